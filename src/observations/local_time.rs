//! Timings recorded in local solar time (`time_local`, `local_time`, `day_reckoning`; see
//! shared/interface.md, "Historical-style timings"): validated and converted to the UT1 label
//! the rest of the tool uses, with the reading kept as recorded.
//!
//! From 1972 on the labels are UTC; a local-time reading is converted to UT1 and used as the
//! UTC label, which differs from it by under 0.9 s (DUT1 is not known when the file is read).

use crate::sky::solar_time::{ut1_from_local, DayReckoning, LocalTime};
use crate::time::iso::{parse_utc_zoned, Zone};
use crate::time::scales::TimeModel;
use chrono::NaiveDateTime;

/// A clock reading in local solar time, as recorded.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct LocalReading {
    /// The reading, in the row's own day reckoning.
    pub reading: NaiveDateTime,
    /// Apparent or mean solar time.
    pub kind: LocalTime,
    /// Civil or astronomical day.
    pub reckoning: DayReckoning,
}

impl LocalReading {
    /// The UT1 label of the reading at this longitude (degrees, east positive). The Delta T
    /// model only places the Sun for the equation of time, which it moves by milliseconds.
    pub fn ut1_label(&self, longitude_deg: f64) -> Option<NaiveDateTime> {
        let civil = self.reckoning.to_civil(self.reading);
        ut1_from_local(civil, self.kind, longitude_deg, &TimeModel::default())
    }
}

/// The columns of local-time readings, where the file has them.
#[derive(Clone, Copy, Debug, Default)]
pub struct LocalColumns {
    /// `time_local`.
    pub time_local: Option<usize>,
    /// `local_time`.
    pub local_time: Option<usize>,
    /// `day_reckoning`.
    pub day_reckoning: Option<usize>,
}

/// A row's local-time fields, read: the reading, or a sentence saying how to fix them and the
/// column at fault.
pub fn parse_local(
    time_local: &str,
    local_time: &str,
    day_reckoning: &str,
    cols: &LocalColumns,
) -> Result<LocalReading, (String, Option<usize>)> {
    let (reading, zone) = parse_utc_zoned(time_local).map_err(|m| (m, cols.time_local))?;
    if zone != Zone::Missing {
        return Err((
            format!("'{time_local}' carries a zone, but a local solar time has none; write the clock reading as it was recorded, e.g. 1769-06-03T21:25:03.5"),
            cols.time_local,
        ));
    }
    if local_time.is_empty() {
        return Err((
            "time_local needs local_time: write apparent (sundial time) or mean (local mean time) to say which solar time the clock kept".into(),
            cols.local_time.or(cols.time_local),
        ));
    }
    let kind = LocalTime::parse(local_time).ok_or_else(|| {
        (
            format!("'{local_time}' is not a kind of local time; write apparent or mean"),
            cols.local_time,
        )
    })?;
    let reckoning = if day_reckoning.is_empty() {
        DayReckoning::Civil
    } else {
        DayReckoning::parse(day_reckoning).ok_or_else(|| {
            (
                format!("'{day_reckoning}' is not a day reckoning; write civil (the day begins at midnight) or astronomical (it begins at noon)"),
                cols.day_reckoning,
            )
        })?
    };
    Ok(LocalReading {
        reading,
        kind,
        reckoning,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::time::iso::parse_utc;

    #[test]
    fn readings_parse_and_bad_fields_say_how_to_fix_them() {
        let cols = LocalColumns {
            time_local: Some(5),
            local_time: Some(6),
            day_reckoning: Some(7),
        };
        let r = parse_local("1769-06-03T21:25:03.5", "Mean", "astronomical", &cols).unwrap();
        assert_eq!(r.kind, LocalTime::Mean);
        // Astronomical June 3, 21:25 at 149.5 W = civil June 4, 09:25 local mean time, which
        // is 9 h 58 min before UT1 (common practice, no source: 4 min of time per degree).
        let ut1 = r.ut1_label(-149.5).unwrap();
        assert_eq!(ut1, parse_utc("1769-06-04T19:23:03.5Z").unwrap());
        let e = parse_local("1769-06-03T21:25:03Z", "mean", "", &cols).unwrap_err();
        assert!(e.0.contains("has none") && e.1 == Some(5), "{e:?}");
        let e = parse_local("1769-06-03T21:25:03", "", "", &cols).unwrap_err();
        assert!(e.0.contains("apparent") && e.1 == Some(6), "{e:?}");
        let e = parse_local("1769-06-03T21:25:03", "sidereal", "", &cols).unwrap_err();
        assert!(e.0.contains("apparent or mean"), "{e:?}");
        let e = parse_local("1769-06-03T21:25:03", "mean", "julian", &cols).unwrap_err();
        assert!(e.0.contains("civil") && e.1 == Some(7), "{e:?}");
        assert!(parse_local("June 3", "mean", "", &cols).is_err());
    }
}
