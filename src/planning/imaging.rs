//! What a camera's images would tell of the solar parallax: the information that measured
//! positions of the planet on the disc carry, for forecasts beside the contacts'.
//!
//! A station photographs the Sun every `every_s` seconds while the planet's disc is wholly
//! inside the Sun's (between its own contacts II and III) and the Sun stands at least at the
//! minimum altitude; each image gives the separation of the centres in the Sun's radius with
//! the standard uncertainty `sigma_solar_radii`. Each such position adds the row of partial
//! derivatives of the separation (`geometry::disc_position`) with respect to the parallax and
//! the planet's offsets (per arcsecond) and to the station's own factor on the Sun's apparent
//! radius (seeing and the definition of the limb bias a station's measured radius alike on all
//! its images), weighted 1/sigma^2. The station's factor is eliminated on the spot (the Schur
//! complement of its block), so that what is left adds to the network's information on the
//! classic parameters exactly as the reduction would treat it. The radius corrections of the
//! contacts do not enter a position.
//!
//! References: S. D. Silvey, *Optimal Design* (1980), ch. 1-3 (information matrices);
//! nuisance parameters eliminated by the Schur complement: e.g. P. R. Bevington and D. K.
//! Robinson, *Data Reduction and Error Analysis*, 3rd ed. (2003), chapter 8, with the block
//! elimination of `reduction/normal_equations.rs`.

use crate::geometry::besselian::length_scale_rate_per_arcsec;
use crate::geometry::contacts::{sun_alt_az_parallactic, Contact, Perturbation};
use crate::geometry::disc_position::place_model;
use crate::geometry::station::Station;
use crate::geometry::transit::TransitEvent;
use crate::reduction::parameters::{N_CLASSIC, OFFSET_EAST, OFFSET_NORTH, PARALLAX};
use nalgebra::{SMatrix, SVector};

/// The information matrix of the classic parameters.
pub type Info = SMatrix<f64, N_CLASSIC, N_CLASSIC>;

/// How the stations would image the Sun.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Imaging {
    /// Seconds between images.
    pub every_s: f64,
    /// Standard uncertainty of one measured separation, in the Sun's radius.
    pub sigma_solar_radii: f64,
}

/// What one station's images would measure.
#[derive(Clone, Debug, PartialEq)]
pub struct SitePositions {
    /// How many images (positions) in the window.
    pub count: usize,
    /// The first and last image, hours from the elements' epoch (`None` without images).
    pub window_hours: Option<(f64, f64)>,
    /// Their information on the classic parameters, the station's radius factor eliminated.
    pub info: Info,
}

/// The positions a station would measure and their information.
///
/// Arguments: `event`; `st`; `imaging`; `min_altitude_deg`, the least altitude of the Sun.
pub fn site_positions(
    event: &TransitEvent,
    st: &Station,
    imaging: &Imaging,
    min_altitude_deg: f64,
) -> SitePositions {
    let geo = st.geocentric();
    let el = &event.elements;
    let pred = event.predict(st);
    let none = SitePositions {
        count: 0,
        window_hours: None,
        info: Info::zeros(),
    };
    let (Some(second), Some(third)) = (
        pred.contacts[Contact::II.index()],
        pred.contacts[Contact::III.index()],
    ) else {
        return none;
    };
    let er = event.earth_radii_per_arcsec();
    let step_h = imaging.every_s / 3600.0;
    let w = 1.0 / (imaging.sigma_solar_radii * imaging.sigma_solar_radii);
    // Accumulate [classic | radius factor] as a 6 x 6 block, then eliminate the factor.
    let mut block = SMatrix::<f64, 6, 6>::zeros();
    let (mut count, mut first, mut last) = (0, f64::NAN, f64::NAN);
    let mut h = second.hours + 0.5 * step_h;
    while h < third.hours {
        let up = sun_alt_az_parallactic(el, &geo, h).0 >= min_altitude_deg;
        let m = up.then(|| place_model(el, &geo, h, &Perturbation::NOMINAL));
        // Measured only while the planet's disc is wholly inside the Sun's.
        if let Some(m) = m.filter(|m| m.separation_solar_radii + m.planet_radius_solar_radii <= 1.0)
        {
            let p = m.separation_partials;
            let mut r = SVector::<f64, 6>::zeros();
            r[PARALLAX] = p.per_scale * length_scale_rate_per_arcsec();
            r[OFFSET_EAST] = p.per_dx_er * er;
            r[OFFSET_NORTH] = p.per_dy_er * er;
            // The model's separation over (1 + factor): -rho per unit factor.
            r[N_CLASSIC] = -m.separation_solar_radii;
            block += w * r * r.transpose();
            if count == 0 {
                first = h;
            }
            count += 1;
            last = h;
        }
        h += step_h;
    }
    if count == 0 {
        return none;
    }
    SitePositions {
        count,
        window_hours: Some((first, last)),
        info: eliminate_factor(&block),
    }
}

