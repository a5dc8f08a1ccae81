//! The reduction: from contact timings to the solar parallax and the astronomical unit.
//!
//! One condition equation per timing: O - C (s) = sum_j (dt/dp_j) dp_j over the parameters
//! p = (solar parallax; the planet's offset from its predicted place relative to the Sun, east
//! and north; corrections to the sum of the radii, for contacts I and IV, and to their
//! difference, for II and III), all in arcseconds. The computed times C and the partial
//! derivatives come from the event's elements (implicit differentiation of the contact
//! condition; `contacts::contact_partials`), and the solution iterates (Gauss-Newton) until the
//! parallax changes by less than 1e-6 arcsec. Outliers are rejected one at a time against a
//! robust scale (1.4826 x the median absolute deviation of the normalised residuals), and every
//! rejected row is diagnosed where a known blunder fits.
//!
//! References: J. F. Encke, *Die Entfernung der Sonne von der Erde aus dem Venusdurchgange von
//! 1761* (1822) and *... von 1769* (1824): the condition equations; S. Newcomb, *Astronomical
//! Papers of the American Ephemeris* II (1891); P. R. Bevington and D. K. Robinson, *Data
//! Reduction and Error Analysis*, 3rd ed. (2003), chapter 8 (non-linear least squares);
//! R. T. Birge, Phys. Rev. 40, 207 (1932).

use crate::error::{Error, Result};
use crate::geometry::besselian::check_parallax;
use crate::geometry::contacts::{
    contact_partials, offset_on_plane, sun_alt_az_parallactic, Contact, Perturbation,
};
use crate::geometry::station::GeocentricStation;
use crate::geometry::transit::{transit_on_date, TransitEvent};
use crate::observations::timings::{Observation, ObservationSet, RejectReason, Rejected};
use crate::reduction::diagnosis::{clock_offset_s, explain_row, explain_station, StationTiming};
use crate::reduction::least_squares::{
    confounded, median, robust_sigma, solve_weighted, statistics, FitStatistics,
};
use crate::sky::constants::{au_km_from_parallax_arcsec, nominal_parallax_arcsec, ARCSEC_RAD};
use crate::sky::ephemeris::Planet;
use crate::time::scales::TimeModel;
use nalgebra::{DMatrix, DVector};
use serde::Serialize;

/// Number of fitted parameters.
pub const N_PARAMS: usize = 5;

/// Parameter names, in order.
pub const PARAMETER_NAMES: [&str; N_PARAMS] = [
    "solar_parallax",
    "planet_offset_east",
    "planet_offset_north",
    "radius_sum_correction",
    "radius_difference_correction",
];

/// How far from greatest transit a timing may lie and still belong to the event, hours.
pub const EVENT_WINDOW_H: f64 = 36.0;

/// The Sun's true altitude below which a timing is taken as made with the Sun set (degrees):
/// refraction (~0.6 deg) and the semidiameter (~0.27 deg) still show the limb at -0.9 deg.
pub const MIN_VISIBLE_ALTITUDE_DEG: f64 = -1.0;

/// Settings of a reduction.
#[derive(Clone, Copy, Debug)]
pub struct ReduceOptions {
    /// The event; inferred from the timings when `None`.
    pub event: Option<(Planet, chrono::NaiveDate)>,
    /// The a-priori solar parallax, arcsec.
    pub prior_parallax_arcsec: f64,
    /// Delta T and DUT1.
    pub time_model: TimeModel,
    /// Rejection threshold in robust standard deviations.
    pub outlier_threshold: f64,
    /// Whether to follow the solution as timings are added (for the report's convergence
    /// chart; Monte Carlo forecasts leave it out for speed).
    pub follow_convergence: bool,
}

impl Default for ReduceOptions {
    fn default() -> Self {
        ReduceOptions {
            event: None,
            prior_parallax_arcsec: nominal_parallax_arcsec(),
            time_model: TimeModel::default(),
            outlier_threshold: 5.0,
            follow_convergence: true,
        }
    }
}

/// A fitted (or fixed) parameter.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Parameter {
    /// Name (see [`PARAMETER_NAMES`]).
    pub name: String,
    /// Value.
    pub value: f64,
    /// Standard uncertainty (scaled by the Birge ratio when above 1); `None` if held fixed.
    pub sigma: Option<f64>,
    /// Unit.
    pub unit: String,
    /// Whether the data could not determine it and it was held at its a-priori value.
    pub fixed: bool,
}

/// The Halley chord of one station: the planet's apparent path across the disc between a pair
/// of contacts.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Chord {
    /// "interior" (II-III) or "exterior" (I-IV).
    pub pair: String,
    /// Path length between the observed contacts, arcsec.
    pub observed_arcsec: f64,
    /// Path length between the predicted contacts (fitted parameters), arcsec.
    pub predicted_arcsec: f64,
    /// Duration observed minus predicted, seconds.
    pub duration_o_c_s: f64,
    /// Closest approach of the station's path to the Sun's centre minus the geocentric
    /// path's, arcsec (positive: displaced away from the centre by parallax).
    pub parallax_displacement_arcsec: f64,
}

