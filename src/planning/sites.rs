//! Campaign planning: which sites to recruit, what each can time, and how precise the parallax
//! will come out.
//!
//! The forecast is the Fisher information of the reduction's own condition equations: each
//! contact a site sees with the Sun above the minimum altitude adds its row of partial
//! derivatives (seconds per arcsecond of each parameter) with weight 1/sigma^2, and the forecast
//! variance of the parallax is the (parallax, parallax) element of the inverse, with the nuisance
//! parameters (the planet's offsets and the radius corrections) included. Sites are chosen
//! greedily, each step adding the site that most reduces that variance.
//!
//! References: S. D. Silvey, *Optimal Design* (1980), ch. 1-3 (information matrices,
//! D- and c-optimal designs; greedy, sequential selection); the classical pairings: E. Halley,
//! Phil. Trans. 29, 454 (1716) (durations, stations far apart in latitude) and J.-N. Delisle's
//! method of one contact from stations far apart in longitude (1760).

use super::imaging::{site_positions, Imaging, SitePositions};
use crate::geometry::contacts::Contact;
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;
use crate::reduction::equations::{condition_row, nominal_theta};
use crate::reduction::parameters::N_CLASSIC as N_PARAMS;
use nalgebra::{DMatrix, SMatrix};

type Info = SMatrix<f64, N_PARAMS, N_PARAMS>;

/// What the network would measure.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Measure {
    /// Contact timings only.
    Contacts,
    /// Positions on the disc from images only.
    Positions,
    /// Both, reduced together.
    Both,
}

impl Measure {
    /// The word used on the command line and in the outputs.
    pub fn name(self) -> &'static str {
        match self {
            Measure::Contacts => "contacts",
            Measure::Positions => "positions",
            Measure::Both => "both",
        }
    }

    /// From the command line's word.
    pub fn parse(text: &str) -> Option<Measure> {
        [Measure::Contacts, Measure::Positions, Measure::Both]
            .into_iter()
            .find(|m| m.name() == text.trim().to_ascii_lowercase())
    }

    fn contacts(self) -> bool {
        self != Measure::Positions
    }

    fn positions(self) -> bool {
        self != Measure::Contacts
    }
}

/// How a plan is made.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct PlanOptions {
    /// The timing uncertainty assumed for every contact, seconds.
    pub sigma_s: f64,
    /// The least altitude of the Sun, degrees.
    pub min_altitude_deg: f64,
    /// How many sites to choose.
    pub choose: Option<usize>,
    /// How the stations would image the Sun (`None`: no images).
    pub imaging: Option<Imaging>,
    /// What the choice, the gains and the forecasts count.
    pub measure: Measure,
}

/// The forecast sigma of the parallax (arcsec) by each way of measuring, for the chosen sites
/// (or every site when none is chosen); `None` where it is not determined.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct MethodForecasts {
    /// Contacts alone.
    pub contacts: Option<f64>,
    /// Positions alone.
    pub positions: Option<f64>,
    /// Both together.
    pub both: Option<f64>,
}

/// One site's view of one contact.
#[derive(Clone, Debug, PartialEq)]
pub struct SiteContact {
    /// Which contact.
    pub contact: Contact,
    /// Hours from the elements' epoch.
    pub hours: f64,
    /// True altitude of the Sun, degrees.
    pub sun_altitude_deg: f64,
    /// Seconds of contact time per arcsecond of solar parallax.
    pub sensitivity_s_per_arcsec: f64,
    /// Whether the Sun is at least at the minimum altitude.
    pub visible: bool,
    row: [f64; N_PARAMS],
}

/// A candidate site.
#[derive(Clone, Debug)]
pub struct Site {
    /// The site.
    pub station: Station,
    /// Its contacts (those that occur there).
    pub contacts: Vec<SiteContact>,
    /// Percentage by which the whole candidate network's forecast sigma would grow without
    /// this site (its gain to the network); `None` if the rest cannot determine the parallax.
    pub gain_percent: Option<f64>,
    /// What its images would measure (`None` without `imaging`).
    pub positions: Option<SitePositions>,
}

