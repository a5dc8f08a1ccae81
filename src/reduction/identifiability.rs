//! What the timings can determine: the rank test on the reduced normal matrix, the choice of
//! parameters to hold fixed when some combination is not determined, and the sentence that
//! says why.
//!
//! The test works on the normal matrix of the global parameters (each station's own
//! parameters eliminated) in correlation form: its eigenvalues are the squared singular
//! values of the weighted, column-normalised design matrix, so the ratio of the smallest to
//! the largest singular value is sqrt(lambda_min / lambda_max).
//!
//! References: W. H. Press et al., *Numerical Recipes*, 3rd ed. (2007), section 15.4 (singular
//! values and the null space of a least-squares design); Bevington and Robinson (2003),
//! chapter 7.

use super::equations::Timing;
use super::parameters::{ParameterSet, OFFSET_EAST, OFFSET_NORTH, PARALLAX};
use crate::geometry::contacts::Contact;
use crate::geometry::station::GeocentricStation;
use crate::sky::constants::EARTH_EQUATORIAL_RADIUS_M;
use nalgebra::DMatrix;

/// The smallest ratio of singular values (of the column-normalised, weighted design matrix)
/// treated as independent information; below it the parameters are practically confounded
/// (their variances inflated some 10^7 times over an orthogonal design). Calibrated on
/// campaigns: world-wide networks of 30-45 stations give 2.6e-3 to 8e-3; six stations within
/// 70 km of each other, or one kind of contact only, give 2e-5 to 4e-5.
pub const RANK_TOLERANCE: f64 = 2e-4;

/// A free-parameter submatrix in correlation form (zero rows and columns where the diagonal
/// is zero).
pub fn correlation_form(normal: &DMatrix<f64>, idx: &[usize]) -> DMatrix<f64> {
    let d: Vec<f64> = idx
        .iter()
        .map(|&j| normal[(j, j)].max(0.0).sqrt())
        .collect();
    DMatrix::from_fn(idx.len(), idx.len(), |a, b| {
        if d[a] > 0.0 && d[b] > 0.0 {
            normal[(idx[a], idx[b])] / (d[a] * d[b])
        } else {
            0.0
        }
    })
}

/// If the free global parameters are confounded, the direction in parameter space that the
/// timings cannot see (the eigenvector of the smallest eigenvalue of the normal matrix in
/// correlation form, over all global parameters, zero for fixed ones); `None` when they are
/// all determined.
///
/// Arguments: `normal`, the reduced normal matrix over every global parameter; `free`, a flag
/// per global parameter.
pub fn confounded(normal: &DMatrix<f64>, free: &[bool]) -> Option<Vec<f64>> {
    let idx: Vec<usize> = (0..normal.nrows()).filter(|&j| free[j]).collect();
    if idx.is_empty() {
        return None;
    }
    let eigen = correlation_form(normal, &idx).symmetric_eigen();
    let (imin, lmin) =
        eigen
            .eigenvalues
            .iter()
            .enumerate()
            .fold(
                (0, f64::INFINITY),
                |acc, (i, &l)| if l < acc.1 { (i, l) } else { acc },
            );
    let lmax = eigen.eigenvalues.max();
    if lmax > 0.0 && (lmin.max(0.0) / lmax).sqrt() >= RANK_TOLERANCE {
        return None;
    }
    let mut out = vec![0.0; normal.nrows()];
    for (k, &j) in idx.iter().enumerate() {
        out[j] = eigen.eigenvectors[(k, imin)];
    }
    Some(out)
}

/// The variance inflation of one free parameter: the diagonal element of the inverse of the
/// normal matrix in correlation form, 1 / (1 - R^2) with R the multiple correlation of the
/// parameter with all the other free ones (1 when it is independent of them, infinite when
/// the others reproduce it). `None` when the matrix cannot be inverted.
///
/// Reference: D. A. Belsley, E. Kuh and R. E. Welsch, *Regression Diagnostics* (1980),
/// chapter 3 (variance inflation factors).
pub fn variance_inflation(normal: &DMatrix<f64>, free: &[bool], index: usize) -> Option<f64> {
    let idx: Vec<usize> = (0..normal.nrows()).filter(|&j| free[j]).collect();
    let k = idx.iter().position(|&j| j == index)?;
    let inv = correlation_form(normal, &idx).try_inverse()?;
    let v = inv[(k, k)];
    (v.is_finite() && v > 0.0).then_some(v)
}

