#!/usr/bin/env python3
"""Build ringheat's outside reference files (tests/reference/*.tsv) from PyPI packages.

Sources (nothing is typed in by hand):
  * `chemicals` (PyPI): its PubChem identifier table, the CRC Handbook standard-state table
    (`chemicals.heat_capacity.CRC_standard_data`), the Active Thermochemical Tables 1.112 gas
    file shipped with it (`Reactions/ATcT 1.112 (g).tsv`), the TRC ideal-gas heat-capacity
    correlations (`chemicals.heat_capacity.TRC_gas_data`), and its WebBook and Yaws gas-phase
    heat-of-formation columns (cross-checks only).
  * `rdkit` (PyPI): parsing, formulas, hydrogen counts, rings, aromaticity, random SMILES.

Every output is a TSV file: a block of `#` lines (source package and version, table used, date,
how rows were chosen, column meanings and units) followed by one header row and the data.
Row selection is deterministic (fixed seeds), so a rerun with the same package versions gives
the same rows; only the date line changes.

Usage (from the repository root):
    python3 tools/make_reference.py all            # every file
    python3 tools/make_reference.py structures     # tests/reference/smiles_structures.tsv
    python3 tools/make_reference.py spellings      # tests/reference/canonical_spellings.tsv
    python3 tools/make_reference.py thermo         # tests/reference/thermo_reference.tsv and
                                                   # tests/reference/trc_heat_capacity.tsv
    python3 tools/make_reference.py atct           # tests/reference/atct_small_species.tsv
"""

import csv
import datetime
import os
import random
import re
import sys

import chemicals
import rdkit
from chemicals.identifiers import search_chemical
from rdkit import Chem, RDLogger

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from provenance import UNRELIABLE_FILE, unreliable_species  # noqa: E402
from rdkit.Chem import rdMolDescriptors

RDLogger.DisableLog("rdApp.*")

REPO = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
OUT_DIR = os.path.join(REPO, "tests", "reference")
CHEM_DIR = os.path.dirname(chemicals.__file__)
PUBCHEM_TABLE = os.path.join("Identifiers", "chemical identifiers pubchem large.tsv")
ATCT_TABLE = os.path.join("Reactions", "ATcT 1.112 (g).tsv")

# Seeds for every random choice in this script.
SEED_STRUCTURES = 20240611
SEED_SPELLINGS = 7321

STRUCTURE_TARGET = 6000
SPELLING_TARGET = 1200
# Species whose CRC and ATcT heats of formation differ by more than this are dropped.
MAX_SOURCE_DISAGREEMENT_KJ = 4.0
THERMO_ELEMENTS = {"C", "H", "O", "N", "S", "F", "Cl", "Br", "I"}


def versions_header():
    return [
        f"# packages: chemicals {chemicals.__version__}, rdkit {rdkit.__version__}, "
        f"python {sys.version.split()[0]}",
        f"# generated: {datetime.date.today().isoformat()} by tools/make_reference.py "
        f"(regenerate with `python3 tools/make_reference.py all`)",
    ]


def write_tsv(name, header_lines, columns, rows):
    path = os.path.join(OUT_DIR, name)
    os.makedirs(OUT_DIR, exist_ok=True)
    with open(path, "w", encoding="utf-8", newline="") as f:
        for line in header_lines:
            f.write(line.rstrip() + "\n")
        f.write("\t".join(columns) + "\n")
        for row in rows:
            cells = ["" if row.get(c) is None else str(row[c]) for c in columns]
            for cell in cells:
                if "\t" in cell or "\n" in cell:
                    raise ValueError(f"tab or newline in a cell of {name}: {cell!r}")
            f.write("\t".join(cells) + "\n")
    print(f"wrote {path}: {len(rows)} rows, {os.path.getsize(path)} bytes")


# ---------------------------------------------------------------------------------------------
# RDKit facts about one molecule


def total_hydrogens(mol):
    """Implicit + explicit hydrogens on heavy atoms, plus hydrogen atoms kept as nodes."""
    return sum(a.GetTotalNumHs() for a in mol.GetAtoms()) + sum(
        1 for a in mol.GetAtoms() if a.GetAtomicNum() == 1
    )


def cyclomatic(mol):
    components = len(Chem.GetMolFrags(mol)) if mol.GetNumAtoms() else 0
    return mol.GetNumBonds() - mol.GetNumAtoms() + components


def structure_facts(mol):
    rings = cyclomatic(mol)
    sssr = sorted(len(r) for r in Chem.GetSymmSSSR(mol))
    return {
        "formula": rdMolDescriptors.CalcMolFormula(mol),
        "heavy_atoms": mol.GetNumHeavyAtoms(),
        "hydrogens": total_hydrogens(mol),
        "rings": rings,
        "ring_sizes": ",".join(str(s) for s in sssr),
        "ring_sizes_comparable": 1 if len(sssr) == rings else 0,
    }


# ---------------------------------------------------------------------------------------------
# 1. smiles_structures.tsv


def read_pubchem_table():
    """(cid, smiles) of every row of the identifier table; columns are positional, no header."""
    rows = []
    with open(os.path.join(CHEM_DIR, PUBCHEM_TABLE), encoding="utf-8") as f:
        for line in f:
            parts = line.rstrip("\n").split("\t")
            if len(parts) < 5 or not parts[4]:
                continue
            rows.append((parts[0], parts[4]))
    return rows


