//! Local solar time, as the clocks of historical expeditions kept it: local mean time
//! (UT1 + longitude / 15 h) and local apparent time (12 h + the local hour angle of the true
//! Sun), with the equation of time solved from the tool's own ephemeris and sidereal time
//! rather than a low-accuracy formula; and the two day reckonings (civil, and astronomical,
//! whose day begins at noon).
//!
//! References: the definitions of the *Explanatory Supplement to the Astronomical Almanac*
//! (ed. P. K. Seidelmann, 1992), section 2.24 (apparent and mean solar time, the equation of
//! time as apparent minus mean); J. Meeus, *Astronomical Algorithms*, 2nd ed. (1998), chapter
//! 28 (the equation of time, example 28.a), both cited from memory of their content.

use crate::sky::ephemeris::{geocentric_state, Planet};
use crate::time::scales::TimeModel;
use chrono::{NaiveDateTime, TimeDelta};

/// Which solar time a clock was kept to.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum LocalTime {
    /// Local apparent (true) solar time: sundial time.
    Apparent,
    /// Local mean solar time.
    Mean,
}

impl LocalTime {
    /// Parse `apparent` or `mean` (any case).
    pub fn parse(text: &str) -> Option<LocalTime> {
        match text.trim().to_ascii_lowercase().as_str() {
            "apparent" => Some(LocalTime::Apparent),
            "mean" => Some(LocalTime::Mean),
            _ => None,
        }
    }

    /// `apparent` or `mean`.
    pub fn name(self) -> &'static str {
        match self {
            LocalTime::Apparent => "apparent",
            LocalTime::Mean => "mean",
        }
    }
}

/// How the date of a reading is counted.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq)]
pub enum DayReckoning {
    /// The day begins at midnight.
    #[default]
    Civil,
    /// The day of that number begins at its noon (astronomical June 3, 21 h = civil June 4, 9 h).
    Astronomical,
}

impl DayReckoning {
    /// Parse `civil` or `astronomical` (any case).
    pub fn parse(text: &str) -> Option<DayReckoning> {
        match text.trim().to_ascii_lowercase().as_str() {
            "civil" => Some(DayReckoning::Civil),
            "astronomical" => Some(DayReckoning::Astronomical),
            _ => None,
        }
    }

    /// `civil` or `astronomical`.
    pub fn name(self) -> &'static str {
        match self {
            DayReckoning::Civil => "civil",
            DayReckoning::Astronomical => "astronomical",
        }
    }

    /// The reading in this reckoning of a civil reading.
    pub fn from_civil(self, civil: NaiveDateTime) -> NaiveDateTime {
        match self {
            DayReckoning::Civil => civil,
            DayReckoning::Astronomical => civil - TimeDelta::hours(12),
        }
    }

    /// The civil reading of a reading in this reckoning.
    pub fn to_civil(self, reading: NaiveDateTime) -> NaiveDateTime {
        match self {
            DayReckoning::Civil => reading,
            DayReckoning::Astronomical => reading + TimeDelta::hours(12),
        }
    }
}

/// The equation of time (apparent minus mean solar time) in seconds at the instant whose UT1
/// (or, from 1972, UTC, within a second of it) label is given: 12 h + GAST - RA of the Sun's
/// geocentric apparent place (true equator and equinox of date) - UT1, reduced to +-12 h.
pub fn equation_of_time_s(label: NaiveDateTime, model: &TimeModel) -> Option<f64> {
    let tt = model.tt_from_label(label).ok()?;
    // The Sun's place does not depend on the planet; Venus's windows serve near its transits.
    let state = geocentric_state(Planet::Venus, tt, model);
    let ra_rad = state.sun_au[1].atan2(state.sun_au[0]);
    let (ut1a, ut1b) = model.ut1_jd_pair(tt);
    let ut1_day_fraction = ((ut1a - 0.5).fract() + ut1b).rem_euclid(1.0);
    let hours = 12.0 + (state.gast_rad - ra_rad).to_degrees() / 15.0 - 24.0 * ut1_day_fraction;
    Some((hours + 12.0).rem_euclid(24.0) * 3600.0 - 12.0 * 3600.0)
}

fn seconds(s: f64) -> TimeDelta {
    TimeDelta::nanoseconds((s * 1e9).round() as i64)
}

