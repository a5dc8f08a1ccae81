//! The embedded demonstrations, run through the main job: by default an invented network of
//! school, club and observatory stations (fictional names) timing the transit of Venus of
//! 2012 June 5-6 in UTC; with `--scenario 1769`, invented expeditions timing the transit of
//! 1769 in local solar time with doubtful longitudes (`expeditions.rs`).

pub mod expeditions;

use crate::error::Result;
use crate::geometry::station::stations_from_table;
use crate::geometry::transit::{transit_on_date, TransitEvent};
use crate::observations::csv_table::CsvTable;
use crate::observations::timings::observations_from_table;
use crate::planning::simulation::{campaign_csv, simulate_campaign, SimulationSettings};
use crate::reduction::{reduce, ReduceOptions};
use crate::render::reduction::reduction_table;
use crate::time::scales::TimeModel;
use crate::Planet;
use rand::SeedableRng;
use std::path::Path;

/// The invented network's stations, embedded in the binary.
pub const DEMO_NETWORK_CSV: &str = include_str!("../data/demo_network.csv");

/// The demonstration campaign's timings, embedded in the binary (made by
/// [`generate_demo_campaign`]; a unit test checks that it still reproduces).
pub const DEMO_CAMPAIGN_CSV: &str = include_str!("../data/demo_campaign.csv");

/// Seed of the demonstration campaign.
pub const DEMO_SEED: u64 = 20_120_606;

fn demo_event() -> Result<TransitEvent> {
    let date = chrono::NaiveDate::from_ymd_opt(2012, 6, 6).unwrap_or_default();
    transit_on_date(Planet::Venus, date, &TimeModel::default())
}

/// The settings the demonstration campaign was simulated with: timings good to 20 s at the
/// exterior and 8 s at the interior contacts, a 6 s black drop, 4 % of timings with a blunder
/// and one station in twenty with its clock off by a minute.
pub fn demo_settings() -> SimulationSettings {
    SimulationSettings {
        sigma_s: [20.0, 8.0, 8.0, 20.0],
        black_drop_bias_s: 6.0,
        min_altitude_deg: 3.0,
        weather_loss: 0.1,
        blunder_rate: 0.04,
        clock_error_rate: 0.05,
        clock_error_s: 60.0,
    }
}

/// Simulate the demonstration campaign from the embedded network (deterministic).
pub fn generate_demo_campaign() -> Result<String> {
    let table = CsvTable::from_bytes(Path::new("<demo network>"), DEMO_NETWORK_CSV.as_bytes())?;
    let stations = stations_from_table(&table)?;
    let event = demo_event()?;
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(DEMO_SEED);
    let campaign = simulate_campaign(&event, &stations, &demo_settings(), &mut rng);
    let mut text = String::from(
        "# Simulated timings of an invented network (fictional stations) for the transit of Venus of\n\
         # 2012 June 5-6, made by transit-parallax's simulator (src/demo.rs, generate_demo_campaign).\n",
    );
    text.push_str(&campaign_csv(&campaign.observations));
    Ok(text)
}

/// An embedded demonstration.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Scenario {
    /// Schools, clubs and observatories timing the transit of 2012 in UTC (the default).
    Schools2012,
    /// Expeditions timing the transit of 1769 in local solar time, longitudes doubtful.
    Expeditions1769,
}

impl Scenario {
    /// Parse a scenario's name: `2012` (or `schools`) or `1769` (or `expeditions`).
    pub fn parse(text: &str) -> Option<Scenario> {
        match text.trim().to_ascii_lowercase().as_str() {
            "2012" | "schools" => Some(Scenario::Schools2012),
            "1769" | "expeditions" => Some(Scenario::Expeditions1769),
            _ => None,
        }
    }

    fn campaign(self) -> (&'static str, &'static str, chrono::NaiveDate) {
        match self {
            Scenario::Schools2012 => (
                "<demo campaign>",
                DEMO_CAMPAIGN_CSV,
                chrono::NaiveDate::from_ymd_opt(2012, 6, 6).unwrap_or_default(),
            ),
            Scenario::Expeditions1769 => (
                "<expeditions 1769>",
                expeditions::EXPEDITIONS_CAMPAIGN_CSV,
                expeditions::expeditions_date(),
            ),
        }
    }

    fn introduction(self) -> &'static str {
        match self {
            Scenario::Schools2012 => "Demonstration: an invented network of 32 school, club and observatory stations timed the\n\
                 transit of Venus of 2012 June 5-6 (simulated timings, with a few blunders and a black drop).\n\
                 The reduction below recovers the solar parallax and the astronomical unit from them.\n\n",
            Scenario::Expeditions1769 => "Historical-style demonstration: thirteen invented expeditions timed the transit of Venus of\n\
                 1769 June 3-4 as the 18th century recorded: clocks kept to local apparent or mean time (one to\n\
                 another station's meridian), days reckoned from noon, Old Style dates, longitudes from Paris or\n\
                 in hours of time, known exactly at six stations, to a quarter of a degree at five and not at all\n\
                 at two; three observers at one fort and two at two others, judging the interior contacts as the\n\
                 thread of light or the limbs touching; readings given as ranges; one post that timed only the\n\
                 interval between the interior contacts (simulated timings). The reduction solves for the\n\
                 parallax, every doubtful longitude and each judgement's lag, and sets Halley's and Delisle's\n\
                 methods beside the full solution.\n\n",
        }
    }

    /// The embedded campaign's timings as an observations file.
    pub fn campaign_csv(self) -> &'static str {
        self.campaign().1
    }
}

/// Reduce the embedded campaign, write its HTML report to `report_path` and return the printed
/// summary.
pub fn run_demo(report_path: &Path) -> Result<String> {
    run_scenario(Scenario::Schools2012, report_path)
}

/// Reduce one embedded campaign, write its HTML report to `report_path` and return the printed
/// summary.
pub fn run_scenario(scenario: Scenario, report_path: &Path) -> Result<String> {
    let (name, csv, date) = scenario.campaign();
    let table = CsvTable::from_bytes(Path::new(name), csv.as_bytes())?;
    let set = observations_from_table(&table, false)?;
    let options = ReduceOptions {
        event: Some((Planet::Venus, date)),
        ..ReduceOptions::default()
    };
    let red = reduce(set, &options)?;
    let mut out = String::from(scenario.introduction());
    out.push_str(&reduction_table(&red));
    crate::render::document::write_report(&red, report_path)?;
    out.push_str(&format!("\nreport written: {}\n", report_path.display()));
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_embedded_campaign_reproduces() {
        assert_eq!(generate_demo_campaign().unwrap(), DEMO_CAMPAIGN_CSV);
    }
}
