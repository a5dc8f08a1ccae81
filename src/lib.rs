//! # transit-parallax
//!
//! Predict, plan and reduce timings of the contacts of Mercury and Venus with the Sun's limb,
//! to measure the solar parallax and the astronomical unit.
//!
//! The science lives here; the `transit-parallax` binary only parses arguments and prints.
//!
//! ```
//! use transit_parallax::{Planet, Station, TimeModel, transit_on_date};
//! let date = chrono::NaiveDate::from_ymd_opt(2012, 6, 6).unwrap();
//! let event = transit_on_date(Planet::Venus, date, &TimeModel::default()).unwrap();
//! let station = Station::new("harbour", -33.87, 151.21, 58.0).unwrap();
//! let prediction = event.predict(&station);
//! let second_contact = prediction.contacts[1].unwrap();
//! assert!(second_contact.sun_altitude_deg > 0.0);
//! ```
#![deny(missing_docs)]

pub mod besselian;
pub mod campaign_output;
pub mod charts;
pub mod chebyshev;
pub mod constants;
pub mod contacts;
pub mod csvinput;
pub mod demo;
pub mod diagnosis;
pub mod document;
pub mod ephemeris;
pub mod error;
pub mod observations;
pub mod output;
pub mod planning;
pub mod reduction;
pub mod report;
pub mod simulate;
pub mod solver;
pub mod station;
pub mod timescale;
pub mod transit;
pub mod vector;

pub use contacts::{Contact, ContactCircumstances};
pub use ephemeris::Planet;
pub use error::{Error, Result};
pub use station::Station;
pub use timescale::{TimeModel, Tt};
pub use transit::{transit_on_date, transits_in_years, StationPrediction, TransitEvent};
