//! Diagnosis of rejected timings: which known blunder, if any, explains a timing.
//!
//! The blunders seen in pooled public timings and their signatures (common practice, no single
//! source; see docs/reduction.md): local time left in (O - C near a whole number of hours, or of
//! half hours), the date off by a day, contacts mislabelled (the timing fits another contact's
//! prediction at that station), the longitude's sign flipped or latitude and longitude
//! exchanged (the timing fits the station with its coordinates corrected), and a station clock
//! off by a constant (all the station's timings share one offset; see
//! [`crate::reduction`]).

use super::historical_diagnosis::{meridian_alternatives, reckoning_sentence};
pub use super::row_blunders::{find_row_blunder, RowBlunder};
use super::row_blunders::{minute_typo, predicted_hours};
use crate::geometry::contacts::{Contact, Perturbation};
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;

/// Explain one timing that does not fit by a blunder of that timing alone, in the
/// reduction's English sentence (see [`find_row_blunder`]), or `None`.
pub fn explain_row(
    event: &TransitEvent,
    station: &Station,
    contact: Contact,
    observed_h: f64,
    p: &Perturbation,
    tolerance_s: f64,
) -> Option<String> {
    find_row_blunder(event, station, contact, observed_h, p, tolerance_s).map(|b| b.sentence())
}

/// Explain a timed interval that does not fit: it fits another pair of contacts at this
/// station (the contacts mislabelled), or it is off by whole minutes (a digit of the minutes
/// mistyped).
///
/// Arguments: `event`; `station`; `pair`, the contacts as given; `observed_h`, the interval
/// (hours); `p`, the solution's parameters; `tolerance_s`.
pub fn explain_interval(
    event: &TransitEvent,
    station: &Station,
    pair: (Contact, Contact),
    observed_h: f64,
    p: &Perturbation,
    tolerance_s: f64,
) -> Option<String> {
    let geo = station.geocentric();
    let interval = |a: Contact, b: Contact| {
        Some(predicted_hours(event, &geo, b, p)? - predicted_hours(event, &geo, a, p)?)
    };
    for (a, b) in [(0, 3), (1, 2), (0, 1), (2, 3), (0, 2), (1, 3)] {
        let (a, b) = (Contact::ALL[a], Contact::ALL[b]);
        if (a, b) == pair {
            continue;
        }
        if let Some(h) = interval(a, b) {
            let r = (observed_h - h) * 3600.0;
            if r.abs() < tolerance_s {
                return Some(format!(
                    "given as the interval {}-{} but fits {}-{} at this station (O - C {r:+.1} s): the contacts were probably mislabelled",
                    pair.0.roman(),
                    pair.1.roman(),
                    a.roman(),
                    b.roman()
                ));
            }
        }
    }
    let h = interval(pair.0, pair.1)?;
    minute_typo((observed_h - h) * 3600.0, tolerance_s.min(15.0)).map(|b| b.sentence())
}

/// One timing of a station, for station-level diagnosis.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct StationTiming {
    /// Which contact.
    pub contact: Contact,
    /// Observed, hours from the elements' epoch (TT).
    pub observed_h: f64,
    /// Standard uncertainty, seconds.
    pub sigma_s: f64,
    /// Seconds a degree of longitude adds through the conversion from local solar time (240
    /// for a reading on the station's own meridian, else 0): a longitude tried elsewhere moves
    /// such a timing too.
    pub local_s_per_deg: f64,
    /// The observed time had the clock kept the other kind of solar time (apparent or mean),
    /// hours, for a local reading.
    pub other_kind_h: Option<f64>,
    /// The prime meridian the row's longitude was written from.
    pub meridian: crate::observations::angles::Meridian,
}

/// A hypothesis about a station: its score (chi-square, plus twice its fitted constants), the
/// sentence that names it, and a short name for alternatives.
type Hypothesis = (f64, String, String);