/// The classic block with the last parameter (the station's factor) eliminated:
/// A - b b^T / c.
fn eliminate_factor(block: &SMatrix<f64, 6, 6>) -> Info {
    let a: Info = block.fixed_view::<N_CLASSIC, N_CLASSIC>(0, 0).into_owned();
    let b: SVector<f64, N_CLASSIC> = block.fixed_view::<N_CLASSIC, 1>(0, N_CLASSIC).into_owned();
    let c = block[(N_CLASSIC, N_CLASSIC)];
    if c > 0.0 {
        a - b * b.transpose() / c
    } else {
        a
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::planning::sites::forecast_sigma;
    use crate::time::iso::parse_date;
    use crate::time::scales::TimeModel;
    use crate::{transit_on_date, Planet};

    fn event() -> TransitEvent {
        transit_on_date(
            Planet::Venus,
            parse_date("2012-06-06").unwrap(),
            &TimeModel::default(),
        )
        .unwrap()
    }

    fn station(name: &str, lat: f64, lon: f64) -> Station {
        Station::new(name, lat, lon, 0.0).unwrap()
    }

    /// A station that sees the whole transit with the Sun up takes an image every minute of
    /// it; twice the cadence gives twice the images and twice the information.
    #[test]
    fn images_fill_the_window_and_information_grows_with_them() {
        let ev = event();
        let st = station("north", 64.8, -147.7);
        let every = |s: f64| Imaging {
            every_s: s,
            sigma_solar_radii: 1e-3,
        };
        let a = site_positions(&ev, &st, &every(60.0), 5.0);
        let b = site_positions(&ev, &st, &every(30.0), 5.0);
        // Venus 2012 from Alaska: about 6.1 h between II and III, all with the Sun up.
        assert!((350..380).contains(&a.count), "{} images", a.count);
        assert!((b.count as f64 / a.count as f64 - 2.0).abs() < 0.02);
        let ratio = b.info[(0, 0)] / a.info[(0, 0)];
        assert!((ratio - 2.0).abs() < 0.05, "{ratio}");
        let (first, last) = a.window_hours.unwrap();
        assert!(last > first);
    }

    /// A station where the Sun is down through the transit measures nothing.
    #[test]
    fn no_images_without_the_sun() {
        let ev = event();
        // Venus 2012 (01:30 UT at mid-transit) is night in western Europe and Africa.
        let st = station("dark", 0.0, 0.0);
        let s = site_positions(
            &ev,
            &st,
            &Imaging {
                every_s: 60.0,
                sigma_solar_radii: 1e-3,
            },
            5.0,
        );
        assert_eq!(s.count, 0);
        assert!(s.window_hours.is_none());
        assert_eq!(s.info, Info::zeros());
    }

    /// Two stations far apart in latitude determine the parallax from positions alone (the
    /// chords' separation on the disc, measured in the Sun's radius); one alone cannot, once
    /// its factor on the Sun's radius and the planet's offsets are free.
    #[test]
    fn positions_from_two_stations_determine_the_parallax() {
        let ev = event();
        let imaging = Imaging {
            every_s: 60.0,
            sigma_solar_radii: 5e-4,
        };
        let north = site_positions(&ev, &station("north", 64.8, -147.7), &imaging, 5.0);
        let south = site_positions(&ev, &station("south", -33.9, 151.2), &imaging, 5.0);
        let both = forecast_sigma(&(north.info + south.info)).expect("determined");
        // The differential parallax of Venus is about 22" across the Earth (common practice:
        // 8.8" x (1/0.29 - 1) per Earth radius, figures from memory): a separation known to
        // 5e-4 of 946" (0.47") a few hundred times over gives a few hundredths of an
        // arcsecond of solar parallax.
        eprintln!("two stations, positions alone: {both:.4} arcsec");
        assert!(both > 0.005 && both < 0.2, "{both}");
        assert!(forecast_sigma(&north.info).is_none_or(|s| s > 10.0 * both));
    }
}
