#!/bin/bash
# Tests of the rxnheat command line: outputs, JSON, exit codes, bad input, batch CSV streaming.
# Usage: run_cli_tests.sh PATH/TO/rxnheat      (CTest runs it as test_cli)
# Prints "N passed, M failed" last and exits non-zero on any failure.
# Outside references: GNU units (`units -t FROM TO`, Debian package units) for unit factors and
# R; python3-periodictable (IUPAC atomic weights) for molar masses; values named beside each check.
set -u
BIN=${1:?usage: run_cli_tests.sh PATH/TO/rxnheat}
PY=/usr/bin/python3
TMP=$(mktemp -d)
trap 'rm -rf "$TMP"' EXIT
passed=0
failed=0

pass() { passed=$((passed + 1)); }
fail() {
    failed=$((failed + 1))
    echo "FAIL: $1"
    [ -n "${2:-}" ] && echo "      $2"
    echo "      command: rxnheat ${LAST_ARGS:-}" | cut -c1-300
    echo "      rc=$RC stdout: $(head -c 400 "$TMP/out")"
    echo "      stderr: $(head -c 400 "$TMP/err")"
}

# run ARGS...: runs the binary (60 s limit), sets RC; stdout in $TMP/out, stderr in $TMP/err.
run() {
    LAST_ARGS="$*"
    timeout 60 "$BIN" "$@" >"$TMP/out" 2>"$TMP/err"
    RC=$?
}
# run_in FILE ARGS...: same with FILE as standard input.
run_in() {
    local f=$1
    shift
    LAST_ARGS="$* < $f"
    timeout 60 "$BIN" "$@" <"$f" >"$TMP/out" 2>"$TMP/err"
    RC=$?
}
out() { cat "$TMP/out"; }
err() { cat "$TMP/err"; }

expect_rc() {  # NAME RC
    if [ "$RC" -eq "$2" ]; then pass; else fail "$1: exit status $RC, expected $2"; fi
}
expect_out() {  # NAME EXACT_STDOUT
    if [ "$(out)" == "$2" ]; then pass; else fail "$1: stdout is not '$2'"; fi
}
expect_out_re() {  # NAME EXTENDED_REGEX (whole stdout, one line)
    if out | grep -Eq -- "$2"; then pass; else fail "$1: stdout does not match /$2/"; fi
}
expect_err_re() {  # NAME EXTENDED_REGEX
    if err | grep -Eq -- "$2"; then pass; else fail "$1: stderr does not match /$2/"; fi
}
expect_empty_out() { if [ ! -s "$TMP/out" ]; then pass; else fail "$1: stdout should be empty"; fi; }
expect_empty_err() { if [ ! -s "$TMP/err" ]; then pass; else fail "$1: stderr should be empty"; fi; }

# jcheck NAME PYTHON_EXPRESSION: stdout must be exactly one JSON object (strict UTF-8); the
# expression, with the object bound to j, must be true.
jcheck() {
    local msg
    if msg=$("$PY" - "$TMP/out" "$2" <<'EOF' 2>&1
import json, math, sys
raw = open(sys.argv[1], "rb").read()
text = raw.decode("utf-8")          # strict: invalid UTF-8 fails the check
j = json.loads(text)                # one JSON value; trailing data fails
if not isinstance(j, dict):
    raise SystemExit("not a JSON object")
if not eval(sys.argv[2]):
    raise SystemExit("false: " + sys.argv[2])
EOF
    ); then pass; else fail "$1" "$msg"; fi
}
# jval KEY: prints a number or string of the JSON object on stdout.
jval() { "$PY" -c 'import json,sys; print(repr(json.load(open(sys.argv[1]))[sys.argv[2]]))' "$TMP/out" "$1"; }
# close A B TOL: |A - B| <= TOL
close() { "$PY" -c 'import sys; a,b,t=map(float,sys.argv[1:4]); sys.exit(0 if abs(a-b)<=t else 1)' "$1" "$2" "$3"; }
expect_close() {  # NAME A B TOL
    if close "$2" "$3" "$4"; then pass; else fail "$1: $2 is not within $4 of $3"; fi
}

# pycheck NAME ARGS... < PYTHON_SCRIPT: passes when the script exits 0; shows its output if not.
pycheck() {
    local name=$1 msg
    shift
    if msg=$("$PY" - "$@" 2>&1); then
        [ -n "$msg" ] && echo "      $msg"
        pass
    else
        failed=$((failed + 1))
        echo "FAIL: $name"
        echo "$msg" | tail -n 5 | sed 's/^/      /'
    fi
}

# Outside references computed here.
units_factor() { units -t "$1" "$2"; }                       # GNU units
molar_mass() { "$PY" -c 'import periodictable,sys; print(periodictable.formula(sys.argv[1]).mass)' "$1"; }

METHANE="CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"
SHIFT="CO(g) + H2O(g) -> CO2(g) + H2(g)"

# ==== the issue's new-user checks ===================================================================
run dh "$METHANE" --json
expect_rc "dh methane --json" 0
expect_empty_err "dh methane --json"
# -890.6 kJ/mol: CODATA Key Values (Cox et al. 1989) via NASA Glenn data (ΔfH° CO2(g) −393.51,
# H2O(l) −285.83; CH4(g) −74.6 in the NASA Glenn record).
jcheck "dh methane value" 'abs(j["value"] - (-890.6)) <= 0.3 and j["unit"] == "kJ/mol"'
jcheck "dh methane fields" 'j["kind"] == "exothermic" and j["temperature_K"] == 298.15 and j["reaction"] == "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"'
jcheck "dh methane sources" 'sorted(s["species"] for s in j["sources"]) == ["CH4(g)", "CO2(g)", "H2O(l)", "O2(g)"] and all(s["record"] and "NASA" in s["text"] for s in j["sources"])'
DH_METHANE=$(jval value)

run dh "$SHIFT" -T 1000 --json
expect_rc "dh shift 1000 K" 0
# −34.8 kJ/mol at 1000 K: NIST-JANAF 4th ed. (1998), from memory (ΔfH° at 1000 K: CO2 −394.62,
# H2O(g) −247.86, CO −111.98).
jcheck "dh shift 1000 K value" 'abs(j["value"] - (-34.8)) <= 0.3 and j["temperature_K"] == 1000'
DH_SHIFT_1000=$(jval value)

run check "H2(g) + O2(g) -> H2O(l)"
expect_rc "check unbalanced: exit 2" 2
# O: 2 on the left, 1 on the right (atom count by hand); the words must name O and its totals.
expect_out_re "check unbalanced: words" 'not balanced.*O[^A-Za-z].*2.*left.*1.*right'
run check "H2(g) + O2(g) -> H2O(l)" --json
expect_rc "check unbalanced --json: exit 2" 2
jcheck "check unbalanced --json" 'j["ok"] is False and "balanced" in j["check"] and j["error"] == j["check"]'
run check "2 H2(g) + O2(g) -> 2 H2O(l)"
expect_rc "check ok" 0
expect_out "check ok: prints ok" "ok"
run check "2 H2(g) + O2(g) -> 2 H2O(l)" --json
jcheck "check ok --json" 'j["ok"] is True and j["check"] == "ok" and "error" not in j'

# ==== dh text output, units, temperature text =========================================================
run dh "$METHANE"
expect_rc "dh text" 0
# 6 significant digits: -890.57 (the JSON value printed with %.6g).
EXPECT_TEXT="$("$PY" -c 'import sys; print("%.6g kJ/mol (exothermic)" % float(sys.argv[1]))' "$DH_METHANE")"
expect_out "dh text format" "$EXPECT_TEXT"

run dh "$METHANE" -u kcal/mol --json
# kJ -> kcal (thermochemical calorie): factor from GNU units.
F=$(units_factor kJ/mol kcal/mol)
expect_close "dh kcal/mol" "$(jval value)" "$("$PY" -c "print($DH_METHANE*$F)")" 1e-4
jcheck "dh kcal/mol unit" 'j["unit"] == "kcal/mol"'
run dh "$METHANE" -u BTU/lbmol --json
# GNU units has no lbmol: a pound-mole is (lb/g) mol; btu is the International Table BTU.
F=$(units_factor kJ/mol 'btu/((lb/g) mol)')
expect_close "dh BTU/lbmol" "$(jval value)" "$("$PY" -c "print($DH_METHANE*$F)")" 0.05

run dh "$METHANE" -u MJ/kg --per "CH4(g)" --json
expect_rc "dh --per MJ/kg" 0
# per kg of methane: ΔrH°/M(CH4), M from python3-periodictable (IUPAC atomic weights).
M_CH4=$(molar_mass CH4)
expect_close "dh --per MJ/kg value" "$(jval value)" "$("$PY" -c "print($DH_METHANE/$M_CH4)")" 0.005
jcheck "dh --per fields" 'j["per"] == "CH4(g)" and j["unit"] == "MJ/kg"'
run dh "$METHANE" -u MJ/kg --per "CH4(g)"
expect_out_re "dh --per text" '^-55\.[0-9]+ MJ/kg of CH4\(g\) \(exothermic\)$'
run dh "$METHANE" --per "O2(g)" --json
# per mole of O2, whose coefficient is 2: half the value (stoichiometry, common practice).
expect_close "dh --per O2" "$(jval value)" "$("$PY" -c "print($DH_METHANE/2)")" 1e-9

# Temperature as text: 350 °C and 662 °F are both 623.15 K (GNU units tempC(350), tempF(662)).
TK_C=$(units -t 'tempC(350)' K)
TK_F=$(units -t 'tempF(662)' K)
run dh "$SHIFT" -T 623.15 --json
V_K=$(jval value)
run dh "$SHIFT" -T "350 C" --json
jcheck "-T '350 C' is 623.15 K" "abs(j['temperature_K'] - $TK_C) < 1e-9"
expect_close "-T '350 C' same value" "$(jval value)" "$V_K" 1e-9
run dh "$SHIFT" --temperature="662 F" --json
jcheck "--temperature='662 F' is 623.15 K" "abs(j['temperature_K'] - $TK_F) < 1e-9"
run dh "$SHIFT" -T1000 --json
expect_close "-T1000 attached" "$(jval value)" "$DH_SHIFT_1000" 1e-12

# ==== du, load, kind ====================================================================================
run du "$METHANE" --json
expect_rc "du" 0
# ΔrU° = ΔrH° − Δn(gas)·R·T with Δn(gas) = 1 − 3 = −2; R from GNU units.
R=$(units -t R 'J/mol/K')
expect_close "du value" "$(jval value)" "$("$PY" -c "print($DH_METHANE + 2*$R*298.15/1000)")" 1e-5
jcheck "du dn_gas" 'j["dn_gas"] == -2 and j["unit"] == "kJ/mol"'

