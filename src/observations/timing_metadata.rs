//! How a timing was made: the clock it was read from (`clock_source`), the instrument and its
//! aperture (`instrument`, `aperture_mm`), how the Sun was viewed (`viewing`) and the
//! observer's `notes`. None of these enters the fit; they let the residuals be grouped
//! afterwards (`reduction::residual_groups`), where a bad clock or a small instrument's black
//! drop shows as a group's offset.
//!
//! Every column is optional and every cell may be empty; a value that is given is checked:
//! `clock_source` one of `gps`, `radio`, `network`, `phone`, `other`; `viewing` one of
//! `filter`, `projection` (any case); `aperture_mm` a positive number of millimetres (at most
//! [`MAX_APERTURE_MM`]).

use super::csv_table::CsvTable;
use super::rows::RowError;
use serde::Serialize;

/// The largest aperture read, millimetres (more is taken as a slip of the unit).
pub const MAX_APERTURE_MM: f64 = 10_000.0;

/// Where the time of a timing came from.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum ClockSource {
    /// A satellite navigation receiver's time.
    Gps,
    /// A radio time signal.
    Radio,
    /// A computer kept to network time.
    Network,
    /// A mobile phone's clock.
    Phone,
    /// Anything else (a watch set by hand).
    Other,
}

impl ClockSource {
    /// Every source, in the order of outputs.
    pub const ALL: [ClockSource; 5] = [
        ClockSource::Gps,
        ClockSource::Radio,
        ClockSource::Network,
        ClockSource::Phone,
        ClockSource::Other,
    ];

    /// The word written in files: `gps`, `radio`, `network`, `phone`, `other`.
    pub fn name(self) -> &'static str {
        match self {
            ClockSource::Gps => "gps",
            ClockSource::Radio => "radio",
            ClockSource::Network => "network",
            ClockSource::Phone => "phone",
            ClockSource::Other => "other",
        }
    }

    /// The word read back (any case, spaces around ignored); `None` for an unknown word.
    pub fn from_name(text: &str) -> Option<ClockSource> {
        let t = text.trim();
        Self::ALL
            .into_iter()
            .find(|c| c.name().eq_ignore_ascii_case(t))
    }
}

/// How the Sun was looked at.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Viewing {
    /// Through a solar filter over the front of the instrument.
    Filter,
    /// The image projected onto a screen.
    Projection,
}

impl Viewing {
    /// Every way, in the order of outputs.
    pub const ALL: [Viewing; 2] = [Viewing::Filter, Viewing::Projection];

    /// `filter` or `projection`.
    pub fn name(self) -> &'static str {
        match self {
            Viewing::Filter => "filter",
            Viewing::Projection => "projection",
        }
    }

    /// The word read back (any case); `None` for an unknown word.
    pub fn from_name(text: &str) -> Option<Viewing> {
        let t = text.trim();
        Self::ALL
            .into_iter()
            .find(|v| v.name().eq_ignore_ascii_case(t))
    }
}

/// How one timing was made; every field empty where the file does not say.
#[derive(Clone, Debug, Default, PartialEq, Serialize)]
pub struct TimingMetadata {
    /// The clock the time was read from.
    pub clock_source: Option<ClockSource>,
    /// The instrument (free text).
    pub instrument: String,
    /// The instrument's aperture, millimetres.
    pub aperture_mm: Option<f64>,
    /// How the Sun was viewed.
    pub viewing: Option<Viewing>,
    /// The observer's notes (free text).
    pub notes: String,
}

/// The columns of the metadata in a table (each optional).
#[derive(Clone, Copy, Debug, Default)]
pub struct MetadataColumns {
    /// `clock_source`.
    pub clock_source: Option<usize>,
    /// `instrument`.
    pub instrument: Option<usize>,
    /// `aperture_mm`.
    pub aperture_mm: Option<usize>,
    /// `viewing`.
    pub viewing: Option<usize>,
    /// `notes`.
    pub notes: Option<usize>,
}

impl MetadataColumns {
    /// Find the columns by header name.
    pub fn find(table: &CsvTable) -> MetadataColumns {
        MetadataColumns {
            clock_source: table.optional("clock_source"),
            instrument: table.optional("instrument"),
            aperture_mm: table.optional("aperture_mm"),
            viewing: table.optional("viewing"),
            notes: table.optional("notes"),
        }
    }
}

/// The list of words allowed, for messages: `gps, radio, network, phone or other`.
fn allowed(names: &[&str]) -> String {
    match names.split_last() {
        Some((last, rest)) if !rest.is_empty() => format!("{} or {last}", rest.join(", ")),
        Some((last, _)) => (*last).to_string(),
        None => String::new(),
    }
}

/// A clock source as written (empty: not given).
///
/// Errors: a sentence naming the column and the allowed values.
pub fn parse_clock_source(text: &str) -> Result<Option<ClockSource>, String> {
    let t = text.trim();
    if t.is_empty() {
        return Ok(None);
    }
    ClockSource::from_name(t).map(Some).ok_or_else(|| {
        let names: Vec<&str> = ClockSource::ALL.iter().map(|c| c.name()).collect();
        format!(
            "clock_source '{t}' is not a clock source; write {} (or leave it empty)",
            allowed(&names)
        )
    })
}

