//! The model of a measured position: where the planet's centre stands on the Sun's disc seen
//! from a station at one instant, under trial values of the parameters, with the partial
//! derivatives that the condition equations of a position need.
//!
//! On the fundamental plane the station sees the planet's centre displaced from the Sun's by
//! (u, v) = (s x - xi, s y - eta) Earth radii, where s = sin(pi_0)/sin(pi) rescales the
//! elements for a trial parallax; the cones of the exterior and interior contacts have radii
//! R_ext = s l1 - zeta tan f1 and R_int = s l2 - zeta tan f2 there, whose mean is the Sun's
//! apparent radius on the same scale (their half difference is the planet's). So the
//! separation in units of the Sun's apparent radius is rho = sqrt(u^2 + v^2) / ((R_ext +
//! R_int) / 2): a ratio of two lengths on the plane, as the ratio of two lengths on an image
//! is free of the image's scale. The position angle, from the Sun's north point through east,
//! is atan2(u, v) referred to the Sun's own north (the convergence of the meridians, as for
//! the contacts). A separation in arcseconds is rho times the Sun's topocentric apparent
//! radius (959.63" at 1 au).
//!
//! The plane's ratio is linear in the small angles; its value is carried to the exact angle
//! between the topocentric apparent vectors of the Sun and the planet by a factor taken at
//! nominal parameters (it differs from 1 by up to 2e-5). The partials with respect to the
//! parallax, the planet's offsets, time and longitude are analytic (differentiation of rho
//! and atan2(u, v) through u, v and the radii), but for the position angle's rate and its
//! change with longitude, which also hold the slow turn of the Sun's north against the plane
//! (central differences). The unit tests check every partial against central differences of
//! the model; tests/reference_positions.rs checks the places against Skyfield with the JPL
//! ephemerides (1.8e-6 solar radii, 0.0005 deg at worst).
//!
//! References: W. Chauvenet, *A Manual of Spherical and Practical Astronomy* (1863), vol. I,
//! the chapter on transits (the cones of contact and the station's place on the plane);
//! *Explanatory Supplement to the Astronomical Almanac* (1992), section 8.3 (the station's
//! coordinates xi, eta, zeta and their rates); the position measurements of the 1874 and 1882
//! transits reduced by the same condition equations: S. Newcomb, *Astronomical Papers of the
//! American Ephemeris* II (1891), cited from memory of its treatment.

use super::besselian::{earth_radii_per_au, Elements};
use super::contacts::{local_geometry, sky_at, Contact, Perturbation};
use super::station::GeocentricStation;
use crate::sky::constants::{sun_radius_au, ARCSEC_RAD};

/// What one measured position gives.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum PositionQuantity {
    /// The distance of the planet's centre from the Sun's centre, in the Sun's apparent radius
    /// on the same image (free of the image's scale and orientation).
    SeparationSolarRadii,
    /// The same distance in arcseconds (needs the image's scale).
    SeparationArcsec,
    /// The direction of the planet's centre from the Sun's centre, degrees from the north
    /// point of the disc (north celestial pole of date) through east (needs the image's
    /// orientation).
    PositionAngleDeg,
}

impl PositionQuantity {
    /// The unit of its value and uncertainty.
    pub fn unit(self) -> &'static str {
        match self {
            PositionQuantity::SeparationSolarRadii => "solar radii",
            PositionQuantity::SeparationArcsec => "arcsec",
            PositionQuantity::PositionAngleDeg => "deg",
        }
    }
}

/// Partial derivatives of one modelled quantity, per unit of each argument of the model.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub struct PlacePartials {
    /// Per unit of the length scale s = sin(pi_0)/sin(pi).
    pub per_scale: f64,
    /// Per Earth radius of correction to x (the planet's place east on the plane).
    pub per_dx_er: f64,
    /// Per Earth radius of correction to y (north).
    pub per_dy_er: f64,
    /// Per hour of time (the planet's motion across the disc and the Earth's turning).
    pub per_hour: f64,
    /// Per radian of the station's east longitude.
    pub per_longitude_rad: f64,
}

impl PlacePartials {
    fn times(self, k: f64) -> PlacePartials {
        PlacePartials {
            per_scale: self.per_scale * k,
            per_dx_er: self.per_dx_er * k,
            per_dy_er: self.per_dy_er * k,
            per_hour: self.per_hour * k,
            per_longitude_rad: self.per_longitude_rad * k,
        }
    }
}

/// The modelled place and its partials at one instant.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct PlaceModel {
    /// The separation of the centres, in the Sun's apparent radius.
    pub separation_solar_radii: f64,
    /// The Sun's topocentric apparent radius, arcseconds.
    pub sun_radius_arcsec: f64,
    /// The planet's apparent radius, in the Sun's.
    pub planet_radius_solar_radii: f64,
    /// The position angle, degrees in [0, 360).
    pub position_angle_deg: f64,
    /// The partials of the separation in solar radii.
    pub separation_partials: PlacePartials,
    /// The partials of the position angle, degrees per unit.
    pub position_angle_partials: PlacePartials,
}

