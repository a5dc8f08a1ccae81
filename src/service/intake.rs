//! Reading a submission into timings: the JSON body of `POST /api/submissions` (the keys of
//! the stable interface) and the participant's form (its fields, or a pasted observations
//! file). Values are kept as text, as sent; the reduction's reader judges them.

use super::store::TimingFields;
use crate::observations::csv_table::CsvTable;
use serde_json::Value;

/// A contact as sent, written as its number where it reads as one (`II` -> `2`), else as
/// sent (the reduction then says why it cannot be read).
fn contact_number(text: String) -> String {
    use crate::observations::contact_forms::parse_contact_pair;
    match crate::geometry::contacts::Contact::parse(&text) {
        Some(c) => c.number().to_string(),
        None => match parse_contact_pair(&text) {
            Ok((a, b)) => format!("{}-{}", a.number(), b.number()),
            Err(_) => text,
        },
    }
}

/// A JSON value as the text a CSV field would hold: strings as they are, numbers as written,
/// null or absent as empty; anything else is refused with the key named.
fn text_of(v: Option<&Value>, key: &str) -> Result<String, String> {
    match v {
        None | Some(Value::Null) => Ok(String::new()),
        Some(Value::String(s)) => Ok(s.clone()),
        Some(Value::Number(n)) => Ok(n.to_string()),
        Some(_) => Err(format!("'{key}' must be a number or a string")),
    }
}

/// The timings of a JSON submission: `station`, `latitude`, `longitude`, optional
/// `elevation_m` and `longitude_sigma_deg`, and `timings`, a non-empty array of objects with
/// `contact` and `time_utc` (or `time_local` with `local_time` and `day_reckoning`) and an
/// optional `sigma_s`. How the timings were made (`observer`, `clock_source`, `instrument`,
/// `aperture_mm`, `viewing`, `notes`) may be given for the whole submission, for a timing, or
/// both (a timing's own value wins).
///
/// Errors: a sentence saying what is missing or malformed (the body is unreadable).
pub fn from_json(body: &[u8]) -> Result<Vec<TimingFields>, String> {
    let text =
        std::str::from_utf8(body).map_err(|e| format!("the body is not UTF-8 text ({e})"))?;
    let v: Value = serde_json::from_str(text).map_err(|e| format!("the body is not JSON: {e}"))?;
    let obj = v.as_object().ok_or("the body must be a JSON object")?;
    let station = match obj.get("station") {
        Some(Value::String(s)) if !s.trim().is_empty() => s.clone(),
        _ => return Err("'station' (a non-empty name) is missing".into()),
    };
    let timings = match obj.get("timings") {
        Some(Value::Array(a)) if !a.is_empty() => a,
        _ => return Err("'timings' (a non-empty array of timings) is missing".into()),
    };
    let common = TimingFields {
        station,
        latitude: text_of(obj.get("latitude"), "latitude")?,
        longitude: text_of(obj.get("longitude"), "longitude")?,
        elevation_m: text_of(obj.get("elevation_m"), "elevation_m")?,
        longitude_sigma_deg: text_of(obj.get("longitude_sigma_deg"), "longitude_sigma_deg")?,
        meridian: text_of(obj.get("meridian"), "meridian")?,
        observer: text_of(obj.get("observer"), "observer")?,
        calendar: text_of(obj.get("calendar"), "calendar")?,
        clock_source: text_of(obj.get("clock_source"), "clock_source")?,
        instrument: text_of(obj.get("instrument"), "instrument")?,
        aperture_mm: text_of(obj.get("aperture_mm"), "aperture_mm")?,
        viewing: text_of(obj.get("viewing"), "viewing")?,
        notes: text_of(obj.get("notes"), "notes")?,
        ..TimingFields::default()
    };
    timings
        .iter()
        .map(|t| {
            let t = t.as_object().ok_or("each timing must be a JSON object")?;
            // A timing may name its own observer, calendar and how it was made; the
            // submission's hold otherwise.
            let own = |key: &str, common: &str| -> Result<String, String> {
                let v = text_of(t.get(key), key)?;
                Ok(if v.is_empty() { common.to_string() } else { v })
            };
            let written = text_of(t.get("contact"), "contact")?;
            Ok(TimingFields {
                contact: contact_number(written.clone()),
                contact_as_written: written,
                time_utc: text_of(t.get("time_utc"), "time_utc")?,
                sigma_s: text_of(t.get("sigma_s"), "sigma_s")?,
                time_local: text_of(t.get("time_local"), "time_local")?,
                local_time: text_of(t.get("local_time"), "local_time")?,
                day_reckoning: text_of(t.get("day_reckoning"), "day_reckoning")?,
                time_meridian: text_of(t.get("time_meridian"), "time_meridian")?,
                duration: text_of(t.get("duration"), "duration")?,
                contact_judged: text_of(t.get("contact_judged"), "contact_judged")?,
                observer: own("observer", &common.observer)?,
                calendar: own("calendar", &common.calendar)?,
                clock_source: own("clock_source", &common.clock_source)?,
                instrument: own("instrument", &common.instrument)?,
                aperture_mm: own("aperture_mm", &common.aperture_mm)?,
                viewing: own("viewing", &common.viewing)?,
                notes: own("notes", &common.notes)?,
                ..common.clone()
            })
        })
        .collect()
}

