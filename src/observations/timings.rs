//! Submitted contact timings: reading, validating, and accounting for every row.
//!
//! Every data row ends up either in [`ObservationSet::valid`] or in
//! [`ObservationSet::rejected`] with its line number, a reason and a diagnosis sentence; nothing
//! is dropped silently. With `strict`, the first invalid row is an error instead.

use crate::error::{Error, Result};
use crate::geometry::contacts::Contact;
use crate::geometry::station::{
    normalise_longitude_deg, Station, MAX_ELEVATION_M, MIN_ELEVATION_M,
};
use crate::observations::csv_table::CsvTable;
use crate::observations::local_time::{parse_local, LocalColumns, LocalReading};
use crate::observations::longitude::LongitudeKnowledge;
use crate::time::iso::{parse_utc_zoned, Zone};
use crate::time::scales::{MAX_YEAR, MIN_YEAR};
use chrono::{Datelike, NaiveDateTime};
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
    /// Contact number 1-4, if it could be read.
    pub contact: Option<u8>,
    /// Why.
    pub reason: RejectReason,
    /// A sentence: what is wrong, the likely blunder, or how to fix it.
    pub diagnosis: Option<String>,
    /// O - C in seconds against the final solution, where it could be computed.
    pub o_c_s: Option<f64>,
}

/// One usable timing.
#[derive(Clone, Debug, PartialEq)]
pub struct Observation {
    /// Line in the file.
    pub line: u64,
    /// The station.
    pub station: Station,
    /// Which contact.
    pub contact: Contact,
    /// The time as given (UTC from 1972, UT1 before).
    pub time_label: NaiveDateTime,
    /// Standard uncertainty, seconds.
    pub sigma_s: f64,
    /// Whether `sigma_s` came from the file (else the default for the contact).
    pub sigma_given: bool,
    /// The clock reading in local solar time, where the row gave one (`time_label` is then
    /// its UT1 at the station's longitude).
    pub local: Option<LocalReading>,
    /// How well the station's longitude is known (`longitude_sigma_deg`).
    pub longitude: LongitudeKnowledge,
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
    /// Other sentences about how rows were read (elevations that differ a little).
    pub notes: Vec<String>,
}

