#!/usr/bin/env python3
"""The --xlsx workbook read back as a spreadsheet program would read it.

Usage: xlsx_test.py SOURCE_DIR SIFTER_BINARY

With Debian's python3-openpyxl (a general-purpose reader of the format), for every shipped
example and good test project:
  1. the sheets are the ones documented, in order, with the caution on the first one;
  2. each sheet's header row is as documented, with units in brackets, and frozen;
  3. every number equals the one `sifter check --json` writes for the same run (numbers are
     stored as numbers, not text);
  4. no cell holds a formula.
Then a project whose texts look like formulas: they come back as text with a leading
apostrophe, never as formulas; and a failing run leaves no workbook behind.
"""
import json
import pathlib
import subprocess
import sys
import tempfile

try:
    import openpyxl
except ImportError:
    sys.exit("xlsx_test: python3-openpyxl is missing (sh cmake/install-deps.sh tests installs it)")

# The workbook stores a double with the digits libxlsxwriter prints (%.16G); the JSON keeps
# every digit. Relative difference allowed between the two readings of one double.
REL_TOL = 1e-14

SHEETS = ["SIF summary", "Subsystems", "LOPA worksheet", "Components", "Requirement checks"]
SUMMARY_HEADER_ROW = 4  # rows 1-3: the caution, the file and its SHA-256, the project's title
HEADERS = {
    "SIF summary": ["SIF", "title", "demand mode", "PFDavg [-]", "PFH [1/h]", "PFDavg exact [-]", "PFH exact [1/h]",
                    "RRF [-]", "required RRF [-]", "required PFD [-]", "required PFH [1/h]", "SIL required",
                    "SIL probability", "SIL architecture", "SIL systematic", "SIL achieved", "verdict", "limited by",
                    "spurious trips [1/yr]", "scenarios"],
    "Subsystems": ["SIF", "subsystem", "role", "vote", "channels", "PFDavg [-]", "PFH [1/h]", "PFDavg exact [-]",
                   "PFH exact [1/h]", "share of the SIF [-]", "lambda_DU of a channel [1/h]",
                   "lambda_DD of a channel [1/h]", "lambda_SU of a channel [1/h]", "lambda_SD of a channel [1/h]",
                   "proof-test interval [h]", "beta effective [-]", "beta_D effective [-]", "HFT", "SFF [-]",
                   "SIL architecture", "SC", "spurious trips [1/yr]", "equation"],
    "LOPA worksheet": ["scenario", "consequence", "step", "cause", "item", "title",
                       "value [1/yr for cause and target rows, else -]", "credited",
                       "frequency after the step [1/yr]", "required RRF [-]", "note"],
    "Components": ["component", "library model", "lambda_DU [1/h]", "lambda_DD [1/h]", "lambda_SU [1/h]",
                   "lambda_SD [1/h]", "element type", "SC", "SFF declared [-]", "data confidence [-]"],
    "Requirement checks": ["SIF", "check", "ok", "value", "limit", "message"],
}

failures = []


def fail(where, message):
    failures.append(f"{where}: {message}")


def same_number(where, cell, expected):
    if expected is None:
        if cell is not None:
            fail(where, f"expected an empty cell, found {cell!r}")
        return
    if isinstance(expected, bool) or not isinstance(cell, (int, float)) or isinstance(cell, bool):
        if cell != expected:
            fail(where, f"expected {expected!r}, found {cell!r}")
        return
    if abs(cell - expected) > REL_TOL * max(abs(expected), 1e-300):
        fail(where, f"expected {expected!r}, found {cell!r}")


def run(sifter, project, outdir, extra=()):
    book = outdir / "out.xlsx"
    results = outdir / "out.json"
    for f in (book, results):
        f.unlink(missing_ok=True)
    proc = subprocess.run([sifter, "check", str(project), "--quiet", "--xlsx", str(book), "--json", str(results),
                           *extra], capture_output=True, text=True)
    return proc, book, results


def rows_of(sheet, header_row):
    return [list(r) for r in sheet.iter_rows(min_row=header_row + 1, values_only=True)]


