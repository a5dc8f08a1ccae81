#!/usr/bin/env python3
"""Generate synthetic observing campaigns for the reduction's acceptance tests.

The true contact times come from the JPL DE421 ephemeris through Skyfield, with exactly the
model stated in generate_contacts.py (apparent topocentric positions; Sun 959.63" at 1 au,
Venus 6051.8 km, Mercury 2439.7 km; the au of IAU 2012 Resolution B2, so the true solar
parallax is asin(6378.1366 km / au) = 8.794143"). Times are UTC with UT1 = UTC.

Each campaign: stations drawn at random (fixed seed) over the sunlit hemisphere; a station
times each contact that happens with the Sun at least 5 degrees up. Timing errors: Gaussian
with a per-station standard deviation of 3 to 15 s (given in `sigma_s`); a black-drop bias of
+8 s on contact II and -8 s on contact III (II seen late, III early), the same for everyone;
then, in the campaigns named "blunders", injected blunders of the kinds seen in pooled public
timings. The column `injected` names each blunder (ignored by the tool, read by the tests):

    zone:+3h         local time entered as UTC (3 h)
    zone:+5.5h       half-hour zone left in
    day:+1           date off by one day
    swap:II>III      a contact II timing labelled III
    swap:I>II        a contact I timing labelled II (exterior/interior mislabelled)
    lonsign          station longitude entered with the wrong sign (all its rows)
    latlon           latitude and longitude exchanged (all its rows)
    clock:+75s       station clock 75 s fast (all its rows)

Also a pool of true contact times (no errors) at 120 stations for Venus 2012,
tests/reference/campaigns/venus-2012-pool.csv, from which tests draw campaigns of their own.

Run: python3 tests/reference/generate_campaigns.py  (a few minutes); writes
tests/reference/campaigns/<name>.csv.
"""

import csv
import os
import sys
import tempfile

import numpy as np
from skyfield.api import wgs84
from skyfield.jpllib import SpiceKernel

from generate_contacts import HERE, S_PER_DAY, ContactSolver, iso, write_spk

# name, planet, approx. greatest transit (TT JD), TT - UTC (s), stations, blunders?, seed
CAMPAIGNS = [
    ("venus-2004-clean", "venus", 2453164.85, 64.184, 36, False, 2004),
    ("venus-2012-blunders", "venus", 2456084.56, 66.184, 44, True, 2012),
    ("mercury-2016-blunders", "mercury", 2457518.12, 68.184, 36, True, 2016),
    ("mercury-2019-clean", "mercury", 2458799.14, 69.184, 30, False, 2019),
    # For --planet-place: a clean Venus 2012 campaign of 40 stations.
    ("venus-2012-place", "venus", 2456084.56, 66.184, 40, False, 4012),
]

# A pool of true (noise-free) contact times at 120 random stations for Venus 2012, from which
# the tests draw many campaigns and add their own Gaussian timing errors (the statistics of
# the uncertainty; the truth stays DE421's).
POOL = ("venus-2012-pool", "venus", 2456084.56, 66.184, 120, 5120)

BLACK_DROP_S = {2: 8.0, 3: -8.0}
ROW_BLUNDERS = ["zone:+3h", "swap:II>III", "day:+1", "zone:+5.5h", "swap:I>II"]
STATION_BLUNDERS = ["lonsign", "clock:+75s", "latlon"]


def draw_station(rng):
    lat = np.degrees(np.arcsin(rng.uniform(-0.95, 0.95)))
    lon = rng.uniform(-180.0, 180.0)
    return float(round(lat, 4)), float(round(lon, 4)), float(round(rng.uniform(0.0, 1500.0)))


