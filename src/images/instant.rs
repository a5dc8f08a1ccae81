//! The instant of an image: given by the user, from a FITS header (`DATE-OBS`, the start of
//! the exposure, plus half of `EXPTIME`), or from a photograph's EXIF date and time.

use super::error::MeasureError;
use super::fits::FitsTimeCards;
use crate::time::iso::{parse_utc_zoned, Zone};
use chrono::{NaiveDate, NaiveDateTime, TimeDelta};
use std::path::Path;

/// What the user says about time, for every image of a run.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct InstantOptions {
    /// The UTC instant to use instead of the file's own (`--time-utc`).
    pub time_utc: Option<NaiveDateTime>,
    /// The camera clock's offset from UTC in seconds (`--camera-utc-offset +02:00` is 7200),
    /// for EXIF times that carry no offset.
    pub camera_utc_offset_s: Option<i32>,
    /// How far the camera's clock was ahead of the true time, in seconds (`--clock-offset-s`;
    /// positive when the clock was fast). Subtracted from the times read from files.
    pub clock_offset_s: f64,
}

/// Where an image's instant came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum InstantSource {
    /// Given on the command line.
    Given,
    /// FITS `DATE-OBS` plus half of `EXPTIME`.
    FitsMidExposure,
    /// FITS `DATE-OBS` alone (no `EXPTIME`).
    FitsStart,
    /// EXIF `DateTimeOriginal` with its own offset.
    Exif,
    /// EXIF `DateTimeOriginal` with the camera's zone given by the user.
    ExifWithGivenZone,
}

impl InstantSource {
    /// A short, stable name for reports.
    pub fn name(self) -> &'static str {
        match self {
            InstantSource::Given => "given",
            InstantSource::FitsMidExposure => "fits-date-obs-plus-half-exptime",
            InstantSource::FitsStart => "fits-date-obs",
            InstantSource::Exif => "exif",
            InstantSource::ExifWithGivenZone => "exif-with-given-zone",
        }
    }
}

fn fail(path: &Path, reason: String) -> MeasureError {
    MeasureError::Instant {
        path: path.to_path_buf(),
        reason,
    }
}

fn shift_s(label: NaiveDateTime, seconds: f64) -> NaiveDateTime {
    label + TimeDelta::nanoseconds((seconds * 1e9).round() as i64)
}

/// The instant from FITS cards: `DATE-OBS` is the start of the exposure (FITS Standard 4.0,
/// IAU FITS Working Group 2016, section 9.1.2 and Table 22: "the start date and time of the
/// observation"), so the middle of the exposure is `DATE-OBS + EXPTIME / 2`; the camera's
/// clock offset is then subtracted.
///
/// # Errors
/// [`MeasureError::Instant`] when `DATE-OBS` is missing, is not an ISO 8601 date and time, or
/// `TIMESYS` names a scale other than UTC.
pub fn fits_instant(
    path: &Path,
    cards: &FitsTimeCards,
    clock_offset_s: f64,
) -> Result<(NaiveDateTime, InstantSource), MeasureError> {
    if let Some(system) = &cards.time_system {
        if !system.eq_ignore_ascii_case("UTC") {
            return Err(fail(path, format!("the FITS header's TIMESYS is '{system}', not UTC; give the instant with --time-utc")));
        }
    }
    let text = cards.date_obs.as_deref().ok_or_else(|| {
        fail(
            path,
            "the FITS header has no DATE-OBS; give the instant with --time-utc".to_string(),
        )
    })?;
    let (start, zone) = parse_utc_zoned(text).map_err(|e| fail(path, format!("DATE-OBS {e}")))?;
    if !matches!(zone, Zone::Missing | Zone::Utc) {
        return Err(fail(
            path,
            format!("DATE-OBS '{text}' carries a zone offset, which FITS does not allow"),
        ));
    }
    let (label, source) = match cards.exposure_s {
        Some(exposure_s) => (
            shift_s(start, 0.5 * exposure_s),
            InstantSource::FitsMidExposure,
        ),
        None => (start, InstantSource::FitsStart),
    };
    Ok((shift_s(label, -clock_offset_s), source))
}