run load "$METHANE" 1 kmol "CH4(g)" --json
expect_rc "load 1 kmol" 0
# 1 kmol of CH4 reacting: 1000 × ΔrH° (kJ); kmol = 1000 mol.
expect_close "load 1 kmol value" "$(jval value)" "$("$PY" -c "print($DH_METHANE*1000)")" 1e-6
jcheck "load total unit" 'j["unit"] == "kJ" and j["key"] == "CH4(g)" and j["quantity_unit"] == "kmol"'
run load "$METHANE" 120 kg/h "CH4(g)" -u MW --json
expect_rc "load 120 kg/h" 0
# 120 kg/h of CH4: 120000/M mol per 3600 s, × ΔrH° (kJ/mol) / 1000 -> MW (M from periodictable).
expect_close "load rate MW" "$(jval value)" "$("$PY" -c "print(120000/$M_CH4/3600*$DH_METHANE/1000)")" 1e-4
run load "$METHANE" 120 kg/h "CH4(g)" --json
jcheck "load rate default kW" 'j["unit"] == "kW"'
run load "$METHANE" 120 kg/h "CH4(g)"
expect_out_re "load text" '^-[0-9.]+ kW \(exothermic\)$'
run load "$METHANE" -5 kg "CH4(g)"
expect_rc "load negative quantity (an argument, not an option): exit 2" 2
expect_err_re "load negative quantity: words" 'negative'
run load "$METHANE" lots kg "CH4(g)"
expect_rc "load non-number quantity" 2
expect_err_re "load non-number quantity: words" "QUANTITY.*lots"
run load "$METHANE" 5 kg
expect_rc "load missing KEY" 2
expect_err_re "load missing KEY: names it" 'missing KEY'
run load "$METHANE" 5 furlongs "CH4(g)" --json
expect_rc "load unknown quantity unit" 2
jcheck "load unknown quantity unit --json" '"furlongs" in j["error"] and j["error_kind"] == "unit"'

run kind "$METHANE"
expect_rc "kind" 0
expect_out "kind exothermic" "exothermic"
run kind "CO2(g) + 2 H2O(l) -> CH4(g) + 2 O2(g)"
expect_out "kind endothermic" "endothermic"
# The shift reaction at 298.15 K is about −41.2 kJ/mol (NIST-JANAF, from memory): inside a 50 kJ/mol
# band it is thermoneutral, outside a 40 kJ/mol band it is not.
run kind "$SHIFT" --tolerance 50
expect_out "kind thermoneutral within tolerance" "thermoneutral"
run kind "$SHIFT" --tolerance 40 --json
jcheck "kind --json" 'j["kind"] == "exothermic" and j["tolerance_kJ_per_mol"] == 40 and abs(j["dH_kJ_per_mol"] + 41.2) < 0.5'

# ==== balance, reverse, scale =============================================================================
run balance "C3H8(g) + O2(g) -> CO2(g) + H2O(l)"
expect_rc "balance" 0
# C3H8 + 5 O2 -> 3 CO2 + 4 H2O (atom count by hand: C 3, H 8, O 10 on each side).
expect_out "balance propane" "C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)"
run balance "C3H8(g) + O2(g) -> CO2(g) + H2O(l)" --json
jcheck "balance --json" 'j["reaction"] == "C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)" and j["input"].startswith("C3H8")'

run reverse "$METHANE"
expect_out "reverse" "CO2(g) + 2 H2O(l) -> CH4(g) + 2 O2(g)"
REV=$(out)
run dh "$REV" --json
# Reversing flips the sign (Hess's law, common practice).
expect_close "dh of reversed = -dh" "$(jval value)" "$("$PY" -c "print(-$DH_METHANE)")" 1e-9
run reverse "$METHANE" --json
jcheck "reverse --json" 'j["reaction"] == "CO2(g) + 2 H2O(l) -> CH4(g) + 2 O2(g)"'

run scale "2 H2(g) + O2(g) -> 2 H2O(l)" 1/2
expect_out "scale 1/2 keeps fractions" "H2(g) + 1/2 O2(g) -> H2O(l)"
run scale "$METHANE" 3 --json
jcheck "scale --json" 'j["reaction"] == "3 CH4(g) + 6 O2(g) -> 3 CO2(g) + 6 H2O(l)" and j["factor"] == "3"'
run dh "3 CH4(g) + 6 O2(g) -> 3 CO2(g) + 6 H2O(l)" --json
# Scaling scales ΔrH° (extensive, common practice).
expect_close "dh of scaled = 3 dh" "$(jval value)" "$("$PY" -c "print(3*$DH_METHANE)")" 1e-9
run scale "$METHANE" -2
expect_rc "scale negative factor" 2
run scale "$METHANE"
expect_rc "scale missing FACTOR" 2
expect_err_re "scale missing FACTOR: names it" 'missing FACTOR'
# Issue 10: a factor with an exponent is read exactly; one whose coefficients would not read back
# (over 12 digits, grammar/SYNTAX.md) is an error in words.
run scale "H2 + 1/2 O2 -> H2O" 1e-7
expect_out "scale 1e-7" "1/10000000 H2 + 1/20000000 O2 -> 1/10000000 H2O"
run scale "H2 + 1/2 O2 -> H2O" 1e13
expect_rc "scale 1e13" 2
expect_err_re "scale 1e13: says the digits" '12 digits'
# Issue 10: temperature text at 0 K or underflowing is refused when read, in words.
run dh "$METHANE" -T "0 K"
expect_rc "dh at 0 K" 2
expect_err_re "dh at 0 K: absolute zero" 'absolute zero'
run dh "$METHANE" -T 1e-400
expect_rc "dh at 1e-400 K" 2
expect_err_re "dh at 1e-400 K: underflows" 'underflows'
# Issue 10: H2O0.9999999 is not water; the totals are shown apart.
run check "H2O0.9999999 -> H2O"
expect_out "check H2O0.9999999" "the reaction is not balanced: O 0.9999999 on the left, 1 on the right"

# ==== species =============================================================================================
run species "H2O(l)" --json
expect_rc "species H2O(l)" 0
# ΔfH° −285.830 ± 0.040 kJ/mol, S° 69.95 ± 0.03 J/(mol·K): CODATA Key Values (Cox et al. 1989).
# Cp° 75.3 J/(mol·K) at 298.15 K: NIST-JANAF 4th ed. (1998), from memory.
jcheck "species H2O(l) dHf" 'abs(j["dHf_kJ_per_mol"] + 285.83) <= 0.05'
jcheck "species H2O(l) S" 'abs(j["S_J_per_molK"] - 69.95) <= 0.1'
jcheck "species H2O(l) Cp" 'abs(j["Cp_J_per_molK"] - 75.3) <= 0.3'
jcheck "species H2O(l) fields" 'j["species"] == "H2O(l)" and j["record"] and j["temperature_K"] == 298.15 and j["dH_sensible_kJ_per_mol"] == 0 and j["tmin_K"] <= 298.15 <= j["tmax_K"] and "NASA" in j["source"]'
M_H2O=$(molar_mass H2O)
expect_close "species H2O molar mass (periodictable)" "$("$PY" -c 'import json,sys; print(json.load(open(sys.argv[1]))["molar_mass_g_per_mol"])' "$TMP/out")" "$M_H2O" 0.002
run species "H2O(l)"
expect_rc "species text" 0
# The card's own layout: headings, then "  label  value" lines under them.
expect_out_re "species text heading Species" '^Species$'
expect_out_re "species text heading At 298.15 K" '^At 298\.15 K$'
expect_out_re "species text heading At T" '^At T = 298\.15 K$'
expect_out_re "species text heading Source record" '^Source record$'
expect_out_re "species text has dHf" '^  ΔfH° +-285\.8'
expect_out_re "species text has molar mass" '^  molar mass +18\.01'
expect_out_re "species text has Cp" '^  Cp° +75\.[0-9]* J/\(mol K\)$'
expect_out_re "species text has S" '^  S° +69\.9[0-9]* J/\(mol K\)$'
expect_out_re "species text has the record's range" '^  temperature range +[0-9.]+ to [0-9.]+ K$'
expect_out_re "species text has source" '^  citation +.*NASA'
# A record with no heat capacity (NASA Glenn gives nitromethane liquid, CH3NO2(L), as ΔfH° at
# 298.15 K alone, interval count 0): ΔfH° is printed, the rest is said to be missing, exit 0.
# ΔfH°(CH3NO2, l) = −113.1 kJ/mol: NBS tables (Wagman et al. 1982), from memory.
run species "CH3NO2(l)"
expect_rc "species without heat capacity" 0
expect_out_re "species without heat capacity: dHf" '^  ΔfH° +-113\.1 kJ/mol$'
expect_out_re "species without heat capacity: said plainly" 'data give no heat capacity for CH3NO2\(l\)'
expect_out_re "species without heat capacity: one temperature" '^  temperature range +298\.15 K only$'
if out | grep -Eq '^  (Cp°|S°) '; then fail "species without heat capacity: no Cp or S line"; else pass; fi
run species "CH3NO2(l)" --json
expect_rc "species without heat capacity --json" 0
jcheck "species without heat capacity --json: dHf" 'abs(j["dHf_kJ_per_mol"] + 113.1) <= 0.5'
jcheck "species without heat capacity --json: nulls" 'all(j[k] is None for k in ("Cp_J_per_molK", "dH_sensible_kJ_per_mol", "H_kJ_per_mol", "S_J_per_molK", "tmin_K", "tmax_K")) and j["temperature_K"] == 298.15 and j["record"] == "CH3NO2(L)"'
# NASA Glenn gives liquid methane, CH4(L), only as its assigned enthalpy at the normal boiling
# point, 111.643 K: that is H°(T), not ΔfH° at 298.15 K. Expected about −89.3 kJ/mol: ΔfH°(CH4, g)
# −74.87 (NIST-JANAF 1998), less about 6.2 of gas heat from 111.6 to 298.15 K (Cp° near 33.4
# J/(mol K)) and the heat of vaporisation 8.19 at 111.7 K, all from memory.
run species "CH4(l)" -T 111.643 --json
expect_rc "species at the one temperature of its record" 0
jcheck "species CH4(l) 111.643 K: H, not dHf" 'j["dHf_kJ_per_mol"] is None and abs(j["H_kJ_per_mol"] + 89.3) <= 0.5 and j["Cp_J_per_molK"] is None and j["S_J_per_molK"] is None'
run species "CH4(l)" -T 111.643
expect_out_re "species CH4(l) 111.643 K text: H°(T)" '^  H°\(T\) +-89\.2[0-9]* kJ/mol'
if out | grep -q 'ΔfH° *-'; then fail "species CH4(l) 111.643 K text: no ΔfH° value"; else pass; fi
run species "Fe(s)" -T 1300 --json
# At 1300 K solid iron is the gamma (fcc) form, stable 1184–1665 K: NIST-JANAF (1998), from memory.
jcheck "species Fe(s) 1300 K gamma record" 'j["tmin_K"] <= 1300 <= j["tmax_K"] and abs(j["tmin_K"] - 1184) < 1 and abs(j["tmax_K"] - 1665) < 1'
run species "CO2(g)" -T 1000 --json
# H°(1000 K) − H°(298.15 K) of CO2(g): 33.40 kJ/mol, NIST-JANAF (1998), from memory.
jcheck "species CO2(g) 1000 K sensible heat" 'abs(j["dH_sensible_kJ_per_mol"] - 33.40) <= 0.1'

