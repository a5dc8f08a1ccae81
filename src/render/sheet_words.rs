//! The words and numbers of the observers' sheet and its calendar in the sheet's language:
//! the messages of `locales/<code>/sheet.ftl` (and the caution of `pages.ftl`), angles and
//! coordinates with the language's decimal sign, the date with its month names, Delta T and
//! where it came from. Times of day stay 24-hour, as in every language.
//!
//! A message whose id ends in `-html` is HTML as it stands in the file; its variables are
//! escaped here unless the caller gives HTML it made itself.

use crate::geometry::transit::TransitEvent;
use crate::language::numbers::{date_long, decimal, decimal_text};
use crate::language::{text, Args, Language};
use crate::render::svg::esc_text;

/// A plain-text message with no values.
pub fn word(language: Language, id: &str) -> String {
    text(language, id, &Args::new())
}

/// A plain-text message with no values, escaped for an element's content.
pub fn word_html(language: Language, id: &str) -> String {
    esc_text(&word(language, id))
}

/// The solar-observing caution in the language (the pages' own message; in English the
/// library's [`crate::render::text::SAFETY_CAUTION`], a test holds them together).
pub fn caution(language: Language) -> String {
    word(language, "solar-caution")
}

/// `x` with `decimals` places and the language's decimal sign (`52.1600`, `52,1600`).
pub fn number(language: Language, x: f64, decimals: usize) -> String {
    decimal(language, x, decimals)
}

/// The sheet's title: the transit, its date written in full for the language, the station
/// (plain text).
pub fn title(language: Language, event: &TransitEvent, station: &str) -> String {
    text(
        language,
        "sheet-title",
        &Args::new()
            .text("planet", event.planet.name())
            .text("date", date_long(language, event.date()))
            .text("station", station),
    )
}

/// Delta T and its uncertainty (`73.0 ± 3.1`, `73,0 ± 3,1`), or `66.184, fixed` where it was
/// fixed with `--delta-t` and counts as exact.
pub fn delta_t_value(language: Language, event: &TransitEvent) -> String {
    let delta_t_s = event.elements.delta_t_s;
    match event.delta_t_sigma_s() {
        sigma_s if sigma_s > 0.0 => format!(
            "{} ± {}",
            decimal(language, delta_t_s, 1),
            decimal_text(language, &crate::words::uncertainty(sigma_s))
        ),
        _ => text(
            language,
            "sheet-delta-t-fixed-value",
            &Args::new().text("value", decimal(language, delta_t_s, 3)),
        ),
    }
}

/// What the uncertainty of Delta T does to the times printed, in one or two sentences: the
/// same as [`crate::render::station_predictions::delta_t_note`] says in English.
pub fn delta_t_note(language: Language, event: &TransitEvent) -> String {
    use crate::time::scales::DeltaTSource;
    use chrono::Datelike;
    let source = event.time_model().delta_t_s(event.greatest).1;
    let source_id = match source {
        DeltaTSource::Fixed => return word(language, "sheet-delta-t-fixed"),
        DeltaTSource::LeapSeconds => "sheet-delta-t-source-leap-seconds",
        DeltaTSource::Reconstruction => "sheet-delta-t-source-reconstruction",
        DeltaTSource::Observed => "sheet-delta-t-source-observed",
        DeltaTSource::Predicted => "sheet-delta-t-source-predicted",
        DeltaTSource::Extrapolated => "sheet-delta-t-source-extrapolated",
    };
    let from = text(
        language,
        "sheet-delta-t-from",
        &Args::new().text("source", word(language, source_id)),
    );
    let times_id = match source {
        DeltaTSource::Reconstruction if event.date().year() < 1972 => "sheet-times-ut1",
        DeltaTSource::Reconstruction => "sheet-times-utc",
        DeltaTSource::Extrapolated => "sheet-times-utc-held",
        _ => "sheet-times-utc-hardly",
    };
    format!("{from} {}", word(language, times_id))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::time::iso::parse_date;
    use crate::time::scales::TimeModel;

    fn event(planet: crate::Planet, date: &str, model: &TimeModel) -> TransitEvent {
        crate::transit_on_date(planet, parse_date(date).unwrap(), model).unwrap()
    }

    /// The English words of Delta T are the library's own (`station_predictions`), for a
    /// transit before 1972 (reconstruction, UT1), one of observed Delta T, one far ahead
    /// (extrapolated) and Delta T fixed; the caution is the library's.
    #[test]
    fn the_english_delta_t_is_the_librarys() {
        use crate::render::station_predictions::{delta_t_note as english_note, delta_t_text};
        let fixed = TimeModel {
            delta_t_override_s: Some(66.184),
            ..TimeModel::default()
        };
        let cases = [
            event(crate::Planet::Venus, "1769-06-03", &TimeModel::default()),
            event(crate::Planet::Venus, "2012-06-06", &TimeModel::default()),
            event(crate::Planet::Venus, "2117-12-11", &TimeModel::default()),
            event(crate::Planet::Mercury, "2032-11-13", &fixed),
        ];
        for e in &cases {
            assert_eq!(delta_t_note(Language::English, e), english_note(e).trim());
            assert_eq!(
                delta_t_value(Language::English, e),
                delta_t_text(e).replace("+-", "±")
            );
        }
        assert_eq!(
            caution(Language::English),
            crate::render::text::SAFETY_CAUTION
        );
        let de = delta_t_value(Language::German, &cases[3]);
        assert_eq!(de, "66,184, fest");
    }

    /// The title takes the language's words for the transit and its month names.
    #[test]
    fn the_title_is_in_the_language() {
        let e = event(crate::Planet::Venus, "2012-06-06", &TimeModel::default());
        assert_eq!(
            title(Language::German, &e, "Sternwarte"),
            "Venustransit, 6. Juni 2012: Sternwarte"
        );
        assert_eq!(
            title(Language::Spanish, &e, "X"),
            "Tránsito de Venus, 6 de junio de 2012: X"
        );
        assert_eq!(
            title(Language::English, &e, "X"),
            "Transit of Venus, 6 June 2012: X"
        );
    }
}
