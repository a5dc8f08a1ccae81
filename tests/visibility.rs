//! `transits --visibility-map` and `--visibility-grid` as a user runs them: the grid's columns
//! and rows, values in range and never NaN, the map a well-formed SVG, and the usage errors.

mod common;

use common::{err, out, run, temp};
use quick_xml::events::Event;
use quick_xml::Reader;

/// Run the binary for the Mercury transit of 2032 with these extra arguments.
fn mercury_2032(extra: &[&str]) -> std::process::Output {
    let mut args = vec!["transits", "--planet", "mercury", "--date", "2032-11-13"];
    args.extend_from_slice(extra);
    run(&args)
}

#[test]
fn the_grid_has_a_row_per_point_and_contact_with_values_in_range() {
    let path = temp("vis-grid.csv", b"");
    let o = mercury_2032(&["--visibility-grid", &path, "--grid-deg", "5"]);
    assert!(o.status.success(), "{}", err(&o));
    assert!(out(&o).contains("visibility grid written"), "{}", out(&o));
    let text = std::fs::read_to_string(&path).unwrap();
    assert!(!text.contains("NaN") && !text.contains("inf"));
    let mut rdr = csv::Reader::from_reader(text.as_bytes());
    let header: Vec<String> = rdr.headers().unwrap().iter().map(String::from).collect();
    // Source: the stable interface, /work/shared/interface.md ("the visibility map").
    assert_eq!(
        header[..5],
        [
            "latitude",
            "longitude",
            "contact",
            "time_utc",
            "sun_altitude_deg"
        ]
    );
    let rows: Vec<csv::StringRecord> = rdr.records().map(|r| r.unwrap()).collect();
    // Latitudes 90 to -90 every 5 degrees (37), longitudes -180 to 175 (72), four contacts.
    assert_eq!(rows.len(), 37 * 72 * 4);
    let mut seen = std::collections::HashSet::new();
    for r in &rows {
        let lat: f64 = r[0].parse().unwrap();
        let lon: f64 = r[1].parse().unwrap();
        let contact: u8 = r[2].parse().unwrap();
        assert!((-90.0..=90.0).contains(&lat) && (-180.0..180.0).contains(&lon));
        assert!((1..=4).contains(&contact));
        // Mercury 2032 is no grazing transit: every contact occurs everywhere.
        assert!(
            r[3].starts_with("2032-11-13T") && r[3].ends_with('Z'),
            "{r:?}"
        );
        let alt: f64 = r[4].parse().unwrap();
        assert!((-90.0..=90.0).contains(&alt));
        assert_eq!(&r[5] == "true", alt >= 0.0);
        seen.insert(r[6].to_string());
    }
    for class in ["whole", "ingress-only", "egress-only", "none"] {
        assert!(seen.contains(class), "no point sees {class}");
    }
}

/// Every element of an SVG well formed and balanced; the number of `<text>` elements.
fn check_xml(svg: &str) -> usize {
    let mut reader = Reader::from_str(svg);
    let (mut depth, mut texts) = (0i64, 0usize);
    loop {
        match reader.read_event() {
            Ok(Event::Start(e)) => {
                depth += 1;
                texts += usize::from(e.name().as_ref() == b"text");
            }
            Ok(Event::End(_)) => depth -= 1,
            Ok(Event::Eof) => break,
            Ok(_) => {}
            Err(e) => panic!("not well-formed XML: {e}"),
        }
    }
    assert_eq!(depth, 0, "unbalanced elements");
    texts
}

#[test]
fn the_map_is_well_formed_svg_with_legend_and_labels() {
    let path = temp("vis-map.svg", b"");
    let o = mercury_2032(&["--visibility-map", &path]);
    assert!(o.status.success(), "{}", err(&o));
    let svg = std::fs::read_to_string(&path).unwrap();
    assert!(!svg.contains("NaN"));
    let texts = check_xml(&svg);
    assert!(texts > 20, "{texts} texts");
    for words in [
        "whole transit seen",
        "ingress only",
        "egress only",
        "Sun on the horizon at contact I",
        "Natural Earth",
    ] {
        assert!(svg.contains(words), "legend lacks '{words}'");
    }
    // Lines of equal time labelled with the contact and the UTC time.
    assert!(svg.contains(">I 06:4"), "no label of contact I");
    assert!(svg.contains(">IV 11:0"), "no label of contact IV");
}

#[test]
fn a_distant_venus_transit_gives_a_time_or_an_empty_cell_never_nan() {
    // The transit of Venus of 2117 is no grazing one either; a coarse grid is enough to check
    // that a distant event renders and that no cell holds anything but a time or nothing.
    let path = temp("vis-venus.csv", b"");
    let o = run(&[
        "transits",
        "--planet",
        "venus",
        "--date",
        "2117-12-11",
        "--visibility-grid",
        &path,
        "--grid-deg",
        "10",
        "--format",
        "json",
    ]);
    assert!(o.status.success(), "{}", err(&o));
    assert!(!out(&o).contains("written"), "JSON output stays JSON");
    let text = std::fs::read_to_string(&path).unwrap();
    for line in text.lines().skip(1) {
        let f: Vec<&str> = line.split(',').collect();
        assert!(f[3].is_empty() || f[3].starts_with("2117-12-1"), "{line}");
        assert_eq!(f[3].is_empty(), f[4].is_empty(), "{line}");
    }
}

#[test]
fn a_map_without_a_date_is_a_usage_error_naming_the_date() {
    let o = run(&[
        "transits",
        "--planet",
        "mercury",
        "--from",
        "2030",
        "--to",
        "2040",
        "--visibility-map",
        "x.svg",
    ]);
    assert_eq!(o.status.code(), Some(2), "{}", err(&o));
    assert!(err(&o).contains("--date"), "{}", err(&o));
    let o = run(&["transits", "--planet", "mercury"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("--from") && err(&o).contains("--date"));
}

#[test]
fn a_grid_spacing_out_of_range_is_a_usage_error() {
    for bad in ["0", "-2", "45", "NaN"] {
        let o = mercury_2032(&["--visibility-grid", "x.csv", "--grid-deg", bad]);
        assert_eq!(o.status.code(), Some(2), "--grid-deg {bad}: {}", err(&o));
        assert!(err(&o).contains("--grid-deg"), "{}", err(&o));
    }
}

#[test]
fn the_years_listing_is_unchanged() {
    let o = run(&[
        "transits", "--planet", "mercury", "--from", "2030", "--to", "2040",
    ]);
    assert!(o.status.success());
    assert!(out(&o).contains("2032-11-13") && out(&o).contains("2039-11-07"));
}
