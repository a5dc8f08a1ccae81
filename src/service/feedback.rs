//! Instant feedback on a submission: each timing read by the same rules as `reduce`, then
//! compared with its prediction at the station (the nominal parallax and the ephemeris's
//! place): O - C, the Sun's altitude, a verdict and, for a timing far off, the likely blunder
//! by the reduction's own rules (`reduction::diagnosis::explain_row`: zone time, date,
//! contacts exchanged, half a day); an offset that all of a station's timings share, named
//! once for the station; and the station's expected share of the information on the
//! parallax.
//!
//! The verdict is the reduction's own rule (`reduction::agreement`), so that the solution
//! never contradicts it: whether the contact occurs at the station is the ephemeris's at
//! nominal parameters; "fits" within 3 tolerance sigmas (the timing's sigma with 4 s for what
//! the prediction does not know), "doubtful" within ten of them or two minutes, "rejected"
//! beyond (a gross blunder, which the reduction screens before its first fit), when the Sun
//! was down, or when the row cannot be read. The JSON keeps those three words; people read
//! plain ones (`verdict_words`, `advice`).

use super::feedback_words::{
    difference_words, example_time, offset_cause, plain, plain_reason, station_advice, VerdictWords,
};
use super::store::{export_csv, StoredTiming, TimingFields};
use crate::geometry::contacts::Perturbation;
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;
use crate::observations::csv_table::CsvTable;
use crate::observations::timings::{observations_from_table, Observation, ObservationSet};
use crate::reduction::agreement::{
    agreement, nominal_contact_hours, tolerance_sigma_s, Agreement, FIT_SIGMAS,
};
use crate::reduction::diagnosis::{clock_offset_s, explain_row};
use crate::reduction::rejection::NOMINAL_CLOCK_SIGMAS;
use crate::reduction::screening::MIN_VISIBLE_ALTITUDE_DEG;
use serde::Serialize;

/// What a participant sees for one timing.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct TimingFeedback {
    /// The contact, where it could be read (1-4).
    pub contact: Option<u8>,
    /// The contact as the participant wrote it (`II`, `2`, `C2`).
    pub contact_as_written: String,
    /// The predicted time of that contact at the station (UTC from 1972, UT1 before).
    pub predicted_utc: Option<String>,
    /// Observed minus predicted, seconds.
    pub o_c_s: Option<f64>,
    /// The Sun's true altitude at the predicted contact, degrees.
    pub sun_altitude_deg: Option<f64>,
    /// `fits`, `doubtful` or `rejected`.
    pub verdict: &'static str,
    /// The verdict in words for people ("fits", "probably a slip you can fix", ...).
    pub verdict_words: VerdictWords,
    /// A sentence: the likely blunder, why the row cannot be used, or how close it is.
    pub diagnosis: Option<String>,
    /// What to do about it, in plain words (none when nothing needs doing).
    pub advice: Option<String>,
    /// Whether the timing shares an offset with every other timing of its station, named
    /// once for the station (`station_advice`).
    pub station_offset: bool,
    /// Whether the row could be read as a timing.
    #[serde(skip)]
    pub readable: bool,
    /// The observed instant, hours from the elements' epoch (TT), for the drawing.
    #[serde(skip)]
    pub observed_h: Option<f64>,
    /// The station as read.
    #[serde(skip)]
    pub station: Option<Station>,
    /// The timing's standard uncertainty as read, seconds.
    #[serde(skip)]
    pub sigma_s: Option<f64>,
}

/// An offset common to every timing of one station, said once.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct StationAdvice {
    /// The station's name.
    pub station: String,
    /// How many of its timings share the offset.
    pub timings: usize,
    /// The common offset, seconds (positive: late).
    pub offset_s: f64,
    /// What it probably is and what to change.
    pub advice: String,
}

/// The feedback on one submission.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct SubmissionFeedback {
    /// One per row, in order.
    pub timings: Vec<TimingFeedback>,
    /// The offsets common to a station's timings.
    pub stations: Vec<StationAdvice>,
}

impl SubmissionFeedback {
    /// How many rows could be read as timings.
    pub fn rows_read(&self) -> usize {
        self.timings.iter().filter(|t| t.readable).count()
    }
}

