//! The service's limits, said plainly: the largest request body (a pasted file or an upload:
//! 256 KB, about 3,000 rows of the observations columns), answered over the limit with `413`
//! and a page that says the limit, how to split a file and the way back (JSON with an `error`
//! on the API); and, with `--public`, a per-address rate limit on posts (the `governor`
//! crate's generic cell rate algorithm), answered with `429`.
//!
//! References: RFC 9110, section 15.5.14 (`413 Content Too Large`); RFC 6585, section 4
//! (`429 Too Many Requests`, `Retry-After`); OWASP Cheat Sheet Series, "Denial of Service"
//! (limit request sizes and rates per client).

use super::pages::page;
use axum::extract::{ConnectInfo, Request, State};
use axum::http::{header, HeaderValue, Method, StatusCode};
use axum::middleware::Next;
use axum::response::{Html, IntoResponse, Response};
use axum::Json;
use governor::{DefaultKeyedRateLimiter, Quota, RateLimiter};
use std::net::{IpAddr, SocketAddr};
use std::num::NonZeroU32;
use std::sync::Arc;

/// Largest request body, bytes (a pasted file, an upload, a JSON submission).
pub const BODY_LIMIT_BYTES: usize = 256 * 1024;

/// About how many rows of the observations columns fit in [`BODY_LIMIT_BYTES`] (some 85
/// bytes a row: station, coordinates, contact, an ISO 8601 time, its uncertainty).
pub const ROWS_WITHIN_LIMIT: usize = 3_000;

/// The limits as the participant's form states them, in the visitor's language.
pub fn limits_sentence(l: crate::language::Language) -> String {
    use crate::language::{numbers::decimal, text, Args};
    let args = Args::new()
        .text("kb", decimal(l, (BODY_LIMIT_BYTES / 1024) as f64, 0))
        .text("rows", decimal(l, ROWS_WITHIN_LIMIT as f64, 0));
    format!(
        "<p id=\"limits\">{}</p>\n",
        crate::render::svg::esc(&text(l, "limits", &args))
    )
}

/// The `413` answer: a page in the site's layout (the caution, the limit, how to split the
/// file, the way back) or, on the API, JSON with an `error`.
pub fn too_large(api: bool) -> Response {
    let kb = BODY_LIMIT_BYTES / 1024;
    if api {
        let error = format!("the body is larger than the limit of {kb} KB ({BODY_LIMIT_BYTES} bytes); send the timings in several submissions, each under the limit");
        return (
            StatusCode::PAYLOAD_TOO_LARGE,
            Json(serde_json::json!({ "error": error })),
        )
            .into_response();
    }
    let body = format!(
        "<p id=\"limit\">What you sent is larger than the limit of {kb} KB (about {} rows of timings), so nothing was stored.</p>\n<p>Split the file into parts under {kb} KB each: keep the header line (the column names) at the top of every part, and keep each station's rows together if you can. Send each part on its own; the timings of one station sent in several parts are pooled.</p>\n<p><a id=\"back\" href=\"/\">Back to the form</a></p>\n",
        crate::language::numbers::decimal(crate::language::Language::English, ROWS_WITHIN_LIMIT as f64, 0)
    );
    (
        StatusCode::PAYLOAD_TOO_LARGE,
        Html(page("Too large to receive", &body)),
    )
        .into_response()
}

/// Middleware: a `413` from any route (the body-limit rejection's bare text, or a handler's)
/// becomes [`too_large`].
pub async fn explain_too_large(req: Request, next: Next) -> Response {
    let api = req.uri().path().starts_with("/api/");
    let res = next.run(req).await;
    if res.status() == StatusCode::PAYLOAD_TOO_LARGE {
        too_large(api)
    } else {
        res
    }
}

/// The anti-forgery token and the file of an upload form; a body over the limit is
/// answered `413` (not misread as a form without a file), a malformed one `400`.
pub async fn read_upload(
    mut form: axum::extract::Multipart,
) -> Result<(String, Option<axum::body::Bytes>), Response> {
    let (mut csrf, mut file) = (String::new(), None);
    let refusal = |e: axum::extract::multipart::MultipartError| {
        if e.status() == StatusCode::PAYLOAD_TOO_LARGE {
            too_large(false)
        } else {
            let why = format!(
                "the upload could not be read ({}); choose the file and send it again",
                e.body_text()
            );
            (
                StatusCode::BAD_REQUEST,
                Html(super::pages::message_page("Not received", &why)),
            )
                .into_response()
        }
    };
    loop {
        match form.next_field().await {
            Ok(Some(part)) => match part.name() {
                Some("csrf") => csrf = part.text().await.map_err(refusal)?,
                Some("file") => file = Some(part.bytes().await.map_err(refusal)?),
                _ => {}
            },
            Ok(None) => return Ok((csrf, file)),
            Err(e) => return Err(refusal(e)),
        }
    }
}

