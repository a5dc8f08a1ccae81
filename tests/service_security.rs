//! The service closed to forgery and leaks, over HTTP on 127.0.0.1 (each server stops by
//! itself): cross-origin and non-JSON posts refused with nothing stored, forms bound to the
//! visitor's cookie, the organiser's token never on a page, sign-in and sign-out, formula
//! cells neutralised in the export and read back by `reduce`, security headers everywhere,
//! 413 pages, and the rate limit with `--public`.

mod common;

use common::server::{
    get, post_json, request, settled_report, settled_solution, sign_in, start, visitor,
};
use common::{err, out, run, temp};

fn db(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-security-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir.join("campaign.sqlite")
}

const TOKEN: &str = "Organiser9Secret";

fn good_body(station: &str) -> String {
    serde_json::json!({ "station": station, "latitude": 22.28, "longitude": 114.16,
        "timings": [{ "contact": 2, "time_utc": "2012-06-05T22:29:40Z", "sigma_s": 8 }] })
    .to_string()
}

#[test]
fn cross_origin_and_plain_text_posts_store_nothing() {
    let server = start(&db("origin"), &["--token", TOKEN]);
    let port = server.port;
    let body = good_body("Forged Station");
    let plain = request(
        port,
        "POST",
        "/api/submissions",
        &["Content-Type: text/plain"],
        body.as_bytes(),
    );
    assert_eq!(plain.status, 415, "{}", plain.body);
    assert!(plain.json()["error"]
        .as_str()
        .unwrap()
        .contains("application/json"));
    let foreign = request(
        port,
        "POST",
        "/api/submissions",
        &[
            "Content-Type: application/json",
            "Origin: https://elsewhere.example",
        ],
        body.as_bytes(),
    );
    assert_eq!(foreign.status, 403, "{}", foreign.body);
    let (cookie, csrf) = visitor(port);
    let cookie = format!("Cookie: {cookie}");
    let form = format!("csrf={csrf}&station=Forged&contact0=2&time_utc0=2012-06-05T22%3A30%3A00Z");
    let ct = "Content-Type: application/x-www-form-urlencoded";
    let r = request(
        port,
        "POST",
        "/submit",
        &[ct, &cookie, "Origin: http://evil.example"],
        form.as_bytes(),
    );
    assert_eq!(r.status, 403);
    // Another visitor's token with this cookie, and no token at all: refused.
    let (_, other_csrf) = visitor(port);
    let other = form.replace(&csrf, &other_csrf);
    assert_eq!(
        request(port, "POST", "/submit", &[ct, &cookie], other.as_bytes()).status,
        403
    );
    let none = "station=Forged&contact0=2&time_utc0=2012-06-05T22%3A30%3A00Z";
    assert_eq!(
        request(port, "POST", "/submit", &[ct, &cookie], none.as_bytes()).status,
        403
    );
    let solution = settled_solution(&server);
    assert_eq!(solution["submissions"], 0, "{solution}");
    // The same origin, the visitor's own token: received.
    // The test client names the host `127.0.0.1` (no port) in its Host header.
    let same = "Origin: http://127.0.0.1".to_string();
    let r = request(
        port,
        "POST",
        "/submit",
        &[ct, &cookie, &same],
        form.as_bytes(),
    );
    assert_eq!(r.status, 201, "{}", r.body);
    assert_eq!(post_json(port, "/api/submissions", &body).status, 201);
    assert_eq!(settled_solution(&server)["submissions"], 2);
}

