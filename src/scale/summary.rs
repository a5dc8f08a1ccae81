//! Everything else the campaign's timings measure, in one place for the table, the JSON and
//! the report: the scale of the Solar System, the planet's and the Sun's sizes, the depth of
//! the transit, and the transit read as a distant observer of the Sun would read it.

use super::diameters::{sizes, Sizes};
use super::kepler::{
    earth_mean_speed_km_s, light_time_s, scale_of_solar_system, semi_major_axis_au, ScaleRow,
    GAUSSIAN_K, PLANETS,
};
use super::light_curve::{depth_at_greatest, disc_geometry, radius_ratio_from_depth};
use crate::reduction::Reduction;
use crate::sky::ephemeris::{geocentric_state, heliocentric_state_au, Planet};
use crate::sky::vector::{dot, norm};

/// The transit as a distant observer of the Sun would read it.
#[derive(Clone, Debug, PartialEq)]
pub struct DistantView {
    /// The fraction of the Sun's light blocked at greatest transit.
    pub depth: f64,
    /// The planet's radius over the Sun's that this depth implies where the planet crossed.
    pub radius_ratio_from_depth: Option<f64>,
    /// The same ratio from the timings (the nominal semidiameters with the fitted
    /// corrections, at greatest transit); `None` where the corrections were not both fitted.
    pub radius_ratio_from_timings: Option<f64>,
    /// The planet's orbital period from the ephemeris (osculating, at the event), days.
    pub period_days: f64,
    /// Its distance from the Sun by Kepler's third law, AU.
    pub distance_au: f64,
    /// The same in km with the campaign's AU (`None` when the AU is not determined).
    pub distance_km: Option<f64>,
}

/// What else the timings measure.
#[derive(Clone, Debug, PartialEq)]
pub struct WhatElse {
    /// The eight planets' semi-major axes in km (empty when the AU is not determined).
    pub scale: Vec<ScaleRow>,
    /// The planet's distance from the Earth at greatest transit, km, with its uncertainty.
    pub earth_planet_km: Option<(f64, f64)>,
    /// Light time over one AU, s, with its uncertainty.
    pub light_time_s: Option<(f64, f64)>,
    /// The Earth's mean orbital speed, km/s, with its uncertainty.
    pub earth_speed_km_s: Option<(f64, f64)>,
    /// The planet's and the Sun's sizes.
    pub sizes: Sizes,
    /// The transit as a distant observer would read it.
    pub distant: DistantView,
}

/// The planet's mass over the Sun's (Kepler's table, `kepler::PLANETS`).
fn mass_ratio(planet: Planet) -> f64 {
    let orbit = match planet {
        Planet::Mercury => &PLANETS[0],
        Planet::Venus => &PLANETS[1],
    };
    1.0 / orbit.sun_to_planet_mass
}

/// The planet's osculating orbital period at the event from the ephemeris's heliocentric
/// state, days: vis-viva 1/a = 2/r - v^2/mu with mu = k^2 (1 + m/M), then Kepler's law
/// (e.g. J. M. A. Danby, *Fundamentals of Celestial Mechanics*, 2nd ed., 1988, section 6.3).
fn osculating_period_days(red: &Reduction) -> f64 {
    let ev = &red.event;
    let (r, v) = heliocentric_state_au(ev.planet, ev.greatest, ev.time_model().ephemeris);
    let mu = GAUSSIAN_K * GAUSSIAN_K * (1.0 + mass_ratio(ev.planet));
    let a = 1.0 / (2.0 / norm(r) - dot(v, v) / mu);
    std::f64::consts::TAU * (a * a * a / mu).sqrt()
}

fn distant_view(red: &Reduction, au: Option<f64>) -> DistantView {
    let g = disc_geometry(&red.event, red.event.hours_of_greatest());
    let depth = depth_at_greatest(&red.event);
    let period_days = osculating_period_days(red);
    let distance_au = semi_major_axis_au(period_days, mass_ratio(red.event.planet));
    DistantView {
        depth,
        radius_ratio_from_depth: radius_ratio_from_depth(depth, g.separation_ratio),
        radius_ratio_from_timings: super::diameters::fitted_radius_ratio(red),
        period_days,
        distance_au,
        distance_km: au.map(|a| a * distance_au),
    }
}

/// Everything else the reduction's timings measure.
pub fn what_else(red: &Reduction) -> WhatElse {
    let au = red.au_km.zip(red.au_sigma_km);
    let ev = &red.event;
    let state = geocentric_state(ev.planet, ev.greatest, ev.time_model());
    let planet_au = norm(state.planet_au);
    WhatElse {
        scale: au.map_or(Vec::new(), |(a, s)| scale_of_solar_system(a, s)),
        earth_planet_km: au.map(|(a, s)| (planet_au * a, planet_au * s)),
        light_time_s: au.map(|(a, s)| (light_time_s(a), light_time_s(s))),
        earth_speed_km_s: au.map(|(a, s)| (earth_mean_speed_km_s(a), earth_mean_speed_km_s(s))),
        sizes: sizes(red),
        distant: distant_view(red, red.au_km),
    }
}
