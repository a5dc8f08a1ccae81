//! Submitted contact timings: reading, validating, and accounting for every row.
//!
//! Every data row ends up either in [`ObservationSet::valid`] or in
//! [`ObservationSet::rejected`] with its line number, a reason and a diagnosis sentence; nothing
//! is dropped silently. With `strict`, the first invalid row is an error instead.

use super::angles::Meridian;
use super::contact_forms::ContactJudged;
use super::rows::{parse_row, Columns};
use super::timing_metadata::TimingMetadata;
use crate::error::{Error, Result};
use crate::geometry::contacts::Contact;
use crate::geometry::station::{normalise_longitude_deg, Station};
use crate::observations::csv_table::CsvTable;
use crate::observations::local_time::LocalReading;
use crate::observations::longitude::LongitudeKnowledge;
use crate::sky::solar_time::LocalTime;
use crate::time::calendar::Calendar;
use crate::time::iso::Zone;
use chrono::{NaiveDate, NaiveDateTime};
use serde::Serialize;
use std::collections::HashMap;
use std::path::Path;

/// Default standard uncertainty of a timing by contact (I, II, III, IV), seconds, used where
/// `sigma_s` is absent: exterior contacts are harder to time (the first touch is invisible until
/// the notch grows; the last moment is lost in the limb's glare), interior contacts are timed
/// to 5-20 s by modern amateurs (common practice, no single source).
pub const DEFAULT_SIGMA_S: [f64; 4] = [20.0, 10.0, 10.0, 20.0];

/// Why a row was not used.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum RejectReason {
    /// Malformed or impossible.
    Invalid,
    /// The same station and contact given again.
    Duplicate,
    /// Rejected by the robust outlier test (often with a diagnosed blunder).
    Outlier,
    /// Timed with the Sun below the horizon.
    NotVisible,
    /// The station's own unknowns (an unknown longitude) cannot be determined from its
    /// timings, so they are left out rather than used with a guess.
    Undetermined,
}

impl RejectReason {
    /// The word used in outputs.
    pub fn as_str(self) -> &'static str {
        match self {
            RejectReason::Invalid => "invalid",
            RejectReason::Duplicate => "duplicate",
            RejectReason::Outlier => "outlier",
            RejectReason::NotVisible => "not-visible",
            RejectReason::Undetermined => "undetermined",
        }
    }
}

/// A row that is not in the solution.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Rejected {
    /// Line in the file (the header is line 1).
    pub line: u64,
    /// Station name as given (may be empty).
    pub station: String,
    /// Contact number 1-4, if it could be read (for a timed interval, its later contact).
    pub contact: Option<u8>,
    /// The contact as written where it is not a single number: the pair of a timed interval
    /// (`2-3`), or text that is not a contact.
    pub contact_label: Option<String>,
    /// Why.
    pub reason: RejectReason,
    /// A sentence: what is wrong, the likely blunder, or how to fix it.
    pub diagnosis: Option<String>,
    /// O - C in seconds against the final solution, where it could be computed.
    pub o_c_s: Option<f64>,
}

/// A timed interval between two contacts at one station (a `duration` row).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Interval {
    /// The earlier contact (the row's `contact` is the later).
    pub first: Contact,
    /// The interval, seconds (a range's midpoint).
    pub seconds: f64,
    /// The date the row gives, if any (a duration has no instant).
    pub date: Option<NaiveDate>,
    /// The solar time the clock kept, where the row says (`local_time`): an interval of
    /// apparent time differs from one of UT by the equation of time's change.
    pub kept_to: Option<LocalTime>,
}

/// How a row was written, where it matters for notes and diagnosis.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub struct AsWritten {
    /// The calendar of its date.
    pub calendar: Calendar,
    /// The prime meridian of its longitude.
    pub meridian: Meridian,
    /// The width of a range reading (or of the minute, for a time to the minute), seconds.
    pub range_s: Option<f64>,
    /// Whether the time was written to the minute only.
    pub minute_only: bool,
    /// Whether the time was written without a date; the reduction completes it.
    pub undated: bool,
    /// Whether the longitude was written in hours of time.
    pub longitude_in_time: bool,
}

