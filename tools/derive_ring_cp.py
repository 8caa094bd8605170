#!/usr/bin/env python3
"""Derive the Cp(T) arrays of ring corrections from their parent compounds.

For every [[ring]] entry of group-tables/rings-{carbocyclic,heterocyclic,polycyclic}.toml that has
no `cp`, the parent compound (the entry's `derived_from`, else the CAS in PARENTS below) is looked
up in the TRC ideal-gas heat-capacity table of the `chemicals` package (TRC_gas_data, TRCCp), and

    Cp_ring(T) = Cp_parent(T) - sum(count * group Cp(T)) - sum(count * correction Cp(T))

at the seven table temperatures, with the group and correction terms taken from
`ringheat estimate --format json SMILES` on the entry's parent SMILES. The correlation is used
only inside its [Tmin, Tmax]; a 1500 K value beyond Tmax is the parent Cp extrapolated linearly
from the last two in-range table temperatures (and gets a wider unc_cp). An entry is skipped if
the parent has no TRC row, if 300-1000 K is not inside the range, or if a term lacks Cp.

    python3 tools/derive_ring_cp.py            # report only
    python3 tools/derive_ring_cp.py --write    # also insert cp, unc_cp, derived_from, source text

By default only entries that already name `derived_from` are done: for the others (published
hf/s whose parent is still an independent check in tests/thermo_validation.rs) a cp derived from
the parent would need `derived_from`, which takes the parent out of the validation statistics of
hf and s too. `--new-parents` also does those, with the parents of PARENTS.
"""
import json
import re
import subprocess
import sys
import tomllib
from pathlib import Path

import chemicals
from chemicals.heat_capacity import TRC_gas_data, TRCCp
from chemicals.identifiers import search_chemical

ROOT = Path(__file__).resolve().parent.parent
FILES = ["rings-carbocyclic.toml", "rings-heterocyclic.toml", "rings-polycyclic.toml"]
TEMPS = [300, 400, 500, 600, 800, 1000, 1500]
CAL = 4.184
UNC_IN_RANGE = 1.0
UNC_EXTRAPOLATED = 2.0
# Check of the linear extrapolation on ring parents whose TRC correlation reaches 1500 K (the
# 17 of BACKTEST): it overshoots the correlation's own Cp(1500) by this fraction of the
# extrapolated 1000-1500 K rise (range over the 17; see backtest()).
BACKTEST = ["287-92-3", "110-82-7", "291-64-5", "292-64-8", "822-35-5", "142-29-0", "110-83-8",
            "628-92-2", "592-57-4", "119-64-2", "120-92-3", "108-94-1", "75-21-8", "109-99-9",
            "123-91-1", "420-12-2", "110-01-0"]

# Parents of entries that name no derived_from: (name, CAS), checked against the package's
# identifier table (formula) before use.
PARENTS = {
    "cyclononane": ("cyclononane", "293-55-0"),
    "cyclodecane": ("cyclodecane", "293-96-9"),
    "cycloundecane": ("cycloundecane", "294-41-7"),
    "cyclododecane": ("cyclododecane", "294-62-2"),
    "cyclopropene": ("cyclopropene", "2781-85-3"),
    "cyclooctene": ("cis-cyclooctene", "931-87-3"),
    "oxirane": ("oxirane", "75-21-8"),
    "oxetane": ("oxetane", "503-30-0"),
    "aziridine": ("aziridine", "151-56-4"),
    "pyrrolidine": ("pyrrolidine", "123-75-1"),
    "thiirane": ("thiirane", "420-12-2"),
    "thiolane": ("thiolane", "110-01-0"),
    "spiropentane": ("spiropentane", "157-40-4"),
    "bicyclo[3.1.0]hexane": ("bicyclo[3.1.0]hexane", "285-58-5"),
    "bicyclo[4.1.0]heptane": ("bicyclo[4.1.0]heptane", "286-08-8"),
}


def backtest():
    """(lowest, highest) overshoot of the 800/1000 K linear extrapolation at 1500 K, as a
    fraction of the extrapolated rise, and (lowest, highest) in cal/(mol K)."""
    fr, ab = [], []
    for cas in BACKTEST:
        row = TRC_gas_data.loc[cas]
        a = [float(row[f"a{i}"]) for i in range(8)]
        c8, c10, c15 = (TRCCp(t, *a) / CAL for t in (800, 1000, 1500))
        ext = c10 + 2.5 * (c10 - c8)
        fr.append((ext - c15) / (ext - c10))
        ab.append(ext - c15)
    return (min(fr), max(fr)), (min(ab), max(ab))


