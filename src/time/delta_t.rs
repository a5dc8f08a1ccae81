//! Delta T = TT - UT1 with its uncertainty, from the best published sources for each era
//! (`src/data/delta_t.txt`, written by `tools/fit_delta_t.py`, which names every source):
//!
//! - before the first observation in the file (1973): the cubic spline of Morrison,
//!   Stephenson, Hohenkerk and Zawilski (2021), with the uncertainty the authors tabulate (20 s
//!   in the 1630s, 2 s in the 1760s, 0.05 s from 1870); from 1955, where the spline's own
//!   departure from the IERS observations (0.27 s at worst) exceeds that figure, that departure;
//! - from 1973 to the last observation (2026 November): the IERS observations, with the
//!   error of interpolating their monthly values (under 0.007 s);
//! - for the year after: the IERS Bulletin A predictions, with the accuracy every Bulletin A
//!   states, 0.00025 (days ahead)^0.75 s;
//! - after that, an extrapolation from the last prediction by three published predictions:
//!   the same authors' own (their table for 2030-2400), the polynomials of Espenak and Meeus
//!   (2006), and the long-term parabola of Morrison and Stephenson (2004), each joined to the
//!   last IERS prediction. The value is the middle of their range and the uncertainty half
//!   the range (with the Bulletin A accuracy at the join in quadrature), never less than the
//!   authors' own uncertainty: it grows as the published predictions diverge (3 s in 2032,
//!   some 70 s by 2117).
//!
//! References: L. V. Morrison, F. R. Stephenson, C. Y. Hohenkerk and M. Zawilski, Proc. R.
//! Soc. A 477, 20200776 (2021), Table S15.2020, and the authors' tables at
//! <http://astro.ukho.gov.uk/nao/lvm/>; IERS Rapid Service/Prediction Center, Bulletin A and
//! finals2000A; F. Espenak and J. Meeus, NASA TP-2006-214141 (2006); L. V. Morrison and
//! F. R. Stephenson, J. Hist. Astron. 35, 327 (2004).

use super::delta_t_polynomials::{delta_t_espenak_meeus_s, delta_t_morrison_stephenson_s};
use std::sync::OnceLock;

/// What a Delta T value rests on.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum DeltaTBasis {
    /// The reconstruction of Morrison et al. (2021).
    Reconstruction,
    /// IERS observations.
    Observed,
    /// IERS Bulletin A predictions.
    Predicted,
    /// Published long-term predictions, joined to the last IERS prediction.
    Extrapolated,
}

/// Delta T at an instant, its standard uncertainty and what it rests on.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DeltaTEstimate {
    /// TT - UT1, seconds.
    pub delta_t_s: f64,
    /// Its standard uncertainty, seconds (always positive).
    pub sigma_s: f64,
    /// The source.
    pub basis: DeltaTBasis,
}

/// The parsed data file.
struct Table {
    /// (K0, K1, a0, a1, a2, a3).
    spline: Vec<[f64; 6]>,
    spline_departure_s: f64,
    /// (year, epsilon s).
    epsilon: Vec<(f64, f64)>,
    interpolation_error_s: f64,
    /// (decimal year, Delta T s).
    observed: Vec<(f64, f64)>,
    predicted: Vec<(f64, f64)>,
    /// (year, Delta T s, epsilon s).
    long_term: Vec<(f64, f64, f64)>,
}

/// The data file compiled in.
const DATA: &str = include_str!("../data/delta_t.txt");

fn parse() -> Table {
    let mut t = Table {
        spline: Vec::new(),
        spline_departure_s: 0.0,
        epsilon: Vec::new(),
        interpolation_error_s: 0.0,
        observed: Vec::new(),
        predicted: Vec::new(),
        long_term: Vec::new(),
    };
    for line in DATA.lines().filter(|l| !l.starts_with('#')) {
        let mut words = line.split_whitespace();
        let Some(key) = words.next() else { continue };
        let v: Vec<f64> = words.filter_map(|w| w.parse().ok()).collect();
        match (key, v.as_slice()) {
            ("spline", &[k0, k1, a0, a1, a2, a3]) => t.spline.push([k0, k1, a0, a1, a2, a3]),
            ("spline_minus_observed_worst_s", &[x]) => t.spline_departure_s = x,
            ("epsilon", &[y, e]) => t.epsilon.push((y, e)),
            ("observed_interpolation_error_s", &[x]) => t.interpolation_error_s = x,
            ("observed", &[y, d]) => t.observed.push((y, d)),
            ("predicted", &[y, d]) => t.predicted.push((y, d)),
            ("long_term", &[y, d, e]) => t.long_term.push((y, d, e)),
            _ => {}
        }
    }
    t
}

fn table() -> &'static Table {
    static TABLE: OnceLock<Table> = OnceLock::new();
    TABLE.get_or_init(parse)
}

