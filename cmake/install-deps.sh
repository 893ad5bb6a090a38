#!/bin/sh
# Installs what sifter needs on Debian 12 (as root), from Debian's packages only.
# Skips apt entirely when everything is already there.
set -eu
packages="cmake g++ ninja-build pkg-config libboost-dev libboost-graph-dev nlohmann-json3-dev libcli11-dev
libgtest-dev libgmock-dev libbenchmark-dev libeigen3-dev python3 python3-jsonschema python3-icalendar chromium fonts-dejavu-core
clang-14 libclang-rt-14-dev"
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
