#!/usr/bin/env python3
"""Fit compact Chebyshev series to the JPL development ephemerides around every transit of
Mercury and Venus from 1600 to 2300, for the tool's `--ephemeris jpl`.

What is fitted, per transit window (greatest transit +- 2 days, TDB taken as TT as the tool
does): the barycentric positions (ICRF axes, au) of the Earth, the Sun and the planet. The
tool differentiates the Earth's series for its barycentric velocity (aberration) and does the
light time and aberration itself, exactly as it does with VSOP87.

Which ephemeris serves which years (the PyPI packages ship the JPL Chebyshev coefficients as
NumPy arrays; pinned: jplephem==2.24 de405==1997.1 de421==2008.1 de422==2009.1
de423==2010.1, numpy 2.x):
  1600-1799  DE405   (DE421 and DE423 start in 1899 and 1799)
  1800-1899  DE423
  1900-2049  DE421   (the ephemeris of the modern reference checks)
  2050-2199  DE423
  2200-2300  DE422   (DE405 and DE423 end in 2200; DE422 runs -3000 to 3000)

Transits are found with the ephemeris itself: every local minimum of the geometric
geocentric Sun-planet separation at an inferior conjunction below the sum of the
semidiameters plus 60 arcsec gets a window (so near misses are decided by the same
ephemeris inside the tool).

Each body's series is split into the fewest equal segments (1, 2, 4 or 8 per window) and the
fewest coefficients (up to 22) whose largest error over 100 random instants per segment is
below 2 m (the ephemerides' own records join with jumps of up to about a metre, DE422's for Mercury).

Run:  python3 tools/fit_jpl_windows.py
Writes src/data/jpl_windows.txt (the series) and tests/reference/jpl_windows_check.csv
(positions from the ephemeris at random instants inside each window, for the Rust check).
"""

import importlib
import os
import sys

import numpy as np
from numpy.polynomial import chebyshev as C

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(HERE)
AU_KM = 149597870.700          # IAU 2012 Resolution B2
SUN_RADIUS_ARCSEC = 959.63     # at 1 au (Auwers 1891), as the tool uses
PLANET_RADIUS_KM = {"mercury": 2439.7, "venus": 6051.8}  # IAU WGCCRE (Archinal et al. 2011)
HALF_WIDTH_D = 2.0
TOLERANCE_KM = 0.002
MAX_COEFFS = 22
RANGES = [
    (1600, 1799, "de405"),
    (1800, 1899, "de423"),
    (1900, 2049, "de421"),
    (2050, 2199, "de423"),
    (2200, 2300, "de422"),
]
RNG = np.random.default_rng(20261202)


class Ephemeris:
    """Barycentric positions (km) from the coefficient arrays of a PyPI `deNNN` package."""

    def __init__(self, name):
        module = importlib.import_module(name)
        folder = os.path.dirname(module.__file__)
        consts = dict((k.decode("ascii"), v) for k, v in np.load(os.path.join(folder, "constants.npy")))
        self.name = name.upper()
        self.jalpha, self.jomega, self.emrat = consts["jalpha"], consts["jomega"], consts["EMRAT"]
        self.sets = {b: np.load(os.path.join(folder, "jpl-%s.npy" % b), mmap_mode="r")
                     for b in ("sun", "mercury", "venus", "earthmoon", "moon")}

    def _series(self, body, day0, offsets):
        """Position of `body` at JD day0 + offsets (day0 a whole or half day: exact)."""
        sets = self.sets[body]
        n = sets.shape[0]
        span = (self.jomega - self.jalpha) / n
        since = (day0 - self.jalpha) + offsets
        i = np.clip(np.floor(since / span).astype(int), 0, n - 1)
        tau = 2.0 * (since - i * span) / span - 1.0
        coeffs = np.asarray(sets[i])                      # (m, 3, k)
        t = C.chebvander(tau, coeffs.shape[2] - 1)        # (m, k)
        return np.einsum("mk,mak->ma", t, coeffs)

    def position_km(self, body, day0, offsets):
        offsets = np.atleast_1d(np.asarray(offsets, dtype=float))
        if body == "earth":
            emb = self._series("earthmoon", day0, offsets)
            moon = self._series("moon", day0, offsets)
            return emb - moon / (1.0 + self.emrat)
        return self._series(body, day0, offsets)


def separation_and_limit(eph, planet, day0, offsets):
    """Geometric geocentric Sun-planet separation and the contact limit + margin, radians."""
    e = eph.position_km("earth", day0, offsets)
    s = eph.position_km("sun", day0, offsets) - e
    p = eph.position_km(planet, day0, offsets) - e
    ds, dp = np.linalg.norm(s, axis=1), np.linalg.norm(p, axis=1)
    cosang = np.clip(np.einsum("ma,ma->m", s, p) / (ds * dp), -1.0, 1.0)
    sun_sd = np.arcsin(np.sin(SUN_RADIUS_ARCSEC * np.pi / 648000.0) * AU_KM / ds)
    planet_sd = np.arcsin(PLANET_RADIUS_KM[planet] / dp)
    # Behind the Sun (superior conjunction) is no transit: the limit is then never met.
    limit = np.where(dp < ds, sun_sd + planet_sd + 60.0 * np.pi / 648000.0, -1.0)
    return np.arccos(cosang), limit