/// One usable timing.
#[derive(Clone, Debug, PartialEq)]
pub struct Observation {
    /// Line in the file.
    pub line: u64,
    /// The station.
    pub station: Station,
    /// Who (or which telescope) timed it; empty where the file does not say.
    pub observer: String,
    /// Which contact; for a timed interval, the later of its two.
    pub contact: Contact,
    /// The time as given (UTC from 1972, UT1 before; a range's midpoint); for a timed
    /// interval, noon of the date it gives, or the default label where it gives none.
    pub time_label: NaiveDateTime,
    /// Standard uncertainty, seconds (with a range's variance added).
    pub sigma_s: f64,
    /// Whether `sigma_s` came from the file (else the default for the contact).
    pub sigma_given: bool,
    /// The clock reading in local solar time, where the row gave one (`time_label` is then
    /// its label at the station's longitude or the clock's meridian).
    pub local: Option<LocalReading>,
    /// How well the station's longitude is known (`longitude_sigma_deg`).
    pub longitude: LongitudeKnowledge,
    /// How the observer judged the contact.
    pub judged: ContactJudged,
    /// For a timed interval (`duration`): its earlier contact and its length.
    pub duration: Option<Interval>,
    /// How the row was written.
    pub written: AsWritten,
    /// How the timing was made (clock, instrument, viewing, notes).
    pub metadata: TimingMetadata,
}

impl Observation {
    /// A timing of one instant (every field else at its default): for simulations and tests.
    pub fn instant(
        line: u64,
        station: Station,
        contact: Contact,
        time_label: NaiveDateTime,
        sigma_s: f64,
    ) -> Observation {
        Observation {
            line,
            station,
            observer: String::new(),
            contact,
            time_label,
            sigma_s,
            sigma_given: true,
            local: None,
            longitude: LongitudeKnowledge::Exact,
            judged: ContactJudged::Geometric,
            duration: None,
            written: AsWritten::default(),
            metadata: TimingMetadata::default(),
        }
    }

    /// The contacts the row times: (earlier, later) for an interval, (None, contact) else.
    pub fn contacts(&self) -> (Option<Contact>, Contact) {
        (self.duration.map(|d| d.first), self.contact)
    }

    /// The contact as written in outputs: `2`, or `2-3` for an interval.
    pub fn contact_label(&self) -> String {
        match self.duration {
            Some(d) => format!("{}-{}", d.first.number(), self.contact.number()),
            None => self.contact.number().to_string(),
        }
    }

    /// What two rows of one timing are compared by: an interval's length, or an instant's
    /// label as seconds from 1970 (its written time scale), s.
    pub fn value_s(&self) -> f64 {
        match self.duration {
            Some(d) => d.seconds,
            None => self.time_label.and_utc().timestamp_millis() as f64 / 1000.0,
        }
    }

    /// Whether the row's time says when (an instant, or an interval with a date).
    pub fn is_dated(&self) -> bool {
        !self.written.undated && self.duration.map_or(true, |d| d.date.is_some())
    }
}

/// All rows of an observations file, sorted into usable and rejected.
#[derive(Clone, Debug)]
pub struct ObservationSet {
    /// The file.
    pub path: std::path::PathBuf,
    /// Data rows read.
    pub rows_total: usize,
    /// Rows that passed validation (they may still be rejected by the reduction).
    pub valid: Vec<Observation>,
    /// Rows rejected so far.
    pub rejected: Vec<Rejected>,
    /// Lines whose time had no zone and was read as UTC.
    pub lines_without_zone: Vec<u64>,
    /// Lines whose time was a range, or written to the minute only.
    pub lines_with_ranges: Vec<u64>,
    /// Other sentences about how rows were read (elevations that differ a little).
    pub notes: Vec<String>,
}

