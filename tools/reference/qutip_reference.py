#!/usr/bin/python3
"""Reference numbers for the lumenfold transport engine, computed with QuTiP and SciPy.

Writes test/reference/qutip-reference.json (or --out PATH), or with --check PATH recomputes
everything and exits non-zero if a number moved. Units and model definitions follow
/work/shared/CONVENTIONS.md: energies cm^-1, time ps, rates ps^-1, indices 0-based.
Run with Debian's interpreter: /usr/bin/python3 tools/reference/qutip_reference.py
"""
import argparse
import json
import math
import platform
import sys

import numpy as np
import qutip
import scipy
import scipy.linalg as sla

CM_TO_RAD_PS = 2 * math.pi * 0.0299792458  # 2*pi*c, rad/ps per cm^-1 (exact c, SI 2019)
KB_CM_PER_K = 0.695034800  # k_B/(hc), CODATA 2018
SEED = 20240611
SEC_CUTOFF = 0.1  # brmesolve's default, passed explicitly
ODE_OPTIONS = dict(atol=1e-12, rtol=1e-10, nsteps=1_000_000)
REL_TOL, REL_FLOOR, TRACE_ABS_TOL = 1e-9, 1e-14, 1e-7
TRACE_KEYS = {"site_populations", "sink_population", "mesolve_efficiency",
              "mesolve_residual_population"}

# Adolphs and Renger, Biophys. J. 91, 2778 (2006), as tabulated (cm^-1, relative to 12210 cm^-1)
# in QuTiP's HEOM FMO example notebook (qutip-notebooks examples/heom/heom-2-fmo-example),
# which cites Ishizaki and Fleming, PNAS 106, 17255 (2009).
FMO_CM = [[200, -87.7, 5.5, -5.9, 6.7, -13.7, -9.9],
          [-87.7, 320, 30.8, 8.2, 0.7, 11.8, 4.3],
          [5.5, 30.8, 0, -53.5, -2.2, -9.6, 6.0],
          [-5.9, 8.2, -53.5, 110, -70.7, -17.0, -63.3],
          [6.7, 0.7, -2.2, -70.7, 270, 81.1, -1.3],
          [-13.7, 11.8, -9.6, -17.0, 81.1, 420, 39.7],
          [-9.9, 4.3, 6.0, -63.3, -1.3, 39.7, 230]]
FMO_CM = [[float(x) for x in row] for row in FMO_CM]
FMO_EIGENVALUES_CM = [-30.01, 81.70, 155.09, 244.80, 259.67, 367.56, 471.20]  # given in the brief
FMO_SOURCE = ("Adolphs & Renger, Biophys. J. 91, 2778 (2006); matrix as tabulated in QuTiP's HEOM "
              "FMO example (qutip-notebooks examples/heom/heom-2-fmo-example), citing Ishizaki & "
              "Fleming, PNAS 106, 17255 (2009); cm^-1 relative to 12210 cm^-1")
FMO_BATH_SOURCE = ("lambda = 35 cm^-1 as in QuTiP's FMO example (which follows Ishizaki & Fleming 2009); "
                   "gamma_c = 106 cm^-1 (1/gamma_c ~ 50 fs) is from memory, not verified; note the "
                   "QuTiP example itself uses gamma = 1/(166 fs) = 31.98 cm^-1")


def auxiliary_energies_cm(h_cm):
    """Sink and ground energies: far below the band and 'span + 1000' apart, so that the smallest
    nonzero level spacing of the full Hamiltonian is the smallest exciton spacing."""
    e = np.linalg.eigvalsh(np.asarray(h_cm, float))
    gap = (e[-1] - e[0]) + 1000.0
    return e[0] - gap, e[0] - 2 * gap


def full_hamiltonian(h_cm):
    """H on sites (0..N-1) + sink (N) + ground (N+1), in rad/ps."""
    n_sites = len(h_cm)
    h = np.zeros((n_sites + 2, n_sites + 2))
    h[:n_sites, :n_sites] = h_cm
    h[n_sites, n_sites], h[n_sites + 1, n_sites + 1] = auxiliary_energies_cm(h_cm)
    return qutip.Qobj(h * CM_TO_RAD_PS)


