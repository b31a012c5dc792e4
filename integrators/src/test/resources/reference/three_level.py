#!/usr/bin/env python3
"""Reference propagator for the driven three-level ladder used by the integrators tests and benchmarks.

H(t) = diag(0, 1, 2.3) + 0.3 cos(1.1 t) (|0><1| + |1><0|) + 0.2 sin(0.7 t) (|1><2| + |2><1|)
       + 0.15 cos(1.7 t + 0.4) (|0><2| + |2><0|),   t in [0, 6],   hbar = 1,  dU/dt = -i H(t) U, U(0) = I.

The problem is of our own invention (no published source). U(6) is computed column by column with
mpmath.odefun (Taylor-series ODE solver) at 30 significant digits and checked against SciPy's DOP853 at
rtol = atol = 1e-13.  Run: python3 three_level.py > three_level.txt
"""
import mpmath as mp
import numpy as np
from scipy.integrate import solve_ivp

mp.mp.dps = 30
T = mp.mpf(6)


def ham(t):
    c01 = mp.mpf('0.3') * mp.cos(mp.mpf('1.1') * t)
    c12 = mp.mpf('0.2') * mp.sin(mp.mpf('0.7') * t)
    c02 = mp.mpf('0.15') * mp.cos(mp.mpf('1.7') * t + mp.mpf('0.4'))
    return [[mp.mpf(0), c01, c02], [c01, mp.mpf(1), c12], [c02, c12, mp.mpf('2.3')]]


def rhs(t, y):
    h = ham(t)
    return [-1j * sum(h[i][k] * y[k] for k in range(3)) for i in range(3)]


def column(j):
    y0 = [mp.mpc(1 if i == j else 0) for i in range(3)]
    f = mp.odefun(rhs, 0, y0)
    return f(T)


U = [[None] * 3 for _ in range(3)]
for j in range(3):
    col = column(j)
    for i in range(3):
        U[i][j] = col[i]


def ham_np(t):
    return np.array([[complex(x) for x in row] for row in ham(mp.mpf(t))])


def rhs_np(t, y):
    return -1j * ham_np(t) @ y


Unp = np.zeros((3, 3), dtype=complex)
for j in range(3):
    y0 = np.zeros(3, dtype=complex); y0[j] = 1
    sol = solve_ivp(rhs_np, (0, 6), y0, method='DOP853', rtol=1e-13, atol=1e-13)
    Unp[:, j] = sol.y[:, -1]

dev = max(abs(complex(U[i][j]) - Unp[i, j]) for i in range(3) for j in range(3))
print("# three-level ladder, U(6) from mpmath.odefun at 30 digits; row i, column j: re im")
for i in range(3):
    for j in range(3):
        print(i, j, mp.nstr(U[i][j].real, 20), mp.nstr(U[i][j].imag, 20))
print("# max |mpmath - DOP853(rtol 1e-13)| =", "%.2e" % dev)
