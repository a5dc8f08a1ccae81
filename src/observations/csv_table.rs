//! Reading CSV files whose columns are found by header name, with line and column numbers kept
//! for every value so that errors can say exactly where a problem is.

use crate::error::{Error, Location, Result};
use std::path::{Path, PathBuf};

/// A CSV file read into memory: its header and its records with their line numbers.
#[derive(Debug, Clone)]
pub struct CsvTable {
    /// The file as named by the user (or a label such as `<demo>`).
    pub path: PathBuf,
    /// Header names, trimmed, lower-cased.
    pub headers: Vec<String>,
    /// Records with the line (1-based; the header is line 1) on which each starts.
    pub records: Vec<(u64, csv::StringRecord)>,
}

impl CsvTable {
    /// Read a CSV file, or the first sheet of an `.xlsx` or `.ods` workbook, from disk.
    ///
    /// Errors: the file cannot be read, is not UTF-8 (the line and byte column are named), is
    /// empty, or is not valid CSV.
    pub fn read(path: &Path) -> Result<CsvTable> {
        let bytes = std::fs::read(path).map_err(|source| Error::Io {
            path: path.to_path_buf(),
            source,
        })?;
        // By content, not by name: a CSV file saved as `.xlsx`, or a workbook as `.csv`.
        if super::spreadsheet::looks_like_spreadsheet(&bytes) {
            return super::spreadsheet::first_sheet_of_bytes(path, &bytes);
        }
        Self::from_bytes(path, &bytes)
    }

    /// Parse CSV text held in memory; `path` labels it in messages. The separator (comma,
    /// semicolon or tab) is found from the header line, or from a first line `sep=;`; in a
    /// semicolon- or tab-separated file a decimal comma (`52,1601`) reads as a decimal point.
    /// Rows whose every field is empty (a spreadsheet's blank rows) are left out.
    ///
    /// Errors: not UTF-8; empty; a CSV syntax error (line named).
    pub fn from_bytes(path: &Path, bytes: &[u8]) -> Result<CsvTable> {
        let text = decode_text(path, bytes)?;
        if text.trim().is_empty() {
            return Err(Error::Input {
                location: Location {
                    file: path.to_path_buf(),
                    line: 1,
                    column: None,
                },
                message: "the file is empty".into(),
                hint: "give a header row and at least one data row".into(),
            });
        }
        let (text, separator) = separator_of(text);
        let text = text.as_ref();
        let mut reader = csv::ReaderBuilder::new()
            .flexible(true)
            .trim(csv::Trim::All)
            .comment(Some(b'#'))
            .delimiter(separator)
            .from_reader(text.as_bytes());
        let headers: Vec<String> = reader
            .headers()
            .map_err(|e| csv_error(path, &e))?
            .iter()
            .map(|h| h.trim().to_ascii_lowercase())
            .collect();
        let line_of = line_finder(text);
        let decimal_comma = separator != b',';
        let mut records = Vec::new();
        let mut overfull = Vec::new();
        for rec in reader.records() {
            let rec = rec.map_err(|e| csv_error(path, &e))?;
            if rec.iter().all(str::is_empty) {
                continue;
            }
            let line = rec.position().map(|p| line_of(p.byte())).unwrap_or(0);
            if rec.iter().skip(headers.len()).any(|f| !f.is_empty()) {
                overfull.push(overfull_row(
                    path,
                    line,
                    rec.len(),
                    headers.len(),
                    separator,
                ));
            }
            let rec = if rec.iter().any(|f| f != unneutralised(f)) {
                rec.iter().map(unneutralised).collect()
            } else {
                rec
            };
            let rec = if decimal_comma {
                with_decimal_points(&headers, &rec)
            } else {
                rec
            };
            records.push((line, rec));
        }
        if !overfull.is_empty() {
            return Err(Error::BadRows {
                file: path.to_path_buf(),
                rows: overfull,
                total: records.len(),
            });
        }
        Ok(CsvTable {
            path: path.to_path_buf(),
            headers,
            records,
        })
    }

    /// Index of a required column.
    ///
    /// Errors: the column is absent; the message lists the columns found.
    pub fn require(&self, name: &str) -> Result<usize> {
        self.optional(name).ok_or_else(|| Error::Input {
            location: Location {
                file: self.path.clone(),
                line: 1,
                column: None,
            },
            message: format!(
                "missing column '{name}' (the header has: {})",
                self.headers.join(", ")
            ),
            hint: format!("add a column named '{name}' to the header row"),
        })
    }

    /// Index of an optional column.
    pub fn optional(&self, name: &str) -> Option<usize> {
        self.headers.iter().position(|h| h == name)
    }

    /// Location of a field for messages.
    pub fn location(&self, line: u64, col: Option<usize>) -> Location {
        Location {
            file: self.path.clone(),
            line,
            column: col.map(|c| (c + 1, self.headers.get(c).cloned().unwrap_or_default())),
        }
    }

