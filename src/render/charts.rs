//! Charts of a reduction as plain, self-contained SVG (no scripts, no external references):
//! the station map here; the solar disc (`disc_chart.rs`), the residuals
//! (`residual_chart.rs`) and the convergence (`convergence_chart.rs`) beside it, re-exported
//! from here. Every string from an input file is escaped. The charts' captions and keys are
//! written by `figures.rs`.

use crate::geometry::contacts::Contact;
use crate::language::numbers::decimal;
use crate::language::{text, Args, Language};
use crate::reduction::{Reduction, StationContribution};
use crate::render::axes::{SMALL_TEXT_PX, TEXT_PX};
use crate::render::svg::{esc, graticule_labels_sized, land_svg, svg_open_text};
use std::fmt::Write;

pub use crate::render::convergence_chart::{convergence_svg, convergence_svg_in};
pub use crate::render::disc_chart::{
    disc_exaggeration, solar_disc_chart, solar_disc_svg, DiscChart, DISC_STATIONS_MAX,
};
pub use crate::render::residual_chart::{
    residuals_chart, residuals_svg, ResidualChart, REJECTED_PER_CONTACT_MAX,
    RESIDUALS_PER_CONTACT_MAX,
};

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

/// Most stations drawn on the map (by share; stations with no timing used after them).
pub const MAP_STATIONS_MAX: usize = 2000;

/// A sentence saying what the charts leave out, or nothing when they show everything.
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

/// Marker radius (px) of a station with this share of the information.
fn marker_r(share: f64) -> f64 {
    2.5 + 30.0 * share.max(0.0).sqrt()
}

/// The map's keys below the frame: the colour scale and three marker sizes.
fn map_keys(language: Language, s: &mut String, h: f64) {
    let y = h + 14.0;
    let _ = writeln!(
        s,
        "<text x=\"10\" y=\"{:.1}\">{}</text>",
        y + 12.0,
        esc(&text(language, "chart-map-colour-key", &Args::new()))
    );
    for (k, z) in [-2.0, -1.0, 0.0, 1.0, 2.0].iter().enumerate() {
        let x = 200.0 + 34.0 * k as f64;
        let _ = writeln!(s, "<rect x=\"{x}\" y=\"{y}\" width=\"32\" height=\"14\" fill=\"{}\" stroke=\"#1f2937\" stroke-width=\"0.4\"/><text x=\"{}\" y=\"{}\" text-anchor=\"middle\" font-size=\"{SMALL_TEXT_PX}\">{z:+.0}</text>", residual_colour(*z), x + 16.0, y + 30.0);
    }
    let key_y = h + 76.0;
    let _ = writeln!(
        s,
        "<text x=\"10\" y=\"{:.1}\">{}</text>",
        key_y + 5.0,
        esc(&text(language, "chart-map-area-key", &Args::new()))
    );
    for (k, share) in [0.01f64, 0.05, 0.2].iter().enumerate() {
        let x = 270.0 + 100.0 * k as f64;
        let r = marker_r(*share);
        let _ = writeln!(s, "<circle cx=\"{x}\" cy=\"{key_y}\" r=\"{r:.1}\" fill=\"#e5e7eb\" stroke=\"#1f2937\" stroke-width=\"0.6\"/><text x=\"{:.1}\" y=\"{:.1}\" font-size=\"{SMALL_TEXT_PX}\">{:.0} %</text>", x + r + 4.0, key_y + 5.0, 100.0 * share);
    }
}

/// A world map (equirectangular) with each station: marker area by its information share,
/// colour by its mean normalised residual, a cross where none of its timings was used. Land
/// outlines: Natural Earth 1:110m (public domain). In English.
pub fn station_map_svg(red: &Reduction) -> String {
    station_map_svg_in(Language::English, red)
}

/// A station's mark's title: its name and number, and its share and mean normalised residual
/// or why it was not used.
fn station_title(language: Language, number: usize, st: &StationContribution) -> String {
    let args = Args::new()
        .text("station", st.station.clone())
        .text("number", number.to_string());
    esc(&match &st.not_used {
        Some(why) => text(
            language,
            "chart-map-not-used",
            &args.text("why", why.clone()),
        ),
        None => {
            let z = decimal(language, st.mean_normalised_residual, 2);
            let args = args
                .text("share", decimal(language, st.information_share, 3))
                .text(
                    "z",
                    if st.mean_normalised_residual >= 0.0 && !z.starts_with('-') {
                        format!("+{z}")
                    } else {
                        z
                    },
                );
            text(language, "chart-map-station", &args)
        }
    })
}

/// The station map in `language`.
pub fn station_map_svg_in(language: Language, red: &Reduction) -> String {
    let (w, h) = (720.0, 360.0);
    let px = |lon: f64, lat: f64| ((lon + 180.0) * 2.0, (90.0 - lat) * 2.0);
    let title = text(language, "chart-map-title", &Args::new());
    let mut s = svg_open_text(w, h + 100.0, &title, TEXT_PX);
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/><rect width=\"{w}\" height=\"{h}\" fill=\"#dbeafe\"/>");
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
    s.push_str(&graticule_labels_sized(h, SMALL_TEXT_PX));
    // Markers near the frame are cut at it, as on any map.
    let _ = writeln!(s, "<defs><clipPath id=\"map-frame\"><rect width=\"{w}\" height=\"{h}\"/></clipPath></defs>\n<g clip-path=\"url(#map-frame)\">");
    for (i, st) in red.stations.iter().enumerate().take(MAP_STATIONS_MAX) {
        let (x, y) = px(st.longitude_deg, st.latitude_deg);
        if st.not_used.is_some() {
            let _ = writeln!(
                s,
                "<g class=\"not-used\" stroke=\"#b91c1c\" stroke-width=\"1.6\"><line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\"/><line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\"/><title>{}</title></g>",
                x - 4.0, y - 4.0, x + 4.0, y + 4.0, x - 4.0, y + 4.0, x + 4.0, y - 4.0,
                station_title(language, i + 1, st)
            );
            continue;
        }
        let _ = writeln!(
            s,
            "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"{:.1}\" fill=\"{}\" fill-opacity=\"0.85\" stroke=\"#1f2937\" stroke-width=\"0.6\"><title>{}</title></circle>",
            marker_r(st.information_share),
            residual_colour(st.mean_normalised_residual),
            station_title(language, i + 1, st)
        );
    }
    s.push_str("</g>\n");
    map_keys(language, &mut s, h);
    s.push_str("</svg>\n");
    s
}