def ket_bra(dim, i, j):
    return qutip.basis(dim, i) * qutip.basis(dim, j).dag()


def collapse_operators(n_sites, trap_sites, k_trap, k_loss, gamma_phi):
    dim, sink, ground = n_sites + 2, n_sites, n_sites + 1
    losses = k_loss if isinstance(k_loss, list) else [k_loss] * n_sites
    ops = [math.sqrt(k_trap) * ket_bra(dim, sink, t) for t in trap_sites]
    ops += [math.sqrt(losses[m]) * ket_bra(dim, ground, m) for m in range(n_sites) if losses[m] > 0]
    ops += [math.sqrt(gamma_phi) * ket_bra(dim, m, m) for m in range(n_sites) if gamma_phi > 0]
    return ops


def vec_index(dim, i, j):
    """Liouville-space index of |i><j|: QuTiP stacks columns (qutip.mat2vec)."""
    return i + dim * j


def check_vectorization(h, c_ops, lio):
    """L @ vec(rho) must equal vec(-i[H,rho] + sum D[c]rho) with column stacking."""
    dim = h.shape[0]
    rng = np.random.default_rng(1)
    x = rng.normal(size=(dim, dim)) + 1j * rng.normal(size=(dim, dim))
    rho = x @ x.conj().T
    hm = h.full()
    drho = -1j * (hm @ rho - rho @ hm)
    for c in c_ops:
        cm = c.full()
        cdc = cm.conj().T @ cm
        drho += cm @ rho @ cm.conj().T - 0.5 * (cdc @ rho + rho @ cdc)
    got = lio @ rho.reshape(-1, order="F")
    assert np.allclose(got, drho.reshape(-1, order="F"), rtol=0, atol=1e-9 * np.abs(drho).max())


def hsr_system(case):
    n_sites = len(case["hamiltonian_cm"])
    c_ops = collapse_operators(n_sites, case["trap_sites"], case["trap_rate_ps"],
                               case["loss_rate_ps"], case["dephasing_ps"])
    return n_sites, full_hamiltonian(case["hamiltonian_cm"]), c_ops


def hsr_observables(case):
    """eta, loss, tau from two linear solves on the excitonic block of qutip.liouvillian."""
    (n_sites, h, c_ops), traps, k_trap = hsr_system(case), case["trap_sites"], case["trap_rate_ps"]
    dim, sink, ground = n_sites + 2, n_sites, n_sites + 1
    lio = qutip.liouvillian(h, c_ops).full()
    check_vectorization(h, c_ops, lio)
    ex = [vec_index(dim, i, j) for j in range(n_sites) for i in range(n_sites)]
    l_ex = lio[np.ix_(ex, ex)]
    rho0 = np.zeros(len(ex), complex)
    rho0[ex.index(vec_index(dim, case["start_site"], case["start_site"]))] = 1.0
    lu = sla.lu_factor(l_ex)
    x_ex = -sla.lu_solve(lu, rho0)            # X = -L^-1 rho0 = integral of rho
    y_ex = -sla.lu_solve(lu, x_ex)            # L^-2 rho0 = integral of t rho
    x_full, y_full = np.zeros(dim * dim, complex), np.zeros(dim * dim, complex)
    x_full[ex], y_full[ex] = x_ex, y_ex
    eta = (lio @ x_full)[vec_index(dim, sink, sink)].real
    loss = (lio @ x_full)[vec_index(dim, ground, ground)].real
    tau = (lio @ y_full)[vec_index(dim, sink, sink)].real / eta
    diag = lambda v, t: v[ex.index(vec_index(dim, t, t))]
    eta_direct = sum(k_trap * diag(x_ex, t).real for t in traps)
    tau_direct = sum(k_trap * diag(y_ex, t).real for t in traps) / eta
    assert abs(eta - eta_direct) <= 1e-12, (case["name"], eta, eta_direct)
    assert abs(tau - tau_direct) <= 1e-10 * tau, (case["name"], tau, tau_direct)
    assert abs(eta + loss - 1.0) <= 1e-10, (case["name"], eta + loss)
    slowest = float(np.min(-np.linalg.eigvals(l_ex).real))
    return {"efficiency": float(eta), "loss_fraction": float(loss),
            "transfer_time_ps": float(tau)}, slowest


