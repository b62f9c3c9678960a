#!/bin/sh
# Batch throughput of the command line against its floor (issue 10, item 12): `rxnheat batch` on
# a generated CSV of ROWS rows (default 1,000,000) drawn from 50 reactions at 5 temperatures,
# side by side with the floor, awk reading the same file and writing each line with a constant
# appended. Each is run REPS times (default 5) in turn; the script prints every run, the medians,
# the ratio of the medians to the floor's, and the peak resident set of each (GNU time's %M).
#
#   tests/bench/bench_batch.sh [PATH/TO/rxnheat] [ROWS] [REPS] [THREADS...]
#
# THREADS defaults to "1 2". The rows are drawn with a fixed seed (awk's srand(12345)), so every
# run reads the same file; a sheet repeats its reactions, so the engine's cache is warm after
# the first 250 rows and the figure is the cost of the batch pipeline itself: reading, CSV,
# the cached evaluation, formatting and writing in order. Needs GNU time (Debian package `time`).
set -eu

here=$(cd "$(dirname "$0")" && pwd)
cli=${1:-$here/../../build/cli/rxnheat}
rows=${2:-1000000}
reps=${3:-5}
shift $(($# < 3 ? $# : 3))
threads_list=${*:-1 2}
[ -x "$cli" ] || { echo "bench_batch.sh: no rxnheat at $cli (build the target rxnheat_cli)" >&2; exit 2; }
[ -x /usr/bin/time ] || { echo "bench_batch.sh: needs GNU time (/usr/bin/time, Debian package time)" >&2; exit 2; }

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
    r[12] = "C2H6(g) + 7/2 O2(g) -> 2 CO2(g) + 3 H2O(g)"
    r[13] = "C2H4(g) + 3 O2(g) -> 2 CO2(g) + 2 H2O(g)"
    r[14] = "acetylene(g) + 5/2 O2(g) -> 2 CO2(g) + H2O(g)"
    r[15] = "n-butane(g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(g)"
    r[16] = "C2H4(g) + H2(g) -> C2H6(g)"
    r[17] = "acetylene(g) + H2(g) -> C2H4(g)"
    r[18] = "CO(g) + 1/2 O2(g) -> CO2(g)"
    r[19] = "C(s) + O2(g) -> CO2(g)"
    r[20] = "C(s) + H2O(g) -> CO(g) + H2(g)"
    r[21] = "2 NO(g) + O2(g) -> 2 NO2(g)"
    r[22] = "2 NO2(g) -> N2O4(g)"
    r[23] = "N2(g) + O2(g) -> 2 NO(g)"
    r[24] = "H2(g) + Cl2(g) -> 2 HCl(g)"
    r[25] = "H2(g) + F2(g) -> 2 HF(g)"
    r[26] = "H2S(g) + 3/2 O2(g) -> SO2(g) + H2O(g)"
    r[27] = "H2S(g) + 2 O2(g) -> SO3(g) + H2O(g)"
    r[28] = "SO3(g) + H2O(g) -> H2SO4(g)"
    r[29] = "CH3OH(g) + 3/2 O2(g) -> CO2(g) + 2 H2O(g)"
    r[30] = "C2H5OH(g) + 3 O2(g) -> 2 CO2(g) + 3 H2O(g)"
    r[31] = "CH4(g) + 2 H2O(g) -> CO2(g) + 4 H2(g)"
    r[32] = "CO2(g) + 4 H2(g) -> CH4(g) + 2 H2O(g)"
    r[33] = "CO2(g) + H2(g) -> CO(g) + H2O(g)"
    r[34] = "2 CH4(g) -> acetylene(g) + 3 H2(g)"
    r[35] = "C2H6(g) -> C2H4(g) + H2(g)"
    r[36] = "C3H8(g) -> propylene(g) + H2(g)"
    r[37] = "NH3(g) + HCl(g) -> NH4Cl(s)"
    r[38] = "MgCO3(s) -> MgO(s) + CO2(g)"
    r[39] = "2 Al(s) + 3/2 O2(g) -> Al2O3(s)"
    r[40] = "3 Fe(s) + 2 O2(g) -> Fe3O4(s)"
    r[41] = "4 Fe(s) + 3 O2(g) -> 2 Fe2O3(s)"
    r[42] = "Si(s) + O2(g) -> SiO2(s)"
    r[43] = "2 HCl(g) + 1/2 O2(g) -> Cl2(g) + H2O(g)"
    r[44] = "2 H2O2(g) -> 2 H2O(g) + O2(g)"
    r[45] = "N2O4(g) -> 2 NO2(g)"
    r[46] = "CH4(g) + Cl2(g) -> CH3Cl(g) + HCl(g)"
    r[47] = "COS(g) + H2O(g) -> CO2(g) + H2S(g)"
    r[48] = "HCN(g) + H2O(g) -> NH3(g) + CO(g)"
    r[49] = "C6H6(g) + 15/2 O2(g) -> 6 CO2(g) + 3 H2O(g)"
    split("400 500 600 700 800", t, " ")
    srand(12345)
    print "reaction,temperature,unit"
    for (i = 0; i < n; i++) {
        k = int(rand() * 50)
        unit = (i % 3 == 0) ? "MJ/kmol" : "kJ/mol"
        printf "\"%s\",%s K,%s\n", r[k], t[int(rand() * 5) + 1], unit
    }
}' > "$csv"

# median of the numbers on standard input
median() { sort -g | awk '{ a[NR] = $1 } END { print a[int((NR + 1) / 2)] }'; }

# run NAME COMMAND...: one timed run; appends "seconds peak_KiB" to $work/NAME.
run() {
    name=$1
    shift
    start=$(date +%s.%N)
    /usr/bin/time -f %M -o "$work/rss" "$@" > "$work/out.csv" 2> "$work/err.txt" || {
        echo "$name failed:" >&2; cat "$work/err.txt" >&2; exit 1; }
    end=$(date +%s.%N)
    echo "$start $end $(tail -n 1 "$work/rss")" | awk '{ printf "%.4f %d\n", $2 - $1, $3 }' >> "$work/$name"
}

check_batch_output() {
    out_rows=$(($(wc -l < "$work/out.csv") - 1))
    [ "$out_rows" -eq "$rows" ] || { echo "expected $rows output rows, got $out_rows" >&2; exit 1; }
    bad=$(awk -F, 'NR > 1 && $NF != "" { n++ } END { print n + 0 }' "$work/out.csv")
    [ "$bad" -eq 0 ] || { echo "$bad rows had errors, e.g.:" >&2; awk -F, 'NR > 1 && $NF != ""' "$work/out.csv" | head -3 >&2; exit 1; }
}

echo "rxnheat batch: $rows rows from 50 reactions at 5 temperatures, $(wc -c < "$csv") bytes, $reps runs each ($cli)"
for rep in $(seq 1 "$reps"); do
    run floor awk '{ print $0 ",1" }' "$csv"
    for threads in $threads_list; do
        run "threads$threads" "$cli" batch "$csv" --threads "$threads"
        check_batch_output
    done
done

floor=$(cut -d' ' -f1 "$work/floor" | median)
echo "floor (awk, a constant appended): s per run: $(cut -d' ' -f1 "$work/floor" | tr '\n' ' ')median $floor s, peak $(cut -d' ' -f2 "$work/floor" | sort -n | tail -n 1) KiB"
for threads in $threads_list; do
    f=$work/threads$threads
    m=$(cut -d' ' -f1 "$f" | median)
    echo "--threads $threads: s per run: $(cut -d' ' -f1 "$f" | tr '\n' ' ')median $m s, $(echo "$rows $m" | awk '{ printf "%.0f", $1 / $2 }') rows/s, ratio to the floor $(echo "$m $floor" | awk '{ printf "%.2f", $1 / $2 }'), peak $(cut -d' ' -f2 "$f" | sort -n | tail -n 1) KiB"
done
