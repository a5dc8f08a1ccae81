//! Contour lines of a field sampled on a regular grid, by marching squares: each cell of four
//! samples is classed by which corners lie at or above the level, and the line crosses the
//! cell's edges where the level falls between two corners, at the point found by linear
//! interpolation along that edge. Cells with a missing corner are skipped, so lines stop at the
//! edge of the data. The ambiguous saddle cells (two opposite corners above) are resolved by
//! the mean of the four corners.
//!
//! References: W. E. Lorensen and H. E. Cline, "Marching cubes: a high resolution 3D surface
//! construction algorithm", Computer Graphics 21(4), 163-169 (1987), of which marching squares
//! is the two-dimensional case; saddle resolution by the cell mean as in G. M. Nielson and
//! B. Hamann, "The asymptotic decider", Proc. IEEE Visualization '91, 83-91 (1991), in its
//! simplest (mean-value) form.

use std::collections::HashMap;

/// A point in grid coordinates: (column, row), fractional between samples.
pub type GridXy = (f64, f64);

/// A field of samples, row by row, `None` where there is no value.
pub struct Field<'a> {
    /// The samples, `rows * columns` of them, row by row.
    pub values: &'a [Option<f64>],
    /// Number of rows.
    pub rows: usize,
    /// Number of columns.
    pub columns: usize,
}

impl Field<'_> {
    fn get(&self, row: usize, column: usize) -> Option<f64> {
        self.values
            .get(row * self.columns + column)
            .copied()
            .flatten()
            .filter(|v| v.is_finite())
    }
}

/// The segments of the contour at `level`, each a pair of points in grid coordinates.
pub fn contour_segments(field: &Field, level: f64) -> Vec<[GridXy; 2]> {
    let mut out = Vec::new();
    for r in 0..field.rows.saturating_sub(1) {
        for c in 0..field.columns.saturating_sub(1) {
            let (Some(a), Some(b), Some(d), Some(e)) = (
                field.get(r, c),
                field.get(r, c + 1),
                field.get(r + 1, c + 1),
                field.get(r + 1, c),
            ) else {
                continue;
            };
            cell_segments([a, b, d, e], (c as f64, r as f64), level, &mut out);
        }
    }
    out
}

/// The segments inside one cell whose corners, clockwise from the top left (row r, column c),
/// hold `v`; `origin` is (c, r).
fn cell_segments(v: [f64; 4], origin: GridXy, level: f64, out: &mut Vec<[GridXy; 2]>) {
    let above = |k: usize| v[k] >= level;
    let case = (0..4).fold(0usize, |acc, k| acc | (usize::from(above(k)) << k));
    if case == 0 || case == 15 {
        return;
    }
    let (x, y) = origin;
    let frac = |p: f64, q: f64| {
        if (q - p).abs() < f64::MIN_POSITIVE {
            0.5
        } else {
            ((level - p) / (q - p)).clamp(0.0, 1.0)
        }
    };
    // The crossing on each edge: 0 top (0-1), 1 right (1-2), 2 bottom (3-2), 3 left (0-3).
    let edge = |k: usize| -> GridXy {
        match k {
            0 => (x + frac(v[0], v[1]), y),
            1 => (x + 1.0, y + frac(v[1], v[2])),
            2 => (x + frac(v[3], v[2]), y + 1.0),
            _ => (x, y + frac(v[0], v[3])),
        }
    };
    // Edge k joins corners k and k + 1, clockwise: 0 top, 1 right, 2 bottom, 3 left.
    let crossed: Vec<usize> = (0..4).filter(|&k| above(k) != above((k + 1) % 4)).collect();
    match crossed.as_slice() {
        [p, q] => out.push([edge(*p), edge(*q)]),
        [_, _, _, _] => {
            // A saddle: the corners above are opposite. Join the edges round the corners that
            // the cell's mean puts on their own.
            let mean_above = v.iter().sum::<f64>() / 4.0 >= level;
            if above(0) == mean_above {
                // Corners 1 and 3 stand apart: cut them off.
                out.push([edge(0), edge(1)]);
                out.push([edge(2), edge(3)]);
            } else {
                out.push([edge(3), edge(0)]);
                out.push([edge(1), edge(2)]);
            }
        }
        _ => {}
    }
}

