//! The one rule, shared by the service's instant feedback and the reduction's screening, for
//! whether a contact occurs at a station and whether a timing agrees with its prediction.
//!
//! - Occurrence is decided by the ephemeris at the nominal parameters (the IAU parallax, the
//!   ephemeris's place of the planet, the nominal radii), never by a solution that blunders
//!   may have dragged: a contact the prediction gives is never called "does not occur".
//! - Agreement: the timing's own standard uncertainty combined in quadrature with
//!   [`MODEL_ALLOWANCE_S`] for what the prediction does not know is its tolerance sigma;
//!   within [`FIT_SIGMAS`] of those it *fits*, within [`DOUBT_SIGMAS`] of them or
//!   [`DOUBT_FLOOR_S`] it is *doubtful*, beyond it is *rejected*: a gross blunder, which the
//!   reduction screens before the first fit so that it cannot drag the solution.
//!
//! References: the 3-sigma rule for a single normal deviate (Bevington and Robinson, *Data
//! Reduction and Error Analysis*, 3rd ed., 2003, section 2.3); the allowance, the 10-sigma
//! and 2-minute bounds are round figures of ours (common practice of screening pooled
//! timings, no single source): a parallax wrong by a few per cent moves no contact by more
//! than about 20 s, a clock or zone blunder by whole minutes or hours.

use crate::geometry::contacts::{Contact, Perturbation};
use crate::geometry::station::GeocentricStation;
use crate::geometry::transit::TransitEvent;
use crate::observations::longitude::LongitudeKnowledge;
use crate::observations::timings::Observation;

/// The allowance for what the prediction does not know (the parallax to a few tenths of a
/// per cent, the black drop), seconds; a round figure of ours.
pub const MODEL_ALLOWANCE_S: f64 = 4.0;
/// Within this many tolerance sigmas a timing fits.
pub const FIT_SIGMAS: f64 = 3.0;
/// Within this many tolerance sigmas (or [`DOUBT_FLOOR_S`]) a timing is doubtful; beyond, a
/// gross blunder.
pub const DOUBT_SIGMAS: f64 = 10.0;
/// The least distance from the prediction at which a timing is a gross blunder, seconds.
pub const DOUBT_FLOOR_S: f64 = 120.0;

/// How a timing stands against its prediction (the service's `verdict`).
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord)]
pub enum Agreement {
    /// Within [`FIT_SIGMAS`] tolerance sigmas.
    Fits,
    /// Further, but within [`DOUBT_SIGMAS`] of them or [`DOUBT_FLOOR_S`].
    Doubtful,
    /// Beyond: a gross blunder (or no prediction to compare with).
    Rejected,
}

impl Agreement {
    /// The word of the service's JSON: `fits`, `doubtful`, `rejected`.
    pub fn as_str(self) -> &'static str {
        match self {
            Agreement::Fits => "fits",
            Agreement::Doubtful => "doubtful",
            Agreement::Rejected => "rejected",
        }
    }
}

/// The tolerance sigma of a timing, seconds: its own standard uncertainty `sigma_s` and
/// [`MODEL_ALLOWANCE_S`] in quadrature.
pub fn tolerance_sigma_s(sigma_s: f64) -> f64 {
    sigma_s.hypot(MODEL_ALLOWANCE_S)
}

/// The distance from the prediction beyond which a timing of uncertainty `sigma_s` is a gross
/// blunder, seconds: the larger of [`DOUBT_SIGMAS`] tolerance sigmas and [`DOUBT_FLOOR_S`].
pub fn gross_limit_s(sigma_s: f64) -> f64 {
    (DOUBT_SIGMAS * tolerance_sigma_s(sigma_s)).max(DOUBT_FLOOR_S)
}

/// How a timing agrees with its prediction.
///
/// Arguments: `o_c_s`, observed minus predicted (s); `sigma_s`, the timing's standard
/// uncertainty (s).
/// Returns: [`Agreement::Fits`] within [`FIT_SIGMAS`] tolerance sigmas, [`Agreement::Doubtful`]
/// within [`gross_limit_s`], else [`Agreement::Rejected`] (also for a value that is not a
/// number).
/// References: see the module's.
pub fn agreement(o_c_s: f64, sigma_s: f64) -> Agreement {
    let off_s = o_c_s.abs();
    if off_s <= FIT_SIGMAS * tolerance_sigma_s(sigma_s) {
        Agreement::Fits
    } else if off_s <= gross_limit_s(sigma_s) {
        Agreement::Doubtful
    } else {
        Agreement::Rejected
    }
}

