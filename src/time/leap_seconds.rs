//! The labels on clocks in the leap-second era: the IERS table of TAI - UTC, and the
//! arithmetic of labels (UTC or UT1) as seconds from 2000-01-01T12:00:00, by whole days and
//! seconds so that microseconds survive from 1600 to 2300.
//!
//! References: IERS Bulletin C and the IERS leap-second file (the table); the label arithmetic
//! is plain calendar arithmetic (chrono's days from the common era).

use chrono::{NaiveDate, NaiveDateTime};

/// TAI - UTC in whole seconds from each date on (IERS Bulletin C; the table is that of the
/// IERS leap-second file). Year, month, day, TAI - UTC (s).
pub const LEAP_SECONDS: [(i32, u32, u32, i32); 28] = [
    (1972, 1, 1, 10),
    (1972, 7, 1, 11),
    (1973, 1, 1, 12),
    (1974, 1, 1, 13),
    (1975, 1, 1, 14),
    (1976, 1, 1, 15),
    (1977, 1, 1, 16),
    (1978, 1, 1, 17),
    (1979, 1, 1, 18),
    (1980, 1, 1, 19),
    (1981, 7, 1, 20),
    (1982, 7, 1, 21),
    (1983, 7, 1, 22),
    (1985, 7, 1, 23),
    (1988, 1, 1, 24),
    (1990, 1, 1, 25),
    (1991, 1, 1, 26),
    (1992, 7, 1, 27),
    (1993, 7, 1, 28),
    (1994, 7, 1, 29),
    (1996, 1, 1, 30),
    (1997, 7, 1, 31),
    (1999, 1, 1, 32),
    (2006, 1, 1, 33),
    (2009, 1, 1, 34),
    (2012, 7, 1, 35),
    (2015, 7, 1, 36),
    (2017, 1, 1, 37),
];

/// The last day for which the leap-second table is known to hold: the IERS leap-second file
/// "updated through IERS Bulletin C 72 issued in July 2026" expires on 28 June 2027 (as
/// carried by the PyPI package astropy-iers-data 0.2026.11.16; update with each bulletin).
/// After it, TAI - UTC stays at its last value.
pub const LEAP_TABLE_VALID_UNTIL: (i32, u32, u32) = (2027, 6, 28);

/// The time label's epoch: 2000-01-01T12:00:00 (UTC or UT1, following the label).
pub(crate) fn label_epoch() -> NaiveDateTime {
    NaiveDate::from_ymd_opt(2000, 1, 1)
        .and_then(|d| d.and_hms_opt(12, 0, 0))
        .unwrap_or_default()
}

/// Seconds of a label after 2000-01-01T12:00:00, counting no leap seconds.
pub(crate) fn label_seconds(label: NaiveDateTime) -> f64 {
    let delta = label - label_epoch();
    delta.num_seconds() as f64 + f64::from(delta.subsec_nanos()) * 1e-9
}

/// Days from 0001-01-01 (day 1, chrono's `num_days_from_ce`) to the label epoch's date,
/// 2000-01-01.
const EPOCH_DAYS_FROM_CE: i64 = 730_120;

/// The label `seconds` after the label epoch (no leap seconds counted), by integer day and
/// second arithmetic (chrono's general addition dominated `predict` for large grids).
pub(crate) fn label_from_seconds(seconds: f64) -> NaiveDateTime {
    let whole = seconds.floor();
    let mut nanos = ((seconds - whole) * 1e9).round() as i64;
    // Seconds from 2000-01-01T00:00:00; the epoch is at noon.
    let mut whole = whole as i64 + 43_200;
    if nanos >= 1_000_000_000 {
        whole += 1;
        nanos -= 1_000_000_000;
    }
    let days = whole.div_euclid(86_400) + EPOCH_DAYS_FROM_CE;
    let second_of_day = whole.rem_euclid(86_400);
    i32::try_from(days)
        .ok()
        .and_then(NaiveDate::from_num_days_from_ce_opt)
        .and_then(|d| {
            let t = chrono::NaiveTime::from_num_seconds_from_midnight_opt(
                second_of_day as u32,
                nanos as u32,
            )?;
            Some(d.and_time(t))
        })
        .unwrap_or_default()
}

