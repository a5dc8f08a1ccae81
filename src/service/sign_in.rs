//! The organiser's sign-in: the token is given once (the sign-in form, or `?token=` answered
//! by a redirect that drops it from the address) and the organiser is then held by a session
//! cookie (a random id kept in the server's memory, `HttpOnly; SameSite=Strict; Path=/`), so
//! that no page, link or form ever holds the token and a saved or shared page leaks nothing.
//! `Authorization: Bearer TOKEN` keeps working on every organiser route for scripts.
//! Sessions end with `POST /organiser/sign-out` or when the server stops.
//!
//! References: OWASP Cheat Sheet Series, "Session Management" (session ids random, kept in
//! cookies with `HttpOnly` and `SameSite`, never in URLs) and "Cross-Site Request Forgery
//! Prevention" (login forms carry the anti-forgery token too); RFC 6265bis
//! (draft-ietf-httpbis-rfc6265bis), sections 4.1.2.6 and 5.6.7; RFC 6750, section 2.1 (bearer
//! tokens in the `Authorization` header).

use super::forgery::{cookie, refused_form, set_cookie, Visitor};
use super::pages::page;
use super::server::App;
use axum::body::Bytes;
use axum::extract::{Request, State};
use axum::http::{header, HeaderMap, StatusCode};
use axum::middleware::Next;
use axum::response::{Html, IntoResponse, Redirect, Response};
use axum::routing::post;
use axum::{Extension, Json, Router};
use std::collections::HashSet;
use std::sync::{Arc, Mutex};

/// The name of the organiser's session cookie.
pub const SESSION_COOKIE: &str = "tp_organiser";

/// The organiser's sessions in force (random ids, in memory only).
#[derive(Default)]
pub struct Sessions(Mutex<HashSet<String>>);

impl Sessions {
    /// Open a session; its id.
    pub fn open(&self) -> String {
        let id = super::server::random_token(32);
        if let Ok(mut s) = self.0.lock() {
            s.insert(id.clone());
        }
        id
    }

    /// Whether the request's session cookie names a session in force.
    pub fn holds(&self, headers: &HeaderMap) -> bool {
        let Some(id) = cookie(headers, SESSION_COOKIE) else {
            return false;
        };
        self.0.lock().map(|s| s.contains(id)).unwrap_or(false)
    }

    /// End the request's session, if any.
    pub fn close(&self, headers: &HeaderMap) {
        if let (Some(id), Ok(mut s)) = (cookie(headers, SESSION_COOKIE), self.0.lock()) {
            s.remove(id);
        }
    }
}

/// Whether two secrets are equal, in time that depends on their lengths only.
pub fn same_secret(a: &str, b: &str) -> bool {
    a.len() == b.len()
        && a.bytes()
            .zip(b.bytes())
            .fold(0u8, |acc, (x, y)| acc | (x ^ y))
            == 0
}

/// Whether a path is one of the organiser's (guarded by [`gate`]).
fn guarded(path: &str) -> bool {
    (path == "/organiser" || path.starts_with("/organiser/"))
        && path != "/organiser/sign-in"
        && path != "/organiser/sign-out"
        || path == "/api/solution"
        || path == "/api/export.csv"
}

/// The sign-in page (`401`, or `403` after a wrong anti-forgery token), with a line saying why.
fn sign_in_page(visitor: Option<&Visitor>, why: &str) -> Response {
    let csrf = visitor.map_or("", |v| v.token.as_str());
    let body = format!(
        "<p>{}</p>\n<form method=\"post\" action=\"/organiser/sign-in\">\n<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n<div class=\"field\"><label for=\"token\">Organiser's token</label><input type=\"password\" name=\"token\" id=\"token\" autocomplete=\"current-password\" required=\"required\"/></div>\n<p class=\"actions\"><button type=\"submit\" id=\"sign-in\">Sign in</button></p>\n</form>\n<p>The token was printed when the service started (or given with <code>--token</code>). After signing in, this browser is held by a cookie until you sign out; scripts send the header <code>Authorization: Bearer TOKEN</code> instead.</p>\n",
        crate::render::svg::esc(why),
        crate::render::svg::esc(csrf)
    );
    (
        StatusCode::UNAUTHORIZED,
        Html(page("Organiser: sign in", &body)),
    )
        .into_response()
}

fn unauthorised(path: &str, visitor: Option<&Visitor>, why: &str) -> Response {
    if path.starts_with("/api/") {
        let error = format!("{why}; send the header Authorization: Bearer TOKEN");
        (
            StatusCode::UNAUTHORIZED,
            Json(serde_json::json!({ "error": error })),
        )
            .into_response()
    } else {
        sign_in_page(visitor, why)
    }
}

