//! Fitting a circle to edge points: an algebraic start, then a geometric least-squares fit
//! with the rejection of outlying points and the covariance of centre and radius.

use nalgebra::{Matrix3, Vector3};

/// A point in pixel coordinates (`x` to the right, `y` down), in pixels.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct EdgePoint {
    /// Column coordinate, pixels.
    pub x_px: f64,
    /// Row coordinate, pixels.
    pub y_px: f64,
}

/// A fitted circle with its covariance.
#[derive(Debug, Clone, PartialEq)]
pub struct CircleFit {
    /// Centre, column coordinate in pixels.
    pub centre_x_px: f64,
    /// Centre, row coordinate in pixels.
    pub centre_y_px: f64,
    /// Radius in pixels.
    pub radius_px: f64,
    /// Covariance of (centre x, centre y, radius), pixels squared.
    pub covariance_px2: [[f64; 3]; 3],
    /// RMS of the geometric residuals of the points kept, pixels.
    pub rms_residual_px: f64,
    /// Points kept in the final fit.
    pub points_used: usize,
    /// Points rejected as outliers.
    pub points_rejected: usize,
}

/// Algebraic circle fit: minimises `sum (x^2 + y^2 + D x + E y + F)^2`, linear in D, E, F.
///
/// Returns (centre x, centre y, radius) in pixels, or `None` for fewer than three points or
/// collinear points.
///
/// # References
/// Kåsa, I. (1976), "A circle fitting procedure and its error analysis", IEEE Transactions on
/// Instrumentation and Measurement IM-25, 8-14. Chernov, N. (2010), *Circular and Linear
/// Regression: Fitting Circles and Lines by Least Squares*, CRC Press, section 5.1.
pub fn kasa_fit(points: &[EdgePoint]) -> Option<(f64, f64, f64)> {
    if points.len() < 3 {
        return None;
    }
    // Centre the coordinates for conditioning.
    let n = points.len() as f64;
    let mx = points.iter().map(|p| p.x_px).sum::<f64>() / n;
    let my = points.iter().map(|p| p.y_px).sum::<f64>() / n;
    let mut normal = Matrix3::<f64>::zeros();
    let mut rhs = Vector3::<f64>::zeros();
    for p in points {
        let (x, y) = (p.x_px - mx, p.y_px - my);
        let row = Vector3::new(x, y, 1.0);
        normal += row * row.transpose();
        rhs -= row * (x * x + y * y);
    }
    let solution = normal.lu().solve(&rhs)?;
    let (cx, cy) = (-solution[0] / 2.0, -solution[1] / 2.0);
    let radius2 = cx * cx + cy * cy - solution[2];
    (radius2 > 0.0 && radius2.is_finite()).then(|| (cx + mx, cy + my, radius2.sqrt()))
}

/// One geometric least-squares fit (Gauss-Newton on the distances to the circle) from a
/// start; returns the circle, its normal matrix `J^T J` and the residuals.
fn geometric_fit(
    points: &[EdgePoint],
    start: (f64, f64, f64),
) -> Option<((f64, f64, f64), Matrix3<f64>)> {
    let (mut cx, mut cy, mut radius) = start;
    let mut normal = Matrix3::zeros();
    for _ in 0..30 {
        normal = Matrix3::zeros();
        let mut gradient = Vector3::zeros();
        for p in points {
            let (dx, dy) = (p.x_px - cx, p.y_px - cy);
            let distance = dx.hypot(dy);
            if distance == 0.0 {
                continue;
            }
            let row = Vector3::new(-dx / distance, -dy / distance, -1.0);
            normal += row * row.transpose();
            gradient += row * (distance - radius);
        }
        let step = normal.lu().solve(&(-gradient))?;
        cx += step[0];
        cy += step[1];
        radius += step[2];
        if !(cx.is_finite() && cy.is_finite() && radius > 0.0) {
            return None;
        }
        if step.norm() < 1e-10 * radius.max(1.0) {
            break;
        }
    }
    Some(((cx, cy, radius), normal))
}

fn residuals(points: &[EdgePoint], circle: (f64, f64, f64)) -> Vec<f64> {
    points
        .iter()
        .map(|p| (p.x_px - circle.0).hypot(p.y_px - circle.1) - circle.2)
        .collect()
}

