//! The JPL development ephemerides around every transit of Mercury and Venus from 1600 to
//! 2300, as compact Chebyshev series compiled into the crate (`src/data/jpl_windows.txt`,
//! 95 kB).
//!
//! `tools/fit_jpl_windows.py` fitted them with `jplephem` to the PyPI packages `de405`,
//! `de421`, `de422` and `de423` (the script says which ephemeris serves which years): the
//! barycentric positions of the Earth, the Sun and the planet, ICRF axes, over 5 days about
//! each transit and near miss, within 2 m of the ephemeris (1.25 m worst, measured by the
//! script; `tests/reference_ephemeris.rs` checks 660 positions from the script within 1 km).
//! The argument is TDB, taken equal to TT as everywhere in the tool (under 2 ms).
//! References: E. M. Standish, "JPL Planetary and Lunar Ephemerides, DE405/LE405", JPL IOM
//! 312.F-98-048 (1998); W. M. Folkner, J. G. Williams, D. H. Boggs, "The Planetary and Lunar
//! Ephemeris DE 421", JPL IOM 343R-08-003 (2008); Chebyshev series as in Press et al.,
//! *Numerical Recipes*, 3rd ed., section 5.8.

use crate::sky::chebyshev::Chebyshev;
use crate::sky::constants::{AU_KM, SECONDS_PER_DAY};
use crate::sky::ephemeris::Planet;
use crate::sky::vector::V3;
use crate::time::scales::Tt;

/// The fitted series, as compiled in.
const DATA: &str = include_str!("../data/jpl_windows.txt");

/// A body whose barycentric position a window holds.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Body {
    /// The Earth's centre.
    Earth,
    /// The Sun's centre.
    Sun,
    /// The window's planet.
    Planet,
}

/// One segment of a body's series: where it ends (days from the window's start; it starts
/// where the one before ends), and x, y, z in km.
#[derive(Clone, Debug)]
struct Segment {
    end_days: f64,
    axes: [Chebyshev; 3],
}

/// The series of one transit (or near miss): a few days of one JPL ephemeris.
#[derive(Clone, Debug)]
pub struct Window {
    /// The planet.
    pub planet: Planet,
    /// The ephemeris fitted, e.g. `DE421`.
    pub source: String,
    start: Tt,
    length_days: f64,
    bodies: [Vec<Segment>; 3],
}

impl Window {
    /// Days from the window's start to an instant.
    fn days_in(&self, tt: Tt) -> f64 {
        tt.seconds_since(self.start) / SECONDS_PER_DAY
    }

    /// Whether the instant falls inside the window.
    pub fn covers(&self, tt: Tt) -> bool {
        (0.0..=self.length_days).contains(&self.days_in(tt))
    }

    /// Barycentric position (au) and velocity (au/day) of a body at an instant of the window
    /// (clamped to the window's ends outside it).
    pub fn position_velocity_au(&self, body: Body, tt: Tt) -> (V3, V3) {
        let d = self.days_in(tt).clamp(0.0, self.length_days);
        let segments = &self.bodies[body as usize];
        let seg = segments
            .iter()
            .find(|s| d <= s.end_days)
            .or(segments.last());
        let mut p = [0.0; 3];
        let mut v = [0.0; 3];
        if let Some(seg) = seg {
            for k in 0..3 {
                let (value, rate) = seg.axes[k].value_and_rate(d);
                p[k] = value / AU_KM;
                v[k] = rate / AU_KM;
            }
        }
        (p, v)
    }

    /// Barycentric position of a body, au.
    pub fn position_au(&self, body: Body, tt: Tt) -> V3 {
        self.position_velocity_au(body, tt).0
    }
}

/// Every window compiled in, read once.
pub fn windows() -> &'static [Window] {
    static WINDOWS: std::sync::OnceLock<Vec<Window>> = std::sync::OnceLock::new();
    WINDOWS.get_or_init(|| parse(DATA).unwrap_or_default())
}

/// The window of this planet that covers this instant, if any.
pub fn window_for(planet: Planet, tt: Tt) -> Option<&'static Window> {
    windows()
        .iter()
        .find(|w| w.planet == planet && w.covers(tt))
}

