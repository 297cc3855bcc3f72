#!/usr/bin/env bash
# How much of a fresh run is JVM warm-up: the reference job on JDK 17, on JDK 25, and on JDK 25 with
# an ahead-of-time cache (JEP 483 and JEP 515: classes loaded and linked, and method profiles, from a
# training run), alternating, RUNS times, one and two threads; prints the median wall times.
#
#   bash bench/aot.sh [RUNS [ROWS]]        (defaults: 5 runs, the spec's 1,000,000 rows)
#   JDK25=/path/to/jdk-25 bash bench/aot.sh (default: the first /usr/lib/jvm/*25* folder)
#
# The cache is made by one training run of 200,000 rows (java -XX:AOTCacheOutput=FILE -jar ...) and
# used with java -XX:AOTCache=FILE -jar ...; it belongs to that JDK build and that jar, so make it
# again after either changes. Every run writes the full file; outputs are removed and the page
# cache flushed before each run, as in compare.sh.
set -euo pipefail
cd "$(dirname "$0")/.."
RUNS=${1:-5}
ROWS=${2:-1000000}
# shellcheck source=bench/lib.sh
. bench/lib.sh
JDK25=${JDK25:-$(ls -d /usr/lib/jvm/*25* 2>/dev/null | head -1)}
J25="$JDK25/bin/java"
if [ ! -x "$J25" ]; then
  echo "aot.sh: needs a JDK 25 (set JDK25=...)" >&2
  exit 1
fi
if [ ! -f "$JAR" ]; then
  mvn -B -q package -DskipTests -pl cli -am >&2
fi
OUT=$(mktemp -d)
trap 'rm -rf "$OUT"' EXIT
echo "machine: $(nproc) cores; $(java -version 2>&1 | head -1); $("$J25" -version 2>&1 | head -1)" >&2
"$J25" -XX:AOTCacheOutput="$OUT/standin.aot" -jar "$JAR" generate "$SPEC" --rows 200000 --out "$OUT/train" \
  --threads 2 >/dev/null 2>"$OUT/train.log"
echo "cache: $(du -h "$OUT/standin.aot" | cut -f1)" >&2

measure() { # name threads java-and-flags...
  local name=$1 threads=$2
  shift 2
  rm -rf "$OUT/run"
  sync
  /usr/bin/time -f "%e" -o "$OUT/time" "$@" -jar "$JAR" generate "$SPEC" --rows "$ROWS" --out "$OUT/run" \
    --threads "$threads" >/dev/null
  echo "$name-$threads $(cat "$OUT/time")" >>"$OUT/results"
  printf '  %-12s %6.2f s\n' "$name-$threads" "$(cat "$OUT/time")" >&2
}

for i in $(seq "$RUNS"); do
  echo "run $i of $RUNS" >&2
  for t in 1 2; do
    measure jdk17 "$t" java
    measure jdk25 "$t" "$J25"
    measure jdk25-aot "$t" "$J25" -XX:AOTCache="$OUT/standin.aot"
  done
done

echo
echo "$SPEC, $ROWS rows, median wall time (s) of $RUNS alternating runs:"
for n in jdk17 jdk25 jdk25-aot; do
  for t in 1 2; do
    printf '%-14s %6.2f\n' "$n-$t" "$(median "$n-$t" 2)"
  done
done
