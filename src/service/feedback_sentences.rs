//! The feedback's sentences as values: a message of the participants' languages with its
//! arguments (numbers kept as numbers until the sentence is written, so that each language
//! writes them its own way), or the library's own English words where the tool has no message
//! for them (a reader's reason for a row it cannot read). The API writes every sentence in
//! English; the pages write it in the visitor's language.

use super::feedback_words::difference_size;
use crate::language::numbers::{decimal, decimal_text};
use crate::language::{text, Args, Language};
use crate::reduction::row_blunders::RowBlunder;

/// A value of a sentence.
#[derive(Clone, Debug, PartialEq)]
pub enum Value {
    /// Words as they are.
    Text(String),
    /// A number with this many decimals (no grouping of digits), with the language's decimal
    /// sign.
    Decimal(f64, usize),
    /// A number in its shortest form (`5.5`, `1`), with the language's decimal sign.
    Number(f64),
    /// A number with its sign (`+12.0`, `-3`), this many decimals.
    Signed(f64, usize),
    /// A count: written as a whole number, it chooses the plural form.
    Count(usize),
    /// A difference from the prediction in words ("12.0 s later than predicted"); `interval`:
    /// of a timed interval from the predicted one.
    Difference {
        /// Observed minus predicted, seconds.
        o_c_s: f64,
        /// Whether it is an interval's difference.
        interval: bool,
    },
    /// A sentence within the sentence.
    Sentence(Box<Sentence>),
}

/// A sentence of the feedback.
#[derive(Clone, Debug, PartialEq)]
pub enum Sentence {
    /// A message of the participants' languages and its values.
    Message {
        /// The message's id.
        id: &'static str,
        /// Its values by name.
        args: Vec<(&'static str, Value)>,
    },
    /// Words of the library that have no message (English in every language).
    Verbatim(String),
}

impl Sentence {
    /// The message `id` without values yet.
    pub fn new(id: &'static str) -> Self {
        Sentence::Message {
            id,
            args: Vec::new(),
        }
    }

    /// The sentence with one more value.
    pub fn with(mut self, name: &'static str, value: Value) -> Self {
        if let Sentence::Message { args, .. } = &mut self {
            args.push((name, value));
        }
        self
    }

    /// The sentence in `language` (plain text, to be escaped where it goes into HTML).
    pub fn in_language(&self, language: Language) -> String {
        match self {
            Sentence::Verbatim(words) => words.clone(),
            Sentence::Message { id, args } => {
                let mut a = Args::new();
                for (name, value) in args {
                    a = match value {
                        Value::Count(n) => a.count(name, *n),
                        other => a.text(name, written(language, other)),
                    };
                }
                text(language, id, &a)
            }
        }
    }

    /// The sentence in English (the API's words).
    pub fn english(&self) -> String {
        self.in_language(Language::English)
    }
}

/// A value written for `language`.
fn written(language: Language, value: &Value) -> String {
    match value {
        Value::Text(s) => s.clone(),
        Value::Decimal(x, d) => decimal_text(language, &format!("{x:.d$}")),
        Value::Number(x) => decimal_text(language, &format!("{x}")),
        Value::Signed(x, d) => decimal_text(language, &format!("{x:+.d$}")),
        Value::Count(n) => n.to_string(),
        Value::Difference {
            o_c_s,
            interval: false,
        } => super::feedback_page::difference_in(language, *o_c_s),
        Value::Difference {
            o_c_s,
            interval: true,
        } => {
            let size = difference_size(*o_c_s, |a| decimal(language, a, 1));
            let id = if *o_c_s >= 0.0 {
                "later-than-predicted-interval"
            } else {
                "earlier-than-predicted-interval"
            };
            text(language, id, &Args::new().text("size", size))
        }
        Value::Sentence(s) => s.in_language(language),
    }
}

impl serde::Serialize for Sentence {
    fn serialize<S: serde::Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        serializer.serialize_str(&self.english())
    }
}

/// "yes" or "no", for a message's selection.
fn yes(b: bool) -> Value {
    Value::Text(if b { "yes" } else { "no" }.into())
}