/// The chi-square of a station's timings at corrected coordinates, if every corrected
/// residual lies within max(4 scatter sigma, 20 s) and the chi-square per timing is under 9.
fn fits_at(
    event: &TransitEvent,
    st: &Station,
    rows: &[StationTiming],
    p: &Perturbation,
    scatter: f64,
) -> Option<f64> {
    let geo = st.geocentric();
    let mut chi2 = 0.0;
    for r in rows {
        let h = predicted_hours(event, &geo, r.contact, p)?;
        let d = (r.observed_h - h) * 3600.0;
        if d.abs() > (4.0 * scatter * r.sigma_s).max(20.0) {
            return None;
        }
        chi2 += (d / (r.sigma_s * scatter)).powi(2);
    }
    (chi2 / (rows.len() as f64) < 9.0).then_some(chi2)
}

/// As [`fits_at`], with the station's longitude moved to `st`'s from `from_deg` (east): local
/// readings on the station's meridian are converted again at the moved longitude (240 s per
/// degree earlier for a longitude further east).
fn fits_moved(
    event: &TransitEvent,
    st: &Station,
    rows: &[StationTiming],
    (p, scatter, from_deg): (&Perturbation, f64, f64),
) -> Option<f64> {
    let shift_deg = crate::geometry::station::normalise_longitude_deg(st.longitude_deg - from_deg);
    let moved: Vec<StationTiming> = rows
        .iter()
        .map(|r| StationTiming {
            observed_h: r.observed_h - shift_deg * r.local_s_per_deg / 3600.0,
            ..*r
        })
        .collect();
    fits_at(event, st, &moved, p, scatter)
}

/// The coordinate blunders: the longitude's sign, latitude and longitude exchanged.
fn coordinate_hypotheses(
    event: &TransitEvent,
    station: &Station,
    rows: &[StationTiming],
    p: &Perturbation,
    scatter: f64,
) -> Vec<Hypothesis> {
    let mut found = Vec::new();
    let (lat, lon) = (station.latitude_deg, station.longitude_deg);
    if lon.abs() > 0.5 {
        let flipped = Station {
            longitude_deg: -lon,
            ..station.clone()
        };
        if let Some(score) = fits_moved(event, &flipped, rows, (p, scatter, lon)) {
            found.push((
                score,
                format!(
                    "the station's timings fit its longitude with the sign reversed ({:.4} instead of {:.4}): west was probably entered as east or the reverse",
                    -lon, lon
                ),
                "a longitude with the sign reversed".to_string(),
            ));
        }
    }
    if lat.abs() > 0.5 {
        let flipped = Station {
            latitude_deg: -lat,
            ..station.clone()
        };
        if let Some(score) = fits_at(event, &flipped, rows, p, scatter) {
            found.push((
                score,
                format!(
                    "the station's timings fit its latitude with the sign reversed ({:.4} instead of {lat:.4}): south was probably entered as north or the reverse",
                    -lat
                ),
                "a latitude with the sign reversed".to_string(),
            ));
        }
    }
    if lon.abs() <= 90.0 && (lat - lon).abs() > 0.5 {
        let swapped = Station {
            latitude_deg: lon,
            longitude_deg: lat,
            ..station.clone()
        };
        if let Some(score) = fits_moved(event, &swapped, rows, (p, scatter, lon)) {
            found.push((
                score,
                format!(
                    "the station's timings fit latitude and longitude exchanged (latitude {lon:.4}, longitude {lat:.4})"
                ),
                "latitude and longitude exchanged".to_string(),
            ));
        }
    }
    found.extend(meridian_hypotheses(event, station, rows, (p, scatter)));
    found
}

/// The longitude counted from another prime meridian than the one written (Paris or Ferro
/// taken as Greenwich, or the reverse).
fn meridian_hypotheses(
    event: &TransitEvent,
    station: &Station,
    rows: &[StationTiming],
    (p, scatter): (&Perturbation, f64),
) -> Vec<Hypothesis> {
    let lon = station.longitude_deg;
    let written = rows.first().map(|r| r.meridian).unwrap_or_default();
    meridian_alternatives(written)
        .into_iter()
        .filter_map(|(shift, name, value)| {
            let moved = Station {
                longitude_deg: crate::geometry::station::normalise_longitude_deg(lon + shift),
                ..station.clone()
            };
            let score = fits_moved(event, &moved, rows, (p, scatter, lon))?;
            Some((
                score,
                format!(
                    "the station's timings fit its longitude counted from {name} ({:.4} east of Greenwich instead of {lon:.4}, {shift:+.4} degrees): set meridian to {value}",
                    moved.longitude_deg
                ),
                format!("a longitude counted from {name}"),
            ))
        })
        .collect()
}

