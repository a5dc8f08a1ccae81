//! The routes of registration: `POST /api/registrations` (JSON), the registration form for
//! people (`GET` and `POST /register`, with the visitor's anti-forgery token), the station's
//! private page (`/registrations/KEY`), its observers' sheet (`.../sheet.html`) and its
//! calendar (`.../calendar.ics`). The private key is the registration's id: random letters and
//! digits (some 143 bits), never shown to the organiser and never stored as such.
//!
//! The JSON route shares the rules of `POST /api/submissions`: `415` for a body that is not
//! JSON and `403` for a foreign `Origin` (`forgery::check_posts`), `413` over the body limit.

use super::forgery::{refused_form, Visitor};
use super::form::text_field;
use super::pages::{message_page, page, page_in};
use super::registration::{
    calendar_file, calendar_ics, checked, fields_from_form, fields_from_json, looks_like_key,
    prediction, sheet_html, RegistrationFields, KEY_LEN,
};
use super::server::{random_token, App};
use super::store_registrations::Registration;
use crate::geometry::sun_horizon::sun_is_up;
use crate::language::{text, Args, Language};
use crate::render::svg::esc;
use crate::time::iso::format_utc;
use axum::body::Bytes;
use axum::extract::{Path, State};
use axum::http::{header, HeaderValue, StatusCode};
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

/// `POST /api/registrations`: `201` with `registration_id` (the private key), `sheet_url`,
/// `calendar_url` and `registration_url`; `400` with `{ "error" }` naming the field.
pub async fn api_register_route(State(app): State<Shared>, body: Bytes) -> Response {
    let r = match fields_from_json(&body).and_then(|f| checked(&f)) {
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
        "<form method=\"post\" action=\"/register\" id=\"register-form\">\n<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n<fieldset><legend>{}</legend>\n{}\n<div class=\"row\">{}{}</div>\n<div class=\"row\">{}{}</div>\n</fieldset>\n<p class=\"actions\"><button type=\"submit\" id=\"register\">{}</button></p>\n</form>",
        esc(csrf),
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
    let fields = fields_from_form(&form);
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
        Ok((key, stored)) => private_response(&app, &key, &stored, StatusCode::CREATED),
        Err(e) => (
            StatusCode::INTERNAL_SERVER_ERROR,
            Html(message_page("Not registered", &e)),
        )
            .into_response(),
    }
}

/// The contacts seen from the station, in its clock time and UTC, as a list.
fn contacts_list(app: &App, r: &Registration) -> String {
    let Ok((p, zone)) = prediction(app.event(), r) else {
        return String::new();
    };
    let mut s = String::from("<ul id=\"contacts\">\n");
    for c in p.contacts.iter().flatten() {
        let label = app.event().label(c.hours);
        let reading = zone.reading(label);
        let sun = if sun_is_up(c.sun_altitude_deg) {
            format!("the Sun {:.0}° up", c.sun_altitude_deg)
        } else {
            "the Sun below the horizon: not seen".to_string()
        };
        let _ = writeln!(
            s,
            "<li>Contact {}: {} {} ({} UTC), {sun}</li>",
            c.contact.roman(),
            &reading.iso(0)[11..19],
            esc(&reading.abbreviation),
            &format_utc(label, 0)[11..19]
        );
    }
    if p.contacts.iter().all(Option::is_none) {
        s.push_str("<li>No contact of this transit occurs at this place.</li>\n");
    }
    s.push_str("</ul>\n");
    s
}

/// The station's private page: its links, its place and zone, its contacts.
fn private_response(app: &App, key: &str, r: &Registration, status: StatusCode) -> Response {
    let (private, sheet, calendar) = urls(key);
    let mut s = format!(
        "<p>Your private link: <a id=\"private\" href=\"{p}\">{p}</a>. Keep it: it opens your sheet and calendar again, and anyone who has it can.</p>\n<ul>\n<li><a id=\"sheet\" href=\"{sheet}\">Your observers' sheet</a>: a printable page with the contacts in your clock time and a table for your timings.</li>\n<li><a id=\"calendar\" href=\"{calendar}\" download=\"{file}\">Your calendar of the contacts</a> (.ics, with reminders) for a phone or a calendar program.</li>\n</ul>\n",
        p = esc(&private),
        file = esc(&calendar_file(r)),
    );
    let _ = writeln!(
        s,
        "<h2>Your station</h2>\n<p id=\"station\">{}: latitude {:.4}°, longitude {:.4}°, elevation {:.0} m; clocks on {}.</p>\n<h2>The contacts there</h2>",
        esc(&r.station),
        r.latitude_deg,
        r.longitude_deg,
        r.elevation_m,
        esc(&r.time_zone)
    );
    s.push_str(&contacts_list(app, r));
    s.push_str("<p>After the event, <a href=\"/\">send your timings</a> under the same station name.</p>\n");
    let mut res = (
        status,
        Html(page(&format!("Registered: {}", r.station), &s)),
    )
        .into_response();
    no_store(&mut res);
    res
}

/// A private answer is kept by no cache.
fn no_store(res: &mut Response) {
    res.headers_mut()
        .insert(header::CACHE_CONTROL, HeaderValue::from_static("no-store"));
}

/// The registration a key opens, or the status and sentence of the refusal (`404`).
fn find(app: &App, key: &str) -> Result<Registration, (StatusCode, String)> {
    let not_found = || {
        (
            StatusCode::NOT_FOUND,
            "no registration answers to this link".to_string(),
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

/// The page of a refusal of [`find`].
fn refused((status, why): (StatusCode, String)) -> Response {
    let title = if status == StatusCode::NOT_FOUND {
        "Not found"
    } else {
        "Error"
    };
    (status, Html(message_page(title, &why))).into_response()
}

/// `GET /registrations/{key}`.
pub async fn private_route(State(app): State<Shared>, Path(key): Path<String>) -> Response {
    match find(&app, &key) {
        Ok(r) => private_response(&app, &key, &r, StatusCode::OK),
        Err(why) => refused(why),
    }
}

/// `GET /registrations/{key}/sheet.html`: the page `predict --sheets` writes for the station.
pub async fn sheet_route(State(app): State<Shared>, Path(key): Path<String>) -> Response {
    let r = match find(&app, &key) {
        Ok(r) => r,
        Err(why) => return refused(why),
    };
    let mut res = match sheet_html(app.event(), &r) {
        Ok(html) => Html(html).into_response(),
        Err(e) => (
            StatusCode::INTERNAL_SERVER_ERROR,
            Html(message_page("Error", &e)),
        )
            .into_response(),
    };
    no_store(&mut res);
    res
}

/// `GET /registrations/{key}/calendar.ics`: the calendar `predict --sheets` writes beside it.
pub async fn calendar_route(State(app): State<Shared>, Path(key): Path<String>) -> Response {
    let r = match find(&app, &key) {
        Ok(r) => r,
        Err(why) => return refused(why),
    };
    let ics = match calendar_ics(app.event(), &r) {
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
