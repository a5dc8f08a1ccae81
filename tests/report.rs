//! Reports: the HTML page is well-formed, holds the four charts as inline SVG and the solution's
//! numbers, carries the caution, loads nothing and runs no script, and shows markup from
//! submitted files only escaped; Markdown writes its charts beside it. (tests/browser.rs lays
//! the pages out in Chromium.)

use quick_xml::events::Event;
use quick_xml::Reader;
use rand::SeedableRng;
use std::path::{Path, PathBuf};
use transit_parallax::observations::csv_table::CsvTable;
use transit_parallax::observations::timings::observations_from_table;
use transit_parallax::planning::simulation::{
    global_stations, simulate_campaign, SimulationSettings,
};
use transit_parallax::reduction::{reduce, ReduceOptions, Reduction};
use transit_parallax::render::document::{html_report, markdown_report, write_report};
use transit_parallax::render::reduction::reduction_json;
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet};

fn reduce_text(text: &str) -> Reduction {
    let table = CsvTable::from_bytes(Path::new("t.csv"), text.as_bytes()).unwrap();
    let set = observations_from_table(&table, false).unwrap();
    reduce(set, &ReduceOptions::default()).unwrap()
}

fn demo() -> Reduction {
    reduce_text(transit_parallax::demo::DEMO_CAMPAIGN_CSV)
}

/// Parse as XML (the report is written in XHTML syntax); returns the element names seen.
fn well_formed(html: &str) -> Vec<String> {
    let mut reader = Reader::from_str(html);
    let mut names = Vec::new();
    let mut depth: i64 = 0;
    loop {
        match reader.read_event() {
            Ok(Event::Start(e)) => {
                depth += 1;
                names.push(String::from_utf8_lossy(e.name().as_ref()).into_owned());
            }
            Ok(Event::Empty(e)) => {
                names.push(String::from_utf8_lossy(e.name().as_ref()).into_owned())
            }
            Ok(Event::End(_)) => depth -= 1,
            Ok(Event::Eof) => break,
            Ok(_) => {}
            Err(e) => panic!("not well-formed at byte {}: {e}", reader.buffer_position()),
        }
    }
    assert_eq!(depth, 0, "unbalanced elements");
    names
}

#[test]
fn demo_report_is_well_formed_and_complete() {
    let red = demo();
    let html = html_report(&red);
    let names = well_formed(&html);
    assert_eq!(
        names.iter().filter(|n| *n == "svg").count(),
        5,
        "five charts (the fifth the light curve)"
    );
    assert!(!names
        .iter()
        .any(|n| n == "script" || n == "img" || n == "link" || n == "iframe"));
    assert!(
        !html.contains("http://")
            || html.matches("http://").count()
                == html.matches("xmlns=\"http://www.w3.org/2000/svg\"").count(),
        "nothing loaded from anywhere"
    );
    assert!(html.contains("certified solar filter"));
    // The solution's numbers as the JSON output gives them.
    let json = reduction_json(&red);
    let pi = json["parallax_arcsec"].as_f64().unwrap();
    let au = json["au_km"].as_f64().unwrap();
    assert!(html.contains(&format!("{pi:.4}")), "parallax {pi}");
    // The AU in millions of km, to about three digits of its uncertainty.
    let au_sigma = json["au_sigma_km"].as_f64().unwrap();
    let d = transit_parallax::render::text::decimals_for(au_sigma / 1e6);
    let expected = format!("{:.d$} ± {:.d$} million km", au / 1e6, au_sigma / 1e6);
    assert!(html.contains(&expected), "AU {expected}");
    for r in json["rejected"].as_array().unwrap() {
        assert!(
            html.contains(&format!("<td>{}</td>", r["line"])),
            "rejected line {}",
            r["line"]
        );
    }
}

