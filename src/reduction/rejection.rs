//! Accounting for every timing not used: the station-wide blunder tests and the record of
//! each rejected row with its reason and the diagnosis that explains it.
//!
//! A station at least half of whose timings could not be used is tested as a whole (the
//! longitude's sign, latitude and longitude exchanged, a clock error); a station with two or
//! more timings is also tested for a common clock offset, which can hide below the rejection
//! threshold. The rules themselves are in `diagnosis.rs`.
//!
//! References: the blunders of pooled public timings and their signatures are common
//! practice (no single source); see docs/reduction.md.

use super::agreement::tolerance_sigma_s;
use super::diagnosis::{
    clock_offset_s, explain_interval, explain_row, explain_station, station_offset_sentence,
    StationTiming,
};
use super::equations::{perturbation, residual_s, Timing};
use super::fit::FitOutcome;
use super::historical_diagnosis::{minute_reading, station_timing};
use super::parameters::ParameterSet;
use super::screening::Screened;
use crate::geometry::contacts::Perturbation;
use crate::geometry::transit::TransitEvent;
use crate::observations::timings::{RejectReason, Rejected};

/// Rows of one station and the sentence that explains them all.
pub type StationVerdict = (Vec<usize>, String);

fn station_timings(event: &TransitEvent, timings: &[Timing], rows: &[usize]) -> Vec<StationTiming> {
    rows.iter()
        .map(|&i| station_timing(event, &timings[i]))
        .collect()
}

/// A common clock offset over all the rows of a station, as a verdict.
fn clock_verdict(
    event: &TransitEvent,
    timings: &[Timing],
    params: &ParameterSet,
    s: &Screened,
    (rows, name, threshold): (&[usize], &str, f64),
) -> Option<StationVerdict> {
    let er = event.earth_radii_per_arcsec();
    let res: Option<Vec<f64>> = rows
        .iter()
        .map(|&i| residual_s(event, &timings[i], params, &s.outcome.theta, er))
        .collect();
    let sig: Vec<f64> = rows.iter().map(|&i| timings[i].obs.sigma_s).collect();
    let offset = clock_offset_s(&res?, &sig, s.scatter, threshold)?;
    let local = rows.iter().all(|&i| timings[i].obs.local.is_some());
    Some((
        rows.to_vec(),
        station_offset_sentence(offset, rows.len(), name, local),
    ))
}

/// A common offset over all the rows of a station against the nominal prediction (the shared
/// rule of `agreement.rs`, as the service's feedback tests it: each row's tolerance sigma, three
/// standard errors, over 30 s), for a station the fit may have partly absorbed (regression,
/// issue 20: a station a minute off among five dragged the parallax from 8.8 to 6.5 arcsec).
/// Only where every row is an instant the shared rule applies to.
fn nominal_clock_verdict(
    timings: &[Timing],
    s: &Screened,
    (rows, name): (&[usize], &str),
) -> Option<StationVerdict> {
    let res: Vec<f64> = rows
        .iter()
        .map(|&i| s.nominal_o_c_s[i])
        .collect::<Option<_>>()?;
    let sig: Vec<f64> = rows
        .iter()
        .map(|&i| tolerance_sigma_s(timings[i].obs.sigma_s))
        .collect();
    let offset = clock_offset_s(&res, &sig, 1.0, NOMINAL_CLOCK_SIGMAS)?;
    Some((
        rows.to_vec(),
        station_offset_sentence(offset, rows.len(), name, false),
    ))
}

/// Standard errors of a common offset at nominal parameters that make it a clock error (the
/// feedback's test).
pub const NOMINAL_CLOCK_SIGMAS: f64 = 3.0;

/// Test each station as a whole; the verdicts for stations a station-wide blunder explains.
pub fn station_wide(
    event: &TransitEvent,
    timings: &[Timing],
    params: &ParameterSet,
    s: &Screened,
    threshold: f64,
) -> Vec<StationVerdict> {
    let p_now = perturbation(&s.outcome.theta, event.earth_radii_per_arcsec());
    let mut unused = vec![false; timings.len()];
    let not_visible = s.not_visible.iter().map(|(i, _)| i);
    for &i in s.outliers.iter().chain(not_visible).chain(&s.no_contact) {
        unused[i] = true;
    }
    // Each station's instants, stations in the order of their names (linear in the rows);
    // intervals are immune to what these tests look for (a clock, the place's sign).
    let mut by_station: Vec<Vec<usize>> = Vec::new();
    for (i, t) in timings.iter().enumerate().filter(|(_, t)| !t.is_interval()) {
        if by_station.len() <= t.station {
            by_station.resize(t.station + 1, Vec::new());
        }
        by_station[t.station].push(i);
    }
    by_station.retain(|r| !r.is_empty());
    by_station.sort_by(|a, b| {
        timings[a[0]]
            .obs
            .station
            .name
            .cmp(&timings[b[0]].obs.station.name)
    });
    let mut verdicts = Vec::new();
    for rows in by_station {
        let name = timings[rows[0]].obs.station.name.as_str();
        let bad = rows.iter().filter(|&&i| unused[i]).count();
        if bad == 0 || 2 * bad < rows.len() {
            if rows.len() >= 2 {
                verdicts.extend(
                    clock_verdict(event, timings, params, s, (&rows, name, threshold))
                        .or_else(|| nominal_clock_verdict(timings, s, (&rows, name))),
                );
            }
            continue;
        }
        let st = station_timings(event, timings, &rows);
        let station = &timings[rows[0]].obs.station;
        if let Some(d) = explain_station(event, station, &st, &p_now, s.scatter, threshold) {
            verdicts.push((rows, d));
        }
    }
    verdicts
}