/// The result of planning.
#[derive(Clone, Debug)]
pub struct Plan {
    /// All candidate sites, in file order.
    pub sites: Vec<Site>,
    /// Forecast sigma of the parallax with every site (arcsec), if determined.
    pub all_sites_sigma_arcsec: Option<f64>,
    /// Indices of the chosen sites, in order of choice.
    pub chosen: Vec<usize>,
    /// Forecast sigma of the parallax for the chosen sites (arcsec).
    pub chosen_sigma_arcsec: Option<f64>,
    /// Sentences explaining the choice.
    pub reasons: Vec<String>,
    /// Timing uncertainty assumed, seconds.
    pub sigma_s: f64,
    /// What the choice, the gains and the forecasts count.
    pub measure: Measure,
    /// How the stations would image the Sun, if they do.
    pub imaging: Option<Imaging>,
    /// The forecast by each way of measuring (with `imaging`).
    pub by_method: Option<MethodForecasts>,
}

/// The information of the sites `which` on the classic parameters, counting what `measure`
/// says.
fn information(sites: &[Site], which: &[usize], sigma_s: f64, measure: Measure) -> Info {
    let mut n = Info::zeros();
    let w = 1.0 / (sigma_s * sigma_s);
    for &i in which {
        if measure.contacts() {
            for c in sites[i].contacts.iter().filter(|c| c.visible) {
                let r = nalgebra::SVector::<f64, N_PARAMS>::from_row_slice(&c.row);
                n += w * r * r.transpose();
            }
        }
        if let Some(p) = sites[i].positions.as_ref().filter(|_| measure.positions()) {
            n += p.info;
        }
    }
    n
}

/// Whether a site adds anything to what `measure` counts.
fn adds_something(site: &Site, measure: Measure) -> bool {
    (measure.contacts() && site.contacts.iter().any(|c| c.visible))
        || (measure.positions() && site.positions.as_ref().is_some_and(|p| p.count > 0))
}

/// Forecast sigma of the parallax from an information matrix, with the parameters no site
/// constrains (all-zero columns) left out; `None` when the parallax is not determined.
pub fn forecast_sigma(n: &Info) -> Option<f64> {
    let idx: Vec<usize> = (0..N_PARAMS).filter(|&j| n[(j, j)] > 0.0).collect();
    if !idx.contains(&0) {
        return None;
    }
    let m = DMatrix::from_fn(idx.len(), idx.len(), |a, b| n[(idx[a], idx[b])]);
    let d: Vec<f64> = (0..idx.len()).map(|a| m[(a, a)].sqrt()).collect();
    let corr = DMatrix::from_fn(idx.len(), idx.len(), |a, b| m[(a, b)] / (d[a] * d[b]));
    if corr.clone().symmetric_eigenvalues().min()
        < crate::reduction::identifiability::RANK_TOLERANCE.powi(2)
    {
        return None;
    }
    let inv = corr.try_inverse()?;
    let var = inv[(0, 0)] / (d[0] * d[0]);
    (var > 0.0).then(|| var.sqrt())
}

/// Forecast with a weak prior on the nuisance parameters (10 arcsec), used only to rank sites
/// while the chosen set is still too small to determine everything.
fn forecast_sigma_regularised(n: &Info) -> f64 {
    let mut m = *n;
    for j in 1..N_PARAMS {
        m[(j, j)] += 1.0 / (10.0f64 * 10.0);
    }
    m[(0, 0)] += 1e-12;
    m.try_inverse()
        .map(|inv| inv[(0, 0)].max(0.0).sqrt())
        .unwrap_or(f64::INFINITY)
}

/// One candidate's contacts, circumstances and condition-equation rows.
fn evaluate_site(event: &TransitEvent, st: &Station, o: &PlanOptions) -> Site {
    let min_altitude_deg = o.min_altitude_deg;
    let theta = nominal_theta();
    let geo = st.geocentric();
    let pred = event.predict(st);
    let contacts = Contact::ALL
        .iter()
        .filter_map(|&c| {
            let cc = pred.contacts[c.index()]?;
            let (_, row) = condition_row(event, &geo, c, &theta)?;
            Some(SiteContact {
                contact: c,
                hours: cc.hours,
                sun_altitude_deg: cc.sun_altitude_deg,
                sensitivity_s_per_arcsec: cc.sensitivity_s_per_arcsec,
                visible: cc.sun_altitude_deg >= min_altitude_deg,
                row,
            })
        })
        .collect();
    Site {
        station: st.clone(),
        contacts,
        gain_percent: None,
        positions: o
            .imaging
            .map(|im| site_positions(event, st, &im, min_altitude_deg)),
    }
}

