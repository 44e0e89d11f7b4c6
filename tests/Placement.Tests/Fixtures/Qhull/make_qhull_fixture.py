#!/usr/bin/env python3
"""Makes qhull_unit_cube_3000.csv: 3000 uniform random points in the unit cube and, for every point whose
Qhull Voronoi region is bounded and lies inside the cube (so clipping by the cube cannot change it), the cell
volume and face count from Qhull via scipy.spatial.

Run with Debian's Python (python3-scipy): /usr/bin/python3 make_qhull_fixture.py
Volumes: scipy.spatial.ConvexHull of the region's vertices. Faces: ridges (scipy Voronoi.ridge_points) that
contain the point. Qhull options are scipy's defaults for Voronoi ("Qbb Qc Qz").
"""
import sys
import numpy as np
import scipy
from scipy.spatial import Voronoi, ConvexHull

N = 3000
SEED = 20240601

rng = np.random.default_rng(SEED)
pts = rng.random((N, 3))
vor = Voronoi(pts)
faces = np.zeros(N, dtype=int)
for a, b in vor.ridge_points:
    faces[a] += 1
    faces[b] += 1

out = sys.stdout if len(sys.argv) > 1 and sys.argv[1] == "-" else open("qhull_unit_cube_3000.csv", "w")
out.write(f"# made by make_qhull_fixture.py: numpy default_rng({SEED}), N={N}; scipy {scipy.__version__} "
          f"(Qhull via scipy.spatial.Voronoi, options Qbb Qc Qz); interior = bounded region inside [0,1]^3\n")
out.write("index,x,y,z,interior,volume,faces\n")
for i in range(N):
    region = vor.regions[vor.point_region[i]]
    interior = len(region) > 0 and -1 not in region
    volume = float("nan")
    if interior:
        v = vor.vertices[region]
        interior = bool(np.all(v > 0) and np.all(v < 1))
        if interior:
            volume = ConvexHull(v).volume
    x, y, z = pts[i]
    out.write(f"{i},{x!r},{y!r},{z!r},{int(interior)},{volume!r},{faces[i] if interior else -1}\n")
