#!/usr/bin/python3
"""The rigid-cap check as a computational engineer would write it with numpy: the peer
that bench/compare.sh times against cairn on the same generated project files.

    peer_rigid_cap.py envelope CAP.yaml            envelope CSV on stdout
    peer_rigid_cap.py full CAP.yaml                the long CSV (one row per combination and pile)
    peer_rigid_cap.py summary CAP.yaml [...]       one summary row per cap
    peer_rigid_cap.py agree CAP.yaml CAIRN.json    compares with cairn's JSON to 1e-9
    peer_rigid_cap.py core CAP.yaml                CPU seconds of the solve alone
    peer_rigid_cap.py read CAP.yaml                reading alone (the file into the arrays)

The same method as cairn's solver (docs/methods.md): a rigid cap with six degrees of
freedom on axial and lateral pile-head springs, K = Σ Tᵢᵀ·Kᵢ·Tᵢ, one factorization, the load
cases solved once and every combination's movement as one matrix product; combinations that
lift compression-only piles re-solved with the active set, all those with one active set
together. Utilization is the largest of compression / allowable compression, tension /
allowable tension and lateral / allowable lateral (a demand below 1e-6 kN is none), the
envelope takes the first combination of the largest value, as cairn does.

Reads only what bench/make_cases.py writes: SI, one or more pile types with typed-in
springs and allowable capacities, vertical or battered piles, point loads, service
combinations with factors. Debian's python3 with python3-numpy and python3-yaml (C loader).
"""
import math
import sys

import numpy as np
import yaml

TOL = 1e-6          # kN: a smaller demand is none (cairn's checks)
TENSION_SHARE = 1e-12


def load(path):
    with open(path, "rb") as f:
        return yaml.load(f, Loader=yaml.CSafeLoader)


def model(doc):
    types = doc["pile_types"]
    piles = doc["piles"]
    n = len(piles)
    ids = [str(p["id"]) for p in piles]
    xyz = np.array([[float(p["x"]), float(p["y"]), 0.0] for p in piles])
    axis = np.tile([0.0, 0.0, -1.0], (n, 1))
    for i, p in enumerate(piles):
        b = p.get("batter")
        if b:
            t = math.radians(float(b["toward"]))
            h = 1.0 / float(b["ratio"])
            v = np.array([h * math.cos(t), h * math.sin(t), -1.0])
            axis[i] = v / np.linalg.norm(v)
    ka = np.array([float(types[p["type"]]["axial_stiffness"]) for p in piles])
    kl = np.array([float(types[p["type"]].get("lateral_stiffness", 0.0)) for p in piles])
    tension = np.array([bool(types[p["type"]].get("tension", True)) for p in piles])
    cap = lambda p, k: types[p["type"]]["capacity"].get(k)
    caps = {k: np.array([np.nan if cap(p, k) is None else float(cap(p, k)) for p in piles])
            for k in ("compression", "tension", "lateral")}
    # Reference point: the heads' centroid weighted by vertical stiffness.
    w = ka * axis[:, 2] ** 2 + kl * (1 - axis[:, 2] ** 2)
    c = (w[:, None] * xyz).sum(0) / w.sum()
    r = xyz - c
    # T_i = [I | −[r]×]: head movement u = t + θ × r.
    T = np.zeros((n, 3, 6))
    T[:, :, :3] = np.eye(3)
    T[:, 0, 4], T[:, 0, 5] = r[:, 2], -r[:, 1]
    T[:, 1, 3], T[:, 1, 5] = -r[:, 2], r[:, 0]
    T[:, 2, 3], T[:, 2, 4] = r[:, 1], -r[:, 0]
    A = np.einsum("ni,nij->nj", axis, T)                  # a·u = A_i·U
    P = np.eye(3)[None] - axis[:, :, None] * axis[:, None, :]
    lat = np.einsum("nij,njk->nik", P, T)                 # (I − aaᵀ)·u
    K_ax = ka[:, None, None] * A[:, :, None] * A[:, None, :]
    K_lat = kl[:, None, None] * np.einsum("nij,nik->njk", lat, lat)
    cases = list(doc["load_cases"].keys())
    F_case = np.zeros((6, len(cases)))
    for j, name in enumerate(cases):
        for ld in doc["load_cases"][name]["loads"]:
            at = np.array((list(map(float, ld["at"])) + [0.0])[:3])
            f = np.array([float(ld.get(k, 0.0)) for k in ("Fx", "Fy", "Fz")])
            m = np.array([float(ld.get(k, 0.0)) for k in ("Mx", "My", "Mz")])
            F_case[:3, j] += f
            F_case[3:, j] += m + np.cross(at - c, f)
    combos = doc["combinations"]
    combo_ids = [str(k) for k in combos]
    index = {name: j for j, name in enumerate(cases)}
    factors = np.zeros((len(cases), len(combos)))
    for k, name in enumerate(combos):
        for case, factor in combos[name]["factors"].items():
            factors[index[case], k] = float(factor)
    return dict(n=n, ids=ids, ka=ka, kl=kl, tension=tension, caps=caps, A=A, lat=lat,
                K_ax=K_ax, K_lat=K_lat, F=F_case @ factors, F_case=F_case, factors=factors,
                combo_ids=combo_ids, T=T)


