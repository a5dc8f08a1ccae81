//! An offset that all of a station's timings share (two or more), found by the reduction's
//! own test and said once for the station, each timing pointing to it: a wrong date, a time
//! zone left in, or a clock off (`feedback_sentences::station_advice`).

use super::feedback::TimingFeedback;
use super::feedback_sentences::{offset_cause, station_advice, Sentence, Value};
use super::feedback_words::VerdictWords;
use crate::reduction::agreement::{tolerance_sigma_s, Agreement};
use crate::reduction::diagnosis::clock_offset_s;
use crate::reduction::rejection::NOMINAL_CLOCK_SIGMAS;
use serde::Serialize;

/// An offset common to every timing of one station, said once.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct StationAdvice {
    /// The station's name.
    pub station: String,
    /// How many of its timings share the offset.
    pub timings: usize,
    /// The common offset, seconds (positive: late).
    pub offset_s: f64,
    /// What it probably is and what to change (English in the API).
    pub advice: Sentence,
}

/// Find each station whose instants (two or more) share one offset beyond their uncertainty
/// (the reduction's own test, `reduction::diagnosis::clock_offset_s`, at unit scatter and
/// three standard errors), name it once, and let each timing refer to it.
pub fn station_offsets(timings: &mut [TimingFeedback]) -> Vec<StationAdvice> {
    let mut names: Vec<String> = Vec::new();
    for t in timings.iter() {
        if let Some(st) = &t.station {
            if !names.contains(&st.name) {
                names.push(st.name.clone());
            }
        }
    }
    let mut out = Vec::new();
    for name in names {
        let rows: Vec<usize> = (0..timings.len())
            .filter(|&k| timings[k].station.as_ref().is_some_and(|s| s.name == name))
            .collect();
        let instants: Vec<usize> = rows
            .iter()
            .copied()
            .filter(|&k| timings[k].o_c_s.is_some() && timings[k].observed_h.is_some())
            .collect();
        if instants.len() < 2 || instants.len() < rows.len() {
            continue;
        }
        let res: Vec<f64> = instants.iter().filter_map(|&k| timings[k].o_c_s).collect();
        let sig: Vec<f64> = instants
            .iter()
            .map(|&k| tolerance_sigma_s(timings[k].sigma_s.unwrap_or(0.0)))
            .collect();
        let Some(offset_s) = clock_offset_s(&res, &sig, 1.0, NOMINAL_CLOCK_SIGMAS) else {
            continue;
        };
        for &k in &instants {
            refer_to_station(&mut timings[k], offset_s);
        }
        out.push(StationAdvice {
            station: name,
            timings: instants.len(),
            offset_s,
            advice: station_advice(offset_s, instants.len()),
        });
    }
    out
}

/// A timing that shares its station's offset: at least doubtful, its text pointing to the
/// station's advice.
fn refer_to_station(t: &mut TimingFeedback, offset_s: f64) {
    let o_c = t.o_c_s.unwrap_or(offset_s);
    let own = Agreement::Doubtful.max(match t.verdict {
        "fits" => Agreement::Fits,
        "doubtful" => Agreement::Doubtful,
        _ => Agreement::Rejected,
    });
    t.verdict = own.as_str();
    t.verdict_words = if own == Agreement::Rejected {
        VerdictWords::Slip
    } else {
        VerdictWords::Doubtful
    };
    t.station_offset = true;
    let diff = Value::Difference {
        o_c_s: o_c,
        interval: false,
    };
    t.diagnosis = Some(
        Sentence::new("feedback-part-of-offset")
            .with("diff", diff)
            .with("cause", Value::Sentence(Box::new(offset_cause(offset_s))))
            .with("rest", Value::Signed(o_c - offset_s, 1)),
    );
    t.advice = Some(Sentence::new("advice-see-station"));
}
