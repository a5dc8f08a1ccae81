#!/usr/bin/env python3
"""Reference local apparent solar time for the tool's conversion of historical clock readings.

Local apparent time = 12 h + the local hour angle of the Sun's geocentric apparent place:
12 h + GAST + longitude - RA (true equator and equinox of date), reduced to 0-24 h, with
Skyfield 1.53 (GAST IAU 2006/2000A, the Sun's apparent place from the JPL ephemeris: DE405
for 1639 and 1769, DE421 for 2012) and a fixed Delta T per event, as generate_contacts.py.
Local mean time = UT1 + longitude / 15 h needs no reference.

Pinned: skyfield==1.53 jplephem==2.24 de405==1997.1 de421==2008.1 numpy 2.x.
Run: python3 tests/reference/generate_local_time.py
Writes tests/reference/local_apparent_skyfield.csv.
"""

import csv
import os
import tempfile

import numpy as np
from skyfield.api import load
from skyfield.jpllib import SpiceKernel

from generate_contacts import HERE, S_PER_DAY, iso, write_spk

# event, ephemeris, TT JD of the event's noon region, Delta T (s)
EVENTS = [
    ("venus-1639-12-04", "de405", 2320030.27, 65.0),
    ("venus-1769-06-03", "de405", 2367328.43, 16.0),
    ("venus-2012-06-06", "de421", 2456084.56, 66.184),
]
LONGITUDES = [-149.57, -94.17, -0.01, 25.97, 113.26, 166.67]
OFFSETS_H = [-6.0, -2.5, 0.0, 3.25, 7.0]


def local_apparent_reading(eph, t, ut1_label, lon):
    """The local apparent reading (civil day, a Julian-date-like number on the label scale
    that `iso` formats) at TT `t`, whose UT1 label is `ut1_label`, at east longitude `lon`:
    the UT1 date shifted by the longitude, its time of day replaced by 12 h + the local hour
    angle of the Sun's apparent place (the nearest such instant)."""
    ra, _, _ = eph[399].at(t).observe(eph["sun"]).apparent().radec(epoch="date")
    lat_h = (12.0 + t.gast + lon / 15.0 - ra.hours) % 24.0
    mean_label = ut1_label + lon / 360.0
    day = np.floor(mean_label - 0.5) + 0.5
    reading = day + lat_h / 24.0
    if reading - mean_label > 0.5:
        reading -= 1.0
    elif mean_label - reading > 0.5:
        reading += 1.0
    return reading


def main():
    rows = []
    for label, module, jd, delta_t in EVENTS:
        path = os.path.join(tempfile.mkdtemp(), module + ".bsp")
        write_spk(module, [(jd - 3.0, jd + 3.0)], path)
        eph = SpiceKernel(path)
        ts = load.timescale(delta_t=delta_t)
        for h in OFFSETS_H:
            t = ts.tt_jd(jd, h / 24.0)
            ut1_label = jd + h / 24.0 - delta_t / S_PER_DAY
            for lon in LONGITUDES:
                reading = local_apparent_reading(eph, t, ut1_label, lon)
                rows.append([label, delta_t, lon, iso(ut1_label), iso(reading)[:-1]])
    with open(os.path.join(HERE, "local_apparent_skyfield.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["event", "delta_t_s", "longitude", "ut1", "local_apparent"])
        w.writerows(rows)
    print(len(rows), "rows")


if __name__ == "__main__":
    main()
