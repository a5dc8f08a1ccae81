//! Diagnoses that blamed the wrong cause, on the embedded demo campaign with one blunder
//! added by hand to one station (Kestrel Point Observatory, whose four timings fit, or Jade
//! Harbour School). The blunder signatures are common practice of the trade (no single
//! source): whole minutes on one row are a typing slip, whole hours on every row of a station
//! a time zone left in, a station whose rows fit with the latitude's sign reversed a
//! hemisphere mistyped.

use std::process::Command;

fn demo_rows() -> Vec<String> {
    let p = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("src/data/demo_campaign.csv");
    std::fs::read_to_string(p)
        .unwrap()
        .lines()
        .map(str::to_string)
        .collect()
}

/// Reduce the demo campaign after `edit` changed its rows; the JSON result.
fn reduce_edited(name: &str, edit: impl Fn(&mut Vec<String>)) -> serde_json::Value {
    let mut rows = demo_rows();
    edit(&mut rows);
    let path = std::env::temp_dir().join(format!("tp-diag-{}-{name}.csv", std::process::id()));
    std::fs::write(&path, rows.join("\n")).unwrap();
    let o = Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
        .args(["reduce", path.to_str().unwrap(), "--format", "json"])
        .output()
        .unwrap();
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    serde_json::from_slice(&o.stdout).unwrap()
}

/// Shift the time of the rows of `station` selected by `which` (0-based among its rows).
fn shift(rows: &mut [String], station: &str, which: &[usize], seconds: i64) {
    let mut k = 0;
    for row in rows.iter_mut() {
        if !row.starts_with(&format!("{station},")) {
            continue;
        }
        if which.contains(&k) {
            let mut f: Vec<String> = row.split(',').map(str::to_string).collect();
            let t = chrono::NaiveDateTime::parse_from_str(
                f[5].trim_end_matches('Z'),
                "%Y-%m-%dT%H:%M:%S%.f",
            )
            .unwrap();
            let t = t + chrono::TimeDelta::seconds(seconds);
            f[5] = t.format("%Y-%m-%dT%H:%M:%S%.3fZ").to_string();
            *row = f.join(",");
        }
        k += 1;
    }
}

fn rejected_of<'a>(j: &'a serde_json::Value, station: &str) -> Vec<&'a serde_json::Value> {
    j["rejected"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|r| r["station"] == station)
        .collect()
}

const KESTREL: &str = "Kestrel Point Observatory";

#[test]
fn one_row_off_by_a_minute_is_a_typo_not_the_longitude() {
    let j = reduce_edited("minute", |r| shift(r, KESTREL, &[1], 60));
    let rej = rejected_of(&j, KESTREL);
    assert_eq!(rej.len(), 1, "only the slipped row: {rej:?}");
    let d = rej[0]["diagnosis"].as_str().unwrap();
    assert!(d.contains("minutes was probably mistyped"), "{d}");
    assert!(!d.contains("longitude"), "{d}");
}

#[test]
fn one_row_off_by_90_s_is_not_a_station_clock() {
    let j = reduce_edited("ninety", |r| shift(r, KESTREL, &[1], 90));
    let rej = rejected_of(&j, KESTREL);
    assert_eq!(rej.len(), 1, "the station's other rows stay: {rej:?}");
    assert!(!rej[0]["diagnosis"].as_str().unwrap().contains("clock"));
}

#[test]
fn a_whole_station_in_zone_time_is_named_as_such() {
    let j = reduce_edited("zone", |r| shift(r, KESTREL, &[0, 1, 2, 3], 8 * 3600));
    let rej = rejected_of(&j, KESTREL);
    assert_eq!(rej.len(), 4);
    for r in rej {
        let d = r["diagnosis"].as_str().unwrap();
        assert!(d.contains("time zone of +8 h"), "{d}");
    }
}

#[test]
fn a_latitude_with_its_sign_flipped_is_found() {
    let j = reduce_edited("latitude", |rows| {
        for row in rows
            .iter_mut()
            .filter(|r| r.starts_with("Jade Harbour School,"))
        {
            let mut f: Vec<String> = row.split(',').map(str::to_string).collect();
            f[1] = format!("-{}", f[1]);
            *row = f.join(",");
        }
    });
    let rej = rejected_of(&j, "Jade Harbour School");
    assert!(!rej.is_empty());
    for r in rej {
        let d = r["diagnosis"].as_str().unwrap();
        assert!(d.contains("latitude with the sign reversed"), "{d}");
    }
}

#[test]
fn a_station_with_every_row_rejected_stays_in_the_table() {
    let j = reduce_edited("kept", |_| {});
    // Red Earth Station's clock was wrong (see worked-examples/README.md): all four rejected.
    let st = j["stations"]
        .as_array()
        .unwrap()
        .iter()
        .find(|s| s["station"] == "Red Earth Station")
        .expect("the station is still listed");
    assert_eq!(st["timings"], 0);
    assert!(st["not_used"].as_str().unwrap().contains("clock"));
}
