//! The `transit-parallax` command: parses arguments, calls the library, prints.

use clap::{Parser, Subcommand, ValueEnum};
use std::path::PathBuf;
use std::process::ExitCode;
use transit_parallax::output::{self, Format};
use transit_parallax::reduction::ReduceOptions;
use transit_parallax::{report, timescale, Error, Planet, TimeModel};

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
        /// venus or mercury.
        #[arg(long)]
        planet: String,
        /// A date within one day of greatest transit, YYYY-MM-DD (UTC).
        #[arg(long)]
        date: String,
        /// CSV file with columns station,latitude,longitude,elevation_m.
        #[arg(long)]
        stations: PathBuf,
        /// Output format.
        #[arg(long, value_enum, default_value = "table")]
        format: FormatArg,
        #[command(flatten)]
        time: TimeArgs,
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
            planet,
            date,
            stations,
            format,
            time,
        } => {
            let planet = planet_of(&planet)?;
            let date = date_of(&date)?;
            let model = time.model()?;
            let stations = transit_parallax::station::read_stations(&stations)?;
            let event = transit_parallax::transit_on_date(planet, date, &model)?;
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
        Command::Demo { report } => transit_parallax::demo::run_demo(&report),
    }
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
