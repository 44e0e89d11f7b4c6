#!/usr/bin/python3
"""Writes healpix_ring_centres.csv: HEALPix RING-order pixel-centre unit vectors from healpy.pix2vec.

Run with Debian's python (python3-healpy):  /usr/bin/python3 make_fixture.py > healpix_ring_centres.csv
The header records this script and the healpy/numpy versions, so the fixture says what produced it.
Reference: Gorski et al. 2005, ApJ 622, 759 (the HEALPix paper); healpy is an independent implementation.
"""
import sys

import healpy
import numpy

NSIDES = (1, 2, 3, 4, 7, 8)


def main():
    out = sys.stdout
    out.write("# HEALPix RING pixel centres, produced by healpy.pix2vec(nside, ipix, nest=False)\n")
    out.write(f"# healpy {healpy.__version__}, numpy {numpy.__version__}\n")
    out.write("# script: tests/Placement.Tests/Fixtures/Healpix/make_fixture.py (verbatim below)\n")
    with open(__file__, encoding="utf-8") as f:
        for line in f:
            out.write("#| " + line.rstrip("\n") + "\n")
    out.write("nside,ipix,x,y,z\n")
    for nside in NSIDES:
        npix = healpy.nside2npix(nside)
        x, y, z = healpy.pix2vec(nside, numpy.arange(npix), nest=False)
        for i in range(npix):
            out.write(f"{nside},{i},{x[i]!r},{y[i]!r},{z[i]!r}\n")


if __name__ == "__main__":
    main()
