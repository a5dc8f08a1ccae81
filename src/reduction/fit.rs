//! The fit: Gauss-Newton iteration of the condition equations over a campaign's parameter
//! set, with priors as pseudo-observations and each station's own parameters eliminated block
//! by block.
//!
//! Each step linearises every timing at the current values, tests (once) which parameters the
//! timings can determine, solves the reduced normal equations and applies the corrections.
//! The iteration stops when the parallax changes by less than 1e-6 arcsec and every other
//! parameter by less than 1e-4, or after 40 steps. With longitude corrections (nonlinear and
//! sometimes weakly determined) a step under a thousandth of a global parameter's uncertainty,
//! or a hundredth of a station's own, also counts, and steps are limited and line-searched
//! (`next_theta`).
//!
//! References: P. R. Bevington and D. K. Robinson, *Data Reduction and Error Analysis*, 3rd ed.
//! (2003), chapter 8 (non-linear least squares by linearisation); W. H. Press et al.,
//! *Numerical Recipes*, 3rd ed. (2007), section 15.5.

use super::black_drop::{lag_plan, LagPlan};
use super::equations::{linearise, residual_s, Linearised, Timing};
use super::identifiability::{
    describe_confusion, hold_fixed_what_cannot_be_separated, why_parallax_not_determined, Holding,
};
use super::normal_equations::{reduced_normal, solve, BlockSolution, LinearSystem, LocalPartials};
use super::parameters::{
    ParameterKind, ParameterSet, N_CLASSIC, PARALLAX, RADIUS_DIFFERENCE, RADIUS_SUM,
};
use crate::geometry::transit::TransitEvent;
use nalgebra::{DMatrix, DVector};
use rayon::prelude::*;

/// Fewer rows than this are solved on one thread (a thread costs more than they do).
const PARALLEL_MIN_ROWS: usize = 512;

/// A campaign's condition equations linearised once at given values, to be solved for
/// several choices of free parameters or right-hand sides (the error budget's linear
/// responses: J. Nocedal and S. J. Wright, *Numerical Optimization*, 2nd ed., 2006, section
/// 10.3, on the Gauss-Newton step as the least-squares solution of the linearised system).
pub struct LinearisedCampaign {
    lin: Linearisation,
}

impl LinearisedCampaign {
    /// Linearise the timings `used` at `theta`; `None` when a timing's contact does not occur
    /// there.
    pub fn at(
        event: &TransitEvent,
        (timings, used): (&[Timing], &[usize]),
        params: &ParameterSet,
        theta: &[f64],
    ) -> Option<Self> {
        let lin = linearise_all(event, timings, used, params, theta);
        lin.unsolvable
            .is_empty()
            .then_some(LinearisedCampaign { lin })
    }

    /// Solve the linearised system over the `free` parameters with these residuals (the
    /// timings' own when `None`); `None` when the free parameters are not determined.
    pub fn solve(
        &self,
        params: &ParameterSet,
        (free, theta): (&[bool], &[f64]),
        residuals_s: Option<&DVector<f64>>,
    ) -> Option<BlockSolution> {
        let sys = LinearSystem {
            global: &self.lin.global,
            local: &self.lin.local,
            residuals: residuals_s.unwrap_or(&self.lin.residuals),
            weights: &self.lin.weights,
        };
        solve(&sys, params, free, theta)
    }
}

/// Largest number of Gauss-Newton steps.
pub const MAX_ITERATIONS: usize = 40;

/// The outcome of one fit.
#[derive(Clone, Debug)]
pub struct FitOutcome {
    /// Values of every parameter.
    pub theta: Vec<f64>,
    /// Unscaled covariance of the global parameters (zero rows for fixed ones; all zero when
    /// the fit could not be solved).
    pub covariance: DMatrix<f64>,
    /// Unscaled standard uncertainty of every parameter (`None` for fixed ones).
    pub sigma: Vec<Option<f64>>,
    /// O - C of the timings in the fit, seconds, in the order of `used`.
    pub residuals_s: Vec<f64>,
    /// The design of the global parameters (s per unit), with each station's own parameters
    /// projected out.
    pub jacobian: DMatrix<f64>,
    /// Which parameters were fitted.
    pub free: Vec<bool>,
    /// Gauss-Newton steps taken.
    pub iterations: usize,
    /// Whether the iteration converged.
    pub converged: bool,
    /// Timings whose contact does not occur at their station under the current values.
    pub unsolvable: Vec<usize>,
    /// Sentences for the user (parameters held fixed and why).
    pub messages: Vec<String>,
}

