//! Helpers every renderer shares: output formats, rounding for JSON, CSV quoting, and the
//! solar-observing caution every observer-facing output carries.

use crate::reduction::Headline;
use crate::time::iso::push_digits;

/// The caution printed with every output meant for observers.
pub const SAFETY_CAUTION: &str = "CAUTION: looking at the Sun can blind. Never look at the Sun, \
even briefly or partly covered, without a certified solar filter on the front of the telescope \
or eye, or watch its image projected on a screen. Never look through an optical finder: cap it \
or take it off. Follow local guidance, the rules of your site and the directions of an \
experienced supervisor.";

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

/// Quote a CSV field where it needs it (a field that starts with `#` too: the reader takes a
/// line beginning with it for a comment).
pub fn csv_field(text: &str) -> String {
    if text.contains([',', '"', '\n', '\r']) || text.starts_with('#') {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}

/// A clock label for people: ISO 8601 with a trailing `Z` from 1972 (UTC), and with ` UT1`
/// instead before 1972, when the labels are mean solar time at Greenwich (machine-readable
/// outputs keep the `Z` of the stable interface).
pub fn clock_label(label: chrono::NaiveDateTime, decimals: u32) -> String {
    let text = crate::time::iso::format_utc(label, decimals);
    if chrono::Datelike::year(&label) >= 1972 {
        text
    } else {
        format!("{} UT1", text.trim_end_matches('Z'))
    }
}

/// The scale of the labels of an event, for column headers: `UTC` or `UT1`.
pub fn scale_of(label: chrono::NaiveDateTime) -> &'static str {
    if chrono::Datelike::year(&label) >= 1972 {
        "UTC"
    } else {
        "UT1"
    }
}

/// A number with `decimals` digits after the point, as `format!("{x:.decimals$}")` writes
/// it, but by integer arithmetic where the scaled value fits (the exact decimal expansion
/// behind `{:.N}` dominated the output of `predict` for tens of thousands of stations).
pub fn fixed(x: f64, decimals: usize) -> String {
    let mut s = String::with_capacity(16);
    push_fixed(&mut s, x, decimals);
    s
}

/// Append `x` as [`fixed`] writes it, without allocating.
pub fn push_fixed(out: &mut String, x: f64, decimals: usize) {
    let d = decimals.min(9);
    let p = 10f64.powi(d as i32);
    let raw = x * p;
    let scaled = raw.round();
    // Near a tie the product's rounding error could decide it: leave those (and huge values)
    // to the exact formatting, which rounds ties to even.
    if !scaled.is_finite()
        || scaled.abs() >= 9.0e15
        || ((raw - raw.trunc()).abs() - 0.5).abs() < 1e-6
    {
        use std::fmt::Write;
        let _ = write!(out, "{x:.decimals$}");
        return;
    }
    let v = scaled.abs() as u64;
    let ip = 10u64.pow(d as u32);
    if x.is_sign_negative() {
        out.push('-');
    }
    push_digits(out, v / ip, 1);
    if d > 0 {
        out.push('.');
        push_digits(out, v % ip, d);
    }
}

/// Append `text` right-aligned in `width` characters, as `format!("{text:>width$}")` does.
pub fn push_right(out: &mut String, text: &str, width: usize) {
    for _ in text.chars().count()..width {
        out.push(' ');
    }
    out.push_str(text);
}

/// Decimals that show a value to about three significant digits of its uncertainty.
pub fn decimals_for(sigma: f64) -> usize {
    if !(sigma.is_finite() && sigma > 0.0) {
        return 2;
    }
    (2.0 - sigma.log10().floor()).clamp(0.0, 6.0) as usize
}

/// The AU of a headline in millions of km, with its uncertainty and 95 % interval, e.g.
/// `148.76 +- 1.09 million km (95 %: 146.64 to 150.94 million km)`; `pm` is the plus-minus
/// sign to use. Full precision stays in the JSON.
pub fn au_text(h: &Headline, pm: &str) -> String {
    let Some(au) = h.au else {
        return "not given: the parallax's one-sigma range reaches zero, so the timings set no upper bound on it".to_string();
    };
    let m = 1e-6;
    let d = decimals_for(au.au_sigma_km * m);
    let (lo, hi) = au.au_interval_95_km;
    let interval = match hi {
        Some(hi) => format!("95 %: {:.d$} to {:.d$} million km", lo * m, hi * m),
        None => format!("95 %: from {:.d$} million km, unbounded above", lo * m),
    };
    format!(
        "{:.d$} {pm} {:.d$} million km ({interval})",
        au.au_km * m,
        au.au_sigma_km * m
    )
}

