//! A first look at the Sun: the background and disc levels, the centroid and the radius of
//! the pixels above a threshold, and the checks that there is one disc, inside the frame.

use super::grey::GreyImage;

/// The rough disc: where to start looking for the limb.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RoughDisc {
    /// Centroid of the bright pixels, column coordinate in pixels.
    pub centre_x_px: f64,
    /// Centroid of the bright pixels, row coordinate in pixels.
    pub centre_y_px: f64,
    /// Radius of a disc of the same area, pixels.
    pub radius_px: f64,
    /// The background level (a low percentile of the frame).
    pub background: f64,
    /// The disc's bright level (a high percentile of the frame).
    pub peak: f64,
    /// True when a bright pixel lies on the outermost row or column.
    pub touches_frame: bool,
}

/// Why no rough disc was found.
#[derive(Debug, Clone, PartialEq)]
pub struct NoDisc(pub String);

/// The noise of the frame: 1.4826 x the median absolute difference of horizontally adjacent
/// pixels, over sqrt(2) (Rousseeuw & Croux 1993, JASA 88, 1273; a smooth scene adds little).
fn pixel_noise(image: &GreyImage) -> f64 {
    let stride = (image.pixels.len() / 200_000).max(1);
    let mut differences: Vec<f32> = (0..image.pixels.len() - 1)
        .step_by(stride)
        .filter(|i| (i + 1) % image.width != 0)
        .map(|i| (image.pixels[i + 1] - image.pixels[i]).abs())
        .collect();
    if differences.is_empty() {
        return 0.0;
    }
    let k = differences.len() / 2;
    let (_, median, _) = differences.select_nth_unstable_by(k, |a, b| a.total_cmp(b));
    1.4826 * *median as f64 / std::f64::consts::SQRT_2
}

/// The `fraction` quantile of every `stride`-th pixel.
fn quantile(image: &GreyImage, fraction: f64) -> f64 {
    let stride = (image.pixels.len() / 200_000).max(1);
    let mut sample: Vec<f32> = image.pixels.iter().step_by(stride).copied().collect();
    let k = ((sample.len() - 1) as f64 * fraction).round() as usize;
    let (_, value, _) = sample.select_nth_unstable_by(k, |a, b| a.total_cmp(b));
    *value as f64
}

/// Find the rough disc: the threshold is the background plus a fifth of the disc's contrast
/// (the limb of a limb-darkened Sun is still about 0.3 of the centre's brightness, Cox 2000,
/// *Allen's Astrophysical Quantities*, section 14.7), so the bright set is the whole disc.
///
/// # Errors
/// [`NoDisc`] with a reason when the frame has no contrast (the disc less than 15 times the
/// pixel noise above the background), too few bright pixels, or the
/// bright pixels are not gathered in one round disc (their mean squared distance from the
/// centroid is that of a uniform disc, R^2 / 2, within 25 %).
pub fn rough_disc(image: &GreyImage) -> Result<RoughDisc, NoDisc> {
    let background = quantile(image, 0.02);
    let peak = quantile(image, 0.998);
    if peak.partial_cmp(&background) != Some(std::cmp::Ordering::Greater) {
        return Err(NoDisc("the frame is uniform".to_string()));
    }
    let noise = pixel_noise(image);
    if peak - background < 15.0 * noise {
        return Err(NoDisc(format!(
            "the brightest pixels stand only {:.1} times the noise above the background",
            (peak - background) / noise
        )));
    }
    let threshold = (background + 0.2 * (peak - background)) as f32;
    let (mut count, mut sum_x, mut sum_y) = (0usize, 0.0f64, 0.0f64);
    let mut touches_frame = false;
    for row in 0..image.height {
        let line = &image.pixels[row * image.width..(row + 1) * image.width];
        let edge_row = row == 0 || row + 1 == image.height;
        for (column, &v) in line.iter().enumerate() {
            if v > threshold {
                count += 1;
                sum_x += column as f64;
                sum_y += row as f64;
                touches_frame |= edge_row || column == 0 || column + 1 == image.width;
            }
        }
    }
    if count < 300 {
        return Err(NoDisc(format!("only {count} bright pixels")));
    }
    let (cx, cy) = (sum_x / count as f64, sum_y / count as f64);
    let radius_px = (count as f64 / std::f64::consts::PI).sqrt();
    let mut sum_r2 = 0.0;
    for row in 0..image.height {
        for column in 0..image.width {
            if image.at(column, row) > threshold {
                sum_r2 += (column as f64 - cx).powi(2) + (row as f64 - cy).powi(2);
            }
        }
    }
    let roundness = (sum_r2 / count as f64) / (radius_px * radius_px / 2.0);
    if !(0.8..=1.25).contains(&roundness) && !touches_frame {
        return Err(NoDisc(format!(
            "the bright pixels are not one round disc (spread {roundness:.2} times a disc's)"
        )));
    }
    Ok(RoughDisc {
        centre_x_px: cx,
        centre_y_px: cy,
        radius_px,
        background,
        peak,
        touches_frame,
    })
}
