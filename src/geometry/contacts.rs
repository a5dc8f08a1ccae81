//! Contact times of a transit for a station (or the Earth's centre) from the elements, with the
//! Sun's altitude and azimuth, the position angle of the contact point and the sensitivity of
//! the contact time to the solar parallax; and the same contacts from the full model, for
//! checking.
//!
//! References: W. Chauvenet, *A Manual of Spherical and Practical Astronomy* (1863), vol. I,
//! sections on the prediction of eclipses and transits for a given place (the iteration on the
//! quadratic in the time correction); *Explanatory Supplement to the Astronomical Almanac*
//! (1992), section 8.3 (local circumstances).

use crate::geometry::besselian::{earth_radii_per_au, length_scale_rate_per_arcsec, Elements};
use crate::geometry::station::GeocentricStation;
use crate::sky::ephemeris::{geocentric_state, semidiameters_rad, Planet};
use crate::sky::vector::{angle_between, dot, norm, scale, sub, V3};
use crate::time::scales::{TimeModel, Tt};
use serde::Serialize;

/// The four contacts.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
pub enum Contact {
    /// Exterior ingress (contact I).
    I = 1,
    /// Interior ingress (contact II).
    II = 2,
    /// Interior egress (contact III).
    III = 3,
    /// Exterior egress (contact IV).
    IV = 4,
}

impl Contact {
    /// All four, in order.
    pub const ALL: [Contact; 4] = [Contact::I, Contact::II, Contact::III, Contact::IV];

    /// 1 to 4.
    pub fn number(self) -> u8 {
        self as u8
    }

    /// Roman numeral.
    pub fn roman(self) -> &'static str {
        match self {
            Contact::I => "I",
            Contact::II => "II",
            Contact::III => "III",
            Contact::IV => "IV",
        }
    }

    /// Exterior contacts (I, IV) lie on the cone of the sum of the radii.
    pub fn is_exterior(self) -> bool {
        matches!(self, Contact::I | Contact::IV)
    }

    /// Ingress contacts (I, II) are the earlier root.
    pub fn is_ingress(self) -> bool {
        matches!(self, Contact::I | Contact::II)
    }

    /// Index 0..3.
    pub fn index(self) -> usize {
        self as usize - 1
    }

    /// Parse `1`..`4`, `I`..`IV` or `C1`..`C4`, any case.
    pub fn parse(text: &str) -> Option<Contact> {
        let t = text.trim().to_ascii_uppercase();
        let t = t.strip_prefix('C').unwrap_or(&t);
        match t {
            "1" | "I" => Some(Contact::I),
            "2" | "II" => Some(Contact::II),
            "3" | "III" => Some(Contact::III),
            "4" | "IV" => Some(Contact::IV),
            _ => None,
        }
    }
}

/// Changes to the elements that the reduction fits: the scale of every element length for a
/// trial parallax, s = sin(pi_0)/sin(pi), and corrections (Earth radii at the nominal scale,
/// multiplied by s like the elements) to x, y and to the cone radii l1 (exterior) and l2
/// (interior).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Perturbation {
    /// s = sin(pi_0) / sin(pi).
    pub length_scale: f64,
    /// Correction to x, Earth radii.
    pub dx_er: f64,
    /// Correction to y, Earth radii.
    pub dy_er: f64,
    /// Correction to l1 (exterior contacts), Earth radii.
    pub dl_ext_er: f64,
    /// Correction to l2 (interior contacts), Earth radii.
    pub dl_int_er: f64,
}

impl Perturbation {
    /// No change: the nominal AU and the elements as computed.
    pub const NOMINAL: Perturbation = Perturbation {
        length_scale: 1.0,
        dx_er: 0.0,
        dy_er: 0.0,
        dl_ext_er: 0.0,
        dl_int_er: 0.0,
    };

    /// Only a change of scale.
    pub fn scale(length_scale: f64) -> Perturbation {
        Perturbation {
            length_scale,
            ..Perturbation::NOMINAL
        }
    }
}

