"""xarray and dask behaviour of the front door: broadcasting by dimension
name, laziness, multi-output kernels, and a dask.distributed cluster of worker
processes. Expected numbers come from the NumPy path of the same function."""

import warnings

import numpy as np
import pytest

xr = pytest.importorskip("xarray")
da = pytest.importorskip("dask.array")

import wetboil  # noqa: E402
from wetboil.chf import kandlikar  # noqa: E402
from wetboil.departure import fritz  # noqa: E402
from wetboil.fluids import Saturation  # noqa: E402

WATER = Saturation(T=373.124, p=101325.0, rho_l=958.35, rho_v=0.59817, h_lv=2.2564e6, sigma=0.058912)


def test_dataarrays_broadcast_by_dimension_name():
    beta = xr.DataArray(np.array([10.0, 40.0, 70.0]), dims="receding", coords={"receding": [10, 40, 70]})
    phi = xr.DataArray(np.array([0.0, 45.0]), dims="orientation")
    q = kandlikar(beta, WATER, phi)
    assert isinstance(q, xr.DataArray)
    assert q.dims == ("receding", "orientation") and q.shape == (3, 2)
    assert q.name == "critical_heat_flux"
    assert list(q.coords["receding"].values) == [10, 40, 70]
    expect = kandlikar(np.array([10.0, 40.0, 70.0])[:, None], WATER, np.array([0.0, 45.0])[None, :])
    np.testing.assert_array_equal(q.values, expect)
    # the same arrays with dims in the other order still line up by name
    q2 = kandlikar(beta, WATER, phi.rename({"orientation": "orientation"}).transpose())
    np.testing.assert_array_equal(q2.transpose("receding", "orientation").values, expect)


def test_results_carry_their_own_units_not_an_inputs_attrs():
    # contract: an input's attrs (here its unit, degrees or Pa) do not describe the result; every
    # output is labelled with the unit of the kernel's output (Model.outputs), fluid fields with theirs
    theta = xr.DataArray([30.0, 60.0], dims="t", attrs={"units": "deg", "long_name": "receding angle"})
    assert fritz(theta, WATER).attrs == {"units": "m"}
    assert kandlikar(theta, WATER).attrs == {"units": "W/m2"}
    assert wetboil.validity(fritz, theta, WATER).attrs == {}
    state = wetboil.fluids.water(p=xr.DataArray([1.0e5, 2.0e5], dims="p", attrs={"units": "Pa"}))
    for field, unit in [("T", "K"), ("rho_l", "kg/m3"), ("h_lv", "J/kg"), ("sigma", "N/m"), ("p", "Pa")]:
        assert getattr(state, field).attrs == {"units": unit}, field
    pytest.importorskip("CoolProp")
    r = wetboil.fluids.from_coolprop("Water", T=xr.DataArray([300.0], dims="T", attrs={"units": "K"}))
    assert r.rho_l.attrs == {"units": "kg/m3"} and r.p.attrs == {"units": "Pa"}


def test_fluid_fields_as_dataarrays():
    p = xr.DataArray([1.0e5, 2.0e5], dims="pressure")
    sat = WATER.replace(sigma=xr.DataArray([0.0589, 0.0550], dims="pressure"), p=p)
    theta = xr.DataArray([30.0, 60.0, 90.0], dims="angle")
    d = fritz(theta, sat)
    assert set(d.dims) == {"angle", "pressure"}
    np.testing.assert_allclose(d.sel(angle=0).values if "angle" in d.coords else d.isel(angle=0).values,
                               fritz(30.0, WATER.replace(sigma=np.array([0.0589, 0.0550]))))


def test_mixed_dataarray_and_ndarray():
    theta = xr.DataArray(np.linspace(0, 90, 5), dims="angle")
    g = np.full(5, 9.80665)
    out = fritz(theta, WATER, g)
    np.testing.assert_allclose(out.values, fritz(np.linspace(0, 90, 5), WATER))