# ==== bad input: each a clear error, exit status 2, in text and in JSON ===================================
PAREN4K=$(printf '(%.0s' $(seq 4096))
PAREN5K=$(printf '(%.0s' $(seq 5000))
# bad NAME KIND WORDS_REGEX ARGS...: exit 2; text: message on stderr matching WORDS, nothing on
# stdout; --json: one object with "error" (matching WORDS) and error_kind KIND, nothing on stderr.
bad() {
    local name=$1 kind=$2 words=$3
    shift 3
    run "$@"
    expect_rc "$name: exit 2" 2
    expect_empty_out "$name: no stdout"
    expect_err_re "$name: words on stderr" "$words"
    run "$@" --json
    expect_rc "$name --json: exit 2" 2
    expect_empty_err "$name --json: no stderr"
    jcheck "$name --json: error object" "isinstance(j.get('error'), str) and __import__('re').search(r'''$words''', j['error']) is not None and j.get('error_kind') == '$kind'"
}
# An empty required argument is an argument error, by the catalogue's one rule for every host.
bad "empty reaction" argument 'empty' dh ""
bad "4 KiB of '('" syntax 'position [0-9]+' dh "$PAREN4K"
bad "5000 characters" too_long '4096' dh "$PAREN5K"
bad "species with no data (dh)" unknown_species 'no data.*H2O5' dh "H2(g) + 5/2 O2(g) -> H2O5(g)"
bad "species with no data (species)" unknown_species 'no data.*H2O5' species "H2O5(g)"
# NASA Glenn gas records start at 200 K (NASA/TP-2002-211556): 150 K is out of range.
bad "temperature below 200 K" out_of_range '150 K' dh "$SHIFT" -T 150
bad "species below 200 K" out_of_range '150 K' species "CO2(g)" -T 150
bad "unknown unit" unit "MJ/bogus.*kJ/mol" dh "$METHANE" -u MJ/bogus
bad "wrong-case unit mJ/mol" unit "mJ/mol" dh "$METHANE" -u mJ/mol
bad "unknown temperature text" argument 'banana' dh "$METHANE" -T banana
bad "unbalanced dh" unbalanced 'not balanced' dh "H2(g) + O2(g) -> H2O(l)"
bad "syntax error position" syntax 'position [0-9]+' dh "CH4(g) + -> CO2(g)"
bad "per-mass unit without --per" unit 'per' dh "$METHANE" -u MJ/kg
bad "missing table file" table "no-such-table" dh "$METHANE" --table "$TMP/no-such-table.csv"
# A species over the 4096-character limit.
bad "species 5000 characters" too_long '4096' species "$PAREN5K"

# JSON stays valid with quotes, control characters and bytes that are not UTF-8 in the input.
run dh $'CH4"\x01\t(g) -> \xff\xfe' --json
expect_rc "odd bytes --json: exit 2" 2
jcheck "odd bytes --json: valid JSON error" 'isinstance(j["error"], str) and len(j["error"]) > 0'

# ==== the command line itself =============================================================================
# usage NAME ARGS...: exit 2, usage on stderr; with --json, the error object with error_kind usage.
usage() {
    local name=$1
    shift
    run "$@"
    expect_rc "$name: exit 2" 2
    expect_err_re "$name: usage on stderr" 'usage: rxnheat'
    run "$@" --json
    expect_rc "$name --json: exit 2" 2
    jcheck "$name --json" 'j["error_kind"] == "usage" and len(j["error"]) > 0'
}
usage "no command"
usage "unknown command" frobnicate "$METHANE"
usage "unknown option" dh "$METHANE" --frobnicate
usage "unknown short option" dh "$METHANE" -z
usage "option not taken by the command" reverse "$METHANE" -T 300
usage "option without its value" dh "$METHANE" -T
usage "option given twice" dh "$METHANE" -T 300 -T 400
usage "missing REACTION" dh
usage "unquoted reaction (extra arguments)" dh "CH4(g)" + "2 O2(g)"
usage "empty option value" dh "$METHANE" -u ""
run dh "CH4(g)" + "2 O2(g)"
expect_err_re "extra arguments: quoting hint" 'quotes'
run dh "$METHANE" -- --json
expect_rc "-- ends options (then --json is an extra argument)" 2

# The commands cli/CLI.md names as not in this version, whose functions the catalogue does not have yet.
# Every command the specification names is in this version: each answers --help.
for cmd in tad hv duty streamh steam hess eqx; do
    run "$cmd" --help
    expect_rc "$cmd is in this version: --help exit 0" 0
    expect_out_re "$cmd --help: usage" "^usage: rxnheat $cmd"
done

run --help
expect_rc "--help" 0
expect_out_re "--help lists commands" '^  batch '
if out | grep -q 'Not in this version'; then fail "--help names no planned command now (every one is in)"; else pass; fi
run help
expect_rc "help" 0
expect_out_re "help: usage" '^usage: rxnheat'
for cmd in dh du load kind check balance reverse scale species batch; do
    run "$cmd" --help
    expect_rc "$cmd --help" 0
    expect_out_re "$cmd --help: usage line" "^usage: rxnheat $cmd( |\$)"
    run help "$cmd"
    expect_out_re "help $cmd" "^usage: rxnheat $cmd( |\$)"
done
run dh --help --json
jcheck "--help --json" 'j["help"].startswith("usage: rxnheat dh")'
run help frobnicate
expect_rc "help of an unknown command" 2
run --version
expect_rc "--version" 0
expect_out_re "--version text" 'rxnheat'

# ==== user species table ==================================================================================
# An invented value for H2O(l) (not data): the table row must override the built-in record.
printf 'formula,phase,dHf,source\nH2O,l,-280.0,test table\n' >"$TMP/table.csv"
run dh "H2(g) + 1/2 O2(g) -> H2O(l)" --table "$TMP/table.csv" --json
expect_rc "--table" 0
# H2(g) and O2(g) are reference elements (ΔfH° = 0), so ΔrH° is the table's ΔfH°.
jcheck "--table overrides the built-in row" 'abs(j["value"] + 280.0) < 1e-6 and any(s["record"] == "user table" for s in j["sources"])'
printf 'formula,phase,dHf\nH2O,l,lots\n' >"$TMP/badtable.csv"
run dh "H2(g) + 1/2 O2(g) -> H2O(l)" --table "$TMP/badtable.csv" --json
expect_rc "malformed table" 2
jcheck "malformed table names row and column" 'j["error_kind"] == "table" and "2" in j["error"] and "dHf" in j["error"]'
# A table saved as "CSV UTF-8" by a spreadsheet starts with a UTF-8 byte-order mark (EF BB BF)
# and may end its lines with CRLF; a quoted cell may hold a comma. Same invented row as above.
printf '\xef\xbb\xbfformula,phase,dHf,source\r\nH2O,l,-280.0,"test table, saved with a mark"\r\n' >"$TMP/bomtable.csv"
run dh "H2(g) + 1/2 O2(g) -> H2O(l)" --table "$TMP/bomtable.csv" --json
expect_rc "--table with a byte-order mark" 0
jcheck "--table with a byte-order mark: its row is used" 'abs(j["value"] + 280.0) < 1e-6 and any(s["record"] == "user table" for s in j["sources"])'
run dh "H2(g) + 1/2 O2(g) -> H2O(l)" --table "$TMP/bomtable.csv"
expect_rc "--table with a byte-order mark (text)" 0
expect_out_re "--table with a byte-order mark (text): the table's value" '^-280 kJ/mol'
bad "--table on a directory" table "directory" dh "$METHANE" --table "$TMP"
printf 'formula,phase,dHf,name\nH2O,l,-280.0,"water\n' >"$TMP/unclosedtable.csv"
bad "--table with an unclosed quote" table 'row 2: .*starts on line 2 is not closed' dh "$METHANE" --table "$TMP/unclosedtable.csv"
printf 'formula,phase,dHf\nH2O,l,-28"0.0\n' >"$TMP/quotetable.csv"
bad "--table with a stray quote" table 'row 2: .*unquoted field \(cell 3\)' dh "$METHANE" --table "$TMP/quotetable.csv"

# ==== the catalogue's own commands: hf, cp, sensible, molarmass, source, version, why, functions ==========
run molarmass "CuSO4·5H2O"
expect_rc "molarmass CuSO4·5H2O" 0
# python3-periodictable: CuSO4(H2O)5 = 249.685 g/mol with its (older IUPAC) weights; the current
# conventional weights (H 1.008, O 15.999, S 32.06) give 249.677, so the check allows 0.01.
M_BLUE=$(molar_mass 'CuSO4(H2O)5')
expect_out_re "molarmass CuSO4·5H2O text" '^249\.6[6-9][0-9]* g/mol$'
run molarmass "CuSO4·5H2O" --json
jcheck "molarmass --json fields" 'j["unit"] == "g/mol" and j["function"] == "MOLARMASS" and j["input"] == {"formula": "CuSO4·5H2O"}'
expect_close "molarmass CuSO4·5H2O value (periodictable)" "$(jval value)" "$M_BLUE" 0.01
run molarmass "Ca(OH)2" --json
expect_close "molarmass Ca(OH)2 (periodictable)" "$(jval value)" "$(molar_mass 'Ca(OH)2')" 0.005
bad "molarmass of a formula that does not parse" syntax '.' molarmass "Ca(OH"

run hf "CO2(g)" --json
expect_rc "hf CO2(g)" 0
# ΔfH° CO2(g) = −393.51 ± 0.13 kJ/mol: CODATA Key Values (Cox et al. 1989).
jcheck "hf CO2(g) value" 'abs(j["value"] + 393.51) <= 0.15 and j["unit"] == "kJ/mol" and j["function"] == "SPECIESHF" and j["temperature_K"] == 298.15'
HF_CO2=$(jval value)
run hf "CO2(g)"
expect_out "hf text" "$("$PY" -c 'import sys; print("%.6g kJ/mol" % float(sys.argv[1]))' "$HF_CO2")"
run hf "CO2(g)" -u kcal/mol --json
expect_close "hf kcal/mol (GNU units)" "$(jval value)" "$("$PY" -c "print($HF_CO2*$(units_factor kJ/mol kcal/mol))")" 1e-4
# The invented table above makes ΔfH° H2O(l) −280.0 kJ/mol.
run hf "H2O(l)" --table "$TMP/table.csv" --json
jcheck "hf --table" 'abs(j["value"] + 280.0) < 1e-9 and j["input"]["table"].endswith("table.csv")'

run cp "H2O(l)" 298.15 --json
expect_rc "cp H2O(l)" 0
# Cp° H2O(l) 75.3 J/(mol·K) at 298.15 K: NIST-JANAF 4th ed. (1998), from memory.
jcheck "cp H2O(l) value" 'abs(j["value"] - 75.3) <= 0.3 and j["unit"] == "J/(mol·K)" and j["input"]["temperature"] == "298.15"'
run cp "CO2(g)" "726.85 C" --json
# Cp° CO2(g) at 1000 K: 54.31 J/(mol·K), NIST-JANAF 4th ed. (1998), from memory; 726.85 °C = 1000 K
# (GNU units tempC(726.85)).
jcheck "cp CO2(g) at 726.85 C" "abs(j['value'] - 54.31) <= 0.1 and abs(j['temperature_K'] - $(units -t 'tempC(726.85)' K)) < 1e-9"
run cp "CO2(g)"
expect_rc "cp without its temperature" 2
expect_err_re "cp without its temperature: names it" 'missing TEMP'

