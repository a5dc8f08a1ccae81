//! Halley's method: the parallax from the durations of the transit at stations far apart in
//! latitude, whose chords lie at different distances from the Sun's centre.
//!
//! Each station's timings are taken with a clock offset of its own (no prior), so that only
//! the intervals between its contacts count, and timed intervals given as such enter
//! directly. The planet's offset along its path moves every contact of a station alike and
//! cannot be told from the clocks: it is held at the ephemeris's value. The offset across the
//! path and the radius corrections change the chord's length: they are fitted as the full
//! solution fits them (the offset as `--planet-place` says), where the durations can separate
//! them from the parallax. Stations of unknown longitude are taken at the longitude written
//! (a duration depends on the longitude only through the Earth's turning between its
//! contacts). What is held is listed with the result.
//!
//! References: E. Halley, "Methodus singularis quâ Solis parallaxis sive distantia a Terra,
//! ope Veneris intra Solem conspiciendae, tuto determinari poterit", Phil. Trans. 29, 454
//! (1716): the duration at stations far apart in latitude, the planet's path and the radii
//! from the tables; in condition equations: W. Chauvenet, *A Manual of Spherical and Practical
//! Astronomy* (1863), vol. I (cited from memory of its treatment).

use super::classic_methods::{count_stations, gains, parallax_of, Method, MethodSolution};
use super::equations::Timing;
use super::fit::{fit, initial_free};
use super::parameters::{ParameterKind, ParameterSet, OFFSET_EAST, OFFSET_NORTH, PARALLAX};
use crate::geometry::transit::TransitEvent;

/// Halley's method on the timings `used` by the full solution.
///
/// Arguments: `event`; the timings and those used; `params`, the full solution's parameter
/// set (its planet place, lags and longitude corrections are kept); `theta`, the full
/// solution's values, from which the iteration starts.
/// Returns: the solution, with every parameter it held and why; not determined (with the
/// sentence) where the durations cannot separate the parallax from what it needs.
pub fn halley(
    event: &TransitEvent,
    (timings, used): (&[Timing], &[usize]),
    params: &ParameterSet,
    theta: &[f64],
) -> MethodSolution {
    let rows = duration_rows(timings, used);
    let stations = count_stations(timings, &rows);
    if stations < 2 {
        return MethodSolution::not_determined(
            Method::Halley,
            (rows.len(), stations),
            format!(
                "Halley's method needs durations at two stations or more (two contacts timed at each, or a timed interval); {} such",
                crate::words::count(stations, "station has", "stations have")
            ),
        );
    }
    let mut p = params.clone();
    let mut start = theta.to_vec();
    let mut held = Vec::new();
    if let Some(along) = hold_offset_along_path(event, &mut p, &mut start) {
        held.push(format!("planet_offset_{along} (along the planet's path: it moves every contact of a station alike, so the station clocks take it; held at the ephemeris's value)"));
    }
    let unknown = hold_unknown_longitudes(&mut p, &mut start);
    if unknown > 0 {
        held.push(format!(
            "the longitude of {} (unknown, taken as written: a duration depends on it only through the Earth's turning between the contacts)",
            crate::words::count(unknown, "station", "stations")
        ));
    }
    add_clocks(timings, &rows, &mut p, &mut start);
    let outcome = fit(event, timings, &rows, &p, &start);
    held.extend(held_by_fit(params, &p, (timings, &rows), &outcome.free));
    let figure = parallax_of(timings, &rows, &p, &outcome);
    let mut m = match figure {
        Ok((pi, sigma, stats)) => MethodSolution {
            gains: gains(timings, &rows, &outcome),
            sigma_scale: stats.sigma_scale,
            ..MethodSolution::from_parallax(
                Method::Halley,
                (pi, sigma),
                (rows.len(), stations),
                None,
            )
        },
        Err(why) => {
            let hint = if params.specs()[OFFSET_NORTH].fixed {
                ""
            } else {
                "; with --planet-place fixed (or a prior) the planet's path is taken from the ephemeris, as Halley took it from the tables"
            };
            MethodSolution::not_determined(
                Method::Halley,
                (rows.len(), stations),
                format!("{why}{hint}"),
            )
        }
    };
    m.held = held;
    m
}

/// The rows Halley's method can use: at each station, its timed intervals, and its instants
/// where there are two or more (one duration at least).
fn duration_rows(timings: &[Timing], used: &[usize]) -> Vec<usize> {
    // Per station, how many of its timings are used: an interval counts alone, instants in
    // twos (one duration).
    let n_stations = timings.iter().map(|t| t.station + 1).max().unwrap_or(0);
    let mut instants = vec![0usize; n_stations];
    let mut intervals = vec![0usize; n_stations];
    for &i in used {
        let s = timings[i].station;
        if timings[i].is_interval() {
            intervals[s] += 1;
        } else {
            instants[s] += 1;
        }
    }
    let counts = |s: usize| instants[s] >= 2 || intervals[s] >= 1;
    used.iter()
        .copied()
        .filter(|&i| {
            let s = timings[i].station;
            counts(s) && (timings[i].is_interval() || instants[s] >= 2)
        })
        .collect()
}

/// A clock offset (no prior) for every station with instants among the rows (an interval
/// needs none: its clock's error cancels in it).
fn add_clocks(timings: &[Timing], rows: &[usize], p: &mut ParameterSet, start: &mut Vec<f64>) {
    let mut seen = std::collections::HashSet::new();
    for &i in rows {
        let t = &timings[i];
        if !t.is_interval() && seen.insert(t.station) {
            p.add_station_parameter(
                t.station,
                ParameterSet::clock_offset(&t.obs.station.name, None),
            );
            start.push(0.0);
        }
    }
}

/// The global parameters a classic method's fit left unfitted beyond what its set held from
/// the start, each with the reason: not involved by its timings, a black-drop lag with nothing
/// to measure it against, or not determined by its timings (held by the rank test).
pub fn held_by_fit(
    full: &ParameterSet,
    method: &ParameterSet,
    (timings, rows): (&[Timing], &[usize]),
    free: &[bool],
) -> Vec<String> {
    let (could, _) = initial_free(method, timings, rows);
    (0..method.n_global())
        .filter(|&j| !free[j] && j != PARALLAX)
        .filter_map(|j| {
            let spec = &method.specs()[j];
            let name = &spec.name;
            if full.specs()[j].fixed && spec.fixed {
                return Some(format!(
                    "{name} (held, as in the full solution: --planet-place)"
                ));
            }
            if spec.fixed {
                return None;
            }
            Some(if !could[j] {
                match spec.kind {
                    ParameterKind::BlackDrop(..) => {
                        format!("{name} (no timing of its own to measure it against: held at 0 s)")
                    }
                    _ => format!("{name} (no timing of that kind of contact: not involved)"),
                }
            } else {
                format!("{name} (its timings cannot determine it: held at the a-priori value)")
            })
        })
        .collect()
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
