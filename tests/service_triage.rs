//! How each timing was made and the organiser's triage, through the server on 127.0.0.1 (each
//! server stops by itself): submissions with their clock, instrument, aperture, viewing and
//! notes; the export's columns read back by `reduce` (grouped residuals in its JSON, a bad
//! clock source named with file, line and column); the table filtered by metadata and
//! verdict, searched and sorted; timings excluded in bulk, restored with a reason shown in the
//! audit trail; a note shown on the participant's private link; and nothing changed by a form
//! without the visitor's anti-forgery token.

mod common;

use common::server::{
    assert_export_reduces_to, get, post_json, predicted_at, request, settled_solution, sign_in,
    start, visitor, Reply,
};
use common::{err, out, run, temp};

fn db(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-triage-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir.join("campaign.sqlite")
}

/// Six invented stations, (name, latitude, longitude, clock source, aperture mm, observer).
const STATIONS: [(&str, f64, f64, &str, f64, &str); 6] = [
    ("Kestrel Point", 64.84, -147.72, "gps", 80.0, "Ana Quill"),
    ("Driftwood Bay", 21.31, -157.86, "gps", 120.0, "Bo Lantern"),
    ("Cedar Valley", 35.01, 135.77, "radio", 50.0, "Cy Meadow"),
    (
        "Harbour Hill",
        -33.87,
        151.21,
        "phone",
        200.0,
        "Di Fernleaf",
    ),
    ("Coral Reach", 13.44, 144.79, "phone", 70.0, "Ed Saltmarsh"),
    (
        "Jade Harbour",
        22.28,
        114.16,
        "network",
        90.0,
        "Fay Tidewater",
    ),
];

/// Submit the six stations: how they timed at the submission's level, Coral Reach's contact
/// III with its own clock source and a note that begins with a formula character.
fn seed(port: u16) -> Vec<String> {
    let mut links = Vec::new();
    for (k, (name, lat, lon, clock, aperture, observer)) in STATIONS.into_iter().enumerate() {
        let e = 3.0 * (k as f64 - 2.5);
        let mut third = serde_json::json!({ "contact": 3, "time_utc": predicted_at(lat, lon, 3, -e), "sigma_s": 8 });
        if name == "Coral Reach" {
            third["clock_source"] = "gps".into();
            third["notes"] = "=HYPERLINK(\"x\")".into();
        }
        let body = serde_json::json!({
            "station": name, "latitude": lat, "longitude": lon, "observer": observer,
            "clock_source": clock, "aperture_mm": aperture, "instrument": "refractor",
            "viewing": if k % 2 == 0 { "filter" } else { "projection" },
            "notes": "steady air",
            "timings": [{ "contact": 2, "time_utc": predicted_at(lat, lon, 2, e), "sigma_s": 8 }, third]
        });
        let r = post_json(port, "/api/submissions", &body.to_string());
        assert_eq!(r.status, 201, "{}", r.body);
        links.push(r.json()["review"].as_str().unwrap().to_string());
    }
    links
}

/// The signed-in organiser with a visitor's anti-forgery token: (cookie header, token).
fn organiser(server: &common::server::Server) -> (String, String) {
    let (visitor_cookie, csrf) = visitor(server.port);
    let session = sign_in(server.port, &server.token);
    (format!("Cookie: {visitor_cookie}; {session}"), csrf)
}

fn post_form(port: u16, path: &str, cookies: &str, form: &str) -> Reply {
    request(
        port,
        "POST",
        path,
        &["Content-Type: application/x-www-form-urlencoded", cookies],
        form.as_bytes(),
    )
}

fn page(port: u16, path: &str, cookies: &str) -> String {
    let r = request(port, "GET", path, &[cookies], b"");
    assert_eq!(r.status, 200, "{path}: {}", r.body);
    r.body
}

/// The ids of the table's rows on a page (from the boxes that tick them).
fn row_ids(html: &str) -> Vec<i64> {
    html.split("type=\"checkbox\" form=\"bulk\" name=\"timing\" value=\"")
        .skip(1)
        .filter_map(|s| s[..s.find('"')?].parse().ok())
        .collect()
}

/// The table of every timing, from its opening tag on.
fn table_part(html: &str) -> &str {
    &html[html.find("<table id=\"rows\">").expect("the table")..]
}