/// Linear interpolation in a sorted series of (x, y), held flat beyond its ends.
fn interpolate(series: &[(f64, f64)], x: f64) -> f64 {
    let k = series.partition_point(|p| p.0 <= x);
    match (k.checked_sub(1).map(|i| series[i]), series.get(k)) {
        (Some(a), Some(b)) => a.1 + (b.1 - a.1) * (x - a.0) / (b.0 - a.0),
        (Some(a), None) => a.1,
        (None, Some(b)) => b.1,
        (None, None) => 0.0,
    }
}

impl Table {
    fn spline_s(&self, year: f64) -> f64 {
        let k = self
            .spline
            .partition_point(|s| s[0] <= year)
            .saturating_sub(1)
            .min(self.spline.len() - 1);
        let [k0, k1, a0, a1, a2, a3] = self.spline[k];
        let t = (year - k0) / (k1 - k0);
        a0 + t * (a1 + t * (a2 + t * a3))
    }

    /// The authors' epsilon: the larger of the two tabulated values that bracket the year.
    fn epsilon_s(&self, year: f64) -> f64 {
        let k = self.epsilon.partition_point(|e| e.0 <= year);
        let before = k.checked_sub(1).map(|i| self.epsilon[i]);
        let after = self.epsilon.get(k);
        match (before, after) {
            (Some(b), _) if b.0 == year => b.1,
            (Some(b), Some(a)) => b.1.max(a.1),
            (Some(b), None) => b.1,
            (None, Some(a)) => a.1,
            (None, None) => 0.0,
        }
    }

    /// The authors' long-term prediction (linear between their tabulated years, continued
    /// before the first with the slope of the first interval) and its epsilon.
    fn long_term_s(&self, year: f64) -> (f64, f64) {
        let lt = &self.long_term;
        let values: Vec<(f64, f64)> = lt.iter().map(|x| (x.0, x.1)).collect();
        let eps: Vec<(f64, f64)> = lt.iter().map(|x| (x.0, x.2)).collect();
        let value = if year < lt[0].0 {
            let slope = (lt[1].1 - lt[0].1) / (lt[1].0 - lt[0].0);
            lt[0].1 + slope * (year - lt[0].0)
        } else {
            interpolate(&values, year)
        };
        (value, interpolate(&eps, year))
    }

    /// The extrapolation after the last IERS prediction (see the module's notes).
    fn extrapolated(&self, year: f64) -> DeltaTEstimate {
        let &(y0, v0) = self.predicted.last().unwrap_or(&(2027.0, 69.4));
        let sigma0 = bulletin_a_sigma_s(y0 - self.last_observed_year());
        let increments = [
            self.long_term_s(year).0 - self.long_term_s(y0).0,
            delta_t_espenak_meeus_s(year) - delta_t_espenak_meeus_s(y0),
            delta_t_morrison_stephenson_s(year) - delta_t_morrison_stephenson_s(y0),
        ];
        let lo = increments.iter().copied().fold(f64::INFINITY, f64::min);
        let hi = increments.iter().copied().fold(f64::NEG_INFINITY, f64::max);
        let spread = 0.5 * (hi - lo);
        DeltaTEstimate {
            delta_t_s: v0 + 0.5 * (hi + lo),
            sigma_s: (sigma0 * sigma0 + spread * spread)
                .sqrt()
                .max(self.long_term_s(year).1),
            basis: DeltaTBasis::Extrapolated,
        }
    }

    fn last_observed_year(&self) -> f64 {
        self.observed.last().map_or(2026.8, |o| o.0)
    }
}

/// The accuracy of an IERS Bulletin A prediction of UT1 `lead_years` ahead: 0.00025
/// (days ahead)^0.75 seconds (the expression every Bulletin A prints).
fn bulletin_a_sigma_s(lead_years: f64) -> f64 {
    0.00025 * (lead_years.max(0.0) * 365.25).powf(0.75)
}

/// The year from which the spline's departure from the IERS observations, rather than the
/// authors' epsilon, bounds its error (the IERS series begins in 1962 in its C04 form; the
/// observations compiled in begin in 1973).
const SPLINE_DEPARTURE_FROM_YEAR: f64 = 1955.0;

