//! Rendering of campaign plans, sensitivity grids and Monte Carlo forecasts (table, CSV, JSON).

use crate::geometry::transit::TransitEvent;
use crate::planning::simulation::{MonteCarloSummary, SimulationSettings};
use crate::planning::sites::{GridPoint, Plan};
use crate::render::text::{
    clock_label, csv_field, decimals_for, km_to_three_digits, name_cell, round as r, scale_of,
    thousands, SAFETY_CAUTION,
};
use crate::sky::constants::AU_KM;
use crate::time::iso::format_utc;
use crate::words::count;
use serde_json::{json, Value};

/// The columns of `plan` CSV output, in order.
pub const PLAN_COLUMNS: &str =
    "station,contact,time_utc,sun_altitude_deg,sensitivity_s_per_arcsec,visible,gain_percent,chosen,ephemeris";

/// CSV of a plan: one row per site and contact that occurs there.
pub fn plan_csv(event: &TransitEvent, plan: &Plan) -> String {
    let mut s = String::from(PLAN_COLUMNS);
    s.push('\n');
    let ephemeris = csv_field(&event.ephemeris_name());
    for (i, site) in plan.sites.iter().enumerate() {
        for c in &site.contacts {
            s.push_str(&format!(
                "{},{},{},{:.3},{:.3},{},{},{},{ephemeris}\n",
                csv_field(&site.station.name),
                c.contact.number(),
                format_utc(event.label(c.hours), 2),
                c.sun_altitude_deg,
                c.sensitivity_s_per_arcsec,
                c.visible,
                site.gain_percent
                    .map(|g| format!("{g:.3}"))
                    .unwrap_or_default(),
                plan.chosen.contains(&i)
            ));
        }
    }
    s
}

/// JSON of a plan.
pub fn plan_json(event: &TransitEvent, plan: &Plan, min_altitude_deg: f64) -> Value {
    let sites: Vec<Value> = plan
        .sites
        .iter()
        .enumerate()
        .map(|(i, site)| {
            let mut v = json!({
                "station": site.station.name,
                "latitude": site.station.latitude_deg,
                "longitude": site.station.longitude_deg,
                "gain_percent": site.gain_percent.map(|g| r(g, 3)),
                "chosen": plan.chosen.contains(&i),
                "contacts": site.contacts.iter().map(|c| json!({
                    "contact": c.contact.number(),
                    "time_utc": format_utc(event.label(c.hours), 2),
                    "sun_altitude_deg": r(c.sun_altitude_deg, 3),
                    "sensitivity_s_per_arcsec": r(c.sensitivity_s_per_arcsec, 3),
                    "visible": c.visible,
                })).collect::<Vec<_>>(),
            });
            if let Some(p) = &site.positions {
                let at = |h: f64| format_utc(event.label(h), 0);
                v["images"] = json!(p.count);
                v["images_from_utc"] = json!(p.window_hours.map(|w| at(w.0)));
                v["images_to_utc"] = json!(p.window_hours.map(|w| at(w.1)));
            }
            v
        })
        .collect();
    let mut out = json!({
        "planet": event.planet.name(),
        "transit_date": event.date().to_string(),
        "ephemeris": event.ephemeris_name(),
        "sigma_s": plan.sigma_s,
        "min_altitude_deg": min_altitude_deg,
        "sites": sites,
        "forecast_all_sites_sigma_arcsec": plan.all_sites_sigma_arcsec.map(|x| r(x, 6)),
        "chosen": plan.chosen.iter().map(|&i| plan.sites[i].station.name.clone()).collect::<Vec<_>>(),
        "forecast_parallax_sigma_arcsec": plan.chosen_sigma_arcsec.map(|x| r(x, 6)),
        "forecast_au_sigma_km": plan.chosen_sigma_arcsec.map(|x| r(au_sigma_km(x), 0)),
        "reasons": plan.reasons,
    });
    if let (Some(im), Some(m)) = (plan.imaging, plan.by_method) {
        out["measure"] = json!(plan.measure.name());
        out["positions_every_s"] = json!(im.every_s);
        out["sigma_solar_radii"] = json!(im.sigma_solar_radii);
        out["forecast_by_method"] = json!({
            "sites": if plan.chosen.is_empty() { "every site" } else { "chosen" },
            "contacts_sigma_arcsec": m.contacts.map(|x| r(x, 6)),
            "positions_sigma_arcsec": m.positions.map(|x| r(x, 6)),
            "both_sigma_arcsec": m.both.map(|x| r(x, 6)),
        });
    }
    out
}

