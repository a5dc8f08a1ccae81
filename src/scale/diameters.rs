//! The planet's and the Sun's diameters from the timings: the fitted corrections to the sum
//! of the apparent radii (contacts I and IV) and to their difference (II and III) give the
//! planet's semidiameter correction (sum - difference)/2 and the Sun's (sum + difference)/2,
//! as seen from the Earth's centre at greatest transit; the measured AU turns the angles into
//! kilometres. Each station's ingress (I-II) and egress (III-IV) durations give a teaching
//! estimate of its own.
//!
//! The black drop makes interior contacts late at ingress and early at egress, which shortens
//! the interior chord as a smaller difference of the radii would: the planet comes out larger
//! and the Sun smaller. The reduction's linear response to one second of it (error_budget.rs)
//! says by how much for this campaign.
//!
//! References: the radius corrections of the condition equations as in S. Newcomb,
//! *Astronomical Papers of the American Ephemeris* II (1891); propagation of the covariance to
//! first order: JCGM 100:2008 (GUM), section 5.2 (correlated input quantities).

use crate::geometry::besselian::geocentric_separation_rad;
use crate::geometry::contacts::{Contact, Perturbation};
use crate::reduction::parameters::{PARALLAX, RADIUS_DIFFERENCE, RADIUS_SUM};
use crate::reduction::Reduction;
use crate::sky::constants::{au_km_from_parallax_arcsec, ARCSEC_RAD, AU_KM};
use crate::sky::ephemeris::geocentric_state;
use crate::sky::vector::norm;
use std::collections::HashMap;

/// The largest uncertainty, as a share of the diameter, with which a diameter is given: a
/// wider one says the timings fix the radius corrections only in combination with the
/// planet's offsets, and the value printed would be the ephemeris's radii returned with noise
/// (a two-station Mercury campaign gave a Sun 7 % small). A round figure of ours.
pub const MAX_RELATIVE_SIGMA: f64 = 0.1;

/// A diameter in km with its standard uncertainty.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Diameter {
    /// The diameter, km.
    pub km: f64,
    /// Its standard uncertainty, km.
    pub sigma_km: f64,
}

/// One station's estimate of the planet's diameter from one of its durations.
#[derive(Clone, Debug, PartialEq)]
pub struct StationSize {
    /// The station.
    pub station: String,
    /// "ingress" (I-II) or "egress" (III-IV).
    pub pair: &'static str,
    /// The observed duration, seconds.
    pub observed_s: f64,
    /// The duration predicted for the IAU radius at that station, seconds.
    pub predicted_s: f64,
    /// The diameter it implies, km, with the campaign's AU.
    pub diameter_km: f64,
    /// Its standard uncertainty from the two timings' sigmas, km.
    pub sigma_km: f64,
}

/// What the timings say of the sizes.
#[derive(Clone, Debug, PartialEq)]
pub struct Sizes {
    /// The planet's diameter (`None`: not determined, see `why_not`).
    pub planet: Option<Diameter>,
    /// The Sun's diameter.
    pub sun: Option<Diameter>,
    /// Why the diameters are not determined.
    pub why_not: Option<String>,
    /// The IAU mean diameter of the planet, km.
    pub iau_planet_km: f64,
    /// The change of the planet's diameter per second of black drop, km (from the campaign's
    /// own fit).
    pub planet_km_per_black_drop_s: Option<f64>,
    /// Each station's estimates from its durations.
    pub stations: Vec<StationSize>,
}

/// The scaled covariance of two global parameters from the reduction's correlations and
/// uncertainties (0 where either is fixed).
fn covariance(red: &Reduction, a: usize, b: usize) -> f64 {
    let (Some(sa), Some(sb)) = (red.parameters[a].sigma, red.parameters[b].sigma) else {
        return 0.0;
    };
    red.correlation
        .get(a)
        .and_then(|row| row.get(b))
        .map_or(0.0, |r| r * sa * sb)
}

/// The quadratic form g^T C g over (parallax, radius sum, radius difference).
fn variance(red: &Reduction, g: [f64; 3]) -> f64 {
    let idx = [PARALLAX, RADIUS_SUM, RADIUS_DIFFERENCE];
    let mut v = 0.0;
    for (i, &a) in idx.iter().enumerate() {
        for (j, &b) in idx.iter().enumerate() {
            v += g[i] * g[j] * covariance(red, a, b);
        }
    }
    v
}

