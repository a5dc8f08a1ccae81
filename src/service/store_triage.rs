//! The organiser's triage in the database: each timing's feedback at arrival (its verdict and
//! O - C against the prediction, columns `verdict` and `o_c_s` of the timings table, so that the
//! table filters and sorts by them in SQL), several timings excluded at once with one reason,
//! a timing restored with a reason, and notes from the organiser to a participant (table
//! `participant_notes`). Every change writes its line in the audit trail, in the same
//! transaction.
//!
//! A database made by an earlier version gains the columns and the table when opened; its
//! timings then have no recorded verdict ("not recorded" in the table) until sent again.

use super::feedback::SubmissionFeedback;
use super::store::{now_utc, Store, StoreResult};
use rusqlite::{params, Connection};
use std::collections::HashMap;

fn db_err(e: rusqlite::Error) -> String {
    format!("database: {e}")
}

/// The columns the triage adds to the timings table, with their types.
const TRIAGE_COLUMNS: [(&str, &str); 2] = [("verdict", "TEXT"), ("o_c_s", "REAL")];

const NOTES_SCHEMA: &str = "
CREATE TABLE IF NOT EXISTS participant_notes (
    id INTEGER PRIMARY KEY,
    submission_id INTEGER NOT NULL,
    at_utc TEXT NOT NULL,
    note TEXT NOT NULL
);
CREATE INDEX IF NOT EXISTS participant_notes_submission ON participant_notes(submission_id);
";

/// Add the triage's columns and table to a database that lacks them (new or older).
pub(super) fn migrate(conn: &Connection) -> StoreResult<()> {
    let have: Vec<String> = conn
        .prepare("SELECT name FROM pragma_table_info('timings')")
        .and_then(|mut stmt| {
            stmt.query_map([], |r| r.get::<_, String>(0))?
                .collect::<Result<Vec<_>, _>>()
        })
        .map_err(db_err)?;
    for (col, kind) in TRIAGE_COLUMNS {
        if !have.iter().any(|h| h == col) {
            conn.execute_batch(&format!("ALTER TABLE timings ADD COLUMN {col} {kind}"))
                .map_err(db_err)?;
        }
    }
    conn.execute_batch(NOTES_SCHEMA).map_err(db_err)
}

/// The most a note to a participant may hold, characters.
pub const NOTE_MAX_CHARS: usize = 2000;

impl Store {
    /// Record the feedback each timing had at arrival (`ids` in the order of the feedback's
    /// timings).
    ///
    /// Errors: the database's.
    pub fn record_feedback(&mut self, ids: &[i64], fb: &SubmissionFeedback) -> StoreResult<()> {
        let tx = self.connection().unchecked_transaction().map_err(db_err)?;
        for (id, t) in ids.iter().zip(&fb.timings) {
            let o_c = t.o_c_s.filter(|x| x.is_finite());
            tx.execute(
                "UPDATE timings SET verdict = ?2, o_c_s = ?3 WHERE id = ?1",
                params![id, t.verdict, o_c],
            )
            .map_err(db_err)?;
        }
        tx.commit().map_err(db_err)
    }

    /// The verdict at arrival of every timing in force that has one, by timing id.
    ///
    /// Errors: the database's.
    pub fn verdicts_in_force(&self) -> StoreResult<HashMap<i64, String>> {
        let mut stmt = self
            .connection()
            .prepare("SELECT t.id, t.verdict FROM timings t JOIN submissions s ON s.id = t.submission_id WHERE s.status = 'accepted' AND s.superseded_by IS NULL AND t.verdict IS NOT NULL")
            .map_err(db_err)?;
        let rows = stmt
            .query_map([], |r| Ok((r.get(0)?, r.get(1)?)))
            .map_err(db_err)?;
        rows.collect::<Result<HashMap<_, _>, _>>().map_err(db_err)
    }

