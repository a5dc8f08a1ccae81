//! The residuals of the solution grouped by how the timings were made: by clock source and by
//! aperture class. A group whose timings sit off the others' shows a cause the fit does not
//! model: a clock set wrong in one way (all the phones, say), or the black drop seen larger
//! and later in small instruments.
//!
//! For each group of n timings with residuals r_i and standard uncertainties s_i (weights
//! w_i = 1 / s_i^2):
//! - the weighted mean O - C, m = sum(w r) / sum(w);
//! - its standard error, 1 / sqrt(sum(w)) times the group's Birge ratio
//!   sqrt(sum(w (r - m)^2) / (n - 1)) where that exceeds 1 (a group that scatters more than
//!   its uncertainties say is not allowed a smaller error than its scatter supports);
//! - the scatter, the sample standard deviation of the residuals (unweighted).
//!
//! With fewer than [`MIN_GROUP_TIMINGS`] timings none of these is determined (one residual
//! has no scatter and no error of its own beyond what it was given). A group departs from the
//! rest when its mean differs from the weighted mean of every other timing by more than
//! [`DEPARTURE_SIGMAS`] standard errors of that difference (the two errors combined in
//! quadrature; the rest needs two timings as well).
//!
//! Aperture classes (documented in docs/service.md): up to 60 mm (small refractors, binocular
//! halves, pinhole-size projections), 61-100 mm (the common small refractor), 101-150 mm,
//! over 150 mm.

use super::result::UsedTiming;
use crate::observations::timing_metadata::ClockSource;

/// Fewest timings for which a group's mean, error and scatter are given.
pub const MIN_GROUP_TIMINGS: usize = 2;

/// A group departs from the rest beyond this many standard errors of the difference.
pub const DEPARTURE_SIGMAS: f64 = 3.0;

/// The upper bounds of the aperture classes, millimetres (a class holds apertures above the
/// previous bound and up to its own); the last class is open.
pub const APERTURE_BOUNDS_MM: [f64; 3] = [60.0, 100.0, 150.0];

/// The group's label where the timings do not say.
pub const NOT_GIVEN: &str = "not given";

/// The statistics of one group's residuals.
#[derive(Clone, Debug, PartialEq)]
pub struct GroupStatistics {
    /// Timings in the group.
    pub count: usize,
    /// Weighted mean O - C, seconds (`None` with fewer than two timings).
    pub mean_o_c_s: Option<f64>,
    /// Its standard error, seconds (positive; `None` where the mean is not determined).
    pub mean_sigma_s: Option<f64>,
    /// Sample standard deviation of the residuals, seconds.
    pub scatter_s: Option<f64>,
}

/// One group: its label, its statistics and, where it departs from the rest, by how much.
#[derive(Clone, Debug, PartialEq)]
pub struct ResidualGroup {
    /// `gps`, ... or `<= 60 mm`, ..., or [`NOT_GIVEN`].
    pub label: String,
    /// The statistics.
    pub stats: GroupStatistics,
    /// The difference from the rest in standard errors of the difference, where both sides
    /// are determined.
    pub departure_sigmas: Option<f64>,
    /// The difference from the rest's weighted mean, seconds, where determined.
    pub difference_s: Option<f64>,
    /// A sentence when the group departs from the rest, or says why nothing is determined.
    pub note: Option<String>,
}

/// The weighted mean and its (Birge-inflated) standard error, unweighted scatter.
pub fn group_statistics(residuals: &[(f64, f64)]) -> GroupStatistics {
    let count = residuals.len();
    let usable = residuals
        .iter()
        .all(|(r, s)| r.is_finite() && s.is_finite() && *s > 0.0);
    if count < MIN_GROUP_TIMINGS || !usable {
        return GroupStatistics {
            count,
            mean_o_c_s: None,
            mean_sigma_s: None,
            scatter_s: None,
        };
    }
    let sw: f64 = residuals.iter().map(|(_, s)| 1.0 / (s * s)).sum();
    let mean = residuals.iter().map(|(r, s)| r / (s * s)).sum::<f64>() / sw;
    let chi2: f64 = residuals
        .iter()
        .map(|(r, s)| ((r - mean) / s).powi(2))
        .sum();
    let n = count as f64;
    let birge = (chi2 / (n - 1.0)).sqrt().max(1.0);
    let plain = residuals.iter().map(|(r, _)| r).sum::<f64>() / n;
    let scatter = (residuals
        .iter()
        .map(|(r, _)| (r - plain).powi(2))
        .sum::<f64>()
        / (n - 1.0))
        .sqrt();
    GroupStatistics {
        count,
        mean_o_c_s: Some(mean),
        mean_sigma_s: Some(birge / sw.sqrt()),
        scatter_s: Some(scatter),
    }
}

