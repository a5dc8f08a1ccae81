//! Rendering a reduction: the JSON object of the stable interface and a readable terminal
//! report (solution, parameters, correlations, stations ranked by contribution, rejected rows).

use crate::geometry::contacts::Contact;
use crate::reduction::error_budget::ErrorBudget;
use crate::reduction::Reduction;
use crate::render::text::{au_text, csv_field, name_cell, round as r, SAFETY_CAUTION};
use crate::words::count;
use serde_json::{json, Map, Value};
use std::collections::HashMap;

/// A number rounded for JSON, or null when absent or not finite.
pub(crate) fn opt(x: Option<f64>, decimals: i32) -> Value {
    match x {
        Some(v) if v.is_finite() => json!(r(v, decimals)),
        _ => Value::Null,
    }
}

/// A station's fitted longitude correction and its uncertainty (degrees), if it has one.
pub fn longitude_correction(red: &Reduction, station: &str) -> Option<(f64, Option<f64>)> {
    let name = format!("longitude_correction[{station}]");
    red.parameters
        .iter()
        .find(|p| p.name == name)
        .map(|p| (p.value, p.sigma))
}

/// Every station's fitted longitude correction and its uncertainty (degrees), by station
/// name: one pass over the parameters, so that a campaign of tens of thousands of stations
/// is not searched once per station.
pub fn longitude_corrections(red: &Reduction) -> HashMap<&str, (f64, Option<f64>)> {
    red.parameters
        .iter()
        .filter_map(|p| {
            let station = p
                .name
                .strip_prefix("longitude_correction[")?
                .strip_suffix(']')?;
            Some((station, (p.value, p.sigma)))
        })
        .collect()
}

fn parameters_json(red: &Reduction) -> Vec<Value> {
    red.parameters
        .iter()
        .map(|p| {
            json!({
                "name": p.name,
                "value": r(p.value, 6),
                "sigma": opt(p.sigma, 6),
                "unit": p.unit,
                "fixed": p.fixed,
            })
        })
        .collect()
}

/// The JSON object of `reduce --format json` (keys of shared/interface.md, and more).
pub fn reduction_json(red: &Reduction) -> Value {
    let mut map = reduction_json_head(red);
    map.insert(
        "rejected".into(),
        crate::render::reduction_json::rejected_value(red),
    );
    map.insert(
        "stations".into(),
        crate::render::reduction_json::stations_value(red),
    );
    Value::Object(map)
}

/// Every key of [`reduction_json`] but the two that grow with the campaign (`stations`,
/// `rejected`: see [`crate::render::reduction_json`]).
pub(crate) fn reduction_json_head(red: &Reduction) -> Map<String, Value> {
    let st = &red.statistics;
    let mut v = json!({
        "planet": red.event.planet.name(),
        "transit_date": red.event.date().to_string(),
        "greatest_utc": red.event.greatest_utc(),
        "prior_parallax_arcsec": r(red.prior_parallax_arcsec, 6),
        "parallax_arcsec": opt(red.parallax_arcsec, 6),
        "parallax_sigma_arcsec": opt(red.parallax_sigma_arcsec, 6),
        "parallax_interval_95_arcsec": red.parallax_interval_95.map(|(a, b)| vec![r(a, 6), r(b, 6)]),
        "au_km": opt(red.au_km, 0),
        "au_sigma_km": opt(red.au_sigma_km, 0),
        "au_interval_95_km": red.au_interval_95_km.map(|(a, b)| json!([r(a, 0), b.map(|b| r(b, 0))])),
        "timings_total": red.timings_total,
        "timings_used": red.timings_used,
        "parameters": parameters_json(red),
        "correlation": red.correlation.iter().map(|row| row.iter().map(|x| r(*x, 4)).collect::<Vec<f64>>()).collect::<Vec<_>>(),
        "chi2": r(st.chi2, 3),
        "dof": st.dof,
        "p_value": opt(st.p_value, 4),
        "p_lower": opt(st.p_lower, 6),
        "birge_ratio": opt(st.birge_ratio, 4),
        "sigma_scale": r(st.sigma_scale, 4),
        "robust_scatter": r(red.robust_scatter, 4),
        "iterations": red.iterations,
        "warnings": red.warnings,
        "delta_t_s": r(red.event.elements.delta_t_s, 3),
        "delta_t_sigma_s": delta_t_sigma(red),
        "delta_t_source": red.event.time_model().delta_t_s(red.event.greatest).1.describe(),
        "black_drop": red.black_drop.iter().map(|b| json!({
            "contact_judged": b.contact_judged,
            "contact": b.contact,
            "delay_s": opt(b.delay_s, 2),
            "sigma_s": opt(b.sigma_s, 2),
            "relative_to": b.relative_to,
            "note": b.note,
        })).collect::<Vec<_>>(),
        "ephemeris": red.event.ephemeris_name(),
        "planet_place": red.planet_place.label(),
        "planet_place_parallax_shift_arcsec": red.place_bias_arcsec.map(|b| vec![r(b[0], 6), r(b[1], 6)]),
        "convergence": red.convergence.iter().map(|c| json!({
            "timings": c.timings,
            "parallax_arcsec": r(c.parallax_arcsec, 6),
            "sigma_arcsec": r(c.sigma_arcsec, 6),
        })).collect::<Vec<_>>(),
        "methods": methods_json(red),
        "error_budget": red.error_budget.as_ref().map(budget_json),
    });
    let mut map = match v.take() {
        Value::Object(map) => map,
        _ => Map::new(),
    };
    let w = crate::scale::summary::what_else(red);
    for (k, x) in crate::render::what_else::what_else_json(&w) {
        map.insert(k.to_string(), x);
    }
    for (k, x) in crate::render::residual_groups::groups_json(red) {
        map.insert(k.to_string(), x);
    }
    map
}

