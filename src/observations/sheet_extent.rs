//! How much a spreadsheet would take to expand, found before it is expanded: a few bytes of a
//! ZIP archive can declare gigabytes of XML, and a few bytes of XML a row repeated a million
//! times, and a reader that builds the sheet in memory would then exhaust it (and a server
//! would stop for everyone). These checks read the archive's directory and stream the sheet's
//! XML, keeping only counters.
//!
//! Formats: the ZIP central directory (PKWARE APPNOTE 6.3.10, §4.3.12 uncompressed size);
//! OpenDocument tables, where `table:number-rows-repeated` and `table:number-columns-repeated`
//! repeat a row or cell (OASIS OpenDocument 1.2 part 1, §9.1.3 and §9.1.4).

use quick_xml::events::{BytesStart, Event};
use std::io::{BufReader, Cursor, Read};

/// The most uncompressed bytes all entries of a spreadsheet's archive may declare together.
pub const MAX_UNCOMPRESSED_BYTES: u64 = 256 * 1024 * 1024;

/// The most cells (rows times columns, repeats expanded) the table of a first sheet may span.
pub const MAX_CELLS: u64 = 2_000_000;

/// The sum of the uncompressed sizes the archive's entries declare.
///
/// Errors: the bytes are not a ZIP archive (the message says so).
pub fn declared_uncompressed_bytes(bytes: &[u8]) -> Result<u64, String> {
    let mut zip = zip::ZipArchive::new(Cursor::new(bytes)).map_err(|e| e.to_string())?;
    let mut total_bytes = 0u64;
    for k in 0..zip.len() {
        let entry = zip.by_index_raw(k).map_err(|e| e.to_string())?;
        total_bytes = total_bytes.saturating_add(entry.size());
    }
    Ok(total_bytes)
}

/// The cells the tables of an OpenDocument spreadsheet span, summed over its sheets (a reader
/// expands every sheet when it opens the file): for each, from its first to its last row
/// holding anything, times its widest such row, with repeats expanded. Empty repeated rows and
/// cells at the edges, which office programs write to the sheet's full size, are not counted.
///
/// Errors: no `content.xml`, or XML that cannot be read (the message says so).
pub fn ods_cells_spanned(bytes: &[u8]) -> Result<u64, String> {
    let mut zip = zip::ZipArchive::new(Cursor::new(bytes)).map_err(|e| e.to_string())?;
    let content = zip.by_name("content.xml").map_err(|e| e.to_string())?;
    let limited = content.take(MAX_UNCOMPRESSED_BYTES);
    let mut xml = quick_xml::Reader::from_reader(BufReader::new(limited));
    let mut extent = Extent::default();
    let mut total_cells = 0u64;
    let mut buf = Vec::new();
    loop {
        match xml.read_event_into(&mut buf).map_err(|e| e.to_string())? {
            Event::Start(e) => extent.start(&e, true),
            Event::Empty(e) => extent.start(&e, false),
            Event::End(e) if e.local_name().as_ref() == b"table-row" => extent.end_row(),
            Event::End(e) if e.local_name().as_ref() == b"table" => {
                total_cells = total_cells.saturating_add(extent.cells());
                extent = Extent::default();
            }
            Event::Eof => break,
            _ => {}
        }
        buf.clear();
    }
    Ok(total_cells)
}

/// Whether a ZIP archive holds an OpenDocument document (its `mimetype` entry or its
/// `content.xml`) rather than an Office Open XML workbook.
pub fn is_open_document(bytes: &[u8]) -> bool {
    zip::ZipArchive::new(Cursor::new(bytes))
        .is_ok_and(|mut zip| zip.by_name("content.xml").is_ok() || zip.by_name("mimetype").is_ok())
}

/// Whether a ZIP archive holds a binary Excel workbook (`.xlsb`).
pub fn is_binary_workbook(bytes: &[u8]) -> bool {
    zip::ZipArchive::new(Cursor::new(bytes))
        .is_ok_and(|mut zip| zip.by_name("xl/workbook.bin").is_ok())
}

