"""Files that are not UTF-8 TOML, or hold numbers no calculation can use, are refused in one line
naming the file and the place, by the model reader, the vehicle reader and every command; a
UTF-8 file with a byte-order mark is read."""

from __future__ import annotations

import os
import random
from pathlib import Path

import pytest

from influence.errors import ModelError
from influence.model.reader import read_model_file
from tests.cli import invoke, refused
from vehicles.errors import VehicleError
from vehicles.library.files import read_load_model
from vehicles.tomlfile import MAX_FILE_BYTES

GIRDER = '[beam]\nspans = [10.0, 12.0]\nEI = 2.0e5\nsupports = ["pinned", "roller", "roller"]\n'
VEHICLE = '[vehicle]\nname = "pair"\nunits = "kN-m"\nloads = [100.0, 100.0]\nspacings = [3.0]\n'

NOT_TOML = {
    "random bytes": (bytes(random.Random(7).randrange(256) for _ in range(4000)), "not"),
    "UTF-16 text": (('title = "x"\n' + GIRDER).encode("utf-16"), "UTF-16"),
    "UTF-16 without a mark": (('title = "x"\n' + GIRDER).encode("utf-16-le"), "UTF-16"),
    "a Latin-1 byte": (('title = "Caf\xe9 bridge"\n' + GIRDER).encode("latin-1"), "0xe9"),
    "a zero byte": (b'title = "a\x00b"\n' + GIRDER.encode(), "zero byte"),
    "deep nesting": (b"a = " + b"[" * 20000 + b"]" * 20000, "too deeply"),
    "broken syntax": (b"[beam\nspans = [1.0]\n", "not valid TOML"),
    "too large": (b"# " + b"x" * (MAX_FILE_BYTES + 10) + b"\n", "larger than"),
}

OUT_OF_RANGE = {
    "nan": ("spans = [10.0, 12.0]", "spans = [10.0, nan]", "beam.spans[2]"),
    "infinity": ("EI = 2.0e5", "EI = inf", "beam.EI"),
    "overflowing float": ("EI = 2.0e5", "EI = 1e400", "beam.EI"),
    "integer beyond a float": ("spans = [10.0, 12.0]", "spans = [10, 1" + "0" * 400 + "]",
                               "beam.spans[2]"),
    "huge span": ("spans = [10.0, 12.0]", "spans = [1.0e300, 1.0e300]", "beam.spans[1]"),
}


def _write(tmp_path: Path, data: bytes, name: str = "bad.toml") -> Path:
    path = tmp_path / name
    path.write_bytes(data)
    return path


@pytest.mark.parametrize("case", NOT_TOML, ids=list(NOT_TOML))
def test_a_model_file_that_is_not_utf8_toml_is_refused(tmp_path: Path, case: str) -> None:
    data, expected = NOT_TOML[case]
    path = _write(tmp_path, data)
    with pytest.raises(ModelError, match=expected) as caught:
        read_model_file(path)
    assert str(caught.value).startswith(f"{path}: ") and "(" in str(caught.value)
    assert expected in refused("check", str(path))


@pytest.mark.parametrize("case", NOT_TOML, ids=list(NOT_TOML))
def test_a_vehicle_file_that_is_not_utf8_toml_is_refused(tmp_path: Path, case: str) -> None:
    data, expected = NOT_TOML[case]
    path = _write(tmp_path, data)
    with pytest.raises(VehicleError, match=expected):
        read_load_model(path)
    message = refused("govern", str(Path(__file__).parent.parent / "examples" / "overpass.toml"),
                      "moment", "--at", "P1", "--vehicle", str(path))
    assert str(path) in message


@pytest.mark.parametrize("device", ["/dev/zero", "/dev/urandom"])
def test_an_endless_input_is_refused_after_a_capped_read(device: str) -> None:
    if not os.path.exists(device):
        pytest.skip(f"{device} does not exist here")
    with pytest.raises(ModelError, match="larger than"):
        read_model_file(device)
    assert "larger than" in refused("check", device)
    with pytest.raises(VehicleError, match="larger than"):
        read_load_model(device)


def test_a_folder_or_a_missing_file_is_refused(tmp_path: Path) -> None:
    assert "folder" in refused("check", str(tmp_path))
    assert "file not found" in refused("check", str(tmp_path / "absent.toml"))
    with pytest.raises(VehicleError, match="folder"):
        read_load_model(tmp_path)


def test_a_byte_order_mark_is_read(tmp_path: Path) -> None:
    model = _write(tmp_path, b"\xef\xbb\xbf" + GIRDER.encode(), "bom.toml")
    assert len(read_model_file(model).model.members) == 2
    status, _ = invoke("check", str(model))
    assert status == 0
    vehicle = _write(tmp_path, b"\xef\xbb\xbf" + VEHICLE.encode(), "bom-vehicle.toml")
    assert read_load_model(vehicle).cases[0].train is not None


@pytest.mark.parametrize("case", OUT_OF_RANGE, ids=list(OUT_OF_RANGE))
def test_numbers_out_of_range_are_refused_with_their_key(tmp_path: Path, case: str) -> None:
    old, new, item = OUT_OF_RANGE[case]
    path = _write(tmp_path, GIRDER.replace(old, new).encode())
    with pytest.raises(ModelError) as caught:
        read_model_file(path)
    assert caught.value.item == item
    assert item in refused("check", str(path))


@pytest.mark.parametrize("axle", ["1e300", "nan", "-inf", "1" + "0" * 30])
def test_an_axle_out_of_range_is_refused(tmp_path: Path, axle: str) -> None:
    path = _write(tmp_path, VEHICLE.replace("loads = [100.0,", f"loads = [{axle},").encode())
    with pytest.raises(VehicleError) as caught:
        read_load_model(path)
    assert "vehicle.loads[1]" in str(caught.value)


def test_one_reader_parses_input_toml() -> None:
    # every model and vehicle file goes through vehicles.tomlfile; only the packaged standard
    # tables (read from the installed package, not from users) parse TOML on their own
    root = Path(__file__).resolve().parent.parent
    parsers = sorted(str(path.relative_to(root)) for package in ("influence", "vehicles")
                     for path in (root / package).rglob("*.py") if "tomllib" in path.read_text())
    assert parsers == ["influence/fatigue/tables.py", "influence/rating/tables.py",
                       "vehicles/tomlfile.py"]
    cli = [path.name for path in (root / "influence" / "cli").glob("*.py")
           if "read_toml" in path.read_text() or "open(" in path.read_text()]
    assert cli == []


def test_a_spectrum_file_is_read_through_the_same_capped_reader(tmp_path: Path) -> None:
    from influence.fatigue.spectrum import read_spectrum

    path = _write(tmp_path, "truck,gross_weight\n".encode("utf-16"), "spectrum.csv")
    with pytest.raises(ModelError, match="UTF-16"):
        read_spectrum(path)
