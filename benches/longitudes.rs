//! Speed of a reduction with a longitude unknown at every station: 2,000 stations of a
//! simulated Venus 2012 campaign, each with its own longitude correction (no prior), with
//! leave-one-station-out influence; once as `reduce` runs (the classic methods and the error
//! budget included) and once with the full solution alone. The per-station unknowns are
//! eliminated block by block, so the cost grows linearly with the stations. Figures are
//! recorded in docs/performance.md.

use criterion::{criterion_group, criterion_main, Criterion};
use rand::SeedableRng;
use transit_parallax::observations::longitude::LongitudeKnowledge;
use transit_parallax::planning::simulation::{
    global_stations, simulate_campaign, stations_seeing, SimulationSettings,
};
use transit_parallax::reduction::{reduce_for_event, ReduceOptions};
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
    let stations: Vec<_> = stations_seeing(&event, global_stations(9000, "l"), 3, 5.0)
        .into_iter()
        .take(2000)
        .collect();
    assert_eq!(stations.len(), 2000);
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(2000);
    let mut campaign =
        simulate_campaign(&event, &stations, &SimulationSettings::default(), &mut rng);
    for o in &mut campaign.observations.valid {
        o.longitude = LongitudeKnowledge::Unknown;
    }
    let n = campaign.observations.valid.len();
    let options = ReduceOptions {
        event: Some((Planet::Venus, event.date())),
        follow_convergence: false,
        ..ReduceOptions::default()
    };
    let mut g = c.benchmark_group("longitudes");
    g.sample_size(10);
    g.bench_function(
        format!("{n} timings, 2000 unknown longitudes, as reduce runs"),
        |b| {
            b.iter(|| {
                reduce_for_event(campaign.observations.clone(), event.clone(), &options).unwrap()
            })
        },
    );
    let alone = ReduceOptions {
        compare_methods: false,
        ..options
    };
    g.bench_function(
        format!("{n} timings, 2000 unknown longitudes, full solution alone"),
        |b| {
            b.iter(|| {
                reduce_for_event(campaign.observations.clone(), event.clone(), &alone).unwrap()
            })
        },
    );
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
