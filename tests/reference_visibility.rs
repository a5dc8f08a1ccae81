//! The visibility grid against an independent reference: each sample point's contact times and
//! the Sun's true altitude at them, and the edges of the regions where contacts I and IV are
//! seen with the Sun up, from the JPL ephemerides evaluated by Skyfield
//! (tests/reference/generate_visibility.py, which reuses the model and contact solver of
//! generate_contacts.py; Delta T fixed to the same value on both sides).
//!
//! Tolerances: 0.1 s in time and 0.01 degree in altitude, the bounds of
//! tests/reference_contacts.rs (where the worst differences found are 0.054 s and 0.003
//! degree); the Sun's altitude changes by at most 0.25 degree a minute, so 0.1 s moves it by
//! under 0.0005 degree and the altitude bound is set by the models, not the timing.

use transit_parallax::geometry::contacts::Contact;
use transit_parallax::geometry::visibility::{visibility_at, visibility_grid};
use transit_parallax::time::iso::{parse_date, parse_utc};
use transit_parallax::time::scales::TimeModel;
use transit_parallax::{transit_on_date, Planet, TransitEvent};

struct Row {
    event: String,
    planet: Planet,
    delta_t_s: f64,
    kind: String,
    latitude_deg: f64,
    longitude_deg: f64,
    contact: Contact,
    time: chrono::NaiveDateTime,
    sun_altitude_deg: f64,
}

fn rows() -> Vec<Row> {
    let text = include_str!("reference/visibility_skyfield.csv");
    let mut rdr = csv::Reader::from_reader(text.as_bytes());
    rdr.records()
        .map(|r| {
            let r = r.unwrap();
            let num = |i: usize| r[i].parse::<f64>().unwrap();
            Row {
                event: r[0].to_string(),
                planet: Planet::parse(&r[1]).unwrap(),
                delta_t_s: num(2),
                kind: r[3].to_string(),
                latitude_deg: num(4),
                longitude_deg: num(5),
                contact: Contact::parse(&r[6]).unwrap(),
                time: parse_utc(&r[7]).unwrap(),
                sun_altitude_deg: num(8),
            }
        })
        .collect()
}

fn event_of(rows: &[Row], name: &str) -> TransitEvent {
    let first = rows.iter().find(|r| r.event == name).unwrap();
    let date = parse_date(&name[name.find('-').unwrap() + 1..]).unwrap();
    transit_on_date(first.planet, date, &TimeModel::fixed(first.delta_t_s)).unwrap()
}

/// Compare every row of one event; the largest differences in time (s) and altitude (deg).
fn compare(name: &str) -> (f64, f64) {
    let rows = rows();
    let event = event_of(&rows, name);
    let (mut worst_s, mut worst_deg) = (0.0f64, 0.0f64);
    let mine: Vec<&Row> = rows.iter().filter(|r| r.event == name).collect();
    assert!(mine.len() > 60, "{name}: {} rows", mine.len());
    for r in mine {
        let p = visibility_at(&event, r.latitude_deg, r.longitude_deg);
        let c = p.contacts[r.contact.index()].unwrap_or_else(|| {
            panic!(
                "{name}: no contact {} at {} {}",
                r.contact.roman(),
                r.latitude_deg,
                r.longitude_deg
            )
        });
        let dt = (event.label(c.hours) - r.time).num_microseconds().unwrap() as f64 * 1e-6;
        let dalt = c.sun_altitude_deg - r.sun_altitude_deg;
        worst_s = worst_s.max(dt.abs());
        worst_deg = worst_deg.max(dalt.abs());
        // Source: Skyfield with JPL DE421 / DE423 (generate_visibility.py).
        assert!(dt.abs() < 0.1, "{name} {} {:?}: {dt} s", r.kind, r.contact);
        assert!(
            dalt.abs() < 0.01,
            "{name} {} {:?}: {dalt} deg",
            r.kind,
            r.contact
        );
        if r.kind == "beside" {
            // 1.5 degrees of longitude from the edge the Sun is some 1 degree up or down:
            // the two sides must agree on which.
            assert_eq!(
                c.sun_up(),
                r.sun_altitude_deg >= 0.0,
                "{name} beside {:?}",
                r.contact
            );
        }
    }
    (worst_s, worst_deg)
}

#[test]
fn mercury_2032_agrees_with_skyfield_de421() {
    let (s, deg) = compare("mercury-2032-11-13");
    eprintln!("Mercury 2032: worst {s:.4} s, {deg:.5} deg");
}

#[test]
fn venus_2117_agrees_with_skyfield_de423() {
    let (s, deg) = compare("venus-2117-12-11");
    eprintln!("Venus 2117: worst {s:.4} s, {deg:.5} deg");
}

#[test]
fn the_grid_changes_class_where_skyfield_puts_the_edge() {
    // Source: the edges of generate_visibility.py. On the 1-degree grid the points nearest an
    // edge of contact I lie on either side of it as Skyfield says: the class changes between
    // whole/egress-only (Sun up at I) and ingress-only/none/part (Sun down at I) there.
    let rows = rows();
    let name = "mercury-2032-11-13";
    let event = event_of(&rows, name);
    let grid = visibility_grid(&event, 1.0, 2).unwrap();
    for edge in rows
        .iter()
        .filter(|r| r.event == name && r.kind == "edge" && r.contact == Contact::I)
    {
        let row = (90.0 - edge.latitude_deg).round() as usize;
        let west = ((edge.longitude_deg + 180.0).floor() as usize) % grid.columns;
        let east = (west + 1) % grid.columns;
        let up = |col: usize| {
            grid.at(row, col).contacts[0]
                .map(|c| c.sun_up())
                .unwrap_or(false)
        };
        assert_ne!(
            up(west),
            up(east),
            "no edge between the grid points either side of {} {}",
            edge.latitude_deg,
            edge.longitude_deg
        );
    }
}
