//! The organiser's table of every timing in force, a page at a time: `GET /organiser?page=N&
//! state=in_force|excluded|all&station=NAME`, read with SQL `LIMIT`/`OFFSET` and filters (so
//! that a campaign of 100,000 timings is never read whole for a page), each row with its state
//! in the latest solution and the form that excludes or restores it.

use super::cache::Solved;
use super::store::Store;
use crate::render::svg::esc;
use rusqlite::params_from_iter;
use std::collections::HashMap;
use std::fmt::Write;

/// Rows on one page of the table.
pub const PAGE_ROWS: i64 = 200;

/// Which timings the table lists.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum StateFilter {
    /// Every timing of the submissions in force.
    All,
    /// Those not excluded by the organiser.
    InForce,
    /// Those excluded by the organiser.
    Excluded,
}

impl StateFilter {
    fn name(self) -> &'static str {
        match self {
            StateFilter::All => "all",
            StateFilter::InForce => "in_force",
            StateFilter::Excluded => "excluded",
        }
    }

    fn sql(self) -> &'static str {
        match self {
            StateFilter::All => "",
            StateFilter::InForce => " AND t.excluded_reason IS NULL",
            StateFilter::Excluded => " AND t.excluded_reason IS NOT NULL",
        }
    }
}

/// The page asked for: its number (from 1), the state and the station's name (a part of it,
/// any case; empty for every station).
#[derive(Clone, Debug, PartialEq)]
pub struct TableQuery {
    /// Page number, from 1.
    pub page: i64,
    /// Which timings.
    pub state: StateFilter,
    /// A part of the station's name.
    pub station: String,
}

impl TableQuery {
    /// The page asked for in a query string; page 1 of every timing by default.
    pub fn from_query(q: &HashMap<String, String>) -> TableQuery {
        let state = match q.get("state").map(String::as_str) {
            Some("in_force") => StateFilter::InForce,
            Some("excluded") => StateFilter::Excluded,
            _ => StateFilter::All,
        };
        TableQuery {
            page: q
                .get("page")
                .and_then(|p| p.parse::<i64>().ok())
                .unwrap_or(1)
                .clamp(1, i64::MAX / PAGE_ROWS),
            state,
            station: q.get("station").map_or(String::new(), |s| s.trim().into()),
        }
    }

    /// The address of page `page` with the same filters.
    fn link(&self, page: i64) -> String {
        let pairs = [
            ("page", page.to_string()),
            ("state", self.state.name().to_string()),
            ("station", self.station.clone()),
        ];
        format!(
            "/organiser?{}",
            serde_urlencoded::to_string(pairs).unwrap_or_default()
        )
    }
}

/// One row of the table: timing id, station, contact, time as sent, the organiser's reason
/// for excluding it.
pub type TableRow = (i64, String, String, String, Option<String>);

const IN_FORCE: &str = "FROM timings t JOIN submissions s ON s.id = t.submission_id WHERE s.status = 'accepted' AND s.superseded_by IS NULL";

fn station_clause(q: &TableQuery) -> (&'static str, Vec<String>) {
    if q.station.is_empty() {
        ("", Vec::new())
    } else {
        (
            " AND instr(lower(t.station), lower(?1)) > 0",
            vec![q.station.clone()],
        )
    }
}

/// One page of the table and how many timings match the filters.
///
/// Errors: the database's, as text.
pub fn page_of(store: &Store, q: &TableQuery) -> Result<(Vec<TableRow>, i64), String> {
    let err = |e: rusqlite::Error| format!("database: {e}");
    let (station, p) = station_clause(q);
    let filter = format!("{IN_FORCE}{}{station}", q.state.sql());
    let total: i64 = store
        .connection()
        .query_row(
            &format!("SELECT COUNT(*) {filter}"),
            params_from_iter(&p),
            |r| r.get(0),
        )
        .map_err(err)?;
    let offset = (q.page - 1) * PAGE_ROWS;
    let sql = format!("SELECT t.id, t.station, t.contact, CASE WHEN t.time_utc = '' THEN t.time_local ELSE t.time_utc END, t.excluded_reason {filter} ORDER BY t.id LIMIT {PAGE_ROWS} OFFSET {offset}");
    let mut stmt = store.connection().prepare(&sql).map_err(err)?;
    let rows = stmt
        .query_map(params_from_iter(&p), |r| {
            Ok((r.get(0)?, r.get(1)?, r.get(2)?, r.get(3)?, r.get(4)?))
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

/// The filter form: state and station.
fn filters(q: &TableQuery, s: &mut String) {
    let option = |f: StateFilter, label: &str| {
        let selected = if q.state == f { " selected" } else { "" };
        format!("<option value=\"{}\"{selected}>{label}</option>", f.name())
    };
    let _ = writeln!(s, "<form method=\"get\" action=\"/organiser\" id=\"filters\"><div class=\"row\"><div class=\"field\"><label for=\"filter-state\">Timings</label><select id=\"filter-state\" name=\"state\">{}{}{}</select></div><div class=\"field\"><label for=\"filter-station\">Station <span class=\"hint\">a part of its name</span></label><input id=\"filter-station\" name=\"station\" value=\"{}\" size=\"16\"/></div></div><p class=\"actions\"><button type=\"submit\">show</button></p></form>", option(StateFilter::All, "all"), option(StateFilter::InForce, "in force"), option(StateFilter::Excluded, "excluded by you"), esc(&q.station));
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

/// The table's section: the filters, "timings 201-400 of 100,000", the rows with their
/// states and forms, the page links.
pub fn table_html(
    q: &TableQuery,
    (rows, total): (&[TableRow], i64),
    solved: &Solved,
    csrf: &str,
) -> String {
    let mut s = String::from("<h2>Every timing</h2>\n");
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
    let mut t = String::from("<table id=\"rows\"><tr><th scope=\"col\">id</th><th scope=\"col\">station</th><th scope=\"col\">contact</th><th scope=\"col\">time</th><th scope=\"col\">state</th><th scope=\"col\">why</th><th scope=\"col\">action</th></tr>\n");
    for (id, station, contact, time, excluded) in rows {
        let (state, why) = match (excluded, solved.states.get(id)) {
            (Some(r), _) => ("excluded".to_string(), format!("by the organiser: {r}")),
            (None, Some((state, why))) if state != "excluded" => (state.clone(), why.clone()),
            (None, _) => (
                "pending".to_string(),
                "arrived after the solution was computed".to_string(),
            ),
        };
        let action = super::organiser::action_form(csrf, *id, excluded.is_some());
        let _ = writeln!(t, "<tr><td>{id}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{action}</td></tr>", esc(station), esc(contact), esc(time), esc(&state), esc(&why));
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

    #[test]
    fn the_query_is_read_with_defaults() {
        let q: HashMap<String, String> =
            [("page", "3"), ("state", "excluded"), ("station", " Lima ")]
                .into_iter()
                .map(|(k, v)| (k.to_string(), v.to_string()))
                .collect();
        let t = TableQuery::from_query(&q);
        assert_eq!(
            (t.page, t.state, t.station.as_str()),
            (3, StateFilter::Excluded, "Lima")
        );
        let d = TableQuery::from_query(&HashMap::new());
        assert_eq!((d.page, d.state), (1, StateFilter::All));
        assert!(d.link(2).contains("page=2"));
    }
}
