//! # transit-parallax
//!
//! Predict, plan and reduce timings of the contacts of Mercury and Venus with the Sun's limb,
//! to measure the solar parallax and the astronomical unit.
//!
//! The science lives here; the `transit-parallax` binary only parses arguments and prints.
//! The modules follow the data's journey:
//!
//! | stage | takes | gives |
//! | --- | --- | --- |
//! | [`time`] | clock labels (UTC, UT1) | TT and UT1 instants, Delta T with its uncertainty |
//! | [`sky`] | TT instants | apparent geocentric places of the Sun and the planet |
//! | [`geometry`] | places, stations | an event's elements, each station's contacts and their circumstances |
//! | [`observations`] | submitted CSV files | validated timings, every row used or rejected with a reason |
//! | [`reduction`] | timings and an event | the solar parallax and the AU with uncertainties, diagnoses, contributions |
//! | [`planning`] | candidate sites, an event | ranked sites, chosen networks, simulated campaigns |
//! | [`render`] | any of the above | tables, CSV, JSON, charts and reports |
//!
//! [`demo`] holds the embedded invented campaign, [`error`] the typed errors of every stage and
//! [`words`] the phrasing they share.
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

pub mod demo;
pub mod error;
pub mod geometry;
pub mod images;
pub mod language;
pub mod observations;
pub mod planning;
pub mod reduction;
pub mod render;
pub mod scale;
pub mod service;
pub mod sky;
pub mod time;
pub mod words;

pub use error::{Error, Result};
pub use geometry::contacts::{Contact, ContactCircumstances};
pub use geometry::station::Station;
pub use geometry::transit::{transit_on_date, transits_in_years, StationPrediction, TransitEvent};
pub use sky::ephemeris::Planet;
pub use time::scales::{TimeModel, Tt};