def categorize(smiles, mol):
    """One category per row, first match wins; used for the biased sample."""
    if re.search(r"\[\d", smiles):
        return "isotope"
    if any(a.GetFormalCharge() != 0 for a in mol.GetAtoms()):
        return "charged"
    if "@" in smiles or "/" in smiles or "\\" in smiles:
        return "stereo"
    if "." in smiles:
        return "multi_component"
    if any(a.GetIsAromatic() for a in mol.GetAtoms()):
        if any(a.GetAtomicNum() not in (1, 6) for a in mol.GetAtoms()):
            return "aromatic_hetero"
        return "aromatic_carbocycle"
    if mol.GetRingInfo().NumRings() > 0:
        if any(a.GetAtomicNum() not in (1, 6) for a in mol.GetAtoms()):
            return "aliphatic_ring_hetero"
        return "aliphatic_ring_carbon"
    if any(a.GetAtomicNum() not in (1, 6) for a in mol.GetAtoms()):
        return "acyclic_hetero"
    return "acyclic_carbon"


# Rows drawn from each category (all of a category when it holds fewer).
STRUCTURE_QUOTAS = {
    "isotope": 400,
    "charged": 700,
    "stereo": 900,
    "multi_component": 300,
    "aromatic_hetero": 1100,
    "aromatic_carbocycle": 700,
    "aliphatic_ring_hetero": 600,
    "aliphatic_ring_carbon": 400,
    "acyclic_hetero": 600,
    "acyclic_carbon": 300,
}


def make_structures():
    table = read_pubchem_table()
    pools = {k: [] for k in STRUCTURE_QUOTAS}
    skipped = 0
    for cid, smiles in table:
        mol = Chem.MolFromSmiles(smiles)
        if mol is None:
            skipped += 1
            continue
        pools[categorize(smiles, mol)].append((cid, smiles, mol))
    rng = random.Random(SEED_STRUCTURES)
    chosen = []
    taken = {}
    for cat, quota in STRUCTURE_QUOTAS.items():
        pool = pools[cat]
        pick = pool if len(pool) <= quota else rng.sample(pool, quota)
        taken[cat] = (len(pick), len(pool))
        chosen.extend(pick)
    # Top up to the target from the remaining rows, uniformly.
    chosen_ids = {c[0] for c in chosen}
    rest = [r for cat in pools for r in pools[cat] if r[0] not in chosen_ids]
    extra = max(0, STRUCTURE_TARGET - len(chosen))
    chosen.extend(rng.sample(rest, min(extra, len(rest))))
    chosen.sort(key=lambda r: int(r[0]) if r[0].isdigit() else 0)
    rows = []
    for cid, smiles, mol in chosen:
        row = {"pubchem_cid": cid, "smiles": smiles}
        row.update(structure_facts(mol))
        rows.append(row)
    quota_text = ", ".join(f"{c} {n}/{p}" for c, (n, p) in taken.items())
    header = [
        "# ringheat reference: SMILES structures with RDKit's formula, atom counts and rings.",
        f"# source: chemicals package, file '{PUBCHEM_TABLE}' (PubChem identifier table; "
        "column 1 = PubChem CID, column 5 = SMILES as the table gives it).",
        *versions_header(),
        f"# table rows: {len(table)}; rows RDKit could not parse (skipped): {skipped}.",
        "# selection: every row parsed with RDKit (Chem.MolFromSmiles, default sanitization) and put",
        "#   in the first matching category: isotope ([digit), charged (any formal charge), stereo",
        "#   (@ / \\), multi_component (.), aromatic_hetero, aromatic_carbocycle,",
        "#   aliphatic_ring_hetero, aliphatic_ring_carbon, acyclic_hetero, acyclic_carbon; then",
        f"#   random.Random({SEED_STRUCTURES}).sample per category (taken/available: {quota_text});",
        f"#   topped up uniformly from the remaining rows to {STRUCTURE_TARGET}; sorted by CID.",
        "# columns:",
        "#   pubchem_cid: PubChem compound id from the table",
        "#   smiles: SMILES exactly as in the table",
        "#   formula: rdMolDescriptors.CalcMolFormula (Hill order, charge suffix, isotopes merged)",
        "#   heavy_atoms: Mol.GetNumHeavyAtoms()",
        "#   hydrogens: sum of Atom.GetTotalNumHs() plus hydrogen atoms kept as nodes",
        "#   rings: cyclomatic number = bonds - atoms + connected components (RDKit mol)",
        "#   ring_sizes: sorted sizes of Chem.GetSymmSSSR joined by ',' (empty if none)",
        "#   ring_sizes_comparable: 1 when the symmetrized SSSR has exactly `rings` rings, else 0",
        "#     (RDKit's symmetrization can add rings on cages such as cubane)",
    ]
    columns = [
        "pubchem_cid",
        "smiles",
        "formula",
        "heavy_atoms",
        "hydrogens",
        "rings",
        "ring_sizes",
        "ring_sizes_comparable",
    ]
    write_tsv("smiles_structures.tsv", header, columns, rows)
    return pools


