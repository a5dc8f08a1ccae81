//! Times contacts I-IV with circumstances for the 26 reference stations of
//! tests/reference/generate_contacts.py (Venus 2012), repeated; prints seconds per station.
//! Used by tools/compare_speed.sh.

use std::time::Instant;
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet, Station};

fn main() {
    let text = include_str!("../tests/reference/contacts_skyfield.csv");
    let mut stations: Vec<Station> = Vec::new();
    for line in text
        .lines()
        .skip(1)
        .filter(|l| l.starts_with("venus-2012-06-06"))
    {
        let f: Vec<&str> = line.split(',').collect();
        if f[3] == "geocentre" || stations.iter().any(|s| s.name == f[3]) {
            continue;
        }
        let num = |s: &str| s.parse::<f64>().unwrap_or(0.0);
        if let Ok(st) = Station::new(f[3], num(f[4]), num(f[5]), num(f[6])) {
            stations.push(st);
        }
    }
    let event = match transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap_or_default(),
        &TimeModel::fixed(66.184),
    ) {
        Ok(e) => e,
        Err(e) => {
            eprintln!("{e}");
            return;
        }
    };
    let geos: Vec<_> = stations.iter().map(Station::geocentric).collect();
    let reps = 20_000;
    let t0 = Instant::now();
    let mut n = 0usize;
    for _ in 0..reps {
        for g in &geos {
            n += event
                .predict_geocentric(std::hint::black_box(g))
                .iter()
                .flatten()
                .count();
        }
    }
    let per = t0.elapsed().as_secs_f64() / (reps * geos.len()) as f64;
    eprintln!("{} stations x {reps} repetitions, {n} contacts", geos.len());
    println!("{per:.9}");
}
