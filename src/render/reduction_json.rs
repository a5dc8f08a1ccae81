//! The reduction's JSON written straight from the reduction: the rows that grow with the
//! campaign (one per station, one per timing not used) are serialised from typed views, never
//! built as a tree of `serde_json::Value`s first, so that the service's solution at 100,000
//! timings is written in a fraction of the time.
//!
//! The bytes are those of [`crate::render::reduction::reduction_json`] serialised (keys in
//! sorted order, as `serde_json`'s map keeps them); a unit test holds the two together.

use crate::reduction::result::{Chord, StationContribution};
use crate::reduction::Reduction;
use crate::render::text::round as r;
use serde::ser::{Serialize, Serializer};
use serde_json::{Map, Value};

/// A number rounded for JSON, absent (null) when not finite.
fn rounded(x: Option<f64>, decimals: i32) -> Option<f64> {
    x.filter(|v| v.is_finite()).map(|v| r(v, decimals))
}

/// A station's chord, its fields in sorted order.
#[derive(serde::Serialize)]
struct ChordRow<'a> {
    duration_o_c_s: f64,
    observed_arcsec: f64,
    pair: &'a str,
    parallax_displacement_arcsec: f64,
    predicted_arcsec: f64,
}

impl<'a> ChordRow<'a> {
    fn of(c: &'a Chord) -> Self {
        ChordRow {
            duration_o_c_s: r(c.duration_o_c_s, 2),
            observed_arcsec: r(c.observed_arcsec, 3),
            pair: &c.pair,
            parallax_displacement_arcsec: r(c.parallax_displacement_arcsec, 3),
            predicted_arcsec: r(c.predicted_arcsec, 3),
        }
    }
}

/// One station of `stations`, its fields in sorted order (the keys of the interface).
#[derive(serde::Serialize)]
struct StationRow<'a> {
    chord: Option<ChordRow<'a>>,
    contact_labels: &'a [String],
    contacts: &'a [u8],
    influence_arcsec: Option<f64>,
    information_share: f64,
    latitude: f64,
    longitude: f64,
    longitude_correction_deg: Option<f64>,
    longitude_correction_sigma_deg: Option<f64>,
    mean_normalised_residual: f64,
    not_used: &'a Option<String>,
    observers: &'a [String],
    residuals_s: Vec<f64>,
    station: &'a str,
    timings: usize,
}

impl<'a> StationRow<'a> {
    fn of(s: &'a StationContribution, correction: Option<(f64, Option<f64>)>) -> Self {
        StationRow {
            chord: s.chord.as_ref().map(ChordRow::of),
            contact_labels: &s.contact_labels,
            contacts: &s.contacts,
            influence_arcsec: rounded(s.influence_arcsec, 6),
            information_share: r(s.information_share, 6),
            latitude: s.latitude_deg,
            longitude: s.longitude_deg,
            longitude_correction_deg: correction.map(|c| r(c.0, 6)),
            longitude_correction_sigma_deg: correction.and_then(|c| c.1).map(|x| r(x, 6)),
            mean_normalised_residual: r(s.mean_normalised_residual, 3),
            not_used: &s.not_used,
            observers: &s.observers,
            residuals_s: s.residuals_s.iter().map(|x| r(*x, 2)).collect(),
            station: &s.station,
            timings: s.timings,
        }
    }
}

/// The `stations` array.
struct Stations<'a>(&'a Reduction);

impl Serialize for Stations<'_> {
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        let corrections = crate::render::reduction::longitude_corrections(self.0);
        serializer.collect_seq(self.0.stations.iter().map(|s| {
            let correction = corrections.get(s.station.as_str()).copied();
            StationRow::of(s, correction)
        }))
    }
}

/// One row of `rejected`, its fields in sorted order.
#[derive(serde::Serialize)]
struct RejectedRow<'a> {
    contact: Option<u8>,
    contact_label: &'a Option<String>,
    diagnosis: &'a Option<String>,
    line: u64,
    o_c_s: Option<f64>,
    reason: &'static str,
    station: &'a str,
}

/// The `rejected` array.
struct RejectedRows<'a>(&'a Reduction);

impl Serialize for RejectedRows<'_> {
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        serializer.collect_seq(self.0.rejected.iter().map(|x| RejectedRow {
            contact: x.contact,
            contact_label: &x.contact_label,
            diagnosis: &x.diagnosis,
            line: x.line,
            o_c_s: rounded(x.o_c_s, 2),
            reason: x.reason.as_str(),
            station: &x.station,
        }))
    }
}

/// The `stations` array as JSON values (for the object that `reduce --format json` prints).
pub(crate) fn stations_value(red: &Reduction) -> Value {
    serde_json::to_value(Stations(red)).unwrap_or(Value::Null)
}