/// The segments joined into polylines where their ends meet (shared cell edges give
/// identical end points); a closed line repeats its first point at the end.
pub fn join_segments(segments: &[[GridXy; 2]]) -> Vec<Vec<GridXy>> {
    let key = |p: GridXy| ((p.0 * 1e6).round() as i64, (p.1 * 1e6).round() as i64);
    let mut ends: HashMap<(i64, i64), Vec<usize>> = HashMap::new();
    for (i, s) in segments.iter().enumerate() {
        ends.entry(key(s[0])).or_default().push(i);
        ends.entry(key(s[1])).or_default().push(i);
    }
    let mut used = vec![false; segments.len()];
    let mut lines = Vec::new();
    for start in 0..segments.len() {
        if used[start] {
            continue;
        }
        used[start] = true;
        let mut line = vec![segments[start][0], segments[start][1]];
        // Grow forward from the last point, then backward from the first.
        for forward in [true, false] {
            loop {
                let tip = if forward {
                    line[line.len() - 1]
                } else {
                    line[0]
                };
                let next = ends
                    .get(&key(tip))
                    .and_then(|c| c.iter().copied().find(|&i| !used[i]));
                let Some(i) = next else { break };
                used[i] = true;
                let s = segments[i];
                let far = if key(s[0]) == key(tip) { s[1] } else { s[0] };
                if forward {
                    line.push(far);
                } else {
                    line.insert(0, far);
                }
            }
        }
        lines.push(line);
    }
    lines
}

/// Contour lines of `field` at `level`, as polylines in grid coordinates.
pub fn contour_lines(field: &Field, level: f64) -> Vec<Vec<GridXy>> {
    join_segments(&contour_segments(field, level))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A cone: the distance from the centre of a 21 x 21 grid.
    fn cone() -> Vec<Option<f64>> {
        (0..21 * 21)
            .map(|k| {
                let (r, c) = ((k / 21) as f64 - 10.0, (k % 21) as f64 - 10.0);
                Some((r * r + c * c).sqrt())
            })
            .collect()
    }

    #[test]
    fn a_cone_gives_one_closed_circle_of_the_right_radius() {
        // Source: geometry of the field itself; the linear interpolation along a cell edge
        // errs from the true circle by under 0.1 grid units at radius 6 (chord sag).
        let values = cone();
        let field = Field {
            values: &values,
            rows: 21,
            columns: 21,
        };
        let lines = contour_lines(&field, 6.0);
        assert_eq!(lines.len(), 1, "{lines:?}");
        let line = &lines[0];
        assert_eq!(line.first(), line.last(), "closed");
        for &(x, y) in line {
            let r = ((x - 10.0).powi(2) + (y - 10.0).powi(2)).sqrt();
            assert!((r - 6.0).abs() < 0.1, "radius {r}");
        }
    }

    #[test]
    fn a_plane_gives_a_straight_line_where_expected() {
        // v = column: the level 2.25 is the vertical line x = 2.25, exactly.
        let values: Vec<Option<f64>> = (0..5 * 6).map(|k| Some((k % 6) as f64)).collect();
        let field = Field {
            values: &values,
            rows: 5,
            columns: 6,
        };
        let lines = contour_lines(&field, 2.25);
        assert_eq!(lines.len(), 1);
        assert_eq!(lines[0].len(), 5);
        assert!(lines[0].iter().all(|p| (p.0 - 2.25).abs() < 1e-12));
    }

    #[test]
    fn missing_samples_stop_the_line() {
        let mut values: Vec<Option<f64>> = (0..5 * 6).map(|k| Some((k % 6) as f64)).collect();
        values[2 * 6 + 2] = None;
        let field = Field {
            values: &values,
            rows: 5,
            columns: 6,
        };
        let lines = contour_lines(&field, 2.25);
        // The two cells beside the missing sample are skipped: the line breaks in two.
        assert_eq!(lines.len(), 2, "{lines:?}");
        assert!(lines.iter().all(|l| l.iter().all(|p| p.0.is_finite())));
    }

    #[test]
    fn a_saddle_cell_gives_two_segments() {
        // Row-major 2 x 2: (0,0) = 1, (0,1) = 0, (1,0) = 0, (1,1) = 1.
        let values = [Some(1.0), Some(0.0), Some(0.0), Some(1.0)];
        let field = Field {
            values: &values,
            rows: 2,
            columns: 2,
        };
        assert_eq!(contour_segments(&field, 0.5).len(), 2);
        // The mean (0.5) is at the level: the corners above are joined, the others cut off.
        assert_eq!(contour_segments(&field, 0.4).len(), 2);
    }
}