/// The variance inflation of the parallax above which the timings are taken not to separate
/// it from the other parameters: 1000, a multiple correlation of 0.9995 (printed as 1.000).
/// Calibrated on campaigns: world-wide networks give 1.1 to 2.4, a two-station Mercury
/// campaign 22, one station's four contacts 6,800.
pub const MAX_PARALLAX_INFLATION: f64 = 1000.0;

/// What the rank test found.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct Separation<'a> {
    /// Names of the parameters in an undetermined direction.
    pub confused: Vec<&'a str>,
    /// Whether the parallax took part in an undetermined direction (|component| > 0.05).
    pub parallax_entangled: bool,
    /// The other parameters of those directions.
    pub entangled_with: Vec<&'a str>,
}

/// Hold fixed, one at a time, the nuisance parameter that dominates each undetermined
/// direction (or the parallax itself when it does), until the rest are determined.
///
/// Arguments: `normal`, the reduced normal matrix over every global parameter; `free`, flags
/// per global parameter, updated; `names`, their names; `parallax`, the parallax's index.
/// Returns: the parameters found confounded (empty when all were determined), and whether
/// the parallax was one of them: then what was held fixed is what the parallax needs, and the
/// parallax is not determined by the timings alone.
pub fn hold_fixed_what_cannot_be_separated<'a>(
    normal: &DMatrix<f64>,
    free: &mut [bool],
    names: &[&'a str],
    parallax: usize,
) -> Separation<'a> {
    let mut out = Separation::default();
    while let Some(v) = confounded(normal, free) {
        let involved: Vec<usize> = (0..v.len())
            .filter(|&j| free[j] && v[j].abs() > 0.05)
            .collect();
        for &j in &involved {
            if !out.confused.contains(&names[j]) {
                out.confused.push(names[j]);
            }
        }
        if involved.contains(&parallax) {
            out.parallax_entangled = true;
            for &j in involved.iter().filter(|&&j| j != parallax) {
                if !out.entangled_with.contains(&names[j]) {
                    out.entangled_with.push(names[j]);
                }
            }
        }
        let nuisance = (0..v.len())
            .filter(|&j| j != parallax && free[j])
            .max_by(|&a, &b| v[a].abs().total_cmp(&v[b].abs()));
        match nuisance {
            Some(j) if v[j].abs() > 1e-3 => free[j] = false,
            _ => {
                free[parallax] = false;
                break;
            }
        }
    }
    out
}

/// If the free parameters determine the parallax only in a combination with others (its
/// variance inflation at least [`MAX_PARALLAX_INFLATION`]), the sentence that says so, naming
/// the parameters most correlated with it.
pub fn parallax_inseparable(
    normal: &DMatrix<f64>,
    free: &[bool],
    names: &[&str],
    parallax: usize,
) -> Option<String> {
    let inflation = variance_inflation(normal, free, parallax).unwrap_or(f64::INFINITY);
    if inflation < MAX_PARALLAX_INFLATION {
        return None;
    }
    let idx: Vec<usize> = (0..normal.nrows()).filter(|&j| free[j]).collect();
    let corr = correlation_form(normal, &idx);
    let k = idx.iter().position(|&j| j == parallax)?;
    let mut partners: Vec<(f64, &str)> = (0..idx.len())
        .filter(|&a| a != k)
        .map(|a| (corr[(k, a)].abs(), names[idx[a]]))
        .collect();
    partners.sort_by(|a, b| b.0.total_cmp(&a.0));
    let list: Vec<&str> = partners.iter().take(2).map(|p| p.1).collect();
    Some(format!(
        "the timings determine the solar parallax only in combination with {} (its variance is inflated {inflation:.0} times by them, against 1 to 3 for a well-spread network)",
        list.join(" and ")
    ))
}

/// How many times the parallax's uncertainty may grow when the parameters held for want of
/// data are freed within loose priors before the parallax counts as resting on them (our
/// own round figure; calibrated on campaigns: world-wide networks give 1.0 to 1.01, one
/// station's four contacts hundreds).
pub const MAX_GROWTH_WHEN_FREED: f64 = 3.0;

