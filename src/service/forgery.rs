//! Closing the service to cross-site request forgery.
//!
//! - Every visitor gets a random id in a cookie (`HttpOnly; SameSite=Strict; Path=/`), and
//!   every form the service prints carries the anti-forgery token HMAC-SHA256(secret, id),
//!   the secret being random per start of the server: the "signed double-submit cookie" of
//!   the OWASP Cross-Site Request Forgery Prevention Cheat Sheet. A post whose token does not
//!   belong to the visitor's own cookie is refused (`403`); the check is in constant time.
//! - Every post whose `Origin` header names another site than the one the request came to
//!   (its `Host`) is refused (`403`), as the same cheat sheet's "verifying origin with
//!   standard headers" advises; a request without `Origin` (scripts, `curl`) passes, and
//!   `Origin: null` passes only with `Sec-Fetch-Site: same-origin`.
//! - `POST /api/submissions` takes only `Content-Type: application/json` (`415`): a page
//!   elsewhere can post `text/plain` or a form without a preflight, never JSON.
//!
//! References: OWASP Cheat Sheet Series, "Cross-Site Request Forgery Prevention"; RFC 2104
//! (HMAC); RFC 6265bis (draft-ietf-httpbis-rfc6265bis), section 5.6.7 (`SameSite`) and 4.1.2.6
//! (`HttpOnly`); RFC 6454, section 7 (the `Origin` header).

use super::pages::message_page;
use axum::extract::{Request, State};
use axum::http::{header, HeaderMap, HeaderValue, Method, StatusCode};
use axum::middleware::Next;
use axum::response::{Html, IntoResponse, Response};
use axum::Json;
use hmac::{Hmac, Mac};
use sha2::Sha256;
use std::sync::Arc;

type HmacSha256 = Hmac<Sha256>;

/// The name of the visitor's cookie.
pub const VISITOR_COOKIE: &str = "tp_visitor";

/// The server's secret for the anti-forgery tokens (random per start).
#[derive(Clone)]
pub struct Forgery {
    secret: Arc<[u8; 32]>,
}

impl Default for Forgery {
    fn default() -> Self {
        Self::new()
    }
}

impl Forgery {
    /// A fresh random secret.
    pub fn new() -> Forgery {
        let mut secret = [0u8; 32];
        rand::Rng::fill(&mut rand::thread_rng(), &mut secret);
        Forgery {
            secret: Arc::new(secret),
        }
    }

    fn mac(&self, visitor_id: &str) -> HmacSha256 {
        let mut mac =
            HmacSha256::new_from_slice(self.secret.as_slice()).expect("HMAC takes any key length");
        mac.update(visitor_id.as_bytes());
        mac
    }
}

/// The visitor of one request: its id (from its cookie, or new) and the token its forms carry.
#[derive(Clone)]
pub struct Visitor {
    id: String,
    forgery: Forgery,
    /// The anti-forgery token of this visitor's forms (hexadecimal HMAC-SHA256 of its id).
    pub token: String,
}

impl Visitor {
    fn new(forgery: Forgery, id: String) -> Visitor {
        let token = hex(&forgery.mac(&id).finalize().into_bytes());
        Visitor { id, forgery, token }
    }

    /// Whether a form's token belongs to this visitor (compared in constant time).
    pub fn accepts(&self, sent: Option<&str>) -> bool {
        let Some(bytes) = sent.and_then(unhex) else {
            return false;
        };
        self.forgery.mac(&self.id).verify_slice(&bytes).is_ok()
    }
}

fn hex(bytes: &[u8]) -> String {
    bytes.iter().map(|b| format!("{b:02x}")).collect()
}

fn unhex(text: &str) -> Option<Vec<u8>> {
    if text.len() % 2 != 0 {
        return None;
    }
    (0..text.len())
        .step_by(2)
        .map(|k| u8::from_str_radix(text.get(k..k + 2)?, 16).ok())
        .collect()
}

/// The value of a cookie of the request, if it is there.
pub fn cookie<'a>(headers: &'a HeaderMap, name: &str) -> Option<&'a str> {
    headers
        .get_all(header::COOKIE)
        .iter()
        .filter_map(|v| v.to_str().ok())
        .flat_map(|v| v.split(';'))
        .filter_map(|pair| pair.trim().split_once('='))
        .find(|(k, _)| *k == name)
        .map(|(_, v)| v)
}

/// A `Set-Cookie` value that browsers keep from script (`HttpOnly`) and send only with
/// requests started on this site (`SameSite=Strict`), for every path.
pub fn set_cookie(name: &str, value: &str, max_age_s: Option<u64>) -> HeaderValue {
    let age = max_age_s.map_or(String::new(), |s| format!("; Max-Age={s}"));
    HeaderValue::from_str(&format!(
        "{name}={value}; HttpOnly; SameSite=Strict; Path=/{age}"
    ))
    .expect("cookie values are letters and digits")
}

