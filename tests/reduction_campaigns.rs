//! The reduction against synthetic campaigns made outside the tool: true contacts from the JPL
//! DE421 ephemeris through Skyfield (tests/reference/generate_campaigns.py), Gaussian timing
//! errors of 3-15 s, a black-drop bias of 8 s on II and III, and injected blunders.
//! The true solar parallax is that of the IAU 2012 au: 149 597 870.7 km (IAU 2012 Resolution
//! B2), asin(6378.1366 km / au) = 8.794143".

use std::path::Path;
use transit_parallax::observations::timings::{read_observations, RejectReason};
use transit_parallax::reduction::{reduce, ReduceOptions, Reduction};
use transit_parallax::{Contact, Station};

const TRUE_AU_KM: f64 = 149_597_870.7;

fn run(name: &str, prior: f64) -> Reduction {
    let path = format!(
        "{}/tests/reference/campaigns/{name}.csv",
        env!("CARGO_MANIFEST_DIR")
    );
    let set = read_observations(Path::new(&path), false).unwrap();
    let options = ReduceOptions {
        prior_parallax_arcsec: prior,
        ..ReduceOptions::default()
    };
    reduce(set, &options).unwrap()
}

fn injected(name: &str) -> Vec<(u64, String, f64, f64, String, Contact)> {
    let path = format!(
        "{}/tests/reference/campaigns/{name}.csv",
        env!("CARGO_MANIFEST_DIR")
    );
    let mut rdr = csv::Reader::from_path(path).unwrap();
    rdr.records()
        .enumerate()
        .filter_map(|(k, r)| {
            let r = r.unwrap();
            let kind = r[7].to_string();
            (!kind.is_empty()).then(|| {
                (
                    k as u64 + 2,
                    r[0].to_string(),
                    r[1].parse().unwrap(),
                    r[2].parse().unwrap(),
                    kind,
                    Contact::parse(&r[4]).unwrap(),
                )
            })
        })
        .collect()
}

fn check_au(red: &Reduction) {
    let au = red.au_km.unwrap();
    let sigma = red.au_sigma_km.unwrap();
    assert!((au - TRUE_AU_KM).abs() < 2.0 * sigma, "AU {au} +- {sigma}");
    let shares: f64 = red.stations.iter().map(|s| s.information_share).sum();
    assert!((shares - 1.0).abs() < 1e-9, "shares sum to {shares}");
}

#[test]
fn clean_venus_2004_recovers_the_au_and_rejects_nothing() {
    let red = run("venus-2004-clean", 8.794143);
    check_au(&red);
    assert!(red.rejected.is_empty(), "{:?}", red.rejected);
    assert_eq!(red.timings_used, red.timings_total);
}

#[test]
fn clean_mercury_2019_recovers_the_au_and_rejects_nothing() {
    let red = run("mercury-2019-clean", 8.794143);
    check_au(&red);
    assert!(red.rejected.is_empty(), "{:?}", red.rejected);
}

/// The phrase the diagnosis of each injected blunder must contain.
fn expected_phrase(kind: &str) -> &'static str {
    match kind {
        "zone:+3h" => "whole number of hours",
        "zone:+5.5h" => "half hours",
        "day:+1" => "off by one day",
        "swap:II>III" => "contacts II and III",
        "swap:I>II" => "contacts I and II",
        "lonsign" => "sign reversed",
        "latlon" => "latitude and longitude exchanged",
        "clock:+75s" => "clock",
        other => panic!("unknown blunder {other}"),
    }
}

fn check_blunders(name: &str) {
    let red = run(name, 8.794143);
    check_au(&red);
    let inj = injected(name);
    assert!(inj.len() >= 8);
    // A coordinate blunder is only detectable where it moves the contact by several sigma; the
    // test computes that effect with the tool's own prediction and requires detection above
    // 6 sigma (common practice for a 5-sigma rejection threshold).
    let date = red.event.date();
    for (line, station, lat, lon, kind, contact) in &inj {
        if kind == "lonsign" || kind == "latlon" {
            let (tlat, tlon) = if kind == "lonsign" {
                (*lat, -*lon)
            } else {
                (*lon, *lat)
            };
            let given = red
                .event
                .predict(&Station::new(station, *lat, *lon, 0.0).unwrap());
            let truth = red
                .event
                .predict(&Station::new(station, tlat, tlon, 0.0).unwrap());
            let effect_s = match (
                given.contacts[contact.index()],
                truth.contacts[contact.index()],
            ) {
                (Some(a), Some(b)) => ((a.hours - b.hours) * 3600.0).abs(),
                _ => f64::INFINITY,
            };
            if effect_s < 6.0 * 15.0 {
                eprintln!("{name} line {line}: {kind} moves the contact by {effect_s:.1} s only; not required");
                continue;
            }
        }
        let r = red
            .rejected
            .iter()
            .find(|r| r.line == *line)
            .unwrap_or_else(|| panic!("{name} ({date}) line {line} ({kind}) was not rejected"));
        assert_eq!(r.reason, RejectReason::Outlier, "line {line}");
        let d = r.diagnosis.clone().unwrap_or_default();
        assert!(d.contains(expected_phrase(kind)), "line {line} {kind}: {d}");
    }
    // No clean row is rejected.
    for r in &red.rejected {
        assert!(
            inj.iter().any(|(l, ..)| *l == r.line),
            "clean line {} rejected: {:?}",
            r.line,
            r.diagnosis
        );
    }
}

#[test]
fn venus_2012_blunders_are_caught_and_diagnosed() {
    check_blunders("venus-2012-blunders");
}

#[test]
fn mercury_2016_blunders_are_caught_and_diagnosed() {
    check_blunders("mercury-2016-blunders");
}

#[test]
fn the_result_does_not_depend_on_the_prior() {
    // Requirement: priors of 7.5" and 10.5" give results that agree to 1e-4 of the sigma.
    for name in [
        "venus-2004-clean",
        "venus-2012-blunders",
        "mercury-2016-blunders",
    ] {
        let a = run(name, 7.5);
        let b = run(name, 10.5);
        let sigma = a.parallax_sigma_arcsec.unwrap();
        let diff = (a.parallax_arcsec.unwrap() - b.parallax_arcsec.unwrap()).abs();
        assert!(diff < 1e-4 * sigma, "{name}: {diff} vs sigma {sigma}");
        assert_eq!(a.timings_used, b.timings_used, "{name}");
    }
}
