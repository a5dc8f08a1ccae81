//! The visibility map and grid of a transit (`transits --visibility-map`, `--visibility-grid`):
//! the world shaded by which part of the transit is seen with the Sun up, the limits where the
//! Sun is on the horizon at contacts I and IV, labelled lines of equal time of each contact,
//! graticule, land and a legend; and the grid itself as CSV.

use crate::geometry::contacts::Contact;
use crate::geometry::transit::TransitEvent;
use crate::geometry::visibility::{Visibility, VisibilityGrid, HORIZON_ALTITUDE_DEG};
use crate::render::contours::{contour_lines, Field, GridXy};
use crate::render::labels::{wrapped_text, LabelPlacer, TextBox};
use crate::render::svg::{
    esc, graticule_label_boxes, graticule_labels, graticule_lines, grid_cells_svg, land_svg,
    svg_open, trim_tick, world_px,
};
use crate::render::text::csv_field;
use crate::time::iso::format_utc;
use std::fmt::Write;

/// The columns of the grid CSV, in order.
pub const GRID_COLUMNS: &str =
    "latitude,longitude,contact,time_utc,sun_altitude_deg,sun_up,seen,ephemeris";

/// Width of the map, px (the 2 px per degree world frame).
const MAP_W: f64 = 720.0;
/// Height of the map, px.
const MAP_H: f64 = 360.0;
/// Top of the map below the title, px.
const MAP_TOP: f64 = 26.0;
/// The legend's rows, px apart.
const LEGEND_ROW_PX: f64 = 18.0;
/// Font size of the labels on the lines of equal time, px.
const LABEL_PX: f64 = 12.0;
/// Spacings tried for the lines of equal time, minutes: the smallest that gives at most
/// [`MAX_TIME_LINES`] lines for every contact is used.
pub const TIME_STEPS_MIN: [f64; 9] = [0.5, 1.0, 2.0, 5.0, 10.0, 15.0, 30.0, 60.0, 120.0];
/// Most lines of equal time drawn for one contact.
pub const MAX_TIME_LINES: usize = 5;

/// The grid as CSV: one row per grid point and contact, north to south, west to east, contacts
/// I-IV. `time_utc` and `sun_altitude_deg` are empty where the contact does not occur at that
/// point (the planet's path misses that contact's cone there).
pub fn visibility_grid_csv(event: &TransitEvent, grid: &VisibilityGrid) -> String {
    let ephemeris = csv_field(&event.ephemeris_name());
    let mut s = String::with_capacity(grid.points.len() * 4 * 80);
    s.push_str(GRID_COLUMNS);
    s.push('\n');
    for p in &grid.points {
        let (lat, lon) = (trim_tick(p.latitude_deg), trim_tick(p.longitude_deg));
        for c in Contact::ALL {
            let _ = write!(s, "{lat},{lon},{},", c.number());
            match p.contacts[c.index()] {
                Some(seen) => {
                    let _ = write!(
                        s,
                        "{},{:.3},{}",
                        format_utc(event.label(seen.hours), 2),
                        seen.sun_altitude_deg,
                        seen.sun_up()
                    );
                }
                None => s.push_str(",,false"),
            }
            let _ = writeln!(s, ",{},{ephemeris}", p.seen.name());
        }
    }
    s
}

/// The fill of a region on the map: light to dark and hatched differently, so that the classes
/// stay apart in greyscale print.
fn region_fill(v: Visibility) -> &'static str {
    match v {
        Visibility::Whole => "#fff7d6",
        Visibility::IngressOnly => "url(#seen-ingress)",
        Visibility::EgressOnly => "url(#seen-egress)",
        Visibility::Part => "url(#seen-part)",
        Visibility::None => "#9aa1ad",
    }
}