fn au_sigma_km(parallax_sigma_arcsec: f64) -> f64 {
    let pi = crate::sky::constants::nominal_parallax_arcsec() * crate::sky::constants::ARCSEC_RAD;
    AU_KM * parallax_sigma_arcsec * crate::sky::constants::ARCSEC_RAD / pi.tan()
}

/// The forecast by each way of measuring (with images), below the table of sites.
fn method_summary(plan: &Plan, s: &mut String) {
    let Some(m) = plan.by_method else {
        return;
    };
    let which = if plan.chosen.is_empty() {
        "every site"
    } else {
        "the chosen sites"
    };
    s.push_str(&format!(
        "\nForecast for {which} by what is measured (the choice above counts {}):\n",
        plan.measure.name()
    ));
    for (what, sigma) in [
        ("contacts alone", m.contacts),
        ("positions alone", m.positions),
        ("both together", m.both),
    ] {
        match sigma {
            Some(x) => s.push_str(&format!(
                "  {what:<16} parallax +- {x:.d$}\" (AU +- {})\n",
                km_to_three_digits(au_sigma_km(x)),
                d = decimals_for(x)
            )),
            None => s.push_str(&format!("  {what:<16} not determined\n")),
        }
    }
}

/// The forecasts and the reasons for the choice, below the table of sites.
fn plan_summary(plan: &Plan, s: &mut String) {
    s.push_str("\n#: the site's number on the map (`--map`), in the order of the sites file.\ngain %: how much larger the forecast uncertainty of the whole candidate network would be without the site.\n");
    if let Some(a) = plan.all_sites_sigma_arcsec {
        s.push_str(&format!(
            "Forecast with every site: parallax +- {a:.d$}\" (AU +- {}).\n",
            km_to_three_digits(au_sigma_km(a)),
            d = decimals_for(a)
        ));
    }
    if !plan.chosen.is_empty() {
        let names: Vec<&str> = plan
            .chosen
            .iter()
            .map(|&i| plan.sites[i].station.name.as_str())
            .collect();
        s.push_str(&format!(
            "\nChosen ({}, marked *): {}\n",
            names.len(),
            names.join(", ")
        ));
        match plan.chosen_sigma_arcsec {
            Some(x) => s.push_str(&format!(
                "Forecast for the chosen sites: parallax +- {x:.d$}\" (AU +- {}).\n",
                km_to_three_digits(au_sigma_km(x)),
                d = decimals_for(x)
            )),
            None => s.push_str("The chosen sites cannot determine the parallax by themselves.\n"),
        }
        for reason in &plan.reasons {
            s.push_str(&format!("  - {reason}\n"));
        }
    }
}

/// A site's images, below its contacts.
fn images_line(event: &TransitEvent, p: &crate::planning::imaging::SitePositions) -> String {
    let pad = " ".repeat(4 + name_cell("").chars().count() + 2);
    match p.window_hours {
        Some((a, b)) => format!(
            "{pad}images: {} from {} to {}\n",
            p.count,
            clock_label(event.label(a), 0),
            clock_label(event.label(b), 0)
        ),
        None => format!("{pad}images: none (the planet not wholly on the disc with the Sun up)\n"),
    }
}

