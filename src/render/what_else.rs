//! What else the timings measure, for the table, the JSON and the reports: the scale of the
//! Solar System, the sizes, the depth of the transit and the distant observer's reading.

use crate::reduction::Reduction;
use crate::render::reduction::opt;
use crate::render::text::{name_cell, round as r};
use crate::scale::light_curve::LIMB_DARKENING_LAW;
use crate::scale::summary::WhatElse;
use serde_json::{json, Value};

/// The JSON keys of the stable interface (`planet_diameter_km`, ..., `transit_depth`,
/// `scale`) and a few more, to merge into the reduction's object.
pub fn what_else_json(w: &WhatElse) -> Vec<(&'static str, Value)> {
    let s = &w.sizes;
    vec![
        ("planet_diameter_km", opt(s.planet.map(|d| d.km), 1)),
        (
            "planet_diameter_sigma_km",
            opt(s.planet.map(|d| d.sigma_km), 1),
        ),
        ("sun_diameter_km", opt(s.sun.map(|d| d.km), 0)),
        ("sun_diameter_sigma_km", opt(s.sun.map(|d| d.sigma_km), 0)),
        ("planet_diameter_iau_km", json!(r(s.iau_planet_km, 1))),
        (
            "planet_diameter_per_black_drop_s_km",
            opt(s.planet_km_per_black_drop_s, 2),
        ),
        ("sizes_note", json!(s.why_not)),
        (
            "station_sizes",
            json!(s
                .stations
                .iter()
                .map(|x| json!({
                    "station": x.station,
                    "pair": x.pair,
                    "observed_s": r(x.observed_s, 2),
                    "predicted_s": r(x.predicted_s, 2),
                    "diameter_km": r(x.diameter_km, 0),
                    "sigma_km": r(x.sigma_km, 0),
                }))
                .collect::<Vec<_>>()),
        ),
        ("transit_depth", json!(r(w.distant.depth, 8))),
        ("limb_darkening", json!(LIMB_DARKENING_LAW)),
        (
            "scale",
            json!(w
                .scale
                .iter()
                .map(|x| json!({
                    "body": x.body,
                    "period_days": r(x.period_days, 4),
                    "semi_major_axis_au": r(x.semi_major_axis_au, 7),
                    "semi_major_axis_km": r(x.semi_major_axis_km, 0),
                    "sigma_km": r(x.sigma_km, 0),
                }))
                .collect::<Vec<_>>()),
        ),
        (
            "earth_planet_distance_km",
            opt(w.earth_planet_km.map(|x| x.0), 0),
        ),
        (
            "earth_planet_distance_sigma_km",
            opt(w.earth_planet_km.map(|x| x.1), 0),
        ),
        ("light_time_au_s", opt(w.light_time_s.map(|x| x.0), 3)),
        ("light_time_au_sigma_s", opt(w.light_time_s.map(|x| x.1), 3)),
        (
            "earth_mean_speed_km_s",
            opt(w.earth_speed_km_s.map(|x| x.0), 4),
        ),
        (
            "earth_mean_speed_sigma_km_s",
            opt(w.earth_speed_km_s.map(|x| x.1), 4),
        ),
        (
            "distant_observer",
            json!({
                "depth": r(w.distant.depth, 8),
                "radius_ratio_from_depth": opt(w.distant.radius_ratio_from_depth, 6),
                "radius_ratio_from_timings": opt(w.distant.radius_ratio_from_timings, 6),
                "period_days": r(w.distant.period_days, 3),
                "distance_au": r(w.distant.distance_au, 6),
                "distance_km": opt(w.distant.distance_km, 0),
            }),
        ),
    ]
}

fn million(km: f64, sigma: f64) -> String {
    let d = crate::render::text::decimals_for(sigma * 1e-6);
    format!("{:.d$} +- {:.d$} million km", km * 1e-6, sigma * 1e-6)
}

/// Column headers of the scale table.
pub const SCALE_HEADERS: [&str; 4] = [
    "planet",
    "period (days)",
    "semi-major axis (AU)",
    "semi-major axis (million km)",
];

/// Column headers of the stations' size estimates.
pub const SIZE_HEADERS: [&str; 5] = [
    "station",
    "duration",
    "observed (s)",
    "predicted for the IAU radius (s)",
    "diameter (km)",
];

/// The scale table's rows.
pub fn scale_rows(w: &WhatElse) -> Vec<Vec<String>> {
    w.scale
        .iter()
        .map(|row| {
            let d = crate::render::text::decimals_for(row.sigma_km * 1e-6);
            vec![
                row.body.clone(),
                format!("{:.2}", row.period_days),
                format!("{:.6}", row.semi_major_axis_au),
                format!(
                    "{:.d$} +- {:.d$}",
                    row.semi_major_axis_km * 1e-6,
                    row.sigma_km * 1e-6
                ),
            ]
        })
        .collect()
}

