//! What each station contributed, and how the solution firmed up.
//!
//! - The share of the information on the parallax: with the nuisance parameters present it is
//!   the Schur complement of the normal matrix; a timing's part is w (a_i - proj_i)^2, with
//!   a_i its parallax partial and proj_i that partial's projection on the nuisance columns
//!   (each station's own parameters are projected out first, in the fit's design), so the
//!   shares add to one.
//! - Leave-one-station-out influence by a rank-k downdate of the normal matrix,
//!   delta = -(N - N_k)^-1 J_k^T W_k r_k, not by refitting.
//! - The Halley chord of each station that timed a pair of contacts.
//! - Partial solutions on the first k timings in file order (the convergence chart).
//!
//! References: E. Halley, Phil. Trans. 29, 454 (1716) (durations between contacts); the
//! Schur complement and downdating: G. H. Golub and C. F. Van Loan, *Matrix Computations*,
//! 4th ed. (2013), sections 3.2 and 6.5; R. D. Cook, Technometrics 19, 15 (1977) (influence of
//! left-out observations).

use super::equations::{perturbation, Timing};
use super::fit::{fit, FitOutcome};
use super::identifiability::RANK_TOLERANCE;
use super::parameters::{ParameterSet, PARALLAX};
use super::result::{Chord, ConvergencePoint, StationContribution};
use super::statistics::statistics;
use crate::geometry::contacts::{offset_on_plane, Contact, Perturbation};
use crate::geometry::station::GeocentricStation;
use crate::geometry::transit::TransitEvent;
use crate::observations::timings::Rejected;
use nalgebra::{DMatrix, DVector};

/// Partial solutions on the first k used timings (file order), at up to 25 values of k.
pub fn convergence(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    params: &ParameterSet,
    theta: &[f64],
) -> Vec<ConvergencePoint> {
    let mut order: Vec<usize> = used.to_vec();
    order.sort_by_key(|&i| timings[i].obs.line);
    let n = order.len();
    let steps = 25.min(n);
    let mut out = Vec::new();
    for s in 1..=steps {
        let k = (n * s) / steps;
        if k < params.len() + 1 {
            continue;
        }
        let sub = &order[..k];
        let o = fit(event, timings, sub, params, theta);
        if !o.free[PARALLAX] || !o.converged {
            continue;
        }
        let chi2: f64 = o
            .residuals_s
            .iter()
            .zip(sub)
            .map(|(r, &i)| (r / timings[i].obs.sigma_s).powi(2))
            .sum();
        let dof = k - o.free.iter().filter(|&&f| f).count();
        let st = statistics(chi2, dof);
        out.push(ConvergencePoint {
            timings: k,
            parallax_arcsec: o.theta[PARALLAX],
            sigma_arcsec: o.covariance[(0, 0)].max(0.0).sqrt() * st.sigma_scale,
        });
    }
    out
}

/// The fit's design restricted to the free global parameters.
struct Design<'a> {
    j: &'a DMatrix<f64>,
    w: &'a [f64],
    residuals_s: &'a [f64],
    free_idx: Vec<usize>,
}

