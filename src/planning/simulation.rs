//! Simulated campaigns: timings made from the prediction model with realistic errors, for
//! demonstrations, for testing the reduction's statistics and for forecasting a campaign.
//!
//! The truth is the model at the nominal astronomical unit (IAU 2012 B2). Each station times
//! every contact it sees with the Sun above a minimum altitude, unless clouds take the whole
//! station (`weather_loss`); timing errors are Gaussian with the given standard deviation per
//! contact, plus a black-drop bias (interior contacts: II seen late, III early); a fraction of
//! timings carry a blunder and a fraction of stations a clock error.

use crate::geometry::contacts::Contact;
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;
use crate::observations::timings::{Observation, ObservationSet};
use rand::Rng;
use rand_distr::{Distribution, Normal};

/// Settings of a simulated campaign.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct SimulationSettings {
    /// Standard deviation of the timing errors, seconds, for contacts I-IV.
    pub sigma_s: [f64; 4],
    /// Black-drop bias, seconds: added to II, subtracted from III.
    pub black_drop_bias_s: f64,
    /// Least altitude of the Sun for a contact to be timed, degrees.
    pub min_altitude_deg: f64,
    /// Probability that a station is clouded out.
    pub weather_loss: f64,
    /// Probability that a timing carries a blunder.
    pub blunder_rate: f64,
    /// Probability that a station's clock is wrong.
    pub clock_error_rate: f64,
    /// Size of a clock error, seconds (its sign is random).
    pub clock_error_s: f64,
}

impl Default for SimulationSettings {
    fn default() -> Self {
        SimulationSettings {
            sigma_s: [20.0, 10.0, 10.0, 20.0],
            black_drop_bias_s: 0.0,
            min_altitude_deg: 5.0,
            weather_loss: 0.0,
            blunder_rate: 0.0,
            clock_error_rate: 0.0,
            clock_error_s: 60.0,
        }
    }
}

/// The kind of blunder injected into a simulated timing.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum InjectedBlunder {
    /// A whole number of hours added (zone time left in).
    ZoneHours(i32),
    /// The date off by one day.
    Day,
    /// The contact labelled as its neighbour (I<->II, III<->IV).
    Mislabelled,
    /// The station's clock off by a constant.
    Clock,
}

/// A simulated campaign: the timings as a reduction would read them, and what was injected.
#[derive(Clone, Debug)]
pub struct SimulatedCampaign {
    /// The timings (line numbers count from 2, as in a file with a header).
    pub observations: ObservationSet,
    /// Blunders injected, by index into `observations.valid`.
    pub blunders: Vec<(usize, InjectedBlunder)>,
}

/// Simulate one campaign.
///
/// Arguments: `event`; `stations`; `settings`; `rng`, a seeded generator for reproducibility.
pub fn simulate_campaign<R: Rng + ?Sized>(
    event: &TransitEvent,
    stations: &[Station],
    settings: &SimulationSettings,
    rng: &mut R,
) -> SimulatedCampaign {
    let mut valid = Vec::new();
    let mut blunders = Vec::new();
    let model = *event.time_model();
    for st in stations {
        if rng.gen::<f64>() < settings.weather_loss {
            continue;
        }
        let clock = if rng.gen::<f64>() < settings.clock_error_rate {
            let sign = if rng.gen::<bool>() { 1.0 } else { -1.0 };
            Some(sign * settings.clock_error_s)
        } else {
            None
        };
        let prediction = event.predict(st);
        for c in Contact::ALL {
            let Some(cc) = prediction.contacts[c.index()] else {
                continue;
            };
            if cc.sun_altitude_deg < settings.min_altitude_deg {
                continue;
            }
            let sigma = settings.sigma_s[c.index()];
            let noise = Normal::new(0.0, sigma)
                .map(|n| n.sample(rng))
                .unwrap_or(0.0);
            let bias = match c {
                Contact::II => settings.black_drop_bias_s,
                Contact::III => -settings.black_drop_bias_s,
                _ => 0.0,
            };
            let mut error_s = noise + bias + clock.unwrap_or(0.0);
            let mut label = c;
            let mut injected = clock.map(|_| InjectedBlunder::Clock);
            if rng.gen::<f64>() < settings.blunder_rate {
                injected = Some(inject_blunder(rng, &mut error_s, &mut label));
            }
            let tt = event.elements.instant(cc.hours).add_seconds(error_s);
            let index = valid.len();
            if let Some(b) = injected {
                blunders.push((index, b));
            }
            valid.push(Observation::instant(
                index as u64 + 2,
                st.clone(),
                label,
                model.label_from_tt(tt),
                sigma,
            ));
        }
    }
    one_row_per_contact(valid, blunders)
}

