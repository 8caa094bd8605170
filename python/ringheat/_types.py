"""The result types: plain frozen dataclasses whose field names carry their units.

Every class is built from the rows the native engine returns (``python/src/rows.rs`` names
the same fields); nothing here computes a number.
"""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass
from typing import Any, Dict, List, Optional, Tuple, Type, TypeVar, Union

T = TypeVar("T")


def _tuple(value: Any) -> Any:
    return tuple(value) if isinstance(value, list) else value


def _build(cls: Type[T], data: Dict[str, Any], nested: Dict[str, type]) -> T:
    kwargs = {}
    for f in dataclasses.fields(cls):  # type: ignore[arg-type]
        v = data[f.name]
        if f.name in nested and v is not None:
            v = tuple(nested[f.name]._from(x) for x in v)  # type: ignore[attr-defined]
        else:
            v = _tuple(v)
        kwargs[f.name] = v
    return cls(**kwargs)


@dataclass(frozen=True)
class Flag:
    """A warning of an estimate: what was assumed, stood in or left out."""

    category: str
    """``stand-in``, ``not applied``, ``assumption`` or ``missing property``."""
    text: str
    """The flag as the command line prints it."""

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "Flag":
        return _build(cls, d, {})


@dataclass(frozen=True)
class Term:
    """One group, correction or ring term of a group-additivity sum, per occurrence."""

    kind: str
    label: str
    count: int
    hf_kj_per_mol: Optional[float]
    hf_unc_kj_per_mol: Optional[float]
    s_j_per_mol_k: Optional[float]
    s_unc_j_per_mol_k: Optional[float]
    cp_j_per_mol_k: Optional[Tuple[float, ...]]
    """At ``CP_TEMPERATURES_K``."""
    cp_unc_j_per_mol_k: Optional[float]
    source: str
    notes: Tuple[str, ...]

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "Term":
        return _build(cls, d, {})


@dataclass(frozen=True)
class State:
    """Cp, H, S and G at one temperature (ideal gas, 1 bar)."""

    t_k: float
    cp_j_per_mol_k: float
    cp_unc_j_per_mol_k: float
    h_minus_h298_kj_per_mol: float
    h_kj_per_mol: float
    h_unc_kj_per_mol: float
    s_j_per_mol_k: float
    s_unc_j_per_mol_k: float
    g_kj_per_mol: float
    g_unc_kj_per_mol: float

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "State":
        return _build(cls, d, {})


@dataclass(frozen=True)
class Estimate:
    """Group-additivity thermochemistry of one molecule (gas phase, 298.15 K, 1 bar)."""

    input: str
    name: Optional[str]
    source: str
    """Where the input came from: a file name, or the ``source`` given to ``estimate_many``."""
    line: int
    canonical_smiles: str
    formula: str
    hf298_kj_per_mol: Optional[float]
    hf298_unc_kj_per_mol: Optional[float]
    strain_free_hf298_kj_per_mol: Optional[float]
    """Benson's strain-free sum: Hf298 without the ring corrections."""
    strain_free_hf298_unc_kj_per_mol: Optional[float]
    s298_j_per_mol_k: Optional[float]
    s298_unc_j_per_mol_k: Optional[float]
    cp298_j_per_mol_k: Optional[float]
    cp298_unc_j_per_mol_k: Optional[float]
    cp_temperatures_k: Tuple[float, ...]
    cp_j_per_mol_k: Optional[Tuple[float, ...]]
    cp_unc_j_per_mol_k: Optional[Tuple[float, ...]]
    symmetry_number: int
    external_symmetry_number: int
    internal_symmetry_number: int
    optical_isomers: int
    symmetry_overridden: bool
    symmetry_notes: Tuple[str, ...]
    flags: Tuple[Flag, ...]
    terms: Tuple[Term, ...]
    states: Tuple[State, ...]
    """At the temperatures asked for with ``temperatures_k``."""

    ok = True

    @property
    def sources(self) -> Tuple[str, ...]:
        """The distinct sources of the terms, in the order the terms name them."""
        return tuple(dict.fromkeys(t.source for t in self.terms))

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "Estimate":
        return _build(cls, d, {"flags": Flag, "terms": Term, "states": State})