impl ObservationSet {
    /// Sentences about how rows were read that the user should know (times without a zone,
    /// ranges and times to the minute).
    pub fn reading_notes(&self) -> Vec<String> {
        let lines = |l: &[u64]| {
            let shown: Vec<String> = l.iter().take(8).map(|n| n.to_string()).collect();
            let more = if l.len() > 8 { ", ..." } else { "" };
            format!(
                "line{} {}{more}",
                if l.len() == 1 { "" } else { "s" },
                shown.join(", ")
            )
        };
        let mut out = Vec::new();
        let l = &self.lines_without_zone;
        if !l.is_empty() {
            out.push(format!(
                "{} without a trailing Z ({}) {} read as UTC; write times as 2012-06-05T22:25:41.3Z, or with their offset (+08:00)",
                crate::words::count(l.len(), "time", "times"),
                lines(l),
                if l.len() == 1 { "was" } else { "were" }
            ));
        }
        let l = &self.lines_with_ranges;
        if !l.is_empty() {
            out.push(format!(
                "{} given as a range or to the minute only ({}) {} used at the range's middle, with its width / sqrt(12) added to the uncertainty in quadrature",
                crate::words::count(l.len(), "reading", "readings"),
                lines(l),
                if l.len() == 1 { "is" } else { "are" }
            ));
        }
        out.extend(self.notes.iter().cloned());
        out
    }
}

/// Read an observations file: columns `station,latitude,longitude,elevation_m,contact,time_utc`
/// and optionally `sigma_s`, found by header name (`elevation_m` may be absent: 0 m).
///
/// Errors: unreadable, non-UTF-8 or empty file, or a missing required column; with `strict`,
/// also the first invalid row.
pub fn read_observations(path: &Path, strict: bool) -> Result<ObservationSet> {
    let table = CsvTable::read(path)?;
    observations_from_table(&table, strict)
}

/// Sort the rows of an already-read table (see [`read_observations`]).
pub fn observations_from_table(table: &CsvTable, strict: bool) -> Result<ObservationSet> {
    let cols = Columns::find(table)?;
    let mut set = ObservationSet {
        path: table.path.clone(),
        rows_total: table.records.len(),
        valid: Vec::new(),
        rejected: Vec::new(),
        lines_without_zone: Vec::new(),
        lines_with_ranges: Vec::new(),
        notes: Vec::new(),
    };
    // First line of each station, with its coordinates; first line of each timing's identity
    // (station, observer, contact or pair, judgement).
    let mut first_coords: FirstCoordinates = HashMap::new();
    let mut first_contact: HashMap<TimingKey, (u64, f64)> = HashMap::new();
    // Each row reads on its own (in parallel on a large file); what rows say about each
    // other (moved stations, duplicates) is decided in file order below.
    let parsed: Vec<_> = {
        use rayon::prelude::*;
        table
            .records
            .par_iter()
            .with_min_len(1024)
            .map(|(line, rec)| parse_row(table, *line, rec, &cols))
            .collect()
    };
    for ((line, rec), row) in table.records.iter().zip(parsed) {
        let name = table.text(rec, cols.station).to_string();
        match row {
            Ok((mut obs, zone)) => {
                if zone == Zone::Missing {
                    set.lines_without_zone.push(*line);
                }
                if obs.written.range_s.is_some() {
                    set.lines_with_ranges.push(*line);
                }
                let key = (
                    obs.station.name.clone(),
                    obs.observer.clone(),
                    obs.contact_label(),
                    obs.judged,
                );
                let notes = &mut set.notes;
                if let Some(message) = moved_station(&mut first_coords, &mut obs, *line, notes) {
                    let c = Some(obs.contact_label());
                    let col = Some(cols.station);
                    reject_or_fail(table, &mut set, *line, &name, c, message, col, strict)?;
                    continue;
                }
                if let Some(&(l0, t0)) = first_contact.get(&key) {
                    set.rejected.push(duplicate(&obs, name, *line, (l0, t0)));
                    continue;
                }
                first_contact.insert(key, (*line, obs.value_s()));
                set.valid.push(obs);
            }
            Err((message, column)) => {
                let text = table.text(rec, cols.contact);
                let contact =
                    Some(Contact::parse(text).map_or(text.to_string(), |c| c.number().to_string()));
                reject_or_fail(
                    table, &mut set, *line, &name, contact, message, column, strict,
                )?;
            }
        }
    }
    Ok(set)
}

