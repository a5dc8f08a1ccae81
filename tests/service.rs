//! The pooled-submission service over HTTP on 127.0.0.1 (each server stops by itself): the
//! routes of the stable interface, instant feedback on good and bad timings, the organiser's
//! token, the export that `reduce` reads to the same solution, exclusions, corrections, and
//! hostile input refused with the right status and nothing stored that should not be.

mod common;

use common::server::{
    assert_export_reduces_to, get, post_json, predicted_utc, request, settled_solution, sign_in,
    start, visitor,
};
use common::{err, run};

fn db(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-service-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir.join("campaign.sqlite")
}

/// A station's timings as the simulator would give them: contacts II and III of a station
/// in Hong Kong, from the tool's own prediction plus `error_s`.
fn submission(name: &str, lat: f64, lon: f64, error_s: [f64; 2]) -> String {
    let p = predicted_utc(name, lat, lon);
    let mut timings = Vec::new();
    for (k, c) in [2, 3].iter().enumerate() {
        let row = p[c - 1].as_deref().unwrap();
        let t = transit_parallax::time::iso::parse_utc(row).unwrap();
        let t = t + chrono::TimeDelta::milliseconds((error_s[k] * 1000.0) as i64);
        timings.push(serde_json::json!({ "contact": c, "time_utc": transit_parallax::time::iso::format_utc(t, 1), "sigma_s": 8 }));
    }
    serde_json::json!({ "station": name, "latitude": lat, "longitude": lon, "elevation_m": 0, "timings": timings }).to_string()
}

/// Network stations that see both interior contacts of 2012.
const STATIONS: [(&str, f64, f64); 6] = [
    ("Jade Harbour School", 22.28, 114.16),
    ("Kestrel Point Observatory", 64.84, -147.72),
    ("Driftwood Bay School", 21.31, -157.86),
    ("Harbour Hill Club", -33.87, 151.21),
    ("Coral Reach School", 13.44, 144.79),
    ("Cedar Valley Station", 35.01, 135.77),
];

#[test]
fn submissions_get_feedback_and_the_export_reduces_to_the_same_solution() {
    let server = start(&db("main"), &[]);
    let port = server.port;
    assert!(server.token.chars().all(|c| c.is_ascii_alphanumeric()) && server.token.len() >= 16);
    for (k, (name, lat, lon)) in STATIONS.iter().enumerate() {
        let e = (k as f64 - 2.5) * 3.0;
        let r = post_json(
            port,
            "/api/submissions",
            &submission(name, *lat, *lon, [e, -e]),
        );
        assert_eq!(r.status, 201, "{}", r.body);
        let v = r.json();
        assert!(v["submission_id"].as_i64().unwrap() > 0);
        for t in v["timings"].as_array().unwrap() {
            assert_eq!(t["verdict"], "fits", "{t}");
            assert!(t["predicted_utc"].as_str().unwrap().ends_with('Z'));
            assert!(t["o_c_s"].as_f64().unwrap().abs() < 20.0);
            assert!(t["sun_altitude_deg"].as_f64().unwrap() > 0.0);
        }
    }
    // A blunder: the time zone (+8 h) left in.
    let blunder = submission(
        "Pearl Shore Club",
        22.3,
        114.2,
        [8.0 * 3600.0, 8.0 * 3600.0],
    );
    let v = post_json(port, "/api/submissions", &blunder).json();
    let t = &v["timings"][0];
    assert_eq!(t["verdict"], "rejected", "{t}");
    assert!(t["diagnosis"].as_str().unwrap().contains("zone"), "{t}");
    // The same again is recognised, not counted twice.
    let again = post_json(port, "/api/submissions", &blunder);
    assert_eq!(again.status, 200);
    assert!(again.json()["duplicate_of"].is_i64());
    // The organiser's routes need the token.
    assert_eq!(get(port, "/api/solution", None).status, 401);
    assert_eq!(get(port, "/api/export.csv", Some("wrong")).status, 401);
    assert_eq!(get(port, "/organiser", None).status, 401);
    let solution = settled_solution(&server);
    assert_eq!(solution["submissions"], 7);
    assert_eq!(solution["timings_total"], 14);
    // The export reduces to the same solution as the service's.
    let direct = assert_export_reduces_to(&server, &solution);
    assert!(direct["rejected"]
        .as_array()
        .unwrap()
        .iter()
        .any(|r| r["station"] == "Pearl Shore Club"));
}

