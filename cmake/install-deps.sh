#!/bin/sh
# Installs what sifter needs on Debian 12 (as root), from Debian's packages only.
# Skips apt entirely when everything is already there.
#   sh cmake/install-deps.sh            what the program needs to build and run
#   sh cmake/install-deps.sh tests      that, and what the test suite and benchmarks need
#   sh cmake/install-deps.sh tests ci   that, and the sanitizer and fuzzing compiler CI uses
set -eu
program="cmake g++ ninja-build pkg-config libboost-dev libboost-graph-dev nlohmann-json3-dev libcli11-dev
libeigen3-dev libxlsxwriter-dev libsimdjson-dev"
tests="libgtest-dev libgmock-dev libbenchmark-dev python3 python3-jsonschema python3-openpyxl chromium
fonts-dejavu-core python3-numpy time python3-icalendar poppler-utils"
ci="clang-14 libclang-rt-14-dev clang-format-14 clang-tidy-14 clang-format clang-tidy"
packages="$program"
for group in "$@"; do
  case "$group" in
    tests) packages="$packages $tests" ;;
    ci) packages="$packages $ci" ;;
    *) echo "install-deps.sh: unknown group '$group' (tests, ci)" >&2; exit 2 ;;
  esac
done
missing=""
for p in $packages; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing="$missing $p"
done
if [ -n "$missing" ]; then
  echo "installing:$missing"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  # shellcheck disable=SC2086
  apt-get install -y -qq --no-install-recommends $missing
fi
