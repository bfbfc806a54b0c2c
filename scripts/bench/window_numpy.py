"""numpy version of the Window finder ranking (scripts/bench/window.ts hands it the inputs).

Same maths as src/lib/irradiation/rank.ts, vectorised: A_i = eps_i*c_i*l (Beer-Lambert);
f_S = A_S*g, f_species = (A_S + A_others)*g with g = (1 - 10^-A_tot)/A_tot (IUPAC Glossary of Terms
Used in Photochemistry, 3rd ed., Pure Appl. Chem. 79, 293 (2007)); q_abs = sum over the grid of
q*T*w_trapezoid*f, done for all lamp x wall x solvent combinations as one matrix product; ranking
by q_abs,S descending then selectivity. Prints one JSON line: times and cpu (ms per run), topIndex, topFlux.
"""
import json
import os
import sys
import time

try:
    import numpy as np
except ImportError:
    sys.stderr.write("numpy is not installed for python3\n")
    sys.exit(3)


def rank(eps, conc, q, T, solv, step, path):
    n = eps.shape[1]
    a = eps * (np.asarray(conc) * path)[:, None]
    a_s = a[0]
    a_sp = a.sum(axis=0)
    a_tot = a_sp[None, :] + solv * path                      # S x n
    with np.errstate(divide="ignore", invalid="ignore"):
        g = np.where(a_tot > 1e-12, -np.expm1(-np.log(10.0) * a_tot) / a_tot, np.log(10.0))
    F = np.concatenate([g * a_s, g * a_sp], axis=0)          # 2S x n
    w = np.full(n, step)
    w[0] = w[-1] = 0.5 * step
    lamp_flux = q @ w                                        # L
    P = (q * w)[:, None, :] * T[None, :, :]                  # L x W x n, trapezoid weights folded into q first
    M = P.reshape(-1, n) @ F.T                               # (L*W) x 2S, one BLAS matrix product
    S = solv.shape[0]
    subs = M[:, :S].ravel()                                  # index (l*W + w)*S + s
    spec = M[:, S:].ravel()
    sel = np.divide(subs, spec, out=np.zeros_like(subs), where=spec > 0)
    order = np.lexsort((np.arange(subs.size), -sel, -subs))
    top = order[:10]
    frac = subs[top] / lamp_flux[top // (T.shape[0] * S)]
    return order, subs, frac


def main():
    d = sys.argv[1]
    meta = json.load(open(os.path.join(d, "meta.json")))
    n = meta["n"]
    data = np.fromfile(os.path.join(d, "inputs.f64"), dtype=np.float64).reshape(-1, n)
    k = 0
    eps = data[k:k + meta["species"]]; k += meta["species"]
    q = data[k:k + meta["lamps"]]; k += meta["lamps"]
    T = data[k:k + meta["walls"]]; k += meta["walls"]
    solv = data[k:k + meta["solvents"]]
    args = (eps, meta["conc"], q, T, solv, meta["stepNm"], meta["pathCm"])
    for _ in range(5):
        rank(*args)
    times = []
    cpu = []
    for _ in range(meta["runs"]):
        c0 = time.process_time()
        t0 = time.perf_counter()
        order, subs, _frac = rank(*args)
        times.append((time.perf_counter() - t0) * 1e3)
        cpu.append((time.process_time() - c0) * 1e3)
    print(json.dumps({"times": times, "cpu": cpu, "topIndex": int(order[0]), "topFlux": float(subs[order[0]])}))


if __name__ == "__main__":
    main()
