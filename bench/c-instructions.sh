#!/usr/bin/env bash
# Counts machine instructions per classification of the emitted C classifiers with valgrind's
# callgrind and writes bench/results/c-instructions.md. Counts are exact and repeatable whatever
# the machine's load. Needs valgrind and a host C compiler (CC, default gcc).
# Builds bench/target/benchmarks.jar first unless SKIP_BUILD=1. Not part of CI.
set -euo pipefail
cd "$(dirname "$0")/.."

if ! command -v valgrind >/dev/null; then
  echo "valgrind not found (Debian: apt-get install valgrind)" >&2
  exit 2
fi
jar=bench/target/benchmarks.jar
if [[ "${SKIP_BUILD:-0}" != 1 ]]; then
  mvn -B -q -pl bench -am package -DskipTests
fi
mkdir -p bench/results
java -cp "$jar" dev.splitwright.bench.CInstructions --cc "${CC:-gcc}" \
  --work bench/target/c-instructions --out bench/results/c-instructions.md
