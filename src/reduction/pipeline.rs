//! The reduction, step by step, as docs/reduction.md describes it:
//!
//! 1. name the event (given, or inferred from the timings' median date);
//! 2. turn the valid rows into timings of the event (`screening::timings_of_event`);
//! 3. build the campaign's parameter set (the classic five, starting from the a-priori
//!    parallax);
//! 4. screen, fit and reject outliers (`screening::screen`);
//! 5. test each station as a whole for a blunder and refit without the stations so explained
//!    (`rejection::station_wide`);
//! 6. record every row not used with its reason and diagnosis (`rejection::record_rejections`);
//! 7. sum up: statistics, uncertainties scaled by the Birge ratio, the AU, each station's
//!    contribution and the convergence (`summarise`, `contributions`).
//!
//! References: J. F. Encke (1822, 1824) and S. Newcomb (1891) for the condition equations;
//! Bevington and Robinson (2003), chapter 8; R. T. Birge, Phys. Rev. 40, 207 (1932).

use super::black_drop::{add_lag_parameters, lag_plan, lags};
use super::classic_methods::{condition_equations, methods};
use super::contributions::{contributions, convergence, stations_not_used};
use super::error_budget::{error_budget, Solved};
use super::fit::FitOutcome;
use super::historical_diagnosis::{campaign_kind_check, meridian_corrections};
use super::parameters::{ParameterKind, ParameterSet, Prior, Scope, PARALLAX};
use super::planet_place::{parallax_shift_arcsec, place_accuracy_arcsec};
use super::rejection::{record_rejections, station_wide};
use super::result::{Parameter, ReduceOptions, Reduction, UsedTiming};
use super::screening::{scatter_of, screen, timings_of_event, Screened};
use super::statistics::{fit_statistics, FitStatistics};
use super::{equations::Timing, fit::fit};
use crate::error::{Error, Result};
use crate::geometry::besselian::check_parallax;
use crate::geometry::transit::{transit_on_date, TransitEvent};
use crate::observations::longitude::LongitudeKnowledge;
use crate::observations::timings::{Observation, ObservationSet, RejectReason, Rejected};
use crate::sky::constants::{au_and_sigma_km, au_km_from_parallax_arcsec};
use crate::sky::ephemeris::Planet;
use crate::time::scales::TimeModel;

/// The error when not one timing can be used, listing every row with its reason.
fn no_usable_timing(path: &std::path::Path, rows_total: usize, rejected: &[Rejected]) -> Error {
    let why = if rows_total == 0 {
        "the file has a header and no rows".to_string()
    } else {
        format!("none of its {rows_total} rows can be used")
    };
    let rows = rejected
        .iter()
        .map(|r| {
            format!(
                "line {}: station '{}', contact {}: {}: {}",
                r.line,
                r.station,
                r.contact.map_or("-".to_string(), |c| c.to_string()),
                r.reason.as_str(),
                r.diagnosis.as_deref().unwrap_or("no diagnosis")
            )
        })
        .collect();
    Error::NoUsableTiming {
        file: path.to_path_buf(),
        why,
        rows,
    }
}

fn infer_event(valid: &[Observation], model: &TimeModel) -> Result<TransitEvent> {
    let mut times: Vec<chrono::NaiveDateTime> = valid
        .iter()
        .filter(|o| o.is_dated())
        .map(|o| o.time_label)
        .collect();
    if times.is_empty() {
        return Err(Error::argument(
            "no row gives a date (each is a time of day alone or a timed interval without one), so the transit cannot be found from the file; give --planet and --date",
        ));
    }
    times.sort();
    let mid = times[times.len() / 2].date();
    for planet in [Planet::Venus, Planet::Mercury] {
        if let Ok(ev) = transit_on_date(planet, mid, model) {
            return Ok(ev);
        }
    }
    Err(Error::argument(format!(
        "the timings (median date {mid}) match no transit of Venus or Mercury within a day; give --planet and --date"
    )))
}

