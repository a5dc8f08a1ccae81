//! What a reduction gives: its settings, the fitted parameters, each station's contribution,
//! the statistics and every row not used, in one [`Reduction`].

use super::black_drop::BlackDropLag;
use super::classic_methods::MethodSolution;
use super::equations::perturbation;
use super::error_budget::ErrorBudget;
#[cfg(doc)]
use super::parameters::CLASSIC_NAMES;
use crate::geometry::contacts::Perturbation;
use crate::geometry::transit::TransitEvent;
use crate::observations::timings::Rejected;
use crate::reduction::planet_place::PlanetPlace;
use crate::reduction::statistics::FitStatistics;
use crate::sky::constants::nominal_parallax_arcsec;
use crate::sky::ephemeris::Planet;
use crate::time::scales::TimeModel;
use serde::Serialize;

/// Settings of a reduction.
#[derive(Clone, Copy, Debug)]
pub struct ReduceOptions {
    /// The event; inferred from the timings when `None`.
    pub event: Option<(Planet, chrono::NaiveDate)>,
    /// The a-priori solar parallax, arcsec.
    pub prior_parallax_arcsec: f64,
    /// Delta T and DUT1.
    pub time_model: TimeModel,
    /// Rejection threshold in robust standard deviations.
    pub outlier_threshold: f64,
    /// Whether to follow the solution as timings are added (for the report's convergence
    /// chart; Monte Carlo forecasts leave it out for speed).
    pub follow_convergence: bool,
    /// The planet's place relative to the Sun: free, held, or with a prior.
    pub planet_place: PlanetPlace,
    /// Whether to solve Halley's and Delisle's methods beside the full solution and draw up
    /// the error budget (a few more fits; Monte Carlo forecasts leave them out for speed).
    pub compare_methods: bool,
}

impl Default for ReduceOptions {
    fn default() -> Self {
        ReduceOptions {
            event: None,
            prior_parallax_arcsec: nominal_parallax_arcsec(),
            time_model: TimeModel::default(),
            outlier_threshold: 5.0,
            follow_convergence: true,
            planet_place: PlanetPlace::Free,
            compare_methods: true,
        }
    }
}

/// A fitted (or fixed) parameter.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Parameter {
    /// Name (see [`CLASSIC_NAMES`] for the global ones).
    pub name: String,
    /// Value.
    pub value: f64,
    /// Standard uncertainty (scaled by the Birge ratio when above 1); `None` if held fixed.
    pub sigma: Option<f64>,
    /// Unit.
    pub unit: String,
    /// Whether the data could not determine it and it was held at its a-priori value.
    pub fixed: bool,
}

/// The Halley chord of one station: the planet's apparent path across the disc between a pair
/// of contacts.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Chord {
    /// "interior" (II-III) or "exterior" (I-IV).
    pub pair: String,
    /// Path length between the observed contacts, arcsec.
    pub observed_arcsec: f64,
    /// Path length between the predicted contacts (fitted parameters), arcsec.
    pub predicted_arcsec: f64,
    /// Duration observed minus predicted, seconds.
    pub duration_o_c_s: f64,
    /// Closest approach of the station's path to the Sun's centre minus the geocentric
    /// path's, arcsec (positive: displaced away from the centre by parallax).
    pub parallax_displacement_arcsec: f64,
}

/// One station's part in the solution.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct StationContribution {
    /// Name.
    pub station: String,
    /// Latitude, degrees.
    pub latitude_deg: f64,
    /// Longitude, degrees east.
    pub longitude_deg: f64,
    /// Elevation, metres.
    pub elevation_m: f64,
    /// Timings used.
    pub timings: usize,
    /// Share of the information on the parallax (the stations' shares sum to 1).
    pub information_share: f64,
    /// Change of the parallax if the station is left out, arcsec (`None` when the rest cannot
    /// determine it).
    pub influence_arcsec: Option<f64>,
    /// O - C of the used timings, seconds, in the order of `contacts`.
    pub residuals_s: Vec<f64>,
    /// The contacts of those timings (for a timed interval, its later contact).
    pub contacts: Vec<u8>,
    /// The same as written: `2`, or `2-3` for a timed interval.
    pub contact_labels: Vec<String>,
    /// The observers named in the station's timings.
    pub observers: Vec<String>,
    /// Mean of the normalised residuals (O - C)/sigma.
    pub mean_normalised_residual: f64,
    /// The Halley chord, where a pair of contacts was timed.
    pub chord: Option<Chord>,
    /// For a station none of whose timings was used: why (the first rejected row's sentence).
    pub not_used: Option<String>,
}

