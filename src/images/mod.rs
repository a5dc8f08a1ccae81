//! Positions on the disc from images: the Sun's limb and the planet's disc found on a FITS,
//! PNG, TIFF or JPEG image, the separation of their centres in solar radii with its
//! uncertainty, and the image's instant.
//!
//! One concept per file: [`grey`] and [`fits`] read images, [`rough_disc`] finds the Sun,
//! [`limb`] its edge points, [`circle_fit`] fits circles, [`limb_darkening`] the Sun's
//! brightness profile, [`planet`] the dark disc, [`measurement`] puts them together,
//! [`instant`] reads the time, [`rows`] writes observation rows. The method and its sources
//! are in docs/measuring.md.

pub mod circle_fit;
pub mod error;
pub mod fits;
pub mod grey;
pub mod instant;
pub mod limb;
pub mod limb_darkening;
pub mod measurement;
pub mod planet;
pub mod rough_disc;
pub mod rows;

pub use error::MeasureError;
pub use grey::GreyImage;
pub use instant::{InstantOptions, InstantSource};
pub use measurement::{measure_disc, DiscMeasurement};

use chrono::NaiveDateTime;
use std::path::{Path, PathBuf};

/// One image measured: the file, its instant and the measurement.
#[derive(Debug, Clone, PartialEq)]
pub struct ImageMeasurement {
    /// The image file.
    pub path: PathBuf,
    /// The instant, UTC.
    pub time_utc: NaiveDateTime,
    /// Where the instant came from.
    pub instant_source: InstantSource,
    /// The fits and the separation.
    pub disc: DiscMeasurement,
}

/// Largest image file read, bytes (1 GiB): a guard against reading a wrong path into memory.
const MAX_FILE_BYTES: u64 = 1 << 30;

/// Where an image's own time is to be read from.
enum FileTime {
    /// A FITS header's cards.
    Fits(fits::FitsTimeCards),
    /// A raster file's bytes (EXIF).
    Raster(Vec<u8>),
}

/// Read an image file of any supported kind to grey pixels, keeping what gives its time.
fn decode(path: &Path) -> Result<(GreyImage, FileTime), MeasureError> {
    let io_error = |source| MeasureError::Io {
        path: path.to_path_buf(),
        source,
    };
    let size = std::fs::metadata(path).map_err(io_error)?.len();
    if size > MAX_FILE_BYTES {
        return Err(MeasureError::Format {
            path: path.to_path_buf(),
            reason: format!("the file is larger than {MAX_FILE_BYTES} bytes"),
        });
    }
    let bytes = std::fs::read(path).map_err(io_error)?;
    if fits::looks_like_fits(&bytes) {
        let (image, cards) = fits::read_fits(path, &bytes)?;
        return Ok((image, FileTime::Fits(cards)));
    }
    Ok((grey::read_raster(path)?, FileTime::Raster(bytes)))
}

/// The instant: `--time-utc` if given, else the file's own.
fn instant_of(
    path: &Path,
    file_time: &FileTime,
    options: &InstantOptions,
) -> Result<(NaiveDateTime, InstantSource), MeasureError> {
    if let Some(time_utc) = options.time_utc {
        return Ok((time_utc, InstantSource::Given));
    }
    match file_time {
        FileTime::Fits(cards) => instant::fits_instant(path, cards, options.clock_offset_s),
        FileTime::Raster(bytes) => instant::exif_instant(path, bytes, options),
    }
}

/// Read an image file of any supported kind to grey pixels and find its instant.
///
/// # Errors
/// [`MeasureError::Io`], [`MeasureError::Format`] or [`MeasureError::Instant`].
pub fn read_image(
    path: &Path,
    options: &InstantOptions,
) -> Result<(GreyImage, NaiveDateTime, InstantSource), MeasureError> {
    let (image, file_time) = decode(path)?;
    let (time, source) = instant_of(path, &file_time, options)?;
    Ok((image, time, source))
}

/// Read, measure and time one image file (the image first, so that an image without a Sun or
/// a planet is refused for that, whatever its time).
///
/// # Errors
/// Any [`MeasureError`], naming the file.
pub fn measure_file(
    path: &Path,
    options: &InstantOptions,
) -> Result<ImageMeasurement, MeasureError> {
    let (image, file_time) = decode(path)?;
    let disc = measure_disc(path, &image)?;
    let (time_utc, instant_source) = instant_of(path, &file_time, options)?;
    Ok(ImageMeasurement {
        path: path.to_path_buf(),
        time_utc,
        instant_source,
        disc,
    })
}
