//! The historical-style demonstration: an invented network of expeditions (fictional names)
//! timing the real transit of Venus of 1769 June 3-4 with clocks kept to local apparent or
//! mean time, some in astronomical day reckoning, their longitudes known to about a quarter
//! of a degree, and two stations whose longitude is unknown. Simulated with the library's own
//! simulator and recorded with `planning::historical`.

use crate::error::Result;
use crate::geometry::station::stations_from_table;
use crate::geometry::transit::{transit_on_date, TransitEvent};
use crate::observations::csv_table::CsvTable;
use crate::planning::historical::{record_historically, HistoricalStyle};
use crate::planning::simulation::{campaign_csv, simulate_campaign, SimulationSettings};
use crate::time::scales::TimeModel;
use crate::Planet;
use rand::SeedableRng;
use std::path::Path;

/// The expeditions' stations, embedded in the binary.
pub const EXPEDITIONS_NETWORK_CSV: &str = include_str!("../data/expeditions_1769_network.csv");

/// The expeditions' timings, embedded in the binary (made by [`generate_expeditions_campaign`];
/// a unit test checks that it still reproduces).
pub const EXPEDITIONS_CAMPAIGN_CSV: &str = include_str!("../data/expeditions_1769_campaign.csv");

/// Seed of the expeditions' campaign.
pub const EXPEDITIONS_SEED: u64 = 17_690_603;

/// The transit of 1769 (greatest transit June 3, 22:25 UT1).
pub fn expeditions_date() -> chrono::NaiveDate {
    chrono::NaiveDate::from_ymd_opt(1769, 6, 3).unwrap_or_default()
}

fn expeditions_event() -> Result<TransitEvent> {
    transit_on_date(Planet::Venus, expeditions_date(), &TimeModel::default())
}

/// Timings good to 12 s at the exterior and 9 s at the interior contacts, a 10 s black drop,
/// no blunders: an 18th-century expedition's pendulum clock and telescope (a round figure of
/// ours; the reductions of the time quote scatters of this size, from memory).
pub fn expeditions_settings() -> SimulationSettings {
    SimulationSettings {
        sigma_s: [12.0, 9.0, 9.0, 12.0],
        black_drop_bias_s: 10.0,
        min_altitude_deg: 3.0,
        ..SimulationSettings::default()
    }
}

/// Longitudes recorded to 0.25 degree; six stations at established observatories and trading
/// posts whose longitudes are known exactly; two stations recorded as of unknown longitude,
/// their written longitudes 1.6 degrees east and 2.1 degrees west of the truth.
pub fn expeditions_style() -> HistoricalStyle {
    HistoricalStyle {
        longitude_sigma_deg: 0.25,
        unknown_longitudes: vec![
            ("Volcano Harbour".into(), 1.6),
            ("Sandalwood Bay".into(), -2.1),
        ],
        exact_longitudes: [
            "Quaker River House",
            "Harbour Hill College",
            "Neva Island Academy",
            "Ice Bay Factory",
            "Lantern Mission",
            "Ural Ironworks",
        ]
        .map(String::from)
        .to_vec(),
        apparent_share: 0.5,
        astronomical_share: 0.4,
    }
}

/// Simulate and record the expeditions' campaign from the embedded network (deterministic).
pub fn generate_expeditions_campaign() -> Result<String> {
    let table = CsvTable::from_bytes(
        Path::new("<expeditions network>"),
        EXPEDITIONS_NETWORK_CSV.as_bytes(),
    )?;
    let stations = stations_from_table(&table)?;
    let event = expeditions_event()?;
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(EXPEDITIONS_SEED);
    let campaign = simulate_campaign(&event, &stations, &expeditions_settings(), &mut rng);
    let recorded =
        record_historically(campaign, &expeditions_style(), event.time_model(), &mut rng);
    let mut text = String::from(
        "# Simulated timings of an invented network of expeditions (fictional stations) for the transit\n\
         # of Venus of 1769 June 3-4, as recorded: local apparent or mean time, some days reckoned from\n\
         # noon, longitudes doubtful or unknown. Made by transit-parallax's simulator\n\
         # (src/demo/expeditions.rs, generate_expeditions_campaign).\n",
    );
    text.push_str(&campaign_csv(&recorded.observations));
    Ok(text)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_embedded_campaign_reproduces() {
        assert_eq!(
            generate_expeditions_campaign().unwrap(),
            EXPEDITIONS_CAMPAIGN_CSV
        );
    }
}