/// Whether the parallax rests on parameters that were held because the timings cannot
/// determine them: the growth factor of its uncertainty when those parameters are freed
/// within loose priors (`loose_sigma[j]` in each one's unit), against its uncertainty with
/// them held. `None` when nothing was held (or the systems cannot be solved).
///
/// Arguments: `normal`, the reduced normal matrix over every global parameter (priors
/// included); `free_before`, the flags before the rank test held anything; `free_after`,
/// after; `parallax`, its index; `loose_sigma`, per global parameter.
/// References: estimability of a linear function in a rank-deficient model (it must lie in
/// the row space of the design): e.g. K.-R. Koch, *Parameter Estimation and Hypothesis Testing
/// in Linear Models*, 2nd ed. (1999), section 3.3 (cited from memory); the loose priors make
/// the test numerical, as in any regularised least squares.
pub fn growth_when_freed(
    normal: &DMatrix<f64>,
    (free_before, free_after): (&[bool], &[bool]),
    parallax: usize,
    loose_sigma: &[f64],
) -> Option<f64> {
    let held: Vec<usize> = (0..normal.nrows())
        .filter(|&j| free_before[j] && !free_after[j] && j != parallax)
        .collect();
    if held.is_empty() || !free_after[parallax] {
        return None;
    }
    let variance = |free: &[bool], add_priors: bool| -> Option<f64> {
        let idx: Vec<usize> = (0..normal.nrows()).filter(|&j| free[j]).collect();
        let k = idx.iter().position(|&j| j == parallax)?;
        let mut m = DMatrix::from_fn(idx.len(), idx.len(), |a, b| normal[(idx[a], idx[b])]);
        if add_priors {
            for (a, &j) in idx.iter().enumerate() {
                if held.contains(&j) {
                    m[(a, a)] += 1.0 / (loose_sigma[j] * loose_sigma[j]);
                }
            }
        }
        let v = m.cholesky()?.inverse()[(k, k)];
        (v.is_finite() && v > 0.0).then_some(v)
    };
    let held_variance = variance(free_after, false)?;
    let freed_variance = variance(free_before, true)?;
    Some((freed_variance / held_variance).sqrt())
}

/// Which global parameters were free before the rank test held any, which are free after,
/// and their names.
pub struct Holding<'a> {
    /// Free before the rank test.
    pub before: &'a [bool],
    /// Free after it.
    pub after: &'a [bool],
    /// Names of the global parameters.
    pub names: &'a [&'a str],
}

impl Holding<'_> {
    /// The names of the parameters the rank test held.
    pub fn held(&self) -> Vec<&str> {
        (0..self.after.len())
            .filter(|&j| self.before[j] && !self.after[j])
            .map(|j| self.names[j])
            .collect()
    }
}

/// A loose prior for a parameter held by the rank test, in its unit, for testing whether the
/// parallax rests on it: 10" for the offsets and radius corrections (far beyond any
/// ephemeris's error since the 18th century), 60 s for a black-drop lag (beyond the largest
/// reported), 1 degree otherwise. Our own round figures.
fn loose_sigma(unit: &str) -> f64 {
    match unit {
        "arcsec" => 10.0,
        "s" => 60.0,
        _ => 1.0,
    }
}

/// Why the timings do not determine the solar parallax, if they do not: it rests on a
/// parameter held for want of data ([`growth_when_freed`]); it is entangled with parameters
/// nothing determines; its variance is inflated beyond [`MAX_PARALLAX_INFLATION`]; or, with
/// the planet's place fitted freely, every timing comes from one station
/// (`one_station_only`). `None` when the parallax is determined.
pub fn why_parallax_not_determined(
    normal: &DMatrix<f64>,
    params: &ParameterSet,
    holding: &Holding,
    separation: &Separation,
    timings: &[&Timing],
) -> Option<String> {
    let g = params.n_global();
    let loose: Vec<f64> = params.specs()[..g]
        .iter()
        .map(|s| loose_sigma(s.unit))
        .collect();
    let growth = growth_when_freed(normal, (holding.before, holding.after), PARALLAX, &loose)
        .filter(|&x| x > MAX_GROWTH_WHEN_FREED);
    if let Some(growth) = growth {
        let held = holding.held();
        return Some(format!(
            "the solar parallax rests on holding {} at the a-priori value{}, which these timings cannot determine: freed within a loose prior ({}), its uncertainty grows {growth:.0}-fold, so the parallax is not determined by the timings",
            held.join(", "),
            if held.len() == 1 { "" } else { "s" },
            "10\" for the offsets and radii, 60 s for a black-drop lag"
        ));
    }
    if separation.parallax_entangled {
        return Some(format!(
            "the solar parallax is entangled with {}, which the timings cannot determine; holding those at their a-priori values would make the parallax rest on that assumption",
            separation.entangled_with.join(", ")
        ));
    }
    parallax_inseparable(normal, holding.after, holding.names, PARALLAX)
        .or_else(|| one_station_only(params, timings))
}

