//! The residuals grouped by clock source and by aperture class
//! (`reduction::residual_groups`) as people and programs read them: the JSON arrays
//! `residuals_by_clock_source` and `residuals_by_aperture`, rows for the terminal table, and
//! the sections of the HTML and Markdown reports and of the organiser's page. A figure a
//! group does not determine is written "not determined" (null in the JSON).

use crate::reduction::residual_groups::{
    any_metadata, by_aperture, by_clock_source, ResidualGroup,
};
use crate::reduction::Reduction;
use crate::render::document::{html_table, md_cell, md_table};
use crate::render::reduction::opt;
use crate::render::svg::esc;
use serde_json::{json, Value};
use std::fmt::Write;

/// The columns of a group's row.
pub const GROUP_HEADERS: [&str; 5] = [
    "group",
    "timings",
    "mean O - C (s)",
    "scatter (s)",
    "from the rest",
];

const NOT_DETERMINED: &str = "not determined";

/// One group as JSON: `group`, `timings`, `mean_o_c_s`, `mean_o_c_sigma_s`, `scatter_s`,
/// `difference_from_rest_s`, `departure_sigmas`, `note`.
fn group_json(g: &ResidualGroup) -> Value {
    json!({
        "group": g.label,
        "timings": g.stats.count,
        "mean_o_c_s": opt(g.stats.mean_o_c_s, 2),
        "mean_o_c_sigma_s": opt(g.stats.mean_sigma_s, 2),
        "scatter_s": opt(g.stats.scatter_s, 2),
        "difference_from_rest_s": opt(g.difference_s, 2),
        "departure_sigmas": opt(g.departure_sigmas, 2),
        "note": g.note,
    })
}

