//! Stage 4, observations: from submitted files to timings the reduction can use.
//!
//! Takes CSV files as observers wrote them and gives validated timings, with every row that
//! cannot be used kept with its line, a reason and a sentence saying how to fix it.
//!
//! - `angles.rs`: latitudes and longitudes as records write them (sexagesimal, hours of time,
//!   other prime meridians).
//! - `csv_table.rs`: CSV reading with the line and column of every value.
//! - `local_time.rs`: readings in local apparent or mean solar time, converted to UT1.
//! - `contact_forms.rs`: pairs of contacts for timed intervals and how a contact was judged.
//! - `rows.rs`: one row of an observations file into one timing.
//! - `spreadsheet.rs`: the first sheet of an .xlsx or .ods file read as a table.
//! - `templates.rs`: blank stations and observations files with one commented example row.
//! - `readings.rs`: times and durations as written: Julian dates, ranges, times to the minute.
//! - `longitude.rs`: how well a station's longitude is known (`longitude_sigma_deg`).
//! - `timing_metadata.rs`: how a timing was made (clock source, instrument, aperture, viewing,
//!   notes), validated.
//! - `timings.rs`: reading and validating timings; rejected rows and their reasons.
pub mod angles;
pub mod contact_forms;
pub mod csv_table;
pub mod local_time;
pub mod longitude;
pub mod readings;
pub mod rows;
pub mod sheet_extent;
pub mod spreadsheet;
pub mod spreadsheet_cells;
pub mod templates;
pub mod timing_metadata;
pub mod timings;
