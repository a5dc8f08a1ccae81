//! The solar disc of a reduction: the geocentric path, each station's path (its parallax
//! displacement exaggerated) with its contacts, the planet to scale, and every path numbered
//! as in the station table. The numbers stand off the band the paths make, each joined to its
//! own path by a leader line perpendicular to the band (so no two leaders cross), placed by
//! [`LabelPlacer`] clear of one another, of the leaders, of the compass letters and of the
//! planet's disc.

use crate::geometry::contacts::{offset_on_plane, Contact};
use crate::geometry::station::{GeocentricStation, Station};
use crate::reduction::Reduction;
use crate::render::axes::TEXT_PX;
use crate::render::labels::{LabelPlacer, TextBox};
use crate::render::svg::{esc, svg_open_text};
use crate::sky::constants::{sun_radius_au, ARCSEC_RAD};
use crate::sky::vector::norm;
use std::fmt::Write;

/// Most station paths drawn on the solar disc (those with the largest shares).
pub const DISC_STATIONS_MAX: usize = 40;

/// Colours of the stations' paths, in turn across the band (neighbours differ); each dark
/// enough for its number to be read on white (contrast above 4.5).
const PATH_COLOURS: [&str; 6] = [
    "#1d4ed8", "#9a3412", "#047857", "#9d174d", "#6d28d9", "#0e7490",
];

/// The drawn chart and what its caption and key need.
pub struct DiscChart {
    /// The SVG.
    pub svg: String,
    /// Each drawn path's number (its row in the station table) and station, in that order.
    pub key: Vec<(usize, String)>,
    /// How many times larger than it is each station's displacement is drawn.
    pub exaggeration: f64,
    /// Paths drawn without a number (no room was found; none in the tests' campaigns).
    pub unnumbered: usize,
}

/// A point in chart pixels.
type Px = (f64, f64);

/// One station's path: its number, name, points (arcsec east, north of the Sun's centre, at
/// the geocentric path's times) and contacts (contact, east, north).
struct StationPath {
    number: usize,
    name: String,
    points: Vec<(f64, f64)>,
    contacts: Vec<(u8, f64, f64)>,
}

/// The planet's apparent semidiameter at greatest transit, arcsec.
fn planet_semidiameter_arcsec(red: &Reduction) -> f64 {
    let ev = &red.event;
    let p_er = norm(ev.elements.planet_earth_radii(ev.hours_of_greatest()));
    let p_au = p_er / crate::geometry::besselian::earth_radii_per_au();
    (ev.planet.radius_au() / p_au).asin() / ARCSEC_RAD
}

/// The Sun's apparent semidiameter at greatest transit, arcsec.
fn sun_semidiameter_arcsec(red: &Reduction) -> f64 {
    let ev = &red.event;
    let s_er = norm(ev.elements.sun_earth_radii(ev.hours_of_greatest()));
    let s_au = s_er / crate::geometry::besselian::earth_radii_per_au();
    (sun_radius_au() / s_au).asin() / ARCSEC_RAD
}

