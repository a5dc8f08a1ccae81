//! The registrations in the campaign's database: each station registered before the event,
//! with its coordinates and the time zone of its clocks, found again by its private key (only
//! the key's SHA-256 is stored, so a copy of the database opens no private link); and the
//! network planned against reported: which registered stations have sent timings under the
//! same name (compared without regard to case or surrounding spaces), which are silent, and
//! which stations reported without registering. Each registration keeps the language its
//! sheet and calendar are written in (a database made before languages existed gains the
//! column, its registrations in English).

use super::store::{content_hash, Store, StoreResult};
use crate::language::Language;
use rusqlite::{params, Connection, OptionalExtension};
use std::collections::BTreeMap;

/// The registrations' table (created with the store's own tables).
pub(super) const REGISTRATIONS_SCHEMA: &str = "
CREATE TABLE IF NOT EXISTS registrations (
    id INTEGER PRIMARY KEY,
    key_hash TEXT NOT NULL UNIQUE,
    registered_utc TEXT NOT NULL,
    station TEXT NOT NULL,
    latitude REAL NOT NULL,
    longitude REAL NOT NULL,
    elevation_m REAL NOT NULL,
    time_zone TEXT NOT NULL,
    language TEXT NOT NULL DEFAULT 'en'
);
";

/// Create the registrations' table where it is missing, and give a table made before the
/// registrations had a language its column (every registration it holds in English).
pub(super) fn create_table(conn: &Connection) -> StoreResult<()> {
    conn.execute_batch(REGISTRATIONS_SCHEMA).map_err(db_err)?;
    let has_language: bool = conn
        .query_row(
            "SELECT COUNT(*) > 0 FROM pragma_table_info('registrations') WHERE name = 'language'",
            [],
            |r| r.get(0),
        )
        .map_err(db_err)?;
    if !has_language {
        conn.execute_batch(
            "ALTER TABLE registrations ADD COLUMN language TEXT NOT NULL DEFAULT 'en'",
        )
        .map_err(db_err)?;
    }
    Ok(())
}

/// One registered station.
#[derive(Clone, Debug, PartialEq)]
pub struct Registration {
    /// Row id (the organiser's number, never the private key).
    pub id: i64,
    /// When it was registered, ISO 8601 UTC.
    pub registered_utc: String,
    /// Station name, as registered.
    pub station: String,
    /// Latitude, degrees north.
    pub latitude_deg: f64,
    /// Longitude, degrees east.
    pub longitude_deg: f64,
    /// Elevation, metres.
    pub elevation_m: f64,
    /// The clocks' time zone, as the registration named it (`Europe/Amsterdam`, `+05:30`).
    pub time_zone: String,
    /// The language of the station's sheet and calendar, chosen at registration.
    pub language: Language,
}

/// A station name as names are matched between registrations and submissions: trimmed,
/// inner runs of white space one space, lower case.
pub fn name_key(name: &str) -> String {
    name.split_whitespace()
        .collect::<Vec<_>>()
        .join(" ")
        .to_lowercase()
}

/// A station of the network, planned or reported, at its coordinates.
#[derive(Clone, Debug, PartialEq)]
pub struct NetworkStation {
    /// Name (as registered, else as first reported).
    pub station: String,
    /// Latitude, degrees north.
    pub latitude_deg: f64,
    /// Longitude, degrees east.
    pub longitude_deg: f64,
    /// Whether it registered before the event.
    pub registered: bool,
    /// Whether timings in force name it.
    pub reported: bool,
}

/// The network planned against reported.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct NetworkPlan {
    /// Every station, registered or reported, by name.
    pub stations: Vec<NetworkStation>,
}

impl NetworkPlan {
    /// (registered, reported, registered but silent, reported without registering).
    pub fn counts(&self) -> (usize, usize, usize, usize) {
        let n = |f: &dyn Fn(&NetworkStation) -> bool| self.stations.iter().filter(|s| f(s)).count();
        (
            n(&|s| s.registered),
            n(&|s| s.reported),
            n(&|s| s.registered && !s.reported),
            n(&|s| s.reported && !s.registered),
        )
    }
}

fn db_err(e: rusqlite::Error) -> String {
    format!("database: {e}")
}

