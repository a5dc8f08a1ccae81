//! The heavy artefacts of each version of the data, computed once on a bounded worker and
//! served from an `Arc` cache, so that the organiser's downloads never hold up a participant.
//!
//! The version is the server's change counter (`generation`): every accepted submission,
//! exclusion or restoration raises it. Two background workers, each one job at a time on
//! tokio's blocking pool (never on the runtime's threads), turn a version into artefacts:
//!
//! - the reducer: the timings in force, read through a connection of its own (never the store's
//!   mutex), reduced exactly as `reduce` reads the export, with the solution JSON, the export CSV,
//!   each timing's state for the organiser's table and the page's charts;
//! - the renderer: the HTML report (the reduction again, with the convergence chart), for the
//!   newest solved version, skipping the versions that went by while it worked.
//!
//! Requests clone the `Arc` of the newest artefacts and send their bytes; while a newer version
//! is computed the previous one is served, with its version and the changes pending.

use super::feedback::information_of_set;
use super::server::App;
use super::store::{export_csv, Store, StoredTiming};
use crate::observations::csv_table::CsvTable;
use crate::observations::timings::{observations_from_table, ObservationSet};
use crate::reduction::{reduce_for_event, ReduceOptions, Reduction};
use axum::body::Bytes;
use std::collections::HashMap;
use std::sync::{Arc, Mutex, RwLock};
use tokio::sync::Notify;

/// How long the reducer waits after a change, milliseconds, so that a burst of submissions is
/// reduced together.
const DEBOUNCE_MS: u64 = 100;

/// One version's solution and the artefacts made with it.
#[derive(Default)]
pub struct Solved {
    /// The version of the data reduced (0: none yet).
    pub version: u64,
    /// The reduction of the timings in force.
    pub reduction: Option<Arc<Reduction>>,
    /// Why there is no reduction.
    pub error: Option<String>,
    /// The information the timings carry on the parallax (arcsec^-2).
    pub information: f64,
    /// Submissions in force in this version.
    pub submissions: i64,
    /// The solution JSON without its closing brace (the request adds `pending`).
    pub solution_json: Bytes,
    /// Every timing in force and not excluded, as an observations file.
    pub export_csv: Bytes,
    /// Each reduced timing's state and why, by timing id.
    pub states: HashMap<i64, (String, String)>,
    /// The organiser page's methods and charts (HTML).
    pub charts_html: String,
    /// The timings that need the organiser's attention (`triage.rs`).
    pub attention: super::triage::Attention,
    /// When this version was reduced, ISO 8601 UTC (empty: none yet).
    pub solved_utc: String,
    /// The public results page's section of this version (`results_page.rs`).
    pub public: super::results_page::PublicSection,
    observations: Option<ObservationSet>,
}

/// The HTML report of one version.
#[derive(Default)]
pub struct Rendered {
    /// The version of the data it reports on (0: none yet).
    pub version: u64,
    /// The page, or `None` when there is no solution to report.
    pub html: Option<Bytes>,
    /// The convergence chart for the public results page, in each language.
    pub convergence: super::results_page::ConvergenceCharts,
}

/// The cache of the newest artefacts, and the workers' own database connections.
#[derive(Default)]
pub struct Cache {
    solved: RwLock<Arc<Solved>>,
    rendered: RwLock<Arc<Rendered>>,
    solved_changed: Notify,
    reader: Mutex<Option<Store>>,
    page_reader: Mutex<Option<Store>>,
}

impl Cache {
    /// The newest solution (cloned `Arc`; never waits on a worker).
    pub fn solved(&self) -> Arc<Solved> {
        self.solved.read().map(|s| s.clone()).unwrap_or_default()
    }

    /// The newest report.
    pub fn rendered(&self) -> Arc<Rendered> {
        self.rendered.read().map(|s| s.clone()).unwrap_or_default()
    }

    /// Run `f` on a read connection of the organiser's pages (its own, opened on first use
    /// beside the writer's), or on the writer's store when the database has no file.
    pub fn with_page_reader<T>(
        &self,
        app: &App,
        f: impl FnOnce(&Store) -> Result<T, String>,
    ) -> Result<T, String> {
        with_reader(&self.page_reader, app, f)
    }
}

