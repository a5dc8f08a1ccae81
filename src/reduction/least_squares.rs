//! Weighted linear least squares for the condition equations, with parameters that can be held
//! fixed, a rank test that says which parameter combinations the data cannot determine, and the
//! statistics of the solution.
//!
//! References: P. R. Bevington and D. K. Robinson, *Data Reduction and Error Analysis for the
//! Physical Sciences*, 3rd ed. (2003), chapters 7-8 (least squares, chi-square, covariance);
//! W. H. Press et al., *Numerical Recipes*, 3rd ed. (2007), section 15.4 (general linear least
//! squares, singular value decomposition); R. T. Birge, Phys. Rev. 40, 207 (1932) (the ratio
//! sqrt(chi^2/dof) as a test of stated uncertainties).

use nalgebra::{DMatrix, DVector};
use statrs::distribution::{ChiSquared, ContinuousCDF, StudentsT};

/// The smallest ratio of singular values (of the column-normalised, weighted design matrix)
/// treated as independent information; below it the parameters are practically confounded
/// (their variances inflated some 10^7 times over an orthogonal design). Calibrated on
/// campaigns: world-wide networks of 30-45 stations give 2.6e-3 to 8e-3; six stations within
/// 70 km of each other, or one kind of contact only, give 2e-5 to 4e-5.
pub const RANK_TOLERANCE: f64 = 2e-4;

/// One weighted least-squares step.
#[derive(Clone, Debug)]
pub struct LinearSolution {
    /// Corrections to the free parameters (zero for fixed ones), in parameter order.
    pub correction: DVector<f64>,
    /// Unscaled covariance of all parameters (zero rows and columns for fixed ones).
    pub covariance: DMatrix<f64>,
    /// The normal matrix J^T W J of the free parameters (in free-parameter order).
    pub normal_free: DMatrix<f64>,
}

/// Solve min sum w_i (r_i - J_i . delta)^2 over the free parameters.
///
/// Arguments: `jacobian` (n x p), `residuals` (n), `weights` (n, 1/sigma^2), `free` (p flags).
/// Returns: `None` when the free parameters are not all determined (see [`confounded`]).
pub fn solve_weighted(
    jacobian: &DMatrix<f64>,
    residuals: &DVector<f64>,
    weights: &DVector<f64>,
    free: &[bool],
) -> Option<LinearSolution> {
    let p = jacobian.ncols();
    let idx: Vec<usize> = (0..p).filter(|&j| free[j]).collect();
    let jf = jacobian.select_columns(&idx);
    let wj = DMatrix::from_fn(jf.nrows(), jf.ncols(), |i, j| jf[(i, j)] * weights[i]);
    let normal = jf.transpose() * &wj;
    let rhs = wj.transpose() * residuals;
    let chol = normal.clone().cholesky()?;
    let delta_free = chol.solve(&rhs);
    let cov_free = chol.inverse();
    let mut correction = DVector::zeros(p);
    let mut covariance = DMatrix::zeros(p, p);
    for (a, &ja) in idx.iter().enumerate() {
        correction[ja] = delta_free[a];
        for (b, &jb) in idx.iter().enumerate() {
            covariance[(ja, jb)] = cov_free[(a, b)];
        }
    }
    Some(LinearSolution {
        correction,
        covariance,
        normal_free: normal,
    })
}

/// If the free parameters are confounded, the right singular vector of the smallest singular
/// value of the weighted, column-normalised design matrix, over all p parameters (zero for
/// fixed ones); `None` when they are all determined.
pub fn confounded(
    jacobian: &DMatrix<f64>,
    weights: &DVector<f64>,
    free: &[bool],
) -> Option<Vec<f64>> {
    let p = jacobian.ncols();
    let idx: Vec<usize> = (0..p).filter(|&j| free[j]).collect();
    if idx.is_empty() {
        return None;
    }
    let mut a = DMatrix::from_fn(jacobian.nrows(), idx.len(), |i, j| {
        jacobian[(i, idx[j])] * weights[i].sqrt()
    });
    for j in 0..a.ncols() {
        let n = a.column(j).norm();
        if n > 0.0 {
            a.column_mut(j).scale_mut(1.0 / n);
        }
    }
    if a.nrows() < a.ncols() {
        // Fewer equations than unknowns: pad so that the SVD shows the null space.
        let cols = a.ncols();
        a = a.resize_vertically(cols, 0.0);
    }
    let svd = a.svd(false, true);
    let v_t = svd.v_t.as_ref()?;
    let (imin, smin) =
        svd.singular_values
            .iter()
            .enumerate()
            .fold(
                (0, f64::INFINITY),
                |acc, (i, &s)| if s < acc.1 { (i, s) } else { acc },
            );
    let smax = svd.singular_values.max();
    if smax > 0.0 && smin / smax >= RANK_TOLERANCE {
        return None;
    }
    let mut out = vec![0.0; p];
    for (k, &j) in idx.iter().enumerate() {
        out[j] = v_t[(imin, k)];
    }
    Some(out)
}

