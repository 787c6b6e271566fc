#!/usr/bin/env bash
# End-to-end tests: runs the cairn executable on the project files in tests/data and
# projects-demo and checks exit statuses, messages and written files.
#
#   CAIRN=/path/to/cairn bash tests/end_to_end.sh <source dir>
#
# Exit status of cairn: 0 all checks pass, 1 a check fails, 2 bad input or usage (and then
# nothing is written). Writes only into a fresh temporary folder, removed at the end.
# Prints one line per failed check and a final line 'N passed, M failed'.
set -u

src=${1:?usage: CAIRN=<cairn executable> bash tests/end_to_end.sh <source dir>}
cairn=${CAIRN:?set CAIRN to the path of the cairn executable}
data="$src/tests/data"
work=$(mktemp -d "${TMPDIR:-/tmp}/cairn-e2e.XXXXXX") || exit 2
trap 'rm -rf "$work"' EXIT

passed=0
failed=0
ok() { passed=$((passed + 1)); }
bad() {
  failed=$((failed + 1))
  echo "FAIL: $*"
  if [ -s "$work/err" ]; then sed 's/^/    stderr| /' "$work/err" | head -n 5; fi
}

# Runs cairn; stdout in $work/out, stderr in $work/err, exit status in $status.
run() {
  "$cairn" "$@" >"$work/out" 2>"$work/err"
  status=$?
}

# expect_status NAME STATUS ARGS...: runs cairn with ARGS and checks its exit status.
expect_status() {
  local name=$1 want=$2
  shift 2
  run "$@"
  if [ "$status" -eq "$want" ]; then ok; else bad "$name: exit status $status, expected $want"; fi
}

# expect_in NAME FILE TEXT: FILE contains TEXT (fixed string).
expect_in() {
  if grep -qF -- "$3" "$2"; then ok; else bad "$1: '$3' not found in $(basename "$2")"; fi
}

# A listing of a folder with a checksum of every file, to see whether anything changed.
snapshot() { (cd "$1" && find . -type f -exec md5sum {} + | sort); }

json_has_keys() {
  python3 -c '
import json, sys
doc = json.load(sys.stdin)
missing = [k for k in sys.argv[1:] if k not in doc]
if missing:
    sys.exit("missing keys: " + ", ".join(missing))
' "$@"
}

# ---- a passing file ---------------------------------------------------------------------
expect_status "base.yaml passes" 0 check "$data/base.yaml"
expect_status "e2e/pass.yaml passes" 0 check "$data/e2e/pass.yaml"
expect_in "text report ends with the caution" "$work/out" "qualified engineer"
expect_status "us/cap.yaml runs" 0 check "$data/us/cap.yaml"
expect_status "includes/main.yaml runs" 0 check "$data/includes/main.yaml"

# ---- output formats ---------------------------------------------------------------------
expect_status "--format json" 0 check "$data/e2e/pass.yaml" --format json
if json_has_keys combinations envelope summary units <"$work/out" 2>"$work/err"; then ok; else
  bad "--format json: not JSON, or keys missing"
fi
if python3 -c '
import json, sys
doc = json.load(sys.stdin)
ids = [c["id"] for c in doc["combinations"]]
assert ids == ["S1", "S2"], ids
for c in doc["combinations"]:
    for key in ("id", "limit_state", "status", "cap", "piles", "max_utilization"):
        assert key in c, key
    assert len(c["cap"]["translation"]) == 3 and len(c["cap"]["rotation"]) == 3
    assert [p["id"] for p in c["piles"]] == ["A1", "A2", "A3", "A4", "B2"]
    for p in c["piles"]:
        for key in ("id", "axial", "lateral", "active", "utilization"):
            assert key in p, key
s = doc["summary"]
assert s["pass"] is True
for key in ("pile", "combination", "check"):
    assert key in s["governing"], key
' <"$work/out" 2>"$work/err"; then ok; else bad "--format json: document shape"; fi

expect_status "--format csv" 0 check "$data/e2e/pass.yaml" --format csv
if [ -s "$work/out" ] && grep -q ',' "$work/out"; then ok; else bad "--format csv: no CSV rows"; fi
expect_status "--format markdown" 0 check "$data/e2e/pass.yaml" --format markdown
if [ -s "$work/out" ] && grep -q '^|' "$work/out"; then ok; else bad "--format markdown: no table"; fi
expect_status "--format text" 0 check "$data/e2e/pass.yaml" --format text
if [ -s "$work/out" ]; then ok; else bad "--format text: nothing printed"; fi

# ---- --out writes every file ------------------------------------------------------------
out="$work/out-pass"
expect_status "--out" 0 check "$data/e2e/pass.yaml" --out "$out"
for f in report.txt results.json envelope.csv summary.csv results.csv; do
  if [ -s "$out/$f" ]; then ok; else bad "--out: $f missing or empty"; fi
done
if json_has_keys combinations envelope summary units <"$out/results.json" 2>"$work/err"; then ok; else
  bad "--out: results.json is not the JSON document"
fi
if ls -A "$out" | grep -qv -e '^[a-z][A-Za-z0-9_.-]*\.\(txt\|md\|json\|csv\|html\)$'; then
  bad "--out: temporaries or stray files left behind: $(ls -A "$out" | tr '\n' ' ')"
else
  ok
fi

# ---- --explain ----------------------------------------------------------------------------
expect_status "--explain A1" 0 check "$data/base.yaml" --explain A1
expect_in "--explain A1" "$work/out" "Hand check of pile"
expect_status "--explain of a missing pile" 2 check "$data/base.yaml" --explain Z9
expect_in "--explain of a missing pile" "$work/err" "--explain: pile 'Z9' does not exist"

# ---- failing checks -------------------------------------------------------------------------
expect_status "overloaded pile fails" 1 check "$data/e2e/fail_overload.yaml"
expect_status "overloaded pile fails (json)" 1 check "$data/e2e/fail_overload.yaml" --format json
if python3 -c 'import json,sys; sys.exit(0 if json.load(sys.stdin)["summary"]["pass"] is False else 1)' \
  <"$work/out" 2>"$work/err"; then ok; else bad "overloaded pile: summary.pass is not false"; fi
expect_status "cap that overturns fails" 1 check "$data/e2e/fail_overturn.yaml"
cat "$work/out" "$work/err" >"$work/both"
expect_in "cap that overturns" "$work/both" "the cap overturns"
# The group demand row of that combination has no pile forces to sum: it must not read "ok".
if grep -E '^  S1 ' "$work/out" | tail -n 1 | grep -q 'overturned$'; then ok; else
  bad "cap that overturns: its group demand row does not say so"
fi

