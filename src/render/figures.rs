//! The reduction's charts as figures for a page: each chart with a caption that says what is
//! plotted, in what units and what the marks mean (and what was left out), and the keys the
//! charts' numbers point to. The report and the service's organiser page show the same
//! figures; the organiser's page has no station table or table of rows not used, so there the
//! keys carry everything the numbers point to.

use crate::reduction::Reduction;
use crate::render::charts::{
    solar_disc_chart, station_map_svg, DiscChart, ResidualChart, DISC_STATIONS_MAX,
    MAP_STATIONS_MAX,
};
use crate::render::convergence_chart::{convergence_svg, ZOOM_SIGMAS};
use crate::render::residual_chart::residuals_chart;
use crate::render::svg::esc;
use std::fmt::Write;

/// The page a figure goes on: what the numbers on its charts can point to.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Page {
    /// The report, with its station table and table of rows not used.
    Report,
    /// The organiser's page of the service, with neither table: keys stand in for them.
    Organiser,
}

/// Most rows not used listed in the residual chart's key on the organiser's page.
pub const RESIDUAL_KEY_MAX: usize = 300;

/// The solar disc's caption (plain text).
pub fn disc_caption(red: &Reduction, chart: &DiscChart, page: Page) -> String {
    let numbered = match page {
        Page::Report => "numbered as in the station table (the key below the chart)",
        Page::Organiser => "numbered as in the key below the chart",
    };
    let mut s = format!("The planet's path across the Sun, north up and east to the left as the Sun appears in the sky. Black line: the path seen from the Earth's centre. Coloured lines: the path seen from each station, its displacement by parallax drawn {:.0} times larger than it is, {numbered}; a thin line of the path's colour joins each number to its path. Red dots: the stations' contacts, off the limb by the same exaggeration. Black disc: the planet to scale at greatest transit. The bar is 100 arcseconds on the Sun.", chart.exaggeration);
    let used = red.stations.iter().filter(|s| s.not_used.is_none()).count();
    if used > chart.key.len() {
        let _ = write!(s, " Only the {} stations with the largest shares of the information are drawn, of {used} whose timings were used.", chart.key.len().min(DISC_STATIONS_MAX));
    }
    if chart.unnumbered > 0 {
        let _ = write!(
            s,
            " {} paths found no room for their number; the key lists every path drawn.",
            chart.unnumbered
        );
    }
    s
}

/// The solar disc's key: `1 Station; 2 Station; ...`.
pub fn disc_key(chart: &DiscChart) -> String {
    chart
        .key
        .iter()
        .map(|(n, name)| format!("{n} {name}"))
        .collect::<Vec<_>>()
        .join("; ")
}

/// The station map's caption.
pub fn map_caption(red: &Reduction) -> String {
    let mut s = String::from("Where the stations were, on a world map of longitude and latitude (degrees, equirectangular). Each circle is a station: its area shows the station's share of the information on the parallax (key below the map), its colour the mean of its timings' O - C divided by their uncertainties (blue: early; red: late; the colours saturate at ±2). A red cross marks a station none of whose timings was used. Land: Natural Earth 1:110m (public domain).");
    if red.stations.len() > MAP_STATIONS_MAX {
        let _ = write!(
            s,
            " The {MAP_STATIONS_MAX} stations with the largest shares are drawn, of {}.",
            red.stations.len()
        );
    }
    s
}

/// The residual chart's caption.
pub fn residual_caption(chart: &ResidualChart, page: Page) -> String {
    let (table, elsewhere) = match page {
        Page::Report => (
            "numbered as in the table of rows not used",
            "the table of rows not used (its first rows) and the CSV output list every one",
        ),
        Page::Organiser => (
            "numbered as in the key below the chart",
            "the key below the chart and the timings' table list them",
        ),
    };
    let mut s = String::from("O - C (observed minus computed time, in seconds) of each timing, grouped by contact and in the order of the file within each group. Blue dots on grey bars: timings used, with their standard uncertainty.");
    let (inside, numbered) = chart.numbered;
    if inside > 0 {
        let _ = write!(s, " Red crosses, drawn beneath the used timings: timings not used, {table} where the number finds room beside the cross");
        if inside > numbered {
            let _ = write!(
                s,
                " ({numbered} of {inside} are numbered; the others had no room: {elsewhere})"
            );
        }
        s.push('.');
    }
    let (off, valued) = chart.off_scale;
    if off > 0 {
        let _ = write!(s, " Red arrows at the top or bottom edge: timings not used whose O - C is off the scale (beyond ±{:.0} s), their O - C written beside the arrow", chart.limit_s);
        if off > valued {
            let _ = write!(s, " where it finds room ({valued} of {off}; {elsewhere})");
        }
        s.push('.');
    }
    if inside + off == 0 {
        s.push_str(" No timing with a computed O - C was left out of the solution.");
    }
    if chart.used.0 < chart.used.1 || chart.rejected.0 < chart.rejected.1 {
        let _ = write!(s, " So many timings would hide one another that an even sample in the order of the file is drawn: {} of {} used and {} of {} not used (the CSV and JSON outputs list every one).", chart.used.0, chart.used.1, chart.rejected.0, chart.rejected.1);
    }
    s
}

