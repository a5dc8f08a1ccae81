//! The condition equations: one per timing, O - C (s) = sum_j (dt/dp_j) dp_j.
//!
//! The computed time C and the partial derivatives come from the event's elements (implicit
//! differentiation of the contact condition; `geometry::contacts::contact_partials`). The
//! classic global parameters are the solar parallax, the planet's offset from its predicted
//! place relative to the Sun (east and north) and corrections to the sum of the radii (for
//! contacts I and IV) and to their difference (II and III), all in arcseconds. A trial
//! parallax rescales every element by s = sin(pi_0)/sin(pi).
//!
//! References: J. F. Encke, *Die Entfernung der Sonne von der Erde aus dem Venusdurchgange von
//! 1761* (1822) and *... von 1769* (1824); S. Newcomb, *Astronomical Papers of the American
//! Ephemeris* II (1891); W. Chauvenet, *A Manual of Spherical and Practical Astronomy* (1863),
//! vol. I (the contact condition on the fundamental plane).

use super::parameters::{
    ParameterKind, ParameterSet, N_CLASSIC, OFFSET_EAST, OFFSET_NORTH, PARALLAX, RADIUS_DIFFERENCE,
    RADIUS_SUM,
};
use crate::geometry::contacts::{contact_partials, Contact, Perturbation};
use crate::geometry::station::GeocentricStation;
use crate::geometry::transit::TransitEvent;
use crate::observations::timings::Observation;
use crate::sky::constants::{nominal_parallax_arcsec, ARCSEC_RAD};

/// A timing ready for the condition equations.
#[derive(Clone, Debug)]
pub struct Timing {
    /// The row as read.
    pub obs: Observation,
    /// Its station's geocentric coordinates.
    pub geo: GeocentricStation,
    /// The observed instant, hours (TT) from the elements' epoch.
    pub observed_h: f64,
    /// Its station's index in the campaign (order of first appearance).
    pub station: usize,
}

/// One linearised condition equation.
#[derive(Clone, Debug, PartialEq)]
pub struct Linearised {
    /// The computed contact time, hours from the elements' epoch.
    pub computed_h: f64,
    /// Partials of the contact time (s) with respect to the classic global parameters (per
    /// arcsec).
    pub global: [f64; N_CLASSIC],
    /// Partials with respect to the timing's own station's parameters, in the order of
    /// [`ParameterSet::station_parameters`].
    pub local: Vec<f64>,
}

/// The classic parameters' values as changes to the elements.
///
/// Arguments: `theta`, at least the five classic parameters (arcsec); `er_per_arcsec`, Earth
/// radii on the fundamental plane per arcsec at the event.
pub fn perturbation(theta: &[f64], er_per_arcsec: f64) -> Perturbation {
    let pi0 = nominal_parallax_arcsec() * ARCSEC_RAD;
    Perturbation {
        length_scale: pi0.sin() / (theta[PARALLAX] * ARCSEC_RAD).sin(),
        dx_er: theta[OFFSET_EAST] * er_per_arcsec,
        dy_er: theta[OFFSET_NORTH] * er_per_arcsec,
        dl_ext_er: theta[RADIUS_SUM] * er_per_arcsec,
        dl_int_er: theta[RADIUS_DIFFERENCE] * er_per_arcsec,
    }
}

/// A contact's computed time (hours from the elements' epoch) and its condition-equation row:
/// the partial derivatives of the contact time (seconds) with respect to the classic
/// parameters (per arcsecond), at parameter values `theta`. `None` when the station sees no
/// such contact under those values.
pub fn condition_row(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
    theta: &[f64],
) -> Option<(f64, [f64; N_CLASSIC])> {
    condition_row_with(event, geo, contact, theta, event.earth_radii_per_arcsec())
}

