//! Transit events: finding every transit of a planet in a span of years, naming one by date,
//! and predicting any station's contacts for it.
//!
//! Search: inferior conjunctions are found as zeros of the heliocentric longitude difference
//! (VSOP87A), kept where the geocentric elongation is under a degree; the instant of least
//! apparent separation (greatest transit) is then found by golden-section search on the full
//! model, and the elements are fitted about it.
//!
//! References: J. Meeus, *Astronomical Algorithms*, 2nd ed. (1998), chapter 36 (conjunctions
//! of planets) for the approach; golden-section search: Press et al., *Numerical Recipes*,
//! 3rd ed., section 10.2.

use crate::error::{Error, Result};
use crate::geometry::besselian::{geocentric_separation_rad, Elements};
use crate::geometry::contacts::{
    solve_contact_hours, solve_with_circumstances, Contact, ContactCircumstances, Perturbation,
};
use crate::geometry::station::{GeocentricStation, Station};
use crate::sky::constants::ARCSEC_RAD;
use crate::sky::ephemeris::{
    geocentric_state, geometric_elongation_rad, heliocentric_longitude_difference_rad, Planet,
};
use crate::time::iso::format_utc;
use crate::time::scales::{TimeModel, Tt, MAX_YEAR, MIN_YEAR};
use chrono::{Datelike, NaiveDate, NaiveDateTime};

/// One transit of Mercury or Venus, with its elements.
#[derive(Clone, Debug)]
pub struct TransitEvent {
    /// The planet.
    pub planet: Planet,
    /// Elements fitted about greatest transit.
    pub elements: Elements,
    /// Greatest transit (least geocentric apparent separation of centres), TT.
    pub greatest: Tt,
    /// Least geocentric separation of centres, arcseconds.
    pub min_separation_arcsec: f64,
    /// Geocentric contacts I-IV as hours from the elements' epoch (`None` for a contact that
    /// does not occur, e.g. II and III of a grazing transit).
    pub geocentric_hours: [Option<f64>; 4],
}

/// A station's predicted contacts.
#[derive(Clone, Debug)]
pub struct StationPrediction {
    /// The station.
    pub station: Station,
    /// Each contact's circumstances, `None` where the station sees no such contact.
    pub contacts: [Option<ContactCircumstances>; 4],
}

impl TransitEvent {
    /// Build the event about a time near greatest transit (within half a day), or `None` when
    /// the planet does not reach the Sun's disc as seen from the Earth's centre.
    pub fn near(planet: Planet, guess: Tt, time_model: &TimeModel) -> Option<TransitEvent> {
        // First pass: elements about the guess, greatest transit from the fitted vectors.
        let first = Elements::compute_with_nodes(planet, guess, time_model, 9);
        let h = golden_minimum(|h| first.geocentric_separation_rad(h), -6.0, 6.0, 1e-6);
        let centre = first.instant(h);
        // Second pass: elements centred on greatest transit, which is then refined.
        let second = Elements::compute(planet, centre, time_model);
        let h = golden_minimum(|h| second.geocentric_separation_rad(h), -0.5, 0.5, 1e-8);
        let greatest = second.instant(h);
        let state = geocentric_state(planet, greatest, time_model);
        let (min_sep, ext_limit, _) = geocentric_separation_rad(planet, &state);
        if min_sep >= ext_limit {
            return None;
        }
        let elements = second;
        let mut geocentric_hours = [None; 4];
        for c in Contact::ALL {
            geocentric_hours[c.index()] =
                solve_contact_hours(&elements, None, c, h, &Perturbation::NOMINAL);
        }
        geocentric_hours[0]?;
        Some(TransitEvent {
            planet,
            elements,
            greatest,
            min_separation_arcsec: min_sep / ARCSEC_RAD,
            geocentric_hours,
        })
    }

    /// The time model the event was computed with.
    pub fn time_model(&self) -> &TimeModel {
        &self.elements.time_model
    }

    /// The ephemeris the event was computed with: `JPL DE421` (or DE405, DE422, DE423) where
    /// a fitted window covers it and `--ephemeris jpl` is chosen, else `VSOP87A`.
    pub fn ephemeris_name(&self) -> String {
        crate::sky::ephemeris::ephemeris_name(
            self.planet,
            self.greatest,
            self.time_model().ephemeris,
        )
    }

    /// The label (UTC from 1972, UT1 before) of an instant given as hours from the epoch.
    pub fn label(&self, hours: f64) -> NaiveDateTime {
        self.time_model()
            .label_from_tt(self.elements.instant(hours))
    }

    /// The standard uncertainty of the event's Delta T, seconds (the published one: see
    /// [`TimeModel::delta_t_sigma_s`]); 0 when Delta T was fixed by the user.
    pub fn delta_t_sigma_s(&self) -> f64 {
        self.time_model().delta_t_sigma_s(self.greatest)
    }

