"""Type stubs of the native module (python/src/lib.rs); use the ``ringheat`` package API."""

from typing import List, Optional, Tuple

__version__: str
SAFETY_NOTE: str
CP_TEMPERATURES_K: List[float]

class Engine:
    def __init__(self, tables: Optional[str] = None, extra_tables: Optional[str] = None) -> None: ...
    def estimate_json(
        self,
        items: List[Tuple[str, Optional[str]]],
        source: str,
        first_line: int,
        temperatures_k: List[float],
        sigma: Optional[int],
        optical_isomers: Optional[int],
        threads: int,
        lines: Optional[List[int]] = None,
    ) -> str: ...
    def estimate_file_json(
        self,
        path: str,
        temperatures_k: List[float],
        sigma: Optional[int],
        optical_isomers: Optional[int],
        threads: int,
    ) -> str: ...
    def strain_json(
        self,
        items: List[Tuple[str, Optional[str]]],
        source: str,
        first_line: int,
        hf298_kj: Optional[Tuple[float, float]],
    ) -> str: ...
    def cbh_json(
        self,
        items: List[Tuple[str, Optional[str]]],
        source: str,
        first_line: int,
        rungs: List[int],
        template_unit: Optional[str],
    ) -> str: ...
