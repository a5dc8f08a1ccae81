#!/usr/bin/env python3
"""Generate reference contact times for transits of Venus and Mercury.

Independent reference for `cargo test`: the JPL DE421 (1900-2050), DE423
(1799-2200) and DE405 (1600-2200, used here for 1639, 1761, 1769 and Mercury 1786) planetary ephemerides, evaluated by the general-purpose astronomy
library Skyfield.  The output CSV is committed next to this script so that the
Rust tests never need Python.

Model the fixtures follow (keep the Rust side identical in meaning):

* Positions: Skyfield `observer.at(t).observe(body).apparent()` - light-time
  iterated, gravitational deflection (Skyfield's default: Sun, Jupiter, Saturn),
  annual (and, for a topocentric observer, diurnal) aberration, GCRS.
* Observers: WGS 84 geodetic latitude, longitude (east positive), elevation in
  metres, through `skyfield.api.wgs84.latlon`; no polar motion.
* Earth rotation: IAU 2006/2000A sidereal time with a FIXED Delta T = TT - UT1
  per event (given in the output), so that the geometry and not a Delta T model
  is what the comparison tests.  For events from 1972 on, Delta T is set to
  32.184 s + (TAI - UTC), i.e. UT1 = UTC.  Output times are labelled UTC:
  from 1972 on they are TT - 32.184 s - (TAI - UTC) with TAI - UTC =
  32, 34, 36, 37 s for 2004, 2012, 2016, 2019 (IERS Bulletin C) and, following the
  tool's convention, 37 s after the table's end (2117).  Before 1972 they are
  UT1 = TT - Delta T.
* Sizes: the Sun's radius is sin(959.63 arcsec) au (959.63" at 1 au, Auwers
  1891); Venus 6051.8 km, Mercury 2439.7 km (IAU WGCCRE, Archinal et al. 2011);
  the au is 149 597 870.700 km (IAU 2012 Resolution B2).  Apparent semidiameter
  s = asin(R / d) with d the apparent (light-time) distance.
* Contacts: apparent separation of centres = s_sun + s_planet (I, IV) or
  s_sun - s_planet (II, III); no refraction, no irradiation.

The PyPI packages `de405`, `de421` and `de423` ship the JPL Chebyshev coefficients as
NumPy arrays; this script writes them, for short windows around each event,
into a temporary SPK (DAF type 2) file that Skyfield opens offline.

Pinned versions: skyfield==1.53 jplephem==2.24 de405==1997.1 de421==2008.1 de423==2010.1
numpy 2.x.  Run:  python3 tests/reference/generate_contacts.py
Writes tests/reference/contacts_skyfield.csv (with the Sun's true altitude and the position angle
of the contact point at each contact) and prints the time per station.
"""

import csv
import os
import struct
import sys
import tempfile
import time

import numpy as np
from jplephem.daf import DAF
from skyfield.api import load, wgs84
from skyfield.jpllib import SpiceKernel
from skyfield.trigonometry import position_angle_of

HERE = os.path.dirname(os.path.abspath(__file__))
AU_KM = 149597870.700
ARCSEC = np.pi / 648000.0
R_SUN_AU = np.sin(959.63 * ARCSEC)
RADIUS_KM = {"venus": 6051.8, "mercury": 2439.7}
T0_JD = 2451545.0
S_PER_DAY = 86400.0

# event label, planet, ephemeris module, approximate greatest transit (TT JD),
# Delta T (TT - UT1, s) used on both sides, TT - (time label) in seconds
EVENTS = [
    ("venus-2004-06-08", "venus", "de421", 2453164.85, 64.184, 64.184),
    ("venus-2012-06-06", "venus", "de421", 2456084.56, 66.184, 66.184),
    ("mercury-2016-05-09", "mercury", "de421", 2457518.12, 68.184, 68.184),
    ("mercury-2019-11-11", "mercury", "de421", 2458799.14, 69.184, 69.184),
    ("venus-1874-12-09", "venus", "de423", 2405866.67, -3.0, -3.0),
    ("venus-1882-12-06", "venus", "de423", 2408786.21, -5.5, -5.5),
    ("venus-2117-12-11", "venus", "de423", 2494622.62, 240.0, 69.184),
    # Before DE423's start (1799): DE405 (Standish 1998), which runs from 1599.
    ("venus-1639-12-04", "venus", "de405", 2320030.27, 65.0, 65.0),
    ("venus-1761-06-06", "venus", "de405", 2364408.72, 15.0, 15.0),
    ("venus-1769-06-03", "venus", "de405", 2367328.43, 16.0, 16.0),
    # A transit of Mercury of the 18th century (greatest transit 1786 May 4, 05:41 UT1).
    ("mercury-1786-05-04", "mercury", "de405", 2373506.74, 17.0, 17.0),
]

