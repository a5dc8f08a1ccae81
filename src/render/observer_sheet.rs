//! The observers' sheet: one printable, self-contained HTML page per station (inline CSS and
//! SVG, no script, nothing fetched) with the solar-observing caution, the four contacts in the
//! station's clock time and UTC, whether the Sun rises or sets during the transit, the solar
//! disc with each contact's place on the limb, and a blank table for the timings.
//!
//! The page fits one sheet of A4 or US Letter (`@page` size auto, 12 mm margins).

use crate::geometry::contacts::{Contact, ContactCircumstances};
use crate::geometry::sun_horizon::{sun_during, sun_is_up, SunDuring};
use crate::geometry::transit::{StationPrediction, TransitEvent};
use crate::render::sheet_limb::{limb_svg, LimbFrame, LimbMark};
use crate::render::station_predictions::{delta_t_note, delta_t_text};
use crate::render::svg::esc;
use crate::render::text::SAFETY_CAUTION;
use crate::time::civil::{offset_text, CivilZone};
use crate::time::iso::format_utc;
use std::fmt::Write as _;

/// One station's sheet: its predictions, its clock's zone and the name of its calendar file.
#[derive(Clone, Copy, Debug)]
pub struct SheetStation<'a> {
    /// The station and its contacts.
    pub prediction: &'a StationPrediction,
    /// The station's civil zone, if any.
    pub zone: Option<&'a CivilZone>,
    /// The file name of the station's calendar, beside the sheet.
    pub calendar_file: &'a str,
}

/// The uncertainty of a predicted contact from the geometry alone (ephemeris and elements),
/// seconds: the largest difference from Skyfield with the JPL ephemerides over 1,080 contacts
/// was 0.054 s (README, "How accurate"), stated as 0.1 s.
pub const GEOMETRY_SIGMA_S: f64 = 0.1;

