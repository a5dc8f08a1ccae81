//! Registration before the event, over HTTP on 127.0.0.1 (each server stops by itself): a
//! station registered through `POST /api/registrations` gets a private link whose sheet is
//! byte for byte the page `predict --sheets` writes for it (the contacts in its time zone, the
//! caution) and whose calendar parses as iCalendar with the same contact events; a bad zone
//! or place is refused with the field named; non-JSON, foreign and oversized posts store
//! nothing; the form for people answers with the links; the organiser sees the stations
//! planned against reported, linked by name; a station registered in German gets its sheet,
//! calendar and private page in German (the page following a later choice on the switch).

mod common;

use common::server::{get, post_json, request, seed_five_stations, start, visitor, Server};
use common::{err, run_words, temp};
use std::path::PathBuf;

const TOKEN: &str = "Organiser5Plan";

fn db(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-registration-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir.join("campaign.sqlite")
}

fn register(server: &Server, body: serde_json::Value) -> common::server::Reply {
    post_json(server.port, "/api/registrations", &body.to_string())
}

/// The organiser page's count of this id (`n-registered`, ...).
fn count(page: &str, id: &str) -> i64 {
    let k = page
        .find(&format!("id=\"{id}\">"))
        .unwrap_or_else(|| panic!("no {id} on the page"))
        + id.len()
        + 6;
    page[k..page[k..].find('<').unwrap() + k].parse().unwrap()
}

fn registered_count(server: &Server) -> i64 {
    let page = get(server.port, "/organiser", Some(&server.token));
    assert_eq!(page.status, 200);
    count(&page.body, "n-registered")
}

/// The sheet and calendar `predict --sheets` writes for one station in a zone.
fn predicted_sheet(name: &str, row: &str) -> (String, String) {
    predicted_sheet_in(name, row, "en")
}

/// The sheet and calendar `predict --sheets --language CODE` writes for one station.
fn predicted_sheet_in(name: &str, row: &str, code: &str) -> (String, String) {
    let stations = temp(
        &format!("reg-{name}.csv"),
        format!("station,latitude,longitude,elevation_m,time_zone\n{row}\n").as_bytes(),
    );
    let dir = std::env::temp_dir().join(format!(
        "tp-reg-sheets-{}-{name}-{code}",
        std::process::id()
    ));
    let o = run_words(
        "predict --planet venus --date 2012-06-06 --format json --stations",
        &[
            &stations,
            "--sheets",
            dir.to_str().unwrap(),
            "--language",
            code,
        ],
    );
    assert!(o.status.success(), "{}", err(&o));
    let read = |ext: &str| std::fs::read_to_string(dir.join(format!("{name}.{ext}"))).unwrap();
    (read("html"), read("ics"))
}

/// An iCalendar text without its DTSTAMP lines (the time it was made).
fn without_stamps(ics: &str) -> String {
    ics.split("\r\n")
        .filter(|l| !l.starts_with("DTSTAMP:"))
        .collect::<Vec<_>>()
        .join("\r\n")
}

