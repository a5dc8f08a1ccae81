//! The words of the participants' pages in each language: Project Fluent files
//! (`locales/<code>/<area>.ftl`, one file per area of the pages, embedded in the binary), read
//! once into one `fluent-bundle` per language. A message missing from a language (the test
//! below forbids it) or failing to format falls back to English, never to an empty string.
//!
//! Reference: Project Fluent, the syntax guide (projectfluent.org/fluent/guide), and the
//! `fluent-bundle` crate's documentation.

use super::Language;
use fluent_bundle::concurrent::FluentBundle;
use fluent_bundle::{FluentArgs, FluentResource, FluentValue};
use fluent_syntax::ast;
use std::sync::OnceLock;

/// The areas of the pages, one Fluent file each: the service's pages and their frame, the
/// observers' sheet, the public results, the feedback's diagnoses and advice.
pub const AREAS: [&str; 4] = ["pages", "sheet", "results", "feedback"];

/// The Fluent files of a language, one per area (in the order of [`AREAS`]).
macro_rules! files_of {
    ($code:literal) => {
        [
            include_str!(concat!("../../locales/", $code, "/pages.ftl")),
            include_str!(concat!("../../locales/", $code, "/sheet.ftl")),
            include_str!(concat!("../../locales/", $code, "/results.ftl")),
            include_str!(concat!("../../locales/", $code, "/feedback.ftl")),
        ]
    };
}

/// The Fluent sources of a language, one per area (in the order of [`AREAS`]).
pub fn sources(language: Language) -> [&'static str; 4] {
    match language {
        Language::English => files_of!("en"),
        Language::Spanish => files_of!("es"),
        Language::French => files_of!("fr"),
        Language::German => files_of!("de"),
        Language::Portuguese => files_of!("pt"),
    }
}

/// A Fluent source read into a resource; a resource with a syntax error keeps the messages
/// it could read (the test below fails on any error, so a shipped file has none).
fn resource_of(source: &str) -> FluentResource {
    match FluentResource::try_new(source.to_string()) {
        Ok(r) | Err((r, _)) => r,
    }
}

type Bundle = FluentBundle<FluentResource>;

/// Every language's bundle, made on first use.
fn bundles() -> &'static [Bundle; 5] {
    static BUNDLES: OnceLock<[Bundle; 5]> = OnceLock::new();
    BUNDLES.get_or_init(|| Language::ALL.map(bundle_of))
}

fn bundle_of(language: Language) -> Bundle {
    let id = language.code().parse().unwrap_or_default();
    let mut bundle = FluentBundle::new_concurrent(vec![id]);
    // The pages are left to right in every language here: no isolation marks around the
    // values (they would reach the HTML as invisible characters).
    bundle.set_use_isolating(false);
    for source in sources(language) {
        // A message defined twice keeps its first definition (the test forbids it).
        let _ = bundle.add_resource(resource_of(source));
    }
    bundle
}

/// The values a message takes: numbers already written for the language (see
/// [`super::numbers`]) go in as text; counts that choose a plural form go in as numbers.
#[derive(Default)]
pub struct Args<'a>(FluentArgs<'a>);

impl<'a> Args<'a> {
    /// No values.
    pub fn new() -> Self {
        Args(FluentArgs::new())
    }

    /// A text value.
    pub fn text(mut self, name: &'a str, value: impl Into<String>) -> Self {
        self.0.set(name, FluentValue::from(value.into()));
        self
    }

    /// A count (chooses the plural form; written as an integer).
    pub fn count(mut self, name: &'a str, value: usize) -> Self {
        self.0.set(name, FluentValue::from(value as f64));
        self
    }
}

/// The message `id` in `language` with `args`; English when the language lacks it or it
/// fails to format; the id itself (never an empty string) if English lacks it too.
pub fn text(language: Language, id: &str, args: &Args) -> String {
    formatted(language, id, args)
        .or_else(|| formatted(Language::English, id, args))
        .unwrap_or_else(|| id.to_string())
}

/// The message formatted without fallback, `None` on any error.
fn formatted(language: Language, id: &str, args: &Args) -> Option<String> {
    let bundle = &bundles()[Language::ALL.iter().position(|l| *l == language)?];
    let pattern = bundle.get_message(id)?.value()?;
    let mut errors = Vec::new();
    let out = bundle.format_pattern(pattern, Some(&args.0), &mut errors);
    errors.is_empty().then(|| out.into_owned())
}

/// The ids of a language's messages, in file order (for the completeness test and tools).
pub fn message_ids(language: Language) -> Vec<String> {
    let mut ids = Vec::new();
    for source in sources(language) {
        let resource = resource_of(source);
        ids.extend(resource.entries().filter_map(|e| match e {
            ast::Entry::Message(m) => Some(m.id.name.to_string()),
            _ => None,
        }));
    }
    ids
}

