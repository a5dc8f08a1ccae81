//! Rendering of station predictions (`predict`) as a table, CSV and JSON, with the columns and
//! keys of the stable interface: UTC, and where asked local solar time and civil (clock) time.

use crate::geometry::contacts::Contact;
use crate::geometry::transit::{StationPrediction, TransitEvent};
use crate::render::text::{
    clock_label, csv_field, name_cell, push_fixed, push_right, round, scale_of, SAFETY_CAUTION,
};
use crate::sky::solar_time::{local_from_label, LocalTime};
use crate::time::calendar::{julian_from_gregorian, Calendar};
use crate::time::civil::CivilZone;
use crate::time::iso::{format_utc, push_digits, push_utc};

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

/// The clocks a prediction is read on besides UTC, each station's in the order of the
/// predictions: local solar time (apparent or mean) with each station's calendar (Gregorian
/// where the slice is shorter), and each station's civil time zone (none where the slice is
/// shorter or the entry is `None`).
#[derive(Clone, Copy, Debug, Default)]
pub struct Clocks<'a> {
    /// Local solar time, where asked.
    pub solar: Option<LocalTime>,
    /// Each station's calendar.
    pub calendars: &'a [Calendar],
    /// Each station's civil time zone.
    pub zones: &'a [Option<CivilZone>],
}

impl<'a> Clocks<'a> {
    /// The calendar of the `k`-th prediction.
    fn calendar(&self, k: usize) -> Calendar {
        self.calendars.get(k).copied().unwrap_or_default()
    }

    /// The civil zone of the `k`-th prediction.
    fn zone(&self, k: usize) -> Option<&'a CivilZone> {
        self.zones.get(k).and_then(Option::as_ref)
    }

    /// Whether any station has a civil zone (the civil columns are written).
    pub fn civil(&self) -> bool {
        self.zones.iter().any(Option::is_some)
    }

    /// Whether the calendar column is written (solar time asked, calendars given).
    fn calendar_column(&self) -> bool {
        self.solar.is_some() && !self.calendars.is_empty()
    }

    /// The same clocks for the predictions from `start` on (a chunk of the list).
    fn starting_at(self, start: usize) -> Clocks<'a> {
        Clocks {
            calendars: self.calendars.get(start..).unwrap_or(&[]),
            zones: self.zones.get(start..).unwrap_or(&[]),
            ..self
        }
    }
}

/// A coordinate printed with at most 6 decimals and no trailing zeros.
fn trim_number(x: f64) -> String {
    let s = crate::render::text::fixed(x, 6);
    let s = s.trim_end_matches('0').trim_end_matches('.');
    if s == "-0" {
        "0".into()
    } else {
        s.to_string()
    }
}

/// The civil reading of a contact in a zone, ISO 8601 with its offset, to 0.01 s.
fn civil_reading(event: &TransitEvent, hours: f64, zone: &CivilZone) -> String {
    zone.reading(event.label(hours)).iso(2)
}