# ---- bad input: exit 2, a located message, nothing written --------------------------------
# A folder with old outputs that must stay as they are, and an empty one that must stay empty.
old="$work/old-outputs"
mkdir -p "$old" "$work/empty"
echo "old report" >"$old/report.txt"
echo "old,table" >"$old/summary.csv"
before=$(snapshot "$old")
bad_files=("$data"/bad_*.yaml "$data/cycle/a.yaml" "$data/e2e/unresisted_fx.yaml")
for file in "${bad_files[@]}"; do
  name=${file#"$data/"}
  expect_status "$name" 2 check "$file"
  if grep -qE '^cairn: [^ ]+:[0-9]+:[0-9]+: error: ' "$work/err"; then ok; else
    bad "$name: no 'cairn: file:line:col: error: ' message"
  fi
  if [ ! -s "$work/out" ]; then ok; else bad "$name: printed a report on bad input"; fi
  expect_status "$name --out (old outputs)" 2 check "$file" --out "$old"
  if [ "$(snapshot "$old")" = "$before" ]; then ok; else bad "$name: old outputs changed"; fi
  expect_status "$name --out (empty folder)" 2 check "$file" --out "$work/empty" --format json
  if [ -z "$(ls -A "$work/empty")" ]; then ok; else bad "$name: wrote into the output folder"; fi
done
if [ ! -e "$work/never-made" ]; then
  expect_status "bad input with --out to a new folder" 2 check "$data/bad_several.yaml" \
    --out "$work/never-made"
  if [ ! -e "$work/never-made" ] || [ -z "$(ls -A "$work/never-made")" ]; then ok; else
    bad "bad input: files written to a new output folder"
  fi
fi

# The message for a load nothing resists, pinned (found after reading, by the solver setup).
run check "$data/e2e/unresisted_fx.yaml"
expect_in "unresisted Fx" "$work/err" \
  "cairn: $data/e2e/unresisted_fx.yaml:21:27: error: load_cases.L: Fx cannot be resisted: no battered piles and no lateral stiffness"
# Several problems in one run: one line each.
run check "$data/bad_several.yaml"
if [ "$(grep -c '^cairn: ' "$work/err")" -eq 4 ]; then ok; else
  bad "bad_several.yaml: expected 4 messages, got $(grep -c '^cairn: ' "$work/err")"
fi

# ---- usage errors ----------------------------------------------------------------------------
expect_status "no command" 2
expect_status "check without a file" 2 check
expect_status "unknown option" 2 check "$data/base.yaml" --no-such-option
expect_status "unknown format" 2 check "$data/base.yaml" --format pdf
expect_status "missing project file" 2 check "$work/no-such-file.yaml"
expect_in "missing project file" "$work/err" "cannot open the project file"
expect_status "--help" 0 --help

# ---- demo projects ---------------------------------------------------------------------------
# Each projects-demo/<name>/cap.yaml must pass; when <name>/expected/check.json exists, the
# JSON document must match it, apart from "input" and "command" (which name paths and flags).
for project in "$src"/projects-demo/*/cap.yaml; do
  [ -e "$project" ] || continue
  dir=$(dirname "$project")
  name=$(basename "$dir")
  (cd "$dir" && "$cairn" check cap.yaml --format json >"$work/out" 2>"$work/err")
  status=$?
  if [ "$status" -eq 0 ]; then ok; else bad "projects-demo/$name: exit status $status, expected 0"; fi
  if [ -f "$dir/expected/check.json" ]; then
    if python3 - "$dir/expected/check.json" "$work/out" >"$work/diff" 2>&1 <<'EOF'
import json, math, sys

def load(path):
    with open(path) as f:
        doc = json.load(f)
    for key in ("input", "options", "command"):
        doc.pop(key, None)
    return doc

def compare(a, b, where):
    # Numbers agree to 1e-9 relative (or 1e-9 absolute near zero): the same program on
    # another compiler may round the last printed digit differently.
    if isinstance(a, bool) or isinstance(b, bool) or not isinstance(a, (int, float)) \
            or not isinstance(b, (int, float)):
        if type(a) != type(b):
            return f"{where}: {a!r} != {b!r}"
        if isinstance(a, dict):
            if a.keys() != b.keys():
                return f"{where}: keys {sorted(a)} != {sorted(b)}"
            for k in a:
                d = compare(a[k], b[k], f"{where}.{k}")
                if d:
                    return d
            return None
        if isinstance(a, list):
            if len(a) != len(b):
                return f"{where}: {len(a)} items != {len(b)}"
            for i, (x, y) in enumerate(zip(a, b)):
                d = compare(x, y, f"{where}[{i}]")
                if d:
                    return d
            return None
        return None if a == b else f"{where}: {a!r} != {b!r}"
    return None if math.isclose(a, b, rel_tol=1e-9, abs_tol=1e-9) else f"{where}: {a!r} != {b!r}"

difference = compare(load(sys.argv[1]), load(sys.argv[2]), "$")
if difference:
    sys.exit(difference)
EOF
    then ok; else bad "projects-demo/$name: differs from expected/check.json: $(tail -n 1 "$work/diff")"; fi
  fi
done

# ---- Loads imported from a reactions CSV: the same pile forces as the loads written out.
expect_status "reactions.yaml passes" 0 check "$data/reactions/reactions.yaml" --format json
cp "$work/out" "$work/imported.json"
expect_status "direct.yaml passes" 0 check "$data/reactions/direct.yaml" --format json
if python3 - "$work/imported.json" "$work/out" <<'PY'
import json, math, sys
a, b = (json.load(open(f)) for f in sys.argv[1:3])
for ca, cb in zip(a["combinations"], b["combinations"]):
    for pa, pb in zip(ca["piles"], cb["piles"]):
        for key in ("axial", "lateral"):
            if not math.isclose(pa[key], pb[key], rel_tol=1e-9, abs_tol=1e-9):
                sys.exit(f"{ca['id']} {pa['id']} {key}: {pa[key]} != {pb[key]}")
PY
then ok; else bad "reactions round trip: pile forces differ"; fi
expect_status "reactions: support absent from the file" 2 check "$data/reactions/bad_unmapped.yaml"
expect_in "reactions: absent support named" "$work/err" "bad_unmapped.yaml:12:5: error: columns: support '777' of column 'C9' does not appear in"
expect_status "reactions: support mapped twice" 2 check "$data/reactions/bad_twice.yaml"
expect_in "reactions: twice named" "$work/err" "bad_twice.yaml:12:39: error: columns[1].support: support '101' is mapped twice (columns 'C1' and 'C9')"
expect_status "reactions: non-numeric value" 2 check "$data/reactions/bad_value.yaml"
expect_in "reactions: file, row and column named" "$work/err" "bad_value.csv:3:9: error: row 3, column 'Fy': expected a number (a force in kN), got 'x1'"

expect_status "reactions: a row given twice" 2 check "$data/reactions/bad_repeated.yaml"
expect_in "reactions: repeated row named" "$work/err" "bad_repeated.csv:3:1: error: row 3: support '101' and load case 'D' were already given in row 2"
expect_status "factors out of range" 2 check "$data/e2e/bad_factors.yaml"
expect_in "factor of safety below 1" "$work/err" "pile_types.PC45.factor_of_safety: expected a factor of safety of at least 1, got '0.8'"
expect_in "resistance factor above 1" "$work/err" "pile_types.PC45.resistance_factor_tip: expected a resistance factor φ from 0 to 1, got '1.5'"

# ---- The calculation package: HTML per cap, and the plan alone as SVG that is valid XML.
expect_status "report --svg" 0 report "$data/e2e/pass.yaml" --out "$work/package" --svg
if [ -s "$work/package/pass.html" ]; then ok; else bad "report wrote no pass.html"; fi
if python3 -c 'import sys, xml.etree.ElementTree as E; E.parse(sys.argv[1])' "$work/package/pass-plan.svg" 2>"$work/err"
then ok; else bad "the plan SVG is not well-formed XML"; fi

# ---- Many caps: one summary table; exit 1 when any cap fails, 2 when any cannot be read.
expect_status "batch, all pass" 0 check "$data/e2e/pass.yaml" "$data/base.yaml"
expect_in "batch summary" "$work/out" "PASS: all 2 caps pass"
expect_status "batch, one fails" 1 check "$data/e2e/pass.yaml" "$data/e2e/fail_overload.yaml"
expect_in "batch names the failing count" "$work/out" "FAIL: 1 of 2 caps fails"
expect_status "batch, one unreadable" 2 check "$data/e2e/pass.yaml" "$data/bad_pile_type.yaml"
expect_status "batch --format json" 0 check "$data/e2e/pass.yaml" "$data/base.yaml" --format json
if json_has_keys caps summary caution <"$work/out"; then ok; else bad "batch json keys"; fi

# ---- Capacity from the soil, springs, generated combinations.
expect_status "capacity" 0 capacity "$data/e2e/soil.yaml"
expect_in "capacity breakdown" "$work/out" "Ultimate compression = tip + shaft"
expect_in "capacity with depth" "$work/out" "Capacity with depth"
expect_status "capacity --format json" 0 capacity "$data/e2e/soil.yaml" --format json
if json_has_keys pile_types units caution <"$work/out"; then ok; else bad "capacity json keys"; fi
expect_status "check with computed capacities" 0 check "$data/e2e/soil.yaml"
expect_in "computed capacities stated" "$work/out" "computed from the soil"
expect_status "springs --format csv" 0 springs "$data/e2e/soil.yaml" --format csv
expect_in "springs header" "$work/out" "pile,type,x (m),y (m),axis x,axis y,axis z,axial (kN/m),lateral (kN/m),head"
expect_status "generated combinations" 0 check "$data/e2e/generated.yaml"
expect_in "generated combinations listed" "$work/out" "generated: asce7-lrfd"
expect_status "unknown generator" 2 check "$data/e2e/bad_generator.yaml"
expect_in "valid generators listed" "$work/err" "asce7-asd"

# ---- Reactions CSV: no number lost silently; the file's own names; factored combinations;
# warnings on stderr and in every output, never in the exit status.
r="$data/reactions"
# same_forces A.json B.json: every pile's axial and lateral force agree, combination by combination.
same_forces() {
  python3 - "$1" "$2" <<'PY'
import json, math, sys
a, b = (json.load(open(f)) for f in sys.argv[1:3])
if len(a["combinations"]) != len(b["combinations"]):
    sys.exit("different numbers of combinations")
for ca, cb in zip(a["combinations"], b["combinations"]):
    if ca["id"] != cb["id"]:
        sys.exit(f"combination {ca['id']} != {cb['id']}")
    for pa, pb in zip(ca["piles"], cb["piles"]):
        for key in ("axial", "lateral"):
            if not math.isclose(pa[key], pb[key], rel_tol=1e-9, abs_tol=1e-9):
                sys.exit(f"{ca['id']} {pa['id']} {key}: {pa[key]} != {pb[key]}")
PY
}
expect_status "reactions: direct loads" 0 check "$r/direct.yaml" --format json
cp "$work/out" "$work/direct.json"
for name in mapped semicolon; do
  expect_status "reactions: $name.yaml passes" 0 check "$r/$name.yaml" --format json
  if same_forces "$work/out" "$work/direct.json" 2>"$work/err"; then ok; else bad "reactions: $name.yaml forces differ from direct.yaml"; fi
done
expect_status "reactions: combinations typed in" 0 check "$r/combos_direct.yaml" --format json
cp "$work/out" "$work/combos_direct.json"
expect_status "reactions: combinations imported" 0 check "$r/combos.yaml" --format json
if same_forces "$work/out" "$work/combos_direct.json" 2>"$work/err"; then ok; else bad "reactions: imported combinations differ from typed ones"; fi
expect_in "reactions: imported combination has its limit state" "$work/out" '"limit_state": "strength"'
# Each bad file: exit 2, the message located in the CSV (file:row:column) or the YAML.
while IFS='|' read -r name message; do
  expect_status "reactions: $name" 2 check "$r/$name.yaml"
  expect_in "reactions: $name message" "$work/err" "$message"
done <<'EOF_BAD'
bad_thousands|bad_thousands.csv:2:11: error: row 2: found 9 cells, expected 8 as in the header; '1,850.0' looks like one number written with a thousands separator
bad_2400|bad_2400.csv:2:11: error: row 2: found 9 cells, expected 8 as in the header; '2,400' looks like one number written with a thousands separator
bad_trailing_comma|bad_trailing_comma.csv:3:22: error: row 3: found 9 cells, expected 8 as in the header; the row ends with a trailing ','
bad_short_row|bad_short_row.csv:3:1: error: row 3: found 7 cells, expected 8 as in the header; a cell is missing
bad_quoted_thousands|bad_quoted_thousands.csv:2:11: error: row 2, column 'Fz': expected a number (a force in kN), got '1,850.0'; a number with a thousands separator (or a decimal comma) is not read
bad_semicolon|semicolon.csv:1:1: error: header: the columns are separated by ';', not ','; set loads_from.delimiter: ';'
bad_decimal_comma|semicolon.csv:2:7: error: row 2, column 'Fz': expected a number (a force in kN), got '2400,0'; a decimal comma is not read with loads_from.decimal '.'
bad_missing_column|mapped.csv:1:1: error: header: missing column 'FZ' (for Fz, loads_from.headers); found: Load Case, NODE, FZ (kN), FX (kN), FY (kN), MX (kNm), MY (kNm), MZ (kNm), Comment
bad_combination_factor|bad_combination_factor.yaml:28:7: error: loads_from.combinations.factors.strength: missing; the imported strength combinations need a factor for each load case typed in the file, e.g. strength: {SW: …, PIPE: …}
bad_combination_pattern|combos.csv:8:1: error: row 8: combination 'SLS-CHAR' matches nothing in loads_from.combinations.limit_state (ULS-*, SLS-1)
EOF_BAD
# A load case in no combination: a warning on stderr and in the notes of every output.
unused="load_cases.W: no combination uses this load case; its loads are not checked"
expect_status "warning: exit status unchanged" 0 check "$r/unused_case.yaml"
expect_in "warning on stderr" "$work/err" "unused_case.yaml:17:3: warning: $unused"
expect_in "warning in the text notes" "$work/out" "Warning: $unused"
for format in markdown csv json; do
  expect_status "warning: --format $format" 0 check "$r/unused_case.yaml" --format "$format"
  expect_in "warning in the $format notes" "$work/out" "Warning: $unused"
done
expect_status "warning: --out" 0 check "$r/unused_case.yaml" --out "$work/warned"
for file in report.txt report.md results.json summary.csv envelope.csv; do
  expect_in "warning in $file" "$work/warned/$file" "Warning: $unused"
done
expect_status "warning: report" 0 report "$r/unused_case.yaml" --out "$work/warned-html"
expect_in "warning on stderr (report)" "$work/err" "warning: $unused"
expect_in "warning in the HTML notes" "$work/warned-html/unused_case.html" "Warning: $unused"
# ---- No unsafe defaults: yield moment, battered spacing, the tension keys, the η = 1 note.
expect_status "battered piles crossing at depth" 1 check "$data/defaults/battered_toward.yaml"
expect_in "battered pair and depth named" "$work/out" "FAIL: battered piles A1 and A2 come within 0.000 m of each other at 4.000 m below the pile heads, less than 1.000 m."
expect_status "Broms without a yield moment" 2 check "$data/defaults/bad_no_yield_moment.yaml"
expect_in "yield moment asked for" "$work/err" "pile_types.PC45: Broms' lateral capacity of this reinforced concrete pile needs its yield moment"
expect_status "yield moment of a steel pipe" 0 check "$data/defaults/pipe_in_clay.yaml"
expect_in "yield moment's source stated" "$work/out" "with the plastic modulus Z, reduced for the axial force at P = 1000.0 kN, the least favourable axial force of all combinations"
expect_status "yield moment of a concrete pile" 0 check "$data/defaults/concrete_in_sand.yaml"
expect_in "concrete My at the pile's tension" "$work/out" "from f'c and 8 bars by strain compatibility with the ACI 318-19 rectangular stress block (β1 = 0.80), at P = -200.0 kN (tension)"
expect_status "tension: false with a tension capacity" 2 check "$data/defaults/bad_tension_contradiction.yaml"
expect_in "which tension was meant" "$work/err" "which did you mean"
expect_status "capacity.tension: 0 accepted, tension fails" 1 check "$data/defaults/tension_zero.yaml"
expect_in "no claim of driven piles in sand without soil" "$work/out" "the project has no soil profile"
expect_status "bored piles in sand" 0 check "$data/defaults/bored_in_sand.yaml"
expect_in "bored piles do not densify" "$work/out" "bored piles do not densify the soil between them"

# ---- One verdict in every output: an overturned combination, the pile states and words.
mixed="$data/outputs/mixed.yaml"
expect_status "mixed.yaml fails (S2 overturns)" 1 check "$mixed"
expect_in "text: S2's title carries its verdict" "$work/out" "Combination S2 (service): 0.25·D + 1.0·O — overturned"
expect_in "text: a dropped pile is named by its state" "$work/out" " none        dropped out pass"
if grep -E '^  [AB][12] ' "$work/out" | grep -F ' overturned ' | grep -qv ' overturned fail$'; then
  bad "text: a pile of the overturned combination is not marked fail"
else ok; fi
expect_in "text: the command as run" "$work/out" "command: $(basename "$cairn") check $mixed"
expect_status "mixed.yaml csv" 1 check "$mixed" --format csv
expect_in "csv: the summary row says why" "$work/out" "fail,the cap overturns in S2,0.847,A2,S1,compression,1,2,4"
expect_in "csv: overturned pile rows" "$work/out" "A1,-1.350,-1.350,-,-,-,none,overturned,fail"
expect_status "mixed.yaml json" 1 check "$mixed" --format json
if python3 -c '
import json, sys
doc = json.load(sys.stdin)
s2 = doc["combinations"][1]
assert s2["status"] == "overturned", s2["status"]
assert all(p["state"] == "overturned" and p["pass"] is False for p in s2["piles"])
assert doc["combinations"][0]["piles"][2]["state"] == "dropped out"
assert doc["summary"]["reasons"] == ["the cap overturns in S2"], doc["summary"]["reasons"]
assert all(e["max_tension"]["combination"] is None for e in doc["envelope"])
' <"$work/out" 2>"$work/err"; then ok; else bad "json: verdict, states or reasons"; fi
expect_status "mixed.yaml --out" 1 check "$mixed" --out "$work/mixed-out"
if [ "$(grep -c '^S2,.*,overturned,fail$' "$work/mixed-out/results.csv")" -eq 4 ]; then ok; else
  bad "results.csv: not every pile of S2 overturned and failing"
fi
expect_in "summary.csv says why" "$work/mixed-out/summary.csv" "fail,the cap overturns in S2,"
if awk 'prev ~ /^\|/ && $0 !~ /^\|/ && $0 != "" {bad = 1} {prev = $0} END {exit bad}' \
  "$work/mixed-out/report.md"; then ok; else bad "report.md: a line follows a table without a blank line"; fi
expect_status "mixed.yaml report" 1 report "$mixed" --out "$work/mixed-html" --svg
expect_in "html: overturned at a glance" "$work/mixed-html/mixed.html" 'id="overturned">Overturned: S2'
expect_in "html: the command as run" "$work/mixed-html/mixed.html" "<code>$(basename "$cairn") report $mixed --out $work/mixed-html --svg</code>"
if [ "$(grep -o '<g class="pile failing"' "$work/mixed-html/mixed-plan.svg" | wc -l)" -eq 4 ]; then ok; else
  bad "plan: the piles of an overturned cap are not all marked failing"
fi
expect_in "plan: colour bar" "$work/mixed-html/mixed-plan.svg" 'class="colour-bar"'
if python3 -c 'import sys, xml.etree.ElementTree as E; E.parse(sys.argv[1])' "$work/mixed-html/mixed-plan.svg" 2>"$work/err"
then ok; else bad "mixed plan SVG is not well-formed XML"; fi
# No "-0.000" and no round-off rotations anywhere in the demo outputs.
for project in "$src"/projects-demo/*/cap.yaml; do
  (cd "$(dirname "$project")" && "$cairn" check cap.yaml >"$work/out" 2>"$work/err")
  if grep -qE -- '-0\.0+([^0-9]|$)' "$work/out"; then bad "$project: prints a negative zero"; else ok; fi
  if grep -oE 'rotation \([^)]*\)' "$work/out" | grep -qE 'e-(1[0-9]|[2-9][0-9])'; then
    bad "$project: prints a round-off rotation"
  else ok; fi
done
# ---- A group on survey grid coordinates: the rigid cap is solved about the group's own
# centre (issue 12), so the far-off origin costs no digits.
expect_status "far from the origin" 0 check "$data/e2e/far_origin.yaml" --format json
if python3 - "$work/out" <<'PY'
import json, math, sys
doc = json.load(open(sys.argv[1]))
axial = [p["axial"] for p in doc["combinations"][0]["piles"]]
for got, want in zip(axial, (500.0, 250.0, 250.0)):
    if not math.isclose(got, want, rel_tol=1e-9):
        sys.exit(f"axial forces {axial}, expected 500/250/250")
PY
then ok; else bad "far from the origin: pile forces"; fi
expect_status "far from the origin, hand check" 0 check "$data/e2e/far_origin.yaml" --explain A
expect_in "far from the origin, hand check agrees" "$work/out" "= 333.3 + 83.3 + 83.3 = 500.0 kN   (solver: 500.0 kN)"
# Capacity limits (issue 10): the limit that governed is printed with its source, the
# engineer's reason is quoted, and a reason without its limit is an input error.
expect_status "capacity with the engineer's limits" 0 capacity "$data/e2e/soil.yaml"
expect_in "engineer's reason quoted" "$work/out" "max_unit_tip given, reason: 'fixture: checks the run, not the limit'"
expect_in "depth table notes the transition" "$work/out" "Db < 10·D in 'dense sand'"
expect_status "limit reason alone" 2 check "$data/e2e/bad_limit_reason.yaml"
expect_in "limit reason alone named" "$work/err" "bad_limit_reason.yaml:7:105: error: soil.layers[0].max_unit_tip_reason: expected max_unit_tip beside it, got a reason alone"

# ---- capacity: allowable and factored with depth, CSV, the length needed, --from -----------
expect_status "capacity --format csv" 0 capacity "$data/e2e/soil.yaml" --format csv --step 5
expect_in "capacity csv header" "$work/out" "pile type,length (m),tip depth (m),tip (kN),shaft (kN),ultimate compression (kN),ultimate tension (kN),allowable compression (kN),allowable tension (kN),factored compression (kN),factored tension (kN)"
expect_in "capacity csv row" "$work/out" "PC45,3.00,4.50,"
expect_in "capacity csv caution" "$work/out" "# Results are for checking by a qualified engineer"
expect_status "capacity: length needed" 0 capacity "$data/e2e/soil_datum.yaml" --need-compression 1500 --need-tension 400
expect_in "length needed answer" "$work/out" "Length needed for 1500.0 kN compression and 400.0 kN tension (allowable): length "
expect_in "length needed: tip elevation" "$work/out" "m below the ground (elevation "
expect_in "length needed: bisection" "$work/out" "found in the table, then refined by bisection to 0.01 m"
expect_in "tip elevation column" "$work/out" "tip elevation (m)"
expect_status "capacity: factored need in csv" 0 capacity "$data/e2e/soil.yaml" --format csv --need-compression 900 --need-basis factored
expect_in "factored need answer" "$work/out" "# PC45: Length needed for 900.0 kN compression (factored): length "
expect_status "capacity: need beyond the profile" 1 capacity "$data/e2e/soil.yaml" --need-compression 90000
expect_in "need beyond the profile" "$work/out" "no length within the soil profile meets it"
expect_status "capacity --from beyond the profile" 2 capacity "$data/e2e/soil.yaml" --from 27
expect_in "--from beyond the profile message" "$work/err" "--from: expected a pile length whose tip lies within the soil profile (at most 26.5 m: profile 28 m deep, pile heads 1.5 m below the ground), got '27'"
expect_status "capacity --need-tension negative" 2 capacity "$data/e2e/soil.yaml" --need-tension -5
expect_in "negative need message" "$work/err" "--need-tension: expected a positive force in kN, got '-5'"

# ---- bored piles computed by driven-pile methods: reduced sand tip, cautions -------------
expect_status "bored pile with driven-pile methods" 0 capacity "$data/e2e/bored.yaml"
expect_in "bored caution on stderr" "$work/err" "bored.yaml:12:5: warning: pile_types.PC45: tip method 'vesic' (sand) on a bored pile: the method was developed for driven piles; its unit tip is taken as 1/3 of the driven value (Meyerhof 1976)"
expect_in "bored tip reduced" "$work/out" "bored = 0.333"
expect_in "bored factors' table named" "$work/out" "10.5.5.2.3-1 (driven piles) or 10.5.5.2.4-1 (drilled shafts), the one that holds each method"

# ---- Code combinations that can govern piles: EN 1997 design approach 1 with its
# resistance sets, AASHTO LRFD with extreme-event resistance factors, ASCE 7 without SDS.
expect_status "EN 1997 DA1" 0 check "$data/e2e/en1997.yaml"
expect_in "DA1 combination 2 generated" "$work/out" "DA1-C2-L+W(Wx)   strength    1.0·G + 1.3·Q + 0.78·Wx"
expect_in "R4 factors of CFA piles stated" "$work/out" "cfa pile factors (EN 1997-1 Table A.8); computed from the soil: base ÷ γb 1.45, shaft ÷ γs 1.3, tension shaft ÷ γs;t 1.6"
expect_in "ξ3 with the rigid cap stated" "$work/out" "ξ = max(ξ3 1.33, ξ4 1.23) ÷ 1.1 for the rigid cap"
expect_status "EN 1997 DA1 --format json" 0 check "$data/e2e/en1997.yaml" --format json
if python3 - "$work/out" <<'PY'
import json, sys
doc = json.load(open(sys.argv[1]))
ids = [c["id"] for c in doc["combinations"]]
assert "DA1-C1-G" in ids and "DA1-C2-W(Wx)-inf" in ids, ids
PY
then ok; else bad "EN 1997 combinations missing from the json"; fi
cp "$work/out" "$work/en1997.json"
expect_status "EN 1997 capacity --format json" 0 capacity "$data/e2e/en1997.yaml" --format json
# R_c;d = (R_b/γb + R_s/γs)/ξ with CFA R1 (γb 1.1, γs 1.0) and R4 (γb 1.45, γs 1.3), ξ = 1.33/1.1
# (EN 1997-1:2004 eq. 7.6, Tables A.8 and A.10, from memory), against axial/utilization.
if python3 - "$work/out" "$work/en1997.json" <<'PY'
import json, math, sys
cap = json.load(open(sys.argv[1]))["pile_types"][0]
check = json.load(open(sys.argv[2]))
xi = 1.33 / 1.1
want = {"DA1-C1-G": (cap["tip"] / 1.1 + cap["shaft"] / 1.0) / xi,
        "DA1-C2-G": (cap["tip"] / 1.45 + cap["shaft"] / 1.3) / xi}
seen = 0
for c in check["combinations"]:
    if c["id"] in want:
        seen += 1
        p = c["piles"][0]
        got = p["axial"] / p["utilization"]
        if not math.isclose(got, want[c["id"]], rel_tol=1e-9):
            sys.exit(f"{c['id']}: resistance {got} != {want[c['id']]}")
if seen != 2:
    sys.exit("DA1-C1-G or DA1-C2-G missing")
PY
then ok; else bad "EN 1997 design resistance differs from (R_b/γb + R_s/γs)/ξ"; fi
expect_status "EN 1997 DA3" 0 check "$data/e2e/en1997_da3.yaml"
expect_in "DA3: earth pressure at A2" "$work/out" "DA3-L       strength    1.35·G + 1.0·H + 1.5·Q"
expect_in "DA3: R3 with M2 stated" "$work/out" "driven pile factors (EN 1997-1 Table A.6); computed from the soil with set M2 (tan φ' and tan δ ÷ 1.25, cu ÷ 1.4): base ÷ γb 1, shaft ÷ γs 1, tension shaft ÷ γs;t 1.1, each ÷ ξ 1 × γRd 1.4"
expect_status "AASHTO LRFD" 0 check "$data/e2e/aashto.yaml"
expect_in "Extreme Event I with minimum γp" "$work/out" "EXT-I-min(EQ)   strength    0.9·DC + 0.65·DW + 0.5·LL + 1.0·EQ"
expect_in "extreme-event φ stated" "$work/out" "Pile type HP: AASHTO extreme event resistances compression 2400.0 kN, tension 720.0 kN, lateral 300.0 kN: ultimate given × φ 1 (compression, lateral), 0.8 (uplift)"
expect_status "ASCE 7 seismic without SDS" 2 check "$data/e2e/bad_sds.yaml"
expect_in "SDS asked for, located" "$work/err" "bad_sds.yaml:14:13: error: combinations.generate.sds: missing; expected SDS (in g) for the vertical seismic effect Ev = 0.2·SDS·D of ASCE/SEI 7-16 §12.4.2.2, because load case 'E' is seismic"

# ---- Robustness: inputs that once crashed or hung are located input errors (exit 2).
robust="$data/robust"
expect_status "alias cycle" 2 check "$robust/alias_cycle.yaml"
expect_in "alias cycle named" "$work/err" "alias_cycle.yaml:3:8: error: x.a: an alias refers to a map or list that contains it (a cycle)"
expect_status "alias bomb" 2 check "$robust/alias_bomb.yaml"
expect_in "alias bomb refused" "$work/err" "alias_bomb.yaml:6:5: error: a4: aliases expand this to more than 102636 values"
python3 -c 'import sys; n=100000; open(sys.argv[1], "w").write("x: " + "[" * n + "]" * n + "\n")' "$work/deep.yaml"
expect_status "100,000 nested lists" 2 check "$work/deep.yaml"
expect_in "nesting limit named" "$work/err" "deep.yaml:1:203: error: lists and maps nested deeper than 200 levels"
python3 -c 'import sys; n=100000; open(sys.argv[1], "w").write("x: " + "{a: " * n + "1" + "}" * n + "\n")' "$work/deep.yaml"
expect_status "100,000 nested maps" 2 check "$work/deep.yaml"
expect_status "key that is a list" 2 check "$robust/list_key.yaml"
expect_in "list key located" "$work/err" "list_key.yaml:3:3: error: expected a name as a key, got a list"
expect_status "column without at" 2 check "$robust/column_without_at.yaml"
expect_in "column without at located" "$work/err" "column_without_at.yaml:24:5: error: columns[0].at: expected [x, y] or [x, y, z] in m, got nothing"
expect_status "huge loads" 2 check "$robust/huge_loads.yaml"
expect_in "1e308 kip refused" "$work/err" "huge_loads.yaml:20:44: error: load_cases.L.loads[0].Fz: expected a force in kN no larger than 1e+12 in magnitude, got '-1e308 kip'"
expect_status "tab in indentation" 2 check "$robust/tab_indent.yaml"
expect_in "tab named" "$work/err" "tab_indent.yaml:5:1: error: tab character in indentation; YAML indents with spaces"
for step in 1e-9 0 -1 nan inf; do
  expect_status "capacity --step $step" 2 capacity "$data/e2e/soil.yaml" --step "$step"
done
expect_in "a table too long is refused" "$work/err" "--step: expected a positive length in m no larger than 1e+07, got 'inf'"
run capacity "$data/e2e/soil.yaml" --step 1e-9
expect_in "rows counted, shortest step given" "$work/err" "would have 25000001001 rows, more than 10000; use a step of at least 0.0025 m"
expect_status "capacity --from inf" 2 capacity "$data/e2e/soil.yaml" --from inf

python3 -c 'import sys; open(sys.argv[1], "w").write(open(sys.argv[2]).read().replace("  - {id: A2, x: 1.35, y: -1.35, type: PC45}\n", "  - {id: A0, x: 0, y: 0, type: PC45}\n" * 5000))' "$work/same.yaml" "$data/base.yaml"
expect_status "5,000 piles at one point" 2 check "$work/same.yaml"
expect_in "the rest counted" "$work/err" "error: piles: … and 4994 more piles at positions already used"
if [ "$(wc -l <"$work/err")" -le 12 ]; then ok; else bad "same position: $(wc -l <"$work/err") lines of messages"; fi
expect_status "missing capacity, generated combinations" 2 check "$robust/missing_factored_once.yaml"
if [ "$(wc -l <"$work/err")" -eq 1 ]; then ok; else bad "missing capacity reported $(wc -l <"$work/err") times"; fi
expect_status "unknown command" 2 chek "$data/base.yaml"
expect_in "nearest command suggested" "$work/err" "cairn: error: unknown command 'chek'; did you mean 'check'?"

# ---- --out is all or nothing, and replaces only cairn's own files (cairn-manifest.json) ----
# check_set DIR: when DIR's manifest says complete, every file it names is there with its
# size and SHA-256 (checked here with Python's hashlib, independently of cairn's own).
check_set() {
  python3 - "$1" <<'PY'
import hashlib, json, os, sys
folder = sys.argv[1]
path = os.path.join(folder, "cairn-manifest.json")
if not os.path.exists(path):
    sys.exit(0)
m = json.load(open(path))
assert m["tool"] == "cairn", "not cairn's manifest"
if m["complete"] is not True:
    sys.exit(0)
for f in m["files"]:
    data = open(os.path.join(folder, f["name"]), "rb").read()
    assert len(data) == f["bytes"], f["name"] + ": size differs from the manifest"
    assert hashlib.sha256(data).hexdigest() == f["sha256"], f["name"] + ": SHA-256 differs"
PY
}
atomic="$work/atomic"
mkdir -p "$atomic"
expect_status "--out: first run" 0 check "$data/e2e/pass.yaml" --out "$atomic/out"
if check_set "$atomic/out" 2>"$work/err" &&
  python3 -c 'import json,sys; m=json.load(open(sys.argv[1])); sys.exit(0 if m["complete"] is True and m["version"] and m["written"] and "report.txt" in [f["name"] for f in m["files"]] else 1)' \
    "$atomic/out/cairn-manifest.json"; then ok; else bad "--out: manifest content"; fi
expect_status "--out: a second run replaces cairn's own files" 0 check "$data/e2e/pass.yaml" --out "$atomic/out"

# A folder where an output file goes: exit 2, nothing replaced, nothing printed.
rm "$atomic/out/summary.csv" && mkdir "$atomic/out/summary.csv"
before=$(snapshot "$atomic/out")
expect_status "--out: a folder in the way" 2 check "$data/e2e/pass.yaml" --out "$atomic/out"
expect_in "--out: a folder in the way, named" "$work/err" "summary.csv' is a folder"
if [ "$(snapshot "$atomic/out")" = "$before" ]; then ok; else bad "--out: files replaced with a folder in the way"; fi
if [ ! -s "$work/out" ]; then ok; else bad "--out: printed a report when the files could not be written"; fi
mkdir -p "$atomic/pkg-blocked/pass-plan.svg"
expect_status "report: a folder in the way" 2 report "$data/e2e/pass.yaml" --out "$atomic/pkg-blocked" --svg
if [ ! -s "$work/out" ]; then ok; else bad "report: listed files that were not written"; fi
if [ "$(ls -A "$atomic/pkg-blocked")" = "pass-plan.svg" ]; then ok; else
  bad "report: wrote beside a folder in the way: $(ls -A "$atomic/pkg-blocked" | tr '\n' ' ')"
fi

# --out . beside a file of the user's with an output's name: refused, the file kept.
mkdir -p "$atomic/here"
echo "my own notes" >"$atomic/here/report.txt"
pass_yaml=$(cd "$data/e2e" && pwd)/pass.yaml
(cd "$atomic/here" && "$cairn" check "$pass_yaml" --out . >"$work/out" 2>"$work/err")
status=$?
if [ "$status" -eq 2 ]; then ok; else bad "--out . with a user's report.txt: exit $status, expected 2"; fi
expect_in "--out . with a user's file" "$work/err" "was not written by cairn"
if [ "$(cat "$atomic/here/report.txt")" = "my own notes" ] && [ "$(ls -A "$atomic/here")" = "report.txt" ]; then
  ok; else bad "--out . changed the folder"; fi

# Stale temporaries of runs that are gone (pid 999999999 exists on no Linux system) are
# removed by the next run into the folder; a file of the user's that looks similar stays.
touch "$atomic/out/.cairn-tmp-999999999-report.txt" "$atomic/out/report.txt.cairn-tmp-999999999" \
  "$atomic/out/.cairn-tmp-notes"
rmdir "$atomic/out/summary.csv"
expect_status "--out: run after a crash" 0 check "$data/e2e/pass.yaml" --out "$atomic/out"
if [ "$(cd "$atomic/out" && ls -A | grep -c 'cairn-tmp')" -eq 1 ] && [ -e "$atomic/out/.cairn-tmp-notes" ]; then
  ok; else bad "--out: stale temporaries left: $(ls -A "$atomic/out" | tr '\n' ' ')"; fi

# A many-cap report killed at points up to its end (where the renames are): the manifest
# never vouches for a mixed set, and a run to the end leaves no temporaries.
mkdir -p "$atomic/caps"
for i in $(seq 1 40); do cp "$data/e2e/pass.yaml" "$atomic/caps/cap$i.yaml"; done
start=$(date +%s%N)
expect_status "report of 40 caps" 0 report "$atomic/caps"/cap*.yaml --out "$atomic/pkg" --tables
elapsed=$(( ($(date +%s%N) - start) / 1000000 ))
for percent in 30 60 80 90 95 100; do
  delay=$(python3 -c "print(max(0.01, $elapsed * $percent / 100000))")
  (timeout --foreground -s KILL "$delay" "$cairn" report "$atomic/caps"/cap*.yaml --out "$atomic/pkg" >/dev/null 2>&1) 2>/dev/null
  if check_set "$atomic/pkg" 2>"$work/err"; then ok; else bad "killed after ${delay}s: the manifest vouches for a mixed set"; fi
done
# And killed as soon as the manifest says "complete": false, i.e. among the renames.
for trial in 1 2 3; do
  "$cairn" report "$atomic/caps"/cap*.yaml --out "$atomic/pkg" --svg >/dev/null 2>&1 &
  pid=$!
  while kill -0 "$pid" 2>/dev/null; do
    if grep -q '"complete": false' "$atomic/pkg/cairn-manifest.json" 2>/dev/null; then
      kill -KILL "$pid" 2>/dev/null
      break
    fi
  done
  wait "$pid" 2>/dev/null
  if check_set "$atomic/pkg" 2>"$work/err"; then ok; else bad "killed among the renames: the manifest vouches for a mixed set"; fi
done
expect_status "report of 40 caps after the kills" 0 report "$atomic/caps"/cap*.yaml --out "$atomic/pkg"
if check_set "$atomic/pkg" 2>"$work/err" &&
  python3 -c 'import json,sys; sys.exit(0 if json.load(open(sys.argv[1]))["complete"] is True else 1)' \
    "$atomic/pkg/cairn-manifest.json"; then ok; else bad "report of 40 caps: manifest not complete"; fi
if [ -z "$(find "$atomic/pkg" -name '*cairn-tmp*')" ]; then ok; else
  bad "report of 40 caps: temporaries left: $(find "$atomic/pkg" -name '*cairn-tmp*' | head -n 3)"
fi

# ---- Inputs the fuzz targets found (scripts/fuzz): each runs to a verdict or a located error.
fuzz_replay() {  # fuzz_replay NAME ARGS...
  local name=$1
  shift
  run "$@"
  if [ "$status" -le 2 ] && ! grep -q 'internal error' "$work/err" && ! grep -qwi -e 'nan' -e '-nan' "$work/out"; then
    ok; else bad "fuzz regression $name: exit $status"; fi
}
for file in "$data"/fuzz-regressions/fuzz_project/*; do
  [ -e "$file" ] || continue
  fuzz_replay "$(basename "$file")" check "$file"
done
for file in "$data"/fuzz-regressions/fuzz_reactions/*; do
  [ -e "$file" ] || continue
  replay="$work/fuzz-reactions"
  rm -rf "$replay" && mkdir -p "$replay"
  cp "$src/fuzz/reactions-cap.yaml" "$replay/cap.yaml"
  cp "$file" "$replay/reactions.csv"
  fuzz_replay "$(basename "$file")" check "$replay/cap.yaml"
done

# ---- The demo projects' text, Markdown and CSV outputs against expected/ (scripts/update-expected
# writes them): words and text the same, numbers within one unit in their last printed digit
# (tests/compare_text.py), as the JSON comparison above allows for another compiler's rounding.
for project in "$src"/projects-demo/*/cap.yaml; do
  [ -e "$project" ] || continue
  dir=$(dirname "$project")
  name=$(basename "$dir")
  for expected in "$dir"/expected/check.txt "$dir"/expected/check.md "$dir"/expected/check.csv \
                  "$dir"/expected/capacity.txt; do
    [ -f "$expected" ] || continue
    file=$(basename "$expected")
    case "$file" in
      check.txt) args=(check cap.yaml) ;;
      check.md) args=(check cap.yaml --format markdown) ;;
      check.csv) args=(check cap.yaml --format csv) ;;
      capacity.txt) args=(capacity cap.yaml) ;;
    esac
    (cd "$dir" && "$cairn" "${args[@]}" >"$work/out" 2>"$work/err")
    status=$?
    if [ "$status" -le 1 ] && python3 "$src/tests/compare_text.py" "$expected" "$work/out" >"$work/diff" 2>&1
    then ok; else bad "projects-demo/$name: differs from expected/$file (exit $status): $(tail -n 1 "$work/diff")"; fi
  done
