//! Charts of a reduction as plain, self-contained SVG (no scripts, no external references):
//! the solar disc with each station's path, the station map, the residuals, and the
//! convergence of the parallax. Every string from an input file is escaped.

use crate::geometry::contacts::{offset_on_plane, Contact};
use crate::geometry::station::Station;
use crate::reduction::Reduction;
use crate::render::labels::{LabelPlacer, TextBox};
use crate::render::svg::{esc, graticule_labels, land_svg, svg_open, ticks, trim_tick};
use crate::sky::constants::{sun_radius_au, ARCSEC_RAD};
use crate::sky::vector::norm;
use std::fmt::Write;

/// Colour for a mean normalised residual: blue (negative) through white to red (positive),
/// saturating at +-2.
pub fn residual_colour(z: f64) -> String {
    let t = (z / 2.0).clamp(-1.0, 1.0);
    let (r, g, b) = if t >= 0.0 {
        (255.0, 255.0 * (1.0 - t), 255.0 * (1.0 - t))
    } else {
        (255.0 * (1.0 + t), 255.0 * (1.0 + t), 255.0)
    };
    format!("#{:02x}{:02x}{:02x}", r as u8, g as u8, b as u8)
}

/// The Sun's apparent semidiameter (arcsec) at greatest transit.
/// The planet's apparent semidiameter at greatest transit, arcsec.
fn planet_semidiameter_arcsec(red: &Reduction) -> f64 {
    let ev = &red.event;
    let p_er = norm(ev.elements.planet_earth_radii(ev.hours_of_greatest()));
    let p_au = p_er / crate::geometry::besselian::earth_radii_per_au();
    (ev.planet.radius_au() / p_au).asin() / ARCSEC_RAD
}

fn sun_semidiameter_arcsec(red: &Reduction) -> f64 {
    let ev = &red.event;
    let s_er = norm(ev.elements.sun_earth_radii(ev.hours_of_greatest()));
    let s_au = s_er / crate::geometry::besselian::earth_radii_per_au();
    (sun_radius_au() / s_au).asin() / ARCSEC_RAD
}

/// The parallax exaggeration used by [`solar_disc_svg`].
pub fn disc_exaggeration(red: &Reduction) -> f64 {
    let (_, max_disp) = station_paths(red, 1.0);
    let target = 0.12 * sun_semidiameter_arcsec(red);
    let raw = if max_disp > 0.0 {
        target / max_disp
    } else {
        1.0
    };
    [1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0]
        .iter()
        .copied()
        .rfind(|f| *f <= raw.max(1.0))
        .unwrap_or(1.0)
}

type Path = Vec<(f64, f64)>;

/// A drawn path: name, points (arcsec east, north) and contact points (contact, east, north).
type NamedPath = (String, Path, Vec<(u8, f64, f64)>);

/// Geocentric path and each station's path (arcsec east, north of the Sun's centre), with the
/// station's displacement from the geocentric path multiplied by `factor`; and the largest
/// true displacement (arcsec).
fn station_paths(red: &Reduction, factor: f64) -> (Vec<NamedPath>, f64) {
    let ev = &red.event;
    let p = red.perturbation();
    let k = 1.0 / (ev.earth_radii_per_arcsec() * p.length_scale);
    let h0 = ev.geocentric_hours[0].unwrap_or(-3.0) - 0.3;
    let h1 = ev.geocentric_hours[3].unwrap_or(3.0) + 0.3;
    let n = 60;
    let at = |h: f64, st: Option<&crate::geometry::station::GeocentricStation>| {
        let (u, v) = offset_on_plane(&ev.elements, st, h, &p);
        (u * k, v * k)
    };
    let mut out = Vec::new();
    let mut max_disp: f64 = 0.0;
    let geo_path: Path = (0..=n)
        .map(|i| at(h0 + (h1 - h0) * i as f64 / n as f64, None))
        .collect();
    out.push(("geocentre".to_string(), geo_path, Vec::new()));
    let drawn = red.stations.iter().filter(|s| s.not_used.is_none());
    for s in drawn.take(DISC_STATIONS_MAX) {
        let Ok(st) = Station::new(&s.station, s.latitude_deg, s.longitude_deg, s.elevation_m)
        else {
            continue;
        };
        let geo = st.geocentric();
        let mut path = Vec::with_capacity(n + 1);
        for i in 0..=n {
            let h = h0 + (h1 - h0) * i as f64 / n as f64;
            let g = at(h, None);
            let t = at(h, Some(&geo));
            max_disp = max_disp.max(((t.0 - g.0).powi(2) + (t.1 - g.1).powi(2)).sqrt());
            path.push((g.0 + factor * (t.0 - g.0), g.1 + factor * (t.1 - g.1)));
        }
        let mut points = Vec::new();
        for (c, _r) in s.contacts.iter().zip(&s.residuals_s) {
            let Some(contact) = Contact::parse(&c.to_string()) else {
                continue;
            };
            if let Some(h) = ev.contact_hours_perturbed(&geo, contact, &p) {
                let g = at(h, None);
                let t = at(h, Some(&geo));
                points.push((*c, g.0 + factor * (t.0 - g.0), g.1 + factor * (t.1 - g.1)));
            }
        }
        out.push((s.station.clone(), path, points));
    }
    (out, max_disp)
}

