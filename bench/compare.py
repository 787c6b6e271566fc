#!/usr/bin/python3
"""cairn against the numpy peer (bench/peer_rigid_cap.py) on the same generated cases.

    bench/compare.py [--cairn build/cairn] [--work /tmp/cairn-bench] [--scale 1.0] [--json]
                     [--only NAME ...] [--repeat N] [--blas DIR]

Generates the cases under --work (never in the repository), checks that the peer agrees with
cairn to 1e-9 on a smaller case of each kind (cairn's JSON, full precision) and that the
envelope tables of the timed cases are the same text, then runs each program once per case
under /usr/bin/time -v and prints wall time, peak memory and the ratio peer / cairn.
--scale shrinks every case (0.1 for a quick look); --json adds cairn's JSON of the linear
case (the peer writes no JSON). --repeat N runs every timing N times and keeps the median
(the machine may be shared). --blas DIR puts DIR first on the peer's LD_LIBRARY_PATH, e.g.
the folder of an optimized libblas.so.3 (OpenBLAS); the BLAS the peer's numpy loads is
printed.

After reading: for the two 500 × 10,000 envelope cases each program also runs reading
alone (cairn's bench_read_project, the peer's `read` mode: the file into the arrays the
solve starts from), and the time after reading is the full run's less that run's (start-up
cancels). The solver core: bench_cap_solver's CPU time against the peer's `core` mode.
Needs Debian's python3 with python3-numpy and python3-yaml: scripts/install-deps --bench
installs them.
"""
import argparse
import json
import os
import re
import statistics
import subprocess
import sys

HERE = os.path.dirname(os.path.abspath(__file__))
PY = "/usr/bin/python3"
PEER = os.path.join(HERE, "peer_rigid_cap.py")
MAKE = os.path.join(HERE, "make_cases.py")


def timed_once(cmd, out_path, cwd, env=None):
    """Wall seconds and peak resident memory (MB) of cmd, stdout to out_path."""
    with open(out_path, "wb") as out:
        proc = subprocess.run(["/usr/bin/time", "-v"] + cmd, stdout=out, stderr=subprocess.PIPE,
                              cwd=cwd, env=env)
    err = proc.stderr.decode(errors="replace")
    if proc.returncode not in (0, 1):
        sys.exit(f"compare: {' '.join(cmd)} failed ({proc.returncode}):\n{err[-2000:]}")
    wall = re.search(r"Elapsed \(wall clock\) time.*: (?:(\d+):)?(\d+):([\d.]+)", err)
    h, m, s = wall.groups()
    seconds = int(h or 0) * 3600 + int(m) * 60 + float(s)
    rss = int(re.search(r"Maximum resident set size \(kbytes\): (\d+)", err).group(1)) / 1024
    cpu = re.search(r"Percent of CPU this job got: (\d+)%", err).group(1)
    user = float(re.search(r"User time \(seconds\): ([\d.]+)", err).group(1))
    system = float(re.search(r"System time \(seconds\): ([\d.]+)", err).group(1))
    return seconds, rss, int(cpu), user + system


def timed(cmd, out_path, cwd, repeat=1, env=None):
    """The median wall time of `repeat` runs, with the largest peak memory and CPU share,
    and the median CPU time (user + system: less disturbed than wall time on a busy machine)."""
    runs = [timed_once(cmd, out_path, cwd, env) for _ in range(repeat)]
    return (statistics.median(r[0] for r in runs), max(r[1] for r in runs),
            max(r[2] for r in runs), statistics.median(r[3] for r in runs))


def make(work, name, piles, combos, *extra):
    path = os.path.join(work, name)
    if not os.path.exists(path + (".yaml" if "--caps" not in extra else "")):
        if "--caps" in extra:
            subprocess.run([PY, MAKE, path, *extra, str(piles), str(combos)], check=True)
        else:
            subprocess.run([PY, MAKE, work, str(piles), str(combos), "--name", name, *extra],
                           check=True)
    return path


