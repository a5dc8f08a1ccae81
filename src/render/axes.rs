//! Axes every chart of a reduction shares: the text sizes, round clock-time ticks, ticks on a
//! logarithmic scale, and the arrow that marks a value off the scale at a chart's edge.

use crate::render::svg::trim_tick;
use std::fmt::Write;

/// The smallest text on a chart, in the SVG's own units. Charts are drawn at their view box's
/// size (never wider than a report's content, 968 px; the service's page is wider still), so a
/// unit is a CSS pixel there and no text is smaller than 12 px (tests/browser.rs measures it).
pub const SMALL_TEXT_PX: f64 = 12.0;
/// The ordinary text of a chart (ticks, axis names), in the SVG's units.
pub const TEXT_PX: f64 = 13.0;

/// Steps between clock-time ticks, minutes: each divides an hour or a day evenly.
const TIME_STEPS_MIN: [f64; 12] = [
    1.0, 2.0, 5.0, 10.0, 15.0, 20.0, 30.0, 60.0, 120.0, 180.0, 360.0, 720.0,
];

/// Round clock times for an axis running from `start_s` to `end_s` (seconds after the
/// midnight that begins the first label's day): every 1, 2, 5, 10, 15, 20 or 30 minutes or 1,
/// 2, 3, 6 or 12 hours, the smallest step that gives at most `most` ticks. Returns the step
/// (minutes) and the ticks (seconds after that midnight), each a whole multiple of the step.
pub fn time_ticks(start_s: f64, end_s: f64, most: usize) -> (f64, Vec<f64>) {
    let span_s = (end_s - start_s).abs().max(1.0);
    let most = most.max(2) as f64;
    let step_min = TIME_STEPS_MIN
        .iter()
        .copied()
        .find(|m| span_s / (m * 60.0) <= most - 1.0)
        .unwrap_or(1440.0);
    let step_s = step_min * 60.0;
    let first = (start_s.min(end_s) / step_s).ceil() as i64;
    let last = (start_s.max(end_s) / step_s).floor() as i64;
    let ticks = (first..=last).map(|k| k as f64 * step_s).collect();
    (step_min, ticks)
}

/// A tick's clock time, `HH:MM` (seconds after a midnight; past 24 h it is the next day's).
pub fn clock_label(seconds: f64) -> String {
    let minutes = (seconds / 60.0).round() as i64;
    let m = minutes.rem_euclid(24 * 60);
    format!("{:02}:{:02}", m / 60, m % 60)
}

/// Ticks for a logarithmic axis over [lo, hi] (both positive): the powers of ten inside it,
/// and 2 and 5 times them when fewer than three powers fall inside.
pub fn log_ticks(lo: f64, hi: f64) -> Vec<f64> {
    if !(lo > 0.0 && hi > lo && hi.is_finite()) {
        return Vec::new();
    }
    let (a, b) = (lo.log10().floor() as i32, hi.log10().ceil() as i32);
    let decades: Vec<f64> = (a..=b)
        .map(|k| 10f64.powi(k))
        .filter(|v| *v >= lo * (1.0 - 1e-9) && *v <= hi * (1.0 + 1e-9))
        .collect();
    if decades.len() >= 3 {
        return decades;
    }
    (a..=b)
        .flat_map(|k| [1.0, 2.0, 5.0].map(|m| m * 10f64.powi(k)))
        .filter(|v| *v >= lo * (1.0 - 1e-9) && *v <= hi * (1.0 + 1e-9))
        .collect()
}

/// A tick value on a logarithmic axis, as written (`0.05`, `1`, `20`).
pub fn log_tick_label(v: f64) -> String {
    let decimals = (-v.log10().floor()).max(0.0) as usize;
    trim_tick(format!("{v:.decimals$}").parse().unwrap_or(v))
}

/// An arrow at a chart's edge for a value off its scale: a shaft from `(x, y)` pointing up
/// (`up`) or down, 12 px long, with its head at the end.
pub fn edge_arrow((x, y): (f64, f64), up: bool, colour: &str) -> String {
    let d = if up { -1.0 } else { 1.0 };
    let tip = y + 12.0 * d;
    let mut s = String::new();
    let _ = write!(
        s,
        "<path d=\"M{x:.1},{y:.1} L{x:.1},{tip:.1} M{:.1},{:.1} L{x:.1},{tip:.1} L{:.1},{:.1}\" stroke=\"{colour}\" stroke-width=\"1.6\" fill=\"none\"/>",
        x - 4.0,
        tip - 5.0 * d,
        x + 4.0,
        tip - 5.0 * d
    );
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn time_ticks_fall_on_round_clock_times() {
        // 05:23:10 to 06:54:00: 91 minutes, at most 8 ticks: every 15 minutes.
        let (step, t) = time_ticks(19_390.0, 24_840.0, 8);
        assert_eq!(step, 15.0);
        let labels: Vec<String> = t.iter().map(|&s| clock_label(s)).collect();
        assert_eq!(
            labels,
            ["05:30", "05:45", "06:00", "06:15", "06:30", "06:45"]
        );
        // Nearly seven hours: every hour, none at :29 past.
        let (step, t) = time_ticks(22.0 * 3600.0 + 29.0 * 60.0, 29.2 * 3600.0, 8);
        assert_eq!(step, 60.0);
        for s in &t {
            assert_eq!(s % 3600.0, 0.0, "{}", clock_label(*s));
        }
        assert_eq!(clock_label(t[0]), "23:00");
        assert_eq!(clock_label(*t.last().unwrap()), "05:00", "past midnight");
        // A Mercury transit's ingress alone: three minutes, every minute.
        let (step, t) = time_ticks(600.5, 780.0, 8);
        assert_eq!((step, t.len()), (1.0, 3));
        // Every step divides an hour or a day, and the count stays within the bound.
        for span in [300.0, 4_000.0, 20_000.0, 80_000.0] {
            let (step, t) = time_ticks(1234.0, 1234.0 + span, 7);
            assert!(t.len() <= 7 && t.len() >= 2, "{span}: {}", t.len());
            assert!(60.0 % step == 0.0 || (24.0 * 60.0) % step == 0.0, "{step}");
        }
    }

    #[test]
    fn log_ticks_are_powers_of_ten_or_their_multiples() {
        assert_eq!(log_ticks(0.03, 20.0), vec![0.1, 1.0, 10.0]);
        assert_eq!(log_ticks(0.03, 0.4), vec![0.05, 0.1, 0.2]);
        assert!(log_ticks(0.0, 1.0).is_empty());
        assert_eq!(log_tick_label(0.05), "0.05");
        assert_eq!(log_tick_label(20.0), "20");
    }

    #[test]
    fn edge_arrows_point_off_the_scale() {
        let up = edge_arrow((10.0, 40.0), true, "#000");
        assert!(up.contains("L10.0,28.0"), "{up}");
        let down = edge_arrow((10.0, 40.0), false, "#000");
        assert!(down.contains("L10.0,52.0"), "{down}");
    }
}
