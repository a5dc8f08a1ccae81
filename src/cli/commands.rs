//! One function per command: check the values clap could not, call the library, render the
//! result. No science here.

use crate::args::{date_of, planet_of};
use crate::args::{
    Cli, Command, DemoArgs, PlanArgs, PredictArgs, ReduceArgs, ServeArgs, SimulateArgs,
    TemplateArg, TransitsArgs,
};
use std::path::Path;
use transit_parallax::geometry::station::read_stations;
use transit_parallax::geometry::station_file::read_station_file;
use transit_parallax::observations::templates::{template_text, TemplateKind};
use transit_parallax::observations::timings::read_observations;
use transit_parallax::planning::{simulation, sites};
use transit_parallax::reduction::planet_place::PlanetPlace;
use transit_parallax::reduction::{reduce, ReduceOptions};
use transit_parallax::render::sheet_files::write_sheets;
use transit_parallax::render::station_predictions::{self, Clocks};
use transit_parallax::render::text::Format;
use transit_parallax::render::{document, planning, planning_charts, prediction, reduction};
use transit_parallax::sky::constants::{nominal_parallax_arcsec, AU_KM};
use transit_parallax::time::civil::CivilZone;
use transit_parallax::{Contact, Error};

/// Run one command; the text to print on success.
pub fn run(command: Command) -> Result<String, Error> {
    match command {
        Command::Transits(a) => transits(a),
        Command::Predict(a) => predict(a),
        Command::Reduce(a) => reduce_timings(a),
        Command::Measure(a) => crate::measure::measure(a),
        Command::Plan(a) => plan(a),
        Command::Simulate(a) => simulate(a),
        Command::Demo(a) => demo(a),
        Command::Serve(a) => serve(a),
        Command::Template(a) => Ok(template_text(match a.kind {
            TemplateArg::Stations => TemplateKind::Stations,
            TemplateArg::Observations => TemplateKind::Observations,
        })),
        Command::Completions(a) => completions(a.shell),
        Command::Manual => manual(),
    }
}

fn completions(shell: clap_complete::Shell) -> Result<String, Error> {
    use clap::CommandFactory;
    let mut out = Vec::new();
    clap_complete::generate(shell, &mut Cli::command(), "transit-parallax", &mut out);
    String::from_utf8(out).map_err(|e| Error::Numerical(format!("completion script: {e}")))
}

fn manual() -> Result<String, Error> {
    use clap::CommandFactory;
    let command = Cli::command();
    let mut out = Vec::new();
    let io = |e: std::io::Error| Error::Numerical(format!("manual page: {e}"));
    clap_mangen::Man::new(command.clone())
        .render(&mut out)
        .map_err(io)?;
    for sub in command.get_subcommands() {
        let name = format!("transit-parallax-{}", sub.get_name());
        // clap wants a static name; the process ends as soon as the page is printed.
        let sub = sub.clone().name(Box::leak(name.into_boxed_str()) as &str);
        out.extend_from_slice(b"\n");
        clap_mangen::Man::new(sub).render(&mut out).map_err(io)?;
    }
    String::from_utf8(out).map_err(|e| Error::Numerical(format!("manual page: {e}")))
}

