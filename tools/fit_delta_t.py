#!/usr/bin/env python3
"""Write src/data/delta_t.txt, the Delta T (TT - UT1) data the tool compiles in.

Sources (each section of the output names its own):

* 1500-2019: the cubic spline of L. V. Morrison, F. R. Stephenson, C. Y. Hohenkerk and
  M. Zawilski, "Addendum 2020 to 'Measurement of the Earth's rotation: 720 BC to AD 2015'",
  Proc. R. Soc. A 477, 20200776 (2021), Table S15.2020, as the PyPI package skyfield 1.53
  ships it (skyfield/data/delta_t.npz, key 'Table-S15.2020.txt', stored transposed with the
  coefficients highest order first; written here in the paper's order a0..a3, unchanged).
* Its uncertainty: the epsilon column of the same authors' yearly table on the HM Nautical
  Almanac Office pages (http://astro.ukho.gov.uk/nao/lvm/, the table as obtained on
  2021-01-13), 1600-2019, and their predictions with epsilon for 2030-2300.
* 1973-02 to the last observation: observed Delta T = 32.184 s + (TAI - UTC) - (UT1 - UTC)
  from the IERS Rapid Service/Prediction Center's finals2000A.all (rows flagged 'I') and
  the IERS leap-second file, as the PyPI package astropy-iers-data carries them; the IERS
  Bulletin A predictions (rows flagged 'P') for the year after.

Pinned: skyfield==1.53 astropy-iers-data==0.2026.11.16.0.37.44 numpy 2.x.
Run: python3 tools/fit_delta_t.py (a few seconds). It also writes tests/reference/delta_t_skyfield.csv:
Skyfield's own Delta T (load.timescale(builtin=True), 0h UT1) at the transit dates and on June 1
of every tenth year 1600-2020, the outside check of tests/delta_t_reference.rs. It prints the checks it makes: the spline
against skyfield's own Delta T before 1971, and the monthly observed series, linearly
interpolated, against the daily one (the figure written as observed_interpolation_error_s).
"""

import hashlib
import os
import sys

import astropy_iers_data as aid
import numpy as np
import skyfield
from skyfield.api import load

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, "..", "src", "data", "delta_t.txt")
CHECK = os.path.join(HERE, "..", "tests", "reference", "delta_t_skyfield.csv")
# Dates of the transits the tests name, with Skyfield's Delta T beside them.
EVENT_DATES = [(1631, 12, 7), (1639, 12, 4), (1761, 6, 6), (1769, 6, 3), (1874, 12, 9),
               (1882, 12, 6), (2004, 6, 8), (2012, 6, 6), (2016, 5, 9), (2019, 11, 11)]

# The authors' yearly table (HMNAO LVM pages, obtained 2021-01-13): epsilon by year, 1600-2019,
# where the 1600-1800 and 1800-1950 sub-tables overlap the finer one is used.
EPSILON = [(1600, 15), (1610, 15), (1620, 20), (1630, 20), (1640, 20), (1650, 20), (1660, 15),
           (1670, 10), (1680, 5), (1690, 5), (1700, 5), (1710, 5), (1720, 5), (1730, 2),
           (1740, 2), (1750, 2), (1760, 2), (1770, 1), (1780, 1), (1790, 1), (1800, 0.5),
           (1805, 0.3), (1810, 0.2), (1815, 0.2), (1820, 0.2), (1825, 0.2), (1830, 0.2),
           (1835, 0.1), (1840, 0.1), (1845, 0.1), (1850, 0.1), (1855, 0.1), (1860, 0.1),
           (1865, 0.1), (1870, 0.05), (2019, 0.05)]
# Their predictions, same table: year, Delta T (s), epsilon (s).
LONG_TERM = [(2030, 67, 2), (2040, 68, 4), (2050, 70, 6), (2100, 80, 10), (2200, 160, 20),
             (2300, 330, 30), (2400, 610, 50)]


def sha(path):
    with open(path, "rb") as f:
        return hashlib.sha256(f.read()).hexdigest()


def spline_rows():
    path = os.path.join(os.path.dirname(skyfield.__file__), "data", "delta_t.npz")
    tab = np.load(path)["Table-S15.2020.txt"]
    rows = []
    for i in range(tab.shape[1]):
        k0, k1, a3, a2, a1, a0 = tab[:, i]
        if k1 > 1550:
            rows.append((k0, k1, a0, a1, a2, a3))
    return path, rows


def spline(rows, y):
    for k0, k1, a0, a1, a2, a3 in rows:
        if k0 <= y < k1 or (y == k1 == rows[-1][1]):
            t = (y - k0) / (k1 - k0)
            return a0 + t * (a1 + t * (a2 + t * a3))
    raise ValueError(y)


def leap_seconds():
    out = []
    with open(aid.IERS_LEAP_SECOND_FILE) as f:
        for line in f:
            if line.startswith("#") or not line.strip():
                continue
            p = line.split()
            out.append((float(p[0]), float(p[4])))
    return np.array(out)


def finals(leaps):
    """Every row of finals2000A.all with a UT1 value: (mjd, flag, delta_t_s, decimal_year)."""
    rows = []
    with open(aid.IERS_A_FILE) as f:
        for line in f:
            if len(line) < 68 or line[57] not in "IP":
                continue
            mjd = float(line[7:15])
            ut1_utc = float(line[58:68])
            tai_utc = leaps[np.searchsorted(leaps[:, 0], mjd, side="right") - 1, 1]
            delta_t = 32.184 + tai_utc - ut1_utc
            # Decimal year of the TT instant, as the tool counts it: 2000 + days from J2000 / 365.25.
            jd_tt = mjd + 2400000.5 + (32.184 + tai_utc) / 86400.0
            rows.append((mjd, line[57], delta_t, 2000.0 + (jd_tt - 2451545.0) / 365.25, line[:6]))
    return rows


