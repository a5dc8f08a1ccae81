//! Timings in local solar time (`time_local`, `local_time`, `day_reckoning`): `predict
//! --local-time` gives the readings a station's clock would show, and `reduce` of those
//! readings finds the contacts where they were predicted; bad fields are invalid rows with a
//! sentence, or errors naming the line with `--strict`.

mod common;

use common::{err, out, run, temp};

const STATIONS: &str = "station,latitude,longitude,elevation_m\n\
Coral Bay Fort,-17.53,-149.57,5\n\
North Cape Camp,70.98,25.97,30\n\
Bay of Firs,37.77,-122.42,16\n\
Hudson Post,58.76,-94.17,10\n\
Southern Cape,-33.93,18.42,20\n\
Pearl River,23.13,113.26,10\n";

/// Predicted readings in local time as an observations file: apparent time at even stations,
/// mean time at odd ones, astronomical reckoning on the first contact of each.
fn local_campaign() -> String {
    let stations = temp("local_stations.csv", STATIONS.as_bytes());
    let mut rows = String::from("station,latitude,longitude,elevation_m,contact,time_local,local_time,day_reckoning,sigma_s\n");
    for (k, kind) in ["apparent", "mean"].iter().enumerate() {
        let o = run(&[
            "predict",
            "--planet",
            "venus",
            "--date",
            "1769-06-03",
            "--delta-t",
            "16",
            "--stations",
            &stations,
            "--local-time",
            kind,
            "--format",
            "csv",
        ]);
        assert!(o.status.success(), "{}", err(&o));
        for line in out(&o).lines().skip(1) {
            let f: Vec<&str> = line.split(',').collect();
            let station_index = STATIONS
                .lines()
                .skip(1)
                .position(|l| l.starts_with(f[0]))
                .unwrap();
            let altitude: f64 = f[4].parse().unwrap_or(-90.0);
            if station_index % 2 != k || altitude < 5.0 {
                continue;
            }
            let (reading, reckoning) = if f[1] == "1" {
                // Astronomical day: the civil reading minus 12 h, same clock.
                let t =
                    chrono::NaiveDateTime::parse_from_str(f[3], "%Y-%m-%dT%H:%M:%S%.f").unwrap();
                (
                    (t - chrono::TimeDelta::hours(12))
                        .format("%Y-%m-%dT%H:%M:%S%.3f")
                        .to_string(),
                    "astronomical",
                )
            } else {
                (f[3].to_string(), "civil")
            };
            let st = STATIONS.lines().nth(station_index + 1).unwrap();
            rows.push_str(&format!("{st},{},{reading},{kind},{reckoning},2\n", f[1]));
        }
    }
    rows
}

/// `reduce` of a file for the transit of 1769 with Delta T 16 s, as JSON, with these extra
/// arguments; the command must succeed.
fn reduce_1769(path: &str, extra: &[&str]) -> serde_json::Value {
    let mut args = vec![
        "reduce",
        path,
        "--planet",
        "venus",
        "--date",
        "1769-06-03",
        "--delta-t",
        "16",
        "--format",
        "json",
    ];
    args.extend(extra);
    let o = run(&args);
    assert!(o.status.success(), "{}", err(&o));
    serde_json::from_str(&out(&o)).unwrap()
}

#[test]
fn readings_in_local_time_reduce_to_the_predicted_contacts() {
    let text = local_campaign();
    assert!(
        text.contains("astronomical") && text.contains(",mean,") && text.contains(",apparent,")
    );
    let path = temp("local_campaign.csv", text.as_bytes());
    // The place held, so that no fitted offset can absorb a conversion error common to all
    // rows (reading apparent time as mean time moves these contacts by 2 min 16 s).
    let v = reduce_1769(&path, &["--planet-place", "fixed"]);
    let n = text.lines().count() - 1;
    assert!(n >= 12, "{n} rows");
    assert_eq!(
        v["timings_used"].as_u64().unwrap() as usize,
        n,
        "{}",
        v["rejected"]
    );
    // Source of the check: the tool's own predictions, turned into clock readings and back;
    // the conversion must not move a contact by more than 0.05 s (the readings carry 0.01 s).
    let residuals: Vec<f64> = v["stations"]
        .as_array()
        .unwrap()
        .iter()
        .flat_map(|s| s["residuals_s"].as_array().cloned().unwrap_or_default())
        .map(|r| r.as_f64().unwrap())
        .collect();
    assert_eq!(residuals.len(), n);
    let worst = residuals.iter().fold(0.0f64, |w, r| w.max(r.abs()));
    eprintln!("{n} readings, largest O - C {worst:.4} s");
    assert!(worst < 0.05, "largest O - C {worst} s");
}

