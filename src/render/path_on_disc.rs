//! The planet's path across the Sun as seen from one station, north up and east left (as the
//! observers' sheets draw the disc, `sheet_limb.rs`, whose disc, frame and contact marks this
//! reuses): the track of the planet's centre with a band as wide as the planet, the four
//! predicted contacts on the limb, and a participant's timings placed on the track (where the
//! planet would be at each observed instant), each marked by a shape and a word for its
//! verdict, never by colour alone. Plain SVG with presentation attributes (the service's
//! content-security policy allows no script and no style attribute).
//!
//! References: the planet's place on the disc from the fundamental-plane elements
//! (`geometry::contacts::disc_place`; Chauvenet 1863, vol. I, the chapter on transits); the
//! position angle from the north point through east (*Explanatory Supplement to the
//! Astronomical Almanac*, 1992, section 8.3).

use super::sheet_limb::{
    disc_with_frame, limb_point_px, push_marks, reserved_deg, LimbFrame, LimbMark, CENTRE_PX,
    DISC_RADIUS_PX, VIEW_PX,
};
use super::svg::esc;
use crate::geometry::contacts::{disc_place, Contact, DiscPlace};
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;
use crate::reduction::agreement::Agreement;
use std::fmt::Write as _;

/// A participant's timing to place on the path.
#[derive(Clone, Debug, PartialEq)]
pub struct ObservedMark {
    /// The label beside the mark: the contact as written.
    pub label: String,
    /// The observed instant, hours from the elements' epoch (TT).
    pub observed_h: f64,
    /// The timing's verdict.
    pub verdict: Agreement,
}

/// The furthest from the Sun's centre a mark is drawn, in solar radii (beyond, the text
/// alternative says it lies off the drawing).
const MARK_LIMIT_SUN_RADII: f64 = 1.4;
/// Points along the track.
const TRACK_POINTS: usize = 48;

/// The path's predicted contacts at a station: (contact, hours, place), in order.
pub fn contact_places(event: &TransitEvent, station: &Station) -> Vec<(Contact, f64, DiscPlace)> {
    let geo = station.geocentric();
    event
        .predict(station)
        .contacts
        .iter()
        .flatten()
        .map(|c| {
            (
                c.contact,
                c.hours,
                disc_place(&event.elements, Some(&geo), c.hours),
            )
        })
        .collect()
}

/// A place on the disc in view-box px.
pub fn place_px(place: &DiscPlace) -> (f64, f64) {
    limb_point_px(
        CENTRE_PX,
        DISC_RADIUS_PX * place.separation_sun_radii,
        place.position_angle_deg,
    )
}

/// The track of the planet's centre from a little before the first contact to a little after
/// the last, as an SVG polyline's points and the planet's radius in px.
fn track(event: &TransitEvent, station: &Station, first_h: f64, last_h: f64) -> (String, f64) {
    let geo = station.geocentric();
    let margin_h = 0.08 * (last_h - first_h).max(0.1);
    let (from_h, to_h) = (first_h - margin_h, last_h + margin_h);
    let mut points = String::new();
    let mut radius_px = 0.0;
    for k in 0..=TRACK_POINTS {
        let h = from_h + (to_h - from_h) * k as f64 / TRACK_POINTS as f64;
        if !event.elements.covers(h) {
            continue;
        }
        let place = disc_place(&event.elements, Some(&geo), h);
        let (x, y) = place_px(&place);
        let _ = write!(points, "{x:.1},{y:.1} ");
        radius_px = DISC_RADIUS_PX * place.planet_radius_sun_radii;
    }
    (points.trim_end().to_string(), radius_px)
}

/// One observed timing's mark: a circle (fits), a square (doubtful) or a cross (rejected),
/// with its label and verdict word.
fn push_observed(s: &mut String, (x, y): (f64, f64), mark: &ObservedMark) {
    let (colour, word) = match mark.verdict {
        Agreement::Fits => ("#166534", "fits"),
        Agreement::Doubtful => ("#92400e", "doubtful"),
        Agreement::Rejected => ("#b91c1c", "off"),
    };
    match mark.verdict {
        Agreement::Fits => {
            let _ = writeln!(s, "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"4.5\" fill=\"{colour}\" stroke=\"#fff\" stroke-width=\"1\"/>");
        }
        Agreement::Doubtful => {
            let _ = writeln!(s, "<rect x=\"{:.1}\" y=\"{:.1}\" width=\"8\" height=\"8\" fill=\"{colour}\" stroke=\"#fff\" stroke-width=\"1\"/>", x - 4.0, y - 4.0);
        }
        Agreement::Rejected => {
            let _ = writeln!(s, "<path d=\"M{:.1},{:.1}L{:.1},{:.1}M{:.1},{:.1}L{:.1},{:.1}\" stroke=\"{colour}\" stroke-width=\"2.5\"/>", x - 4.5, y - 4.5, x + 4.5, y + 4.5, x - 4.5, y + 4.5, x + 4.5, y - 4.5);
        }
    }
    // The label inwards, towards the disc's centre, clear of the contact numerals outside.
    let (cx, cy) = CENTRE_PX;
    let (dx, dy) = (cx - x, cy - y);
    let d = dx.hypot(dy).max(1.0);
    let (lx, ly) = (x + 22.0 * dx / d, y + 22.0 * dy / d + 4.0);
    let _ = writeln!(
        s,
        "<text x=\"{lx:.1}\" y=\"{ly:.1}\" text-anchor=\"middle\" font-size=\"11\" fill=\"{colour}\">{} {word}</text>",
        esc(&mark.label)
    );
}