/// A session cookie and a `303` to `to`.
fn signed_in(app: &App, to: &str) -> Response {
    let id = app.sessions.open();
    let mut res = Redirect::to(to).into_response();
    res.headers_mut()
        .append(header::SET_COOKIE, set_cookie(SESSION_COOKIE, &id, None));
    res
}

/// The request's address without its `token` parameter.
fn without_token(req: &Request) -> String {
    let rest: Vec<&str> = req
        .uri()
        .query()
        .unwrap_or("")
        .split('&')
        .filter(|p| !p.is_empty() && !p.starts_with("token=") && *p != "token")
        .collect();
    let path = req.uri().path();
    if rest.is_empty() {
        path.to_string()
    } else {
        format!("{path}?{}", rest.join("&"))
    }
}

/// Middleware on the organiser's routes: `?token=` signs in and redirects to the address
/// without it; a bearer token or a session passes; anything else answers `401` (the sign-in
/// form on pages, JSON on the API).
pub async fn gate(State(app): State<Arc<App>>, req: Request, next: Next) -> Response {
    let path = req.uri().path().to_string();
    if !guarded(&path) {
        return next.run(req).await;
    }
    let visitor = req.extensions().get::<Visitor>().cloned();
    let query: Vec<(String, String)> =
        serde_urlencoded::from_str(req.uri().query().unwrap_or("")).unwrap_or_default();
    if let Some((_, token)) = query.iter().find(|(k, _)| k == "token") {
        if same_secret(token, app.token()) {
            return signed_in(&app, &without_token(&req));
        }
        return unauthorised(&path, visitor.as_ref(), "the organiser's token is wrong");
    }
    if app.authorised(req.headers(), &Default::default()) {
        return next.run(req).await;
    }
    unauthorised(
        &path,
        visitor.as_ref(),
        "sign in with the organiser's token to see this page",
    )
}

fn form_value(body: &[u8], name: &str) -> Option<String> {
    serde_urlencoded::from_bytes::<Vec<(String, String)>>(body)
        .ok()?
        .into_iter()
        .find(|(k, _)| k == name)
        .map(|(_, v)| v.trim().to_string())
}

/// `POST /organiser/sign-in`: the token from the sign-in form.
async fn sign_in(
    State(app): State<Arc<App>>,
    Extension(visitor): Extension<Visitor>,
    body: Bytes,
) -> Response {
    if !visitor.accepts(form_value(&body, "csrf").as_deref()) {
        return refused_form();
    }
    match form_value(&body, "token") {
        Some(t) if same_secret(&t, app.token()) => signed_in(&app, "/organiser"),
        _ => sign_in_page(Some(&visitor), "that is not the organiser's token"),
    }
}

/// `POST /organiser/sign-out`: the session ends and its cookie is cleared.
async fn sign_out(
    State(app): State<Arc<App>>,
    Extension(visitor): Extension<Visitor>,
    headers: HeaderMap,
    body: Bytes,
) -> Response {
    if !visitor.accepts(form_value(&body, "csrf").as_deref()) {
        return refused_form();
    }
    app.sessions.close(&headers);
    let mut res = Redirect::to("/organiser").into_response();
    res.headers_mut()
        .append(header::SET_COOKIE, set_cookie(SESSION_COOKIE, "", Some(0)));
    res
}

/// The sign-in and sign-out routes.
pub fn routes(app: Arc<App>) -> Router {
    Router::new()
        .route("/organiser/sign-in", post(sign_in))
        .route("/organiser/sign-out", post(sign_out))
        .with_state(app)
}

/// The sign-out button for the organiser's pages.
pub fn sign_out_form(csrf: &str) -> String {
    format!(
        "<form method=\"post\" action=\"/organiser/sign-out\"><input type=\"hidden\" name=\"csrf\" value=\"{}\"/><button type=\"submit\" id=\"sign-out\">Sign out</button></form>\n",
        crate::render::svg::esc(csrf)
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_organisers_paths_are_guarded_and_secrets_compared() {
        for p in [
            "/organiser",
            "/organiser/report.html",
            "/organiser/exclude",
            "/api/solution",
            "/api/export.csv",
        ] {
            assert!(guarded(p), "{p}");
        }
        for p in [
            "/",
            "/organiser/sign-in",
            "/organiser/sign-out",
            "/api/submissions",
            "/organisers",
        ] {
            assert!(!guarded(p), "{p}");
        }
        assert!(same_secret("abc", "abc"));
        assert!(!same_secret("abc", "abd") && !same_secret("abc", "ab"));
    }
}