impl PlaceModel {
    /// The modelled value of `q` in its unit.
    pub fn value(&self, q: PositionQuantity) -> f64 {
        match q {
            PositionQuantity::SeparationSolarRadii => self.separation_solar_radii,
            PositionQuantity::SeparationArcsec => {
                self.separation_solar_radii * self.sun_radius_arcsec
            }
            PositionQuantity::PositionAngleDeg => self.position_angle_deg,
        }
    }

    /// The partials of `q`, in its unit per unit of each argument. The Sun's apparent radius
    /// in arcseconds is taken as known (it does not depend on the parallax).
    pub fn partials(&self, q: PositionQuantity) -> PlacePartials {
        match q {
            PositionQuantity::SeparationSolarRadii => self.separation_partials,
            PositionQuantity::SeparationArcsec => {
                self.separation_partials.times(self.sun_radius_arcsec)
            }
            PositionQuantity::PositionAngleDeg => self.position_angle_partials,
        }
    }
}

/// The planet's place on the disc seen from `st` at `hours` (from the elements' epoch) under
/// the trial parallax and offsets of `p`, with its partials. The radius corrections of `p`
/// are not applied: a measured position takes the Sun's radius from the same image, so the
/// effective radii of the contacts (the black drop, irradiation) do not enter it.
pub fn place_model(
    el: &Elements,
    st: &GeocentricStation,
    hours: f64,
    p: &Perturbation,
) -> PlaceModel {
    let p = Perturbation {
        dl_ext_er: 0.0,
        dl_int_er: 0.0,
        ..*p
    };
    let ext = local_geometry(el, Some(st), Contact::I, hours, &p);
    let int = local_geometry(el, Some(st), Contact::II, hours, &p);
    let (u, v) = (ext.u, ext.v);
    let d2 = u * u + v * v;
    let d = d2.sqrt();
    let r = 0.5 * (ext.radius + int.radius);
    let rho = d / r;
    // d(u, v) per argument: s, dx, dy, hour, longitude (u = s x - xi, v = s y - eta).
    let ppl = ext.pos_per_longitude;
    let du = [ext.x, ext.scale, 0.0, ext.u_rate, -ppl[0]];
    let dv = [ext.y, 0.0, ext.scale, ext.v_rate, -ppl[1]];
    let dr = [
        0.5 * (ext.l + int.l),
        0.0,
        0.0,
        0.5 * (ext.radius_rate + int.radius_rate),
        -0.5 * ppl[2] * (ext.tan_f + int.tan_f),
    ];
    // The ratio on the plane is linear in the small angles; the exact angles of the same
    // topocentric vectors differ from it by up to 2e-5 of rho (terms of the second order in
    // the Sun's apparent radius): a factor taken at nominal parameters carries the exact
    // value, the plane its changes.
    let plane_nominal = if p == Perturbation::NOMINAL {
        rho
    } else {
        rho_nominal(el, st, hours)
    };
    let (separation_rad, sun_radius_rad) = topocentric_angles(el, st, hours, ext.mu);
    let exact_rho = separation_rad / sun_radius_rad;
    let exact = if plane_nominal > 1e-9 && exact_rho.is_finite() {
        exact_rho / plane_nominal
    } else {
        1.0
    };
    let rho = rho * exact;
    let rho_per = |k: usize| exact * ((u * du[k] + v * dv[k]) / d * r - d * dr[k]) / (r * r);
    let pa_per = |k: usize| (v * du[k] - u * dv[k]) / d2 * (180.0 / std::f64::consts::PI);
    let pa_deg = sky_at(el, Some(st), hours, ext.mu, u.atan2(v)).position_angle_deg;
    let mut pa_partials = partials_from(pa_per);
    // The position angle's rate and its change with the station's longitude also hold the
    // slow turn of the Sun's north against the plane's (the convergence term, which depends
    // on the topocentric Sun's right ascension): central differences, over 0.36 s and 0.2".
    let step_h = 1e-4;
    let turn = position_angle_deg(el, st, hours + step_h, &p)
        - position_angle_deg(el, st, hours - step_h, &p);
    let wrapped = |d: f64| (d + 540.0).rem_euclid(360.0) - 180.0;
    pa_partials.per_hour = wrapped(turn) / (2.0 * step_h);
    // Likewise the station's longitude turns the topocentric Sun's north a little.
    let step_rad = 1e-6;
    let turned = |k: f64| GeocentricStation {
        longitude_rad: st.longitude_rad + k,
        ..*st
    };
    let turn = position_angle_deg(el, &turned(step_rad), hours, &p)
        - position_angle_deg(el, &turned(-step_rad), hours, &p);
    pa_partials.per_longitude_rad = wrapped(turn) / (2.0 * step_rad);
    PlaceModel {
        separation_solar_radii: rho,
        sun_radius_arcsec: sun_radius_rad / ARCSEC_RAD,
        planet_radius_solar_radii: 0.5 * (ext.radius - int.radius) / r,
        position_angle_deg: pa_deg,
        separation_partials: partials_from(rho_per),
        position_angle_partials: pa_partials,
    }
}