/// Reduce a set of timings.
///
/// Errors: an invalid prior parallax; no event found; no usable timing (every row listed).
pub fn reduce(set: ObservationSet, options: &ReduceOptions) -> Result<Reduction> {
    if set.valid.is_empty() {
        return Err(no_usable_timing(&set.path, set.rows_total, &set.rejected));
    }
    let model = options.time_model;
    let event = match options.event {
        Some((planet, date)) => transit_on_date(planet, date, &model)?,
        None => infer_event(&set.valid, &model)?,
    };
    reduce_for_event(set, event, options)
}

/// Reduce a set of timings for an event already computed (as [`reduce`]; the event's time
/// model is used and `options.event` is ignored). Saves the event's setup when many campaigns
/// are reduced for one transit.
pub fn reduce_for_event(
    set: ObservationSet,
    event: TransitEvent,
    options: &ReduceOptions,
) -> Result<Reduction> {
    check_parallax(options.prior_parallax_arcsec)?;
    let model = *event.time_model();
    let mut set = set;
    if let Some(note) = super::undated::complete_dates(&mut set.valid, &event) {
        set.notes.push(note);
    }
    let mut rejected = set.rejected.clone();
    let timings = timings_of_event(&set.valid, &event, &model, &mut rejected)?;
    let mut params = ParameterSet::classic(options.prior_parallax_arcsec);
    options.planet_place.apply(&mut params);
    add_lag_parameters(&mut params, &timings);
    add_longitude_corrections(&mut params, &timings);
    let threshold = options.outlier_threshold;
    let mut screened = screen(&event, &timings, &params, threshold);
    let verdicts = station_wide(&event, &timings, &params, &screened, threshold);
    if !verdicts.is_empty() {
        let all: std::collections::HashSet<usize> = verdicts
            .iter()
            .flat_map(|(r, _)| r.iter().copied())
            .collect();
        let s = &mut screened;
        s.used.retain(|i| !all.contains(i));
        s.outliers.retain(|i| !all.contains(i));
        s.not_visible.retain(|(i, _)| !all.contains(i));
        s.no_contact.retain(|i| !all.contains(i));
        s.outcome = fit(&event, &timings, &s.used, &params, &s.outcome.theta);
        s.scatter = scatter_of(&timings, &s.used, &s.outcome);
    }
    leave_out_undetermined(&event, (&timings, &params), &mut screened, &mut rejected);
    record_rejections(
        &event,
        &timings,
        &params,
        &screened,
        (&verdicts, threshold),
        &mut rejected,
    );
    if screened.used.is_empty() {
        return Err(no_usable_timing(&set.path, set.rows_total, &rejected));
    }
    let campaign = Campaign {
        params: &params,
        timings: &timings,
        rows_total: set.rows_total,
    };
    let mut reduction = summarise(event, &campaign, options, &screened, rejected);
    reduction.warnings.extend(set.reading_notes());
    Ok(reduction)
}

/// What `summarise` needs of the campaign besides the event.
struct Campaign<'a> {
    params: &'a ParameterSet,
    timings: &'a [Timing],
    rows_total: usize,
}

/// Warnings about the fit's convergence, degrees of freedom and scatter.
fn fit_warnings(outcome: &FitOutcome, stats: &FitStatistics) -> Vec<String> {
    let mut warnings = outcome.messages.clone();
    if !outcome.converged && outcome.free[PARALLAX] {
        // The fit's own sentence says what still moved; one sentence says both.
        let consequence = "; the parallax is not determined and no result is given";
        match warnings
            .iter_mut()
            .find(|w| w.starts_with("the iteration did not converge"))
        {
            Some(w) => w.push_str(consequence),
            None => warnings.push(format!(
                "the iteration did not converge in {} steps{consequence}",
                outcome.iterations
            )),
        }
    }
    if stats.dof == 0 && outcome.free[PARALLAX] {
        warnings.push(
            "there are no degrees of freedom: the uncertainties rest on the stated sigmas alone"
                .into(),
        );
    }
    if stats.too_small() {
        warnings.push(format!(
            "the residuals scatter less than the stated sigmas allow (chi-square {:.1} for {}; so small a value has probability {} if they were right): the stated uncertainties are probably too large, and so is the parallax's, which is not scaled down",
            stats.chi2,
            crate::words::count(stats.dof, "degree of freedom", "degrees of freedom"),
            super::statistics::probability(stats.p_lower.unwrap_or(0.0))
        ));
    }
    if let Some(rb) = stats.birge_ratio {
        if rb > 1.0 && stats.too_large() {
            warnings.push(format!(
                "the residuals scatter {rb:.2} times more than the stated sigmas allow (chi-square {:.1} for {}); the uncertainties are scaled up by that factor",
                stats.chi2, crate::words::count(stats.dof, "degree of freedom", "degrees of freedom")
            ));
        }
    }
    warnings
}