def jd_of_year(year):
    """Julian date of January 1.0 of a (proleptic Gregorian from 1582) year."""
    a = (14 - 1) // 12
    y, m = year + 4800 - a, 1 + 12 * a - 3
    return 1 + (153 * m + 2) // 5 + 365 * y + y // 4 - y // 100 + y // 400 - 32045 - 0.5


def find_windows(eph, planet, y0, y1):
    """Centres (JD, whole or half day) of the transit windows of the years y0..y1."""
    start, end = jd_of_year(y0), jd_of_year(y1 + 1)
    day0 = np.floor(start) + 0.5
    offsets = np.arange(0.0, end - day0, 0.25)
    sep, limit = separation_and_limit(eph, planet, day0, offsets)
    centres = []
    for k in range(1, len(sep) - 1):
        if sep[k] <= sep[k - 1] and sep[k] < sep[k + 1]:
            fine = offsets[k] + np.arange(-0.5, 0.5, 1.0 / 1440.0)
            s2, l2 = separation_and_limit(eph, planet, day0, fine)
            j = int(np.argmin(s2))
            if s2[j] < l2[j]:
                centres.append(day0 + np.floor(fine[j] * 2.0) / 2.0)  # to the half day
    return centres


def fit_body(eph, body, lo):
    """Segments [(start offset days, length days, coeffs (3, k))] for one body's window."""
    width = 2.0 * HALF_WIDTH_D + 1.0  # the window's centre is rounded: keep +-2 d around it
    for n_seg in (1, 2, 4, 8):
        seg_len = width / n_seg
        for k in range(8, MAX_COEFFS + 1):
            segments, worst = [], 0.0
            for s in range(n_seg):
                a = s * seg_len
                x = np.cos(np.pi * (np.arange(k) + 0.5) / k)
                values = eph.position_km(body, lo, a + (x + 1.0) * seg_len / 2.0)
                coeffs = np.array([C.chebfit(x, values[:, axis], k - 1) for axis in range(3)])
                coeffs = np.round(coeffs, 5)
                probe = RNG.uniform(0.0, seg_len, 100)
                truth = eph.position_km(body, lo, a + probe)
                got = np.array([C.chebval(2.0 * probe / seg_len - 1.0, coeffs[axis]) for axis in range(3)]).T
                worst = max(worst, float(np.max(np.abs(got - truth))))
                segments.append((a, seg_len, coeffs))
            if worst < TOLERANCE_KM:
                return segments, worst
    raise RuntimeError("no fit within tolerance for %s at %s" % (body, lo))


def main():
    out = [
        "# JPL development ephemerides around every transit of Mercury and Venus, 1600-2300,",
        "# as Chebyshev series fitted by tools/fit_jpl_windows.py (which says which ephemeris",
        "# serves which years). Barycentric positions in km, ICRF axes, argument TDB (= TT).",
        "# window,PLANET,EPHEMERIS,START_JD,LENGTH_DAYS",
        "# BODY,SEGMENT_START_DAYS,SEGMENT_LENGTH_DAYS,AXIS,coefficients...",
    ]
    checks = ["planet,ephemeris,jd_tdb,body,x_km,y_km,z_km"]
    worst_all = 0.0
    n_windows = 0
    for planet in ("mercury", "venus"):
        for y0, y1, name in RANGES:
            eph = Ephemeris(name)
            for centre in find_windows(eph, planet, y0, y1):
                lo = centre - HALF_WIDTH_D - 0.5
                out.append("window,%s,%s,%.1f,%.1f" % (planet, eph.name, lo, 2.0 * HALF_WIDTH_D + 1.0))
                n_windows += 1
                for body in ("earth", "sun", planet):
                    segments, worst = fit_body(eph, body, lo)
                    worst_all = max(worst_all, worst)
                    for a, length, coeffs in segments:
                        for axis in range(3):
                            digits = " ".join(("%.5f" % c).rstrip("0").rstrip(".") for c in coeffs[axis])
                            out.append("%s,%g,%g,%s,%s" % (body, a, length, "xyz"[axis], digits))
                    for probe in RNG.uniform(0.5, 2.0 * HALF_WIDTH_D + 0.5, 2):
                        p = eph.position_km(body, lo, probe)[0]
                        checks.append("%s,%s,%.9f,%s,%.6f,%.6f,%.6f" % (planet, eph.name, lo + probe, body, *p))
                print("%s %s %.1f (%s)" % (planet, name, centre, worst), file=sys.stderr)
    path = os.path.join(ROOT, "src", "data", "jpl_windows.txt")
    with open(path, "w") as f:
        f.write("\n".join(out) + "\n")
    with open(os.path.join(ROOT, "tests", "reference", "jpl_windows_check.csv"), "w") as f:
        f.write("\n".join(checks) + "\n")
    print("%d windows, worst fit error %.3f m, %d bytes" % (n_windows, worst_all * 1e3, os.path.getsize(path)), file=sys.stderr)


if __name__ == "__main__":
    main()