# Invented stations spread over both hemispheres (name, lat, lon east, elevation m).
STATIONS = [
    ("north-cape", 70.98, 25.97, 300.0),
    ("fjord-hill", 60.39, 5.32, 12.0),
    ("river-bend", 51.48, -0.01, 46.0),
    ("high-plateau", 40.42, -3.70, 667.0),
    ("desert-well", 23.42, 25.66, 250.0),
    ("lake-shore", -1.29, 36.82, 1795.0),
    ("cape-point", -33.93, 18.42, 20.0),
    ("steppe", 43.24, 76.95, 800.0),
    ("monsoon-bay", 19.08, 72.88, 14.0),
    ("delta-town", 13.75, 100.50, 2.0),
    ("island-peak", 1.35, 103.82, 160.0),
    ("coral-coast", -12.46, 130.84, 30.0),
    ("harbour-city", -33.87, 151.21, 58.0),
    ("south-sound", -45.87, 170.50, 100.0),
    ("volcano-rim", 19.82, -155.47, 4200.0),
    ("bay-of-firs", 37.77, -122.42, 16.0),
    ("prairie", 49.90, -97.14, 239.0),
    ("lake-city", 41.88, -87.63, 181.0),
    ("tundra-camp", 64.84, -147.72, 136.0),
    ("andes-pass", -33.45, -70.67, 570.0),
    ("pampas", -34.60, -58.38, 25.0),
    ("rain-forest", -3.12, -60.02, 92.0),
    ("far-east-port", 43.12, 131.89, 60.0),
    ("snow-station", -77.85, 166.67, 24.0),
    ("old-capital", 35.01, 135.77, 50.0),
    ("tropic-isle", -17.53, -149.57, 5.0),
]

# SPK body codes: bodies written into the temporary kernel.
BODIES = [
    ("sun", 10, 0),
    ("mercury", 1, 0),
    ("venus", 2, 0),
    ("earthmoon", 3, 0),
    ("jupiter", 5, 0),
    ("saturn", 6, 0),
]