/// One station's part in the solution.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct StationContribution {
    /// Name.
    pub station: String,
    /// Latitude, degrees.
    pub latitude_deg: f64,
    /// Longitude, degrees east.
    pub longitude_deg: f64,
    /// Elevation, metres.
    pub elevation_m: f64,
    /// Timings used.
    pub timings: usize,
    /// Share of the information on the parallax (the stations' shares sum to 1).
    pub information_share: f64,
    /// Change of the parallax if the station is left out, arcsec (`None` when the rest cannot
    /// determine it).
    pub influence_arcsec: Option<f64>,
    /// O - C of the used timings, seconds, in the order of `contacts`.
    pub residuals_s: Vec<f64>,
    /// The contacts of those timings.
    pub contacts: Vec<u8>,
    /// Mean of the normalised residuals (O - C)/sigma.
    pub mean_normalised_residual: f64,
    /// The Halley chord, where a pair of contacts was timed.
    pub chord: Option<Chord>,
}

/// The result of a reduction.
#[derive(Clone, Debug)]
pub struct Reduction {
    /// The event.
    pub event: TransitEvent,
    /// The a-priori parallax, arcsec.
    pub prior_parallax_arcsec: f64,
    /// The solar parallax (None when the timings cannot determine it).
    pub parallax_arcsec: Option<f64>,
    /// Its standard uncertainty.
    pub parallax_sigma_arcsec: Option<f64>,
    /// 95 % interval of the parallax.
    pub parallax_interval_95: Option<(f64, f64)>,
    /// The AU in km.
    pub au_km: Option<f64>,
    /// Its standard uncertainty, km: half the width of the exact image of pi -+ sigma.
    pub au_sigma_km: Option<f64>,
    /// 95 % interval of the AU (exact mapping of the parallax interval), km.
    pub au_interval_95_km: Option<(f64, f64)>,
    /// Data rows read.
    pub timings_total: usize,
    /// Timings in the solution.
    pub timings_used: usize,
    /// Rows not used, by line.
    pub rejected: Vec<Rejected>,
    /// Stations ranked by information share.
    pub stations: Vec<StationContribution>,
    /// All parameters.
    pub parameters: Vec<Parameter>,
    /// Correlation matrix of the parameters (fixed ones have zero rows).
    pub correlation: Vec<Vec<f64>>,
    /// Chi-square statistics.
    pub statistics: FitStatistics,
    /// Robust scale of the normalised residuals of the used timings.
    pub robust_scatter: f64,
    /// Gauss-Newton iterations of the final fit.
    pub iterations: usize,
    /// Sentences the user must read (identifiability, scaling, convergence).
    pub warnings: Vec<String>,
    /// Rows used, with their final residuals (line, station, contact, O - C s, sigma s).
    pub used: Vec<UsedTiming>,
    /// How the parallax firmed up as timings were added in file order.
    pub convergence: Vec<ConvergencePoint>,
}

/// The result in one place: parallax and AU with their uncertainties and 95 % intervals.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Headline {
    /// Solar parallax, arcsec.
    pub parallax_arcsec: f64,
    /// Its standard uncertainty, arcsec.
    pub parallax_sigma_arcsec: f64,
    /// 95 % interval, arcsec.
    pub parallax_interval_95: (f64, f64),
    /// AU, km.
    pub au_km: f64,
    /// Its standard uncertainty, km.
    pub au_sigma_km: f64,
    /// 95 % interval, km.
    pub au_interval_95_km: (f64, f64),
}

impl Reduction {
    /// The headline numbers, when the parallax was determined.
    pub fn headline(&self) -> Option<Headline> {
        let p = self.parallax_arcsec?;
        let au = self.au_km?;
        Some(Headline {
            parallax_arcsec: p,
            parallax_sigma_arcsec: self.parallax_sigma_arcsec?,
            parallax_interval_95: self.parallax_interval_95.unwrap_or((p, p)),
            au_km: au,
            au_sigma_km: self.au_sigma_km?,
            au_interval_95_km: self.au_interval_95_km.unwrap_or((au, au)),
        })
    }

    /// The fitted parameters as changes to the elements.
    pub fn perturbation(&self) -> Perturbation {
        let mut theta = [0.0; N_PARAMS];
        for (t, p) in theta.iter_mut().zip(&self.parameters) {
            *t = p.value;
        }
        perturbation(&theta, self.event.earth_radii_per_arcsec())
    }
}

/// The solution after the first `timings` used timings (in the order of the file).
#[derive(Clone, Copy, Debug, PartialEq, Serialize)]
pub struct ConvergencePoint {
    /// Number of timings in this partial solution.
    pub timings: usize,
    /// Parallax, arcsec.
    pub parallax_arcsec: f64,
    /// Its standard uncertainty (Birge-scaled), arcsec.
    pub sigma_arcsec: f64,
}

/// A timing in the solution.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct UsedTiming {
    /// Line in the file.
    pub line: u64,
    /// Station name.
    pub station: String,
    /// Contact 1-4.
    pub contact: u8,
    /// O - C, seconds.
    pub o_c_s: f64,
    /// Standard uncertainty used, seconds.
    pub sigma_s: f64,
}

struct Timing {
    obs: Observation,
    geo: GeocentricStation,
    observed_h: f64,
}

struct FitOutcome {
    theta: [f64; N_PARAMS],
    covariance: DMatrix<f64>,
    residuals_s: Vec<f64>,
    jacobian: DMatrix<f64>,
    free: [bool; N_PARAMS],
    iterations: usize,
    converged: bool,
    unsolvable: Vec<usize>,
    messages: Vec<String>,
}