fn transits(a: TransitsArgs) -> Result<String, Error> {
    let planet = planet_of(&a.planet)?;
    let model = a.time.model()?;
    let events = match (&a.date, a.from, a.to) {
        (Some(d), _, _) => vec![transit_parallax::transit_on_date(
            planet,
            date_of(d)?,
            &model,
        )?],
        (None, Some(from), Some(to)) => {
            if a.visibility_map.is_some() || a.visibility_grid.is_some() {
                return Err(Error::argument(
                    "--visibility-map and --visibility-grid draw one transit: add --date YYYY-MM-DD (a date within one day of its greatest transit) in place of --from and --to",
                ));
            }
            transit_parallax::transits_in_years(planet, from, to, &model)?
        }
        _ => {
            return Err(Error::argument(
                "give the years with --from YEAR --to YEAR, or one transit with --date YYYY-MM-DD",
            ))
        }
    };
    if let Some(path) = &a.light_curve {
        write_light_curve(path, &events.iter().collect::<Vec<_>>())?;
    }
    let format = a.format.format();
    let mut text = match format {
        Format::Table => prediction::transits_table(&events),
        Format::Csv => prediction::transits_csv(&events),
        Format::Json => pretty(&prediction::transits_json(&events)),
    };
    if let ([event], true) = (
        events.as_slice(),
        a.visibility_map.is_some() || a.visibility_grid.is_some(),
    ) {
        for written in write_visibility(event, &a)? {
            if format == Format::Table {
                text.push_str(&written);
            }
        }
    }
    Ok(text)
}

/// The visibility map and grid of one transit, as `--visibility-map` and `--visibility-grid`
/// ask; a line saying what was written for each.
fn write_visibility(
    event: &transit_parallax::TransitEvent,
    a: &TransitsArgs,
) -> Result<Vec<String>, Error> {
    use transit_parallax::geometry::visibility::visibility_grid;
    use transit_parallax::render::visibility_map::{visibility_grid_csv, visibility_map_svg};
    let threads = std::thread::available_parallelism().map_or(1, |n| n.get().min(8));
    let grid = visibility_grid(event, a.grid_deg, threads)?;
    let mut written = Vec::new();
    if let Some(path) = &a.visibility_map {
        write_file(path, &visibility_map_svg(event, &grid))?;
        written.push(format!("visibility map written: {}\n", path.display()));
    }
    if let Some(path) = &a.visibility_grid {
        write_file(path, &visibility_grid_csv(event, &grid))?;
        written.push(format!("visibility grid written: {}\n", path.display()));
    }
    Ok(written)
}

fn predict(a: PredictArgs) -> Result<String, Error> {
    let zone = a
        .time_zone
        .as_deref()
        .map(CivilZone::parse)
        .transpose()
        .map_err(|m| Error::argument(format!("--time-zone: {m}")))?;
    let file = read_station_file(&a.stations, zone)?;
    let event = a.event.transit()?;
    let predictions: Vec<_> = file.stations.iter().map(|s| event.predict(s)).collect();
    let clocks = Clocks {
        solar: a.local_time.map(|k| k.kind()),
        calendars: &file.calendars,
        zones: &file.zones,
    };
    if let Some(path) = &a.light_curve {
        write_light_curve(path, &[&event])?;
    }
    if let Some(dir) = &a.sheets {
        let written = write_sheets(
            dir,
            &event,
            &predictions,
            &file.zones,
            a.language,
            std::time::SystemTime::now().into(),
        )?;
        eprintln!(
            "{} observers' sheets (with their calendars) written to {}",
            written.len() / 2,
            dir.display()
        );
    }
    Ok(match a.format.format() {
        Format::Table => station_predictions::predictions_table(&event, &predictions, clocks),
        Format::Csv => station_predictions::predictions_csv(&event, &predictions, clocks),
        Format::Json => {
            let ephemeris = event.ephemeris_name();
            pretty(&station_predictions::predictions_json(
                &ephemeris,
                &event,
                &predictions,
                clocks,
            ))
        }
    })
}