/// The two keys of `reduce --format json`: `residuals_by_clock_source` and
/// `residuals_by_aperture`, arrays of groups (only the groups the used timings fall in).
pub fn groups_json(red: &Reduction) -> [(&'static str, Value); 2] {
    let list = |g: Vec<ResidualGroup>| Value::Array(g.iter().map(group_json).collect());
    [
        (
            "residuals_by_clock_source",
            list(by_clock_source(&red.used)),
        ),
        ("residuals_by_aperture", list(by_aperture(&red.used))),
    ]
}

/// A group's row: label, count, mean +- its error, scatter, the difference from the rest.
fn row(g: &ResidualGroup, pm: &str) -> Vec<String> {
    let mean = match (g.stats.mean_o_c_s, g.stats.mean_sigma_s) {
        (Some(m), Some(e)) => format!("{m:+.1} {pm} {e:.1}"),
        _ => NOT_DETERMINED.into(),
    };
    let scatter = g
        .stats
        .scatter_s
        .map_or(NOT_DETERMINED.into(), |s| format!("{s:.1}"));
    let from_rest = match (g.difference_s, g.departure_sigmas) {
        (Some(d), Some(z)) => format!("{d:+.1} s ({:.1} standard errors)", z.abs()),
        _ => NOT_DETERMINED.into(),
    };
    vec![
        g.label.clone(),
        g.stats.count.to_string(),
        mean,
        scatter,
        from_rest,
    ]
}

/// The two groupings with their titles, and every sentence of the groups (departures first).
fn groupings(red: &Reduction) -> ([(&'static str, Vec<ResidualGroup>); 2], Vec<String>) {
    let g = [
        ("Residuals by clock source", by_clock_source(&red.used)),
        ("Residuals by aperture class", by_aperture(&red.used)),
    ];
    let sentences = g
        .iter()
        .flat_map(|(_, gs)| gs.iter())
        .filter(|x| x.departure_sigmas.is_some_and(|z| z.abs() > 3.0))
        .filter_map(|x| x.note.clone())
        .collect();
    (g, sentences)
}

/// The introduction of the section.
const INTRO: &str = "O - C of the timings used, grouped by how they were made: weighted mean with its standard error, scatter (standard deviation), and the difference from every other timing. A group of fewer than 2 timings is not determined. Aperture classes: up to 60 mm, above 60 up to 100 mm, above 100 up to 150 mm, above 150 mm.";

/// The section of the HTML report and of the organiser's page (empty when no timing used
/// says its clock or its aperture).
pub fn groups_html(red: &Reduction) -> String {
    if !any_metadata(&red.used) {
        return String::new();
    }
    let (g, sentences) = groupings(red);
    let mut s = format!(
        "<h2 id=\"residual-groups\">How the timings were made</h2>\n<p>{}</p>\n",
        esc(INTRO)
    );
    for (title, groups) in &g {
        let rows: Vec<Vec<String>> = groups.iter().map(|x| row(x, "±")).collect();
        let _ = writeln!(s, "<h3>{}</h3>", esc(title));
        s.push_str(&html_table(title, &GROUP_HEADERS, &rows));
    }
    if sentences.is_empty() {
        s.push_str("<p>No group departs from the rest by more than 3 standard errors.</p>\n");
    }
    for line in sentences {
        let _ = writeln!(
            s,
            "<p class=\"note\">{}.</p>",
            esc(&line.replace("+-", "±"))
        );
    }
    s
}

/// The section of the Markdown report (empty when no timing used says its clock or aperture).
pub fn groups_markdown(red: &Reduction) -> String {
    if !any_metadata(&red.used) {
        return String::new();
    }
    let (g, sentences) = groupings(red);
    let mut s = format!("\n## How the timings were made\n\n{}\n", md_cell(INTRO));
    for (title, groups) in &g {
        let rows: Vec<Vec<String>> = groups.iter().map(|x| row(x, "+-")).collect();
        let _ = write!(
            s,
            "\n### {}\n\n{}",
            md_cell(title),
            md_table(&GROUP_HEADERS, &rows)
        );
    }
    if sentences.is_empty() {
        s.push_str("\nNo group departs from the rest by more than 3 standard errors.\n");
    }
    for line in sentences {
        let _ = write!(s, "\n{}.\n", md_cell(&line));
    }
    s
}

/// The section of the terminal table (empty when no timing used says its clock or aperture).
pub fn groups_text(red: &Reduction) -> String {
    if !any_metadata(&red.used) {
        return String::new();
    }
    let (g, sentences) = groupings(red);
    let mut s = String::new();
    for (title, groups) in &g {
        let _ = writeln!(s, "\n{title}");
        for x in groups {
            let r = row(x, "+-");
            let _ = writeln!(
                s,
                "  {:<12} {:>4} timings  mean {:<16} scatter {:<15} from the rest {}",
                r[0], r[1], r[2], r[3], r[4]
            );
        }
    }
    for line in sentences {
        let _ = writeln!(s, "  {line}.");
    }
    s
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::observations::timing_metadata::ClockSource;
    use crate::reduction::residual_groups::by_clock_source;
    use crate::reduction::UsedTiming;

    #[test]
    fn rows_say_not_determined_for_thin_groups() {
        let used = vec![UsedTiming {
            line: 2,
            station: "A".into(),
            contact: 2,
            contact_label: "2".into(),
            observer: String::new(),
            o_c_s: 1.0,
            sigma_s: 5.0,
            metadata: crate::observations::timing_metadata::TimingMetadata {
                clock_source: Some(ClockSource::Radio),
                ..Default::default()
            },
        }];
        let g = by_clock_source(&used);
        let r = row(&g[0], "±");
        assert_eq!(r[0], "radio");
        assert_eq!(r[1], "1");
        assert!(r[2..].iter().all(|c| c == NOT_DETERMINED), "{r:?}");
        let v = group_json(&g[0]);
        assert!(v["mean_o_c_s"].is_null() && v["mean_o_c_sigma_s"].is_null());
        assert!(v["note"].as_str().unwrap().contains("not determined"));
    }
}
