//! The `measure` stage against synthetic images made outside the tool.
//!
//! Source of every truth here: tests/reference/generate_solar_images.py (Skyfield 1.53 with
//! the JPL DE421 ephemeris for the planet's apparent topocentric place; the quadratic
//! limb-darkening law of Cox 2000, section 14.7). The committed images are clean (no noise
//! beyond 16-bit or 8-bit rounding); the noisy images are NOT committed: the generator writes
//! their parameters to noisy_cases.csv and this test renders them itself with the same law,
//! geometry, Gaussian blur and Gaussian noise (seeded), so that 120 images give the spread of
//! the z-scores.

use chrono::NaiveDateTime;
use rand::SeedableRng;
use rand_distr::{Distribution, Normal};
use rayon::prelude::*;
use std::path::{Path, PathBuf};
use transit_parallax::images::{
    measure_disc, measure_file, GreyImage, InstantOptions, InstantSource, MeasureError,
};
use transit_parallax::time::iso::parse_utc;

fn images_dir() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/reference/images")
}

fn records(name: &str) -> Vec<csv::StringRecord> {
    let mut reader = csv::Reader::from_path(images_dir().join(name)).expect("reference CSV");
    reader.records().map(|r| r.expect("row")).collect()
}

fn utc(text: &str) -> NaiveDateTime {
    parse_utc(text).expect("time")
}

fn seconds_between(a: NaiveDateTime, b: NaiveDateTime) -> f64 {
    (a - b).num_nanoseconds().expect("span") as f64 * 1e-9
}

#[test]
fn clean_images_give_the_separation_within_2e_4_solar_radii() {
    // Source: truth.csv from generate_solar_images.py (Skyfield + DE421), clean images.
    for row in records("truth.csv") {
        let (file, truth) = (&row[0], row[7].parse::<f64>().expect("truth"));
        let file_has_time = matches!(&row[17], "fits" | "exif-offset" | "exif-no-offset");
        let options = InstantOptions {
            camera_utc_offset_s: Some(6 * 3600),
            time_utc: (!file_has_time).then(|| utc(&row[6])),
            ..Default::default()
        };
        let m = measure_file(&images_dir().join(file), &options)
            .unwrap_or_else(|e| panic!("{file}: {e}"));
        let error = m.disc.separation_solar_radii - truth;
        eprintln!(
            "{file}: measured {:.6} truth {truth:.6} error {error:+.2e} sigma {:.1e} R {:.3} px (true {})",
            m.disc.separation_solar_radii, m.disc.sigma_solar_radii, m.disc.sun.radius_px, &row[14]
        );
        assert!(error.abs() < 2e-4, "{file}: error {error:e} solar radii");
        assert!(m.disc.sigma_solar_radii > 0.0 && m.disc.sigma_solar_radii < 2e-3);
        let ratio = row[9].parse::<f64>().expect("radius");
        // The half-deficit radius of a blurred small disc is a little small: within 25 %.
        assert!(
            (m.disc.planet_radius_solar_radii / ratio - 1.0).abs() < 0.25,
            "{file}: planet radius"
        );
    }
}

