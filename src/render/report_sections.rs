//! The sections of the reports that explain the result beyond the fit itself: the classic
//! methods beside the full solution, the error budget, and what else the timings measure,
//! in HTML and in Markdown (the tables and helpers of `document.rs`).

use crate::reduction::Reduction;
use crate::render::document::{html_table, md_cell, md_table, plus_minus, plus_minus_rows};
use crate::render::methods::{
    budget_rows, methods_rows, methods_sentences, BUDGET_HEADERS, METHOD_HEADERS,
};
use crate::render::svg::esc;
use crate::render::text::capitalise;
use crate::render::what_else::{
    distant_sentences, scale_intro, scale_rows, size_rows, size_sentences, SCALE_HEADERS,
    SIZE_HEADERS,
};
use std::fmt::Write;

const METHODS_TITLE: &str = "The classic methods beside the full solution";
const BUDGET_TITLE: &str = "Error budget of the parallax";

/// The methods side by side and the error budget, in HTML.
pub(crate) fn html_methods(red: &Reduction, s: &mut String) {
    if !red.methods.is_empty() {
        let _ = writeln!(s, "<h2>{METHODS_TITLE}</h2>");
        s.push_str(&html_table(
            METHODS_TITLE,
            &METHOD_HEADERS,
            &plus_minus_rows(methods_rows(red)),
        ));
        for line in methods_sentences(red) {
            let _ = writeln!(s, "<p>{}.</p>", esc(&plus_minus(&capitalise(&line))));
        }
    }
    if let Some(b) = &red.error_budget {
        let _ = writeln!(s, "<h2>{BUDGET_TITLE}</h2>");
        s.push_str(&html_table(
            BUDGET_TITLE,
            &BUDGET_HEADERS,
            &plus_minus_rows(budget_rows(b)),
        ));
        for line in b.sentences() {
            let _ = writeln!(s, "<p>{}.</p>", esc(&plus_minus(&capitalise(&line))));
        }
    }
}

const WHAT_ELSE_TITLE: &str = "What else the timings measure";

/// The light curve seen from the Earth's centre, for the reports (every minute, from 15
/// minutes before contact I to 15 after IV), or `None` when it cannot be computed.
pub(crate) fn report_light_curve(red: &Reduction) -> Option<String> {
    let points = crate::scale::light_curve::light_curve(&red.event, 60.0, 900.0).ok()?;
    Some(crate::render::light_curve_chart::light_curve_svg(
        &red.event, &points,
    ))
}

/// The scale of the Solar System, the sizes and the depth, in HTML.
pub(crate) fn html_what_else(red: &Reduction, s: &mut String) {
    let w = crate::scale::summary::what_else(red);
    let _ = writeln!(
        s,
        "<h2>{WHAT_ELSE_TITLE}</h2>\n<p>{}</p>",
        esc(&plus_minus(&scale_intro(red, &w)))
    );
    if !w.scale.is_empty() {
        s.push_str(&html_table(
            "The planets' distances",
            &SCALE_HEADERS,
            &plus_minus_rows(scale_rows(&w)),
        ));
    }
    for line in size_sentences(red, &w) {
        let _ = writeln!(s, "<p>{}</p>", esc(&plus_minus(&line)));
    }
    if !w.sizes.stations.is_empty() {
        s.push_str(&html_table(
            "Each station's sizes",
            &SIZE_HEADERS,
            &plus_minus_rows(size_rows(&w, 300)),
        ));
    }
    if let Some(svg) = report_light_curve(red) {
        s.push_str(&crate::render::figures::light_curve_figure(&svg));
    }
    for line in distant_sentences(red, &w) {
        let _ = writeln!(s, "<p>{}</p>", esc(&plus_minus(&line)));
    }
}

/// The scale of the Solar System, the sizes and the depth, in Markdown (the light curve as
/// its own SVG file, `chart`).
pub(crate) fn md_what_else(red: &Reduction, s: &mut String, chart: Option<&str>) {
    let w = crate::scale::summary::what_else(red);
    let _ = write!(
        s,
        "\n## {WHAT_ELSE_TITLE}\n\n{}\n\n",
        md_cell(&scale_intro(red, &w))
    );
    if !w.scale.is_empty() {
        s.push_str(&md_table(&SCALE_HEADERS, &scale_rows(&w)));
    }
    for line in size_sentences(red, &w) {
        let _ = write!(s, "\n{}\n", md_cell(&line));
    }
    if !w.sizes.stations.is_empty() {
        s.push('\n');
        s.push_str(&md_table(&SIZE_HEADERS, &size_rows(&w, 300)));
    }
    if let Some(file) = chart {
        let _ = write!(
            s,
            "\n![The Sun's brightness seen from the Earth's centre through the transit]({file})\n\n{}\n",
            md_cell(&crate::render::figures::light_curve_caption())
        );
    }
    for line in distant_sentences(red, &w) {
        let _ = write!(s, "\n{}\n", md_cell(&line));
    }
}

/// The methods side by side and the error budget, in Markdown.
pub(crate) fn md_methods(red: &Reduction, s: &mut String) {
    if !red.methods.is_empty() {
        let _ = write!(s, "\n## {METHODS_TITLE}\n\n");
        s.push_str(&md_table(&METHOD_HEADERS, &methods_rows(red)));
        for line in methods_sentences(red) {
            let _ = write!(s, "\n{}.\n", md_cell(&capitalise(&line)));
        }
    }
    if let Some(b) = &red.error_budget {
        let _ = write!(s, "\n## {BUDGET_TITLE}\n\n");
        s.push_str(&md_table(&BUDGET_HEADERS, &budget_rows(b)));
        for line in b.sentences() {
            let _ = write!(s, "\n{}.\n", md_cell(&capitalise(&line)));
        }
    }
}
