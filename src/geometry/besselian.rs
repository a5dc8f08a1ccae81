//! Besselian-style elements of a transit: the geometry of one event on the fundamental plane,
//! fitted as Chebyshev series in time so that any station's contacts cost a few cheap steps.
//!
//! The axis is the line from the planet's centre to the Sun's centre (apparent geocentric
//! positions). The fundamental plane passes through the Earth's centre perpendicular to it,
//! with x towards increasing right ascension, y towards the north and z along the axis
//! towards the Sun. Lengths are in Earth equatorial radii (IERS 2010, 6 378 136.6 m) for the
//! nominal astronomical unit (IAU 2012 B2).
//!
//! Elements, functions of time: x, y (where the axis meets the plane), d and a (declination
//! and right ascension of the axis), mu = GAST - a (its Greenwich hour angle), and for the two
//! cones tangent to the Sun and the planet, exterior (I, IV: sin f1 = (R_sun + R_p)/|S - P|)
//! and interior (II, III: sin f2 = (R_sun - R_p)/|S - P|), their radii on the plane l1, l2
//! and tan f1, tan f2. A station at (xi, eta, zeta) is at contact when
//! (x - xi)^2 + (y - eta)^2 = (l - zeta tan f)^2.
//!
//! References: W. Chauvenet, *A Manual of Spherical and Practical Astronomy* (1863), vol. I,
//! chapters on eclipses and on transits; *Explanatory Supplement to the Astronomical Almanac*
//! (1992), chapter 8 (eclipses: Besselian elements); J. Meeus, *Elements of Solar Eclipses
//! 1951-2200* (1989).

use crate::error::{Error, Result};
use crate::sky::chebyshev::Chebyshev;
use crate::sky::constants::{
    nominal_parallax_arcsec, sun_radius_au, ARCSEC_RAD, AU_M, EARTH_EQUATORIAL_RADIUS_M,
};
use crate::sky::ephemeris::{geocentric_state, GeocentricState, Planet};
use crate::sky::vector::{angle_between, dot, norm, scale, sub};
use crate::time::scales::{TimeModel, Tt};

/// Number of full-model evaluations (Chebyshev nodes) per event.
pub const NODES: usize = 20;

/// Half-width of the interval covered by the elements, hours either side of the centre.
pub const HALF_WIDTH_H: f64 = 6.5;

/// The elements of one event at one instant, with their rates per hour.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub struct ElementValues {
    /// x (Earth radii) and its rate per hour.
    pub x: (f64, f64),
    /// y (Earth radii) and its rate per hour.
    pub y: (f64, f64),
    /// Declination of the axis d (radians) and its rate.
    pub d: (f64, f64),
    /// Greenwich hour angle of the axis mu (radians) and its rate.
    pub mu: (f64, f64),
    /// Radius of the exterior cone on the plane l1 (Earth radii) and its rate.
    pub l1: (f64, f64),
    /// Radius of the interior cone on the plane l2 (Earth radii) and its rate.
    pub l2: (f64, f64),
    /// tan f1.
    pub tan_f1: f64,
    /// tan f2.
    pub tan_f2: f64,
}

/// The elements of one cone (exterior or interior) at one instant, with rates per hour.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub struct ConeValues {
    /// x (Earth radii) and its rate per hour.
    pub x: (f64, f64),
    /// y (Earth radii) and its rate per hour.
    pub y: (f64, f64),
    /// Declination of the axis (radians) and its rate.
    pub d: (f64, f64),
    /// Greenwich hour angle of the axis (radians) and its rate.
    pub mu: (f64, f64),
    /// The cone's radius on the plane (Earth radii) and its rate.
    pub l: (f64, f64),
    /// tan f of the cone.
    pub tan_f: f64,
}

/// Besselian-style elements of one transit.
#[derive(Clone, Debug)]
pub struct Elements {
    /// The planet.
    pub planet: Planet,
    /// How UT1 was obtained.
    pub time_model: TimeModel,
    /// The centre of the interval (TT); series arguments are hours from it.
    pub epoch: Tt,
    /// Delta T used (s), at the epoch.
    pub delta_t_s: f64,
    x: Chebyshev,
    y: Chebyshev,
    d: Chebyshev,
    mu: Chebyshev,
    ra: Chebyshev,
    l1: Chebyshev,
    l2: Chebyshev,
    tan_f1: Chebyshev,
    tan_f2: Chebyshev,
    sun: [Chebyshev; 3],
    planet_vec: [Chebyshev; 3],
}

