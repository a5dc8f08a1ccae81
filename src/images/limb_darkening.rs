//! The Sun's own limb-darkening profile, fitted to its pixels as a quadratic in mu.

use super::grey::GreyImage;
use nalgebra::{Matrix3, Vector3};

/// Intensity across the disc, `I(mu) = a + b mu + c mu^2`, with `mu = sqrt(1 - (r/R)^2)` the
/// cosine of the angle between the line of sight and the normal to the Sun's surface.
///
/// The quadratic law is the form of Cox (2000), *Allen's Astrophysical Quantities*, 4th ed.,
/// section 14.7, `I(mu)/I(1) = 1 - u2 - v2 + u2 mu + v2 mu^2`, fitted here with free
/// coefficients so that the camera's band and response do not matter.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LimbDarkening {
    /// Intensity at the limb (mu = 0), image units.
    pub a: f64,
    /// Coefficient of mu, image units.
    pub b: f64,
    /// Coefficient of mu^2, image units.
    pub c: f64,
    /// RMS of the pixels about the profile (the noise, image units).
    pub rms: f64,
    /// Pixels used in the final fit.
    pub pixels_used: usize,
}

impl LimbDarkening {
    /// The profile's intensity at `mu`.
    #[inline]
    pub fn at_mu(&self, mu: f64) -> f64 {
        self.a + mu * (self.b + mu * self.c)
    }

    /// The profile's intensity at `r_px` from the centre of a disc of radius `radius_px`.
    #[inline]
    pub fn at_radius(&self, r_px: f64, radius_px: f64) -> f64 {
        self.at_mu(mu_at(r_px, radius_px))
    }

    /// d I / d r at `r_px` (image units per pixel), for `r_px < radius_px`.
    pub fn slope_per_px(&self, r_px: f64, radius_px: f64) -> f64 {
        let mu = mu_at(r_px, radius_px).max(1e-6);
        let dmu_dr = -r_px / (radius_px * radius_px * mu);
        (self.b + 2.0 * self.c * mu) * dmu_dr
    }

    /// `integral from r0 to R of (I(r) - background) dr`, pixels x image units, by Simpson's
    /// rule in the substitution `r = R - s^2` that removes the square root at the limb.
    pub fn integral_to_limb(&self, r0_px: f64, radius_px: f64, background: f64) -> f64 {
        let top = (radius_px - r0_px).max(0.0).sqrt();
        let n = 64;
        let h = top / n as f64;
        let f = |s: f64| (self.at_radius(radius_px - s * s, radius_px) - background) * 2.0 * s;
        let mut sum = f(0.0) + f(top);
        for i in 1..n {
            sum += f(i as f64 * h) * if i % 2 == 1 { 4.0 } else { 2.0 };
        }
        sum * h / 3.0
    }
}

/// `mu = sqrt(1 - (r/R)^2)`, 0 outside the disc.
#[inline]
pub fn mu_at(r_px: f64, radius_px: f64) -> f64 {
    let q = r_px / radius_px;
    (1.0 - q * q).max(0.0).sqrt()
}

/// Fit the profile to the pixels within `inner_radius_px` of the centre (one pixel in
/// `stride` in each direction), in two passes: the second drops pixels darker or brighter
/// than four RMS of the first (the planet, spots).
pub fn fit_limb_darkening(
    image: &GreyImage,
    centre: (f64, f64),
    radius_px: f64,
    inner_radius_px: f64,
) -> Option<LimbDarkening> {
    let area = std::f64::consts::PI * inner_radius_px * inner_radius_px;
    let stride = ((area / 150_000.0).sqrt().floor() as usize).max(1);
    let mut model: Option<LimbDarkening> = None;
    for _pass in 0..2 {
        let mut normal = Matrix3::<f64>::zeros();
        let mut rhs = Vector3::<f64>::zeros();
        let (mut count, mut sum_sq) = (0usize, 0.0);
        let row_lo = (centre.1 - inner_radius_px).ceil().max(0.0) as usize;
        let row_hi = ((centre.1 + inner_radius_px).floor() as usize).min(image.height - 1);
        for row in (row_lo..=row_hi).step_by(stride) {
            let dy = row as f64 - centre.1;
            let half = (inner_radius_px * inner_radius_px - dy * dy)
                .max(0.0)
                .sqrt();
            let col_lo = (centre.0 - half).ceil().max(0.0) as usize;
            let col_hi = ((centre.0 + half).floor().max(0.0) as usize).min(image.width - 1);
            for column in (col_lo..=col_hi).step_by(stride) {
                let r = (column as f64 - centre.0).hypot(dy);
                let mu = mu_at(r, radius_px);
                let value = image.at(column, row) as f64;
                if let Some(m) = &model {
                    if (value - m.at_mu(mu)).abs() > 4.0 * m.rms {
                        continue;
                    }
                }
                let basis = Vector3::new(1.0, mu, mu * mu);
                normal += basis * basis.transpose();
                rhs += basis * value;
                sum_sq += value * value;
                count += 1;
            }
        }
        if count < 30 {
            return None;
        }
        let coefficients = normal.lu().solve(&rhs)?;
        // Residual sum of squares from the normal equations: y.y - x.(A^T y).
        let residual_sq = (sum_sq - coefficients.dot(&rhs)).max(0.0);
        let rms = (residual_sq / (count as f64 - 3.0)).sqrt().max(1e-9);
        model = Some(LimbDarkening {
            a: coefficients[0],
            b: coefficients[1],
            c: coefficients[2],
            rms,
            pixels_used: count,
        });
    }
    model.filter(|m| m.a.is_finite() && m.at_mu(1.0) > 0.0)
}
