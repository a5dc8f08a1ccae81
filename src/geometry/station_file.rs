//! Reading a stations (or sites) file: each station's place, the calendar its local times are
//! written in and the civil time zone of its clocks. Every bad row is reported at once, each
//! with its line, column and a fix, as `reduce` lists its unusable timings.

use super::station::{normalise_longitude_deg, Station};
use crate::error::{Error, Result};
use crate::observations::csv_table::CsvTable;
use crate::observations::rows::{place, PlaceColumns};
use crate::time::calendar::Calendar;
use crate::time::civil::CivilZone;
use std::path::Path;

/// A stations file as read: the stations in file order, and for each its calendar and its
/// civil time zone (where the file or the command gives one).
#[derive(Clone, Debug)]
pub struct StationFile {
    /// The stations, in file order.
    pub stations: Vec<Station>,
    /// Each station's calendar (empty when the file has no `calendar` column).
    pub calendars: Vec<Calendar>,
    /// Each station's civil time zone: its `time_zone` cell, or the default given.
    pub zones: Vec<Option<CivilZone>>,
}

/// The columns of a stations file.
struct StationColumns {
    name: usize,
    place: PlaceColumns,
    calendar: Option<usize>,
    zone: Option<usize>,
}

/// Read a stations file: columns `station,latitude,longitude[,elevation_m]` found by name
/// (a missing `elevation_m` column means 0 m).
///
/// Errors: unreadable or empty file, missing column, and every bad row at once (non-numeric or
/// out-of-range value, empty or repeated station name), each naming line and column.
pub fn read_stations(path: &Path) -> Result<Vec<Station>> {
    read_station_file(path, None).map(|f| f.stations)
}

/// Stations from an already-read table (see [`read_stations`]).
pub fn stations_from_table(table: &CsvTable) -> Result<Vec<Station>> {
    station_file_from_table(table, None).map(|f| f.stations)
}

/// Read a stations file with each station's calendar (see [`station_file_from_table`]).
pub fn read_stations_with_calendars(path: &Path) -> Result<(Vec<Station>, Vec<Calendar>)> {
    read_station_file(path, None).map(|f| (f.stations, f.calendars))
}

/// Stations and their calendars from a table (see [`station_file_from_table`]).
pub fn stations_and_calendars(table: &CsvTable) -> Result<(Vec<Station>, Vec<Calendar>)> {
    station_file_from_table(table, None).map(|f| (f.stations, f.calendars))
}

/// Read a stations file with calendars and civil zones; `default_zone` is the zone of rows
/// whose `time_zone` cell is empty (or of every row when the column is absent).
pub fn read_station_file(path: &Path, default_zone: Option<CivilZone>) -> Result<StationFile> {
    let table = CsvTable::read(path)?;
    station_file_from_table(&table, default_zone)
}

/// Stations, calendars and zones from a table (columns `station`, `latitude`, `longitude`,
/// optionally `elevation_m`, `meridian`, `calendar` and `time_zone`).
///
/// Errors: a missing column; otherwise [`Error::BadRows`] listing every row that cannot be read.
pub fn station_file_from_table(
    table: &CsvTable,
    default_zone: Option<CivilZone>,
) -> Result<StationFile> {
    let cols = StationColumns {
        name: table.require("station")?,
        place: PlaceColumns {
            lat: table.require("latitude")?,
            lon: table.require("longitude")?,
            elev: table.optional("elevation_m"),
            meridian: table.optional("meridian"),
        },
        calendar: table.optional("calendar"),
        zone: table.optional("time_zone"),
    };
    let n = table.records.len();
    let mut file = StationFile {
        stations: Vec::with_capacity(n),
        calendars: Vec::with_capacity(if cols.calendar.is_some() { n } else { 0 }),
        zones: Vec::with_capacity(n),
    };
    let mut seen: std::collections::HashMap<&str, u64> =
        std::collections::HashMap::with_capacity(n);
    let mut bad = Vec::new();
    for (line, rec) in &table.records {
        match station_row(table, (*line, rec), &cols, default_zone.as_ref()) {
            Ok((station, calendar, zone)) => {
                if let Some(first) = seen.insert(table.text(rec, cols.name), *line) {
                    bad.push(row_error(
                        table,
                        *line,
                        Some(cols.name),
                        format!(
                            "station '{}' was already given on line {first}",
                            station.name
                        ),
                        "give each station once, with a unique name",
                    ));
                    continue;
                }
                file.stations.push(station);
                if cols.calendar.is_some() {
                    file.calendars.push(calendar);
                }
                file.zones.push(zone);
            }
            Err(e) => bad.push(e),
        }
    }
    if !bad.is_empty() {
        return Err(Error::BadRows {
            file: table.path.clone(),
            rows: bad,
            total: n,
        });
    }
    if file.stations.is_empty() {
        return Err(Error::Input {
            location: table.location(1, None),
            message: "the file has a header but no stations".into(),
            hint: "add one row per station".into(),
        });
    }
    Ok(file)
}

