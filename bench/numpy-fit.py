"""Reference for the CLI speed benchmark: a plain numpy ellipsoid fit of one magnetometer.

Reads a CSV whose header names time and the three axes (time, compass_a.x, compass_a.y,
compass_a.z), fits the general quadric x'Ax + b'x + c = 1 by linear least squares
(numpy.linalg.lstsq), takes the centre (the hard-iron offset) and the eigen-decomposition of
A (the soft-iron axes), and prints them as JSON. It is what a careful engineer writes in an
afternoon: no outlier rejection, no intervals, no checks. Used by bench/cli-bench.ts only.
"""
import json
import sys

import numpy as np


def main(path: str) -> None:
    data = np.loadtxt(path, delimiter=",", skiprows=1, usecols=(1, 2, 3))
    x, y, z = data[:, 0], data[:, 1], data[:, 2]
    design = np.column_stack([x * x, y * y, z * z, 2 * x * y, 2 * x * z, 2 * y * z, 2 * x, 2 * y, 2 * z])
    v, *_ = np.linalg.lstsq(design, np.ones_like(x), rcond=None)
    a = np.array([[v[0], v[3], v[4]], [v[3], v[1], v[5]], [v[4], v[5], v[2]]])
    centre = -np.linalg.solve(a, v[6:9])
    scale = 1 + centre @ a @ centre
    values, vectors = np.linalg.eigh(a / scale)
    radii = 1 / np.sqrt(values)
    print(json.dumps({"offset": centre.tolist(), "radii": radii.tolist(), "axes": vectors.T.tolist()}))


if __name__ == "__main__":
    main(sys.argv[1])
