//! Where on the Earth a transit is seen with the Sun up: for every point of a latitude and
//! longitude grid at sea level, the local time of each contact and the Sun's true altitude then,
//! and which part of the transit the point sees above the horizon.
//!
//! Each point's contacts come from the same per-station solver as every prediction
//! ([`TransitEvent::predict_geocentric`]); the Sun's altitude is its true (unrefracted) altitude
//! of the centre against the geodetic horizon, as in `predict`. The classification samples the
//! Sun's altitude from the point's own contact I to its contact IV, so that a Sun that sets and
//! rises again during a long transit (short summer nights at high latitude) is not taken for a
//! transit seen whole.

use crate::error::{Error, Result};
use crate::geometry::contacts::{sun_alt_az_parallactic, Contact};
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;

/// The Sun counts as up when its centre's true altitude is at least this, degrees (the
/// geometric horizon; refraction and the Sun's radius are left out on purpose, so that the
/// limits are those of `predict`'s `sun_altitude_deg` crossing zero).
pub const HORIZON_ALTITUDE_DEG: f64 = 0.0;

/// Instants at which the Sun's altitude is sampled from contact I to contact IV, both included.
const ALTITUDE_SAMPLES: usize = 13;

/// Least and greatest grid spacing accepted, degrees.
pub const GRID_DEG_RANGE: (f64, f64) = (0.5, 30.0);

/// One contact at one grid point.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ContactSeen {
    /// The contact's time, hours from the event elements' epoch.
    pub hours: f64,
    /// True altitude of the Sun's centre at that time, degrees.
    pub sun_altitude_deg: f64,
}

impl ContactSeen {
    /// Whether the Sun is up ([`HORIZON_ALTITUDE_DEG`]) at this contact.
    pub fn sun_up(&self) -> bool {
        self.sun_altitude_deg >= HORIZON_ALTITUDE_DEG
    }
}

/// Which part of the transit a place sees with the Sun up.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Visibility {
    /// The Sun is up from contact I to contact IV.
    Whole,
    /// The Sun is up at contact I and down at contact IV (it sets during the transit).
    IngressOnly,
    /// The Sun is down at contact I and up at contact IV (it rises during the transit).
    EgressOnly,
    /// The Sun is up for part of the transit but not at contact I nor at IV, or it sets and
    /// rises again between them.
    Part,
    /// The Sun is down throughout the transit.
    None,
}

impl Visibility {
    /// Every class, in the order of the map's legend.
    pub const ALL: [Visibility; 5] = [
        Visibility::Whole,
        Visibility::IngressOnly,
        Visibility::EgressOnly,
        Visibility::Part,
        Visibility::None,
    ];

    /// The class's name in files: `whole`, `ingress-only`, `egress-only`, `part`, `none`.
    pub fn name(self) -> &'static str {
        match self {
            Visibility::Whole => "whole",
            Visibility::IngressOnly => "ingress-only",
            Visibility::EgressOnly => "egress-only",
            Visibility::Part => "part",
            Visibility::None => "none",
        }
    }

    /// A sentence-length description for a legend.
    pub fn description(self) -> &'static str {
        match self {
            Visibility::Whole => "whole transit seen (Sun up from I to IV)",
            Visibility::IngressOnly => "ingress only (Sun sets before IV)",
            Visibility::EgressOnly => "egress only (Sun rises after I)",
            Visibility::Part => "part, neither I nor IV (Sun up only between)",
            Visibility::None => "nothing seen (Sun down throughout)",
        }
    }
}

