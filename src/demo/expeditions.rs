//! The historical-style demonstration: an invented network of expeditions (fictional names)
//! timing the real transit of Venus of 1769 June 3-4 with clocks kept to local apparent or
//! mean time (one kept to another station's meridian), some in astronomical day reckoning,
//! three dating Old Style, their longitudes known to about a quarter of a degree (some written
//! from Paris or in hours of time), two stations whose longitude is unknown, several observers
//! at three stations judging the interior contacts as the thread of light or the limbs
//! touching, readings given as ranges, and one station that reports only the interval
//! between the interior contacts. Simulated with the library's own simulator and recorded with
//! `planning::historical`: every column of records as the 18th century wrote them appears.

use crate::error::Result;
use crate::geometry::contacts::Contact;
use crate::geometry::station::stations_from_table;
use crate::geometry::transit::{transit_on_date, TransitEvent};
use crate::observations::contact_forms::ContactJudged;
use crate::observations::csv_table::CsvTable;
use crate::planning::historical::{record_historically, HistoricalStyle};
use crate::planning::simulation::{campaign_csv, simulate_campaign, SimulationSettings};
use crate::time::scales::TimeModel;
use crate::Planet;
use rand::SeedableRng;
use std::path::Path;

/// The expeditions' stations, embedded in the binary.
pub const EXPEDITIONS_NETWORK_CSV: &str = include_str!("../data/expeditions_1769_network.csv");

/// The expeditions' timings, embedded in the binary (made by [`generate_expeditions_campaign`];
/// a unit test checks that it still reproduces).
pub const EXPEDITIONS_CAMPAIGN_CSV: &str = include_str!("../data/expeditions_1769_campaign.csv");

/// Seed of the expeditions' campaign.
pub const EXPEDITIONS_SEED: u64 = 17_690_603;

/// The transit of 1769 (greatest transit June 3, 22:25 UT1).
pub fn expeditions_date() -> chrono::NaiveDate {
    chrono::NaiveDate::from_ymd_opt(1769, 6, 3).unwrap_or_default()
}

fn expeditions_event() -> Result<TransitEvent> {
    transit_on_date(Planet::Venus, expeditions_date(), &TimeModel::default())
}

/// Timings good to 12 s at the exterior and 9 s at the interior contacts, no blunders: an
/// 18th-century expedition's pendulum clock and telescope (a round figure of ours; the
/// reductions of the time quote scatters of this size, from memory). The black drop enters
/// through each observer's judgement ([`expeditions_style`]).
pub fn expeditions_settings() -> SimulationSettings {
    SimulationSettings {
        sigma_s: [12.0, 9.0, 9.0, 12.0],
        black_drop_bias_s: 0.0,
        min_altitude_deg: 3.0,
        ..SimulationSettings::default()
    }
}

/// The observers of the stations with more than one (plainly descriptive roles, no names):
/// the first of each list is the station's principal observer.
pub const EXPEDITION_OBSERVERS: [(&str, &[&str]); 3] = [
    (
        "Coral Lagoon Fort",
        &["astronomer", "captain", "naturalist"],
    ),
    ("Ice Bay Factory", &["first observer", "second observer"]),
    ("Neva Island Academy", &["academician", "adjunct"]),
];

