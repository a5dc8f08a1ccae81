//! Delisle's method: the parallax from the absolute times of one contact at stations far apart
//! in longitude, whose clocks and longitudes are good.
//!
//! Only instants at stations whose longitude is taken as exact are used, with no clock
//! unknowns. The tables' error in the planet's place and in the radii shifts each contact's
//! geocentric time, the same at every station: the planet's offsets and the radius
//! corrections enter through their partials at the Earth's centre (so at most one unknown
//! shift per contact), the offsets as `--planet-place` says; the parallax enters with each
//! station's own partial, and comes from the differences of the same contact between stations.
//! Black-drop lags are fitted as in the full solution.
//!
//! References: J.-N. Delisle, the method of the absolute times of one contact at stations of
//! known longitude, first proposed for the transit of Mercury of 1753 with a world map of
//! the contact's times, then set out for the transit of Venus of 1761 in his memoir and
//! world map of 1760 (both cited from memory); in condition equations: W. Chauvenet,
//! *A Manual of Spherical and Practical Astronomy* (1863), vol. I (cited from memory of its
//! treatment).

use super::classic_methods::{count_stations, gains, parallax_of, Method, MethodSolution};
use super::equations::Timing;
use super::fit::fit;
use super::halley::held_by_fit;
use super::parameters::{ParameterKind, ParameterSet, Scope};
use crate::geometry::transit::TransitEvent;
use crate::observations::longitude::LongitudeKnowledge;

/// The assumption Delisle's method makes beyond the full solution.
pub const DELISLE_ASSUMPTION: &str = "that the tables' error shifts each contact by the same time at every station (one unknown geocentric time per contact), where the full solution lets it vary with each station's place on the limb";

/// Delisle's method on the timings `used` by the full solution.
///
/// Arguments: `event`; the timings and those used; `params`, the full solution's parameter set
/// (its planet place and lags are kept; station parameters are not).
/// Returns: the solution, with every parameter it held and why.
pub fn delisle(
    event: &TransitEvent,
    (timings, used): (&[Timing], &[usize]),
    params: &ParameterSet,
) -> MethodSolution {
    let rows: Vec<usize> = used
        .iter()
        .copied()
        .filter(|&i| {
            let t = &timings[i];
            !t.is_interval() && t.obs.longitude == LongitudeKnowledge::Exact
        })
        .collect();
    let stations = count_stations(timings, &rows);
    if stations < 2 {
        let why = if rows.is_empty() {
            "Delisle's method needs absolute times at stations whose longitude is taken as exact; here there are none"
        } else {
            "Delisle's method compares one contact between stations, and only one station of exactly known longitude timed absolute times"
        };
        return MethodSolution::not_determined(Method::Delisle, (rows.len(), stations), why.into());
    }
    let mut p = ParameterSet::classic(params.specs()[0].start);
    for j in 1..p.n_global() {
        if let (Some(spec), Some(full)) = (p.spec_mut(j), params.specs().get(j)) {
            spec.fixed = full.fixed;
            spec.prior = full.prior;
        }
    }
    for spec in params
        .specs()
        .iter()
        .filter(|s| matches!(s.kind, ParameterKind::BlackDrop(..)))
    {
        p.add_global_parameter(spec.clone());
    }
    debug_assert!(p.specs().iter().all(|s| s.scope == Scope::Global));
    p.set_nuisance_at_geocentre();
    let start = p.start_values();
    let outcome = fit(event, timings, &rows, &p, &start);
    let held = held_by_fit(params, &p, (timings, &rows), &outcome.free);
    let mut m = match parallax_of(timings, &rows, &p, &outcome) {
        Ok((pi, sigma, stats)) => MethodSolution {
            gains: gains(timings, &rows, &outcome),
            sigma_scale: stats.sigma_scale,
            ..MethodSolution::from_parallax(
                Method::Delisle,
                (pi, sigma),
                (rows.len(), stations),
                None,
            )
        },
        Err(why) => MethodSolution::not_determined(Method::Delisle, (rows.len(), stations), why),
    };
    m.held = held;
    m
}
