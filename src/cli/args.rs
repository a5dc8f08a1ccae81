//! The command line's grammar: every command, option and help text (clap derive). Values are
//! checked in `commands.rs`, which turns them into library calls.

use clap::{Parser, Subcommand, ValueEnum};
use std::path::PathBuf;
use transit_parallax::language::Language;
use transit_parallax::render::text::Format;
use transit_parallax::sky::ephemeris::EphemerisChoice;
use transit_parallax::sky::solar_time::LocalTime;
use transit_parallax::time::iso;
use transit_parallax::{Error, Planet, TimeModel};

#[derive(Parser)]
#[command(
    name = "transit-parallax",
    version,
    about = "Predict, plan and reduce timings of transits of Venus and Mercury to the solar parallax and the astronomical unit."
)]
pub struct Cli {
    /// The command to run.
    #[command(subcommand)]
    pub command: Command,
}

#[derive(Clone, Copy, ValueEnum)]
pub enum FormatArg {
    Table,
    Csv,
    Json,
}

#[derive(clap::Args, Clone)]
pub struct TimeArgs {
    /// Replace the built-in Delta T model by a fixed TT - UT1, in seconds.
    #[arg(long = "delta-t", value_name = "SECONDS", allow_hyphen_values = true)]
    pub delta_t: Option<f64>,
    /// UT1 - UTC in seconds (|DUT1| < 0.9 s), for events in the leap-second era.
    #[arg(
        long,
        value_name = "SECONDS",
        default_value_t = 0.0,
        allow_hyphen_values = true
    )]
    pub dut1: f64,
    /// The planetary theory: jpl (series fitted to the JPL ephemerides around each transit,
    /// VSOP87A where an event has none) or vsop87.
    #[arg(long, value_enum, default_value = "jpl")]
    pub ephemeris: EphemerisArg,
}

/// Values of `--ephemeris`.
#[derive(clap::ValueEnum, Clone, Copy, Debug)]
pub enum EphemerisArg {
    Jpl,
    Vsop87,
}

impl TimeArgs {
    pub fn model(&self) -> Result<TimeModel, Error> {
        let m = TimeModel {
            delta_t_override_s: self.delta_t,
            dut1_s: self.dut1,
            ephemeris: match self.ephemeris {
                EphemerisArg::Jpl => EphemerisChoice::Jpl,
                EphemerisArg::Vsop87 => EphemerisChoice::Vsop87,
            },
        };
        m.validate()?;
        Ok(m)
    }
}

#[derive(clap::Args, Clone)]
pub struct EventArgs {
    /// venus or mercury.
    #[arg(long)]
    pub planet: String,
    /// A date within one day of greatest transit, YYYY-MM-DD (UTC).
    #[arg(long)]
    pub date: String,
    #[command(flatten)]
    pub time: TimeArgs,
}

impl EventArgs {
    pub fn transit(&self) -> Result<transit_parallax::TransitEvent, Error> {
        let planet = planet_of(&self.planet)?;
        let date = date_of(&self.date)?;
        transit_parallax::transit_on_date(planet, date, &self.time.model()?)
    }
}

