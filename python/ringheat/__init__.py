"""ringheat: ring-strain thermochemistry from SMILES, in Python, on the ringheat Rust engine.

Benson group additivity with ring corrections (``estimate``), strain energies by several
schemes (``strain``), the isodesmic hierarchy of reactions (``cbh``), and batch screening
(``estimate_many``, ``estimate_frame``) with every input giving one row, a result or an error.
Results are frozen dataclasses whose field names carry their units (``hf298_kj_per_mol``,
``s298_j_per_mol_k``) and whose terms carry their sources.

Screening estimates only (gas phase, group additivity; errors of several kJ/mol are usual).
Not a substitute for calorimetry or a qualified process-safety review; follow local codes and
licensed practice.
"""

from __future__ import annotations

import json
import os
from typing import Any, Callable, Dict, Iterable, List, Optional, Sequence, Tuple, Union

from . import _ringheat
from ._types import (
    CbhReaction,
    Estimate,
    EstimateRow,
    Failure,
    Flag,
    RingSystem,
    Scheme,
    Species,
    State,
    Strain,
    Term,
    rows_from,
)

__version__: str = _ringheat.__version__
SAFETY_NOTE: str = _ringheat.SAFETY_NOTE
CP_TEMPERATURES_K: Tuple[float, ...] = tuple(_ringheat.CP_TEMPERATURES_K)

PathLike = Union[str, "os.PathLike[str]"]
Item = Union[str, Tuple[str, Optional[str]]]
"""An input molecule: a SMILES, or a (SMILES, name) pair."""


class RingheatError(Exception):
    """A molecule gave no result. ``place``, ``input``, ``message`` and ``column`` are those
    the command line prints (``<argument>:1: error: ...`` for a single molecule)."""

    def __init__(self, failure: Failure) -> None:
        super().__init__(str(failure))
        self.failure = failure
        self.place: str = failure.place
        self.input: str = failure.input
        self.message: str = failure.message
        self.column: Optional[int] = failure.column


class SmilesError(RingheatError, ValueError):
    """The SMILES does not parse; ``column`` (1-based) is where reading stopped."""


class EstimateError(RingheatError):
    """Group additivity cannot estimate the molecule (an atom without a Benson type, ...)."""


class StrainError(RingheatError):
    """No strain energy: the molecule has no Hf298 to start from."""


class ReactionError(RingheatError):
    """The CBH reaction cannot be built for the molecule."""


class TablesError(ValueError):
    """The group tables cannot be loaded (the message names the file and the place)."""


_ERRORS = {"estimate": EstimateError, "strain": StrainError, "reaction": ReactionError}


def _raise(failure: Failure) -> None:
    cls = SmilesError if failure.kind == "smiles" else _ERRORS.get(failure.kind, RingheatError)
    raise cls(failure)


class Engine:
    """Group tables, reference species and strain-free increments, read once.

    ``extra_tables``: a directory of table files whose entries add to or replace the bundled
    ones (``--extra-tables``); ``tables``: use only that directory's files (``--tables``).
    """

    def __init__(
        self, tables: Optional[PathLike] = None, extra_tables: Optional[PathLike] = None
    ) -> None:
        try:
            self._native = _ringheat.Engine(
                None if tables is None else os.fspath(tables),
                None if extra_tables is None else os.fspath(extra_tables),
            )
        except ValueError as e:
            raise TablesError(str(e)) from None

    def estimate(
        self,
        smiles: str,
        *,
        name: Optional[str] = None,
        temperatures_k: Sequence[float] = (),
        sigma: Optional[int] = None,
        optical_isomers: Optional[int] = None,
    ) -> Estimate:
        """Hf298, S298 and Cp(T) of one molecule; raises ``SmilesError`` or ``EstimateError``."""
        rows = self.estimate_many(
            [(smiles, name)],
            threads=1,
            temperatures_k=temperatures_k,
            sigma=sigma,
            optical_isomers=optical_isomers,
            source="<argument>",
        )
        return _single(rows[0])

    def estimate_many(
        self,
        items: Iterable[Item],
        *,
        threads: Optional[int] = None,
        temperatures_k: Sequence[float] = (),
        sigma: Optional[int] = None,
        optical_isomers: Optional[int] = None,
        source: str = "<python>",
        first_line: int = 1,
        lines: Optional[Sequence[int]] = None,
    ) -> "Rows":
        """One row per item, in order: an ``Estimate`` or a ``Failure`` (errors are rows, not
        exceptions). Item i is named ``source:line`` with ``lines[i]`` when given, else
        ``first_line + i``. ``threads``: engine threads (``None`` or 0: one per core); the GIL
        is released while they work."""
        raw = self._native.estimate_json(
            _items(items),
            source,
            first_line,
            [float(t) for t in temperatures_k],
            sigma,
            optical_isomers,
            _threads(threads),
            None if lines is None else [int(n) for n in lines],
        )
        return Rows(rows_from(Estimate, json.loads(raw)))

    def estimate_file(
        self,
        path: PathLike,
        *,
        threads: Optional[int] = None,
        temperatures_k: Sequence[float] = (),
        sigma: Optional[int] = None,
        optical_isomers: Optional[int] = None,
    ) -> "Rows":
        """Rows of a SMILES file read as ``ringheat estimate --file`` reads it (names,
        ``sigma=N``, comments), each error named by file and line."""
        raw = self._native.estimate_file_json(
            os.fspath(path),
            [float(t) for t in temperatures_k],
            sigma,
            optical_isomers,
            _threads(threads),
        )
        return Rows(rows_from(Estimate, json.loads(raw)))

    def strain(
        self,
        smiles: str,
        *,
        hf298_kj_per_mol: Optional[float] = None,
        hf298_unc_kj_per_mol: float = 0.0,
    ) -> Strain:
        """Strain energy by every scheme; ``hf298_kj_per_mol`` replaces the molecule's
        reference value (as ``--hf298``)."""
        user = None if hf298_kj_per_mol is None else (hf298_kj_per_mol, hf298_unc_kj_per_mol)
        raw = self._native.strain_json([(smiles, None)], "<argument>", 1, user)
        return _single(rows_from(Strain, json.loads(raw))[0])

    def cbh(self, smiles: str, rung: int, *, template_unit: Optional[str] = None) -> CbhReaction:
        """The CBH-``rung`` reaction (0 to 3) of one molecule, each species with its reference
        Hf298 and source; ``template_unit`` (``hartree``, ``kJ/mol``, ``kcal/mol``) adds the
        fill-in template of computed enthalpies."""
        raw = self._native.cbh_json([(smiles, None)], "<argument>", 1, [rung], template_unit)
        return _single(rows_from(CbhReaction, json.loads(raw))[0])