/// Delta T at a decimal year (2000 + days from J2000 TT / 365.25), with its uncertainty and
/// its basis.
///
/// Arguments: `year`, decimal year of the TT instant.
/// Returns: the estimate; outside 1500-2400 the nearest source is continued (the toolkit
/// accepts 1600-2300).
/// References: see the module's notes.
pub fn delta_t_estimate(year: f64) -> DeltaTEstimate {
    let t = table();
    let first_observed = t.observed.first().map_or(1973.0, |o| o.0);
    let last_observed = t.last_observed_year();
    let last_predicted = t.predicted.last().map_or(last_observed, |p| p.0);
    if year < first_observed {
        let mut sigma = t.epsilon_s(year);
        if year >= SPLINE_DEPARTURE_FROM_YEAR {
            sigma = sigma.max(t.spline_departure_s);
        }
        return DeltaTEstimate {
            delta_t_s: t.spline_s(year),
            sigma_s: sigma,
            basis: DeltaTBasis::Reconstruction,
        };
    }
    if year <= last_observed {
        return DeltaTEstimate {
            delta_t_s: interpolate(&t.observed, year),
            sigma_s: t.interpolation_error_s.max(0.001),
            basis: DeltaTBasis::Observed,
        };
    }
    if year <= last_predicted {
        let mut series = vec![*t.observed.last().unwrap_or(&(year, 69.0))];
        series.extend_from_slice(&t.predicted);
        return DeltaTEstimate {
            delta_t_s: interpolate(&series, year),
            sigma_s: bulletin_a_sigma_s(year - last_observed).max(t.interpolation_error_s),
            basis: DeltaTBasis::Predicted,
        };
    }
    t.extrapolated(year)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_reconstruction_and_its_published_uncertainty() {
        // Source: Skyfield 1.53's Delta T (the same Table S15.2020), in
        // tests/reference/delta_t_skyfield.csv: 1769-06-03 20.5987 s, 1874-12-09 -1.0968 s,
        // 1882-12-06 -4.1540 s (tests/delta_t_reference.rs checks every row).
        let at = |y: f64| delta_t_estimate(y);
        let e = at(1769.425052);
        assert!((e.delta_t_s - 20.5987).abs() < 1e-3, "{e:?}");
        assert_eq!(e.basis, DeltaTBasis::Reconstruction);
        // The authors' epsilon: 2 s in 1760, 1 s in 1770: the larger bracketing value.
        assert_eq!(e.sigma_s, 2.0);
        assert!((at(1874.939083).delta_t_s + 1.0968).abs() < 1e-3);
        assert_eq!(at(1874.94).sigma_s, 0.05);
        assert!((at(1882.930869).delta_t_s + 4.1540).abs() < 1e-3);
        assert_eq!(at(1639.92).sigma_s, 20.0);
        // From 1955 the spline's measured departure from the IERS series bounds it.
        assert!((at(1965.0).sigma_s - 0.272).abs() < 1e-9);
    }

    #[test]
    fn observations_predictions_and_the_extrapolation() {
        // Source: IERS finals2000A via astropy-iers-data (tools/fit_delta_t.py), and Skyfield
        // 1.53's own IERS table in tests/reference/delta_t_skyfield.csv: 2012-06-06 66.762 s;
        // observed near 69.2 s from 2019 to 2026 (shared/method-notes.md).
        let e = delta_t_estimate(2012.428476);
        assert_eq!(e.basis, DeltaTBasis::Observed);
        assert!((e.delta_t_s - 66.762).abs() < 0.02, "{e:?}");
        assert!(e.sigma_s < 0.01);
        for y in [2019.5, 2023.0, 2026.5] {
            assert!((delta_t_estimate(y).delta_t_s - 69.2).abs() < 0.3, "{y}");
        }
        let p = delta_t_estimate(2027.3);
        assert_eq!(p.basis, DeltaTBasis::Predicted);
        assert!(p.sigma_s > 0.0 && p.sigma_s < 0.05, "{p:?}");
        // The extrapolation's uncertainty grows with the divergence of the predictions and
        // is never below the authors' own epsilon (2 s in 2030, 10 s in 2100).
        let mercury_2032 = delta_t_estimate(2032.87);
        let venus_2117 = delta_t_estimate(2117.94);
        assert_eq!(mercury_2032.basis, DeltaTBasis::Extrapolated);
        assert!(mercury_2032.sigma_s >= 2.0 && mercury_2032.sigma_s < 6.0);
        // Observed 69.2 s lies within 2 sigma of the 2032 value.
        assert!((mercury_2032.delta_t_s - 69.2).abs() < 2.0 * mercury_2032.sigma_s);
        assert!(venus_2117.sigma_s > 30.0 && venus_2117.sigma_s < 150.0);
        let mut last = 0.0;
        for y in (2030..=2300).step_by(10) {
            let s = delta_t_estimate(f64::from(y)).sigma_s;
            assert!(s >= last * 0.999, "{y}: {s} < {last}");
            last = s;
        }
    }

    #[test]
    fn the_model_is_continuous_where_its_sources_meet() {
        // Common practice: no jump of Delta T larger than its uncertainty where one source
        // hands over to the next.
        let t = table();
        for y in [
            t.observed[0].0,
            t.last_observed_year(),
            t.predicted.last().unwrap().0,
        ] {
            let a = delta_t_estimate(y - 1e-6);
            let b = delta_t_estimate(y + 1e-6);
            let jump = (a.delta_t_s - b.delta_t_s).abs();
            assert!(jump <= a.sigma_s.max(b.sigma_s), "{y}: {a:?} {b:?}");
        }
    }
}
