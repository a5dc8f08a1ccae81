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
    /// An offset from UTC in seconds (`+08:00` is 28800), converted to UTC.
    Offset(i32),
    /// No zone at all: read as UTC.
    Missing,
}

/// Split a trailing zone (`Z`, `+HH:MM`, `-HH:MM`, `+HHMM`, `+HH`, `+HH:MM:SS`) off a time.
fn split_zone(text: &str) -> std::result::Result<(&str, Zone), String> {
    if let Some(body) = text.strip_suffix('Z').or_else(|| text.strip_suffix('z')) {
        return Ok((body, Zone::Utc));
    }
    // "2012-06-05 22:25:41 UTC", as people write it.
    let utc_at = text.len().saturating_sub(3);
    if utc_at > 10
        && text
            .get(utc_at..)
            .is_some_and(|z| z.eq_ignore_ascii_case("utc"))
    {
        return Ok((text[..utc_at].trim_end(), Zone::Utc));
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
    let offset_s = crate::time::civil::parse_offset_s(offset).ok_or_else(|| {
        format!("'{text}' has a time-zone offset that is not +HH:MM or +HH:MM:SS; give the time in UTC with a trailing Z, e.g. 2012-06-05T22:25:41.3Z")
    })?;
    Ok((body, Zone::Offset(offset_s)))
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
        Zone::Offset(offset_s) => label - TimeDelta::seconds(i64::from(offset_s)),
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
    let mut out = String::with_capacity(32);
    push_utc(&mut out, label, decimals);
    out
}

/// Append `v` in decimal, padded with zeros to at least `width` digits.
pub fn push_digits(out: &mut String, v: u64, width: usize) {
    let mut buf = itoa::Buffer::new();
    let digits = buf.format(v);
    for _ in digits.len()..width {
        out.push('0');
    }
    out.push_str(digits);
}

/// Append a label as [`format_utc`] writes it, rounded to `decimals` digits of seconds. A leap
/// second (chrono's nanoseconds past 10^9) shows as :60. Written digit by digit with integer
/// arithmetic: strftime parses its pattern on every call and `format!` allocates, which
/// dominated `predict` for tens of thousands of stations.
pub fn push_utc(out: &mut String, label: NaiveDateTime, decimals: u32) {
    use chrono::{Datelike, Timelike};
    let d = decimals.min(9);
    let leap = label.nanosecond() >= 1_000_000_000;
    let base = if leap {
        label
            .with_nanosecond(label.nanosecond() - 1_000_000_000)
            .unwrap_or(label)
    } else {
        label
    };
    let base_s = i64::from(base.date().num_days_from_ce()) * 86_400
        + i64::from(base.num_seconds_from_midnight());
    let step = 10_i64.pow(9 - d);
    // Rounded to the step; i64 nanoseconds would overflow, so whole seconds and a remainder.
    let units = (i64::from(base.nanosecond()) + step / 2) / step;
    let per_second = 1_000_000_000 / step;
    let whole_s = base_s + units / per_second;
    let fraction = units % per_second;
    let date = i32::try_from(whole_s.div_euclid(86_400))
        .ok()
        .and_then(chrono::NaiveDate::from_num_days_from_ce_opt)
        .unwrap_or_default();
    let of_day = whole_s.rem_euclid(86_400);
    // Inside a leap second the whole second stays 60 unless rounding carried past it.
    let second = if leap && whole_s == base_s {
        60
    } else {
        of_day % 60
    };
    let year = date.year();
    if year < 0 {
        out.push('-');
    }
    push_digits(out, u64::from(year.unsigned_abs()), 4);
    for (sep, v) in [
        ('-', i64::from(date.month())),
        ('-', i64::from(date.day())),
        ('T', of_day / 3600),
        (':', of_day / 60 % 60),
        (':', second),
    ] {
        out.push(sep);
        push_digits(out, v as u64, 2);
    }
    if d > 0 {
        out.push('.');
        push_digits(out, fraction as u64, d as usize);
    }
    out.push('Z');
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
        // As the service's feedback shows the form (regression: issue 20).
        assert_eq!(
            parse_utc_zoned("2012-06-05 22:25:41 UTC").unwrap(),
            (label("2012-06-05T22:25:41Z"), Zone::Utc)
        );
        assert!(parse_utc("2012-06-05 22:25:41 utc").is_ok());
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
        assert_eq!(
            format_utc(label("1639-12-04T15:07:03.05Z"), 1),
            "1639-12-04T15:07:03.1Z"
        );
        assert_eq!(
            format_utc(label("2016-12-31T23:59:60.25Z"), 3),
            "2016-12-31T23:59:60.250Z"
        );
        assert_eq!(
            format_utc(label("2117-12-11T02:48:00Z"), 0),
            "2117-12-11T02:48:00Z"
        );
        let mut s = String::new();
        push_digits(&mut s, 7, 3);
        push_digits(&mut s, 1234, 2);
        push_digits(&mut s, 0, 1);
        push_digits(&mut s, u64::MAX, 0);
        assert_eq!(s, format!("00712340{}", u64::MAX));
    }
}
