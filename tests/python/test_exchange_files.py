"""vibtherm.read takes the QC exchange files (QCSchema JSON, Molden) through the same library
call as the command line; the water-model files are those of tests/data/make_water_exchange_files.py."""
import numpy as np
import pytest

import vibtherm


def test_read_qcschema_and_molden(root, cli):
    for name in ("water-model-hessian.json", "water-model.molden", "water-model-all-modes.molden"):
        path = root / "tests/data" / name
        species = vibtherm.read(str(path))
        assert len(species) == 1 and species[0].symbols == ["O", "H", "H"]
        temperatures = [298.15, 1000.0]
        rows = cli("table", path, "--temps", "298.15,1000", "--format", "json")["species"][0]["rows"]
        t = vibtherm.table(species[0], temperatures=temperatures)
        for key in ("Cp", "S", "H_minus_H298"):
            assert np.allclose(t[key], [r[key] for r in rows], rtol=1e-9, atol=0), (name, key)


def test_bad_exchange_file_raises(root):
    with pytest.raises(vibtherm.InputError) as info:
        vibtherm.read(str(root / "tests/bad/qcschema_gradient.json"))
    assert "holds no Hessian" in str(info.value)