/// The position angle alone (degrees in [0, 360)), as [`place_model`] gives it.
fn position_angle_deg(el: &Elements, st: &GeocentricStation, hours: f64, p: &Perturbation) -> f64 {
    let g = local_geometry(el, Some(st), Contact::I, hours, p);
    sky_at(el, Some(st), hours, g.mu, g.u.atan2(g.v)).position_angle_deg
}

fn partials_from(f: impl Fn(usize) -> f64) -> PlacePartials {
    PlacePartials {
        per_scale: f(0),
        per_dx_er: f(1),
        per_dy_er: f(2),
        per_hour: f(3),
        per_longitude_rad: f(4),
    }
}

/// The separation in solar radii on the plane at nominal parameters.
fn rho_nominal(el: &Elements, st: &GeocentricStation, hours: f64) -> f64 {
    let p = Perturbation::NOMINAL;
    let ext = local_geometry(el, Some(st), Contact::I, hours, &p);
    let int = local_geometry(el, Some(st), Contact::II, hours, &p);
    ext.u.hypot(ext.v) / (0.5 * (ext.radius + int.radius))
}

/// The station's place in Earth radii (true equator and equinox of date) at `hours`; `mu` is
/// the axis' Greenwich hour angle.
fn station_vector(el: &Elements, st: &GeocentricStation, hours: f64, mu: f64) -> [f64; 3] {
    let lst = mu + el.axis_ra_rad(hours) + st.longitude_rad;
    let (sl, cl) = lst.sin_cos();
    [st.rho_cos_phi * cl, st.rho_cos_phi * sl, st.rho_sin_phi]
}

