//! Every page for people, in a real browser, checked for accessibility and for phones: the
//! service is started and fed timings of the transit of Venus of 2012, then Debian's chromium
//! (through chromium-driver) visits the participant's form, the feedback after a real form
//! post, the review page of the private link, a message page, the `413` page, the organiser's
//! sign-in page, the organiser's page, the report, an observer's sheet of `predict
//! --sheets` (as a file), the public results page, the registration form, a registered
//! station's private page and its sheet as the service serves it (in English, and in
//! German). On a desktop window axe-core (from the npm registry; `.ci/run` installs it)
//! audits each page and the test fails on any violation, listing each with its
//! rule, impact and elements; on a phone 360 px wide each page must fit without scrolling
//! sideways (a wide table scrolls inside its own box, never the page).
//!
//! Without chromium and chromedriver, or without axe-core outside CI, the tests say SKIPPED.

mod common;
#[path = "common/webdriver.rs"]
mod webdriver;

use common::server::{
    post_json, predicted_at, request, seed_five_stations, settled_report, settled_solution,
    sign_in, start, visitor, Server,
};
use fantoccini::{Client, Locator};
use std::path::{Path, PathBuf};
use std::sync::Mutex;
use std::time::Duration;
use webdriver::{
    axe_violations, session, sideways_overflow, small_chart_text, start_driver, which, Screen,
};

/// Public pages (no sign-in) beyond the participant's, to be checked like the others.
const PUBLIC_PAGES: &[&str] = &["/results", "/register"];

/// The phone's width, CSS pixels.
const PHONE_WIDTH_PX: u32 = 360;

/// The smallest text a chart may be drawn with on the phone, CSS pixels (the project's rule
/// for every chart on every page: a wide chart scrolls inside its figure rather than shrink).
const MIN_CHART_TEXT_PX: f64 = 12.0;

/// The organiser's token of these tests.
const TOKEN: &str = "organiser11y";

/// One browser at a time: the two tests each start a server and a browser.
static ONE_BROWSER: Mutex<()> = Mutex::new(());

