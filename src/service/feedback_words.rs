//! The feedback's words for people: the verdict in words, a difference from the prediction
//! ("12.0 s later than predicted") and an example of the time form expected. The sentences
//! built from them are in `feedback_sentences.rs`.

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

/// An example of the time form expected, at this event: its geocentric contact II (or
/// greatest transit), written as people write it.
pub fn example_time(event: &TransitEvent) -> String {
    let h = event.geocentric_hours[1].unwrap_or_else(|| event.hours_of_greatest());
    event.label(h).format("%Y-%m-%d %H:%M:%S UTC").to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_difference_in_words() {
        let difference_words = |x: f64| {
            super::super::feedback_page::difference_in(crate::language::Language::English, x)
        };
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
}
