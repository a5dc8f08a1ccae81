//! Geocentric apparent positions of the Sun and of Mercury or Venus, and the Earth's rotation.
//!
//! Model (docs/method.md gives the reasoning and the error budget):
//! - Barycentric positions of the Earth, the Sun and the planet from series fitted to the JPL
//!   development ephemerides around each transit (`jpl_windows.rs`, the default), or
//! - heliocentric positions of the planet and the Earth from the full VSOP87A series
//!   (Bretagnon and Francou 1988, A&A 202, 309) through the `vsop87` crate, referred to the
//!   dynamical ecliptic and equinox J2000 and rotated to the FK5/ICRS equator with the matrix
//!   given with VSOP87.
//! - Light time iterated for the planet (geocentric distance) and for the Sun (with the JPL
//!   series; heliocentric VSOP87 leaves the Sun's barycentric motion out).
//! - Annual aberration, relativistic form of ERFA `eraAb` (Klioner 2003), with the Earth's
//!   barycentric velocity from the JPL series' derivative, or with VSOP87 from ERFA
//!   `eraEpv00` (through the `erfa` crate).
//! - Precession and nutation IAU 2006/2000A (`eraPnm06a`), so the vectors are referred to the
//!   true equator and equinox of date; Greenwich apparent sidereal time IAU 2006 (`eraGst06`).
//! - TDB is taken equal to TT (they differ by under 2 ms).

use crate::sky::constants::{
    sun_radius_au, AU_KM, LIGHT_TIME_DAYS_PER_AU, MERCURY_RADIUS_KM, SECONDS_PER_DAY,
    VENUS_RADIUS_KM,
};
use crate::sky::vector::{add, dot, mat_vec, norm, scale, sub, unit, V3};
use crate::time::scales::{TimeModel, Tt};
use serde::Serialize;

/// The planets that transit the Sun as seen from the Earth.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Planet {
    /// Mercury.
    Mercury,
    /// Venus.
    Venus,
}

impl Planet {
    /// Lower-case name, as used on the command line and in files.
    pub fn name(self) -> &'static str {
        match self {
            Planet::Mercury => "mercury",
            Planet::Venus => "venus",
        }
    }

    /// The name as written in prose: `Mercury`, `Venus` (also the `Display` form).
    pub fn title(self) -> &'static str {
        match self {
            Planet::Mercury => "Mercury",
            Planet::Venus => "Venus",
        }
    }

    /// Mean radius in km (IAU WGCCRE, Archinal et al. 2011).
    pub fn radius_km(self) -> f64 {
        match self {
            Planet::Mercury => MERCURY_RADIUS_KM,
            Planet::Venus => VENUS_RADIUS_KM,
        }
    }

    /// Radius in au, fixed: the planet's angular size at 1 au does not scale with the AU.
    pub fn radius_au(self) -> f64 {
        self.radius_km() / AU_KM
    }

    /// Mean synodic period in days (common practice, no source: 115.88 d and 583.92 d).
    pub fn synodic_period_days(self) -> f64 {
        match self {
            Planet::Mercury => 115.877_5,
            Planet::Venus => 583.921_4,
        }
    }

    /// Parse `venus` or `mercury` (any case).
    pub fn parse(text: &str) -> Option<Planet> {
        match text.trim().to_ascii_lowercase().as_str() {
            "venus" => Some(Planet::Venus),
            "mercury" => Some(Planet::Mercury),
            _ => None,
        }
    }

    /// Heliocentric position in au, VSOP87A (J2000 ecliptic), at a Julian date (TDB).
    pub fn heliocentric_ecliptic_au(self, jd_tdb: f64) -> V3 {
        let c = match self {
            Planet::Mercury => vsop87::vsop87a::mercury(jd_tdb),
            Planet::Venus => vsop87::vsop87a::venus(jd_tdb),
        };
        [c.x, c.y, c.z]
    }
}

impl std::fmt::Display for Planet {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.title())
    }
}

