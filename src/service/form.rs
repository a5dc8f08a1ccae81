//! The participant's forms: the station and up to four timings (one block per contact,
//! stacked on a phone), a pasted observations file, an uploaded one. Every field has its own
//! `<label for>`; choices (contact, kind of local time, day reckoning) are lists, so nothing
//! has to be spelled; the station's name and coordinates are `required`. The posted names are
//! the ones `intake::from_form` reads (`station`, `latitude`, ..., `contact0`, `time_utc0`,
//! `time_local0`, `local_time0`, `day_reckoning0`, `sigma_s0`, ..., `csv`, `file`).
//!
//! Latitude and longitude keep the ordinary keyboard: a phone's decimal pad (`inputmode=
//! "decimal"`) has no minus sign on some systems, and south and west are negative; elevation
//! and uncertainties, which are positive, get the decimal pad.

use super::store::TimingFields;
use crate::render::svg::esc;
use std::fmt::Write;

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

/// A choice list with its label; `value` is selected, and kept as an option of its own when it
/// is none of `options` (a correction then sends back what was sent).
fn select_field(name: &str, label: &str, options: &[(&str, &str)], value: &str) -> String {
    let mut s = format!(
        "<div class=\"field\"><label for=\"{n}\">{}</label><select id=\"{n}\" name=\"{n}\">",
        esc(label),
        n = esc(name)
    );
    let known = options.iter().any(|(v, _)| v.eq_ignore_ascii_case(value));
    if !known {
        let _ = write!(
            s,
            "<option value=\"{v}\" selected>as sent: {v}</option>",
            v = esc(value)
        );
    }
    for (v, text) in options {
        let selected = if known && v.eq_ignore_ascii_case(value) {
            " selected"
        } else {
            ""
        };
        let _ = write!(
            s,
            "<option value=\"{}\"{selected}>{}</option>",
            esc(v),
            esc(text)
        );
    }
    s.push_str("</select></div>");
    s
}

const CONTACTS: [(&str, &str); 5] = [
    ("", "not timed"),
    ("1", "I: exterior ingress (first touch)"),
    ("2", "II: interior ingress (fully on the Sun)"),
    ("3", "III: interior egress (begins to leave)"),
    ("4", "IV: exterior egress (last touch)"),
];

const LOCAL_TIMES: [(&str, &str); 3] = [
    ("", "none (the time is UTC)"),
    ("apparent", "apparent (sundial time)"),
    ("mean", "mean (local mean time)"),
];

const DAY_RECKONINGS: [(&str, &str); 2] = [
    ("", "civil (from midnight)"),
    ("astronomical", "astronomical (from noon)"),
];

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
fn station_fields(first: &TimingFields) -> String {
    const DECIMAL: &str = " inputmode=\"decimal\"";
    format!(
        "<h2>Your station</h2>\n<fieldset><legend class=\"vh\">Your station</legend>\n{}\n<div class=\"row\">{}{}</div>\n<div class=\"row\">{}{}</div>\n</fieldset>\n",
        text_field("station", "Station's name", "as you want it listed", &first.station, " required"),
        text_field("latitude", "Latitude (degrees)", "north positive, south negative: -33.87", &first.latitude, " required"),
        text_field("longitude", "Longitude (degrees)", "east positive, west negative: -157.86", &first.longitude, " required"),
        text_field("elevation_m", "Elevation (metres)", "above sea level", &first.elevation_m, DECIMAL),
        text_field("longitude_sigma_deg", "Longitude's uncertainty (degrees)", "or the word unknown; leave empty when the longitude is exact", &first.longitude_sigma_deg, ""),
    )
}

