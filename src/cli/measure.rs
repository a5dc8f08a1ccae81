//! The `measure` command: check the options, measure every image in parallel, write rows.

use crate::args::{MeasureArgs, MeasureFormat};
use indicatif::{ProgressBar, ProgressStyle};
use rayon::prelude::*;
use std::io::IsTerminal;
use transit_parallax::images::instant::parse_camera_utc_offset;
use transit_parallax::images::rows::{csv_rows, json_rows, StationColumns};
use transit_parallax::images::{measure_file, ImageMeasurement, InstantOptions, MeasureError};
use transit_parallax::time::iso::parse_utc;
use transit_parallax::Error;

/// Help text after the options: the solar caution, the clock's sign, examples.
pub const MEASURE_AFTER_HELP: &str = "\
Solar caution for cameras: photograph the Sun only through a certified solar filter fitted over \
the FRONT of the lens or telescope (or by projection); never look at the Sun through an optical \
finder or viewfinder; follow local guidance and experienced supervision.

Time: FITS images give DATE-OBS (the start of the exposure) plus half of EXPTIME; photographs \
give EXIF DateTimeOriginal with SubSecTimeOriginal and OffsetTimeOriginal. Without an offset, \
say the camera clock's zone with --camera-utc-offset. --clock-offset-s S means the camera's \
clock read S seconds MORE than the true time; S is subtracted.

Output: one row per image, contact empty, with separation_solar_radii (the planet's centre from \
the Sun's centre in units of the Sun's radius on the same image) and sigma_solar_radii. Images \
that cannot be measured are reported on stderr with the reason; the others are still measured.

Examples:
  transit-parallax measure sun-*.fits --station hill-camp --latitude 48.2 --longitude 16.4 --elevation-m 190
  transit-parallax measure IMG_0412.jpg --camera-utc-offset +02:00 --clock-offset-s 1.5
  transit-parallax measure frame.png --time-utc 2012-06-06T01:29:36.5Z --format json";

fn options(a: &MeasureArgs) -> Result<(InstantOptions, StationColumns), Error> {
    let time_utc = a
        .time_utc
        .as_deref()
        .map(parse_utc)
        .transpose()
        .map_err(Error::argument)?;
    let camera_utc_offset_s = a
        .camera_utc_offset
        .as_deref()
        .map(parse_camera_utc_offset)
        .transpose()
        .map_err(Error::argument)?;
    if !a.clock_offset_s.is_finite() || a.clock_offset_s.abs() > 86_400.0 {
        return Err(Error::argument(
            "--clock-offset-s must be a number of seconds within one day",
        ));
    }
    for (name, value, limit) in [
        ("--latitude", a.latitude, 90.0),
        ("--longitude", a.longitude, 180.0),
    ] {
        if value.is_some_and(|v| v.is_nan() || v.abs() > limit) {
            return Err(Error::argument(format!(
                "{name} must be within -{limit} to {limit} degrees"
            )));
        }
    }
    if a.elevation_m
        .is_some_and(|v| !(-500.0..=9000.0).contains(&v))
    {
        return Err(Error::argument(
            "--elevation-m must be within -500 to 9000 metres",
        ));
    }
    let instant = InstantOptions {
        time_utc,
        camera_utc_offset_s,
        clock_offset_s: a.clock_offset_s,
    };
    let station = StationColumns {
        station: a.station.clone(),
        latitude_deg: a.latitude,
        longitude_deg: a.longitude,
        elevation_m: a.elevation_m,
    };
    Ok((instant, station))
}

/// Run `measure`: the rows on success; every failed image on stderr.
pub fn measure(a: MeasureArgs) -> Result<String, Error> {
    let (instant, station) = options(&a)?;
    let bar = if std::io::stderr().is_terminal() && a.images.len() > 1 {
        let bar = ProgressBar::new(a.images.len() as u64);
        if let Ok(style) = ProgressStyle::with_template("{bar:40} {pos}/{len} images {elapsed}") {
            bar.set_style(style);
        }
        bar
    } else {
        ProgressBar::hidden()
    };
    let outcomes: Vec<Result<ImageMeasurement, MeasureError>> = a
        .images
        .par_iter()
        .map(|path| {
            let outcome = measure_file(path, &instant);
            bar.inc(1);
            outcome
        })
        .collect();
    bar.finish_and_clear();
    let mut measured = Vec::new();
    for outcome in outcomes {
        match outcome {
            Ok(m) => measured.push(m),
            Err(e) => eprintln!("not measured: {e}"),
        }
    }
    if measured.is_empty() {
        return Err(Error::argument(format!(
            "none of the {} image(s) could be measured (reasons above)",
            a.images.len()
        )));
    }
    match a.format {
        MeasureFormat::Csv => {
            csv_rows(&station, &measured).map_err(|e| Error::Numerical(e.to_string()))
        }
        MeasureFormat::Json => {
            let rows = json_rows(&station, &measured);
            serde_json::to_string_pretty(&rows)
                .map(|t| t + "\n")
                .map_err(|e| Error::Numerical(e.to_string()))
        }
    }
}
