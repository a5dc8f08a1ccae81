//! The public results page, `GET /results`: no token, nothing private. The running solar
//! parallax and astronomical unit with their uncertainties (or "not determined" and why), the
//! counts (stations, timings, submissions), the map of the stations and their table with the
//! coordinates rounded to 0.1 degree, the convergence of the solution, the time the solution
//! was computed and the changes not yet in it. No submission key, no participant's note, no
//! observer's name: only the stations' names (which participants give "as they want them
//! listed"), their rounded places and the solution's figures.
//!
//! The page's section of each version is made once by the reducer (`cache.rs`, beside the
//! organiser's charts), the convergence chart once by the report's renderer; a request only
//! joins the newest of each with the "as of" sentence. The page reloads itself (`Refresh`
//! header, no script).

use super::cache::Solved;
use super::network_plan::{as_of_sentence, places_map_svg};
use super::pages::{page, scroll_box};
use super::server::App;
use super::store::StoredTiming;
use super::store_registrations::NetworkStation;
use crate::reduction::Reduction;
use crate::render::charts::{convergence_svg, station_map_svg};
use crate::render::svg::esc;
use crate::render::text::au_text;
use axum::body::Body;
use axum::http::{header, HeaderMap, HeaderValue};
use axum::response::Response;
use std::collections::HashSet;
use std::fmt::Write;

/// Seconds between the page's reloads while changes wait to be reduced, and otherwise.
pub const REFRESH_PENDING_S: u32 = 10;
/// Seconds between the page's reloads when the solution is up to date.
pub const REFRESH_SETTLED_S: u32 = 60;

/// A coordinate rounded to 0.1 degree, as the public page shows every place.
pub fn public_deg(x: f64) -> f64 {
    (x * 10.0).round() / 10.0
}

/// The headline: the parallax and the AU with their uncertainties, or why they are not
/// determined.
fn headline(red: Option<&Reduction>, error: Option<&str>) -> String {
    let Some(red) = red else {
        let why = error.unwrap_or("no timing has been reduced yet");
        return format!(
            "<p id=\"parallax\">The solar parallax and the astronomical unit are not determined yet: {}.</p>\n",
            esc(why.trim_end_matches('.'))
        );
    };
    match red.headline() {
        Some(h)
            if h.parallax_sigma_arcsec.is_finite()
                && h.parallax_sigma_arcsec > 0.0
                && h.parallax_arcsec.is_finite() =>
        {
            format!(
                "<table class=\"headline\"><tr><th scope=\"row\">solar parallax</th><td id=\"parallax\">{:.4}\" ± {:.4}\"</td></tr><tr><th scope=\"row\">astronomical unit</th><td id=\"au\">{}</td></tr><tr><th scope=\"row\">timings used</th><td id=\"n-used\">{} of {}</td></tr></table>\n",
                h.parallax_arcsec,
                h.parallax_sigma_arcsec,
                esc(&au_text(&h, "±")),
                red.timings_used,
                red.timings_total
            )
        }
        _ => {
            let why = red
                .warnings
                .last()
                .map_or("the timings in force do not determine it", String::as_str);
            let stations = red.stations.iter().filter(|s| s.timings > 0).count();
            let need = match stations {
                0 => " Timings from at least two stations far apart are needed; no station has sent usable ones yet.",
                1 => " Timings from at least two stations far apart are needed; one station has sent usable ones so far.",
                _ => "",
            };
            format!(
                "<p id=\"parallax\">The solar parallax is not determined yet, and so neither is the astronomical unit: {}.{need}</p>\n",
                esc(why.trim_end_matches('.'))
            )
        }
    }
}

/// The stations of the solution with their places rounded to 0.1 degree (for the map and the
/// table), without their observers.
fn public_stations(red: &Reduction) -> Reduction {
    let mut public = red.clone();
    for s in &mut public.stations {
        s.latitude_deg = public_deg(s.latitude_deg);
        s.longitude_deg = public_deg(s.longitude_deg);
        s.elevation_m = 0.0;
        s.observers.clear();
    }
    public
}

/// The stations as plain places (for the map drawn while the parallax is not determined).
fn places(red: &Reduction) -> Vec<NetworkStation> {
    red.stations
        .iter()
        .map(|s| NetworkStation {
            station: s.station.clone(),
            latitude_deg: s.latitude_deg,
            longitude_deg: s.longitude_deg,
            registered: true,
            reported: true,
        })
        .collect()
}