/// Most station paths drawn on the solar disc (those with the largest shares).
pub const DISC_STATIONS_MAX: usize = 40;
/// Most stations drawn on the map (by share; stations with no timing used after them).
pub const MAP_STATIONS_MAX: usize = 2000;
/// Most timings drawn per contact on the residual chart (an even sample beyond it), and most
/// rejected timings marked per contact.
pub const RESIDUALS_PER_CONTACT_MAX: usize = 400;
/// See [`RESIDUALS_PER_CONTACT_MAX`].
pub const REJECTED_PER_CONTACT_MAX: usize = 100;

/// Every k-th item of a list so that at most `max` are kept, in order.
fn thin<T>(items: Vec<T>, max: usize) -> Vec<T> {
    if items.len() <= max || max == 0 {
        return items;
    }
    let step = items.len().div_ceil(max);
    items.into_iter().step_by(step).collect()
}

/// A sentence saying what a chart leaves out, or nothing when it shows everything.
pub fn sampling_note(red: &Reduction) -> Option<String> {
    let stations = red.stations.len();
    let used = red.used.len();
    let big = stations > DISC_STATIONS_MAX
        || stations > MAP_STATIONS_MAX
        || Contact::ALL.iter().any(|c| {
            red.used.iter().filter(|u| u.contact == c.number()).count() > RESIDUALS_PER_CONTACT_MAX
        });
    big.then(|| format!(
        "This campaign is large ({stations} stations, {used} timings used), so the charts show a part of it: the solar disc the {} stations with the largest shares of the information, the map at most {MAP_STATIONS_MAX} stations, the residual chart an even sample of at most {RESIDUALS_PER_CONTACT_MAX} timings and {REJECTED_PER_CONTACT_MAX} rejected ones per contact. The JSON and CSV outputs of reduce list every station and timing.",
        DISC_STATIONS_MAX.min(stations)
    ))
}