/// The parallax exaggeration of the disc: a round factor that spreads the stations' paths
/// over about an eighth of the Sun's radius either side of the geocentric path.
pub fn disc_exaggeration(red: &Reduction) -> f64 {
    let (_, _, max_disp) = station_paths(red, 1.0);
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

/// The geocentric path, each drawn station's path with its displacement from the geocentric
/// one multiplied by `factor`, and the largest true displacement (arcsec).
fn station_paths(red: &Reduction, factor: f64) -> (Vec<(f64, f64)>, Vec<StationPath>, f64) {
    let ev = &red.event;
    let p = red.perturbation();
    let k = 1.0 / (ev.earth_radii_per_arcsec() * p.length_scale);
    let h0 = ev.geocentric_hours[0].unwrap_or(-3.0) - 0.3;
    let h1 = ev.geocentric_hours[3].unwrap_or(3.0) + 0.3;
    let n = 60;
    let hours: Vec<f64> = (0..=n)
        .map(|i| h0 + (h1 - h0) * i as f64 / n as f64)
        .collect();
    let at = |h: f64, st: Option<&GeocentricStation>| {
        let (u, v) = offset_on_plane(&ev.elements, st, h, &p);
        (u * k, v * k)
    };
    let shifted = |h: f64, geo: &GeocentricStation| {
        let (g, t) = (at(h, None), at(h, Some(geo)));
        (g.0 + factor * (t.0 - g.0), g.1 + factor * (t.1 - g.1))
    };
    let geo_path: Vec<(f64, f64)> = hours.iter().map(|&h| at(h, None)).collect();
    let mut out = Vec::new();
    let mut max_disp: f64 = 0.0;
    let drawn = red
        .stations
        .iter()
        .enumerate()
        .filter(|(_, s)| s.not_used.is_none());
    for (i, s) in drawn.take(DISC_STATIONS_MAX) {
        let Ok(st) = Station::new(&s.station, s.latitude_deg, s.longitude_deg, s.elevation_m)
        else {
            continue;
        };
        let geo = st.geocentric();
        for &h in &hours {
            let (g, t) = (at(h, None), at(h, Some(&geo)));
            max_disp = max_disp.max((t.0 - g.0).hypot(t.1 - g.1));
        }
        let contacts = s
            .contacts
            .iter()
            .filter_map(|c| {
                let contact = Contact::parse(&c.to_string())?;
                let h = ev.contact_hours_perturbed(&geo, contact, &p)?;
                let (e, n) = shifted(h, &geo);
                Some((*c, e, n))
            })
            .collect();
        out.push(StationPath {
            number: i + 1,
            name: s.station.clone(),
            points: hours.iter().map(|&h| shifted(h, &geo)).collect(),
            contacts,
        });
    }
    (geo_path, out, max_disp)
}

/// A path's number as placed: its baseline start, the label's centre and the leader from the
/// path (`anchor`) to the label's edge (`end`).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct PathLabel {
    /// The number (the station's row in the table).
    pub number: usize,
    /// Baseline start of the text, px.
    pub baseline: Px,
    /// Where the leader leaves the path, px.
    pub anchor: Px,
    /// Where the leader meets the label's box, px.
    pub end: Px,
}

/// Font size of the paths' numbers, px.
pub const NUMBER_PX: f64 = TEXT_PX;

/// Where the segment p-q enters box b (its parameter 0..1 along p-q), if it touches it at all
/// (Liang-Barsky clipping).
fn segment_entry(p: Px, q: Px, b: &TextBox) -> Option<f64> {
    let (dx, dy) = (q.0 - p.0, q.1 - p.1);
    let (mut t0, mut t1) = (0.0f64, 1.0f64);
    for (den, num) in [
        (-dx, p.0 - b.x0),
        (dx, b.x1 - p.0),
        (-dy, p.1 - b.y0),
        (dy, b.y1 - p.1),
    ] {
        if den == 0.0 {
            if num < 0.0 {
                return None;
            }
        } else {
            let t = num / den;
            if den < 0.0 {
                t0 = t0.max(t);
            } else {
                t1 = t1.min(t);
            }
        }
    }
    (t0 <= t1).then_some(t0)
}

/// Distance from point c to the segment p-q.
fn distance_to_segment(c: Px, p: Px, q: Px) -> f64 {
    let (dx, dy) = (q.0 - p.0, q.1 - p.1);
    let len2 = dx * dx + dy * dy;
    let t = if len2 > 0.0 {
        (((c.0 - p.0) * dx + (c.1 - p.1) * dy) / len2).clamp(0.0, 1.0)
    } else {
        0.0
    };
    (c.0 - p.0 - t * dx).hypot(c.1 - p.1 - t * dy)
}

/// Whether a box comes within `margin` of a circle (cx, cy, r).
fn box_near_circle(b: &TextBox, (cx, cy, r): (f64, f64, f64), margin: f64) -> bool {
    let nx = cx.clamp(b.x0, b.x1);
    let ny = cy.clamp(b.y0, b.y1);
    (nx - cx).hypot(ny - cy) < r + margin
}

/// The band the paths make across the Sun: the chord's first and last sample on the Sun,
/// the unit normal to the chord, and the band's extent across the chord (px, least and
/// greatest signed distance of any path from it).
struct Band {
    k0: usize,
    k1: usize,
    origin: Px,
    normal: Px,
    extent: (f64, f64),
}