/// A blunder of one timing in the participant's words: the reduction's own finding
/// ([`RowBlunder`]), with "O - C" said as "the difference".
pub fn blunder_sentence(b: &RowBlunder) -> Sentence {
    let hours = |o_c_s: f64| Value::Signed(o_c_s / 3600.0, 3);
    match *b {
        RowBlunder::DateOff { o_c_s, miss_s } => Sentence::new("blunder-date-off")
            .with("oc", Value::Signed(o_c_s, 0))
            .with("miss", Value::Decimal(miss_s, 0))
            .with("late", yes(o_c_s > 0.0)),
        RowBlunder::HalfDay { o_c_s } => Sentence::new("blunder-half-day")
            .with("hours", hours(o_c_s))
            .with("late", yes(o_c_s > 0.0)),
        RowBlunder::ZoneHours { o_c_s, hours: h } => Sentence::new("blunder-zone-hours")
            .with("hours", hours(o_c_s))
            .with("subtract", yes(h > 0.0))
            .with("fix", Value::Decimal(h.abs(), 0)),
        RowBlunder::HalfHourZone { o_c_s, hours: h } => Sentence::new("blunder-half-hour-zone")
            .with("hours", hours(o_c_s))
            .with("subtract", yes(h > 0.0))
            .with("fix", Value::Decimal(h.abs(), 1)),
        RowBlunder::ContactsExchanged {
            labelled,
            fits,
            o_c_s,
        } => {
            let (first, second) = if labelled < fits {
                (labelled, fits)
            } else {
                (fits, labelled)
            };
            Sentence::new("blunder-contacts-exchanged")
                .with("labelled", Value::Text(labelled.roman().into()))
                .with("fits", Value::Text(fits.roman().into()))
                .with("oc", Value::Signed(o_c_s, 1))
                .with("first", Value::Text(first.roman().into()))
                .with("second", Value::Text(second.roman().into()))
        }
        RowBlunder::MinuteTypo {
            o_c_s,
            minutes,
            miss_s,
        } => Sentence::new("blunder-minute-typo")
            .with("oc", Value::Signed(o_c_s, 1))
            .with("n", Value::Count(minutes.abs() as usize))
            .with("miss", Value::Decimal(miss_s, 0))
            .with("subtract", yes(minutes > 0.0)),
    }
}

/// What an offset common to a station's timings probably is, in a few words: a whole day
/// (the date), whole or half hours (a time zone left in), or else the clock. Common
/// practice, no single source (the blunders of docs/reduction.md).
pub fn offset_cause(offset_s: f64) -> Sentence {
    match offset_kind(offset_s) {
        OffsetKind::Days(days) => Sentence::new("offset-cause-date").with("n", Value::Count(days)),
        OffsetKind::Hours(h) => Sentence::new("offset-cause-zone").with("hours", Value::Number(h)),
        OffsetKind::Clock => {
            Sentence::new("offset-cause-clock").with("seconds", Value::Decimal(offset_s.abs(), 0))
        }
    }
}

/// The kinds of offset a whole station's timings share.
enum OffsetKind {
    /// Whole days.
    Days(usize),
    /// Whole or half hours (up to 14).
    Hours(f64),
    /// Anything else: the clock.
    Clock,
}

fn offset_kind(offset_s: f64) -> OffsetKind {
    let days = (offset_s / 86_400.0).round();
    let halves = (offset_s / 1800.0).round();
    if days != 0.0 && (offset_s - 86_400.0 * days).abs() < 120.0 {
        OffsetKind::Days(days.abs() as usize)
    } else if halves != 0.0 && halves.abs() <= 28.0 && (offset_s - 1800.0 * halves).abs() < 120.0 {
        OffsetKind::Hours(halves.abs() / 2.0)
    } else {
        OffsetKind::Clock
    }
}

/// What an offset common to all `n` timings of a station probably is, and what to change.
pub fn station_advice(offset_s: f64, n: usize) -> Sentence {
    let all = Sentence::new("all-your-timings").with("n", Value::Count(n));
    let common = |id: &'static str| {
        Sentence::new(id)
            .with("all", Value::Sentence(Box::new(all.clone())))
            .with("late", yes(offset_s > 0.0))
    };
    match offset_kind(offset_s) {
        OffsetKind::Days(days) => common("station-advice-date").with("days", Value::Count(days)),
        OffsetKind::Hours(h) => common("station-advice-zone").with("hours", Value::Number(h)),
        OffsetKind::Clock => {
            common("station-advice-clock").with("seconds", Value::Decimal(offset_s.abs(), 0))
        }
    }
}