/// A readable plan.
pub fn plan_table(event: &TransitEvent, plan: &Plan, min_altitude_deg: f64) -> String {
    let images = plan.imaging.map_or(String::new(), |i| {
        format!(
            "; an image every {} s with separations to {} solar radii",
            i.every_s, i.sigma_solar_radii
        )
    });
    let counted = if plan.imaging.is_some() {
        "contacts and images"
    } else {
        "contacts"
    };
    let mut s = format!(
        "Planning for the transit of {} on {} (timings of {:.0} s assumed{images}; {counted} counted with the Sun at least {:.0} deg up; ephemeris {})\n\n",
        event.planet.title(),
        event.date(),
        plan.sigma_s,
        min_altitude_deg,
        event.ephemeris_name()
    );
    s.push_str(&format!(
        "{:>3} {}  {:>3} {:>26} {:>8} {:>9} {:>8}\n",
        "#",
        name_cell("site"),
        "",
        format!(
            "time ({})",
            scale_of(event.label(event.hours_of_greatest()))
        ),
        "Sun alt",
        "s/arcsec",
        "gain %"
    ));
    for (i, site) in plan.sites.iter().enumerate() {
        let name = name_cell(&site.station.name);
        let mark = if plan.chosen.contains(&i) { "*" } else { " " };
        for (k, c) in site.contacts.iter().enumerate() {
            s.push_str(&format!(
                "{:>3} {}{} {:>3} {:>26} {:>8.1} {:>9.2} {:>8}{}\n",
                if k == 0 {
                    (i + 1).to_string()
                } else {
                    String::new()
                },
                if k == 0 { name.clone() } else { name_cell("") },
                if k == 0 { mark } else { " " },
                c.contact.roman(),
                clock_label(event.label(c.hours), 1),
                c.sun_altitude_deg,
                c.sensitivity_s_per_arcsec,
                if k == 0 {
                    site.gain_percent
                        .map(|g| format!("{g:.2}"))
                        .unwrap_or_else(|| "-".into())
                } else {
                    String::new()
                },
                if c.visible {
                    ""
                } else {
                    "  (too low or below horizon)"
                }
            ));
        }
        if site.contacts.is_empty() {
            s.push_str(&format!(
                "{:>3} {name}{mark} no contact of this transit here\n",
                i + 1
            ));
        }
        if let Some(p) = &site.positions {
            s.push_str(&images_line(event, p));
        }
    }
    plan_summary(plan, &mut s);
    method_summary(plan, &mut s);
    s.push('\n');
    s.push_str(SAFETY_CAUTION);
    s.push('\n');
    s
}

/// CSV of a sensitivity grid.
pub fn grid_csv(event: &TransitEvent, points: &[GridPoint], min_altitude_deg: f64) -> String {
    let mut s = String::from(
        "latitude,longitude,time_utc,sun_altitude_deg,sensitivity_s_per_arcsec,visible,ephemeris\n",
    );
    let ephemeris = csv_field(&event.ephemeris_name());
    for p in points {
        match p.hours {
            Some(h) => s.push_str(&format!(
                "{:.4},{:.4},{},{:.3},{:.3},{},{ephemeris}\n",
                p.latitude_deg,
                p.longitude_deg,
                format_utc(event.label(h), 1),
                p.sun_altitude_deg,
                p.sensitivity_s_per_arcsec,
                p.sun_altitude_deg >= min_altitude_deg
            )),
            None => s.push_str(&format!(
                "{:.4},{:.4},,,,false,{ephemeris}\n",
                p.latitude_deg, p.longitude_deg
            )),
        }
    }
    s
}

/// JSON of a Monte Carlo forecast.
pub fn simulation_json(
    event: &TransitEvent,
    m: &MonteCarloSummary,
    settings: &SimulationSettings,
    stations: usize,
    seed: u64,
) -> Value {
    json!({
        "planet": event.planet.name(),
        "transit_date": event.date().to_string(),
        "ephemeris": event.ephemeris_name(),
        "stations": stations,
        "trials": m.trials,
        "trials_solved": m.solved,
        "seed": seed,
        "mean_timings_per_campaign": r(m.mean_timings, 2),
        "au_true_km": AU_KM,
        "au_mean_km": m.au_bias_km.map(|b| r(AU_KM + b, 0)),
        "au_bias_km": m.au_bias_km.map(|b| r(b, 0)),
        "au_sigma_forecast_km": m.au_sigma_forecast_km.map(|x| r(x, 0)),
        "au_scatter_km": m.au_scatter_km.map(|x| r(x, 0)),
        "coverage_95": m.coverage_95.map(|x| r(x, 4)),
        "departures": m.departures(settings, stations),
        "blunders_injected": m.blunders_injected,
        "blunders_caught": m.blunders_caught,
        "blunders_caught_share": if m.blunders_injected > 0 { Some(r(m.blunders_caught as f64 / m.blunders_injected as f64, 4)) } else { None },
        "settings": {
            "sigma_s": settings.sigma_s,
            "black_drop_bias_s": settings.black_drop_bias_s,
            "min_altitude_deg": settings.min_altitude_deg,
            "weather_loss": settings.weather_loss,
            "blunder_rate": settings.blunder_rate,
            "clock_error_rate": settings.clock_error_rate,
            "clock_error_s": settings.clock_error_s,
        },
    })
}

