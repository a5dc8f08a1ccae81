//! The service in a real browser: Debian's chromium driven through chromium-driver
//! (WebDriver, the `fantoccini` crate) fills the participant's form, submits a good timing
//! and a blunder and reads the feedback from the page, then opens the organiser's page with
//! the token and sees the row counts and the solution change. A screenshot of each page is
//! written under target/ for review. Every server and driver listens on 127.0.0.1 and stops
//! by itself. Without chromium and chromedriver the test says SKIPPED (CI installs both).

mod common;

#[path = "common/webdriver.rs"]
mod webdriver;

use common::server::{predicted_at, seed_five_stations, settled_solution, start};
use fantoccini::{Client, Locator};
use std::path::Path;
use std::time::Duration;
use webdriver::{session, start_driver, which, Screen};

async fn fill(c: &Client, id: &str, text: &str) {
    let e = c.find(Locator::Id(id)).await.expect(id);
    e.clear().await.ok();
    e.send_keys(text).await.expect(id);
}

async fn screenshot(c: &Client, name: &str) {
    let png = c.screenshot().await.expect("a screenshot");
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("target");
    std::fs::create_dir_all(&dir).ok();
    std::fs::write(dir.join(name), png).expect("written");
}

/// Fill the participant's form for one timing of contact II and send it; the feedback
/// table's text.
async fn send_form(c: &Client, base: &str, station: (&str, &str, &str), time: &str) -> String {
    send_form_saying_how(c, base, station, time, &[]).await
}

/// [`send_form`], also filling in how the timing was made: (field id, value) pairs, the
/// lists (`clock_source`, `viewing`) chosen by value.
async fn send_form_saying_how(
    c: &Client,
    base: &str,
    station: (&str, &str, &str),
    time: &str,
    how: &[(&str, &str)],
) -> String {
    c.goto(&format!("{base}/")).await.expect("the form");
    assert_styled(c, "the form").await;
    fill(c, "station", station.0).await;
    fill(c, "latitude", station.1).await;
    fill(c, "longitude", station.2).await;
    for (id, value) in how {
        if ["clock_source", "viewing"].contains(id) {
            c.find(Locator::Id(id))
                .await
                .expect("a list")
                .select_by_value(value)
                .await
                .expect("chosen");
        } else {
            fill(c, id, value).await;
        }
    }
    c.find(Locator::Id("contact0"))
        .await
        .expect("contact0")
        .select_by_value("2")
        .await
        .expect("contact II");
    fill(c, "time_utc0", time).await;
    fill(c, "sigma_s0", "8").await;
    c.find(Locator::Id("send"))
        .await
        .expect("send")
        .click()
        .await
        .expect("sent");
    let found = c
        .wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Id("feedback"))
        .await;
    match found {
        Ok(e) => e.text().await.expect("text"),
        Err(e) => {
            screenshot(c, "service-participant-failed.png").await;
            panic!("{e}: {}", c.source().await.unwrap_or_default());
        }
    }
}

/// Whether the page's caution is drawn in its style (the inline style element allowed by its
/// hash in the content-security policy: unstyled, its border would be the browser's default).
async fn assert_styled(c: &Client, page: &str) {
    let v = c
        .execute(
            "return getComputedStyle(document.querySelector('.caution')).borderTopColor;",
            vec![],
        )
        .await
        .expect("a computed style");
    assert_eq!(
        v,
        serde_json::json!("rgb(185, 28, 28)"),
        "{page} styled under the CSP"
    );
}

async fn organiser_counts(c: &Client, base: &str, token: &str) -> (String, String) {
    // `?token=` signs in and is redirected away; the session cookie holds the organiser.
    c.goto(&format!("{base}/organiser?token={token}"))
        .await
        .expect("the organiser's page");
    let url = c.current_url().await.expect("an address");
    assert!(!url.as_str().contains(token), "the token left in {url}");
    assert_styled(c, "the organiser's page").await;
    let n = c
        .find(Locator::Id("n-timings"))
        .await
        .expect("counts")
        .text()
        .await
        .unwrap();
    let p = c
        .find(Locator::Id("parallax"))
        .await
        .expect("solution")
        .text()
        .await
        .unwrap();
    (n, p)
}

/// The rows of the organiser's table, as text.
async fn table_text(c: &Client) -> String {
    c.find(Locator::Id("rows"))
        .await
        .expect("the table")
        .text()
        .await
        .unwrap()
}