fn reduce_timings(a: ReduceArgs) -> Result<String, Error> {
    let event = match (&a.planet, &a.date) {
        (Some(p), Some(d)) => Some((planet_of(p)?, date_of(d)?)),
        _ => None,
    };
    if !(2.0..=20.0).contains(&a.outlier_threshold) {
        return Err(Error::argument(format!(
            "--outlier-threshold {} is outside 2 to 20 robust standard deviations",
            a.outlier_threshold
        )));
    }
    let model = a.time.model()?;
    let options = ReduceOptions {
        event,
        prior_parallax_arcsec: a.prior_parallax.unwrap_or_else(nominal_parallax_arcsec),
        time_model: model,
        outlier_threshold: a.outlier_threshold,
        follow_convergence: a.report.is_some(),
        planet_place: PlanetPlace::parse(&a.planet_place).map_err(Error::argument)?,
        compare_methods: true,
    };
    let set = read_observations(&a.observations, a.strict)?;
    let red = reduce(set, &options)?;
    let format = a.format.format();
    let mut text = match format {
        Format::Json => pretty(&reduction::reduction_json(&red)),
        Format::Csv => reduction::reduction_csv(&red),
        Format::Table => reduction::reduction_table(&red),
    };
    if let Some(path) = &a.report {
        for p in document::write_report(&red, path)? {
            if format == Format::Table {
                text.push_str(&format!("report written: {}\n", p.display()));
            }
        }
    }
    Ok(text)
}

fn plan(a: PlanArgs) -> Result<String, Error> {
    check_range("--sigma-s", a.sigma_s, 0.01, 3600.0)?;
    check_range("--min-altitude", a.min_altitude, -1.0, 60.0)?;
    check_range("--grid-deg", a.grid_deg, 0.1, 30.0)?;
    if a.contact.is_none() && (a.map.is_some() || a.grid_csv.is_some()) {
        let option = if a.map.is_some() {
            "--map"
        } else {
            "--grid-csv"
        };
        return Err(Error::argument(format!(
            "{option} shows one contact's sensitivity: add --contact 1, 2, 3 or 4 (I to IV) to say which; run once per contact for more"
        )));
    }
    let stations = read_stations(&a.sites)?;
    match a.choose {
        Some(0) => {
            return Err(Error::argument(
                "--choose 0: give the number of sites to choose, at least 1",
            ))
        }
        Some(k) if k > stations.len() => {
            return Err(Error::argument(format!(
                "--choose {k}, but {} lists {}; give at most that many",
                a.sites.display(),
                transit_parallax::words::count(stations.len(), "site", "sites")
            )))
        }
        _ => {}
    }
    let event = a.event.transit()?;
    let options = plan_options(&a)?;
    let plan = sites::plan_with(&event, &stations, &options);
    let format = a.format.format();
    let mut text = match format {
        Format::Table => planning::plan_table(&event, &plan, a.min_altitude),
        Format::Csv => planning::plan_csv(&event, &plan),
        Format::Json => pretty(&planning::plan_json(&event, &plan, a.min_altitude)),
    };
    let Some(c) = &a.contact else {
        return Ok(text);
    };
    let contact = Contact::parse(c).ok_or_else(|| {
        Error::argument(format!(
            "--contact '{c}' is not a contact; give 1-4 or I-IV"
        ))
    })?;
    let grid = sites::sensitivity_grid(&event, contact, a.grid_deg);
    if let Some(path) = &a.map {
        let title = format!(
            "Transit of {} {}: sensitivity of contact {}",
            event.planet,
            event.date(),
            contact.roman()
        );
        let svg = planning_charts::sensitivity_map_svg(
            &grid,
            (a.grid_deg, a.min_altitude),
            contact,
            (&stations, &plan.chosen),
            &title,
        );
        write_file(path, &svg)?;
        if format == Format::Table {
            text.push_str(&format!("map written: {}\n", path.display()));
        }
    }
    if let Some(path) = &a.grid_csv {
        write_file(path, &planning::grid_csv(&event, &grid, a.min_altitude))?;
        if format == Format::Table {
            text.push_str(&format!("grid written: {}\n", path.display()));
        }
    }
    Ok(text)
}