done

# The comparison itself: one unit in the last digit passes, two fail, a changed word fails.
printf 'pile R01: 1094.3 kN, -0.000 m\n' >"$work/expected.txt"
printf 'pile R01: 1094.4 kN, 0.000 m\n' >"$work/one.txt"
printf 'pile R01: 1094.5 kN, 0.000 m\n' >"$work/two.txt"
printf 'pile R02: 1094.3 kN, 0.000 m\n' >"$work/word.txt"
if python3 "$src/tests/compare_text.py" "$work/expected.txt" "$work/one.txt" >/dev/null; then ok; else
  bad "compare_text: one unit in the last digit refused"; fi
if python3 "$src/tests/compare_text.py" "$work/expected.txt" "$work/two.txt" >/dev/null; then
  bad "compare_text: two units in the last digit accepted"; else ok; fi
if python3 "$src/tests/compare_text.py" "$work/expected.txt" "$work/word.txt" >/dev/null; then
  bad "compare_text: a changed word accepted"; else ok; fi
# ---- The calculation package (report): sign-off keys, many caps with an index ----------
expect_status "package: keys with problems" 2 report "$data/package/bad_package.yaml" --out "$work/pkg-bad"
expect_in "package: unknown key named" "$work/err" "bad_package.yaml:25:3: error: package.revison: unknown key; did you mean 'revision'?"
expect_in "package: unknown combination named" "$work/err" "package.show_combinations: combination 'S2' does not exist; did you mean 'S1'?"
if [ ! -e "$work/pkg-bad" ]; then ok; else bad "package: a report with bad input wrote files"; fi
expect_status "package: a foundation file" 0 report "$src/projects-demo/demo-package.yaml" --out "$work/pkg"
for f in index.html bent-3-footing-millbrook-quarry-overland-conveyor-crossing.html \
  bent-3-footing-millbrook-quarry-overland-conveyor-crossing-all-combinations.csv \
  crane-rail-end-block-harwick-bay-precast-yard.html kestrel-ridge-water-tower.html; do
  if [ -s "$work/pkg/$f" ]; then ok; else bad "package: $f not written"; fi
