//! The organiser's view of the network planned against reported: the solution's "as of" time
//! and the changes pending, the counts (registered, reported, registered but silent, reported
//! without registering), a world map that marks each kind by shape as well as colour (with a
//! key and a caption), and the table of the registered stations.

use super::pages::scroll_box;
use super::server::App;
use super::store_registrations::{NetworkPlan, NetworkStation, Registration};
use crate::language::{text, Args, Language};
use crate::render::svg::{
    esc, graticule_labels_sized, graticule_lines, land_svg, svg_open, world_px,
};
use std::fmt::Write;

/// The map's marks: (class, colour, words of the key).
const REPORTED_REGISTERED: (&str, &str, &str) = (
    "reg-reported",
    "#15803d",
    "registered and reported (filled circle)",
);
const REPORTED_ONLY: (&str, &str, &str) = (
    "walk-in",
    "#1d4ed8",
    "reported without registering (filled square)",
);
const REGISTERED_ONLY: (&str, &str, &str) = (
    "silent",
    "#b45309",
    "registered, no timings yet (open triangle)",
);

/// Where the land outlines come from, as every map says.
const LAND_CREDIT: &str = "Land: Natural Earth 1:110m (public domain).";

/// One station's mark at (x, y): a filled circle, a filled square or an open triangle.
fn mark(s: &NetworkStation, (x, y): (f64, f64)) -> String {
    let title = format!("<title>{}</title>", esc(&s.station));
    match (s.registered, s.reported) {
        (true, true) => format!(
            "<circle class=\"{}\" cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"4\" fill=\"{}\" stroke=\"#1f2937\" stroke-width=\"0.6\">{title}</circle>",
            REPORTED_REGISTERED.0, REPORTED_REGISTERED.1
        ),
        (false, _) => format!(
            "<rect class=\"{}\" x=\"{:.1}\" y=\"{:.1}\" width=\"7\" height=\"7\" fill=\"{}\" stroke=\"#1f2937\" stroke-width=\"0.6\">{title}</rect>",
            REPORTED_ONLY.0, x - 3.5, y - 3.5, REPORTED_ONLY.1
        ),
        (true, false) => format!(
            "<path class=\"{}\" d=\"M{x:.1},{:.1} l5,9 l-10,0 z\" fill=\"#ffffff\" fill-opacity=\"0.6\" stroke=\"{}\" stroke-width=\"1.8\">{title}</path>",
            REGISTERED_ONLY.0, y - 6.0, REGISTERED_ONLY.1
        ),
    }
}

/// The world frame (720 x 360 px, land, graticule) with a mark for each station that has a
/// place, silent ones first so that a reported one at the same place is drawn over them; the
/// SVG is left open below the frame (`extra_h` px) for a key.
fn frame_with_marks(stations: &[NetworkStation], label: &str, extra_h: f64) -> String {
    let (w, h) = (720.0, 360.0);
    let mut s = svg_open(w, h + extra_h, label);
    let _ = writeln!(s, "<rect width=\"{w}\" height=\"{h}\" fill=\"#dbeafe\"/>");
    s.push_str(&land_svg("#e7e2d3", "#9c9581", 0.4));
    s.push_str(&graticule_lines("#94a3b8"));
    s.push_str(&graticule_labels_sized(h, 13.0));
    let _ = writeln!(s, "<defs><clipPath id=\"plan-frame\"><rect width=\"{w}\" height=\"{h}\"/></clipPath></defs>\n<g clip-path=\"url(#plan-frame)\">");
    let mut order: Vec<&NetworkStation> = stations.iter().collect();
    order.sort_by_key(|st| st.reported);
    let placed = order
        .into_iter()
        .filter(|st| st.latitude_deg.is_finite() && st.longitude_deg.is_finite());
    for st in placed {
        let _ = writeln!(
            s,
            "{}",
            mark(st, world_px(st.longitude_deg, st.latitude_deg))
        );
    }
    s.push_str("</g>\n");
    s
}

/// A plain map of stations (each a filled circle, named in its tooltip), for the public page
/// while the solution's own map has no figures to draw.
pub fn places_map_svg(stations: &[NetworkStation]) -> String {
    let mut s = frame_with_marks(stations, "World map of the stations", 24.0);
    let _ = writeln!(
        s,
        "<text x=\"12\" y=\"378\" font-size=\"13\">{LAND_CREDIT}</text>\n</svg>"
    );
    s
}

/// The map of the network planned against reported, with its key (one line per mark, text at
/// 13 px like the report's charts).
pub fn network_map_svg(plan: &NetworkPlan) -> String {
    let h = 360.0;
    let line_h = 20.0;
    let mut s = frame_with_marks(
        &plan.stations,
        "World map of the stations registered and reported",
        24.0 + 4.0 * line_h,
    );
    let key_stations = [(true, true), (false, true), (true, false)];
    let keys = [REPORTED_REGISTERED, REPORTED_ONLY, REGISTERED_ONLY];
    for (k, ((registered, reported), (_, _, words))) in key_stations.iter().zip(keys).enumerate() {
        let (x, y) = (16.0, h + 22.0 + line_h * k as f64);
        let st = NetworkStation {
            station: words.to_string(),
            latitude_deg: 0.0,
            longitude_deg: 0.0,
            registered: *registered,
            reported: *reported,
        };
        let _ = writeln!(
            s,
            "{}<text x=\"{:.1}\" y=\"{:.1}\" font-size=\"13\">{}</text>",
            mark(&st, (x, y)),
            x + 14.0,
            y + 4.5,
            esc(words)
        );
    }
    let _ = writeln!(
        s,
        "<text x=\"12\" y=\"{:.1}\" font-size=\"13\">{LAND_CREDIT}</text>",
        h + 26.0 + 3.0 * line_h
    );
    s.push_str("</svg>\n");
    s
}