#[test]
fn the_instant_comes_from_date_obs_plus_half_exptime_and_from_exif() {
    // Source: truth.csv; the FITS file's DATE-OBS is the mid-exposure time minus EXPTIME / 2
    // (FITS Standard 4.0, section 9.1.2); the EXIF of venus2012-a carries +08:00.
    let truth: Vec<_> = records("truth.csv");
    let time_of = |file: &str| utc(&truth.iter().find(|r| &r[0] == file).expect("row")[6]);
    let dir = images_dir();
    let fits =
        measure_file(&dir.join("venus2012-b.fits"), &InstantOptions::default()).expect("fits");
    assert_eq!(fits.instant_source, InstantSource::FitsMidExposure);
    assert!(seconds_between(fits.time_utc, time_of("venus2012-b.fits")).abs() < 1e-6);
    let fast = InstantOptions {
        clock_offset_s: 1.5,
        ..Default::default()
    };
    let corrected = measure_file(&dir.join("venus2012-b.fits"), &fast).expect("fits");
    assert!(
        (seconds_between(corrected.time_utc, fits.time_utc) + 1.5).abs() < 1e-6,
        "a fast clock is subtracted"
    );
    let exif =
        measure_file(&dir.join("venus2012-a.png"), &InstantOptions::default()).expect("exif");
    assert_eq!(exif.instant_source, InstantSource::Exif);
    assert!(seconds_between(exif.time_utc, time_of("venus2012-a.png")).abs() < 1e-6);
    // No offset in the EXIF: refused unless the camera's zone is given (+06:00 in the generator).
    let refused = measure_file(&dir.join("venus2012-c.png"), &InstantOptions::default());
    assert!(
        matches!(refused, Err(MeasureError::Instant { .. })),
        "{refused:?}"
    );
    let zoned = InstantOptions {
        camera_utc_offset_s: Some(6 * 3600),
        ..Default::default()
    };
    let c = measure_file(&dir.join("venus2012-c.png"), &zoned).expect("zoned");
    assert_eq!(c.instant_source, InstantSource::ExifWithGivenZone);
    assert!(seconds_between(c.time_utc, time_of("venus2012-c.png")).abs() < 1e-6);
    // --time-utc overrides; a PNG without EXIF needs it.
    let given = InstantOptions {
        time_utc: Some(utc("2016-05-09T12:00:00Z")),
        ..Default::default()
    };
    let g = measure_file(&dir.join("mercury2016-a.png"), &given).expect("given");
    assert_eq!(
        (g.instant_source, g.time_utc),
        (InstantSource::Given, utc("2016-05-09T12:00:00Z"))
    );
    let none = measure_file(&dir.join("mercury2016-a.png"), &InstantOptions::default());
    assert!(
        matches!(none, Err(MeasureError::Instant { .. })),
        "{none:?}"
    );
}

#[test]
fn bad_images_are_refused_with_a_sentence_naming_the_file() {
    // Common practice, no source: the refusal cases of generate_solar_images.py.
    let given = InstantOptions {
        time_utc: Some(utc("2012-06-06T01:00:00Z")),
        ..Default::default()
    };
    let dir = images_dir();
    let outcome = |file: &str| measure_file(&dir.join(file), &given).expect_err(file);
    type Expect = fn(&MeasureError) -> bool;
    let cases: [(&str, Expect); 4] = [
        ("refuse-no-sun.png", |e| {
            matches!(e, MeasureError::NoSun { .. })
        }),
        ("refuse-clipped.png", |e| {
            matches!(e, MeasureError::ClippedLimb { .. })
        }),
        ("refuse-no-planet.png", |e| {
            matches!(e, MeasureError::NoPlanet { .. })
        }),
        ("refuse-two-discs.png", |e| {
            matches!(e, MeasureError::SeveralCandidates { count: 2, .. })
        }),
    ];
    for (file, expected) in cases {
        let e = outcome(file);
        assert!(expected(&e), "{file}: {e}");
        assert!(e.to_string().contains(file), "{e}");
    }
    let missing = measure_file(&dir.join("no-such-file.png"), &given).expect_err("missing");
    assert!(matches!(missing, MeasureError::Io { .. }));
    let not_image = measure_file(&dir.join("truth.csv"), &given).expect_err("csv");
    assert!(
        matches!(not_image, MeasureError::Format { .. }),
        "{not_image}"
    );
}

/// The limb-darkening law of the generator: Cox (2000), section 14.7, u2 = 0.93, v2 = -0.23.
fn law(mu: f64) -> f64 {
    1.0 - 0.93 + 0.23 + 0.93 * mu - 0.23 * mu * mu
}

const SKY: f64 = 0.02;

