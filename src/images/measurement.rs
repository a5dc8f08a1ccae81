//! Measuring one image: the Sun's limb, the planet's disc, and the separation of their
//! centres in units of the Sun's radius, with its standard uncertainty.

use super::circle_fit::{robust_circle_fit, CircleFit};
use super::error::MeasureError;
use super::grey::GreyImage;
use super::limb::{
    area_edges, sky_and_edge_sigma, stacked_profile, steepest_descent_edges, Circle,
};
use super::limb_darkening::{fit_limb_darkening, LimbDarkening};
use super::planet::{find_dark_discs, fit_planet, DarkSearch};
use super::rough_disc::rough_disc;
use std::path::Path;

/// What one image gives: the separation and the fits behind it.
#[derive(Debug, Clone, PartialEq)]
pub struct DiscMeasurement {
    /// Distance of the planet's centre from the Sun's centre, in units of the Sun's radius.
    pub separation_solar_radii: f64,
    /// Standard uncertainty of the separation, solar radii (always positive).
    pub sigma_solar_radii: f64,
    /// The Sun's limb circle (pixels) with its covariance.
    pub sun: CircleFit,
    /// The planet's edge circle (pixels) with its covariance.
    pub planet: CircleFit,
    /// The planet's fitted radius in solar radii (the half-deficit radius: a little small for
    /// a disc not much larger than the blur).
    pub planet_radius_solar_radii: f64,
    /// Gaussian sigma of the limb's edge (the blur), pixels.
    pub edge_sigma_px: f64,
    /// The Sun's fitted limb-darkening profile.
    pub limb_darkening: LimbDarkening,
    /// Sky level outside the disc, image units.
    pub sky: f64,
}

fn limb_fit_error(path: &Path, reason: &str) -> MeasureError {
    MeasureError::LimbFit {
        path: path.to_path_buf(),
        reason: reason.to_string(),
    }
}

fn as_circle(fit: &CircleFit) -> Circle {
    (fit.centre_x_px, fit.centre_y_px, fit.radius_px)
}

/// True when the disc reaches within a pixel of the frame.
fn clipped(image: &GreyImage, sun: Circle) -> bool {
    sun.0 - sun.2 < 1.0
        || sun.1 - sun.2 < 1.0
        || sun.0 + sun.2 > image.width as f64 - 2.0
        || sun.1 + sun.2 > image.height as f64 - 2.0
}

/// First circle, profile and blur: rough disc, steepest-descent edges (twice), the
/// limb-darkening law and the edge width.
fn first_limb(
    path: &Path,
    image: &GreyImage,
) -> Result<(CircleFit, LimbDarkening, f64, f64), MeasureError> {
    let rough = rough_disc(image).map_err(|e| MeasureError::NoSun {
        path: path.to_path_buf(),
        reason: e.0,
    })?;
    if rough.touches_frame {
        return Err(MeasureError::ClippedLimb {
            path: path.to_path_buf(),
        });
    }
    let mut guess = (rough.centre_x_px, rough.centre_y_px, rough.radius_px);
    let mut fit = None;
    for half_window in [(0.12 * guess.2).max(15.0), (0.04 * guess.2).max(10.0)] {
        let edges = steepest_descent_edges(image, guess, half_window, None);
        let f = robust_circle_fit(&edges, 3.0)
            .ok_or_else(|| limb_fit_error(path, "too few edge points along the limb"))?;
        guess = as_circle(&f);
        fit = Some(f);
    }
    let fit = fit.ok_or_else(|| limb_fit_error(path, "no edge points"))?;
    if clipped(image, guess) {
        return Err(MeasureError::ClippedLimb {
            path: path.to_path_buf(),
        });
    }
    let law = fit_limb_darkening(image, (guess.0, guess.1), guess.2, 0.95 * guess.2 - 3.0)
        .ok_or_else(|| limb_fit_error(path, "the disc's brightness profile could not be fitted"))?;
    let half_window_px = (0.04 * guess.2).max(12.0);
    let stacked = stacked_profile(image, guess, half_window_px)
        .ok_or_else(|| limb_fit_error(path, "no complete radial profile"))?;
    let (sky, sigma_px) = sky_and_edge_sigma(&stacked, &law, guess.2, half_window_px)
        .ok_or_else(|| limb_fit_error(path, "the limb is no brighter than the sky"))?;
    Ok((fit, law, sky, sigma_px))
}

