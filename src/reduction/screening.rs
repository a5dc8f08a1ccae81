//! Screening and rejection: which timings go into the solution.
//!
//! In order: timings far from the event are invalid; timings made with the Sun set, or of a
//! contact that does not occur at the station by the ephemeris at nominal parameters (the
//! rule of `agreement.rs`, shared with the service's feedback), wait for diagnosis; gross
//! blunders by that shared rule are screened against the nominal prediction (instants in UTC
//! at stations of exact longitude), then at the a-priori values (per contact, distance from the median O - C against a
//! robust scale, with a floor of 10 minutes); then the fit rejects, round by round, every
//! timing beyond the threshold in robust standard deviations (1.4826 x the median absolute
//! deviation of the normalised residuals), at most 30 % of the timings in all.
//!
//! References: F. R. Hampel, JASA 69, 383 (1974) (the median absolute deviation as a robust
//! scale); sigma clipping against a robust scale is common practice (no single source).

use super::agreement::{agreement, compared_at_nominal, nominal_contact_hours, Agreement};
use super::equations::{nominal_theta, perturbation, residual_s, Timing};
use super::fit::{fit, FitOutcome};
use super::parameters::ParameterSet;
use super::statistics::{median, robust_sigma};
use crate::geometry::contacts::{sun_alt_az_parallactic, Contact};
use crate::geometry::transit::TransitEvent;
use crate::observations::timings::{Interval, Observation, RejectReason, Rejected};
use crate::sky::solar_time::{equation_of_time_s, LocalTime};
use crate::time::calendar::{julian_lag_days, Calendar};
use crate::time::scales::TimeModel;
use crate::Result;

/// How far from greatest transit a timing may lie and still belong to the event, hours.
pub const EVENT_WINDOW_H: f64 = 36.0;

/// The Sun's true altitude below which a timing is taken as made with the Sun set (degrees):
/// refraction (~0.6 deg) and the semidiameter (~0.27 deg) still show the limb at -0.9 deg.
pub const MIN_VISIBLE_ALTITUDE_DEG: f64 = -1.0;

/// Where each timing stands after screening.
#[derive(Clone, Debug)]
pub struct Screened {
    /// Timings in the solution.
    pub used: Vec<usize>,
    /// Rejected as outliers (pre-screen or clipping).
    pub outliers: Vec<usize>,
    /// Made with the Sun below the horizon, with the Sun's altitude (degrees).
    pub not_visible: Vec<(usize, f64)>,
    /// Of a contact that does not occur at the station.
    pub no_contact: Vec<usize>,
    /// The fit on `used`.
    pub outcome: FitOutcome,
    /// Robust scale of the normalised residuals of `used` (at least 0.5).
    pub scatter: f64,
    /// Every timing's O - C against the nominal prediction (s), where the shared rule of
    /// `agreement.rs` compares it so ([`compared_at_nominal`]).
    pub nominal_o_c_s: Vec<Option<f64>>,
}

/// Turn valid rows into timings of the event: a time more than [`EVENT_WINDOW_H`] from
/// greatest transit (or an interval dated more than a day from it) is rejected as invalid,
/// with the calendar named where the offset is that of Old and New Style. Stations are
/// numbered by first appearance. An interval of apparent time is turned into one of UT by the
/// equation of time's change between its predicted contacts.
pub fn timings_of_event(
    valid: &[Observation],
    event: &TransitEvent,
    model: &TimeModel,
    rejected: &mut Vec<Rejected>,
) -> Result<Vec<Timing>> {
    let greatest_h = event.hours_of_greatest();
    // Station indices in order of first appearance, looked up by name (a linear search made
    // the step quadratic in the stations: 60 % of a 50,000-station reduction).
    let mut names: std::collections::HashMap<&str, usize> = std::collections::HashMap::new();
    let mut timings = Vec::new();
    for obs in valid {
        let observed_h = match obs.duration {
            Some(d) => interval_hours(obs, &d, event),
            None => event.elements.hours(model.tt_from_label(obs.time_label)?),
        };
        let offset_days = match obs.duration {
            Some(d) => d.date.map(|date| (date - event.date()).num_days() as f64),
            None => Some((observed_h - greatest_h) / 24.0),
        };
        let far = match (obs.duration, offset_days) {
            (Some(_), Some(days)) => days.abs() > 1.0,
            (None, Some(days)) => days.abs() * 24.0 > EVENT_WINDOW_H,
            _ => false,
        };
        if far {
            let days = offset_days.unwrap_or(0.0);
            rejected.push(Rejected {
                line: obs.line,
                station: obs.station.name.clone(),
                contact: Some(obs.contact.number()),
                contact_label: obs.duration.map(|_| obs.contact_label()),
                reason: RejectReason::Invalid,
                diagnosis: Some(far_sentence(obs, days, event)),
                o_c_s: None,
            });
            continue;
        }
        let next = names.len();
        let station = *names.entry(obs.station.name.as_str()).or_insert(next);
        timings.push(Timing {
            geo: obs.station.geocentric(),
            obs: obs.clone(),
            observed_h,
            station,
        });
    }
    Ok(timings)
}