class Rows(List[EstimateRow]):
    """Rows of a batch, in input order; flat records and a pandas DataFrame on request."""

    @property
    def failures(self) -> List[Failure]:
        """The error rows."""
        return [r for r in self if isinstance(r, Failure)]

    def to_records(self) -> List[Dict[str, Any]]:
        """One flat dict per row, with the command line's CSV columns (kJ and J) plus the
        place; an error row has its message in ``error`` and empty values elsewhere."""
        return [_record(r) for r in self]

    def to_dataframe(self, index: Any = None) -> Any:
        """The flat records as a pandas DataFrame (needs pandas, which ringheat never needs
        otherwise)."""
        return _frame(self.to_records(), index)


RECORD_COLUMNS: Tuple[str, ...] = (
    "input",
    "name",
    "source",
    "line",
    "canonical_smiles",
    "formula",
    "hf298_kj_per_mol",
    "hf298_unc_kj_per_mol",
    "s298_j_per_mol_k",
    "s298_unc_j_per_mol_k",
    "cp298_j_per_mol_k",
    *(f"cp{t:.0f}_j_per_mol_k" for t in CP_TEMPERATURES_K),
    "sigma",
    "optical_isomers",
    "flags",
    "error",
)
"""Columns of ``Rows.to_records`` and ``estimate_frame``."""

_TEXT = ("input", "name", "source", "canonical_smiles", "formula", "flags", "error")
_INTS = ("sigma", "optical_isomers")


def _record(r: EstimateRow) -> Dict[str, Any]:
    rec: Dict[str, Any] = dict.fromkeys(RECORD_COLUMNS)
    rec.update(input=r.input, name=r.name, source=r.source, line=r.line)
    if isinstance(r, Failure):
        # As the command line's CSV: place, then the message on one line.
        rec["error"] = f"{r.place}: {r.message}".replace("\n", " | ")
        return rec
    rec.update(
        canonical_smiles=r.canonical_smiles,
        formula=r.formula,
        hf298_kj_per_mol=r.hf298_kj_per_mol,
        hf298_unc_kj_per_mol=r.hf298_unc_kj_per_mol,
        s298_j_per_mol_k=r.s298_j_per_mol_k,
        s298_unc_j_per_mol_k=r.s298_unc_j_per_mol_k,
        cp298_j_per_mol_k=r.cp298_j_per_mol_k,
        sigma=r.symmetry_number,
        optical_isomers=r.optical_isomers,
        flags=" | ".join(f.text for f in r.flags),
    )
    for t, cp in zip(r.cp_temperatures_k, r.cp_j_per_mol_k or ()):
        rec[f"cp{t:.0f}_j_per_mol_k"] = cp
    return rec


def _frame(records: List[Dict[str, Any]], index: Any) -> Any:
    try:
        import pandas as pd
    except ImportError as e:  # pragma: no cover - depends on the environment
        raise ImportError("to_dataframe needs pandas: pip install pandas") from e
    frame = pd.DataFrame.from_records(records, columns=list(RECORD_COLUMNS), index=index)
    dtypes = {c: "string" if c in _TEXT else "Int64" if c in _INTS else "float64" for c in RECORD_COLUMNS}
    dtypes["line"] = "int64"
    return frame.astype(dtypes)


