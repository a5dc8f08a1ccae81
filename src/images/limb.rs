//! The Sun's limb: edge points along radial profiles, first at the steepest descent, then
//! by the area under each profile against the Sun's own limb-darkening law.

use super::circle_fit::EdgePoint;
use super::grey::GreyImage;
use super::limb_darkening::LimbDarkening;

/// Sampling step along a ray, pixels.
const STEP_PX: f64 = 0.5;

/// A circle in pixels: centre x, centre y, radius.
pub type Circle = (f64, f64, f64);

/// How many rays for a disc of `radius_px`: one per three pixels of limb, so that no two
/// rays share a pixel (their errors are then independent), between 64 and 2,048.
pub fn ray_count(radius_px: f64) -> usize {
    ((std::f64::consts::TAU * radius_px / 3.0).round() as usize).clamp(64, 2048)
}

/// True when the ray at `angle_rad` from `circle`'s centre, between `r_in_px` and
/// `r_out_px`, passes within `clearance_px` of the circle `avoid`.
fn ray_meets(
    circle: Circle,
    angle_rad: f64,
    r_in_px: f64,
    r_out_px: f64,
    avoid: Circle,
    clearance_px: f64,
) -> bool {
    let (ux, uy) = (angle_rad.cos(), angle_rad.sin());
    let (dx, dy) = (avoid.0 - circle.0, avoid.1 - circle.1);
    let along = (dx * ux + dy * uy).clamp(r_in_px, r_out_px);
    (dx - along * ux).hypot(dy - along * uy) < avoid.2 + clearance_px
}

/// The profile along a ray from `centre` at `angle_rad`, from `r_from_px` in `count` steps;
/// `None` when it leaves the frame.
fn profile(
    image: &GreyImage,
    centre: (f64, f64),
    angle_rad: f64,
    r_from_px: f64,
    count: usize,
) -> Option<Vec<f64>> {
    let (ux, uy) = (angle_rad.cos(), angle_rad.sin());
    (0..count)
        .map(|k| {
            let r = r_from_px + k as f64 * STEP_PX;
            image.bilinear(centre.0 + r * ux, centre.1 + r * uy)
        })
        .collect()
}

/// Edge points at the steepest descent of each radial profile between `radius_px -
/// half_window_px` and `radius_px + half_window_px`, refined to a fraction of a step by a
/// parabola through the three central differences around the extreme. Rays meeting `avoid`
/// are skipped.
pub fn steepest_descent_edges(
    image: &GreyImage,
    guess: Circle,
    half_window_px: f64,
    avoid: Option<(Circle, f64)>,
) -> Vec<EdgePoint> {
    let n = ray_count(guess.2);
    let r_from = (guess.2 - half_window_px).max(1.0);
    let count = (2.0 * half_window_px / STEP_PX).ceil() as usize + 1;
    let mut points = Vec::with_capacity(n);
    for i in 0..n {
        let angle = i as f64 * std::f64::consts::TAU / n as f64;
        if let Some((circle, clearance)) = avoid {
            if ray_meets(
                guess,
                angle,
                r_from,
                guess.2 + half_window_px,
                circle,
                clearance,
            ) {
                continue;
            }
        }
        let Some(p) = profile(image, (guess.0, guess.1), angle, r_from, count) else {
            continue;
        };
        let slope: Vec<f64> = (1..count - 1).map(|k| p[k + 1] - p[k - 1]).collect();
        let Some((k, _)) = slope.iter().enumerate().min_by(|a, b| a.1.total_cmp(b.1)) else {
            continue;
        };
        let mut offset = 0.0;
        if k > 0 && k + 1 < slope.len() {
            let (a, b, c) = (slope[k - 1], slope[k], slope[k + 1]);
            let curvature = a - 2.0 * b + c;
            if curvature > 0.0 {
                offset = (0.5 * (a - c) / curvature).clamp(-1.0, 1.0);
            }
        }
        let r = r_from + (k as f64 + 1.0 + offset) * STEP_PX;
        points.push(EdgePoint {
            x_px: guess.0 + r * angle.cos(),
            y_px: guess.1 + r * angle.sin(),
        });
    }
    points
}

/// The stacked (azimuthally averaged) profile about `circle`, `radius - half_window` to
/// `radius + half_window`, one value per step; rays leaving the frame are skipped.
pub fn stacked_profile(image: &GreyImage, circle: Circle, half_window_px: f64) -> Option<Vec<f64>> {
    let n = ray_count(circle.2);
    let count = (2.0 * half_window_px / STEP_PX).ceil() as usize + 1;
    let mut sum = vec![0.0; count];
    let mut rays = 0usize;
    for i in 0..n {
        let angle = i as f64 * std::f64::consts::TAU / n as f64;
        if let Some(p) = profile(
            image,
            (circle.0, circle.1),
            angle,
            circle.2 - half_window_px,
            count,
        ) {
            sum.iter_mut().zip(&p).for_each(|(s, v)| *s += v);
            rays += 1;
        }
    }
    (rays > 0).then(|| sum.iter().map(|s| s / rays as f64).collect())
}