    /// The UTC date of greatest transit.
    pub fn date(&self) -> NaiveDate {
        self.time_model().label_from_tt(self.greatest).date()
    }

    /// ISO time of greatest transit.
    pub fn greatest_utc(&self) -> String {
        format_utc(self.time_model().label_from_tt(self.greatest), 2)
    }

    /// Predict one station's contacts I-IV.
    pub fn predict(&self, station: &Station) -> StationPrediction {
        let geo = station.geocentric();
        StationPrediction {
            station: station.clone(),
            contacts: self.predict_geocentric(&geo),
        }
    }

    /// Predict contacts for a station given by geocentric coordinates (the fast path).
    #[inline]
    pub fn predict_geocentric(&self, geo: &GeocentricStation) -> [Option<ContactCircumstances>; 4] {
        let mut out = [None; 4];
        for c in Contact::ALL {
            out[c.index()] =
                solve_with_circumstances(&self.elements, Some(geo), c, self.start_hours(c));
        }
        out
    }

    /// One contact's circumstances at a station (the work of [`Self::predict`] for that
    /// contact alone), or `None` where it does not occur there.
    pub fn predict_contact(&self, station: &Station, c: Contact) -> Option<ContactCircumstances> {
        let geo = station.geocentric();
        solve_with_circumstances(&self.elements, Some(&geo), c, self.start_hours(c))
    }

    /// A first guess for a contact: the geocentric contact, or for a contact that does not
    /// occur geocentrically, greatest transit.
    pub fn start_hours(&self, c: Contact) -> f64 {
        self.geocentric_hours[c.index()].unwrap_or(0.0)
    }

    /// A contact's time (hours from the epoch) for trial parameters, for the reduction.
    pub fn contact_hours_perturbed(
        &self,
        geo: &GeocentricStation,
        c: Contact,
        p: &Perturbation,
    ) -> Option<f64> {
        solve_contact_hours(&self.elements, Some(geo), c, self.start_hours(c), p)
    }

    /// A geocentric contact's time (hours from the epoch) for trial parameters.
    pub fn contact_hours_perturbed_geocentric(&self, c: Contact, p: &Perturbation) -> Option<f64> {
        solve_contact_hours(&self.elements, None, c, self.start_hours(c), p)
    }

    /// Earth radii on the fundamental plane per arcsecond of angle on the sky, at greatest
    /// transit and the nominal AU: a displacement of the planet relative to the Sun by one
    /// arcsecond moves the axis by this much (1 / (1/|P| - 1/|S|) in Earth radii per radian).
    pub fn earth_radii_per_arcsec(&self) -> f64 {
        let p =
            crate::sky::vector::norm(self.elements.planet_earth_radii(self.hours_of_greatest()));
        let s = crate::sky::vector::norm(self.elements.sun_earth_radii(self.hours_of_greatest()));
        ARCSEC_RAD / (1.0 / p - 1.0 / s)
    }

    /// Hours from the elements' epoch to greatest transit.
    pub fn hours_of_greatest(&self) -> f64 {
        self.elements.hours(self.greatest)
    }
}

/// Golden-section search for the minimum of `f` on [lo, hi] to `tolerance` (same units).
fn golden_minimum(f: impl Fn(f64) -> f64, lo: f64, hi: f64, tolerance: f64) -> f64 {
    let r = (5f64.sqrt() - 1.0) / 2.0;
    let (mut lo, mut hi) = (lo, hi);
    let mut x1 = hi - r * (hi - lo);
    let mut x2 = lo + r * (hi - lo);
    let mut f1 = f(x1);
    let mut f2 = f(x2);
    while hi - lo > tolerance {
        if f1 < f2 {
            hi = x2;
            x2 = x1;
            f2 = f1;
            x1 = hi - r * (hi - lo);
            f1 = f(x1);
        } else {
            lo = x1;
            x1 = x2;
            f1 = f2;
            x2 = lo + r * (hi - lo);
            f2 = f(x2);
        }
    }
    0.5 * (lo + hi)
}