/// One blunder on a timing of contact `label`: a zone time of 1-10 h either way, a day late,
/// or the contact mislabelled (I for II, III for IV, and the reverse).
fn inject_blunder<R: Rng + ?Sized>(
    rng: &mut R,
    error_s: &mut f64,
    label: &mut Contact,
) -> InjectedBlunder {
    match rng.gen_range(0..3) {
        0 => {
            let h = rng.gen_range(1..=10) * if rng.gen::<bool>() { 1 } else { -1 };
            *error_s += f64::from(h) * 3600.0;
            InjectedBlunder::ZoneHours(h)
        }
        1 => {
            *error_s += 86_400.0;
            InjectedBlunder::Day
        }
        _ => {
            *label = match *label {
                Contact::I => Contact::II,
                Contact::II => Contact::I,
                Contact::III => Contact::IV,
                Contact::IV => Contact::III,
            };
            InjectedBlunder::Mislabelled
        }
    }
}

/// A mislabelled timing may collide with the true timing of the contact it was labelled as:
/// keep the campaign readable as a file would be (one row per station and contact).
fn one_row_per_contact(
    valid: Vec<Observation>,
    blunders: Vec<(usize, InjectedBlunder)>,
) -> SimulatedCampaign {
    let mut seen = std::collections::HashSet::new();
    let mut keep = Vec::new();
    let mut kept_blunders = Vec::new();
    for (i, o) in valid.into_iter().enumerate() {
        if seen.insert((o.station.name.clone(), o.contact)) {
            if let Some(&(_, b)) = blunders.iter().find(|(j, _)| *j == i) {
                kept_blunders.push((keep.len(), b));
            }
            keep.push(o);
        }
    }
    for (k, o) in keep.iter_mut().enumerate() {
        o.line = k as u64 + 2;
    }
    SimulatedCampaign {
        observations: ObservationSet {
            path: "<simulated>".into(),
            rows_total: keep.len(),
            valid: keep,
            rejected: Vec::new(),
            lines_without_zone: Vec::new(),
            lines_with_ranges: Vec::new(),
            notes: Vec::new(),
        },
        blunders: kept_blunders,
    }
}

/// Stations spread evenly over the globe (a Fibonacci lattice), named `prefix-NNN`, at sea
/// level; used for maps and simulations.
pub fn global_stations(n: usize, prefix: &str) -> Vec<Station> {
    (0..n)
        .map(|i| {
            let f = (i as f64 + 0.5) / n as f64;
            let lat = (1.0 - 2.0 * f).asin().to_degrees();
            let lon = (i as f64 * 137.507_764_050_037_85).rem_euclid(360.0) - 180.0;
            Station {
                name: format!("{prefix}-{:03}", i + 1),
                latitude_deg: lat,
                longitude_deg: lon,
                elevation_m: 0.0,
            }
        })
        .collect()
}

/// How many contacts a station sees with the Sun at least `min_altitude_deg` up.
pub fn visible_contacts(event: &TransitEvent, station: &Station, min_altitude_deg: f64) -> usize {
    event
        .predict(station)
        .contacts
        .iter()
        .flatten()
        .filter(|c| c.sun_altitude_deg >= min_altitude_deg)
        .count()
}

/// The candidates that see at least `min_contacts` contacts with the Sun at least
/// `min_altitude_deg` up, in their order (for building networks to simulate).
pub fn stations_seeing(
    event: &TransitEvent,
    candidates: Vec<Station>,
    min_contacts: usize,
    min_altitude_deg: f64,
) -> Vec<Station> {
    candidates
        .into_iter()
        .filter(|s| visible_contacts(event, s, min_altitude_deg) >= min_contacts)
        .collect()
}

pub use super::records::campaign_csv;

/// One trial's outcome: (AU km, AU sigma km, interval holds the truth) if solved; blunders
/// injected; blunders caught; timings.
pub type TrialOutcome = (Option<(f64, f64, bool)>, usize, usize, usize);