/// One timing's fieldset (`k` from 0): the contact, the time in UTC and its uncertainty; and,
/// folded away unless one of them holds something, the fields of a local solar time.
fn timing_fields(k: usize, f: &TimingFields) -> String {
    let local = [&f.time_local, &f.local_time, &f.day_reckoning];
    let open = if local.iter().any(|v| !v.is_empty()) {
        " open"
    } else {
        ""
    };
    format!(
        "<fieldset class=\"timing\"><legend>Timing {n}</legend>\n{}\n{}\n{}\n<details class=\"local\"{open}><summary>Timed by local solar time (an old record)?</summary>\n{}\n<div class=\"row\">{}{}</div>\n</details>\n</fieldset>\n",
        select_field(&format!("contact{k}"), "Contact", &CONTACTS, &f.contact),
        text_field(&format!("time_utc{k}"), "Time (UTC)", "date and time with Z: 2012-06-05T22:25:41.3Z", &f.time_utc, ""),
        text_field(&format!("sigma_s{k}"), "Uncertainty (seconds)", "how sure you are of the time; empty: the usual for that contact", &f.sigma_s, " inputmode=\"decimal\""),
        text_field(&format!("time_local{k}"), "Local solar time", "instead of UTC, no zone: 1769-06-03T21:25:03.5", &f.time_local, ""),
        select_field(&format!("local_time{k}"), "Kind of local time", &LOCAL_TIMES, &f.local_time),
        select_field(&format!("day_reckoning{k}"), "Day reckoning", &DAY_RECKONINGS, &f.day_reckoning),
        n = k + 1,
    )
}

/// The form for a station and its timings, pre-filled with `fields` (empty for a new
/// submission), posting to `action` with the anti-forgery token (and the edit key, for a
/// correction); then the form that posts a pasted observations file to the same address.
pub fn timing_form(action: &str, csrf: &str, key: Option<&str>, fields: &[TimingFields]) -> String {
    let first = fields.first().cloned().unwrap_or_default();
    let mut s = format!(
        "<form method=\"post\" action=\"{}\" id=\"timings-form\">\n{}",
        esc(action),
        hidden(csrf, key)
    );
    s.push_str(&station_fields(&first));
    s.push_str("<h2>Your timings</h2>\n<p class=\"note\">One block per contact you timed; leave the others on \"not timed\".</p>\n<div class=\"timings\">\n");
    for k in 0..4 {
        s.push_str(&timing_fields(
            k,
            &fields.get(k).cloned().unwrap_or_default(),
        ));
    }
    s.push_str("</div>\n<p class=\"actions\"><button type=\"submit\" id=\"send\">Send these timings</button></p>\n</form>\n");
    let _ = writeln!(
        s,
        "<form method=\"post\" action=\"{}\" id=\"paste-form\">\n{}<fieldset><legend>Or paste an observations file</legend>\n<div class=\"field\"><label for=\"csv\">Observations (CSV) <span class=\"hint\">with the columns station,latitude,longitude,elevation_m,contact,time_utc,sigma_s</span></label><textarea name=\"csv\" id=\"csv\" rows=\"6\" spellcheck=\"false\" required></textarea></div>\n<p class=\"actions\"><button type=\"submit\" id=\"send-paste\">Send the pasted file</button></p>\n</fieldset>\n</form>",
        esc(action),
        hidden(csrf, key)
    );
    s
}

/// The form that uploads an observations file (multipart), with the anti-forgery token.
pub fn upload_form(csrf: &str) -> String {
    format!(
        "<form method=\"post\" action=\"/upload\" enctype=\"multipart/form-data\" id=\"upload-form\">\n<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n<fieldset><legend>Or send an observations file</legend>\n<div class=\"field\"><label for=\"file\">File <span class=\"hint\">CSV with the columns above, or an .xlsx or .ods spreadsheet</span></label><input type=\"file\" name=\"file\" id=\"file\" accept=\".csv,.tsv,.txt,.xlsx,.ods,text/csv\" required/></div>\n<p class=\"actions\"><button type=\"submit\" id=\"upload\">Send the file</button></p>\n</fieldset>\n</form>\n",
        esc(csrf)
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
        let html = timing_form("/submit", "t", Some("k"), &[f]);
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
        assert!(upload_form("t").contains("<label for=\"file\">"));
    }
}
