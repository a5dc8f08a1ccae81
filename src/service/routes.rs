//! The organiser's routes, the solution and export of the stable interface, the router and
//! the start of the server.

use super::cache::recompute_loop;
use super::pages::message_page;
use super::server::{App, BODY_LIMIT};
use axum::body::Bytes;
use axum::extract::{DefaultBodyLimit, Query, State};
use axum::http::{HeaderMap, StatusCode};
use axum::response::{Html, IntoResponse, Redirect, Response};
use axum::routing::{get, post};
use axum::{Extension, Json, Router};
use serde_json::json;
use std::collections::HashMap;
use std::sync::Arc;

use super::registration_page as reg;

type Shared = Arc<App>;
type Q = Query<HashMap<String, String>>;

fn unauthorised() -> Response {
    (
        StatusCode::UNAUTHORIZED,
        Json(json!({ "error": "the organiser's token is missing or wrong" })),
    )
        .into_response()
}

async fn solution(State(app): State<Shared>, headers: HeaderMap, Query(q): Q) -> Response {
    if !app.authorised(&headers, &q) {
        return unauthorised();
    }
    super::cached::solution(&app, &headers)
}

async fn export(State(app): State<Shared>, headers: HeaderMap, Query(q): Q) -> Response {
    if !app.authorised(&headers, &q) {
        return unauthorised();
    }
    super::cached::export(&app, &headers)
}

async fn report(State(app): State<Shared>, headers: HeaderMap, Query(q): Q) -> Response {
    if !app.authorised(&headers, &q) {
        return unauthorised();
    }
    super::cached::report(&app, &headers)
}

/// `GET /results`: public, from the cache.
async fn results(
    State(app): State<Shared>,
    Extension(language): Extension<crate::language::Language>,
    headers: HeaderMap,
) -> Response {
    super::results_page::results(&app, &headers, language)
}

async fn organiser(
    State(app): State<Shared>,
    Extension(visitor): Extension<super::forgery::Visitor>,
    headers: HeaderMap,
    Query(q): Q,
) -> Response {
    if !app.authorised(&headers, &q) {
        return unauthorised();
    }
    super::cached::organiser(&app, &q, &visitor.token)
}

/// Exclude (`exclude` true) or restore a timing from the organiser's form, with a reason.
async fn set_state(
    app: Shared,
    (visitor, headers): (super::forgery::Visitor, HeaderMap),
    body: Bytes,
    exclude: bool,
) -> Response {
    let form: Vec<(String, String)> = serde_urlencoded::from_bytes(&body).unwrap_or_default();
    let get = |k: &str| {
        form.iter()
            .find(|(n, _)| n == k)
            .map(|(_, v)| v.trim().to_string())
    };
    if !app.authorised(&headers, &HashMap::new()) {
        return unauthorised();
    }
    if !visitor.accepts(get("csrf").as_deref()) {
        return super::forgery::refused_form();
    }
    let Some(id) = get("timing").and_then(|t| t.parse::<i64>().ok()) else {
        return (
            StatusCode::BAD_REQUEST,
            Html(message_page("Not done", "the form names no timing")),
        )
            .into_response();
    };
    let Some(reason) = get("reason").filter(|r| !r.is_empty()) else {
        let what = if exclude { "excluding" } else { "restoring" };
        return (
            StatusCode::BAD_REQUEST,
            Html(message_page(
                "Not done",
                &format!("give a reason for {what} the timing; it is kept in the audit trail"),
            )),
        )
            .into_response();
    };
    let done = app.with_store(|s| {
        if exclude {
            s.set_excluded(id, Some(&reason))
        } else {
            s.restore_with_reason(id, &reason)
        }
    });
    match done {
        Ok(true) => {
            app.mark_changed();
            Redirect::to("/organiser").into_response()
        }
        Ok(false) => (
            StatusCode::NOT_FOUND,
            Html(message_page("Not done", "no such timing")),
        )
            .into_response(),
        Err(e) => (StatusCode::INTERNAL_SERVER_ERROR, e).into_response(),
    }
}

type V = Extension<super::forgery::Visitor>;

async fn exclude(State(app): State<Shared>, Extension(v): V, h: HeaderMap, b: Bytes) -> Response {
    set_state(app, (v, h), b, true).await
}

async fn restore(State(app): State<Shared>, Extension(v): V, h: HeaderMap, b: Bytes) -> Response {
    set_state(app, (v, h), b, false).await
}

