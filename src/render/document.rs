//! Reports of a reduction for publishing: one self-contained HTML file (inline SVG and CSS, no
//! script, nothing fetched) or Markdown with the charts as SVG files beside it.

use crate::error::{Error, Result};
use crate::reduction::Reduction;
use crate::render::charts::{
    convergence_svg, residuals_chart, sampling_note, solar_disc_chart, station_map_svg,
};
use crate::render::figures::{
    convergence_caption, convergence_figure, disc_caption, disc_figure, disc_key, map_caption,
    map_figure, residual_caption, residual_figure, Page,
};
use crate::render::reduction::chi2_sentence;
use crate::render::reduction::{black_drop_sentences, correlation_notes};
use crate::render::report_sections::{
    html_methods, html_what_else, md_methods, md_what_else, report_light_curve,
};
use crate::render::svg::esc;
use crate::render::text::capitalise;
use crate::render::text::{au_text, SAFETY_CAUTION};
use std::fmt::Write;
use std::path::{Path, PathBuf};

const METHOD: &str =
    "Each station timed the moments when the planet's disc touched the Sun's edge. \
Seen from different places on the Earth, the planet's path across the Sun is shifted by parallax, \
so the contacts come seconds to minutes earlier or later from station to station. For every \
timing the reduction compares the observed time (O) with the time computed (C) for a trial value \
of the solar parallax, writes one condition equation linking O - C to small corrections of the \
parallax and of the planet's place and size, and solves all of them together by least squares. \
Kepler's third law fixes the sizes of the planets' orbits in astronomical units; the parallax \
fixes the astronomical unit in kilometres, AU = 6378.1366 km / sin(parallax).";

struct Summary {
    headline: Vec<(String, String)>,
}

fn summary(red: &Reduction) -> Summary {
    let mut headline = Vec::new();
    match red.headline() {
        Some(h) => {
            let (lo, hi) = h.parallax_interval_95;
            headline.push((
                "Solar parallax".into(),
                format!(
                    "{:.4}\" ± {:.4}\" (95 % interval {lo:.4}\" to {hi:.4}\")",
                    h.parallax_arcsec, h.parallax_sigma_arcsec
                ),
            ));
            headline.push(("Astronomical unit".into(), au_text(&h, "±")));
        }
        None => headline.push((
            "Solar parallax".into(),
            "not determined by these timings (see the warnings)".into(),
        )),
    }
    headline.push((
        "Timings".into(),
        format!(
            "{} used of {} ({} not used)",
            red.timings_used,
            red.timings_total,
            red.rejected.len()
        ),
    ));
    headline.push(("Chi-square".into(), red.statistics.describe()));
    headline.push(("Ephemeris".into(), red.event.ephemeris_name()));
    headline.push((
        "The planet's place".into(),
        crate::render::reduction::place_sentence(red),
    ));
    Summary { headline }
}

fn parameters_rows(red: &Reduction) -> Vec<Vec<String>> {
    red.parameters
        .iter()
        .enumerate()
        .map(|(i, p)| {
            let inseparable = red.inseparable(i);
            let value = match inseparable {
                Some(_) => "-".to_string(),
                None => format!("{:.5}", p.value),
            };
            let sigma = match inseparable {
                Some((other, r)) => Some(format!(
                    "correlated {r:+.4} with {other}: only the combination is determined"
                )),
                None => p.sigma.map(|s| format!("{s:.5}")),
            };
            let mut row = vec![
                format!("p{} {}", i + 1, p.name),
                value,
                sigma.unwrap_or_else(|| {
                    if p.fixed {
                        "held fixed"
                    } else {
                        "not determined"
                    }
                    .into()
                }),
                p.unit.clone(),
            ];
            match red.correlation.get(i) {
                Some(r) => row.extend(r.iter().map(|c| format!("{c:+.3}"))),
                None => row.extend(vec![String::new(); red.correlation.len()]),
            }
            row
        })
        .collect()
}

/// Most stations listed in a report's table (those with the largest shares).
pub const STATION_ROWS_MAX: usize = 300;
/// Most rows not used listed in a report's table (in the order of the file).
pub const REJECTED_ROWS_MAX: usize = 500;

