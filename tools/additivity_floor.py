#!/usr/bin/env python3
"""How low can the Hf298 error of group additivity go on the validation set?

Diagnostic only: nothing it computes goes into the tables (group values come from published
tables or from one measured compound each, never from a fit to the test references).

It reads the per-species file that `cargo test --release --test thermo_validation` writes
(target/tmp/thermo_validation.tsv: CAS, name, class, error, SMILES, estimate, measured, terms,
flags) and refits, by least absolute deviations, a shift of every term (group, correction, ring entry) to
the errors of the estimated species. The mean absolute error left after that fit is a floor for
any set of values of the same terms: published values cannot beat a fit made to the data
itself. A 10-fold cross-validation of the same refit (fit on nine tenths, error on the tenth left
out) shows what refitted values would do on species they were not fitted to. Both are run for
the C/H/O species and for all species.

    cargo test --release --test thermo_validation
    python3 tools/additivity_floor.py
"""
import re
import sys
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parent.parent
DUMP = ROOT / "target" / "tmp" / "thermo_validation.tsv"
REFERENCE = ROOT / "tests" / "reference" / "thermo_reference.tsv"
TERM = re.compile(r"(\d+)x(.+?)(?= \d+x|$)")


def elements_by_cas():
    rows = [l.rstrip("\n").split("\t") for l in REFERENCE.open() if not l.startswith("#")]
    header = rows[0]
    c_cas, c_el = header.index("cas"), header.index("elements")
    return {r[c_cas]: set(re.findall(r"[A-Z][a-z]?", r[c_el])) for r in rows[1:]}


def read_dump():
    out = []
    for line in DUMP.open():
        c = line.rstrip("\n").split("\t")
        if c[0] == "-" or len(c) < 8:
            continue
        counts = {}
        for n, label in TERM.findall(c[7]):
            counts[label] = counts.get(label, 0) + int(n)
        out.append((c[0], c[1], float(c[3]), counts))
    return out


def least_absolute_shifts(x, y, rounds=200):
    """Term shifts minimising the sum of absolute errors (iteratively reweighted least squares)."""
    w = np.ones_like(y)
    shift = np.zeros(x.shape[1])
    for _ in range(rounds):
        sw = np.sqrt(w)
        shift, *_ = np.linalg.lstsq(x * sw[:, None], y * sw, rcond=None)
        w = 1.0 / np.maximum(np.abs(y - x @ shift), 1e-3)
    return shift


def floor(species, folds=10):
    labels = sorted({k for _, _, _, t in species for k in t})
    x = np.array([[t.get(k, 0) for k in labels] for _, _, _, t in species], dtype=float)
    y = np.array([e for _, _, e, _ in species])
    left = y - x @ least_absolute_shifts(x, y)
    order = np.random.default_rng(1).permutation(len(y))
    held_out = np.zeros(len(y))
    for part in np.array_split(order, folds):
        train = np.setdiff1d(order, part)
        held_out[part] = y[part] - x[part] @ least_absolute_shifts(x[train], y[train])
    return (
        len(species),
        len(labels),
        float(np.abs(y).mean()),
        float(np.abs(left).mean()),
        float(np.abs(held_out).mean()),
    )


def main():
    if not DUMP.exists():
        print(f"{DUMP} is missing: run `cargo test --release --test thermo_validation` first")
        return 1
    elements = elements_by_cas()
    species = read_dump()
    cho = [s for s in species if elements.get(s[0], {"?"}) <= {"C", "H", "O"}]
    for what, subset in (("C/H/O", cho), ("all", species)):
        n, p, now, left, held_out = floor(subset)
        print(
            f"{what:6} species {n:4}, terms {p:4}: Hf298 MAE {now:.2f} kcal/mol with the tables; "
            f"refitted to these data {left:.2f} (the floor); refitted, on species left out of "
            f"the fit {held_out:.2f}"
        )
    return 0


if __name__ == "__main__":
    sys.exit(main())