/// Read these fields as `reduce` would (one data line each, in order).
fn read(fields: &[TimingFields]) -> Option<ObservationSet> {
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

impl TimingFeedback {
    /// A row that could not be read, with the reason in plain words.
    fn unread(written: &str, contact: Option<u8>, why: String, advice: String) -> Self {
        TimingFeedback {
            contact,
            contact_as_written: written.trim().to_string(),
            predicted_utc: None,
            o_c_s: None,
            sun_altitude_deg: None,
            verdict: Agreement::Rejected.as_str(),
            verdict_words: VerdictWords::Unread,
            diagnosis: Some(why),
            advice: Some(advice),
            station_offset: false,
            readable: false,
            observed_h: None,
            station: None,
            sigma_s: None,
        }
    }

    /// A row read as a timing, before it is judged.
    fn read_as(obs: &Observation, written: &str) -> Self {
        TimingFeedback {
            contact: Some(obs.contact.number()),
            contact_as_written: written.trim().to_string(),
            predicted_utc: None,
            o_c_s: None,
            sun_altitude_deg: None,
            verdict: Agreement::Rejected.as_str(),
            verdict_words: VerdictWords::DoesNotFit,
            diagnosis: None,
            advice: None,
            station_offset: false,
            readable: true,
            observed_h: None,
            station: Some(obs.station.clone()),
            sigma_s: Some(obs.sigma_s),
        }
    }
}

fn judge(event: &TransitEvent, obs: &Observation, written: &str) -> TimingFeedback {
    let mut fb = TimingFeedback::read_as(obs, written);
    if let Some(d) = obs.duration {
        return judge_interval(event, obs, &d, fb);
    }
    // A time without a date is judged on the day nearest its prediction, as the reduction does.
    let mut completed = obs.clone();
    crate::reduction::undated::complete_date(&mut completed, event);
    let obs = &completed;
    let Ok(tt) = event.time_model().tt_from_label(obs.time_label) else {
        fb.diagnosis = Some("the time lies outside the years the tool covers".into());
        fb.advice = Some("check the date".into());
        return fb;
    };
    let observed_h = event.elements.hours(tt);
    fb.observed_h = Some(observed_h);
    let occurs = nominal_contact_hours(event, &obs.station.geocentric(), obs.contact);
    let Some(c) = occurs.and(event.predict(&obs.station).contacts[obs.contact.index()]) else {
        fb.diagnosis = Some(format!(
            "your station does not see contact {} of this transit (the planet's path as seen from there misses that circle)",
            fb.contact_as_written
        ));
        fb.advice = Some("check the contact's number and your station's coordinates (south latitudes and west longitudes are negative)".into());
        return fb;
    };
    let o_c = (observed_h - c.hours) * 3600.0;
    fb.predicted_utc = Some(crate::time::iso::format_utc(event.label(c.hours), 1));
    fb.o_c_s = Some(o_c);
    fb.sun_altitude_deg = Some(c.sun_altitude_deg);
    if c.sun_altitude_deg < MIN_VISIBLE_ALTITUDE_DEG {
        fb.diagnosis = Some(format!(
            "the Sun was {:.1} degrees below the horizon at your station at this contact",
            -c.sun_altitude_deg
        ));
        fb.advice = Some(
            "check your station's coordinates (west longitudes are negative) and the date".into(),
        );
        return fb;
    }
    let tolerance_s = FIT_SIGMAS * tolerance_sigma_s(obs.sigma_s);
    let far = explain_row(
        event,
        &obs.station,
        obs.contact,
        observed_h,
        &Perturbation::NOMINAL,
        tolerance_s,
    );
    set_verdict(
        &mut fb,
        agreement(o_c, obs.sigma_s),
        (o_c, obs.sigma_s),
        far,
    );
    fb
}

/// The verdict and its words for an instant `o_c_s` from its prediction, of uncertainty
/// `sigma_s`; `far` the blunder that explains it, if any.
fn set_verdict(
    fb: &mut TimingFeedback,
    verdict: Agreement,
    (o_c_s, sigma_s): (f64, f64),
    far: Option<String>,
) {
    let diff = difference_words(o_c_s);
    fb.verdict = verdict.as_str();
    (fb.verdict_words, fb.diagnosis, fb.advice) = match (verdict, far) {
        (Agreement::Fits, _) => (
            VerdictWords::Fits,
            Some(format!("{diff}: within what your timing's uncertainty allows")),
            None,
        ),
        (Agreement::Doubtful, far) => (
            VerdictWords::Doubtful,
            Some(match far {
                Some(f) => format!("{diff}: probably {}", plain(&f)),
                None => format!("{diff}: more than your stated uncertainty ({sigma_s:.0} s) allows"),
            }),
            Some("check the clock you timed with and the contact's number; if the time is right as written, leave it: the solution weighs it with the others".into()),
        ),
        (Agreement::Rejected, Some(f)) => (
            VerdictWords::Slip,
            Some(format!("{diff}: probably {}", plain(&f))),
            Some("correct the time as said, then send it again through your private link below".into()),
        ),
        (Agreement::Rejected, None) => (
            VerdictWords::DoesNotFit,
            Some(format!("{diff}: far more than any error of the prediction or of a clock")),
            Some("check the date, the time zone (give the time in UTC) and the contact's number".into()),
        ),
    };
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
            "your station does not see the interval {} of this transit",
            obs.contact_label()
        ));
        fb.advice = Some("check the pair of contacts and your station's coordinates".into());
        return fb;
    };
    let observed_h = crate::reduction::screening::interval_hours(obs, d, event);
    let o_c = (observed_h - (b.hours - a.hours)) * 3600.0;
    fb.o_c_s = Some(o_c);
    fb.sun_altitude_deg = Some(a.sun_altitude_deg.min(b.sun_altitude_deg));
    set_verdict(
        &mut fb,
        agreement(o_c, obs.sigma_s),
        (o_c, obs.sigma_s),
        None,
    );
    if let Some(text) = &mut fb.diagnosis {
        *text = text.replace("than predicted", "than the predicted interval");
    }
    fb
}

