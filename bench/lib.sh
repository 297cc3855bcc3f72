# Shared by bench/compare.sh and bench/aot.sh (sourced, after they cd to the repository root).

# The reference job and the command-line jar.
SPEC=bench/mixed-1m.yaml
JAR=cli/target/standin.jar

# median NAME COLUMN: the median of COLUMN over the lines of $OUT/results whose first field is NAME
# (the mean of the two middle values for an even count).
median() {
  awk -v n="$1" -v c="$2" '$1 == n { print $c }' "$OUT/results" | sort -g |
    awk '{ v[NR] = $1 } END { print (NR % 2 ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2) }'
}
