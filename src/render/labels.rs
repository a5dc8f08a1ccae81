//! Text on charts that never overprints or leaves the chart: labels placed beside their marks
//! only where they fit, and captions wrapped to the chart's width.
//!
//! Widths are estimated, not measured (an SVG is written before any font is chosen): 0.65 em
//! per character is meant to be wider than the digits and average letters of the common
//! sans-serif faces (DejaVu Sans digits about 0.64 em, Liberation Sans about 0.56 em: figures
//! from memory, not read from the font files), and a line's box runs from 0.93 em above the
//! baseline to 0.24 em below (DejaVu Sans's ascent and descent, also from memory). The browser
//! test checks the result in Chromium's own layout, which is what holds the estimate.

use crate::render::svg::esc;
use std::fmt::Write;

/// Estimated advance of one character, in em.
const EM_PER_CHAR: f64 = 0.65;
/// Extent of a line of text above its baseline, in em.
const ASCENT_EM: f64 = 0.93;
/// Extent below the baseline, in em.
const DESCENT_EM: f64 = 0.24;

/// An axis-aligned box in chart pixels: left, top, right, bottom.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct TextBox {
    /// Left edge, px.
    pub x0: f64,
    /// Top edge, px.
    pub y0: f64,
    /// Right edge, px.
    pub x1: f64,
    /// Bottom edge, px.
    pub y1: f64,
}

impl TextBox {
    /// The box of `text` at `font_px` whose baseline starts at (x, y) (text-anchor start).
    pub fn of_text(text: &str, font_px: f64, (x, y): (f64, f64)) -> TextBox {
        let width = EM_PER_CHAR * font_px * text.chars().count() as f64;
        TextBox {
            x0: x,
            y0: y - ASCENT_EM * font_px,
            x1: x + width,
            y1: y + DESCENT_EM * font_px,
        }
    }

    /// Whether the two boxes share any area.
    pub fn overlaps(&self, other: &TextBox) -> bool {
        self.x0 < other.x1 && other.x0 < self.x1 && self.y0 < other.y1 && other.y0 < self.y1
    }

    /// Whether this box lies wholly inside `outer`.
    pub fn within(&self, outer: &TextBox) -> bool {
        self.x0 >= outer.x0 && self.x1 <= outer.x1 && self.y0 >= outer.y0 && self.y1 <= outer.y1
    }
}

/// Places short labels beside their marks: right, left, above or below the mark, the first of
/// those that stays inside the area and clear of every label placed before; none if none does.
/// (Greedy candidate-position labelling, as in Christensen, Marks and Shieber, "An empirical
/// study of algorithms for point-feature label placement", ACM Transactions on Graphics 14,
/// 1995, the simplest of the methods compared there; cited from memory.)
pub struct LabelPlacer {
    area: TextBox,
    taken: Vec<TextBox>,
}

impl LabelPlacer {
    /// A placer for labels kept inside this area.
    pub fn new(area: TextBox) -> LabelPlacer {
        LabelPlacer {
            area,
            taken: Vec::new(),
        }
    }

    /// The baseline start of `text` beside the mark at (x, y) whose half-size is `gap_px`, or
    /// `None` when it fits nowhere; a placed label is remembered.
    pub fn place(
        &mut self,
        text: &str,
        font_px: f64,
        (x, y): (f64, f64),
        gap_px: f64,
    ) -> Option<(f64, f64)> {
        let probe = TextBox::of_text(text, font_px, (0.0, 0.0));
        let (w, up, down) = (probe.x1, -probe.y0, probe.y1);
        let middle = y + (up - down) / 2.0;
        let candidates = [
            (x + gap_px + 1.0, middle),
            (x - gap_px - 1.0 - w, middle),
            (x - w / 2.0, y - gap_px - 1.0 - down),
            (x - w / 2.0, y + gap_px + 1.0 + up),
        ];
        let spot = candidates.into_iter().find(|&at| {
            let b = TextBox::of_text(text, font_px, at);
            b.within(&self.area) && self.taken.iter().all(|t| !t.overlaps(&b))
        })?;
        self.taken.push(TextBox::of_text(text, font_px, spot));
        Some(spot)
    }

    /// Whether a box lies inside the area and clear of every label placed or reserved.
    pub fn is_clear(&self, b: &TextBox) -> bool {
        b.within(&self.area) && self.taken.iter().all(|t| !t.overlaps(b))
    }

    /// The labels placed and the boxes reserved so far.
    pub fn taken(&self) -> &[TextBox] {
        &self.taken
    }

    /// Like [`LabelPlacer::place_centred`], but a spot is taken only where `accept` also
    /// allows its box (a leader line clear of other labels, a box off a drawn disc).
    pub fn place_centred_where(
        &mut self,
        text: &str,
        font_px: f64,
        centres: &[(f64, f64)],
        accept: impl Fn(&LabelPlacer, &TextBox, (f64, f64)) -> bool,
    ) -> Option<((f64, f64), (f64, f64))> {
        let probe = TextBox::of_text(text, font_px, (0.0, 0.0));
        let (w, up, down) = (probe.x1, -probe.y0, probe.y1);
        let (spot, centre) = centres
            .iter()
            .map(|&(x, y)| ((x - w / 2.0, y + (up - down) / 2.0), (x, y)))
            .find(|&(at, centre)| {
                let b = TextBox::of_text(text, font_px, at);
                self.is_clear(&b) && accept(self, &b, centre)
            })?;
        self.taken.push(TextBox::of_text(text, font_px, spot));
        Some((spot, centre))
    }

