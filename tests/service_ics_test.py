#!/usr/bin/env python3
"""The iCalendar file of `sifter service` read by an independent parser.

Usage: service_ics_test.py SIFTER_BINARY PROJECT RECORDS OUTDIR

Writes the example's schedule with --ics, parses it with Debian's python3-icalendar, and checks
the RFC 5545 rules the parser does not enforce: CRLF line ends, lines of at most 75 octets, one
VEVENT per scheduled component with UID, DTSTAMP and an all-day DTSTART.
"""
import json
import pathlib
import subprocess
import sys

try:
    import icalendar
except ImportError:
    sys.exit("service_ics_test: python3-icalendar is missing (sh cmake/install-deps.sh installs it)")

sifter, project, records, outdir = sys.argv[1:5]
out = pathlib.Path(outdir)
out.mkdir(parents=True, exist_ok=True)
ics, js = out / "schedule.ics", out / "service.json"
run = subprocess.run([sifter, "service", project, records, "--as-of", "2025-06-30", "--ics", str(ics),
                      "--json", str(js)], capture_output=True, text=True)
if run.returncode not in (0, 1):
    sys.exit("sifter service failed: " + run.stderr)
raw = ics.read_bytes()
problems = []
if b"\n" in raw.replace(b"\r\n", b""):
    problems.append("a line ends without CR")
for n, line in enumerate(raw.split(b"\r\n"), 1):
    if len(line) > 75:
        problems.append(f"line {n} has {len(line)} octets")
cal = icalendar.Calendar.from_ical(raw)
if str(cal.get("VERSION")) != "2.0" or not cal.get("PRODID"):
    problems.append("VERSION 2.0 and PRODID are required")
events = [c for c in cal.walk() if c.name == "VEVENT"]
schedule = json.loads(js.read_text())["schedule"]
if len(events) != len(schedule):
    problems.append(f"{len(events)} events for {len(schedule)} scheduled components")
uids = set()
for ev, row in zip(sorted(events, key=lambda e: str(e["UID"])), sorted(schedule, key=lambda r: r["component"] + "-" + r["next_due"].replace("-", ""))):
    for key in ("UID", "DTSTAMP", "DTSTART", "SUMMARY"):
        if key not in ev:
            problems.append(f"an event lacks {key}")
    uids.add(str(ev["UID"]))
    start = ev.decoded("DTSTART")
    if start.isoformat() != row["next_due"]:
        problems.append(f"{ev['UID']}: DTSTART {start} but next due {row['next_due']}")
    summary = str(ev["SUMMARY"])
    if row["component"] not in summary or row["overdue"] != summary.startswith("OVERDUE"):
        problems.append(f"summary {summary!r} does not match {row}")
if len(uids) != len(events):
    problems.append("UIDs are not unique")
desc = str(events[0]["DESCRIPTION"])
if "calculation aid" not in desc:
    problems.append("the description lacks the caution")
if problems:
    sys.exit("\n".join(problems))
print(f"{len(events)} events parsed; lines within 75 octets; CRLF throughout")
