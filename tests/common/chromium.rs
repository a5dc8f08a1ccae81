//! Headless Chromium for the tests that check pages as a browser lays them out (Debian's
//! `chromium`, which `.ci/run` installs): finding it, running it on a local page, and a script
//! that measures every chart of a page in Chromium's own layout. Without chromium the tests
//! say SKIPPED and pass.

use std::path::{Path, PathBuf};
use std::process::Command;

/// The first Chromium found where Debian and others install it.
pub fn find_chromium() -> Option<PathBuf> {
    [
        "/usr/bin/chromium",
        "/usr/bin/chromium-browser",
        "/usr/bin/google-chrome",
    ]
    .iter()
    .map(PathBuf::from)
    .find(|p| p.exists())
}

/// The browser, or `None` after saying the test is skipped.
pub fn browser_or_skip() -> Option<PathBuf> {
    let found = find_chromium();
    if found.is_none() {
        eprintln!(
            "SKIPPED: no chromium installed (CI installs Debian's chromium and runs this test)"
        );
    }
    found
}

/// A fresh folder for one test's files.
pub fn temp_dir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("tp-browser-{}-{name}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    d
}

/// Headless Chromium on a local page with these extra arguments; its output.
pub fn chromium(
    browser: &Path,
    page: &Path,
    profile: &Path,
    extra: &[String],
) -> std::process::Output {
    Command::new(browser)
        .args([
            "--headless",
            "--no-sandbox",
            "--disable-gpu",
            "--disable-quic",
            "--no-first-run",
            "--disable-background-networking",
            "--disable-component-update",
            "--disable-sync",
            "--disable-default-apps",
            "--hide-scrollbars",
            "--window-size=1200,3000",
        ])
        .arg(format!("--user-data-dir={}", profile.display()))
        .args(extra)
        .arg(format!("file://{}", page.display()))
        .output()
        .expect("chromium runs")
}

/// Measures every `<svg>` of the page in the browser's layout and appends the findings as
/// JSON in `<pre id="layout-findings">`.
pub const MEASURE: &str = r#"<script>
(function () {
  var problems = [], texts = 0, shapes = 0, smallest = 1e9;
  var svgs = document.querySelectorAll('svg');
  svgs.forEach(function (svg, k) {
    var name = svg.getAttribute('aria-label') || ('chart ' + k);
    var v = svg.getBoundingClientRect();
    var vb = svg.viewBox.baseVal;
    if (!vb || vb.width <= 0 || Math.abs(v.width / v.height - vb.width / vb.height) > 0.01) {
      problems.push(name + ': not drawn at its view box aspect ratio');
    }
    var inside = function (r, tol) {
      return r.left >= v.left - tol && r.right <= v.right + tol &&
             r.top >= v.top - tol && r.bottom <= v.bottom + tol;
    };
    var boxes = [];
    var scale = vb && vb.width > 0 ? v.width / vb.width : 1;
    svg.querySelectorAll('text').forEach(function (t) {
      var s = t.textContent.trim();
      if (!s) return;
      texts++;
      var px = parseFloat(getComputedStyle(t).fontSize) * scale;
      if (window.MIN_TEXT_PX && !(px >= window.MIN_TEXT_PX - 0.01)) {
        problems.push(name + ': text ' + s + ' is ' + px.toFixed(1) + ' px');
      }
      smallest = Math.min(smallest, px);
      var r = t.getBoundingClientRect();
      if (r.width <= 0 || r.height <= 0) problems.push(name + ': text ' + s + ' has no box');
      if (!inside(r, 0.5)) problems.push(name + ': text ' + s + ' reaches outside the view box');
      boxes.push({ r: r, s: s });
    });
    for (var i = 0; i < boxes.length; i++) {
      for (var j = i + 1; j < boxes.length; j++) {
        var a = boxes[i].r, b = boxes[j].r;
        var dx = Math.min(a.right, b.right) - Math.max(a.left, b.left);
        var dy = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
        if (dx > 1 && dy > 1.5) {
          problems.push(name + ': text ' + boxes[i].s + ' overlaps text ' + boxes[j].s);
        }
      }
    }
    svg.querySelectorAll('circle, ellipse, rect, line, path, polyline, polygon').forEach(function (e) {
      if (e.closest('defs, clipPath, mask, symbol, [clip-path]')) return;
      shapes++;
      if (!inside(e.getBoundingClientRect(), 1.0)) {
        problems.push(name + ': a ' + e.tagName + ' reaches outside the view box');
      }
    });
  });
  var pre = document.createElement('pre');
  pre.id = 'layout-findings';
  pre.textContent = JSON.stringify({ svgs: svgs.length, texts: texts, shapes: shapes, smallest: smallest, problems: problems });
  document.body.appendChild(pre);
})();
</script>"#;

