//! Checks against handbook worked examples and published catalogues.

use transit_parallax::geometry::contacts::Contact;
use transit_parallax::time::iso::format_utc;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transits_in_years, Planet};

fn hms_to_seconds(h: f64, m: f64, s: f64) -> f64 {
    h * 3600.0 + m * 60.0 + s
}

#[test]
fn mean_and_apparent_sidereal_time_match_meeus_example_12a() {
    // Source: J. Meeus, Astronomical Algorithms, 2nd ed. (1998), Example 12.a: 1987 April 10,
    // 0h UT: mean sidereal time 13h10m46.3668s, apparent 13h10m46.1351s. The IAU 2006/2000A
    // expressions used here differ from the book's IAU 1982/1980 ones by a few milliseconds.
    let ut1 = (2_446_895.5, 0.0);
    let tt = (2_446_895.5, 55.0 / 86_400.0);
    let gmst = erfa::time::gmst06(ut1.0, ut1.1, tt.0, tt.1);
    let gast = erfa::time::gst06a(ut1.0, ut1.1, tt.0, tt.1);
    let to_s = |rad: f64| rad.to_degrees() / 15.0 * 3600.0;
    assert!((to_s(gmst) - hms_to_seconds(13.0, 10.0, 46.3668)).abs() < 0.01);
    assert!((to_s(gast) - hms_to_seconds(13.0, 10.0, 46.1351)).abs() < 0.02);
}

#[test]
fn mean_sidereal_time_matches_meeus_example_12b() {
    // Source: J. Meeus, Astronomical Algorithms, 2nd ed., Example 12.b: 1987 April 10,
    // 19h21m00s UT: mean sidereal time 8h34m57.0896s.
    let frac = hms_to_seconds(19.0, 21.0, 0.0) / 86_400.0;
    let gmst = erfa::time::gmst06(2_446_895.5, frac, 2_446_895.5, frac + 55.0 / 86_400.0);
    let s = gmst.to_degrees() / 15.0 * 3600.0;
    assert!((s - hms_to_seconds(8.0, 34.0, 57.0896)).abs() < 0.01);
}

#[test]
fn the_list_of_venus_transits_1600_2300_is_complete() {
    // From memory (shared/references.md, [M]): greatest transit dates, UT, 1600-2300.
    let expected = [
        "1631-12-07",
        "1639-12-04",
        "1761-06-06",
        "1769-06-03",
        "1874-12-09",
        "1882-12-06",
        "2004-06-08",
        "2012-06-06",
        "2117-12-11",
        "2125-12-08",
        "2247-06-11",
        "2255-06-09",
    ];
    let events = transits_in_years(Planet::Venus, 1600, 2300, &TimeModel::default()).unwrap();
    let dates: Vec<String> = events.iter().map(|e| e.date().to_string()).collect();
    assert_eq!(dates, expected);
}

#[test]
fn mercury_transits_2001_2100_match_the_published_list() {
    // From memory (shared/references.md, [M]): Mercury transits 2001-2100.
    let expected = [
        "2003-05-07",
        "2006-11-08",
        "2016-05-09",
        "2019-11-11",
        "2032-11-13",
        "2039-11-07",
        "2049-05-07",
        "2052-11-09",
        "2062-05-10",
        "2065-11-11",
        "2078-11-14",
        "2085-11-07",
        "2095-05-08",
        "2098-11-10",
    ];
    let events = transits_in_years(Planet::Mercury, 2001, 2100, &TimeModel::default()).unwrap();
    let dates: Vec<String> = events.iter().map(|e| e.date().to_string()).collect();
    assert_eq!(dates, expected);
}

/// (planet, year, [I, II, greatest, III, IV] as HH:MM:SS, least separation arcsec)
type Catalogue = (Planet, i32, [&'static str; 5], f64);

#[test]
fn geocentric_circumstances_match_the_published_catalogue() {
    // Source: F. Espenak's NASA catalogues of transits of Mercury and Venus, as collected in
    // shared/references.md (Mercury rows [P]; Venus rows with times from memory [M]). The
    // catalogue uses its own radii and Delta T, so the tolerance is 10 s and 1 arcsec.
    let cases: [Catalogue; 4] = [
        (
            Planet::Venus,
            2004,
            ["05:13:29", "05:32:55", "08:19:44", "11:06:33", "11:25:59"],
            626.9,
        ),
        (
            Planet::Venus,
            2012,
            ["22:09:38", "22:27:34", "01:29:36", "04:31:39", "04:49:35"],
            554.4,
        ),
        (
            Planet::Mercury,
            2016,
            ["11:12:19", "11:15:31", "14:57:26", "18:39:14", "18:42:26"],
            318.5,
        ),
        (
            Planet::Mercury,
            2019,
            ["12:35:27", "12:37:08", "15:19:48", "18:02:33", "18:04:14"],
            75.9,
        ),
    ];
    let secs = |t: &str| {
        let p: Vec<f64> = t.split(':').map(|x| x.parse().unwrap()).collect();
        hms_to_seconds(p[0], p[1], p[2])
    };
    for (planet, year, times, sep) in cases {
        let ev = &transits_in_years(planet, year, year, &TimeModel::default()).unwrap()[0];
        assert!(
            (ev.min_separation_arcsec - sep).abs() < 1.0,
            "{year}: {}",
            ev.min_separation_arcsec
        );
        let mut got: Vec<String> = Contact::ALL
            .iter()
            .map(|c| {
                format_utc(ev.label(ev.geocentric_hours[c.index()].unwrap()), 0)[11..19].to_string()
            })
            .collect();
        got.insert(2, ev.greatest_utc()[11..19].to_string());
        for (g, e) in got.iter().zip(times) {
            let mut d = (secs(g) - secs(e)).abs();
            if d > 43_200.0 {
                d = 86_400.0 - d;
            }
            assert!(d < 10.0, "{planet} {year}: {g} vs {e}");
        }
    }
}

#[test]
fn venus_moves_across_the_sun_at_about_4_arcsec_per_minute() {
    // Facts of the trade (shared/references.md, computed from the catalogue): about 4"/min.
    let ev = &transits_in_years(Planet::Venus, 2012, 2012, &TimeModel::default()).unwrap()[0];
    let offset = |h: f64| {
        let unit = |v: [f64; 3]| {
            let n = (v[0] * v[0] + v[1] * v[1] + v[2] * v[2]).sqrt();
            [v[0] / n, v[1] / n, v[2] / n]
        };
        let s = unit(ev.elements.sun_earth_radii(h));
        let p = unit(ev.elements.planet_earth_radii(h));
        [p[0] - s[0], p[1] - s[1], p[2] - s[2]]
    };
    let (a, b) = (offset(-0.5), offset(0.5));
    let d = ((a[0] - b[0]).powi(2) + (a[1] - b[1]).powi(2) + (a[2] - b[2]).powi(2)).sqrt();
    let arcsec_per_min = d.to_degrees() * 3600.0 / 60.0;
    assert!((arcsec_per_min - 4.0).abs() < 0.3, "{arcsec_per_min}");
}