/// The geocentric distances (AU) and apparent semidiameters (radians) of the Sun and the
/// planet at greatest transit: (sun distance, planet distance, sun semidiameter, planet's).
fn geometry_at_greatest(red: &Reduction) -> (f64, f64, f64, f64) {
    let ev = &red.event;
    let state = geocentric_state(ev.planet, ev.greatest, ev.time_model());
    let (_, ext, int) = geocentric_separation_rad(ev.planet, &state);
    (
        norm(state.sun_au),
        norm(state.planet_au),
        0.5 * (ext + int),
        0.5 * (ext - int),
    )
}

/// One body's diameter from its nominal semidiameter (rad), distance (AU), the fitted
/// correction's weights on (sum, difference), and the AU; `None` unless its uncertainty is
/// under [`MAX_RELATIVE_SIGMA`] of the diameter.
fn diameter_of(red: &Reduction, (s0, dist_au, sign): (f64, f64, f64), pi: f64) -> Option<Diameter> {
    let theta = |j: usize| red.parameters[j].value;
    let ds = 0.5 * (theta(RADIUS_SUM) + sign * theta(RADIUS_DIFFERENCE)) * ARCSEC_RAD;
    let au_km = au_km_from_parallax_arcsec(pi);
    let dist_km = dist_au * au_km;
    let km = 2.0 * (s0 + ds) * dist_km;
    let per = dist_km * ARCSEC_RAD;
    let g = [-km / (pi * ARCSEC_RAD).tan() * ARCSEC_RAD, per, sign * per];
    let sigma_km = variance(red, g).max(0.0).sqrt();
    (km > 0.0 && sigma_km > 0.0 && sigma_km < MAX_RELATIVE_SIGMA * km)
        .then_some(Diameter { km, sigma_km })
}

/// The planet's radius over the Sun's as the timings fitted them at greatest transit (the
/// nominal semidiameters with the fitted corrections), where both corrections were fitted.
pub fn fitted_radius_ratio(red: &Reduction) -> Option<f64> {
    if red.parameters[RADIUS_SUM].fixed || red.parameters[RADIUS_DIFFERENCE].fixed {
        return None;
    }
    let (_, _, s_sun, s_p) = geometry_at_greatest(red);
    let (sum, diff) = (
        red.parameters[RADIUS_SUM].value,
        red.parameters[RADIUS_DIFFERENCE].value,
    );
    let planet = s_p + 0.5 * (sum - diff) * ARCSEC_RAD;
    let sun = s_sun + 0.5 * (sum + diff) * ARCSEC_RAD;
    (planet > 0.0 && sun > 0.0).then(|| planet / sun)
}

/// The sizes the campaign's timings give.
pub fn sizes(red: &Reduction) -> Sizes {
    let iau_planet_km = 2.0 * red.event.planet.radius_km();
    let mut out = Sizes {
        planet: None,
        sun: None,
        why_not: None,
        iau_planet_km,
        planet_km_per_black_drop_s: None,
        stations: Vec::new(),
    };
    let Some(pi) = red.parallax_arcsec.filter(|_| red.au_km.is_some()) else {
        out.why_not = Some(
            "the parallax, and so the AU that turns angles into kilometres, is not determined"
                .into(),
        );
        return out;
    };
    if red.parameters[RADIUS_SUM].fixed || red.parameters[RADIUS_DIFFERENCE].fixed {
        out.why_not = Some("the sizes need both kinds of contact, exterior (I or IV) and interior (II or III), in the solution, and one kind is missing".into());
        return out;
    }

    let (d_sun, d_p, s_sun, s_p) = geometry_at_greatest(red);
    out.planet = diameter_of(red, (s_p, d_p, -1.0), pi);
    out.sun = diameter_of(red, (s_sun, d_sun, 1.0), pi);
    if out.planet.is_none() || out.sun.is_none() {
        out.why_not = Some("the timings cannot tell the radius corrections apart well enough: the uncertainty of a diameter would exceed a tenth of the diameter itself (typical of few stations, or when the planet's place is fitted freely; --planet-place fixed or a prior separates them)".into());
    }
    if let Some(response) = red
        .error_budget
        .as_ref()
        .and_then(|b| b.per_black_drop_s.as_ref())
    {
        let d_km = d_p * au_km_from_parallax_arcsec(pi);
        let ds = 0.5 * (response[RADIUS_SUM] - response[RADIUS_DIFFERENCE]) * ARCSEC_RAD;
        let dpi = response[PARALLAX] * ARCSEC_RAD;
        let km = 2.0 * s_p * d_km;
        out.planet_km_per_black_drop_s = Some(2.0 * ds * d_km - km * dpi / (pi * ARCSEC_RAD).tan());
    }
    let au_ratio = au_km_from_parallax_arcsec(pi) / AU_KM;
    out.stations = station_sizes(red, iau_planet_km * au_ratio);
    out
}