/// Measure the planet's place on the Sun in one grey image.
///
/// Steps: the rough disc (threshold and centroid); the limb at the steepest descent of radial
/// profiles and a robust circle fit; the Sun's limb-darkening law fitted to its own pixels;
/// the planet as the only dark disc in the deficit against that law, and its edge fitted as a
/// circle; the limb again, by the area under each profile (unbiased by blur and
/// limb darkening), away from the planet; the separation `d / R` and its uncertainty from the
/// two fits' covariances (first-order propagation, JCGM 100:2008, *Guide to the Expression of
/// Uncertainty in Measurement*, section 5.1.2, including the Sun's radius).
///
/// # Errors
/// [`MeasureError::NoSun`], [`MeasureError::ClippedLimb`], [`MeasureError::LimbFit`],
/// [`MeasureError::NoPlanet`], [`MeasureError::SeveralCandidates`],
/// [`MeasureError::PlanetFit`], each naming `path`.
pub fn measure_disc(path: &Path, image: &GreyImage) -> Result<DiscMeasurement, MeasureError> {
    let (first, law, sky, edge_sigma_px) = first_limb(path, image)?;
    let mut sun = as_circle(&first);
    let margin_px = (3.0 * edge_sigma_px).max(3.0);
    let candidate = match find_dark_discs(image, sun, &law, sun.2 - margin_px, 0.2) {
        DarkSearch::None => {
            return Err(MeasureError::NoPlanet {
                path: path.to_path_buf(),
            })
        }
        DarkSearch::Several(count) => {
            return Err(MeasureError::SeveralCandidates {
                path: path.to_path_buf(),
                count,
            })
        }
        DarkSearch::One(c) => c,
    };
    let planet_error = |reason: &str| MeasureError::PlanetFit {
        path: path.to_path_buf(),
        reason: reason.to_string(),
    };
    let planet = fit_planet(image, &candidate, sun, &law)
        .ok_or_else(|| planet_error("too few edge points around the dark disc"))?;
    let planet_circle = as_circle(&planet);
    if (planet_circle.0 - sun.0).hypot(planet_circle.1 - sun.1) + planet_circle.2
        > sun.2 - margin_px
    {
        return Err(planet_error("the planet's disc reaches the Sun's limb; use an image taken between the second and third contacts"));
    }
    let half_window_px = (8.0 * edge_sigma_px).clamp(12.0, 0.25 * sun.2);
    let avoid = Some((planet_circle, 3.0 * edge_sigma_px + 3.0));
    let mut sun_fit = first;
    for _round in 0..3 {
        // The law again, out to a few blur widths from the limb, for the circle of the round.
        let reach_px = sun.2 - (4.0 * edge_sigma_px + 2.0).max(5.0);
        let law = fit_limb_darkening(image, (sun.0, sun.1), sun.2, reach_px).ok_or_else(|| {
            limb_fit_error(path, "the disc's brightness profile could not be fitted")
        })?;
        let edges = area_edges(image, sun, &law, sky, edge_sigma_px, half_window_px, avoid);
        sun_fit = robust_circle_fit(&edges, 4.0)
            .ok_or_else(|| limb_fit_error(path, "too few edge points along the limb"))?;
        sun = as_circle(&sun_fit);
    }
    let (separation_solar_radii, sigma_solar_radii) = separation(&sun_fit, &planet);
    if !(sigma_solar_radii > 0.0
        && sigma_solar_radii.is_finite()
        && separation_solar_radii.is_finite())
    {
        return Err(limb_fit_error(path, "the fits give no finite uncertainty"));
    }
    Ok(DiscMeasurement {
        separation_solar_radii,
        sigma_solar_radii,
        planet_radius_solar_radii: planet.radius_px / sun_fit.radius_px,
        sun: sun_fit,
        planet,
        edge_sigma_px,
        limb_darkening: law,
        sky,
    })
}

/// `s = |c_planet - c_sun| / R_sun` and its standard uncertainty from the covariances of the
/// Sun's (x, y, R) and the planet's (x, y), the two fits independent (JCGM 100:2008,
/// equation 13).
pub fn separation(sun: &CircleFit, planet: &CircleFit) -> (f64, f64) {
    let (dx, dy) = (
        planet.centre_x_px - sun.centre_x_px,
        planet.centre_y_px - sun.centre_y_px,
    );
    let distance = dx.hypot(dy);
    let radius = sun.radius_px;
    let (ux, uy) = if distance > 1e-12 {
        (dx / distance, dy / distance)
    } else {
        (1.0, 0.0)
    };
    let s = distance / radius;
    let g_sun = [-ux / radius, -uy / radius, -s / radius];
    let g_planet = [ux / radius, uy / radius];
    let mut variance = 0.0;
    for i in 0..3 {
        for j in 0..3 {
            variance += g_sun[i] * sun.covariance_px2[i][j] * g_sun[j];
        }
    }
    for i in 0..2 {
        for j in 0..2 {
            variance += g_planet[i] * planet.covariance_px2[i][j] * g_planet[j];
        }
    }
    (s, variance.max(0.0).sqrt())
}
