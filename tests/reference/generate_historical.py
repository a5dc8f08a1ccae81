#!/usr/bin/env python3
"""Generate a synthetic historical campaign for the reduction's acceptance test of
historical-style timings (local solar time, doubtful and unknown longitudes).

Truth: the transit of Venus of 1769 June 3-4 from the JPL DE405 ephemeris through Skyfield,
with exactly the contact model of generate_contacts.py (apparent topocentric positions; Sun
959.63" at 1 au, Venus 6051.8 km; the au of IAU 2012 Resolution B2, so the true solar
parallax is 8.794143"), and a fixed Delta T of 16.0 s on both sides (reduce with
--delta-t 16).

The campaign, as 18th-century expeditions would have recorded it:

* stations drawn at random (fixed seed) where at least two contacts happen with the Sun at
  least 5 degrees up; each times every such contact;
* timing errors: Gaussian with a per-station standard deviation of 8, 10 or 12 s (given in
  `sigma_s`), and a black drop: contact II seen 10 s late and III 10 s early;
* clocks kept to local apparent time (12 h + the local hour angle of the Sun's geocentric
  apparent place, true equator and equinox of date, Skyfield's GAST) or local mean time
  (UT1 + longitude / 15 h), at the station's TRUE longitude, alternately by station;
* the day reckoned astronomically (from noon: the reading minus 12 h) on every third row;
* the longitude written in the file (wrapped into -180..180) off the truth by a Gaussian
  error of 0.25 degree (and `longitude_sigma_deg` 0.25), except at two stations whose longitude is `unknown`, written
  1.2 degrees east and 1.8 degrees west of the truth.

The column `true_longitude` (ignored by the tool) gives the truth, on the same side of the
date line as the written longitude, so the test can check each fitted longitude correction.

Pinned: skyfield==1.53 jplephem==2.24 de405==1997.1 numpy 2.x.
Run: python3 tests/reference/generate_historical.py (under a minute);
writes tests/reference/campaigns/venus-1769-historical.csv.
"""

import csv
import os
import sys

import numpy as np

from generate_contacts import HERE, S_PER_DAY, de405_event, iso, sites_seeing_contacts
from generate_local_time import local_apparent_reading

NAME = "venus-1769-historical"
JD_GUESS = 2367328.43
DELTA_T_S = 16.0
N_STATIONS = 24
SEED = 1769
LONGITUDE_SIGMA_DEG = 0.25
UNKNOWN = {3: 1.2, 11: -1.8}  # station index -> error of the written longitude, degrees
BLACK_DROP_S = {2: 10.0, 3: -10.0}


def draw_station(rng):
    lat = np.degrees(np.arcsin(rng.uniform(-0.95, 0.95)))
    lon = rng.uniform(-180.0, 180.0)
    return float(round(lat, 4)), float(round(lon, 4)), float(round(rng.uniform(0.0, 800.0)))


def local_reading(eph, ts, t_days, lon_deg, kind):
    """The local solar-time reading (civil day) at TT JD_GUESS + t_days, as a Julian-date-like
    number on the same scale as `iso` expects."""
    ut1_label = JD_GUESS + t_days - DELTA_T_S / S_PER_DAY
    if kind == "mean":
        return ut1_label + lon_deg / 360.0
    return local_apparent_reading(eph, ts.tt_jd(JD_GUESS, t_days), ut1_label, lon_deg)


def main():
    eph, earth, ts, solver = de405_event("venus", JD_GUESS, DELTA_T_S)
    rng = np.random.default_rng(SEED)
    stations = sites_seeing_contacts(earth, solver, draw_station, rng, N_STATIONS)
    rows = []
    for k, (lat, lon, elev, seen) in enumerate(stations):
        name = "exp-%02d" % (k + 1)
        sigma = float(rng.choice([8.0, 10.0, 12.0]))
        kind = "apparent" if k % 2 == 0 else "mean"
        if k in UNKNOWN:
            written, prior = lon + UNKNOWN[k], "unknown"
        else:
            written, prior = lon + rng.normal(0.0, LONGITUDE_SIGMA_DEG), LONGITUDE_SIGMA_DEG
        # Written longitudes stay within -180..180; the clock's local time follows the same
        # side of the date line as the written longitude (the expedition's own calendar).
        wrapped = (written + 180.0) % 360.0 - 180.0
        lon, written = lon + (wrapped - written), wrapped
        for c in sorted(seen):
            t_days = seen[c] + (rng.normal(0.0, sigma) + BLACK_DROP_S.get(c, 0.0)) / S_PER_DAY
            reading = local_reading(eph, ts, t_days, lon, kind)
            reckoning = "civil"
            if len(rows) % 3 == 2:
                reckoning, reading = "astronomical", reading - 0.5
            rows.append([name, lat, round(written, 4), elev, c, iso(reading)[:-1], kind,
                         reckoning, sigma, prior, lon])
    with open(os.path.join(HERE, "campaigns", NAME + ".csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["station", "latitude", "longitude", "elevation_m", "contact", "time_local",
                    "local_time", "day_reckoning", "sigma_s", "longitude_sigma_deg",
                    "true_longitude"])
        w.writerows(rows)
    print(NAME, len(stations), "stations", len(rows), "timings", file=sys.stderr)


if __name__ == "__main__":
    main()