struct Scene {
    sun: (f64, f64, f64),
    planet: (f64, f64, f64),
}

impl Scene {
    fn intensity(&self, x: f64, y: f64) -> f64 {
        let r = (x - self.sun.0).hypot(y - self.sun.1);
        if r >= self.sun.2 || (x - self.planet.0).hypot(y - self.planet.1) < self.planet.2 {
            return SKY;
        }
        law((1.0 - (r / self.sun.2).powi(2)).max(0.0).sqrt())
    }

    /// Pixel values: edges integrated on a 12 x 12 grid, as the generator does on 16 x 16.
    fn pixel(&self, x: f64, y: f64) -> f64 {
        let near = |c: (f64, f64, f64)| ((x - c.0).hypot(y - c.1) - c.2).abs() < 1.5;
        if !(near(self.sun) || near(self.planet)) {
            return self.intensity(x, y);
        }
        let k = 12;
        let mut sum = 0.0;
        for i in 0..k {
            for j in 0..k {
                let (dx, dy) = (
                    (i as f64 + 0.5) / k as f64 - 0.5,
                    (j as f64 + 0.5) / k as f64 - 0.5,
                );
                sum += self.intensity(x + dx, y + dy);
            }
        }
        sum / (k * k) as f64
    }
}

/// A separable Gaussian blur (edges clamped).
fn blur(pixels: &[f64], width: usize, height: usize, sigma_px: f64) -> Vec<f64> {
    let reach = (5.0 * sigma_px).ceil() as isize;
    let kernel: Vec<f64> = (-reach..=reach)
        .map(|k| (-0.5 * (k as f64 / sigma_px).powi(2)).exp())
        .collect();
    let total: f64 = kernel.iter().sum();
    let pass = |input: &[f64], along_rows: bool| -> Vec<f64> {
        let mut out = vec![0.0; input.len()];
        for row in 0..height {
            for col in 0..width {
                let mut sum = 0.0;
                for (k, w) in kernel.iter().enumerate() {
                    let offset = k as isize - reach;
                    let (c, r) = if along_rows {
                        (col as isize + offset, row as isize)
                    } else {
                        (col as isize, row as isize + offset)
                    };
                    let (c, r) = (
                        c.clamp(0, width as isize - 1) as usize,
                        r.clamp(0, height as isize - 1) as usize,
                    );
                    sum += w * input[r * width + c];
                }
                out[row * width + col] = sum / total;
            }
        }
        out
    };
    pass(&pass(pixels, true), false)
}

fn render_noisy(row: &csv::StringRecord) -> (GreyImage, f64) {
    let f = |i: usize| row[i].parse::<f64>().expect("number");
    let (width, height) = (f(5) as usize, f(6) as usize);
    let scene = Scene {
        sun: (f(7), f(8), f(9)),
        planet: (f(10), f(11), f(12)),
    };
    let mut pixels = Vec::with_capacity(width * height);
    for y in 0..height {
        for x in 0..width {
            pixels.push(scene.pixel(x as f64, y as f64));
        }
    }
    let mut blurred = blur(&pixels, width, height, f(13));
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(f(15) as u64);
    let noise = Normal::new(0.0, f(14)).expect("noise");
    blurred
        .iter_mut()
        .for_each(|v| *v += noise.sample(&mut rng));
    let image =
        GreyImage::new(width, height, blurred.iter().map(|&v| v as f32).collect()).expect("image");
    (image, f(4))
}

