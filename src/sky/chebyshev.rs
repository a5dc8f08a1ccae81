//! Chebyshev series: interpolation at Chebyshev nodes and evaluation with the derivative.
//!
//! References: W. H. Press et al., *Numerical Recipes*, 3rd ed. (2007), section 5.8
//! (Chebyshev approximation, `chebft`/`chebev`) and 5.9 (derivatives of Chebyshev series).

/// Largest number of coefficients a series may hold.
pub const MAX_TERMS: usize = 24;

/// A Chebyshev series on an interval [start, end] of its argument.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Chebyshev {
    start: f64,
    end: f64,
    len: usize,
    coeffs: [f64; MAX_TERMS],
}

impl Chebyshev {
    /// The `n` Chebyshev nodes on [start, end], in increasing order.
    pub fn nodes(start: f64, end: f64, n: usize) -> Vec<f64> {
        let half = 0.5 * (end - start);
        let mid = 0.5 * (end + start);
        (0..n)
            .rev()
            .map(|k| mid + half * (std::f64::consts::PI * (k as f64 + 0.5) / n as f64).cos())
            .collect()
    }

    /// Interpolate values given at [`Chebyshev::nodes`] (same order, same `n`).
    ///
    /// Panics never; `n` is capped at [`MAX_TERMS`] by the caller's choice of nodes.
    pub fn fit(start: f64, end: f64, values: &[f64]) -> Chebyshev {
        let n = values.len().min(MAX_TERMS);
        let mut coeffs = [0.0; MAX_TERMS];
        for (j, c) in coeffs.iter_mut().enumerate().take(n) {
            let mut sum = 0.0;
            for (i, v) in values.iter().take(n).enumerate() {
                // values[i] sits at node k = n - 1 - i
                let k = (n - 1 - i) as f64;
                sum += v * (std::f64::consts::PI * j as f64 * (k + 0.5) / n as f64).cos();
            }
            *c = 2.0 * sum / n as f64;
        }
        coeffs[0] *= 0.5;
        Chebyshev {
            start,
            end,
            len: n,
            coeffs,
        }
    }

    /// A series on [start, end] with these coefficients (at most [`MAX_TERMS`]; more are
    /// ignored), e.g. read from a file of fitted series.
    pub fn from_coefficients(start: f64, end: f64, coefficients: &[f64]) -> Chebyshev {
        let n = coefficients.len().min(MAX_TERMS);
        let mut coeffs = [0.0; MAX_TERMS];
        coeffs[..n].copy_from_slice(&coefficients[..n]);
        Chebyshev {
            start,
            end,
            len: n,
            coeffs,
        }
    }

    /// Drop trailing coefficients whose magnitudes sum to less than `tolerance` (in the units
    /// of the function): the truncation error is bounded by that sum, since |T_j| <= 1.
    pub fn truncated(mut self, tolerance: f64) -> Chebyshev {
        let mut tail = 0.0;
        while self.len > 2 {
            let c = self.coeffs[self.len - 1].abs();
            if tail + c >= tolerance {
                break;
            }
            tail += c;
            self.coeffs[self.len - 1] = 0.0;
            self.len -= 1;
        }
        self
    }

    /// Number of coefficients kept.
    pub fn len(&self) -> usize {
        self.len
    }

    /// True when the series holds no coefficient (never, for a fitted series).
    pub fn is_empty(&self) -> bool {
        self.len == 0
    }

    /// The interval's start.
    pub fn start(&self) -> f64 {
        self.start
    }

    /// The interval's end.
    pub fn end(&self) -> f64 {
        self.end
    }

    /// Value and first derivative (per unit of the argument) at `t`.
    #[inline]
    pub fn value_and_rate(&self, t: f64) -> (f64, f64) {
        let scale = 2.0 / (self.end - self.start);
        let x = (t - self.start) * scale - 1.0;
        // T_j and T_j' by their recurrences.
        let (mut t0, mut t1) = (1.0, x);
        let (mut d0, mut d1) = (0.0, 1.0);
        if self.len < 2 {
            return (self.coeffs[0], 0.0);
        }
        let mut value = self.coeffs[0] + self.coeffs[1] * x;
        let mut rate = self.coeffs[1];
        for j in 2..self.len {
            let t2 = 2.0 * x * t1 - t0;
            let d2 = 2.0 * x * d1 + 2.0 * t1 - d0;
            value += self.coeffs[j] * t2;
            rate += self.coeffs[j] * d2;
            t0 = t1;
            t1 = t2;
            d0 = d1;
            d1 = d2;
        }
        (value, rate * scale)
    }

    /// Value at `t`.
    #[inline]
    pub fn value(&self, t: f64) -> f64 {
        self.value_and_rate(t).0
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    #[test]
    fn reproduces_a_polynomial_exactly() {
        let f = |t: f64| 3.0 - 2.0 * t + 0.5 * t * t - 0.1 * t.powi(3);
        let nodes = Chebyshev::nodes(-6.0, 7.0, 8);
        let values: Vec<f64> = nodes.iter().map(|&t| f(t)).collect();
        let c = Chebyshev::fit(-6.0, 7.0, &values);
        for t in [-6.0, -1.3, 0.0, 4.4, 7.0] {
            let (v, r) = c.value_and_rate(t);
            assert!((v - f(t)).abs() < 1e-12);
            assert!((r - (-2.0 + t - 0.3 * t * t)).abs() < 1e-11);
        }
    }

    #[test]
    fn truncation_bounds_the_error() {
        let nodes = Chebyshev::nodes(-6.0, 7.0, 20);
        let values: Vec<f64> = nodes.iter().map(|&t| (0.05 * t).exp()).collect();
        let full = Chebyshev::fit(-6.0, 7.0, &values);
        let short = full.truncated(1e-9);
        assert!(short.len() < full.len());
        for k in 0..50 {
            let t = -6.0 + 13.0 * k as f64 / 49.0;
            assert!((short.value(t) - full.value(t)).abs() < 1e-9);
        }
    }

    proptest! {
        #[test]
        fn derivative_matches_central_difference(t in -5.9f64..6.9) {
            let nodes = Chebyshev::nodes(-6.0, 7.0, 16);
            let values: Vec<f64> = nodes.iter().map(|&t| (0.3 * t).sin() + 0.01 * t * t).collect();
            let c = Chebyshev::fit(-6.0, 7.0, &values);
            let h = 1e-4;
            let fd = (c.value(t + h) - c.value(t - h)) / (2.0 * h);
            prop_assert!((c.value_and_rate(t).1 - fd).abs() < 1e-7);
            prop_assert!((c.value(t) - ((0.3 * t).sin() + 0.01 * t * t)).abs() < 1e-9);
        }
    }
}
