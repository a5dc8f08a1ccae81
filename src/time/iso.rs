//! ISO 8601 labels: parsing the times and dates people write, and formatting instants with a
//! chosen number of decimals of seconds.
//!
//! References: ISO 8601-1:2019 (date and time representations).

use chrono::{NaiveDate, NaiveDateTime, TimeDelta};

/// Parse an ISO 8601 time in UTC, `YYYY-MM-DDTHH:MM:SS[.fff]Z` (a space may replace `T`; the
/// `Z` may be omitted). Returns a message saying what is wrong on failure.
pub fn parse_utc(text: &str) -> std::result::Result<NaiveDateTime, String> {
    let trimmed = text.trim();
    let body = trimmed
        .strip_suffix('Z')
        .or_else(|| trimmed.strip_suffix('z'))
        .unwrap_or(trimmed);
    if body.contains('+') || body.matches('-').count() > 2 {
        return Err(format!(
            "'{trimmed}' carries a time-zone offset; give the time in UTC with a trailing Z, e.g. 2012-06-05T22:25:41.3Z"
        ));
    }
    let normal = body.replacen(' ', "T", 1);
    NaiveDateTime::parse_from_str(&normal, "%Y-%m-%dT%H:%M:%S%.f")
        .or_else(|_| NaiveDateTime::parse_from_str(&normal, "%Y-%m-%dT%H:%M"))
        .map_err(|_| {
            format!("'{trimmed}' is not an ISO 8601 UTC time; write it like 2012-06-05T22:25:41.3Z")
        })
}

/// Parse a calendar date `YYYY-MM-DD`.
pub fn parse_date(text: &str) -> std::result::Result<NaiveDate, String> {
    NaiveDate::parse_from_str(text.trim(), "%Y-%m-%d")
        .map_err(|_| format!("'{}' is not a date; write it as YYYY-MM-DD", text.trim()))
}

/// Format a label as ISO 8601 with `decimals` digits of seconds (rounded) and a trailing `Z`.
pub fn format_utc(label: NaiveDateTime, decimals: u32) -> String {
    let step_ns = 10_i64.pow(9 - decimals.min(9));
    let epoch = super::scales::label_epoch();
    let delta = label - epoch;
    // i128 nanoseconds: i64 nanoseconds overflow 292 years from the epoch.
    let ns = i128::from(delta.num_seconds()) * 1_000_000_000 + i128::from(delta.subsec_nanos());
    let step = i128::from(step_ns);
    let rounded = (ns + step / 2).div_euclid(step) * step;
    let whole_s = rounded.div_euclid(1_000_000_000) as i64;
    let rest_ns = rounded.rem_euclid(1_000_000_000) as i64;
    let t = epoch + TimeDelta::seconds(whole_s) + TimeDelta::nanoseconds(rest_ns);
    if decimals == 0 {
        return t.format("%Y-%m-%dT%H:%M:%SZ").to_string();
    }
    let frac = t.format("%.9f").to_string();
    format!(
        "{}{}Z",
        t.format("%Y-%m-%dT%H:%M:%S"),
        &frac[..(1 + decimals as usize).min(frac.len())]
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn label(text: &str) -> NaiveDateTime {
        parse_utc(text).unwrap()
    }

    #[test]
    fn parse_and_format() {
        assert!(parse_utc("2012-06-05T22:25:41.3").is_ok());
        assert!(parse_utc("2012-06-05 22:25:41Z").is_ok());
        assert!(parse_utc("2012-06-05T22:25:41+02:00").is_err());
        assert!(parse_utc("yesterday").is_err());
        assert_eq!(
            format_utc(label("2012-06-05T22:25:41.296Z"), 2),
            "2012-06-05T22:25:41.30Z"
        );
        assert_eq!(
            format_utc(label("2012-06-05T23:59:59.996Z"), 2),
            "2012-06-06T00:00:00.00Z"
        );
    }
}