/// Each station's estimate from its ingress and egress durations: the observed duration over
/// the duration predicted for the IAU radius at that station (the planet's speed across the
/// limb being the prediction's), times the IAU diameter scaled to the measured AU.
fn station_sizes(red: &Reduction, nominal_km: f64) -> Vec<StationSize> {
    let fitted = red.perturbation();
    // Each station's fitted longitude correction (degrees, 0 where it has none) and its rows
    // used, in order, gathered once (not searched once per station).
    let corrections = crate::render::reduction::longitude_corrections(red);
    let mut used_by_station: HashMap<&str, Vec<_>> = HashMap::new();
    for u in &red.used {
        used_by_station
            .entry(u.station.as_str())
            .or_default()
            .push(u);
    }
    // Stations on their own, in parallel, gathered in order.
    use rayon::prelude::*;
    red.stations
        .par_iter()
        .filter(|s| s.timings > 0)
        .flat_map_iter(|st| {
            let correction_deg = corrections.get(st.station.as_str()).map_or(0.0, |c| c.0);
            let rows: &[_] = used_by_station
                .get(st.station.as_str())
                .map_or(&[], Vec::as_slice);
            station_pairs(red, (st, correction_deg), rows, (&fitted, nominal_km))
        })
        .collect()
}

/// One station's ingress and egress estimates (none where a pair is not timed or its
/// durations are not positive).
fn station_pairs(
    red: &Reduction,
    (st, correction_deg): (&crate::reduction::result::StationContribution, f64),
    rows: &[&crate::reduction::result::UsedTiming],
    (fitted, nominal_km): (&Perturbation, f64),
) -> Vec<StationSize> {
    let station = crate::geometry::station::Station {
        name: st.station.clone(),
        latitude_deg: st.latitude_deg,
        longitude_deg: st.longitude_deg + correction_deg,
        elevation_m: st.elevation_m,
    };
    let geo = station.geocentric();
    let mut out = Vec::new();
    for (pair, a, b) in [
        ("ingress", Contact::I, Contact::II),
        ("egress", Contact::III, Contact::IV),
    ] {
        let label = |c: Contact| c.number().to_string();
        let find = |c: Contact| rows.iter().find(|u| u.contact_label == label(c));
        let (Some(ra), Some(rb)) = (find(a), find(b)) else {
            continue;
        };
        let at = |p: &Perturbation, c: Contact| red.event.contact_hours_perturbed(&geo, c, p);
        let (Some(fa), Some(fb), Some(na), Some(nb)) = (
            at(fitted, a),
            at(fitted, b),
            at(&Perturbation::NOMINAL, a),
            at(&Perturbation::NOMINAL, b),
        ) else {
            continue;
        };
        let observed_s = (fb - fa) * 3600.0 + rb.o_c_s - ra.o_c_s;
        let predicted_s = (nb - na) * 3600.0;
        if !(observed_s > 0.0 && predicted_s > 0.0) {
            continue;
        }
        let diameter_km = nominal_km * observed_s / predicted_s;
        let sigma_km = diameter_km * ra.sigma_s.hypot(rb.sigma_s) / observed_s;
        out.push(StationSize {
            station: st.station.clone(),
            pair,
            observed_s,
            predicted_s,
            diameter_km,
            sigma_km,
        });
    }
    out
}
