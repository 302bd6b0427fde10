#!/usr/bin/env python3
"""Low-frequency treatments, scale factors per quantity, conformer ensembles and tunnelling
through the executable: input keys and options, their notes in every output, and the
symmetric Eckart correction against an independent quadrature written here.

Usage: lowfreq_cli_test.py VIBTHERM_EXE PROJECT_ROOT
"""
import json
import math
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from harness import Checks  # noqa: E402

exe, root = sys.argv[1], sys.argv[2]
data = os.path.join(root, "tests", "data")
soft = os.path.join(data, "model-soft-mode.yaml")
ts = os.path.join(data, "model-ts-symmetric.yaml")
c = Checks(exe)


def json_of(*args):
    r = c.run(*args, "--format", "json")
    return (json.loads(r.stdout) if r.returncode == 0 else None), r


def row(doc, T):
    return next(x for x in doc["species"][0]["rows"] if abs(x["T"] - T) < 1e-9)


# --- the low_frequency key, --low-freq overriding it, and the notes that record them -----
doc, r = json_of("table", soft, "--temps", "298.15")
c.check("table with low_frequency: qrrho exits 0", doc is not None, r.stderr)
notes = " ".join(doc["species"][0].get("notes", [])) if doc else ""
c.check("table JSON notes name the qrrho treatment", "low-frequency treatment qrrho" in notes, notes)
c.check("table JSON notes give the scale factors",
        "zero-point energy 0.98, thermal enthalpy 0.99, entropy and heat capacity 1" in notes, notes)
harm, r = json_of("table", soft, "--temps", "298.15", "--low-freq", "harmonic")
c.check("--low-freq harmonic overrides the key", harm is not None and
        row(harm, 298.15)["S"] > row(doc, 298.15)["S"] + 5.0, r.stderr)
c.check("harmonic run warns about the 12 cm^-1 mode with its share of S",
        "vibration 1 at 12.0 cm^-1 (below 50 cm^-1)" in r.stderr and "% of S°(298.15 K)" in r.stderr, r.stderr)
r = c.run("table", soft, "--temps", "298.15")
c.check("qrrho run has no soft-mode warning", "below 50 cm^-1" not in r.stderr, r.stderr)
c.check("text table shows the model line", "low-frequency treatment qrrho" in r.stdout and
        "ZPE 0.98, enthalpy 0.99, entropy/Cp 1" in r.stdout, r.stdout)

# floor: the same table as a harmonic species with the mode at 100 cm^-1 (Ribeiro et al. 2011).
floor, r = json_of("table", soft, "--temps", "300,1000", "--low-freq", "floor", "--scale-zpe", "1",
                   "--scale-enthalpy", "1")
raised_path = os.path.join(os.environ.get("TMPDIR", "/tmp"), f"vibtherm-raised-{os.getpid()}.yaml")
with open(soft) as f, open(raised_path, "w") as g:
    g.write(f.read().replace("[12.0,", "[100.0,").replace("low_frequency: qrrho", "low_frequency: harmonic"))
raised, r2 = json_of("table", raised_path, "--temps", "300,1000", "--scale-zpe", "1", "--scale-enthalpy", "1")
os.remove(raised_path)
ok = floor is not None and raised is not None
for T in (300.0, 1000.0):
    for key in ("Cp", "S", "H_minus_H298"):
        ok = ok and abs(row(floor, T)[key] - row(raised, T)[key]) <= 1e-9 * max(1.0, abs(row(raised, T)[key]))
c.check("--low-freq floor equals the harmonic species at 100 cm^-1", ok, r.stderr + r2.stderr)

# inspect and modes record the treatment.
ins, r = json_of("inspect", soft)
c.check("inspect JSON notes name the treatment", ins is not None and
        any("qrrho" in n for n in ins["species"][0]["notes"]), r.stderr)
modes, r = json_of("modes", soft, "--temps", "298.15")
m0 = modes["species"][0]["vibrations"][0] if modes else {}
c.check("modes JSON marks the 12 cm^-1 mode as changed by qrrho",
        m0.get("treatment") == "qrrho" and 0 < m0.get("qrrho_weight", 1) < 1e-3, m0)

