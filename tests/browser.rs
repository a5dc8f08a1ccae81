//! The reports and charts as a browser lays them out. Headless Chromium (Debian's `chromium`,
//! which `.ci/run` installs) renders each page the binary writes; a script added to a copy of
//! the page measures every chart in Chromium's own layout and writes what it found into the
//! page, which `--dump-dom` returns. Checked: every text has a box, no text's box overlaps
//! another's, nothing drawn reaches outside the chart's view box, and the chart is drawn at its
//! own aspect ratio. Without chromium the tests say SKIPPED and pass (CI installs it).

mod common;

use common::chromium::{browser_or_skip, chromium, measure_with, screenshot_pixels, temp_dir};
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

/// The reports of campaigns large and small, as the binary writes them: the demo, one
/// station, a Mercury transit, 1,500 stations, and 100,000 timings.
fn reports(dir: &Path) -> Vec<(String, String)> {
    let big = temp("browser-big.csv", &big_campaign());
    let huge = temp("browser-huge.csv", &huge_campaign());
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
        ("huge", vec!["reduce", &huge, "--report"]),
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

/// A campaign of 100,000 timings: 1 % blunders over 50,100 simulated stations (the service's
/// isolation benchmark's campaign), its first 100,000 rows. The real reduction takes a few
/// seconds, so the chart is of a real result, not a synthetic one.
fn huge_campaign() -> Vec<u8> {
    use rand::SeedableRng;
    use transit_parallax::planning::simulation::{
        campaign_csv, global_stations, simulate_campaign, SimulationSettings,
    };
    let settings = SimulationSettings {
        sigma_s: [20.0, 10.0, 10.0, 20.0],
        black_drop_bias_s: 5.0,
        blunder_rate: 0.01,
        min_altitude_deg: 0.0,
        ..SimulationSettings::default()
    };
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(50_000);
    let camp = simulate_campaign(
        &venus_2012(),
        &global_stations(50_100, "s"),
        &settings,
        &mut rng,
    );
    let csv = campaign_csv(&camp.observations);
    let rows: Vec<&str> = csv.lines().take(100_001).collect();
    assert_eq!(rows.len(), 100_001, "100,000 timings simulated");
    (rows.join("\n") + "\n").into_bytes()
}

fn venus_2012() -> transit_parallax::TransitEvent {
    transit_parallax::transit_on_date(
        transit_parallax::Planet::Venus,
        transit_parallax::time::iso::parse_date("2012-06-06").unwrap(),
        &transit_parallax::time::scales::TimeModel::default(),
    )
    .unwrap()
}

/// The text of the reports' charts, in CSS pixels as laid out at the report's width.
const MIN_TEXT_PX: f64 = 12.0;

#[test]
fn report_charts_are_laid_out_cleanly_in_a_browser() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("layout");
    for (name, html) in reports(&dir) {
        let f = measure_with(&browser, &dir, &name, &html, Some(MIN_TEXT_PX));
        assert!(
            (MIN_TEXT_PX..20.0).contains(&f.smallest_text_px),
            "{name}: the smallest text is {} px",
            f.smallest_text_px
        );
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

/// The planning map and the simulation's histogram: no overlaps, no text under 12 px.
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
    let f = measure_with(
        &browser,
        &dir,
        "planning",
        &page_of(&svgs),
        Some(MIN_TEXT_PX),
    );
    assert_eq!(f.svgs, 2);
    assert!(f.texts > 10, "{} texts", f.texts);
    assert!(f.problems.is_empty(), "{}", f.problems.join("\n"));
}

/// The visibility maps of Mercury 2032 and Venus 2117: no overlaps, no text under 12 px.
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
    let f = measure_with(
        &browser,
        &dir,
        "visibility",
        &page_of(&svgs),
        Some(MIN_TEXT_PX),
    );
    assert_eq!(f.svgs, 2);
    assert!(f.texts > 40, "{} texts", f.texts);
    assert!(f.problems.is_empty(), "{}", f.problems.join("\n"));
}

