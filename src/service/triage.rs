//! The organiser's triage: timings excluded several at a time with one reason (those ticked in
//! the table, or every timing the filters show), notes from the organiser to a participant
//! (shown on the participant's private link), and the list of timings that need attention,
//! made once per version of the data by the reducer (`cache.rs`):
//!
//! - the feedback at arrival and the solution disagree (the feedback said it fits and the
//!   solution rejected it, or the feedback rejected it and the solution uses it);
//! - the feedback found it doubtful;
//! - it is its station's only timing (nothing to compare it with: a slip or a clock error
//!   cannot show).
//!
//! Every form here posts the visitor's anti-forgery token, and every route checks the
//! organiser's session (or token) first.

use super::forgery::{refused_form, Visitor};
use super::pages::{message_page, scroll_box};
use super::server::App;
use super::store::StoredTiming;
use super::table_query::TableQuery;
use crate::render::svg::esc;
use axum::body::Bytes;
use axum::extract::State;
use axum::http::{HeaderMap, StatusCode};
use axum::response::{Html, IntoResponse, Redirect, Response};
use axum::routing::post;
use axum::{Extension, Router};
use std::collections::HashMap;
use std::fmt::Write;
use std::sync::Arc;

/// The most rows of the attention list shown (the counts say how many there are).
pub const ATTENTION_ROWS: usize = 100;

/// One timing that needs the organiser's attention.
#[derive(Clone, Debug, PartialEq)]
pub struct AttentionItem {
    /// Timing id.
    pub timing_id: i64,
    /// Its submission.
    pub submission_id: i64,
    /// Station.
    pub station: String,
    /// Contact as sent.
    pub contact: String,
    /// Why it needs attention.
    pub why: String,
}

/// The list of timings that need attention, with how many of each kind there are.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct Attention {
    /// The rows shown (at most [`ATTENTION_ROWS`]).
    pub items: Vec<AttentionItem>,
    /// Timings whose feedback and solution disagree.
    pub disagreements: usize,
    /// Timings the feedback found doubtful.
    pub doubtful: usize,
    /// Stations with one timing.
    pub lone_stations: usize,
    /// Timings that need attention, each counted once (for one of these reasons or several).
    pub timings: usize,
}

/// Why a timing not excluded needs attention, if it does (the lone-station case aside).
fn reason_of(verdict: Option<&str>, state: Option<&(String, String)>) -> Option<(bool, String)> {
    let state_words = state.map_or("not reduced yet".to_string(), |(s, w)| {
        if w.is_empty() {
            s.clone()
        } else {
            format!("{s}: {w}")
        }
    });
    let rejected = state.is_some_and(|(s, _)| s.starts_with("rejected"));
    let used = state.is_some_and(|(s, _)| s == "used");
    match verdict {
        Some("fits") if rejected => Some((
            true,
            format!("the feedback said it fits; the solution has it {state_words}"),
        )),
        Some("rejected") if used => Some((
            true,
            format!("the feedback rejected it; the solution uses it ({state_words})"),
        )),
        Some("doubtful") => Some((
            false,
            format!("the feedback found it doubtful; in the solution: {state_words}"),
        )),
        _ => None,
    }
}

/// The timings in force (not excluded) that need attention: the disagreements first, then
/// the doubtful, then the stations with one timing.
pub fn attention(
    timings: &[StoredTiming],
    verdicts: &HashMap<i64, String>,
    states: &HashMap<i64, (String, String)>,
) -> Attention {
    let live: Vec<&StoredTiming> = timings.iter().filter(|t| t.excluded.is_none()).collect();
    let item = |t: &StoredTiming, why: String| AttentionItem {
        timing_id: t.id,
        submission_id: t.submission_id,
        station: t.fields.station.clone(),
        contact: t.fields.contact.clone(),
        why,
    };
    let mut out = Attention::default();
    let mut doubtful = Vec::new();
    for t in &live {
        match reason_of(verdicts.get(&t.id).map(String::as_str), states.get(&t.id)) {
            Some((true, why)) => {
                out.disagreements += 1;
                out.items.push(item(t, why));
            }
            Some((false, why)) => {
                out.doubtful += 1;
                doubtful.push(item(t, why));
            }
            None => {}
        }
    }
    out.items.extend(doubtful);
    // A station as the reduction knows it: by its name as written.
    let mut per_station: HashMap<&str, usize> = HashMap::new();
    for t in &live {
        *per_station.entry(t.fields.station.trim()).or_default() += 1;
    }
    let lone = "its station's only timing: nothing to compare it with, so a slip or a clock error cannot show";
    for t in &live {
        if per_station.get(t.fields.station.trim()) == Some(&1) {
            out.lone_stations += 1;
            // One row per timing: a lone timing already listed gets the reason added.
            match out.items.iter_mut().find(|i| i.timing_id == t.id) {
                Some(listed) => listed.why = format!("{}; {lone}", listed.why),
                None => out.items.push(item(t, lone.into())),
            }
        }
    }
    out.timings = out.items.len();
    out.items.truncate(ATTENTION_ROWS);
    out
}

