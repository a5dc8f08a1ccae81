//! Longitudes as unknowns (`longitude_sigma_deg`): a simulated network whose every longitude is
//! declared unknown still determines the parallax; stations whose timings cannot place them
//! are left out with a sentence, never used with the longitude given; nothing claims a zero
//! uncertainty.

mod common;

use common::{err, out, run, temp};
use rand::SeedableRng;
use transit_parallax::planning::simulation::{
    campaign_csv, global_stations, simulate_campaign, SimulationSettings,
};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet};

#[test]
fn every_longitude_unknown_still_determines_the_parallax() {
    let event = transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap(),
        &TimeModel::default(),
    )
    .unwrap();
    let stations = global_stations(400, "lon");
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(11);
    let camp = simulate_campaign(&event, &stations, &SimulationSettings::default(), &mut rng);
    // The simulator's own observations file, every longitude declared unknown.
    let text: String = campaign_csv(&camp.observations)
        .lines()
        .enumerate()
        .map(|(k, l)| {
            format!(
                "{l},{}\n",
                if k == 0 {
                    "longitude_sigma_deg"
                } else {
                    "unknown"
                }
            )
        })
        .collect();
    let path = temp("all_unknown.csv", text.as_bytes());
    let o = run(&["reduce", &path, "--format", "json"]);
    assert!(o.status.success(), "{}", err(&o));
    let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap();
    let (pi, sigma) = (
        v["parallax_arcsec"].as_f64().unwrap(),
        v["parallax_sigma_arcsec"].as_f64().unwrap(),
    );
    eprintln!("all longitudes unknown: {pi:.4} +- {sigma:.4}");
    // Truth: the simulation's parallax, that of the IAU 2012 au (8.794143").
    assert!(
        sigma > 0.0 && (pi - 8.794_143).abs() < 3.0 * sigma,
        "{pi} {sigma}"
    );
    let rejected = v["rejected"].as_array().unwrap();
    let left_out: Vec<_> = rejected
        .iter()
        .filter(|r| r["reason"] == "undetermined")
        .collect();
    for r in &left_out {
        assert!(
            r["diagnosis"]
                .as_str()
                .unwrap()
                .contains("longitude is unknown"),
            "{r}"
        );
    }
    for s in v["stations"].as_array().unwrap() {
        if let Some(x) = s["longitude_correction_sigma_deg"].as_f64() {
            assert!(x > 0.0, "{s}");
        }
    }
    eprintln!("{} timings left out as undetermined", left_out.len());
}
