//! The feedback's words for people: a difference from the prediction ("12.0 s later than
//! predicted"), a reader's reason without jargon and with an example of the form expected,
//! and what an offset common to a station's timings probably is and what to change.

use crate::geometry::transit::TransitEvent;

/// A verdict in words for people: a closed set, each with its English words (the API's
/// `verdict_words`, serialised as them) and its message in the participants' languages
/// (`locales/*/*.ftl`; a test holds the English message to the English words).
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum VerdictWords {
    /// The timing agrees with its prediction.
    Fits,
    /// More off than its uncertainty allows, not enough to be set aside.
    Doubtful,
    /// Far more off than any error of the prediction or of a clock.
    DoesNotFit,
    /// A blunder of a known kind, with the correction said.
    Slip,
    /// The row could not be read as a timing.
    Unread,
}

impl VerdictWords {
    /// Every verdict in words.
    pub const ALL: [VerdictWords; 5] = [
        VerdictWords::Fits,
        VerdictWords::Doubtful,
        VerdictWords::DoesNotFit,
        VerdictWords::Slip,
        VerdictWords::Unread,
    ];

    /// The words in English, as the API writes them.
    pub fn english(self) -> &'static str {
        match self {
            VerdictWords::Fits => "fits",
            VerdictWords::Doubtful => "doubtful",
            VerdictWords::DoesNotFit => "does not fit",
            VerdictWords::Slip => "probably a slip you can fix",
            VerdictWords::Unread => "could not be read",
        }
    }

    /// The id of the words' message in the participants' languages.
    pub fn message_id(self) -> &'static str {
        match self {
            VerdictWords::Fits => "verdict-fits",
            VerdictWords::Doubtful => "verdict-doubtful",
            VerdictWords::DoesNotFit => "verdict-does-not-fit",
            VerdictWords::Slip => "verdict-slip",
            VerdictWords::Unread => "verdict-unread",
        }
    }
}

impl serde::Serialize for VerdictWords {
    fn serialize<S: serde::Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        serializer.serialize_str(self.english())
    }
}

impl PartialEq<&str> for VerdictWords {
    fn eq(&self, other: &&str) -> bool {
        self.english() == *other
    }
}

/// A difference from the prediction in words: "12.0 s later than predicted", "8 h 0 min
/// earlier than predicted".
pub fn difference_words(o_c_s: f64) -> String {
    let side = if o_c_s >= 0.0 { "later" } else { "earlier" };
    let size = difference_size(o_c_s, |a| format!("{a:.1}"));
    format!("{size} {side} than predicted")
}

/// The size of a difference, without its side: "12.0 s", "16 min 23 s", "8 h 0 min"
/// (`one_decimal` writes a number of seconds with one decimal, in the reader's language).
pub fn difference_size(o_c_s: f64, one_decimal: impl Fn(f64) -> String) -> String {
    let a = o_c_s.abs();
    // Rounded to the second before it is split, so that 119.7 s reads "2 min 0 s", never
    // "1 min 60 s".
    let whole_s = a.round() as u64;
    if a < 100.0 {
        format!("{} s", one_decimal(a))
    } else if whole_s < 3600 {
        format!("{} min {} s", whole_s / 60, whole_s % 60)
    } else {
        format!("{} h {} min", whole_s / 3600, (whole_s % 3600) / 60)
    }
}

/// The reduction's wording of a blunder, for people: "O - C" said in words.
pub fn plain(sentence: &str) -> String {
    sentence
        .replace("O - C is", "the difference is")
        .replace("O - C", "difference")
}

/// A reason of the reader in plain words: no "ISO 8601", an example of the form expected
/// (`example`, a time of this event).
pub fn plain_reason(reason: &str, example: &str) -> (String, String) {
    if reason.contains("ISO 8601") {
        let quoted = reason.split('\'').nth(1).filter(|q| !q.is_empty());
        let what = match quoted {
            Some(q) => format!("the time '{q}' could not be read as a date and time"),
            None => "a time could not be read as a date and time".to_string(),
        };
        return (
            what,
            format!("write the date and the time of day in UTC, like {example}"),
        );
    }
    (
        reason.to_string(),
        format!("correct the row and send it again (times in UTC, like {example})"),
    )
}

