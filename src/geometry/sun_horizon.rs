//! Sunrise and sunset at a station during a transit: the instants between two contacts at which
//! the Sun's upper limb crosses the horizon, for the observers' sheets.
//!
//! The rule is the almanacs' standard one: the Sun rises or sets when the true (geometric)
//! altitude of its centre is -0°50′, which allows 34′ for refraction at the horizon and 16′ for
//! the Sun's semidiameter; the station's height (dip of the horizon) is not allowed for.
//!
//! References: J. Meeus, *Astronomical Algorithms*, 2nd ed. (1998), chapter 15 ("Rising,
//! Transit and Setting"), the standard altitude h0 = -0°50′ for the Sun.

use crate::geometry::contacts::sun_alt_az_parallactic;
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;

/// The true altitude of the Sun's centre at which its upper limb is on the horizon, degrees:
/// -0°50′ (Meeus 1998, ch. 15).
pub const SUNRISE_ALTITUDE_DEG: f64 = -50.0 / 60.0;

/// Step of the search for horizon crossings, hours (5 minutes: the Sun's altitude changes
/// direction far more slowly, so no pair of crossings hides between two samples).
const SEARCH_STEP_H: f64 = 5.0 / 60.0;

/// Bisection stops when the bracket is shorter than this, hours (0.01 s).
const BISECTION_TOLERANCE_H: f64 = 0.01 / 3600.0;

/// One crossing of the horizon by the Sun's upper limb.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct HorizonCrossing {
    /// Hours from the elements' epoch (as a contact's `hours`).
    pub hours: f64,
    /// `true` for sunrise, `false` for sunset.
    pub rising: bool,
}

/// What the Sun does between two contacts at a station.
#[derive(Clone, Debug, PartialEq)]
pub enum SunDuring {
    /// The upper limb is above the horizon throughout.
    UpThroughout,
    /// The upper limb is below the horizon throughout.
    DownThroughout,
    /// The Sun rises or sets (or both) in between, in time order.
    Crossings(Vec<HorizonCrossing>),
}

/// Whether the Sun is up (its upper limb above the horizon, the rule of
/// [`SUNRISE_ALTITUDE_DEG`]) at this true altitude of its centre, degrees.
pub fn sun_is_up(sun_altitude_deg: f64) -> bool {
    sun_altitude_deg > SUNRISE_ALTITUDE_DEG
}

/// A root of `f` in `[a_h, b_h]` by bisection, where `f(a_h)` and `f(b_h)` differ in sign.
///
/// Arguments: `f`, a continuous function of hours; `a_h < b_h`, the bracket, hours.
/// Returns: an hour within 0.01 s of the root.
/// References: any numerical text, e.g. W. H. Press et al., *Numerical Recipes*, 3rd ed.
/// (2007), section 9.1.
pub fn bisect_hours(f: impl Fn(f64) -> f64, a_h: f64, b_h: f64) -> f64 {
    let (mut lo, mut hi) = (a_h, b_h);
    let f_lo_negative = f(lo) < 0.0;
    while hi - lo > BISECTION_TOLERANCE_H {
        let mid = 0.5 * (lo + hi);
        if (f(mid) < 0.0) == f_lo_negative {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi)
}

/// Sunrises and sunsets at a station between two instants of a transit.
///
/// Arguments: `event`; `station`; `from_h` and `to_h`, hours from the elements' epoch (the
/// contacts I and IV), within the interval the elements cover.
/// Returns: [`SunDuring`]: up or down throughout, or each crossing of the horizon by the Sun's
/// upper limb (true altitude of the centre -0°50′), found by sampling every 5 minutes and
/// bisecting each change of sign to 0.01 s.
/// Notes: altitudes are topocentric against the geodetic horizon, as the contacts' are.
/// References: Meeus (1998), ch. 15, for the standard altitude.
pub fn sun_during(event: &TransitEvent, station: &Station, from_h: f64, to_h: f64) -> SunDuring {
    let geo = station.geocentric();
    let above =
        |hours: f64| sun_alt_az_parallactic(&event.elements, &geo, hours).0 - SUNRISE_ALTITUDE_DEG;
    let steps = (((to_h - from_h) / SEARCH_STEP_H).ceil() as usize).max(1);
    let step_h = (to_h - from_h) / steps as f64;
    let mut crossings = Vec::new();
    let mut prev_h = from_h;
    let mut prev = above(from_h);
    for k in 1..=steps {
        let next_h = from_h + step_h * k as f64;
        let next = above(next_h);
        if (prev < 0.0) != (next < 0.0) {
            crossings.push(HorizonCrossing {
                hours: bisect_hours(above, prev_h, next_h),
                rising: prev < 0.0,
            });
        }
        (prev_h, prev) = (next_h, next);
    }
    match (crossings.is_empty(), above(from_h) > 0.0) {
        (false, _) => SunDuring::Crossings(crossings),
        (true, true) => SunDuring::UpThroughout,
        (true, false) => SunDuring::DownThroughout,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn bisection_finds_a_known_root_to_the_tolerance() {
        // cos(h) has its root at pi/2 hours.
        let root_h = bisect_hours(f64::cos, 1.0, 2.0);
        assert!((root_h - std::f64::consts::FRAC_PI_2).abs() < BISECTION_TOLERANCE_H);
        // Either sign at the start.
        let root_h = bisect_hours(|h| -h.cos(), 1.0, 2.0);
        assert!((root_h - std::f64::consts::FRAC_PI_2).abs() < BISECTION_TOLERANCE_H);
    }

    #[test]
    fn a_crossing_lies_where_the_altitude_is_the_standard_one() {
        // Hong Kong sees the Sun set during the transit of Mercury of 2032 (about 09:45 UTC).
        let event = crate::transit_on_date(
            crate::Planet::Mercury,
            crate::time::iso::parse_date("2032-11-13").expect("date"),
            &crate::time::scales::TimeModel::default(),
        )
        .expect("transit");
        let station = Station {
            name: "Hong Kong".into(),
            latitude_deg: 22.28,
            longitude_deg: 114.16,
            elevation_m: 40.0,
        };
        let c1 = event.predict(&station).contacts[0]
            .expect("contact I")
            .hours;
        let c4 = event.predict(&station).contacts[3]
            .expect("contact IV")
            .hours;
        let SunDuring::Crossings(found) = sun_during(&event, &station, c1, c4) else {
            panic!("the Sun sets at Hong Kong during the transit");
        };
        assert_eq!(found.len(), 1);
        assert!(!found[0].rising);
        let alt_deg =
            sun_alt_az_parallactic(&event.elements, &station.geocentric(), found[0].hours).0;
        assert!((alt_deg - SUNRISE_ALTITUDE_DEG).abs() < 1e-4, "{alt_deg}");
        assert!(sun_is_up(0.0) && !sun_is_up(-0.9));
    }
}
