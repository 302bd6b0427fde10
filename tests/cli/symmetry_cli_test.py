"""Point group and symmetry number detected from the geometry, and the spin from the electron
count, through the executable."""
import json
import math
import pathlib
import sys

from harness import Checks

R = 8.314462618  # J/(mol K), CODATA 2018 (N_A k_B)


def main():
    exe, root = sys.argv[1], pathlib.Path(sys.argv[2])
    data = root / "tests" / "data" / "symmetry"
    c = Checks(exe)

    def inspect(*args):
        r = c.run("inspect", *args, "--format", "json")
        return (json.loads(r.stdout)["species"] if r.returncode == 0 else None), r

    def s298(*args):
        r = c.run("table", *args, "--temps", "298.15", "--format", "json")
        return (json.loads(r.stdout)["species"][0]["rows"][0]["S"] if r.returncode == 0 else None), r

    # Point-group orders of the rotational subgroups (common practice).
    expected = {"water-no-sigma": ("C2v", 2, False), "methane": ("Td", 12, False),
                "CHFClBr": ("C1", 1, True), "water-sigma-1": ("C2v", 1, False)}
    species, r = inspect(*(str(data / f) for f in ("water-no-sigma.yaml", "methane.yaml",
                                                    "bromochlorofluoromethane.yaml", "water-sigma-1.yaml")))
    c.check("inspect exits 0", species is not None, r.stderr)
    for s in species or []:
        group, sigma, chiral = expected[s["name"]]
        c.check(f"{s['name']}: point group {group}", s.get("point_group") == group, s.get("point_group"))
        c.check(f"{s['name']}: symmetry number used {sigma}", s["symmetry_number"] == sigma, s["symmetry_number"])
        c.check(f"{s['name']}: chiral is {chiral}", s.get("chiral") == chiral, s.get("chiral"))
    notes = {s["name"]: s["notes"] + s["warnings"] for s in species or []}
    c.check("detected sigma is said in the notes",
            any("symmetry number 2 from the point group C2v" in n for n in notes.get("water-no-sigma", [])), notes)
    c.check("a given sigma that disagrees is warned about with both values",
            any("symmetry_number 1 given" in n and "has 2" in n for n in notes.get("water-sigma-1", [])), notes)
    c.check("the warning reaches stderr", "symmetry_number 1 given" in r.stderr, r.stderr)

    # Water without symmetry_number: S°(298.15 K) with sigma = 2. NIST-JANAF (Chase 1998) lists
    # 188.834 J/(mol K); our RRHO with the fundamentals gives 188.65, not the sigma = 1 value 194.4.
    s, r = s298(str(data / "water-no-sigma.yaml"))
    c.check("water without symmetry_number: S(298.15) = 188.6 J/(mol K) (NIST-JANAF 188.834)",
            s is not None and abs(s - 188.834) < 0.5, s)
    s1, _ = s298(str(data / "water-sigma-1.yaml"))
    c.check("water with sigma 1 given: S higher by R ln 2 (S_rot contains -R ln sigma, common practice)",
            None not in (s, s1) and abs(s1 - s - R * math.log(2)) < 1e-6, (s, s1))

    # Racemic mixture of a chiral species: + R ln 2 in S (mixing of two enantiomers, common practice).
    chiral = str(data / "bromochlorofluoromethane.yaml")
    plain, _ = s298(chiral)
    racemic, r = s298(chiral, "--racemic")
    c.check("--racemic adds R ln 2 to S of a chiral species", None not in (plain, racemic) and
            abs(racemic - plain - R * math.log(2)) < 1e-6, (plain, racemic, r.stderr))
    c.check("--racemic is recorded", "racemic mixture" in r.stderr, r.stderr)
    w, _ = s298(str(data / "water-no-sigma.yaml"))
    w2, r = s298(str(data / "water-no-sigma.yaml"), "--racemic")
    c.check("--racemic leaves an achiral species alone", w == w2 and "not chiral" in r.stderr, (w, w2, r.stderr))

    # The tolerance option: a zero tolerance is refused, a looser one keeps C2v.
    r = c.run("inspect", str(data / "water-no-sigma.yaml"), "--symmetry-tolerance", "0")
    c.check("--symmetry-tolerance 0 is refused in one line, exit 2",
            r.returncode == 2 and len(r.stderr.strip().splitlines()) == 1, r.stderr)
    species, r = inspect(str(data / "water-no-sigma.yaml"), "--symmetry-tolerance", "0.05")
    c.check("--symmetry-tolerance 0.05 still finds C2v", species and species[0]["point_group"] == "C2v", r.stderr)

    # Rigid-rotor input: no geometry, so no point group and sigma must be given.
    species, r = inspect(str(root / "tests" / "data" / "carbon_monoxide_rotor.yaml"))
    c.check("rotational-constant input: point_group null, sigma as given",
            species and species[0]["point_group"] is None and species[0]["symmetry_number"] == 1, r.stderr)
    r = c.run("table", str(root / "tests" / "bad" / "rotational_constants_no_symmetry.yaml"))
    c.check("rotational constants without symmetry_number: one located line, exit 2",
            r.returncode == 2 and "no 'symmetry_number'" in r.stderr and len(r.stderr.strip().splitlines()) == 1,
            r.stderr)

    # Spin from the electron count: CH3 (9 electrons) without spin_multiplicity is a doublet;
    # S°(298.15 K) about 194 J/(mol K) (NIST-JANAF, Chase 1998, lists 194.2, from memory).
    s, r = s298(str(data / "methyl.yaml"))
    c.check("CH3 without spin_multiplicity: doublet, S(298.15) = 194.0 +- 0.5", s is not None and abs(s - 194.0) < 0.5,
            (s, r.stderr))
    c.check("the doublet is said in the notes", "spin multiplicity 2 (doublet) from the electron count 9" in r.stderr,
            r.stderr)
    r = c.run("table", str(root / "tests" / "bad" / "spin_parity_methyl_singlet.yaml"))
    c.check("CH3 with spin_multiplicity 1: one located line naming both, exit 2",
            r.returncode == 2 and "spin_multiplicity 1" in r.stderr and "9 electrons" in r.stderr and
            len(r.stderr.strip().splitlines()) == 1, r.stderr)
    r = c.run("table", str(root / "tests" / "data" / "oxygen.yaml"))
    c.check("O2 with spin_multiplicity 3: accepted", r.returncode == 0, r.stderr)
    c.finish()


if __name__ == "__main__":
    main()
