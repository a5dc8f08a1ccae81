//! The blunders of one timing alone, named: the date off by a day, half a day (civil and
//! astronomical day reckoning confused, or a.m. and p.m.), a time zone left in (whole or half
//! hours), the contact mislabelled, a digit of the minutes mistyped. Each is a value the
//! reduction writes as an English sentence ([`RowBlunder::sentence`]) and the service words in
//! the participant's language.
//!
//! The blunders and their signatures are common practice, no single source (see
//! docs/reduction.md, "Blunders").

use crate::geometry::contacts::{Contact, Perturbation};
use crate::geometry::station::{GeocentricStation, Station};
use crate::geometry::transit::TransitEvent;

/// A blunder of one timing that explains its difference from its prediction.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum RowBlunder {
    /// The date is off by one day; `miss_s` how far the corrected timing stays off.
    DateOff {
        /// Observed minus predicted, seconds.
        o_c_s: f64,
        /// The corrected timing's distance from its prediction, seconds.
        miss_s: f64,
    },
    /// Half a day off: civil and astronomical day reckoning confused, or a.m. and p.m.
    HalfDay {
        /// Observed minus predicted, seconds.
        o_c_s: f64,
    },
    /// A whole number of hours: a time zone left in (`hours` signed as O - C).
    ZoneHours {
        /// Observed minus predicted, seconds.
        o_c_s: f64,
        /// The whole hours, signed.
        hours: f64,
    },
    /// An odd number of half hours: a half-hour time zone left in (`hours` signed as O - C).
    HalfHourZone {
        /// Observed minus predicted, seconds.
        o_c_s: f64,
        /// The hours (a whole number and a half), signed.
        hours: f64,
    },
    /// The timing fits another contact at the station.
    ContactsExchanged {
        /// The contact as labelled.
        labelled: Contact,
        /// The contact it fits.
        fits: Contact,
        /// Observed minus the prediction of the contact it fits, seconds.
        o_c_s: f64,
    },
    /// A whole number of minutes (1-9, or 10-50 by tens): a digit of the minutes mistyped.
    MinuteTypo {
        /// Observed minus predicted, seconds.
        o_c_s: f64,
        /// The whole minutes, signed.
        minutes: f64,
        /// The corrected timing's distance from its prediction, seconds.
        miss_s: f64,
    },
}

impl RowBlunder {
    /// The blunder in the reduction's English sentence.
    pub fn sentence(&self) -> String {
        let fix = |x: f64| if x > 0.0 { "subtract" } else { "add" };
        match *self {
            RowBlunder::DateOff { o_c_s, miss_s } => format!(
                "the timing is {o_c_s:+.0} s from its prediction, one day within {miss_s:.0} s: the date is probably off by one day ({})",
                if o_c_s > 0.0 { "a day late" } else { "a day early" }
            ),
            RowBlunder::HalfDay { o_c_s } => format!(
                "O - C is {:+.3} h, half a day: civil and astronomical day reckoning were probably confused (an astronomical day begins at noon: astronomical June 3, 21 h is civil June 4, 9 h; set day_reckoning to {}), or a.m. and p.m. on a modern clock",
                o_c_s / 3600.0,
                if o_c_s > 0.0 {
                    "civil if the rows say astronomical"
                } else {
                    "astronomical if the rows say civil"
                }
            ),
            RowBlunder::ZoneHours { o_c_s, hours } => format!(
                "O - C is {:+.3} h, a whole number of hours: local (zone) time was probably given as UTC; {} {:.0} h to correct it",
                o_c_s / 3600.0,
                fix(hours),
                hours.abs()
            ),
            RowBlunder::HalfHourZone { o_c_s, hours } => format!(
                "O - C is {:+.3} h, a whole number of half hours: a half-hour time zone was probably left in; {} {:.1} h to correct it",
                o_c_s / 3600.0,
                fix(hours),
                hours.abs()
            ),
            RowBlunder::ContactsExchanged { labelled, fits, o_c_s } => {
                let (a, b) = if labelled < fits { (labelled, fits) } else { (fits, labelled) };
                format!(
                    "labelled contact {} but fits contact {} at this station (O - C {o_c_s:+.1} s): contacts {} and {} were probably exchanged",
                    labelled.roman(),
                    fits.roman(),
                    a.roman(),
                    b.roman()
                )
            }
            RowBlunder::MinuteTypo { o_c_s, minutes, miss_s } => format!(
                "O - C is {o_c_s:+.1} s, {} within {miss_s:.0} s: a digit of the minutes was probably mistyped; {} {:.0} min to correct it",
                crate::words::count(minutes.abs() as usize, "whole minute", "whole minutes"),
                fix(minutes),
                minutes.abs()
            ),
        }
    }
}

/// Predicted contact time (hours from the elements' epoch) for a station and contact under
/// trial parameters, or `None` when the station sees no such contact.
pub(crate) fn predicted_hours(
    event: &TransitEvent,
    geo: &GeocentricStation,
    c: Contact,
    p: &Perturbation,
) -> Option<f64> {
    event.contact_hours_perturbed(geo, c, p)
}