/// The timings of an uploaded observations file: CSV text (comma, semicolon or tab separated,
/// as `reduce` reads it) or a spreadsheet (.xlsx, .ods: its first sheet).
///
/// Errors: a sentence saying what is wrong with the file.
pub fn from_csv_bytes(bytes: &[u8]) -> Result<Vec<TimingFields>, String> {
    let label = std::path::Path::new("the file");
    let table = if crate::observations::spreadsheet::looks_like_spreadsheet(bytes) {
        crate::observations::spreadsheet::first_sheet_of_bytes(label, bytes)
    } else {
        CsvTable::from_bytes(label, bytes)
    };
    fields_of_table(&table.map_err(|e| e.to_string())?)
}

/// The timings of a pasted observations file: columns by header name, any of the export's.
fn from_csv(text: &str) -> Result<Vec<TimingFields>, String> {
    let table = CsvTable::from_bytes(std::path::Path::new("the pasted text"), text.as_bytes())
        .map_err(|e| e.to_string())?;
    fields_of_table(&table)
}

/// The fields of each row of a table read as `reduce` reads it.
fn fields_of_table(table: &CsvTable) -> Result<Vec<TimingFields>, String> {
    if table.optional("station").is_none() {
        return Err(format!(
            "{} has no 'station' column; its first line must name the columns",
            table.path.display()
        ));
    }
    let mut out = Vec::new();
    for (_, r) in &table.records {
        let get = |name: &str| {
            table
                .optional(name)
                .map_or(String::new(), |k| table.text(r, k).to_string())
        };
        out.push(TimingFields {
            station: get("station"),
            latitude: get("latitude"),
            longitude: get("longitude"),
            elevation_m: get("elevation_m"),
            contact: contact_number(get("contact")),
            contact_as_written: get("contact"),
            time_utc: get("time_utc"),
            sigma_s: get("sigma_s"),
            time_local: get("time_local"),
            local_time: get("local_time"),
            day_reckoning: get("day_reckoning"),
            longitude_sigma_deg: get("longitude_sigma_deg"),
            observer: get("observer"),
            calendar: get("calendar"),
            meridian: get("meridian"),
            time_meridian: get("time_meridian"),
            duration: get("duration"),
            contact_judged: get("contact_judged"),
            clock_source: get("clock_source"),
            instrument: get("instrument"),
            aperture_mm: get("aperture_mm"),
            viewing: get("viewing"),
            notes: get("notes"),
        });
    }
    if out.is_empty() {
        return Err(format!("{} has a header and no rows", table.path.display()));
    }
    Ok(out)
}

