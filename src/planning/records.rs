//! A campaign written out as the observations file a reduction reads, in the forms its rows
//! were recorded in: UTC times, or clock readings in local solar time (to another meridian,
//! as ranges, dated Old Style), longitudes from Paris or in hours of time, observers, timed
//! intervals and judged contacts. Used by the demonstrations, the tests and the service's
//! simulated campaigns; `observations::timings` reads every form back.

use crate::observations::angles::{
    format_hours_of_time, format_sexagesimal, Axis, Meridian, PARIS_EAST_OF_GREENWICH_DEG,
};
use crate::observations::contact_forms::ContactJudged;
use crate::observations::longitude::LongitudeKnowledge;
use crate::observations::timings::{Observation, ObservationSet};
use crate::time::calendar::{julian_from_gregorian, Calendar};
use crate::time::iso::format_utc;
use chrono::{NaiveDate, NaiveDateTime};

/// A date as written in a calendar.
fn date_text(date: NaiveDate, calendar: Calendar) -> String {
    match (calendar, julian_from_gregorian(date)) {
        (Calendar::Julian, Some((y, m, d))) => format!("{y:04}-{m:02}-{d:02}"),
        _ => date.format("%Y-%m-%d").to_string(),
    }
}

/// A reading with no zone, to 0.1 s, its date in a calendar.
fn reading_text(t: NaiveDateTime, calendar: Calendar) -> String {
    let mut s = format_utc(t, 1);
    s.pop();
    format!("{}{}", date_text(t.date(), calendar), &s[10..])
}

/// A reading, or a range of `width_s` about it (`START/END`, END as a time where the date is
/// the same).
fn reading_or_range(t: NaiveDateTime, width_s: Option<f64>, calendar: Calendar) -> String {
    let Some(w) = width_s else {
        return reading_text(t, calendar);
    };
    let half = chrono::TimeDelta::nanoseconds((w * 0.5e9).round() as i64);
    let (start, end) = (
        reading_text(t - half, calendar),
        reading_text(t + half, calendar),
    );
    if start[..10] == end[..10] {
        format!("{start}/{}", &end[11..])
    } else {
        format!("{start}/{end}")
    }
}

/// The sigma a row writes: the timing's own, without the variance of a range that the row
/// writes beside it (a reader adds that back, width^2 / 12).
fn sigma_as_written(o: &Observation) -> f64 {
    let range_var = o.written.range_s.map_or(0.0, |w| w * w / 12.0);
    (o.sigma_s * o.sigma_s - range_var)
        .max(0.0)
        .sqrt()
        .max(0.01)
}

/// A duration as `H:MM:SS.s`.
fn duration_text(seconds: f64) -> String {
    let tenths = (seconds * 10.0).round() as u64;
    let (s, t) = (tenths / 10, tenths % 10);
    format!("{}:{:02}:{:02}.{t}", s / 3600, s / 60 % 60, s % 60)
}

/// The station's coordinates as the row wrote them: latitude, and longitude counted from its
/// meridian (sexagesimal from Paris, or in hours of time where so recorded).
fn coordinates(o: &Observation) -> (String, String, String) {
    let st = &o.station;
    let lon = crate::geometry::station::normalise_longitude_deg(
        st.longitude_deg - o.written.meridian.east_of_greenwich_deg(),
    );
    let meridian = match o.written.meridian {
        Meridian::Paris => "paris".to_string(),
        Meridian::Ferro => "ferro".to_string(),
        Meridian::EastOfGreenwich(d) => format!("{d:.7}"),
        Meridian::Greenwich => String::new(),
    };
    if o.written.meridian != Meridian::Greenwich || o.written.longitude_in_time {
        let lon_text = if o.written.longitude_in_time {
            format_hours_of_time(lon)
        } else {
            format_sexagesimal(lon, Axis::Longitude)
        };
        return (
            format_sexagesimal(st.latitude_deg, Axis::Latitude),
            lon_text,
            meridian,
        );
    }
    (
        format!("{:.4}", st.latitude_deg),
        format!("{lon:.4}"),
        meridian,
    )
}

/// The meridian a clock was kept to, counted as the row counts longitudes.
fn clock_meridian(o: &Observation) -> String {
    match o.local.and_then(|l| l.meridian_deg) {
        None => String::new(),
        Some(0.0) => "greenwich".into(),
        Some(m) if (m - PARIS_EAST_OF_GREENWICH_DEG).abs() < 1e-9 => "paris".into(),
        Some(m) => format!("{:.4}", m - o.written.meridian.east_of_greenwich_deg()),
    }
}