/// Classify a place from the Sun's altitude at contact I, at contact IV and at instants
/// between them (degrees; `None` where a contact does not occur there).
///
/// Returns: [`Visibility::Whole`] when the Sun is up at I, at IV and at every instant between;
/// [`Visibility::IngressOnly`] when up at I and not at IV; [`Visibility::EgressOnly`] when up
/// at IV and not at I; [`Visibility::Part`] when up at some instant otherwise; else
/// [`Visibility::None`].
pub fn classify(
    sun_at_i_deg: Option<f64>,
    sun_at_iv_deg: Option<f64>,
    sun_between_deg: &[f64],
) -> Visibility {
    let up = |a: Option<f64>| a.is_some_and(|x| x >= HORIZON_ALTITUDE_DEG);
    let (at_i, at_iv) = (up(sun_at_i_deg), up(sun_at_iv_deg));
    let between_all = sun_between_deg.iter().all(|&a| a >= HORIZON_ALTITUDE_DEG);
    let between_any = sun_between_deg.iter().any(|&a| a >= HORIZON_ALTITUDE_DEG);
    match (at_i, at_iv) {
        (true, true) if between_all => Visibility::Whole,
        (true, false) => Visibility::IngressOnly,
        (false, true) => Visibility::EgressOnly,
        _ if at_i || at_iv || between_any => Visibility::Part,
        _ => Visibility::None,
    }
}

/// One point of the grid.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct VisibilityPoint {
    /// Geodetic latitude, degrees.
    pub latitude_deg: f64,
    /// Longitude, degrees east.
    pub longitude_deg: f64,
    /// Contacts I-IV (`None` where a contact does not occur there or the solver found none).
    pub contacts: [Option<ContactSeen>; 4],
    /// Which part of the transit the point sees with the Sun up.
    pub seen: Visibility,
}

/// The grid: rows of latitude from 90 degrees north to 90 south, each row's longitudes from
/// -180 degrees eastward, `step_lat_deg` and `step_lon_deg` apart.
#[derive(Clone, Debug)]
pub struct VisibilityGrid {
    /// Number of rows (latitudes).
    pub rows: usize,
    /// Number of columns (longitudes); the column after the last would be -180 again.
    pub columns: usize,
    /// Spacing of the rows, degrees.
    pub step_lat_deg: f64,
    /// Spacing of the columns, degrees.
    pub step_lon_deg: f64,
    /// The points, row by row.
    pub points: Vec<VisibilityPoint>,
}

impl VisibilityGrid {
    /// The point of row `row` and column `column` (the column taken modulo the row's length,
    /// so that the column after the last is the first).
    pub fn at(&self, row: usize, column: usize) -> &VisibilityPoint {
        &self.points[row * self.columns + column % self.columns]
    }
}

/// One grid point's contacts and the part of the transit it sees.
pub fn visibility_at(
    event: &TransitEvent,
    latitude_deg: f64,
    longitude_deg: f64,
) -> VisibilityPoint {
    let station = Station {
        name: String::new(),
        latitude_deg,
        longitude_deg,
        elevation_m: 0.0,
    };
    let geo = station.geocentric();
    let solved = event.predict_geocentric(&geo);
    let contacts = solved.map(|c| {
        c.filter(|c| c.hours.is_finite() && c.sun_altitude_deg.is_finite())
            .map(|c| ContactSeen {
                hours: c.hours,
                sun_altitude_deg: c.sun_altitude_deg,
            })
    });
    let start = contacts[Contact::I.index()].map_or(event.start_hours(Contact::I), |c| c.hours);
    let end = contacts[Contact::IV.index()].map_or(event.start_hours(Contact::IV), |c| c.hours);
    let between: Vec<f64> = (1..ALTITUDE_SAMPLES - 1)
        .map(|k| start + (end - start) * k as f64 / (ALTITUDE_SAMPLES - 1) as f64)
        .map(|h| sun_alt_az_parallactic(&event.elements, &geo, h).0)
        .filter(|a| a.is_finite())
        .collect();
    let seen = classify(
        contacts[Contact::I.index()].map(|c| c.sun_altitude_deg),
        contacts[Contact::IV.index()].map(|c| c.sun_altitude_deg),
        &between,
    );
    VisibilityPoint {
        latitude_deg,
        longitude_deg,
        contacts,
        seen,
    }
}