def mesolve_efficiency(case, slowest_rate):
    """Time-step with qutip.mesolve until the excitonic population is below 1e-10."""
    n_sites, h, c_ops = hsr_system(case)
    dim, sink = n_sites + 2, n_sites
    rho0 = ket_bra(dim, case["start_site"], case["start_site"])
    excitonic = sum(ket_bra(dim, m, m) for m in range(n_sites))
    t_end = 30.0 / slowest_rate   # exp(-30) ~ 1e-13 of the slowest mode
    out = qutip.mesolve(h, rho0, np.linspace(0.0, t_end, 5), c_ops,
                        [ket_bra(dim, sink, sink), excitonic],
                        options=qutip.Options(**ODE_OPTIONS))
    p_sink, p_left = float(out.expect[0][-1]), float(out.expect[1][-1])
    assert p_left < 1e-10, (case["name"], p_left)
    assert abs(p_sink - case["efficiency"]) < 1e-6, (case["name"], p_sink, case["efficiency"])
    return {"mesolve_efficiency": p_sink, "mesolve_end_time_ps": t_end,
            "mesolve_residual_population": p_left}


def drude_lorentz_spectrum(lam_cm, gamma_cm, temp_k):
    """S(w) = 2 J(w) (n(w)+1), J(w) = 2 lam gamma w/(w^2+gamma^2), w in rad/ps, S in ps^-1."""
    kt = KB_CM_PER_K * temp_k

    def spectrum(w):
        wc = w / CM_TO_RAD_PS
        x = wc / kt
        if abs(x) < 1e-8:
            g = 1.0 + 0.5 * x                 # x/(1-exp(-x)), series; exact kT at w = 0
        elif x < -700.0:
            g = 0.0                           # deep uphill: Boltzmann factor underflows
        else:
            g = x / -math.expm1(-x)           # w (n(w)+1) / kT, finite for both signs
        # J(w)(n(w)+1) = [2 lam gamma / (w^2+gamma^2)] * kT * g
        return CM_TO_RAD_PS * 2.0 * (2.0 * lam_cm * gamma_cm / (wc * wc + gamma_cm ** 2)) * kt * g
    return spectrum


def lindblad_super(c):
    """Column-stacked superoperator of c rho c^+ - 1/2 {c^+ c, rho}."""
    eye, cdc = np.eye(c.shape[0]), c.conj().T @ c
    return np.kron(c.conj(), c) - 0.5 * (np.kron(eye, cdc) + np.kron(cdc.T, eye))


def rebuild_tensor(energies, vecs, a_mats, spectrum, c_mats, dw_min):
    """The secular Bloch-Redfield tensor as we read br_tensor.pyx, in the eigenbasis."""
    n = len(energies)
    w = energies[:, None] - energies[None, :]          # w[i, j] = E_i - E_j
    smat = np.vectorize(spectrum)(w)
    kept = np.abs(w.reshape(n, n, 1, 1) - w.reshape(1, 1, n, n)) < dw_min * SEC_CUTOFF
    r = np.diag(-1j * w.T.reshape(-1))                   # -i (E_a - E_b) at index a + n b
    for a_site in a_mats:
        a = vecs.conj().T @ a_site @ vecs
        t = 0.5 * np.einsum("ac,db,abcd->abcd", a, a, smat.T[:, None, :, None] + smat.T[None, :, None, :])
        g = np.einsum("dk,kb,dk->db", a, a, smat)          # for a == c
        hh = np.einsum("ak,kc,ck->ac", a, a, smat)         # for b == d
        eye = np.eye(n)
        t -= 0.5 * np.einsum("ac,db->abcd", eye, g) + 0.5 * np.einsum("ac,bd->abcd", hh, eye)
        r += np.where(kept, t, 0).transpose(1, 0, 3, 2).reshape(n * n, n * n)
    for c in c_mats:
        r += lindblad_super(vecs.conj().T @ c @ vecs)
    return r, kept, w