/// A timing off its prediction by `r_s` that a slip of the date, the day reckoning or the
/// time zone explains within `tolerance_s`. The astronomical day of a date begins at its
/// noon (common practice of observatories until 1925, no source).
fn clock_slip(r_s: f64, tolerance_s: f64) -> Option<RowBlunder> {
    for days in [-1.0f64, 1.0] {
        let miss_s = (r_s - 86_400.0 * days).abs();
        if miss_s < tolerance_s {
            return Some(RowBlunder::DateOff { o_c_s: r_s, miss_s });
        }
    }
    if [-1.0f64, 1.0]
        .iter()
        .any(|s| (r_s - 43_200.0 * s).abs() < tolerance_s)
    {
        return Some(RowBlunder::HalfDay { o_c_s: r_s });
    }
    let hours = (r_s / 3600.0).round();
    if (1.0..=14.0).contains(&hours.abs()) && (r_s - 3600.0 * hours).abs() < tolerance_s {
        return Some(RowBlunder::ZoneHours { o_c_s: r_s, hours });
    }
    let halves = (r_s / 1800.0).round();
    if halves.abs() <= 29.0
        && (halves as i64) % 2 != 0
        && (r_s - 1800.0 * halves).abs() < tolerance_s
    {
        return Some(RowBlunder::HalfHourZone {
            o_c_s: r_s,
            hours: halves / 2.0,
        });
    }
    None
}

/// Name the blunder of one timing that does not fit, if a blunder of that timing alone
/// explains it: the date off by a day, half a day, a time zone left in (whole or half hours),
/// the contact mislabelled, or a digit of the minutes mistyped.
///
/// Arguments: `event`; `station`, `contact` as given; `observed_h`, the timing (hours from the
/// elements' epoch, TT); `p`, the solution's parameters; `tolerance_s`, how close a corrected
/// timing must come to its prediction.
pub fn find_row_blunder(
    event: &TransitEvent,
    station: &Station,
    contact: Contact,
    observed_h: f64,
    p: &Perturbation,
    tolerance_s: f64,
) -> Option<RowBlunder> {
    let geo = station.geocentric();
    if let Some(c_h) = predicted_hours(event, &geo, contact, p) {
        if let Some(b) = clock_slip((observed_h - c_h) * 3600.0, tolerance_s) {
            return Some(b);
        }
    }
    for other in Contact::ALL {
        if other == contact {
            continue;
        }
        if let Some(o_h) = predicted_hours(event, &geo, other, p) {
            let r = (observed_h - o_h) * 3600.0;
            if r.abs() < tolerance_s {
                return Some(RowBlunder::ContactsExchanged {
                    labelled: contact,
                    fits: other,
                    o_c_s: r,
                });
            }
        }
    }
    let c_h = predicted_hours(event, &geo, contact, p)?;
    minute_typo((observed_h - c_h) * 3600.0, tolerance_s.min(15.0))
}

/// A typing slip in the minutes: O - C within `tolerance_s` of 1-9 whole minutes (the last
/// digit) or of 10, 20, 30, 40 or 50 (the tens digit). Common practice, no single source.
pub fn minute_typo(r: f64, tolerance_s: f64) -> Option<RowBlunder> {
    let minutes = (r / 60.0).round();
    let m = minutes.abs();
    let plausible = (1.0..=9.0).contains(&m) || (m % 10.0 == 0.0 && (10.0..=50.0).contains(&m));
    let miss_s = (r - 60.0 * minutes).abs();
    (plausible && miss_s < tolerance_s).then_some(RowBlunder::MinuteTypo {
        o_c_s: r,
        minutes,
        miss_s,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn half_a_day_names_the_day_reckoning() {
        // An astronomical reading marked civil comes out 12 h early.
        let early = clock_slip(-43_195.0, 30.0).unwrap();
        assert_eq!(early, RowBlunder::HalfDay { o_c_s: -43_195.0 });
        assert!(early
            .sentence()
            .contains("astronomical if the rows say civil"));
        let late = clock_slip(43_210.0, 30.0).unwrap();
        assert!(late
            .sentence()
            .contains("civil if the rows say astronomical"));
        // Eleven hours is a zone left in, not half a day.
        assert!(matches!(
            clock_slip(11.0 * 3600.0, 30.0),
            Some(RowBlunder::ZoneHours { hours, .. }) if hours == 11.0
        ));
    }

    #[test]
    fn slips_of_the_clock_are_named() {
        assert_eq!(
            clock_slip(86_410.0, 30.0),
            Some(RowBlunder::DateOff {
                o_c_s: 86_410.0,
                miss_s: 10.0
            })
        );
        let zone = clock_slip(-5.0 * 3600.0 + 4.0, 30.0).unwrap();
        assert_eq!(zone.sentence(), "O - C is -4.999 h, a whole number of hours: local (zone) time was probably given as UTC; add 5 h to correct it");
        let half = clock_slip(5.5 * 3600.0, 30.0).unwrap();
        assert!(
            half.sentence().contains("subtract 5.5 h"),
            "{}",
            half.sentence()
        );
        let typo = minute_typo(-600.0 + 3.0, 15.0).unwrap();
        assert_eq!(typo.sentence(), "O - C is -597.0 s, 10 whole minutes within 3 s: a digit of the minutes was probably mistyped; add 10 min to correct it");
        assert!(minute_typo(11.0 * 60.0, 15.0).is_none());
    }
}