fn registration_of(r: &rusqlite::Row) -> rusqlite::Result<Registration> {
    Ok(Registration {
        id: r.get(0)?,
        registered_utc: r.get(1)?,
        station: r.get(2)?,
        latitude_deg: r.get(3)?,
        longitude_deg: r.get(4)?,
        elevation_m: r.get(5)?,
        time_zone: r.get(6)?,
        language: Language::from_code(&r.get::<_, String>(7)?).unwrap_or_default(),
    })
}

const COLUMNS: &str =
    "id, registered_utc, station, latitude, longitude, elevation_m, time_zone, language";

impl Store {
    /// Store a registration (its `id` and `registered_utc` are set here) under the SHA-256 of
    /// its private `key`; returns it as stored.
    pub fn register(&mut self, r: &Registration, key: &str) -> StoreResult<Registration> {
        let at = super::store::now_utc();
        self.connection()
            .execute(
                "INSERT INTO registrations (key_hash, registered_utc, station, latitude, longitude, elevation_m, time_zone, language) VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8)",
                params![content_hash(key.as_bytes()), at, r.station, r.latitude_deg, r.longitude_deg, r.elevation_m, r.time_zone, r.language.code()],
            )
            .map_err(db_err)?;
        Ok(Registration {
            id: self.connection().last_insert_rowid(),
            registered_utc: at,
            ..r.clone()
        })
    }

    /// The registration a private key opens, if any.
    pub fn registration_by_key(&self, key: &str) -> StoreResult<Option<Registration>> {
        self.connection()
            .query_row(
                &format!("SELECT {COLUMNS} FROM registrations WHERE key_hash = ?1"),
                params![content_hash(key.as_bytes())],
                registration_of,
            )
            .optional()
            .map_err(db_err)
    }

    /// Every registration, in order of arrival.
    pub fn registrations(&self) -> StoreResult<Vec<Registration>> {
        let mut stmt = self
            .connection()
            .prepare(&format!("SELECT {COLUMNS} FROM registrations ORDER BY id"))
            .map_err(db_err)?;
        let rows = stmt.query_map([], registration_of).map_err(db_err)?;
        rows.collect::<Result<Vec<_>, _>>().map_err(db_err)
    }

    /// The stations that timings in force name (excluded ones too: the station reported),
    /// each with the coordinates of its first timing.
    fn reported_stations(&self) -> StoreResult<Vec<(String, String, String)>> {
        let mut stmt = self
            .connection()
            .prepare("SELECT t.station, t.latitude, t.longitude FROM timings t JOIN submissions s ON s.id = t.submission_id WHERE s.status = 'accepted' AND s.superseded_by IS NULL GROUP BY t.station ORDER BY MIN(t.id)")
            .map_err(db_err)?;
        let rows = stmt
            .query_map([], |r| Ok((r.get(0)?, r.get(1)?, r.get(2)?)))
            .map_err(db_err)?;
        rows.collect::<Result<Vec<_>, _>>().map_err(db_err)
    }

