//! The error budget of the parallax: what the stated uncertainty is made of (the timings, the
//! station longitudes) and the model terms it leaves out (Delta T, the planet's place where
//! it is held), each as its effect on the parallax in arcseconds.
//!
//! The Delta T term is the parallax's change per second of Delta T, times the uncertainty of
//! Delta T. The change is the linear response of the solution to the change of every O - C
//! when the event and the timings are computed for Delta T + 10 s (the response is linear
//! over far more than that): one more evaluation of the contacts and one solve of the
//! normal equations already formed. A Delta T error turns the Earth under the
//! planet's path (times labelled UTC) or moves every timing along the path (times labelled
//! UT1, before 1972); both look much like a shift of the planet along its path, so where the
//! planet's offsets are free they absorb most of it. The same rate with the offsets held at
//! their fitted values measures how much.
//!
//! The timing and longitude terms split the stated variance: the timing term is the
//! parallax's uncertainty with every longitude correction held at its fitted value (the same
//! normal equations, those parameters held), the longitude term what the corrections'
//! freedom adds in quadrature.
//!
//! References: the propagation of a model parameter's error by its partial derivative:
//! JCGM 100:2008 (GUM), section 5.1; Delta T and its uncertainty: see `time::delta_t` (the
//! reconstruction of Morrison, Stephenson, Hohenkerk and Zawilski 2021, IERS observations and
//! predictions, the spread of published predictions).

use super::equations::{residual_s, Timing};
use super::fit::LinearisedCampaign;
use super::parameters::{ParameterKind, ParameterSet, OFFSET_EAST, OFFSET_NORTH, PARALLAX};
use crate::geometry::contacts::Contact;
use crate::geometry::transit::TransitEvent;
use crate::time::scales::{DeltaTSource, TimeModel};
use nalgebra::DVector;
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
    /// Where Delta T came from.
    pub delta_t_source: DeltaTSource,
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
    /// The change of every global parameter (in its unit) per second of black drop (contact
    /// II seen one second late and III one second early at every station), by the same linear
    /// response; `None` when it could not be computed.
    pub per_black_drop_s: Option<Vec<f64>>,
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
    /// Which parameters the solution fitted.
    pub free: &'a [bool],
    /// The stated (Birge-scaled) uncertainty of the parallax, arcsec.
    pub parallax_sigma_arcsec: f64,
    /// The factor the uncertainties were scaled by.
    pub sigma_scale: f64,
    /// The parallax's shift for the place's accuracy (east, north), where it was held.
    pub place_shift_arcsec: Option<[f64; 2]>,
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
    // An interval's length does not depend on Delta T.
    for t in timings.iter_mut().filter(|t| !t.is_interval()) {
        t.observed_h = event
            .elements
            .hours(moved.tt_from_label(t.obs.time_label).ok()?);
    }
    Some((event, timings))
}

/// The timings' O - C (seconds, in the order of `used`) when the event and the timings are
/// recomputed for Delta T + [`DELTA_T_STEP_S`], at the solution's values. One Gauss-Newton
/// step from the solution with these residuals is the solution's linear response: at the
/// solution the normal equations' right-hand side with the original residuals (and the
/// priors) is zero, so what is left is that of the change alone.
fn residuals_moved(s: &Solved) -> Option<DVector<f64>> {
    let (event, timings) = with_delta_t(s, DELTA_T_STEP_S)?;
    let er = event.earth_radii_per_arcsec();
    let moved: Option<Vec<f64>> = s
        .used
        .iter()
        .map(|&i| residual_s(&event, &timings[i], s.params, s.theta, er))
        .collect();
    Some(DVector::from_vec(moved?))
}

/// The parallax's change per second of Delta T, as the linear response of the solution with
/// these parameters free (held ones stay at their solved values, where the rest's normal
/// equations are balanced too).
fn rate(s: &Solved, lin: &LinearisedCampaign, free: &[bool], change: &DVector<f64>) -> Option<f64> {
    let sol = lin.solve(s.params, (free, s.theta), Some(change))?;
    Some(sol.correction[PARALLAX] / DELTA_T_STEP_S)
}

/// The free flags with every parameter that `drop` picks held.
fn holding(s: &Solved, drop: impl Fn(ParameterKind) -> bool) -> Vec<bool> {
    s.free
        .iter()
        .zip(s.params.specs())
        .map(|(&f, spec)| f && !drop(spec.kind))
        .collect()
}

