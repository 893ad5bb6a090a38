#!/usr/bin/env python3
"""Prints reports to PDF in a real browser (Debian's chromium, headless) and reads each page back
with poppler's pdfinfo and pdftotext (Debian's poppler-utils).

usage: print_test.py SIFTER SOURCE_DIR WORKDIR

1. A register of 40 SIFs (tests/bench/make_register.py, invented data), given document control,
   printed with `report --compact`: at most 2 A4 pages per SIF, plus an allowance of 4 pages for
   the cover with its contents, the summary tables and the closing notes (common practice for a
   register: the issue asks for "about two pages per SIF at most").
2. Every printed page of that register and of the example report with requirements
   (examples/unit70_requirements.json, printed in full) carries the document number and revision
   in its footer.

Exit 77 (ctest SKIP_RETURN_CODE) where chromium or poppler-utils is absent outside CI; in CI (CI set
and not "false" or "0") a missing tool is a failure.
"""
import json
import os
import pathlib
import re
import shutil
import subprocess
import sys
import tempfile

SIFS = 40
PAGES_PER_SIF = 2
ALLOWANCE = 4  # cover and contents, the summary tables, the closing notes
DOCUMENT = {"number": "REG-TEST-0040", "revision": "C7", "date": "2026-12-01", "prepared_by": "tests",
            "checked_by": "tests", "approved_by": "tests"}


def missing(tool):
    if os.environ.get("CI", "") not in ("", "false", "0"):
        sys.exit("print test FAILED: %s is missing and CI requires it; sh cmake/install-deps.sh tests installs it" % tool)
    print("print test SKIPPED: %s is not installed here (sh cmake/install-deps.sh tests installs it)" % tool)
    sys.exit(77)


def print_pdf(html, pdf):
    profile = tempfile.mkdtemp()
    try:
        proc = subprocess.run(["chromium", "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic",
                               "--no-first-run", "--disable-background-networking", "--disable-component-update",
                               "--disable-sync", "--user-data-dir=" + profile, "--no-pdf-header-footer",
                               "--print-to-pdf=" + str(pdf), "file://" + str(html.resolve())],
                              capture_output=True, text=True, timeout=300)
    finally:
        shutil.rmtree(profile, ignore_errors=True)
    if proc.returncode != 0 or not pdf.exists():
        sys.exit("print test FAILED: chromium exited %d: %s" % (proc.returncode, proc.stderr[-2000:]))


def pages_of(pdf):
    info = subprocess.run(["pdfinfo", str(pdf)], capture_output=True, text=True, check=True).stdout
    return int(re.search(r"^Pages:\s+(\d+)", info, re.M).group(1))


def page_text(pdf, page):
    return subprocess.run(["pdftotext", "-layout", "-f", str(page), "-l", str(page), str(pdf), "-"],
                          capture_output=True, text=True, check=True).stdout


def report(sifter, project, html, *extra):
    proc = subprocess.run([sifter, "report", str(project), "-o", str(html), *extra], capture_output=True, text=True)
    if proc.returncode not in (0, 1):  # 1: a SIF falls short, the report is written
        sys.exit("print test FAILED: sifter report exited %d: %s" % (proc.returncode, proc.stderr))


def footer_on_every_page(pdf, number, revision):
    pages = pages_of(pdf)
    want = "document %s revision %s" % (number, revision)
    bad = [p for p in range(1, pages + 1) if want not in " ".join(page_text(pdf, p).split())]
    print("%s: %d pages, footer \"%s\" missing on %s" % (pdf.name, pages, want, bad or "none"))
    return bad


def main():
    sifter, source, work = sys.argv[1], pathlib.Path(sys.argv[2]), pathlib.Path(sys.argv[3])
    for tool in ("chromium", "pdfinfo", "pdftotext"):
        if not shutil.which(tool):
            missing(tool)
    shutil.rmtree(work, ignore_errors=True)
    work.mkdir(parents=True)
    failures = []

    register = work / "register.json"
    subprocess.run([sys.executable, str(source / "tests" / "bench" / "make_register.py"), str(SIFS), str(register)],
                   check=True)
    project = json.loads(register.read_text())
    project["document"] = DOCUMENT
    register.write_text(json.dumps(project, indent=1))
    html, pdf = work / "register.html", work / "register.pdf"
    report(sifter, register, html, "--compact")
    print_pdf(html, pdf)
    pages = pages_of(pdf)
    limit = PAGES_PER_SIF * SIFS + ALLOWANCE
    print("register of %d SIFs, --compact: %d A4 pages (%.2f per SIF); at most %d allowed" %
          (SIFS, pages, pages / SIFS, limit))
    if pages > limit:
        failures.append("the compact register prints %d pages, more than %d" % (pages, limit))
    if footer_on_every_page(pdf, DOCUMENT["number"], DOCUMENT["revision"]):
        failures.append("the compact register's footer is missing on some pages")

    example = source / "examples" / "unit70_requirements.json"
    document = json.loads(example.read_text())["document"]
    html, pdf = work / "unit70.html", work / "unit70.pdf"
    report(sifter, example, html)
    print_pdf(html, pdf)
    if footer_on_every_page(pdf, document["number"], document["revision"]):
        failures.append("the example report's footer is missing on some pages")

    for f in failures:
        print("FAIL", f)
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