/// The commands.
#[derive(Subcommand)]
pub enum Command {
    /// List every transit of a planet in a span of years, with geocentric contacts.
    #[command(
        after_help = "Examples:\n  transit-parallax transits --planet venus --from 1600 --to 2300\n  transit-parallax transits --planet mercury --from 2030 --to 2060 --format csv\n  transit-parallax transits --planet mercury --date 2032-11-13 --visibility-map mercury-2032.svg --visibility-grid mercury-2032.csv"
    )]
    Transits(TransitsArgs),
    /// Predict contacts I-IV for each station of a file.
    #[command(
        after_help = "Examples:\n  transit-parallax predict --planet mercury --date 2032-11-13 --stations stations.csv\n  transit-parallax predict --planet venus --date 2117-12-11 --stations stations.csv --format csv\n  transit-parallax predict --planet venus --date 1769-06-03 --stations stations.csv --local-time apparent\n  transit-parallax predict --planet mercury --date 2032-11-13 --stations stations.csv --sheets sheets/"
    )]
    Predict(PredictArgs),
    /// Reduce contact timings to the solar parallax and the astronomical unit.
    #[command(
        after_help = "Examples:\n  transit-parallax reduce timings.csv\n  transit-parallax reduce timings.csv --planet venus --date 2012-06-06 --report report.html"
    )]
    Reduce(ReduceArgs),
    /// Measure the planet's place on the Sun's disc in images: one observation row per image.
    #[command(after_help = crate::measure::MEASURE_AFTER_HELP)]
    Measure(MeasureArgs),
    /// Rank candidate sites, choose a network and forecast the precision; map a contact's sensitivity.
    #[command(
        after_help = "Examples:\n  transit-parallax plan --planet venus --date 2117-12-11 --sites sites.csv --choose 8\n  transit-parallax plan --planet venus --date 2117-12-11 --sites sites.csv --contact 2 --map contact2.svg"
    )]
    Plan(PlanArgs),
    /// Monte Carlo campaigns through the real reduction: how precise will the AU come out?
    #[command(
        after_help = "Examples:\n  transit-parallax simulate --planet venus --date 2117-12-11 --network network.csv --trials 1000\n  transit-parallax simulate --planet venus --date 2117-12-11 --network network.csv --trials 500 --weather-loss 0.2 --blunder-rate 0.03"
    )]
    Simulate(SimulateArgs),
    /// Run the main job on an embedded, invented campaign and write its HTML report.
    #[command(
        after_help = "Examples:\n  transit-parallax demo\n  transit-parallax demo --report /tmp/demo.html\n  transit-parallax demo --scenario 1769 --report /tmp/expeditions.html"
    )]
    Demo(DemoArgs),
    /// Run a local web service where participants submit timings and get instant feedback,
    /// and the organiser watches the solution firm up.
    #[command(
        after_help = "Examples:\n  transit-parallax serve --planet venus --date 2117-12-11 --db campaign.sqlite\n  transit-parallax serve --planet mercury --date 2032-11-13 --db campaign.sqlite --listen 127.0.0.1:8080 --token s3cret"
    )]
    Serve(ServeArgs),
    /// Print a blank stations or observations file: its header, how to write each column and
    /// one example row, commented out.
    #[command(
        after_help = "Examples:\n  transit-parallax template stations > stations.csv\n  transit-parallax template observations > timings.csv"
    )]
    Template(TemplateArgs),
    /// Print a shell completion script (bash, zsh, fish, elvish or powershell).
    #[command(
        after_help = "Examples:\n  transit-parallax completions bash > /etc/bash_completion.d/transit-parallax\n  transit-parallax completions zsh > ~/.zfunc/_transit-parallax"
    )]
    Completions(CompletionsArgs),
    /// Print the manual page (roff) of the command and its subcommands.
    #[command(
        after_help = "Examples:\n  transit-parallax manual > transit-parallax.1\n  transit-parallax manual | man -l -"
    )]
    Manual,
}

// Arguments of `template`.
#[derive(clap::Args)]
pub struct TemplateArgs {
    /// Which file: stations (for predict and plan) or observations (timings, for reduce).
    #[arg(value_enum)]
    pub kind: TemplateArg,
}

/// Values of `template`.
#[derive(clap::ValueEnum, Clone, Copy, Debug)]
pub enum TemplateArg {
    Stations,
    Observations,
}

// Arguments of `completions`.
#[derive(clap::Args)]
pub struct CompletionsArgs {
    /// The shell.
    #[arg(value_enum)]
    pub shell: clap_complete::Shell,
}

// Arguments of `transits`.
#[derive(clap::Args)]
pub struct TransitsArgs {
    /// venus or mercury.
    #[arg(long)]
    pub planet: String,
    /// First year (1600-2300), with --to.
    #[arg(long, requires = "to", conflicts_with = "date")]
    pub from: Option<i32>,
    /// Last year (1600-2300), with --from.
    #[arg(long, requires = "from", conflicts_with = "date")]
    pub to: Option<i32>,
    /// One transit instead of a span of years: a date within one day of its greatest
    /// transit, YYYY-MM-DD (UTC); needed by --visibility-map and --visibility-grid.
    #[arg(long)]
    pub date: Option<String>,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: FormatArg,
    #[command(flatten)]
    pub time: TimeArgs,
    /// Write the Sun's brightness seen from the Earth's centre through each transit: .csv
    /// (time_utc,relative_flux; every transit of the years) or .svg (the chart; one transit).
    #[arg(long = "light-curve", value_name = "FILE.csv|FILE.svg")]
    pub light_curve: Option<PathBuf>,
    /// Draw the world map of where the transit (--date) is seen with the Sun up: whole,
    /// ingress only, egress only, part or nothing; the horizon at contacts I and IV; lines of
    /// equal time of each contact.
    #[arg(long = "visibility-map", value_name = "FILE.svg")]
    pub visibility_map: Option<PathBuf>,
    /// Write the map's grid (--date): latitude,longitude,contact,time_utc,sun_altitude_deg
    /// for every grid point and contact (time and altitude empty where a contact does not
    /// occur).
    #[arg(long = "visibility-grid", value_name = "FILE.csv")]
    pub visibility_grid: Option<PathBuf>,
    /// Spacing of the visibility grid, degrees (0.5 to 30).
    #[arg(
        long = "grid-deg",
        value_name = "G",
        default_value_t = 2.0,
        allow_hyphen_values = true
    )]
    pub grid_deg: f64,
}

