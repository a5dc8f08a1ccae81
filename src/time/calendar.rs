//! Dates written in the Julian calendar (Old Style), as many records of the 17th and 18th
//! centuries were: conversion to and from the proleptic Gregorian calendar that every time
//! label of the toolkit uses.
//!
//! The Gregorian reform dropped 10 days in 1582 (Julian date + 10 days = Gregorian date until
//! Julian 1700 February 28), 11 days from Julian 1700 March 1 to 1800 February 28, 12 days to
//! 1900 February 28 (common practice; Great Britain and its colonies changed in 1752, Sweden
//! in 1753, Russia in 1918). The arithmetic is that of E. M. Reingold and N. Dershowitz,
//! *Calendrical Calculations*, 4th ed. (2018), chapter 3, through the `calendrical_calculations`
//! crate; both calendars count days as rata die (day 1 = Gregorian 0001-01-01), as chrono's
//! `num_days_from_ce` does.

use chrono::{Datelike, NaiveDate};

/// The calendar a date is written in.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq)]
pub enum Calendar {
    /// The Gregorian calendar (New Style), proleptic before 1582: the default.
    #[default]
    Gregorian,
    /// The Julian calendar (Old Style).
    Julian,
}

impl Calendar {
    /// Parse `gregorian` or `julian` (any case; also `new style`/`ns`, `old style`/`os`);
    /// empty is the default, Gregorian.
    pub fn parse(text: &str) -> Option<Calendar> {
        match text.trim().to_ascii_lowercase().as_str() {
            "" | "gregorian" | "new style" | "ns" => Some(Calendar::Gregorian),
            "julian" | "old style" | "os" => Some(Calendar::Julian),
            _ => None,
        }
    }

    /// `gregorian` or `julian`.
    pub fn name(self) -> &'static str {
        match self {
            Calendar::Gregorian => "gregorian",
            Calendar::Julian => "julian",
        }
    }
}

/// Days in a month of the Julian calendar (every fourth year a leap year, 1700 included).
fn julian_month_days(year: i32, month: u32) -> Option<u32> {
    let leap = calendrical_calculations::julian::is_leap_year(year);
    Some(match month {
        1 | 3 | 5 | 7 | 8 | 10 | 12 => 31,
        4 | 6 | 9 | 11 => 30,
        2 if leap => 29,
        2 => 28,
        _ => return None,
    })
}

/// The Gregorian date of a date written in the Julian calendar, or `None` when no such Julian
/// date exists (month 13, April 31, February 29 of a year not divisible by 4).
pub fn gregorian_from_julian(year: i32, month: u32, day: u32) -> Option<NaiveDate> {
    if day == 0 || day > julian_month_days(year, month)? {
        return None;
    }
    let fixed = calendrical_calculations::julian::fixed_from_julian(year, month as u8, day as u8);
    let days = i32::try_from(fixed.to_i64_date()).ok()?;
    NaiveDate::from_num_days_from_ce_opt(days)
}

/// The Julian-calendar year, month and day of a Gregorian date.
pub fn julian_from_gregorian(date: NaiveDate) -> Option<(i32, u32, u32)> {
    let fixed =
        calendrical_calculations::rata_die::RataDie::new(i64::from(date.num_days_from_ce()));
    let (y, m, d) = calendrical_calculations::julian::julian_from_fixed(fixed).ok()?;
    Some((y, u32::from(m), u32::from(d)))
}

/// Days the Julian calendar is behind the Gregorian on a Gregorian date (10 in the 17th
/// century, 11 in the 18th, 12 in the 19th, 13 in the 20th and 21st).
pub fn julian_lag_days(date: NaiveDate) -> Option<i64> {
    let (y, m, d) = julian_from_gregorian(date)?;
    let written = NaiveDate::from_ymd_opt(y, m, d)
        // A Julian February 29 that the Gregorian calendar lacks: count from the day before.
        .or_else(|| NaiveDate::from_ymd_opt(y, m, d - 1).map(|x| x + chrono::Days::new(1)))?;
    Some((date - written).num_days())
}

