//! The worked examples reproduce: every output committed under worked-examples/ is what the
//! command shown in worked-examples/README.md prints today, byte for byte. A change that
//! alters an output on purpose regenerates the example and says why in its commit; one that
//! does not (a refactoring) must leave this test green. (Regression guard; the outputs
//! themselves are checked against outside references elsewhere.)

use std::path::{Path, PathBuf};
use std::process::Command;

fn examples() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("worked-examples")
}

/// Run the binary in `dir` and return its standard output, requiring success.
fn output_in(dir: &Path, args: &[&str]) -> String {
    let out = Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
        .current_dir(dir)
        .args(args)
        .output()
        .expect("binary runs");
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).expect("UTF-8 output")
}

fn committed(path: &Path) -> String {
    std::fs::read_to_string(path).unwrap_or_else(|e| panic!("{}: {e}", path.display()))
}

fn scratch(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("tp-worked-{}-{name}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temporary folder");
    dir
}

#[test]
fn school_network_reduction_reproduces() {
    let dir = examples().join("venus-2012-school-network");
    let timings = dir.join("timings.csv");
    let t = timings.to_str().unwrap();
    assert_eq!(
        output_in(&dir, &["reduce", t]),
        committed(&dir.join("reduction.txt"))
    );
    assert_eq!(
        output_in(&dir, &["reduce", t, "--format", "json"]),
        committed(&dir.join("reduction.json"))
    );
}

#[test]
fn mercury_2032_predictions_reproduce() {
    let dir = examples().join("mercury-2032-planning");
    let stations = dir.join("stations.csv");
    let s = stations.to_str().unwrap();
    let event = [
        "--planet",
        "mercury",
        "--date",
        "2032-11-13",
        "--stations",
        s,
    ];
    let mut args = vec!["predict"];
    args.extend(event);
    assert_eq!(
        output_in(&dir, &args),
        committed(&dir.join("predictions.txt"))
    );
    args.extend(["--format", "csv"]);
    assert_eq!(
        output_in(&dir, &args),
        committed(&dir.join("predictions.csv"))
    );
    let transits = [
        "transits", "--planet", "mercury", "--from", "2030", "--to", "2060",
    ];
    assert_eq!(
        output_in(&dir, &transits),
        committed(&dir.join("transits-2030-2060.txt"))
    );
}

#[test]
fn venus_2117_plan_and_simulation_reproduce() {
    let dir = examples().join("venus-2117-planning");
    let work = scratch("2117");
    let sites = dir.join("candidate_sites.csv");
    let network = dir.join("chosen_network.csv");
    let (sites, network) = (sites.to_str().unwrap(), network.to_str().unwrap());
    let event = ["--planet", "venus", "--date", "2117-12-11"];
    let mut plan = vec!["plan"];
    plan.extend(event);
    plan.extend(["--sites", sites, "--choose", "8"]);
    let mut plan_json = plan.clone();
    plan_json.extend(["--format", "json"]);
    assert_eq!(
        output_in(&work, &plan_json),
        committed(&dir.join("plan.json"))
    );
    plan.extend(["--contact", "2", "--grid-deg", "2"]);
    plan.extend(["--map", "contact2-sensitivity.svg"]);
    assert_eq!(output_in(&work, &plan), committed(&dir.join("plan.txt")));
    assert_eq!(
        committed(&work.join("contact2-sensitivity.svg")),
        committed(&dir.join("contact2-sensitivity.svg"))
    );
    let mut sim = vec!["simulate"];
    sim.extend(event);
    sim.extend(["--network", network, "--trials", "1000", "--seed", "2117"]);
    sim.extend([
        "--black-drop",
        "5",
        "--weather-loss",
        "0.2",
        "--blunder-rate",
        "0.03",
    ]);
    sim.extend(["--histogram", "au-histogram.svg"]);
    assert_eq!(output_in(&work, &sim), committed(&dir.join("simulate.txt")));
    assert_eq!(
        committed(&work.join("au-histogram.svg")),
        committed(&dir.join("au-histogram.svg"))
    );
}

#[test]
fn expeditions_1769_reproduce() {
    let dir = examples().join("venus-1769-expeditions");
    // The worked example's timings are the embedded historical-style demonstration.
    assert_eq!(
        committed(&dir.join("timings.csv")),
        transit_parallax::demo::Scenario::Expeditions1769.campaign_csv()
    );
    let timings = dir.join("timings.csv");
    let stations = dir.join("stations.csv");
    let (t, s) = (timings.to_str().unwrap(), stations.to_str().unwrap());
    assert_eq!(
        output_in(&dir, &["reduce", t]),
        committed(&dir.join("reduction.txt"))
    );
    assert_eq!(
        output_in(&dir, &["reduce", t, "--format", "json"]),
        committed(&dir.join("reduction.json"))
    );
    let predict = [
        "predict",
        "--planet",
        "venus",
        "--date",
        "1769-06-03",
        "--stations",
        s,
        "--local-time",
        "apparent",
    ];
    assert_eq!(
        output_in(&dir, &predict),
        committed(&dir.join("predictions-apparent.txt"))
    );
}
