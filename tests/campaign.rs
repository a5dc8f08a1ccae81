//! Campaign planning and simulation: the plan's numbers agree with the prediction core, the
//! chosen network follows the classical pairings, and the forecasts agree with Monte Carlo
//! campaigns reduced by the real reduction.

use std::path::Path;
use std::process::Command;
use transit_parallax::geometry::station::read_stations;
use transit_parallax::planning::simulation::{
    global_stations, monte_carlo, stations_seeing, SimulationSettings,
};
use transit_parallax::planning::sites::{plan, sensitivity_grid};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Contact, Planet, Station, TransitEvent};

fn venus_2012() -> TransitEvent {
    transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap(),
        &TimeModel::default(),
    )
    .unwrap()
}

fn candidates() -> Vec<Station> {
    read_stations(Path::new(concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/data/candidate_sites.csv"
    )))
    .unwrap()
}

#[test]
fn plan_agrees_with_the_prediction_core() {
    // The sensitivities are those of the prediction core, which tests/sensitivity.rs checks
    // against central differences of the full model (1 %); visibility follows the altitude.
    let ev = venus_2012();
    let sites = candidates();
    let p = plan(&ev, &sites, 10.0, 5.0, None);
    for (site, st) in p.sites.iter().zip(&sites) {
        let pred = ev.predict(st);
        for c in &site.contacts {
            let cc = pred.contacts[c.contact.index()].unwrap();
            assert_eq!(c.sensitivity_s_per_arcsec, cc.sensitivity_s_per_arcsec);
            assert_eq!(c.sun_altitude_deg, cc.sun_altitude_deg);
            assert_eq!(c.visible, cc.sun_altitude_deg >= 5.0);
        }
    }
}

#[test]
fn chosen_network_pairs_latitudes_and_its_forecast_matches_simulation() {
    let ev = venus_2012();
    let sites = candidates();
    let p = plan(&ev, &sites, 10.0, 5.0, Some(6));
    assert_eq!(p.chosen.len(), 6);
    let chosen: Vec<&Station> = p.chosen.iter().map(|&i| &sites[i]).collect();
    // Sites far apart in latitude on the daylit hemisphere: two chosen sites more than 60
    // degrees apart in latitude that both see ingress and egress with the Sun up.
    let both = |s: &Station| {
        let pr = ev.predict(s);
        let up = |c: Contact| pr.contacts[c.index()].is_some_and(|x| x.sun_altitude_deg >= 5.0);
        (up(Contact::I) || up(Contact::II)) && (up(Contact::III) || up(Contact::IV))
    };
    let lats: Vec<f64> = chosen
        .iter()
        .filter(|s| both(s))
        .map(|s| s.latitude_deg)
        .collect();
    let spread = lats.iter().cloned().fold(f64::MIN, f64::max)
        - lats.iter().cloned().fold(f64::MAX, f64::min);
    assert!(spread > 60.0, "latitude spread {spread}");
    assert!(p.reasons.iter().any(|r| r.contains("Halley")));
    // Requirement: forecast within 20 % of the scatter of simulated estimates.
    let forecast = p.chosen_sigma_arcsec.unwrap();
    let network: Vec<Station> = chosen.into_iter().cloned().collect();
    let settings = SimulationSettings {
        sigma_s: [10.0; 4],
        ..SimulationSettings::default()
    };
    let m = monte_carlo(&ev, &network, &settings, 400, 61, 2, &|| {});
    let pi = transit_parallax::sky::constants::nominal_parallax_arcsec();
    let scatter_km = m.au_scatter_km.expect("400 campaigns solved");
    let scatter_arcsec = scatter_km / transit_parallax::sky::constants::AU_KM * pi;
    assert!(
        (forecast / scatter_arcsec - 1.0).abs() < 0.20,
        "{forecast} vs {scatter_arcsec}"
    );
}

#[test]
fn forty_stations_forecast_and_coverage_over_1000_trials() {
    let ev = venus_2012();
    let net: Vec<Station> = stations_seeing(&ev, global_stations(400, "g"), 2, 5.0)
        .into_iter()
        .step_by(4)
        .take(40)
        .collect();
    assert_eq!(net.len(), 40);
    let settings = SimulationSettings {
        sigma_s: [10.0; 4],
        ..SimulationSettings::default()
    };
    let m = monte_carlo(&ev, &net, &settings, 1000, 2032, 2, &|| {});
    let (forecast, scatter, coverage) = (
        m.au_sigma_forecast_km.unwrap(),
        m.au_scatter_km.unwrap(),
        m.coverage_95.unwrap(),
    );
    eprintln!("forecast {forecast} scatter {scatter} coverage {coverage}");
    // Requirement: forecast sigma within 10 % of the simulated scatter; coverage 93-97 %.
    assert!((forecast / scatter - 1.0).abs() < 0.10);
    assert!((0.93..=0.97).contains(&coverage), "{coverage}");
    assert_eq!(m.solved, 1000);
    // A campaign that behaves as forecast gets no sentence of departure.
    assert!(
        m.departures(&settings, net.len()).is_empty(),
        "{:?}",
        m.departures(&settings, net.len())
    );
}

