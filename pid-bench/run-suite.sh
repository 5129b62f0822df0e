#!/usr/bin/env bash
# The short benchmark suite (about four minutes on two cores): builds the benchmarks jar, runs every
# JMH benchmark with the GC profiler and the loop timing at 1 kHz and 10 kHz, and writes
# pid-bench/results/summary.md and summary.json. Extra arguments go to the suite (--help lists them).
# Run it on a quiet machine: spinning loops and benchmarks share the cores with everything else.
set -euo pipefail
cd "$(dirname "$0")/.."
mvn -B -q -pl pid-bench -am package -DskipTests
java -jar pid-bench/target/pid-bench-benchmarks.jar --output-dir pid-bench/results "$@"