/// A length in km to about three significant digits, for an uncertainty: `1.39 million km`
/// from a million up, `382,000 km` or `1,090 km` below (the digits past the third would
/// claim a precision the forecast does not have).
pub fn km_to_three_digits(km: f64) -> String {
    if !km.is_finite() {
        return "not determined".into();
    }
    if km.abs() >= 1e6 {
        let d = decimals_for(km.abs() * 1e-6);
        return format!("{:.d$} million km", km * 1e-6);
    }
    if km == 0.0 {
        return "0 km".into();
    }
    let magnitude = 10f64.powf(km.abs().log10().floor() - 2.0).max(1.0);
    format!("{} km", thousands((km / magnitude).round() * magnitude))
}

/// A number rounded to a whole and written with thousands separators: `1,094,605`.
pub fn thousands(x: f64) -> String {
    let v = x.round();
    let digits = format!("{:.0}", v.abs());
    let mut out = String::new();
    for (i, ch) in digits.chars().enumerate() {
        if i > 0 && (digits.len() - i) % 3 == 0 {
            out.push(',');
        }
        out.push(ch);
    }
    if v < 0.0 {
        format!("-{out}")
    } else {
        out
    }
}

/// Width of the station-name column of every table, in display columns.
pub const NAME_COLUMNS: usize = 24;

/// A station name fitted to [`NAME_COLUMNS`] display columns (wide characters count two):
/// cut with an ellipsis when longer, padded with spaces when shorter.
pub fn name_cell(name: &str) -> String {
    use unicode_width::UnicodeWidthChar;
    let width = unicode_width::UnicodeWidthStr::width(name);
    let mut out = String::new();
    let mut used = 0;
    if width <= NAME_COLUMNS {
        out.push_str(name);
        used = width;
    } else {
        for ch in name.chars() {
            let w = ch.width().unwrap_or(0);
            if used + w > NAME_COLUMNS - 1 {
                break;
            }
            out.push(ch);
            used += w;
        }
        out.push('…');
        used += 1;
    }
    out.push_str(&" ".repeat(NAME_COLUMNS.saturating_sub(used)));
    out
}

/// The text with its first letter in upper case (for sentences that start a paragraph).
pub fn capitalise(s: &str) -> String {
    let mut c = s.chars();
    match c.next() {
        Some(f) => f.to_uppercase().collect::<String>() + c.as_str(),
        None => String::new(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn uncertainties_in_km_keep_three_digits() {
        assert_eq!(km_to_three_digits(10_382_243.0), "10.4 million km");
        assert_eq!(km_to_three_digits(1_385_665.0), "1.39 million km");
        assert_eq!(km_to_three_digits(382_243.0), "382,000 km");
        assert_eq!(km_to_three_digits(1_094.4), "1,090 km");
        assert_eq!(km_to_three_digits(57.4), "57 km");
        assert_eq!(km_to_three_digits(f64::NAN), "not determined");
    }

    #[test]
    fn names_fill_the_same_display_width() {
        use unicode_width::UnicodeWidthStr;
        for name in [
            "Kestrel",
            "天文台北极星观测站天文台北极星",
            "A very long station name indeed, far too long",
            "",
        ] {
            assert_eq!(name_cell(name).width(), NAME_COLUMNS, "{name}");
        }
        assert!(name_cell("A very long station name indeed").ends_with('…'));
        assert_eq!(name_cell("Kestrel").trim_end(), "Kestrel");
    }

    #[test]
    fn fixed_matches_the_standard_formatting() {
        for &(x, d) in &[
            (12.3456, 3),
            (-0.0004, 3),
            (359.9996, 3),
            (0.5, 0),
            (2.5, 0),
            (0.125, 2),
            (-45.125_001, 2),
            (1e20, 2),
            (1.005, 2),
        ] {
            assert_eq!(fixed(x, d), format!("{x:.d$}"), "{x} {d}");
        }
    }

    #[test]
    fn thousands_separators() {
        assert_eq!(thousands(1_094_605.4), "1,094,605");
        assert_eq!(thousands(-1234.0), "-1,234");
        assert_eq!(thousands(999.0), "999");
        assert_eq!(thousands(0.2), "0");
    }

    #[test]
    fn decimals_follow_the_uncertainty() {
        assert_eq!(decimals_for(1.09), 2);
        assert_eq!(decimals_for(0.0123), 4);
        assert_eq!(decimals_for(250.0), 0);
        assert_eq!(decimals_for(f64::NAN), 2);
    }
}