#[test]
fn metadata_is_stored_exported_and_read_back_by_reduce() {
    let server = start(&db("metadata"), &[]);
    seed(server.port);
    let solution = settled_solution(&server);
    let export = get(server.port, "/api/export.csv", Some(&server.token));
    assert_eq!(export.status, 200);
    let header = export.body.lines().next().unwrap().to_string();
    for col in [
        "clock_source",
        "instrument",
        "aperture_mm",
        "viewing",
        "notes",
    ] {
        assert!(header.split(',').any(|c| c == col), "{col} in {header}");
    }
    // A text cell beginning with a formula character is neutralised; the others are as sent.
    assert!(
        export.body.contains("\"'=HYPERLINK(\"\"x\"\")\""),
        "{}",
        export.body
    );
    assert!(export
        .body
        .contains(",phone,refractor,200.0,projection,steady air"));
    // The timing's own clock source wins over the submission's.
    let coral: Vec<&str> = export
        .body
        .lines()
        .filter(|l| l.starts_with("Coral Reach"))
        .collect();
    assert!(
        coral[0].contains(",phone,") && coral[1].contains(",gps,"),
        "{coral:?}"
    );
    // The export reduces to the service's solution, with the residuals grouped.
    let direct = assert_export_reduces_to(&server, &solution);
    assert_eq!(
        solution["residuals_by_clock_source"],
        direct["residuals_by_clock_source"]
    );
    let clocks = direct["residuals_by_clock_source"].as_array().unwrap();
    let count = |g: &str| {
        clocks
            .iter()
            .find(|x| x["group"] == g)
            .map_or(0, |x| x["timings"].as_u64().unwrap())
    };
    assert_eq!(
        (count("gps"), count("phone"), count("radio")),
        (5, 3, 2),
        "{clocks:?}"
    );
    let radio = clocks.iter().find(|x| x["group"] == "radio").unwrap();
    assert!(radio["mean_o_c_sigma_s"].as_f64().unwrap() > 0.0);
    let apertures = direct["residuals_by_aperture"].as_array().unwrap();
    let labels: Vec<&str> = apertures
        .iter()
        .map(|g| g["group"].as_str().unwrap())
        .collect();
    assert_eq!(labels, ["<= 60 mm", "61-100 mm", "101-150 mm", "> 150 mm"]);
    // The report shows the groups.
    let path = temp("triage-export.csv", export.body.as_bytes());
    let report = temp("triage-report.md", b"");
    let o = run(&[
        "reduce",
        &path,
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--report",
        &report,
    ]);
    assert!(o.status.success(), "{}", err(&o));
    let md = std::fs::read_to_string(&report).unwrap();
    assert!(
        md.contains("## How the timings were made") && md.contains("Residuals by clock source")
    );
    // A clock source that is not one of the words: named with file, line, column and the
    // allowed words (with --strict an error; without, the row is listed as invalid).
    let bad = export.body.replacen(",radio,", ",sundial,", 1);
    let line = bad.lines().position(|l| l.contains(",sundial,")).unwrap() + 1;
    let bad_path = temp("triage-bad.csv", bad.as_bytes());
    let o = run(&[
        "reduce",
        &bad_path,
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--strict",
    ]);
    assert_eq!(o.status.code(), Some(2));
    let e = err(&o);
    assert!(
        e.contains(&format!("triage-bad.csv:{line}:")) && e.contains("column 'clock_source'"),
        "{e}"
    );
    assert!(
        e.contains("clock_source") && e.contains("gps, radio, network, phone or other"),
        "{e}"
    );
    let o = run(&[
        "reduce",
        &bad_path,
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--format",
        "json",
    ]);
    let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap();
    let r = &v["rejected"][0];
    assert_eq!(
        (r["line"].as_u64(), r["reason"].as_str()),
        (Some(line as u64), Some("invalid"))
    );
}