run sensible "CO2(g)" 1000 --json
expect_rc "sensible CO2(g) 1000 K" 0
# H°(1000 K) − H°(298.15 K) of CO2(g): 33.40 kJ/mol, NIST-JANAF (1998), from memory.
jcheck "sensible CO2(g) value" 'abs(j["value"] - 33.40) <= 0.1 and j["unit"] == "kJ/mol" and j["function"] == "SPECIESH"'
run sensible "CO2(g)" 1000 --tref 1000
expect_out "sensible with Tref = T is 0" "0 kJ/mol"
# NASA Glenn gas records start at 200 K (NASA/TP-2002-211556).
run sensible "CO2(g)" 150
expect_rc "sensible below the data" 2
expect_err_re "sensible below the data: words" '150 K'

run source "CO2(g)"
expect_rc "source CO2(g)" 0
expect_out_re "source names NASA Glenn" 'NASA'
run source "$METHANE" --json
jcheck "source --json" 'j["function"] == "RXNSOURCE" and "NASA" in j["result"] and j["input"]["reaction_or_species"].startswith("CH4")'

run version
expect_rc "version" 0
expect_out_re "version: host and version" '^rxnheat command line [0-9]+\.[0-9]+\.[0-9]+; engine '
run version --json
jcheck "version --json" 'j["function"] == "RXNVERSION" and j["result"].startswith("rxnheat command line") and j["input"] == {}'

run why RXNDH "$METHANE"
expect_rc "why RXNDH ok: exit 0" 0
expect_out "why RXNDH ok" "ok"
run why RXNLOAD "$METHANE" 500 kg/hour CH4 kW
expect_rc "why RXNLOAD kg/hour: exit 2" 2
expect_out_re "why RXNLOAD names kg/hour" 'kg/hour'
run why RXNLOAD "$METHANE" 500 kg/hour CH4 kW --json
expect_rc "why --json: exit 2" 2
jcheck "why --json" 'j["ok"] is False and "kg/hour" in j["result"] and j["function"] == "RXNWHY" and j["input"]["function"] == "RXNLOAD" and j["input"]["arguments"][1] == "500"'
run why load "$METHANE" 500 kg/h CH4 kW
expect_out "why by command name, a good call" "ok"
run why RXNLOAD "$METHANE" lots kg CH4
expect_rc "why: a quantity that is no number" 2
expect_out_re "why: names the quantity" 'quantity.*lots'
# A table argument is a file name: the invented table above is fine, the malformed one is not.
run why RXNDH "H2(g) + 1/2 O2(g) -> H2O(l)" "" "" "" "$TMP/table.csv"
expect_out "why with a table file" "ok"
run why RXNDH "H2(g) + 1/2 O2(g) -> H2O(l)" "" "" "" "$TMP/badtable.csv"
expect_rc "why with a malformed table file" 2
expect_out_re "why with a malformed table file: words" 'dHf'
run why RXNFROB "$METHANE"
expect_rc "why of an unknown function" 2
expect_out_re "why of an unknown function: lists the functions" 'RXNDH'
run why
expect_rc "why without FUNCTION" 2
expect_err_re "why without FUNCTION: names it" 'missing FUNCTION'

run functions
expect_rc "functions" 0
expect_out_re "functions lists RXNDH and its command" '^RXNDH +dh '
run functions --json
expect_rc "functions --json" 0
cp "$TMP/out" "$TMP/functions.json"
# The cell names of engine/FUNCTIONS.md that exist today, listed here by hand (not read from the program).
pycheck "functions --json: every known cell name, nothing unknown" "$TMP/functions.json" <<'PYEOF'
import json, sys
j = json.load(open(sys.argv[1], encoding="utf-8"))
known = "RXNDH RXNDU RXNDS RXNDG RXNLOGK RXNLOAD RXNKIND RXNCHECK RXNBALANCE RXNREVERSE RXNSCALE RXNWHY SPECIESHF SPECIESCP SPECIESH MOLARMASS RXNEQX RXNHESS RXNHESSPLAN STEAMTSAT STEAMPSAT STEAMH STEAMLATENT FUELHV STREAMH RXNDUTY RXNTAD RXNSOURCE RXNVERSION".split()
names = [f["calc_name"] for f in j["functions"]]
assert sorted(names) == sorted(known), sorted(set(names) ^ set(known))
for f in j["functions"]:
    assert set(f) == {"calc_name", "cli_command", "idl_method", "summary", "layers", "arguments"}, f
    assert f["summary"] and set(f["layers"]) <= {"calc", "cli", "c"}, f
    for a in f["arguments"]:
        assert set(a) == {"name", "kind", "required", "default", "option", "repeated"} and isinstance(a["required"], bool), a
        assert a["option"] is None or a["option"].startswith("--"), a
dh = [f for f in j["functions"] if f["calc_name"] == "RXNDH"][0]
assert dh["cli_command"] == "dh" and dh["idl_method"] == "rxnDH", dh
assert [a["name"] for a in dh["arguments"]] == ["reaction", "temperature", "unit", "per", "table"], dh["arguments"]
assert dh["arguments"][1]["default"] == "298.15 K" and dh["arguments"][0]["default"] is None
# How the command takes each argument (dh --help: REACTION positional, -T/--temperature, --per).
assert [a["option"] for a in dh["arguments"]] == [None, "--temperature", "--unit", "--per", "--table"], dh["arguments"]
hess = [f for f in j["functions"] if f["calc_name"] == "RXNHESS"][0]
assert [(a["option"], a["repeated"]) for a in hess["arguments"]] == [(None, False), ("--step", True), ("--dh", True), ("--unit", False)], hess
PYEOF
# One command per line: a command of a group is two words ("steam tsat"), split on purpose below.
while IFS= read -r cmd; do
    # shellcheck disable=SC2086
    run $cmd --help
    expect_rc "$cmd --help" 0
    expect_out_re "$cmd --help: usage line" "^usage: rxnheat $cmd( |\$)"
    expect_out_re "$cmd --help: exit status" '^Exit status: 0 success'
done < <("$PY" -c 'import json,sys; print("\n".join([f["cli_command"] for f in json.load(open(sys.argv[1]))["functions"] if f["cli_command"]] + ["species", "batch", "functions"]))' "$TMP/functions.json")
run load --help
expect_out_re "load --help has the caution" 'CAUTION'
expect_out_re "load --help lists QUANTITY_UNIT" '^  QUANTITY_UNIT '
run dh --help
expect_out_re "dh --help gives the default temperature" '298\.15 K'
if "$PY" -c 'import sys; sys.exit(any(len(l) > 78 for l in open(sys.argv[1], encoding="utf-8").read().splitlines()[1:]))' "$TMP/out"; then pass; else fail "dh --help: lines after the usage line wrapped at 78 columns"; fi
run --help
expect_out_re "--help lists why" '^  why '
expect_out_re "--help lists functions" '^  functions '

# ==== batch ===============================================================================================
{
    printf '\xef\xbb\xbfreaction,temperature,unit\r\n'                      # BOM, header, CRLF
    printf '%s\r\n' "$METHANE"                                              # line 2
    printf '"%s",1000\n' "$SHIFT"                                           # line 3
    printf '\n'                                                             # line 4: blank, skipped
    printf '"H2(g) + O2(g) -> H2O(l)",,\n'                                  # line 5: unbalanced
    printf 'CH₄(g) + 2O₂(g) → CO₂(g) + 2H₂O(l),"25 C",kcal/mol\n'          # line 6: UTF-8
    printf '"%s","350 C"\n' "$SHIFT"                                        # line 7
    printf '"%s",150\n' "$SHIFT"                                            # line 8: below 200 K
    printf '"bad, ""quoted"" reaction",300\n'                               # line 9: comma, quotes
    printf '"%s",300,kJ/mol,extra\n' "$SHIFT"                               # line 10: 4 cells
    printf ',,\n'                                                           # line 11: skipped
    printf '"%s",,MJ/bogus\n' "$SHIFT"                                      # line 12: unit
    printf '"two\nlines -> x"\n'                                            # lines 13-14
    printf '%s' "$SHIFT"                                                    # line 15, no newline
} >"$TMP/batch.csv"
run batch "$TMP/batch.csv"
expect_rc "batch: exit 0 with bad rows" 0
expect_err_re "batch: bad rows counted on stderr" '6 of 11 rows'
cp "$TMP/out" "$TMP/batch1.out"
pycheck "batch: rows, values and errors" "$TMP/batch1.out" "$DH_METHANE" "$DH_SHIFT_1000" "$V_K" "$(units_factor kJ/mol kcal/mol)" <<'EOF'
import csv, sys
rows = list(csv.reader(open(sys.argv[1], newline="", encoding="utf-8")))
dh_methane, dh_shift_1000, dh_shift_623, kcal = map(float, sys.argv[2:6])
assert rows[0] == ["line", "reaction", "temperature_K", "value", "unit", "kind", "error"], rows[0]
body = rows[1:]
assert [r[0] for r in body] == ["2", "3", "5", "6", "7", "8", "9", "10", "12", "13", "15"], [r[0] for r in body]
by = {r[0]: r for r in body}
def ok(r): return r[6] == "" and r[3] != ""
assert ok(by["2"]) and abs(float(by["2"][3]) - dh_methane) < 1e-9 and by["2"][4] == "kJ/mol" and by["2"][5] == "exothermic"
assert ok(by["3"]) and abs(float(by["3"][3]) - dh_shift_1000) < 1e-9 and float(by["3"][2]) == 1000
assert not ok(by["5"]) and "balanced" in by["5"][6]
# 25 °C = 298.15 K; kcal/mol via GNU units; the Unicode form is the same reaction.
assert ok(by["6"]) and abs(float(by["6"][2]) - 298.15) < 1e-9 and abs(float(by["6"][3]) - dh_methane * kcal) < 1e-4
assert by["6"][1] == "CH₄(g) + 2O₂(g) → CO₂(g) + 2H₂O(l)"       # UTF-8 passed through
assert ok(by["7"]) and abs(float(by["7"][3]) - dh_shift_623) < 1e-9
assert not ok(by["8"]) and "150" in by["8"][6]
assert by["9"][1] == 'bad, "quoted" reaction' and not ok(by["9"])
assert not ok(by["10"]) and "4 cells" in by["10"][6]
assert not ok(by["12"]) and "bogus" in by["12"][6]
assert by["13"][1] == "two\nlines -> x" and not ok(by["13"])
assert ok(by["15"]) and abs(float(by["15"][3]) - (-41.16)) < 0.3   # shift at 298.15 K, NIST-JANAF, from memory
EOF

run_in "$TMP/batch.csv" batch - --threads 2
expect_rc "batch stdin --threads 2" 0
if cmp -s "$TMP/out" "$TMP/batch1.out"; then pass; else fail "batch --threads 2 output differs from 1 thread"; fi
run_in "$TMP/batch.csv" batch - --threads 5  # a reading thread, the main one and 3 helpers
if cmp -s "$TMP/out" "$TMP/batch1.out"; then pass; else fail "batch --threads 5 output differs from 1 thread"; fi
run_in "$TMP/batch.csv" batch
if cmp -s "$TMP/out" "$TMP/batch1.out"; then pass; else fail "batch without FILE reads standard input"; fi

