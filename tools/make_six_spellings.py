#!/usr/bin/env python3
"""Writes tests/reference/six_spellings.tsv: PubChem molecules, each in six SMILES spellings.

The spelling-invariance test (tests/spelling_invariance.rs) estimates every spelling of a row
and asserts that Hf298, S298 and Cp298 agree to the printed precision; `ringheat` is not run
here. The six spellings of a row are
  1. the SMILES exactly as the PubChem identifier table of the `chemicals` package gives it,
  2. RDKit's canonical SMILES (Chem.MolToSmiles, isomeric),
  3-4. two random atom orders, aromatic (lower-case) form: Chem.MolToSmiles(mol,
     doRandom=True),
  5-6. two random atom orders, Kekule form: Chem.MolToSmiles(mol, doRandom=True,
     kekuleSmiles=True) after Chem.Kekulize(mol, clearAromaticFlags=True).
RDKit's random generator is seeded per row (rdBase.SeedRandomNumberGenerator) with a seed drawn
from random.Random(SEED), so a rerun with the same package versions gives the same file.

Usage: python3 tools/make_six_spellings.py [--count N] [--out PATH]
Needs: pip install rdkit chemicals (versions are written into the file header).
"""

import argparse
import datetime
import os
import random
import sys

import chemicals
import rdkit
from rdkit import Chem, RDLogger, rdBase

RDLogger.DisableLog("rdApp.*")

REPO = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
CHEM_DIR = os.path.dirname(chemicals.__file__)
PUBCHEM_TABLE = os.path.join("Identifiers", "chemical identifiers pubchem large.tsv")
SEED = 20261202
DEFAULT_COUNT = 6000
# Elements the group tables can type at all; other rows would only test the error path.
ELEMENTS = {"C", "H", "O", "N", "S", "P", "F", "Cl", "Br", "I", "Si", "B"}
MIN_HEAVY, MAX_HEAVY = 3, 60


def read_pubchem_table():
    """(cid, smiles) of every row of the identifier table; columns are positional."""
    rows = []
    with open(os.path.join(CHEM_DIR, PUBCHEM_TABLE), encoding="utf-8") as f:
        for line in f:
            parts = line.rstrip("\n").split("\t")
            if len(parts) >= 5 and parts[4]:
                rows.append((parts[0], parts[4]))
    return rows


def eligible(smiles, mol):
    if mol is None or "." in smiles:
        return False
    if not MIN_HEAVY <= mol.GetNumHeavyAtoms() <= MAX_HEAVY:
        return False
    atoms = mol.GetAtoms()
    if any(a.GetSymbol() not in ELEMENTS for a in atoms):
        return False
    if any(a.GetIsotope() != 0 for a in atoms):
        return False
    return mol.GetRingInfo().NumRings() > 0 or any(
        b.GetBondTypeAsDouble() > 1 for b in mol.GetBonds()
    ) or mol.GetNumHeavyAtoms() >= 4


def spellings(mol, seed):
    """Canonical, two aromatic random and two Kekule random spellings."""
    canonical = Chem.MolToSmiles(mol)
    rdBase.SeedRandomNumberGenerator(seed)
    aromatic = [Chem.MolToSmiles(mol, doRandom=True) for _ in range(2)]
    kek = Chem.Mol(mol)
    Chem.Kekulize(kek, clearAromaticFlags=True)
    kekule = [Chem.MolToSmiles(kek, doRandom=True, kekuleSmiles=True) for _ in range(2)]
    return [canonical] + aromatic + kekule


def round_trips(spelled, canonical):
    for s in spelled:
        m = Chem.MolFromSmiles(s)
        if m is None or Chem.MolToSmiles(m) != canonical:
            return False
    return True


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--count", type=int, default=DEFAULT_COUNT)
    ap.add_argument("--out", default=os.path.join(REPO, "tests", "reference", "six_spellings.tsv"))
    args = ap.parse_args()
    table = read_pubchem_table()
    pool = []
    for cid, smiles in table:
        mol = Chem.MolFromSmiles(smiles)
        if eligible(smiles, mol):
            pool.append((cid, smiles, mol))
    rng = random.Random(SEED)
    rng.shuffle(pool)
    rows, skipped, seen = [], 0, set()
    for cid, smiles, mol in pool:
        if len(rows) >= args.count:
            break
        spelled = spellings(mol, rng.randrange(1, 2**31))
        if spelled[0] in seen:
            continue
        if not round_trips([smiles] + spelled, spelled[0]):
            skipped += 1
            continue
        seen.add(spelled[0])
        rows.append((int(cid), [smiles] + spelled))
    rows.sort()
    with open(args.out, "w", encoding="utf-8", newline="") as f:
        f.write(
            "# ringheat reference: PubChem molecules in six SMILES spellings each "
            "(spelling-invariance test).\n"
            f"# source: chemicals package, file '{PUBCHEM_TABLE}' (PubChem identifier table;"
            " column 1 = CID, column 5 = SMILES).\n"
            f"# packages: chemicals {chemicals.__version__}, rdkit {rdkit.__version__}, "
            f"python {sys.version.split()[0]}\n"
            f"# generated: {datetime.date.today().isoformat()} by tools/make_six_spellings.py "
            f"(seed {SEED}; regenerate with `python3 tools/make_six_spellings.py`)\n"
            f"# selection: single-component rows RDKit parses, {MIN_HEAVY}-{MAX_HEAVY} heavy "
            f"atoms, elements {' '.join(sorted(ELEMENTS))}, no isotopes; shuffled with "
            f"random.Random({SEED}); distinct by RDKit canonical SMILES; {len(pool)} eligible,"
            f" {len(rows)} taken, {skipped} skipped (a spelling did not round-trip in RDKit).\n"
            "# columns: pubchem_cid, as_given (table SMILES), rdkit_canonical, random_1 and"
            " random_2 (MolToSmiles(doRandom=True)), kekule_1 and kekule_2"
            " (MolToSmiles(doRandom=True, kekuleSmiles=True) after Kekulize).\n"
        )
        f.write("pubchem_cid\tas_given\trdkit_canonical\trandom_1\trandom_2\tkekule_1\tkekule_2\n")
        for cid, spelled in rows:
            f.write("\t".join([str(cid)] + spelled) + "\n")
    print(f"wrote {args.out}: {len(rows)} rows ({skipped} skipped)")
    return 0


if __name__ == "__main__":
    sys.exit(main())