#[test]
fn noisy_images_agree_within_their_stated_sigma() {
    // Source: noisy_cases.csv from generate_solar_images.py (Skyfield + DE421 places), rendered
    // here with the generator's law, blur and noise. For an honest uncertainty the z-scores
    // (measured - true) / sigma have a spread near 1.
    let cases = records("noisy_cases.csv");
    let z: Vec<f64> = cases
        .par_iter()
        .map(|row| {
            let (image, truth) = render_noisy(row);
            let m = measure_disc(Path::new(&format!("case-{}", &row[0])), &image)
                .unwrap_or_else(|e| panic!("{e}"));
            (m.separation_solar_radii - truth) / m.sigma_solar_radii
        })
        .collect();
    let n = z.len() as f64;
    let mean = z.iter().sum::<f64>() / n;
    let spread = (z.iter().map(|v| (v - mean).powi(2)).sum::<f64>() / (n - 1.0)).sqrt();
    eprintln!(
        "{} noisy images: mean z {mean:+.3}, spread {spread:.3}, largest |z| {:.2}",
        z.len(),
        z.iter().fold(0.0f64, |a, v| a.max(v.abs()))
    );
    assert!((0.8..=1.25).contains(&spread), "spread of z {spread}");
    assert!(mean.abs() < 3.0 * spread / n.sqrt() + 0.1, "mean z {mean}");
}