# ---------------------------------------------------------------------------------------------
# 2. canonical_spellings.tsv


def random_spellings(mol, seed, kekule, count):
    m = Chem.Mol(mol)
    if kekule:
        Chem.Kekulize(m, clearAromaticFlags=True)
    return list(
        Chem.MolToRandomSmilesVect(
            m, count, randomSeed=seed, isomericSmiles=True, kekuleSmiles=kekule
        )
    )


def make_spellings(pools=None):
    if pools is None:
        pools = {}
        for cid, smiles in read_pubchem_table():
            mol = Chem.MolFromSmiles(smiles)
            if mol is not None:
                pools.setdefault(categorize(smiles, mol), []).append((cid, smiles, mol))
    # Weights: stereo and ring molecules dominate; small enough to keep the file compact.
    wanted = {
        "stereo": 400,
        "aromatic_hetero": 200,
        "aromatic_carbocycle": 150,
        "aliphatic_ring_hetero": 150,
        "aliphatic_ring_carbon": 120,
        "charged": 60,
        "isotope": 40,
        "acyclic_hetero": 60,
        "acyclic_carbon": 40,
        "multi_component": 30,
    }
    rng = random.Random(SEED_SPELLINGS)
    rows = []
    seen = set()
    rejected_short = 0
    for cat, n in wanted.items():
        pool = [r for r in pools.get(cat, []) if 4 <= r[2].GetNumHeavyAtoms() <= 45]
        order = rng.sample(pool, len(pool))
        taken = 0
        for cid, smiles, mol in order:
            if taken >= n:
                break
            canon = Chem.MolToSmiles(mol)
            if canon in seen:
                continue
            seed = rng.randrange(1, 2**31)
            # Spellings 1-3 aromatic (as RDKit writes them), 4-5 Kekulé with aromatic flags cleared.
            aromatic = list(dict.fromkeys(random_spellings(mol, seed, False, 12)))
            kekule = list(dict.fromkeys(random_spellings(mol, seed + 1, True, 12)))
            spellings = aromatic[:3]
            for s in kekule:
                if len(spellings) >= 5:
                    break
                if s not in spellings:
                    spellings.append(s)
            for s in aromatic[3:]:
                if len(spellings) >= 5:
                    break
                if s not in spellings:
                    spellings.append(s)
            if len(spellings) < 5:
                rejected_short += 1
                continue
            # Sanity: every spelling must round-trip in RDKit to the same canonical SMILES.
            if any(Chem.MolToSmiles(Chem.MolFromSmiles(s)) != canon for s in spellings):
                rejected_short += 1
                continue
            seen.add(canon)
            taken += 1
            row = {"id": cid, "category": cat, "rdkit_canonical": canon}
            for i, s in enumerate(spellings, 1):
                row[f"spelling_{i}"] = s
            rows.append(row)
    header = [
        "# ringheat reference: one molecule per row, five different SMILES spellings of it.",
        f"# source: molecules from the chemicals package file '{PUBCHEM_TABLE}' (PubChem",
        "#   identifier table); spellings written by RDKit.",
        *versions_header(),
        "# selection: rows grouped by the same categories as smiles_structures.tsv, 4 to 45 heavy",
        f"#   atoms, drawn with random.Random({SEED_SPELLINGS}); quotas per category: "
        + ", ".join(f"{k} {v}" for k, v in wanted.items())
        + ".",
        "#   Molecules are distinct by RDKit canonical isomeric SMILES. Molecules for which five",
        "#   distinct spellings that all round-trip in RDKit could not be made were skipped: "
        f"{rejected_short}.",
        "# spellings: Chem.MolToRandomSmilesVect(mol, 12, randomSeed=s, isomericSmiles=True) with a",
        "#   per-row seed s from the generator above; spelling_1..3 are aromatic (lower-case) forms,",
        "#   spelling_4..5 are Kekule forms (Chem.Kekulize(m, clearAromaticFlags=True) and",
        "#   kekuleSmiles=True, seed s+1) unless fewer distinct ones exist. All five differ.",
        "# columns: id (PubChem CID), category (selection category), rdkit_canonical",
        "#   (Chem.MolToSmiles, isomeric), spelling_1..spelling_5.",
    ]
    columns = ["id", "category", "rdkit_canonical"] + [f"spelling_{i}" for i in range(1, 6)]
    write_tsv("canonical_spellings.tsv", header, columns, rows)


# ---------------------------------------------------------------------------------------------
# ATcT helpers

TOKEN = re.compile(r"([A-Z][a-z]?|\(|\)|\d+)")


