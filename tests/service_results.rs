//! The public results page, `GET /results`, over HTTP on 127.0.0.1 (each server stops by
//! itself): no token needed; "not determined" and why while the data are thin; the solution's
//! parallax, the counts, the map and the stations rounded to 0.1 degree once they are not;
//! never a submission key, a participant's note or an observer's name; the version, the
//! changes pending and `Refresh` in its headers; the newer solution once a submission settles.

mod common;

use common::server::{
    get, post_json, predicted_at, seed_five_stations, settled_report, settled_solution, start,
    Reply,
};
use std::path::PathBuf;

const TOKEN: &str = "Organiser3Public";

fn db(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-results-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir.join("campaign.sqlite")
}

/// The text of the element with this id (up to its first tag inside).
fn text_of(page: &str, id: &str) -> String {
    let start = page
        .find(&format!("id=\"{id}\">"))
        .unwrap_or_else(|| panic!("no {id} in {page}"))
        + id.len()
        + 6;
    page[start..start + page[start..].find('<').unwrap()].to_string()
}

/// A submission of one station with an observer's name and a note; its review link's key.
fn submit_private(port: u16, name: &str, (lat, lon): (f64, f64)) -> String {
    let body = serde_json::json!({ "station": name, "latitude": lat, "longitude": lon,
        "observer": "Odalys Quenby", "notes": "gate code 4471, ask for Quenby",
        "timings": [
            { "contact": 2, "time_utc": predicted_at(lat, lon, 2, 3.0), "sigma_s": 8 },
            { "contact": 3, "time_utc": predicted_at(lat, lon, 3, -2.0), "sigma_s": 8 }] });
    let r = post_json(port, "/api/submissions", &body.to_string());
    assert_eq!(r.status, 201, "{}", r.body);
    let review = r.json()["review"].as_str().unwrap().to_string();
    review.split("key=").nth(1).unwrap().to_string()
}

fn results(port: u16) -> Reply {
    let r = get(port, "/results", None);
    assert_eq!(r.status, 200, "{}", r.body);
    r
}

fn assert_nothing_private(page: &str, keys: &[String]) {
    for secret in [TOKEN, "Odalys", "Quenby", "gate code", "4471", "key="] {
        assert!(!page.contains(secret), "{secret} on the public page");
    }
    for k in keys {
        assert!(
            !page.contains(k.as_str()),
            "a submission key on the public page"
        );
    }
}

#[test]
fn thin_data_is_not_determined_and_says_why() {
    let server = start(&db("thin"), &["--token", TOKEN]);
    let first = results(server.port);
    assert!(first.body.contains("id=\"parallax\""));
    settled_solution(&server);
    let empty = results(server.port);
    assert!(empty
        .body
        .contains("not determined yet: no timings have arrived yet"));
    assert!(empty.body.contains("certified solar filter"), "the caution");
    let key = submit_private(server.port, "Lone Pine", (35.6789, 139.6912));
    settled_solution(&server);
    let page = results(server.port);
    let parallax = text_of(&page.body, "parallax");
    assert!(parallax.contains("not determined"), "{parallax}");
    assert!(!parallax.contains('"'), "no figure: {parallax}");
    assert!(parallax.contains("at least two stations"), "{parallax}");
    // No share of the information on a parallax that is not determined; the place on a map.
    assert!(page.body.contains(
        "<td>Lone Pine</td><td>35.7</td><td>139.7</td><td>2</td><td>not determined</td>"
    ));
    assert!(page.body.contains("World map of the stations") && !page.body.contains("share 0"));
    assert_eq!(text_of(&page.body, "n-stations"), "1");
    assert_eq!(text_of(&page.body, "n-timings"), "2");
    assert_nothing_private(&page.body, &[key]);
}

