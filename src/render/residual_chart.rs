//! The residual chart of a reduction: O - C of every timing used with its standard
//! uncertainty, by contact, and the timings not used under them. A rejected timing on the
//! scale is a cross numbered as in the table of rows not used where the number finds room; one
//! off the scale is an arrow at the edge with its value. Labels are placed by [`LabelPlacer`]
//! clear of one another and of every mark; those that find no room are left out and counted
//! for the caption. Beyond [`RESIDUALS_PER_CONTACT_MAX`] used or [`REJECTED_PER_CONTACT_MAX`]
//! rejected timings per contact an even sample is drawn (the caption says so).

use crate::geometry::contacts::Contact;
use crate::observations::timings::Rejected;
use crate::reduction::{Reduction, UsedTiming};
use crate::render::axes::{edge_arrow, SMALL_TEXT_PX, TEXT_PX};
use crate::render::labels::{LabelPlacer, TextBox};
use crate::render::svg::{esc, svg_open_text, ticks, trim_tick};
use std::fmt::Write;

/// Most timings drawn per contact on the residual chart (an even sample beyond it).
pub const RESIDUALS_PER_CONTACT_MAX: usize = 400;
/// Most rejected timings marked per contact (an even sample beyond it).
pub const REJECTED_PER_CONTACT_MAX: usize = 100;

/// The drawn chart and the counts its caption needs.
#[derive(Clone, Debug, Default)]
pub struct ResidualChart {
    /// The SVG.
    pub svg: String,
    /// Used timings drawn, and in all.
    pub used: (usize, usize),
    /// Rejected timings with an O - C drawn, and in all.
    pub rejected: (usize, usize),
    /// Rejected timings drawn on the scale, and how many of them carry their number.
    pub numbered: (usize, usize),
    /// Rejected timings drawn as arrows off the scale, and how many carry their value.
    pub off_scale: (usize, usize),
    /// The scale's half-range, seconds.
    pub limit_s: f64,
}

/// Every k-th item of a list so that at most `max` are kept, in order.
pub fn thin<T>(items: Vec<T>, max: usize) -> Vec<T> {
    if items.len() <= max || max == 0 {
        return items;
    }
    let step = items.len().div_ceil(max);
    items.into_iter().step_by(step).collect()
}

/// An O - C off the scale as written beside its arrow: `+3601 s`, `-152 s`, `+48.5 s`.
pub fn off_scale_text(v: f64) -> String {
    if v.abs() >= 100.0 {
        format!("{v:+.0} s")
    } else {
        format!("{v:+.1} s")
    }
}

const WIDTH: f64 = 720.0;
const HEIGHT: f64 = 430.0;
const LEFT: f64 = 64.0;
const RIGHT: f64 = 12.0;
/// Top and bottom of the scale; arrows and their values go in the strips outside it.
const PLOT_TOP: f64 = 50.0;
const PLOT_BOTTOM: f64 = HEIGHT - 72.0;

/// The box of a mark of half-size `r` at (x, y).
fn mark_box((x, y): (f64, f64), r: f64) -> TextBox {
    TextBox {
        x0: x - r,
        y0: y - r,
        x1: x + r,
        y1: y + r,
    }
}

/// One contact's column: marks drawn into `marks`, labels into `labels`, counts into `out`.
struct Column<'a> {
    x0: f64,
    width: f64,
    used: Vec<&'a UsedTiming>,
    rejected: Vec<(usize, &'a Rejected)>,
}