/// The drawing: an inline SVG element with `role="img"`, a `<title>` and a `<desc>`, or
/// `None` when the station sees no contact of the transit.
///
/// Arguments: `event`; `station`; `marks`, the participant's timings; `id`, a prefix for the
/// title's and description's element ids (unique on the page).
/// Returns: the SVG, and the text alternative that describes it.
pub fn path_on_disc_svg(
    event: &TransitEvent,
    station: &Station,
    marks: &[ObservedMark],
    id: &str,
) -> Option<(String, String)> {
    let contacts = contact_places(event, station);
    let first_h = contacts.first()?.1;
    let last_h = contacts.last()?.1;
    let (points, radius_px) = track(event, station, first_h, last_h);
    let (w, h) = VIEW_PX;
    let title = format!(
        "The planet's path across the Sun seen from {}",
        station.name
    );
    let text = text_alternative(event, station, &contacts, marks);
    let mut s = format!(
        "<svg xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 {w} {h}\" role=\"img\" aria-labelledby=\"{id}-title {id}-desc\" class=\"limb path\">\n<title id=\"{id}-title\">{}</title>\n<desc id=\"{id}-desc\">{}</desc>\n",
        esc(&title),
        esc(&text)
    );
    s.push_str(&disc_with_frame(LimbFrame::North));
    let _ = writeln!(s, "<polyline points=\"{points}\" fill=\"none\" stroke=\"#9ca3af\" stroke-width=\"{:.1}\" stroke-linecap=\"round\" stroke-opacity=\"0.6\"/>", (2.0 * radius_px).max(2.0));
    let _ = writeln!(
        s,
        "<polyline points=\"{points}\" fill=\"none\" stroke=\"#111827\" stroke-width=\"0.8\"/>"
    );
    let limb: Vec<LimbMark> = contacts
        .iter()
        .map(|(c, _, p)| LimbMark {
            contact: *c,
            angle_deg: p.position_angle_deg,
        })
        .collect();
    push_marks(&mut s, &limb, reserved_deg(LimbFrame::North));
    let geo = station.geocentric();
    for m in marks {
        if !event.elements.covers(m.observed_h) {
            continue;
        }
        let place = disc_place(&event.elements, Some(&geo), m.observed_h);
        if place.separation_sun_radii <= MARK_LIMIT_SUN_RADII {
            push_observed(&mut s, place_px(&place), m);
        }
    }
    s.push_str("</svg>");
    Some((s, text))
}

/// The drawing in words: where the planet enters and leaves, and where each timing falls.
fn text_alternative(
    event: &TransitEvent,
    station: &Station,
    contacts: &[(Contact, f64, DiscPlace)],
    marks: &[ObservedMark],
) -> String {
    let mut text = format!(
        "Solar disc with north up and east left, as seen from {}. Predicted contacts (position angle from north through east): ",
        station.name
    );
    let listed: Vec<String> = contacts
        .iter()
        .map(|(c, h, p)| {
            format!(
                "{} at {} ({:.0} degrees)",
                c.roman(),
                crate::time::iso::format_utc(event.label(*h), 0),
                p.position_angle_deg
            )
        })
        .collect();
    text.push_str(&listed.join(", "));
    text.push('.');
    let geo = station.geocentric();
    for m in marks {
        let on = event.elements.covers(m.observed_h)
            && disc_place(&event.elements, Some(&geo), m.observed_h).separation_sun_radii
                <= MARK_LIMIT_SUN_RADII;
        let _ = write!(
            text,
            " Your contact {}: {}{}.",
            m.label,
            m.verdict.as_str(),
            if on {
                ", marked where the planet would be at your time"
            } else {
                ", too far from the prediction to show on the drawing"
            }
        );
    }
    text
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{transit_on_date, Planet, TimeModel};

    fn event_2012() -> TransitEvent {
        let date = chrono::NaiveDate::from_ymd_opt(2012, 6, 6).unwrap();
        transit_on_date(Planet::Venus, date, &TimeModel::default()).unwrap()
    }

    #[test]
    fn contacts_lie_on_the_limb_and_marks_carry_words() {
        let event = event_2012();
        let st = Station::new("Jade Harbour School", 22.28, 114.16, 40.0).unwrap();
        let places = contact_places(&event, &st);
        assert_eq!(places.len(), 4);
        for (c, _, p) in &places {
            // Exterior contacts: centres 1 + r apart; interior: 1 - r (the cones' definition).
            let want = if c.is_exterior() {
                1.0 + p.planet_radius_sun_radii
            } else {
                1.0 - p.planet_radius_sun_radii
            };
            assert!((p.separation_sun_radii - want).abs() < 1e-6, "{c:?} {p:?}");
            // Venus is about 1/32 of the Sun across (58 arcsec against 1890).
            assert!((p.planet_radius_sun_radii - 0.0307).abs() < 0.002, "{p:?}");
        }
        let marks = [
            ObservedMark {
                label: "II".into(),
                observed_h: places[1].1 + 3.0 / 3600.0,
                verdict: Agreement::Fits,
            },
            ObservedMark {
                label: "III".into(),
                observed_h: places[2].1 + 8.0,
                verdict: Agreement::Rejected,
            },
        ];
        let (svg, text) = path_on_disc_svg(&event, &st, &marks, "p1").unwrap();
        assert!(svg.contains("role=\"img\"") && svg.contains("<title id=\"p1-title\">"));
        assert!(svg.contains(">II fits</text>"), "{svg}");
        assert!(!svg.contains("style="));
        assert!(text.contains("Your contact II: fits, marked"), "{text}");
        assert!(
            text.contains("Your contact III: rejected, too far"),
            "{text}"
        );
    }
}