def parse_condensed_formula(text):
    """Element counts and charge of an ATcT formula such as `(CH3)2CHCH2C(CH3)3 (g)` or `[CN]- (g)`.

    Returns None for anything it does not understand.
    """
    text = text.strip()
    if text.endswith("(g)"):
        text = text[:-3].strip()
    charge = 0
    m = re.fullmatch(r"\[(.*)\]([+-])(\d*)", text)
    if m:
        text = m.group(1)
        charge = (1 if m.group(2) == "+" else -1) * int(m.group(3) or 1)
    else:
        m = re.fullmatch(r"(.*?)([+-])(\d*)", text)
        if m:
            text = m.group(1)
            charge = (1 if m.group(2) == "+" else -1) * int(m.group(3) or 1)
    pos = 0
    stack = [{}]
    last = None  # counts dict of the last element or closed group
    tokens = TOKEN.findall(text)
    if "".join(tokens) != text:
        return None
    for tok in tokens:
        pos += 1
        if tok == "(":
            stack.append({})
            last = None
        elif tok == ")":
            if len(stack) < 2:
                return None
            group = stack.pop()
            last = group
            for k, v in group.items():
                stack[-1][k] = stack[-1].get(k, 0) + v
        elif tok.isdigit():
            if last is None:
                return None
            n = int(tok)
            for k, v in last.items():
                stack[-1][k] = stack[-1].get(k, 0) + v * (n - 1)
            last = None
        else:
            stack[-1][tok] = stack[-1].get(tok, 0) + 1
            last = {tok: 1}
    if len(stack) != 1:
        return None
    return stack[0], charge


def mol_element_counts(mol):
    counts = {}
    for a in mol.GetAtoms():
        sym = a.GetSymbol()
        if a.GetAtomicNum() == 1 and a.GetIsotope() == 2:
            sym = "D"
        counts[sym] = counts.get(sym, 0) + 1
        h = a.GetTotalNumHs()
        if h:
            counts["H"] = counts.get("H", 0) + h
    return counts


GREEK = {"α": "alpha", "β": "beta", "γ": "gamma", "δ": "delta", "ω": "omega"}


def normalized_name(name):
    name = name.lower()
    for k, v in GREEK.items():
        name = name.replace(k, v)
    return re.sub(r"[^a-z0-9]", "", name)


def name_matches_cas(name, cas):
    """True when `name` is one of the names the identifier table gives for `cas`.

    Guards CRC-only rows (which have no formula to check) against a CAS number that the
    identifier table maps to another species (a radical's CAS pointing at its parent molecule).
    """
    try:
        meta = search_chemical(cas)
    except Exception:  # the package raises plain exceptions for unknown identifiers
        return False
    names = [meta.common_name or "", meta.iupac_name or ""] + list(meta.synonyms or [])
    return normalized_name(name) in {normalized_name(n) for n in names}


def lookup_smiles(cas):
    try:
        meta = search_chemical(cas)
    except Exception:  # the package raises plain exceptions for unknown identifiers
        return None
    return meta.smiles if meta is not None and meta.smiles else None


def species_state(smiles):
    """(mol, reason) where reason is None for a neutral closed-shell single-component molecule."""
    if smiles is None:
        return None, "no SMILES for the CAS number"
    mol = Chem.MolFromSmiles(smiles)
    if mol is None:
        return None, "RDKit cannot parse the SMILES"
    if len(Chem.GetMolFrags(mol)) != 1:
        return mol, "more than one component"
    if Chem.GetFormalCharge(mol) != 0:
        return mol, "charged"
    if any(a.GetNumRadicalElectrons() for a in mol.GetAtoms()):
        return mol, "radical"
    if any(a.GetIsotope() for a in mol.GetAtoms()):
        return mol, "isotope-labelled"
    return mol, None


def read_atct():
    """ATcT gas rows that are neutral closed-shell molecules whose SMILES matches the formula."""
    path = os.path.join(CHEM_DIR, ATCT_TABLE)
    with open(path, encoding="utf-8") as f:
        rows = list(csv.DictReader(f, delimiter="\t"))
    kept, dropped = [], []
    for r in rows:
        cas, name, formula = r["CAS"], r["Chemical"], r["Formula"]
        parsed = parse_condensed_formula(formula)
        if parsed is None:
            dropped.append((cas, name, "ATcT formula not understood"))
            continue
        counts, charge = parsed
        if charge != 0:
            dropped.append((cas, name, "ion"))
            continue
        if "D" in counts:
            dropped.append((cas, name, "isotope-labelled"))
            continue
        smiles = lookup_smiles(cas)
        mol, reason = species_state(smiles)
        if reason is None and mol_element_counts(mol) != counts:
            reason = (
                f"SMILES {smiles} ({rdMolDescriptors.CalcMolFormula(mol)}) does not match the "
                f"ATcT formula {formula}"
            )
        if reason is not None:
            dropped.append((cas, name, reason))
            continue
        kept.append(
            {
                "cas": cas,
                "name": name,
                "smiles": smiles,
                "canonical": Chem.MolToSmiles(mol),
                "mol": mol,
                "atct_formula": formula.replace(" (g)", ""),
                "hf298_kj": float(r["Hfg"]) / 1000.0,
                "hf0_kj": float(r["Hfg_0K"]) / 1000.0 if r["Hfg_0K"] else None,
                "unc_kj": float(r["uncertainty"]) / 1000.0,
            }
        )
    # Two ATcT species (isomers) that map to one structure: the CAS lookup cannot tell them
    # apart, so neither is trusted.
    by_canon = {}
    for k in kept:
        by_canon.setdefault(k["canonical"], []).append(k)
    result = []
    for k in kept:
        if len(by_canon[k["canonical"]]) > 1:
            others = ", ".join(o["cas"] for o in by_canon[k["canonical"]] if o is not k)
            dropped.append((k["cas"], k["name"], f"same structure as {others}"))
        else:
            result.append(k)
    return rows, result, dropped