/// The organiser page's section of the timings that need attention.
pub fn attention_html(a: &Attention) -> String {
    let mut s = String::from("<h2 id=\"attention\">Needs attention</h2>\n");
    if a.items.is_empty() {
        s.push_str("<p>Nothing: no timing where the feedback and the solution disagree, none doubtful, no station with one timing.</p>\n");
        return s;
    }
    let _ = writeln!(
        s,
        "<p>Feedback and solution disagree: {}; doubtful at arrival: {}; stations with one timing: {}.{}</p>",
        a.disagreements,
        a.doubtful,
        a.lone_stations,
        if a.timings > a.items.len() {
            format!(" The first {} of {} timings are listed.", a.items.len(), a.timings)
        } else {
            String::new()
        }
    );
    let mut t = String::from("<table id=\"attention-rows\"><tr><th scope=\"col\">timing</th><th scope=\"col\">submission</th><th scope=\"col\">station</th><th scope=\"col\">contact</th><th scope=\"col\">why</th></tr>\n");
    for i in &a.items {
        let _ = writeln!(
            t,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            i.timing_id,
            i.submission_id,
            esc(&i.station),
            esc(&i.contact),
            esc(&i.why)
        );
    }
    t.push_str("</table>\n");
    s.push_str(&scroll_box("Needs attention", &t));
    s
}

/// The form that excludes several timings with one reason: those ticked in the table (their
/// boxes belong to this form through their `form` attribute), or every timing the filters
/// show (`total`), the filters posted with it.
pub fn bulk_form(q: &TableQuery, total: i64, csrf: &str) -> String {
    let mut hidden = format!(
        "<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>",
        esc(csrf)
    );
    for (name, value) in q.pairs() {
        let _ = write!(
            hidden,
            "<input type=\"hidden\" name=\"{name}\" value=\"{}\"/>",
            esc(&value)
        );
    }
    let every = if q.narrows() {
        format!("every timing these filters show ({total}), on every page")
    } else {
        format!("every timing ({total}), on every page")
    };
    format!(
        "<form method=\"post\" action=\"/organiser/exclude-many\" id=\"bulk\">{hidden}<fieldset><legend>Exclude several timings</legend><div class=\"row\"><div class=\"field\"><label for=\"bulk-scope\">Which</label><select id=\"bulk-scope\" name=\"scope\"><option value=\"checked\" selected>the timings ticked below</option><option value=\"filtered\">{}</option></select></div><div class=\"field\"><label for=\"bulk-reason\">Reason <span class=\"hint\">kept in the audit trail</span></label><input id=\"bulk-reason\" name=\"reason\" size=\"18\" required/></div></div><p class=\"actions\"><button type=\"submit\" id=\"bulk-exclude\">exclude</button></p></fieldset></form>\n",
        esc(&every)
    )
}

/// The form that sends a note to the participant of a submission.
pub fn note_form(csrf: &str) -> String {
    format!(
        "<h2 id=\"notes\">A note to a participant</h2>\n<form method=\"post\" action=\"/organiser/note\" id=\"note-form\"><input type=\"hidden\" name=\"csrf\" value=\"{}\"/><div class=\"row\"><div class=\"field\"><label for=\"note-submission\">Submission <span class=\"hint\">its number, from the table</span></label><input id=\"note-submission\" name=\"submission\" inputmode=\"numeric\" size=\"8\" required/></div></div><div class=\"field\"><label for=\"note-text\">Note <span class=\"hint\">shown on the participant's private link; kept in the audit trail</span></label><textarea id=\"note-text\" name=\"note\" rows=\"3\" required></textarea></div><p class=\"actions\"><button type=\"submit\" id=\"send-note\">send the note</button></p></form>\n",
        esc(csrf)
    )
}

