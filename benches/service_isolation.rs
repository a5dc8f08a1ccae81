//! The organiser never blocks a participant: a measurement harness (not a test, no speed
//! assertion). It writes a campaign of 100,000 timings into a fresh database, starts the
//! service on 127.0.0.1 in this process, and measures
//!
//! 1. the phases of one background reduction at that size (read from the store, the export,
//!    its parsing, the reduction, the information estimate, the solution JSON, the report);
//! 2. the participants' `GET /` latency (p50, p99, max) while four report downloads and two
//!    solution requests run back to back (goal: p99 < 50 ms);
//! 3. the catch-up time: from the acknowledgement of one new submission to the first solution
//!    that counts it (goal: < 3 s), with the organiser's load running.
//!
//! ```sh
//! cargo bench --bench service_isolation              # 100,000 timings, 20 s of load
//! cargo bench --bench service_isolation -- 20000 10  # 20,000 timings, 10 s of load
//! ```
//!
//! The figures are in docs/performance.md.

use std::io::{Read, Write};
use std::sync::atomic::{AtomicBool, Ordering};
use std::sync::Arc;
use std::time::{Duration, Instant};
use transit_parallax::service::routes::{serve, ServeSettings};
use transit_parallax::service::store::Store;
use transit_parallax::TransitEvent;

mod isolation_data;

/// One reply: status, the header lines (lower-case names) and the body's length, bytes.
struct Reply {
    status: u16,
    head: String,
    body: Vec<u8>,
}

impl Reply {
    fn header(&self, name: &str) -> Option<&str> {
        self.head.lines().find_map(|l| {
            let (k, v) = l.split_once(':')?;
            k.eq_ignore_ascii_case(name).then(|| v.trim())
        })
    }
}

/// One HTTP/1.0 request on a new connection, read to the end (never chunked).
fn request(port: u16, method: &str, path: &str, headers: &[String], body: &str) -> Reply {
    let mut s = std::net::TcpStream::connect(("127.0.0.1", port)).expect("the server answers");
    let mut head = format!("{method} {path} HTTP/1.0\r\nHost: 127.0.0.1\r\nConnection: close\r\nContent-Length: {}\r\n", body.len());
    for h in headers {
        head.push_str(h);
        head.push_str("\r\n");
    }
    head.push_str("\r\n");
    s.write_all(head.as_bytes()).expect("sent");
    s.write_all(body.as_bytes()).expect("sent");
    let mut raw = Vec::new();
    let _ = s.read_to_end(&mut raw);
    let split = raw
        .windows(4)
        .position(|w| w == b"\r\n\r\n")
        .unwrap_or(raw.len());
    let head = String::from_utf8_lossy(&raw[..split]).into_owned();
    let status = head
        .split_whitespace()
        .nth(1)
        .and_then(|c| c.parse().ok())
        .unwrap_or(0);
    let body = raw.get(split + 4..).unwrap_or_default().to_vec();
    Reply { status, head, body }
}

const TOKEN: &str = "bench";

fn organiser_get(port: u16, path: &str, etag: Option<&str>) -> Reply {
    let mut headers = vec![format!("Authorization: Bearer {TOKEN}")];
    if let Some(e) = etag {
        headers.push(format!("If-None-Match: {e}"));
    }
    request(port, "GET", path, &headers, "")
}

/// The number of timings in the solution (`timings_total`), if the reply is one. The key is
/// found by a scan rather than by parsing the whole object: a 20 MB parse is the client's
/// cost, not the time the solution takes to count a timing.
fn timings_total(reply: &Reply) -> Option<u64> {
    let key = b"\"timings_total\":";
    let at = reply.body.windows(key.len()).rposition(|w| w == key)? + key.len();
    let digits: String = reply.body[at..]
        .iter()
        .take_while(|b| b.is_ascii_digit())
        .map(|&b| char::from(b))
        .collect();
    digits.parse().ok()
}

/// Wait until the solution counts `n` timings (polling with the last ETag, so that an
/// unchanged solution costs a `304`); returns the seconds waited.
fn wait_for_timings(port: u16, n: u64, limit: Duration) -> Option<f64> {
    let start = Instant::now();
    let mut etag: Option<String> = None;
    while start.elapsed() < limit {
        let reply = organiser_get(port, "/api/solution", etag.as_deref());
        if reply.status == 200 {
            if timings_total(&reply) == Some(n) {
                return Some(start.elapsed().as_secs_f64());
            }
            etag = reply.header("etag").map(String::from);
        }
        std::thread::sleep(Duration::from_millis(50));
    }
    None
}

fn percentile(sorted_ms: &[f64], q: f64) -> f64 {
    if sorted_ms.is_empty() {
        return f64::NAN;
    }
    let k = ((sorted_ms.len() - 1) as f64 * q).round() as usize;
    sorted_ms[k]
}

/// Start the service on a free port of 127.0.0.1 over the database at `db`.
fn start(event: TransitEvent, db: &std::path::Path) -> u16 {
    let port = std::net::TcpListener::bind("127.0.0.1:0")
        .and_then(|l| l.local_addr())
        .expect("a free port")
        .port();
    let store = Store::open(db).expect("the store opens");
    let settings = ServeSettings {
        listen: ([127, 0, 0, 1], port).into(),
        public: false,
        token: Some(TOKEN.into()),
        stop_after: Some(Duration::from_secs(1800)),
    };
    std::thread::spawn(move || serve(event, store, settings));
    for _ in 0..100 {
        if std::net::TcpStream::connect(("127.0.0.1", port)).is_ok() {
            break;
        }
        std::thread::sleep(Duration::from_millis(50));
    }
    port
}