/// The hatching patterns of the regions seen in part.
const PATTERNS: &str = "<defs>\
<pattern id=\"seen-ingress\" width=\"6\" height=\"6\" patternUnits=\"userSpaceOnUse\" patternTransform=\"rotate(45)\"><rect width=\"6\" height=\"6\" fill=\"#fcd9a5\"/><line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\" stroke=\"#b45309\" stroke-width=\"1.2\"/></pattern>\
<pattern id=\"seen-egress\" width=\"6\" height=\"6\" patternUnits=\"userSpaceOnUse\" patternTransform=\"rotate(-45)\"><rect width=\"6\" height=\"6\" fill=\"#c3dbf0\"/><line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\" stroke=\"#1d4ed8\" stroke-width=\"1.2\"/></pattern>\
<pattern id=\"seen-part\" width=\"5\" height=\"5\" patternUnits=\"userSpaceOnUse\"><rect width=\"5\" height=\"5\" fill=\"#e6d8f3\"/><circle cx=\"2.5\" cy=\"2.5\" r=\"1.1\" fill=\"#6b21a8\"/></pattern>\
</defs>\n";

/// How a contact's lines are drawn: colour and dash pattern ("" for solid).
fn contact_stroke(c: Contact) -> (&'static str, &'static str) {
    match c {
        Contact::I => ("#7c2d12", ""),
        Contact::II => ("#7c2d12", "4 2"),
        Contact::III => ("#1e3a8a", ""),
        Contact::IV => ("#1e3a8a", "4 2"),
    }
}

/// A point in grid coordinates (column, row) on the map, px.
fn grid_to_px(grid: &VisibilityGrid, (column, row): GridXy) -> (f64, f64) {
    let (x, y) = world_px(
        -180.0 + column * grid.step_lon_deg,
        90.0 - row * grid.step_lat_deg,
    );
    (x, y + MAP_TOP)
}

/// A field of the grid with its first column repeated after the last (longitude 180 = -180),
/// so that lines close across the antimeridian.
fn wrapped_field(
    grid: &VisibilityGrid,
    value: impl Fn(usize, usize) -> Option<f64>,
) -> Vec<Option<f64>> {
    let mut values = Vec::with_capacity(grid.rows * (grid.columns + 1));
    for r in 0..grid.rows {
        for c in 0..=grid.columns {
            values.push(value(r, c % grid.columns));
        }
    }
    values
}

/// An SVG path of polylines given in grid coordinates.
fn path_of(grid: &VisibilityGrid, lines: &[Vec<GridXy>], style: &str) -> String {
    let mut d = String::new();
    for line in lines.iter().filter(|l| l.len() >= 2) {
        for (k, &p) in line.iter().enumerate() {
            let (x, y) = grid_to_px(grid, p);
            let _ = write!(d, "{}{x:.1},{y:.1}", if k == 0 { "M" } else { "L" });
        }
    }
    if d.is_empty() {
        return String::new();
    }
    format!("<path d=\"{d}\" fill=\"none\" {style}/>\n")
}

/// The lines where the Sun's centre is on the horizon at contacts I and IV.
fn horizon_lines(grid: &VisibilityGrid) -> String {
    let mut s = String::new();
    for (c, dash) in [(Contact::I, ""), (Contact::IV, " stroke-dasharray=\"7 3\"")] {
        let values = wrapped_field(grid, |r, col| {
            grid.at(r, col).contacts[c.index()].map(|x| x.sun_altitude_deg)
        });
        let field = Field {
            values: &values,
            rows: grid.rows,
            columns: grid.columns + 1,
        };
        let lines = contour_lines(&field, HORIZON_ALTITUDE_DEG);
        s.push_str(&path_of(
            grid,
            &lines,
            &format!("stroke=\"#111827\" stroke-width=\"1.7\"{dash}"),
        ));
    }
    s
}

