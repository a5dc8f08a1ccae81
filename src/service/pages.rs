//! The service's pages for people: the participant's form and feedback, the review of one's
//! own submission, and the organiser's page. Plain HTML forms that work without JavaScript
//! (the file upload too), nothing fetched from elsewhere, every string from a participant
//! escaped.

use super::feedback::TimingFeedback;
use super::store::TimingFields;
use crate::render::svg::esc;
use crate::render::text::SAFETY_CAUTION;
use std::fmt::Write;

/// The pages' style sheet (`style.rs`), the exact text of their `<style>` element (allowed by
/// its SHA-256 hash in the content-security policy).
pub use super::style::STYLE;

/// The participant's forms (`form.rs`).
pub use super::form::{timing_form, upload_form};

/// The page's frame: a skip link, the header (the site's line, the title, the solar caution,
/// first on every page), the page's own content in `<main id="main">`, a footer.
pub fn page(title: &str, body: &str) -> String {
    format!(
        "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n<title>{t}</title>\n<style>{STYLE}</style>\n</head>\n<body>\n<a class=\"skip\" href=\"#main\">Skip to the content</a>\n<header class=\"masthead\"><div class=\"frame\">\n<p class=\"site\"><a href=\"/\">transit-parallax</a> · pooled timings</p>\n<h1>{t}</h1>\n<p class=\"caution\" role=\"note\">{c}</p>\n</div></header>\n<main id=\"main\" class=\"frame\" tabindex=\"-1\">\n{body}</main>\n<footer class=\"frame\"><p>transit-parallax {v}: contact timings pooled for the solar parallax. These pages load nothing from elsewhere and run no script.</p></footer>\n</body>\n</html>\n",
        t = esc(title),
        c = esc(SAFETY_CAUTION),
        v = env!("CARGO_PKG_VERSION"),
    )
}

/// A wide table in a box that scrolls sideways on its own (so that the page never does),
/// reachable from the keyboard and named for screen readers.
pub fn scroll_box(label: &str, table: &str) -> String {
    format!(
        "<div class=\"scroll\" tabindex=\"0\" role=\"region\" aria-label=\"{}\">\n{table}</div>\n",
        esc(label)
    )
}

/// The feedback table for a submission's timings.
pub fn feedback_table(fields: &[TimingFields], fb: &[TimingFeedback]) -> String {
    let mut s = String::from("<table id=\"feedback\"><tr><th scope=\"col\">station</th><th scope=\"col\">contact</th><th scope=\"col\">your time</th><th scope=\"col\">predicted</th><th scope=\"col\">O - C (s)</th><th scope=\"col\">Sun's altitude</th><th scope=\"col\">verdict</th><th scope=\"col\">what it means</th></tr>\n");
    for (f, b) in fields.iter().zip(fb) {
        let time = if f.time_utc.is_empty() {
            &f.time_local
        } else {
            &f.time_utc
        };
        let _ = writeln!(
            s,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td class=\"{v}\">{v}</td><td>{}</td></tr>",
            esc(&f.station),
            esc(&f.contact),
            esc(time),
            esc(b.predicted_utc.as_deref().unwrap_or("-")),
            b.o_c_s.map_or("-".into(), |x| format!("{x:+.1}")),
            b.sun_altitude_deg.map_or("-".into(), |x| format!("{x:.1} deg")),
            esc(b.diagnosis.as_deref().unwrap_or("")),
            v = b.verdict,
        );
    }
    s.push_str("</table>\n");
    s
}

/// The reply page after a submission.
pub fn feedback_page(
    id: i64,
    link: &str,
    (fields, fb): (&[TimingFields], &[TimingFeedback]),
    share: Option<f64>,
    duplicate: bool,
) -> String {
    let mut body = String::new();
    if duplicate {
        body.push_str(
            "<p>This is the same as a submission already received; it was not counted twice.</p>\n",
        );
    }
    let _ = writeln!(
        body,
        "<p id=\"received\">Received and stored as submission {id}.</p>"
    );
    body.push_str(&scroll_box(
        "Your timings against their predictions",
        &feedback_table(fields, fb),
    ));
    if let Some(x) = share {
        let _ = writeln!(body, "<p>This station's expected share of the information on the solar parallax so far: {:.1} % (before the planet's place and the radii are fitted).</p>", 100.0 * x);
    }
    let _ = writeln!(body, "<p>To review or correct your submission later, keep this private link: <a id=\"private\" href=\"{l}\">{l}</a>. A correction is stored as a new version; the old one is kept.</p>\n<p><a href=\"/\">Send another</a></p>", l = esc(link));
    page("Thank you: your timings", &body)
}

/// A page with one message (errors, refusals).
pub fn message_page(title: &str, message: &str) -> String {
    page(
        title,
        &format!(
            "<p>{}</p>\n<p><a href=\"/\">Back to the form</a></p>\n",
            esc(message)
        ),
    )
}
