//! The HTTP server (axum on tokio): the routes of the stable interface, the participant's and
//! the organiser's pages; the background reduction after each change is in `cache.rs`, never
//! in a request.

use super::cache::Cache;
use super::feedback::{feedback, parallax_information, SubmissionFeedback};
use super::feedback_page::{feedback_cards, feedback_page, share_of, NoShare};
use super::forgery::{refused_form, Visitor};
use super::intake::{from_form, from_json};
use super::pages::{message_page_in, page_in, timing_form};
use super::store::{Store, TimingFields};
use crate::geometry::transit::TransitEvent;
use crate::language::Language;
use axum::body::Bytes;
use axum::extract::{Path, Query, State};
use axum::http::{header, HeaderMap, StatusCode};
use axum::response::{Html, IntoResponse, Response};
use axum::{Extension, Json};
use serde_json::json;
use std::collections::HashMap;
use std::sync::atomic::{AtomicU64, Ordering};
use std::sync::{Arc, Mutex};
use tokio::sync::Notify;

/// Largest request body, bytes.
pub const BODY_LIMIT: usize = super::limits::BODY_LIMIT_BYTES;

/// The server's state.
pub struct App {
    event: TransitEvent,
    store: Mutex<Store>,
    token: String,
    /// The organiser's sessions (see `sign_in.rs`).
    pub sessions: super::sign_in::Sessions,
    generation: AtomicU64,
    notify: Notify,
    /// The artefacts of the newest version of the data.
    pub cache: Cache,
}

/// A random string of letters and digits.
pub fn random_token(len: usize) -> String {
    use rand::Rng;
    rand::thread_rng()
        .sample_iter(&rand::distributions::Alphanumeric)
        .take(len)
        .map(char::from)
        .collect()
}

type Shared = Arc<App>;

fn internal(e: impl std::fmt::Display) -> Response {
    (
        StatusCode::INTERNAL_SERVER_ERROR,
        Json(json!({ "error": e.to_string() })),
    )
        .into_response()
}

impl App {
    /// The state for an event and an opened store; `token` for the organiser.
    pub fn new(event: TransitEvent, store: Store, token: String) -> Shared {
        Arc::new(App {
            event,
            store: Mutex::new(store),
            token,
            sessions: Default::default(),
            generation: AtomicU64::new(1),
            notify: Notify::new(),
            cache: Cache::default(),
        })
    }

    fn changed(&self) {
        self.generation.fetch_add(1, Ordering::SeqCst);
        self.notify.notify_one();
    }

    /// Note a change of the timings in force (the background task reduces them again).
    pub fn mark_changed(&self) {
        self.changed();
    }

    /// Whether timings changed since the latest solution.
    pub fn pending(&self) -> bool {
        self.pending_changes() > 0
    }

    /// How many changes of the data the latest solution does not include yet.
    pub fn pending_changes(&self) -> u64 {
        self.generation()
            .saturating_sub(self.cache.solved().version)
    }

    /// The version of the data: raised by every change of the timings in force.
    pub fn generation(&self) -> u64 {
        self.generation.load(Ordering::SeqCst)
    }

    /// Notified at each change of the timings in force.
    pub(super) fn change_notify(&self) -> &Notify {
        &self.notify
    }

    /// The transit.
    pub fn event(&self) -> &TransitEvent {
        &self.event
    }

    /// The organiser's token.
    pub fn token(&self) -> &str {
        &self.token
    }

    /// Run `f` on the store under its lock.
    pub fn with_store<T>(
        &self,
        f: impl FnOnce(&mut Store) -> Result<T, String>,
    ) -> Result<T, String> {
        let mut guard = self
            .store
            .lock()
            .map_err(|_| "the database lock was poisoned".to_string())?;
        f(&mut guard)
    }

    /// Whether the request is the organiser's: the token in `Authorization: Bearer`, or a
    /// session cookie (`?token=` is turned into a session by `sign_in::gate`, never read here).
    pub fn authorised(&self, headers: &HeaderMap, _query: &HashMap<String, String>) -> bool {
        let bearer = headers
            .get(header::AUTHORIZATION)
            .and_then(|v| v.to_str().ok())
            .and_then(|v| v.strip_prefix("Bearer "));
        bearer.is_some_and(|b| super::sign_in::same_secret(b, &self.token))
            || self.sessions.holds(headers)
    }

    /// The station's expected share of the information on the parallax, once the network
    /// (the latest solution's stations and these) has
    /// [`super::feedback_page::MIN_STATIONS_FOR_SHARE`] stations;
    /// else why it does not show.
    fn share(&self, fields: &[TimingFields]) -> Result<f64, NoShare> {
        let solved = self.cache.solved();
        let mut names: Vec<&str> = solved
            .reduction
            .as_ref()
            .map(|r| {
                r.stations
                    .iter()
                    .filter(|s| s.timings > 0)
                    .map(|s| s.station.as_str())
                    .collect()
            })
            .unwrap_or_default();
        for f in fields {
            if !names.contains(&f.station.as_str()) {
                names.push(&f.station);
            }
        }
        let own = parallax_information(&self.event, fields);
        share_of(own, solved.information, names.len())
    }
}