/// Choose `value` in the organiser's filter `filter` (`filter-{filter}`), press "show" and
/// wait for the table filtered so.
async fn show_filtered(c: &Client, filter: &str, value: &str) {
    c.find(Locator::Id(&format!("filter-{filter}")))
        .await
        .expect("the filter")
        .select_by_value(value)
        .await
        .expect("chosen");
    c.find(Locator::Id("show"))
        .await
        .expect("show")
        .click()
        .await
        .expect("shown");
    let chosen = format!("#filter-{filter} option[value='{value}'][selected]");
    c.wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Css(&chosen))
        .await
        .expect("the filtered table");
}

/// The organiser filters the table by the verdict at arrival, ticks the blunder, excludes it
/// with a reason through the bulk form, then restores it with a reason that the audit trail
/// shows.
async fn triage(c: &Client, base: &str) {
    c.goto(&format!("{base}/organiser"))
        .await
        .expect("the page");
    show_filtered(c, "verdict", "rejected").await;
    let rows = table_text(c).await;
    assert!(
        rows.contains("Pearl Shore Club") && !rows.contains("Jade Harbour School"),
        "{rows}"
    );
    c.find(Locator::Css("#rows input[type='checkbox']"))
        .await
        .expect("a box to tick")
        .click()
        .await
        .expect("ticked");
    fill(c, "bulk-reason", "zone time left in").await;
    c.find(Locator::Id("bulk-exclude"))
        .await
        .expect("exclude")
        .click()
        .await
        .expect("sent");
    let restore = c
        .wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Css("#rows form[action='/organiser/restore']"))
        .await
        .expect("the excluded row's restore form");
    assert!(table_text(c)
        .await
        .contains("by the organiser: zone time left in"));
    screenshot(c, "service-organiser-triage.png").await;
    restore
        .find(Locator::Css("input[name='reason']"))
        .await
        .expect("a reason")
        .send_keys("the observer confirmed the zone")
        .await
        .expect("typed");
    restore
        .find(Locator::Css("button"))
        .await
        .expect("restore")
        .click()
        .await
        .expect("sent");
    c.wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Css("#rows form[action='/organiser/exclude']"))
        .await
        .expect("restored");
    let page = c.source().await.expect("the page");
    let trail = &page[page.find("Audit trail").expect("the audit trail")..];
    assert!(
        trail.contains("<td>restored</td>") && trail.contains("the observer confirmed the zone"),
        "{trail}"
    );
}

/// One test's campaign in a real browser: a fresh server with the organiser's `token`, a
/// chromium-driver, and the folder they use. `None`, with SKIPPED said, without chromium and
/// chromedriver.
struct BrowserCampaign {
    dir: std::path::PathBuf,
    chromium: std::path::PathBuf,
    server: common::server::Server,
    driver: webdriver::Driver,
    base: String,
}

impl BrowserCampaign {
    fn start(name: &str, token: &str) -> Option<BrowserCampaign> {
        let (Some(chromium), Some(driver_path)) = (which("chromium"), which("chromedriver")) else {
            eprintln!("SKIPPED: chromium and chromedriver are not installed (CI installs Debian's chromium and chromium-driver and runs this test)");
            return None;
        };
        let dir = std::env::temp_dir().join(format!("tp-service-{name}-{}", std::process::id()));
        let _ = std::fs::remove_dir_all(&dir);
        std::fs::create_dir_all(&dir).unwrap();
        let server = start(&dir.join("campaign.sqlite"), &["--token", token]);
        let driver = start_driver(&driver_path);
        let base = format!("http://127.0.0.1:{}", server.port);
        Some(BrowserCampaign {
            dir,
            chromium,
            server,
            driver,
            base,
        })
    }

    /// A desktop session with a profile of its own.
    async fn session(&self) -> Client {
        session(
            &self.driver,
            &self.chromium,
            &self.dir.join("profile"),
            Screen::Desktop,
        )
        .await
    }
}

/// The runtime a browser test drives its session on.
fn runtime() -> tokio::runtime::Runtime {
    tokio::runtime::Builder::new_current_thread()
        .enable_all()
        .build()
        .unwrap()
}