/// An interval's length in hours of UT: as written, less the change of the equation of time
/// between its predicted contacts where it was measured in apparent time (the interval between
/// two apparent times is the UT interval plus that change).
pub fn interval_hours(obs: &Observation, d: &Interval, event: &TransitEvent) -> f64 {
    let mut seconds = d.seconds;
    if d.kept_to == Some(LocalTime::Apparent) {
        let geo = obs.station.geocentric();
        let p = perturbation(&nominal_theta(), event.earth_radii_per_arcsec());
        let model = event.time_model();
        let eot = |c| {
            let h = event.contact_hours_perturbed(&geo, c, &p)?;
            equation_of_time_s(event.label(h), model)
        };
        if let (Some(a), Some(b)) = (eot(d.first), eot(obs.contact)) {
            seconds -= b - a;
        }
    }
    seconds / 3600.0
}

/// Why a row cannot belong to the event: how far it lies, and where that is the Julian
/// calendar's lag (10 days in the 17th century, 11 in the 18th, 12 in the 19th), which
/// calendar to set.
fn far_sentence(obs: &Observation, days: f64, event: &TransitEvent) -> String {
    let lag = julian_lag_days(event.date()).unwrap_or(11) as f64;
    let calendar_hint = if obs.written.calendar == Calendar::Gregorian && (days + lag).abs() < 1.0 {
        format!(" It lies {lag:.0} days before the transit, the lag of the Julian calendar then: the date was probably written Old Style; set calendar to julian")
    } else if obs.written.calendar == Calendar::Julian && (days - lag).abs() < 1.0 {
        format!(" It lies {lag:.0} days after the transit, as a New Style date read as Old Style would: set calendar to gregorian (or leave it empty)")
    } else {
        String::new()
    };
    format!(
        "the time is {days:.1} days from greatest transit ({}); it cannot belong to this event.{calendar_hint}",
        event.greatest_utc()
    )
}

/// The timings sorted at the a-priori values.
struct Sorted {
    /// Computable and visible: they go forward.
    candidates: Vec<usize>,
    /// Made with the Sun set, with its altitude (degrees).
    not_visible: Vec<(usize, f64)>,
    /// Of a contact that the ephemeris at nominal parameters does not give at the station.
    no_contact: Vec<usize>,
    /// Of a contact that occurs at nominal parameters but not at the prior values (a prior
    /// parallax far off at a grazing station): outliers, never "does not occur".
    unsolvable: Vec<usize>,
    /// Every timing's O - C at the a-priori values (s; 0 where not computed).
    prior_residual_s: Vec<f64>,
    /// Every timing's O - C against the nominal prediction (s), where the shared rule applies.
    nominal_o_c_s: Vec<Option<f64>>,
}

/// The nominal time of a timing's contact (hours from the elements' epoch), if it (and the
/// first contact of an interval) occurs at its station by the shared rule
/// ([`nominal_contact_hours`]: the ephemeris at nominal parameters).
fn nominal_hours(event: &TransitEvent, t: &Timing) -> Option<f64> {
    if let Some(d) = t.obs.duration {
        nominal_contact_hours(event, &t.geo, d.first)?;
    }
    nominal_contact_hours(event, &t.geo, t.obs.contact)
}