#[test]
fn the_public_page_follows_the_solution_and_keeps_private_things_private() {
    let server = start(&db("public"), &["--token", TOKEN]);
    seed_five_stations(&server, false);
    let key = submit_private(server.port, "Lantern Hill", (35.6789, 139.6912));
    let solution = settled_solution(&server);
    let page = results(server.port);
    assert_eq!(
        page.header("x-data-version"),
        Some(solution["version"].to_string())
    );
    assert_eq!(page.header("x-pending-changes").as_deref(), Some("0"));
    assert_eq!(page.header("refresh").as_deref(), Some("60"));
    let want = format!(
        "{:.4}\" ± {:.4}\"",
        solution["parallax_arcsec"].as_f64().unwrap(),
        solution["parallax_sigma_arcsec"].as_f64().unwrap()
    );
    assert_eq!(text_of(&page.body, "parallax"), want);
    assert!(text_of(&page.body, "au").contains("million km"));
    assert_eq!(text_of(&page.body, "n-stations"), "6");
    assert_eq!(text_of(&page.body, "n-timings"), "12");
    assert_eq!(text_of(&page.body, "n-submissions"), "6");
    assert!(text_of(&page.body, "as-of").contains("it includes every timing received"));
    assert!(page.body.contains("World map of the stations"));
    // Places at 0.1 degree, in the table and on the map.
    assert!(page
        .body
        .contains("<td>Lantern Hill</td><td>35.7</td><td>139.7</td>"));
    for precise in ["35.6789", "139.6912", "35.68", "139.69", "-157.86", "64.84"] {
        assert!(!page.body.contains(precise), "{precise} on the public page");
    }
    assert_nothing_private(&page.body, std::slice::from_ref(&key));
    // The same version again: 304 on its ETag.
    let etag = page.header("etag").unwrap();
    let again = common::server::request(
        server.port,
        "GET",
        "/results",
        &[&format!("If-None-Match: {etag}")],
        b"",
    );
    assert_eq!(again.status, 304);

    // The convergence, once the renderer has drawn it.
    settled_report(&server);
    let drawn = (0..600)
        .map(|_| {
            std::thread::sleep(std::time::Duration::from_millis(100));
            results(server.port)
        })
        .find(|r| r.body.contains("id=\"convergence\""))
        .expect("the convergence drawn within a minute");
    assert!(drawn.body.contains("Convergence of the solar parallax"));

    // A new station: the page shows the newer solution once it settles.
    let key2 = submit_private(server.port, "Harbour Light", (1.2834, 103.8607));
    let newer = settled_solution(&server);
    assert!(newer["version"].as_u64() > solution["version"].as_u64());
    let after = results(server.port);
    assert_eq!(
        after.header("x-data-version"),
        Some(newer["version"].to_string())
    );
    assert_eq!(text_of(&after.body, "n-stations"), "7");
    let want = format!(
        "{:.4}\" ± {:.4}\"",
        newer["parallax_arcsec"].as_f64().unwrap(),
        newer["parallax_sigma_arcsec"].as_f64().unwrap()
    );
    assert_eq!(text_of(&after.body, "parallax"), want);
    assert!(after
        .body
        .contains("<td>Harbour Light</td><td>1.3</td><td>103.9</td>"));
    assert_nothing_private(&after.body, &[key, key2]);
}

/// The page in the visitor's language: German from `Accept-Language` (its words, decimal
/// commas, the charts' words, `Content-Language`), French from the switch (`?lang=fr`), and a
/// separate version tag per language so that no cache hands one language to another; nothing
/// private in any of them.
#[test]
fn the_public_page_speaks_the_visitors_language() {
    let server = start(&db("languages"), &["--token", TOKEN]);
    seed_five_stations(&server, false);
    let key = submit_private(server.port, "Lantern Hill", (35.6789, 139.6912));
    let solution = settled_solution(&server);
    settled_report(&server);
    let german = |path: &str| {
        common::server::request(
            server.port,
            "GET",
            path,
            &["Accept-Language: de-DE,de;q=0.9,en;q=0.5"],
            b"",
        )
    };
    let de = (0..600)
        .map(|_| {
            std::thread::sleep(std::time::Duration::from_millis(100));
            german("/results")
        })
        .find(|r| r.body.contains("id=\"convergence\""))
        .expect("the convergence drawn within a minute");
    assert_eq!(de.status, 200);
    assert_eq!(de.header("content-language").as_deref(), Some("de"));
    assert!(de.body.contains("<html lang=\"de\""));
    assert!(de
        .body
        .contains("Ergebnisse: die Sonnenparallaxe bis jetzt"));
    let want = format!(
        "{:.4}\" ± {:.4}\"",
        solution["parallax_arcsec"].as_f64().unwrap(),
        solution["parallax_sigma_arcsec"].as_f64().unwrap()
    )
    .replace('.', ",");
    assert_eq!(text_of(&de.body, "parallax"), want);
    assert!(text_of(&de.body, "au").contains("Millionen km"));
    assert!(text_of(&de.body, "as-of").contains("sie enthält jede eingegangene Zeit"));
    assert!(de
        .body
        .contains("<td>Lantern Hill</td><td>35,7</td><td>139,7</td>"));
    // The charts speak German too: the map's key and the convergence's axes.
    assert!(de.body.contains("Fläche: Anteil an der Information"));
    assert!(de.body.contains("Konvergenz der Sonnenparallaxe"));
    assert!(!de.body.contains("share of the information"));
    assert!(!de.body.contains("timings in the solution"));
    assert_nothing_private(&de.body, std::slice::from_ref(&key));

    let fr = get(server.port, "/results?lang=fr", None);
    assert_eq!(fr.status, 200);
    assert!(fr.body.contains("<html lang=\"fr\""));
    assert!(text_of(&fr.body, "au").contains("millions de km"));
    assert!(fr.body.contains("Carte du monde des stations"));
    assert!(fr.body.contains("aria-current=\"true\">Français</a>"));
    assert_nothing_private(&fr.body, std::slice::from_ref(&key));

    let en = results(server.port);
    for page in [&de, &fr] {
        assert_ne!(page.header("etag"), en.header("etag"), "a tag per language");
    }
    // The German tag does not match the English page.
    let etag = de.header("etag").unwrap();
    let english_again = common::server::request(
        server.port,
        "GET",
        "/results",
        &[&format!("If-None-Match: {etag}"), "Accept-Language: en"],
        b"",
    );
    assert_eq!(english_again.status, 200);
    assert!(english_again.body.contains("<html lang=\"en\""));
}