/// The service's organiser page with the 1,500-station campaign's solution: its four charts
/// (the same figures as the report's, with keys in place of the report's tables) laid out
/// cleanly with no text under 12 px, each with a caption.
#[test]
fn the_organiser_pages_charts_are_laid_out_cleanly_in_a_browser() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let bytes = big_campaign();
    let table = transit_parallax::observations::csv_table::CsvTable::from_bytes(
        Path::new("big.csv"),
        &bytes,
    )
    .unwrap();
    let set =
        transit_parallax::observations::timings::observations_from_table(&table, false).unwrap();
    let red = transit_parallax::reduction::reduce(set, &Default::default()).unwrap();
    let charts = transit_parallax::service::organiser::charts_html(&red);
    let view = transit_parallax::service::organiser::OrganiserView {
        solution: Some(&red),
        error: None,
        pending: false,
        timing_counts: (red.timings_total as i64, 0),
        table_html: "",
        charts_html: &charts,
        counts: (1500, 1500, 0),
        unreadable: &[],
        audit: &[],
        csrf: "test",
        network_html: "",
    };
    let html = transit_parallax::service::organiser::organiser_page(&view);
    assert_eq!(
        html.matches("<figcaption>").count(),
        4,
        "a caption per chart"
    );
    assert!(html.contains("Key: 1 "), "the disc's key on the page");
    assert!(html.contains("numbered as in the key below the chart"));
    let dir = temp_dir("organiser");
    let f = measure_with(&browser, &dir, "organiser", &html, Some(MIN_TEXT_PX));
    assert_eq!(f.svgs, 4, "the four charts");
    assert!(f.texts > 40, "{} texts", f.texts);
    assert!(
        (MIN_TEXT_PX..20.0).contains(&f.smallest_text_px),
        "the smallest text is {} px",
        f.smallest_text_px
    );
    assert!(f.problems.is_empty(), "{}", f.problems.join("\n"));
}

/// Send an observations file to the service's upload form in parts within its body limit
/// (each part with the header line), as an organiser loading a large file would.
fn upload_in_parts(port: u16, csv: &[u8]) {
    use common::server::{request, visitor};
    let text = String::from_utf8_lossy(csv);
    let mut lines = text.lines();
    let header = lines.next().expect("a header line");
    let rows: Vec<&str> = lines.collect();
    let (cookie, csrf) = visitor(port);
    let cookie = format!("Cookie: {cookie}");
    for part in rows.chunks(2_000) {
        let file = format!("{header}\n{}\n", part.join("\n"));
        let body = format!(
            "--XyZ\r\nContent-Disposition: form-data; name=\"csrf\"\r\n\r\n{csrf}\r\n--XyZ\r\nContent-Disposition: form-data; name=\"file\"; filename=\"part.csv\"\r\nContent-Type: text/csv\r\n\r\n{file}\r\n--XyZ--\r\n"
        );
        let headers = [
            "Content-Type: multipart/form-data; boundary=XyZ",
            cookie.as_str(),
        ];
        let r = request(port, "POST", "/upload", &headers, body.as_bytes());
        assert_eq!(r.status, 201, "{}", &r.body[..r.body.len().min(2_000)]);
    }
}

/// The service's public results page (`GET /results`, no token) with the 1,500-station
/// campaign's solution, in English and in German (the longer words): its two charts (the map
/// and the convergence) each with a caption, laid out cleanly with no text under 12 px.
#[test]
fn the_public_results_page_is_laid_out_cleanly_in_a_browser() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("results");
    let server = common::server::start(&dir.join("campaign.sqlite"), &[]);
    upload_in_parts(server.port, &big_campaign());
    common::server::settled_report(&server);
    for code in ["en", "de"] {
        let page = common::server::get(server.port, &format!("/results?lang={code}"), None);
        assert_eq!(page.status, 200);
        let html = page.body;
        assert!(html.contains(&format!("<html lang=\"{code}\"")), "{code}");
        let opening = "<b id=\"n-stations\">";
        let counted = &html[html.find(opening).expect("the counts") + opening.len()..];
        let stations: usize = counted[..counted.find('<').unwrap()]
            .replace([',', '.'], "")
            .parse()
            .expect("a count");
        // The grid's stations that saw a contact (about 1,070 of the 1,500).
        assert!(stations > 1_000, "{stations} stations ({code})");
        assert_eq!(
            html.matches("<figcaption>").count(),
            2,
            "a caption per chart ({code})"
        );
        let name = format!("results-{code}");
        let f = measure_with(&browser, &dir, &name, &html, Some(MIN_TEXT_PX));
        assert_eq!(f.svgs, 2, "the map and the convergence ({code})");
        assert!(f.texts > 10, "{} texts ({code})", f.texts);
        assert!(
            (MIN_TEXT_PX..20.0).contains(&f.smallest_text_px),
            "the smallest text is {} px ({code})",
            f.smallest_text_px
        );
        assert!(f.problems.is_empty(), "{code}: {}", f.problems.join("\n"));
    }
}