/// Sentences saying what the tables leave out of a large campaign.
fn table_notes(red: &Reduction) -> (Option<String>, Option<String>) {
    let n = red.stations.len();
    let stations = (n > STATION_ROWS_MAX).then(|| {
        let rest: f64 = red.stations[STATION_ROWS_MAX..]
            .iter()
            .map(|s| s.information_share)
            .sum();
        format!(
            "The table lists the {STATION_ROWS_MAX} stations with the largest shares of the information; the other {} carry {:.1} % of it. `reduce --format json` lists every station.",
            n - STATION_ROWS_MAX,
            100.0 * rest
        )
    });
    let r = red.rejected.len();
    let rows = (r > REJECTED_ROWS_MAX).then(|| {
        format!(
            "The table lists the first {REJECTED_ROWS_MAX} of the {r} rows not used; `reduce --format csv` lists every row with its reason."
        )
    });
    (stations, rows)
}

fn station_rows(red: &Reduction) -> Vec<Vec<String>> {
    red.stations
        .iter()
        .take(STATION_ROWS_MAX)
        .enumerate()
        .map(|(i, s)| {
            let oc: Vec<String> = s
                .contact_labels
                .iter()
                .zip(&s.residuals_s)
                .map(|(c, r)| format!("{c}: {r:+.1}"))
                .collect();
            let (chord_o, chord_p, disp) = match &s.chord {
                Some(c) => (
                    format!("{:.2} ({})", c.observed_arcsec, c.pair),
                    format!("{:.2}", c.predicted_arcsec),
                    format!("{:+.2}", c.parallax_displacement_arcsec),
                ),
                None => ("-".into(), "-".into(), "-".into()),
            };
            vec![
                format!("{}", i + 1),
                s.station.clone(),
                format!("{:.3}, {:.3}", s.latitude_deg, s.longitude_deg),
                s.timings.to_string(),
                format!("{:.4}", s.information_share),
                s.influence_arcsec
                    .map(|x| format!("{x:+.5}"))
                    .unwrap_or_else(|| "-".into()),
                chord_o,
                chord_p,
                disp,
                match &s.not_used {
                    Some(why) => format!("not used: {why}"),
                    None => oc.join("; "),
                },
            ]
        })
        .collect()
}

const STATION_HEADERS: [&str; 10] = [
    "#",
    "station",
    "latitude, longitude (deg)",
    "timings",
    "information share",
    "influence on the parallax (arcsec)",
    "chord observed (arcsec)",
    "chord predicted (arcsec)",
    "parallax displacement of the path (arcsec)",
    "O - C by contact (s), or why no timing was used",
];

fn rejected_rows(red: &Reduction) -> Vec<Vec<String>> {
    red.rejected
        .iter()
        .take(REJECTED_ROWS_MAX)
        .enumerate()
        .map(|(i, r)| {
            vec![
                format!("{}", i + 1),
                r.line.to_string(),
                r.station.clone(),
                r.contact
                    .map(|c| c.to_string())
                    .unwrap_or_else(|| "-".into()),
                r.reason.as_str().to_string(),
                r.o_c_s
                    .map(|x| format!("{x:+.1}"))
                    .unwrap_or_else(|| "-".into()),
                r.diagnosis.clone().unwrap_or_default(),
            ]
        })
        .collect()
}

const REJECTED_HEADERS: [&str; 7] = [
    "#",
    "line",
    "station",
    "contact",
    "reason",
    "O - C (s)",
    "diagnosis",
];

/// A table in a box that scrolls sideways on its own on a narrow screen (the page never
/// does), reachable from the keyboard and named `label` for screen readers.
pub(crate) fn html_table(label: &str, headers: &[&str], rows: &[Vec<String>]) -> String {
    let mut s = format!(
        "<div class=\"scroll\" tabindex=\"0\" role=\"region\" aria-label=\"{}\">\n<table>\n<thead><tr>",
        esc(label)
    );
    for h in headers {
        let _ = write!(s, "<th scope=\"col\">{}</th>", esc(h));
    }
    s.push_str("</tr></thead>\n<tbody>\n");
    for r in rows {
        s.push_str("<tr>");
        for c in r {
            let _ = write!(s, "<td>{}</td>", esc(c));
        }
        s.push_str("</tr>\n");
    }
    s.push_str("</tbody>\n</table>\n</div>\n");
    s
}