impl Design<'_> {
    /// The normal matrix J^T W J of the free parameters.
    fn normal(&self) -> DMatrix<f64> {
        let m = self.free_idx.len();
        let mut normal = DMatrix::<f64>::zeros(m, m);
        for i in 0..self.w.len() {
            for (a, &ja) in self.free_idx.iter().enumerate() {
                for (b, &jb) in self.free_idx.iter().enumerate() {
                    normal[(a, b)] += self.w[i] * self.j[(i, ja)] * self.j[(i, jb)];
                }
            }
        }
        normal
    }

    /// Information on the parallax per timing: w (a_i - proj_i)^2, with proj_i the parallax
    /// partial's projection on the free nuisance columns.
    fn information(&self) -> Vec<f64> {
        let (j, w, n) = (self.j, self.w, self.w.len());
        let nuis: Vec<usize> = self
            .free_idx
            .iter()
            .copied()
            .filter(|&k| k != PARALLAX)
            .collect();
        let m = nuis.len();
        let proj_coef: Vec<f64> = if nuis.is_empty() {
            Vec::new()
        } else {
            let nn = DMatrix::from_fn(m, m, |a, b| {
                (0..n)
                    .map(|i| w[i] * j[(i, nuis[a])] * j[(i, nuis[b])])
                    .sum()
            });
            let rhs = DVector::from_fn(m, |a, _| {
                (0..n)
                    .map(|i| w[i] * j[(i, nuis[a])] * j[(i, PARALLAX)])
                    .sum()
            });
            match nn.cholesky() {
                Some(ch) => ch.solve(&rhs).iter().copied().collect(),
                None => vec![0.0; m],
            }
        };
        (0..n)
            .map(|i| {
                let proj: f64 = nuis
                    .iter()
                    .zip(&proj_coef)
                    .map(|(&k, c)| j[(i, k)] * c)
                    .sum();
                w[i] * (j[(i, PARALLAX)] - proj).powi(2)
            })
            .collect()
    }

    /// Leave-one-station-out change of the parallax: delta = -(N - N_k)^-1 J_k^T W_k r_k,
    /// or `None` when the other stations cannot determine every free parameter.
    fn influence(&self, normal: &DMatrix<f64>, rows: &[usize]) -> Option<f64> {
        let (j, w) = (self.j, self.w);
        let m = self.free_idx.len();
        let mut nk = normal.clone();
        let mut g = DVector::<f64>::zeros(m);
        for &k in rows {
            for (a, &ja) in self.free_idx.iter().enumerate() {
                g[a] += w[k] * j[(k, ja)] * self.residuals_s[k];
                for (b, &jb) in self.free_idx.iter().enumerate() {
                    nk[(a, b)] -= w[k] * j[(k, ja)] * j[(k, jb)];
                }
            }
        }
        let pi_col = self
            .free_idx
            .iter()
            .position(|&k| k == PARALLAX)
            .unwrap_or(0);
        // The rest must still determine every free parameter: the smallest eigenvalue of the
        // downdated normal matrix in correlation form must stay clear of zero.
        let d = DVector::from_fn(m, |a, _| nk[(a, a)].max(0.0).sqrt());
        let cond_ok = d.iter().all(|&x| x > 0.0) && {
            let corr = DMatrix::from_fn(m, m, |a, b| nk[(a, b)] / (d[a] * d[b]));
            corr.symmetric_eigenvalues().min() > RANK_TOLERANCE.powi(2)
        };
        if cond_ok && w.len() - rows.len() > m {
            nk.cholesky().map(|ch| -ch.solve(&g)[pi_col])
        } else {
            None
        }
    }
}

/// The Halley chord of a station from its used timings (interior pair first, else exterior).
fn chord(event: &TransitEvent, station: &[&Timing], p: &Perturbation, er: f64) -> Option<Chord> {
    let geo = &station.first()?.geo;
    let observed = |c: Contact| {
        station
            .iter()
            .find(|t| t.obs.contact == c && !t.is_interval())
            .map(|t| t.observed_h)
    };
    let interval = |a: Contact, b: Contact| {
        station
            .iter()
            .find(|t| t.obs.duration.is_some_and(|d| d.first == a) && t.obs.contact == b)
            .map(|t| t.observed_h)
    };
    let path = |h1: f64, h2: f64, st: Option<&GeocentricStation>| {
        let k = 1.0 / (er * p.length_scale);
        let p1 = offset_on_plane(&event.elements, st, h1, p);
        let p2 = offset_on_plane(&event.elements, st, h2, p);
        let d = ((p2.0 - p1.0).powi(2) + (p2.1 - p1.1).powi(2)).sqrt();
        let closest = (p1.0 * (p2.1 - p1.1) - p1.1 * (p2.0 - p1.0)).abs() / d.max(1e-12);
        (d * k, closest * k)
    };
    [
        (Contact::II, Contact::III, "interior"),
        (Contact::I, Contact::IV, "exterior"),
    ]
    .iter()
    .find_map(|&(a, b, pair)| {
        let ca = event.contact_hours_perturbed(geo, a, p)?;
        let cb = event.contact_hours_perturbed(geo, b, p)?;
        // The observed instants, or a timed interval laid from the predicted first contact.
        let (oa, ob) = match (observed(a), observed(b)) {
            (Some(oa), Some(ob)) => (oa, ob),
            _ => (ca, ca + interval(a, b)?),
        };
        let ga = event.contact_hours_perturbed_geocentric(a, p)?;
        let gb = event.contact_hours_perturbed_geocentric(b, p)?;
        let (obs_len, _) = path(oa, ob, Some(geo));
        let (pred_len, topo_closest) = path(ca, cb, Some(geo));
        let (_, geo_closest) = path(ga, gb, None);
        Some(Chord {
            pair: pair.to_string(),
            observed_arcsec: obs_len,
            predicted_arcsec: pred_len,
            duration_o_c_s: ((ob - oa) - (cb - ca)) * 3600.0,
            parallax_displacement_arcsec: topo_closest - geo_closest,
        })
    })
}

/// The observers named in a station's timings, each once, in order of appearance.
fn observers_of(own: &[&Timing]) -> Vec<String> {
    let mut out: Vec<String> = Vec::new();
    for t in own {
        if !t.obs.observer.is_empty() && !out.contains(&t.obs.observer) {
            out.push(t.obs.observer.clone());
        }
    }
    out
}

