//! The `transit-parallax` command: parses arguments, calls the library, prints.

use clap::{Parser, Subcommand, ValueEnum};
use std::path::PathBuf;
use std::process::ExitCode;
use transit_parallax::output::{self, Format};
use transit_parallax::reduction::ReduceOptions;
use transit_parallax::{campaign_output, report, timescale, Error, Planet, TimeModel};

#[derive(Parser)]
#[command(
    name = "transit-parallax",
    version,
    about = "Predict, plan and reduce timings of transits of Venus and Mercury to the solar parallax and the astronomical unit."
)]
struct Cli {
    #[command(subcommand)]
    command: Command,
}

#[derive(Clone, Copy, ValueEnum)]
enum FormatArg {
    Table,
    Csv,
    Json,
}

#[derive(clap::Args, Clone)]
struct TimeArgs {
    /// Replace the built-in Delta T model by a fixed TT - UT1, in seconds.
    #[arg(long = "delta-t", value_name = "SECONDS", allow_hyphen_values = true)]
    delta_t: Option<f64>,
    /// UT1 - UTC in seconds (|DUT1| < 0.9 s), for events in the leap-second era.
    #[arg(
        long,
        value_name = "SECONDS",
        default_value_t = 0.0,
        allow_hyphen_values = true
    )]
    dut1: f64,
}

impl TimeArgs {
    fn model(&self) -> Result<TimeModel, Error> {
        let m = TimeModel {
            delta_t_override_s: self.delta_t,
            dut1_s: self.dut1,
        };
        m.validate()?;
        Ok(m)
    }
}

#[derive(clap::Args, Clone)]
struct EventArgs {
    /// venus or mercury.
    #[arg(long)]
    planet: String,
    /// A date within one day of greatest transit, YYYY-MM-DD (UTC).
    #[arg(long)]
    date: String,
    #[command(flatten)]
    time: TimeArgs,
}

impl EventArgs {
    fn transit(&self) -> Result<transit_parallax::TransitEvent, Error> {
        let planet = planet_of(&self.planet)?;
        let date = date_of(&self.date)?;
        transit_parallax::transit_on_date(planet, date, &self.time.model()?)
    }
}

