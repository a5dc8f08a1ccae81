//! The sensitivity of contact times to the solar parallax (from the elements, by implicit
//! differentiation) against central finite differences of the full model, in which the
//! station's distance from the Earth's centre in au follows the parallax.
//! Requirement: agreement within 1 % (common practice for an analytic derivative, no source).

use proptest::prelude::*;
use transit_parallax::geometry::contacts::{full_model_contact, Contact};
use transit_parallax::sky::constants::nominal_parallax_arcsec;
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet, Station, TransitEvent};

fn check(ev: &TransitEvent, st: &Station, contact: Contact) -> Option<(f64, f64)> {
    let geo = st.geocentric();
    let c = ev.predict(st).contacts[contact.index()]?;
    let start = ev.elements.instant(c.hours);
    let model = *ev.time_model();
    let h = 0.05; // arcsec
    let pi0 = nominal_parallax_arcsec();
    let plus = full_model_contact(ev.planet, Some(&geo), contact, start, &model, pi0 + h)?;
    let minus = full_model_contact(ev.planet, Some(&geo), contact, start, &model, pi0 - h)?;
    Some((
        c.sensitivity_s_per_arcsec,
        plus.seconds_since(minus) / (2.0 * h),
    ))
}

fn event(planet: Planet, date: &str) -> TransitEvent {
    transit_on_date(planet, parse_date(date).unwrap(), &TimeModel::default()).unwrap()
}

#[test]
fn fixed_stations_venus_2012_and_mercury_2016() {
    let cases = [
        (Planet::Venus, "2012-06-06", 70.98, 25.97),
        (Planet::Venus, "2012-06-06", -33.87, 151.21),
        (Planet::Venus, "2012-06-06", 19.82, -155.47),
        (Planet::Mercury, "2016-05-09", 51.48, 0.0),
        (Planet::Mercury, "2016-05-09", -33.45, -70.67),
    ];
    for (planet, date, lat, lon) in cases {
        let ev = event(planet, date);
        let st = Station::new("s", lat, lon, 0.0).unwrap();
        for c in Contact::ALL {
            let (analytic, fd) = check(&ev, &st, c).expect("contact exists");
            // 1 % of the value, with a floor of 0.02 s/arcsec where the sensitivity is near 0.
            let tol = (0.01 * fd.abs()).max(0.02);
            assert!(
                (analytic - fd).abs() < tol,
                "{date} ({lat},{lon}) {c:?}: {analytic} vs {fd}"
            );
        }
    }
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 6, ..ProptestConfig::default() })]
    #[test]
    fn random_stations_venus_2004(lat in -70.0f64..70.0, lon in -180.0f64..180.0, c in 0usize..4) {
        let ev = event(Planet::Venus, "2004-06-08");
        let st = Station::new("s", lat, lon, 0.0).unwrap();
        if let Some((analytic, fd)) = check(&ev, &st, Contact::ALL[c]) {
            let tol = (0.01 * fd.abs()).max(0.02);
            prop_assert!((analytic - fd).abs() < tol, "{} vs {}", analytic, fd);
        }
    }
}
