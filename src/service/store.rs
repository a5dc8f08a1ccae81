//! The campaign's database: every submission stored raw, with its time of arrival and a
//! content hash, before it is parsed; its timings as submitted (text, so that nothing a
//! participant sent is lost or altered); exclusions and corrections kept in an audit trail.
//! SQLite through rusqlite (the library bundled), in WAL mode with synchronous commits, so
//! an acknowledged submission survives a crash of the process.
//!
//! References: SQLite's documentation of write-ahead logging and `PRAGMA synchronous = FULL`
//! (sqlite.org, "Write-Ahead Logging" and "PRAGMA statements").

use rusqlite::{params, Connection, OptionalExtension};
use sha2::{Digest, Sha256};
use std::path::Path;

/// Errors of the store, as text for the server's messages.
pub type StoreResult<T> = Result<T, String>;

fn db_err(e: rusqlite::Error) -> String {
    format!("database: {e}")
}

/// The fields of one timing as submitted (text, unparsed).
#[derive(Clone, Debug, Default, PartialEq)]
pub struct TimingFields {
    /// Station name.
    pub station: String,
    /// Latitude, degrees, as sent.
    pub latitude: String,
    /// Longitude, degrees east, as sent.
    pub longitude: String,
    /// Elevation, metres, as sent.
    pub elevation_m: String,
    /// Contact, as sent (1-4 or I-IV).
    pub contact: String,
    /// Time UTC, as sent.
    pub time_utc: String,
    /// Standard uncertainty, seconds, as sent.
    pub sigma_s: String,
    /// Clock reading in local solar time, as sent.
    pub time_local: String,
    /// `apparent` or `mean`.
    pub local_time: String,
    /// `civil` or `astronomical`.
    pub day_reckoning: String,
    /// The longitude's uncertainty, degrees or `unknown`.
    pub longitude_sigma_deg: String,
    /// Who timed it.
    pub observer: String,
    /// `gregorian` or `julian`.
    pub calendar: String,
    /// The prime meridian of the longitude.
    pub meridian: String,
    /// The meridian a local clock was kept to.
    pub time_meridian: String,
    /// A timed interval (with a pair of contacts).
    pub duration: String,
    /// `geometric`, `thread` or `touch`.
    pub contact_judged: String,
    /// `gps`, `radio`, `network`, `phone` or `other`.
    pub clock_source: String,
    /// The instrument (free text).
    pub instrument: String,
    /// The instrument's aperture, millimetres, as sent.
    pub aperture_mm: String,
    /// `filter` or `projection`.
    pub viewing: String,
    /// The participant's notes (free text).
    pub notes: String,
    /// The contact exactly as the participant wrote it (`II`, `c2`), for the feedback to echo;
    /// neither stored nor exported (empty for a timing read back from the store).
    pub contact_as_written: String,
}

/// The columns of the observations file the store exports, in order (the timings table has
/// one column of the same name each).
pub const EXPORT_COLUMNS: [&str; 22] = [
    "station",
    "latitude",
    "longitude",
    "elevation_m",
    "contact",
    "time_utc",
    "sigma_s",
    "time_local",
    "local_time",
    "day_reckoning",
    "longitude_sigma_deg",
    "observer",
    "calendar",
    "meridian",
    "time_meridian",
    "duration",
    "contact_judged",
    "clock_source",
    "instrument",
    "aperture_mm",
    "viewing",
    "notes",
];

impl TimingFields {
    /// The values in the order of [`EXPORT_COLUMNS`] (the store's columns and the export's).
    pub fn values(&self) -> [&str; 22] {
        [
            &self.station,
            &self.latitude,
            &self.longitude,
            &self.elevation_m,
            &self.contact,
            &self.time_utc,
            &self.sigma_s,
            &self.time_local,
            &self.local_time,
            &self.day_reckoning,
            &self.longitude_sigma_deg,
            &self.observer,
            &self.calendar,
            &self.meridian,
            &self.time_meridian,
            &self.duration,
            &self.contact_judged,
            &self.clock_source,
            &self.instrument,
            &self.aperture_mm,
            &self.viewing,
            &self.notes,
        ]
    }

