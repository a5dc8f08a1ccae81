//! Where the time of `predict` goes for a 1-degree grid of 64,800 stations: reading the
//! stations file, setting up the event, the contacts, and writing the CSV, each timed in one
//! process. Compare with the whole command timed with `time` (docs/performance.md).
//!
//! `cargo run --release --example predict_phases` (writes the grid to the temporary folder).

use std::fmt::Write;
use std::time::Instant;
use transit_parallax::geometry::station::read_stations;
use transit_parallax::render::station_predictions::{predictions_csv, Clocks};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet};

fn main() -> Result<(), Box<dyn std::error::Error>> {
    let mut grid = String::from("station,latitude,longitude,elevation_m\n");
    for i in 0..180 {
        for j in 0..360 {
            let _ = writeln!(
                grid,
                "g{i}-{j},{},{},0",
                -89.5 + f64::from(i),
                -179.5 + f64::from(j)
            );
        }
    }
    let path = std::env::temp_dir().join("transit-parallax-grid-1deg.csv");
    std::fs::write(&path, grid)?;
    let t0 = Instant::now();
    let stations = read_stations(&path)?;
    let t1 = Instant::now();
    let event = transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06")?,
        &TimeModel::default(),
    )?;
    let t2 = Instant::now();
    let predictions: Vec<_> = stations.iter().map(|s| event.predict(s)).collect();
    let t3 = Instant::now();
    let csv = predictions_csv(&event, &predictions, Clocks::default());
    let t4 = Instant::now();
    let ms = |a: Instant, b: Instant| (b - a).as_secs_f64() * 1e3;
    println!(
        "stations file ({} stations) written to {}",
        stations.len(),
        path.display()
    );
    println!("read the stations   {:7.1} ms", ms(t0, t1));
    println!("event setup         {:7.1} ms", ms(t1, t2));
    println!("contacts I-IV       {:7.1} ms", ms(t2, t3));
    println!(
        "CSV ({:.1} MB)      {:7.1} ms",
        csv.len() as f64 / 1e6,
        ms(t3, t4)
    );
    Ok(())
}
