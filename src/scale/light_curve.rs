//! How much of the Sun's light the planet blocks, seen from the Earth's centre: the area of
//! the Sun's disc the planet covers, weighted by the Sun's limb darkening, as a light curve
//! (relative brightness against time), its depth at greatest transit, and the inverse that
//! reads a transit as a distant observer of the Sun would: the planet's size relative to the
//! Sun's from the depth.
//!
//! The Sun's brightness across its disc follows the linear limb-darkening law
//! I(mu) / I(1) = 1 - u (1 - mu), mu the cosine of the angle from the disc's centre, with
//! u = 0.6: the grey atmosphere in the Eddington approximation, I(mu) proportional to
//! (2 + 3 mu) / 5 (A. S. Eddington, *The Internal Constitution of the Stars*, 1926; e.g.
//! D. Mihalas, *Stellar Atmospheres*, 2nd ed., 1978, chapter 3), which follows the Sun's
//! integrated (bolometric) limb darkening closely. The Sun's flux is
//! F = integral of I over the disc = pi (1 - u / 3) in units of the central intensity and the
//! Sun's radius.
//!
//! The light the planet blocks (disc of radius p, centre at distance z from the Sun's, both in
//! units of the Sun's radius) is the integral over the Sun's radius r of I(r) times the arc of
//! the circle of radius r that the planet covers, 2 acos((r^2 + z^2 - p^2) / (2 r z)) (the
//! one-dimensional form of the overlap integral; K. Mandel and E. Agol, ApJ 580, L171, 2002,
//! section 2, give it in closed form for this law; here it is integrated numerically after
//! the substitution r = a + (b - a)(1 - cos t) / 2, which removes the square-root ends).

use crate::error::Result;
use crate::geometry::besselian::geocentric_separation_rad;
use crate::geometry::transit::TransitEvent;
use crate::sky::ephemeris::geocentric_state;

/// The linear limb-darkening coefficient (Eddington approximation).
pub const LIMB_DARKENING_U: f64 = 0.6;

/// The name of the limb-darkening law, for reports.
pub const LIMB_DARKENING_LAW: &str = "linear limb darkening I(mu)/I(1) = 1 - u (1 - mu) with u = 0.6 (grey atmosphere, Eddington approximation)";

/// Gauss-Legendre points in the substituted variable, per segment.
const NODES: usize = 96;

/// Gauss-Legendre nodes and weights on [-1, 1], found once by Newton's method on the
/// Legendre polynomial (W. H. Press et al., *Numerical Recipes*, 3rd ed., 2007, section 4.6,
/// routine gauleg).
fn gauss_legendre() -> &'static [(f64, f64)] {
    static RULE: std::sync::OnceLock<Vec<(f64, f64)>> = std::sync::OnceLock::new();
    RULE.get_or_init(|| {
        let n = NODES;
        (0..n)
            .map(|i| {
                let mut x = (std::f64::consts::PI * (i as f64 + 0.75) / (n as f64 + 0.5)).cos();
                let mut dp = 1.0;
                for _ in 0..100 {
                    let (mut p0, mut p1) = (1.0, x);
                    for k in 2..=n {
                        let k = k as f64;
                        let p2 = ((2.0 * k - 1.0) * x * p1 - (k - 1.0) * p0) / k;
                        p0 = p1;
                        p1 = p2;
                    }
                    dp = n as f64 * (x * p1 - p0) / (x * x - 1.0);
                    let dx = p1 / dp;
                    x -= dx;
                    if dx.abs() < 1e-15 {
                        break;
                    }
                }
                (x, 2.0 / ((1.0 - x * x) * dp * dp))
            })
            .collect()
    })
}

/// The Sun's intensity at radius r (units of its radius) relative to the centre's.
pub fn intensity(r: f64) -> f64 {
    let mu = (1.0 - r * r).max(0.0).sqrt();
    1.0 - LIMB_DARKENING_U * (1.0 - mu)
}

/// The Sun's whole flux in units of the central intensity times its radius squared.
pub fn solar_flux() -> f64 {
    std::f64::consts::PI * (1.0 - LIMB_DARKENING_U / 3.0)
}

/// The angle of the circle of radius `r` (about the Sun's centre) that lies inside the
/// planet's disc of radius `p` centred at distance `z`.
fn covered_arc(r: f64, p: f64, z: f64) -> f64 {
    if r + z <= p {
        return std::f64::consts::TAU;
    }
    if r >= z + p || r <= z - p || z <= 0.0 || r <= 0.0 {
        return 0.0;
    }
    let c = ((r * r + z * z - p * p) / (2.0 * r * z)).clamp(-1.0, 1.0);
    2.0 * c.acos()
}

/// Integral of f over [a, b] by Gauss-Legendre quadrature in t in [0, pi] after
/// r = a + (b - a)(1 - cos t)/2, which turns square-root ends into smooth ones.
fn integrate(f: impl Fn(f64) -> f64, a: f64, b: f64) -> f64 {
    if b <= a {
        return 0.0;
    }
    let half = 0.5 * (b - a);
    let half_pi = 0.5 * std::f64::consts::PI;
    gauss_legendre()
        .iter()
        .map(|&(x, w)| {
            let t = half_pi * (x + 1.0);
            let r = a + half * (1.0 - t.cos());
            f(r) * half * t.sin() * w * half_pi
        })
        .sum()
}