def fmt(x, digits=3):
    return None if x is None else f"{x:.{digits}f}"


# ---------------------------------------------------------------------------------------------
# 4. atct_small_species.tsv


def make_atct():
    table, kept, dropped = read_atct()
    kept.sort(key=lambda k: (k["mol"].GetNumHeavyAtoms(), k["canonical"]))
    rows = [
        {
            "cas": k["cas"],
            "name": k["name"],
            "smiles": k["smiles"],
            "formula": rdMolDescriptors.CalcMolFormula(k["mol"]),
            "hf298_kj": fmt(k["hf298_kj"]),
            "hf0_kj": fmt(k["hf0_kj"]),
            "unc_kj": fmt(k["unc_kj"]),
        }
        for k in kept
    ]
    reasons = {}
    for _, _, why in dropped:
        key = why
        if why.startswith("SMILES"):
            key = "looked-up structure has another formula"
        elif why.startswith("same structure"):
            key = "two ATcT entries share one structure"
        reasons[key] = reasons.get(key, 0) + 1
    mismatches = [d for d in dropped if d[2].startswith(("SMILES", "same structure"))]
    header = [
        "# ringheat reference: Active Thermochemical Tables 1.112 gas-phase heats of formation of",
        "#   neutral closed-shell molecules (reference species for isodesmic reactions).",
        f"# source: chemicals package, file '{ATCT_TABLE}' (columns CAS, Chemical, Formula,",
        "#   Hfg_0K, Hfg, uncertainty in J/mol); SMILES from",
        "#   chemicals.identifiers.search_chemical(CAS).smiles (PubChem identifier table).",
        *versions_header(),
        f"# selection: {len(table)} ATcT rows; kept {len(rows)} whose ATcT formula is neutral and whose",
        "#   SMILES is one component, neutral, without radicals (RDKit), without isotopes, and has",
        "#   exactly the element counts of the ATcT formula. Dropped: "
        + "; ".join(f"{k} {v}" for k, v in sorted(reasons.items()))
        + ".",
        "#   Rows dropped because the looked-up structure is another species (formula mismatch) or",
        "#   shared by two ATcT entries:",
        *[f"#     {cas} {name}: {why}" for cas, name, why in mismatches],
        "# caution: RDKit sees closed-shell SMILES only; ground-state triplets written as closed",
        "#   shell in PubChem (O=O) pass the filter. Noble-gas atoms are kept.",
        "# columns: cas; name (ATcT); smiles (PubChem via chemicals); formula (RDKit CalcMolFormula);",
        "#   hf298_kj (ATcT Hfg at 298.15 K, kJ/mol); hf0_kj (ATcT Hfg_0K, kJ/mol);",
        "#   unc_kj (ATcT stated uncertainty, kJ/mol). Sorted by heavy-atom count.",
    ]
    columns = ["cas", "name", "smiles", "formula", "hf298_kj", "hf0_kj", "unc_kj"]
    write_tsv("atct_small_species.tsv", header, columns, rows)


# ---------------------------------------------------------------------------------------------
# 3. thermo_reference.tsv


def classify(mol):
    if any(a.GetIsAromatic() for a in mol.GetAtoms()):
        return "aromatic"
    rings = cyclomatic(mol)
    if rings == 0:
        return "acyclic"
    return "monocyclic" if rings == 1 else "polycyclic"


def element_string(mol):
    present = {a.GetSymbol() for a in mol.GetAtoms()}
    if any(a.GetTotalNumHs() for a in mol.GetAtoms()):
        present.add("H")
    order = ["C", "H", "O", "N", "S", "F", "Cl", "Br", "I"]
    return "".join(e for e in order if e in present)


def nan_to_none(x):
    try:
        return None if x != x else float(x)
    except TypeError:
        return None


# Cross-checks of the CRC entropy and heat capacity against the package's other tables. WEBBOOK
# is not used (its CAS-number lookup matches some species to the wrong compound). A CRC value that another
# source contradicts by more than these limits is left empty (our choice: about 2.5 cal/(mol K)
# for S, about 1.2 cal/(mol K) for Cp, several times the scatter of sound data).
MAX_S_DISAGREEMENT_J = 10.0
MAX_CP_DISAGREEMENT_J = 5.0


def entropy_cross_check(cas, s_crc):
    """Other S0g values for `cas` (JANAF, Yaws) that contradict the CRC value."""
    import chemicals.reaction as reaction

    try:
        methods = [m for m in reaction.S0g_methods(cas) if m in ("JANAF", "YAWS")]
    except Exception:
        return []
    bad = []
    for m in methods:
        try:
            other = reaction.S0g(cas, method=m)
        except Exception:
            continue
        if other is not None and abs(other - s_crc) > MAX_S_DISAGREEMENT_J:
            bad.append((m, other))
    return bad


