//! English phrasing shared by every stage: counts with their nouns in the right number.

/// A count with its noun in the right number: `1 timing`, `2 timings`.
pub fn count(n: usize, one: &str, many: &str) -> String {
    format!("{n} {}", if n == 1 { one } else { many })
}

/// `both timings` for two, `all N timings` for more.
pub fn all_of(n: usize, noun_plural: &str) -> String {
    if n == 2 {
        format!("both {noun_plural}")
    } else {
        format!("all {n} {noun_plural}")
    }
}

/// An uncertainty to two significant figures at least (never a bare 0.0 for one that is not
/// zero): `3.1`, `0.050`, `0.0067`.
pub fn uncertainty(x: f64) -> String {
    if x != 0.0 && x.abs() < 1e-4 {
        return format!("{x:.1e}");
    }
    let d = match x.abs() {
        v if v >= 10.0 => 0,
        v if v >= 1.0 => 1,
        v if v >= 0.1 => 2,
        v if v >= 0.01 => 3,
        _ => 4,
    };
    format!("{x:.d$}")
}
/// Line numbers as a reader takes them in: ascending, runs joined (`2-5, 9, 12-13`).
pub fn line_ranges(lines: &[u64]) -> String {
    let mut sorted = lines.to_vec();
    sorted.sort_unstable();
    sorted.dedup();
    let mut parts: Vec<String> = Vec::new();
    let mut k = 0;
    while k < sorted.len() {
        let start = sorted[k];
        let mut end = start;
        while k + 1 < sorted.len() && sorted[k + 1] == end + 1 {
            k += 1;
            end = sorted[k];
        }
        parts.push(if end == start {
            start.to_string()
        } else {
            format!("{start}-{end}")
        });
        k += 1;
    }
    parts.join(", ")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn line_ranges_join_runs() {
        assert_eq!(line_ranges(&[12, 2, 3, 4, 5, 9, 13]), "2-5, 9, 12-13");
        assert_eq!(line_ranges(&[7]), "7");
        assert_eq!(line_ranges(&[]), "");
    }
}