@dataclass(frozen=True)
class Failure:
    """A record that gave no result: where it was, what it said, and why (errors are rows)."""

    kind: str
    """``smiles`` when the SMILES does not parse, else the step that failed."""
    source: str
    line: int
    input: str
    name: Optional[str]
    message: str
    """As the command line prints it after ``error:`` (a SMILES error holds a caret line)."""
    column: Optional[int]
    """1-based column of a SMILES error."""

    ok = False

    @property
    def place(self) -> str:
        """``source:line``, as the command line names the record."""
        return f"{self.source}:{self.line}"

    def __str__(self) -> str:
        return f"{self.place}: error: {self.message}"

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "Failure":
        return _build(cls, d, {})


@dataclass(frozen=True)
class Scheme:
    """The strain energy by one scheme, or why the scheme gives none (``unavailable``)."""

    scheme: str
    strain_kj_per_mol: Optional[float]
    strain_unc_kj_per_mol: Optional[float]
    strain_free_hf298_kj_per_mol: Optional[float]
    strain_free_hf298_unc_kj_per_mol: Optional[float]
    reaction: Optional[str]
    fallback_species: Tuple[str, ...]
    unavailable: Optional[str]
    source: str

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "Scheme":
        return _build(cls, d, {})


@dataclass(frozen=True)
class RingSystem:
    """The strain of one ring system from its ring corrections."""

    number: int
    atoms: Tuple[int, ...]
    ring_sizes: Tuple[int, ...]
    corrections: Tuple[str, ...]
    strain_kj_per_mol: float
    strain_unc_kj_per_mol: float
    stand_in: Optional[str]

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "RingSystem":
        return _build(cls, d, {})


@dataclass(frozen=True)
class Strain:
    """A molecule's strain energy by every scheme, side by side."""

    input: str
    name: Optional[str]
    canonical_smiles: str
    formula: str
    hf298_kj_per_mol: float
    """The molecule's own Hf298 used by every scheme."""
    hf298_unc_kj_per_mol: float
    hf298_source: str
    group_additivity_hf298_kj_per_mol: Optional[float]
    group_additivity_hf298_unc_kj_per_mol: Optional[float]
    schemes: Tuple[Scheme, ...]
    spread_kj_per_mol: Optional[float]
    ring_systems: Tuple[RingSystem, ...]
    unassigned_kj_per_mol: Optional[float]
    unassigned_unc_kj_per_mol: Optional[float]
    flags: Tuple[str, ...]

    ok = True

    def scheme(self, word: str) -> Optional[Scheme]:
        """The first scheme whose name contains ``word`` (``"CBH-2"``, ``"Benson"``)."""
        return next((s for s in self.schemes if word in s.scheme), None)

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "Strain":
        return _build(cls, d, {"schemes": Scheme, "ring_systems": RingSystem})


@dataclass(frozen=True)
class Species:
    """One species of a CBH reaction (coefficient: products positive, reactants negative)."""

    smiles: str
    coefficient: int
    role: str
    """``target``, ``co-reactant`` or ``product``."""
    hf298_kj_per_mol: Optional[float]
    hf298_unc_kj_per_mol: Optional[float]
    hf298_source: Optional[str]

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "Species":
        return _build(cls, d, {})


@dataclass(frozen=True)
class CbhReaction:
    """A rung of the isodesmic hierarchy (CBH-0 to CBH-3) for one molecule."""

    input: str
    name: Optional[str]
    rung: int
    reaction_class: str
    reaction: str
    reaction_smiles: str
    target_cancelled: bool
    species: Tuple[Species, ...]
    template: Optional[str]
    """The fill-in template of computed enthalpies, when a ``template_unit`` was given."""

    ok = True

    @classmethod
    def _from(cls, d: Dict[str, Any]) -> "CbhReaction":
        return _build(cls, d, {"species": Species})


EstimateRow = Union[Estimate, Failure]
"""A row of ``estimate_many``: a result or an error."""


def rows_from(cls: Type[T], raw: List[Dict[str, Any]]) -> List[Union[T, Failure]]:
    """Rows from the engine's ``[{"ok": ...} | {"error": ...}]`` list."""
    out: List[Union[T, Failure]] = []
    for r in raw:
        if "ok" in r:
            out.append(cls._from(r["ok"]))  # type: ignore[attr-defined]
        else:
            out.append(Failure._from(r["error"]))
    return out


__all__ = [
    "CbhReaction",
    "Estimate",
    "EstimateRow",
    "Failure",
    "Flag",
    "RingSystem",
    "Scheme",
    "Species",
    "State",
    "Strain",
    "Term",
]
