//! A grey image as 32-bit floats, and reading PNG, TIFF and JPEG files into one.
//!
//! Pixel `(column, row)` has its centre at `x = column`, `y = row` (x to the right, y down).
//! FITS files are read in [`super::fits`].

use super::error::MeasureError;
use std::path::Path;

/// A grey image: `width * height` intensities, row after row.
#[derive(Debug, Clone, PartialEq)]
pub struct GreyImage {
    /// Columns.
    pub width: usize,
    /// Rows.
    pub height: usize,
    /// Intensities, row-major; any linear unit.
    pub pixels: Vec<f32>,
}

impl GreyImage {
    /// An image from its pixels; `None` when the count does not match or a side is zero.
    pub fn new(width: usize, height: usize, pixels: Vec<f32>) -> Option<Self> {
        (width > 0 && height > 0 && width.checked_mul(height) == Some(pixels.len())).then_some(
            Self {
                width,
                height,
                pixels,
            },
        )
    }

    /// The pixel at `(column, row)`; the caller keeps the indices in range.
    #[inline]
    pub fn at(&self, column: usize, row: usize) -> f32 {
        self.pixels[row * self.width + column]
    }

    /// Bilinear interpolation at `(x, y)` in pixel units; `None` outside the pixel centres.
    #[inline]
    pub fn bilinear(&self, x: f64, y: f64) -> Option<f64> {
        if !(x >= 0.0 && y >= 0.0) {
            return None;
        }
        let (x0, y0) = (x.floor() as usize, y.floor() as usize);
        if x0 + 1 >= self.width || y0 + 1 >= self.height {
            return None;
        }
        let (fx, fy) = (x - x0 as f64, y - y0 as f64);
        let i = y0 * self.width + x0;
        let p = &self.pixels;
        let top = p[i] as f64 * (1.0 - fx) + p[i + 1] as f64 * fx;
        let bottom = p[i + self.width] as f64 * (1.0 - fx) + p[i + self.width + 1] as f64 * fx;
        Some(top * (1.0 - fy) + bottom * fy)
    }
}

/// Read a PNG (8 or 16 bit), TIFF or JPEG file to grey intensities in 0-1 (colour images by
/// their luma).
///
/// # Errors
/// [`MeasureError::Io`] when the file cannot be opened, [`MeasureError::Format`] when it
/// cannot be decoded.
pub fn read_raster(path: &Path) -> Result<GreyImage, MeasureError> {
    let io_error = |source| MeasureError::Io {
        path: path.to_path_buf(),
        source,
    };
    let format_error = |reason: String| MeasureError::Format {
        path: path.to_path_buf(),
        reason,
    };
    let reader = image::ImageReader::open(path)
        .map_err(io_error)?
        .with_guessed_format()
        .map_err(io_error)?;
    let decoded = reader.decode().map_err(|e| format_error(e.to_string()))?;
    let luma = decoded.to_luma32f();
    let (width, height) = (luma.width() as usize, luma.height() as usize);
    GreyImage::new(width, height, luma.into_raw())
        .ok_or_else(|| format_error("the image has no pixels".to_string()))
}