/// Earth radii per au for the nominal astronomical unit.
pub fn earth_radii_per_au() -> f64 {
    AU_M / EARTH_EQUATORIAL_RADIUS_M
}

/// The elements at one instant from a full-model state (no fitting).
///
/// Returns: (x, y, d, a, gast, l1, l2, tan f1, tan f2) with lengths in Earth radii.
pub fn instantaneous_elements(planet: Planet, state: &GeocentricState) -> [f64; 9] {
    let k = earth_radii_per_au();
    let s = scale(k, state.sun_au);
    let p = scale(k, state.planet_au);
    let g = sub(s, p);
    let g_len = norm(g);
    let gz = scale(1.0 / g_len, g);
    let a = gz[1].atan2(gz[0]);
    let d = gz[2].asin();
    let (sa, ca) = a.sin_cos();
    let (sd, cd) = d.sin_cos();
    let ex = [-sa, ca, 0.0];
    let ey = [-sd * ca, -sd * sa, cd];
    let x = dot(p, ex);
    let y = dot(p, ey);
    let z = dot(p, gz);
    let r_sun = sun_radius_au() * k;
    let r_p = planet.radius_au() * k;
    let sin_f1 = (r_sun + r_p) / g_len;
    let sin_f2 = (r_sun - r_p) / g_len;
    let cos_f1 = (1.0 - sin_f1 * sin_f1).sqrt();
    let cos_f2 = (1.0 - sin_f2 * sin_f2).sqrt();
    let tan_f1 = sin_f1 / cos_f1;
    let tan_f2 = sin_f2 / cos_f2;
    let l1 = z * tan_f1 + r_p / cos_f1;
    let l2 = z * tan_f2 - r_p / cos_f2;
    [x, y, d, a, state.gast_rad, l1, l2, tan_f1, tan_f2]
}

impl Elements {
    /// Compute the elements over [epoch - 6.5 h, epoch + 6.5 h] from [`NODES`] full-model
    /// evaluations.
    pub fn compute(planet: Planet, epoch: Tt, time_model: &TimeModel) -> Elements {
        Self::compute_with_nodes(planet, epoch, time_model, NODES)
    }

    /// As [`Elements::compute`] with `nodes` evaluations (fewer for a coarse first look).
    pub fn compute_with_nodes(
        planet: Planet,
        epoch: Tt,
        time_model: &TimeModel,
        nodes: usize,
    ) -> Elements {
        let n_nodes = nodes.clamp(4, crate::sky::chebyshev::MAX_TERMS);
        let nodes = Chebyshev::nodes(-HALF_WIDTH_H, HALF_WIDTH_H, n_nodes);
        let mut cols: Vec<Vec<f64>> = (0..15).map(|_| Vec::with_capacity(n_nodes)).collect();
        let k = earth_radii_per_au();
        let mut prev_mu: Option<f64> = None;
        let mut prev_a: Option<f64> = None;
        for &h in &nodes {
            let st = geocentric_state(planet, epoch.add_seconds(h * 3600.0), time_model);
            let e = instantaneous_elements(planet, &st);
            let a = unwrap_angle(e[3], prev_a);
            let mu = unwrap_angle(e[4] - e[3], prev_mu);
            prev_a = Some(a);
            prev_mu = Some(mu);
            let values = [
                e[0],
                e[1],
                e[2],
                mu,
                a,
                e[5],
                e[6],
                e[7],
                e[8],
                st.sun_au[0] * k,
                st.sun_au[1] * k,
                st.sun_au[2] * k,
                st.planet_au[0] * k,
                st.planet_au[1] * k,
                st.planet_au[2] * k,
            ];
            for (c, v) in cols.iter_mut().zip(values) {
                c.push(v);
            }
        }
        // Series are cut where the dropped terms sum to far below what matters: 5e-9 Earth
        // radii (3 cm, some 30 microseconds of contact time) for lengths, where the full model's
        // own smoothness (~1e-10 per coefficient) sets the floor; 1e-10 rad for angles, 1e-13
        // for tan f; 1e-6 Earth radii for the bodies' vectors (altitudes, azimuths, position
        // angles and the separation of centres).
        let tolerances = [
            5e-9, 5e-9, 1e-10, 1e-10, 1e-10, 5e-9, 5e-9, 1e-13, 1e-13, 1e-6, 1e-6, 1e-6, 1e-6,
            1e-6, 1e-6,
        ];
        let fit = |i: usize| {
            Chebyshev::fit(-HALF_WIDTH_H, HALF_WIDTH_H, &cols[i]).truncated(tolerances[i])
        };
        Elements {
            planet,
            time_model: *time_model,
            epoch,
            delta_t_s: time_model.delta_t_s(epoch).0,
            x: fit(0),
            y: fit(1),
            d: fit(2),
            mu: fit(3),
            ra: fit(4),
            l1: fit(5),
            l2: fit(6),
            tan_f1: fit(7),
            tan_f2: fit(8),
            sun: [fit(9), fit(10), fit(11)],
            planet_vec: [fit(12), fit(13), fit(14)],
        }
    }