/// The five stations of `seed_five_stations` (one a zone-time blunder), one submission that
/// cannot be read, for the organiser's table of those, and one that says how it was timed and
/// has a note from the organiser; returns that one's private link.
fn seed(server: &Server) -> String {
    seed_five_stations(server, true);
    // One that cannot be read, for the organiser's table of those.
    let unreadable = post_json(server.port, "/api/submissions", r#"{"station":""}"#);
    assert_eq!(unreadable.status, 400);
    let body = serde_json::json!({ "station": "Lantern Hill", "latitude": 35.68, "longitude": 139.69,
        "clock_source": "phone", "aperture_mm": 60, "viewing": "projection", "notes": "haze",
        "timings": [{ "contact": 2, "time_utc": predicted_at(35.68, 139.69, 2, 3.0), "sigma_s": 8 }] });
    let r = post_json(server.port, "/api/submissions", &body.to_string());
    assert_eq!(r.status, 201, "{}", r.body);
    let v = r.json();
    let (cookie, csrf) = visitor(server.port);
    let cookies = format!("Cookie: {cookie}; {}", sign_in(server.port, TOKEN));
    let note = format!(
        "csrf={csrf}&submission={}&note=Your+clock+seems+3+s+fast%3B+please+say+how+you+set+it",
        v["submission_id"]
    );
    let r = request(
        server.port,
        "POST",
        "/organiser/note",
        &["Content-Type: application/x-www-form-urlencoded", &cookies],
        note.as_bytes(),
    );
    assert_eq!(r.status, 303, "{}", r.body);
    v["review"].as_str().unwrap().to_string()
}

/// An observer's sheet written by `predict --sheets`; its path.
fn sheet(dir: &Path) -> PathBuf {
    let stations = common::temp(
        "a11y-stations.csv",
        b"station,latitude,longitude,elevation_m,time_zone\nJade Terrace School,22.28,114.16,40,Asia/Hong_Kong\n",
    );
    let out = dir.join("sheets");
    let o = common::run_words(
        "predict --planet venus --date 2012-06-06 --format json --stations",
        &[&stations, "--sheets", out.to_str().unwrap()],
    );
    assert!(o.status.success(), "{}", common::err(&o));
    out.join("Jade_Terrace_School.html")
}

/// A station registered through the API (after the seed, so that the organiser's map shows
/// it silent); its private page and its sheet.
fn register(server: &Server) -> (String, String) {
    let body = serde_json::json!({ "station": "Quiet Ridge Observatory", "latitude": -41.29,
        "longitude": 174.78, "elevation_m": 120, "time_zone": "Pacific/Auckland" });
    let r = post_json(server.port, "/api/registrations", &body.to_string());
    assert_eq!(r.status, 201, "{}", r.body);
    let v = r.json();
    (
        v["registration_url"].as_str().unwrap().to_string(),
        v["sheet_url"].as_str().unwrap().to_string(),
    )
}

/// What each page is checked for.
enum Check<'a> {
    /// axe-core's audit (its source).
    Axe(&'a str),
    /// No sideways scrolling at the phone's width (CSS pixels).
    Width(u32),
}

/// Check the page in view; the problems found are added to `problems`. A screenshot of each
/// page is written under target/ for review (`a11y-desktop-PAGE.png`, `a11y-phone-PAGE.png`).
async fn check(c: &Client, page: &str, how: &Check<'_>, problems: &mut Vec<String>) {
    let screen = match how {
        Check::Axe(axe) => {
            problems.extend(axe_violations(c, page, axe).await);
            "desktop"
        }
        Check::Width(width) => {
            problems.extend(sideways_overflow(c, page, *width).await);
            problems.extend(small_chart_text(c, page, MIN_CHART_TEXT_PX).await);
            "phone"
        }
    };
    let png = c.screenshot().await.expect("a screenshot");
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("target");
    std::fs::create_dir_all(&dir).ok();
    let name: String = page
        .chars()
        .map(|ch| if ch.is_ascii_alphanumeric() { ch } else { '-' })
        .collect();
    std::fs::write(dir.join(format!("a11y-{screen}-{name}.png")), png).expect("written");
}

async fn goto(c: &Client, url: &str) {
    c.goto(url).await.unwrap_or_else(|e| panic!("{url}: {e}"));
}

/// Fill the participant's form (one timing of contact II) and send it: the feedback page.
async fn send_form(c: &Client, base: &str) -> String {
    goto(c, &format!("{base}/")).await;
    for (id, text) in [
        ("station", "Lantern Hill School"),
        ("latitude", "35.68"),
        ("longitude", "139.69"),
        ("time_utc0", &predicted_at(35.68, 139.69, 2, -6.0)),
        ("sigma_s0", "8"),
    ] {
        let e = c.find(Locator::Id(id)).await.expect(id);
        e.send_keys(text).await.expect(id);
    }
    let contact = c.find(Locator::Id("contact0")).await.expect("contact0");
    contact.select_by_value("2").await.expect("contact II");
    c.find(Locator::Id("send"))
        .await
        .expect("send")
        .click()
        .await
        .expect("sent");
    let private = c
        .wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Id("private"))
        .await
        .unwrap_or_else(|e| panic!("no feedback page: {e}"));
    private
        .attr("href")
        .await
        .expect("a link")
        .expect("a private link")
}

/// A pasted file over the limit: the `413` page (the paste is set through WebDriver, typing
/// 300 KB would take minutes).
async fn send_too_much(c: &Client, base: &str) {
    goto(c, &format!("{base}/")).await;
    c.execute(
        "document.getElementById('csv').value = 'station\\n' + 'x'.repeat(300 * 1024);",
        vec![],
    )
    .await
    .expect("the paste");
    c.find(Locator::Id("send-paste"))
        .await
        .expect("send")
        .click()
        .await
        .expect("sent");
    c.wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Id("limit"))
        .await
        .unwrap_or_else(|e| panic!("no 413 page: {e}"));
}

/// Exclude the first timing of the organiser's table with a reason, so that the page shows a
/// restore form and the audit trail a row.
async fn exclude_first(c: &Client) {
    let form = c
        .find(Locator::Css("#rows form[action='/organiser/exclude']"))
        .await
        .expect("an exclude form");
    form.find(Locator::Css("input[name='reason']"))
        .await
        .expect("a reason")
        .send_keys("clock not set")
        .await
        .expect("typed");
    form.find(Locator::Css("button"))
        .await
        .expect("a button")
        .click()
        .await
        .expect("excluded");
    c.wait()
        .at_most(Duration::from_secs(20))
        .for_element(Locator::Css("#rows form[action='/organiser/restore']"))
        .await
        .unwrap_or_else(|e| panic!("no restore form after excluding: {e}"));
}

