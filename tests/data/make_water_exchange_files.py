#!/usr/bin/python3
"""Writes the QCSchema and Molden test files of the water model from water-model-hessian-full.yaml.

Usage: /usr/bin/python3 tests/data/make_water_exchange_files.py   (needs PyYAML and NumPy, Debian)

The geometry is that of tests/data/water.yaml (Hoy & Bunker 1979, values from memory) in
bohr (CODATA 2018 a0); the Hessian is the model force field of water-model-hessian-full.yaml
(NOT data, see that file). The Molden wavenumbers and normal coordinates are the eigen-
values and vectors of its mass-weighted Hessian (most abundant isotope masses, AME2016 as
in src/elements.cpp; CODATA 2018 constants), printed to 10 decimals; the all-modes file
keeps the six near-zero entries of the translations and rotations as the diagonalisation
gives them. Re-run after changing the model; the files are committed.
"""
import json
import pathlib

import numpy as np
import yaml

here = pathlib.Path(__file__).parent
src = yaml.safe_load((here / "water-model-hessian-full.yaml").read_text())
bohr_m = 5.29177210903e-11
hartree_J = 4.3597447222071e-18
amu_kg = 1.66053906660e-27
c_cm_s = 299792458.0 * 100.0
mass = {"O": 15.99491461957, "H": 1.00782503223}

symbols = [a[0] for a in src["atoms"]]
xyz_A = np.array([a[1:] for a in src["atoms"]], dtype=float)
xyz_bohr = xyz_A * 1e-10 / bohr_m
n = 3 * len(symbols)
H = np.array(src["hessian"], dtype=float).reshape(n, n)

doc = {
    "schema_name": "qcschema_output",
    "schema_version": 1,
    "molecule": {
        "schema_name": "qcschema_molecule",
        "schema_version": 2,
        "name": "water-model-hessian",
        "symbols": symbols,
        "geometry": [float(v) for v in xyz_bohr.ravel()],
        "molecular_charge": 0,
        "molecular_multiplicity": 1,
    },
    "driver": "hessian",
    "model": {"method": "model-force-field", "basis": "none"},
    "keywords": {},
    "return_result": [[float(v) for v in row] for row in H],
    "properties": {"return_energy": -76.0},
    "success": True,
    "extras": {"note": "Test file: the model force field of tests/data/water-model-hessian-full.yaml "
                       "(not data); return_energy is a placeholder for the reader test, not a computed energy."},
}
(here / "water-model-hessian.json").write_text(json.dumps(doc, indent=1) + "\n")

# Normal modes of the mass-weighted Hessian, in cm^-1 (negative for negative eigenvalues).
m = np.repeat([mass[s] for s in symbols], 3) * amu_kg
Hsi = H * hartree_J / bohr_m**2
w, v = np.linalg.eigh(Hsi / np.sqrt(np.outer(m, m)))
nu = np.sign(w) * np.sqrt(np.abs(w)) / (2 * np.pi * c_cm_s)
disp = v / np.sqrt(m)[:, None]
disp /= np.linalg.norm(disp, axis=0)


def molden(keep):
    out = ["[Molden Format]", "[Title]",
           " water model force field (tests/data/make_water_exchange_files.py): not data", "[FREQ]"]
    out += [f"{nu[k]:.10f}" for k in keep]
    out.append("[FR-COORD]")
    out += [f"{s} {x:.12f} {y:.12f} {z:.12f}" for s, (x, y, z) in zip(symbols, xyz_bohr)]
    out.append("[FR-NORM-COORD]")
    for i, k in enumerate(keep, 1):
        out.append(f"vibration {i}")
        out += [f"{disp[3*a, k]:.8f} {disp[3*a+1, k]:.8f} {disp[3*a+2, k]:.8f}" for a in range(len(symbols))]
    out.append("[INT]")
    out += ["0.0" for _ in keep]  # intensities are not part of the model
    return "\n".join(out) + "\n"


order = list(np.argsort(np.abs(nu)))
(here / "water-model.molden").write_text(molden(sorted(order[6:], key=lambda k: nu[k])))
(here / "water-model-all-modes.molden").write_text(molden(sorted(order, key=lambda k: nu[k])))
print("wavenumbers/cm^-1:", [f"{x:.6f}" for x in sorted(nu)])
