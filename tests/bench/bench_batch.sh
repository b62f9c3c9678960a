#!/bin/sh
# Batch throughput of the command line: `rxnheat batch` on a generated 100,000-row CSV, with
# --threads 1 and --threads 2, each run REPS times (default 5); prints rows/s of every run and
# the median.
#
#   tests/bench/bench_batch.sh [PATH/TO/rxnheat] [ROWS] [REPS]
#
# The rows cycle through 12 typical reactions at 5 temperatures each (a sheet repeats its
# reactions, so the engine's cache is warm for most rows); every 10th row has spaces appended
# that make its text new, so parsing is part of the measurement too.
set -eu

here=$(cd "$(dirname "$0")" && pwd)
cli=${1:-$here/../../build/engine/rxnheat}
rows=${2:-100000}
reps=${3:-5}
[ -x "$cli" ] || { echo "bench_batch.sh: no rxnheat at $cli (build the target rxnheat_cli)" >&2; exit 2; }

work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT INT TERM
csv=$work/rows.csv

awk -v n="$rows" 'BEGIN {
    r[0] = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)"
    r[1] = "CO(g) + H2O(g) -> CO2(g) + H2(g)"
    r[2] = "N2(g) + 3 H2(g) -> 2 NH3(g)"
    r[3] = "CaCO3(s) -> CaO(s) + CO2(g)"
    r[4] = "SO2(g) + 1/2 O2(g) -> SO3(g)"
    r[5] = "CH4(g) + H2O(g) -> CO(g) + 3 H2(g)"
    r[6] = "CO(g) + 2 H2(g) -> CH3OH(g)"
    r[7] = "Fe2O3(s) + 3 CO(g) -> 2 Fe(s) + 3 CO2(g)"
    r[8] = "C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)"
    r[9] = "4 NH3(g) + 5 O2(g) -> 4 NO(g) + 6 H2O(g)"
    r[10] = "C(s) + CO2(g) -> 2 CO(g)"
    r[11] = "2 H2(g) + O2(g) -> 2 H2O(g)"
    split("400 600 700 800 900", t, " ")
    print "reaction,temperature,unit"
    for (i = 0; i < n; i++) {
        text = r[i % 12]
        if (i % 10 == 9) { pad = ""; for (k = 0; k < (int(i / 10) % 200) + 1; k++) pad = pad " "; text = text pad }
        unit = (i % 3 == 0) ? "MJ/kmol" : "kJ/mol"
        printf "\"%s\",%s K,%s\n", text, t[(i % 5) + 1], unit
    }
}' > "$csv"

echo "rxnheat batch: $rows rows, $(wc -c < "$csv") bytes, $reps runs per setting ($cli)"
for threads in 1 2; do
    rates=""
    for rep in $(seq 1 "$reps"); do
        start=$(date +%s.%N)
        "$cli" batch "$csv" --threads "$threads" > "$work/out.csv" 2> "$work/err.txt" || {
            echo "rxnheat batch failed (exit $?):" >&2; cat "$work/err.txt" >&2; exit 1; }
        end=$(date +%s.%N)
        out_rows=$(($(wc -l < "$work/out.csv") - 1))
        [ "$out_rows" -eq "$rows" ] || { echo "expected $rows output rows, got $out_rows" >&2; exit 1; }
        bad=$(awk -F, 'NR > 1 && $NF != "" { n++ } END { print n + 0 }' "$work/out.csv")
        [ "$bad" -eq 0 ] || { echo "$bad rows had errors, e.g.:" >&2; awk -F, 'NR > 1 && $NF != ""' "$work/out.csv" | head -3 >&2; exit 1; }
        rate=$(echo "$start $end $rows" | awk '{ printf "%.0f", $3 / ($2 - $1) }')
        rates="$rates $rate"
    done
    median=$(echo "$rates" | tr ' ' '\n' | grep . | sort -n | awk '{ a[NR] = $1 } END { print a[int((NR + 1) / 2)] }')
    echo "--threads $threads: rows/s per run:$rates; median $median rows/s"
done