#[test]
fn markup_in_station_names_appears_only_escaped() {
    let mut text =
        String::from("station,latitude,longitude,elevation_m,contact,time_utc,sigma_s\n");
    let evil = [
        "<script>alert(1)</script>",
        "<img src=x onerror=alert(1)>",
        "\"quoted\" & 'single'",
    ];
    let base = transit_parallax::demo::DEMO_CAMPAIGN_CSV;
    for (i, line) in base
        .lines()
        .filter(|l| !l.starts_with('#'))
        .skip(1)
        .enumerate()
    {
        let mut fields: Vec<String> = line.split(',').map(str::to_string).collect();
        if i < 12 {
            fields[0] = format!("\"{} {}\"", evil[i % 3].replace('"', "\"\""), i / 3);
        }
        text.push_str(&fields.join(","));
        text.push('\n');
    }
    let red = reduce_text(&text);
    let html = html_report(&red);
    let names = well_formed(&html);
    assert!(
        !names.iter().any(|n| n == "script" || n == "img"),
        "no such element"
    );
    assert!(!html.contains("<script"), "raw script tag");
    assert!(!html.contains("<img"), "raw img tag");
    assert!(
        html.contains("&lt;img src=x onerror=alert(1)&gt;"),
        "the img markup shows as text"
    );
    assert!(html.contains("&lt;script&gt;alert(1)&lt;/script&gt;"));
    assert!(html.contains("&quot;quoted&quot; &amp; &#39;single&#39;"));
    let (md, charts) = markdown_report(&red, "r");
    assert!(!md.contains("<script") && !md.contains("<img"));
    // Regression: Markdown is escaped for Markdown, not HTML: quotes stay as they are.
    assert!(
        !md.contains("&quot;") && !md.contains("&#39;"),
        "HTML entities for quotes"
    );
    assert!(md.contains("\"quoted\" &amp; 'single'"), "quotes kept");
    for (_, svg) in charts {
        assert!(!svg.contains("<script") && !svg.contains("<img"));
    }
}

fn temp_dir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("tp-report-{}-{name}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    d
}

#[test]
fn markdown_report_writes_its_charts_beside_it() {
    let red = demo();
    let dir = temp_dir("md");
    let written = write_report(&red, &dir.join("campaign.md")).unwrap();
    assert_eq!(written.len(), 6);
    let md = std::fs::read_to_string(dir.join("campaign.md")).unwrap();
    for name in [
        "campaign-disc.svg",
        "campaign-map.svg",
        "campaign-residuals.svg",
        "campaign-convergence.svg",
        "campaign-light-curve.svg",
    ] {
        assert!(md.contains(name));
        let svg = std::fs::read_to_string(dir.join(name)).unwrap();
        well_formed(&svg);
    }
    assert!(md.contains("| station |") || md.contains("| # | station |"));
    assert!(write_report(&red, &dir.join("campaign.pdf")).is_err());
}

#[test]
fn a_5000_timing_report_stays_under_5_mb() {
    let event = transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap(),
        &TimeModel::default(),
    )
    .unwrap();
    let stations: Vec<_> = global_stations(6000, "r").into_iter().take(2600).collect();
    let settings = SimulationSettings {
        min_altitude_deg: 0.0,
        blunder_rate: 0.01,
        ..SimulationSettings::default()
    };
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(7);
    let camp = simulate_campaign(&event, &stations, &settings, &mut rng);
    assert!(
        camp.observations.valid.len() >= 5000,
        "{}",
        camp.observations.valid.len()
    );
    let red = reduce(
        camp.observations,
        &ReduceOptions {
            event: Some((Planet::Venus, event.date())),
            ..ReduceOptions::default()
        },
    )
    .unwrap();
    let html = html_report(&red);
    assert!(html.len() < 5_000_000, "{} bytes", html.len());
}

/// A text of an SVG: x, y and its content.
type PlacedText = (f64, f64, String);

/// The view box of an SVG and the (x, y) of every `<text>` in it.
fn text_positions(svg: &str) -> ((f64, f64), Vec<PlacedText>) {
    let mut reader = Reader::from_str(svg);
    let mut view = (0.0, 0.0);
    let mut texts = Vec::new();
    let mut pending: Option<(f64, f64)> = None;
    loop {
        match reader.read_event() {
            Ok(Event::Start(e)) | Ok(Event::Empty(e)) => {
                let attr = |name: &[u8]| {
                    e.attributes()
                        .flatten()
                        .find(|a| a.key.as_ref() == name)
                        .map(|a| String::from_utf8_lossy(&a.value).into_owned())
                };
                if e.name().as_ref() == b"svg" {
                    let vb: Vec<f64> = attr(b"viewBox")
                        .unwrap()
                        .split(' ')
                        .map(|v| v.parse().unwrap())
                        .collect();
                    view = (vb[2], vb[3]);
                }
                if e.name().as_ref() == b"text" {
                    let num = |n: &[u8]| attr(n).and_then(|v| v.parse().ok()).unwrap_or(0.0);
                    pending = Some((num(b"x"), num(b"y")));
                }
            }
            Ok(Event::Text(t)) => {
                if let Some((x, y)) = pending.take() {
                    texts.push((x, y, String::from_utf8_lossy(&t).into_owned()));
                }
            }
            Ok(Event::Eof) => break,
            Ok(_) => {}
            Err(e) => panic!("not well-formed: {e}"),
        }
    }
    (view, texts)
}

