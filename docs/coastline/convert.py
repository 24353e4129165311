#!/usr/bin/env python3
"""Converts Natural Earth land (1:110m) from the npm package world-atlas 2.0.2 (land-110m.json, TopoJSON)
into the compact ring file the app ships (src/EventReview.Core/Network/land-110m.txt).

Usage:  npm pack world-atlas@2.0.2 && tar xzf world-atlas-2.0.2.tgz
        python3 docs/coastline/convert.py package/land-110m.json > src/EventReview.Core/Network/land-110m.txt

Output: comment lines start with '#'; every other line is one ring, 'o' (outer boundary of land) or 'h' (a hole:
a lake or inland sea), then space-separated 'lon,lat' pairs in degrees (WGS-84 longitude east, latitude north),
rounded to 0.01 degree; consecutive duplicate points after rounding are dropped. Nothing else is changed.
"""
import json
import sys


def main(path):
    topo = json.load(open(path, encoding="utf-8"))
    sx, sy = topo["transform"]["scale"]
    tx, ty = topo["transform"]["translate"]
    arcs = []
    for arc in topo["arcs"]:
        x = y = 0
        points = []
        for dx, dy in arc:
            x += dx
            y += dy
            points.append((x * sx + tx, y * sy + ty))
        arcs.append(points)

    def ring(indices):
        points = []
        for i in indices:
            a = arcs[i] if i >= 0 else list(reversed(arcs[~i]))
            points.extend(a if not points else a[1:])
        out = []
        for lon, lat in points:
            p = (round(lon, 2), round(lat, 2))
            if not out or out[-1] != p:
                out.append(p)
        return out

    print("# Natural Earth land, 1:110m (public domain), from the npm package world-atlas 2.0.2 (land-110m.json).")
    print("# Converted by docs/coastline/convert.py: one ring per line, o = land outline, h = hole; lon,lat in degrees.")
    for geometry in topo["objects"]["land"]["geometries"]:
        polygons = geometry["arcs"] if geometry["type"] == "MultiPolygon" else [geometry["arcs"]]
        for polygon in polygons:
            for k, r in enumerate(polygon):
                points = ring(r)
                if len(points) >= 3:
                    print(("o " if k == 0 else "h ") + " ".join(f"{lon:g},{lat:g}" for lon, lat in points))


if __name__ == "__main__":
    main(sys.argv[1])