#[test]
fn no_page_holds_the_token_and_the_organiser_signs_in_and_out() {
    let server = start(&db("token"), &["--token", TOKEN]);
    let port = server.port;
    let r = post_json(port, "/api/submissions", &good_body("Jade Harbour School"));
    let review = r.json()["review"].as_str().unwrap().to_string();
    settled_report(&server);
    let redirect = request(
        port,
        "GET",
        "/organiser/report.html?token=Organiser9Secret&x=1",
        &[],
        b"",
    );
    assert_eq!(redirect.status, 303);
    assert_eq!(
        redirect.header("location").as_deref(),
        Some("/organiser/report.html?x=1")
    );
    let set = redirect.set_cookies().join("\n");
    assert!(
        set.contains("tp_organiser=")
            && set.contains("HttpOnly")
            && set.contains("SameSite=Strict"),
        "{set}"
    );
    let session = sign_in(port, TOKEN);
    let c = format!("Cookie: {session}");
    let mut bodies = Vec::new();
    for path in [
        "/",
        review.as_str(),
        "/organiser",
        "/organiser/report.html",
        "/nowhere",
        "/organiser?token=wrong",
    ] {
        let r = request(port, "GET", path, &[&c], b"");
        assert!(!r.body.contains(TOKEN), "the token on {path}");
        assert!(
            !r.head.contains(TOKEN),
            "the token in the headers of {path}"
        );
        bodies.push((path, r.status));
    }
    assert_eq!(bodies[2].1, 200);
    assert_eq!(bodies[3].1, 200);
    assert_eq!(bodies[5].1, 401);
    // Without a session: the sign-in form, 401; the API: JSON 401; Bearer works for scripts.
    let r = get(port, "/organiser", None);
    assert_eq!(r.status, 401);
    assert!(r.body.contains("autocomplete=\"current-password\""));
    assert_eq!(get(port, "/api/solution", Some(TOKEN)).status, 200);
    assert_eq!(get(port, "/organiser/report.html", Some(TOKEN)).status, 200);
}

#[test]
fn the_sign_in_form_holds_the_organiser_until_sign_out() {
    let server = start(&db("sign-in"), &["--token", TOKEN]);
    let port = server.port;
    let (vc, csrf) = visitor(port);
    let ct = "Content-Type: application/x-www-form-urlencoded";
    let vh = format!("Cookie: {vc}");
    let wrong = format!("csrf={csrf}&token=nope");
    assert_eq!(
        request(
            port,
            "POST",
            "/organiser/sign-in",
            &[ct, &vh],
            wrong.as_bytes()
        )
        .status,
        401
    );
    let good = format!("csrf={csrf}&token={TOKEN}");
    let r = request(
        port,
        "POST",
        "/organiser/sign-in",
        &[ct, &vh],
        good.as_bytes(),
    );
    assert_eq!(r.status, 303, "{}", r.body);
    let s2 = common::server::cookie_of(&r, "tp_organiser").unwrap();
    let both = format!("Cookie: {vc}; {s2}");
    assert_eq!(
        request(port, "GET", "/organiser", &[&both], b"").status,
        200
    );
    let out_form = format!("csrf={csrf}");
    let r = request(
        port,
        "POST",
        "/organiser/sign-out",
        &[ct, &both],
        out_form.as_bytes(),
    );
    assert_eq!(r.status, 303);
    assert_eq!(
        request(port, "GET", "/organiser", &[&both], b"").status,
        401
    );
}

#[test]
fn formula_cells_round_trip_through_the_export_and_reduce() {
    let server = start(&db("formula"), &["--token", TOKEN]);
    let port = server.port;
    // Contact II at this place is predicted at 22:34:04.5 (a time far from it would now be
    // screened as a gross blunder, leaving nothing to reduce).
    for name in ["=HYPERLINK(\"http://x\",\"y\")", "@SUM(1)"] {
        let body = serde_json::json!({ "station": name, "latitude": -33.87, "longitude": 151.21,
            "timings": [{ "contact": 2, "time_utc": "2012-06-05T22:34:07Z", "sigma_s": 8 }] });
        assert_eq!(
            post_json(port, "/api/submissions", &body.to_string()).status,
            201
        );
    }
    let solution = settled_solution(&server);
    let export = get(port, "/api/export.csv", Some(TOKEN)).body;
    let cells: Vec<&str> = export
        .lines()
        .skip(1)
        .map(|l| l.split(',').next().unwrap())
        .collect();
    assert!(cells[0].starts_with("\"'=HYPERLINK"), "{export}");
    assert!(cells[1].starts_with("'@SUM"), "{export}");
    assert!(
        export.contains(",-33.87,"),
        "numbers stay numbers: {export}"
    );
    let path = temp(&format!("formula-{port}.csv"), export.as_bytes());
    let o = run(&[
        "reduce",
        &path,
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--format",
        "json",
    ]);
    let direct: serde_json::Value =
        serde_json::from_str(&out(&o)).unwrap_or_else(|_| panic!("{}", err(&o)));
    assert_eq!(direct["timings_total"], solution["timings_total"]);
    let text = direct.to_string();
    assert!(
        text.contains("=HYPERLINK(\\\"http://x\\\",\\\"y\\\")") && text.contains("\"@SUM(1)\""),
        "{text}"
    );
    assert!(
        !text.contains("'@SUM") && !text.contains("'=HYPER"),
        "{text}"
    );
}