/// The clock kept the other kind of solar time than the file says: the station's readings
/// fit when read as that kind (they differ by the equation of time).
fn kind_hypothesis(
    event: &TransitEvent,
    station: &Station,
    rows: &[StationTiming],
    (p, scatter): (&Perturbation, f64),
) -> Option<Hypothesis> {
    let swapped: Vec<StationTiming> = rows
        .iter()
        .map(|r| {
            r.other_kind_h.map(|h| StationTiming {
                observed_h: h,
                ..*r
            })
        })
        .collect::<Option<_>>()?;
    let score = fits_at(event, station, &swapped, p, scatter)?;
    let eot_s = (rows[0].observed_h - swapped[0].observed_h) * 3600.0;
    Some((
        score,
        format!(
            "the station's clock readings fit the other kind of local solar time (apparent and mean time differ by the equation of time, {eot_s:+.0} s here): change local_time (apparent to mean, or mean to apparent)"
        ),
        "the other kind of solar time".into(),
    ))
}

/// A clock off by a constant: every timing shares one offset (two or more timings).
fn clock_hypothesis(
    event: &TransitEvent,
    station: &Station,
    rows: &[StationTiming],
    p: &Perturbation,
    (scatter, threshold): (f64, f64),
) -> Option<Hypothesis> {
    if rows.len() < 2 {
        return None;
    }
    let geo = station.geocentric();
    let res: Vec<f64> = rows
        .iter()
        .map(|r| predicted_hours(event, &geo, r.contact, p).map(|h| (r.observed_h - h) * 3600.0))
        .collect::<Option<_>>()?;
    let sig: Vec<f64> = rows.iter().map(|r| r.sigma_s).collect();
    let offset = clock_offset_s(&res, &sig, scatter, threshold)?;
    let chi2: f64 = res
        .iter()
        .zip(&sig)
        .map(|(r, s)| ((r - offset) / (s * scatter)).powi(2))
        .sum();
    let local = rows
        .iter()
        .all(|r| r.local_s_per_deg > 0.0 || r.other_kind_h.is_some());
    (chi2 / ((rows.len() - 1) as f64) < 9.0).then(|| {
        (
            chi2 + 2.0,
            station_offset_sentence(offset, rows.len(), &station.name, local),
            format!("a clock off by {offset:+.1} s"),
        )
    })
}

/// Explain a station whose timings do not fit by a blunder common to all of them: the
/// longitude's sign flipped, latitude and longitude exchanged, or the clock off by a constant.
/// A hypothesis is acceptable when every corrected residual lies within max(4 scatter sigma,
/// 20 s) and its chi-square per degree of freedom (normalised by `scatter`) is under 9; they
/// are ranked by chi-square plus twice the number of fitted constants (Akaike's criterion:
/// the clock offset is one; H. Akaike, IEEE Trans. Autom. Control 19, 716 (1974)), and any
/// within 2 of the best is named as an alternative that these timings cannot rule out.
pub fn explain_station(
    event: &TransitEvent,
    station: &Station,
    rows: &[StationTiming],
    p: &Perturbation,
    scatter: f64,
    threshold: f64,
) -> Option<String> {
    let scatter = scatter.max(1.0);
    let mut found = coordinate_hypotheses(event, station, rows, p, scatter);
    found.extend(kind_hypothesis(event, station, rows, (p, scatter)));
    found.extend(clock_hypothesis(
        event,
        station,
        rows,
        p,
        (scatter, threshold),
    ));
    found.sort_by(|a, b| a.0.total_cmp(&b.0));
    let (best_score, best_text, _) = found.first()?.clone();
    let alternatives: Vec<&str> = found[1..]
        .iter()
        .filter(|(score, _, _)| score - best_score < 2.0)
        .map(|(_, _, short)| short.as_str())
        .collect();
    if alternatives.is_empty() {
        Some(best_text)
    } else {
        Some(format!(
            "{best_text}; {} would explain them about as well, and these timings cannot tell which",
            alternatives.join(" or ")
        ))
    }
}

