//! Timings recorded in local solar time (`time_local`, `local_time`, `day_reckoning`; see
//! shared/interface.md, "Historical-style timings"): validated and converted to the UT1 label
//! the rest of the tool uses, with the reading kept as recorded.
//!
//! From 1972 on the labels are UTC; a local-time reading is converted to UT1 and used as the
//! UTC label, which differs from it by under 0.9 s (DUT1 is not known when the file is read).

use super::readings::{parse_time_reading, TimeReading};
use crate::sky::solar_time::{label_from_local, DayReckoning, LocalTime};
use crate::time::calendar::Calendar;
use crate::time::iso::Zone;
use crate::time::scales::TimeModel;
use chrono::NaiveDateTime;

/// A clock reading in local solar time, as recorded.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct LocalReading {
    /// The reading (a range's midpoint), in the row's own day reckoning, its date converted to
    /// the Gregorian calendar.
    pub reading: NaiveDateTime,
    /// Apparent or mean solar time.
    pub kind: LocalTime,
    /// Civil or astronomical day.
    pub reckoning: DayReckoning,
    /// The meridian the clock was kept to (or the time reduced to), degrees east of
    /// Greenwich, where it is not the station's own (`time_meridian`).
    pub meridian_deg: Option<f64>,
    /// The reading as written: its range, or whether it was written to the minute.
    pub written: TimeReading,
}

impl LocalReading {
    /// A reading of one instant on the station's own meridian (for simulations).
    pub fn new(reading: NaiveDateTime, kind: LocalTime, reckoning: DayReckoning) -> LocalReading {
        LocalReading {
            reading,
            kind,
            reckoning,
            meridian_deg: None,
            written: TimeReading {
                label: reading,
                zone: Zone::Missing,
                range_s: None,
                minute_only: false,
                undated: false,
            },
        }
    }

    /// The time label (UT1 before 1972, UTC after) of the reading at this station longitude
    /// (degrees, east positive), or at the meridian the clock was kept to. The Delta T model
    /// only places the Sun for the equation of time, which it moves by milliseconds.
    pub fn label(&self, station_longitude_deg: f64) -> Option<NaiveDateTime> {
        let civil = self.reckoning.to_civil(self.reading);
        let longitude = self.meridian_deg.unwrap_or(station_longitude_deg);
        label_from_local(civil, self.kind, longitude, &TimeModel::default())
    }

    /// Whether the clock was kept to the station's own meridian, so that an error in the
    /// station's longitude moves the conversion to UT (240 s per degree).
    pub fn follows_station(&self) -> bool {
        self.meridian_deg.is_none()
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

/// A row's local-time fields, read (the reading's date in `calendar`; a range or a time to the
/// minute is kept as such): the reading, or a sentence saying how to fix them and the column
/// at fault.
pub fn parse_local(
    time_local: &str,
    local_time: &str,
    day_reckoning: &str,
    (cols, calendar): (&LocalColumns, Calendar),
) -> Result<LocalReading, (String, Option<usize>)> {
    let written = parse_time_reading(time_local, calendar).map_err(|m| {
        let m = m.replace("2012-06-05T22:25:41.3Z", "1769-06-03T21:25:03.5");
        (m, cols.time_local)
    })?;
    let (reading, zone) = (written.label, written.zone);
    if written.undated {
        return Err((
            format!("'{time_local}' has no date; a local solar time needs its date, e.g. 1769-06-03T21:25:03.5"),
            cols.time_local,
        ));
    }
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
        meridian_deg: None,
        written,
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
        let g = (&cols, Calendar::Gregorian);
        let r = parse_local("1769-06-03T21:25:03.5", "Mean", "astronomical", g).unwrap();
        assert_eq!(r.kind, LocalTime::Mean);
        // Astronomical June 3, 21:25 at 149.5 W = civil June 4, 09:25 local mean time, which
        // is 9 h 58 min before UT1 (common practice, no source: 4 min of time per degree).
        let ut1 = r.label(-149.5).unwrap();
        assert_eq!(ut1, parse_utc("1769-06-04T19:23:03.5Z").unwrap());
        // The same clock reduced to the Greenwich meridian: the station's longitude no longer
        // enters, and a mean time there is UT1 itself.
        let greenwich = LocalReading {
            meridian_deg: Some(0.0),
            ..r
        };
        assert_eq!(
            greenwich.label(-149.5),
            parse_utc("1769-06-04T09:25:03.5Z").ok()
        );
        assert!(!greenwich.follows_station() && r.follows_station());
        // A Julian date, Old Style (11 days behind in 1769), and a range.
        let j = parse_local(
            "1769-05-23T21:25:00/21:25:07",
            "mean",
            "astronomical",
            (&cols, Calendar::Julian),
        )
        .unwrap();
        assert_eq!(j.label(-149.5), parse_utc("1769-06-04T19:23:03.5Z").ok());
        assert_eq!(j.written.range_s, Some(7.0));
        let e = parse_local("1769-06-03T21:25:03Z", "mean", "", g).unwrap_err();
        assert!(e.0.contains("has none") && e.1 == Some(5), "{e:?}");
        let e = parse_local("1769-06-03T21:25:03", "", "", g).unwrap_err();
        assert!(e.0.contains("apparent") && e.1 == Some(6), "{e:?}");
        let e = parse_local("1769-06-03T21:25:03", "sidereal", "", g).unwrap_err();
        assert!(e.0.contains("apparent or mean"), "{e:?}");
        let e = parse_local("1769-06-03T21:25:03", "mean", "julian", g).unwrap_err();
        assert!(e.0.contains("civil") && e.1 == Some(7), "{e:?}");
        let e = parse_local("June 3", "mean", "", g).unwrap_err();
        assert!(e.0.contains("1769-06-03T21:25:03.5"), "{e:?}");
    }
}