def secular_record(case, h, a_ops, c_ops, spectrum):
    """Run the tensor builder brmesolve uses, confirm our reading of its rule, describe it."""
    n_sites = len(case["hamiltonian_cm"])
    tensor, ekets = qutip.bloch_redfield_tensor(h, a_ops, c_ops=c_ops, use_secular=True,
                                                sec_cutoff=SEC_CUTOFF)
    energies = np.linalg.eigvalsh(h.full())
    gaps = np.abs(energies[:, None] - energies[None, :])
    dw_min = float(gaps[gaps != 0].min())
    vecs = np.hstack([k.full() for k in ekets])
    mine, kept, w = rebuild_tensor(energies, vecs, [a.full() for a, _ in a_ops], spectrum,
                                   [c.full() for c in c_ops], dw_min)
    ref = tensor.full()
    assert np.abs(mine - ref).max() <= 1e-9 * np.abs(ref).max(), case["name"]
    ex = [i for i in range(len(energies)) if abs(vecs[:n_sites, i]).sum() > 0.5]  # exciton levels
    assert len(ex) == n_sites and ex == sorted(ex, key=lambda i: energies[i])
    pairs, kept_diffs, dropped_diffs = [], [], []
    for a in range(n_sites):
        for b in range(n_sites):
            for c in range(n_sites):
                for d in range(n_sites):
                    diff = abs(w[ex[a], ex[b]] - w[ex[c], ex[d]]) / CM_TO_RAD_PS
                    if (a, b) == (c, d) or (a == b and c == d):
                        continue
                    if kept[ex[a], ex[b], ex[c], ex[d]]:
                        pairs.append([a, b, c, d])
                        kept_diffs.append(diff)
                    else:
                        dropped_diffs.append(diff)
    rates = [[0.0 if a == b else float(ref[vec_index(len(energies), ex[b], ex[b]),
                                            vec_index(len(energies), ex[a], ex[a])].real)
              for a in range(n_sites)] for b in range(n_sites)]
    check_rates(case, energies[ex], vecs[:n_sites][:, ex], spectrum, rates)
    return ref, vecs, {
        "solver_path": ("qutip.brmesolve -> n_str == 0 branch (time-independent; Python-function "
                        "spectra count as n_func) -> qutip.cy.br_tensor.bloch_redfield_tensor -> "
                        "qutip.bloch_redfield.bloch_redfield_solve (scipy zvode on R in the eigenbasis)"),
        "rule": ("element R[ab,cd] of every a_ops term is computed only if "
                 "|(E_a - E_b) - (E_c - E_d)| < sec_cutoff * dw_min (strict, on eigenvalues in rad/ps), "
                 "where dw_min = min |E_i - E_j| over all ordered pairs of eigenvalues of the FULL "
                 "Hamiltonian passed to brmesolve (sites + sink + ground) with E_i - E_j != 0; "
                 "otherwise the element is 0. c_ops terms are never truncated. Population-population "
                 "elements always survive; coherence ab couples to coherence cd when their Bohr "
                 "frequencies nearly match. Here sink and ground are placed so that dw_min equals the "
                 "smallest nonzero exciton spacing."),
        "source_lines": ("qutip 4.7.1: qutip/cy/br_tensor.pyx line 40 (condition), qutip/cy/brtools.pyx "
                         "lines 549-560 (skew_and_dwmin, called at br_tensor.pyx line 170), qutip/bloch_redfield.py "
                         "lines 180-183 (brmesolve's call); Python-function spectra are classed as "
                         "n_func at qutip/rhs_generate.py lines 253-255"),
        "sec_cutoff": SEC_CUTOFF,
        "dw_min_rad_ps": dw_min, "dw_min_cm": dw_min / CM_TO_RAD_PS,
        "threshold_cm": SEC_CUTOFF * dw_min / CM_TO_RAD_PS,
        "auxiliary_levels_cm": list(auxiliary_energies_cm(case["hamiltonian_cm"])),
        "exciton_energies_cm": [float(energies[i] / CM_TO_RAD_PS) for i in ex],
        "kept_coherence_pairs": pairs,
        "largest_kept_nonzero_difference_cm": max([d for d in kept_diffs if d > 0], default=0.0),
        "smallest_dropped_difference_cm": min(dropped_diffs, default=None),
        "population_rates_ps": rates,
        "population_rates_note": "population_rates_ps[b][a] = R[bb,aa], the rate from exciton a to b",
    }