/// The Earth's heliocentric position in au, VSOP87A (J2000 ecliptic), at a Julian date (TDB).
pub fn earth_heliocentric_ecliptic_au(jd_tdb: f64) -> V3 {
    let c = vsop87::vsop87a::earth(jd_tdb);
    [c.x, c.y, c.z]
}

/// Rotation from the VSOP87 dynamical ecliptic and equinox J2000 to the FK5 equator J2000
/// (rows), as published with VSOP87 (Bretagnon and Francou 1988). FK5 J2000 and the ICRS
/// differ by about 20 mas, a rotation common to the Sun and the planet.
pub const VSOP87_TO_FK5: [[f64; 3]; 3] = [
    [1.0, 0.000_000_440_360, -0.000_000_190_919],
    [-0.000_000_479_966, 0.917_482_137_087, -0.397_776_982_902],
    [0.0, 0.397_776_982_902, 0.917_482_137_087],
];

/// Transpose of a rotation matrix times a vector.
fn mat_t_vec(m: [[f64; 3]; 3], v: V3) -> V3 {
    [
        m[0][0] * v[0] + m[1][0] * v[1] + m[2][0] * v[2],
        m[0][1] * v[0] + m[1][1] * v[1] + m[2][1] * v[2],
        m[0][2] * v[0] + m[1][2] * v[1] + m[2][2] * v[2],
    ]
}

/// Apply annual aberration to a unit direction.
///
/// Arguments: `p_unit`, direction to the body (unit vector); `v_c`, the observer's barycentric
/// velocity in units of the speed of light (same frame).
/// Returns: the apparent direction (unit vector).
/// References: ERFA `eraAb` (gravitational term at the observer omitted, below 1e-11 rad);
/// S. A. Klioner, AJ 125, 1580 (2003).
pub fn aberration(p_unit: V3, v_c: V3) -> V3 {
    let bm1 = (1.0 - dot(v_c, v_c)).sqrt();
    let pdv = dot(p_unit, v_c);
    let w1 = 1.0 + pdv / (1.0 + bm1);
    unit(add(scale(bm1, p_unit), scale(w1, v_c)))
}

/// Geocentric apparent vectors of the Sun and the planet and the Earth's orientation at one
/// instant.
#[derive(Clone, Copy, Debug)]
pub struct GeocentricState {
    /// The instant (TT).
    pub tt: Tt,
    /// The Sun: apparent direction times light-time distance, au, true equator and equinox of date.
    pub sun_au: V3,
    /// The planet, likewise.
    pub planet_au: V3,
    /// Greenwich apparent sidereal time, radians.
    pub gast_rad: f64,
}

/// Which planetary theory computes the positions (`--ephemeris`).
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum EphemerisChoice {
    /// Series fitted to the JPL development ephemerides around each transit
    /// ([`crate::sky::jpl_windows`]), VSOP87A where an instant has none.
    #[default]
    Jpl,
    /// VSOP87A everywhere.
    Vsop87,
}

/// The JPL window that serves an instant under this choice, if any.
pub fn jpl_window(
    planet: Planet,
    tt: Tt,
    choice: EphemerisChoice,
) -> Option<&'static crate::sky::jpl_windows::Window> {
    match choice {
        EphemerisChoice::Jpl => crate::sky::jpl_windows::window_for(planet, tt),
        EphemerisChoice::Vsop87 => None,
    }
}

/// The name of the ephemeris that serves an instant: `JPL DE421`, ..., or `VSOP87A`.
pub fn ephemeris_name(planet: Planet, tt: Tt, choice: EphemerisChoice) -> String {
    jpl_window(planet, tt, choice)
        .map(|w| format!("JPL {}", w.source))
        .unwrap_or_else(|| "VSOP87A".to_string())
}

