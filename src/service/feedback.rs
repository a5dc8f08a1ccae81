//! Instant feedback on a submission: each timing read by the same rules as `reduce`, then
//! compared with its prediction at the station (the nominal parallax and the ephemeris's
//! place): O - C, the Sun's altitude, a verdict and, for a timing far off, the likely blunder
//! by the reduction's own rules (`reduction::diagnosis::explain_row`: zone time, date,
//! contacts exchanged, half a day); and the station's expected share of the information on
//! the parallax.
//!
//! The verdict: "fits" within 3 sigma of the prediction, sigma being the timing's own with
//! 4 s for what the prediction itself does not know (the parallax to a few tenths of a per
//! cent, the black drop; a round figure of ours); "doubtful" within ten of those sigmas or two
//! minutes; "rejected" beyond, when the Sun was down, or when the row cannot be read.

use super::store::{export_csv, StoredTiming, TimingFields};
use crate::geometry::contacts::Perturbation;
use crate::geometry::transit::TransitEvent;
use crate::observations::csv_table::CsvTable;
use crate::observations::timings::{observations_from_table, Observation};
use crate::reduction::diagnosis::explain_row;
use serde::Serialize;

/// What a participant sees for one timing.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct TimingFeedback {
    /// The contact, where it could be read (1-4).
    pub contact: Option<u8>,
    /// The predicted time of that contact at the station (UTC from 1972, UT1 before).
    pub predicted_utc: Option<String>,
    /// Observed minus predicted, seconds.
    pub o_c_s: Option<f64>,
    /// The Sun's true altitude at the predicted contact, degrees.
    pub sun_altitude_deg: Option<f64>,
    /// `fits`, `doubtful` or `rejected`.
    pub verdict: &'static str,
    /// A sentence: the likely blunder, why the row cannot be used, or how close it is.
    pub diagnosis: Option<String>,
}

/// The allowance for what the prediction does not know, seconds.
const MODEL_ALLOWANCE_S: f64 = 4.0;

/// Read these fields as `reduce` would (one data line each, in order).
fn read(fields: &[TimingFields]) -> Option<crate::observations::timings::ObservationSet> {
    let stored: Vec<StoredTiming> = fields
        .iter()
        .enumerate()
        .map(|(k, f)| StoredTiming {
            id: k as i64,
            submission_id: 0,
            fields: f.clone(),
            excluded: None,
        })
        .collect();
    let (text, _) = export_csv(&stored);
    let table = CsvTable::from_bytes(std::path::Path::new("<submission>"), text.as_bytes()).ok()?;
    observations_from_table(&table, false).ok()
}

fn judge(event: &TransitEvent, obs: &Observation) -> TimingFeedback {
    let mut fb = TimingFeedback {
        contact: Some(obs.contact.number()),
        predicted_utc: None,
        o_c_s: None,
        sun_altitude_deg: None,
        verdict: "rejected",
        diagnosis: None,
    };
    if let Some(d) = obs.duration {
        return judge_interval(event, obs, &d, fb);
    }
    // A time without a date is judged on the day nearest its prediction, as the reduction does.
    let mut completed = obs.clone();
    crate::reduction::undated::complete_date(&mut completed, event);
    let obs = &completed;
    let model = event.time_model();
    let Ok(tt) = model.tt_from_label(obs.time_label) else {
        fb.diagnosis = Some("the time lies outside the years the tool covers".into());
        return fb;
    };
    let observed_h = event.elements.hours(tt);
    let Some(c) = event.predict(&obs.station).contacts[obs.contact.index()] else {
        fb.diagnosis = Some(format!(
            "this station sees no contact {} of this transit",
            obs.contact.number()
        ));
        return fb;
    };
    let o_c = (observed_h - c.hours) * 3600.0;
    fb.predicted_utc = Some(crate::time::iso::format_utc(event.label(c.hours), 1));
    fb.o_c_s = Some(o_c);
    fb.sun_altitude_deg = Some(c.sun_altitude_deg);
    let sigma = obs.sigma_s.hypot(MODEL_ALLOWANCE_S);
    let far = explain_row(
        event,
        &obs.station,
        obs.contact,
        observed_h,
        &Perturbation::NOMINAL,
        3.0 * sigma,
    );
    (fb.verdict, fb.diagnosis) = if c.sun_altitude_deg < -0.5 {
        ("rejected", Some(format!("the Sun was {:.1} degrees below the horizon at this station at the predicted contact; check the station's coordinates (a longitude's sign?) and the date", -c.sun_altitude_deg)))
    } else if o_c.abs() <= 3.0 * sigma {
        (
            "fits",
            Some(format!(
                "{o_c:+.1} s from the prediction, within what the timing's uncertainty allows"
            )),
        )
    } else if o_c.abs() <= (10.0 * sigma).max(120.0) {
        ("doubtful", Some(far.unwrap_or_else(|| format!("{o_c:+.1} s from the prediction: more than the stated uncertainty ({:.0} s) allows; check the clock and the contact's number", obs.sigma_s))))
    } else {
        ("rejected", Some(far.unwrap_or_else(|| format!("{o_c:+.0} s from the prediction, far more than any parallax or clock error; check the date, the time zone and the contact's number"))))
    };
    fb
}