/// Partial derivatives of a contact time, hours per unit of each parameter of
/// [`Perturbation`] (s, dx, dy, dl), at a solved contact.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ContactPartials {
    /// d t / d s.
    pub per_scale_h: f64,
    /// d t / d(dx), hours per Earth radius.
    pub per_dx_h: f64,
    /// d t / d(dy), hours per Earth radius.
    pub per_dy_h: f64,
    /// d t / d(dl) of this contact's cone, hours per Earth radius.
    pub per_dl_h: f64,
    /// d t / d(station's east longitude), hours per radian: a change of longitude turns the
    /// station about the Earth's axis as a change of the axis's hour angle mu would.
    pub per_longitude_h: f64,
}

/// The quantities of one station that the contact equation needs at one instant.
#[derive(Clone, Copy, Debug)]
pub(crate) struct LocalGeometry {
    pub(crate) u: f64,
    pub(crate) v: f64,
    pub(crate) u_rate: f64,
    pub(crate) v_rate: f64,
    pub(crate) radius: f64,
    pub(crate) radius_rate: f64,
    pub(crate) x: f64,
    pub(crate) y: f64,
    pub(crate) l: f64,
    pub(crate) mu: f64,
    pub(crate) scale: f64,
    /// d(xi, eta, zeta)/d(east longitude), Earth radii per radian.
    pub(crate) pos_per_longitude: [f64; 3],
    pub(crate) tan_f: f64,
}

/// Station coordinates on the fundamental plane (xi, eta, zeta) and their rates per hour.
///
/// References: Explanatory Supplement (1992), eq. 8.331 and the rates that follow.
#[inline]
fn station_on_plane(
    st: Option<&GeocentricStation>,
    d: (f64, f64),
    mu: (f64, f64),
) -> ([f64; 3], [f64; 3], [f64; 3]) {
    let Some(st) = st else {
        return ([0.0; 3], [0.0; 3], [0.0; 3]);
    };
    let theta = mu.0 + st.longitude_rad;
    let (s_th, c_th) = theta.sin_cos();
    let (s_d, c_d) = d.0.sin_cos();
    let xi = st.rho_cos_phi * s_th;
    let eta = st.rho_sin_phi * c_d - st.rho_cos_phi * s_d * c_th;
    let zeta = st.rho_sin_phi * s_d + st.rho_cos_phi * c_d * c_th;
    let xi_rate = mu.1 * st.rho_cos_phi * c_th;
    let eta_rate = mu.1 * xi * s_d - d.1 * zeta;
    let zeta_rate = d.1 * eta - mu.1 * xi * c_d;
    // The longitude enters only through theta = mu + longitude: the mu terms of the rates.
    let per_longitude = [st.rho_cos_phi * c_th, xi * s_d, -xi * c_d];
    (
        [xi, eta, zeta],
        [xi_rate, eta_rate, zeta_rate],
        per_longitude,
    )
}

#[inline]
pub(crate) fn local_geometry(
    el: &Elements,
    st: Option<&GeocentricStation>,
    contact: Contact,
    hours: f64,
    p: &Perturbation,
) -> LocalGeometry {
    let e = el.at_cone(hours, contact.is_exterior());
    let (pos, rate, pos_per_longitude) = station_on_plane(st, e.d, e.mu);
    let (l, tan_f) = (e.l, e.tan_f);
    let s = p.length_scale;
    let x = e.x.0 + p.dx_er;
    let y = e.y.0 + p.dy_er;
    let l0 = l.0
        + if contact.is_exterior() {
            p.dl_ext_er
        } else {
            p.dl_int_er
        };
    LocalGeometry {
        u: s * x - pos[0],
        v: s * y - pos[1],
        u_rate: s * e.x.1 - rate[0],
        v_rate: s * e.y.1 - rate[1],
        radius: s * l0 - pos[2] * tan_f,
        radius_rate: s * l.1 - rate[2] * tan_f,
        x,
        y,
        l: l0,
        mu: e.mu.0,
        scale: s,
        pos_per_longitude,
        tan_f,
    }
}

