//! `--ephemeris` and `--planet-place` through the binary: every output names the ephemeris,
//! the JSON carries `ephemeris` and `planet_place` (shared/interface.md, section "Ephemeris and
//! the planet's place"), bad values are refused with a way to fix them, and thin campaigns
//! with the place held still print nothing impossible.

mod common;

use common::{data, err, out, run};

fn json(args: &[&str]) -> serde_json::Value {
    let o = run(args);
    assert!(o.status.success(), "{}", err(&o));
    serde_json::from_str(&out(&o)).unwrap()
}

#[test]
fn transits_and_predictions_name_their_ephemeris() {
    let v = json(&[
        "transits", "--planet", "venus", "--from", "1760", "--to", "2013", "--format", "json",
    ]);
    let names: Vec<&str> = v
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["ephemeris"].as_str().unwrap())
        .collect();
    // DE405 before 1800, DE423 in the 19th century, DE421 from 1900 (tools/fit_jpl_windows.py).
    assert_eq!(
        names,
        [
            "JPL DE405",
            "JPL DE405",
            "JPL DE423",
            "JPL DE423",
            "JPL DE421",
            "JPL DE421"
        ]
    );
    let v = json(&[
        "transits",
        "--planet",
        "venus",
        "--from",
        "2012",
        "--to",
        "2012",
        "--format",
        "json",
        "--ephemeris",
        "vsop87",
    ]);
    assert_eq!(v[0]["ephemeris"], "VSOP87A");
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        &data("candidate_sites.csv"),
        "--format",
        "csv",
    ]);
    let text = out(&o);
    let mut lines = text.lines();
    assert!(lines.next().unwrap().ends_with(",ephemeris"));
    assert!(lines.all(|l| l.ends_with(",JPL DE421")));
    let o = run(&[
        "predict",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--stations",
        &data("candidate_sites.csv"),
    ]);
    assert!(out(&o).contains("Ephemeris: JPL DE421."));
    let o = run(&[
        "transits",
        "--planet",
        "venus",
        "--from",
        "2012",
        "--to",
        "2012",
        "--ephemeris",
        "de440",
    ]);
    assert_eq!(o.status.code(), Some(2));
    assert!(
        err(&o).contains("jpl") && err(&o).contains("vsop87"),
        "{}",
        err(&o)
    );
}

#[test]
fn reduce_states_the_ephemeris_and_the_planet_place() {
    let demo = data("../../src/data/demo_campaign.csv");
    let free = json(&["reduce", &demo, "--format", "json"]);
    assert_eq!(free["ephemeris"], "JPL DE421");
    assert_eq!(free["planet_place"], "free");
    assert!(free["planet_place_parallax_shift_arcsec"].is_null());
    let fixed = json(&[
        "reduce",
        &demo,
        "--format",
        "json",
        "--planet-place",
        "fixed",
    ]);
    assert_eq!(fixed["planet_place"], "fixed");
    let (sf, sx) = (
        free["parallax_sigma_arcsec"].as_f64().unwrap(),
        fixed["parallax_sigma_arcsec"].as_f64().unwrap(),
    );
    assert!(sx > 0.0 && sx < sf, "{sf} {sx}");
    let shift = fixed["planet_place_parallax_shift_arcsec"]
        .as_array()
        .unwrap();
    assert!(shift.iter().all(|x| x.as_f64().unwrap().is_finite()));
    let prior = json(&[
        "reduce",
        &demo,
        "--format",
        "json",
        "--planet-place",
        "prior=0.02",
    ]);
    assert_eq!(prior["planet_place"], "prior=0.02");
    let o = run(&["reduce", &demo, "--planet-place", "fixed"]);
    let text = out(&o);
    assert!(
        text.contains("held at the ephemeris's value") && text.contains("good to about 0.005\""),
        "{text}"
    );
    for bad in ["loose", "prior=0", "prior=-0.1", "prior=abc"] {
        let o = run(&["reduce", &demo, "--planet-place", bad]);
        assert_eq!(o.status.code(), Some(2), "{bad}");
        assert!(err(&o).contains("prior=0.01"), "{}", err(&o));
    }
}

#[test]
fn thin_campaigns_with_the_place_held_print_nothing_impossible() {
    for (file, determined) in [("one_station.csv", true), ("one_timing.csv", false)] {
        let v = json(&[
            "reduce",
            &data(file),
            "--format",
            "json",
            "--planet-place",
            "fixed",
        ]);
        let text = v.to_string();
        assert!(
            !text.contains("NaN") && !text.contains("null,null"),
            "{file}"
        );
        match v["parallax_sigma_arcsec"].as_f64() {
            Some(s) => assert!(determined && s > 0.0, "{file}: {s}"),
            None => {
                assert!(!determined, "{file}");
                assert!(v["au_km"].is_null() && v["planet_place_parallax_shift_arcsec"].is_null());
            }
        }
    }
}