    /// Hours from the epoch of an instant.
    pub fn hours(&self, tt: Tt) -> f64 {
        tt.seconds_since(self.epoch) / 3600.0
    }

    /// The instant `hours` after the epoch.
    pub fn instant(&self, hours: f64) -> Tt {
        self.epoch.add_seconds(hours * 3600.0)
    }

    /// Whether `hours` lies within the fitted interval.
    pub fn covers(&self, hours: f64) -> bool {
        (-HALF_WIDTH_H..=HALF_WIDTH_H).contains(&hours)
    }

    /// The elements and their rates per hour at `hours` from the epoch.
    #[inline]
    pub fn at(&self, hours: f64) -> ElementValues {
        ElementValues {
            x: self.x.value_and_rate(hours),
            y: self.y.value_and_rate(hours),
            d: self.d.value_and_rate(hours),
            mu: self.mu.value_and_rate(hours),
            l1: self.l1.value_and_rate(hours),
            l2: self.l2.value_and_rate(hours),
            tan_f1: self.tan_f1.value(hours),
            tan_f2: self.tan_f2.value(hours),
        }
    }

    /// The elements one contact needs (the exterior or interior cone only) at `hours`.
    #[inline]
    pub fn at_cone(&self, hours: f64, exterior: bool) -> ConeValues {
        let (l, tan_f) = if exterior {
            (&self.l1, &self.tan_f1)
        } else {
            (&self.l2, &self.tan_f2)
        };
        ConeValues {
            x: self.x.value_and_rate(hours),
            y: self.y.value_and_rate(hours),
            d: self.d.value_and_rate(hours),
            mu: self.mu.value_and_rate(hours),
            l: l.value_and_rate(hours),
            tan_f: tan_f.value(hours),
        }
    }

    /// Number of coefficients kept in each series (x, y, d, mu, a, l1, l2, tan f1, tan f2).
    pub fn series_lengths(&self) -> [usize; 9] {
        [
            self.x.len(),
            self.y.len(),
            self.d.len(),
            self.mu.len(),
            self.ra.len(),
            self.l1.len(),
            self.l2.len(),
            self.tan_f1.len(),
            self.tan_f2.len(),
        ]
    }

    /// Right ascension of the axis (radians) at `hours`; GAST = mu + a.
    pub fn axis_ra_rad(&self, hours: f64) -> f64 {
        self.ra.value(hours)
    }

    /// Geocentric vector of the Sun in Earth radii (true equator and equinox of date).
    pub fn sun_earth_radii(&self, hours: f64) -> [f64; 3] {
        [
            self.sun[0].value(hours),
            self.sun[1].value(hours),
            self.sun[2].value(hours),
        ]
    }

    /// Geocentric vector of the planet in Earth radii (true equator and equinox of date).
    pub fn planet_earth_radii(&self, hours: f64) -> [f64; 3] {
        [
            self.planet_vec[0].value(hours),
            self.planet_vec[1].value(hours),
            self.planet_vec[2].value(hours),
        ]
    }

