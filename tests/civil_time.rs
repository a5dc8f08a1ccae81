//! Civil (clock) time in `predict`, checked against the IANA time-zone database as Python's
//! zoneinfo reads it (tests/reference/civil_time_zoneinfo.csv, written by
//! tests/reference/generate_civil_time.py from the system's tzdata 2025b): every zone's offset
//! one second before and at each of its clock changes in 2012, 2032, 2039 and 2117, for zones
//! with and without daylight saving, in both hemispheres, at quarter-hour offsets.

mod common;
use chrono::NaiveDateTime;
use common::{err, out, run, run_words, temp};
use transit_parallax::time::civil::CivilZone;

fn reference() -> Vec<(String, NaiveDateTime, String, i32)> {
    let text = include_str!("reference/civil_time_zoneinfo.csv");
    text.lines()
        .filter(|l| !l.starts_with('#') && !l.starts_with("zone,"))
        .map(|l| {
            let f: Vec<&str> = l.split(',').collect();
            let utc = NaiveDateTime::parse_from_str(f[1], "%Y-%m-%dT%H:%M:%SZ").expect("utc");
            (
                f[0].to_string(),
                utc,
                f[2].to_string(),
                f[3].parse().expect("offset"),
            )
        })
        .collect()
}

#[test]
fn offsets_either_side_of_every_clock_change_match_the_tz_database() {
    let rows = reference();
    assert!(rows.len() > 100, "{} reference rows", rows.len());
    for (zone, utc, civil, offset_s) in rows {
        let z = CivilZone::parse(&zone).expect("zone");
        let r = z.reading(utc);
        assert_eq!(r.offset_s, offset_s, "{zone} at {utc}");
        assert_eq!(r.iso(0), civil, "{zone} at {utc}");
    }
}

/// The offset the reference gives a zone at an instant: that of the last reference row of the
/// zone at or before it in the same year (rows either side of each change bracket it).
fn reference_offset_s(zone: &str, at: NaiveDateTime) -> i32 {
    use chrono::Datelike;
    let rows: Vec<_> = reference()
        .into_iter()
        .filter(|(z, t, _, _)| z == zone && t.year() == at.year())
        .collect();
    let before = rows.iter().filter(|r| r.1 <= at).max_by_key(|r| r.1);
    let after = rows.iter().filter(|r| r.1 > at).min_by_key(|r| r.1);
    match (before, after) {
        // No change between the two reference rows around the instant: the offset holds.
        (Some(b), Some(a)) if b.3 == a.3 || (a.1 - b.1).num_seconds() == 1 => b.3,
        (Some(b), _) if b.1 >= rows.iter().map(|r| r.1).max().unwrap_or(b.1) => b.3,
        (Some(b), Some(_)) => b.3,
        (None, Some(a)) => a.3,
        _ => panic!("no reference for {zone} in {}", at.year()),
    }
}

#[test]
fn predict_gives_each_station_its_clock_time() {
    let stations = "station,latitude,longitude,elevation_m,time_zone\n\
        Harbour School,-33.86,151.21,20,Australia/Sydney\n\
        Canal Club,52.16,4.49,0,Europe/Amsterdam\n\
        Hill Station,12.97,77.59,900,\n\
        Ridge Hut,-43.95,-176.55,40,Pacific/Chatham\n";
    let path = temp("civil_stations.csv", stations.as_bytes());
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[&path, "--time-zone", "Asia/Kolkata", "--format", "json"],
    );
    assert!(o.status.success(), "{}", err(&o));
    let rows: serde_json::Value = serde_json::from_str(&out(&o)).expect("json");
    let rows = rows.as_array().expect("array");
    assert_eq!(rows.len(), 16);
    for r in rows {
        let zone = r["time_zone"].as_str().expect("zone");
        let utc = r["time_utc"].as_str().expect("utc");
        let civil = r["time_civil"].as_str().expect("civil");
        let t = NaiveDateTime::parse_from_str(utc, "%Y-%m-%dT%H:%M:%S%.fZ").expect("utc");
        let want = reference_offset_s(zone, t);
        let local = t + chrono::TimeDelta::seconds(i64::from(want));
        let text = local.format("%Y-%m-%dT%H:%M:%S%.f").to_string();
        let sign = if want < 0 { '-' } else { '+' };
        let off = format!("{sign}{:02}:{:02}", want.abs() / 3600, want.abs() / 60 % 60);
        assert!(civil.ends_with(&off), "{zone}: {civil} wants {off}");
        assert_eq!(&civil[..19], &text[..19], "{zone}: {civil} from {utc}");
        // The hundredths are the UTC label's.
        assert_eq!(&civil[19..22], &utc[19..22]);
    }
    let station_zone = |name: &str| {
        rows.iter()
            .find(|r| r["station"] == name)
            .and_then(|r| r["time_zone"].as_str())
            .map(str::to_string)
    };
    // The option fills the row that leaves its zone empty.
    assert_eq!(
        station_zone("Hill Station").as_deref(),
        Some("Asia/Kolkata")
    );
    assert_eq!(
        station_zone("Canal Club").as_deref(),
        Some("Europe/Amsterdam")
    );
}

#[test]
fn the_table_and_csv_name_each_rows_zone() {
    let stations = "station,latitude,longitude,time_zone\nCanal Club,52.16,4.49,Europe/Amsterdam\nBay School,-33.9,18.4,+02:00\n";
    let path = temp("civil_table.csv", stations.as_bytes());
    let args = [
        "predict",
        "--planet",
        "mercury",
        "--date",
        "2032-11-13",
        "--stations",
        &path,
    ];
    let o = run(&args);
    assert!(o.status.success(), "{}", err(&o));
    let text = out(&o);
    assert!(
        text.contains("Civil time: Europe/Amsterdam for Canal Club; +02:00 for Bay School."),
        "{text}"
    );
    assert!(text.contains("2032-11-13 07:41:"), "{text}");
    let o = run(&[&args[..], &["--format", "csv"]].concat());
    let csv = out(&o);
    let header = csv.lines().next().expect("header");
    assert!(
        header.starts_with("station,contact,time_utc,time_civil,time_zone,"),
        "{header}"
    );
    assert!(csv.contains(",2032-11-13T08:4"), "{csv}");
}

#[test]
fn a_zone_that_does_not_exist_is_named_with_its_line() {
    let stations = "station,latitude,longitude,time_zone\nA,52,4,Europe/Amsterdam\nB,52,4,Europe/Leiden\nC,52,4,+25:00\n";
    let path = temp("civil_bad.csv", stations.as_bytes());
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[&path],
    );
    assert_eq!(o.status.code(), Some(2));
    let e = err(&o);
    assert!(e.contains("2 of its 3 rows cannot be read"), "{e}");
    assert!(e.contains("civil_bad.csv:3:4 (column 'time_zone'): 'Europe/Leiden' is not a zone of the IANA time-zone database"), "{e}");
    assert!(
        e.contains("civil_bad.csv:4:4 (column 'time_zone'): '+25:00' is not an offset"),
        "{e}"
    );
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[&path, "--time-zone", "Mars/Olympus"],
    );
    assert_eq!(o.status.code(), Some(2));
    assert!(
        err(&o).contains("--time-zone: 'Mars/Olympus' is not a zone"),
        "{}",
        err(&o)
    );
}
