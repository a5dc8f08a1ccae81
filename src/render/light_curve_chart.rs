//! The light curve of a transit seen from the Earth's centre: a CSV of the Sun's relative
//! brightness against time, and the same as a self-contained SVG chart with the contacts
//! marked.

use crate::geometry::transit::TransitEvent;
use crate::render::svg::{svg_open, ticks};
use crate::scale::light_curve::{LightPoint, LIMB_DARKENING_LAW};
use crate::time::iso::push_utc;
use std::fmt::Write;

/// `time_utc,relative_flux`: one row per point (times UTC from 1972, UT1 before, to 0.1 s;
/// the flux to 1e-9).
pub fn light_curve_csv(curves: &[(&TransitEvent, Vec<LightPoint>)]) -> String {
    let mut s = String::from("time_utc,relative_flux\n");
    for (event, points) in curves {
        for p in points {
            push_utc(&mut s, event.label(p.hours), 1);
            let _ = writeln!(s, ",{:.9}", p.relative_flux);
        }
    }
    s
}

/// The chart: relative brightness against time (hours of the label's day), the contacts as
/// dashed lines labelled I-IV, the depth written beside the lowest point.
pub fn light_curve_svg(event: &TransitEvent, points: &[LightPoint]) -> String {
    let (w, h) = (720.0, 320.0);
    let (left, right, top, bottom) = (84.0, 20.0, 34.0, 64.0);
    let title = format!(
        "The Sun's brightness during the transit of {} of {}, seen from the Earth's centre",
        event.planet,
        event.date()
    );
    let mut s = svg_open(w, h, &title);
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    let (Some(first), Some(last)) = (points.first(), points.last()) else {
        let _ = writeln!(s, "<text x=\"20\" y=\"40\">No points.</text></svg>");
        return s;
    };
    let min = points.iter().map(|p| p.relative_flux).fold(1.0, f64::min);
    let depth = 1.0 - min;
    let ylo = 1.0 - (depth * 1.15).max(1e-6);
    let (t0, t1) = (first.hours, last.hours.max(first.hours + 1e-6));
    let x_of = |hours: f64| left + (w - left - right) * (hours - t0) / (t1 - t0);
    let y_of = |f: f64| top + (h - top - bottom) * (1.0 - f) / (1.0 - ylo);
    let _ = writeln!(
        s,
        "<text x=\"{left}\" y=\"18\">{}</text>",
        crate::render::svg::esc(&title)
    );
    for t in ticks(0.0, (1.0 - ylo) * 100.0, 5) {
        let y = y_of(1.0 - t / 100.0);
        let _ = writeln!(s, "<line x1=\"{left}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"#e5e7eb\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\">{}</text>", w - right, left - 5.0, y + 4.0, format_percent(t));
    }
    let _ = writeln!(s, "<text x=\"14\" y=\"{}\" transform=\"rotate(-90 14 {})\" text-anchor=\"middle\">light blocked (% of the Sun's)</text>", (top + h - bottom) / 2.0, (top + h - bottom) / 2.0);
    for t in ticks(t0, t1, 8) {
        let x = x_of(t);
        let label = event.label(t).format("%H:%M").to_string();
        let _ = writeln!(
            s,
            "<text x=\"{x:.1}\" y=\"{}\" text-anchor=\"middle\">{label}</text>",
            h - bottom + 16.0
        );
    }
    let scale = if event.date() < chrono::NaiveDate::from_ymd_opt(1972, 1, 1).unwrap_or_default() {
        "UT1"
    } else {
        "UTC"
    };
    let _ = writeln!(s, "<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">time ({scale}), contacts I-IV dashed; limb darkening: linear, u = 0.6</text>", (left + w - right) / 2.0, h - bottom + 34.0);
    // Contact lines, and their labels; labels of contacts closer than 20 px (a Mercury
    // transit's I and II) are written once, together, between their lines.
    let names = ["I", "II", "III", "IV"];
    let marks: Vec<(f64, &str)> = event
        .geocentric_hours
        .iter()
        .zip(names)
        .filter_map(|(c, n)| c.map(|c| (x_of(c), n)))
        .collect();
    let mut groups: Vec<(Vec<f64>, Vec<&str>)> = Vec::new();
    for &(x, n) in &marks {
        let _ = writeln!(s, "<line x1=\"{x:.1}\" y1=\"{top}\" x2=\"{x:.1}\" y2=\"{}\" stroke=\"#6b7280\" stroke-dasharray=\"4,3\"/>", h - bottom);
        match groups.last_mut() {
            Some((xs, ns)) if xs.last().is_some_and(|&last| x - last < 20.0) => {
                xs.push(x);
                ns.push(n);
            }
            _ => groups.push((vec![x], vec![n])),
        }
    }
    for (xs, ns) in groups {
        let x = xs.iter().sum::<f64>() / xs.len() as f64;
        let _ = writeln!(
            s,
            "<text x=\"{x:.1}\" y=\"{}\" text-anchor=\"middle\" fill=\"#374151\">{}</text>",
            top - 4.0,
            ns.join(", ")
        );
    }
    let path: Vec<String> = points
        .iter()
        .map(|p| format!("{:.1},{:.1}", x_of(p.hours), y_of(p.relative_flux)))
        .collect();
    let _ = writeln!(
        s,
        "<polyline points=\"{}\" fill=\"none\" stroke=\"#1d4ed8\" stroke-width=\"2\"/>",
        path.join(" ")
    );
    let _ = writeln!(s, "<text x=\"{}\" y=\"{}\" text-anchor=\"middle\" fill=\"#1d4ed8\">deepest: {:.4} % of the light</text>", (left + w - right) / 2.0, y_of(min) + 18.0, depth * 100.0);
    let _ = writeln!(
        s,
        "<desc>{}</desc>",
        crate::render::svg::esc(LIMB_DARKENING_LAW)
    );
    s.push_str("</svg>\n");
    s
}

fn format_percent(t: f64) -> String {
    let s = format!("{t:.4}");
    s.trim_end_matches('0').trim_end_matches('.').to_string()
}
