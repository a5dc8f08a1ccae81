//! The participant's forms: the station and up to four timings (one block per contact,
//! stacked on a phone), a pasted observations file, an uploaded one. Every field has its own
//! `<label for>`; choices (contact, kind of local time, day reckoning) are lists, so nothing
//! has to be spelled; the station's name and coordinates are `required`. The posted names are
//! the ones `intake::from_form` reads (`station`, `latitude`, ..., `contact0`, `time_utc0`,
//! `time_local0`, `local_time0`, `day_reckoning0`, `sigma_s0`, ..., `observer`,
//! `clock_source`, `instrument`, `aperture_mm`, `viewing`, `notes`, `csv`, `file`).
//!
//! Latitude and longitude keep the ordinary keyboard: a phone's decimal pad (`inputmode=
//! "decimal"`) has no minus sign on some systems, and south and west are negative; elevation
//! and uncertainties, which are positive, get the decimal pad.

use super::store::TimingFields;
use crate::language::{text, Args, Language};
use crate::render::svg::esc;
use std::fmt::Write;

/// A message of the form in the visitor's language.
fn t(language: Language, id: &str) -> String {
    text(language, id, &Args::new())
}

/// A message with one text value.
fn t1(language: Language, id: &str, name: &'static str, value: &str) -> String {
    text(language, id, &Args::new().text(name, value))
}

/// A text field with its label (and a hint inside the label, read with it).
pub(super) fn text_field(name: &str, label: &str, hint: &str, value: &str, attrs: &str) -> String {
    let hint = if hint.is_empty() {
        String::new()
    } else {
        format!(" <span class=\"hint\">{}</span>", esc(hint))
    };
    format!(
        "<div class=\"field\"><label for=\"{n}\">{}{hint}</label><input id=\"{n}\" name=\"{n}\" value=\"{}\" autocomplete=\"off\" spellcheck=\"false\"{attrs}/></div>",
        esc(label),
        esc(value),
        n = esc(name),
    )
}

/// A choice list with its label; `options` are (value posted, id of the message shown);
/// `value` is selected, and kept as an option of its own when it is none of `options` (a
/// correction then sends back what was sent).
fn select_field(
    language: Language,
    (name, label): (&str, &str),
    options: &[(&str, &str)],
    value: &str,
) -> String {
    let mut s = format!(
        "<div class=\"field\"><label for=\"{n}\">{}</label><select id=\"{n}\" name=\"{n}\">",
        esc(label),
        n = esc(name)
    );
    let known = options.iter().any(|(v, _)| v.eq_ignore_ascii_case(value));
    if !known {
        let _ = write!(
            s,
            "<option value=\"{}\" selected>{}</option>",
            esc(value),
            esc(&t1(language, "as-sent", "value", value))
        );
    }
    for (v, id) in options {
        let selected = if known && v.eq_ignore_ascii_case(value) {
            " selected"
        } else {
            ""
        };
        let _ = write!(
            s,
            "<option value=\"{}\"{selected}>{}</option>",
            esc(v),
            esc(&t(language, id))
        );
    }
    s.push_str("</select></div>");
    s
}

/// The choices of contact: the value posted and the message shown.
const CONTACTS: [(&str, &str); 5] = [
    ("", "contact-none"),
    ("1", "contact-1"),
    ("2", "contact-2"),
    ("3", "contact-3"),
    ("4", "contact-4"),
];

/// The kinds of local time.
const LOCAL_TIMES: [(&str, &str); 3] = [
    ("", "local-kind-none"),
    ("apparent", "local-kind-apparent"),
    ("mean", "local-kind-mean"),
];

/// The day reckonings.
const DAY_RECKONINGS: [(&str, &str); 2] = [("", "day-civil"), ("astronomical", "day-astronomical")];

/// The clocks a time may have been read from.
const CLOCK_SOURCES: [(&str, &str); 6] = [
    ("", "not-said"),
    ("gps", "clock-gps"),
    ("radio", "clock-radio"),
    ("network", "clock-network"),
    ("phone", "clock-phone"),
    ("other", "clock-other"),
];

/// The ways the Sun may have been viewed (both safe; see the caution).
const VIEWINGS: [(&str, &str); 3] = [
    ("", "not-said"),
    ("filter", "viewing-filter"),
    ("projection", "viewing-projection"),
];

