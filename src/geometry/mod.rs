//! Stage 3, geometry: from the bodies' places to each station's contacts.
//!
//! Takes the ephemeris and stations on WGS 84 and gives an event's fundamental-plane elements,
//! the transits in a span of years, and for every station the contact times I-IV with the
//! Sun's altitude and azimuth, the position and vertex angles and the sensitivity of each
//! contact to the solar parallax.
//!
//! - `station.rs`: stations on WGS 84 and their geocentric coordinates.
//! - `station_file.rs`: reading stations files (places, calendars, civil zones), every bad row at once.
//! - `besselian.rs`: the fundamental-plane elements of an event, fitted as Chebyshev series.
//! - `contacts.rs`: a station's contacts, circumstances, partial derivatives, full-model check.
//! - `disc_position.rs`: the planet's place on the disc under trial parameters, and its
//!   partials (the model of a measured position).
//! - `transit.rs`: finding transits, naming an event by date, predicting stations.
//! - `sun_horizon.rs`: sunrise and sunset at a station between two contacts.
//! - `visibility.rs`: each contact's time and the Sun's altitude over a world grid, and which
//!   part of the transit each place sees with the Sun up.
pub mod besselian;
pub mod contacts;
pub mod disc_position;
pub mod station;
pub mod station_file;
pub mod sun_horizon;
pub mod transit;
pub mod visibility;
