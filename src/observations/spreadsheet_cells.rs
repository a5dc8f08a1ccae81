//! One spreadsheet cell as the text a CSV file would hold, with what kind of cell it was, so
//! that a typed note (`# ...`) can be told from a formula's error (`#N/A`).
//!
//! Date and time cells become ISO 8601 text: a date with a time as `2012-06-05T22:27:46.5` (no
//! zone: the reading notes say it was read as UTC), a time alone (a serial under one day, or an
//! ISO duration in OpenDocument) as `22:27:46.5`, which the reduction completes with its date.
//! Spreadsheet serial dates count days from 1899-12-30 (1900 system) or 1904-01-01 (ECMA-376
//! Part 1, §18.17.4.1); OpenDocument stores ISO 8601 text (OASIS OpenDocument 1.2, part 1,
//! §19.385 office:date-value).

use calamine::Data;

/// What a cell held, as far as reading a table cares.
#[derive(Debug, Clone, PartialEq)]
pub enum CellKind {
    /// Nothing.
    Empty,
    /// Typed text (a note when it begins with `#`).
    Text,
    /// A number, date, time or truth value.
    Value,
    /// A formula's error, named as the spreadsheet shows it (`#N/A`, `#DIV/0!`).
    Error(String),
}

/// A cell's text and kind.
#[derive(Debug, Clone, PartialEq)]
pub struct CellText {
    /// The text a CSV file would hold (empty for an error cell).
    pub text: String,
    /// What the cell held.
    pub kind: CellKind,
}

impl CellText {
    /// Whether the cell holds a note: typed text beginning with `#`.
    pub fn is_note(&self) -> bool {
        self.kind == CellKind::Text && self.text.trim_start().starts_with('#')
    }

    /// Whether the cell holds nothing.
    pub fn is_empty(&self) -> bool {
        !matches!(self.kind, CellKind::Error(_)) && self.text.trim().is_empty()
    }
}

/// A cell as text and kind.
pub fn cell_text(cell: &Data) -> CellText {
    let (text, kind) = match cell {
        Data::Empty => (String::new(), CellKind::Empty),
        Data::String(s) => (s.clone(), CellKind::Text),
        Data::Int(i) => (i.to_string(), CellKind::Value),
        Data::Float(f) => (f.to_string(), CellKind::Value),
        Data::Bool(b) => (b.to_string(), CellKind::Value),
        Data::DateTime(d) => (date_time_text(d), CellKind::Value),
        Data::DateTimeIso(s) => (s.clone(), CellKind::Value),
        Data::DurationIso(s) => (
            iso_duration_as_time(s).unwrap_or_else(|| s.clone()),
            CellKind::Value,
        ),
        Data::Error(e) => (String::new(), CellKind::Error(e.to_string())),
    };
    CellText { text, kind }
}

/// A spreadsheet date-time serial as ISO 8601 text (a time of day alone under one day).
fn date_time_text(d: &calamine::ExcelDateTime) -> String {
    let serial_days = d.as_f64();
    match d.as_datetime() {
        Some(t) if (0.0..1.0).contains(&serial_days) && !d.is_duration() => time_text(t.time()),
        Some(t) if d.is_duration() => time_text(t.time()),
        Some(t) => format!("{}T{}", t.date(), time_text(t.time())),
        None => serial_days.to_string(),
    }
}
/// A time of day to the millisecond, trailing zeros of the fraction dropped (`22:27:46.5`).
fn time_text(t: chrono::NaiveTime) -> String {
    use chrono::Timelike;
    // Serial days carry binary rounding: round to the millisecond.
    let ms_total = (u64::from(t.num_seconds_from_midnight()) * 1000
        + u64::from(t.nanosecond()) / 1_000_000
        + u64::from(t.nanosecond() % 1_000_000 >= 500_000))
        % 86_400_000;
    let (s, ms) = (ms_total / 1000, ms_total % 1000);
    let mut out = format!("{:02}:{:02}:{:02}", s / 3600, s / 60 % 60, s % 60);
    if ms > 0 {
        let frac = format!("{ms:03}");
        out.push('.');
        out.push_str(frac.trim_end_matches('0'));
    }
    out
}

/// An OpenDocument time cell (`PT22H27M46.5S`, ISO 8601 duration since midnight) as a time
/// of day, if it is one (under 24 hours).
fn iso_duration_as_time(text: &str) -> Option<String> {
    let (value_s, _) = crate::observations::readings::parse_one_duration(text)?;
    if !(0.0..86_400.0).contains(&value_s) {
        return None;
    }
    let whole_ms = (value_s * 1000.0).round() as i64;
    let t = chrono::NaiveTime::from_num_seconds_from_midnight_opt(
        u32::try_from(whole_ms / 1000).ok()?,
        u32::try_from(whole_ms % 1000).ok()? * 1_000_000,
    )?;
    Some(time_text(t))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn times_are_written_to_the_millisecond() {
        let t = chrono::NaiveTime::from_hms_nano_opt(22, 27, 46, 499_999_600).expect("time");
        assert_eq!(time_text(t), "22:27:46.5");
        let t = chrono::NaiveTime::from_hms_opt(4, 26, 38).expect("time");
        assert_eq!(time_text(t), "04:26:38");
        assert_eq!(
            iso_duration_as_time("PT22H27M46.5S").as_deref(),
            Some("22:27:46.5")
        );
        assert_eq!(iso_duration_as_time("PT25H").as_deref(), None);
    }

    #[test]
    fn an_error_cell_is_named_and_never_a_note() {
        let c = cell_text(&Data::Error(calamine::CellErrorType::NA));
        assert_eq!(c.kind, CellKind::Error("#N/A".into()));
        assert!(!c.is_note());
        assert!(!c.is_empty());
        assert!(cell_text(&Data::String("# a note".into())).is_note());
        assert!(cell_text(&Data::Empty).is_empty());
    }
}