/// One row's station, calendar and zone, or the row's error as a line of the list.
fn station_row(
    table: &CsvTable,
    (line, rec): (u64, &csv::StringRecord),
    cols: &StationColumns,
    default_zone: Option<&CivilZone>,
) -> std::result::Result<(Station, Calendar, Option<CivilZone>), String> {
    let name = table.text(rec, cols.name);
    if name.is_empty() {
        return Err(row_error(
            table,
            line,
            Some(cols.name),
            "the station name is empty".into(),
            "give every station a name",
        ));
    }
    let calendar = match cols.calendar {
        None => Calendar::default(),
        Some(c) => {
            let text = table.text(rec, c);
            Calendar::parse(text).ok_or_else(|| {
                row_error(
                    table,
                    line,
                    Some(c),
                    format!("'{text}' is not a calendar"),
                    "write gregorian (New Style, the default) or julian (Old Style)",
                )
            })?
        }
    };
    let zone = match cols.zone.map(|c| (c, table.text(rec, c))) {
        Some((c, text)) if !text.is_empty() => Some(CivilZone::parse(text).map_err(|m| {
            row_error(
                table,
                line,
                Some(c),
                m,
                "correct the zone or leave it empty",
            )
        })?),
        _ => default_zone.cloned(),
    };
    let (lat, lon, elev, _) = place(table, line, rec, cols.place).map_err(|(message, col)| {
        row_error(
            table,
            line,
            col,
            message,
            "correct the station's place (a sign, a digit or the hemisphere letter may be wrong)",
        )
    })?;
    let station = Station {
        name: name.to_string(),
        latitude_deg: lat,
        longitude_deg: normalise_longitude_deg(lon),
        elevation_m: elev,
    };
    Ok((station, calendar, zone))
}

/// A row's problem as one line of the list, its place written as every other message of the
/// tool writes it: `stations.csv:4:2 (column 'latitude'): ...; fix`.
fn row_error(
    table: &CsvTable,
    line: u64,
    col: Option<usize>,
    message: String,
    hint: &str,
) -> String {
    let place = table.location(line, col);
    // A message that already ends in its own advice ("...; write it as ...") needs no other.
    if message.contains("; ") {
        format!("{place}: {message}")
    } else {
        format!("{place}: {message}; {hint}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn table(text: &str) -> CsvTable {
        CsvTable::from_bytes(Path::new("stations.csv"), text.as_bytes()).expect("table")
    }

    #[test]
    fn every_bad_row_is_listed_at_once() {
        let t = table(
            "station,latitude,longitude,elevation_m,time_zone\n\
             A,52.16,4.49,0,Europe/Amsterdam\n\
             B,north,4.49,0,\n\
             C,52.16,4.49,0,Europe/Atlantis\n\
             A,52.16,4.49,0,\n\
             ,1,2,3,\n",
        );
        let err = station_file_from_table(&t, None).expect_err("bad rows");
        let text = err.to_string();
        for needle in [
            "4 of its 5 rows cannot be read",
            "stations.csv:3:2 (column 'latitude')",
            "stations.csv:4:5 (column 'time_zone'): 'Europe/Atlantis' is not a zone",
            "stations.csv:5:1 (column 'station'): station 'A' was already given on line 2",
            "stations.csv:6:1 (column 'station'): the station name is empty",
        ] {
            assert!(text.contains(needle), "{needle}\n{text}");
        }
    }

    #[test]
    fn zones_come_from_the_cell_or_the_default() {
        let t = table("station,latitude,longitude,time_zone\nA,52,4,+05:30\nB,52,4,\n");
        let ny = CivilZone::parse("America/New_York").ok();
        let f = station_file_from_table(&t, ny.clone()).expect("file");
        assert_eq!(
            f.zones[0].as_ref().map(|z| z.name()).as_deref(),
            Some("+05:30")
        );
        assert_eq!(f.zones[1], ny);
        assert!(f.calendars.is_empty());
    }
}
