//! The observers' sheet: one printable, self-contained HTML page per station (inline CSS and
//! SVG, no script, nothing fetched) with the solar-observing caution, the four contacts in the
//! station's clock time and UTC, whether the Sun rises or sets during the transit, the solar
//! disc with each contact's place on the limb, and a blank table for the timings.
//!
//! The page fits one sheet of A4 or US Letter (`@page` size auto, 12 mm margins). Its words,
//! numbers and date are in the sheet's language (`sheet_words.rs`, `locales/*/sheet.ftl`).

use crate::geometry::contacts::{Contact, ContactCircumstances};
use crate::geometry::sun_horizon::{sun_during, sun_is_up, SunDuring};
use crate::geometry::transit::{StationPrediction, TransitEvent};
use crate::language::{text, Args, Language};
use crate::render::sheet_limb::{limb_svg, LimbFrame, LimbMark};
use crate::render::sheet_words::{
    caution, delta_t_note, delta_t_value, number, title, word, word_html,
};
use crate::render::svg::{esc, esc_text};
use crate::time::civil::{offset_text, CivilZone};
use crate::time::iso::format_utc;
use std::fmt::Write as _;

/// One station's sheet: its predictions, its clock's zone, the name of its calendar file and
/// the language it is written in.
#[derive(Clone, Copy, Debug)]
pub struct SheetStation<'a> {
    /// The station and its contacts.
    pub prediction: &'a StationPrediction,
    /// The station's civil zone, if any.
    pub zone: Option<&'a CivilZone>,
    /// The file name of the station's calendar, beside the sheet.
    pub calendar_file: &'a str,
    /// The language of the sheet and its calendar.
    pub language: Language,
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
svg.limb { width: 39mm; height: auto; display: block; margin: 0 auto; }
.blank td { height: 6mm; }
.fill { display: flex; gap: 12px; margin-top: 5px; }
.fill span { flex: 1; border-bottom: 1px solid #000; padding-top: 6px; font-size: 9pt; }
footer { margin-top: 4px; border-top: 1px solid #777; font-size: 7.5pt; }
@media print { body { margin: 0 auto; max-width: none; } }
@media screen { .scroll { overflow-x: auto; max-width: 100%; } svg { max-width: 100%; height: auto; } }
@media screen and (max-width: 600px) { body { margin: 8px; } .drawings { flex-wrap: wrap; } \
figure { width: 100%; } svg.limb { width: min(100%, 64mm); } .drawings .note { width: 100%; margin-top: 0; } .fill { flex-direction: column; } \
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
    let l = st.language;
    let station = &st.prediction.station;
    let _ = writeln!(
        s,
        "<header>\n<div class=\"caution\" role=\"note\">{}</div>",
        esc(&caution(l))
    );
    let _ = writeln!(
        s,
        "<h1>{}</h1>\n</header>\n<main>",
        esc(&title(l, event, &station.name))
    );
    let station_line = text(
        l,
        "sheet-station-html",
        &Args::new()
            .text("station", esc(&station.name))
            .text("latitude", number(l, station.latitude_deg, 4))
            .text("longitude", number(l, station.longitude_deg, 4))
            .text("elevation", number(l, station.elevation_m, 0)),
    );
    let _ = writeln!(s, "<p>{station_line}</p>");
    let zone_text = match st.zone {
        Some(z) => {
            let at = event.label(event.hours_of_greatest());
            let r = z.reading(at);
            text(
                l,
                "sheet-zone-html",
                &Args::new()
                    .text("zone", esc(&z.name()))
                    .text("abbreviation", esc(&r.abbreviation))
                    .text("offset", offset_text(r.offset_s)),
            )
        }
        None => word(l, "sheet-no-zone-html"),
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
    let l = st.language;
    let _ = write!(s, "<tr><td><b>{}</b></td>", contact.roman());
    let Some(x) = cc else {
        let span = if st.zone.is_some() { 7 } else { 6 };
        let _ = writeln!(
            s,
            "<td colspan=\"{span}\">{}</td></tr>",
            word_html(l, "sheet-no-such-contact")
        );
        return;
    };
    if let Some(z) = st.zone {
        let _ = write!(s, "<td class=\"t\">{}</td>", civil_html(event, x.hours, z));
    }
    let seen = word_html(
        l,
        if sun_is_up(x.sun_altitude_deg) {
            "sheet-seen-yes"
        } else {
            "sheet-seen-no"
        },
    );
    let deg = |x: f64| number(l, x, 1);
    let _ = writeln!(
        s,
        "<td class=\"t\">{}</td><td class=\"num\">{}°</td><td class=\"num\">{}°</td>\
         <td class=\"num\">{}°</td><td class=\"num\">{}°</td><td class=\"t\">{seen}</td></tr>",
        utc_html(event, x.hours),
        deg(x.sun_altitude_deg),
        deg(x.sun_azimuth_deg),
        deg(x.position_angle_deg),
        deg(x.vertex_angle_deg)
    );
}

/// The table of the four contacts and its note on accuracy.
fn push_contacts(s: &mut String, event: &TransitEvent, st: &SheetStation) {
    let l = st.language;
    let w = |id: &str| word_html(l, id);
    let heading = word(l, "sheet-contacts-heading");
    let _ = writeln!(s, "<h2>{}</h2>", esc_text(&heading));
    s.push_str(&scroll_open(&heading));
    let _ = write!(
        s,
        "<table>\n<tr><th scope=\"col\">{}</th>",
        w("sheet-col-contact")
    );
    if st.zone.is_some() {
        let _ = write!(s, "<th scope=\"col\">{}</th>", w("sheet-col-your-clock"));
    }
    s.push_str("<th scope=\"col\">UTC</th>");
    for id in [
        "sheet-col-sun-altitude",
        "sheet-col-sun-azimuth",
        "sheet-col-position-angle",
        "sheet-col-vertex-angle",
        "sheet-col-seen",
    ] {
        let _ = write!(s, "<th scope=\"col\">{}</th>", w(id));
    }
    s.push_str("</tr>\n");
    for c in Contact::ALL {
        let cc = st.prediction.contacts[c.index()];
        push_contact_row(s, event, st, c, cc.as_ref());
    }
    s.push_str("</table>\n</div>\n");
    let note = text(
        l,
        "sheet-contacts-note",
        &Args::new()
            .text("sigma", number(l, GEOMETRY_SIGMA_S, 1))
            .text("delta_t", delta_t_value(l, event)),
    );
    let _ = writeln!(s, "<p class=\"note\">{}</p>", esc_text(&note));
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
    let l = st.language;
    let during = sun_during(event, &st.prediction.station, first_h, last_h);
    let text_html = match during {
        SunDuring::UpThroughout => word_html(l, "sheet-sun-up-throughout"),
        SunDuring::DownThroughout => word_html(l, "sheet-sun-down-throughout"),
        SunDuring::Crossings(list) => list
            .iter()
            .map(|c| {
                let id = if c.rising {
                    "sheet-sun-rises-html"
                } else {
                    "sheet-sun-sets-html"
                };
                let time = both_clocks_html(event, c.hours, st.zone);
                text(l, id, &Args::new().text("time", time))
            })
            .collect::<Vec<_>>()
            .join(" "),
    };
    let _ = writeln!(
        s,
        "<p><b>{}</b> {text_html} <span class=\"note\">{}</span></p>",
        word_html(l, "sheet-sun-heading"),
        word_html(l, "sheet-sun-note")
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
    let l = st.language;
    let w = |id: &str| word_html(l, id);
    let _ = writeln!(
        s,
        "<h2>{}</h2>\n<div class=\"drawings\">",
        w("sheet-drawings-heading")
    );
    let _ = writeln!(
        s,
        "<figure><figcaption>{}<br>{}</figcaption>\n{}</figure>",
        w("sheet-zenith-caption-1"),
        w("sheet-zenith-caption-2"),
        limb_svg(l, LimbFrame::Zenith, &marks(true))
    );
    let _ = writeln!(
        s,
        "<figure><figcaption>{}<br>{}</figcaption>\n{}</figure>",
        w("sheet-north-caption-1"),
        w("sheet-north-caption-2"),
        limb_svg(l, LimbFrame::North, &marks(false))
    );
    let _ = writeln!(
        s,
        "<p class=\"note\">{}</p>\n</div>",
        w("sheet-drawings-note")
    );
}

/// The blank table for the timings, with the lines for observer, instrument and clock.
fn push_blank_table(s: &mut String, l: Language) {
    let w = |id: &str| word_html(l, id);
    let heading = word(l, "sheet-timings-heading");
    let _ = writeln!(s, "<h2>{}</h2>", esc_text(&heading));
    s.push_str(&scroll_open(&heading));
    s.push_str("<table class=\"blank\">\n<tr>");
    for id in [
        "sheet-col-contact",
        "sheet-col-clock-time",
        "sheet-col-zone",
    ] {
        let _ = write!(s, "<th scope=\"col\">{}</th>", w(id));
    }
    let _ = write!(
        s,
        "<th scope=\"col\">{}</th>",
        word(l, "sheet-col-sure-html")
    );
    for id in ["sheet-col-observer", "sheet-col-what-seen"] {
        let _ = write!(s, "<th scope=\"col\">{}</th>", w(id));
    }
    s.push_str("</tr>\n");
    for _ in 0..5 {
        s.push_str(
            "<tr><td></td><td>&nbsp;&nbsp;&nbsp;&nbsp;:&nbsp;&nbsp;&nbsp;&nbsp;&nbsp;:</td>\
             <td></td><td></td><td></td><td></td></tr>\n",
        );
    }
    let _ = writeln!(
        s,
        "</table>\n</div>\n<div class=\"fill\"><span>{}</span><span>{}</span><span>{}</span></div>\n<p class=\"note\">{}</p>",
        w("sheet-fill-observers"),
        w("sheet-fill-instrument"),
        w("sheet-fill-clock"),
        word(l, "sheet-reduce-note-html")
    );
}

/// The footer: how the times were computed, and by what.
fn push_footer(s: &mut String, event: &TransitEvent, st: &SheetStation, seen_up: usize) {
    let l = st.language;
    let file = st.calendar_file;
    let calendar = if seen_up == 0 {
        text(l, "sheet-calendar-empty", &Args::new().text("file", file))
    } else {
        let args = Args::new().text("file", file).count("n", seen_up);
        text(l, "sheet-calendar-holds", &args)
    };
    let computed = text(
        l,
        "sheet-computed",
        &Args::new()
            .text("version", env!("CARGO_PKG_VERSION"))
            .text("ephemeris", event.ephemeris_name())
            .text("delta_t", delta_t_value(l, event)),
    );
    let _ = writeln!(
        s,
        "<footer><p>{} {} {}</p></footer>",
        esc_text(&calendar),
        esc_text(&computed),
        esc_text(&delta_t_note(l, event))
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

/// The whole sheet of one station, a self-contained HTML page in the sheet's language.
pub fn observer_sheet_html(event: &TransitEvent, st: &SheetStation) -> String {
    let mut s = String::with_capacity(24_000);
    let _ = writeln!(
        s,
        "<!DOCTYPE html>\n<html lang=\"{}\"><head><meta charset=\"utf-8\">\n\
         <meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n\
         <title>{}</title>\n<style>\n{STYLE}\n</style></head><body>",
        st.language.code(),
        esc(&title(st.language, event, &st.prediction.station.name))
    );
    push_heading(&mut s, event, st);
    push_contacts(&mut s, event, st);
    push_sun_during(&mut s, event, st);
    push_drawings(&mut s, st);
    push_blank_table(&mut s, st.language);
    s.push_str("</main>\n");
    push_footer(&mut s, event, st, contacts_seen_up(st.prediction));
    s.push_str("</body></html>\n");
    s
}
