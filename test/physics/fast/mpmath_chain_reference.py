#!/usr/bin/python3
"""40-digit reference for the structured hsr solver under strong dephasing (test/physics/fast/hsr-structured.test.ts).

A 16-site homogeneous chain (nearest-neighbour coupling -120 cm^-1, equal site energies), trap of rate 1 ps^-1 on
the last site, loss 0.001 ps^-1 on every site, excitation on the first. The excitonic Liouvillian (column
stacking, index of |a><b| is a + N b) is
    L = -i (I (x) Heff - conj(Heff) (x) I) + gamma_phi (sum_m P_m (x) P_m - I),  Heff = H - i/2 diag(K),
built entry by entry in mpmath at 40 digits and solved by LU: X = -L^-1 rho0, Y = -L^-1 X,
eta = k_trap X_tt, tau = k_trap Y_tt / eta. Run: /usr/bin/python3 test/physics/fast/mpmath_chain_reference.py GAMMA
(about a minute per value with Debian's python3-mpmath).
"""
import sys

import mpmath as mp

mp.mp.dps = 40
n = 16
gamma = mp.mpf(sys.argv[1])
c = 2 * mp.pi * mp.mpf("0.0299792458")  # 2 pi c in rad/ps per cm^-1 (exact c)
H = [[(-120 if abs(i - j) == 1 else 0) * c for j in range(n)] for i in range(n)]
K = [mp.mpf("0.001")] * n
K[n - 1] += 1
N = n * n
L = mp.zeros(N, N)
for a in range(n):
    for b in range(n):
        col = a + n * b
        for cc in range(n):
            h = H[a][cc] - (1j * K[a] / 2 if a == cc else 0)  # (Heff X)_ab
            if h != 0:
                L[col, cc + n * b] += -1j * h
            h2 = H[cc][b] + (1j * K[b] / 2 if cc == b else 0)  # (X Heff^H)_ab
            if h2 != 0:
                L[col, a + n * cc] += 1j * h2
        if a != b:
            L[col, col] -= gamma
rho = mp.zeros(N, 1)
rho[0] = 1
X = mp.lu_solve(L, -rho)
Y = mp.lu_solve(L, -X)
t = (n - 1) * (n + 1)
eta = mp.re(X[t])
print(mp.nstr(eta, 20), mp.nstr(mp.re(Y[t]) / eta, 20))
