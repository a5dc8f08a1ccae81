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
use super::network_plan::{as_of_sentence_in, places_map_svg};
use super::pages::{page_in, scroll_box};
use super::server::App;
use super::store::StoredTiming;
use super::store_registrations::NetworkStation;
use crate::language::numbers::decimal;
use crate::language::{text, Args, Language};
use crate::reduction::{Headline, Reduction};
use crate::render::charts::{convergence_svg_in, station_map_svg_in};
use crate::render::svg::esc;
use crate::render::text::decimals_for;
use axum::body::Body;
use axum::http::{header, HeaderMap, HeaderValue};
use axum::response::Response;
use std::collections::HashSet;
use std::fmt::Write;
use std::sync::OnceLock;

/// Seconds between the page's reloads while changes wait to be reduced, and otherwise.
pub const REFRESH_PENDING_S: u32 = 10;
/// Seconds between the page's reloads when the solution is up to date.
pub const REFRESH_SETTLED_S: u32 = 60;

/// A coordinate rounded to 0.1 degree, as the public page shows every place.
pub fn public_deg(x: f64) -> f64 {
    (x * 10.0).round() / 10.0
}

/// A message of the results page in `language`, with `args`.
fn t(language: Language, id: &str, args: Args) -> String {
    text(language, id, &args)
}

/// The astronomical unit with its uncertainty and 95 % interval, in million km, written for
/// the language (or why it is not given).
fn au_in(language: Language, h: &Headline) -> String {
    let Some(au) = h.au else {
        return esc(&t(language, "results-au-not-given", Args::new()));
    };
    let m = 1e-6;
    let d = decimals_for(au.au_sigma_km * m);
    let n = |x: f64| decimal(language, x * m, d);
    let (lo, hi) = au.au_interval_95_km;
    let args = Args::new()
        .text("au", n(au.au_km))
        .text("sigma", n(au.au_sigma_km))
        .text("lo", n(lo));
    esc(&match hi {
        Some(hi) => t(language, "results-au-value", args.text("hi", n(hi))),
        None => t(language, "results-au-value-open", args),
    })
}

/// The headline: the parallax and the AU with their uncertainties, or why they are not
/// determined.
fn headline(language: Language, red: Option<&Reduction>, why: Option<&str>) -> String {
    let Some(red) = red else {
        let why = why.map_or_else(
            || t(language, "results-no-timing-reduced", Args::new()),
            str::to_string,
        );
        let sentence = t(
            language,
            "results-not-determined",
            Args::new().text("why", why.trim_end_matches('.')),
        );
        return format!("<p id=\"parallax\">{}</p>\n", esc(&sentence));
    };
    match red.headline() {
        Some(h)
            if h.parallax_sigma_arcsec.is_finite()
                && h.parallax_sigma_arcsec > 0.0
                && h.parallax_arcsec.is_finite() =>
        {
            let used = t(
                language,
                "results-used-of",
                Args::new()
                    .text("used", decimal(language, red.timings_used as f64, 0))
                    .text("total", decimal(language, red.timings_total as f64, 0)),
            );
            format!(
                "<table class=\"headline\"><tr><th scope=\"row\">{}</th><td id=\"parallax\">{}\" ± {}\"</td></tr><tr><th scope=\"row\">{}</th><td id=\"au\">{}</td></tr><tr><th scope=\"row\">{}</th><td id=\"n-used\">{}</td></tr></table>\n",
                esc(&t(language, "results-parallax", Args::new())),
                decimal(language, h.parallax_arcsec, 4),
                decimal(language, h.parallax_sigma_arcsec, 4),
                esc(&t(language, "results-au", Args::new())),
                au_in(language, &h),
                esc(&t(language, "results-timings-used", Args::new())),
                esc(&used)
            )
        }
        _ => not_determined(language, red),
    }
}

