#!/usr/bin/env python3
"""Reference timing for the Voronoi benchmark: scipy's Qhull route on N uniform random points in the unit cube.

Route: scipy.spatial.Voronoi (Qhull, options "Qbb Qc Qz") then, for every bounded cell, its volume by
scipy.spatial.ConvexHull of the cell's vertices and its face count from the ridges. Also times
scipy.spatial.Delaunay alone, the fastest Qhull step any such route needs.

Usage (Debian's Python with python3-scipy): /usr/bin/python3 bench/qhull_reference.py 100000 [repeats] [delaunay]
(the optional third argument "delaunay" times only the Delaunay step, e.g. at 1e6 where the full route takes minutes)
Prints one line per stage: median wall time over the repeats, and cells per second.
"""
import statistics
import sys
import time

import numpy as np
import scipy
from scipy.spatial import ConvexHull, Delaunay, Voronoi


def voronoi_route(pts):
    vor = Voronoi(pts)
    faces = np.bincount(vor.ridge_points.ravel(), minlength=len(pts))
    volumes = np.full(len(pts), np.nan)
    for i, r in enumerate(vor.point_region):
        region = vor.regions[r]
        if region and -1 not in region:
            volumes[i] = ConvexHull(vor.vertices[region]).volume
    return volumes, faces


def main():
    if len(sys.argv) > 1 and sys.argv[1] in ("-h", "--help"):
        print(__doc__)
        return
    n = int(sys.argv[1]) if len(sys.argv) > 1 else 100_000
    repeats = int(sys.argv[2]) if len(sys.argv) > 2 else 1
    pts = np.random.default_rng(2026).random((n, 3))
    print(f"scipy {scipy.__version__}, numpy {np.__version__}, N = {n}, repeats = {repeats}")
    stages = [("delaunay only", lambda: Delaunay(pts))]
    if not (len(sys.argv) > 3 and sys.argv[3] == "delaunay"):
        stages.append(("voronoi + convex hull volumes + faces", lambda: voronoi_route(pts)))
    for name, fn in stages:
        times = []
        for _ in range(repeats):
            t = time.perf_counter()
            fn()
            times.append(time.perf_counter() - t)
        m = statistics.median(times)
        print(f"{name}: median {m:.2f} s, {n / m:,.0f} cells/s")


if __name__ == "__main__":
    main()
