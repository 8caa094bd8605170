"""Throughput of the Dask recipe on 1 and on 2 workers (the README's ratio).

Run by hand after installing the package (README, "Python package"):
    python python/bench/dask_throughput.py [N_SMILES] [REPEATS]
It screens N_SMILES of tests/reference/smiles_structures.tsv (PubChem identifiers via the
`chemicals` package), repeated REPEATS times, through the recipe on a LocalCluster with one
worker process, then two, each with one thread, and prints rows per second and the ratio.
The cluster start is outside the timing; reading the input and writing Parquet are inside.
"""

import sys
import tempfile
import time
from pathlib import Path

import dask.dataframe as dd
import distributed
import pandas as pd

import ringheat

sys.path.insert(0, str(Path(__file__).resolve().parents[1] / "tests"))
from conftest import reference_smiles  # noqa: E402


def screen(inputs: pd.DataFrame, workers: int, out: Path) -> float:
    with distributed.LocalCluster(
        n_workers=workers, threads_per_worker=1, processes=True, dashboard_address=None
    ) as cluster, distributed.Client(cluster) as client:
        client.run(lambda: ringheat.estimate("C"))  # load the tables on every worker first
        start = time.perf_counter()
        frame = dd.from_pandas(inputs, npartitions=16)
        frame.map_partitions(ringheat.estimate_frame, "smiles", meta=ringheat.frame_meta()).to_parquet(out)
        return time.perf_counter() - start


def main() -> None:
    n = int(sys.argv[1]) if len(sys.argv) > 1 else 6000
    repeats = int(sys.argv[2]) if len(sys.argv) > 2 else 2
    smiles = reference_smiles(n) * repeats
    inputs = pd.DataFrame({"smiles": pd.array(smiles, dtype="string")})
    with tempfile.TemporaryDirectory() as tmp:
        seconds = {w: screen(inputs, w, Path(tmp) / f"w{w}.parquet") for w in (1, 2)}
    for w, s in seconds.items():
        print(f"{w} worker(s): {len(smiles)} rows in {s:.2f} s = {len(smiles) / s:.0f} rows/s")
    print(f"throughput ratio 2 workers / 1 worker: {seconds[1] / seconds[2]:.2f}")


if __name__ == "__main__":
    main()
