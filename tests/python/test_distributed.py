"""dask.distributed: a local cluster with two workers gives the same results, bit for
bit, as the in-process NumPy evaluation, and the same error with the same position.

Reference: the NumPy evaluation of the same function (checked against published values
in test_models.py) and Rubinstein (1982) main theorem written here.
"""

import dask.array as da
import distributed
import numpy as np
import pytest

import counteroffer as co


@pytest.fixture(scope="module")
def client():
    # two workers in this process (threads): the graph and its functions still travel
    # through the scheduler as on a real cluster
    with distributed.LocalCluster(n_workers=2, threads_per_worker=1, processes=False,
                                  dashboard_address=None) as cluster:
        with distributed.Client(cluster) as c:
            yield c


def test_two_workers_give_the_in_process_results(client):
    assert len(client.scheduler_info()["workers"]) == 2
    rng = np.random.default_rng(11)
    d1 = rng.uniform(0, 0.999, (300, 40))
    d2 = rng.uniform(0, 0.999, 40)
    got = client.compute(co.share(da.from_array(d1, chunks=(50, 20)), d2, surplus=7.0)).result()
    np.testing.assert_array_equal(got, co.share(d1, d2, surplus=7.0))
    np.testing.assert_allclose(got, 7.0 * (1 - d2) / (1 - d1 * d2), rtol=1e-12)
    res = co.solve(da.from_array(d1[:, 0], chunks=60), 0.9, other_outside=0.4)
    want = co.solve(d1[:, 0], 0.9, other_outside=0.4)
    for k in want:
        np.testing.assert_array_equal(client.compute(res[k]).result(), want[k])


def test_two_workers_report_the_error_position_of_the_whole_array(client):
    x = np.full(1000, 0.5)
    x[777] = -1.0
    lazy = co.share(da.from_array(x, chunks=100), 0.9)
    with pytest.raises(co.InvalidArgumentError, match=r"own_factor = -1\.0 .*\(777,\)"):
        client.compute(lazy).result()