def envelope_of(csv_text):
    """The envelope section of cairn's CSV (the whole text when it is the envelope alone)."""
    lines = csv_text.splitlines()
    if "# envelope" in lines:
        lines = lines[lines.index("# envelope") + 1:]
    body = []
    for line in lines:
        if not line or line.startswith("#"):
            if body:
                break
            continue
        body.append(line)
    return "\n".join(body) + "\n"


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--cairn", default=os.path.join(HERE, "..", "build", "cairn"))
    ap.add_argument("--work", default="/tmp/cairn-bench")
    ap.add_argument("--scale", type=float, default=1.0)
    ap.add_argument("--json", action="store_true")
    ap.add_argument("--only", nargs="*")
    ap.add_argument("--repeat", type=int, default=1)
    ap.add_argument("--blas")
    a = ap.parse_args()
    cairn = os.path.abspath(a.cairn)
    peer_env = None
    if a.blas:
        peer_env = dict(os.environ)
        peer_env["LD_LIBRARY_PATH"] = a.blas + (":" + os.environ["LD_LIBRARY_PATH"]
                                               if os.environ.get("LD_LIBRARY_PATH") else "")
    blas = subprocess.run(
        [PY, "-c", "import numpy; print(sorted({l.split()[-1] for l in open('/proc/self/maps') "
                   "if 'blas' in l and len(l.split()) > 5}))"],
        capture_output=True, text=True, env=peer_env).stdout.strip()
    print(f"the peer's numpy loads: {blas}")
    read_only = os.path.join(os.path.dirname(cairn), "bench_read_project")
    try:
        subprocess.run([PY, "-c", "import numpy, yaml; yaml.CSafeLoader"], check=True,
                       stderr=subprocess.DEVNULL)
    except subprocess.CalledProcessError:
        sys.exit("compare: needs python3-numpy and python3-yaml: scripts/install-deps --bench")
    help_text = subprocess.run([cairn, "check", "--help"], capture_output=True, text=True).stdout
    has_detail = "--detail" in help_text
    detail = (lambda level: ["--detail", level]) if has_detail else (lambda level: [])
    os.makedirs(a.work, exist_ok=True)
    s = lambda k: max(1, int(k * a.scale))
    tag = f"s{a.scale:g}"

    # Agreement to 1e-9 first, on the same kinds of project at 500 × 300.
    for kind, extra in (("linear", []), ("compression-only", ["--compression-only"])):
        small = make(a.work, f"agree-{kind}", 500, 300, *extra)
        js = small + ".json"
        with open(js, "wb") as f:
            subprocess.run([cairn, "check", small + ".yaml", "--format", "json"], stdout=f)
        r = subprocess.run([PY, PEER, "agree", small + ".yaml", js], capture_output=True, text=True)
        print(f"agreement, {kind}, 500 × 300: {r.stdout.strip() or r.stderr.strip()}")
        if r.returncode != 0:
            sys.exit("compare: the peer does not agree with cairn; nothing timed")

    rows = []

    after = []

    def run(name, cairn_cmd, peer_cmd, cwd, check_envelope=False, reading=None):
        if a.only and not any(o in name for o in a.only):
            return
        c_out, p_out = os.path.join(a.work, "cairn.out"), os.path.join(a.work, "peer.out")
        ct, cm, cc, c_cpu = timed(cairn_cmd, c_out, cwd, a.repeat)
        pt, pm, pc, p_cpu = (timed(peer_cmd, p_out, cwd, a.repeat, peer_env) if peer_cmd
                             else (None, None, None, None))
        if reading and peer_cmd and os.path.exists(read_only):
            scratch = os.path.join(a.work, "read.out")
            cr, _, _, cr_cpu = timed([read_only, reading], scratch, cwd, a.repeat)
            pr, _, _, pr_cpu = timed([PY, PEER, "read", reading], scratch, cwd, a.repeat,
                                     peer_env)
            after.append((name, cr, ct - cr, pr, pt - pr, c_cpu - cr_cpu, p_cpu - pr_cpu))
        note = ""
        if check_envelope:
            same = envelope_of(open(c_out).read()) == envelope_of(open(p_out).read())
            if not same:
                sys.exit(f"compare: {name}: the envelopes differ ({c_out}, {p_out})")
            note = "envelopes equal"
        rows.append((name, ct, cm, cc, pt, pm, note, os.path.getsize(c_out)))
        print(f"  {name}: cairn {ct:.2f} s {cm:.0f} MB" +
              (f", peer {pt:.2f} s {pm:.0f} MB" if pt else ""), flush=True)

    n, m = 500, s(10000)
    for kind, extra in (("linear", []), ("compression-only", ["--compression-only"])):
        case = make(a.work, f"{kind}-{n}x{m}-{tag}", n, m, *extra) + ".yaml"
        run(f"{n} × {m} {kind}, envelope", [cairn, "check", case, "--format", "csv"] +
            detail("envelope"), [PY, PEER, "envelope", case], a.work, check_envelope=True,
            reading=case)
        if has_detail:
            run(f"{n} × {m} {kind}, full CSV", [cairn, "check", case, "--format", "csv"],
                [PY, PEER, "full", case], a.work)
        if a.json and kind == "linear":
            run(f"{n} × {m} {kind}, full JSON", [cairn, "check", case, "--format", "json"],
                None, a.work)
    caps = s(500)
    found = make(a.work, f"caps-{caps}-{tag}", 20, 1000, "--caps", str(caps))
    files = sorted(f for f in os.listdir(found) if f.startswith("cap-"))
    run(f"{caps} caps × 20 piles × 1000, summary",
        [cairn, "check", "foundation.yaml", "--format", "csv"],
        [PY, PEER, "summary"] + files, found)
    for combos in (s(10000), s(100000)):
        case = make(a.work, f"linear-100x{combos}-{tag}", 100, combos) + ".yaml"
        run(f"100 × {combos} linear, summary", [cairn, "check", case, "--format", "csv"] +
            detail("summary"), [PY, PEER, "summary", case], a.work)

    # The solver core: cairn's bench_cap_solver (500 × 10,000 linear, streamed, and the floor
    # of writing its n·m results) against the peer's solve and utilization after reading.
    bench = os.path.join(os.path.dirname(cairn), "bench_cap_solver")
    core = None
    if os.path.exists(bench) and (not a.only or any("core" in o for o in a.only)):
        r = subprocess.run([bench, "--benchmark_filter=Linear500|LinearArrays500|LinearKept500|Floor500",
                            f"--benchmark_repetitions={a.repeat}", "--benchmark_format=json"],
                           capture_output=True, text=True)
        times = {}
        for b in json.loads(r.stdout)["benchmarks"]:
            if b.get("run_type", "iteration") == "iteration":
                times.setdefault(b["name"].split("/")[0], []).append(b["cpu_time"])
        times = {k: statistics.median(v) for k, v in times.items()}
        # bench_cap_solver's case is 500 × 10,000 whatever --scale says; so is the peer's.
        case = make(a.work, "linear-500x10000-s1", 500, 10000) + ".yaml"
        peer_core = statistics.median(
            float(subprocess.run([PY, PEER, "core", case], capture_output=True, text=True,
                                 env=peer_env).stdout) * 1000 for _ in range(a.repeat))
        core = (times["BM_SolveLinear500x10000"], times["BM_WriteFloor500x10000"], peer_core,
                times.get("BM_SolveLinearArrays500x10000"), times.get("BM_SolveLinearKept500x10000"))

    print()
    if core:
        c, floor, p, arrays, kept = core
        print(f"solver core, 500 × 10,000 linear (CPU time): cairn {c:.1f} ms, "
              f"floor (writing n·m results) {floor:.1f} ms, cairn / floor {c / floor:.2f}; "
              f"numpy peer {p:.1f} ms, peer / cairn {p / c:.1f}×")
        if arrays and kept:
            # Axial and lateral alone, as the peer computes them: each combination's arrays
            # overwriting the last's, and kept for every pile and combination (80 MB) as the
            # peer keeps them.
            print(f"  axial and lateral only: {arrays:.1f} ms (peer / cairn {p / arrays:.1f}×); "
                  f"kept for every pile and combination: {kept:.1f} ms "
                  f"(peer / cairn {p / kept:.1f}×)")
        print()
    print("| case | cairn | cairn memory | numpy peer | peer memory | peer / cairn |")
    print("|---|---|---|---|---|---|")
    for name, ct, cm, cc, pt, pm, note, size in rows:
        peer = f"{pt:.2f} s" if pt else "—"
        pmem = f"{pm:.0f} MB" if pm else "—"
        ratio = f"{pt / ct:.2f}×" if pt else "—"
        print(f"| {name} | {ct:.2f} s | {cm:.0f} MB | {peer} | {pmem} | {ratio} |")
    if after:
        print()
        print("After reading (a full run less a run that only reads):")
        print()
        print("| case | cairn reading | cairn after reading | peer reading | peer after reading "
              "| peer / cairn after reading | the same in CPU time |")
        print("|---|---|---|---|---|---|---|")
        for name, cr, ca, pr, pa, ca_cpu, pa_cpu in after:
            # Below the noise of the two runs at small scales: no ratio.
            ratio = f"{pa / ca:.1f}×" if ca > 0 and pa > 0 else "—"
            cpu = (f"{ca_cpu:.2f} s, {pa_cpu:.2f} s: {pa_cpu / ca_cpu:.1f}×"
                   if ca_cpu > 0 and pa_cpu > 0 else "—")
            print(f"| {name} | {cr:.2f} s | {ca:.2f} s | {pr:.2f} s | {pa:.2f} s | {ratio} "
                  f"| {cpu} |")


if __name__ == "__main__":
    main()
