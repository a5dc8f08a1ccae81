//! The organiser's page: the live solution (parallax, AU, uncertainty, chi-square, the
//! classic methods side by side), the report's charts, every timing in force with its state
//! (used, rejected and why, excluded by the organiser and why) and the buttons that exclude or
//! restore it, the unreadable submissions, the audit trail and the downloads.

use super::pages::{page, scroll_box};
use crate::reduction::Reduction;
use crate::render::figures::{convergence_figure, disc_figure, map_figure, residual_figure, Page};
use crate::render::svg::esc;
use crate::render::text::au_text;
use std::fmt::Write;

/// What the page shows, gathered by the server.
pub struct OrganiserView<'a> {
    /// The latest solution.
    pub solution: Option<&'a Reduction>,
    /// Why there is no solution.
    pub error: Option<&'a str>,
    /// Whether timings arrived since the solution was computed.
    pub pending: bool,
    /// Timings in force, and those of them excluded by the organiser.
    pub timing_counts: (i64, i64),
    /// The table of the timings, the page asked for (`timing_table.rs`).
    pub table_html: &'a str,
    /// The solution's methods and charts, made once per version (`charts_html`).
    pub charts_html: &'a str,
    /// The "as of" sentence and the stations planned against reported (`network_plan.rs`).
    pub network_html: &'a str,
    /// (submissions in force, stored, unreadable).
    pub counts: (i64, i64, i64),
    /// Unreadable submissions: (id, arrival, reason).
    pub unreadable: &'a [(i64, String, String)],
    /// The audit trail: (time, action, timing, reason).
    pub audit: &'a [super::store::AuditEntry],
    /// The organiser's anti-forgery token for the page's forms (never the organiser's token).
    pub csrf: &'a str,
}

fn summary(v: &OrganiserView, s: &mut String) {
    let (in_force, stored, unreadable) = v.counts;
    let (rows, excluded) = v.timing_counts;
    let _ = writeln!(s, "<p id=\"counts\">Submissions in force: <b id=\"n-submissions\">{in_force}</b> (stored {stored}, unreadable {unreadable}); timings: <b id=\"n-timings\">{rows}</b>, excluded by you: {excluded}.{}</p>", if v.pending { " New timings are being reduced; reload in a moment." } else { "" });
    match (v.solution, v.error) {
        (Some(red), _) => match red.headline() {
            Some(h) => {
                let _ = writeln!(s, "<table class=\"headline\"><tr><th scope=\"row\">solar parallax</th><td id=\"parallax\">{:.4}\" ± {:.4}\"</td></tr><tr><th scope=\"row\">astronomical unit</th><td id=\"au\">{}</td></tr><tr><th scope=\"row\">timings used</th><td id=\"n-used\">{} of {}</td></tr><tr><th scope=\"row\">chi-square</th><td>{}</td></tr></table>", h.parallax_arcsec, h.parallax_sigma_arcsec, esc(&au_text(&h, "±")), red.timings_used, red.timings_total, esc(&red.statistics.describe()));
            }
            None => {
                let why = red.warnings.last().map_or("", String::as_str);
                let _ = writeln!(
                    s,
                    "<p id=\"parallax\">The solar parallax is not determined yet: {}</p>",
                    esc(why)
                );
            }
        },
        (None, Some(e)) => {
            let _ = writeln!(s, "<p id=\"parallax\">No solution yet: {}</p>", esc(e));
        }
        (None, None) => s.push_str("<p id=\"parallax\">No solution yet.</p>\n"),
    }
}

fn methods(red: &Reduction, s: &mut String) {
    if red.methods.is_empty() {
        return;
    }
    let mut t = String::from("<table><tr><th scope=\"col\">method</th><th scope=\"col\">solar parallax (arcsec)</th><th scope=\"col\">AU (millions of km)</th><th scope=\"col\">timings (stations)</th><th scope=\"col\">note</th></tr>\n");
    for row in crate::render::methods::methods_rows(red) {
        let cells: Vec<String> = row
            .iter()
            .map(|c| format!("<td>{}</td>", esc(&c.replace(" +- ", " ± "))))
            .collect();
        let _ = writeln!(t, "<tr>{}</tr>", cells.concat());
    }
    t.push_str("</table>\n");
    s.push_str("<h2>The methods side by side</h2>\n");
    s.push_str(&scroll_box("The methods side by side", &t));
}