/// Whether a campaign needs the columns of records as the 18th and 19th centuries wrote them.
fn needs_record_columns(set: &ObservationSet) -> bool {
    set.valid.iter().any(|o| {
        !o.observer.is_empty()
            || o.duration.is_some()
            || o.judged != ContactJudged::Geometric
            || o.written.calendar != Calendar::Gregorian
            || o.written.meridian != Meridian::Greenwich
            || o.written.longitude_in_time
    })
}

/// The observations file of a campaign (every valid row; the header names the columns used).
pub fn campaign_csv(set: &ObservationSet) -> String {
    let historical = set
        .valid
        .iter()
        .any(|o| o.local.is_some() || o.longitude != LongitudeKnowledge::Exact);
    let records = needs_record_columns(set);
    let mut s = String::from("station,latitude,longitude,elevation_m,contact,time_utc,sigma_s");
    if historical || records {
        s.push_str(",time_local,local_time,day_reckoning,longitude_sigma_deg");
    }
    if records {
        s.push_str(",observer,calendar,meridian,time_meridian,duration,contact_judged");
    }
    s.push('\n');
    for o in &set.valid {
        s.push_str(&row(o, historical || records, records));
        s.push('\n');
    }
    s
}

/// One row of [`campaign_csv`].
fn row(o: &Observation, historical: bool, records: bool) -> String {
    let calendar = o.written.calendar;
    let utc = match (o.local, o.duration) {
        (None, None) => format_utc(o.time_label, 1),
        _ => String::new(),
    };
    let (lat, lon, meridian) = if records {
        coordinates(o)
    } else {
        (
            format!("{:.4}", o.station.latitude_deg),
            format!("{:.4}", o.station.longitude_deg),
            String::new(),
        )
    };
    let field = crate::render::text::csv_field;
    let mut s = format!(
        "{},{},{},{:.0},{},{utc},{}",
        field(&o.station.name),
        field(&lat),
        field(&lon),
        o.station.elevation_m,
        o.contact_label(),
        (sigma_as_written(o) * 100.0).round() / 100.0
    );
    if !historical {
        return s;
    }
    let (reading, kind, reckoning) = match (&o.local, &o.duration) {
        (Some(l), _) => (
            reading_or_range(l.reading, l.written.range_s, calendar),
            l.kind.name(),
            l.reckoning.name(),
        ),
        (None, Some(d)) => (
            d.date.map(|x| date_text(x, calendar)).unwrap_or_default(),
            d.kept_to.map_or("", |k| k.name()),
            "",
        ),
        _ => (String::new(), "", ""),
    };
    let knowledge = match o.longitude {
        LongitudeKnowledge::Exact => String::new(),
        LongitudeKnowledge::Sigma(x) => format!("{x}"),
        LongitudeKnowledge::Unknown => "unknown".into(),
    };
    s.push_str(&format!(",{reading},{kind},{reckoning},{knowledge}"));
    if records {
        let written_calendar = if calendar == Calendar::Julian {
            "julian"
        } else {
            ""
        };
        let judged = match o.judged {
            ContactJudged::Geometric => "",
            j => j.name(),
        };
        s.push_str(&format!(
            ",{},{written_calendar},{meridian},{},{},{judged}",
            crate::render::text::csv_field(&o.observer),
            clock_meridian(o),
            o.duration
                .map(|d| duration_text(d.seconds))
                .unwrap_or_default(),
        ));
    }
    s
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::observations::csv_table::CsvTable;
    use crate::observations::timings::observations_from_table;
    use std::path::Path;

    fn read(text: &str) -> ObservationSet {
        let t = CsvTable::from_bytes(Path::new("t.csv"), text.as_bytes()).unwrap();
        observations_from_table(&t, true).unwrap()
    }

    /// Found in review: a meridian given as a number was written back as Greenwich, and a
    /// range's variance, already in the sigma read, was added again on reading the copy.
    #[test]
    fn a_written_campaign_reads_back_as_it_was_read() {
        let first = read(
            "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s,time_local,local_time,meridian\n\
             a,60,10,0,2,,5,1769-06-03T20:10:00/20:10:06,mean,12.5\n\
             b,-20,-150,0,3,1769-06-04T03:40:00Z,8,,,\n",
        );
        let again = read(&campaign_csv(&first));
        assert_eq!(again.valid.len(), 2);
        for (x, y) in first.valid.iter().zip(&again.valid) {
            assert!((x.station.longitude_deg - y.station.longitude_deg).abs() < 1e-6);
            assert_eq!(x.written.meridian, y.written.meridian);
            assert!(
                (x.sigma_s - y.sigma_s).abs() < 0.01,
                "{} {}",
                x.sigma_s,
                y.sigma_s
            );
            assert_eq!(x.time_label, y.time_label);
        }
        assert!((first.valid[0].sigma_s - 5f64.hypot(6.0 / 12f64.sqrt())).abs() < 1e-9);
    }
}