done
expect_in "package: index names the running header's project" "$work/pkg/kestrel-ridge-water-tower.html" '@top-left { content: "cairn demo caps"'
expect_in "package: listing names the index" "$work/out" "index: $work/pkg/index.html"
expect_status "package: one cap keeps its file's name" 0 report "$data/package/good_package.yaml" --out "$work/pkg-one"
if [ -s "$work/pkg-one/good_package.html" ] && [ ! -e "$work/pkg-one/index.html" ]; then ok; else
  bad "package: one cap should write good_package.html and no index"; fi
expect_in "package: sign-off from the keys" "$work/pkg-one/good_package.html" "<td>B. Checker</td>"
# ---- Fixed and partial heads (docs/methods-bending.md) ------------------------------------
expect_status "fixed heads: a check runs" 0 check "$data/bending/fixed_heads.yaml" --format json
if python3 -c '
import json, sys
doc = json.load(open(sys.argv[1]))
for combo in doc["combinations"]:
    for pile in combo["piles"]:
        assert len(pile["head_forces"]) == 6 and "max_moment" in pile, pile["id"]
assert len(doc["cap_stiffness"]["matrix"]) == 6
' "$work/out"; then ok; else bad "fixed heads: head_forces, max_moment, cap_stiffness in JSON"; fi
expect_status "head: partial without head_restraint" 2 check "$data/bending/bad_partial_without_restraint.yaml"
expect_in "head: partial without head_restraint names the key" "$work/err" "pile_types.PART: head: partial needs head_restraint"
# ---- As-built re-check (check/report --as-built SURVEY.csv) --------------------------------
site="$data/site"
expect_status "as-built: offsets within tolerance accepted" 0 check "$site/diamond.yaml" --as-built "$site/within.csv"
expect_in "as-built: verdict in plain words" "$work/out" "Verdict: accept as built"
expect_in "as-built: cap design not checked" "$work/out" "The cap's own structural design"
expect_status "as-built: short pile with a reduced capacity needs remedial work" 1 check "$site/diamond.yaml" --as-built "$site/short_reduced.csv"
expect_in "as-built: remedial" "$work/out" "Verdict: remedial work needed — governing combination S1"
expect_status "as-built: bad survey" 2 check "$site/diamond.yaml" --as-built "$site/bad_status.csv"
expect_in "as-built: file, row and column" "$work/err" "bad_status.csv:3:7: error: row 3, column 'status': expected accepted, damaged, rejected or abandoned, got 'acepted'"
expect_status "as-built: tighter tolerance flags the 50 mm offset" 0 check "$site/diamond.yaml" --as-built "$site/within.csv" --plan-tolerance 40 --format json
if python3 -c 'import json,sys; d=json.load(open(sys.argv[1])); sys.exit(0 if d["verdict"]=="accept, deviations taken by the piles" and d["piles"][0]["out_of_tolerance"] else 1)' "$work/out"; then ok; else bad "as-built: --plan-tolerance 40"; fi
expect_status "as-built: report package" 0 report "$site/diamond.yaml" --as-built "$site/moved.csv" --out "$work/as-built-report"
expect_in "as-built: package section" "$work/as-built-report/diamond.html" "<section id=\"as-built\">"
for survey in "$src"/projects-demo/*/survey.csv; do
  [ -e "$survey" ] || continue
  dir=$(dirname "$survey")
  name=$(basename "$dir")
  (cd "$dir" && "$cairn" check cap.yaml --as-built survey.csv >"$work/out" 2>"$work/err")
  status=$?
  if [ "$status" -le 1 ]; then ok; else bad "projects-demo/$name as built: exit status $status"; fi
  if [ -f "$dir/expected/as-built.txt" ]; then
    if diff -q "$dir/expected/as-built.txt" "$work/out" >/dev/null; then ok; else bad "projects-demo/$name: differs from expected/as-built.txt"; fi
  fi
done
# ---- Site studies and revisions ------------------------------------------------------------
expect_status "diff: new revision passes" 0 diff "$site/diamond.yaml" "$site/diamond_rev.yaml"
expect_in "diff: moved pile" "$work/out" "Pile E moved by (100, 0) mm"
expect_status "diff: new revision fails what passed" 1 diff "$site/diamond.yaml" "$site/diamond_fail.yaml"
expect_in "diff: named" "$work/out" "fails a check the old one passed:** combination S1"
expect_status "diff: old failed, new passes" 0 diff "$site/diamond_fail.yaml" "$site/diamond.yaml"
expect_status "diff: results JSON refused" 2 diff "$site/diamond.yaml" "$work/out.json"
expect_status "safe-region: kern" 0 safe-region "$data/site/square4.yaml" --rays 0
expect_in "safe-region: smallest margin" "$work/out" "Smallest margin: 0.354 m in combination S2"
# Losing any pile of the diamond puts exactly the capacity on two piles (hand derivation in
# tests/test_site_studies.cpp): round-off decides the exit status, the value is 1.
run pile-loss "$site/diamond.yaml" --format json
if [ "$status" -le 1 ] && python3 -c 'import json,sys; d=json.load(open(sys.argv[1])); sys.exit(0 if all(abs(c["max_utilization"]-1)<1e-9 for c in d["single"]) else 1)' "$work/out"; then ok; else bad "pile-loss: the diamond"; fi
expect_status "add-pile: replaces a lost pile" 0 add-pile "$site/diamond.yaml" --type P --lose E
expect_in "add-pile: found" "$work/out" "Found: one pile added at"
expect_status "add-pile: unknown type" 2 add-pile "$site/diamond.yaml" --type Q
expect_in "add-pile: type named" "$work/err" "--type: no pile type 'Q'"
expect_status "tolerance: the diamond within 75 mm" 0 tolerance "$site/diamond.yaml" --trials 500 --seed 3
cp "$work/out" "$work/tolerance-1"
run tolerance "$site/diamond.yaml" --trials 500 --seed 3
if diff -q "$work/out" "$work/tolerance-1" >/dev/null; then ok; else bad "tolerance: the same seed gives the same study"; fi

expect_status "as-built: a foundation survey with a cap column" 0 check "$site/foundation.yaml" --as-built "$site/caps_survey.csv"
expect_in "as-built: second cap's verdict" "$work/out" "Verdict: accept, deviations taken by the piles — governing combination S2"
# ---- cairn design: the demo's search, its chosen file checked again, limits explained.
for design in "$src"/projects-demo/*/design.yaml; do
  [ -e "$design" ] || continue
  dir=$(dirname "$design")
  name=$(basename "$dir")
  scratch="$work/design-$name"
  mkdir -p "$scratch" && cp "$design" "$scratch/design.yaml"
  (cd "$scratch" && "$cairn" design design.yaml --write chosen.yaml --format json >design.json 2>"$work/err")
  status=$?
  if [ "$status" -eq 0 ]; then ok; else bad "design $name: exit status $status, expected 0"; fi
  if [ -f "$dir/expected/chosen.yaml" ] && cmp -s "$scratch/chosen.yaml" "$dir/expected/chosen.yaml"; then ok; else
    bad "design $name: chosen.yaml differs from expected/chosen.yaml"; fi
  if grep -qF "## Best layouts" "$scratch/chosen-search.md" 2>/dev/null; then ok; else
    bad "design $name: chosen-search.md missing or without the table"; fi
  (cd "$scratch" && "$cairn" check chosen.yaml --format json >check.json 2>"$work/err")
  status=$?
  if [ "$status" -eq 0 ]; then ok; else bad "design $name: check chosen.yaml: exit status $status"; fi
  # The chosen file reproduces the search's numbers exactly.
  if python3 - "$scratch/design.json" "$scratch/check.json" <<'PY'
