//! Civil (clock) time: the time an observer's watch or phone shows, in a named zone of the
//! IANA time-zone database with its daylight-saving rules (`Europe/Amsterdam`), or at a fixed
//! offset from UTC (`+05:30`).
//!
//! The rules come from the IANA tz database bundled into the `jiff` crate (the same on every
//! machine; a zone's current rule extends to any future year, as the database's own POSIX rule
//! says); for a date before a zone adopted standard time, the database gives the place's local
//! mean time (LMT), whose offset may carry seconds. Civil time is counted from UTC: before 1972 the labels this
//! tool prints are UT1, and a zone's offset is applied to that label as to UTC.
//!
//! References: IANA Time Zone Database (<https://www.iana.org/time-zones>); ISO 8601-1:2019
//! §4.3.13 (time shift, `+hh:mm`).

use chrono::NaiveDateTime;

/// A civil time zone: a named IANA zone, or a fixed offset from UTC.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum CivilZone {
    /// A zone of the tz database, with its history of offsets and daylight saving.
    Named(jiff::tz::TimeZone),
    /// A fixed offset from UTC.
    Fixed {
        /// Seconds east of UTC.
        offset_s: i32,
    },
}

/// The zone's reading of one instant: its offset then and the abbreviation in use.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct CivilReading {
    /// The civil date and time (UTC label + offset).
    pub local: NaiveDateTime,
    /// Offset east of UTC in seconds.
    pub offset_s: i32,
    /// The abbreviation in force (`CET`, `CEST`, `LMT`), or the offset for a fixed zone.
    pub abbreviation: String,
}

impl CivilZone {
    /// Read a zone: an IANA name (`Europe/Amsterdam`, any case), `UTC`/`Z`, or a fixed offset
    /// `+05:30`, `-0300`, `+09` or with seconds `+00:19:32` (a local mean time), optionally
    /// after `UTC` or `GMT` (`UTC+01:00`).
    ///
    /// Errors: a sentence saying what was wrong and how to write a zone.
    pub fn parse(text: &str) -> Result<CivilZone, String> {
        let t = text.trim();
        if t.is_empty() {
            return Err("the time zone is empty; give an IANA zone such as Europe/Amsterdam or an offset such as +05:30".into());
        }
        let upper = t.to_ascii_uppercase();
        let rest = upper
            .strip_prefix("UTC")
            .or_else(|| upper.strip_prefix("GMT"))
            .unwrap_or(&upper);
        if rest.starts_with('+') || rest.starts_with('-') {
            return parse_offset_s(rest).map(|offset_s| CivilZone::Fixed { offset_s }).ok_or_else(|| {
                format!("'{t}' is not an offset from UTC; write it as +HH:MM (for example +05:30 or -03:00) or +HH:MM:SS, within 18 hours")
            });
        }
        if rest.is_empty() || upper == "Z" {
            return Ok(CivilZone::Fixed { offset_s: 0 });
        }
        jiff::tz::TimeZoneDatabase::bundled()
            .get(t)
            .map(CivilZone::Named)
            .map_err(|_| {
                format!("'{t}' is not a zone of the IANA time-zone database; write a name such as Europe/Amsterdam, America/Sao_Paulo or Asia/Kolkata, or a fixed offset such as +05:30")
            })
    }

    /// The zone as written back: its IANA name, or the offset `+05:30`.
    pub fn name(&self) -> String {
        match self {
            CivilZone::Named(tz) => tz.iana_name().unwrap_or("UTC").to_string(),
            CivilZone::Fixed { offset_s } => offset_text(*offset_s),
        }
    }

    /// The civil reading of an instant given by its UTC label (outside the years -9999 to
    /// 9999 jiff supports, the zone's offset at the nearer end).
    pub fn reading(&self, utc: NaiveDateTime) -> CivilReading {
        let (offset_s, abbreviation) = match self {
            CivilZone::Named(tz) => {
                let second = utc.and_utc().timestamp();
                let at = jiff::Timestamp::from_second(second).unwrap_or(if second < 0 {
                    jiff::Timestamp::MIN
                } else {
                    jiff::Timestamp::MAX
                });
                let info = tz.to_offset_info(at);
                let offset_s = info.offset().seconds();
                (offset_s, info.abbreviation().to_string())
            }
            CivilZone::Fixed { offset_s } => (*offset_s, offset_text(*offset_s)),
        };
        CivilReading {
            local: utc + chrono::TimeDelta::seconds(i64::from(offset_s)),
            offset_s,
            abbreviation,
        }
    }
}

