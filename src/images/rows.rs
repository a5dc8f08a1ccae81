//! Observation rows from measured images: the CSV of the observations format (a position row:
//! `contact` empty, `separation_solar_radii` and `sigma_solar_radii`) or JSON with the fits'
//! diagnostics.

use super::ImageMeasurement;
use crate::time::iso::format_utc;
use serde::Serialize;

/// The station columns, written on every row (empty when not given).
#[derive(Debug, Clone, PartialEq, Default)]
pub struct StationColumns {
    /// Station name.
    pub station: Option<String>,
    /// Geodetic latitude, degrees north.
    pub latitude_deg: Option<f64>,
    /// Longitude, degrees east.
    pub longitude_deg: Option<f64>,
    /// Elevation above the ellipsoid, metres.
    pub elevation_m: Option<f64>,
}

/// The CSV header of position rows.
pub const CSV_HEADER: [&str; 8] = [
    "station",
    "latitude",
    "longitude",
    "elevation_m",
    "contact",
    "time_utc",
    "separation_solar_radii",
    "sigma_solar_radii",
];

/// Decimals of seconds in `time_utc`.
const TIME_DECIMALS: u32 = 3;

fn optional(value: Option<f64>) -> String {
    value.map(|v| v.to_string()).unwrap_or_default()
}

/// Write the rows as CSV (header first).
pub fn csv_rows(
    station: &StationColumns,
    measured: &[ImageMeasurement],
) -> Result<String, csv::Error> {
    let mut writer = csv::Writer::from_writer(Vec::new());
    writer.write_record(CSV_HEADER)?;
    for m in measured {
        writer.write_record([
            station.station.clone().unwrap_or_default(),
            optional(station.latitude_deg),
            optional(station.longitude_deg),
            optional(station.elevation_m),
            String::new(),
            format_utc(m.time_utc, TIME_DECIMALS),
            format!("{:.6}", m.disc.separation_solar_radii),
            format!("{:.6}", m.disc.sigma_solar_radii.max(1e-6)),
        ])?;
    }
    let bytes = writer.into_inner().map_err(|e| e.into_error())?;
    Ok(String::from_utf8_lossy(&bytes).into_owned())
}

/// One row of the JSON output: the CSV's columns plus the fits' diagnostics.
#[derive(Debug, Clone, Serialize)]
pub struct JsonRow {
    /// Station name.
    pub station: Option<String>,
    /// Latitude, degrees north.
    pub latitude: Option<f64>,
    /// Longitude, degrees east.
    pub longitude: Option<f64>,
    /// Elevation, metres.
    pub elevation_m: Option<f64>,
    /// Always empty: a position, not a contact.
    pub contact: Option<String>,
    /// ISO 8601 UTC.
    pub time_utc: String,
    /// Separation of centres, solar radii.
    pub separation_solar_radii: f64,
    /// Its standard uncertainty, solar radii.
    pub sigma_solar_radii: f64,
    /// The image file.
    pub image_file: String,
    /// Where the instant came from.
    pub time_source: &'static str,
    /// Sun's centre, column, pixels.
    pub sun_centre_x_px: f64,
    /// Sun's centre, row, pixels.
    pub sun_centre_y_px: f64,
    /// Sun's radius, pixels.
    pub sun_radius_px: f64,
    /// Standard uncertainty of the Sun's radius, pixels.
    pub sun_radius_sigma_px: f64,
    /// Limb edge points used.
    pub sun_edge_points_used: usize,
    /// Limb edge points rejected as outliers.
    pub sun_edge_points_rejected: usize,
    /// RMS of the limb points about the circle, pixels.
    pub sun_edge_rms_px: f64,
    /// Planet's centre, column, pixels.
    pub planet_centre_x_px: f64,
    /// Planet's centre, row, pixels.
    pub planet_centre_y_px: f64,
    /// Planet's radius, solar radii.
    pub planet_radius_solar_radii: f64,
    /// Planet edge points used.
    pub planet_edge_points_used: usize,
    /// Planet edge points rejected.
    pub planet_edge_points_rejected: usize,
    /// The limb's blur (Gaussian sigma), pixels.
    pub limb_blur_sigma_px: f64,
}

/// The JSON rows.
pub fn json_rows(station: &StationColumns, measured: &[ImageMeasurement]) -> Vec<JsonRow> {
    let r6 = |v: f64| (v * 1e6).round() / 1e6;
    let r3 = |v: f64| (v * 1e3).round() / 1e3;
    measured
        .iter()
        .map(|m| {
            let (sun, planet) = (&m.disc.sun, &m.disc.planet);
            JsonRow {
                station: station.station.clone(),
                latitude: station.latitude_deg,
                longitude: station.longitude_deg,
                elevation_m: station.elevation_m,
                contact: None,
                time_utc: format_utc(m.time_utc, TIME_DECIMALS),
                separation_solar_radii: r6(m.disc.separation_solar_radii),
                sigma_solar_radii: r6(m.disc.sigma_solar_radii).max(1e-6),
                image_file: m.path.display().to_string(),
                time_source: m.instant_source.name(),
                sun_centre_x_px: r3(sun.centre_x_px),
                sun_centre_y_px: r3(sun.centre_y_px),
                sun_radius_px: r3(sun.radius_px),
                sun_radius_sigma_px: sun.covariance_px2[2][2].max(0.0).sqrt(),
                sun_edge_points_used: sun.points_used,
                sun_edge_points_rejected: sun.points_rejected,
                sun_edge_rms_px: r3(sun.rms_residual_px),
                planet_centre_x_px: r3(planet.centre_x_px),
                planet_centre_y_px: r3(planet.centre_y_px),
                planet_radius_solar_radii: r6(m.disc.planet_radius_solar_radii),
                planet_edge_points_used: planet.points_used,
                planet_edge_points_rejected: planet.points_rejected,
                limb_blur_sigma_px: r3(m.disc.edge_sigma_px),
            }
        })
        .collect()
}
