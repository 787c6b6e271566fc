#!/usr/bin/env bash
# Renders the HTML calculation package in a real browser (headless Chromium) and checks that
# the page is not blank, that the DOM holds the plan drawing and the caution, and that the
# browser logged no script or console errors; then prints it to PDF on Letter and A4 paper
# (page count, running header and caution on every page, read with poppler-utils), and
# renders a package of two caps: index links resolve, and the input echo's sizes and
# SHA-256 digests match the files (sha256sum).
#
# Usage: CAIRN=/path/to/cairn tests/browser_render.sh SOURCE_DIR
# Skipped (exit 0, with a message) when /usr/bin/chromium is absent; scripts/install-deps
# installs Debian's chromium package.
set -euo pipefail

src="${1:?usage: browser_render.sh SOURCE_DIR}"
chromium=/usr/bin/chromium
if [ ! -x "$chromium" ]; then
  echo "SKIPPED: chromium not installed"
  exit 0
fi
: "${CAIRN:?set CAIRN to the cairn executable}"

work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
fixture="$src/tests/data/html/cap.yaml"
out="$work/out"
mkdir -p "$out"

fail() {
  echo "browser_render: FAIL: $*" >&2
  exit 1
}

# 1. The report. Exit 1 only means a check failed; 2 means it could not run.
set +e
timeout 60 "$CAIRN" report "$fixture" --out "$out" >"$work/report.log" 2>&1
status=$?
set -e
[ "$status" -le 1 ] || { cat "$work/report.log" >&2; fail "cairn report exited with $status"; }
html="$out/cap.html"
[ -s "$html" ] || fail "cairn report wrote no $html"

# Chromium flags: no network, no first-run or background services, one throwaway profile.
flags=(--headless --no-sandbox --disable-gpu --disable-quic --no-first-run
       --disable-background-networking --disable-component-update --disable-sync
       --disable-extensions --hide-scrollbars --user-data-dir="$work/profile")

# 2. Screenshot, with the browser's log on stderr.
png="$work/page.png"
timeout 60 "$chromium" "${flags[@]}" --enable-logging=stderr --v=0 \
  --screenshot="$png" --window-size=1200,1600 "file://$html" \
  >"$work/shot.out" 2>"$work/shot.err" || { cat "$work/shot.err" >&2; fail "chromium --screenshot failed"; }
[ -s "$png" ] || { cat "$work/shot.err" >&2; fail "no screenshot written"; }

# 3. Not blank: decode the PNG (zlib, no imaging library) and count distinct pixel colours;
#    a blank or error page has a handful, a rendered report with tables and a coloured plan
#    has many. Also require some dark pixels (text).
python3 - "$png" <<'PY' || fail "the rendered page looks blank"
import struct, sys, zlib

data = open(sys.argv[1], "rb").read()
assert data[:8] == b"\x89PNG\r\n\x1a\n", "not a PNG"
pos, chunks = 8, {}
idat = b""
while pos < len(data):
    length, kind = struct.unpack(">I4s", data[pos:pos + 8])
    body = data[pos + 8:pos + 8 + length]
    if kind == b"IHDR":
        width, height, depth, colour, _, _, interlace = struct.unpack(">IIBBBBB", body)
    elif kind == b"IDAT":
        idat += body
    pos += 12 + length
