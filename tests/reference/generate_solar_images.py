#!/usr/bin/env python3
"""Synthetic images of the Sun with Venus or Mercury in transit, for `cargo test --test measure`.

Made outside the tool, so that the measurement is checked against an independent truth:

* Geometry: the planet's apparent topocentric place relative to the Sun's centre from the JPL
  DE421 ephemeris (PyPI package `de421`, Folkner et al. 2008) evaluated by Skyfield
  (`observer.at(t).observe(body).apparent()`), with the DE421 excerpt written to a temporary
  SPK file exactly as generate_contacts.py does (its `write_spk` is imported). UT1 = UTC and
  TT = UTC + 32.184 s + (TAI - UTC), TAI - UTC = 34, 36, 37 s in 2012, 2016, 2019 (IERS
  Bulletin C).
* Sizes: the Sun's radius sin(959.63 arcsec) au (Auwers 1891), Venus 6051.8 km and Mercury
  2439.7 km (Archinal et al. 2011); semidiameters asin(R / d) at the apparent distance.
* Separation in solar radii: the angular separation of the centres over the Sun's apparent
  semidiameter. On the image the planet sits at that many Sun radii from the Sun's centre,
  in the direction of its position angle (north through east, Skyfield's position_angle_of on
  the true equator of date), then the frame is rotated by a random angle (a camera's
  orientation), scaled (a random Sun radius in pixels) and framed off-centre.
* Limb darkening: the quadratic law I(mu)/I(1) = 1 - u2 - v2 + u2 mu + v2 mu^2 of Cox (2000),
  *Allen's Astrophysical Quantities*, 4th ed., section 14.7, with u2 = 0.93, v2 = -0.23
  (the table's 0.50 um row, from memory; the tool fits its own law, so the exact values only
  set how dark the limb is: I(0)/I(1) = 0.30).
* Rendering: the Sun at 1.0, the sky and the planet's disc at 0.02 (scattered light); pixels
  near an edge integrated on a 16 x 16 grid; a Gaussian blur (sigma in pixels, by FFT); for
  noisy images Gaussian noise of the stated sigma (in units of the centre's brightness) added
  after the blur; stored as 16-bit counts = 1000 + 40000 x intensity.

Writes tests/reference/images/: clean images (PNG 16-bit, some with an EXIF eXIf chunk, and
FITS with DATE-OBS and EXPTIME), the refusal cases, truth.csv (one row per committed image)
and noisy_cases.csv (the parameters of 120 noisy images that the Rust test renders itself with
the same law, seeded, so that the z-scores' spread can be checked without committing them).

Pinned versions: skyfield==1.53 jplephem==2.24 de421==2008.1 numpy 2.x.
Run:  python3 tests/reference/generate_solar_images.py
"""

import csv
import os
import struct
import sys
import tempfile
import zlib

import numpy as np
from skyfield.api import load, wgs84
from skyfield.jpllib import SpiceKernel
from skyfield.trigonometry import position_angle_of

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)
from generate_contacts import write_spk  # noqa: E402

OUT = os.path.join(HERE, "images")
ARCSEC = np.pi / 648000.0
AU_KM = 149597870.700
R_SUN_AU = np.sin(959.63 * ARCSEC)
RADIUS_KM = {"venus": 6051.8, "mercury": 2439.7}
U2, V2 = 0.93, -0.23
SKY = 0.02
COUNTS_ZERO, COUNTS_SCALE = 1000.0, 40000.0

# event, planet, TAI - UTC (s), approximate mid-transit as a Julian date (UTC)
EVENTS = {
    "venus-2012": ("venus", 34.0, 2456084.56),
    "mercury-2016": ("mercury", 36.0, 2457518.12),
    "mercury-2019": ("mercury", 37.0, 2458799.14),
}

