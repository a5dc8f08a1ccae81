//! Small 3-vector helpers (plain arrays, so the ERFA matrices fit without conversion).

/// A 3-vector.
pub type V3 = [f64; 3];

/// Dot product.
#[inline]
pub fn dot(a: V3, b: V3) -> f64 {
    a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
}

/// Euclidean length.
#[inline]
pub fn norm(a: V3) -> f64 {
    dot(a, a).sqrt()
}

/// a - b.
#[inline]
pub fn sub(a: V3, b: V3) -> V3 {
    [a[0] - b[0], a[1] - b[1], a[2] - b[2]]
}

/// a + b.
#[inline]
pub fn add(a: V3, b: V3) -> V3 {
    [a[0] + b[0], a[1] + b[1], a[2] + b[2]]
}

/// s a.
#[inline]
pub fn scale(s: f64, a: V3) -> V3 {
    [s * a[0], s * a[1], s * a[2]]
}

/// a / |a|.
#[inline]
pub fn unit(a: V3) -> V3 {
    scale(1.0 / norm(a), a)
}

/// Matrix times vector, m given by rows.
#[inline]
pub fn mat_vec(m: [[f64; 3]; 3], v: V3) -> V3 {
    [dot(m[0], v), dot(m[1], v), dot(m[2], v)]
}

/// Angle between two vectors in radians, accurate at small and large angles
/// (atan2 of the cross and dot products).
pub fn angle_between(a: V3, b: V3) -> f64 {
    let c = [
        a[1] * b[2] - a[2] * b[1],
        a[2] * b[0] - a[0] * b[2],
        a[0] * b[1] - a[1] * b[0],
    ];
    norm(c).atan2(dot(a, b))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn small_angles_are_accurate() {
        let a = [1.0, 0.0, 0.0];
        let b = [1.0, 1e-9, 0.0];
        assert!((angle_between(a, b) - 1e-9).abs() < 1e-20);
        assert!((angle_between(a, [-1.0, 0.0, 0.0]) - std::f64::consts::PI).abs() < 1e-15);
    }
}