/// Read the data file's format (see its header): `window,...` lines, each followed by the
/// body lines of its segments. Returns the line (1-based) and a reason on a malformed line.
fn parse(text: &str) -> Result<Vec<Window>, (usize, String)> {
    let mut out: Vec<Window> = Vec::new();
    for (k, line) in text.lines().enumerate() {
        let bad = |why: &str| (k + 1, format!("{why}: {line}"));
        if line.starts_with('#') || line.trim().is_empty() {
            continue;
        }
        let f: Vec<&str> = line.split(',').collect();
        let num = |s: &str| s.trim().parse::<f64>().map_err(|_| bad("not a number"));
        if f[0] == "window" {
            if f.len() != 5 {
                return Err(bad("a window line has 5 fields"));
            }
            let planet = Planet::parse(f[1]).ok_or_else(|| bad("unknown planet"))?;
            out.push(Window {
                planet,
                source: f[2].to_string(),
                start: Tt::from_jd(num(f[3])?),
                length_days: num(f[4])?,
                bodies: [Vec::new(), Vec::new(), Vec::new()],
            });
            continue;
        }
        if f.len() != 5 {
            return Err(bad("a series line has 5 fields"));
        }
        let window = out
            .last_mut()
            .ok_or_else(|| bad("a series before any window"))?;
        let body = match f[0] {
            "earth" => Body::Earth,
            "sun" => Body::Sun,
            "mercury" | "venus" => Body::Planet,
            _ => return Err(bad("unknown body")),
        };
        let axis = "xyz".find(f[3]).ok_or_else(|| bad("unknown axis"))?;
        let (start, length) = (num(f[1])?, num(f[2])?);
        let coeffs: Vec<f64> = f[4].split_whitespace().map(num).collect::<Result<_, _>>()?;
        let series = Chebyshev::from_coefficients(start, start + length, &coeffs);
        let segments = &mut window.bodies[body as usize];
        if axis == 0 {
            segments.push(Segment {
                end_days: start + length,
                axes: [series; 3],
            });
        } else if let Some(seg) = segments.last_mut() {
            seg.axes[axis] = series;
        } else {
            return Err(bad("a y or z series before its x"));
        }
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_compiled_windows_parse_and_cover_every_transit_of_venus() {
        assert!(parse(DATA).is_ok(), "{:?}", parse(DATA).err());
        let w = windows();
        assert_eq!(w.len(), 110);
        // The transits of Venus 1600-2300 (common practice, no source: the pairs 1631/1639,
        // 1761/1769, 1874/1882, 2004/2012, 2117/2125, 2247/2255).
        let venus: Vec<i32> = w
            .iter()
            .filter(|w| w.planet == Planet::Venus)
            .map(|w| (2000.0 + (w.start.days_j2000() + 2.5) / 365.25).floor() as i32)
            .collect();
        assert_eq!(
            venus,
            [1631, 1639, 1761, 1769, 1874, 1882, 2004, 2012, 2117, 2125, 2247, 2255]
        );
        for w in w {
            for b in &w.bodies {
                assert!(!b.is_empty() && b.iter().all(|s| s.axes.iter().all(|a| a.len() >= 2)));
            }
        }
    }

    #[test]
    fn a_malformed_line_is_named() {
        assert_eq!(parse("earth,0,5,x,1 2").unwrap_err().0, 1);
        assert_eq!(
            parse("window,venus,DE421,2456082.0,5.0\nsun,0,5,q,1")
                .unwrap_err()
                .0,
            2
        );
        assert!(parse("window,pluto,DE421,1,5").is_err());
    }

    #[test]
    fn velocity_is_the_rate_of_the_position() {
        let w = &windows()[0];
        let t = w.start.add_seconds(2.3 * 86_400.0);
        let (_, v) = w.position_velocity_au(Body::Earth, t);
        let a = w.position_au(Body::Earth, t.add_seconds(-60.0));
        let b = w.position_au(Body::Earth, t.add_seconds(60.0));
        for k in 0..3 {
            let fd = (b[k] - a[k]) / (120.0 / 86_400.0);
            assert!((fd - v[k]).abs() < 1e-9, "{fd} {}", v[k]);
        }
    }
}