# fit JSON provenance records the factors and the treatment used.
r = c.run("fit", soft, "--form", "json", "--allow-missing-hf")
prov = json.loads(r.stdout)["species"][0]["provenance"]["model_options"] if r.returncode == 0 else {}
c.check("fit JSON provenance has the scale factors and the treatment",
        prov.get("scale_zpe") == "0.98" and prov.get("scale_enthalpy") == "0.99" and
        prov.get("scale_entropy") == "1" and prov.get("low_frequency") == "qrrho", (prov, r.stderr))

# --- tunnelling: Wigner and the symmetric Eckart barrier -----------------------------------
h, cl, k, NA = 6.62607015e-34, 299792458.0, 1.380649e-23, 6.02214076e23  # CODATA 2018 exact


def eckart_symmetric_kappa(V_J_per_mol, nu_cm1, T):
    """Symmetric Eckart barrier, Johnston & Heicklen (1962) with α1 = α2 = α = 2πV/(hν):
    2πa = α √ξ, 2πd = 2 √(α² − π²/4), P(ξ) = (cosh 4πa − 1) / (cosh 4πa + cosh 2πd), and
    κ = (V/kT) e^{V/kT} ∫₀^∞ P(ξ) e^{−ξV/kT} dξ, by composite Simpson in u = √ξ."""
    V = V_J_per_mol / NA
    hnu = h * cl * 100.0 * nu_cm1
    alpha = 2 * math.pi * V / hnu
    two_pi_d = 2 * math.sqrt(alpha * alpha - math.pi ** 2 / 4)
    beta = V / (k * T)

    def integrand(u):  # ξ = u², dξ = 2u du
        x = 2 * alpha * u  # 4πa
        P = (math.cosh(x) - 1) / (math.cosh(x) + math.cosh(two_pi_d)) if x < 600 else 1.0
        return 2 * u * P * math.exp(beta * (1 - u * u))

    top = math.sqrt(1 + 60 / beta)
    n = 200000
    s = integrand(0) + integrand(top)
    step = top / n
    for i in range(1, n):
        s += (4 if i % 2 else 2) * integrand(i * step)
    return beta * s * step / 3


doc, r = json_of("table", ts, "--temps", "300,600,1500")
c.check("transition-state table exits 0", doc is not None, r.stderr)
for T in (300.0, 600.0, 1500.0):
    x = row(doc, T) if doc else {}
    u = h * cl * 100.0 * 1500.0 / (k * T)
    c.check(f"kappa_wigner at {T:g} K is 1 + u^2/24 (Wigner 1932)",
            abs(x.get("kappa_wigner", 0) - (1 + u * u / 24)) < 1e-12, x)
    ref = eckart_symmetric_kappa(40e3, 1500.0, T)
    c.check(f"kappa_eckart at {T:g} K matches the independent quadrature ({ref:.8f}) to 1e-7",
            abs(x.get("kappa_eckart", 0) - ref) < 1e-7 * ref, (x.get("kappa_eckart"), ref))


def eckart_kappa_jh(V1_J_per_mol, V2_J_per_mol, nu_cm1, T):
    """Unsymmetrical Eckart barrier in the parametrisation of Johnston & Heicklen, J. Phys.
    Chem. 66, 532 (1962): α_i = 2πV_i/(hν), ξ = E/V1 (E above the reactants), a and b
    from the kinetic energies far on the reactant side (E) and the product side
    (E − V1 + V2): 2πa = 2√(α1 ξ)/(α1^-1/2 + α2^-1/2), 2πb = 2√((ξ − 1)α1 + α2)/(α1^-1/2 + α2^-1/2),
    2πd = 2√(α1 α2 − π²/4), P = (cosh 2π(a+b) − cosh 2π(a−b)) / (cosh 2π(a+b) + cosh 2πd),
    κ = e^{V1/kT} ∫ P(E) e^{−E/kT} dE/kT from E0 = max(0, V1 − V2); composite Simpson in
    u = √(E − E0). A different parametrisation from the library's (Eckart's A, B, C); the
    formulas are from memory, checked by their symmetric limit below."""
    V1, V2 = V1_J_per_mol / NA, V2_J_per_mol / NA
    hnu = h * cl * 100.0 * nu_cm1
    a1, a2 = 2 * math.pi * V1 / hnu, 2 * math.pi * V2 / hnu
    denominator = 1 / math.sqrt(a1) + 1 / math.sqrt(a2)
    D = 2 * math.sqrt(a1 * a2 - math.pi ** 2 / 4)
    kT = k * T
    E0 = max(0.0, V1 - V2)

    def P(E):
        xi = E / V1
        X = 2 * (math.sqrt(a1 * xi) + math.sqrt(max(0.0, (xi - 1) * a1 + a2))) / denominator  # 2π(a+b)
        Y = 2 * (math.sqrt(a1 * xi) - math.sqrt(max(0.0, (xi - 1) * a1 + a2))) / denominator  # 2π(a−b)
        M = max(X, abs(Y), D)  # scale every cosh by e^{-M}
        ch = lambda z: 0.5 * (math.exp(z - M) + math.exp(-z - M))
        return (ch(X) - ch(Y)) / (ch(X) + ch(D))

    top = math.sqrt(V1 + 60 * kT - E0)
    n = 200000
    step = top / n
    f = lambda u: 2 * u * P(E0 + u * u) * math.exp((V1 - E0 - u * u) / kT) / kT
    s = f(0.0) + f(top)
    for i in range(1, n):
        s += (4 if i % 2 else 2) * f(i * step)
    return s * step / 3