/// The solar disc with the geocentric path, each station's path (parallax displacement
/// exaggerated by [`disc_exaggeration`]) and the contact points. North up, east left, as the
/// Sun is seen in the sky.
pub fn solar_disc_svg(red: &Reduction) -> String {
    let size = 640.0;
    let c = size / 2.0;
    let r_px = 260.0;
    let sd = sun_semidiameter_arcsec(red);
    let scale = r_px / sd;
    let factor = disc_exaggeration(red);
    let (paths, _) = station_paths(red, factor);
    let mut s = svg_open(
        size,
        size + 52.0,
        "Solar disc with the planet's path from each station",
    );
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    let _ = writeln!(s, "<defs><clipPath id=\"disc-area\"><rect x=\"0\" y=\"0\" width=\"{size}\" height=\"{size}\"/></clipPath></defs>");
    let _ = writeln!(s, "<circle cx=\"{c}\" cy=\"{c}\" r=\"{r_px}\" fill=\"#fde9a9\" stroke=\"#c88a12\" stroke-width=\"1.5\"/>");
    let _ = writeln!(s, "<text x=\"{c}\" y=\"16\" text-anchor=\"middle\">N</text><text x=\"12\" y=\"{}\" text-anchor=\"middle\">E</text><text x=\"{}\" y=\"{}\" text-anchor=\"middle\">W</text>", c + 4.0, size - 12.0, c + 4.0);
    let xy = |e: f64, n: f64| (c - e * scale, c - n * scale);
    let _ = writeln!(s, "<g clip-path=\"url(#disc-area)\" fill=\"none\">");
    let mut placed: Vec<(f64, f64)> = Vec::new();
    for (i, (name, path, points)) in paths.iter().enumerate() {
        let d: Vec<String> = path
            .iter()
            .map(|&(e, n)| {
                let (x, y) = xy(e, n);
                format!("{x:.1},{y:.1}")
            })
            .collect();
        let (stroke, width) = if i == 0 {
            ("#000000", 2.0)
        } else {
            ("#2b6cb0", 0.8)
        };
        let _ = writeln!(s, "<polyline points=\"{}\" stroke=\"{stroke}\" stroke-width=\"{width}\"><title>{}</title></polyline>", d.join(" "), esc(name));
        for (cn, e, n) in points {
            let (x, y) = xy(*e, *n);
            let _ = writeln!(s, "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"2.5\" fill=\"#c53030\"><title>{} contact {}</title></circle>", esc(name), cn);
        }
        if i > 0 {
            // Number the path where it is closest to the disc's centre, and only where no
            // other number is within 12 px (they crowd at ingress and egress otherwise).
            let closest = path
                .iter()
                .copied()
                .min_by(|a, b| (a.0 * a.0 + a.1 * a.1).total_cmp(&(b.0 * b.0 + b.1 * b.1)));
            if let Some((e, n)) = closest {
                let (x, y) = xy(e, n);
                let (lx, ly) = (x + 3.0, y - 3.0 - 9.0 * (i % 3) as f64);
                if placed
                    .iter()
                    .all(|&(px, py): &(f64, f64)| (px - lx).hypot(py - ly) > 12.0)
                {
                    placed.push((lx, ly));
                    let _ = writeln!(
                        s,
                        "<text x=\"{lx:.1}\" y=\"{ly:.1}\" font-size=\"9\" fill=\"#2b6cb0\">{i}</text>"
                    );
                }
            }
        }
    }
    let _ = writeln!(s, "</g>");
    s.push_str(&disc_scale(red, (c, size), scale));
    let caption = [
        "Black: the geocentric path. Blue: each station's path, numbered as in the station table,",
        &format!("its parallax displacement drawn {factor:.0} times larger than it is, so the red contact dots"),
        "lie off the limb by the same factor. The planet is drawn to scale at greatest transit.",
    ];
    for (k, line) in caption.iter().enumerate() {
        let _ = writeln!(
            s,
            "<text x=\"10\" y=\"{}\">{}</text>",
            size + 14.0 + 14.0 * k as f64,
            esc(line)
        );
    }
    s.push_str("</svg>\n");
    s
}

/// The planet's disc to scale at the geocentric greatest-transit point, and a scale bar of
/// 100 arcsec.
fn disc_scale(red: &Reduction, (c, size): (f64, f64), scale: f64) -> String {
    let ev = &red.event;
    let p = red.perturbation();
    let k = 1.0 / (ev.earth_radii_per_arcsec() * p.length_scale);
    let (u, v) = offset_on_plane(&ev.elements, None, ev.hours_of_greatest(), &p);
    let (x, y) = (c - u * k * scale, c - v * k * scale);
    let r = planet_semidiameter_arcsec(red) * scale;
    let bar = 100.0 * scale;
    format!(
        "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"{r:.2}\" fill=\"#111827\"><title>{} to scale at greatest transit</title></circle>\n<g stroke=\"#374151\" stroke-width=\"1.5\"><line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\"/></g><text x=\"{:.1}\" y=\"{:.1}\" text-anchor=\"middle\" font-size=\"10\">100\"</text>\n",
        ev.planet,
        size - 20.0 - bar,
        size - 24.0,
        size - 20.0,
        size - 24.0,
        size - 20.0 - bar / 2.0,
        size - 28.0
    )
}