    /// Geocentric apparent separation of the centres (radians) from the fitted vectors.
    pub fn geocentric_separation_rad(&self, hours: f64) -> f64 {
        angle_between(self.sun_earth_radii(hours), self.planet_earth_radii(hours))
    }

    /// Largest difference between the fitted elements and the full model at the midpoints
    /// between nodes, expressed as the equivalent shift on the plane in Earth radii (x, y, l1,
    /// l2) and in radians times one Earth radius (d, mu).
    pub fn fit_residual_earth_radii(&self) -> f64 {
        let nodes = Chebyshev::nodes(-HALF_WIDTH_H, HALF_WIDTH_H, NODES);
        let mut worst: f64 = 0.0;
        for w in nodes.windows(2) {
            let h = 0.5 * (w[0] + w[1]);
            let st = geocentric_state(self.planet, self.instant(h), &self.time_model);
            let e = instantaneous_elements(self.planet, &st);
            let v = self.at(h);
            let mu_full = e[4] - e[3];
            let dmu = (mu_full - v.mu.0 + std::f64::consts::PI).rem_euclid(std::f64::consts::TAU)
                - std::f64::consts::PI;
            for diff in [
                e[0] - v.x.0,
                e[1] - v.y.0,
                e[2] - v.d.0,
                dmu,
                e[5] - v.l1.0,
                e[6] - v.l2.0,
            ] {
                worst = worst.max(diff.abs());
            }
        }
        worst
    }
}

fn unwrap_angle(angle: f64, previous: Option<f64>) -> f64 {
    match previous {
        None => angle,
        Some(p) => {
            let tau = std::f64::consts::TAU;
            angle + ((p - angle) / tau).round() * tau
        }
    }
}

/// Geocentric angular separation of the centres (radians) and the contact thresholds
/// s_sun + s_p and s_sun - s_p (radians) from a full-model state.
pub fn geocentric_separation_rad(planet: Planet, state: &GeocentricState) -> (f64, f64, f64) {
    let (ss, sp) = crate::sky::ephemeris::semidiameters_rad(planet, state.sun_au, state.planet_au);
    (
        angle_between(state.sun_au, state.planet_au),
        ss + sp,
        ss - sp,
    )
}

/// Scale factor s = sin(pi_0) / sin(pi) by which a trial parallax multiplies every element
/// length, pi_0 being the nominal parallax.
pub fn length_scale(parallax_arcsec: f64) -> f64 {
    (nominal_parallax_arcsec() * ARCSEC_RAD).sin() / (parallax_arcsec * ARCSEC_RAD).sin()
}

/// ds/dpi at the nominal parallax, per arcsecond: -cot(pi_0) x (1 arcsec in radians).
pub fn length_scale_rate_per_arcsec() -> f64 {
    -ARCSEC_RAD / (nominal_parallax_arcsec() * ARCSEC_RAD).tan()
}

/// Check a parallax value given by a user.
pub fn check_parallax(parallax_arcsec: f64) -> Result<()> {
    if !(1.0..=30.0).contains(&parallax_arcsec) {
        return Err(Error::argument(format!(
            "a solar parallax of {parallax_arcsec} arcsec is not plausible; give a value between 1 and 30"
        )));
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn series_stay_short() {
        // Common practice, no source: the speed figures of docs/performance.md assume short
        // series after truncation (measured: 4 or 5 terms for Venus 2012).
        let el = Elements::compute(
            Planet::Venus,
            Tt::from_jd(2_456_084.56),
            &TimeModel::default(),
        );
        let lengths = el.series_lengths();
        eprintln!("series lengths {lengths:?}");
        assert!(lengths.iter().all(|&n| (2..=8).contains(&n)), "{lengths:?}");
    }

    #[test]
    fn fitted_elements_match_the_full_model() {
        // Common practice, no source: the fit must be far below the 0.3 s goal; 1e-7 Earth
        // radii is 0.6 m on the plane, about 0.0002 s of contact time.
        let model = TimeModel::default();
        let epoch = Tt::from_jd(2_456_084.56);
        let el = Elements::compute(Planet::Venus, epoch, &model);
        let r = el.fit_residual_earth_radii();
        assert!(r < 1e-7, "fit residual {r}");
    }
}
