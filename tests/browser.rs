//! The reports and charts as a browser lays them out. Headless Chromium (Debian's `chromium`,
//! which `.ci/run` installs) renders each page the binary writes; a script added to a copy of
//! the page measures every chart in Chromium's own layout and writes what it found into the
//! page, which `--dump-dom` returns. Checked: every text has a box, no text's box overlaps
//! another's, nothing drawn reaches outside the chart's view box, and the chart is drawn at its
//! own aspect ratio. Without chromium the tests say SKIPPED and pass (CI installs it).

mod common;

use common::chromium::{browser_or_skip, chromium, measure, screenshot_pixels, temp_dir};
use common::{data, run, temp};
use std::path::Path;

/// A page holding standalone SVG files, as a browser opens them side by side.
fn page_of(svgs: &[String]) -> String {
    let mut s =
        String::from("<!DOCTYPE html>\n<html><head><meta charset=\"utf-8\"></head><body>\n");
    for svg in svgs {
        let start = svg.find("<svg").unwrap_or(0);
        s.push_str(&svg[start..]);
        s.push_str("\n<br>\n");
    }
    s.push_str("</body></html>\n");
    s
}

#[test]
fn a_browser_renders_the_demo_report() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("shot");
    let page = dir.join("demo.html");
    let o = run(&["demo", "--report", page.to_str().unwrap()]);
    assert!(o.status.success());
    let shot = dir.join("demo.png");
    let o = chromium(
        &browser,
        &page,
        &dir.join("profile"),
        &[format!("--screenshot={}", shot.display())],
    );
    assert!(
        shot.exists(),
        "no screenshot: {}",
        String::from_utf8_lossy(&o.stderr)
    );
    let (width, height, pixels) = screenshot_pixels(&shot);
    assert_eq!((width, height), (1200, 3000), "rendered at full size");
    let mut distinct = std::collections::HashSet::new();
    let mut non_white = 0usize;
    for px in &pixels {
        distinct.insert(px.to_vec());
        if px.iter().take(3).any(|&c| c < 200) {
            non_white += 1;
        }
    }
    assert!(
        distinct.len() > 50,
        "the page looks blank ({} colours)",
        distinct.len()
    );
    assert!(
        non_white > 10_000,
        "too little drawn ({non_white} dark pixels)"
    );
}

/// The reports of campaigns large and small, as the binary writes them.
fn reports(dir: &Path) -> Vec<(String, String)> {
    let big = temp("browser-big.csv", &big_campaign());
    let mut pages = Vec::new();
    for (name, args) in [
        ("demo", vec!["demo", "--report"]),
        (
            "one-station",
            vec!["reduce", &data("one_station.csv"), "--report"][..].to_vec(),
        ),
        (
            "mercury",
            vec!["reduce", &data("two_stations_mercury.csv"), "--report"],
        ),
        ("big", vec!["reduce", &big, "--report"]),
    ] {
        let file = dir.join(format!("{name}-report.html"));
        let mut a = args.clone();
        a.push(file.to_str().unwrap());
        let o = run(&a);
        assert!(
            o.status.success(),
            "{name}: {}",
            String::from_utf8_lossy(&o.stderr)
        );
        pages.push((name.to_string(), std::fs::read_to_string(&file).unwrap()));
    }
    pages
}

/// A campaign of 1,500 simulated stations with a few blunders, written by the binary's own
/// simulation through the library, so the residual chart is sampled and the map crowded.
fn big_campaign() -> Vec<u8> {
    use rand::SeedableRng;
    use transit_parallax::planning::simulation::{
        campaign_csv, global_stations, simulate_campaign, SimulationSettings,
    };
    let event = transit_parallax::transit_on_date(
        transit_parallax::Planet::Venus,
        transit_parallax::time::iso::parse_date("2012-06-06").unwrap(),
        &transit_parallax::time::scales::TimeModel::default(),
    )
    .unwrap();
    let stations = global_stations(1500, "grid");
    let settings = SimulationSettings {
        blunder_rate: 0.01,
        ..SimulationSettings::default()
    };
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(11);
    let camp = simulate_campaign(&event, &stations, &settings, &mut rng);
    campaign_csv(&camp.observations).into_bytes()
}

#[test]
fn report_charts_are_laid_out_cleanly_in_a_browser() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("layout");
    for (name, html) in reports(&dir) {
        let f = measure(&browser, &dir, &name, &html);
        assert_eq!(
            f.svgs, 5,
            "{name}: the five charts (the light curve the fifth)"
        );
        assert!(
            f.texts > 20 && f.shapes > 20,
            "{name}: {} texts, {} shapes",
            f.texts,
            f.shapes
        );
        assert!(f.problems.is_empty(), "{name}:\n{}", f.problems.join("\n"));
    }
}

#[test]
fn planning_charts_are_laid_out_cleanly_in_a_browser() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("planning");
    let map = dir.join("plan.svg");
    let hist = dir.join("hist.svg");
    let o = run(&[
        "plan",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--sites",
        &data("candidate_sites.csv"),
        "--choose",
        "3",
        "--contact",
        "II",
        "--grid-deg",
        "5",
        "--map",
        map.to_str().unwrap(),
    ]);
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    let o = run(&[
        "simulate",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--network",
        &data("candidate_sites.csv"),
        "--trials",
        "60",
        "--histogram",
        hist.to_str().unwrap(),
    ]);
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    let svgs = [map, hist].map(|p| std::fs::read_to_string(p).unwrap());
    let f = measure(&browser, &dir, "planning", &page_of(&svgs));
    assert_eq!(f.svgs, 2);
    assert!(f.texts > 10, "{} texts", f.texts);
    assert!(f.problems.is_empty(), "{}", f.problems.join("\n"));
}

#[test]
fn the_visibility_map_is_laid_out_cleanly_in_a_browser() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("visibility");
    let mut svgs = Vec::new();
    for (planet, date) in [("mercury", "2032-11-13"), ("venus", "2117-12-11")] {
        let map = dir.join(format!("{planet}.svg"));
        let o = run(&[
            "transits",
            "--planet",
            planet,
            "--date",
            date,
            "--visibility-map",
            map.to_str().unwrap(),
        ]);
        assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
        svgs.push(std::fs::read_to_string(map).unwrap());
    }
    let f = measure(&browser, &dir, "visibility", &page_of(&svgs));
    assert_eq!(f.svgs, 2);
    assert!(f.texts > 40, "{} texts", f.texts);
    assert!(f.problems.is_empty(), "{}", f.problems.join("\n"));
}
