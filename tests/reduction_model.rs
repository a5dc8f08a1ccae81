//! The reduction's model: partial derivatives against re-solved contacts (property test),
//! recovery of known parameters, identifiability warnings, and hostile observation files.

use proptest::prelude::*;
use rand::SeedableRng;
use rand_chacha::ChaCha8Rng;
use std::path::Path;
use transit_parallax::geometry::contacts::{contact_partials, Perturbation};
use transit_parallax::observations::csv_table::CsvTable;
use transit_parallax::observations::timings::observations_from_table;
use transit_parallax::planning::simulation::{simulate_campaign, SimulationSettings};
use transit_parallax::reduction::{reduce, ReduceOptions};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Contact, Planet, Station, TransitEvent};

fn venus_2012() -> TransitEvent {
    transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap(),
        &TimeModel::default(),
    )
    .unwrap()
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 24, ..ProptestConfig::default() })]
    /// Implicit-differentiation partials against central differences of the re-solved contact
    /// (common practice for analytic derivatives, no source): 0.1 % or 1e-6 h.
    #[test]
    fn partials_match_central_differences(lat in -60.0f64..60.0, lon in -180.0f64..180.0, c in 0usize..4,
                                           s in 0.9f64..1.1, dx in -1e-3f64..1e-3, dl in -1e-3f64..1e-3) {
        let ev = venus_2012();
        let geo = Station::new("p", lat, lon, 0.0).unwrap().geocentric();
        let contact = Contact::ALL[c];
        let base = Perturbation { length_scale: s, dx_er: dx, dy_er: -dx, dl_ext_er: dl, dl_int_er: -dl };
        let Some(h0) = ev.contact_hours_perturbed(&geo, contact, &base) else { return Ok(()) };
        let d = contact_partials(&ev.elements, Some(&geo), contact, h0, &base);
        let solve = |p: Perturbation| ev.contact_hours_perturbed(&geo, contact, &p).unwrap();
        let check = |analytic: f64, plus: Perturbation, minus: Perturbation, step: f64| {
            let fd = (solve(plus) - solve(minus)) / (2.0 * step);
            (analytic - fd).abs() <= 1e-3 * fd.abs() + 1e-6
        };
        let e = 1e-6;
        let scale_ok = check(d.per_scale_h, Perturbation { length_scale: s + e, ..base }, Perturbation { length_scale: s - e, ..base }, e);
        let dx_ok = check(d.per_dx_h, Perturbation { dx_er: dx + e, ..base }, Perturbation { dx_er: dx - e, ..base }, e);
        let dy_ok = check(d.per_dy_h, Perturbation { dy_er: -dx + e, ..base }, Perturbation { dy_er: -dx - e, ..base }, e);
        let dl_ok = if contact.is_exterior() {
            check(d.per_dl_h, Perturbation { dl_ext_er: dl + e, ..base }, Perturbation { dl_ext_er: dl - e, ..base }, e)
        } else {
            check(d.per_dl_h, Perturbation { dl_int_er: -dl + e, ..base }, Perturbation { dl_int_er: -dl - e, ..base }, e)
        };
        prop_assert!(scale_ok && dx_ok && dy_ok && dl_ok, "scale {} dx {} dy {} dl {}", scale_ok, dx_ok, dy_ok, dl_ok);
    }
}

fn reduce_stations(
    ev: &TransitEvent,
    stations: &[Station],
    sigma: f64,
    seed: u64,
    only: Option<Contact>,
) -> transit_parallax::reduction::Reduction {
    let settings = SimulationSettings {
        sigma_s: [sigma; 4],
        ..SimulationSettings::default()
    };
    let mut rng = ChaCha8Rng::seed_from_u64(seed);
    let mut camp = simulate_campaign(ev, stations, &settings, &mut rng);
    if let Some(c) = only {
        camp.observations.valid.retain(|o| o.contact == c);
        camp.observations.rows_total = camp.observations.valid.len();
    }
    let options = ReduceOptions {
        event: Some((ev.planet, ev.date())),
        ..ReduceOptions::default()
    };
    reduce(camp.observations, &options).unwrap()
}

