//! The service's pages for people: the participant's form and feedback, the review of one's
//! own submission, and the organiser's page. Plain HTML forms that work without JavaScript
//! (the file upload too), nothing fetched from elsewhere, every string from a participant
//! escaped.

use crate::render::svg::esc;
use crate::render::text::SAFETY_CAUTION;

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