/// A world map (equirectangular) with each station: marker area by its information share,
/// colour by its mean normalised residual. Land outlines: Natural Earth 1:110m (public domain).
pub fn station_map_svg(red: &Reduction) -> String {
    let (w, h) = (720.0, 360.0);
    let px = |lon: f64, lat: f64| ((lon + 180.0) * 2.0, (90.0 - lat) * 2.0);
    let mut s = svg_open(w, h + 80.0, "World map of the stations");
    let _ = writeln!(s, "<rect width=\"{w}\" height=\"{h}\" fill=\"#dbeafe\"/>");
    s.push_str(&land_svg("#e7e2d3", "#9c9581", 0.4));
    let _ = writeln!(s, "<g stroke=\"#94a3b8\" stroke-width=\"0.3\">");
    for lat in [-60.0, -30.0, 0.0, 30.0, 60.0] {
        let (_, y) = px(0.0, lat);
        let _ = writeln!(s, "<line x1=\"0\" y1=\"{y}\" x2=\"{w}\" y2=\"{y}\"/>");
    }
    for lon in [-120.0, -60.0, 0.0, 60.0, 120.0] {
        let (x, _) = px(lon, 0.0);
        let _ = writeln!(s, "<line x1=\"{x}\" y1=\"0\" x2=\"{x}\" y2=\"{h}\"/>");
    }
    let _ = writeln!(s, "</g>");
    s.push_str(&graticule_labels(h));
    // Markers near the frame are cut at it, as on any map.
    let _ = writeln!(s, "<defs><clipPath id=\"map-frame\"><rect width=\"{w}\" height=\"{h}\"/></clipPath></defs>\n<g clip-path=\"url(#map-frame)\">");
    for (i, st) in red.stations.iter().enumerate().take(MAP_STATIONS_MAX) {
        let (x, y) = px(st.longitude_deg, st.latitude_deg);
        if let Some(why) = &st.not_used {
            let _ = writeln!(
                s,
                "<g class=\"not-used\" stroke=\"#b91c1c\" stroke-width=\"1.6\"><line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\"/><line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\"/><title>{} (#{}): not used: {}</title></g>",
                x - 4.0, y - 4.0, x + 4.0, y + 4.0, x - 4.0, y + 4.0, x + 4.0, y - 4.0,
                esc(&st.station),
                i + 1,
                esc(why)
            );
            continue;
        }
        let r = 2.5 + 30.0 * st.information_share.max(0.0).sqrt();
        let _ = writeln!(
            s,
            "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"{r:.1}\" fill=\"{}\" fill-opacity=\"0.85\" stroke=\"#1f2937\" stroke-width=\"0.6\"><title>{} (#{}): share {:.3}, mean z {:+.2}</title></circle>",
            residual_colour(st.mean_normalised_residual),
            esc(&st.station),
            i + 1,
            st.information_share,
            st.mean_normalised_residual
        );
    }
    s.push_str("</g>\n");
    let legend_y = h + 18.0;
    for (k, z) in [-2.0, -1.0, 0.0, 1.0, 2.0].iter().enumerate() {
        let x = 10.0 + 28.0 * k as f64;
        let _ = writeln!(s, "<rect x=\"{x}\" y=\"{}\" width=\"26\" height=\"10\" fill=\"{}\" stroke=\"#1f2937\" stroke-width=\"0.3\"/><text x=\"{}\" y=\"{}\" text-anchor=\"middle\" font-size=\"9\">{z:+.0}</text>", legend_y - 10.0, residual_colour(*z), x + 13.0, legend_y + 10.0);
    }
    let _ = writeln!(s, "<text x=\"160\" y=\"{legend_y}\">Colour: mean (O - C)/sigma of the station's timings. Area: share of the information on the parallax.</text>");
    let _ = writeln!(s, "<text x=\"160\" y=\"{}\" font-size=\"9\">Red cross: a station none of whose timings was used. Land: Natural Earth 1:110m (public domain).</text>", legend_y + 14.0);
    // Size key: marker areas for three shares of the information.
    let key_y = legend_y + 34.0;
    let _ = writeln!(
        s,
        "<text x=\"10\" y=\"{}\" font-size=\"10\">Share of the information:</text>",
        key_y + 4.0
    );
    for (k, share) in [0.01f64, 0.05, 0.2].iter().enumerate() {
        let x = 190.0 + 90.0 * k as f64;
        let r = 2.5 + 30.0 * share.sqrt();
        let _ = writeln!(s, "<circle cx=\"{x}\" cy=\"{key_y}\" r=\"{r:.1}\" fill=\"#e5e7eb\" stroke=\"#1f2937\" stroke-width=\"0.6\"/><text x=\"{:.1}\" y=\"{:.1}\" font-size=\"10\">{:.0} %</text>", x + r + 4.0, key_y + 4.0, 100.0 * share);
    }
    s.push_str("</svg>\n");
    s
}

