"""The Python rows equal the command line's for the demo data, field for field."""

import csv
import io

import pytest

import ringheat
from conftest import DEMO

TEMPERATURES = [500.0, 1000.0]


@pytest.fixture(scope="module")
def py_rows():
    return ringheat.estimate_file(DEMO, temperatures_k=TEMPERATURES, threads=2)


def q(d, key):
    """(value, uncertainty) of an optional quantity of the JSON output."""
    v = d.get(key)
    return (None, None) if v is None else (v["value"], v["uncertainty"])


def test_same_rows_in_the_same_order(cli_json, py_rows):
    assert len(py_rows) == len(cli_json) > 20
    assert [r.input for r in py_rows] == [
        (c["error"]["input"] if "error" in c else c["input"]) for c in cli_json
    ]


def test_estimates_field_for_field(cli_json, py_rows):
    done = 0
    for c, p in zip(cli_json, py_rows):
        if "error" in c:
            continue
        done += 1
        assert isinstance(p, ringheat.Estimate), p
        e = c["estimate"]
        assert (p.input, p.name, p.canonical_smiles, p.formula) == (
            c["input"], c["name"], c["canonical_smiles"], c["formula"])
        assert (p.hf298_kj_per_mol, p.hf298_unc_kj_per_mol) == q(e, "hf298_kj")
        assert (p.strain_free_hf298_kj_per_mol, p.strain_free_hf298_unc_kj_per_mol) == q(
            e, "strain_free_hf298_kj")
        assert (p.s298_j_per_mol_k, p.s298_unc_j_per_mol_k) == q(e, "s298_j")
        assert (p.cp298_j_per_mol_k, p.cp298_unc_j_per_mol_k) == q(c, "cp298_j")
        if e["cp_j"] is None:
            assert p.cp_j_per_mol_k is None
        else:
            assert p.cp_j_per_mol_k == tuple(x["value"] for x in e["cp_j"])
            assert p.cp_unc_j_per_mol_k == tuple(x["uncertainty"] for x in e["cp_j"])
        s = e["symmetry"]
        assert (p.symmetry_number, p.external_symmetry_number, p.internal_symmetry_number,
                p.optical_isomers, list(p.symmetry_notes), p.symmetry_overridden) == (
            s["total"], s["external"], s["internal"], s["optical_isomers"], s["notes"],
            e["symmetry_overridden"])
        assert len(p.flags) == len(e["flags"])
        assert len(p.terms) == len(e["terms"])
        for pt, ct in zip(p.terms, e["terms"]):
            v = ct["per_unit"]
            known = v["known"]
            assert (pt.kind, pt.label, pt.count, pt.source) == (
                ct["kind"], ct["label"], ct["count"], ct["source"])
            assert pt.hf_kj_per_mol == (v["hf_kj"] if known["hf"] else None)
            assert pt.hf_unc_kj_per_mol == (v["unc_hf_kj"] if known["hf"] else None)
            assert pt.s_j_per_mol_k == (v["s_j"] if known["s"] else None)
            assert pt.s_unc_j_per_mol_k == (v["unc_s_j"] if known["s"] else None)
            assert pt.cp_j_per_mol_k == (tuple(v["cp_j"]) if known["cp"] else None)
            assert pt.cp_unc_j_per_mol_k == (v["unc_cp_j"] if known["cp"] else None)
            assert len(pt.notes) == len(ct["notes"])
        assert [s.t_k for s in p.states] == [s["t_k"] for s in c["states"]]
        for ps, cs in zip(p.states, c["states"]):
            assert (ps.cp_j_per_mol_k, ps.cp_unc_j_per_mol_k, ps.h_minus_h298_kj_per_mol,
                    ps.h_kj_per_mol, ps.h_unc_kj_per_mol, ps.s_j_per_mol_k, ps.s_unc_j_per_mol_k,
                    ps.g_kj_per_mol, ps.g_unc_kj_per_mol) == (
                cs["cp_j"], cs["cp_unc_j"], cs["dh_kj"], cs["h_kj"], cs["h_unc_kj"], cs["s_j"],
                cs["s_unc_j"], cs["g_kj"], cs["g_unc_kj"])
    assert done > 20


def test_errors_carry_the_command_line_place_and_message(cli_json, py_rows):
    errors = [(c["error"], p) for c, p in zip(cli_json, py_rows) if "error" in c]
    assert errors, "the demo data holds a bad SMILES on purpose"
    for c, p in errors:
        assert isinstance(p, ringheat.Failure)
        assert (p.source, p.line, p.input, p.message) == (
            c["place"]["source"], c["place"]["line"], c["input"], c["message"])
        assert p.place == f"{c['place']['source']}:{c['place']['line']}"
    bad = errors[0][1]
    assert bad.kind == "smiles" and f"at column {bad.column}" in bad.message


def test_records_equal_the_csv_output(cli_csv, py_rows):
    """Flat records have the CSV's columns and, printed as the CSV prints them, its cells
    (flags text and one-line errors included)."""
    table = list(csv.reader(io.StringIO(cli_csv)))
    header, lines = table[0], table[1:]
    columns = [c for c in ringheat.RECORD_COLUMNS if c not in ("source", "line")]
    assert header == columns
    assert len(lines) == len(py_rows)
    for cells, rec in zip(lines, py_rows.to_records()):
        for col, cell in zip(header, cells):
            v = rec[col]
            if rec["error"] is not None and col == "name":
                continue  # the CSV leaves an error row's name out; the Failure keeps it
            if v is None:
                mine = ""
            elif isinstance(v, float):
                mine = f"{v:.3f}"
            else:
                mine = str(v)
            assert mine == cell, (rec["input"], col)