/// A per-address rate limit on posts: `per_second` replenished, bursts of `burst`.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub struct RateLimit {
    /// Posts per second each address regains.
    pub per_second: u32,
    /// Posts an address may send at once after a pause.
    pub burst: u32,
}

impl RateLimit {
    /// The limit with `--public`: 10 posts a second per address, bursts of 60 (a school's
    /// class behind one address sending its forms in the same minute passes).
    pub const PUBLIC: RateLimit = RateLimit {
        per_second: 10,
        burst: 60,
    };

    /// The keyed limiter of this limit.
    pub fn limiter(self) -> Arc<DefaultKeyedRateLimiter<IpAddr>> {
        let one = NonZeroU32::MIN;
        let quota = Quota::per_second(NonZeroU32::new(self.per_second).unwrap_or(one))
            .allow_burst(NonZeroU32::new(self.burst).unwrap_or(one));
        Arc::new(RateLimiter::keyed(quota))
    }

    /// The start-up line.
    pub fn describe(self) -> String {
        format!(
            "rate limit on: {} posts a second per address, bursts of {} (429 beyond)",
            self.per_second, self.burst
        )
    }
}

/// Middleware: posts beyond an address's rate answer `429` with a sentence and `Retry-After`.
/// The address is the connection's peer (behind a proxy, the proxy's).
pub async fn limit_rate(
    State(limiter): State<Arc<DefaultKeyedRateLimiter<IpAddr>>>,
    req: Request,
    next: Next,
) -> Response {
    if req.method() != Method::POST {
        return next.run(req).await;
    }
    let peer = req
        .extensions()
        .get::<ConnectInfo<SocketAddr>>()
        .map(|c| c.0.ip());
    let Some(ip) = peer else {
        return next.run(req).await;
    };
    if limiter.check_key(&ip).is_ok() {
        if limiter.len() > 100_000 {
            limiter.retain_recent();
        }
        return next.run(req).await;
    }
    let why =
        "Too many posts from your address in a short time; wait a few seconds and send again.";
    let mut res = if req.uri().path().starts_with("/api/") {
        (
            StatusCode::TOO_MANY_REQUESTS,
            Json(serde_json::json!({ "error": why })),
        )
            .into_response()
    } else {
        (
            StatusCode::TOO_MANY_REQUESTS,
            Html(super::pages::message_page("Please wait", why)),
        )
            .into_response()
    };
    res.headers_mut()
        .insert(header::RETRY_AFTER, HeaderValue::from_static("5"));
    res
}

#[cfg(test)]
mod tests {
    use super::*;
    use axum::body::Body;
    use axum::routing::post;
    use axum::Router;
    use tower::ServiceExt;

    async fn status(app: &Router, from: [u8; 4], method: Method) -> StatusCode {
        let mut req = Request::builder()
            .method(method)
            .uri("/x")
            .body(Body::empty())
            .unwrap();
        req.extensions_mut()
            .insert(ConnectInfo(SocketAddr::from((from, 1000))));
        app.clone().oneshot(req).await.unwrap().status()
    }

    /// A burst of 3 at 1 a second: the fourth post of one address is refused, another
    /// address and gets are not limited.
    #[test]
    fn posts_beyond_the_burst_are_refused_per_address() {
        let limit = RateLimit {
            per_second: 1,
            burst: 3,
        };
        let app = Router::new()
            .route("/x", post(|| async { "ok" }).get(|| async { "ok" }))
            .layer(axum::middleware::from_fn_with_state(
                limit.limiter(),
                limit_rate,
            ));
        let rt = tokio::runtime::Builder::new_current_thread()
            .enable_all()
            .build()
            .unwrap();
        rt.block_on(async {
            for _ in 0..3 {
                assert_eq!(
                    status(&app, [10, 0, 0, 1], Method::POST).await,
                    StatusCode::OK
                );
            }
            assert_eq!(
                status(&app, [10, 0, 0, 1], Method::POST).await,
                StatusCode::TOO_MANY_REQUESTS
            );
            assert_eq!(
                status(&app, [10, 0, 0, 2], Method::POST).await,
                StatusCode::OK
            );
            assert_eq!(
                status(&app, [10, 0, 0, 1], Method::GET).await,
                StatusCode::OK
            );
        });
        assert!(limits_sentence(crate::language::Language::German).contains("3.000 Zeilen"));
        assert!(limits_sentence(crate::language::Language::English).contains("256 KB"));
    }
}