/// A parameter's unscaled uncertainty: from the global covariance, or the fit's own figure
/// for a station's parameter.
fn unscaled_sigma(outcome: &FitOutcome, j: usize) -> f64 {
    let cov = &outcome.covariance;
    if j < cov.nrows() {
        cov[(j, j)].max(0.0).sqrt()
    } else {
        outcome.sigma[j].unwrap_or(0.0)
    }
}

/// Every parameter with its value and scaled uncertainty.
fn parameters_of(params: &ParameterSet, outcome: &FitOutcome, scale: f64) -> Vec<Parameter> {
    params
        .specs()
        .iter()
        .enumerate()
        .map(|(j, spec)| Parameter {
            name: spec.name.clone(),
            value: outcome.theta[j],
            // A parameter the step could not solve has no uncertainty: "not determined",
            // never a zero.
            sigma: outcome.free[j]
                .then(|| unscaled_sigma(outcome, j) * scale)
                .filter(|s| s.is_finite() && *s > 0.0),
            unit: spec.unit.into(),
            fixed: !outcome.free[j],
        })
        .collect()
}

/// The correlation matrix of the global parameters (zero rows for fixed ones).
fn correlation_of(outcome: &FitOutcome) -> Vec<Vec<f64>> {
    let cov = &outcome.covariance;
    let g = cov.nrows();
    (0..g)
        .map(|a| {
            (0..g)
                .map(|b| {
                    let d = (cov[(a, a)] * cov[(b, b)]).sqrt();
                    if d > 0.0 {
                        cov[(a, b)] / d
                    } else {
                        0.0
                    }
                })
                .collect()
        })
        .collect()
}

/// The sentence when the parallax's one-sigma range reaches zero.
pub const AU_UNBOUNDED: &str = "the parallax's one-sigma range reaches zero, so these timings set no upper bound on the astronomical unit: no AU is given";

/// The headline figures: parallax, its sigma and 95 % interval; the AU = a_e / sin(pi), its
/// sigma (half the width of the exact image of pi -+ sigma; to first order AU cot(pi)
/// sigma_pi, from which it differs by (sigma_pi/pi)^2 relatively) and its 95 % interval (the
/// exact image of the parallax interval, unbounded above where that reaches zero). No AU when
/// pi - sigma reaches zero; nothing when the sigma is not a positive number.
fn headline_into(red: &mut Reduction, coverage_factor_95: f64) {
    let pi = red.parameters[PARALLAX].value;
    let Some(s) = red.parameters[PARALLAX]
        .sigma
        .filter(|s| s.is_finite() && *s > 0.0)
    else {
        red.warnings.push("the fit gave no positive uncertainty for the parallax; it is not determined and no result is given".into());
        return;
    };
    let k = coverage_factor_95;
    red.parallax_arcsec = Some(pi);
    red.parallax_sigma_arcsec = Some(s);
    // A parallax is positive: the interval is clipped at zero.
    red.parallax_interval_95 = Some(((pi - k * s).max(0.0), pi + k * s));
    let Some((au, au_sigma)) = au_and_sigma_km(pi, s) else {
        red.warnings.push(AU_UNBOUNDED.into());
        return;
    };
    red.au_km = Some(au);
    red.au_sigma_km = Some(au_sigma);
    red.au_interval_95_km = Some((
        au_km_from_parallax_arcsec(pi + k * s),
        (pi - k * s > 0.0).then(|| au_km_from_parallax_arcsec(pi - k * s)),
    ));
}