/// The stations' table; the shares of the information only where the parallax is
/// `determined` (else there is no information on it to share).
fn stations_table(red: &Reduction, determined: bool) -> String {
    let mut t = String::from("<table id=\"stations\"><tr><th scope=\"col\">station</th><th scope=\"col\">latitude (0.1°)</th><th scope=\"col\">longitude (0.1°)</th><th scope=\"col\">timings used</th><th scope=\"col\">share of the information</th></tr>\n");
    for s in &red.stations {
        let share = if !determined {
            "not determined".to_string()
        } else if s.timings > 0 && s.information_share.is_finite() {
            format!("{:.1} %", 100.0 * s.information_share)
        } else {
            "none".to_string()
        };
        let _ = writeln!(
            t,
            "<tr><td>{}</td><td>{:.1}</td><td>{:.1}</td><td>{}</td><td>{share}</td></tr>",
            esc(&s.station),
            s.latitude_deg,
            s.longitude_deg,
            s.timings
        );
    }
    t.push_str("</table>\n");
    scroll_box("The stations", &t)
}

/// The public section of one solved version (made once, by the reducer): the headline, the
/// counts, the map and the stations' table. `timings` are the timings in force.
pub fn public_section(solved: &Solved, timings: &[StoredTiming]) -> String {
    let reduced: Vec<&StoredTiming> = timings.iter().filter(|t| t.excluded.is_none()).collect();
    let stations: HashSet<String> = reduced
        .iter()
        .map(|t| super::store_registrations::name_key(&t.fields.station))
        .collect();
    let red = solved.reduction.as_deref();
    let why = if reduced.is_empty() {
        Some("no timings have arrived yet")
    } else {
        solved
            .error
            .as_deref()
            .map(|e| e.strip_prefix("<campaign>: ").unwrap_or(e))
    };
    let mut s = headline(red, why);
    let _ = writeln!(
        s,
        "<p id=\"counts\">Stations: <b id=\"n-stations\">{}</b>; timings in force: <b id=\"n-timings\">{}</b>; submissions: <b id=\"n-submissions\">{}</b>.</p>",
        stations.len(),
        reduced.len(),
        solved.submissions
    );
    if let Some(red) = red.filter(|r| !r.stations.is_empty()) {
        let public = public_stations(red);
        let determined = red.headline().is_some();
        let map = if determined {
            station_map_svg(&public)
        } else {
            places_map_svg(&places(&public))
        };
        let _ = writeln!(
            s,
            "<h2>The stations</h2>\n<figure id=\"map\">{map}<figcaption>The stations, each at its place rounded to 0.1 degree.</figcaption></figure>"
        );
        s.push_str(&stations_table(&public, determined));
    }
    s
}

/// The convergence chart of a reduction (made once per version by the report's renderer).
pub fn convergence_html(red: &Reduction) -> Option<String> {
    red.parallax_arcsec?;
    Some(convergence_svg(red))
}

/// `GET /results`: the newest section and convergence chart, the "as of" sentence, the
/// version headers and `Refresh`.
pub fn results(app: &App, headers: &HeaderMap) -> Response {
    let solved = app.cache.solved();
    let rendered = app.cache.rendered();
    let pending = app.pending_changes();
    let mut body = format!(
        "<p id=\"as-of\">{}</p>\n",
        as_of_sentence(&solved.solved_utc, solved.version, pending)
    );
    if solved.version == 0 {
        body.push_str(&headline(
            None,
            Some("the first solution is being computed"),
        ));
    }
    body.push_str(&solved.public_html);
    if let Some(chart) = rendered.convergence_html.as_deref() {
        let note = if rendered.version == solved.version {
            String::new()
        } else {
            format!(
                " Drawn for an earlier version of the data ({}); the newest is being drawn.",
                rendered.version
            )
        };
        let _ = writeln!(body, "<h2>How the solution converged</h2>\n<figure id=\"convergence\">{chart}<figcaption>The solar parallax and its uncertainty as the timings are added.{note}</figcaption></figure>");
    }
    body.push_str("<p><a href=\"/register\">Register a station</a> · <a href=\"/\">Send your timings</a></p>\n");
    let html = page("Results: the solar parallax so far", &body);
    let etag = format!("\"r{}-{}-{}\"", solved.version, rendered.version, pending);
    let mut res = super::cached::versioned(
        headers,
        (etag, solved.version, pending),
        "text/html; charset=utf-8",
        move || Body::from(html),
    );
    let refresh = if pending > 0 {
        REFRESH_PENDING_S
    } else {
        REFRESH_SETTLED_S
    };
    res.headers_mut()
        .insert(header::REFRESH, HeaderValue::from(refresh));
    res
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn places_are_rounded_to_a_tenth_and_thin_data_is_not_determined() {
        assert_eq!(public_deg(35.6789), 35.7);
        assert_eq!(public_deg(-157.8612), -157.9);
        let s = headline(None, Some("<campaign>: no rows."));
        assert!(
            s.contains("not determined yet: &lt;campaign&gt;: no rows.</p>"),
            "{s}"
        );
    }
}
