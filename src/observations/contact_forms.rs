//! What a row says of the contact: a pair of contacts for a timed interval (`2-3`, `II-III`)
//! and how the observer judged an interior contact (`contact_judged`).
//!
//! The black drop (the dark ligament that joins the planet to the limb near the interior
//! contacts) makes the moment observers saw differ from the ideal contact of the discs: some
//! timed the thread of light between the limbs forming or breaking, others the limbs seeming to
//! touch. The reduction fits each judgement's lag behind the geometric contact (see
//! `reduction::black_drop`).
//!
//! References: T. Hornsby, Phil. Trans. 61, 574 (1771), and C. Green and J. Cook, Phil.
//! Trans. 61, 397 (1771), record both judgements at one station in 1769; G. Schneider, J. M.
//! Pasachoff and L. Golub, Icarus 168, 249 (2004), on the black drop's cause.

use crate::geometry::contacts::Contact;

/// How an observer judged a contact.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum ContactJudged {
    /// The ideal contact of the two discs (the default, and what a row that does not say is
    /// taken to mean).
    #[default]
    Geometric,
    /// The thread of light between the limbs formed (egress) or broke (ingress).
    Thread,
    /// The limbs seemed to touch (the black drop).
    Touch,
}

impl ContactJudged {
    /// Every judgement that carries a lag, in the order of outputs.
    pub const LAGGED: [ContactJudged; 2] = [ContactJudged::Thread, ContactJudged::Touch];

    /// Parse `geometric`, `thread` or `touch` (any case; empty is geometric).
    pub fn parse(text: &str) -> Result<ContactJudged, String> {
        match text.trim().to_ascii_lowercase().as_str() {
            "" | "geometric" => Ok(ContactJudged::Geometric),
            "thread" => Ok(ContactJudged::Thread),
            "touch" => Ok(ContactJudged::Touch),
            other => Err(format!(
                "'{other}' is not a judgement of the contact; write geometric (the ideal contact of the discs), thread (the thread of light between the limbs formed or broke) or touch (the limbs seemed to touch)"
            )),
        }
    }

    /// `geometric`, `thread` or `touch`.
    pub fn name(self) -> &'static str {
        match self {
            ContactJudged::Geometric => "geometric",
            ContactJudged::Thread => "thread",
            ContactJudged::Touch => "touch",
        }
    }
}

/// A pair of contacts for a timed interval: `2-3`, `II-III`, `C1-C4`, `1-4` (any of the forms
/// of a single contact, joined by a hyphen or a dash). The first must come before the second.
pub fn parse_contact_pair(text: &str) -> Result<(Contact, Contact), String> {
    let t = text.trim();
    let bad = || {
        format!("'{t}' is not a pair of contacts for a duration; write the two contacts the interval runs between, e.g. 2-3 or II-III")
    };
    let (a, b) = t.split_once(['-', '–', '—']).ok_or_else(bad)?;
    let (a, b) = (
        Contact::parse(a.trim()).ok_or_else(bad)?,
        Contact::parse(b.trim()).ok_or_else(bad)?,
    );
    if a == b {
        return Err(format!(
            "'{t}': a duration runs between two different contacts; write the pair it was timed between, e.g. 2-3"
        ));
    }
    if a > b {
        return Err(format!(
            "'{t}': a duration runs from the earlier contact to the later; write {}-{}",
            b.number().min(a.number()),
            b.number().max(a.number())
        ));
    }
    Ok((a, b))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn pairs_and_judgements_parse() {
        assert_eq!(parse_contact_pair("2-3"), Ok((Contact::II, Contact::III)));
        assert_eq!(
            parse_contact_pair("II - III"),
            Ok((Contact::II, Contact::III))
        );
        assert_eq!(parse_contact_pair("c1–c4"), Ok((Contact::I, Contact::IV)));
        assert!(parse_contact_pair("3-2").unwrap_err().contains("write 2-3"));
        // Found in review: the same contact twice was told to write itself again.
        let same = parse_contact_pair("2-2").unwrap_err();
        assert!(same.contains("two different contacts") && !same.contains("write 2-2"));
        assert!(parse_contact_pair("2").unwrap_err().contains("II-III"));
        assert!(parse_contact_pair("2-5").is_err());
        assert_eq!(ContactJudged::parse("Touch"), Ok(ContactJudged::Touch));
        assert_eq!(ContactJudged::parse(""), Ok(ContactJudged::Geometric));
        assert!(ContactJudged::parse("blob").unwrap_err().contains("thread"));
    }
}
