//! How well a station's longitude is known (`longitude_sigma_deg`): exactly (the default), to
//! a standard uncertainty in degrees, or not at all. Where it is not exact, the reduction
//! solves for a correction to it (see `reduction::parameters`).

/// The a-priori knowledge of a station's longitude.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub enum LongitudeKnowledge {
    /// Taken as exact (the column empty, 0, or absent).
    #[default]
    Exact,
    /// Known to this standard uncertainty, degrees.
    Sigma(f64),
    /// Not known: a correction is solved for with no prior.
    Unknown,
}

impl LongitudeKnowledge {
    /// Parse a `longitude_sigma_deg` field: empty or 0, a positive number of degrees up to
    /// 180, or `unknown`; otherwise the sentence that says how to fix it.
    pub fn parse(text: &str) -> Result<LongitudeKnowledge, String> {
        let t = text.trim();
        if t.is_empty() {
            return Ok(LongitudeKnowledge::Exact);
        }
        if t.eq_ignore_ascii_case("unknown") {
            return Ok(LongitudeKnowledge::Unknown);
        }
        match t.parse::<f64>() {
            Ok(0.0) => Ok(LongitudeKnowledge::Exact),
            Ok(v) if v.is_finite() && v > 0.0 && v <= 180.0 => Ok(LongitudeKnowledge::Sigma(v)),
            _ => Err(format!(
                "'{t}' is not a longitude uncertainty; give a positive number of degrees up to 180, 0 or nothing for an exact longitude, or unknown"
            )),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_form_parses_and_bad_ones_are_explained() {
        assert_eq!(LongitudeKnowledge::parse(""), Ok(LongitudeKnowledge::Exact));
        assert_eq!(
            LongitudeKnowledge::parse("0"),
            Ok(LongitudeKnowledge::Exact)
        );
        assert_eq!(
            LongitudeKnowledge::parse("0.25"),
            Ok(LongitudeKnowledge::Sigma(0.25))
        );
        assert_eq!(
            LongitudeKnowledge::parse("Unknown"),
            Ok(LongitudeKnowledge::Unknown)
        );
        for bad in ["-1", "181", "NaN", "inf", "about 1"] {
            assert!(
                LongitudeKnowledge::parse(bad)
                    .unwrap_err()
                    .contains("unknown"),
                "{bad}"
            );
        }
    }
}
