//! `predict --sheets DIR`: the observers' sheets and calendars as the binary writes them, read
//! back and checked against `predict --format json` for the same stations, against RFC 5545's
//! rules for the calendar, and sunrise and sunset against an independent reference.

mod common;

use chrono::{DateTime, TimeDelta};
use common::{err, out, run_words, temp};
use std::collections::HashMap;
use std::path::{Path, PathBuf};
use transit_parallax::render::text::SAFETY_CAUTION;

/// A zone with daylight-saving rules (the Sun rises during the transit), a fixed offset (up
/// throughout), no zone (rises), Hong Kong (sets during the transit), California (down
/// throughout), and a name to be made safe whose safe form another name already took.
const STATIONS: &str = "station,latitude,longitude,elevation_m,time_zone
Leiden Primary School,52.16,4.49,2,Europe/Amsterdam
Cinnamon Coast Club,6.93,79.85,5,+05:30
Saltmarsh Academy,38.72,-9.14,50,
Jade Terrace School,22.28,114.16,40,Asia/Hong_Kong
Redwood Valley School,38.44,-122.71,50,America/Los_Angeles
Leiden / Primary School?,52.16,4.49,2,Europe/Amsterdam
";

/// The file stems the binary should choose, in station order.
const STEMS: [&str; 6] = [
    "Leiden_Primary_School",
    "Cinnamon_Coast_Club",
    "Saltmarsh_Academy",
    "Jade_Terrace_School",
    "Redwood_Valley_School",
    "Leiden_Primary_School-2",
];

/// Run `predict --format json --sheets DIR` on [`STATIONS`]; the JSON rows and the folder.
fn predict_with_sheets(name: &str) -> (Vec<serde_json::Value>, PathBuf) {
    let stations = temp(&format!("{name}-stations.csv"), STATIONS.as_bytes());
    let dir = std::env::temp_dir().join(format!("tp-sheets-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    let nested = dir.join("nested");
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --format json --stations",
        &[&stations, "--sheets", nested.to_str().unwrap()],
    );
    assert!(o.status.success(), "{}", err(&o));
    assert!(err(&o).contains("6 observers' sheets"), "{}", err(&o));
    let rows: Vec<serde_json::Value> = serde_json::from_str(&out(&o)).unwrap();
    (rows, dir.join("nested"))
}

/// An ISO 8601 time with decimals rounded to the second, written as the sheet writes it
/// (`Z` for UTC, else the offset).
fn to_second(iso: &str) -> String {
    let t = DateTime::parse_from_rfc3339(iso).unwrap() + TimeDelta::milliseconds(500);
    let text = t.format("%Y-%m-%dT%H:%M:%S%:z").to_string();
    if iso.ends_with('Z') {
        text.replace("+00:00", "Z")
    } else {
        text
    }
}

/// Every `datetime="..."` value of a page, in order.
fn datetimes(html: &str) -> Vec<String> {
    html.split("datetime=\"")
        .skip(1)
        .map(|s| s[..s.find('"').unwrap()].to_string())
        .collect()
}

/// The JSON rows of one station.
fn rows_of<'a>(rows: &'a [serde_json::Value], station: &str) -> Vec<&'a serde_json::Value> {
    rows.iter().filter(|r| r["station"] == station).collect()
}

fn station_names() -> Vec<&'static str> {
    STATIONS
        .lines()
        .skip(1)
        .map(|l| l.split(',').next().unwrap())
        .collect()
}

/// Every row of every table of a page has as many cells as the table's first row (a heading
/// and its blank rows must line up).
fn assert_tables_are_rectangular(stem: &str, html: &str) {
    for table in html.split("<table").skip(1) {
        let table = table.split("</table>").next().unwrap_or("");
        let cells: Vec<usize> = table
            .split("<tr")
            .skip(1)
            .map(|row| row.matches("<td").count() + row.matches("<th").count())
            .collect();
        assert!(
            cells.windows(2).all(|w| w[0] == w[1]),
            "{stem}: a table's rows have {cells:?} cells"
        );
    }
}