/// Choose up to `k` sites one at a time, each the one that most lowers the forecast sigma
/// (greedy forward selection; a weak prior ranks sites while the set cannot yet determine
/// everything). A site that adds nothing (no contact, no image with the Sun up) is never
/// chosen.
fn choose_greedily(sites: &[Site], k: usize, sigma_s: f64, measure: Measure) -> Vec<usize> {
    let mut chosen = Vec::new();
    let mut n = Info::zeros();
    for _ in 0..k.min(sites.len()) {
        let best = (0..sites.len())
            .filter(|i| !chosen.contains(i))
            .filter(|&i| adds_something(&sites[i], measure))
            .map(|i| {
                let trial = n + information(sites, &[i], sigma_s, measure);
                let score = forecast_sigma(&trial)
                    .unwrap_or_else(|| 1e6 * forecast_sigma_regularised(&trial));
                (i, score)
            })
            .min_by(|a, b| a.1.total_cmp(&b.1));
        let Some((i, _)) = best else { break };
        n += information(sites, &[i], sigma_s, measure);
        chosen.push(i);
    }
    chosen
}

/// Evaluate every candidate site and, with `choose`, pick that many greedily (contact timings
/// only; [`plan_with`] for images too).
///
/// Arguments: `event`; `stations`; `sigma_s`, the timing uncertainty assumed for every contact;
/// `min_altitude_deg`; `choose`, how many sites to pick.
pub fn plan(
    event: &TransitEvent,
    stations: &[Station],
    sigma_s: f64,
    min_altitude_deg: f64,
    choose: Option<usize>,
) -> Plan {
    let options = PlanOptions {
        sigma_s,
        min_altitude_deg,
        choose,
        imaging: None,
        measure: Measure::Contacts,
    };
    plan_with(event, stations, &options)
}

/// Evaluate every candidate site for what the network would measure and, with `choose`, pick
/// that many greedily; with imaging, also the forecast by each way of measuring.
pub fn plan_with(event: &TransitEvent, stations: &[Station], o: &PlanOptions) -> Plan {
    let (sigma_s, measure) = (o.sigma_s, o.measure);
    let mut sites: Vec<Site> = stations
        .iter()
        .map(|st| evaluate_site(event, st, o))
        .collect();
    let all: Vec<usize> = (0..sites.len()).collect();
    let all_sigma = forecast_sigma(&information(&sites, &all, sigma_s, measure));
    for i in 0..sites.len() {
        let rest: Vec<usize> = all.iter().copied().filter(|&j| j != i).collect();
        let without = forecast_sigma(&information(&sites, &rest, sigma_s, measure));
        sites[i].gain_percent = match (all_sigma, without) {
            (Some(a), Some(b)) => Some(100.0 * (b / a - 1.0)),
            _ => None,
        };
    }
    let chosen = o
        .choose
        .map_or_else(Vec::new, |k| choose_greedily(&sites, k, sigma_s, measure));
    let chosen_sigma = if chosen.is_empty() {
        None
    } else {
        forecast_sigma(&information(&sites, &chosen, sigma_s, measure))
    };
    let mut reasons = explain_choice(&sites, &chosen, chosen_sigma);
    if let Some(k) = o.choose.filter(|&k| k > chosen.len()) {
        reasons.push(format!(
            "only {} of the {k} sites asked for were chosen: the other sites see no contact {}with the Sun at least {} degrees up and would add nothing",
            chosen.len(),
            if measure.positions() { "and take no image " } else { "" },
            o.min_altitude_deg
        ));
    }
    let counted = if chosen.is_empty() { &all } else { &chosen };
    let by_method = o.imaging.map(|_| {
        let f = |m: Measure| forecast_sigma(&information(&sites, counted, sigma_s, m));
        MethodForecasts {
            contacts: f(Measure::Contacts),
            positions: f(Measure::Positions),
            both: f(Measure::Both),
        }
    });
    Plan {
        sites,
        all_sites_sigma_arcsec: all_sigma,
        chosen,
        chosen_sigma_arcsec: chosen_sigma,
        reasons,
        sigma_s,
        measure,
        imaging: o.imaging,
        by_method,
    }
}