impl Band {
    fn new(geo: &[Px], paths: &[(usize, Vec<Px>)], inside: &dyn Fn(Px) -> bool) -> Option<Band> {
        let on_sun: Vec<usize> = (0..geo.len()).filter(|&k| inside(geo[k])).collect();
        let (k0, k1) = match (on_sun.first(), on_sun.last()) {
            (Some(&a), Some(&b)) if b > a => (a, b),
            _ => (0, geo.len().checked_sub(1)?),
        };
        if k1 == 0 {
            return None;
        }
        let (dx, dy) = (geo[k1].0 - geo[k0].0, geo[k1].1 - geo[k0].1);
        let len = dx.hypot(dy).max(1e-9);
        let mut band = Band {
            k0,
            k1,
            origin: geo[k0],
            normal: (-dy / len, dx / len),
            extent: (0.0, 0.0),
        };
        band.extent = paths
            .iter()
            .flat_map(|(_, pts)| pts[k0..=k1].iter())
            .chain(&geo[k0..=k1])
            .map(|&p| band.across(p))
            .fold((f64::MAX, f64::MIN), |(lo, hi), a| (lo.min(a), hi.max(a)));
        Some(band)
    }

    /// Signed distance of a point from the chord, px.
    fn across(&self, p: Px) -> f64 {
        (p.0 - self.origin.0) * self.normal.0 + (p.1 - self.origin.1) * self.normal.1
    }

    /// The side of the band each path's number goes to (+1 or -1): the half of the paths
    /// lying further to one side than the other half goes to that side, so that a leader
    /// crosses at most half the band.
    fn sides(&self, paths: &[(usize, Vec<Px>)]) -> Vec<f64> {
        let mean =
            |pts: &[Px]| -> f64 { pts[self.k0..=self.k1].iter().map(|&p| self.across(p)).sum() };
        let mut order: Vec<usize> = (0..paths.len()).collect();
        order.sort_by(|&a, &b| mean(&paths[a].1).total_cmp(&mean(&paths[b].1)));
        let mut sides = vec![1.0; paths.len()];
        for &k in &order[..paths.len() / 2] {
            sides[k] = -1.0;
        }
        sides
    }

    /// Signed distance from the chord of a label `gap` px beyond the band on `side`.
    fn beyond(&self, side: f64, gap: f64) -> f64 {
        if side > 0.0 {
            self.extent.1 + 2.0 + gap
        } else {
            self.extent.0 - 2.0 - gap
        }
    }

    /// Candidate (anchor on the path, label centre) pairs: the label `gap` px beyond the band
    /// on `side`, straight across from points near the fraction `frac` of the chord.
    fn candidates(&self, pts: &[Px], frac: f64, spread: f64, side: f64, gap: f64) -> Vec<(Px, Px)> {
        [0.0, 1.0, -1.0, 2.0, -2.0]
            .iter()
            .map(|step| {
                let f = (frac + step * spread).clamp(0.03, 0.97);
                let k = self.k0 + (f * (self.k1 - self.k0) as f64).round() as usize;
                let a = pts[k];
                let shift = self.beyond(side, gap) - self.across(a);
                (
                    a,
                    (a.0 + shift * self.normal.0, a.1 + shift * self.normal.1),
                )
            })
            .collect()
    }
}

/// Whether a number's box at `b` with its leader from `anchor` to `centre` keeps off the
/// planet, off the leaders drawn before, and its leader off every label placed before.
fn clear_spot(
    placer: &LabelPlacer,
    b: &TextBox,
    (anchor, centre): (Px, Px),
    planet: (f64, f64, f64),
    leaders: &[(Px, Px)],
) -> bool {
    let grown = TextBox {
        x0: b.x0 - 2.0,
        y0: b.y0 - 2.0,
        x1: b.x1 + 2.0,
        y1: b.y1 + 2.0,
    };
    !box_near_circle(b, planet, 3.0)
        && (anchor.0 - planet.0).hypot(anchor.1 - planet.1) > planet.2 + 3.0
        && distance_to_segment((planet.0, planet.1), anchor, centre) > planet.2 + 1.0
        && leaders
            .iter()
            .all(|&(p, q)| segment_entry(p, q, &grown).is_none())
        && placer
            .taken()
            .iter()
            .all(|t| segment_entry(anchor, centre, t).map_or(true, |t| t >= 1.0))
}