/// Store, read and acknowledge one submission; (submission id, fields, edit key, duplicate
/// of, feedback) or the reason it is unreadable (stored all the same).
type Accepted = (
    i64,
    Vec<TimingFields>,
    String,
    Option<i64>,
    SubmissionFeedback,
);

fn take_in(
    app: &App,
    body: &[u8],
    read: impl FnOnce(&[u8]) -> Result<Vec<TimingFields>, String>,
    supersedes: Option<i64>,
) -> Result<Result<Accepted, String>, String> {
    let (id, earlier) = app.with_store(|s| s.store_raw(body))?;
    let fields = match read(body) {
        Ok(f) => f,
        Err(why) => {
            app.with_store(|s| s.mark(id, "unreadable", Some(&why)))?;
            return Ok(Err(why));
        }
    };
    if let (Some(first), None) = (earlier, supersedes) {
        app.with_store(|s| {
            s.mark(
                id,
                "duplicate",
                Some(&format!("the same as submission {first}")),
            )
        })?;
        let key = app
            .with_store(|s| s.submission(first))?
            .map(|x| x.0)
            .unwrap_or_default();
        let fb = feedback(&app.event, &fields);
        return Ok(Ok((first, fields, key, Some(first), fb)));
    }
    let key = random_token(24);
    // The feedback is kept with the timings (the organiser's table filters by its verdict)
    // before the change is announced to the reducer.
    let fb = feedback(&app.event, &fields);
    app.with_store(|s| {
        let ids = s.accept(id, &key, &fields, supersedes)?;
        s.record_feedback(&ids, &fb)
    })?;
    app.changed();
    Ok(Ok((id, fields, key, None, fb)))
}

/// `POST /api/submissions`.
pub async fn api_submit_route(State(app): State<Shared>, body: Bytes) -> Response {
    let worker = app.clone();
    let done = tokio::task::spawn_blocking(move || take_in(&worker, &body, from_json, None)).await;
    match done {
        Ok(Ok(Ok((id, fields, key, duplicate, fb)))) => {
            let status = if duplicate.is_some() {
                StatusCode::OK
            } else {
                StatusCode::CREATED
            };
            let share = app.share(&fields);
            let reply = json!({
                "submission_id": id,
                "duplicate_of": duplicate,
                "timings": fb.timings,
                "station_advice": fb.stations,
                "timings_read": fb.rows_read(),
                "information_share": share.as_ref().ok(),
                "information_share_note": share.as_ref().err().map(|_| {
                    super::feedback_page::share_sentence(Language::English, &share)
                }),
                "review": format!("/submission/{id}?key={key}"),
            });
            (status, Json(reply)).into_response()
        }
        Ok(Ok(Err(why))) => {
            (StatusCode::BAD_REQUEST, Json(json!({ "error": why }))).into_response()
        }
        Ok(Err(e)) => internal(e),
        Err(e) => internal(e),
    }
}

fn form_pairs(body: &[u8]) -> Result<Vec<(String, String)>, String> {
    serde_urlencoded::from_bytes::<Vec<(String, String)>>(body)
        .map_err(|e| format!("the form could not be read: {e}"))
}

fn field<'a>(form: &'a [(String, String)], name: &str) -> Option<&'a str> {
    form.iter()
        .find(|(k, _)| k == name)
        .map(|(_, v)| v.as_str())
}

async fn form_submit(
    (app, l): (Shared, Language),
    visitor: Visitor,
    body: Bytes,
    supersedes: Option<(i64, String)>,
) -> Response {
    let form = match form_pairs(&body) {
        Ok(f) => f,
        Err(why) => {
            return (
                StatusCode::BAD_REQUEST,
                Html(message_page_in(l, &t(l, "not-received"), &why)),
            )
                .into_response()
        }
    };
    if !visitor.accepts(field(&form, "csrf")) {
        return refused_form();
    }
    let old = match supersedes {
        Some((id, key)) => match app.with_store(|s| s.submission(id)) {
            Ok(Some((k, true, _))) if k == key => Some(id),
            _ => {
                return (
                    StatusCode::FORBIDDEN,
                    Html(message_page_in(
                        l,
                        &t(l, "refused"),
                        &t(l, "refused-not-in-force"),
                    )),
                )
                    .into_response()
            }
        },
        None => None,
    };
    let worker = app.clone();
    let read = move |_: &[u8]| from_form(&form);
    let done = tokio::task::spawn_blocking(move || take_in(&worker, &body, read, old)).await;
    feedback_reply(&app, l, done)
}

/// A message of the participants' pages in the visitor's language.
fn t(l: Language, id: &str) -> String {
    crate::language::text(l, id, &crate::language::Args::new())
}

