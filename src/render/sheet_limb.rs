//! The solar disc drawn for an observers' sheet, with the place on the limb where each contact
//! happens: once with the zenith up (as the Sun stands in the sky, placed by the vertex angle)
//! and once with north up and east to the left (as an equatorial mount shows it, placed by the
//! position angle).
//!
//! Conventions: the position angle is counted from the north point of the Sun's disc through
//! east, the vertex angle from the point of the disc nearest the zenith through east; with the
//! reference point up and the disc seen directly (not mirrored), east lies to the left and both
//! angles run anticlockwise.
//!
//! References: *Explanatory Supplement to the Astronomical Almanac* (1992), section 8.3 (local
//! circumstances: position angle from the north point, vertex angle from the vertex); the
//! parallactic angle that turns one into the other, J. Meeus, *Astronomical Algorithms*, 2nd
//! ed. (1998), chapter 14.

use crate::geometry::contacts::Contact;
use crate::language::Language;
use crate::render::sheet_words::word;
use crate::render::svg::esc;
use std::fmt::Write as _;

/// Which way up a drawing is.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum LimbFrame {
    /// Zenith up: angles are vertex angles.
    Zenith,
    /// North up, east left: angles are position angles.
    North,
}

/// One contact's place on the limb.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct LimbMark {
    /// Which contact.
    pub contact: Contact,
    /// Its angle on the limb (vertex or position angle, as the frame says), degrees from the
    /// reference point through east.
    pub angle_deg: f64,
}

/// Width and height of the drawing's view box, px.
pub const VIEW_PX: (f64, f64) = (260.0, 240.0);
/// Centre of the disc in the view box, px.
pub const CENTRE_PX: (f64, f64) = (130.0, 130.0);
/// Radius of the disc, px.
pub const DISC_RADIUS_PX: f64 = 78.0;
/// Radius of the circle the contact numerals are centred on, px.
const LABEL_RADIUS_PX: f64 = 98.0;
/// Least angle between two numerals on the label circle, degrees (an arc of 27 px, more than
/// the widest numeral, "III" at 18 px, needs).
pub const MIN_LABEL_GAP_DEG: f64 = 16.0;

/// The point at `angle_deg` from the top of a circle, anticlockwise (east left), in view-box
/// px (y down).
pub fn limb_point_px(centre_px: (f64, f64), radius_px: f64, angle_deg: f64) -> (f64, f64) {
    let (s, c) = angle_deg.to_radians().sin_cos();
    (centre_px.0 - radius_px * s, centre_px.1 - radius_px * c)
}

/// Angles for the numerals of marks at `angles_deg`, spread so that no two lie closer than
/// `min_gap_deg` around the circle, nor closer than that to a `reserved_deg` angle (where a
/// frame label or arrow stands), each moved as little as the spreading needs.
///
/// Returns: one angle per input, degrees in 0..360, in the input order.
/// Notes: neighbours closer than the gap are pushed apart, symmetrically or, beside a reserved
/// angle, the movable one alone, repeatedly until every gap is met (four marks need a few
/// passes); the marks themselves do not move.
pub fn label_angles_deg(angles_deg: &[f64], reserved_deg: &[f64], min_gap_deg: f64) -> Vec<f64> {
    // (angle, input index or None for a reserved angle)
    let mut items: Vec<(f64, Option<usize>)> = angles_deg
        .iter()
        .enumerate()
        .map(|(k, a)| (a.rem_euclid(360.0), Some(k)))
        .chain(reserved_deg.iter().map(|a| (a.rem_euclid(360.0), None)))
        .collect();
    items.sort_by(|a, b| a.0.total_cmp(&b.0));
    let n = items.len();
    if n > 1 && min_gap_deg * n as f64 <= 360.0 {
        for _ in 0..500 {
            let mut moved = false;
            for i in 0..n {
                let j = (i + 1) % n;
                let deficit = min_gap_deg - (items[j].0 - items[i].0).rem_euclid(360.0);
                if deficit <= 1e-9 {
                    continue;
                }
                let (share_i, share_j) = match (items[i].1, items[j].1) {
                    (Some(_), Some(_)) => (0.5, 0.5),
                    (Some(_), None) => (1.0, 0.0),
                    (None, Some(_)) => (0.0, 1.0),
                    (None, None) => continue,
                };
                items[i].0 -= share_i * (deficit + 1e-6);
                items[j].0 += share_j * (deficit + 1e-6);
                moved = true;
            }
            if !moved {
                break;
            }
        }
    }
    let mut out = vec![0.0; angles_deg.len()];
    for (angle, index) in items {
        if let Some(k) = index {
            out[k] = angle.rem_euclid(360.0);
        }
    }
    out
}

