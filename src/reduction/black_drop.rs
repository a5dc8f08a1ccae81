//! The black drop as parameters of the condition equations: for each way an interior contact
//! was judged (`thread`: the thread of light between the limbs formed or broke; `touch`: the
//! limbs seemed to touch) and each interior contact (II, III), the lag in seconds of the
//! judged moment behind the geometric contact of the discs (positive: seen later).
//!
//! A lag is measured against timings of the same contact judged otherwise. Where every timing
//! of a contact carries one judgement, its lag moves that contact's time at every station
//! nearly as a change of the interior radius correction (and the planet's offsets) does: to
//! first order they are one unknown, so the lag is held at 0 s and the radius correction
//! carries the black drop (the output says so). Where several judgements but no geometric
//! timing are present, the most frequent judgement's lag is held at 0 and the others are
//! measured relative to it (our own choice of reference: only the differences are measured,
//! and the most frequent gives them the smallest uncertainties).
//!
//! References: the lag as one more unknown of the condition equations, as 19th-century
//! reductions carried a constant correction for each observer's way of judging a contact:
//! S. Newcomb, *Astronomical Papers of the American Ephemeris* II (1891) (cited from memory of
//! its treatment of personal equations); the two judgements recorded side by side at one
//! station in 1769: C. Green and J. Cook, Phil. Trans. 61, 397 (1771).

use super::equations::Timing;
use super::parameters::{ParameterKind, ParameterSet, ParameterSpec, Scope};
use crate::geometry::contacts::Contact;
use crate::observations::contact_forms::ContactJudged;
use crate::observations::timings::Observation;
use serde::Serialize;

/// The interior contacts, whose timings a black drop delays or advances.
const INTERIOR: [Contact; 2] = [Contact::II, Contact::III];

/// The partial derivative (s per s) of a timing's computed value with respect to the lag of
/// `judged` at `contact`: +1 for an instant of that judgement and contact; for an interval of
/// that judgement, +1 where it ends at that contact and -1 where it begins there.
pub fn lag_partial(obs: &Observation, judged: ContactJudged, contact: Contact) -> f64 {
    if obs.judged != judged {
        return 0.0;
    }
    let (first, last) = obs.contacts();
    let mut p = 0.0;
    if last == contact {
        p += 1.0;
    }
    if first == Some(contact) {
        p -= 1.0;
    }
    p
}

/// Whether a timing involves a contact (as an instant or as either end of an interval).
fn involves(obs: &Observation, contact: Contact) -> bool {
    let (first, last) = obs.contacts();
    last == contact || first == Some(contact)
}

/// Add a lag parameter for every judgement other than geometric and every interior contact
/// that the timings carry, starting at 0 s with no prior (before any station parameter).
pub fn add_lag_parameters(params: &mut ParameterSet, timings: &[Timing]) {
    for judged in ContactJudged::LAGGED {
        for contact in INTERIOR {
            let present = timings
                .iter()
                .any(|t| t.obs.judged == judged && involves(&t.obs, contact));
            if present {
                params.add_global_parameter(ParameterSpec {
                    name: format!("black_drop[{}, {}]", judged.name(), contact.roman()),
                    unit: "s",
                    kind: ParameterKind::BlackDrop(judged, contact),
                    scope: Scope::Global,
                    start: 0.0,
                    prior: None,
                    fixed: false,
                });
            }
        }
    }
}

/// What the timings in a fit can say of one lag.
#[derive(Clone, Debug, PartialEq)]
pub enum LagPlan {
    /// No timing in the fit has this judgement at this contact: held at 0 s, not involved.
    NotInvolved,
    /// Fitted against the geometric timings of the contact, or relative to the lag of
    /// another judgement (held at 0 s).
    Fitted(Option<ContactJudged>),
    /// Held at 0 s: the sentence says why and what carries the black drop instead.
    Held(String),
}