/// Approximate heliocentric position (au, J2000 ecliptic) from mean Keplerian elements, for
/// the coarse search only (every candidate is refined with VSOP87 and the full model).
///
/// References: E. M. Standish, *Keplerian Elements for Approximate Positions of the Major
/// Planets* (JPL Solar System Dynamics), table 1, 1800-2050 (values from memory; used here
/// only to bracket conjunctions, with generous margins); Kepler's equation by Newton's method.
fn kepler_position_au(body: usize, jd: f64) -> [f64; 3] {
    // a (au), e, I (deg), L (deg), long. perihelion (deg), long. node (deg); rates per century.
    const ELEMENTS: [[f64; 12]; 3] = [
        [
            0.387_099_27,
            0.000_000_37,
            0.205_635_93,
            0.000_019_06,
            7.004_979_02,
            -0.005_947_49,
            252.250_323_50,
            149_472.674_111_75,
            77.457_796_28,
            0.160_476_89,
            48.330_765_93,
            -0.125_340_81,
        ],
        [
            0.723_335_66,
            0.000_003_90,
            0.006_776_72,
            -0.000_041_07,
            3.394_676_05,
            -0.000_788_90,
            181.979_099_50,
            58_517.815_387_29,
            131.602_467_18,
            0.002_683_29,
            76.679_842_55,
            -0.277_694_18,
        ],
        [
            1.000_002_61,
            0.000_005_62,
            0.016_711_23,
            -0.000_043_92,
            -0.000_015_31,
            -0.012_946_68,
            100.464_571_66,
            35_999.372_449_81,
            102.937_681_93,
            0.323_273_64,
            0.0,
            0.0,
        ],
    ];
    let t = (jd - 2_451_545.0) / 36_525.0;
    let k = &ELEMENTS[body];
    let a = k[0] + k[1] * t;
    let e = k[2] + k[3] * t;
    let inc = (k[4] + k[5] * t).to_radians();
    let l = k[6] + k[7] * t;
    let peri = k[8] + k[9] * t;
    let node = (k[10] + k[11] * t).to_radians();
    let m = (l - peri).to_radians().rem_euclid(std::f64::consts::TAU);
    let w = peri.to_radians() - node;
    let mut ecc_anom = m + e * m.sin();
    for _ in 0..6 {
        ecc_anom -= (ecc_anom - e * ecc_anom.sin() - m) / (1.0 - e * ecc_anom.cos());
    }
    let xp = a * (ecc_anom.cos() - e);
    let yp = a * (1.0 - e * e).sqrt() * ecc_anom.sin();
    let (sw, cw) = w.sin_cos();
    let (so, co) = node.sin_cos();
    let (si, ci) = inc.sin_cos();
    [
        (cw * co - sw * so * ci) * xp + (-sw * co - cw * so * ci) * yp,
        (cw * so + sw * co * ci) * xp + (-sw * so + cw * co * ci) * yp,
        (sw * si) * xp + (cw * si) * yp,
    ]
}

/// Inferior conjunctions in heliocentric longitude between two Julian dates (TT) at which the
/// planet passes within `max_elongation_deg` of the Sun, found with the approximate Keplerian
/// model and refined with VSOP87A to about a minute.
pub fn inferior_conjunctions_jd(
    planet: Planet,
    start_jd: f64,
    end_jd: f64,
    max_elongation_deg: f64,
) -> Vec<f64> {
    let body = match planet {
        Planet::Mercury => 0,
        Planet::Venus => 1,
    };
    let wrap = |d: f64| {
        (d + std::f64::consts::PI).rem_euclid(std::f64::consts::TAU) - std::f64::consts::PI
    };
    let approx = |jd: f64| {
        let p = kepler_position_au(body, jd);
        let e = kepler_position_au(2, jd);
        (wrap(p[1].atan2(p[0]) - e[1].atan2(e[0])), p, e)
    };
    let step = planet.synodic_period_days() / 8.0;
    let mut out = Vec::new();
    let mut t0 = start_jd;
    let mut f0 = approx(t0).0;
    while t0 < end_jd {
        let t1 = t0 + step;
        let f1 = approx(t1).0;
        if f0 < 0.0 && f1 >= 0.0 && f1 - f0 < std::f64::consts::PI {
            let c = illinois(|jd| approx(jd).0, t0, f0, t1, f1, 1e-4);
            let (_, p, e) = approx(c);
            let elong = crate::sky::vector::angle_between(
                [-e[0], -e[1], -e[2]],
                [p[0] - e[0], p[1] - e[1], p[2] - e[2]],
            );
            // Generous margin over the approximate model's error (a few arcminutes at most).
            if elong.to_degrees() < max_elongation_deg + 0.5 {
                let f = |jd: f64| heliocentric_longitude_difference_rad(planet, jd);
                let (a, b) = (c - 2.0, c + 2.0);
                let (fa, fb) = (f(a), f(b));
                let refined = if fa < 0.0 && fb >= 0.0 {
                    illinois(f, a, fa, b, fb, 1e-3)
                } else {
                    c
                };
                if geometric_elongation_rad(planet, refined).to_degrees() < max_elongation_deg {
                    out.push(refined);
                }
            }
        }
        t0 = t1;
        f0 = f1;
    }
    out
}

