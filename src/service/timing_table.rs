//! The organiser's table of every timing in force, a page at a time (the filters, search and
//! order of `table_query.rs`), read with SQL `LIMIT`/`OFFSET` (so that a campaign of 100,000
//! timings is never read whole for a page), each row with its verdict at arrival, its state in
//! the latest solution, a box that ticks it for a bulk exclusion and the form that excludes or
//! restores it.

use super::cache::Solved;
use super::store::Store;
use crate::render::svg::esc;
use rusqlite::params_from_iter;
use std::fmt::Write;

use super::table_query::{Sort, CLOCK_CHOICES, VERDICT_CHOICES, VIEWING_CHOICES};
pub use super::table_query::{StateFilter, TableQuery, PAGE_ROWS};

/// One row of the table.
#[derive(Clone, Debug, PartialEq)]
pub struct TableRow {
    /// Timing id.
    pub id: i64,
    /// The submission it came with.
    pub submission_id: i64,
    /// Station, as sent.
    pub station: String,
    /// Observer, as sent.
    pub observer: String,
    /// Contact, as sent.
    pub contact: String,
    /// The time as sent (UTC, or the local reading).
    pub time: String,
    /// Clock source, as sent.
    pub clock_source: String,
    /// The feedback's verdict at arrival, where recorded.
    pub verdict: Option<String>,
    /// The O - C at arrival, seconds, where recorded.
    pub o_c_s: Option<f64>,
    /// The organiser's reason for excluding it.
    pub excluded: Option<String>,
}

const IN_FORCE: &str = "FROM timings t JOIN submissions s ON s.id = t.submission_id WHERE s.status = 'accepted' AND s.superseded_by IS NULL";

/// How many timings match the query's filters.
///
/// Errors: the database's, as text.
pub fn matching_count(store: &Store, q: &TableQuery) -> Result<i64, String> {
    let (cond, p) = q.condition();
    store
        .connection()
        .query_row(
            &format!("SELECT COUNT(*) {IN_FORCE}{cond}"),
            params_from_iter(&p),
            |r| r.get(0),
        )
        .map_err(|e| format!("database: {e}"))
}

/// The ids of every timing the query's filters show (every page), not yet excluded: what a
/// bulk exclusion of "every timing the filters show" excludes.
///
/// Errors: the database's, as text.
pub fn matching_ids(store: &Store, q: &TableQuery) -> Result<Vec<i64>, String> {
    let err = |e: rusqlite::Error| format!("database: {e}");
    let (cond, p) = q.condition();
    let sql = format!("SELECT t.id {IN_FORCE}{cond} AND t.excluded_reason IS NULL ORDER BY t.id");
    let mut stmt = store.connection().prepare(&sql).map_err(err)?;
    let rows = stmt
        .query_map(params_from_iter(&p), |r| r.get(0))
        .map_err(err)?;
    rows.collect::<Result<Vec<i64>, _>>().map_err(err)
}

/// One page of the table and how many timings match the filters.
///
/// Errors: the database's, as text.
pub fn page_of(store: &Store, q: &TableQuery) -> Result<(Vec<TableRow>, i64), String> {
    let err = |e: rusqlite::Error| format!("database: {e}");
    let total = matching_count(store, q)?;
    let (cond, p) = q.condition();
    let offset = (q.page - 1) * PAGE_ROWS;
    let sql = format!("SELECT t.id, t.submission_id, t.station, t.observer, t.contact, CASE WHEN t.time_utc = '' THEN t.time_local ELSE t.time_utc END, t.clock_source, t.verdict, t.o_c_s, t.excluded_reason {IN_FORCE}{cond} ORDER BY {} LIMIT {PAGE_ROWS} OFFSET {offset}", q.order_sql());
    let mut stmt = store.connection().prepare(&sql).map_err(err)?;
    let rows = stmt
        .query_map(params_from_iter(&p), |r| {
            Ok(TableRow {
                id: r.get(0)?,
                submission_id: r.get(1)?,
                station: r.get(2)?,
                observer: r.get(3)?,
                contact: r.get(4)?,
                time: r.get(5)?,
                clock_source: r.get(6)?,
                verdict: r.get(7)?,
                o_c_s: r.get(8)?,
                excluded: r.get(9)?,
            })
        })
        .map_err(err)?;
    Ok((rows.collect::<Result<Vec<_>, _>>().map_err(err)?, total))
}

/// Timings in force and those of them excluded by the organiser.
///
/// Errors: the database's, as text.
pub fn timing_counts(store: &Store) -> Result<(i64, i64), String> {
    store
        .connection()
        .query_row(
            &format!("SELECT COUNT(*), COALESCE(SUM(t.excluded_reason IS NOT NULL), 0) {IN_FORCE}"),
            [],
            |r| Ok((r.get(0)?, r.get(1)?)),
        )
        .map_err(|e| format!("database: {e}"))
}

/// A choice list of the filter form.
fn choice_list(id: &str, label: &str, choices: &[(&str, &str)], value: &str) -> String {
    let mut s = format!("<div class=\"field\"><label for=\"filter-{id}\">{label}</label><select id=\"filter-{id}\" name=\"{id}\">");
    for (word, text) in choices {
        let selected = if *word == value { " selected" } else { "" };
        let _ = write!(
            s,
            "<option value=\"{word}\"{selected}>{}</option>",
            esc(text)
        );
    }
    s.push_str("</select></div>");
    s
}

