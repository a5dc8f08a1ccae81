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

use super::black_drop::lag_partial;
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
    /// The observed instant, hours (TT) from the elements' epoch; for a timed interval, the
    /// interval in hours (of UT: an interval of apparent time is corrected for the change of
    /// the equation of time).
    pub observed_h: f64,
    /// Its station's index in the campaign (order of first appearance).
    pub station: usize,
}

impl Timing {
    /// Whether the timing is an interval between two contacts (else an instant).
    pub fn is_interval(&self) -> bool {
        self.obs.duration.is_some()
    }
}

/// One linearised condition equation.
#[derive(Clone, Debug, PartialEq)]
pub struct Linearised {
    /// The computed contact time (or interval), hours from the elements' epoch.
    pub computed_h: f64,
    /// Partials of the contact time (s) with respect to the classic global parameters (per
    /// arcsec).
    pub global: [f64; N_CLASSIC],
    /// Partials with respect to the global parameters after the classic five, in order
    /// (black-drop lags: s per s); empty where there are none.
    pub extra: Vec<f64>,
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
    condition_row_and_longitude(event, geo, contact, theta, er).map(|(h, row, _)| (h, row))
}

/// As [`condition_row_with`], with the partial derivative of the contact time with respect
/// to the station's east longitude too (seconds per degree).
fn condition_row_and_longitude(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
    theta: &[f64],
    er: f64,
) -> Option<(f64, [f64; N_CLASSIC], f64)> {
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
        d.per_longitude_h * 3600.0 * std::f64::consts::PI / 180.0,
    ))
}

/// A contact's computed time and condition-equation row in Delisle's form: the parallax as at
/// the station, the planet's offsets and the radius corrections as the shift they give the
/// geocentric contact, the same at every station (the time at the station with no such
/// correction, plus the geocentric contact's change). The geocentric contact does not depend
/// on the parallax, which only rescales the fundamental plane.
///
/// References: J.-N. Delisle's comparison of one contact's absolute times between stations
/// (1753 memoir; as condition equations in W. Chauvenet, *A Manual of Spherical and Practical
/// Astronomy*, 1863, vol. I, cited from memory of its treatment).
fn geocentric_nuisance_row(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
    theta: &[f64],
    er: f64,
) -> Option<(f64, [f64; N_CLASSIC])> {
    let parallax_only = [theta[PARALLAX], 0.0, 0.0, 0.0, 0.0];
    let (h_station, row, _) = condition_row_and_longitude(event, geo, contact, &parallax_only, er)?;
    let p = perturbation(theta, er);
    let p0 = perturbation(&parallax_only, er);
    let h_geo = event.contact_hours_perturbed_geocentric(contact, &p)?;
    let h_geo0 = event.contact_hours_perturbed_geocentric(contact, &p0)?;
    let d = contact_partials(&event.elements, None, contact, h_geo, &p);
    let ext = contact.is_exterior();
    let dl = d.per_dl_h * er * 3600.0;
    Some((
        h_station + h_geo - h_geo0,
        [
            row[PARALLAX],
            d.per_dx_h * er * 3600.0,
            d.per_dy_h * er * 3600.0,
            if ext { dl } else { 0.0 },
            if ext { 0.0 } else { dl },
        ],
    ))
}

/// A timing's contact time and row in the parameter set's form: with each station's own
/// partials, or Delisle's (nuisance at the geocentre, no longitude partial).
fn row_in_form(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
    (params, theta): (&ParameterSet, &[f64]),
    er: f64,
) -> Option<(f64, [f64; N_CLASSIC], f64)> {
    if params.nuisance_at_geocentre() {
        geocentric_nuisance_row(event, geo, contact, theta, er).map(|(h, row)| (h, row, 0.0))
    } else {
        condition_row_and_longitude(event, geo, contact, theta, er)
    }
}

/// A timing's station as the parameters place it (moved by its longitude correction, where
/// it has one), and the time that the correction adds to the computed contact (hours: a clock
/// read in local solar time at a longitude further east gives an earlier UT1) plus the
/// station clock's offset.
fn placed(t: &Timing, params: &ParameterSet, theta: &[f64]) -> (Option<GeocentricStation>, f64) {
    let mut moved = None;
    let mut shift_h = 0.0;
    for &j in params.station_parameters(t.station) {
        match params.specs()[j].kind {
            ParameterKind::ClockOffset => shift_h += theta[j] / 3600.0,
            ParameterKind::LongitudeCorrection => {
                moved = Some(moved_station(t, theta[j]));
                shift_h += theta[j] * local_s_per_deg(t) / 3600.0;
            }
            ParameterKind::Classic(_) | ParameterKind::BlackDrop(..) => {}
        }
    }
    (moved, shift_h)
}

