//! The scale of the Solar System from the measured astronomical unit: Kepler's third law
//! gives every planet's mean distance from the Sun in AU from its period; the campaign's AU
//! turns them all into kilometres at once.
//!
//! Kepler's third law with the two-body mass correction, in the Gaussian form:
//! a^3 = k^2 (1 + m/M) P^2 / (4 pi^2), a in AU, P in days, k = 0.01720209895 (the Gaussian
//! gravitational constant, an IAU 1976 defining constant; since IAU 2012 Resolution B2 the AU
//! is fixed in metres instead, and k is 2 pi / (sidereal year) to 1e-9 relative).
//!
//! References: the sidereal periods from the mean longitude rates of E. M. Standish,
//! "Keplerian elements for approximate positions of the major planets" (JPL, the table valid
//! 1800-2050), P = 360 deg / (dL/dt); the planets' masses as ratios of the Sun's from the IAU
//! 2009 system of astronomical constants (B. Luzum et al., Celest. Mech. Dyn. Astr. 110, 293,
//! 2011; Mars, Jupiter and the outer planets as adopted there, the Earth with the Moon). Both
//! tables are quoted from memory of those sources and checked together: the semi-major axes
//! that follow agree with Standish's own to 2.2e-5 from Mercury to Saturn (tests).

use crate::sky::constants::SPEED_OF_LIGHT_M_PER_S;
use serde::Serialize;

/// The Gaussian gravitational constant, AU^(3/2) per day per solar mass^(1/2) (IAU 1976).
pub const GAUSSIAN_K: f64 = 0.017_202_098_95;

/// A planet's period and mass, as Kepler's law needs them.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct PlanetOrbit {
    /// Name.
    pub name: &'static str,
    /// Mean longitude rate, degrees per Julian century (Standish, J2000 table).
    pub mean_longitude_rate_deg_per_century: f64,
    /// The Sun's mass over the planet's (with its satellites).
    pub sun_to_planet_mass: f64,
}

impl PlanetOrbit {
    /// The sidereal period, days: 360 degrees at the mean longitude rate.
    pub fn period_days(&self) -> f64 {
        360.0 / (self.mean_longitude_rate_deg_per_century / 36_525.0)
    }

    /// The semi-major axis from the period by Kepler's third law, AU.
    pub fn semi_major_axis_au(&self) -> f64 {
        semi_major_axis_au(self.period_days(), 1.0 / self.sun_to_planet_mass)
    }
}

/// The eight planets, in order from the Sun.
pub const PLANETS: [PlanetOrbit; 8] = [
    PlanetOrbit {
        name: "Mercury",
        mean_longitude_rate_deg_per_century: 149_472.674_111_75,
        sun_to_planet_mass: 6_023_597.4,
    },
    PlanetOrbit {
        name: "Venus",
        mean_longitude_rate_deg_per_century: 58_517.815_387_29,
        sun_to_planet_mass: 408_523.719,
    },
    PlanetOrbit {
        name: "Earth",
        mean_longitude_rate_deg_per_century: 35_999.372_449_81,
        sun_to_planet_mass: 328_900.559_6,
    },
    PlanetOrbit {
        name: "Mars",
        mean_longitude_rate_deg_per_century: 19_140.302_684_99,
        sun_to_planet_mass: 3_098_703.59,
    },
    PlanetOrbit {
        name: "Jupiter",
        mean_longitude_rate_deg_per_century: 3_034.746_127_75,
        sun_to_planet_mass: 1_047.348_644,
    },
    PlanetOrbit {
        name: "Saturn",
        mean_longitude_rate_deg_per_century: 1_222.493_622_01,
        sun_to_planet_mass: 3_497.901_8,
    },
    PlanetOrbit {
        name: "Uranus",
        mean_longitude_rate_deg_per_century: 428.482_027_85,
        sun_to_planet_mass: 22_902.98,
    },
    PlanetOrbit {
        name: "Neptune",
        mean_longitude_rate_deg_per_century: 218.459_453_25,
        sun_to_planet_mass: 19_412.26,
    },
];

