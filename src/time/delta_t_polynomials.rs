//! Published formulas for Delta T that the tool does not use as its model but weighs among the
//! predictions for the years after the last observation (see `delta_t.rs`): the Espenak and
//! Meeus polynomials and the long-term parabola of Morrison and Stephenson.

/// Delta T = TT - UT1 in seconds from the Espenak and Meeus polynomials, for a decimal year.
///
/// Arguments: `year`, decimal year (the source uses y = year + (month - 0.5) / 12).
/// Returns: Delta T in seconds.
/// Notes: valid 1600 to 2150 and, as the long-term parabola -20 + 32 u^2, beyond. The pieces
/// from 1961 on are quoted from memory of the source (shared/references.md marks them so);
/// the tool's own model is [`super::delta_t::delta_t_estimate`].
/// References: F. Espenak and J. Meeus, *Five Millennium Canon of Solar Eclipses: -1999 to
/// +3000*, NASA TP-2006-214141 (2006), section 2.6 (polynomial expressions for Delta T).
pub fn delta_t_espenak_meeus_s(year: f64) -> f64 {
    let y = year;
    if !(1600.0..2150.0).contains(&y) {
        let u = (y - 1820.0) / 100.0;
        return -20.0 + 32.0 * u * u;
    }
    if y < 1700.0 {
        let t = y - 1600.0;
        return 120.0 - 0.9808 * t - 0.01532 * t * t + t.powi(3) / 7129.0;
    }
    if y < 1800.0 {
        let t = y - 1700.0;
        return 8.83 + 0.1603 * t - 0.005_928_5 * t * t + 0.000_133_36 * t.powi(3)
            - t.powi(4) / 1_174_000.0;
    }
    if y < 1860.0 {
        let t = y - 1800.0;
        return 13.72 - 0.332_447 * t + 0.006_861_2 * t * t + 0.004_111_6 * t.powi(3)
            - 0.000_374_36 * t.powi(4)
            + 0.000_012_127_2 * t.powi(5)
            - 0.000_000_169_9 * t.powi(6)
            + 0.000_000_000_875 * t.powi(7);
    }
    if y < 1900.0 {
        let t = y - 1860.0;
        return 7.62 + 0.5737 * t - 0.251_754 * t * t + 0.016_806_68 * t.powi(3)
            - 0.000_447_362_4 * t.powi(4)
            + t.powi(5) / 233_174.0;
    }
    if y < 1920.0 {
        let t = y - 1900.0;
        return -2.79 + 1.494_119 * t - 0.059_893_9 * t * t + 0.006_196_6 * t.powi(3)
            - 0.000_197 * t.powi(4);
    }
    if y < 1941.0 {
        let t = y - 1920.0;
        return 21.20 + 0.844_93 * t - 0.076_100 * t * t + 0.002_093_6 * t.powi(3);
    }
    if y < 1961.0 {
        let t = y - 1950.0;
        return 29.07 + 0.407 * t - t * t / 233.0 + t.powi(3) / 2547.0;
    }
    if y < 1986.0 {
        let t = y - 1975.0;
        return 45.45 + 1.067 * t - t * t / 260.0 - t.powi(3) / 718.0;
    }
    if y < 2005.0 {
        let t = y - 2000.0;
        return 63.86 + 0.3345 * t - 0.060_374 * t * t
            + 0.001_727_5 * t.powi(3)
            + 0.000_651_814 * t.powi(4)
            + 0.000_023_735_99 * t.powi(5);
    }
    if y < 2050.0 {
        let t = y - 2000.0;
        return 62.92 + 0.322_17 * t + 0.005_589 * t * t;
    }
    let u = (y - 1820.0) / 100.0;
    -20.0 + 32.0 * u * u - 0.5628 * (2150.0 - y)
}

/// The long-term parabola of Delta T, -20 + 32 u^2 seconds with u = (year - 1820) / 100.
///
/// References: L. V. Morrison and F. R. Stephenson, J. Hist. Astron. 35, 327 (2004), as quoted
/// by Espenak and Meeus (2006), section 2.6 (common practice; from memory of those sources).
pub fn delta_t_morrison_stephenson_s(year: f64) -> f64 {
    let u = (year - 1820.0) / 100.0;
    -20.0 + 32.0 * u * u
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn delta_t_matches_published_polynomial_values() {
        // Source: Espenak and Meeus, NASA TP-2006-214141, polynomials; values computed from
        // them in shared/references.md, y = year + (month - 0.5)/12.
        let cases = [
            (1761.0 + 5.5 / 12.0, 15.1),
            (1769.0 + 5.5 / 12.0, 16.2),
            (1874.0 + 11.5 / 12.0, -3.1),
            (1882.0 + 11.5 / 12.0, -5.5),
            (2004.0 + 5.5 / 12.0, 64.6),
            (2012.0 + 5.5 / 12.0, 67.8),
        ];
        for (y, expected) in cases {
            let got = delta_t_espenak_meeus_s(y);
            assert!((got - expected).abs() < 0.06, "{y}: {got} vs {expected}");
        }
    }

    #[test]
    fn delta_t_polynomials_join_at_their_boundaries() {
        // Common practice, no source: the pieces are continuous to well under a second.
        for y in [
            1700.0, 1800.0, 1860.0, 1900.0, 1920.0, 1941.0, 1961.0, 1986.0, 2005.0, 2050.0,
        ] {
            let jump = delta_t_espenak_meeus_s(y) - delta_t_espenak_meeus_s(y - 1e-9);
            assert!(jump.abs() < 1.0, "{y}: {jump}");
        }
    }
}