fn draw_column(
    col: &Column,
    y_of: &dyn Fn(f64) -> f64,
    limit_s: f64,
    (marks, labels): (&mut String, &mut String),
    out: &mut ResidualChart,
) {
    let mut order: Vec<u64> = col
        .used
        .iter()
        .map(|u| u.line)
        .chain(col.rejected.iter().map(|(_, r)| r.line))
        .collect();
    order.sort_unstable();
    let n = order.len().max(1) as f64;
    let x_at =
        |line: u64| col.x0 + col.width * (order.partition_point(|&l| l < line) as f64 + 0.5) / n;
    let mut placer = LabelPlacer::new(TextBox {
        x0: col.x0 + 2.0,
        y0: 2.0,
        x1: col.x0 + col.width - 2.0,
        y1: HEIGHT - 30.0,
    });
    // Rejected first, so that the used timings are drawn over them.
    let mut pending = Vec::new();
    for (idx, r) in &col.rejected {
        let v = r.o_c_s.unwrap_or(0.0);
        let x = x_at(r.line);
        let title = format!(
            "<title>not used, {} line {}: O - C {v:+.1} s; {}</title>",
            esc(&r.station),
            r.line,
            esc(r.diagnosis.as_deref().unwrap_or(r.reason.as_str()))
        );
        if v.abs() > limit_s {
            let up = v > 0.0;
            let y = if up { PLOT_TOP } else { PLOT_BOTTOM };
            let _ = writeln!(marks, "<g>{title}{}</g>", edge_arrow((x, y), up, "#b91c1c"));
            let tip = if up { y - 12.0 } else { y + 12.0 };
            placer.reserve(mark_box((x, (y + tip) / 2.0), 5.0));
            pending.push((off_scale_text(v), (x, tip), true));
            out.off_scale.0 += 1;
        } else {
            let y = y_of(v);
            let _ = writeln!(marks, "<g>{title}<path d=\"M{:.1},{:.1} l7,7 M{:.1},{:.1} l7,-7\" stroke=\"#dc2626\" stroke-width=\"1.6\" stroke-opacity=\"0.8\"/></g>", x - 3.5, y - 3.5, x - 3.5, y + 3.5);
            placer.reserve(mark_box((x, y), 4.0));
            pending.push(((idx + 1).to_string(), (x, y), false));
            out.numbered.0 += 1;
        }
    }
    for u in &col.used {
        let (x, y) = (x_at(u.line), y_of(u.o_c_s));
        let _ = writeln!(
            marks,
            "<g><title>{} line {}: O - C {:+.1} s, sigma {:.1} s</title><line x1=\"{x:.1}\" y1=\"{:.1}\" x2=\"{x:.1}\" y2=\"{:.1}\" stroke=\"#9ca3af\"/><circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"2.2\" fill=\"#1d4ed8\"/></g>",
            esc(&u.station), u.line, u.o_c_s, u.sigma_s, y_of(u.o_c_s - u.sigma_s), y_of(u.o_c_s + u.sigma_s)
        );
        placer.reserve(mark_box((x, y), 2.5));
    }
    // Values of the arrows before the crosses' numbers: an arrow says little without it.
    pending.sort_by_key(|p| !p.2);
    for (text, at, off) in pending {
        let gap = if off { 5.0 } else { 4.5 };
        if let Some((lx, ly)) = placer.place(&text, SMALL_TEXT_PX, at, gap) {
            let _ = writeln!(labels, "<text x=\"{lx:.1}\" y=\"{ly:.1}\" font-size=\"{SMALL_TEXT_PX}\" fill=\"#b91c1c\">{}</text>", esc(&text));
            if off {
                out.off_scale.1 += 1;
            } else {
                out.numbered.1 += 1;
            }
        }
    }
}

