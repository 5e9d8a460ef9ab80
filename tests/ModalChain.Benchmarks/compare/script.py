"""The script a practitioner would otherwise write: PyYAML + NumPy/SciPy (OpenBLAS). Benchmark dependency only.

usage: script.py all|lowest|harmonic MODEL.yaml OUT.json
"""
import json
import re
import sys
import time

import numpy as np
import scipy.linalg
import scipy.sparse
import scipy.sparse.linalg
import yaml

SCALE = {"kg": 1.0, "N/m": 1.0, "kN/mm": 1e6, "kN": 1e3, "N": 1.0, "Hz": 1.0, "%": 0.01}


def value(text):
    number, unit = re.match(r"\s*([-+0-9.eE]+)\s*(\S*)", str(text)).groups()
    return float(number) * SCALE.get(unit, 1.0)


def matrices(model, sparse):
    names = list(model["masses"])
    index = {name: i for i, name in enumerate(names)}
    n = len(names)
    rows, cols, vals = [], [], []
    for spring in model["springs"].values():
        a, b = (index.get(x, -1) for x in spring["between"])
        k = value(spring["stiffness"])
        for i, j, v in ((a, a, k), (b, b, k), (a, b, -k), (b, a, -k)):
            if i >= 0 and j >= 0:
                rows.append(i); cols.append(j); vals.append(v)
    k = scipy.sparse.coo_matrix((vals, (rows, cols)), shape=(n, n)).tocsc()
    m = np.array([value(model["masses"][name]["mass"]) for name in names])
    return names, (k if sparse else k.toarray()), m


def main():
    kind, path, out = sys.argv[1:4]
    with open(path, encoding="utf-8") as f:
        model = yaml.load(f, Loader=getattr(yaml, "CSafeLoader", yaml.SafeLoader))
    names, k, m = matrices(model, sparse=(kind == "lowest"))
    started, processor = time.perf_counter(), time.process_time()
    if kind == "lowest":
        lam, phi = scipy.sparse.linalg.eigsh(k, 20, scipy.sparse.diags(m).tocsc(), sigma=-1e-6 * (k.diagonal() / m).max(), which="LM")
        order = np.argsort(lam); lam, phi = lam[order], phi[:, order]
    else:
        lam, phi = scipy.linalg.eigh(k, np.diag(m), driver="gvd")
    eigen = time.perf_counter() - started
    print(f"stage: eigen solve: {eigen:.3f} s (processor {time.process_time() - processor:.3f} s)", file=sys.stderr)
    freqs = np.sqrt(np.maximum(lam, 0)) / (2 * np.pi)
    result = {"frequencies_hz": freqs.tolist()}
    if kind == "harmonic":
        zeta = 0.02
        h = model["harmonic"]["frequencies"]
        f = np.linspace(value(h["from"]), value(h["to"]), int(h["points"]))
        w = 2 * np.pi * f
        at = names.index(model["loads"]["push"]["at"])
        force = value(model["loads"]["push"]["amplitude"])
        outputs = [names.index(o) for o in model["harmonic"]["outputs"]]
        omega = np.sqrt(np.maximum(lam, 0))
        denominator = omega[None, :] ** 2 - w[:, None] ** 2 + 2j * zeta * omega[None, :] * w[:, None]
        response = (phi[outputs, :][None, :, :] * (phi[at, :] * force)[None, None, :] / denominator[:, None, :]).sum(axis=2)
        result["outputs"] = {names[o]: np.abs(response[:, i]).tolist() for i, o in enumerate(outputs)}
    else:
        result["shapes"] = {names[i]: phi[i, :].tolist() for i in range(len(names))}
        gamma = phi.T @ m
        result["effective_mass_kg"] = (gamma ** 2).tolist()
    with open(out, "w", encoding="utf-8") as f:
        json.dump(result, f)


if __name__ == "__main__":
    main()