/// A rejected timing on the residual chart: a cross, or a triangle at the edge pointing off
/// the scale, with its number from the table of rows not used where the number fits.
fn rejected_mark(
    r: &crate::observations::timings::Rejected,
    number: usize,
    (x, y): (f64, f64),
    off_scale: bool,
    placer: &mut LabelPlacer,
) -> String {
    let v = r.o_c_s.unwrap_or(0.0);
    let up = if v > 0.0 { 1.0 } else { -1.0 };
    let (mark, centre) = if off_scale {
        (
            format!(
                "<path d=\"M{x:.1},{y:.1} l-4,{:.1} l8,0 z\" fill=\"#dc2626\"/>",
                7.0 * up
            ),
            (x, y + 3.5 * up),
        )
    } else {
        (
            format!("<path d=\"M{:.1},{:.1} l6,6 M{:.1},{:.1} l6,-6\" stroke=\"#dc2626\" stroke-width=\"1.6\"/>", x - 3.0, y - 3.0, x - 3.0, y + 3.0),
            (x, y),
        )
    };
    let number = number.to_string();
    let label = placer
        .place(&number, 9.0, centre, 4.0)
        .map(|(lx, ly)| format!("<text x=\"{lx:.1}\" y=\"{ly:.1}\" font-size=\"9\" fill=\"#dc2626\">{number}</text>"))
        .unwrap_or_default();
    format!(
        "<g><title>not used, {} line {}: O - C {v:+.1} s; {}</title>{mark}{label}</g>\n",
        esc(&r.station),
        r.line,
        esc(r.diagnosis.as_deref().unwrap_or(""))
    )
}

