//! Speed of the reduction: a campaign of about 5,000 timings from 1,500 stations, with outlier
//! rejection, blunder diagnosis and leave-one-station-out influence for every station.
//! Figures are recorded in docs/performance.md.

use criterion::{criterion_group, criterion_main, Criterion};
use rand::SeedableRng;
use transit_parallax::planning::simulation::{
    global_stations, simulate_campaign, visible_contacts, SimulationSettings,
};
use transit_parallax::reduction::{reduce, ReduceOptions};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet};

fn bench(c: &mut Criterion) {
    let event = transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap(),
        &TimeModel::default(),
    )
    .unwrap();
    // Stations that see the most contacts first, to reach about 5,000 timings.
    let mut ranked: Vec<(usize, _)> = global_stations(6000, "b")
        .into_iter()
        .map(|s| (visible_contacts(&event, &s, 0.0), s))
        .collect();
    ranked.sort_by_key(|r| std::cmp::Reverse(r.0));
    let stations: Vec<_> = ranked.into_iter().map(|(_, s)| s).take(1500).collect();
    let settings = SimulationSettings {
        sigma_s: [20.0, 10.0, 10.0, 20.0],
        black_drop_bias_s: 5.0,
        blunder_rate: 0.01,
        min_altitude_deg: 0.0,
        ..SimulationSettings::default()
    };
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(5000);
    let campaign = simulate_campaign(&event, &stations, &settings, &mut rng);
    let n = campaign.observations.valid.len();
    // As `reduce` runs without --report: the convergence chart's partial solutions left out.
    let options = ReduceOptions {
        event: Some((Planet::Venus, event.date())),
        follow_convergence: false,
        ..ReduceOptions::default()
    };
    let mut g = c.benchmark_group("reduce");
    g.sample_size(10);
    g.bench_function(
        format!("{n} timings from {} stations", stations.len()),
        |b| b.iter(|| reduce(campaign.observations.clone(), &options).unwrap()),
    );
    // As `reduce --report FILE.html` runs: with the convergence chart, then the page.
    let with_report = ReduceOptions {
        follow_convergence: true,
        ..options
    };
    g.bench_function(format!("{n} timings, with the HTML report"), |b| {
        b.iter(|| {
            let red = reduce(campaign.observations.clone(), &with_report).unwrap();
            transit_parallax::render::document::html_report(&red).len()
        })
    });
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