/// Solve one contact for a station (or the Earth's centre when `st` is `None`).
///
/// Arguments: `el`, the event's elements; `st`, the station; `contact`; `start_hours`, a first
/// guess (hours from the elements' epoch); `p`, the trial parallax and corrections
/// ([`Perturbation::NOMINAL`] for the prediction).
/// Returns: hours from the epoch, or `None` when the station sees no such contact (the
/// planet's path misses the cone) or it falls outside the fitted interval.
/// Notes: each step solves the quadratic for the time at which the distance from the axis
/// equals the cone's radius, the motion taken as linear (Chauvenet's iteration); it converges
/// to better than a microsecond in three or four steps.
pub fn solve_contact_hours(
    el: &Elements,
    st: Option<&GeocentricStation>,
    contact: Contact,
    start_hours: f64,
    p: &Perturbation,
) -> Option<f64> {
    solve_with_geometry(el, st, contact, start_hours, p).map(|(t, _)| t)
}

/// As [`solve_contact_hours`], also returning the geometry of the last step (taken less than
/// 0.4 ms before the solution, so that the circumstances need no further evaluation).
fn solve_with_geometry(
    el: &Elements,
    st: Option<&GeocentricStation>,
    contact: Contact,
    start_hours: f64,
    p: &Perturbation,
) -> Option<(f64, LocalGeometry)> {
    let mut t = start_hours;
    let mut grazing_steps = 0;
    for _ in 0..12 {
        let g = local_geometry(el, st, contact, t, p);
        let n2 = g.u_rate * g.u_rate + g.v_rate * g.v_rate;
        if n2 <= 0.0 {
            return None;
        }
        let b = g.u * g.u_rate + g.v * g.v_rate - g.radius * g.radius_rate;
        let c = g.u * g.u + g.v * g.v - g.radius * g.radius;
        let a = n2 - g.radius_rate * g.radius_rate;
        let disc = b * b - a * c;
        let step = if disc < 0.0 {
            // The linear path misses the cone here: move to the closest approach and retry.
            grazing_steps += 1;
            if grazing_steps > 3 {
                return None;
            }
            -b / a
        } else if contact.is_ingress() {
            (-b - disc.sqrt()) / a
        } else {
            (-b + disc.sqrt()) / a
        };
        t += step;
        if !el.covers(t) || !t.is_finite() {
            return None;
        }
        // Convergence is quadratic: after a step under 1e-7 h (0.4 ms) the remaining error
        // is below a nanosecond.
        if step.abs() < 1e-7 {
            return Some((t, g));
        }
    }
    None
}

/// Solve a contact and its circumstances at once (the prediction's fast path): the
/// circumstances use the geometry of the solver's last step, under 0.4 ms before the contact
/// (the planet moves 0.00003" in that time).
pub fn solve_with_circumstances(
    el: &Elements,
    st: Option<&GeocentricStation>,
    contact: Contact,
    start_hours: f64,
) -> Option<ContactCircumstances> {
    let (t, g) = solve_with_geometry(el, st, contact, start_hours, &Perturbation::NOMINAL)?;
    Some(circumstances_from(el, st, contact, t, &g))
}

/// Partial derivatives of a solved contact time with respect to the parameters of
/// [`Perturbation`] and to the station's longitude, by implicit differentiation of the contact
/// condition F = (s (x + dx) - xi)^2 + (s (y + dy) - eta)^2 - (s (l + dl) - zeta tan f)^2 = 0
/// (Chauvenet 1863, vol. I; the station's coordinates as in the Explanatory Supplement 1992,
/// eq. 8.331, whose longitude enters through the local hour angle mu + longitude).
pub fn contact_partials(
    el: &Elements,
    st: Option<&GeocentricStation>,
    contact: Contact,
    hours: f64,
    p: &Perturbation,
) -> ContactPartials {
    let g = local_geometry(el, st, contact, hours, p);
    let df_dt = g.u * g.u_rate + g.v * g.v_rate - g.radius * g.radius_rate;
    ContactPartials {
        per_scale_h: -(g.u * g.x + g.v * g.y - g.radius * g.l) / df_dt,
        per_dx_h: -(g.u * g.scale) / df_dt,
        per_dy_h: -(g.v * g.scale) / df_dt,
        per_dl_h: (g.radius * g.scale) / df_dt,
        per_longitude_h: (g.u * g.pos_per_longitude[0] + g.v * g.pos_per_longitude[1]
            - g.radius * g.tan_f * g.pos_per_longitude[2])
            / df_dt,
    }
}

