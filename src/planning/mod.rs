//! Stage 6, planning: before the event, which sites to recruit and how precise the result will be.
//!
//! Takes candidate sites and an event and gives each site's contacts, visibility and gain to
//! the network, a greedy choice of N sites with its forecast, sensitivity maps, and Monte
//! Carlo campaigns run through the real reduction.
//!
//! - `sites.rs`: site ranking, greedy network choice, forecasts, sensitivity grids.
//! - `simulation.rs`: simulated campaigns and Monte Carlo forecasts.
//! - `imaging.rs`: the information a camera's positions of the planet on the disc carry.
//! - `historical.rs`: simulated campaigns recorded as historical expeditions wrote them.
//! - `records.rs`: a campaign written out as an observations file, in the forms it was
//!   recorded in.
pub mod historical;
pub mod imaging;
pub mod records;
pub mod simulation;
pub mod sites;
