//! The routes of registration: `POST /api/registrations` (JSON), the registration form for
//! people (`GET` and `POST /register`, with the visitor's anti-forgery token), the station's
//! private page (`/registrations/KEY`), its observers' sheet (`.../sheet.html`) and its
//! calendar (`.../calendar.ics`). The private key is the registration's id: random letters and
//! digits (some 143 bits), never shown to the organiser and never stored as such.
//!
//! Languages: a registration keeps the language it was made in (the form's, or the JSON's
//! `language`, else the request's). The sheet and calendar are in that language unless their
//! link asks for another (`?lang=`); the private page is in the language the visitor chose on
//! the switch (this link's `?lang=`, or the cookie), else the registration's, and its links to
//! the sheet and calendar ask for the page's language when it differs (docs/service.md,
//! "Languages").
//!
//! The JSON route shares the rules of `POST /api/submissions`: `415` for a body that is not
//! JSON and `403` for a foreign `Origin` (`forgery::check_posts`), `413` over the body limit.

use super::forgery::{refused_form, Visitor};
use super::form::text_field;
use super::language_choice::{chosen_language, from_query, with_language};
use super::pages::{message_page_in, page_in};
use super::registration::{
    calendar_file, calendar_ics, checked, fields_from_form, fields_from_json, looks_like_key,
    prediction, sheet_html, RegistrationFields, KEY_LEN,
};
use super::server::{random_token, App};
use super::store_registrations::Registration;
use crate::geometry::sun_horizon::sun_is_up;
use crate::language::numbers::decimal;
use crate::language::{text, Args, Language};
use crate::render::svg::esc;
use crate::time::iso::format_utc;
use axum::body::Bytes;
use axum::extract::{Path, RawQuery, State};
use axum::http::{header, HeaderMap, HeaderValue, StatusCode};
use axum::response::{Html, IntoResponse, Response};
use axum::{Extension, Json};
use serde_json::json;
use std::fmt::Write;
use std::sync::Arc;

type Shared = Arc<App>;

/// The addresses of a registration: (private page, sheet, calendar).
pub fn urls(key: &str) -> (String, String, String) {
    let base = format!("/registrations/{key}");
    (
        base.clone(),
        format!("{base}/sheet.html"),
        format!("{base}/calendar.ics"),
    )
}

/// Store a checked registration under a new private key; the key and the stored registration.
fn store(app: &App, r: &Registration) -> Result<(String, Registration), String> {
    let key = random_token(KEY_LEN);
    let stored = app.with_store(|s| s.register(r, &key))?;
    Ok((key, stored))
}

/// The fields with the request's language where they name none.
fn with_default_language(mut f: RegistrationFields, l: Language) -> RegistrationFields {
    if f.language.trim().is_empty() {
        f.language = l.code().to_string();
    }
    f
}

/// `POST /api/registrations`: `201` with `registration_id` (the private key), `language`,
/// `sheet_url`, `calendar_url` and `registration_url`; `400` with `{ "error" }` naming the
/// field. The sheet's language is the body's `language`, else the request's.
pub async fn api_register_route(
    State(app): State<Shared>,
    Extension(l): Extension<Language>,
    body: Bytes,
) -> Response {
    let fields = fields_from_json(&body).map(|f| with_default_language(f, l));
    let r = match fields.and_then(|f| checked(&f)) {
        Ok(r) => r,
        Err(why) => {
            return (StatusCode::BAD_REQUEST, Json(json!({ "error": why }))).into_response()
        }
    };
    match store(&app, &r) {
        Ok((key, stored)) => {
            let (private, sheet, calendar) = urls(&key);
            let reply = json!({
                "registration_id": key,
                "station": stored.station,
                "time_zone": stored.time_zone,
                "language": stored.language.code(),
                "sheet_url": sheet,
                "calendar_url": calendar,
                "registration_url": private,
            });
            (StatusCode::CREATED, Json(reply)).into_response()
        }
        Err(e) => (
            StatusCode::INTERNAL_SERVER_ERROR,
            Json(json!({ "error": e })),
        )
            .into_response(),
    }
}