#[test]
fn the_command_writes_one_row_per_measured_image_and_reports_the_others() {
    // Common practice, no source: the interface's position-row columns.
    let dir = images_dir();
    let run = |args: &[&str]| {
        std::process::Command::new(env!("CARGO_BIN_EXE_transit-parallax"))
            .args(args)
            .output()
            .expect("run")
    };
    let fits = dir.join("venus2012-b.fits");
    let no_sun = dir.join("refuse-no-sun.png");
    let out = run(&[
        "measure",
        fits.to_str().expect("path"),
        no_sun.to_str().expect("path"),
        "--station",
        "hill-camp",
        "--latitude",
        "1.35",
        "--longitude",
        "103.82",
        "--elevation-m",
        "160",
    ]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8_lossy(&out.stdout);
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(lines[0], "station,latitude,longitude,elevation_m,contact,time_utc,separation_solar_radii,sigma_solar_radii");
    assert_eq!(lines.len(), 2, "{text}");
    assert!(
        lines[1].starts_with("hill-camp,1.35,103.82,160,,2012-06-06T02:26:24.000Z,0.630"),
        "{}",
        lines[1]
    );
    let stderr = String::from_utf8_lossy(&out.stderr);
    assert!(
        stderr.contains("refuse-no-sun.png") && stderr.contains("no Sun"),
        "{stderr}"
    );
    let json = run(&["measure", fits.to_str().expect("path"), "--format", "json"]);
    let rows: serde_json::Value = serde_json::from_slice(&json.stdout).expect("json");
    assert!(rows[0]["sun_radius_px"]
        .as_f64()
        .is_some_and(|r| (r - 140.0).abs() < 0.1));
    assert_eq!(rows[0]["contact"], serde_json::Value::Null);
    let none = run(&["measure", no_sun.to_str().expect("path")]);
    assert!(!none.status.success());
    let help = run(&["measure", "--help"]);
    let help_text = String::from_utf8_lossy(&help.stdout);
    assert!(
        help_text.contains("certified solar filter") && help_text.contains("never look"),
        "{help_text}"
    );
}

/// A FITS file written by hand: BITPIX -32, the given extra cards, the pixels as f32.
fn fits_bytes(image: &GreyImage, extra_cards: &[String]) -> Vec<u8> {
    let mut cards = vec![
        format!("{:<8}= {:>20}", "SIMPLE", "T"),
        format!("{:<8}= {:>20}", "BITPIX", "-32"),
        format!("{:<8}= {:>20}", "NAXIS", "2"),
        format!("{:<8}= {:>20}", "NAXIS1", image.width),
        format!("{:<8}= {:>20}", "NAXIS2", image.height),
    ];
    cards.extend(extra_cards.iter().cloned());
    cards.push("END".to_string());
    let mut bytes: Vec<u8> = cards
        .iter()
        .flat_map(|c| format!("{c:<80}").into_bytes())
        .collect();
    bytes.resize(bytes.len().div_ceil(2880) * 2880, b' ');
    bytes.extend(image.pixels.iter().flat_map(|v| v.to_be_bytes()));
    bytes.resize(bytes.len().div_ceil(2880) * 2880, 0);
    bytes
}

#[test]
fn tiff_jpeg_and_float_fits_are_read_with_the_time_from_date_obs() {
    // Source: venus2012-b.fits and its truth (generate_solar_images.py), re-encoded here.
    let truth: f64 = records("truth.csv")
        .iter()
        .find(|r| &r[0] == "venus2012-b.fits")
        .expect("row")[7]
        .parse()
        .expect("truth");
    let fits_path = images_dir().join("venus2012-b.fits");
    let (image, _, _) =
        transit_parallax::images::read_image(&fits_path, &InstantOptions::default()).expect("fits");
    let top = image.pixels.iter().fold(0.0f32, |a, &v| a.max(v));
    let dir = std::env::temp_dir().join(format!("measure-formats-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp dir");
    let grey16: Vec<u16> = image
        .pixels
        .iter()
        .map(|v| (v / top * 60000.0).round() as u16)
        .collect();
    let buffer16 = image::ImageBuffer::<image::Luma<u16>, _>::from_raw(
        image.width as u32,
        image.height as u32,
        grey16,
    )
    .expect("buffer");
    buffer16.save(dir.join("venus.tiff")).expect("tiff");
    let grey8: Vec<u8> = image
        .pixels
        .iter()
        .map(|v| (v / top * 250.0).round() as u8)
        .collect();
    let buffer8 = image::ImageBuffer::<image::Luma<u8>, _>::from_raw(
        image.width as u32,
        image.height as u32,
        grey8,
    )
    .expect("buffer");
    let mut jpeg = Vec::new();
    image::codecs::jpeg::JpegEncoder::new_with_quality(&mut jpeg, 95)
        .encode_image(&buffer8)
        .expect("jpeg");
    std::fs::write(dir.join("venus.jpg"), jpeg).expect("write");
    let given = InstantOptions {
        time_utc: Some(utc("2012-06-06T02:26:24Z")),
        ..Default::default()
    };
    for (file, tolerance) in [("venus.tiff", 2e-4), ("venus.jpg", 1e-3)] {
        let m = measure_file(&dir.join(file), &given).unwrap_or_else(|e| panic!("{e}"));
        let error = m.disc.separation_solar_radii - truth;
        eprintln!(
            "{file}: error {error:+.2e} sigma {:.1e}",
            m.disc.sigma_solar_radii
        );
        assert!(error.abs() < tolerance, "{file}: {error}");
    }
    // A float FITS without DATE-OBS: measured, but its time must be given.
    std::fs::write(dir.join("float.fits"), fits_bytes(&image, &[])).expect("write");
    let no_time =
        measure_file(&dir.join("float.fits"), &InstantOptions::default()).expect_err("no DATE-OBS");
    assert!(
        matches!(no_time, MeasureError::Instant { .. }) && no_time.to_string().contains("DATE-OBS"),
        "{no_time}"
    );
    let timed = fits_bytes(
        &image,
        &[
            format!("{:<8}= '2012-06-06T02:26:23.5'", "DATE-OBS"),
            format!("{:<8}= {:>20}", "EXPTIME", "1.0"),
        ],
    );
    std::fs::write(dir.join("timed.fits"), &timed).expect("write");
    let m = measure_file(&dir.join("timed.fits"), &InstantOptions::default()).expect("timed");
    assert_eq!(
        m.time_utc,
        utc("2012-06-06T02:26:24Z"),
        "DATE-OBS + EXPTIME / 2"
    );
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn truncated_and_garbled_files_are_refused_with_typed_errors() {
    // Common practice, no source: no panic on a bad file.
    let fits_path = images_dir().join("venus2012-b.fits");
    let (image, _, _) =
        transit_parallax::images::read_image(&fits_path, &InstantOptions::default()).expect("fits");
    let dir = std::env::temp_dir().join(format!("measure-bad-files-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp dir");
    let given = InstantOptions {
        time_utc: Some(utc("2012-06-06T02:26:24Z")),
        ..Default::default()
    };
    let timed = fits_bytes(
        &image,
        &[format!("{:<8}= '2012-06-06T02:26:23.5'", "DATE-OBS")],
    );
    std::fs::write(dir.join("short.fits"), &timed[..4000]).expect("write");
    assert!(matches!(
        measure_file(&dir.join("short.fits"), &given),
        Err(MeasureError::Format { .. })
    ));
    let png = std::fs::read(images_dir().join("venus2012-a.png")).expect("png");
    std::fs::write(dir.join("short.png"), &png[..png.len() / 3]).expect("write");
    assert!(matches!(
        measure_file(&dir.join("short.png"), &given),
        Err(MeasureError::Format { .. })
    ));
    std::fs::write(
        dir.join("garbage.jpg"),
        b"\xff\xd8\xff\xe0 not really a jpeg",
    )
    .expect("write");
    assert!(matches!(
        measure_file(&dir.join("garbage.jpg"), &given),
        Err(MeasureError::Format { .. })
    ));
    let _ = std::fs::remove_dir_all(&dir);
}

/// The EXIF block a PNG carries in its `eXIf` chunk (the generator's bytes).
fn png_exif(png: &[u8]) -> Vec<u8> {
    let mut at = 8;
    while at + 12 <= png.len() {
        let len = u32::from_be_bytes(png[at..at + 4].try_into().unwrap()) as usize;
        if &png[at + 4..at + 8] == b"eXIf" {
            return png[at + 8..at + 8 + len].to_vec();
        }
        at += 12 + len;
    }
    panic!("no eXIf chunk");
}

/// A camera's JPEG: venus2012-a re-encoded at quality 95 by the `image` crate, with the
/// generator's EXIF block (DateTimeOriginal, SubSecTimeOriginal, OffsetTimeOriginal +08:00)
/// in an APP1 segment after the start of image, as cameras write it (CIPA DC-008, the Exif
/// 2.3 standard, section 4.5.4, cited from memory). The instant comes from it, and the
/// separation stays within 2e-4 solar radii of the truth (truth.csv, Skyfield + DE421).
#[test]
fn a_camera_jpeg_gives_its_exif_instant() {
    let dir = images_dir();
    let png = std::fs::read(dir.join("venus2012-a.png")).unwrap();
    let exif = png_exif(&png);
    let grey = image::load_from_memory(&png).unwrap().to_luma8();
    let mut jpeg = Vec::new();
    image::codecs::jpeg::JpegEncoder::new_with_quality(&mut jpeg, 95)
        .encode_image(&grey)
        .unwrap();
    let mut segment = vec![0xFF, 0xE1];
    segment.extend_from_slice(&((2 + 6 + exif.len()) as u16).to_be_bytes());
    segment.extend_from_slice(b"Exif\0\0");
    segment.extend_from_slice(&exif);
    jpeg.splice(2..2, segment);
    let path = std::env::temp_dir().join(format!("tp-camera-{}.jpg", std::process::id()));
    std::fs::write(&path, &jpeg).unwrap();
    let m = measure_file(&path, &InstantOptions::default()).expect("a camera JPEG");
    let _ = std::fs::remove_file(&path);
    let truth = records("truth.csv");
    let row = truth.iter().find(|r| &r[0] == "venus2012-a.png").unwrap();
    assert_eq!(m.instant_source, InstantSource::Exif);
    assert!(seconds_between(m.time_utc, utc(&row[6])).abs() < 1e-3);
    let error = m.disc.separation_solar_radii - row[7].parse::<f64>().unwrap();
    assert!(error.abs() < 2e-4, "error {error:e} solar radii");
}
