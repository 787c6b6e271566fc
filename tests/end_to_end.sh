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
for f in report.txt results.json envelope.csv summary.csv combination-S1.csv combination-S2.csv; do
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
if grep -E '^  S1 ' "$work/out" | tail -n 1 | grep -q 'overturns$'; then ok; else
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
# JSON document must match it, apart from "input" and "options" (which name paths and flags).
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
    for key in ("input", "options"):
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
expect_in "reactions: file, row and column named" "$work/err" "bad_value.csv:3: error: row 3, column 'Fy': expected a number (a force in kN), got 'x1'"

expect_status "reactions: a row given twice" 2 check "$data/reactions/bad_repeated.yaml"
expect_in "reactions: repeated row named" "$work/err" "bad_repeated.csv:3: error: row 3: support '101' and load case 'D' were already given in row 2"
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
expect_in "batch names the failing count" "$work/out" "FAIL: 1 of 2 caps fail"
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
# tests/data/fuzz-regressions/pending/ holds those not fixed yet; they are not replayed.
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

echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
