//! Stage 9, pooled submissions: a small web service where a campaign's participants submit
//! timings and get instant feedback, and the organiser watches the solution firm up.
//!
//! - `cache.rs`: each version's reduction, solution JSON, report and export, computed once on
//!   a bounded worker and served from an `Arc` cache.
//! - `cached.rs`: the solution, export, report and organiser's page served from that cache.
//! - `timing_table.rs`: the organiser's table of every timing, paged and filtered in SQL.
//! - `store.rs`: the SQLite database (raw submissions, timings as sent, the audit trail).
//! - `store_triage.rs`: the triage in the database (verdicts at arrival, bulk exclusion,
//!   restoration with a reason, notes to participants).
//! - `table_query.rs`: the organiser's table's filters, search and order, as SQL.
//! - `triage.rs`: the organiser's triage routes (bulk exclusion, notes) and the list of
//!   timings that need attention.
//! - `intake.rs`: a submission's JSON body or form into timings.
//! - `feedback.rs`: each timing against its prediction at once, and the station's share.
//! - `pages.rs`: the pages' frame (header, caution, landmarks, language switch) and the participant's pages.
//! - `language_choice.rs`: the visitor's language (switch, cookie, `Accept-Language`) and the switch.
//! - `form.rs`: the participant's forms, one labelled field each.
//! - `style.rs`: the pages' style sheet, phone first.
//! - `feedback_words.rs`: the feedback's plain words (verdicts, differences, an example time).
//! - `feedback_sentences.rs`: the feedback's sentences as messages with values, written in
//!   the visitor's language (English in the API).
//! - `feedback_page.rs`: the reply to a submission: one card per timing, the path drawn.
//! - `organiser.rs`: the organiser's page.
//! - `server.rs`: the state, the participant's routes, the background reduction.
//! - `routes.rs`: the organiser's and the interface's routes, the router, the start.
//! - `security.rs`: the security headers on every response, and the router's protective layers.
//! - `forgery.rs`: the visitor's anti-forgery cookie and tokens, the origin and content-type checks.
//! - `sign_in.rs`: the organiser's sign-in, session cookie and sign-out.
//! - `registration.rs`: a station registered before the event, checked; its sheet and calendar.
//! - `registration_page.rs`: the registration's routes: the API, the form, the private link.
//! - `store_registrations.rs`: the registrations in the database; planned against reported.
//! - `network_plan.rs`: the organiser's stations planned against reported, with their map.
//! - `results_page.rs`: the public results page, from the cache.
//! - `limits.rs`: the body limit said plainly (413 pages), the rate limit with `--public`.
pub mod cache;
pub mod cached;
pub mod feedback;
pub mod feedback_page;
pub mod feedback_sentences;
pub mod feedback_station;
pub mod feedback_words;
pub mod forgery;
pub mod form;
pub mod intake;
pub mod language_choice;
pub mod limits;
pub mod network_plan;
pub mod organiser;
pub mod pages;
pub mod registration;
pub mod registration_page;
pub mod results_page;
pub mod routes;
pub mod security;
pub mod server;
pub mod sign_in;
pub mod store;
pub mod store_registrations;
pub mod store_triage;
pub mod style;
pub mod table_query;
pub mod timing_table;
pub mod triage;