NEW_PARENTS = "--new-parents" in sys.argv[1:]
# The linear 800/1000 K extrapolation to 1500 K overshoots (see backtest()), so by default an
# entry whose parent's correlation stops short of 1500 K gets no cp; `--extrapolate` allows it.
EXTRAPOLATE = "--extrapolate" in sys.argv[1:]


def fmt(x):
    return f"{x:.2f}".replace("-0.00", "0.00")


def estimate(smiles):
    out = subprocess.run(
        ["cargo", "run", "--release", "-q", "--", "estimate", "--format", "json", smiles],
        cwd=ROOT, check=True, capture_output=True, text=True).stdout
    return json.loads(out)[0]


def derive(entry):
    """Return (result dict) or (None, reason)."""
    name = entry["name"]
    if "derived_from" in entry:
        pname, cas = [p.strip() for p in entry["derived_from"].rsplit(",", 1)]
    elif name in PARENTS and NEW_PARENTS:
        pname, cas = PARENTS[name]
    else:
        if name in PARENTS and PARENTS[name][1] not in TRC_gas_data.index:
            return None, f"no TRC row for {PARENTS[name][0]} ({PARENTS[name][1]})"
        return None, ("no parent named" if name not in PARENTS else
                      f"its parent {PARENTS[name][0]} is an independent check of the published "
                      f"hf/s (no derived_from yet); pass --new-parents to derive cp from it anyway")
    if cas not in TRC_gas_data.index:
        return None, f"no TRC row for {pname} ({cas})"
    row = TRC_gas_data.loc[cas]
    tmin, tmax = float(row.Tmin), float(row.Tmax)
    inside = [t for t in TEMPS if tmin <= t <= tmax]
    if inside[:6] != TEMPS[:6]:
        return None, f"TRC range {tmin:g}-{tmax:g} K does not cover 300-1000 K"
    rec = estimate(entry["smiles"])
    try:
        ident = search_chemical(cas)
        if ident.formula != rec["formula"]:
            return None, f"formula {rec['formula']} != {ident.formula} of {cas}"
    except Exception:
        pass  # the identifier table lacks it; the TRC row was found by CAS
    terms = rec["estimate"]["terms"]
    rings = [t for t in terms if t["kind"] == "Ring"]
    if len(rings) != 1 or rings[0]["label"] != name or rings[0]["count"] != 1:
        return None, f"ring terms of the parent are {[(t['label'], t['count']) for t in rings]}"
    coeffs = [float(row[f"a{i}"]) for i in range(8)]
    parent = {t: TRCCp(t, *coeffs) for t in inside}
    extrapolated = 1500 not in parent
    if extrapolated and not EXTRAPOLATE:
        return None, f"TRC correlation ends at {tmax:g} K, before 1500 K (pass --extrapolate)"
    if extrapolated:
        t1, t2 = inside[-2], inside[-1]
        parent[1500] = parent[t2] + (parent[t2] - parent[t1]) * (1500 - t2) / (t2 - t1)
    total = [0.0] * 7
    labels = []
    for t in terms:
        if t["kind"] not in ("Group", "Correction"):
            continue
        cp = t["per_unit"]["cp_j"]
        if any(v is None for v in cp):
            return None, f"term {t['label']} has no Cp"
        for i in range(7):
            total[i] += t["count"] * cp[i]
        labels.append(f"{t['count']} {t['label']}" if t["count"] != 1 else t["label"])
    other = [t["kind"] for t in terms if t["kind"] not in ("Group", "Correction", "Ring")]
    ring = [(parent[T] - total[i]) / CAL for i, T in enumerate(TEMPS)]
    return {
        "pname": pname, "cas": cas, "tmin": tmin, "tmax": tmax, "extrapolated": extrapolated,
        "last_two": inside[-2:], "ring": ring, "labels": labels, "other_kinds": other,
        "parent_cal": [parent[T] / CAL for T in TEMPS], "groups_cal": [v / CAL for v in total],
        "unc": UNC_EXTRAPOLATED if extrapolated else UNC_IN_RANGE,
    }, None


