//! Starting the service for a test (on 127.0.0.1, any free port, stopping by itself) and a
//! minimal HTTP/1.1 client over a plain TCP stream, so that tests can also send what no
//! well-behaved client would (oversized or non-UTF-8 bodies).

use std::io::{BufRead, BufReader, Read, Write};
use std::net::TcpStream;
use std::process::{Child, Command, Stdio};
use std::time::Duration;

/// A running service: killed when dropped (it also stops by itself after a while).
pub struct Server {
    pub child: Child,
    pub port: u16,
    pub token: String,
}

impl Drop for Server {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

/// Start `serve` for the transit of Venus of 2012 on `db`, with `extra` arguments; waits for
/// its start-up lines.
pub fn start(db: &std::path::Path, extra: &[&str]) -> Server {
    start_event(db, ("venus", "2012-06-06"), extra)
}

/// Start `serve` for the transit (planet, date) on `db`, with `extra` arguments.
pub fn start_event(db: &std::path::Path, (planet, date): (&str, &str), extra: &[&str]) -> Server {
    let mut child = Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
        .args(["serve", "--planet", planet, "--date", date, "--db"])
        .arg(db)
        .args(["--listen", "127.0.0.1:0", "--stop-after", "300"])
        .args(extra)
        .stderr(Stdio::piped())
        .stdout(Stdio::null())
        .spawn()
        .expect("the server starts");
    let stderr = child.stderr.take().expect("stderr");
    let mut lines = BufReader::new(stderr).lines();
    let mut port = 0;
    let mut token = extra
        .iter()
        .position(|a| *a == "--token")
        .and_then(|k| extra.get(k + 1))
        .map_or(String::new(), |t| t.to_string());
    for line in lines.by_ref().take(3) {
        let line = line.expect("a line");
        if let Some(rest) = line.strip_prefix("listening on http://127.0.0.1:") {
            port = rest.trim().parse().expect("a port");
        }
        if let Some(t) = line.strip_prefix("organiser token: ") {
            token = t.trim().to_string();
        }
        if port != 0 && !token.is_empty() {
            break;
        }
    }
    assert!(port != 0, "the server said where it listens");
    // Keep draining stderr so that the server never blocks on a full pipe.
    std::thread::spawn(move || for _ in lines {});
    Server { child, port, token }
}

/// One HTTP response.
pub struct Reply {
    pub status: u16,
    pub body: String,
    /// The status line and headers, as sent.
    pub head: String,
}

impl Reply {
    pub fn json(&self) -> serde_json::Value {
        serde_json::from_str(&self.body).unwrap_or_else(|e| panic!("{e}: {}", self.body))
    }
}

/// Send one request (`headers` as full lines) and read the whole reply.
pub fn request(port: u16, method: &str, path: &str, headers: &[&str], body: &[u8]) -> Reply {
    let Ok(mut s) = TcpStream::connect(("127.0.0.1", port)) else {
        // Refused (a killed server): no reply.
        return Reply {
            status: 0,
            body: String::new(),
            head: String::new(),
        };
    };
    s.set_read_timeout(Some(Duration::from_secs(60))).ok();
    let mut head = format!("{method} {path} HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\nContent-Length: {}\r\n", body.len());
    for h in headers {
        head.push_str(h);
        head.push_str("\r\n");
    }
    head.push_str("\r\n");
    let _ = s.write_all(head.as_bytes());
    let _ = s.write_all(body);
    let mut raw = Vec::new();
    let _ = s.read_to_end(&mut raw);
    let text = String::from_utf8_lossy(&raw).into_owned();
    let status = text
        .split_whitespace()
        .nth(1)
        .and_then(|c| c.parse().ok())
        .unwrap_or(0);
    let body = match text.find("\r\n\r\n") {
        Some(k) => text[k + 4..].to_string(),
        None => String::new(),
    };
    // Chunked replies: join the chunks.
    let body = if text[..text.find("\r\n\r\n").unwrap_or(0)]
        .to_ascii_lowercase()
        .contains("transfer-encoding: chunked")
    {
        dechunk(&body)
    } else {
        body
    };
    let head = text[..text.find("\r\n\r\n").unwrap_or(0)].to_string();
    Reply { status, body, head }
}

impl Reply {
    /// The value of the first header of this name (case-insensitive), if any.
    pub fn header(&self, name: &str) -> Option<String> {
        let want = format!("{}:", name.to_ascii_lowercase());
        self.head
            .lines()
            .find(|l| l.to_ascii_lowercase().starts_with(&want))
            .map(|l| l[want.len()..].trim().to_string())
    }