def _items(items: Iterable[Item]) -> List[Tuple[str, Optional[str]]]:
    out = []
    for i, item in enumerate(items):
        if isinstance(item, str):
            out.append((item, None))
        elif isinstance(item, tuple) and len(item) == 2 and isinstance(item[0], str):
            out.append((item[0], None if item[1] is None else str(item[1])))
        else:
            raise TypeError(f"item {i}: give a SMILES string or a (SMILES, name) pair, not {item!r}")
    return out


def _threads(threads: Optional[int]) -> int:
    if threads is None:
        return 0
    if threads < 0:
        raise ValueError("threads must be 0 (one per core) or more")
    return threads


def _single(row: Any) -> Any:
    if isinstance(row, Failure):
        _raise(row)
    return row


_engines: Dict[Tuple[Optional[str], Optional[str]], Engine] = {}


def engine(tables: Optional[PathLike] = None, extra_tables: Optional[PathLike] = None) -> Engine:
    """The engine over these tables, read on first use and kept for the process (make an
    ``Engine`` yourself to read edited tables again)."""
    key = (
        None if tables is None else os.path.abspath(os.fspath(tables)),
        None if extra_tables is None else os.path.abspath(os.fspath(extra_tables)),
    )
    if key not in _engines:
        _engines[key] = Engine(*key)
    return _engines[key]


def _on_engine(method: Callable[..., Any]) -> Callable[..., Any]:
    """The module-level form of an ``Engine`` method: the same arguments, plus ``tables`` and
    ``extra_tables`` choosing the engine as ``--tables`` and ``--extra-tables`` do (bundled
    tables by default; see ``engine``). ``__init__.pyi`` gives editors the full signatures."""

    def function(
        *args: Any,
        tables: Optional[PathLike] = None,
        extra_tables: Optional[PathLike] = None,
        **kwargs: Any,
    ) -> Any:
        return getattr(engine(tables, extra_tables), method.__name__)(*args, **kwargs)

    function.__name__ = function.__qualname__ = method.__name__
    function.__doc__ = method.__doc__
    return function


estimate = _on_engine(Engine.estimate)
estimate_many = _on_engine(Engine.estimate_many)
estimate_file = _on_engine(Engine.estimate_file)
strain = _on_engine(Engine.strain)
cbh = _on_engine(Engine.cbh)


def estimate_frame(
    frame: Any,
    smiles: str = "smiles",
    name: Optional[str] = None,
    *,
    threads: Optional[int] = 1,
    tables: Optional[PathLike] = None,
    extra_tables: Optional[PathLike] = None,
) -> Any:
    """A pandas DataFrame of ``RECORD_COLUMNS``, one row per row of ``frame`` and with its
    index, from the column ``smiles`` (and names from the column ``name``). Errors name their
    row ``<frame>:N`` with N = index + 1 for an integer index (the 1-based row number of a
    frame with the default index), else the position in ``frame``. Made for Dask:
    ``dask_frame.map_partitions(ringheat.estimate_frame, meta=ringheat.frame_meta())`` gives
    the rows, errors and places of the single-process run."""
    names = frame[name] if name is not None else [None] * len(frame)
    items = [(str(s), None if _missing(n) else str(n)) for s, n in zip(frame[smiles], names)]
    index = frame.index
    lines = [int(i) + 1 for i in index] if _integer_index(index) else None
    rows = estimate_many(
        items, threads=threads, source="<frame>", lines=lines, tables=tables, extra_tables=extra_tables
    )
    return rows.to_dataframe(index=index)


def _missing(value: Any) -> bool:
    # None, NaN and pandas' NA (checked by type name: pandas is not needed here).
    if value is None or type(value).__name__ == "NAType":
        return True
    return isinstance(value, float) and value != value


def _integer_index(index: Any) -> bool:
    return getattr(index.dtype, "kind", "") in "iu" and (len(index) == 0 or int(index.min()) >= 0)


def frame_meta() -> Any:
    """An empty DataFrame with the columns and types ``estimate_frame`` returns."""
    return Rows().to_dataframe()


__all__ = [
    "CP_TEMPERATURES_K",
    "RECORD_COLUMNS",
    "SAFETY_NOTE",
    "CbhReaction",
    "Engine",
    "Estimate",
    "EstimateError",
    "EstimateRow",
    "Failure",
    "Flag",
    "ReactionError",
    "RingSystem",
    "RingheatError",
    "Rows",
    "Scheme",
    "SmilesError",
    "Species",
    "State",
    "Strain",
    "StrainError",
    "TablesError",
    "Term",
    "cbh",
    "engine",
    "estimate",
    "estimate_file",
    "estimate_frame",
    "estimate_many",
    "frame_meta",
    "strain",
]