#[test]
fn hostile_input_is_refused_and_nothing_is_rendered_raw() {
    let server = start(&db("hostile"), &["--token", "organiser1"]);
    let port = server.port;
    // Over the body limit: 413.
    let big = vec![b' '; 300 * 1024];
    assert_eq!(
        request(
            port,
            "POST",
            "/api/submissions",
            &["Content-Type: application/json"],
            &big
        )
        .status,
        413
    );
    // Not UTF-8, not JSON, no station: 400 with an error, stored as unreadable.
    for body in [
        &b"\xff\xfe{\"station\""[..],
        b"{not json",
        b"{\"timings\":[]}",
    ] {
        let r = request(
            port,
            "POST",
            "/api/submissions",
            &["Content-Type: application/json"],
            body,
        );
        assert_eq!(r.status, 400, "{}", r.body);
        assert!(r.json()["error"].is_string());
    }
    // Markup and script in every field: stored, and only ever shown escaped.
    let evil = "<script>alert(1)</script>";
    let body = serde_json::json!({ "station": evil, "latitude": evil, "longitude": evil, "elevation_m": evil,
        "timings": [{ "contact": evil, "time_utc": evil, "sigma_s": evil }] }).to_string();
    let r = post_json(port, "/api/submissions", &body);
    assert_eq!(r.status, 201, "{}", r.body);
    assert_eq!(r.json()["timings"][0]["verdict"], "rejected");
    // A forged form without its anti-forgery token: refused, nothing stored.
    let before = settled_solution(&server)["submissions"].clone();
    let forged = request(
        port,
        "POST",
        "/submit",
        &["Content-Type: application/x-www-form-urlencoded"],
        b"station=Forged&contact0=2&time_utc0=2012-06-05T22%3A30%3A00Z",
    );
    assert_eq!(forged.status, 403);
    let forged_exclude = request(
        port,
        "POST",
        "/organiser/exclude",
        &["Content-Type: application/x-www-form-urlencoded"],
        b"token=organiser1&timing=1&reason=x",
    );
    // Without a session the organiser's form is refused before anything else.
    assert_eq!(forged_exclude.status, 401);
    assert_eq!(settled_solution(&server)["submissions"], before);
    let page = get(port, "/organiser", Some("organiser1"));
    assert_eq!(page.status, 200);
    assert!(
        !page.body.contains(evil),
        "raw markup on the organiser's page"
    );
    assert!(page.body.contains("&lt;script&gt;"));
    assert!(page.body.contains("could not be read"));
    let form = get(port, "/", None).body;
    assert!(
        form.contains("certified solar filter")
            && !form.contains("http://")
            && !form.contains("https://")
    );
}

#[test]
fn the_organiser_excludes_and_restores_and_participants_correct() {
    let server = start(&db("organiser"), &[]);
    let port = server.port;
    for (name, lat, lon) in STATIONS {
        assert_eq!(
            post_json(
                port,
                "/api/submissions",
                &submission(name, lat, lon, [2.0, -3.0])
            )
            .status,
            201
        );
    }
    let first = settled_solution(&server);
    let (visitor_cookie, csrf) = visitor(port);
    let session = sign_in(port, &server.token);
    let cookies = format!("Cookie: {visitor_cookie}; {session}");
    let form_headers = [
        "Content-Type: application/x-www-form-urlencoded",
        cookies.as_str(),
    ];
    // Signed in, but without the anti-forgery token: refused.
    let r = request(
        port,
        "POST",
        "/organiser/exclude",
        &form_headers,
        b"timing=1&reason=x",
    );
    assert_eq!(r.status, 403, "{}", r.body);
    let form = format!("csrf={csrf}&timing=1&reason=clock+doubtful");
    let r = request(
        port,
        "POST",
        "/organiser/exclude",
        &form_headers,
        form.as_bytes(),
    );
    assert_eq!(r.status, 303, "{}", r.body);
    let after = settled_solution(&server);
    assert_eq!(
        after["timings_total"].as_i64().unwrap(),
        first["timings_total"].as_i64().unwrap() - 1
    );
    let page = request(port, "GET", "/organiser", &[cookies.as_str()], b"").body;
    assert!(page.contains("clock doubtful") && page.contains("excluded"));
    let form = format!("csrf={csrf}&timing=1&reason=clock+checked");
    assert_eq!(
        request(
            port,
            "POST",
            "/organiser/restore",
            &form_headers,
            form.as_bytes()
        )
        .status,
        303
    );
    assert_eq!(
        settled_solution(&server)["timings_total"],
        first["timings_total"]
    );
    // A participant corrects a submission through the private link: a new version.
    let v = post_json(
        port,
        "/api/submissions",
        &submission("Late Club", 22.3, 114.2, [300.0, 0.0]),
    )
    .json();
    let link = v["review"].as_str().unwrap().to_string();
    let id = v["submission_id"].as_i64().unwrap();
    let review = get(port, &link, None);
    assert_eq!(review.status, 200);
    assert!(review.body.contains("Late Club"));
    assert_eq!(
        get(port, &format!("/submission/{id}?key=wrong"), None).status,
        404
    );
    let key = link.split("key=").nth(1).unwrap();
    let corrected = format!("csrf={csrf}&key={key}&station=Late+Club&latitude=22.3&longitude=114.2&contact0=3&time_utc0=2012-06-06T04%3A36%3A00Z&sigma_s0=8");
    let r = request(
        port,
        "POST",
        &format!("/submission/{id}"),
        &form_headers,
        corrected.as_bytes(),
    );
    assert_eq!(r.status, 201, "{}", r.body);
    assert!(r.body.contains("Received and stored as submission"));
    let old = get(port, &link, None).body;
    assert!(old.contains("corrected by a later one"));
}