/// Seconds a one-degree longitude correction adds to a timing through its conversion from
/// local solar time: 240 for a reading on the station's own meridian, 0 otherwise (a time
/// kept to another meridian, a UTC time, or an interval, in which it cancels).
fn local_s_per_deg(t: &Timing) -> f64 {
    match &t.obs.local {
        Some(l) if l.follows_station() && !t.is_interval() => LOCAL_S_PER_DEG,
        _ => 0.0,
    }
}

/// The time (s) the global parameters beyond the classic five add to a timing's computed
/// value (the black-drop lags), and their partials.
fn extra_globals(t: &Timing, params: &ParameterSet, theta: &[f64]) -> (f64, Vec<f64>) {
    let partials: Vec<f64> = params.specs()[N_CLASSIC..params.n_global()]
        .iter()
        .map(|spec| match spec.kind {
            ParameterKind::BlackDrop(judged, contact) => lag_partial(&t.obs, judged, contact),
            _ => 0.0,
        })
        .collect();
    let shift = partials
        .iter()
        .zip(&theta[N_CLASSIC..])
        .map(|(p, v)| p * v)
        .sum();
    (shift, partials)
}

/// Seconds of local solar time per degree of longitude.
const LOCAL_S_PER_DEG: f64 = 240.0;

/// Linearise one timing's condition equation at parameter values `theta` (every parameter of
/// `params`, the classic ones first). A station clock's offset c adds c to the computed time
/// (partial 1 s per s); a longitude correction moves the station (its partial from the
/// contact condition, [`contact_partials`]) and, for a reading in local solar time on the
/// station's meridian, the conversion to UT1 (240 s per degree); a black-drop lag adds itself
/// to the timings of its judgement and contact. A timed interval is the difference of its two
/// contacts: clock offsets and the local-time conversion cancel in it.
pub fn linearise(
    event: &TransitEvent,
    t: &Timing,
    params: &ParameterSet,
    theta: &[f64],
    er: f64,
) -> Option<Linearised> {
    let own = params.station_parameters(t.station);
    let (moved, shift_h) = placed(t, params, theta);
    let geo = moved.as_ref().unwrap_or(&t.geo);
    let (h, classic, per_deg) = row_in_form(event, geo, t.obs.contact, (params, theta), er)?;
    let (computed_h, classic, per_deg, clock) = match t.obs.duration {
        None => (h + shift_h, classic, per_deg + local_s_per_deg(t), 1.0),
        Some(d) => {
            let (h0, c0, d0) = row_in_form(event, geo, d.first, (params, theta), er)?;
            let mut diff = classic;
            for (x, y) in diff.iter_mut().zip(c0) {
                *x -= y;
            }
            (h - h0, diff, per_deg - d0, 0.0)
        }
    };
    let (lag_s, extra) = extra_globals(t, params, theta);
    let local = own
        .iter()
        .map(|&j| match params.specs()[j].kind {
            ParameterKind::ClockOffset => clock,
            ParameterKind::LongitudeCorrection => per_deg,
            ParameterKind::Classic(_) | ParameterKind::BlackDrop(..) => 0.0,
        })
        .collect();
    Some(Linearised {
        computed_h: computed_h + lag_s / 3600.0,
        global: classic,
        extra,
        local,
    })
}

/// The timing's station with its longitude corrected by `correction_deg`.
fn moved_station(t: &Timing, correction_deg: f64) -> GeocentricStation {
    // The distances from the axis and the equator depend on the latitude and the elevation
    // only: a longitude correction turns the station about the axis.
    GeocentricStation {
        longitude_rad: t.geo.longitude_rad + correction_deg.to_radians(),
        ..t.geo
    }
}

/// The computed contact time of one timing (or its interval), hours from the elements' epoch,
/// at parameter values `theta` (no partial derivatives: for residuals), or `None` when the
/// station sees no such contact.
pub fn computed_hours(
    event: &TransitEvent,
    t: &Timing,
    params: &ParameterSet,
    theta: &[f64],
    er: f64,
) -> Option<f64> {
    let (moved, shift_h) = placed(t, params, theta);
    let geo = moved.as_ref().unwrap_or(&t.geo);
    let (lag_s, _) = extra_globals(t, params, theta);
    if params.nuisance_at_geocentre() {
        let at = |c| geocentric_nuisance_row(event, geo, c, theta, er).map(|x| x.0);
        let value = match t.obs.duration {
            None => at(t.obs.contact)? + shift_h,
            Some(d) => at(t.obs.contact)? - at(d.first)?,
        };
        return Some(value + lag_s / 3600.0);
    }
    let p = perturbation(theta, er);
    let h = event.contact_hours_perturbed(geo, t.obs.contact, &p)?;
    let value = match t.obs.duration {
        None => h + shift_h,
        Some(d) => h - event.contact_hours_perturbed(geo, d.first, &p)?,
    };
    Some(value + lag_s / 3600.0)
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
    computed_hours(event, t, params, theta, er).map(|h| (t.observed_h - h) * 3600.0)
}