/// What the measuring script found on a page.
pub struct Findings {
    pub svgs: u64,
    pub texts: u64,
    pub shapes: u64,
    /// The smallest text of any chart, CSS px as laid out.
    pub smallest_text_px: f64,
    pub problems: Vec<String>,
}

/// Lay out this HTML page in Chromium and return what the measuring script found.
pub fn measure(browser: &Path, dir: &Path, name: &str, html: &str) -> Findings {
    measure_with(browser, dir, name, html, None)
}

/// [`measure`], also finding every chart text smaller than `min_text_px` CSS pixels as laid
/// out (its font size times the chart's scale from its view box to the page).
pub fn measure_with(
    browser: &Path,
    dir: &Path,
    name: &str,
    html: &str,
    min_text_px: Option<f64>,
) -> Findings {
    let page = dir.join(format!("{name}.html"));
    let body_end = html.rfind("</body>").unwrap_or(html.len());
    let limit = min_text_px.map_or(String::new(), |px| {
        format!("<script>window.MIN_TEXT_PX = {px};</script>\n")
    });
    let measured = format!(
        "{}{limit}{MEASURE}\n{}",
        &html[..body_end],
        &html[body_end..]
    );
    std::fs::write(&page, measured).unwrap();
    let o = chromium(
        browser,
        &page,
        &dir.join(format!("profile-{name}")),
        &["--dump-dom".into(), "--virtual-time-budget=5000".into()],
    );
    let dom = String::from_utf8_lossy(&o.stdout);
    let start = dom.find("<pre id=\"layout-findings\">").unwrap_or_else(|| {
        panic!(
            "{name}: no findings; stderr: {}",
            String::from_utf8_lossy(&o.stderr)
        )
    });
    let rest = &dom[start + "<pre id=\"layout-findings\">".len()..];
    let text = &rest[..rest.find("</pre>").unwrap()];
    let text = text
        .replace("&lt;", "<")
        .replace("&gt;", ">")
        .replace("&quot;", "\"")
        .replace("&amp;", "&");
    let v: serde_json::Value = serde_json::from_str(&text).unwrap();
    Findings {
        svgs: v["svgs"].as_u64().unwrap(),
        texts: v["texts"].as_u64().unwrap(),
        shapes: v["shapes"].as_u64().unwrap(),
        smallest_text_px: v["smallest"].as_f64().unwrap_or(0.0),
        problems: v["problems"]
            .as_array()
            .unwrap()
            .iter()
            .map(|p| p.as_str().unwrap().to_string())
            .collect(),
    }
}

/// A screenshot Chromium wrote: its width and height in pixels and each pixel's samples
/// (RGB or RGBA), decoded with the `png` crate.
#[allow(dead_code)]
pub fn screenshot_pixels(shot: &Path) -> (u32, u32, Vec<Vec<u8>>) {
    let decoder = png::Decoder::new(std::fs::File::open(shot).expect("screenshot"));
    let mut reader = decoder.read_info().expect("png header");
    let mut buf = vec![0; reader.output_buffer_size()];
    let info = reader.next_frame(&mut buf).expect("png frame");
    let step = info.color_type.samples();
    let pixels = buf[..info.buffer_size()]
        .chunks(step)
        .map(<[u8]>::to_vec)
        .collect();
    (info.width, info.height, pixels)
}
