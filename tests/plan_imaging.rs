//! Planning with images: `plan --positions-every SECONDS --sigma-solar-radii X` forecasts the
//! parallax from measured positions on the disc beside the contacts, and says which way of
//! measuring does better. The forecast is the information of the condition equations (each
//! position's partials from `geometry::disc_position`, checked against Skyfield in
//! tests/reference_positions.rs); here: its scaling laws (independent measurements: the
//! variance goes as sigma^2 and as the cadence), the comparison, and the refusals.

mod common;

use common::{err, out, plan_venus_2012};
use serde_json::Value;

fn plan_json(extra: &[&str]) -> Value {
    let mut args = vec!["--format", "json"];
    args.extend_from_slice(extra);
    let o = plan_venus_2012(&args);
    assert!(o.status.success(), "{}", err(&o));
    serde_json::from_str(&out(&o)).unwrap()
}

fn by_method(v: &Value, key: &str) -> f64 {
    v["forecast_by_method"][key].as_f64().unwrap_or_else(|| {
        panic!("{key} not determined: {}", v["forecast_by_method"]);
    })
}

#[test]
fn positions_forecast_scales_as_independent_measurements() {
    let base = plan_json(&["--positions-every", "60", "--sigma-solar-radii", "0.001"]);
    let finer = plan_json(&["--positions-every", "60", "--sigma-solar-radii", "0.0005"]);
    let faster = plan_json(&["--positions-every", "15", "--sigma-solar-radii", "0.001"]);
    let p = by_method(&base, "positions_sigma_arcsec");
    // Half the uncertainty of each image: half the forecast.
    let r = by_method(&finer, "positions_sigma_arcsec") / p;
    assert!((r - 0.5).abs() < 1e-6, "{r}");
    // Four times the images (independent): half the forecast, to the edges of the windows.
    let r = by_method(&faster, "positions_sigma_arcsec") / p;
    assert!((r - 0.5).abs() < 0.01, "{r}");
    assert_eq!(base["measure"], "both");
    assert_eq!(base["forecast_by_method"]["sites"], "every site");
    // Both together do at least as well as either alone.
    let both = by_method(&base, "both_sigma_arcsec");
    assert!(both <= p && both <= by_method(&base, "contacts_sigma_arcsec"));
    // The contacts alone are the plan without images.
    let plain = plan_json(&[]);
    let c = plain["forecast_all_sites_sigma_arcsec"].as_f64().unwrap();
    assert!((by_method(&base, "contacts_sigma_arcsec") - c).abs() < 1e-9);
    // Without images the plan's output is as it always was.
    assert!(plain.get("forecast_by_method").is_none() && plain.get("measure").is_none());
    assert!(plain["sites"][0].get("images").is_none());
    // Every site that sees the planet wholly on the disc with the Sun up has images.
    let sites = base["sites"].as_array().unwrap();
    assert!(sites.iter().any(|s| s["images"].as_u64().unwrap() > 100));
    for s in sites {
        if s["images"].as_u64().unwrap() > 0 {
            assert!(s["images_from_utc"].as_str().unwrap() < s["images_to_utc"].as_str().unwrap());
        }
    }
}

/// Choosing for positions picks sites that image, and its forecast is the chosen sites'
/// positions alone.
#[test]
fn sites_chosen_for_their_images() {
    let v = plan_json(&[
        "--positions-every",
        "60",
        "--sigma-solar-radii",
        "0.001",
        "--measure",
        "positions",
        "--choose",
        "4",
    ]);
    assert_eq!(v["measure"], "positions");
    assert_eq!(v["forecast_by_method"]["sites"], "chosen");
    let chosen = v["forecast_parallax_sigma_arcsec"].as_f64().unwrap();
    assert!((chosen - by_method(&v, "positions_sigma_arcsec")).abs() < 1e-9);
    let names: Vec<&str> = v["chosen"]
        .as_array()
        .unwrap()
        .iter()
        .map(|n| n.as_str().unwrap())
        .collect();
    for s in v["sites"].as_array().unwrap() {
        if names.contains(&s["station"].as_str().unwrap()) {
            assert!(s["images"].as_u64().unwrap() > 0, "{s}");
        }
    }
}

#[test]
fn the_table_compares_the_ways_of_measuring_and_carries_the_caution() {
    let o = plan_venus_2012(&["--positions-every", "60", "--sigma-solar-radii", "0.001"]);
    assert!(o.status.success(), "{}", err(&o));
    let text = out(&o);
    assert!(text.contains("an image every 60 s"), "{text}");
    assert!(text.contains("positions alone  parallax +- "), "{text}");
    assert!(text.contains("images: "), "{text}");
    assert!(text.contains("certified solar filter"));
}

#[test]
fn images_half_described_or_wrongly_are_refused() {
    let o = plan_venus_2012(&["--positions-every", "60"]);
    assert!(!o.status.success());
    assert!(err(&o).contains("--sigma-solar-radii"), "{}", err(&o));
    let o = plan_venus_2012(&["--measure", "positions"]);
    assert!(!o.status.success());
    assert!(err(&o).contains("--positions-every"), "{}", err(&o));
    let o = plan_venus_2012(&[
        "--measure",
        "photos",
        "--positions-every",
        "60",
        "--sigma-solar-radii",
        "0.001",
    ]);
    assert!(
        err(&o).contains("give contacts, positions or both"),
        "{}",
        err(&o)
    );
    for bad in [["0", "0.001"], ["60", "0"], ["60", "-1"], ["nan", "0.001"]] {
        let o = plan_venus_2012(&["--positions-every", bad[0], "--sigma-solar-radii", bad[1]]);
        assert!(!o.status.success(), "{bad:?}");
        assert!(!err(&o).contains("panicked"), "{}", err(&o));
    }
}