/// The filter form: state, search, clock source, viewing, verdict at arrival, order.
fn filters(q: &TableQuery, s: &mut String) {
    let states = [
        ("all", "all"),
        ("in_force", "in force"),
        ("excluded", "excluded by you"),
    ];
    let sorts: Vec<(&str, &str)> = Sort::ALL.iter().map(|(_, w, l)| (*w, *l)).collect();
    let _ = writeln!(s, "<form method=\"get\" action=\"/organiser\" id=\"filters\"><div class=\"row\">{}<div class=\"field\"><label for=\"filter-q\">Search <span class=\"hint\">a part of a station's or an observer's name</span></label><input id=\"filter-q\" name=\"q\" value=\"{}\" size=\"16\"/></div></div><div class=\"row\">{}{}{}{}</div><p class=\"actions\"><button type=\"submit\" id=\"show\">show</button></p></form>",
        choice_list("state", "Timings", &states, q.state.name()),
        esc(&q.search),
        choice_list("clock", "Clock", &CLOCK_CHOICES, &q.clock),
        choice_list("viewing", "Viewing", &VIEWING_CHOICES, &q.viewing),
        choice_list("verdict", "Verdict at arrival", &VERDICT_CHOICES, &q.verdict),
        choice_list("sort", "Order", &sorts, q.sort.name()),
    );
}

/// The page's links: first, previous, next, last.
fn page_links(q: &TableQuery, total: i64, s: &mut String) {
    let last = ((total + PAGE_ROWS - 1) / PAGE_ROWS).max(1);
    let mut links = Vec::new();
    for (label, page, rel) in [
        ("first", 1, "first"),
        ("previous", q.page - 1, "prev"),
        ("next", q.page + 1, "next"),
        ("last", last, "last"),
    ] {
        if (1..=last).contains(&page) && page != q.page {
            links.push(format!(
                "<a rel=\"{rel}\" href=\"{}\">{label}</a>",
                esc(&q.link(page))
            ));
        }
    }
    let _ = writeln!(
        s,
        "<p class=\"pages\">Page {} of {last}: {}</p>",
        q.page,
        links.join(" · ")
    );
}

/// The verdict at arrival and its O - C, as the table shows it.
fn arrival(row: &TableRow) -> String {
    match (&row.verdict, row.o_c_s) {
        (Some(v), Some(x)) => format!("{v}, {x:+.1} s"),
        (Some(v), None) => v.clone(),
        (None, _) => "not recorded".into(),
    }
}

/// The table's section: the filters, "timings 201-400 of 100,000", the bulk exclusion, the
/// rows (each with a box to tick for it, its state and its form), the page links.
pub fn table_html(
    q: &TableQuery,
    (rows, total): (&[TableRow], i64),
    solved: &Solved,
    csrf: &str,
) -> String {
    let mut s = String::from("<h2 id=\"every-timing\">Every timing</h2>\n");
    filters(q, &mut s);
    let first = (q.page - 1) * PAGE_ROWS + 1;
    let shown = if rows.is_empty() {
        format!("No timing on this page; {} match.", count(total))
    } else {
        let last = first + rows.len() as i64 - 1;
        format!(
            "Timings {}-{} of {}.",
            count(first),
            count(last),
            count(total)
        )
    };
    let _ = writeln!(s, "<p id=\"shown\">{shown}</p>");
    s.push_str(&super::triage::bulk_form(q, total, csrf));
    let mut t = String::from("<table id=\"rows\"><tr><th scope=\"col\">tick</th><th scope=\"col\">id</th><th scope=\"col\">submission</th><th scope=\"col\">station</th><th scope=\"col\">observer</th><th scope=\"col\">contact</th><th scope=\"col\">time</th><th scope=\"col\">clock</th><th scope=\"col\">at arrival</th><th scope=\"col\">state</th><th scope=\"col\">why</th><th scope=\"col\">action</th></tr>\n");
    for row in rows {
        let id = row.id;
        let (state, why) = match (&row.excluded, solved.states.get(&id)) {
            (Some(r), _) => ("excluded".to_string(), format!("by the organiser: {r}")),
            (None, Some((state, why))) if state != "excluded" => (state.clone(), why.clone()),
            (None, _) => (
                "pending".to_string(),
                "arrived after the solution was computed".to_string(),
            ),
        };
        let tick = format!("<input type=\"checkbox\" form=\"bulk\" name=\"timing\" value=\"{id}\" id=\"tick-{id}\"/><label class=\"vh\" for=\"tick-{id}\">tick timing {id}</label>");
        let action = super::organiser::action_form(csrf, id, row.excluded.is_some());
        let _ = writeln!(t, "<tr><td>{tick}</td><td>{id}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{action}</td></tr>", row.submission_id, esc(&row.station), esc(&row.observer), esc(&row.contact), esc(&row.time), esc(&row.clock_source), esc(&arrival(row)), esc(&state), esc(&why));
    }
    t.push_str("</table>\n");
    s.push_str(&super::pages::scroll_box("Every timing", &t));
    page_links(q, total, &mut s);
    s
}

/// A count with thousands separators: 100,000.
fn count(n: i64) -> String {
    let digits = n.unsigned_abs().to_string();
    let mut out = String::new();
    for (k, c) in digits.chars().enumerate() {
        if k > 0 && (digits.len() - k) % 3 == 0 {
            out.push(',');
        }
        out.push(c);
    }
    if n < 0 {
        format!("-{out}")
    } else {
        out
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn counts_have_thousands_separators() {
        assert_eq!(count(0), "0");
        assert_eq!(count(999), "999");
        assert_eq!(count(1000), "1,000");
        assert_eq!(count(100_000), "100,000");
        assert_eq!(count(1_234_567), "1,234,567");
    }
}
