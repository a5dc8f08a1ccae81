//! Stage 1, time: from the labels on observers' clocks to the instants the ephemeris needs.
//!
//! Takes ISO 8601 labels (UTC from 1972, UT1 before) and gives TT and UT1 instants, through
//! the IERS leap-second table, TT - TAI = 32.184 s and a Delta T model (the published
//! reconstruction, IERS observations and predictions, an extrapolation, or a fixed value given
//! by the user), with the published uncertainty of Delta T.
//!
//! - `scales.rs`: the leap-second table, Delta T, [`scales::TimeModel`], [`scales::Tt`].
//! - `delta_t.rs`: Delta T and its uncertainty from the published reconstruction, IERS
//!   observations and predictions, and an extrapolation.
//! - `delta_t_polynomials.rs`: the Espenak-Meeus polynomials and the Morrison-Stephenson
//!   parabola (published predictions the extrapolation weighs).
//! - `calendar.rs`: dates in the Julian calendar (Old Style).
//! - `civil.rs`: civil (clock) time in IANA zones and at fixed offsets.
//! - `leap_seconds.rs`: the IERS table of TAI - UTC and the arithmetic of clock labels.
//! - `iso.rs`: parsing and formatting ISO 8601 labels.
pub mod calendar;
pub mod civil;
pub mod delta_t;
pub mod delta_t_polynomials;
pub mod iso;
pub mod leap_seconds;
pub mod scales;
