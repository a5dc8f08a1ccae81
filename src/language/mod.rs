//! The languages of the pages participants read (the form, the feedback, the registration,
//! the sheet, the public results): which languages there are, which one a visitor gets, and
//! their words, numbers and dates.
//!
//! - `mod.rs`: the languages and the choice among them (`Accept-Language`, RFC 9110 section
//!   12.5.4, matched by `fluent-langneg`).
//! - `messages.rs`: the words, in Project Fluent files (`locales/<code>/<area>.ftl`, read with
//!   `fluent-bundle`); every message exists in every language (a test holds them together).
//! - `numbers.rs`: decimals and dates written as each language writes them (separators from
//!   the CLDR data of `num-format`, month names from `chrono`'s locales).
//!
//! The translations other than English were made by the project's engineers and want a
//! native speaker's review (each file says so).

pub mod messages;
pub mod numbers;

pub use messages::{text, Args};

use unic_langid::LanguageIdentifier;

/// A language of the participants' pages.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, Default)]
pub enum Language {
    /// English (the project's own language, and the fallback).
    #[default]
    English,
    /// Spanish.
    Spanish,
    /// French.
    French,
    /// German.
    German,
    /// Portuguese.
    Portuguese,
}

impl Language {
    /// Every language, English first (the order of the language switch).
    pub const ALL: [Language; 5] = [
        Language::English,
        Language::Spanish,
        Language::French,
        Language::German,
        Language::Portuguese,
    ];

    /// The BCP 47 code (`en`, `es`, ...): the `lang` attribute and the `lang` parameter.
    pub fn code(self) -> &'static str {
        match self {
            Language::English => "en",
            Language::Spanish => "es",
            Language::French => "fr",
            Language::German => "de",
            Language::Portuguese => "pt",
        }
    }

    /// The language's name in itself, as the language switch shows it.
    pub fn own_name(self) -> &'static str {
        match self {
            Language::English => "English",
            Language::Spanish => "Español",
            Language::French => "Français",
            Language::German => "Deutsch",
            Language::Portuguese => "Português",
        }
    }

    /// Every language's code with its own name, for a message that lists them:
    /// `en (English), es (Español), fr (Français), de (Deutsch), pt (Português)`.
    pub fn codes_named() -> String {
        Language::ALL
            .iter()
            .map(|l| format!("{} ({})", l.code(), l.own_name()))
            .collect::<Vec<_>>()
            .join(", ")
    }

    /// The language of a code (`es`, `es-MX`, `PT-br`: the primary subtag decides), if it is
    /// one of ours.
    pub fn from_code(code: &str) -> Option<Language> {
        let primary = code.trim().split(['-', '_']).next()?.to_ascii_lowercase();
        Language::ALL.into_iter().find(|l| l.code() == primary)
    }

    fn identifier(self) -> LanguageIdentifier {
        self.code().parse().unwrap_or_default()
    }

    /// The best of our languages for an `Accept-Language` header (weights honoured, regional
    /// variants matched to their language), English when none matches or the header cannot
    /// be read.
    pub fn negotiate(accept_language: &str) -> Language {
        use fluent_langneg::{negotiate_languages, NegotiationStrategy};
        let requested = by_preference(accept_language);
        let available: Vec<LanguageIdentifier> =
            Language::ALL.iter().map(|l| l.identifier()).collect();
        let default = Language::English.identifier();
        let chosen = negotiate_languages(
            &requested,
            &available,
            Some(&default),
            NegotiationStrategy::Lookup,
        );
        chosen
            .first()
            .and_then(|id| Language::from_code(id.language.as_str()))
            .unwrap_or_default()
    }
}

/// The language ranges of an `Accept-Language` header, most wanted first: the quality values
/// (`;q=0.8`, default 1) sort them, ties keep the header's order, `q=0` and unreadable ranges
/// are dropped, `*` is left to the fallback (RFC 9110 sections 12.4.2 and 12.5.4; the
/// negotiation crate reads the order only).
fn by_preference(header: &str) -> Vec<LanguageIdentifier> {
    let mut ranges: Vec<(f64, LanguageIdentifier)> = header
        .split(',')
        .filter_map(|item| {
            let mut parts = item.split(';');
            let tag = parts.next()?.trim();
            let q = parts
                .filter_map(|p| p.trim().strip_prefix("q="))
                .map(|v| v.trim().parse::<f64>().ok())
                .next()
                .unwrap_or(Some(1.0))?;
            if !(q > 0.0 && q <= 1.0) || tag.is_empty() || tag == "*" {
                return None;
            }
            Some((q, tag.parse().ok()?))
        })
        .collect();
    ranges.sort_by(|a, b| b.0.total_cmp(&a.0));
    ranges.into_iter().map(|(_, id)| id).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: RFC 9110 section 12.5.4 (quality values; a language range matches its
    // regional variants).
    #[test]
    fn accept_language_is_honoured() {
        assert_eq!(Language::negotiate(""), Language::English);
        assert_eq!(
            Language::negotiate("es-MX,es;q=0.9,en;q=0.8"),
            Language::Spanish
        );
        assert_eq!(Language::negotiate("pt-BR"), Language::Portuguese);
        assert_eq!(Language::negotiate("de-AT, en;q=0.5"), Language::German);
        assert_eq!(Language::negotiate("ja, fr;q=0.3"), Language::French);
        assert_eq!(Language::negotiate("en;q=0.2, fr;q=0.9"), Language::French);
        assert_eq!(Language::negotiate("zz, ;;q=x"), Language::English);
        assert_eq!(Language::from_code("PT_br"), Some(Language::Portuguese));
        assert_eq!(Language::from_code("xx"), None);
        assert_eq!(
            Language::codes_named(),
            "en (English), es (Español), fr (Français), de (Deutsch), pt (Português)"
        );
    }
}
