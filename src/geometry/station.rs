//! Observing stations on the WGS 84 ellipsoid and their geocentric coordinates.

use crate::error::{Error, Result};
use crate::sky::constants::{EARTH_EQUATORIAL_RADIUS_M, WGS84_A_M, WGS84_F};
use serde::Serialize;

/// Lowest elevation accepted, metres (the Dead Sea shore is at about -430 m).
pub const MIN_ELEVATION_M: f64 = -500.0;
/// Highest elevation accepted, metres.
pub const MAX_ELEVATION_M: f64 = 15_000.0;

/// An observing station.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Station {
    /// The station's name, as given.
    pub name: String,
    /// Geodetic latitude, degrees, WGS 84, north positive.
    pub latitude_deg: f64,
    /// Longitude, degrees, east positive, normalised to -180..180.
    pub longitude_deg: f64,
    /// Height above the WGS 84 ellipsoid, metres.
    pub elevation_m: f64,
}

/// A station's geocentric coordinates in units of the Earth's equatorial radius
/// (IERS 2010, 6 378 136.6 m), the unit of the Besselian-style elements.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct GeocentricStation {
    /// rho cos(phi'), distance from the rotation axis.
    pub rho_cos_phi: f64,
    /// rho sin(phi'), height above the equatorial plane.
    pub rho_sin_phi: f64,
    /// East longitude, radians.
    pub longitude_rad: f64,
    /// Geodetic latitude, radians (for the local horizon).
    pub latitude_rad: f64,
}

impl Station {
    /// A station, checked: latitude -90..90, longitude -180..360 (normalised to -180..180),
    /// elevation -500..9000 m.
    pub fn new(
        name: &str,
        latitude_deg: f64,
        longitude_deg: f64,
        elevation_m: f64,
    ) -> Result<Self> {
        let bad = |what: &str| Error::argument(format!("station '{name}': {what}"));
        if !(-90.0..=90.0).contains(&latitude_deg) {
            return Err(bad("latitude must lie between -90 and 90 degrees"));
        }
        if !(-180.0..=360.0).contains(&longitude_deg) {
            return Err(bad(
                "longitude must lie between -180 and 360 degrees (east positive)",
            ));
        }
        if !(MIN_ELEVATION_M..=MAX_ELEVATION_M).contains(&elevation_m) {
            return Err(bad("elevation must lie between -500 and 9000 m"));
        }
        Ok(Station {
            name: name.to_string(),
            latitude_deg,
            longitude_deg: normalise_longitude_deg(longitude_deg),
            elevation_m,
        })
    }

    /// Geocentric coordinates.
    ///
    /// References: ERFA `eraGd2gce` (Green, *Spherical Astronomy*, 1985, section 4.5) with the
    /// WGS 84 ellipsoid; lengths divided by the IERS 2010 equatorial radius.
    pub fn geocentric(&self) -> GeocentricStation {
        let lon = self.longitude_deg.to_radians();
        let lat = self.latitude_deg.to_radians();
        let xyz = erfa::transform::geodetic_to_geocentric_inner(
            WGS84_A_M,
            WGS84_F,
            lon,
            lat,
            self.elevation_m,
        )
        .unwrap_or([0.0; 3]);
        GeocentricStation {
            rho_cos_phi: xyz[0].hypot(xyz[1]) / EARTH_EQUATORIAL_RADIUS_M,
            rho_sin_phi: xyz[2] / EARTH_EQUATORIAL_RADIUS_M,
            longitude_rad: lon,
            latitude_rad: lat,
        }
    }
}

/// Longitude to -180 < lon <= 180 degrees.
pub fn normalise_longitude_deg(lon: f64) -> f64 {
    let l = lon.rem_euclid(360.0);
    if l > 180.0 {
        l - 360.0
    } else {
        l
    }
}

pub use super::station_file::{
    read_stations, read_stations_with_calendars, stations_and_calendars, stations_from_table,
};

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn geocentric_radius_at_equator_and_pole() {
        // Source: NGA WGS 84 definition: a = 6 378 137 m, b = a (1 - f) = 6 356 752.314 m.
        let eq = Station::new("eq", 0.0, 0.0, 0.0).unwrap().geocentric();
        assert!((eq.rho_cos_phi * EARTH_EQUATORIAL_RADIUS_M - 6_378_137.0).abs() < 1e-6);
        let pole = Station::new("np", 90.0, 0.0, 0.0).unwrap().geocentric();
        assert!((pole.rho_sin_phi * EARTH_EQUATORIAL_RADIUS_M - 6_356_752.314).abs() < 1e-3);
    }

    #[test]
    fn longitudes_are_normalised() {
        assert_eq!(normalise_longitude_deg(350.0), -10.0);
        assert_eq!(normalise_longitude_deg(-180.0), 180.0);
        assert_eq!(normalise_longitude_deg(45.0), 45.0);
    }

    #[test]
    fn ranges_are_checked() {
        assert!(Station::new("a", 91.0, 0.0, 0.0).is_err());
        assert!(Station::new("a", 0.0, 361.0, 0.0).is_err());
        assert!(Station::new("a", 0.0, 0.0, 15_500.0).is_err());
        assert!(
            Station::new("a", 0.0, 0.0, 12_000.0).is_ok(),
            "airborne observers"
        );
    }
}
