//! Delta T against an outside source: Skyfield 1.53's own Delta T (the cubic spline of Morrison,
//! Stephenson, Hohenkerk and Zawilski 2021 before 1973, its daily IERS table after), in
//! tests/reference/delta_t_skyfield.csv, made by tools/fit_delta_t.py.

use transit_parallax::time::delta_t::{delta_t_estimate, DeltaTBasis};

fn rows() -> Vec<(String, f64, f64)> {
    let path = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/reference/delta_t_skyfield.csv"
    );
    let text = std::fs::read_to_string(path).unwrap();
    text.lines()
        .filter(|l| !l.starts_with('#') && !l.starts_with("date"))
        .map(|l| {
            let f: Vec<&str> = l.split(',').collect();
            (
                f[0].to_string(),
                f[1].parse().unwrap(),
                f[2].parse().unwrap(),
            )
        })
        .collect()
}

/// Source: Skyfield 1.53 (tests/reference/delta_t_skyfield.csv). Before 1973 both evaluate
/// the same published spline, so they agree to the fixture's rounding (0.0001 s); after, the
/// tool interpolates monthly IERS values where Skyfield keeps daily ones (0.0067 s at worst,
/// measured by tools/fit_delta_t.py), and Skyfield's table holds predictions near its end.
#[test]
fn delta_t_agrees_with_skyfield() {
    let rows = rows();
    assert!(rows.len() > 50);
    for (date, year, skyfield) in rows {
        let e = delta_t_estimate(year);
        let tolerance = if year < 1973.0 { 2e-4 } else { 0.03 };
        assert!(
            (e.delta_t_s - skyfield).abs() < tolerance,
            "{date}: {} vs Skyfield {skyfield}",
            e.delta_t_s
        );
        assert!(e.sigma_s > 0.0, "{date}");
    }
}

/// The acceptance of the Delta T item: 1769 within 1 s of the 2021 reconstruction (Skyfield's
/// value of it, 20.5987 s) with a sigma of at least the authors' published figure there (1 s
/// in 1770, 2 s in 1760: http://astro.ukho.gov.uk/nao/lvm/, via tools/fit_delta_t.py).
#[test]
fn delta_t_of_1769_is_the_reconstruction_with_its_published_uncertainty() {
    let e = delta_t_estimate(1769.425052);
    assert_eq!(e.basis, DeltaTBasis::Reconstruction);
    assert!((e.delta_t_s - 20.5987).abs() < 1.0, "{e:?}");
    assert!(e.sigma_s >= 1.0, "{e:?}");
}
