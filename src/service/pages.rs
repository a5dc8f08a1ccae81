//! The service's pages for people: the participant's form and feedback, the review of one's
//! own submission, and the organiser's page. Plain HTML forms that work without JavaScript
//! (the file upload too), nothing fetched from elsewhere, every string from a participant
//! escaped.

use super::store::TimingFields;
use crate::render::svg::esc;
use crate::render::text::SAFETY_CAUTION;
use std::fmt::Write;

/// The pages' style sheet, the exact text of their `<style>` element (allowed by its SHA-256
/// hash in the content-security policy).
pub const STYLE: &str = "body{font-family:sans-serif;max-width:1000px;margin:1.5em auto;padding:0 1em;color:#111827;line-height:1.45}table{border-collapse:collapse;margin:1em 0;font-size:0.9em}th,td{border:1px solid #d1d5db;padding:3px 6px;text-align:left;vertical-align:top}th{background:#f3f4f6}.caution{border:2px solid #b91c1c;background:#fef2f2;padding:0.6em 1em;font-weight:bold}.fits{color:#166534}.doubtful{color:#92400e}.rejected{color:#b91c1c}fieldset{margin:1em 0}label{display:inline-block;margin:0.2em 0.8em 0.2em 0}.cards{list-style:none;padding:0}.card{border:1px solid #d1d5db;border-radius:6px;padding:0.5em 0.8em;margin:0.8em 0;max-width:40em}.card h3{margin:0.2em 0}.card dt{font-weight:bold;margin-top:0.3em}.card dd{margin:0 0 0 1em;overflow-wrap:anywhere}.station-advice{border-left:4px solid #92400e;padding:0.2em 0.8em}figure.path{margin:1em 0;max-width:360px}svg.limb{width:100%;height:auto}";

/// The page's frame: title, style, the solar caution first.
pub fn page(title: &str, body: &str) -> String {
    format!(
        "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n<title>{t}</title>\n<style>{STYLE}</style>\n</head>\n<body>\n<h1>{t}</h1>\n<p class=\"caution\">{c}</p>\n{body}</body>\n</html>\n",
        t = esc(title),
        c = esc(SAFETY_CAUTION)
    )
}

fn input(name: &str, label: &str, value: &str, size: usize) -> String {
    format!(
        "<label>{} <input name=\"{}\" id=\"{}\" value=\"{}\" size=\"{size}\"/></label>",
        esc(label),
        esc(name),
        esc(name),
        esc(value)
    )
}

/// The form for a station and its timings, pre-filled with `fields` (empty for a new
/// submission), posting to `action` with the anti-forgery token (and the edit key, for a
/// correction).
pub fn timing_form(action: &str, csrf: &str, key: Option<&str>, fields: &[TimingFields]) -> String {
    let first = fields.first().cloned().unwrap_or_default();
    let mut s = format!("<form method=\"post\" action=\"{}\">\n<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n", esc(action), esc(csrf));
    if let Some(k) = key {
        let _ = writeln!(
            s,
            "<input type=\"hidden\" name=\"key\" value=\"{}\"/>",
            esc(k)
        );
    }
    let _ = writeln!(
        s,
        "<fieldset><legend>Station</legend>{}{}{}{}{}</fieldset>",
        input("station", "name", &first.station, 28),
        input("latitude", "latitude (deg, north +)", &first.latitude, 9),
        input("longitude", "longitude (deg, east +)", &first.longitude, 10),
        input("elevation_m", "elevation (m)", &first.elevation_m, 6),
        input(
            "longitude_sigma_deg",
            "longitude uncertainty (deg, or unknown; empty: exact)",
            &first.longitude_sigma_deg,
            8
        )
    );
    s.push_str("<fieldset><legend>Timings (leave a row empty if you did not time that contact)</legend>\n<table><tr><th>contact</th><th>time UTC (2012-06-05T22:25:41.3Z)</th><th>or local solar time (no zone)</th><th>apparent or mean</th><th>uncertainty (s)</th></tr>\n");
    for k in 0..4 {
        let f = fields.get(k).cloned().unwrap_or_default();
        let _ = writeln!(
            s,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            input(&format!("contact{k}"), "", &f.contact, 4),
            input(&format!("time_utc{k}"), "", &f.time_utc, 26),
            input(&format!("time_local{k}"), "", &f.time_local, 22),
            input(&format!("local_time{k}"), "", &f.local_time, 9),
            input(&format!("sigma_s{k}"), "", &f.sigma_s, 5)
        );
    }
    s.push_str("</table></fieldset>\n<fieldset><legend>Or paste an observations file (CSV with the columns station,latitude,longitude,elevation_m,contact,time_utc,sigma_s)</legend>\n<textarea name=\"csv\" id=\"csv\" rows=\"6\" cols=\"100\"></textarea></fieldset>\n<p><button type=\"submit\" id=\"send\">Send</button></p>\n</form>\n");
    s
}

/// The form that uploads an observations file (multipart), with the anti-forgery token.
pub fn upload_form(csrf: &str) -> String {
    format!(
        "<form method=\"post\" action=\"/upload\" enctype=\"multipart/form-data\">\n<input type=\"hidden\" name=\"csrf\" value=\"{}\"/>\n<fieldset><legend>Or send an observations file (CSV with the columns above, or an .xlsx or .ods spreadsheet)</legend>\n<input type=\"file\" name=\"file\" id=\"file\" accept=\".csv,.tsv,.txt,.xlsx,.ods,text/csv\"/> <button type=\"submit\" id=\"upload\">Send the file</button></fieldset>\n</form>\n",
        esc(csrf)
    )
}

/// A page with one message (errors, refusals).
pub fn message_page(title: &str, message: &str) -> String {
    page(
        title,
        &format!(
            "<p>{}</p>\n<p><a href=\"/\">Back to the form</a></p>\n",
            esc(message)
        ),
    )
}