fn used_rows(timings: &[Timing], used: &[usize], outcome: &FitOutcome) -> Vec<UsedTiming> {
    used.iter()
        .zip(&outcome.residuals_s)
        .map(|(&i, r)| UsedTiming {
            line: timings[i].obs.line,
            station: timings[i].obs.station.name.clone(),
            contact: timings[i].obs.contact.number(),
            contact_label: timings[i].obs.contact_label(),
            observer: timings[i].obs.observer.clone(),
            o_c_s: *r,
            sigma_s: timings[i].obs.sigma_s,
            metadata: timings[i].obs.metadata.clone(),
        })
        .collect()
}

/// A longitude the timings cannot place within this many degrees is not determined.
const LONGITUDE_UNDETERMINED_DEG: f64 = 30.0;

/// Leave out the timings of every station whose longitude correction the timings cannot
/// determine (no prior and an uncertainty over [`LONGITUDE_UNDETERMINED_DEG`]), each with a
/// sentence, and fit again without them: using them with the given longitude would rest the
/// result on a value the file calls unknown.
fn leave_out_undetermined(
    event: &TransitEvent,
    (timings, params): (&[Timing], &ParameterSet),
    s: &mut Screened,
    rejected: &mut Vec<Rejected>,
) {
    let lost: Vec<(usize, f64)> = params
        .specs()
        .iter()
        .enumerate()
        .filter(|(_, spec)| spec.kind == ParameterKind::LongitudeCorrection && spec.prior.is_none())
        .filter_map(
            |(j, spec)| match (spec.scope, s.outcome.sigma.get(j).copied().flatten()) {
                (Scope::Station(k), Some(sigma)) if sigma > LONGITUDE_UNDETERMINED_DEG => {
                    Some((k, sigma))
                }
                _ => None,
            },
        )
        .collect();
    if lost.is_empty() {
        return;
    }
    for &i in &s.used {
        let t = &timings[i];
        if let Some(&(_, sigma)) = lost.iter().find(|(k, _)| *k == t.station) {
            rejected.push(Rejected {
                line: t.obs.line,
                station: t.obs.station.name.clone(),
                contact: Some(t.obs.contact.number()),
                contact_label: t.obs.duration.map(|_| t.obs.contact_label()),
                reason: RejectReason::Undetermined,
                diagnosis: Some(format!("the station's longitude is unknown and its timings cannot determine it (uncertainty {sigma:.0} degrees), so they are left out rather than used with the longitude given; give longitude_sigma_deg a number, or time more contacts there")),
                o_c_s: None,
            });
        }
    }
    s.used
        .retain(|&i| !lost.iter().any(|(k, _)| *k == timings[i].station));
    s.outcome = fit(event, timings, &s.used, params, &s.outcome.theta);
    s.scatter = scatter_of(timings, &s.used, &s.outcome);
}

/// A longitude correction for every station whose longitude is not taken as exact, with its
/// prior (none for an unknown longitude); the first row of a station says.
fn add_longitude_corrections(params: &mut ParameterSet, timings: &[Timing]) {
    let mut seen = std::collections::HashSet::new();
    for t in timings {
        if !seen.insert(t.station) {
            continue;
        }
        let prior = match t.obs.longitude {
            LongitudeKnowledge::Exact => continue,
            LongitudeKnowledge::Sigma(sigma) => Some(Prior { value: 0.0, sigma }),
            LongitudeKnowledge::Unknown => None,
        };
        let spec = ParameterSet::longitude_correction(&t.obs.station.name, prior);
        params.add_station_parameter(t.station, spec);
    }
}