#[test]
fn the_organiser_filters_excludes_in_bulk_restores_with_a_reason_and_writes_a_note() {
    let server = start(&db("triage"), &[]);
    let port = server.port;
    let links = seed(port);
    settled_solution(&server);
    let (cookies, csrf) = organiser(&server);
    // Filters by clock source, viewing, verdict; search by observer; order by |O - C|.
    let phones = row_ids(&page(port, "/organiser?clock=phone", &cookies));
    assert_eq!(phones.len(), 3, "{phones:?}");
    let projection = row_ids(&page(
        port,
        "/organiser?viewing=projection&clock=gps",
        &cookies,
    ));
    assert_eq!(projection.len(), 2, "{projection:?}");
    let fits = row_ids(&page(port, "/organiser?verdict=fits", &cookies));
    assert_eq!(fits.len(), 12);
    assert!(row_ids(&page(port, "/organiser?verdict=rejected", &cookies)).is_empty());
    let by_observer = page(port, "/organiser?q=fernleaf", &cookies);
    assert_eq!(row_ids(&by_observer).len(), 2);
    let table = table_part(&by_observer);
    assert!(table.contains("<td>Harbour Hill</td>") && !table.contains("<td>Kestrel Point</td>"));
    // The largest |O - C| were sent at +-7.5 s (the first and the last station), the
    // smallest at +-1.5 s.
    let sorted = page(port, "/organiser?sort=o_c", &cookies);
    let table = table_part(&sorted);
    let at = |x: &str| table.find(x).unwrap_or_else(|| panic!("{x} in {table}"));
    assert!(at("7.5 s</td>") < at("4.5 s</td>") && at("4.5 s</td>") < at("1.5 s</td>"));
    let page_all = page(port, "/organiser", &cookies);
    assert!(page_all.contains("id=\"attention\"") && page_all.contains("id=\"bulk\""));
    assert!(
        page_all.contains("Residuals by clock source")
            && page_all.contains("Residuals by aperture class")
    );
    // Without the anti-forgery token nothing changes.
    let ids: Vec<i64> = phones.clone();
    let ticked: String = ids.iter().map(|i| format!("&timing={i}")).collect();
    let r = post_form(
        port,
        "/organiser/exclude-many",
        &cookies,
        &format!("scope=checked&reason=x{ticked}"),
    );
    assert_eq!(r.status, 403);
    let r = post_form(port, "/organiser/note", &cookies, "submission=1&note=x");
    assert_eq!(r.status, 403);
    let r = post_form(port, "/organiser/restore", &cookies, "timing=1&reason=x");
    assert_eq!(r.status, 403);
    let r = request(
        port,
        "POST",
        "/organiser/exclude-many",
        &["Content-Type: application/x-www-form-urlencoded"],
        format!("csrf={csrf}&scope=filtered&reason=x").as_bytes(),
    );
    assert_eq!(r.status, 401);
    assert_eq!(
        row_ids(&page(port, "/organiser?state=excluded", &cookies)).len(),
        0
    );
    // Bulk exclusion of the ticked rows, then of every row the filters show.
    let r = post_form(
        port,
        "/organiser/exclude-many",
        &cookies,
        &format!(
            "csrf={csrf}&scope=checked&reason=phone+clocks+unchecked&timing={}&timing={}",
            ids[0], ids[1]
        ),
    );
    assert_eq!(r.status, 303, "{}", r.body);
    assert_eq!(
        row_ids(&page(port, "/organiser?state=excluded", &cookies)),
        ids[..2].to_vec()
    );
    let r = post_form(
        port,
        "/organiser/exclude-many",
        &cookies,
        &format!("csrf={csrf}&scope=filtered&clock=phone&reason=phone+clocks+unchecked"),
    );
    assert_eq!(r.status, 303, "{}", r.body);
    assert!(r.header("location").unwrap().contains("clock=phone"));
    assert_eq!(
        row_ids(&page(port, "/organiser?state=excluded", &cookies)),
        ids
    );
    let r = post_form(
        port,
        "/organiser/exclude-many",
        &cookies,
        &format!("csrf={csrf}&scope=checked&reason="),
    );
    assert_eq!(r.status, 400);
    let solution = settled_solution(&server);
    assert_eq!(solution["timings_total"], 9);
    // Restoring asks a reason, and the audit trail shows it.
    let r = post_form(
        port,
        "/organiser/restore",
        &cookies,
        &format!("csrf={csrf}&timing={}", ids[2]),
    );
    assert_eq!(r.status, 400);
    let r = post_form(
        port,
        "/organiser/restore",
        &cookies,
        &format!(
            "csrf={csrf}&timing={}&reason=clock+checked+against+GPS",
            ids[2]
        ),
    );
    assert_eq!(r.status, 303);
    let audit = page(port, "/organiser", &cookies);
    let trail = &audit[audit.find("Audit trail").unwrap()..];
    assert!(
        trail.contains(&format!(
            "<td>restored</td><td>{}</td><td>clock checked against GPS</td>",
            ids[2]
        )),
        "{trail}"
    );
    assert_eq!(trail.matches("phone clocks unchecked").count(), 3);
    assert_eq!(settled_solution(&server)["timings_total"], 10);
    // A note to the participant, shown on the private link only.
    let submission: i64 = links[3]
        .split('/')
        .nth(2)
        .unwrap()
        .split('?')
        .next()
        .unwrap()
        .parse()
        .unwrap();
    let r = post_form(
        port,
        "/organiser/note",
        &cookies,
        &format!("csrf={csrf}&submission={submission}&note=Please+check+<your>+phone%27s+clock"),
    );
    assert_eq!(r.status, 303, "{}", r.body);
    let review = get(port, &links[3], None);
    assert!(review.body.contains("Notes from the organiser"));
    assert!(
        review
            .body
            .contains("Please check &lt;your&gt; phone&#39;s clock")
            || review
                .body
                .contains("Please check &lt;your&gt; phone's clock"),
        "{}",
        review.body
    );
    assert!(!get(port, &links[0], None)
        .body
        .contains("Notes from the organiser"));
    let r = post_form(
        port,
        "/organiser/note",
        &cookies,
        &format!("csrf={csrf}&submission=999&note=x"),
    );
    assert_eq!(r.status, 404);
}