/// The uncertainty of the Delta T used (null where it was fixed with --delta-t and counts as
/// exact: never a zero).
fn delta_t_sigma(red: &Reduction) -> Value {
    let sigma = red.event.delta_t_sigma_s();
    opt((sigma > 0.0).then_some(sigma), 3)
}

/// The methods side by side: null figures and a note where a method gives none.
fn methods_json(red: &Reduction) -> Vec<Value> {
    red.methods
        .iter()
        .map(|m| {
            json!({
                "method": m.method,
                "parallax_arcsec": opt(m.parallax_arcsec, 6),
                "parallax_sigma_arcsec": opt(m.parallax_sigma_arcsec, 6),
                "au_km": opt(m.au_km, 0),
                "au_sigma_km": opt(m.au_sigma_km, 0),
                "timings_used": m.timings_used,
                "stations_used": m.stations_used,
                "note": m.note,
                "held": m.held,
                "difference_sd_arcsec": opt(m.difference_sd_arcsec, 7),
            })
        })
        .collect()
}

fn budget_json(b: &ErrorBudget) -> Value {
    json!({
        "delta_t_s": r(b.delta_t_s, 3),
        "delta_t_sigma_s": opt(b.delta_t_sigma_s, 3),
        "delta_t_fixed": b.delta_t_fixed,
        "parallax_per_delta_t_arcsec_per_s": opt(b.parallax_per_delta_t_arcsec_per_s, 7),
        "parallax_per_delta_t_offsets_held_arcsec_per_s": opt(b.parallax_per_delta_t_offsets_held_arcsec_per_s, 7),
        "delta_t_arcsec": opt(b.delta_t_arcsec, 6),
        "timings_arcsec": r(b.timings_arcsec, 6),
        "longitudes_arcsec": opt(b.longitudes_arcsec, 6),
        "planet_place_arcsec": opt(b.planet_place_arcsec, 6),
        "stated_arcsec": r(b.stated_arcsec, 6),
        "with_model_terms_arcsec": r(b.with_model_terms_arcsec, 6),
    })
}

