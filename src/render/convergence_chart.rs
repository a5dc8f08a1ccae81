//! How the solar parallax firmed up as timings were added in the order of the file, in two
//! panels sharing the axis of timings: the parallax with its one-sigma band, zoomed on the
//! final value (five final uncertainties either side, so the final band fills a fifth of the
//! panel; the early, wide band runs off it), and the uncertainty itself on a logarithmic scale
//! over its whole range, with the fall as one over the square root of the number of timings
//! that independent timings would give, drawn through the final value.
//!
//! Two panels rather than one axis stretched from the first guess to the last: on one linear
//! axis the first partial solutions (uncertainties of arcseconds) squash the final band
//! (hundredths) to a line; a logarithmic scale of the parallax itself would distort the value
//! a reader wants to read off. The zoom keeps the value linear and readable, the log panel
//! keeps the whole history and shows at a glance whether the uncertainty falls as it should.

use crate::language::numbers::{decimal, decimal_text};
use crate::language::{text, Args, Language};
use crate::reduction::{ConvergencePoint, Reduction};
use crate::render::axes::{edge_arrow, log_tick_label, log_ticks, SMALL_TEXT_PX, TEXT_PX};
use crate::render::svg::{svg_open_text, ticks, trim_tick};
use std::fmt::Write;

const WIDTH: f64 = 720.0;
const HEIGHT: f64 = 480.0;
const LEFT: f64 = 76.0;
const RIGHT: f64 = 20.0;
/// Top and bottom of the zoomed panel of the parallax.
const A: (f64, f64) = (40.0, 220.0);
/// Top and bottom of the panel of the uncertainty.
const B: (f64, f64) = (276.0, 416.0);
/// Half the zoomed panel's range, in final uncertainties.
pub const ZOOM_SIGMAS: f64 = 5.0;

/// The zoomed panel's range (arcsec): the final value plus or minus [`ZOOM_SIGMAS`] final
/// uncertainties (at least 0.002").
pub fn zoom_range(final_arcsec: f64, final_sigma_arcsec: f64) -> (f64, f64) {
    let half = (ZOOM_SIGMAS * final_sigma_arcsec).max(0.002);
    (final_arcsec - half, final_arcsec + half)
}