impl ObservationSet {
    /// Sentences about how rows were read that the user should know (times without a zone).
    pub fn reading_notes(&self) -> Vec<String> {
        let l = &self.lines_without_zone;
        if l.is_empty() {
            return self.notes.clone();
        }
        let shown: Vec<String> = l.iter().take(8).map(|n| n.to_string()).collect();
        let more = if l.len() > 8 { ", ..." } else { "" };
        vec![format!(
            "{} without a trailing Z (line{} {}{more}) {} read as UTC; write times as 2012-06-05T22:25:41.3Z, or with their offset (+08:00)",
            crate::words::count(l.len(), "time", "times"),
            if l.len() == 1 { "" } else { "s" },
            shown.join(", "),
            if l.len() == 1 { "was" } else { "were" }
        )]
        .into_iter()
        .chain(self.notes.iter().cloned())
        .collect()
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

struct Columns {
    station: usize,
    lat: usize,
    lon: usize,
    elev: Option<usize>,
    contact: usize,
    time: Option<usize>,
    local: LocalColumns,
    longitude_sigma: Option<usize>,
    sigma: Option<usize>,
}

/// Sort the rows of an already-read table (see [`read_observations`]).
pub fn observations_from_table(table: &CsvTable, strict: bool) -> Result<ObservationSet> {
    let cols = Columns {
        station: table.require("station")?,
        lat: table.require("latitude")?,
        lon: table.require("longitude")?,
        elev: table.optional("elevation_m"),
        contact: table.require("contact")?,
        time: table.optional("time_utc"),
        local: LocalColumns {
            time_local: table.optional("time_local"),
            local_time: table.optional("local_time"),
            day_reckoning: table.optional("day_reckoning"),
        },
        longitude_sigma: table.optional("longitude_sigma_deg"),
        sigma: table.optional("sigma_s"),
    };
    if cols.time.is_none() && cols.local.time_local.is_none() {
        // The message names the column every modern file has.
        table.require("time_utc")?;
    }
    let mut set = ObservationSet {
        path: table.path.clone(),
        rows_total: table.records.len(),
        valid: Vec::new(),
        rejected: Vec::new(),
        lines_without_zone: Vec::new(),
        notes: Vec::new(),
    };
    // First line of each station, with its coordinates; first line of each station+contact.
    let mut first_coords: FirstCoordinates = HashMap::new();
    let mut first_contact: HashMap<(String, u8), (u64, NaiveDateTime)> = HashMap::new();
    for (line, rec) in &table.records {
        let name = table.text(rec, cols.station).to_string();
        match parse_row(table, *line, rec, &cols) {
            Ok((mut obs, zone)) => {
                if zone == Zone::Missing {
                    set.lines_without_zone.push(*line);
                }
                let key = (obs.station.name.clone(), obs.contact.number());
                let notes = &mut set.notes;
                if let Some(message) = moved_station(&mut first_coords, &mut obs, *line, notes) {
                    let c = Some(obs.contact.number());
                    let col = Some(cols.station);
                    reject_or_fail(table, &mut set, *line, &name, c, message, col, strict)?;
                    continue;
                }
                if let Some(&(l0, t0)) = first_contact.get(&key) {
                    set.rejected.push(duplicate(&obs, name, *line, (l0, t0)));
                    continue;
                }
                first_contact.insert(key, (*line, obs.time_label));
                set.valid.push(obs);
            }
            Err((message, column)) => {
                let contact = Contact::parse(table.text(rec, cols.contact)).map(Contact::number);
                reject_or_fail(
                    table, &mut set, *line, &name, contact, message, column, strict,
                )?;
            }
        }
    }
    Ok(set)
}

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

/// A second timing of the same contact at the same station (the first, on line `l0` at
/// `t0`, is kept).
fn duplicate(
    obs: &Observation,
    name: String,
    line: u64,
    (l0, t0): (u64, NaiveDateTime),
) -> Rejected {
    let diff = (obs.time_label - t0).num_milliseconds() as f64 / 1000.0;
    let diagnosis = if diff == 0.0 {
        format!("the same timing was given on line {l0}")
    } else {
        format!(
            "contact {} at this station was already timed on line {l0} ({diff:+.1} s from it); the first is kept",
            obs.contact.roman()
        )
    };
    Rejected {
        line,
        station: name,
        contact: Some(obs.contact.number()),
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
    contact: Option<u8>,
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
        contact,
        reason: RejectReason::Invalid,
        diagnosis: Some(message),
        o_c_s: None,
    });
    Ok(())
}

type RowError = (String, Option<usize>);

/// A timing's standard uncertainty, seconds: positive, at most an hour.
fn parse_sigma(text: &str, column: usize) -> std::result::Result<f64, RowError> {
    let v: f64 = text.parse().map_err(|_| {
        (
            format!("sigma_s '{text}' is not a number of seconds"),
            Some(column),
        )
    })?;
    if !v.is_finite() || v <= 0.0 || v > 3600.0 {
        return Err((
            format!("sigma_s {text} must be a positive number of seconds, at most 3600"),
            Some(column),
        ));
    }
    Ok(v)
}

fn parse_row(
    table: &CsvTable,
    line: u64,
    rec: &csv::StringRecord,
    cols: &Columns,
) -> std::result::Result<(Observation, Zone), RowError> {
    if rec.iter().all(|f| f.trim().is_empty()) {
        return Err((
            "every field of the row is empty; delete the row or fill it in".into(),
            None,
        ));
    }
    let name = table.text(rec, cols.station);
    if name.is_empty() {
        return Err((
            "the station name is empty; give every row a station name".into(),
            Some(cols.station),
        ));
    }
    let num = |col: usize, min: f64, max: f64, unit: &str| -> std::result::Result<f64, RowError> {
        table
            .number_in(line, rec, col, min, max, unit)
            .map_err(|e| match e {
                Error::Input { message, .. } => (message, Some(col)),
                other => (other.to_string(), Some(col)),
            })
    };
    let lat = num(cols.lat, -90.0, 90.0, "degrees")?;
    let lon = num(cols.lon, -180.0, 360.0, "degrees (east positive)")?;
    let elev = match cols.elev {
        Some(c) if !table.text(rec, c).is_empty() => {
            num(c, MIN_ELEVATION_M, MAX_ELEVATION_M, "metres")?
        }
        _ => 0.0,
    };
    let contact_text = table.text(rec, cols.contact);
    let contact = Contact::parse(contact_text).ok_or_else(|| {
        (
            format!("'{contact_text}' is not a contact; write 1-4, I-IV or C1-C4"),
            Some(cols.contact),
        )
    })?;
    let (time, zone, local) = row_time(table, rec, cols, lon)?;
    if !(MIN_YEAR..=MAX_YEAR).contains(&time.year()) {
        return Err((
            format!("the year {} is outside {MIN_YEAR}-{MAX_YEAR}", time.year()),
            if local.is_some() {
                cols.local.time_local
            } else {
                cols.time
            },
        ));
    }
    let longitude = match cols.longitude_sigma {
        Some(c) => LongitudeKnowledge::parse(table.text(rec, c)).map_err(|m| (m, Some(c)))?,
        None => LongitudeKnowledge::Exact,
    };
    let (sigma_s, sigma_given) = match cols.sigma {
        Some(c) if !table.text(rec, c).is_empty() => (parse_sigma(table.text(rec, c), c)?, true),
        _ => (DEFAULT_SIGMA_S[contact.index()], false),
    };
    Ok((
        Observation {
            line,
            station: Station {
                name: name.to_string(),
                latitude_deg: lat,
                longitude_deg: normalise_longitude_deg(lon),
                elevation_m: elev,
            },
            contact,
            time_label: time,
            sigma_s,
            sigma_given,
            local,
            longitude,
        },
        zone,
    ))
}

/// A row's time: its UTC (UT1 before 1972) label and zone, from `time_utc`, or from
/// `time_local` converted at the station's longitude (a row gives one of the two).
fn row_time(
    table: &CsvTable,
    rec: &csv::StringRecord,
    cols: &Columns,
    longitude_deg: f64,
) -> std::result::Result<(NaiveDateTime, Zone, Option<LocalReading>), RowError> {
    let text = |c: Option<usize>| c.map_or("", |c| table.text(rec, c));
    let utc = text(cols.time);
    let local = text(cols.local.time_local);
    match (utc.is_empty(), local.is_empty()) {
        (false, false) => Err((
            "the row gives both time_utc and time_local; keep the one the observer recorded (time_local is the clock reading in local solar time)".into(),
            cols.local.time_local,
        )),
        (true, false) => {
            let reading = parse_local(
                local,
                text(cols.local.local_time),
                text(cols.local.day_reckoning),
                &cols.local,
            )?;
            let ut1 = reading.ut1_label(longitude_deg).ok_or_else(|| {
                (
                    format!("the local time '{local}' cannot be converted (its year is outside {MIN_YEAR}-{MAX_YEAR})"),
                    cols.local.time_local,
                )
            })?;
            Ok((ut1, Zone::Utc, Some(reading)))
        }
        (true, true) if cols.time.is_none() => Err((
            "the row gives no time; fill in time_local (with local_time) or add a time_utc column".into(),
            cols.local.time_local,
        )),
        _ => {
            let (time, zone) = parse_utc_zoned(utc).map_err(|m| (m, cols.time))?;
            Ok((time, zone, None))
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn set(text: &str) -> ObservationSet {
        let t = CsvTable::from_bytes(Path::new("t.csv"), text.as_bytes()).unwrap();
        observations_from_table(&t, false).unwrap()
    }

    const HEAD: &str = "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s\n";

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