/// The linearised equations of the timings in the fit.
struct Linearisation {
    global: DMatrix<f64>,
    local: Vec<LocalPartials>,
    residuals: DVector<f64>,
    weights: DVector<f64>,
    unsolvable: Vec<usize>,
}

/// Where the iteration stands when it ends.
struct Ending {
    theta: Vec<f64>,
    free: Vec<bool>,
    messages: Vec<String>,
    iterations: usize,
    converged: bool,
}

impl Linearisation {
    fn system(&self) -> LinearSystem<'_> {
        LinearSystem {
            global: &self.global,
            local: &self.local,
            residuals: &self.residuals,
            weights: &self.weights,
        }
    }

    /// The weighted sum of squares of the residuals.
    fn weighted_squares(&self) -> f64 {
        self.residuals
            .iter()
            .zip(self.weights.iter())
            .map(|(r, w)| w * r * r)
            .sum()
    }

    /// The outcome at these values: from the step's solution, or, where it could not be
    /// solved, with zero covariance and no uncertainties.
    fn outcome(self, end: Ending, solution: Option<BlockSolution>, n_params: usize) -> FitOutcome {
        let g = self.global.ncols();
        let residuals_s = self.residuals.iter().copied().collect();
        let (covariance, sigma, jacobian) = match solution {
            Some(sol) => (sol.covariance_global, sol.sigma, sol.projected_global),
            None => (DMatrix::zeros(g, g), vec![None; n_params], self.global),
        };
        FitOutcome {
            theta: end.theta,
            covariance,
            sigma,
            residuals_s,
            jacobian,
            free: end.free,
            iterations: end.iterations,
            converged: end.converged,
            unsolvable: self.unsolvable,
            messages: end.messages,
        }
    }
}

fn linearise_all(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    theta: &[f64],
) -> Linearisation {
    let n_global = params.n_global();
    let er = event.earth_radii_per_arcsec();
    let mut rows = Vec::with_capacity(used.len());
    let mut local = Vec::with_capacity(used.len());
    let mut residuals = Vec::with_capacity(used.len());
    let mut weights = Vec::with_capacity(used.len());
    let mut unsolvable = Vec::new();
    // Each timing's contact is solved on its own: in parallel, gathered in order, so that the
    // system (and every figure from it) is the same on any number of cores.
    let solved: Vec<Option<Linearised>> = used
        .par_iter()
        .with_min_len(PARALLEL_MIN_ROWS)
        .map(|&i| linearise(event, &timings[i], params, theta, er))
        .collect();
    for (&i, lin) in used.iter().zip(solved) {
        let t = &timings[i];
        match lin {
            Some(l) => {
                rows.push((l.global, l.extra));
                local.push(LocalPartials {
                    station: t.station,
                    partials: l.local,
                });
                residuals.push((t.observed_h - l.computed_h) * 3600.0);
                weights.push(1.0 / (t.obs.sigma_s * t.obs.sigma_s));
            }
            None => unsolvable.push(i),
        }
    }
    let global = DMatrix::from_fn(rows.len(), n_global, |i, j| {
        if j < N_CLASSIC {
            rows[i].0[j]
        } else {
            rows[i].1[j - N_CLASSIC]
        }
    });
    Linearisation {
        global,
        local,
        residuals: DVector::from_vec(residuals),
        weights: DVector::from_vec(weights),
        unsolvable,
    }
}

/// Which parameters start free: those not held fixed by the set, less the radius corrections
/// of contact kinds with no timing and the black-drop lags the timings cannot measure; and
/// the sentences that say so.
pub(crate) fn initial_free(
    params: &ParameterSet,
    timings: &[Timing],
    used: &[usize],
) -> (Vec<bool>, Vec<String>) {
    let mut free: Vec<bool> = params.specs().iter().map(|s| !s.fixed).collect();
    let mut messages = Vec::new();
    // An interval between an exterior and an interior contact involves both corrections.
    let involves = |exterior: bool| {
        used.iter().any(|&i| {
            let (first, last) = timings[i].obs.contacts();
            last.is_exterior() == exterior || first.is_some_and(|c| c.is_exterior() == exterior)
        })
    };
    free[RADIUS_SUM] &= involves(true);
    free[RADIUS_DIFFERENCE] &= involves(false);
    if !free[RADIUS_SUM] {
        messages.push("no exterior contact (I or IV) is in the solution, so the correction to the sum of the radii is held at 0".to_string());
    }
    if !free[RADIUS_DIFFERENCE] {
        messages.push("no interior contact (II or III) is in the solution, so the correction to the difference of the radii is held at 0".to_string());
    }
    for (j, plan) in lag_plan(params, timings, used) {
        match plan {
            LagPlan::Fitted(_) => {}
            LagPlan::NotInvolved => free[j] = false,
            LagPlan::Held(why) => {
                free[j] = false;
                messages.push(why);
            }
        }
    }
    (free, messages)
}