/// The parallax's band and line, clipped to the zoomed panel.
fn zoomed_panel(
    language: Language,
    s: &mut String,
    pts: &[ConvergencePoint],
    x_of: &dyn Fn(f64) -> f64,
    (ylo, yhi): (f64, f64),
) {
    let y_of = |v: f64| A.0 + (A.1 - A.0) * (yhi - v) / (yhi - ylo);
    for t in ticks(ylo, yhi, 5) {
        let y = y_of(t);
        let _ = writeln!(s, "<line x1=\"{LEFT}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"#e5e7eb\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\">{}</text>", WIDTH - RIGHT, LEFT - 6.0, y + 4.5, decimal_text(language, &trim_tick(t)));
    }
    let zoomed = words(
        language,
        "chart-convergence-zoomed",
        Args::new().text("sigmas", format!("{ZOOM_SIGMAS:.0}")),
    );
    let _ = writeln!(s, "<text x=\"{LEFT}\" y=\"{}\">{zoomed}</text>", A.0 - 12.0);
    let line = |f: &dyn Fn(&ConvergencePoint) -> f64,
                it: &mut dyn Iterator<Item = &ConvergencePoint>| {
        it.map(|p| format!("{:.1},{:.1}", x_of(p.timings as f64), y_of(f(p))))
            .collect::<Vec<_>>()
            .join(" ")
    };
    let _ = writeln!(s, "<defs><clipPath id=\"convergence-zoom\"><rect x=\"{LEFT}\" y=\"{}\" width=\"{}\" height=\"{}\"/></clipPath></defs>\n<g clip-path=\"url(#convergence-zoom)\">", A.0, WIDTH - LEFT - RIGHT, A.1 - A.0);
    let _ = writeln!(
        s,
        "<polygon points=\"{} {}\" fill=\"#bfdbfe\" stroke=\"none\"/>",
        line(&|p| p.parallax_arcsec + p.sigma_arcsec, &mut pts.iter()),
        line(
            &|p| p.parallax_arcsec - p.sigma_arcsec,
            &mut pts.iter().rev()
        )
    );
    let _ = writeln!(
        s,
        "<polyline points=\"{}\" fill=\"none\" stroke=\"#1d4ed8\" stroke-width=\"1.8\"/>\n</g>",
        line(&|p| p.parallax_arcsec, &mut pts.iter())
    );
    let _ = writeln!(
        s,
        "<rect x=\"{LEFT}\" y=\"{}\" width=\"{}\" height=\"{}\" fill=\"none\" stroke=\"#9ca3af\"/>",
        A.0,
        WIDTH - LEFT - RIGHT,
        A.1 - A.0
    );
    let iau = crate::sky::constants::nominal_parallax_arcsec();
    let value = decimal_text(language, &trim_tick(iau));
    let label = text(
        language,
        "chart-convergence-iau",
        &Args::new().text("value", value),
    );
    if (ylo..=yhi).contains(&iau) {
        let y = y_of(iau);
        let _ = writeln!(s, "<line x1=\"{LEFT}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"#15803d\" stroke-dasharray=\"5,4\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\" fill=\"#15803d\" font-size=\"{SMALL_TEXT_PX}\" stroke=\"#ffffff\" stroke-width=\"3\" paint-order=\"stroke\">{}</text>", WIDTH - RIGHT, WIDTH - RIGHT - 4.0, if y - A.0 > 20.0 { y - 5.0 } else { y + 16.0 }, crate::render::svg::esc(&label));
    } else {
        let up = iau > yhi;
        let (y, ty) = if up {
            (A.0 + 14.0, A.0 + 14.0)
        } else {
            (A.1 - 14.0, A.1 - 6.0)
        };
        let x = WIDTH - RIGHT - 12.0;
        let _ = writeln!(s, "{}<text x=\"{:.1}\" y=\"{ty:.1}\" text-anchor=\"end\" fill=\"#15803d\" font-size=\"{SMALL_TEXT_PX}\">{}</text>", edge_arrow((x, y), up, "#15803d"), x - 8.0, words(language, if up { "chart-convergence-off-above" } else { "chart-convergence-off-below" }, Args::new().text("label", label)));
    }
}

/// The uncertainty on a logarithmic scale, with the fall as 1/sqrt(N) through the final one.
fn uncertainty_panel(
    language: Language,
    s: &mut String,
    pts: &[ConvergencePoint],
    x_of: &dyn Fn(f64) -> f64,
) {
    let Some(last) = pts.last() else {
        return;
    };
    let reference = |n: f64| last.sigma_arcsec * (last.timings as f64 / n.max(1.0)).sqrt();
    let values = pts
        .iter()
        .flat_map(|p| [p.sigma_arcsec, reference(p.timings as f64)])
        .filter(|v| *v > 0.0 && v.is_finite());
    let (lo, hi) = values.fold((f64::MAX, 0.0f64), |(a, b), v| (a.min(v), b.max(v)));
    let (lo, hi) = (lo / 1.3, hi * 1.3);
    let y_of = |v: f64| B.1 - (B.1 - B.0) * (v.max(lo).ln() - lo.ln()) / (hi.ln() - lo.ln());
    for t in log_ticks(lo, hi) {
        let y = y_of(t);
        let _ = writeln!(s, "<line x1=\"{LEFT}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"#e5e7eb\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\">{}</text>", WIDTH - RIGHT, LEFT - 6.0, y + 4.5, decimal_text(language, &log_tick_label(t)));
    }
    let _ = writeln!(
        s,
        "<text x=\"{LEFT}\" y=\"{}\">{}</text>",
        B.0 - 12.0,
        words(language, "chart-convergence-sigma-axis", Args::new())
    );
    let _ = writeln!(
        s,
        "<rect x=\"{LEFT}\" y=\"{}\" width=\"{}\" height=\"{}\" fill=\"none\" stroke=\"#9ca3af\"/>",
        B.0,
        WIDTH - LEFT - RIGHT,
        B.1 - B.0
    );
    let line = |f: &dyn Fn(&ConvergencePoint) -> f64| {
        pts.iter()
            .map(|p| format!("{:.1},{:.1}", x_of(p.timings as f64), y_of(f(p))))
            .collect::<Vec<_>>()
            .join(" ")
    };
    let _ = writeln!(s, "<polyline points=\"{}\" fill=\"none\" stroke=\"#6b7280\" stroke-width=\"1.2\" stroke-dasharray=\"5,4\"/>", line(&|p| reference(p.timings as f64)));
    let _ = writeln!(
        s,
        "<polyline points=\"{}\" fill=\"none\" stroke=\"#1d4ed8\" stroke-width=\"1.8\"/>",
        line(&|p| p.sigma_arcsec)
    );
    for p in pts {
        let _ = writeln!(s, "<circle cx=\"{:.1}\" cy=\"{:.1}\" r=\"2.5\" fill=\"#1d4ed8\"><title>{}</title></circle>", x_of(p.timings as f64), y_of(p.sigma_arcsec), point_title(language, p));
    }
    let _ = writeln!(s, "<text x=\"{}\" y=\"{}\" text-anchor=\"end\" fill=\"#4b5563\" font-size=\"{SMALL_TEXT_PX}\">{}</text>", WIDTH - RIGHT - 6.0, B.0 + 16.0, words(language, "chart-convergence-dashed", Args::new()));
}

/// A chart's words in `language`, escaped for the SVG.
fn words(language: Language, id: &str, args: Args) -> String {
    crate::render::svg::esc(&text(language, id, &args))
}

/// A point's title: the timings so far and the solution with them.
fn point_title(language: Language, p: &ConvergencePoint) -> String {
    let args = Args::new()
        .text("timings", p.timings.to_string())
        .text("parallax", decimal(language, p.parallax_arcsec, 4))
        .text("sigma", decimal(language, p.sigma_arcsec, 4));
    words(language, "chart-convergence-point", args)
}

/// The convergence chart (see the module's description), in English.
pub fn convergence_svg(red: &Reduction) -> String {
    convergence_svg_in(Language::English, red)
}

/// The convergence chart in `language`.
pub fn convergence_svg_in(language: Language, red: &Reduction) -> String {
    let title = text(language, "chart-convergence-title", &Args::new());
    let mut s = svg_open_text(WIDTH, HEIGHT, &title, TEXT_PX);
    let _ = writeln!(s, "<g font-size=\"{TEXT_PX}\">");
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    let pts: Vec<ConvergencePoint> = red
        .convergence
        .iter()
        .filter(|p| {
            p.sigma_arcsec > 0.0 && p.sigma_arcsec.is_finite() && p.parallax_arcsec.is_finite()
        })
        .cloned()
        .collect();
    let Some(last) = pts.last() else {
        let _ = writeln!(
            s,
            "<text x=\"20\" y=\"40\">{}</text></g></svg>",
            words(language, "chart-convergence-too-few", Args::new())
        );
        return s;
    };
    let final_pi = red.parallax_arcsec.unwrap_or(last.parallax_arcsec);
    let nmax = (last.timings as f64).max(1.0);
    let x_of = |n: f64| LEFT + (WIDTH - LEFT - RIGHT) * n / nmax;
    for t in ticks(0.0, nmax, 8) {
        let x = x_of(t);
        let _ = writeln!(s, "<line x1=\"{x:.1}\" y1=\"{}\" x2=\"{x:.1}\" y2=\"{}\" stroke=\"#e5e7eb\"/><line x1=\"{x:.1}\" y1=\"{}\" x2=\"{x:.1}\" y2=\"{}\" stroke=\"#e5e7eb\"/><text x=\"{x:.1}\" y=\"{}\" text-anchor=\"middle\">{}</text>", A.0, A.1, B.0, B.1, B.1 + 18.0, decimal_text(language, &trim_tick(t)));
    }
    let _ = writeln!(
        s,
        "<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">{}</text>",
        (LEFT + WIDTH - RIGHT) / 2.0,
        HEIGHT - 12.0,
        words(language, "chart-convergence-timings-axis", Args::new())
    );
    let range = zoom_range(final_pi, last.sigma_arcsec);
    zoomed_panel(language, &mut s, &pts, &x_of, range);
    uncertainty_panel(language, &mut s, &pts, &x_of);
    s.push_str("</g>\n</svg>\n");
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_zoom_shows_the_final_band_as_a_fifth_of_the_panel() {
        let (lo, hi) = zoom_range(8.80, 0.04);
        assert!((hi - lo - 0.4).abs() < 1e-12);
        assert!((2.0 * 0.04) / (hi - lo) >= 0.2 - 1e-12);
        let (lo, hi) = zoom_range(8.8, 0.0);
        assert!(hi > lo, "never an empty range");
    }
}