/// The result of a reduction.
#[derive(Clone, Debug)]
pub struct Reduction {
    /// The event.
    pub event: TransitEvent,
    /// The a-priori parallax, arcsec.
    pub prior_parallax_arcsec: f64,
    /// How the planet's place entered the fit.
    pub planet_place: PlanetPlace,
    /// With the place held or constrained: how far the parallax moves (arcsec) if the
    /// ephemeris's place is wrong by its stated accuracy east, and north.
    pub place_bias_arcsec: Option<[f64; 2]>,
    /// The solar parallax (None when the timings cannot determine it).
    pub parallax_arcsec: Option<f64>,
    /// Its standard uncertainty.
    pub parallax_sigma_arcsec: Option<f64>,
    /// 95 % interval of the parallax.
    pub parallax_interval_95: Option<(f64, f64)>,
    /// The AU in km.
    pub au_km: Option<f64>,
    /// Its standard uncertainty, km: half the width of the exact image of pi -+ sigma (the AU
    /// is not given when pi - sigma reaches zero).
    pub au_sigma_km: Option<f64>,
    /// 95 % interval of the AU (the exact image of the parallax interval), km; the upper end
    /// is `None` (unbounded) when the parallax interval reaches zero.
    pub au_interval_95_km: Option<(f64, Option<f64>)>,
    /// Data rows read.
    pub timings_total: usize,
    /// Timings in the solution.
    pub timings_used: usize,
    /// Rows not used, by line.
    pub rejected: Vec<Rejected>,
    /// Stations ranked by information share.
    pub stations: Vec<StationContribution>,
    /// All parameters.
    pub parameters: Vec<Parameter>,
    /// Correlation matrix of the parameters (fixed ones have zero rows).
    pub correlation: Vec<Vec<f64>>,
    /// Chi-square statistics.
    pub statistics: FitStatistics,
    /// Robust scale of the normalised residuals of the used timings.
    pub robust_scatter: f64,
    /// Gauss-Newton iterations of the final fit.
    pub iterations: usize,
    /// Sentences the user must read (identifiability, scaling, convergence).
    pub warnings: Vec<String>,
    /// Rows used, with their final residuals (line, station, contact, O - C s, sigma s).
    pub used: Vec<UsedTiming>,
    /// How the parallax firmed up as timings were added in file order.
    pub convergence: Vec<ConvergencePoint>,
    /// The full solution, Halley's and Delisle's methods side by side (empty when not
    /// compared).
    pub methods: Vec<MethodSolution>,
    /// The terms of the parallax's uncertainty, where the parallax was determined and the
    /// methods compared.
    pub error_budget: Option<ErrorBudget>,
    /// The fitted lag of each judged interior contact behind the geometric one (empty where
    /// every timing is geometric).
    pub black_drop: Vec<BlackDropLag>,
}

/// The correlation from which two parameters count as one combination (prints as 1.000).
pub const INSEPARABLE_CORRELATION: f64 = 0.9995;

/// The AU from a determined parallax.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct AuFigure {
    /// AU, km.
    pub au_km: f64,
    /// Its standard uncertainty, km.
    pub au_sigma_km: f64,
    /// 95 % interval, km (upper end `None`: unbounded).
    pub au_interval_95_km: (f64, Option<f64>),
}

/// The result in one place: parallax and AU with their uncertainties and 95 % intervals.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Headline {
    /// Solar parallax, arcsec.
    pub parallax_arcsec: f64,
    /// Its standard uncertainty, arcsec.
    pub parallax_sigma_arcsec: f64,
    /// 95 % interval, arcsec.
    pub parallax_interval_95: (f64, f64),
    /// The AU, unless the parallax's one-sigma range reaches zero.
    pub au: Option<AuFigure>,
}

impl Reduction {
    /// The headline numbers, when the parallax was determined.
    pub fn headline(&self) -> Option<Headline> {
        let p = self.parallax_arcsec?;
        let au = match (self.au_km, self.au_sigma_km, self.au_interval_95_km) {
            (Some(au_km), Some(au_sigma_km), Some(au_interval_95_km)) => Some(AuFigure {
                au_km,
                au_sigma_km,
                au_interval_95_km,
            }),
            _ => None,
        };
        Some(Headline {
            parallax_arcsec: p,
            parallax_sigma_arcsec: self.parallax_sigma_arcsec?,
            parallax_interval_95: self.parallax_interval_95?,
            au,
        })
    }

    /// Where a fitted global parameter correlates at +-1 (|r| of at least 0.9995, printed as
    /// 1.000) with another fitted one, that one's name and the correlation: the timings fix
    /// their combination, not this parameter alone, so its value is not a result.
    pub fn inseparable(&self, j: usize) -> Option<(&str, f64)> {
        let row = self.correlation.get(j)?;
        let fitted = |k: usize| {
            self.parameters
                .get(k)
                .is_some_and(|p| !p.fixed && p.sigma.is_some())
        };
        if !fitted(j) {
            return None;
        }
        row.iter()
            .enumerate()
            .filter(|&(k, r)| k != j && fitted(k) && r.abs() >= INSEPARABLE_CORRELATION)
            .max_by(|a, b| a.1.abs().total_cmp(&b.1.abs()))
            .map(|(k, &r)| (self.parameters[k].name.as_str(), r))
    }

    /// The fitted parameters as changes to the elements.
    pub fn perturbation(&self) -> Perturbation {
        let theta: Vec<f64> = self.parameters.iter().map(|p| p.value).collect();
        perturbation(&theta, self.event.earth_radii_per_arcsec())
    }
}

/// The solution after the first `timings` used timings (in the order of the file).
#[derive(Clone, Copy, Debug, PartialEq, Serialize)]
pub struct ConvergencePoint {
    /// Number of timings in this partial solution.
    pub timings: usize,
    /// Parallax, arcsec.
    pub parallax_arcsec: f64,
    /// Its standard uncertainty (Birge-scaled), arcsec.
    pub sigma_arcsec: f64,
}

/// A timing in the solution.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct UsedTiming {
    /// Line in the file.
    pub line: u64,
    /// Station name.
    pub station: String,
    /// Contact 1-4 (for a timed interval, its later contact).
    pub contact: u8,
    /// The contact as written: `2`, or `2-3` for a timed interval.
    pub contact_label: String,
    /// Who timed it (empty where the file does not say).
    pub observer: String,
    /// O - C, seconds.
    pub o_c_s: f64,
    /// Standard uncertainty used, seconds.
    pub sigma_s: f64,
    /// How the timing was made.
    pub metadata: crate::observations::timing_metadata::TimingMetadata,
}