#[derive(Subcommand)]
enum Command {
    /// List every transit of a planet in a span of years, with geocentric contacts.
    Transits {
        /// venus or mercury.
        #[arg(long)]
        planet: String,
        /// First year (1600-2300).
        #[arg(long)]
        from: i32,
        /// Last year (1600-2300).
        #[arg(long)]
        to: i32,
        /// Output format.
        #[arg(long, value_enum, default_value = "table")]
        format: FormatArg,
        #[command(flatten)]
        time: TimeArgs,
    },
    /// Predict contacts I-IV for each station of a file.
    Predict {
        #[command(flatten)]
        event: EventArgs,
        /// CSV file with columns station,latitude,longitude,elevation_m.
        #[arg(long)]
        stations: PathBuf,
        /// Output format.
        #[arg(long, value_enum, default_value = "table")]
        format: FormatArg,
    },
    /// Reduce contact timings to the solar parallax and the astronomical unit.
    Reduce {
        /// CSV file with columns station,latitude,longitude,elevation_m,contact,time_utc[,sigma_s].
        observations: PathBuf,
        /// venus or mercury (with --date; otherwise the event is inferred from the timings).
        #[arg(long, requires = "date")]
        planet: Option<String>,
        /// A date within one day of greatest transit, YYYY-MM-DD (with --planet).
        #[arg(long, requires = "planet")]
        date: Option<String>,
        /// The a-priori solar parallax in arcsec (default: the IAU 2009 value, 8.794143).
        #[arg(long = "prior-parallax", value_name = "ARCSEC")]
        prior_parallax: Option<f64>,
        /// Stop at the first invalid row (exit status 2, line named) instead of listing it.
        #[arg(long)]
        strict: bool,
        /// Rejection threshold, in robust standard deviations of the normalised residuals.
        #[arg(
            long = "outlier-threshold",
            value_name = "SIGMAS",
            default_value_t = 5.0
        )]
        outlier_threshold: f64,
        /// Output format.
        #[arg(long, value_enum, default_value = "table")]
        format: FormatArg,
        /// Also write a report: FILE.html (self-contained page) or FILE.md (with SVG charts).
        #[arg(long, value_name = "FILE")]
        report: Option<PathBuf>,
        #[command(flatten)]
        time: TimeArgs,
    },
    /// Rank candidate sites, choose a network and forecast the precision; map a contact's sensitivity.
    Plan {
        #[command(flatten)]
        event: EventArgs,
        /// CSV file of candidate sites (columns of a stations file).
        #[arg(long)]
        sites: PathBuf,
        /// Choose this many sites that together minimise the forecast uncertainty.
        #[arg(long, value_name = "N")]
        choose: Option<usize>,
        /// Standard uncertainty of one timing, seconds.
        #[arg(long = "sigma-s", value_name = "S", default_value_t = 10.0)]
        sigma_s: f64,
        /// Least altitude of the Sun for a contact to count, degrees.
        #[arg(
            long = "min-altitude",
            value_name = "DEG",
            default_value_t = 5.0,
            allow_hyphen_values = true
        )]
        min_altitude: f64,
        /// Output format.
        #[arg(long, value_enum, default_value = "table")]
        format: FormatArg,
        /// Draw a world map of the sensitivity of one contact (with --contact) to this SVG file.
        #[arg(long, value_name = "FILE.svg", requires = "contact")]
        map: Option<PathBuf>,
        /// The contact for --map and --grid-csv: 1-4 or I-IV.
        #[arg(long)]
        contact: Option<String>,
        /// Grid spacing of the map, degrees.
        #[arg(long = "grid-deg", value_name = "DEG", default_value_t = 2.0)]
        grid_deg: f64,
        /// Also write the grid as CSV (with --contact).
        #[arg(long = "grid-csv", value_name = "FILE.csv", requires = "contact")]
        grid_csv: Option<PathBuf>,
    },
    /// Monte Carlo campaigns through the real reduction: how precise will the AU come out?
    Simulate {
        #[command(flatten)]
        event: EventArgs,
        /// CSV file of the network's stations.
        #[arg(long)]
        network: PathBuf,
        /// Number of simulated campaigns.
        #[arg(long, default_value_t = 200)]
        trials: usize,
        /// Standard uncertainty of one timing, seconds (all contacts).
        #[arg(long = "sigma-s", value_name = "S", default_value_t = 10.0)]
        sigma_s: f64,
        /// Seed of the random generator (the same seed gives the same result).
        #[arg(long, default_value_t = 1)]
        seed: u64,
        /// Black-drop bias in seconds (II seen late, III early by this much).
        #[arg(long = "black-drop", value_name = "S", default_value_t = 0.0)]
        black_drop: f64,
        /// Probability that a station is clouded out.
        #[arg(long = "weather-loss", value_name = "P", default_value_t = 0.0)]
        weather_loss: f64,
        /// Probability that a timing carries a blunder.
        #[arg(long = "blunder-rate", value_name = "P", default_value_t = 0.0)]
        blunder_rate: f64,
        /// Probability that a station's clock is wrong.
        #[arg(long = "clock-error-rate", value_name = "P", default_value_t = 0.0)]
        clock_error_rate: f64,
        /// Size of a clock error, seconds.
        #[arg(long = "clock-error-s", value_name = "S", default_value_t = 60.0)]
        clock_error_s: f64,
        /// Least altitude of the Sun for a contact to be timed, degrees.
        #[arg(
            long = "min-altitude",
            value_name = "DEG",
            default_value_t = 5.0,
            allow_hyphen_values = true
        )]
        min_altitude: f64,
        /// Worker threads (default: all cores).
        #[arg(long)]
        threads: Option<usize>,
        /// Write a histogram of the AU estimates to this SVG file.
        #[arg(long, value_name = "FILE.svg")]
        histogram: Option<PathBuf>,
        /// Output format.
        #[arg(long, value_enum, default_value = "table")]
        format: FormatArg,
    },
    /// Run the main job on an embedded, invented campaign and write its HTML report.
    Demo {
        /// Where to write the report (default: transit-parallax-demo.html in the current folder).
        #[arg(
            long,
            value_name = "FILE",
            default_value = "transit-parallax-demo.html"
        )]
        report: PathBuf,
    },
}

fn format_of(f: FormatArg) -> Format {
    match f {
        FormatArg::Table => Format::Table,
        FormatArg::Csv => Format::Csv,
        FormatArg::Json => Format::Json,
    }
}

fn planet_of(text: &str) -> Result<Planet, Error> {
    Planet::parse(text).ok_or_else(|| {
        Error::argument(format!(
            "--planet '{text}' is not a transiting planet; give venus or mercury"
        ))
    })
}