/// The nominal parameter values (IAU parallax, no corrections).
pub fn nominal_theta() -> [f64; N_CLASSIC] {
    [nominal_parallax_arcsec(), 0.0, 0.0, 0.0, 0.0]
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::station::Station;
    use crate::planning::simulation::global_stations;
    use crate::{transit_on_date, Planet, TimeModel};

    /// The analytic longitude partial against a central difference of 0.01 degree of the
    /// solved contact (common practice for checking an analytic derivative, no source).
    #[test]
    fn longitude_partial_matches_central_differences() {
        let date = chrono::NaiveDate::from_ymd_opt(1769, 6, 3).unwrap();
        let event = transit_on_date(Planet::Venus, date, &TimeModel::default()).unwrap();
        let er = event.earth_radii_per_arcsec();
        let theta = nominal_theta();
        let p = perturbation(&theta, er);
        let mut checked = 0;
        for st in global_stations(60, "d") {
            for c in Contact::ALL {
                let geo = st.geocentric();
                let Some((_, _, per_deg)) =
                    condition_row_and_longitude(&event, &geo, c, &theta, er)
                else {
                    continue;
                };
                let at = |d: f64| {
                    let moved = Station {
                        longitude_deg: st.longitude_deg + d,
                        ..st.clone()
                    };
                    event.contact_hours_perturbed(&moved.geocentric(), c, &p)
                };
                let (Some(a), Some(b)) = (at(0.01), at(-0.01)) else {
                    continue;
                };
                let numeric = (a - b) * 3600.0 / 0.02;
                assert!(
                    (numeric - per_deg).abs() < 1e-3 * (1.0 + per_deg.abs()),
                    "{} {c:?}: {per_deg} s/deg analytic, {numeric} numeric",
                    st.name
                );
                checked += 1;
            }
        }
        assert!(checked > 100, "{checked}");
    }

    /// Every global partial of `linearise` (both forms, instants and intervals, a black-drop
    /// lag among the parameters) against central differences of `computed_hours` (common
    /// practice for checking an analytic derivative, no source).
    #[test]
    fn global_partials_match_central_differences() {
        use crate::observations::contact_forms::ContactJudged;
        use crate::observations::timings::{Interval, Observation};
        let date = chrono::NaiveDate::from_ymd_opt(1769, 6, 3).unwrap();
        let event = transit_on_date(Planet::Venus, date, &TimeModel::default()).unwrap();
        let er = event.earth_radii_per_arcsec();
        for geocentric in [false, true] {
            let mut params = ParameterSet::classic(8.8);
            params.add_global_parameter(crate::reduction::parameters::ParameterSpec {
                name: "black_drop[touch, II]".into(),
                unit: "s",
                kind: ParameterKind::BlackDrop(ContactJudged::Touch, Contact::II),
                scope: crate::reduction::parameters::Scope::Global,
                start: 0.0,
                prior: None,
                fixed: false,
            });
            if geocentric {
                params.set_nuisance_at_geocentre();
            }
            let theta = [8.8, 0.3, -0.2, 0.5, -0.4, 7.0];
            let mut checked = 0;
            for st in global_stations(40, "p") {
                for (first, c) in [
                    (None, Contact::II),
                    (None, Contact::IV),
                    (Some(Contact::II), Contact::III),
                ] {
                    let mut obs = Observation::instant(2, st.clone(), c, Default::default(), 5.0);
                    obs.judged = ContactJudged::Touch;
                    obs.duration = first.map(|f| Interval {
                        first: f,
                        seconds: 1.0,
                        date: None,
                        kept_to: None,
                    });
                    let t = Timing {
                        geo: st.geocentric(),
                        obs,
                        observed_h: 0.0,
                        station: 0,
                    };
                    let Some(lin) = linearise(&event, &t, &params, &theta, er) else {
                        continue;
                    };
                    for j in 0..theta.len() {
                        let step = if j == PARALLAX { 1e-4 } else { 1e-3 };
                        let at = |d: f64| {
                            let mut th = theta;
                            th[j] += d;
                            computed_hours(&event, &t, &params, &th, er)
                        };
                        let (Some(a), Some(b)) = (at(step), at(-step)) else {
                            continue;
                        };
                        let numeric = (a - b) * 3600.0 / (2.0 * step);
                        let analytic = if j < N_CLASSIC {
                            lin.global[j]
                        } else {
                            lin.extra[j - N_CLASSIC]
                        };
                        assert!(
                            (numeric - analytic).abs() < 1e-3 * (1.0 + analytic.abs()),
                            "{} {c:?} {first:?} p{j} geocentric {geocentric}: {analytic} vs {numeric}",
                            st.name
                        );
                        checked += 1;
                    }
                }
            }
            assert!(checked > 300, "{checked}");
        }
    }
}
