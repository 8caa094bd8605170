#!/usr/bin/env python3
"""Derive the Cp(T) arrays (and missing S298) of ring corrections from their parent compounds.

For every [[ring]] entry of group-tables/rings-{carbocyclic,heterocyclic,polycyclic}.toml that has
no `cp`, the parent compound (the entry's `derived_from`, else the CAS in PARENTS below) is looked
up in the TRC ideal-gas heat-capacity table of the `chemicals` package (TRC_gas_data, TRCCp), and

    Cp_ring(T) = Cp_parent(T) - sum(count * group Cp(T)) - sum(count * correction Cp(T))

at the seven table temperatures, with the group and correction terms taken from
`ringheat estimate --format json SMILES` on the entry's parent SMILES. The correlation is used
only inside its [Tmin, Tmax]. Where it ends at 1000 K, the ring correction (not the parent Cp,
which bends more) is extrapolated linearly from its 800 and 1000 K values to 1500 K; the same
extrapolation on the ring entries whose parents' correlations reach 1500 K (backtest()) sets the
wider unc_cp of such entries. An entry is skipped if the parent has no TRC row, if 300-1000 K is
not inside the range, or if a term lacks Cp.

An entry without `s` gets one the same way from the parent's TRC S298 (coefficients and entropy
constant J), minus the groups' S and R ln(n/sigma) with the tool's own symmetry numbers, so the
value follows the flat-graph convention and the entry loses `parent_symmetry`; `s` is added to
the parent's `properties` in `derived_from` (tools/provenance.py).

The same goes for `cp`: the parent's `derived_from` table lists it, and the parent stays an
independent check of any property not listed (for an entry whose published hf and s are Benson's,
the validation test leaves the parent out of the Cp statistics only).

    python3 tools/derive_ring_cp.py            # report only
    python3 tools/derive_ring_cp.py --write    # also insert cp, unc_cp, derived_from, source text
"""
import json
import math
import re
import subprocess
import sys
import tomllib
from pathlib import Path

import chemicals
from chemicals.heat_capacity import TRC_gas_data, TRCCp, TRCCp_integral_over_T
from chemicals.identifiers import search_chemical

sys.path.insert(0, str(Path(__file__).resolve().parent))
import provenance  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
FILES = ["rings-carbocyclic.toml", "rings-heterocyclic.toml", "rings-polycyclic.toml"]
TEMPS = [300, 400, 500, 600, 800, 1000, 1500]
CAL = 4.184
UNC_IN_RANGE = 1.0
UNC_EXTRAPOLATED = 2.0
# Parents of entries whose derived_from names no compound for hf: (name, CAS), checked against the package's
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
    "pyridine": ("pyridine", "110-86-1"),
    "thiirane": ("thiirane", "420-12-2"),
    "thiolane": ("thiolane", "110-01-0"),
    "spiropentane": ("spiropentane", "157-40-4"),
    "bicyclo[3.1.0]hexane": ("bicyclo[3.1.0]hexane", "285-58-5"),
    "bicyclo[4.1.0]heptane": ("bicyclo[4.1.0]heptane", "286-08-8"),
}


_BACKTEST = []


def backtest():
    """Errors (cal/(mol K)) of the 800/1000 K linear extrapolation of a ring correction to
    1500 K, over the ring entries whose cp came from a TRC correlation that reaches 1500 K.
    Taken once, from the tables as they were when the run started."""
    if _BACKTEST:
        return _BACKTEST
    errors = []
    for fname in FILES + ["rings-derived.toml"]:
        data = tomllib.loads((ROOT / "group-tables" / fname).read_text())
        per_cal = 1.0 if data["meta"].get("entropy_unit", "").startswith("cal") else 1.0 / CAL
        for e in data.get("ring", []):
            src = e["source"]
            from_trc = "cp derived: TRC" in src or "Cp(T) at 300-1500 K (TRC" in src
            if "cp" not in e or not from_trc or "extrapolated" in src:
                continue
            c = [v * per_cal for v in e["cp"]]
            errors.append((c[5] + 2.5 * (c[5] - c[4])) - c[6])
    _BACKTEST.extend(errors)
    return errors




