//! Charts of planning and simulation as self-contained SVG: a contact's sensitivity to the
//! parallax over the Earth, and the histogram of simulated AU estimates.

use crate::geometry::contacts::Contact;
use crate::geometry::station::Station;
use crate::render::charts::residual_colour;
use crate::render::labels::{wrapped_text, LabelPlacer, TextBox};
use crate::render::svg::{
    esc, graticule_label_boxes, graticule_labels, grid_cells_svg, land_svg, svg_open_text, ticks,
    trim_tick, world_px,
};
use std::fmt::Write;

/// Colour for a sensitivity (s/arcsec) on a diverging scale saturating at `limit`.
fn sensitivity_colour(v: f64, limit: f64) -> String {
    residual_colour(2.0 * v / limit.max(1e-9))
}

/// A world map of one contact's sensitivity to the parallax (s/arcsec) where the contact is
/// seen with the Sun at least `min_altitude_deg` up; grey where it is not. The candidate sites
/// are numbered in file order, with a key below the map; `chosen` (indices into `sites`) are
/// drawn as filled stars and marked in the key, the others as open triangles.
pub fn sensitivity_map_svg(
    points: &[crate::planning::sites::GridPoint],
    (step_deg, min_altitude_deg): (f64, f64),
    contact: Contact,
    (sites, chosen): (&[Station], &[usize]),
    title: &str,
) -> String {
    let (w, h) = (720.0, 360.0);
    let limit = points
        .iter()
        .filter(|p| p.sun_altitude_deg >= min_altitude_deg)
        .map(|p| p.sensitivity_s_per_arcsec.abs())
        .filter(|v| v.is_finite())
        .fold(1e-3, f64::max);
    let ly = h + 18.0;
    let marks = if chosen.is_empty() {
        "Open triangles: the sites, numbered as in the key."
    } else {
        "Open triangles: the sites, numbered as in the key; filled stars: the chosen sites."
    };
    let note = format!(
        "Contact {}: seconds per arcsecond of solar parallax. Light: not seen with the Sun {min_altitude_deg:.0} degrees up. {title}. {marks} Land (shaded): Natural Earth 1:110m (public domain).",
        contact.roman()
    );
    let (note_lines, after) = wrapped_text(&note, (220.0, ly), (12.0, 15.0), w - 230.0);
    let (key, key_end) = site_key((sites, chosen), after.max(ly + 14.0) + 4.0, w);
    let mut s = svg_open_text(w, key_end, title, 12.0);
    let _ = writeln!(s, "<rect width=\"{w}\" height=\"{h}\" fill=\"#f3f4f6\"/>");
    // Cells merged into runs of one colour along each row of latitude.
    let bin = |p: &crate::planning::sites::GridPoint| -> Option<i32> {
        (p.sun_altitude_deg >= min_altitude_deg && p.sensitivity_s_per_arcsec.is_finite())
            .then(|| (p.sensitivity_s_per_arcsec / limit * 8.0).round() as i32)
    };
    let centres: Vec<(f64, f64)> = points
        .iter()
        .map(|p| (p.longitude_deg, p.latitude_deg))
        .collect();
    s.push_str(&grid_cells_svg(&centres, (step_deg, step_deg), |k| {
        bin(&points[k]).map(|b| sensitivity_colour(f64::from(b) / 8.0 * limit, limit))
    }));
    // Land shaded lightly over everything, so that ocean tells from land where the contact is
    // not seen as well as where it is.
    s.push_str(&land_svg("rgba(55,65,81,0.22)", "#374151", 0.5));
    s.push_str(&graticule_labels(h));
    s.push_str(&site_marks((sites, chosen), (w, h)));
    for (k, f) in [-1.0, -0.5, 0.0, 0.5, 1.0].iter().enumerate() {
        let x = 10.0 + 40.0 * k as f64;
        let _ = writeln!(s, "<rect x=\"{x}\" y=\"{}\" width=\"38\" height=\"10\" fill=\"{}\" stroke=\"#1f2937\" stroke-width=\"0.3\"/><text x=\"{}\" y=\"{}\" text-anchor=\"middle\" font-size=\"12\">{:+.1}</text>", ly - 10.0, sensitivity_colour(f * limit, limit), x + 19.0, ly + 10.0, f * limit);
    }
    s.push_str(&note_lines);
    s.push_str(&key);
    s.push_str("</svg>\n");
    s
}

/// Most sites listed in a map's key; the rest are said in one line.
const KEY_MAX_SITES: usize = 80;
/// Columns of a map's key.
const KEY_COLUMNS: usize = 4;