/// Summary of a Monte Carlo series of simulated campaigns reduced with the real reduction.
#[derive(Clone, Debug, PartialEq)]
pub struct MonteCarloSummary {
    /// Trials run.
    pub trials: usize,
    /// Trials whose reduction gave a parallax.
    pub solved: usize,
    /// The AU estimates, km.
    pub au_estimates_km: Vec<f64>,
    /// Every trial in order: (AU km, AU sigma km, interval holds the truth) where solved;
    /// blunders injected; blunders caught; timings.
    pub per_trial: Vec<TrialOutcome>,
    /// Median of the stated AU uncertainties, km (the typical forecast; `None` when no trial
    /// was solved).
    pub au_sigma_forecast_km: Option<f64>,
    /// Standard deviation of the AU estimates, km (`None` with fewer than two solved).
    pub au_scatter_km: Option<f64>,
    /// Mean AU estimate minus the true AU, km (`None` when no trial was solved).
    pub au_bias_km: Option<f64>,
    /// Share of solved trials whose 95 % interval holds the true AU (`None` when none was).
    pub coverage_95: Option<f64>,
    /// Blunders injected over all trials.
    pub blunders_injected: usize,
    /// Of those, the ones rejected by the reduction.
    pub blunders_caught: usize,
    /// Mean number of timings per campaign.
    pub mean_timings: f64,
}

/// Run `trials` simulated campaigns (trial k uses seed `seed + k`) through the reduction on
/// `threads` threads; `progress` is called with each finished trial's count.
pub fn monte_carlo(
    event: &TransitEvent,
    stations: &[Station],
    settings: &SimulationSettings,
    trials: usize,
    seed: u64,
    threads: usize,
    progress: &(dyn Fn() + Sync),
) -> MonteCarloSummary {
    use rand::SeedableRng;
    let truth_km = crate::sky::constants::AU_KM;
    let options = crate::reduction::ReduceOptions {
        event: Some((event.planet, event.date())),
        follow_convergence: false,
        compare_methods: false,
        ..crate::reduction::ReduceOptions::default()
    };
    let run_one = |k: usize| -> TrialOutcome {
        let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(seed.wrapping_add(k as u64));
        let camp = simulate_campaign(event, stations, settings, &mut rng);
        let n = camp.observations.valid.len();
        let injected: Vec<u64> = camp.blunders.iter().map(|(i, _)| *i as u64 + 2).collect();
        let result =
            crate::reduction::reduce_for_event(camp.observations, event.clone(), &options).ok();
        let out = result.as_ref().and_then(|r| {
            let (lo, hi) = r.au_interval_95_km?;
            let holds = lo <= truth_km && hi.map_or(true, |hi| truth_km <= hi);
            Some((r.au_km?, r.au_sigma_km?, holds))
        });
        let caught = result
            .as_ref()
            .map(|r| {
                injected
                    .iter()
                    .filter(|l| r.rejected.iter().any(|x| x.line == **l))
                    .count()
            })
            .unwrap_or(0);
        progress();
        (out, injected.len(), caught, n)
    };
    let threads = threads.clamp(1, 64);
    // Results are put back in trial order, so that any number of threads gives the same sums.
    let mut indexed: Vec<(usize, TrialOutcome)> = std::thread::scope(|s| {
        let handles: Vec<_> = (0..threads)
            .map(|t| {
                let run_one = &run_one;
                s.spawn(move || {
                    (t..trials)
                        .step_by(threads)
                        .map(|k| (k, run_one(k)))
                        .collect::<Vec<_>>()
                })
            })
            .collect();
        handles
            .into_iter()
            .flat_map(|h| h.join().unwrap_or_default())
            .collect()
    });
    indexed.sort_by_key(|(k, _)| *k);
    let results: Vec<TrialOutcome> = indexed.into_iter().map(|(_, r)| r).collect();
    summarise_trials(&results, trials, truth_km)
}