/// The parallax's rates per second of Delta T: as solved, and with the planet's offsets
/// held where they were free.
fn delta_t_rates(s: &Solved, lin: &LinearisedCampaign) -> (Option<f64>, Option<f64>) {
    let Some(change) = residuals_moved(s) else {
        return (None, None);
    };
    let offset = |k: ParameterKind| {
        k == ParameterKind::Classic(OFFSET_EAST) || k == ParameterKind::Classic(OFFSET_NORTH)
    };
    let as_solved = rate(s, lin, s.free, &change);
    let offsets_free = s.free[OFFSET_EAST] || s.free[OFFSET_NORTH];
    let held = offsets_free
        .then(|| rate(s, lin, &holding(s, offset), &change))
        .flatten();
    (as_solved, held)
}

/// The parallax's unscaled uncertainty with every longitude correction held at its fitted
/// value, or `None` where there are none (or the system cannot be solved).
fn sigma_longitudes_held(s: &Solved, lin: &LinearisedCampaign) -> Option<f64> {
    if !s.params.has_longitude_corrections() {
        return None;
    }
    let free = holding(s, |k| k == ParameterKind::LongitudeCorrection);
    let sol = lin.solve(s.params, (&free, s.theta), None)?;
    let v = sol.covariance_global[(PARALLAX, PARALLAX)];
    (v.is_finite() && v > 0.0).then(|| v.sqrt())
}

/// The global parameters' change per second of black drop: contact II seen one second late
/// and III one second early at every station (O - C of II up by one second, of III down).
fn black_drop_response(s: &Solved, lin: &LinearisedCampaign) -> Option<Vec<f64>> {
    let er = s.event.earth_radii_per_arcsec();
    let moved: Option<Vec<f64>> = s
        .used
        .iter()
        .map(|&i| {
            let t = &s.timings[i];
            let seen = |c: Contact| match c {
                Contact::II => 1.0,
                Contact::III => -1.0,
                _ => 0.0,
            };
            let (first, last) = t.obs.contacts();
            let drop = seen(last) - first.map_or(0.0, seen);
            residual_s(s.event, t, s.params, s.theta, er).map(|r| r + drop)
        })
        .collect();
    let sol = lin.solve(
        s.params,
        (s.free, s.theta),
        Some(&DVector::from_vec(moved?)),
    )?;
    Some(
        sol.correction
            .iter()
            .take(s.params.n_global())
            .copied()
            .collect(),
    )
}

/// The error budget of a determined parallax.
pub fn error_budget(s: &Solved) -> ErrorBudget {
    let model = s.event.time_model();
    let (delta_t_s, source) = model.delta_t_s(s.event.greatest);
    let fixed = source == DeltaTSource::Fixed;
    let delta_t_sigma_s = (!fixed).then(|| s.event.delta_t_sigma_s());
    let lin = LinearisedCampaign::at(s.event, (s.timings, s.used), s.params, s.theta);
    let (rate, rate_held) = lin
        .as_ref()
        .map_or((None, None), |lin| delta_t_rates(s, lin));
    let delta_t_arcsec = rate.zip(delta_t_sigma_s).map(|(r, sigma)| r.abs() * sigma);
    let stated = s.parallax_sigma_arcsec;
    let (timings_arcsec, longitudes_arcsec) =
        match lin.as_ref().and_then(|l| sigma_longitudes_held(s, l)) {
            Some(held) => {
                let t = (held * s.sigma_scale).min(stated);
                (t, Some((stated * stated - t * t).max(0.0).sqrt()))
            }
            None => (stated, None),
        };
    let planet_place_arcsec = s.place_shift_arcsec.map(|[e, n]| e.hypot(n));
    let per_black_drop_s = lin.as_ref().and_then(|l| black_drop_response(s, l));
    let model_sq =
        delta_t_arcsec.unwrap_or(0.0).powi(2) + planet_place_arcsec.unwrap_or(0.0).powi(2);
    ErrorBudget {
        delta_t_s,
        delta_t_sigma_s,
        delta_t_fixed: fixed,
        delta_t_source: source,
        parallax_per_delta_t_arcsec_per_s: rate,
        parallax_per_delta_t_offsets_held_arcsec_per_s: rate_held,
        delta_t_arcsec,
        timings_arcsec,
        longitudes_arcsec,
        planet_place_arcsec,
        stated_arcsec: stated,
        with_model_terms_arcsec: (stated * stated + model_sq).sqrt(),
        per_black_drop_s,
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
                "Delta T {:.1} s +- {} s, from {}",
                self.delta_t_s,
                crate::words::uncertainty(sigma),
                self.delta_t_source.describe()
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
