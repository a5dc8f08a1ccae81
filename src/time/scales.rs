//! Time scales: UTC with leap seconds, TAI, TT, UT1 and Delta T.
//!
//! Conventions (see `shared/interface.md` and docs/method.md):
//! - From 1972 on, time labels are UTC: TT = UTC + (TAI - UTC) + 32.184 s, with TAI - UTC from
//!   the built-in IERS table; after the table's last entry it stays at its last value.
//! - Before 1972, time labels are UT1 (mean solar time at Greenwich): TT = UT1 + Delta T.
//! - The Earth's rotation always uses UT1 = TT - Delta T, with Delta T from `delta_t.rs` (the
//!   reconstruction of Morrison et al. 2021, IERS observations and predictions, and an
//!   extrapolation), DUT1 = UT1 - UTC where the user gives it, or a fixed Delta T.
use crate::error::{Error, Result};
use crate::sky::constants::{J2000_JD, SECONDS_PER_DAY, TT_MINUS_TAI_S};
use chrono::{NaiveDateTime, TimeDelta};

/// Earliest year the toolkit accepts.
pub const MIN_YEAR: i32 = 1600;
/// Latest year the toolkit accepts.
pub const MAX_YEAR: i32 = 2300;

/// An instant of Terrestrial Time, held as whole days and seconds from J2000.0 (2000 January 1,
/// 12h TT), so that microseconds survive over the whole supported range.
#[derive(Clone, Copy, Debug, PartialEq, PartialOrd)]
pub struct Tt {
    days: i64,
    seconds: f64,
}

impl Tt {
    /// The instant `seconds` SI seconds after J2000.0 TT.
    pub fn from_j2000_seconds(seconds: f64) -> Tt {
        Tt { days: 0, seconds }.normalised()
    }

    /// The instant at Julian date `jd` (TT).
    pub fn from_jd(jd: f64) -> Tt {
        let days = (jd - J2000_JD).floor();
        Tt {
            days: days as i64,
            seconds: (jd - J2000_JD - days) * SECONDS_PER_DAY,
        }
        .normalised()
    }

    fn normalised(self) -> Tt {
        let extra = (self.seconds / SECONDS_PER_DAY).floor();
        Tt {
            days: self.days + extra as i64,
            seconds: self.seconds - extra * SECONDS_PER_DAY,
        }
    }

    /// This instant moved by `seconds` (SI seconds, either sign).
    pub fn add_seconds(self, seconds: f64) -> Tt {
        Tt {
            days: self.days,
            seconds: self.seconds + seconds,
        }
        .normalised()
    }

    /// Seconds from `earlier` to `self`.
    pub fn seconds_since(self, earlier: Tt) -> f64 {
        (self.days - earlier.days) as f64 * SECONDS_PER_DAY + (self.seconds - earlier.seconds)
    }

    /// Two-part Julian date (TT), in the form the ERFA routines expect.
    pub fn jd_pair(self) -> (f64, f64) {
        (J2000_JD + self.days as f64, self.seconds / SECONDS_PER_DAY)
    }

    /// Julian date (TT) as one number (loses precision below ~10 microseconds).
    pub fn jd(self) -> f64 {
        J2000_JD + self.days as f64 + self.seconds / SECONDS_PER_DAY
    }

    /// Days from J2000.0 (TT).
    pub fn days_j2000(self) -> f64 {
        self.days as f64 + self.seconds / SECONDS_PER_DAY
    }

    /// Decimal year, 2000.0 + days / 365.25 (the argument of the Delta T polynomials).
    pub fn decimal_year(self) -> f64 {
        2000.0 + self.days_j2000() / 365.25
    }
}

use super::delta_t::{delta_t_estimate, DeltaTBasis};
pub use super::delta_t_polynomials::delta_t_espenak_meeus_s;
use super::leap_seconds::{label_from_seconds, label_seconds, tai_minus_utc_at_seconds, ymd};
pub use super::leap_seconds::{tai_minus_utc_s, LEAP_SECONDS, LEAP_TABLE_VALID_UNTIL};