/// Chi-square statistics of a solution.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FitStatistics {
    /// Weighted sum of squared residuals.
    pub chi2: f64,
    /// Degrees of freedom (timings used minus free parameters).
    pub dof: usize,
    /// Probability of a chi-square at least this large if the stated sigmas are right.
    pub p_value: Option<f64>,
    /// Birge ratio sqrt(chi2 / dof).
    pub birge_ratio: Option<f64>,
    /// Factor applied to the uncertainties: max(1, Birge ratio).
    pub sigma_scale: f64,
    /// Two-sided 95 % coverage factor: Student's t with `dof` degrees of freedom when the
    /// uncertainties were scaled from the scatter, else the normal 1.96.
    pub coverage_factor_95: f64,
}

impl FitStatistics {
    /// "chi2 for dof degrees of freedom, p = ..., Birge ratio ..." for reports.
    pub fn describe(&self) -> String {
        format!(
            "{:.1} for {} degrees of freedom{}{}",
            self.chi2,
            self.dof,
            self.p_value
                .map(|p| format!(", p = {p:.3}"))
                .unwrap_or_default(),
            self.birge_ratio
                .map(|b| format!(", Birge ratio {b:.2}"))
                .unwrap_or_default()
        )
    }
}

/// Statistics from the chi-square and the degrees of freedom.
pub fn statistics(chi2: f64, dof: usize) -> FitStatistics {
    // An empty sum of floats is -0.0; print it as 0.
    let chi2 = chi2 + 0.0;
    if dof == 0 {
        return FitStatistics {
            chi2,
            dof,
            p_value: None,
            birge_ratio: None,
            sigma_scale: 1.0,
            coverage_factor_95: 1.959_963_984_540_054,
        };
    }
    let d = dof as f64;
    let p_value = ChiSquared::new(d).ok().map(|c| 1.0 - c.cdf(chi2));
    let birge = (chi2 / d).sqrt();
    let scaled = birge > 1.0;
    let coverage = if scaled {
        StudentsT::new(0.0, 1.0, d)
            .map(|t| t.inverse_cdf(0.975))
            .unwrap_or(1.959_963_984_540_054)
    } else {
        1.959_963_984_540_054
    };
    FitStatistics {
        chi2,
        dof,
        p_value,
        birge_ratio: Some(birge),
        sigma_scale: birge.max(1.0),
        coverage_factor_95: coverage,
    }
}

/// Median of a slice (NaN-free); 0 for an empty slice.
pub fn median(values: &[f64]) -> f64 {
    if values.is_empty() {
        return 0.0;
    }
    let mut v = values.to_vec();
    v.sort_by(|a, b| a.total_cmp(b));
    let n = v.len();
    if n % 2 == 1 {
        v[n / 2]
    } else {
        0.5 * (v[n / 2 - 1] + v[n / 2])
    }
}

/// Robust standard deviation: 1.4826 x the median absolute deviation from the median
/// (consistent with sigma for a normal distribution; Hampel 1974, JASA 69, 383).
pub fn robust_sigma(values: &[f64]) -> f64 {
    let m = median(values);
    let dev: Vec<f64> = values.iter().map(|v| (v - m).abs()).collect();
    1.4826 * median(&dev)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn recovers_a_straight_line() {
        // y = 2 + 3 x, exact.
        let xs = [0.0, 1.0, 2.0, 3.0, 4.0];
        let j = DMatrix::from_fn(5, 2, |i, k| if k == 0 { 1.0 } else { xs[i] });
        let r = DVector::from_iterator(5, xs.iter().map(|x| 2.0 + 3.0 * x));
        let w = DVector::from_element(5, 1.0);
        let s = solve_weighted(&j, &r, &w, &[true, true]).unwrap();
        assert!((s.correction[0] - 2.0).abs() < 1e-12);
        assert!((s.correction[1] - 3.0).abs() < 1e-12);
        // Source: Bevington and Robinson, eq. 6.21-6.23: var(b) = N / Delta for unit weights.
        let delta = 5.0 * 30.0 - 10.0 * 10.0;
        assert!((s.covariance[(1, 1)] - 5.0 / delta).abs() < 1e-12);
    }

    #[test]
    fn detects_confounded_columns_and_names_them() {
        let j = DMatrix::from_fn(4, 3, |i, k| match k {
            0 => 1.0,
            1 => 2.0,
            _ => i as f64,
        });
        let w = DVector::from_element(4, 1.0);
        let v = confounded(&j, &w, &[true, true, true]).unwrap();
        assert!(v[0].abs() > 0.5 && v[1].abs() > 0.5 && v[2].abs() < 1e-6);
        assert!(confounded(&j, &w, &[true, false, true]).is_none());
    }

    #[test]
    fn statistics_follow_the_distributions() {
        // Source: standard tables: chi-square with 10 dof has P(>18.307) = 0.05; Student's t
        // with 10 dof has a 97.5 % point of 2.228.
        let s = statistics(18.307, 10);
        assert!((s.p_value.unwrap() - 0.05).abs() < 1e-4);
        assert!((s.coverage_factor_95 - 2.228).abs() < 1e-3);
        let s = statistics(5.0, 10);
        assert_eq!(s.sigma_scale, 1.0);
        assert!((s.coverage_factor_95 - 1.96).abs() < 1e-3);
    }

    #[test]
    fn robust_sigma_ignores_a_wild_point() {
        let v = [-1.0, -0.5, 0.0, 0.5, 1.0, 1000.0];
        assert!(robust_sigma(&v) < 2.0);
        assert_eq!(median(&[3.0, 1.0, 2.0]), 2.0);
    }
}