/// The planet's place in a sentence: the choice, the ephemeris's own accuracy, and the bias
/// that holding the place risks (measured, see `reduction::planet_place`).
pub fn place_sentence(red: &Reduction) -> String {
    use crate::reduction::planet_place::{place_accuracy_arcsec, PlanetPlace};
    let name = red.event.ephemeris_name();
    let accuracy = place_accuracy_arcsec(&name);
    let planet = red.event.planet.title();
    let ephemeris = format!(
        "{name}, whose place of {planet} relative to the Sun is good to about {accuracy}\""
    );
    let risk = |bias: Option<[f64; 2]>| {
        match (bias, red.parallax_sigma_arcsec) {
        (Some([e, n]), Some(sigma)) => {
            let worst = e.abs().max(n.abs());
            let verdict = if worst > 0.5 * sigma {
                "a bias comparable to the uncertainty: prefer --planet-place free or a looser prior"
            } else {
                "small beside the uncertainty"
            };
            format!(" An error of that size east or north would move the parallax by {:.5}\" or {:.5}\" ({:.3} or {:.3} of its uncertainty): {verdict}.", e.abs(), n.abs(), e.abs() / sigma, n.abs() / sigma)
        }
        _ => " What an ephemeris error would do to the parallax is not determined (the parallax is not).".to_string(),
    }
    };
    match red.planet_place {
        PlanetPlace::Free => {
            let held: Vec<&str> = red
                .parameters
                .iter()
                .filter(|p| p.name.starts_with("planet_offset_") && p.fixed)
                .map(|p| p.name.as_str())
                .collect();
            if held.is_empty() {
                format!("The planet's place relative to the Sun is fitted (two offsets, --planet-place free), so no error of the ephemeris ({ephemeris}) enters the parallax, at the cost of a larger uncertainty.")
            } else {
                format!("The planet's place relative to the Sun was to be fitted (--planet-place free), but these timings cannot determine {}, so {} held at the ephemeris's value ({ephemeris}), as the warnings say.", held.join(" or "), if held.len() == 1 { "it is" } else { "both are" })
            }
        }
        PlanetPlace::Fixed => format!("The planet's place relative to the Sun is held at the ephemeris's value (--planet-place fixed): {ephemeris}.{}", risk(red.place_bias_arcsec)),
        PlanetPlace::Prior(sigma) => format!("The planet's place relative to the Sun is fitted with a prior of {sigma}\" on each offset (--planet-place prior={sigma}): {ephemeris}.{}", risk(red.place_bias_arcsec)),
    }
}

/// The result, the chi-square and the warnings.
fn headline_section(red: &Reduction, s: &mut String) {
    s.push_str(&format!(
        "Reduction of {} of the transit of {} on {} (greatest transit {})\n\n",
        count(red.timings_total, "timing", "timings"),
        red.event.planet.title(),
        red.event.date(),
        red.event.greatest_utc()
    ));
    match red.headline() {
        Some(h) => {
            let (lo, hi) = h.parallax_interval_95;
            let clipped = if lo <= 0.0 { ", clipped at zero" } else { "" };
            s.push_str(&format!(
                "  solar parallax      {:.4}\" +- {:.4}\"   (95 %: {lo:.4}\" to {hi:.4}\"{clipped})\n",
                h.parallax_arcsec, h.parallax_sigma_arcsec
            ));
            s.push_str(&format!("  astronomical unit   {}\n", au_text(&h, "+-")));
        }
        None => {
            s.push_str("  solar parallax      not determined by these timings (see the warnings)\n")
        }
    }
    s.push_str(&format!(
        "  timings used        {} of {} ({} not used)\n",
        red.timings_used,
        red.timings_total,
        red.rejected.len()
    ));
    s.push_str(&format!(
        "  chi-square          {}\n",
        red.statistics.describe()
    ));
    s.push_str(&format!("  {}\n", chi2_sentence(red)));
    s.push_str(&format!(
        "  ephemeris           {}\n",
        red.event.ephemeris_name()
    ));
    s.push_str(&format!("  {}\n", place_sentence(red)));
    for w in &red.warnings {
        s.push_str(&format!("  warning: {w}\n"));
    }
}