def write_spk(module_name, windows_jd, path):
    """Write a DAF/SPK type 2 file with the segments needed around `windows_jd`."""
    module = __import__(module_name)
    folder = os.path.dirname(module.__file__)
    consts = dict((k.decode("ascii"), v) for k, v in np.load(os.path.join(folder, "constants.npy")))
    jalpha, jomega, emrat = consts["jalpha"], consts["jomega"], consts["EMRAT"]

    with open(path, "w+b") as f:
        fmt = "<8sII60sIII8s603s28s297s"
        ftp = b"FTPSTR:\r:\n:\r\n:\r\x00:\x81:\x10\xce:ENDFTP"
        rec = struct.pack(fmt, b"DAF/SPK ", 2, 6, b"reference excerpt".ljust(60),
                          2, 2, 385, b"LTL-IEEE", b"\0" * 603, ftp, b"\0" * 297)
        f.write(rec)
        f.write(b"\0" * 1024)
        f.write(b" " * 1024)
        f.flush()
        f.seek(0)
        daf = DAF(f)

        def add(target, center, sets, days_per_set):
            for lo, hi in windows_jd:
                i = int((lo - jalpha) // days_per_set)
                j = int((hi - jalpha) // days_per_set) + 1
                chunk = sets[i:j]
                n_sets, _, ncoef = chunk.shape
                radius = days_per_set * S_PER_DAY / 2.0
                init = (jalpha + i * days_per_set - T0_JD) * S_PER_DAY
                mids = init + radius + np.arange(n_sets) * 2.0 * radius
                body = np.column_stack([mids, np.full(n_sets, radius), chunk.reshape(n_sets, 3 * ncoef)])
                rsize = 2 + 3 * ncoef
                data = np.concatenate([body.ravel(), [init, 2.0 * radius, rsize, n_sets]])
                start = init
                end = init + n_sets * 2.0 * radius
                daf.add_array(b"excerpt", (start, end, target, center, 1, 2), data)

        for name, target, center in BODIES:
            sets = np.load(os.path.join(folder, "jpl-%s.npy" % name))
            add(target, center, sets, (jomega - jalpha) / sets.shape[0])
        moon = np.load(os.path.join(folder, "jpl-moon.npy"))
        dps = (jomega - jalpha) / moon.shape[0]
        # The DE files give the Moon relative to the Earth's centre.
        add(301, 3, moon * (emrat / (1.0 + emrat)), dps)
        add(399, 3, moon * (-1.0 / (1.0 + emrat)), dps)


def de405_event(planet, jd_guess, delta_t_s):
    """JPL DE405 around `jd_guess` (a temporary SPK file), the Earth, a timescale with the fixed
    Delta T, and the contact solver of `planet`: the set-up every historical generator shares."""
    path = os.path.join(tempfile.mkdtemp(), "de405.bsp")
    write_spk("de405", [(jd_guess - 3.0, jd_guess + 3.0)], path)
    eph = SpiceKernel(path)
    ts = load.timescale(delta_t=delta_t_s)
    return eph, eph[399], ts, ContactSolver(eph, planet, jd_guess, delta_t_s)


def sites_seeing_contacts(earth, solver, draw, rng, count, min_altitude_deg=5.0, min_contacts=2):
    """`count` sites drawn by `draw(rng)` (latitude, longitude, elevation) that see at least
    `min_contacts` contacts with the Sun above `min_altitude_deg`; each as (lat, lon, elev,
    {contact: time})."""
    sites = []
    while len(sites) < count:
        lat, lon, elev = draw(rng)
        obs = earth + wgs84.latlon(lat, lon, elevation_m=elev)
        res = solver.contacts(obs)
        seen = {c: t for c, t in res.items() if solver.sun_altitude_deg(obs, t) > min_altitude_deg}
        if len(seen) >= min_contacts:
            sites.append((lat, lon, elev, seen))
    return sites


def iso(jd_label):
    """ISO 8601 string (Z) for a Julian date on the output time label, to 0.1 ms."""
    day = np.floor(jd_label - 0.5) + 0.5
    tenth_ms = int(round((jd_label - day) * S_PER_DAY * 1e4))
    y, mo, d, _, _, _ = load.timescale().tt_jd(day).tt_calendar()  # calendar only
    sec, frac = divmod(tenth_ms, 10000)
    return "%04d-%02d-%02dT%02d:%02d:%02d.%04dZ" % (y, mo, d, sec // 3600, sec // 60 % 60, sec % 60, frac)


class ContactSolver:
    """Contacts I-IV for observers during one event (see the module docstring for the model)."""

    def __init__(self, eph, planet, jd_guess, delta_t_s):
        self.ts = load.timescale(delta_t=delta_t_s)
        self.sun = eph["sun"]
        self.body = eph[2] if planet == "venus" else eph[1]
        self.r_p_au = RADIUS_KM[planet] / AU_KM
        self.jd_guess = jd_guess

    def separation(self, observer, offset_days):
        # Two-part Julian date keeps sub-microsecond resolution.
        t = self.ts.tt_jd(self.jd_guess, offset_days)
        o = observer.at(t)
        s_app = o.observe(self.sun).apparent()
        p_app = o.observe(self.body).apparent()
        sep = s_app.separation_from(p_app).radians
        return (sep, np.arcsin(R_SUN_AU / s_app.distance().au),
                np.arcsin(self.r_p_au / p_app.distance().au))

    def contact_fn(self, observer, kind):
        def f(offset_days):
            sep, ss, sp = self.separation(observer, offset_days)
            return sep - (ss + sp if kind == "ext" else ss - sp)
        return f

    @staticmethod
    def solve(f, a, b):
        """Bisection on a bracketing interval to 1e-11 day (under a microsecond)."""
        fa = f(a)
        if np.sign(fa) == np.sign(f(b)):
            return None
        while b - a > 1e-11:
            m = 0.5 * (a + b)
            fm = f(m)
            if np.sign(fm) == np.sign(fa):
                a, fa = m, fm
            else:
                b = m
        return 0.5 * (a + b)

    def contacts(self, observer):
        """Contacts as {n: days from jd_guess (TT)}."""
        # grid of 2-minute steps over +-9 h around greatest transit
        grid = np.arange(-9 * 30, 9 * 30 + 1) / 720.0  # days from jd_guess
        t = self.ts.tt_jd(self.jd_guess, grid)
        o = observer.at(t)
        s_app = o.observe(self.sun).apparent()
        p_app = o.observe(self.body).apparent()
        sep = s_app.separation_from(p_app).radians
        ss = np.arcsin(R_SUN_AU / s_app.distance().au)
        sp = np.arcsin(self.r_p_au / p_app.distance().au)
        res = {}
        for kind, (ci, cj) in (("ext", (1, 4)), ("int", (2, 3))):
            g = sep - (ss + sp if kind == "ext" else ss - sp)
            idx = np.nonzero(np.sign(g[:-1]) != np.sign(g[1:]))[0]
            f = self.contact_fn(observer, kind)
            for k in idx:
                root = self.solve(f, grid[k], grid[k + 1])
                which = ci if g[k] > 0 else cj
                res[which] = root
        return res

    def position_angle_deg(self, observer, offset_days):
        """Position angle of the planet's centre from the Sun's, from north (true equator and
        equinox of date) through east, degrees."""
        t = self.ts.tt_jd(self.jd_guess, offset_days)
        o = observer.at(t)
        s_ra, s_dec, _ = o.observe(self.sun).apparent().radec(epoch="date")
        p_ra, p_dec, _ = o.observe(self.body).apparent().radec(epoch="date")
        return position_angle_of((s_dec, s_ra), (p_dec, p_ra)).degrees

    def sun_altitude_deg(self, observer, offset_days):
        """True (unrefracted) altitude of the Sun's centre."""
        t = self.ts.tt_jd(self.jd_guess, offset_days)
        alt, _, _ = observer.at(t).observe(self.sun).apparent().altaz()
        return alt.degrees


def timing_only():
    """Time Skyfield on the Venus 2012 event for the 26 stations; print seconds per station."""
    label, planet, module, jd_guess, delta_t_s, _ = EVENTS[1]
    path = os.path.join(tempfile.mkdtemp(), module + ".bsp")
    write_spk(module, [(jd_guess - 3.0, jd_guess + 3.0)], path)
    eph = SpiceKernel(path)
    solver = ContactSolver(eph, planet, jd_guess, delta_t_s)
    earth = eph[399]
    t0 = time.perf_counter()
    for name, lat, lon, elev in STATIONS:
        solver.contacts(earth + wgs84.latlon(lat, lon, elevation_m=elev))
    per = (time.perf_counter() - t0) / len(STATIONS)
    print("%.6f" % per)


def main():
    if "--timing-only" in sys.argv:
        timing_only()
        return
    out_rows = []
    per_station_s = []
    by_module = {}
    for ev in EVENTS:
        by_module.setdefault(ev[2], []).append(ev)
    tmpdir = tempfile.mkdtemp()
    for module_name, events in by_module.items():
        path = os.path.join(tmpdir, module_name + ".bsp")
        write_spk(module_name, [(e[3] - 3.0, e[3] + 3.0) for e in events], path)
        eph = SpiceKernel(path)
        sun = eph["sun"]
        earth = eph[399]
        for label, planet, _, jd_guess, delta_t_s, label_offset_s in events:
            solver = ContactSolver(eph, planet, jd_guess, delta_t_s)
            contacts = solver.contacts

            observers = [("geocentre", None, None, None, earth)]
            for name, lat, lon, elev in STATIONS:
                observers.append((name, lat, lon, elev, earth + wgs84.latlon(lat, lon, elevation_m=elev)))
            for name, lat, lon, elev, obs in observers:
                t_start = time.perf_counter()
                res = contacts(obs)
                if name != "geocentre":
                    per_station_s.append(time.perf_counter() - t_start)
                for c in sorted(res):
                    jd_label = jd_guess + (res[c] - label_offset_s / S_PER_DAY)
                    alt = "" if lat is None else "%.4f" % solver.sun_altitude_deg(obs, res[c])
                    pa = "%.4f" % solver.position_angle_deg(obs, res[c])
                    out_rows.append([label, planet, delta_t_s, name,
                                     "" if lat is None else lat, "" if lon is None else lon,
                                     "" if elev is None else elev, c, iso(jd_label), alt, pa])
            print(label, "done", file=sys.stderr)
    with open(os.path.join(HERE, "contacts_skyfield.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["event", "planet", "delta_t_s", "station", "latitude", "longitude",
                    "elevation_m", "contact", "time_utc", "sun_altitude_deg", "position_angle_deg"])
        w.writerows(out_rows)
    mean = sum(per_station_s) / len(per_station_s)
    print("skyfield: %.4f s per station for all four contacts (%d stations)" % (mean, len(per_station_s)))


if __name__ == "__main__":
    main()