/// A readable Monte Carlo forecast, with a sentence wherever the campaigns depart from it.
pub fn simulation_table(
    event: &TransitEvent,
    m: &MonteCarloSummary,
    settings: &SimulationSettings,
    stations: usize,
) -> String {
    let mut s = format!(
        "Monte Carlo forecast: {} of {}, transit of {} on {} (ephemeris {})\n\n",
        count(m.trials, "simulated campaign", "simulated campaigns"),
        count(stations, "station", "stations"),
        event.planet.title(),
        event.date(),
        event.ephemeris_name()
    );
    s.push_str(&format!(
        "  timings per campaign (mean)     {:.1}\n",
        m.mean_timings
    ));
    s.push_str(&format!(
        "  campaigns reduced               {} of {}\n",
        m.solved, m.trials
    ));
    let km = |x: Option<f64>, what: &str| match x {
        Some(v) => format!("{} km", thousands(v)),
        None => format!("not determined ({what})"),
    };
    s.push_str(&format!(
        "  forecast AU uncertainty         {} (median of the stated sigmas)\n",
        km(m.au_sigma_forecast_km, "no campaign gave a parallax")
    ));
    s.push_str(&format!(
        "  scatter of the AU estimates     {}\n",
        km(m.au_scatter_km, "fewer than two campaigns gave a parallax")
    ));
    let bias = m.au_bias_km.map(|b| {
        format!(
            "{}{} km",
            if b >= 0.0 { "+" } else { "-" },
            thousands(b.abs())
        )
    });
    s.push_str(&format!(
        "  bias of the mean AU             {}\n",
        bias.unwrap_or_else(|| "not determined (no campaign gave a parallax)".into())
    ));
    if let Some(c) = m.coverage_95 {
        s.push_str(&format!(
            "  95 % intervals holding the AU   {:.1} %\n",
            100.0 * c
        ));
    }
    if m.blunders_injected > 0 {
        s.push_str(&format!(
            "  blunders caught                 {} of {} ({:.1} %)\n",
            m.blunders_caught,
            m.blunders_injected,
            100.0 * m.blunders_caught as f64 / m.blunders_injected as f64
        ));
    }
    for d in m.departures(settings, stations) {
        s.push_str(&format!("  note: {d}\n"));
    }
    s.push('\n');
    s.push_str(SAFETY_CAUTION);
    s.push('\n');
    s
}

/// CSV of a Monte Carlo series: one row per trial (trial k used seed `seed + k`).
pub fn simulation_csv(m: &MonteCarloSummary, seed: u64, ephemeris: &str) -> String {
    let mut s = String::from(
        "trial,seed,timings,solved,au_km,au_sigma_km,interval_holds_truth,blunders_injected,blunders_caught,ephemeris\n",
    );
    let ephemeris = csv_field(ephemeris);
    for (k, (out, injected, caught, timings)) in m.per_trial.iter().enumerate() {
        let (solved, au, sigma, holds) = match out {
            Some((au, sigma, holds)) => (
                "true",
                format!("{au:.0}"),
                format!("{sigma:.0}"),
                holds.to_string(),
            ),
            None => ("false", String::new(), String::new(), String::new()),
        };
        s.push_str(&format!(
            "{},{},{timings},{solved},{au},{sigma},{holds},{injected},{caught},{ephemeris}\n",
            k + 1,
            seed.wrapping_add(k as u64)
        ));
    }
    s
}