/// The table's civil-time cell: `2032-11-13 08:19:56.12 +01:00 CET` (the abbreviation where
/// the zone has one in letters).
fn civil_cell(event: &TransitEvent, hours: f64, zone: &CivilZone) -> String {
    let reading = zone.reading(event.label(hours));
    let mut t = reading.iso(2);
    t.replace_range(10..11, " ");
    t.insert(22, ' ');
    if reading
        .abbreviation
        .chars()
        .all(|c| c.is_ascii_alphabetic())
    {
        t.push(' ');
        t.push_str(&reading.abbreviation);
    }
    t
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
    clocks: Clocks,
) -> String {
    let mut s = String::with_capacity(100 * 4 * predictions.len() + 128);
    let mut columns = PREDICT_COLUMNS.to_vec();
    let mut at = 3;
    for (wanted, name) in [
        (clocks.solar.is_some(), "time_local"),
        (clocks.civil(), "time_civil"),
        (clocks.civil(), "time_zone"),
        (clocks.calendar_column(), "calendar"),
    ] {
        if wanted {
            columns.insert(at, name);
            at += 1;
        }
    }
    s.push_str(&columns.join(","));
    s.push('\n');
    let ephemeris = csv_field(&event.ephemeris_name());
    let threads = std::thread::available_parallelism().map_or(1, |n| n.get().min(8));
    if threads < 2 || predictions.len() < 4_000 {
        csv_rows(event, (&ephemeris, clocks), predictions, &mut s);
        return s;
    }
    let chunk = predictions.len().div_ceil(threads);
    let parts: Vec<String> = std::thread::scope(|scope| {
        let handles: Vec<_> = predictions
            .chunks(chunk)
            .enumerate()
            .map(|(k, part)| {
                let ephemeris = &ephemeris;
                let clocks = clocks.starting_at(k * chunk);
                scope.spawn(move || {
                    let mut out = String::with_capacity(100 * 4 * part.len());
                    csv_rows(event, (ephemeris, clocks), part, &mut out);
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
    (ephemeris, clocks): (&str, Clocks),
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
            clock_fields(
                event,
                (cc.map(|x| x.hours), p.station.longitude_deg),
                clocks,
                k,
                s,
            );
            opt(s, cc.map(|x| x.sun_altitude_deg), 3);
            opt(s, cc.map(|x| x.sun_azimuth_deg), 3);
            opt(s, cc.map(|x| x.position_angle_deg), 2);
            opt(s, cc.map(|x| x.vertex_angle_deg), 2);
            opt(s, cc.map(|x| x.sensitivity_s_per_arcsec), 3);
            s.push_str(&place);
        }
    }
}

/// The CSV fields of the clocks besides UTC (time_local, time_civil, time_zone, calendar, as
/// asked), each after a comma, for the `k`-th station's contact at `hours` (none: no contact).
fn clock_fields(
    event: &TransitEvent,
    (hours, longitude_deg): (Option<f64>, f64),
    clocks: Clocks,
    k: usize,
    s: &mut String,
) {
    if let Some(kind) = clocks.solar {
        s.push(',');
        let how = (kind, clocks.calendar(k));
        if let Some(text) = hours.and_then(|h| local_reading(event, h, longitude_deg, how)) {
            s.push_str(&text);
        }
    }
    if clocks.civil() {
        s.push(',');
        let zone = clocks.zone(k);
        if let (Some(h), Some(z)) = (hours, zone) {
            s.push_str(&civil_reading(event, h, z));
        }
        s.push(',');
        if let Some(z) = zone {
            s.push_str(&csv_field(&z.name()));
        }
    }
    if clocks.calendar_column() {
        s.push(',');
        s.push_str(clocks.calendar(k).name());
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
    /// Present (null where there is no civil time) whenever any station has a zone.
    #[serde(skip_serializing_if = "Option::is_none")]
    time_civil: Option<Option<String>>,
    #[serde(skip_serializing_if = "Option::is_none")]
    time_local: Option<String>,
    #[serde(skip_serializing_if = "Option::is_none")]
    calendar: Option<&'static str>,
    time_utc: Option<String>,
    /// Present (null for a station without a zone) whenever any station has a zone.
    #[serde(skip_serializing_if = "Option::is_none")]
    time_zone: Option<Option<String>>,
    vertex_angle_deg: Option<f64>,
    visible: Option<bool>,
}

/// JSON for station predictions: one object per station and contact, serialised straight from
/// these rows (a `serde_json::Value` tree per row dominated the command for large grids).
pub fn predictions_json<'a>(
    ephemeris: &'a str,
    event: &TransitEvent,
    predictions: &'a [StationPrediction],
    clocks: Clocks,
) -> Vec<PredictionRow<'a>> {
    let mut rows = Vec::with_capacity(4 * predictions.len());
    let civil = clocks.civil();
    for (k, p) in predictions.iter().enumerate() {
        let how = clocks.solar.map(|kind| (kind, clocks.calendar(k)));
        let calendar = Some(clocks.calendar(k).name()).filter(|_| clocks.calendar_column());
        let zone = clocks.zone(k);
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
                time_civil: civil
                    .then(|| zone.and_then(|z| cc.map(|x| civil_reading(event, x.hours, z)))),
                time_zone: civil.then(|| zone.map(|z| z.name())),
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
pub(crate) fn delta_t_text(ev: &TransitEvent) -> String {
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

/// Width of the table's civil-time column (`2032-11-13 08:19:56.12 +00:19:32 LMT`).
const CIVIL_WIDTH: usize = 37;

/// The heading's sentence naming each station's civil zone: `Civil time: Europe/Amsterdam
/// for A, B; +05:30 for C.`, stations without a zone named too.
fn zones_note(predictions: &[StationPrediction], clocks: Clocks) -> String {
    let mut groups: Vec<(String, Vec<&str>)> = Vec::new();
    for (k, p) in predictions.iter().enumerate() {
        let zone = clocks.zone(k).map_or(
            "no zone given (add one in a time_zone column)".to_string(),
            |z| z.name(),
        );
        match groups.iter_mut().find(|(z, _)| *z == zone) {
            Some((_, names)) => names.push(&p.station.name),
            None => groups.push((zone, vec![&p.station.name])),
        }
    }
    if let [(zone, _)] = groups.as_slice() {
        return format!("Civil time: {zone} for every station.\n");
    }
    let parts: Vec<String> = groups
        .iter()
        .map(|(zone, names)| format!("{zone} for {}", names.join(", ")))
        .collect();
    let sentence = format!("Civil time: {}.", parts.join("; "));
    let mut out = textwrap::fill(&sentence, 100);
    out.push('\n');
    out
}

/// The table's heading (event, ephemeris, Delta T and the column names) and the width of the
/// local-time column.
fn table_heading(
    event: &TransitEvent,
    predictions: &[StationPrediction],
    clocks: Clocks,
) -> (String, usize) {
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
    if clocks.civil() {
        s.push_str(&zones_note(predictions, clocks));
    }
    s.push('\n');
    let local_width = if clocks.solar.is_some() && clocks.calendars.contains(&Calendar::Julian) {
        26
    } else {
        23
    };
    let mut local_header = clocks.solar.map_or(String::new(), |kind| {
        format!(" {:>local_width$}", format!("local {} time", kind.name()))
    });
    if clocks.civil() {
        local_header.push_str(&format!(" {:>CIVIL_WIDTH$}", "civil time"));
    }
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
    clocks: Clocks,
) -> String {
    let (mut s, local_width) = table_heading(event, predictions, clocks);
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
            if let Some(kind) = clocks.solar {
                s.push(' ');
                let how = (kind, clocks.calendar(k));
                let text = local_reading(event, x.hours, p.station.longitude_deg, how).map(|t| {
                    if how.1 == Calendar::Julian {
                        format!("{t} OS")
                    } else {
                        t
                    }
                });
                push_right(&mut s, text.as_deref().unwrap_or("-"), local_width);
            }
            if clocks.civil() {
                s.push(' ');
                let text = clocks.zone(k).map(|z| civil_cell(event, x.hours, z));
                push_right(
                    &mut s,
                    text.as_deref().unwrap_or("no zone given"),
                    CIVIL_WIDTH,
                );
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