/// The settings an event is computed with: how Delta T is obtained, DUT1 in the leap-second
/// era, and the ephemeris (carried here because every computation that needs the time
/// settings needs the ephemeris too).
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub struct TimeModel {
    /// A fixed TT - UT1 in seconds that replaces the built-in model (`--delta-t`).
    pub delta_t_override_s: Option<f64>,
    /// UT1 - UTC in seconds for the leap-second era (|DUT1| < 0.9 s); 0 when unknown.
    pub dut1_s: f64,
    /// The planetary theory (`--ephemeris`).
    pub ephemeris: crate::sky::ephemeris::EphemerisChoice,
}

/// Where a Delta T value came from.
#[derive(Clone, Copy, Debug, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum DeltaTSource {
    /// Fixed by the user.
    Fixed,
    /// The leap-second table with the DUT1 the user gave.
    LeapSeconds,
    /// The reconstruction of Morrison, Stephenson, Hohenkerk and Zawilski (2021).
    Reconstruction,
    /// IERS observations.
    Observed,
    /// IERS Bulletin A predictions.
    Predicted,
    /// Published long-term predictions joined to the last IERS prediction.
    Extrapolated,
}

impl DeltaTSource {
    /// The source in words, for headers and notes.
    pub fn describe(self) -> &'static str {
        match self {
            DeltaTSource::Fixed => "fixed with --delta-t",
            DeltaTSource::LeapSeconds => "the leap-second table and the DUT1 given",
            DeltaTSource::Reconstruction => {
                "the reconstruction of Morrison, Stephenson, Hohenkerk and Zawilski (2021)"
            }
            DeltaTSource::Observed => "IERS observations",
            DeltaTSource::Predicted => "IERS Bulletin A predictions",
            DeltaTSource::Extrapolated => {
                "an extrapolation: the middle of three published predictions, half their spread as the uncertainty"
            }
        }
    }
}

impl From<DeltaTBasis> for DeltaTSource {
    fn from(b: DeltaTBasis) -> Self {
        match b {
            DeltaTBasis::Reconstruction => DeltaTSource::Reconstruction,
            DeltaTBasis::Observed => DeltaTSource::Observed,
            DeltaTBasis::Predicted => DeltaTSource::Predicted,
            DeltaTBasis::Extrapolated => DeltaTSource::Extrapolated,
        }
    }
}

impl TimeModel {
    /// A model with a fixed Delta T.
    pub fn fixed(delta_t_s: f64) -> TimeModel {
        TimeModel {
            delta_t_override_s: Some(delta_t_s),
            ..TimeModel::default()
        }
    }

    /// Check the settings; `--delta-t` and `--dut1` come from users.
    pub fn validate(&self) -> Result<()> {
        if let Some(dt) = self.delta_t_override_s {
            if !dt.is_finite() || dt.abs() > 3600.0 {
                return Err(Error::argument(format!(
                    "--delta-t {dt} is not a plausible TT - UT1 in seconds; give a value between -3600 and 3600"
                )));
            }
        }
        if !self.dut1_s.is_finite() || self.dut1_s.abs() >= 0.9 {
            return Err(Error::argument(format!(
                "--dut1 {} is not a valid UT1 - UTC; it must lie strictly between -0.9 and 0.9 seconds",
                self.dut1_s
            )));
        }
        if self.dut1_s != 0.0 && self.delta_t_override_s.is_some() {
            return Err(Error::argument(
                "--dut1 and --delta-t together: a fixed --delta-t already sets UT1; give one of them",
            ));
        }
        Ok(())
    }

    /// Check that the settings suit an event in `year` (called where an event is named:
    /// `transit_on_date`, `transits_in_years`): DUT1 belongs to the leap-second era
    /// (1972 on), when times are UTC; before 1972 times are UT1 and DUT1 has no meaning.
    pub fn validate_for_year(&self, year: i32) -> Result<()> {
        if self.dut1_s != 0.0 && year < 1972 {
            return Err(Error::argument(format!(
                "--dut1 applies from 1972 on (UTC with leap seconds); times of {year} are UT1 already, so leave --dut1 out (give --delta-t to change TT - UT1)"
            )));
        }
        Ok(())
    }

    fn leap_era_start() -> NaiveDateTime {
        ymd(1972, 1, 1)
    }

    fn table_end() -> NaiveDateTime {
        let (y, m, d) = LEAP_TABLE_VALID_UNTIL;
        ymd(y, m, d) + TimeDelta::days(1)
    }