#[test]
fn a_registered_station_gets_the_sheet_and_calendar_of_predict_sheets() {
    let server = start(&db("sheet"), &["--token", TOKEN]);
    let reply = register(
        &server,
        serde_json::json!({ "station": "Lantern Hill School", "latitude": 35.68,
            "longitude": 139.69, "elevation_m": 40, "time_zone": "Asia/Tokyo" }),
    );
    assert_eq!(reply.status, 201, "{}", reply.body);
    let v = reply.json();
    let id = v["registration_id"].as_str().unwrap();
    assert_eq!(id.len(), 24);
    assert!(id.chars().all(|c| c.is_ascii_alphanumeric()), "{id}");
    let sheet_url = v["sheet_url"].as_str().unwrap();
    let calendar_url = v["calendar_url"].as_str().unwrap();
    assert_eq!(sheet_url, format!("/registrations/{id}/sheet.html"));
    assert_eq!(calendar_url, format!("/registrations/{id}/calendar.ics"));

    let (want_html, want_ics) = predicted_sheet(
        "Lantern_Hill_School",
        "Lantern Hill School,35.68,139.69,40,Asia/Tokyo",
    );
    let sheet = get(server.port, sheet_url, None);
    assert_eq!(sheet.status, 200);
    assert!(sheet
        .header("content-type")
        .unwrap()
        .starts_with("text/html"));
    assert_eq!(sheet.header("cache-control").as_deref(), Some("no-store"));
    assert_eq!(sheet.body, want_html, "the sheet of predict --sheets");
    assert!(sheet.body.contains("certified solar filter"), "the caution");
    // The contacts in the station's clock time (JST, UTC+9): contact II at 22:28:30 UTC.
    assert!(sheet.body.contains("07:28:30 JST"), "contact II in JST");

    let calendar = get(server.port, calendar_url, None);
    assert_eq!(calendar.status, 200);
    assert_eq!(
        calendar.header("content-type").as_deref(),
        Some("text/calendar; charset=utf-8")
    );
    assert!(calendar
        .header("content-disposition")
        .unwrap()
        .contains("Lantern_Hill_School.ics"));
    let parsed: icalendar::Calendar = calendar.body.parse().expect("RFC 5545 text");
    assert_eq!(parsed.components.len(), 4, "four contacts with the Sun up");
    assert_eq!(without_stamps(&calendar.body), without_stamps(&want_ics));
    let predicted = common::server::predicted_utc("Lantern Hill School", 35.68, 139.69);
    for utc in predicted.iter().flatten() {
        // DTSTART is the predicted time rounded to the second.
        let t = chrono::DateTime::parse_from_rfc3339(utc).unwrap()
            + chrono::TimeDelta::milliseconds(500);
        let stamp = t.format("DTSTART:%Y%m%dT%H%M%SZ").to_string();
        assert!(calendar.body.contains(&stamp), "{stamp}");
    }

    let private = get(server.port, v["registration_url"].as_str().unwrap(), None);
    assert_eq!(private.status, 200);
    assert!(private.body.contains(&format!("href=\"{sheet_url}\"")));
    assert!(private
        .body
        .contains("Contact II: 07:28:30 JST (22:28:30 UTC)"));
    assert!(!private.body.contains(TOKEN));
    // Another registration, another key; keys that open nothing answer 404.
    let other = register(
        &server,
        serde_json::json!({ "station": "Lantern Hill School", "latitude": 35.68,
            "longitude": 139.69, "time_zone": "+09:00" }),
    );
    assert_eq!(other.status, 201);
    assert_ne!(other.json()["registration_id"], v["registration_id"]);
    let wrong = format!("/registrations/{}/sheet.html", "A".repeat(24));
    assert_eq!(get(server.port, &wrong, None).status, 404);
    assert_eq!(
        get(server.port, "/registrations/short/calendar.ics", None).status,
        404
    );
    // Two registrations under one name are one station, listed twice.
    assert_eq!(registered_count(&server), 1);
    let page = get(server.port, "/organiser", Some(&server.token)).body;
    assert_eq!(page.matches("<td>Lantern Hill School</td>").count(), 2);
}