/// Number each path: beside the band of paths, at a point along it spread evenly among the
/// paths on that side, joined to the path by a leader perpendicular to the band. `geo` and
/// each path are in px, sampled at the same times; `inside` says which of those points lie
/// on the Sun; `planet` is the planet's disc (cx, cy, r), never covered by a number or a
/// leader. Paths that find no room get no number (the caller counts them).
pub fn place_path_numbers(
    geo: &[Px],
    paths: &[(usize, Vec<Px>)],
    inside: &dyn Fn(Px) -> bool,
    planet: (f64, f64, f64),
    placer: &mut LabelPlacer,
) -> Vec<PathLabel> {
    let Some(band) = Band::new(geo, paths, inside) else {
        return Vec::new();
    };
    let sides = band.sides(paths);
    let mut leaders: Vec<(Px, Px)> = Vec::new();
    let mut out = Vec::new();
    for (i, (number, pts)) in paths.iter().enumerate() {
        // Along each side, the paths share out the chord in the order of their numbers.
        let same: Vec<usize> = (0..paths.len()).filter(|&j| sides[j] == sides[i]).collect();
        let m = same.len() as f64;
        let slot = same.iter().position(|&j| j == i).unwrap_or(0) as f64;
        let frac = 0.1 + 0.8 * (slot + 0.5) / m;
        let text = number.to_string();
        let mut found = None;
        'search: for (spread, far) in [(0.4 / m, 16), (0.05, 40)] {
            for side in [sides[i], -sides[i]] {
                for q in 0..far {
                    let gap = 12.0 + 14.0 * q as f64;
                    for (anchor, centre) in band.candidates(pts, frac, spread, side, gap) {
                        let accept = |pl: &LabelPlacer, b: &TextBox, c: Px| {
                            clear_spot(pl, b, (anchor, c), planet, &leaders)
                        };
                        if let Some((baseline, c)) =
                            placer.place_centred_where(&text, NUMBER_PX, &[centre], accept)
                        {
                            found = Some((anchor, baseline, c));
                            break 'search;
                        }
                    }
                }
            }
        }
        let Some((anchor, baseline, c)) = found else {
            continue;
        };
        let b = TextBox::of_text(&text, NUMBER_PX, baseline);
        let t = segment_entry(anchor, c, &b).unwrap_or(1.0);
        let end = (
            anchor.0 + t * (c.0 - anchor.0),
            anchor.1 + t * (c.1 - anchor.1),
        );
        leaders.push((anchor, end));
        out.push(PathLabel {
            number: *number,
            baseline,
            anchor,
            end,
        });
    }
    out
}

/// Text centred on x with its baseline at y, and its box kept clear of the numbers.
fn centred_text(s: &mut String, placer: &mut LabelPlacer, text: &str, (x, y): Px) {
    let b = TextBox::of_text(text, TEXT_PX, (0.0, 0.0));
    placer.reserve(TextBox::of_text(text, TEXT_PX, (x - b.x1 / 2.0, y)));
    let _ = writeln!(
        s,
        "<text x=\"{x:.1}\" y=\"{y:.1}\" text-anchor=\"middle\">{}</text>",
        esc(text)
    );
}