/// As [`condition_row`], with the event's Earth radii per arcsec given.
pub fn condition_row_with(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
    theta: &[f64],
    er: f64,
) -> Option<(f64, [f64; N_CLASSIC])> {
    let p = perturbation(theta, er);
    let h = event.contact_hours_perturbed(geo, contact, &p)?;
    let d = contact_partials(&event.elements, Some(geo), contact, h, &p);
    let pi = theta[PARALLAX] * ARCSEC_RAD;
    let ds_dpi = -(nominal_parallax_arcsec() * ARCSEC_RAD).sin() * pi.cos() / (pi.sin() * pi.sin())
        * ARCSEC_RAD;
    let ext = contact.is_exterior();
    Some((
        h,
        [
            d.per_scale_h * ds_dpi * 3600.0,
            d.per_dx_h * er * 3600.0,
            d.per_dy_h * er * 3600.0,
            if ext { d.per_dl_h * er * 3600.0 } else { 0.0 },
            if ext { 0.0 } else { d.per_dl_h * er * 3600.0 },
        ],
    ))
}

/// Linearise one timing's condition equation at parameter values `theta` (every parameter of
/// `params`, the classic ones first). A station clock's offset c adds c to the computed time
/// (partial 1 s per s).
pub fn linearise(
    event: &TransitEvent,
    t: &Timing,
    params: &ParameterSet,
    theta: &[f64],
    er: f64,
) -> Option<Linearised> {
    let own = params.station_parameters(t.station);
    let longitude = own
        .iter()
        .find(|&&j| params.specs()[j].kind == ParameterKind::LongitudeCorrection)
        .map(|&j| theta[j]);
    let moved = longitude.map(|d| moved_station(t, d));
    let geo = moved.as_ref().unwrap_or(&t.geo);
    let (mut computed_h, global) = condition_row_with(event, geo, t.obs.contact, theta, er)?;
    // A clock read in local solar time at a longitude further east gives an earlier UT1.
    let local_s_per_deg = if t.obs.local.is_some() { 240.0 } else { 0.0 };
    let mut local = Vec::with_capacity(own.len());
    for &j in own {
        match params.specs()[j].kind {
            ParameterKind::ClockOffset => {
                computed_h += theta[j] / 3600.0;
                local.push(1.0);
            }
            ParameterKind::LongitudeCorrection => {
                computed_h += theta[j] * local_s_per_deg / 3600.0;
                let rate = longitude_rate_s_per_deg(event, t, (theta, theta[j]), er)?;
                local.push(rate + local_s_per_deg);
            }
            ParameterKind::Classic(_) => local.push(0.0),
        }
    }
    Some(Linearised {
        computed_h,
        global,
        local,
    })
}

/// The timing's station with its longitude corrected by `correction_deg`.
fn moved_station(t: &Timing, correction_deg: f64) -> GeocentricStation {
    let mut st = t.obs.station.clone();
    st.longitude_deg += correction_deg;
    st.geocentric()
}

/// The change of the computed contact time per degree of longitude (seconds), by a central
/// difference of 0.01 degree about the current correction (the contact time is smooth in the
/// station's position; the step's truncation error is far below a millisecond per degree).
fn longitude_rate_s_per_deg(
    event: &TransitEvent,
    t: &Timing,
    (theta, correction_deg): (&[f64], f64),
    er: f64,
) -> Option<f64> {
    const STEP_DEG: f64 = 0.01;
    let p = perturbation(theta, er);
    let at = |d: f64| event.contact_hours_perturbed(&moved_station(t, d), t.obs.contact, &p);
    Some(
        (at(correction_deg + STEP_DEG)? - at(correction_deg - STEP_DEG)?) * 3600.0
            / (2.0 * STEP_DEG),
    )
}

/// O - C of one timing in seconds at parameter values `theta`, or `None` when the station
/// sees no such contact.
pub fn residual_s(
    event: &TransitEvent,
    t: &Timing,
    params: &ParameterSet,
    theta: &[f64],
    er: f64,
) -> Option<f64> {
    linearise(event, t, params, theta, er).map(|l| (t.observed_h - l.computed_h) * 3600.0)
}

/// The nominal parameter values (IAU parallax, no corrections).
pub fn nominal_theta() -> [f64; N_CLASSIC] {
    [nominal_parallax_arcsec(), 0.0, 0.0, 0.0, 0.0]
}
