//! Stage 5, the reduction.
pub mod diagnosis;
pub mod least_squares;
pub mod pipeline;
pub use pipeline::*;