/// A way of viewing as written (empty: not given).
///
/// Errors: a sentence naming the column and the allowed values.
pub fn parse_viewing(text: &str) -> Result<Option<Viewing>, String> {
    let t = text.trim();
    if t.is_empty() {
        return Ok(None);
    }
    Viewing::from_name(t).map(Some).ok_or_else(|| {
        format!("viewing '{t}' is not a way of viewing the Sun; write filter (a solar filter over the front of the instrument) or projection (or leave it empty)")
    })
}

/// An aperture as written, millimetres (empty: not given).
///
/// Errors: a sentence naming the column when it is not a positive number of millimetres.
pub fn parse_aperture_mm(text: &str) -> Result<Option<f64>, String> {
    let t = text.trim();
    if t.is_empty() {
        return Ok(None);
    }
    match t.parse::<f64>() {
        Ok(v) if v.is_finite() && v > 0.0 && v <= MAX_APERTURE_MM => Ok(Some(v)),
        _ => Err(format!(
            "aperture_mm '{t}' is not an aperture; write the instrument's aperture as a positive number of millimetres (at most {MAX_APERTURE_MM:.0}), e.g. 80"
        )),
    }
}

/// The metadata of one row.
///
/// Errors: the sentence and the column at fault.
pub fn parse_metadata(
    table: &CsvTable,
    rec: &csv::StringRecord,
    cols: &MetadataColumns,
) -> Result<TimingMetadata, RowError> {
    let text = |c: Option<usize>| c.map_or("", |c| table.text(rec, c));
    Ok(TimingMetadata {
        clock_source: parse_clock_source(text(cols.clock_source))
            .map_err(|m| (m, cols.clock_source))?,
        instrument: text(cols.instrument).trim().to_string(),
        aperture_mm: parse_aperture_mm(text(cols.aperture_mm))
            .map_err(|m| (m, cols.aperture_mm))?,
        viewing: parse_viewing(text(cols.viewing)).map_err(|m| (m, cols.viewing))?,
        notes: text(cols.notes).trim().to_string(),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn clock_sources_and_viewing_are_read_in_any_case_and_empty_is_not_given() {
        assert_eq!(parse_clock_source(" GPS ").unwrap(), Some(ClockSource::Gps));
        assert_eq!(
            parse_clock_source("phone").unwrap(),
            Some(ClockSource::Phone)
        );
        assert_eq!(parse_clock_source("").unwrap(), None);
        assert_eq!(
            parse_viewing("Projection").unwrap(),
            Some(Viewing::Projection)
        );
        assert_eq!(parse_viewing("  ").unwrap(), None);
        for c in ClockSource::ALL {
            assert_eq!(ClockSource::from_name(c.name()), Some(c));
        }
    }

    #[test]
    fn unknown_words_name_the_column_and_the_allowed_values() {
        let e = parse_clock_source("sundial").unwrap_err();
        assert!(e.contains("clock_source 'sundial'"), "{e}");
        assert!(e.contains("gps, radio, network, phone or other"), "{e}");
        let e = parse_viewing("naked eye").unwrap_err();
        assert!(
            e.contains("viewing 'naked eye'") && e.contains("filter"),
            "{e}"
        );
        assert!(e.contains("projection"), "{e}");
    }

    #[test]
    fn apertures_are_positive_millimetres() {
        assert_eq!(parse_aperture_mm("80").unwrap(), Some(80.0));
        assert_eq!(parse_aperture_mm(" 60.5 ").unwrap(), Some(60.5));
        assert_eq!(parse_aperture_mm("").unwrap(), None);
        for bad in ["0", "-50", "NaN", "inf", "eighty", "1e9"] {
            let e = parse_aperture_mm(bad).unwrap_err();
            assert!(
                e.contains("aperture_mm") && e.contains("positive"),
                "{bad}: {e}"
            );
        }
    }

    #[test]
    fn a_row_reports_the_column_at_fault() {
        let text = b"station,clock_source,aperture_mm,viewing,instrument,notes\nA,radio,80,filter,refractor , clouds\nB,sundial,80,,,\nC,gps,-1,,,\nD,,,eyes,,\n";
        let table = CsvTable::from_bytes(std::path::Path::new("t.csv"), text).unwrap();
        let cols = MetadataColumns::find(&table);
        let rows: Vec<_> = table
            .records
            .iter()
            .map(|(_, r)| parse_metadata(&table, r, &cols))
            .collect();
        let a = rows[0].as_ref().unwrap();
        assert_eq!(a.clock_source, Some(ClockSource::Radio));
        assert_eq!(a.aperture_mm, Some(80.0));
        assert_eq!(a.viewing, Some(Viewing::Filter));
        assert_eq!(
            (a.instrument.as_str(), a.notes.as_str()),
            ("refractor", "clouds")
        );
        assert_eq!(rows[1].as_ref().unwrap_err().1, cols.clock_source);
        assert_eq!(rows[2].as_ref().unwrap_err().1, cols.aperture_mm);
        assert_eq!(rows[3].as_ref().unwrap_err().1, cols.viewing);
    }
}