    /// The fields from their values in the order of [`EXPORT_COLUMNS`].
    fn from_values(mut v: Vec<String>) -> TimingFields {
        v.resize(EXPORT_COLUMNS.len(), String::new());
        let mut it = v.into_iter();
        let mut next = || it.next().unwrap_or_default();
        TimingFields {
            station: next(),
            latitude: next(),
            longitude: next(),
            elevation_m: next(),
            contact: next(),
            time_utc: next(),
            sigma_s: next(),
            time_local: next(),
            local_time: next(),
            day_reckoning: next(),
            longitude_sigma_deg: next(),
            observer: next(),
            calendar: next(),
            meridian: next(),
            time_meridian: next(),
            duration: next(),
            contact_judged: next(),
            clock_source: next(),
            instrument: next(),
            aperture_mm: next(),
            viewing: next(),
            notes: next(),
            contact_as_written: String::new(),
        }
    }
}

/// A stored timing with its identity and state.
#[derive(Clone, Debug, PartialEq)]
pub struct StoredTiming {
    /// Row id.
    pub id: i64,
    /// The submission it came with.
    pub submission_id: i64,
    /// The fields as submitted.
    pub fields: TimingFields,
    /// Excluded by the organiser, with the reason.
    pub excluded: Option<String>,
}

/// One entry of the audit trail: (time UTC, action, timing id, reason).
pub type AuditEntry = (String, String, Option<i64>, Option<String>);

/// A hex SHA-256 of the bytes.
pub fn content_hash(bytes: &[u8]) -> String {
    Sha256::digest(bytes)
        .iter()
        .map(|b| format!("{b:02x}"))
        .collect()
}

/// The database of one campaign.
pub struct Store {
    conn: Connection,
}

const SCHEMA: &str = "
CREATE TABLE IF NOT EXISTS submissions (
    id INTEGER PRIMARY KEY,
    received_utc TEXT NOT NULL,
    content_hash TEXT NOT NULL,
    body BLOB NOT NULL,
    status TEXT NOT NULL,
    error TEXT,
    edit_key TEXT,
    supersedes INTEGER,
    superseded_by INTEGER
);
CREATE INDEX IF NOT EXISTS submissions_hash ON submissions(content_hash);
CREATE TABLE IF NOT EXISTS timings (
    id INTEGER PRIMARY KEY,
    submission_id INTEGER NOT NULL,
    station TEXT NOT NULL, latitude TEXT NOT NULL, longitude TEXT NOT NULL,
    elevation_m TEXT NOT NULL, contact TEXT NOT NULL, time_utc TEXT NOT NULL,
    sigma_s TEXT NOT NULL, time_local TEXT NOT NULL, local_time TEXT NOT NULL,
    day_reckoning TEXT NOT NULL, longitude_sigma_deg TEXT NOT NULL,
    observer TEXT NOT NULL DEFAULT '', calendar TEXT NOT NULL DEFAULT '',
    meridian TEXT NOT NULL DEFAULT '', time_meridian TEXT NOT NULL DEFAULT '',
    duration TEXT NOT NULL DEFAULT '', contact_judged TEXT NOT NULL DEFAULT '',
    excluded_reason TEXT
);
CREATE INDEX IF NOT EXISTS timings_submission ON timings(submission_id);
CREATE TABLE IF NOT EXISTS audit (
    id INTEGER PRIMARY KEY,
    at_utc TEXT NOT NULL,
    action TEXT NOT NULL,
    timing_id INTEGER,
    reason TEXT
);
";

/// Add to the timings table of a database made by an earlier version every column of
/// [`EXPORT_COLUMNS`] it lacks (empty text in the rows it holds).
fn add_missing_columns(conn: &Connection) -> StoreResult<()> {
    let have: Vec<String> = conn
        .prepare("SELECT name FROM pragma_table_info('timings')")
        .and_then(|mut stmt| {
            stmt.query_map([], |r| r.get::<_, String>(0))?
                .collect::<Result<Vec<_>, _>>()
        })
        .map_err(db_err)?;
    for col in EXPORT_COLUMNS
        .iter()
        .filter(|c| !have.iter().any(|h| h == *c))
    {
        conn.execute_batch(&format!(
            "ALTER TABLE timings ADD COLUMN {col} TEXT NOT NULL DEFAULT ''"
        ))
        .map_err(db_err)?;
    }
    Ok(())
}

/// The time now, UTC, ISO 8601 to the millisecond.
pub(super) fn now_utc() -> String {
    let since = std::time::SystemTime::now()
        .duration_since(std::time::UNIX_EPOCH)
        .unwrap_or_default();
    let secs = i64::try_from(since.as_secs()).unwrap_or(0);
    chrono::DateTime::from_timestamp(secs, since.subsec_nanos())
        .map(|t| t.format("%Y-%m-%dT%H:%M:%S%.3fZ").to_string())
        .unwrap_or_default()
}

