"""Type stubs of the ringheat package, so editors and type checkers see every signature."""

import os
from typing import Any, Dict, Iterable, List, Optional, Sequence, Tuple, Union

from ._types import CbhReaction as CbhReaction
from ._types import Estimate as Estimate
from ._types import EstimateRow as EstimateRow
from ._types import Failure as Failure
from ._types import Flag as Flag
from ._types import RingSystem as RingSystem
from ._types import Scheme as Scheme
from ._types import Species as Species
from ._types import State as State
from ._types import Strain as Strain
from ._types import Term as Term

__version__: str
SAFETY_NOTE: str
CP_TEMPERATURES_K: Tuple[float, ...]
RECORD_COLUMNS: Tuple[str, ...]

PathLike = Union[str, os.PathLike[str]]
Item = Union[str, Tuple[str, Optional[str]]]

class RingheatError(Exception):
    failure: Failure
    place: str
    input: str
    message: str
    column: Optional[int]
    def __init__(self, failure: Failure) -> None: ...

class SmilesError(RingheatError, ValueError): ...
class EstimateError(RingheatError): ...
class StrainError(RingheatError): ...
class ReactionError(RingheatError): ...
class TablesError(ValueError): ...

class Rows(List[EstimateRow]):
    @property
    def failures(self) -> List[Failure]: ...
    def to_records(self) -> List[Dict[str, Any]]: ...
    def to_dataframe(self, index: Any = None) -> Any: ...

class Engine:
    def __init__(
        self, tables: Optional[PathLike] = None, extra_tables: Optional[PathLike] = None
    ) -> None: ...
    def estimate(
        self,
        smiles: str,
        *,
        name: Optional[str] = None,
        temperatures_k: Sequence[float] = (),
        sigma: Optional[int] = None,
        optical_isomers: Optional[int] = None,
    ) -> Estimate: ...
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
    ) -> Rows: ...
    def estimate_file(
        self,
        path: PathLike,
        *,
        threads: Optional[int] = None,
        temperatures_k: Sequence[float] = (),
        sigma: Optional[int] = None,
        optical_isomers: Optional[int] = None,
    ) -> Rows: ...
    def strain(
        self,
        smiles: str,
        *,
        hf298_kj_per_mol: Optional[float] = None,
        hf298_unc_kj_per_mol: float = 0.0,
    ) -> Strain: ...
    def cbh(
        self, smiles: str, rung: int, *, template_unit: Optional[str] = None
    ) -> CbhReaction: ...

def engine(
    tables: Optional[PathLike] = None, extra_tables: Optional[PathLike] = None
) -> Engine: ...
def estimate(
    smiles: str,
    *,
    name: Optional[str] = None,
    temperatures_k: Sequence[float] = (),
    sigma: Optional[int] = None,
    optical_isomers: Optional[int] = None,
    tables: Optional[PathLike] = None,
    extra_tables: Optional[PathLike] = None,
) -> Estimate: ...
def estimate_many(
    items: Iterable[Item],
    *,
    threads: Optional[int] = None,
    temperatures_k: Sequence[float] = (),
    sigma: Optional[int] = None,
    optical_isomers: Optional[int] = None,
    source: str = "<python>",
    first_line: int = 1,
    lines: Optional[Sequence[int]] = None,
    tables: Optional[PathLike] = None,
    extra_tables: Optional[PathLike] = None,
) -> Rows: ...
def estimate_file(
    path: PathLike,
    *,
    threads: Optional[int] = None,
    temperatures_k: Sequence[float] = (),
    sigma: Optional[int] = None,
    optical_isomers: Optional[int] = None,
    tables: Optional[PathLike] = None,
    extra_tables: Optional[PathLike] = None,
) -> Rows: ...
def estimate_frame(
    frame: Any,
    smiles: str = "smiles",
    name: Optional[str] = None,
    *,
    threads: Optional[int] = 1,
    tables: Optional[PathLike] = None,
    extra_tables: Optional[PathLike] = None,
) -> Any: ...
def frame_meta() -> Any: ...
def strain(
    smiles: str,
    *,
    hf298_kj_per_mol: Optional[float] = None,
    hf298_unc_kj_per_mol: float = 0.0,
    tables: Optional[PathLike] = None,
    extra_tables: Optional[PathLike] = None,
) -> Strain: ...
def cbh(
    smiles: str,
    rung: int,
    *,
    template_unit: Optional[str] = None,
    tables: Optional[PathLike] = None,
    extra_tables: Optional[PathLike] = None,
) -> CbhReaction: ...