run batch "$TMP/batch.csv" --json
expect_rc "batch --json" 0
jcheck "batch --json" 'j["rows"] == 11 and j["failed"] == 6 and len(j["results"]) == 11 and j["results"][0]["line"] == 2 and "error" in j["results"][2]'

run batch -T "350 C" -u J/mol "$TMP/batch.csv" --json
# Defaults for empty cells: the last row (line 15) has no temperature and no unit, so takes both.
jcheck "batch -T/-u defaults" 'j["results"][-1]["unit"] == "J/mol" and abs(j["results"][-1]["temperature_K"] - 623.15) < 1e-9'

# A larger file, several chunks of 1024 rows, 2 threads: order kept, every value equals the
# single-reaction result, in constant memory (max RSS of 2,000 vs 100,000 rows).
"$PY" - "$TMP/many.csv" 100000 <<'EOF'
import sys
rs = ["CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)", "CO(g) + H2O(g) -> CO2(g) + H2(g)", "N2(g) + 3 H2(g) -> 2 NH3(g)"]
with open(sys.argv[1], "w") as f:
    for i in range(int(sys.argv[2])):
        f.write('"%s",%d\n' % (rs[i % 3], 300 + i % 900))
EOF
head -n 2000 "$TMP/many.csv" >"$TMP/few.csv"
pycheck "batch 100000 rows in order, constant memory" "$BIN" "$TMP/few.csv" "$TMP/many.csv" "$TMP/many.out" <<'EOF'
import csv, resource, subprocess, sys
binary, few, many, out = sys.argv[1:5]
def rss(path, dest):
    before = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss
    with open(dest, "wb") as o:
        p = subprocess.run([binary, "batch", path, "--threads", "2"], stdout=o, stderr=subprocess.DEVNULL, timeout=300)
    assert p.returncode == 0, p.returncode
    return resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss
small = rss(few, out)
large = rss(many, out)
rows = list(csv.reader(open(out, newline="")))[1:]
assert len(rows) == 100000, len(rows)
assert [int(r[0]) for r in rows] == list(range(1, 100001)), "order"
assert all(r[6] == "" for r in rows), [r for r in rows if r[6]][:1]
assert [int(float(r[2])) for r in rows[:1000]] == [300 + i % 900 for i in range(1000)]
# ru_maxrss is in KiB; the RUSAGE_CHILDREN maximum only grows, so 'large' is the bigger run's peak.
assert large - small < 16 * 1024, (small, large)
print("batch 100000 rows: max RSS %d KiB (2000 rows: %d KiB)" % (large, small))
EOF
# Spot checks of the large output against single calls.
for n in 1 2 3 899 90001; do
    row=$(sed -n "$((n + 1))p" "$TMP/many.out")
    reaction=$(sed -n "${n}p" "$TMP/many.csv" | "$PY" -c 'import csv,sys; print(next(csv.reader(sys.stdin))[0])')
    temp=$(sed -n "${n}p" "$TMP/many.csv" | "$PY" -c 'import csv,sys; print(next(csv.reader(sys.stdin))[1])')
    run dh "$reaction" -T "$temp" --json
    v=$(echo "$row" | "$PY" -c 'import csv,sys; print(next(csv.reader(sys.stdin))[3])')
    expect_close "batch row $n equals dh -T $temp" "$v" "$(jval value)" 0
done
# The same 100 chunks with 1 and with 3 threads (a reading thread ahead of two computing ones):
# the same bytes.
run batch "$TMP/many.csv" --threads 1
cp "$TMP/out" "$TMP/many1.out"
run batch "$TMP/many.csv" --threads 3
if cmp -s "$TMP/out" "$TMP/many1.out" && cmp -s "$TMP/out" "$TMP/many.out"; then pass; else fail "batch of 100 chunks: --threads 1, 2 and 3 differ"; fi

# Streaming: with standard input held open, the first chunk of 1024 rows is written before the
# input ends; with one thread, and with a reading thread ahead of the computing one.
mkfifo "$TMP/fifo"
for threads in 1 2; do
    timeout 60 "$BIN" batch - --threads "$threads" <"$TMP/fifo" >"$TMP/stream.out" 2>/dev/null &
    BATCH_PID=$!
    exec 3>"$TMP/fifo"
    head -n 1500 "$TMP/many.csv" >&3
    streamed=no
    for _ in $(seq 1 100); do
        if [ "$(wc -l <"$TMP/stream.out")" -ge 1025 ]; then streamed=yes; break; fi
        sleep 0.1
    done
    exec 3>&-
    wait "$BATCH_PID"
    RC=$?
    if [ "$streamed" = yes ]; then pass; else fail "batch --threads $threads streams: first 1024 rows out before the input ended"; fi
    if [ "$RC" -eq 0 ] && [ "$(wc -l <"$TMP/stream.out")" -eq 1501 ]; then pass; else fail "batch --threads $threads streamed run: all rows"; fi
done

run batch "$TMP/no-such.csv"
expect_rc "batch missing file" 2
expect_err_re "batch missing file: words" 'cannot open'
run batch "$TMP"
expect_rc "batch on a directory" 2
run batch "$TMP/batch.csv" --threads lots
expect_rc "batch bad --threads" 2
run batch "$TMP/batch.csv" --threads 0
expect_rc "batch --threads 0 (one per processor)" 0
# A header-only file and an empty file give just the header row.
printf 'reaction,temperature\n' >"$TMP/header.csv"
: >"$TMP/empty.csv"
run batch "$TMP/header.csv"
expect_out "batch header only" "line,reaction,temperature_K,value,unit,kind,error"
run batch "$TMP/empty.csv" --json
jcheck "batch empty --json" 'j == {"results": [], "rows": 0, "failed": 0}'
# An unterminated quote at the end of the input is an error row, not a hang.
printf '"%s,300\n' "$SHIFT" >"$TMP/unterminated.csv"
run batch "$TMP/unterminated.csv"
expect_rc "batch unterminated quote" 0
expect_out_re "batch unterminated quote: error row" 'not closed'
# A row longer than the 16384-byte limit is an error row; the next row still works.
{ printf '%s\n' "$(printf 'x%.0s' $(seq 20000))"; printf '"%s"\n' "$SHIFT"; } >"$TMP/long.csv"
run batch "$TMP/long.csv" --json
jcheck "batch over-long row" 'j["rows"] == 2 and "longer than" in j["results"][0]["error"] and "value" in j["results"][1]'

# ---- bounded memory and time on hostile input (issue 10, items 6 and 7) -------------------------
# Each is an error in words, under a time limit (no hang) and a peak resident set below 64 MiB
# (GNU time's %M, KiB; the engine and its data take about 8 MiB).
# run_rss SECONDS INPUT ARGS...: the binary with INPUT as standard input under `timeout SECONDS`
# and GNU time; sets RC and RSS_KB.
run_rss() {
    local secs=$1 input=$2
    shift 2
    LAST_ARGS="$* < $input"
    /usr/bin/time -f %M -o "$TMP/rss" timeout "$secs" "$BIN" "$@" <"$input" >"$TMP/out" 2>"$TMP/err"
    RC=$?
    RSS_KB=$(tail -n 1 "$TMP/rss")
}
# RXNHEAT_TEST_RSS_LIMIT_KIB raises the limit for a sanitizer build, whose shadow memory and
# allocator add to every process (.ci/run sets it for the ASan stage); 64 MiB otherwise.
rss_limit_kib=${RXNHEAT_TEST_RSS_LIMIT_KIB:-65536}
expect_rss() {  # NAME: peak RSS below the limit
    if [ "${RSS_KB:-999999999}" -lt "$rss_limit_kib" ]; then pass; else fail "$1: peak RSS ${RSS_KB:-?} KiB, limit $rss_limit_kib KiB"; fi
}
"$PY" -c 'import sys; sys.stdout.write("," * 10**7 + "\n\"CO(g) + H2O(g) -> CO2(g) + H2(g)\"\n")' >"$TMP/commas.csv"
run_rss 20 /dev/null batch "$TMP/commas.csv"
expect_rc "batch, a line of 10^7 commas: exit 0, an error row" 0
expect_out_re "batch, a line of 10^7 commas: words" '^1,.*the row has more than 4096 cells$'
expect_out_re "batch, a line of 10^7 commas: the next row is read" '^2,CO\(g\) \+ H2O\(g\) -> CO2\(g\) \+ H2\(g\),298.15,'
expect_rss "batch, a line of 10^7 commas"
run_rss 20 /dev/zero batch -
expect_rc "batch of /dev/zero: cannot be read, exit 2" 2
expect_err_re "batch of /dev/zero: words" 'no line end'
expect_rss "batch of /dev/zero"
{ echo "formula,phase,dHf"; "$PY" -c 'import sys; sys.stdout.write("," * (5 * 10**6) + "\n")'; } >"$TMP/table-commas.csv"
run_rss 20 /dev/null dh "$METHANE" --table "$TMP/table-commas.csv"
expect_rc "--table with a row of 5x10^6 commas: exit 2" 2
expect_err_re "--table with a row of 5x10^6 commas: words" 'row 2: the row has more than [0-9]+ cells'
expect_rss "--table with a row of 5x10^6 commas"
# 60,000 rows of 100 cells: each row within the limits, the table as a whole is not.
"$PY" -c '
import sys
with open(sys.argv[1], "w") as f:
    f.write("formula,phase,dHf" + "," * 97 + "\n")
    for i in range(60000):
        f.write("H2O,l,-285.83" + "," * 97 + "\n")
' "$TMP/table-wide.csv"
run_rss 20 /dev/null dh "$METHANE" --table "$TMP/table-wide.csv"
expect_rc "--table of 6x10^6 cells: exit 2" 2
expect_err_re "--table of 6x10^6 cells: words" 'more than [0-9,]+ cells'
expect_rss "--table of 6x10^6 cells"
run_rss 20 /dev/null dh "$METHANE" --table /dev/zero
expect_rc "--table /dev/zero: exit 2" 2
expect_err_re "--table /dev/zero: words" "species table file '/dev/zero'.*(longer than|no line end)"
expect_rss "--table /dev/zero"
run_rss 20 /dev/null batch "$TMP/batch.csv" --table /dev/zero
expect_rc "batch --table /dev/zero: exit 2" 2
expect_rss "batch --table /dev/zero"
run dh "$METHANE" --table "$TMP"
expect_rc "--table DIRECTORY: exit 2" 2
expect_err_re "--table DIRECTORY: says it is a directory" 'is a directory'
run batch "$TMP/batch.csv" --table "$TMP"
expect_err_re "batch --table DIRECTORY: says it is a directory" 'is a directory'
# A NUL byte in a cell is written as U+2400 (the symbol for NUL), never as a raw NUL.
printf 'H2\000 + O2 -> H2O,300\n' >"$TMP/nul.csv"
run batch "$TMP/nul.csv"
if "$PY" -c 'import sys; sys.exit(b"\0" in open(sys.argv[1], "rb").read())' "$TMP/out"; then
    pass
else
    fail "batch output holds a raw NUL byte"
fi
expect_out_re "batch NUL: written as the symbol for NUL" $'^1,H2\u2400 \\+ O2 -> H2O,300,'


