//! Simulated campaigns recorded as historical expeditions recorded them: clocks kept to local
//! apparent or mean solar time (of the station's meridian, or of another's), some in
//! astronomical day reckoning, some dated Old Style, longitudes known only to a fraction of a
//! degree or not at all and written from Paris or in hours of time, several observers judging
//! the interior contacts in their own ways, readings given as ranges, and stations that report
//! only the interval between the interior contacts. For demonstrations and for testing the
//! reduction of such timings.
//!
//! A simulated campaign (`simulation::simulate_campaign`) is turned into its historical
//! record: each station's clock shows local time at its true longitude (or at the meridian it
//! was kept to), while the file gives a longitude with an error drawn from the stated
//! uncertainty (or a given error for a station whose longitude is recorded as unknown).
//!
//! References: the definitions of local apparent and mean time and of the astronomical day
//! in the *Explanatory Supplement to the Astronomical Almanac* (1992), section 2.24 (from
//! memory of its content); see `sky::solar_time`; the Julian calendar: `time::calendar`.

use super::simulation::SimulatedCampaign;
use crate::geometry::contacts::Contact;
use crate::observations::angles::Meridian;
use crate::observations::contact_forms::ContactJudged;
use crate::observations::local_time::LocalReading;
use crate::observations::longitude::LongitudeKnowledge;
use crate::observations::timings::{Interval, Observation, ObservationSet};
use crate::sky::solar_time::{local_from_label, DayReckoning, LocalTime};
use crate::time::calendar::Calendar;
use crate::time::scales::TimeModel;
use chrono::TimeDelta;
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
    /// Stations that date Old Style (the Julian calendar).
    pub julian_calendar: Vec<String>,
    /// Stations that write their longitude from the Paris meridian.
    pub paris_longitudes: Vec<String>,
    /// Stations that write their longitude in hours of time.
    pub longitudes_in_time: Vec<String>,
    /// Stations whose clock kept the mean time of another meridian (its longitude, degrees
    /// east of Greenwich).
    pub clock_meridians: Vec<(String, f64)>,
    /// Stations that report only the interval between the interior contacts.
    pub durations_only: Vec<String>,
    /// The share of readings written as a range of 2 to 8 s that holds the reading.
    pub range_share: f64,
    /// How each observer judged the interior contacts (observers not named: geometric).
    pub judgements: Vec<(String, ContactJudged)>,
    /// The true lag of each judgement behind the geometric contact, seconds.
    pub lags: Vec<(ContactJudged, Contact, f64)>,
}

impl Default for HistoricalStyle {
    fn default() -> Self {
        HistoricalStyle {
            longitude_sigma_deg: 0.25,
            unknown_longitudes: Vec::new(),
            exact_longitudes: Vec::new(),
            apparent_share: 0.5,
            astronomical_share: 0.3,
            julian_calendar: Vec::new(),
            paris_longitudes: Vec::new(),
            longitudes_in_time: Vec::new(),
            clock_meridians: Vec::new(),
            durations_only: Vec::new(),
            range_share: 0.0,
            judgements: Vec::new(),
            lags: Vec::new(),
        }
    }
}

impl HistoricalStyle {
    fn listed(list: &[String], name: &str) -> bool {
        list.iter().any(|n| n == name)
    }