    /// Every `Set-Cookie` value.
    pub fn set_cookies(&self) -> Vec<String> {
        self.head
            .lines()
            .filter(|l| l.to_ascii_lowercase().starts_with("set-cookie:"))
            .map(|l| l[11..].trim().to_string())
            .collect()
    }
}

/// The `name=value` of a cookie a reply sets.
pub fn cookie_of(reply: &Reply, name: &str) -> Option<String> {
    reply
        .set_cookies()
        .iter()
        .find(|c| c.starts_with(&format!("{name}=")))
        .map(|c| c.split(';').next().unwrap().to_string())
}

/// A visitor of the participant's form: its cookie (`tp_visitor=...`) and its forms'
/// anti-forgery token.
pub fn visitor(port: u16) -> (String, String) {
    let r = request(port, "GET", "/", &[], b"");
    let cookie = cookie_of(&r, "tp_visitor").expect("a visitor cookie");
    let k = r.body.find("name=\"csrf\" value=\"").expect("a csrf field") + 19;
    let csrf = r.body[k..k + 64].to_string();
    (cookie, csrf)
}

/// Sign the organiser in through `?token=`; the session cookie (`tp_organiser=...`).
pub fn sign_in(port: u16, token: &str) -> String {
    let r = request(port, "GET", &format!("/organiser?token={token}"), &[], b"");
    assert_eq!(r.status, 303, "{}", r.body);
    cookie_of(&r, "tp_organiser").expect("a session cookie")
}

fn dechunk(body: &str) -> String {
    let mut out = String::new();
    let mut rest = body;
    while let Some(k) = rest.find("\r\n") {
        let size = usize::from_str_radix(rest[..k].trim(), 16).unwrap_or(0);
        if size == 0 {
            break;
        }
        let start = k + 2;
        let end = (start + size).min(rest.len());
        out.push_str(&rest[start..end]);
        rest = rest.get(end + 2..).unwrap_or("");
    }
    out
}

pub fn post_json(port: u16, path: &str, body: &str) -> Reply {
    request(
        port,
        "POST",
        path,
        &["Content-Type: application/json"],
        body.as_bytes(),
    )
}

pub fn get(port: u16, path: &str, token: Option<&str>) -> Reply {
    let auth = token.map(|t| format!("Authorization: Bearer {t}"));
    let headers: Vec<&str> = auth.iter().map(String::as_str).collect();
    request(port, "GET", path, &headers, b"")
}

/// The solution once the background reduction has caught up with every change.
pub fn settled_solution(server: &Server) -> serde_json::Value {
    for _ in 0..600 {
        let v = get(server.port, "/api/solution", Some(&server.token)).json();
        if v["pending"] == false {
            return v;
        }
        std::thread::sleep(Duration::from_millis(100));
    }
    panic!("the solution did not settle within a minute");
}

/// The organiser's report once the renderer has made it for the settled solution.
#[allow(dead_code)]
pub fn settled_report(server: &Server) -> Reply {
    settled_solution(server);
    for _ in 0..600 {
        let r = get(server.port, "/organiser/report.html", Some(&server.token));
        if r.status == 200 {
            return r;
        }
        std::thread::sleep(Duration::from_millis(100));
    }
    panic!("the report was not rendered within a minute");
}

/// The organiser's export, reduced by the binary: the same figures as the service's own
/// `solution` (the export is what the service reduces); returns the direct reduction.
pub fn assert_export_reduces_to(
    server: &Server,
    solution: &serde_json::Value,
) -> serde_json::Value {
    let export = get(server.port, "/api/export.csv", Some(&server.token));
    assert_eq!(export.status, 200);
    let path = super::temp(
        &format!("export-{}.csv", server.port),
        export.body.as_bytes(),
    );
    let o = super::run(&[
        "reduce",
        &path,
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--format",
        "json",
    ]);
    assert!(o.status.success(), "{}", super::err(&o));
    let direct: serde_json::Value = serde_json::from_str(&super::out(&o)).expect("JSON");
    for key in [
        "parallax_arcsec",
        "parallax_sigma_arcsec",
        "au_km",
        "timings_used",
        "chi2",
    ] {
        assert_eq!(direct[key], solution[key], "{key}");
    }
    direct
}

/// The tool's own predicted times (UTC labels, as `predict --format json` writes them) of
/// contacts I-IV of 2012 at a station, `None` where a contact does not occur.
pub fn predicted_utc(name: &str, lat: f64, lon: f64) -> Vec<Option<String>> {
    let stations = super::temp(
        &format!("st-{name}-{lat}-{lon}.csv"),
        format!("station,latitude,longitude,elevation_m\n{name},{lat},{lon},0\n").as_bytes(),
    );
    let o = super::run_words(
        "predict --planet venus --date 2012-06-06 --format json --stations",
        &[&stations],
    );
    let v: serde_json::Value = serde_json::from_str(&super::out(&o)).expect("JSON");
    (1..=4)
        .map(|c| {
            v.as_array()?
                .iter()
                .find(|r| r["contact"] == c)
                .and_then(|r| r["time_utc"].as_str().map(String::from))
        })
        .collect()
}

/// The library's predicted time of contact `contact` (1-4) of the transit of Venus of 2012 at
/// a station, shifted by `shift_s` (UTC, one decimal).
#[allow(dead_code)]
pub fn predicted_at(lat: f64, lon: f64, contact: usize, shift_s: f64) -> String {
    let event = transit_parallax::transit_on_date(
        transit_parallax::Planet::Venus,
        transit_parallax::time::iso::parse_date("2012-06-06").unwrap(),
        &transit_parallax::TimeModel::default(),
    )
    .unwrap();
    let st = transit_parallax::Station {
        name: "s".into(),
        latitude_deg: lat,
        longitude_deg: lon,
        elevation_m: 0.0,
    };
    let c = event.predict(&st).contacts[contact - 1].unwrap();
    let t = event.label(c.hours) + chrono::TimeDelta::milliseconds((shift_s * 1000.0) as i64);
    transit_parallax::time::iso::format_utc(t, 1)
}

/// Five invented stations' contacts II and III through the API (a few seconds either side of
/// their predictions), so that a solution, its charts and the report exist; with `zone_slip`
/// the third station's contact II is 9 h late (a zone-time blunder, a rejected row).
#[allow(dead_code)]
pub fn seed_five_stations(server: &Server, zone_slip: bool) {
    let stations = [
        ("Kestrel Point", 64.84, -147.72),
        ("Driftwood Bay", 21.31, -157.86),
        ("Cedar Valley", 35.01, 135.77),
        ("Harbour Hill", -33.87, 151.21),
        ("Coral Reach", 13.44, 144.79),
    ];
    for (k, (name, lat, lon)) in stations.into_iter().enumerate() {
        let e = 4.0 * (k as f64 - 2.0);
        let slip_s = if zone_slip && k == 2 {
            9.0 * 3600.0
        } else {
            0.0
        };
        let (t2, t3) = (
            predicted_at(lat, lon, 2, e + slip_s),
            predicted_at(lat, lon, 3, -e),
        );
        let body = serde_json::json!({ "station": name, "latitude": lat, "longitude": lon,
            "timings": [{ "contact": 2, "time_utc": t2, "sigma_s": 8 }, { "contact": 3, "time_utc": t3, "sigma_s": 8 }] });
        assert_eq!(
            post_json(server.port, "/api/submissions", &body.to_string()).status,
            201
        );
    }
}
