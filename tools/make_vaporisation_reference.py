#!/usr/bin/env python3
"""Write group-tables/phase/vaporisation-crc.toml: measured vaporisation enthalpies at 298.15 K.

Source (nothing typed in by hand): the `chemicals` package (PyPI), its CRC Handbook tables
  * `chemicals.phase_change.Hvap_data_CRC`, column `Hvap298` (J/mol): the enthalpy of
    vaporisation at 298.15 K;
  * `chemicals.heat_capacity.CRC_standard_data`, columns `Hfg`, `Hfl` (J/mol) and `S0g`, `S0l`
    (J/(mol K)): gas and liquid heats of formation and entropies, used as a cross-check
    (`Hfg - Hfl` is a second measure of the vaporisation enthalpy) and for the vaporisation
    entropy `S0g - S0l`;
  * `chemicals.identifiers.search_chemical(CAS).smiles` for the structure.

Species with no Hvap298 but a CRC enthalpy of vaporisation at the normal boiling point (columns
`HvapTb`, `Tb`) get a value moved to 298.15 K by Watson's relation (K. M. Watson, Ind. Eng. Chem.
35 (1943) 398: dHvap(T) = dHvap(Tb) ((1 - T/Tc) / (1 - Tb/Tc))^0.38, `chemicals.phase_change.Watson`)
with the critical temperature of `chemicals.critical.Tc` (its default source order). Such entries
carry `from_boiling_point` and a wider uncertainty, WATSON_UNC_KJ; over the species that have
both columns, the moved values differ from Hvap298 by 0.8 kJ/mol on average (RMS 1.7, 90th
percentile 2.0; computed with chemicals 1.5.2 when this script was written). The checks of the
estimate use the direct Hvap298 entries only.

ringheat uses the file twice: as the measured dHvap of a species (after a user value, before the
group-contribution estimate), and in tests/vaporisation.rs as the outside data the estimate is
checked against. A species whose `Hvap298` and `Hfg - Hfl` disagree by more than
MAX_DISAGREEMENT_KJ is written with `suspect = true` and the reason: the carboxylic acids are the
usual case (their vapour is partly dimerised, so the tabulated Hvap298 is not the monomer's).
Suspect entries are neither used as measured values nor counted in the checks.

Usage (from the repository root, with `pip install chemicals`):
    python3 tools/make_vaporisation_reference.py
"""

import datetime
import math
import os
import sys

import chemicals
from chemicals.heat_capacity import CRC_standard_data
from chemicals.identifiers import search_chemical
from chemicals.critical import Tc
from chemicals.phase_change import Hvap_data_CRC, Watson

REPO = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
TARGET = os.path.join(REPO, "group-tables", "phase", "vaporisation-crc.toml")
# Elements the group-contribution estimate can handle; other species are left out.
ELEMENTS = {"C", "H", "O", "N", "S", "F", "Cl", "Br", "I"}
# Our choice: above this, Hvap298 and Hfg - Hfl of the same CRC edition contradict each other.
MAX_DISAGREEMENT_KJ = 3.0
# Our assumption: the CRC Hvap298 column gives no uncertainty; 1 kJ/mol is typical of
# calorimetric and vapour-pressure determinations of this quantity (recalled from memory:
# J. S. Chickos, W. E. Acree, J. Phys. Chem. Ref. Data 32 (2003) 519 discuss the spread).
ASSUMED_UNC_KJ = 1.0
# Uncertainty of a Watson-moved value: the 90th percentile of |moved - Hvap298| (see above).
WATSON_UNC_KJ = 2.0
# Uncertainty of Hf(gas) - Hf(liquid): two tabulated values of about 1 kJ/mol each (assumed).
FORMATION_UNC_KJ = 1.5


def finite(x):
    return x is not None and not (isinstance(x, float) and math.isnan(x))


def toml_string(text):
    return '"' + str(text).replace("\\", "\\\\").replace('"', '\\"') + '"'


def elements_of(formula):
    out, i = set(), 0
    while i < len(formula):
        if formula[i].isupper():
            j = i + 1
            while j < len(formula) and formula[j].islower():
                j += 1
            out.add(formula[i:j])
            i = j
        else:
            i += 1
    return out


def molecule_of(cas, formula_hint=None):
    """(smiles, formula) from the package's identifier table, or (None, reason)."""
    try:
        meta = search_chemical(cas)
    except Exception:
        return None, "no smiles"
    smiles, formula = meta.smiles, formula_hint or meta.formula
    if not smiles:
        return None, "no smiles"
    if not elements_of(str(formula)) <= ELEMENTS:
        return None, "elements"
    if "." in smiles or "+" in smiles or "-]" in smiles:
        return None, "ionic or mixture"
    return smiles, formula