# =================================================================================================
# Units as the trade writes them (tracker issue 7 item 5): Btu/MMBtu, /hr, Gcal (IT calorie), klb,
# MMscf/MMscfd, Sm3. Kept in this one block, apart from the rest of the file. Outside reference:
# GNU units (`units -d 15 -t`); named definitions where GNU units lacks the unit.
# =================================================================================================
tu_units() { LC_ALL=C units -d 15 -t "$1" "$2"; }  # GNU units, 15 significant digits
expect_rel() {  # NAME A B RELATIVE_TOLERANCE
    if "$PY" -c 'import sys; a,b,t=map(float,sys.argv[1:4]); sys.exit(0 if abs(a-b)<=t*max(abs(a),abs(b)) else 1)' \
        "$2" "$3" "$4"; then pass; else fail "$1: $2 is not within relative $4 of $3"; fi
}
tu_mul() { "$PY" -c 'import sys; print(repr(float(sys.argv[1]) * float(sys.argv[2])))' "$1" "$2"; }

# 10 t/hr of methane: a flow, so the default result is kW.
run load "$METHANE" 10 t/hr CH4 --json
expect_rc "trade units: load t/hr" 0
jcheck "trade units: t/hr is a flow (default kW)" 'j["unit"] == "kW" and j["value"] < 0'
TU_KW=$(jval value)
run load "$METHANE" 10 t/h CH4 --json
expect_out_re "trade units: t/hr = t/h" "\"value\":$TU_KW,"
# Gcal/h is 10^9 IT calories per hour. source: GNU units: calorie_IT, hour
run load "$METHANE" 10 t/hr CH4 -u Gcal/h --json
expect_rc "trade units: -u Gcal/h" 0
jcheck "trade units: -u Gcal/h echoed" 'j["unit"] == "Gcal/h"'
expect_rel "trade units: Gcal/h = kW converted by GNU units (1e9 calorie_IT/hour)" "$(jval value)" \
    "$(tu_mul "$TU_KW" "$(tu_units kW '1e9 calorie_IT/hour')")" 1e-12
TU_GCAL=$(jval value)
run load "$METHANE" 10 t/hr CH4 -u Gcal/hr --json
expect_rel "trade units: Gcal/hr = Gcal/h" "$(jval value)" "$TU_GCAL" 0
# Not the thermochemical Gcal (GNU units' own `Gcal`): the two differ by 0.067 %.
run load "$METHANE" 10 t/hr CH4 -u kcal/h --json
pycheck "trade units: Gcal/h is not 10^6 kcal/h (IT vs thermochemical calorie)" "$(jval value)" "$TU_GCAL" <<'EOF'
import sys
kcal_h, gcal_h = map(float, sys.argv[1:3])
r = (kcal_h / 1e6) / gcal_h
assert abs(r - 4.1868 / 4.184) < 1e-12, r   # calorie_IT / calorie_th (GNU units definitions)
EOF
# MMBtu/h and MMBTU/h are one unit. source: GNU units: btu (= btu_IT), hour
run load "$METHANE" 3 MMscfd CH4 -u MMBtu/h --json
expect_rc "trade units: MMscfd -u MMBtu/h" 0
TU_MMBTU=$(jval value)
run load "$METHANE" 3 MMscfd CH4 -u MMBTU/h --json
expect_rel "trade units: MMBtu/h = MMBTU/h" "$TU_MMBTU" "$(jval value)" 0
run load "$METHANE" 3 MMscfd CH4 -u MMBtu/hr --json
expect_rel "trade units: MMBtu/hr = MMBtu/h" "$TU_MMBTU" "$(jval value)" 0
# MMscfd = MMscf/d = 10^6 scf per day (scf: ideal gas at 60 °F, 14.696 psia; the trade's
# definition, written in GNU units' named constants; GNU units has no MMscf).
run load "$METHANE" 3 MMscfd CH4 --json
jcheck "trade units: MMscfd is a flow (default kW)" 'j["unit"] == "kW"'
TU_MMSCFD_KW=$(jval value)
run load "$METHANE" 3 MMscf/d CH4 --json
expect_rel "trade units: MMscfd = MMscf/d" "$TU_MMSCFD_KW" "$(jval value)" 0
run dh "$METHANE" --json
TU_DH=$(jval value)
expect_rel "trade units: 3 MMscfd of CH4 burnt, in kW (GNU units: 1e6 ft^3, psi, R, tempF, day)" \
    "$TU_MMSCFD_KW" "$(tu_mul "$TU_DH" "$(tu_units '3e6 * 14.696 psi * ft^3 / (R * tempF(60)) / day' 'mol/s')")" 1e-12
expect_rel "trade units: MMBtu/h from MMscfd (GNU units: btu/hour)" "$TU_MMBTU" \
    "$(tu_mul "$TU_MMSCFD_KW" "$(tu_units kW '1e6 btu/hour')")" 1e-12
run load "$METHANE" 2 MMscf CH4 -u MMBtu --json
jcheck "trade units: MMscf is a total, -u MMBtu" 'j["unit"] == "MMBtu" and j["value"] < 0'
# Sm3 (15 °C) against Nm3 (0 °C), both at 101.325 kPa: ideal gas (common practice), the ratio of
# the moles is 288.15/273.15.
run load "$METHANE" 100 Sm3/h CH4 --json
TU_SM3=$(jval value)
run load "$METHANE" 100 Nm3/h CH4 --json
expect_rel "trade units: Nm3/h over Sm3/h = 288.15/273.15" "$("$PY" -c "print($(jval value) / $TU_SM3)")" \
    "$("$PY" -c 'print(288.15 / 273.15)')" 1e-12
run load "$METHANE" 100 Sm3/hr CH4 --json
expect_rel "trade units: Sm3/hr = Sm3/h" "$(jval value)" "$TU_SM3" 0
# klb = 1000 lb (GNU units: klb); klb/hr a mass flow.
run load "$METHANE" 5 klb/hr CH4 --json
TU_KLB=$(jval value)
run load "$METHANE" 5 lb/h CH4 --json
expect_rel "trade units: klb/hr = 1000 lb/h (GNU units klb/lb)" "$TU_KLB" \
    "$(tu_mul "$(jval value)" "$(tu_units klb lb)")" 1e-12
# Btu per mass and per amount beside BTU.
run dh "$METHANE" -u Btu/lb --per CH4 --json
TU_BTULB=$(jval value)
run dh "$METHANE" -u BTU/lb --per CH4 --json
expect_rel "trade units: dh Btu/lb = BTU/lb" "$TU_BTULB" "$(jval value)" 0
run dh "$METHANE" -u Btu/lbmol --json
expect_rel "trade units: dh Btu/lbmol (GNU units: btu, lb/g mol)" "$(jval value)" \
    "$(tu_mul "$TU_DH" "$(tu_units 'kJ/mol' 'btu / ((lb/g) * mol)')")" 1e-12
# Still case-sensitive, with a hint; a one-word flow takes no second time.
run load "$METHANE" 10 t/hr CH4 -u mmbtu/h
expect_rc "trade units: wrong case refused" 2
expect_err_re "trade units: wrong case hint" "did you mean 'MMBTU/h'"
run load "$METHANE" 3 MMSCFD CH4
expect_rc "trade units: MMSCFD refused" 2
expect_err_re "trade units: MMSCFD hint" "did you mean 'MMscfd'"
run load "$METHANE" 3 MMscfd/d CH4
expect_rc "trade units: MMscfd/d refused" 2
expect_err_re "trade units: MMscfd/d words" "already a flow"
run load "$METHANE" 10 t/hr CH4 -u Gcal
expect_rc "trade units: a total unit for a /hr flow" 2
expect_err_re "trade units: a total unit for a /hr flow, words" "is a flow"
run load "$METHANE" 10 kg/hour CH4
expect_rc "trade units: kg/hour refused" 2
expect_err_re "trade units: unknown unit lists Sm3 and MMscfd" "Sm3.*MMscfd"
# ---- end of the trade-units block ----------------------------------------------------------------

# ---- the generated command table of cli/CLI.md matches each command's own usage line ------------
CLI_MD="$(dirname "$0")/../../cli/CLI.md"
while IFS=$'\t' read -r cmd args; do
    # shellcheck disable=SC2086
    run $cmd --help  # a command of a group is two words ("steam tsat")
    usage=$(head -n 1 "$TMP/out")
    want="usage: rxnheat $cmd${args:+ $args}"
    if [ "$usage" == "$want" ]; then pass; else fail "CLI.md row for $cmd: '$want' vs --help '$usage'"; fi
done < <("$PY" - "$CLI_MD" <<'EOF'
import re, sys
text = open(sys.argv[1], encoding="utf-8").read()
body = text.split("<!-- commands: generated from the catalogue, do not edit -->")[1].split("<!-- end of commands -->")[0]
for line in body.splitlines():
    m = re.match(r"\| `([a-z]+(?: [a-z]+)?)` \| (?:`(.*?)`)? \|", line)
    if m:
        print("%s\t%s" % (m.group(1), (m.group(2) or "").replace("\\|", "|")))
EOF
)

# ---- species of a user-table row with only dHf: what the table has, exit 0 -------------------------
printf 'formula,phase,dHf\nXeF6,g,-279\n' > "$TMP/only-dhf.csv"   # an invented demo row
run species "XeF6(g)" --table "$TMP/only-dhf.csv"
expect_rc "species: a table row with only dHf exits 0" 0
expect_out_re "species: a table row with only dHf prints it" '-279 kJ/mol'
run species "XeF6(g)" --table "$TMP/only-dhf.csv" --json
jcheck "species --json: a table row with only dHf" 'j["dHf_kJ_per_mol"] == -279 and j["Cp_J_per_molK"] is None'