/// Visit every page for people and check each; the problems found.
async fn every_page(
    c: &Client,
    (server, noted): (&Server, &str),
    sheet: &Path,
    how: Check<'_>,
) -> Vec<String> {
    let base = format!("http://127.0.0.1:{}", server.port);
    let mut problems = Vec::new();
    goto(c, &format!("{base}/organiser")).await;
    c.find(Locator::Id("token"))
        .await
        .expect("the sign-in form");
    check(c, "sign-in page", &how, &mut problems).await;
    goto(c, &format!("{base}/")).await;
    check(c, "the form", &how, &mut problems).await;
    let private = send_form(c, &base).await;
    check(c, "feedback page", &how, &mut problems).await;
    goto(c, &format!("{base}{private}")).await;
    check(c, "review page", &how, &mut problems).await;
    goto(c, &format!("{base}{noted}")).await;
    c.find(Locator::Id("organiser-notes"))
        .await
        .expect("the note");
    check(c, "review page with a note", &how, &mut problems).await;
    goto(c, &format!("{base}/submission/999999?key=none")).await;
    check(c, "message page", &how, &mut problems).await;
    send_too_much(c, &base).await;
    check(c, "413 page", &how, &mut problems).await;
    for path in PUBLIC_PAGES {
        goto(c, &format!("{base}{path}")).await;
        check(c, path, &how, &mut problems).await;
    }
    let (private, sheet_url) = register(server);
    goto(c, &format!("{base}{private}")).await;
    check(c, "registered station's page", &how, &mut problems).await;
    goto(c, &format!("{base}{sheet_url}")).await;
    check(c, "registered station's sheet", &how, &mut problems).await;
    goto(c, &format!("{base}/organiser?token={TOKEN}")).await;
    exclude_first(c).await;
    settled_report(server);
    goto(c, &format!("{base}/organiser")).await;
    c.find(Locator::Id("n-timings")).await.expect("signed in");
    check(c, "organiser's page", &how, &mut problems).await;
    goto(
        c,
        &format!("{base}/organiser?state=excluded&clock=&verdict=rejected&sort=o_c"),
    )
    .await;
    c.find(Locator::Id("bulk"))
        .await
        .expect("the filtered table");
    check(c, "organiser's page, filtered", &how, &mut problems).await;
    goto(c, &format!("{base}/organiser/report.html")).await;
    check(c, "report", &how, &mut problems).await;
    goto(c, &format!("file://{}", sheet.display())).await;
    check(c, "observer's sheet", &how, &mut problems).await;
    // The registered station's page and sheet in German (the longest words), last: the
    // switch's choice stays in the browser's cookie.
    goto(c, &format!("{base}{private}?lang=de")).await;
    check(
        c,
        "registered station's page in German",
        &how,
        &mut problems,
    )
    .await;
    goto(c, &format!("{base}{sheet_url}?lang=de")).await;
    check(
        c,
        "registered station's sheet in German",
        &how,
        &mut problems,
    )
    .await;
    problems
}

/// Start everything and visit every page on `screen`; the problems found, or `None` when the
/// test is skipped.
fn run(name: &str, screen: Screen, axe: Option<&str>) -> Option<Vec<String>> {
    let (Some(chromium), Some(driver_path)) = (which("chromium"), which("chromedriver")) else {
        eprintln!("SKIPPED: chromium and chromedriver are not installed (CI installs Debian's chromium and chromium-driver and runs this test)");
        return None;
    };
    let _one = ONE_BROWSER.lock().unwrap_or_else(|e| e.into_inner());
    let dir = std::env::temp_dir().join(format!("tp-a11y-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let server = start(&dir.join("campaign.sqlite"), &["--token", TOKEN]);
    let noted = seed(&server);
    settled_solution(&server);
    let sheet = sheet(&dir);
    let driver = start_driver(&driver_path);
    let runtime = tokio::runtime::Builder::new_current_thread()
        .enable_all()
        .build()
        .unwrap();
    Some(runtime.block_on(async {
        let c = session(&driver, &chromium, &dir.join("profile"), screen).await;
        let how = match (axe, screen) {
            (Some(source), _) => Check::Axe(source),
            (None, Screen::Phone { width }) => Check::Width(width),
            (None, Screen::Desktop) => panic!("a width is checked on a phone"),
        };
        let problems = every_page(&c, (&server, &noted), &sheet, how).await;
        c.close().await.ok();
        problems
    }))
}

#[test]
fn axe_finds_no_violation_on_any_page() {
    let Some(axe) = webdriver::axe_source_or_skip() else {
        return;
    };
    if let Some(problems) = run("axe", Screen::Desktop, Some(&axe)) {
        assert!(
            problems.is_empty(),
            "{} accessibility violations:\n{}",
            problems.len(),
            problems.join("\n")
        );
    }
}

#[test]
fn every_page_fits_a_phone_360_px_wide() {
    let phone = Screen::Phone {
        width: PHONE_WIDTH_PX,
    };
    if let Some(problems) = run("phone", phone, None) {
        assert!(
            problems.is_empty(),
            "pages wider than the phone:\n{}",
            problems.join("\n")
        );
    }
}