#[test]
fn every_station_gets_a_safe_sheet_with_the_caution_and_the_predicted_times() {
    let (rows, dir) = predict_with_sheets("sheets");
    for (name, stem) in station_names().into_iter().zip(STEMS) {
        assert!(stem
            .chars()
            .all(|c| c.is_ascii_alphanumeric() || c == '-' || c == '_'));
        let html = std::fs::read_to_string(dir.join(format!("{stem}.html"))).unwrap();
        assert!(dir.join(format!("{stem}.ics")).exists(), "{stem}.ics");
        let caution = html.find(SAFETY_CAUTION).expect("caution");
        assert!(
            caution < html.find("<h1>").unwrap(),
            "the caution comes first"
        );
        for bad in ["<script", "src=", "href=", "url(", "@import"] {
            assert!(!html.to_ascii_lowercase().contains(bad), "{stem}: {bad}");
        }
        assert_tables_are_rectangular(stem, &html);
        assert!(
            !html.replace("&nbsp;", "").contains("nbsp;"),
            "{stem}: an entity lost its ampersand"
        );
        let stamps = datetimes(&html);
        for r in rows_of(&rows, name) {
            let utc = to_second(r["time_utc"].as_str().unwrap());
            assert!(stamps.contains(&utc), "{stem}: {utc} not in {stamps:?}");
            if let Some(civil) = r["time_civil"].as_str() {
                let civil = to_second(civil);
                assert!(stamps.contains(&civil), "{stem}: {civil} not in {stamps:?}");
            }
        }
    }
    let saltmarsh = std::fs::read_to_string(dir.join("Saltmarsh_Academy.html")).unwrap();
    assert!(saltmarsh.contains("UTC only") && saltmarsh.contains("--time-zone"));
    let leiden = std::fs::read_to_string(dir.join("Leiden_Primary_School.html")).unwrap();
    assert!(leiden.contains("Europe/Amsterdam") && leiden.contains("CET (UTC+01:00)"));
    let cinnamon = std::fs::read_to_string(dir.join("Cinnamon_Coast_Club.html")).unwrap();
    assert!(cinnamon.contains("stays up through the whole transit"));
    let redwood = std::fs::read_to_string(dir.join("Redwood_Valley_School.html")).unwrap();
    assert!(redwood.contains("down for the whole transit"));
    assert!(redwood.contains("holds no events"));
    assert_eq!(redwood.matches("below horizon — not seen").count(), 4);
}

/// Check an iCalendar text line by line (RFC 5545 §3.1 and §3.6): CRLF endings, lines of at
/// most 75 octets, BEGIN and END balanced; its DTSTART values and counts of VEVENT, VALARM.
fn check_ics(ics: &str) -> (Vec<String>, usize, usize) {
    assert!(ics.ends_with("\r\n"));
    assert_eq!(
        ics.matches('\n').count(),
        ics.matches("\r\n").count(),
        "CRLF only"
    );
    let mut open: Vec<&str> = Vec::new();
    let (mut starts, mut events, mut alarms) = (Vec::new(), 0, 0);
    for line in ics.split("\r\n").filter(|l| !l.is_empty()) {
        assert!(line.len() <= 75, "{} octets: {line}", line.len());
        if let Some(what) = line.strip_prefix("BEGIN:") {
            open.push(what);
            events += usize::from(what == "VEVENT");
            alarms += usize::from(what == "VALARM");
        } else if let Some(what) = line.strip_prefix("END:") {
            assert_eq!(open.pop(), Some(what), "unbalanced END:{what}");
        } else if let Some(v) = line.strip_prefix("DTSTART:") {
            starts.push(v.to_string());
        }
    }
    assert!(open.is_empty(), "unclosed {open:?}");
    assert!(ics.starts_with("BEGIN:VCALENDAR\r\n") && ics.contains("\r\nPRODID:"));
    (starts, events, alarms)
}