def check_rates(case, e_ex, c_site_ex, spectrum, rates):
    """CONVENTIONS: k_ba = sum_m |c_ma|^2 |c_mb|^2 S(E_a - E_b); detailed balance."""
    kt = KB_CM_PER_K * case["temperature_k"] * CM_TO_RAD_PS
    p = np.abs(c_site_ex) ** 2
    for a in range(len(e_ex)):
        for b in range(len(e_ex)):
            if a == b:
                continue
            want = float(np.sum(p[:, a] * p[:, b])) * spectrum(e_ex[a] - e_ex[b])
            assert abs(rates[b][a] - want) <= 1e-9 * max(abs(want), 1e-3), (case["name"], a, b)
            if rates[a][b] > 1e-6:
                ratio = rates[b][a] / rates[a][b]
                assert abs(ratio / math.exp((e_ex[a] - e_ex[b]) / kt) - 1) < 1e-9, case["name"]


def propagate(tensor, vecs, start, times):
    """Populations from expm(R t) in the eigenbasis: an ODE-free check of brmesolve's traces."""
    rho = np.outer(vecs[start].conj(), vecs[start])     # V^+ |start><start| V
    vec, pops, step = rho.reshape(-1, order="F"), [], sla.expm(tensor * (times[1] - times[0]))
    for _ in times:
        rho_site = vecs @ vec.reshape(rho.shape, order="F") @ vecs.conj().T
        pops.append(np.real(np.diag(rho_site)))
        vec = step @ vec
    return np.array(pops)


def redfield_run(case):
    n_sites = len(case["hamiltonian_cm"])
    dim, sink = n_sites + 2, n_sites
    h = full_hamiltonian(case["hamiltonian_cm"])
    spectrum = drude_lorentz_spectrum(case["reorganization_cm"], case["cutoff_cm"],
                                      case["temperature_k"])
    a_ops = [[ket_bra(dim, m, m), spectrum] for m in range(n_sites)]
    c_ops = collapse_operators(n_sites, case["trap_sites"], case["trap_rate_ps"],
                               case["loss_rate_ps"], 0.0)
    tensor, vecs, secular = secular_record(case, h, a_ops, c_ops, spectrum)
    times = np.linspace(0.0, 4.0, 41)
    e_ops = [ket_bra(dim, m, m) for m in range(dim)]
    out = qutip.brmesolve(h, ket_bra(dim, case["start_site"], case["start_site"]), times,
                          a_ops=a_ops, e_ops=e_ops, c_ops=c_ops, use_secular=True,
                          sec_cutoff=SEC_CUTOFF,
                          options=qutip.Options(**ODE_OPTIONS))
    pops = np.array([np.real(ex) for ex in out.expect]).T     # [time][level]
    assert np.abs(pops.sum(axis=1) - 1).max() < 1e-8, case["name"]
    assert np.abs(pops - propagate(tensor, vecs, case["start_site"], times)).max() < 1e-8, case["name"]
    return {"secular": secular, "times_ps": times.tolist(),
            "site_populations": pops[:, :n_sites].tolist(), "sink_population": pops[:, sink].tolist()}


def random_hamiltonian(rng, n_sites):
    h = np.diag(rng.uniform(0.0, 400.0, n_sites))
    for i in range(n_sites):
        for j in range(i + 1, n_sites):
            h[i, j] = h[j, i] = rng.uniform(-100.0, 100.0)
    return h.tolist()


def random_layout(rng, n_sites, max_traps):
    traps = sorted(rng.choice(n_sites, size=int(rng.integers(1, max_traps + 1)), replace=False).tolist())
    start = int(rng.choice([m for m in range(n_sites) if m not in traps]))
    return traps, start


