//! Statistics of a solution: chi-square, p-value, the Birge ratio and coverage factors, and
//! the robust scale that screening uses.
//!
//! References: P. R. Bevington and D. K. Robinson, *Data Reduction and Error Analysis for the
//! Physical Sciences*, 3rd ed. (2003), chapters 7-8 (chi-square, covariance); R. T. Birge,
//! Phys. Rev. 40, 207 (1932) (the ratio sqrt(chi^2/dof) as a test of stated uncertainties);
//! F. R. Hampel, JASA 69, 383 (1974) (the median absolute deviation).

use super::equations::Timing;
use super::fit::FitOutcome;
use super::parameters::ParameterSet;
use statrs::distribution::{ChiSquared, ContinuousCDF, StudentsT};

/// The chi-square statistics of a fit: the timings' weighted squares plus the priors of the
/// free parameters, with those priors counted as observations.
pub fn fit_statistics(
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    outcome: &FitOutcome,
) -> FitStatistics {
    let chi2: f64 = used
        .iter()
        .zip(&outcome.residuals_s)
        .map(|(&i, r)| (r / timings[i].obs.sigma_s).powi(2))
        .sum();
    let n_free = outcome.free.iter().filter(|&&f| f).count();
    let (prior_chi2, n_priors) = params.prior_chi2(&outcome.theta, &outcome.free);
    statistics(
        chi2 + prior_chi2,
        (used.len() + n_priors).saturating_sub(n_free),
    )
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
    /// Probability of a chi-square at most this small if the stated sigmas are right (the
    /// lower tail: small values say the sigmas are too large).
    pub p_lower: Option<f64>,
    /// Birge ratio sqrt(chi2 / dof).
    pub birge_ratio: Option<f64>,
    /// Factor applied to the uncertainties: max(1, Birge ratio).
    pub sigma_scale: f64,
    /// Two-sided 95 % coverage factor: Student's t with `dof` degrees of freedom when the
    /// uncertainties were scaled from the scatter, else the normal 1.96.
    pub coverage_factor_95: f64,
}

impl FitStatistics {
    /// "chi2 for dof degrees of freedom, p = ..., Birge ratio ..." for reports; where the
    /// chi-square is improbably small, the probability of so small a value instead.
    pub fn describe(&self) -> String {
        let tail = match (self.p_value, self.p_lower) {
            (_, Some(lo)) if lo < 0.05 => {
                format!(", probability of so small a value {}", probability(lo))
            }
            (Some(p), _) => format!(", p = {}", probability(p)),
            _ => String::new(),
        };
        format!(
            "{:.1} for {}{tail}{}",
            self.chi2,
            crate::words::count(self.dof, "degree of freedom", "degrees of freedom"),
            self.birge_ratio
                .map(|b| format!(", Birge ratio {b:.2}"))
                .unwrap_or_default()
        )
    }

    /// Whether the chi-square is improbably large (upper tail under 5 %).
    pub fn too_large(&self) -> bool {
        self.p_value.is_some_and(|p| p < 0.05)
    }

    /// Whether the chi-square is improbably small (lower tail under 5 %): the stated
    /// uncertainties are too large.
    pub fn too_small(&self) -> bool {
        self.p_lower.is_some_and(|p| p < 0.05)
    }
}

/// A probability to three decimals, or to two significant figures below 0.001 (never a bare
/// 0.000 or 1.000 for a value that is not).
pub fn probability(p: f64) -> String {
    if p < 1e-12 {
        "below 1e-12".to_string()
    } else if p < 0.001 {
        format!("{p:.1e}")
    } else if p > 0.999 && p < 1.0 {
        format!("1 - {:.1e}", 1.0 - p)
    } else {
        format!("{p:.3}")
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
            p_lower: None,
            birge_ratio: None,
            sigma_scale: 1.0,
            coverage_factor_95: 1.959_963_984_540_054,
        };
    }
    let d = dof as f64;
    let lower = ChiSquared::new(d).ok().map(|c| c.cdf(chi2));
    let p_value = ChiSquared::new(d).ok().map(|c| c.sf(chi2));
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
        p_lower: lower,
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
    fn both_tails_are_judged() {
        // Source: chi-square with 65 dof has P(< 25.7) of about 1.4e-6 (standard tables give
        // the 0.1 % point near 35.0); the campaign, 25.7 for 65 dof, is too small.
        let s = statistics(25.7, 65);
        assert!(s.too_small() && !s.too_large());
        assert!(
            s.describe().contains("so small a value"),
            "{}",
            s.describe()
        );
        assert!(!s.describe().contains("p = 1.000"), "{}", s.describe());
        let s = statistics(65.0, 65);
        assert!(!s.too_small() && !s.too_large());
        assert_eq!(probability(0.0000123), "1.2e-5");
        assert_eq!(probability(0.9999), "1 - 1.0e-4");
    }

    #[test]
    fn robust_sigma_ignores_a_wild_point() {
        let v = [-1.0, -0.5, 0.0, 0.5, 1.0, 1000.0];
        assert!(robust_sigma(&v) < 2.0);
        assert_eq!(median(&[3.0, 1.0, 2.0]), 2.0);
    }
}
