#!/usr/bin/env python3
"""Writes a big generated cairn project, for measuring how fast a project file is read.

    bench/gen_project.py PILES COMBINATIONS > big.yaml
    /usr/bin/time -v build/cairn check big.yaml --format csv > /dev/null

A square grid of PILES piles of one type under a cap, four load cases and COMBINATIONS
combinations with factors written out. Invented data, for timing only.
"""
import math
import sys


def main():
    piles = int(sys.argv[1]) if len(sys.argv) > 1 else 500
    combinations = int(sys.argv[2]) if len(sys.argv) > 2 else 10000
    side = math.ceil(math.sqrt(piles))
    spacing = 1.5
    width = side * spacing + 1.0
    out = sys.stdout
    out.write("title: generated project for timing\nunits: SI\n")
    out.write(f"cap:\n  thickness: 2.0\n  outline: {{width: {width}, length: {width}, "
              f"center: [0, 0]}}\n")
    out.write("pile_types:\n  P60:\n    section: {shape: round, diameter: 0.6}\n"
              "    length: 20\n    elastic_modulus: 30e6\n    lateral_stiffness: 20000\n"
              "    capacity: {basis: allowable, compression: 3000, tension: 800, lateral: 200}\n")
    out.write("piles:\n")
    origin = -(side - 1) * spacing / 2
    for i in range(piles):
        x = origin + (i % side) * spacing
        y = origin + (i // side) * spacing
        out.write(f"  - {{id: P{i + 1}, x: {x:.3f}, y: {y:.3f}, type: P60}}\n")
    out.write("load_cases:\n"
              "  D: {kind: dead, loads: [{at: [0, 0], Fz: -200000}]}\n"
              "  L: {kind: live, loads: [{at: [0.5, 0], Fz: -60000}]}\n"
              "  W: {kind: wind, loads: [{at: [0, 0], Fx: 2000, My: 8000}]}\n"
              "  E: {kind: seismic, loads: [{at: [0, 0], Fy: 3000, Mx: -9000}]}\n")
    out.write("combinations:\n")
    for c in range(combinations):
        d = 1.0 + (c % 7) * 0.05
        l = (c % 5) * 0.25
        w = ((c % 11) - 5) * 0.1
        e = ((c % 13) - 6) * 0.1
        state = "service"
        out.write(f"  C{c + 1}: {{limit_state: {state}, factors: {{D: {d:.2f}, L: {l:.2f}, "
                  f"W: {w:.2f}, E: {e:.2f}}}}}\n")


if __name__ == "__main__":
    main()
