#!/usr/bin/env python3
"""Generate 300 simulated historical campaigns of the transit of Venus of 1769 for the
statistical acceptance test of the reduction (tests/historical_campaigns.rs).

Truth: the transit of 1769 June 3-4 from JPL DE405 through Skyfield, with exactly the contact
model of generate_contacts.py (apparent topocentric positions; Sun 959.63" at 1 au, Venus
6051.8 km; the au of IAU 2012 Resolution B2, so the true solar parallax is 8.794143"), and a
fixed Delta T of 20.6 s on both sides (reduce with --delta-t 20.6).

A pool of 80 sites is drawn once (fixed seed) where at least two contacts happen with the Sun
at least 5 degrees up. Each campaign draws 20 of them and records them as 18th-century
expeditions wrote, independently of the tool's own code:

* clocks kept to local apparent time (12 h + the local hour angle of the Sun's apparent place,
  Skyfield's GAST and apparent right ascension of date) or local mean time (UT1 + longitude /
  15 h), at the TRUE longitude; a third of the sites count astronomical days (from noon);
* a fifth of the sites date in the Julian calendar (Old Style: 11 days behind in 1769,
  converted here from the Julian day number with the textbook algorithm), `calendar` julian;
* one to three observers per site (`observer`), each with a Gaussian timing error of 8, 10 or
  12 s (its `sigma_s`) and one way of judging the interior contacts: geometric (40 %),
  thread (30 %) or touch (30 %), whose true lags behind the geometric contact are
  thread: II +15 s, III -12 s; touch: II +28 s, III -25 s;
* 15 % of the sites give only durations (`duration`, II-III and I-IV where both ends are
  seen), as differences of their clock readings (apparent or mean: `local_time`), half of
  them with the date, half without; `sigma_s` is sqrt(2) times the observer's;
* 15 % of the instants are written as a range START/END of 2 to 8 s that holds the reading
  at a uniformly random place (so the midpoint is off by a uniform error of that width);
* longitudes: 35 % exact (written from Paris in degrees, minutes and seconds with `meridian`
  paris for half of them), 50 % doubtful (an error drawn with 0.25 degree,
  `longitude_sigma_deg` 0.25), 15 % unknown (written 1 to 2 degrees off, `unknown`); written in
  decimal degrees or in hours of time (9h58m10sW); latitudes in decimal degrees or
  sexagesimal with the hemisphere.

The column `campaign` (1-300) is ignored by the tool; the test splits the file by campaign.
The file is gzip-compressed (written with a fixed timestamp, so the same run gives the same
bytes); the test reads it with the flate2 crate.

Pinned: skyfield==1.53 jplephem==2.24 de405==1997.1 numpy 2.x.
Run: python3 tests/reference/generate_historical_campaigns.py (under a minute: 44 s on the project machine);
writes tests/reference/campaigns/venus-1769-historical-300.csv.gz.
"""

import csv
import gzip
import io
import math
import os
import sys

import numpy as np

from generate_contacts import HERE, S_PER_DAY, de405_event, sites_seeing_contacts
from generate_local_time import local_apparent_reading

NAME = "venus-1769-historical-300"
JD_GUESS = 2367328.43
DELTA_T_S = 20.6
POOL = 80
PER_CAMPAIGN = 20
CAMPAIGNS = 300
SEED = 17691
PARIS_EAST_DEG = 2.5969213 * 0.9  # EPSG prime meridian 8903: 2.5969213 grads
LAG_S = {("thread", 2): 15.0, ("thread", 3): -12.0, ("touch", 2): 28.0, ("touch", 3): -25.0}


def draw_site(rng):
    lat = np.degrees(np.arcsin(rng.uniform(-0.95, 0.95)))
    return float(round(lat, 4)), float(round(rng.uniform(-180.0, 180.0), 4)), float(round(rng.uniform(0, 600)))


def calendar_date(jd, julian):
    """(year, month, day, fraction of day) of a Julian date in the Julian or the Gregorian
    calendar (J. Meeus, Astronomical Algorithms, chapter 7; A = Z for the Julian calendar)."""
    z = math.floor(jd + 0.5)
    f = jd + 0.5 - z
    if julian:
        a = z
    else:
        alpha = math.floor((z - 1867216.25) / 36524.25)
        a = z + 1 + alpha - math.floor(alpha / 4)
    b = a + 1524
    c = math.floor((b - 122.1) / 365.25)
    d = math.floor(365.25 * c)
    e = math.floor((b - d) / 30.6001)
    day = b - d - math.floor(30.6001 * e)
    month = e - 1 if e < 14 else e - 13
    year = c - 4716 if month > 2 else c - 4715
    return year, month, day, f


