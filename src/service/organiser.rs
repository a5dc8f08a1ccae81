//! The organiser's page: the live solution (parallax, AU, uncertainty, chi-square, the
//! classic methods side by side), the report's charts, every timing in force with its state
//! (used, rejected and why, excluded by the organiser and why) and the buttons that exclude or
//! restore it, the unreadable submissions, the audit trail and the downloads.

use super::pages::page;
use super::store::StoredTiming;
use crate::reduction::Reduction;
use crate::render::charts::{convergence_svg, residuals_svg, solar_disc_svg, station_map_svg};
use crate::render::svg::esc;
use crate::render::text::au_text;
use std::fmt::Write;

/// What the page shows, gathered by the server.
pub struct OrganiserView<'a> {
    /// The latest solution and the timing id of each line of the file it reduced.
    pub solution: Option<(&'a Reduction, &'a [i64])>,
    /// Why there is no solution.
    pub error: Option<&'a str>,
    /// Whether timings arrived since the solution was computed.
    pub pending: bool,
    /// Every timing in force.
    pub timings: &'a [StoredTiming],
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
    let rows = v.timings.len();
    let excluded = v.timings.iter().filter(|t| t.excluded.is_some()).count();
    let _ = writeln!(s, "<p id=\"counts\">Submissions in force: <b id=\"n-submissions\">{in_force}</b> (stored {stored}, unreadable {unreadable}); timings: <b id=\"n-timings\">{rows}</b>, excluded by you: {excluded}.{}</p>", if v.pending { " New timings are being reduced; reload in a moment." } else { "" });
    match (v.solution, v.error) {
        (Some((red, _)), _) => match red.headline() {
            Some(h) => {
                let _ = writeln!(s, "<table class=\"headline\"><tr><td>solar parallax</td><td id=\"parallax\">{:.4}\" ± {:.4}\"</td></tr><tr><td>astronomical unit</td><td id=\"au\">{}</td></tr><tr><td>timings used</td><td id=\"n-used\">{} of {}</td></tr><tr><td>chi-square</td><td>{}</td></tr></table>", h.parallax_arcsec, h.parallax_sigma_arcsec, esc(&au_text(&h, "±")), red.timings_used, red.timings_total, esc(&red.statistics.describe()));
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
    s.push_str("<h2>The methods side by side</h2>\n<table><tr><th>method</th><th>solar parallax (arcsec)</th><th>AU (millions of km)</th><th>timings (stations)</th><th>note</th></tr>\n");
    for row in crate::render::methods::methods_rows(red) {
        let cells: Vec<String> = row
            .iter()
            .map(|c| format!("<td>{}</td>", esc(&c.replace(" +- ", " ± "))))
            .collect();
        let _ = writeln!(s, "<tr>{}</tr>", cells.concat());
    }
    s.push_str("</table>\n");
}

/// The state of one timing in the latest solution.
fn state_of(v: &OrganiserView, t: &StoredTiming) -> (String, String) {
    if let Some(r) = &t.excluded {
        return ("excluded".into(), format!("by the organiser: {r}"));
    }
    let Some((red, ids)) = v.solution else {
        return ("pending".into(), String::new());
    };
    let Some(k) = ids.iter().position(|&id| id == t.id) else {
        return (
            "pending".into(),
            "arrived after the solution was computed".into(),
        );
    };
    let line = k as u64 + 2;
    if let Some(u) = red.used.iter().find(|u| u.line == line) {
        return ("used".into(), format!("O - C {:+.1} s", u.o_c_s));
    }
    match red.rejected.iter().find(|r| r.line == line) {
        Some(r) => (
            format!("rejected ({})", r.reason.as_str()),
            r.diagnosis.clone().unwrap_or_default(),
        ),
        None => ("pending".into(), String::new()),
    }
}

fn rows(v: &OrganiserView, s: &mut String) {
    let csrf = v.csrf;
    s.push_str("<h2>Every timing</h2>\n<table id=\"rows\"><tr><th>id</th><th>station</th><th>contact</th><th>time</th><th>state</th><th>why</th><th>action</th></tr>\n");
    for t in v.timings.iter().take(2000) {
        let (state, why) = state_of(v, t);
        let time = if t.fields.time_utc.is_empty() {
            &t.fields.time_local
        } else {
            &t.fields.time_utc
        };
        let action = if t.excluded.is_some() {
            format!("<form method=\"post\" action=\"/organiser/restore\"><input type=\"hidden\" name=\"csrf\" value=\"{}\"/><input type=\"hidden\" name=\"timing\" value=\"{}\"/><button type=\"submit\">restore</button></form>", esc(csrf), t.id)
        } else {
            format!("<form method=\"post\" action=\"/organiser/exclude\"><input type=\"hidden\" name=\"csrf\" value=\"{}\"/><input type=\"hidden\" name=\"timing\" value=\"{}\"/><input name=\"reason\" placeholder=\"reason\" size=\"14\"/><button type=\"submit\">exclude</button></form>", esc(csrf), t.id)
        };
        let _ = writeln!(s, "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{action}</td></tr>", t.id, esc(&t.fields.station), esc(&t.fields.contact), esc(time), esc(&state), esc(&why));
    }
    s.push_str("</table>\n");
    if v.timings.len() > 2000 {
        let _ = writeln!(
            s,
            "<p>The first 2,000 of {} timings are shown; the export has them all.</p>",
            v.timings.len()
        );
    }
}

fn trails(v: &OrganiserView, s: &mut String) {
    s.push_str("<h2>Submissions that could not be read</h2>\n");
    if v.unreadable.is_empty() {
        s.push_str("<p>None.</p>\n");
    } else {
        s.push_str("<table><tr><th>submission</th><th>arrived</th><th>why</th></tr>\n");
        for (id, at, why) in v.unreadable {
            let _ = writeln!(
                s,
                "<tr><td>{id}</td><td>{}</td><td>{}</td></tr>",
                esc(at),
                esc(why)
            );
        }
        s.push_str("</table>\n");
    }
    s.push_str("<h2>Audit trail</h2>\n<table><tr><th>when (UTC)</th><th>action</th><th>timing</th><th>reason</th></tr>\n");
    for (at, action, id, reason) in v.audit {
        let _ = writeln!(
            s,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            esc(at),
            esc(action),
            id.map_or(String::new(), |i| i.to_string()),
            esc(reason.as_deref().unwrap_or(""))
        );
    }
    s.push_str("</table>\n");
}

/// The organiser's page.
pub fn organiser_page(v: &OrganiserView) -> String {
    let mut s = String::new();
    let _ = writeln!(s, "<p>Downloads: <a id=\"export\" href=\"/api/export.csv\">every timing in force (observations CSV)</a> · <a href=\"/organiser/report.html\">the report (HTML)</a> · <a href=\"/organiser\">reload</a></p>");
    s.push_str(&super::sign_in::sign_out_form(v.csrf));
    summary(v, &mut s);
    if let Some((red, _)) = v.solution {
        methods(red, &mut s);
        if red.parallax_arcsec.is_some() {
            let _ = writeln!(s, "<h2>Charts</h2>\n<figure>{}</figure>\n<figure>{}</figure>\n<figure>{}</figure>\n<figure>{}</figure>", solar_disc_svg(red), station_map_svg(red), residuals_svg(red), convergence_svg(red));
        }
    }
    rows(v, &mut s);
    trails(v, &mut s);
    page("Organiser: the campaign's solution", &s)
}
