#!/bin/sh
# Instructions per cold call (callgrind): cold_calls run with N = 1,000 and N = 3,000 new texts,
# the difference of the two totals divided by 2,000 (see cold_calls.cpp). Needs valgrind.
#
#   tests/bench/marginal_instructions.sh BUILD dh|balance [REACTION [T_K]]
#   e.g. tests/bench/marginal_instructions.sh build dh 'N2(g) + 3 H2(g) -> 2 NH3(g)' 700
set -eu
build=$1
shift
bin=$build/tests/bench/cold_calls
total() {
    valgrind --tool=callgrind --callgrind-out-file=/dev/null "$bin" "$1" "$2" ${3:+"$3"} ${4:+"$4"} 2>&1 |
        sed -n 's/^==[0-9]*== Collected : \([0-9]*\).*/\1/p'
}
kind=$1
shift
small=$(total "$kind" 1000 "$@")
large=$(total "$kind" 3000 "$@")
echo "$kind ${1:-(default reaction)}: $(( (large - small) / 2000 )) instructions a call"