/// Escape text for Markdown (CommonMark): a backslash before every character that could
/// start emphasis, code, a link or a table cell, entities for `&`, `<` and `>` (so nothing
/// can be read as raw HTML); line breaks and control characters become spaces. Quotes and apostrophes stay as they are (regression: they used to be HTML
/// entities).
pub(crate) fn md_cell(text: &str) -> String {
    let mut s = String::with_capacity(text.len());
    for ch in text.chars() {
        match ch {
            '\\' | '`' | '*' | '_' | '{' | '}' | '[' | ']' | '#' | '|' | '~' | '!' => {
                s.push('\\');
                s.push(ch);
            }
            // Entities, not backslashes, for markup: no renderer can take them for HTML.
            '&' => s.push_str("&amp;"),
            '<' => s.push_str("&lt;"),
            '>' => s.push_str("&gt;"),
            c if c.is_control() => s.push(' '),
            c => s.push(c),
        }
    }
    s
}

pub(crate) fn md_table(headers: &[&str], rows: &[Vec<String>]) -> String {
    let mut s = String::from("|");
    for h in headers {
        let _ = write!(s, " {} |", md_cell(h));
    }
    s.push_str("\n|");
    for _ in headers {
        s.push_str(" --- |");
    }
    s.push('\n');
    for r in rows {
        s.push('|');
        for c in r {
            let _ = write!(s, " {} |", md_cell(c));
        }
        s.push('\n');
    }
    s
}

fn param_headers(n_correlated: usize) -> Vec<String> {
    let mut h = vec![
        "parameter".to_string(),
        "value".into(),
        "standard uncertainty".into(),
        "unit".into(),
    ];
    for i in 0..n_correlated {
        h.push(format!("corr. p{}", i + 1));
    }
    h
}

fn title(red: &Reduction) -> String {
    format!(
        "Transit of {} of {}: solar parallax and astronomical unit",
        capitalise(red.event.planet.name()),
        red.event.date()
    )
}

/// The plus-minus sign the page uses, for text written for the terminal.
pub(crate) fn plus_minus(text: &str) -> String {
    text.replace(" +- ", " ± ")
}

pub(crate) fn plus_minus_rows(rows: Vec<Vec<String>>) -> Vec<Vec<String>> {
    rows.into_iter()
        .map(|r| r.iter().map(|c| plus_minus(c)).collect())
        .collect()
}

/// The report's style sheet, the exact text of its `<style>` element (the service's
/// content-security policy allows it by its SHA-256 hash; W3C CSP Level 3, section 8.3).
pub const REPORT_STYLE: &str = concat!(
    "\n*{box-sizing:border-box}\n",
    "body{font-family:sans-serif;max-width:1000px;margin:2em auto;padding:0 1em;color:#111827;line-height:1.45;-webkit-text-size-adjust:100%}\n",
    "table{border-collapse:collapse;margin:1em 0;font-size:0.85em}\n",
    "th,td{border:1px solid #d1d5db;padding:3px 6px;text-align:left;vertical-align:top}\n",
    "th{background:#f3f4f6}\n",
    "p,li,figcaption,.headline td{overflow-wrap:anywhere}\n",
    ".caution{border:2px solid #b91c1c;background:#fef2f2;padding:0.6em 1em;font-weight:bold}\n",
    ".headline th{background:none;font-weight:bold}\n",
    ".scroll{overflow-x:auto;max-width:100%}\n",
    ".scroll>table{margin:0.5em 0}\n",
    ".skip{position:absolute;left:0.5em;top:-10em;background:#111827;color:#fff;padding:0.5em 1em}\n",
    ".skip:focus{top:0.5em}\n",
    ":focus-visible{outline:3px solid #b45309;outline-offset:2px}\n",
    "svg{max-width:100%;height:auto}\n",
    "figure.chart{overflow-x:auto}figure.chart>svg{max-width:none}\n",
    "figure{margin:1.5em 0}\n",
    "figcaption{font-size:0.9em;color:#374151}\n",
    "footer{border-top:1px solid #d1d5db;margin-top:2em;color:#374151}\n",
    "@media print{figure,table{page-break-inside:avoid}.skip{display:none}.scroll{overflow:visible}}\n",
);