/// The statistics of the trials' outcomes, in trial order.
fn summarise_trials(results: &[TrialOutcome], trials: usize, truth_km: f64) -> MonteCarloSummary {
    let solved: Vec<(f64, f64, bool)> = results.iter().filter_map(|r| r.0).collect();
    let m = solved.len().max(1) as f64;
    let mean = solved.iter().map(|r| r.0).sum::<f64>() / m;
    let scatter = (solved.len() > 1)
        .then(|| (solved.iter().map(|r| (r.0 - mean).powi(2)).sum::<f64>() / (m - 1.0)).sqrt());
    let any = !solved.is_empty();
    let sigmas: Vec<f64> = solved.iter().map(|r| r.1).collect();
    MonteCarloSummary {
        trials,
        solved: solved.len(),
        au_estimates_km: solved.iter().map(|r| r.0).collect(),
        per_trial: results.to_vec(),
        au_sigma_forecast_km: any.then(|| crate::reduction::statistics::median(&sigmas)),
        au_scatter_km: scatter,
        au_bias_km: any.then_some(mean - truth_km),
        coverage_95: any.then(|| solved.iter().filter(|r| r.2).count() as f64 / m),
        blunders_injected: results.iter().map(|r| r.1).sum(),
        blunders_caught: results.iter().map(|r| r.2).sum(),
        mean_timings: results.iter().map(|r| r.3 as f64).sum::<f64>() / results.len().max(1) as f64,
    }
}

/// Refuse a network that cannot be simulated: no station sees a contact of the event with the
/// Sun at least `settings.min_altitude_deg` up.
///
/// Errors: an argument error that says why and what to change.
pub fn check_network(
    event: &TransitEvent,
    stations: &[Station],
    settings: &SimulationSettings,
) -> crate::Result<()> {
    let seen: usize = stations
        .iter()
        .map(|s| visible_contacts(event, s, settings.min_altitude_deg))
        .sum();
    if seen == 0 {
        return Err(crate::Error::argument(format!(
            "no station of the network sees any contact of the transit of {} on {} with the Sun at least {} degrees up, so there is nothing to simulate; choose stations where the Sun is up during the transit (see `plan`) or lower --min-altitude",
            event.planet,
            event.date(),
            settings.min_altitude_deg
        )));
    }
    Ok(())
}

impl MonteCarloSummary {
    /// Plain sentences where the simulated campaigns depart from their own forecast, and why:
    /// coverage of the 95 % intervals outside what chance allows (a 99 % binomial band), or a
    /// scatter of the estimates more than 10 % and chance (a 99 % band for a standard
    /// deviation) away from the stated uncertainty.
    ///
    /// Arguments: `settings` (for the likely causes); `stations`, the network's size.
    pub fn departures(&self, settings: &SimulationSettings, stations: usize) -> Vec<String> {
        let mut out = Vec::new();
        if self.solved < self.trials {
            out.push(format!(
                "{} of the {} simulated campaigns gave no parallax (too few timings survived clouds, the Sun's altitude and rejection, or the stations could not separate the parallax from the planet's place and the radii)",
                self.trials - self.solved,
                self.trials
            ));
        }
        let causes = likely_causes(settings, stations);
        let n = self.solved as f64;
        if let Some(c) = self.coverage_95.filter(|_| self.solved >= 10) {
            let band = 2.576 * (0.95 * 0.05 / n).sqrt();
            if (c - 0.95).abs() > band.max(0.01) {
                out.push(format!(
                    "the 95 % intervals held the true AU in {:.1} % of the campaigns, not 95 %: the stated uncertainties are {} here{causes}",
                    100.0 * c,
                    if c < 0.95 { "too small" } else { "too cautious" }
                ));
            }
        }
        if let (Some(f), Some(sc)) = (self.au_sigma_forecast_km, self.au_scatter_km) {
            let ratio = sc / f;
            let band = 0.10 + 2.576 / (2.0 * (n - 1.0).max(1.0)).sqrt();
            if self.solved >= 10 && (ratio - 1.0).abs() > band {
                out.push(format!(
                    "the estimates scatter {ratio:.2} times the typical stated uncertainty{causes}"
                ));
            }
        }
        out
    }
}

/// The settings that make simulated campaigns depart from their forecast, as a clause.
fn likely_causes(settings: &SimulationSettings, stations: usize) -> String {
    let mut c = Vec::new();
    if settings.blunder_rate > 0.0 || settings.clock_error_rate > 0.0 {
        c.push("blunders the reduction cannot catch (clock errors at stations with one timing, mislabelled contacts that fit another contact)");
    }
    if settings.weather_loss > 0.0 {
        c.push("clouds that leave some campaigns with few stations");
    }
    if stations < 6 {
        c.push("too few stations for the uncertainties of a least-squares fit to be reliable");
    }
    if settings.black_drop_bias_s != 0.0 {
        c.push("the black drop, which shifts contacts II and III");
    }
    if c.is_empty() {
        String::new()
    } else {
        format!("; likely causes: {}", c.join("; "))
    }
}
