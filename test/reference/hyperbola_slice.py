#!/usr/bin/env python3
"""Reference values for test/core/locate/hyperbola.test.ts: where the curve |p-A| - |p-B| = d in the horizontal
plane up = h crosses the edges of a square view, for microphones at different heights (a tilted hyperboloid).
Independent of the TypeScript method: scans f along each edge on a fine grid and refines every sign change with
scipy.optimize.brentq. Run: python3 test/reference/hyperbola_slice.py   (numpy + scipy; the tests never run it)."""
import numpy as np
from scipy.optimize import brentq

A = np.array([0.0, 0.0, 0.0])
B = np.array([3.0, 1.0, 4.0])
D_RANGE = 2.0          # c * tau, metres (source nearer B)
HALF = 30.0            # view: -30..30 m east and north


def f(east, north, up):
    p = np.array([east, north, up])
    return np.linalg.norm(p - A) - np.linalg.norm(p - B) - D_RANGE


def crossings(up):
    found = []
    s = np.linspace(-HALF, HALF, 600001)
    edges = [
        ('south', lambda w: (w, -HALF)), ('north', lambda w: (w, HALF)),
        ('west', lambda w: (-HALF, w)), ('east', lambda w: (HALF, w)),
    ]
    for name, at in edges:
        east, north = at(s)
        east = np.broadcast_to(east, s.shape)
        north = np.broadcast_to(north, s.shape)
        values = (np.sqrt((east - A[0])**2 + (north - A[1])**2 + (up - A[2])**2)
                  - np.sqrt((east - B[0])**2 + (north - B[1])**2 + (up - B[2])**2) - D_RANGE)
        for i in np.nonzero(np.sign(values[:-1]) != np.sign(values[1:]))[0]:
            w = brentq(lambda x: f(*at(x), up), s[i], s[i + 1], xtol=1e-14, rtol=1e-15)
            found.append((name, *(float(c) for c in at(w))))
    return found


if __name__ == '__main__':
    for up in (1.0, 10.0):
        print(f'plane up = {up} m')
        for name, east, north in crossings(up):
            print(f'  {name:5s} east {east: .9f}  north {north: .9f}')
