//! Physical and conventional constants, each with its unit and authority.
//!
//! Derived constants are computed from the base ones so that a single change
//! propagates. Figures marked "from memory" in `shared/references.md` are
//! confirmed here by arithmetic or by the reference tests named beside them.

/// The astronomical unit in metres, exact by definition (IAU 2012 Resolution B2).
pub const AU_M: f64 = 149_597_870_700.0;

/// The astronomical unit in kilometres (IAU 2012 Resolution B2).
pub const AU_KM: f64 = AU_M / 1000.0;

/// Earth's equatorial radius in metres used to define the solar parallax
/// (IERS Conventions 2010, Table 1.1; IAU 2009 system of astronomical constants).
pub const EARTH_EQUATORIAL_RADIUS_M: f64 = 6_378_136.6;

/// WGS 84 semi-major axis in metres (NGA, WGS 84 definition), used for station coordinates.
pub const WGS84_A_M: f64 = 6_378_137.0;

/// WGS 84 flattening (NGA, WGS 84 definition).
pub const WGS84_F: f64 = 1.0 / 298.257_223_563;

/// Speed of light in metres per second (exact, SI definition).
pub const SPEED_OF_LIGHT_M_PER_S: f64 = 299_792_458.0;

/// Light time for one astronomical unit, in days.
pub const LIGHT_TIME_DAYS_PER_AU: f64 = AU_M / SPEED_OF_LIGHT_M_PER_S / SECONDS_PER_DAY;

/// Seconds in a day of 86 400 SI seconds.
pub const SECONDS_PER_DAY: f64 = 86_400.0;

/// Julian date of the epoch J2000.0 (2000 January 1, 12h TT).
pub const J2000_JD: f64 = 2_451_545.0;

/// Days per Julian century.
pub const DAYS_PER_JULIAN_CENTURY: f64 = 36_525.0;

/// TT - TAI in seconds (IAU 1991 Resolution A4).
pub const TT_MINUS_TAI_S: f64 = 32.184;

/// Radians per arcsecond.
pub const ARCSEC_RAD: f64 = std::f64::consts::PI / 648_000.0;

/// Solar semidiameter at 1 au, arcseconds (Auwers 1891, adopted in the IAU 1976 system
/// and in transit and eclipse predictions).
pub const SUN_SEMIDIAMETER_AT_1AU_ARCSEC: f64 = 959.63;

/// Venus mean radius in km (IAU WGCCRE report, Archinal et al. 2011).
pub const VENUS_RADIUS_KM: f64 = 6051.8;

/// Mercury mean radius in km (IAU WGCCRE report, Archinal et al. 2011).
pub const MERCURY_RADIUS_KM: f64 = 2439.7;

/// The Sun's radius in au implied by [`SUN_SEMIDIAMETER_AT_1AU_ARCSEC`]:
/// `sin(959.63")`, so that `asin(R / 1 au)` is exactly 959.63".
pub fn sun_radius_au() -> f64 {
    (SUN_SEMIDIAMETER_AT_1AU_ARCSEC * ARCSEC_RAD).sin()
}

/// The solar parallax, in arcseconds, that corresponds to an astronomical unit of `au_km`:
/// `asin(a_e / AU)` with `a_e` the IERS 2010 equatorial radius.
pub fn parallax_arcsec_from_au_km(au_km: f64) -> f64 {
    (EARTH_EQUATORIAL_RADIUS_M / 1000.0 / au_km).asin() / ARCSEC_RAD
}

/// The astronomical unit in km implied by a solar parallax in arcseconds: `a_e / sin(pi)`.
pub fn au_km_from_parallax_arcsec(parallax_arcsec: f64) -> f64 {
    EARTH_EQUATORIAL_RADIUS_M / 1000.0 / (parallax_arcsec * ARCSEC_RAD).sin()
}

/// The AU (km) and its standard uncertainty (km) from a parallax and its uncertainty
/// (arcsec): a_e / sin(pi), and half the width of the exact image of pi -+ sigma (to first
/// order AU cot(pi) sigma_pi, from which it differs by (sigma/pi)^2 relatively); `None` when
/// pi - sigma reaches zero, where the parallax sets no upper bound on the AU.
pub fn au_and_sigma_km(parallax_arcsec: f64, sigma_arcsec: f64) -> Option<(f64, f64)> {
    (parallax_arcsec - sigma_arcsec > 0.0).then(|| {
        let au = au_km_from_parallax_arcsec;
        (
            au(parallax_arcsec),
            0.5 * (au(parallax_arcsec - sigma_arcsec) - au(parallax_arcsec + sigma_arcsec)),
        )
    })
}

/// The solar parallax of the IAU 2009/2012 system, arcseconds: asin(6378.1366 km / AU).
pub fn nominal_parallax_arcsec() -> f64 {
    parallax_arcsec_from_au_km(AU_KM)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn nominal_parallax_matches_iau_2009() {
        // Source: Luzum et al. 2011, Celest. Mech. Dyn. Astr. 110, 293 (IAU 2009 system): 8.794143".
        // The value there is recalled from memory; the arithmetic here confirms it.
        assert!((nominal_parallax_arcsec() - 8.794_143).abs() < 5e-7);
    }

    #[test]
    fn parallax_and_au_round_trip() {
        let au = au_km_from_parallax_arcsec(8.794_143);
        assert!((parallax_arcsec_from_au_km(au) - 8.794_143).abs() < 1e-12);
        // Source: IAU 2012 Resolution B2; 1e-6 arcsec of parallax is about 17 km of AU.
        assert!((au - AU_KM).abs() < 20.0);
    }

    #[test]
    fn sun_radius_is_the_nominal_solar_radius_to_a_few_hundred_km() {
        // Source: IAU 2015 Resolution B3, nominal solar radius 695 700 km; 959.63" at 1 au
        // gives 696 000 km (Auwers 1891), so they differ by about 0.04 %.
        let r_km = sun_radius_au() * AU_KM;
        assert!((r_km - 695_700.0).abs() < 400.0, "{r_km}");
    }
}
