//! Registering a station before the event: the station's name, coordinates and the time zone
//! of its clocks, read from the JSON of `POST /api/registrations` or the registration form and
//! checked (each refusal a sentence naming the field); and the station's observers' sheet and
//! calendar, made by the library's own sheet renderer exactly as `predict --sheets` writes
//! them (`render::observer_sheet`, `render::sheet_calendar`), in the station's time zone and
//! in the language chosen at registration.

use super::store_registrations::Registration;
use crate::geometry::station::{Station, MAX_ELEVATION_M, MIN_ELEVATION_M};
use crate::geometry::transit::{StationPrediction, TransitEvent};
use crate::language::Language;
use crate::render::observer_sheet::{observer_sheet_html, SheetStation};
use crate::render::sheet_calendar::station_calendar;
use crate::render::sheet_files::safe_file_stem;
use crate::time::civil::CivilZone;
use serde_json::Value;

/// The longest station name a registration takes, characters.
pub const STATION_NAME_MAX: usize = 120;

/// The length of a registration's private key (letters and digits: some 143 random bits).
pub const KEY_LEN: usize = 24;

/// Whether `text` has the form of a private key (checked before any look-up).
pub fn looks_like_key(text: &str) -> bool {
    text.len() == KEY_LEN && text.chars().all(|c| c.is_ascii_alphanumeric())
}

/// The fields of a registration as sent (text, as a form or JSON holds them).
#[derive(Clone, Debug, Default, PartialEq)]
pub struct RegistrationFields {
    /// Station name.
    pub station: String,
    /// Latitude, degrees north.
    pub latitude: String,
    /// Longitude, degrees east.
    pub longitude: String,
    /// Elevation, metres (empty: 0).
    pub elevation_m: String,
    /// Time zone of the station's clocks.
    pub time_zone: String,
    /// Language of the sheet and calendar, a code (`de`; empty: English).
    pub language: String,
}

/// A JSON value as text: strings as they are, numbers as written, absent or null as empty.
fn text_of(v: Option<&Value>, key: &str) -> Result<String, String> {
    match v {
        None | Some(Value::Null) => Ok(String::new()),
        Some(Value::String(s)) => Ok(s.trim().to_string()),
        Some(Value::Number(n)) => Ok(n.to_string()),
        Some(_) => Err(format!("'{key}' must be a number or a string")),
    }
}

/// The fields of the JSON body of `POST /api/registrations`.
///
/// Errors: a sentence saying what is wrong with the body.
pub fn fields_from_json(body: &[u8]) -> Result<RegistrationFields, String> {
    let text =
        std::str::from_utf8(body).map_err(|e| format!("the body is not UTF-8 text ({e})"))?;
    let v: Value = serde_json::from_str(text).map_err(|e| format!("the body is not JSON: {e}"))?;
    let obj = v.as_object().ok_or("the body must be a JSON object")?;
    let get = |key: &str| text_of(obj.get(key), key);
    Ok(RegistrationFields {
        station: get("station")?,
        latitude: get("latitude")?,
        longitude: get("longitude")?,
        elevation_m: get("elevation_m")?,
        time_zone: get("time_zone")?,
        language: get("language")?,
    })
}

/// The fields of the registration form.
pub fn fields_from_form(form: &[(String, String)]) -> RegistrationFields {
    let get = |name: &str| {
        form.iter()
            .find(|(k, _)| k == name)
            .map(|(_, v)| v.trim().to_string())
            .unwrap_or_default()
    };
    RegistrationFields {
        station: get("station"),
        latitude: get("latitude"),
        longitude: get("longitude"),
        elevation_m: get("elevation_m"),
        time_zone: get("time_zone"),
        language: get("lang"),
    }
}

/// A number of degrees or metres as sent; the sentence when it is not one.
fn number(text: &str, key: &str, what: &str) -> Result<f64, String> {
    let t = text.trim();
    if t.is_empty() {
        return Err(format!("'{key}' is missing; give {what}"));
    }
    t.parse::<f64>()
        .ok()
        .filter(|x| x.is_finite())
        .ok_or_else(|| format!("'{key}' is '{t}', not a number; give {what}"))
}