/// A date `YYYY-MM-DD` at the start of `text` read in `calendar`, and the rest of the text
/// (after the date, with its separator `T` or a space kept): so that a Julian date such as
/// 1700-02-29, which the Gregorian calendar lacks, can be read. `None` when the text does not
/// begin with such a date or the date does not exist in that calendar.
pub fn split_date(text: &str, calendar: Calendar) -> Option<(NaiveDate, &str)> {
    let t = text.trim_start();
    let mut parts = t.splitn(3, '-');
    let y: i32 = parts.next()?.trim().parse().ok()?;
    let m: u32 = parts.next()?.trim().parse().ok()?;
    let rest = parts.next()?;
    let digits = rest.chars().take_while(|c| c.is_ascii_digit()).count();
    if digits == 0 || digits > 2 {
        return None;
    }
    let d: u32 = rest[..digits].parse().ok()?;
    let date = match calendar {
        Calendar::Gregorian => NaiveDate::from_ymd_opt(y, m, d)?,
        Calendar::Julian => gregorian_from_julian(y, m, d)?,
    };
    Some((date, &rest[digits..]))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn date(y: i32, m: u32, d: u32) -> NaiveDate {
        NaiveDate::from_ymd_opt(y, m, d).unwrap()
    }

    #[test]
    fn the_reform_and_its_growing_lag() {
        // Common practice (the reform of 1582): Julian 1582 October 4 was followed by
        // Gregorian October 15; Britain's Julian 1752 September 2 by Gregorian September 14.
        assert_eq!(gregorian_from_julian(1582, 10, 4), Some(date(1582, 10, 14)));
        assert_eq!(gregorian_from_julian(1582, 10, 5), Some(date(1582, 10, 15)));
        assert_eq!(gregorian_from_julian(1752, 9, 3), Some(date(1752, 9, 14)));
        // The transit of Venus of 1639, dated November 24 Old Style in England, is Gregorian
        // December 4 (common practice, the date of the event in New Style).
        assert_eq!(gregorian_from_julian(1639, 11, 24), Some(date(1639, 12, 4)));
        assert_eq!(julian_lag_days(date(1639, 12, 4)), Some(10));
        assert_eq!(julian_lag_days(date(1769, 6, 3)), Some(11));
        assert_eq!(julian_lag_days(date(1874, 12, 9)), Some(12));
        // Julian 1700 February 29 exists; Gregorian does not.
        assert_eq!(gregorian_from_julian(1700, 2, 29), Some(date(1700, 3, 11)));
        assert_eq!(gregorian_from_julian(1701, 2, 29), None);
        assert_eq!(gregorian_from_julian(1701, 4, 31), None);
        assert_eq!(gregorian_from_julian(1701, 13, 1), None);
        for g in [date(1600, 1, 1), date(1769, 6, 3), date(2299, 12, 31)] {
            let (y, m, d) = julian_from_gregorian(g).unwrap();
            assert_eq!(gregorian_from_julian(y, m, d), Some(g));
        }
    }

    #[test]
    fn dates_are_split_from_their_times() {
        let (d, rest) = split_date("1700-02-29T10:00", Calendar::Julian).unwrap();
        assert_eq!((d, rest), (date(1700, 3, 11), "T10:00"));
        assert!(split_date("1700-02-29T10:00", Calendar::Gregorian).is_none());
        let (d, rest) = split_date("1769-6-3 09:34", Calendar::Gregorian).unwrap();
        assert_eq!((d, rest), (date(1769, 6, 3), " 09:34"));
        assert!(split_date("June 3", Calendar::Julian).is_none());
        assert_eq!(Calendar::parse("Old Style"), Some(Calendar::Julian));
        assert_eq!(Calendar::parse(""), Some(Calendar::Gregorian));
        assert_eq!(Calendar::parse("mayan"), None);
    }
}