def heat_capacity_cross_check(cas, cp_crc):
    """Other Cp(298.15 K) values for `cas` (Poling table, TRC correlation) that contradict CRC."""
    import chemicals.heat_capacity as hc

    bad = []
    if cas in hc.Cp_data_Poling.index:
        other = nan_to_none(hc.Cp_data_Poling.loc[cas, "Cpg"])
        if other is not None and abs(other - cp_crc) > MAX_CP_DISAGREEMENT_J:
            bad.append(("Poling", other))
    if cas in hc.TRC_gas_data.index:
        row = hc.TRC_gas_data.loc[cas]
        try:
            if row["Tmin"] <= 298.15 <= row["Tmax"]:
                coeffs = [row[k] for k in ("a0", "a1", "a2", "a3", "a4", "a5", "a6", "a7")]
                other = hc.TRCCp(298.15, *coeffs)
                if abs(other - cp_crc) > MAX_CP_DISAGREEMENT_J:
                    bad.append(("TRC", other))
        except Exception:
            pass
    return bad


# A CRC-only heat of formation is cross-checked against the two other gas-phase heat-of-formation
# columns the package carries for it: the NIST WebBook column and the Yaws compilation. Neither is
# used as a value (WebBook's lookup matches some species to the wrong compound; Yaws carries some estimates). A
# CRC value is kept when no check column has the species, or when at least one of them agrees
# with it within this tolerance; when every available check disagrees nobody here can tell which
# is right, so the species is dropped. Our choice: about 2 kcal/mol, beyond the scatter of sound
# measurements.
MAX_CRC_CHECK_DISAGREEMENT_KJ = 8.0
HF_CHECK_COLUMNS = ("WEBBOOK", "YAWS")


def check_hfs(cas):
    """The gas Hf298 values (kJ/mol) of the check columns the package carries for `cas`."""
    import chemicals.reaction as reaction

    out = {}
    try:
        methods = reaction.Hfg_methods(cas)
    except Exception:
        return out
    for m in HF_CHECK_COLUMNS:
        if m in methods:
            try:
                out[m] = reaction.Hfg(cas, method=m) / 1000.0
            except Exception:
                pass
    return out