def solve(m):
    """Pile forces of every combination: axial (n×m), lateral (n×m), active (n×m)."""
    K_ax, K_lat, A, lat = m["K_ax"], m["K_lat"], m["A"], m["lat"]
    K = K_ax.sum(0) + K_lat.sum(0)
    factor = np.linalg.cholesky(K)
    U_case = np.linalg.solve(factor.T, np.linalg.solve(factor, m["F_case"]))
    U = U_case @ m["factors"]                             # 6 × m, one product
    F = m["F"]
    ncomb = U.shape[1]
    active = np.ones((m["n"], ncomb), dtype=bool)
    co = ~m["tension"]
    if co.any():
        def lifting(U_sub, act):
            along = A @ U_sub
            heads = np.sqrt(((m["T"].reshape(-1, 6) @ U_sub).reshape(m["n"], 3, -1) ** 2).sum(1))
            tol = TENSION_SHARE * heads.max(0)
            drop = act & co[:, None] & (along < -tol)
            add = ~act & co[:, None] & (along > tol)
            return drop, add
        drop, add = lifting(U, active)
        pending = np.nonzero(drop.any(0))[0]
        act = active[:, pending].copy()
        act[drop[:, pending]] = False
        for _ in range(4 * m["n"] + 20):
            if pending.size == 0:
                break
            U_sub = np.empty((6, pending.size))
            # One factorization per active set, all its combinations together.
            keys, groups = np.unique(np.packbits(act, axis=0), axis=1, return_inverse=True)
            for g in range(keys.shape[1]):
                cols = np.nonzero(groups.ravel() == g)[0]
                out = ~act[:, cols[0]]
                Kg = K - K_ax[out].sum(0)
                U_sub[:, cols] = np.linalg.solve(Kg, F[:, pending[cols]])
            drop, add = lifting(U_sub, act)
            settled = ~(drop.any(0) | add.any(0))
            done = pending[settled]
            U[:, done] = U_sub[:, settled]
            active[:, done] = act[:, settled]
            act = act[:, ~settled]
            act[drop[:, ~settled]] = False
            act[add[:, ~settled]] = True
            pending = pending[~settled]
        if pending.size:
            raise SystemExit("peer: the active set did not settle")
    axial = np.where(active, m["ka"][:, None] * (A @ U), 0.0)
    v = (lat.reshape(-1, 6) @ U).reshape(m["n"], 3, -1)
    lateral = m["kl"][:, None] * np.sqrt((v ** 2).sum(1))
    return axial, lateral, active


def utilization(m, axial, lateral):
    caps = m["caps"]

    def ratio(demand, capacity):
        with np.errstate(divide="ignore", invalid="ignore"):
            u = np.where(np.isnan(capacity[:, None]) | (capacity[:, None] <= 0), np.inf,
                         demand / capacity[:, None])
        return np.where(demand > TOL, u, -1.0)

    stack = np.stack([ratio(axial, caps["compression"]), ratio(-axial, caps["tension"]),
                      ratio(lateral, caps["lateral"])])
    check = stack.argmax(0)
    util = stack.max(0)
    none = util < 0
    util[none] = 0.0
    check = np.where(none, 3, check)
    return util, check


CHECKS = np.array(["compression", "tension", "lateral", "none"])


def fixed(values, decimals):
    out = np.char.mod(f"%.{decimals}f", np.where(np.abs(values) < 5e-7, 0.0, values))
    return np.where(np.char.equal(out, f"-{0:.{decimals}f}"), f"{0:.{decimals}f}", out)


def util_text(u):
    return np.where(np.isinf(u), "no capacity", fixed(np.where(np.isinf(u), 0.0, u), 3))


