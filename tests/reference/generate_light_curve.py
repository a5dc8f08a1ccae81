#!/usr/bin/env python3
"""Reference values of the light a planet's disc blocks from a limb-darkened Sun, computed
independently of the tool's method.

The tool integrates, about the Sun's centre, the Sun's intensity times the arc of each circle
that the planet covers (one-dimensional). This script integrates the intensity over the
planet's disc instead, in polar coordinates about the PLANET's centre (two-dimensional), with
the Sun's limb as the exact outer boundary of each ray: for direction phi from the planet's
centre, the ray lies inside the Sun for rho between the roots of
rho^2 + 2 z rho cos(phi) + z^2 - 1 = 0, clipped to [0, p]. Gauss-Legendre quadrature in rho
(smooth on each ray) and in phi.

Law: linear limb darkening I(mu)/I(1) = 1 - u (1 - mu), u = 0.6 (grey atmosphere, Eddington
approximation); the Sun's flux pi (1 - u/3). Lengths in units of the Sun's radius: p the
planet's radius, z the distance between the centres.

Pinned: numpy 2.x. Run: python3 tests/reference/generate_light_curve.py
Writes tests/reference/light_curve_numpy.csv (p, z, blocked fraction of the Sun's flux).
"""

import csv
import os

import numpy as np

HERE = os.path.dirname(os.path.abspath(__file__))
U = 0.6
N_RHO = 200
N_PHI = 4000


def blocked(p, z):
    xr, wr = np.polynomial.legendre.leggauss(N_RHO)
    xp, wp = np.polynomial.legendre.leggauss(N_PHI)
    phi = np.pi * (xp + 1.0)          # 0 .. 2 pi
    wphi = np.pi * wp
    c = np.cos(phi)
    disc = 1.0 - z * z * (1.0 - c * c)
    total = 0.0
    for k in range(N_PHI):
        if disc[k] <= 0.0:
            continue
        root = np.sqrt(disc[k])
        lo = max(0.0, -z * c[k] - root)
        hi = min(p, -z * c[k] + root)
        if hi <= lo:
            continue
        rho = lo + (hi - lo) * (xr + 1.0) / 2.0
        w = wr * (hi - lo) / 2.0
        r2 = z * z + rho * rho + 2.0 * z * rho * c[k]
        mu = np.sqrt(np.clip(1.0 - r2, 0.0, None))
        inten = 1.0 - U * (1.0 - mu)
        total += wphi[k] * np.sum(w * inten * rho)
    return total / (np.pi * (1.0 - U / 3.0))


def main():
    cases = []
    for p in (0.0052, 0.0306, 0.1):
        for z in (0.0, 0.3, 0.6613, 0.9, 1.0 - 2.0 * p, 1.0 - p, 1.0 - 0.5 * p, 1.0,
                  1.0 + 0.5 * p, 1.0 + 0.9 * p):
            cases.append((p, z, blocked(p, z)))
    with open(os.path.join(HERE, "light_curve_numpy.csv"), "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["p", "z", "blocked"])
        for p, z, b in cases:
            w.writerow(["%.6f" % p, "%.6f" % z, "%.12e" % b])
    print(len(cases), "cases")


if __name__ == "__main__":
    main()