/// The notes for the participant's private link (empty when there are none).
pub fn notes_html(notes: &[(String, String)]) -> String {
    if notes.is_empty() {
        return String::new();
    }
    let mut s = String::from(
        "<h2 id=\"organiser-notes\">Notes from the organiser</h2>\n<ul class=\"notes\">\n",
    );
    for (at, note) in notes {
        let _ = writeln!(s, "<li><b>{} UTC</b>: {}</li>", esc(at), esc(note));
    }
    s.push_str("</ul>\n");
    s
}

/// A refusal page with the status and the sentence.
fn not_done(status: StatusCode, why: &str) -> Response {
    (status, Html(message_page("Not done", why))).into_response()
}

/// The posted form's pairs, the organiser and the anti-forgery token checked; `Err` is the
/// refusal to send.
fn checked_form(
    app: &App,
    visitor: &Visitor,
    headers: &HeaderMap,
    body: &[u8],
) -> Result<Vec<(String, String)>, Box<Response>> {
    if !app.authorised(headers, &HashMap::new()) {
        return Err(Box::new(not_done(
            StatusCode::UNAUTHORIZED,
            "sign in with the organiser's token first",
        )));
    }
    let form: Vec<(String, String)> = serde_urlencoded::from_bytes(body).unwrap_or_default();
    let csrf = form
        .iter()
        .find(|(k, _)| k == "csrf")
        .map(|(_, v)| v.as_str());
    if !visitor.accepts(csrf) {
        return Err(Box::new(refused_form()));
    }
    Ok(form)
}

fn value(form: &[(String, String)], name: &str) -> String {
    form.iter()
        .find(|(k, _)| k == name)
        .map_or(String::new(), |(_, v)| v.trim().to_string())
}

type Shared = Arc<App>;

/// `POST /organiser/exclude-many`: `reason`, `scope` (`checked` with one `timing` per ticked
/// row, or `filtered` with the table's filters); answers with the table as it was filtered.
async fn exclude_many(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    headers: HeaderMap,
    body: Bytes,
) -> Response {
    let form = match checked_form(&app, &visitor, &headers, &body) {
        Ok(f) => f,
        Err(refusal) => return *refusal,
    };
    let reason = value(&form, "reason");
    if reason.is_empty() {
        return not_done(
            StatusCode::BAD_REQUEST,
            "give a reason for excluding the timings; it is kept in the audit trail",
        );
    }
    let filters: HashMap<String, String> = form
        .iter()
        .filter(|(k, _)| k != "timing")
        .cloned()
        .collect();
    let query = TableQuery::from_query(&filters);
    let ids: Vec<i64> = if value(&form, "scope") == "filtered" {
        match app.with_store(|s| super::timing_table::matching_ids(s, &query)) {
            Ok(ids) => ids,
            Err(e) => return (StatusCode::INTERNAL_SERVER_ERROR, e).into_response(),
        }
    } else {
        form.iter()
            .filter(|(k, _)| k == "timing")
            .filter_map(|(_, v)| v.trim().parse().ok())
            .collect()
    };
    if ids.is_empty() {
        return not_done(
            StatusCode::BAD_REQUEST,
            "no timing was chosen: tick the timings to exclude, or choose every timing the filters show",
        );
    }
    match app.with_store(|s| s.exclude_many(&ids, &reason)) {
        Ok(n) => {
            if n > 0 {
                app.mark_changed();
            }
            Redirect::to(&query.link(1)).into_response()
        }
        Err(e) => (StatusCode::INTERNAL_SERVER_ERROR, e).into_response(),
    }
}