/// The visibility of a transit over the whole Earth at sea level, every `grid_deg` degrees
/// (rounded so that a whole number of steps spans 180 degrees of latitude and 360 of
/// longitude): latitudes 90 to -90 both included, longitudes from -180 up to 180 excluded.
///
/// Arguments: `event`; `grid_deg`, the spacing in degrees ([`GRID_DEG_RANGE`]); `threads`,
/// worker threads (rows are shared out in chunks; 1 computes on the calling thread).
/// Errors: [`Error::Argument`] when `grid_deg` is outside [`GRID_DEG_RANGE`] or not a number.
pub fn visibility_grid(
    event: &TransitEvent,
    grid_deg: f64,
    threads: usize,
) -> Result<VisibilityGrid> {
    let (lo, hi) = GRID_DEG_RANGE;
    if !(grid_deg.is_finite() && (lo..=hi).contains(&grid_deg)) {
        return Err(Error::argument(format!(
            "--grid-deg {grid_deg} is outside the range; give a spacing from {lo} to {hi} degrees"
        )));
    }
    let steps_lat = (180.0 / grid_deg).round().max(1.0) as usize;
    let columns = (360.0 / grid_deg).round().max(1.0) as usize;
    let (step_lat_deg, step_lon_deg) = (180.0 / steps_lat as f64, 360.0 / columns as f64);
    let rows = steps_lat + 1;
    let row_points = |row: usize| -> Vec<VisibilityPoint> {
        let lat = 90.0 - row as f64 * step_lat_deg;
        (0..columns)
            .map(|j| visibility_at(event, lat, -180.0 + j as f64 * step_lon_deg))
            .collect()
    };
    let threads = threads.clamp(1, rows);
    let chunk = rows.div_ceil(threads);
    let parts: Vec<Vec<VisibilityPoint>> = std::thread::scope(|scope| {
        let handles: Vec<_> = (0..rows)
            .step_by(chunk)
            .map(|first| {
                let row_points = &row_points;
                scope.spawn(move || {
                    (first..(first + chunk).min(rows))
                        .flat_map(row_points)
                        .collect::<Vec<_>>()
                })
            })
            .collect();
        handles
            .into_iter()
            .map(|h| h.join().unwrap_or_default())
            .collect()
    });
    let points: Vec<VisibilityPoint> = parts.into_iter().flatten().collect();
    if points.len() != rows * columns {
        return Err(Error::Numerical(
            "a worker computing the visibility grid stopped early".into(),
        ));
    }
    Ok(VisibilityGrid {
        rows,
        columns,
        step_lat_deg,
        step_lon_deg,
        points,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn classes_follow_the_sun_at_the_exterior_contacts() {
        // Common practice, no source: the classes as defined above, case by case.
        assert_eq!(classify(Some(10.0), Some(20.0), &[15.0]), Visibility::Whole);
        assert_eq!(
            classify(Some(10.0), Some(-2.0), &[3.0]),
            Visibility::IngressOnly
        );
        assert_eq!(
            classify(Some(-1.0), Some(5.0), &[1.0]),
            Visibility::EgressOnly
        );
        assert_eq!(classify(Some(-1.0), Some(-5.0), &[2.0]), Visibility::Part);
        assert_eq!(classify(Some(-1.0), Some(-5.0), &[-2.0]), Visibility::None);
        // Up at I and IV but the Sun set and rose between: not the whole transit.
        assert_eq!(classify(Some(3.0), Some(4.0), &[-1.0]), Visibility::Part);
        // A contact that does not occur is not seen.
        assert_eq!(classify(None, Some(4.0), &[5.0]), Visibility::EgressOnly);
        assert_eq!(classify(None, None, &[]), Visibility::None);
        // The horizon itself counts as up.
        assert_eq!(classify(Some(0.0), Some(0.0), &[0.0]), Visibility::Whole);
    }

    #[test]
    fn class_names_are_distinct() {
        let names: std::collections::HashSet<_> =
            Visibility::ALL.iter().map(|v| v.name()).collect();
        assert_eq!(names.len(), Visibility::ALL.len());
    }
}