/// The table of the registered stations and whether each has reported.
fn registrations_table(registrations: &[Registration], plan: &NetworkPlan) -> String {
    let reported = |name: &str| {
        let key = super::store_registrations::name_key(name);
        plan.stations
            .iter()
            .any(|s| s.reported && super::store_registrations::name_key(&s.station) == key)
    };
    let mut t = String::from("<table id=\"registrations\"><tr><th scope=\"col\">station</th><th scope=\"col\">latitude</th><th scope=\"col\">longitude</th><th scope=\"col\">time zone</th><th scope=\"col\">registered (UTC)</th><th scope=\"col\">timings</th></tr>\n");
    for r in registrations {
        let _ = writeln!(
            t,
            "<tr><td>{}</td><td>{:.4}</td><td>{:.4}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            esc(&r.station),
            r.latitude_deg,
            r.longitude_deg,
            esc(&r.time_zone),
            esc(&r.registered_utc),
            if reported(&r.station) {
                "reported"
            } else {
                "none yet"
            }
        );
    }
    t.push_str("</table>\n");
    scroll_box("Registered stations", &t)
}

/// The sentence of the solution's time and the changes it does not include yet (English, as
/// the organiser's page has it).
pub fn as_of_sentence(solved_utc: &str, version: u64, pending: u64) -> String {
    as_of_sentence_in(Language::English, solved_utc, version, pending)
}

/// The sentence of the solution's time and the changes it does not include yet, in
/// `language` (HTML: the values escaped).
pub fn as_of_sentence_in(
    language: Language,
    solved_utc: &str,
    version: u64,
    pending: u64,
) -> String {
    let solution = if solved_utc.is_empty() {
        text(language, "as-of-none", &Args::new())
    } else {
        let when: String = solved_utc
            .replace('T', " ")
            .trim_end_matches('Z')
            .chars()
            .take(19)
            .collect();
        let args = Args::new()
            .text("when", when)
            .text("version", version.to_string());
        text(language, "as-of-solution", &args)
    };
    let args = Args::new().text("solution", solution);
    esc(&match pending {
        0 => text(language, "as-of-settled", &args),
        n => text(language, "as-of-pending", &args.count("n", n as usize)),
    })
}

/// The organiser page's section: the "as of" sentence, the network planned against
/// reported (counts, map, registered stations).
pub fn organiser_section(app: &App) -> String {
    let solved = app.cache.solved();
    let mut s = format!(
        "<p id=\"as-of\">{}</p>\n",
        as_of_sentence(&solved.solved_utc, solved.version, app.pending_changes())
    );
    let read = app
        .cache
        .with_page_reader(app, |st| Ok((st.network_plan()?, st.registrations()?)));
    let (plan, registrations) = match read {
        Ok(x) => x,
        Err(e) => {
            let _ = writeln!(s, "<p>The registrations could not be read: {}</p>", esc(&e));
            return s;
        }
    };
    let (registered, reported, silent, walk_in) = plan.counts();
    let _ = writeln!(
        s,
        "<h2>Stations planned and reported</h2>\n<p id=\"plan-counts\">Registered: <b id=\"n-registered\">{registered}</b>; reported: <b id=\"n-reported\">{reported}</b>; registered but silent: <b id=\"n-silent\">{silent}</b>; reported without registering: <b id=\"n-walk-in\">{walk_in}</b>.</p>"
    );
    if plan.stations.is_empty() {
        s.push_str("<p>No station has registered or reported yet.</p>\n");
        return s;
    }
    let _ = writeln!(
        s,
        "<figure id=\"plan-map\" class=\"chart\" tabindex=\"0\">{}<figcaption>Stations planned against reported: a filled circle for a registered station that has sent timings, a filled square for one that sent timings without registering, an open triangle for a registered station with no timings yet.</figcaption></figure>",
        network_map_svg(&plan)
    );
    if !registrations.is_empty() {
        s.push_str(&registrations_table(&registrations, &plan));
    }
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_map_marks_each_kind_by_shape_and_says_the_key() {
        let st = |name: &str, registered, reported| NetworkStation {
            station: name.into(),
            latitude_deg: 10.0,
            longitude_deg: 20.0,
            registered,
            reported,
        };
        let plan = NetworkPlan {
            stations: vec![
                st("A <b>", true, true),
                st("B", false, true),
                st("C", true, false),
            ],
        };
        let svg = network_map_svg(&plan);
        // One of each on the map, one of each in the key.
        assert_eq!(svg.matches("<circle class=\"reg-reported\"").count(), 2);
        assert_eq!(svg.matches("<rect class=\"walk-in\"").count(), 2);
        assert_eq!(svg.matches("<path class=\"silent\"").count(), 2);
        assert!(svg.contains("A &lt;b&gt;") && !svg.contains("A <b>"));
        assert!(svg.contains("registered, no timings yet (open triangle)"));
        assert_eq!(
            as_of_sentence("2012-06-06T01:02:03.456Z", 4, 2),
            "Solution as of 2012-06-06 01:02:03 UTC (version 4 of the data); 2 newer changes (submissions, corrections or exclusions) are being reduced."
        );
        assert!(as_of_sentence("", 0, 0).starts_with("No solution"));
    }
}