/// Longitudes recorded to 0.25 degree; six stations at established observatories and trading
/// posts whose longitudes are known exactly; two stations recorded as of unknown longitude,
/// their written longitudes 1.6 degrees east and 2.1 degrees west of the truth.
pub fn expeditions_style() -> HistoricalStyle {
    HistoricalStyle {
        longitude_sigma_deg: 0.25,
        unknown_longitudes: vec![
            ("Volcano Harbour".into(), 1.6),
            ("Sandalwood Bay".into(), -2.1),
        ],
        exact_longitudes: [
            "Quaker River House",
            "Harbour Hill College",
            "Neva Island Academy",
            "Ice Bay Factory",
            "Lantern Mission",
            "Ural Ironworks",
        ]
        .map(String::from)
        .to_vec(),
        apparent_share: 0.5,
        astronomical_share: 0.4,
        julian_calendar: ["Neva Island Academy", "Ural Ironworks", "Lena River Fort"]
            .map(String::from)
            .to_vec(),
        paris_longitudes: ["Lantern Mission", "Midnight Cape Camp"]
            .map(String::from)
            .to_vec(),
        longitudes_in_time: ["Coral Lagoon Fort", "Ice Bay Factory"]
            .map(String::from)
            .to_vec(),
        // Lena River Fort's clock kept the mean time of the academy's meridian.
        clock_meridians: vec![("Lena River Fort".into(), 30.30)],
        durations_only: vec!["Fjord Mouth Post".into()],
        range_share: 0.1,
        judgements: vec![
            ("astronomer".into(), ContactJudged::Thread),
            ("captain".into(), ContactJudged::Touch),
            ("first observer".into(), ContactJudged::Thread),
            ("second observer".into(), ContactJudged::Thread),
            ("academician".into(), ContactJudged::Touch),
        ],
        // Invented lags within the 10-30 s of 18th-century reports.
        lags: vec![
            (ContactJudged::Thread, Contact::II, 12.0),
            (ContactJudged::Thread, Contact::III, -10.0),
            (ContactJudged::Touch, Contact::II, 25.0),
            (ContactJudged::Touch, Contact::III, -22.0),
        ],
    }
}

/// Every observer's timings: the principal observers' from one simulated run over the whole
/// network, the others' from runs of their own over their stations (independent errors).
fn observers_campaign<R: rand::Rng>(
    event: &TransitEvent,
    stations: &[crate::Station],
    rng: &mut R,
) -> crate::planning::simulation::SimulatedCampaign {
    let settings = expeditions_settings();
    let mut campaign = simulate_campaign(event, stations, &settings, rng);
    let name_of = |station: &str, k: usize| {
        EXPEDITION_OBSERVERS
            .iter()
            .find(|(s, _)| *s == station)
            .and_then(|(_, o)| o.get(k))
            .map_or(String::new(), |o| o.to_string())
    };
    for o in &mut campaign.observations.valid {
        o.observer = name_of(&o.station.name, 0);
    }
    for k in 1..3 {
        let more: Vec<crate::Station> = stations
            .iter()
            .filter(|s| !name_of(&s.name, k).is_empty())
            .cloned()
            .collect();
        let extra = simulate_campaign(event, &more, &settings, rng);
        for mut o in extra.observations.valid {
            o.observer = name_of(&o.station.name, k);
            campaign.observations.valid.push(o);
        }
    }
    // Rows in the order of the network, each station's observers together.
    let order = |name: &str| stations.iter().position(|s| s.name == name).unwrap_or(0);
    campaign
        .observations
        .valid
        .sort_by_key(|o| (order(&o.station.name), o.observer.clone(), o.contact));
    campaign.observations.rows_total = campaign.observations.valid.len();
    campaign
}

/// Simulate and record the expeditions' campaign from the embedded network (deterministic).
pub fn generate_expeditions_campaign() -> Result<String> {
    let table = CsvTable::from_bytes(
        Path::new("<expeditions network>"),
        EXPEDITIONS_NETWORK_CSV.as_bytes(),
    )?;
    let stations = stations_from_table(&table)?;
    let event = expeditions_event()?;
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(EXPEDITIONS_SEED);
    let campaign = observers_campaign(&event, &stations, &mut rng);
    let recorded =
        record_historically(campaign, &expeditions_style(), event.time_model(), &mut rng);
    let mut text = String::from(
        "# Simulated timings of an invented network of expeditions (fictional stations and observers)\n\
         # for the transit of Venus of 1769 June 3-4, as recorded: local apparent or mean time (one clock\n\
         # kept to another station's meridian), some days reckoned from noon, Old Style dates, longitudes\n\
         # doubtful or unknown, from Paris or in hours of time, several observers judging the interior\n\
         # contacts their own ways, readings as ranges, a station reporting only durations. Made by\n\
         # transit-parallax's simulator (src/demo/expeditions.rs, generate_expeditions_campaign).\n",
    );
    text.push_str(&campaign_csv(&recorded.observations));
    Ok(text)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_embedded_campaign_reproduces() {
        assert_eq!(
            generate_expeditions_campaign().unwrap(),
            EXPEDITIONS_CAMPAIGN_CSV
        );
    }
}