#[test]
fn bad_registrations_are_refused_with_the_field_named_and_nothing_stored() {
    let server = start(&db("bad"), &["--token", TOKEN]);
    let body = |lat: serde_json::Value, lon: serde_json::Value, zone: &str| {
        serde_json::json!({ "station": "Quiet Ridge", "latitude": lat, "longitude": lon,
            "time_zone": zone })
    };
    for (b, words) in [
        (
            body(35.0.into(), 139.0.into(), "Asia/Tokio"),
            ["'time_zone'", "'Asia/Tokio' is not a zone"],
        ),
        (
            body(35.0.into(), 139.0.into(), ""),
            ["'time_zone' is missing", "Europe/Amsterdam"],
        ),
        (
            body(95.0.into(), 139.0.into(), "UTC"),
            ["'latitude' is 95", "-90 to 90"],
        ),
        (
            body(35.0.into(), "east".into(), "UTC"),
            ["'longitude' is 'east'", "not a number"],
        ),
        (
            serde_json::json!({ "latitude": 1, "longitude": 2, "time_zone": "UTC" }),
            ["'station' is missing", "name"],
        ),
    ] {
        let r = register(&server, b);
        assert_eq!(r.status, 400, "{}", r.body);
        let e = r.json()["error"].as_str().unwrap().to_string();
        for w in words {
            assert!(e.contains(w), "{w} in {e}");
        }
    }
    let good = body(35.0.into(), 139.0.into(), "Asia/Tokyo").to_string();
    let plain = request(
        server.port,
        "POST",
        "/api/registrations",
        &["Content-Type: text/plain"],
        good.as_bytes(),
    );
    assert_eq!(plain.status, 415, "{}", plain.body);
    let foreign = request(
        server.port,
        "POST",
        "/api/registrations",
        &[
            "Content-Type: application/json",
            "Origin: https://elsewhere.example",
        ],
        good.as_bytes(),
    );
    assert_eq!(foreign.status, 403, "{}", foreign.body);
    let huge = format!("{{\"station\":\"{}\"}}", "x".repeat(300 * 1024));
    let over = post_json(server.port, "/api/registrations", &huge);
    assert_eq!(over.status, 413);
    assert_eq!(registered_count(&server), 0, "nothing stored");

    // The form for people: refused without its token, the reason and the values kept on a
    // bad zone, the links on success.
    let (cookie, csrf) = visitor(server.port);
    let page = get(server.port, "/register", None);
    assert!(page.body.contains("<label for=\"time_zone\">"));
    assert!(page.body.contains("certified solar filter"));
    let cookie = format!("Cookie: {cookie}");
    let ct = "Content-Type: application/x-www-form-urlencoded";
    let form = |csrf: &str, zone: &str| {
        format!("csrf={csrf}&station=Quiet+Ridge&latitude=-33.9&longitude=151.2&elevation_m=&time_zone={zone}")
    };
    let forged = request(
        server.port,
        "POST",
        "/register",
        &[&cookie, ct],
        form("00", "UTC").as_bytes(),
    );
    assert_eq!(forged.status, 403);
    let bad = request(
        server.port,
        "POST",
        "/register",
        &[&cookie, ct],
        form(&csrf, "Mars%2FOlympus").as_bytes(),
    );
    assert_eq!(bad.status, 400);
    assert!(bad.body.contains("id=\"error\"") && bad.body.contains("Mars/Olympus"));
    assert!(bad.body.contains("value=\"-33.9\""), "the values kept");
    assert_eq!(registered_count(&server), 0);
    let ok = request(
        server.port,
        "POST",
        "/register",
        &[&cookie, ct],
        form(&csrf, "Australia%2FSydney").as_bytes(),
    );
    assert_eq!(ok.status, 201, "{}", ok.body);
    assert!(ok.body.contains("id=\"sheet\"") && ok.body.contains("AEST"));
    assert_eq!(registered_count(&server), 1);
}