import json, sys
d, c = (json.load(open(f)) for f in sys.argv[1:3])
sys.exit(0 if d["best"][0]["max_utilization"] == c["summary"]["max_utilization"] else
         f'{d["best"][0]["max_utilization"]} != {c["summary"]["max_utilization"]}')
PY
  then ok; else bad "design $name: the chosen file's utilization differs from the search's"; fi
done
expect_status "design: piles too short" 1 design "$data/design/too_short.yaml"
expect_in "design: none passes, explained" "$work/out" "No layout passes every check. The limit that rejects most layouts: pile capacity: no length up to design.length.max carries the load"
expect_in "design: rejections counted" "$work/out" "Layouts rejected, by reason"
expect_status "design: contradictory spacing" 2 design "$data/design/bad_spacing.yaml"
expect_in "design: spacing named" "$work/err" "bad_spacing.yaml:17:12: error: design.spacing: the smallest spacing (4 pile widths) is larger than the largest (3); no layout can meet both"
cp "$data/design/typed.yaml" "$work/typed.yaml"
expect_status "design: --write over the design file" 2 design "$work/typed.yaml" --write "$work/typed.yaml"
expect_in "design: --write over the design file, said" "$work/err" "is the design file itself"
expect_status "check: a design file without piles" 2 check "$data/design/typed.yaml"
expect_in "check: piles missing" "$work/err" "piles: missing"
{ cat "$data/design/typed.yaml"; printf 'piles:\n  - {id: A, x: -0.6, y: -0.6, type: P40}\n  - {id: B, x: 0.6, y: -0.6, type: P40}\n  - {id: C, x: -0.6, y: 0.6, type: P40}\n  - {id: D, x: 0.6, y: 0.6, type: P40}\n'; } >"$work/with-piles.yaml"
expect_status "check: a file with piles and a design section ignores the section" 0 check "$work/with-piles.yaml"
expect_status "design: markdown" 0 design "$data/design/typed.yaml" --format markdown
expect_in "design: markdown table" "$work/out" "## Best layouts"
# Errors by kind: a file that cannot be opened is named without a line (never file:0:0),
# alone or among the caps of a foundation file.
expect_status "a missing project file" 2 check "$work/no-such-cap.yaml"
expect_in "a missing project file is named" "$work/err" "cairn: $work/no-such-cap.yaml: error: cannot open the project file (does it exist?)"
if grep -q ':0:0' "$work/err"; then bad "a missing project file: a location with line 0"; else ok; fi
printf 'title: two caps\ncaps: [no-such-cap.yaml, %s]\n' "$data/base.yaml" >"$work/foundation.yaml"
expect_status "a foundation file with a missing cap" 2 check "$work/foundation.yaml"
if grep -q ':0:0' "$work/err"; then bad "a foundation file: a location with line 0"; else ok; fi
# ---- --detail: levels below full show the full run's tables ---------------------------
crane="$src/projects-demo/crane-rail-footing/cap.yaml"
expect_status "--detail full" 0 check "$crane" --format csv
awk '/^# envelope/{f=1;next} /^$/{f=0} f' "$work/out" >"$work/envelope-full"
expect_status "--detail envelope" 0 check "$crane" --format csv --detail envelope
awk '/^# envelope/{f=1;next} /^$/{f=0} f' "$work/out" >"$work/envelope-brief"
if [ -s "$work/envelope-full" ] && cmp -s "$work/envelope-full" "$work/envelope-brief"; then ok; else
  bad "--detail envelope: the envelope differs from the full output's"
