//! The planet's disc: a dark circle on the Sun, found in the deficit against the Sun's own
//! limb-darkening profile, checked to be the only one, and its edge fitted as a circle.

use super::circle_fit::{robust_circle_fit, CircleFit, EdgePoint};
use super::grey::GreyImage;
use super::limb::Circle;
use super::limb_darkening::LimbDarkening;

/// A dark region on the disc.
#[derive(Debug, Clone, PartialEq)]
pub struct DarkCandidate {
    /// Deficit-weighted centroid, column coordinate in pixels.
    pub centre_x_px: f64,
    /// Deficit-weighted centroid, row coordinate in pixels.
    pub centre_y_px: f64,
    /// Pixels above the threshold.
    pub area_px: usize,
    /// Largest deficit (0 = as bright as the Sun there, 1 = black).
    pub peak_deficit: f64,
}

/// The outcome of the search for dark discs.
#[derive(Debug, Clone, PartialEq)]
pub enum DarkSearch {
    /// None.
    None,
    /// Exactly one, the planet.
    One(DarkCandidate),
    /// Several of comparable size.
    Several(usize),
}

/// The deficit `1 - I / I_law(mu)` of pixel (column, row).
#[inline]
fn deficit(image: &GreyImage, column: usize, row: usize, sun: Circle, law: &LimbDarkening) -> f64 {
    let r = (column as f64 - sun.0).hypot(row as f64 - sun.1);
    1.0 - image.at(column, row) as f64 / law.at_radius(r, sun.2)
}

/// Find the dark discs within `inner_radius_px` of the Sun's centre: pixels whose deficit
/// exceeds `threshold` and whose shortfall `I_law - I` exceeds five times the noise (the
/// law's RMS), grouped by 4-connectivity; groups of fewer than 3 pixels are noise,
/// and groups smaller than a quarter of the largest are ignored (faint small spots). The
/// search is the "dark deficit" thresholding of a flat-fielded disc: Gonzalez, R. C. & Woods,
/// R. E. (2018), *Digital Image Processing*, 4th ed., sections 10.3 (thresholding) and 9.5
/// (connected components).
pub fn find_dark_discs(
    image: &GreyImage,
    sun: Circle,
    law: &LimbDarkening,
    inner_radius_px: f64,
    threshold: f64,
) -> DarkSearch {
    if inner_radius_px.is_nan() || inner_radius_px <= 1.0 || sun.0 < 0.0 || sun.1 < 0.0 {
        return DarkSearch::None;
    }
    let row_lo = (sun.1 - inner_radius_px).ceil().max(0.0) as usize;
    let row_hi = ((sun.1 + inner_radius_px).floor().max(0.0) as usize).min(image.height - 1);
    let col_lo = (sun.0 - inner_radius_px).ceil().max(0.0) as usize;
    let col_hi = ((sun.0 + inner_radius_px).floor().max(0.0) as usize).min(image.width - 1);
    if col_lo > col_hi || row_lo > row_hi {
        return DarkSearch::None;
    }
    let (w, h) = (col_hi + 1 - col_lo, row_hi + 1 - row_lo);
    let inside = |c: usize, r: usize| (c as f64 - sun.0).hypot(r as f64 - sun.1) < inner_radius_px;
    let mut dark = vec![false; w * h];
    for r in row_lo..=row_hi {
        for c in col_lo..=col_hi {
            dark[(r - row_lo) * w + (c - col_lo)] = inside(c, r) && {
                let expected = law.at_radius((c as f64 - sun.0).hypot(r as f64 - sun.1), sun.2);
                let shortfall = expected - image.at(c, r) as f64;
                shortfall > threshold * expected && shortfall > 5.0 * law.rms
            };
        }
    }
    let mut candidates = connected_candidates(&mut dark, (w, h), (col_lo, row_lo), |c, r| {
        deficit(image, c, r, sun, law)
    });
    let largest = candidates.iter().map(|c| c.area_px).max().unwrap_or(0);
    candidates.retain(|c| 4 * c.area_px >= largest);
    match candidates.len() {
        0 => DarkSearch::None,
        1 => DarkSearch::One(candidates.remove(0)),
        n => DarkSearch::Several(n),
    }
}

