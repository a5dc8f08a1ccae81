//! Rendering of predictions (`transits`, `predict`) as tables, CSV and JSON, with the columns
//! and keys of the stable interface.

use crate::geometry::contacts::Contact;
use crate::geometry::transit::{StationPrediction, TransitEvent};
use crate::render::text::{
    clock_label, csv_field, fixed, name_cell, push_fixed, push_right, round, scale_of,
    SAFETY_CAUTION,
};
use crate::sky::solar_time::{local_from_label, LocalTime};
use crate::time::calendar::{julian_from_gregorian, Calendar};
use crate::time::iso::{format_utc, push_digits, push_utc};
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

/// A coordinate printed with at most 6 decimals and no trailing zeros.
fn trim_number(x: f64) -> String {
    let s = fixed(x, 6);
    let s = s.trim_end_matches('0').trim_end_matches('.');
    if s == "-0" {
        "0".into()
    } else {
        s.to_string()
    }
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

/// The columns of `predict` CSV output, in order.
pub const PREDICT_COLUMNS: [&str; 11] = [
    "station",
    "contact",
    "time_utc",
    "sun_altitude_deg",
    "sun_azimuth_deg",
    "position_angle_deg",
    "vertex_angle_deg",
    "sensitivity_s_per_arcsec",
    "latitude",
    "longitude",
    "ephemeris",
];

/// How local solar time is written: its kind, and each station's calendar (in the order of
/// the predictions; Gregorian where the slice is shorter).
#[derive(Clone, Copy, Debug)]
pub struct LocalClock<'a> {
    /// Apparent or mean solar time.
    pub kind: LocalTime,
    /// Each station's calendar.
    pub calendars: &'a [Calendar],
}

impl<'a> LocalClock<'a> {
    /// The calendar of the `k`-th prediction.
    fn calendar(&self, k: usize) -> Calendar {
        self.calendars.get(k).copied().unwrap_or_default()
    }

    /// The same clock for the predictions from `start` on (a chunk of the list).
    fn starting_at(self, start: usize) -> LocalClock<'a> {
        LocalClock {
            calendars: self.calendars.get(start..).unwrap_or(&[]),
            ..self
        }
    }
}

/// The local solar-time reading of a contact at a station (civil day reckoning, no zone, as
/// the input column `time_local` takes it), to 0.01 s, its date in `calendar`.
fn local_reading(
    event: &TransitEvent,
    hours: f64,
    longitude_deg: f64,
    (kind, calendar): (LocalTime, Calendar),
) -> Option<String> {
    let local = local_from_label(event.label(hours), kind, longitude_deg, event.time_model())?;
    let mut s = String::with_capacity(24);
    push_utc(&mut s, local, 2);
    s.pop();
    if calendar == Calendar::Julian {
        let (y, m, d) = julian_from_gregorian(local.date())?;
        s.replace_range(..10, &format!("{y:04}-{m:02}-{d:02}"));
    }
    Some(s)
}

/// CSV for station predictions: one row per station and contact. Written field by field into
/// one buffer (for a 1-degree grid of 64,800 stations, `format!` per row took longer than the
/// predictions themselves), large lists in parallel chunks joined in order.
pub fn predictions_csv(
    event: &TransitEvent,
    predictions: &[StationPrediction],
    local: Option<LocalClock>,
) -> String {
    let mut s = String::with_capacity(100 * 4 * predictions.len() + 128);
    let mut columns = PREDICT_COLUMNS.to_vec();
    if local.is_some() {
        columns.insert(3, "time_local");
    }
    let calendars = local.is_some_and(|l| !l.calendars.is_empty());
    if calendars {
        columns.insert(4, "calendar");
    }
    s.push_str(&columns.join(","));
    s.push('\n');
    let ephemeris = csv_field(&event.ephemeris_name());
    let threads = std::thread::available_parallelism().map_or(1, |n| n.get().min(8));
    if threads < 2 || predictions.len() < 4_000 {
        csv_rows(event, (&ephemeris, local), predictions, &mut s);
        return s;
    }
    let chunk = predictions.len().div_ceil(threads);
    let parts: Vec<String> = std::thread::scope(|scope| {
        let handles: Vec<_> = predictions
            .chunks(chunk)
            .enumerate()
            .map(|(k, part)| {
                let ephemeris = &ephemeris;
                let local = local.map(|l| l.starting_at(k * chunk));
                scope.spawn(move || {
                    let mut out = String::with_capacity(100 * 4 * part.len());
                    csv_rows(event, (ephemeris, local), part, &mut out);
                    out
                })
            })
            .collect();
        handles
            .into_iter()
            .map(|h| h.join().unwrap_or_default())
            .collect()
    });
    for part in parts {
        s.push_str(&part);
    }
    s
}

