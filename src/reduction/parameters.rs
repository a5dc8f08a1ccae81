//! The parameter set of a campaign: every unknown the condition equations solve for, named,
//! with its unit, its prior knowledge and whether it is held fixed.
//!
//! Parameters are global (the solar parallax, the planet's offsets, the radius corrections:
//! one value for the whole campaign) or belong to one station (for example a correction to a
//! doubtful longitude). Global parameters come first, in the order of [`CLASSIC_NAMES`] for
//! the five classic ones; per-station parameters follow, grouped by station. The normal
//! equations eliminate each station's group on its own (see `normal_equations.rs`), so the
//! cost of a fit grows linearly with the number of stations.
//!
//! References: Bevington and Robinson, *Data Reduction and Error Analysis*, 3rd ed. (2003),
//! chapter 8; priors as pseudo-observations: e.g. W. H. Press et al., *Numerical Recipes*,
//! 3rd ed. (2007), section 15.4 (a measurement of a parameter added as one more equation).

use crate::geometry::contacts::Contact;
use crate::observations::contact_forms::ContactJudged;

/// Number of the classic global parameters (parallax, two offsets, two radius corrections).
pub const N_CLASSIC: usize = 5;

/// Index of the solar parallax among the parameters.
pub const PARALLAX: usize = 0;
/// Index of the planet's eastward offset from its predicted place relative to the Sun.
pub const OFFSET_EAST: usize = 1;
/// Index of the planet's northward offset.
pub const OFFSET_NORTH: usize = 2;
/// Index of the correction to the sum of the radii (contacts I and IV).
pub const RADIUS_SUM: usize = 3;
/// Index of the correction to the difference of the radii (contacts II and III).
pub const RADIUS_DIFFERENCE: usize = 4;

/// Names of the classic global parameters, in order.
pub const CLASSIC_NAMES: [&str; N_CLASSIC] = [
    "solar_parallax",
    "planet_offset_east",
    "planet_offset_north",
    "radius_sum_correction",
    "radius_difference_correction",
];

/// Whom a parameter belongs to.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Scope {
    /// One value for the whole campaign.
    Global,
    /// One value for the station of this index (in the campaign's station order).
    Station(usize),
}

/// What a parameter is, so that the condition equations know its partial derivative.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum ParameterKind {
    /// One of the five classic global parameters (its index in [`CLASSIC_NAMES`]).
    Classic(usize),
    /// A station clock's constant error, seconds (observed = true + offset): the partial of
    /// every timing of that station is 1 s per s.
    ClockOffset,
    /// A correction to the station's longitude, degrees east: it moves the station, and for
    /// timings read in local solar time the conversion to UT1 (-240 s per degree east).
    LongitudeCorrection,
    /// The lag (seconds, positive: seen later) of an interior contact judged in this way
    /// behind the geometric contact: the partial of a timing of that contact and judgement
    /// is 1 s per s (see `black_drop.rs`).
    BlackDrop(ContactJudged, Contact),
}

/// Prior knowledge of a parameter: a value and its standard uncertainty, in the parameter's
/// unit; added to the normal equations as one pseudo-observation.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Prior {
    /// The a-priori value.
    pub value: f64,
    /// Its standard uncertainty (positive).
    pub sigma: f64,
}

/// One unknown of the condition equations.
#[derive(Clone, Debug, PartialEq)]
pub struct ParameterSpec {
    /// Name, as reported (`solar_parallax`, ...).
    pub name: String,
    /// Unit of its value and uncertainty.
    pub unit: &'static str,
    /// What it is.
    pub kind: ParameterKind,
    /// Global or one station's.
    pub scope: Scope,
    /// The value the iteration starts from.
    pub start: f64,
    /// Prior knowledge, if any.
    pub prior: Option<Prior>,
    /// Held at `start` (not fitted).
    pub fixed: bool,
}

/// The parameters of one campaign.
#[derive(Clone, Debug, PartialEq)]
pub struct ParameterSet {
    specs: Vec<ParameterSpec>,
    n_global: usize,
    by_station: Vec<Vec<usize>>,
    /// Whether the planet's offsets and the radius corrections enter as the same shift of each
    /// contact at every station (their partials at the Earth's centre: Delisle's form, see
    /// `classic/delisle.rs`) rather than with each station's own partials.
    nuisance_at_geocentre: bool,
}

impl ParameterSet {
    /// The classic five global parameters, starting from the a-priori parallax (arcsec) and
    /// no corrections; no priors, nothing held fixed.
    pub fn classic(prior_parallax_arcsec: f64) -> Self {
        let specs = CLASSIC_NAMES
            .iter()
            .enumerate()
            .map(|(j, name)| ParameterSpec {
                name: name.to_string(),
                unit: "arcsec",
                kind: ParameterKind::Classic(j),
                scope: Scope::Global,
                start: if j == PARALLAX {
                    prior_parallax_arcsec
                } else {
                    0.0
                },
                prior: None,
                fixed: false,
            })
            .collect();
        ParameterSet {
            specs,
            n_global: N_CLASSIC,
            by_station: Vec::new(),
            nuisance_at_geocentre: false,
        }
    }

    /// A station clock's offset (seconds), free, starting from 0, with an optional prior.
    pub fn clock_offset(station_name: &str, prior: Option<Prior>) -> ParameterSpec {
        ParameterSpec {
            name: format!("clock_offset[{station_name}]"),
            unit: "s",
            kind: ParameterKind::ClockOffset,
            scope: Scope::Global,
            start: 0.0,
            prior,
            fixed: false,
        }
    }