# ---- eqx: equilibrium conversion of one reaction from a feed ----------------------------------------
NH3="N2(g) + 3 H2(g) -> 2 NH3(g)"
run eqx "$NH3" 700 200 N2=1 H2=3
expect_rc "eqx ammonia: exit 0" 0
x200=$(out)
run eqx "$NH3" 700 50 N2=1 H2=3
x50=$(out)
# Common practice: more pressure, more ammonia (fewer moles of gas on the product side).
if "$PY" -c 'import sys; sys.exit(0 if float(sys.argv[1]) > float(sys.argv[2]) > 0 else 1)' "$x200" "$x50"; then pass; else fail "eqx: 200 bar ($x200) above 50 bar ($x50)"; fi
# The same feed as repeated --feed options, the pressure in MPa, the temperature in C: the same number.
run eqx "$NH3" "426.85 C" "20 MPa" --feed N2=1 --feed H2=3
expect_rc "eqx --feed options: exit 0" 0
expect_out "eqx --feed options, MPa, C: same value" "$x200"
run eqx "$NH3" 700 200 N2=1 --feed H2=3 --json
expect_rc "eqx --json" 0
jcheck "eqx --json value" "j['function'] == 'RXNEQX' and abs(j['value'] - $x200) < 1e-6 and j['unit'] == '' and j['input']['feed'] == ['N2=1'] and j['input']['feed_options'] == ['H2=3']"
# Argon as an inert lowers it (common practice: dilution acts like a lower pressure).
run eqx "$NH3" 700 200 N2=1 H2=3 Ar=1
xar=$(out)
if "$PY" -c 'import sys; sys.exit(0 if float(sys.argv[1]) < float(sys.argv[2]) else 1)' "$xar" "$x200"; then pass; else fail "eqx: argon ($xar) below none ($x200)"; fi
run eqx "$NH3" 700 200 N2=1 H2=3 --key H2
expect_out "eqx --key H2 (1:3 feed converts alike)" "$x200"
# N2O4 <=> 2 NO2 at 298.15 K and 1 bar: ξ = sqrt(K/(K+4)) with ΔrG° 4.73 kJ/mol (NBS tables,
# Wagman et al. 1982, from memory): about 0.19.
run eqx "N2O4(g) <=> 2 NO2(g)" 298.15 1 N2O4=1
expect_rc "eqx N2O4: exit 0" 0
expect_close "eqx N2O4 dissociation near 0.19" "$(out)" 0.19 0.02
# Bad input: exit 2 with words.
run eqx "$NH3" 700 200 NH3=1
expect_rc "eqx feed without reactants: exit 2" 2
expect_err_re "eqx feed without reactants: words" 'the feed has no N2\(g\), a reactant'
run eqx "$NH3" 700 "150 psi" N2=1 H2=3
expect_rc "eqx psi: exit 2" 2
expect_err_re "eqx psi: absolute or gauge" 'psia or psig'
run eqx "$NH3" 700 0 N2=1 H2=3
expect_rc "eqx zero pressure: exit 2" 2
expect_err_re "eqx zero pressure: words" "the pressure '0' is not above zero absolute"
run eqx "$NH3" 700 200 N2 H2=3
expect_rc "eqx feed word without =: exit 2" 2
expect_err_re "eqx feed word without =: words" "SPECIES=MOL, e.g. N2=1, not 'N2'"
run eqx "$NH3" 700 200
expect_rc "eqx without a feed: exit 2" 2
expect_err_re "eqx without a feed: words" 'feed.* is required'
run eqx "$NH3" 700 200 N2=1 H2=3 Zz9=1
expect_rc "eqx unknown feed species: exit 2" 2
expect_err_re "eqx unknown feed species: named" 'Zz'
run eqx "$NH3" 700 200 N2=1 H2=lots
expect_rc "eqx feed amount not a number: exit 2" 2
expect_err_re "eqx feed amount not a number: words" "amount of 'H2' must be a number"
run eqx --help
expect_out_re "eqx --help: feed as words or --feed" '--feed SPECIES=MOL'
# ---- end of the eqx block ----------------------------------------------------------------------------
# ==== hess, hess-plan: Hess's law from the user's own steps ============================================
# CODATA Key Values (Cox et al. 1989): ΔfH°(CO2, g) = −393.51, ΔfH°(CO, g) = −110.53 kJ/mol, so
# CO + ½ O2 → CO2 is −282.98; the target C + ½ O2 → CO is (1) − (2).
CO_T="C(s) + 1/2 O2(g) -> CO(g)"
S1="C(s) + O2(g) -> CO2(g)"
S2="CO(g) + 1/2 O2(g) -> CO2(g)"
run hess "$CO_T" --step "$S1" --dh -393.51 --step "$S2" --dh -282.98
expect_rc "hess: exit 0" 0
expect_close "hess: CODATA ΔfH°(CO, g)" "$(out | cut -d' ' -f1)" -110.53 1e-9
expect_out_re "hess text: unit" '^-110\.53[0-9]* kJ/mol'
run hess "$CO_T" --step "$S1" --dh -94.0511 --step "$S2" --dh -67.6338 -u kcal/mol --json
expect_rc "hess kcal/mol --json" 0
jcheck "hess --json: value, unit, steps in order" "j['function'] == 'RXNHESS' and abs(j['value'] - (-94.0511 + 67.6338)) < 1e-9 and j['unit'] == 'kcal/mol' and j['input']['steps_options'] == ['$S1', '$S2']"
run hess-plan "$CO_T" --step "$S1" --step "$S2"
expect_rc "hess-plan: exit 0" 0
expect_out "hess-plan: the combination" "1×(1) − 1×(2)"
run hess "$CO_T" --step "$S1" --dh -393.51
expect_rc "hess, CO in no step: exit 2" 2
expect_err_re "hess, CO in no step: words" "no combination.*'CO\(g\)'"
run hess "$CO_T" --step "$S1" --dh -393.51 --step "$S2"
expect_rc "hess, a step without ΔH: exit 2" 2
expect_err_re "hess, a step without ΔH: words" "2 cells and 'step_dh' 1"
run hess "$CO_T" --step "$S1" --dh about --step "$S2" --dh -282.98
expect_rc "hess, ΔH not a number: exit 2" 2
expect_err_re "hess, ΔH not a number: words" "--dh cell 1: must be a number, not 'about'"
run hess "$CO_T" --step "$S1" --dh -393.51 --step "$S2" --dh -282.98 --step "2 CO(g) + O2(g) -> 2 CO2(g)" --dh -566
expect_rc "hess, dependent steps that disagree: exit 2" 2
expect_err_re "hess, dependent steps that disagree: words" 'dependent.*do not cancel'
run hess "$CO_T"
expect_rc "hess without steps: exit 2" 2
expect_err_re "hess without steps: words" "^rxnheat hess: --step is required$"
run hess --help
expect_out_re "hess --help: --step and --dh, repeated and required" '^usage: rxnheat hess TARGET --step REACTION\.\.\. --dh DH\.\.\. \[-u UNIT\]$'
# ---- end of the hess block ---------------------------------------------------------------------------
# ==== hv: heating value of a fuel or a fuel-gas composition ==========================================
# Methane: −ΔcH° 890.7 kJ/mol (NIST WebBook, from memory), over 16.043 g/mol: 55.5 MJ/kg.
run hv "CH4(g)" --json
expect_rc "hv methane: exit 0" 0
jcheck "hv methane 55.5 MJ/kg (NIST WebBook ΔcH°, from memory)" 'abs(j["value"] - 55.5) <= 0.1 and j["unit"] == "MJ/kg" and j["function"] == "FUELHV"'
run hv "CH4(g)" -u kJ/mol
expect_close "hv methane kJ/mol (NIST WebBook, from memory)" "$(out | cut -d' ' -f1)" 890.7 0.9
HV_MOL=$(out | cut -d' ' -f1)
run hv "CH4(g)" --basis lhv -u kJ/mol
# LHV = HHV − 2 × 44.004 kJ/mol (CODATA Key Values ΔfH° H2O(g), H2O(l), from memory).
expect_close "hv methane LHV = HHV − 2 ΔvapH° of water" "$(out | cut -d' ' -f1)" "$("$PY" -c "print($HV_MOL - 2*44.004)")" 0.05
# The natural gas of issue 9 as SPECIES=FRACTION words, per Sm3: the parts summed here with the
# ideal-gas molar density at 15 °C and 101.325 kPa from GNU units.
SM3=$(units -d 15 -t 'atm / (R * tempC(15))' 'mol/m^3')
C2H6_MOL=$(timeout 10 "$BIN" hv "C2H6(g)" -u kJ/mol | cut -d' ' -f1)
run hv CH4=0.95 C2H6=0.03 N2=0.02 -u MJ/Sm3
expect_rc "hv natural gas: exit 0" 0
expect_out_re "hv natural gas somewhat above 36 MJ/Sm3" '^3[6-8]\.[0-9]+ MJ/Sm3$'
# The parts as printed (6 digits), so within 1e-4 MJ/Sm3.
expect_close "hv natural gas per Sm3 = sum of its parts (GNU units)" "$(out | cut -d' ' -f1)" \
    "$("$PY" -c "print((0.95*$HV_MOL + 0.03*$C2H6_MOL) * $SM3 / 1000)")" 1e-4