/// A timed interval against the interval predicted at the station (no instant to give).
fn judge_interval(
    event: &TransitEvent,
    obs: &Observation,
    d: &crate::observations::timings::Interval,
    mut fb: TimingFeedback,
) -> TimingFeedback {
    let p = event.predict(&obs.station);
    let (Some(a), Some(b)) = (p.contacts[d.first.index()], p.contacts[obs.contact.index()]) else {
        fb.diagnosis = Some(format!(
            "this station sees no interval {} of this transit",
            obs.contact_label()
        ));
        return fb;
    };
    let observed_h = crate::reduction::screening::interval_hours(obs, d, event);
    let o_c = (observed_h - (b.hours - a.hours)) * 3600.0;
    fb.o_c_s = Some(o_c);
    fb.sun_altitude_deg = Some(a.sun_altitude_deg.min(b.sun_altitude_deg));
    let sigma = obs.sigma_s.hypot(MODEL_ALLOWANCE_S);
    (fb.verdict, fb.diagnosis) = if o_c.abs() <= 3.0 * sigma {
        ("fits", Some(format!("the interval is {o_c:+.1} s from the predicted one, within what its uncertainty allows")))
    } else if o_c.abs() <= (10.0 * sigma).max(120.0) {
        ("doubtful", Some(format!("the interval is {o_c:+.1} s from the predicted one: more than its uncertainty ({:.0} s) allows; check the two readings and the pair of contacts", obs.sigma_s)))
    } else {
        ("rejected", Some(format!("the interval is {o_c:+.0} s from the predicted one; check the pair of contacts and the readings")))
    };
    fb
}

/// Feedback for each timing of a submission, in order.
pub fn feedback(event: &TransitEvent, fields: &[TimingFields]) -> Vec<TimingFeedback> {
    let Some(set) = read(fields) else {
        return fields
            .iter()
            .map(|_| TimingFeedback {
                contact: None,
                predicted_utc: None,
                o_c_s: None,
                sun_altitude_deg: None,
                verdict: "rejected",
                diagnosis: Some("the submission could not be read as timings".into()),
            })
            .collect();
    };
    (0..fields.len())
        .map(|k| {
            let line = k as u64 + 2;
            if let Some(obs) = set.valid.iter().find(|o| o.line == line) {
                return judge(event, obs);
            }
            let r = set.rejected.iter().find(|r| r.line == line);
            TimingFeedback {
                contact: r.and_then(|r| r.contact),
                predicted_utc: None,
                o_c_s: None,
                sun_altitude_deg: None,
                verdict: "rejected",
                diagnosis: Some(
                    r.and_then(|r| r.diagnosis.clone())
                        .unwrap_or_else(|| "the row cannot be read".into()),
                ),
            }
        })
        .collect()
}

/// The information these timings carry on the parallax, sum of (sensitivity / sigma)^2
/// (arcsec^-2), before the planet's place and the radii are fitted: the numerator of a
/// station's expected share.
pub fn parallax_information(event: &TransitEvent, fields: &[TimingFields]) -> f64 {
    read(fields).map_or(0.0, |set| information_of_set(event, &set))
}

/// [`parallax_information`] of timings already read: each row's prediction on its own (in
/// parallel), summed in order so that the figure is the same on any number of cores.
pub fn information_of_set(
    event: &TransitEvent,
    set: &crate::observations::timings::ObservationSet,
) -> f64 {
    use rayon::prelude::*;
    let terms: Vec<f64> = set
        .valid
        .par_iter()
        .with_min_len(256)
        .map(|o| {
            let p = event.predict(&o.station);
            let Some(c) = p.contacts[o.contact.index()] else {
                return 0.0;
            };
            // An interval's sensitivity is the difference of its two contacts'.
            let first = match o.duration {
                Some(d) => match p.contacts[d.first.index()] {
                    Some(f) => Some(f),
                    None => return 0.0,
                },
                None => None,
            };
            let sensitivity =
                c.sensitivity_s_per_arcsec - first.map_or(0.0, |f| f.sensitivity_s_per_arcsec);
            let up = c
                .sun_altitude_deg
                .min(first.map_or(90.0, |f| f.sun_altitude_deg))
                > -0.5;
            if up {
                (sensitivity / o.sigma_s).powi(2)
            } else {
                0.0
            }
        })
        .collect();
    terms.iter().sum()
}