#[test]
fn the_service_listens_only_here_unless_told() {
    let o = run(&[
        "serve",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--db",
        db("public").to_str().unwrap(),
        "--listen",
        "0.0.0.0:0",
        "--stop-after",
        "1",
    ]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("--public"), "{}", err(&o));
    let o = run(&[
        "serve",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--db",
        db("tok").to_str().unwrap(),
        "--token",
        "not-ok!",
        "--stop-after",
        "1",
    ]);
    assert_eq!(o.status.code(), Some(2));
}

/// An observations file sent as a multipart form (no script needed): stored, read and
/// answered with its feedback; without the form's anti-forgery token refused.
#[test]
fn an_observations_file_can_be_uploaded() {
    let server = start(&db("upload"), &[]);
    let port = server.port;
    let page = get(port, "/", None).body;
    assert!(page.contains("enctype=\"multipart/form-data\"") && !page.contains("<script"));
    let (cookie, csrf) = visitor(port);
    let cookie = format!("Cookie: {cookie}");
    let csrf = csrf.as_str();
    let file = "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s\nJade Harbour School,22.28,114.16,40,II,2012-06-05T22:29:40Z,8\n";
    let multipart = |token: &str| {
        format!(
            "--XyZ\r\nContent-Disposition: form-data; name=\"csrf\"\r\n\r\n{token}\r\n--XyZ\r\nContent-Disposition: form-data; name=\"file\"; filename=\"t.csv\"\r\nContent-Type: text/csv\r\n\r\n{file}\r\n--XyZ--\r\n"
        )
    };
    let headers = [
        "Content-Type: multipart/form-data; boundary=XyZ",
        cookie.as_str(),
    ];
    let r = request(
        port,
        "POST",
        "/upload",
        &headers,
        multipart(csrf).as_bytes(),
    );
    assert_eq!(r.status, 201, "{}", r.body);
    assert!(
        r.body.contains("Jade Harbour School") && r.body.contains("fits"),
        "{}",
        r.body
    );
    let r = request(
        port,
        "POST",
        "/upload",
        &headers,
        multipart("forged").as_bytes(),
    );
    assert_eq!(r.status, 403);
    assert_eq!(settled_solution(&server)["submissions"], 1);
    // A file as a spreadsheet in a European locale writes it: semicolons, decimal commas, a
    // time with no date (judged on the day nearest its prediction), a blank row.
    let local = "station;latitude;longitude;elevation_m;contact;time_utc;sigma_s\nLantern Quay Club;22,28;114,16;40;III;04:36:00,5Z;8\n;;;;;;\n";
    let body = format!(
        "--XyZ\r\nContent-Disposition: form-data; name=\"csrf\"\r\n\r\n{csrf}\r\n--XyZ\r\nContent-Disposition: form-data; name=\"file\"; filename=\"t.csv\"\r\nContent-Type: text/csv\r\n\r\n{local}\r\n--XyZ--\r\n"
    );
    let r = request(port, "POST", "/upload", &headers, body.as_bytes());
    assert_eq!(r.status, 201, "{}", r.body);
    assert!(
        r.body.contains("Lantern Quay Club") && r.body.contains("fits"),
        "{}",
        r.body
    );
}

