#!/usr/bin/env bash
# Installs the build into a scratch prefix, then builds a consumer outside the tree against it,
# once with find_package(rxnheat) and once with pkg-config, and runs both.
# Expected values: CH4 combustion -890.57 kJ/mol (CODATA Key Values, Cox et al. 1989, via NASA
# Glenn data); water-gas shift at 1000 K about -34.8 kJ/mol (NIST-JANAF 4th ed., from memory).
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
out=$("$work/cmake/consumer_c"); check "find_package C consumer" "$out" "-34.7"
check "C consumer gets the range error" "$out" "status 6"
pcdir=$(dirname "$(find "$work/prefix" -name rxnheat.pc | head -n 1)")
flags=$(PKG_CONFIG_PATH="$pcdir" pkg-config --cflags --libs rxnheat)
g++ -std=c++17 "$src/consumer/consumer.cpp" $flags -o "$work/pc_cpp"
out=$("$work/pc_cpp"); check "pkg-config C++ consumer" "$out" "-890.57"
if [ -f "$work/prefix/include/rxnheat/rxnheat.h" ]; then echo "ok: C header installed"; pass=$((pass+1)); else echo "FAILED: C header"; fail=$((fail+1)); fi
if [ -f "$work/prefix/include/rxnheat/csv.hpp" ]; then echo "ok: CSV header installed"; pass=$((pass+1)); else echo "FAILED: CSV header"; fail=$((fail+1)); fi
echo "$pass passed, $fail failed"
[ "$fail" -eq 0 ]