impl Store {
    /// Open (or create) the database at `path`, in WAL mode with synchronous commits.
    pub fn open(path: &Path) -> StoreResult<Store> {
        let conn = Connection::open(path).map_err(|e| format!("{}: {e}", path.display()))?;
        conn.execute_batch("PRAGMA journal_mode = WAL; PRAGMA synchronous = FULL;")
            .map_err(db_err)?;
        conn.execute_batch(SCHEMA).map_err(db_err)?;
        add_missing_columns(&conn)?;
        super::store_triage::migrate(&conn)?;
        super::store_registrations::create_table(&conn)?;
        Ok(Store { conn })
    }

    /// The connection, for the read-only queries of other modules (the organiser's table).
    pub(crate) fn connection(&self) -> &Connection {
        &self.conn
    }

    /// The database's file, `None` for one in memory.
    pub fn file(&self) -> Option<String> {
        self.conn.path().filter(|p| !p.is_empty()).map(String::from)
    }

    /// Store a submission's raw body before anything is parsed; returns its id and, where an
    /// identical body (same hash) is already in force, that submission's id.
    pub fn store_raw(&mut self, body: &[u8]) -> StoreResult<(i64, Option<i64>)> {
        let hash = content_hash(body);
        let earlier: Option<i64> = self
            .conn
            .query_row(
                "SELECT id FROM submissions WHERE content_hash = ?1 AND status = 'accepted' AND superseded_by IS NULL ORDER BY id LIMIT 1",
                params![hash],
                |r| r.get(0),
            )
            .optional()
            .map_err(db_err)?;
        self.conn
            .execute(
                "INSERT INTO submissions (received_utc, content_hash, body, status) VALUES (?1, ?2, ?3, 'received')",
                params![now_utc(), hash, body],
            )
            .map_err(db_err)?;
        Ok((self.conn.last_insert_rowid(), earlier))
    }

    /// Mark a stored submission unreadable (or a duplicate), with the reason.
    pub fn mark(&mut self, id: i64, status: &str, error: Option<&str>) -> StoreResult<()> {
        self.conn
            .execute(
                "UPDATE submissions SET status = ?2, error = ?3 WHERE id = ?1",
                params![id, status, error],
            )
            .map_err(db_err)?;
        Ok(())
    }

    /// Accept a stored submission with its timings in one transaction; returns the timings'
    /// ids. `supersedes` names the submission this one corrects (kept, marked superseded).
    pub fn accept(
        &mut self,
        id: i64,
        edit_key: &str,
        timings: &[TimingFields],
        supersedes: Option<i64>,
    ) -> StoreResult<Vec<i64>> {
        let tx = self.conn.transaction().map_err(db_err)?;
        tx.execute(
            "UPDATE submissions SET status = 'accepted', edit_key = ?2, supersedes = ?3 WHERE id = ?1",
            params![id, edit_key, supersedes],
        )
        .map_err(db_err)?;
        if let Some(old) = supersedes {
            tx.execute(
                "UPDATE submissions SET superseded_by = ?2 WHERE id = ?1",
                params![old, id],
            )
            .map_err(db_err)?;
            tx.execute(
                "INSERT INTO audit (at_utc, action, timing_id, reason) VALUES (?1, 'corrected', NULL, ?2)",
                params![now_utc(), format!("submission {old} corrected by submission {id}")],
            )
            .map_err(db_err)?;
        }
        let mut ids = Vec::with_capacity(timings.len());
        for t in timings {
            let placeholders: Vec<String> = (2..=EXPORT_COLUMNS.len() + 1)
                .map(|k| format!("?{k}"))
                .collect();
            let sql = format!(
                "INSERT INTO timings (submission_id, {}) VALUES (?1, {})",
                EXPORT_COLUMNS.join(", "),
                placeholders.join(", ")
            );
            let values: Vec<rusqlite::types::Value> = std::iter::once(id.into())
                .chain(t.values().iter().map(|v| v.to_string().into()))
                .collect();
            tx.execute(&sql, rusqlite::params_from_iter(values))
                .map_err(db_err)?;
            ids.push(tx.last_insert_rowid());
        }
        tx.commit().map_err(db_err)?;
        Ok(ids)
    }