/// An EXIF ASCII field's first value as text.
fn ascii(exif: &exif::Exif, tag: exif::Tag) -> Option<Vec<u8>> {
    match &exif.get_field(tag, exif::In::PRIMARY)?.value {
        exif::Value::Ascii(values) => values.first().cloned(),
        _ => None,
    }
}

/// The instant from a photograph's EXIF: `DateTimeOriginal`, with `SubSecTimeOriginal` and
/// `OffsetTimeOriginal` (CIPA DC-008-2019, *Exif 2.32*, section 4.6.5, tags 0x9003, 0x9291
/// and 0x9011). Without an offset the camera's zone must be given
/// ([`InstantOptions::camera_utc_offset_s`]). The camera's clock offset is then subtracted.
///
/// # Errors
/// [`MeasureError::Instant`] when the file has no EXIF date and time, it is malformed, or it
/// has no offset and none was given.
pub fn exif_instant(
    path: &Path,
    bytes: &[u8],
    options: &InstantOptions,
) -> Result<(NaiveDateTime, InstantSource), MeasureError> {
    let missing = || {
        fail(path, "the image has no EXIF date and time (DateTimeOriginal); give the instant with --time-utc".to_string())
    };
    let exif = exif::Reader::new()
        .read_from_container(&mut std::io::Cursor::new(bytes))
        .map_err(|_| missing())?;
    let raw = ascii(&exif, exif::Tag::DateTimeOriginal).ok_or_else(missing)?;
    let mut stamp = exif::DateTime::from_ascii(&raw).map_err(|e| {
        fail(
            path,
            format!("the EXIF DateTimeOriginal is malformed ({e})"),
        )
    })?;
    if let Some(sub) = ascii(&exif, exif::Tag::SubSecTimeOriginal) {
        stamp.parse_subsec(&sub).map_err(|e| {
            fail(
                path,
                format!("the EXIF SubSecTimeOriginal is malformed ({e})"),
            )
        })?;
    }
    if let Some(offset) = ascii(&exif, exif::Tag::OffsetTimeOriginal) {
        // A blank offset is the same as none.
        let _ = stamp.parse_offset(&offset);
    }
    let local = NaiveDate::from_ymd_opt(stamp.year.into(), stamp.month.into(), stamp.day.into())
        .and_then(|d| {
            d.and_hms_nano_opt(
                stamp.hour.into(),
                stamp.minute.into(),
                stamp.second.into(),
                stamp.nanosecond.unwrap_or(0),
            )
        })
        .ok_or_else(|| {
            fail(
                path,
                format!("the EXIF DateTimeOriginal '{stamp}' is not a valid date and time"),
            )
        })?;
    let (offset_s, source) = match (stamp.offset, options.camera_utc_offset_s) {
        (Some(minutes), _) => (i64::from(minutes) * 60, InstantSource::Exif),
        (None, Some(seconds)) => (i64::from(seconds), InstantSource::ExifWithGivenZone),
        (None, None) => {
            return Err(fail(
                path,
                format!("the EXIF time {stamp} has no zone offset (OffsetTimeOriginal); say the camera clock's zone with --camera-utc-offset, e.g. +02:00, or give --time-utc"),
            ))
        }
    };
    let utc = local - TimeDelta::seconds(offset_s);
    Ok((shift_s(utc, -options.clock_offset_s), source))
}

/// Parse the camera clock's zone, `+HH:MM`, `-HH:MM` or `Z`, to seconds east of UTC.
///
/// # Errors
/// A sentence saying how to write it.
pub fn parse_camera_utc_offset(text: &str) -> Result<i32, String> {
    let trimmed = text.trim();
    if trimmed.eq_ignore_ascii_case("z") || trimmed.eq_ignore_ascii_case("utc") {
        return Ok(0);
    }
    crate::time::civil::parse_offset_s(trimmed)
        .ok_or_else(|| format!("'{trimmed}' is not an offset from UTC; write the camera clock's zone as +HH:MM, e.g. +02:00 or -05:00"))
}