def write_pool(eph, earth, out_dir):
    """True contact times (Sun at least 5 degrees up) at the pool's random stations."""
    name, planet, jd_guess, tt_minus_utc, n_stations, seed = POOL
    rng = np.random.default_rng(seed)
    solver = ContactSolver(eph, planet, jd_guess, tt_minus_utc)
    rows, k = [], 0
    while k < n_stations:
        lat, lon, elev = draw_station(rng)
        obs = earth + wgs84.latlon(lat, lon, elevation_m=elev)
        res = solver.contacts(obs)
        seen = {c: t for c, t in res.items() if solver.sun_altitude_deg(obs, t) > 5.0}
        if len(seen) < 2:
            continue
        k += 1
        for c in sorted(seen):
            jd_label = jd_guess + (seen[c] * S_PER_DAY - tt_minus_utc) / S_PER_DAY
            rows.append(["pool-%03d" % k, lat, lon, elev, c, iso(jd_label)])
    with open(os.path.join(out_dir, name + ".csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["station", "latitude", "longitude", "elevation_m", "contact", "time_utc"])
        w.writerows(rows)
    print(name, n_stations, "stations", len(rows), "true times", file=sys.stderr)


def main():
    out_dir = os.path.join(HERE, "campaigns")
    os.makedirs(out_dir, exist_ok=True)
    tmp = os.path.join(tempfile.mkdtemp(), "de421.bsp")
    write_spk("de421", [(c[2] - 3.0, c[2] + 3.0) for c in CAMPAIGNS], tmp)
    only = sys.argv[1:]
    eph = SpiceKernel(tmp)
    earth = eph[399]
    if not only or POOL[0] in only:
        write_pool(eph, earth, out_dir)
    for name, planet, jd_guess, tt_minus_utc, n_stations, blunders, seed in CAMPAIGNS:
        if only and name not in only:
            continue
        rng = np.random.default_rng(seed)
        solver = ContactSolver(eph, planet, jd_guess, tt_minus_utc)
        stations = []
        attempts = 0
        while len(stations) < n_stations and attempts < 2000:
            attempts += 1
            lat, lon, elev = draw_station(rng)
            if blunders and len(stations) < len(STATION_BLUNDERS) and STATION_BLUNDERS[len(stations)] == "latlon" and abs(lon) > 89.0:
                continue  # a station whose exchanged coordinates are still valid
            obs = earth + wgs84.latlon(lat, lon, elevation_m=elev)
            res = solver.contacts(obs)
            seen = {c: t for c, t in res.items() if solver.sun_altitude_deg(obs, t) > 5.0}
            if len(seen) < 2:
                continue
            stations.append(("%s-%02d" % (name.split("-")[0][:3], len(stations) + 1), lat, lon, elev, seen))
        rows = []
        for i, (sname, lat, lon, elev, seen) in enumerate(stations):
            sigma = float(rng.choice([3.0, 5.0, 8.0, 10.0, 15.0]))
            station_blunder = STATION_BLUNDERS[i] if blunders and i < len(STATION_BLUNDERS) else ""
            w_lat, w_lon = lat, lon
            if station_blunder == "lonsign":
                w_lon = -lon
            elif station_blunder == "latlon":
                w_lat, w_lon = lon, lat
            for c in sorted(seen):
                t_s = seen[c] * S_PER_DAY + rng.normal(0.0, sigma) + BLACK_DROP_S.get(c, 0.0)
                label_c = c
                injected = station_blunder
                if station_blunder == "clock:+75s":
                    t_s += 75.0
                rows.append([sname, w_lat, w_lon, elev, label_c, t_s, sigma, injected, c])
        if blunders:
            # Row blunders on stations beyond the station blunders, one row each.
            candidates = [r for r in rows if r[7] == ""]
            order = rng.permutation(len(candidates))
            used = set()
            k = 0
            for blunder in ROW_BLUNDERS:
                while k < len(order):
                    r = candidates[order[k]]
                    k += 1
                    if r[0] in used:
                        continue
                    c = r[8]
                    if blunder == "swap:II>III" and c != 2:
                        continue
                    if blunder == "swap:I>II" and c != 1:
                        continue
                    # The swapped-label rows need the other contact at this station.
                    if blunder.startswith("swap") and any(o[0] == r[0] and o[4] == c + 1 for o in rows):
                        # relabel would duplicate a timed contact: drop the true one instead
                        rows[:] = [o for o in rows if not (o[0] == r[0] and o[4] == c + 1)]
                    used.add(r[0])
                    r[7] = blunder
                    if blunder == "zone:+3h":
                        r[5] += 3 * 3600.0
                    elif blunder == "zone:+5.5h":
                        r[5] += 5.5 * 3600.0
                    elif blunder == "day:+1":
                        r[5] += 86400.0
                    else:
                        r[4] = c + 1
                    break
        with open(os.path.join(out_dir, name + ".csv"), "w", newline="") as f:
            w = csv.writer(f, lineterminator="\n")
            w.writerow(["station", "latitude", "longitude", "elevation_m", "contact", "time_utc", "sigma_s", "injected"])
            for sname, lat, lon, elev, c, t_s, sigma, injected, _ in rows:
                jd_label = jd_guess + (t_s - tt_minus_utc) / S_PER_DAY
                w.writerow([sname, lat, lon, elev, c, iso(jd_label), sigma, injected])
        print(name, len(stations), "stations", len(rows), "timings", file=sys.stderr)


if __name__ == "__main__":
    main()
