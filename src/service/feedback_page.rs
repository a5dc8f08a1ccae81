//! The reply to a submission for people: what was received and what could not be read, an
//! offset common to a station's timings said once, the planet's path across the Sun from the
//! participant's station with their timings on it, and one card per timing (the contact as
//! written, the time sent, the prediction, the difference in words, the Sun's altitude, the
//! verdict in words and what to do). Cards, not a wide table: the page reads at 360 px.

use super::feedback::{SubmissionFeedback, TimingFeedback};
use super::pages::page_in;
use super::store::TimingFields;
use crate::geometry::transit::TransitEvent;
use crate::language::numbers::decimal;
use crate::language::{text, Args, Language};
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

/// A message without values in the visitor's language.
fn t(l: Language, id: &str) -> String {
    text(l, id, &Args::new())
}

/// A difference from the prediction in the visitor's words ("12.0 s later than
/// predicted", "3,0 s früher als vorhergesagt").
pub fn difference_in(l: Language, o_c_s: f64) -> String {
    let size = super::feedback_words::difference_size(o_c_s, |a| decimal(l, a, 1));
    let id = if o_c_s >= 0.0 {
        "later-than-predicted"
    } else {
        "earlier-than-predicted"
    };
    text(l, id, &Args::new().text("size", size))
}

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
fn card(l: Language, f: &TimingFields, b: &TimingFeedback) -> String {
    let written = if b.contact_as_written.is_empty() {
        t(l, "card-contact-none")
    } else {
        b.contact_as_written.clone()
    };
    let heading = text(l, "card-contact", &Args::new().text("contact", written));
    let mut s = format!("<li class=\"card\"><h3>{}</h3>\n<dl>\n", esc(&heading));
    pair(&mut s, &t(l, "card-station"), &f.station);
    pair(&mut s, &t(l, "card-your-time"), sent_time(f));
    if let Some(p) = &b.predicted_utc {
        pair(&mut s, &t(l, "card-predicted"), p);
    }
    if let Some(x) = b.o_c_s {
        pair(&mut s, &t(l, "card-difference"), &difference_in(l, x));
    }
    if let Some(a) = b.sun_altitude_deg {
        let degrees = Args::new().text("degrees", decimal(l, a, 1));
        pair(
            &mut s,
            &t(l, "card-sun-altitude"),
            &text(l, "card-sun-altitude-value", &degrees),
        );
    }
    let _ = writeln!(
        s,
        "<dt>{}</dt><dd class=\"{}\"><strong>{}</strong></dd>",
        esc(&t(l, "card-verdict")),
        b.verdict,
        esc(&t(l, b.verdict_words.message_id()))
    );
    if let Some(d) = &b.diagnosis {
        pair(&mut s, &t(l, "card-meaning"), &d.in_language(l));
    }
    let advice = b
        .advice
        .as_ref()
        .map_or_else(|| t(l, "card-nothing-to-do"), |a| a.in_language(l));
    pair(&mut s, &t(l, "card-what-to-do"), &advice);
    s.push_str("</dl></li>\n");
    s
}

