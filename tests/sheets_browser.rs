//! The observers' sheet as a browser lays it out and prints it (`predict --sheets`): headless
//! Chromium takes a screenshot, prints the page to PDF on A4 and on US Letter (one page each),
//! and a script measures every piece of text at the widths of both papers: no text's box
//! overlaps another's, and none reaches outside the page or outside its drawing; in each of the
//! five languages (German has the longest words, French and Portuguese the longest sentences).
//! Without chromium the tests say SKIPPED and pass (CI installs it).

mod common;

use common::chromium::{browser_or_skip, chromium, screenshot_pixels, temp_dir};
use common::run;
use std::path::{Path, PathBuf};

/// Stations of the sheets looked at: a zone with daylight saving rules, one without a zone
/// (the longer paragraph), one where the Sun sets during the transit.
const STATIONS: &str = "station,latitude,longitude,elevation_m,time_zone
Leiden Primary School,52.16,4.49,2,Europe/Amsterdam
Saltmarsh Academy,38.72,-9.14,50,
Jade Terrace School,22.28,114.16,40,Asia/Hong_Kong
";

/// The languages whose sheets are laid out and printed: all of them.
const LANGUAGES: [&str; 5] = ["en", "de", "es", "fr", "pt"];

/// The sheets of the Mercury transit of 2032 for [`STATIONS`] in every language of
/// [`LANGUAGES`], in `dir`.
fn sheets(dir: &Path) -> Vec<PathBuf> {
    LANGUAGES
        .iter()
        .flat_map(|code| sheets_in(dir, code))
        .collect()
}

/// The sheets of the Mercury transit of 2032 for [`STATIONS`] in one language, in `dir`.
fn sheets_in(dir: &Path, code: &str) -> Vec<PathBuf> {
    let stations = dir.join("stations.csv");
    std::fs::write(&stations, STATIONS).unwrap();
    let out = dir.join(format!("sheets-{code}"));
    let o = run(&[
        "predict",
        "--planet",
        "mercury",
        "--date",
        "2032-11-13",
        "--stations",
        stations.to_str().unwrap(),
        "--sheets",
        out.to_str().unwrap(),
        "--language",
        code,
    ]);
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    [
        "Leiden_Primary_School",
        "Saltmarsh_Academy",
        "Jade_Terrace_School",
    ]
    .iter()
    .map(|n| out.join(format!("{n}.html")))
    .collect()
}

/// Measures every text node of the page (HTML and SVG) and appends the findings as JSON in
/// `<pre id="layout-findings">`: text boxes that overlap, and text outside the page width or
/// outside its drawing.
const MEASURE_TEXT: &str = r#"<script>
(function () {
  var problems = [], boxes = [];
  var width = document.documentElement.clientWidth;
  var walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
  var node;
  while ((node = walker.nextNode())) {
    var s = node.textContent.trim();
    if (!s) continue;
    var range = document.createRange();
    range.selectNodeContents(node);
    var svg = node.parentElement.closest('svg');
    var limit = svg ? svg.getBoundingClientRect() : null;
    Array.prototype.forEach.call(range.getClientRects(), function (r) {
      if (r.width <= 0 || r.height <= 0) return;
      if (r.left < -0.5 || r.right > width + 0.5) problems.push('"' + s + '" leaves the page');
      if (limit && (r.left < limit.left - 0.5 || r.right > limit.right + 0.5 ||
                    r.top < limit.top - 0.5 || r.bottom > limit.bottom + 0.5)) {
        problems.push('"' + s + '" leaves its drawing');
      }
      boxes.push({ r: r, s: s, n: node });
    });
  }
  for (var i = 0; i < boxes.length; i++) {
    for (var j = i + 1; j < boxes.length; j++) {
      if (boxes[i].n === boxes[j].n) continue;
      var a = boxes[i].r, b = boxes[j].r;
      var dx = Math.min(a.right, b.right) - Math.max(a.left, b.left);
      var dy = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
      if (dx > 1 && dy > 1.5) problems.push('"' + boxes[i].s + '" overlaps "' + boxes[j].s + '"');
    }
  }
  var pre = document.createElement('pre');
  pre.id = 'layout-findings';
  pre.textContent = JSON.stringify({ width: width, texts: boxes.length, problems: problems });
  document.body.appendChild(pre);
})();
</script>"#;

