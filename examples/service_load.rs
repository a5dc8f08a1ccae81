//! Load on the pooled-submission service at a paced rate, for docs/performance.md: starts the
//! service in this process on 127.0.0.1 (a fresh database in a temporary folder, stopping by
//! itself), sends N submissions of four timings from 200 client threads at R submissions per
//! second, and prints the acknowledgement latency (p50, p99, max).
//!
//! ```sh
//! cargo run --release --example service_load -- 5000 500
//! ```
use std::io::{Read, Write};
use std::sync::Mutex;
use std::time::{Duration, Instant};
use transit_parallax::planning::simulation::global_stations;
use transit_parallax::service::routes::{serve, ServeSettings};
use transit_parallax::service::store::Store;

fn body(
    event: &transit_parallax::TransitEvent,
    k: usize,
    st: &transit_parallax::Station,
) -> Option<String> {
    let p = event.predict(st);
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
    (timings.len() == 4).then(|| {
        serde_json::json!({ "station": format!("load-{k}"), "latitude": st.latitude_deg,
            "longitude": st.longitude_deg, "timings": timings })
        .to_string()
    })
}

fn post(port: u16, body: &str) -> bool {
    let Ok(mut s) = std::net::TcpStream::connect(("127.0.0.1", port)) else {
        return false;
    };
    let req = format!("POST /api/submissions HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\nContent-Type: application/json\r\nContent-Length: {}\r\n\r\n{body}", body.len());
    let _ = s.write_all(req.as_bytes());
    let mut reply = String::new();
    let _ = s.read_to_string(&mut reply);
    reply.starts_with("HTTP/1.1 201")
}

fn main() {
    let args: Vec<usize> = std::env::args()
        .skip(1)
        .filter_map(|a| a.parse().ok())
        .collect();
    let (n, rate) = (
        args.first().copied().unwrap_or(5000),
        args.get(1).copied().unwrap_or(500),
    );
    let date = transit_parallax::time::iso::parse_date("2012-06-06").expect("a date");
    let event = transit_parallax::transit_on_date(
        transit_parallax::Planet::Venus,
        date,
        &Default::default(),
    )
    .expect("the event");
    let bodies: Vec<String> = global_stations(6 * n, "load")
        .iter()
        .enumerate()
        .filter_map(|(k, st)| body(&event, k, st))
        .take(n)
        .collect();
    let dir = std::env::temp_dir().join(format!("tp-service-load-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("a folder");
    let port = std::net::TcpListener::bind("127.0.0.1:0")
        .and_then(|l| l.local_addr())
        .expect("a port")
        .port();
    let store = Store::open(&dir.join("load.sqlite")).expect("the database");
    let settings = ServeSettings {
        listen: ([127, 0, 0, 1], port).into(),
        public: false,
        token: Some("load".into()),
        stop_after: Some(Duration::from_secs(600)),
    };
    let ev = event.clone();
    std::thread::spawn(move || serve(ev, store, settings));
    std::thread::sleep(Duration::from_millis(500));
    let next = Mutex::new(0usize);
    let latencies = Mutex::new(Vec::new());
    let t0 = Instant::now();
    std::thread::scope(|s| {
        for _ in 0..200 {
            s.spawn(|| loop {
                let k = {
                    let mut g = next.lock().expect("lock");
                    *g += 1;
                    *g - 1
                };
                if k >= bodies.len() {
                    break;
                }
                let due = t0 + Duration::from_secs_f64(k as f64 / rate as f64);
                if let Some(wait) = due.checked_duration_since(Instant::now()) {
                    std::thread::sleep(wait);
                }
                let start = Instant::now();
                if post(port, &bodies[k]) {
                    latencies
                        .lock()
                        .expect("lock")
                        .push(start.elapsed().as_secs_f64() * 1000.0);
                }
            });
        }
    });
    let mut l = latencies.into_inner().expect("lock");
    l.sort_by(f64::total_cmp);
    let q = |f: f64| l[((l.len() as f64 - 1.0) * f) as usize];
    println!(
        "{} of {} submissions acknowledged at {rate} per second (4 timings each) in {:.1} s: latency p50 {:.1} ms, p99 {:.1} ms, max {:.1} ms",
        l.len(),
        bodies.len(),
        t0.elapsed().as_secs_f64(),
        q(0.5),
        q(0.99),
        q(1.0)
    );
    let _ = std::fs::remove_dir_all(&dir);
}
