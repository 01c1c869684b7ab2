#!/usr/bin/python3
"""Time the hsr efficiency / transfer-time solve in Python, as a yardstick for the TS engine.

For each N (default 7 16 32 64 128) a seeded random hsr problem (one trap, uniform loss) is solved
(a) with a dense N^2 x N^2 superoperator built from numpy kron formulas and numpy.linalg.solve
    (two solves: X = -L^-1 rho0 for eta, then L^-2 rho0 for tau), and
(b) with qutip.liouvillian (sites + sink + ground, sparse CSR), its excitonic block factorized
    once by scipy.sparse.linalg.splu (sparse LU) and solved twice.
Methods: numpy-dense-build+solve (kron build and both solves), numpy-dense-solve (both
numpy.linalg.solve calls only), qutip-sparse-build+solve (liouvillian, block, splu, both solves),
qutip-sparse-solve (splu factorization and both solves only).
One JSON object per line on stdout; BLAS information goes to stderr once.
Run: /usr/bin/python3 bench/reference_timing.py [N ...] [--case-json FILE]
"""
import argparse
import ctypes
import json
import os
import statistics
import sys
import time
from pathlib import Path

import numpy as np
import scipy.sparse.linalg as spla

sys.path.insert(0, str(Path(__file__).resolve().parents[1] / "tools" / "reference"))
import qutip  # noqa: E402
from qutip_reference import (CM_TO_RAD_PS, collapse_operators, full_hamiltonian,  # noqa: E402
                             random_hamiltonian, vec_index)

SEED = 20240612
MAX_BYTES = 4 * 2 ** 30      # skip when the dense peak (or predicted LU fill) would reach 4 GiB
MAX_SOLVE_S = 60.0           # skip when one run (build + 2 solves) is predicted to take longer
CASE_KEYS = ["hamiltonian_cm", "trap_sites", "trap_rate_ps", "loss_rate_ps", "dephasing_ps",
             "start_site"]
DENSE_PEAK_COPIES = 3        # kron build holds about three N^2 x N^2 complex arrays at once
TIME_BUDGET_S = 2.0          # repeat until about this much time is spent (3..100 repeats)


def blas_info():
    """Which BLAS numpy loaded (from /proc/self/maps), and OpenBLAS's own report if present."""
    with open("/proc/self/maps") as f:
        libs = sorted({line.split()[-1] for line in f
                       if ("blas" in line or "lapack" in line) and "dist-packages" not in line})
    info = {"loaded": libs, "OPENBLAS_CORETYPE": os.environ.get("OPENBLAS_CORETYPE"),
            "OPENBLAS_NUM_THREADS": os.environ.get("OPENBLAS_NUM_THREADS"), "numpy": np.__version__}
    for lib in libs:
        try:
            handle = ctypes.CDLL(lib)
            handle.openblas_get_config.restype = ctypes.c_char_p
            info["openblas_config"] = handle.openblas_get_config().decode()
            info["openblas_threads"] = handle.openblas_get_num_threads()
            break
        except (OSError, AttributeError):
            continue
    try:
        import threadpoolctl
        info["threadpoolctl"] = threadpoolctl.threadpool_info()
    except ImportError:
        info["threadpoolctl"] = "not installed"
    return info


def random_case(n_sites):
    rng = np.random.default_rng(SEED + n_sites)
    h = random_hamiltonian(rng, n_sites)
    trap = int(rng.integers(n_sites))
    start = int(rng.choice([m for m in range(n_sites) if m != trap]))
    return {"name": f"bench-random-n{n_sites}", "hamiltonian_cm": h, "trap_sites": [trap],
            "trap_rate_ps": float(rng.uniform(0.5, 5.0)), "loss_rate_ps": float(rng.uniform(0.0005, 0.01)),
            "dephasing_ps": float(rng.uniform(0.5, 100.0)), "start_site": start}


def loss_list(case):
    k, n = case["loss_rate_ps"], len(case["hamiltonian_cm"])
    return list(k) if isinstance(k, list) else [k] * n


def numpy_superoperator(case):
    """Excitonic-block Liouvillian, column stacking (index of |a><b| is a + N b):
    L = -i (I (x) Heff - conj(Heff) (x) I) + gamma_phi (sum_m P_m (x) P_m - I),
    Heff = H - i/2 diag(k_trap at traps + k_loss at every site)."""
    n = len(case["hamiltonian_cm"])
    decay = np.array(loss_list(case), float)
    decay[case["trap_sites"]] += case["trap_rate_ps"]
    heff = np.asarray(case["hamiltonian_cm"], float) * CM_TO_RAD_PS - 0.5j * np.diag(decay)
    eye = np.eye(n)
    lio = -1j * (np.kron(eye, heff) - np.kron(heff.conj(), eye))
    same_site = np.zeros(n * n)
    same_site[[m + n * m for m in range(n)]] = 1.0
    lio[np.diag_indices(n * n)] += case["dephasing_ps"] * (same_site - 1.0)
    return lio


def observables(case, solve):
    """eta and tau from a function that applies L^-1; rho0 on the start site."""
    n = len(case["hamiltonian_cm"])
    rho0 = np.zeros(n * n, complex)
    rho0[case["start_site"] * (n + 1)] = 1.0
    x = -solve(rho0)
    y = -solve(x)
    traps = [t * (n + 1) for t in case["trap_sites"]]
    eta = case["trap_rate_ps"] * x[traps].real.sum()
    return float(eta), float(case["trap_rate_ps"] * y[traps].real.sum() / eta)