/// Hold fixed what the timings cannot determine, and say so.
fn check_rank(
    sys: &LinearSystem,
    params: &ParameterSet,
    (free, theta): (&mut [bool], &[f64]),
    (timings, used): (&[Timing], &[usize]),
    messages: &mut Vec<String>,
) {
    let g = params.n_global();
    let names: Vec<&str> = params.specs()[..g]
        .iter()
        .map(|s| s.name.as_str())
        .collect();
    let Some(normal) = reduced_normal(sys, params, free, theta) else {
        return;
    };
    let before = free[..g].to_vec();
    let separation = hold_fixed_what_cannot_be_separated(&normal, &mut free[..g], &names, PARALLAX);
    let list: Vec<&Timing> = used.iter().map(|&i| &timings[i]).collect();
    let holding = Holding {
        before: &before,
        after: &free[..g],
        names: &names,
    };
    if !separation.confused.is_empty() {
        messages.push(describe_confusion(
            &list,
            &separation.confused,
            &holding.held(),
        ));
    }
    let why = if free[PARALLAX] {
        why_parallax_not_determined(&normal, params, &holding, &separation, &list)
    } else {
        None
    };
    if let Some(why) = why {
        free[PARALLAX] = false;
        messages.push(why);
    }
    if !free[PARALLAX] {
        messages.push("the solar parallax cannot be determined from these timings; it is held at the a-priori value and no result is given".to_string());
    }
}

/// Fit the parameters to the timings `used` (indices into `timings`), starting from `theta0`.
///
/// Arguments: `event`; `timings`; `used`; `params`, the campaign's parameter set; `theta0`,
/// the starting values of every parameter.
/// Returns: the outcome; `unsolvable` lists timings whose contact vanished (the caller drops
/// them and fits again).
pub fn fit(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    theta0: &[f64],
) -> FitOutcome {
    let mut theta = theta0.to_vec();
    let (mut free, mut messages) = initial_free(params, timings, used);
    let mut iterations = 0;
    loop {
        let lin = linearise_all(event, timings, used, params, &theta);
        let end = |theta, free, messages, converged| Ending {
            theta,
            free,
            messages,
            iterations,
            converged,
        };
        if !lin.unsolvable.is_empty() || lin.residuals.is_empty() {
            return lin.outcome(end(theta, free, messages, false), None, params.len());
        }
        if iterations == 0 {
            let sys = lin.system();
            check_rank(
                &sys,
                params,
                (&mut free, &theta),
                (timings, used),
                &mut messages,
            );
        }
        let solution = if free.iter().any(|&f| f) {
            solve(&lin.system(), params, &free, &theta)
        } else {
            None
        };
        let Some(sol) = solution else {
            let converged = !free[PARALLAX];
            return lin.outcome(end(theta, free, messages, converged), None, params.len());
        };
        let converged = iterations > 0 && step_is_small(params, &sol);
        if converged || iterations >= MAX_ITERATIONS {
            if !converged {
                messages.push(still_moving(params, &sol, iterations));
            }
            let ending = end(theta, free, messages, converged);
            return lin.outcome(ending, Some(sol), params.len());
        }
        // The objective at the current values, from this step's own residuals.
        let now = lin.weighted_squares() + params.prior_chi2(&theta, &free).0;
        theta = next_theta(
            event,
            (timings, used),
            params,
            (&theta, &free),
            (&sol.correction, now),
        );
        // Keep the parallax in a physical range while iterating.
        theta[PARALLAX] = theta[PARALLAX].clamp(1.0, 30.0);
        iterations += 1;
    }
}