# Invented stations (name, latitude, longitude east, elevation m) with the Sun up during the
# chosen instants.
STATIONS = {
    "venus-2012": [("harbour-city", -33.87, 151.21, 58.0), ("island-peak", 1.35, 103.82, 160.0),
                   ("volcano-rim", 19.82, -155.47, 4200.0), ("steppe", 43.24, 76.95, 800.0),
                   ("far-east-port", 43.12, 131.89, 60.0)],
    "mercury-2016": [("river-bend", 51.48, -0.01, 46.0), ("high-plateau", 40.42, -3.70, 667.0),
                     ("lake-city", 41.88, -87.63, 181.0), ("pampas", -34.60, -58.38, 25.0)],
    "mercury-2019": [("prairie", 49.90, -97.14, 239.0), ("andes-pass", -33.45, -70.67, 570.0),
                     ("rain-forest", -3.12, -60.02, 92.0), ("desert-well", 23.42, 25.66, 250.0)],
}
# Instants (hours from the UTC Julian date above) well inside contacts II-III.
OFFSETS_H = [-2.2, -1.1, 0.0, 1.0, 2.0]


class Sky:
    def __init__(self):
        path = os.path.join(tempfile.mkdtemp(), "de421.bsp")
        write_spk("de421", [(jd - 3.0, jd + 3.0) for _, _, jd in EVENTS.values()], path)
        self.eph = SpiceKernel(path)
        self.earth = self.eph[399]

    def place(self, event, station, utc_jd):
        """(separation in solar radii, position angle deg, planet radius in solar radii,
        Sun's altitude deg)."""
        planet, dat, _ = EVENTS[event]
        ts = load.timescale(delta_t=32.184 + dat)
        t = ts.tt_jd(utc_jd + (32.184 + dat) / 86400.0)
        _, lat, lon, elev = station
        o = (self.earth + wgs84.latlon(lat, lon, elevation_m=elev)).at(t)
        sun = o.observe(self.eph["sun"]).apparent()
        body = o.observe(self.eph[2] if planet == "venus" else self.eph[1]).apparent()
        s_sun = np.arcsin(R_SUN_AU / sun.distance().au)
        s_planet = np.arcsin(RADIUS_KM[planet] / AU_KM / body.distance().au)
        sep = sun.separation_from(body).radians
        s_ra, s_dec, _ = sun.radec(epoch="date")
        p_ra, p_dec, _ = body.radec(epoch="date")
        pa = position_angle_of((s_dec, s_ra), (p_dec, p_ra)).degrees
        alt = sun.altaz()[0].degrees
        return sep / s_sun, pa, s_planet / s_sun, alt


def iso_utc(jd):
    days = jd - 2440587.5
    seconds = round(days * 86400.0, 3)
    whole = int(np.floor(seconds))
    ms = int(round((seconds - whole) * 1000))
    y, mo, d = np.datetime64(whole, "s").astype(object).timetuple()[:3]
    hh, mm, ss = whole // 3600 % 24, whole // 60 % 60, whole % 60
    return "%04d-%02d-%02dT%02d:%02d:%02d.%03dZ" % (y, mo, d, hh, mm, ss, ms)


def law(mu):
    return 1.0 - U2 - V2 + U2 * mu + V2 * mu * mu


def intensity(x, y, g):
    r = np.hypot(x - g["cx"], y - g["cy"])
    mu = np.sqrt(np.clip(1.0 - (r / g["r_sun"]) ** 2, 0.0, 1.0))
    value = np.where(r < g["r_sun"], law(mu), SKY)
    for (px, py, rp, depth) in g["dark"]:
        inside = np.hypot(x - px, y - py) < rp
        value = np.where(inside & (r < g["r_sun"]), value * (1.0 - depth) + SKY * depth, value)
    return value