run hv CH4=95 C2H6=3 N2=2 -u MJ/Sm3 --json
jcheck "hv mol % --json: the words as given" 'j["input"]["fuel"] == ["CH4=95", "C2H6=3", "N2=2"] and 36 < j["value"] < 39'
# Bad input: exit 2 with words.
run hv CH4=0.95 C2H6=0.03
expect_rc "hv sum off by 2 %: exit 2" 2
expect_err_re "hv sum off: gives the sum" 'sum to 0.98'
run hv CH4 C2H6=0.03
expect_rc "hv species among fractions: exit 2" 2
expect_err_re "hv species among fractions: words" "SPECIES=FRACTION"
run hv "Zz9"
expect_rc "hv unknown species: exit 2" 2
expect_err_re "hv unknown species: named" 'Zz'
run hv CH4 --basis GHV
expect_rc "hv bad basis: exit 2" 2
expect_err_re "hv bad basis: words" 'HHV .*LHV'
run hv CH4 -u MJ/m3
expect_rc "hv bad unit: exit 2" 2
expect_err_re "hv bad unit: conditions needed" 'Nm3'
run hv methanol -u MJ/Nm3
expect_rc "hv liquid per gas volume: exit 2" 2
expect_err_re "hv liquid per gas volume: words" 'not a gas at 25'
run hv
expect_rc "hv without a fuel: exit 2" 2
run hv --help
expect_out_re "hv --help: usage" 'FUEL\|SPECIES=FRACTION\.\.\.'
# ---- end of the hv block -----------------------------------------------------------------------------
# ---- streamh, duty, tad: stream enthalpy, reactor duty, adiabatic temperature -----------------------
SHIFT="CO(g) + H2O(g) -> CO2(g) + H2(g)"
CH4_AIR="CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)"
# An element in its reference state at 298.15 K has H = 0 (the formation basis).
run streamh 298.15 O2=3 N2=7
expect_rc "streamh elements at 298.15 K: exit 0" 0
expect_out "streamh elements at 298.15 K: 0 kW" "0 kW"
# 3.6 kmol/h = 1 mol/s (GNU units: kmol/hr -> mol/s), so the kW are ΔfH°(CO2) in kJ/mol: the CODATA
# Key Values (Cox et al. 1989) value −393.51 kJ/mol, from memory.
KMOLH=$(units -d 15 -t 'kmol/hr' 'mol/s')
run streamh 298.15 "CO2(g)=$("$PY" -c "print(1/$KMOLH)")" --json
expect_rc "streamh CO2 --json" 0
jcheck "streamh 1 mol/s CO2 = ΔfH° in kW (CODATA, from memory)" 'abs(j["value"] - (-393.51)) < 0.01 and j["unit"] == "kW" and j["function"] == "STREAMH"'
run streamh 800 --stream CH4=10 --stream N2=5 --flow-unit kmol -u MJ
expect_rc "streamh --stream options, a total in MJ" 0
expect_out_re "streamh total in MJ" '^-?[0-9.e+-]+ MJ$'
run streamh 800 CH4=10 --flow-unit kmol -u kW
expect_rc "streamh a total in kW: exit 2" 2
expect_err_re "streamh a total in kW: words" 'is a total, not a flow'
# duty at one temperature = load of the amount converted (the identity of RXNDUTY).
run duty "$SHIFT" 0.8 CO 600 600 CO=100 H2O=300 N2=10 --json
expect_rc "duty shift at 600 K" 0
DUTY_600=$(jval value)
run load "$SHIFT" 80 kmol/h CO -T 600 --json
expect_close "duty at T_in = T_out is load of the converted CO" "$DUTY_600" "$(jval value)" 1e-9
# duty = streamh(out) − streamh(in), the outlet written out by hand.
run duty "$SHIFT" 0.8 CO 500 "326.85 C" CO=100 H2O=300 N2=10 --json
D=$(jval value)
run streamh 600 CO=20 H2O=220 CO2=80 H2=80 N2=10 --json
OUT=$(jval value)
run streamh 500 CO=100 H2O=300 N2=10 --json
IN=$(jval value)
expect_close "duty = streamh(out) - streamh(in)" "$D" "$("$PY" -c "print($OUT - ($IN))")" 1e-9
run duty "$SHIFT" 0.8 CO 500 600 CO=100 H2O=50
expect_rc "duty water runs out: exit 2" 2
expect_err_re "duty water runs out: names it and the amounts" 'H2O\(g\) runs out: .*needs 80 kmol/h of H2O\(g\), and the feed has 50 kmol/h'
run duty "$SHIFT" 1.5 CO 500 600 CO=100 H2O=300
expect_rc "duty conversion 1.5: exit 2" 2
expect_err_re "duty conversion 1.5: words" 'the conversion must be a fraction from 0 to 1'
run duty "$SHIFT" 0.5 CO2 500 600 CO=100 H2O=300
expect_err_re "duty key a product: words" 'is a product'
run duty "$SHIFT" 0.5 CO 500 600 CO=100 H2O=300 Zq7=1
expect_rc "duty unknown feed species: exit 2" 2
expect_err_re "duty unknown feed species: named" 'Zq'
# tad: methane in air (3.76 N2 per O2, common practice); no-dissociation flame temperature about
# 2320-2330 K (combustion textbooks, from memory).
run tad "$CH4_AIR" 298.15 --extra N2=7.52 --json
expect_rc "tad methane-air" 0
jcheck "tad methane-air near 2325 K (from memory)" 'abs(j["value"] - 2325) < 15 and j["unit"] == "K" and j["function"] == "RXNTAD"'
TAD=$(jval value)
run duty "$CH4_AIR" 1 CH4 298.15 "$TAD" CH4=1 O2=2 N2=7.52 --json
expect_close "duty to the tad answer is zero" "$(jval value)" 0 1e-3
run tad "$CH4_AIR" "25 C" --extra N2=7.52 --conversion 0.5
expect_rc "tad --conversion 0.5" 0
# N2 written on both sides (carried through the burner): fed and heated, the same answer as
# --extra N2=7.52, not the pure-O2 flame of its net coefficient 0.
run tad "CH4(g) + 2 O2(g) + 7.52 N2(g) -> CO2(g) + 2 H2O(g) + 7.52 N2(g)" 298.15 --json
expect_close "tad with N2 on both sides = tad --extra N2=7.52" "$(jval value)" "$TAD" 1e-9
run tad "$CH4_AIR" 298.15 N2=7.52
expect_rc "tad extra feed only as --extra: exit 2" 2
run tad "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)" 298.15 --extra N2=7.52
expect_rc "tad liquid water: outside the data, exit 2" 2
expect_err_re "tad liquid water: words" 'the adiabatic temperature lies above'
run tad --help
expect_out_re "tad --help: --extra and the caution" '--extra SPECIES=MOL'
expect_out_re "tad --help: the caution" 'CAUTION: a screening estimate'
# ---- end of the streamh, duty, tad block -------------------------------------------------------------
# ==== ds, dg, logk: reaction entropy, Gibbs energy and equilibrium constant =========================
AMMONIA="N2(g) + 3 H2(g) -> 2 NH3(g)"
# log10 K at 700 K = 2 × log Kf(NH3) = 2 × (−2.029): NIST-JANAF 4th ed. (1998), from memory.
run logk "$AMMONIA" -T 700 --json
expect_rc "logk ammonia 700 K" 0
jcheck "logk ammonia 700 K (JANAF, from memory)" 'abs(j["value"] - (-4.058)) <= 0.03 and j["unit"] == "" and j["function"] == "RXNLOGK" and j["temperature_K"] == 700'
LOGK_700=$(jval value)
run logk "$AMMONIA" -T "426.85 C" --json
expect_close "logk -T 426.85 C = 700 K" "$(jval value)" "$LOGK_700" 1e-9
run logk "$(timeout 10 "$BIN" reverse "$AMMONIA")" -T 700 --json
expect_close "logk of the reverse = −logk" "$(jval value)" "$("$PY" -c "print(-($LOGK_700))")" 1e-9
# ΔrG°(298.15 K) = 2 × ΔfG°(NH3) = 2 × (−16.367) kJ/mol: NIST-JANAF 4th ed., from memory.
run dg "$AMMONIA" --json
expect_rc "dg ammonia" 0
jcheck "dg ammonia 298.15 K (JANAF, from memory)" 'abs(j["value"] - (-32.73)) <= 0.15 and j["unit"] == "kJ/mol"'
DG_298=$(jval value)
# log K = −ΔrG°/(R·T·ln 10), R from GNU units (R = k N_A).
R_UNITS=$(units -d 15 -t R 'J/mol/K')
run logk "$AMMONIA" --json
expect_close "logk = -dg/(R T ln 10) (GNU units R)" "$(jval value)" \
    "$("$PY" -c "import math; print(-$DG_298*1000/($R_UNITS*298.15*math.log(10)))")" 1e-6
run dg "$AMMONIA" -u kcal/mol --json
expect_close "dg kcal/mol (GNU units kJ/kcal)" "$(jval value)" \
    "$("$PY" -c "print($DG_298*$(units -d 15 -t kJ kcal))")" 1e-9
run dg "$AMMONIA" -u MJ/kg
expect_rc "dg per-mass unit refused" 2
expect_err_re "dg per-mass unit: words" 'per mole of reaction'
# ΔrS°(298.15 K) = 2·192.774 − 191.609 − 3·130.680 J/(mol·K): JANAF S°, from memory.
run ds "$AMMONIA" --json
expect_rc "ds ammonia" 0
jcheck "ds ammonia 298.15 K (JANAF, from memory)" 'abs(j["value"] - (-198.10)) <= 0.2 and j["unit"] == "J/(mol·K)"'
DS_298=$(jval value)
run ds "$AMMONIA" -u "cal/(mol*K)" --json
expect_close "ds cal/(mol*K) (GNU units cal)" "$(jval value)" "$("$PY" -c "print($DS_298/$(units -d 15 -t cal J))")" 1e-9
run ds "$AMMONIA" -u "kJ/mol/K"
expect_out_re "ds kJ/mol/K plain" '^-0\.198[0-9]* kJ/mol/K$'
run ds "$AMMONIA" -u "J/mol·K"
expect_rc "ds J/mol·K refused (J·K/mol as written)" 2
expect_err_re "ds J/mol·K: words and the known units" 'parentheses.*known units: J/\(mol·K\)'
run ds "$AMMONIA" -u kJ/mol
expect_rc "ds energy unit refused" 2
expect_err_re "ds energy unit: words" 'energy per amount'
run logk "$AMMONIA" -u kJ/mol
expect_rc "logk takes no unit" 2
run logk "N2(g) + H2(g) -> NH3(g)" -T 700
expect_rc "logk unbalanced" 2
expect_err_re "logk unbalanced: words" 'not balanced'
# Exothermic, yet log K < 0 at 700 K (the README's point).
run kind "$AMMONIA" -T 700
expect_out "kind ammonia 700 K" "exothermic"
run why RXNLOGK "$AMMONIA" "9000 K"
expect_rc "why RXNLOGK out of range" 2
# ---- end of the ds, dg, logk block ------------------------------------------------------------------

# ---- steam: IAPWS-IF97, the commands of the group `steam` -------------------------------------------
run steam tsat "10 bar" --json
expect_rc "steam tsat 10 bar" 0
# IAPWS-IF97 release, Table 36: Ts = 453.035632 K at 1 MPa.
jcheck "steam tsat 10 bar (IF97 Table 36)" 'abs(j["value"] - 453.035632) <= 5e-7 and j["unit"] == "K" and j["function"] == "STEAMTSAT"'
run steam tsat 1MPa
expect_out "steam tsat 1MPa plain" "453.036 K"
run steam psat 500 --json
# IAPWS-IF97 release, Table 35: ps = 2.63889776 MPa at 500 K.
jcheck "steam psat 500 K (IF97 Table 35)" 'abs(j["value"] - 26.3889776) <= 5e-7 and j["unit"] == "bar" and j["temperature_K"] == 500'
run steam h "3 MPa" -T 300 --json
# IAPWS-IF97 release, Table 5: h = 115.331273 kJ/kg at 3 MPa, 300 K.
jcheck "steam h 3 MPa 300 K (IF97 Table 5)" 'abs(j["value"] - 115.331273) <= 5e-7 and j["unit"] == "kJ/kg"'
run steam h "0.035 bar" -T "426.85 C" --json
# IAPWS-IF97 release, Table 15: h = 3335.68375 kJ/kg at 0.0035 MPa, 700 K.
jcheck "steam h 0.035 bar 700 K (IF97 Table 15)" 'abs(j["value"] - 3335.68375) <= 5e-6'
run steam latent "10 bar"
expect_rc "steam latent 10 bar" 0
# Steam tables, from memory: hfg about 2015 kJ/kg at 10 bar.
expect_out_re "steam latent 10 bar about 2015 kJ/kg (steam tables, from memory)" '^201[4-6](\.[0-9]+)? kJ/kg$'
run steam h "10 bar" --state vapour --json
jcheck "steam h saturated vapour at 10 bar: no temperature reported" '"temperature_K" not in j and j["input"]["state"] == "vapour" and abs(j["value"] - 2777.1) <= 0.3'
run steam h "250 bar" -T 650
expect_rc "steam h in region 3: exit 2" 2
expect_err_re "steam h in region 3: words" 'region 3 of IAPWS-IF97'
run steam h "250 bar" -T 650 --json
jcheck "steam h in region 3 --json" '"region 3" in j["error"] and j["error_kind"] == "out_of_range"'
run steam h "10 bar" --state gas
expect_rc "steam h --state gas: exit 2" 2
expect_err_re "steam h --state gas: words" 'liquid.*vapour'
run steam h "10 bar"
expect_rc "steam h without temperature or state: exit 2" 2
run steam tsat "-5 bar"
expect_rc "steam tsat of a negative pressure: exit 2" 2
expect_err_re "steam tsat of a negative pressure: words" 'above zero'
run steam
expect_rc "steam without its command: exit 2" 2
expect_err_re "steam without its command lists them" 'steam tsat, steam psat, steam h, steam latent'
run steam frobnicate 10
expect_rc "steam frobnicate: exit 2" 2
expect_err_re "steam frobnicate: words" "unknown command 'steam frobnicate'"
run steam --help
expect_rc "steam --help" 0
expect_out_re "steam --help lists steam latent" '^  steam latent '
run help steam h
expect_out_re "help steam h" '^usage: rxnheat steam h PRESSURE \[-T TEMP\] \[--state STATE\]$'
run --help
expect_out_re "--help lists steam h" '^  steam h +specific enthalpy'
run why "steam h" "250 bar" 650
expect_rc "why steam h in region 3" 2
expect_out_re "why steam h in region 3: words" 'region 3'
if grep -q '^| `steam tsat` |' "$CLI_MD"; then pass; else fail "CLI.md has the row of steam tsat"; fi
# ---- end of the steam block -------------------------------------------------------------------------

echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
