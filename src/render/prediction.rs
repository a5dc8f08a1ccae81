//! Rendering of the transits of a span of years (`transits`) as a table, CSV and JSON, with the
//! columns and keys of the stable interface. Station predictions: `station_predictions.rs`.

use crate::geometry::contacts::Contact;
use crate::geometry::transit::TransitEvent;
use crate::render::station_predictions::delta_t_text;
use crate::render::text::{round, scale_of};
use crate::time::iso::format_utc;
use serde_json::{json, Value};

/// JSON for a list of transits (`transits` command).
pub fn transits_json(events: &[TransitEvent]) -> Value {
    Value::Array(
        events
            .iter()
            .map(|ev| {
                let contacts: Vec<Value> = Contact::ALL
                    .iter()
                    .filter_map(|&c| {
                        ev.geocentric_hours[c.index()].map(|h| {
                            json!({"contact": c.number(), "time_utc": format_utc(ev.label(h), 2)})
                        })
                    })
                    .collect();
                let duration_h = match (ev.geocentric_hours[0], ev.geocentric_hours[3]) {
                    (Some(a), Some(b)) => Some(b - a),
                    _ => None,
                };
                json!({
                    "planet": ev.planet.name(),
                    "date": ev.date().to_string(),
                    "greatest_utc": ev.greatest_utc(),
                    "min_separation_arcsec": round(ev.min_separation_arcsec, 2),
                    "contacts": contacts,
                    "duration_h": duration_h.map(|d| round(d, 4)),
                    "delta_t_s": round(ev.elements.delta_t_s, 2),
                    "delta_t_sigma_s": Some(ev.delta_t_sigma_s()).filter(|x| *x > 0.0).map(|x| round(x, 4)),
                    "ephemeris": ev.ephemeris_name(),
                })
            })
            .collect(),
    )
}

/// CSV for a list of transits.
pub fn transits_csv(events: &[TransitEvent]) -> String {
    let mut s = String::from(
        "planet,date,contact_1_utc,contact_2_utc,greatest_utc,contact_3_utc,contact_4_utc,min_separation_arcsec,delta_t_s,delta_t_sigma_s,ephemeris\n",
    );
    for ev in events {
        let c = |i: usize| {
            ev.geocentric_hours[i]
                .map(|h| format_utc(ev.label(h), 2))
                .unwrap_or_default()
        };
        s.push_str(&format!(
            "{},{},{},{},{},{},{},{:.2},{:.2},{:.2},{}\n",
            ev.planet.name(),
            ev.date(),
            c(0),
            c(1),
            ev.greatest_utc(),
            c(2),
            c(3),
            ev.min_separation_arcsec,
            ev.elements.delta_t_s,
            Some(ev.delta_t_sigma_s())
                .filter(|x| *x > 0.0)
                .map(crate::words::uncertainty)
                .unwrap_or_default(),
            ev.ephemeris_name()
        ));
    }
    s
}

/// Table for a list of transits: each contact with its own date (month-day), since contacts
/// of one transit can fall on two dates.
pub fn transits_table(events: &[TransitEvent]) -> String {
    let mut s = String::new();
    let row = |cells: [&str; 11]| {
        format!(
            "{:<8} {:<10} {:<5} {:>14} {:>14} {:>14} {:>14} {:>14} {:>10} {:>16}  {}\n",
            cells[0],
            cells[1],
            cells[2],
            cells[3],
            cells[4],
            cells[5],
            cells[6],
            cells[7],
            cells[8],
            cells[9],
            cells[10]
        )
    };
    s.push_str(&row([
        "planet",
        "date",
        "scale",
        "I",
        "II",
        "greatest",
        "III",
        "IV",
        "least sep",
        "Delta T",
        "ephemeris",
    ]));
    s.push_str(&row([
        "", "", "", "", "", "", "", "", "(arcsec)", "(s)", "",
    ]));
    for ev in events {
        let when = |h: f64| format_utc(ev.label(h), 0)[5..19].replace('T', " ");
        let c = |i: usize| {
            ev.geocentric_hours[i]
                .map(when)
                .unwrap_or_else(|| "-".into())
        };
        let greatest = ev.greatest_utc()[5..19].replace('T', " ");
        let date = ev.date().to_string();
        let sep = format!("{:.1}", ev.min_separation_arcsec);
        let dt = delta_t_text(ev);
        let scale = scale_of(ev.label(ev.hours_of_greatest()));
        let (c1, c2, c3, c4) = (c(0), c(1), c(2), c(3));
        let ephemeris = ev.ephemeris_name();
        s.push_str(&row([
            ev.planet.title(),
            &date,
            scale,
            &c1,
            &c2,
            &greatest,
            &c3,
            &c4,
            &sep,
            &dt,
            &ephemeris,
        ]));
    }
    if events.is_empty() {
        s.push_str("(no transit in these years)\n");
    }
    s.push_str("Geocentric contacts, month-day and time; times are UTC from 1972 and UT1 (mean solar time at Greenwich) before.\n");
    s.push_str(
        "Delta T = TT - UT1 with its published uncertainty (the 2021 reconstruction of Morrison, Stephenson, Hohenkerk and Zawilski before 1973, IERS observations and predictions to 2027, then the spread of published predictions); give --delta-t to use another value.\n",
    );
    s
}
