"""xarray: the package's functions are NumPy ufuncs, so labelled arrays go through them
unchanged (NumPy's __array_ufunc__ protocol, NEP 13): broadcasting by dimension name,
coordinates kept, the error policy applied, and a dask-backed DataArray stays lazy.

Reference: Rubinstein (1982) main theorem written here, S (1 - d2)/(1 - d1 d2), and
the package's own NumPy evaluation (checked against published values in test_models.py).
"""

import dask.array as da
import numpy as np
import pytest
import xarray as xr

import counteroffer as co


def test_share_broadcasts_by_dimension_name_and_keeps_coordinates():
    own = xr.DataArray(np.array([[0.90, 0.95, 0.99], [0.80, 0.50, 0.999]]),
                       dims=("deal", "scenario"),
                       coords={"deal": ["Harbour lease", "Quarry licence"],
                               "scenario": ["base", "slow", "fast"]})
    other = xr.DataArray(np.array([0.9, 0.7]), dims=("deal",),
                         coords={"deal": ["Harbour lease", "Quarry licence"]})
    got = co.share(own, other, surplus=50.0)
    assert isinstance(got, xr.DataArray)
    assert got.dims == ("deal", "scenario")
    assert list(got.coords["scenario"].values) == ["base", "slow", "fast"]
    d1 = own.values
    d2 = other.values[:, None]  # aligned by the name "deal", not by position
    np.testing.assert_allclose(got.values, 50.0 * (1 - d2) / (1 - d1 * d2), rtol=1e-14)


def test_multi_output_solve_gives_labelled_fields():
    own = xr.DataArray(np.array([0.9, 0.95, 0.99]), dims=("deal",))
    res = co.solve(own, 0.9, other_outside=0.3)
    for name in ("own_share", "other_share", "binding", "rational"):
        assert isinstance(res[name], xr.DataArray) and res[name].dims == ("deal",)
    np.testing.assert_array_equal(res["own_share"].values,
                                  co.solve(own.values, 0.9, other_outside=0.3)["own_share"])


def test_invalid_element_raises_with_its_position():
    with pytest.raises(co.InvalidArgumentError, match=r"own_factor = 1.5 .*index \(1,\)"):
        co.share(xr.DataArray([0.5, 1.5], dims=("deal",)), 0.9)


def test_dask_backed_dataarray_stays_lazy_and_computes_the_same():
    vals = np.array([0.5, 0.6, 0.7, 0.8, 0.95])
    lazy = co.share(xr.DataArray(da.from_array(vals, chunks=2), dims=("deal",)), 0.9)
    assert isinstance(lazy.data, da.Array)
    np.testing.assert_array_equal(lazy.compute().values, co.share(vals, 0.9))