/// The convergence chart's caption.
pub fn convergence_caption(red: &Reduction) -> String {
    let last = red.convergence.last();
    let band = last.map_or(String::new(), |p| {
        format!(" (the final band: ±{:.4}\")", p.sigma_arcsec)
    });
    format!("How the solar parallax firmed up as the timings were added in the order of the file (a solution after every twenty-fifth of them). Upper panel: the parallax (blue line, arcseconds) and its standard uncertainty (blue band), zoomed on the final value ± {ZOOM_SIGMAS:.0} final uncertainties so that the final band is readable{band}; the early, wider band runs off the panel. Green dashed line: the IAU 2009 value. Lower panel: the standard uncertainty on a logarithmic scale; the grey dashed line falls as one over the square root of the number of timings through the final value, as independent timings would make it fall (a flatter blue curve means errors the added timings do not average away).")
}

/// The light curve's caption.
pub fn light_curve_caption() -> String {
    format!("The Sun's brightness seen from the Earth's centre through the transit: the change in brightness in parts per million of the unobscured Sun (so the transit is a dip), against time. Dashed lines: contacts I-IV. Model: {}.", crate::scale::light_curve::LIMB_DARKENING_LAW)
}

/// The opening of a chart's figure: drawn at its own size, never shrunk (its text stays at
/// least 12 px), it scrolls sideways inside the figure where the page is narrower (WCAG 2.2,
/// success criterion 1.4.10, excepts charts and maps from reflow), and takes the keyboard's
/// focus so that it can be scrolled without a pointer (as the tables' boxes do).
pub const CHART_FIGURE: &str = "<figure class=\"chart\" tabindex=\"0\">";

fn figure(svg: &str, caption: &str, extra: &str) -> String {
    format!(
        "{CHART_FIGURE}\n{svg}<figcaption>{}{extra}</figcaption>\n</figure>\n",
        esc(caption)
    )
}

/// The solar disc as a figure, with its key.
pub fn disc_figure(red: &Reduction, page: Page) -> String {
    let chart = solar_disc_chart(red);
    let key = format!(
        "<br/><span class=\"key\">Key: {}.</span>",
        esc(&disc_key(&chart))
    );
    figure(&chart.svg, &disc_caption(red, &chart, page), &key)
}

/// The station map as a figure.
pub fn map_figure(red: &Reduction) -> String {
    figure(&station_map_svg(red), &map_caption(red), "")
}

/// The rows not used that the residual chart numbers, for the organiser's page.
fn residual_key(red: &Reduction) -> String {
    let rows: Vec<String> = red
        .rejected
        .iter()
        .enumerate()
        .filter(|(_, r)| r.contact.is_some() && r.o_c_s.is_some())
        .take(RESIDUAL_KEY_MAX)
        .map(|(i, r)| {
            format!(
                "{}: {}, line {}, contact {}, O - C {:+.1} s, {}",
                i + 1,
                r.station,
                r.line,
                r.contact.unwrap_or(0),
                r.o_c_s.unwrap_or(0.0),
                r.diagnosis.as_deref().unwrap_or(r.reason.as_str())
            )
        })
        .collect();
    if rows.is_empty() {
        return String::new();
    }
    format!(
        "<details><summary>Key to the numbered marks ({} timings not used)</summary><p>{}</p></details>",
        rows.len(),
        esc(&rows.join("; "))
    )
}

/// The residual chart as a figure (on the organiser's page with the key to its numbers).
pub fn residual_figure(red: &Reduction, page: Page) -> String {
    let chart = residuals_chart(red);
    let key = match page {
        Page::Report => String::new(),
        Page::Organiser => residual_key(red),
    };
    format!(
        "{CHART_FIGURE}\n{}<figcaption>{}</figcaption>\n</figure>\n{key}\n",
        chart.svg,
        esc(&residual_caption(&chart, page))
    )
}

/// The convergence chart as a figure.
pub fn convergence_figure(red: &Reduction) -> String {
    figure(&convergence_svg(red), &convergence_caption(red), "")
}

/// The light curve as a figure.
pub fn light_curve_figure(svg: &str) -> String {
    figure(svg, &light_curve_caption(), "")
}
