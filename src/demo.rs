//! The embedded demonstration: an invented network of stations (fictional names) on a real
//! event, run through the main job.

use crate::csvinput::CsvTable;
use crate::error::Result;
use crate::output::predictions_table;
use crate::station::stations_from_table;
use crate::timescale::TimeModel;
use crate::transit::transit_on_date;
use crate::Planet;
use std::path::Path;

/// The invented network's stations file, embedded in the binary.
pub const DEMO_STATIONS_CSV: &str = include_str!("data/demo_stations.csv");

/// Predict the invented network's contacts for the transit of Mercury of 2032 November 13
/// and return the printed report.
pub fn run_demo() -> Result<String> {
    let table = CsvTable::from_bytes(Path::new("<demo stations>"), DEMO_STATIONS_CSV.as_bytes())?;
    let stations = stations_from_table(&table)?;
    let date = chrono::NaiveDate::from_ymd_opt(2032, 11, 13).unwrap_or_default();
    let event = transit_on_date(Planet::Mercury, date, &TimeModel::default())?;
    let predictions: Vec<_> = stations.iter().map(|s| event.predict(s)).collect();
    let mut out = String::from(
        "Demonstration: contact predictions for an invented network of 15 stations\n\
         (transit of Mercury, 2032 November 13).\n\n",
    );
    out.push_str(&predictions_table(&event, &predictions));
    Ok(out)
}