    /// The text of a field (empty when the row is short).
    pub fn text<'a>(&self, rec: &'a csv::StringRecord, col: usize) -> &'a str {
        rec.get(col).unwrap_or("")
    }

    /// A number in a range, or an error naming line and column.
    pub fn number_in(
        &self,
        line: u64,
        rec: &csv::StringRecord,
        col: usize,
        min: f64,
        max: f64,
        unit: &str,
    ) -> Result<f64> {
        let text = self.text(rec, col);
        let name = self.headers.get(col).cloned().unwrap_or_default();
        let value: f64 = text.parse().map_err(|_| Error::Input {
            location: self.location(line, Some(col)),
            message: if text.is_empty() {
                format!("'{name}' is empty")
            } else {
                format!("{name} '{text}' is not a number")
            },
            hint: format!("give {name} as a decimal number in {unit}"),
        })?;
        if !value.is_finite() || value < min || value > max {
            return Err(Error::Input {
                location: self.location(line, Some(col)),
                message: format!("{name} {text} is outside {min} to {max} {unit}"),
                hint: "check the value (a sign, a digit or the decimal point may be wrong)".into(),
            });
        }
        Ok(value)
    }
}

/// The characters that make a spreadsheet read a cell as a formula (OWASP, "CSV Injection").
const FORMULA_STARTS: [char; 6] = ['=', '+', '-', '@', '\t', '\r'];

/// A cell made safe for spreadsheets: a cell beginning with `=`, `+`, `-`, `@`, a tab or a
/// carriage return gets a leading `'`, unless `numeric` and it is a plain number (`-33.9`).
/// [`CsvTable::from_bytes`] reads such a cell back without the `'`.
///
/// Reference: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection).
pub fn formula_safe(text: &str, numeric: bool) -> std::borrow::Cow<'_, str> {
    let plain_number = text.parse::<f64>().is_ok()
        && text
            .chars()
            .all(|c| c.is_ascii_digit() || ".+-eE".contains(c));
    if text.starts_with(FORMULA_STARTS) && !(numeric && plain_number) {
        format!("'{text}").into()
    } else {
        text.into()
    }
}

/// A cell as written before [`formula_safe`]: the leading `'` dropped where the rest begins
/// with one of the formula characters.
fn unneutralised(field: &str) -> &str {
    match field.strip_prefix('\'') {
        Some(rest) if rest.starts_with(FORMULA_STARTS) => rest,
        _ => field,
    }
}

/// The file's bytes as text: UTF-8 (with a byte-order mark dropped) and Unix line endings.
/// Windows line endings: the csv crate counts a CRLF pair as two line breaks in its
/// positions, so they are normalised first (regression test: crlf_line_numbers).
fn decode_text<'a>(path: &Path, bytes: &'a [u8]) -> Result<std::borrow::Cow<'a, str>> {
    let text = match std::str::from_utf8(bytes) {
        Ok(t) => t,
        Err(e) => {
            let before = &bytes[..e.valid_up_to()];
            let line = before.iter().filter(|&&b| b == b'\n').count() as u64 + 1;
            let col = before.iter().rev().take_while(|&&b| b != b'\n').count() + 1;
            return Err(Error::Input {
                location: Location {
                    file: path.to_path_buf(),
                    line,
                    column: None,
                },
                message: format!(
                    "the file is not UTF-8 text: byte {col} of this line is not valid UTF-8 (the file was probably saved in another encoding)"
                ),
                hint: "save it as UTF-8 (plain text CSV)".into(),
            });
        }
    };
    let text = text.strip_prefix('\u{feff}').unwrap_or(text);
    Ok(if text.contains('\r') {
        std::borrow::Cow::Owned(text.replace("\r\n", "\n").replace('\r', "\n"))
    } else {
        std::borrow::Cow::Borrowed(text)
    })
}

/// Columns whose text is free (names and notes): a comma there is a comma.
const TEXT_COLUMNS: [&str; 9] = [
    "station",
    "observer",
    "note",
    "notes",
    "comment",
    "comments",
    "remarks",
    "instrument",
    "time_zone",
];

/// The separator of a delimited text: a first line `sep=X` (a spreadsheet convention), kept in
/// place as a comment so that line numbers hold; else whichever of comma, semicolon and tab
/// the header line (the first that is neither blank nor a comment) has most of, outside quotes
/// (a comma on a tie). RFC 4180 describes the comma-separated form; the others differ only in
/// the separator.
fn separator_of(text: std::borrow::Cow<'_, str>) -> (std::borrow::Cow<'_, str>, u8) {
    // Not trimmed: the separator may be a tab.
    let first = text.lines().next().unwrap_or("");
    let first = first.strip_suffix(' ').unwrap_or(first);
    if first.len() == 5 && first.is_char_boundary(4) && first[..4].eq_ignore_ascii_case("sep=") {
        let sep = first.as_bytes()[4];
        let mut owned = text.into_owned();
        owned.replace_range(..1, "#");
        return (owned.into(), sep);
    }
    let header = text
        .lines()
        .map(str::trim)
        .find(|l| !l.is_empty() && !l.starts_with('#'))
        .unwrap_or("");
    let mut counts = [0usize; 3];
    let mut quoted = false;
    for c in header.chars() {
        match c {
            '"' => quoted = !quoted,
            ',' if !quoted => counts[0] += 1,
            ';' if !quoted => counts[1] += 1,
            '\t' if !quoted => counts[2] += 1,
            _ => {}
        }
    }
    let sep = [b',', b';', b'\t']
        .into_iter()
        .zip(counts)
        .fold(
            (b',', 0),
            |best, (s, n)| if n > best.1 { (s, n) } else { best },
        )
        .0;
    (text, sep)
}