/// The stations' size estimates as rows (at most `limit`).
pub fn size_rows(w: &WhatElse, limit: usize) -> Vec<Vec<String>> {
    w.sizes
        .stations
        .iter()
        .take(limit)
        .map(|x| {
            vec![
                x.station.clone(),
                format!(
                    "{} ({})",
                    x.pair,
                    if x.pair == "ingress" {
                        "I-II"
                    } else {
                        "III-IV"
                    }
                ),
                format!("{:.1}", x.observed_s),
                format!("{:.1}", x.predicted_s),
                format!("{:.0} +- {:.0}", x.diameter_km, x.sigma_km),
            ]
        })
        .collect()
}

/// The sentence that introduces the scale table, or says why there is none.
pub fn scale_intro(red: &Reduction, w: &WhatElse) -> String {
    if w.scale.is_empty() {
        return "The AU is not determined, so no distance is given in kilometres.".to_string();
    }
    let mut s = "The campaign measured the AU; Kepler's third law, with each planet's period (Standish's mean motions) and mass (IAU 2009), gives every planet's distance from the Sun in AU, and the AU turns them all into kilometres, with the AU's uncertainty.".to_string();
    if let Some((d, sd)) = w.earth_planet_km {
        s.push_str(&format!(
            " {} was {} from the Earth at greatest transit.",
            red.event.planet,
            million(d, sd)
        ));
    }
    if let (Some((t, ts)), Some((v, vs))) = (w.light_time_s, w.earth_speed_km_s) {
        s.push_str(&format!(" Light takes {t:.1} +- {ts:.1} s to cross one AU; the Earth moves along its orbit at {v:.3} +- {vs:.3} km/s on average."));
    }
    s
}

/// The sentences about the sizes (before the stations' table).
pub fn size_sentences(red: &Reduction, w: &WhatElse) -> Vec<String> {
    let s = &w.sizes;
    let mut out = Vec::new();
    let planet = red.event.planet;
    match (s.planet, s.sun) {
        (Some(p), Some(sun)) => out.push(format!(
            "From the radius corrections and the AU: {planet}'s diameter {:.0} +- {:.0} km (IAU {:.1} km), the Sun's {:.0} +- {:.0} km.",
            p.km, p.sigma_km, s.iau_planet_km, sun.km, sun.sigma_km
        )),
        _ => out.push(format!(
            "{planet}'s and the Sun's diameters are not determined: {}.",
            s.why_not.as_deref().unwrap_or("the timings cannot tell them")
        )),
    }
    if let Some(b) = s.planet_km_per_black_drop_s {
        out.push(format!("The black drop makes interior contacts late at ingress and early at egress, which shortens the interior chord and so enlarges the planet: in this campaign's solution each second of it adds {b:+.1} km to the diameter."));
    }
    if !s.stations.is_empty() {
        out.push("Each station's own estimate from its durations: the observed duration over the duration predicted for the IAU radius at that station (the planet's speed across the limb), times the IAU diameter at the measured AU. A black drop lengthens both durations.".into());
    }
    out
}

/// The sentences of the distant observer's reading.
pub fn distant_sentences(red: &Reduction, w: &WhatElse) -> Vec<String> {
    let d = &w.distant;
    let ratio = d
        .radius_ratio_from_depth
        .map(|x| format!("{x:.5}"))
        .unwrap_or_else(|| "not determined".into());
    let distance = d
        .distance_km
        .map(|km| format!(", {:.2} million km with the campaign's AU", km * 1e-6))
        .unwrap_or_default();
    vec![
        format!(
            "Seen from the Earth's centre the planet blocked {:.4} % of the Sun's light at greatest transit ({LIMB_DARKENING_LAW}).",
            100.0 * d.depth
        ),
        format!(
            "A distant observer of the Sun would read the transit as transits of planets around other stars are read: the depth (computed with the IAU radii) gives the planet's radius as {ratio} of the Sun's, where the timings' fitted radii give {}; the repetition gives the period, {:.2} days (the osculating period of {} from the ephemeris); Kepler's third law gives its distance, {:.4} AU{distance}.",
            d.radius_ratio_from_timings.map_or("nothing (not determined)".to_string(), |x| format!("{x:.5}")),
            d.period_days,
            red.event.planet,
            d.distance_au
        ),
    ]
}

/// The section for the terminal.
pub fn what_else_section(red: &Reduction, s: &mut String) {
    let w = crate::scale::summary::what_else(red);
    s.push_str("\nWhat else the timings measure\n");
    s.push_str(&format!("  {}\n", scale_intro(red, &w)));
    for row in scale_rows(&w) {
        s.push_str(&format!(
            "    {:<8} period {:>9} d   a = {:>9} AU = {} million km\n",
            row[0], row[1], row[2], row[3]
        ));
    }
    for line in size_sentences(red, &w) {
        s.push_str(&format!("  {line}\n"));
    }
    const SHOWN: usize = 12;
    for row in size_rows(&w, SHOWN) {
        s.push_str(&format!(
            "    {} {:<16} {:>7} s observed, {:>7} s predicted: {} km\n",
            name_cell(&row[0]),
            row[1],
            row[2],
            row[3],
            row[4]
        ));
    }
    if w.sizes.stations.len() > SHOWN {
        s.push_str(&format!(
            "    ... {} more in the JSON (station_sizes) and the report\n",
            w.sizes.stations.len() - SHOWN
        ));
    }
    for line in distant_sentences(red, &w) {
        s.push_str(&format!("  {line}\n"));
    }
}
