//! End-to-end tests of the `transit-parallax` binary: the stable interface of
//! shared/interface.md and the handling of bad input (exit status 2, file and line named,
//! never a panic).

use std::io::Write;
use std::process::{Command, Output};

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
}

fn run(args: &[&str]) -> Output {
    bin().args(args).output().expect("binary runs")
}

fn stdout(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

struct TempFile(std::path::PathBuf);

impl TempFile {
    fn new(name: &str, bytes: &[u8]) -> TempFile {
        let dir = std::env::temp_dir().join(format!("tp-cli-{}", std::process::id()));
        std::fs::create_dir_all(&dir).unwrap();
        let path = dir.join(name);
        std::fs::File::create(&path)
            .unwrap()
            .write_all(bytes)
            .unwrap();
        TempFile(path)
    }
    fn path(&self) -> &str {
        self.0.to_str().unwrap()
    }
}

impl Drop for TempFile {
    fn drop(&mut self) {
        let _ = std::fs::remove_file(&self.0);
    }
}

const GOOD: &str =
    "station,latitude,longitude,elevation_m\nharbour,-33.87,151.21,58\nhill,35.01,135.77,50\n";

fn predict_with(file: &TempFile) -> Output {
    run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        file.path(),
        "--format",
        "csv",
    ])
}

#[test]
fn transits_json_has_the_interface_keys() {
    let o = run(&[
        "transits", "--planet", "venus", "--from", "2000", "--to", "2020", "--format", "json",
    ]);
    assert!(o.status.success(), "{}", stderr(&o));
    let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
    let arr = v.as_array().unwrap();
    assert_eq!(arr.len(), 2);
    let first = &arr[0];
    for key in [
        "planet",
        "date",
        "greatest_utc",
        "min_separation_arcsec",
        "contacts",
    ] {
        assert!(first.get(key).is_some(), "missing {key}");
    }
    assert_eq!(first["date"], "2004-06-08");
    assert_eq!(arr[1]["date"], "2012-06-06");
    let contacts = first["contacts"].as_array().unwrap();
    assert_eq!(contacts.len(), 4);
    assert_eq!(contacts[0]["contact"], 1);
    assert!(contacts[0]["time_utc"].as_str().unwrap().ends_with('Z'));
}

#[test]
fn transits_csv_and_table_render() {
    let o = run(&[
        "transits", "--planet", "mercury", "--from", "2030", "--to", "2040", "--format", "csv",
    ]);
    assert!(o.status.success());
    let text = stdout(&o);
    // From memory (shared/references.md): Mercury transits on 2032 Nov 13 and 2039 Nov 7.
    assert!(text.contains("mercury,2032-11-13,"));
    assert!(text.contains("mercury,2039-11-07,"));
    assert_eq!(text.lines().count(), 3);
    let o = run(&[
        "transits", "--planet", "mercury", "--from", "2030", "--to", "2040",
    ]);
    assert!(stdout(&o).contains("2032-11-13"));
}

#[test]
fn predict_csv_begins_with_the_interface_columns() {
    let f = TempFile::new("good.csv", GOOD.as_bytes());
    let o = predict_with(&f);
    assert!(o.status.success(), "{}", stderr(&o));
    let text = stdout(&o);
    let mut lines = text.lines();
    assert!(lines
        .next()
        .unwrap()
        .starts_with("station,contact,time_utc,sun_altitude_deg"));
    let rows: Vec<&str> = lines.collect();
    assert_eq!(rows.len(), 8, "one row per station and contact");
    assert!(rows[0].starts_with("harbour,1,2012-06-05T22:"));
    assert!(rows[3].starts_with("harbour,4,"));
    assert!(rows[4].starts_with("hill,1,"));
}

#[test]
fn predict_json_and_table() {
    let f = TempFile::new("good2.csv", GOOD.as_bytes());
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        f.path(),
        "--format",
        "json",
    ]);
    let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
    let rows = v.as_array().unwrap();
    assert_eq!(rows.len(), 8);
    for key in ["station", "contact", "time_utc", "sun_altitude_deg"] {
        assert!(rows[0].get(key).is_some());
    }
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        f.path(),
    ]);
    let text = stdout(&o);
    assert!(
        text.contains("certified solar filter"),
        "the table carries the caution"
    );
}

