#!/usr/bin/env python3
"""Convert the prose provenance of group-tables/*.toml to the typed form. Re-runnable.

Old form (one compound per string, "name, CAS"; one field per property set):

    derived_from = "tetrahydropyran, 142-68-7"       # every value of the entry
    s_derived_from = "pyridine, 110-86-1"            # only `s`
    cp_derived_from = "oxirane, 75-21-8"             # only `cp`

New form (tools/provenance.py, src/data/provenance.rs), one line in place of the first old one:

    derived_from = { cas = "142-68-7", name = "tetrahydropyran", properties = ["hf"] }

`properties` of an old `derived_from` are the values the entry gives (hf, s, cp), except `s` and
`cp` of entries whose source says they were "taken as 0" by convention (conformational
corrections of examples/derive_missing_groups.rs): those rest on no measurement. `s_derived_from`
adds `s`, `cp_derived_from` adds `cp`; one compound named in several fields becomes one table.
Lines already in the typed form are left alone, so a second run changes nothing, and a file
taken from another branch can be converted again. The header phrase `derived_from = "name, CAS"`
becomes the new form too. Numbers are not touched. Standard library only:

    python3 tools/convert_provenance.py            # converts group-tables/*.toml in place
    python3 tools/convert_provenance.py FILE...    # converts these files
"""

import re
import sys
import tomllib
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))
from provenance import DerivedFrom, cas_problem, merged, toml_value  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
OLD_LINE = re.compile(r'^(derived_from|s_derived_from|cp_derived_from)\s*=\s*"((?:[^"\\]|\\.)*)"\s*$')
ENTRY_HEAD = re.compile(r"^\[\[(group|correction|ring)\]\]\s*$")
# Wrong CAS numbers in the old text, with the right one and where it was checked.
CAS_FIXES = {
    # bicyclo[1.1.1]pentane: 311-75-0 fails the CAS check digit; the chemicals 1.5.2 identifier
    # table (chemicals.identifiers.search_chemical) gives 311-75-1 for C1C2CC1C2.
    "311-75-0": "311-75-1",
}
CONVENTION_ZERO = "S and Cp taken as 0"
OLD_HEADER = 'derived_from = "name, CAS"'
NEW_HEADER = 'derived_from = { cas, name, properties }'


def split_old(text, where):
    """(name, CAS) of an old "name, CAS" string."""
    if "," not in text:
        raise SystemExit(f"{where}: {text!r} is not \"name, CAS\"")
    name, cas = (p.strip() for p in text.rsplit(",", 1))
    cas = CAS_FIXES.get(cas, cas)
    problem = cas_problem(cas)
    if problem:
        raise SystemExit(f"{where}: {problem} (add the right number to CAS_FIXES)")
    return name, cas


def convert_block(lines, where):
    """The lines of one entry with the old provenance lines replaced."""
    olds = [(i, OLD_LINE.match(l)) for i, l in enumerate(lines)]
    olds = [(i, m) for i, m in olds if m]
    if not olds:
        return lines
    entry = tomllib.loads("".join(lines))
    entry = next(iter(entry.values()))[0]
    given = [p for p in ("hf", "s", "cp") if p in entry]
    if CONVENTION_ZERO in entry.get("source", ""):
        given = [p for p in given if p == "hf"]
    compounds = []
    for _, m in olds:
        field, text = m.group(1), m.group(2)
        name, cas = split_old(text, where)
        props = {"derived_from": given, "s_derived_from": ["s"], "cp_derived_from": ["cp"]}[field]
        if not props:
            raise SystemExit(f"{where}: {field} names {name}, but the entry gives no value")
        compounds = merged(compounds, cas, name, props)
    first = olds[0][0]
    drop = {i for i, _ in olds}
    out = []
    for i, line in enumerate(lines):
        if i == first:
            out.append(f"derived_from = {toml_value(compounds)}\n")
        elif i not in drop:
            out.append(line)
    return out


def convert_file(path):
    """Converts one file in place; returns the number of entries changed."""
    text = path.read_text(encoding="utf-8")
    lines = text.splitlines(keepends=True)
    blocks = [[]]
    for line in lines:
        if line.startswith("[") and blocks[-1]:
            blocks.append([])
        blocks[-1].append(line)
    out = []
    changed = 0
    for n, block in enumerate(blocks):
        head = ENTRY_HEAD.match(block[0]) if block else None
        if head:
            where = f"{path.name}: {head.group(1)} #{n}"
            new = convert_block(block, where)
            changed += new != block
            block = new
        out += [l.replace(OLD_HEADER, NEW_HEADER) if l.startswith("#") else l for l in block]
    new_text = "".join(out)
    if new_text != text:
        path.write_text(new_text, encoding="utf-8")
        tomllib.loads(new_text)  # still valid TOML
    return changed


def main(args):
    files = [Path(a) for a in args] or sorted((ROOT / "group-tables").glob("*.toml"))
    for path in files:
        n = convert_file(path)
        print(f"{path}: {n} entries converted", file=sys.stderr)


if __name__ == "__main__":
    main(sys.argv[1:])