def make_thermo():
    from chemicals.heat_capacity import CRC_standard_data as crc
    s_dropped, cp_dropped, check_dropped = [], [], []
    unreliable = unreliable_species(REPO)

    _, atct_kept, _ = read_atct()
    atct = {k["cas"]: k for k in atct_kept}
    cas_list = sorted(
        set(crc.index[crc["Hfg"].notna()]) | set(atct.keys()),
        key=lambda c: [int(p) for p in c.split("-")] if re.fullmatch(r"\d+-\d+-\d", c) else [0],
    )
    rows, excluded, disagree, unverified = [], {}, [], []
    for cas in cas_list:
        in_crc = cas in crc.index
        crc_row = crc.loc[cas] if in_crc else None
        if crc_row is not None and getattr(crc_row, "ndim", 1) > 1:
            crc_row = crc_row.iloc[0]
        name = atct[cas]["name"] if cas in atct else str(crc_row["Chemical"])
        smiles = atct[cas]["smiles"] if cas in atct else lookup_smiles(cas)
        mol, reason = species_state(smiles)
        if reason is None:
            symbols = {a.GetSymbol() for a in mol.GetAtoms()}
            if not symbols <= THERMO_ELEMENTS:
                reason = "element outside C H O N S F Cl Br I"
            elif "C" not in symbols:
                reason = "no carbon"
        if reason is not None:
            excluded[reason] = excluded.get(reason, 0) + 1
            continue
        crc_hf = nan_to_none(crc_row["Hfg"]) if crc_row is not None else None
        crc_hf = None if crc_hf is None else crc_hf / 1000.0
        if cas in atct:
            hf, unc, src = atct[cas]["hf298_kj"], atct[cas]["unc_kj"], "ATcT 1.112"
            if crc_hf is not None and abs(crc_hf - hf) > MAX_SOURCE_DISAGREEMENT_KJ:
                disagree.append((cas, name, hf, crc_hf))
                continue
        elif crc_hf is not None:
            if not name_matches_cas(name, cas):
                unverified.append((cas, name, smiles))
                continue
            hf, unc, src = crc_hf, None, "CRC"
            checks = check_hfs(cas)
            if checks and all(
                abs(v - crc_hf) > MAX_CRC_CHECK_DISAGREEMENT_KJ for v in checks.values()
            ):
                check_dropped.append((cas, name, crc_hf, checks))
                continue
        else:
            continue
        s_crc = nan_to_none(crc_row["S0g"]) if crc_row is not None else None
        if s_crc is not None:
            bad = entropy_cross_check(cas, s_crc)
            if bad:
                s_dropped.append((cas, name, s_crc, bad))
                s_crc = None
        cp_crc = nan_to_none(crc_row["Cpg"]) if crc_row is not None else None
        if cp_crc is not None:
            bad = heat_capacity_cross_check(cas, cp_crc)
            if bad:
                cp_dropped.append((cas, name, cp_crc, bad))
                cp_crc = None
        rows.append(
            {
                "cas": cas,
                "name": name,
                "smiles": smiles,
                "hf298_kj": fmt(hf, 2),
                "hf298_unc_kj": fmt(unc, 3),
                "hf_source": src,
                "s298_j": fmt(s_crc, 2),
                "cp298_j": fmt(cp_crc, 2),
                "class": classify(mol),
                "hetero": 1 if any(a.GetAtomicNum() != 6 for a in mol.GetAtoms()) else 0,
                "elements": element_string(mol),
            }
        )
    # One structure listed under two CAS numbers (cis/trans isomers without stereo in the
    # looked-up SMILES, or a radical's CAS pointing at its parent): keep the ATcT row, whose
    # structure was checked against the ATcT formula, when there is exactly one; else keep none.
    groups = {}
    for r in rows:
        canon = Chem.MolToSmiles(Chem.MolFromSmiles(r["smiles"]))
        groups.setdefault(canon, []).append(r)
    unique, dup = [], []
    for r in rows:
        group = groups[Chem.MolToSmiles(Chem.MolFromSmiles(r["smiles"]))]
        atct_rows = [g for g in group if g["hf_source"] == "ATcT 1.112"]
        if len(group) == 1 or (len(atct_rows) == 1 and atct_rows[0] is r):
            unique.append(r)
        else:
            others = ", ".join(g["cas"] for g in group if g is not r)
            dup.append((r["cas"], r["name"], others))
    rows = unique
    # The project's list of unreliable species applies on top of the checks above (it was
    # seeded from them); a species the checks flag that the list lacks is reported.
    flagged = {c for c, *_ in check_dropped} | {c for c, *_ in s_dropped} | {
        c for c, *_ in cp_dropped}
    for cas in sorted(flagged - set(unreliable)):
        print(f"make_reference: {cas} is flagged by the checks but not listed in "
              f"{UNRELIABLE_FILE}; add it with its reason", file=sys.stderr)
    listed_dropped = []
    kept = []
    for r in rows:
        props = unreliable.get(r["cas"], ("", set(), ""))[1]
        if "hf" in props:
            listed_dropped.append((r["cas"], r["name"]))
            continue
        if "s" in props:
            r["s298_j"] = ""
        if "cp" in props:
            r["cp298_j"] = ""
        kept.append(r)
    rows = kept
    counts = {}
    for r in rows:
        counts[r["class"]] = counts.get(r["class"], 0) + 1
    n_atct = sum(1 for r in rows if r["hf_source"] == "ATcT 1.112")
    header = [
        "# ringheat reference: measured gas-phase Hf298, S298, Cp298 of neutral closed-shell",
        "#   C/H/O/N/S/F/Cl/Br/I molecules with at least one carbon, for group-additivity validation.",
        "# sources: chemicals package: CRC Handbook table chemicals.heat_capacity.CRC_standard_data",
        "#   (file 'Heat Capacity/CRC Standard Thermodynamic Properties of Chemical Substances.tsv',",
        f"#   columns Hfg J/mol, S0g J/(mol K), Cpg J/(mol K)) and '{ATCT_TABLE}' (Hfg, uncertainty);",
        "#   SMILES from chemicals.identifiers.search_chemical(CAS).smiles. API TDB and TRC",
        "#   values are not used, and WEBBOOK and YAWS only as cross-checks (WebBook matches some",
        "#   CAS numbers to the wrong compound; Yaws carries estimates).",
        f"# unreliable species: {UNRELIABLE_FILE} ({len(unreliable)} listed) is applied after",
        "#   the checks below: a listed Hf298 drops the species, a listed S298 or Cp298 is left empty.",
        *versions_header(),
        "# selection: every CAS with a CRC Hfg or an ATcT 1.112 gas entry (ATcT rows only when the",
        "#   looked-up SMILES matches the ATcT formula); one component, net charge 0, no radical",
        "#   electrons and no isotopes per RDKit; elements C H O N S F Cl Br I only; >= 1 carbon.",
        f"#   Excluded: " + "; ".join(f"{k} {v}" for k, v in sorted(excluded.items())) + ".",
        f"# hf298_kj: ATcT 1.112 where present ({n_atct} rows), else CRC ({len(rows) - n_atct} rows).",
        f"#   Species where CRC and ATcT differ by more than {MAX_SOURCE_DISAGREEMENT_KJ} kJ/mol are",
        f"#   dropped ({len(disagree)}):",
        *[f"#     {c} {n}: ATcT {a:.2f}, CRC {b:.2f} kJ/mol" for c, n, a, b in disagree],
        "#   CRC-only rows where every check column the package has for the species (WEBBOOK,",
        f"#   YAWS; used only as checks) differs from CRC by more than {MAX_CRC_CHECK_DISAGREEMENT_KJ} kJ/mol,",
        f"#   dropped ({len(check_dropped)}):",
        *[
            f"#     {c} {n}: CRC {a:.2f}; "
            + ", ".join(f"{m} {v:.2f}" for m, v in sorted(b.items()))
            + " kJ/mol"
            for c, n, a, b in check_dropped
        ],
        "#   CRC-only rows whose CRC name is not among the identifier table's names for the CAS",
        f"#   number (structure unverified), dropped ({len(unverified)}):",
        *[f"#     {c} {n}: looked-up SMILES {sm}" for c, n, sm in unverified],
        "#   Same structure under two CAS numbers (kept only the formula-checked ATcT row if there",
        f"#   is exactly one), dropped ({len(dup)}):",
        *[f"#     {c} {n}: same structure as {o}" for c, n, o in dup],
        f"# s298_j: CRC S0g, left empty where JANAF or Yaws (chemicals.reaction.S0g) differ by more",
        f"#   than {MAX_S_DISAGREEMENT_J} J/(mol K) ({len(s_dropped)}):",
        *[
            f"#     {c} {n}: CRC {v:.1f}; " + ", ".join(f"{m} {o:.1f}" for m, o in bad)
            for c, n, v, bad in s_dropped
        ],
        f"# cp298_j: CRC Cpg, left empty where the Poling table or the TRC correlation at 298.15 K",
        f"#   differ by more than {MAX_CP_DISAGREEMENT_J} J/(mol K) ({len(cp_dropped)}):",
        *[
            f"#     {c} {n}: CRC {v:.1f}; " + ", ".join(f"{m} {o:.1f}" for m, o in bad)
            for c, n, v, bad in cp_dropped
        ],
        f"# {UNRELIABLE_FILE}: species whose listed Hf298 the checks above did not",
        f"#   drop already, dropped ({len(listed_dropped)})" + (":" if listed_dropped else "."),
        *[f"#     {c} {n}" for c, n in listed_dropped],
        "# class counts: " + ", ".join(f"{k} {v}" for k, v in sorted(counts.items())),
        "# columns:",
        "#   cas; name (ATcT name if ATcT has it, else CRC); smiles (PubChem via chemicals);",
        "#   hf298_kj (kJ/mol, 298.15 K, ideal gas); hf298_unc_kj (ATcT stated uncertainty, kJ/mol;",
        "#   empty for CRC); hf_source (ATcT 1.112 or CRC); s298_j (CRC S0g, J/(mol K), may be",
        "#   empty); cp298_j (CRC Cpg, J/(mol K), may be empty); class (aromatic when RDKit perceives",
        "#   an aromatic atom, else acyclic / monocyclic / polycyclic by cyclomatic number);",
        "#   hetero (1 if any atom other than C/H); elements (present elements, order C H O N S F Cl",
        "#   Br I).",
    ]
    columns = [
        "cas",
        "name",
        "smiles",
        "hf298_kj",
        "hf298_unc_kj",
        "hf_source",
        "s298_j",
        "cp298_j",
        "class",
        "hetero",
        "elements",
    ]
    write_tsv("thermo_reference.tsv", header, columns, rows)
    make_trc_heat_capacity(rows)