def check_project(sifter, project, outdir):
    name = project.name
    proc, book_path, results_path = run(sifter, project, outdir)
    if proc.returncode not in (0, 1):
        fail(name, f"check exited {proc.returncode}: {proc.stderr.strip()}")
        return
    results = json.loads(results_path.read_text())
    book = openpyxl.load_workbook(book_path)  # formulas kept as formulas: nothing evaluated
    if book.sheetnames != SHEETS:
        fail(name, f"sheets {book.sheetnames}")
        return
    first = book[SHEETS[0]]
    if not str(first["A1"].value).startswith("CAUTION: sifter is a calculation aid"):
        fail(name, f"first sheet's A1 is {first['A1'].value!r}, not the caution")
    for sheet_name, header in HEADERS.items():
        sheet = book[sheet_name]
        row = SUMMARY_HEADER_ROW if sheet_name == SHEETS[0] else 1
        found = [c.value for c in sheet[row]][: len(header)]
        if found != header:
            fail(f"{name} {sheet_name}", f"header row {found}")
        if sheet.freeze_panes != f"A{row + 1}":
            fail(f"{name} {sheet_name}", f"frozen at {sheet.freeze_panes}, expected A{row + 1}")
        widths = [sheet.column_dimensions[openpyxl.utils.get_column_letter(i + 1)].width for i in range(len(header))]
        if not all(w and w > 0 for w in widths):
            fail(f"{name} {sheet_name}", f"column widths not set: {widths}")
        for cells in sheet.iter_rows():
            for cell in cells:
                if cell.data_type == "f" or (isinstance(cell.value, str) and cell.value.startswith("=")):
                    fail(f"{name} {sheet_name}!{cell.coordinate}", f"formula cell {cell.value!r}")

    summary = rows_of(first, SUMMARY_HEADER_ROW)
    if len(summary) != len(results["sifs"]):
        fail(name, f"{len(summary)} summary rows for {len(results['sifs'])} SIFs")
    col = {h: i for i, h in enumerate(HEADERS["SIF summary"])}
    keys = {"PFDavg [-]": "pfd_avg", "PFH [1/h]": "pfh", "PFDavg exact [-]": "pfd_avg_exact",
            "PFH exact [1/h]": "pfh_exact", "RRF [-]": "rrf", "required RRF [-]": "required_rrf",
            "required PFD [-]": "required_pfd", "required PFH [1/h]": "required_pfh", "SIL required": "sil_required",
            "SIL probability": "sil_probability", "SIL architecture": "sil_architecture",
            "SIL systematic": "sil_systematic", "SIL achieved": "sil_achieved",
            "spurious trips [1/yr]": "spurious_trip_rate_per_yr"}
    for row, sif in zip(summary, results["sifs"]):
        if row[col["SIF"]] != sif["id"]:
            fail(name, f"summary row {row[0]!r} for SIF {sif['id']!r}")
        for header, key in keys.items():
            same_number(f"{name} {sif['id']} {header}", row[col[header]], sif[key])

    subs = rows_of(book["Subsystems"], 1)
    expected = [(s["id"], sub) for s in results["sifs"] for sub in s["subsystems"]]
    col = {h: i for i, h in enumerate(HEADERS["Subsystems"])}
    if len(subs) != len(expected):
        fail(name, f"{len(subs)} subsystem rows for {len(expected)} subsystems")
    keys = {"PFDavg [-]": "pfd_avg", "PFH [1/h]": "pfh", "PFDavg exact [-]": "pfd_avg_exact",
            "PFH exact [1/h]": "pfh_exact", "share of the SIF [-]": "share", "beta effective [-]": "beta_effective",
            "beta_D effective [-]": "beta_d_effective", "HFT": "hft", "SFF [-]": "sff",
            "SIL architecture": "sil_architecture", "SC": "systematic_capability",
            "spurious trips [1/yr]": "spurious_trip_rate_per_yr"}
    for row, (sif_id, sub) in zip(subs, expected):
        if (row[col["SIF"]], row[col["subsystem"]]) != (sif_id, sub["name"]):
            fail(name, f"subsystem row {row[:2]} for {sif_id} {sub['name']}")
        for header, key in keys.items():
            same_number(f"{name} {sif_id}/{sub['name']} {header}", row[col[header]], sub[key])

    # The worksheet's frequencies end at each scenario's mitigated frequency, as in the JSON.
    sheet_rows = rows_of(book["LOPA worksheet"], 1)
    col = {h: i for i, h in enumerate(HEADERS["LOPA worksheet"])}
    for sc in results["scenarios"]:
        mine = [r for r in sheet_rows if r[col["scenario"]] == sc["id"]]
        if not mine:
            fail(name, f"no worksheet rows for scenario {sc['id']}")
            continue
        with_sif = [r for r in mine if r[col["step"]] == "with_sif"]
        if sc["mitigated_frequency_per_yr"] is not None and len(with_sif) == 1:
            same_number(f"{name} {sc['id']} with SIF", with_sif[0][col["frequency after the step [1/yr]"]],
                        sc["mitigated_frequency_per_yr"])
        for r in mine:
            for h in ("value [1/yr for cause and target rows, else -]", "frequency after the step [1/yr]",
                      "required RRF [-]"):
                if r[col[h]] is not None and not isinstance(r[col[h]], (int, float)):
                    fail(name, f"{sc['id']} {h} holds text {r[col[h]]!r}, not a number")
    if not results["scenarios"] and sheet_rows:
        fail(name, "worksheet rows without scenarios")

    # The requirement checks, row for row as check --json gives them (value and limit in the unit the
    # check's name ends with).
    checks = rows_of(book["Requirement checks"], 1)
    expected = [(s["id"], c) for s in results["sifs"] for c in s.get("requirement_checks", [])]
    if len(checks) != len(expected):
        fail(name, f"{len(checks)} requirement-check rows for {len(expected)} checks in the JSON")
    col = {h: i for i, h in enumerate(HEADERS["Requirement checks"])}
    for row, (sif_id, c) in zip(checks, expected):
        where = f"{name} {sif_id} {c['check']}"
        if (row[col["SIF"]], row[col["check"]], row[col["message"]]) != (sif_id, c["check"], c["message"]):
            fail(where, f"requirement-check row {row}")
        if row[col["ok"]] is not c["ok"]:
            fail(where, f"ok {row[col['ok']]!r}, JSON {c['ok']!r}")
        same_number(where + " value", row[col["value"]], c["value"])
        same_number(where + " limit", row[col["limit"]], c["limit"])
    return len(expected)


