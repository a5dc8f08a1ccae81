//! The reasons an image cannot be measured: each names the file and says what to do.

use std::path::PathBuf;

/// Why an image could not be read or measured. Every message names the file.
#[derive(Debug, thiserror::Error)]
pub enum MeasureError {
    /// The file could not be opened or read.
    #[error("cannot read {}: {source}; check the path and permissions", path.display())]
    Io {
        /// The image file.
        path: PathBuf,
        /// The underlying error.
        #[source]
        source: std::io::Error,
    },
    /// The file is not an image this tool can decode.
    #[error("{} is not a readable image ({reason}); give a FITS, PNG, TIFF or JPEG file", path.display())]
    Format {
        /// The image file.
        path: PathBuf,
        /// What the decoder said.
        reason: String,
    },
    /// No bright disc stands out from the background.
    #[error("{} shows no Sun: no bright disc stands out from the background ({reason})", path.display())]
    NoSun {
        /// The image file.
        path: PathBuf,
        /// What was found instead.
        reason: String,
    },
    /// The Sun's disc touches or leaves the frame, so its limb cannot be fitted all round.
    #[error("{} has the Sun's disc touching the edge of the frame; frame the whole disc with a margin", path.display())]
    ClippedLimb {
        /// The image file.
        path: PathBuf,
    },
    /// The Sun's limb could not be fitted as a circle.
    #[error("{}: the Sun's limb could not be fitted as a circle ({reason})", path.display())]
    LimbFit {
        /// The image file.
        path: PathBuf,
        /// Why.
        reason: String,
    },
    /// No dark disc was found on the Sun.
    #[error("{} shows no planet on the Sun: no dark disc stands out from the limb-darkened surface", path.display())]
    NoPlanet {
        /// The image file.
        path: PathBuf,
    },
    /// More than one dark disc could be the planet (a large sunspot, a dust speck).
    #[error("{} shows {count} dark discs on the Sun that could each be the planet (a sunspot or dust as dark and as large as the planet?); crop or choose another image", path.display())]
    SeveralCandidates {
        /// The image file.
        path: PathBuf,
        /// How many candidates.
        count: usize,
    },
    /// The planet's edge could not be fitted as a circle.
    #[error("{}: the planet's edge could not be fitted as a circle ({reason})", path.display())]
    PlanetFit {
        /// The image file.
        path: PathBuf,
        /// Why.
        reason: String,
    },
    /// The image's instant could not be found or read.
    #[error("{}: {reason}", path.display())]
    Instant {
        /// The image file.
        path: PathBuf,
        /// What is missing or malformed, and what to give instead.
        reason: String,
    },
}