/// Whether a step is small enough to stop: the parallax by under 1e-6 arcsec and every other
/// parameter by under 1e-4 in its unit. Where stations carry longitude corrections, a step
/// under a thousandth of the parameter's uncertainty (a hundredth for a station's own) also
/// counts: a weakly determined longitude moves by more than 1e-4 degree with the contact
/// solver's last digits alone, and drags the global parameters by as little.
fn step_is_small(params: &ParameterSet, sol: &BlockSolution) -> bool {
    let g = params.n_global();
    let relative = params.has_longitude_corrections();
    sol.correction.iter().enumerate().all(|(j, &c)| {
        let absolute: f64 = if j == PARALLAX { 1e-6 } else { 1e-4 };
        let share = if j < g { 1e-3 } else { 1e-2 };
        let by_sigma = sol.sigma[j].filter(|_| relative).map_or(0.0, |s| share * s);
        c.abs() < absolute.max(by_sigma)
    })
}

/// The sentence for an iteration that did not converge: which parameters were still moving at
/// the last step, and by how much against their uncertainty (the ones the timings determine
/// only weakly, or that a blunder pulls back and forth).
fn still_moving(params: &ParameterSet, sol: &BlockSolution, iterations: usize) -> String {
    let mut moving: Vec<(f64, String)> = sol
        .correction
        .iter()
        .enumerate()
        .filter_map(|(j, &c)| {
            let spec = &params.specs()[j];
            let ratio = sol.sigma[j].map_or(f64::INFINITY, |s| c.abs() / s.max(1e-300));
            (c.abs() >= 1e-4 || j == PARALLAX && c.abs() >= 1e-6)
                .then(|| (ratio, format!("{} ({:+.2e} {})", spec.name, c, spec.unit)))
        })
        .collect();
    moving.sort_by(|a, b| b.0.total_cmp(&a.0));
    let names: Vec<String> = moving.into_iter().take(4).map(|m| m.1).collect();
    format!(
        "the iteration did not converge in {iterations} steps: {} still moved at the last step; these parameters, or the rows that determine them, defeat it",
        names.join(", ")
    )
}

/// Largest step of a longitude correction in one iteration, degrees.
const MAX_LONGITUDE_STEP_DEG: f64 = 2.0;

/// The weighted sum of squares of the used timings' residuals at `theta`, with the priors of
/// the free parameters; infinite where a timing has no computed contact.
fn objective(
    event: &TransitEvent,
    (timings, used): (&[Timing], &[usize]),
    params: &ParameterSet,
    (theta, free): (&[f64], &[bool]),
) -> f64 {
    let er = event.earth_radii_per_arcsec();
    let residuals: Vec<Option<f64>> = used
        .par_iter()
        .with_min_len(PARALLEL_MIN_ROWS)
        .map(|&i| residual_s(event, &timings[i], params, theta, er))
        .collect();
    // Summed in order: the same figure on any number of cores.
    let mut sum = params.prior_chi2(theta, free).0;
    for (&i, r) in used.iter().zip(residuals) {
        match r {
            Some(r) => sum += (r / timings[i].obs.sigma_s).powi(2),
            None => return f64::INFINITY,
        }
    }
    sum
}

