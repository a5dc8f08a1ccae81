//! The classic methods beside the full solution, each solved by least squares on the timings
//! the full solution kept, so that they differ only in what they take from those timings and
//! what they assume:
//!
//! - **Halley's method** (`halley.rs`; E. Halley, Phil. Trans. 29, 454, 1716): the durations
//!   of the transit at each station, by one clock. Every station's clock is an unknown of its
//!   own, so only the intervals between its contacts count (and timed intervals given as
//!   such). The planet's offset along its path moves every contact of a station alike and is
//!   taken by the clocks: it is held at the ephemeris's value. Its offset across the path and
//!   the radius corrections change the chord's length and are fitted, the offset as
//!   `--planet-place` says, where the durations can separate them from the parallax; where they
//!   cannot, the parallax is not determined, and `--planet-place fixed` takes the path from the
//!   ephemeris, as Halley took it from the tables.
//! - **Delisle's method** (`delisle.rs`; J.-N. Delisle, 1753 for Mercury, 1760 for Venus):
//!   the absolute times of one
//!   contact at stations of exactly known longitude (good clocks assumed). The tables' error
//!   in the planet's place and in the radii shifts each contact's geocentric time, the same
//!   at every station; that shift is the unknown, with the offsets as `--planet-place` says,
//!   and the parallax comes from the differences of the same contact from station to station.
//!
//! What each method holds fixed is listed in full with each solution. A method that assumes
//! more than the full solution may state a smaller uncertainty; its note then names the
//! assumption. How far a method may lie from the full solution by chance follows from the
//! covariance of the two estimates, both linear in the same timings to first order.
//!
//! References: as above; both as special cases of the condition equations: S. Newcomb,
//! *Astronomical Papers of the American Ephemeris* II (1891), and W. Chauvenet, *A Manual of
//! Spherical and Practical Astronomy* (1863), vol. I (both cited from memory of their
//! treatment); the covariance of two estimators linear in the same data: JCGM 100:2008 (GUM),
//! section 5.2.

use super::delisle::{delisle, DELISLE_ASSUMPTION};
use super::equations::Timing;
use super::fit::FitOutcome;
use super::halley::halley;
use super::parameters::{ParameterSet, PARALLAX};
use super::statistics::{fit_statistics, FitStatistics};
use crate::geometry::transit::TransitEvent;
use crate::sky::constants::au_and_sigma_km;
use serde::Serialize;

/// Which method a solution follows.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Method {
    /// The full condition-equation solution.
    ConditionEquations,
    /// Durations at each station only.
    Halley,
    /// Single contacts at stations of exactly known longitude.
    Delisle,
}

impl Method {
    /// The name in tables and reports.
    pub fn title(self) -> &'static str {
        match self {
            Method::ConditionEquations => "condition equations (full solution)",
            Method::Halley => "Halley (durations)",
            Method::Delisle => "Delisle (single contacts)",
        }
    }

    /// What the method takes from the timings, in plain words.
    pub fn what_it_uses(self) -> &'static str {
        match self {
            Method::ConditionEquations => "every timing kept: absolute times and durations together, doubtful longitudes corrected, the planet's place and the radii with each station's own partials",
            Method::Halley => "only the durations between contacts at each station (every station's clock an unknown of its own): clock errors and the clock part of a longitude error cancel, so stations with one timing add nothing",
            Method::Delisle => "the absolute times of single contacts at stations whose longitude is taken as exact, the tables' error entering as one shift of each contact's geocentric time, the same at every station: needs good clocks and longitudes, but uses stations that timed only one contact",
        }
    }
}

/// One method's result.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct MethodSolution {
    /// The method.
    pub method: Method,
    /// Solar parallax, arcsec (`None`: not determined, see `note`).
    pub parallax_arcsec: Option<f64>,
    /// Its standard uncertainty (scaled by the method's own Birge ratio when above 1), arcsec.
    pub parallax_sigma_arcsec: Option<f64>,
    /// The AU, km.
    pub au_km: Option<f64>,
    /// Its standard uncertainty, km.
    pub au_sigma_km: Option<f64>,
    /// Timings the method used.
    pub timings_used: usize,
    /// Stations those timings came from.
    pub stations_used: usize,
    /// Why the method gives no figure, or what it assumes beyond the full solution.
    pub note: Option<String>,
    /// Every parameter the method held, each with the reason.
    pub held: Vec<String>,
    /// The standard deviation of this method's difference from the full solution by chance
    /// alone, arcsec, from the covariance of the two estimates (`None` for the full solution
    /// or where either has no figure).
    pub difference_sd_arcsec: Option<f64>,
    /// Each timing's part in the estimate (index into the timings, gain times sigma, s), for
    /// the covariance with another method's estimate.
    #[serde(skip)]
    pub gains: Vec<(usize, f64)>,
    /// The factor its uncertainties were scaled by.
    #[serde(skip)]
    pub sigma_scale: f64,
}

