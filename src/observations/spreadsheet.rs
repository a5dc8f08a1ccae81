//! Spreadsheets read directly: the first sheet of an `.xlsx` or `.ods` file becomes a table as
//! a CSV file would, its row numbers the spreadsheet's own (the header in row 1 is line 1) and
//! its columns counted from A, so that messages point at the cell. Notes typed above the
//! header or between rows (a first cell beginning with `#`) are left out; a formula's error
//! (`#N/A`) is never a note: the rows holding one are listed for the user to fix.
//!
//! Cells are read with the `calamine` crate: an `.xlsx` sheet cell by cell as it streams, an
//! `.ods` sheet after its size has been checked ([`super::sheet_extent`]), so that a sheet
//! that declares a million rows or a stray cell far away never fills the memory.

use super::csv_table::CsvTable;
use super::sheet_extent::{self, MAX_CELLS, MAX_UNCOMPRESSED_BYTES};
use super::spreadsheet_cells::{cell_text, CellKind, CellText};
use crate::error::{Error, Location, Result};
use calamine::Reader;
use std::collections::BTreeMap;
use std::io::Cursor;
use std::path::Path;

/// Whether bytes begin as a spreadsheet does: a ZIP archive (.xlsx, .ods; PKWARE APPNOTE
/// 4.3.7, local file header signature) or an OLE2 compound file (.xls).
pub fn looks_like_spreadsheet(bytes: &[u8]) -> bool {
    bytes.starts_with(b"PK\x03\x04") || bytes.starts_with(&[0xD0, 0xCF, 0x11, 0xE0])
}

/// The first sheet of a spreadsheet file as a table: the first row holding anything but a
/// note is the header.
///
/// Errors: as [`first_sheet_of_bytes`], or the file cannot be read.
pub fn read_first_sheet(path: &Path) -> Result<CsvTable> {
    let bytes = std::fs::read(path).map_err(|source| Error::Io {
        path: path.to_path_buf(),
        source,
    })?;
    first_sheet_of_bytes(path, &bytes)
}

/// The first sheet of a spreadsheet held in memory; `label` names it in messages.
///
/// Errors: not an `.xlsx` or `.ods` workbook (an `.xls` file is asked to be saved again); a
/// sheet too large to expand; no sheet or no header; [`Error::BadRows`] listing the cells that
/// hold a formula's error.
pub fn first_sheet_of_bytes(label: &Path, bytes: &[u8]) -> Result<CsvTable> {
    if bytes.starts_with(b"PK") {
        let declared =
            sheet_extent::declared_uncompressed_bytes(bytes).map_err(|e| unreadable(label, &e))?;
        if declared > MAX_UNCOMPRESSED_BYTES {
            return Err(too_large(
                label,
                &format!("it unpacks to {} MB", declared / 1_000_000),
            ));
        }
    }
    // Each reader is chosen by content and opened only after the checks: an `.xls` or
    // `.ods` reader expands every sheet as it opens.
    let cells = if !bytes.starts_with(b"PK") || sheet_extent::is_binary_workbook(bytes) {
        return Err(at_line(
            label,
            "this is an older or binary Excel workbook (.xls or .xlsb), which is not read".into(),
            "save it as .xlsx or .ods (or export the sheet as CSV) and give that file",
        ));
    } else if sheet_extent::is_open_document(bytes) {
        ods_cells(label, bytes)?
    } else {
        let mut book: calamine::Xlsx<_> = calamine::open_workbook_from_rs(Cursor::new(bytes))
            .map_err(|e| unreadable(label, &e))?;
        xlsx_cells(label, &mut book)?
    };
    table_of(label, cells)
}

/// The cells of a sheet holding anything, by row and column (both from 0).
type SheetCells = BTreeMap<u32, Vec<(u32, CellText)>>;

/// The cells of an `.xlsx` workbook's first sheet, streamed, stopping past [`MAX_CELLS`].
fn xlsx_cells(label: &Path, book: &mut calamine::Xlsx<Cursor<&[u8]>>) -> Result<SheetCells> {
    let Some(name) = book.sheet_names().first().cloned() else {
        return Err(no_sheet(label));
    };
    let mut reader = book
        .worksheet_cells_reader(&name)
        .map_err(|e| unreadable(label, &e))?;
    let mut cells = SheetCells::new();
    let mut count = 0u64;
    while let Some(cell) = reader.next_cell().map_err(|e| unreadable(label, &e))? {
        let (row, col) = cell.get_position();
        let text = cell_text(&cell.get_value().clone().into());
        if text.is_empty() {
            continue;
        }
        count += 1;
        if count > MAX_CELLS {
            return Err(too_large(
                label,
                "its first sheet holds more cells than that",
            ));
        }
        cells.entry(row).or_default().push((col, text));
    }
    Ok(cells)
}

/// The cells of an `.ods` workbook's first sheet, once its sheets are known to be safe to
/// expand.
fn ods_cells(label: &Path, bytes: &[u8]) -> Result<SheetCells> {
    let spanned = sheet_extent::ods_cells_spanned(bytes).map_err(|e| unreadable(label, &e))?;
    if spanned > MAX_CELLS {
        return Err(too_large(
            label,
            &format!("its sheets span {spanned} cells once their repeated rows are expanded"),
        ));
    }
    let mut book: calamine::Ods<_> =
        calamine::open_workbook_from_rs(Cursor::new(bytes)).map_err(|e| unreadable(label, &e))?;
    let range = match book.worksheet_range_at(0) {
        Some(r) => r.map_err(|e| unreadable(label, &e))?,
        None => return Err(no_sheet(label)),
    };
    let mut cells = SheetCells::new();
    for (row, col, value) in range.used_cells() {
        let text = cell_text(value);
        if !text.is_empty() {
            let (row, col) = (row as u32, col as u32);
            let (row0, col0) = range.start().unwrap_or((0, 0));
            cells
                .entry(row0 + row)
                .or_default()
                .push((col0 + col, text));
        }
    }
    Ok(cells)
}

