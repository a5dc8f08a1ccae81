//! The compiled JPL windows against the JPL ephemerides themselves: 660 barycentric positions
//! (two instants per body and window, random inside each window) evaluated by `jplephem`
//! from the PyPI packages de405, de421, de422 and de423, written by tools/fit_jpl_windows.py
//! into tests/reference/jpl_windows_check.csv.

use transit_parallax::sky::constants::AU_KM;
use transit_parallax::sky::jpl_windows::{window_for, Body};
use transit_parallax::time::scales::Tt;
use transit_parallax::Planet;

#[test]
fn windows_reproduce_the_jpl_ephemerides_within_a_kilometre() {
    let text = include_str!("reference/jpl_windows_check.csv");
    let mut rdr = csv::Reader::from_reader(text.as_bytes());
    let (mut worst_km, mut n) = (0.0f64, 0usize);
    for r in rdr.records() {
        let r = r.unwrap();
        let planet = Planet::parse(&r[0]).unwrap();
        let tt = Tt::from_jd(r[2].parse().unwrap());
        let w = window_for(planet, tt).unwrap_or_else(|| panic!("no window at {}", &r[2]));
        assert_eq!(w.source, &r[1], "the ephemeris named for {}", &r[2]);
        let body = match &r[3] {
            "earth" => Body::Earth,
            "sun" => Body::Sun,
            _ => Body::Planet,
        };
        let p = w.position_au(body, tt);
        for k in 0..3 {
            let truth_km: f64 = r[4 + k].parse().unwrap();
            worst_km = worst_km.max((p[k] * AU_KM - truth_km).abs());
        }
        n += 1;
    }
    eprintln!("{n} positions, worst difference {:.3} m", worst_km * 1e3);
    // Requirement: 1 km. The fit itself is held to 2 m by the generator; the instant, given
    // to 1e-9 day (86 microseconds, 4 m of Mercury's motion), costs a few metres more.
    assert!(n >= 600 && worst_km < 1.0, "{worst_km} km");
}
