//! Write a large simulated campaign (Venus 2012, stations spread over the globe, 1 %
//! blunders) as an observations CSV on standard output, for timing whole commands:
//!
//! ```sh
//! cargo run --release --example big_campaign -- 13000 > /tmp/big.csv   # about 50,000 rows
//! time target/release/transit-parallax reduce /tmp/big.csv --report /tmp/big.html
//! ```
use rand::SeedableRng;
use transit_parallax::planning::simulation::{
    campaign_csv, global_stations, simulate_campaign, SimulationSettings,
};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet};

fn main() {
    let n: usize = std::env::args()
        .nth(1)
        .and_then(|a| a.parse().ok())
        .unwrap_or(13_000);
    let date = parse_date("2012-06-06").expect("a date");
    let event = transit_on_date(Planet::Venus, date, &TimeModel::default()).expect("the event");
    let settings = SimulationSettings {
        sigma_s: [20.0, 10.0, 10.0, 20.0],
        black_drop_bias_s: 5.0,
        blunder_rate: 0.01,
        min_altitude_deg: 0.0,
        ..SimulationSettings::default()
    };
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(50_000);
    let campaign = simulate_campaign(&event, &global_stations(n, "s"), &settings, &mut rng);
    print!("{}", campaign_csv(&campaign.observations));
}