/// The contact as the participant wrote it (as stored where that is not known).
fn as_written(f: &TimingFields) -> &str {
    if f.contact_as_written.is_empty() {
        &f.contact
    } else {
        &f.contact_as_written
    }
}

/// Feedback for each timing of a submission, in order, and the offsets its stations share.
pub fn feedback(event: &TransitEvent, fields: &[TimingFields]) -> SubmissionFeedback {
    let example = example_time(event);
    let Some(set) = read(fields) else {
        let timings = fields
            .iter()
            .map(|f| {
                let (why, what) =
                    plain_reason("the submission could not be read as timings", &example);
                TimingFeedback::unread(as_written(f), None, why, what)
            })
            .collect();
        return SubmissionFeedback {
            timings,
            stations: Vec::new(),
        };
    };
    let mut timings: Vec<TimingFeedback> = fields
        .iter()
        .enumerate()
        .map(|(k, f)| {
            let line = k as u64 + 2;
            let written = as_written(f);
            if let Some(obs) = set.valid.iter().find(|o| o.line == line) {
                return judge(event, obs, written);
            }
            let r = set.rejected.iter().find(|r| r.line == line);
            let reason = r
                .and_then(|r| r.diagnosis.clone())
                .unwrap_or_else(|| "the row cannot be read".into());
            let (why, what) = plain_reason(&reason, &example);
            TimingFeedback::unread(written, r.and_then(|r| r.contact), why, what)
        })
        .collect();
    let stations = station_offsets(&mut timings);
    SubmissionFeedback { timings, stations }
}

/// Find each station whose instants (two or more) share one offset beyond their uncertainty
/// (the reduction's own test, `reduction::diagnosis::clock_offset_s`, at unit scatter and
/// three standard errors), name it once, and let each timing refer to it.
fn station_offsets(timings: &mut [TimingFeedback]) -> Vec<StationAdvice> {
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
    t.diagnosis = Some(format!(
        "{}: part of the offset that all your timings share, probably {} (said once, above); without it this timing is {:+.1} s from its prediction",
        difference_words(o_c),
        offset_cause(offset_s),
        o_c - offset_s
    ));
    t.advice = Some("see what to change for the whole station, above".into());
}

/// The information these timings carry on the parallax, sum of (sensitivity / sigma)^2
/// (arcsec^-2), before the planet's place and the radii are fitted: the numerator of a
/// station's expected share.
pub fn parallax_information(event: &TransitEvent, fields: &[TimingFields]) -> f64 {
    read(fields).map_or(0.0, |set| information_of_set(event, &set))
}