#[test]
fn a_confused_day_reckoning_is_diagnosed() {
    // Regression: an astronomical reading marked civil is 12 h early; the diagnosis must say
    // so rather than blame a time zone.
    let text = local_campaign();
    let mut lines: Vec<String> = text.lines().map(String::from).collect();
    let k = lines
        .iter()
        .position(|l| l.contains(",astronomical,"))
        .unwrap();
    lines[k] = lines[k].replace(",astronomical,", ",civil,");
    let path = temp(
        "confused_reckoning.csv",
        (lines.join("\n") + "\n").as_bytes(),
    );
    let v = reduce_1769(&path, &[]);
    let line = k as u64 + 1;
    let r = v["rejected"]
        .as_array()
        .unwrap()
        .iter()
        .find(|r| r["line"] == line)
        .unwrap_or_else(|| panic!("line {line} not rejected"));
    assert!(
        r.to_string().contains("astronomical if the rows say civil"),
        "{r}"
    );
}

#[test]
fn bad_local_time_fields_are_invalid_rows_with_a_way_to_fix_them() {
    let head = "station,latitude,longitude,elevation_m,contact,time_utc,time_local,local_time,day_reckoning\n";
    let rows = [
        (
            "a,10,20,0,2,1769-06-03T19:39:57Z,1769-06-03T09:43:56,apparent,",
            "both time_utc and time_local",
        ),
        ("b,10,20,0,2,,1769-06-03T09:43:56,,", "needs local_time"),
        (
            "c,10,20,0,2,,1769-06-03T09:43:56,sidereal,",
            "apparent or mean",
        ),
        ("d,10,20,0,2,,1769-06-03T09:43:56,mean,julian", "civil"),
        ("e,10,20,0,2,,1769-06-03T09:43:56Z,mean,", "has none"),
        ("f,10,20,0,2,,,mean,", "not"),
    ];
    let mut text = String::from(head);
    for (r, _) in &rows {
        text.push_str(r);
        text.push('\n');
    }
    text.push_str("g,-17.53,-149.57,5,2,,1769-06-03T09:43:56,apparent,civil\n");
    let path = temp("bad_local.csv", text.as_bytes());
    let o = run(&[
        "reduce",
        &path,
        "--planet",
        "venus",
        "--date",
        "1769-06-03",
        "--format",
        "json",
    ]);
    let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap_or_default();
    let rejected = v["rejected"].as_array().cloned().unwrap_or_default();
    for (k, (_, needle)) in rows.iter().enumerate() {
        let line = k as u64 + 2;
        let r = rejected
            .iter()
            .find(|r| r["line"] == line)
            .unwrap_or_else(|| panic!("line {line} not listed: {}", err(&o)));
        let why = r.to_string();
        assert!(why.contains(needle), "line {line}: {why}");
    }
    let o = run(&["reduce", &path, "--strict"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("bad_local.csv:2:7"), "{}", err(&o));
}

#[test]
fn local_apparent_time_matches_skyfield() {
    // Source: Skyfield 1.53 with JPL DE405 (1639, 1769) and DE421 (2012): 12 h + GAST +
    // longitude - RA of the Sun's apparent place (tests/reference/generate_local_time.py).
    // Requirement: within 1 s.
    use transit_parallax::sky::solar_time::{local_from_label, LocalTime};
    use transit_parallax::time::iso::parse_utc;
    use transit_parallax::time::scales::TimeModel;
    let text = include_str!("reference/local_apparent_skyfield.csv");
    let mut rdr = csv::Reader::from_reader(text.as_bytes());
    let (mut worst, mut n) = (0.0f64, 0);
    for r in rdr.records() {
        let r = r.unwrap();
        let model = TimeModel::fixed(r[1].parse().unwrap());
        let lon: f64 = r[2].parse().unwrap();
        let ut1 = parse_utc(&r[3]).unwrap();
        let truth = parse_utc(&r[4]).unwrap();
        let got = local_from_label(ut1, LocalTime::Apparent, lon, &model).unwrap();
        let d = (got - truth).num_microseconds().unwrap() as f64 * 1e-6;
        worst = worst.max(d.abs());
        n += 1;
    }
    eprintln!("{n} instants, local apparent time within {worst:.4} s of Skyfield");
    assert!(n == 90 && worst < 1.0, "{worst}");
}

#[test]
fn a_doubtful_longitude_is_solved_for_and_reported() {
    // The local-time campaign with one expedition's longitude given 0.25 degree too far east
    // (its clock readings are the true ones): solving for the correction with a prior of 1
    // degree must find -0.25 within 3 sigma and put every timing back on its prediction.
    let text = local_campaign();
    let mut out_text = String::new();
    for (k, line) in text.lines().enumerate() {
        if k == 0 {
            out_text.push_str(&format!("{line},longitude_sigma_deg\n"));
        } else if line.starts_with("Hudson Post,") {
            let moved = line.replacen(",-94.17,", ",-93.92,", 1);
            out_text.push_str(&format!("{moved},1\n"));
        } else {
            out_text.push_str(&format!("{line},\n"));
        }
    }
    assert!(out_text.contains("-93.92"));
    let path = temp("doubtful_longitude.csv", out_text.as_bytes());
    let v = reduce_1769(&path, &["--planet-place", "fixed"]);
    let st = v["stations"]
        .as_array()
        .unwrap()
        .iter()
        .find(|s| s["station"] == "Hudson Post")
        .unwrap();
    let c = st["longitude_correction_deg"].as_f64().unwrap();
    let sigma = st["longitude_correction_sigma_deg"].as_f64().unwrap();
    eprintln!("longitude correction {c:+.5} +- {sigma:.5} deg");
    assert!(
        sigma > 0.0 && (c + 0.25).abs() < 3.0 * sigma.max(0.002),
        "{c} {sigma}"
    );
    // Stations taken as exact carry no correction.
    let other = v["stations"]
        .as_array()
        .unwrap()
        .iter()
        .find(|s| s["station"] == "Coral Bay Fort")
        .unwrap();
    assert!(other["longitude_correction_deg"].is_null());
    let o = run(&[
        "reduce",
        &path,
        "--planet",
        "venus",
        "--date",
        "1769-06-03",
        "--delta-t",
        "16",
        "--planet-place",
        "fixed",
    ]);
    assert!(
        out(&o).contains("longitude of Hudson Post: given -93.9200"),
        "{}",
        out(&o)
    );
}

#[test]
fn an_undetermined_longitude_is_said_to_be_so() {
    // Thin data: one timing at a station of unknown longitude. Nothing may claim a zero or
    // negative uncertainty; the correction is "not determined".
    let text =
        "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s,longitude_sigma_deg\n\
                Lone Hill,64.84,-147.72,140,2,2012-06-05T22:23:54.3Z,8,unknown\n";
    let path = temp("lone_unknown.csv", text.as_bytes());
    let o = run(&["reduce", &path, "--format", "json"]);
    assert!(o.status.success(), "{}", err(&o));
    let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap();
    assert!(v["stations"][0]["longitude_correction_sigma_deg"].is_null());
    for p in v["parameters"].as_array().unwrap() {
        if let Some(s) = p["sigma"].as_f64() {
            assert!(s > 0.0, "{p}");
        }
    }
    let o = run(&["reduce", &path]);
    assert!(out(&o).contains("its correction is not determined by these timings"));
    let bad = "station,latitude,longitude,elevation_m,contact,time_utc,longitude_sigma_deg\n\
               a,10,20,0,2,2012-06-05T22:30:00Z,-1\n\
               b,10,20,0,2,2012-06-05T22:30:00Z,200\n";
    let path = temp("bad_longitude_sigma.csv", bad.as_bytes());
    let o = run(&["reduce", &path, "--format", "json"]);
    let text = out(&o) + &err(&o);
    assert!(text.contains("is not a longitude uncertainty"), "{text}");
}