#[test]
fn noise_free_timings_recover_the_nominal_parallax_exactly() {
    let ev = venus_2012();
    let stations: Vec<Station> = [
        (64.0, -150.0),
        (-35.0, 150.0),
        (20.0, -156.0),
        (35.0, 135.0),
        (-45.0, 170.0),
        (60.0, 25.0),
        (1.3, 103.8),
    ]
    .iter()
    .enumerate()
    .map(|(i, (la, lo))| Station::new(&format!("s{i}"), *la, *lo, 0.0).unwrap())
    .collect();
    let red = reduce_stations(&ev, &stations, 1e-3, 1, None);
    let pi = red.parallax_arcsec.unwrap();
    assert!(
        (pi - transit_parallax::sky::constants::nominal_parallax_arcsec()).abs() < 1e-5,
        "{pi}"
    );
    assert!(red.warnings.is_empty(), "{:?}", red.warnings);
}

#[test]
fn one_station_is_named_as_the_reason() {
    let ev = venus_2012();
    let st = [Station::new("alone", -35.0, 150.0, 0.0).unwrap()];
    let red = reduce_stations(&ev, &st, 5.0, 2, None);
    let text = red.warnings.join(" ");
    assert!(text.contains("one station"), "{text}");
    assert!(
        text.contains("Halley") && text.contains("Delisle"),
        "{text}"
    );
    assert!(
        red.parameters.iter().any(|p| p.fixed),
        "some parameter must be held fixed"
    );
}

#[test]
fn stations_close_together_are_named_as_the_reason() {
    let ev = venus_2012();
    let stations: Vec<Station> = (0..6)
        .map(|i| {
            Station::new(
                &format!("c{i}"),
                -33.8 + 0.1 * i as f64,
                151.0 + 0.1 * i as f64,
                0.0,
            )
            .unwrap()
        })
        .collect();
    let red = reduce_stations(&ev, &stations, 5.0, 3, None);
    let text = red.warnings.join(" ");
    assert!(
        text.contains("within") && text.contains("km of each other"),
        "{text}"
    );
}

#[test]
fn a_single_kind_of_contact_fixes_the_other_radius_correction() {
    let ev = venus_2012();
    let stations: Vec<Station> = [
        (64.0, -150.0),
        (-35.0, 150.0),
        (20.0, -156.0),
        (35.0, 135.0),
        (-45.0, 170.0),
    ]
    .iter()
    .enumerate()
    .map(|(i, (la, lo))| Station::new(&format!("s{i}"), *la, *lo, 0.0).unwrap())
    .collect();
    let red = reduce_stations(&ev, &stations, 5.0, 4, Some(Contact::II));
    let text = red.warnings.join(" ");
    assert!(text.contains("no exterior contact"), "{text}");
    let fixed: Vec<&str> = red
        .parameters
        .iter()
        .filter(|p| p.fixed)
        .map(|p| p.name.as_str())
        .collect();
    assert!(fixed.contains(&"radius_sum_correction"), "{fixed:?}");
}