/// Compute the geocentric apparent state at an instant.
///
/// Arguments: `planet`; `tt`, the instant; `time_model`, which gives UT1 for the sidereal time
/// and the ephemeris to use.
/// Returns: [`GeocentricState`].
/// References: see the module documentation.
pub fn geocentric_state(planet: Planet, tt: Tt, time_model: &TimeModel) -> GeocentricState {
    let (sun_geo, planet_geo, v_c) = match jpl_window(planet, tt, time_model.ephemeris) {
        Some(w) => jpl_vectors(w, tt),
        None => vsop87_vectors(planet, tt),
    };
    apparent_state(tt, time_model, (sun_geo, planet_geo), v_c)
}

/// Geocentric light-time vectors of the Sun and the planet (ICRS axes, au) and the Earth's
/// barycentric velocity over c, from a JPL window: P(t - tau) - E(t) with tau iterated for
/// each body (three passes converge far below a millimetre).
fn jpl_vectors(w: &crate::sky::jpl_windows::Window, tt: Tt) -> (V3, V3, V3) {
    use crate::sky::jpl_windows::Body;
    let (earth, earth_velocity) = w.position_velocity_au(Body::Earth, tt);
    let retarded = |body: Body| {
        let mut p = sub(w.position_au(body, tt), earth);
        for _ in 0..3 {
            let tau_s = norm(p) * LIGHT_TIME_DAYS_PER_AU * SECONDS_PER_DAY;
            p = sub(w.position_au(body, tt.add_seconds(-tau_s)), earth);
        }
        p
    };
    (
        retarded(Body::Sun),
        retarded(Body::Planet),
        scale(LIGHT_TIME_DAYS_PER_AU, earth_velocity),
    )
}

/// The same from VSOP87A: heliocentric positions rotated to the FK5 equator (about 20 mas
/// from the ICRS, common to both bodies), the Earth's barycentric velocity from ERFA
/// `eraEpv00`.
fn vsop87_vectors(planet: Planet, tt: Tt) -> (V3, V3, V3) {
    let (jd1, jd2) = tt.jd_pair();
    // VSOP87 takes a one-part Julian date, which resolves only ~40 microseconds (about a metre
    // of orbital motion). The part lost in rounding is restored to first order with the bodies'
    // velocities, so that the positions are smooth in time (the elements' series need that).
    let jd = jd1 + jd2;
    let lost_days = (jd1 - jd) + jd2;
    let (_, pvh, pvb) = erfa::earth::position_velocity_00(jd1, jd2);
    let earth_velocity_ecl = mat_t_vec(VSOP87_TO_FK5, pvh[1]);
    let earth = add(
        earth_heliocentric_ecliptic_au(jd),
        scale(lost_days, earth_velocity_ecl),
    );

    // Light time for the planet: P(t - tau) - E(t). One evaluation at t and one at t - tau0;
    // the refined tau1 differs from tau0 by ~(d rho/dt) tau0 / c, far below a millisecond, so
    // P(t - tau1) is interpolated linearly between the two (error < 1 mm).
    let p_now = planet.heliocentric_ecliptic_au(jd);
    let tau0_days = norm(sub(p_now, earth)) * LIGHT_TIME_DAYS_PER_AU;
    let jd_then = jd - tau0_days;
    let p_then = planet.heliocentric_ecliptic_au(jd_then);
    // (jd - jd_then) is exact; each evaluation's rounding is restored with the planet's velocity.
    let planet_velocity = scale(1.0 / (jd - jd_then), sub(p_now, p_then));
    let lost_then_days = lost_days + ((jd - jd_then) - tau0_days);
    let p_now = add(p_now, scale(lost_days, planet_velocity));
    let p_then = add(p_then, scale(lost_then_days, planet_velocity));
    let tau1_days = norm(sub(p_then, earth)) * LIGHT_TIME_DAYS_PER_AU;
    let w = tau1_days / tau0_days;
    let p_ret = add(scale(1.0 - w, p_now), scale(w, p_then));
    let planet_geo = sub(p_ret, earth);
    // The Sun: heliocentric coordinates leave out its motion about the barycentre during the
    // light time (about 6 km, some 0.01 arcsec); the JPL windows include it.
    let sun_geo = scale(-1.0, earth);
    (
        mat_vec(VSOP87_TO_FK5, sun_geo),
        mat_vec(VSOP87_TO_FK5, planet_geo),
        // Aberration with the Earth's barycentric velocity (ERFA eraEpv00, au/day, BCRS).
        scale(LIGHT_TIME_DAYS_PER_AU, pvb[1]),
    )
}