// Arguments of `predict`.
#[derive(clap::Args)]
pub struct PredictArgs {
    #[command(flatten)]
    pub event: EventArgs,
    /// CSV file with columns station,latitude,longitude,elevation_m.
    #[arg(long)]
    pub stations: PathBuf,
    /// Also give each contact as the station's clock would read it in local solar time:
    /// apparent (sundial time) or mean (column time_local, civil day reckoning).
    #[arg(long = "local-time", value_enum, value_name = "apparent|mean")]
    pub local_time: Option<LocalTimeArg>,
    /// Also give each contact in civil (clock) time: an IANA zone such as Europe/Amsterdam or a
    /// fixed offset such as +05:30 (column time_civil); a time_zone column in the stations
    /// file sets it per station, this option filling the rows that leave it empty.
    #[arg(long = "time-zone", value_name = "ZONE", allow_hyphen_values = true)]
    pub time_zone: Option<String>,
    /// Write the Sun's brightness seen from the Earth's centre through the transit: .csv
    /// (time_utc,relative_flux) or .svg (the chart, contacts marked).
    #[arg(long = "light-curve", value_name = "FILE.csv|FILE.svg")]
    pub light_curve: Option<PathBuf>,
    /// Also write for every station a printable sheet DIR/<station>.html (caution, contacts in
    /// clock time and UTC, sunrise or sunset, where on the limb to look, a table for the
    /// timings) and its calendar DIR/<station>.ics (one event per contact seen with the Sun up).
    #[arg(long, value_name = "DIR")]
    pub sheets: Option<PathBuf>,
    /// The language of the sheets and calendars (--sheets): en (English, the default), es
    /// (Spanish), fr (French), de (German) or pt (Portuguese); their words, decimal sign and
    /// month names (times stay 24-hour).
    #[arg(
        long,
        value_name = "CODE",
        requires = "sheets",
        default_value = "en",
        value_parser = sheet_language
    )]
    pub language: Language,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: FormatArg,
}

/// A value of `--language`: one of the sheets' languages by its code (`de`, `pt-BR`: the
/// primary subtag decides).
fn sheet_language(code: &str) -> Result<Language, String> {
    Language::from_code(code).ok_or_else(|| {
        format!(
            "not a language of the sheets; give one of {}",
            Language::codes_named()
        )
    })
}

/// Values of `--local-time`.
#[derive(clap::ValueEnum, Clone, Copy, Debug)]
pub enum LocalTimeArg {
    Apparent,
    Mean,
}

impl LocalTimeArg {
    pub fn kind(self) -> LocalTime {
        match self {
            LocalTimeArg::Apparent => LocalTime::Apparent,
            LocalTimeArg::Mean => LocalTime::Mean,
        }
    }
}

// Arguments of `reduce`.
#[derive(clap::Args)]
pub struct ReduceArgs {
    /// CSV file with columns station,latitude,longitude,elevation_m,contact,time_utc[,sigma_s].
    pub observations: PathBuf,
    /// venus or mercury (with --date; otherwise the event is inferred from the timings).
    #[arg(long, requires = "date")]
    pub planet: Option<String>,
    /// A date within one day of greatest transit, YYYY-MM-DD (with --planet).
    #[arg(long, requires = "planet")]
    pub date: Option<String>,
    /// The a-priori solar parallax in arcsec (default: the IAU 2009 value, 8.794143).
    #[arg(long = "prior-parallax", value_name = "ARCSEC")]
    pub prior_parallax: Option<f64>,
    /// Stop at the first invalid row (exit status 2, line named) instead of listing it.
    #[arg(long)]
    pub strict: bool,
    /// Rejection threshold, in robust standard deviations of the normalised residuals.
    #[arg(
        long = "outlier-threshold",
        value_name = "SIGMAS",
        default_value_t = 5.0
    )]
    pub outlier_threshold: f64,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: FormatArg,
    /// Also write a report: FILE.html (self-contained page) or FILE.md (with SVG charts).
    #[arg(long, value_name = "FILE")]
    pub report: Option<PathBuf>,
    /// The planet's place relative to the Sun: free (fitted, the default), fixed (held at the
    /// ephemeris's value) or prior=ARCSEC (fitted with a prior of that standard uncertainty).
    #[arg(
        long = "planet-place",
        value_name = "free|fixed|prior=ARCSEC",
        default_value = "free"
    )]
    pub planet_place: String,
    #[command(flatten)]
    pub time: TimeArgs,
}