/// The self-contained HTML report (well-formed XHTML syntax, inline SVG, no script).
pub fn html_report(red: &Reduction) -> String {
    let sum = summary(red);
    let mut s = String::new();
    s.push_str("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n");
    let _ = writeln!(s, "<title>{}</title>", esc(&title(red)));
    let _ = write!(s, "<style>{REPORT_STYLE}</style>\n</head>\n<body>\n<a class=\"skip\" href=\"#main\">Skip to the result</a>\n<header>\n");
    let _ = writeln!(s, "<h1>{}</h1>", esc(&title(red)));
    let _ = writeln!(
        s,
        "<p class=\"caution\" role=\"note\">{}</p>\n</header>\n<main id=\"main\">",
        esc(SAFETY_CAUTION)
    );
    s.push_str("<h2>Result</h2>\n<table class=\"headline\">\n");
    for (k, v) in &sum.headline {
        let _ = writeln!(
            s,
            "<tr><th scope=\"row\">{}</th><td>{}</td></tr>",
            esc(k),
            esc(v)
        );
    }
    s.push_str("</table>\n");
    let _ = writeln!(s, "<p>{}</p>", esc(&chi2_sentence(red)));
    if !red.warnings.is_empty() {
        s.push_str("<ul>\n");
        for w in &red.warnings {
            let _ = writeln!(s, "<li>Warning: {}</li>", esc(w));
        }
        s.push_str("</ul>\n");
    }
    let _ = writeln!(
        s,
        "<h2>How the result was obtained</h2>\n<p>{}</p>",
        esc(METHOD)
    );
    if let Some(note) = sampling_note(red) {
        let _ = writeln!(s, "<p class=\"note\">{}</p>", esc(&note));
    }
    let _ = writeln!(
        s,
        "<h2>The planet's path across the Sun</h2>\n{}<h2>Where the stations were</h2>\n{}<h2>Residuals</h2>\n{}<h2>How the answer firmed up</h2>\n{}",
        disc_figure(red, Page::Report),
        map_figure(red),
        residual_figure(red, Page::Report),
        convergence_figure(red)
    );
    s.push_str("<h2>Parameters</h2>\n");
    let ph = param_headers(red.correlation.len());
    let ph_ref: Vec<&str> = ph.iter().map(String::as_str).collect();
    s.push_str(&html_table("Parameters", &ph_ref, &parameters_rows(red)));
    for note in correlation_notes(red)
        .into_iter()
        .chain(black_drop_sentences(red))
    {
        let _ = writeln!(s, "<p>{}</p>", esc(&plus_minus(&capitalise(&note))));
    }
    html_methods(red, &mut s);
    html_what_else(red, &mut s);
    let (station_note, rows_note) = table_notes(red);
    s.push_str("<h2>Stations, ranked by their share of the information on the parallax</h2>\n");
    if let Some(n) = &station_note {
        let _ = writeln!(s, "<p>{}</p>", esc(n));
    }
    s.push_str(&html_table(
        "Stations",
        &STATION_HEADERS,
        &station_rows(red),
    ));
    s.push_str(&crate::render::residual_groups::groups_html(red));
    s.push_str("<h2>Rows not used</h2>\n");
    if red.rejected.is_empty() {
        s.push_str("<p>Every row was used.</p>\n");
    } else {
        if let Some(n) = &rows_note {
            let _ = writeln!(s, "<p>{}</p>", esc(n));
        }
        s.push_str(&html_table(
            "Rows not used",
            &REJECTED_HEADERS,
            &rejected_rows(red),
        ));
    }
    let _ = writeln!(
        s,
        "</main>\n<footer>\n<p><small>Made by transit-parallax {}. Event: greatest transit {} (Delta T {:.1} s). Times are UTC (UT1 before 1972).</small></p>\n</footer>",
        env!("CARGO_PKG_VERSION"),
        esc(&red.event.greatest_utc()),
        red.event.elements.delta_t_s
    );
    s.push_str("</body>\n</html>\n");
    s
}