/// An example of the time form expected, at this event: its geocentric contact II (or
/// greatest transit), written as people write it.
pub fn example_time(event: &TransitEvent) -> String {
    let h = event.geocentric_hours[1].unwrap_or_else(|| event.hours_of_greatest());
    event.label(h).format("%Y-%m-%d %H:%M:%S UTC").to_string()
}

/// What an offset common to a station's timings probably is, in a few words (the
/// classification of [`station_advice`]).
pub fn offset_cause(offset_s: f64) -> String {
    let days = (offset_s / 86_400.0).round();
    let halves = (offset_s / 1800.0).round();
    if days != 0.0 && (offset_s - 86_400.0 * days).abs() < 120.0 {
        format!(
            "a date off by {}",
            crate::words::count(days.abs() as usize, "day", "days")
        )
    } else if halves != 0.0 && halves.abs() <= 28.0 && (offset_s - 1800.0 * halves).abs() < 120.0 {
        format!("a time zone of {} h left in", halves.abs() / 2.0)
    } else {
        format!("a clock off by about {:.0} s", offset_s.abs())
    }
}

/// What an offset common to all `n` timings of a station probably is, and what to change:
/// a whole day (the date), whole or half hours (a time zone left in), or else the clock.
/// Common practice, no single source (the blunders of docs/reduction.md).
pub fn station_advice(offset_s: f64, n: usize) -> String {
    const WORDS: [&str; 9] = [
        "", "one", "two", "three", "four", "five", "six", "seven", "eight",
    ];
    let all = match n {
        2 => "both of your timings".to_string(),
        3..=8 => format!("all {} of your timings", WORDS[n]),
        _ => format!("all {n} of your timings"),
    };
    let side = if offset_s > 0.0 { "late" } else { "early" };
    let (fix, back) = if offset_s > 0.0 {
        ("subtract", "from")
    } else {
        ("add", "to")
    };
    let days = (offset_s / 86_400.0).round();
    if days != 0.0 && (offset_s - 86_400.0 * days).abs() < 120.0 {
        return format!("{all} are about {} {side}: the date is probably wrong; check the date you wrote and send them again", crate::words::count(days.abs() as usize, "day", "days"));
    }
    let halves = (offset_s / 1800.0).round();
    if halves != 0.0 && halves.abs() <= 28.0 && (offset_s - 1800.0 * halves).abs() < 120.0 {
        let h = halves.abs() / 2.0;
        return format!("{all} are about {h} h {side}: your clock's time zone was probably left in (local time given as UTC); {fix} {h} h {back} each and send them again");
    }
    format!("{all} are about {:.0} s {side}: check the clock you timed with (set it by a time signal or GPS); if it was off by that much, {fix} {:.0} s {back} each and send them again", offset_s.abs(), offset_s.abs())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_difference_in_words() {
        assert_eq!(difference_words(12.04), "12.0 s later than predicted");
        assert_eq!(difference_words(-3.0), "3.0 s earlier than predicted");
        assert_eq!(difference_words(983.0), "16 min 23 s later than predicted");
        assert_eq!(
            difference_words(-28_803.0),
            "8 h 0 min earlier than predicted"
        );
        // Rounded before it is split: never "1 min 60 s".
        assert_eq!(difference_words(119.7), "2 min 0 s later than predicted");
        assert_eq!(difference_words(3599.6), "1 h 0 min later than predicted");
    }

    #[test]
    fn verdict_words_are_the_english_messages() {
        use crate::language::{text, Args, Language};
        for v in VerdictWords::ALL {
            assert_eq!(
                text(Language::English, v.message_id(), &Args::new()),
                v.english()
            );
        }
    }

    #[test]
    fn offsets_are_named_by_their_likely_cause() {
        assert_eq!(offset_cause(62.0), "a clock off by about 62 s");
        assert_eq!(offset_cause(-5.5 * 3600.0), "a time zone of 5.5 h left in");
        assert_eq!(offset_cause(86_430.0), "a date off by 1 day");
        let advice = station_advice(-3600.0, 3);
        assert!(
            advice.starts_with("all three of your timings are about 1 h early"),
            "{advice}"
        );
        assert!(advice.contains("add 1 h to each"), "{advice}");
    }
}