/// For every lag parameter, what the timings `used` can determine (see the module's notes).
pub fn lag_plan(
    params: &ParameterSet,
    timings: &[Timing],
    used: &[usize],
) -> Vec<(usize, LagPlan)> {
    let mut out = Vec::new();
    for (j, spec) in params.specs().iter().enumerate() {
        let ParameterKind::BlackDrop(judged, contact) = spec.kind else {
            continue;
        };
        let count = |k: ContactJudged| {
            used.iter()
                .filter(|&&i| timings[i].obs.judged == k && involves(&timings[i].obs, contact))
                .count()
        };
        let mine = count(judged);
        let plan = if mine == 0 {
            LagPlan::NotInvolved
        } else if count(ContactJudged::Geometric) > 0 {
            LagPlan::Fitted(None)
        } else {
            // The reference: the most frequent judgement of this contact (thread before touch
            // on a tie).
            let reference = ContactJudged::LAGGED
                .into_iter()
                .max_by_key(|&k| (count(k), std::cmp::Reverse(k)))
                .unwrap_or(judged);
            if reference != judged {
                LagPlan::Fitted(Some(reference))
            } else if ContactJudged::LAGGED
                .iter()
                .any(|&k| k != judged && count(k) > 0)
            {
                LagPlan::Held(format!(
                    "no timing of contact {} was judged geometric, so the lag of '{}' there is held at 0 s and the other judgements' lags are measured relative to it; the interior radius correction carries the '{}' lag",
                    contact.roman(), judged.name(), judged.name()
                ))
            } else {
                LagPlan::Held(format!(
                    "every timing of contact {} was judged '{}', so its lag behind the geometric contact cannot be told apart from the interior radius correction (and the planet's offsets): it is held at 0 s and the radius correction carries it; timings judged geometric at some stations would separate the two",
                    contact.roman(), judged.name()
                ))
            }
        };
        out.push((j, plan));
    }
    out
}

/// A fitted lag, as reported (`black_drop` in the JSON).
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct BlackDropLag {
    /// The judgement.
    pub contact_judged: &'static str,
    /// The interior contact, 2 or 3.
    pub contact: u8,
    /// The lag behind the geometric contact (or behind `relative_to`), seconds; `None` where
    /// not determined.
    pub delay_s: Option<f64>,
    /// Its standard uncertainty, seconds.
    pub sigma_s: Option<f64>,
    /// The judgement the lag is measured from, where no timing of the contact was geometric.
    pub relative_to: Option<&'static str>,
    /// Why no figure, where there is none.
    pub note: Option<String>,
}

/// The lags of a solution: one entry per judgement and interior contact present, with its
/// fitted value and (scaled) uncertainty, or the sentence why it is not determined.
///
/// Arguments: `params`; `plan`, from [`lag_plan`] on the fit's timings; `values`, every
/// parameter's value; `sigmas`, every parameter's scaled uncertainty (`None`: not fitted).
pub fn lags(
    params: &ParameterSet,
    plan: &[(usize, LagPlan)],
    values: &[f64],
    sigmas: &[Option<f64>],
) -> Vec<BlackDropLag> {
    plan.iter()
        .filter_map(|(j, p)| {
            let ParameterKind::BlackDrop(judged, contact) = params.specs()[*j].kind else {
                return None;
            };
            let mut lag = BlackDropLag {
                contact_judged: judged.name(),
                contact: contact.number(),
                delay_s: None,
                sigma_s: None,
                relative_to: None,
                note: None,
            };
            match (p, sigmas[*j]) {
                (LagPlan::NotInvolved, _) => return None,
                (LagPlan::Held(why), _) => lag.note = Some(why.clone()),
                (LagPlan::Fitted(reference), Some(s)) if s.is_finite() && s > 0.0 => {
                    lag.delay_s = Some(values[*j]);
                    lag.sigma_s = Some(s);
                    lag.relative_to = reference.map(ContactJudged::name);
                }
                (LagPlan::Fitted(_), _) => {
                    lag.note = Some("not determined: the timings cannot separate this lag from the other parameters (see the warnings)".into());
                }
            }
            Some(lag)
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::station::Station;
    use crate::observations::timings::Interval;

    fn obs(contact: Contact, judged: ContactJudged, first: Option<Contact>) -> Observation {
        let st = Station::new("s", 0.0, 0.0, 0.0).unwrap();
        let mut o = Observation::instant(2, st, contact, Default::default(), 5.0);
        o.judged = judged;
        o.duration = first.map(|f| Interval {
            first: f,
            seconds: 20_000.0,
            date: None,
            kept_to: None,
        });
        o
    }

    #[test]
    fn partials_follow_the_judgement_and_the_ends_of_an_interval() {
        use ContactJudged::*;
        assert_eq!(
            lag_partial(&obs(Contact::II, Touch, None), Touch, Contact::II),
            1.0
        );
        assert_eq!(
            lag_partial(&obs(Contact::II, Thread, None), Touch, Contact::II),
            0.0
        );
        let interval = obs(Contact::III, Touch, Some(Contact::II));
        assert_eq!(lag_partial(&interval, Touch, Contact::II), -1.0);
        assert_eq!(lag_partial(&interval, Touch, Contact::III), 1.0);
        assert_eq!(lag_partial(&interval, Thread, Contact::III), 0.0);
    }
}