def numpy_build_solve(case):
    lio = numpy_superoperator(case)
    return observables(case, lambda b: np.linalg.solve(lio, b))


def qutip_build(case):
    n = len(case["hamiltonian_cm"])
    c_ops = collapse_operators(n, case["trap_sites"], case["trap_rate_ps"], loss_list(case),
                               case["dephasing_ps"])
    lio = qutip.liouvillian(full_hamiltonian(case["hamiltonian_cm"]), c_ops).data
    ex = np.array([vec_index(n + 2, i, j) for j in range(n) for i in range(n)])
    return lio[ex][:, ex].tocsc()


def qutip_build_solve(case):
    lu = spla.splu(qutip_build(case))
    return observables(case, lu.solve)


def timed(fn):
    """Median wall time in ms of fn() and fn's result. A first call estimates the cost; it is
    discarded below 5 s (warm-up) and kept as a sample above. About TIME_BUDGET_S is spent,
    3 to 100 samples (1 when one call takes over 20 s)."""
    t0 = time.perf_counter()
    result = fn()
    single = time.perf_counter() - t0
    times = [single] if single > 5.0 else []
    repeats = 1 if single > 20.0 else int(min(100, max(3, TIME_BUDGET_S / max(single, 1e-6))))
    while len(times) < repeats:
        t0 = time.perf_counter()
        result = fn()
        times.append(time.perf_counter() - t0)
    return 1e3 * statistics.median(times), repeats, result


def predicted(last, n, exponent_time):
    """Scale (N, seconds, bytes) measured at a smaller N: time ~ N^6 (LU of N^2), bytes ~ N^4."""
    if last is None:
        return 0.0, DENSE_PEAK_COPIES * 16.0 * n ** 4
    n0, t0, b0 = last
    return t0 * (n / n0) ** exponent_time, b0 * (n / n0) ** 4


def run_size(case, history):
    n = len(case["hamiltonian_cm"])
    rows = []
    methods = {
        "numpy-dense-build+solve": (numpy_build_solve, None),
        "numpy-dense-solve": (None, "numpy-dense-build+solve"),
        "qutip-sparse-build+solve": (qutip_build_solve, None),
        "qutip-sparse-solve": (None, "qutip-sparse-build+solve"),
    }
    for method, (fn, parent) in methods.items():
        family = parent or method
        est_s, est_bytes = predicted(history.get(family), n, 6)
        skip = None
        if est_bytes >= MAX_BYTES:
            skip = f"memory: predicted peak {est_bytes / 2 ** 30:.1f} GiB >= 4 GiB"
        elif est_s > MAX_SOLVE_S:
            skip = f"time: predicted {est_s:.0f} s per run (build + 2 solves) > {MAX_SOLVE_S:.0f} s"
        if skip:
            rows.append(dict(N=n, method=method, median_ms=None, repeats=0, efficiency=None,
                             transfer_time_ps=None, skipped=skip))
            continue
        if parent is None:
            ms, reps, (eta, tau) = timed(lambda: fn(case))
            if "sparse" in method:
                lu = spla.splu(qutip_build(case))
                nbytes = 20.0 * (lu.L.nnz + lu.U.nnz)       # complex value + int32 index
            else:
                nbytes = DENSE_PEAK_COPIES * 16.0 * n ** 4
            history[method] = (n, ms / 1e3, nbytes)
        else:
            ms, reps, (eta, tau) = time_solve_only(case, parent)
        rows.append(dict(N=n, method=method, median_ms=ms, repeats=reps, efficiency=eta,
                         transfer_time_ps=tau, skipped=None))
    done = [r["efficiency"] for r in rows if r["efficiency"] is not None]
    assert max(done, default=0) - min(done, default=0) < 1e-8, f"methods disagree at N={n}: {done}"
    return rows


def time_solve_only(case, parent):
    if "sparse" in parent:
        mat = qutip_build(case)
        fn = lambda: observables(case, spla.splu(mat).solve)
    else:
        lio = numpy_superoperator(case)
        fn = lambda: observables(case, lambda b: np.linalg.solve(lio, b))
    return timed(fn)


def main(argv):
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("sizes", nargs="*", type=int, default=[7, 16, 32, 64, 128])
    parser.add_argument("--case-json", metavar="FILE", help="one explicit case instead: "
                        "hamiltonian_cm, trap_sites, trap_rate_ps, loss_rate_ps (number or list), "
                        "dephasing_ps, start_site")
    args = parser.parse_args(argv)
    print("# blas: " + json.dumps(blas_info()), file=sys.stderr)
    if args.case_json:
        with open(args.case_json) as f:
            cases = [json.load(f)]
        missing = sorted(set(CASE_KEYS) - set(cases[0]))
        if missing:
            print(f"{args.case_json}: missing key(s) {missing}; a case needs {CASE_KEYS}", file=sys.stderr)
            return 2
    else:
        cases = [random_case(n) for n in sorted(args.sizes) if n >= 2]
    history = {}
    for case in cases:
        for row in run_size(case, history):
            print(json.dumps(row), flush=True)
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