/// Aberration, then bias-precession-nutation to the true equator and equinox of date, and
/// the sidereal time.
fn apparent_state(
    tt: Tt,
    time_model: &TimeModel,
    (sun_eq, planet_eq): (V3, V3),
    v_c: V3,
) -> GeocentricState {
    let (jd1, jd2) = tt.jd_pair();
    let sun_app = scale(norm(sun_eq), aberration(unit(sun_eq), v_c));
    let planet_app = scale(norm(planet_eq), aberration(unit(planet_eq), v_c));
    let rnpb = erfa::prenut::pn_matrix_06a(jd1, jd2);
    let (ut1a, ut1b) = time_model.ut1_jd_pair(tt);
    let gast_rad = erfa::time::gst06(ut1a, ut1b, jd1, jd2, rnpb);
    GeocentricState {
        tt,
        sun_au: mat_vec(rnpb, sun_app),
        planet_au: mat_vec(rnpb, planet_app),
        gast_rad,
    }
}

/// Apparent semidiameters (radians) of the Sun and the planet seen from a point, given their
/// vectors from that point in au: `asin(R / d)`.
pub fn semidiameters_rad(planet: Planet, sun_au: V3, planet_au: V3) -> (f64, f64) {
    (
        (sun_radius_au() / norm(sun_au)).asin(),
        (planet.radius_au() / norm(planet_au)).asin(),
    )
}

/// Geometric (no light time, no aberration) angle between the Sun and the planet seen from the
/// Earth's centre, radians, and the rate of the heliocentric longitude difference. Used to find
/// conjunctions quickly.
pub fn geometric_elongation_rad(planet: Planet, jd_tdb: f64) -> f64 {
    let earth = earth_heliocentric_ecliptic_au(jd_tdb);
    let p = sub(planet.heliocentric_ecliptic_au(jd_tdb), earth);
    crate::sky::vector::angle_between(scale(-1.0, earth), p)
}

/// Heliocentric ecliptic longitude difference planet - Earth (radians, in -pi..pi), J2000.
pub fn heliocentric_longitude_difference_rad(planet: Planet, jd_tdb: f64) -> f64 {
    let e = earth_heliocentric_ecliptic_au(jd_tdb);
    let p = planet.heliocentric_ecliptic_au(jd_tdb);
    let d = p[1].atan2(p[0]) - e[1].atan2(e[0]);
    (d + std::f64::consts::PI).rem_euclid(std::f64::consts::TAU) - std::f64::consts::PI
}