#[test]
fn the_organiser_sees_stations_planned_against_reported() {
    let server = start(&db("plan"), &["--token", TOKEN]);
    // One of the five stations that will report, named in another case and spacing, and one
    // that will stay silent.
    for (name, lat, lon) in [
        ("cedar  VALLEY", 35.01, 135.77),
        ("Quiet Ridge", -41.3, 174.8),
    ] {
        let r = register(
            &server,
            serde_json::json!({ "station": name, "latitude": lat, "longitude": lon,
                "time_zone": "UTC" }),
        );
        assert_eq!(r.status, 201);
    }
    let before = get(server.port, "/organiser", Some(&server.token)).body;
    assert_eq!(
        [
            count(&before, "n-registered"),
            count(&before, "n-reported"),
            count(&before, "n-silent")
        ],
        [2, 0, 2]
    );
    seed_five_stations(&server, false);
    let page = get(server.port, "/organiser", Some(&server.token)).body;
    assert_eq!(
        [
            count(&page, "n-registered"),
            count(&page, "n-reported"),
            count(&page, "n-silent"),
            count(&page, "n-walk-in"),
        ],
        [2, 5, 1, 4]
    );
    // On the map: the silent one an open triangle, the linked one a circle, the four others
    // squares (each kind once more in the key), with a caption.
    assert_eq!(page.matches("<path class=\"silent\"").count(), 2);
    assert_eq!(page.matches("<circle class=\"reg-reported\"").count(), 2);
    assert_eq!(page.matches("<rect class=\"walk-in\"").count(), 5);
    assert!(page.contains("<figcaption>Stations planned against reported"));
    assert!(page.contains("id=\"as-of\""));
    assert!(page.contains("<td>Quiet Ridge</td>") && page.contains("none yet"));
    // The private keys never reach the organiser.
    assert!(!page.contains("/registrations/"));
}

/// The `href` of the link with this id on a page.
fn href_of(page: &str, id: &str) -> String {
    let k = page
        .find(&format!("id=\"{id}\" href=\""))
        .unwrap_or_else(|| panic!("no link {id}"))
        + id.len()
        + 12;
    page[k..k + page[k..].find('"').unwrap()].replace("&amp;", "&")
}

#[test]
fn a_station_registered_in_german_gets_its_sheet_calendar_and_page_in_german() {
    let server = start(&db("german"), &["--token", TOKEN]);
    // The form in German (the switch's ?lang=de, then kept in the cookie).
    let (cookie, csrf) = visitor(server.port);
    let form = request(
        server.port,
        "GET",
        "/register?lang=de",
        &[&format!("Cookie: {cookie}")],
        b"",
    );
    assert!(
        form.body.contains("<html lang=\"de\">")
            && form.body.contains("name=\"lang\" value=\"de\"")
    );
    let lang_cookie = common::server::cookie_of(&form, "tp_lang").expect("the choice kept");
    assert_eq!(lang_cookie, "tp_lang=de");
    let body = format!("csrf={csrf}&lang=de&station=Lantern+Hill+School&latitude=35.68&longitude=139.69&elevation_m=40&time_zone=Asia%2FTokyo");
    let cookies = format!("Cookie: {cookie}; {lang_cookie}");
    let ok = request(
        server.port,
        "POST",
        "/register",
        &[&cookies, "Content-Type: application/x-www-form-urlencoded"],
        body.as_bytes(),
    );
    assert_eq!(ok.status, 201, "{}", ok.body);
    // The private page in German: its title, the caution, the contacts, the decimal comma.
    assert!(ok.body.contains("<html lang=\"de\">"));
    assert!(ok.body.contains("Angemeldet: Lantern Hill School"));
    assert!(ok.body.contains("zertifizierten Sonnenfilter"));
    assert!(
        ok.body.contains("Kontakt II: 07:28:30 JST (22:28:30 UTC)"),
        "{}",
        ok.body
    );
    assert!(ok.body.contains("Breite 35,6800°"));
    assert!(!ok.body.contains("Your observers' sheet"));
    let sheet_url = href_of(&ok.body, "sheet");
    let calendar_url = href_of(&ok.body, "calendar");
    let private_url = href_of(&ok.body, "private");
    assert!(
        !sheet_url.contains("lang="),
        "the registration's own language: {sheet_url}"
    );

    // The sheet, with no cookie at all, is the German page predict --sheets writes.
    let (want_html, want_ics) = predicted_sheet_in(
        "Lantern_Hill_School",
        "Lantern Hill School,35.68,139.69,40,Asia/Tokyo",
        "de",
    );
    let sheet = get(server.port, &sheet_url, None);
    assert_eq!(sheet.status, 200);
    assert_eq!(sheet.header("content-language").as_deref(), Some("de"));
    assert_eq!(
        sheet.body, want_html,
        "the sheet of predict --sheets --language de"
    );
    assert!(
        sheet.body.contains("zertifizierten Sonnenfilter")
            && sheet.body.contains("Die vier Kontakte")
    );
    assert!(sheet.body.contains("Venustransit, 6. Juni 2012"));
    // The calendar likewise.
    let calendar = get(server.port, &calendar_url, None);
    assert_eq!(calendar.status, 200);
    assert_eq!(without_stamps(&calendar.body), without_stamps(&want_ics));
    let unfolded = calendar.body.replace("\r\n ", "");
    assert!(unfolded.contains("SUMMARY:Venustransit: Kontakt II (Lantern Hill School)"));
    assert!(unfolded.contains("VORSICHT: Ein Blick in die Sonne"));

    // Opened later with an English browser and no choice made: still German (the language
    // the participant registered in), whatever the browser says.
    let later = request(
        server.port,
        "GET",
        &private_url,
        &["Accept-Language: en-GB"],
        b"",
    );
    assert!(later.body.contains("<html lang=\"de\">"), "{}", later.body);
    // Chosen French on the switch: the page in French, its links ask for French sheets.
    let french = request(
        server.port,
        "GET",
        &format!("{private_url}?lang=fr"),
        &[],
        b"",
    );
    assert!(
        french.body.contains("<html lang=\"fr\">")
            && french.body.contains("Inscrite : Lantern Hill School")
    );
    let french_sheet_url = href_of(&french.body, "sheet");
    assert!(french_sheet_url.ends_with("?lang=fr"), "{french_sheet_url}");
    let french_sheet = get(server.port, &french_sheet_url, None);
    assert!(
        french_sheet.body.contains("<html lang=\"fr\">")
            && french_sheet.body.contains("Transit de Vénus, 6 juin 2012")
    );
    assert!(french_sheet.body.contains("filtre solaire certifié"));
    // The plain link still gives the registration's German.
    assert!(get(server.port, &sheet_url, None)
        .body
        .contains("<html lang=\"de\">"));
}