/// The fraction of the Sun's light blocked by a dark disc of radius `p` whose centre is `z`
/// from the Sun's (both in units of the Sun's radius).
pub fn blocked_fraction(p: f64, z: f64) -> f64 {
    if p <= 0.0 || z >= 1.0 + p {
        return 0.0;
    }
    let z = z.max(0.0);
    let lo = (z - p).max(0.0);
    let hi = (z + p).min(1.0);
    // Break at the kinks of the integrand: r = p - z (the planet covers whole circles inside
    // it) and r = 1 (the limb).
    let mut cuts = vec![lo, hi];
    if p - z > lo && p - z < hi {
        cuts.push(p - z);
    }
    cuts.sort_by(f64::total_cmp);
    let f = |r: f64| intensity(r) * covered_arc(r, p, z) * r;
    let blocked: f64 = cuts.windows(2).map(|w| integrate(f, w[0], w[1])).sum();
    blocked / solar_flux()
}

/// The planet's radius relative to the Sun's that blocks `depth` of the light when its
/// centre is `z` from the Sun's (units of the Sun's radius), found by bisection; `None` when
/// no disc up to the Sun's own size does.
pub fn radius_ratio_from_depth(depth: f64, z: f64) -> Option<f64> {
    if !(depth > 0.0 && depth < 1.0) {
        return None;
    }
    let (mut lo, mut hi) = (0.0_f64, 1.0_f64);
    if blocked_fraction(hi, z) < depth {
        return None;
    }
    for _ in 0..60 {
        let mid = 0.5 * (lo + hi);
        if blocked_fraction(mid, z) < depth {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    Some(0.5 * (lo + hi))
}

/// The geometry of the transit seen from the Earth's centre at one instant.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DiscGeometry {
    /// The planet's radius over the Sun's.
    pub radius_ratio: f64,
    /// The distance between the centres over the Sun's radius.
    pub separation_ratio: f64,
}

/// The geocentric geometry at `hours` from the event's epoch (the full model: light time,
/// aberration, the apparent semidiameters of both bodies).
pub fn disc_geometry(event: &TransitEvent, hours: f64) -> DiscGeometry {
    let tt = event.elements.instant(hours);
    let state = geocentric_state(event.planet, tt, event.time_model());
    let (sep, ext, int) = geocentric_separation_rad(event.planet, &state);
    let (s_sun, s_p) = (0.5 * (ext + int), 0.5 * (ext - int));
    DiscGeometry {
        radius_ratio: s_p / s_sun,
        separation_ratio: sep / s_sun,
    }
}

/// One point of a light curve.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct LightPoint {
    /// Hours from the event's epoch.
    pub hours: f64,
    /// The Sun's brightness relative to its unobstructed value (1 outside the transit).
    pub relative_flux: f64,
}

/// The light curve of an event seen from the Earth's centre, every `step_s` seconds from
/// `margin_s` before contact I to as long after contact IV.
///
/// Errors: a step that is not positive or would give more than a million points.
pub fn light_curve(event: &TransitEvent, step_s: f64, margin_s: f64) -> Result<Vec<LightPoint>> {
    let first = event.geocentric_hours[0].unwrap_or(event.hours_of_greatest());
    let last = event.geocentric_hours[3].unwrap_or(event.hours_of_greatest());
    let (start, end) = (first - margin_s / 3600.0, last + margin_s / 3600.0);
    let n = ((end - start) * 3600.0 / step_s).floor();
    if !(step_s > 0.0 && n.is_finite() && n < 1e6) {
        return Err(crate::Error::argument(format!(
            "a light-curve step of {step_s} s does not fit the transit; give a positive step of a second or more"
        )));
    }
    Ok((0..=n as usize)
        .map(|k| {
            let hours = start + k as f64 * step_s / 3600.0;
            let g = disc_geometry(event, hours);
            LightPoint {
                hours,
                relative_flux: 1.0 - blocked_fraction(g.radius_ratio, g.separation_ratio),
            }
        })
        .collect())
}

/// The fraction of the Sun's light blocked at greatest transit, seen from the Earth's centre.
pub fn depth_at_greatest(event: &TransitEvent) -> f64 {
    let g = disc_geometry(event, event.hours_of_greatest());
    blocked_fraction(g.radius_ratio, g.separation_ratio)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_small_disc_at_the_centre_blocks_its_area_times_the_central_brightness() {
        // Common practice, no source: a disc of radius p << 1 at the centre blocks
        // p^2 / (1 - u/3) of the light (area pi p^2 at the central intensity over the flux).
        let p = 0.01;
        let expect = p * p / (1.0 - LIMB_DARKENING_U / 3.0);
        assert!((blocked_fraction(p, 0.0) - expect).abs() < 1e-4 * expect);
        // Nothing before contact I, everything for a disc covering the Sun.
        assert_eq!(blocked_fraction(0.03, 1.031), 0.0);
        assert!((blocked_fraction(1.5, 0.0) - 1.0).abs() < 1e-9);
        // Near the limb the same disc blocks less (limb darkening).
        assert!(blocked_fraction(p, 0.9) < 0.7 * blocked_fraction(p, 0.0));
    }

    #[test]
    fn the_depth_inverts_to_the_radius() {
        for (p, z) in [(0.0306, 0.6), (0.005, 0.1), (0.03, 0.98)] {
            let d = blocked_fraction(p, z);
            let back = radius_ratio_from_depth(d, z).unwrap();
            assert!((back - p).abs() < 1e-9, "{p} {z}: {back}");
        }
        assert!(radius_ratio_from_depth(0.0, 0.5).is_none());
    }
}
