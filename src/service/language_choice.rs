//! Which language a visitor reads the participants' pages in: the language switch's choice
//! (`?lang=es`, then kept in a cookie), else the cookie, else the browser's `Accept-Language`
//! (RFC 9110 section 12.5.4), else English. The switch itself is a list of plain links, each
//! language named in itself, so that it works without script and is found by someone who
//! cannot read the page's current language.

use crate::language::{text, Args, Language};
use crate::render::svg::esc;
use axum::extract::Request;
use axum::http::{header, HeaderMap, HeaderValue};
use axum::middleware::Next;
use axum::response::Response;

/// The cookie that keeps a visitor's choice.
pub const LANGUAGE_COOKIE: &str = "tp_lang";

/// A year, seconds: how long the choice is kept.
const KEEP_S: u64 = 365 * 86_400;

/// The language chosen on the link (`lang` in the query), if it names one of ours.
pub fn from_query(query: Option<&str>) -> Option<Language> {
    serde_urlencoded::from_str::<Vec<(String, String)>>(query?)
        .ok()?
        .into_iter()
        .find(|(k, _)| k == "lang")
        .and_then(|(_, v)| Language::from_code(&v))
}

/// The visitor's language from the request's query and headers, and whether it was chosen
/// on this request (the response then keeps it in the cookie).
pub fn language_of(query: Option<&str>, headers: &HeaderMap) -> (Language, bool) {
    if let Some(l) = from_query(query) {
        return (l, true);
    }
    if let Some(l) = super::forgery::cookie(headers, LANGUAGE_COOKIE).and_then(Language::from_code)
    {
        return (l, false);
    }
    let accept = headers
        .get(header::ACCEPT_LANGUAGE)
        .and_then(|v| v.to_str().ok())
        .unwrap_or("");
    (Language::negotiate(accept), false)
}

/// The language the visitor chose on the switch, on this link (`?lang=`) or earlier (the
/// cookie); `None` when they never chose (the browser's languages are no choice here: a
/// registered station's pages then keep the language it registered in).
pub fn chosen_language(query: Option<&str>, headers: &HeaderMap) -> Option<Language> {
    from_query(query)
        .or_else(|| super::forgery::cookie(headers, LANGUAGE_COOKIE).and_then(Language::from_code))
}

/// Middleware: give the request its [`Language`]; keep a choice made on the switch in the
/// cookie; say the language of the answer (`Content-Language`, unless the route said it, as
/// a registered station's sheet does) and that it depends on the browser's languages and the
/// cookie (`Vary`), so that no cache serves one visitor's language to another.
pub async fn choose_language(mut req: Request, next: Next) -> Response {
    let (language, chosen) = language_of(req.uri().query(), req.headers());
    req.extensions_mut().insert(language);
    let mut res = next.run(req).await;
    let h = res.headers_mut();
    if chosen {
        let cookie = format!(
            "{LANGUAGE_COOKIE}={}; HttpOnly; SameSite=Lax; Path=/; Max-Age={KEEP_S}",
            language.code()
        );
        if let Ok(v) = HeaderValue::from_str(&cookie) {
            h.append(header::SET_COOKIE, v);
        }
    }
    if let (false, Ok(v)) = (
        h.contains_key(header::CONTENT_LANGUAGE),
        HeaderValue::from_str(language.code()),
    ) {
        h.insert(header::CONTENT_LANGUAGE, v);
    }
    h.append(
        header::VARY,
        HeaderValue::from_static("Accept-Language, Cookie"),
    );
    res
}

/// `here` (a path with its query) with `lang` set to `language` (any `lang` already there
/// replaced; the other parameters, such as a private link's key, kept).
pub fn with_language(here: &str, language: Language) -> String {
    let (path, query) = here.split_once('?').unwrap_or((here, ""));
    let mut pairs: Vec<(String, String)> =
        serde_urlencoded::from_str::<Vec<(String, String)>>(query)
            .unwrap_or_default()
            .into_iter()
            .filter(|(k, _)| k != "lang")
            .collect();
    pairs.push(("lang".into(), language.code().into()));
    let query = serde_urlencoded::to_string(&pairs).unwrap_or_default();
    format!("{path}?{query}")
}

/// The language switch: every language named in itself, a link to the same page (`here`)
/// in that language, the current one marked for screen readers.
pub fn language_switch(current: Language, here: &str) -> String {
    let mut s = format!(
        "<nav class=\"languages\" aria-label=\"{}\"><ul>",
        esc(&text(current, "language-switch", &Args::new()))
    );
    for l in Language::ALL {
        let mark = if l == current {
            " aria-current=\"true\""
        } else {
            ""
        };
        s.push_str(&format!(
            "<li><a href=\"{}\" lang=\"{c}\" hreflang=\"{c}\"{mark}>{}</a></li>",
            esc(&with_language(here, l)),
            esc(l.own_name()),
            c = l.code(),
        ));
    }
    s.push_str("</ul></nav>\n");
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    fn headers(pairs: &[(&'static str, &'static str)]) -> HeaderMap {
        let mut h = HeaderMap::new();
        for (k, v) in pairs {
            h.append(*k, HeaderValue::from_static(v));
        }
        h
    }

    #[test]
    fn the_switch_then_the_cookie_then_the_browser() {
        let browser = headers(&[("accept-language", "de-CH, en;q=0.5")]);
        assert_eq!(language_of(None, &browser), (Language::German, false));
        let kept = headers(&[
            ("accept-language", "de"),
            ("cookie", "tp_visitor=abc; tp_lang=pt"),
        ]);
        assert_eq!(language_of(None, &kept), (Language::Portuguese, false));
        assert_eq!(
            language_of(Some("key=k1&lang=es"), &kept),
            (Language::Spanish, true)
        );
        assert_eq!(
            language_of(Some("lang=xx"), &browser),
            (Language::German, false),
            "an unknown code is no choice"
        );
        assert_eq!(language_of(None, &HeaderMap::new()).0, Language::English);
        // A choice is the switch or the cookie, never the browser's languages.
        assert_eq!(chosen_language(None, &browser), None);
        assert_eq!(chosen_language(None, &kept), Some(Language::Portuguese));
        assert_eq!(
            chosen_language(Some("lang=fr"), &kept),
            Some(Language::French)
        );
    }

    #[test]
    fn the_switch_keeps_the_rest_of_the_address() {
        assert_eq!(
            with_language("/submission/7?key=Ab1&lang=fr", Language::German),
            "/submission/7?key=Ab1&lang=de"
        );
        assert_eq!(with_language("/", Language::Spanish), "/?lang=es");
        let nav = language_switch(Language::French, "/");
        assert!(nav.contains("aria-label=\"Langue\""), "{nav}");
        assert!(nav.contains("hreflang=\"pt\">Português</a>"));
        assert!(nav.contains("lang=\"fr\" hreflang=\"fr\" aria-current=\"true\">Français"));
        assert_eq!(nav.matches("<li>").count(), Language::ALL.len());
    }
}
