//! Spreadsheets read directly: the first sheet of an `.xlsx`, `.xlsm`, `.xls` or `.ods` file
//! becomes a table as a CSV file would, its row numbers the spreadsheet's own (the header in
//! row 1 is line 1) and its columns counted from A, so that messages point at the cell.
//!
//! Cells are read with the `calamine` crate. Date and time cells become ISO 8601 text: a date
//! with a time as `2012-06-05T22:27:46.5` (no zone: the reading notes say it was read as UTC),
//! a time alone (a serial under one day, or an ISO duration in OpenDocument) as `22:27:46.5`,
//! which the reduction completes with its date. Spreadsheet serial dates count days from
//! 1899-12-30 (1900 system) or 1904-01-01 (ECMA-376 Part 1, §18.17.4.1); OpenDocument stores
//! ISO 8601 text (OASIS OpenDocument 1.2, part 1, §19.385 office:date-value).

use super::csv_table::CsvTable;
use crate::error::{Error, Location, Result};
use calamine::{open_workbook_auto, Data, Reader};

use std::path::Path;

/// Whether a path names a spreadsheet this module reads (by its extension, any case).
pub fn is_spreadsheet(path: &Path) -> bool {
    path.extension()
        .and_then(|e| e.to_str())
        .is_some_and(|e| ["xlsx", "xlsm", "xls", "ods"].contains(&e.to_ascii_lowercase().as_str()))
}

/// The first sheet of a spreadsheet as a table: the first row with any text is the header.
///
/// Errors: the file cannot be opened as a spreadsheet, has no sheet, or no header row.
pub fn read_first_sheet(path: &Path) -> Result<CsvTable> {
    let book = open_workbook_auto(path).map_err(|e| unreadable(path, &e));
    first_sheet(path, book?)
}

/// Whether bytes begin as a spreadsheet does: a ZIP archive (.xlsx, .ods; PKWARE APPNOTE
/// 4.3.7, local file header signature) or an OLE2 compound file (.xls).
pub fn looks_like_spreadsheet(bytes: &[u8]) -> bool {
    bytes.starts_with(b"PK\x03\x04") || bytes.starts_with(&[0xD0, 0xCF, 0x11, 0xE0])
}

/// The first sheet of a spreadsheet held in memory (an upload); `label` names it in messages.
///
/// Errors: as [`read_first_sheet`].
pub fn first_sheet_of_bytes(label: &Path, bytes: &[u8]) -> Result<CsvTable> {
    let cursor = std::io::Cursor::new(bytes.to_vec());
    let book = calamine::open_workbook_auto_from_rs(cursor).map_err(|e| unreadable(label, &e));
    first_sheet(label, book?)
}

fn unreadable(path: &Path, e: &dyn std::fmt::Display) -> Error {
    at_line(
        path,
        format!("the file cannot be read as a spreadsheet ({e})"),
        "save it again as .xlsx or .ods, or export the sheet as CSV",
    )
}

fn at_line(path: &Path, message: String, hint: &str) -> Error {
    Error::Input {
        location: Location {
            file: path.to_path_buf(),
            line: 1,
            column: None,
        },
        message,
        hint: hint.into(),
    }
}

/// The table of a workbook's first sheet.
fn first_sheet<RS: std::io::Read + std::io::Seek>(
    path: &Path,
    mut book: calamine::Sheets<RS>,
) -> Result<CsvTable> {
    let again = "save it again as .xlsx or .ods, or export the sheet as CSV";
    let range = match book.worksheet_range_at(0) {
        Some(Ok(r)) => r,
        Some(Err(e)) => {
            return Err(at_line(
                path,
                format!("its first sheet cannot be read ({e})"),
                again,
            ))
        }
        None => {
            return Err(at_line(
                path,
                "the spreadsheet has no sheet".into(),
                "put the table on its first sheet",
            ))
        }
    };
    let (row0, col0) = range.start().unwrap_or((0, 0));
    let mut rows = range.rows().enumerate().map(|(k, cells)| {
        let mut fields: Vec<String> = vec![String::new(); col0 as usize];
        fields.extend(cells.iter().map(cell_text));
        (u64::from(row0) + k as u64 + 1, fields)
    });
    // Rows above the header (notes) are skipped; lines keep the sheet's own row numbers.
    let Some((_, header)) = rows.find(|(_, f)| f.iter().any(|x| !x.is_empty())) else {
        return Err(at_line(
            path,
            "the first sheet is empty".into(),
            "give a header row and at least one data row",
        ));
    };
    let headers: Vec<String> = header
        .iter()
        .map(|h| h.trim().to_ascii_lowercase())
        .collect();
    let records = rows
        .filter(|(_, f)| {
            f.iter().any(|x| !x.is_empty()) && !f.first().is_some_and(|x| x.starts_with('#'))
        })
        .map(|(line, f)| {
            let mut rec = csv::StringRecord::from(f);
            rec.trim();
            (line, rec)
        })
        .collect();
    Ok(CsvTable {
        path: path.to_path_buf(),
        headers,
        records,
    })
}

/// A cell as the text a CSV file would hold.
fn cell_text(cell: &Data) -> String {
    match cell {
        Data::Empty => String::new(),
        Data::String(s) => s.clone(),
        Data::Int(i) => i.to_string(),
        Data::Float(f) => f.to_string(),
        Data::Bool(b) => b.to_string(),
        Data::DateTime(d) => {
            let serial_days = d.as_f64();
            match d.as_datetime() {
                Some(t) if (0.0..1.0).contains(&serial_days) && !d.is_duration() => {
                    time_text(t.time())
                }
                Some(t) if d.is_duration() => time_text(t.time()),
                Some(t) => format!("{}T{}", t.date(), time_text(t.time())),
                None => serial_days.to_string(),
            }
        }
        Data::DateTimeIso(s) => s.clone(),
        Data::DurationIso(s) => iso_duration_as_time(s).unwrap_or_else(|| s.clone()),
        Data::Error(e) => format!("#{e:?}"),
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
    fn spreadsheets_are_known_by_their_extension() {
        assert!(is_spreadsheet(Path::new("timings.XLSX")));
        assert!(is_spreadsheet(Path::new("a/b.ods")));
        assert!(!is_spreadsheet(Path::new("timings.csv")));
    }
}
