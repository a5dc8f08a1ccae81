//! Helpers every renderer shares: output formats, rounding for JSON, CSV quoting, and the
//! solar-observing caution every observer-facing output carries.

/// The caution printed with every output meant for observers.
pub const SAFETY_CAUTION: &str = "CAUTION: looking at the Sun can blind. Never look at the Sun, \
even briefly or partly covered, without a certified solar filter on the front of the telescope \
or eye, or watch its image projected on a screen. Follow local guidance, the rules of your \
site and the directions of an experienced supervisor.";

/// Output formats.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Format {
    /// Aligned text for a terminal.
    Table,
    /// Comma-separated values with a header row.
    Csv,
    /// JSON.
    Json,
}

/// Round to a number of decimals (for JSON output).
pub fn round(x: f64, decimals: i32) -> f64 {
    let p = 10f64.powi(decimals);
    (x * p).round() / p
}

/// Quote a CSV field where it needs it.
pub fn csv_field(text: &str) -> String {
    if text.contains([',', '"', '\n', '\r']) {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}