#[test]
fn predict_accepts_longitudes_from_0_to_360() {
    let f = TempFile::new(
        "east.csv",
        b"station,latitude,longitude,elevation_m\na,40.0,-100.0,0\nb,40.0,260.0,0\n",
    );
    let o = predict_with(&f);
    let text = stdout(&o);
    let times: Vec<&str> = text
        .lines()
        .skip(1)
        .map(|l| l.split(',').nth(2).unwrap())
        .collect();
    assert_eq!(times[0], times[4]);
}

#[test]
fn demo_runs_writes_its_report_and_carries_the_caution() {
    let dir = std::env::temp_dir().join(format!("tp-demo-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let o = bin().arg("demo").current_dir(&dir).output().unwrap();
    assert!(o.status.success(), "{}", stderr(&o));
    let text = stdout(&o);
    assert!(text.contains("certified solar filter"));
    assert!(text.contains("solar parallax"));
    assert!(text.contains("report written: transit-parallax-demo.html"));
    let html = std::fs::read_to_string(dir.join("transit-parallax-demo.html")).unwrap();
    assert!(html.contains("<svg") && html.contains("certified solar filter"));
}

#[test]
fn reduce_writes_html_and_markdown_reports() {
    let dir = std::env::temp_dir().join(format!("tp-rep-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let html = dir.join("r.html");
    let o = run(&[
        "reduce",
        &campaign("venus-2004-clean"),
        "--report",
        html.to_str().unwrap(),
    ]);
    assert!(o.status.success(), "{}", stderr(&o));
    assert!(std::fs::read_to_string(&html).unwrap().contains("</html>"));
    let md = dir.join("r.md");
    let o = run(&[
        "reduce",
        &campaign("venus-2004-clean"),
        "--report",
        md.to_str().unwrap(),
        "--format",
        "json",
    ]);
    assert!(o.status.success());
    assert!(dir.join("r-map.svg").exists());
    let o = run(&[
        "reduce",
        &campaign("venus-2004-clean"),
        "--report",
        dir.join("r.docx").to_str().unwrap(),
    ]);
    assert_usage_error(&o, &[".html", ".md"]);
}

fn assert_usage_error(o: &Output, needles: &[&str]) {
    assert_eq!(o.status.code(), Some(2), "stderr: {}", stderr(o));
    let err = stderr(o);
    assert!(!err.contains("panicked"), "{err}");
    for n in needles {
        assert!(err.contains(n), "expected '{n}' in: {err}");
    }
}

#[test]
fn bad_latitude_names_line_and_column() {
    let f = TempFile::new(
        "badlat.csv",
        b"station,latitude,longitude,elevation_m\na,10,10,0\nb,95,10,0\n",
    );
    assert_usage_error(&predict_with(&f), &["badlat.csv:3:2", "latitude"]);
}

#[test]
fn bad_longitude_and_elevation_are_refused() {
    let f = TempFile::new(
        "badlon.csv",
        b"station,latitude,longitude,elevation_m\na,10,-181,0\n",
    );
    assert_usage_error(&predict_with(&f), &["badlon.csv:2:3", "longitude"]);
    let f = TempFile::new(
        "badel.csv",
        b"station,latitude,longitude,elevation_m\na,10,10,15100\n",
    );
    assert_usage_error(&predict_with(&f), &["badel.csv:2:4", "elevation_m"]);
    let f = TempFile::new(
        "lowel.csv",
        b"station,latitude,longitude,elevation_m\na,10,10,-600\n",
    );
    assert_usage_error(&predict_with(&f), &["lowel.csv:2:4"]);
}

#[test]
fn missing_column_is_named() {
    let f = TempFile::new("nocol.csv", b"station,latitude,elevation_m\na,10,0\n");
    assert_usage_error(
        &predict_with(&f),
        &["nocol.csv:1", "missing column 'longitude'"],
    );
}

#[test]
fn non_numeric_field_is_named() {
    let f = TempFile::new(
        "nan.csv",
        b"station,latitude,longitude,elevation_m\na,ten,10,0\n",
    );
    assert_usage_error(
        &predict_with(&f),
        &["nan.csv:2:2", "'ten' is not a latitude"],
    );
}

#[test]
fn empty_and_header_only_files_are_refused() {
    let f = TempFile::new("empty.csv", b"");
    assert_usage_error(&predict_with(&f), &["empty.csv:1", "empty"]);
    let f = TempFile::new("header.csv", b"station,latitude,longitude,elevation_m\n");
    assert_usage_error(&predict_with(&f), &["header.csv", "no stations"]);
}

#[test]
fn non_utf8_file_is_refused_with_its_line() {
    let f = TempFile::new(
        "latin1.csv",
        b"station,latitude,longitude,elevation_m\nS\xe3o Paulo,-23.5,-46.6,760\n",
    );
    assert_usage_error(&predict_with(&f), &["latin1.csv:2", "UTF-8"]);
}

#[test]
fn repeated_station_is_refused() {
    let f = TempFile::new(
        "dup.csv",
        b"station,latitude,longitude,elevation_m\na,1,1,0\na,2,2,0\n",
    );
    assert_usage_error(&predict_with(&f), &["dup.csv:3:1", "line 2"]);
}

#[test]
fn missing_file_is_a_usage_error() {
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        "/nonexistent/x.csv",
    ]);
    assert_usage_error(&o, &["/nonexistent/x.csv"]);
}

#[test]
fn year_outside_range_is_refused() {
    let o = run(&[
        "transits", "--planet", "venus", "--from", "1500", "--to", "1700",
    ]);
    assert_usage_error(&o, &["1500", "1600", "2300"]);
    let f = TempFile::new("good3.csv", GOOD.as_bytes());
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2400-01-01",
        "--stations",
        f.path(),
    ]);
    assert_usage_error(&o, &["2400"]);
}