/// Arguments of `measure`.
#[derive(clap::Args)]
pub struct MeasureArgs {
    /// Image files: FITS, PNG (8 or 16 bit), TIFF or JPEG, each showing the whole Sun with the
    /// planet on it.
    #[arg(required = true, value_name = "IMAGE")]
    pub images: Vec<PathBuf>,
    /// The instant of every image, ISO 8601 UTC (e.g. 2012-06-06T01:29:36.5Z), instead of the
    /// time in each file.
    #[arg(long = "time-utc", value_name = "TIME")]
    pub time_utc: Option<String>,
    /// The zone the camera's clock was set to, +HH:MM (e.g. +02:00), for photographs whose
    /// EXIF time has no offset.
    #[arg(
        long = "camera-utc-offset",
        value_name = "+HH:MM",
        allow_hyphen_values = true
    )]
    pub camera_utc_offset: Option<String>,
    /// How many seconds the camera's clock was AHEAD of the true time (negative if it was
    /// behind); this is subtracted from the time read from each file. Not applied to --time-utc.
    #[arg(
        long = "clock-offset-s",
        value_name = "SECONDS",
        default_value_t = 0.0,
        allow_hyphen_values = true
    )]
    pub clock_offset_s: f64,
    /// Station name written on every row.
    #[arg(long)]
    pub station: Option<String>,
    /// Station latitude, degrees north (WGS 84).
    #[arg(long, allow_hyphen_values = true)]
    pub latitude: Option<f64>,
    /// Station longitude, degrees east (WGS 84).
    #[arg(long, allow_hyphen_values = true)]
    pub longitude: Option<f64>,
    /// Station elevation above the ellipsoid, metres.
    #[arg(long = "elevation-m", allow_hyphen_values = true)]
    pub elevation_m: Option<f64>,
    /// Output format: csv (observation rows) or json (the rows with the fits' diagnostics).
    #[arg(long, value_enum, default_value = "csv")]
    pub format: MeasureFormat,
}

/// Values of `measure --format`.
#[derive(Clone, Copy, ValueEnum)]
pub enum MeasureFormat {
    Csv,
    Json,
}

// Arguments of `plan`.
#[derive(clap::Args)]
pub struct PlanArgs {
    #[command(flatten)]
    pub event: EventArgs,
    /// CSV file of candidate sites (columns of a stations file).
    #[arg(long)]
    pub sites: PathBuf,
    /// Choose this many sites that together minimise the forecast uncertainty.
    #[arg(long, value_name = "N")]
    pub choose: Option<usize>,
    /// Standard uncertainty of one timing, seconds.
    #[arg(
        long = "sigma-s",
        value_name = "S",
        default_value_t = 10.0,
        allow_hyphen_values = true
    )]
    pub sigma_s: f64,
    /// Least altitude of the Sun for a contact to count, degrees.
    #[arg(
        long = "min-altitude",
        value_name = "DEG",
        default_value_t = 5.0,
        allow_hyphen_values = true
    )]
    pub min_altitude: f64,
    /// Each station also images the Sun every this many seconds while the planet is wholly on
    /// the disc (with --sigma-solar-radii): the forecast counts the measured positions too.
    #[arg(
        long = "positions-every",
        value_name = "SECONDS",
        requires = "sigma_solar_radii",
        allow_hyphen_values = true
    )]
    pub positions_every: Option<f64>,
    /// Standard uncertainty of one measured separation of the centres, in the Sun's radius
    /// (1e-3 is about 0.95"), with --positions-every.
    #[arg(
        long = "sigma-solar-radii",
        value_name = "X",
        requires = "positions_every",
        allow_hyphen_values = true
    )]
    pub sigma_solar_radii: Option<f64>,
    /// What the choice and the forecast count: contacts, positions or both (default: both with
    /// --positions-every, else contacts).
    #[arg(long, value_name = "WHAT")]
    pub measure: Option<String>,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: FormatArg,
    /// Draw a world map of the sensitivity of one contact (with --contact) to this SVG file,
    /// the sites numbered with a key and the chosen ones (--choose) marked.
    #[arg(long, value_name = "FILE.svg")]
    pub map: Option<PathBuf>,
    /// The contact for --map and --grid-csv: 1-4 or I-IV.
    #[arg(long)]
    pub contact: Option<String>,
    /// Grid spacing of the map, degrees.
    #[arg(long = "grid-deg", value_name = "DEG", default_value_t = 2.0)]
    pub grid_deg: f64,
    /// Also write the grid as CSV (with --contact).
    #[arg(long = "grid-csv", value_name = "FILE.csv")]
    pub grid_csv: Option<PathBuf>,
}

