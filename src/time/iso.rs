//! ISO 8601 labels: parsing the times and dates people write, and formatting instants with a
//! chosen number of decimals of seconds.
//!
//! References: ISO 8601-1:2019 (date and time representations).

use chrono::{NaiveDate, NaiveDateTime, TimeDelta};

/// How a time given as text named its zone.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Zone {
    /// A trailing `Z`: UTC.
    Utc,
    /// An offset from UTC in minutes (`+08:00` is 480), converted to UTC.
    Offset(i32),
    /// No zone at all: read as UTC.
    Missing,
}

/// Split a trailing zone (`Z`, `+HH:MM`, `-HH:MM`, `+HHMM`, `+HH`) off a time.
fn split_zone(text: &str) -> std::result::Result<(&str, Zone), String> {
    if let Some(body) = text.strip_suffix('Z').or_else(|| text.strip_suffix('z')) {
        return Ok((body, Zone::Utc));
    }
    // A sign after the date part (position 10 on) starts an offset.
    let Some(pos) = text
        .char_indices()
        .skip(10)
        .find(|(_, c)| *c == '+' || *c == '-')
        .map(|(i, _)| i)
    else {
        return Ok((text, Zone::Missing));
    };
    let (body, offset) = text.split_at(pos);
    let sign = if offset.starts_with('-') { -1 } else { 1 };
    let digits: String = offset[1..].chars().filter(|c| *c != ':').collect();
    let bad = || {
        format!("'{text}' has a time-zone offset that is not +HH:MM; give the time in UTC with a trailing Z, e.g. 2012-06-05T22:25:41.3Z")
    };
    if !(digits.len() == 2 || digits.len() == 4) || !digits.chars().all(|c| c.is_ascii_digit()) {
        return Err(bad());
    }
    let hours: i32 = digits[..2].parse().map_err(|_| bad())?;
    let minutes: i32 = if digits.len() == 4 {
        digits[2..].parse().map_err(|_| bad())?
    } else {
        0
    };
    if hours > 14 || minutes > 59 {
        return Err(bad());
    }
    Ok((body, Zone::Offset(sign * (hours * 60 + minutes))))
}

/// Whether a leap second was inserted at the end of this UTC day (IERS Bulletin C: the day
/// before each change of TAI - UTC from 1972 July 1 on).
fn leap_second_day(date: NaiveDate) -> bool {
    let next = date.succ_opt();
    crate::time::scales::LEAP_SECONDS
        .iter()
        .skip(1)
        .any(|&(y, m, d, _)| next == NaiveDate::from_ymd_opt(y, m, d))
}

/// Parse an ISO 8601 time, `YYYY-MM-DDTHH:MM:SS[.fff]` with a zone: `Z` (UTC), an offset
/// `+HH:MM` (converted to UTC) or none (read as UTC, and said so through [`Zone::Missing`]);
/// a space may replace `T`. Second 60 is accepted only at 23:59 of a day that ended with a
/// leap second. Returns a message saying what is wrong on failure.
pub fn parse_utc_zoned(text: &str) -> std::result::Result<(NaiveDateTime, Zone), String> {
    let trimmed = text.trim();
    let (body, zone) = split_zone(trimmed)?;
    let normal = body.replacen(' ', "T", 1);
    let label = NaiveDateTime::parse_from_str(&normal, "%Y-%m-%dT%H:%M:%S%.f")
        .or_else(|_| NaiveDateTime::parse_from_str(&normal, "%Y-%m-%dT%H:%M"))
        .map_err(|_| {
            format!("'{trimmed}' is not an ISO 8601 UTC time; write it like 2012-06-05T22:25:41.3Z")
        })?;
    if chrono::Timelike::nanosecond(&label) >= 1_000_000_000 {
        let at_end = chrono::Timelike::hour(&label) == 23 && chrono::Timelike::minute(&label) == 59;
        if !(at_end && leap_second_day(label.date())) {
            return Err(format!(
                "'{trimmed}' has second 60, but no leap second ended that day (IERS Bulletin C); check the time"
            ));
        }
    }
    let label = match zone {
        Zone::Offset(minutes) => label - TimeDelta::minutes(i64::from(minutes)),
        _ => label,
    };
    Ok((label, zone))
}

/// Parse an ISO 8601 time as [`parse_utc_zoned`] does, keeping only the UTC label.
pub fn parse_utc(text: &str) -> std::result::Result<NaiveDateTime, String> {
    parse_utc_zoned(text).map(|(label, _)| label)
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
    // Written field by field (chrono's strftime parses its pattern on every call, which
    // dominated `predict` for tens of thousands of stations). A leap second shows as :60.
    use chrono::{Datelike, Timelike};
    let (mut second, mut nanos) = (t.second(), t.nanosecond());
    if nanos >= 1_000_000_000 {
        second += 1;
        nanos -= 1_000_000_000;
    }
    let mut out = format!(
        "{:04}-{:02}-{:02}T{:02}:{:02}:{second:02}",
        t.year(),
        t.month(),
        t.day(),
        t.hour(),
        t.minute()
    );
    if decimals > 0 {
        let digits = format!("{nanos:09}");
        out.push('.');
        out.push_str(&digits[..(decimals.min(9) as usize)]);
    }
    out.push('Z');
    out
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
        // Offsets are converted to UTC (regression: they used to be refused).
        assert_eq!(
            label("2012-06-06T06:25:41+08:00"),
            label("2012-06-05T22:25:41Z")
        );
        assert_eq!(
            label("2012-06-05T20:55:41-01:30"),
            label("2012-06-05T22:25:41Z")
        );
        assert_eq!(
            parse_utc_zoned("2012-06-05T22:25:41").unwrap().1,
            Zone::Missing
        );
        assert!(parse_utc("2012-06-05T22:25:41+2:0").is_err());
        // Second 60 only where a leap second was inserted (IERS Bulletin C: end of 2016).
        assert!(parse_utc("2012-06-05T22:11:60Z").is_err());
        assert!(parse_utc("2016-12-31T23:59:60.5Z").is_ok());
        assert!(parse_utc("2012-06-30T23:59:60Z").is_ok());
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