#[test]
fn a_participant_and_the_organiser_in_a_real_browser() {
    let Some(b) = BrowserCampaign::start("browser", "organiser7") else {
        return;
    };
    let (server, base) = (&b.server, &b.base);
    seed_five_stations(server, false);
    runtime().block_on(async {
        let c = b.session().await;
        let good = send_form(
            &c,
            base,
            ("Jade Harbour School", "22.28", "114.16"),
            &predicted_at(22.28, 114.16, 2, 5.0),
        )
        .await;
        screenshot(&c, "service-participant-good.png").await;
        assert!(good.contains("fits"), "{good}");
        let blunder = send_form(
            &c,
            base,
            ("Pearl Shore Club", "22.30", "114.20"),
            // Hong Kong's zone time (+8 h) left in.
            &predicted_at(22.3, 114.2, 2, 8.0 * 3600.0),
        )
        .await;
        screenshot(&c, "service-participant-blunder.png").await;
        assert!(
            // Plain words for a fixable slip, not "rejected" (issue 20).
            blunder.contains("probably a slip you can fix") && blunder.contains("zone"),
            "{blunder}"
        );
        settled_solution(server);
        let (n1, p1) = organiser_counts(&c, base, "organiser7").await;
        screenshot(&c, "service-organiser.png").await;
        assert_eq!(n1, "12", "{n1}");
        assert!(p1.contains('"'), "a parallax on the page: {p1}");
        send_form(
            &c,
            base,
            ("Lantern Hill", "35.68", "139.69"),
            &predicted_at(35.68, 139.69, 2, -6.0),
        )
        .await;
        settled_solution(server);
        let (n2, p2) = organiser_counts(&c, base, "organiser7").await;
        screenshot(&c, "service-organiser-after.png").await;
        assert_eq!(n2, "13");
        assert_ne!(p1, p2, "the solution changed with the new timing");
        c.goto(&format!("{base}/organiser/report.html"))
            .await
            .expect("the report");
        assert_styled(&c, "the report").await;
        let source = c.source().await.expect("the report's source");
        assert!(!source.contains("organiser7"), "the token on the report");
        triage(&c, base).await;
        c.close().await.ok();
    });
}

/// Register a station through the form in Chromium; the private page's links; the sheet
/// opened from it, styled under the content-security policy, with the station's clock times.
async fn register_in_browser(c: &Client, base: &str) -> String {
    c.goto(&format!("{base}/register")).await.expect("the form");
    assert_styled(c, "the registration form").await;
    fill(c, "station", "Kauri Point School").await;
    fill(c, "latitude", "-36.85").await;
    fill(c, "longitude", "174.76").await;
    fill(c, "elevation_m", "20").await;
    fill(c, "time_zone", "Pacific/Auckland").await;
    c.find(Locator::Id("register"))
        .await
        .expect("the button")
        .click()
        .await
        .expect("sent");
    let sheet = c
        .wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Id("sheet"))
        .await
        .unwrap_or_else(|e| panic!("no registered page: {e}"));
    screenshot(c, "service-registered.png").await;
    let contacts = c
        .find(Locator::Id("contacts"))
        .await
        .expect("the contacts")
        .text()
        .await
        .unwrap();
    assert!(contacts.contains("NZST"), "{contacts}");
    sheet.click().await.expect("the sheet");
    let caution = c
        .wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Css(".caution"))
        .await
        .expect("the sheet's caution");
    screenshot(c, "service-registered-sheet.png").await;
    assert!(caution
        .text()
        .await
        .unwrap()
        .contains("certified solar filter"));
    let background = c
        .execute(
            "return getComputedStyle(document.querySelector('.caution')).backgroundColor;",
            vec![],
        )
        .await
        .expect("a computed style");
    // The sheet's own style (#ffe9a8) applies: its hash is in the policy.
    assert_eq!(background, serde_json::json!("rgb(255, 233, 168)"));
    let url = c.current_url().await.expect("an address");
    assert!(url.path().ends_with("/sheet.html"), "{url}");
    let source = c.source().await.expect("the sheet's source");
    assert!(source.contains("Kauri Point School") && source.contains("NZST"));
    let segments: Vec<String> = url.path_segments().unwrap().map(String::from).collect();
    segments[segments.len() - 2].clone()
}

