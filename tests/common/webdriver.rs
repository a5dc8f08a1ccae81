//! Chromium driven through chromium-driver (WebDriver, the `fantoccini` crate) for the
//! service's browser tests: starting the driver, a desktop or a phone-sized session, and two checks
//! of the page in view: axe-core's audit (every violation, with its rule, impact and the
//! elements' selectors) and whether the page scrolls sideways.
//!
//! Included by `#[path]` from the tests that drive a browser, not from `common/mod.rs`, so that
//! the other test crates do not compile the WebDriver client; each test uses only part of it.
#![allow(dead_code)]

use fantoccini::{Client, ClientBuilder};
use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::Duration;

/// chromium-driver on a free loopback port, killed when dropped.
pub struct Driver(Child, u16);

impl Drop for Driver {
    fn drop(&mut self) {
        let _ = self.0.kill();
        let _ = self.0.wait();
    }
}

/// Where Debian (and others) install a program of the browser's.
pub fn which(name: &str) -> Option<PathBuf> {
    ["/usr/bin", "/usr/local/bin", "/usr/lib/chromium"]
        .iter()
        .map(|d| Path::new(d).join(name))
        .find(|p| p.exists())
}

/// Start chromium-driver; waits until it listens.
pub fn start_driver(path: &Path) -> Driver {
    let port = std::net::TcpListener::bind("127.0.0.1:0")
        .and_then(|l| l.local_addr())
        .unwrap()
        .port();
    let child = Command::new(path)
        .args([format!("--port={port}"), "--allowed-ips=127.0.0.1".into()])
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .spawn()
        .expect("chromedriver starts");
    for _ in 0..100 {
        if std::net::TcpStream::connect(("127.0.0.1", port)).is_ok() {
            break;
        }
        std::thread::sleep(Duration::from_millis(100));
    }
    Driver(child, port)
}

/// The screen a session shows pages on.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum Screen {
    /// A desktop window, 1100 x 1400 CSS pixels.
    Desktop,
    /// A phone: Chromium's mobile emulation, a viewport `width` CSS pixels wide (the page's
    /// `<meta name="viewport">` is honoured, as on a phone).
    Phone { width: u32 },
}

/// A new browser session on `screen` with its own profile folder.
pub async fn session(driver: &Driver, chromium: &Path, profile: &Path, screen: Screen) -> Client {
    let mut args = vec![
        "--headless".to_string(),
        "--no-sandbox".into(),
        "--disable-gpu".into(),
        "--disable-dev-shm-usage".into(),
        "--disable-quic".into(),
        "--no-first-run".into(),
        "--disable-background-networking".into(),
        "--disable-component-update".into(),
        "--disable-sync".into(),
        "--hide-scrollbars".into(),
        format!("--user-data-dir={}", profile.display()),
    ];
    let mut options = serde_json::json!({ "binary": chromium });
    match screen {
        Screen::Desktop => args.push("--window-size=1100,1400".into()),
        Screen::Phone { width } => {
            options["mobileEmulation"] = serde_json::json!({
                "deviceMetrics": { "width": width, "height": 740, "pixelRatio": 2.0, "touch": true, "mobile": true }
            });
        }
    }
    options["args"] = serde_json::json!(args);
    let mut caps = serde_json::Map::new();
    caps.insert("goog:chromeOptions".into(), options);
    let connector = hyper_util::client::legacy::connect::HttpConnector::new();
    ClientBuilder::new(connector)
        .capabilities(caps)
        .connect(&format!("http://127.0.0.1:{}", driver.1))
        .await
        .expect("a WebDriver session")
}

/// axe-core's `axe.min.js`: from `AXE_CORE_JS`, else `node_modules/axe-core/axe.min.js` at
/// the repository's root (`.ci/run` installs it from the npm registry). Missing, the test
/// fails when `CI` is set and is skipped (with the reason printed) otherwise.
pub fn axe_source_or_skip() -> Option<String> {
    let path = std::env::var_os("AXE_CORE_JS")
        .map(PathBuf::from)
        .unwrap_or_else(|| {
            Path::new(env!("CARGO_MANIFEST_DIR")).join("node_modules/axe-core/axe.min.js")
        });
    match std::fs::read_to_string(&path) {
        Ok(text) => Some(text),
        Err(e) if std::env::var_os("CI").is_some() => panic!(
            "axe-core is needed for the accessibility test and was not found at {} ({e}); \
             .ci/run installs it with `npm install --no-save axe-core@4` and sets AXE_CORE_JS",
            path.display()
        ),
        Err(e) => {
            eprintln!(
                "SKIPPED: axe-core not found at {} ({e}); run `npm install --no-save axe-core@4` \
                 at the repository's root or set AXE_CORE_JS (CI does)",
                path.display()
            );
            None
        }
    }
}