/// Hostile inputs: each must give a clear message or a listed rejection, never a panic.
#[test]
fn hostile_observation_files_never_panic() {
    let head = "station,latitude,longitude,elevation_m,contact,time_utc,sigma_s\n";
    let cases: Vec<(String, &str)> = vec![
        (
            format!("{head}a,NaN,20,0,2,2012-06-05T22:30:00Z,5\n"),
            "latitude",
        ),
        (
            format!("{head}a,10,inf,0,2,2012-06-05T22:30:00Z,5\n"),
            "longitude",
        ),
        (
            format!("{head}a,10,20,1e309,2,2012-06-05T22:30:00Z,5\n"),
            "elevation",
        ),
        (
            format!("{head}a,10,20,0,2,2012-13-45T22:30:00Z,5\n"),
            "no such day",
        ),
        (
            format!("{head}a,10,20,0,2,2012-06-05T22:30:00Z,0\n"),
            "sigma_s",
        ),
        (
            format!("{head}a,10,20,0,2,99999-06-05T22:30:00Z,5\n"),
            "the year 99999 is outside 1600-2300",
        ),
        (
            format!("{head}\"unterminated,10,20,0,2,2012-06-05T22:30:00Z,5\n"),
            "",
        ),
        (format!("{head}a,10\n"), ""),
        (format!("{head},,,,,,\n"), ""),
        (
            format!("{head}<script>alert(1)</script>,10,20,0,2,2012-06-05T22:30:00Z,5\n"),
            "",
        ),
        (
            format!("{head}a,10,20,0,2,1500-06-05T22:30:00Z,5\n"),
            "1500",
        ),
    ];
    // The columns of records as the 18th and 19th centuries wrote them, each with a bad value
    // (and the sentence that must name it).
    let hist = "station,latitude,longitude,contact,time_utc,time_local,local_time,day_reckoning,observer,calendar,meridian,time_meridian,duration,contact_judged\n";
    let ok_local = "1769-06-03T09:34:10,apparent,astronomical";
    let historical: Vec<(String, &str)> = vec![
        (
            format!("{hist}a,70°22'36\"N,31.09,2,,{ok_local},Hell,mayan,,,,\n"),
            "not a calendar",
        ),
        (
            format!("{hist}a,70°22'36\"N,31.09,2,,{ok_local},Hell,,atlantis,,,\n"),
            "not a prime meridian",
        ),
        (
            format!("{hist}a,70°22'36\"N,31.09,2,,{ok_local},Hell,,,noon,,\n"),
            "not a meridian for the clock",
        ),
        (
            format!("{hist}a,70°22'36\"N,31.09,2,,{ok_local},Hell,,,,,blob\n"),
            "not a judgement",
        ),
        (
            format!("{hist}a,70°72'36\"N,31.09,2,,{ok_local},Hell,,,,,\n"),
            "under 60",
        ),
        (
            format!("{hist}a,70°22'36\"E,31.09,2,,{ok_local},Hell,,,,,\n"),
            "write N or S",
        ),
        (
            format!("{hist}a,70.3,25h0m0sE,2,,{ok_local},Hell,,,,,\n"),
            "outside",
        ),
        (
            format!("{hist}a,70.3,-5 32 30 W,2,,{ok_local},Hell,,,,,\n"),
            "minus sign",
        ),
        (
            format!("{hist}a,70.3,31.09,3-2,,,,,Hell,,,,5:53:14,\n"),
            "write 2-3",
        ),
        (
            format!("{hist}a,70.3,31.09,2-3,,,,,Hell,,,,five hours,\n"),
            "not a duration",
        ),
        (
            format!("{hist}a,70.3,31.09,2-3,,,,,Hell,,,,-5:53:14,\n"),
            "not a duration",
        ),
        (
            format!("{hist}a,70.3,31.09,2-3,,1769-06-03T09:34:10,,,Hell,,,,5:53:14,\n"),
            "date alone",
        ),
        (
            format!("{hist}a,70.3,31.09,2-3,,,sidereal,,Hell,,,,5:53:14,\n"),
            "not a kind of local time",
        ),
        (
            format!("{hist}a,70.3,31.09,2,,1769-06-03T09:34:14/09:34:10,apparent,,Hell,,,,,\n"),
            "ends before",
        ),
        (
            format!("{hist}a,70.3,31.09,2,,1769-06-03T09:00:00/11:00:00,apparent,,Hell,,,,,\n"),
            "more than an hour",
        ),
        (
            format!("{hist}a,70.3,31.09,2,,1701-02-29T09:00:00,apparent,,Hell,julian,,,,\n"),
            "Julian calendar",
        ),
        (
            format!("{hist}a,70.3,31.09,2,1769-06-03T19:34:10Z,,,,Hell,,,greenwich,,\n"),
            "time_meridian applies",
        ),
        (
            format!("{hist}a,70.3,31.09,2,,1769-06-03T09:34:10,apparent,,Hell,,,,PT5X,\n"),
            "pair of contacts",
        ),
    ];
    for (text, needle) in cases.into_iter().chain(historical) {
        let table = match CsvTable::from_bytes(Path::new("h.csv"), text.as_bytes()) {
            Ok(t) => t,
            Err(e) => {
                assert!(e.to_string().contains("h.csv:"), "{e}");
                continue;
            }
        };
        match observations_from_table(&table, false) {
            Err(e) => assert!(e.to_string().contains("h.csv"), "{e}"),
            Ok(set) => {
                let all: String = set
                    .rejected
                    .iter()
                    .filter_map(|r| r.diagnosis.clone())
                    .collect();
                assert!(all.contains(needle), "{text}: {all}");
                assert!(set.rejected.iter().all(|r| r.line == 2 || r.line == 0));
                let _ = reduce(
                    set,
                    &ReduceOptions {
                        event: Some((Planet::Venus, parse_date("2012-06-06").unwrap())),
                        ..ReduceOptions::default()
                    },
                );
            }
        }
    }
}