/// Sort the timings at the a-priori values: computable and visible ones go forward (with
/// their O - C); the rest wait for diagnosis. Whether a contact occurs is decided by the
/// shared rule, at nominal parameters.
fn sort_by_visibility(
    event: &TransitEvent,
    timings: &[Timing],
    params: &ParameterSet,
    theta_prior: &[f64],
) -> Sorted {
    let er = event.earth_radii_per_arcsec();
    let mut out = Sorted {
        candidates: Vec::new(),
        not_visible: Vec::new(),
        no_contact: Vec::new(),
        unsolvable: Vec::new(),
        prior_residual_s: vec![0.0; timings.len()],
        nominal_o_c_s: vec![None; timings.len()],
    };
    let p = perturbation(theta_prior, event.earth_radii_per_arcsec());
    let altitude = |geo, h: f64| {
        if event.elements.covers(h) {
            sun_alt_az_parallactic(&event.elements, geo, h).0
        } else {
            f64::NAN
        }
    };
    for (i, t) in timings.iter().enumerate() {
        let Some(nominal_h) = nominal_hours(event, t) else {
            out.no_contact.push(i);
            continue;
        };
        if compared_at_nominal(&t.obs) {
            out.nominal_o_c_s[i] = Some((t.observed_h - nominal_h) * 3600.0);
        }
        let alt = match t.obs.duration {
            // An interval: the Sun must be up at both of its (predicted) contacts.
            Some(d) => [d.first, t.obs.contact]
                .iter()
                .filter_map(|&c| event.contact_hours_perturbed(&t.geo, c, &p))
                .map(|h| altitude(&t.geo, h))
                .fold(f64::INFINITY, f64::min),
            None => altitude(&t.geo, t.observed_h),
        };
        match residual_s(event, t, params, theta_prior, er) {
            None => out.unsolvable.push(i),
            Some(r) => {
                out.prior_residual_s[i] = r;
                if alt.is_finite() && alt < MIN_VISIBLE_ALTITUDE_DEG {
                    out.not_visible.push((i, alt));
                } else {
                    out.candidates.push(i);
                }
            }
        }
    }
    out
}

/// Screen gross blunders against the nominal prediction, before any fit, by the shared rule
/// ([`agreement`]: beyond the larger of ten tolerance sigmas and two minutes), so that a few
/// stations with many blunders cannot drag the first solution. Only instants in UTC at
/// stations whose longitude is taken as exact are screened so: a local solar time or a
/// longitude to be solved for moves a timing from its nominal prediction by what the fit is
/// to find.
///
/// Returns: (kept, screened out).
fn screen_at_nominal(
    timings: &[Timing],
    candidates: Vec<usize>,
    nominal_o_c_s: &[Option<f64>],
) -> (Vec<usize>, Vec<usize>) {
    let gross = |i: usize| {
        nominal_o_c_s[i]
            .is_some_and(|r| agreement(r, timings[i].obs.sigma_s) == Agreement::Rejected)
    };
    candidates.into_iter().partition(|&i| !gross(i))
}