/// The table of a sheet's cells: notes left out, the first other row the header, cells beside
/// the table (right of its last named column) left out, every cell holding a formula's error
/// listed as a bad row.
fn table_of(label: &Path, cells: SheetCells) -> Result<CsvTable> {
    let mut rows = cells.into_iter().filter(|(_, row)| {
        !row.iter()
            .find(|(_, c)| !c.is_empty())
            .is_some_and(|(_, c)| c.is_note())
    });
    let Some((_, header)) = rows.next() else {
        return Err(at_line(
            label,
            "the first sheet is empty".into(),
            "give a header row and at least one data row",
        ));
    };
    let headers: Vec<String> = fields_of(&header)
        .iter()
        .map(|h| h.trim().to_ascii_lowercase())
        .collect();
    let mut records = Vec::new();
    let mut errors = Vec::new();
    for (row, mut cells) in rows {
        // Cells beside the table (right of its last named column) are not part of it.
        cells.retain(|(col, _)| (*col as usize) < headers.len());
        if cells.is_empty() {
            continue;
        }
        let line = u64::from(row) + 1;
        for (col, cell) in &cells {
            if let CellKind::Error(name) = &cell.kind {
                errors.push(error_cell_line(label, line, *col, &headers, name));
            }
        }
        let mut rec = csv::StringRecord::from(fields_of(&cells));
        rec.trim();
        records.push((line, rec));
    }
    if !errors.is_empty() {
        return Err(Error::BadRows {
            file: label.to_path_buf(),
            rows: errors,
            total: records.len(),
        });
    }
    Ok(CsvTable {
        path: label.to_path_buf(),
        headers,
        records,
    })
}

/// A row's fields from column A to its last cell holding anything.
fn fields_of(cells: &[(u32, CellText)]) -> Vec<String> {
    let width = cells
        .iter()
        .map(|(c, _)| *c as usize + 1)
        .max()
        .unwrap_or(0);
    let mut fields = vec![String::new(); width];
    for (col, cell) in cells {
        fields[*col as usize] = cell.text.clone();
    }
    fields
}

/// The line of the bad-rows list for a cell holding a formula's error.
fn error_cell_line(label: &Path, line: u64, col: u32, headers: &[String], name: &str) -> String {
    let column = headers
        .get(col as usize)
        .filter(|h| !h.is_empty())
        .map(|h| format!(" (column '{h}')"))
        .unwrap_or_default();
    format!(
        "{}:{line}:{}{column}: the cell holds the spreadsheet error {name}; correct the formula or type the value",
        label.display(),
        col + 1
    )
}

/// The error for a file calamine cannot open.
fn unreadable(path: &Path, e: &dyn std::fmt::Display) -> Error {
    at_line(
        path,
        format!("the file cannot be read as a spreadsheet ({e})"),
        "save it again as .xlsx or .ods, or export the sheet as CSV",
    )
}

/// The error for a sheet too large to expand; `why` says what was found.
fn too_large(path: &Path, why: &str) -> Error {
    at_line(
        path,
        format!(
            "the spreadsheet is too large to read: {why} (at most {MAX_CELLS} cells and {} MB unpacked are read)",
            MAX_UNCOMPRESSED_BYTES / 1_000_000
        ),
        "delete stray cells far from the table (or export the table alone as CSV) and give that file",
    )
}

/// The error for a workbook with no sheet.
fn no_sheet(path: &Path) -> Error {
    at_line(
        path,
        "the spreadsheet has no sheet".into(),
        "put the table on its first sheet",
    )
}

/// An input error at line 1 of a file.
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

#[cfg(test)]
mod tests {
    use super::*;

    fn cell(text: &str, kind: CellKind) -> CellText {
        CellText {
            text: text.into(),
            kind,
        }
    }

    #[test]
    fn notes_above_the_header_are_left_out_and_error_cells_listed() {
        let mut cells = SheetCells::new();
        cells.insert(0, vec![(1, cell("# campaign notes", CellKind::Text))]);
        cells.insert(
            2,
            vec![
                (0, cell("station", CellKind::Text)),
                (1, cell("time_utc", CellKind::Text)),
            ],
        );
        cells.insert(
            3,
            vec![
                (0, cell("A", CellKind::Text)),
                (1, cell("", CellKind::Error("#N/A".into()))),
            ],
        );
        let e = table_of(Path::new("t.xlsx"), cells).expect_err("error cell");
        let text = e.to_string();
        assert!(
            text.contains(
                "t.xlsx:4:2 (column 'time_utc'): the cell holds the spreadsheet error #N/A"
            ),
            "{text}"
        );
        let mut cells = SheetCells::new();
        cells.insert(0, vec![(0, cell("# notes", CellKind::Text))]);
        cells.insert(1, vec![(0, cell("station", CellKind::Text))]);
        cells.insert(4, vec![(0, cell("A", CellKind::Text))]);
        let t = table_of(Path::new("t.xlsx"), cells).expect("table");
        assert_eq!(t.headers, vec!["station"]);
        assert_eq!(t.records[0].0, 5);
    }
}
