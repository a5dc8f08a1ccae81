//! Typed errors of the library.
//!
//! Every error that comes from what a user supplied names where it is (file, line,
//! column) and says how to fix it. The binary maps [`Error::is_usage`] errors to exit
//! status 2 and the rest to 1.

use std::path::PathBuf;

/// Where in an input file a problem was found. Lines count from 1, the header being line 1;
/// columns count from 1.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Location {
    /// The file as the user named it.
    pub file: PathBuf,
    /// Line number, 1-based (the header is line 1).
    pub line: u64,
    /// Column number (1-based) and its header name, when the problem is in one field.
    pub column: Option<(usize, String)>,
}

impl std::fmt::Display for Location {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}:{}", self.file.display(), self.line)?;
        if let Some((col, name)) = &self.column {
            write!(f, ":{col} (column '{name}')")?;
        }
        Ok(())
    }
}

/// Errors of the `transit_parallax` library.
#[derive(Debug, thiserror::Error)]
pub enum Error {
    /// A file could not be opened or read.
    #[error("cannot read or write {}: {source}; check the path and permissions", path.display())]
    Io {
        /// The path given.
        path: PathBuf,
        /// The underlying error.
        #[source]
        source: std::io::Error,
    },
    /// A value in an input file is missing, malformed or out of range.
    #[error("{location}: {message}; {hint}")]
    Input {
        /// Where.
        location: Location,
        /// What is wrong.
        message: String,
        /// How to fix it.
        hint: String,
    },
    /// A command-line value is malformed or out of range.
    #[error("{message}")]
    Argument {
        /// What is wrong and how to fix it.
        message: String,
    },
    /// No transit matches the requested date.
    #[error("no transit of {planet} has its greatest transit within one day of {date}; {nearest}")]
    NoTransit {
        /// The planet asked for.
        planet: String,
        /// The date asked for (YYYY-MM-DD).
        date: String,
        /// The nearest transits, as a sentence.
        nearest: String,
    },
    /// A date or year outside what the models support.
    #[error("{what} {value} is outside the supported range {min} to {max}")]
    OutOfRange {
        /// What quantity.
        what: String,
        /// The value given.
        value: String,
        /// Lower limit.
        min: String,
        /// Upper limit.
        max: String,
    },
    /// Not one timing of a file could be used: every row is listed with its reason.
    #[error("{}: {why}; {}", file.display(), rows_text(rows))]
    NoUsableTiming {
        /// The file.
        file: PathBuf,
        /// Why nothing could be used, in a phrase.
        why: String,
        /// Each row not used: line, station, contact, reason and sentence.
        rows: Vec<String>,
    },
    /// Rows of a stations or sites file that cannot be read, every one listed with its line,
    /// column and fix.
    #[error("{}: {}; fix these rows and run again:{}", file.display(), bad_rows_count(rows.len(), *total), rows_list(rows))]
    BadRows {
        /// The file.
        file: PathBuf,
        /// One line per bad row.
        rows: Vec<String>,
        /// Rows in the file (blank rows not counted).
        total: usize,
    },
    /// A numerical method failed to converge or met a degenerate case.
    #[error("computation failed: {0}")]
    Numerical(String),
}

impl Error {
    /// True when the error comes from what the user supplied (exit status 2).
    pub fn is_usage(&self) -> bool {
        !matches!(self, Error::Numerical(_))
    }

    /// Shorthand for an argument error.
    pub fn argument(message: impl Into<String>) -> Self {
        Error::Argument {
            message: message.into(),
        }
    }
}

/// The count of bad rows as the message says it (`2 of its 14 rows cannot be read`).
fn bad_rows_count(bad: usize, total: usize) -> String {
    if bad == 1 && total == 1 {
        "its one row cannot be read".to_string()
    } else if bad == 1 {
        format!("1 of its {total} rows cannot be read")
    } else {
        format!("{bad} of its {total} rows cannot be read")
    }
}

/// The bad rows, one indented line each.
fn rows_list(rows: &[String]) -> String {
    rows.iter().map(|r| format!("\n  {r}")).collect()
}

/// The list of bad rows after a sentence asking to fix them (or how to add rows where none).
fn rows_text(rows: &[String]) -> String {
    if rows.is_empty() {
        return "add one row per timing below the header".to_string();
    }
    let mut s = String::from("fix these rows and run again:");
    for r in rows {
        s.push_str("\n  ");
        s.push_str(r);
    }
    s
}

/// Result type of the library.
pub type Result<T> = std::result::Result<T, Error>;
