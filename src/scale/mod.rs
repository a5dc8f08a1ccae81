//! Stage 8, what else the timings measure: with the AU in kilometres, Kepler's third law
//! scales the whole Solar System (`kepler.rs`); the fitted radius corrections give the
//! planet's and the Sun's diameters (`diameters.rs`); and the geometry with the Sun's limb
//! darkening gives how much of its light the planet blocks (`light_curve.rs`), the way
//! transits of planets around other stars are read.
pub mod diameters;
pub mod kepler;
pub mod light_curve;
pub mod summary;