/// The planet's heliocentric position (au) and velocity (au per day) at an instant, from the
/// JPL series where a window covers it, else VSOP87A (J2000 ecliptic axes; the orbit's size
/// and period do not depend on the axes). Velocities by a central difference of 0.01 day.
pub fn heliocentric_state_au(planet: Planet, tt: Tt, choice: EphemerisChoice) -> (V3, V3) {
    let at = |t: Tt| -> V3 {
        match jpl_window(planet, t, choice) {
            Some(w) => {
                use crate::sky::jpl_windows::Body;
                sub(w.position_au(Body::Planet, t), w.position_au(Body::Sun, t))
            }
            None => planet.heliocentric_ecliptic_au(t.jd()),
        }
    };
    let h_s = 0.01 * SECONDS_PER_DAY;
    let (before, after) = (at(tt.add_seconds(-h_s)), at(tt.add_seconds(h_s)));
    (at(tt), scale(1.0 / 0.02, sub(after, before)))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::sky::constants::{ARCSEC_RAD, DAYS_PER_JULIAN_CENTURY, J2000_JD};

    fn julian_centuries(jd: f64) -> f64 {
        (jd - J2000_JD) / DAYS_PER_JULIAN_CENTURY
    }

    #[test]
    fn venus_heliocentric_matches_handbook_example() {
        // Source: J. Meeus, Astronomical Algorithms, 2nd ed. (1998), Example 32.a: Venus on
        // 1992 December 20, 0h TD, JDE 2448976.5, ecliptic and equinox of date, from the full
        // VSOP87D series: L = 26.11412 deg, B = -2.62060 deg, R = 0.7246017 au (the book's
        // truncated tables give 26.11428, -2.62070, 0.724603).
        let c = vsop87::vsop87d::venus(2_448_976.5);
        let l_deg = c.longitude().to_degrees();
        let b_deg = c.latitude().to_degrees();
        assert!((l_deg - 26.11412).abs() < 1.0 / 3600.0, "{l_deg}");
        assert!((b_deg + 2.62060).abs() < 1.0 / 3600.0, "{b_deg}");
        assert!((c.distance() - 0.7246017).abs() < 2e-7);
        // The J2000 rectangular series (used by this crate) agrees with it after precession
        // in longitude by ~ 50.29"/yr x 7.0 yr (common practice, no source): within 2".
        let a = Planet::Venus.heliocentric_ecliptic_au(2_448_976.5);
        let l2000 = a[1].atan2(a[0]).to_degrees();
        let precession_deg = 5029.0966 / 3600.0 * julian_centuries(2_448_976.5);
        assert!((l2000 + precession_deg - l_deg).abs() < 2.0 / 3600.0);
    }

    #[test]
    fn apparent_sun_matches_handbook_example() {
        // Source: J. Meeus, Astronomical Algorithms, 2nd ed., Example 25.a: 1992 October 13.0 TD,
        // apparent right ascension 13h13m31.4s (low-accuracy method, good to ~0.01 deg).
        let tt = Tt::from_jd(2_448_908.5);
        let s = geocentric_state(Planet::Venus, tt, &TimeModel::fixed(59.0));
        let ra_h = s.sun_au[1]
            .atan2(s.sun_au[0])
            .rem_euclid(std::f64::consts::TAU)
            .to_degrees()
            / 15.0;
        let expected_h = 13.0 + 13.0 / 60.0 + 31.4 / 3600.0;
        assert!((ra_h - expected_h).abs() * 3600.0 < 1.5, "{ra_h}");
    }

    #[test]
    fn vsop87_and_the_jpl_series_differ_by_hundredths_of_an_arcsecond() {
        // The planet's place relative to the Sun, VSOP87A against the series fitted to DE421,
        // at greatest transit of Venus 2004 and 2012 (the figure that
        // `reduction::planet_place::place_accuracy_arcsec` gives VSOP87A).
        let mut worst: f64 = 0.0;
        for jd in [2_453_164.85, 2_456_084.56] {
            let tt = Tt::from_jd(jd);
            let offset = |choice| {
                let m = TimeModel {
                    ephemeris: choice,
                    ..TimeModel::fixed(66.0)
                };
                let s = geocentric_state(Planet::Venus, tt, &m);
                sub(unit(s.planet_au), unit(s.sun_au))
            };
            let d = sub(
                offset(EphemerisChoice::Jpl),
                offset(EphemerisChoice::Vsop87),
            );
            worst = worst.max(norm(d) / ARCSEC_RAD);
        }
        eprintln!("VSOP87A - DE421, Venus relative to the Sun: {worst:.4} arcsec");
        assert!(worst > 0.001 && worst < 0.05, "{worst}");
    }

    #[test]
    fn aberration_of_a_perpendicular_direction_is_the_constant() {
        // Common practice, no source: at 29.8 km/s perpendicular to the line of sight the
        // displacement is about 20.5 arcsec (the constant of aberration).
        let v = [0.0, 29_785.0 / 299_792_458.0, 0.0];
        let p = aberration([1.0, 0.0, 0.0], v);
        let shift_arcsec = p[1].atan2(p[0]) / ARCSEC_RAD;
        assert!((shift_arcsec - 20.49).abs() < 0.05, "{shift_arcsec}");
    }
}