/// Minutes from midnight UTC (or UT1) of the event's date to each point's contact `c`, where
/// the contact occurs with the Sun up.
fn contact_minutes(event: &TransitEvent, grid: &VisibilityGrid, c: Contact) -> Vec<Option<f64>> {
    let midnight = event.date().and_time(chrono::NaiveTime::MIN);
    wrapped_field(grid, |r, col| {
        grid.at(r, col).contacts[c.index()]
            .filter(|x| x.sun_up())
            .map(|x| (event.label(x.hours) - midnight).num_milliseconds() as f64 / 60_000.0)
    })
}

/// The spacing of the lines of equal time, minutes: the smallest of [`TIME_STEPS_MIN`] that
/// puts at most [`MAX_TIME_LINES`] lines in every contact's range of times (minutes).
pub fn time_step_min(ranges_min: &[(f64, f64)]) -> f64 {
    let lines =
        |step: f64, (lo, hi): (f64, f64)| ((hi / step).floor() - (lo / step).ceil() + 1.0).max(0.0);
    TIME_STEPS_MIN
        .iter()
        .copied()
        .find(|&step| {
            ranges_min
                .iter()
                .all(|&r| lines(step, r) <= MAX_TIME_LINES as f64)
        })
        .unwrap_or(TIME_STEPS_MIN[TIME_STEPS_MIN.len() - 1])
}

/// A time of day from minutes after midnight: `HH:MM`, or `HH:MM:SS` when `seconds`.
pub fn clock_text(minutes: f64, seconds: bool) -> String {
    let total_s = (minutes * 60.0).round().rem_euclid(86_400.0) as u64;
    let (h, m, sec) = (total_s / 3600, total_s / 60 % 60, total_s % 60);
    if seconds {
        format!("{h:02}:{m:02}:{sec:02}")
    } else {
        format!("{h:02}:{m:02}")
    }
}

/// Points along a line (px) at these fractions of its length, where a label may sit.
fn points_along(line: &[(f64, f64)], fractions: &[f64]) -> Vec<(f64, f64)> {
    let lengths: Vec<f64> = line
        .windows(2)
        .map(|w| (w[1].0 - w[0].0).hypot(w[1].1 - w[0].1))
        .collect();
    let total: f64 = lengths.iter().sum();
    fractions
        .iter()
        .filter_map(|f| {
            let mut want = f * total;
            for (k, &len) in lengths.iter().enumerate() {
                if want <= len && len > 0.0 {
                    let t = want / len;
                    let (a, b) = (line[k], line[k + 1]);
                    return Some((a.0 + t * (b.0 - a.0), a.1 + t * (b.1 - a.1)));
                }
                want -= len;
            }
            None
        })
        .collect()
}

/// The lines of equal time of every contact, labelled where a label fits; and the spacing used
/// (minutes).
fn time_lines(
    event: &TransitEvent,
    grid: &VisibilityGrid,
    placer: &mut LabelPlacer,
) -> (String, f64) {
    let fields: Vec<(Contact, Vec<Option<f64>>)> = Contact::ALL
        .iter()
        .map(|&c| (c, contact_minutes(event, grid, c)))
        .collect();
    let ranges: Vec<(f64, f64)> = fields
        .iter()
        .map(|(_, v)| {
            v.iter()
                .flatten()
                .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), &x| {
                    (lo.min(x), hi.max(x))
                })
        })
        .filter(|(lo, hi)| lo <= hi)
        .collect();
    let step = time_step_min(&ranges);
    let (mut lines_svg, mut labels_svg) = (String::new(), String::new());
    for (c, values) in &fields {
        let (colour, dash) = contact_stroke(*c);
        let field = Field {
            values,
            rows: grid.rows,
            columns: grid.columns + 1,
        };
        let (lo, hi) = values
            .iter()
            .flatten()
            .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), &x| {
                (lo.min(x), hi.max(x))
            });
        if lo > hi {
            continue;
        }
        let mut level = (lo / step).ceil() * step;
        while level <= hi {
            let lines = contour_lines(&field, level);
            let style =
                format!("stroke=\"{colour}\" stroke-width=\"1\" stroke-dasharray=\"{dash}\"");
            lines_svg.push_str(&path_of(grid, &lines, &style));
            let text = format!("{} {}", c.roman(), clock_text(level, step < 1.0));
            // The longest piece of the line carries the label, near its middle if there is room.
            let longest = lines
                .iter()
                .map(|l| l.iter().map(|&p| grid_to_px(grid, p)).collect::<Vec<_>>())
                .max_by(|a, b| a.len().cmp(&b.len()));
            if let Some(px_line) = longest {
                let spots = points_along(&px_line, &[0.5, 0.4, 0.6, 0.3, 0.7, 0.2, 0.8, 0.1, 0.9]);
                if let Some((x, y)) = placer.place_centred(&text, LABEL_PX, &spots) {
                    let _ = writeln!(labels_svg, "<text x=\"{x:.1}\" y=\"{y:.1}\" font-size=\"{LABEL_PX}\" fill=\"{colour}\" stroke=\"#ffffff\" stroke-width=\"2.5\" paint-order=\"stroke\">{}</text>", esc(&text));
                }
            }
            level += step;
        }
    }
    lines_svg.push_str(&labels_svg);
    (lines_svg, step)
}

