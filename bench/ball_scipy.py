"""A straightforward scipy implementation of the exact ball DeltaA in the brane, for bench/engine.mjs's ratio.

solve_ivp (DOP853, rtol 1e-12) shoots the profile from the tip z0 in the flat (r, y) arclength with the same
cutoff-free integrand as src/lib/holo/ball-shot.ts (so both compute the same number), brentq finds z0(R).
Prints: microseconds per answer, the answer.  Usage: python3 bench/ball_scipy.py d R zh
"""
import sys
import time

import numpy as np
from scipy.integrate import solve_ivp
from scipy.optimize import brentq
from scipy.special import gamma


def shoot(d, w, z0, rtol=1e-12):
    zm = 1e-4 * z0

    def rhs(s, y):
        r, z, phi, q, K = y
        sn, cs = np.sin(phi), np.cos(phi)
        rho = np.hypot(r, z)
        P = (r * cs + z * q * sn) / rho
        T = (r * q * sn - z * cs) / rho
        return [cs, q * sn, -(d - 2) * sn / r + (1 - d) * q * cs / z, -0.5 * d * w * z ** (d - 1) * sn,
                r ** (d - 2) * z ** (1 - d) * (w * z**d * sn * sn + P * P) / (1 - T)]

    q0 = np.sqrt(1 - w * z0**d)
    c = -q0 / z0
    s0 = 1e-5 * z0
    y0 = [s0, z0 + q0 * c * s0 * s0 / 2, c * s0, q0 - 0.25 * d * w * z0 ** (d - 1) * c * s0 * s0, 0.0]
    ev = lambda s, y: y[1] - zm
    ev.terminal = True
    sol = solve_ivp(rhs, (s0, 1e3 * z0), y0, method='DOP853', rtol=rtol, atol=1e-14 * z0, events=ev)
    r, z, _, _, K = sol.y_events[0][0]
    R = np.hypot(r, z)
    return R, K + R ** (d - 2) * w * zm * zm / 4


def delta_area(d, R, zh):
    w = zh ** (-d)
    z0 = brentq(lambda z0: shoot(d, w, z0)[0] - R, 0.5 * min(R, zh), min(R, zh * (1 - 1e-12)), xtol=1e-15 * R, rtol=1e-15)
    om = 2 * np.pi ** ((d - 1) / 2) / gamma((d - 1) / 2)
    return om * shoot(d, w, z0)[1]


if __name__ == '__main__':
    d, R, zh = int(sys.argv[1]), float(sys.argv[2]), float(sys.argv[3])
    t = time.perf_counter()
    n = 0
    while time.perf_counter() - t < 3 or n < 2:
        v = delta_area(d, R, zh)
        n += 1
    print((time.perf_counter() - t) / n * 1e6, repr(float(v)))