fi
if grep -q '^# Combination' "$work/out"; then bad "--detail envelope: per-combination tables"; else ok; fi
expect_status "--detail summary with an overturned combination" 1 check "$mixed" --detail summary
expect_in "--detail summary names the overturned combination" "$work/out" "Combination S2 (service): 0.25·D + 1.0·O — overturned"
expect_in "--detail summary: the verdict" "$work/out" "FAIL: 1 of 2 combinations fails; the cap overturns in S2"
expect_status "--detail governing --out" 1 check "$mixed" --detail governing --out "$work/governing-out"
for f in report.txt results.json summary.csv governing.csv; do
  if [ -s "$work/governing-out/$f" ]; then ok; else bad "--detail governing --out: $f missing"; fi
done
if [ -e "$work/governing-out/results.csv" ]; then bad "--detail governing --out: results.csv written"; else ok; fi
expect_status "--detail unknown" 2 check "$crane" --detail everything
# Nonlinear soil keys (issue 15): a p-y curve for the other soil and ε50 out of range are
# located input errors.
expect_status "lateral curve on the wrong soil" 2 check "$data/e2e/bad_lateral_curve.yaml"
expect_in "lateral curve on the wrong soil named" "$work/err" "bad_lateral_curve.yaml:7:"
expect_in "lateral curve on the wrong soil says why" "$work/err" "soil.layers[0] ('soft clay').lateral_curve: 'sand_api' is a curve for sand layers, this layer is clay"
expect_in "strain_50 out of range" "$work/err" "strain_50: expected a strain below 0.1"
# ---- nonlinear soil response (issue 15): the switch, its outputs, linear unchanged -------
nl="$data/nonlinear"
expect_status "nonlinear: SI cap passes" 0 check "$nl/lateral_si.yaml"
expect_in "nonlinear: the mode" "$work/out" "Soil response: nonlinear; p-multipliers: by_direction."
expect_in "nonlinear: the curves used" "$work/out" "Curves of pile type PC45: p-y (static): 'soft clay': soft clay below water, Matlock (1970)"
expect_in "nonlinear: the multiplier of each pile" "$work/out" "Nonlinear soil response: piles in each combination"
expect_in "nonlinear: the pushover of the governing combination" "$work/out" "Pushover of combination U1: its loads times λ"
expect_status "nonlinear: JSON" 0 check "$nl/lateral_si.yaml" --format json
if python3 -c '
import json, sys
doc = json.load(sys.stdin)
a = doc["analysis"]
assert a["soil_response"] == "nonlinear" and a["p_multipliers"] == "by_direction", a
assert a["pushover"]["combination"] == "U1" and a["pushover"]["points"][0]["load_factor"] == 0
for c in doc["combinations"]:
    for p in c["piles"]:
        for k in ("head_forces", "head_deflection", "max_moment", "max_moment_depth", "p_multiplier", "axial"):
            assert k in p, (c["id"], p["id"], k)
