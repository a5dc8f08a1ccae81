#!/usr/bin/env python3
"""Reference civil times: each zone's offset either side of its clock changes, from the IANA
time-zone database as Python's zoneinfo reads it (the system's compiled tzdata; the version is
written into the fixture's first line).

Zones with daylight saving in both hemispheres, one whose saving ended (America/Sao_Paulo,
2019), zones without saving (Asia/Kolkata, Africa/Johannesburg), a quarter-hour offset
(Pacific/Chatham, Asia/Kathmandu). Years: the transits of 2012, 2032, 2039 and 2117 (the last
two follow the zones' current rules, which both databases extend in the same way). Only
instants after 1970 are written: for earlier dates builds of the database differ (the
"backzone" data some distributions compile in).

Run: python3 tests/reference/generate_civil_time.py
Writes tests/reference/civil_time_zoneinfo.csv (zone,utc,civil,offset_s).
"""

import csv
import datetime as dt
import os
from zoneinfo import ZoneInfo

HERE = os.path.dirname(os.path.abspath(__file__))
ZONES = [
    "Europe/Amsterdam", "America/New_York", "Australia/Sydney", "America/Sao_Paulo",
    "Asia/Kolkata", "Africa/Johannesburg", "Pacific/Chatham", "Asia/Kathmandu",
    "America/Santiago",
]
YEARS = [2012, 2032, 2039, 2117]
UTC = dt.timezone.utc


def offset_s(zone, t):
    return int(t.astimezone(zone).utcoffset().total_seconds())


def changes(zone, year):
    """UTC instants (to the second) at which the zone's offset changes in the year."""
    t = dt.datetime(year, 1, 1, tzinfo=UTC)
    end = dt.datetime(year + 1, 1, 1, tzinfo=UTC)
    step = dt.timedelta(hours=1)
    while t < end:
        if offset_s(zone, t) != offset_s(zone, t + step):
            lo, hi = t, t + step
            while (hi - lo).total_seconds() > 1:
                mid = lo + (hi - lo) / 2
                mid = mid.replace(microsecond=0)
                if offset_s(zone, mid) == offset_s(zone, lo):
                    lo = mid
                else:
                    hi = mid
            yield hi
        t += step


def civil(zone, t):
    local = t.astimezone(zone)
    off = offset_s(zone, t)
    sign = "-" if off < 0 else "+"
    h, m = divmod(abs(off) // 60, 60)
    return local.strftime("%Y-%m-%dT%H:%M:%S") + f"{sign}{h:02}:{m:02}", off


def main():
    with open("/usr/share/zoneinfo/tzdata.zi") as f:
        version = f.readline().strip().lstrip("# ")
    path = os.path.join(HERE, "civil_time_zoneinfo.csv")
    with open(path, "w", newline="") as f:
        f.write(f"# IANA tz database {version}, read by Python zoneinfo; generate_civil_time.py\n")
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["zone", "utc", "civil", "offset_s"])
        for name in ZONES:
            zone = ZoneInfo(name)
            for year in YEARS:
                instants = [dt.datetime(year, 6, 15, 12, tzinfo=UTC)]
                for c in changes(zone, year):
                    instants += [c - dt.timedelta(seconds=1), c]
                for t in instants:
                    text, off = civil(zone, t)
                    w.writerow([name, t.strftime("%Y-%m-%dT%H:%M:%SZ"), text, off])


if __name__ == "__main__":
    main()