fn with_reader<T>(
    slot: &Mutex<Option<Store>>,
    app: &App,
    f: impl FnOnce(&Store) -> Result<T, String>,
) -> Result<T, String> {
    let mut guard = slot
        .lock()
        .map_err(|_| "the reader's lock was poisoned".to_string())?;
    if guard.is_none() {
        let path = app.with_store(|s| Ok(s.file()))?;
        match path {
            Some(p) => *guard = Some(Store::open(std::path::Path::new(&p))?),
            None => return app.with_store(|s| f(s)),
        }
    }
    match guard.as_ref() {
        Some(store) => f(store),
        None => Err("no reader".into()),
    }
}

/// Reduce the timings in force whenever they change (after a short wait), one job at a time;
/// starts the report's renderer beside it.
pub async fn recompute_loop(app: Arc<App>) {
    tokio::spawn(render_loop(app.clone()));
    loop {
        let generation = app.generation();
        if app.cache.solved().version == generation {
            app.change_notify().notified().await;
            tokio::time::sleep(std::time::Duration::from_millis(DEBOUNCE_MS)).await;
            continue;
        }
        let worker = app.clone();
        let done = tokio::task::spawn_blocking(move || solve_once(&worker, generation)).await;
        if let Ok(solved) = done {
            if let Ok(mut s) = app.cache.solved.write() {
                *s = Arc::new(solved);
            }
            app.cache.solved_changed.notify_one();
        }
    }
}

/// Render the report of the newest solved version, one at a time, on a thread of its own at a
/// lower priority; while the reducer has changes to reduce, the report waits (up to
/// [`RENDER_DEFER_S`]), so that a new timing reaches the solution first.
async fn render_loop(app: Arc<App>) {
    let pool = render_pool();
    let mut deferred_since: Option<std::time::Instant> = None;
    loop {
        let solved = app.cache.solved();
        if solved.version == 0 || app.cache.rendered().version == solved.version {
            app.cache.solved_changed.notified().await;
            continue;
        }
        let waiting = deferred_since.get_or_insert_with(std::time::Instant::now);
        if app.generation() > solved.version && waiting.elapsed().as_secs() < RENDER_DEFER_S {
            // A newer version is being reduced: its report is the one worth making.
            let _ = tokio::time::timeout(
                std::time::Duration::from_millis(500),
                app.cache.solved_changed.notified(),
            )
            .await;
            continue;
        }
        deferred_since = None;
        let event = app.event().clone();
        let pool = pool.clone();
        let done = tokio::task::spawn_blocking(move || match pool.as_deref() {
            Some(p) => p.install(|| render_once(&event, &solved)),
            None => render_once(&event, &solved),
        })
        .await;
        if let Ok(rendered) = done {
            if let Ok(mut r) = app.cache.rendered.write() {
                *r = Arc::new(rendered);
            }
        }
    }
}

/// The longest the report waits for the reducer to catch up, seconds (so that a steady stream
/// of submissions never leaves the report behind for good).
const RENDER_DEFER_S: u64 = 20;

/// The renderer's scheduling priority (`nice`).
const RENDER_NICE: i32 = 10;

/// The renderer's own thread: one, at a lower scheduling priority than the reducer and the
/// requests (`nice` 10 on Linux, where a thread's nice value is its own: `setpriority(2)`),
/// so that a report in progress takes the cores only when nothing else wants them. `None`
/// (the reductions then run on the blocking pool's thread) if the thread cannot be made.
fn render_pool() -> Option<Arc<rayon::ThreadPool>> {
    rayon::ThreadPoolBuilder::new()
        .num_threads(1)
        .thread_name(|_| "report-renderer".into())
        .start_handler(|_| lower_thread_priority(RENDER_NICE))
        .build()
        .ok()
        .map(Arc::new)
}

/// Lower the calling thread's scheduling priority to `nice` (0 normal, 19 the least; Linux
/// only, elsewhere nothing).
pub fn lower_thread_priority(nice: i32) {
    #[cfg(target_os = "linux")]
    // SAFETY: `setpriority` takes plain integers and touches no memory of ours; with
    // `PRIO_PROCESS` and who = 0 it applies, on Linux, to the calling thread only.
    unsafe {
        let _ = libc::setpriority(libc::PRIO_PROCESS, 0, nice);
    }
    #[cfg(not(target_os = "linux"))]
    let _ = nice;
}

/// The options of the service's reductions: those of `reduce` for the event.
fn options(event: &crate::TransitEvent, follow_convergence: bool) -> ReduceOptions {
    ReduceOptions {
        event: Some((event.planet, event.date())),
        follow_convergence,
        ..ReduceOptions::default()
    }
}