#[test]
fn registering_a_station_and_reading_the_results_in_a_real_browser() {
    let Some(b) = BrowserCampaign::start("register", "organiser8") else {
        return;
    };
    let (server, base) = (&b.server, &b.base);
    seed_five_stations(server, false);
    let before = settled_solution(server);
    runtime().block_on(async {
        let c = b.session().await;
        let key = register_in_browser(&c, base).await;
        let feedback = send_form_saying_how(
            &c,
            base,
            ("Kauri Point School", "-36.85", "174.76"),
            &predicted_at(-36.85, 174.76, 2, 3.0),
            &HOW_KAURI,
        )
        .await;
        assert!(feedback.contains("fits"), "{feedback}");
        let solution = settled_solution(server);
        assert_ne!(solution["parallax_arcsec"], before["parallax_arcsec"]);
        organiser_sees_how(&c, base, "organiser8").await;
        c.goto(&format!("{base}/results"))
            .await
            .expect("the results");
        assert_styled(&c, "the results page").await;
        screenshot(&c, "service-results.png").await;
        let parallax = c
            .find(Locator::Id("parallax"))
            .await
            .expect("the solution")
            .text()
            .await
            .unwrap();
        let want = format!("{:.4}", solution["parallax_arcsec"].as_f64().unwrap());
        assert!(parallax.contains(&want), "{parallax} against {want}");
        let stations = c
            .find(Locator::Id("n-stations"))
            .await
            .expect("the counts")
            .text()
            .await
            .unwrap();
        assert_eq!(
            stations, "6",
            "the registered station's timing in the solution"
        );
        let source = c.source().await.expect("the page's source");
        for private in HOW_KAURI.iter().map(|(_, v)| *v).filter(|v| v.len() > 4) {
            assert!(!source.contains(private), "{private} on the public page");
        }
        for private in ["organiser8", key.as_str(), "-36.85", "174.76"] {
            assert!(!source.contains(private), "{private} on the public page");
        }
        assert!(source.contains("174.8"), "the place to 0.1 degree");
        c.close().await.ok();
    });
}

/// How the registered station's timing was made, as its observer fills it in.
const HOW_KAURI: [(&str, &str); 6] = [
    ("observer", "Rangi Tamatea"),
    ("clock_source", "gps"),
    ("instrument", "80 mm refractor on a tripod"),
    ("aperture_mm", "80"),
    ("viewing", "projection"),
    ("notes", "thin cloud at the second contact; private remark"),
];

/// The organiser's table filtered by clock source: the registered station's timing, with
/// its observer and instrument, and none of the seeded ones (which said nothing of a clock).
async fn organiser_sees_how(c: &Client, base: &str, token: &str) {
    organiser_counts(c, base, token).await;
    show_filtered(c, "clock", "gps").await;
    let rows = table_text(c).await;
    assert!(
        rows.contains("Kauri Point School") && rows.contains("Rangi Tamatea"),
        "{rows}"
    );
    assert!(!rows.contains("Kestrel Point"), "{rows}");
    screenshot(c, "service-organiser-by-clock.png").await;
}

/// The page's language (`<html lang>`) and its main heading.
async fn language_and_heading(c: &Client) -> (String, String) {
    let lang = c
        .execute("return document.documentElement.lang;", vec![])
        .await
        .expect("the page's language");
    let h1 = c
        .find(Locator::Css("h1"))
        .await
        .expect("a heading")
        .text()
        .await
        .expect("its text");
    (lang.as_str().unwrap_or_default().to_string(), h1)
}

/// The language switch in Chromium: a click on "Deutsch" turns the form German, the choice
/// outlives the page (a cookie), and the feedback of a timing sent from it is German too; a
/// click on "English" turns it back.
#[test]
fn the_language_switch_in_a_real_browser() {
    let Some(b) = BrowserCampaign::start("language", "organiser9") else {
        return;
    };
    let base = &b.base;
    runtime().block_on(async {
        let c = b.session().await;
        c.goto(&format!("{base}/")).await.expect("the form");
        let switch = |code: &'static str| {
            let c = c.clone();
            async move {
                c.find(Locator::Css(&format!("nav.languages a[hreflang='{code}']")))
                    .await
                    .expect("the switch's link")
                    .click()
                    .await
                    .expect("clicked");
            }
        };
        switch("de").await;
        let (lang, h1) = language_and_heading(&c).await;
        assert_eq!(lang, "de");
        assert_eq!(h1, "Senden Sie Ihre Zeiten");
        // Kept: the plain address is German now.
        c.goto(&format!("{base}/")).await.expect("the form again");
        assert_eq!(language_and_heading(&c).await.0, "de");
        let feedback = send_form(
            &c,
            base,
            ("Willow Point Observatory", "22.28", "114.16"),
            &predicted_at(22.28, 114.16, 2, 5.0),
        )
        .await;
        assert!(feedback.contains("passt"), "{feedback}");
        assert!(feedback.contains("später als vorhergesagt"), "{feedback}");
        screenshot(&c, "service-feedback-german.png").await;
        switch("en").await;
        let (lang, _) = language_and_heading(&c).await;
        assert_eq!(lang, "en");
        c.close().await.ok();
    });
}