/// The form that excludes or restores one timing, each with a reason.
pub(super) fn action_form(csrf: &str, id: i64, excluded: bool) -> String {
    if excluded {
        format!("<form method=\"post\" action=\"/organiser/restore\" class=\"inline\"><input type=\"hidden\" name=\"csrf\" value=\"{}\"/><input type=\"hidden\" name=\"timing\" value=\"{id}\"/><label class=\"vh\" for=\"restore-reason-{id}\">reason for restoring timing {id}</label><input id=\"restore-reason-{id}\" name=\"reason\" placeholder=\"reason\" size=\"14\" required/><button type=\"submit\">restore</button></form>", esc(csrf))
    } else {
        format!("<form method=\"post\" action=\"/organiser/exclude\" class=\"inline\"><input type=\"hidden\" name=\"csrf\" value=\"{}\"/><input type=\"hidden\" name=\"timing\" value=\"{id}\"/><label class=\"vh\" for=\"reason-{id}\">reason for excluding timing {id}</label><input id=\"reason-{id}\" name=\"reason\" placeholder=\"reason\" size=\"14\"/><button type=\"submit\">exclude</button></form>", esc(csrf))
    }
}

/// The solution's methods side by side and its charts (made once per version of the data).
pub fn charts_html(red: &Reduction) -> String {
    let mut s = String::new();
    methods(red, &mut s);
    if red.parallax_arcsec.is_some() {
        let page = Page::Organiser;
        let _ = writeln!(
            s,
            "<h2>Charts</h2>\n{}{}{}{}",
            disc_figure(red, page),
            map_figure(red),
            residual_figure(red, page),
            convergence_figure(red)
        );
    }
    s
}

fn trails(v: &OrganiserView, s: &mut String) {
    s.push_str("<h2>Submissions that could not be read</h2>\n");
    if v.unreadable.is_empty() {
        s.push_str("<p>None.</p>\n");
    } else {
        let mut t = String::from("<table><tr><th scope=\"col\">submission</th><th scope=\"col\">arrived</th><th scope=\"col\">why</th></tr>\n");
        for (id, at, why) in v.unreadable {
            let _ = writeln!(
                t,
                "<tr><td>{id}</td><td>{}</td><td>{}</td></tr>",
                esc(at),
                esc(why)
            );
        }
        t.push_str("</table>\n");
        s.push_str(&scroll_box("Submissions that could not be read", &t));
    }
    s.push_str("<h2>Audit trail</h2>\n");
    let mut t = String::from("<table><tr><th scope=\"col\">when (UTC)</th><th scope=\"col\">action</th><th scope=\"col\">timing</th><th scope=\"col\">reason</th></tr>\n");
    for (at, action, id, reason) in v.audit {
        let _ = writeln!(
            t,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            esc(at),
            esc(action),
            id.map_or(String::new(), |i| i.to_string()),
            esc(reason.as_deref().unwrap_or(""))
        );
    }
    t.push_str("</table>\n");
    s.push_str(&scroll_box("Audit trail", &t));
}

/// The organiser's page.
pub fn organiser_page(v: &OrganiserView) -> String {
    let mut s = String::new();
    let _ = writeln!(s, "<p>Downloads: <a id=\"export\" href=\"/api/export.csv\">every timing in force (observations CSV)</a> · <a href=\"/organiser/report.html\">the report (HTML)</a> · <a href=\"/organiser\">reload</a></p>");
    s.push_str(&super::sign_in::sign_out_form(v.csrf));
    summary(v, &mut s);
    s.push_str(v.network_html);
    s.push_str(v.charts_html);
    s.push_str(v.table_html);
    trails(v, &mut s);
    page("Organiser: the campaign's solution", &s)
}