/// The aperture class of an aperture, as its label.
pub fn aperture_class(aperture_mm: Option<f64>) -> String {
    let Some(a) = aperture_mm else {
        return NOT_GIVEN.into();
    };
    let [b0, b1, b2] = APERTURE_BOUNDS_MM;
    if a <= b0 {
        format!("<= {b0:.0} mm")
    } else if a <= b1 {
        format!("{:.0}-{b1:.0} mm", b0 + 1.0)
    } else if a <= b2 {
        format!("{:.0}-{b2:.0} mm", b1 + 1.0)
    } else {
        format!("> {b2:.0} mm")
    }
}

/// Every aperture class's label, in order, then [`NOT_GIVEN`].
pub fn aperture_labels() -> Vec<String> {
    [Some(1.0), Some(61.0), Some(101.0), Some(151.0), None]
        .into_iter()
        .map(aperture_class)
        .collect()
}

/// What a group of this kind may point to, for the departure sentence.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Grouping {
    /// By clock source.
    ClockSource,
    /// By aperture class.
    Aperture,
}

impl Grouping {
    fn what(self, label: &str) -> String {
        match self {
            Grouping::ClockSource if label == NOT_GIVEN => {
                "timings that do not say their clock".into()
            }
            Grouping::ClockSource => format!("timings read from {label} clocks"),
            Grouping::Aperture if label == NOT_GIVEN => {
                "timings that do not say their aperture".into()
            }
            Grouping::Aperture => format!("timings with apertures of {label}"),
        }
    }

    fn cause(self) -> &'static str {
        match self {
            Grouping::ClockSource => "look at how these clocks were set (an offset shared by one kind of clock is a clock error, not the transit)",
            Grouping::Aperture => "small instruments see the black drop larger and time interior contacts later; compare the contacts these timings are of",
        }
    }
}

/// The groups of the used timings by `key` (labels in the order of `order`; a label absent
/// from the timings is left out), each against the rest.
pub fn groups_by(
    used: &[UsedTiming],
    key: impl Fn(&UsedTiming) -> String,
    order: &[String],
    grouping: Grouping,
) -> Vec<ResidualGroup> {
    let keys: Vec<String> = used.iter().map(&key).collect();
    order
        .iter()
        .filter(|label| keys.contains(label))
        .map(|label| {
            let (inside, rest): (Vec<_>, Vec<_>) = used
                .iter()
                .zip(&keys)
                .map(|(u, k)| (k == label, (u.o_c_s, u.sigma_s)))
                .partition(|(is, _)| *is);
            let inside: Vec<(f64, f64)> = inside.into_iter().map(|(_, x)| x).collect();
            let rest: Vec<(f64, f64)> = rest.into_iter().map(|(_, x)| x).collect();
            one_group(label, &inside, &rest, grouping)
        })
        .collect()
}

fn one_group(
    label: &str,
    inside: &[(f64, f64)],
    rest: &[(f64, f64)],
    grouping: Grouping,
) -> ResidualGroup {
    let stats = group_statistics(inside);
    let other = group_statistics(rest);
    let mut group = ResidualGroup {
        label: label.to_string(),
        stats: stats.clone(),
        departure_sigmas: None,
        difference_s: None,
        note: None,
    };
    if stats.mean_o_c_s.is_none() {
        group.note = Some(format!(
            "not determined: {} in the group, at least {MIN_GROUP_TIMINGS} are needed",
            crate::words::count(stats.count, "timing", "timings")
        ));
        return group;
    }
    let (Some(m), Some(e), Some(mr), Some(er)) = (
        stats.mean_o_c_s,
        stats.mean_sigma_s,
        other.mean_o_c_s,
        other.mean_sigma_s,
    ) else {
        return group;
    };
    let d = m - mr;
    let sd = e.hypot(er);
    let z = d / sd;
    group.difference_s = Some(d);
    group.departure_sigmas = Some(z);
    if z.abs() > DEPARTURE_SIGMAS {
        group.note = Some(format!(
            "{} ({}) are on average {d:+.1} s +- {sd:.1} s from the rest ({:.1} standard errors): {}",
            capital(&grouping.what(label)),
            stats.count,
            z.abs(),
            grouping.cause()
        ));
    }
    group
}

fn capital(text: &str) -> String {
    let mut c = text.chars();
    c.next().map_or(String::new(), |f| {
        f.to_uppercase().collect::<String>() + c.as_str()
    })
}

/// The used timings grouped by clock source (in the order of [`ClockSource::ALL`], then those
/// that do not say).
pub fn by_clock_source(used: &[UsedTiming]) -> Vec<ResidualGroup> {
    let order: Vec<String> = ClockSource::ALL
        .iter()
        .map(|c| c.name().to_string())
        .chain([NOT_GIVEN.to_string()])
        .collect();
    groups_by(
        used,
        |u| {
            u.metadata
                .clock_source
                .map_or(NOT_GIVEN.to_string(), |c| c.name().to_string())
        },
        &order,
        Grouping::ClockSource,
    )
}