/// The positions in `used` of each station's timings, stations in order of first appearance.
fn rows_by_station<'a>(timings: &'a [Timing], used: &[usize]) -> Vec<(&'a str, Vec<usize>)> {
    let mut out: Vec<(&str, Vec<usize>)> = Vec::new();
    let mut index: std::collections::HashMap<&str, usize> = Default::default();
    for (k, &i) in used.iter().enumerate() {
        let name = timings[i].obs.station.name.as_str();
        match index.get(name) {
            Some(&j) => out[j].1.push(k),
            None => {
                index.insert(name, out.len());
                out.push((name, vec![k]));
            }
        }
    }
    out
}

/// Information shares (Schur complement of the normal matrix on the parallax), leave-one-out
/// influence (rank-k downdate of the normal matrix) and chords, per station, ranked by share.
pub fn contributions(
    event: &TransitEvent,
    timings: &[Timing],
    used: &[usize],
    outcome: &FitOutcome,
    w: &[f64],
    er: f64,
) -> Vec<StationContribution> {
    let design = Design {
        j: &outcome.jacobian,
        w,
        residuals_s: &outcome.residuals_s,
        free_idx: (0..outcome.jacobian.ncols())
            .filter(|&j| outcome.free[j])
            .collect(),
    };
    let parallax_free = outcome.free[PARALLAX];
    let normal = design.normal();
    let info = if parallax_free && !used.is_empty() {
        design.information()
    } else {
        vec![0.0; used.len()]
    };
    let total_info: f64 = info.iter().sum();
    let p = perturbation(&outcome.theta, er);
    // Stations on their own, in parallel, gathered in order (the sort below is stable, so
    // the list does not depend on the cores).
    use rayon::prelude::*;
    let mut out: Vec<StationContribution> = rows_by_station(timings, used)
        .into_par_iter()
        .with_min_len(64)
        .map(|(name, rows)| {
            let own: Vec<&Timing> = rows.iter().map(|&k| &timings[used[k]]).collect();
            let first = own[0];
            let share = if total_info > 0.0 {
                rows.iter().map(|&k| info[k]).sum::<f64>() / total_info
            } else {
                0.0
            };
            StationContribution {
                station: name.to_string(),
                latitude_deg: first.obs.station.latitude_deg,
                longitude_deg: first.obs.station.longitude_deg,
                elevation_m: first.obs.station.elevation_m,
                timings: rows.len(),
                information_share: share,
                influence_arcsec: parallax_free
                    .then(|| design.influence(&normal, &rows))
                    .flatten(),
                residuals_s: rows.iter().map(|&k| outcome.residuals_s[k]).collect(),
                contacts: own.iter().map(|t| t.obs.contact.number()).collect(),
                contact_labels: own.iter().map(|t| t.obs.contact_label()).collect(),
                observers: observers_of(&own),
                mean_normalised_residual: rows
                    .iter()
                    .map(|&k| outcome.residuals_s[k] / timings[used[k]].obs.sigma_s)
                    .sum::<f64>()
                    / rows.len() as f64,
                chord: chord(event, &own, &p, er),
                not_used: None,
            }
        })
        .collect();
    out.sort_by(|a, b| b.information_share.total_cmp(&a.information_share));
    out
}

/// The stations none of whose timings was used, kept in the list (after the others) with the
/// reason, so that no station vanishes from the table or the map.
pub fn stations_not_used(
    timings: &[Timing],
    used: &[usize],
    rejected: &[Rejected],
) -> Vec<StationContribution> {
    let mut out: Vec<StationContribution> = Vec::new();
    let mut seen: std::collections::HashSet<&str> = used
        .iter()
        .map(|&i| timings[i].obs.station.name.as_str())
        .collect();
    for t in timings {
        let name = &t.obs.station.name;
        if !seen.insert(name.as_str()) {
            continue;
        }
        let why = rejected
            .iter()
            .find(|r| &r.station == name)
            .map(|r| {
                let d = r.diagnosis.as_deref().unwrap_or("no diagnosis");
                format!("{}: {d}", r.reason.as_str())
            })
            .unwrap_or_else(|| "not used".into());
        out.push(StationContribution {
            station: name.clone(),
            latitude_deg: t.obs.station.latitude_deg,
            longitude_deg: t.obs.station.longitude_deg,
            elevation_m: t.obs.station.elevation_m,
            timings: 0,
            information_share: 0.0,
            influence_arcsec: None,
            residuals_s: Vec::new(),
            contacts: Vec::new(),
            contact_labels: Vec::new(),
            observers: Vec::new(),
            mean_normalised_residual: 0.0,
            chord: None,
            not_used: Some(why),
        });
    }
    out
}
