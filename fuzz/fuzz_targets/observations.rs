//! Fuzz the observation reader: any bytes must give rows or a typed error, never a panic.
#![no_main]

use libfuzzer_sys::fuzz_target;
use std::path::Path;
use transit_parallax::observations::csv_table::CsvTable;
use transit_parallax::observations::timings::observations_from_table;

fuzz_target!(|data: &[u8]| {
    if let Ok(table) = CsvTable::from_bytes(Path::new("fuzz.csv"), data) {
        for strict in [false, true] {
            if let Ok(set) = observations_from_table(&table, strict) {
                assert_eq!(set.valid.len() + set.rejected.len(), set.rows_total);
            }
        }
    }
});