/// Lay out a sheet at this window width and return (text boxes, problems).
fn measure_sheet(browser: &Path, dir: &Path, sheet: &Path, width_px: u32) -> (u64, Vec<String>) {
    let html = std::fs::read_to_string(sheet).unwrap();
    let end = html.rfind("</body>").unwrap();
    let page = dir.join(format!("measured-{width_px}.html"));
    std::fs::write(
        &page,
        format!("{}{MEASURE_TEXT}{}", &html[..end], &html[end..]),
    )
    .unwrap();
    let o = chromium(
        browser,
        &page,
        &dir.join(format!("profile-measure-{width_px}")),
        &[
            format!("--window-size={width_px},1100"),
            "--dump-dom".into(),
            "--virtual-time-budget=3000".into(),
        ],
    );
    let dom = String::from_utf8_lossy(&o.stdout);
    let tag = "<pre id=\"layout-findings\">";
    let start = dom.find(tag).expect("findings") + tag.len();
    let text = &dom[start..];
    let text = text[..text.find("</pre>").unwrap()]
        .replace("&lt;", "<")
        .replace("&gt;", ">")
        .replace("&quot;", "\"")
        .replace("&amp;", "&");
    let v: serde_json::Value = serde_json::from_str(&text).unwrap();
    let laid_out_px = v["width"].as_u64().unwrap();
    assert!(
        laid_out_px.abs_diff(u64::from(width_px)) < 20,
        "laid out {laid_out_px} px wide, not {width_px}"
    );
    let problems = v["problems"].as_array().unwrap();
    (
        v["texts"].as_u64().unwrap(),
        problems
            .iter()
            .map(|p| p.as_str().unwrap().to_string())
            .collect(),
    )
}

/// The number of pages of a PDF: its page objects (`/Type /Page`, not the `/Pages` tree).
fn pdf_pages(pdf: &[u8]) -> usize {
    let mut count = 0;
    let mut i = 0;
    while let Some(k) = pdf[i..].windows(5).position(|w| w == b"/Type") {
        let rest = &pdf[i + k + 5..];
        let rest = &rest[rest.iter().take_while(|c| c.is_ascii_whitespace()).count()..];
        if rest.starts_with(b"/Page") && !rest.starts_with(b"/Pages") {
            count += 1;
        }
        i += k + 5;
    }
    count
}

#[test]
fn each_sheet_prints_on_one_page_of_a4_and_of_letter() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("sheets-print");
    for sheet in sheets(&dir) {
        let html = std::fs::read_to_string(&sheet).unwrap();
        for (paper, size) in [("a4", "A4"), ("letter", "letter")] {
            // The sheet's own @page says size auto; the paper is set as a printer would.
            let page = dir.join(format!("{paper}.html"));
            let forced = html.replacen(
                "</style>",
                &format!("@page {{ size: {size}; margin: 12mm; }}\n</style>"),
                1,
            );
            std::fs::write(&page, forced).unwrap();
            let pdf = dir.join(format!("{paper}.pdf"));
            let _ = std::fs::remove_file(&pdf);
            let o = chromium(
                &browser,
                &page,
                &dir.join(format!("profile-{paper}")),
                &[
                    format!("--print-to-pdf={}", pdf.display()),
                    "--no-pdf-header-footer".into(),
                ],
            );
            let bytes = std::fs::read(&pdf)
                .unwrap_or_else(|_| panic!("no PDF: {}", String::from_utf8_lossy(&o.stderr)));
            assert!(bytes.len() > 1000, "{paper}: PDF of {} bytes", bytes.len());
            assert_eq!(pdf_pages(&bytes), 1, "{}: {paper}", sheet.display());
        }
    }
}

#[test]
fn a_sheet_is_laid_out_without_overlaps_at_the_widths_of_a4_and_letter() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("sheets-layout");
    for sheet in sheets(&dir) {
        // A4 is 794 px wide at 96 px per inch, Letter 816 px.
        for width_px in [794, 816] {
            let (texts, problems) = measure_sheet(&browser, &dir, &sheet, width_px);
            assert!(texts > 60, "{}: only {texts} texts", sheet.display());
            assert!(
                problems.is_empty(),
                "{} at {width_px} px:\n{}",
                sheet.display(),
                problems.join("\n")
            );
        }
    }
}

#[test]
fn a_screenshot_of_a_sheet_shows_a_page() {
    let Some(browser) = browser_or_skip() else {
        return;
    };
    let dir = temp_dir("sheets-shot");
    let sheet = &sheets_in(&dir, "en")[0];
    let shot = dir.join("sheet.png");
    let o = chromium(
        &browser,
        sheet,
        &dir.join("profile-shot"),
        &[
            "--window-size=794,1123".into(),
            format!("--screenshot={}", shot.display()),
        ],
    );
    assert!(
        shot.exists(),
        "no screenshot: {}",
        String::from_utf8_lossy(&o.stderr)
    );
    let (_, _, pixels) = screenshot_pixels(&shot);
    let dark = pixels
        .iter()
        .filter(|px| px.iter().take(3).all(|&c| c < 100))
        .count();
    assert!(dark > 5_000, "too little drawn ({dark} dark pixels)");
}