/// What makes two rows the same timing: station, observer, contact (or pair) and judgement.
type TimingKey = (String, String, String, ContactJudged);

/// First line of each station, with its latitude, longitude and elevation.
type FirstCoordinates = HashMap<String, (u64, f64, f64, f64)>;

/// Elevations of one station that differ by up to this much (metres) are taken as the same
/// place, with a note: a GPS and a map rarely agree better (common practice, no source).
pub const ELEVATION_TOLERANCE_M: f64 = 50.0;

/// If the station was given before with other coordinates, the sentence that says so;
/// otherwise remember its coordinates. An elevation within [`ELEVATION_TOLERANCE_M`] of the
/// first is accepted with a note (the first is used).
fn moved_station(
    first: &mut FirstCoordinates,
    obs: &mut Observation,
    line: u64,
    notes: &mut Vec<String>,
) -> Option<String> {
    let st = obs.station.clone();
    let coords = (st.latitude_deg, st.longitude_deg, st.elevation_m);
    let Some(&(l0, la, lo, el)) = first.get(&st.name) else {
        first.insert(st.name.clone(), (line, coords.0, coords.1, coords.2));
        return None;
    };
    let moved = (la - coords.0).abs() > 1e-4
        || normalise_longitude_deg(lo - coords.1).abs() > 1e-4
        || (el - coords.2).abs() > ELEVATION_TOLERANCE_M;
    if !moved && (el - coords.2).abs() > 1.0 {
        notes.push(format!(
            "station '{}' is at {el} m on line {l0} and {} m on line {line}; the first elevation is used",
            st.name, coords.2
        ));
        obs.station.elevation_m = el;
    }
    moved.then(|| {
        format!(
            "station '{}' was given on line {l0} at {la}, {lo}, {el} m but here at {}, {}, {} m; give each station one set of coordinates (or a different name)",
            st.name, coords.0, coords.1, coords.2
        )
    })
}

/// A second timing of the same contact (or interval) at the same station (the first, on line
/// `l0` with [`Observation::value_s`] `v0`, is kept).
fn duplicate(obs: &Observation, name: String, line: u64, (l0, v0): (u64, f64)) -> Rejected {
    let diff = ((obs.value_s() - v0) * 1000.0).round() / 1000.0;
    let by = if obs.observer.is_empty() {
        String::new()
    } else {
        format!(" by {}", obs.observer)
    };
    let diagnosis = if diff == 0.0 {
        format!("the same timing was given on line {l0}")
    } else {
        format!(
            "{} at this station was already timed{by} on line {l0} ({diff:+.1} s from it); the first is kept (rows of different observers, or of different judgements of the contact, are separate timings: give the observer column)",
            match obs.duration {
                Some(d) => format!("the interval {}-{}", d.first.roman(), obs.contact.roman()),
                None => format!("contact {}", obs.contact.roman()),
            }
        )
    };
    Rejected {
        line,
        station: name,
        contact: Some(obs.contact.number()),
        contact_label: obs.duration.map(|_| obs.contact_label()),
        reason: RejectReason::Duplicate,
        diagnosis: Some(diagnosis),
        o_c_s: None,
    }
}