/// The legend below the map; returns its SVG and the height it takes, px.
fn legend(top: f64, step_min: f64, note: &str) -> (String, f64) {
    let mut s = String::from("<g font-size=\"12\" fill=\"#111827\">\n");
    for (k, v) in Visibility::ALL.iter().enumerate() {
        let y = top + LEGEND_ROW_PX * k as f64;
        let _ = writeln!(s, "<rect x=\"10\" y=\"{:.1}\" width=\"20\" height=\"12\" fill=\"{}\" stroke=\"#374151\" stroke-width=\"0.5\"/><text x=\"36\" y=\"{:.1}\">{}</text>", y, region_fill(*v), y + 10.5, esc(v.description()));
    }
    let step_text = if step_min < 1.0 {
        format!("{:.0} s", step_min * 60.0)
    } else {
        format!("{} min", trim_tick(step_min))
    };
    // Each entry: colour, the samples drawn (dash patterns, "" solid), the text.
    let entries: [(&str, &[&str], String); 4] = [
        ("#111827", &[""], "Sun on the horizon at contact I".into()),
        (
            "#111827",
            &["7 3"],
            "Sun on the horizon at contact IV".into(),
        ),
        (
            "#7c2d12",
            &["", "4 2"],
            format!("equal times: I solid, II dashed, every {step_text}"),
        ),
        (
            "#1e3a8a",
            &["", "4 2"],
            format!("equal times: III solid, IV dashed, every {step_text}"),
        ),
    ];
    for (k, (colour, dashes, text)) in entries.iter().enumerate() {
        let y = top + LEGEND_ROW_PX * k as f64 + 6.0;
        let width = if dashes.len() == 1 { 1.7 } else { 1.0 };
        let piece = 32.0 / dashes.len() as f64;
        for (j, dash) in dashes.iter().enumerate() {
            let x0 = 360.0 + piece * j as f64;
            let _ = writeln!(s, "<line x1=\"{x0:.1}\" y1=\"{y:.1}\" x2=\"{:.1}\" y2=\"{y:.1}\" stroke=\"{colour}\" stroke-width=\"{width}\" stroke-dasharray=\"{dash}\"/>", x0 + piece - 5.0);
        }
        let _ = writeln!(
            s,
            "<text x=\"396\" y=\"{:.1}\">{}</text>",
            y + 4.5,
            esc(text)
        );
    }
    s.push_str("</g>\n");
    let (note_svg, after) = wrapped_text(
        note,
        (10.0, top + LEGEND_ROW_PX * 5.0 + 12.0),
        (12.0, 15.0),
        MAP_W - 20.0,
    );
    s.push_str(&note_svg);
    (s, after - top)
}