/// With the planet's offsets fitted freely (no prior), one station's timings bear on the
/// parallax only through the turning of its parallactic shift between the contacts as the
/// Earth rotates; the ephemeris's motion of the planet across the Sun, which the reduction
/// takes as exact and does not fit, changes the contacts the same way, so the parallax would
/// rest on that assumption. The classic methods all compare stations for this reason
/// (Halley 1716; Delisle 1753). The sentence, when every timing comes from one station.
fn one_station_only(params: &ParameterSet, timings: &[&Timing]) -> Option<String> {
    let place_free = [OFFSET_EAST, OFFSET_NORTH]
        .iter()
        .all(|&j| !params.specs()[j].fixed && params.specs()[j].prior.is_none());
    let first = timings.first()?.obs.station.name.as_str();
    let one = timings.iter().all(|t| t.obs.station.name == first);
    (place_free && one).then(|| format!(
        "every timing comes from one station ({first}): with the planet's place fitted, one station measures the parallax only through the turning of its parallactic shift between the contacts as the Earth rotates, which an error in the ephemeris's motion of the planet across the Sun (taken as exact, not fitted) would mimic; timings from a second station far away would determine it, or --planet-place fixed (or prior=ARCSEC) measures it against the ephemeris's place of the planet"
    ))
}

/// Stations closer together than this, km, are "a tight cluster" in the sentence that says
/// why parameters cannot be told apart.
const CLUSTER_KM: f64 = 1000.0;

/// Largest distance between two stations, km, exact below `CLUSTER_KM`; above it, some
/// distance of at least `CLUSTER_KM` (the search stops there: the sentence needs no more).
/// Each station's geocentric position is converted to Cartesian once, so the pairwise search
/// costs only arithmetic.
fn spread_km(stations: &[&GeocentricStation]) -> f64 {
    let km_per_radius = EARTH_EQUATORIAL_RADIUS_M / 1000.0;
    let xyz: Vec<[f64; 3]> = stations
        .iter()
        .map(|s| {
            let (sin_l, cos_l) = s.longitude_rad.sin_cos();
            [
                s.rho_cos_phi * cos_l * km_per_radius,
                s.rho_cos_phi * sin_l * km_per_radius,
                s.rho_sin_phi * km_per_radius,
            ]
        })
        .collect();
    let mut spread_km: f64 = 0.0;
    for (i, a) in xyz.iter().enumerate() {
        for b in &xyz[i + 1..] {
            let d = ((a[0] - b[0]).powi(2) + (a[1] - b[1]).powi(2) + (a[2] - b[2]).powi(2)).sqrt();
            spread_km = spread_km.max(d);
            if spread_km >= CLUSTER_KM {
                return spread_km;
            }
        }
    }
    spread_km
}