/// The participant's form carries how the timings were made to the store and back.
#[test]
fn the_form_sends_how_the_timings_were_made() {
    let server = start(&db("form"), &[]);
    let port = server.port;
    let form = get(port, "/", None).body;
    for field in [
        "clock_source",
        "viewing",
        "aperture_mm",
        "instrument",
        "notes",
        "observer",
    ] {
        assert!(form.contains(&format!("<label for=\"{field}\"")), "{field}");
    }
    assert!(form.contains("inputmode=\"numeric\""));
    let (cookie, csrf) = visitor(port);
    let t2 = predicted_at(22.28, 114.16, 2, 1.0).replace(':', "%3A");
    let body = format!("csrf={csrf}&station=Jade+Harbour&latitude=22.28&longitude=114.16&observer=Gil+Ember&clock_source=radio&instrument=reflector&aperture_mm=150&viewing=projection&notes=%2Bsun+low&contact0=2&time_utc0={t2}&sigma_s0=8");
    let r = request(
        port,
        "POST",
        "/submit",
        &[
            "Content-Type: application/x-www-form-urlencoded",
            &format!("Cookie: {cookie}"),
        ],
        body.as_bytes(),
    );
    assert_eq!(r.status, 201, "{}", r.body);
    settled_solution(&server);
    let export = get(port, "/api/export.csv", Some(&server.token)).body;
    assert!(
        export.contains(",radio,reflector,150,projection,'+sun low"),
        "{export}"
    );
}

/// The worked example's 82 timings with a clock source each (in turn gps, radio, network,
/// phone, other) and an aperture; the phones' times 25 s late: the phone group departs from
/// the rest and the reduction says so, the others do not.
#[test]
fn a_group_of_bad_clocks_stands_out_in_the_residuals() {
    let path = [
        env!("CARGO_MANIFEST_DIR"),
        "worked-examples",
        "venus-2012-school-network",
        "timings.csv",
    ]
    .iter()
    .collect::<std::path::PathBuf>();
    let text = std::fs::read_to_string(path).unwrap();
    let clocks = ["gps", "radio", "network", "phone", "other"];
    let mut file_text = String::new();
    for (k, line) in text.lines().enumerate() {
        if k == 0 {
            file_text.push_str(&format!("{line},clock_source,aperture_mm\n"));
            continue;
        }
        let mut cells: Vec<String> = line.split(',').map(String::from).collect();
        let clock = clocks[(k - 1) % 5];
        if clock == "phone" {
            if let Ok(t) = transit_parallax::time::iso::parse_utc(&cells[5]) {
                cells[5] =
                    transit_parallax::time::iso::format_utc(t + chrono::TimeDelta::seconds(25), 1);
            }
        }
        file_text.push_str(&format!(
            "{},{clock},{}\n",
            cells.join(","),
            [50, 80, 120, 200][(k - 1) % 4]
        ));
    }
    let file = temp("triage-phones.csv", file_text.as_bytes());
    let o = run(&["reduce", &file, "--format", "json"]);
    assert!(o.status.success(), "{}", err(&o));
    let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap();
    let groups = v["residuals_by_clock_source"].as_array().unwrap();
    for g in groups {
        let z = g["departure_sigmas"].as_f64().unwrap();
        if g["group"] == "phone" {
            assert!(z > 3.0, "{g}");
            let note = g["note"].as_str().unwrap();
            assert!(note.starts_with("Timings read from phone clocks"), "{note}");
            assert!(g["mean_o_c_s"].as_f64().unwrap() > 10.0, "{g}");
        } else {
            assert!(z.abs() < 3.0, "{g}");
            assert!(g["note"].is_null(), "{g}");
        }
        assert!(g["scatter_s"].as_f64().unwrap() > 0.0);
    }
    let table = out(&run(&["reduce", &file]));
    assert!(
        table.contains("Residuals by clock source")
            && table.contains("Timings read from phone clocks"),
        "{table}"
    );
}