def hsr_cases():
    cases = []
    fmo = dict(source=FMO_SOURCE, hamiltonian_cm=FMO_CM, trap_sites=[2], trap_rate_ps=1.0,
               loss_rate_ps=0.001)
    for g in [0.0, 0.1, 1.0, 10.0, 30.0, 100.0, 1000.0, 10000.0]:
        cases.append(dict(fmo, name=f"fmo7-start0-dephasing{g:g}", dephasing_ps=g, start_site=0))
    cases.append(dict(fmo, name="fmo7-start5-dephasing10", dephasing_ps=10.0, start_site=5))
    rng = np.random.default_rng(SEED)
    for k, n_sites in enumerate([3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 4, 6, 8, 5]):
        traps, start = random_layout(rng, n_sites, 2)
        case = dict(name=f"random{k}-n{n_sites}", source=f"seeded random array (numpy default_rng "
                    f"seed {SEED}, hsr case {k})", hamiltonian_cm=random_hamiltonian(rng, n_sites),
                    trap_sites=traps, trap_rate_ps=float(rng.uniform(0.5, 5.0)),
                    loss_rate_ps=float(rng.uniform(0.0005, 0.01)),
                    dephasing_ps=float(rng.uniform(0.5, 100.0)), start_site=start)
        if k == 10:
            case["loss_rate_ps"] = rng.uniform(0.0005, 0.01, n_sites).tolist()
        if k == 11:
            case["dephasing_ps"] = 0.0
        cases.append(case)
    return cases


def redfield_cases():
    fmo = dict(source=FMO_SOURCE + "; bath: " + FMO_BATH_SOURCE, hamiltonian_cm=FMO_CM,
               reorganization_cm=35.0, cutoff_cm=106.0, start_site=0)
    cases = [dict(fmo, name="fmo7-77K", temperature_k=77.0, trap_sites=[2], trap_rate_ps=1.0,
                  loss_rate_ps=0.001),
             dict(fmo, name="fmo7-300K", temperature_k=300.0, trap_sites=[2], trap_rate_ps=1.0,
                  loss_rate_ps=0.001),
             dict(fmo, name="fmo7-300K-closed", temperature_k=300.0, trap_sites=[], trap_rate_ps=0.0,
                  loss_rate_ps=0.0)]
    rng = np.random.default_rng(SEED + 1)
    for k, (n_sites, temp) in enumerate([(3, 300.0), (5, 77.0), (6, 150.0)]):
        traps, start = random_layout(rng, n_sites, 1)
        cases.append(dict(name=f"random{k}-n{n_sites}-{temp:g}K", source=f"seeded random array "
                          f"(numpy default_rng seed {SEED + 1}, redfield case {k})",
                          hamiltonian_cm=random_hamiltonian(rng, n_sites), trap_sites=traps,
                          trap_rate_ps=float(rng.uniform(0.5, 5.0)),
                          loss_rate_ps=float(rng.uniform(0.0005, 0.01)), temperature_k=temp,
                          reorganization_cm=float(rng.uniform(10.0, 100.0)),
                          cutoff_cm=float(rng.uniform(30.0, 200.0)), start_site=start))
    return cases


CONVENTIONS = {
    "units": "energies cm^-1, time ps, rates ps^-1, temperature K; all indices 0-based",
    "constants": {"two_pi_c_rad_per_ps_per_cm": CM_TO_RAD_PS, "kB_over_hc_cm_per_K": KB_CM_PER_K},
    "hilbert_space": "N sites (0..N-1), sink = N, ground = N+1; H in rad/ps = 2*pi*c * H_cm",
    "auxiliary_levels": "sink and ground energies do not enter hsr results; see secular.auxiliary_levels_cm",
    "lindblad": "rate * (A rho A^+ - 1/2 {A^+ A, rho}); trap sqrt(k_trap)|sink><t|, loss sqrt(k_loss_m)"
                "|ground><m| for every site, hsr sqrt(gamma_phi)|m><m| (site coherences decay at gamma_phi)",
    "vectorization": "QuTiP column stacking: Liouville index of |i><j| is i + dim*j",
    "efficiency": "eta = sink-population gain of L_full X, X = -L_ex^-1 rho0 (equals sum_t k_trap X_tt)",
    "transfer_time": "tau = sum_t k_trap [L_ex^-2 rho0]_tt / eta",
    "loss_fraction": "ground-population gain of L_full X; eta + loss = 1",
    "redfield_spectrum": "S(w) = 2 J(w) (n(w)+1), J(w) = 2 lambda gamma_c w/(w^2+gamma_c^2), "
                         "J(-w) = -J(w), S(0) = 4 lambda kT/gamma_c; QuTiP receives 2*pi*c*S(w/(2*pi*c))",
    "redfield_bath": "one independent bath per site through |m><m|; no hsr dephasing in redfield cases",
    "redfield_solver": f"qutip.brmesolve, use_secular=True, sec_cutoff={SEC_CUTOFF}, "
                       f"options atol={ODE_OPTIONS['atol']}, rtol={ODE_OPTIONS['rtol']}",
    "site_populations": "site_populations[time index][site index]",
    "check_tolerance": f"--check: relative {REL_TOL} (+{REL_FLOOR} absolute floor); absolute "
                       f"{TRACE_ABS_TOL} for time-stepped values {sorted(TRACE_KEYS)}",
}