/// Middleware: give the request its [`Visitor`] (from the visitor's cookie, or a new id that
/// the response then sets).
pub async fn visitor(State(forgery): State<Forgery>, mut req: Request, next: Next) -> Response {
    let known = cookie(req.headers(), VISITOR_COOKIE)
        .filter(|v| v.len() == 32 && v.chars().all(|c| c.is_ascii_alphanumeric()))
        .map(String::from);
    let fresh = known.is_none();
    let id = known.unwrap_or_else(|| super::server::random_token(32));
    req.extensions_mut()
        .insert(Visitor::new(forgery, id.clone()));
    let mut res = next.run(req).await;
    if fresh {
        res.headers_mut()
            .append(header::SET_COOKIE, set_cookie(VISITOR_COOKIE, &id, None));
    }
    res
}

/// The refusal of a forged form: `403` with a page saying what to do.
pub fn refused_form() -> Response {
    (
        StatusCode::FORBIDDEN,
        Html(message_page(
            "Refused",
            "the form's anti-forgery token is missing or belongs to another visitor; reload the form and send it again",
        )),
    )
        .into_response()
}

/// Whether the request's `Origin`, if any, is the site the request came to (its `Host`).
fn same_origin(headers: &HeaderMap) -> bool {
    let Some(origin) = headers.get(header::ORIGIN) else {
        return true;
    };
    // Under `Referrer-Policy: no-referrer` Chromium sends `Origin: null` with a page's own
    // form posts; the Fetch Metadata header then says where the request started (W3C, "Fetch
    // Metadata Request Headers", section 2.4; a sandboxed or foreign page sends `cross-site`).
    if origin.as_bytes() == b"null" {
        return headers
            .get("sec-fetch-site")
            .is_some_and(|v| v.as_bytes() == b"same-origin");
    }
    let host = headers.get(header::HOST).and_then(|h| h.to_str().ok());
    let origin_host = origin
        .to_str()
        .ok()
        .and_then(|o| o.split_once("://"))
        .map(|(_, rest)| rest.trim_end_matches('/'));
    matches!((origin_host, host), (Some(o), Some(h)) if o.eq_ignore_ascii_case(h))
}

fn is_json(headers: &HeaderMap) -> bool {
    headers
        .get(header::CONTENT_TYPE)
        .and_then(|v| v.to_str().ok())
        .and_then(|v| v.split(';').next())
        .is_some_and(|t| t.trim().eq_ignore_ascii_case("application/json"))
}

/// Middleware: refuse a post from another site (`403`) and a submission to the JSON API that
/// is not JSON (`415`), before anything is read or stored.
pub async fn check_posts(req: Request, next: Next) -> Response {
    if req.method() != Method::POST {
        return next.run(req).await;
    }
    let api = req.uri().path().starts_with("/api/");
    if !same_origin(req.headers()) {
        let why = "this request was sent from another site; send it from this service's own pages or without an Origin header";
        return if api {
            (
                StatusCode::FORBIDDEN,
                Json(serde_json::json!({ "error": why })),
            )
                .into_response()
        } else {
            (StatusCode::FORBIDDEN, Html(message_page("Refused", why))).into_response()
        };
    }
    if api && !is_json(req.headers()) {
        let why = "send the submission as JSON, with the header Content-Type: application/json";
        return (
            StatusCode::UNSUPPORTED_MEDIA_TYPE,
            Json(serde_json::json!({ "error": why })),
        )
            .into_response();
    }
    next.run(req).await
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_token_belongs_to_one_visitor_and_one_secret() {
        let forgery = Forgery::new();
        let a = Visitor::new(forgery.clone(), "a".repeat(32));
        let b = Visitor::new(forgery, "b".repeat(32));
        assert!(a.accepts(Some(&a.token)));
        assert!(!a.accepts(Some(&b.token)) && !b.accepts(Some(&a.token)));
        assert!(!a.accepts(None) && !a.accepts(Some("zz")) && !a.accepts(Some("")));
        let other_start = Visitor::new(Forgery::new(), "a".repeat(32));
        assert!(!other_start.accepts(Some(&a.token)));
        assert_eq!(a.token.len(), 64);
    }

    #[test]
    fn origins_are_compared_with_the_host() {
        let headers = |origin: Option<&str>| {
            let mut h = HeaderMap::new();
            h.insert(header::HOST, HeaderValue::from_static("127.0.0.1:8040"));
            if let Some(o) = origin {
                h.insert(header::ORIGIN, HeaderValue::from_str(o).unwrap());
            }
            h
        };
        assert!(same_origin(&headers(None)));
        assert!(same_origin(&headers(Some("http://127.0.0.1:8040"))));
        assert!(!same_origin(&headers(Some("http://127.0.0.1:9999"))));
        assert!(!same_origin(&headers(Some("https://evil.example"))));
        assert!(!same_origin(&headers(Some("null"))));
        let mut h = headers(Some("null"));
        h.insert("sec-fetch-site", HeaderValue::from_static("same-origin"));
        assert!(same_origin(&h));
        h.insert("sec-fetch-site", HeaderValue::from_static("cross-site"));
        assert!(!same_origin(&h));
        let mut h = HeaderMap::new();
        h.insert(
            header::COOKIE,
            HeaderValue::from_static("x=1; tp_visitor=abc"),
        );
        assert_eq!(cookie(&h, VISITOR_COOKIE), Some("abc"));
    }
}