    /// A submission's edit key, whether it is in force, and its timings' fields.
    pub fn submission(&self, id: i64) -> StoreResult<Option<(String, bool, Vec<TimingFields>)>> {
        let head: Option<(Option<String>, Option<i64>, String)> = self
            .conn
            .query_row(
                "SELECT edit_key, superseded_by, status FROM submissions WHERE id = ?1",
                params![id],
                |r| Ok((r.get(0)?, r.get(1)?, r.get(2)?)),
            )
            .optional()
            .map_err(db_err)?;
        let Some((Some(key), superseded, status)) = head else {
            return Ok(None);
        };
        let timings = self
            .timings_where("t.submission_id = ?1", params![id])?
            .into_iter()
            .map(|t| t.fields)
            .collect();
        Ok(Some((
            key,
            superseded.is_none() && status == "accepted",
            timings,
        )))
    }

    fn timings_where(
        &self,
        clause: &str,
        p: impl rusqlite::Params,
    ) -> StoreResult<Vec<StoredTiming>> {
        let cols: Vec<String> = EXPORT_COLUMNS.iter().map(|c| format!("t.{c}")).collect();
        let n = EXPORT_COLUMNS.len();
        let sql = format!("SELECT t.id, t.submission_id, {}, t.excluded_reason FROM timings t JOIN submissions s ON s.id = t.submission_id WHERE {clause} ORDER BY t.id", cols.join(", "));
        let mut stmt = self.conn.prepare(&sql).map_err(db_err)?;
        let rows = stmt
            .query_map(p, |r| {
                let values = (2..n + 2)
                    .map(|k| r.get::<_, String>(k))
                    .collect::<Result<Vec<_>, _>>()?;
                Ok(StoredTiming {
                    id: r.get(0)?,
                    submission_id: r.get(1)?,
                    fields: TimingFields::from_values(values),
                    excluded: r.get(n + 2)?,
                })
            })
            .map_err(db_err)?;
        rows.collect::<Result<Vec<_>, _>>().map_err(db_err)
    }

    /// Every timing of the submissions in force (not superseded), excluded ones included.
    pub fn timings_in_force(&self) -> StoreResult<Vec<StoredTiming>> {
        self.timings_where(
            "s.status = 'accepted' AND s.superseded_by IS NULL",
            params![],
        )
    }

    /// Exclude (with a reason) or restore a timing; the audit trail keeps each action.
    pub fn set_excluded(&mut self, timing_id: i64, reason: Option<&str>) -> StoreResult<bool> {
        let tx = self.conn.transaction().map_err(db_err)?;
        let n = tx
            .execute(
                "UPDATE timings SET excluded_reason = ?2 WHERE id = ?1",
                params![timing_id, reason],
            )
            .map_err(db_err)?;
        if n == 1 {
            let action = if reason.is_some() {
                "excluded"
            } else {
                "restored"
            };
            tx.execute(
                "INSERT INTO audit (at_utc, action, timing_id, reason) VALUES (?1, ?2, ?3, ?4)",
                params![now_utc(), action, timing_id, reason],
            )
            .map_err(db_err)?;
        }
        tx.commit().map_err(db_err)?;
        Ok(n == 1)
    }

    /// Submissions by status: (accepted and in force, all stored, unreadable).
    pub fn counts(&self) -> StoreResult<(i64, i64, i64)> {
        let q = |sql: &str| -> StoreResult<i64> {
            self.conn.query_row(sql, [], |r| r.get(0)).map_err(db_err)
        };
        Ok((
            q("SELECT COUNT(*) FROM submissions WHERE status = 'accepted' AND superseded_by IS NULL")?,
            q("SELECT COUNT(*) FROM submissions")?,
            q("SELECT COUNT(*) FROM submissions WHERE status = 'unreadable'")?,
        ))
    }

    /// Unreadable submissions: (id, time of arrival, reason), newest first, at most `limit`.
    pub fn unreadable(&self, limit: i64) -> StoreResult<Vec<(i64, String, String)>> {
        let mut stmt = self
            .conn
            .prepare("SELECT id, received_utc, COALESCE(error, '') FROM submissions WHERE status = 'unreadable' ORDER BY id DESC LIMIT ?1")
            .map_err(db_err)?;
        let rows = stmt
            .query_map(params![limit], |r| Ok((r.get(0)?, r.get(1)?, r.get(2)?)))
            .map_err(db_err)?;
        rows.collect::<Result<Vec<_>, _>>().map_err(db_err)
    }

    /// The audit trail, newest first, at most `limit` entries.
    pub fn audit(&self, limit: i64) -> StoreResult<Vec<AuditEntry>> {
        let mut stmt = self
            .conn
            .prepare(
                "SELECT at_utc, action, timing_id, reason FROM audit ORDER BY id DESC LIMIT ?1",
            )
            .map_err(db_err)?;
        let rows = stmt
            .query_map(params![limit], |r| {
                Ok((r.get(0)?, r.get(1)?, r.get(2)?, r.get(3)?))
            })
            .map_err(db_err)?;
        rows.collect::<Result<Vec<_>, _>>().map_err(db_err)
    }

