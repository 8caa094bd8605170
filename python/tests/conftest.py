"""Shared paths and helpers of the Python tests: the repository root and the command line."""

import json
import os
import subprocess
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "demo-data" / "solvent-recovery-ring-screen.smi"
STRUCTURES = REPO / "tests" / "reference" / "smiles_structures.tsv"


def run_cli(*args: str) -> str:
    """Standard output of ``ringheat ARGS`` (``RINGHEAT_BIN`` if set, else ``cargo run``)."""
    binary = os.environ.get("RINGHEAT_BIN")
    cmd = [binary, *args] if binary else ["cargo", "run", "--release", "--quiet", "--", *args]
    done = subprocess.run(cmd, cwd=REPO, capture_output=True, text=True, check=True)
    return done.stdout


def reference_smiles(limit: int = 6000) -> list:
    """SMILES of tests/reference/smiles_structures.tsv (PubChem identifiers via the
    ``chemicals`` package; many are salts, boron or metal compounds that give error rows)."""
    out = []
    with open(STRUCTURES, encoding="utf-8") as f:
        header = None
        for line in f:
            if line.startswith("#"):
                continue
            cells = line.rstrip("\n").split("\t")
            if header is None:
                header = cells
                continue
            out.append(cells[header.index("smiles")])
            if len(out) == limit:
                break
    return out


@pytest.fixture(scope="session")
def cli_json():
    """``ringheat estimate --format json --at 500,1000`` on the demo data."""
    return json.loads(run_cli("estimate", "--format", "json", "--at", "500,1000", "--file", str(DEMO)))


@pytest.fixture(scope="session")
def cli_csv():
    """``ringheat estimate --format csv`` on the demo data."""
    return run_cli("estimate", "--format", "csv", "--file", str(DEMO))
