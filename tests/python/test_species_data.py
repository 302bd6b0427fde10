"""A species built from Python data equals the same species read from YAML, and bad
input of every kind raises vibtherm.InputError (file, line, column, message) or TypeError."""
import numpy as np
import pytest

import vibtherm

WATER_COORDINATES = [[0.0, 0.0, 0.065569], [0.0, 0.756950, -0.520313], [0.0, -0.756950, -0.520313]]


def same_species(a, b):
    assert a.name == b.name
    assert a.symbols == b.symbols and a.isotopes == b.isotopes
    assert np.array_equal(a.masses, b.masses)
    assert np.array_equal(a.coordinates, b.coordinates)
    assert np.array_equal(a.frequencies, b.frequencies)
    assert a.formula == b.formula
    assert a.symmetry_number == b.symmetry_number
    assert a.electronic_levels == b.electronic_levels
    assert a.enthalpy_of_formation == b.enthalpy_of_formation
    assert a.phase == b.phase and a.transition_state == b.transition_state
    if a.hessian is None:
        assert b.hessian is None
    else:
        assert np.array_equal(a.hessian, b.hessian)
    ta, tb = vibtherm.table(a), vibtherm.table(b)
    for key in ta:
        assert np.array_equal(ta[key], tb[key]), key


def test_water_from_python_data_equals_yaml(root):
    from_yaml = vibtherm.read(str(root / "tests/data/water.yaml"))[0]
    from_python = vibtherm.species(name="water", symbols=["O", "H", "H"],
                                   coordinates=np.array(WATER_COORDINATES),
                                   frequencies=np.array([1595.0, 3657.0, 3756.0]), symmetry_number=2,
                                   spin_multiplicity=1, enthalpy_of_formation=-241.826)
    same_species(from_python, from_yaml)
    assert from_python.file == "<python>"


def test_hessian_species_from_python_equals_yaml(root):
    from_yaml = vibtherm.read(str(root / "tests/data/water-model-hessian.yaml"))[0]
    hartree_per_bohr2 = 4.3597447222071e-18 / 0.529177210903e-10 ** 2  # CODATA 2018
    lower = [from_yaml.hessian[i, j] / hartree_per_bohr2 for i in range(9) for j in range(i + 1)]
    # Rounded to the file's ten decimals, so the values are the file's own.
    lower = [round(x, 10) for x in lower]
    from_python = vibtherm.species(name="water-model-hessian", atoms=[["O", *WATER_COORDINATES[0]],
                                   ["H", *WATER_COORDINATES[1]], ["H", *WATER_COORDINATES[2]]],
                                   symmetry_number=2, spin_multiplicity=1, hessian_unit="hartree/bohr^2",
                                   hessian=lower)
    same_species(from_python, from_yaml)


def test_isotopes_and_levels_from_python():
    s = vibtherm.species(name="D2O", symbols=["O", "H", "H"], coordinates=WATER_COORDINATES,
                         frequencies=[1178.4, 2671.6, 2787.7], isotopes={2: "D", 3: "D"},
                         electronic_levels=[{"energy": 0.0, "degeneracy": 1}], symmetry_number=2)
    assert s.isotopes == ["", "D", "D"]
    assert s.formula == {"O": 1, "H": 2}  # composition by element; the isotopes are in the masses
    assert s.masses[1] == pytest.approx(2.014101778, abs=1e-8)  # AME2020 (from memory)


def test_bad_file_raises_located_error(root):
    with pytest.raises(vibtherm.InputError) as info:
        vibtherm.read(str(root / "tests/bad/quoted_number.yaml"))
    e = info.value
    assert isinstance(e, ValueError)
    assert e.file.endswith("quoted_number.yaml") and (e.line, e.column) == (6, 21)
    assert e.message == "'frequencies' entry 2 is the quoted text '3657', expected a number"
    assert str(e) == f"{e.file}:6:21: error: {e.message}"


@pytest.mark.parametrize("keys,message", [
    ({"name": "w", "symbols": ["O", "H", "H"], "coordinates": WATER_COORDINATES, "frequencies": [1595.0, float("nan"), 3756.0]},
     "'frequencies' entry 2 is '.nan', expected a finite number"),
    ({"name": "w", "symbols": ["O", "H", "Xx"], "coordinates": WATER_COORDINATES, "frequencies": [1, 2, 3]},
     "unknown element"),
    ({"name": "w", "symbols": ["O", "H", "H"], "coordinates": WATER_COORDINATES, "frequencies": [1, 2, 3],
      "symetry_number": 2}, "did you mean 'symmetry_number'?"),
    ({"symbols": ["Ar"], "coordinates": [[0, 0, 0]]}, "missing required key 'name'"),
])
def test_bad_python_data_raises_input_error(keys, message):
    with pytest.raises(vibtherm.InputError) as info:
        vibtherm.species(**keys)
    assert message in info.value.message
    assert info.value.file == "<python>"


def test_bad_arguments_raise_type_or_value_errors(root):
    water = vibtherm.read(str(root / "tests/data/water.yaml"))[0]
    with pytest.raises(TypeError, match="unknown keyword 'low_freqs'"):
        vibtherm.table(water, low_freqs="qrrho")
    with pytest.raises(TypeError, match="a unit"):
        vibtherm.table(water, pressure=1.0)
    with pytest.raises(ValueError, match="positive"):
        vibtherm.table(water, temperatures=[0.0, 300.0])
    with pytest.raises(vibtherm.InputError, match="temperatures must be positive"):
        vibtherm.table(water, temperatures="0,300")
    with pytest.raises(TypeError, match="fixed once"):
        vibtherm.table(vibtherm.prepare(water), scale=0.9)
    with pytest.raises(TypeError, match="symbols' and 'coordinates' go together"):
        vibtherm.species(name="w", symbols=["O"])
    with pytest.raises(vibtherm.InputError, match="cannot read file"):
        vibtherm.read(str(root / "tests/data/no-such-file.yaml"))


def test_model_options_change_the_result(root):
    water = vibtherm.read(str(root / "tests/data/water.yaml"))[0]
    bar = vibtherm.table(water, temperatures=[298.15])["S"][0]
    atm = vibtherm.table(water, temperatures=[298.15], standard_state="atm")["S"][0]
    # S(1 atm) = S(1 bar) - R ln(101325/100000): an exact identity of the ideal gas.
    assert atm == pytest.approx(bar - 8.314462618 * np.log(1.01325), abs=1e-9)