/// The blunder that explains one timing alone; a station-wide cause (coordinates, clock) only
/// when the timing is its station's only one, since otherwise the station's other rows would
/// have to fit that cause better (regression: one row off by a minute at a station whose
/// other rows fit was blamed on a reversed longitude).
fn diagnose(
    event: &TransitEvent,
    t: &Timing,
    p: &Perturbation,
    (scatter, threshold, alone): (f64, f64, bool),
) -> Option<String> {
    let tolerance_s = (4.0 * scatter * t.obs.sigma_s).max(20.0);
    let station = &t.obs.station;
    if let Some(d) = t.obs.duration {
        return explain_interval(
            event,
            station,
            (d.first, t.obs.contact),
            t.observed_h,
            p,
            tolerance_s,
        );
    }
    let minute = || {
        let h = event.contact_hours_perturbed(&station.geocentric(), t.obs.contact, p)?;
        minute_reading(t, (t.observed_h - h) * 3600.0, tolerance_s)
    };
    // A time ending in :00 within a minute of its prediction is named before a mistyped
    // digit of the minutes: the commoner slip of a clock read by eye.
    minute()
        .or_else(|| explain_row(event, station, t.obs.contact, t.observed_h, p, tolerance_s))
        .or_else(|| {
            if !alone {
                return None;
            }
            let row = station_timings(event, std::slice::from_ref(t), &[0]);
            explain_station(event, station, &row, p, scatter, threshold)
        })
}

fn sun_set_sentence(altitude_deg: f64) -> String {
    format!(
        "the Sun's centre was {:.1} degrees below the horizon at this time and place; check the time, date and coordinates",
        -altitude_deg
    )
}

fn no_contact_sentence(contact: &str) -> String {
    format!(
        "contact {contact} of this transit does not occur at this station (the planet's path as seen from there misses that circle); check the contact number and the coordinates"
    )
}

/// Record every timing not used, with its reason and diagnosis, sorted by line.
pub fn record_rejections(
    event: &TransitEvent,
    timings: &[Timing],
    params: &ParameterSet,
    s: &Screened,
    (verdicts, threshold): (&[StationVerdict], f64),
    rejected: &mut Vec<Rejected>,
) {
    let outcome: &FitOutcome = &s.outcome;
    let er = event.earth_radii_per_arcsec();
    let p_final = perturbation(&outcome.theta, er);
    let residual_at = |i: usize| residual_s(event, &timings[i], params, &outcome.theta, er);
    let mut per_station = vec![0usize; timings.iter().map(|t| t.station + 1).max().unwrap_or(0)];
    for t in timings {
        per_station[t.station] += 1;
    }
    let alone = |i: usize| per_station[timings[i].station] == 1;
    let diagnosis = |i: usize| {
        diagnose(
            event,
            &timings[i],
            &p_final,
            (s.scatter, threshold, alone(i)),
        )
    };
    let reject = |i: usize, reason: RejectReason, diagnosis: Option<String>| Rejected {
        line: timings[i].obs.line,
        station: timings[i].obs.station.name.clone(),
        contact: Some(timings[i].obs.contact.number()),
        contact_label: timings[i]
            .obs
            .duration
            .map(|_| timings[i].obs.contact_label()),
        reason,
        diagnosis,
        o_c_s: residual_at(i),
    };
    for (rows, d) in verdicts {
        for &i in rows {
            rejected.push(reject(i, RejectReason::Outlier, Some(d.clone())));
        }
    }
    for &i in &s.outliers {
        let d = diagnosis(i).or_else(|| {
            residual_at(i).map(|r| {
                format!(
                    "O - C is {r:+.1} s, {:.1} times the robust scatter of its uncertainty; no known blunder fits",
                    (r / timings[i].obs.sigma_s / s.scatter).abs()
                )
            })
        });
        rejected.push(reject(i, RejectReason::Outlier, d));
    }
    for &(i, alt) in &s.not_visible {
        rejected.push(match diagnosis(i) {
            Some(d) => reject(i, RejectReason::Outlier, Some(d)),
            None => reject(i, RejectReason::NotVisible, Some(sun_set_sentence(alt))),
        });
    }
    let mut no_contact = s.no_contact.clone();
    no_contact.sort();
    no_contact.dedup();
    for &i in &no_contact {
        rejected.push(match diagnosis(i) {
            Some(d) => reject(i, RejectReason::Outlier, Some(d)),
            None => reject(
                i,
                RejectReason::Invalid,
                Some(no_contact_sentence(timings[i].obs.contact.roman())),
            ),
        });
    }
    rejected.sort_by_key(|r| r.line);
}