fn date_of(text: &str) -> Result<chrono::NaiveDate, Error> {
    timescale::parse_date(text).map_err(|m| Error::argument(format!("--date: {m}")))
}

fn run(cli: Cli) -> Result<String, Error> {
    match cli.command {
        Command::Transits {
            planet,
            from,
            to,
            format,
            time,
        } => {
            let planet = planet_of(&planet)?;
            let events = transit_parallax::transits_in_years(planet, from, to, &time.model()?)?;
            Ok(match format_of(format) {
                Format::Table => output::transits_table(&events),
                Format::Csv => output::transits_csv(&events),
                Format::Json => pretty(&output::transits_json(&events)),
            })
        }
        Command::Predict {
            event,
            stations,
            format,
        } => {
            let stations = transit_parallax::station::read_stations(&stations)?;
            let event = event.transit()?;
            let predictions: Vec<_> = stations.iter().map(|s| event.predict(s)).collect();
            Ok(match format_of(format) {
                Format::Table => output::predictions_table(&event, &predictions),
                Format::Csv => output::predictions_csv(&event, &predictions),
                Format::Json => pretty(&output::predictions_json(&event, &predictions)),
            })
        }
        Command::Reduce {
            observations,
            planet,
            date,
            prior_parallax,
            strict,
            outlier_threshold,
            format,
            report: report_path,
            time,
        } => {
            let event = match (planet, date) {
                (Some(p), Some(d)) => Some((planet_of(&p)?, date_of(&d)?)),
                _ => None,
            };
            if !(2.0..=20.0).contains(&outlier_threshold) {
                return Err(Error::argument(format!(
                    "--outlier-threshold {outlier_threshold} is outside 2 to 20 robust standard deviations"
                )));
            }
            let options = ReduceOptions {
                event,
                prior_parallax_arcsec: prior_parallax
                    .unwrap_or_else(transit_parallax::constants::nominal_parallax_arcsec),
                time_model: time.model()?,
                outlier_threshold,
                follow_convergence: report_path.is_some(),
            };
            let set = transit_parallax::observations::read_observations(&observations, strict)?;
            let red = transit_parallax::reduction::reduce(set, &options)?;
            let mut text = match format_of(format) {
                Format::Json => pretty(&report::reduction_json(&red)),
                _ => report::reduction_table(&red),
            };
            if let Some(path) = report_path {
                let written = transit_parallax::document::write_report(&red, &path)?;
                if format_of(format) != Format::Json {
                    for p in written {
                        text.push_str(&format!("report written: {}\n", p.display()));
                    }
                }
            }
            Ok(text)
        }
        Command::Plan {
            event,
            sites,
            choose,
            sigma_s,
            min_altitude,
            format,
            map,
            contact,
            grid_deg,
            grid_csv,
        } => {
            check_range("--sigma-s", sigma_s, 0.01, 3600.0)?;
            check_range("--min-altitude", min_altitude, -1.0, 60.0)?;
            check_range("--grid-deg", grid_deg, 0.1, 30.0)?;
            let stations = transit_parallax::station::read_stations(&sites)?;
            let event = event.transit()?;
            let planet = event.planet;
            let plan =
                transit_parallax::planning::plan(&event, &stations, sigma_s, min_altitude, choose);
            let mut text = match format_of(format) {
                Format::Table => campaign_output::plan_table(&event, &plan, min_altitude),
                Format::Csv => campaign_output::plan_csv(&event, &plan),
                Format::Json => pretty(&campaign_output::plan_json(&event, &plan, min_altitude)),
            };
            if let Some(c) = contact {
                let c = transit_parallax::Contact::parse(&c).ok_or_else(|| {
                    Error::argument(format!(
                        "--contact '{c}' is not a contact; give 1-4 or I-IV"
                    ))
                })?;
                let grid = transit_parallax::planning::sensitivity_grid(&event, c, grid_deg);
                if let Some(path) = map {
                    let title = format!(
                        "Transit of {} {}: sensitivity of contact {}",
                        planet,
                        event.date(),
                        c.roman()
                    );
                    let svg = transit_parallax::charts::sensitivity_map_svg(
                        &grid,
                        grid_deg,
                        c,
                        min_altitude,
                        &title,
                    );
                    write_file(&path, &svg)?;
                    if format_of(format) == Format::Table {
                        text.push_str(&format!("map written: {}\n", path.display()));
                    }
                }
                if let Some(path) = grid_csv {
                    write_file(
                        &path,
                        &campaign_output::grid_csv(&event, &grid, min_altitude),
                    )?;
                    if format_of(format) == Format::Table {
                        text.push_str(&format!("grid written: {}\n", path.display()));
                    }
                }
            }
            Ok(text)
        }
        Command::Simulate {
            event,
            network,
            trials,
            sigma_s,
            seed,
            black_drop,
            weather_loss,
            blunder_rate,
            clock_error_rate,
            clock_error_s,
            min_altitude,
            threads,
            histogram,
            format,
        } => {
            check_range("--trials", trials as f64, 1.0, 1_000_000.0)?;
            check_range("--sigma-s", sigma_s, 0.01, 3600.0)?;
            check_range("--black-drop", black_drop, -600.0, 600.0)?;
            for (name, p) in [
                ("--weather-loss", weather_loss),
                ("--blunder-rate", blunder_rate),
                ("--clock-error-rate", clock_error_rate),
            ] {
                check_range(name, p, 0.0, 1.0)?;
            }
            check_range("--clock-error-s", clock_error_s, 0.0, 86_400.0)?;
            check_range("--min-altitude", min_altitude, -1.0, 60.0)?;
            let stations = transit_parallax::station::read_stations(&network)?;
            let event = event.transit()?;
            let planet = event.planet;
            let settings = transit_parallax::simulate::SimulationSettings {
                sigma_s: [sigma_s; 4],
                black_drop_bias_s: black_drop,
                min_altitude_deg: min_altitude,
                weather_loss,
                blunder_rate,
                clock_error_rate,
                clock_error_s,
            };
            let threads = threads.unwrap_or_else(|| {
                std::thread::available_parallelism()
                    .map(|n| n.get())
                    .unwrap_or(1)
            });
            let bar = indicatif::ProgressBar::new(trials as u64);
            bar.set_style(
                indicatif::ProgressStyle::with_template(
                    "{bar:40} {pos}/{len} campaigns ({eta} left)",
                )
                .unwrap_or_else(|_| indicatif::ProgressStyle::default_bar()),
            );
            let tick = || bar.inc(1);
            let summary = transit_parallax::simulate::monte_carlo(
                &event, &stations, &settings, trials, seed, threads, &tick,
            );
            bar.finish_and_clear();
            let mut text = match format_of(format) {
                Format::Json => pretty(&campaign_output::simulation_json(
                    &event,
                    &summary,
                    &settings,
                    stations.len(),
                    seed,
                )),
                _ => campaign_output::simulation_table(&event, &summary, stations.len()),
            };
            if let Some(path) = histogram {
                let title = format!(
                    "AU from {} simulated campaigns, transit of {} {}",
                    summary.solved,
                    planet,
                    event.date()
                );
                let svg = transit_parallax::charts::histogram_svg(
                    &summary.au_estimates_km,
                    transit_parallax::constants::AU_KM,
                    "astronomical unit (km)",
                    &title,
                );
                write_file(&path, &svg)?;
                if format_of(format) != Format::Json {
                    text.push_str(&format!("histogram written: {}\n", path.display()));
                }
            }
            Ok(text)
        }
        Command::Demo { report } => transit_parallax::demo::run_demo(&report),
    }
}