/// The solar disc with every path numbered (see the module's description). North up, east
/// left, as the Sun is seen in the sky.
pub fn solar_disc_chart(red: &Reduction) -> DiscChart {
    let size = 640.0;
    let c = size / 2.0;
    let r_px = 260.0;
    let scale = r_px / sun_semidiameter_arcsec(red);
    let factor = disc_exaggeration(red);
    let (geo, paths, _) = station_paths(red, factor);
    let xy = |(e, n): (f64, f64)| (c - e * scale, c - n * scale);
    let mut s = svg_open_text(
        size,
        size,
        "Solar disc with the planet's path from each station",
        TEXT_PX,
    );
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    let _ = writeln!(s, "<circle cx=\"{c}\" cy=\"{c}\" r=\"{r_px}\" fill=\"#fde9a9\" stroke=\"#c88a12\" stroke-width=\"1.5\"/>");
    let mut placer = LabelPlacer::new(TextBox {
        x0: 2.0,
        y0: 2.0,
        x1: size - 2.0,
        y1: size - 2.0,
    });
    centred_text(&mut s, &mut placer, "N", (c, 18.0));
    centred_text(&mut s, &mut placer, "E", (14.0, c + 5.0));
    centred_text(&mut s, &mut placer, "W", (size - 14.0, c + 5.0));
    let geo_px: Vec<Px> = geo.iter().map(|&p| xy(p)).collect();
    let path_px: Vec<(usize, Vec<Px>)> = paths
        .iter()
        .map(|p| (p.number, p.points.iter().map(|&q| xy(q)).collect()))
        .collect();
    // Colours in turn across the band, so that neighbouring paths differ.
    let mut order: Vec<usize> = (0..paths.len()).collect();
    let (g0, g1) = (geo_px[0], geo_px[geo_px.len() - 1]);
    let mean_across = |k: usize| {
        path_px[k]
            .1
            .iter()
            .map(|p| (p.0 - g0.0) * (g0.1 - g1.1) + (p.1 - g0.1) * (g1.0 - g0.0))
            .sum::<f64>()
    };
    order.sort_by(|&a, &b| mean_across(a).total_cmp(&mean_across(b)));
    let mut colour = vec![PATH_COLOURS[0]; paths.len()];
    for (rank, &k) in order.iter().enumerate() {
        colour[k] = PATH_COLOURS[rank % PATH_COLOURS.len()];
    }
    let points = |pts: &[Px]| {
        pts.iter()
            .map(|(x, y)| format!("{x:.1},{y:.1}"))
            .collect::<Vec<_>>()
            .join(" ")
    };
    let _ = writeln!(s, "<defs><clipPath id=\"disc-area\"><rect x=\"0\" y=\"0\" width=\"{size}\" height=\"{size}\"/></clipPath></defs>\n<g clip-path=\"url(#disc-area)\" fill=\"none\">");
    let _ = writeln!(s, "<polyline points=\"{}\" stroke=\"#000000\" stroke-width=\"2\"><title>geocentric path</title></polyline>", points(&geo_px));
    for (k, p) in paths.iter().enumerate() {
        let _ = writeln!(s, "<polyline points=\"{}\" stroke=\"{}\" stroke-width=\"1\"><title>{} {}</title></polyline>", points(&path_px[k].1), colour[k], p.number, esc(&p.name));
        for (cn, e, n) in &p.contacts {
            let (x, y) = xy((*e, *n));
            let _ = writeln!(s, "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"2.5\" fill=\"#c53030\"><title>{} {}: contact {}</title></circle>", p.number, esc(&p.name), cn);
        }
    }
    let _ = writeln!(s, "</g>");
    let planet = planet_disc(red, c, scale);
    s.push_str(&disc_scale(&mut placer, planet, size, scale, red));
    let inside = |(x, y): Px| (x - c).hypot(y - c) < r_px;
    let labels = place_path_numbers(&geo_px, &path_px, &inside, planet, &mut placer);
    for l in &labels {
        let k = path_px.iter().position(|p| p.0 == l.number).unwrap_or(0);
        let _ = writeln!(s, "<g><title>{} {}</title><line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\" stroke=\"{col}\" stroke-width=\"1\"/><circle cx=\"{:.1}\" cy=\"{:.1}\" r=\"2.2\" fill=\"{col}\"/><text x=\"{:.1}\" y=\"{:.1}\" font-size=\"{NUMBER_PX}\" fill=\"{col}\">{}</text></g>", l.number, esc(&paths[k].name), l.anchor.0, l.anchor.1, l.end.0, l.end.1, l.anchor.0, l.anchor.1, l.baseline.0, l.baseline.1, l.number, col = colour[k]);
    }
    s.push_str("</svg>\n");
    DiscChart {
        svg: s,
        key: paths.iter().map(|p| (p.number, p.name.clone())).collect(),
        exaggeration: factor,
        unnumbered: paths.len() - labels.len(),
    }
}

/// The solar disc as SVG alone (see [`solar_disc_chart`]).
pub fn solar_disc_svg(red: &Reduction) -> String {
    solar_disc_chart(red).svg
}

/// The planet's disc at the geocentric greatest-transit point (cx, cy, r in px).
fn planet_disc(red: &Reduction, c: f64, scale: f64) -> (f64, f64, f64) {
    let ev = &red.event;
    let p = red.perturbation();
    let k = 1.0 / (ev.earth_radii_per_arcsec() * p.length_scale);
    let (u, v) = offset_on_plane(&ev.elements, None, ev.hours_of_greatest(), &p);
    (
        c - u * k * scale,
        c - v * k * scale,
        planet_semidiameter_arcsec(red) * scale,
    )
}

