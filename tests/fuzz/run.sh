#!/usr/bin/env bash
# Runs the libFuzzer target for a bounded time on the seed corpus; exits non-zero on any finding.
#
# Usage: tests/fuzz/run.sh FUZZ_BINARY [SECONDS] [WORK_DIR]
#   FUZZ_BINARY  build-asan/tests/fuzz/sifter_fuzz_check (configure with -DSIFTER_FUZZ=ON, clang)
#   SECONDS      total fuzzing time, default 60
#   WORK_DIR     where the growing corpus and any crash input go (default: a new temporary folder,
#                kept when something is found). Keep a finding: copy it to tests/fuzz/crashes/,
#                fix the code, and the replay test (FuzzCrashes.*) checks it from then on.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../.." && pwd)"
binary="$1"
seconds="${2:-60}"
work="${3:-$(mktemp -d)}"
mkdir -p "$work/corpus" "$work/findings"
# The seeds: the examples, every test project (good and bad), earlier findings, and the
# shipped component library. Only the first folder (the work corpus) is written to.
# Per input at most 30 s: the seed tests/data/good/one_minute_proof_test.json (a one-minute
# proof test over the mission, a bounded-work case whose release time a unit test holds under
# a second) takes 10-20 s through the whole check path under the sanitizer and coverage
# instrumentation, and a limit of 10 s flagged it as slow in one of two CI runs.
status=0
"$binary" -max_total_time="$seconds" -timeout=30 -report_slow_units=30 -rss_limit_mb=2048 -max_len=16384 -print_final_stats=1 \
  -dict="$here/project.dict" -artifact_prefix="$work/findings/" \
  "$work/corpus" "$root/examples" "$root/tests/data/bad" "$root/tests/data/bad_libraries" \
  "$root/tests/data/good" "$here/crashes" "$root/data/components" >"$work/fuzz.log" 2>&1 || status=$?
grep -E "^(Done|stat::number_of_executed_units|stat::peak_rss_mb)" "$work/fuzz.log" || true
if [ "$status" -ne 0 ] || [ -n "$(ls -A "$work/findings")" ]; then
  echo "fuzz: FINDING (exit $status); input and log in $work" >&2
  grep -E "ERROR|runtime error|escaped|SUMMARY" "$work/fuzz.log" | head -20 >&2 || true
  exit 1
fi
echo "fuzz: no finding in $seconds s ($(ls "$work/corpus" | wc -l) inputs in the corpus)"
[ -n "${3:-}" ] || rm -rf "$work"
