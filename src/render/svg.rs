//! SVG basics every chart shares: escaping, the opening of a self-contained SVG, round tick
//! values and the land outlines (Natural Earth 1:110m, public domain).

use std::fmt::Write;

/// Escape text for XML and HTML (element content and quoted attributes).
pub fn esc(text: &str) -> String {
    escape(text, true)
}

/// Plain text escaped for an element's content (`&`, `<`, `>`; quotes and apostrophes, which
/// only an attribute value needs escaped, kept as they are).
pub fn esc_text(text: &str) -> String {
    escape(text, false)
}

/// `&`, `<`, `>` (and with `quotes` `"` and `'`) as entities; control characters other than
/// newline and tab as spaces.
fn escape(text: &str, quotes: bool) -> String {
    let mut s = String::with_capacity(text.len());
    for ch in text.chars() {
        match ch {
            '&' => s.push_str("&amp;"),
            '<' => s.push_str("&lt;"),
            '>' => s.push_str("&gt;"),
            '"' if quotes => s.push_str("&quot;"),
            '\'' if quotes => s.push_str("&#39;"),
            c if (c as u32) < 0x20 && c != '\n' && c != '\t' => s.push(' '),
            c => s.push(c),
        }
    }
    s
}

/// The opening tag of a self-contained SVG of that size, labelled for screen readers.
pub fn svg_open(width: f64, height: f64, label: &str) -> String {
    svg_open_text(width, height, label, 11.0)
}

/// [`svg_open`] with the text's size (px of the view box) for every text that sets none.
pub fn svg_open_text(width: f64, height: f64, label: &str, font_px: f64) -> String {
    format!(
        "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{width:.0}\" height=\"{height:.0}\" viewBox=\"0 0 {width:.0} {height:.0}\" role=\"img\" aria-label=\"{}\" font-family=\"sans-serif\" font-size=\"{font_px}\">\n",
        esc(label)
    )
}

/// "Nice" tick values covering [lo, hi].
pub fn ticks(lo: f64, hi: f64, target: usize) -> Vec<f64> {
    let span = (hi - lo).abs().max(1e-12);
    let raw = span / target.max(1) as f64;
    let mag = 10f64.powf(raw.log10().floor());
    let step = [1.0, 2.0, 5.0, 10.0]
        .iter()
        .map(|m| m * mag)
        .find(|s| *s >= raw)
        .unwrap_or(10.0 * mag);
    let start = (lo / step).ceil() * step;
    let mut out = Vec::new();
    let mut v = start;
    while v <= hi + 1e-9 * span && out.len() < 50 {
        out.push(if v.abs() < 1e-12 * span { 0.0 } else { v });
        v += step;
    }
    out
}

/// The land outlines as rings of (longitude, latitude) in degrees (Natural Earth 1:110m,
/// public domain; converted by tools/convert_land.py).
pub fn land_rings() -> impl Iterator<Item = Vec<(f64, f64)>> {
    const LAND: &str = include_str!("../data/land_110m.txt");
    LAND.lines()
        .filter(|l| !l.starts_with('#') && !l.trim().is_empty())
        .flat_map(|line| {
            let ring: Vec<(f64, f64)> = line
                .split_whitespace()
                .filter_map(|p| {
                    let (a, b) = p.split_once(',')?;
                    Some((a.parse().ok()?, b.parse().ok()?))
                })
                .collect();
            // Rings that cross the antimeridian are cut there, so that no edge spans the map.
            let mut parts: Vec<Vec<(f64, f64)>> = vec![Vec::new()];
            for (k, &p) in ring.iter().enumerate() {
                if k > 0 && (p.0 - ring[k - 1].0).abs() > 180.0 {
                    parts.push(Vec::new());
                }
                if let Some(last) = parts.last_mut() {
                    last.push(p);
                }
            }
            parts.into_iter().filter(|r| r.len() >= 3)
        })
}

/// Land outlines as an SVG group on the 720 x 360 equirectangular frame (2 px per degree).
pub fn land_svg(fill: &str, stroke: &str, width: f64) -> String {
    let mut s = format!("<g fill=\"{fill}\" stroke=\"{stroke}\" stroke-width=\"{width}\">\n");
    for ring in land_rings() {
        let pts: Vec<String> = ring
            .iter()
            .map(|&(lon, lat)| {
                let (x, y) = world_px(lon, lat);
                format!("{x:.1},{y:.1}")
            })
            .collect();
        let _ = writeln!(s, "<polygon points=\"{}\"/>", pts.join(" "));
    }
    s.push_str("</g>\n");
    s
}

/// Pixels per degree of the equirectangular world frame every map shares (720 x 360).
pub const PX_PER_DEG: f64 = 2.0;

/// A longitude and latitude (degrees) on the 720 x 360 equirectangular frame, in pixels from
/// its top left corner (plate carree: x proportional to longitude, y to latitude).
pub fn world_px(longitude_deg: f64, latitude_deg: f64) -> (f64, f64) {
    (
        (longitude_deg + 180.0) * PX_PER_DEG,
        (90.0 - latitude_deg) * PX_PER_DEG,
    )
}