/// The visibility map of a transit as a self-contained SVG.
pub fn visibility_map_svg(event: &TransitEvent, grid: &VisibilityGrid) -> String {
    let title = format!(
        "Transit of {} {}: where it is seen with the Sun up",
        event.planet.title(),
        event.date()
    );
    let map_area = TextBox {
        x0: 0.0,
        y0: MAP_TOP,
        x1: MAP_W,
        y1: MAP_TOP + MAP_H,
    };
    let mut placer = LabelPlacer::new(map_area);
    for b in graticule_label_boxes(MAP_H) {
        placer.reserve(TextBox {
            y0: b.y0 + MAP_TOP,
            y1: b.y1 + MAP_TOP,
            ..b
        });
    }
    let (lines, step_min) = time_lines(event, grid, &mut placer);
    let note = format!(
        "Times {}. Sun up: the true altitude of its centre at least {} degrees (no refraction), at sea level. Grid every {} degrees; ephemeris {}. Land: Natural Earth 1:110m (public domain).",
        crate::render::text::scale_of(event.label(event.hours_of_greatest())),
        trim_tick(HORIZON_ALTITUDE_DEG),
        trim_tick(grid.step_lat_deg),
        event.ephemeris_name()
    );
    let legend_top = MAP_TOP + MAP_H + 10.0;
    let (legend_svg, legend_h) = legend(legend_top, step_min, &note);
    let height = legend_top + legend_h;
    let mut s = svg_open(MAP_W, height, &title);
    s.push_str(PATTERNS);
    let _ = writeln!(s, "<rect width=\"{MAP_W}\" height=\"{height:.0}\" fill=\"#ffffff\"/><text x=\"10\" y=\"17\" font-size=\"13\" font-weight=\"bold\">{}</text>", esc(&title));
    let _ = writeln!(s, "<g transform=\"translate(0 {MAP_TOP})\">");
    let centres: Vec<(f64, f64)> = grid
        .points
        .iter()
        .map(|p| (p.longitude_deg, p.latitude_deg))
        .collect();
    s.push_str(&grid_cells_svg(
        &centres,
        (grid.step_lon_deg, grid.step_lat_deg),
        |k| Some(region_fill(grid.points[k].seen).to_string()),
    ));
    s.push_str(&land_svg("rgba(31,41,55,0.16)", "#374151", 0.5));
    s.push_str(&graticule_lines("#6b7280"));
    let _ = writeln!(s, "<rect width=\"{MAP_W}\" height=\"{MAP_H}\" fill=\"none\" stroke=\"#374151\" stroke-width=\"0.8\"/>");
    s.push_str("</g>\n");
    s.push_str(&horizon_lines(grid));
    s.push_str(&lines);
    let _ = writeln!(s, "<g transform=\"translate(0 {MAP_TOP})\">");
    s.push_str(&graticule_labels(MAP_H));
    s.push_str("</g>\n");
    s.push_str(&legend_svg);
    s.push_str("</svg>\n");
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_time_step_keeps_few_lines() {
        // Mercury's contacts spread over about two minutes, Venus's over about fifteen.
        assert_eq!(time_step_min(&[(400.2, 402.1)]), 0.5);
        assert_eq!(time_step_min(&[(400.2, 415.1)]), 5.0);
        assert_eq!(time_step_min(&[(400.0, 700.0)]), 60.0);
        assert_eq!(time_step_min(&[]), 0.5);
    }

    #[test]
    fn clock_texts_wrap_at_midnight() {
        assert_eq!(clock_text(401.5, true), "06:41:30");
        assert_eq!(clock_text(401.0, false), "06:41");
        assert_eq!(clock_text(-30.0, false), "23:30");
        assert_eq!(clock_text(1450.0, false), "00:10");
    }

    #[test]
    fn label_spots_lie_on_the_line() {
        let spots = points_along(&[(0.0, 0.0), (10.0, 0.0), (10.0, 10.0)], &[0.5, 0.75, 2.0]);
        assert_eq!(spots, vec![(10.0, 0.0), (10.0, 5.0)]);
    }
}
