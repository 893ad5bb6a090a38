#!/usr/bin/env bash
# Whole-process benchmark of `sifter check` on synthetic registers of N SIFs (not part of ctest).
#
# Usage: tests/bench/register_bench.sh [SIFTER_BINARY] [N ...]
#   default binary build/sifter, default N = 1000 10000 100000
# Prints one Markdown table row per N and mode: wall time (best of RUNS) and peak resident memory,
# measured with GNU time (/usr/bin/time -v, Debian package "time"). Environment:
#   RUNS=3 (repeats per point), TIMEOUT=900 (seconds per run), EXACT_FLAGS="" (the exact
#   cross-check on) and SIMPLIFIED_FLAGS="--no-exact".
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
binary="${1:-$root/build/sifter}"
shift || true
sizes=("$@")
[ ${#sizes[@]} -eq 0 ] && sizes=(1000 10000 100000)
runs="${RUNS:-3}"
timeout_s="${TIMEOUT:-900}"
[ -x /usr/bin/time ] || { echo "register_bench: needs GNU time (apt-get install time)" >&2; exit 2; }
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT

measure() {  # measure FILE FLAGS... -> "wall_s rss_mb exit"
  local file="$1"; shift
  local best="" rss="" code=0
  for _ in $(seq "$runs"); do
    code=0
    timeout "$timeout_s" /usr/bin/time -v -o "$work/time.txt" "$binary" check --quiet "$@" --json "$work/out.json" \
      "$file" 2>/dev/null || code=$?
    if [ "$code" -ge 124 ]; then echo "timeout - $code"; return; fi
    local wall mem
    wall=$(awk -F': ' '/Elapsed \(wall clock\)/ {n=split($2,p,":"); s=0; for(i=1;i<=n;i++) s=s*60+p[i]; print s}' "$work/time.txt")
    mem=$(awk -F': ' '/Maximum resident set size/ {printf "%.0f", $2/1024}' "$work/time.txt")
    if [ -z "$best" ] || awk "BEGIN{exit !($wall < $best)}"; then best=$wall; fi
    if [ -z "$rss" ] || [ "$mem" -gt "$rss" ]; then rss=$mem; fi
  done
  echo "$best $rss $code"
}

echo "| N SIFs | file | mode | wall [s] | peak memory [MB] | exit |"
echo "|---:|---:|---|---:|---:|---:|"
for n in "${sizes[@]}"; do
  file="$work/register_$n.json"
  python3 "$here/make_register.py" "$n" "$file"
  size_mb=$(awk "BEGIN{printf \"%.1f\", $(stat -c %s "$file")/1048576}")
  # shellcheck disable=SC2086
  read -r wall rss code < <(measure "$file" ${SIMPLIFIED_FLAGS---no-exact})
  echo "| $n | $size_mb MB | simplified (--no-exact) | $wall | $rss | $code |"
  # shellcheck disable=SC2086
  read -r wall rss code < <(measure "$file" ${EXACT_FLAGS-})
  echo "| $n | $size_mb MB | with the exact cross-check | $wall | $rss | $code |"
done
