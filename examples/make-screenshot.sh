#!/bin/sh
# Regenerates examples/report-unit40.png, the picture of the report in README.md: the page of
# SIF-401 as a browser shows it. Run from anywhere, after building (./build/sifter):
#   sh examples/make-screenshot.sh [path/to/sifter]
# Needs chromium and python3 (cmake/install-deps.sh installs both). The date is pinned with
# SOURCE_DATE_EPOCH so that the picture changes only when the report does.
set -eu
root=$(cd "$(dirname "$0")/.." && pwd)
sifter=${1:-$root/build/sifter}
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cd "$root"
SOURCE_DATE_EPOCH=1735689600 "$sifter" report examples/unit40.json -o "$work/unit40.html"
profile=$(mktemp -d "$work/profile.XXXXXX")
# A page is 820 px wide on screen; a tall window holds the cover, the summary and SIF-401.
timeout 120 chromium --headless --no-sandbox --disable-gpu --disable-quic --no-first-run \
  --disable-background-networking --disable-component-update --disable-sync --hide-scrollbars \
  --user-data-dir="$profile" --screenshot="$work/tall.png" --window-size=820,4200 \
  "file://$work/unit40.html" >"$work/chromium.log" 2>&1
# Cut out the top of SIF-401's page, from its heading to the end of its PFD(t) figure. Section
# headings are the only 3 px full-width rules (the kind line has 8 px, box and table rules 2 px);
# the first is the Summary's, the second SIF-401's.
python3 - "$root/tests" "$work/tall.png" "$root/examples/report-unit40.png" <<'PY'
import sys
sys.path.insert(0, sys.argv[1])
import png_check
width, height, channels, rows = png_check.read_png(sys.argv[2])
ink = png_check.ink_per_row(width, channels, rows)
runs, start = [], None
for y, n in enumerate(ink + [0]):
    full = n > 0.8 * width
    if full and start is None:
        start = y
    elif not full and start is not None:
        runs.append((start, y - start))
        start = None
headings = [y for y, length in runs if length == 3]
if len(headings) < 2:
    sys.exit("make-screenshot: found %d section headings, expected at least 2; has the layout changed?" % len(headings))
kPageRows = 1540  # down to the end of the PFD(t) figure
top = max(headings[1] - 24, 0)
page = rows[top:top + kPageRows]
png_check.write_png(sys.argv[3], width, len(page), channels, page)
print("wrote %s (%dx%d, from y = %d)" % (sys.argv[3], width, len(page), top))
PY