/// The planet's offset from the Sun's centre as seen from a station, in Earth radii on the
/// fundamental plane (u, v): multiply by the angular scale for arcseconds.
pub fn offset_on_plane(
    el: &Elements,
    st: Option<&GeocentricStation>,
    hours: f64,
    p: &Perturbation,
) -> (f64, f64) {
    let g = local_geometry(el, st, Contact::II, hours, p);
    (g.u, g.v)
}

/// Sensitivity of a contact time to the solar parallax, seconds per arcsecond, at a solved
/// contact: implicit differentiation of F(t, s) = (s x - xi)^2 + (s y - eta)^2 - (s l - zeta
/// tan f)^2 = 0 with respect to the length scale s = sin(pi_0)/sin(pi) (docs/method.md,
/// section 6). Exact for the fitted elements; tests check it against central differences of
/// the full model.
fn sensitivity_from_geometry(g: &LocalGeometry) -> f64 {
    let df_ds = g.u * g.x + g.v * g.y - g.radius * g.l;
    let df_dt = g.u * g.u_rate + g.v * g.v_rate - g.radius * g.radius_rate;
    let dt_ds_h = -df_ds / df_dt;
    dt_ds_h * 3600.0 * length_scale_rate_per_arcsec()
}

/// A station's circumstances at one contact.
#[derive(Clone, Copy, Debug, PartialEq, Serialize)]
pub struct ContactCircumstances {
    /// Which contact.
    pub contact: Contact,
    /// Hours from the elements' epoch.
    pub hours: f64,
    /// True (unrefracted) altitude of the Sun's centre, degrees.
    pub sun_altitude_deg: f64,
    /// Azimuth of the Sun, degrees from north through east.
    pub sun_azimuth_deg: f64,
    /// Position angle of the contact point on the Sun's limb, degrees from the north point
    /// of the disc through east.
    pub position_angle_deg: f64,
    /// The same measured from the Sun's zenith point (the vertex), degrees.
    pub vertex_angle_deg: f64,
    /// d(contact time)/d(solar parallax), seconds per arcsecond.
    pub sensitivity_s_per_arcsec: f64,
}

/// Circumstances of a solved contact.
pub fn circumstances(
    el: &Elements,
    st: Option<&GeocentricStation>,
    contact: Contact,
    hours: f64,
) -> ContactCircumstances {
    let g = local_geometry(el, st, contact, hours, &Perturbation::NOMINAL);
    circumstances_from(el, st, contact, hours, &g)
}

fn circumstances_from(
    el: &Elements,
    st: Option<&GeocentricStation>,
    contact: Contact,
    hours: f64,
    g: &LocalGeometry,
) -> ContactCircumstances {
    let sky = sky_at(el, st, hours, g.mu, g.u.atan2(g.v));
    ContactCircumstances {
        contact,
        hours,
        sun_altitude_deg: sky.sun_altitude_deg,
        sun_azimuth_deg: sky.sun_azimuth_deg,
        position_angle_deg: sky.position_angle_deg,
        vertex_angle_deg: (sky.position_angle_deg - sky.parallactic_angle_deg).rem_euclid(360.0),
        sensitivity_s_per_arcsec: sensitivity_from_geometry(g),
    }
}

/// What a station sees in the sky at one instant.
pub(crate) struct Sky {
    pub(crate) sun_altitude_deg: f64,
    pub(crate) sun_azimuth_deg: f64,
    pub(crate) parallactic_angle_deg: f64,
    pub(crate) position_angle_deg: f64,
}