/// O - C of every timing with its error bar, grouped by contact; rejected timings marked (off
/// the scale: a triangle at the edge) and numbered as in the table of rows not used.
pub fn residuals_svg(red: &Reduction) -> String {
    let (w, h) = (720.0, 360.0);
    let (left, right, top, bottom) = (60.0, 10.0, 20.0, 40.0);
    let ymax = red
        .used
        .iter()
        .map(|u| u.o_c_s.abs() + u.sigma_s)
        .fold(10.0, f64::max)
        * 1.15;
    let y_of = |v: f64| top + (h - top - bottom) * (0.5 - v.clamp(-ymax, ymax) / (2.0 * ymax));
    let group_w = (w - left - right) / 4.0;
    let mut s = svg_open(w, h, "Residuals O - C by contact");
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    for t in ticks(-ymax, ymax, 8) {
        let y = y_of(t);
        let _ = writeln!(s, "<line x1=\"{left}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"#e5e7eb\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\">{t}</text>", w - right, left - 5.0, y + 4.0);
    }
    let _ = writeln!(s, "<text x=\"14\" y=\"{}\" transform=\"rotate(-90 14 {})\" text-anchor=\"middle\">O - C (s)</text>", h / 2.0, h / 2.0);
    for (g, c) in Contact::ALL.iter().enumerate() {
        let x0 = left + group_w * g as f64;
        let _ = writeln!(s, "<line x1=\"{x0:.1}\" y1=\"{top}\" x2=\"{x0:.1}\" y2=\"{}\" stroke=\"#9ca3af\"/><text x=\"{:.1}\" y=\"{}\" text-anchor=\"middle\">contact {}</text>", h - bottom, x0 + group_w / 2.0, h - bottom + 18.0, c.roman());
        let rows: Vec<_> = red
            .used
            .iter()
            .filter(|u| u.contact == c.number())
            .collect();
        let rows = thin(rows, RESIDUALS_PER_CONTACT_MAX);
        let rej: Vec<(usize, &crate::observations::timings::Rejected)> = red
            .rejected
            .iter()
            .enumerate()
            .filter(|(_, r)| r.contact == Some(c.number()) && r.o_c_s.is_some())
            .collect();
        let rej = thin(rej, REJECTED_PER_CONTACT_MAX);
        // Used and rejected timings side by side in the order of the file.
        let mut order: Vec<u64> = rows
            .iter()
            .map(|u| u.line)
            .chain(rej.iter().map(|(_, r)| r.line))
            .collect();
        order.sort_unstable();
        let n = order.len().max(1) as f64;
        let x_at =
            |line: u64| x0 + group_w * (order.partition_point(|&l| l < line) as f64 + 0.5) / n;
        for u in &rows {
            let x = x_at(u.line);
            let _ = writeln!(
                s,
                "<g><title>{} line {}: O - C {:+.1} s, sigma {:.1} s</title><line x1=\"{x:.1}\" y1=\"{:.1}\" x2=\"{x:.1}\" y2=\"{:.1}\" stroke=\"#6b7280\"/><circle cx=\"{x:.1}\" cy=\"{:.1}\" r=\"2.2\" fill=\"#1d4ed8\"/></g>",
                esc(&u.station), u.line, u.o_c_s, u.sigma_s, y_of(u.o_c_s - u.sigma_s), y_of(u.o_c_s + u.sigma_s), y_of(u.o_c_s)
            );
        }
        let mut placer = LabelPlacer::new(TextBox {
            x0: x0 + 1.0,
            y0: top,
            x1: x0 + group_w - 1.0,
            y1: h - bottom,
        });
        for (idx, r) in &rej {
            let v = r.o_c_s.unwrap_or(0.0);
            let at = (x_at(r.line), y_of(v));
            s.push_str(&rejected_mark(r, *idx + 1, at, v.abs() > ymax, &mut placer));
        }
    }
    s.push_str("</svg>\n");
    s
}

/// The convergence chart's one-sigma band and the parallax's line.
fn convergence_band(
    pts: &[crate::reduction::ConvergencePoint],
    x_of: &dyn Fn(f64) -> f64,
    y_of: &dyn Fn(f64) -> f64,
) -> String {
    let mut s = String::new();
    let points = |it: &mut dyn Iterator<Item = &crate::reduction::ConvergencePoint>,
                  value: &dyn Fn(&crate::reduction::ConvergencePoint) -> f64| {
        it.map(|p| format!("{:.1},{:.1}", x_of(p.timings as f64), y_of(value(p))))
            .collect::<Vec<String>>()
    };
    let upper = points(&mut pts.iter(), &|p| p.parallax_arcsec + p.sigma_arcsec);
    let lower = points(&mut pts.iter().rev(), &|p| {
        p.parallax_arcsec - p.sigma_arcsec
    });
    let _ = writeln!(
        s,
        "<polygon points=\"{} {}\" fill=\"#bfdbfe\" stroke=\"none\"/>",
        upper.join(" "),
        lower.join(" ")
    );
    let line = points(&mut pts.iter(), &|p| p.parallax_arcsec);
    let _ = writeln!(
        s,
        "<polyline points=\"{}\" fill=\"none\" stroke=\"#1d4ed8\" stroke-width=\"1.8\"/>",
        line.join(" ")
    );
    s
}

/// The parallax and its uncertainty as timings are added in the order of the file.
pub fn convergence_svg(red: &Reduction) -> String {
    let (w, h) = (720.0, 300.0);
    let (left, right, top, bottom) = (70.0, 20.0, 20.0, 40.0);
    let mut s = svg_open(w, h, "Convergence of the solar parallax");
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    let pts = &red.convergence;
    let Some(last) = pts.last() else {
        let _ = writeln!(s, "<text x=\"20\" y=\"40\">Too few timings to follow the solution as they are added.</text></svg>");
        return s;
    };
    let final_pi = red.parallax_arcsec.unwrap_or(last.parallax_arcsec);
    let spread = pts
        .iter()
        .map(|p| (p.parallax_arcsec - final_pi).abs() + p.sigma_arcsec)
        .fold(0.05, f64::max);
    let (ylo, yhi) = (final_pi - spread * 1.1, final_pi + spread * 1.1);
    let nmax = last.timings as f64;
    let x_of = |n: f64| left + (w - left - right) * n / nmax;
    let y_of = |v: f64| top + (h - top - bottom) * (yhi - v.clamp(ylo, yhi)) / (yhi - ylo);
    for t in ticks(ylo, yhi, 6) {
        let y = y_of(t);
        let _ = writeln!(s, "<line x1=\"{left}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"#e5e7eb\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\">{}</text>", w - right, left - 5.0, y + 4.0, trim_tick(t));
    }
    for t in ticks(0.0, nmax, 8) {
        let x = x_of(t);
        let _ = writeln!(
            s,
            "<text x=\"{x:.1}\" y=\"{}\" text-anchor=\"middle\">{t}</text>",
            h - bottom + 16.0
        );
    }
    let _ = writeln!(s, "<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">timings in the solution (file order)</text>", (left + w - right) / 2.0, h - 6.0);
    let _ = writeln!(s, "<text x=\"14\" y=\"{}\" transform=\"rotate(-90 14 {})\" text-anchor=\"middle\">solar parallax (arcsec)</text>", h / 2.0, h / 2.0);
    s.push_str(&convergence_band(pts, &x_of, &y_of));
    let y = y_of(crate::sky::constants::nominal_parallax_arcsec());
    let _ = writeln!(s, "<line x1=\"{left}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"#16a34a\" stroke-dasharray=\"5,4\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\" fill=\"#16a34a\">IAU 2009 value 8.794143\"</text>", w - right, w - right - 4.0, y - 4.0);
    s.push_str("</svg>\n");
    s
}
