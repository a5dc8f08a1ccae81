//! Simulated campaigns recorded as historical expeditions recorded them: clocks kept to local
//! apparent or mean solar time, some in astronomical day reckoning, and longitudes known only
//! to a fraction of a degree or not at all. For demonstrations and for testing the reduction
//! of such timings.
//!
//! A simulated campaign (`simulation::simulate_campaign`) is turned into its historical
//! record: each station's clock shows local time at its true longitude, while the file gives
//! a longitude with an error drawn from the stated uncertainty (or a given error for a
//! station whose longitude is recorded as unknown).
//!
//! References: the definitions of local apparent and mean time and of the astronomical day
//! in the *Explanatory Supplement to the Astronomical Almanac* (1992), section 2.24 (from
//! memory of its content); see `sky::solar_time`.

use super::simulation::SimulatedCampaign;
use crate::observations::local_time::LocalReading;
use crate::observations::longitude::LongitudeKnowledge;
use crate::observations::timings::ObservationSet;
use crate::sky::solar_time::{local_from_label, DayReckoning, LocalTime};
use crate::time::scales::TimeModel;
use rand::Rng;
use rand_distr::{Distribution, Normal};

/// How a simulated campaign is recorded.
#[derive(Clone, Debug, PartialEq)]
pub struct HistoricalStyle {
    /// The stated standard uncertainty of the recorded longitudes, degrees (their errors are
    /// drawn from it); 0 records every longitude exactly.
    pub longitude_sigma_deg: f64,
    /// Stations whose longitude is recorded as unknown, with the error of the longitude
    /// written in the file, degrees east.
    pub unknown_longitudes: Vec<(String, f64)>,
    /// Stations whose longitude is recorded exactly (an established observatory's).
    pub exact_longitudes: Vec<String>,
    /// Probability that a station's clock kept local apparent time (else mean time).
    pub apparent_share: f64,
    /// Probability that a station reckoned astronomical days (else civil).
    pub astronomical_share: f64,
}

impl Default for HistoricalStyle {
    fn default() -> Self {
        HistoricalStyle {
            longitude_sigma_deg: 0.25,
            unknown_longitudes: Vec::new(),
            exact_longitudes: Vec::new(),
            apparent_share: 0.5,
            astronomical_share: 0.3,
        }
    }
}

/// A campaign recorded in the historical style, and the truth it was made from.
#[derive(Clone, Debug)]
pub struct HistoricalCampaign {
    /// The timings as a reduction reads them (local readings, recorded longitudes).
    pub observations: ObservationSet,
    /// Each station's name with its recorded longitude's error (recorded minus true),
    /// degrees.
    pub longitude_errors_deg: Vec<(String, f64)>,
}

/// One station's record: recorded longitude error, knowledge, clock kind and reckoning.
struct StationRecord {
    error_deg: f64,
    knowledge: LongitudeKnowledge,
    kind: LocalTime,
    reckoning: DayReckoning,
}

fn draw_record<R: Rng + ?Sized>(name: &str, style: &HistoricalStyle, rng: &mut R) -> StationRecord {
    let (error_deg, knowledge) = match style.unknown_longitudes.iter().find(|(n, _)| n == name) {
        Some((_, e)) => (*e, LongitudeKnowledge::Unknown),
        None if style.exact_longitudes.iter().any(|n| n == name) => {
            (0.0, LongitudeKnowledge::Exact)
        }
        None if style.longitude_sigma_deg > 0.0 => (
            Normal::new(0.0, style.longitude_sigma_deg)
                .map(|n| n.sample(rng))
                .unwrap_or(0.0),
            LongitudeKnowledge::Sigma(style.longitude_sigma_deg),
        ),
        None => (0.0, LongitudeKnowledge::Exact),
    };
    let kind = if rng.gen::<f64>() < style.apparent_share {
        LocalTime::Apparent
    } else {
        LocalTime::Mean
    };
    let reckoning = if rng.gen::<f64>() < style.astronomical_share {
        DayReckoning::Astronomical
    } else {
        DayReckoning::Civil
    };
    StationRecord {
        error_deg,
        knowledge,
        kind,
        reckoning,
    }
}

/// Record a simulated campaign in the historical style.
///
/// Arguments: `campaign`, made with UT1 (or UTC) labels at true longitudes; `style`; `model`,
/// the time model (for the equation of time); `rng`, a seeded generator.
/// Returns: the campaign as recorded; a timing whose local reading cannot be formed (outside
/// the ephemeris's years) keeps its UT1 label.
pub fn record_historically<R: Rng + ?Sized>(
    campaign: SimulatedCampaign,
    style: &HistoricalStyle,
    model: &TimeModel,
    rng: &mut R,
) -> HistoricalCampaign {
    let mut set = campaign.observations;
    let mut records: Vec<(String, StationRecord)> = Vec::new();
    for o in &mut set.valid {
        let name = o.station.name.clone();
        let k = match records.iter().position(|(n, _)| *n == name) {
            Some(k) => k,
            None => {
                let r = draw_record(&name, style, rng);
                records.push((name, r));
                records.len() - 1
            }
        };
        let rec = &records[k].1;
        let true_longitude = o.station.longitude_deg;
        let recorded = true_longitude + rec.error_deg;
        o.station.longitude_deg = recorded;
        o.longitude = rec.knowledge;
        let Some(civil) = local_from_label(o.time_label, rec.kind, true_longitude, model) else {
            continue;
        };
        let reading = LocalReading::new(rec.reckoning.from_civil(civil), rec.kind, rec.reckoning);
        // The label a reader forms from the reading at the recorded longitude.
        if let Some(label) = reading.label(recorded) {
            o.time_label = label;
            o.local = Some(reading);
        }
    }
    HistoricalCampaign {
        observations: set,
        longitude_errors_deg: records.into_iter().map(|(n, r)| (n, r.error_deg)).collect(),
    }
}
