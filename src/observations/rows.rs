//! One row of an observations file into one [`Observation`]: the station and its coordinates
//! (in any written form, from any prime meridian), the observer, the contact or the pair of
//! contacts of a timed interval, the time (UTC, or a clock reading in local solar time, in
//! either calendar, as an instant, a range or to the minute), how the contact was judged and
//! the uncertainty.
//!
//! Every field that cannot be read gives a sentence saying how to write it and the column at
//! fault; the caller lists the row as invalid (or, with `--strict`, stops there).

use super::angles::{parse_angle, Axis, Meridian};
use super::contact_forms::{parse_contact_pair, ContactJudged};
use super::csv_table::CsvTable;
use super::local_time::{parse_local, LocalColumns, LocalReading};
use super::longitude::LongitudeKnowledge;
use super::readings::{parse_duration, parse_time_reading, TimeReading};
use super::timing_metadata::{parse_metadata, MetadataColumns};
use super::timings::{AsWritten, Interval, Observation, DEFAULT_SIGMA_S};
use crate::geometry::contacts::Contact;
use crate::geometry::station::{
    normalise_longitude_deg, Station, MAX_ELEVATION_M, MIN_ELEVATION_M,
};
use crate::time::calendar::{split_date, Calendar};
use crate::time::iso::Zone;
use crate::time::scales::{MAX_YEAR, MIN_YEAR};
use chrono::{Datelike, NaiveDateTime};

/// A sentence saying what is wrong with a row, and the column at fault.
pub type RowError = (String, Option<usize>);

/// The columns of an observations file (found by header name).
pub struct Columns {
    /// `station`.
    pub station: usize,
    /// `latitude`.
    pub lat: usize,
    /// `longitude`.
    pub lon: usize,
    /// `elevation_m`.
    pub elev: Option<usize>,
    /// `contact`.
    pub contact: usize,
    /// `time_utc`.
    pub time: Option<usize>,
    /// `time_local`, `local_time`, `day_reckoning`.
    pub local: LocalColumns,
    /// `longitude_sigma_deg`.
    pub longitude_sigma: Option<usize>,
    /// `sigma_s`.
    pub sigma: Option<usize>,
    /// `observer`.
    pub observer: Option<usize>,
    /// `calendar`.
    pub calendar: Option<usize>,
    /// `meridian`.
    pub meridian: Option<usize>,
    /// `time_meridian`.
    pub time_meridian: Option<usize>,
    /// `duration`.
    pub duration: Option<usize>,
    /// `contact_judged`.
    pub judged: Option<usize>,
    /// How the timing was made (`clock_source`, `instrument`, `aperture_mm`, `viewing`,
    /// `notes`).
    pub metadata: MetadataColumns,
    /// The columns of a measured position on the disc (`separation_solar_radii`,
    /// `separation_arcsec`, `position_angle_deg`), where present.
    pub position: Vec<usize>,
}

impl Columns {
    /// Find the columns by name.
    ///
    /// Errors: a required column is absent (the message lists the header).
    pub fn find(table: &CsvTable) -> crate::Result<Columns> {
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
            observer: table.optional("observer"),
            calendar: table.optional("calendar"),
            meridian: table.optional("meridian"),
            time_meridian: table.optional("time_meridian"),
            duration: table.optional("duration"),
            judged: table.optional("contact_judged"),
            metadata: MetadataColumns::find(table),
            position: [
                "separation_solar_radii",
                "separation_arcsec",
                "position_angle_deg",
            ]
            .iter()
            .filter_map(|name| table.optional(name))
            .collect(),
        };
        if cols.time.is_none() && cols.local.time_local.is_none() && cols.duration.is_none() {
            // The message names the column every modern file has.
            table.require("time_utc")?;
        }
        Ok(cols)
    }
}

/// Why a row giving a position on the disc (no contact) is not reduced.
pub const POSITION_NOT_REDUCED: &str = "a position on the disc (no contact): `measure` writes such rows and `plan --positions-every` forecasts them, but this version of `reduce` does not reduce positions yet; the contact rows are reduced without it";

/// The text of an optional column ("" where absent).
fn field<'a>(table: &CsvTable, rec: &'a csv::StringRecord, col: Option<usize>) -> &'a str {
    col.map_or("", |c| table.text(rec, c))
}