#[test]
fn charts_carry_their_labels_inside_the_view_box() {
    // Regression (charts judged from screenshots): a count axis and million-km ticks on the
    // histogram, the true-value label above the bars, graticule labels and a size key on the
    // map, tick labels without needless decimals on the convergence chart.
    let red = demo();
    let values: Vec<f64> = (0..200)
        .map(|k| 149.6e6 + 1.0e4 * f64::from(k - 100))
        .collect();
    let hist = transit_parallax::render::planning_charts::histogram_svg(
        &values,
        149_597_870.7,
        ("astronomical unit (million km)", 1e6),
        "AU from 200 campaigns",
    );
    let map = transit_parallax::render::charts::station_map_svg(&red);
    let disc = transit_parallax::render::charts::solar_disc_svg(&red);
    let grid = transit_parallax::planning::sites::sensitivity_grid(
        &red.event,
        transit_parallax::Contact::II,
        10.0,
    );
    let site = transit_parallax::Station::new("Ice Point", -77.8, 166.7, 20.0).unwrap();
    let plan_map = transit_parallax::render::planning_charts::sensitivity_map_svg(
        &grid,
        (10.0, 5.0),
        transit_parallax::Contact::II,
        (std::slice::from_ref(&site), &[0]),
        "test map",
    );
    assert!(
        plan_map.contains("<title>Ice Point (#1)</title>"),
        "the sites are plotted"
    );
    let conv = transit_parallax::render::charts::convergence_svg(&red);
    for (svg, needles) in [
        (&hist, vec!["campaigns", "true value", "million km", "150"]),
        (
            &map,
            vec!["60°N", "120°W", "area: share of the information", "20 %"],
        ),
        (
            &conv,
            vec!["Solar parallax (arcsec)", "logarithmic scale", "IAU 2009"],
        ),
        (&disc, vec!["100", "N", "E", "W"]),
        (
            &plan_map,
            vec!["30°N", "60°E", "Open triangles", "1 Ice Point"],
        ),
    ] {
        let ((w, h), texts) = text_positions(svg);
        for n in needles {
            assert!(texts.iter().any(|t| t.2.contains(n)), "label {n}");
        }
        for (x, y, t) in &texts {
            assert!(
                (0.0..=w).contains(x) && (0.0..=h).contains(y),
                "{t} at {x},{y}"
            );
            assert!(!t.ends_with(".000"), "needless decimals: {t}");
        }
    }
    // Every path drawn on the disc is numbered, and no two numbers overprint (boxes as the
    // label placer estimates them; tests/browser.rs measures them in Chromium).
    let chart = transit_parallax::render::charts::solar_disc_chart(&red);
    assert_eq!(chart.unnumbered, 0);
    let (_, texts) = text_positions(&disc);
    let numbers: Vec<&PlacedText> = texts
        .iter()
        .filter(|t| t.2.parse::<u32>().is_ok())
        .collect();
    assert_eq!(numbers.len(), chart.key.len(), "every station numbered");
    let used = red.stations.iter().filter(|s| s.not_used.is_none()).count();
    assert_eq!(chart.key.len(), used.min(40));
    use transit_parallax::render::labels::TextBox;
    let boxes: Vec<TextBox> = numbers
        .iter()
        .map(|t| TextBox::of_text(&t.2, 13.0, (t.0, t.1)))
        .collect();
    for (a, p) in boxes.iter().enumerate() {
        for q in &boxes[a + 1..] {
            assert!(!p.overlaps(q), "{p:?} and {q:?} overprint");
        }
    }
    // The true-value label sits above the plotting area, clear of the bars.
    let (_, texts) = text_positions(&hist);
    let label = texts.iter().find(|t| t.2 == "true value").unwrap();
    assert!(label.1 < 50.0, "{label:?}");
}