def text_of(jd, julian):
    """A reading (a Julian-date-like number on the clock's scale) as ISO 8601 text without a
    zone, to 0.1 s, its date in the Julian or the Gregorian calendar."""
    y, m, d, f = calendar_date(jd, julian)
    tenths = int(round(f * S_PER_DAY * 10))
    if tenths >= S_PER_DAY * 10:  # rounding reached midnight: take the next day
        return text_of(math.floor(jd + 0.5) + 0.5 + 1e-9, julian)
    s, t = divmod(tenths, 10)
    return "%04d-%02d-%02dT%02d:%02d:%02d.%d" % (y, m, d, s // 3600, s // 60 % 60, s % 60, t)


def clock_reading(eph, ts, t_days, lon, kind):
    """The local reading (civil day) at TT JD_GUESS + t_days on the clock's scale."""
    ut1_label = JD_GUESS + t_days - DELTA_T_S / S_PER_DAY
    if kind == "mean":
        return ut1_label + lon / 360.0
    return local_apparent_reading(eph, ts.tt_jd(JD_GUESS, t_days), ut1_label, lon)


def three_parts(v):
    """Whole units, minutes and seconds (to 0.01) of a positive value, the seconds rounded
    first so that they never print as 60."""
    hundredths = int(round(v * 360000.0))
    whole, rest = divmod(hundredths, 360000)
    minutes, seconds = divmod(rest, 6000)
    return whole, minutes, seconds / 100.0


def sexagesimal(value, pos, neg):
    letter = pos if value >= 0 else neg
    d, m, s = three_parts(abs(value))
    return "%d°%02d'%05.2f\"%s" % (d, m, s, letter)


def hours_of_time(lon):
    letter = "E" if lon >= 0 else "W"
    h, m, s = three_parts(abs(lon) / 15.0)
    return "%dh%02dm%05.2fs%s" % (h, m, s, letter)


def written_place(rng, lat, lon):
    """The latitude, longitude, meridian and longitude_sigma_deg as written, and the longitude
    the file's clock readings follow (the true one)."""
    r = rng.uniform()
    if r < 0.35:
        err, prior = 0.0, ""
    elif r < 0.85:
        err, prior = rng.normal(0.0, 0.25), "0.25"
    else:
        err, prior = rng.choice([-1.0, 1.0]) * rng.uniform(1.0, 2.0), "unknown"
    written = (lon + err + 180.0) % 360.0 - 180.0
    meridian = ""
    if prior == "" and rng.uniform() < 0.5:
        written_lon = sexagesimal(((written - PARIS_EAST_DEG + 180.0) % 360.0) - 180.0, "E", "W")
        meridian = "paris"
    elif rng.uniform() < 0.5:
        written_lon = hours_of_time(written)
    else:
        written_lon = "%.4f" % written
    written_lat = sexagesimal(lat, "N", "S") if rng.uniform() < 0.5 else "%.4f" % lat
    return written_lat, written_lon, meridian, prior


def site_rows(rng, eph, ts, campaign, name, site):
    lat, lon, elev, seen = site
    kind = "apparent" if rng.uniform() < 0.6 else "mean"
    astronomical = rng.uniform() < 1.0 / 3.0
    julian = rng.uniform() < 0.2
    durations_only = rng.uniform() < 0.15 and len(seen) >= 2
    wlat, wlon, meridian, prior = written_place(rng, lat, lon)
    rows = []
    for k in range(int(rng.choice([1, 2, 3], p=[0.5, 0.35, 0.15]))):
        observer = "obs-%d" % (k + 1)
        sigma = float(rng.choice([8.0, 10.0, 12.0]))
        judged = str(rng.choice(["", "thread", "touch"], p=[0.4, 0.3, 0.3]))
        readings = {}
        for c, t in seen.items():
            lag = LAG_S.get((judged, c), 0.0)
            t_days = t + (rng.normal(0.0, sigma) + lag) / S_PER_DAY
            readings[c] = clock_reading(eph, ts, t_days, lon, kind)
        common = [campaign, name, observer, wlat, wlon, meridian, "%.0f" % elev, prior, kind, judged]
        if durations_only:
            for a, b in [(2, 3), (1, 4)]:
                if a in readings and b in readings:
                    dur = (readings[b] - readings[a]) * S_PER_DAY
                    date = text_of(readings[a], julian)[:10] if rng.uniform() < 0.5 else ""
                    rows.append(common + ["%d-%d" % (a, b), date, "", "%.1f" % dur,
                                          "%.2f" % (sigma * math.sqrt(2.0)),
                                          "julian" if julian and date else ""])
            continue
        for c in sorted(readings):
            r = readings[c]
            if astronomical:
                r -= 0.5
            text = text_of(r, julian)
            if rng.uniform() < 0.15:
                width = rng.uniform(2.0, 8.0)
                u = rng.uniform()
                start = text_of(r - u * width / S_PER_DAY, julian)
                end = text_of(r + (1.0 - u) * width / S_PER_DAY, julian)
                text = start + "/" + (end[11:] if end[:10] == start[:10] else end)
            rows.append(common + [str(c), text, "astronomical" if astronomical else "civil", "",
                                  "%.0f" % sigma, "julian" if julian else ""])
    return rows


def main():
    eph, earth, ts, solver = de405_event("venus", JD_GUESS, DELTA_T_S)
    rng = np.random.default_rng(SEED)
    pool = sites_seeing_contacts(earth, solver, draw_site, rng, POOL)
    print("pool of", len(pool), "sites", file=sys.stderr)
    header = ["campaign", "station", "observer", "latitude", "longitude", "meridian",
              "elevation_m", "longitude_sigma_deg", "local_time", "contact_judged",
              "contact", "time_local", "day_reckoning", "duration", "sigma_s", "calendar"]
    out = []
    for k in range(1, CAMPAIGNS + 1):
        chosen = rng.choice(len(pool), size=PER_CAMPAIGN, replace=False)
        for j, s in enumerate(chosen):
            out.extend(site_rows(rng, eph, ts, k, "site-%02d" % (s + 1), pool[s]))
    text = io.StringIO()
    text.write("# %d simulated historical campaigns of 1769 (see generate_historical_campaigns.py); "
               "true lags: thread II +15 s, III -12 s; touch II +28 s, III -25 s\n" % CAMPAIGNS)
    w = csv.writer(text, lineterminator="\n")
    w.writerow(header)
    for row in out:
        w.writerow(row)
    path = os.path.join(HERE, "campaigns", NAME + ".csv.gz")
    with open(path, "wb") as f:
        with gzip.GzipFile(filename="", mode="wb", fileobj=f, mtime=0) as g:
            g.write(text.getvalue().encode("utf-8"))
    print(NAME, len(out), "rows", file=sys.stderr)


if __name__ == "__main__":
    main()