/// Parameters to element changes.
fn perturbation(theta: &[f64; N_PARAMS], er_per_arcsec: f64) -> Perturbation {
    let pi0 = nominal_parallax_arcsec() * ARCSEC_RAD;
    Perturbation {
        length_scale: pi0.sin() / (theta[0] * ARCSEC_RAD).sin(),
        dx_er: theta[1] * er_per_arcsec,
        dy_er: theta[2] * er_per_arcsec,
        dl_ext_er: theta[3] * er_per_arcsec,
        dl_int_er: theta[4] * er_per_arcsec,
    }
}

/// Computed time (hours) and the row of the design matrix (s per arcsec).
fn model_row(
    event: &TransitEvent,
    t: &Timing,
    theta: &[f64; N_PARAMS],
    er: f64,
) -> Option<(f64, [f64; N_PARAMS])> {
    condition_row_with(event, &t.geo, t.obs.contact, theta, er)
}

/// A contact's computed time (hours from the elements' epoch) and its condition-equation row:
/// the partial derivatives of the contact time (seconds) with respect to the parameters of
/// [`PARAMETER_NAMES`] (per arcsecond), at parameter values `theta`.
pub fn condition_row(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
    theta: &[f64; N_PARAMS],
) -> Option<(f64, [f64; N_PARAMS])> {
    condition_row_with(event, geo, contact, theta, event.earth_radii_per_arcsec())
}

