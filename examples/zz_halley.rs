use rand::SeedableRng;
use rand_chacha::ChaCha8Rng;
use transit_parallax::planning::historical::{record_historically, HistoricalStyle};
use transit_parallax::planning::simulation::*;
use transit_parallax::reduction::classic_methods::Method;
use transit_parallax::reduction::{reduce_for_event, ReduceOptions};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet};
fn main() {
    let args: Vec<String> = std::env::args().collect();
    let hist = args[1] == "hist";
    let bd: f64 = args[2].parse().unwrap();
    let lon_sigma: f64 = args[3].parse().unwrap();
    let model = TimeModel::default();
    let event = transit_on_date(Planet::Venus, parse_date("1769-06-03").unwrap(), &model).unwrap();
    let net: Vec<_> = stations_seeing(&event, global_stations(300, "exp"), 3, 5.0)
        .into_iter()
        .step_by(2)
        .take(30)
        .collect();
    let settings = SimulationSettings {
        sigma_s: [12.0, 9.0, 9.0, 12.0],
        black_drop_bias_s: bd,
        ..SimulationSettings::default()
    };
    let style = HistoricalStyle {
        longitude_sigma_deg: lon_sigma,
        unknown_longitudes: if args.len() > 4 {
            vec![(net[4].name.clone(), 1.2), (net[17].name.clone(), -1.8)]
        } else {
            vec![]
        },
        ..HistoricalStyle::default()
    };
    let mut f = vec![];
    let mut h = vec![];
    let mut d = vec![];
    for k in 0..200 {
        let mut rng = ChaCha8Rng::seed_from_u64(17_690 + k as u64);
        let camp = simulate_campaign(&event, &net, &settings, &mut rng);
        let mut camp = camp;
        if args[1] == "shift" {
            use rand::Rng;
            let mut shifts = std::collections::HashMap::new();
            for o in &mut camp.observations.valid {
                let s = *shifts
                    .entry(o.station.name.clone())
                    .or_insert_with(|| rng.gen_range(-60.0..60.0));
                o.time_label += chrono::TimeDelta::milliseconds((s * 1000.0) as i64);
            }
        }
        let obs = if hist {
            record_historically(camp, &style, &model, &mut rng).observations
        } else {
            camp.observations
        };
        let options = ReduceOptions {
            event: Some((Planet::Venus, event.date())),
            follow_convergence: false,
            ..ReduceOptions::default()
        };
        let red = reduce_for_event(obs, event.clone(), &options).unwrap();
        f.push((
            red.parallax_arcsec.unwrap(),
            red.parallax_sigma_arcsec.unwrap(),
        ));
        let m = red
            .methods
            .iter()
            .find(|m| m.method == Method::Halley)
            .unwrap();
        h.push((
            m.parallax_arcsec.unwrap_or(f64::NAN),
            m.parallax_sigma_arcsec.unwrap_or(f64::NAN),
        ));
        let m = red
            .methods
            .iter()
            .find(|m| m.method == Method::Delisle)
            .unwrap();
        if let Some(p) = m.parallax_arcsec {
            d.push((p, m.parallax_sigma_arcsec.unwrap()));
        }
    }
    for (name, v) in [("full", &f), ("halley", &h), ("delisle", &d)] {
        if v.is_empty() {
            continue;
        }
        let n = v.len() as f64;
        let mean = v.iter().map(|x| x.0).sum::<f64>() / n;
        let sc = (v.iter().map(|x| (x.0 - mean).powi(2)).sum::<f64>() / (n - 1.0)).sqrt();
        let sg = v.iter().map(|x| x.1).sum::<f64>() / n;
        println!(
            "{name}: mean {mean:.4} scatter {sc:.4} stated {sg:.4} ratio {:.3}",
            sg / sc
        );
    }
}