/// Kepler's third law: the semi-major axis (AU) of an orbit of `period_days` about the Sun
/// for a body of `mass_ratio` = m / M_sun.
pub fn semi_major_axis_au(period_days: f64, mass_ratio: f64) -> f64 {
    let two_pi = std::f64::consts::TAU;
    (GAUSSIAN_K * GAUSSIAN_K * (1.0 + mass_ratio) * period_days * period_days / (two_pi * two_pi))
        .cbrt()
}

/// One planet's distance from the Sun.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct ScaleRow {
    /// The planet.
    pub body: String,
    /// Sidereal period, days.
    pub period_days: f64,
    /// Semi-major axis from Kepler's third law, AU.
    pub semi_major_axis_au: f64,
    /// The same in km, with the campaign's AU.
    pub semi_major_axis_km: f64,
    /// Its standard uncertainty, km (the AU's, scaled; the periods are exact by comparison).
    pub sigma_km: f64,
}

/// The semi-major axes of the eight planets in km from a measured AU and its uncertainty.
pub fn scale_of_solar_system(au_km: f64, au_sigma_km: f64) -> Vec<ScaleRow> {
    PLANETS
        .iter()
        .map(|p| {
            let a = p.semi_major_axis_au();
            ScaleRow {
                body: p.name.to_string(),
                period_days: p.period_days(),
                semi_major_axis_au: a,
                semi_major_axis_km: a * au_km,
                sigma_km: a * au_sigma_km,
            }
        })
        .collect()
}

/// The light time over one AU, seconds, for an AU in km.
pub fn light_time_s(au_km: f64) -> f64 {
    au_km * 1000.0 / SPEED_OF_LIGHT_M_PER_S
}

/// The Earth's mean orbital speed, km/s: 2 pi a / P for the Earth's semi-major axis from
/// Kepler's law (a circular-orbit mean; the true speed varies by 1.7 % either way).
pub fn earth_mean_speed_km_s(au_km: f64) -> f64 {
    let earth = &PLANETS[2];
    std::f64::consts::TAU * earth.semi_major_axis_au() * au_km / (earth.period_days() * 86_400.0)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn semi_major_axes_match_the_mean_elements() {
        // Source: E. M. Standish, "Keplerian elements for approximate positions of the major
        // planets" (JPL), J2000 semi-major axes (from memory of the table). Within 1e-4
        // relative from Mercury to Saturn (measured: at most 2.2e-5). Uranus and Neptune's
        // mean elements, fitted over 1800-2050, absorb their mutual perturbations, which
        // Kepler's two-body law leaves out: measured 3.3e-4 and 4.0e-4, so 5e-4 there.
        let standish = [
            0.387_099_27,
            0.723_335_66,
            1.000_002_61,
            1.523_710_34,
            5.202_887_00,
            9.536_675_94,
            19.189_164_64,
            30.069_922_76,
        ];
        for (p, a) in PLANETS.iter().zip(standish) {
            let rel = (p.semi_major_axis_au() - a).abs() / a;
            let bound = if p.name == "Uranus" || p.name == "Neptune" {
                5e-4
            } else {
                1e-4
            };
            assert!(
                rel < bound,
                "{}: {} vs {a} ({rel:e})",
                p.name,
                p.semi_major_axis_au()
            );
        }
    }

    #[test]
    fn the_au_scales_every_distance() {
        // Common practice, no source: light crosses 1 AU in 499.0 s; the Earth moves at
        // 29.78 km/s on average; Jupiter is 5.2 AU from the Sun.
        let au = crate::sky::constants::AU_KM;
        assert!((light_time_s(au) - 499.004_784).abs() < 1e-3);
        assert!((earth_mean_speed_km_s(au) - 29.78).abs() < 0.01);
        let rows = scale_of_solar_system(au, 1000.0);
        assert_eq!(rows.len(), 8);
        assert!((rows[4].semi_major_axis_km / au - 5.2030).abs() < 1e-3);
        assert!((rows[4].sigma_km - 5203.0).abs() < 1.0);
    }
}