def fmt(x):
    return f"{x:.2f}".replace("-0.00", "0.00")


def estimate(smiles):
    out = subprocess.run(
        ["cargo", "run", "--release", "-q", "--", "estimate", "--format", "json", smiles],
        cwd=ROOT, check=True, capture_output=True, text=True).stdout
    return json.loads(out)[0]


def parent_trc_row(entry):
    """((parent name, CAS, TRC row), None) for a ring entry, or (None, reason)."""
    name = entry["name"]
    hf_parents = [d for d in provenance.read(entry) if "hf" in d.properties]
    if hf_parents:
        pname, cas = hf_parents[0].name, hf_parents[0].cas
    elif name in PARENTS:
        pname, cas = PARENTS[name]
    else:
        return None, "no parent named"
    if cas not in TRC_gas_data.index:
        return None, f"no TRC row for {pname} ({cas})"
    return (pname, cas, TRC_gas_data.loc[cas]), None


def derive(entry):
    """Return (result dict) or (None, reason)."""
    name = entry["name"]
    found, why = parent_trc_row(entry)
    if found is None:
        return None, why
    pname, cas, row = found
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
    ring = [(parent[T] - total[i]) / CAL for i, T in enumerate(TEMPS) if T in parent]
    if extrapolated:
        ring.append(ring[5] + (ring[5] - ring[4]) * (1500 - 1000) / (1000 - 800))
        parent[1500] = float("nan")
    return {
        "pname": pname, "cas": cas, "tmin": tmin, "tmax": tmax, "extrapolated": extrapolated,
        "last_two": inside[-2:], "ring": ring, "labels": labels, "other_kinds": other,
        "parent_cal": [parent[T] / CAL for T in TEMPS], "groups_cal": [v / CAL for v in total],
        "unc": extrapolated_unc(ring) if extrapolated else UNC_IN_RANGE,
    }, None


def extrapolated_unc(ring):
    """unc_cp (cal/(mol K)) of an entry whose 1500 K value `ring[6]` was extrapolated: the
    largest backtest error, at least UNC_EXTRAPOLATED, and at least half the extrapolated
    1000-1500 K change (a steep extrapolation is less sure than the backtest's), rounded up to
    0.1."""
    worst = max(abs(e) for e in backtest())
    half_rise = 0.5 * abs(ring[6] - ring[5])
    return max(UNC_EXTRAPOLATED, math.ceil(max(worst, half_rise) * 10) / 10)


BACKTEST_TEXT = re.compile(
    r"\(on \d+ ring entries whose parents' correlations reach 1500 K the same extrapolation "
    r"was off by [-+0-9.]+ to [-+0-9.]+ cal/\(mol K\)\), hence unc_cp [0-9.]+ instead of"
)


def backtest_text(unc):
    errors = backtest()
    return (f"(on {len(errors)} ring entries whose parents' correlations reach 1500 K the same "
            f"extrapolation was off by {min(errors):+.2f} to {max(errors):+.2f} cal/(mol K)), "
            f"hence unc_cp {unc} instead of")


def entry_span(lines, name):
    """(first, past-the-end) line index of the [[ring]] entry named `name` (from its name line
    to the next blank line or table header)."""
    start = next(i for i, l in enumerate(lines) if l == f'name = "{name}"')
    end = start + 1
    while end < len(lines) and lines[end].strip() and not lines[end].startswith("[["):
        end += 1
    return start, end


def entries_lacking(field):
    """(file name, path, entry) for every ring entry of FILES without `field`."""
    for fname in FILES:
        path = ROOT / "group-tables" / fname
        for e in tomllib.loads(path.read_text()).get("ring", []):
            if field not in e:
                yield fname, path, e