assert depth == 8 and colour in (2, 6) and interlace == 0, f"unexpected PNG format {depth}/{colour}"
bpp = 3 if colour == 2 else 4
raw = zlib.decompress(idat)
stride = width * bpp
rows, prev, at = [], bytearray(stride), 0
for _ in range(height):
    ftype, line = raw[at], bytearray(raw[at + 1:at + 1 + stride])
    at += 1 + stride
    for i in range(stride):
        a = line[i - bpp] if i >= bpp else 0
        b = prev[i]
        c = prev[i - bpp] if i >= bpp else 0
        if ftype == 1: line[i] = (line[i] + a) & 255
        elif ftype == 2: line[i] = (line[i] + b) & 255
        elif ftype == 3: line[i] = (line[i] + (a + b) // 2) & 255
        elif ftype == 4:
            p = a + b - c
            pa, pb, pc = abs(p - a), abs(p - b), abs(p - c)
            line[i] = (line[i] + (a if pa <= pb and pa <= pc else b if pb <= pc else c)) & 255
    rows.append(bytes(line))
    prev = line
colours, dark = set(), 0
for line in rows:
    for i in range(0, stride, bpp):
        r, g, b = line[i], line[i + 1], line[i + 2]
        colours.add((r, g, b))
        if r + g + b < 150: dark += 1
print(f"browser_render: {width}x{height}, {len(colours)} colours, {dark} dark pixels")
sys.exit(0 if len(colours) > 50 and dark > 2000 else 1)
PY

# 4. The DOM after rendering holds the plan, the piles and the caution.
timeout 60 "$chromium" "${flags[@]}" --dump-dom "file://$html" >"$work/dom.html" 2>"$work/dom.err" \
  || { cat "$work/dom.err" >&2; fail "chromium --dump-dom failed"; }
grep -q '<svg[^>]*class="plan"' "$work/dom.html" || fail "the DOM has no plan drawing"
for pile in A1 A2 A3 A4 B2; do
  grep -q "data-pile=\"$pile\"" "$work/dom.html" || fail "the plan has no pile $pile"
done
grep -q 'id="caution"' "$work/dom.html" || fail "the DOM has no caution"
grep -q 'Cap &lt;C4&gt; &amp; grid B' "$work/dom.html" || fail "the title is not escaped as text"

# 5. No console or script errors in the browser's log.
#    Chromium logs every console message of the page as "INFO:CONSOLE:<line>" (older
#    versions "CONSOLE(<line>)"); the report has no scripts, so any such line is a fault.
if grep -E "Uncaught|CONSOLE[:(]|SyntaxError|Failed to load resource|net::ERR_" \
    "$work/shot.err" "$work/dom.err"; then
  fail "the browser logged errors"
fi

# 6. Paper: Chromium's print-to-PDF, opened with poppler's pdfinfo and pdftotext (Debian
#    poppler-utils, installed by scripts/install-deps). Letter is Chromium's default paper
#    (the style sheet says `size: auto`); A4 is forced by one more @page rule. The fixture's
#    package starts each of its 11 sections on a new page (the sign-off and the contents
#    share the first, the design basis follows on the second), so it prints on 10 to 20
#    pages; every page carries the running header "page i of N" and the caution.
command -v pdfinfo >/dev/null && command -v pdftotext >/dev/null \
  || fail "pdfinfo/pdftotext not installed (Debian poppler-utils; scripts/install-deps)"
sed 's|</head>|<style>@page { size: A4; }</style></head>|' "$html" >"$out/cap-a4.html"
for paper in letter a4; do
  page="$html"; [ "$paper" = a4 ] && page="$out/cap-a4.html"
  pdf="$work/$paper.pdf"
  timeout 90 "$chromium" "${flags[@]}" --no-pdf-header-footer --print-to-pdf="$pdf" "file://$page" \
    >"$work/pdf.out" 2>"$work/pdf.err" || { cat "$work/pdf.err" >&2; fail "print-to-pdf ($paper) failed"; }
  pdfinfo "$pdf" >"$work/pdfinfo" 2>&1 || { cat "$work/pdfinfo" >&2; fail "pdfinfo cannot open the $paper PDF"; }
  pages=$(awk '/^Pages:/ {print $2}' "$work/pdfinfo")
  grep -qi "($paper)" "$work/pdfinfo" || fail "the $paper PDF has pages of another size: $(grep 'Page size' "$work/pdfinfo")"
  [ "$pages" -ge 10 ] && [ "$pages" -le 20 ] || fail "the $paper PDF has $pages pages, expected 10 to 20"
  for ((i = 1; i <= pages; i++)); do
    pdftotext -f "$i" -l "$i" "$pdf" "$work/page.txt"
    grep -q "page $i of $pages" "$work/page.txt" || fail "$paper page $i has no running header 'page $i of $pages'"
    grep -q "Results are for checking by a qualified engineer" "$work/page.txt" \
      || fail "$paper page $i has no caution"
  done
  echo "browser_render: $paper PDF, $pages pages, header and caution on each"
done

# 7. Many caps: index.html links every cap's page; every link of the index and every
#    in-page link (contents, inputs → appendix) resolves; the input echo's sizes and
#    SHA-256 digests match the files (sha256sum, coreutils).
many="$work/many"
set +e
timeout 120 "$CAIRN" report "$fixture" "$src/projects-demo/crane-rail-footing/cap.yaml" \
  --out "$many" >"$work/many.log" 2>&1
status=$?
set -e
[ "$status" -le 1 ] || { cat "$work/many.log" >&2; fail "cairn report of two caps exited with $status"; }
[ -s "$many/index.html" ] || fail "no index.html for two caps"
timeout 60 "$chromium" "${flags[@]}" --dump-dom "file://$many/index.html" >"$work/index.dom" 2>/dev/null \
  || fail "chromium cannot open index.html"
python3 - "$many" "$work/index.dom" <<'PY' || fail "the index or the input echo does not check out"
import hashlib, html, os, re, subprocess, sys

folder, dom = sys.argv[1], open(sys.argv[2], encoding="utf-8").read()
pages = re.findall(r'<a href="([^"#]+\.html)"', dom)
assert len(pages) == 2, f"expected 2 cap pages in the index, got {pages}"
sources = re.findall(r'<td><code class="source">([^<]+)</code></td>', dom)
assert len(sources) == 2, f"expected each page's source file in the index, got {sources}"
for page in pages:
    path = os.path.join(folder, html.unescape(page))
    assert os.path.isfile(path), f"index link {page} does not resolve"
    text = open(path, encoding="utf-8").read()
    ids = set(re.findall(r'\bid="([^"]+)"', text))
    for target in re.findall(r'href="#([^"]+)"', text):
        assert target in ids, f"{page}: link #{target} has no target"
    # The input echo: file (relative to the project file), bytes, SHA-256.
    echo = text[text.index('class="input-echo"'):]
    echo = echo[:echo.index("</table>")]
    rows = re.findall(r'<code>([^<]+)</code></a></td><td>([^<]+)</td><td class="num">(\d+)</td>'
                      r'<td><code class="digest">([0-9a-f]{64})</code>', echo)
    assert rows, f"{page}: no input echo rows"
    # Paths in the echo are relative to the project file's folder (the page's "input").
    given = re.search(r'<tr><th>input</th><td><code>([^<]+)</code>', text)
    assert given, f"{page}: no input file in the title block"
    base = os.path.dirname(html.unescape(given.group(1)))
    for name, role, size, digest in rows:
        name = html.unescape(name)
        path_in = os.path.normpath(os.path.join(base, name))
        assert os.path.isfile(path_in), f"{page}: input {name} not found at {path_in}"
        assert os.path.getsize(path_in) == int(size), f"{page}: {name} size differs"
        out = subprocess.run(["sha256sum", path_in], capture_output=True, text=True, check=True)
        assert out.stdout.split()[0] == digest, f"{page}: {name} SHA-256 differs from sha256sum"
    print(f"browser_render: {page}: {len(rows)} input files match sha256sum, links resolve")
PY

echo "browser_render: ok"
