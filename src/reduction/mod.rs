//! Stage 5, the reduction: from contact timings to the solar parallax and the astronomical
//! unit.
//!
//! Takes validated timings and an event; gives a [`Reduction`]: the parallax and the AU with
//! honest uncertainties, every parameter and its correlations, the chi-square statistics,
//! each station's share of the information and influence, and every row not used with the
//! blunder that explains it. `pipeline.rs` calls the pieces in the order of docs/reduction.md:
//!
//! - `parameters.rs`: the campaign's parameter set (global and per-station, units, priors,
//!   held fixed).
//! - `black_drop.rs`: the lag of a judged interior contact behind the geometric one, as
//!   parameters.
//! - `equations.rs`: the condition equations (computed times and partial derivatives).
//! - `normal_equations.rs`: the normal equations with per-station parameters eliminated block
//!   by block.
//! - `identifiability.rs`: the rank test and what to hold fixed when the timings cannot
//!   separate parameters.
//! - `fit.rs`: Gauss-Newton iteration.
//! - `statistics.rs`: chi-square, p-value, Birge ratio, coverage factors, robust scale.
//! - `agreement.rs`: the one rule, shared with the service's feedback, for whether a contact
//!   occurs at a station (the ephemeris at nominal parameters) and whether a timing fits.
//! - `screening.rs`: timings of the event, visibility, pre-screening, sigma clipping.
//! - `undated.rs`: times written without a date take the date nearest their predicted contact.
//! - `diagnosis.rs`: the blunder rules (zone time, date, contacts exchanged, coordinates,
//!   clocks).
//! - `historical_diagnosis.rs`: the blunders of historical records (day reckonings, apparent
//!   and mean time, prime meridians, times to the minute).
//! - `rejection.rs`: station-wide tests and the record of every row not used.
//! - `contributions.rs`: information shares, influence, Halley chords, convergence.
//! - `residual_groups.rs`: the residuals grouped by clock source and by aperture class.
//! - `result.rs`: the settings and the result types.
//! - `classic_methods.rs`: Halley's and Delisle's methods beside the full solution (shared
//!   types, the comparison by the covariance of the estimates); `halley.rs`, `delisle.rs`:
//!   each method.
//! - `error_budget.rs`: the terms of the parallax's uncertainty (timings, longitudes, Delta T,
//!   the planet's place).
//! - `planet_place.rs`: the planet's place free, held or with a prior, and the bias that
//!   holding it risks.
//! - `pipeline.rs`: [`reduce`] and [`reduce_for_event`].
pub mod agreement;
pub mod black_drop;
pub mod classic_methods;
pub mod contributions;
pub mod delisle;
pub mod diagnosis;
pub mod equations;
pub mod error_budget;
pub mod fit;
pub mod halley;
pub mod historical_diagnosis;
pub mod identifiability;
pub mod normal_equations;
pub mod parameters;
pub mod pipeline;
pub mod planet_place;
pub mod rejection;
pub mod residual_groups;
pub mod result;
pub mod row_blunders;
pub mod screening;
pub mod statistics;
pub mod undated;

pub use pipeline::{reduce, reduce_for_event};
pub use result::{
    Chord, ConvergencePoint, Headline, Parameter, ReduceOptions, Reduction, StationContribution,
    UsedTiming,
};
