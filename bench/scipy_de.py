#!/usr/bin/python3
"""SciPy's differential evolution on the BBOB functions of the search benchmark (bench/search.js).

Reads a JSON request on stdin:
  {"seeds": [1, 2, ...],
   "problems": [{"fn": "ellipsoid" | "rosenbrock", "dim": 10, "xopt": [...], "budget": 6000,
                 "probe": [[x...], ...]}]}
and prints JSON on stdout:
  {"scipy": "1.10.1", "results": [{"fn", "dim", "budget", "best": [f - f_opt per seed],
                                  "evaluations": [...], "probe": [f at each probe point]}]}

The functions follow Hansen et al. 2009 (INRIA RR-6829), f2 separable ellipsoid with T_osz and f8
Rosenbrock, with the same shift x_opt as the JavaScript side (sent in the request) and f_opt = 0;
the probe values let bench/search.js check that both sides compute the same function.
SciPy settings: the defaults (strategy best1bin, popsize 15, mutation (0.5, 1), recombination 0.7,
updating 'immediate') except polish=False (the L-BFGS-B polish would spend evaluations beyond the
budget) and tol=0 (run the whole budget); maxiter is set so that (maxiter + 1) * popsize * dim
evaluations fit in the budget.
"""
import json
import sys

import numpy as np
import scipy
from scipy.optimize import differential_evolution


def tosz(x):
    xh = np.where(x != 0, np.log(np.abs(x) + (x == 0)), 0.0)
    c1 = np.where(x > 0, 10.0, 5.5)
    c2 = np.where(x > 0, 7.9, 3.1)
    return np.sign(x) * np.exp(xh + 0.049 * (np.sin(c1 * xh) + np.sin(c2 * xh)))


def make(fn, xopt):
    xopt = np.asarray(xopt, dtype=float)
    dim = xopt.size
    if fn == "ellipsoid":
        weights = 10.0 ** (6.0 * np.arange(dim) / (dim - 1))
        return lambda x: float(np.sum(weights * tosz(np.asarray(x) - xopt) ** 2))
    if fn == "rosenbrock":
        c = max(1.0, np.sqrt(dim) / 8.0)

        def rosen(x):
            z = c * (np.asarray(x) - xopt) + 1.0
            return float(np.sum(100.0 * (z[:-1] ** 2 - z[1:]) ** 2 + (z[:-1] - 1.0) ** 2))

        return rosen
    raise SystemExit(f"unknown function {fn}")


def main():
    request = json.load(sys.stdin)
    out = []
    for p in request["problems"]:
        f = make(p["fn"], p["xopt"])
        dim = p["dim"]
        popsize = 15
        maxiter = max(1, p["budget"] // (popsize * dim) - 1)
        best, used = [], []
        for seed in request["seeds"]:
            r = differential_evolution(f, [(-5.0, 5.0)] * dim, maxiter=maxiter, popsize=popsize, tol=0,
                                       polish=False, seed=seed)
            best.append(float(r.fun))
            used.append(int(r.nfev))
        out.append({"fn": p["fn"], "dim": dim, "budget": p["budget"], "best": best, "evaluations": used,
                    "probe": [f(x) for x in p.get("probe", [])]})
    json.dump({"scipy": scipy.__version__, "results": out}, sys.stdout)


if __name__ == "__main__":
    main()
