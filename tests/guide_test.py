#!/usr/bin/env python3
"""The contributor guide's map of the tree is true: every room of src/<folder>/ is named in its
folder's row of DEVELOPERS.md "The path of the data", every room the guide names exists there,
include/ mirrors src/ for the public rooms, and each "Where to start" answer is the file where
that change is made. Run: python3 tests/guide_test.py [REPO]"""
import pathlib, re, sys

repo = pathlib.Path(sys.argv[1] if len(sys.argv) > 1 else pathlib.Path(__file__).resolve().parents[1])
guide = (repo / "DEVELOPERS.md").read_text()
section = guide[guide.index("## The path of the data"):guide.index("### Conventions")]
problems = []

rows = {}
for line in section.splitlines():
    m = re.match(r"\| `([a-z]+)/` \| (.*?) \|", line)
    if m:
        rows[m.group(1)] = set(re.findall(r"`([a-z0-9_]+)`", m.group(2)))
folders = ["model", "input", "graph", "engines", "analysis", "results", "report", "cli"]
for folder in folders:
    if folder not in rows:
        problems.append(f"the guide has no row for {folder}/")
for folder in ["model", "input", "graph", "engines", "analysis"]:
    rooms = {p.stem for p in (repo / "src" / folder).glob("*.[ch]pp")} | {p.stem for p in (repo / "include/sifter" / folder).glob("*.hpp")}
    for room in sorted(rooms - rows.get(folder, set())):
        problems.append(f"src/{folder}/{room} is not named in the guide's row for {folder}/")
    for room in sorted(rows.get(folder, set()) - rooms):
        problems.append(f"the guide names {folder}/{room}, which src/{folder}/ does not hold")
results = {p.stem for p in (repo / "include/sifter/results").glob("*.hpp")}
for room in sorted(results ^ rows.get("results", set())):
    problems.append(f"results/{room}: the guide's row and include/sifter/results/ disagree")
# Results are a leaf: standard library and model only.
for h in (repo / "include/sifter/results").glob("*.hpp"):
    for inc in re.findall(r'#include [<"]([^>"]+)[>"]', h.read_text()):
        if "/" in inc and not inc.startswith(("sifter/model/", "sifter/results/")):
            problems.append(f"{h.relative_to(repo)} includes {inc}: results include only the model")
# Where to start: each answer is a file that holds what the change touches.
answers = dict(re.findall(r"\| (change an equation|add a LOPA rule|add a column to a report table|add a command) \| `([^`]+)`", section))
expect = {
    "change an equation": r"B\.3\.2\.2",               # the Annex B PFDavg forms
    "add a LOPA rule": r"FindingKind::k",              # where findings of the rules are raised
    "add a column to a report table": r"Table [a-z_]+\(",  # the table builders
    "add a command": r"add\(&sifter::cli::add_\w+_command\)",
}
for question, pattern in expect.items():
    path = answers.get(question)
    if not path:
        problems.append(f'"Where to start" does not answer "{question}"')
        continue
    p = repo / path
    if not p.exists():
        problems.append(f'"{question}": {path} does not exist')
    elif not re.search(pattern, p.read_text()):
        problems.append(f'"{question}": {path} does not hold what that change touches ({pattern})')
for p in problems:
    print("guide:", p)
print("guide: ok" if not problems else f"guide: {len(problems)} problem(s)")
sys.exit(1 if problems else 0)
