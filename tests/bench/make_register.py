#!/usr/bin/env python3
"""Writes a synthetic plant register: N SIFs of varied architectures, with LOPA scenarios.

Usage: make_register.py N OUTPUT.json [--seed S] [--library PATH] [--templates]

Invented data for benchmarks and tests, not for design. The same N and seed give the same file.
Sensors vote 1oo1, 1oo2, 2oo3 or 1oo2D; the logic is a safety PLC component or a vendor figure
from a safety manual; final elements are series channels (solenoid + valve) in 1oo1 or 1oo2, or a
motor trip. About one SIF in ten is in high demand. Every other SIF has a LOPA scenario that
feeds it (causes, enabling conditions, modifiers, layers). With --templates every logic
subsystem is written as a reference to a subsystem template, with its own figures beside it.
"""
import argparse
import json
import os
import random

SENSORS = ["pressure-transmitter-smart", "level-transmitter-radar", "temperature-transmitter-rtd",
           "flow-transmitter-dp"]
VOTES = [("1oo1", 1), ("1oo2", 2), ("2oo3", 3), ("1oo2D", 2)]


def sif_and_components(rng, i):
    tag = "%05d" % i
    high = rng.random() < 0.1
    components = []

    def add(prefix, model, **extra):
        cid = "%s-%s%s" % (prefix, tag, extra.pop("suffix", ""))
        components.append(dict({"id": cid, "model": model}, **extra))
        return cid

    vote, n = rng.choice(VOTES)
    model = rng.choice(SENSORS)
    sensors = [add("TX", model, suffix=chr(ord("A") + k)) for k in range(n)]
    sensing = {"name": "sensing", "role": "sensor", "vote": vote, "channels": sensors}
    if n > 1:
        sensing["beta"] = rng.choice(["2%", "5%", "10%"])
    if rng.random() < 0.3:
        sensing["proof_test_interval"] = rng.choice(["6 mo", "2 yr"])
    if rng.random() < 0.5:
        logic = {"name": "logic", "role": "logic", "vote": "1oo1", "channels": [add("LS", "safety-plc-redundant")]}
    elif high:
        logic = {"name": "logic", "role": "logic", "pfh": "%d FIT" % rng.choice([2, 5, 10]), "hft": 1,
                 "systematic_capability": 3}
    else:
        logic = {"name": "logic", "role": "logic", "pfd_avg": rng.choice([2e-5, 5e-5, 1e-4]), "hft": 1,
                 "systematic_capability": 3}
    kind = rng.random()
    if kind < 0.5:
        final = {"name": "isolation", "role": "final", "vote": "1oo1",
                 "channels": [[add("SOV", "solenoid-valve-3way"), add("XV", "ball-valve-spring-return")]]}
    elif kind < 0.85:
        final = {"name": "isolation", "role": "final", "vote": "1oo2", "beta": "10%",
                 "channels": [[add("SOV", "solenoid-valve-3way", suffix="A"), add("XV", "ball-valve-spring-return", suffix="A")],
                              [add("SOV", "solenoid-valve-3way", suffix="B"), add("XV", "ball-valve-spring-return", suffix="B")]]}
    else:
        final = {"name": "motor trip", "role": "final", "vote": "1oo1",
                 "channels": [[add("IR", "interposing-relay"), add("MC", "motor-contactor")]]}
    if rng.random() < 0.3 and final["name"] == "isolation":
        final["partial_stroke"] = {"interval": "3 mo", "coverage": "60%"}
    sif = {"id": "SIF-" + tag, "title": "Synthetic function %d (invented)" % i,
           "demand_mode": "high" if high else "low",
           "target": {"pfh": "1e-7/h"} if high else rng.choice([{"sil": 1}, {"sil": 2}, {"rrf": 300}]),
           "subsystems": [sensing, logic, final]}
    return sif, components, high


def scenario_for(rng, sif_id, i):
    layers = [{"id": "IPL-1", "title": "alarm and operator response", "kind": "operator_response", "pfd": 0.1,
               "response_time": "10 min", "time_available": "40 min", "devices": ["TI-%05d" % i]},
              {"sif": sif_id}]
    if rng.random() < 0.5:
        layers.append({"id": "IPL-2", "title": "relief valve", "kind": "relief_device", "pfd": 0.01})
    return {"id": "LOPA-%05d" % i, "title": "Synthetic scenario %d (invented)" % i,
            "consequences": [{"category": "safety", "severity": rng.choice([3, 4])}],
            "causes": [{"id": "C1", "title": "control loop failure", "frequency": rng.choice(["0.1/yr", "0.3/yr"]),
                        "devices": ["BPCS-%05d" % i],
                        "enabling": [{"title": "unit in operation", "probability": 0.9}]}],
            "modifiers": [{"title": "person present", "probability": 0.5}],
            "layers": layers}


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("n", type=int)
    ap.add_argument("output")
    ap.add_argument("--seed", type=int, default=20240601)
    here = os.path.dirname(os.path.abspath(__file__))
    ap.add_argument("--library", default=os.path.join(here, "..", "..", "data", "components", "illustrative.json"))
    ap.add_argument("--templates", action="store_true", help="write the logic subsystems through a template")
    args = ap.parse_args()
    rng = random.Random(args.seed)
    components, sifs, scenarios = [], [], []
    for i in range(args.n):
        sif, comps, high = sif_and_components(rng, i)
        components += comps
        sifs.append(sif)
        if not high and i % 2 == 0:
            scenarios.append(scenario_for(rng, sif["id"], i))
    templates = {}
    if args.templates:
        templates = {"logic-plc": {"role": "logic", "vote": "1oo1"},
                     "logic-vendor": {"role": "logic", "hft": 1, "systematic_capability": 3}}
        for sif in sifs:
            logic = sif["subsystems"][1]
            kind = "logic-plc" if "channels" in logic else "logic-vendor"
            own = {k: v for k, v in logic.items() if k not in templates[kind] and k != "role"}
            sif["subsystems"][1] = dict(name=own.pop("name"), template=kind, **own)
    out_dir = os.path.dirname(os.path.abspath(args.output))
    project = {
        "format": "sifter-project/1",
        "title": "Synthetic register of %d SIFs, seed %d (invented data, not for design)" % (args.n, args.seed),
        "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h", "mission_time": "20 yr"},
        "libraries": [os.path.relpath(os.path.abspath(args.library), out_dir)],
        "components": components,
        **({"subsystem_templates": templates} if templates else {}),
        "sifs": sifs,
        "risk_criteria": {"safety": {"3": "1e-4/yr", "4": "1e-5/yr"}},
        "scenarios": scenarios,
    }
    # One line per component, SIF and scenario: readable, and close to a register exported by a tool.
    with open(args.output, "w") as f:
        f.write("{\n")
        keys = list(project)
        for k, key in enumerate(keys):
            value = project[key]
            sep = ",\n" if k + 1 < len(keys) else "\n"
            if isinstance(value, list) and value and isinstance(value[0], dict):
                f.write("  %s: [\n" % json.dumps(key))
                f.write(",\n".join("    " + json.dumps(v) for v in value))
                f.write("\n  ]" + sep)
            else:
                f.write("  %s: %s%s" % (json.dumps(key), json.dumps(value), sep))
        f.write("}\n")


if __name__ == "__main__":
    main()