impl MethodSolution {
    /// A method that gives no figure, and why.
    pub fn not_determined(
        method: Method,
        (timings, stations): (usize, usize),
        why: String,
    ) -> Self {
        MethodSolution {
            method,
            parallax_arcsec: None,
            parallax_sigma_arcsec: None,
            au_km: None,
            au_sigma_km: None,
            timings_used: timings,
            stations_used: stations,
            note: Some(why),
            held: Vec::new(),
            difference_sd_arcsec: None,
            gains: Vec::new(),
            sigma_scale: 1.0,
        }
    }

    /// A method's figures from a parallax and its (scaled) uncertainty: the AU as the exact
    /// image of pi -+ sigma (none when pi - sigma reaches zero), as for the full solution.
    pub fn from_parallax(
        method: Method,
        (pi, sigma): (f64, f64),
        (timings, stations): (usize, usize),
        note: Option<String>,
    ) -> Self {
        let au = au_and_sigma_km(pi, sigma);
        MethodSolution {
            parallax_arcsec: Some(pi),
            parallax_sigma_arcsec: Some(sigma),
            au_km: au.map(|a| a.0),
            au_sigma_km: au.map(|a| a.1),
            note: note.or_else(|| {
                au.is_none().then(|| {
                    "the parallax's one-sigma range reaches zero, so no AU is given".to_string()
                })
            }),
            ..MethodSolution::not_determined(method, (timings, stations), String::new())
        }
    }
}

/// Each timing's part in a fit's parallax (the parallax row of C J^T W, times the timing's
/// sigma), in the order of `used`, paired with the timing's index.
pub fn gains(timings: &[Timing], used: &[usize], outcome: &FitOutcome) -> Vec<(usize, f64)> {
    let c = &outcome.covariance;
    let j = &outcome.jacobian;
    used.iter()
        .enumerate()
        .map(|(row, &i)| {
            let g: f64 = (0..c.ncols()).map(|b| c[(PARALLAX, b)] * j[(row, b)]).sum();
            (i, g / timings[i].obs.sigma_s)
        })
        .collect()
}

/// A fit's parallax and Birge-scaled uncertainty with its statistics, or the sentence why not.
pub fn parallax_of(
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    outcome: &FitOutcome,
) -> Result<(f64, f64, FitStatistics), String> {
    if !outcome.converged || !outcome.free[PARALLAX] {
        // The specific reason (resting on a held parameter, entangled, inseparable) before
        // the general sentence that follows it.
        let why = outcome
            .messages
            .iter()
            .find(|m| m.contains("the solar parallax") && !m.contains("no result is given"))
            .or_else(|| {
                outcome
                    .messages
                    .iter()
                    .find(|m| m.contains("did not converge"))
            })
            .or_else(|| outcome.messages.iter().find(|m| m.contains("parallax")))
            .cloned()
            .unwrap_or_else(|| {
                format!(
                    "the iteration did not converge in {} steps",
                    outcome.iterations
                )
            });
        return Err(why);
    }
    let stats = fit_statistics(timings, used, params, outcome);
    let sigma = outcome.covariance[(PARALLAX, PARALLAX)].max(0.0).sqrt() * stats.sigma_scale;
    if !(sigma.is_finite() && sigma > 0.0) {
        return Err("the fit gave no positive uncertainty for the parallax".into());
    }
    Ok((outcome.theta[PARALLAX], sigma, stats))
}

/// How many stations the rows come from.
pub fn count_stations(timings: &[Timing], rows: &[usize]) -> usize {
    let mut s: Vec<usize> = rows.iter().map(|&i| timings[i].station).collect();
    s.sort_unstable();
    s.dedup();
    s.len()
}

/// The full solution as one of the methods, with its timings' parts in its parallax.
pub fn condition_equations(
    parallax: Option<(f64, f64)>,
    (timings, used, stations): (&[Timing], &[usize], usize),
    (outcome, sigma_scale): (&FitOutcome, f64),
    why_not: Option<String>,
) -> MethodSolution {
    let counts = (used.len(), stations);
    match parallax {
        Some(fig) => MethodSolution {
            gains: gains(timings, used, outcome),
            sigma_scale,
            ..MethodSolution::from_parallax(Method::ConditionEquations, fig, counts, None)
        },
        None => MethodSolution::not_determined(
            Method::ConditionEquations,
            counts,
            why_not.unwrap_or_else(|| "the parallax is not determined".into()),
        ),
    }
}