/// The registration form, pre-filled with `f`, with an error sentence above it when `error`.
fn form_page(l: Language, csrf: &str, f: &RegistrationFields, error: Option<&str>) -> String {
    const DECIMAL: &str = " inputmode=\"decimal\"";
    let t = |id: &str| text(l, id, &Args::new());
    let t1 = |id: &str, v: &str| text(l, id, &Args::new().text("example", v.to_string()));
    let mut s = format!("<p>{}</p>\n", esc(&t("register-intro")));
    if let Some(why) = error {
        let _ = writeln!(
            s,
            "<p id=\"error\" class=\"card rejected\" role=\"alert\">{} {}</p>",
            esc(&t("register-refused")),
            esc(why)
        );
    }
    let _ = writeln!(
        s,
        "<form method=\"post\" action=\"/register\" id=\"register-form\">\n<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n<input type=\"hidden\" name=\"lang\" value=\"{}\"/>\n<fieldset><legend>{}</legend>\n{}\n<div class=\"row\">{}{}</div>\n<div class=\"row\">{}{}</div>\n</fieldset>\n<p class=\"actions\"><button type=\"submit\" id=\"register\">{}</button></p>\n</form>",
        esc(csrf),
        l.code(),
        esc(&t("station-heading")),
        text_field("station", &t("station-name"), &t("register-name-hint"), &f.station, " required maxlength=\"120\""),
        text_field("latitude", &t("latitude"), &t1("latitude-hint", "-33.87"), &f.latitude, " required"),
        text_field("longitude", &t("longitude"), &t1("longitude-hint", "-157.86"), &f.longitude, " required"),
        text_field("elevation_m", &t("elevation"), &t("register-elevation-hint"), &f.elevation_m, DECIMAL),
        text_field("time_zone", &t("register-zone"), &t("register-zone-hint"), &f.time_zone, " required"),
        esc(&t("register-button")),
    );
    let _ = writeln!(s, "<p class=\"note\">{}</p>", esc(&t("register-privacy")));
    page_in(l, Some("/register"), &t("register-title"), &s)
}

/// `GET /register`.
pub async fn register_page_route(
    Extension(visitor): Extension<Visitor>,
    Extension(l): Extension<Language>,
) -> Html<String> {
    Html(form_page(
        l,
        &visitor.token,
        &RegistrationFields::default(),
        None,
    ))
}

/// `POST /register`: `201` with the registered page, `400` with the form and the reason.
pub async fn register_form_route(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    Extension(l): Extension<Language>,
    body: Bytes,
) -> Response {
    let form: Vec<(String, String)> = serde_urlencoded::from_bytes(&body).unwrap_or_default();
    let csrf = form
        .iter()
        .find(|(k, _)| k == "csrf")
        .map(|(_, v)| v.as_str());
    if !visitor.accepts(csrf) {
        return refused_form();
    }
    let fields = with_default_language(fields_from_form(&form), l);
    let r = match checked(&fields) {
        Ok(r) => r,
        Err(why) => {
            return (
                StatusCode::BAD_REQUEST,
                Html(form_page(l, &visitor.token, &fields, Some(&why))),
            )
                .into_response()
        }
    };
    match store(&app, &r) {
        Ok((key, stored)) => {
            private_response(&app, &key, &stored, stored.language, StatusCode::CREATED)
        }
        Err(e) => (
            StatusCode::INTERNAL_SERVER_ERROR,
            Html(message_page_in(
                l,
                text(l, "register-refused", &Args::new()).trim_end_matches([':', ' ']),
                &e,
            )),
        )
            .into_response(),
    }
}

/// The contacts seen from the station, in its clock time and UTC, as a list in `l`.
fn contacts_list(app: &App, r: &Registration, l: Language) -> String {
    let Ok((p, zone)) = prediction(app.event(), r) else {
        return String::new();
    };
    let mut s = String::from("<ul id=\"contacts\">\n");
    for c in p.contacts.iter().flatten() {
        let label = app.event().label(c.hours);
        let reading = zone.reading(label);
        let sun = if sun_is_up(c.sun_altitude_deg) {
            let degrees = decimal(l, c.sun_altitude_deg, 0);
            text(
                l,
                "registered-sun-up",
                &Args::new().text("degrees", degrees),
            )
        } else {
            text(l, "registered-sun-down", &Args::new())
        };
        let clock = format!("{} {}", &reading.iso(0)[11..19], reading.abbreviation);
        let line = text(
            l,
            "registered-contact",
            &Args::new()
                .text("contact", c.contact.roman())
                .text("clock", clock)
                .text("utc", format_utc(label, 0)[11..19].to_string())
                .text("sun", sun),
        );
        let _ = writeln!(s, "<li>{}</li>", esc(&line));
    }
    if p.contacts.iter().all(Option::is_none) {
        let none = text(l, "registered-no-contact", &Args::new());
        let _ = writeln!(s, "<li>{}</li>", esc(&none));
    }
    s.push_str("</ul>\n");
    s
}