#[test]
fn each_calendar_holds_the_contacts_seen_with_the_sun_up_at_their_predicted_times() {
    let (rows, dir) = predict_with_sheets("calendars");
    for (name, stem) in station_names().into_iter().zip(STEMS) {
        let ics = std::fs::read_to_string(dir.join(format!("{stem}.ics"))).unwrap();
        let (starts, events, alarms) = check_ics(&ics);
        let seen: Vec<String> = rows_of(&rows, name)
            .into_iter()
            .filter(|r| r["sun_altitude_deg"].as_f64().unwrap() > -50.0 / 60.0)
            .map(|r| to_second(r["time_utc"].as_str().unwrap()).replace(['-', ':'], ""))
            .collect();
        assert_eq!(events, seen.len(), "{stem}");
        assert_eq!(alarms, events, "{stem}: one reminder per event");
        assert_eq!(starts, seen, "{stem}: DTSTART in UTC to the second");
        // The crate's own parser reads it back.
        let parsed: icalendar::Calendar = ics.parse().expect("RFC 5545 text");
        assert_eq!(parsed.components.len(), events, "{stem}");
        for uid in ics.lines().filter(|l| l.starts_with("UID:")) {
            assert!(!uid.contains("uuid"), "{uid}");
        }
    }
    // Stable UIDs: a second run writes the same ones.
    let (_, again) = predict_with_sheets("calendars-again");
    let uids = |d: &Path| {
        let ics = std::fs::read_to_string(d.join("Jade_Terrace_School.ics")).unwrap();
        ics.lines()
            .filter(|l| l.starts_with("UID:"))
            .map(String::from)
            .collect::<Vec<_>>()
    };
    assert_eq!(uids(&dir), uids(&again));
    let ics = std::fs::read_to_string(dir.join("Jade_Terrace_School.ics")).unwrap();
    assert!(ics.contains("SUMMARY:Transit of Mercury: contact II (Jade Terrace School)"));
    assert!(
        ics.contains("TRIGGER;RELATED=START:-PT1800S"),
        "30 min before contact I"
    );
    // Unfolded (RFC 5545 §3.1), each description gives the clock time, the Sun's altitude and
    // the caution; each reminder is shown on screen.
    let unfolded = ics.replace("\r\n ", "");
    let descriptions: Vec<&str> = unfolded
        .split("\r\n")
        .filter(|l| l.starts_with("DESCRIPTION:Contact") && l.contains(" at Jade Terrace"))
        .collect();
    assert_eq!(
        descriptions.len(),
        2,
        "contacts I and II are seen at Hong Kong"
    );
    for d in descriptions {
        assert!(d.contains("Clock time ") && d.contains("(HKT)"), "{d}");
        assert!(d.contains("Sun's altitude") && d.contains("CAUTION: looking at the Sun"));
    }
    assert_eq!(unfolded.matches("ACTION:DISPLAY").count(), 2);
}

#[test]
fn sunrise_and_sunset_agree_with_the_noaa_algorithm_within_a_minute() {
    // Source: tests/reference/sunrise_noaa.csv, written by generate_sunrise_noaa.py (NOAA
    // Solar Calculator equations after Meeus 1998, chs. 12, 15, 25), independent of the tool.
    let reference = std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/reference/sunrise_noaa.csv"),
    )
    .unwrap();
    let (_, dir) = predict_with_sheets("sunrise");
    let stems: HashMap<&str, &str> = station_names().into_iter().zip(STEMS).collect();
    let mut checked = 0;
    for line in reference.lines().skip(1) {
        let f: Vec<&str> = line.split(',').collect();
        let html = std::fs::read_to_string(dir.join(format!("{}.html", stems[f[0]]))).unwrap();
        let para = &html[html.find("Sunrise and sunset").unwrap()..];
        let para = &para[..para.find("</p>").unwrap()];
        assert!(
            para.contains(&format!("The Sun {} during the transit", f[1])),
            "{para}"
        );
        let utc = datetimes(para)
            .into_iter()
            .find(|t| t.ends_with('Z'))
            .unwrap();
        let ours = DateTime::parse_from_rfc3339(&utc).unwrap();
        let noaa = DateTime::parse_from_rfc3339(f[2]).unwrap();
        let diff_s = (ours - noaa).num_seconds().abs();
        assert!(
            diff_s <= 60,
            "{}: {utc} against {} ({diff_s} s)",
            f[0],
            f[2]
        );
        checked += 1;
    }
    assert_eq!(checked, 3);
}

#[test]
fn an_unwritable_folder_is_a_clear_error() {
    let stations = temp("unwritable-stations.csv", STATIONS.as_bytes());
    let file = temp("not-a-folder", b"x");
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[&stations, "--sheets", &format!("{file}/sheets")],
    );
    assert!(!o.status.success());
    assert!(err(&o).contains("cannot read or write"), "{}", err(&o));
    assert!(err(&o).contains("not-a-folder"), "{}", err(&o));
    assert!(!err(&o).contains("panicked"), "{}", err(&o));
}

/// Run `predict --sheets DIR --language CODE` on [`STATIONS`]; the folder.
fn sheets_in(name: &str, code: &str) -> PathBuf {
    let stations = temp(&format!("{name}-stations.csv"), STATIONS.as_bytes());
    let dir = std::env::temp_dir().join(format!("tp-sheets-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[
            &stations,
            "--sheets",
            dir.to_str().unwrap(),
            "--language",
            code,
        ],
    );
    assert!(o.status.success(), "{}", err(&o));
    dir
}

/// The caution of a language as the pages and sheets write it (the pages' own message).
fn caution_in(language: transit_parallax::language::Language) -> String {
    let args = transit_parallax::language::Args::new();
    transit_parallax::render::svg::esc(&transit_parallax::language::text(
        language,
        "solar-caution",
        &args,
    ))
}