/// Why the parallax is not determined by the reduction, and what is needed.
fn not_determined(language: Language, red: &Reduction) -> String {
    let why = red.warnings.last().map_or_else(
        || t(language, "results-default-why", Args::new()),
        String::clone,
    );
    let mut sentence = t(
        language,
        "results-parallax-not-determined",
        Args::new().text("why", why.trim_end_matches('.')),
    );
    match red.stations.iter().filter(|s| s.timings > 0).count() {
        0 => sentence = sentence + " " + &t(language, "results-need-two-none", Args::new()),
        1 => sentence = sentence + " " + &t(language, "results-need-two-one", Args::new()),
        _ => {}
    }
    format!("<p id=\"parallax\">{}</p>\n", esc(&sentence))
}

/// The stations of the solution with their places rounded to 0.1 degree (for the map and the
/// table), without their observers.
fn public_stations(red: &Reduction) -> Reduction {
    let mut public = red.clone();
    // What the page does not show is not kept with it.
    public.used = Vec::new();
    public.rejected = Vec::new();
    public.convergence = Vec::new();
    public.correlation = Vec::new();
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
fn stations_table(language: Language, red: &Reduction, determined: bool) -> String {
    let h = |id: &str| esc(&t(language, id, Args::new()));
    let mut s = format!(
        "<table id=\"stations\"><tr><th scope=\"col\">{}</th><th scope=\"col\">{}</th><th scope=\"col\">{}</th><th scope=\"col\">{}</th><th scope=\"col\">{}</th></tr>\n",
        h("results-col-station"),
        h("results-col-latitude"),
        h("results-col-longitude"),
        h("results-col-timings"),
        h("results-col-share")
    );
    for st in &red.stations {
        let share = if !determined {
            h("results-share-not-determined")
        } else if st.timings > 0 && st.information_share.is_finite() {
            format!("{} %", decimal(language, 100.0 * st.information_share, 1))
        } else {
            h("results-share-none")
        };
        let _ = writeln!(
            s,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{share}</td></tr>",
            esc(&st.station),
            decimal(language, st.latitude_deg, 1),
            decimal(language, st.longitude_deg, 1),
            st.timings
        );
    }
    s.push_str("</table>\n");
    scroll_box(&t(language, "results-stations-heading", Args::new()), &s)
}

/// The public section of one solved version: its figures, gathered once by the reducer, and
/// its HTML in each language, written on the first request for that language.
#[derive(Default)]
pub struct PublicSection {
    /// The solution with the stations' places rounded and their observers removed.
    public: Option<Reduction>,
    /// Why there is no reduction (the library's own words).
    why: Option<String>,
    /// Stations, timings in force and submissions.
    counts: (usize, usize, i64),
    /// The HTML in each language of [`Language::ALL`], once written.
    html: [OnceLock<String>; 5],
}

/// The public section of one solved version (made once, by the reducer): the headline, the
/// counts, the map and the stations' table. `timings` are the timings in force.
pub fn public_section(solved: &Solved, timings: &[StoredTiming]) -> PublicSection {
    let reduced: Vec<&StoredTiming> = timings.iter().filter(|t| t.excluded.is_none()).collect();
    let stations: HashSet<String> = reduced
        .iter()
        .map(|t| super::store_registrations::name_key(&t.fields.station))
        .collect();
    let why = if reduced.is_empty() {
        Some(t(
            Language::English,
            "results-no-timings-arrived",
            Args::new(),
        ))
    } else {
        solved
            .error
            .as_deref()
            .map(|e| e.strip_prefix("<campaign>: ").unwrap_or(e).to_string())
    };
    PublicSection {
        public: solved.reduction.as_deref().map(public_stations),
        why: why.filter(|_| solved.reduction.is_none() || reduced.is_empty()),
        counts: (stations.len(), reduced.len(), solved.submissions),
        html: Default::default(),
    }
}

impl PublicSection {
    /// The section in `language` (written once per version and language).
    pub fn html(&self, language: Language) -> &str {
        let k = Language::ALL
            .iter()
            .position(|l| *l == language)
            .unwrap_or(0);
        self.html[k].get_or_init(|| self.write(language))
    }

    fn write(&self, language: Language) -> String {
        let why = match (&self.why, self.public.is_none() && self.counts.1 == 0) {
            (_, true) => Some(t(language, "results-no-timings-arrived", Args::new())),
            (w, false) => w.clone(),
        };
        let mut s = headline(language, self.public.as_ref(), why.as_deref());
        let b = |id: &str, n: f64| format!("<b id=\"{id}\">{}</b>", decimal(language, n, 0));
        let counts = t(
            language,
            "results-counts",
            Args::new()
                .text("stations", b("n-stations", self.counts.0 as f64))
                .text("timings", b("n-timings", self.counts.1 as f64))
                .text("submissions", b("n-submissions", self.counts.2 as f64)),
        );
        let _ = writeln!(s, "<p id=\"counts\">{counts}</p>");
        if let Some(public) = self.public.as_ref().filter(|r| !r.stations.is_empty()) {
            let determined = public.headline().is_some();
            let map = if determined {
                station_map_svg_in(language, public)
            } else {
                places_map_svg(&places(public))
            };
            let _ = writeln!(
                s,
                "<h2>{}</h2>\n<figure id=\"map\" class=\"chart\" tabindex=\"0\">{map}<figcaption>{}</figcaption></figure>",
                esc(&t(language, "results-stations-heading", Args::new())),
                esc(&t(language, "results-map-caption", Args::new()))
            );
            s.push_str(&stations_table(language, public, determined));
        }
        s
    }
}

/// The convergence chart of one version for the public page: the solution's steps, kept once
/// by the report's renderer, and the chart in each language, drawn on the first request for
/// that language.
#[derive(Default)]
pub struct ConvergenceCharts {
    /// The parallax and its steps (the rest of the reduction left out); `None`: nothing to
    /// draw.
    steps: Option<Reduction>,
    svg: [OnceLock<String>; 5],
}

impl ConvergenceCharts {
    /// The charts of a reduction made with its convergence.
    pub fn of(red: &Reduction) -> Self {
        let steps = red.parallax_arcsec.map(|_| {
            let mut steps = red.clone();
            steps.used = Vec::new();
            steps.rejected = Vec::new();
            steps.stations = Vec::new();
            steps.correlation = Vec::new();
            steps
        });
        ConvergenceCharts {
            steps,
            svg: Default::default(),
        }
    }

    /// The chart in `language`, `None` when there is nothing to draw.
    pub fn svg(&self, language: Language) -> Option<&str> {
        let steps = self.steps.as_ref()?;
        let k = Language::ALL
            .iter()
            .position(|l| *l == language)
            .unwrap_or(0);
        Some(self.svg[k].get_or_init(|| convergence_svg_in(language, steps)))
    }
}

/// `GET /results`: the newest section and convergence chart in the visitor's language, the
/// "as of" sentence, the version headers and `Refresh`.
pub fn results(app: &App, headers: &HeaderMap, language: Language) -> Response {
    let solved = app.cache.solved();
    let rendered = app.cache.rendered();
    let pending = app.pending_changes();
    let mut body = format!(
        "<p id=\"as-of\">{}</p>\n",
        as_of_sentence_in(language, &solved.solved_utc, solved.version, pending)
    );
    if solved.version == 0 {
        let first = t(language, "results-first-being-computed", Args::new());
        body.push_str(&headline(language, None, Some(&first)));
    }
    body.push_str(solved.public.html(language));
    if let Some(chart) = rendered.convergence.svg(language) {
        let mut caption = t(language, "results-convergence-caption", Args::new());
        if rendered.version != solved.version {
            let older = Args::new().text("version", rendered.version.to_string());
            caption = caption + " " + &t(language, "results-convergence-older", older);
        }
        let _ = writeln!(
            body,
            "<h2>{}</h2>\n<figure id=\"convergence\" class=\"chart\" tabindex=\"0\">{chart}<figcaption>{}</figcaption></figure>",
            esc(&t(language, "results-convergence-heading", Args::new())),
            esc(&caption)
        );
    }
    let _ = writeln!(body, "<p>{}</p>", t(language, "results-links", Args::new()));
    let title = t(language, "results-title", Args::new());
    let html = page_in(language, Some("/results"), &title, &body);
    let etag = format!(
        "\"r{}-{}-{}-{}\"",
        solved.version,
        rendered.version,
        pending,
        language.code()
    );
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
        let s = headline(Language::English, None, Some("<campaign>: no rows."));
        assert!(
            s.contains("not determined yet: &lt;campaign&gt;: no rows.</p>"),
            "{s}"
        );
    }
}