/// Check a registration's fields: a name (at most [`STATION_NAME_MAX`] characters), a latitude
/// of -90 to 90 degrees, a longitude of -180 to 360 degrees east (kept as -180 to 180), an
/// elevation of -500 to 15,000 m (empty: 0) and a time zone of the IANA database (or a fixed
/// offset such as `+05:30`), written back by its canonical name; a language of the sheets
/// (`es`, `pt-BR`: the primary subtag decides; empty: English).
///
/// Errors: a sentence naming the field and what it should hold.
pub fn checked(f: &RegistrationFields) -> Result<Registration, String> {
    let station = f.station.split_whitespace().collect::<Vec<_>>().join(" ");
    if station.is_empty() {
        return Err("'station' is missing; give the station's name as you want it listed".into());
    }
    if station.chars().count() > STATION_NAME_MAX {
        return Err(format!(
            "'station' is longer than {STATION_NAME_MAX} characters; give a shorter name"
        ));
    }
    let latitude_deg = number(
        &f.latitude,
        "latitude",
        "degrees north, -90 to 90 (south negative)",
    )?;
    if !(-90.0..=90.0).contains(&latitude_deg) {
        return Err(format!("'latitude' is {latitude_deg}, outside -90 to 90 degrees (north positive, south negative)"));
    }
    let longitude_deg = number(
        &f.longitude,
        "longitude",
        "degrees east, -180 to 180 (west negative)",
    )?;
    if !(-180.0..=360.0).contains(&longitude_deg) {
        return Err(format!("'longitude' is {longitude_deg}, outside -180 to 180 degrees (east positive, west negative)"));
    }
    let elevation_m = if f.elevation_m.trim().is_empty() {
        0.0
    } else {
        number(&f.elevation_m, "elevation_m", "metres above sea level")?
    };
    if !(MIN_ELEVATION_M..=MAX_ELEVATION_M).contains(&elevation_m) {
        return Err(format!(
            "'elevation_m' is {elevation_m}, outside {MIN_ELEVATION_M} to {MAX_ELEVATION_M} metres"
        ));
    }
    let checked = Station::new(&station, latitude_deg, longitude_deg, elevation_m)
        .map_err(|e| e.to_string())?;
    if f.time_zone.trim().is_empty() {
        return Err("'time_zone' is missing; give the time zone of the station's clocks, a name of the IANA database such as Europe/Amsterdam, America/Sao_Paulo or Asia/Kolkata (or a fixed offset such as +05:30)".into());
    }
    let zone = CivilZone::parse(&f.time_zone).map_err(|e| format!("'time_zone': {e}"))?;
    let language = match f.language.trim() {
        "" => Language::English,
        code => Language::from_code(code).ok_or_else(|| {
            format!(
                "'language' is '{code}', not a language of the sheets; give one of {}",
                Language::codes_named()
            )
        })?,
    };
    Ok(Registration {
        id: 0,
        registered_utc: String::new(),
        station,
        latitude_deg: checked.latitude_deg,
        longitude_deg: checked.longitude_deg,
        elevation_m,
        time_zone: zone.name(),
        language,
    })
}

/// The registration's station, its predicted contacts and its zone.
pub fn prediction(
    event: &TransitEvent,
    r: &Registration,
) -> Result<(StationPrediction, CivilZone), String> {
    let station = Station::new(&r.station, r.latitude_deg, r.longitude_deg, r.elevation_m)
        .map_err(|e| e.to_string())?;
    let zone = CivilZone::parse(&r.time_zone)?;
    Ok((event.predict(&station), zone))
}

/// The calendar's file name, as `predict --sheets` names it beside the sheet.
pub fn calendar_file(r: &Registration) -> String {
    format!("{}.ics", safe_file_stem(&r.station))
}

/// The station's observers' sheet in `language` (the registration's own, or another the
/// reader chose): the page `predict --sheets --language` writes for it.
pub fn sheet_html(
    event: &TransitEvent,
    r: &Registration,
    language: Language,
) -> Result<String, String> {
    let (p, zone) = prediction(event, r)?;
    let file = calendar_file(r);
    Ok(observer_sheet_html(
        event,
        &SheetStation {
            prediction: &p,
            zone: Some(&zone),
            calendar_file: &file,
            language,
        },
    ))
}

/// The station's calendar (RFC 5545) in `language`, its events stamped with the time of
/// registration.
pub fn calendar_ics(
    event: &TransitEvent,
    r: &Registration,
    language: Language,
) -> Result<String, String> {
    let (p, zone) = prediction(event, r)?;
    let file = calendar_file(r);
    let stamp = chrono::DateTime::parse_from_rfc3339(&r.registered_utc)
        .map(|t| t.to_utc())
        .unwrap_or_default();
    Ok(station_calendar(
        event,
        &SheetStation {
            prediction: &p,
            zone: Some(&zone),
            calendar_file: &file,
            language,
        },
        stamp,
    ))
}