/// Group the marked pixels of a `w x h` window at (`col_lo`, `row_lo`) by 4-connectivity
/// (clearing the marks), each group as a candidate with its deficit-weighted centroid;
/// groups under 3 pixels are dropped as noise.
fn connected_candidates(
    dark: &mut [bool],
    (w, h): (usize, usize),
    (col_lo, row_lo): (usize, usize),
    deficit: impl Fn(usize, usize) -> f64,
) -> Vec<DarkCandidate> {
    let mut candidates: Vec<DarkCandidate> = Vec::new();
    let mut stack = Vec::new();
    for start in 0..dark.len() {
        if !dark[start] {
            continue;
        }
        dark[start] = false;
        stack.push(start);
        let (mut area, mut weight, mut sx, mut sy, mut peak) = (0usize, 0.0, 0.0, 0.0, 0.0f64);
        while let Some(i) = stack.pop() {
            let (c, r) = (i % w, i / w);
            let d = deficit(c + col_lo, r + row_lo);
            area += 1;
            weight += d;
            sx += d * (c + col_lo) as f64;
            sy += d * (r + row_lo) as f64;
            peak = peak.max(d);
            let neighbours = [
                (c > 0).then(|| i - 1),
                (c + 1 < w).then(|| i + 1),
                (r > 0).then(|| i - w),
                (r + 1 < h).then(|| i + w),
            ];
            for j in neighbours.into_iter().flatten() {
                if dark[j] {
                    dark[j] = false;
                    stack.push(j);
                }
            }
        }
        if area >= 3 && weight > 0.0 {
            candidates.push(DarkCandidate {
                centre_x_px: sx / weight,
                centre_y_px: sy / weight,
                area_px: area,
                peak_deficit: peak,
            });
        }
    }
    candidates
}

/// The deficit at a sub-pixel point (bilinear intensity over the law at that radius).
fn deficit_at(image: &GreyImage, x: f64, y: f64, sun: Circle, law: &LimbDarkening) -> Option<f64> {
    let r = (x - sun.0).hypot(y - sun.1);
    Some(1.0 - image.bilinear(x, y)? / law.at_radius(r, sun.2))
}

/// Edge points of the dark disc around `centre`: along rays from the centre, the first
/// crossing (outwards) of half the deficit at the centre, linearly interpolated. For a disc
/// blurred by a symmetric point-spread function the half-deficit contour is a circle
/// concentric with the disc, so the fitted centre is unbiased (its radius is a little smaller
/// for a disc not much larger than the blur).
fn half_deficit_edges(
    image: &GreyImage,
    centre: (f64, f64),
    radius_px: f64,
    sun: Circle,
    law: &LimbDarkening,
) -> Vec<EdgePoint> {
    let n = ((std::f64::consts::TAU * radius_px / 2.0).round() as usize).clamp(12, 720);
    let step = 0.25;
    let reach = 2.0 * radius_px + 4.0;
    let core: Vec<f64> = (0..8)
        .filter_map(|k| {
            let a = k as f64 * std::f64::consts::FRAC_PI_4;
            let r = 0.3 * radius_px;
            deficit_at(
                image,
                centre.0 + r * a.cos(),
                centre.1 + r * a.sin(),
                sun,
                law,
            )
        })
        .chain(deficit_at(image, centre.0, centre.1, sun, law))
        .collect();
    let level = 0.5 * core.iter().sum::<f64>() / core.len().max(1) as f64;
    let mut points = Vec::with_capacity(n);
    for i in 0..n {
        let angle = i as f64 * std::f64::consts::TAU / n as f64;
        let (ux, uy) = (angle.cos(), angle.sin());
        let mut previous = f64::NAN;
        let mut k = 0usize;
        while (k as f64) * step <= reach {
            let r = k as f64 * step;
            let Some(d) = deficit_at(image, centre.0 + r * ux, centre.1 + r * uy, sun, law) else {
                break;
            };
            if previous >= level && d < level {
                let r_edge = r - step + step * (previous - level) / (previous - d);
                points.push(EdgePoint {
                    x_px: centre.0 + r_edge * ux,
                    y_px: centre.1 + r_edge * uy,
                });
                break;
            }
            previous = d;
            k += 1;
        }
    }
    points
}

/// Fit the planet's edge as a circle, starting from a candidate: two rounds of half-deficit
/// edges and the robust circle fit, the second from the first's centre and radius.
pub fn fit_planet(
    image: &GreyImage,
    candidate: &DarkCandidate,
    sun: Circle,
    law: &LimbDarkening,
) -> Option<CircleFit> {
    let mut centre = (candidate.centre_x_px, candidate.centre_y_px);
    let mut radius = (candidate.area_px as f64 / std::f64::consts::PI)
        .sqrt()
        .max(1.0);
    let mut fit = None;
    for _round in 0..2 {
        let points = half_deficit_edges(image, centre, radius, sun, law);
        let f = robust_circle_fit(&points, 4.0)?;
        centre = (f.centre_x_px, f.centre_y_px);
        radius = f.radius_px.max(1.0);
        fit = Some(f);
    }
    fit
}
