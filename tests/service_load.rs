//! The service under load and after a crash, on 127.0.0.1 (bounded in count and time; every
//! server stops by itself): 20,000 timings from 200 concurrent clients all stored (counts and
//! content hashes compared), the export reducing to the service's own solution, the p99
//! acknowledgement latency reported; and a server killed with SIGKILL in the middle of a load
//! keeps every acknowledged submission and a sound database, and its solution comes back.

mod common;

use common::server::{assert_export_reduces_to, post_json, settled_solution, start};
use std::sync::Mutex;
use std::time::{Duration, Instant};
use transit_parallax::planning::simulation::global_stations;
use transit_parallax::service::store::{content_hash, Store};

fn db(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-load-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir.join("campaign.sqlite")
}

/// Submission bodies: each station's visible contacts from the prediction (no errors), four
/// timings where all are seen. Names are unique: `prefix-N`.
fn bodies(n: usize, prefix: &str) -> Vec<String> {
    let event = transit_parallax::transit_on_date(
        transit_parallax::Planet::Venus,
        transit_parallax::time::iso::parse_date("2012-06-06").unwrap(),
        &transit_parallax::TimeModel::default(),
    )
    .unwrap();
    let mut out = Vec::new();
    for (k, st) in global_stations(6 * n, prefix).into_iter().enumerate() {
        let p = event.predict(&st);
        let timings: Vec<serde_json::Value> = p
            .contacts
            .iter()
            .enumerate()
            .filter_map(|(c, cc)| {
                let cc = cc.as_ref().filter(|cc| cc.sun_altitude_deg > 5.0)?;
                let t = transit_parallax::time::iso::format_utc(event.label(cc.hours), 2);
                Some(serde_json::json!({ "contact": c + 1, "time_utc": t, "sigma_s": 10 }))
            })
            .collect();
        if timings.len() < 4 {
            continue;
        }
        out.push(
            serde_json::json!({ "station": format!("{prefix}-{k}"), "latitude": st.latitude_deg,
            "longitude": st.longitude_deg, "elevation_m": 0, "timings": timings })
            .to_string(),
        );
        if out.len() == n {
            break;
        }
    }
    assert_eq!(out.len(), n, "enough stations see all four contacts");
    out
}

/// Send `bodies` from `clients` threads; returns the acknowledgement latencies (s) and the
/// bodies acknowledged with 201.
fn send_all(
    port: u16,
    bodies: &[String],
    clients: usize,
    deadline: Instant,
) -> (Vec<f64>, Vec<String>) {
    let next = Mutex::new(0usize);
    let results = Mutex::new((Vec::new(), Vec::new()));
    std::thread::scope(|s| {
        for _ in 0..clients {
            s.spawn(|| loop {
                let k = {
                    let mut n = next.lock().unwrap();
                    *n += 1;
                    *n - 1
                };
                if k >= bodies.len() || Instant::now() > deadline {
                    break;
                }
                let t0 = Instant::now();
                let r = post_json(port, "/api/submissions", &bodies[k]);
                let dt = t0.elapsed().as_secs_f64();
                let mut res = results.lock().unwrap();
                if r.status == 201 {
                    res.0.push(dt);
                    res.1.push(bodies[k].clone());
                }
            });
        }
    });
    results.into_inner().unwrap()
}

#[test]
fn twenty_thousand_timings_from_two_hundred_clients() {
    let path = db("load");
    let server = start(&path, &[]);
    let all = bodies(5000, "load");
    let t0 = Instant::now();
    let (mut latencies, acked) = send_all(
        server.port,
        &all,
        200,
        Instant::now() + Duration::from_secs(240),
    );
    let elapsed = t0.elapsed().as_secs_f64();
    assert_eq!(
        acked.len(),
        all.len(),
        "every submission acknowledged within the time allowed"
    );
    latencies.sort_by(f64::total_cmp);
    let p = |q: f64| latencies[((latencies.len() as f64 - 1.0) * q) as usize] * 1000.0;
    eprintln!(
        "{} submissions ({} timings) in {elapsed:.1} s = {:.0} per second; acknowledgement latency p50 {:.1} ms, p99 {:.1} ms, max {:.1} ms",
        acked.len(),
        acked.len() * 4,
        acked.len() as f64 / elapsed,
        p(0.5),
        p(0.99),
        p(1.0)
    );
    let solution = settled_solution(&server);
    assert_eq!(solution["submissions"], 5000);
    assert_eq!(solution["timings_total"], 20_000);
    // The database holds every one: the content hashes of what was acknowledged.
    let mut sent: Vec<String> = acked.iter().map(|b| content_hash(b.as_bytes())).collect();
    let mut stored = Store::open(&path).unwrap().accepted_hashes().unwrap();
    sent.sort();
    stored.sort();
    assert_eq!(sent, stored);
    // The export reduces to the service's own solution.
    assert_export_reduces_to(&server, &solution);
}

#[test]
fn a_killed_server_keeps_every_acknowledged_submission() {
    let path = db("crash");
    let all = bodies(8000, "crash");
    let mut server = start(&path, &[]);
    let port = server.port;
    // Kill the server with SIGKILL while 40 clients are sending.
    let killer = std::thread::spawn({
        let pid = server.child.id();
        move || {
            std::thread::sleep(Duration::from_millis(700));
            let _ = std::process::Command::new("kill")
                .args(["-KILL", &pid.to_string()])
                .status();
        }
    });
    let (_, acked) = send_all(port, &all, 40, Instant::now() + Duration::from_secs(60));
    killer.join().unwrap();
    let _ = server.child.wait();
    eprintln!("{} submissions acknowledged before the kill", acked.len());
    assert!(
        !acked.is_empty() && acked.len() < all.len(),
        "the kill came during the load"
    );
    assert_eq!(Store::open(&path).unwrap().integrity_check().unwrap(), "ok");
    let stored: std::collections::HashSet<String> = Store::open(&path)
        .unwrap()
        .accepted_hashes()
        .unwrap()
        .into_iter()
        .collect();
    for b in &acked {
        assert!(
            stored.contains(&content_hash(b.as_bytes())),
            "an acknowledged submission was lost"
        );
    }
    // Restarted on the same database, the solution comes back.
    drop(server);
    let server = start(&path, &[]);
    let solution = settled_solution(&server);
    assert!(solution["submissions"].as_u64().unwrap() >= acked.len() as u64);
    assert!(
        solution["parallax_arcsec"].as_f64().is_some(),
        "{}",
        solution["error"]
    );
}