/// The Markdown report and its charts: (Markdown text, [(file name, SVG)]); `stem` names the
/// chart files (`STEM-disc.svg`, ...), which the text links to.
pub fn markdown_report(red: &Reduction, stem: &str) -> (String, Vec<(String, String)>) {
    let sum = summary(red);
    let mut charts = vec![
        (format!("{stem}-disc.svg"), solar_disc_chart(red).svg),
        (format!("{stem}-map.svg"), station_map_svg(red)),
        (format!("{stem}-residuals.svg"), residuals_chart(red).svg),
        (format!("{stem}-convergence.svg"), convergence_svg(red)),
    ];
    let light = report_light_curve(red).map(|svg| (format!("{stem}-light-curve.svg"), svg));
    let mut s = format!(
        "# {}\n\n> {}\n\n## Result\n\n",
        md_cell(&title(red)),
        md_cell(SAFETY_CAUTION)
    );
    s.push_str(&md_table(
        &["quantity", "value"],
        &sum.headline
            .iter()
            .map(|(a, b)| vec![a.clone(), b.clone()])
            .collect::<Vec<_>>(),
    ));
    let _ = write!(s, "\n{}\n\n", md_cell(&chi2_sentence(red)));
    for w in &red.warnings {
        let _ = writeln!(s, "- Warning: {}", md_cell(w));
    }
    let _ = write!(
        s,
        "\n## How the result was obtained\n\n{}\n\n",
        md_cell(METHOD)
    );
    let disc = solar_disc_chart(red);
    let residuals = residuals_chart(red);
    let captions = [
        (
            "The planet's path across the Sun",
            format!(
                "{} Key: {}.",
                disc_caption(red, &disc, Page::Report),
                disc_key(&disc)
            ),
        ),
        ("Where the stations were", map_caption(red)),
        (
            "Residuals O - C by contact",
            residual_caption(&residuals, Page::Report),
        ),
        ("How the solar parallax firmed up", convergence_caption(red)),
    ];
    for ((file, _), (alt, cap)) in charts.iter().zip(&captions) {
        let _ = write!(s, "![{alt}]({file})\n\n{}\n\n", md_cell(cap));
    }
    if let Some(note) = sampling_note(red) {
        let _ = write!(s, "{}\n\n", md_cell(&note));
    }
    s.push_str("## Parameters\n\n");
    let ph = param_headers(red.correlation.len());
    let ph_ref: Vec<&str> = ph.iter().map(String::as_str).collect();
    s.push_str(&md_table(&ph_ref, &parameters_rows(red)));
    for note in correlation_notes(red)
        .into_iter()
        .chain(black_drop_sentences(red))
    {
        let _ = write!(s, "\n{}\n", md_cell(&capitalise(&note)));
    }
    md_methods(red, &mut s);
    md_what_else(red, &mut s, light.as_ref().map(|(f, _)| f.as_str()));
    let (station_note, rows_note) = table_notes(red);
    s.push_str("\n## Stations, ranked by their share of the information on the parallax\n\n");
    if let Some(n) = &station_note {
        let _ = write!(s, "{}\n\n", md_cell(n));
    }
    s.push_str(&md_table(&STATION_HEADERS, &station_rows(red)));
    s.push_str(&crate::render::residual_groups::groups_markdown(red));
    s.push_str("\n## Rows not used\n\n");
    if red.rejected.is_empty() {
        s.push_str("Every row was used.\n");
    } else {
        if let Some(n) = &rows_note {
            let _ = write!(s, "{}\n\n", md_cell(n));
        }
        s.push_str(&md_table(&REJECTED_HEADERS, &rejected_rows(red)));
    }
    charts.extend(light);
    (s, charts)
}

/// Write the report: HTML when `path` ends in `.html` (or `.htm`), Markdown with SVG files
/// beside it when it ends in `.md`.
///
/// Errors: another extension, or a file that cannot be written.
pub fn write_report(red: &Reduction, path: &Path) -> Result<Vec<PathBuf>> {
    let ext = path
        .extension()
        .and_then(|e| e.to_str())
        .map(|e| e.to_ascii_lowercase());
    let io = |p: &Path, e: std::io::Error| Error::Io {
        path: p.to_path_buf(),
        source: e,
    };
    match ext.as_deref() {
        Some("html") | Some("htm") => {
            std::fs::write(path, html_report(red)).map_err(|e| io(path, e))?;
            Ok(vec![path.to_path_buf()])
        }
        Some("md") => {
            let stem = path.file_stem().and_then(|s| s.to_str()).unwrap_or("report");
            let (text, charts) = markdown_report(red, stem);
            std::fs::write(path, text).map_err(|e| io(path, e))?;
            let mut written = vec![path.to_path_buf()];
            for (name, svg) in charts {
                let p = path.with_file_name(&name);
                std::fs::write(&p, svg).map_err(|e| io(&p, e))?;
                written.push(p);
            }
            Ok(written)
        }
        _ => Err(Error::argument(format!(
            "--report {}: give a file name ending in .html (one self-contained page) or .md (Markdown with SVG charts beside it)",
            path.display()
        ))),
    }
}