fn explain_choice(sites: &[Site], chosen: &[usize], sigma: Option<f64>) -> Vec<String> {
    let mut out = Vec::new();
    if chosen.is_empty() {
        return out;
    }
    if sigma.is_none() {
        out.push("these sites together cannot determine the parallax with the nuisance parameters free; add sites that see both ingress and egress, far apart in latitude".into());
    }
    let sees = |i: usize, c: Contact| {
        sites[i]
            .contacts
            .iter()
            .find(|x| x.contact == c && x.visible)
    };
    // Halley: both ingress and egress seen, the largest difference in latitude.
    let dur: Vec<usize> = chosen
        .iter()
        .copied()
        .filter(|&i| {
            (sees(i, Contact::I).is_some() || sees(i, Contact::II).is_some())
                && (sees(i, Contact::III).is_some() || sees(i, Contact::IV).is_some())
        })
        .collect();
    let mut best_lat: Option<(usize, usize, f64)> = None;
    for &a in &dur {
        for &b in &dur {
            let d = sites[a].station.latitude_deg - sites[b].station.latitude_deg;
            if d > best_lat.map_or(0.0, |x| x.2) {
                best_lat = Some((a, b, d));
            }
        }
    }
    if let Some((a, b, d)) = best_lat {
        out.push(format!(
            "durations (Halley's method): '{}' and '{}' both see ingress and egress and lie {:.0} degrees apart in latitude, so parallax lengthens the transit at one and shortens it at the other",
            sites[a].station.name, sites[b].station.name, d
        ));
    }
    // Delisle: the same contact with the most different sensitivities.
    let mut best_pair: Option<(usize, usize, Contact, f64)> = None;
    for c in Contact::ALL {
        for &a in chosen {
            for &b in chosen {
                if let (Some(x), Some(y)) = (sees(a, c), sees(b, c)) {
                    let d = x.sensitivity_s_per_arcsec - y.sensitivity_s_per_arcsec;
                    if d > best_pair.map_or(0.0, |p| p.3) {
                        best_pair = Some((a, b, c, d));
                    }
                }
            }
        }
    }
    if let Some((a, b, c, d)) = best_pair {
        let dlon = crate::geometry::station::normalise_longitude_deg(
            sites[a].station.longitude_deg - sites[b].station.longitude_deg,
        )
        .abs();
        out.push(format!(
            "single contacts (Delisle's method): '{}' and '{}', {:.0} degrees apart in longitude, both time contact {}, whose time differs between them by {:.1} s per arcsecond of parallax",
            sites[a].station.name, sites[b].station.name, dlon, c.roman(), d
        ));
    }
    out
}

/// One point of a sensitivity grid.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct GridPoint {
    /// Latitude, degrees.
    pub latitude_deg: f64,
    /// Longitude, degrees.
    pub longitude_deg: f64,
    /// The contact's time, hours from the elements' epoch (`None` where it does not occur).
    pub hours: Option<f64>,
    /// Sun's true altitude at the contact, degrees.
    pub sun_altitude_deg: f64,
    /// Seconds per arcsecond of parallax.
    pub sensitivity_s_per_arcsec: f64,
}

/// The sensitivity of one contact over the whole Earth at sea level, on a grid of `step_deg`
/// (latitudes from -90 + step/2, longitudes from -180 + step/2).
pub fn sensitivity_grid(event: &TransitEvent, contact: Contact, step_deg: f64) -> Vec<GridPoint> {
    let n_lat = (180.0 / step_deg).round().max(1.0) as usize;
    let n_lon = (360.0 / step_deg).round().max(1.0) as usize;
    let mut out = Vec::with_capacity(n_lat * n_lon);
    for i in 0..n_lat {
        let lat = 90.0 - (i as f64 + 0.5) * 180.0 / n_lat as f64;
        for j in 0..n_lon {
            let lon = -180.0 + (j as f64 + 0.5) * 360.0 / n_lon as f64;
            let st = Station {
                name: String::new(),
                latitude_deg: lat,
                longitude_deg: lon,
                elevation_m: 0.0,
            };
            let geo = st.geocentric();
            let start = event.start_hours(contact);
            let solved = crate::geometry::contacts::solve_with_circumstances(
                &event.elements,
                Some(&geo),
                contact,
                start,
            );
            let point = match solved {
                Some(c) => GridPoint {
                    latitude_deg: lat,
                    longitude_deg: lon,
                    hours: Some(c.hours),
                    sun_altitude_deg: c.sun_altitude_deg,
                    sensitivity_s_per_arcsec: c.sensitivity_s_per_arcsec,
                },
                None => GridPoint {
                    latitude_deg: lat,
                    longitude_deg: lon,
                    hours: None,
                    sun_altitude_deg: f64::NAN,
                    sensitivity_s_per_arcsec: f64::NAN,
                },
            };
            out.push(point);
        }
    }
    out
}
