//! The normal equations of the condition equations, with each station's own parameters
//! eliminated block by block.
//!
//! Each timing's condition equation has partial derivatives with respect to the global
//! parameters and to its own station's parameters only, so the normal matrix is an arrowhead:
//! a dense global block, one small block per station, and the couplings between each station
//! block and the globals; station blocks never touch one another. Eliminating each station
//! block (its Schur complement) leaves the reduced global system
//!
//! ```text
//! N_red = N_gg - sum_s N_gs N_ss^-1 N_sg,    b_red = b_g - sum_s N_gs N_ss^-1 b_s
//! ```
//!
//! whose solution gives the global corrections; each station's corrections follow by back
//! substitution, d_s = N_ss^-1 (b_s - N_sg d_g), and its covariance is
//! N_ss^-1 + N_ss^-1 N_sg C_gg N_gs N_ss^-1. The cost is linear in the number of stations.
//! A prior (value v, sigma s) on a free parameter is one pseudo-observation: 1/s^2 on its
//! diagonal and (v - current value)/s^2 on its right-hand side.
//!
//! References: the elimination of parameters from partitioned normal equations ("Helmert
//! blocking", after F. R. Helmert, *Die mathematischen und physikalischen Theorieen der
//! hoeheren Geodaesie*, 1880; cited from memory), as in any treatment of partitioned least
//! squares, e.g. K.-R. Koch, *Parameter Estimation and Hypothesis Testing in Linear Models*,
//! 2nd ed. (1999); Bevington and Robinson (2003), chapter 8.

use super::parameters::ParameterSet;
use nalgebra::{Cholesky, DMatrix, DVector, Dyn};

/// The partials of one timing with respect to its station's own parameters.
#[derive(Clone, Debug, PartialEq)]
pub struct LocalPartials {
    /// The station the timing belongs to.
    pub station: usize,
    /// Partials with respect to that station's parameters, in the order of
    /// [`ParameterSet::station_parameters`] (empty when it has none).
    pub partials: Vec<f64>,
}

/// One linearised system: the design, residuals and weights of the timings in the fit.
pub struct LinearSystem<'a> {
    /// n x G partials with respect to the global parameters.
    pub global: &'a DMatrix<f64>,
    /// Per timing, its station and the partials with respect to that station's parameters.
    pub local: &'a [LocalPartials],
    /// O - C of each timing.
    pub residuals: &'a DVector<f64>,
    /// Weights 1/sigma^2.
    pub weights: &'a DVector<f64>,
}

/// The solution of one linearised step.
#[derive(Clone, Debug)]
pub struct BlockSolution {
    /// Corrections to every parameter (zero for fixed ones).
    pub correction: DVector<f64>,
    /// Unscaled covariance of the global parameters (zero rows and columns for fixed ones).
    pub covariance_global: DMatrix<f64>,
    /// Unscaled standard uncertainty of every parameter (`None` for fixed ones).
    pub sigma: Vec<Option<f64>>,
    /// The global design with each station's own free parameters projected out (the same as
    /// the input where no station has any): the rows whose normal matrix is the reduced one.
    pub projected_global: DMatrix<f64>,
}

struct StationBlock {
    rows: Vec<usize>,
    params: Vec<usize>,
    local_cols: Vec<usize>,
    chol: Cholesky<f64, Dyn>,
    n_sg: DMatrix<f64>,
    b_s: DVector<f64>,
}

/// Free global indices and the free global normal matrix and right-hand side, formed as the
/// dense product of the selected columns, with the globals' priors added.
fn global_normal(
    sys: &LinearSystem,
    params: &ParameterSet,
    free: &[bool],
    theta: &[f64],
) -> (Vec<usize>, DMatrix<f64>, DVector<f64>) {
    let idx: Vec<usize> = (0..params.n_global()).filter(|&j| free[j]).collect();
    let jf = sys.global.select_columns(&idx);
    let wj = DMatrix::from_fn(jf.nrows(), jf.ncols(), |i, j| jf[(i, j)] * sys.weights[i]);
    let mut normal = jf.transpose() * &wj;
    let mut rhs = wj.transpose() * sys.residuals;
    for (a, &j) in idx.iter().enumerate() {
        if let Some(p) = params.specs()[j].prior {
            normal[(a, a)] += 1.0 / (p.sigma * p.sigma);
            rhs[a] += (p.value - theta[j]) / (p.sigma * p.sigma);
        }
    }
    (idx, normal, rhs)
}

