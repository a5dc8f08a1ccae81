//! The classic methods beside the full solution: Halley's (durations only) and Delisle's
//! (single contacts at stations of exactly known longitude), each solved by least squares on
//! the timings the full solution kept, so that the three differ only in what information
//! they take from those timings.
//!
//! - **Halley's method** uses only the durations between contacts timed at the same station:
//!   every station gets a clock offset of its own with no prior, which removes everything a
//!   constant error of that station's clock does, and so also the constant part of a
//!   longitude error of a clock kept to local time. A station needs two timings to count.
//!   The planet's offset along its path moves every contact at a station alike, so the
//!   station clocks absorb it and it is held at the ephemeris's value (the offset component
//!   nearer the path's direction is held; the other carries the cross-path part, which the
//!   durations do measure through the chord's length).
//! - **Delisle's method** compares the absolute time of one contact between stations: only
//!   stations whose longitude is taken as exact, no station clock terms, and for each contact
//!   one time shift common to all stations (what the tables' error does to that contact
//!   everywhere alike), so that the parallax comes from the differences of the same contact
//!   from station to station. The planet's offsets and the radius corrections stay in as
//!   well, for the part of their effect that differs from station to station: with the
//!   shifts alone the method would claim an uncertainty below the full solution's, which it
//!   cannot have (measured on the reference campaigns: 0.024" against 0.028" for the clean
//!   2004 campaign).
//!
//! The full solution (condition equations) uses both kinds of information at once, with the
//! longitudes corrected where they are doubtful.
//!
//! References: E. Halley, "Methodus singularis quâ Solis parallaxis ... ope Veneris intra
//! Solem conspiciendae", Phil. Trans. 29, 454 (1716); J.-N. Delisle, *Mémoire* and
//! *Mappemonde* for the transit of 1761 (1760), whose method compares the absolute times of one
//! contact at stations of known longitude; the two as special cases of the condition
//! equations: S. Newcomb, *Astronomical Papers of the American Ephemeris* II (1891), and
//! W. Chauvenet, *A Manual of Spherical and Practical Astronomy* (1863), vol. I.

use super::equations::Timing;
use super::fit::{fit, FitOutcome};
use super::parameters::{
    ParameterKind, ParameterSet, ParameterSpec, Scope, N_CLASSIC, OFFSET_EAST, OFFSET_NORTH,
    PARALLAX,
};
use super::statistics::{statistics, FitStatistics};
use crate::geometry::contacts::Contact;
use crate::geometry::transit::TransitEvent;
use crate::observations::longitude::LongitudeKnowledge;
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
            Method::ConditionEquations => "every timing kept: absolute times and durations together, doubtful longitudes corrected",
            Method::Halley => "only the durations between contacts at the same station: clock errors and the clock part of a longitude error cancel, so stations with one timing add nothing",
            Method::Delisle => "single contacts compared from station to station, at stations whose longitude is taken as exact: needs good clocks and longitudes, but uses stations that timed only one contact",
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
    /// Why the method gives no figure, or what it had to assume.
    pub note: Option<String>,
}

impl MethodSolution {
    fn not_determined(method: Method, timings: usize, stations: usize, why: String) -> Self {
        MethodSolution {
            method,
            parallax_arcsec: None,
            parallax_sigma_arcsec: None,
            au_km: None,
            au_sigma_km: None,
            timings_used: timings,
            stations_used: stations,
            note: Some(why),
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
            method,
            parallax_arcsec: Some(pi),
            parallax_sigma_arcsec: Some(sigma),
            au_km: au.map(|a| a.0),
            au_sigma_km: au.map(|a| a.1),
            timings_used: timings,
            stations_used: stations,
            note: note.or_else(|| {
                au.is_none().then(|| {
                    "the parallax's one-sigma range reaches zero, so no AU is given".to_string()
                })
            }),
        }
    }
}

/// The chi-square statistics of a fit: the timings' weighted squares plus the priors of the
/// free parameters, with those priors counted as observations.
pub fn fit_statistics(
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    outcome: &FitOutcome,
) -> FitStatistics {
    let chi2: f64 = used
        .iter()
        .zip(&outcome.residuals_s)
        .map(|(&i, r)| (r / timings[i].obs.sigma_s).powi(2))
        .sum();
    let n_free = outcome.free.iter().filter(|&&f| f).count();
    let (prior_chi2, n_priors) = params.prior_chi2(&outcome.theta, &outcome.free);
    statistics(
        chi2 + prior_chi2,
        (used.len() + n_priors).saturating_sub(n_free),
    )
}

/// The parallax and its Birge-scaled uncertainty from a fit, or the sentence why not.
fn parallax_of(
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    outcome: &FitOutcome,
) -> Result<(f64, f64), String> {
    if !outcome.converged || !outcome.free[PARALLAX] {
        let why = outcome
            .messages
            .iter()
            .find(|m| m.contains("parallax"))
            .cloned()
            .unwrap_or_else(|| "the iteration did not converge".into());
        return Err(why);
    }
    let stats = fit_statistics(timings, used, params, outcome);
    let sigma = outcome.covariance[(PARALLAX, PARALLAX)].max(0.0).sqrt() * stats.sigma_scale;
    if !(sigma.is_finite() && sigma > 0.0) {
        return Err("the fit gave no positive uncertainty for the parallax".into());
    }
    Ok((outcome.theta[PARALLAX], sigma))
}