/// The CSV rows of these predictions, appended to `s`.
fn csv_rows(
    event: &TransitEvent,
    (ephemeris, local): (&str, Option<LocalClock>),
    predictions: &[StationPrediction],
    s: &mut String,
) {
    let opt = |s: &mut String, v: Option<f64>, decimals: usize| {
        s.push(',');
        if let Some(x) = v.filter(|x| x.is_finite()) {
            push_fixed(s, x, decimals);
        }
    };
    for (k, p) in predictions.iter().enumerate() {
        let name = csv_field(&p.station.name);
        let place = format!(
            ",{},{},{ephemeris}\n",
            trim_number(p.station.latitude_deg),
            trim_number(p.station.longitude_deg)
        );
        for c in Contact::ALL {
            let cc = p.contacts[c.index()];
            s.push_str(&name);
            s.push(',');
            push_digits(s, u64::from(c.number()), 1);
            s.push(',');
            if let Some(x) = cc {
                push_utc(s, event.label(x.hours), 2);
            }
            if let Some(clock) = local {
                s.push(',');
                let lon = p.station.longitude_deg;
                let how = (clock.kind, clock.calendar(k));
                if let Some(text) = cc.and_then(|x| local_reading(event, x.hours, lon, how)) {
                    s.push_str(&text);
                }
                if !clock.calendars.is_empty() {
                    s.push(',');
                    s.push_str(how.1.name());
                }
            }
            opt(s, cc.map(|x| x.sun_altitude_deg), 3);
            opt(s, cc.map(|x| x.sun_azimuth_deg), 3);
            opt(s, cc.map(|x| x.position_angle_deg), 2);
            opt(s, cc.map(|x| x.vertex_angle_deg), 2);
            opt(s, cc.map(|x| x.sensitivity_s_per_arcsec), 3);
            s.push_str(&place);
        }
    }
}

/// One station and contact of `predict --format json` (keys of the stable interface).
/// Fields in alphabetical order, as every other JSON output writes its keys.
#[derive(serde::Serialize)]
pub struct PredictionRow<'a> {
    contact: u8,
    ephemeris: &'a str,
    position_angle_deg: Option<f64>,
    sensitivity_s_per_arcsec: Option<f64>,
    station: &'a str,
    sun_altitude_deg: Option<f64>,
    sun_azimuth_deg: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    time_local: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    calendar: Option<&'static str>,
    time_utc: Option<String>,
    vertex_angle_deg: Option<f64>,
    visible: Option<bool>,
}

/// JSON for station predictions: one object per station and contact, serialised straight from
/// these rows (a `serde_json::Value` tree per row dominated the command for large grids).
pub fn predictions_json<'a>(
    ephemeris: &'a str,
    event: &TransitEvent,
    predictions: &'a [StationPrediction],
    local: Option<LocalClock>,
) -> Vec<PredictionRow<'a>> {
    let mut rows = Vec::with_capacity(4 * predictions.len());
    for (k, p) in predictions.iter().enumerate() {
        let how = local.map(|l| (l.kind, l.calendar(k)));
        let calendar = local
            .filter(|l| !l.calendars.is_empty())
            .map(|l| l.calendar(k).name());
        for c in Contact::ALL {
            let cc = p.contacts[c.index()];
            rows.push(PredictionRow {
                station: &p.station.name,
                ephemeris,
                contact: c.number(),
                time_utc: cc.map(|x| format_utc(event.label(x.hours), 2)),
                time_local: how.and_then(|how| {
                    cc.and_then(|x| local_reading(event, x.hours, p.station.longitude_deg, how))
                }),
                calendar,
                sun_altitude_deg: cc.map(|x| round(x.sun_altitude_deg, 3)),
                sun_azimuth_deg: cc.map(|x| round(x.sun_azimuth_deg, 3)),
                position_angle_deg: cc.map(|x| round(x.position_angle_deg, 2)),
                vertex_angle_deg: cc.map(|x| round(x.vertex_angle_deg, 2)),
                sensitivity_s_per_arcsec: cc.map(|x| round(x.sensitivity_s_per_arcsec, 3)),
                visible: cc.map(|x| x.sun_altitude_deg > -1.0),
            });
        }
    }
    rows
}

/// Delta T and its uncertainty as printed (`73.0 +- 3.1`), or `66.184, fixed` where it was
/// fixed with `--delta-t` and counts as exact.
fn delta_t_text(ev: &TransitEvent) -> String {
    match ev.delta_t_sigma_s() {
        s if s > 0.0 => format!(
            "{:.1} +- {}",
            ev.elements.delta_t_s,
            crate::words::uncertainty(s)
        ),
        _ => format!("{:.3}, fixed", ev.elements.delta_t_s),
    }
}