    /// Exclude every timing of `ids` that is in force and not excluded yet, with one reason;
    /// one audit line each. Returns how many were excluded.
    ///
    /// Errors: the database's.
    pub fn exclude_many(&mut self, ids: &[i64], reason: &str) -> StoreResult<usize> {
        let tx = self.connection().unchecked_transaction().map_err(db_err)?;
        let at = now_utc();
        let mut n = 0;
        for id in ids {
            let changed = tx
                .execute(
                    "UPDATE timings SET excluded_reason = ?2 WHERE id = ?1 AND excluded_reason IS NULL AND submission_id IN (SELECT id FROM submissions WHERE status = 'accepted' AND superseded_by IS NULL)",
                    params![id, reason],
                )
                .map_err(db_err)?;
            if changed == 1 {
                tx.execute(
                    "INSERT INTO audit (at_utc, action, timing_id, reason) VALUES (?1, 'excluded', ?2, ?3)",
                    params![at, id, reason],
                )
                .map_err(db_err)?;
                n += 1;
            }
        }
        tx.commit().map_err(db_err)?;
        Ok(n)
    }

    /// Restore an excluded timing, the reason kept in the audit trail. `false` when no
    /// excluded timing has that id.
    ///
    /// Errors: the database's.
    pub fn restore_with_reason(&mut self, timing_id: i64, reason: &str) -> StoreResult<bool> {
        let tx = self.connection().unchecked_transaction().map_err(db_err)?;
        let n = tx
            .execute(
                "UPDATE timings SET excluded_reason = NULL WHERE id = ?1 AND excluded_reason IS NOT NULL",
                params![timing_id],
            )
            .map_err(db_err)?;
        if n == 1 {
            tx.execute(
                "INSERT INTO audit (at_utc, action, timing_id, reason) VALUES (?1, 'restored', ?2, ?3)",
                params![now_utc(), timing_id, reason],
            )
            .map_err(db_err)?;
        }
        tx.commit().map_err(db_err)?;
        Ok(n == 1)
    }

    /// Keep a note from the organiser to the participant of an accepted submission (shown on
    /// the participant's private link), with its audit line. `false` when no accepted
    /// submission has that id.
    ///
    /// Errors: the database's.
    pub fn add_note(&mut self, submission_id: i64, note: &str) -> StoreResult<bool> {
        let tx = self.connection().unchecked_transaction().map_err(db_err)?;
        let known: i64 = tx
            .query_row(
                "SELECT COUNT(*) FROM submissions WHERE id = ?1 AND status = 'accepted'",
                params![submission_id],
                |r| r.get(0),
            )
            .map_err(db_err)?;
        if known == 0 {
            return Ok(false);
        }
        let at = now_utc();
        tx.execute(
            "INSERT INTO participant_notes (submission_id, at_utc, note) VALUES (?1, ?2, ?3)",
            params![submission_id, at, note],
        )
        .map_err(db_err)?;
        tx.execute(
            "INSERT INTO audit (at_utc, action, timing_id, reason) VALUES (?1, ?2, NULL, ?3)",
            params![at, format!("note to submission {submission_id}"), note],
        )
        .map_err(db_err)?;
        tx.commit().map_err(db_err)?;
        Ok(true)
    }

    /// The organiser's notes to a submission's participant, and to the versions it corrects
    /// (a note follows the submission through corrections): (time UTC, note), oldest first.
    ///
    /// Errors: the database's.
    pub fn notes(&self, submission_id: i64) -> StoreResult<Vec<(String, String)>> {
        let mut stmt = self
            .connection()
            .prepare("WITH RECURSIVE chain(id) AS (SELECT ?1 UNION SELECT s.supersedes FROM submissions s JOIN chain c ON s.id = c.id WHERE s.supersedes IS NOT NULL) SELECT at_utc, note FROM participant_notes WHERE submission_id IN (SELECT id FROM chain) ORDER BY id")
            .map_err(db_err)?;
        let rows = stmt
            .query_map(params![submission_id], |r| Ok((r.get(0)?, r.get(1)?)))
            .map_err(db_err)?;
        rows.collect::<Result<Vec<_>, _>>().map_err(db_err)
    }
}