/// The text of the sheet's `<style>` element, for its hash in the content-security policy.
pub fn sheet_style_text() -> String {
    format!("\n{}\n", crate::render::observer_sheet::STYLE)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn fields(lat: &str, lon: &str, elev: &str, zone: &str) -> RegistrationFields {
        RegistrationFields {
            station: "  Lantern   Hill ".into(),
            latitude: lat.into(),
            longitude: lon.into(),
            elevation_m: elev.into(),
            time_zone: zone.into(),
            language: String::new(),
        }
    }

    #[test]
    fn fields_are_checked_with_sentences_that_name_them() {
        let r = checked(&fields("35.68", "139.69", "", "asia/tokyo")).unwrap();
        assert_eq!(r.station, "Lantern Hill");
        assert_eq!(r.time_zone, "Asia/Tokyo");
        assert_eq!(r.elevation_m, 0.0);
        let r = checked(&fields("-33.9", "200", "40", "+05:30")).unwrap();
        assert_eq!((r.longitude_deg, r.time_zone.as_str()), (-160.0, "+05:30"));
        for (f, why) in [
            (fields("91", "0", "", "UTC"), "'latitude' is 91"),
            (fields("x", "0", "", "UTC"), "'latitude' is 'x'"),
            (fields("", "0", "", "UTC"), "'latitude' is missing"),
            (fields("0", "-181", "", "UTC"), "'longitude' is -181"),
            (fields("0", "NaN", "", "UTC"), "not a number"),
            (fields("0", "0", "20000", "UTC"), "'elevation_m' is 20000"),
            (
                fields("0", "0", "", "Europe/Atlantis"),
                "'time_zone': 'Europe/Atlantis'",
            ),
            (fields("0", "0", "", ""), "'time_zone' is missing"),
        ] {
            let e = checked(&f).unwrap_err();
            assert!(e.contains(why), "{e}");
        }
        let mut long = fields("0", "0", "", "UTC");
        long.station = "x".repeat(STATION_NAME_MAX + 1);
        assert!(checked(&long).unwrap_err().contains("longer"));
        long.station = " ".into();
        assert!(checked(&long).unwrap_err().contains("'station' is missing"));
    }

    #[test]
    fn json_is_read_as_text_and_bad_bodies_are_explained() {
        let f = fields_from_json(
            br#"{"station":"A","latitude":10.5,"longitude":"20","time_zone":"UTC"}"#,
        )
        .unwrap();
        assert_eq!((f.latitude.as_str(), f.elevation_m.as_str()), ("10.5", ""));
        assert!(fields_from_json(b"[1]").unwrap_err().contains("object"));
        assert!(fields_from_json(br#"{"latitude":[1]}"#)
            .unwrap_err()
            .contains("latitude"));
        assert!(looks_like_key(&"a".repeat(KEY_LEN)));
        assert!(!looks_like_key("../x") && !looks_like_key(&"a".repeat(KEY_LEN + 1)));
    }

    /// The sheet is the library's own page, with the caution and the zone's clock times, and
    /// its style element is the one the policy allows.
    #[test]
    fn the_sheet_is_the_librarys_own() {
        let event = crate::transit_on_date(
            crate::Planet::Venus,
            crate::time::iso::parse_date("2012-06-06").unwrap(),
            &crate::time::scales::TimeModel::default(),
        )
        .unwrap();
        let mut r = checked(&fields("35.68", "139.69", "40", "Asia/Tokyo")).unwrap();
        r.registered_utc = "2012-05-01T10:00:00.000Z".into();
        let html = sheet_html(&event, &r, r.language).unwrap();
        assert!(html.contains(
            crate::render::text::SAFETY_CAUTION
                .split(';')
                .next()
                .unwrap()
        ));
        assert!(html.contains("JST"), "the clock times in the zone");
        assert!(html.contains(&format!("<style>{}</style>", sheet_style_text())));
        let ics = calendar_ics(&event, &r, r.language).unwrap();
        assert!(ics.contains("BEGIN:VCALENDAR") && ics.contains("DTSTAMP:20120501T100000Z"));
        assert_eq!(calendar_file(&r), "Lantern_Hill.ics");
        // In German: the caution, the words and the decimal comma; the calendar likewise.
        let html = sheet_html(&event, &r, Language::German).unwrap();
        assert!(
            html.contains("<html lang=\"de\">") && html.contains("zertifizierten Sonnenfilter")
        );
        assert!(html.contains("Breite 35,6800°"), "the decimal comma");
        let ics = calendar_ics(&event, &r, Language::German).unwrap();
        assert!(
            ics.contains("SUMMARY:Venustransit: Kontakt II (Lantern Hill)"),
            "{ics}"
        );
    }

    /// The language is taken as a code, English when none is given; another is refused with
    /// the five codes named.
    #[test]
    fn the_language_is_checked() {
        let mut f = fields("35.68", "139.69", "", "UTC");
        assert_eq!(checked(&f).unwrap().language, Language::English);
        f.language = "pt-BR".into();
        assert_eq!(checked(&f).unwrap().language, Language::Portuguese);
        f.language = "ja".into();
        let e = checked(&f).unwrap_err();
        assert!(
            e.contains("'language' is 'ja'")
                && e.contains("en (English)")
                && e.contains("pt (Português)"),
            "{e}"
        );
    }
}
