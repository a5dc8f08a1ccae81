//! What the organiser's table shows: the page, the state (in force, excluded), how the timings
//! were made (clock source, viewing), the verdict they had at arrival, a search of station
//! names and observers, and the order (station, time, |O - C|, arrival). Read from the query
//! string `GET /organiser?page=N&state=..&clock=..&viewing=..&verdict=..&q=..&sort=..`
//! (`station=` is read as `q=`, as earlier addresses wrote it), and turned into one SQL
//! condition with its parameters, so that the table is filtered, ordered and paged by the
//! database (a campaign of 100,000 timings is never read whole for a page). The same
//! condition picks the timings a bulk exclusion of "every timing the filters show" excludes.

use std::collections::HashMap;

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
    /// The word of the query string.
    pub fn name(self) -> &'static str {
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

/// The order of the table's rows.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Sort {
    /// In order of arrival (the default).
    Submitted,
    /// By station name, then arrival.
    Station,
    /// By the time as sent.
    Time,
    /// By |O - C| at arrival, largest first (those without one last).
    AbsOC,
}

impl Sort {
    /// Every order, with its query word and its label.
    pub const ALL: [(Sort, &'static str, &'static str); 4] = [
        (Sort::Submitted, "submitted", "order of arrival"),
        (Sort::Station, "station", "station"),
        (Sort::Time, "time", "time"),
        (Sort::AbsOC, "o_c", "|O - C|, largest first"),
    ];

    /// The word of the query string.
    pub fn name(self) -> &'static str {
        Self::ALL
            .iter()
            .find(|(s, _, _)| *s == self)
            .map_or("submitted", |(_, n, _)| n)
    }

    fn sql(self) -> &'static str {
        match self {
            Sort::Submitted => "t.id",
            Sort::Station => "lower(t.station), t.id",
            Sort::Time => "CASE WHEN t.time_utc = '' THEN t.time_local ELSE t.time_utc END, t.id",
            Sort::AbsOC => "t.o_c_s IS NULL, abs(t.o_c_s) DESC, t.id",
        }
    }
}

/// The choice lists of the filters: (query word, label). The empty word is "any"; `none`
/// is "not given" (or, for the verdict, not recorded).
pub const CLOCK_CHOICES: [(&str, &str); 7] = [
    ("", "any"),
    ("gps", "GPS"),
    ("radio", "radio"),
    ("network", "network"),
    ("phone", "phone"),
    ("other", "other"),
    ("none", "not given"),
];

/// See [`CLOCK_CHOICES`].
pub const VIEWING_CHOICES: [(&str, &str); 4] = [
    ("", "any"),
    ("filter", "filter"),
    ("projection", "projection"),
    ("none", "not given"),
];

/// See [`CLOCK_CHOICES`]: the feedback's verdict when the timing arrived.
pub const VERDICT_CHOICES: [(&str, &str); 5] = [
    ("", "any"),
    ("fits", "fits"),
    ("doubtful", "doubtful"),
    ("rejected", "rejected"),
    ("none", "not recorded"),
];

/// The page asked for.
#[derive(Clone, Debug, PartialEq)]
pub struct TableQuery {
    /// Page number, from 1.
    pub page: i64,
    /// Which timings.
    pub state: StateFilter,
    /// A part of the station's name or of the observer's (any case; empty: every timing).
    pub search: String,
    /// Clock source word of [`CLOCK_CHOICES`].
    pub clock: String,
    /// Viewing word of [`VIEWING_CHOICES`].
    pub viewing: String,
    /// Verdict word of [`VERDICT_CHOICES`].
    pub verdict: String,
    /// The order.
    pub sort: Sort,
}

/// The word of `choices` that `value` names (any case), or "" (any) for another.
fn choice(choices: &[(&str, &str)], value: Option<&String>) -> String {
    let v = value.map_or("", |v| v.trim());
    choices
        .iter()
        .find(|(w, _)| w.eq_ignore_ascii_case(v))
        .map_or(String::new(), |(w, _)| (*w).to_string())
}

/// Rows on one page of the table.
pub const PAGE_ROWS: i64 = 200;

impl TableQuery {
    /// The page asked for in a query string (or a posted form); page 1 of every timing, in
    /// order of arrival, by default. Unknown words are read as "any".
    pub fn from_query(q: &HashMap<String, String>) -> TableQuery {
        let state = match q.get("state").map(String::as_str) {
            Some("in_force") => StateFilter::InForce,
            Some("excluded") => StateFilter::Excluded,
            _ => StateFilter::All,
        };
        let sort = q.get("sort").map_or(Sort::Submitted, |w| {
            Sort::ALL
                .iter()
                .find(|(_, n, _)| n == w)
                .map_or(Sort::Submitted, |(s, _, _)| *s)
        });
        let search = q
            .get("q")
            .filter(|s| !s.trim().is_empty())
            .or_else(|| q.get("station"))
            .map_or(String::new(), |s| s.trim().into());
        TableQuery {
            page: q
                .get("page")
                .and_then(|p| p.parse::<i64>().ok())
                .unwrap_or(1)
                .clamp(1, i64::MAX / PAGE_ROWS),
            state,
            search,
            clock: choice(&CLOCK_CHOICES, q.get("clock")),
            viewing: choice(&VIEWING_CHOICES, q.get("viewing")),
            verdict: choice(&VERDICT_CHOICES, q.get("verdict")),
            sort,
        }
    }

