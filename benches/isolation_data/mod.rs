//! The campaign of the isolation benchmark, written straight into the service's database
//! (one transaction, so that 100,000 timings take seconds rather than one synchronous commit
//! per submission), and the phases of one background reduction at that size, timed.

use rand::SeedableRng;
use std::time::Instant;
use transit_parallax::planning::records::campaign_csv;
use transit_parallax::planning::simulation::{
    global_stations, simulate_campaign, SimulationSettings,
};
use transit_parallax::reduction::{reduce_for_event, ReduceOptions};
use transit_parallax::service::intake::from_csv_bytes;
use transit_parallax::service::store::{export_csv, Store, TimingFields, EXPORT_COLUMNS};
use transit_parallax::TransitEvent;

/// The transit of Venus of 2012.
pub fn venus_2012() -> TransitEvent {
    let date = transit_parallax::time::iso::parse_date("2012-06-06").expect("a date");
    transit_parallax::transit_on_date(transit_parallax::Planet::Venus, date, &Default::default())
        .expect("the event")
}

/// Simulate a campaign (stations over the globe, 1 % blunders) of at least `n` timings,
/// keep the first `n`, and store them as one accepted submission per station; returns the
/// number of timings stored.
pub fn write_campaign(event: &TransitEvent, db: &std::path::Path, n: usize) -> usize {
    let settings = SimulationSettings {
        sigma_s: [20.0, 10.0, 10.0, 20.0],
        black_drop_bias_s: 5.0,
        blunder_rate: 0.01,
        min_altitude_deg: 0.0,
        ..SimulationSettings::default()
    };
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(50_000);
    let stations = global_stations(n / 2 + 100, "s");
    let campaign = simulate_campaign(event, &stations, &settings, &mut rng);
    let mut fields = from_csv_bytes(campaign_csv(&campaign.observations).as_bytes())
        .expect("the simulated campaign reads");
    fields.truncate(n);
    drop(Store::open(db).expect("the schema is made"));
    let mut conn = rusqlite::Connection::open(db).expect("the database opens");
    let tx = conn.transaction().expect("a transaction");
    let placeholders: Vec<String> = (2..=EXPORT_COLUMNS.len() + 1)
        .map(|k| format!("?{k}"))
        .collect();
    let sql = format!(
        "INSERT INTO timings (submission_id, {}) VALUES (?1, {})",
        EXPORT_COLUMNS.join(", "),
        placeholders.join(", ")
    );
    let mut last_station = String::new();
    let mut submission = 0;
    for f in &fields {
        if f.station != last_station {
            tx.execute(
                "INSERT INTO submissions (received_utc, content_hash, body, status, edit_key) VALUES ('2012-06-06T00:00:00Z', ?1, x'00', 'accepted', 'key')",
                [format!("bench-{}", f.station)],
            )
            .expect("a submission");
            submission = tx.last_insert_rowid();
            last_station.clone_from(&f.station);
        }
        let values: Vec<String> = std::iter::once(submission.to_string())
            .chain(f.values().iter().map(|v| v.to_string()))
            .collect();
        tx.execute(&sql, rusqlite::params_from_iter(values))
            .expect("a timing");
    }
    tx.commit().expect("committed");
    fields.len()
}

/// A new station's submission of its four predicted contacts, as JSON (`k` makes its name).
pub fn new_submission(event: &TransitEvent, k: usize) -> String {
    let station = global_stations(40, "new")
        .into_iter()
        .find(|st| {
            event
                .predict(st)
                .contacts
                .iter()
                .all(|c| c.as_ref().is_some_and(|c| c.sun_altitude_deg > 5.0))
        })
        .expect("a station that sees the four contacts");
    let p = event.predict(&station);
    let timings: Vec<serde_json::Value> = p
        .contacts
        .iter()
        .enumerate()
        .filter_map(|(c, cc)| {
            let t = transit_parallax::time::iso::format_utc(event.label(cc.as_ref()?.hours), 2);
            Some(serde_json::json!({ "contact": c + 1, "time_utc": t, "sigma_s": 10 }))
        })
        .collect();
    serde_json::json!({ "station": format!("catch-up-{k}"), "latitude": station.latitude_deg,
        "longitude": station.longitude_deg, "elevation_m": 0, "timings": timings })
    .to_string()
}

fn timed<T>(what: &str, f: impl FnOnce() -> T) -> T {
    let t = Instant::now();
    let out = f();
    println!("  {what}: {:.3} s", t.elapsed().as_secs_f64());
    out
}

/// Time each phase of one reduction of the timings in force, as the background worker
/// once did it (the text round trip, the convergence chart) and as it does it now.
pub fn phases(event: &TransitEvent, db: &std::path::Path) {
    println!("phases of one reduction:");
    let store = Store::open(db).expect("the store opens");
    let timings = timed("read the timings in force", || {
        store.timings_in_force().expect("read")
    });
    let (text, _) = timed("export CSV", || export_csv(&timings));
    let path = std::path::Path::new("<campaign>");
    let table = timed("parse the export", || {
        transit_parallax::observations::csv_table::CsvTable::from_bytes(path, text.as_bytes())
            .expect("parsed")
    });
    let set = timed("observations from the table", || {
        transit_parallax::observations::timings::observations_from_table(&table, false)
            .expect("read")
    });
    let fields: Vec<TimingFields> = timings.iter().map(|t| t.fields.clone()).collect();
    timed(
        "information estimate (from the fields, reading them again)",
        || transit_parallax::service::feedback::parallax_information(event, &fields),
    );
    timed(
        "information estimate (from the parsed timings, as the service does)",
        || transit_parallax::service::feedback::information_of_set(event, &set),
    );
    let mut options = ReduceOptions {
        event: Some((event.planet, event.date())),
        follow_convergence: false,
        ..ReduceOptions::default()
    };
    let red = timed("reduce (as `reduce` without --report)", || {
        reduce_for_event(set.clone(), event.clone(), &options).expect("reduced")
    });
    options.follow_convergence = true;
    let full = timed("reduce with the convergence chart", || {
        reduce_for_event(set, event.clone(), &options).expect("reduced")
    });
    timed(
        "solution JSON (written straight, as the service does)",
        || transit_parallax::render::reduction_json::reduction_json_bytes(&red, &[]).len(),
    );
    timed(
        "solution JSON through a serde_json::Value (as before)",
        || {
            serde_json::to_vec(&transit_parallax::render::reduction::reduction_json(&red))
                .map_or(0, |v| v.len())
        },
    );
    timed("HTML report", || {
        transit_parallax::render::document::html_report(&full).len()
    });
}
