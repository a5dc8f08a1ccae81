//! The pooled-submission service: one submission of four timings, from the request to the
//! acknowledgement (stored raw, read, committed, answered with its feedback), sent one after
//! another to a service in this process on 127.0.0.1 with a fresh database. The latency under
//! load (p99 at 500 submissions per second) comes from `examples/service_load.rs`; both are in
//! docs/performance.md.

use criterion::{criterion_group, criterion_main, Criterion};
use std::io::{Read, Write};
use std::time::Duration;
use transit_parallax::service::routes::{serve, ServeSettings};
use transit_parallax::service::store::Store;

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

fn bench(c: &mut Criterion) {
    let date = transit_parallax::time::iso::parse_date("2012-06-06").unwrap();
    let event = transit_parallax::transit_on_date(
        transit_parallax::Planet::Venus,
        date,
        &Default::default(),
    )
    .unwrap();
    let dir = std::env::temp_dir().join(format!("tp-bench-service-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let port = std::net::TcpListener::bind("127.0.0.1:0")
        .and_then(|l| l.local_addr())
        .unwrap()
        .port();
    let store = Store::open(&dir.join("bench.sqlite")).unwrap();
    let settings = ServeSettings {
        listen: ([127, 0, 0, 1], port).into(),
        public: false,
        token: Some("bench".into()),
        stop_after: Some(Duration::from_secs(300)),
    };
    std::thread::spawn(move || serve(event, store, settings));
    std::thread::sleep(Duration::from_millis(500));
    let mut k = 0u64;
    let mut g = c.benchmark_group("service");
    g.sample_size(50);
    g.bench_function("one submission of four timings, acknowledged", |b| {
        b.iter(|| {
            k += 1;
            // A distinct station each time, so that no submission is a duplicate.
            let body = format!(r#"{{"station":"bench-{k}","latitude":21.31,"longitude":-157.86,"timings":[{{"contact":1,"time_utc":"2012-06-05T22:11:03Z"}},{{"contact":2,"time_utc":"2012-06-05T22:28:40Z"}},{{"contact":3,"time_utc":"2012-06-06T04:36:30Z"}},{{"contact":4,"time_utc":"2012-06-06T04:53:48Z"}}]}}"#);
            assert!(post(port, &body));
        })
    });
    g.finish();
    let _ = std::fs::remove_dir_all(&dir);
}

criterion_group!(benches, bench);
criterion_main!(benches);
