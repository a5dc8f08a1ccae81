//! Stage 2, the sky: where the Sun and the planet are seen from the Earth's centre.
//!
//! Takes TT instants and gives apparent geocentric positions (light time, aberration,
//! precession-nutation) and the Earth's rotation angle, with the constants every later stage
//! shares.
//!
//! - `constants.rs`: physical and conventional constants, each with unit and authority.
//! - `vector.rs`: small 3-vector helpers.
//! - `chebyshev.rs`: Chebyshev interpolation and evaluation with derivatives.
//! - `solar_time.rs`: local apparent and mean solar time, the equation of time, day reckonings.
//! - `jpl_windows.rs`: series fitted to the JPL ephemerides around each transit, compiled in.
//! - `ephemeris.rs`: the ephemeris choice, JPL or VSOP87A positions, light time, aberration, precession-nutation, sidereal time.
pub mod chebyshev;
pub mod constants;
pub mod ephemeris;
pub mod jpl_windows;
pub mod solar_time;
pub mod vector;