def render(g, width, height, blur_px, noise, rng):
    y, x = np.mgrid[0:height, 0:width].astype(float)
    img = intensity(x, y, g)
    near = np.abs(np.hypot(x - g["cx"], y - g["cy"]) - g["r_sun"]) < 1.5
    for (px, py, rp, _) in g["dark"]:
        near |= np.abs(np.hypot(x - px, y - py) - rp) < 1.5
    k = 16
    sub = (np.arange(k) + 0.5) / k - 0.5
    ys, xs = np.nonzero(near)
    acc = np.zeros(len(xs))
    for dy in sub:
        for dx in sub:
            acc += intensity(xs + dx, ys + dy, g)
    img[ys, xs] = acc / (k * k)
    if blur_px > 0:
        pad = int(np.ceil(5 * blur_px))
        big = np.pad(img, pad, mode="edge")
        fy = np.fft.fftfreq(big.shape[0])[:, None]
        fx = np.fft.rfftfreq(big.shape[1])[None, :]
        kernel = np.exp(-2.0 * (np.pi * blur_px) ** 2 * (fx * fx + fy * fy))
        big = np.fft.irfft2(np.fft.rfft2(big) * kernel, s=big.shape)
        img = big[pad:-pad, pad:-pad]
    if noise > 0:
        img = img + rng.normal(0.0, noise, img.shape)
    return np.clip(np.round(COUNTS_ZERO + COUNTS_SCALE * img), 0, 65535).astype(np.uint16)


def png_chunk(kind, data):
    return struct.pack(">I", len(data)) + kind + data + struct.pack(">I", zlib.crc32(kind + data))


def exif_tiff(date_time, subsec, offset):
    """A little-endian TIFF/EXIF block (CIPA DC-008-2019): IFD0 pointing to an Exif IFD with
    DateTimeOriginal (0x9003), SubSecTimeOriginal (0x9291) and, if given, OffsetTimeOriginal
    (0x9011)."""
    fields = [(0x9003, (date_time + "\0").encode()), (0x9291, (subsec + "\0").encode())]
    if offset:
        fields.append((0x9011, (offset + "\0").encode()))
    fields.sort()
    ifd0_at, exif_at = 8, 8 + 2 + 12 + 4
    data_at = exif_at + 2 + 12 * len(fields) + 4
    out = b"II*\0" + struct.pack("<I", ifd0_at)
    out += struct.pack("<H", 1) + struct.pack("<HHII", 0x8769, 4, 1, exif_at) + struct.pack("<I", 0)
    blob = b""
    entries = b""
    for tag, value in fields:
        if len(value) <= 4:
            # Values of four bytes or fewer sit in the entry itself (TIFF 6.0, section 2).
            entries += struct.pack("<HHI", tag, 2, len(value)) + value.ljust(4, b"\0")
        else:
            entries += struct.pack("<HHII", tag, 2, len(value), data_at + len(blob))
            blob += value
    return out + struct.pack("<H", len(fields)) + entries + struct.pack("<I", 0) + blob


def write_png16(path, counts, exif=None):
    write_png(path, counts, 16, exif)


def write_png(path, counts, bits, exif=None):
    """A grey PNG (ISO/IEC 15948:2004) of 8 or 16 bits, filter type Up on every row."""
    h, w = counts.shape
    big = np.frombuffer(counts.astype(">u2" if bits == 16 else "u1").tobytes(), np.uint8).reshape(h, -1)
    # The Up filter works on bytes, modulo 256 (ISO/IEC 15948, section 9.2).
    up = np.vstack([big[:1], big[1:] - big[:-1]])
    raw = b"".join((b"\0" if row == 0 else b"\2") + up[row].tobytes() for row in range(h))
    chunks = [png_chunk(b"IHDR", struct.pack(">IIBBBBB", w, h, bits, 0, 0, 0, 0))]
    if exif is not None:
        chunks.append(png_chunk(b"eXIf", exif))
    chunks += [png_chunk(b"IDAT", zlib.compress(raw, 9)), png_chunk(b"IEND", b"")]
    with open(path, "wb") as f:
        f.write(b"\x89PNG\r\n\x1a\n" + b"".join(chunks))