    /// TT for a time label (UTC from 1972, UT1 before).
    ///
    /// Errors: a label outside the years [`MIN_YEAR`]..=[`MAX_YEAR`].
    pub fn tt_from_label(&self, label: NaiveDateTime) -> Result<Tt> {
        check_label_year(label)?;
        let s = label_seconds(label);
        let offset = if label < Self::leap_era_start() {
            // Delta T at the label's own year; the label is within a minute of TT, which moves
            // Delta T by far less than a microsecond.
            let approx = Tt::from_j2000_seconds(s);
            self.delta_t_override_s
                .unwrap_or_else(|| delta_t_estimate(approx.decimal_year()).delta_t_s)
        } else {
            tai_minus_utc_s(label).unwrap_or(10.0) + TT_MINUS_TAI_S
        };
        Ok(Tt::from_j2000_seconds(s + offset))
    }

    /// The time label (UTC from 1972, UT1 before) of an instant of TT.
    pub fn label_from_tt(&self, tt: Tt) -> NaiveDateTime {
        let tt_s = tt.seconds_since(Tt::from_j2000_seconds(0.0));
        // UTC if the instant falls in the leap-second era. At the 1972 boundary UT1 + Delta T
        // and UTC + 42.184 s overlap by some tens of milliseconds; UTC takes precedence there.
        let mut guess = tt_s - TT_MINUS_TAI_S - 37.0;
        for _ in 0..3 {
            let leap = tai_minus_utc_at_seconds(guess).unwrap_or(10.0);
            guess = tt_s - TT_MINUS_TAI_S - leap;
        }
        if tai_minus_utc_at_seconds(guess).is_some() {
            return label_from_seconds(guess);
        }
        let dt = self
            .delta_t_override_s
            .unwrap_or_else(|| delta_t_estimate(tt.decimal_year()).delta_t_s);
        let mut label_s = tt_s - dt;
        if self.delta_t_override_s.is_none() {
            // Delta T is evaluated at the label's own year, as in `tt_from_label`: one more
            // pass converges (Delta T changes by far less than a microsecond per second).
            let y = Tt::from_j2000_seconds(label_s).decimal_year();
            label_s = tt_s - delta_t_estimate(y).delta_t_s;
        }
        label_from_seconds(label_s)
    }

    /// Delta T = TT - UT1 in seconds at an instant, and where it came from: the value fixed
    /// with `--delta-t`; before 1972 (labels UT1) the reconstruction; in the leap-second era
    /// with `--dut1` given, 32.184 s + (TAI - UTC) - DUT1; otherwise the built-in model
    /// (IERS observations, predictions, extrapolation; see `delta_t.rs`).
    pub fn delta_t_s(&self, tt: Tt) -> (f64, DeltaTSource) {
        if let Some(dt) = self.delta_t_override_s {
            return (dt, DeltaTSource::Fixed);
        }
        if self.dut1_s != 0.0 {
            let label = self.label_from_tt(tt);
            if label >= Self::leap_era_start() && label < Self::table_end() {
                let leap = tai_minus_utc_s(label).unwrap_or(10.0);
                return (
                    TT_MINUS_TAI_S + leap - self.dut1_s,
                    DeltaTSource::LeapSeconds,
                );
            }
        }
        let e = delta_t_estimate(tt.decimal_year());
        (e.delta_t_s, e.basis.into())
    }

    /// The standard uncertainty of Delta T at an instant, in seconds: 0 for a fixed value
    /// (it counts as exact), 0.01 s with DUT1 given, else the built-in model's published
    /// uncertainty (see `delta_t.rs`).
    pub fn delta_t_sigma_s(&self, tt: Tt) -> f64 {
        match self.delta_t_s(tt).1 {
            DeltaTSource::Fixed => 0.0,
            DeltaTSource::LeapSeconds => 0.01,
            _ => delta_t_estimate(tt.decimal_year()).sigma_s,
        }
    }

