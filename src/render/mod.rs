//! Stage 7, rendering: every result as people and programs read it.
//!
//! Takes the results of the other stages and gives terminal tables, CSV, JSON, SVG charts and
//! the self-contained HTML and Markdown reports. Nothing here computes science.
//!
//! - `text.rs`: helpers every renderer shares (formats, rounding, CSV fields, the
//!   solar-observing caution).
//! - `prediction.rs`: `transits` table, CSV and JSON.
//! - `station_predictions.rs`: `predict` table, CSV and JSON, with local solar and civil time.
//! - `planning.rs`: `plan` and `simulate` tables, CSV and JSON; sensitivity grids.
//! - `reduction.rs`: `reduce` table and JSON.
//! - `reduction_json.rs`: the JSON's per-station and per-row arrays written straight from the reduction (the service's solution at 100,000 timings).
//! - `svg.rs`: what every chart shares: escaping, the SVG opening, ticks, land outlines and
//!   graticule labels.
//! - `labels.rs`: labels placed beside their marks where they fit, captions wrapped to a
//!   chart's width.
//! - `axes.rs`: what the reduction's charts share: text sizes, round clock-time and
//!   logarithmic ticks, the arrow for a value off the scale.
//! - `charts.rs`: the station map; re-exports the reduction's other charts.
//! - `disc_chart.rs`: the solar disc with every station's path, numbered with leader lines.
//! - `residual_chart.rs`: O - C by contact, rejected timings beneath, arrows off the scale.
//! - `convergence_chart.rs`: the parallax zoomed on its final value, the uncertainty on a
//!   logarithmic scale.
//! - `figures.rs`: the charts as figures with captions and keys, for the report and the
//!   service's organiser page.
//! - `planning_charts.rs`: the sensitivity map and the histogram of simulated AU estimates.
//! - `visibility_map.rs`: the visibility map of a transit and its grid as CSV.
//! - `contours.rs`: contour lines of a gridded field (marching squares).
//! - `methods.rs`: the classic methods side by side and the error budget, for the table and
//!   the reports.
//! - `light_curve_chart.rs`: the light curve of a transit as CSV and SVG.
//! - `what_else.rs`: the scale of the Solar System, the sizes and the transit's depth.
//! - `observer_sheet.rs`: one printable page per station for its observers.
//! - `sheet_limb.rs`: the solar disc with each contact's place on the limb, for the sheet.
//! - `path_on_disc.rs`: the planet's path across the disc seen from a station, with a
//!   participant's timings placed on it (the service's feedback page).
//! - `sheet_calendar.rs`: each station's contacts as an RFC 5545 calendar.
//! - `sheet_files.rs`: the sheets and calendars written to a folder, names made safe.
//! - `sheet_words.rs`: the sheet's and calendar's words, numbers and date in its language.
//! - `document.rs`: the HTML and Markdown reports.
//! - `residual_groups.rs`: the residuals by clock source and aperture class, for the JSON,
//!   the reports and the organiser's page.
//! - `report_sections.rs`: the reports' sections on the classic methods, the error budget and
//!   what else the timings measure.
pub mod axes;
pub mod charts;
pub mod contours;
pub mod convergence_chart;
pub mod disc_chart;
pub mod document;
pub mod figures;
pub mod labels;
pub mod light_curve_chart;
pub mod methods;
pub mod observer_sheet;
pub mod path_on_disc;
pub mod planning;
pub mod planning_charts;
pub mod prediction;
pub mod reduction;
pub mod reduction_json;
pub mod report_sections;
pub mod residual_chart;
pub mod residual_groups;
pub mod sheet_calendar;
pub mod sheet_files;
pub mod sheet_limb;
pub mod sheet_words;
pub mod station_predictions;
pub mod svg;
pub mod text;
pub mod visibility_map;
pub mod what_else;
