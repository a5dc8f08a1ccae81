//! Stage 7, rendering: every result as people and programs read it.
//!
//! Takes the results of the other stages and gives terminal tables, CSV, JSON, SVG charts and
//! the self-contained HTML and Markdown reports. Nothing here computes science.
//!
//! - `text.rs`: helpers every renderer shares (formats, rounding, CSV fields, the
//!   solar-observing caution).
//! - `prediction.rs`: `transits` and `predict` tables, CSV and JSON.
//! - `planning.rs`: `plan` and `simulate` tables, CSV and JSON; sensitivity grids.
//! - `reduction.rs`: `reduce` table and JSON.
//! - `charts.rs`: the SVG charts (solar disc, station map, residuals, convergence, sensitivity
//!   map, histogram) and escaping.
//! - `document.rs`: the HTML and Markdown reports.
pub mod charts;
pub mod document;
pub mod planning;
pub mod prediction;
pub mod reduction;
pub mod text;