    /// UT1 - label (seconds) at an instant: 0 before 1972, where labels are UT1; from 1972,
    /// UT1 - UTC = 32.184 s + (TAI - UTC) - Delta T (within 0.9 s in the leap-second era,
    /// minutes after it: the labels stay tied to TT while UT1 follows the Earth).
    pub fn ut1_minus_label_s(&self, tt: Tt) -> f64 {
        let label = self.label_from_tt(tt);
        if label < Self::leap_era_start() {
            return 0.0;
        }
        let leap = tai_minus_utc_s(label).unwrap_or(10.0);
        TT_MINUS_TAI_S + leap - self.delta_t_s(tt).0
    }

    /// The UT1 label of a time label (UTC from 1972, UT1 before): local solar time is always
    /// reckoned from UT1.
    pub fn ut1_of_label(&self, label: NaiveDateTime) -> Result<NaiveDateTime> {
        let tt = self.tt_from_label(label)?;
        Ok(label + seconds_delta(self.ut1_minus_label_s(tt)))
    }

    /// The time label of a UT1 instant (the inverse of [`TimeModel::ut1_of_label`], by two
    /// passes: UT1 - UTC changes by milliseconds a day).
    pub fn label_of_ut1(&self, ut1: NaiveDateTime) -> Result<NaiveDateTime> {
        let mut label = ut1;
        for _ in 0..2 {
            let tt = self.tt_from_label(label)?;
            label = ut1 - seconds_delta(self.ut1_minus_label_s(tt));
        }
        Ok(label)
    }

    /// UT1 as a two-part Julian date for an instant of TT.
    pub fn ut1_jd_pair(&self, tt: Tt) -> (f64, f64) {
        let (dt, _) = self.delta_t_s(tt);
        tt.add_seconds(-dt).jd_pair()
    }
}

/// A number of seconds as a chrono duration, to the nanosecond.
fn seconds_delta(s: f64) -> TimeDelta {
    TimeDelta::nanoseconds((s * 1e9).round() as i64)
}

fn check_label_year(label: NaiveDateTime) -> Result<()> {
    use chrono::Datelike;
    check_year(label.year())
}

