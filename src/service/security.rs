//! The response headers that every answer of the service carries, pages, errors and 404s
//! alike: a strict content-security policy, `nosniff`, no referrer, no framing; and
//! [`harden`], which wraps the router in every protective layer of the service (these
//! headers, the rate limit, the visitor's anti-forgery cookie, the origin and content-type
//! checks, the organiser's sign-in).
//!
//! The pages carry no script and fetch nothing from elsewhere; their only inline content is one
//! `<style>` element (the pages') or another (the report's), allowed by the SHA-256 hash of its
//! exact text, computed at start-up, so no `'unsafe-inline'` is needed.
//!
//! References: W3C, "Content Security Policy Level 3" (Working Draft), sections 6.1
//! (`default-src`, `script-src`, `style-src`, `img-src`), 6.3 (`base-uri`, `form-action`,
//! `frame-ancestors`) and 8.3 (hash sources); OWASP Secure Headers Project and "HTTP Headers
//! Cheat Sheet" (`X-Content-Type-Options`, `Referrer-Policy`, `X-Frame-Options`); RFC 7034
//! (`X-Frame-Options`).

use super::server::App;
use axum::extract::{Request, State};
use axum::http::header::{self, HeaderName, HeaderValue};
use axum::middleware::{from_fn, from_fn_with_state, Next};
use axum::response::Response;
use axum::Router;
use sha2::{Digest, Sha256};
use std::sync::Arc;

/// The CSP hash source of one inline `<style>` element's exact text: `'sha256-BASE64'`.
pub fn style_hash(text: &str) -> String {
    format!("'sha256-{}'", base64(&Sha256::digest(text.as_bytes())))
}

/// Standard base64 with padding (RFC 4648, section 4), as CSP hash sources are written.
fn base64(bytes: &[u8]) -> String {
    const ALPHABET: &[u8; 64] = b"ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";
    let mut out = String::new();
    for chunk in bytes.chunks(3) {
        let b = [
            chunk[0],
            *chunk.get(1).unwrap_or(&0),
            *chunk.get(2).unwrap_or(&0),
        ];
        let n = (u32::from(b[0]) << 16) | (u32::from(b[1]) << 8) | u32::from(b[2]);
        for k in 0..4 {
            if k <= chunk.len() {
                out.push(char::from(ALPHABET[(n >> (18 - 6 * k)) as usize & 63]));
            } else {
                out.push('=');
            }
        }
    }
    out
}

/// The content-security policy of every response: nothing allowed by default; the pages',
/// the report's and the observers' sheet's style elements by their hashes; images from the service itself and
/// `data:` URLs; forms posted only to the service; no framing, no `<base>`, no script.
pub fn content_security_policy() -> String {
    format!(
        "default-src 'none'; script-src 'none'; style-src {} {} {}; img-src 'self' data:; form-action 'self'; frame-ancestors 'none'; base-uri 'none'",
        style_hash(super::pages::STYLE),
        style_hash(crate::render::document::REPORT_STYLE),
        style_hash(&super::registration::sheet_style_text())
    )
}

/// Add the security headers to a response (any the handler set are replaced).
async fn add_headers(State(csp): State<Arc<HeaderValue>>, req: Request, next: Next) -> Response {
    let mut res = next.run(req).await;
    let h = res.headers_mut();
    h.insert(header::CONTENT_SECURITY_POLICY, (*csp).clone());
    h.insert(
        header::X_CONTENT_TYPE_OPTIONS,
        HeaderValue::from_static("nosniff"),
    );
    h.insert(
        header::REFERRER_POLICY,
        HeaderValue::from_static("no-referrer"),
    );
    h.insert(header::X_FRAME_OPTIONS, HeaderValue::from_static("DENY"));
    h.insert(
        HeaderName::from_static("cross-origin-opener-policy"),
        HeaderValue::from_static("same-origin"),
    );
    res
}

/// Wrap the service's router in its protective layers, outermost first: the security headers
/// (so that every refusal carries them too), the per-address rate limit (`rate`, with
/// `--public`), the visitor's language, 413 answers explained, the visitor's anti-forgery cookie, the origin and
/// content-type checks of posts, and the organiser's sign-in (with its routes added).
pub fn harden(router: Router, app: Arc<App>, rate: Option<super::limits::RateLimit>) -> Router {
    let csp = HeaderValue::from_str(&content_security_policy())
        .unwrap_or_else(|_| HeaderValue::from_static("default-src 'none'"));
    let forgery = super::forgery::Forgery::new();
    let mut r = router
        .merge(super::sign_in::routes(app.clone()))
        .layer(from_fn_with_state(app, super::sign_in::gate))
        .layer(from_fn(super::forgery::check_posts))
        .layer(from_fn_with_state(forgery, super::forgery::visitor))
        .layer(from_fn(super::limits::explain_too_large))
        .layer(from_fn(super::language_choice::choose_language));
    if let Some(rate) = rate {
        r = r.layer(from_fn_with_state(
            rate.limiter(),
            super::limits::limit_rate,
        ));
    }
    r.layer(from_fn_with_state(Arc::new(csp), add_headers))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Base64 against RFC 4648, section 10's test vectors; the hash form against a value
    /// computed independently (`printf '' | openssl dgst -sha256 -binary | base64`).
    #[test]
    fn hashes_are_written_as_csp_wants_them() {
        for (text, want) in [
            ("", ""),
            ("f", "Zg=="),
            ("fo", "Zm8="),
            ("foo", "Zm9v"),
            ("foob", "Zm9vYg=="),
            ("fooba", "Zm9vYmE="),
            ("foobar", "Zm9vYmFy"),
        ] {
            assert_eq!(base64(text.as_bytes()), want);
        }
        assert_eq!(
            style_hash(""),
            "'sha256-47DEQpj8HBSa+/TImW+5JCeuQeRkm5NMpJWZG3hSuFU='"
        );
        let csp = content_security_policy();
        assert!(csp.contains("script-src 'none'") && !csp.contains("unsafe-inline"));
    }
}