/// Where a frame's own labels and arrow stand on the label circle, degrees: the top (the up
/// arrow and its label), and for the north-up frame the east point.
pub fn reserved_deg(frame: LimbFrame) -> &'static [f64] {
    match frame {
        LimbFrame::Zenith => &[0.0],
        LimbFrame::North => &[0.0, 90.0],
    }
}

/// The fixed labels of a frame in the language: (text, x px, y px, text-anchor).
fn frame_labels(language: Language, frame: LimbFrame) -> Vec<(String, f64, f64, &'static str)> {
    let top = (CENTRE_PX.0, 16.0, "middle");
    let left_x = CENTRE_PX.0 - LABEL_RADIUS_PX - 22.0;
    match frame {
        LimbFrame::Zenith => vec![(word(language, "limb-zenith"), top.0, top.1, top.2)],
        LimbFrame::North => vec![
            (word(language, "limb-north"), top.0, top.1, top.2),
            (
                word(language, "limb-east"),
                left_x,
                CENTRE_PX.1 + 4.0,
                "middle",
            ),
        ],
    }
}

/// The drawing as an inline SVG element (no XML prolog), `aria-label` naming it.
///
/// Arguments: `language`, of the labels; `frame`, which way up; `marks`, the contacts that
/// occur at the station.
/// Returns: the disc, an arrow and a label for the up direction (and east for the north-up
/// frame), and for each contact a dot on the limb, a short tick outwards and its numeral.
pub fn limb_svg(language: Language, frame: LimbFrame, marks: &[LimbMark]) -> String {
    let label = word(
        language,
        match frame {
            LimbFrame::Zenith => "limb-zenith-label",
            LimbFrame::North => "limb-north-label",
        },
    );
    let (w, h) = VIEW_PX;
    let mut s = format!(
        "<svg xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 {w} {h}\" role=\"img\" \
         aria-label=\"{}\" class=\"limb\">\n",
        esc(&label)
    );
    s.push_str(&disc_with_frame_in(language, frame));
    push_marks(&mut s, marks, reserved_deg(frame));
    s.push_str("</svg>");
    s
}

/// The disc, the arrow towards the up direction and the frame's labels in English (the
/// inside of an SVG element of view box [`VIEW_PX`]): the service's drawing of the planet's
/// path; see [`disc_with_frame_in`].
pub fn disc_with_frame(frame: LimbFrame) -> String {
    disc_with_frame_in(Language::English, frame)
}

/// The disc, the arrow towards the up direction and the frame's labels in `language` (the
/// inside of an SVG element of view box [`VIEW_PX`]): the observers' sheets' drawings.
pub fn disc_with_frame_in(language: Language, frame: LimbFrame) -> String {
    let (cx, cy) = CENTRE_PX;
    let mut s = String::new();
    let _ = writeln!(
        s,
        "<circle cx=\"{cx}\" cy=\"{cy}\" r=\"{DISC_RADIUS_PX}\" fill=\"#fff7d6\" stroke=\"#000\" stroke-width=\"1.5\"/>"
    );
    // The arrow from the disc towards the up direction.
    let _ = writeln!(
        s,
        "<line x1=\"{cx}\" y1=\"{}\" x2=\"{cx}\" y2=\"24\" stroke=\"#555\" stroke-width=\"1\" stroke-dasharray=\"3 2\"/>",
        cy - 18.0
    );
    let _ = writeln!(
        s,
        "<polygon points=\"{},{} {},{} {cx},21\" fill=\"#555\"/>",
        cx - 4.0,
        29.0,
        cx + 4.0,
        29.0
    );
    for (text, x, y, anchor) in frame_labels(language, frame) {
        let _ = writeln!(
            s,
            "<text x=\"{x}\" y=\"{y}\" text-anchor=\"{anchor}\" font-size=\"15\" font-weight=\"bold\">{}</text>",
            esc(&text)
        );
    }
    s
}

