//! The blunders of historical records and their signatures, each named with the column to
//! change and the value to give it:
//!
//! - civil and astronomical day reckoning confused: every local reading of a station 12 h off;
//! - apparent and mean solar time confused: a station's readings (or every station's) off by
//!   the equation of time, which fit when read as the other kind;
//! - the longitude counted from Paris (or Ferro) but read as from Greenwich, or the reverse:
//!   the station fits with its longitude moved by that meridian's offset, its local readings
//!   converted again at the moved longitude;
//! - a time read to the minute only: it ends in :00 and lies within a minute of its prediction;
//! - Julian and Gregorian dates confused (10 to 12 days): see `screening::timings_of_event`.
//!
//! References: the day reckonings, the equation of time and the prime meridians as in
//! `sky::solar_time` and `observations::angles`; the calendars: E. G. Richards, "Calendars",
//! in *Explanatory Supplement to the Astronomical Almanac*, 3rd ed. (2012), chapter 15 (cited
//! from memory). Such errors, station by station, in the re-reduction of the 1761 and 1769
//! records: S. Newcomb, *Astronomical Papers of the American Ephemeris* II (1891) (cited from
//! memory of its treatment); reading them as signatures is common practice. The thresholds
//! (within 120 s of half a day; a sum of squares at least halved and down by more than 20)
//! are our own, checked on the real 1769 records by `tests/historical_records.rs`.

use super::diagnosis::StationTiming;
use super::equations::Timing;
use super::fit::{fit, FitOutcome};
use super::parameters::{ParameterKind, ParameterSet, Scope};
use crate::geometry::transit::TransitEvent;
use crate::observations::angles::{
    Meridian, FERRO_EAST_OF_GREENWICH_DEG, PARIS_EAST_OF_GREENWICH_DEG,
};
use crate::observations::local_time::LocalReading;
use crate::sky::solar_time::LocalTime;
use chrono::Timelike;

/// One station timing for diagnosis, with what a historical blunder would change: the seconds
/// a degree of longitude adds through the local-time conversion, and the observed time had the
/// clock kept the other kind of solar time.
pub fn station_timing(event: &TransitEvent, t: &Timing) -> StationTiming {
    let local = t.obs.local.filter(|l| l.follows_station());
    StationTiming {
        contact: t.obs.contact,
        observed_h: t.observed_h,
        sigma_s: t.obs.sigma_s,
        local_s_per_deg: if local.is_some() { 240.0 } else { 0.0 },
        other_kind_h: t
            .obs
            .local
            .and_then(|l| other_kind_hours(event, &l, t.obs.station.longitude_deg)),
        meridian: t.obs.written.meridian,
    }
}

/// The other kind of local solar time.
pub fn other_kind(kind: LocalTime) -> LocalTime {
    match kind {
        LocalTime::Apparent => LocalTime::Mean,
        LocalTime::Mean => LocalTime::Apparent,
    }
}

/// The observed time (hours from the elements' epoch) of a local reading read as the other
/// kind of solar time.
pub fn other_kind_hours(event: &TransitEvent, l: &LocalReading, longitude_deg: f64) -> Option<f64> {
    let swapped = LocalReading {
        kind: other_kind(l.kind),
        ..*l
    };
    let label = swapped.label(longitude_deg)?;
    let tt = event.time_model().tt_from_label(label).ok()?;
    Some(event.elements.hours(tt))
}

/// The prime meridians a longitude may have been counted from instead of the one written:
/// (longitude shift in degrees, the sentence's name, the value for the `meridian` column).
pub fn meridian_alternatives(written: Meridian) -> Vec<(f64, &'static str, &'static str)> {
    let from = written.east_of_greenwich_deg();
    [
        (0.0, "Greenwich", "greenwich"),
        (PARIS_EAST_OF_GREENWICH_DEG, "Paris", "paris"),
        (FERRO_EAST_OF_GREENWICH_DEG, "Ferro", "ferro"),
    ]
    .into_iter()
    .filter(|(east, _, _)| (east - from).abs() > 1e-6)
    .map(|(east, name, value)| (east - from, name, value))
    .collect()
}

/// The sentence for a station whose local readings are all 12 h off: the day reckonings
/// confused (an astronomical day begins at noon).
pub fn reckoning_sentence(offset_s: f64, station: &str) -> Option<String> {
    let sign = [-1.0f64, 1.0]
        .into_iter()
        .find(|s| (offset_s - 43_200.0 * s).abs() < 120.0)?;
    Some(format!(
        "every local reading of station '{station}' is off by {:+.3} h, half a day: civil and astronomical day reckoning were confused (an astronomical day begins at noon); set day_reckoning to {}",
        offset_s / 3600.0,
        if sign < 0.0 { "astronomical" } else { "civil" }
    ))
}