#[test]
fn a_sheet_in_spanish_or_german_has_its_caution_words_and_decimal_comma() {
    use transit_parallax::language::Language;
    for (code, language) in [("es", Language::Spanish), ("de", Language::German)] {
        let dir = sheets_in(&format!("language-{code}"), code);
        let html = std::fs::read_to_string(dir.join("Leiden_Primary_School.html")).unwrap();
        assert!(html.contains(&format!("<html lang=\"{code}\">")), "{code}");
        // The full caution, first on the page, in the language: filter over the front, or
        // projection; never an optical finder; local guidance and a supervisor.
        let caution = caution_in(language);
        let at = html.find(&caution).expect("the translated caution");
        assert!(
            at < html.find("<h1>").unwrap(),
            "{code}: the caution comes first"
        );
        let words: &[&str] = match language {
            Language::Spanish => &[
                "filtro solar certificado",
                "proyectada",
                "buscador óptico",
                "supervisor con experiencia",
            ],
            _ => &[
                "zertifizierten Sonnenfilter",
                "Projektionsschirm",
                "optischen Sucher",
                "erfahrenen Aufsicht",
            ],
        };
        for w in words {
            assert!(caution.contains(w), "{code}: {w}");
        }
        assert!(!html.contains(SAFETY_CAUTION), "{code}: no English caution");
        // Numbers with the decimal comma, the date with its month name, times 24-hour.
        assert!(
            html.contains("52,1600°") && html.contains("4,4900°"),
            "{code}: coordinates"
        );
        assert!(!html.contains("52.1600"), "{code}: no decimal point");
        let (title, heading, seen, month) = match language {
            Language::Spanish => (
                "Tránsito de Mercurio, 13 de noviembre de 2032",
                "Los cuatro contactos",
                "sí, Sol arriba",
                "noviembre",
            ),
            _ => (
                "Merkurtransit, 13. November 2032",
                "Die vier Kontakte",
                "ja, Sonne oben",
                "November",
            ),
        };
        assert!(
            html.contains(&format!("<h1>{title}: Leiden Primary School</h1>")),
            "{code}: {month}"
        );
        assert!(html.contains(heading) && html.contains(seen), "{code}");
        assert!(html.contains("12:06:00 CET"), "{code}: 24-hour clock time");
        for english in [
            "The four contacts",
            "Your timings",
            "Sunrise and sunset",
            "Position angle",
            "Zenith<",
        ] {
            assert!(
                !html.contains(english),
                "{code}: '{english}' left in English"
            );
        }
        assert_tables_are_rectangular(code, &html);
        // The calendar in the same language, its caution and decimal comma (escaped as RFC
        // 5545 text: `\,`), still valid iCalendar.
        let ics = std::fs::read_to_string(dir.join("Leiden_Primary_School.ics")).unwrap();
        let (_, events, _) = check_ics(&ics);
        assert_eq!(events, 2, "{code}");
        let unfolded = ics.replace("\r\n ", "");
        let summary = match language {
            Language::Spanish => {
                "SUMMARY:Tránsito de Mercurio: contacto III (Leiden Primary School)"
            }
            _ => "SUMMARY:Merkurtransit: Kontakt III (Leiden Primary School)",
        };
        assert!(unfolded.contains(summary), "{code}: {unfolded}");
        let first_words = caution.split(',').next().unwrap();
        assert!(
            unfolded.contains(first_words),
            "{code}: the caution in the calendar"
        );
        assert!(
            unfolded.contains("19\\,5"),
            "{code}: the Sun's altitude with a comma"
        );
    }
}

#[test]
fn an_unknown_language_is_refused_naming_the_five() {
    let stations = temp("unknown-language.csv", STATIONS.as_bytes());
    let dir = std::env::temp_dir().join(format!("tp-sheets-{}-unknown", std::process::id()));
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[
            &stations,
            "--sheets",
            dir.to_str().unwrap(),
            "--language",
            "ja",
        ],
    );
    assert!(!o.status.success());
    for code in [
        "'ja'",
        "en (English)",
        "es (Español)",
        "fr (Français)",
        "de (Deutsch)",
        "pt (Português)",
    ] {
        assert!(err(&o).contains(code), "{code}: {}", err(&o));
    }
    assert!(!dir.exists(), "nothing written");
    // The option belongs to --sheets.
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --language de --stations",
        &[&stations],
    );
    assert!(
        !o.status.success() && err(&o).contains("--sheets"),
        "{}",
        err(&o)
    );
}
