"""The Python API: results with units in their names and sources, errors as exceptions with
the command line's place and message, tables chosen as on the command line, the GIL released."""

import dataclasses
import shutil
import threading

import pytest

import ringheat
from conftest import REPO, reference_smiles


def test_estimate_gives_units_in_names_and_sources():
    e = ringheat.estimate("C1CC1", temperatures_k=[500])
    # Measured Hf298 of cyclopropane 53.3 kJ/mol (CRC Handbook, as in src/lib.rs's example).
    assert abs(e.hf298_kj_per_mol - 53.3) < 5.0
    assert e.formula == "C3H6" and e.symmetry_number == 6
    assert e.cp_temperatures_k == ringheat.CP_TEMPERATURES_K
    assert [s.t_k for s in e.states] == [500.0]
    assert all(t.source for t in e.terms) and e.sources
    assert any(t.kind == "ring" and t.label == "cyclopropane" for t in e.terms)
    with pytest.raises(dataclasses.FrozenInstanceError):
        e.hf298_kj_per_mol = 0.0  # type: ignore[misc]


def test_smiles_error_has_the_command_line_place_column_and_message():
    with pytest.raises(ringheat.SmilesError) as info:
        ringheat.estimate("C1CC(=O")
    err = info.value
    assert isinstance(err, ValueError) and isinstance(err, ringheat.RingheatError)
    assert err.place == "<argument>:1" and err.input == "C1CC(=O"
    assert err.column == 5
    assert err.message.startswith("branch '(' is never closed at column 5\nC1CC(=O\n")
    assert str(err).startswith("<argument>:1: error: branch")


def test_estimate_error_for_an_element_without_groups():
    with pytest.raises(ringheat.EstimateError) as info:
        ringheat.estimate("[Xe]")
    assert "Xe" in info.value.message and info.value.column is None


def test_estimate_many_keeps_order_and_makes_errors_rows():
    rows = ringheat.estimate_many(
        ["CCO", ("C1CCCCC1", "cyclohexane"), "C1CC", "[Xe]"], threads=2, source="batch"
    )
    assert [r.ok for r in rows] == [True, True, False, False]
    assert rows[1].name == "cyclohexane"
    assert [f.place for f in rows.failures] == ["batch:3", "batch:4"]
    records = rows.to_records()
    assert [r["line"] for r in records] == [1, 2, 3, 4]
    assert records[2]["error"].startswith("batch:3: ring bond 1")
    assert list(records[0]) == list(ringheat.RECORD_COLUMNS)


def test_threads_do_not_change_rows():
    smiles = reference_smiles(400)
    one = ringheat.estimate_many(smiles, threads=1)
    two = ringheat.estimate_many(smiles, threads=2)
    assert one == two


def test_symmetry_override():
    e = ringheat.estimate("C1CCCCC1", sigma=6)
    assert e.symmetry_number == 6 and e.symmetry_overridden


def test_strain_and_cbh():
    s = ringheat.strain("C1CC12CC2")
    assert s.formula == "C5H8" and s.hf298_source.startswith("measured")
    cbh2 = s.scheme("CBH-2")
    assert cbh2 is not None and cbh2.strain_kj_per_mol > 200
    r = ringheat.cbh("C1CC12CC2", 2, template_unit="hartree")
    assert r.rung == 2 and r.reaction == "C1C2(C1)CC2 + 6 CC -> CC(C)(C)C + 4 CCC"
    assert [sp.role for sp in r.species].count("target") == 1
    assert all(sp.hf298_source for sp in r.species if sp.role != "target")
    assert r.template is not None and "hartree" in r.template
    with pytest.raises(ringheat.SmilesError):
        ringheat.strain("C1CC")
    with pytest.raises(ValueError):
        ringheat.cbh("CCC", 7)


def test_tables_and_extra_tables_as_on_the_command_line(tmp_path):
    bundled = ringheat.estimate("CCC")
    # --tables with a copy of the bundled files gives the same numbers.
    copy = tmp_path / "copy"
    copy.mkdir()
    for f in (REPO / "group-tables").glob("*.toml"):
        shutil.copy(f, copy)
    assert ringheat.estimate("CCC", tables=copy).hf298_kj_per_mol == bundled.hf298_kj_per_mol
    # --extra-tables with one entry of our own replaces that entry (invented test value).
    extra = tmp_path / "extra"
    extra.mkdir()
    (extra / "mine.toml").write_text(
        '[meta]\ntitle = "test"\nenthalpy_unit = "kJ/mol"\nentropy_unit = "J/(mol K)"\n\n'
        '[[group]]\nkey = "C-(C)2(H)2"\nhf = -10.0\nunc_hf = 1.0\n'
        'source = "invented for a test"\n'
    )
    mine = ringheat.estimate("CCC", extra_tables=extra)
    assert any(t.source == "invented for a test" for t in mine.terms)
    assert mine.hf298_kj_per_mol != bundled.hf298_kj_per_mol
    bad = tmp_path / "bad"
    bad.mkdir()
    (bad / "x.toml").write_text("[meta\n")
    with pytest.raises(ringheat.TablesError) as info:
        ringheat.Engine(extra_tables=bad)
    assert "x.toml" in str(info.value)
    with pytest.raises(ringheat.TablesError):
        ringheat.Engine(tables=copy, extra_tables=extra)


def test_dataframe():
    pd = pytest.importorskip("pandas")
    frame = ringheat.estimate_many(["CCO", "C1CC"]).to_dataframe()
    assert list(frame.columns) == list(ringheat.RECORD_COLUMNS)
    assert frame["error"].isna().tolist() == [True, False]
    assert isinstance(frame, pd.DataFrame)
    meta = ringheat.frame_meta()
    assert len(meta) == 0 and list(meta.dtypes) == list(frame.dtypes)


def test_the_gil_is_released_while_the_engine_works():
    """While one thread is inside the engine, another Python thread runs Python code to its
    end. With the GIL held, the main thread could not even wake up before the call returned."""
    native = ringheat.engine()._native
    items = [(s, None) for s in reference_smiles(3000)]
    inside = threading.Event()
    done = threading.Event()

    def work():
        inside.set()
        native.estimate_json(items, "<python>", 1, [], None, None, 1)
        done.set()

    t = threading.Thread(target=work)
    t.start()
    inside.wait()
    busy = sum(i * i for i in range(200_000))  # longer than the 5 ms switch interval
    finished_first = not done.is_set()
    t.join()
    assert busy > 0 and finished_first