/// A timing that ends in :00 (as read, before any conversion) and lies within a minute of its
/// prediction: it was probably read to the minute only.
pub fn minute_reading(t: &Timing, residual_s: f64, tolerance_s: f64) -> Option<String> {
    if t.obs.written.minute_only || t.obs.written.range_s.is_some() || t.is_interval() {
        return None;
    }
    let read = t.obs.local.map_or(t.obs.time_label, |l| l.reading);
    if read.second() != 0 || read.nanosecond() != 0 || residual_s.abs() > 60.0 + tolerance_s {
        return None;
    }
    Some(format!(
        "the time ends in :00 and lies {residual_s:+.1} s from its prediction: it was probably read to the minute only; write it without seconds ({}), which counts the whole minute, or give sigma_s of at least 17 s (a minute's rounding)",
        read.format("%H:%M")
    ))
}

/// Across the campaign: if the local readings fit far better read as the other kind of solar
/// time (the weighted sum of squares at least halved, and down by more than 20), the sentence
/// that says so. Tried only where the fit's scatter is too large (one more fit).
pub fn campaign_kind_check(
    event: &TransitEvent,
    (timings, used): (&[Timing], &[usize]),
    params: &ParameterSet,
    outcome: &FitOutcome,
) -> Option<String> {
    let local: Vec<usize> = used
        .iter()
        .copied()
        .filter(|&i| timings[i].obs.local.is_some() && !timings[i].is_interval())
        .collect();
    if local.len() < 2 {
        return None;
    }
    let mut swapped = timings.to_vec();
    for &i in &local {
        let t = &timings[i];
        let l = t.obs.local?;
        swapped[i].observed_h = other_kind_hours(event, &l, t.obs.station.longitude_deg)?;
    }
    let again = fit(event, &swapped, used, params, &outcome.theta);
    let squares = |o: &FitOutcome, ts: &[Timing]| -> f64 {
        used.iter()
            .zip(&o.residuals_s)
            .map(|(&i, r)| (r / ts[i].obs.sigma_s).powi(2))
            .sum()
    };
    let (before, after) = (squares(outcome, timings), squares(&again, &swapped));
    (again.converged && after < 0.5 * before && before - after > 20.0).then(|| {
        let kinds: Vec<LocalTime> = local.iter().filter_map(|&i| timings[i].obs.local.map(|l| l.kind)).collect();
        let all_one = kinds.iter().all(|&k| k == kinds[0]);
        let change = if all_one {
            format!("set local_time to {}", other_kind(kinds[0]).name())
        } else {
            "change local_time (apparent to mean, mean to apparent) on the local rows".to_string()
        };
        format!(
            "the local readings fit far better read as the other kind of solar time (chi-square {before:.0} as written, {after:.0} so read): apparent and mean time differ by the equation of time, and the clocks probably kept the other kind; {change}"
        )
    })
}

/// Each fitted longitude correction that equals, within three of its standard deviations, the
/// offset of another prime meridian from the one written (and differs from zero by more than
/// three): the longitude was probably counted from that meridian.
pub fn meridian_corrections(
    timings: &[Timing],
    params: &ParameterSet,
    (theta, sigma): (&[f64], &[Option<f64>]),
) -> Vec<String> {
    let mut out = Vec::new();
    for (j, spec) in params.specs().iter().enumerate() {
        let (ParameterKind::LongitudeCorrection, Scope::Station(k)) = (spec.kind, spec.scope)
        else {
            continue;
        };
        let Some(s) = sigma[j] else {
            continue;
        };
        let c = theta[j];
        if c.abs() < 3.0 * s {
            continue;
        }
        let Some(t) = timings.iter().find(|t| t.station == k) else {
            continue;
        };
        for (shift, name, value) in meridian_alternatives(t.obs.written.meridian) {
            if (c - shift).abs() < 3.0 * s {
                out.push(format!(
                    "the longitude of station '{}' is corrected by {c:+.3} +- {s:.3} degrees, the offset of the {name} meridian ({shift:+.3}): it was probably counted from {name}; set meridian to {value}",
                    t.obs.station.name
                ));
            }
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reckonings_and_meridians() {
        assert!(reckoning_sentence(-43_190.0, "a")
            .unwrap()
            .contains("set day_reckoning to astronomical"));
        assert!(reckoning_sentence(43_200.0, "a")
            .unwrap()
            .contains("set day_reckoning to civil"));
        assert!(reckoning_sentence(40_000.0, "a").is_none());
        let alt = meridian_alternatives(Meridian::Greenwich);
        assert_eq!(alt.len(), 2);
        assert!((alt[0].0 - 2.337_229).abs() < 1e-5 && alt[0].2 == "paris");
        let alt = meridian_alternatives(Meridian::Paris);
        assert!((alt[0].0 + 2.337_229).abs() < 1e-5 && alt[0].2 == "greenwich");
        assert!((alt[1].0 + 20.0).abs() < 1e-9 && alt[1].2 == "ferro");
    }
}
