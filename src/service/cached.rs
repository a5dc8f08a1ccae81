//! The organiser's heavy responses served from the cache (`cache.rs`): the solution JSON, the
//! export and the report are bytes made once per version of the data, sent with the version
//! as their `ETag` (`304` when the client has it), `X-Data-Version` and `X-Pending-Changes`
//! (changes the version does not include yet); the organiser's page gathers only a page of the
//! table, through a read connection of its own.

use super::organiser::{organiser_page, OrganiserView};
use super::pages::message_page;
use super::server::App;
use super::timing_table::{page_of, table_html, timing_counts, TableQuery};
use axum::body::{Body, Bytes};
use axum::http::{header, HeaderMap, HeaderValue, StatusCode};
use axum::response::{Html, IntoResponse, Response};
use std::collections::HashMap;

/// Whether the request's `If-None-Match` names `etag` (or `*`).
fn not_modified(headers: &HeaderMap, etag: &str) -> bool {
    headers
        .get_all(header::IF_NONE_MATCH)
        .iter()
        .filter_map(|v| v.to_str().ok())
        .flat_map(|v| v.split(','))
        .any(|t| {
            let t = t.trim();
            t == "*" || t.trim_start_matches("W/") == etag
        })
}

/// A cached body with its version headers, or `304` when the client holds that version.
pub(super) fn versioned(
    headers: &HeaderMap,
    (etag, version, pending): (String, u64, u64),
    content_type: &'static str,
    body: impl FnOnce() -> Body,
) -> Response {
    let mut response = if not_modified(headers, &etag) {
        StatusCode::NOT_MODIFIED.into_response()
    } else {
        let mut r = Response::new(body());
        r.headers_mut()
            .insert(header::CONTENT_TYPE, HeaderValue::from_static(content_type));
        r
    };
    let h = response.headers_mut();
    for (name, value) in [
        (header::ETAG, etag),
        (
            header::HeaderName::from_static("x-data-version"),
            version.to_string(),
        ),
        (
            header::HeaderName::from_static("x-pending-changes"),
            pending.to_string(),
        ),
        (header::CACHE_CONTROL, "no-cache".to_string()),
    ] {
        if let Ok(v) = HeaderValue::from_str(&value) {
            h.insert(name, v);
        }
    }
    response
}

/// `GET /api/solution`: the newest solution's JSON with `pending` (whether changes wait to be
/// reduced) appended; the cached bytes are shared, never copied.
pub fn solution(app: &App, headers: &HeaderMap) -> Response {
    let solved = app.cache.solved();
    let pending = app.pending_changes();
    let etag = format!("\"v{}-{}\"", solved.version, u8::from(pending > 0));
    let tail = if pending > 0 {
        &b",\"pending\":true}"[..]
    } else {
        &b",\"pending\":false}"[..]
    };
    let prefix = if solved.version == 0 {
        Bytes::from_static(b"{\"error\":\"no solution yet\",\"version\":0")
    } else {
        solved.solution_json.clone()
    };
    versioned(
        headers,
        (etag, solved.version, pending),
        "application/json",
        move || {
            let chunks = [
                Ok::<_, std::io::Error>(prefix),
                Ok(Bytes::from_static(tail)),
            ];
            Body::from_stream(futures_util::stream::iter(chunks))
        },
    )
}

/// `GET /api/export.csv`: the timings in force of the newest solved version.
pub fn export(app: &App, headers: &HeaderMap) -> Response {
    let solved = app.cache.solved();
    if solved.version == 0 {
        return (
            StatusCode::SERVICE_UNAVAILABLE,
            [(header::RETRY_AFTER, "2")],
            "the export is being prepared; try again in a moment",
        )
            .into_response();
    }
    let etag = format!("\"v{}\"", solved.version);
    let body = solved.export_csv.clone();
    versioned(
        headers,
        (etag, solved.version, app.pending_changes()),
        "text/csv; charset=utf-8",
        move || Body::from(body),
    )
}

/// `GET /organiser/report.html`: the newest report rendered (perhaps of an earlier version
/// than the newest solution, as its headers say).
pub fn report(app: &App, headers: &HeaderMap) -> Response {
    let rendered = app.cache.rendered();
    let Some(html) = rendered.html.clone() else {
        let solved = app.cache.solved();
        let (status, why) = if solved.reduction.is_some() && rendered.version != solved.version {
            (
                StatusCode::SERVICE_UNAVAILABLE,
                "the report is being prepared; reload in a moment",
            )
        } else {
            (StatusCode::NOT_FOUND, "no timing has been reduced yet")
        };
        return (status, Html(message_page("No report yet", why))).into_response();
    };
    let etag = format!("\"v{}\"", rendered.version);
    let pending = app.generation().saturating_sub(rendered.version);
    versioned(
        headers,
        (etag, rendered.version, pending),
        "text/html; charset=utf-8",
        move || Body::from(html),
    )
}

/// `GET /organiser?page=N&state=..&q=..&clock=..&viewing=..&verdict=..&sort=..`: the
/// solution of the cache, the timings that need attention, a page of the table read in SQL.
pub fn organiser(app: &App, q: &HashMap<String, String>, csrf: &str) -> Response {
    let query = TableQuery::from_query(q);
    let gathered = app.cache.with_page_reader(app, |s| {
        Ok((
            page_of(s, &query)?,
            timing_counts(s)?,
            s.counts()?,
            s.unreadable(200)?,
            s.audit(200)?,
        ))
    });
    let ((rows, total), timings, counts, unreadable, audit) = match gathered {
        Ok(x) => x,
        Err(e) => return (StatusCode::INTERNAL_SERVER_ERROR, e).into_response(),
    };
    let solved = app.cache.solved();
    let table = super::triage::attention_html(&solved.attention)
        + &table_html(&query, (&rows, total), &solved, csrf)
        + &super::triage::note_form(csrf);
    let network = super::network_plan::organiser_section(app);
    let view = OrganiserView {
        solution: solved.reduction.as_deref(),
        error: solved.error.as_deref(),
        pending: app.pending(),
        timing_counts: timings,
        table_html: &table,
        charts_html: &solved.charts_html,
        network_html: &network,
        counts,
        unreadable: &unreadable,
        audit: &audit,
        csrf,
    };
    Html(organiser_page(&view)).into_response()
}