/// A record with each decimal comma (`52,1601`, `51°28'40,5"N`, `04:26:38,5Z`) read as a point:
/// in a field outside the text columns, a comma between two digits, one in each part of a
/// range `START/END` at most.
fn with_decimal_points(headers: &[String], rec: &csv::StringRecord) -> csv::StringRecord {
    let mut out = csv::StringRecord::new();
    for (k, field) in rec.iter().enumerate() {
        let text_column = headers
            .get(k)
            .is_some_and(|h| TEXT_COLUMNS.contains(&h.as_str()));
        if text_column || !field.contains(',') {
            out.push_field(field);
            continue;
        }
        let parts: Vec<String> = field.split('/').map(decimal_point_of_part).collect();
        out.push_field(&parts.join("/"));
    }
    out.set_position(rec.position().cloned());
    out
}

/// One number's decimal comma as a point, if it has exactly one comma, between two digits.
fn decimal_point_of_part(part: &str) -> String {
    let b = part.as_bytes();
    let decimal = part.matches(',').count() == 1
        && part.find(',').is_some_and(|i| {
            i > 0 && i + 1 < b.len() && b[i - 1].is_ascii_digit() && b[i + 1].is_ascii_digit()
        });
    if decimal {
        part.replace(',', ".")
    } else {
        part.to_string()
    }
}

/// Line numbers counted from the records' byte offsets (the csv crate's own line count skips
/// comment lines): the line of the first non-blank, non-comment line at or after a byte.
fn line_finder(text: &str) -> impl Fn(u64) -> u64 + '_ {
    let newline_offsets: Vec<usize> = text
        .bytes()
        .enumerate()
        .filter_map(|(i, b)| (b == b'\n').then_some(i))
        .collect();
    move |byte: u64| {
        // The reader's position may point at blank or comment lines it skipped first.
        let mut b = (byte as usize).min(text.len());
        while b < text.len() {
            let rest = &text[b..];
            let end = rest.find('\n').map(|i| i + 1).unwrap_or(rest.len());
            let t = rest[..end].trim();
            if t.is_empty() || t.starts_with('#') {
                b += end;
            } else {
                break;
            }
        }
        newline_offsets.partition_point(|&nl| nl < b) as u64 + 1
    }
}

/// The line of the bad-rows list for a row with more fields than the header has names.
fn overfull_row(path: &Path, line: u64, fields: usize, names: usize, separator: u8) -> String {
    let why = if separator == b',' {
        "a decimal comma (52,1601) in a comma-separated file splits a number in two; write decimal points, put such numbers in quotes, or separate the columns with semicolons"
    } else {
        "a separator inside a value splits it in two; put such values in quotes, or give the extra columns a name in the header"
    };
    format!(
        "{}:{line}: the row has {fields} fields but the header names {names}; {why}",
        path.display()
    )
}

/// The error for text the csv crate cannot read as CSV.
fn csv_error(path: &Path, e: &csv::Error) -> Error {
    let line = e.position().map(|p| p.line()).unwrap_or(1);
    Error::Input {
        location: Location {
            file: path.to_path_buf(),
            line,
            column: None,
        },
        message: format!("malformed CSV ({e})"),
        hint:
            "check quoting and separators (comma-, semicolon- or tab-separated, header row first)"
                .into(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn crlf_line_numbers() {
        // Regression: with CRLF endings, line numbers came out one too small.
        let text = b"a,b\r\n1,2\r\n3,4\r\n";
        let t = CsvTable::from_bytes(Path::new("x.csv"), text).unwrap();
        let lines: Vec<u64> = t.records.iter().map(|(l, _)| *l).collect();
        assert_eq!(lines, vec![2, 3]);
    }

    #[test]
    fn a_decimal_comma_in_a_comma_separated_file_is_a_bad_row() {
        let text = b"station,latitude,longitude\nA,52,1601,4.497\nB,1.0,2.0,\n";
        let e = CsvTable::from_bytes(Path::new("s.csv"), text).expect_err("overfull");
        let text = e.to_string();
        assert!(
            text.contains("s.csv:2: the row has 4 fields but the header names 3"),
            "{text}"
        );
        assert!(text.contains("decimal comma"), "{text}");
        assert!(
            !text.contains("s.csv:3"),
            "a trailing empty field is not an error: {text}"
        );
    }

    #[test]
    fn comments_and_blank_lines_keep_numbering() {
        let text = b"# note\na,b\n\n1,2\n";
        let t = CsvTable::from_bytes(Path::new("x.csv"), text).unwrap();
        assert_eq!(t.headers, vec!["a", "b"]);
        assert_eq!(t.records[0].0, 4);
    }
}