/// The used timings grouped by aperture class (see the module's notes).
pub fn by_aperture(used: &[UsedTiming]) -> Vec<ResidualGroup> {
    groups_by(
        used,
        |u| aperture_class(u.metadata.aperture_mm),
        &aperture_labels(),
        Grouping::Aperture,
    )
}

/// Whether any used timing says how it was made (its clock or its aperture): the reports show
/// the groups only then.
pub fn any_metadata(used: &[UsedTiming]) -> bool {
    used.iter()
        .any(|u| u.metadata.clock_source.is_some() || u.metadata.aperture_mm.is_some())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::observations::timing_metadata::TimingMetadata;

    fn timing(o_c_s: f64, sigma_s: f64, clock: Option<ClockSource>, ap: Option<f64>) -> UsedTiming {
        UsedTiming {
            line: 2,
            station: "A".into(),
            contact: 2,
            contact_label: "2".into(),
            observer: String::new(),
            o_c_s,
            sigma_s,
            metadata: TimingMetadata {
                clock_source: clock,
                aperture_mm: ap,
                ..TimingMetadata::default()
            },
        }
    }

    #[test]
    fn thin_groups_are_not_determined() {
        let none = group_statistics(&[]);
        assert_eq!(
            (none.count, none.mean_o_c_s, none.mean_sigma_s),
            (0, None, None)
        );
        let one = group_statistics(&[(3.0, 5.0)]);
        assert_eq!((one.count, one.mean_o_c_s, one.scatter_s), (1, None, None));
        let groups = by_clock_source(&[
            timing(1.0, 5.0, Some(ClockSource::Gps), None),
            timing(2.0, 5.0, None, None),
            timing(-1.0, 5.0, None, None),
        ]);
        assert_eq!(groups.len(), 2);
        assert_eq!(groups[0].label, "gps");
        assert!(groups[0]
            .note
            .as_deref()
            .unwrap()
            .starts_with("not determined"));
        assert!(groups[0].departure_sigmas.is_none());
        // The rest has one timing: the group's own figures, no comparison.
        assert!(groups[1].stats.mean_o_c_s.is_some());
        assert!(groups[1].departure_sigmas.is_none());
    }

    #[test]
    fn the_weighted_mean_error_and_scatter() {
        let s = group_statistics(&[(1.0, 1.0), (3.0, 1.0)]);
        assert!((s.mean_o_c_s.unwrap() - 2.0).abs() < 1e-12);
        // chi2 = 2 over 1 dof: Birge ratio sqrt(2), error sqrt(2) / sqrt(2) = 1.
        assert!((s.mean_sigma_s.unwrap() - 1.0).abs() < 1e-12);
        assert!((s.scatter_s.unwrap() - 2f64.sqrt()).abs() < 1e-12);
        // Weights pull the mean to the better timing; a tight group keeps its formal error.
        let w = group_statistics(&[(0.0, 1.0), (0.1, 2.0)]);
        assert!((w.mean_o_c_s.unwrap() - 0.02).abs() < 1e-12);
        assert!((w.mean_sigma_s.unwrap() - (0.8f64).sqrt()).abs() < 1e-12);
        assert!(w.mean_sigma_s.unwrap() > 0.0);
    }

    #[test]
    fn a_group_off_the_rest_is_named() {
        let mut used = Vec::new();
        for k in 0..6 {
            let jitter = if k % 2 == 0 { 0.5 } else { -0.5 };
            used.push(timing(jitter, 2.0, Some(ClockSource::Gps), Some(80.0)));
            used.push(timing(
                30.0 + jitter,
                2.0,
                Some(ClockSource::Phone),
                Some(200.0),
            ));
        }
        let groups = by_clock_source(&used);
        let phone = groups.iter().find(|g| g.label == "phone").unwrap();
        assert!(phone.departure_sigmas.unwrap() > DEPARTURE_SIGMAS);
        let note = phone.note.as_deref().unwrap();
        assert!(
            note.starts_with("Timings read from phone clocks (6)"),
            "{note}"
        );
        assert!(note.contains("+30.0 s"), "{note}");
        let ap = by_aperture(&used);
        let labels: Vec<&str> = ap.iter().map(|g| g.label.as_str()).collect();
        assert_eq!(labels, ["61-100 mm", "> 150 mm"]);
    }

    #[test]
    fn aperture_classes_have_documented_bounds() {
        assert_eq!(aperture_class(Some(60.0)), "<= 60 mm");
        assert_eq!(aperture_class(Some(60.5)), "61-100 mm");
        assert_eq!(aperture_class(Some(100.0)), "61-100 mm");
        assert_eq!(aperture_class(Some(150.0)), "101-150 mm");
        assert_eq!(aperture_class(Some(150.1)), "> 150 mm");
        assert_eq!(aperture_class(None), NOT_GIVEN);
        assert_eq!(aperture_labels().len(), 5);
    }
}