#[allow(clippy::too_many_arguments)]
fn reject_or_fail(
    table: &CsvTable,
    set: &mut ObservationSet,
    line: u64,
    station: &str,
    contact: Option<String>,
    message: String,
    column: Option<usize>,
    strict: bool,
) -> Result<()> {
    if strict {
        return Err(Error::Input {
            location: table.location(line, column),
            message,
            hint:
                "correct or remove the row (without --strict, invalid rows are listed and skipped)"
                    .into(),
        });
    }
    set.rejected.push(Rejected {
        line,
        station: station.to_string(),
        contact: contact.as_deref().and_then(|c| c.parse::<u8>().ok()),
        contact_label: contact.filter(|c| c.parse::<u8>().is_err() && !c.is_empty()),
        reason: RejectReason::Invalid,
        diagnosis: Some(message),
        o_c_s: None,
    });
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    fn set(text: &str) -> ObservationSet {
        let t = CsvTable::from_bytes(Path::new("t.csv"), text.as_bytes()).unwrap();
        observations_from_table(&t, false).unwrap()
    }

    const HEAD: &str = "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s\n";

    /// Found in review: two intervals of one pair were compared by their (undated) labels,
    /// so different durations were called "the same timing".
    #[test]
    fn duplicate_intervals_are_compared_by_their_length() {
        let head = "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s,duration\n";
        let s = set(&format!(
            "{head}a,10,20,0,2-3,,5,5:49:52\na,10,20,0,2-3,,5,5:49:58\na,10,20,0,2-3,,5,5:49:52\n"
        ));
        assert_eq!(s.valid.len(), 1);
        let d: Vec<&str> = s
            .rejected
            .iter()
            .filter_map(|r| r.diagnosis.as_deref())
            .collect();
        assert!(
            d[0].contains("the interval II-III") && d[0].contains("+6.0 s"),
            "{d:?}"
        );
        assert!(d[1].contains("the same timing"), "{d:?}");
    }

    #[test]
    fn every_row_is_accounted_for() {
        let text = format!(
            "{HEAD}a,10,20,0,2,2012-06-05T22:30:00Z,5\n\
             a,10,20,0,II,2012-06-05T22:30:00Z,5\n\
             a,10,20,0,3,2012-06-06T04:30:00Z,-1\n\
             b,95,20,0,2,2012-06-05T22:30:00Z,5\n\
             b,10,20,0,V,2012-06-05T22:30:00Z,5\n\
             c,10,20,0,C3,not a time,\n\
             a,11,20,0,4,2012-06-06T04:50:00Z,\n\
             d,-5,200,0,iv,2012-06-06T04:50:00Z,\n"
        );
        let s = set(&text);
        assert_eq!(s.rows_total, 8);
        assert_eq!(s.valid.len() + s.rejected.len(), 8);
        let reasons: Vec<(u64, RejectReason)> =
            s.rejected.iter().map(|r| (r.line, r.reason)).collect();
        assert!(reasons.contains(&(3, RejectReason::Duplicate)));
        for line in [4, 5, 6, 7, 8] {
            assert!(
                reasons.contains(&(line, RejectReason::Invalid)),
                "line {line}: {reasons:?}"
            );
        }
        let d = s.valid.iter().find(|o| o.station.name == "d").unwrap();
        assert_eq!(d.contact, Contact::IV);
        assert_eq!(d.station.longitude_deg, -160.0);
        assert_eq!(d.sigma_s, DEFAULT_SIGMA_S[3]);
    }

    #[test]
    fn strict_mode_names_the_first_bad_line() {
        let text = format!(
            "{HEAD}a,10,20,0,2,2012-06-05T22:30:00Z,5\nb,10,20,0,9,2012-06-05T22:30:00Z,5\n"
        );
        let t = CsvTable::from_bytes(Path::new("t.csv"), text.as_bytes()).unwrap();
        let err = observations_from_table(&t, true).unwrap_err().to_string();
        assert!(err.contains("t.csv:3:5"), "{err}");
    }
}