/// The feedback as cards, with any station-wide offset said first, once.
pub fn feedback_cards(l: Language, fields: &[TimingFields], fb: &SubmissionFeedback) -> String {
    let mut s = String::new();
    for st in &fb.stations {
        let heading = text(
            l,
            "all-together",
            &Args::new().text("station", &*st.station),
        );
        let _ = writeln!(
            s,
            "<section class=\"station-advice\"><h2>{}</h2>\n<p>{}.</p></section>",
            esc(&heading),
            esc(&capitalised(&st.advice.in_language(l)))
        );
    }
    let _ = writeln!(
        s,
        "<h2>{}</h2>\n<ol class=\"cards\" id=\"feedback\">",
        esc(&t(l, "each-timing"))
    );
    for (f, b) in fields.iter().zip(&fb.timings) {
        s.push_str(&card(l, f, b));
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

/// Why a station's share is not shown.
#[derive(Clone, Debug, PartialEq)]
pub enum NoShare {
    /// The network has fewer than [`MIN_STATIONS_FOR_SHARE`] stations (so far, this many).
    NetworkTooSmall(usize),
    /// None of the timings could be used.
    NothingUsable,
}

/// A station's expected share of the information on the parallax, `own / (own + rest)`
/// (arcsec^-2 each), once `stations` (the network with this one) reaches
/// [`MIN_STATIONS_FOR_SHARE`]; else why it does not show.
pub fn share_of(own: f64, rest: f64, stations: usize) -> Result<f64, NoShare> {
    if stations < MIN_STATIONS_FOR_SHARE {
        return Err(NoShare::NetworkTooSmall(stations));
    }
    if own > 0.0 && (own + rest).is_finite() {
        Ok(own / (own + rest))
    } else {
        Err(NoShare::NothingUsable)
    }
}

/// What the page says of the station's share in the visitor's language: the share once the
/// network has [`MIN_STATIONS_FOR_SHARE`] stations, else when it will show.
pub fn share_sentence(l: Language, share: &Result<f64, NoShare>) -> String {
    match share {
        Ok(x) => text(
            l,
            "share-value",
            &Args::new().text("percent", decimal(l, 100.0 * x, 1)),
        ),
        Err(NoShare::NetworkTooSmall(so_far)) => text(
            l,
            "share-later",
            &Args::new()
                .text("min", MIN_STATIONS_FOR_SHARE.to_string())
                .text("so_far", so_far.to_string()),
        ),
        Err(NoShare::NothingUsable) => t(l, "share-none"),
    }
}

/// The reply page after a submission, in the visitor's language: "Received and stored" only
/// when at least one row was read; otherwise a heading that says none could be, and what to
/// change.
pub fn feedback_page(
    l: Language,
    event: &TransitEvent,
    (id, link): (i64, &str),
    (fields, fb): (&[TimingFields], &SubmissionFeedback),
    share: &Result<f64, NoShare>,
    duplicate: bool,
) -> String {
    let mut body = String::new();
    if duplicate {
        let _ = writeln!(body, "<p>{}</p>", esc(&t(l, "feedback-duplicate")));
    }
    let (read, total) = (fb.rows_read(), fb.timings.len());
    let title = if read == 0 {
        let args = Args::new().text("id", id.to_string()).count("n", total);
        let _ = writeln!(
            body,
            "<p id=\"received\">{}</p>",
            esc(&text(l, "feedback-none-read", &args))
        );
        t(l, "feedback-title-unread")
    } else {
        let args = Args::new().text("id", id.to_string()).count("n", read);
        let mut received = text(l, "feedback-received", &args);
        if read < total {
            received.push(' ');
            received.push_str(&text(
                l,
                "feedback-some-unread",
                &Args::new().count("n", total - read),
            ));
        }
        let _ = writeln!(body, "<p id=\"received\">{}</p>", esc(&received));
        t(l, "feedback-title")
    };
    body.push_str(&drawings(event, fb));
    body.push_str(&feedback_cards(l, fields, fb));
    if read > 0 {
        let _ = writeln!(
            body,
            "<p id=\"share\">{}</p>",
            esc(&share_sentence(l, share))
        );
    }
    let _ = writeln!(
        body,
        "<p>{} <a id=\"private\" href=\"{link}\">{link}</a>. {}</p>\n<p><a href=\"/\">{}</a></p>",
        esc(&t(l, "feedback-private-link")),
        esc(&t(l, "feedback-versions")),
        esc(&t(l, "send-another")),
        link = esc(link),
    );
    page_in(l, Some(link), &title, &body)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn no_share_before_the_network() {
        // The first station alone would hold "100.0 %" (issue 20).
        let first = share_of(3.0, 0.0, 1);
        assert_eq!(first, Err(NoShare::NetworkTooSmall(1)));
        let words = share_sentence(Language::English, &first);
        assert!(words.contains("at least 3 stations"), "{words}");
        assert!(!words.contains('%'));
        assert!(share_of(3.0, 5.0, 2).is_err());
        let third = share_of(3.0, 9.0, 3).unwrap();
        assert!((third - 0.25).abs() < 1e-12);
        assert!(share_sentence(Language::English, &Ok(third)).contains("25.0 %"));
        assert!(share_sentence(Language::French, &Ok(third)).contains("25,0 %"));
        assert_eq!(
            share_of(0.0, 9.0, 4),
            Err(NoShare::NothingUsable),
            "no zero share of nothing"
        );
    }

    #[test]
    fn differences_in_the_visitors_words() {
        assert_eq!(
            difference_in(Language::English, 12.04),
            "12.0 s later than predicted"
        );
        assert_eq!(
            difference_in(Language::German, -3.0),
            "3,0 s früher als vorhergesagt"
        );
        assert_eq!(
            difference_in(Language::Spanish, 983.0),
            "16 min 23 s más tarde de lo predicho"
        );
    }
}