def write_fits(path, counts, date_obs, exptime_s):
    """FITS primary image, BITPIX 16 with BZERO 32768 for unsigned counts (FITS Standard 4.0,
    section 5.3), DATE-OBS the start of the exposure and EXPTIME in seconds."""
    h, w = counts.shape

    def card(key, value, comment=""):
        text = "%-8s= %20s / %s" % (key, value, comment)
        return text[:80].ljust(80)

    cards = [card("SIMPLE", "T"), card("BITPIX", "16"), card("NAXIS", "2"), card("NAXIS1", str(w)),
             card("NAXIS2", str(h)), card("BZERO", "32768"), card("BSCALE", "1"),
             card("DATE-OBS", "'%s'" % date_obs, "start of exposure (UTC)"),
             card("EXPTIME", "%.4f" % exptime_s, "exposure time (s)"),
             "END".ljust(80)]
    header = "".join(cards).encode("ascii")
    header += b" " * (-len(header) % 2880)
    data = (counts.astype(np.int32) - 32768).astype(">i2").tobytes()
    data += b"\0" * (-len(data) % 2880)
    with open(path, "wb") as f:
        f.write(header + data)


def geometry(sep, pa_deg, rp_ratio, r_sun, width, height, rng):
    rot = rng.uniform(0, 2 * np.pi)
    margin = r_sun + 12
    cx = rng.uniform(margin, width - margin) if width > 2 * margin else width / 2
    cy = rng.uniform(margin, height - margin) if height > 2 * margin else height / 2
    # North up, east left on the sky, then the camera's rotation.
    ang = np.radians(pa_deg)
    dx, dy = -np.sin(ang), -np.cos(ang)
    dx, dy = dx * np.cos(rot) - dy * np.sin(rot), dx * np.sin(rot) + dy * np.cos(rot)
    px, py = cx + sep * r_sun * dx, cy + sep * r_sun * dy
    return {"cx": cx, "cy": cy, "r_sun": r_sun, "dark": [(px, py, rp_ratio * r_sun, 1.0)]}, rot


def main():
    os.makedirs(OUT, exist_ok=True)
    rng = np.random.default_rng(20120606)
    sky = Sky()
    truth = []
    # Clean committed images: (file, event, station index, offset h, side px, Sun radius px, blur).
    clean = [
        ("venus2012-a.png", "venus-2012", 0, -1.1, 420, 180.0, 1.2, "exif-offset"),
        ("venus2012-b.fits", "venus-2012", 1, 1.0, 330, 140.0, 1.0, "fits"),
        ("venus2012-c.png", "venus-2012", 3, 0.0, 420, 170.0, 1.5, "exif-no-offset"),
        ("mercury2016-a.png", "mercury-2016", 0, -2.2, 640, 300.0, 1.0, "none"),
        ("mercury2019-a.png", "mercury-2019", 1, 1.0, 580, 270.0, 0.9, "8-bit"),
    ]
    for name, event, si, off_h, side, r_sun, blur, timing in clean:
        station = STATIONS[event][si]
        jd = EVENTS[event][2] + off_h / 24.0
        sep, pa, rp, alt = sky.place(event, station, jd)
        assert alt > 5.0, (name, alt)
        g, rot = geometry(sep, pa, rp, r_sun, side, side, rng)
        counts = render(g, side, side, blur, 0.0, rng)
        path = os.path.join(OUT, name)
        time_utc = iso_utc(jd)
        exptime = 0.002
        if timing == "fits":
            start = iso_utc(jd - exptime / 2 / 86400.0)[:-1]
            write_fits(path, counts, start, exptime)
        elif timing.startswith("exif"):
            # The camera's clock on local zone +08:00 (a) or +06:00 (c); EXIF local time.
            zone_h = 8 if timing == "exif-offset" else 6
            local = iso_utc(jd + zone_h / 24.0)
            stamp = local[:19].replace("-", ":").replace("T", " ")
            exif = exif_tiff(stamp, local[20:23], "+%02d:00" % zone_h if timing == "exif-offset" else None)
            write_png16(path, counts, exif)
        elif timing == "8-bit":
            # 8-bit grey: 5 + 240 x intensity, from the same rendering.
            eight = np.clip(np.round(5.0 + 240.0 * (counts.astype(float) - COUNTS_ZERO) / COUNTS_SCALE), 0, 255)
            write_png(path, eight.astype(np.uint8), 8)
        else:
            write_png16(path, counts)
        truth.append([name, event, station[0], station[1], station[2], station[3], time_utc, "%.9f" % sep,
                      "%.4f" % pa, "%.7f" % rp, side, side, "%.4f" % g["cx"], "%.4f" % g["cy"], "%.4f" % r_sun,
                      "%.3f" % blur, "0", timing])
    refusals(rng)
    with open(os.path.join(OUT, "truth.csv"), "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["file", "event", "station", "latitude", "longitude", "elevation_m", "time_utc",
                    "separation_solar_radii", "position_angle_deg", "planet_radius_solar_radii", "width_px",
                    "height_px", "sun_centre_x_px", "sun_centre_y_px", "sun_radius_px", "blur_sigma_px",
                    "noise_sigma", "time_source"])
        w.writerows(truth)
    noisy_cases(sky, rng)