/// A timing's standard uncertainty, seconds: positive, at most an hour.
fn parse_sigma(text: &str, column: usize) -> Result<f64, RowError> {
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

/// The columns of a station's place.
#[derive(Clone, Copy)]
pub struct PlaceColumns {
    /// `latitude`.
    pub lat: usize,
    /// `longitude`.
    pub lon: usize,
    /// `elevation_m`.
    pub elev: Option<usize>,
    /// `meridian`.
    pub meridian: Option<usize>,
}

/// A station's place as a row writes it (timings and stations files alike): latitude,
/// longitude east of Greenwich (from the row's meridian, not yet normalised) and elevation,
/// and the meridian the longitude was counted from.
///
/// Errors: the sentence and the column.
pub fn place(
    table: &CsvTable,
    line: u64,
    rec: &csv::StringRecord,
    cols: PlaceColumns,
) -> Result<(f64, f64, f64, Meridian), RowError> {
    let meridian =
        Meridian::parse(field(table, rec, cols.meridian)).map_err(|m| (m, cols.meridian))?;
    let angle = |col: usize, axis: Axis| {
        parse_angle(table.text(rec, col), axis).map_err(|m| (m, Some(col)))
    };
    let lat = angle(cols.lat, Axis::Latitude)?;
    let lon = angle(cols.lon, Axis::Longitude)? + meridian.east_of_greenwich_deg();
    let elev = match cols.elev {
        Some(c) if !table.text(rec, c).is_empty() => table
            .number_in(line, rec, c, MIN_ELEVATION_M, MAX_ELEVATION_M, "metres")
            .map_err(|e| match e {
                crate::Error::Input { message, .. } => (message, Some(c)),
                other => (other.to_string(), Some(c)),
            })?,
        _ => 0.0,
    };
    Ok((lat, lon, elev, meridian))
}

/// The meridian a local-time reading was kept to, where it is not the station's own: a name
/// (`greenwich`, `paris`, `ferro`) or a longitude in any written form, counted from the row's
/// meridian. Returns degrees east of Greenwich.
fn time_meridian(text: &str, meridian: Meridian) -> Result<Option<f64>, String> {
    let t = text.trim();
    if t.is_empty() {
        return Ok(None);
    }
    if let Some(named) = Meridian::named(t) {
        return Ok(Some(named.east_of_greenwich_deg()));
    }
    parse_angle(t, Axis::Longitude)
        .map(|d| Some(d + meridian.east_of_greenwich_deg()))
        .map_err(|_| format!("'{t}' is not a meridian for the clock; write greenwich, paris, ferro, or the meridian's longitude (counted like the longitude column)"))
}

/// Parse one row (see the module's notes); returns the observation and the zone its time was
/// written with.
pub fn parse_row(
    table: &CsvTable,
    line: u64,
    rec: &csv::StringRecord,
    cols: &Columns,
) -> Result<(Observation, Zone), RowError> {
    let name = station_name(table, rec, cols)?;
    let place_cols = PlaceColumns {
        lat: cols.lat,
        lon: cols.lon,
        elev: cols.elev,
        meridian: cols.meridian,
    };
    let (lat, lon, elev, meridian) = place(table, line, rec, place_cols)?;
    // One longitude for the station and its local readings: written as 200 or as -160, or
    // as 359 from Paris, a station reads its clock the same way.
    let lon = normalise_longitude_deg(lon);
    let calendar = Calendar::parse(field(table, rec, cols.calendar)).ok_or_else(|| {
        (format!("'{}' is not a calendar; write gregorian (New Style, the default) or julian (Old Style)", field(table, rec, cols.calendar)), cols.calendar)
    })?;
    let judged =
        ContactJudged::parse(field(table, rec, cols.judged)).map_err(|m| (m, cols.judged))?;
    let longitude_in_time = table.text(rec, cols.lon).contains(['h', 'H']);
    let mut written = AsWritten {
        calendar,
        meridian,
        longitude_in_time,
        ..AsWritten::default()
    };
    let RowTiming {
        contact,
        interval,
        time,
        zone,
        local,
        range_sigma_s,
    } = row_timing(table, rec, cols, (lon, meridian), &mut written)?;
    let time_col = if local.is_some() {
        cols.local.time_local
    } else {
        cols.time
    };
    if interval.as_ref().map_or(true, |i| i.date.is_some())
        && !(MIN_YEAR..=MAX_YEAR).contains(&time.year())
    {
        return Err((
            format!("the year {} is outside {MIN_YEAR}-{MAX_YEAR}", time.year()),
            time_col,
        ));
    }
    let longitude = match cols.longitude_sigma {
        Some(c) => LongitudeKnowledge::parse(table.text(rec, c)).map_err(|m| (m, Some(c)))?,
        None => LongitudeKnowledge::Exact,
    };
    let (sigma_s, sigma_given) = row_sigma(table, rec, cols, contact, interval.as_ref())?;
    let metadata = parse_metadata(table, rec, &cols.metadata)?;
    let observation = Observation {
        line,
        station: Station {
            name: name.to_string(),
            latitude_deg: lat,
            longitude_deg: lon,
            elevation_m: elev,
        },
        observer: field(table, rec, cols.observer).to_string(),
        contact,
        time_label: time,
        sigma_s: sigma_s.hypot(range_sigma_s),
        sigma_given,
        local,
        longitude,
        judged,
        duration: interval,
        written,
        metadata,
    };
    Ok((observation, zone))
}

/// The row's station name, or why the row has none (every field empty, or the name's).
fn station_name<'a>(
    table: &CsvTable,
    rec: &'a csv::StringRecord,
    cols: &Columns,
) -> Result<&'a str, RowError> {
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
    Ok(name)
}