/// Assemble one station's block and its coupling to the free globals; `None` when the
/// station's free parameters are not determined by its own timings and priors.
fn station_block(
    sys: &LinearSystem,
    params: &ParameterSet,
    station: usize,
    rows: Vec<usize>,
    (free, theta, idx): (&[bool], &[f64], &[usize]),
) -> Option<StationBlock> {
    let all = params.station_parameters(station);
    let local_cols: Vec<usize> = (0..all.len()).filter(|&k| free[all[k]]).collect();
    let p: Vec<usize> = local_cols.iter().map(|&k| all[k]).collect();
    let (k, g) = (p.len(), idx.len());
    let mut n_ss = DMatrix::zeros(k, k);
    let mut n_sg = DMatrix::zeros(k, g);
    let mut b_s = DVector::zeros(k);
    for &i in &rows {
        let w = sys.weights[i];
        let lp = &sys.local[i].partials;
        for (a, &ca) in local_cols.iter().enumerate() {
            let da = lp.get(ca).copied().unwrap_or(0.0);
            b_s[a] += w * da * sys.residuals[i];
            for (b, &cb) in local_cols.iter().enumerate() {
                n_ss[(a, b)] += w * da * lp.get(cb).copied().unwrap_or(0.0);
            }
            for (b, &jb) in idx.iter().enumerate() {
                n_sg[(a, b)] += w * da * sys.global[(i, jb)];
            }
        }
    }
    for (a, &j) in p.iter().enumerate() {
        if let Some(pr) = params.specs()[j].prior {
            n_ss[(a, a)] += 1.0 / (pr.sigma * pr.sigma);
            b_s[a] += (pr.value - theta[j]) / (pr.sigma * pr.sigma);
        }
    }
    Some(StationBlock {
        rows,
        params: p,
        local_cols,
        chol: n_ss.cholesky()?,
        n_sg,
        b_s,
    })
}

/// The timings of each station that has free parameters of its own.
fn rows_by_station(sys: &LinearSystem, params: &ParameterSet, free: &[bool]) -> Vec<Vec<usize>> {
    let mut rows = vec![Vec::new(); params.n_stations()];
    for (i, l) in sys.local.iter().enumerate() {
        if params
            .station_parameters(l.station)
            .iter()
            .any(|&j| free[j])
        {
            rows[l.station].push(i);
        }
    }
    rows
}

/// Free global indices, the reduced normal matrix and right-hand side over them, and the
/// station blocks for back substitution.
type Eliminated = (Vec<usize>, DMatrix<f64>, DVector<f64>, Vec<StationBlock>);

/// The free-global normal matrix and right-hand side with every station block eliminated,
/// and the blocks for back substitution; `None` when a station's free parameters are not
/// determined by its timings and priors (a station with no timing in the system is left out).
fn eliminate(
    sys: &LinearSystem,
    params: &ParameterSet,
    free: &[bool],
    theta: &[f64],
) -> Option<Eliminated> {
    let (idx, mut normal, mut rhs) = global_normal(sys, params, free, theta);
    let mut blocks = Vec::new();
    for (s, rows) in rows_by_station(sys, params, free).into_iter().enumerate() {
        if rows.is_empty() {
            // A station none of whose timings is in the system has nothing to say about the
            // global parameters: its own stay where they are, not determined (their
            // uncertainty is left empty, never zero).
            continue;
        }
        let b = station_block(sys, params, s, rows, (free, theta, &idx))?;
        let x = b.chol.solve(&b.n_sg);
        normal -= b.n_sg.transpose() * &x;
        rhs -= x.transpose() * &b.b_s;
        blocks.push(b);
    }
    Some((idx, normal, rhs, blocks))
}

/// The reduced normal matrix over every global parameter (the free stations' parameters
/// eliminated), for the rank test; `None` as for [`solve`].
pub fn reduced_normal(
    sys: &LinearSystem,
    params: &ParameterSet,
    free: &[bool],
    theta: &[f64],
) -> Option<DMatrix<f64>> {
    let mut all = free.to_vec();
    all[..params.n_global()].fill(true);
    eliminate(sys, params, &all, theta).map(|(_, normal, _, _)| normal)
}

/// Solve one linearised step over the free parameters.
///
/// Arguments: `sys`, the linearised condition equations; `params`, the campaign's parameter
/// set; `free`, one flag per parameter; `theta`, the current values (for the priors).
/// Returns: `None` when the free parameters are not all determined (a station block or the
/// reduced global matrix is not positive definite).
pub fn solve(
    sys: &LinearSystem,
    params: &ParameterSet,
    free: &[bool],
    theta: &[f64],
) -> Option<BlockSolution> {
    let (idx, normal, rhs, blocks) = eliminate(sys, params, free, theta)?;
    let chol = normal.cholesky()?;
    let d_g = chol.solve(&rhs);
    let c_gg = chol.inverse();
    Some(assemble(sys, params, (&idx, &d_g, &c_gg), &blocks))
}