def refresh_extrapolated(path):
    """Brings unc_cp and the backtest figures of entries with an extrapolated 1500 K cp up to
    date (the rule or the backtest set may have changed since they were written)."""
    text = path.read_text()
    data = tomllib.loads(text)
    lines = text.split("\n")
    for e in data.get("ring", []):
        if "cp" not in e or not BACKTEST_TEXT.search(e["source"]):
            continue
        unc = extrapolated_unc(e["cp"])
        start, end = entry_span(lines, e["name"])
        for i in range(start, end):
            if lines[i].startswith("unc_cp = "):
                lines[i] = f"unc_cp = {unc}"
            elif lines[i].startswith("source = "):
                lines[i] = BACKTEST_TEXT.sub(backtest_text(unc), lines[i])
    path.write_text("\n".join(lines))


R_GAS = 8.314462618
UNC_S = 1.0  # cal/(mol K), judgement of this file's author


def derive_entropy(entry):
    """(result dict, None) with the ring entropy from the parent's TRC S298, or (None, reason)."""
    name = entry["name"]
    found, why = parent_trc_row(entry)
    if found is None:
        return None, why
    pname, cas, row = found
    if float(row.Tmin) > 298.15:
        return None, f"TRC range starts at {float(row.Tmin):g} K, above 298.15 K"
    coeffs = [float(row[f"a{i}"]) for i in range(8)]
    s_parent = TRCCp_integral_over_T(298.15, *coeffs, J=float(row.J))
    rec = estimate(entry["smiles"])
    est = rec["estimate"]
    terms = est["terms"]
    rings = [t for t in terms if t["kind"] == "Ring"]
    if len(rings) != 1 or rings[0]["label"] != name or rings[0]["count"] != 1:
        return None, f"ring terms of the parent are {[(t['label'], t['count']) for t in rings]}"
    total, labels = 0.0, []
    for t in terms:
        if t["kind"] not in ("Group", "Correction"):
            continue
        if not t["per_unit"]["known"]["s"]:
            return None, f"term {t['label']} has no S"
        total += t["count"] * t["per_unit"]["s_j"]
        labels.append(f"{t['count']} {t['label']}" if t["count"] != 1 else t["label"])
    sym = est["symmetry"]
    symmetry_term = R_GAS * (math.log(sym["optical_isomers"]) - math.log(sym["total"]))
    ring = (s_parent - total - symmetry_term) / CAL
    return {
        "pname": pname, "cas": cas, "s_parent": s_parent, "ring": ring, "labels": labels,
        "sigma": sym["total"], "optical": sym["optical_isomers"],
        "range": (float(row.Tmin), float(row.Tmax)),
    }, None


def add_derived(block, source_index, r, prop):
    """Lists `prop` for the parent in the block's derived_from line (inserted after the source
    line when the entry has none)."""
    di = next((i for i, l in enumerate(block) if l.startswith("derived_from = ")), None)
    old = provenance.read(tomllib.loads(block[di])) if di is not None else []
    line = "derived_from = " + provenance.toml_value(
        provenance.merged(old, r["cas"], r["pname"], [prop]))
    if di is None:
        block.insert(source_index + 1, line)
    else:
        block[di] = line


def write_entropy(path, name, r):
    """Insert s, unc_s, the parent's provenance and the source text; the value follows the tool's
    flat-graph symmetry convention, so a `parent_symmetry` line is removed."""
    lines = path.read_text().split("\n")
    start, end = entry_span(lines, name)
    block = [l for l in lines[start:end] if not l.startswith("parent_symmetry = ")]
    hi = next(i for i, l in enumerate(block) if l.startswith("hf = "))
    block.insert(hi + 1, f"s = {fmt(r['ring'])}")
    ui = next(i for i, l in enumerate(block) if l.startswith("unc_hf = "))
    block.insert(ui + 1, f"unc_s = {UNC_S}")
    si = next(i for i, l in enumerate(block) if l.startswith("source = "))
    text = (f"s derived: TRC ideal-gas S298 of {r['pname']} (CAS {r['cas']}; {r['s_parent']:.2f} "
            f"J/(mol K) from the TRC coefficients and entropy constant J via the chemicals package "
            f"(version {chemicals.__version__}), table TRC_gas_data, function "
            f"TRCCp_integral_over_T) minus ringheat's group S sum ({' + '.join(r['labels'])}) and "
            f"R ln(n/sigma) with the tool's flat-graph sigma {r['sigma']} and {r['optical']} "
            f"optical isomer(s) (tools/derive_ring_cp.py); unc_s is a judgement of this file's "
            f"author")
    block[si] = block[si][:-1] + "; " + text + '"'
    add_derived(block, si, r, "s")
    ni = next((i for i, l in enumerate(block) if l.startswith("note = ")), None)
    if ni is not None:
        block[ni] = entropy_note(block[ni])
    lines[start:end] = block
    path.write_text("\n".join(lines))