/// A link to the sheet or calendar in the page's language `l`: the plain link when `l` is the
/// registration's own, else with `?lang=`.
fn in_language(url: &str, r: &Registration, l: Language) -> String {
    if l == r.language {
        url.to_string()
    } else {
        with_language(url, l)
    }
}

/// The station's private page in `l`: its links, its place and zone, its contacts.
fn private_response(
    app: &App,
    key: &str,
    r: &Registration,
    l: Language,
    status: StatusCode,
) -> Response {
    let (private, sheet, calendar) = urls(key);
    let html = |id: &str, args: Args| text(l, id, &args);
    let mut s = format!(
        "<p>{}</p>\n<ul>\n<li>{}</li>\n<li>{}</li>\n</ul>\n",
        html(
            "registered-private-link-html",
            Args::new().text("href", esc(&private))
        ),
        html(
            "registered-sheet-html",
            Args::new().text("href", esc(&in_language(&sheet, r, l)))
        ),
        html(
            "registered-calendar-html",
            Args::new()
                .text("href", esc(&in_language(&calendar, r, l)))
                .text("file", esc(&calendar_file(r)))
        ),
    );
    let station = text(
        l,
        "registered-station",
        &Args::new()
            .text("station", r.station.as_str())
            .text("latitude", decimal(l, r.latitude_deg, 4))
            .text("longitude", decimal(l, r.longitude_deg, 4))
            .text("elevation", decimal(l, r.elevation_m, 0))
            .text("zone", r.time_zone.as_str()),
    );
    let _ = writeln!(
        s,
        "<h2>{}</h2>\n<p id=\"station\">{}</p>\n<h2>{}</h2>",
        esc(&text(l, "registered-station-heading", &Args::new())),
        esc(&station),
        esc(&text(l, "registered-contacts-heading", &Args::new())),
    );
    s.push_str(&contacts_list(app, r, l));
    let _ = writeln!(s, "<p>{}</p>", html("registered-after-html", Args::new()));
    let title = text(
        l,
        "registered-title",
        &Args::new().text("station", r.station.as_str()),
    );
    let mut res = (status, Html(page_in(l, Some(&private), &title, &s))).into_response();
    no_store(&mut res);
    res
}

/// A private answer is kept by no cache.
fn no_store(res: &mut Response) {
    res.headers_mut()
        .insert(header::CACHE_CONTROL, HeaderValue::from_static("no-store"));
}

/// The registration a key opens, or the status and sentence of the refusal (`404`), in `l`.
fn find(app: &App, key: &str, l: Language) -> Result<Registration, (StatusCode, String)> {
    let not_found = || {
        (
            StatusCode::NOT_FOUND,
            text(l, "not-found-registration", &Args::new()),
        )
    };
    if !looks_like_key(key) {
        return Err(not_found());
    }
    match app.with_store(|s| s.registration_by_key(key)) {
        Ok(Some(r)) => Ok(r),
        Ok(None) => Err(not_found()),
        Err(e) => Err((StatusCode::INTERNAL_SERVER_ERROR, e)),
    }
}

/// The page of a refusal of [`find`], in `l`.
fn refused(l: Language, (status, why): (StatusCode, String)) -> Response {
    let title = if status == StatusCode::NOT_FOUND {
        text(l, "not-found", &Args::new())
    } else {
        "Error".to_string()
    };
    (status, Html(message_page_in(l, &title, &why))).into_response()
}