/// Grid cells on the world frame as rectangles, the cells of one row of latitude that share a
/// fill merged into one run. `cells` are the cells' centres (longitude, latitude) in degrees,
/// row by row; `step_deg` their (longitude, latitude) size; `fill_of(k)` the fill of cell k
/// (`None`: not drawn). Cells are clipped to the frame.
pub fn grid_cells_svg(
    cells: &[(f64, f64)],
    (step_lon_deg, step_lat_deg): (f64, f64),
    fill_of: impl Fn(usize) -> Option<String>,
) -> String {
    let mut s = String::new();
    let mut i = 0;
    while i < cells.len() {
        let fill = fill_of(i);
        let mut j = i + 1;
        while j < cells.len() && cells[j].1 == cells[i].1 && fill_of(j) == fill {
            j += 1;
        }
        if let Some(fill) = fill {
            let lat = cells[i].1;
            let (x0, y0) = world_px(
                (cells[i].0 - step_lon_deg / 2.0).max(-180.0),
                (lat + step_lat_deg / 2.0).min(90.0),
            );
            let (x1, y1) = world_px(
                (cells[j - 1].0 + step_lon_deg / 2.0).min(180.0),
                (lat - step_lat_deg / 2.0).max(-90.0),
            );
            let _ = writeln!(
                s,
                "<rect x=\"{x0:.1}\" y=\"{y0:.1}\" width=\"{:.1}\" height=\"{:.1}\" fill=\"{fill}\"/>",
                x1 - x0,
                y1 - y0
            );
        }
        i = j;
    }
    s
}

/// Lines of latitude and longitude every 30 degrees on the world frame.
pub fn graticule_lines(stroke: &str) -> String {
    let mut s = format!("<g stroke=\"{stroke}\" stroke-width=\"0.4\" fill=\"none\">");
    for lat in (-60..=60).step_by(30) {
        let (_, y) = world_px(0.0, f64::from(lat));
        let _ = write!(s, "<line x1=\"0\" y1=\"{y:.1}\" x2=\"720\" y2=\"{y:.1}\"/>");
    }
    for lon in (-150..=150).step_by(30) {
        let (x, _) = world_px(f64::from(lon), 0.0);
        let _ = write!(s, "<line x1=\"{x:.1}\" y1=\"0\" x2=\"{x:.1}\" y2=\"360\"/>");
    }
    s.push_str("</g>\n");
    s
}

/// The boxes of the labels [`graticule_labels`] writes, for keeping other labels off them.
pub fn graticule_label_boxes(h: f64) -> Vec<crate::render::labels::TextBox> {
    use crate::render::labels::TextBox;
    let mut boxes: Vec<TextBox> = [-60i32, -30, 0, 30, 60]
        .iter()
        .map(|&lat| TextBox::of_text("60°N", 9.0, (3.0, f64::from(90 - lat) * 2.0 - 2.0)))
        .collect();
    for lon in [-120i32, -60, 0, 60, 120] {
        let x = f64::from(lon + 180) * 2.0;
        boxes.push(TextBox::of_text("120°W", 9.0, (x + 2.0, h - 3.0)));
    }
    boxes
}

/// A tick value without needless decimals (`148`, `148.5`, not `148.000`).
pub fn trim_tick(t: f64) -> String {
    let s = format!("{t:.6}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    if s == "-0" {
        "0".into()
    } else {
        s.to_string()
    }
}

/// Latitude labels at the left edge and longitude labels along the bottom of the 2 px per
/// degree equirectangular frame.
pub fn graticule_labels(h: f64) -> String {
    graticule_labels_sized(h, 12.0)
}

/// [`graticule_labels`] at `font_px`.
pub fn graticule_labels_sized(h: f64, font_px: f64) -> String {
    let mut s = format!("<g font-size=\"{font_px}\" fill=\"#475569\">");
    for lat in [-60i32, -30, 0, 30, 60] {
        let y = f64::from(90 - lat) * 2.0;
        let label = match lat.cmp(&0) {
            std::cmp::Ordering::Less => format!("{}°S", -lat),
            std::cmp::Ordering::Greater => format!("{lat}°N"),
            std::cmp::Ordering::Equal => "0°".into(),
        };
        let _ = write!(s, "<text x=\"3\" y=\"{:.1}\">{label}</text>", y - 2.0);
    }
    for lon in [-120i32, -60, 0, 60, 120] {
        let x = f64::from(lon + 180) * 2.0;
        let label = match lon.cmp(&0) {
            std::cmp::Ordering::Less => format!("{}°W", -lon),
            std::cmp::Ordering::Greater => format!("{lon}°E"),
            std::cmp::Ordering::Equal => "0°".into(),
        };
        let _ = write!(
            s,
            "<text x=\"{:.1}\" y=\"{:.1}\">{label}</text>",
            x + 2.0,
            h - 3.0
        );
    }
    s.push_str("</g>\n");
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn escaping_neutralises_markup() {
        assert_eq!(
            esc("<script>\"x\" & 'y'</script>"),
            "&lt;script&gt;&quot;x&quot; &amp; &#39;y&#39;&lt;/script&gt;"
        );
    }

    #[test]
    fn tick_labels_have_no_needless_decimals() {
        assert_eq!(trim_tick(12.0), "12");
        assert_eq!(trim_tick(8.85), "8.85");
        assert_eq!(trim_tick(-0.0), "0");
    }

    #[test]
    fn ticks_are_round_numbers() {
        assert_eq!(ticks(0.0, 10.0, 5), vec![0.0, 2.0, 4.0, 6.0, 8.0, 10.0]);
        assert!(ticks(-37.0, 37.0, 8).contains(&0.0));
    }

    #[test]
    fn land_outlines_load() {
        assert!(land_rings().count() > 100);
    }
}