/// The router of every route, with the body limit, in its protective layers
/// (`security::harden`; `rate`: the per-address limit of posts, with `--public`).
pub fn router(app: Shared, rate: Option<super::limits::RateLimit>) -> Router {
    let routes = Router::new()
        .route("/", get(super::server::participant_route))
        .route("/submit", post(super::server::submit_route))
        .route("/upload", post(super::server::upload_route))
        .route(
            "/submission/{id}",
            get(super::server::review_route).post(super::server::correct_route),
        )
        .route("/api/submissions", post(super::server::api_submit_route))
        .route("/api/registrations", post(reg::api_register_route))
        .route(
            "/register",
            get(reg::register_page_route).post(reg::register_form_route),
        )
        .route("/registrations/{key}", get(reg::private_route))
        .route("/registrations/{key}/sheet.html", get(reg::sheet_route))
        .route(
            "/registrations/{key}/calendar.ics",
            get(reg::calendar_route),
        )
        .route("/results", get(results))
        .route("/api/solution", get(solution))
        .route("/api/export.csv", get(export))
        .route("/organiser", get(organiser))
        .route("/organiser/report.html", get(report))
        .route("/organiser/exclude", post(exclude))
        .route("/organiser/restore", post(restore))
        .merge(super::triage::routes())
        .layer(DefaultBodyLimit::max(BODY_LIMIT))
        .with_state(app.clone());
    super::security::harden(routes, app, rate)
}

/// How the server is started.
pub struct ServeSettings {
    /// Address and port to listen on (port 0: any free port).
    pub listen: std::net::SocketAddr,
    /// Whether a non-loopback address is allowed.
    pub public: bool,
    /// The organiser's token; generated when `None`.
    pub token: Option<String>,
    /// Stop after this long (tests), or run until interrupted.
    pub stop_after: Option<std::time::Duration>,
}

/// Run the service until interrupted (or `stop_after`): listen, say where and the token on
/// standard error, reduce in the background.
///
/// Errors: a non-loopback address without `public`, an address that cannot be bound, a token
/// that is not letters and digits.
pub fn serve(
    event: crate::TransitEvent,
    store: super::store::Store,
    settings: ServeSettings,
) -> crate::Result<()> {
    if !settings.listen.ip().is_loopback() && !settings.public {
        return Err(crate::Error::argument(format!(
            "--listen {}: the service listens only on this computer (127.0.0.1 or [::1]) unless --public is given; with --public anyone who can reach the address can send timings, so put it behind a firewall or a proxy you control",
            settings.listen
        )));
    }
    let token = settings
        .token
        .clone()
        .unwrap_or_else(|| super::server::random_token(24));
    if token.is_empty() || !token.chars().all(|c| c.is_ascii_alphanumeric()) {
        return Err(crate::Error::argument(
            "--token: give letters and digits only",
        ));
    }
    let generated = settings.token.is_none();
    let runtime = tokio::runtime::Builder::new_multi_thread()
        .enable_all()
        .build()
        .map_err(|e| crate::Error::argument(format!("the server could not start: {e}")))?;
    runtime.block_on(async move {
        let listener = tokio::net::TcpListener::bind(settings.listen)
            .await
            .map_err(|e| crate::Error::argument(format!("--listen {}: {e}", settings.listen)))?;
        let local = listener.local_addr().map_err(|e| crate::Error::argument(e.to_string()))?;
        let app = App::new(event, store, token.clone());
        tokio::spawn(recompute_loop(app.clone()));
        if settings.public && !local.ip().is_loopback() {
            eprintln!("warning: listening on a public address: anyone who can reach it can send timings; keep the organiser's token secret");
        }
        let rate = settings.public.then_some(super::limits::RateLimit::PUBLIC);
        if let Some(r) = rate {
            eprintln!("{}", r.describe());
        }
        eprintln!("listening on http://{local}");
        if generated {
            eprintln!("organiser token: {token}");
        }
        let stop = async move {
            match settings.stop_after {
                Some(d) => tokio::time::sleep(d).await,
                None => {
                    let _ = tokio::signal::ctrl_c().await;
                }
            }
        };
        let service = router(app, rate)
            .into_make_service_with_connect_info::<std::net::SocketAddr>();
        axum::serve(listener, service)
            .with_graceful_shutdown(stop)
            .await
            .map_err(|e| crate::Error::argument(format!("the server stopped: {e}")))
    })
}