/// A contact's time at a station by the ephemeris at the nominal parameters, hours from the
/// elements' epoch (TT), or `None` when the contact does not occur there (the planet's path as
/// seen from the station misses that circle).
///
/// Arguments: `event`; `geo`, the station's geocentric coordinates as given; `contact`.
/// References: the contact condition of the fundamental plane (W. Chauvenet, *A Manual of
/// Spherical and Practical Astronomy*, 1863, vol. I, the chapter on transits), solved by
/// [`TransitEvent::contact_hours_perturbed`].
pub fn nominal_contact_hours(
    event: &TransitEvent,
    geo: &GeocentricStation,
    contact: Contact,
) -> Option<f64> {
    event.contact_hours_perturbed(geo, contact, &Perturbation::NOMINAL)
}

/// Whether the shared rule compares a timing with its nominal prediction: an instant in UTC
/// (or UT1) at a station whose longitude is taken as exact. Not an interval, a local solar time
/// or a longitude to be solved for (their offset from the nominal prediction is partly what
/// the fit is to find).
pub fn compared_at_nominal(obs: &Observation) -> bool {
    obs.duration.is_none() && obs.local.is_none() && obs.longitude == LongitudeKnowledge::Exact
}

/// A timing's O - C against the nominal prediction, seconds, where the shared rule applies
/// ([`compared_at_nominal`]); `None` otherwise, or where the contact does not occur.
///
/// Arguments: `event`; `obs`, the timing as read; `observed_h`, its instant in hours from the
/// elements' epoch (TT).
pub fn nominal_o_c_s(event: &TransitEvent, obs: &Observation, observed_h: f64) -> Option<f64> {
    if !compared_at_nominal(obs) {
        return None;
    }
    let h = nominal_contact_hours(event, &obs.station.geocentric(), obs.contact)?;
    Some((observed_h - h) * 3600.0)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::station::Station;
    use crate::{transit_on_date, Planet, TimeModel};

    // Common practice, no source: the thresholds as documented.
    #[test]
    fn the_thresholds_of_the_rule() {
        // sigma 8 s: tolerance sigma 8.94 s, fits to 26.8 s, doubtful to 120 s.
        assert_eq!(agreement(3.0, 8.0), Agreement::Fits);
        assert_eq!(agreement(-26.0, 8.0), Agreement::Fits);
        assert_eq!(agreement(28.0, 8.0), Agreement::Doubtful);
        assert_eq!(agreement(-119.0, 8.0), Agreement::Doubtful);
        assert_eq!(agreement(121.0, 8.0), Agreement::Rejected);
        // sigma 20 s: ten tolerance sigmas (204 s) exceed the floor.
        assert_eq!(agreement(200.0, 20.0), Agreement::Doubtful);
        assert_eq!(agreement(f64::NAN, 8.0), Agreement::Rejected);
        assert!((gross_limit_s(20.0) - 10.0 * 20.0f64.hypot(4.0)).abs() < 1e-9);
        assert_eq!(Agreement::Doubtful.as_str(), "doubtful");
    }

    #[test]
    fn occurrence_is_the_prediction_s() {
        let date = chrono::NaiveDate::from_ymd_opt(2012, 6, 6).unwrap();
        let event = transit_on_date(Planet::Venus, date, &TimeModel::default()).unwrap();
        let st = Station::new("Jade Harbour School", 22.28, 114.16, 40.0).unwrap();
        let p = event.predict(&st);
        for c in Contact::ALL {
            let h = nominal_contact_hours(&event, &st.geocentric(), c).expect("occurs");
            let predicted = p.contacts[c.index()].expect("predicted").hours;
            assert!((h - predicted).abs() * 3600.0 < 0.01, "{c:?}");
        }
    }
}
