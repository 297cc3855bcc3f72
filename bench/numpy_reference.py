#!/usr/bin/python3
"""The reference job (bench/mixed-1m.yaml) done "the usual way": numpy + scipy.stats + pandas.

A Gaussian copula as one would script it: standard normal draws from numpy's default generator,
times the transposed Cholesky factor of the latent correlation matrix, Φ by scipy.stats.norm.cdf,
each column by its scipy.stats ``ppf`` (numpy.searchsorted on the cumulative weights for the
categorical column, a threshold for the Bernoulli one), columns rounded to 3 or 4 decimals and
written by pandas ``DataFrame.to_csv``.

The latent matrix: with ``--latent REPORT.json`` it is read from Standin's report of the same job
(``correlation.latent``, in ``correlation.order``), so both tools sample the same copula. Without it
the script computes 2 sin(πρ/6) of the Spearman target (exact for continuous pairs, Kruskal 1958;
an approximation for the Poisson, categorical and Bernoulli columns, which Standin solves
numerically) and, if that is not positive definite, clips its eigenvalues at 1e-8 and rescales the
diagonal to 1 (the usual quick repair). The marginals' parameters are those bench/mixed-1m.yaml
gives, converted from mean/sd with the textbook moment formulas (Johnson, Kotz and Balakrishnan).

Prints one line: ``numpy_reference rows=N seconds=S`` and the phase times; run it under
``/usr/bin/time -v`` for the peak memory (bench/compare.sh does).

Needs the Debian packages python3-numpy python3-scipy python3-pandas (run with /usr/bin/python3).
"""

import argparse
import json
import math
import sys
import time

import numpy as np
import pandas as pd
from scipy import stats

ORDER = ["wind_knots", "fare_eur", "cargo_t", "load_share", "engine_h", "late_boats", "deck", "refunded"]

SPEARMAN = np.array([
    [1.00, 0.20, -0.10, 0.15, 0.05, 0.40, 0.00, 0.10],
    [0.20, 1.00, 0.30, 0.25, 0.00, 0.10, 0.20, 0.05],
    [-0.10, 0.30, 1.00, 0.50, 0.30, 0.00, 0.10, 0.00],
    [0.15, 0.25, 0.50, 1.00, 0.20, 0.05, 0.00, 0.00],
    [0.05, 0.00, 0.30, 0.20, 1.00, 0.10, 0.00, 0.00],
    [0.40, 0.10, 0.00, 0.05, 0.10, 1.00, 0.00, 0.30],
    [0.00, 0.20, 0.10, 0.00, 0.00, 0.00, 1.00, 0.00],
    [0.10, 0.05, 0.00, 0.00, 0.00, 0.30, 0.00, 1.00],
])


def latent_matrix(report_path):
    if report_path:
        with open(report_path, encoding="utf-8") as f:
            corr = json.load(f)["correlation"]
        index = [corr["order"].index(name) for name in ORDER]
        m = np.array(corr["latent"], dtype=float)
        return m[np.ix_(index, index)]
    m = 2.0 * np.sin(math.pi * SPEARMAN / 6.0)
    np.fill_diagonal(m, 1.0)
    w, v = np.linalg.eigh(m)
    if w.min() <= 0:
        m = (v * np.maximum(w, 1e-8)) @ v.T
        d = np.sqrt(np.diag(m))
        m = m / np.outer(d, d)
    return m


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--rows", type=int, default=1_000_000)
    ap.add_argument("--seed", type=int, default=1000001)
    ap.add_argument("--latent", help="Standin's report.json of the same job, for correlation.latent")
    ap.add_argument("--out", default="numpy-reference.csv")
    args = ap.parse_args()
    t0 = time.perf_counter()
    n = args.rows
    latent = latent_matrix(args.latent)
    chol = np.linalg.cholesky(latent)
    rng = np.random.default_rng(args.seed)
    z = rng.standard_normal((n, len(ORDER))) @ chol.T
    u = stats.norm.cdf(z)
    t1 = time.perf_counter()

    s2 = math.log1p((15 / 48) ** 2)
    gamma_shape = (310 / 45) ** 2
    gamma_scale = 45 ** 2 / 310
    beta_common = 0.62 * 0.38 / 0.12 ** 2 - 1
    levels = np.array(["upper", "lower", "cabin", "car"])
    weights = np.array([4, 3, 2, 1], dtype=float)
    cum = np.cumsum(weights) / weights.sum()
    cum[-1] = 1.0
    cols = {
        "wind_knots": 12.5 + 4.0 * z[:, 0],
        "fare_eur": stats.lognorm.ppf(u[:, 1], math.sqrt(s2), scale=math.exp(math.log(48) - s2 / 2)),
        "cargo_t": stats.gamma.ppf(u[:, 2], gamma_shape, scale=gamma_scale),
        "load_share": stats.beta.ppf(u[:, 3], 0.62 * beta_common, 0.38 * beta_common),
        "engine_h": stats.weibull_min.ppf(u[:, 4], 1.8, scale=420),
        "late_boats": stats.poisson.ppf(u[:, 5], 3.2).astype(np.int64),
        "deck": levels[np.searchsorted(cum, u[:, 6])],
        "refunded": u[:, 7] > 1 - 0.07,
    }
    t2 = time.perf_counter()
    df = pd.DataFrame(cols)
    df = df.round({"wind_knots": 3, "fare_eur": 3, "cargo_t": 3, "load_share": 4, "engine_h": 3})
    df.to_csv(args.out, index=False)
    t3 = time.perf_counter()
    print(f"numpy_reference rows={n} seconds={t3 - t0:.3f} (draw {t1 - t0:.3f}, ppf {t2 - t1:.3f}, "
          f"to_csv {t3 - t2:.3f})", file=sys.stderr)


if __name__ == "__main__":
    main()