/// The timings of the participant's form: a pasted file if there is one, else the station's
/// fields and the rows of the timing table that have a time.
///
/// Errors: a sentence saying what is missing.
pub fn from_form(form: &[(String, String)]) -> Result<Vec<TimingFields>, String> {
    let get = |name: &str| {
        form.iter()
            .find(|(k, _)| k == name)
            .map(|(_, v)| v.trim().to_string())
            .unwrap_or_default()
    };
    let csv = get("csv");
    if !csv.is_empty() {
        return from_csv(&csv);
    }
    let station = get("station");
    if station.is_empty() {
        return Err("give the station's name".into());
    }
    let common = TimingFields {
        station,
        latitude: get("latitude"),
        longitude: get("longitude"),
        elevation_m: get("elevation_m"),
        longitude_sigma_deg: get("longitude_sigma_deg"),
        observer: get("observer"),
        clock_source: get("clock_source"),
        instrument: get("instrument"),
        aperture_mm: get("aperture_mm"),
        viewing: get("viewing"),
        notes: get("notes"),
        ..TimingFields::default()
    };
    let rows: Vec<TimingFields> = (0..4)
        .map(|k| TimingFields {
            contact: contact_number(get(&format!("contact{k}"))),
            contact_as_written: get(&format!("contact{k}")),
            time_utc: get(&format!("time_utc{k}")),
            time_local: get(&format!("time_local{k}")),
            local_time: get(&format!("local_time{k}")),
            day_reckoning: get(&format!("day_reckoning{k}")),
            sigma_s: get(&format!("sigma_s{k}")),
            ..common.clone()
        })
        .filter(|t| !(t.time_utc.is_empty() && t.time_local.is_empty() && t.contact.is_empty()))
        .collect();
    if rows.is_empty() {
        return Err("give at least one timing: a contact and its time".into());
    }
    Ok(rows)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn contacts_are_written_as_numbers_and_bad_bodies_are_explained() {
        let body = br#"{"station":"A","latitude":10,"longitude":"20.5","timings":[{"contact":"IV","time_utc":"2012-06-06T04:40:00Z"},{"contact":"C9","time_utc":"x"}]}"#;
        let t = from_json(body).unwrap();
        assert_eq!(
            (
                t[0].contact.as_str(),
                t[0].latitude.as_str(),
                t[0].longitude.as_str()
            ),
            ("4", "10", "20.5")
        );
        assert_eq!(t[1].contact, "C9");
        for (bad, why) in [
            (&b"\xff"[..], "UTF-8"),
            (b"[1]", "object"),
            (b"{\"station\":\"\",\"timings\":[{}]}", "station"),
            (b"{\"station\":\"A\",\"timings\":[]}", "timings"),
            (
                b"{\"station\":\"A\",\"latitude\":[1],\"timings\":[{}]}",
                "latitude",
            ),
        ] {
            assert!(from_json(bad).unwrap_err().contains(why), "{why}");
        }
        let form: Vec<(String, String)> = [
            ("station", "B"),
            ("contact0", "ii"),
            ("time_utc0", "2012-06-05T22:30:00Z"),
            ("day_reckoning0", "astronomical"),
            ("contact1", ""),
            ("time_utc1", ""),
        ]
        .iter()
        .map(|(a, b)| (a.to_string(), b.to_string()))
        .collect();
        let t = from_form(&form).unwrap();
        assert_eq!(t.len(), 1);
        assert_eq!(t[0].contact, "2");
        assert_eq!(t[0].day_reckoning, "astronomical");
        assert!(from_form(&[]).is_err());
    }

    #[test]
    fn how_a_timing_was_made_is_the_submissions_unless_the_timing_says() {
        let body = br#"{"station":"A","latitude":10,"longitude":20,"clock_source":"gps","aperture_mm":80,"viewing":"filter","instrument":"refractor","notes":"thin cloud","timings":[{"contact":2,"time_utc":"x"},{"contact":3,"time_utc":"y","clock_source":"phone","aperture_mm":"60","notes":"=1+1"}]}"#;
        let t = from_json(body).unwrap();
        assert_eq!(
            (
                t[0].clock_source.as_str(),
                t[0].aperture_mm.as_str(),
                t[0].viewing.as_str()
            ),
            ("gps", "80", "filter")
        );
        assert_eq!(
            (t[0].instrument.as_str(), t[0].notes.as_str()),
            ("refractor", "thin cloud")
        );
        assert_eq!(
            (
                t[1].clock_source.as_str(),
                t[1].aperture_mm.as_str(),
                t[1].notes.as_str()
            ),
            ("phone", "60", "=1+1")
        );
        assert_eq!(t[1].instrument, "refractor");
        assert!(
            from_json(br#"{"station":"A","clock_source":[1],"timings":[{}]}"#)
                .unwrap_err()
                .contains("clock_source")
        );
        let form: Vec<(String, String)> = [
            ("station", "B"),
            ("observer", "R. Vale"),
            ("clock_source", "radio"),
            ("aperture_mm", "102"),
            ("viewing", "projection"),
            ("contact0", "2"),
            ("time_utc0", "2012-06-05T22:30:00Z"),
            ("contact1", "3"),
            ("time_utc1", "2012-06-06T04:30:00Z"),
        ]
        .iter()
        .map(|(a, b)| (a.to_string(), b.to_string()))
        .collect();
        let t = from_form(&form).unwrap();
        assert!(t.iter().all(|f| f.clock_source == "radio"
            && f.aperture_mm == "102"
            && f.viewing == "projection"
            && f.observer == "R. Vale"));
    }
}