/// The `rejected` array as JSON values.
pub(crate) fn rejected_value(red: &Reduction) -> Value {
    serde_json::to_value(RejectedRows(red)).unwrap_or(Value::Null)
}

/// Stations serialised together on one thread.
const STATION_CHUNK_ROWS: usize = 2048;

/// The `stations` array written in parallel: chunks of rows serialised on their own and
/// joined in order, so that the bytes do not depend on the cores.
fn stations_bytes(red: &Reduction, chunk_rows: usize, out: &mut Vec<u8>) -> serde_json::Result<()> {
    use rayon::prelude::*;
    let corrections = crate::render::reduction::longitude_corrections(red);
    let chunks: Vec<serde_json::Result<Vec<u8>>> = red
        .stations
        .par_chunks(chunk_rows.max(1))
        .map(|chunk| {
            let mut buf = Vec::with_capacity(chunk.len() * 320);
            for (k, s) in chunk.iter().enumerate() {
                if k > 0 {
                    buf.push(b',');
                }
                let correction = corrections.get(s.station.as_str()).copied();
                serde_json::to_writer(&mut buf, &StationRow::of(s, correction))?;
            }
            Ok(buf)
        })
        .collect();
    out.push(b'[');
    for (k, chunk) in chunks.into_iter().enumerate() {
        if k > 0 {
            out.push(b',');
        }
        out.extend_from_slice(&chunk?);
    }
    out.push(b']');
    Ok(())
}

/// The compact bytes of `reduce --format json`'s object with `extra` keys added (the
/// service adds `submissions` and `version`), written without building the large arrays as
/// values. Keys are in sorted order, as in the serialised `Value`.
pub fn reduction_json_bytes(red: &Reduction, extra: &[(&str, Value)]) -> Vec<u8> {
    let mut head = crate::render::reduction::reduction_json_head(red);
    for (k, v) in extra {
        head.insert((*k).to_string(), v.clone());
    }
    whole_bytes(red, &head, STATION_CHUNK_ROWS).unwrap_or_else(|_| b"{}".to_vec())
}

/// The object: the small keys of `head` merged in sorted order with the two large arrays.
fn whole_bytes(
    red: &Reduction,
    head: &Map<String, Value>,
    chunk_rows: usize,
) -> serde_json::Result<Vec<u8>> {
    let mut keys: Vec<&str> = head.keys().map(String::as_str).collect();
    keys.extend(["rejected", "stations"]);
    keys.sort_unstable();
    keys.dedup();
    let mut out = Vec::with_capacity(red.stations.len() * 320 + red.rejected.len() * 160 + 65_536);
    out.push(b'{');
    for (k, key) in keys.into_iter().enumerate() {
        if k > 0 {
            out.push(b',');
        }
        serde_json::to_writer(&mut out, key)?;
        out.push(b':');
        match key {
            "rejected" => serde_json::to_writer(&mut out, &RejectedRows(red))?,
            "stations" => stations_bytes(red, chunk_rows, &mut out)?,
            _ => serde_json::to_writer(&mut out, &head[key])?,
        }
    }
    out.push(b'}');
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::observations::csv_table::CsvTable;
    use crate::observations::timings::observations_from_table;
    use crate::reduction::{reduce, ReduceOptions};

    /// The demo campaign (stations, rejected rows with and without a figure, chords) written
    /// both ways gives the same bytes.
    #[test]
    fn the_direct_bytes_are_those_of_the_value() {
        let text = crate::demo::DEMO_CAMPAIGN_CSV;
        let table = CsvTable::from_bytes(std::path::Path::new("demo"), text.as_bytes())
            .expect("the demo parses");
        let set = observations_from_table(&table, false).expect("the demo reads");
        let red = reduce(set, &ReduceOptions::default()).expect("the demo reduces");
        assert!(!red.stations.is_empty() && !red.rejected.is_empty());
        let extra = [("submissions", Value::from(7)), ("version", Value::from(3))];
        let mut value = crate::render::reduction::reduction_json(&red);
        if let Some(map) = value.as_object_mut() {
            for (k, v) in &extra {
                map.insert((*k).to_string(), v.clone());
            }
        }
        let via_value = serde_json::to_vec(&value).expect("serialised");
        let direct = reduction_json_bytes(&red, &extra);
        assert_eq!(
            String::from_utf8_lossy(&direct),
            String::from_utf8_lossy(&via_value)
        );
        // Chunks of one and of three stations join to the same bytes.
        let mut head = crate::render::reduction::reduction_json_head(&red);
        for (k, v) in &extra {
            head.insert((*k).to_string(), v.clone());
        }
        for chunk_rows in [1, 3] {
            let chunked = whole_bytes(&red, &head, chunk_rows).expect("written");
            assert_eq!(chunked, via_value, "chunks of {chunk_rows}");
        }
    }
}