/// Counters over the rows of one table.
#[derive(Debug, Default)]
struct Extent {
    /// Rows so far, repeats expanded.
    rows: u64,
    /// Repeats of the row being read.
    row_repeats: u64,
    /// Columns so far in the row being read, repeats expanded.
    column: u64,
    /// The column just after the last cell holding anything in the row being read.
    row_end: u64,
    /// First and one-past-last row holding anything.
    first_row: Option<u64>,
    end_row: u64,
    /// The widest row holding anything.
    width: u64,
}

impl Extent {
    /// A row or cell begins (`open`: it has content inside, as a cell with a paragraph does).
    fn start(&mut self, e: &BytesStart<'_>, open: bool) {
        match e.local_name().as_ref() {
            b"table-row" => {
                self.row_repeats = repeats(e, b"table:number-rows-repeated");
                self.column = 0;
                self.row_end = 0;
                if !open {
                    self.end_row();
                }
            }
            b"table-cell" | b"covered-table-cell" => {
                self.column = self
                    .column
                    .saturating_add(repeats(e, b"table:number-columns-repeated"));
                let has_value = e.try_get_attribute(b"office:value-type").ok().flatten();
                if open || has_value.is_some() {
                    self.row_end = self.column;
                }
            }
            _ => {}
        }
    }

    /// A row ends.
    fn end_row(&mut self) {
        if self.row_end > 0 {
            self.first_row.get_or_insert(self.rows);
            self.end_row = self.rows.saturating_add(self.row_repeats);
            self.width = self.width.max(self.row_end);
        }
        self.rows = self.rows.saturating_add(self.row_repeats);
        self.row_repeats = 1;
    }

    fn cells(&self) -> u64 {
        self.first_row
            .map_or(0, |first| (self.end_row - first).saturating_mul(self.width))
    }
}

/// A repeat count attribute (1 when absent or unreadable).
fn repeats(e: &BytesStart<'_>, name: &[u8]) -> u64 {
    e.try_get_attribute(name)
        .ok()
        .flatten()
        .and_then(|a| {
            std::str::from_utf8(&a.value)
                .ok()?
                .trim()
                .parse::<u64>()
                .ok()
        })
        .unwrap_or(1)
        .max(1)
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::io::Write;

    fn ods_with(content: &str) -> Vec<u8> {
        let mut out = Cursor::new(Vec::new());
        {
            let mut zip = zip::ZipWriter::new(&mut out);
            let opts = zip::write::SimpleFileOptions::default();
            zip.start_file("content.xml", opts).expect("entry");
            zip.write_all(content.as_bytes()).expect("write");
            zip.finish().expect("finish");
        }
        out.into_inner()
    }

    const HEAD: &str = r#"<office:document-content xmlns:office="o" xmlns:table="t" xmlns:text="x"><office:body><office:spreadsheet><table:table table:name="S">"#;
    const TAIL: &str =
        "</table:table></office:spreadsheet></office:body></office:document-content>";

    #[test]
    fn trailing_empty_repeats_are_not_counted() {
        let rows = r#"<table:table-row><table:table-cell office:value-type="string"><text:p>a</text:p></table:table-cell><table:table-cell office:value-type="string"><text:p>b</text:p></table:table-cell><table:table-cell table:number-columns-repeated="16382"/></table:table-row><table:table-row table:number-rows-repeated="1048575"><table:table-cell table:number-columns-repeated="16384"/></table:table-row>"#;
        let bytes = ods_with(&format!("{HEAD}{rows}{TAIL}"));
        assert_eq!(ods_cells_spanned(&bytes), Ok(2));
    }

    #[test]
    fn a_repeated_row_with_content_is_counted_in_full() {
        let rows = r#"<table:table-row table:number-rows-repeated="1000000"><table:table-cell table:number-columns-repeated="3" office:value-type="float" office:value="1"/></table:table-row>"#;
        let bytes = ods_with(&format!("{HEAD}{rows}{TAIL}"));
        assert_eq!(ods_cells_spanned(&bytes), Ok(3_000_000));
        assert!(declared_uncompressed_bytes(&bytes).expect("zip") > 0);
    }
}
