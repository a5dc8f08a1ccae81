//! Helpers shared by the integration tests that run the binary.
#![allow(dead_code)]

use std::path::PathBuf;
use std::process::{Command, Output};

/// A file under tests/data.
pub fn data(name: &str) -> String {
    let p: PathBuf = [env!("CARGO_MANIFEST_DIR"), "tests", "data", name]
        .iter()
        .collect();
    p.to_string_lossy().into_owned()
}

/// Run the binary with these arguments.
pub fn run(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
        .args(args)
        .output()
        .expect("binary runs")
}

/// `plan` for the transit of Venus of 2012 over the invented candidate sites
/// (tests/data/candidate_sites.csv), with `extra` arguments.
pub fn plan_venus_2012(extra: &[&str]) -> Output {
    let sites = data("candidate_sites.csv");
    let mut args = vec![
        "plan",
        "--planet",
        "venus",
        "--date",
        "2012-06-06",
        "--sites",
        &sites,
    ];
    args.extend_from_slice(extra);
    run(&args)
}

/// Standard output as text.
pub fn out(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

/// Standard error as text.
pub fn err(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// A file with these bytes in this test process's temporary folder; its path.
pub fn temp(name: &str, bytes: &[u8]) -> String {
    let dir = std::env::temp_dir().join(format!("tp-tests-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let p = dir.join(name);
    // Written beside and renamed into place, so that two tests writing the same name at once
    // never let a reader see a half-written (or empty) file.
    static WRITES: std::sync::atomic::AtomicUsize = std::sync::atomic::AtomicUsize::new(0);
    let k = WRITES.fetch_add(1, std::sync::atomic::Ordering::Relaxed);
    let part = dir.join(format!(".{name}.{k}.part"));
    std::fs::write(&part, bytes).unwrap();
    std::fs::rename(&part, &p).unwrap();
    p.to_string_lossy().into_owned()
}
pub mod chromium;
pub mod server;

/// Run the binary with the words of `command` (split at spaces) followed by `more` (paths and
/// other arguments that may hold spaces).
pub fn run_words(command: &str, more: &[&str]) -> Output {
    let mut args: Vec<&str> = command.split_whitespace().collect();
    args.extend_from_slice(more);
    run(&args)
}