/// The sites on the map: open triangles, filled stars for the chosen, each with its number
/// (1 for the first site of the file) beside it where the number fits clear of the others.
fn site_marks((sites, chosen): (&[Station], &[usize]), (w, h): (f64, f64)) -> String {
    let mut placer = LabelPlacer::new(TextBox {
        x0: 0.0,
        y0: 0.0,
        x1: w,
        y1: h,
    });
    for b in graticule_label_boxes(h) {
        placer.reserve(b);
    }
    let mut marks = String::new();
    let mut numbers = String::new();
    // The chosen sites first, so that their numbers win the space.
    let order = chosen
        .iter()
        .copied()
        .chain((0..sites.len()).filter(|k| !chosen.contains(k)));
    for k in order.filter(|&k| k < sites.len()) {
        let site = &sites[k];
        let (x, y) = world_px(site.longitude_deg, site.latitude_deg);
        let is_chosen = chosen.contains(&k);
        let shape = if is_chosen {
            star_path(x, y, 6.0)
        } else {
            format!("M{x:.1},{:.1} l4,7 l-8,0 z", y - 4.0)
        };
        let (fill, stroke) = if is_chosen {
            ("#111827", "#ffffff")
        } else {
            ("#ffffff", "#111827")
        };
        let _ = writeln!(marks, "<path d=\"{shape}\" fill=\"{fill}\" stroke=\"{stroke}\" stroke-width=\"0.9\"><title>{} (#{})</title></path>", esc(&site.name), k + 1);
        let text = (k + 1).to_string();
        if let Some((tx, ty)) = placer.place(&text, 12.0, (x, y), 5.0) {
            let weight = if is_chosen {
                " font-weight=\"bold\""
            } else {
                ""
            };
            let _ = writeln!(numbers, "<text x=\"{tx:.1}\" y=\"{ty:.1}\" font-size=\"12\"{weight} stroke=\"#ffffff\" stroke-width=\"2.5\" paint-order=\"stroke\">{text}</text>");
        }
    }
    marks + &numbers
}

/// A five-pointed star of outer radius `r_px` centred on (x, y), as path data.
fn star_path(x: f64, y: f64, r_px: f64) -> String {
    let mut d = String::new();
    for k in 0..10 {
        let r = if k % 2 == 0 { r_px } else { r_px * 0.45 };
        let a = std::f64::consts::PI * f64::from(k) / 5.0;
        let _ = write!(
            d,
            "{}{:.1},{:.1}",
            if k == 0 { "M" } else { "L" },
            x + r * a.sin(),
            y - r * a.cos()
        );
    }
    d.push('z');
    d
}

/// The key of the site numbers below a map, from `top`: number and name in columns, chosen
/// sites in bold with a star; the SVG and the bottom of the chart.
fn site_key((sites, chosen): (&[Station], &[usize]), top: f64, w: f64) -> (String, f64) {
    if sites.is_empty() {
        return (String::new(), top);
    }
    let shown = sites.len().min(KEY_MAX_SITES);
    let rows = shown.div_ceil(KEY_COLUMNS);
    let column_w = (w - 20.0) / KEY_COLUMNS as f64;
    // Characters that fit a column at 12 px after the number (estimated as labels.rs does).
    let max_chars = ((column_w - 34.0) / (0.65 * 12.0)).floor() as usize;
    let mut s = format!(
        "<text x=\"10\" y=\"{:.1}\" font-size=\"13\" font-weight=\"bold\">Sites</text>\n",
        top + 10.0
    );
    for (k, site) in sites.iter().enumerate().take(shown) {
        let (col, row) = (k / rows, k % rows);
        let (x, y) = (10.0 + column_w * col as f64, top + 28.0 + 16.0 * row as f64);
        let is_chosen = chosen.contains(&k);
        let name: String = if site.name.chars().count() > max_chars {
            let cut: String = site
                .name
                .chars()
                .take(max_chars.saturating_sub(1))
                .collect();
            format!("{cut}…")
        } else {
            site.name.clone()
        };
        if is_chosen {
            let _ = writeln!(
                s,
                "<path d=\"{}\" fill=\"#111827\"/>",
                star_path(x + 3.0, y - 3.5, 3.5)
            );
        }
        let weight = if is_chosen {
            " font-weight=\"bold\""
        } else {
            ""
        };
        let _ = writeln!(
            s,
            "<text x=\"{:.1}\" y=\"{y:.1}\" font-size=\"12\"{weight}>{} {}</text>",
            x + 9.0,
            k + 1,
            esc(&name)
        );
    }
    let mut bottom = top + 28.0 + 16.0 * rows as f64;
    if sites.len() > shown {
        let _ = writeln!(s, "<text x=\"10\" y=\"{bottom:.1}\" font-size=\"12\">and {} more sites, numbered in the order of the sites file</text>", sites.len() - shown);
        bottom += 16.0;
    }
    (s, bottom)
}

