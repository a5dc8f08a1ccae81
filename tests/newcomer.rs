//! What a new user tripped over: dates of contacts, time labels and scales, CSV output,
//! time zones, messages, plurals, widths, help. One regression test per finding.

mod common;

use common::*;
use std::process::Command;

const HEADER: &str = "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s\n";

#[test]
fn each_contact_carries_its_own_date() {
    // Contact I of 2012 was on June 5 (UTC), greatest transit on June 6: geocentric contact I
    // at 22:09 UTC (from memory; the topocentric contacts of 2012 are checked against JPL DE421
    // through Skyfield in tests/reference_contacts.rs). III and IV of 1769 on June 4 (UT1),
    // about 01:16 and 01:35 (from memory).
    let t = out(&run(&[
        "transits", "--planet", "venus", "--from", "1769", "--to", "2012",
    ]));
    let row = |year: &str| t.lines().find(|l| l.contains(year)).unwrap().to_string();
    assert!(
        row("2012-06-06").contains("06-05 22:09"),
        "{}",
        row("2012-06-06")
    );
    assert!(row("2012-06-06").contains("UTC"));
    let r1769 = row("1769-06-03");
    assert!(
        r1769.contains("06-04 01:16") && r1769.contains("UT1"),
        "{r1769}"
    );
    assert!(t.contains("Venus "), "planet names capitalised: {t}");
}

#[test]
fn times_before_1972_are_called_ut1() {
    let stations = data("candidate_sites.csv");
    let t = out(&run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "1769-06-03",
        "--stations",
        &stations,
    ]));
    assert!(t.contains("time (UT1)"), "{t}");
    assert!(t.contains(" UT1 "), "labels say UT1");
    assert!(!t.contains("(UTC)"));
    let t = out(&run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2117-12-11",
        "--stations",
        &stations,
    ]));
    assert!(t.contains("stay tied to TT"), "what Delta T moves: {t}");
}

#[test]
fn reduce_csv_is_csv() {
    let f = std::path::Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("worked-examples/venus-2012-school-network/timings.csv");
    let o = run(&["reduce", f.to_str().unwrap(), "--format", "csv"]);
    assert!(o.status.success());
    let text = out(&o);
    let mut r = csv::Reader::from_reader(text.as_bytes());
    let headers = r.headers().unwrap().clone();
    assert_eq!(
        headers.iter().collect::<Vec<_>>(),
        [
            "line",
            "station",
            "contact",
            "state",
            "reason",
            "o_c_s",
            "sigma_s",
            "diagnosis"
        ]
    );
    let rows: Vec<csv::StringRecord> = r.records().map(|x| x.unwrap()).collect();
    assert_eq!(rows.len(), 82, "one row per timing");
    assert!(rows
        .iter()
        .any(|x| &x[3] == "rejected" && &x[4] == "outlier"));
    assert!(rows
        .iter()
        .filter(|x| &x[3] == "used")
        .all(|x| !x[5].is_empty()));
}

#[test]
fn offsets_are_converted_and_impossible_seconds_refused() {
    // Kestrel Point's contact I of the demo campaign, written with +08:00 and without a zone.
    let rows = [
        "Kestrel Point Observatory,64.84,-147.72,140,1,2012-06-06T06:05:52.3+08:00,20",
        "Kestrel Point Observatory,64.84,-147.72,140,2,2012-06-05T22:23:54.6,8",
        "Kestrel Point Observatory,64.84,-147.72,140,3,2012-06-06T04:31:60Z,8",
    ];
    let f = temp(
        "zones.csv",
        format!("{HEADER}{}\n", rows.join("\n")).as_bytes(),
    );
    let j: serde_json::Value = serde_json::from_str(&out(&run(&[
        "reduce",
        &f,
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--format",
        "json",
    ])))
    .unwrap();
    let rejected = j["rejected"].as_array().unwrap();
    // The +08:00 row is read (not refused); the second 60 on a day with no leap second is.
    assert!(rejected.iter().all(|r| r["line"] != 2), "{rejected:?}");
    let bad = rejected.iter().find(|r| r["line"] == 4).unwrap();
    assert!(bad["diagnosis"].as_str().unwrap().contains("second 60"));
    assert!(j["warnings"]
        .to_string()
        .contains("without a trailing Z (line 3)"));
}

#[test]
fn messages_say_what_and_where() {
    // Not UTF-8: the file and the line named, no 'byte' column.
    let f = temp("latin1.csv", b"station,latitude,longitude,elevation_m,contact,time_utc\nS\xe3o,1,2,3,1,2012-06-05T22:00:00Z\n");
    let o = run(&["reduce", &f]);
    assert_eq!(o.status.code(), Some(2));
    let e = err(&o);
    assert!(e.contains("latin1.csv:2") && e.contains("not UTF-8"), "{e}");
    assert!(!e.contains("column 'byte'"));
    // A range is said once.
    let f = temp(
        "range.csv",
        format!("{HEADER}A,95,0,0,1,2012-06-05T22:00:00Z,5\n").as_bytes(),
    );
    let o = run(&["reduce", &f, "--strict"]);
    let e = err(&o);
    assert_eq!(e.matches("-90").count(), 1, "{e}");
    // A negative value on the command line is refused in words.
    let sites = data("candidate_sites.csv");
    let o = run(&[
        "plan",
        "--planet",
        "venus",
        "--date",
        "2117-12-11",
        "--sites",
        &sites,
        "--sigma-s",
        "-3",
    ]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("must be a positive number"), "{}", err(&o));
}