    /// A correction to a station's longitude (degrees east), free, starting from 0, with its
    /// prior (`None`: the longitude is unknown).
    pub fn longitude_correction(station_name: &str, prior: Option<Prior>) -> ParameterSpec {
        ParameterSpec {
            name: format!("longitude_correction[{station_name}]"),
            unit: "deg",
            kind: ParameterKind::LongitudeCorrection,
            scope: Scope::Global,
            start: 0.0,
            prior,
            fixed: false,
        }
    }

    /// Add a global parameter after the classic five; returns its index. Global parameters
    /// must all be added before the first station parameter (a programming error otherwise:
    /// the parameter is then not added and `None` returned).
    pub fn add_global_parameter(&mut self, spec: ParameterSpec) -> Option<usize> {
        if self.has_station_parameters() || self.specs.len() != self.n_global {
            return None;
        }
        self.specs.push(ParameterSpec {
            scope: Scope::Global,
            ..spec
        });
        self.n_global += 1;
        Some(self.n_global - 1)
    }

    /// Add a parameter of one station; returns its index. Stations' parameters must be added
    /// after every global one.
    pub fn add_station_parameter(&mut self, station: usize, spec: ParameterSpec) -> usize {
        let index = self.specs.len();
        if self.by_station.len() <= station {
            self.by_station.resize(station + 1, Vec::new());
        }
        self.by_station[station].push(index);
        self.specs.push(ParameterSpec {
            scope: Scope::Station(station),
            ..spec
        });
        index
    }

    /// Make the planet's offsets and the radius corrections enter through their partials at
    /// the Earth's centre, the same shift of a contact at every station (Delisle's form).
    pub fn set_nuisance_at_geocentre(&mut self) {
        self.nuisance_at_geocentre = true;
    }

    /// Whether the nuisance parameters enter at the Earth's centre (Delisle's form).
    pub fn nuisance_at_geocentre(&self) -> bool {
        self.nuisance_at_geocentre
    }

    /// Every parameter, globals first.
    pub fn specs(&self) -> &[ParameterSpec] {
        &self.specs
    }

    /// Mutable access to one parameter's specification (to hold it fixed or give it a prior).
    pub fn spec_mut(&mut self, index: usize) -> Option<&mut ParameterSpec> {
        self.specs.get_mut(index)
    }

    /// Number of parameters in all.
    pub fn len(&self) -> usize {
        self.specs.len()
    }

    /// Whether there are no parameters (never, for a set made by [`ParameterSet::classic`]).
    pub fn is_empty(&self) -> bool {
        self.specs.is_empty()
    }

    /// Number of global parameters (they are the first ones).
    pub fn n_global(&self) -> usize {
        self.n_global
    }

    /// Indices of the parameters of station `station` (empty if it has none).
    pub fn station_parameters(&self, station: usize) -> &[usize] {
        self.by_station.get(station).map_or(&[], |v| v.as_slice())
    }

    /// Number of stations that may carry parameters (one past the highest index used).
    pub fn n_stations(&self) -> usize {
        self.by_station.len()
    }

    /// Whether any station carries parameters of its own.
    pub fn has_station_parameters(&self) -> bool {
        self.by_station.iter().any(|v| !v.is_empty())
    }

    /// Whether any station carries a longitude correction (the one nonlinear kind of station
    /// parameter, which the fit treats with care).
    pub fn has_longitude_corrections(&self) -> bool {
        self.specs
            .iter()
            .any(|s| s.kind == ParameterKind::LongitudeCorrection)
    }

    /// The chi-square of the priors of the parameters flagged in `which`, at `theta`, and how
    /// many there are: each prior is one pseudo-observation.
    pub fn prior_chi2(&self, theta: &[f64], which: &[bool]) -> (f64, usize) {
        self.specs
            .iter()
            .enumerate()
            .filter(|(j, _)| which.get(*j).copied().unwrap_or(false))
            .filter_map(|(j, spec)| spec.prior.map(|p| ((theta[j] - p.value) / p.sigma).powi(2)))
            .fold((0.0, 0), |(sum, n), x| (sum + x, n + 1))
    }

    /// The starting values of every parameter.
    pub fn start_values(&self) -> Vec<f64> {
        self.specs.iter().map(|s| s.start).collect()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn classic_set_has_the_five_global_parameters() {
        let set = ParameterSet::classic(8.8);
        assert_eq!(set.len(), N_CLASSIC);
        assert_eq!(set.n_global(), N_CLASSIC);
        assert_eq!(set.start_values(), vec![8.8, 0.0, 0.0, 0.0, 0.0]);
        assert!(!set.has_station_parameters());
        assert_eq!(
            set.specs()[RADIUS_DIFFERENCE].name,
            "radius_difference_correction"
        );
    }

    #[test]
    fn station_parameters_are_grouped_by_station() {
        let mut set = ParameterSet::classic(8.8);
        let a = set.add_station_parameter(2, ParameterSet::clock_offset("a", None));
        let b = set.add_station_parameter(0, ParameterSet::clock_offset("b", None));
        assert_eq!((a, b), (5, 6));
        assert_eq!(set.station_parameters(2), &[5]);
        assert_eq!(set.station_parameters(0), &[6]);
        assert!(set.station_parameters(1).is_empty());
        assert!(set.station_parameters(9).is_empty());
        assert_eq!(set.specs()[5].scope, Scope::Station(2));
        assert!(set.has_station_parameters());
        assert_eq!(set.specs()[6].name, "clock_offset[b]");
    }
}