    /// The content hashes of the accepted submissions, in order of arrival.
    pub fn accepted_hashes(&self) -> StoreResult<Vec<String>> {
        let mut stmt = self
            .conn
            .prepare("SELECT content_hash FROM submissions WHERE status = 'accepted' ORDER BY id")
            .map_err(db_err)?;
        let rows = stmt.query_map([], |r| r.get(0)).map_err(db_err)?;
        rows.collect::<Result<Vec<_>, _>>().map_err(db_err)
    }

    /// The database's own integrity check ("ok" when sound).
    pub fn integrity_check(&self) -> StoreResult<String> {
        self.conn
            .query_row("PRAGMA integrity_check", [], |r| r.get(0))
            .map_err(db_err)
    }
}

/// The export's columns that hold numbers: a plain number there (`-33.9`) is written as it
/// is; any other cell beginning with a formula character is written with a leading `'`.
const NUMERIC_COLUMNS: [&str; 7] = [
    "aperture_mm",
    "latitude",
    "longitude",
    "elevation_m",
    "sigma_s",
    "longitude_sigma_deg",
    "meridian",
];

/// The timings in force and not excluded as an observations file that `reduce` reads, each
/// field CSV-quoted; returns the text and the timing id of each data line (line k + 2).
pub fn export_csv(timings: &[StoredTiming]) -> (String, Vec<i64>) {
    let mut s = EXPORT_COLUMNS.join(",");
    s.push('\n');
    let mut ids = Vec::new();
    for t in timings.iter().filter(|t| t.excluded.is_none()) {
        let fields: Vec<String> = t
            .fields
            .values()
            .iter()
            .zip(EXPORT_COLUMNS)
            .map(|(v, col)| {
                let numeric = NUMERIC_COLUMNS.contains(&col);
                let safe = crate::observations::csv_table::formula_safe(v, numeric);
                crate::render::text::csv_field(&safe)
            })
            .collect();
        s.push_str(&fields.join(","));
        s.push('\n');
        ids.push(t.id);
    }
    (s, ids)
}

/// A database as the first release of the service made it (no columns of historical
/// records, of how a timing was made or of triage; one submission of one timing), in a
/// fresh folder named after `name`, for the tests that newer code reads it.
#[cfg(test)]
pub(crate) fn oldest_database(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("old.sqlite");
    let conn = Connection::open(&path).unwrap();
    conn.execute_batch(
        "CREATE TABLE submissions (id INTEGER PRIMARY KEY, received_utc TEXT NOT NULL, content_hash TEXT NOT NULL, body BLOB NOT NULL, status TEXT NOT NULL, error TEXT, edit_key TEXT, supersedes INTEGER, superseded_by INTEGER);
         CREATE TABLE timings (id INTEGER PRIMARY KEY, submission_id INTEGER NOT NULL, station TEXT NOT NULL, latitude TEXT NOT NULL, longitude TEXT NOT NULL, elevation_m TEXT NOT NULL, contact TEXT NOT NULL, time_utc TEXT NOT NULL, sigma_s TEXT NOT NULL, time_local TEXT NOT NULL, local_time TEXT NOT NULL, day_reckoning TEXT NOT NULL, longitude_sigma_deg TEXT NOT NULL, excluded_reason TEXT);
         CREATE TABLE audit (id INTEGER PRIMARY KEY, at_utc TEXT NOT NULL, action TEXT NOT NULL, timing_id INTEGER, reason TEXT);
         INSERT INTO submissions VALUES (1, 'x', 'h', x'00', 'accepted', NULL, 'k', NULL, NULL);
         INSERT INTO timings VALUES (1, 1, 'a', '10', '20', '0', '2', '2012-06-05T22:30:00Z', '5', '', '', '', '', NULL);",
    )
    .unwrap();
    path
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A database made before the columns of historical records existed gains them, its rows
    /// read with those fields empty.
    #[test]
    fn an_older_database_gains_the_new_columns() {
        let path = oldest_database("store");
        let store = Store::open(&path).unwrap();
        let t = store.timings_in_force().unwrap();
        assert_eq!(t.len(), 1);
        assert_eq!(t[0].fields.station, "a");
        assert_eq!(t[0].fields.observer, "");
        let (csv, _) = export_csv(&t);
        assert!(csv.starts_with(&EXPORT_COLUMNS.join(",")));
    }
}