def source_text(r):
    s = (f"cp derived: TRC ideal-gas Cp(T) of {r['pname']} (CAS {r['cas']}; TRC ideal-gas "
         f"heat-capacity coefficients via the chemicals package (version {chemicals.__version__}), "
         f"table TRC_gas_data, function TRCCp, valid {r['tmin']:g}-{r['tmax']:g} K) minus ringheat's "
         f"group Cp sum ({' + '.join(r['labels'])}; per-term cp_j of `ringheat estimate --format json`)"
         f" at 300-1500 K (tools/derive_ring_cp.py)")
    if r["extrapolated"]:
        a, b = r["last_two"]
        s += (f"; the correlation ends at {r['tmax']:g} K, so the parent Cp at 1500 K was "
              f"extrapolated linearly from its {a} and {b} K values, hence unc_cp "
              f"{UNC_EXTRAPOLATED} instead of {UNC_IN_RANGE}")
    s += f"; unc_cp is a judgement of this file's author"
    return s


def write(path, name, r, has_derived):
    lines = path.read_text().split("\n")
    start = next(i for i, l in enumerate(lines) if l == f'name = "{name}"')
    end = start + 1
    while end < len(lines) and lines[end].strip() and not lines[end].startswith("[["):
        end += 1
    block = lines[start:end]
    cp_line = "cp = [" + ", ".join(fmt(v) for v in r["ring"]) + "]"
    anchor = max(i for i, l in enumerate(block) if l.startswith(("hf = ", "s = ")))
    block.insert(anchor + 1, cp_line)
    last_unc = max(i for i, l in enumerate(block) if l.startswith("unc_"))
    block.insert(last_unc + 1, f"unc_cp = {r['unc']}")
    si = next(i for i, l in enumerate(block) if l.startswith("source = "))
    assert block[si].endswith('"')
    block[si] = block[si][:-1] + "; " + source_text(r) + '"'
    if not has_derived:
        block.insert(si + 1, f'derived_from = "{r["pname"]}, {r["cas"]}"')
    ni = next((i for i, l in enumerate(block) if l.startswith("note = ")), None)
    if ni is not None:
        note = re.sub(r'(?:[.;] )?cp (?:not recalled|left out).*"$', '"', block[ni])
        note = note.replace("hf only", "hf and cp only")
        if not note.endswith('."'):
            note = note[:-1] + '."'
    else:
        note = 'note = ""'
    if r["extrapolated"]:
        (f1, f2), (a1, a2) = backtest()
        rise = r["parent_cal"][6] - r["parent_cal"][5]
        add = (f"The 1500 K cp rests on the linear extrapolation of the parent Cp: on {len(BACKTEST)} "
               f"ring compounds whose TRC correlation reaches 1500 K the same extrapolation came out "
               f"{a1:.1f}-{a2:.1f} cal/(mol K) ({f1:.2f}-{f2:.2f} of the extrapolated 1000-1500 K rise) "
               f"above the correlation, so this 1500 K value is probably too high by about "
               f"{f1 * rise:.0f}-{f2 * rise:.0f} cal/(mol K), more than unc_cp says; the 300-1000 K values "
               f"are inside the TRC range.")
        note = note[:-1] + (" " if note != 'note = ""' else "") + add + '"'
    if ni is not None:
        block[ni] = note
    else:
        block.append(note)
    lines[start:end] = block
    path.write_text("\n".join(lines))


def main():
    do_write = "--write" in sys.argv[1:]
    for fname in FILES:
        path = ROOT / "group-tables" / fname
        data = tomllib.loads(path.read_text())
        for e in data.get("ring", []):
            if "cp" in e:
                continue
            r, why = derive(e)
            if r is None:
                print(f"{fname}: {e['name']}: skipped: {why}")
                continue
            extra = f" (other term kinds: {r['other_kinds']})" if r["other_kinds"] else ""
            print(f"{fname}: {e['name']}: parent {r['pname']} {r['cas']} TRC {r['tmin']:g}-"
                  f"{r['tmax']:g} K{' EXTRAPOLATED 1500' if r['extrapolated'] else ''}{extra}")
            print("   parent  " + " ".join(f"{v:7.2f}" for v in r["parent_cal"]))
            print("   groups  " + " ".join(f"{v:7.2f}" for v in r["groups_cal"]))
            print("   ring    " + " ".join(f"{v:7.2f}" for v in r["ring"]))
            if do_write:
                write(path, e["name"], r, "derived_from" in e)


if __name__ == "__main__":
    main()
