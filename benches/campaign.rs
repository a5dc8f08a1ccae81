//! Speed of planning and simulation: a sensitivity map of one contact on a 0.5-degree grid, and
//! Monte Carlo campaigns of 100 stations reduced on two threads. Figures in docs/performance.md.

use criterion::{criterion_group, criterion_main, Criterion};
use transit_parallax::planning::simulation::{
    global_stations, monte_carlo, stations_seeing, SimulationSettings,
};
use transit_parallax::planning::sites::sensitivity_grid;
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Contact, Planet};

fn bench(c: &mut Criterion) {
    let event = transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap(),
        &TimeModel::default(),
    )
    .unwrap();
    let mut g = c.benchmark_group("planning");
    g.sample_size(10);
    g.bench_function(
        "sensitivity grid 0.5 deg (259,200 points), contact II",
        |b| b.iter(|| sensitivity_grid(&event, Contact::II, 0.5).len()),
    );
    let stations: Vec<_> = stations_seeing(&event, global_stations(800, "m"), 2, 5.0)
        .into_iter()
        .take(100)
        .collect();
    let settings = SimulationSettings {
        sigma_s: [10.0; 4],
        ..SimulationSettings::default()
    };
    g.bench_function("200 campaigns of 100 stations, 2 threads", |b| {
        b.iter(|| monte_carlo(&event, &stations, &settings, 200, 1, 2, &|| {}).solved)
    });
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