// Arguments of `simulate`.
#[derive(clap::Args)]
pub struct SimulateArgs {
    #[command(flatten)]
    pub event: EventArgs,
    /// CSV file of the network's stations.
    #[arg(long)]
    pub network: PathBuf,
    /// Number of simulated campaigns.
    #[arg(long, default_value_t = 200)]
    pub trials: usize,
    /// Standard uncertainty of one timing, seconds (all contacts).
    #[arg(
        long = "sigma-s",
        value_name = "S",
        default_value_t = 10.0,
        allow_hyphen_values = true
    )]
    pub sigma_s: f64,
    /// Seed of the random generator (the same seed gives the same result).
    #[arg(long, default_value_t = 1)]
    pub seed: u64,
    /// Black-drop bias in seconds (II seen late, III early by this much).
    #[arg(long = "black-drop", value_name = "S", default_value_t = 0.0)]
    pub black_drop: f64,
    /// Probability that a station is clouded out.
    #[arg(long = "weather-loss", value_name = "P", default_value_t = 0.0)]
    pub weather_loss: f64,
    /// Probability that a timing carries a blunder.
    #[arg(long = "blunder-rate", value_name = "P", default_value_t = 0.0)]
    pub blunder_rate: f64,
    /// Probability that a station's clock is wrong.
    #[arg(long = "clock-error-rate", value_name = "P", default_value_t = 0.0)]
    pub clock_error_rate: f64,
    /// Size of a clock error, seconds.
    #[arg(long = "clock-error-s", value_name = "S", default_value_t = 60.0)]
    pub clock_error_s: f64,
    /// Least altitude of the Sun for a contact to be timed, degrees.
    #[arg(
        long = "min-altitude",
        value_name = "DEG",
        default_value_t = 5.0,
        allow_hyphen_values = true
    )]
    pub min_altitude: f64,
    /// Worker threads (default: all cores).
    #[arg(long)]
    pub threads: Option<usize>,
    /// Write a histogram of the AU estimates to this SVG file.
    #[arg(long, value_name = "FILE.svg")]
    pub histogram: Option<PathBuf>,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: FormatArg,
}

// Arguments of `serve`.
#[derive(clap::Args)]
pub struct ServeArgs {
    #[command(flatten)]
    pub event: EventArgs,
    /// The campaign's database (SQLite), created on first start.
    #[arg(long, value_name = "FILE")]
    pub db: PathBuf,
    /// Address and port to listen on (port 0: any free port).
    #[arg(long, value_name = "ADDR:PORT", default_value = "127.0.0.1:8040")]
    pub listen: String,
    /// The organiser's token (letters and digits); printed at start when generated.
    #[arg(long, value_name = "TOKEN")]
    pub token: Option<String>,
    /// Allow an address other than this computer's own (127.0.0.1, [::1]).
    #[arg(long)]
    pub public: bool,
    /// Stop by itself after this many seconds (for tests and timed demonstrations).
    #[arg(long, value_name = "SECONDS")]
    pub stop_after: Option<u64>,
}

// Arguments of `demo`.
#[derive(clap::Args)]
pub struct DemoArgs {
    /// Where to write the report (default: transit-parallax-demo.html in the current folder).
    #[arg(
        long,
        value_name = "FILE",
        default_value = "transit-parallax-demo.html"
    )]
    pub report: PathBuf,
    /// Which embedded campaign: 2012 (schools, clubs and observatories timing in UTC) or 1769
    /// (expeditions timing in local solar time, with doubtful and unknown longitudes).
    #[arg(long, value_name = "NAME", default_value = "2012")]
    pub scenario: String,
}

pub fn planet_of(text: &str) -> Result<Planet, Error> {
    Planet::parse(text).ok_or_else(|| {
        Error::argument(format!(
            "--planet '{text}' is not a transiting planet; give venus or mercury"
        ))
    })
}

pub fn date_of(text: &str) -> Result<chrono::NaiveDate, Error> {
    iso::parse_date(text).map_err(|m| Error::argument(format!("--date: {m}")))
}

impl FormatArg {
    /// The library's output format.
    pub fn format(self) -> Format {
        match self {
            FormatArg::Table => Format::Table,
            FormatArg::Csv => Format::Csv,
            FormatArg::Json => Format::Json,
        }
    }
}