def test_shapes_that_do_not_line_up_are_a_wetboil_error_naming_the_arguments():
    # contract (README): shapes that do not broadcast raise a WetboilValueError (a ValueError) naming
    # the arguments; with xarray inputs too, not NumPy's or xarray's own error
    theta = xr.DataArray([30.0, 60.0], dims="angle")
    with pytest.raises(wetboil.WetboilValueError, match=r"departure.fritz: argument shapes do not broadcast: "
                                                        r"contact_angle_deg \{'angle': 2\}, .*, g \(3,\)"):
        fritz(theta, WATER, np.full(3, 9.80665))
    with pytest.raises(wetboil.WetboilValueError, match=r"sigma_sl \{'angle': 3\}.*AlignmentError"):
        wetboil.wetting.young_angle(xr.DataArray([0.04, 0.05], dims="angle"),
                                    xr.DataArray([0.01, 0.02, 0.03], dims="angle"), 0.0728)
    # errors of the kernels themselves pass through unchanged
    with wetboil.errstate(invalid="raise"), pytest.raises(wetboil.InvalidValueError, match="departure.fritz: 1 of 2"):
        fritz(xr.DataArray([30.0, -1.0], dims="angle"), WATER)


def test_dask_stays_lazy_and_matches():
    x = da.from_array(np.linspace(0, 90, 100_001), chunks=20_000)
    lazy = fritz(x, WATER)
    assert isinstance(lazy, da.Array)
    np.testing.assert_array_equal(lazy.compute(), fritz(np.linspace(0, 90, 100_001), WATER))


def test_dask_backed_dataarray_stays_lazy():
    x = xr.DataArray(da.from_array(np.linspace(0, 90, 1000), chunks=100), dims="angle")
    q = kandlikar(x, WATER, 30.0)
    assert isinstance(q.data, da.Array)
    np.testing.assert_array_equal(q.compute().values, kandlikar(np.linspace(0, 90, 1000), WATER, 30.0))


def test_dask_warnings_arrive_at_compute():
    x = da.from_array(np.array([10.0, 200.0, 20.0]), chunks=2)
    lazy = fritz(x, WATER)
    with pytest.warns(wetboil.InvalidValueWarning):
        out = lazy.compute(scheduler="sync")
    assert np.isnan(out[1])


def test_dask_keeps_the_policy_of_the_call_not_of_compute():
    # contract: errstate applies to the call that builds the lazy result (README, errstate docstring);
    # warnings arrive at compute time, one per chunk with that chunk's count
    x = da.from_array(np.array([10.0, -3.0, -4.0, 5.0]), chunks=2)
    with wetboil.errstate(invalid="raise"):
        strict = fritz(x, WATER)
    with pytest.raises(wetboil.InvalidValueError):
        strict.compute(scheduler="sync")
    with wetboil.errstate(invalid="ignore"):
        quiet = fritz(xr.DataArray(x, dims="t"), WATER)
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert np.isnan(quiet.compute(scheduler="sync").values[1:3]).all()
    loud = fritz(x, WATER)
    with wetboil.errstate(invalid="ignore"), pytest.warns(wetboil.InvalidValueWarning, match="1 of 2"):
        loud.compute(scheduler="sync")


def test_local_cluster_with_two_worker_processes():
    distributed = pytest.importorskip("distributed")
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        with distributed.LocalCluster(n_workers=2, threads_per_worker=1, processes=True,
                                      dashboard_address=None) as cluster, distributed.Client(cluster) as client:
            x = da.from_array(np.linspace(0, 90, 400_000), chunks=50_000)
            lazy = kandlikar(x, WATER, 30.0)
            got = client.compute(lazy).result()
            # the public function itself pickles and runs on a worker
            scalar = client.submit(fritz, 45.0, WATER).result()
    np.testing.assert_array_equal(got, kandlikar(np.linspace(0, 90, 400_000), WATER, 30.0))
    assert scalar == fritz(45.0, WATER)
