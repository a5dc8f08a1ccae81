//! Speed of the prediction core: per-event setup, and contacts I-IV per station.
//! Figures are recorded in docs/performance.md.

use criterion::{black_box, criterion_group, criterion_main, Criterion};
use transit_parallax::geometry::besselian::Elements;
use transit_parallax::geometry::station::Station;
use transit_parallax::geometry::transit::TransitEvent;
use transit_parallax::sky::ephemeris::{geocentric_state, Planet};
use transit_parallax::time::scales::{TimeModel, Tt};

fn stations(n: usize) -> Vec<transit_parallax::geometry::station::GeocentricStation> {
    // A deterministic spread over the globe (golden-angle spiral).
    (0..n)
        .map(|i| {
            let f = (i as f64 + 0.5) / n as f64;
            let lat = (1.0 - 2.0 * f).asin().to_degrees();
            let lon = (i as f64 * 137.507_764_050_037_85) % 360.0 - 180.0;
            Station::new("s", lat, lon, 100.0).unwrap().geocentric()
        })
        .collect()
}

fn bench(c: &mut Criterion) {
    let model = TimeModel::default();
    let greatest = Tt::from_jd(2_456_084.562_2);
    c.bench_function("full model state (JPL series + IAU 2006/2000A)", |b| {
        b.iter(|| geocentric_state(Planet::Venus, black_box(greatest), &model))
    });
    let vsop87 = TimeModel {
        ephemeris: transit_parallax::sky::ephemeris::EphemerisChoice::Vsop87,
        ..TimeModel::default()
    };
    c.bench_function("full model state (VSOP87A + IAU 2006/2000A)", |b| {
        b.iter(|| geocentric_state(Planet::Venus, black_box(greatest), &vsop87))
    });
    c.bench_function(
        "event setup with VSOP87A (greatest transit search + elements)",
        |b| b.iter(|| TransitEvent::near(Planet::Venus, black_box(greatest), &vsop87)),
    );
    c.bench_function("event setup (elements fit)", |b| {
        b.iter(|| Elements::compute(Planet::Venus, black_box(greatest), &model))
    });
    c.bench_function("event setup (greatest transit search + elements)", |b| {
        b.iter(|| TransitEvent::near(Planet::Venus, black_box(greatest), &model))
    });
    let event = TransitEvent::near(Planet::Venus, greatest, &model).unwrap();
    let sts = stations(10_000);
    let mut g = c.benchmark_group("contacts I-IV");
    g.throughput(criterion::Throughput::Elements(sts.len() as u64));
    g.sample_size(20);
    g.bench_function("10000 stations, Venus 2012", |b| {
        b.iter(|| {
            let mut n = 0usize;
            for s in &sts {
                n += event
                    .predict_geocentric(black_box(s))
                    .iter()
                    .flatten()
                    .count();
            }
            n
        })
    });
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
