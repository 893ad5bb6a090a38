#!/usr/bin/env python3
"""Times `sifter check` against the numpy peer on generated registers, and prints the ratios.

Usage: register_vs_peer.py [--sifter build/sifter] [--runs 3] [--sizes 10000 100000]
                           [--mc-sifs 2000] [--mc-samples 10000] [--keep DIR] [--templated]

For each size N it writes a register with make_register.py, then runs, RUNS times each:
the numpy peer (numpy_peer.py), `sifter check --quiet --no-exact --json OUT`, and
`sifter check --quiet --json OUT` (the exact cross-check on); then once more per run the Monte
Carlo, `sifter check --quiet --no-exact --samples S --json OUT` on a register of --mc-sifs SIFs
(0 to skip). Every process is measured whole by GNU time (/usr/bin/time -v): wall time,
user + system CPU time and peak resident memory. The table shows the best (smallest) wall time
of the runs, the median wall time, the CPU time of the best run and the largest peak memory.
No assertion on time: a smoke run (tiny sizes, one run) only checks that everything runs.
"""
import argparse
import os
import shutil
import statistics
import subprocess
import sys
import tempfile

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.normpath(os.path.join(HERE, "..", ".."))


def timed(cmd, tmp):
    """Runs cmd under GNU time; returns (wall s, cpu s, peak MB, exit code)."""
    report = os.path.join(tmp, "time.txt")
    code = subprocess.run(["/usr/bin/time", "-v", "-o", report] + cmd, stdout=subprocess.DEVNULL,
                          stderr=subprocess.DEVNULL).returncode
    fields = {}
    with open(report) as f:
        for line in f:
            key, _, value = line.strip().rpartition(": ")
            fields[key] = value
    parts = [float(p) for p in fields["Elapsed (wall clock) time (h:mm:ss or m:ss)"].split(":")]
    wall = 0.0
    for p in parts:
        wall = wall * 60 + p
    cpu = float(fields["User time (seconds)"]) + float(fields["System time (seconds)"])
    return wall, cpu, int(fields["Maximum resident set size (kbytes)"]) / 1024.0, code


def measure(cmd, runs, tmp, accepted=(0, 1)):
    """sifter exits 1 when a SIF falls short, which a register may: accepted. The peer must exit 0
    (a Python without numpy exits 1 at once, which would pass for a fast peer)."""
    results = [timed(cmd, tmp) for _ in range(runs)]
    best = min(results, key=lambda r: r[0])
    failed = [r[3] for r in results if r[3] not in accepted]
    if failed:
        sys.exit("register_vs_peer: %s exited with %d" % (" ".join(cmd), failed[0]))
    return {"best": best[0], "median": statistics.median(r[0] for r in results), "cpu": best[1],
            "rss": max(r[2] for r in results)}


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--sifter", default=os.path.join(ROOT, "build", "sifter"))
    ap.add_argument("--python", default=sys.executable, help="a Python with numpy (Debian: /usr/bin/python3)")
    ap.add_argument("--runs", type=int, default=3)
    ap.add_argument("--sizes", type=int, nargs="+", default=[10000, 100000])
    ap.add_argument("--mc-sifs", type=int, default=2000)
    ap.add_argument("--mc-samples", type=int, default=10000)
    ap.add_argument("--keep", help="keep the registers and outputs in this directory")
    ap.add_argument("--templated", action="store_true",
                    help="also time --no-exact on the same register written through subsystem templates")
    args = ap.parse_args()
    if not os.path.exists("/usr/bin/time"):
        sys.exit("register_vs_peer: needs GNU time (Debian package \"time\")")
    tmp = args.keep or tempfile.mkdtemp()
    os.makedirs(tmp, exist_ok=True)
    try:
        out = os.path.join(tmp, "out.json")
        print("| N SIFs | file | run | best wall [s] | median wall [s] | CPU [s] | peak memory [MB] | memory / file | vs peer |")
        print("|---:|---:|---|---:|---:|---:|---:|---:|---:|")
        for n in args.sizes:
            reg = os.path.join(tmp, "register_%d.json" % n)
            subprocess.run([args.python, os.path.join(HERE, "make_register.py"), str(n), reg], check=True)
            size_mb = os.path.getsize(reg) / 1048576.0
            runs = [("numpy peer (simplified)", [args.python, os.path.join(HERE, "numpy_peer.py"), reg, out]),
                    ("sifter --no-exact --json", [args.sifter, "check", "--quiet", "--no-exact", "--json", out, reg]),
                    ("sifter --json (exact on)", [args.sifter, "check", "--quiet", "--json", out, reg])]
            peer = None
            for name, cmd in runs:
                m = measure(cmd, args.runs, tmp, accepted=(0,) if cmd[0] == args.python else (0, 1))
                peer = peer or m["best"]
                print("| %d | %.1f MB | %s | %.3f | %.3f | %.2f | %.0f | %.1fx | %.2fx |" % (
                    n, size_mb, name, m["best"], m["median"], m["cpu"], m["rss"], m["rss"] / size_mb,
                    m["best"] / peer), flush=True)
            if args.templated:
                tpl = os.path.join(tmp, "register_%d_templates.json" % n)
                subprocess.run([args.python, os.path.join(HERE, "make_register.py"), str(n), tpl, "--templates"],
                               check=True)
                tpl_mb = os.path.getsize(tpl) / 1048576.0
                m = measure([args.sifter, "check", "--quiet", "--no-exact", "--json", out, tpl], args.runs, tmp)
                print("| %d | %.1f MB | sifter --no-exact --json, logic through templates | %.3f | %.3f | %.2f | %.0f "
                      "| %.1fx | %.2fx |" % (n, tpl_mb, m["best"], m["median"], m["cpu"], m["rss"], m["rss"] / tpl_mb,
                                            m["best"] / peer), flush=True)
        if args.mc_sifs > 0:
            reg = os.path.join(tmp, "register_mc_%d.json" % args.mc_sifs)
            subprocess.run([args.python, os.path.join(HERE, "make_register.py"), str(args.mc_sifs), reg], check=True)
            m = measure([args.sifter, "check", "--quiet", "--no-exact", "--samples", str(args.mc_samples), "--json",
                         out, reg], args.runs, tmp)
            print("| %d | %.1f MB | sifter Monte Carlo, %d samples | %.3f | %.3f | %.2f | %.0f | | |" % (
                args.mc_sifs, os.path.getsize(reg) / 1048576.0, args.mc_samples, m["best"], m["median"], m["cpu"],
                m["rss"]))
    finally:
        if not args.keep:
            shutil.rmtree(tmp, ignore_errors=True)


if __name__ == "__main__":
    main()