/// The fieldset of how the timings were made: observer, clock, instrument, aperture, viewing,
/// notes (the submission's; every timing takes them).
fn how_fields(l: Language, first: &TimingFields) -> String {
    let heading = t(l, "how-heading");
    format!(
        "<h2>{h}</h2>\n<fieldset><legend class=\"vh\">{h}</legend>\n<div class=\"row\">{}{}</div>\n<div class=\"row\">{}{}</div>\n{}\n<div class=\"field\"><label for=\"notes\">{} <span class=\"hint\">{}</span></label><textarea id=\"notes\" name=\"notes\" rows=\"2\">{}</textarea></div>\n</fieldset>\n",
        text_field("observer", &t(l, "observer"), &t(l, "observer-hint"), &first.observer, ""),
        select_field(l, ("clock_source", &t(l, "clock-source")), &CLOCK_SOURCES, &first.clock_source),
        text_field("instrument", &t(l, "instrument"), &t(l, "instrument-hint"), &first.instrument, ""),
        text_field("aperture_mm", &t(l, "aperture"), &t(l, "aperture-hint"), &first.aperture_mm, " inputmode=\"numeric\""),
        select_field(l, ("viewing", &t(l, "viewing")), &VIEWINGS, &first.viewing),
        esc(&t(l, "notes")),
        esc(&t(l, "notes-hint")),
        esc(&first.notes),
        h = esc(&heading),
    )
}

/// The hidden fields every form posts: the anti-forgery token, and the edit key of a
/// correction.
fn hidden(csrf: &str, key: Option<&str>) -> String {
    let mut s = format!(
        "<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n",
        esc(csrf)
    );
    if let Some(k) = key {
        let _ = writeln!(
            s,
            "<input type=\"hidden\" name=\"key\" value=\"{}\"/>",
            esc(k)
        );
    }
    s
}

/// The station's fieldset.
fn station_fields(l: Language, first: &TimingFields) -> String {
    const DECIMAL: &str = " inputmode=\"decimal\"";
    let heading = t(l, "station-heading");
    format!(
        "<h2>{h}</h2>\n<fieldset><legend class=\"vh\">{h}</legend>\n{}\n<div class=\"row\">{}{}</div>\n<div class=\"row\">{}{}</div>\n</fieldset>\n",
        text_field("station", &t(l, "station-name"), &t(l, "station-name-hint"), &first.station, " required"),
        text_field("latitude", &t(l, "latitude"), &t1(l, "latitude-hint", "example", "-33.87"), &first.latitude, " required"),
        text_field("longitude", &t(l, "longitude"), &t1(l, "longitude-hint", "example", "-157.86"), &first.longitude, " required"),
        text_field("elevation_m", &t(l, "elevation"), &t(l, "elevation-hint"), &first.elevation_m, DECIMAL),
        text_field("longitude_sigma_deg", &t(l, "longitude-sigma"), &t(l, "longitude-sigma-hint"), &first.longitude_sigma_deg, ""),
        h = esc(&heading),
    )
}

/// One timing's fieldset (`k` from 0): the contact, the time in UTC and its uncertainty; and,
/// folded away unless one of them holds something, the fields of a local solar time.
fn timing_fields(l: Language, k: usize, f: &TimingFields) -> String {
    let local = [&f.time_local, &f.local_time, &f.day_reckoning];
    let open = if local.iter().any(|v| !v.is_empty()) {
        " open"
    } else {
        ""
    };
    let legend = t1(l, "timing-legend", "number", &(k + 1).to_string());
    format!(
        "<fieldset class=\"timing\"><legend>{}</legend>\n{}\n{}\n{}\n<details class=\"local\"{open}><summary>{}</summary>\n{}\n<div class=\"row\">{}{}</div>\n</details>\n</fieldset>\n",
        esc(&legend),
        select_field(l, (&format!("contact{k}"), &t(l, "contact")), &CONTACTS, &f.contact),
        text_field(&format!("time_utc{k}"), &t(l, "time-utc"), &t1(l, "time-utc-hint", "example", "2012-06-05T22:25:41.3Z"), &f.time_utc, ""),
        text_field(&format!("sigma_s{k}"), &t(l, "sigma"), &t(l, "sigma-hint"), &f.sigma_s, " inputmode=\"decimal\""),
        esc(&t(l, "local-summary")),
        text_field(&format!("time_local{k}"), &t(l, "time-local"), &t1(l, "time-local-hint", "example", "1769-06-03T21:25:03.5"), &f.time_local, ""),
        select_field(l, (&format!("local_time{k}"), &t(l, "local-kind")), &LOCAL_TIMES, &f.local_time),
        select_field(l, (&format!("day_reckoning{k}"), &t(l, "day-reckoning")), &DAY_RECKONINGS, &f.day_reckoning),
    )
}

