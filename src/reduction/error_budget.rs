//! The error budget of the parallax: what the stated uncertainty is made of (the timings, the
//! station longitudes) and the model terms it leaves out (Delta T, the planet's place where
//! it is held), each as its effect on the parallax in arcseconds.
//!
//! The Delta T term is the parallax's change per second of Delta T, found by solving again
//! with the event computed for Delta T + 10 s (the response is linear over far more than
//! that), times the uncertainty of Delta T. A Delta T error turns the Earth under the
//! planet's path (times labelled UTC) or moves every timing along the path (times labelled
//! UT1, before 1972); both look much like a shift of the planet along its path, so where the
//! planet's offsets are free they absorb most of it. The same rate with the offsets held at
//! their fitted values measures how much.
//!
//! The timing and longitude terms split the stated variance: the timing term is the
//! parallax's uncertainty with every longitude correction held at its fitted value, the
//! longitude term what the corrections' freedom adds in quadrature.
//!
//! References: the propagation of a model parameter's error by its partial derivative:
//! JCGM 100:2008 (GUM), section 5.1; Delta T and its uncertainty: L. V. Morrison and
//! F. R. Stephenson, J. Hist. Astron. 35, 327 (2004).

use super::equations::Timing;
use super::fit::fit;
use super::parameters::{ParameterKind, ParameterSet, OFFSET_EAST, OFFSET_NORTH, PARALLAX};
use crate::geometry::transit::TransitEvent;
use crate::time::scales::{DeltaTSource, TimeModel};
use serde::Serialize;

/// The step in Delta T for the rate, seconds.
const DELTA_T_STEP_S: f64 = 10.0;

/// The terms of the parallax's uncertainty, arcsec unless named otherwise.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct ErrorBudget {
    /// Delta T (TT - UT1) used at greatest transit, seconds.
    pub delta_t_s: f64,
    /// Its standard uncertainty, seconds (`None` when fixed with `--delta-t`: counted as
    /// exact).
    pub delta_t_sigma_s: Option<f64>,
    /// Whether Delta T was fixed by the user.
    pub delta_t_fixed: bool,
    /// The parallax's change per second of Delta T, as solved, arcsec per s.
    pub parallax_per_delta_t_arcsec_per_s: Option<f64>,
    /// The same with the planet's offsets held at their fitted values (`None` where they
    /// were held already), arcsec per s.
    pub parallax_per_delta_t_offsets_held_arcsec_per_s: Option<f64>,
    /// The Delta T term: |rate| x its uncertainty (`None` when Delta T was fixed or the rate
    /// could not be computed).
    pub delta_t_arcsec: Option<f64>,
    /// The timings' term (longitudes held at their fitted values), Birge-scaled.
    pub timings_arcsec: f64,
    /// What the longitude corrections add in quadrature (`None` where every longitude is
    /// exact).
    pub longitudes_arcsec: Option<f64>,
    /// The planet's place, where it is held or constrained: the parallax's shift for the
    /// ephemeris's stated accuracy, east and north in quadrature.
    pub planet_place_arcsec: Option<f64>,
    /// The stated uncertainty (timings and longitudes).
    pub stated_arcsec: f64,
    /// The stated uncertainty with the model terms added in quadrature.
    pub with_model_terms_arcsec: f64,
}

/// What the budget needs of the solution.
pub struct Solved<'a> {
    /// The event as solved.
    pub event: &'a TransitEvent,
    /// Every timing of the event.
    pub timings: &'a [Timing],
    /// Those in the solution.
    pub used: &'a [usize],
    /// The parameter set.
    pub params: &'a ParameterSet,
    /// The solution's values.
    pub theta: &'a [f64],
    /// The stated (Birge-scaled) uncertainty of the parallax, arcsec.
    pub parallax_sigma_arcsec: f64,
    /// The factor the uncertainties were scaled by.
    pub sigma_scale: f64,
    /// The parallax's shift for the place's accuracy (east, north), where it was held.
    pub place_shift_arcsec: Option<[f64; 2]>,
}

/// The parallax found by fitting again from the solution's values, or `None`.
fn refit_parallax(
    event: &TransitEvent,
    timings: &[Timing],
    s: &Solved,
    params: &ParameterSet,
) -> Option<f64> {
    let out = fit(event, timings, s.used, params, s.theta);
    (out.converged && out.free[PARALLAX]).then(|| out.theta[PARALLAX])
}

/// The event and its timings recomputed for Delta T changed by `step_s`.
fn with_delta_t(s: &Solved, step_s: f64) -> Option<(TransitEvent, Vec<Timing>)> {
    let model = s.event.time_model();
    let delta_t = model.delta_t_s(s.event.greatest).0;
    let moved = TimeModel {
        delta_t_override_s: Some(delta_t + step_s),
        dut1_s: 0.0,
        ..*model
    };
    let event = TransitEvent::near(s.event.planet, s.event.greatest, &moved)?;
    let mut timings = s.timings.to_vec();
    for t in &mut timings {
        t.observed_h = event
            .elements
            .hours(moved.tt_from_label(t.obs.time_label).ok()?);
    }
    Some((event, timings))
}

