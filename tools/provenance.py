"""Typed provenance of group-table entries, as the Rust loader reads it (src/data/provenance.rs).

An entry whose values were derived from one measured compound carries

    derived_from = { cas = "109-99-9", name = "tetrahydrofuran", properties = ["s", "cp"] }

or an array of such tables. The compound is no independent check of the properties listed.
Standard library only; the tools import it (`from provenance import ...`).
"""

from typing import NamedTuple

PROPERTIES = ("hf", "s", "cp")


class DerivedFrom(NamedTuple):
    """One measured compound and the properties of the entry derived from it."""

    cas: str
    name: str
    properties: tuple


def cas_problem(cas):
    """Why `cas` is not a CAS registry number (form N-NN-N and check digit), or None."""
    parts = cas.split("-")
    if not (len(parts) == 3 and all(p.isdigit() for p in parts) and 2 <= len(parts[0]) <= 7
            and len(parts[1]) == 2 and len(parts[2]) == 1):
        return f'CAS number "{cas}" is not of the form N-NN-N'
    body = parts[0] + parts[1]
    check = sum(int(d) * w for d, w in zip(reversed(body), range(1, len(body) + 1))) % 10
    if check != int(parts[2]):
        return f'CAS number "{cas}" fails its check digit (expected {check})'
    return None


def sort_properties(properties):
    """The properties in file order (hf, s, cp), without repeats."""
    return tuple(p for p in PROPERTIES if p in set(properties))


def read(entry):
    """The DerivedFrom list of a parsed TOML entry (dict); [] when it has none. Raises
    ValueError on a malformed value, with the reason."""
    value = entry.get("derived_from")
    if value is None:
        return []
    items = [value] if isinstance(value, dict) else value
    if isinstance(value, str) or not isinstance(items, list) or not items:
        raise ValueError(f"derived_from {value!r} is not the typed form")
    out = []
    for item in items:
        if set(item) != {"cas", "name", "properties"}:
            raise ValueError(f"derived_from {item!r} needs exactly cas, name, properties")
        problem = cas_problem(item["cas"])
        if problem:
            raise ValueError(problem)
        props = item["properties"]
        if not props or any(p not in PROPERTIES for p in props) or len(set(props)) != len(props):
            raise ValueError(f"derived_from {item!r}: properties must be distinct hf, s, cp")
        out.append(DerivedFrom(item["cas"], item["name"], sort_properties(props)))
    return out


def cas_for(entry, prop):
    """CAS numbers of the compounds the entry's `prop` was derived from."""
    return {d.cas for d in read(entry) if prop in d.properties}


def toml_string(text):
    """A TOML basic string holding `text`."""
    return '"' + text.replace("\\", "\\\\").replace('"', '\\"') + '"'


def toml_value(compounds):
    """The TOML text of a derived_from value (as src/data/provenance.rs writes it)."""
    tables = [
        "{ cas = %s, name = %s, properties = [%s] }" % (
            toml_string(d.cas), toml_string(d.name),
            ", ".join(toml_string(p) for p in sort_properties(d.properties)))
        for d in compounds
    ]
    return tables[0] if len(tables) == 1 else "[" + ", ".join(tables) + "]"


def merged(compounds, cas, name, props):
    """`compounds` with `props` of compound `cas` added (the compound appended if new)."""
    out = []
    found = False
    for d in compounds:
        if d.cas == cas:
            d = DerivedFrom(d.cas, d.name, sort_properties(d.properties + tuple(props)))
            found = True
        out.append(d)
    if not found:
        out.append(DerivedFrom(cas, name, sort_properties(props)))
    return out


UNRELIABLE_FILE = "group-tables/reference/unreliable-species.toml"


def unreliable_species(root):
    """The project's one list of unreliable measured values (UNRELIABLE_FILE under `root`):
    {CAS: (name, set of properties, reason)}. Raises ValueError on a malformed entry."""
    import tomllib
    from pathlib import Path

    data = tomllib.loads((Path(root) / UNRELIABLE_FILE).read_text(encoding="utf-8"))
    out = {}
    for e in data.get("unreliable", []):
        if set(e) != {"cas", "name", "properties", "reason"}:
            raise ValueError(f"{UNRELIABLE_FILE}: {e!r} needs exactly cas, name, properties, reason")
        problem = cas_problem(e["cas"])
        if problem or e["cas"] in out:
            raise ValueError(f"{UNRELIABLE_FILE}: {problem or 'CAS ' + e['cas'] + ' listed twice'}")
        props = set(e["properties"])
        if not props or not props <= set(PROPERTIES):
            raise ValueError(f"{UNRELIABLE_FILE}: {e['cas']}: properties must be hf, s, cp")
        out[e["cas"]] = (e["name"], props, e["reason"])
    return out