/// `POST /organiser/note`: `submission` and `note`.
async fn note(
    State(app): State<Shared>,
    Extension(visitor): Extension<Visitor>,
    headers: HeaderMap,
    body: Bytes,
) -> Response {
    let form = match checked_form(&app, &visitor, &headers, &body) {
        Ok(f) => f,
        Err(refusal) => return *refusal,
    };
    let Ok(submission) = value(&form, "submission").parse::<i64>() else {
        return not_done(
            StatusCode::BAD_REQUEST,
            "give the submission's number (the table's submission column)",
        );
    };
    let text = value(&form, "note");
    if text.is_empty() || text.chars().count() > super::store_triage::NOTE_MAX_CHARS {
        return not_done(
            StatusCode::BAD_REQUEST,
            &format!(
                "write the note (at most {} characters)",
                super::store_triage::NOTE_MAX_CHARS
            ),
        );
    }
    match app.with_store(|s| s.add_note(submission, &text)) {
        Ok(true) => Redirect::to("/organiser#notes").into_response(),
        Ok(false) => not_done(
            StatusCode::NOT_FOUND,
            "no accepted submission has that number",
        ),
        Err(e) => (StatusCode::INTERNAL_SERVER_ERROR, e).into_response(),
    }
}

/// The triage's routes (state: the app).
pub fn routes() -> Router<Shared> {
    Router::new()
        .route("/organiser/exclude-many", post(exclude_many))
        .route("/organiser/note", post(note))
}

#[cfg(test)]
mod tests {
    use super::super::store::TimingFields;
    use super::*;

    fn timing(id: i64, station: &str, excluded: bool) -> StoredTiming {
        StoredTiming {
            id,
            submission_id: id,
            fields: TimingFields {
                station: station.into(),
                contact: "2".into(),
                ..TimingFields::default()
            },
            excluded: excluded.then(|| "x".to_string()),
        }
    }

    #[test]
    fn disagreements_doubts_and_lone_stations_are_listed() {
        let timings = vec![
            timing(1, "A", false),
            timing(2, "A", false),
            timing(3, "A", false),
            timing(4, "B", false),
            timing(5, "C", false),
            timing(6, "C", true),
        ];
        let verdicts: HashMap<i64, String> =
            [(1, "fits"), (2, "doubtful"), (3, "rejected"), (4, "fits")]
                .into_iter()
                .map(|(k, v)| (k, v.to_string()))
                .collect();
        let states: HashMap<i64, (String, String)> = [
            (1, ("rejected (outlier)", "zone slip")),
            (2, ("used", "O - C +3.0 s")),
            (3, ("used", "O - C +1.0 s")),
            (4, ("used", "O - C +0.1 s")),
        ]
        .into_iter()
        .map(|(k, (a, b))| (k, (a.to_string(), b.to_string())))
        .collect();
        let a = attention(&timings, &verdicts, &states);
        assert_eq!((a.disagreements, a.doubtful, a.lone_stations), (2, 1, 2));
        let ids: Vec<i64> = a.items.iter().map(|i| i.timing_id).collect();
        assert_eq!(ids, [1, 3, 2, 4, 5]);
        assert!(a.items[0].why.contains("rejected (outlier): zone slip"));
        let html = attention_html(&a);
        assert!(html.contains("stations with one timing: 2"));
        let none = attention(&[], &HashMap::new(), &HashMap::new());
        assert!(attention_html(&none).contains("Nothing"));
    }

    /// A lone station's doubtful timing is one row with both reasons.
    #[test]
    fn each_timing_is_listed_once() {
        let timings = vec![
            timing(1, "Reed Lake", false),
            timing(2, "Reed Lake", false),
            timing(3, "Stone Quay", false),
        ];
        let verdicts: HashMap<i64, String> = [(3, "doubtful".to_string())].into_iter().collect();
        let a = attention(&timings, &verdicts, &HashMap::new());
        assert_eq!((a.doubtful, a.lone_stations, a.timings), (1, 1, 1));
        assert_eq!(a.items.len(), 1);
        assert!(
            a.items[0].why.contains("; its station's only timing"),
            "{}",
            a.items[0].why
        );
        assert!(!attention_html(&a).contains("are listed"));
    }

    #[test]
    fn notes_and_forms_escape_what_they_show() {
        let html = notes_html(&[("2026-01-01T00:00:00.000Z".into(), "<b>check</b>".into())]);
        assert!(html.contains("&lt;b&gt;check"));
        assert!(notes_html(&[]).is_empty());
        let q =
            TableQuery::from_query(&[("q".to_string(), "\"x".to_string())].into_iter().collect());
        let form = bulk_form(&q, 3, "tok");
        assert!(form.contains("name=\"q\" value=\"&quot;x\""));
        assert!(form.contains("these filters show (3)"));
        assert!(note_form("tok").contains("<label for=\"note-text\">"));
    }
}