# The leading row of a load along +x is the row of largest x (AASHTO LRFD Table 10.7.2.4-1).
u1 = {p["id"]: p["p_multiplier"] for p in doc["combinations"][1]["piles"]}
assert u1["A3"] > u1["A2"] > u1["A1"], u1
u2 = {p["id"]: p["p_multiplier"] for p in doc["combinations"][2]["piles"]}
assert u2["A1"] > u2["A3"], u2
' <"$work/out" 2>"$work/err"; then ok; else bad "nonlinear: JSON analysis member or pile fields"; fi
# The streamed JSON (--out) and the one on stdout are the same document.
expect_status "nonlinear: --out" 0 check "$nl/lateral_si.yaml" --format json --out "$work/nl-out"
if cmp -s "$work/out" "$work/nl-out/results.json"; then ok; else bad "nonlinear: results.json differs from stdout"; fi
expect_status "nonlinear: US cap" 0 check "$nl/lateral_us.yaml"
expect_in "nonlinear US: deflections in inches" "$work/out" "Head deflection (in)"
expect_in "nonlinear US: reversing loads" "$work/out" "p-multipliers: reversing."
expect_in "nonlinear US: the chosen combination pushed" "$work/out" "Pushover of combination U-1"
expect_in "nonlinear US: the displacement limit ends the curve" "$work/out" "the displacement limit of"
expect_status "nonlinear: a load above the group's capacity" 1 check "$nl/mechanism.yaml"
expect_in "nonlinear: no equilibrium, named" "$work/out" "the group found no equilibrium beyond λ ="
expect_in "nonlinear: the verdict names it" "$work/out" "no equilibrium (a mechanism) in U1, U2"
# The switch on the command line: linear over the project's key gives the linear run of the
# same project without the analysis section, line for line (but the command and input).
expect_status "--soil-response linear" 0 check "$nl/lateral_si.yaml" --soil-response linear
grep -v '^command:\|^input:' "$work/out" >"$work/nl-linear"
grep -v '^analysis:\|^  soil_response:\|^  p_multipliers:' "$nl/lateral_si.yaml" >"$work/no-analysis.yaml"
expect_status "the same cap without analysis:" 0 check "$work/no-analysis.yaml"
grep -v '^command:\|^input:' "$work/out" >"$work/plain-linear"
if cmp -s "$work/nl-linear" "$work/plain-linear"; then ok; else bad "--soil-response linear differs from the linear run"; fi
if grep -q 'Nonlinear soil response\|Pushover' "$work/plain-linear"; then bad "linear run: nonlinear sections shown"; else ok; fi
# Linear outputs do not change: --soil-response linear on a project without the key.
expect_status "base.yaml, JSON" 0 check "$data/base.yaml" --format json
grep -v '"command"' "$work/out" >"$work/base-default"
expect_status "base.yaml, JSON, --soil-response linear" 0 check "$data/base.yaml" --format json --soil-response linear
grep -v '"command"' "$work/out" >"$work/base-linear"
if cmp -s "$work/base-default" "$work/base-linear"; then ok; else bad "--soil-response linear changes the linear JSON"; fi
if grep -q '"analysis"\|p_multiplier' "$work/base-linear"; then bad "linear JSON: nonlinear fields"; else ok; fi
expect_status "--soil-response nonlinear without p-y curves" 2 check "$data/e2e/soil.yaml" --soil-response nonlinear
expect_in "nonlinear without p-y curves: located" "$work/err" "soil.yaml:8: error: soil.layers[0] ('soft clay').lateral_curve: missing"
expect_status "--soil-response unknown" 2 check "$nl/lateral_si.yaml" --soil-response elastic
sed 's/soil_response: nonlinear/soil_response: plastic/' "$nl/lateral_si.yaml" >"$work/bad-response.yaml"
expect_status "analysis.soil_response unknown" 2 check "$work/bad-response.yaml"
expect_in "analysis.soil_response unknown: located" "$work/err" "bad-response.yaml:37:"
sed 's/p_multipliers: by_direction/p_multipliers: by_direction\n  pushover: U9/' "$nl/lateral_si.yaml" >"$work/bad-pushover.yaml"
expect_status "analysis.pushover unknown" 2 check "$work/bad-pushover.yaml"
expect_in "analysis.pushover unknown: named" "$work/err" "analysis.pushover: combination 'U9' does not exist; did you mean 'U1'?"
# The package of a group with no equilibrium on nonlinear soil says so in those words.
expect_status "report, nonlinear mechanism" 1 report "$nl/mechanism.yaml" --out "$work/mech-package"
if grep -q 'No equilibrium (a mechanism): ' "$work"/mech-package/*.html; then ok; else bad "nonlinear package: no-equilibrium wording"; fi
# report --soil-response: the package of a project without the key, run on nonlinear soil.
expect_status "report --soil-response nonlinear" 0 report "$work/no-analysis.yaml" --out "$work/nl-package" --soil-response nonlinear
if grep -q 'id="nonlinear"' "$work"/nl-package/*.html; then ok; else bad "report --soil-response nonlinear: no nonlinear section"; fi
expect_status "report, linear by default" 0 report "$work/no-analysis.yaml" --out "$work/lin-package"
if grep -q 'id="nonlinear"' "$work"/lin-package/*.html; then bad "report without --soil-response: a nonlinear section"; else ok; fi
# ---- nonlinear runs: CSV columns and the as-built survey's factors ------------------------
nl="$data/nonlinear"
# The CSV of a nonlinear run (--format csv at full detail, results.csv under --out) carries each
# pile's largest moment, its depth, head deflection and p-multiplier, equal to the JSON's.
expect_status "nonlinear CSV: JSON" 0 check "$nl/lateral_si.yaml" --format json
cp "$work/out" "$work/nl-csv.json"
expect_status "nonlinear CSV: --format csv and --out" 0 check "$nl/lateral_si.yaml" --format csv --out "$work/nl-csv-out"
cp "$work/out" "$work/nl-full.csv"
if python3 - "$work/nl-csv.json" "$work/nl-full.csv" "$work/nl-csv-out/results.csv" <<'PY' 2>"$work/err"; then ok; else bad "nonlinear CSV: values differ from the JSON"; fi
import csv, json, sys
doc = json.load(open(sys.argv[1]))
want = {}
for c in doc["combinations"]:
    for p in c["piles"]:
        want[(c["id"], p["id"])] = p
def close(text, value):
    decimals = len(text.split(".")[1]) if "." in text else 0
    return abs(float(text) - value) <= 0.5 * 10 ** -decimals + 1e-12
def check(row, combination):
    p = want[(combination, row["pile"])]
    assert close(row["largest moment (kN·m)"], p["max_moment"]), (combination, row)
    assert close(row["at depth (m)"], p["max_moment_depth"]), (combination, row)
    assert close(row["head deflection (mm)"], p["head_deflection"]), (combination, row)
    assert close(row["p-multiplier"], p["p_multiplier"]), (combination, row)
seen = 0
for row in csv.DictReader(l for l in open(sys.argv[3], encoding="utf-8") if not l.startswith("#")):
    check(row, row["combination"])
    seen += 1
assert seen == len(want), (seen, len(want))
# The full CSV: a table per combination, headed "# Combination <id> (...".
lines = open(sys.argv[2], encoding="utf-8").read().split("\n")
seen = 0
for i, line in enumerate(lines):
    if line.startswith("# Combination "):
        combination = line.split()[2]
        block = []
        for l in lines[i + 1:]:
            if not l:
                break
            block.append(l)
        for row in csv.DictReader(block):
            check(row, combination)
            seen += 1
assert seen == len(want), (seen, len(want))
PY
# A linear run's CSV has no such columns (the same project on linear springs).
expect_status "linear CSV: no nonlinear columns" 0 check "$nl/lateral_si.yaml" --format csv --soil-response linear --out "$work/lin-csv-out"
if grep -q 'head deflection\|p-multiplier' "$work/out" "$work/lin-csv-out/results.csv"; then bad "linear CSV: nonlinear columns"; else ok; fi
# The as-built survey on a nonlinear project: the damaged pile's curves are scaled and it
# carries less than its mirror image A2 (symmetric about the wind's line), on nonlinear soil as
# on linear springs; the run says so.
mkdir -p "$work/nl-site"
cp "$nl/lateral_si.yaml" "$work/nl-site/cap.yaml"
printf 'pile,x,y,status,stiffness_factor,capacity_factor\nA1,-1.6,-0.8,accepted,,\nA2,0.0,-0.8,accepted,,\nA3,1.6,-0.8,accepted,,\nB1,-1.6,0.8,accepted,,\nB2,0.0,0.8,damaged,0.5,0.7\nB3,1.6,0.8,accepted,,\n' >"$work/nl-site/survey.csv"
for response in nonlinear linear; do
  expect_status "as built, $response" 0 check "$work/nl-site/cap.yaml" --as-built "$work/nl-site/survey.csv" --format json --soil-response "$response"
  if python3 -c '
import json, sys
doc = json.load(sys.stdin)
for c in doc["combinations"]:
    piles = {p["id"]: p for p in c["piles"]}
    a2, b2 = piles["A2"], piles["B2"]
    assert abs(a2["design_axial"] - b2["design_axial"]) < 0.1, c
    assert b2["axial"] < 0.9 * a2["axial"], c
' <"$work/out" 2>"$work/err"; then ok; else bad "as built, $response: the damaged pile does not shed load"; fi
done
expect_status "as built, nonlinear: text" 0 check "$work/nl-site/cap.yaml" --as-built "$work/nl-site/survey.csv"
expect_in "as built, nonlinear: the scaled curves named" "$work/out" "and the pile's own stiffness × 0.5 (as built: stiffness_factor)"
expect_in "as built, nonlinear: the mode" "$work/out" "Soil response: nonlinear."
# The site studies work on the linear springs and say so for a nonlinear project.
expect_status "pile-loss on a nonlinear project" 0 pile-loss "$work/nl-site/cap.yaml"
expect_in "pile-loss on a nonlinear project: the warning" "$work/err" "pile-loss studies the cap on its linear springs"
# Cyclic p-y curves for a whole nonlinear run (analysis.lateral_loading), and the cycles a
# curve needs as located errors.
cp "$nl/lateral_si.yaml" "$work/cyclic.yaml"
printf '  lateral_loading: cyclic\n' >>"$work/cyclic.yaml"
expect_status "nonlinear, cyclic curves" 0 check "$work/cyclic.yaml"
expect_in "nonlinear, cyclic curves named" "$work/out" "p-y (cyclic)"
expect_status "nonlinear, cyclic curves: JSON" 0 check "$work/cyclic.yaml" --format json
expect_in "nonlinear, cyclic curves: JSON member" "$work/out" '"lateral_loading": "cyclic"'
cp "$nl/lateral_si.yaml" "$work/cycles-static.yaml"
printf '  load_cycles: 100\n' >>"$work/cycles-static.yaml"
expect_status "load_cycles without cyclic curves" 2 check "$work/cycles-static.yaml"
expect_in "load_cycles without cyclic curves: located" "$work/err" "cycles-static.yaml:$(wc -l <"$work/cycles-static.yaml"):"
expect_in "load_cycles without cyclic curves: why" "$work/err" "give it with lateral_loading: cyclic"
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