    /// The filters and the order as (name, value) pairs, without the page.
    pub fn pairs(&self) -> Vec<(&'static str, String)> {
        vec![
            ("state", self.state.name().to_string()),
            ("q", self.search.clone()),
            ("clock", self.clock.clone()),
            ("viewing", self.viewing.clone()),
            ("verdict", self.verdict.clone()),
            ("sort", self.sort.name().to_string()),
        ]
    }

    /// The address of page `page` with the same filters and order.
    pub fn link(&self, page: i64) -> String {
        let mut pairs = vec![("page", page.to_string())];
        pairs.extend(self.pairs());
        format!(
            "/organiser?{}",
            serde_urlencoded::to_string(pairs).unwrap_or_default()
        )
    }

    /// The SQL condition (to follow `WHERE` of the timings in force, each clause starting with
    /// ` AND`) and its parameters, numbered from `?1`.
    pub fn condition(&self) -> (String, Vec<String>) {
        let mut sql = String::from(self.state.sql());
        let mut p: Vec<String> = Vec::new();
        if !self.search.is_empty() {
            p.push(self.search.clone());
            let k = p.len();
            sql.push_str(&format!(" AND (instr(lower(t.station), lower(?{k})) > 0 OR instr(lower(t.observer), lower(?{k})) > 0)"));
        }
        for (column, word) in [("clock_source", &self.clock), ("viewing", &self.viewing)] {
            match word.as_str() {
                "" => {}
                "none" => sql.push_str(&format!(" AND trim(t.{column}) = ''")),
                w => {
                    p.push(w.to_string());
                    sql.push_str(&format!(" AND lower(trim(t.{column})) = ?{}", p.len()));
                }
            }
        }
        match self.verdict.as_str() {
            "" => {}
            "none" => sql.push_str(" AND t.verdict IS NULL"),
            w => {
                p.push(w.to_string());
                sql.push_str(&format!(" AND t.verdict = ?{}", p.len()));
            }
        }
        (sql, p)
    }

    /// The `ORDER BY` of the table.
    pub fn order_sql(&self) -> &'static str {
        self.sort.sql()
    }

    /// Whether any filter narrows the table (the state, the search, the metadata, the verdict).
    pub fn narrows(&self) -> bool {
        self.state != StateFilter::All
            || !self.search.is_empty()
            || !self.clock.is_empty()
            || !self.viewing.is_empty()
            || !self.verdict.is_empty()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn query(pairs: &[(&str, &str)]) -> TableQuery {
        let q: HashMap<String, String> = pairs
            .iter()
            .map(|(k, v)| (k.to_string(), v.to_string()))
            .collect();
        TableQuery::from_query(&q)
    }

    #[test]
    fn the_query_is_read_with_defaults() {
        let t = query(&[("page", "3"), ("state", "excluded"), ("station", " Lima ")]);
        assert_eq!(
            (t.page, t.state, t.search.as_str()),
            (3, StateFilter::Excluded, "Lima")
        );
        let d = query(&[]);
        assert_eq!(
            (d.page, d.state, d.sort),
            (1, StateFilter::All, Sort::Submitted)
        );
        assert!(!d.narrows());
        assert!(d.link(2).contains("page=2"));
        assert_eq!(d.condition(), (String::new(), Vec::new()));
    }

    #[test]
    fn filters_become_one_parametrised_condition() {
        let t = query(&[
            ("q", "o'Brien"),
            ("clock", "PHONE"),
            ("viewing", "none"),
            ("verdict", "doubtful"),
            ("sort", "o_c"),
            ("state", "in_force"),
        ]);
        let (sql, p) = t.condition();
        assert_eq!(p, ["o'Brien", "phone", "doubtful"]);
        assert!(!sql.contains("Brien"), "{sql}");
        assert!(sql.contains("lower(trim(t.clock_source)) = ?2"), "{sql}");
        assert!(sql.contains("trim(t.viewing) = ''"), "{sql}");
        assert!(sql.contains("t.verdict = ?3"), "{sql}");
        assert_eq!(t.sort, Sort::AbsOC);
        assert!(t.order_sql().contains("abs(t.o_c_s) DESC"));
        let link = t.link(1);
        assert!(
            link.contains("clock=phone") && link.contains("sort=o_c"),
            "{link}"
        );
        // Unknown words are "any", never SQL.
        let u = query(&[
            ("clock", "x' OR 1=1 --"),
            ("sort", "drop"),
            ("verdict", "maybe"),
        ]);
        assert_eq!(
            (u.clock.as_str(), u.verdict.as_str(), u.sort),
            ("", "", Sort::Submitted)
        );
    }
}