    /// The judgement of an observer, and its true lag at a contact (s).
    fn judgement(&self, observer: &str, contact: Contact) -> (ContactJudged, f64) {
        let judged = self
            .judgements
            .iter()
            .find(|(o, _)| o == observer)
            .map_or(ContactJudged::Geometric, |x| x.1);
        let lag = self
            .lags
            .iter()
            .find(|(j, c, _)| *j == judged && *c == contact)
            .map_or(0.0, |x| x.2);
        (judged, lag)
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
        None if HistoricalStyle::listed(&style.exact_longitudes, name) => {
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

/// Record one timing: its judgement's lag, the clock reading (of its kind, at the true
/// longitude or the clock's meridian), a range where drawn, and how it is written.
fn record_one<R: Rng + ?Sized>(
    o: &mut Observation,
    rec: &StationRecord,
    (style, model): (&HistoricalStyle, &TimeModel),
    rng: &mut R,
) {
    let name = o.station.name.clone();
    let true_longitude = o.station.longitude_deg;
    let recorded = true_longitude + rec.error_deg;
    o.station.longitude_deg = crate::geometry::station::normalise_longitude_deg(recorded);
    o.longitude = rec.knowledge;
    let (judged, lag_s) = style.judgement(&o.observer, o.contact);
    if !o.contact.is_exterior() {
        o.judged = judged;
        o.time_label += TimeDelta::nanoseconds((lag_s * 1e9).round() as i64);
    }
    if HistoricalStyle::listed(&style.julian_calendar, &name) {
        o.written.calendar = Calendar::Julian;
    }
    if HistoricalStyle::listed(&style.paris_longitudes, &name) {
        o.written.meridian = Meridian::Paris;
    }
    o.written.longitude_in_time = HistoricalStyle::listed(&style.longitudes_in_time, &name);
    let clock = style
        .clock_meridians
        .iter()
        .find(|(n, _)| *n == name)
        .map(|x| x.1);
    let kind = if clock.is_some() {
        LocalTime::Mean
    } else {
        rec.kind
    };
    let at = clock.unwrap_or(true_longitude);
    let Some(civil) = local_from_label(o.time_label, kind, at, model) else {
        return;
    };
    let mut reading = LocalReading::new(rec.reckoning.from_civil(civil), kind, rec.reckoning);
    reading.meridian_deg = clock;
    let intervals_only = HistoricalStyle::listed(&style.durations_only, &name);
    if style.range_share > 0.0 && !intervals_only && rng.gen::<f64>() < style.range_share {
        // A range of 2-8 s holding the reading anywhere: its midpoint is the value used.
        let width = rng.gen_range(2.0..8.0);
        let shift = (0.5 - rng.gen::<f64>()) * width;
        reading.reading += TimeDelta::nanoseconds((shift * 1e9).round() as i64);
        reading.written.range_s = Some(width);
        o.written.range_s = Some(width);
        // As a reader of the row has it: the range's own variance (uniform, width^2 / 12)
        // added to the timing's.
        o.sigma_s = o.sigma_s.hypot(width / 12f64.sqrt());
    }
    // The label a reader forms from the reading at the recorded longitude.
    if let Some(label) = reading.label(recorded) {
        o.time_label = label;
        o.local = Some(reading);
    }
}

/// Record a simulated campaign in the historical style.
///
/// Arguments: `campaign`, made with UT1 (or UTC) labels at true longitudes (observers named
/// in `observer`, where the campaign has several per station); `style`; `model`, the time
/// model (for the equation of time); `rng`, a seeded generator.
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
        record_one(o, &records[k].1, (style, model), rng);
    }
    merge_intervals(&mut set, &style.durations_only);
    HistoricalCampaign {
        observations: set,
        longitude_errors_deg: records.into_iter().map(|(n, r)| (n, r.error_deg)).collect(),
    }
}

/// At the stations that report only intervals, each observer's interior contacts become one
/// timed interval II-III of the clock's kind (the readings' difference), dated; their
/// exterior contacts are dropped.
fn merge_intervals(set: &mut ObservationSet, stations: &[String]) {
    if stations.is_empty() {
        return;
    }
    let mut out: Vec<Observation> = Vec::new();
    for o in &set.valid {
        if !HistoricalStyle::listed(stations, &o.station.name) {
            out.push(o.clone());
            continue;
        }
        if o.contact != Contact::III {
            continue;
        }
        let first = set.valid.iter().find(|x| {
            x.station.name == o.station.name && x.observer == o.observer && x.contact == Contact::II
        });
        let (Some(first), Some(a), Some(b)) = (first, first.and_then(|f| f.local), o.local) else {
            continue;
        };
        let seconds = (b.reading - a.reading).num_microseconds().unwrap_or(0) as f64 * 1e-6;
        let mut interval = o.clone();
        interval.duration = Some(Interval {
            first: Contact::II,
            seconds,
            date: Some(first.time_label.date()),
            kept_to: Some(a.kind),
        });
        interval.local = None;
        interval.written.range_s = None;
        interval.sigma_s = first.sigma_s.hypot(o.sigma_s);
        interval.time_label = first
            .time_label
            .date()
            .and_hms_opt(12, 0, 0)
            .unwrap_or_default();
        out.push(interval);
    }
    for (k, o) in out.iter_mut().enumerate() {
        o.line = k as u64 + 2;
    }
    set.rows_total = out.len();
    set.valid = out;
}