/// The parallax's rates per second of Delta T: as solved, and with the planet's offsets
/// held where they were free.
fn delta_t_rates(s: &Solved) -> (Option<f64>, Option<f64>) {
    let Some((event, timings)) = with_delta_t(s, DELTA_T_STEP_S) else {
        return (None, None);
    };
    let base = s.theta[PARALLAX];
    let rate = |p: Option<f64>| p.map(|p| (p - base) / DELTA_T_STEP_S);
    let as_solved = rate(refit_parallax(&event, &timings, s, s.params));
    let offsets_free = [OFFSET_EAST, OFFSET_NORTH].iter().any(|&j| {
        let spec = &s.params.specs()[j];
        !spec.fixed
    });
    let held = offsets_free.then(|| {
        let mut p = s.params.clone();
        for j in [OFFSET_EAST, OFFSET_NORTH] {
            if let Some(spec) = p.spec_mut(j) {
                spec.fixed = true;
            }
        }
        rate(refit_parallax(&event, &timings, s, &p))
    });
    (as_solved, held.flatten())
}

/// The parallax's unscaled uncertainty with every longitude correction held at its fitted
/// value, or `None` where there are none (or the fit fails).
fn sigma_longitudes_held(s: &Solved) -> Option<f64> {
    if !s.params.has_longitude_corrections() {
        return None;
    }
    let mut p = s.params.clone();
    for j in 0..p.len() {
        if let Some(spec) = p.spec_mut(j) {
            if spec.kind == ParameterKind::LongitudeCorrection {
                spec.fixed = true;
            }
        }
    }
    let out = fit(s.event, s.timings, s.used, &p, s.theta);
    let v = out.covariance[(PARALLAX, PARALLAX)];
    (v.is_finite() && v > 0.0).then(|| v.sqrt())
}

/// The error budget of a determined parallax.
pub fn error_budget(s: &Solved) -> ErrorBudget {
    let model = s.event.time_model();
    let (delta_t_s, source) = model.delta_t_s(s.event.greatest);
    let fixed = source == DeltaTSource::Fixed;
    let delta_t_sigma_s = (!fixed).then(|| s.event.delta_t_sigma_s());
    let (rate, rate_held) = delta_t_rates(s);
    let delta_t_arcsec = rate.zip(delta_t_sigma_s).map(|(r, sigma)| r.abs() * sigma);
    let stated = s.parallax_sigma_arcsec;
    let (timings_arcsec, longitudes_arcsec) = match sigma_longitudes_held(s) {
        Some(held) => {
            let t = (held * s.sigma_scale).min(stated);
            (t, Some((stated * stated - t * t).max(0.0).sqrt()))
        }
        None => (stated, None),
    };
    let planet_place_arcsec = s.place_shift_arcsec.map(|[e, n]| e.hypot(n));
    let model_sq =
        delta_t_arcsec.unwrap_or(0.0).powi(2) + planet_place_arcsec.unwrap_or(0.0).powi(2);
    ErrorBudget {
        delta_t_s,
        delta_t_sigma_s,
        delta_t_fixed: fixed,
        parallax_per_delta_t_arcsec_per_s: rate,
        parallax_per_delta_t_offsets_held_arcsec_per_s: rate_held,
        delta_t_arcsec,
        timings_arcsec,
        longitudes_arcsec,
        planet_place_arcsec,
        stated_arcsec: stated,
        with_model_terms_arcsec: (stated * stated + model_sq).sqrt(),
    }
}

impl ErrorBudget {
    /// Sentences that say what the budget means: the Delta T used, how much of a Delta T
    /// error the planet's offsets absorb, and which terms the stated uncertainty leaves out.
    pub fn sentences(&self) -> Vec<String> {
        let mut out = Vec::new();
        let dt = match self.delta_t_sigma_s {
            None => format!("Delta T {:.1} s was fixed with --delta-t and counts as exact; multiply the rate below by your own doubt about it", self.delta_t_s),
            Some(sigma) => format!(
                "Delta T {:.1} s +- {sigma:.1} s (the built-in model's rough uncertainty)",
                self.delta_t_s
            ),
        };
        out.push(dt);
        match (
            self.parallax_per_delta_t_arcsec_per_s,
            self.parallax_per_delta_t_offsets_held_arcsec_per_s,
        ) {
            (Some(r), Some(h)) if r.abs() < h.abs() => {
                out.push(format!(
                    "one second of Delta T moves the parallax by {r:+.6}\" with the planet's offsets free, and by {h:+.6}\" were they held: the offsets absorb {:.1} % of a Delta T error",
                    100.0 * (1.0 - (r / h).abs())
                ));
            }
            (Some(r), Some(h)) => out.push(format!(
                "one second of Delta T moves the parallax by {r:+.6}\" with the planet's offsets free, and by {h:+.6}\" were they held: here the offsets do not absorb it (with times labelled UTC a Delta T error turns the Earth under the path rather than moving the planet along it)"
            )),
            (Some(r), None) => out.push(format!(
                "one second of Delta T moves the parallax by {r:+.6}\" (the planet's offsets are held, so nothing absorbs it)"
            )),
            _ => out.push("the parallax's dependence on Delta T could not be computed (the solution with Delta T changed did not converge)".into()),
        }
        out.push(format!(
            "the stated uncertainty ({:.4}\") covers the timings and the longitudes; the model terms are not in it, and with them added in quadrature it would be {:.4}\"",
            self.stated_arcsec, self.with_model_terms_arcsec
        ));
        out
    }
}
