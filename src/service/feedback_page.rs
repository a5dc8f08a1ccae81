//! The reply to a submission for people: what was received and what could not be read, an
//! offset common to a station's timings said once, the planet's path across the Sun from the
//! participant's station with their timings on it, and one card per timing (the contact as
//! written, the time sent, the prediction, the difference in words, the Sun's altitude, the
//! verdict in words and what to do). Cards, not a wide table: the page reads at 360 px.

use super::feedback::{SubmissionFeedback, TimingFeedback};
use super::pages::page;
use super::store::TimingFields;
use crate::geometry::transit::TransitEvent;
use crate::reduction::agreement::Agreement;
use crate::render::path_on_disc::{path_on_disc_svg, ObservedMark};
use crate::render::svg::esc;
use std::fmt::Write;

/// The least number of stations with timings before a station's share of the information is
/// shown. The parallax is measured by how the parallax factor differs between stations; with
/// the planet's two offsets and the two radii fitted beside it, the cross-path offset is told
/// from the parallax only by how its effect varies from station to station (docs/method.md),
/// which takes a third station. Before that, a share would say "100 %" of nothing.
pub const MIN_STATIONS_FOR_SHARE: usize = 3;

/// Drawings on one page at most (a large file gets cards only beyond these).
const MAX_DRAWINGS: usize = 3;

/// The time as the participant sent it (UTC, or local solar time).
fn sent_time(f: &TimingFields) -> &str {
    if f.time_utc.is_empty() {
        &f.time_local
    } else {
        &f.time_utc
    }
}

/// One `<dt>`/`<dd>` pair, escaped.
fn pair(s: &mut String, term: &str, value: &str) {
    let _ = writeln!(s, "<dt>{}</dt><dd>{}</dd>", esc(term), esc(value));
}

/// One timing's card.
fn card(f: &TimingFields, b: &TimingFeedback) -> String {
    let written = if b.contact_as_written.is_empty() {
        "(none given)"
    } else {
        &b.contact_as_written
    };
    let mut s = format!(
        "<li class=\"card\"><h3>Contact {}</h3>\n<dl>\n",
        esc(written)
    );
    pair(&mut s, "Station", &f.station);
    pair(&mut s, "Your time", sent_time(f));
    if let Some(p) = &b.predicted_utc {
        pair(&mut s, "Predicted", p);
    }
    if let Some(x) = b.o_c_s {
        pair(
            &mut s,
            "Difference",
            &super::feedback_words::difference_words(x),
        );
    }
    if let Some(a) = b.sun_altitude_deg {
        pair(&mut s, "Sun's altitude", &format!("{a:.1} degrees"));
    }
    let _ = writeln!(
        s,
        "<dt>Verdict</dt><dd class=\"{}\"><strong>{}</strong></dd>",
        b.verdict,
        esc(b.verdict_words)
    );
    if let Some(d) = &b.diagnosis {
        pair(&mut s, "What it means", d);
    }
    pair(
        &mut s,
        "What to do",
        b.advice.as_deref().unwrap_or("nothing: thank you"),
    );
    s.push_str("</dl></li>\n");
    s
}

/// The feedback as cards, with any station-wide offset said first, once.
pub fn feedback_cards(fields: &[TimingFields], fb: &SubmissionFeedback) -> String {
    let mut s = String::new();
    for st in &fb.stations {
        let _ = writeln!(
            s,
            "<section class=\"station-advice\"><h2>All your timings together: {}</h2>\n<p>{}.</p></section>",
            esc(&st.station),
            esc(&capitalised(&st.advice))
        );
    }
    s.push_str("<h2>Each timing</h2>\n<ol class=\"cards\" id=\"feedback\">\n");
    for (f, b) in fields.iter().zip(&fb.timings) {
        s.push_str(&card(f, b));
    }
    s.push_str("</ol>\n");
    s
}

fn capitalised(text: &str) -> String {
    let mut chars = text.chars();
    match chars.next() {
        Some(c) => c.to_uppercase().chain(chars).collect(),
        None => String::new(),
    }
}

