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

use super::feedback_sentences::{blunder_sentence, plain_reason, Sentence, Value};
use super::feedback_station::station_offsets;
pub use super::feedback_station::StationAdvice;
use super::feedback_words::{example_time, VerdictWords};
use super::store::{export_csv, StoredTiming, TimingFields};
use crate::geometry::contacts::Perturbation;
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;
use crate::observations::csv_table::CsvTable;
use crate::observations::timings::{observations_from_table, Observation, ObservationSet};
use crate::reduction::agreement::{
    agreement, nominal_contact_hours, tolerance_sigma_s, Agreement, FIT_SIGMAS,
};
use crate::reduction::diagnosis::{find_row_blunder, RowBlunder};
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
    /// A sentence: the likely blunder, why the row cannot be used, or how close it is
    /// (English in the API, the visitor's language on the pages).
    pub diagnosis: Option<Sentence>,
    /// What to do about it, in plain words (none when nothing needs doing).
    pub advice: Option<Sentence>,
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
    fn unread(written: &str, contact: Option<u8>, why: Sentence, advice: Sentence) -> Self {
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
        fb.diagnosis = Some(Sentence::new("feedback-outside-years"));
        fb.advice = Some(Sentence::new("advice-check-date"));
        return fb;
    };
    let observed_h = event.elements.hours(tt);
    fb.observed_h = Some(observed_h);
    let occurs = nominal_contact_hours(event, &obs.station.geocentric(), obs.contact);
    let Some(c) = occurs.and(event.predict(&obs.station).contacts[obs.contact.index()]) else {
        let contact = Value::Text(fb.contact_as_written.clone());
        fb.diagnosis = Some(Sentence::new("feedback-contact-not-seen").with("contact", contact));
        fb.advice = Some(Sentence::new("advice-check-contact-and-place"));
        return fb;
    };
    let o_c = (observed_h - c.hours) * 3600.0;
    fb.predicted_utc = Some(crate::time::iso::format_utc(event.label(c.hours), 1));
    fb.o_c_s = Some(o_c);
    fb.sun_altitude_deg = Some(c.sun_altitude_deg);
    if c.sun_altitude_deg < MIN_VISIBLE_ALTITUDE_DEG {
        let below = Value::Decimal(-c.sun_altitude_deg, 1);
        fb.diagnosis = Some(Sentence::new("feedback-sun-down").with("degrees", below));
        fb.advice = Some(Sentence::new("advice-check-place-and-date"));
        return fb;
    }
    let tolerance_s = FIT_SIGMAS * tolerance_sigma_s(obs.sigma_s);
    let far = find_row_blunder(
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
        (o_c, obs.sigma_s, false),
        far,
    );
    fb
}

