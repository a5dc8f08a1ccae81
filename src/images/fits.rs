//! Reading a FITS primary image (any BITPIX, with BSCALE and BZERO) and its time cards.
//!
//! The header is parsed by the pure-Rust `fitsrs` crate; the data unit is decoded here from
//! the file's bytes (big-endian, FITS Standard 4.0, Pence et al. 2010 and IAU FITS Working
//! Group 2016, section 5). A cube (NAXIS3 > 1, e.g. colour planes) is read by its first plane.

use super::error::MeasureError;
use super::grey::GreyImage;
use fitsrs::card::Value;
use fitsrs::hdu::header::Bitpix;
use fitsrs::{Fits, HDU};
use std::io::Cursor;
use std::path::Path;

/// The time cards of a FITS header, as written.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct FitsTimeCards {
    /// `DATE-OBS`: the start of the exposure (FITS Standard 4.0, section 9.1.2).
    pub date_obs: Option<String>,
    /// `EXPTIME` in seconds, when present and positive.
    pub exposure_s: Option<f64>,
    /// `TIMESYS`, the time scale of DATE-OBS (UTC when absent, FITS Standard 4.0, 9.2.1).
    pub time_system: Option<String>,
}

/// True when the file starts with the FITS signature `SIMPLE  =`.
pub fn looks_like_fits(bytes: &[u8]) -> bool {
    bytes.starts_with(b"SIMPLE  =")
}

fn number(value: Option<&Value>) -> Option<f64> {
    match value? {
        Value::Integer { value, .. } => Some(*value as f64),
        Value::Float { value, .. } => Some(*value),
        _ => None,
    }
}

fn text(value: Option<&Value>) -> Option<String> {
    match value? {
        Value::String { value, .. } => Some(value.trim().to_string()),
        _ => None,
    }
}

/// Read the primary image of a FITS file held in `bytes` and its time cards.
///
/// # Errors
/// [`MeasureError::Format`] when the header cannot be parsed, the primary HDU holds no 2-D
/// image, or the data unit is shorter than the header says.
pub fn read_fits(path: &Path, bytes: &[u8]) -> Result<(GreyImage, FitsTimeCards), MeasureError> {
    let fail = |reason: String| MeasureError::Format {
        path: path.to_path_buf(),
        reason,
    };
    let mut hdus = Fits::from_reader(Cursor::new(bytes));
    let hdu = match hdus.next() {
        Some(Ok(HDU::Primary(hdu))) => hdu,
        Some(Err(e)) => return Err(fail(format!("FITS header: {e}"))),
        _ => return Err(fail("no primary FITS header".to_string())),
    };
    let header = hdu.get_header();
    let naxis = header.get_xtension().get_naxis();
    if naxis.len() < 2 || naxis.iter().skip(2).any(|&n| n == 0) {
        return Err(fail(format!(
            "the primary HDU holds no 2-D image (NAXIS = {})",
            naxis.len()
        )));
    }
    let (width, height) = (naxis[0] as usize, naxis[1] as usize);
    let bitpix = header.get_xtension().get_bitpix();
    let scale = number(header.get("BSCALE")).unwrap_or(1.0);
    let zero = number(header.get("BZERO")).unwrap_or(0.0);
    let cards = FitsTimeCards {
        date_obs: text(header.get("DATE-OBS")),
        exposure_s: number(header.get("EXPTIME")).filter(|s| s.is_finite() && *s > 0.0),
        time_system: text(header.get("TIMESYS")),
    };
    let start = hdu.get_data_unit_byte_offset() as usize;
    let count = width
        .checked_mul(height)
        .ok_or_else(|| fail("the image is too large".to_string()))?;
    let pixels = decode(bytes, start, count, bitpix, scale, zero)
        .ok_or_else(|| fail("the data unit is shorter than NAXIS1 x NAXIS2 pixels".to_string()))?;
    let image = GreyImage::new(width, height, pixels)
        .ok_or_else(|| fail("the image has no pixels".to_string()))?;
    Ok((image, cards))
}

/// Decode `count` big-endian values of type `bitpix` from `bytes[start..]`, each as
/// `BZERO + BSCALE * stored` (FITS Standard 4.0, section 5.3); non-finite values become 0.
fn decode(
    bytes: &[u8],
    start: usize,
    count: usize,
    bitpix: Bitpix,
    scale: f64,
    zero: f64,
) -> Option<Vec<f32>> {
    let size = bitpix.byte_size();
    let data = bytes.get(start..start.checked_add(count.checked_mul(size)?)?)?;
    let value = |c: &[u8]| -> f64 {
        match bitpix {
            Bitpix::U8 => c[0] as f64,
            Bitpix::I16 => i16::from_be_bytes([c[0], c[1]]) as f64,
            Bitpix::I32 => i32::from_be_bytes([c[0], c[1], c[2], c[3]]) as f64,
            Bitpix::I64 => i64::from_be_bytes(c.try_into().unwrap_or([0; 8])) as f64,
            Bitpix::F32 => f32::from_be_bytes([c[0], c[1], c[2], c[3]]) as f64,
            Bitpix::F64 => f64::from_be_bytes(c.try_into().unwrap_or([0; 8])),
        }
    };
    Some(
        data.chunks_exact(size)
            .map(|c| {
                let v = zero + scale * value(c);
                if v.is_finite() {
                    v as f32
                } else {
                    0.0
                }
            })
            .collect(),
    )
}
