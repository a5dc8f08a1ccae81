#!/usr/bin/env python3
"""Generate reference points for the visibility map (`transits --visibility-map`).

Independent reference for `cargo test`: the JPL ephemerides evaluated by Skyfield through the
same set-up and contact solver as generate_contacts.py (whose module docstring states the model:
apparent places, WGS 84 observers, fixed Delta T, the same radii), for two events:

* Mercury 2032 November 13, JPL DE421, Delta T 69.184 s (UT1 = UTC, TAI - UTC = 37 s);
* Venus 2117 December 11, JPL DE423, Delta T 240 s, times labelled TT - 69.184 s.

Rows of kind `sample`: sea-level points spread over both hemispheres, each contact's time and
the Sun's true altitude then. Rows of kind `edge`: on a parallel, the longitude where the Sun's
true altitude at contact I (or IV) is zero (bisection to 0.001 degree on Skyfield's own
contacts), the edge of the region where that contact is seen with the Sun up; rows of kind
`beside` are the points 1.5 degrees of longitude either side of each edge.

Pinned versions as generate_contacts.py.  Run:  python3 tests/reference/generate_visibility.py
Writes tests/reference/visibility_skyfield.csv.
"""

import csv
import os
import sys
import tempfile

from skyfield.api import wgs84
from skyfield.jpllib import SpiceKernel

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from generate_contacts import S_PER_DAY, ContactSolver, iso, write_spk  # noqa: E402

HERE = os.path.dirname(os.path.abspath(__file__))

# label, planet, ephemeris module, approximate greatest transit (TT JD), Delta T (s),
# TT - (time label) (s)
EVENTS = [
    ("mercury-2032-11-13", "mercury", "de421", 2463549.87, 69.184, 69.184),
    ("venus-2117-12-11", "venus", "de423", 2494622.62, 240.0, 69.184),
]

SAMPLES = [
    (60.0, -150.0), (45.0, -75.0), (35.0, 139.0), (51.5, 0.0), (30.0, 31.0), (0.0, 100.0),
    (-34.0, 18.0), (-34.0, 151.0), (-23.0, -46.0), (19.0, -99.0), (64.0, -22.0), (10.0, 77.0),
    (-45.0, 170.0), (-15.0, -75.0), (70.0, 30.0), (-75.0, 0.0),
]

EDGE_LATITUDES = [-30.0, 0.0, 30.0]


def observer(earth, lat, lon):
    return earth + wgs84.latlon(lat, lon, elevation_m=0.0)


def altitude_at(solver, earth, lat, lon, contact):
    """The Sun's true altitude at the point's contact, and the contact (days from jd_guess)."""
    obs = observer(earth, lat, lon)
    t = solver.contacts(obs).get(contact)
    if t is None:
        return None, None
    return solver.sun_altitude_deg(obs, t), t


def edge_longitude(solver, earth, lat, contact):
    """The first longitude east of -180 where the Sun's altitude at `contact` changes sign."""
    lons = [-180.0 + 20.0 * k for k in range(19)]
    alts = [altitude_at(solver, earth, lat, lon, contact)[0] for lon in lons]
    for k in range(len(lons) - 1):
        a, b = alts[k], alts[k + 1]
        if a is None or b is None or (a >= 0) == (b >= 0):
            continue
        lo, hi, a_lo = lons[k], lons[k + 1], a
        while hi - lo > 0.001:
            mid = 0.5 * (lo + hi)
            m = altitude_at(solver, earth, lat, mid, contact)[0]
            if (m >= 0) == (a_lo >= 0):
                lo, a_lo = mid, m
            else:
                hi = mid
        return 0.5 * (lo + hi)
    return None


def rows_for(kind, solver, earth, jd_guess, label_offset_s, lat, lon, contacts=(1, 2, 3, 4)):
    obs = observer(earth, lat, lon)
    res = solver.contacts(obs)
    out = []
    for c in contacts:
        if c not in res:
            continue
        t = res[c]
        out.append([kind, "%.4f" % lat, "%.4f" % lon, c,
                    iso(jd_guess + t - label_offset_s / S_PER_DAY),
                    "%.4f" % solver.sun_altitude_deg(obs, t)])
    return out


def main():
    out_rows = []
    for label, planet, module, jd_guess, delta_t_s, label_offset_s in EVENTS:
        path = os.path.join(tempfile.mkdtemp(), module + ".bsp")
        write_spk(module, [(jd_guess - 3.0, jd_guess + 3.0)], path)
        eph = SpiceKernel(path)
        earth = eph[399]
        solver = ContactSolver(eph, planet, jd_guess, delta_t_s)
        rows = []
        for lat, lon in SAMPLES:
            rows += rows_for("sample", solver, earth, jd_guess, label_offset_s, lat, lon)
        for contact in (1, 4):
            for lat in EDGE_LATITUDES:
                lon = edge_longitude(solver, earth, lat, contact)
                if lon is None:
                    continue
                rows += rows_for("edge", solver, earth, jd_guess, label_offset_s, lat, lon, (contact,))
                for side in (-1.5, 1.5):
                    rows += rows_for("beside", solver, earth, jd_guess, label_offset_s, lat,
                                     lon + side, (contact,))
        out_rows += [[label, planet, delta_t_s] + r for r in rows]
        print(label, "done", len(rows), "rows", file=sys.stderr)
    with open(os.path.join(HERE, "visibility_skyfield.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["event", "planet", "delta_t_s", "kind", "latitude", "longitude", "contact",
                    "time_utc", "sun_altitude_deg"])
        w.writerows(out_rows)


if __name__ == "__main__":
    main()