/// The form for a station and its timings in the visitor's language, pre-filled with
/// `fields` (empty for a new submission), posting to `action` with the anti-forgery token
/// (and the edit key, for a correction); then the form that posts a pasted observations file
/// to the same address.
pub fn timing_form(
    l: Language,
    action: &str,
    (csrf, key): (&str, Option<&str>),
    fields: &[TimingFields],
) -> String {
    let first = fields.first().cloned().unwrap_or_default();
    let mut s = format!(
        "<form method=\"post\" action=\"{}\" id=\"timings-form\">\n{}",
        esc(action),
        hidden(csrf, key)
    );
    s.push_str(&station_fields(l, &first));
    s.push_str(&how_fields(l, &first));
    let _ = writeln!(
        s,
        "<h2>{}</h2>\n<p class=\"note\">{}</p>\n<div class=\"timings\">",
        esc(&t(l, "timings-heading")),
        esc(&t(l, "timings-note"))
    );
    for k in 0..4 {
        s.push_str(&timing_fields(
            l,
            k,
            &fields.get(k).cloned().unwrap_or_default(),
        ));
    }
    let _ = writeln!(
        s,
        "</div>\n<p class=\"actions\"><button type=\"submit\" id=\"send\">{}</button></p>\n</form>",
        esc(&t(l, "send-timings"))
    );
    let columns = "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s";
    let _ = writeln!(
        s,
        "<form method=\"post\" action=\"{}\" id=\"paste-form\">\n{}<fieldset><legend>{}</legend>\n<div class=\"field\"><label for=\"csv\">{} <span class=\"hint\">{}</span></label><textarea name=\"csv\" id=\"csv\" rows=\"6\" spellcheck=\"false\" required></textarea></div>\n<p class=\"actions\"><button type=\"submit\" id=\"send-paste\">{}</button></p>\n</fieldset>\n</form>",
        esc(action),
        hidden(csrf, key),
        esc(&t(l, "paste-legend")),
        esc(&t(l, "paste-label")),
        esc(&t1(l, "paste-hint", "columns", columns)),
        esc(&t(l, "send-paste")),
    );
    s
}

/// The form that uploads an observations file (multipart), with the anti-forgery token.
pub fn upload_form(l: Language, csrf: &str) -> String {
    format!(
        "<form method=\"post\" action=\"/upload\" enctype=\"multipart/form-data\" id=\"upload-form\">\n<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n<fieldset><legend>{}</legend>\n<div class=\"field\"><label for=\"file\">{} <span class=\"hint\">{}</span></label><input type=\"file\" name=\"file\" id=\"file\" accept=\".csv,.tsv,.txt,.xlsx,.ods,text/csv\" required/></div>\n<p class=\"actions\"><button type=\"submit\" id=\"upload\">{}</button></p>\n</fieldset>\n</form>\n",
        esc(csrf),
        esc(&t(l, "upload-legend")),
        esc(&t(l, "upload-label")),
        esc(&t(l, "upload-hint")),
        esc(&t(l, "send-file")),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every field of the form has a label that names it, and what a correction sends back
    /// is what was sent, also where a choice list does not hold it.
    #[test]
    fn every_field_is_labelled_and_values_are_kept() {
        let f = TimingFields {
            station: "Cedar \"Valley\"".into(),
            contact: "C9".into(),
            local_time: "Apparent".into(),
            ..TimingFields::default()
        };
        let html = timing_form(Language::English, "/submit", ("t", Some("k")), &[f]);
        for name in html.split(" name=\"").skip(1) {
            let name = &name[..name.find('"').unwrap()];
            if ["csrf", "key"].contains(&name) {
                continue;
            }
            assert!(html.contains(&format!("<label for=\"{name}\"")), "{name}");
        }
        assert!(html.contains("value=\"Cedar &quot;Valley&quot;\""));
        assert!(html.contains("<option value=\"C9\" selected>as sent: C9</option>"));
        assert!(html.contains("<option value=\"apparent\" selected>"));
        assert!(html.contains("<option value=\"\" selected>not timed</option>"));
        assert_eq!(html.matches("<fieldset class=\"timing\">").count(), 4);
        assert_eq!(html.matches("<details class=\"local\" open>").count(), 1);
        assert!(upload_form(Language::English, "t").contains("<label for=\"file\">"));
        // The same form in German: the labels in German, the posted names unchanged.
        let de = timing_form(Language::German, "/submit", ("t", None), &[]);
        assert!(de.contains(">Breite (Grad)"), "German labels");
        assert!(de.contains("name=\"latitude\"") && de.contains("name=\"contact3\""));
        for name in [
            "clock_source",
            "viewing",
            "aperture_mm",
            "notes",
            "observer",
            "instrument",
        ] {
            assert!(html.contains(&format!("<label for=\"{name}\"")), "{name}");
        }
        assert!(html.contains("id=\"aperture_mm\" name=\"aperture_mm\" value=\"\" autocomplete=\"off\" spellcheck=\"false\" inputmode=\"numeric\""));
    }
}