def entropy_note(line):
    """A ring entry's note once it has a derived s: no longer "hf and cp only", and the symmetry
    remark says which convention s follows; stand-in cautions cover s too."""
    line = re.sub(r"sigma = \d+ \(real point-group symmetry number of the parent, Benson's "
                  r"convention\)\.", "s follows the tool's flat-graph symmetry convention "
                  r"(derived; no parent_symmetry).", line)
    line = line.replace(" hf and cp only.", "").replace("hf and cp only. ", "")
    line = line.replace("shift this ring value by", "shift this ring's hf by")
    line = re.sub(r"(shift this ring's hf by [^;)]*\))", r"\1 and rederive s", line)
    return line


def source_text(r):
    s = (f"cp derived: TRC ideal-gas Cp(T) of {r['pname']} (CAS {r['cas']}; TRC ideal-gas "
         f"heat-capacity coefficients via the chemicals package (version {chemicals.__version__}), "
         f"table TRC_gas_data, function TRCCp, valid {r['tmin']:g}-{r['tmax']:g} K) minus ringheat's "
         f"group Cp sum ({' + '.join(r['labels'])}; per-term cp_j of `ringheat estimate --format json`)"
         f" at 300-1500 K (tools/derive_ring_cp.py)")
    if r["extrapolated"]:
        s += (f"; the correlation ends at {r['tmax']:g} K, so the ring correction at 1500 K was "
              f"extrapolated linearly from its 800 and 1000 K values {backtest_text(r['unc'])} "
              f"{UNC_IN_RANGE}")
    s += f"; unc_cp is a judgement of this file's author"
    return s


def write(path, name, r):
    lines = path.read_text().split("\n")
    start, end = entry_span(lines, name)
    block = lines[start:end]
    cp_line = "cp = [" + ", ".join(fmt(v) for v in r["ring"]) + "]"
    anchor = max(i for i, l in enumerate(block) if l.startswith(("hf = ", "s = ")))
    block.insert(anchor + 1, cp_line)
    last_unc = max(i for i, l in enumerate(block) if l.startswith("unc_"))
    block.insert(last_unc + 1, f"unc_cp = {r['unc']}")
    si = next(i for i, l in enumerate(block) if l.startswith("source = "))
    assert block[si].endswith('"')
    block[si] = block[si][:-1] + "; " + source_text(r) + '"'
    add_derived(block, si, r, "cp")
    ni = next((i for i, l in enumerate(block) if l.startswith("note = ")), None)
    if ni is not None:
        note = re.sub(r'(?:[.;] )?cp (?:not recalled|left out).*"$', '"', block[ni])
        note = note.replace("hf only", "hf and cp only")
        if not note.endswith('."'):
            note = note[:-1] + '."'
        block[ni] = note
    lines[start:end] = block
    path.write_text("\n".join(lines))


def main():
    do_write = "--write" in sys.argv[1:]
    if do_write:
        backtest()
        for fname in FILES:
            refresh_extrapolated(ROOT / "group-tables" / fname)
    # Each loop re-reads the files: the entropy pass may have written them.
    for fname, path, e in entries_lacking("s"):
        r, why = derive_entropy(e)
        if r is None:
            print(f"{fname}: {e['name']}: no s: {why}")
            continue
        print(f"{fname}: {e['name']}: s {r['ring']:.2f} cal/(mol K) from {r['pname']} "
              f"{r['cas']} (TRC S298 {r['s_parent']:.2f} J/(mol K), sigma {r['sigma']})")
        if do_write:
            write_entropy(path, e["name"], r)
    for fname, path, e in entries_lacking("cp"):
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
            write(path, e["name"], r)


if __name__ == "__main__":
    main()