/// The sky level and the width of the limb's edge from a stacked profile that starts
/// `half_window_px` inside `radius_px`: the sky as the mean of its outer quarter; the blur as
/// a Gaussian sigma from the second moments of the slopes, since the variance of a profile's
/// slope adds under convolution: `sigma^2 = Var(-dP/dr) - Var(-dS/dr)`, with P the observed
/// profile and S the sharp one (the fitted law ending at the limb with a step down to the sky).
pub fn sky_and_edge_sigma(
    stacked: &[f64],
    law: &LimbDarkening,
    radius_px: f64,
    half_window_px: f64,
) -> Option<(f64, f64)> {
    let n = stacked.len();
    let outer = &stacked[n - n / 4..];
    let sky = outer.iter().sum::<f64>() / outer.len() as f64;
    if (law.a - sky).partial_cmp(&0.0) != Some(std::cmp::Ordering::Greater) {
        return None;
    }
    let r_in = radius_px - half_window_px;
    let observed: Vec<(f64, f64)> = (1..n - 1)
        .map(|k| {
            (
                r_in + k as f64 * STEP_PX,
                -(stacked[k + 1] - stacked[k - 1]) / (2.0 * STEP_PX),
            )
        })
        .collect();
    // The sharp profile's slope: -dL/dr inside (substitution r = R - s^2), a step at R.
    let top = half_window_px.sqrt();
    let steps = 400;
    let mut sharp: Vec<(f64, f64)> = (0..steps)
        .map(|i| {
            let s = (i as f64 + 0.5) * top / steps as f64;
            let r = radius_px - s * s;
            (
                r,
                -law.slope_per_px(r, radius_px) * 2.0 * s * top / steps as f64,
            )
        })
        .collect();
    sharp.push((radius_px, law.a - sky));
    let variance = |pairs: &[(f64, f64)], spaced: f64| -> f64 {
        let total: f64 = pairs.iter().map(|p| p.1 * spaced).sum();
        let mean = pairs.iter().map(|p| p.0 * p.1 * spaced).sum::<f64>() / total;
        pairs
            .iter()
            .map(|p| (p.0 - mean).powi(2) * p.1 * spaced)
            .sum::<f64>()
            / total
    };
    let sigma2 = variance(&observed, STEP_PX) - variance(&sharp, 1.0);
    let sigma_px = sigma2.max(0.09).sqrt();
    sigma_px.is_finite().then_some((sky, sigma_px))
}

/// Edge points by the area under each radial profile (the "integral" edge, independent of the
/// blur for a symmetric point-spread function): with `A` the integral of (profile - sky) from
/// `R - w` to `R + w`, the edge on that ray is `R + (A - A_model) / (I(R - w) - sky)`, where
/// `A_model` is the same integral for the fitted limb-darkening law ending at `R`, corrected
/// for the blur at the inner end by `-(sigma^2 / 2) dI/dr` (the first moment of the difference
/// between a sharp and a Gaussian-blurred window). The divisor is the change of the area when
/// the whole limb profile (edge and limb darkening together) moves outwards by one pixel.
pub fn area_edges(
    image: &GreyImage,
    circle: Circle,
    law: &LimbDarkening,
    sky: f64,
    edge_sigma_px: f64,
    half_window_px: f64,
    avoid: Option<(Circle, f64)>,
) -> Vec<EdgePoint> {
    let n = ray_count(circle.2);
    let r_in = circle.2 - half_window_px;
    let count = (2.0 * half_window_px / STEP_PX).round() as usize + 1;
    let height = law.at_radius(r_in, circle.2) - sky;
    let model = law.integral_to_limb(r_in, circle.2, sky)
        - 0.5 * edge_sigma_px * edge_sigma_px * law.slope_per_px(r_in, circle.2);
    let mut points = Vec::with_capacity(n);
    for i in 0..n {
        let angle = i as f64 * std::f64::consts::TAU / n as f64;
        if let Some((planet, clearance)) = avoid {
            if ray_meets(
                circle,
                angle,
                r_in,
                circle.2 + half_window_px,
                planet,
                clearance,
            ) {
                continue;
            }
        }
        let Some(p) = profile(image, (circle.0, circle.1), angle, r_in, count) else {
            continue;
        };
        let inner = p[1..count - 1].iter().map(|v| v - sky).sum::<f64>();
        let area = (inner + 0.5 * (p[0] + p[count - 1] - 2.0 * sky)) * STEP_PX;
        let r = circle.2 + (area - model) / height;
        points.push(EdgePoint {
            x_px: circle.0 + r * angle.cos(),
            y_px: circle.1 + r * angle.sin(),
        });
    }
    points
}
