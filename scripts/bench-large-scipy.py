#!/usr/bin/env python3
"""Outside reference for docs/performance.md ("Large networks"): a general-purpose numerical
library's sparse eigensolver on the networks `npm run bench` writes to bench-results/networks/.

Run by hand after `npx tsx scripts/bench-large.ts` (the project's tests never need python):

    python3 scripts/bench-large-scipy.py

For RC networks it builds the same reduced nodal G and C as src/lib/solver/large/rc-nodal.ts and
times scipy.sparse.linalg.eigsh in shift-invert mode (ARPACK through SuperLU: the 10 poles
nearest 0), plus the dense "generic route" for a 300-capacitor mesh (QZ on the pencil with
scipy.linalg.eig, and one LU solve per capacitor for the open-circuit time constants). The LC
line goes through the modified nodal pencil and scipy.sparse.linalg.eigs. Prints a table and
writes bench-results/scipy.json.
"""
import json, os, sys, time, glob
import numpy as np
import scipy
import scipy.sparse as sp
import scipy.sparse.linalg as sla
import scipy.linalg as la


def nodal_rc(doc):
    """Reduced nodal G, C (node voltages not fixed by a grounded V source)."""
    held, idx = set(), {}
    for e in doc["elements"]:
        if e["type"] == "V":
            a, b = e["nodes"]
            held.add(b if a in ("gnd", "0") else a)
    for e in doc["elements"]:
        for nd in e["nodes"][:2]:
            if nd not in ("gnd", "0") and nd not in held and nd not in idx:
                idx[nd] = len(idx)
    n = len(idx)
    mats = {"R": ([], [], []), "C": ([], [], [])}
    for e in doc["elements"]:
        if e["type"] not in ("R", "C"):
            continue
        y = 1.0 / e["value"] if e["type"] == "R" else e["value"]
        r, c, v = mats[e["type"]]
        a, b = (idx.get(x, -1) for x in e["nodes"][:2])
        for i, j in ((a, b), (b, a)):
            if i < 0:
                continue
            r.append(i); c.append(i); v.append(y)
            if j >= 0:
                r.append(i); c.append(j); v.append(-y)
    G = sp.csc_matrix((mats["R"][2], (mats["R"][0], mats["R"][1])), shape=(n, n))
    C = sp.csc_matrix((mats["C"][2], (mats["C"][0], mats["C"][1])), shape=(n, n))
    return G, C


def mna(doc):
    """Modified nodal G, C for R, C, L, V (branch currents for V and L)."""
    nodes = {}
    for e in doc["elements"]:
        for nd in e["nodes"][:2]:
            if nd not in ("gnd", "0") and nd not in nodes:
                nodes[nd] = len(nodes)
    size = len(nodes)
    br = {}
    for e in doc["elements"]:
        if e["type"] in ("V", "L"):
            br[e["id"]] = size
            size += 1
    g, c = ([], [], []), ([], [], [])
    def add(m, i, j, v):
        if i >= 0 and j >= 0:
            m[0].append(i); m[1].append(j); m[2].append(v)
    for e in doc["elements"]:
        a, b = (nodes.get(x, -1) for x in e["nodes"][:2])
        t = e["type"]
        if t in ("R", "C"):
            y = 1.0 / e["value"] if t == "R" else e["value"]
            m = g if t == "R" else c
            add(m, a, a, y); add(m, b, b, y); add(m, a, b, -y); add(m, b, a, -y)
        elif t in ("V", "L"):
            k = br[e["id"]]
            add(g, a, k, 1); add(g, b, k, -1); add(g, k, a, 1); add(g, k, b, -1)
            if t == "L":
                add(c, k, k, -e["value"])
    G = sp.csc_matrix((g[2], (g[0], g[1])), shape=(size, size))
    C = sp.csc_matrix((c[2], (c[0], c[1])), shape=(size, size))
    return G, C


def timed(f, reps=3):
    best = None
    out = None
    for _ in range(reps):
        t = time.perf_counter()
        out = f()
        dt = time.perf_counter() - t
        best = dt if best is None else min(best, dt)
    return best * 1000, out


def main():
    rows = []
    for path in sorted(glob.glob("bench-results/networks/*.json")):
        name = os.path.basename(path)[:-5]
        doc = json.load(open(path))
        if name.startswith("lc-line"):
            G, C = mna(doc)
            ms, vals = timed(lambda: sla.eigs(G, k=10, M=C, sigma=0, which="LM", return_eigenvectors=False))
            rows.append({"network": name, "elements": len(doc["elements"]), "what": "10 poles (eigs, shift-invert)", "ms": ms})
        else:
            G, C = nodal_rc(doc)
            ms, vals = timed(lambda: sla.eigsh(G, k=10, M=C, sigma=0, which="LM", return_eigenvectors=False))
            rows.append({"network": name, "elements": len(doc["elements"]), "what": "10 poles (eigsh, shift-invert)", "ms": ms, "slowest": float(-min(vals))})
        print(f"{name:16s} {rows[-1]['elements']:>7d} elements  {rows[-1]['what']:32s} {rows[-1]['ms']:9.1f} ms", flush=True)

    # The dense generic route on a 300-capacitor mesh (the same mesh family as scripts/bench.ts).
    mesh300 = "bench-results/networks/dense-mesh-300.json"
    if os.path.exists(mesh300):
        doc = json.load(open(mesh300))
        G, C = mna(doc)
        Gd, Cd = G.toarray(), C.toarray()
        def route():
            return la.eig(-Gd, Cd, right=False)  # QZ on the pencil: every natural frequency
        # Open-circuit τ: with every capacitor open, one LU of G and one solve per capacitor.
        def taus():
            lu = la.lu_factor(Gd)
            nodes = {}
            for e in doc["elements"]:
                for nd in e["nodes"][:2]:
                    if nd not in ("gnd", "0") and nd not in nodes:
                        nodes[nd] = len(nodes)
            out = []
            for e in doc["elements"]:
                if e["type"] != "C":
                    continue
                p = np.zeros(Gd.shape[0])
                a, b = (nodes.get(x, -1) for x in e["nodes"][:2])
                if a >= 0: p[a] += 1
                if b >= 0: p[b] -= 1
                x = la.lu_solve(lu, p)
                out.append(e["value"] * (p @ x))
            return out
        ms_eig, _ = timed(route)
        ms_tau, _ = timed(taus)
        rows.append({"network": "dense-mesh-300", "elements": len(doc["elements"]), "what": "QZ (all poles) + LU solves (all τ)", "ms": ms_eig + ms_tau})
        print(f"dense-mesh-300   {len(doc['elements']):>7d} elements  QZ + LU solves (generic dense)   {ms_eig + ms_tau:9.1f} ms (QZ {ms_eig:.1f}, τ {ms_tau:.1f})")
    json.dump({"scipy": scipy.__version__, "numpy": np.__version__, "load": os.getloadavg()[0], "rows": rows}, open("bench-results/scipy.json", "w"), indent=2)
    print(f"scipy {scipy.__version__}, numpy {np.__version__}; load average {os.getloadavg()[0]:.1f}")


if __name__ == "__main__":
    main()
