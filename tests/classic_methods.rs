//! Halley's and Delisle's methods beside the full solution: what each is immune to, what each
//! needs, and that neither claims more than the full solution knows (common practice of the
//! trade: Halley's durations cancel a station's clock, Delisle's single contacts need the
//! longitude; E. Halley, Phil. Trans. 29, 454 (1716); J.-N. Delisle (1760), cited from memory).

mod common;

use common::{data, err, out, run};
use rand::SeedableRng;
use transit_parallax::observations::longitude::LongitudeKnowledge;
use transit_parallax::planning::simulation::{
    global_stations, simulate_campaign, stations_seeing, SimulationSettings,
};
use transit_parallax::reduction::classic_methods::{Method, MethodSolution};
use transit_parallax::reduction::{reduce_for_event, ReduceOptions, Reduction};
use transit_parallax::time::iso::parse_date;
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet, TransitEvent};

fn event_2012() -> TransitEvent {
    transit_on_date(
        Planet::Venus,
        parse_date("2012-06-06").unwrap(),
        &TimeModel::default(),
    )
    .unwrap()
}

fn method(red: &Reduction, m: Method) -> &MethodSolution {
    red.methods.iter().find(|x| x.method == m).unwrap()
}

fn campaign(event: &TransitEvent) -> transit_parallax::planning::simulation::SimulatedCampaign {
    let net: Vec<_> = stations_seeing(event, global_stations(200, "m"), 3, 5.0)
        .into_iter()
        .take(24)
        .collect();
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(2012);
    simulate_campaign(event, &net, &SimulationSettings::default(), &mut rng)
}

fn reduce(
    event: &TransitEvent,
    set: transit_parallax::observations::timings::ObservationSet,
) -> Reduction {
    reduce_for_event(set, event.clone(), &ReduceOptions::default()).unwrap()
}

/// A station whose clock is off by a few seconds (too little to be rejected) moves the full
/// solution and Delisle's, and leaves Halley's exactly where it was.
#[test]
fn halley_is_immune_to_a_station_clock() {
    let event = event_2012();
    let camp = campaign(&event);
    let before = reduce(&event, camp.observations.clone());
    let mut shifted = camp.observations.clone();
    let name = shifted.valid[0].station.name.clone();
    for o in shifted.valid.iter_mut().filter(|o| o.station.name == name) {
        o.time_label += chrono::TimeDelta::seconds(7);
    }
    let after = reduce(&event, shifted);
    assert_eq!(before.timings_used, after.timings_used);
    let h = |r: &Reduction| method(r, Method::Halley).parallax_arcsec.unwrap();
    let d = |r: &Reduction| method(r, Method::Delisle).parallax_arcsec.unwrap();
    eprintln!(
        "Halley {} -> {}, Delisle {} -> {}, full {:?} -> {:?}",
        h(&before),
        h(&after),
        d(&before),
        d(&after),
        before.parallax_arcsec,
        after.parallax_arcsec
    );
    assert!((h(&before) - h(&after)).abs() < 1e-6);
    assert!((d(&before) - d(&after)).abs() > 1e-4);
    assert!((before.parallax_arcsec.unwrap() - after.parallax_arcsec.unwrap()).abs() > 1e-4);
}

/// Neither classic method claims a smaller uncertainty than the full solution unless its
/// note names the assumption that buys it (Delisle's: the same shift of a contact at every
/// station; E. Halley 1716 and J.-N. Delisle 1753, as docs/reduction.md sets them out).
#[test]
fn neither_method_beats_the_full_solution_without_saying_why() {
    let event = event_2012();
    let red = reduce(&event, campaign(&event).observations);
    let full = red.parallax_sigma_arcsec.unwrap();
    for m in [Method::Halley, Method::Delisle] {
        let sol = method(&red, m);
        let s = sol.parallax_sigma_arcsec.unwrap();
        if s < full {
            let note = sol.note.as_deref().unwrap_or("");
            assert!(
                note.contains("only because it assumes"),
                "{m:?}: {s} < {full}: {note}"
            );
        }
        assert!(sol.difference_sd_arcsec.is_some_and(|d| d > 0.0), "{sol:?}");
    }
    assert_eq!(
        method(&red, Method::ConditionEquations).parallax_sigma_arcsec,
        Some(full)
    );
}

/// Delisle's method leaves out every station whose longitude is not taken as exact; Halley's
/// leaves out stations with a single timing.
#[test]
fn each_method_counts_only_the_timings_it_can_use() {
    let event = event_2012();
    let mut set = campaign(&event).observations;
    let doubtful = set.valid[0].station.name.clone();
    for o in set.valid.iter_mut().filter(|o| o.station.name == doubtful) {
        o.longitude = LongitudeKnowledge::Sigma(0.1);
    }
    // One more station that timed a single contact.
    let mut single = set.valid[5].clone();
    single.station.name = "single contact station".into();
    single.line = 999;
    set.valid.push(single);
    let n_doubtful = set
        .valid
        .iter()
        .filter(|o| o.station.name == doubtful)
        .count();
    let red = reduce(&event, set);
    let full = method(&red, Method::ConditionEquations);
    let delisle = method(&red, Method::Delisle);
    let halley = method(&red, Method::Halley);
    assert_eq!(delisle.timings_used, full.timings_used - n_doubtful);
    assert_eq!(delisle.stations_used, full.stations_used - 1);
    assert_eq!(halley.timings_used, full.timings_used - 1);
    assert_eq!(halley.stations_used, full.stations_used - 1);
}

/// One timing, or one station: every method says why it gives nothing, in the table and the
/// JSON; no error budget is drawn up for a parallax that is not determined.
#[test]
fn thin_data_leaves_every_method_not_determined() {
    for file in ["one_station.csv", "one_timing.csv"] {
        let f = data(file);
        let o = run(&["reduce", &f, "--format", "json"]);
        assert!(o.status.success(), "{}", err(&o));
        let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap();
        let methods = v["methods"].as_array().unwrap();
        assert_eq!(methods.len(), 3, "{file}");
        for m in methods {
            assert!(m["parallax_arcsec"].is_null(), "{file}: {m}");
            assert!(m["parallax_sigma_arcsec"].is_null(), "{file}: {m}");
            assert!(m["au_km"].is_null(), "{file}: {m}");
            assert!(!m["note"].as_str().unwrap().is_empty(), "{file}: {m}");
        }
        assert!(v["error_budget"].is_null(), "{file}");
        let o = run(&["reduce", &f]);
        let text = out(&o);
        assert!(text.contains("not determined"), "{file}: {text}");
        assert!(!text.contains("Error budget"), "{file}: {text}");
    }
}
