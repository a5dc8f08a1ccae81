//! Numbers and dates as each language writes them: the decimal sign and the digit grouping
//! from the Unicode CLDR data that `num-format` carries, the names of months from the
//! locales of `chrono` (glibc's locale data, via `pure-rust-locales`).
//!
//! Times of day stay in the 24-hour form `14:03:27` in every language, as observers' sheets
//! and UTC are written everywhere (common practice, no source).

use super::Language;
use chrono::NaiveDate;
use num_format::{Locale, ToFormattedString};

fn cldr(language: Language) -> Locale {
    match language {
        Language::English => Locale::en,
        Language::Spanish => Locale::es,
        Language::French => Locale::fr,
        Language::German => Locale::de,
        Language::Portuguese => Locale::pt,
    }
}

fn chrono_locale(language: Language) -> chrono::Locale {
    match language {
        Language::English => chrono::Locale::en_GB,
        Language::Spanish => chrono::Locale::es_ES,
        Language::French => chrono::Locale::fr_FR,
        Language::German => chrono::Locale::de_DE,
        Language::Portuguese => chrono::Locale::pt_PT,
    }
}

/// `x` with `decimals` places, written for the language: `1,234.5` in English, `1.234,5` in
/// German, `1 234,5` in French (a narrow no-break space, as CLDR has it). A value that is not
/// finite is written as a dash, never as "NaN".
pub fn decimal(language: Language, x: f64, decimals: usize) -> String {
    if !x.is_finite() {
        return "–".into();
    }
    let text = format!("{:.*}", decimals, x.abs());
    let (whole, fraction) = text.split_once('.').unwrap_or((&text, ""));
    let locale = cldr(language);
    let grouped = whole
        .parse::<u64>()
        .map(|w| w.to_formatted_string(&locale))
        .unwrap_or_else(|_| whole.to_string());
    let negative = x < 0.0 && text.chars().any(|c| c.is_ascii_digit() && c != '0');
    let sign = if negative { locale.minus_sign() } else { "" };
    if fraction.is_empty() {
        format!("{sign}{grouped}")
    } else {
        format!("{sign}{grouped}{}{fraction}", locale.decimal())
    }
}

/// A date written in full for the language: "5 June 2012", "5 de junio de 2012",
/// A number already written with a point for its decimal sign (a chart's tick label such as
/// `8.79` or `-0.5`), with the language's decimal sign instead: `8,79` in German.
pub fn decimal_text(language: Language, number: &str) -> String {
    let sign = cldr(language).decimal();
    if sign == "." {
        number.to_string()
    } else {
        number.replace('.', sign)
    }
}

/// "5 juin 2012", "5. Juni 2012", "5 de junho de 2012".
pub fn date_long(language: Language, date: NaiveDate) -> String {
    let pattern = match language {
        Language::English | Language::French => "%-d %B %Y",
        Language::Spanish | Language::Portuguese => "%-d de %B de %Y",
        Language::German => "%-d. %B %Y",
    };
    date.format_localized(pattern, chrono_locale(language))
        .to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: Unicode CLDR number symbols (decimal sign and grouping of en, es, fr, de, pt),
    // as `num-format` carries them; the expected strings are written from memory of those
    // conventions.
    #[test]
    fn decimals_are_written_for_the_language() {
        assert_eq!(decimal(Language::English, 1234.56, 1), "1,234.6");
        assert_eq!(decimal(Language::German, 1234.56, 1), "1.234,6");
        assert_eq!(decimal(Language::Spanish, 8.794, 3), "8,794");
        assert_eq!(decimal(Language::Portuguese, -0.04, 2), "-0,04");
        let fr = decimal(Language::French, 149_597_870.7, 0);
        assert!(
            fr.starts_with("149") && fr.ends_with("871") && !fr.contains(','),
            "{fr}"
        );
        assert_eq!(
            decimal(Language::English, -0.004, 2),
            "0.00",
            "no minus on zero"
        );
        assert_eq!(decimal(Language::English, f64::NAN, 2), "–");
        assert_eq!(decimal_text(Language::German, "-8.79"), "-8,79");
        assert_eq!(decimal_text(Language::English, "8.79"), "8.79");
    }

    // Month names: glibc's locale data as chrono carries it (from memory of those names).
    #[test]
    fn dates_are_written_for_the_language() {
        let d = NaiveDate::from_ymd_opt(2012, 6, 5).unwrap();
        assert_eq!(date_long(Language::English, d), "5 June 2012");
        assert_eq!(date_long(Language::Spanish, d), "5 de junio de 2012");
        assert_eq!(date_long(Language::French, d), "5 juin 2012");
        assert_eq!(date_long(Language::German, d), "5. Juni 2012");
        assert_eq!(date_long(Language::Portuguese, d), "5 de junho de 2012");
    }
}
