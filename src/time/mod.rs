//! Stage 1, time: from the labels on observers' clocks to the instants the ephemeris needs.
//!
//! Takes ISO 8601 labels (UTC from 1972, UT1 before) and gives TT and UT1 instants, through
//! the IERS leap-second table, TT - TAI = 32.184 s and a Delta T model (Espenak-Meeus
//! polynomials outside the table, or a fixed value given by the user), with a rough
//! uncertainty of Delta T.
//!
//! - `scales.rs`: the leap-second table, Delta T, [`scales::TimeModel`], [`scales::Tt`].
//! - `delta_t.rs`: the Espenak-Meeus polynomials of Delta T.
//! - `iso.rs`: parsing and formatting ISO 8601 labels.
pub mod delta_t;
pub mod iso;
pub mod scales;