/// `+HH:MM`, `+HHMM`, `+HH` (sign already first) as an offset in seconds, within ±18 h.
pub(crate) fn parse_offset_s(text: &str) -> Option<i32> {
    let sign = match text.chars().next()? {
        '-' | '\u{2212}' => -1,
        '+' => 1,
        _ => return None,
    };
    let body = text.trim_start_matches(['+', '-', '\u{2212}']);
    let digits: String = body.chars().filter(|c| *c != ':').collect();
    if digits.is_empty() || !digits.chars().all(|c| c.is_ascii_digit()) {
        return None;
    }
    let number = |r: std::ops::Range<usize>| digits.get(r)?.parse::<i32>().ok();
    let (h, m, s) = match digits.len() {
        1 | 2 => (number(0..digits.len())?, 0, 0),
        4 => (number(0..2)?, number(2..4)?, 0),
        6 => (number(0..2)?, number(2..4)?, number(4..6)?),
        _ => return None,
    };
    let total_s = h * 3600 + m * 60 + s;
    if m >= 60 || s >= 60 || total_s > 18 * 3600 {
        return None;
    }
    Some(sign * total_s)
}

/// An offset as ISO 8601 writes it, `+01:00`; with seconds (`+00:19:32`, a local mean time of
/// the tz database) where it has them.
pub fn offset_text(offset_s: i32) -> String {
    let sign = if offset_s < 0 { '-' } else { '+' };
    let a = offset_s.unsigned_abs();
    let (h, m, s) = (a / 3600, a / 60 % 60, a % 60);
    if s == 0 {
        format!("{sign}{h:02}:{m:02}")
    } else {
        format!("{sign}{h:02}:{m:02}:{s:02}")
    }
}

impl CivilReading {
    /// ISO 8601 with the offset in force: `2032-11-13T08:19:56.12+01:00`, to `decimals`
    /// digits of seconds.
    pub fn iso(&self, decimals: u32) -> String {
        let mut s = String::with_capacity(32);
        crate::time::iso::push_utc(&mut s, self.local, decimals);
        s.pop();
        s.push_str(&offset_text(self.offset_s));
        s
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use chrono::NaiveDate;

    fn at(y: i32, mo: u32, d: u32, h: u32, mi: u32) -> NaiveDateTime {
        NaiveDate::from_ymd_opt(y, mo, d)
            .and_then(|x| x.and_hms_opt(h, mi, 0))
            .expect("valid test date")
    }

    #[test]
    fn amsterdam_either_side_of_the_autumn_change() {
        // EU rule (Directive 2000/84/EC): summer time ends 01:00 UTC on the last Sunday of
        // October; 2032-10-31 is a Sunday.
        let z = CivilZone::parse("Europe/Amsterdam").expect("zone");
        let before = z.reading(at(2032, 10, 31, 0, 59));
        assert_eq!(
            (before.offset_s, before.abbreviation.as_str()),
            (7200, "CEST")
        );
        let after = z.reading(at(2032, 10, 31, 1, 0));
        assert_eq!((after.offset_s, after.abbreviation.as_str()), (3600, "CET"));
        assert_eq!(
            z.reading(at(2032, 11, 13, 7, 19)).iso(0),
            "2032-11-13T08:19:00+01:00"
        );
    }

    #[test]
    fn fixed_offsets_and_case() {
        let z = CivilZone::parse("+05:30").expect("offset");
        assert_eq!(z.name(), "+05:30");
        assert_eq!(
            z.reading(at(2032, 11, 13, 7, 0)).iso(2),
            "2032-11-13T12:30:00.00+05:30"
        );
        assert_eq!(
            CivilZone::parse("UTC-0300").expect("offset").name(),
            "-03:00"
        );
        assert_eq!(CivilZone::parse("utc").expect("utc").name(), "+00:00");
        assert_eq!(
            CivilZone::parse("europe/amsterdam")
                .map(|z| z.name())
                .as_deref(),
            Ok("Europe/Amsterdam")
        );
        for bad in ["Europe/Atlantis", "+25:00", "+05:75", "", "CEST+"] {
            assert!(CivilZone::parse(bad).is_err(), "{bad}");
        }
    }

    #[test]
    fn local_mean_time_offsets_keep_their_seconds() {
        // Before standard time the tz database gives a local mean time, an offset with seconds
        // (for Europe/Amsterdam in 1874 the database, which since its 2022 release keeps one
        // history for Amsterdam and Brussels, gives Brussels' +00:17:30).
        let z = CivilZone::parse("Europe/Amsterdam").expect("zone");
        let r = z.reading(at(1874, 12, 9, 2, 0));
        assert_eq!(r.offset_s, 1050);
        assert!(r.iso(0).ends_with(&offset_text(r.offset_s)), "{}", r.iso(0));
        assert_eq!(offset_text(1050), "+00:17:30");
    }
}