    /// Keep later labels off this box (a legend, another chart's labels).
    pub fn reserve(&mut self, area: TextBox) {
        self.taken.push(area);
    }

    /// The baseline start of `text` centred on the first of `centres` (x, y) where it stays
    /// inside the area and clear of every label placed before, or `None`; a placed label is
    /// remembered. For labels set on a line, at points along it.
    pub fn place_centred(
        &mut self,
        text: &str,
        font_px: f64,
        centres: &[(f64, f64)],
    ) -> Option<(f64, f64)> {
        let probe = TextBox::of_text(text, font_px, (0.0, 0.0));
        let (w, up, down) = (probe.x1, -probe.y0, probe.y1);
        let spot = centres
            .iter()
            .map(|&(x, y)| (x - w / 2.0, y + (up - down) / 2.0))
            .find(|&at| {
                let b = TextBox::of_text(text, font_px, at);
                b.within(&self.area) && self.taken.iter().all(|t| !t.overlaps(&b))
            })?;
        self.taken.push(TextBox::of_text(text, font_px, spot));
        Some(spot)
    }
}

/// The words of `text` in lines of at most `max_width_px` at `font_px` (a word longer than a
/// line gets a line of its own).
pub fn wrap(text: &str, font_px: f64, max_width_px: f64) -> Vec<String> {
    let max_chars = ((max_width_px / (EM_PER_CHAR * font_px)).floor() as usize).max(1);
    let mut lines: Vec<String> = Vec::new();
    let mut line = String::new();
    for word in text.split_whitespace() {
        let len = line.chars().count();
        if len > 0 && len + 1 + word.chars().count() > max_chars {
            lines.push(std::mem::take(&mut line));
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(word);
    }
    if !line.is_empty() {
        lines.push(line);
    }
    lines
}

/// `text` wrapped to `max_width_px` as `<text>` lines from baseline (x, y), `line_px` apart,
/// and the baseline of the line after the last.
pub fn wrapped_text(
    text: &str,
    (x, y): (f64, f64),
    (font_px, line_px): (f64, f64),
    max_width_px: f64,
) -> (String, f64) {
    let mut s = String::new();
    let mut baseline = y;
    for line in wrap(text, font_px, max_width_px) {
        let _ = writeln!(
            s,
            "<text x=\"{x:.1}\" y=\"{baseline:.1}\" font-size=\"{font_px}\">{}</text>",
            esc(&line)
        );
        baseline += line_px;
    }
    (s, baseline)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wrapped_lines_fit_and_keep_every_word() {
        let text = "Contact II: seconds per arcsecond of solar parallax. Light: not seen with the Sun 5 degrees up. Triangles: the sites.";
        let lines = wrap(text, 10.0, 200.0);
        assert!(lines.len() > 2);
        for l in &lines {
            assert!(TextBox::of_text(l, 10.0, (0.0, 0.0)).x1 <= 200.0, "{l}");
        }
        assert_eq!(lines.join(" "), text);
        assert_eq!(wrap("", 10.0, 100.0), Vec::<String>::new());
        assert_eq!(wrap("averyveryverylongword x", 10.0, 20.0).len(), 2);
    }

    #[test]
    fn labels_on_lines_stay_inside_and_clear_of_reserved_boxes() {
        let area = TextBox {
            x0: 0.0,
            y0: 0.0,
            x1: 200.0,
            y1: 100.0,
        };
        let mut placer = LabelPlacer::new(area);
        let legend = TextBox {
            x0: 100.0,
            y0: 0.0,
            x1: 200.0,
            y1: 100.0,
        };
        placer.reserve(legend);
        // The first centre pushes the label past the left edge, the second onto the legend:
        // the third is taken.
        let spot = placer
            .place_centred("I 06:41", 10.0, &[(2.0, 50.0), (150.0, 50.0), (50.0, 50.0)])
            .unwrap();
        let b = TextBox::of_text("I 06:41", 10.0, spot);
        assert!(b.within(&area) && !b.overlaps(&legend));
        assert!((b.x0 + b.x1) / 2.0 - 50.0 < 1e-9);
        // The same spot again is taken: no place left among these centres.
        assert_eq!(placer.place_centred("I 06:41", 10.0, &[(50.0, 50.0)]), None);
    }

    #[test]
    fn placed_labels_never_overlap_or_leave_the_area() {
        let area = TextBox {
            x0: 0.0,
            y0: 0.0,
            x1: 100.0,
            y1: 60.0,
        };
        let mut placer = LabelPlacer::new(area);
        let mut boxes = Vec::new();
        // Thirty marks crowded together: some labels fit, the rest are left out.
        for k in 0..30 {
            let at = (10.0 + 3.0 * f64::from(k), 30.0);
            if let Some(spot) = placer.place(&format!("{k}"), 9.0, at, 3.0) {
                boxes.push(TextBox::of_text(&format!("{k}"), 9.0, spot));
            }
        }
        assert!(boxes.len() >= 4 && boxes.len() < 30, "{}", boxes.len());
        for (i, a) in boxes.iter().enumerate() {
            assert!(a.within(&area), "{a:?}");
            for b in &boxes[i + 1..] {
                assert!(!a.overlaps(b), "{a:?} {b:?}");
            }
        }
        // A mark at the right edge gets its label on the left.
        let mut placer = LabelPlacer::new(area);
        let spot = placer.place("12", 9.0, (98.0, 30.0), 3.0).unwrap();
        assert!(spot.0 < 98.0);
    }
}