/// The headers every response carries.
fn assert_security_headers(what: &str, r: &common::server::Reply) {
    let csp = r
        .header("content-security-policy")
        .unwrap_or_else(|| panic!("CSP on {what}"));
    assert!(
        csp.contains("default-src 'none'")
            && csp.contains("frame-ancestors 'none'")
            && !csp.contains("unsafe-inline"),
        "{csp}"
    );
    assert_eq!(
        r.header("x-content-type-options").as_deref(),
        Some("nosniff"),
        "{what}"
    );
    assert_eq!(
        r.header("referrer-policy").as_deref(),
        Some("no-referrer"),
        "{what}"
    );
    assert_eq!(
        r.header("x-frame-options").as_deref(),
        Some("DENY"),
        "{what}"
    );
}

#[test]
fn headers_everywhere_and_limits_said_plainly() {
    let server = start(&db("headers"), &["--token", TOKEN]);
    let port = server.port;
    let big_paste = format!("csv={}", "a".repeat(300 * 1024));
    let (cookie, _) = visitor(port);
    let ch = format!("Cookie: {cookie}");
    let paste = request(
        port,
        "POST",
        "/submit",
        &["Content-Type: application/x-www-form-urlencoded", &ch],
        big_paste.as_bytes(),
    );
    let file = "x".repeat(300 * 1024);
    let multipart = format!("--XyZ\r\nContent-Disposition: form-data; name=\"file\"; filename=\"t.csv\"\r\nContent-Type: text/csv\r\n\r\n{file}\r\n--XyZ--\r\n");
    let upload = request(
        port,
        "POST",
        "/upload",
        &["Content-Type: multipart/form-data; boundary=XyZ", &ch],
        multipart.as_bytes(),
    );
    for (what, r) in [("paste", &paste), ("upload", &upload)] {
        assert_eq!(r.status, 413, "{what}: {}", r.body);
        assert!(
            r.body.contains("256 KB") && r.body.contains("href=\"/\"") && r.body.contains("Split"),
            "{what}: {}",
            r.body
        );
        assert!(
            r.body.contains("certified solar filter") && !r.body.contains("choose a file"),
            "{what}"
        );
    }
    let api = request(
        port,
        "POST",
        "/api/submissions",
        &["Content-Type: application/json"],
        &vec![b' '; 300 * 1024],
    );
    assert_eq!(api.status, 413);
    assert!(api.json()["error"].as_str().unwrap().contains("256 KB"));
    let form = get(port, "/", None);
    assert!(form.body.contains("256 KB") && form.body.contains("rows"));
    let solution = get(port, "/api/solution", Some(TOKEN));
    let missing = get(port, "/no/such/page", None);
    assert_eq!(missing.status, 404);
    for (what, r) in [
        ("/", &form),
        ("solution", &solution),
        ("404", &missing),
        ("413", &paste),
        ("413 api", &api),
    ] {
        assert_security_headers(what, r);
    }
    assert_eq!(settled_solution(&server)["submissions"], 0);
}

#[test]
fn public_posts_are_rate_limited_and_the_start_up_says_so() {
    let o = run(&[
        "serve",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--db",
        db("rate-line").to_str().unwrap(),
        "--listen",
        "127.0.0.1:0",
        "--public",
        "--stop-after",
        "1",
    ]);
    assert!(
        err(&o).contains("rate limit on: 10 posts a second per address, bursts of 60"),
        "{}",
        err(&o)
    );
    let server = start(&db("rate"), &["--token", TOKEN, "--public"]);
    let statuses: Vec<u16> = (0..100)
        .map(|_| {
            request(
                server.port,
                "POST",
                "/api/submissions",
                &["Content-Type: text/plain"],
                b"x",
            )
            .status
        })
        .collect();
    let refused = statuses.iter().filter(|s| **s == 429).count();
    assert!(statuses[..60].iter().all(|s| *s == 415), "{statuses:?}");
    assert!(refused >= 20, "{statuses:?}");
    let unlimited = start(&db("norate"), &["--token", TOKEN]);
    assert!((0..100).all(|_| request(
        unlimited.port,
        "POST",
        "/api/submissions",
        &["Content-Type: text/plain"],
        b"x"
    )
    .status
        == 415));
}