/// What a row says of its timing (see [`row_timing`]).
struct RowTiming {
    contact: Contact,
    interval: Option<Interval>,
    time: NaiveDateTime,
    zone: Zone,
    local: Option<LocalReading>,
    range_sigma_s: f64,
}

/// What a row says of its timing: the contact (the later of an interval's pair), the interval
/// for a duration row, the label of its time, the zone it was written in, the local reading
/// if any, and the sigma of a range reading; `written` gains the range and the minute-only
/// reading. `lon` and `meridian` are the row's longitude (east of Greenwich) and meridian.
fn row_timing(
    table: &CsvTable,
    rec: &csv::StringRecord,
    cols: &Columns,
    (lon, meridian): (f64, Meridian),
    written: &mut AsWritten,
) -> Result<RowTiming, RowError> {
    let duration_text = field(table, rec, cols.duration);
    if !duration_text.is_empty() {
        let (interval, time, sigma) =
            row_interval(table, rec, cols, written.calendar, duration_text)?;
        written.range_s = sigma.1;
        return Ok(RowTiming {
            contact: interval.1,
            interval: Some(interval.0),
            time,
            zone: Zone::Utc,
            local: None,
            range_sigma_s: sigma.0,
        });
    }
    let contact_text = table.text(rec, cols.contact);
    if contact_text.is_empty() {
        if let Some(&c) = cols
            .position
            .iter()
            .find(|&&c| !table.text(rec, c).is_empty())
        {
            return Err((POSITION_NOT_REDUCED.to_string(), Some(c)));
        }
    }
    let contact = Contact::parse(contact_text).ok_or_else(|| {
        (format!("'{contact_text}' is not a contact; write 1-4, I-IV or C1-C4 (or a pair such as 2-3 with a duration)"), Some(cols.contact))
    })?;
    let tm = time_meridian(field(table, rec, cols.time_meridian), meridian)
        .map_err(|m| (m, cols.time_meridian))?;
    let (reading, local) = row_time(table, rec, cols, (lon, tm, written.calendar))?;
    written.range_s = reading.range_s;
    written.minute_only = reading.minute_only;
    written.undated = reading.undated;
    Ok(RowTiming {
        contact,
        interval: None,
        time: reading.label,
        zone: reading.zone,
        local,
        range_sigma_s: reading.range_sigma_s(),
    })
}

/// The row's stated sigma, or the default for its contact (for an interval, the defaults of
/// its two contacts in quadrature), and whether it was stated.
fn row_sigma(
    table: &CsvTable,
    rec: &csv::StringRecord,
    cols: &Columns,
    contact: Contact,
    interval: Option<&Interval>,
) -> Result<(f64, bool), RowError> {
    let default_sigma = match interval {
        Some(i) => DEFAULT_SIGMA_S[i.first.index()].hypot(DEFAULT_SIGMA_S[contact.index()]),
        None => DEFAULT_SIGMA_S[contact.index()],
    };
    match cols.sigma {
        Some(c) if !table.text(rec, c).is_empty() => {
            Ok((parse_sigma(table.text(rec, c), c)?, true))
        }
        _ => Ok((default_sigma, false)),
    }
}