fn count_stations(timings: &[Timing], rows: &[usize]) -> usize {
    let mut s: Vec<usize> = rows.iter().map(|&i| timings[i].station).collect();
    s.sort_unstable();
    s.dedup();
    s.len()
}

/// Halley's method on the timings `used` by the full solution.
///
/// Arguments: `event`; `timings`; `used`; `params`, the full solution's parameter set (its
/// longitude corrections and the planet place's setting are kept); `theta`, the full
/// solution's values, from which the iteration starts.
pub fn halley(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    theta: &[f64],
) -> MethodSolution {
    // Per station: its first timing and how many of its timings are used.
    let n_stations = timings.iter().map(|t| t.station + 1).max().unwrap_or(0);
    let mut first: Vec<Option<usize>> = vec![None; n_stations];
    for (i, t) in timings.iter().enumerate() {
        first[t.station].get_or_insert(i);
    }
    let mut count = vec![0usize; n_stations];
    for &i in used {
        count[timings[i].station] += 1;
    }
    // A station counts through a duration: two timings.
    let enough = |s: usize| count[s] >= 2;
    let rows: Vec<usize> = used
        .iter()
        .copied()
        .filter(|&i| enough(timings[i].station))
        .collect();
    let stations = count_stations(timings, &rows);
    if stations < 2 {
        return MethodSolution::not_determined(
            Method::Halley,
            rows.len(),
            stations,
            format!(
                "Halley's method needs durations at two stations or more (two contacts timed at each); {} such",
                crate::words::count(stations, "station has", "stations have")
            ),
        );
    }
    let mut p = params.clone();
    let mut start = theta.to_vec();
    let held = hold_offset_along_path(event, &mut p, &mut start);
    let unknown_held = hold_unknown_longitudes(&mut p, &mut start);
    for (s, i) in first.iter().enumerate() {
        if let (Some(i), true) = (i, enough(s)) {
            let clock = ParameterSet::clock_offset(&timings[*i].obs.station.name, None);
            p.add_station_parameter(s, clock);
            start.push(0.0);
        }
    }
    let outcome = fit(event, timings, &rows, &p, &start);
    let mut notes: Vec<String> = held.map(|along| format!("the planet's offset along its path cannot be told from the station clocks, so the {along} offset is held at the ephemeris's value")).into_iter().collect();
    if unknown_held > 0 {
        notes.push(format!(
            "{} of unknown longitude {} used at the longitude written (a duration depends on the longitude only through the Earth's turning between the contacts; the full solution's longitude came from absolute times, which Halley's method does not use)",
            crate::words::count(unknown_held, "station", "stations"),
            if unknown_held == 1 { "is" } else { "are" }
        ));
    }
    let note = (!notes.is_empty()).then(|| notes.join("; "));
    match parallax_of(timings, &rows, &p, &outcome) {
        Ok(fig) => MethodSolution::from_parallax(Method::Halley, fig, (rows.len(), stations), note),
        Err(why) => MethodSolution::not_determined(Method::Halley, rows.len(), stations, why),
    }
}

/// Hold the longitude corrections of stations whose longitude is unknown (no prior) at the
/// written longitude: the durations alone hardly place a station, and a longitude left free
/// with a free clock beside it makes the iteration wander. Returns how many were held.
fn hold_unknown_longitudes(params: &mut ParameterSet, theta: &mut [f64]) -> usize {
    let mut held = 0;
    for (j, value) in theta.iter_mut().enumerate().take(params.len()) {
        let Some(spec) = params.spec_mut(j) else {
            continue;
        };
        if spec.kind == ParameterKind::LongitudeCorrection && spec.prior.is_none() && !spec.fixed {
            spec.fixed = true;
            *value = spec.start;
            held += 1;
        }
    }
    held
}

/// Hold the planet's offset component (east or north) nearer the direction of its path on
/// the fundamental plane at the ephemeris's value (its start, not the full solution's fitted
/// value, which the absolute times determined); returns which ("east" or "north"), or `None`
/// when it was held already.
fn hold_offset_along_path(
    event: &TransitEvent,
    params: &mut ParameterSet,
    theta: &mut [f64],
) -> Option<&'static str> {
    let v = event.elements.at(event.hours_of_greatest());
    let (index, name) = if v.x.1.abs() >= v.y.1.abs() {
        (OFFSET_EAST, "east")
    } else {
        (OFFSET_NORTH, "north")
    };
    let spec = params.spec_mut(index)?;
    if spec.fixed {
        return None;
    }
    spec.fixed = true;
    theta[index] = spec.start;
    Some(name)
}