/// A submission written as an 18th-century record: observers, a judged contact, an Old Style
/// date, a longitude from Paris in hours of time, and a timed interval; stored, given
/// feedback, exported with every column, and reduced from the export as the service reduces.
#[test]
fn a_historical_record_is_submitted_and_exported_as_written() {
    let server = start(&db("historical"), &[]);
    let port = server.port;
    for (k, (name, lat, lon)) in STATIONS.iter().enumerate() {
        let e = (k as f64 - 2.5) * 3.0;
        let r = post_json(
            port,
            "/api/submissions",
            &submission(name, *lat, *lon, [e, -e]),
        );
        assert_eq!(r.status, 201, "{}", r.body);
    }
    let body = serde_json::json!({
        "station": "Old Fort", "latitude": "22°16'48\"N", "longitude": "7h27m17sE",
        "meridian": "paris", "calendar": "julian",
        "timings": [
            { "observer": "first", "contact": "II", "time_utc": "2012-05-23T22:46:01Z", "contact_judged": "touch" },
            { "observer": "second", "contact": "II-III", "duration": "5:58:03", "sigma_s": 15 }
        ]
    });
    let r = post_json(port, "/api/submissions", &body.to_string());
    assert_eq!(r.status, 201, "{}", r.body);
    let v = r.json();
    let timings = v["timings"].as_array().unwrap();
    assert_eq!(timings.len(), 2);
    assert!(timings[1]["o_c_s"].is_f64(), "{}", timings[1]);
    // The export is made once per version of the data, with the solution: wait for it.
    let solution = settled_solution(&server);
    let export = get(port, "/api/export.csv", Some(&server.token)).body;
    let header = export.lines().next().unwrap();
    for col in [
        "observer",
        "calendar",
        "meridian",
        "time_meridian",
        "duration",
        "contact_judged",
    ] {
        assert!(header.split(',').any(|h| h == col), "{col} in {header}");
    }
    assert!(export.contains("2-3"), "{export}");
    assert!(
        export.contains("julian") && export.contains("touch"),
        "{export}"
    );
    assert_eq!(solution["timings_total"], 14);
    assert_export_reduces_to(&server, &solution);
}

/// The solution, export and report are made once per version of the data and served from a
/// cache: the same version twice has the same `ETag` and bytes, `If-None-Match` answers `304`,
/// a new timing raises the version; the organiser's table pages through every timing.
#[test]
fn heavy_artefacts_are_cached_per_version_and_the_table_pages() {
    let path = db("cache");
    let server = start(&path, &["--token", "organiser"]);
    let port = server.port;
    for k in 0..3 {
        let body = submission(&format!("cache-{k}"), 21.3 + k as f64, -157.8, [0.0, 0.0]);
        assert_eq!(post_json(port, "/api/submissions", &body).status, 201);
    }
    let solution = settled_solution(&server);
    let version = solution["version"].as_u64().expect("a version");
    let auth = "Authorization: Bearer organiser";
    let mut report = request(port, "GET", "/organiser/report.html", &[auth], b"");
    for _ in 0..100 {
        if report.status == 200 && report.header("x-data-version") == Some(version.to_string()) {
            break;
        }
        std::thread::sleep(std::time::Duration::from_millis(100));
        report = request(port, "GET", "/organiser/report.html", &[auth], b"");
    }
    assert_eq!(report.status, 200, "{}", report.body);
    let again = request(port, "GET", "/organiser/report.html", &[auth], b"");
    assert_eq!(report.header("etag"), again.header("etag"));
    assert_eq!(report.body, again.body);
    let etag = report.header("etag").expect("an ETag").to_string();
    let if_none = format!("If-None-Match: {etag}");
    let cached = request(
        port,
        "GET",
        "/organiser/report.html",
        &[auth, &if_none],
        b"",
    );
    assert_eq!(cached.status, 304);
    for path in ["/api/solution", "/api/export.csv"] {
        let first = request(port, "GET", path, &[auth], b"");
        let tag = format!("If-None-Match: {}", first.header("etag").expect("an ETag"));
        assert_eq!(
            request(port, "GET", path, &[auth, &tag], b"").status,
            304,
            "{path}"
        );
    }
    // A new timing raises the version.
    let body = submission("cache-new", 35.0, 139.0, [0.0, 0.0]);
    assert_eq!(post_json(port, "/api/submissions", &body).status, 201);
    let newer = settled_solution(&server);
    assert!(newer["version"].as_u64().unwrap() > version);
    let export = request(port, "GET", "/api/export.csv", &[auth], b"");
    assert_ne!(export.header("etag"), Some(etag));
    // The table: 4 stations' timings, filtered by station and state, paged.
    let page = get(
        port,
        "/organiser?station=cache-new&state=in_force",
        Some("organiser"),
    );
    assert_eq!(page.status, 200);
    assert!(page.body.contains("cache-new"), "{}", page.body);
    assert!(!page.body.contains("<td>cache-0</td>"), "{}", page.body);
    assert!(page.body.contains("Timings 1-"), "{}", page.body);
    let none = get(port, "/organiser?state=excluded", Some("organiser"));
    assert!(
        none.body.contains("No timing on this page; 0 match."),
        "{}",
        none.body
    );
}