fn check_range(name: &str, value: f64, min: f64, max: f64) -> Result<(), Error> {
    if !value.is_finite() || value < min || value > max {
        return Err(Error::argument(format!(
            "{name} {value} is outside {min} to {max}"
        )));
    }
    Ok(())
}

fn write_file(path: &std::path::Path, text: &str) -> Result<(), Error> {
    std::fs::write(path, text).map_err(|source| Error::Io {
        path: path.to_path_buf(),
        source,
    })
}

fn pretty(v: &serde_json::Value) -> String {
    let mut s = serde_json::to_string_pretty(v).unwrap_or_default();
    s.push('\n');
    s
}

fn main() -> ExitCode {
    let cli = match Cli::try_parse() {
        Ok(c) => c,
        Err(e) => {
            let code = if e.use_stderr() { 2 } else { 0 };
            let _ = e.print();
            return ExitCode::from(code);
        }
    };
    match run(cli) {
        Ok(text) => {
            use std::io::Write;
            let mut out = std::io::stdout().lock();
            if out.write_all(text.as_bytes()).is_err() {
                return ExitCode::from(1);
            }
            ExitCode::SUCCESS
        }
        Err(e) => {
            eprintln!("error: {e}");
            ExitCode::from(if e.is_usage() { 2 } else { 1 })
        }
    }
}
