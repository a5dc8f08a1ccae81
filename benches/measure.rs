//! Time to measure one 2,000 x 2,000 image (the Sun 1,800 px across, Venus on it), on one core.

use criterion::{criterion_group, criterion_main, Criterion};
use std::path::Path;
use transit_parallax::images::{measure_disc, GreyImage};

/// A limb-darkened Sun (Cox 2000, section 14.7, u2 = 0.93, v2 = -0.23) with a dark disc,
/// edges integrated on a 4 x 4 grid, and a fixed pattern of +-1 % noise.
fn scene(side: usize) -> GreyImage {
    let (cx, cy, radius) = (1010.3, 987.6, 900.0);
    let (px, py, rp) = (cx + 410.0, cy - 260.0, 27.5);
    let value = |x: f64, y: f64| -> f64 {
        let r = (x - cx).hypot(y - cy);
        if r >= radius || (x - px).hypot(y - py) < rp {
            return 0.02;
        }
        let mu = (1.0 - (r / radius).powi(2)).max(0.0).sqrt();
        0.30 + 0.93 * mu - 0.23 * mu * mu
    };
    let mut pixels = Vec::with_capacity(side * side);
    let mut state = 12345u64;
    for y in 0..side {
        for x in 0..side {
            let mut sum = 0.0;
            for k in 0..16 {
                sum += value(
                    x as f64 + ((k % 4) as f64 - 1.5) / 4.0,
                    y as f64 + ((k / 4) as f64 - 1.5) / 4.0,
                );
            }
            state = state
                .wrapping_mul(6364136223846793005)
                .wrapping_add(1442695040888963407);
            let noise = ((state >> 33) as f64 / (1u64 << 31) as f64 - 0.5) * 0.02;
            pixels.push((sum / 16.0 + noise) as f32);
        }
    }
    GreyImage::new(side, side, pixels).expect("image")
}

fn bench(c: &mut Criterion) {
    let image = scene(2000);
    c.bench_function("measure_disc_2000x2000", |b| {
        b.iter(|| measure_disc(Path::new("bench.png"), &image).expect("measured"))
    });
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(10);
    targets = bench
}
criterion_main!(benches);
