"""dask.array on the local (synchronous and threaded) schedulers: the same results as
NumPy, chunk by chunk, with the error policy applied per chunk.

Reference: the NumPy evaluation of the same function, itself checked against the
published formulas in test_models.py; and Rubinstein (1982) main theorem written here.
"""

import dask
import dask.array as da
import numpy as np
import pytest

import counteroffer as co


@pytest.mark.parametrize("scheduler", ["synchronous", "threads"])
def test_share_chunk_by_chunk(scheduler):
    rng = np.random.default_rng(7)
    d1 = rng.uniform(0, 0.999, (400, 30))
    d2 = rng.uniform(0, 0.999, 30)
    S = rng.uniform(1, 1e6, (400, 1))
    x = da.from_array(d1, chunks=(57, 11))
    lazy = co.share(x, d2, surplus=S)
    assert isinstance(lazy, da.Array) and lazy.dtype == np.float64
    with dask.config.set(scheduler=scheduler):
        got = lazy.compute()
    np.testing.assert_array_equal(got, co.share(d1, d2, surplus=S))
    # Rubinstein (1982): S (1 - d2)/(1 - d1 d2)
    np.testing.assert_allclose(got, S * (1 - d2) / (1 - d1 * d2), rtol=1e-12)
    # each block equals the NumPy result on that block's slice
    for idx in [(0, 0), (3, 2), (7, 2)]:
        block = lazy.blocks[idx].compute(scheduler=scheduler)
        r0, c0 = idx[0] * 57, idx[1] * 11
        want = co.share(d1[r0:r0 + 57, c0:c0 + 11], d2[c0:c0 + 11], surplus=S[r0:r0 + 57])
        np.testing.assert_array_equal(block, want)


def test_error_policy_applies_at_compute_time_with_the_callers_settings():
    d1 = da.from_array(np.array([0.5, 0.6, 1.5, 0.7]), chunks=2)
    lazy = co.share(d1, 0.9)
    with pytest.raises(ValueError, match="own_factor = 1.5 is invalid"):
        lazy.compute(scheduler="synchronous")
    with co.errstate(invalid="ignore"):
        lazy2 = co.share(d1, 0.9)  # the policy in force when the graph is built
    got = lazy2.compute(scheduler="synchronous")
    assert np.isnan(got[2]) and not np.isnan(got[[0, 1, 3]]).any()


def test_solve_over_dask_gives_a_mapping_of_dask_arrays():
    d1 = da.from_array(np.linspace(0.1, 0.9, 9), chunks=4)
    res = co.solve(d1, 0.9, other_outside=0.3)
    assert isinstance(res["own_share"], da.Array)
    want = co.solve(np.linspace(0.1, 0.9, 9), 0.9, other_outside=0.3)
    for k in want:
        np.testing.assert_array_equal(res[k].compute(scheduler="synchronous"), want[k])


def test_raw_ufunc_works_with_dask_unchanged():
    # The underlying object is a real numpy ufunc, so dask dispatches it natively
    # (no error policy on this path: the raw ufunc is documented as such).
    d1 = da.from_array(np.linspace(0.1, 0.9, 9), chunks=4)
    raw = co.share.ufunc(d1, 0.5, 1.0, 1.0)
    assert isinstance(raw, da.Array)
    np.testing.assert_array_equal(raw.compute(scheduler="synchronous"),
                                  co.share(np.linspace(0.1, 0.9, 9), 0.5))


def test_solve_over_2d_dask_with_broadcasting():
    d1 = np.linspace(0.1, 0.95, 24).reshape(6, 4)
    w = np.array([0.0, 0.2, 0.4, 0.6])
    res = co.solve(da.from_array(d1, chunks=(4, 3)), 0.9, other_outside=w)
    want = co.solve(d1, 0.9, other_outside=w)
    graph_outputs = dask.compute(*[res[k] for k in want], scheduler="synchronous")
    for k, got in zip(want, graph_outputs):
        assert got.shape == (6, 4)
        np.testing.assert_array_equal(got, want[k])


def test_error_position_counts_from_the_start_of_the_whole_array():
    x = np.full((6, 5), 0.5)
    x[4, 3] = 1.5  # in chunk (2, 1) of 2 x 3 chunks
    lazy = co.share(da.from_array(x, chunks=(2, 3)), 0.9)
    with pytest.raises(ValueError, match=r"own_factor = 1\.5 is invalid .*first at index "
                                         r"\(4, 3\)"):
        lazy.compute(scheduler="synchronous")
    with pytest.raises(ValueError, match=r"first at index \(4, 3\)"):
        co.share(x, 0.9)  # the same position as NumPy reports


def test_error_position_with_broadcast_chunks_and_several_outputs():
    own = da.from_array(np.linspace(0.1, 0.9, 8), chunks=3)
    other = np.full(8, 0.9)
    other[7] = 2.0
    res = co.solve(own, other)
    with pytest.raises(ValueError, match=r"other_factor = 2\.0 .*first at index \(7,\)"):
        res["own_share"].compute(scheduler="synchronous")


def test_dask_dataframe_columns_work_directly():
    import dask.dataframe as dd
    import pandas as pd

    pdf = pd.DataFrame({"own": [0.9, 0.95, 0.5, 0.7], "other": [0.9, 0.8, 0.5, 0.6],
                        "outside": [0.0, 0.5, 0.2, 0.3]},
                       index=pd.Index(["Pell", "Garnet", "Hollis", "Crane"], name="deal"))
    ddf = dd.from_pandas(pdf, npartitions=2, sort=False)
    lazy = co.share(ddf["own"], ddf["other"])
    assert isinstance(lazy, dd.Series)
    got = lazy.compute(scheduler="synchronous")
    # (dask may store the index labels as Arrow strings: labels compared, not dtypes)
    pd.testing.assert_series_equal(got, co.share(pdf["own"], pdf["other"]),
                                   check_index_type=False)
    # Rubinstein (1982): (1 - d2)/(1 - d1 d2)
    np.testing.assert_allclose(got.to_numpy(), (1 - pdf.other) / (1 - pdf.own * pdf.other),
                               rtol=1e-15)
    frame = co.solve(ddf["own"], ddf["other"], other_outside=ddf["outside"])
    assert isinstance(frame, dd.DataFrame)
    pd.testing.assert_frame_equal(frame.compute(scheduler="synchronous"),
                                  co.solve(pdf["own"], pdf["other"],
                                           other_outside=pdf["outside"]),
                                  check_index_type=False)


def test_dask_dataframe_errors_name_the_row_label():
    import dask.dataframe as dd
    import pandas as pd

    pdf = pd.DataFrame({"own": [0.9, 0.95, 1.5, 0.7]},
                       index=pd.Index(["Pell", "Garnet", "Hollis", "Crane"], name="deal"))
    lazy = co.share(dd.from_pandas(pdf, npartitions=2, sort=False)["own"], 0.9)
    with pytest.raises(ValueError, match=r"own_factor = 1\.5 .*label 'Hollis'"):
        lazy.compute(scheduler="synchronous")