/// Root of `f` bracketed by [a, b] (f(a) < 0 <= f(b)) by the Illinois variant of false position.
///
/// References: Dowell and Jarratt, BIT 11, 168 (1971).
fn illinois(f: impl Fn(f64) -> f64, a: f64, fa: f64, b: f64, fb: f64, tolerance: f64) -> f64 {
    let (mut a, mut fa, mut b, mut fb) = (a, fa, b, fb);
    let mut side = 0;
    for _ in 0..60 {
        let c = (a * fb - b * fa) / (fb - fa);
        let fc = f(c);
        if fc == 0.0 || (b - a).abs() < tolerance {
            return c;
        }
        if (fc < 0.0) == (fa < 0.0) {
            a = c;
            fa = fc;
            if side == -1 {
                fb *= 0.5;
            }
            side = -1;
        } else {
            b = c;
            fb = fc;
            if side == 1 {
                fa *= 0.5;
            }
            side = 1;
        }
    }
    0.5 * (a + b)
}

fn check_years(from_year: i32, to_year: i32) -> Result<()> {
    crate::time::scales::check_year(from_year)?;
    crate::time::scales::check_year(to_year)?;
    if from_year > to_year {
        return Err(Error::argument(format!(
            "--from {from_year} is after --to {to_year}; give the earlier year first"
        )));
    }
    Ok(())
}

fn jd_of_date(y: i32, m: u32, d: u32) -> f64 {
    let date = NaiveDate::from_ymd_opt(y, m, d).unwrap_or_default();
    let epoch = NaiveDate::from_ymd_opt(2000, 1, 1).unwrap_or_default();
    2_451_544.5 + (date - epoch).num_days() as f64
}

/// Every transit of `planet` whose greatest transit falls in the years `from_year..=to_year`
/// (UTC, or UT1 before 1972), in order.
///
/// Errors: years outside 1600-2300, or `from_year > to_year`.
pub fn transits_in_years(
    planet: Planet,
    from_year: i32,
    to_year: i32,
    time_model: &TimeModel,
) -> Result<Vec<TransitEvent>> {
    check_years(from_year, to_year)?;
    time_model.validate_for_year(from_year)?;
    find_transits(planet, from_year, to_year, time_model)
}

/// The transits of the years (checked by the callers).
fn find_transits(
    planet: Planet,
    from_year: i32,
    to_year: i32,
    time_model: &TimeModel,
) -> Result<Vec<TransitEvent>> {
    let start = jd_of_date(from_year, 1, 1) - 2.0;
    let end = jd_of_date(to_year + 1, 1, 1) + 2.0;
    let mut out = Vec::new();
    for jd in inferior_conjunctions_jd(planet, start - planet.synodic_period_days() / 8.0, end, 0.4)
    {
        if let Some(ev) = TransitEvent::near(planet, Tt::from_jd(jd), time_model) {
            let y = ev.date().year();
            if (from_year..=to_year).contains(&y) && ev.date().year() >= MIN_YEAR {
                out.push(ev);
            }
        }
    }
    Ok(out)
}

/// The transit whose greatest transit falls within one day of `date` (UTC date).
///
/// Errors: no such transit (the message names the nearest before and after), or a date
/// outside 1600-2300.
pub fn transit_on_date(
    planet: Planet,
    date: NaiveDate,
    time_model: &TimeModel,
) -> Result<TransitEvent> {
    let y = date.year();
    check_years(y, y)?;
    time_model.validate_for_year(y)?;
    let lo = (y - 1).max(MIN_YEAR);
    let hi = (y + 1).min(MAX_YEAR);
    for ev in find_transits(planet, lo, hi, time_model)? {
        if (ev.date() - date).num_days().abs() <= 1 {
            return Ok(ev);
        }
    }
    let span = match planet {
        Planet::Mercury => 15,
        Planet::Venus => 130,
    };
    let found = transits_in_years(
        planet,
        (y - span).max(MIN_YEAR),
        (y + span).min(MAX_YEAR),
        time_model,
    )?;
    let before = found
        .iter()
        .rev()
        .find(|e| e.date() < date)
        .map(|e| e.date().to_string());
    let after = found
        .iter()
        .find(|e| e.date() > date)
        .map(|e| e.date().to_string());
    let nearest = match (before, after) {
        (Some(b), Some(a)) => format!("the nearest are on {b} and {a}"),
        (Some(b), None) => format!("the nearest is on {b}"),
        (None, Some(a)) => format!("the nearest is on {a}"),
        (None, None) => "none falls within the years searched".into(),
    };
    Err(Error::NoTransit {
        planet: planet.name().into(),
        date: date.to_string(),
        nearest: format!("{nearest}; list them with `transit-parallax transits --planet {planet} --from {} --to {}`",
            (y - span).max(MIN_YEAR), (y + span).min(MAX_YEAR)),
    })
}