/// Screen gross blunders at the prior: per contact, distance from the median O - C against a
/// robust scale, with a floor of 10 minutes. Needs five or more candidates.
fn prescreen(
    timings: &[Timing],
    candidates: Vec<usize>,
    prior_residual_s: &[f64],
) -> (Vec<usize>, Vec<usize>) {
    if candidates.len() < 5 {
        return (candidates, Vec::new());
    }
    // The median O - C of each kind of timing (each contact, and each pair of an interval).
    let mut groups: Vec<((Option<Contact>, Contact), f64)> = Vec::new();
    for &i in &candidates {
        let key = timings[i].obs.contacts();
        if !groups.iter().any(|g| g.0 == key) {
            let v: Vec<f64> = candidates
                .iter()
                .filter(|&&k| timings[k].obs.contacts() == key)
                .map(|&k| prior_residual_s[k])
                .collect();
            groups.push((key, median(&v)));
        }
    }
    let med = |i: usize| {
        let key = timings[i].obs.contacts();
        groups.iter().find(|g| g.0 == key).map_or(0.0, |g| g.1)
    };
    let z: Vec<f64> = candidates
        .iter()
        .map(|&i| (prior_residual_s[i] - med(i)) / timings[i].obs.sigma_s)
        .collect();
    let s0 = robust_sigma(&z).max(0.5);
    let mut outliers = Vec::new();
    let keep = candidates
        .iter()
        .zip(&z)
        .filter_map(|(&i, &zi)| {
            let dev_s = (zi * timings[i].obs.sigma_s).abs();
            if dev_s > (10.0 * s0 * timings[i].obs.sigma_s).max(600.0) {
                outliers.push(i);
                None
            } else {
                Some(i)
            }
        })
        .collect();
    (keep, outliers)
}

/// Robust scale of the normalised residuals of a fit (at least 0.5).
pub fn scatter_of(timings: &[Timing], used: &[usize], outcome: &FitOutcome) -> f64 {
    let z: Vec<f64> = used
        .iter()
        .zip(&outcome.residuals_s)
        .map(|(&i, r)| r / timings[i].obs.sigma_s)
        .collect();
    robust_sigma(&z).max(0.5)
}

/// Screen, fit, and reject the worst timings round by round while any lies beyond
/// `threshold` robust standard deviations.
pub fn screen(
    event: &TransitEvent,
    timings: &[Timing],
    params: &ParameterSet,
    threshold: f64,
) -> Screened {
    let theta_prior = params.start_values();
    let sorted = sort_by_visibility(event, timings, params, &theta_prior);
    let (not_visible, no_contact) = (sorted.not_visible, sorted.no_contact);
    let nominal_o_c_s = sorted.nominal_o_c_s;
    let (candidates, mut outliers) = screen_at_nominal(timings, sorted.candidates, &nominal_o_c_s);
    outliers.extend(sorted.unsolvable);
    let (mut used, more) = prescreen(timings, candidates, &sorted.prior_residual_s);
    outliers.extend(more);
    let max_rejections = (used.len() as f64 * 0.3).floor() as usize;
    let mut rejected_by_fit = 0;
    let mut outcome = fit(event, timings, &used, params, &theta_prior);
    loop {
        if !outcome.unsolvable.is_empty() {
            // The contact occurs at nominal parameters (sorted above) but not at these trial
            // values: the timing is off, never "does not occur".
            outliers.extend(outcome.unsolvable.iter().copied());
            used.retain(|i| !outcome.unsolvable.contains(i));
            outcome = fit(event, timings, &used, params, &theta_prior);
            continue;
        }
        let scatter = scatter_of(timings, &used, &outcome);
        let n_free = outcome.free.iter().filter(|&&f| f).count();
        // Every timing beyond the threshold goes in one round (the robust scale is not
        // inflated by the outliers it is meant to find).
        let limit = threshold * scatter;
        let z: Vec<f64> = used
            .iter()
            .zip(&outcome.residuals_s)
            .map(|(&i, r)| r / timings[i].obs.sigma_s)
            .collect();
        let mut beyond: Vec<usize> = (0..used.len()).filter(|&k| z[k].abs() > limit).collect();
        let room = max_rejections
            .saturating_sub(rejected_by_fit)
            .min(used.len().saturating_sub(n_free + 2));
        if beyond.is_empty() || room == 0 {
            return Screened {
                used,
                outliers,
                not_visible,
                no_contact,
                outcome,
                scatter,
                nominal_o_c_s,
            };
        }
        beyond.sort_by(|&a, &b| z[b].abs().total_cmp(&z[a].abs()));
        beyond.truncate(room);
        beyond.sort_unstable();
        for &k in beyond.iter().rev() {
            outliers.push(used.remove(k));
            rejected_by_fit += 1;
        }
        outcome = fit(event, timings, &used, params, &outcome.theta);
    }
}