/// Back substitution: station corrections and uncertainties, the projected design.
fn assemble(
    sys: &LinearSystem,
    params: &ParameterSet,
    (idx, d_g, c_gg): (&[usize], &DVector<f64>, &DMatrix<f64>),
    blocks: &[StationBlock],
) -> BlockSolution {
    let n_params = params.len();
    let g = params.n_global();
    let mut correction = DVector::zeros(n_params);
    let mut covariance_global = DMatrix::zeros(g, g);
    let mut sigma = vec![None; n_params];
    for (a, &ja) in idx.iter().enumerate() {
        correction[ja] = d_g[a];
        sigma[ja] = Some(c_gg[(a, a)].max(0.0).sqrt());
        for (b, &jb) in idx.iter().enumerate() {
            covariance_global[(ja, jb)] = c_gg[(a, b)];
        }
    }
    let mut projected_global = sys.global.clone();
    for b in blocks {
        let d_s = b.chol.solve(&(&b.b_s - &b.n_sg * d_g));
        let x = b.chol.solve(&b.n_sg);
        let cov_s = b.chol.inverse() + &x * c_gg * x.transpose();
        for (a, &j) in b.params.iter().enumerate() {
            correction[j] = d_s[a];
            sigma[j] = Some(cov_s[(a, a)].max(0.0).sqrt());
        }
        for &i in &b.rows {
            let lp = &sys.local[i].partials;
            for (c, &jc) in idx.iter().enumerate() {
                let shift: f64 = (0..b.params.len())
                    .map(|a| lp.get(b.local_cols[a]).copied().unwrap_or(0.0) * x[(a, c)])
                    .sum();
                projected_global[(i, jc)] -= shift;
            }
        }
    }
    BlockSolution {
        correction,
        covariance_global,
        sigma,
        projected_global,
    }
}