/// Delisle's method on the timings `used` by the full solution: the timings of stations
/// whose longitude is taken as exact, with one time shift per contact besides the planet's
/// offsets and the radius corrections.
///
/// Arguments: `event`; `timings`; `used`; `prior_parallax_arcsec`, where the iteration
/// starts.
pub fn delisle(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    prior_parallax_arcsec: f64,
) -> MethodSolution {
    let rows: Vec<usize> = used
        .iter()
        .copied()
        .filter(|&i| timings[i].obs.longitude == LongitudeKnowledge::Exact)
        .collect();
    let stations = count_stations(timings, &rows);
    if rows.is_empty() {
        return MethodSolution::not_determined(
            Method::Delisle,
            0,
            0,
            "Delisle's method needs stations whose longitude is taken as exact; every station here has a doubtful or unknown longitude".into(),
        );
    }
    // The timings regrouped by contact: the "station" of the block elimination is the
    // contact, so that each contact's shift is eliminated as a station's clock would be.
    let grouped: Vec<Timing> = rows
        .iter()
        .map(|&i| Timing {
            station: timings[i].obs.contact.index(),
            ..timings[i].clone()
        })
        .collect();
    let mut p = ParameterSet::classic(prior_parallax_arcsec);
    let mut start = p.start_values();
    for c in Contact::ALL {
        if grouped.iter().any(|t| t.obs.contact == c) {
            p.add_station_parameter(c.index(), contact_shift(c));
            start.push(0.0);
        }
    }
    let all: Vec<usize> = (0..grouped.len()).collect();
    let outcome = fit(event, &grouped, &all, &p, &start);
    match parallax_of(&grouped, &all, &p, &outcome) {
        Ok(fig) => {
            MethodSolution::from_parallax(Method::Delisle, fig, (rows.len(), stations), None)
        }
        Err(why) => {
            let why = if stations < 2 {
                "Delisle's method compares one contact between stations, and only one station of exactly known longitude is left".to_string()
            } else {
                why
            };
            MethodSolution::not_determined(Method::Delisle, rows.len(), stations, why)
        }
    }
}

/// One contact's time shift common to every station, seconds.
fn contact_shift(c: Contact) -> ParameterSpec {
    ParameterSpec {
        name: format!("time_shift[contact {}]", c.number()),
        unit: "s",
        kind: ParameterKind::ClockOffset,
        scope: Scope::Global,
        start: 0.0,
        prior: None,
        fixed: false,
    }
}

/// The full solution as one of the methods.
pub fn condition_equations(
    parallax: Option<(f64, f64)>,
    (timings, stations): (usize, usize),
    why_not: Option<String>,
) -> MethodSolution {
    match parallax {
        Some(fig) => MethodSolution::from_parallax(
            Method::ConditionEquations,
            fig,
            (timings, stations),
            None,
        ),
        None => MethodSolution::not_determined(
            Method::ConditionEquations,
            timings,
            stations,
            why_not.unwrap_or_else(|| "the parallax is not determined".into()),
        ),
    }
}

/// The three methods, with the full solution first.
pub fn methods(
    event: &TransitEvent,
    (timings, used): (&[Timing], &[usize]),
    params: &ParameterSet,
    theta: &[f64],
    full: MethodSolution,
) -> Vec<MethodSolution> {
    debug_assert!(params.n_global() >= N_CLASSIC);
    vec![
        full,
        halley(event, timings, used, params, theta),
        delisle(event, timings, used, params.specs()[PARALLAX].start),
    ]
}

/// Why the three methods differ here, in plain words (one sentence per point): what each
/// uses, and how far each classic method lies from the full solution against what chance
/// allows. A method that uses part of the full solution's information differs from it by
/// chance with a standard deviation of sqrt(sigma_method^2 - sigma_full^2), since the full
/// solution is the efficient one (the difference of an efficient and an inefficient estimator
/// is uncorrelated with the efficient one: J. A. Hausman, Econometrica 46, 1251 (1978)).
pub fn why_they_differ(methods: &[MethodSolution]) -> Vec<String> {
    let mut out = Vec::new();
    for m in methods {
        out.push(format!("{}: {}", m.method.title(), m.method.what_it_uses()));
    }
    out.push("a clock error or a wrong longitude biases Delisle's method and is taken out of Halley's; Halley's gives up the information in absolute times for that, so its uncertainty is larger; the full solution has both kinds of information and the longitude corrections, so its uncertainty is the smallest".to_string());
    let full = methods
        .iter()
        .find(|m| m.method == Method::ConditionEquations)
        .and_then(|m| m.parallax_arcsec.zip(m.parallax_sigma_arcsec));
    for m in methods
        .iter()
        .filter(|m| m.method != Method::ConditionEquations)
    {
        if let (Some((pf, sf)), Some((pm, sm))) =
            (full, m.parallax_arcsec.zip(m.parallax_sigma_arcsec))
        {
            let chance = (sm * sm - sf * sf).max(0.0).sqrt();
            let d = pm - pf;
            let verdict = if chance > 0.0 && d.abs() > 3.0 * chance {
                "more than chance allows: look for clock, longitude or contact errors that the two methods treat differently"
            } else {
                "within what chance allows"
            };
            out.push(format!(
                "{} lies {d:+.4}\" from the full solution; by chance alone the two would differ by about {chance:.4}\" (one standard deviation), so this is {verdict}",
                m.method.title()
            ));
        }
    }
    out
}
