//! Writing the observers' sheets and calendars to a folder (`predict --sheets DIR`): for each
//! station `DIR/<name>.html` and `DIR/<name>.ics`, the name made safe from the station's.

use crate::error::{Error, Result};
use crate::geometry::transit::{StationPrediction, TransitEvent};
use crate::language::Language;
use crate::render::observer_sheet::{observer_sheet_html, SheetStation};
use crate::render::sheet_calendar::station_calendar;
use crate::time::civil::CivilZone;
use chrono::{DateTime, Utc};
use std::collections::HashSet;
use std::path::{Path, PathBuf};

/// Names Windows keeps for devices, which no file may take (any case, any extension).
const RESERVED_NAMES: [&str; 22] = [
    "CON", "PRN", "AUX", "NUL", "COM1", "COM2", "COM3", "COM4", "COM5", "COM6", "COM7", "COM8",
    "COM9", "LPT1", "LPT2", "LPT3", "LPT4", "LPT5", "LPT6", "LPT7", "LPT8", "LPT9",
];

/// A file name (without extension) made from a station's name: ASCII letters, digits, `-` and
/// `_` kept, every other run of characters (spaces, accents, slashes) one `_`, at most 60
/// characters; `station` if nothing is left, and a device name of Windows given `_station`.
pub fn safe_file_stem(name: &str) -> String {
    let mut s = String::with_capacity(name.len());
    for ch in name.chars() {
        if ch.is_ascii_alphanumeric() || ch == '-' || ch == '_' {
            s.push(ch);
        } else if !s.ends_with('_') {
            s.push('_');
        }
    }
    let mut s: String = s.trim_matches('_').chars().take(60).collect();
    if s.is_empty() {
        s = "station".into();
    }
    if RESERVED_NAMES.contains(&s.to_ascii_uppercase().as_str()) {
        s.push_str("_station");
    }
    s
}

/// Safe, distinct file stems for these station names, in order: a stem already taken (compared
/// without regard to case, as macOS and Windows compare names) gets `-2`, `-3`, ... appended.
pub fn distinct_file_stems<'a>(names: impl IntoIterator<Item = &'a str>) -> Vec<String> {
    let mut taken: HashSet<String> = HashSet::new();
    let mut out = Vec::new();
    for name in names {
        let base = safe_file_stem(name);
        let mut stem = base.clone();
        let mut k = 2;
        while !taken.insert(stem.to_ascii_lowercase()) {
            stem = format!("{base}-{k}");
            k += 1;
        }
        out.push(stem);
    }
    out
}

/// Write one sheet and one calendar per station into `dir`, creating it where missing.
///
/// Arguments: `dir`, the folder; `event`; `predictions`, one per station; `zones`, each
/// station's civil zone in the same order (shorter or `None`: UTC only); `language`, of the
/// sheets and calendars; `stamp_utc`, the instant written as each calendar event's DTSTAMP.
/// Returns: the paths written, sheet then calendar for each station.
/// Errors: [`Error::Io`] naming the folder or file that could not be created or written.
pub fn write_sheets(
    dir: &Path,
    event: &TransitEvent,
    predictions: &[StationPrediction],
    zones: &[Option<CivilZone>],
    language: Language,
    stamp_utc: DateTime<Utc>,
) -> Result<Vec<PathBuf>> {
    let io = |path: &Path| {
        let path = path.to_path_buf();
        move |source| Error::Io { path, source }
    };
    std::fs::create_dir_all(dir).map_err(io(dir))?;
    let stems = distinct_file_stems(predictions.iter().map(|p| p.station.name.as_str()));
    let mut written = Vec::with_capacity(2 * predictions.len());
    for (k, (p, stem)) in predictions.iter().zip(&stems).enumerate() {
        let calendar_file = format!("{stem}.ics");
        let st = SheetStation {
            prediction: p,
            zone: zones.get(k).and_then(Option::as_ref),
            calendar_file: &calendar_file,
            language,
        };
        let html = dir.join(format!("{stem}.html"));
        std::fs::write(&html, observer_sheet_html(event, &st)).map_err(io(&html))?;
        let ics = dir.join(&calendar_file);
        std::fs::write(&ics, station_calendar(event, &st, stamp_utc)).map_err(io(&ics))?;
        written.push(html);
        written.push(ics);
    }
    Ok(written)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn names_are_made_safe() {
        assert_eq!(
            safe_file_stem("Leiden Primary School"),
            "Leiden_Primary_School"
        );
        assert_eq!(
            safe_file_stem("École Saint-Jean / Nord"),
            "cole_Saint-Jean_Nord"
        );
        assert_eq!(safe_file_stem("../../etc/passwd"), "etc_passwd");
        assert_eq!(safe_file_stem("東京"), "station");
        assert_eq!(safe_file_stem("con"), "con_station");
        assert!(safe_file_stem(&"x".repeat(200)).len() <= 60);
        for name in ["a b", "x<y>|z?*", "tab\there", "dots..."] {
            let stem = safe_file_stem(name);
            assert!(
                stem.chars()
                    .all(|c| c.is_ascii_alphanumeric() || c == '-' || c == '_'),
                "{stem}"
            );
        }
    }

    #[test]
    fn collisions_get_numbers_case_blind() {
        let stems = distinct_file_stems(["North Hill", "North/Hill", "north hill", "Other"]);
        assert_eq!(
            stems,
            ["North_Hill", "North_Hill-2", "north_hill-3", "Other"]
        );
    }
}