def main():
    rows = []
    dropped = {"no smiles": 0, "elements": 0, "ionic or mixture": 0}
    std = CRC_standard_data
    with_liquid = set(std.index[std["Hfg"].notna() & std["Hfl"].notna()])
    for cas in sorted(set(Hvap_data_CRC.index) | with_liquid):
        rec = Hvap_data_CRC.loc[cas] if cas in Hvap_data_CRC.index else None
        direct = rec["Hvap298"] if rec is not None and finite(rec["Hvap298"]) else None
        formation = None
        if cas in with_liquid:
            formation = (std.loc[cas, "Hfg"] - std.loc[cas, "Hfl"]) / 1000.0
        moved = None
        if direct is None and formation is None and rec is not None:
            tb, hvap_tb = rec["Tb"], rec["HvapTb"]
            tc = Tc(cas) if finite(tb) and finite(hvap_tb) else None
            if finite(tc) and tc > max(tb, 298.15):
                moved = (
                    Watson(298.15, hvap_tb, tb, tc) / 1000.0,
                    f"moved from CRC HvapTb {hvap_tb / 1000.0:.2f} kJ/mol at Tb {tb:.2f} K by "
                    f"Watson's relation (exponent 0.38, Tc {tc:.1f} K from chemicals.critical.Tc)",
                )
        if direct is None and formation is None and moved is None:
            continue
        name = rec["Chemical"] if rec is not None else std.loc[cas, "Chemical"]
        smiles, formula = molecule_of(cas, rec["Formula"] if rec is not None else None)
        if smiles is None:
            dropped[formula] += 1
            continue
        row = {"cas": cas, "name": name, "smiles": smiles}
        if direct is not None:
            row.update(hvap298_kj=direct / 1000.0, basis="Hvap298", unc_kj=ASSUMED_UNC_KJ)
        elif formation is not None:
            row.update(hvap298_kj=formation, basis="Hf(gas) - Hf(liquid)", unc_kj=FORMATION_UNC_KJ)
        else:
            row.update(hvap298_kj=moved[0], basis="Watson from HvapTb", unc_kj=WATSON_UNC_KJ,
                       note=moved[1])
        if formation is not None:
            row["hf_difference_kj"] = formation
        if cas in std.index and finite(std.loc[cas, "S0g"]) and finite(std.loc[cas, "S0l"]):
            row["svap298_j"] = std.loc[cas, "S0g"] - std.loc[cas, "S0l"]
        if direct is not None and formation is not None:
            if abs(formation - row["hvap298_kj"]) > MAX_DISAGREEMENT_KJ:
                row["suspect"] = (
                    f"Hvap298 {row['hvap298_kj']:.2f} and Hfg - Hfl {formation:.2f} kJ/mol of the "
                    f"same handbook differ by more than {MAX_DISAGREEMENT_KJ} kJ/mol"
                )
        rows.append(row)
    rows.sort(key=lambda r: r["cas"])
    n_suspect = sum(1 for r in rows if "suspect" in r)
    n_entropy = sum(1 for r in rows if "svap298_j" in r)
    n_moved = sum(1 for r in rows if r["basis"] == "Watson from HvapTb")
    n_formation = sum(1 for r in rows if r["basis"] == "Hf(gas) - Hf(liquid)")
    out = [
        "# Measured vaporisation enthalpies at 298.15 K (CRC Handbook via the chemicals package).",
        "# Generated by tools/make_vaporisation_reference.py; regenerate instead of editing.",
        f"# chemicals {chemicals.__version__}, python {sys.version.split()[0]}; generated "
        f"{datetime.date.today().isoformat()}",
        "# Tables: chemicals.phase_change.Hvap_data_CRC (Hvap298; HvapTb and Tb), chemicals.",
        "#   heat_capacity.CRC_standard_data (Hfg - Hfl, also a cross-check of Hvap298; S0g - S0l",
        "#   as the vaporisation entropy), chemicals.critical.Tc (for Watson's relation);",
        "#   SMILES from chemicals.identifiers.search_chemical(CAS).",
        f"# entries: {len(rows)}; {n_suspect} suspect (Hvap298 and Hfg - Hfl differ by more than",
        f"#   {MAX_DISAGREEMENT_KJ} kJ/mol; not used); {n_entropy} with a vaporisation entropy.",
        f"# left out: {dropped['elements']} with elements outside C/H/O/N/S/halogens, "
        f"{dropped['no smiles']} without SMILES, {dropped['ionic or mixture']} ionic or mixtures.",
        f"# basis: Hvap298 (the CRC column) {len(rows) - n_moved - n_formation}; where it is",
        f"#   missing, Hf(gas) - Hf(liquid) of the CRC standard-state table {n_formation}; else CRC",
        f"#   HvapTb moved to 298.15 K by Watson's relation {n_moved}.",
        f"# unc_kj: the tables give none; assumed {ASSUMED_UNC_KJ} (Hvap298), {FORMATION_UNC_KJ}",
        f"#   (formation difference), {WATSON_UNC_KJ} (Watson) kJ/mol.",
        "",
        "[meta]",
        'title = "Vaporisation enthalpies at 298.15 K, CRC Handbook"',
        f'source = "CRC Handbook via the chemicals package {chemicals.__version__}"',
        'generator = "tools/make_vaporisation_reference.py"',
        "",
    ]
    for r in rows:
        out.append("[[species]]")
        out.append(f"cas = {toml_string(r['cas'])}")
        out.append(f"name = {toml_string(r['name'])}")
        out.append(f"smiles = {toml_string(r['smiles'])}")
        out.append(f"hvap298_kj = {r['hvap298_kj']:.3f}")
        out.append(f"unc_kj = {r['unc_kj']}")
        out.append(f"basis = {toml_string(r['basis'])}")
        if "note" in r:
            out.append(f"note = {toml_string(r['note'])}")
        if "hf_difference_kj" in r:
            out.append(f"hf_difference_kj = {r['hf_difference_kj']:.3f}")
        if "svap298_j" in r:
            out.append(f"svap298_j = {r['svap298_j']:.3f}")
        if "suspect" in r:
            out.append(f"suspect = {toml_string(r['suspect'])}")
        out.append("")
    os.makedirs(os.path.dirname(TARGET), exist_ok=True)
    with open(TARGET, "w", encoding="utf-8") as f:
        f.write("\n".join(out))
    print(f"wrote {TARGET}: {len(rows)} species ({n_suspect} suspect)")


if __name__ == "__main__":
    main()