/// The plan's options from its arguments: the images' cadence and precision checked, and
/// what is measured.
fn plan_options(a: &PlanArgs) -> Result<sites::PlanOptions, Error> {
    let imaging = match (a.positions_every, a.sigma_solar_radii) {
        (Some(every_s), Some(sigma)) => {
            check_range("--positions-every", every_s, 1.0, 3600.0)?;
            check_range("--sigma-solar-radii", sigma, 1e-6, 0.1)?;
            Some(transit_parallax::planning::imaging::Imaging {
                every_s,
                sigma_solar_radii: sigma,
            })
        }
        _ => None,
    };
    let measure = match a.measure.as_deref() {
        None if imaging.is_some() => sites::Measure::Both,
        None => sites::Measure::Contacts,
        Some(word) => sites::Measure::parse(word).ok_or_else(|| {
            Error::argument(format!(
                "--measure '{word}' is not a way of measuring; give contacts, positions or both"
            ))
        })?,
    };
    if measure != sites::Measure::Contacts && imaging.is_none() {
        return Err(Error::argument(format!(
            "--measure {}: say how the stations would image the Sun with --positions-every SECONDS and --sigma-solar-radii X",
            measure.name()
        )));
    }
    Ok(sites::PlanOptions {
        sigma_s: a.sigma_s,
        min_altitude_deg: a.min_altitude,
        choose: a.choose,
        imaging,
        measure,
    })
}

fn simulation_settings(a: &SimulateArgs) -> Result<simulation::SimulationSettings, Error> {
    if a.trials < 2 {
        return Err(Error::argument(format!(
            "--trials {}: give at least 2 campaigns; the scatter of the estimates needs two or more",
            a.trials
        )));
    }
    check_range("--trials", a.trials as f64, 2.0, 1_000_000.0)?;
    check_range("--sigma-s", a.sigma_s, 0.01, 3600.0)?;
    check_range("--black-drop", a.black_drop, -600.0, 600.0)?;
    for (name, p) in [
        ("--weather-loss", a.weather_loss),
        ("--blunder-rate", a.blunder_rate),
        ("--clock-error-rate", a.clock_error_rate),
    ] {
        check_range(name, p, 0.0, 1.0)?;
    }
    check_range("--clock-error-s", a.clock_error_s, 0.0, 86_400.0)?;
    check_range("--min-altitude", a.min_altitude, -1.0, 60.0)?;
    Ok(simulation::SimulationSettings {
        sigma_s: [a.sigma_s; 4],
        black_drop_bias_s: a.black_drop,
        min_altitude_deg: a.min_altitude,
        weather_loss: a.weather_loss,
        blunder_rate: a.blunder_rate,
        clock_error_rate: a.clock_error_rate,
        clock_error_s: a.clock_error_s,
    })
}

fn simulate(a: SimulateArgs) -> Result<String, Error> {
    let settings = simulation_settings(&a)?;
    let stations = read_stations(&a.network)?;
    let event = a.event.transit()?;
    simulation::check_network(&event, &stations, &settings)?;
    let threads = a.threads.unwrap_or_else(|| {
        std::thread::available_parallelism()
            .map(|n| n.get())
            .unwrap_or(1)
    });
    let bar = indicatif::ProgressBar::new(a.trials as u64);
    bar.set_style(
        indicatif::ProgressStyle::with_template("{bar:40} {pos}/{len} campaigns ({eta} left)")
            .unwrap_or_else(|_| indicatif::ProgressStyle::default_bar()),
    );
    let tick = || bar.inc(1);
    let summary = simulation::monte_carlo(
        &event, &stations, &settings, a.trials, a.seed, threads, &tick,
    );
    bar.finish_and_clear();
    if summary.solved == 0 {
        return Err(Error::argument(format!(
            "not one of the {} simulated campaigns determined the parallax: the network cannot separate it from the planet's place and the radii; add stations far apart in latitude that see both ingress and egress, or far apart in longitude that see the same contact (see `plan`)",
            summary.trials
        )));
    }
    let format = a.format.format();
    let mut text = match format {
        Format::Json => pretty(&planning::simulation_json(
            &event,
            &summary,
            &settings,
            stations.len(),
            a.seed,
        )),
        Format::Csv => planning::simulation_csv(&summary, a.seed, &event.ephemeris_name()),
        Format::Table => planning::simulation_table(&event, &summary, &settings, stations.len()),
    };
    if let Some(path) = &a.histogram {
        let title = format!(
            "AU from {} simulated campaigns, transit of {} {}",
            summary.solved,
            event.planet,
            event.date()
        );
        let svg = planning_charts::histogram_svg(
            &summary.au_estimates_km,
            AU_KM,
            ("astronomical unit (million km)", 1e6),
            &title,
        );
        write_file(path, &svg)?;
        if format == Format::Table {
            text.push_str(&format!("histogram written: {}\n", path.display()));
        }
    }
    Ok(text)
}