/// A duration row: the pair of contacts, the interval, the date if the time column gives one
/// (a duration has no instant), and the range's sigma and width.
#[allow(clippy::type_complexity)]
fn row_interval(
    table: &CsvTable,
    rec: &csv::StringRecord,
    cols: &Columns,
    calendar: Calendar,
    duration_text: &str,
) -> Result<((Interval, Contact), NaiveDateTime, (f64, Option<f64>)), RowError> {
    let (first, second) =
        parse_contact_pair(table.text(rec, cols.contact)).map_err(|m| (m, Some(cols.contact)))?;
    let (seconds, range) = parse_duration(duration_text).map_err(|m| (m, cols.duration))?;
    let utc = field(table, rec, cols.time);
    let local = field(table, rec, cols.local.time_local);
    let (text, col) = if utc.is_empty() {
        (local, cols.local.time_local)
    } else {
        (utc, cols.time)
    };
    let date = if text.is_empty() {
        None
    } else {
        match split_date(text, calendar) {
            Some((d, rest)) if rest.trim().is_empty() => Some(d),
            _ => {
                return Err((format!("'{text}': a duration row gives the date alone (YYYY-MM-DD) or no time at all; put timed instants in rows of their own"), col));
            }
        }
    };
    let kept_to = match field(table, rec, cols.local.local_time) {
        "" => None,
        k => Some(crate::sky::solar_time::LocalTime::parse(k).ok_or_else(|| {
            (format!("'{k}' is not a kind of local time; write apparent (the interval between apparent times, which the equation of time's change corrects) or mean"), cols.local.local_time)
        })?),
    };
    let time = date
        .and_then(|d| d.and_hms_opt(12, 0, 0))
        .unwrap_or_default();
    let interval = Interval {
        first,
        seconds,
        date,
        kept_to,
    };
    let range_sigma = range.map_or(0.0, |r| r / 12f64.sqrt());
    Ok(((interval, second), time, (range_sigma, range)))
}

/// A row's time: from `time_utc`, or from `time_local` converted at the station's longitude
/// (or the meridian the clock was kept to); a row gives one of the two.
fn row_time(
    table: &CsvTable,
    rec: &csv::StringRecord,
    cols: &Columns,
    (longitude_deg, kept_meridian_deg, calendar): (f64, Option<f64>, Calendar),
) -> Result<(TimeReading, Option<LocalReading>), RowError> {
    let utc = field(table, rec, cols.time);
    let local = field(table, rec, cols.local.time_local);
    match (utc.is_empty(), local.is_empty()) {
        (false, false) => Err((
            "the row gives both time_utc and time_local; keep the one the observer recorded (time_local is the clock reading in local solar time)".into(),
            cols.local.time_local,
        )),
        (true, false) => {
            let mut reading = parse_local(
                local,
                field(table, rec, cols.local.local_time),
                field(table, rec, cols.local.day_reckoning),
                (&cols.local, calendar),
            )?;
            reading.meridian_deg = kept_meridian_deg;
            let label = reading.label(longitude_deg).ok_or_else(|| {
                (format!("the local time '{local}' cannot be converted (its year is outside {MIN_YEAR}-{MAX_YEAR})"), cols.local.time_local)
            })?;
            let time = TimeReading { label, zone: Zone::Utc, ..reading.written };
            Ok((time, Some(reading)))
        }
        (true, true) if cols.time.is_none() => Err((
            "the row gives no time; fill in time_local (with local_time) or add a time_utc column".into(),
            cols.local.time_local,
        )),
        _ => {
            if kept_meridian_deg.is_some() {
                return Err(("time_meridian applies to clock readings in local solar time (time_local); a time_utc row has none".into(), cols.time_meridian));
            }
            let reading = parse_time_reading(utc, calendar).map_err(|m| (m, cols.time))?;
            Ok((reading, None))
        }
    }
}