/// The time label (UT1 before 1972, UTC from then on) of a local solar-time reading (civil
/// reckoning) at a longitude (degrees, east positive). Local mean time is UT1 + longitude /
/// 15 h in every era (after the leap-second table UT1 falls minutes behind the UTC label);
/// local apparent time adds the equation of time, solved by iteration (it changes by under
/// 30 s a day, so three passes converge far below a millisecond).
pub fn label_from_local(
    reading: NaiveDateTime,
    kind: LocalTime,
    longitude_deg: f64,
    model: &TimeModel,
) -> Option<NaiveDateTime> {
    let mean_ut1 = reading - seconds(longitude_deg * 240.0);
    let mut ut1 = mean_ut1;
    if kind == LocalTime::Apparent {
        for _ in 0..3 {
            let label = model.label_of_ut1(ut1).ok()?;
            ut1 = mean_ut1 - seconds(equation_of_time_s(label, model)?);
        }
    }
    model.label_of_ut1(ut1).ok()
}

/// The local solar-time reading (civil reckoning) at a longitude of the instant with this time
/// label (UT1 before 1972, UTC from then on), reckoned from UT1 in every era.
pub fn local_from_label(
    label: NaiveDateTime,
    kind: LocalTime,
    longitude_deg: f64,
    model: &TimeModel,
) -> Option<NaiveDateTime> {
    let ut1 = model.ut1_of_label(label).ok()?;
    let mean = ut1 + seconds(longitude_deg * 240.0);
    match kind {
        LocalTime::Mean => Some(mean),
        LocalTime::Apparent => Some(mean + seconds(equation_of_time_s(label, model)?)),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::time::iso::parse_utc;

    fn t(text: &str) -> NaiveDateTime {
        parse_utc(text).unwrap()
    }

    #[test]
    fn equation_of_time_matches_the_handbook_example() {
        // Source: J. Meeus, Astronomical Algorithms, 2nd ed. (1998), example 28.a:
        // E = 13.70949 min on 1992 October 13.0 TD (= 0h TT; UTC 23:59:00.816 the day before,
        // TT - UTC = 32.184 s + 27 s then, IERS Bulletin C). Meeus's method is accurate to a
        // few tenths of a second; 0.5 s is allowed.
        let e = equation_of_time_s(t("1992-10-12T23:59:00.816Z"), &TimeModel::default()).unwrap();
        eprintln!("equation of time {:.5} min", e / 60.0);
        assert!((e / 60.0 - 13.70949).abs() * 60.0 < 0.5, "{} min", e / 60.0);
    }

    #[test]
    fn local_times_round_trip_and_reckonings_differ_by_noon() {
        let m = TimeModel::fixed(16.0);
        let ut1 = t("1769-06-03T19:15:23Z");
        for kind in [LocalTime::Apparent, LocalTime::Mean] {
            let local = local_from_label(ut1, kind, -149.5, &m).unwrap();
            let back = label_from_local(local, kind, -149.5, &m).unwrap();
            assert!(
                (back - ut1).num_microseconds().unwrap().abs() < 1_000,
                "{kind:?}"
            );
        }
        // After the leap-second table the same round trip holds with UTC labels, and
        // Greenwich local mean time is UT1, not the label (Delta T fixed at 240 s: UT1 - UTC
        // = 69.184 - 240 s, by the definitions of TT and UTC).
        let m = TimeModel::fixed(240.0);
        let utc = t("2117-12-11T03:00:00Z");
        for kind in [LocalTime::Apparent, LocalTime::Mean] {
            let local = local_from_label(utc, kind, 151.2, &m).unwrap();
            let back = label_from_local(local, kind, 151.2, &m).unwrap();
            assert!((back - utc).num_microseconds().unwrap().abs() < 1_000);
        }
        let greenwich = local_from_label(utc, LocalTime::Mean, 0.0, &m).unwrap();
        assert_eq!((greenwich - utc).num_milliseconds(), -170_816);
        // Tahiti is 9 h 58 min west: local mean time is that much before UT1.
        let mean = local_from_label(ut1, LocalTime::Mean, -149.5, &m).unwrap();
        assert_eq!((ut1 - mean).num_seconds(), 35_880);
        assert_eq!(
            DayReckoning::Astronomical.to_civil(t("1769-06-03T21:00:00Z")),
            t("1769-06-04T09:00:00Z")
        );
        assert_eq!(LocalTime::parse("Apparent"), Some(LocalTime::Apparent));
        assert_eq!(DayReckoning::parse("sidereal"), None);
    }
}
