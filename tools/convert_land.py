#!/usr/bin/env python3
"""Convert Natural Earth 1:110m land outlines (public domain) into the compact text form that
src/data/land_110m.txt holds for the station maps.

Source: Natural Earth (naturalearthdata.com, public domain), as packaged in TopoJSON by the npm
package world-atlas 2.0.2 (file land-110m.json). Fetch it without installing:

    npm pack world-atlas@2 && tar xzf world-atlas-2.0.2.tgz
    python3 tools/convert_land.py package/land-110m.json > src/data/land_110m.txt

Output: one ring per line, "lon,lat lon,lat ..." in degrees rounded to 0.1, consecutive
duplicates dropped; rings of fewer than 4 points dropped.
"""
import json
import sys


def main(path):
    topo = json.load(open(path))
    sx, sy = topo["transform"]["scale"]
    tx, ty = topo["transform"]["translate"]
    arcs = []
    for arc in topo["arcs"]:
        x = y = 0
        pts = []
        for dx, dy in arc:
            x += dx
            y += dy
            pts.append((x * sx + tx, y * sy + ty))
        arcs.append(pts)

    def ring(indices):
        out = []
        for i in indices:
            pts = arcs[i] if i >= 0 else list(reversed(arcs[~i]))
            out.extend(pts if not out else pts[1:])
        return out

    print("# Natural Earth 1:110m land (public domain), via world-atlas 2.0.2; tools/convert_land.py")
    for geom in topo["objects"]["land"]["geometries"]:
        polys = geom["arcs"] if geom["type"] == "MultiPolygon" else [geom["arcs"]]
        for poly in polys:
            for r in poly:
                pts = []
                for lon, lat in ring(r):
                    p = (round(lon, 1), round(lat, 1))
                    if not pts or pts[-1] != p:
                        pts.append(p)
                if len(pts) >= 4:
                    print(" ".join("%g,%g" % p for p in pts))


if __name__ == "__main__":
    main(sys.argv[1])