# The table temperatures of ringheat's Cp arrays (group-tables/*.toml, cp_temperatures).
CP_TEMPERATURES_K = (300, 400, 500, 600, 800, 1000, 1500)


def make_trc_heat_capacity(thermo_rows):
    """Ideal-gas S298 and Cp(T) from the TRC correlation for the species of thermo_reference.tsv
    whose correlation reaches down to 298.15 K (Cp only at table temperatures inside its range);
    used to give derived table entries an entropy and a heat capacity."""
    import chemicals.heat_capacity as hc

    rows = []
    for r in thermo_rows:
        cas = r["cas"]
        if cas not in hc.TRC_gas_data.index:
            continue
        row = hc.TRC_gas_data.loc[cas]
        if getattr(row, "ndim", 1) > 1:
            row = row.iloc[0]
        tmin, tmax = float(row["Tmin"]), float(row["Tmax"])
        if tmin > 298.15:
            continue
        coeffs = [float(row[f"a{i}"]) for i in range(8)]
        out = {"cas": cas, "name": r["name"], "tmin_k": fmt(tmin, 0), "tmax_k": fmt(tmax, 0)}
        out["s298_j"] = fmt(hc.TRCCp_integral_over_T(298.15, *coeffs, J=float(row["J"])), 3)
        for t in CP_TEMPERATURES_K:
            out[f"cp{t}_j"] = fmt(hc.TRCCp(t, *coeffs), 3) if tmin <= t <= tmax else None
        rows.append(out)
    header = [
        "# ringheat reference: ideal-gas S298 (J/(mol K)) and Cp(T) in J/(mol K) at ringheat's table",
        "#   temperatures, for the species of thermo_reference.tsv whose TRC correlation starts at",
        "#   or below 298 K; a Cp cell is empty where the temperature is outside the correlation.",
        "# source: chemicals package, table chemicals.heat_capacity.TRC_gas_data (TRC ideal-gas",
        "#   heat-capacity coefficients and entropy constant J), evaluated with",
        "#   chemicals.heat_capacity.TRCCp and TRCCp_integral_over_T (S298 = the latter at 298.15 K",
        "#   with J; it reproduces CRC S298 of oxirane, THF and thiophene within 0.5 J/(mol K)).",
        *versions_header(),
        "# columns: cas; name (as in thermo_reference.tsv); tmin_k, tmax_k (range of the",
        "#   correlation); s298_j; cp300_j ... cp1500_j.",
    ]
    columns = ["cas", "name", "tmin_k", "tmax_k", "s298_j"] + [
        f"cp{t}_j" for t in CP_TEMPERATURES_K
    ]
    write_tsv("trc_heat_capacity.tsv", header, columns, rows)


def main(argv):
    what = argv[1] if len(argv) > 1 else "all"
    if what not in ("all", "structures", "spellings", "thermo", "atct"):
        print(__doc__)
        return 2
    pools = None
    if what in ("all", "structures"):
        pools = make_structures()
    if what in ("all", "spellings"):
        make_spellings(pools)
    if what in ("all", "thermo"):
        make_thermo()
    if what in ("all", "atct"):
        make_atct()
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