/// Runs axe (injected just before) on the whole document and hands back its violations as
/// `[{ id, impact, help, targets: [selector] }]`.
const RUN_AXE: &str = r#"
var done = arguments[arguments.length - 1];
window.axe.run(document, { resultTypes: ['violations'] }).then(function (r) {
  done(r.violations.map(function (v) {
    return { id: v.id, impact: v.impact, help: v.help,
             targets: v.nodes.map(function (n) { return n.target.join(' '); }) };
  }));
}, function (e) { done([{ id: 'axe-error', impact: 'error', help: String(e), targets: [] }]); });
"#;

/// axe-core's violations on the page in view, one line each (`page: rule (impact): help; at
/// selectors`); empty when there is none. `axe` is the library's source, executed in the page
/// through WebDriver (which the page's content-security policy does not govern).
pub async fn axe_violations(c: &Client, page: &str, axe: &str) -> Vec<String> {
    let inject = format!("{axe}\n;return typeof window.axe;");
    let kind = c.execute(&inject, vec![]).await.expect("axe injected");
    assert_eq!(
        kind,
        serde_json::json!("object"),
        "{page}: axe did not load"
    );
    let found = c.execute_async(RUN_AXE, vec![]).await.expect("axe ran");
    found
        .as_array()
        .expect("an array of violations")
        .iter()
        .map(|v| {
            let targets: Vec<&str> = v["targets"]
                .as_array()
                .map(|t| t.iter().filter_map(|s| s.as_str()).collect())
                .unwrap_or_default();
            format!(
                "{page}: {} ({}): {}; at {}",
                v["id"].as_str().unwrap_or("?"),
                v["impact"].as_str().unwrap_or("?"),
                v["help"].as_str().unwrap_or(""),
                targets.join(" | ")
            )
        })
        .collect()
}

/// Reports whether the page in view scrolls sideways: its width against the viewport's (CSS
/// pixels) and the widest elements that stick out, or `None` when it fits.
const MEASURE_WIDTH: &str = r#"
var root = document.documentElement, view = root.clientWidth;
var limit = Math.min(view, arguments[0]), out = [], boxed = [];
document.querySelectorAll('body *').forEach(function (e) {
  var r = e.getBoundingClientRect();
  if (r.right <= limit + 0.5) return;
  var name = e.tagName.toLowerCase() + (e.id ? '#' + e.id : '') +
    (typeof e.className === 'string' && e.className ? '.' + e.className : '') +
    ' reaches ' + Math.round(r.right) + ' px';
  // Inside a box that scrolls on its own is fine, unless (positioned) it escapes the box.
  if (e.parentElement && e.parentElement.closest('.scroll')) boxed.push('in a box: ' + name);
  else out.push(name);
});
if (out.length === 0) out = boxed;
return { scroll: root.scrollWidth, view: view, inner: window.innerWidth, over: out.slice(0, 8) };
"#;

/// Whether the page in view fits a viewport of `width_px` CSS pixels: `None`, or a line
/// saying how wide it is and what sticks out.
pub async fn sideways_overflow(c: &Client, page: &str, width_px: u32) -> Option<String> {
    let v = c
        .execute(MEASURE_WIDTH, vec![serde_json::json!(width_px)])
        .await
        .expect("measured");
    let (scroll, view, inner) = (
        v["scroll"].as_f64().unwrap_or(f64::NAN),
        v["view"].as_f64().unwrap_or(f64::NAN),
        v["inner"].as_f64().unwrap_or(f64::NAN),
    );
    let fits = scroll <= view && view <= inner && inner == f64::from(width_px);
    (!fits).then(|| {
        format!(
            "{page}: the page is {scroll} px wide in a viewport of {view} px (window {inner} px); sticking out: {}",
            v["over"]
        )
    })
}

/// Finds the texts of the page's charts (`figure svg text`) drawn smaller than `arguments[0]`
/// CSS pixels as laid out: the text's font size times the chart's scale to the page.
const MEASURE_CHART_TEXT: &str = r#"
var small = [], min = arguments[0];
document.querySelectorAll('figure svg text').forEach(function (t) {
  var m = t.getScreenCTM(), words = t.textContent.trim();
  if (!m || !words) return;
  var px = parseFloat(getComputedStyle(t).fontSize) * Math.hypot(m.a, m.b);
  if (px < min - 0.05) {
    var fig = t.closest('figure');
    small.push((fig.id || fig.className || 'figure') + ': "' + words.slice(0, 24) + '" at ' + px.toFixed(1) + ' px');
  }
});
return small;
"#;

/// The chart texts of the page in view drawn under `min_px` CSS pixels (at most eight, with
/// how many), or `None` when every one is at least that large.
pub async fn small_chart_text(c: &Client, page: &str, min_px: f64) -> Option<String> {
    let v = c
        .execute(MEASURE_CHART_TEXT, vec![serde_json::json!(min_px)])
        .await
        .expect("measured");
    let small: Vec<String> = v
        .as_array()
        .map(|a| {
            a.iter()
                .filter_map(|s| s.as_str().map(String::from))
                .collect()
        })
        .unwrap_or_default();
    (!small.is_empty()).then(|| {
        format!(
            "{page}: {} chart texts under {min_px} px, e.g. {}",
            small.len(),
            small[..small.len().min(8)].join("; ")
        )
    })
}