/// A histogram of values (e.g. AU estimates in km) with the true value marked.
pub fn histogram_svg(
    values: &[f64],
    truth: f64,
    (x_label, tick_scale): (&str, f64),
    title: &str,
) -> String {
    let (w, h) = (720.0, 340.0);
    let (left, right, top, bottom) = (70.0, 20.0, 50.0, 50.0);
    let mut s = svg_open_text(w, h, title, 12.0);
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/><text x=\"{}\" y=\"18\" text-anchor=\"middle\">{}</text>", w / 2.0, esc(title));
    if values.is_empty() {
        s.push_str("<text x=\"20\" y=\"60\">No estimates.</text></svg>\n");
        return s;
    }
    let lo = values
        .iter()
        .cloned()
        .fold(f64::INFINITY, f64::min)
        .min(truth);
    let hi = values
        .iter()
        .cloned()
        .fold(f64::NEG_INFINITY, f64::max)
        .max(truth);
    let span = (hi - lo).max(1e-9);
    let bins = ((values.len() as f64).sqrt().ceil() as usize).clamp(5, 60);
    let mut counts = vec![0usize; bins];
    for v in values {
        let k = (((v - lo) / span) * bins as f64).floor() as usize;
        counts[k.min(bins - 1)] += 1;
    }
    let cmax = counts.iter().copied().max().unwrap_or(1).max(1) as f64;
    let x_of = |v: f64| left + (w - left - right) * (v - lo) / span;
    let bw = (w - left - right) / bins as f64;
    for (k, c) in counts.iter().enumerate() {
        let bh = (h - top - bottom) * *c as f64 / cmax;
        let _ = writeln!(s, "<rect x=\"{:.1}\" y=\"{:.1}\" width=\"{:.1}\" height=\"{bh:.1}\" fill=\"#93c5fd\" stroke=\"#1d4ed8\" stroke-width=\"0.5\"/>", left + bw * k as f64, h - bottom - bh, bw);
    }
    for t in ticks(lo / tick_scale, hi / tick_scale, 6) {
        let x = x_of(t * tick_scale);
        if !(left - 1.0..=w - right + 1.0).contains(&x) {
            continue;
        }
        let _ = writeln!(
            s,
            "<line x1=\"{x:.1}\" y1=\"{}\" x2=\"{x:.1}\" y2=\"{}\" stroke=\"#6b7280\"/><text x=\"{x:.1}\" y=\"{}\" text-anchor=\"middle\" font-size=\"12\">{}</text>",
            h - bottom,
            h - bottom + 4.0,
            h - bottom + 16.0,
            trim_tick(t)
        );
    }
    // The count axis.
    let y_of = |c: f64| h - bottom - (h - top - bottom) * c / cmax;
    for c in ticks(0.0, cmax, 5) {
        let y = y_of(c);
        let _ = writeln!(s, "<line x1=\"{}\" y1=\"{y:.1}\" x2=\"{left}\" y2=\"{y:.1}\" stroke=\"#6b7280\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\" font-size=\"12\">{c}</text>", left - 4.0, left - 6.0, y + 3.0);
    }
    let _ = writeln!(s, "<line x1=\"{left}\" y1=\"{top}\" x2=\"{left}\" y2=\"{}\" stroke=\"#6b7280\"/><text x=\"16\" y=\"{}\" transform=\"rotate(-90 16 {})\" text-anchor=\"middle\">campaigns</text>", h - bottom, (top + h - bottom) / 2.0, (top + h - bottom) / 2.0);
    // The true value, labelled above the bars.
    let xt = x_of(truth);
    let _ = writeln!(s, "<line x1=\"{xt:.1}\" y1=\"{}\" x2=\"{xt:.1}\" y2=\"{}\" stroke=\"#16a34a\" stroke-width=\"2\"/><text x=\"{xt:.1}\" y=\"{}\" text-anchor=\"middle\" fill=\"#16a34a\">true value</text>", top - 8.0, h - bottom, top - 12.0);
    let _ = writeln!(
        s,
        "<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">{}</text>",
        w / 2.0,
        h - 12.0,
        esc(x_label)
    );
    s.push_str("</svg>\n");
    s
}
