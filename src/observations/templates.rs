//! Blank files to fill in: a stations file and an observations (timings) file, each with its
//! header, a note on how to write each column and one example row, commented out so that the
//! file as printed reads as empty until filled.

use crate::render::text::SAFETY_CAUTION;

/// The files a template can be printed for.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum TemplateKind {
    /// Stations (or candidate sites) for `predict` and `plan`.
    Stations,
    /// Timings for `reduce` and the service's upload.
    Observations,
}

/// The caution as comment lines.
fn caution_comment() -> String {
    let mut out = String::new();
    let mut line = String::from("#");
    for word in SAFETY_CAUTION.split_whitespace() {
        if line.len() + word.len() + 1 > 95 {
            out.push_str(&line);
            out.push('\n');
            line = String::from("#");
        }
        line.push(' ');
        line.push_str(word);
    }
    out.push_str(&line);
    out.push('\n');
    out
}

/// The blank file's text: comment lines (`#`), the header, one commented example row.
pub fn template_text(kind: TemplateKind) -> String {
    match kind {
        TemplateKind::Stations => "\
# Stations: one row per station. Columns are found by name; extra columns are ignored.
# latitude, longitude: WGS 84 degrees, north and east positive (52.1601, 4.4970), or with
# their hemisphere (52 09 36.4 N, 4 29 49.2 E; 52°09'36.4\"N). elevation_m: metres above sea
# level (may be left empty: 0). time_zone: the clocks' zone, an IANA name (Europe/Amsterdam)
# or an offset (+05:30); may be left empty.
# Delete the # before the example row and change it, or add rows below it.
station,latitude,longitude,elevation_m,time_zone
# Example Garden School,52.1601,4.4970,2,Europe/Amsterdam
"
        .to_string(),
        TemplateKind::Observations => format!(
            "\
# Timings: one row per contact timed. Columns are found by name; extra columns are ignored.
# contact: 1-4 (or I-IV). time_utc: ISO 8601 in UTC, 2032-11-13T11:05:59.6Z, or with the
# clock's offset, 2032-11-13T12:05:59.6+01:00; a time to the minute only (12:06) counts the
# whole minute. sigma_s: how sure the time is, in seconds (one standard deviation; leave it
# empty for the usual default). observer: who timed it, where several timed at one station.
# Delete the # before the example row and change it, or add rows below it.
{}station,latitude,longitude,elevation_m,contact,time_utc,sigma_s,observer
# Example Garden School,52.1601,4.4970,2,3,2032-11-13T11:05:59.6Z,5,first observer
",
            caution_comment()
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::observations::csv_table::CsvTable;
    use std::path::Path;

    #[test]
    fn each_template_reads_as_a_header_and_its_example_as_a_row() {
        for kind in [TemplateKind::Stations, TemplateKind::Observations] {
            let text = template_text(kind);
            let blank = CsvTable::from_bytes(Path::new("t.csv"), text.as_bytes()).expect("blank");
            assert!(
                blank.records.is_empty(),
                "{kind:?}: the blank file has no row"
            );
            assert!(blank.optional("station").is_some());
            let filled = text.replace("\n# Example", "\nExample");
            let t = CsvTable::from_bytes(Path::new("t.csv"), filled.as_bytes()).expect("filled");
            assert_eq!(t.records.len(), 1, "{kind:?}");
            assert_eq!(
                t.records[0].1.len(),
                t.headers.len(),
                "{kind:?}: one field a column"
            );
        }
        assert!(template_text(TemplateKind::Observations).contains("certified solar filter"));
    }
}