/// The Sun's true altitude and azimuth against the geodetic horizon (no refraction; NaN for the
/// Earth's centre), its parallactic angle, and the position angle of the planet's centre from
/// the north point of the Sun's disc through east. `mu` is the axis' Greenwich hour angle
/// (GAST = mu + a); `plane_angle_rad` is atan2(u, v) on the fundamental plane, whose north
/// follows the planet-Sun axis (up to half a degree from the Sun for Mercury): the position
/// angle is referred to the Sun's own north by adding the convergence of the meridians,
/// (alpha_sun - a) sin(d) (spherical trigonometry, first order in the small offset).
pub(crate) fn sky_at(
    el: &Elements,
    st: Option<&GeocentricStation>,
    hours: f64,
    mu: f64,
    plane_angle_rad: f64,
) -> Sky {
    let axis_ra = el.axis_ra_rad(hours);
    let lst = mu + axis_ra + st.map_or(0.0, |s| s.longitude_rad);
    let (sl, cl) = lst.sin_cos();
    let r: V3 = match st {
        Some(s) => [s.rho_cos_phi * cl, s.rho_cos_phi * sl, s.rho_sin_phi],
        None => [0.0; 3],
    };
    let sun = sub(el.sun_earth_radii(hours), r);
    let sun = scale(1.0 / norm(sun), sun);
    let ra = sun[1].atan2(sun[0]);
    let dec = sun[2].asin();
    let (sd, cd) = dec.sin_cos();
    let d_ra = (ra - axis_ra + std::f64::consts::PI).rem_euclid(std::f64::consts::TAU)
        - std::f64::consts::PI;
    let pa = (plane_angle_rad + d_ra * sd).to_degrees().rem_euclid(360.0);
    let Some(s) = st else {
        return Sky {
            sun_altitude_deg: f64::NAN,
            sun_azimuth_deg: f64::NAN,
            parallactic_angle_deg: 0.0,
            position_angle_deg: pa,
        };
    };
    let (sp, cp) = s.latitude_rad.sin_cos();
    let up = [cp * cl, cp * sl, sp];
    let north = [-sp * cl, -sp * sl, cp];
    let east = [-sl, cl, 0.0];
    let alt = dot(up, sun).clamp(-1.0, 1.0).asin().to_degrees();
    let az = dot(east, sun)
        .atan2(dot(north, sun))
        .to_degrees()
        .rem_euclid(360.0);
    // Parallactic angle: q = atan2(sin H, tan(phi) cos(dec) - sin(dec) cos(H)).
    let h = lst - ra;
    let q = h.sin().atan2(sp / cp * cd - sd * h.cos());
    Sky {
        sun_altitude_deg: alt,
        sun_azimuth_deg: az,
        parallactic_angle_deg: q.to_degrees(),
        position_angle_deg: pa,
    }
}

/// Where the planet's centre stands on the Sun's disc as seen from a station at one instant,
/// at nominal parameters.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DiscPlace {
    /// Position angle of the planet's centre from the Sun's north point through east, degrees.
    pub position_angle_deg: f64,
    /// Distance of the planet's centre from the Sun's centre, in the Sun's apparent radius.
    pub separation_sun_radii: f64,
    /// The planet's apparent radius, in the Sun's.
    pub planet_radius_sun_radii: f64,
}