def refusals(rng):
    """Images the tool must refuse: no Sun, a clipped limb, no planet, two dark discs."""
    side = 200
    noise_only = np.clip(np.round(COUNTS_ZERO + COUNTS_SCALE * (SKY + rng.normal(0, 0.01, (96, 96)))), 0, 65535)
    write_png16(os.path.join(OUT, "refuse-no-sun.png"), noise_only.astype(np.uint16))
    cases = [
        ("refuse-clipped.png", {"cx": 60.0, "cy": 100.0, "r_sun": 80.0, "dark": [(70.0, 90.0, 4.0, 1.0)]}),
        ("refuse-no-planet.png", {"cx": 100.0, "cy": 96.0, "r_sun": 80.0, "dark": []}),
        ("refuse-two-discs.png", {"cx": 100.0, "cy": 98.0, "r_sun": 80.0,
                                  "dark": [(80.0, 90.0, 4.0, 1.0), (125.0, 120.0, 4.0, 0.97)]}),
    ]
    for name, g in cases:
        write_png16(os.path.join(OUT, name), render(g, side, side, 1.0, 0.0, rng))


def noisy_cases(sky, rng):
    """Parameters of 120 noisy images for the Rust test to render (same law, its own seed)."""
    rows = []
    events = list(EVENTS)
    for i in range(120):
        event = events[i % 3]
        station = STATIONS[event][rng.integers(len(STATIONS[event]))]
        off_h = rng.uniform(-2.2, 2.2)
        jd = EVENTS[event][2] + off_h / 24.0
        sep, pa, rp, alt = sky.place(event, station, jd)
        planet = EVENTS[event][0]
        r_sun = rng.uniform(150.0, 220.0) if planet == "venus" else rng.uniform(260.0, 320.0)
        side = int(2 * r_sun + rng.uniform(40, 120))
        g, _ = geometry(sep, pa, rp, r_sun, side, side, rng)
        blur = rng.uniform(0.8, 1.8)
        noise = rng.uniform(0.005, 0.03)
        px, py, rpx, _ = g["dark"][0]
        rows.append([i, event, station[0], iso_utc(jd), "%.9f" % sep, side, side, "%.4f" % g["cx"],
                     "%.4f" % g["cy"], "%.4f" % r_sun, "%.4f" % px, "%.4f" % py, "%.4f" % rpx,
                     "%.3f" % blur, "%.4f" % noise, 1000 + i])
    with open(os.path.join(OUT, "noisy_cases.csv"), "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["case", "event", "station", "time_utc", "separation_solar_radii", "width_px", "height_px",
                    "sun_centre_x_px", "sun_centre_y_px", "sun_radius_px", "planet_x_px", "planet_y_px",
                    "planet_radius_px", "blur_sigma_px", "noise_sigma", "seed"])
        w.writerows(rows)


if __name__ == "__main__":
    main()