/// The names of the variables a message uses (`{ $name }`, in its value, its attributes and
/// every variant of a selection), sorted, for the test that every translation takes the same
/// values as the English.
pub fn variables(language: Language, id: &str) -> Vec<String> {
    let mut names = Vec::new();
    for source in sources(language) {
        let resource = resource_of(source);
        for entry in resource.entries() {
            if let ast::Entry::Message(m) = entry {
                if m.id.name == id {
                    m.value
                        .iter()
                        .for_each(|p| pattern_variables(p, &mut names));
                    for a in &m.attributes {
                        pattern_variables(&a.value, &mut names);
                    }
                }
            }
        }
    }
    names.sort();
    names.dedup();
    names
}

fn pattern_variables(pattern: &ast::Pattern<&str>, names: &mut Vec<String>) {
    for element in &pattern.elements {
        if let ast::PatternElement::Placeable { expression } = element {
            expression_variables(expression, names);
        }
    }
}

fn expression_variables(expression: &ast::Expression<&str>, names: &mut Vec<String>) {
    match expression {
        ast::Expression::Inline(inline) => inline_variables(inline, names),
        ast::Expression::Select { selector, variants } => {
            inline_variables(selector, names);
            for v in variants {
                pattern_variables(&v.value, names);
            }
        }
    }
}

fn inline_variables(inline: &ast::InlineExpression<&str>, names: &mut Vec<String>) {
    match inline {
        ast::InlineExpression::VariableReference { id } => names.push(id.name.to_string()),
        ast::InlineExpression::Placeable { expression } => expression_variables(expression, names),
        ast::InlineExpression::FunctionReference { arguments, .. }
        | ast::InlineExpression::TermReference {
            arguments: Some(arguments),
            ..
        } => {
            for a in &arguments.positional {
                inline_variables(a, names);
            }
            for a in &arguments.named {
                inline_variables(&a.value, names);
            }
        }
        _ => {}
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every file parses without an error, and every message of the English file exists in
    /// every language with the same variables (and no language has a message English lacks).
    #[test]
    fn every_message_exists_in_every_language() {
        for language in Language::ALL {
            for (area, source) in AREAS.iter().zip(sources(language)) {
                let errors = FluentResource::try_new(source.to_string())
                    .err()
                    .map(|(_, e)| e.len())
                    .unwrap_or(0);
                assert_eq!(errors, 0, "{}/{area}.ftl: syntax errors", language.code());
            }
            let mut ids = message_ids(language);
            let all = ids.len();
            ids.sort();
            ids.dedup();
            assert_eq!(
                ids.len(),
                all,
                "{}: a message defined twice",
                language.code()
            );
        }
        let english = message_ids(Language::English);
        assert!(english.len() > 50, "{} messages", english.len());
        // The variables are read from the syntax tree, selections included.
        assert_eq!(
            variables(Language::English, "feedback-received"),
            ["id", "n"]
        );
        for language in Language::ALL {
            let ids = message_ids(language);
            for id in &english {
                assert!(ids.contains(id), "{} lacks {id}", language.code());
                assert_eq!(
                    variables(language, id),
                    variables(Language::English, id),
                    "{}: the variables of {id}",
                    language.code()
                );
            }
            for id in &ids {
                assert!(
                    english.contains(id),
                    "{} has {id}, English not",
                    language.code()
                );
            }
        }
    }

    /// Every message formats in every language with its variables given, with no error and
    /// no text left untranslated by accident (a non-English message equal to the English is
    /// allowed only where it is a symbol or a name).
    #[test]
    fn every_message_formats_in_every_language() {
        for language in Language::ALL {
            for id in message_ids(Language::English) {
                let mut args = Args::new();
                for v in variables(Language::English, &id) {
                    let name: &'static str = Box::leak(v.into_boxed_str());
                    args = if name == "n" {
                        args.count(name, 2)
                    } else {
                        args.text(name, "X")
                    };
                }
                let out = formatted(language, &id, &args);
                assert!(
                    out.as_deref().is_some_and(|s| !s.trim().is_empty()),
                    "{}: {id} does not format",
                    language.code()
                );
            }
        }
    }

    #[test]
    fn a_missing_message_falls_back() {
        assert_eq!(
            text(Language::French, "no-such-message", &Args::new()),
            "no-such-message"
        );
        let fr = text(Language::French, "skip-link", &Args::new());
        assert!(!fr.is_empty() && fr != text(Language::English, "skip-link", &Args::new()));
    }

    /// The planet is named in the reader's language (a Fluent selector on `venus`/`mercury`).
    #[test]
    fn the_planet_is_named_in_each_language() {
        let args = |planet: &str| Args::new().text("planet", planet).text("date", "13");
        for (l, mercury, venus) in [
            (Language::English, "transit of Mercury", "transit of Venus"),
            (
                Language::Spanish,
                "tránsito de Mercurio",
                "tránsito de Venus",
            ),
            (Language::French, "transit de Mercure", "transit de Vénus"),
            (Language::German, "Transit von Merkur", "Transit von Venus"),
            (
                Language::Portuguese,
                "trânsito de Mercúrio",
                "trânsito de Vénus",
            ),
        ] {
            let m = text(l, "form-intro", &args("mercury"));
            let v = text(l, "form-intro", &args("venus"));
            assert!(m.contains(mercury) && v.contains(venus), "{m} / {v}");
        }
    }
}