#[test]
fn simulation_is_reproducible_and_catches_blunders() {
    let ev = venus_2012();
    let net = candidates();
    let settings = SimulationSettings {
        sigma_s: [10.0; 4],
        blunder_rate: 0.05,
        clock_error_rate: 0.1,
        ..SimulationSettings::default()
    };
    let a = monte_carlo(&ev, &net, &settings, 40, 9, 2, &|| {});
    let b = monte_carlo(&ev, &net, &settings, 40, 9, 1, &|| {});
    assert_eq!(
        a.au_estimates_km.iter().sum::<f64>(),
        b.au_estimates_km.iter().sum::<f64>()
    );
    assert!(a.blunders_injected > 10);
    assert!(
        a.blunders_caught as f64 >= 0.8 * a.blunders_injected as f64,
        "{} of {}",
        a.blunders_caught,
        a.blunders_injected
    );
}

#[test]
fn the_sensitivity_grid_matches_predictions() {
    let ev = venus_2012();
    let grid = sensitivity_grid(&ev, Contact::II, 10.0);
    assert_eq!(grid.len(), 18 * 36);
    for p in grid.iter().step_by(37).filter(|p| p.hours.is_some()) {
        let st = Station::new("g", p.latitude_deg, p.longitude_deg, 0.0).unwrap();
        let c = ev.predict(&st).contacts[1].unwrap();
        assert!((c.sensitivity_s_per_arcsec - p.sensitivity_s_per_arcsec).abs() < 1e-9);
        assert!((c.sun_altitude_deg - p.sun_altitude_deg).abs() < 1e-9);
    }
}

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
}

#[test]
fn plan_and_simulate_commands_follow_the_interface() {
    let sites = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/data/candidate_sites.csv"
    );
    let o = bin()
        .args([
            "plan",
            "--planet",
            "venus",
            "--date",
            "2012-06-06",
            "--sites",
            sites,
            "--format",
            "csv",
        ])
        .output()
        .unwrap();
    assert!(o.status.success());
    let text = String::from_utf8_lossy(&o.stdout);
    assert!(text.starts_with("station,contact,time_utc,sun_altitude_deg,sensitivity_s_per_arcsec"));
    let o = bin()
        .args([
            "plan",
            "--planet",
            "venus",
            "--date",
            "2012-06-06",
            "--sites",
            sites,
            "--choose",
            "4",
            "--format",
            "json",
        ])
        .output()
        .unwrap();
    let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
    assert_eq!(v["chosen"].as_array().unwrap().len(), 4);
    assert!(v["forecast_parallax_sigma_arcsec"].as_f64().unwrap() > 0.0);
    let dir = std::env::temp_dir().join(format!("tp-plan-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let map = dir.join("map.svg");
    let grid = dir.join("grid.csv");
    let o = bin()
        .args([
            "plan",
            "--planet",
            "venus",
            "--date",
            "2012-06-06",
            "--sites",
            sites,
            "--contact",
            "2",
            "--grid-deg",
            "5",
        ])
        .arg("--map")
        .arg(&map)
        .arg("--grid-csv")
        .arg(&grid)
        .output()
        .unwrap();
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    assert!(std::fs::read_to_string(&map).unwrap().contains("<svg"));
    assert_eq!(
        std::fs::read_to_string(&grid).unwrap().lines().count(),
        1 + 36 * 72
    );
    let hist = dir.join("h.svg");
    let o = bin()
        .args([
            "simulate",
            "--planet",
            "venus",
            "--date",
            "2012-06-06",
            "--network",
            sites,
            "--trials",
            "30",
            "--seed",
            "3",
            "--format",
            "json",
        ])
        .arg("--histogram")
        .arg(&hist)
        .output()
        .unwrap();
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
    for key in [
        "trials",
        "au_sigma_forecast_km",
        "au_scatter_km",
        "coverage_95",
    ] {
        assert!(v.get(key).is_some(), "missing {key}");
    }
    assert!(std::fs::read_to_string(&hist).unwrap().contains("<svg"));
    let o = bin()
        .args([
            "simulate",
            "--planet",
            "venus",
            "--date",
            "2012-06-06",
            "--network",
            sites,
            "--trials",
            "0",
        ])
        .output()
        .unwrap();
    assert_eq!(o.status.code(), Some(2));
    let o = bin()
        .args([
            "simulate",
            "--planet",
            "venus",
            "--date",
            "2012-06-06",
            "--network",
            sites,
            "--blunder-rate",
            "2",
        ])
        .output()
        .unwrap();
    assert_eq!(o.status.code(), Some(2));
}