/// The report of a solved version: its observations reduced again with the convergence chart
/// (as `reduce --report` does), then the page.
fn render_once(event: &crate::TransitEvent, solved: &Solved) -> Rendered {
    let red = solved
        .observations
        .clone()
        .and_then(|set| reduce_for_event(set, event.clone(), &options(event, true)).ok());
    Rendered {
        version: solved.version,
        html: red
            .as_ref()
            .map(|r| Bytes::from(crate::render::document::html_report(r))),
        convergence: red
            .as_ref()
            .map(super::results_page::ConvergenceCharts::of)
            .unwrap_or_default(),
    }
}

/// One reduction of the timings in force at `generation`, exactly as `reduce` of the export
/// would do it, with the artefacts made from it.
fn solve_once(app: &App, generation: u64) -> Solved {
    let mut solved = Solved {
        version: generation,
        solved_utc: super::store::now_utc(),
        ..Solved::default()
    };
    let read = with_reader(&app.cache.reader, app, |s| {
        Ok((
            (s.timings_in_force()?, s.verdicts_in_force()?),
            s.counts()?.0,
        ))
    });
    let ((timings, verdicts), submissions) = match read {
        Ok(t) => t,
        Err(e) => {
            solved.error = Some(e);
            solved.solution_json = solution_prefix(&solved);
            return solved;
        }
    };
    solved.submissions = submissions;
    let (text, ids) = export_csv(&timings);
    let path = std::path::Path::new("<campaign>");
    let set = CsvTable::from_bytes(path, text.as_bytes())
        .and_then(|table| observations_from_table(&table, false));
    let event = app.event();
    let result = set.and_then(|set| {
        solved.information = information_of_set(event, &set);
        solved.observations = Some(set.clone());
        reduce_for_event(set, event.clone(), &options(event, false))
    });
    match result {
        Ok(red) => solved.reduction = Some(Arc::new(red)),
        Err(e) => solved.error = Some(e.to_string()),
    }
    solved.states = states(&timings, &ids, solved.reduction.as_deref());
    solved.attention = super::triage::attention(&timings, &verdicts, &solved.states);
    if let Some(red) = &solved.reduction {
        solved.charts_html =
            super::organiser::charts_html(red) + &crate::render::residual_groups::groups_html(red);
    }
    solved.public = super::results_page::public_section(&solved, &timings);
    solved.solution_json = solution_prefix(&solved);
    solved.export_csv = Bytes::from(text);
    solved
}

/// The solution's JSON object (the reduction's, or `{ "error" }`) with `submissions` and
/// `version`, without its closing brace.
fn solution_prefix(solved: &Solved) -> Bytes {
    let extra = [
        ("submissions", serde_json::Value::from(solved.submissions)),
        ("version", serde_json::Value::from(solved.version)),
    ];
    let mut bytes = match &solved.reduction {
        Some(red) => crate::render::reduction_json::reduction_json_bytes(red, &extra),
        None => {
            let mut v = serde_json::json!({
                "error": solved.error.clone().unwrap_or_else(|| "no solution yet".into())
            });
            if let Some(map) = v.as_object_mut() {
                for (k, x) in extra {
                    map.insert(k.into(), x);
                }
            }
            serde_json::to_vec(&v).unwrap_or_else(|_| b"{}".to_vec())
        }
    };
    bytes.pop();
    Bytes::from(bytes)
}

/// Each timing's state in the solution and why: `used` with its O - C, `rejected (reason)`
/// with the diagnosis, `excluded` by the organiser; the others are `pending`.
fn states(
    timings: &[StoredTiming],
    ids: &[i64],
    red: Option<&Reduction>,
) -> HashMap<i64, (String, String)> {
    let mut out = HashMap::with_capacity(timings.len());
    for t in timings {
        if let Some(r) = &t.excluded {
            out.insert(t.id, ("excluded".into(), format!("by the organiser: {r}")));
        }
    }
    let Some(red) = red else {
        return out;
    };
    // The export's data line k + 2 is timing ids[k].
    let id_of_line = |line: u64| {
        usize::try_from(line)
            .ok()
            .and_then(|l| l.checked_sub(2))
            .and_then(|k| ids.get(k).copied())
    };
    for u in &red.used {
        if let Some(id) = id_of_line(u.line) {
            let why = format!("O - C {:+.1} s", u.o_c_s);
            out.entry(id).or_insert_with(|| ("used".into(), why));
        }
    }
    for r in &red.rejected {
        if let Some(id) = id_of_line(r.line) {
            let state = format!("rejected ({})", r.reason.as_str());
            let why = r.diagnosis.clone().unwrap_or_default();
            out.entry(id).or_insert_with(|| (state, why));
        }
    }
    out
}