/// The next values: `theta` plus the step on the free parameters. Where stations carry
/// longitude corrections (nonlinear, sometimes weakly determined), the step is
/// halved, up to six times, while it would increase the weighted sum of squares: a
/// backtracking line search (J. Nocedal and S. J. Wright, *Numerical Optimization*, 2nd ed.,
/// 2006, section 3.1), which stops Gauss-Newton from oscillating about the minimum.
fn next_theta(
    event: &TransitEvent,
    rows: (&[Timing], &[usize]),
    params: &ParameterSet,
    (theta, free): (&[f64], &[bool]),
    (correction, now): (&DVector<f64>, f64),
) -> Vec<f64> {
    let step = |scale: f64| -> Vec<f64> {
        let mut next = theta.to_vec();
        for j in (0..next.len()).filter(|&j| free[j]) {
            // A longitude correction moves by at most MAX_LONGITUDE_STEP_DEG per iteration: a
            // trust region for longitudes the timings hardly determine.
            let c = scale * correction[j];
            let longitude = params.specs()[j].kind == ParameterKind::LongitudeCorrection;
            next[j] += if longitude {
                c.clamp(-MAX_LONGITUDE_STEP_DEG, MAX_LONGITUDE_STEP_DEG)
            } else {
                c
            };
        }
        next
    };
    if !params.has_longitude_corrections() {
        return step(1.0);
    }
    let mut scale = 1.0;
    for _ in 0..6 {
        let next = step(scale);
        if objective(event, rows, params, (&next, free)) <= now * (1.0 + 1e-12) {
            return next;
        }
        scale *= 0.5;
    }
    step(scale)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::contacts::Contact;
    use crate::observations::timings::Observation;
    use crate::planning::simulation::{global_stations, stations_seeing};
    use crate::reduction::equations::perturbation;
    use crate::{transit_on_date, Planet, TimeModel};

    /// Synthetic timings of Venus 2012 with every visible contact at every station that sees
    /// all four, made from known parameters and known clock errors, without noise.
    fn synthetic(
        truth: &[f64],
        clocks_s: &[(usize, f64)],
    ) -> (crate::TransitEvent, Vec<Timing>, usize) {
        let date = chrono::NaiveDate::from_ymd_opt(2012, 6, 6).unwrap();
        let event = transit_on_date(Planet::Venus, date, &TimeModel::default()).unwrap();
        let stations = stations_seeing(&event, global_stations(120, "s"), 4, 5.0);
        let p = perturbation(truth, event.earth_radii_per_arcsec());
        let mut timings = Vec::new();
        for (k, st) in stations.iter().enumerate() {
            let geo = st.geocentric();
            let clock = clocks_s.iter().find(|c| c.0 == k).map_or(0.0, |c| c.1);
            for c in Contact::ALL {
                let h = event.contact_hours_perturbed(&geo, c, &p).unwrap();
                timings.push(Timing {
                    obs: Observation::instant(
                        timings.len() as u64 + 2,
                        st.clone(),
                        c,
                        chrono::NaiveDateTime::default(),
                        5.0,
                    ),
                    geo,
                    observed_h: h + clock / 3600.0,
                    station: k,
                });
            }
        }
        (event, timings, stations.len())
    }

    #[test]
    fn recovers_global_and_per_station_parameters() {
        // Truth: a parallax 0.1" above the prior, offsets and radius corrections of a few
        // hundredths of an arcsec, and three stations whose clocks are wrong.
        let truth = [8.894_143, 0.03, -0.02, 0.05, -0.04];
        let clocks = [(0, 42.0), (3, -17.5), (7, 6.25)];
        let (event, timings, n_stations) = synthetic(&truth, &clocks);
        assert!(n_stations >= 10, "{n_stations} stations");
        let mut params = ParameterSet::classic(8.794_143);
        let clock_index: Vec<usize> = clocks
            .iter()
            .map(|&(k, _)| {
                let name = timings[4 * k].obs.station.name.clone();
                params.add_station_parameter(k, ParameterSet::clock_offset(&name, None))
            })
            .collect();
        let used: Vec<usize> = (0..timings.len()).collect();
        let out = fit(&event, &timings, &used, &params, &params.start_values());
        assert!(out.converged, "{:?}", out.messages);
        for (j, t) in truth.iter().enumerate() {
            assert!(
                (out.theta[j] - t).abs() < 2e-5,
                "parameter {j}: {} vs {t}",
                out.theta[j]
            );
        }
        for (&j, &(_, c)) in clock_index.iter().zip(&clocks) {
            assert!(
                (out.theta[j] - c).abs() < 1e-3,
                "clock {} vs {c}",
                out.theta[j]
            );
            assert!(out.sigma[j].is_some_and(|s| s > 0.0 && s < 5.0));
        }
        assert!(out.residuals_s.iter().all(|r| r.abs() < 1e-3));
    }

    #[test]
    fn a_prior_on_a_clock_pulls_it_and_is_honoured() {
        // The same campaign with one clock error, fitted with a tight prior of 0 +- 0.01 s on
        // it: the clock stays near 0 and the residuals of that station take up the error.
        let truth = [8.794_143, 0.0, 0.0, 0.0, 0.0];
        let (event, timings, _) = synthetic(&truth, &[(2, 30.0)]);
        let mut params = ParameterSet::classic(8.794_143);
        let prior = crate::reduction::parameters::Prior {
            value: 0.0,
            sigma: 0.01,
        };
        let j = params.add_station_parameter(2, ParameterSet::clock_offset("c", Some(prior)));
        let used: Vec<usize> = (0..timings.len()).collect();
        let out = fit(&event, &timings, &used, &params, &params.start_values());
        assert!(out.theta[j].abs() < 0.1, "clock {}", out.theta[j]);
        let station_rows: Vec<f64> = used
            .iter()
            .zip(&out.residuals_s)
            .filter(|(&i, _)| timings[i].station == 2)
            .map(|(_, r)| *r)
            .collect();
        assert!(
            station_rows.iter().all(|r| r.abs() > 10.0),
            "{station_rows:?}"
        );
    }
}