/// The parameters and their correlations.
fn parameters_section(red: &Reduction, s: &mut String) {
    s.push_str("\nParameters\n");
    for (j, p) in red.parameters.iter().enumerate() {
        if let Some((other, r)) = red.inseparable(j) {
            s.push_str(&format!(
                "  {:<30} {:>12}    (correlated {r:+.4} with {other}: only their combination is determined)\n",
                p.name, "-"
            ));
            continue;
        }
        match p.sigma {
            Some(sig) => s.push_str(&format!(
                "  {:<30} {:>12.5} +- {:.5} {}\n",
                p.name, p.value, sig, p.unit
            )),
            None => s.push_str(&format!(
                "  {:<30} {:>12.5}    ({})\n",
                p.name,
                p.value,
                if p.fixed {
                    "held fixed"
                } else {
                    "not determined by these timings"
                }
            )),
        }
    }
    let corrections = longitude_corrections(red);
    for st in &red.stations {
        if let Some(&(c, sigma)) = corrections.get(st.station.as_str()) {
            let Some(sigma) = sigma else {
                s.push_str(&format!(
                    "  longitude of {}: given {:.4}; its correction is not determined by these timings\n",
                    st.station, st.longitude_deg
                ));
                continue;
            };
            let sigma = format!("+- {sigma:.4} deg");
            s.push_str(&format!(
                "  longitude of {}: given {:.4}, correction {c:+.4} {sigma}, so {:.4} deg\n",
                st.station,
                st.longitude_deg,
                st.longitude_deg + c
            ));
        }
    }
    black_drop_lines(red, s);
    s.push_str("\nCorrelations\n  ");
    for i in 0..red.correlation.len() {
        s.push_str(&format!("{:>8}", format!("p{}", i + 1)));
    }
    s.push('\n');
    for (i, row) in red.correlation.iter().enumerate() {
        s.push_str(&format!("  p{} ", i + 1));
        for x in row {
            s.push_str(&format!("{x:>8.3}"));
        }
        s.push('\n');
    }
    s.push_str(&format!(
        "  (p1..p{} in the order of the parameters above)\n",
        red.correlation.len()
    ));
    for note in correlation_notes(red) {
        s.push_str(&format!("  {note}\n"));
    }
}

/// The black drop's lags, one line each: the fitted lag, or why it is not determined.
pub fn black_drop_lines(red: &Reduction, s: &mut String) {
    for line in black_drop_sentences(red) {
        s.push_str(&format!("  {line}\n"));
    }
}

/// One sentence per black-drop lag (shared by the table and the reports).
pub fn black_drop_sentences(red: &Reduction) -> Vec<String> {
    red.black_drop
        .iter()
        .map(|b| {
            let what = format!(
                "black drop: contact {} judged '{}'",
                Contact::parse(&b.contact.to_string()).map_or("?", Contact::roman),
                b.contact_judged
            );
            match (b.delay_s, b.sigma_s) {
                (Some(d), Some(sigma)) => {
                    let behind = match b.relative_to {
                        Some(r) => format!("the timings judged '{r}'"),
                        None => "the geometric contact".to_string(),
                    };
                    // Two significant figures of the uncertainty, at least one decimal.
                    let dec = crate::render::text::decimals_for(sigma).saturating_sub(1).max(1);
                    format!(
                        "{what}: seen {d:+.dec$} s +- {sigma:.dec$} s after {behind} (positive: later)"
                    )
                }
                _ => format!("{what}: {}", b.note.as_deref().unwrap_or("not determined")),
            }
        })
        .collect()
}

/// A sentence for each pair of fitted parameters whose correlation prints as +-1.000: the
/// timings fix their combination, not each alone. Between the planet's cross-path offset and
/// the radius corrections this is usual (the chord's shift across the disc moves the contacts
/// almost as the radii do) and the parallax's uncertainty allows for it; a parallax that only
/// a combination determines is reported as not determined by the reduction itself.
pub fn correlation_notes(red: &Reduction) -> Vec<String> {
    let c = &red.correlation;
    let mut notes = Vec::new();
    let fitted = |k: usize| red.parameters.get(k).is_some_and(|p| !p.fixed);
    for (a, row) in c.iter().enumerate() {
        for (b, &r) in row.iter().enumerate().skip(a + 1) {
            if fitted(a) && fitted(b) && r.abs() >= 0.9995 {
                notes.push(format!(
                    "{} and {} correlate at {r:+.3}: the timings fix their combination, not each alone (usual for the planet's offset and the radius corrections; the parallax's uncertainty allows for it)",
                    red.parameters[a].name, red.parameters[b].name
                ));
            }
        }
    }
    notes
}

