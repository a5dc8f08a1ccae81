//! The service's pages for people: the participant's form and feedback, the review of one's
//! own submission, and the organiser's page. Plain HTML forms that work without JavaScript
//! (the file upload too), nothing fetched from elsewhere, every string from a participant
//! escaped.

use super::language_choice::language_switch;
use crate::language::{text, Args, Language};
use crate::render::svg::esc;

/// The pages' style sheet (`style.rs`), the exact text of their `<style>` element (allowed by
/// its SHA-256 hash in the content-security policy).
pub use super::style::STYLE;

/// The participant's forms (`form.rs`).
pub use super::form::{timing_form, upload_form};

/// The page's frame in English, with no language switch (the organiser's pages): see
/// [`page_in`].
pub fn page(title: &str, body: &str) -> String {
    page_in(Language::English, None, title, body)
}

/// The page's frame in `language`: a skip link, the header (the site's line, the language
/// switch when `here` (the page's own address) is given, the title, the solar caution, first
/// on every page), the page's own content in `<main id="main">`, a footer.
pub fn page_in(language: Language, here: Option<&str>, title: &str, body: &str) -> String {
    let t = |id: &str| esc(&text(language, id, &Args::new()));
    let switch = here.map_or(String::new(), |h| language_switch(language, h));
    let footer = text(
        language,
        "footer-line",
        &Args::new().text("version", env!("CARGO_PKG_VERSION")),
    );
    format!(
        "<!DOCTYPE html>\n<html lang=\"{lang}\">\n<head>\n<meta charset=\"utf-8\"/>\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n<title>{title}</title>\n<style>{STYLE}</style>\n</head>\n<body>\n<a class=\"skip\" href=\"#main\">{skip}</a>\n<header class=\"masthead\"><div class=\"frame\">\n<p class=\"site\"><a href=\"/\">transit-parallax</a> · {site}</p>\n{switch}<h1>{title}</h1>\n<p class=\"caution\" role=\"note\">{caution}</p>\n</div></header>\n<main id=\"main\" class=\"frame\" tabindex=\"-1\">\n{body}</main>\n<footer class=\"frame\"><p>{footer}</p></footer>\n</body>\n</html>\n",
        lang = language.code(),
        title = esc(title),
        skip = t("skip-link"),
        site = t("site-line"),
        caution = t("solar-caution"),
        footer = esc(&footer),
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

/// A page with one message (errors, refusals), in English.
pub fn message_page(title: &str, message: &str) -> String {
    message_page_in(Language::English, title, message)
}

/// A page with one message in `language` (the title and message already in it).
pub fn message_page_in(language: Language, title: &str, message: &str) -> String {
    page_in(
        language,
        None,
        title,
        &format!(
            "<p>{}</p>\n<p><a href=\"/\">{}</a></p>\n",
            esc(message),
            esc(&text(language, "back-to-form", &Args::new()))
        ),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The English caution of the pages is the library's own (one text, two places).
    #[test]
    fn the_caution_is_the_libraries() {
        let english = text(Language::English, "solar-caution", &Args::new());
        assert_eq!(english, crate::render::text::SAFETY_CAUTION);
        for language in Language::ALL {
            let html = page_in(language, Some("/"), "T", "");
            assert!(html.contains(&format!("<html lang=\"{}\">", language.code())));
            assert!(html.contains(&esc(&text(language, "solar-caution", &Args::new()))));
            assert!(html.contains("<nav class=\"languages\""));
        }
    }
}