/// The planet drawn to scale and a scale bar of 100 arcsec in the lower right corner.
fn disc_scale(
    placer: &mut LabelPlacer,
    (x, y, r): (f64, f64, f64),
    size: f64,
    scale: f64,
    red: &Reduction,
) -> String {
    let bar = 100.0 * scale;
    let (x1, yb) = (size - 20.0, size - 24.0);
    let mut s = format!(
        "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"{r:.2}\" fill=\"#111827\"><title>{} to scale at greatest transit</title></circle>\n<line x1=\"{:.1}\" y1=\"{yb:.1}\" x2=\"{x1:.1}\" y2=\"{yb:.1}\" stroke=\"#374151\" stroke-width=\"1.5\"/>\n",
        red.event.planet,
        x1 - bar
    );
    centred_text(&mut s, placer, "100\"", (x1 - bar / 2.0, yb - 5.0));
    placer.reserve(TextBox {
        x0: x1 - bar - 2.0,
        y0: yb - 2.0,
        x1: x1 + 2.0,
        y1: yb + 2.0,
    });
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Forty nearly parallel paths a pixel or two apart across a disc, with the planet on the
    /// middle one: every path numbered, no two numbers or a number and the planet overlapping,
    /// no leader through another number.
    #[test]
    fn every_crowded_path_gets_a_number_clear_of_the_others_and_the_planet() {
        let c = 320.0;
        let line = |off: f64| -> Vec<Px> {
            (0..=60)
                .map(|k| {
                    let t = -1.2 + 2.4 * f64::from(k) / 60.0;
                    (c + 300.0 * t + 0.6 * off, c + 120.0 * t - 1.5 * off + 40.0)
                })
                .collect()
        };
        let geo = line(0.0);
        let paths: Vec<(usize, Vec<Px>)> = (0..40)
            .map(|i| (i + 1, line(f64::from(i as u32) - 19.5)))
            .collect();
        let planet = (c, c + 40.0, 9.0);
        let inside = |(x, y): Px| (x - c).hypot(y - c) < 260.0;
        let mut placer = LabelPlacer::new(TextBox {
            x0: 2.0,
            y0: 2.0,
            x1: 638.0,
            y1: 638.0,
        });
        let labels = place_path_numbers(&geo, &paths, &inside, planet, &mut placer);
        assert_eq!(labels.len(), 40, "every path numbered");
        let boxes: Vec<TextBox> = labels
            .iter()
            .map(|l| TextBox::of_text(&l.number.to_string(), NUMBER_PX, l.baseline))
            .collect();
        for (i, a) in boxes.iter().enumerate() {
            assert!(!box_near_circle(a, planet, 0.0), "{a:?} over the planet");
            for b in &boxes[i + 1..] {
                assert!(!a.overlaps(b), "{a:?} overlaps {b:?}");
            }
            for l in &labels {
                if l.number != labels[i].number {
                    assert!(
                        segment_entry(l.anchor, l.end, a).is_none(),
                        "a leader through {a:?}"
                    );
                }
            }
        }
        for (l, (n, pts)) in labels.iter().zip(&paths) {
            assert_eq!(l.number, *n);
            assert!(pts
                .iter()
                .any(|p| (p.0 - l.anchor.0).hypot(p.1 - l.anchor.1) < 1e-9));
        }
    }

    #[test]
    fn segments_and_boxes() {
        let b = TextBox {
            x0: 10.0,
            y0: 10.0,
            x1: 20.0,
            y1: 20.0,
        };
        assert_eq!(
            segment_entry((0.0, 15.0), (30.0, 15.0), &b),
            Some(1.0 / 3.0)
        );
        assert_eq!(segment_entry((0.0, 0.0), (5.0, 30.0), &b), None);
        assert!((distance_to_segment((0.0, 5.0), (-1.0, 0.0), (1.0, 0.0)) - 5.0).abs() < 1e-12);
        assert!(box_near_circle(&b, (25.0, 15.0, 6.0), 0.0));
        assert!(!box_near_circle(&b, (40.0, 15.0, 6.0), 3.0));
    }
}