/// The same step solved densely over every free parameter at once: the check of [`solve`]
/// (tests) and a reference for small systems. Returns the corrections and the unscaled
/// standard uncertainties of every parameter.
pub fn solve_dense(
    sys: &LinearSystem,
    params: &ParameterSet,
    free: &[bool],
    theta: &[f64],
) -> Option<(DVector<f64>, Vec<Option<f64>>)> {
    let n = sys.residuals.len();
    let idx: Vec<usize> = (0..params.len()).filter(|&j| free[j]).collect();
    let column = |i: usize, j: usize| -> f64 {
        if j < params.n_global() {
            return sys.global[(i, j)];
        }
        let l = &sys.local[i];
        let own = params.station_parameters(l.station);
        own.iter()
            .position(|&k| k == j)
            .and_then(|k| l.partials.get(k).copied())
            .unwrap_or(0.0)
    };
    let a = DMatrix::from_fn(n, idx.len(), |i, c| column(i, idx[c]));
    let wa = DMatrix::from_fn(n, idx.len(), |i, c| a[(i, c)] * sys.weights[i]);
    let mut normal = a.transpose() * &wa;
    let mut rhs = wa.transpose() * sys.residuals;
    for (c, &j) in idx.iter().enumerate() {
        if let Some(p) = params.specs()[j].prior {
            normal[(c, c)] += 1.0 / (p.sigma * p.sigma);
            rhs[c] += (p.value - theta[j]) / (p.sigma * p.sigma);
        }
    }
    let chol = normal.cholesky()?;
    let d = chol.solve(&rhs);
    let cov = chol.inverse();
    let mut correction = DVector::zeros(params.len());
    let mut sigma = vec![None; params.len()];
    for (c, &j) in idx.iter().enumerate() {
        correction[j] = d[c];
        sigma[j] = Some(cov[(c, c)].max(0.0).sqrt());
    }
    Some((correction, sigma))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::reduction::parameters::{ParameterSpec, Prior};
    use proptest::prelude::*;

    fn spec(prior: Option<Prior>) -> ParameterSpec {
        ParameterSet::clock_offset("x", prior)
    }

    /// A random arrowhead system: 2-4 globals, 1-5 stations with 0-2 parameters each.
    fn random_system(
        seed: u64,
    ) -> (
        ParameterSet,
        DMatrix<f64>,
        Vec<LocalPartials>,
        DVector<f64>,
        DVector<f64>,
    ) {
        use rand::{Rng, SeedableRng};
        let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(seed);
        let mut params = ParameterSet::classic(8.8);
        let n_stations = rng.gen_range(1..=5);
        let mut per_station = Vec::new();
        for s in 0..n_stations {
            let k = rng.gen_range(0..=2);
            for _ in 0..k {
                let prior = rng.gen_bool(0.3).then(|| Prior {
                    value: rng.gen_range(-1.0..1.0),
                    sigma: rng.gen_range(0.1..2.0),
                });
                params.add_station_parameter(s, spec(prior));
            }
            per_station.push(k);
        }
        let mut local = Vec::new();
        let mut rows = Vec::new();
        for (s, &k) in per_station.iter().enumerate() {
            // Enough rows that every station and the globals are determined.
            for _ in 0..(k + 6) {
                local.push(LocalPartials {
                    station: s,
                    partials: (0..k).map(|_| rng.gen_range(-2.0..2.0)).collect(),
                });
                rows.push(
                    (0..5)
                        .map(|_| rng.gen_range(-3.0..3.0))
                        .collect::<Vec<f64>>(),
                );
            }
        }
        let n = rows.len();
        let global = DMatrix::from_fn(n, 5, |i, j| rows[i][j]);
        let r = DVector::from_fn(n, |_, _| rng.gen_range(-5.0..5.0));
        let w = DVector::from_fn(n, |_, _| rng.gen_range(0.2..3.0));
        (params, global, local, r, w)
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(200))]
        /// Block elimination gives the dense solution: corrections and uncertainties of every
        /// parameter, with some parameters held fixed and some carrying priors.
        #[test]
        fn block_elimination_matches_the_dense_solve(seed in 0u64..1_000_000, fix in 0usize..6) {
            let (params, global, local, r, w) = random_system(seed);
            let mut free = vec![true; params.len()];
            if fix < 5 && fix != 0 {
                free[fix] = false;
            }
            let theta = params.start_values();
            let sys = LinearSystem { global: &global, local: &local, residuals: &r, weights: &w };
            let block = solve(&sys, &params, &free, &theta);
            let dense = solve_dense(&sys, &params, &free, &theta);
            prop_assert_eq!(block.is_some(), dense.is_some());
            if let (Some(b), Some((d, sd))) = (block, dense) {
                for j in 0..params.len() {
                    prop_assert!((b.correction[j] - d[j]).abs() < 1e-8 * (1.0 + d[j].abs()));
                    match (b.sigma[j], sd[j]) {
                        (Some(x), Some(y)) => prop_assert!((x - y).abs() < 1e-8 * (1.0 + y)),
                        (None, None) => {}
                        _ => prop_assert!(false, "sigma present in one solve only"),
                    }
                }
            }
        }
    }

    #[test]
    fn straight_line_as_a_global_system() {
        // y = 2 + 3 x, exact; two globals (the first two classic slots), the rest fixed.
        let xs = [0.0, 1.0, 2.0, 3.0, 4.0];
        let global = DMatrix::from_fn(5, 5, |i, k| match k {
            0 => 1.0,
            1 => xs[i],
            _ => 0.0,
        });
        let r = DVector::from_iterator(5, xs.iter().map(|x| 2.0 + 3.0 * x));
        let w = DVector::from_element(5, 1.0);
        let local: Vec<LocalPartials> = (0..5)
            .map(|_| LocalPartials {
                station: 0,
                partials: vec![],
            })
            .collect();
        let params = ParameterSet::classic(0.0);
        let free = [true, true, false, false, false];
        let sys = LinearSystem {
            global: &global,
            local: &local,
            residuals: &r,
            weights: &w,
        };
        let s = solve(&sys, &params, &free, &params.start_values()).unwrap();
        assert!((s.correction[0] - 2.0).abs() < 1e-12);
        assert!((s.correction[1] - 3.0).abs() < 1e-12);
        // Source: Bevington and Robinson, eq. 6.21-6.23: var(b) = N / Delta for unit weights.
        let delta = 5.0 * 30.0 - 10.0 * 10.0;
        assert!((s.covariance_global[(1, 1)] - 5.0 / delta).abs() < 1e-12);
        assert_eq!(s.sigma[2], None);
    }

    #[test]
    fn a_station_parameter_without_timings_is_not_determined() {
        let mut params = ParameterSet::classic(0.0);
        params.add_station_parameter(1, spec(None));
        let global = DMatrix::from_fn(3, 5, |i, k| if k == 0 { 1.0 + i as f64 } else { 0.0 });
        let local: Vec<LocalPartials> = (0..3)
            .map(|_| LocalPartials {
                station: 0,
                partials: vec![],
            })
            .collect();
        let r = DVector::from_element(3, 1.0);
        let w = DVector::from_element(3, 1.0);
        let sys = LinearSystem {
            global: &global,
            local: &local,
            residuals: &r,
            weights: &w,
        };
        let free = [true, false, false, false, false, true];
        // The station's parameter is left out of the solve: no correction, no uncertainty
        // (never a zero one); the global parameter is solved all the same.
        let s = solve(&sys, &params, &free, &params.start_values()).unwrap();
        assert_eq!(s.sigma[5], None);
        assert_eq!(s.correction[5], 0.0);
        assert!(s.sigma[0].is_some_and(|x| x > 0.0));
    }
}