fn median(values: &mut [f64]) -> f64 {
    values.sort_by(|a, b| a.total_cmp(b));
    let n = values.len();
    if n % 2 == 1 {
        values[n / 2]
    } else {
        0.5 * (values[n / 2 - 1] + values[n / 2])
    }
}

/// Robust circle fit: Kåsa's algebraic fit as a start, then the geometric least-squares fit,
/// rejecting points whose residual exceeds `reject_sigmas` robust standard deviations
/// (1.4826 x the median absolute residual) and refitting until none is rejected.
///
/// The covariance is `s^2 (J^T J)^-1` with `s^2` the residuals' sum of squares over `n - 3`
/// (Gauss-Markov, points independent and of equal weight).
///
/// # References
/// Gander, W., Golub, G. H. & Strebel, R. (1994), "Least-squares fitting of circles and
/// ellipses", BIT Numerical Mathematics 34, 558-578, section 3 (geometric fit).
/// Chernov (2010), chapter 6 (statistical properties, covariance). Rousseeuw, P. J. & Croux,
/// C. (1993), JASA 88, 1273-1283 (the MAD as a robust scale, factor 1.4826).
pub fn robust_circle_fit(points: &[EdgePoint], reject_sigmas: f64) -> Option<CircleFit> {
    let mut kept: Vec<EdgePoint> = points.to_vec();
    let mut circle = kasa_fit(&kept)?;
    for _round in 0..8 {
        let (fitted, _) = geometric_fit(&kept, circle)?;
        circle = fitted;
        let all = residuals(points, circle);
        let mut absolute: Vec<f64> = all.iter().map(|r| r.abs()).collect();
        let scale = (1.4826 * median(&mut absolute)).max(1e-6);
        let next: Vec<EdgePoint> = points
            .iter()
            .zip(&all)
            .filter(|(_, r)| r.abs() <= reject_sigmas * scale)
            .map(|(p, _)| *p)
            .collect();
        let same = next.len() == kept.len();
        kept = next;
        if kept.len() < 5 {
            return None;
        }
        if same {
            break;
        }
    }
    let (circle, normal) = geometric_fit(&kept, circle)?;
    let kept_residuals = residuals(&kept, circle);
    let dof = (kept.len() as f64 - 3.0).max(1.0);
    let variance_px2 = kept_residuals.iter().map(|r| r * r).sum::<f64>() / dof;
    let inverse = normal.try_inverse()?;
    let covariance = inverse * variance_px2;
    let mut covariance_px2 = [[0.0; 3]; 3];
    for (i, row) in covariance_px2.iter_mut().enumerate() {
        for (j, value) in row.iter_mut().enumerate() {
            *value = covariance[(i, j)];
        }
    }
    Some(CircleFit {
        centre_x_px: circle.0,
        centre_y_px: circle.1,
        radius_px: circle.2,
        covariance_px2,
        rms_residual_px: variance_px2.sqrt(),
        points_used: kept.len(),
        points_rejected: points.len() - kept.len(),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn ring(cx: f64, cy: f64, radius: f64, n: usize) -> Vec<EdgePoint> {
        (0..n)
            .map(|i| {
                let a = i as f64 * std::f64::consts::TAU / n as f64;
                EdgePoint {
                    x_px: cx + radius * a.cos(),
                    y_px: cy + radius * a.sin(),
                }
            })
            .collect()
    }

    #[test]
    fn exact_points_give_the_circle_back() {
        // Common practice, no source: points on a known circle.
        let points = ring(312.25, 287.5, 201.75, 90);
        let (x, y, r) = kasa_fit(&points).expect("fit");
        assert!((x - 312.25).abs() < 1e-9 && (y - 287.5).abs() < 1e-9 && (r - 201.75).abs() < 1e-9);
        let fit = robust_circle_fit(&points, 4.0).expect("fit");
        assert!((fit.radius_px - 201.75).abs() < 1e-9);
    }

    #[test]
    fn an_outlier_is_rejected() {
        let mut points = ring(100.0, 120.0, 80.0, 60);
        for (i, p) in points.iter_mut().enumerate() {
            p.x_px += 0.05 * ((i * 7 % 5) as f64 - 2.0);
        }
        points[3].x_px += 15.0;
        let fit = robust_circle_fit(&points, 4.0).expect("fit");
        assert_eq!(fit.points_rejected, 1);
        assert!((fit.centre_x_px - 100.0).abs() < 0.05);
        assert!(fit.covariance_px2[2][2] > 0.0);
    }
}