/// Check that a year lies within [`MIN_YEAR`]..=[`MAX_YEAR`].
pub fn check_year(y: i32) -> Result<()> {
    if !(MIN_YEAR..=MAX_YEAR).contains(&y) {
        return Err(Error::OutOfRange {
            what: "year".into(),
            value: y.to_string(),
            min: MIN_YEAR.to_string(),
            max: MAX_YEAR.to_string(),
        });
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::time::iso::parse_utc;

    fn label(text: &str) -> NaiveDateTime {
        parse_utc(text).unwrap()
    }

    #[test]
    fn utc_tt_round_trip_is_exact_to_a_microsecond() {
        let model = TimeModel::default();
        for text in [
            "1631-12-07T05:19:00.123456Z",
            "1769-06-03T22:25:41.3Z",
            "1971-12-31T23:59:59.9Z",
            "1972-01-01T00:00:00.000001Z",
            "2012-06-05T22:25:41.3Z",
            "2117-12-11T02:48:00.5Z",
            "2299-12-31T23:00:00Z",
        ] {
            let utc = label(text);
            let tt = model.tt_from_label(utc).unwrap();
            let back = model.label_from_tt(tt);
            let diff_ns = (back - utc).num_nanoseconds().unwrap();
            assert!(diff_ns.abs() <= 1000, "{text}: {diff_ns} ns");
        }
    }

    #[test]
    fn tt_minus_utc_in_2012_is_66_184_s() {
        // Source: IERS Bulletin C (TAI - UTC = 34 s until 2012-06-30) and IAU 1991
        // Resolution A4 (TT - TAI = 32.184 s).
        let model = TimeModel::default();
        let utc = label("2012-06-06T00:00:00Z");
        let tt = model.tt_from_label(utc).unwrap();
        let back = Tt::from_j2000_seconds(label_seconds(utc));
        assert!((tt.seconds_since(back) - 66.184).abs() < 1e-6);
        // Delta T is the observed one (IERS): TT - UT1 = 66.184 s - DUT1, and DUT1 was
        // about -0.58 s then (Skyfield 1.53's IERS table gives Delta T 66.762 s on June 6,
        // tests/reference/delta_t_skyfield.csv).
        let (dt, source) = model.delta_t_s(tt);
        assert_eq!(source, DeltaTSource::Observed);
        assert!((dt - 66.762).abs() < 0.02, "{dt}");
        assert!((model.ut1_minus_label_s(tt) + 0.578).abs() < 0.02);
    }

    #[test]
    fn before_1972_labels_are_ut1() {
        let model = TimeModel::fixed(-3.0);
        let ut1 = label("1874-12-09T02:00:00Z");
        let tt = model.tt_from_label(ut1).unwrap();
        let (uta, utb) = model.ut1_jd_pair(tt);
        let (a, b) = Tt::from_j2000_seconds(label_seconds(ut1)).jd_pair();
        assert!(((uta - a) + (utb - b)).abs() * SECONDS_PER_DAY < 1e-6);
    }

    #[test]
    fn years_outside_the_range_are_refused() {
        let model = TimeModel::default();
        assert!(model.tt_from_label(label("1599-12-31T00:00:00Z")).is_err());
        assert!(model.tt_from_label(label("2301-01-01T00:00:00Z")).is_err());
    }

    #[test]
    fn delta_t_uncertainty_is_the_published_one() {
        // Fixed values are exact; with DUT1 given, 0.01 s; otherwise the model's published
        // uncertainty (delta_t.rs): 0.05 s in 1874 (the authors' epsilon), under 0.01 s in
        // 2012 (IERS observations), tens of seconds in 2117 (published predictions diverge).
        let model = TimeModel::default();
        let at = |t: &str| model.delta_t_sigma_s(model.tt_from_label(label(t)).unwrap());
        assert_eq!(
            TimeModel::fixed(-3.0).delta_t_sigma_s(Tt::from_jd(2_405_866.67)),
            0.0
        );
        assert_eq!(at("1874-12-09T04:00:00Z"), 0.05);
        assert!(at("2012-06-06T01:00:00Z") < 0.01);
        assert!((30.0..150.0).contains(&at("2117-12-11T03:00:00Z")));
        let with_dut1 = TimeModel {
            dut1_s: 0.3,
            ..TimeModel::default()
        };
        let tt = with_dut1
            .tt_from_label(label("2012-06-06T01:00:00Z"))
            .unwrap();
        assert_eq!(
            with_dut1.delta_t_s(tt),
            (66.184 - 0.3, DeltaTSource::LeapSeconds)
        );
        assert_eq!(with_dut1.delta_t_sigma_s(tt), 0.01);
    }

    #[test]
    fn local_time_is_reckoned_from_ut1_in_every_era() {
        // After the leap-second table the labels stay UTC, tied to TT (TT - UTC = 69.184 s),
        // while UT1 = TT - Delta T: with Delta T fixed at 240 s, UT1 - UTC = -170.816 s
        // (the definitions of IAU 1991 A4 and IERS Bulletin C; the oracle is arithmetic).
        let model = TimeModel::fixed(240.0);
        let utc = label("2117-12-11T03:00:00Z");
        let ut1 = model.ut1_of_label(utc).unwrap();
        assert!(((ut1 - utc).num_milliseconds() as f64 / 1000.0 + 170.816).abs() < 1e-6);
        assert_eq!(model.label_of_ut1(ut1).unwrap(), utc);
        // Before 1972 the label is UT1 already.
        let ut1 = label("1769-06-03T19:30:00Z");
        assert_eq!(TimeModel::default().ut1_of_label(ut1).unwrap(), ut1);
    }

    #[test]
    fn dut1_and_delta_t_are_validated() {
        assert!(TimeModel {
            delta_t_override_s: None,
            dut1_s: 0.95,
            ..TimeModel::default()
        }
        .validate()
        .is_err());
        assert!(TimeModel::fixed(f64::NAN).validate().is_err());
        assert!(TimeModel::fixed(67.0).validate().is_ok());
        // Regression: --dut1 with --delta-t, or before 1972, is refused.
        let both = TimeModel {
            delta_t_override_s: Some(67.0),
            dut1_s: 0.3,
            ..TimeModel::default()
        };
        assert!(both.validate().is_err());
        let dut1 = TimeModel {
            delta_t_override_s: None,
            dut1_s: 0.3,
            ..TimeModel::default()
        };
        assert!(dut1.validate().is_ok());
        assert!(dut1.validate_for_year(1882).is_err());
        assert!(dut1.validate_for_year(2012).is_ok());
    }
}