#[cfg(test)]
mod tests {
    use super::super::store::TimingFields;
    use super::*;

    fn store_with_two() -> (Store, Vec<i64>) {
        let mut store = Store::open(std::path::Path::new(":memory:")).unwrap();
        let (id, _) = store.store_raw(b"x").unwrap();
        let f = TimingFields {
            station: "A".into(),
            ..TimingFields::default()
        };
        let ids = store.accept(id, "k", &[f.clone(), f], None).unwrap();
        (store, ids)
    }

    #[test]
    fn bulk_exclusion_skips_the_excluded_and_restoring_keeps_its_reason() {
        let (mut store, ids) = store_with_two();
        assert_eq!(store.exclude_many(&ids, "clock set by hand").unwrap(), 2);
        assert_eq!(store.exclude_many(&ids, "again").unwrap(), 0);
        assert_eq!(store.exclude_many(&[999], "none").unwrap(), 0);
        assert!(store.restore_with_reason(ids[0], "clock checked").unwrap());
        assert!(!store.restore_with_reason(ids[0], "twice").unwrap());
        let audit = store.audit(10).unwrap();
        assert_eq!(audit.len(), 3);
        assert_eq!(audit[0].1, "restored");
        assert_eq!(audit[0].3.as_deref(), Some("clock checked"));
        let t = store.timings_in_force().unwrap();
        assert_eq!(
            (t[0].excluded.is_none(), t[1].excluded.is_some()),
            (true, true)
        );
    }

    /// A database made before the triage existed gains its columns and table: its timings
    /// read as "not recorded" and the filters, exclusions and notes work on it.
    #[test]
    fn an_older_database_is_read_by_the_triage() {
        let path = super::super::store::oldest_database("triage-store");
        let mut store = Store::open(&path).unwrap();
        assert!(store.verdicts_in_force().unwrap().is_empty());
        let q = |pairs: &[(&str, &str)]| {
            super::super::table_query::TableQuery::from_query(
                &pairs
                    .iter()
                    .map(|(k, v)| (k.to_string(), v.to_string()))
                    .collect(),
            )
        };
        let (rows, total) = super::super::timing_table::page_of(
            &store,
            &q(&[("verdict", "none"), ("clock", "none")]),
        )
        .unwrap();
        assert_eq!((rows.len(), total, rows[0].verdict.clone()), (1, 1, None));
        assert_eq!(
            super::super::timing_table::page_of(&store, &q(&[("verdict", "fits")]))
                .unwrap()
                .1,
            0
        );
        assert_eq!(store.exclude_many(&[1], "old").unwrap(), 1);
        assert!(store.add_note(1, "hello").unwrap());
    }

    #[test]
    fn notes_go_to_accepted_submissions_only() {
        let (mut store, _) = store_with_two();
        assert!(store.add_note(1, "check your clock").unwrap());
        assert!(!store.add_note(42, "nobody").unwrap());
        assert_eq!(store.notes(1).unwrap()[0].1, "check your clock");
        assert!(store.notes(42).unwrap().is_empty());
        assert_eq!(store.audit(1).unwrap()[0].1, "note to submission 1");
        // A correction's private link shows the notes to the versions it corrects.
        let (second, _) = store.store_raw(b"y").unwrap();
        store
            .accept(second, "k2", &[TimingFields::default()], Some(1))
            .unwrap();
        assert!(store.add_note(second, "thank you").unwrap());
        let notes: Vec<String> = store
            .notes(second)
            .unwrap()
            .into_iter()
            .map(|n| n.1)
            .collect();
        assert_eq!(notes, ["check your clock", "thank you"]);
        assert_eq!(store.notes(1).unwrap().len(), 1);
    }
}
