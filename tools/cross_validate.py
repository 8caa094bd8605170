#!/usr/bin/env python3
"""10-fold cross-validation of the derived table entries: what the tables do on species no value
was derived from, when every species may have been a source.

The generated tables (group-tables/*-derived.toml) are derived from measured compounds of
tests/reference/thermo_reference.tsv by examples/derive_missing_groups.rs, and those compounds
are then left out of the validation figures. Here the reference species are split into 10
folds (by CAS number, sorted, every tenth); for each fold the derivation is run again without
the fold's species (RINGHEAT_DERIVE_EXCLUDE), the fold is estimated with the published tables
plus those re-derived entries (`ringheat estimate --tables DIR`), and the errors on the fold are
collected. Every species thus gets an estimate from tables that did not see it, except species
a hand-written table value was derived from (their values are not re-derived; they are listed
as left out). Species the held-out tables cannot estimate count as not estimated.

    cargo build --release --bin ringheat --example derive_missing_groups
    python3 tools/cross_validate.py

Standard library only; writes its work files under target/cross-validation/.
"""
import csv
import io
import os
import re
import shutil
import subprocess
import sys
import tomllib
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
TABLES = ROOT / "group-tables"
REFERENCE = ROOT / "tests" / "reference" / "thermo_reference.tsv"
WORK = ROOT / "target" / "cross-validation"
RINGHEAT = ROOT / "target" / "release" / "ringheat"
DERIVE = ROOT / "target" / "release" / "examples" / "derive_missing_groups"
FOLDS = 10
KJ_PER_KCAL = 4.184


def reference():
    rows = [l.rstrip("\n").split("\t") for l in REFERENCE.open() if not l.startswith("#")]
    head = rows[0]
    return [dict(zip(head, r)) for r in rows[1:] if r[head.index("hf298_kj")]]


def hand_derived():
    """CAS numbers a value of a hand-written table (not *-derived.toml) rests on, for Hf298."""
    out = set()
    for f in TABLES.glob("*.toml"):
        if f.name.endswith("-derived.toml"):
            continue
        data = tomllib.loads(f.read_text())
        for kind in ("group", "correction", "ring"):
            for e in data.get(kind, []):
                d = e.get("derived_from")
                for x in d if isinstance(d, list) else ([d] if d else []):
                    if "hf" in x.get("properties", []):
                        out.add(x["cas"])
    return out


def estimate(tables, species):
    smi = "\n".join(f"{r['smiles']} {r['cas']}" for r in species) + "\n"
    run = subprocess.run(
        [str(RINGHEAT), "estimate", "--tables", str(tables), "--format", "csv", "--file", "-"],
        input=smi, capture_output=True, text=True,
    )
    out = {}
    for row in csv.DictReader(io.StringIO(run.stdout)):
        v = row.get("hf298_kj_per_mol", "")
        if v:
            out[row["name"]] = float(v)
    return out


def main():
    species = reference()
    fixed = hand_derived()
    pool = sorted((r for r in species if r["cas"] not in fixed), key=lambda r: r["cas"])
    WORK.mkdir(parents=True, exist_ok=True)
    held_out = {}
    for k in range(FOLDS):
        fold = pool[k::FOLDS]
        d = WORK / f"fold-{k}"
        shutil.rmtree(d, ignore_errors=True)
        d.mkdir(parents=True)
        for f in TABLES.glob("*.toml"):
            if not f.name.endswith("-derived.toml"):
                shutil.copy(f, d / f.name)
        exclude = d / "exclude.txt"
        exclude.write_text("".join(r["cas"] + "\n" for r in fold))
        env = dict(os.environ, RINGHEAT_DERIVE_EXCLUDE=str(exclude), RINGHEAT_DERIVE_OUT=str(d))
        subprocess.run([str(DERIVE)], env=env, check=True, capture_output=True)
        est = estimate(d, fold)
        for r in fold:
            held_out[r["cas"]] = est.get(r["cas"])
        print(f"fold {k}: {len(fold)} species, {sum(1 for r in fold if est.get(r['cas']) is not None)} estimated")
    full = estimate(TABLES, pool)

    def figures(label, pick):
        sel = [r for r in pool if pick(r)]
        cv = [(held_out[r["cas"]] - float(r["hf298_kj"])) / KJ_PER_KCAL for r in sel if held_out[r["cas"]] is not None]
        fu = [(full[r["cas"]] - float(r["hf298_kj"])) / KJ_PER_KCAL for r in sel if r["cas"] in full]
        mae = lambda xs: sum(map(abs, xs)) / len(xs) if xs else float("nan")
        print(f"  {label:<12} 10-fold Hf298 MAE {mae(cv):5.2f} kcal/mol (estimated {len(cv)} of {len(sel)}); "
              f"same species with the shipped tables {mae(fu):5.2f} (n={len(fu)})")

    print(f"species: {len(species)} with Hf298; {len(fixed & {r['cas'] for r in species})} left out "
          f"(a hand-written table value rests on them); {len(pool)} cross-validated")
    hal = lambda r: any(x in r["elements"] for x in ("F", "Cl", "Br", "I"))
    figures("all", lambda r: True)
    figures("C/H/O only", lambda r: set(re.findall(r"[A-Z][a-z]?", r["elements"])) <= {"C", "H", "O"})
    for c in ("acyclic", "monocyclic", "polycyclic", "aromatic"):
        figures(c, lambda r, c=c: r["class"] == c)
    figures("halogenated", hal)
    figures("with N", lambda r: "N" in r["elements"])
    figures("with S", lambda r: "S" in r["elements"].replace("Cl", ""))


if __name__ == "__main__":
    sys.exit(main())