fn serve(a: ServeArgs) -> Result<String, Error> {
    use transit_parallax::service::routes::{serve, ServeSettings};
    let listen: std::net::SocketAddr = a.listen.parse().map_err(|_| {
        Error::argument(format!(
            "--listen '{}' is not an address and port; write it as 127.0.0.1:8040",
            a.listen
        ))
    })?;
    let event = a.event.transit()?;
    let store = transit_parallax::service::store::Store::open(&a.db).map_err(Error::argument)?;
    let settings = ServeSettings {
        listen,
        public: a.public,
        token: a.token,
        stop_after: a.stop_after.map(std::time::Duration::from_secs),
    };
    serve(event, store, settings)?;
    Ok(String::new())
}

fn demo(a: DemoArgs) -> Result<String, Error> {
    use transit_parallax::demo::{run_scenario, Scenario};
    let scenario = Scenario::parse(&a.scenario).ok_or_else(|| {
        Error::argument(format!(
            "--scenario '{}' is not an embedded campaign; give 2012 (schools timing in UTC) or 1769 (expeditions timing in local solar time)",
            a.scenario
        ))
    })?;
    run_scenario(scenario, &a.report)
}

fn check_range(name: &str, value: f64, min: f64, max: f64) -> Result<(), Error> {
    if !value.is_finite() || value < min || value > max {
        let must = if min > 0.0 && value <= 0.0 {
            "must be a positive number"
        } else {
            "is outside the range"
        };
        return Err(Error::argument(format!(
            "{name} {value} {must}; give a value from {min} to {max}"
        )));
    }
    Ok(())
}

/// The light curves of these events, every 30 s from 15 minutes before contact I to 15
/// minutes after IV: all of them as CSV, or one as an SVG chart.
fn write_light_curve(path: &Path, events: &[&transit_parallax::TransitEvent]) -> Result<(), Error> {
    use transit_parallax::render::light_curve_chart::{light_curve_csv, light_curve_svg};
    use transit_parallax::scale::light_curve::light_curve;
    let ext = path
        .extension()
        .and_then(|e| e.to_str())
        .map(str::to_ascii_lowercase);
    let mut curves = Vec::new();
    for e in events {
        curves.push((*e, light_curve(e, 30.0, 900.0)?));
    }
    let text = match (ext.as_deref(), curves.as_slice()) {
        (Some("csv"), _) => light_curve_csv(&curves),
        (Some("svg"), [(event, points)]) => light_curve_svg(event, points),
        (Some("svg"), _) => {
            return Err(Error::argument(format!(
                "--light-curve {}: a chart shows one transit and these years hold {}; give years with one transit, or a .csv file for all of them",
                path.display(),
                curves.len()
            )))
        }
        _ => {
            return Err(Error::argument(format!(
                "--light-curve {}: give a file name ending in .csv (time_utc,relative_flux) or .svg (the chart)",
                path.display()
            )))
        }
    };
    write_file(path, &text)
}

fn write_file(path: &Path, text: &str) -> Result<(), Error> {
    std::fs::write(path, text).map_err(|source| Error::Io {
        path: path.to_path_buf(),
        source,
    })
}

fn pretty<T: serde::Serialize + ?Sized>(v: &T) -> String {
    let mut s = serde_json::to_string_pretty(v).unwrap_or_default();
    s.push('\n');
    s
}