#[test]
fn a_full_disk_is_reported() {
    let Ok(full) = std::fs::OpenOptions::new().write(true).open("/dev/full") else {
        return; // not on this system
    };
    let o = Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
        .args([
            "transits", "--planet", "venus", "--from", "2000", "--to", "2020",
        ])
        .stdout(full)
        .output()
        .unwrap();
    assert_eq!(o.status.code(), Some(1));
    assert!(err(&o).contains("could not write"), "{}", err(&o));
}

#[test]
fn elevations_a_few_metres_apart_and_airborne_observers_are_accepted() {
    let rows = [
        "Ridge,64.84,-147.72,140,1,2012-06-05T22:05:52.3Z,20",
        "Ridge,64.84,-147.72,170,2,2012-06-05T22:23:54.6Z,8",
        "Airborne,40.0,-150.0,12000,1,2012-06-05T22:05:00Z,20",
    ];
    let f = temp(
        "elev.csv",
        format!("{HEADER}{}\n", rows.join("\n")).as_bytes(),
    );
    let j: serde_json::Value = serde_json::from_str(&out(&run(&[
        "reduce",
        &f,
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--format",
        "json",
    ])))
    .unwrap();
    let invalid: Vec<_> = j["rejected"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|r| r["reason"] == "invalid")
        .collect();
    assert!(invalid.is_empty(), "{invalid:?}");
    assert!(j["warnings"]
        .to_string()
        .contains("the first elevation is used"));
}

#[test]
fn plan_choose_is_checked() {
    let sites = data("candidate_sites.csv");
    let base = [
        "plan",
        "--planet",
        "venus",
        "--date",
        "2117-12-11",
        "--sites",
        &sites,
    ];
    let o = run(&[&base[..], &["--choose", "0"]].concat());
    assert_eq!(o.status.code(), Some(2));
    let o = run(&[&base[..], &["--choose", "999"]].concat());
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("give at most that many"));
    // A site that adds nothing is never chosen.
    let j: serde_json::Value = serde_json::from_str(&out(&run(&[
        &base[..],
        &["--choose", "24", "--format", "json"],
    ]
    .concat())))
    .unwrap();
    let chosen = j["chosen"].as_array().unwrap().len();
    let t = out(&run(&[&base[..], &["--choose", "24"]].concat()));
    if chosen < 24 {
        assert!(t.contains("would add nothing"), "{t}");
    }
}

#[test]
fn dut1_only_where_it_means_something() {
    let stations = data("candidate_sites.csv");
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "1769-06-03",
        "--stations",
        &stations,
        "--dut1",
        "0.3",
    ]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("from 1972 on"));
    let o = run(&[
        "transits",
        "--planet",
        "venus",
        "--from",
        "2000",
        "--to",
        "2020",
        "--dut1",
        "0.2",
        "--delta-t",
        "64",
    ]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("give one of them"));
}

#[test]
fn plurals_and_names() {
    let t = out(&run(&["reduce", &data("one_timing.csv")]));
    assert!(
        t.starts_with("Reduction of 1 timing of the transit of Venus"),
        "{t}"
    );
}

#[test]
fn wide_names_keep_the_columns_aligned() {
    // An invented station with a name in CJK characters (two display columns each).
    let f = temp(
        "wide.csv",
        "station,latitude,longitude,elevation_m\n北极星天文观测站第一号,35.0,135.0,50\nNorth,35.0,135.0,50\n"
            .as_bytes(),
    );
    let t = out(&run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        &f,
    ]));
    let col = |name: &str| {
        let line = t.lines().find(|l| l.starts_with(name)).unwrap();
        let before = &line[..line.find("2012-").unwrap()];
        unicode_width::UnicodeWidthStr::width(before)
    };
    assert_eq!(col("北极星"), col("North"), "{t}");
}

#[test]
fn every_help_ends_with_examples_and_completions_and_manual_work() {
    for c in [
        "transits",
        "predict",
        "reduce",
        "plan",
        "simulate",
        "demo",
        "completions",
        "manual",
    ] {
        let h = out(&run(&[c, "--help"]));
        assert!(h.contains("Examples:\n  transit-parallax"), "{c}: {h}");
    }
    for shell in ["bash", "zsh", "fish"] {
        let o = run(&["completions", shell]);
        assert!(
            o.status.success() && out(&o).contains("transit-parallax"),
            "{shell}"
        );
    }
    let man = out(&run(&["manual"]));
    assert!(man.contains(".TH transit-parallax 1") && man.contains("transit\\-parallax\\-reduce"));
}
