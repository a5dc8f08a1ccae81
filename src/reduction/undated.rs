//! Times written without a date (`22:27:46Z`, as a logbook or a phone's clock app gives them):
//! each takes the date that puts it nearest the contact predicted at its station, and the
//! reduction says which rows were completed so.

use crate::geometry::transit::TransitEvent;
use crate::observations::timings::Observation;
use chrono::{NaiveDateTime, TimeDelta};

/// Give each undated timing the date that puts it nearest its predicted contact at its
/// station (the event's greatest transit where the contact does not happen there), trying the
/// predicted date and the days either side. Returns the sentence for the reduction's notes, or
/// `None` where every time had its date.
pub fn complete_dates(valid: &mut [Observation], event: &TransitEvent) -> Option<String> {
    let mut lines: Vec<u64> = Vec::new();
    let mut dates = Vec::new();
    for obs in valid
        .iter_mut()
        .filter(|o| o.written.undated && o.duration.is_none())
    {
        complete_date(obs, event);
        lines.push(obs.line);
        let date = obs.time_label.date();
        if !dates.contains(&date) {
            dates.push(date);
        }
    }
    if lines.is_empty() {
        return None;
    }
    dates.sort_unstable();
    let shown: Vec<String> = dates.iter().map(ToString::to_string).collect();
    let each = if lines.len() == 1 { "it" } else { "each" };
    Some(format!(
        "{} written without a date (line{} {}) took the date that puts {each} nearest its predicted contact at its station ({}); write the date with the time to be sure of it",
        crate::words::count(lines.len(), "time", "times"),
        if lines.len() == 1 { "" } else { "s" },
        crate::words::line_ranges(&lines),
        shown.join(", ")
    ))
}

/// Give one undated timing (an instant) the date nearest its predicted contact at its station
/// (the event's greatest transit where that contact does not happen there).
pub fn complete_date(obs: &mut Observation, event: &TransitEvent) {
    if !obs.written.undated || obs.duration.is_some() {
        return;
    }
    let predicted = event.predict(&obs.station).contacts[obs.contact.index()]
        .map_or(event.hours_of_greatest(), |c| c.hours);
    obs.time_label = nearest_on_some_day(obs.time_label, event.label(predicted));
    obs.written.undated = false;
}

/// The time of day of `label` on the day (that of `target` or either side) nearest `target`.
fn nearest_on_some_day(label: NaiveDateTime, target: NaiveDateTime) -> NaiveDateTime {
    let on_target_day = target.date().and_time(label.time());
    [-1, 0, 1]
        .into_iter()
        .map(|d| on_target_day + TimeDelta::days(d))
        .min_by_key(|t| (*t - target).num_milliseconds().abs())
        .unwrap_or(on_target_day)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn at(text: &str) -> NaiveDateTime {
        NaiveDateTime::parse_from_str(text, "%Y-%m-%dT%H:%M:%S").expect("test time")
    }

    #[test]
    fn the_nearest_day_is_taken_across_midnight() {
        let target = at("2012-06-05T23:58:00");
        assert_eq!(
            nearest_on_some_day(at("2000-01-01T00:03:10"), target),
            at("2012-06-06T00:03:10")
        );
        assert_eq!(
            nearest_on_some_day(at("2000-01-01T23:50:00"), target),
            at("2012-06-05T23:50:00")
        );
        let target = at("2012-06-06T00:01:00");
        assert_eq!(
            nearest_on_some_day(at("2000-01-01T23:59:30"), target),
            at("2012-06-05T23:59:30")
        );
    }
}