/// The sentence for an offset common to every timing of a station: for readings in local solar
/// time, half a day is the day reckonings confused; a time zone left in when it is a whole
/// number of hours or half hours (within 2 minutes), the date off when a whole day, else a
/// clock that was wrong by that much.
pub fn station_offset_sentence(offset_s: f64, n: usize, station: &str, local: bool) -> String {
    if local {
        if let Some(s) = reckoning_sentence(offset_s, station) {
            return s;
        }
    }
    let all = crate::words::all_of(n, "timings");
    let hours = offset_s / 3600.0;
    let days = (offset_s / 86_400.0).round();
    if days != 0.0 && (offset_s - 86_400.0 * days).abs() < 120.0 {
        return format!(
            "{all} of station '{station}' are off by {hours:+.2} h, {} day{}: the date is probably wrong by that much",
            days.abs(),
            if days.abs() == 1.0 { "" } else { "s" }
        );
    }
    let half = (offset_s / 1800.0).round();
    if half != 0.0 && half.abs() <= 28.0 && (offset_s - 1800.0 * half).abs() < 120.0 {
        let h = half / 2.0;
        return format!(
            "{all} of station '{station}' are off by {hours:+.3} h: a time zone of {h:+} h was probably left in (local time given as UTC); {} {} h to correct them",
            if h > 0.0 { "subtract" } else { "add" },
            h.abs()
        );
    }
    format!(
        "{all} of station '{station}' are off by about {offset_s:+.1} s: its clock was probably wrong by that much"
    )
}

/// The signature of a station clock error: every timing of the station off by nearly the same
/// amount, well beyond its uncertainty.
///
/// Arguments: the station's residuals O - C (s) and their sigmas (s); `scatter`, the robust
/// scale of normalised residuals; `threshold`, how many standard errors make it significant.
/// Returns: the common offset in seconds, if the signature is there.
pub fn clock_offset_s(
    residuals_s: &[f64],
    sigmas_s: &[f64],
    scatter: f64,
    threshold: f64,
) -> Option<f64> {
    let n = residuals_s.len();
    if n < 2 {
        return None;
    }
    let w: Vec<f64> = sigmas_s.iter().map(|s| 1.0 / (s * s)).collect();
    let wsum: f64 = w.iter().sum();
    let mean = residuals_s.iter().zip(&w).map(|(r, w)| r * w).sum::<f64>() / wsum;
    let se = scatter.max(1.0) / wsum.sqrt();
    // Every row must share the offset within its own uncertainty (regression: one row off by
    // 90 s at a station whose other rows fit was called a clock error of the whole station).
    let consistent = residuals_s
        .iter()
        .zip(sigmas_s)
        .all(|(r, s)| (r - mean).abs() <= (3.0 * s * scatter.max(1.0)).max(0.2 * mean.abs()));
    if mean.abs() > threshold * se && mean.abs() > 30.0 && consistent {
        Some(mean)
    } else {
        None
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn clock_signature() {
        assert!(clock_offset_s(&[75.0, 78.0, 73.0], &[5.0, 5.0, 5.0], 1.0, 5.0).is_some());
        assert!(clock_offset_s(&[75.0, -78.0, 73.0], &[5.0, 5.0, 5.0], 1.0, 5.0).is_none());
        assert!(clock_offset_s(&[4.0, 6.0, 5.0], &[5.0, 5.0, 5.0], 1.0, 5.0).is_none());
        assert!(clock_offset_s(&[80.0], &[5.0], 1.0, 5.0).is_none());
    }
}