unsym = os.path.join(data, "model-ts-unsymmetrical.yaml")
doc, r = json_of("table", unsym, "--temps", "300,600,1500")
c.check("unsymmetrical transition-state table exits 0", doc is not None, r.stderr)
for T in (300.0, 600.0, 1500.0):
    x = row(doc, T) if doc else {}
    ref = eckart_kappa_jh(40e3, 25e3, 1500.0, T)
    c.check(f"unsymmetrical kappa_eckart at {T:g} K matches the Johnston-Heicklen quadrature ({ref:.8f}) to 1e-6",
            abs(x.get("kappa_eckart", 0) - ref) < 1e-6 * ref, (x.get("kappa_eckart"), ref))
# The same formulas reproduce the symmetric case (a = b): a check of the check.
c.check("the Johnston-Heicklen quadrature equals the symmetric one at V1 = V2",
        abs(eckart_kappa_jh(40e3, 40e3, 1500.0, 600.0) / eckart_symmetric_kappa(40e3, 1500.0, 600.0) - 1) < 1e-7)
r = c.run("table", ts, "--temps", "300")
c.check("text table has the kappa columns", "kappa.Wig" in r.stdout and "kappa.Eck" in r.stdout, r.stdout)
ins, r = json_of("inspect", ts)
c.check("inspect notes the tunnelling corrections", ins is not None and
        any("Eckart" in n for n in ins["species"][0]["notes"]), r.stderr)
# --- conformer ensembles -------------------------------------------------------------------
water = os.path.join(data, "water.yaml")
pair = os.path.join(data, "model-conformers.yaml")
high = os.path.join(data, "model-conformers-high.yaml")
one, r1 = json_of("table", water, "--temps", "300,1000")
two, r2 = json_of("table", pair, "--temps", "300,1000")
hi, r3 = json_of("table", high, "--temps", "300")
c.check("ensemble tables exit 0", None not in (one, two, hi), r1.stderr + r2.stderr + r3.stderr)
if None not in (one, two, hi):
    R = 8.31446261815324  # N_A k_B, CODATA 2018 exact
    for T in (300.0, 1000.0):
        c.check(f"two identical conformers: S + R ln 2 at {T:g} K (common practice)",
                abs(row(two, T)["S"] - row(one, T)["S"] - R * math.log(2)) < 1e-6, (row(two, T), row(one, T)))
        c.check(f"two identical conformers: the same Cp at {T:g} K", abs(row(two, T)["Cp"] - row(one, T)["Cp"]) < 1e-6)
        c.check(f"populations 1/2 each at {T:g} K", all(abs(p - 0.5) < 1e-12 for p in row(two, T)["populations"]))
    c.check("a conformer 100 kJ/mol higher changes nothing at 300 K (1e-9)",
            abs(row(hi, 300)["S"] - row(one, 300)["S"]) <= 1e-9 * row(one, 300)["S"] and
            abs(row(hi, 300)["Cp"] - row(one, 300)["Cp"]) <= 1e-9 * row(one, 300)["Cp"])
ins, r = json_of("inspect", pair)
c.check("inspect lists the conformers with populations", ins is not None and
        len(ins["species"][0].get("conformers", [])) == 2 and
        abs(ins["species"][0]["conformers"][0]["populations"][0] - 0.5) < 1e-12, r.stderr)
r = c.run("table", pair, "--temps", "300")
c.check("text table shows the population columns", "pop.1" in r.stdout and "pop.2" in r.stdout, r.stdout)
c.finish()