#[test]
fn date_without_transit_names_the_nearest() {
    let f = TempFile::new("good4.csv", GOOD.as_bytes());
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2020-01-01",
        "--stations",
        f.path(),
    ]);
    assert_usage_error(&o, &["no transit of venus", "2012-06-06", "2117-12-11"]);
}

#[test]
fn bad_planet_date_and_delta_t_are_usage_errors() {
    let f = TempFile::new("good5.csv", GOOD.as_bytes());
    let o = run(&[
        "predict",
        "--planet",
        "mars",
        "--date",
        "2012-06-06",
        "--stations",
        f.path(),
    ]);
    assert_usage_error(&o, &["mars", "venus or mercury"]);
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "6/6/2012",
        "--stations",
        f.path(),
    ]);
    assert_usage_error(&o, &["YYYY-MM-DD"]);
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        f.path(),
        "--dut1",
        "1.5",
    ]);
    assert_usage_error(&o, &["0.9"]);
    let o = run(&["transits", "--planet", "venus"]);
    assert_eq!(o.status.code(), Some(2));
}

#[test]
fn delta_t_override_moves_pre_1972_contacts() {
    // Before 1972 times are UT1 = TT - Delta T: a Delta T larger by 10 s makes every contact
    // 10 s earlier on the UT1 scale, to within the tiny effect on the Earth's rotation.
    let a = run(&[
        "transits",
        "--planet",
        "venus",
        "--from",
        "1874",
        "--to",
        "1874",
        "--format",
        "json",
        "--delta-t",
        "0",
    ]);
    let b = run(&[
        "transits",
        "--planet",
        "venus",
        "--from",
        "1874",
        "--to",
        "1874",
        "--format",
        "json",
        "--delta-t",
        "10",
    ]);
    let ja: serde_json::Value = serde_json::from_str(&stdout(&a)).unwrap();
    let jb: serde_json::Value = serde_json::from_str(&stdout(&b)).unwrap();
    let t = |j: &serde_json::Value| {
        transit_parallax::time::iso::parse_utc(j[0]["greatest_utc"].as_str().unwrap()).unwrap()
    };
    let diff = (t(&ja) - t(&jb)).num_milliseconds();
    assert!((diff - 10_000).abs() <= 20, "{diff}");
}

fn campaign(name: &str) -> String {
    format!(
        "{}/tests/reference/campaigns/{name}.csv",
        env!("CARGO_MANIFEST_DIR")
    )
}

