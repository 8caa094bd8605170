"""The Dask recipe of the README, run for real: a LocalCluster with two worker processes on
this machine screens a few thousand SMILES through ``estimate_frame`` over the partitions of
a Dask DataFrame, writes Parquet, and the result holds every input row (errors included) and
equals the single-process run. No scheduler code of ours: Dask does the distribution."""

import pytest

import ringheat
from conftest import reference_smiles

pd = pytest.importorskip("pandas")
dd = pytest.importorskip("dask.dataframe")
distributed = pytest.importorskip("distributed")

N_SMILES = 2000


def test_screen_on_two_workers_equals_the_single_process_run(tmp_path):
    smiles = reference_smiles(N_SMILES)
    assert len(smiles) == N_SMILES
    inputs = pd.DataFrame({"smiles": pd.array(smiles, dtype="string")})
    expected = ringheat.estimate_frame(inputs, "smiles", threads=1)
    assert expected["error"].notna().sum() > 0, "the set holds salts and metals: error rows"

    out = tmp_path / "screen.parquet"
    with distributed.LocalCluster(
        n_workers=2, threads_per_worker=1, processes=True, dashboard_address=None
    ) as cluster, distributed.Client(cluster) as client:
        frame = dd.from_pandas(inputs, npartitions=8)
        results = frame.map_partitions(
            ringheat.estimate_frame, "smiles", meta=ringheat.frame_meta()
        )
        results.to_parquet(out)
        workers = len(client.scheduler_info()["workers"])
    assert workers == 2

    got = pd.read_parquet(out).sort_index()
    got.index.name = None  # Dask writes the unnamed index as __null_dask_index__
    assert got.index.tolist() == list(range(N_SMILES)), "every input row is in the output"
    assert got["input"].tolist() == smiles
    columns = list(ringheat.RECORD_COLUMNS)
    pd.testing.assert_frame_equal(
        got[columns], expected[columns], check_dtype=False, check_index_type=False
    )
