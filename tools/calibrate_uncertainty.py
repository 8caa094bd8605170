#!/usr/bin/env python3
"""Calibrates the method uncertainty of group additivity per term family (src/thermo/uncertainty.rs).

The reported uncertainty of an estimate is u^2 = u_tables^2 + sum over terms of count x sigma_f^2,
where u_tables combines the tables' own uncertainties and sigma_f is the scatter that one term of
family f (alkyl, unsaturated, aromatic, oxygen, nitrogen, sulfur, halogen-bearing groups, non-ring
corrections, ring corrections, stand-ins) adds. sigma_f^2 is fitted, by non-negative least squares,
to the squared errors of the validation species (those no table value was derived from):

    error_i^2 - u_tables,i^2 - u_reference,i^2  ~  sum_f N_if sigma_f^2

with each squared error capped at (4 sigma_typical)^2 so that a few reference outliers do not set
the scale (our choice). Coverage (fraction within 1 and 2 reported uncertainties) is reported
twice: in-sample, and cross-fitted (sigma_f fitted on one half of the species, coverage counted
on the other half, both ways), which is the honest figure.

    cargo test --release --test thermo_validation      # writes target/tmp/uncertainty_terms.tsv
    python3 tools/calibrate_uncertainty.py             # prints sigma_f and the coverages

Standard library only. The printed sigma_f are what src/thermo/uncertainty.rs carries.
"""
import math
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
DUMP = ROOT / "target" / "tmp" / "uncertainty_terms.tsv"
# Cap of a squared error, in units of the typical error of the property (our choice).
CAP = {"hf": (4.0 * 6.0) ** 2, "s": (4.0 * 6.0) ** 2}


def read(path):
    rows = []
    for line in path.open():
        c = line.rstrip("\n").split("\t")
        if c[0] == "cas":
            continue
        counts = {}
        for part in c[5].split():
            f, n = part.rsplit(":", 1)
            counts[f] = counts.get(f, 0) + int(n)
        rows.append((c[0], c[1], float(c[2]), float(c[3]), float(c[4]), counts))
    return rows


def nnls(x, y, rounds=4000):
    """Non-negative least squares by cyclic coordinate descent (small problems)."""
    m = len(x[0]) if x else 0
    beta = [0.0] * m
    r = list(y)
    norms = [sum(row[j] ** 2 for row in x) for j in range(m)]
    for _ in range(rounds):
        change = 0.0
        for j in range(m):
            if norms[j] == 0:
                continue
            g = sum(x[i][j] * r[i] for i in range(len(x)))
            new = max(0.0, beta[j] + g / norms[j])
            d = new - beta[j]
            if d:
                for i in range(len(x)):
                    r[i] -= d * x[i][j]
                beta[j] = new
                change = max(change, abs(d))
        if change < 1e-10:
            break
    return beta


def fit(rows, prop, families):
    sel = [r for r in rows if r[1] == prop]
    x = [[r[5].get(f, 0) for f in families] for r in sel]
    y = [min(r[2] ** 2, CAP[prop]) - r[3] ** 2 - r[4] ** 2 for r in sel]
    return dict(zip(families, nnls(x, y)))


def coverage(rows, prop, var):
    z = []
    for r in rows:
        if r[1] != prop:
            continue
        u2 = r[3] ** 2 + r[4] ** 2 + sum(n * var.get(f, 0.0) for f, n in r[5].items())
        z.append(abs(r[2]) / math.sqrt(u2) if u2 > 0 else float("inf"))
    n = max(len(z), 1)
    return sum(v <= 1 for v in z) / n, sum(v <= 2 for v in z) / n, len(z)


def main():
    path = Path(sys.argv[1]) if len(sys.argv) > 1 else DUMP
    rows = read(path)
    families = sorted({f for r in rows for f in r[5]})
    for prop, unit in (("hf", "kJ/mol"), ("s", "J/(mol K)")):
        var = fit(rows, prop, families)
        print(f"{prop}: sigma per occurrence ({unit}):")
        for f in families:
            print(f"  {f:<16} {math.sqrt(var[f]):6.2f}")
        one, two, n = coverage(rows, prop, {})
        print(f"  tables only:   {100*one:.0f} % within 1 u, {100*two:.0f} % within 2 u (n={n})")
        one, two, n = coverage(rows, prop, var)
        print(f"  in-sample:     {100*one:.0f} % within 1 u, {100*two:.0f} % within 2 u (n={n})")
        halves = [rows[0::2], rows[1::2]]
        hits1 = hits2 = total = 0
        for a, b in ((0, 1), (1, 0)):
            v = fit(halves[a], prop, families)
            one, two, n = coverage(halves[b], prop, v)
            hits1 += one * n
            hits2 += two * n
            total += n
        print(f"  cross-fitted:  {100*hits1/total:.0f} % within 1 u, {100*hits2/total:.0f} % within 2 u (n={total})")


if __name__ == "__main__":
    main()