/// The sentence that says which parameters the timings cannot tell apart, why, which of them
/// were held at their a-priori values (`held`; the rest are fitted in combination), and what
/// timings would separate them.
pub fn describe_confusion(timings: &[&Timing], names: &[&str], held: &[&str]) -> String {
    let mut stations: Vec<&GeocentricStation> = Vec::new();
    let mut names_seen: std::collections::HashSet<&str> = Default::default();
    for t in timings {
        if names_seen.insert(t.obs.station.name.as_str()) {
            stations.push(&t.geo);
        }
    }
    let mut kinds: Vec<Contact> = timings.iter().map(|t| t.obs.contact).collect();
    kinds.sort();
    kinds.dedup();
    let spread = spread_km(&stations);
    let why = if stations.len() == 1 {
        "all the timings come from one station".to_string()
    } else if spread < CLUSTER_KM {
        format!("all the stations lie within {spread:.0} km of each other")
    } else if kinds.len() == 1 {
        format!("only contact {} was timed", kinds[0].roman())
    } else {
        "the stations' geometry does not separate them".to_string()
    };
    let fitted: Vec<&str> = names
        .iter()
        .copied()
        .filter(|n| !held.contains(n))
        .collect();
    let what = match (held.is_empty(), fitted.is_empty()) {
        (true, _) => "all of them are fitted, in combination".to_string(),
        (false, true) => format!(
            "{} held at the a-priori value{}",
            held.join(", "),
            if held.len() == 1 { " is" } else { "s are" }
        ),
        (false, false) => format!(
            "{} {} held at the a-priori value{}, and {} fitted with what is left",
            held.join(", "),
            if held.len() == 1 { "is" } else { "are" },
            if held.len() == 1 { "" } else { "s" },
            fitted.join(", ")
        ),
    };
    format!(
        "the timings cannot tell apart {}: {why}. Of these, {what}. Stations far apart in latitude that time both ingress and egress (durations, Halley's method), or far apart in longitude that time the same contact (Delisle's method), would separate them",
        names.join(", ")
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn normal_of(j: &DMatrix<f64>) -> DMatrix<f64> {
        j.transpose() * j
    }

    #[test]
    fn detects_confounded_columns_and_names_them() {
        let j = DMatrix::from_fn(4, 3, |i, k| match k {
            0 => 1.0,
            1 => 2.0,
            _ => i as f64,
        });
        let n = normal_of(&j);
        let v = confounded(&n, &[true, true, true]).unwrap();
        assert!(v[0].abs() > 0.5 && v[1].abs() > 0.5 && v[2].abs() < 1e-6);
        assert!(confounded(&n, &[true, false, true]).is_none());
    }

    #[test]
    fn holds_the_nuisance_parameter_not_the_parallax() {
        // Columns 0 (parallax) and 1 identical up to scale; column 2 independent.
        let j = DMatrix::from_fn(5, 3, |i, k| match k {
            0 => 1.0 + i as f64,
            1 => 3.0 * (1.0 + i as f64),
            _ => (i as f64).powi(2),
        });
        let mut free = [true, true, true];
        let names = ["p", "a", "b"];
        let c = hold_fixed_what_cannot_be_separated(&normal_of(&j), &mut free, &names, 0);
        assert_eq!(c.confused, vec!["p", "a"]);
        assert!(c.parallax_entangled);
        assert_eq!(c.entangled_with, vec!["a"]);
        assert_eq!(free, [true, false, true]);
    }

    #[test]
    fn variance_inflation_is_one_for_independent_columns() {
        let j = DMatrix::from_fn(4, 2, |i, k| match (i, k) {
            (0, 0) | (1, 0) => 1.0,
            (2, 1) | (3, 1) => 1.0,
            _ => 0.0,
        });
        let n = normal_of(&j);
        let v = variance_inflation(&n, &[true, true], 0).unwrap();
        assert!((v - 1.0).abs() < 1e-12);
        assert!(parallax_inseparable(&n, &[true, true], &["p", "a"], 0).is_none());
        // Nearly collinear columns (correlation 0.99999) inflate it beyond the limit.
        let j = DMatrix::from_fn(3, 2, |i, k| {
            1.0 + i as f64 + if k == 1 && i == 2 { 0.01 } else { 0.0 }
        });
        let n = normal_of(&j);
        assert!(variance_inflation(&n, &[true, true], 0).unwrap() > MAX_PARALLAX_INFLATION);
        let why = parallax_inseparable(&n, &[true, true], &["p", "a"], 0).unwrap();
        assert!(why.contains("only in combination with a"), "{why}");
    }

    #[test]
    fn a_parallax_resting_on_a_held_parameter_is_found() {
        // Column 1 is nearly column 0 (the parallax): holding it makes the parallax look
        // determined; freeing it within a loose prior shows it is not. Column 2 is
        // independent: holding it changes nothing.
        let j = DMatrix::from_fn(6, 3, |i, k| match k {
            0 => 1.0 + i as f64,
            1 => 1.0 + i as f64 + 1e-6 * (i as f64).powi(2),
            _ => (i as f64 - 2.5).powi(3),
        });
        let n = normal_of(&j);
        let growth = growth_when_freed(
            &n,
            (&[true, true, true], &[true, false, true]),
            0,
            &[1.0; 3],
        )
        .unwrap();
        assert!(growth > MAX_GROWTH_WHEN_FREED, "{growth}");
        // Three orthogonal columns over six rows: a constant, a centred square, a line.
        let j = DMatrix::from_fn(6, 3, |i, k| match k {
            0 => 1.0,
            1 => (i as f64 - 2.5).powi(2) - 17.5 / 6.0,
            _ => i as f64 - 2.5,
        });
        let n = normal_of(&j);
        let growth = growth_when_freed(
            &n,
            (&[true, true, true], &[true, true, false]),
            0,
            &[1e3; 3],
        )
        .unwrap();
        assert!(growth < 1.01, "{growth}");
        assert!(growth_when_freed(&n, (&[true; 3], &[true; 3]), 0, &[1.0; 3]).is_none());
    }

    #[test]
    fn a_zero_column_is_undetermined() {
        let j = DMatrix::from_fn(4, 2, |i, k| if k == 0 { i as f64 + 1.0 } else { 0.0 });
        let v = confounded(&normal_of(&j), &[true, true]).unwrap();
        assert!(v[1].abs() > 0.99);
    }
}