/// The verdict and its words for an instant (or an `interval`) `o_c_s` from its prediction,
/// of uncertainty `sigma_s`; `far` the blunder that explains it, if any.
fn set_verdict(
    fb: &mut TimingFeedback,
    verdict: Agreement,
    (o_c_s, sigma_s, interval): (f64, f64, bool),
    far: Option<RowBlunder>,
) {
    let diff = Value::Difference { o_c_s, interval };
    let said = |id: &'static str| Sentence::new(id).with("diff", diff.clone());
    let probably = |b: &RowBlunder| {
        said("feedback-probably").with("blunder", Value::Sentence(Box::new(blunder_sentence(b))))
    };
    fb.verdict = verdict.as_str();
    let (words, diagnosis, advice) = match (verdict, far) {
        (Agreement::Fits, _) => (VerdictWords::Fits, said("feedback-fits"), None),
        (Agreement::Doubtful, far) => (
            VerdictWords::Doubtful,
            match far {
                Some(b) => probably(&b),
                None => said("feedback-more-than-stated").with("sigma", Value::Decimal(sigma_s, 0)),
            },
            Some(Sentence::new("advice-doubtful")),
        ),
        (Agreement::Rejected, Some(b)) => (
            VerdictWords::Slip,
            probably(&b),
            Some(Sentence::new("advice-slip")),
        ),
        (Agreement::Rejected, None) => (
            VerdictWords::DoesNotFit,
            said("feedback-far-off"),
            Some(Sentence::new("advice-does-not-fit")),
        ),
    };
    (fb.verdict_words, fb.diagnosis, fb.advice) = (words, Some(diagnosis), advice);
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
        let interval = Value::Text(obs.contact_label());
        fb.diagnosis = Some(Sentence::new("feedback-interval-not-seen").with("interval", interval));
        fb.advice = Some(Sentence::new("advice-check-pair"));
        return fb;
    };
    let observed_h = crate::reduction::screening::interval_hours(obs, d, event);
    let o_c = (observed_h - (b.hours - a.hours)) * 3600.0;
    fb.o_c_s = Some(o_c);
    fb.sun_altitude_deg = Some(a.sun_altitude_deg.min(b.sun_altitude_deg));
    set_verdict(
        &mut fb,
        agreement(o_c, obs.sigma_s),
        (o_c, obs.sigma_s, true),
        None,
    );
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
                let (_, what) = plain_reason("", &example);
                let why = Sentence::new("feedback-submission-unread");
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
            let reason = r.and_then(|r| r.diagnosis.clone()).unwrap_or_default();
            let (mut why, what) = plain_reason(&reason, &example);
            if reason.is_empty() {
                why = Sentence::new("feedback-row-unread");
            }
            TimingFeedback::unread(written, r.and_then(|r| r.contact), why, what)
        })
        .collect();
    let stations = station_offsets(&mut timings);
    SubmissionFeedback { timings, stations }
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
            let said = t.diagnosis.as_ref().unwrap().english();
            assert!(said.contains("than predicted"), "{said}");
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
        let advice = &fb.stations[0].advice.english();
        assert!(
            advice.starts_with("all four of your timings are about 62 s late"),
            "{advice}"
        );
        assert!(advice.contains("check the clock"), "{advice}");
        for t in &fb.timings {
            assert!(t.station_offset);
            assert_ne!(t.verdict, "fits", "{t:?}");
            assert_eq!(
                t.advice.as_ref().map(Sentence::english).as_deref(),
                Some("see what to change for the whole station, above")
            );
        }
        // A zone left in is named as such.
        let zone = [("II", 8.0 * 3600.0 + 2.0), ("III", 8.0 * 3600.0 - 3.0)];
        let fb = feedback(&event, &rows(&event, &zone, "8"));
        let advice = fb.stations[0].advice.english();
        assert!(advice.contains("both of your timings are about 8 h late"));
        assert!(advice.contains("subtract 8 h"));
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
            t.diagnosis.as_ref().unwrap().english(),
            t.advice.as_ref().unwrap().english()
        );
        assert!(!all.contains("ISO"), "{all}");
        assert!(all.contains("like 2012-06-05 22:"), "{all}");
        // The example shown is a form the reader takes.
        let ex = example_time(&event);
        assert!(crate::time::iso::parse_utc(&ex).is_ok(), "{ex}");
    }

    /// The sentences are written in the visitor's language on the pages: a zone left in,
    /// said for the station and for each timing, in German, with no English left.
    #[test]
    fn the_sentences_are_written_in_the_visitors_language() {
        use crate::language::Language;
        let event = event_2012();
        let zone = [("II", 8.0 * 3600.0 + 2.0), ("III", 8.0 * 3600.0 - 3.0)];
        let fields = rows(&event, &zone, "8");
        let fb = feedback(&event, &fields);
        let station = fb.stations[0].advice.in_language(Language::German);
        assert!(
            station.starts_with("Ihre beiden Zeiten liegen etwa 8 h zu spät"),
            "{station}"
        );
        assert!(
            station.contains("ziehen Sie von jeder Zeit 8 h ab"),
            "{station}"
        );
        let t = &fb.timings[0];
        let said = t.diagnosis.as_ref().unwrap().in_language(Language::German);
        assert!(
            said.starts_with("8 h 0 min später als vorhergesagt: Teil des Versatzes"),
            "{said}"
        );
        assert!(
            said.contains("eine stehen gebliebene Zeitzone von 8 h"),
            "{said}"
        );
        let cards = super::super::feedback_page::feedback_cards(Language::German, &fields, &fb);
        for english in ["your timings", "than predicted", "probably", "check the"] {
            assert!(!cards.contains(english), "{english} in {cards}");
        }
        // One timing alone off by a whole number of hours: the reduction's finding, in
        // French, with the decimal comma.
        let fb = feedback(&event, &rows(&event, &[("II", -5.0 * 3600.0 + 4.0)], "8"));
        let said = fb.timings[0].diagnosis.as_ref().unwrap();
        assert!(
            said.english().contains("add 5 h to correct it"),
            "{}",
            said.english()
        );
        let fr = said.in_language(Language::French);
        assert!(
            fr.contains("l'écart est de -4,999 h") && fr.contains("ajoutez 5 h"),
            "{fr}"
        );
    }
}
