//! Honest uncertainties: over many simulated campaigns (fixed seeds) the stated sigma of the
//! parallax must match the scatter of the estimates, and the 95 % intervals must cover the
//! truth about 95 % of the time (a well-designed estimator reaches the Cramer-Rao bound; common
//! practice for validating an uncertainty, no single source).

use rand::SeedableRng;
use rand_chacha::ChaCha8Rng;
use transit_parallax::planning::simulation::{
    global_stations, simulate_campaign, stations_seeing, SimulationSettings,
};
use transit_parallax::reduction::{reduce_for_event, ReduceOptions};
use transit_parallax::sky::constants::nominal_parallax_arcsec;
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet, Station, TransitEvent};

fn network(event: &TransitEvent, n: usize, min_alt: f64) -> Vec<Station> {
    stations_seeing(event, global_stations(400, "st"), 2, min_alt)
        .into_iter()
        .step_by(3)
        .take(n)
        .collect()
}

struct Summary {
    trials: usize,
    mean_sigma: f64,
    scatter: f64,
    coverage: f64,
}

fn monte_carlo(
    planet: Planet,
    date: &str,
    stations: usize,
    trials: usize,
    settings: SimulationSettings,
    seed: u64,
) -> Summary {
    let event = transit_on_date(planet, parse_date(date).unwrap(), &TimeModel::default()).unwrap();
    let net = network(&event, stations, settings.min_altitude_deg);
    assert_eq!(net.len(), stations);
    let truth = nominal_parallax_arcsec();
    let run = |range: std::ops::Range<usize>| -> Vec<(f64, f64, bool)> {
        range
            .map(|k| {
                let mut rng = ChaCha8Rng::seed_from_u64(seed + k as u64);
                let camp = simulate_campaign(&event, &net, &settings, &mut rng);
                let options = ReduceOptions {
                    event: Some((planet, event.date())),
                    ..ReduceOptions::default()
                };
                let red = reduce_for_event(camp.observations, event.clone(), &options).unwrap();
                let (lo, hi) = red.parallax_interval_95.unwrap();
                (
                    red.parallax_arcsec.unwrap(),
                    red.parallax_sigma_arcsec.unwrap(),
                    lo <= truth && truth <= hi,
                )
            })
            .collect()
    };
    let half = trials / 2;
    let results: Vec<(f64, f64, bool)> = std::thread::scope(|s| {
        let a = s.spawn(|| run(0..half));
        let b = s.spawn(|| run(half..trials));
        let mut v = a.join().unwrap();
        v.extend(b.join().unwrap());
        v
    });
    let n = results.len() as f64;
    let mean = results.iter().map(|r| r.0).sum::<f64>() / n;
    let scatter = (results.iter().map(|r| (r.0 - mean).powi(2)).sum::<f64>() / (n - 1.0)).sqrt();
    let mean_sigma = results.iter().map(|r| r.1).sum::<f64>() / n;
    let coverage = results.iter().filter(|r| r.2).count() as f64 / n;
    eprintln!("{planet} {date}: {trials} trials, mean stated sigma {mean_sigma:.5}\", scatter {scatter:.5}\", coverage {coverage:.3}, mean {mean:.5}\"");
    Summary {
        trials,
        mean_sigma,
        scatter,
        coverage,
    }
}

#[test]
fn stated_sigma_matches_scatter_and_intervals_cover_venus_2012() {
    let settings = SimulationSettings {
        sigma_s: [10.0; 4],
        black_drop_bias_s: 6.0,
        ..SimulationSettings::default()
    };
    let s = monte_carlo(Planet::Venus, "2012-06-06", 40, 600, settings, 20_120_606);
    assert!(s.trials >= 500);
    // Requirement: stated sigma within 10 % of the scatter; coverage 93-97 %.
    assert!(
        (s.mean_sigma / s.scatter - 1.0).abs() < 0.10,
        "{} vs {}",
        s.mean_sigma,
        s.scatter
    );
    assert!(
        (0.93..=0.97).contains(&s.coverage),
        "coverage {}",
        s.coverage
    );
}