#[test]
fn the_api_takes_a_language_or_the_requests() {
    let server = start(&db("api-language"), &["--token", TOKEN]);
    let station = |extra: &str| {
        format!("{{\"station\":\"Quiet Ridge\",\"latitude\":-33.9,\"longitude\":151.2,\"time_zone\":\"Australia/Sydney\"{extra}}}")
    };
    let pt = post_json(
        server.port,
        "/api/registrations",
        &station(",\"language\":\"pt-BR\""),
    );
    assert_eq!(pt.status, 201, "{}", pt.body);
    assert_eq!(pt.json()["language"], "pt");
    let sheet = get(server.port, pt.json()["sheet_url"].as_str().unwrap(), None);
    assert!(sheet.body.contains("<html lang=\"pt\">") && sheet.body.contains("Trânsito de Vénus"));
    // None in the body: the request's Accept-Language.
    let es = request(
        server.port,
        "POST",
        "/api/registrations",
        &[
            "Content-Type: application/json",
            "Accept-Language: es-MX,es;q=0.9",
        ],
        station("").as_bytes(),
    );
    assert_eq!(es.json()["language"], "es");
    assert_eq!(
        post_json(server.port, "/api/registrations", &station("")).json()["language"],
        "en"
    );
    let bad = post_json(
        server.port,
        "/api/registrations",
        &station(",\"language\":\"tlh\""),
    );
    assert_eq!(bad.status, 400);
    let e = bad.json()["error"].as_str().unwrap().to_string();
    assert!(
        e.contains("'language' is 'tlh'") && e.contains("de (Deutsch)"),
        "{e}"
    );
    // A key that opens nothing: refused in the visitor's language.
    let missing = request(
        server.port,
        "GET",
        &format!("/registrations/{}", "A".repeat(24)),
        &["Accept-Language: de"],
        b"",
    );
    assert_eq!(missing.status, 404);
    assert!(missing
        .body
        .contains("Zu diesem Link gehört keine Anmeldung."));
}