/// The leap-second table as (label seconds after the epoch at which each step starts,
/// TAI - UTC in seconds).
fn leap_steps() -> &'static [(f64, f64)] {
    static STEPS: std::sync::OnceLock<Vec<(f64, f64)>> = std::sync::OnceLock::new();
    STEPS.get_or_init(|| {
        LEAP_SECONDS
            .iter()
            .map(|&(y, m, d, s)| (label_seconds(ymd(y, m, d)), f64::from(s)))
            .collect()
    })
}

/// [`tai_minus_utc_s`] at a label given as seconds after the epoch (never inside a leap
/// second: such labels are continuous).
pub(crate) fn tai_minus_utc_at_seconds(label_s: f64) -> Option<f64> {
    leap_steps()
        .iter()
        .rev()
        .find(|(start, _)| label_s >= *start)
        .map(|&(_, s)| s)
}

pub(crate) fn ymd(y: i32, m: u32, d: u32) -> NaiveDateTime {
    NaiveDate::from_ymd_opt(y, m, d)
        .and_then(|d| d.and_hms_opt(0, 0, 0))
        .unwrap_or_default()
}

/// TAI - UTC in seconds at a UTC label, or `None` before 1972.
///
/// References: IERS Bulletin C; after the table's last entry the last value is kept.
pub fn tai_minus_utc_s(utc: NaiveDateTime) -> Option<f64> {
    LEAP_SECONDS
        .iter()
        .rev()
        .find(|(y, m, d, _)| utc >= ymd(*y, *m, *d))
        .map(|&(_, _, _, s)| f64::from(s))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::time::iso::parse_utc;
    use chrono::TimeDelta;

    fn label(text: &str) -> NaiveDateTime {
        parse_utc(text).unwrap()
    }

    #[test]
    fn leap_seconds_follow_bulletin_c() {
        // Source: IERS Bulletin C (leap-second history): TAI - UTC = 10 s on 1972-01-01,
        // 32 s through 2005, 33 s from 2006-01-01, 34 s from 2009-01-01, 35 s from 2012-07-01,
        // 37 s from 2017-01-01.
        // The integer label arithmetic agrees with chrono's general addition, 1600 to 2300.
        assert_eq!(
            NaiveDate::from_ymd_opt(2000, 1, 1)
                .map(|d| i64::from(chrono::Datelike::num_days_from_ce(&d))),
            Some(EPOCH_DAYS_FROM_CE)
        );
        for k in -2_000i64..2_000 {
            let seconds = k as f64 * 5_523_797.123_456_7 + 0.999_999_999_6 * (k % 3) as f64;
            let whole = seconds.floor();
            let nanos = ((seconds - whole) * 1e9).round() as i64;
            let chrono_way =
                label_epoch() + TimeDelta::seconds(whole as i64) + TimeDelta::nanoseconds(nanos);
            assert_eq!(label_from_seconds(seconds), chrono_way, "{seconds}");
            assert_eq!(
                tai_minus_utc_at_seconds(seconds),
                tai_minus_utc_s(chrono_way),
                "{seconds}"
            );
        }
        assert_eq!(tai_minus_utc_s(label("1971-12-31T23:59:59Z")), None);
        assert_eq!(tai_minus_utc_s(label("1972-01-01T00:00:00Z")), Some(10.0));
        assert_eq!(tai_minus_utc_s(label("2005-12-31T23:59:59Z")), Some(32.0));
        assert_eq!(tai_minus_utc_s(label("2006-01-01T00:00:00Z")), Some(33.0));
        assert_eq!(tai_minus_utc_s(label("2012-06-06T01:29:36Z")), Some(34.0));
        assert_eq!(tai_minus_utc_s(label("2012-07-01T00:00:00Z")), Some(35.0));
        assert_eq!(tai_minus_utc_s(label("2019-11-11T15:20:00Z")), Some(37.0));
        assert_eq!(tai_minus_utc_s(label("2117-12-11T03:00:00Z")), Some(37.0));
    }
}