/// Each contact's dot, tick and numeral (the angles of the marks, the frame's reserved angles
/// kept clear).
pub fn push_marks(s: &mut String, marks: &[LimbMark], reserved_deg: &[f64]) {
    let angles: Vec<f64> = marks.iter().map(|m| m.angle_deg).collect();
    let label_deg = label_angles_deg(&angles, reserved_deg, MIN_LABEL_GAP_DEG);
    for (m, &at_deg) in marks.iter().zip(&label_deg) {
        let (x, y) = limb_point_px(CENTRE_PX, DISC_RADIUS_PX, m.angle_deg);
        let (tx, ty) = limb_point_px(CENTRE_PX, LABEL_RADIUS_PX - 9.0, at_deg);
        let (lx, ly) = limb_point_px(CENTRE_PX, LABEL_RADIUS_PX, at_deg);
        let _ = writeln!(
            s,
            "<line x1=\"{x:.1}\" y1=\"{y:.1}\" x2=\"{tx:.1}\" y2=\"{ty:.1}\" stroke=\"#000\" stroke-width=\"0.8\"/>"
        );
        let _ = writeln!(
            s,
            "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"3.5\" fill=\"#b00\" stroke=\"#000\" stroke-width=\"0.6\"/>"
        );
        let _ = writeln!(
            s,
            "<text x=\"{lx:.1}\" y=\"{:.1}\" text-anchor=\"middle\" font-size=\"16\" font-weight=\"bold\">{}</text>",
            ly + 5.5,
            m.contact.roman()
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn gap_deg(a: f64, b: f64) -> f64 {
        let d = (a - b).rem_euclid(360.0);
        d.min(360.0 - d)
    }

    #[test]
    fn angles_run_anticlockwise_from_the_top_east_left() {
        let (x, y) = limb_point_px((0.0, 0.0), 10.0, 0.0);
        assert!(
            x.abs() < 1e-12 && (y + 10.0).abs() < 1e-12,
            "0 deg is at the top"
        );
        let (x, y) = limb_point_px((0.0, 0.0), 10.0, 90.0);
        assert!(
            (x + 10.0).abs() < 1e-12 && y.abs() < 1e-12,
            "90 deg (east) is left"
        );
        let (x, _) = limb_point_px((0.0, 0.0), 10.0, 270.0);
        assert!((x - 10.0).abs() < 1e-12, "270 deg (west) is right");
    }

    #[test]
    fn close_numerals_are_spread_and_far_ones_stay() {
        // Mercury 2032: contacts I and II 0.4 deg apart, III and IV likewise.
        let marks = [77.7, 77.3, 329.5, 329.1];
        let placed = label_angles_deg(&marks, &[], MIN_LABEL_GAP_DEG);
        for i in 0..4 {
            for j in i + 1..4 {
                assert!(
                    gap_deg(placed[i], placed[j]) >= MIN_LABEL_GAP_DEG - 1e-6,
                    "{placed:?}"
                );
            }
            assert!(
                gap_deg(placed[i], marks[i]) <= MIN_LABEL_GAP_DEG,
                "{placed:?}"
            );
        }
        // Across 0/360 as well.
        let placed = label_angles_deg(&[359.0, 1.0], &[], MIN_LABEL_GAP_DEG);
        assert!(
            gap_deg(placed[0], placed[1]) >= MIN_LABEL_GAP_DEG - 1e-6,
            "{placed:?}"
        );
        let far = [10.0, 100.0, 200.0];
        assert_eq!(label_angles_deg(&far, &[], MIN_LABEL_GAP_DEG), far.to_vec());
        // A reserved angle does not move, and numerals keep clear of it.
        let placed = label_angles_deg(&[346.5, 345.6], &[0.0], MIN_LABEL_GAP_DEG);
        for p in &placed {
            assert!(gap_deg(*p, 0.0) >= MIN_LABEL_GAP_DEG - 1e-6, "{placed:?}");
        }
        assert!(
            gap_deg(placed[0], placed[1]) >= MIN_LABEL_GAP_DEG - 1e-6,
            "{placed:?}"
        );
    }

    #[test]
    fn the_drawing_has_every_mark_and_the_labels_of_its_frame() {
        let marks = [
            LimbMark {
                contact: Contact::I,
                angle_deg: 77.7,
            },
            LimbMark {
                contact: Contact::IV,
                angle_deg: 329.1,
            },
        ];
        let svg = limb_svg(Language::English, LimbFrame::North, &marks);
        assert!(svg.contains(">I</text>") && svg.contains(">IV</text>"));
        assert!(svg.contains(">N</text>") && svg.contains(">E</text>"));
        assert!(limb_svg(Language::English, LimbFrame::Zenith, &marks).contains(">Zenith</text>"));
        // In German east is O(sten) and the zenith Zenit; the drawing is named in German.
        let de = limb_svg(Language::German, LimbFrame::North, &marks);
        assert!(de.contains(">O</text>") && de.contains("aria-label=\"Sonnenscheibe, Norden oben"));
        assert!(limb_svg(Language::German, LimbFrame::Zenith, &marks).contains(">Zenit</text>"));
    }
}
