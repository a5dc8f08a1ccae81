//! The classic methods side by side and the error budget, as rows that the terminal table and
//! the HTML and Markdown reports share, and the sentences that explain them.

use crate::reduction::classic_methods::{why_they_differ, MethodSolution};
use crate::reduction::error_budget::ErrorBudget;
use crate::reduction::Reduction;
use crate::render::text::{capitalise, decimals_for};

/// Column headers of the methods' table.
pub const METHOD_HEADERS: [&str; 5] = [
    "method",
    "solar parallax (arcsec)",
    "astronomical unit (millions of km)",
    "timings (stations)",
    "note",
];

/// Column headers of the error budget.
pub const BUDGET_HEADERS: [&str; 3] = [
    "term",
    "effect on the parallax (arcsec)",
    "in the stated uncertainty",
];

fn parallax_cell(m: &MethodSolution) -> String {
    match (m.parallax_arcsec, m.parallax_sigma_arcsec) {
        (Some(p), Some(s)) => {
            let d = decimals_for(s).max(3);
            format!("{p:.d$} +- {s:.d$}")
        }
        _ => "not determined".into(),
    }
}

fn au_cell(m: &MethodSolution) -> String {
    match (m.au_km, m.au_sigma_km) {
        (Some(a), Some(s)) => {
            let d = decimals_for(s * 1e-6);
            format!("{:.d$} +- {:.d$}", a * 1e-6, s * 1e-6)
        }
        _ => "not given".into(),
    }
}

/// One row per method: name, parallax, AU, timings and stations, and its note (what it
/// uses where it gave figures, why not where it did not).
pub fn methods_rows(red: &Reduction) -> Vec<Vec<String>> {
    red.methods
        .iter()
        .map(|m| {
            let mut note = m.note.clone().unwrap_or_default();
            if !m.held.is_empty() {
                if !note.is_empty() {
                    note.push_str(". ");
                }
                note.push_str(&format!("Held: {}", m.held.join("; ")));
            }
            vec![
                m.method.title().to_string(),
                parallax_cell(m),
                au_cell(m),
                format!("{} ({})", m.timings_used, m.stations_used),
                note,
            ]
        })
        .collect()
}

/// The sentences that say why the methods differ.
pub fn methods_sentences(red: &Reduction) -> Vec<String> {
    if red.methods.is_empty() {
        return Vec::new();
    }
    why_they_differ(&red.methods)
}

/// An effect in arcsec to 0.0001", and in words where it is smaller (never a bare zero).
fn arcsec(x: f64) -> String {
    if x < 5e-5 {
        "below 0.0001".into()
    } else {
        format!("{x:.4}")
    }
}

/// The error budget's rows: each term with its effect on the parallax and whether the stated
/// uncertainty includes it.
pub fn budget_rows(b: &ErrorBudget) -> Vec<Vec<String>> {
    let mut rows = vec![vec![
        "timings (stated sigmas, scaled by the Birge ratio where above 1)".to_string(),
        arcsec(b.timings_arcsec),
        "yes".into(),
    ]];
    if let Some(l) = b.longitudes_arcsec {
        rows.push(vec![
            "station longitudes (corrections solved with their priors)".into(),
            arcsec(l),
            "yes".into(),
        ]);
    }
    let (dt_name, dt_term) = match (b.delta_t_sigma_s, b.delta_t_arcsec) {
        (None, _) => (
            format!("Delta T ({:.1} s, fixed with --delta-t)", b.delta_t_s),
            "not counted: fixed values count as exact".to_string(),
        ),
        (Some(s), Some(x)) => (
            format!(
                "Delta T ({:.1} s +- {} s)",
                b.delta_t_s,
                crate::words::uncertainty(s)
            ),
            arcsec(x),
        ),
        (Some(s), None) => (
            format!(
                "Delta T ({:.1} s +- {} s)",
                b.delta_t_s,
                crate::words::uncertainty(s)
            ),
            "not determined".to_string(),
        ),
    };
    rows.push(vec![dt_name, dt_term, "no".into()]);
    if let Some(p) = b.planet_place_arcsec {
        rows.push(vec![
            "the planet's place (held or constrained: the ephemeris's accuracy)".into(),
            arcsec(p),
            "no".into(),
        ]);
    }
    rows.push(vec![
        "stated uncertainty".into(),
        arcsec(b.stated_arcsec),
        String::new(),
    ]);
    rows.push(vec![
        "with the model terms in quadrature".into(),
        arcsec(b.with_model_terms_arcsec),
        String::new(),
    ]);
    rows
}

/// The methods and the error budget for the terminal.
pub fn methods_section(red: &Reduction, s: &mut String) {
    if !red.methods.is_empty() {
        s.push_str("\nThe classic methods beside the full solution\n");
        for row in methods_rows(red) {
            s.push_str(&format!(
                "  {:<36} {:>20}  AU {:>18}  {:>9} timings (stations)\n",
                row[0], row[1], row[2], row[3]
            ));
            if !row[4].is_empty() {
                s.push_str(&format!("      {}\n", row[4]));
            }
        }
        for line in methods_sentences(red) {
            s.push_str(&format!("  {}.\n", capitalise(&line)));
        }
    }
    if let Some(b) = &red.error_budget {
        s.push_str("\nError budget of the parallax\n");
        for row in budget_rows(b) {
            let inside = if row[2].is_empty() {
                String::new()
            } else {
                format!("  in the stated uncertainty: {}", row[2])
            };
            s.push_str(&format!("  {:<66} {:>10}\"{inside}\n", row[0], row[1]));
        }
        for line in b.sentences() {
            s.push_str(&format!("  {}.\n", capitalise(&line)));
        }
    }
}