/// The stations ranked by their share of the information.
fn stations_section(red: &Reduction, s: &mut String) {
    s.push_str("\nStations by share of the information on the parallax\n");
    s.push_str(&format!(
        "  {} {:>4} {:>8} {:>12} {:>10}  {}\n",
        name_cell("station"),
        "n",
        "share",
        "influence\"",
        "mean z",
        "O-C (s) by contact"
    ));
    for st in &red.stations {
        let name = name_cell(&st.station);
        if let Some(why) = &st.not_used {
            s.push_str(&format!("  {name}    0  not used: {why}\n"));
            continue;
        }
        let oc: Vec<String> = st
            .contact_labels
            .iter()
            .zip(&st.residuals_s)
            .map(|(c, r)| format!("{}:{:+.1}", c, r))
            .collect();
        s.push_str(&format!(
            "  {} {:>4} {:>8.4} {:>12} {:>10.2}  {}\n",
            name,
            st.timings,
            st.information_share,
            st.influence_arcsec
                .map(|x| format!("{x:+.5}"))
                .unwrap_or_else(|| "-".into()),
            st.mean_normalised_residual,
            oc.join(" ")
        ));
    }
}

/// A readable report for the terminal.
pub fn reduction_table(red: &Reduction) -> String {
    let mut s = String::new();
    headline_section(red, &mut s);
    parameters_section(red, &mut s);
    stations_section(red, &mut s);
    s.push_str(&crate::render::residual_groups::groups_text(red));
    crate::render::methods::methods_section(red, &mut s);
    crate::render::what_else::what_else_section(red, &mut s);
    if !red.rejected.is_empty() {
        s.push_str("\nRows not used\n");
        for x in &red.rejected {
            s.push_str(&format!(
                "  line {:>5}  {} contact {:<2} {:<11} {}\n",
                x.line,
                name_cell(&x.station),
                x.contact_label
                    .clone()
                    .or_else(|| x.contact.map(|c| c.to_string()))
                    .unwrap_or_else(|| "-".into()),
                x.reason.as_str(),
                x.diagnosis.clone().unwrap_or_default()
            ));
        }
    }
    s.push('\n');
    s.push_str(SAFETY_CAUTION);
    s.push('\n');
    s
}

/// One sentence on what the chi-square says.
pub fn chi2_sentence(red: &Reduction) -> String {
    let st = &red.statistics;
    match (st.birge_ratio, st.p_value) {
        (Some(b), Some(_)) if st.too_large() && b > 1.0 => format!(
            "The timings scatter more than their stated uncertainties allow (by a factor {b:.2}); the uncertainties above are scaled up to match."
        ),
        (Some(b), Some(_)) if st.too_small() => format!(
            "The timings scatter less than their stated uncertainties allow (by a factor {b:.2}; a chi-square this small has probability {} if they were right): the stated uncertainties are probably too large, and so is the parallax's, which is not scaled down.",
            crate::reduction::statistics::probability(st.p_lower.unwrap_or(0.0))
        ),
        (Some(_), Some(_)) => format!(
            "The scatter of the timings about the solution agrees with their stated uncertainties (chi-square {:.1} for {}).",
            st.chi2,
            count(st.dof, "degree of freedom", "degrees of freedom")
        ),
        _ => "With no degrees of freedom the fit cannot check the stated uncertainties.".to_string(),
    }
}

/// CSV of a reduction: one row per timing in the order of the file, with its station,
/// contact, state (`used`, or the reason it was not used), O - C and sigma (s) and the
/// diagnosis.
pub fn reduction_csv(red: &Reduction) -> String {
    let mut rows: Vec<(u64, String)> = Vec::new();
    for u in &red.used {
        rows.push((
            u.line,
            format!(
                "{},{},{},used,,{:.2},{:.2},",
                u.line,
                csv_field(&u.station),
                u.contact_label,
                u.o_c_s,
                u.sigma_s
            ),
        ));
    }
    for x in &red.rejected {
        rows.push((
            x.line,
            format!(
                "{},{},{},rejected,{},{},,{}",
                x.line,
                csv_field(&x.station),
                x.contact_label
                    .clone()
                    .or_else(|| x.contact.map(|c| c.to_string()))
                    .unwrap_or_default(),
                x.reason.as_str(),
                x.o_c_s.map(|v| format!("{v:.2}")).unwrap_or_default(),
                csv_field(x.diagnosis.as_deref().unwrap_or(""))
            ),
        ));
    }
    rows.sort_by_key(|r| r.0);
    let mut s = String::from("line,station,contact,state,reason,o_c_s,sigma_s,diagnosis\n");
    for (_, r) in rows {
        s.push_str(&r);
        s.push('\n');
    }
    s
}