/// The sheet's style sheet, the text of its `<style>` element between two line ends (the
/// service allows it by its hash in the content-security policy).
pub const STYLE: &str = "@page { size: auto; margin: 12mm; }
* { box-sizing: border-box; }
body { font: 9.5pt/1.28 'DejaVu Sans', Arial, sans-serif; color: #000; background: #fff; max-width: 186mm; margin: 8px auto; }
h1 { font-size: 14pt; margin: 5px 0 2px; }
h2 { font-size: 10.5pt; margin: 6px 0 2px; }
p { margin: 3px 0; }
.caution { border: 3px solid #000; background: #ffe9a8; padding: 5px 9px; font-weight: bold; font-size: 10.5pt; }
table { border-collapse: collapse; width: 100%; }
th, td { border: 1px solid #777; padding: 1px 4px; text-align: left; vertical-align: top; }
th { background: #eee; font-size: 9pt; }
td.num { text-align: right; }
td.t { white-space: nowrap; }
.note { font-size: 7.5pt; color: #222; }
.drawings { display: flex; gap: 10px; align-items: flex-start; }
figure { margin: 0; width: 36%; text-align: center; }
.drawings .note { width: 28%; margin-top: 18px; }
figcaption { font-size: 9pt; font-weight: bold; }
svg.limb { width: 42mm; height: auto; display: block; margin: 0 auto; }
.blank td { height: 6.5mm; }
.fill { display: flex; gap: 12px; margin-top: 5px; }
.fill span { flex: 1; border-bottom: 1px solid #000; padding-top: 6px; font-size: 9pt; }
footer { margin-top: 4px; border-top: 1px solid #777; font-size: 7.5pt; }
@media print { body { margin: 0 auto; max-width: none; } }
@media screen { .scroll { overflow-x: auto; max-width: 100%; } svg { max-width: 100%; height: auto; } }
@media screen and (max-width: 600px) { body { margin: 8px; } .drawings { flex-wrap: wrap; } \
figure { width: 46%; } .drawings .note { width: 100%; margin-top: 0; } .fill { flex-direction: column; } \
.scroll > table { min-width: 34rem; } }";

/// A contact's UTC label rounded to the second, `2032-11-13T06:41:21Z`.
fn utc_iso(event: &TransitEvent, hours: f64) -> String {
    format_utc(event.label(hours), 0)
}

/// A contact's civil reading rounded to the second, as HTML: the clock time and abbreviation,
/// the full ISO 8601 reading in the `datetime` attribute.
fn civil_html(event: &TransitEvent, hours: f64, zone: &CivilZone) -> String {
    let r = zone.reading(event.label(hours));
    let iso = r.iso(0);
    format!(
        "<time datetime=\"{iso}\">{} {}</time>",
        &iso[11..19],
        esc(&r.abbreviation)
    )
}

/// A contact's UTC time as HTML, `<time datetime="...Z">06:41:21 UTC</time>`.
fn utc_html(event: &TransitEvent, hours: f64) -> String {
    let iso = utc_iso(event, hours);
    format!("<time datetime=\"{iso}\">{} UTC</time>", &iso[11..19])
}

/// A time in the station's clock and in UTC, `07:41:21 CET (06:41:21 UTC)`, or UTC alone.
fn both_clocks_html(event: &TransitEvent, hours: f64, zone: Option<&CivilZone>) -> String {
    match zone {
        Some(z) => format!(
            "{} ({})",
            civil_html(event, hours, z),
            utc_html(event, hours)
        ),
        None => utc_html(event, hours),
    }
}

/// The heading: caution, event, station and the zone the times are given in.
fn push_heading(s: &mut String, event: &TransitEvent, st: &SheetStation) {
    let station = &st.prediction.station;
    let planet = event.planet.title();
    let _ = writeln!(
        s,
        "<header>\n<div class=\"caution\" role=\"note\">{}</div>",
        esc(SAFETY_CAUTION)
    );
    let _ = writeln!(
        s,
        "<h1>Transit of {planet}, {}: {}</h1>\n</header>\n<main>",
        event.date(),
        esc(&station.name)
    );
    let _ = writeln!(
        s,
        "<p>Station: <b>{}</b>, latitude {:.4}°, longitude {:.4}° (east positive), elevation {:.0} m.</p>",
        esc(&station.name),
        station.latitude_deg,
        station.longitude_deg,
        station.elevation_m
    );
    let zone_text = match st.zone {
        Some(z) => {
            let at = event.label(event.hours_of_greatest());
            let r = z.reading(at);
            format!(
                "Clock times are in <b>{}</b>: {} (UTC{}) during the transit; UTC is given beside them.",
                esc(&z.name()),
                esc(&r.abbreviation),
                offset_text(r.offset_s)
            )
        }
        None => "No time zone was given for this station, so the times are in <b>UTC only</b>. \
                 To have them in your clock time, run <code>predict</code> again with \
                 <code>--time-zone ZONE</code> (e.g. <code>Europe/Amsterdam</code> or \
                 <code>+05:30</code>) or add a <code>time_zone</code> column to the stations file."
            .to_string(),
    };
    let _ = writeln!(s, "<p>{zone_text}</p>");
}

/// The opening of a box that lets a wide table scroll sideways on a phone's screen (never in
/// print), reachable from the keyboard and named for screen readers.
fn scroll_open(label: &str) -> String {
    format!(
        "<div class=\"scroll\" tabindex=\"0\" role=\"region\" aria-label=\"{}\">\n",
        esc(label)
    )
}

/// One row of the contacts table.
fn push_contact_row(
    s: &mut String,
    event: &TransitEvent,
    st: &SheetStation,
    contact: Contact,
    cc: Option<&ContactCircumstances>,
) {
    let _ = write!(s, "<tr><td><b>{}</b></td>", contact.roman());
    let Some(x) = cc else {
        let span = if st.zone.is_some() { 7 } else { 6 };
        let _ = writeln!(
            s,
            "<td colspan=\"{span}\">no such contact at this station (grazing transit)</td></tr>"
        );
        return;
    };
    if let Some(z) = st.zone {
        let _ = write!(s, "<td class=\"t\">{}</td>", civil_html(event, x.hours, z));
    }
    let seen = if sun_is_up(x.sun_altitude_deg) {
        "yes, Sun up"
    } else {
        "below horizon — not seen"
    };
    let _ = writeln!(
        s,
        "<td class=\"t\">{}</td><td class=\"num\">{:.1}°</td><td class=\"num\">{:.1}°</td>\
         <td class=\"num\">{:.1}°</td><td class=\"num\">{:.1}°</td><td class=\"t\">{seen}</td></tr>",
        utc_html(event, x.hours),
        x.sun_altitude_deg,
        x.sun_azimuth_deg,
        x.position_angle_deg,
        x.vertex_angle_deg
    );
}

/// The table of the four contacts and its note on accuracy.
fn push_contacts(s: &mut String, event: &TransitEvent, st: &SheetStation) {
    s.push_str("<h2>The four contacts</h2>\n");
    s.push_str(&scroll_open("The four contacts"));
    s.push_str("<table>\n<tr><th scope=\"col\">Contact</th>");
    if st.zone.is_some() {
        s.push_str("<th scope=\"col\">Your clock</th>");
    }
    s.push_str(
        "<th scope=\"col\">UTC</th><th scope=\"col\">Sun altitude</th>\
         <th scope=\"col\">Sun azimuth</th><th scope=\"col\">Position angle</th>\
         <th scope=\"col\">Vertex angle</th><th scope=\"col\">Seen?</th></tr>\n",
    );
    for c in Contact::ALL {
        let cc = st.prediction.contacts[c.index()];
        push_contact_row(s, event, st, c, cc.as_ref());
    }
    s.push_str("</table>\n</div>\n");
    let _ = writeln!(
        s,
        "<p class=\"note\">Times are rounded to the second. They are the ideal geometric contacts \
         (I, II: ingress outer and inner; III, IV: egress inner and outer), predicted to \
         ±{GEOMETRY_SIGMA_S} s from the ephemeris, with Delta T {} s (see the foot of the page); \
         what you see may differ by several seconds (the black drop, seeing, your clock). \
         Altitude: true altitude of the Sun's centre (no refraction); azimuth from north \
         through east. Seen: the Sun's upper limb above the horizon (true altitude above −0°50′).</p>",
        esc(&delta_t_text(event).replace("+-", "±"))
    );
}

/// Whether the Sun rises or sets between contacts I and IV, in a paragraph.
fn push_sun_during(s: &mut String, event: &TransitEvent, st: &SheetStation) {
    let hours: Vec<f64> = st
        .prediction
        .contacts
        .iter()
        .flatten()
        .map(|c| c.hours)
        .collect();
    let (Some(&first_h), Some(&last_h)) = (hours.first(), hours.last()) else {
        return;
    };
    let during = sun_during(event, &st.prediction.station, first_h, last_h);
    let text = match during {
        SunDuring::UpThroughout => "The Sun stays up through the whole transit.".to_string(),
        SunDuring::DownThroughout => {
            "The Sun is down for the whole transit: nothing of it can be seen from here."
                .to_string()
        }
        SunDuring::Crossings(list) => list
            .iter()
            .map(|c| {
                format!(
                    "The Sun {} during the transit, at {}.",
                    if c.rising { "rises" } else { "sets" },
                    both_clocks_html(event, c.hours, st.zone)
                )
            })
            .collect::<Vec<_>>()
            .join(" "),
    };
    let _ = writeln!(
        s,
        "<p><b>Sunrise and sunset:</b> {text} <span class=\"note\">(upper limb on the \
         horizon, standard altitude −0°50′, Meeus ch. 15; the station's height not allowed \
         for)</span></p>"
    );
}

/// The two drawings of the disc.
fn push_drawings(s: &mut String, st: &SheetStation) {
    let contacts: Vec<&ContactCircumstances> = st.prediction.contacts.iter().flatten().collect();
    let marks = |vertex: bool| -> Vec<LimbMark> {
        contacts
            .iter()
            .map(|c| LimbMark {
                contact: c.contact,
                angle_deg: if vertex {
                    c.vertex_angle_deg
                } else {
                    c.position_angle_deg
                },
            })
            .collect()
    };
    s.push_str("<h2>Where on the Sun's edge to look</h2>\n<div class=\"drawings\">\n");
    let _ = writeln!(
        s,
        "<figure><figcaption>In the sky: zenith up<br>(vertex angle)</figcaption>\n{}</figure>",
        limb_svg(LimbFrame::Zenith, &marks(true))
    );
    let _ = writeln!(
        s,
        "<figure><figcaption>Equatorial mount: north up,<br>east left (position angle)</figcaption>\n{}</figure>",
        limb_svg(LimbFrame::North, &marks(false))
    );
    s.push_str(
        "<p class=\"note\">Position angle is counted from the north point of the disc \
         through east, vertex angle from the point nearest the zenith through east; both \
         anticlockwise here, as the sky is seen directly. A star diagonal mirrors the image and a \
         projection screen may mirror or turn it: check which way the Sun drifts before the \
         transit.</p>\n</div>\n",
    );
}

/// The blank table for the timings, with the lines for observer, instrument and clock.
fn push_blank_table(s: &mut String) {
    s.push_str("<h2>Your timings</h2>\n");
    s.push_str(&scroll_open("Your timings"));
    s.push_str(
        "<table class=\"blank\">\n<tr><th scope=\"col\">Contact</th>\
         <th scope=\"col\">Clock time (hh:mm:ss.s)</th><th scope=\"col\">Zone or offset</th>\
         <th scope=\"col\">Sure to&nbsp;±&nbsp;s</th><th scope=\"col\">Observer</th>\
         <th scope=\"col\">What you saw (black drop, cloud)</th></tr>\n",
    );
    for _ in 0..5 {
        s.push_str(
            "<tr><td></td><td>&nbsp;&nbsp;&nbsp;&nbsp;:&nbsp;&nbsp;&nbsp;&nbsp;&nbsp;:</td>\
             <td></td><td></td><td></td><td></td></tr>\n",
        );
    }
    s.push_str(
        "</table>\n</div>\n<div class=\"fill\"><span>Observer(s):</span><span>Instrument, aperture (mm), \
         filter or projection:</span><span>Clock set by (GPS, radio, phone), its error:</span></div>\n<p class=\"note\">For \
         <code>reduce</code>, copy each row into an observations file (<code>transit-parallax \
         template observations</code>): contact, time_utc (or the clock time with its offset, \
         2032-11-13T07:43:40.5+01:00), sigma_s (how sure) and observer.</p>\n",
    );
}

/// The footer: how the times were computed, and by what.
fn push_footer(s: &mut String, event: &TransitEvent, st: &SheetStation, seen_up: usize) {
    let calendar = if seen_up == 0 {
        format!(
            "None of the contacts is seen from here with the Sun up, so the calendar {} holds no events.",
            esc(st.calendar_file)
        )
    } else {
        format!(
            "The calendar {} holds the {seen_up} contact(s) seen with the Sun up, with reminders.",
            esc(st.calendar_file)
        )
    };
    let _ = writeln!(
        s,
        "<footer><p>{calendar} Computed by transit-parallax {} with the {} ephemeris; Delta T {} \
         s. {}</p></footer>",
        env!("CARGO_PKG_VERSION"),
        esc(&event.ephemeris_name()),
        esc(&delta_t_text(event).replace("+-", "±")),
        esc(delta_t_note(event).trim())
    );
}

/// The number of contacts at a station seen with the Sun up (its upper limb above the
/// horizon).
pub fn contacts_seen_up(prediction: &StationPrediction) -> usize {
    prediction
        .contacts
        .iter()
        .flatten()
        .filter(|c| sun_is_up(c.sun_altitude_deg))
        .count()
}

/// The whole sheet of one station, a self-contained HTML page.
pub fn observer_sheet_html(event: &TransitEvent, st: &SheetStation) -> String {
    let mut s = String::with_capacity(24_000);
    let _ = writeln!(
        s,
        "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n\
         <meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n\
         <title>Transit of {} {}: {}</title>\n<style>\n{STYLE}\n</style></head><body>",
        event.planet.title(),
        event.date(),
        esc(&st.prediction.station.name)
    );
    push_heading(&mut s, event, st);
    push_contacts(&mut s, event, st);
    push_sun_during(&mut s, event, st);
    push_drawings(&mut s, st);
    push_blank_table(&mut s);
    s.push_str("</main>\n");
    push_footer(&mut s, event, st, contacts_seen_up(st.prediction));
    s.push_str("</body></html>\n");
    s
}