/// A reason of the reader in plain words, and what to do: no "ISO 8601", an example of the
/// form expected (`example`, a time of this event). The reader's other reasons are the
/// library's own words.
pub fn plain_reason(reason: &str, example: &str) -> (Sentence, Sentence) {
    let example = Value::Text(example.to_string());
    if reason.contains("ISO 8601") {
        let quoted = reason.split('\'').nth(1).filter(|q| !q.is_empty());
        let what = match quoted {
            Some(q) => Sentence::new("unread-time-quoted").with("time", Value::Text(q.into())),
            None => Sentence::new("unread-time"),
        };
        return (
            what,
            Sentence::new("advice-write-utc").with("example", example),
        );
    }
    (
        Sentence::Verbatim(reason.to_string()),
        Sentence::new("advice-correct-row").with("example", example),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn offsets_are_named_by_their_likely_cause() {
        assert_eq!(offset_cause(62.0).english(), "a clock off by about 62 s");
        assert_eq!(
            offset_cause(-5.5 * 3600.0).english(),
            "a time zone of 5.5 h left in"
        );
        assert_eq!(offset_cause(86_430.0).english(), "a date off by 1 day");
        let advice = station_advice(-3600.0, 3).english();
        assert!(
            advice.starts_with("all three of your timings are about 1 h early"),
            "{advice}"
        );
        assert!(advice.contains("add 1 h to each"), "{advice}");
        let both = station_advice(8.0 * 3600.0, 2).english();
        assert!(
            both.starts_with("both of your timings are about 8 h late"),
            "{both}"
        );
        assert!(both.contains("subtract 8 h from each"), "{both}");
        let many = station_advice(61.6, 12).english();
        assert!(
            many.starts_with("all 12 of your timings are about 62 s late"),
            "{many}"
        );
    }

    /// The English of each blunder is the reduction's own sentence with "O - C" said in
    /// words.
    #[test]
    fn blunders_in_english_are_the_reductions_sentences() {
        use crate::geometry::contacts::Contact;
        let cases = [
            RowBlunder::DateOff {
                o_c_s: 86_410.0,
                miss_s: 10.0,
            },
            RowBlunder::DateOff {
                o_c_s: -86_395.0,
                miss_s: 5.0,
            },
            RowBlunder::HalfDay { o_c_s: -43_195.0 },
            RowBlunder::HalfDay { o_c_s: 43_210.0 },
            RowBlunder::ZoneHours {
                o_c_s: -17_996.0,
                hours: -5.0,
            },
            RowBlunder::HalfHourZone {
                o_c_s: 19_805.0,
                hours: 5.5,
            },
            RowBlunder::ContactsExchanged {
                labelled: Contact::III,
                fits: Contact::II,
                o_c_s: -2.5,
            },
            RowBlunder::MinuteTypo {
                o_c_s: -597.0,
                minutes: -10.0,
                miss_s: 3.0,
            },
            RowBlunder::MinuteTypo {
                o_c_s: 61.0,
                minutes: 1.0,
                miss_s: 1.0,
            },
        ];
        for b in cases {
            let want = b
                .sentence()
                .replace("O - C is", "the difference is")
                .replace("O - C", "difference");
            assert_eq!(blunder_sentence(&b).english(), want);
        }
    }

    #[test]
    fn sentences_are_written_in_the_visitors_language() {
        let s = Sentence::new("blunder-zone-hours")
            .with("hours", Value::Signed(-5.0, 3))
            .with("subtract", yes(false))
            .with("fix", Value::Decimal(5.0, 0));
        let de = s.in_language(Language::German);
        assert!(de.contains("-5,000"), "{de}");
        assert_ne!(de, s.english());
        assert_eq!(
            written(Language::English, &Value::Signed(86_410.0, 0)),
            "+86410"
        );
        assert_eq!(written(Language::French, &Value::Number(5.5)), "5,5");
        assert_eq!(written(Language::English, &Value::Number(1.0)), "1");
        let d = Value::Difference {
            o_c_s: 12.04,
            interval: true,
        };
        assert_eq!(
            written(Language::English, &d),
            "12.0 s longer than the predicted interval"
        );
        assert_eq!(
            Sentence::Verbatim("as is".into()).in_language(Language::French),
            "as is"
        );
    }
}