/// What the uncertainty of Delta T does to the times printed, in a sentence for the header.
pub fn delta_t_note(event: &TransitEvent) -> String {
    use crate::time::scales::DeltaTSource;
    use chrono::Datelike;
    let source = event.time_model().delta_t_s(event.greatest).1;
    let from = format!("Delta T from {}.", source.describe());
    let text = match source {
        DeltaTSource::Fixed => "Delta T fixed by --delta-t.".to_string(),
        DeltaTSource::LeapSeconds | DeltaTSource::Observed | DeltaTSource::Predicted => format!("{from} Times are UTC; the uncertainty of Delta T hardly moves the contacts."),
        DeltaTSource::Reconstruction if event.date().year() < 1972 => format!("{from} Times are UT1, which is TT - Delta T: an error in Delta T moves every time printed by about as much."),
        DeltaTSource::Reconstruction => format!("{from} Times are UTC."),
        DeltaTSource::Extrapolated => format!("{from} Times are UTC with TAI - UTC held at its last value, so they stay tied to TT: an error in Delta T moves them only through the Earth's rotation under the event (seconds for minutes of Delta T), while the UT1 of each contact, and any leap second still to come, would move by the whole error."),
    };
    format!("{text}\n")
}

/// The table's heading (event, ephemeris, Delta T and the column names) and the width of the
/// local-time column.
fn table_heading(event: &TransitEvent, local: Option<LocalClock>) -> (String, usize) {
    let greatest = event.label(event.hours_of_greatest());
    let mut s = format!(
        "Transit of {} on {} (greatest transit {}, Delta T {} s)\n",
        event.planet.title(),
        event.date(),
        clock_label(greatest, 2),
        delta_t_text(event)
    );
    s.push_str(&format!("Ephemeris: {}.\n", event.ephemeris_name()));
    s.push_str(&delta_t_note(event));
    s.push('\n');
    let local_width = if local.is_some_and(|l| l.calendars.contains(&Calendar::Julian)) {
        26
    } else {
        23
    };
    let local_header = local.map_or(String::new(), |k| {
        format!(" {:>local_width$}", format!("local {} time", k.kind.name()))
    });
    s.push_str(&format!(
        "{} {:>3} {:>26}{local_header} {:>8} {:>8} {:>7} {:>7} {:>9}\n",
        name_cell("station"),
        "",
        format!("time ({})", scale_of(greatest)),
        "Sun alt",
        "Sun az",
        "PA",
        "vertex",
        "s/arcsec"
    ));
    (s, local_width)
}

/// A readable table of station predictions, with the caution.
pub fn predictions_table(
    event: &TransitEvent,
    predictions: &[StationPrediction],
    local: Option<LocalClock>,
) -> String {
    let (mut s, local_width) = table_heading(event, local);
    // Written field by field into one buffer, as `format!` would pad them.
    let mut cell = String::with_capacity(32);
    for (k, p) in predictions.iter().enumerate() {
        let name = name_cell(&p.station.name);
        for c in Contact::ALL {
            s.push_str(&name);
            s.push(' ');
            push_right(&mut s, c.roman(), 3);
            s.push(' ');
            let Some(x) = p.contacts[c.index()] else {
                push_right(&mut s, "no contact here", 26);
                s.push('\n');
                continue;
            };
            push_right(&mut s, &clock_label(event.label(x.hours), 2), 26);
            if let Some(clock) = local {
                s.push(' ');
                let how = (clock.kind, clock.calendar(k));
                let text = local_reading(event, x.hours, p.station.longitude_deg, how).map(|t| {
                    if how.1 == Calendar::Julian {
                        format!("{t} OS")
                    } else {
                        t
                    }
                });
                push_right(&mut s, text.as_deref().unwrap_or("-"), local_width);
            }
            for (v, decimals, width) in [
                (x.sun_altitude_deg, 2, 8),
                (x.sun_azimuth_deg, 2, 8),
                (x.position_angle_deg, 1, 7),
                (x.vertex_angle_deg, 1, 7),
                (x.sensitivity_s_per_arcsec, 2, 9),
            ] {
                s.push(' ');
                cell.clear();
                push_fixed(&mut cell, v, decimals);
                push_right(&mut s, &cell, width);
            }
            if x.sun_altitude_deg < -1.0 {
                s.push_str("  Sun below horizon");
            }
            s.push('\n');
        }
    }
    s.push_str(
        "\nAltitudes are true (no refraction). PA: position angle of the contact point from\n",
    );
    s.push_str(
        "the north point of the Sun's disc through east; vertex: the same from the zenith point.\n",
    );
    s.push_str("s/arcsec: change of the contact time per arcsecond of solar parallax.\n\n");
    s.push_str(SAFETY_CAUTION);
    s.push('\n');
    s
}