/// `GET /`.
pub async fn participant_route(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    Extension(l): Extension<Language>,
) -> Html<String> {
    let args = crate::language::Args::new()
        .text("planet", app.event.planet.name())
        .text(
            "date",
            crate::language::numbers::date_long(l, app.event.date()),
        );
    let intro = format!(
        "<p>{}</p>\n<p>{}</p>\n",
        crate::render::svg::esc(&crate::language::text(l, "form-intro", &args)),
        crate::language::text(l, "form-before-and-after", &crate::language::Args::new())
    );
    let forms = timing_form(l, "/submit", (&visitor.token, None), &[])
        + &super::pages::upload_form(l, &visitor.token)
        + &super::limits::limits_sentence(l);
    Html(page_in(
        l,
        Some("/"),
        &t(l, "form-title"),
        &(intro + &forms),
    ))
}

/// `POST /submit`.
pub async fn submit_route(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    Extension(l): Extension<Language>,
    body: Bytes,
) -> Response {
    form_submit((app, l), visitor, body, None).await
}

/// The reply page for a stored submission: its feedback (`201`; `200` for an identical one),
/// or why it could not be read (`400`; stored all the same).
fn feedback_reply(
    app: &App,
    l: Language,
    done: Result<Result<Result<Accepted, String>, String>, tokio::task::JoinError>,
) -> Response {
    match done {
        Ok(Ok(Ok((id, fields, key, duplicate, fb)))) => {
            let link = format!("/submission/{id}?key={key}");
            let page = feedback_page(
                l,
                &app.event,
                (id, &link),
                (&fields, &fb),
                &app.share(&fields),
                duplicate.is_some(),
            );
            let status = if duplicate.is_some() {
                StatusCode::OK
            } else {
                StatusCode::CREATED
            };
            (status, Html(page)).into_response()
        }
        Ok(Ok(Err(why))) => (
            StatusCode::BAD_REQUEST,
            Html(message_page_in(
                l,
                &t(l, "not-read"),
                &format!("{why}. {}", t(l, "stored-as-it-came")),
            )),
        )
            .into_response(),
        Ok(Err(e)) => internal(e),
        Err(e) => internal(e),
    }
}

/// `POST /upload`: an observations file sent as a multipart form (the file's bytes are the
/// submission stored raw).
pub async fn upload_route(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    Extension(l): Extension<Language>,
    form: axum::extract::Multipart,
) -> Response {
    let (csrf, file) = match super::limits::read_upload(form).await {
        Ok(parts) => parts,
        Err(refusal) => return refusal,
    };
    if !visitor.accepts(Some(&csrf)) {
        return refused_form();
    }
    let Some(bytes) = file.filter(|b| !b.is_empty()) else {
        return (
            StatusCode::BAD_REQUEST,
            Html(message_page_in(
                l,
                &t(l, "not-received"),
                &t(l, "choose-a-file"),
            )),
        )
            .into_response();
    };
    let worker = app.clone();
    let done = tokio::task::spawn_blocking(move || {
        take_in(&worker, &bytes, super::intake::from_csv_bytes, None)
    })
    .await;
    feedback_reply(&app, l, done)
}

/// `GET /submission/{id}?key=`.
pub async fn review_route(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    Extension(l): Extension<Language>,
    Path(id): Path<i64>,
    Query(q): Query<HashMap<String, String>>,
) -> Response {
    let key = q.get("key").cloned().unwrap_or_default();
    match app.with_store(|s| s.submission(id)) {
        Ok(Some((k, in_force, fields))) if k == key => {
            let fb = feedback(&app.event, &fields);
            let notes = app.with_store(|s| s.notes(id)).unwrap_or_default();
            let mut body = super::triage::notes_html(&notes);
            body.push_str(&super::feedback_page::drawings(&app.event, &fb));
            body.push_str(&feedback_cards(l, &fields, &fb));
            let esc = crate::render::svg::esc;
            if in_force {
                body.push_str(&format!(
                    "<h2>{}</h2>\n<p>{}</p>\n",
                    esc(&t(l, "review-correct-heading")),
                    esc(&t(l, "review-correct-note"))
                ));
                body.push_str(&timing_form(
                    l,
                    &format!("/submission/{id}"),
                    (&visitor.token, Some(&key)),
                    &fields,
                ));
            } else {
                body.push_str(&format!("<p>{}</p>\n", esc(&t(l, "review-superseded"))));
            }
            let here = format!("/submission/{id}?key={key}");
            let title = crate::language::text(
                l,
                "review-title",
                &crate::language::Args::new().text("id", id.to_string()),
            );
            Html(page_in(l, Some(&here), &title, &body)).into_response()
        }
        Ok(_) => (
            StatusCode::NOT_FOUND,
            Html(message_page_in(
                l,
                &t(l, "not-found"),
                &t(l, "not-found-submission"),
            )),
        )
            .into_response(),
        Err(e) => internal(e),
    }
}

/// `POST /submission/{id}`.
pub async fn correct_route(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    Extension(l): Extension<Language>,
    Path(id): Path<i64>,
    body: Bytes,
) -> Response {
    let key = form_pairs(&body)
        .ok()
        .and_then(|f| field(&f, "key").map(String::from))
        .unwrap_or_default();
    form_submit((app, l), visitor, body, Some((id, key))).await
}
