#!/usr/bin/env bash
# Side by side, alternating, RUNS times: the reference job (bench/mixed-1m.yaml) by
#   numpy    bench/numpy_reference.py (numpy + scipy.stats ppf + pandas to_csv)
#   standin-1, standin-2   java -jar cli/target/standin.jar generate --threads 1 / 2
#   floor    the same encoder and writer on values drawn once (dev.standin.engine.FormatFloor)
# then the medians of wall time and peak RSS (GNU time) and the ratios. Every run writes the full file.
#
#   bash bench/compare.sh [RUNS [ROWS]]      (defaults: 5 runs, the spec's 1,000,000 rows)
#   BIG_ROWS=50000000 bash bench/compare.sh  also one run of BIG_ROWS rows with -Xmx128m (peak RSS)
#   REBUILD=1 ...                            rebuild the jars first (otherwise only when missing)
#
# Needs JDK 17+, Maven, GNU time (/usr/bin/time) and the Debian packages python3-numpy python3-scipy
# python3-pandas (run by /usr/bin/python3). Leaves OPENBLAS_CORETYPE as the machine sets it.
set -euo pipefail
cd "$(dirname "$0")/.."
RUNS=${1:-5}
ROWS=${2:-1000000}
# shellcheck source=bench/lib.sh
. bench/lib.sh
BENCH_JAR=bench/target/benchmarks.jar
PY=/usr/bin/python3

if [ "${REBUILD:-0}" = 1 ] || [ ! -f "$JAR" ] || [ ! -f "$BENCH_JAR" ]; then
  echo "building $JAR and $BENCH_JAR ..." >&2
  mvn -B -q -Pbench package -DskipTests -pl cli,bench -am >&2
fi
if [ ! -x /usr/bin/time ]; then
  echo "compare.sh: needs GNU time at /usr/bin/time (Debian package time)" >&2
  exit 1
fi
if ! "$PY" -c 'import numpy, scipy, pandas' 2>/dev/null; then
  echo "compare.sh: needs python3-numpy python3-scipy python3-pandas for $PY (apt-get install them)" >&2
  exit 1
fi

OUT=$(mktemp -d)
trap 'rm -rf "$OUT"' EXIT
echo "machine: $(nproc) cores, $(java -version 2>&1 | head -1), $("$PY" -c 'import numpy, scipy, pandas; print("numpy", numpy.__version__, "scipy", scipy.__version__, "pandas", pandas.__version__)')" >&2

# the latent matrix the numpy script samples, from Standin's report of the same job
java -jar "$JAR" generate "$SPEC" --rows "$ROWS" --out "$OUT/latent" --threads 1 >/dev/null

# Each run starts from the same page-cache state: the previous run's output of the same name is
# removed and the dirty pages of earlier runs are flushed (sync) before the clock starts. Without
# this, a run pays for writing back whatever the runs before it left behind, and the figures wander
# by a second or more on this machine's disk.
measure() {
  local name=$1
  shift
  rm -rf "$OUT/$name" "$OUT/$name.csv"
  sync
  if ! /usr/bin/time -f "%e %M" -o "$OUT/time" "$@" >"$OUT/stdout" 2>"$OUT/stderr"; then
    echo "compare.sh: $name failed:" >&2
    cat "$OUT/stderr" >&2
    exit 1
  fi
  read -r seconds kb <"$OUT/time"
  echo "$name $seconds $kb" >>"$OUT/results"
  printf '  %-10s %7.2f s %7.0f MB\n' "$name" "$seconds" "$((kb / 1024))" >&2
}

for i in $(seq "$RUNS"); do
  echo "run $i of $RUNS (load average $(cut -d' ' -f1-3 /proc/loadavg))" >&2
  measure numpy "$PY" bench/numpy_reference.py --rows "$ROWS" --latent "$OUT/latent/mixed-1m.report.json" --out "$OUT/numpy.csv"
  measure standin-1 java -jar "$JAR" generate "$SPEC" --rows "$ROWS" --out "$OUT/standin-1" --threads 1
  measure standin-2 java -jar "$JAR" generate "$SPEC" --rows "$ROWS" --out "$OUT/standin-2" --threads 2
  measure floor java -cp "$BENCH_JAR" dev.standin.engine.FormatFloor "$SPEC" "$OUT/floor.csv" "$ROWS"
done

for f in mixed-1m.csv mixed-1m.report.json mixed-1m.report.html; do
  cmp -s "$OUT/standin-1/$f" "$OUT/standin-2/$f" || { echo "compare.sh: $f differs between --threads 1 and 2" >&2; exit 1; }
done

echo
echo "bench/mixed-1m.yaml, $ROWS rows, median of $RUNS alternating runs:"
printf '%-11s %10s %12s\n' "" "wall (s)" "peak RSS (MB)"
for n in numpy standin-1 standin-2 floor; do
  printf '%-11s %10.2f %12.0f\n' "$n" "$(median $n 2)" "$(awk -v k="$(median $n 3)" 'BEGIN { print k / 1024 }')"
done
np=$(median numpy 2); s1=$(median standin-1 2); s2=$(median standin-2 2); fl=$(median floor 2)
awk -v np="$np" -v s1="$s1" -v s2="$s2" -v fl="$fl" 'BEGIN {
  printf "numpy / standin-1      %6.2fx  (target >= 10)\n", np / s1
  printf "standin-1 / standin-2  %6.2fx  (target >= 1.7)\n", s1 / s2
  printf "standin-1 / floor      %6.2fx  (target <= 3)\n", s1 / fl
}'
echo "data, JSON and HTML reports identical for --threads 1 and 2"

if [ -n "${BIG_ROWS:-}" ]; then
  echo
  echo "one run of $BIG_ROWS rows with -Xmx128m (--threads 2):" >&2
  rm -rf "$OUT/standin-1" "$OUT/standin-2" "$OUT/numpy.csv" "$OUT/floor.csv"
  measure big java -Xmx128m -jar "$JAR" generate "$SPEC" --rows "$BIG_ROWS" --out "$OUT/big" --threads 2
  printf '%s rows: %.2f s, peak RSS %.0f MB\n' "$BIG_ROWS" "$(median big 2)" "$(awk -v k="$(median big 3)" 'BEGIN { print k / 1024 }')"
fi