fn condition_row_with(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
    theta: &[f64; N_PARAMS],
    er: f64,
) -> Option<(f64, [f64; N_PARAMS])> {
    let p = perturbation(theta, er);
    let h = event.contact_hours_perturbed(geo, contact, &p)?;
    let d = contact_partials(&event.elements, Some(geo), contact, h, &p);
    let pi = theta[0] * ARCSEC_RAD;
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

/// The nominal parameter values (IAU parallax, no corrections).
pub fn nominal_theta() -> [f64; N_PARAMS] {
    [nominal_parallax_arcsec(), 0.0, 0.0, 0.0, 0.0]
}

fn describe_confusion(timings: &[&Timing], names: &[&str]) -> String {
    let mut stations: Vec<&GeocentricStation> = Vec::new();
    let mut names_seen: Vec<&str> = Vec::new();
    for t in timings {
        if !names_seen.contains(&t.obs.station.name.as_str()) {
            names_seen.push(&t.obs.station.name);
            stations.push(&t.geo);
        }
    }
    let mut kinds: Vec<Contact> = timings.iter().map(|t| t.obs.contact).collect();
    kinds.sort();
    kinds.dedup();
    let mut spread_km: f64 = 0.0;
    for a in &stations {
        for b in &stations {
            let d = ((a.rho_cos_phi * a.longitude_rad.cos()
                - b.rho_cos_phi * b.longitude_rad.cos())
            .powi(2)
                + (a.rho_cos_phi * a.longitude_rad.sin() - b.rho_cos_phi * b.longitude_rad.sin())
                    .powi(2)
                + (a.rho_sin_phi - b.rho_sin_phi).powi(2))
            .sqrt()
                * 6378.1366;
            spread_km = spread_km.max(d);
        }
    }
    let why = if stations.len() == 1 {
        "all the timings come from one station".to_string()
    } else if spread_km < 1000.0 {
        format!("all the stations lie within {spread_km:.0} km of each other")
    } else if kinds.len() == 1 {
        format!("only contact {} was timed", kinds[0].roman())
    } else {
        "the stations' geometry does not separate them".to_string()
    };
    format!(
        "the timings cannot tell apart {}: {why}. Those that could not be determined are held at their a-priori values. Stations far apart in latitude that time both ingress and egress (durations, Halley's method), or far apart in longitude that time the same contact (Delisle's method), would separate them",
        names.join(", ")
    )
}

fn fit(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    theta0: [f64; N_PARAMS],
) -> FitOutcome {
    let er = event.earth_radii_per_arcsec();
    let mut theta = theta0;
    let mut free = [true; N_PARAMS];
    free[3] = used.iter().any(|&i| timings[i].obs.contact.is_exterior());
    free[4] = used.iter().any(|&i| !timings[i].obs.contact.is_exterior());
    let mut messages = Vec::new();
    if !free[3] {
        messages.push("no exterior contact (I or IV) is in the solution, so the correction to the sum of the radii is held at 0".to_string());
    }
    if !free[4] {
        messages.push("no interior contact (II or III) is in the solution, so the correction to the difference of the radii is held at 0".to_string());
    }
    let mut rank_checked = false;
    let mut iterations = 0;
    let mut converged = false;
    loop {
        let mut rows: Vec<[f64; N_PARAMS]> = Vec::with_capacity(used.len());
        let mut residuals = Vec::with_capacity(used.len());
        let mut weights = Vec::with_capacity(used.len());
        let mut unsolvable = Vec::new();
        for &i in used {
            let t = &timings[i];
            match model_row(event, t, &theta, er) {
                Some((h, row)) => {
                    rows.push(row);
                    residuals.push((t.observed_h - h) * 3600.0);
                    weights.push(1.0 / (t.obs.sigma_s * t.obs.sigma_s));
                }
                None => unsolvable.push(i),
            }
        }
        let n = rows.len();
        let jac = DMatrix::from_fn(n, N_PARAMS, |i, j| rows[i][j]);
        let r = DVector::from_vec(residuals.clone());
        let w = DVector::from_vec(weights);
        if !unsolvable.is_empty() || n == 0 {
            return FitOutcome {
                theta,
                covariance: DMatrix::zeros(N_PARAMS, N_PARAMS),
                residuals_s: residuals,
                jacobian: jac,
                free,
                iterations,
                converged: false,
                unsolvable,
                messages,
            };
        }
        if !rank_checked {
            let mut confused: Vec<&str> = Vec::new();
            while let Some(v) = confounded(&jac, &w, &free) {
                let involved: Vec<&str> = (0..N_PARAMS)
                    .filter(|&j| free[j] && v[j].abs() > 0.05)
                    .map(|j| PARAMETER_NAMES[j])
                    .collect();
                for name in involved {
                    if !confused.contains(&name) {
                        confused.push(name);
                    }
                }
                let nuisance = (1..N_PARAMS)
                    .filter(|&j| free[j])
                    .max_by(|&a, &b| v[a].abs().total_cmp(&v[b].abs()));
                match nuisance {
                    Some(j) if v[j].abs() > 1e-3 => free[j] = false,
                    _ => {
                        free[0] = false;
                        break;
                    }
                }
            }
            if !confused.is_empty() {
                let list: Vec<&Timing> = used.iter().map(|&i| &timings[i]).collect();
                messages.push(describe_confusion(&list, &confused));
            }
            if !free[0] {
                messages.push("the solar parallax cannot be determined from these timings; it is held at the a-priori value and no result is given".to_string());
            }
            rank_checked = true;
        }
        let solution = if free.iter().any(|&f| f) {
            solve_weighted(&jac, &r, &w, &free)
        } else {
            None
        };
        let Some(sol) = solution else {
            return FitOutcome {
                theta,
                covariance: DMatrix::zeros(N_PARAMS, N_PARAMS),
                residuals_s: residuals,
                jacobian: jac,
                free,
                iterations,
                converged: !free[0],
                unsolvable,
                messages,
            };
        };
        let step_pi = sol.correction[0];
        if iterations > 0
            && step_pi.abs() < 1e-6
            && sol.correction.iter().skip(1).all(|c| c.abs() < 1e-4)
        {
            converged = true;
        }
        if converged || iterations >= 40 {
            return FitOutcome {
                theta,
                covariance: sol.covariance,
                residuals_s: residuals,
                jacobian: jac,
                free,
                iterations,
                converged,
                unsolvable,
                messages,
            };
        }
        for j in 0..N_PARAMS {
            if free[j] {
                theta[j] += sol.correction[j];
            }
        }
        // Keep the parallax in a physical range while iterating.
        theta[0] = theta[0].clamp(1.0, 30.0);
        iterations += 1;
    }
}

fn infer_event(valid: &[Observation], model: &TimeModel) -> Result<TransitEvent> {
    let mut times: Vec<chrono::NaiveDateTime> = valid.iter().map(|o| o.time_label).collect();
    if times.is_empty() {
        return Err(Error::argument(
            "no valid timing to reduce; see the rejected rows",
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
/// Errors: an invalid prior parallax; no event found; no usable timing.
pub fn reduce(set: ObservationSet, options: &ReduceOptions) -> Result<Reduction> {
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
    let er = event.earth_radii_per_arcsec();
    let mut rejected = set.rejected.clone();
    let greatest_h = event.hours_of_greatest();
    let mut timings: Vec<Timing> = Vec::new();
    for obs in set.valid.iter().cloned() {
        let tt = model.tt_from_label(obs.time_label)?;
        let observed_h = event.elements.hours(tt);
        if (observed_h - greatest_h).abs() > EVENT_WINDOW_H {
            rejected.push(Rejected {
                line: obs.line,
                station: obs.station.name.clone(),
                contact: Some(obs.contact.number()),
                reason: RejectReason::Invalid,
                diagnosis: Some(format!(
                    "the time is {:.1} days from greatest transit ({}); it cannot belong to this event",
                    (observed_h - greatest_h) / 24.0,
                    event.greatest_utc()
                )),
                o_c_s: None,
            });
            continue;
        }
        let geo = obs.station.geocentric();
        timings.push(Timing {
            obs,
            geo,
            observed_h,
        });
    }

    let theta_prior = [options.prior_parallax_arcsec, 0.0, 0.0, 0.0, 0.0];
    // Sort: visible and computable timings go forward; the rest wait for diagnosis.
    let mut candidates: Vec<usize> = Vec::new();
    let mut not_visible: Vec<(usize, f64)> = Vec::new();
    let mut no_contact: Vec<usize> = Vec::new();
    let mut prior_residual_s = vec![0.0; timings.len()];
    for (i, t) in timings.iter().enumerate() {
        let alt = if event.elements.covers(t.observed_h) {
            sun_alt_az_parallactic(&event.elements, &t.geo, t.observed_h).0
        } else {
            f64::NAN
        };
        match model_row(&event, t, &theta_prior, er) {
            None => no_contact.push(i),
            Some((h, _)) => {
                prior_residual_s[i] = (t.observed_h - h) * 3600.0;
                if alt.is_finite() && alt < MIN_VISIBLE_ALTITUDE_DEG {
                    not_visible.push((i, alt));
                } else {
                    candidates.push(i);
                }
            }
        }
    }

    // Pre-screen gross blunders at the prior: per contact, distance from the median O - C
    // against a robust scale, with a floor of 10 minutes.
    let mut outliers: Vec<usize> = Vec::new();
    if candidates.len() >= 5 {
        let mut med = [0.0; 4];
        for c in Contact::ALL {
            let v: Vec<f64> = candidates
                .iter()
                .filter(|&&i| timings[i].obs.contact == c)
                .map(|&i| prior_residual_s[i])
                .collect();
            med[c.index()] = median(&v);
        }
        let z: Vec<f64> = candidates
            .iter()
            .map(|&i| {
                (prior_residual_s[i] - med[timings[i].obs.contact.index()]) / timings[i].obs.sigma_s
            })
            .collect();
        let s0 = robust_sigma(&z).max(0.5);
        let keep: Vec<usize> = candidates
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
        candidates = keep;
    }

    // Fit, then reject the worst timing while it lies beyond the threshold.
    let mut used = candidates;
    let max_rejections = (used.len() as f64 * 0.3).floor() as usize;
    let mut rejected_by_fit = 0;
    let mut outcome = fit(&event, &timings, &used, theta_prior);
    let mut scatter;
    loop {
        if !outcome.unsolvable.is_empty() {
            for &i in &outcome.unsolvable {
                no_contact.push(i);
            }
            used.retain(|i| !outcome.unsolvable.contains(i));
            outcome = fit(&event, &timings, &used, theta_prior);
            continue;
        }
        let z: Vec<f64> = used
            .iter()
            .zip(&outcome.residuals_s)
            .map(|(&i, r)| r / timings[i].obs.sigma_s)
            .collect();
        scatter = robust_sigma(&z).max(0.5);
        let n_free = outcome.free.iter().filter(|&&f| f).count();
        // Sigma clipping against the robust scale: every timing beyond the threshold goes in
        // one round (the robust scale is not inflated by the outliers it is meant to find).
        let limit = options.outlier_threshold * scatter;
        let mut beyond: Vec<usize> = (0..used.len()).filter(|&k| z[k].abs() > limit).collect();
        let room = max_rejections
            .saturating_sub(rejected_by_fit)
            .min(used.len().saturating_sub(n_free + 2));
        if beyond.is_empty() || room == 0 {
            break;
        }
        beyond.sort_by(|&a, &b| z[b].abs().total_cmp(&z[a].abs()));
        beyond.truncate(room);
        beyond.sort_unstable();
        for &k in beyond.iter().rev() {
            outliers.push(used.remove(k));
            rejected_by_fit += 1;
        }
        outcome = fit(&event, &timings, &used, outcome.theta);
    }

    let residual_at = |i: usize, theta: &[f64; N_PARAMS]| -> Option<f64> {
        model_row(&event, &timings[i], theta, er).map(|(h, _)| (timings[i].observed_h - h) * 3600.0)
    };
    // Station-wide blunders (longitude sign, latitude and longitude exchanged, clock): a
    // station at least half of whose timings could not be used is tested as a whole.
    let mut station_rows: Vec<(Vec<usize>, String)> = Vec::new();
    {
        let p_now = perturbation(&outcome.theta, er);
        let not_used = |i: usize| {
            outliers.contains(&i)
                || not_visible.iter().any(|(j, _)| *j == i)
                || no_contact.contains(&i)
        };
        let mut names: Vec<&str> = timings
            .iter()
            .map(|t| t.obs.station.name.as_str())
            .collect();
        names.sort();
        names.dedup();
        for name in names {
            let rows: Vec<usize> = (0..timings.len())
                .filter(|&i| timings[i].obs.station.name == name)
                .collect();
            let bad = rows.iter().filter(|&&i| not_used(i)).count();
            if bad == 0 || 2 * bad < rows.len() {
                // A clock error can hide below the rejection threshold, partly absorbed by the
                // fit: test every station with two or more timings for a common offset.
                if rows.len() >= 2 {
                    let res: Option<Vec<f64>> = rows
                        .iter()
                        .map(|&i| residual_at(i, &outcome.theta))
                        .collect();
                    let sig: Vec<f64> = rows.iter().map(|&i| timings[i].obs.sigma_s).collect();
                    if let Some(offset) = res
                        .and_then(|r| clock_offset_s(&r, &sig, scatter, options.outlier_threshold))
                    {
                        station_rows.push((
                            rows.clone(),
                            format!(
                                "all {} timings of station '{}' are off by about {offset:+.1} s: its clock was probably wrong by that much",
                                rows.len(),
                                name
                            ),
                        ));
                    }
                }
                continue;
            }
            let st_rows: Vec<StationTiming> = rows
                .iter()
                .map(|&i| StationTiming {
                    contact: timings[i].obs.contact,
                    observed_h: timings[i].observed_h,
                    sigma_s: timings[i].obs.sigma_s,
                })
                .collect();
            if let Some(d) = explain_station(
                &event,
                &timings[rows[0]].obs.station,
                &st_rows,
                &p_now,
                scatter,
                options.outlier_threshold,
            ) {
                station_rows.push((rows, d));
            }
        }
    }
    if !station_rows.is_empty() {
        let all: Vec<usize> = station_rows
            .iter()
            .flat_map(|(r, _)| r.iter().copied())
            .collect();
        used.retain(|i| !all.contains(i));
        outliers.retain(|i| !all.contains(i));
        not_visible.retain(|(i, _)| !all.contains(i));
        no_contact.retain(|i| !all.contains(i));
        outcome = fit(&event, &timings, &used, outcome.theta);
        let z: Vec<f64> = used
            .iter()
            .zip(&outcome.residuals_s)
            .map(|(&i, r)| r / timings[i].obs.sigma_s)
            .collect();
        scatter = robust_sigma(&z).max(0.5);
    }
    let p_final = perturbation(&outcome.theta, er);

    // Diagnose and record every timing that is not used.
    let diagnose = |i: usize| -> Option<String> {
        let t = &timings[i];
        explain_row(
            &event,
            &t.obs.station,
            t.obs.contact,
            t.observed_h,
            &p_final,
            (4.0 * scatter * t.obs.sigma_s).max(20.0),
        )
        .or_else(|| {
            let row = [StationTiming {
                contact: t.obs.contact,
                observed_h: t.observed_h,
                sigma_s: t.obs.sigma_s,
            }];
            explain_station(
                &event,
                &t.obs.station,
                &row,
                &p_final,
                scatter,
                options.outlier_threshold,
            )
        })
    };
    let reject = |i: usize, reason: RejectReason, diagnosis: Option<String>| Rejected {
        line: timings[i].obs.line,
        station: timings[i].obs.station.name.clone(),
        contact: Some(timings[i].obs.contact.number()),
        reason,
        diagnosis,
        o_c_s: residual_at(i, &outcome.theta),
    };
    for (rows, d) in &station_rows {
        for &i in rows {
            rejected.push(reject(i, RejectReason::Outlier, Some(d.clone())));
        }
    }
    for &i in &outliers {
        let d = diagnose(i).or_else(|| {
            residual_at(i, &outcome.theta).map(|r| {
                format!(
                    "O - C is {r:+.1} s, {:.1} times the robust scatter of its uncertainty; no known blunder fits",
                    (r / timings[i].obs.sigma_s / scatter).abs()
                )
            })
        });
        rejected.push(reject(i, RejectReason::Outlier, d));
    }
    for &(i, alt) in &not_visible {
        match diagnose(i) {
            Some(d) => rejected.push(reject(i, RejectReason::Outlier, Some(d))),
            None => rejected.push(reject(
                i,
                RejectReason::NotVisible,
                Some(format!(
                    "the Sun's centre was {:.1} degrees below the horizon at this time and place; check the time, date and coordinates",
                    -alt
                )),
            )),
        }
    }
    no_contact.sort();
    no_contact.dedup();
    for &i in &no_contact {
        match diagnose(i) {
            Some(d) => rejected.push(reject(i, RejectReason::Outlier, Some(d))),
            None => rejected.push(reject(
                i,
                RejectReason::Invalid,
                Some(format!(
                    "contact {} of this transit does not occur at this station (the planet's path as seen from there misses that circle); check the contact number and the coordinates",
                    timings[i].obs.contact.roman()
                )),
            )),
        }
    }
    rejected.sort_by_key(|r| r.line);

    summarise(
        event,
        options,
        set.rows_total,
        &timings,
        &used,
        outcome,
        rejected,
        scatter,
    )
}

#[allow(clippy::too_many_arguments)]
fn summarise(
    event: TransitEvent,
    options: &ReduceOptions,
    rows_total: usize,
    timings: &[Timing],
    used: &[usize],
    outcome: FitOutcome,
    rejected: Vec<Rejected>,
    scatter: f64,
) -> Result<Reduction> {
    let er = event.earth_radii_per_arcsec();
    let mut warnings = outcome.messages.clone();
    let n = used.len();
    let n_free = outcome.free.iter().filter(|&&f| f).count();
    let w: Vec<f64> = used
        .iter()
        .map(|&i| 1.0 / timings[i].obs.sigma_s.powi(2))
        .collect();
    let chi2: f64 = outcome
        .residuals_s
        .iter()
        .zip(&w)
        .map(|(r, w)| r * r * w)
        .sum();
    let dof = n.saturating_sub(n_free);
    let stats = statistics(chi2, dof);
    if !outcome.converged && outcome.free[0] {
        warnings.push(format!(
            "the iteration did not converge in {} steps; treat the result with caution",
            outcome.iterations
        ));
    }
    if dof == 0 && outcome.free[0] {
        warnings.push(
            "there are no degrees of freedom: the uncertainties rest on the stated sigmas alone"
                .into(),
        );
    }
    if let Some(rb) = stats.birge_ratio {
        if rb > 1.0 && stats.p_value.is_some_and(|p| p < 0.05) {
            warnings.push(format!(
                "the residuals scatter {rb:.2} times more than the stated sigmas allow (chi-square {chi2:.1} for {dof} degrees of freedom); the uncertainties are scaled up by that factor"
            ));
        }
    }
    let scale = stats.sigma_scale;
    let cov = &outcome.covariance;
    let parameters: Vec<Parameter> = (0..N_PARAMS)
        .map(|j| Parameter {
            name: PARAMETER_NAMES[j].to_string(),
            value: outcome.theta[j],
            sigma: outcome.free[j].then(|| cov[(j, j)].max(0.0).sqrt() * scale),
            unit: "arcsec".into(),
            fixed: !outcome.free[j],
        })
        .collect();
    let correlation: Vec<Vec<f64>> = (0..N_PARAMS)
        .map(|a| {
            (0..N_PARAMS)
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
        .collect();

    let determined = outcome.free[0] && n > 0;
    let (parallax, sigma, interval, au, au_sigma, au_interval) = if determined {
        let pi = outcome.theta[0];
        let s = parameters[0].sigma.unwrap_or(f64::NAN);
        let k = stats.coverage_factor_95;
        let au = au_km_from_parallax_arcsec(pi);
        // Exact propagation: half the width of the image of pi -+ sigma (to first order
        // AU cot(pi) sigma_pi, from which it differs by (sigma_pi/pi)^2 relatively).
        let au_sigma =
            0.5 * (au_km_from_parallax_arcsec(pi - s) - au_km_from_parallax_arcsec(pi + s));
        (
            Some(pi),
            Some(s),
            Some((pi - k * s, pi + k * s)),
            Some(au),
            Some(au_sigma),
            Some((
                au_km_from_parallax_arcsec(pi + k * s),
                au_km_from_parallax_arcsec(pi - k * s),
            )),
        )
    } else {
        (None, None, None, None, None, None)
    };

    let stations = contributions(&event, timings, used, &outcome, &w, er);
    let convergence = if determined && options.follow_convergence {
        convergence(&event, timings, used, &outcome.theta)
    } else {
        Vec::new()
    };
    let used_rows: Vec<UsedTiming> = used
        .iter()
        .zip(&outcome.residuals_s)
        .map(|(&i, r)| UsedTiming {
            line: timings[i].obs.line,
            station: timings[i].obs.station.name.clone(),
            contact: timings[i].obs.contact.number(),
            o_c_s: *r,
            sigma_s: timings[i].obs.sigma_s,
        })
        .collect();
    Ok(Reduction {
        event,
        prior_parallax_arcsec: options.prior_parallax_arcsec,
        parallax_arcsec: parallax,
        parallax_sigma_arcsec: sigma,
        parallax_interval_95: interval,
        au_km: au,
        au_sigma_km: au_sigma,
        au_interval_95_km: au_interval,
        timings_total: rows_total,
        timings_used: n,
        rejected,
        stations,
        parameters,
        correlation,
        statistics: stats,
        robust_scatter: scatter,
        iterations: outcome.iterations,
        warnings,
        used: used_rows,
        convergence,
    })
}

/// Partial solutions on the first k used timings (file order), at up to 25 values of k.
fn convergence(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    theta: &[f64; N_PARAMS],
) -> Vec<ConvergencePoint> {
    let mut order: Vec<usize> = used.to_vec();
    order.sort_by_key(|&i| timings[i].obs.line);
    let n = order.len();
    let steps = 25.min(n);
    let mut out = Vec::new();
    for s in 1..=steps {
        let k = (n * s) / steps;
        if k < N_PARAMS + 1 {
            continue;
        }
        let sub = &order[..k];
        let o = fit(event, timings, sub, *theta);
        if !o.free[0] || !o.converged {
            continue;
        }
        let chi2: f64 = o
            .residuals_s
            .iter()
            .zip(sub)
            .map(|(r, &i)| (r / timings[i].obs.sigma_s).powi(2))
            .sum();
        let dof = k - o.free.iter().filter(|&&f| f).count();
        let st = statistics(chi2, dof);
        out.push(ConvergencePoint {
            timings: k,
            parallax_arcsec: o.theta[0],
            sigma_arcsec: o.covariance[(0, 0)].max(0.0).sqrt() * st.sigma_scale,
        });
    }
    out
}

/// Information shares (Schur complement of the normal matrix on the parallax), leave-one-out
/// influence (rank-k downdate of the normal matrix) and chords, per station.
fn contributions(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    outcome: &FitOutcome,
    w: &[f64],
    er: f64,
) -> Vec<StationContribution> {
    let free_idx: Vec<usize> = (0..N_PARAMS).filter(|&j| outcome.free[j]).collect();
    let j_all = &outcome.jacobian;
    let n = used.len();
    // Information on the parallax per timing: w (a_i - proj_i)^2.
    let mut info = vec![0.0; n];
    let mut normal = DMatrix::<f64>::zeros(free_idx.len(), free_idx.len());
    for i in 0..n {
        for (a, &ja) in free_idx.iter().enumerate() {
            for (b, &jb) in free_idx.iter().enumerate() {
                normal[(a, b)] += w[i] * j_all[(i, ja)] * j_all[(i, jb)];
            }
        }
    }
    if outcome.free[0] && n > 0 {
        let nuis: Vec<usize> = free_idx.iter().copied().filter(|&j| j != 0).collect();
        let proj_coef: Vec<f64> = if nuis.is_empty() {
            Vec::new()
        } else {
            let m = nuis.len();
            let nn = DMatrix::from_fn(m, m, |a, b| {
                (0..n)
                    .map(|i| w[i] * j_all[(i, nuis[a])] * j_all[(i, nuis[b])])
                    .sum()
            });
            let rhs = DVector::from_fn(m, |a, _| {
                (0..n)
                    .map(|i| w[i] * j_all[(i, nuis[a])] * j_all[(i, 0)])
                    .sum()
            });
            match nn.cholesky() {
                Some(ch) => ch.solve(&rhs).iter().copied().collect(),
                None => vec![0.0; m],
            }
        };
        for i in 0..n {
            let proj: f64 = nuis
                .iter()
                .zip(&proj_coef)
                .map(|(&j, c)| j_all[(i, j)] * c)
                .sum();
            info[i] = w[i] * (j_all[(i, 0)] - proj).powi(2);
        }
    }
    let total_info: f64 = info.iter().sum();

    let mut names: Vec<&str> = used
        .iter()
        .map(|&i| timings[i].obs.station.name.as_str())
        .collect();
    names.dedup();
    let mut seen = Vec::new();
    let p = perturbation(&outcome.theta, er);
    let mut out = Vec::new();
    for name in names {
        if seen.contains(&name) {
            continue;
        }
        seen.push(name);
        let rows: Vec<usize> = (0..n)
            .filter(|&k| timings[used[k]].obs.station.name == name)
            .collect();
        let share = if total_info > 0.0 {
            rows.iter().map(|&k| info[k]).sum::<f64>() / total_info
        } else {
            0.0
        };
        // Leave-one-station-out: delta = -(N - N_k)^-1 J_k^T W_k r_k.
        let influence = if outcome.free[0] {
            let m = free_idx.len();
            let mut nk = normal.clone();
            let mut g = DVector::<f64>::zeros(m);
            for &k in &rows {
                for (a, &ja) in free_idx.iter().enumerate() {
                    g[a] += w[k] * j_all[(k, ja)] * outcome.residuals_s[k];
                    for (b, &jb) in free_idx.iter().enumerate() {
                        nk[(a, b)] -= w[k] * j_all[(k, ja)] * j_all[(k, jb)];
                    }
                }
            }
            let pi_col = free_idx.iter().position(|&j| j == 0).unwrap_or(0);
            // The rest must still determine every free parameter: the smallest eigenvalue of
            // the downdated normal matrix in correlation form must stay clear of zero.
            let d = DVector::from_fn(m, |a, _| nk[(a, a)].max(0.0).sqrt());
            let cond_ok = d.iter().all(|&x| x > 0.0) && {
                let corr = DMatrix::from_fn(m, m, |a, b| nk[(a, b)] / (d[a] * d[b]));
                corr.symmetric_eigenvalues().min()
                    > crate::reduction::least_squares::RANK_TOLERANCE.powi(2)
            };
            if cond_ok && n - rows.len() > m {
                nk.cholesky().map(|ch| -ch.solve(&g)[pi_col])
            } else {
                None
            }
        } else {
            None
        };
        let first = &timings[used[rows[0]]];
        let residuals_s: Vec<f64> = rows.iter().map(|&k| outcome.residuals_s[k]).collect();
        let contacts: Vec<u8> = rows
            .iter()
            .map(|&k| timings[used[k]].obs.contact.number())
            .collect();
        let mean_z = rows
            .iter()
            .map(|&k| outcome.residuals_s[k] / timings[used[k]].obs.sigma_s)
            .sum::<f64>()
            / rows.len() as f64;
        let observed = |c: Contact| {
            rows.iter()
                .map(|&k| &timings[used[k]])
                .find(|t| t.obs.contact == c)
                .map(|t| t.observed_h)
        };
        let chord = [
            (Contact::II, Contact::III, "interior"),
            (Contact::I, Contact::IV, "exterior"),
        ]
        .iter()
        .find_map(|&(a, b, pair)| {
            let (oa, ob) = (observed(a)?, observed(b)?);
            let ca = event.contact_hours_perturbed(&first.geo, a, &p)?;
            let cb = event.contact_hours_perturbed(&first.geo, b, &p)?;
            let ga = event.contact_hours_perturbed_geocentric(a, &p)?;
            let gb = event.contact_hours_perturbed_geocentric(b, &p)?;
            let k = 1.0 / (er * p.length_scale);
            let path = |h1: f64, h2: f64, st: Option<&GeocentricStation>| {
                let p1 = offset_on_plane(&event.elements, st, h1, &p);
                let p2 = offset_on_plane(&event.elements, st, h2, &p);
                let d = ((p2.0 - p1.0).powi(2) + (p2.1 - p1.1).powi(2)).sqrt();
                let closest = (p1.0 * (p2.1 - p1.1) - p1.1 * (p2.0 - p1.0)).abs() / d.max(1e-12);
                (d * k, closest * k)
            };
            let (obs_len, _) = path(oa, ob, Some(&first.geo));
            let (pred_len, topo_closest) = path(ca, cb, Some(&first.geo));
            let (_, geo_closest) = path(ga, gb, None);
            Some(Chord {
                pair: pair.to_string(),
                observed_arcsec: obs_len,
                predicted_arcsec: pred_len,
                duration_o_c_s: ((ob - oa) - (cb - ca)) * 3600.0,
                parallax_displacement_arcsec: topo_closest - geo_closest,
            })
        });
        out.push(StationContribution {
            station: name.to_string(),
            latitude_deg: first.obs.station.latitude_deg,
            longitude_deg: first.obs.station.longitude_deg,
            elevation_m: first.obs.station.elevation_m,
            timings: rows.len(),
            information_share: share,
            influence_arcsec: influence,
            residuals_s,
            contacts,
            mean_normalised_residual: mean_z,
            chord,
        });
    }
    out.sort_by(|a, b| b.information_share.total_cmp(&a.information_share));
    out
}
