"""Every Python result equals the command line's JSON for the same input: the JSON holds
each double in its shortest round-trip form, so 'to the printed digits' is equality."""
import os
import subprocess

import numpy as np
import pytest

import vibtherm

DEMO = "examples/fuel-additive"
TEMPS = "298.15,300:3000:350"


def demo_species(root):
    return vibtherm.read(str(root / DEMO))


def test_read_directory_in_cli_order(root, cli):
    names = [s.name for s in demo_species(root)]
    assert names == [e["name"] for e in cli("inspect", DEMO, "--format", "json")["species"]]


@pytest.mark.parametrize("options,args", [
    ({}, []),
    ({"standard_state": "atm"}, ["--standard-state", "atm"]),
    ({"pressure": "10bar", "scale": 0.97}, ["--pressure", "10bar", "--scale", "0.97"]),
])
def test_table_equals_cli(root, cli, options, args):
    expected = cli("table", DEMO, "--temps", TEMPS, "--breakdown", "--format", "json", *args)["species"]
    got = vibtherm.table(demo_species(root), temperatures=TEMPS, breakdown=True, **options)
    assert len(got) == len(expected)
    for table, entry in zip(got, expected):
        for key in entry["rows"][0]:
            if key == "motions":
                continue
            assert np.array_equal(table[key], [row[key] for row in entry["rows"]]), (entry["name"], key)
        for motion, terms in entry["rows"][0]["motions"].items():
            for key in terms:
                column = [row["motions"][motion][key] for row in entry["rows"]]
                assert np.array_equal(table["motions"][motion][key], column), (entry["name"], motion, key)


def test_table_of_prepared_species_and_default_temperatures(root, cli):
    expected = cli("table", "tests/data/water.yaml", "--format", "json")["species"][0]["rows"]
    prepared = vibtherm.prepare(vibtherm.read(str(root / "tests/data/water.yaml"))[0])
    got = vibtherm.table(prepared)
    assert np.array_equal(got["T"], [r["T"] for r in expected])
    assert np.array_equal(got["S"], [r["S"] for r in expected])


def test_modes_equal_cli(root, cli):
    path = f"{DEMO}/dimethyl-ether.yaml"
    expected = cli("modes", path, "--temps", "300,800,1500", "--format", "json")["species"][0]
    got = vibtherm.modes(vibtherm.read(str(root / path))[0], temperatures=[300, 800, 1500])
    assert got["name"] == expected["name"]
    for key in ("wavenumber", "theta", "zpe", "zpe_share", "T_unfreeze", "T_half", "T_active"):
        assert np.array_equal(got[key], [v[key] for v in expected["vibrations"]]), key
    for t, point in enumerate(expected["temperatures"]):
        assert got["T"][t] == point["T"]
        assert np.array_equal(got["Cv_over_R"][t], [m["Cv_over_R"] for m in point["modes"]])
        assert got["state"][t] == [m["state"] for m in point["modes"]]
        for motion in ("translation", "rotation", "vibration", "total", "electronic"):
            assert got["dof"][motion][t] == point["dof"][motion], motion


def test_inspect_equals_cli(root, cli):
    expected = cli("inspect", DEMO, "--format", "json")["species"]
    got = vibtherm.inspect(demo_species(root))
    for facts, entry in zip(got, expected):
        assert facts["name"] == entry["name"]
        assert facts["rotor"] == entry["rotor"]
        assert facts["mass"] == entry["mass"]
        assert facts["symmetry_number"] == entry["symmetry_number"]
        assert np.array_equal(facts["moments_of_inertia"], entry["moments_of_inertia"])
        assert np.array_equal(facts["frequencies"], entry["frequencies"])
        assert facts["zpe"] == entry["zpe"]


def test_adsorbate_has_no_rotor_facts(root, cli):
    path = "tests/data/adsorbed-water.yaml"
    entry = cli("inspect", path, "--format", "json")["species"][0]
    facts = vibtherm.inspect(vibtherm.read(str(root / path))[0])
    assert "rotor" not in entry and facts["rotor"] is None and facts["moments_of_inertia"] is None
    assert facts["phase"] == entry["phase"] == "adsorbate"
    assert facts["zpe"] == entry["zpe"]


@pytest.mark.parametrize("form,range_", [("nasa7", None), ("nasa9", "200:1000:2000:6000")])
def test_fit_equals_cli(root, cli, form, range_):
    path = f"{DEMO}/methanol.yaml"
    range_args = ["--range", range_] if range_ else []
    expected = cli("fit", path, "--form", "json", *range_args)["species"][0]
    got = vibtherm.fit(vibtherm.read(str(root / path))[0], form=form, range=range_)
    assert got["form"] == expected["form"] == form
    assert got["breakpoints_K"] == expected["breakpoints_K"]
    for r, entry in enumerate(expected["ranges"]):
        coefficients = entry["coefficients"] + ([entry["b1"], entry["b2"]] if form == "nasa9" else [])
        assert np.array_equal(got["coefficients"][r], coefficients)
        assert got["ranges"][r]["errors"] == entry["errors"]
    for key in ("S298_J_per_mol_K", "H298_minus_H0_J_per_mol", "molar_mass_g_per_mol", "warnings"):
        assert got[key] == expected[key], key
    # The record is the one `fit --form nasa7|nasa9` writes for this species.
    text = subprocess.run([os.environ["VIBTHERM_EXE"], "-q", "fit", path, "--form", form, "--no-wrapper",
                           *range_args], capture_output=True, text=True, cwd=root, check=True).stdout
    assert got["record"] in text


def test_nasa_file_equals_eval(root, cli):
    path = "tests/data/o2_gri30_from_memory.dat"
    expected = cli("eval", path, "--temps", "300,1000,2000", "--format", "json")["species"]
    polynomials = vibtherm.read_nasa(str(root / path))
    assert [p.name for p in polynomials] == [e["name"] for e in expected]
    for p, entry in zip(polynomials, expected):
        table = vibtherm.table(p, temperatures=[300, 1000, 2000])
        assert np.array_equal(table["Cp"], p.table([300, 1000, 2000])["Cp"])
        for key in entry["rows"][0]:
            assert np.array_equal(table[key], [row[key] for row in entry["rows"]]), key