def check_hostile(sifter, source, outdir):
    project = json.loads((source / "examples" / "unit40.json").read_text())
    project["title"] = "=HYPERLINK(\"http://example.invalid\",\"x\")"
    project["sifs"][0]["title"] = "+1+2"
    project["sifs"][1]["title"] = "@SUM(A1:A2)"
    project["sifs"][2]["title"] = "-5"  # a number stays as it is
    # The library is named relative to examples/; the copy lives elsewhere, so name it whole.
    project["libraries"] = [str((source / "examples" / lib).resolve()) for lib in project["libraries"]]
    path = outdir / "hostile.json"
    path.write_text(json.dumps(project))
    proc, book_path, _ = run(sifter, path, outdir)
    if proc.returncode not in (0, 1):
        fail("hostile", f"check exited {proc.returncode}: {proc.stderr.strip()}")
        return
    book = openpyxl.load_workbook(book_path)
    titles = [r[1] for r in rows_of(book[SHEETS[0]], SUMMARY_HEADER_ROW)]
    want = ["'+1+2", "'@SUM(A1:A2)", "-5"]
    if titles != want:
        fail("hostile", f"titles {titles}, expected {want}")
    if book[SHEETS[0]]["A3"].value != "'=HYPERLINK(\"http://example.invalid\",\"x\")":
        fail("hostile", f"project title {book[SHEETS[0]]['A3'].value!r}")


def check_nothing_written_on_bad_input(sifter, source, outdir):
    proc, book_path, _ = run(sifter, source / "tests" / "data" / "bad" / "typo_in_key.json", outdir)
    if proc.returncode != 2 or book_path.exists():
        fail("bad input", f"exit {proc.returncode}, workbook left behind: {book_path.exists()}")


def main():
    source, sifter = pathlib.Path(sys.argv[1]), sys.argv[2]
    projects = sorted((source / "examples").glob("*.json")) + sorted((source / "tests" / "data" / "good").glob("*.json"))
    with tempfile.TemporaryDirectory() as tmp:
        outdir = pathlib.Path(tmp)
        checks = 0
        for project in projects:
            checks += check_project(sifter, project, outdir) or 0
        if checks == 0:  # the examples state requirements: an empty sheet everywhere is a defect
            fail("requirement checks", "no project gave a requirement-check row to compare")
        check_nothing_written_on_bad_input(sifter, source, outdir)
        check_hostile(sifter, source, outdir)
    for f in failures:
        print("FAIL", f)
    print(f"xlsx_test: {len(projects)} projects, {checks} requirement checks compared, {len(failures)} failures")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