/// Say the language of an answer made in another language than the visitor's.
fn content_language(res: &mut Response, l: Language) {
    res.headers_mut()
        .insert(header::CONTENT_LANGUAGE, HeaderValue::from_static(l.code()));
}

/// `GET /registrations/{key}`: in the language the visitor chose (`?lang=`, the cookie), else
/// the registration's.
pub async fn private_route(
    State(app): State<Shared>,
    Path(key): Path<String>,
    Extension(l): Extension<Language>,
    RawQuery(query): RawQuery,
    headers: HeaderMap,
) -> Response {
    match find(&app, &key, l) {
        Ok(r) => {
            let shown = chosen_language(query.as_deref(), &headers).unwrap_or(r.language);
            let mut res = private_response(&app, &key, &r, shown, StatusCode::OK);
            content_language(&mut res, shown);
            res
        }
        Err(why) => refused(l, why),
    }
}

/// The registration under `key` and the language of its sheet and calendar: the link's
/// (`?lang=`), else the one it registered in; or why not (as [`find`] says, in `l`).
fn registration_in_language(
    app: &App,
    key: &str,
    l: Language,
    query: Option<&str>,
) -> Result<(Registration, Language), (StatusCode, String)> {
    let r = find(app, key, l)?;
    let language = from_query(query).unwrap_or(r.language);
    Ok((r, language))
}

/// `GET /registrations/{key}/sheet.html`: the page `predict --sheets --language` writes for
/// the station, in the registration's language or the link's (`?lang=`).
pub async fn sheet_route(
    State(app): State<Shared>,
    Path(key): Path<String>,
    Extension(l): Extension<Language>,
    RawQuery(query): RawQuery,
) -> Response {
    let (r, sheet_language) = match registration_in_language(&app, &key, l, query.as_deref()) {
        Ok(found) => found,
        Err(why) => return refused(l, why),
    };
    let mut res = match sheet_html(app.event(), &r, sheet_language) {
        Ok(html) => Html(html).into_response(),
        Err(e) => (
            StatusCode::INTERNAL_SERVER_ERROR,
            Html(message_page_in(l, "Error", &e)),
        )
            .into_response(),
    };
    content_language(&mut res, sheet_language);
    no_store(&mut res);
    res
}

/// `GET /registrations/{key}/calendar.ics`: the calendar `predict --sheets` writes beside it,
/// in the same language as the sheet.
pub async fn calendar_route(
    State(app): State<Shared>,
    Path(key): Path<String>,
    Extension(l): Extension<Language>,
    RawQuery(query): RawQuery,
) -> Response {
    let (r, calendar_language) = match registration_in_language(&app, &key, l, query.as_deref()) {
        Ok(found) => found,
        Err(why) => return refused(l, why),
    };
    let ics = match calendar_ics(app.event(), &r, calendar_language) {
        Ok(text) => text,
        Err(e) => return (StatusCode::INTERNAL_SERVER_ERROR, e).into_response(),
    };
    let disposition = format!("attachment; filename=\"{}\"", calendar_file(&r));
    let mut res = (
        [(header::CONTENT_TYPE, "text/calendar; charset=utf-8")],
        ics,
    )
        .into_response();
    if let Ok(v) = HeaderValue::from_str(&disposition) {
        res.headers_mut().insert(header::CONTENT_DISPOSITION, v);
    }
    content_language(&mut res, calendar_language);
    no_store(&mut res);
    res
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The registration form in the visitor's language, with the language switch and every
    /// field still named as the form posts it.
    #[test]
    fn the_form_is_in_the_visitors_language() {
        let es = form_page(Language::Spanish, "t", &RegistrationFields::default(), None);
        assert!(es.contains("<html lang=\"es\">"));
        assert!(es.contains("Registre su estación") && es.contains("Zona horaria de sus relojes"));
        assert!(es.contains("<nav class=\"languages\""));
        for name in [
            "station",
            "latitude",
            "longitude",
            "elevation_m",
            "time_zone",
        ] {
            assert!(es.contains(&format!("<label for=\"{name}\"")), "{name}");
        }
        let refused = form_page(
            Language::German,
            "t",
            &RegistrationFields::default(),
            Some("x"),
        );
        assert!(refused.contains("Nicht angemeldet: x"), "{refused}");
    }
}
