//! A station's contacts as an iCalendar file: one event per contact seen with the Sun up, each
//! with a reminder, for the observers' phones and calendars; its words and numbers in the
//! sheet's language (`locales/*/sheet.ftl`), the solar caution in every description.
//!
//! References: RFC 5545, *Internet Calendaring and Scheduling Core Object Specification*
//! (2009): sections 3.6.1 (VEVENT), 3.6.6 (VALARM), 3.8.4.7 (UID), 3.8.7.2 (DTSTAMP), 3.1
//! (lines folded at 75 octets, CRLF). Written with the `icalendar` crate.

use crate::geometry::contacts::Contact;
use crate::geometry::sun_horizon::sun_is_up;
use crate::geometry::transit::TransitEvent;
use crate::language::{text, Args};
use crate::render::observer_sheet::SheetStation;
use crate::render::sheet_words::{caution, number, title};
use chrono::{DateTime, TimeDelta, Utc};
use icalendar::{Alarm, Calendar, Component, Event, EventLike, Property, Trigger};

/// The calendar's PRODID (RFC 5545 §3.7.3): who made it.
const PRODUCT_ID: &str = "-//transit-parallax//observers' sheets//EN";

/// How long each contact's event lasts in the calendar, minutes.
const EVENT_DURATION_MIN: i64 = 5;

/// How long before a contact its reminder comes, minutes: 30 before contact I (time to set
/// up), 15 before the others.
fn reminder_min(contact: Contact) -> i64 {
    if contact == Contact::I {
        30
    } else {
        15
    }
}

/// A stable identifier of one contact at one station: the same for every run, so that a
/// calendar imported twice updates its events rather than doubling them (RFC 5545 §3.8.4.7).
/// Made of the planet, the date, the contact and the station's name reduced to safe letters
/// with a hash of the full name (two names that reduce alike keep apart).
pub fn contact_uid(event: &TransitEvent, station_name: &str, contact: Contact) -> String {
    use sha2::{Digest, Sha256};
    let digest = Sha256::digest(station_name.as_bytes());
    let hash: String = digest[..6].iter().map(|b| format!("{b:02x}")).collect();
    let safe: String = station_name
        .chars()
        .map(|c| {
            if c.is_ascii_alphanumeric() {
                c.to_ascii_lowercase()
            } else {
                '-'
            }
        })
        .collect();
    format!(
        "{}-{}-c{}-{}-{hash}@transit-parallax",
        event.planet.title().to_ascii_lowercase(),
        event.date(),
        contact.number(),
        safe.trim_matches('-')
    )
}

/// The calendar of one station's contacts seen with the Sun up (none: a valid, empty
/// calendar).
///
/// Arguments: `event`; `st`, the station, its zone, file names and language; `stamp_utc`, the
/// instant the calendar is made (DTSTAMP).
/// Returns: the calendar as RFC 5545 text (CRLF line ends, lines folded at 75 octets).
pub fn station_calendar(
    event: &TransitEvent,
    st: &SheetStation,
    stamp_utc: DateTime<Utc>,
) -> String {
    let name = &st.prediction.station.name;
    let l = st.language;
    let planet = event.planet.name();
    let mut calendar = Calendar::empty();
    for (key, value) in [
        ("VERSION", "2.0"),
        ("PRODID", PRODUCT_ID),
        ("CALSCALE", "GREGORIAN"),
    ] {
        calendar.append_property(Property::new(key, value));
    }
    calendar.name(&title(l, event, name));
    for c in st.prediction.contacts.iter().flatten() {
        if !sun_is_up(c.sun_altitude_deg) {
            continue;
        }
        let label = event.label(c.hours);
        // Rounded to the second, as the sheet prints it.
        let start = (label + TimeDelta::milliseconds(500)).and_utc();
        let start = start - TimeDelta::nanoseconds(i64::from(start.timestamp_subsec_nanos()));
        let clock = st.zone.map_or(String::new(), |z| {
            let r = z.reading(label);
            let args = Args::new()
                .text("time", r.iso(0)[11..19].to_string())
                .text("abbreviation", r.abbreviation);
            text(l, "calendar-clock-time", &args) + " "
        });
        let contact = c.contact.roman();
        let description = text(
            l,
            "calendar-description",
            &Args::new()
                .text("contact", contact)
                .text("planet", planet)
                .text("station", name.as_str())
                .text("clock", clock)
                .text("utc", start.format("%H:%M:%S").to_string())
                .text("altitude", number(l, c.sun_altitude_deg, 1))
                .text("position_angle", number(l, c.position_angle_deg, 1))
                .text("vertex_angle", number(l, c.vertex_angle_deg, 1)),
        ) + " "
            + &caution(l);
        let uid = contact_uid(event, name, c.contact);
        let reminder = text(
            l,
            "calendar-reminder",
            &Args::new()
                .text("contact", contact)
                .text("planet", planet)
                .count("n", reminder_min(c.contact) as usize),
        );
        let alarm = Alarm::display(
            &reminder,
            Trigger::before_start(TimeDelta::minutes(reminder_min(c.contact))),
        )
        .uid(&format!("alarm-{uid}"))
        .done();
        let summary = text(
            l,
            "calendar-summary",
            &Args::new()
                .text("planet", planet)
                .text("contact", contact)
                .text("station", name.as_str()),
        );
        calendar.push(
            Event::new()
                .uid(&uid)
                .timestamp(stamp_utc)
                .summary(&summary)
                .description(&description)
                .starts(start)
                .ends(start + TimeDelta::minutes(EVENT_DURATION_MIN))
                .alarm(alarm)
                .done(),
        );
    }
    calendar.done().to_string()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn uids_are_stable_and_keep_alike_names_apart() {
        let event = crate::transit_on_date(
            crate::Planet::Mercury,
            crate::time::iso::parse_date("2032-11-13").expect("date"),
            &crate::time::scales::TimeModel::default(),
        )
        .expect("transit");
        let a = contact_uid(&event, "North Hill", Contact::II);
        assert_eq!(a, contact_uid(&event, "North Hill", Contact::II));
        assert!(a.starts_with("mercury-2032-11-13-c2-north-hill-"), "{a}");
        assert_ne!(a, contact_uid(&event, "North/Hill", Contact::II));
        assert_ne!(a, contact_uid(&event, "North Hill", Contact::III));
        assert_eq!(reminder_min(Contact::I), 30);
        assert_eq!(reminder_min(Contact::IV), 15);
    }
}
