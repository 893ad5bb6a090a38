#!/usr/bin/env python3
"""The peer of the register benchmark: simplified Annex B equations over a register, in numpy.

Usage: numpy_peer.py REGISTER.json OUTPUT.json

What an engineer would write in an afternoon, to measure sifter against: it reads the register
that make_register.py writes (and the library it names), sums each channel's component rates,
computes each voting group's PFDavg (low demand) or PFH (high demand) with the simplified
equations of IEC 61508-6:2010 Annex B (B.3.2.2 and B.3.3.2, from memory; 1oo2D taken as 1oo2,
no partial stroke, PTC 1) vectorised over all groups, and writes one figure per SIF as JSON.
It is a speed reference only: no validation, no LOPA, no constraints, no exact cross-check.
"""
import json
import os
import re
import sys

import numpy as np

UNITS = {"FIT": 1e-9, "/h": 1.0, "/yr": 1 / 8760.0}
HOURS = {"h": 1.0, "mo": 730.0, "yr": 8760.0}


def rate(text):
    value, unit = re.match(r"\s*([0-9.eE+-]+)\s*(\S+)", text).groups()
    return float(value) * UNITS[unit]


def hours(text):
    value, unit = text.split()
    return float(value) * HOURS[unit]


def main():
    path, out = sys.argv[1], sys.argv[2]
    with open(path) as f:
        project = json.load(f)
    models = {}
    for lib in project.get("libraries", []):
        with open(os.path.join(os.path.dirname(os.path.abspath(path)), lib)) as f:
            for m in json.load(f)["models"]:
                models[m["id"]] = [rate(m.get(k, "0 FIT")) for k in ("lambda_du", "lambda_dd")]
    comp = {c["id"]: models[c["model"]] for c in project["components"]}
    d = project["defaults"]
    t1_default, mttr = hours(d["proof_test_interval"]), hours(d["mttr"])
    rows, owner, fixed = [], [], np.zeros(len(project["sifs"]))
    for s, sif in enumerate(project["sifs"]):
        high = sif["demand_mode"] == "high"
        for g in sif["subsystems"]:
            if "channels" not in g:  # a vendor figure
                fixed[s] += rate(g["pfh"]) if high else g["pfd_avg"]
                continue
            k, n = (int(x) for x in g["vote"][:4].split("oo"))
            ch = g["channels"][0]
            ids = ch if isinstance(ch, list) else [ch]
            du = sum(comp[i][0] for i in ids)
            dd = sum(comp[i][1] for i in ids)
            beta = float(g.get("beta", "0%").rstrip("%")) / 100
            t1 = hours(g["proof_test_interval"]) if "proof_test_interval" in g else t1_default
            rows.append((n - k + 1, du, dd, beta, t1, high, n))
            owner.append(s)
    a = np.array(rows, dtype=float)
    m, du, dd, beta, t1, high, n = (a[:, i] for i in range(7))
    pairs = np.where(n == 3, 6.0, 2.0)  # 1oo2: 2, 2oo3: 6 (Annex B.3.2.2.2 and B.3.2.2.4)
    ld = du + dd
    tce = np.where(ld > 0, du / np.where(ld > 0, ld, 1) * (t1 / 2 + mttr) + dd / np.where(ld > 0, ld, 1) * mttr, 0)
    tge = np.where(ld > 0, du / np.where(ld > 0, ld, 1) * (t1 / 3 + mttr) + dd / np.where(ld > 0, ld, 1) * mttr, 0)
    ind_du, ind_dd = (1 - beta) * du, (1 - 0.5 * beta) * dd  # beta_D taken as beta / 2
    pfd1 = ld * tce
    pfd2 = pairs * ((1 - 0.5 * beta) * dd + (1 - beta) * du) ** 2 * tce * tge + 0.5 * beta * dd * mttr + beta * du * (t1 / 2 + mttr)
    pfd = np.where(m == 1, pfd1, pfd2)
    pfh1 = du
    pfh2 = pairs * (ind_dd + ind_du) * ind_du * tce + beta * du
    pfh = np.where(m == 1, pfh1, pfh2)
    figure = np.where(high == 1, pfh, pfd)
    total = fixed + np.bincount(np.array(owner), weights=figure, minlength=len(fixed))
    with open(out, "w") as f:
        json.dump({sif["id"]: float(v) for sif, v in zip(project["sifs"], total)}, f)


if __name__ == "__main__":
    main()