def main():
    spline_path, rows = spline_rows()
    ts = load.timescale(builtin=True)
    worst = 0.0
    for year in range(1600, 1971):
        t = ts.ut1(year, 6, 1)
        worst = max(worst, abs(t.delta_t - spline(rows, t.J)))
    print(f"spline against skyfield's Delta T, 1600-1970: worst {worst:.2e} s", file=sys.stderr)
    assert worst < 1e-9

    leaps = leap_seconds()
    daily = finals(leaps)
    observed = [r for r in daily if r[1] == "I"]
    predicted = [r for r in daily if r[1] == "P"]
    monthly = [r for r in observed if r[4][4:6] == " 1"] + [observed[-1]]
    my = np.array([r[3] for r in monthly])
    md = np.array([r[2] for r in monthly])
    diffs = [abs(np.interp(r[3], my, md) - r[2]) for r in observed if r[3] >= my[0]]
    interp_error = max(diffs)
    print(f"monthly observed series, interpolated, against the daily: worst {interp_error:.4f} s, "
          f"rms {np.sqrt(np.mean(np.square(diffs))):.4f} s", file=sys.stderr)
    joined = [abs(spline(rows, r[3]) - r[2]) for r in observed if r[3] < 2019.0]
    spline_error = max(joined)
    print(f"spline against the observed daily series, 1973-2019: worst {spline_error:.3f} s", file=sys.stderr)
    pmonthly = [r for r in predicted if r[4][4:6] == " 1"] + [predicted[-1]]
    last_obs = observed[-1]

    with open(OUT, "w") as f:
        f.write("# Delta T = TT - UT1 (seconds) for transit-parallax. Made by tools/fit_delta_t.py; do not edit.\n")
        f.write("# Decimal years are 2000 + (JD(TT) - 2451545) / 365.25.\n")
        f.write("#\n# spline K0 K1 a0 a1 a2 a3: Delta T = a0 + a1 t + a2 t^2 + a3 t^3, t = (y - K0) / (K1 - K0).\n")
        f.write("#   Morrison, Stephenson, Hohenkerk and Zawilski, Proc. R. Soc. A 477, 20200776 (2021),\n")
        f.write(f"#   Table S15.2020, from PyPI skyfield=={skyfield.__version__} data/delta_t.npz (sha256 {sha(spline_path)}).\n")
        for k0, k1, a0, a1, a2, a3 in rows:
            f.write(f"spline {k0:.0f} {k1:.0f} {a0:.3f} {a1:.3f} {a2:.3f} {a3:.3f}\n")
        f.write("# spline_minus_observed_worst_s: the spline's worst departure from the observed daily series,\n")
        f.write("#   1973-2019 (the uncertainty used between 1955 and the first observation here).\n")
        f.write(f"spline_minus_observed_worst_s {spline_error:.3f}\n")
        f.write("#\n# epsilon YEAR S: the uncertainty of the spline's Delta T; a year takes the larger value of the two\n#   tabulated years that bracket it,\n")
        f.write("#   the epsilon column of the same authors' table, http://astro.ukho.gov.uk/nao/lvm/ (obtained 2021-01-13).\n")
        for y, e in EPSILON:
            f.write(f"epsilon {y} {e}\n")
        f.write("#\n# observed DECIMAL_YEAR DELTA_T: 32.184 + (TAI - UTC) - (UT1 - UTC) on the 1st of each month and on the\n")
        f.write(f"#   last observed day ({last_obs[4].strip()}), from finals2000A.all rows flagged I (IERS Rapid Service) and the\n")
        f.write(f"#   IERS leap-second file, PyPI astropy-iers-data=={aid.__version__} (finals sha256 {sha(aid.IERS_A_FILE)}).\n")
        f.write(f"# observed_interpolation_error_s: the worst difference between this series, linearly interpolated,\n#   and the daily values it was taken from.\n")
        f.write(f"observed_interpolation_error_s {interp_error:.4f}\n")
        for r in monthly:
            f.write(f"observed {r[3]:.6f} {r[2]:.4f}\n")
        f.write("#\n# predicted DECIMAL_YEAR DELTA_T: the IERS Bulletin A predictions (rows flagged P of the same file),\n")
        f.write("#   their accuracy S_t = 0.00025 (days ahead)^0.75 s as every Bulletin A states it.\n")
        for r in pmonthly:
            f.write(f"predicted {r[3]:.6f} {r[2]:.4f}\n")
        f.write("#\n# long_term YEAR DELTA_T EPSILON: the authors' predictions, same table as epsilon.\n")
        for y, v, e in LONG_TERM:
            f.write(f"long_term {y} {v} {e}\n")
    print(f"wrote {OUT}: {len(rows)} spline segments, {len(monthly)} observed, {len(pmonthly)} predicted",
          file=sys.stderr)


def write_check():
    ts = load.timescale(builtin=True)
    dates = EVENT_DATES + [(y, 6, 1) for y in range(1600, 2021, 10)]
    with open(CHECK, "w") as f:
        f.write(f"# Delta T from Skyfield {skyfield.__version__} (load.timescale(builtin=True), ts.ut1(y, m, d).delta_t);\n")
        f.write("# decimal_year = t.J (2000 + (JD(TT) - 2451545) / 365.25). Made by tools/fit_delta_t.py.\n")
        f.write("date,decimal_year,delta_t_s\n")
        for y, m, d in dates:
            t = ts.ut1(y, m, d)
            f.write(f"{y:04d}-{m:02d}-{d:02d},{t.J:.6f},{t.delta_t:.4f}\n")


if __name__ == "__main__":
    write_check()
    main()
