//! The light curve of a transit seen from the Earth's centre: a CSV of the Sun's relative
//! brightness against time, and the same as a self-contained SVG chart with the contacts
//! marked.

use crate::geometry::transit::TransitEvent;
use crate::render::axes::{clock_label, time_ticks, TEXT_PX};
use crate::render::labels::wrap;
use crate::render::svg::{esc, svg_open_text, ticks, trim_tick};
use crate::scale::light_curve::{LightPoint, LIMB_DARKENING_LAW};
use crate::time::iso::push_utc;
use chrono::Timelike;
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

/// Parts per million of the Sun's light.
const PPM: f64 = 1e6;

/// The chart: the change in the Sun's brightness (parts per million, the axis growing
/// upward, so the transit is a dip) against time (ticks at round clock times of the label's
/// time scale), the contacts as dashed lines labelled I-IV, the depth written under the lowest
/// point.
pub fn light_curve_svg(event: &TransitEvent, points: &[LightPoint]) -> String {
    let (w, h) = (720.0, 340.0);
    let (left, right, top, bottom) = (84.0, 20.0, 62.0, 70.0);
    let title = format!(
        "The Sun's brightness during the transit of {} of {}, seen from the Earth's centre",
        event.planet,
        event.date()
    );
    let mut s = svg_open_text(w, h, &title, TEXT_PX);
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    let (Some(first), Some(last)) = (points.first(), points.last()) else {
        let _ = writeln!(s, "<text x=\"20\" y=\"40\">No points.</text></svg>");
        return s;
    };
    let min = points.iter().map(|p| p.relative_flux).fold(1.0, f64::min);
    let depth = 1.0 - min;
    // The axis: change in brightness, ppm, from below the deepest point up to a little above 0.
    let lo_ppm = -(depth * PPM * 1.15).max(1e-3);
    let hi_ppm = -lo_ppm * 0.08;
    let (t0, t1) = (first.hours, last.hours.max(first.hours + 1e-6));
    let x_of = |hours: f64| left + (w - left - right) * (hours - t0) / (t1 - t0);
    let y_of = |ppm: f64| top + (h - top - bottom) * (hi_ppm - ppm) / (hi_ppm - lo_ppm);
    let flux_y = |f: f64| y_of((f - 1.0) * PPM);
    let title_lines = wrap(&title, TEXT_PX, w - 20.0);
    for (k, line) in title_lines.iter().enumerate() {
        let _ = writeln!(
            s,
            "<text x=\"10\" y=\"{}\">{}</text>",
            18.0 + 16.0 * k as f64,
            esc(line)
        );
    }
    for t in ticks(lo_ppm, hi_ppm, 5) {
        let y = y_of(t);
        let stroke = if t == 0.0 { "#9ca3af" } else { "#e5e7eb" };
        let _ = writeln!(s, "<line x1=\"{left}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"{stroke}\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\">{}</text>", w - right, left - 6.0, y + 4.5, trim_tick(t));
    }
    let mid = (top + h - bottom) / 2.0;
    let _ = writeln!(s, "<text x=\"16\" y=\"{mid}\" transform=\"rotate(-90 16 {mid})\" text-anchor=\"middle\">change in brightness (ppm)</text>");
    // Ticks at round clock times: seconds after the midnight of the first label's day.
    let start = event.label(t0);
    let start_s =
        f64::from(start.num_seconds_from_midnight()) + f64::from(start.nanosecond()) * 1e-9;
    let end_s = start_s + (t1 - t0) * 3600.0;
    let (_, time_marks) = time_ticks(start_s, end_s, 9);
    for tick in time_marks {
        let x = x_of(t0 + (tick - start_s) / 3600.0);
        let _ = writeln!(
            s,
            "<line x1=\"{x:.1}\" y1=\"{}\" x2=\"{x:.1}\" y2=\"{}\" stroke=\"#6b7280\"/><text x=\"{x:.1}\" y=\"{}\" text-anchor=\"middle\">{}</text>",
            h - bottom,
            h - bottom + 5.0,
            h - bottom + 20.0,
            clock_label(tick)
        );
    }
    let scale = if event.date() < chrono::NaiveDate::from_ymd_opt(1972, 1, 1).unwrap_or_default() {
        "UT1"
    } else {
        "UTC"
    };
    let _ = writeln!(s, "<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">time ({scale}); contacts I-IV dashed</text>", (left + w - right) / 2.0, h - bottom + 42.0);
    contact_lines(&mut s, event, &x_of, (top, h - bottom));
    let path: Vec<String> = points
        .iter()
        .map(|p| format!("{:.1},{:.1}", x_of(p.hours), flux_y(p.relative_flux)))
        .collect();
    let _ = writeln!(
        s,
        "<polyline points=\"{}\" fill=\"none\" stroke=\"#1d4ed8\" stroke-width=\"2\"/>",
        path.join(" ")
    );
    let _ = writeln!(s, "<text x=\"{}\" y=\"{:.1}\" text-anchor=\"middle\" fill=\"#1d4ed8\">deepest: {:.4} % of the light ({:.0} ppm)</text>", (left + w - right) / 2.0, flux_y(min) + 20.0, depth * 100.0, depth * PPM);
    let _ = writeln!(s, "<desc>{}</desc>", esc(LIMB_DARKENING_LAW));
    s.push_str("</svg>\n");
    s
}

/// The contacts' dashed lines and their labels above the plot; labels of contacts closer
/// than 24 px (a Mercury transit's I and II) are written once, together, between their lines.
fn contact_lines(
    s: &mut String,
    event: &TransitEvent,
    x_of: &dyn Fn(f64) -> f64,
    (top, bottom): (f64, f64),
) {
    let names = ["I", "II", "III", "IV"];
    let marks: Vec<(f64, &str)> = event
        .geocentric_hours
        .iter()
        .zip(names)
        .filter_map(|(c, n)| c.map(|c| (x_of(c), n)))
        .collect();
    let mut groups: Vec<(Vec<f64>, Vec<&str>)> = Vec::new();
    for &(x, n) in &marks {
        let _ = writeln!(s, "<line x1=\"{x:.1}\" y1=\"{top}\" x2=\"{x:.1}\" y2=\"{bottom}\" stroke=\"#6b7280\" stroke-dasharray=\"4,3\"/>");
        match groups.last_mut() {
            Some((xs, ns)) if xs.last().is_some_and(|&last| x - last < 24.0) => {
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
            top - 5.0,
            ns.join(", ")
        );
    }
}