/// Residual chart: a timing off the scale is an arrow at the edge with its value (never a mark
/// clipped to the edge), crosses are drawn beneath the used timings, no two labels overprint
/// (as the placer estimates them), and the caption counts what it could not label or drew
/// only as a sample. Built from the demo's result with rejected rows added (a synthetic
/// result: the chart, not the reduction, is under test).
#[test]
fn residual_chart_draws_off_scale_timings_as_arrows_with_their_values() {
    use transit_parallax::observations::timings::{RejectReason, Rejected};
    use transit_parallax::render::figures::{residual_caption, Page};
    use transit_parallax::render::labels::TextBox;
    let mut red = demo();
    let rejected = |line: u64, contact: u8, o_c_s: f64| Rejected {
        line,
        station: format!("Added {line}"),
        contact: Some(contact),
        contact_label: None,
        reason: RejectReason::Outlier,
        diagnosis: None,
        o_c_s: Some(o_c_s),
    };
    red.rejected = vec![rejected(900, 2, 5000.0), rejected(901, 3, -3601.4)];
    // Many crosses crowded near zero in contact I: not every number finds room.
    red.rejected
        .extend((0..60).map(|k| rejected(1000 + k, 1, 30.0 + f64::from(k as u32) * 0.1)));
    let chart = transit_parallax::render::charts::residuals_chart(&red);
    assert_eq!(chart.off_scale, (2, 2), "both arrows carry their values");
    assert!(chart.svg.contains(">+5000 s<") && chart.svg.contains(">-3601 s<"));
    assert!(chart.limit_s < 3601.0);
    let (inside, numbered) = chart.numbered;
    assert_eq!(inside, 60);
    assert!(numbered > 0 && numbered < inside, "{numbered} of {inside}");
    let caption = residual_caption(&chart, Page::Report);
    assert!(
        caption.contains(&format!("{numbered} of {inside} are numbered")),
        "{caption}"
    );
    assert!(caption.contains("off the scale") && caption.contains("seconds"));
    // Crosses first, used timings after them, labels last.
    let first_used = chart.svg.find("fill=\"#1d4ed8\"").unwrap();
    let last_cross = chart.svg.rfind("stroke=\"#dc2626\"").unwrap();
    assert!(
        last_cross < first_used,
        "rejected marks drawn beneath the used ones"
    );
    let ((w, h), texts) = text_positions(&chart.svg);
    let labels: Vec<TextBox> = texts
        .iter()
        // The marks' labels, not the scale's ticks (written left of the plot, x < 64).
        .filter(|t| t.0 > 64.0 && (t.2.parse::<u32>().is_ok() || t.2.ends_with(" s")))
        .map(|t| TextBox::of_text(&t.2, 12.0, (t.0, t.1)))
        .collect();
    assert_eq!(labels.len(), numbered + 2);
    for (i, a) in labels.iter().enumerate() {
        assert!(
            a.x0 >= 0.0 && a.x1 <= w && a.y0 >= 0.0 && a.y1 <= h,
            "{a:?}"
        );
        for b in &labels[i + 1..] {
            assert!(!a.overlaps(b), "{a:?} overprints {b:?}");
        }
    }
}

/// Every chart of the report has a caption that names what is plotted and its units.
#[test]
fn every_chart_of_the_report_has_a_caption() {
    let html = html_report(&demo());
    let captions: Vec<&str> = html
        .split("<figcaption>")
        .skip(1)
        .map(|c| &c[..c.find("</figcaption>").unwrap()])
        .collect();
    assert_eq!(
        captions.len(),
        5,
        "disc, map, residuals, convergence, light curve"
    );
    for (caption, unit) in captions.iter().zip([
        "arcseconds",
        "degrees",
        "seconds",
        "arcseconds",
        "parts per million",
    ]) {
        assert!(caption.contains(unit), "{unit}: {caption}");
    }
    assert!(captions[0].contains("Key: 1 "), "the disc's key");
}