    /// The network planned against reported: each registered station, linked by name to the
    /// timings in force, and each station that reported without registering (one whose
    /// coordinates cannot be read has them not-a-number: counted, drawn on no map).
    pub fn network_plan(&self) -> StoreResult<NetworkPlan> {
        let mut by_name: BTreeMap<String, NetworkStation> = BTreeMap::new();
        let mut order: Vec<String> = Vec::new();
        for r in self.registrations()? {
            let key = name_key(&r.station);
            if let std::collections::btree_map::Entry::Vacant(slot) = by_name.entry(key.clone()) {
                order.push(key);
                slot.insert(NetworkStation {
                    station: r.station,
                    latitude_deg: r.latitude_deg,
                    longitude_deg: r.longitude_deg,
                    registered: true,
                    reported: false,
                });
            }
        }
        for (name, lat, lon) in self.reported_stations()? {
            let key = name_key(&name);
            if let Some(s) = by_name.get_mut(&key) {
                s.reported = true;
                continue;
            }
            // Coordinates that cannot be read: counted, drawn nowhere.
            let read = |t: &str| t.trim().parse::<f64>().unwrap_or(f64::NAN);
            let (lat, lon) = (read(&lat), read(&lon));
            order.push(key.clone());
            by_name.insert(
                key,
                NetworkStation {
                    station: name,
                    latitude_deg: lat,
                    longitude_deg: lon,
                    registered: false,
                    reported: true,
                },
            );
        }
        Ok(NetworkPlan {
            stations: order
                .into_iter()
                .filter_map(|k| by_name.remove(&k))
                .collect(),
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::service::store::TimingFields;

    fn registration(name: &str) -> Registration {
        Registration {
            id: 0,
            registered_utc: String::new(),
            station: name.into(),
            latitude_deg: 35.0,
            longitude_deg: 139.0,
            elevation_m: 10.0,
            time_zone: "Asia/Tokyo".into(),
            language: Language::English,
        }
    }

    /// A registration is found by its key only (the key itself is not stored), and the plan
    /// links a later submission under the same name, whatever its case and spacing.
    #[test]
    fn registrations_are_found_by_key_and_linked_by_name() {
        let mut store = Store::open(std::path::Path::new(":memory:")).unwrap();
        let a = store
            .register(&registration("Lantern Hill"), "keyA")
            .unwrap();
        store
            .register(&registration("Quiet Ridge"), "keyB")
            .unwrap();
        assert_eq!(
            store.registration_by_key("keyA").unwrap().unwrap().station,
            "Lantern Hill"
        );
        assert_eq!(store.registration_by_key("keyA").unwrap().unwrap().id, a.id);
        assert!(store.registration_by_key("keyC").unwrap().is_none());
        let stored: String = store
            .connection()
            .query_row(
                "SELECT key_hash FROM registrations WHERE id = ?1",
                [a.id],
                |r| r.get(0),
            )
            .unwrap();
        assert_ne!(stored, "keyA");
        let fields = |name: &str| TimingFields {
            station: name.into(),
            latitude: "10".into(),
            longitude: "20".into(),
            ..TimingFields::default()
        };
        for (k, name) in ["  lantern   HILL ", "Walk-in Field"].iter().enumerate() {
            let (id, _) = store.store_raw(format!("body{k}").as_bytes()).unwrap();
            store.accept(id, "k", &[fields(name)], None).unwrap();
        }
        let plan = store.network_plan().unwrap();
        assert_eq!(plan.counts(), (2, 2, 1, 1));
        let walk_in = plan.stations.iter().find(|s| !s.registered).unwrap();
        assert_eq!(
            (walk_in.station.as_str(), walk_in.latitude_deg),
            ("Walk-in Field", 10.0)
        );
        // The language is kept.
        let german = Registration {
            language: Language::German,
            ..registration("Stiller Hang")
        };
        store.register(&german, "keyD").unwrap();
        assert_eq!(
            store.registration_by_key("keyD").unwrap().unwrap().language,
            Language::German
        );
    }

    /// A database whose registrations were made before they had a language gains the column;
    /// its registrations read in English, and new ones keep theirs.
    #[test]
    fn an_older_registrations_table_gains_the_language() {
        let path = super::super::store::oldest_database("registrations-store");
        {
            let conn = Connection::open(&path).unwrap();
            conn.execute_batch(
                "CREATE TABLE registrations (id INTEGER PRIMARY KEY, key_hash TEXT NOT NULL UNIQUE, registered_utc TEXT NOT NULL, station TEXT NOT NULL, latitude REAL NOT NULL, longitude REAL NOT NULL, elevation_m REAL NOT NULL, time_zone TEXT NOT NULL);",
            )
            .unwrap();
            conn.execute(
                "INSERT INTO registrations (key_hash, registered_utc, station, latitude, longitude, elevation_m, time_zone) VALUES (?1, 'x', 'Old Mill', 1, 2, 3, 'UTC')",
                [content_hash(b"keyOld")],
            )
            .unwrap();
        }
        let mut store = Store::open(&path).unwrap();
        let old = store.registration_by_key("keyOld").unwrap().unwrap();
        assert_eq!(
            (old.station.as_str(), old.language),
            ("Old Mill", Language::English)
        );
        let new = Registration {
            language: Language::French,
            ..registration("Moulin Neuf")
        };
        store.register(&new, "keyNew").unwrap();
        drop(store);
        // Opened again, nothing is added twice.
        let store = Store::open(&path).unwrap();
        assert_eq!(
            store
                .registration_by_key("keyNew")
                .unwrap()
                .unwrap()
                .language,
            Language::French
        );
        assert_eq!(store.registrations().unwrap().len(), 2);
    }
}
