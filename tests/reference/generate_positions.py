#!/usr/bin/env python3
"""Reference places of the planet on the Sun's disc seen from stations, for the model of a
measured position (src/geometry/disc_position.rs).

Independent reference: the JPL DE421 and DE423 ephemerides evaluated by the general-purpose
astronomy library Skyfield, with exactly the model of generate_contacts.py (apparent
topocentric places, light-time, deflection and aberration as Skyfield applies them; WGS 84
stations; a fixed Delta T per event so that the geometry is what is compared; the Sun's
radius sin(959.63") au). For each station and instant:

* separation_arcsec: the angle between the apparent centres of the Sun and the planet;
* sun_radius_arcsec: asin(R_sun / d), d the Sun's apparent distance from the station;
* separation_solar_radii: their ratio, as a measurement on one image gives it;
* position_angle_deg: the planet's centre seen from the Sun's, from north (true equator and
  equinox of date) through east (Skyfield's `position_angle_of`).

Instants: every 40 minutes between the geocentric contacts I and IV of each event (whether or
not the Sun is up at the station: the geometry is the same).

Pinned versions: skyfield==1.53 jplephem==2.24 de421==2008.1 de423==2010.1, numpy 2.x.
Run:  python3 tests/reference/generate_positions.py
Writes tests/reference/positions_skyfield.csv.
"""

import csv
import os
import sys
import tempfile

import numpy as np
from skyfield.api import wgs84
from skyfield.jpllib import SpiceKernel
from skyfield.trigonometry import position_angle_of

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from generate_contacts import (  # noqa: E402  (the shared model and set-up)
    EVENTS, HERE, R_SUN_AU, ContactSolver, iso, write_spk,
)

# Events compared (labels of generate_contacts.EVENTS).
CHOSEN = ["venus-2012-06-06", "mercury-2016-05-09", "venus-2117-12-11"]

# Invented stations far apart in latitude and longitude (name, lat, lon east, elevation m).
STATIONS = [
    ("tundra-camp", 64.84, -147.72, 136.0),
    ("harbour-city", -33.87, 151.21, 58.0),
    ("old-capital", 35.01, 135.77, 50.0),
    ("cape-point", -33.93, 18.42, 20.0),
    ("volcano-rim", 19.82, -155.47, 4200.0),
    ("river-bend", 51.48, -0.01, 46.0),
]


def main():
    rows = []
    for label, planet, module, jd_guess, delta_t_s, label_offset_s in EVENTS:
        if label not in CHOSEN:
            continue
        path = os.path.join(tempfile.mkdtemp(), module + ".bsp")
        write_spk(module, [(jd_guess - 3.0, jd_guess + 3.0)], path)
        eph = SpiceKernel(path)
        solver = ContactSolver(eph, planet, jd_guess, delta_t_s)
        earth = eph[399]
        geo = solver.contacts(earth)
        first, last = geo[1], geo[4]
        instants = np.arange(first + 10.0 / 1440.0, last, 40.0 / 1440.0)
        for name, lat, lon, elev in STATIONS:
            observer = earth + wgs84.latlon(lat, lon, elevation_m=elev)
            for offset in instants:
                t = solver.ts.tt_jd(jd_guess, offset)
                o = observer.at(t)
                sun = o.observe(solver.sun).apparent()
                body = o.observe(solver.body).apparent()
                sep = sun.separation_from(body).radians
                sun_radius = np.arcsin(R_SUN_AU / sun.distance().au)
                s_ra, s_dec, _ = sun.radec(epoch="date")
                p_ra, p_dec, _ = body.radec(epoch="date")
                pa = position_angle_of((s_dec, s_ra), (p_dec, p_ra)).degrees
                jd_label = jd_guess + offset - label_offset_s / 86400.0
                rows.append([
                    label, planet, "%.3f" % delta_t_s, name, lat, lon, elev, iso(jd_label),
                    "%.9f" % (sep / sun_radius),
                    "%.5f" % np.degrees(sep * 3600.0),
                    "%.5f" % np.degrees(sun_radius * 3600.0),
                    "%.6f" % pa,
                ])
    out = os.path.join(HERE, "positions_skyfield.csv")
    with open(out, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["event", "planet", "delta_t_s", "station", "latitude", "longitude",
                     "elevation_m", "time_utc", "separation_solar_radii", "separation_arcsec",
                     "sun_radius_arcsec", "position_angle_deg"])
        w.writerows(rows)
    print("wrote %d rows to %s" % (len(rows), out))


if __name__ == "__main__":
    main()
