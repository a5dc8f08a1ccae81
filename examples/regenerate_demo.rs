//! Write the embedded demonstration campaigns afresh from the library's simulator, after a
//! change that moves their simulated times (the ephemeris, Delta T, the simulator or the
//! recording of historical styles): `cargo run --release --example regenerate_demo`.
//! The unit tests `the_embedded_campaign_reproduces` fail until this has been run; say why in
//! the commit, and regenerate the worked examples (worked-examples/README.md) after it.

use transit_parallax::demo::{expeditions::generate_expeditions_campaign, generate_demo_campaign};

fn main() -> Result<(), Box<dyn std::error::Error>> {
    let root = env!("CARGO_MANIFEST_DIR");
    let demo = format!("{root}/src/data/demo_campaign.csv");
    std::fs::write(&demo, generate_demo_campaign()?)?;
    let expeditions = format!("{root}/src/data/expeditions_1769_campaign.csv");
    std::fs::write(&expeditions, generate_expeditions_campaign()?)?;
    eprintln!("wrote {demo} and {expeditions}");
    Ok(())
}