def generate():
    hsr, redfield = [], []
    for case in hsr_cases():
        obs, slowest = hsr_observables(case)
        case.update(obs)
        if case["name"] in ("fmo7-start0-dephasing10", "fmo7-start0-dephasing100", "random3-n6"):
            case.update(mesolve_efficiency(case, slowest))
        hsr.append(case)
    for case in redfield_cases():
        case.update(redfield_run(case))
        redfield.append(case)
    versions = {"qutip": qutip.__version__, "numpy": np.__version__, "scipy": scipy.__version__,
                "python": platform.python_version()}
    return {"generator": "tools/reference/qutip_reference.py", "versions": versions,
            "conventions": CONVENTIONS, "hsr": hsr, "redfield": redfield}


def compare(new, old, path="", trace=False):
    """List of differences beyond tolerance between two JSON trees."""
    if path == "/versions":
        return []
    if isinstance(new, dict) and isinstance(old, dict):
        if set(new) != set(old):
            return [f"{path}: keys differ: {sorted(set(new) ^ set(old))}"]
        return [p for k in new for p in compare(new[k], old[k], f"{path}/{k}", trace or k in TRACE_KEYS)]
    if isinstance(new, list) and isinstance(old, list):
        if len(new) != len(old):
            return [f"{path}: length {len(new)} != {len(old)}"]
        return [p for i, (a, b) in enumerate(zip(new, old)) for p in compare(a, b, f"{path}/{i}", trace)]
    number = (int, float)
    if isinstance(new, number) and isinstance(old, number) and not isinstance(new, bool):
        tol = TRACE_ABS_TOL if trace else REL_TOL * max(abs(new), abs(old)) + REL_FLOOR
        return [] if abs(new - old) <= tol else [f"{path}: now {new!r}, committed {old!r}"]
    return [] if new == old else [f"{path}: now {new!r}, committed {old!r}"]


def summary(data):
    for c in data["hsr"]:
        extra = f"  mesolve {c['mesolve_efficiency']:.10f}" if "mesolve_efficiency" in c else ""
        print(f"hsr {c['name']:28s} eta {c['efficiency']:.10f} tau {c['transfer_time_ps']:10.4f} ps{extra}")
    for c in data["redfield"]:
        s = c["secular"]
        print(f"redfield {c['name']:23s} sink(t={c['times_ps'][-1]:g} ps) {c['sink_population'][-1]:.8f} "
              f"dw_min {s['dw_min_cm']:.4f} cm^-1, extra kept pairs {len(s['kept_coherence_pairs'])}")


def main(argv):
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--out", default="test/reference/qutip-reference.json")
    parser.add_argument("--check", metavar="PATH", help="recompute and compare with PATH")
    args = parser.parse_args(argv)
    for got, want in zip(np.linalg.eigvalsh(np.array(FMO_CM)), FMO_EIGENVALUES_CM):
        assert abs(got - want) < 0.01, (got, want)
    data = generate()
    summary(data)
    if args.check:
        with open(args.check) as f:
            committed = json.load(f)
        problems = compare(json.loads(json.dumps(data)), committed)
        if committed.get("versions") != data["versions"]:
            print(f"note: versions differ: committed {committed.get('versions')}, now {data['versions']}")
        if problems:
            print(f"CHECK FAILED: {len(problems)} value(s) differ from {args.check}:", file=sys.stderr)
            for p in problems[:50]:
                print("  " + p, file=sys.stderr)
            return 1
        print(f"check passed: every value matches {args.check}")
        return 0
    with open(args.out, "w") as f:
        json.dump(data, f, indent=1)
        f.write("\n")
    print(f"wrote {args.out}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
