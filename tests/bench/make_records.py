#!/usr/bin/env python3
"""Writes synthetic in-service records for a register made by make_register.py: every component in
service since 2019-01-01 and proof tested, passing, on 15 March of each year from 2020 on.

Usage: make_records.py REGISTER.json OUTPUT.json [--years N]

Invented data for benchmarks of `sifter service`, not for design.
"""
import argparse
import json


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("register")
    ap.add_argument("output")
    ap.add_argument("--years", type=int, default=5)
    args = ap.parse_args()
    with open(args.register) as f:
        components = [c["id"] for c in json.load(f)["components"]]
    records = {"format": "sifter-records/1",
               "title": "Synthetic proof-test records (invented data, not for design)",
               "in_service_since": {c: "2019-01-01" for c in components},
               "events": [{"date": "%d-03-15" % (2020 + y), "component": c, "event": "proof_test", "result": "pass"}
                          for y in range(args.years) for c in components]}
    with open(args.output, "w") as f:
        json.dump(records, f)


if __name__ == "__main__":
    main()
