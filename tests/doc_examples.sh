#!/usr/bin/env bash
# Every complete project example in README.md and docs/*.md runs as shown.
#
#   CAIRN=/path/to/cairn bash tests/doc_examples.sh <source dir>
#
# A ```yaml block is a complete project when it has top-level `piles:` and `combinations:`
# keys. Blocks that name other files (include, loads_from, file:) are checked where those
# files exist beside the document; otherwise they are skipped and counted. Each complete
# example must exit 0 or 1 (it ran; a check may fail), never 2 (could not run).
# Prints one line per failure and a final line 'N passed, M failed'.
set -u
src=${1:?usage: CAIRN=<cairn executable> bash tests/doc_examples.sh <source dir>}
cairn=${CAIRN:?set CAIRN to the path of the cairn executable}
python3 - "$cairn" "$src" <<'PY'
import glob, os, re, subprocess, sys, tempfile
cairn, src = sys.argv[1], sys.argv[2]
docs = [os.path.join(src, 'README.md')] + sorted(glob.glob(os.path.join(src, 'docs', '*.md')))
passed = failed = skipped = 0
for doc in docs:
    text = open(doc, encoding='utf-8').read()
    for i, block in enumerate(re.findall(r'```yaml\n(.*?)```', text, re.S), start=1):
        if not (re.search(r'^piles:', block, re.M) and re.search(r'^combinations:', block, re.M)):
            continue
        name = f'{os.path.relpath(doc, src)}, yaml example {i}'
        if re.search(r'^\s*(include|loads_from|file):', block, re.M):
            skipped += 1
            continue
        with tempfile.TemporaryDirectory() as work:
            path = os.path.join(work, 'example.yaml')
            with open(path, 'w', encoding='utf-8') as f:
                f.write(block)
            for command in (['check', path], ['check', path, '--format', 'json']):
                r = subprocess.run([cairn] + command, capture_output=True, text=True, timeout=60)
                if r.returncode in (0, 1):
                    passed += 1
                else:
                    failed += 1
                    first = (r.stderr.strip().splitlines() or [''])[0]
                    print(f'FAIL: {name}: cairn {command[0]} exited {r.returncode}: {first}')
if passed == 0:
    failed += 1
    print('FAIL: no complete project example found in README.md or docs/')
print(f'{passed} passed, {failed} failed' + (f', {skipped} skipped' if skipped else ''))
sys.exit(1 if failed else 0)
PY