def envelope_rows(m, axial, lateral, util, check):
    ids = np.array(m["combo_ids"])

    def extreme(values, tol):
        k = values.argmax(1)
        v = values[np.arange(values.shape[0]), k]
        named = v > tol
        return np.where(named, v, 0.0), np.where(named, ids[k], "-"), k

    cmp, cmp_c, _ = extreme(axial, TOL)
    ten, ten_c, _ = extreme(-axial, TOL)
    lat, lat_c, _ = extreme(lateral, TOL)
    ut, ut_c, k = extreme(util, 0.0)
    gov = np.where(ut > 0, CHECKS[check[np.arange(m["n"]), k]], "none")
    result = np.where((util <= 1.0).all(1), "pass", "fail")
    lines = ["pile,max compression (kN),combination,max tension (kN),combination,"
             "max lateral (kN),combination,max utilization,combination,check,result"]
    cols = [np.array(m["ids"]), fixed(cmp, 1), cmp_c, fixed(ten, 1), ten_c, fixed(lat, 1), lat_c,
            util_text(ut), ut_c, gov, result]
    lines += [",".join(row) for row in zip(*cols)]
    return "\n".join(lines) + "\n"


def full_csv(m, axial, lateral, active, util, check, out):
    out.write("combination,pile,axial (kN),lateral (kN),utilization,check,state,result\n")
    n, ncomb = axial.shape
    combo = np.repeat(np.array(m["combo_ids"]), n)
    pile = np.tile(np.array(m["ids"]), ncomb)
    state = np.where(active.T.ravel(), "in contact", "dropped out")
    result = np.where(util.T.ravel() <= 1.0, "pass", "fail")
    cols = [combo, pile, fixed(axial.T.ravel(), 1), fixed(lateral.T.ravel(), 1),
            util_text(util.T.ravel()), CHECKS[check.T.ravel()], state, result]
    block = 1 << 18
    for s in range(0, combo.size, block):
        out.write("\n".join(",".join(r) for r in zip(*(c[s:s + block] for c in cols))) + "\n")


def main():
    mode, files = sys.argv[1], sys.argv[2:]
    if mode == "agree":
        import json
        m = model(load(files[0]))
        axial, lateral, active = solve(m)
        util, _ = utilization(m, axial, lateral)
        with open(files[1]) as f:
            doc = json.load(f)
        worst = 0.0
        scale = max(np.abs(axial).max(), lateral.max(), 1.0)
        for k, combo in enumerate(doc["combinations"]):
            assert combo["id"] == m["combo_ids"][k]
            for i, p in enumerate(combo["piles"]):
                worst = max(worst, abs(p["axial"] - axial[i, k]) / scale,
                            abs(p["lateral"] - lateral[i, k]) / scale,
                            abs(p["utilization"] - util[i, k]))
                if p["active"] != bool(active[i, k]):
                    raise SystemExit(f"peer: pile {p['id']} in {combo['id']}: active differs")
        print(f"largest difference {worst:.3g} (forces over the largest force)")
        if not worst <= 1e-9:
            raise SystemExit("peer: does not agree with cairn to 1e-9")
        return
    if mode == "core":
        # The solver core alone, after reading: the axial and lateral force of every pile in
        # every combination (CPU time, as cairn's bench_cap_solver reports it).
        import time
        m = model(load(files[0]))
        start = time.process_time()
        solve(m)
        print(f"{time.process_time() - start:.6f}")
        return
    if mode == "read":
        # Reading alone, for the time after reading (a full run less this one): the file
        # read and turned into the arrays the solve starts from.
        m = model(load(files[0]))
        print(f"{m['n']} piles, {len(m['combo_ids'])} combinations read")
        return
    if mode == "summary":
        print("file,piles,combinations,max utilization,pile,combination,check,result")
        for path in files:
            m = model(load(path))
            axial, lateral, _ = solve(m)
            util, check = utilization(m, axial, lateral)
            k, i = np.unravel_index(np.argmax(util.T), util.T.shape)
            print(f"{path},{m['n']},{util.shape[1]},{util_text(np.array([util[i, k]]))[0]},"
                  f"{m['ids'][i]},{m['combo_ids'][k]},{CHECKS[check[i, k]]},"
                  f"{'pass' if (util <= 1).all() else 'fail'}")
        return
    m = model(load(files[0]))
    axial, lateral, active = solve(m)
    util, check = utilization(m, axial, lateral)
    if mode == "envelope":
        sys.stdout.write(envelope_rows(m, axial, lateral, util, check))
    elif mode == "full":
        full_csv(m, axial, lateral, active, util, check, sys.stdout)
    else:
        raise SystemExit(f"peer: unknown mode {mode}")


if __name__ == "__main__":
    main()