/// The residual chart (see the module's description).
pub fn residuals_chart(red: &Reduction) -> ResidualChart {
    let limit_s = red
        .used
        .iter()
        .map(|u| u.o_c_s.abs() + u.sigma_s)
        .fold(10.0, f64::max)
        * 1.15;
    let y_of = |v: f64| {
        PLOT_TOP + (PLOT_BOTTOM - PLOT_TOP) * (0.5 - v.clamp(-limit_s, limit_s) / (2.0 * limit_s))
    };
    let group_w = (WIDTH - LEFT - RIGHT) / 4.0;
    let mut s = svg_open_text(WIDTH, HEIGHT, "Residuals O - C by contact", TEXT_PX);
    let _ = writeln!(s, "<rect width=\"100%\" height=\"100%\" fill=\"#ffffff\"/>");
    for t in ticks(-limit_s, limit_s, 8) {
        let y = y_of(t);
        let stroke = if t == 0.0 { "#6b7280" } else { "#e5e7eb" };
        let _ = writeln!(s, "<line x1=\"{LEFT}\" y1=\"{y:.1}\" x2=\"{}\" y2=\"{y:.1}\" stroke=\"{stroke}\"/><text x=\"{}\" y=\"{:.1}\" text-anchor=\"end\" font-size=\"{TEXT_PX}\">{}</text>", WIDTH - RIGHT, LEFT - 6.0, y + 4.5, trim_tick(t));
    }
    let mid = (PLOT_TOP + PLOT_BOTTOM) / 2.0;
    let _ = writeln!(s, "<text x=\"18\" y=\"{mid}\" transform=\"rotate(-90 18 {mid})\" text-anchor=\"middle\" font-size=\"{TEXT_PX}\">O - C (s)</text>");
    let mut out = ResidualChart {
        limit_s,
        ..ResidualChart::default()
    };
    let (mut marks, mut labels) = (String::new(), String::new());
    for (g, c) in Contact::ALL.iter().enumerate() {
        let x0 = LEFT + group_w * g as f64;
        let _ = writeln!(s, "<line x1=\"{x0:.1}\" y1=\"{PLOT_TOP}\" x2=\"{x0:.1}\" y2=\"{PLOT_BOTTOM}\" stroke=\"#9ca3af\"/><text x=\"{:.1}\" y=\"{}\" text-anchor=\"middle\" font-size=\"{TEXT_PX}\">contact {}</text>", x0 + group_w / 2.0, HEIGHT - 8.0, c.roman());
        let used: Vec<&UsedTiming> = red
            .used
            .iter()
            .filter(|u| u.contact == c.number())
            .collect();
        let rejected: Vec<(usize, &Rejected)> = red
            .rejected
            .iter()
            .enumerate()
            .filter(|(_, r)| r.contact == Some(c.number()) && r.o_c_s.is_some())
            .collect();
        out.used.1 += used.len();
        out.rejected.1 += rejected.len();
        let col = Column {
            x0,
            width: group_w,
            used: thin(used, RESIDUALS_PER_CONTACT_MAX),
            rejected: thin(rejected, REJECTED_PER_CONTACT_MAX),
        };
        out.used.0 += col.used.len();
        out.rejected.0 += col.rejected.len();
        draw_column(&col, &y_of, limit_s, (&mut marks, &mut labels), &mut out);
    }
    let _ = writeln!(s, "<line x1=\"{LEFT}\" y1=\"{PLOT_TOP}\" x2=\"{}\" y2=\"{PLOT_TOP}\" stroke=\"#9ca3af\"/><line x1=\"{LEFT}\" y1=\"{PLOT_BOTTOM}\" x2=\"{}\" y2=\"{PLOT_BOTTOM}\" stroke=\"#9ca3af\"/>", WIDTH - RIGHT, WIDTH - RIGHT);
    s.push_str(&marks);
    s.push_str(&labels);
    s.push_str("</svg>\n");
    out.svg = s;
    out
}

/// The residual chart as SVG alone (see [`residuals_chart`]).
pub fn residuals_svg(red: &Reduction) -> String {
    residuals_chart(red).svg
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn off_scale_values_are_written_with_their_sign_and_unit() {
        assert_eq!(off_scale_text(3601.2), "+3601 s");
        assert_eq!(off_scale_text(-152.4), "-152 s");
        assert_eq!(off_scale_text(48.46), "+48.5 s");
    }

    #[test]
    fn thinning_keeps_an_even_sample_in_order() {
        let kept = thin((0..1000).collect(), 100);
        assert_eq!(kept.len(), 100);
        assert_eq!(kept[1] - kept[0], 10);
        assert_eq!(thin(vec![1, 2, 3], 10), vec![1, 2, 3]);
    }
}
