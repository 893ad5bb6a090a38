#!/bin/sh
# Renders a report in a real browser (Debian's chromium, headless) and checks what it drew:
# a screenshot that is a page (not blank, ink from top to bottom) and an A4 print of a sensible
# number of pages. Exit 77 (ctest SKIP_RETURN_CODE) where chromium is absent outside CI; in CI
# (CI set and not "false" or "0") a missing chromium is a failure.
#
# usage: browser_test.sh SIFTER PROJECT WORKDIR MIN_PAGES MAX_PAGES [report|srs] [RECORDS]
# With RECORDS the report holds the in-service section (as of 2026-06-01), whose tables are
# measured with the summary's.
set -eu
sifter=$1 project=$2 work=$3 min_pages=$4 max_pages=$5 document=${6:-report} records=${7:-}

if ! command -v chromium >/dev/null 2>&1; then
  case "${CI:-}" in
    "" | false | 0)
      echo "browser test SKIPPED: chromium is not installed here (sh cmake/install-deps.sh tests installs it)."
      echo "In CI (CI=true) a missing chromium fails this test."
      exit 77 ;;
    *)
      echo "browser test FAILED: chromium is missing and CI=$CI requires it; sh cmake/install-deps.sh tests installs it." >&2
      exit 1 ;;
  esac
fi

here=$(cd "$(dirname "$0")" && pwd)
rm -rf "$work"
mkdir -p "$work"
work=$(cd "$work" && pwd)
if [ -n "$records" ]; then
  "$sifter" "$document" "$project" --records "$records" --as-of 2026-06-01 -o "$work/report.html" || [ $? -eq 1 ]
else
  "$sifter" "$document" "$project" -o "$work/report.html" || [ $? -eq 1 ]  # 1: a SIF falls short, the report is written
fi

# A fresh profile, nothing fetched or synced, no GPU; --no-sandbox because CI runs as root.
render() {
  profile=$(mktemp -d)
  status=0
  timeout 120 chromium --headless --no-sandbox --disable-gpu --disable-quic --no-first-run \
    --disable-background-networking --disable-component-update --disable-sync --hide-scrollbars \
    --user-data-dir="$profile" "$@" "file://$work/report.html" >>"$work/chromium.log" 2>&1 || status=$?
  rm -rf "$profile"
  if [ "$status" -ne 0 ]; then
    echo "browser test FAILED: chromium exited with $status; its log:" >&2
    cat "$work/chromium.log" >&2
    exit 1
  fi
}

# No text of a drawing may leave it (labels measured by the browser's own fonts).
profile=$(mktemp -d)
python3 "$here/svg_text_check.py" timeout 120 chromium --headless --no-sandbox --disable-gpu --no-first-run \
  --disable-background-networking --disable-component-update --disable-sync --user-data-dir="$profile" \
  --virtual-time-budget=5000 -- "$work/report.html" "$work" || { rm -rf "$profile"; exit 1; }
rm -rf "$profile"

if [ -n "$records" ] && ! grep -q 'id="service"' "$work/report.html"; then
  echo "browser test FAILED: the report has no service section, though records were given" >&2
  exit 1
fi

# The summary's and the service section's tables fit their column on screen and in print (the
# report only: the SRS has neither).
if [ "$document" = report ]; then
  profile=$(mktemp -d)
  python3 "$here/table_width_check.py" timeout 120 chromium --headless --no-sandbox --disable-gpu --no-first-run \
    --disable-background-networking --disable-component-update --disable-sync --hide-scrollbars \
    --user-data-dir="$profile" -- "$work/report.html" "$work" '#summary table, #service table' ||
    { rm -rf "$profile"; exit 1; }
  rm -rf "$profile"
fi

render --screenshot="$work/report.png" --window-size=1280,4000
python3 "$here/png_check.py" "$work/report.png" 1280 4000 4000

render --no-pdf-header-footer --print-to-pdf="$work/report.pdf"
python3 - "$work/report.pdf" "$min_pages" "$max_pages" <<'PY'
import re, sys
data = open(sys.argv[1], "rb").read()
pages = len(re.findall(rb"/Type\s*/Page(?![s\w])", data))
low, high = int(sys.argv[2]), int(sys.argv[3])
# A4 is 210 x 297 mm = 595.3 x 841.9 pt; every page box must be A4.
boxes = [tuple(float(v) for v in m) for m in re.findall(rb"/MediaBox\s*\[\s*0\s+0\s+([\d.]+)\s+([\d.]+)\s*\]", data)]
print("%s: %d pages, page boxes %s pt" % (sys.argv[1], pages, sorted(set(boxes))))
if not low <= pages <= high:
    sys.exit("browser test FAILED: the print has %d pages, expected %d to %d" % (pages, low, high))
if not boxes or any(abs(w - 595.3) > 2 or abs(h - 841.9) > 2 for w, h in boxes):
    sys.exit("browser test FAILED: the pages are not A4: %s" % sorted(set(boxes)))
PY
echo "browser test passed"