/// The organiser's load: four threads downloading the report and two requesting the
/// solution, back to back, until `stop`; returns (reports, solutions) completed.
fn organiser_load(port: u16, stop: Arc<AtomicBool>) -> std::thread::JoinHandle<(usize, usize)> {
    std::thread::spawn(move || {
        let paths: [&'static str; 6] = [
            "/organiser/report.html",
            "/organiser/report.html",
            "/organiser/report.html",
            "/organiser/report.html",
            "/api/solution",
            "/api/solution",
        ];
        let handles: Vec<_> = paths
            .iter()
            .map(|&path| {
                let stop = stop.clone();
                std::thread::spawn(move || {
                    stand_in_for_another_machine();
                    let mut n = 0;
                    while !stop.load(Ordering::Relaxed) {
                        let _ = organiser_get(port, path, None);
                        n += 1;
                    }
                    n
                })
            })
            .collect();
        let counts: Vec<usize> = handles.into_iter().map(|h| h.join().unwrap_or(0)).collect();
        (counts[..4].iter().sum(), counts[4..].iter().sum())
    })
}

/// Lower the calling client thread's priority to the least (`nice` 19, Linux): the organiser's
/// downloaders stand in for browsers on other machines, so their own reading and parsing should
/// not take the server's cores; the server's work for them (its request handling and sending)
/// keeps its normal priority.
fn stand_in_for_another_machine() {
    transit_parallax::service::cache::lower_thread_priority(19);
}

/// The participants' page every 20 ms for `seconds`; its latencies, milliseconds, sorted.
fn participant_latencies(port: u16, seconds: f64) -> Vec<f64> {
    let start = Instant::now();
    let mut out = Vec::new();
    while start.elapsed().as_secs_f64() < seconds {
        let t = Instant::now();
        let reply = request(port, "GET", "/", &[], "");
        assert_eq!(reply.status, 200, "the participant's page answers");
        out.push(t.elapsed().as_secs_f64() * 1e3);
        std::thread::sleep(Duration::from_millis(20));
    }
    out.sort_by(f64::total_cmp);
    out
}

/// One new submission of four timings; the seconds from its acknowledgement until the
/// solution counts it.
fn catch_up(port: u16, body: &str, expected: u64) -> Option<f64> {
    let reply = request(
        port,
        "POST",
        "/api/submissions",
        &["Content-Type: application/json".into()],
        body,
    );
    assert_eq!(
        reply.status,
        201,
        "{}",
        String::from_utf8_lossy(&reply.body)
    );
    wait_for_timings(port, expected, Duration::from_secs(120))
}

fn main() {
    let mut args = std::env::args()
        .skip(1)
        .filter(|a| !a.starts_with("--"))
        .filter_map(|a| a.parse::<f64>().ok());
    let n = args.next().map_or(100_000, |v| v as usize);
    let seconds = args.next().unwrap_or(20.0);
    let event = isolation_data::venus_2012();
    let dir = std::env::temp_dir().join(format!("tp-bench-isolation-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("a temporary directory");
    let db = dir.join("campaign.sqlite");
    let t = Instant::now();
    let rows = isolation_data::write_campaign(&event, &db, n);
    println!(
        "campaign written: {rows} timings in {:.1} s",
        t.elapsed().as_secs_f64()
    );
    isolation_data::phases(&event, &db);

    let port = start(event.clone(), &db);
    let t = Instant::now();
    let first = wait_for_timings(port, rows as u64, Duration::from_secs(600));
    println!(
        "first solution after start: {:.1} s",
        first.unwrap_or(t.elapsed().as_secs_f64())
    );
    let idle = participant_latencies(port, 2.0);
    report_latencies("participant GET /, idle", &idle);
    let idle_catch_up = catch_up(
        port,
        &isolation_data::new_submission(&event, 0),
        rows as u64 + 4,
    );
    println!("catch-up of one new submission, idle: {idle_catch_up:.2?} s");

    let stop = Arc::new(AtomicBool::new(false));
    let load = organiser_load(port, stop.clone());
    std::thread::sleep(Duration::from_millis(500));
    let probe = std::thread::spawn(move || participant_latencies(port, seconds));
    std::thread::sleep(Duration::from_secs_f64(seconds / 3.0));
    let busy_catch_up = catch_up(
        port,
        &isolation_data::new_submission(&event, 1),
        rows as u64 + 8,
    );
    let busy = probe.join().expect("the probe");
    stop.store(true, Ordering::Relaxed);
    let (reports, solutions) = load.join().expect("the load");
    report_latencies(
        "participant GET /, 4 report downloads + 2 solution requests running",
        &busy,
    );
    println!(
        "organiser requests completed during the load: {reports} reports, {solutions} solutions"
    );
    println!("catch-up of one new submission, under that load: {busy_catch_up:.2?} s");
    let _ = std::fs::remove_dir_all(&dir);
}

fn report_latencies(what: &str, sorted_ms: &[f64]) {
    println!(
        "{what}: {} requests, p50 {:.1} ms, p99 {:.1} ms, max {:.1} ms",
        sorted_ms.len(),
        percentile(sorted_ms, 0.5),
        percentile(sorted_ms, 0.99),
        sorted_ms.last().copied().unwrap_or(f64::NAN)
    );
}