/// The path across the disc for each station of the submission (up to three),
/// with its timings on it, each in a figure with its text alternative.
pub fn drawings(event: &TransitEvent, fb: &SubmissionFeedback) -> String {
    let mut names: Vec<&str> = Vec::new();
    let mut s = String::new();
    for t in &fb.timings {
        let Some(station) = &t.station else { continue };
        if names.contains(&station.name.as_str()) || names.len() >= MAX_DRAWINGS {
            continue;
        }
        names.push(&station.name);
        let marks: Vec<ObservedMark> = fb
            .timings
            .iter()
            .filter(|m| m.station.as_ref().is_some_and(|x| x.name == station.name))
            .filter_map(|m| {
                Some(ObservedMark {
                    label: m.contact_as_written.clone(),
                    observed_h: m.observed_h?,
                    verdict: match m.verdict {
                        "fits" => Agreement::Fits,
                        "doubtful" => Agreement::Doubtful,
                        _ => Agreement::Rejected,
                    },
                })
            })
            .collect();
        let id = format!("path{}", names.len());
        if let Some((svg, text)) = path_on_disc_svg(event, station, &marks, &id) {
            let _ = writeln!(
                s,
                "<figure class=\"path\">{svg}\n<figcaption>{}</figcaption></figure>",
                esc(&text)
            );
        }
    }
    s
}

/// A station's expected share of the information on the parallax, `own / (own + rest)`
/// (arcsec^-2 each), once `stations` (the network with this one) reaches
/// [`MIN_STATIONS_FOR_SHARE`]; else the sentence that says when it will show.
pub fn share_of(own: f64, rest: f64, stations: usize) -> Result<f64, String> {
    if stations < MIN_STATIONS_FOR_SHARE {
        return Err(format!(
            "your share of the campaign's information on the solar parallax will show once at least {MIN_STATIONS_FOR_SHARE} stations have sent timings ({stations} so far): the parallax is measured by comparing stations"
        ));
    }
    if own > 0.0 && (own + rest).is_finite() {
        Ok(own / (own + rest))
    } else {
        Err(
            "these timings carry no information on the parallax yet (none of them could be used)"
                .into(),
        )
    }
}

/// What the page says of the station's share: the share once the network has
/// [`MIN_STATIONS_FOR_SHARE`] stations, else when it will show.
pub fn share_sentence(share: &Result<f64, String>) -> String {
    match share {
        Ok(x) => format!("Your station's expected share of the campaign's information on the solar parallax so far: {:.1} % (before the planet's place and the radii are fitted).", 100.0 * x),
        Err(why) => capitalised(why),
    }
}

/// The reply page after a submission: "Received and stored" only when at least one row was
/// read; otherwise a heading that says none could be, and what to change.
pub fn feedback_page(
    event: &TransitEvent,
    (id, link): (i64, &str),
    (fields, fb): (&[TimingFields], &SubmissionFeedback),
    share: &Result<f64, String>,
    duplicate: bool,
) -> String {
    let mut body = String::new();
    if duplicate {
        body.push_str(
            "<p>This is the same as a submission already received; it was not counted twice.</p>\n",
        );
    }
    let (read, total) = (fb.rows_read(), fb.timings.len());
    let title = if read == 0 {
        let _ = writeln!(body, "<p id=\"received\">We kept what you sent (as submission {id}) so that the organiser can see it, but none of its {} could be read as a timing. Below, under each row: what could not be read and what to change. Then send the timings again.</p>", crate::words::count(total, "row", "rows"));
        "Your timings could not be read"
    } else {
        let unread = if read < total {
            format!(
                " {} could not be read: see below.",
                crate::words::count(total - read, "row", "rows")
            )
        } else {
            String::new()
        };
        let _ = writeln!(
            body,
            "<p id=\"received\">Received and stored as submission {id}: {} read.{unread}</p>",
            crate::words::count(read, "timing", "timings")
        );
        "Thank you: your timings"
    };
    body.push_str(&drawings(event, fb));
    body.push_str(&feedback_cards(fields, fb));
    if read > 0 {
        let _ = writeln!(body, "<p id=\"share\">{}</p>", esc(&share_sentence(share)));
    }
    let _ = writeln!(body, "<p>To review or correct your submission later, keep this private link: <a id=\"private\" href=\"{l}\">{l}</a>. A correction is stored as a new version; the old one is kept.</p>\n<p><a href=\"/\">Send another</a></p>", l = esc(link));
    page(title, &body)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn no_share_before_the_network() {
        // The first station alone would hold "100.0 %" (issue 20).
        let first = share_of(3.0, 0.0, 1);
        assert!(
            first
                .as_ref()
                .is_err_and(|s| s.contains("at least 3 stations")),
            "{first:?}"
        );
        assert!(!share_sentence(&first).contains('%'));
        assert!(share_of(3.0, 5.0, 2).is_err());
        let third = share_of(3.0, 9.0, 3).unwrap();
        assert!((third - 0.25).abs() < 1e-12);
        assert!(share_sentence(&Ok(third)).contains("25.0 %"));
        assert!(share_of(0.0, 9.0, 4).is_err(), "no zero share of nothing");
    }
}