/// The planet's place on the Sun's disc seen from a station (or the Earth's centre) at
/// `hours`: the offset (u, v) on the fundamental plane against the radii of the exterior and
/// interior cones there (their mean is the Sun's radius, their half difference the planet's),
/// and the position angle as in [`ContactCircumstances::position_angle_deg`].
///
/// References: Chauvenet (1863), vol. I, the chapter on transits (the cones of contact);
/// the sky-plane form of docs/method.md.
pub fn disc_place(el: &Elements, st: Option<&GeocentricStation>, hours: f64) -> DiscPlace {
    let exterior = local_geometry(el, st, Contact::I, hours, &Perturbation::NOMINAL);
    let interior = local_geometry(el, st, Contact::II, hours, &Perturbation::NOMINAL);
    let sun_radius = 0.5 * (exterior.radius + interior.radius);
    let sky = sky_at(el, st, hours, exterior.mu, exterior.u.atan2(exterior.v));
    DiscPlace {
        position_angle_deg: sky.position_angle_deg,
        separation_sun_radii: exterior.u.hypot(exterior.v) / sun_radius,
        planet_radius_sun_radii: 0.5 * (exterior.radius - interior.radius) / sun_radius,
    }
}

/// The Sun's true altitude and azimuth (degrees) and parallactic angle (degrees) at a station.
///
/// Notes: the topocentric vector of the Sun (solar parallax included) against the geodetic
/// horizon; no refraction.
pub fn sun_alt_az_parallactic(
    el: &Elements,
    st: &GeocentricStation,
    hours: f64,
) -> (f64, f64, f64) {
    let sky = sky_at(el, Some(st), hours, el.at(hours).mu.0, 0.0);
    (
        sky.sun_altitude_deg,
        sky.sun_azimuth_deg,
        sky.parallactic_angle_deg,
    )
}

/// A contact computed directly from the full model (no elements), for checks and for refining.
///
/// Arguments: `planet`; `station` (Earth radii, as from [`crate::geometry::station::Station::geocentric`]);
/// `contact`; `start`, a first guess within a few minutes; `time_model`; `parallax_arcsec`, the
/// solar parallax that fixes the station's distance in au.
/// Returns: the contact instant, or `None` if the secant iteration fails.
/// References: the contact condition of method-notes (apparent separation of centres equals
/// s_sun +- s_p, with s = asin(R / d) from the topocentric distances).
pub fn full_model_contact(
    planet: Planet,
    station: Option<&GeocentricStation>,
    contact: Contact,
    start: Tt,
    time_model: &TimeModel,
    parallax_arcsec: f64,
) -> Option<Tt> {
    let station_au_scale =
        1.0 / earth_radii_per_au() / crate::geometry::besselian::length_scale(parallax_arcsec);
    let f = |t: Tt| -> f64 {
        let s = geocentric_state(planet, t, time_model);
        let r: V3 = match station {
            Some(st) => {
                let lst = s.gast_rad + st.longitude_rad;
                scale(
                    station_au_scale,
                    [
                        st.rho_cos_phi * lst.cos(),
                        st.rho_cos_phi * lst.sin(),
                        st.rho_sin_phi,
                    ],
                )
            }
            None => [0.0; 3],
        };
        let sun = sub(s.sun_au, r);
        let pl = sub(s.planet_au, r);
        let (ss, sp) = semidiameters_rad(planet, sun, pl);
        let limit = if contact.is_exterior() {
            ss + sp
        } else {
            ss - sp
        };
        angle_between(sun, pl) - limit
    };
    let mut t0 = start.add_seconds(-5.0);
    let mut t1 = start.add_seconds(5.0);
    let mut f0 = f(t0);
    let mut f1 = f(t1);
    for _ in 0..30 {
        if f1 == f0 {
            break;
        }
        let step = -f1 * t1.seconds_since(t0) / (f1 - f0);
        let t2 = t1.add_seconds(step);
        t0 = t1;
        f0 = f1;
        t1 = t2;
        f1 = f(t1);
        // VSOP87 takes a one-part Julian date, which resolves about 40 microseconds.
        if step.abs() < 1e-4 {
            return Some(t1);
        }
    }
    None
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn contact_labels_parse() {
        assert_eq!(Contact::parse("iii"), Some(Contact::III));
        assert_eq!(Contact::parse("C4"), Some(Contact::IV));
        assert_eq!(Contact::parse(" 2 "), Some(Contact::II));
        assert_eq!(Contact::parse("V"), None);
        assert_eq!(Contact::parse(""), None);
    }
}