#[test]
fn reduce_json_has_the_interface_keys() {
    let o = run(&[
        "reduce",
        &campaign("venus-2012-blunders"),
        "--format",
        "json",
    ]);
    assert!(o.status.success(), "{}", stderr(&o));
    let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
    for key in [
        "planet",
        "transit_date",
        "prior_parallax_arcsec",
        "parallax_arcsec",
        "parallax_sigma_arcsec",
        "au_km",
        "au_sigma_km",
        "timings_total",
        "timings_used",
        "rejected",
        "stations",
        "parameters",
        "chi2",
        "dof",
    ] {
        assert!(v.get(key).is_some(), "missing {key}");
    }
    assert_eq!(v["planet"], "venus");
    assert_eq!(v["transit_date"], "2012-06-06");
    let rejected = v["rejected"].as_array().unwrap();
    assert!(!rejected.is_empty());
    for r in rejected {
        for key in ["line", "station", "contact", "reason", "diagnosis"] {
            assert!(r.get(key).is_some(), "rejected row lacks {key}");
        }
        let reason = r["reason"].as_str().unwrap();
        assert!(["invalid", "duplicate", "outlier", "not-visible"].contains(&reason));
    }
    let stations = v["stations"].as_array().unwrap();
    let share: f64 = stations
        .iter()
        .map(|s| s["information_share"].as_f64().unwrap())
        .sum();
    assert!((share - 1.0).abs() < 1e-4);
    for key in [
        "station",
        "timings",
        "information_share",
        "influence_arcsec",
        "residuals_s",
    ] {
        assert!(stations[0].get(key).is_some(), "station lacks {key}");
    }
    for p in v["parameters"].as_array().unwrap() {
        for key in ["name", "value", "sigma", "unit"] {
            assert!(p.get(key).is_some());
        }
    }
    let used = v["timings_used"].as_u64().unwrap();
    let total = v["timings_total"].as_u64().unwrap();
    assert_eq!(
        used + rejected.len() as u64,
        total,
        "every row is accounted for"
    );
}

#[test]
fn reduce_table_lists_rejections_and_the_caution() {
    let o = run(&[
        "reduce",
        &campaign("mercury-2016-blunders"),
        "--planet",
        "mercury",
        "--date",
        "2016-05-09",
    ]);
    assert!(o.status.success(), "{}", stderr(&o));
    let text = stdout(&o);
    assert!(text.contains("solar parallax"));
    assert!(text.contains("Rows not used"));
    assert!(text.contains("sign reversed"));
    assert!(text.contains("certified solar filter"));
}

#[test]
fn reduce_strict_stops_at_the_first_invalid_row() {
    let f = TempFile::new(
        "strict.csv",
        b"station,latitude,longitude,elevation_m,contact,time_utc\na,10,20,0,2,2012-06-05T22:30:00Z\nb,10,20,0,7,2012-06-05T22:30:00Z\n",
    );
    assert_usage_error(
        &run(&["reduce", f.path(), "--strict"]),
        &["strict.csv:3:5", "contact"],
    );
}

#[test]
fn reduce_lists_invalid_rows_without_strict() {
    let mut text = std::fs::read_to_string(campaign("venus-2004-clean")).unwrap();
    text.push_str("bad,10,20,0,7,2004-06-08T06:00:00Z,5,\n");
    text.push_str("far,10,20,0,2,2004-07-08T06:00:00Z,5,\n");
    let f = TempFile::new("withbad.csv", text.as_bytes());
    let o = run(&["reduce", f.path(), "--format", "json"]);
    assert!(o.status.success(), "{}", stderr(&o));
    let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
    let rejected = v["rejected"].as_array().unwrap();
    assert_eq!(rejected.len(), 2);
    assert!(rejected.iter().all(|r| r["reason"] == "invalid"));
}

#[test]
fn reduce_refuses_a_bad_prior_and_a_file_without_timings() {
    let o = run(&[
        "reduce",
        &campaign("venus-2004-clean"),
        "--prior-parallax",
        "50",
    ]);
    assert_usage_error(&o, &["50"]);
    let f = TempFile::new(
        "none.csv",
        b"station,latitude,longitude,elevation_m,contact,time_utc\n",
    );
    assert_eq!(run(&["reduce", f.path()]).status.code(), Some(2));
    let f = TempFile::new(
        "nocontact.csv",
        b"station,latitude,longitude,time_utc\na,1,2,2012-06-05T22:30:00Z\n",
    );
    assert_usage_error(&run(&["reduce", f.path()]), &["missing column 'contact'"]);
}