/// [`parallax_information`] of timings already read: each row's contacts predicted on their own (in
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
            let Some(c) = event.predict_contact(&o.station, o.contact) else {
                return 0.0;
            };
            // An interval's sensitivity is the difference of its two contacts'.
            let first = match o.duration {
                Some(d) => match event.predict_contact(&o.station, d.first) {
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

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{transit_on_date, Planet, TimeModel};

    fn event_2012() -> TransitEvent {
        let date = chrono::NaiveDate::from_ymd_opt(2012, 6, 6).unwrap();
        transit_on_date(Planet::Venus, date, &TimeModel::default()).unwrap()
    }

    /// Rows of an invented station, each contact at its prediction plus `offsets_s`.
    fn rows(event: &TransitEvent, contacts: &[(&str, f64)], sigma_s: &str) -> Vec<TimingFields> {
        let st = Station::new("Quayside Club", 22.28, 114.16, 40.0).unwrap();
        let p = event.predict(&st);
        contacts
            .iter()
            .map(|(written, offset_s)| {
                let c = crate::geometry::contacts::Contact::parse(written).unwrap();
                let h = p.contacts[c.index()].unwrap().hours + offset_s / 3600.0;
                TimingFields {
                    station: st.name.clone(),
                    latitude: "22.28".into(),
                    longitude: "114.16".into(),
                    elevation_m: "40".into(),
                    contact: c.number().to_string(),
                    contact_as_written: written.to_string(),
                    time_utc: crate::time::iso::format_utc(event.label(h), 1),
                    sigma_s: sigma_s.into(),
                    ..TimingFields::default()
                }
            })
            .collect()
    }

    #[test]
    fn contacts_are_echoed_as_written() {
        let event = event_2012();
        let fb = feedback(&event, &rows(&event, &[("II", 3.0), ("c3", -2.0)], "8"));
        assert_eq!(fb.timings[0].contact_as_written, "II");
        assert_eq!(fb.timings[0].contact, Some(2));
        assert_eq!(fb.timings[1].contact_as_written, "c3");
        for t in &fb.timings {
            assert_eq!(t.verdict, "fits", "{t:?}");
            assert!(t.diagnosis.as_deref().unwrap().contains("than predicted"));
        }
        assert!(fb.stations.is_empty());
    }

    #[test]
    fn a_station_wide_offset_is_named_once() {
        // A clock about a minute off: four different advices before (issue 20).
        let event = event_2012();
        let contacts = [("I", 62.0), ("II", 58.0), ("III", 66.0), ("IV", 61.0)];
        let fb = feedback(&event, &rows(&event, &contacts, "20"));
        assert_eq!(fb.stations.len(), 1, "{:?}", fb.stations);
        let advice = &fb.stations[0].advice;
        assert!(
            advice.starts_with("all four of your timings are about 62 s late"),
            "{advice}"
        );
        assert!(advice.contains("check the clock"), "{advice}");
        for t in &fb.timings {
            assert!(t.station_offset);
            assert_ne!(t.verdict, "fits", "{t:?}");
            assert_eq!(
                t.advice.as_deref(),
                Some("see what to change for the whole station, above")
            );
        }
        // A zone left in is named as such.
        let zone = [("II", 8.0 * 3600.0 + 2.0), ("III", 8.0 * 3600.0 - 3.0)];
        let fb = feedback(&event, &rows(&event, &zone, "8"));
        assert!(fb.stations[0]
            .advice
            .contains("both of your timings are about 8 h late"));
        assert!(fb.stations[0].advice.contains("subtract 8 h"));
        assert_eq!(fb.timings[0].verdict, "rejected");
        assert_eq!(fb.timings[0].verdict_words, "probably a slip you can fix");
        // Timings that disagree among themselves get their own words.
        let mixed = [("II", 60.0), ("III", -60.0)];
        assert!(feedback(&event, &rows(&event, &mixed, "8"))
            .stations
            .is_empty());
    }

    #[test]
    fn an_unreadable_time_is_said_plainly_with_an_example() {
        let event = event_2012();
        let mut r = rows(&event, &[("II", 0.0)], "8");
        r[0].time_utc = "half past ten".into();
        let fb = feedback(&event, &r);
        assert_eq!(fb.rows_read(), 0);
        let t = &fb.timings[0];
        assert_eq!(t.verdict, "rejected");
        assert_eq!(t.verdict_words, "could not be read");
        let all = format!(
            "{} {}",
            t.diagnosis.as_deref().unwrap(),
            t.advice.as_deref().unwrap()
        );
        assert!(!all.contains("ISO"), "{all}");
        assert!(all.contains("like 2012-06-05 22:"), "{all}");
        // The example shown is a form the reader takes.
        let ex = example_time(&event);
        assert!(crate::time::iso::parse_utc(&ex).is_ok(), "{ex}");
    }
}
