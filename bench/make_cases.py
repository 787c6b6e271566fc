#!/usr/bin/env python3
"""Writes the benchmark's project files: invented pile groups under invented loads.

    make_cases.py DIR piles combinations [--compression-only] [--seed N]
    make_cases.py DIR --caps CAPS piles combinations        (a foundation file of CAPS caps)

A rectangular grid of vertical piles at 1.5 m (one pile type with its springs and
allowable capacities typed in), six load cases (dead, live, wind and seismic along x and y,
applied at the top of a 2 m cap and off the centre) and service combinations of the dead
load with random factors on three of the others. With --compression-only the piles take no
tension and the horizontal loads are large enough that about a third of the combinations
lift piles. Only the Python standard library is used.
"""
import argparse
import math
import os
import random


def grid(piles):
    cols = max(1, int(round(math.sqrt(piles * 1.25))))
    rows = (piles + cols - 1) // cols
    points = []
    for r in range(rows):
        for c in range(cols):
            if len(points) < piles:
                points.append(((c - (cols - 1) / 2) * 1.5, (r - (rows - 1) / 2) * 1.5))
    return points, cols * 1.5, rows * 1.5


def project_text(title, piles, combinations, compression_only, seed):
    rnd = random.Random(seed)
    points, width, length = grid(piles)
    n = len(points)
    lines = [f"title: {title}", "units: SI",
             f"cap: {{thickness: 2.0, outline: {{width: {width + 1.0:.3f}, length: {length + 1.0:.3f}}}}}",
             "pile_types:", "  P40:",
             "    section: {shape: square, width: 0.4}", "    length: 18",
             "    axial_stiffness: 250000", "    lateral_stiffness: 8000"]
    if compression_only:
        lines += ["    tension: false",
                  "    capacity: {compression: 1600, lateral: 250}"]
    else:
        lines += ["    capacity: {compression: 1600, tension: 400, lateral: 90}"]
    lines.append("piles:")
    for i, (x, y) in enumerate(points):
        lines.append(f"  - {{id: P{i + 1:04d}, x: {x:.3f}, y: {y:.3f}, type: P40}}")
    # Horizontal loads at the top of the cap, 2 m above the pile heads; a lever arm about
    # the group that lifts the edge piles in a share of the combinations when they take no
    # tension.
    h = 2.0 if not compression_only else 2.0
    wind = 0.06 * 600 * n if not compression_only else 1.3 * 600 * n
    lines += ["load_cases:",
              f"  D: {{kind: dead, loads: [{{at: [0.3, -0.2, {h}], Fz: {-600 * n}}}]}}",
              f"  L: {{kind: live, loads: [{{at: [-0.5, 0.4, {h}], Fz: {-150 * n}, Mx: {15 * n}}}]}}",
              f"  WX: {{kind: wind, loads: [{{at: [0, 0, {h}], Fx: {wind * 0.25}, My: {wind * width / 12}}}]}}",
              f"  WY: {{kind: wind, loads: [{{at: [0, 0, {h}], Fy: {wind * 0.25}, Mx: {-wind * length / 12}}}]}}",
              f"  EX: {{kind: seismic, loads: [{{at: [0, 0, {h}], Fx: {wind * 0.2}, My: {wind * width / 10}, Mz: {8 * n}}}]}}",
              f"  EY: {{kind: seismic, loads: [{{at: [0, 0, {h}], Fy: {wind * 0.2}, Mx: {-wind * length / 10}}}]}}",
              "combinations:"]
    others = ["L", "WX", "WY", "EX", "EY"]
    for c in range(combinations):
        picked = rnd.sample(others, 3)
        factors = ", ".join(f"{k}: {rnd.uniform(-1.0, 1.0):.2f}" for k in sorted(picked))
        lines.append(f"  C{c + 1:06d}: {{limit_state: service, factors: {{D: 1.0, {factors}}}}}")
    return "\n".join(lines) + "\n"


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument("dir")
    parser.add_argument("piles", type=int)
    parser.add_argument("combinations", type=int)
    parser.add_argument("--compression-only", action="store_true")
    parser.add_argument("--caps", type=int, default=0)
    parser.add_argument("--seed", type=int, default=11)
    parser.add_argument("--name", default="cap")
    a = parser.parse_args()
    os.makedirs(a.dir, exist_ok=True)
    if a.caps:
        names = []
        for k in range(a.caps):
            name = f"cap-{k + 1:04d}.yaml"
            with open(os.path.join(a.dir, name), "w") as f:
                f.write(project_text(f"benchmark cap {k + 1}", a.piles, a.combinations,
                                     a.compression_only, a.seed + k))
            names.append(name)
        with open(os.path.join(a.dir, "foundation.yaml"), "w") as f:
            f.write("caps:\n" + "".join(f"  - {n}\n" for n in names))
    else:
        with open(os.path.join(a.dir, a.name + ".yaml"), "w") as f:
            f.write(project_text(f"benchmark {a.piles} piles x {a.combinations} combinations",
                                 a.piles, a.combinations, a.compression_only, a.seed))


if __name__ == "__main__":
    main()