/// The angle between the topocentric apparent vectors of the Sun and the planet, and the
/// Sun's apparent radius asin(R_sun / distance) seen from the station (959.63" at 1 au, IAU
/// 1976 system), both radians; `mu` is the axis' Greenwich hour angle.
fn topocentric_angles(el: &Elements, st: &GeocentricStation, hours: f64, mu: f64) -> (f64, f64) {
    use crate::sky::vector::{angle_between, norm};
    let r = station_vector(el, st, hours, mu);
    let sun = el.sun_earth_radii(hours);
    let planet = el.planet_earth_radii(hours);
    let sun_t = [sun[0] - r[0], sun[1] - r[1], sun[2] - r[2]];
    let planet_t = [planet[0] - r[0], planet[1] - r[1], planet[2] - r[2]];
    let sun_radius_rad = (sun_radius_au() * earth_radii_per_au() / norm(sun_t)).asin();
    (angle_between(sun_t, planet_t), sun_radius_rad)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::contacts::disc_place;
    use crate::geometry::station::Station;
    use crate::geometry::transit::transit_on_date;
    use crate::time::iso::parse_date;
    use crate::time::scales::TimeModel;
    use crate::Planet;

    fn venus_2012() -> crate::geometry::transit::TransitEvent {
        transit_on_date(
            Planet::Venus,
            parse_date("2012-06-06").unwrap(),
            &TimeModel::default(),
        )
        .unwrap()
    }

    fn station(lat: f64, lon: f64) -> GeocentricStation {
        Station::new("s", lat, lon, 100.0).unwrap().geocentric()
    }

    /// At nominal parameters the model is the prediction's own place on the disc (whose
    /// separation is the plane's ratio, without the exact factor: within 3e-5).
    #[test]
    fn nominal_place_is_the_predictions() {
        let ev = venus_2012();
        let st = station(64.8, -147.7);
        let h = ev.hours_of_greatest();
        let m = place_model(&ev.elements, &st, h, &Perturbation::NOMINAL);
        let d = disc_place(&ev.elements, Some(&st), h);
        assert!((m.separation_solar_radii - d.separation_sun_radii).abs() < 3e-5);
        assert!((m.position_angle_deg - d.position_angle_deg).abs() < 1e-9);
        // The Sun's radius on 6 June 2012 (distance 1.0145 au): about 945.9".
        assert!(
            (m.sun_radius_arcsec - 945.9).abs() < 0.5,
            "{}",
            m.sun_radius_arcsec
        );
    }

    /// Each analytic partial against a central difference of the model itself.
    #[test]
    fn partials_match_central_differences() {
        let ev = venus_2012();
        let h0 = ev.hours_of_greatest();
        for (lat, lon, dh) in [
            (64.8, -147.7, -2.0),
            (-33.9, 151.2, 1.5),
            (35.0, 135.8, 0.0),
        ] {
            let st = station(lat, lon);
            let p0 = Perturbation {
                length_scale: 1.0001,
                dx_er: 0.01,
                dy_er: -0.02,
                dl_ext_er: 0.0,
                dl_int_er: 0.0,
            };
            let m = place_model(&ev.elements, &st, h0 + dh, &p0);
            let f = |p: &Perturbation, h: f64, st: &GeocentricStation| {
                let m = place_model(&ev.elements, st, h, p);
                (m.separation_solar_radii, m.position_angle_deg)
            };
            let diff = |plus: (f64, f64), minus: (f64, f64), step: f64| {
                (
                    (plus.0 - minus.0) / (2.0 * step),
                    (plus.1 - minus.1) / (2.0 * step),
                )
            };
            let e = 1e-6;
            let along = |g: &dyn Fn(f64) -> Perturbation| {
                diff(f(&g(e), h0 + dh, &st), f(&g(-e), h0 + dh, &st), e)
            };
            let ds = along(&|k| Perturbation {
                length_scale: p0.length_scale + k,
                ..p0
            });
            let dx = along(&|k| Perturbation {
                dx_er: p0.dx_er + k,
                ..p0
            });
            let dy = along(&|k| Perturbation {
                dy_er: p0.dy_er + k,
                ..p0
            });
            let dt = diff(f(&p0, h0 + dh + e, &st), f(&p0, h0 + dh - e, &st), e);
            let turned = |k: f64| GeocentricStation {
                longitude_rad: st.longitude_rad + k,
                ..st
            };
            let dl = diff(f(&p0, h0 + dh, &turned(e)), f(&p0, h0 + dh, &turned(-e)), e);
            let (a, b) = (m.separation_partials, m.position_angle_partials);
            for (name, analytic, numeric) in [
                ("rho/s", a.per_scale, ds.0),
                ("rho/dx", a.per_dx_er, dx.0),
                ("rho/dy", a.per_dy_er, dy.0),
                ("rho/h", a.per_hour, dt.0),
                ("rho/lon", a.per_longitude_rad, dl.0),
                ("pa/s", b.per_scale, ds.1),
                ("pa/dx", b.per_dx_er, dx.1),
                ("pa/dy", b.per_dy_er, dy.1),
                ("pa/h", b.per_hour, dt.1),
                ("pa/lon", b.per_longitude_rad, dl.1),
            ] {
                let scale = analytic.abs().max(numeric.abs()).max(1e-3);
                assert!(
                    (analytic - numeric).abs() / scale < 2e-4,
                    "{name} at ({lat}, {lon}): {analytic} against {numeric}"
                );
            }
        }
    }

    proptest::proptest! {
        #![proptest_config(proptest::prelude::ProptestConfig::with_cases(64))]
        /// Anywhere on the Earth and at any time of the transit: the separation is positive
        /// and finite, the position angle in [0, 360), the arcseconds the solar radii times
        /// the Sun's radius, and the parallax's partial the central difference of the model.
        #[test]
        fn the_model_holds_everywhere(
            lat in -89.0f64..89.0,
            lon in -180.0f64..180.0,
            dh in -3.0f64..3.0,
        ) {
            let ev = venus_2012();
            let st = station(lat, lon);
            let h = ev.hours_of_greatest() + dh;
            let m = place_model(&ev.elements, &st, h, &Perturbation::NOMINAL);
            let rho = m.value(PositionQuantity::SeparationSolarRadii);
            proptest::prop_assert!(rho.is_finite() && rho > 0.0 && rho < 1.5);
            let pa = m.value(PositionQuantity::PositionAngleDeg);
            proptest::prop_assert!((0.0..360.0).contains(&pa));
            let arcsec = m.value(PositionQuantity::SeparationArcsec);
            proptest::prop_assert!((arcsec - rho * m.sun_radius_arcsec).abs() < 1e-9);
            let e = 1e-6;
            let at = |k: f64| {
                let p = Perturbation { length_scale: 1.0 + k, ..Perturbation::NOMINAL };
                place_model(&ev.elements, &st, h, &p).separation_solar_radii
            };
            let numeric = (at(e) - at(-e)) / (2.0 * e);
            let analytic = m.separation_partials.per_scale;
            proptest::prop_assert!(
                (analytic - numeric).abs() <= 2e-4 * analytic.abs().max(numeric.abs()).max(1e-3),
                "{} against {}", analytic, numeric
            );
        }
    }
}