/// Statistics, parameters, the headline figures and each station's contribution.
fn summarise(
    event: TransitEvent,
    c: &Campaign,
    options: &ReduceOptions,
    s: &Screened,
    rejected: Vec<Rejected>,
) -> Reduction {
    let (outcome, used) = (&s.outcome, &s.used);
    let n = used.len();
    let stats = fit_statistics(c.timings, used, c.params, outcome);
    let w: Vec<f64> = used
        .iter()
        .map(|&i| 1.0 / c.timings[i].obs.sigma_s.powi(2))
        .collect();
    let determined = outcome.free[PARALLAX] && n > 0 && outcome.converged;
    let er = event.earth_radii_per_arcsec();
    let mut stations = contributions(&event, c.timings, used, outcome, &w, er);
    stations.extend(stations_not_used(c.timings, used, &rejected));
    let convergence = if determined && options.follow_convergence {
        convergence(&event, c.timings, used, c.params, &outcome.theta)
    } else {
        Vec::new()
    };
    let place_bias_arcsec = parallax_shift_arcsec(
        options.planet_place,
        &event,
        (c.timings, used),
        c.params,
        outcome,
        place_accuracy_arcsec(&event.ephemeris_name()),
    );
    let parameters = parameters_of(c.params, outcome, stats.sigma_scale);
    let sigmas: Vec<Option<f64>> = parameters.iter().map(|p| p.sigma).collect();
    let black_drop = lags(
        c.params,
        &lag_plan(c.params, c.timings, used),
        &outcome.theta,
        &sigmas,
    );
    let mut red = Reduction {
        black_drop,
        methods: Vec::new(),
        error_budget: None,
        event,
        prior_parallax_arcsec: options.prior_parallax_arcsec,
        planet_place: options.planet_place,
        place_bias_arcsec,
        parallax_arcsec: None,
        parallax_sigma_arcsec: None,
        parallax_interval_95: None,
        au_km: None,
        au_sigma_km: None,
        au_interval_95_km: None,
        timings_total: c.rows_total,
        timings_used: n,
        rejected,
        stations,
        parameters,
        correlation: correlation_of(outcome),
        statistics: stats,
        robust_scatter: s.scatter,
        iterations: outcome.iterations,
        warnings: fit_warnings(outcome, &stats),
        used: used_rows(c.timings, used, outcome),
        convergence,
    };
    historical_warnings(&mut red, c, s);
    if determined {
        headline_into(&mut red, stats.coverage_factor_95);
    }
    if options.compare_methods {
        side_by_side(&mut red, c, s, stats.sigma_scale);
    }
    red
}

/// The warnings that read historical records: which kind of time a campaign's stations kept,
/// when the scatter is too large to be chance, and the meridians' fitted corrections.
fn historical_warnings(red: &mut Reduction, c: &Campaign, s: &Screened) {
    let (outcome, used) = (&s.outcome, &s.used);
    if red.statistics.too_large() {
        red.warnings.extend(campaign_kind_check(
            &red.event,
            (c.timings, used),
            c.params,
            outcome,
        ));
    }
    red.warnings.extend(meridian_corrections(
        c.timings,
        c.params,
        (&outcome.theta, &outcome.sigma),
    ));
}

/// Halley's and Delisle's methods beside the full solution, and the error budget of a
/// determined parallax.
fn side_by_side(red: &mut Reduction, c: &Campaign, s: &Screened, sigma_scale: f64) {
    let (outcome, used) = (&s.outcome, &s.used);
    let stations = red.stations.iter().filter(|st| st.timings > 0).count();
    let figure = red.parallax_arcsec.zip(red.parallax_sigma_arcsec);
    let why_not = red
        .warnings
        .iter()
        .rev()
        .find(|w| w.contains("parallax"))
        .cloned();
    let full = condition_equations(
        figure,
        (c.timings, used, stations),
        (outcome, sigma_scale),
        why_not,
    );
    // The classic methods and the error budget read the same solution and nothing of each
    // other: they run side by side (the figures do not depend on the order).
    let event = &red.event;
    let budget_input = figure.map(|(_, sigma)| Solved {
        event,
        timings: c.timings,
        used,
        params: c.params,
        theta: &outcome.theta,
        free: &outcome.free,
        parallax_sigma_arcsec: sigma,
        sigma_scale,
        place_shift_arcsec: red.place_bias_arcsec,
    });
    let (side, budget) = rayon::join(
        || methods(event, (c.timings, used), c.params, &outcome.theta, full),
        || budget_input.as_ref().map(error_budget),
    );
    red.methods = side;
    red.error_budget = budget;
}
