#!/usr/bin/env bash
# Installs the build into a scratch prefix, then builds a consumer outside the tree against it,
# once with find_package(rxnheat) and once with pkg-config, and runs both.
# Expected values: CH4 combustion -890.57 kJ/mol (CODATA Key Values, Cox et al. 1989, via NASA
# Glenn data); water-gas shift at 1000 K about -34.8 kJ/mol (NIST-JANAF 4th ed., from memory);
# the molar mass of CuSO4·5H2O from python3-periodictable (IUPAC atomic weights); the load of a
# species only our CSV table knows from that table's own row (2 mol × -279 kJ/mol, elements 0).
set -euo pipefail
build=$1
src=$(cd "$(dirname "$0")" && pwd)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cmake --install "$build" --prefix "$work/prefix" >/dev/null
fail=0
pass=0
check() {  # name, got, want-substring
  if grep -q -- "$3" <<<"$2"; then echo "ok: $1"; pass=$((pass+1)); else echo "FAILED: $1: got '$2', want '$3'"; fail=$((fail+1)); fi
}
cmake -S "$src/consumer" -B "$work/cmake" -DCMAKE_PREFIX_PATH="$work/prefix" >/dev/null
cmake --build "$work/cmake" >/dev/null
export LD_LIBRARY_PATH="$work/prefix/lib:$work/prefix/lib/$(gcc -print-multiarch 2>/dev/null || true)"
out=$("$work/cmake/consumer_cpp"); check "find_package C++ consumer" "$out" "-890.57"
check "C++ consumer sees the unbalanced error" "$out" "not balanced"
check "C++ consumer reads and writes CSV" "$out" 'csv: "a, b",c'
# A user species table for RXNLOAD (an invented demo row; the columns of engine/DATA.md, User tables).
printf 'formula,phase,dHf,name,source\nXeF6,g,-279,xenon hexafluoride,demo row\n' >"$work/species.csv"
rc=0
out=$("$work/cmake/consumer_c" "$work/species.csv") || rc=$?
check "C consumer exits 0 (every status as expected)" "$rc" "^0$"
check "find_package C consumer" "$out" "-34.7"
check "C consumer gets the range error" "$out" "status 6"
check "rxnheat_call RXNDH (CODATA via NASA Glenn)" "$out" "^call dh: -890.57 kJ/mol$"
check "rxnheat_call RXNLOAD with a CSV table handle (the table's row)" "$out" "^call load: -558.000000 kJ$"
check "rxnheat_call RXNLOAD without the table: unknown species (status 3)" "$out" "^call load without the table: status 3: .*XeF6"
check "rxnheat_call unknown unit: RXNHEAT_E_UNIT (8), no result" "$out" "^call unit error: status 8, result kind 0: .*kg/hr"
check "rxnheat_why names the unit" "$out" "^why: .*'kg/hr'"
check "rxnheat_why of a good call" "$out" "^why good: ok$"
check "function list: 23" "$out" "^functions 23:"
for f in RXNDH RXNDU RXNDS RXNDG RXNLOGK RXNLOAD RXNKIND RXNCHECK RXNBALANCE RXNREVERSE RXNSCALE RXNWHY SPECIESHF SPECIESCP \
         SPECIESH MOLARMASS STEAMTSAT STEAMPSAT STEAMH STEAMLATENT FUELHV RXNSOURCE RXNVERSION; do
  check "function list has $f" "$(grep '^functions' <<<"$out")" " $f\b"
done
# MOLARMASS against python3-periodictable, within 0.01 g/mol (as the engine tests).
want=$(/usr/bin/python3 -c 'import periodictable; print(repr(periodictable.formula("CuSO4(H2O)5").mass))')
got=$(sed -n 's/^call molarmass: \([^ ]*\) g\/mol$/\1/p' <<<"$out")
if [ -n "$got" ] && /usr/bin/python3 -c "import sys; sys.exit(0 if abs(float('$got') - float('$want')) <= 0.01 else 1)"; then
  echo "ok: rxnheat_call MOLARMASS CuSO4·5H2O $got g/mol vs python3-periodictable $want"; pass=$((pass+1))
else
  echo "FAILED: rxnheat_call MOLARMASS: got '$got', python3-periodictable $want"; fail=$((fail+1))
fi
pcdir=$(dirname "$(find "$work/prefix" -name rxnheat.pc | head -n 1)")
flags=$(PKG_CONFIG_PATH="$pcdir" pkg-config --cflags --libs rxnheat)
g++ -std=c++17 "$src/consumer/consumer.cpp" $flags -o "$work/pc_cpp"
out=$("$work/pc_cpp"); check "pkg-config C++ consumer" "$out" "-890.57"
if [ -f "$work/prefix/include/rxnheat/rxnheat.h" ]; then echo "ok: C header installed"; pass=$((pass+1)); else echo "FAILED: C header"; fail=$((fail+1)); fi
if [ -f "$work/prefix/include/rxnheat/csv.hpp" ]; then echo "ok: CSV header installed"; pass=$((pass+1)); else echo "FAILED: CSV header"; fail=$((fail+1)); fi
echo "$pass passed, $fail failed"
[ "$fail" -eq 0 ]