/// The standard deviation by chance of the difference between two estimates linear in the
/// same timings: var(a) + var(b) - 2 cov(a, b), with cov(a, b) = sum over shared timings of
/// the product of their parts, all scaled by the larger of the two Birge factors.
fn difference_sd(a: &MethodSolution, b: &MethodSolution) -> Option<f64> {
    let (sa, sb) = (a.parallax_sigma_arcsec?, b.parallax_sigma_arcsec?);
    let va = (sa / a.sigma_scale).powi(2);
    let vb = (sb / b.sigma_scale).powi(2);
    let mut cov = 0.0;
    let mut k = 0;
    let mut sorted_b = b.gains.clone();
    sorted_b.sort_by_key(|g| g.0);
    let mut sorted_a = a.gains.clone();
    sorted_a.sort_by_key(|g| g.0);
    for &(i, ga) in &sorted_a {
        while k < sorted_b.len() && sorted_b[k].0 < i {
            k += 1;
        }
        if k < sorted_b.len() && sorted_b[k].0 == i {
            cov += ga * sorted_b[k].1;
        }
    }
    let scale = a.sigma_scale.max(b.sigma_scale);
    Some((va + vb - 2.0 * cov).max(0.0).sqrt() * scale)
}

/// The three methods, with the full solution first.
///
/// Arguments: `event`; the timings and those the full solution used; `params`, the full
/// solution's parameter set; `theta`, its values; `full`, its own entry.
pub fn methods(
    event: &TransitEvent,
    (timings, used): (&[Timing], &[usize]),
    params: &ParameterSet,
    theta: &[f64],
    full: MethodSolution,
) -> Vec<MethodSolution> {
    let mut h = halley(event, (timings, used), params, theta);
    let mut d = delisle(event, (timings, used), params);
    for m in [&mut h, &mut d] {
        m.difference_sd_arcsec = difference_sd(m, &full);
        name_the_assumption(m, &full);
    }
    vec![full, h, d]
}

/// Where a classic method states a smaller uncertainty than the full solution, add to its
/// note the assumption that buys it: for Delisle's method its form (the same shift of a
/// contact at every station), for either what it holds that the full solution fits.
fn name_the_assumption(m: &mut MethodSolution, full: &MethodSolution) {
    let (Some(sm), Some(sf)) = (m.parallax_sigma_arcsec, full.parallax_sigma_arcsec) else {
        return;
    };
    if sm >= sf {
        return;
    }
    let mut assumed: Vec<String> = Vec::new();
    if m.method == Method::Delisle {
        assumed.push(DELISLE_ASSUMPTION.to_string());
    }
    if !m.held.is_empty() {
        assumed.push("what it holds (listed with it) where the full solution fits it".to_string());
    }
    let sentence = format!(
        "its uncertainty ({sm:.4}\") is below the full solution's ({sf:.4}\") only because it assumes {}; the full solution does not",
        assumed.join(", and ")
    );
    m.note = Some(match m.note.take() {
        Some(n) if !n.is_empty() => format!("{n}; {sentence}"),
        _ => sentence,
    });
}

/// A difference in arcsec to four decimals, or to two significant figures where smaller
/// (never a bare 0.0000 for a difference that is not zero).
fn arcsec_text(x: f64) -> String {
    if x != 0.0 && x.abs() < 5e-5 {
        format!("{x:.1e}\"")
    } else {
        format!("{x:.4}\"")
    }
}

/// Why the three methods differ here, in plain words (one sentence per point): what each
/// uses, and how far each classic method lies from the full solution against what chance
/// allows (from the covariance of the two estimates).
pub fn why_they_differ(methods: &[MethodSolution]) -> Vec<String> {
    let mut out: Vec<String> = methods
        .iter()
        .map(|m| format!("{}: {}", m.method.title(), m.method.what_it_uses()))
        .collect();
    out.push("a clock error or a wrong longitude biases Delisle's method and is taken out of Halley's; Halley's gives up the information in absolute times for that; the full solution has both kinds of information and lets the tables' errors differ from station to station, so where it assumes no more than they do its uncertainty is the smallest".to_string());
    let full = methods
        .iter()
        .find(|m| m.method == Method::ConditionEquations)
        .and_then(|m| m.parallax_arcsec);
    for m in methods
        .iter()
        .filter(|m| m.method != Method::ConditionEquations)
    {
        let (Some(pf), Some(pm), Some(chance)) = (full, m.parallax_arcsec, m.difference_sd_arcsec)
        else {
            continue;
        };
        let d = pm - pf;
        // Below a thousandth of the method's own uncertainty both the difference and its
        // chance spread are the iterations' rounding (they stop at steps of 1e-6").
        let negligible = 1e-3 * m.parallax_sigma_arcsec.unwrap_or(0.0).max(1e-6);
        let sentence = if chance < negligible && d.abs() < negligible {
            format!(
                "{} agrees with the full solution to the iterations' precision: here the two take the same information from the same timings",
                m.method.title()
            )
        } else {
            let verdict = if d.abs() > 3.0 * chance {
                "more than chance allows: look for clock, longitude or contact errors, or an assumption of the method, that the two treat differently"
            } else {
                "within what chance allows"
            };
            format!(
                "{} lies {} from the full solution; by chance alone the two would differ by about {} (one standard deviation, from the covariance of the two estimates on the same timings), so this is {verdict}",
                m.method.title(),
                arcsec_text(d),
                arcsec_text(chance)
            )
        };
        out.push(sentence);
    }
    out
}
