#!/usr/bin/env python3
"""Seeded generator of a synthetic mechanism for benchmarks (not physical data).

Each species has 3 to 40 atoms (C, H, O, N) on a random, nonlinear chain with bonds of
1.0-1.5 angstrom, 3N-6 wavenumbers drawn log-uniform between 50 and 3600 cm^-1, an
invented enthalpy of formation, and, for a share of the species (default 20 %), one
hindered rotor about the bond of atoms 1-2 that replaces the lowest wavenumber.
Written as YAML or as XYZ-plus-frequencies (the XYZ form carries no rotor).

Usage: gen_mechanism.py OUT_DIR COUNT [--format yaml|xyz] [--seed 1] [--rotor-share 0.2]
"""
import argparse
import math
import pathlib
import random


def geometry(rng, n):
    """Atom 1 at the origin, atom 2 at +1.5 x; atoms 3.. alternately around atom 1 (x < 0,
    the rotor's top) and on a random walk beyond atom 2, never closer than 0.9 angstrom."""
    pts = [(0.0, 0.0, 0.0), (1.5, 0.0, 0.0)]
    top = [1]
    tip = pts[1]
    while len(pts) < n:
        side = len(pts) % 3 == 0  # about a third go on the top side
        for _ in range(200):
            theta, phi = rng.uniform(0, math.pi), rng.uniform(0, 2 * math.pi)
            r = rng.uniform(1.0, 1.5)
            base = pts[0] if side else tip
            p = (base[0] + r * math.sin(theta) * math.cos(phi), base[1] + r * math.sin(theta) * math.sin(phi),
                 base[2] + r * math.cos(theta))
            if side and p[0] > -0.3:
                continue
            if not side and p[0] < 1.9:
                continue
            if all(math.dist(p, q) > 0.9 for q in pts):
                break
        pts.append(p)
        if side:
            top.append(len(pts))
        else:
            tip = p
    return pts, top


def species(rng, k, rotor_share):
    n = rng.randint(3, 40)
    pts, top = geometry(rng, n)
    symbols = ["C", "C"] + [rng.choice("HHHHCON") for _ in range(n - 2)]
    nu = sorted(math.exp(rng.uniform(math.log(50.0), math.log(3600.0))) for _ in range(3 * n - 6))
    hf = round(rng.uniform(-400.0, 300.0), 3)
    rotor = n >= 4 and rng.random() < rotor_share
    return dict(name=f"S{k:05d}", symbols=symbols, pts=pts, top=top, nu=nu, hf=hf, rotor=rotor,
                barrier=round(rng.uniform(4.0, 20.0), 2), symmetry=rng.choice([1, 3]))


def yaml_text(s):
    lines = [f"name: {s['name']}", "# synthetic benchmark species (invented numbers)", "atoms:"]
    lines += [f"  - [{e}, {x:.5f}, {y:.5f}, {z:.5f}]" for e, (x, y, z) in zip(s["symbols"], s["pts"])]
    lines.append("frequencies: [" + ", ".join(f"{v:.2f}" for v in s["nu"]) + "]")
    lines.append(f"enthalpy_of_formation: {s['hf']}")
    if s["rotor"]:
        top = ", ".join(str(i) for i in s["top"])
        lines += ["hindered_rotors:",
                  f"  - {{bond: [1, 2], symmetry: {s['symmetry']}, barrier: {s['barrier']}, top: [{top}], "
                  f"replaces: {s['nu'][0]:.2f}}}"]
    return "\n".join(lines) + "\n"


def xyz_text(s):
    lines = [str(len(s["symbols"])), f"name={s['name']} enthalpy_of_formation={s['hf']}"]
    lines += [f"{e} {x:.5f} {y:.5f} {z:.5f}" for e, (x, y, z) in zip(s["symbols"], s["pts"])]
    lines.append("frequencies cm^-1")
    lines.append(", ".join(f"{v:.2f}" for v in s["nu"]))
    return "\n".join(lines) + "\n"


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("out")
    ap.add_argument("count", type=int)
    ap.add_argument("--format", choices=["yaml", "xyz"], default="yaml")
    ap.add_argument("--seed", type=int, default=1)
    ap.add_argument("--rotor-share", type=float, default=0.2)
    a = ap.parse_args()
    rng = random.Random(a.seed)
    out = pathlib.Path(a.out)
    out.mkdir(parents=True, exist_ok=True)
    for k in range(a.count):
        s = species(rng, k, a.rotor_share)
        text = yaml_text(s) if a.format == "yaml" else xyz_text(s)
        (out / f"{s['name']}.{a.format}").write_text(text, encoding="utf-8")


if __name__ == "__main__":
    main()
