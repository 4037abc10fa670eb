"""Surfaces, sweeps and screening: wiring (a sweep's numbers are those of the
public functions it chains, which have their own reference tests), labels,
flags, laziness, a dask.distributed cluster, and surface files."""

import importlib
import math
import warnings

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

xr = pytest.importorskip("xarray")
pd = pytest.importorskip("pandas")

import wetboil  # noqa: E402
from wetboil import Surface, load_surfaces, save_surfaces  # noqa: E402
from wetboil import wetting  # noqa: E402
from wetboil.surface import SurfaceFileError  # noqa: E402
from wetboil.chf import kandlikar, zuber  # noqa: E402
from wetboil.departure import fritz, frequency  # noqa: E402
from wetboil.fluids import water  # noqa: E402
from wetboil.nucleation import hsu_active_radii, onset_superheat  # noqa: E402
from wetboil.boiling import cooper_superheat, rohsenow_superheat  # noqa: E402

# invented surfaces (test data only)
SURFACES = [
    Surface("bare (invented)", 78, 88, 52, C_sf=0.013),
    Surface("oxidised (invented)", 24, 33, 11),
    Surface("coated (invented)", 112, 120, 96),
]


def test_sweep_numbers_are_the_public_functions():
    ds = wetboil.sweep(SURFACES, "water", p=[1e5, 1e6], heat_flux=[3e5], orientation_deg=[0.0, 60.0],
                       subcooling=[0.0, 5.0])
    assert ds["chf"].dims == ("surface", "p", "heat_flux", "orientation", "subcooling")
    pt = dict(surface="bare (invented)", p=1e6, heat_flux=3e5, orientation=60.0, subcooling=5.0)
    w = water(p=1e6)
    v = ds.sel(pt)
    assert float(v["chf_kandlikar"]) == kandlikar(52.0, w, 60.0)
    assert float(v["chf_zuber"]) == zuber(w)
    assert float(v["chf"]) == float(v["chf_kandlikar"])  # first method is the design method
    assert float(v["chf_margin"]) == pytest.approx(kandlikar(52.0, w, 60.0) / 3e5, rel=1e-15)
    assert float(v["onset_superheat"]) == onset_superheat(3e5, w, 78.0, method="hsu")
    dtw = rohsenow_superheat(3e5, w, 0.013, 1.0)  # the surface has a C_sf: Rohsenow
    assert float(v["nucleate_superheat"]) == pytest.approx(dtw, rel=1e-14)
    radii = hsu_active_radii(dtw, w, 78.0, w.k_l * (dtw + 5.0) / 3e5, 5.0)
    assert float(v["cavity_radius_min"]) == pytest.approx(radii.r_min, rel=1e-12)
    assert float(v["departure_diameter"]) == fritz(78.0, w)
    assert float(v["departure_frequency"]) == pytest.approx(frequency(fritz(78.0, w), w, method="zuber"), rel=1e-14)
    # no C_sf: Cooper
    v2 = ds.sel(pt | {"surface": "oxidised (invented)"})
    assert float(v2["nucleate_superheat"]) == pytest.approx(cooper_superheat(3e5, w, 1e-6), rel=1e-14)
    assert ds["chf"].attrs["units"] == "W/m2" and "caution" in ds.attrs


def test_flags_mark_rows_outside_validity_ranges():
    df = wetboil.screen(SURFACES, "water", heat_flux=3e5, p=101325.0, orientation_deg=[0.0, 120.0])
    down = df[df["orientation [deg]"] == 120.0]
    up = df[df["orientation [deg]"] == 0.0]
    assert all("chf_kandlikar" in f for f in down["flags"])
    assert not any("chf_kandlikar" in f for f in up["flags"])
    # the coated surface's static angle (112 deg) is beyond Fritz's range
    coated = up[up["surface"] == "coated (invented)"]
    assert "departure_diameter" in coated["flags"].iloc[0]


def test_nucleate_superheat_is_flagged_past_the_critical_heat_flux():
    # Rohsenow (1952) and Cooper (1984) correlate nucleate boiling below the critical heat flux (Rohsenow's
    # validity in wetboil.models()); boiling.curve gives no design superheat at or above the CHF. A sweep
    # flags its nucleate superheat there. The CHF is Kandlikar's (J. Heat Transfer 123 (2001) 1071, his
    # eq. for q''_CHF, as in chf.kandlikar) worked by hand with R134a's saturated properties from CoolProp
    # (the reference library), at 0.5 MPa, receding angle 10 deg, facing up: about 0.55 MW/m2.
    CP = pytest.importorskip("CoolProp.CoolProp")
    p, beta = 5e5, math.radians(10.0)
    rho_l, rho_v = CP.PropsSI("D", "P", p, "Q", 0, "R134a"), CP.PropsSI("D", "P", p, "Q", 1, "R134a")
    h_lv = CP.PropsSI("H", "P", p, "Q", 1, "R134a") - CP.PropsSI("H", "P", p, "Q", 0, "R134a")
    sigma = CP.PropsSI("I", "P", p, "Q", 0, "R134a")
    q_chf = (h_lv * math.sqrt(rho_v) * (1 + math.cos(beta)) / 16
             * math.sqrt(2 / math.pi + math.pi / 4 * (1 + math.cos(beta)))
             * (sigma * 9.80665 * (rho_l - rho_v)) ** 0.25)
    below, above = 0.9 * q_chf, 1.1 * q_chf
    surfaces = [Surface("Cooper (invented)", 20, 30, 10), Surface("Rohsenow (invented)", 20, 30, 10, C_sf=0.005)]
    ds = wetboil.sweep(surfaces, "R134a", p=p, heat_flux=[below, above])
    assert float(ds["chf"].max()) == pytest.approx(q_chf, rel=1e-6)
    bit = 1 << ds["range_flags"].attrs["bits"].split(",").index("nucleate_superheat")
    flagged = (ds["range_flags"] & bit) != 0
    assert not flagged.sel(heat_flux=below).any()
    assert flagged.sel(heat_flux=above).all()
    assert np.isfinite(ds["nucleate_superheat"]).all()  # computed and flagged, as every out-of-range element
    df = wetboil.screen(surfaces, "R134a", heat_flux=above, p=p)
    assert all("nucleate_superheat" in f for f in df["flags"])


def test_screen_ranks_by_margin_with_units_in_columns():
    df = wetboil.screen(SURFACES, "water", heat_flux=4e5, p=[101325.0, 5e5])
    assert list(df["chf_margin [-]"]) == sorted(df["chf_margin [-]"], reverse=True)
    assert "chf [W/m2]" in df.columns and "onset_superheat [K]" in df.columns
    assert df.iloc[0]["surface"] == "oxidised (invented)"
    assert len(df) == 3 * 2
    assert "caution" in df.attrs


def test_probe_liquid_surface_angles_vary_with_pressure():
    s = Surface("probe (invented)", probe_static_deg={"water": 95.0, "diiodomethane": 50.0})
    ds = wetboil.sweep([s], "water", p=[1e5, 1e7], heat_flux=3e5)
    a = ds["static_angle"].sel(surface="probe (invented)").squeeze().values
    assert a[0] != a[1]  # surface tension falls with temperature: the angle follows


def _owens_wendt_by_hand(probes_deg, liquid_d, liquid_p):
    """Owens & Wendt (J. Appl. Polym. Sci. 13 (1969) 1741) by hand: the
    solid's sqrt components from two probe angles, then the liquid's angle.
    Probe splits [mN/m]: water 21.8/51.0 (Fowkes, Ind. Eng. Chem. 56(12)
    (1964) 40), diiodomethane 50.8/0 (Strom et al. 1987; from memory, as in
    wetting.PROBE_LIQUIDS)."""
    rows = {"water": (21.8, 51.0), "diiodomethane": (50.8, 0.0)}
    a = np.array([[2 * math.sqrt(rows[k][0]), 2 * math.sqrt(rows[k][1])] for k in probes_deg])
    b = np.array([sum(rows[k]) * (1 + math.cos(math.radians(v))) for k, v in probes_deg.items()])
    sd, sp = np.linalg.solve(a, b)  # sqrt(gamma_s^d), sqrt(gamma_s^p) [sqrt(mN/m)]
    total = liquid_d + liquid_p
    cos = -1 + 2 * (sd * math.sqrt(liquid_d) + sp * math.sqrt(liquid_p)) / total
    return math.degrees(math.acos(min(1.0, max(-1.0, cos))))


def test_probe_liquid_angles_split_the_working_fluid_by_its_own_kind():
    # A low-energy coating (invented) probed with water and diiodomethane.
    probes = {"water": 118.0, "diiodomethane": 88.0}
    s = Surface("fluoro coat (invented)", probe_static_deg=probes)
    # n-Pentane has no polar part (saturated hydrocarbons: dispersion forces
    # only, Fowkes 1964): its angle follows from the solid's dispersive part
    # alone. Its surface tension from CoolProp (a reference library).
    CP = pytest.importorskip("CoolProp.CoolProp")
    pentane = wetboil.fluids.from_coolprop("n-Pentane", T=280.0)
    sigma = CP.PropsSI("I", "T", 280.0, "Q", 0, "n-Pentane") * 1e3  # mN/m
    expected = _owens_wendt_by_hand(probes, sigma, 0.0)
    assert 30.0 < expected < 45.0  # a case with an angle, not a spreading limit
    assert float(s.angles(pentane).static_deg) == pytest.approx(expected, abs=1e-9)
    # Water keeps its split (and its values bit for bit).
    w = water(p=1e5)
    energy = wetboil.wetting.surface_energy(list(probes.values()), list(probes))
    assert float(s.angles(w).static_deg) == float(wetboil.wetting.predict_angle(
        energy, *wetboil.wetting.split_surface_tension(w.sigma)))
    sw = w.sigma * 1e3
    assert float(s.angles(w).static_deg) == pytest.approx(_owens_wendt_by_hand(probes, sw * 21.8 / 72.8,
                                                                               sw * 51.0 / 72.8), abs=1e-9)
    # A fluid with no tabulated split is refused until the user gives one.
    r134a = wetboil.fluids.from_coolprop("R134a", p=5e5)
    with pytest.raises(ValueError, match="no published dispersive/polar split.*R134a.*dispersive_fraction"):
        s.angles(r134a)
    with pytest.raises(ValueError, match="has no name"):
        s.angles(w.replace(name=None))
    sr = r134a.sigma * 1e3
    got = float(s.angles(r134a, dispersive_fraction=0.6).static_deg)
    assert got == pytest.approx(_owens_wendt_by_hand(probes, 0.6 * sr, 0.4 * sr), abs=1e-9)
    with pytest.raises(ValueError, match="dispersive_fraction = 1.5 is outside"):
        s.angles(r134a, dispersive_fraction=1.5)
    # Surfaces with the working fluid's own angles need no split.
    assert Surface("direct (invented)", 70, 80, 40).angles(r134a).static_deg == 70
    # The sweep passes the choice through, and refuses in the same way.
    with pytest.raises(ValueError, match=r"sweep: surface 'fluoro coat \(invented\)' .*no published dispersive"
                                         r"/polar split.*pass dispersive_fraction=... to this call"):
        wetboil.sweep([s], "R134a", p=5e5, heat_flux=1e5)
    with pytest.raises(ValueError, match="screen: surface 'fluoro coat"):
        wetboil.screen([s], "R134a", p=5e5, heat_flux=1e5)
    ds = wetboil.sweep([s], "R134a", p=5e5, heat_flux=1e5, dispersive_fraction=0.6)
    assert float(ds["static_angle"].squeeze()) == got and ds.attrs["dispersive_fraction"] == 0.6
    df = wetboil.screen([s], "R134a", p=5e5, heat_flux=1e5, dispersive_fraction=0.6)
    assert df["static_angle [deg]"].iloc[0] == got and df.attrs["dispersive_fraction"] == 0.6
    for wrong in (1.5, -0.1, True, "0.5"):
        with pytest.raises(ValueError, match="dispersive_fraction must be a number in 0-1"):
            wetboil.sweep([Surface("direct (invented)", 70, 80, 40)], "water", p=1e5, heat_flux=1e5,
                          dispersive_fraction=wrong)
    ds = wetboil.sweep([s], "n-Pentane", T=280.0, heat_flux=1e5)
    assert float(ds["static_angle"].squeeze()) == pytest.approx(expected, abs=1e-9)
    assert ds.attrs["dispersive_fraction"] == 1.0
    assert "dispersive_fraction" not in wetboil.sweep([Surface("direct (invented)", 70, 80, 40)], "n-Pentane",
                                                      T=280.0, heat_flux=1e5).attrs


def test_rohsenow_exponent_follows_the_fluid_in_sweeps():
    # Rohsenow's n: 1.0 for water, 1.7 for other liquids (Rohsenow 1952;
    # Vachon, Nix & Tanger 1968; common practice) unless the surface gives one.
    pytest.importorskip("CoolProp")
    surfaces = [Surface("given C_sf (invented)", 60, 70, 40, C_sf=0.013),
                Surface("given n (invented)", 60, 70, 40, C_sf=0.013, n=1.0)]
    ds = wetboil.sweep(surfaces, "R134a", p=5e5, heat_flux=1e5)
    r134a = wetboil.fluids.from_coolprop("R134a", p=5e5)
    dt = ds["nucleate_superheat"].squeeze()
    assert float(dt.sel(surface="given C_sf (invented)")) == pytest.approx(
        rohsenow_superheat(1e5, r134a, 0.013, 1.7), rel=1e-14)
    assert float(dt.sel(surface="given n (invented)")) == pytest.approx(
        rohsenow_superheat(1e5, r134a, 0.013, 1.0), rel=1e-14)
    ds = wetboil.sweep(surfaces[:1], "water", p=1e5, heat_flux=1e5)
    assert float(ds["nucleate_superheat"].squeeze()) == pytest.approx(
        rohsenow_superheat(1e5, water(p=1e5), 0.013, 1.0), rel=1e-14)
    # n without C_sf (as every file saved before n became optional carries, n = 1.0): not a fitted
    # pair, so not used, with a warning at construction; the fluid's exponent applies
    with pytest.warns(wetboil.WetboilWarning, match="n = 1 is given without C_sf"):
        old_file = Surface("old file (invented)", 60, 70, 40, n=1.0)
    with pytest.warns(wetboil.WetboilWarning, match="sweep: no C_sf given, so 0.013 .* for 'R134a'"):
        ds = wetboil.sweep([old_file], "R134a", p=5e5, heat_flux=1e5, methods={"nucleate": "rohsenow"})
    assert float(ds["nucleate_superheat"].squeeze()) == pytest.approx(
        rohsenow_superheat(1e5, r134a, 0.013, 1.7), rel=1e-14)
    # an unnamed state: 1.7, with a warning naming the choice
    with pytest.warns(wetboil.WetboilWarning, match="sweep: the fluid state has no name"):
        ds = wetboil.sweep(surfaces[:1], r134a.replace(name=None), heat_flux=1e5)
    assert float(ds["nucleate_superheat"].squeeze()) == pytest.approx(
        rohsenow_superheat(1e5, r134a, 0.013, 1.7), rel=1e-14)


def test_chunked_and_eager_sweeps_have_the_same_dimension_order():
    # A probe-liquid surface's angles vary along p, so p can enter the inputs
    # before surface; the result's dims (and to_dataframe's rows) must not
    # depend on that, nor on chunking. (Wiring check: no outside value.)
    probe = Surface("probe (invented)", probe_static_deg={"water": 95.0, "diiodomethane": 50.0})
    direct = Surface("direct (invented)", 70, 80, 40)
    for surfaces in ([probe, direct], [direct, probe]):
        eager = wetboil.sweep(surfaces, "water", p=[1e5, 1e6], heat_flux=3e5)
        for chunks in (1, {"p": 1}):
            lazy = wetboil.sweep(surfaces, "water", p=[1e5, 1e6], heat_flux=3e5, chunks=chunks)
            assert list(lazy.dims) == list(eager.dims) == ["surface", "p", "heat_flux", "orientation", "subcooling"]
            pd.testing.assert_frame_equal(lazy.to_dataframe(), eager.to_dataframe())


def test_sweep_names_its_fluid_and_the_fields_it_lacks():
    # Wiring: the attrs carry the fluid and the fields NaN at every state (no outside value).
    s = SURFACES[:1]
    ds = wetboil.sweep(s, "water", p=[1e5, 2e5], heat_flux=3e5)
    assert ds.attrs["fluid"] == "water" and "fluid_fields_missing" not in ds.attrs
    bare = water(p=1e5).replace(sigma=float("nan"), k_v=float("nan"))
    ds = wetboil.sweep(s, bare, heat_flux=3e5)
    assert ds.attrs["fluid_fields_missing"] == "sigma, k_v"
    assert np.isnan(ds["chf"].values).all()  # Kandlikar needs sigma
    df = wetboil.screen(s, bare, heat_flux=3e5)
    assert df.attrs["fluid_fields_missing"] == "sigma, k_v" and df.attrs["fluid"] == "water"


def test_sweep_and_screen_record_the_wetboil_version():
    # Wiring (no outside value): a stored sweep.nc or summary must say which
    # version computed it, since correlations and constants change between versions.
    s = SURFACES[:1]
    ds = wetboil.sweep(s, "water", p=[1e5, 2e5], heat_flux=3e5)
    assert ds.attrs["wetboil_version"] == wetboil.__version__
    lazy = wetboil.sweep(s, "water", p=[1e5, 2e5], heat_flux=3e5, chunks=1, compute=False)
    assert lazy.attrs["wetboil_version"] == wetboil.__version__
    assert wetboil.screen(s, "water", heat_flux=3e5, p=1e5).attrs["wetboil_version"] == wetboil.__version__


def test_a_pressure_in_kpa_gets_the_unit_hint_in_python_too():
    # 101.325 "Pa" is below water's triple point, 611.657 Pa (IAPWS R14-08(2011)); as kPa it is 1 atm.
    with pytest.warns(wetboil.WetboilWarning, match=r"101.325 Pa outside .* they look like kPa \(x 1e3\)"):
        with pytest.warns(wetboil.InvalidValueWarning):
            wetboil.sweep(SURFACES[:1], "water", p=[101.325], heat_flux=3e5)
    with warnings.catch_warnings():
        warnings.simplefilter("error")  # a correct pressure: no hint
        wetboil.sweep(SURFACES[:1], "water", p=[101325.0], heat_flux=3e5)
    # strict mode raises with the same hint, not just "physically impossible"
    with wetboil.errstate(invalid="raise"), pytest.raises(wetboil.InvalidValueError,
                                                          match=r"101.325 Pa outside .* they look like kPa"):
        wetboil.sweep(SURFACES[:1], "water", p=[101.325], heat_flux=3e5)


def test_surface_angles_give_one_warning_per_category():
    # Wiring of the warning policy (no outside value): Wenzel on a rough hydrophobic surface
    # (cos < -1/r saturates at 180 deg) is flagged once per call, not once per angle.
    s = Surface("rough (invented)", probe_static_deg={"water": 160.0, "diiodomethane": 120.0},
                probe_receding_deg={"water": 150.0, "diiodomethane": 110.0}, angles_are="intrinsic",
                roughness_ratio=2.0)
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        s.angles(water(p=[1e5, 2e5]))
    ranges = [str(w.message) for w in rec if issubclass(w.category, wetboil.RangeWarning)]
    assert len(ranges) == 1 and ranges[0].count("wetting.wenzel") == 1, ranges


def test_a_property_missing_at_some_states_is_flagged_and_warned():
    # CoolProp (the reference library) has no ammonia surface tension at 0.999 p_crit but has one at
    # 1 bar: the near-critical point's NaN results carry the fluid_state flag, and the fluid layer
    # says which property is missing where.
    CP = pytest.importorskip("CoolProp.CoolProp")
    p_hi = 0.999 * CP.PropsSI("pcrit", "Ammonia")
    try:
        CP.PropsSI("I", "P", p_hi, "Q", 0, "Ammonia")
        pytest.skip("this CoolProp gives ammonia's surface tension at 0.999 p_crit")
    except ValueError:
        pass
    with pytest.warns(wetboil.WetboilWarning, match="CoolProp gave no sigma at 1 of 2 saturated state"):
        df = wetboil.screen(SURFACES[:1], "Ammonia", heat_flux=1e5, p=[1e5, p_hi])
    near = df[df["p [Pa]"] == p_hi].iloc[0]
    assert math.isnan(near["chf [W/m2]"]) and "fluid_state" in near["flags"]
    assert "fluid_state" not in df[df["p [Pa]"] == 1e5].iloc[0]["flags"]
    # requested alone, the near-critical state lacks sigma too: still a gap of a model CoolProp has,
    # flagged, not "no model"
    with pytest.warns(wetboil.WetboilWarning, match="CoolProp gave no sigma at 1 of 1 saturated state"):
        df = wetboil.screen(SURFACES[:1], "Ammonia", heat_flux=1e5, p=[p_hi])
    assert "fluid_state" in df.iloc[0]["flags"] and "fluid_fields_missing" not in df.attrs


def test_a_transport_solver_failing_at_some_states_is_not_a_missing_model():
    # CoolProp (reference library) has R142b's vapour viscosity and conductivity models but cannot
    # solve them at every state, and has R32's; neither is "no model", and the vapour's transport
    # properties do not enter the sweep's chain, so nothing is flagged (a fluid with no model at all:
    # test_cli's Novec649 report).
    pytest.importorskip("CoolProp")
    s = SURFACES[:1]
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", wetboil.WetboilWarning)
        for fluid, p in (("R142b", [3e6]), ("R142b", [1e5, 3e6]), ("R32", [1e5])):
            ds = wetboil.sweep(s, fluid, p=p, heat_flux=1e5)
            assert "fluid_fields_missing" not in ds.attrs, (fluid, p)
            flags = wetboil.screen(s, fluid, p=p, heat_flux=1e5)["flags"]
            assert not any("fluid_state" in f for f in flags), (fluid, p)


def test_cole_rohsenow_on_an_unnamed_state_warns_once_per_sweep_also_in_blocks():
    # Wiring of the warning policy (no outside value): one warning at the call, not one per dask block.
    unnamed = water(p=[1e5, 2e5, 3e5]).replace(name=None)
    for chunks in (None, {"p": 1}):
        with warnings.catch_warnings(record=True) as rec:
            warnings.simplefilter("always")
            ds = wetboil.sweep(SURFACES[:1], unnamed, heat_flux=1e5, methods={"departure": "cole_rohsenow"},
                               chunks=chunks)
        ours = [w for w in rec if "Cole-Rohsenow" in str(w.message) or "cole_rohsenow" in str(w.message)]
        assert len(ours) == 1 and str(ours[0].message).startswith("sweep: the fluid state has no name"), ours
        assert ours[0].filename == __file__  # the user's line, not dask's
    # the general constant, as for any fluid not named water
    assert float(ds["departure_diameter"].isel(p=0).squeeze()) == pytest.approx(
        wetboil.departure.cole_rohsenow(water(p=1e5).replace(name="R113")), rel=1e-13)


def test_bad_input_is_named():
    with pytest.raises(ValueError, match="heat_flux axis is empty"):
        wetboil.sweep(SURFACES, "water", p=1e5, heat_flux=[])
    with pytest.raises(ValueError, match="unknown method"):
        wetboil.sweep(SURFACES, "water", p=1e5, heat_flux=3e5, methods={"chf": ["magic"]})
    with pytest.raises(ValueError, match="unknown key"):
        wetboil.sweep(SURFACES, "water", p=1e5, heat_flux=3e5, methods={"chff": "zuber"})
    with pytest.raises(ValueError, match="exactly one"):
        wetboil.sweep(SURFACES, "water", heat_flux=3e5)
    with pytest.raises(ValueError, match="advancing angle 20 deg is below the receding angle 30"):
        Surface("x", 25, 20, 30)
    with pytest.raises(ValueError, match="advancing_deg / receding_deg need static_deg too"):
        Surface("x", advancing_deg=80, receding_deg=40)
    with pytest.raises(ValueError, match="probe_advancing_deg / probe_receding_deg need probe_static_deg too"):
        Surface("x", probe_receding_deg={"water": 60, "diiodomethane": 30})
    with pytest.raises(ValueError, match="unique"):
        wetboil.sweep([SURFACES[0], SURFACES[0]], "water", p=1e5, heat_flux=3e5)
    # the axes take the kernels' input checks: None, text and None inside a list are not numbers
    with pytest.raises(TypeError, match="heat_flux must be a number"):
        wetboil.sweep(SURFACES, "water", p=1e5, heat_flux=None)
    with pytest.raises(TypeError, match="p contains None"):
        wetboil.sweep(SURFACES, "water", p=[1e5, None], heat_flux=3e5)
    with pytest.raises(TypeError, match="p must be a number"):
        wetboil.sweep(SURFACES, "water", p="1e5", heat_flux=3e5)
    with pytest.raises(TypeError, match="orientation_deg must hold real numbers"):
        wetboil.sweep(SURFACES, "water", p=1e5, heat_flux=3e5, orientation_deg=[0.0, "up"])
    with pytest.raises(TypeError, match="surfaces must be a wetboil.Surface or a sequence"):
        wetboil.sweep(None, "water", p=1e5, heat_flux=3e5)
    with pytest.raises(TypeError, match=r"methods\['onset'\] must be a method name"):
        wetboil.sweep(SURFACES, "water", p=1e5, heat_flux=3e5, methods={"onset": None})
    with pytest.raises(ValueError, match="chunks must be a positive integer"):
        wetboil.sweep(SURFACES, "water", p=1e5, heat_flux=3e5, chunks=0)


def test_screen_errors_name_screen():
    """screen runs sweep's checks; its messages name the function the user called."""
    with pytest.raises(ValueError, match=r"^screen: the heat_flux axis is empty"):
        wetboil.screen(SURFACES, "water", p=1e5, heat_flux=[])
    with pytest.raises(TypeError, match=r"^screen: surfaces must be wetboil.Surface"):
        wetboil.screen(["not a surface"], "water", p=1e5, heat_flux=3e5)
    with wetboil.errstate(out_of_range="raise"), pytest.raises(wetboil.OutOfRangeError, match=r"^screen: 3 of 3 "):
        wetboil.screen(SURFACES, "water", p=1e5, heat_flux=3e5, orientation_deg=90.0, methods={"chf": "zuber"})


def _big_grid(**kw):
    # 10 surfaces x 50 pressures x 20 heat fluxes x 10 orientations x 10 subcoolings = 10^6 points
    rng = np.random.default_rng(3)
    surfaces = []
    for i in range(10):
        r = float(rng.uniform(5, 80))
        surfaces.append(Surface(f"S{i} (invented)", r + 10, r + 20, r, C_sf=0.013 if i % 2 else None))
    return wetboil.sweep(surfaces, "water", p=np.geomspace(5e4, 5e6, 50), heat_flux=np.linspace(1e5, 1e6, 20),
                         orientation_deg=np.linspace(0, 90, 10), subcooling=np.linspace(0, 20, 10), **kw)


def test_million_point_sweep_in_process_dask_and_cluster_identical():
    distributed = pytest.importorskip("distributed")
    eager = _big_grid()
    assert eager["chf"].size == 10**6
    lazy = _big_grid(chunks={"surface": 5, "p": 25}, compute=False)
    assert hasattr(lazy["chf"].data, "dask")
    chunked = lazy.compute()
    stored = _big_grid(chunks={"surface": 5, "p": 25})  # computed block by block into the outputs
    with_bar = _big_grid(chunks={"p": 10}, progress=True)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        with distributed.LocalCluster(n_workers=2, threads_per_worker=1, processes=True,
                                      dashboard_address=None) as cluster, distributed.Client(cluster):
            clustered = _big_grid(chunks={"surface": 5, "p": 25})
    for name in eager.data_vars:
        np.testing.assert_array_equal(eager[name].values, chunked[name].values, err_msg=name)
        np.testing.assert_array_equal(eager[name].values, clustered[name].values, err_msg=name)
        np.testing.assert_array_equal(eager[name].values, stored[name].values, err_msg=name)
        np.testing.assert_array_equal(eager[name].values, with_bar[name].values, err_msg=name)
        assert stored[name].attrs == eager[name].attrs and stored[name].dims == eager[name].dims


def test_a_chunked_sweep_on_dask_processes_returns_its_values():
    """Blocks are written into this process's outputs only under a scheduler that runs here; under
    dask's process pool (whose workers would write into copies) the sweep computes the usual way."""
    import dask

    kw = dict(p=[1e5, 2e5], heat_flux=[1e5, 5e5])
    eager = wetboil.sweep(SURFACES[:2], "water", **kw)
    with dask.config.set(scheduler="processes", num_workers=2):
        chunked = wetboil.sweep(SURFACES[:2], "water", chunks=1, **kw)
    for name in eager.data_vars:
        np.testing.assert_array_equal(eager[name].values, chunked[name].values, err_msg=name)


def test_a_lazy_sweep_keeps_its_inputs_on_their_own_axes():
    """Chunking must not first copy every input field to the size of the grid
    (27 fields: 216 MB for this 10^6-point grid, tens of GB at 10^8 points,
    before the first block). What building the lazy sweep allocates is
    counted by tracemalloc, which sees NumPy's buffers."""
    import tracemalloc

    _big_grid(chunks=5, compute=False)  # imports and one-time tables first
    tracemalloc.start()
    try:
        lazy = _big_grid(chunks={"surface": 5, "p": 25}, compute=False)
        peak = tracemalloc.get_traced_memory()[1]
    finally:
        tracemalloc.stop()
    assert lazy["chf"].size == 10**6
    assert peak < 10**6 * 8, f"building the lazy sweep allocated {peak / 2**20:.0f} MiB"


def test_chunks_must_name_axes_of_the_sweep():
    with pytest.raises(ValueError, match=r"^sweep: chunks names pressure, not an axis of this sweep \(surface, p, "):
        wetboil.sweep(SURFACES, "water", p=[1e5, 2e5], heat_flux=3e5, chunks={"pressure": 1})


def test_results_save_to_netcdf_and_csv(tmp_path):
    ds = wetboil.sweep(SURFACES, "water", p=[1e5, 2e5], heat_flux=3e5)
    nc = tmp_path / "sweep.nc"
    ds.to_netcdf(nc)
    back = xr.load_dataset(nc)
    np.testing.assert_array_equal(back["chf"].values, ds["chf"].values)
    assert back["range_flags"].attrs["bits"] == ds["range_flags"].attrs["bits"]
    csv = tmp_path / "sweep.csv"
    ds.to_dataframe().to_csv(csv)
    assert len(pd.read_csv(csv)) == ds["chf"].size


# --------------------------------------------------------------------------- surface files


def test_surface_files_round_trip(tmp_path):
    surfaces = SURFACES + [
        Surface("probe (invented)", probe_static_deg={"water": 95.0, "diiodomethane": 50.0},
                probe_receding_deg={"water": 70.0, "diiodomethane": 40.0}, Rp=2e-6, notes='quoted "note"'),
        Surface("textured (invented)", 40, 50, 30, angles_are="intrinsic", roughness_ratio=1.8),
    ]
    for ext in ("toml", "csv"):
        path = save_surfaces(surfaces, tmp_path / f"s.{ext}")
        assert load_surfaces(path) == surfaces


def test_surface_file_errors_name_key_and_line(tmp_path):
    bad = tmp_path / "bad.toml"
    bad.write_text('[[surface]]\nname = "a"\nstatic_deg = 30.0\n\n[[surface]]\nname = "b"\nstatik_deg = 30.0\n')
    with pytest.raises(ValueError, match=r"bad.toml:7: unknown key 'statik_deg'"):
        load_surfaces(bad)
    bad.write_text('[[surface]]\nname = "a"\nstatic_deg = 30.0\nadvancing_deg = 20.0\nreceding_deg = 25.0\n')
    with pytest.raises(ValueError, match=r"bad.toml:\d+: surface 'a': advancing angle 20"):
        load_surfaces(bad)
    badcsv = tmp_path / "bad.csv"
    badcsv.write_text("name,static_deg\na,thirty\n")
    with pytest.raises(ValueError, match=r"bad.csv:2: static_deg = 'thirty' is not a number"):
        load_surfaces(badcsv)


def test_surface_files_not_in_utf8_name_file_and_line(tmp_path):
    """Behavioural contract (no outside source): the docstring's promise that errors name the file
    and line holds for a file in another encoding too. A spreadsheet's plain "CSV" export is often
    Windows-1252 (common practice, from memory): 0xe9 is its e-acute, not valid UTF-8."""
    bad = tmp_path / "sheet.csv"
    bad.write_bytes("name,static_deg\nplain (invented),40\nt\u00e9flon (invented),110\n".encode("cp1252"))
    with pytest.raises(SurfaceFileError, match=r"sheet.csv:3: not UTF-8 text \(byte 0xe9\).*CSV UTF-8"):
        load_surfaces(bad)
    bad = tmp_path / "s.toml"
    bad.write_bytes('[[surface]]\nname = "t\u00e9flon (invented)"\nstatic_deg = 110.0\n'.encode("cp1252"))
    with pytest.raises(SurfaceFileError, match=r"s.toml:2: not UTF-8 text"):
        load_surfaces(bad)


def test_duplicate_surface_names_are_named_not_every_name_listed():
    """Behavioural contract (no outside source): with thousands of candidates the error names the
    duplicated names only."""
    surfaces = [Surface(f"T{i:04d} (invented)", 50) for i in range(2000)] + [Surface("T0005 (invented)", 40)]
    with pytest.raises(wetboil.WetboilValueError) as info:
        wetboil.sweep(surfaces, "water", p=1e5, heat_flux=1e5)
    msg = str(info.value)
    assert "'T0005 (invented)'" in msg and "T0006" not in msg and len(msg) < 200, msg


# Awkward text for the file writers (invented): every character TOML 1.0 makes a basic string escape
# (quote, backslash, U+0000-U+001F, U+007F; toml.io/en/v1.0.0#string), tab, CR and CRLF, non-ASCII
# letters, an astral-plane character and U+2028 (a line separator to str.splitlines, not to TOML).
AWKWARD = 'line 1\nline 2\r\nline 3\r\ttab "quoted" back\\slash \\n \x00\x01\x08\x0c\x1b\x1f\x7f ü é 日本 🜁 \u2028 end'


def test_surface_files_escape_strings_and_round_trip(tmp_path):
    import tomllib

    surfaces = [
        Surface('odd "name" \\ ü\tx (invented)', 70, 80, 50, notes=AWKWARD),
        Surface("plain (invented)", 30, notes="  leading and trailing blanks, kept  \n"),
        Surface("probes (invented)", probe_static_deg={"Methylene iodide": 45.0, "water": 80.0},
                notes='[[surface]]\nstatic_deg = 1\n"""'),
    ]
    for ext in ("toml", "csv"):
        path = save_surfaces(surfaces, tmp_path / f"s.{ext}")
        assert load_surfaces(path) == surfaces, ext
    # the TOML is read by the standard library's TOML 1.0 parser as written, with the spec's short escapes
    text = (tmp_path / "s.toml").read_text(encoding="utf-8")
    assert [t["notes"] for t in tomllib.loads(text)["surface"]] == [s.notes for s in surfaces]
    assert 'notes = "line 1\\nline 2\\r\\nline 3\\r\\ttab \\"quoted\\" back\\\\slash \\\\n \\u0000' in text
    assert "\\u007F" in text and "\\b\\f" in text


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(name=st.text(min_size=1).filter(str.strip), notes=st.text())
def test_surface_files_round_trip_any_text(name, notes):
    # Surface strips the name (and refuses a blank one); notes are kept exactly
    import tempfile

    surfaces = [Surface(name, 40, notes=notes), Surface(name + " 2", probe_static_deg={"water": 80, "diiodomethane": 45},
                                                        notes=notes + notes)]
    with tempfile.TemporaryDirectory() as tmp:
        for ext in ("toml", "csv"):
            back = load_surfaces(save_surfaces(surfaces, f"{tmp}/s.{ext}"))
            assert back == surfaces, ext
            assert back[0].name == name.strip() and back[0].notes == notes


def test_surface_text_utf8_cannot_store_is_refused_before_writing(tmp_path):
    for ext in ("toml", "csv"):
        with pytest.raises(wetboil.WetboilValueError, match="notes holds .*lone surrogate"):
            save_surfaces([Surface("s (invented)", 30, notes="x\ud800")], tmp_path / f"s.{ext}")
        assert not (tmp_path / f"s.{ext}").exists()


def test_csv_from_a_spreadsheet_bom_and_empty_rows(tmp_path):
    # "CSV UTF-8" as spreadsheets save it: a byte-order mark (U+FEFF encoded in UTF-8, Unicode
    # standard ch. 23.8), CRLF rows, a quoted cell spanning lines, empty rows left at the end
    path = tmp_path / "sheet.csv"
    rows = ['name,static_deg,notes,probe_static_deg:water,probe_static_deg:diiodomethane',
            'Büro (invented),30,"two\nlines",,', ',,,,', '', '   ,  ,,,', 'probes (invented),,,80,45', ',,,,', ',,,,', '']
    path.write_bytes("\r\n".join(rows).encode("utf-8-sig"))
    assert load_surfaces(path) == [
        Surface("Büro (invented)", 30, notes="two\nlines"),
        Surface("probes (invented)", probe_static_deg={"water": 80.0, "diiodomethane": 45.0}),
    ]
    # error lines count physical lines: the two-line cell and the skipped rows included
    rows[5] = 'probes (invented),,,200,45'
    path.write_bytes("\r\n".join(rows).encode("utf-8-sig"))
    with pytest.raises(SurfaceFileError, match=r"sheet.csv:7: surface 'probes \(invented\)': "
                                                       r"probe_static_deg.water = 200 is outside"):
        load_surfaces(path)


THREE_SURFACES = """\
# a study file with three surfaces (invented); load_surfaces reads its [[surface]] tables
[study]
title = "three surfaces"
fluid = "water"

[[surface]]
name = "one"
static_deg = 30.0
C_sf = 0.013
receding_deg = 20.0

[[surface]]
name = "two"
static_deg = 40.0
{two}

[[surface]]
name = "three"
{three}
"""


@pytest.mark.parametrize("two, three, line, message", [
    ("n = 0.0", "static_deg = 50.0", 15, r"surface 'two': n = 0 is outside"),
    ("C_sf = 0.013", "static_deg = 50.0\nn = -1.0", 20, r"surface 'three': n = -1 is outside"),
    ("C_sf = 0.013", "static_deg = 50.0\nC_sf = 0.01\ntitle = 3.0", 21, r"unknown key 'title' in surface 'three'"),
    ('fluid = "R134a"', "static_deg = 50.0", 15, r"unknown key 'fluid' in surface 'two'"),
    ("C_sf = 0.013", "static_deg = 50.0\nreceding_deg = 60.0", 20, r"surface 'three': receding angle 60 deg is above"),
    ("C_sf = 0.013", 'probe_static_deg = { water = 80.0, diiodomethane = 45.0 }\n[surface.probe_receding_deg]\n'
                'water = 60.0\n"diiodomethane" = 200.0', 22,
     r"surface 'three': probe_receding_deg.diiodomethane = 200 is outside"),
    ("C_sf = 0.013", "probe_static_deg.water = 80.0\nprobe_static_deg.diodomethane = 45.0", 20,
     r"surface 'three': probe_static_deg: unknown probe liquid 'diodomethane'; known liquids: diiodomethane, "),
    ("C_sf = 0.013", 'notes = "no static angle"\nreceding_deg = 20.0', 20,
     r"surface 'three': advancing_deg / receding_deg need static_deg too"),
    ("C_sf = 0.013", "static_deg = 50.0\nprobe_static_deg = { water = 80.0, diiodomethane = 45.0 }", 19,
     r"surface 'three': give either the working fluid's angles"),
])
def test_toml_errors_point_at_the_key_in_its_own_surface(tmp_path, two, three, line, message):
    path = tmp_path / "three.toml"
    path.write_text(THREE_SURFACES.format(two=two, three=three), encoding="utf-8")
    with pytest.raises(SurfaceFileError, match=rf"three.toml:{line}: {message}"):
        load_surfaces(path)


def test_toml_error_lines_skip_other_tables_and_multiline_strings(tmp_path):
    path = tmp_path / "spec.toml"
    path.write_text('[study]\nn = 2\n\n[[surface]]\nname = "a"\nstatic_deg = 30.0\nnotes = """\n[[surface]]\n'
                    'n = 0.5\n"""\n\n[methods]\nn = 3\n\n[[surface]]\nname = "b"\nstatic_deg = 30.0\nn = 0.0\n',
                    encoding="utf-8")
    with pytest.raises(SurfaceFileError, match=r"spec.toml:18: surface 'b': n = 0 is outside"):
        load_surfaces(path)


def test_unknown_probe_liquid_is_refused_when_the_surface_is_built(tmp_path):
    # known names: wetboil.wetting.PROBE_LIQUIDS (sources there), with probe_liquid's spelling variants
    with pytest.raises(wetboil.WetboilValueError, match=r"surface 'p': probe_receding_deg: unknown probe liquid "
                                                        r"'diodomethane'; known liquids: diiodomethane, ethylene glycol, "
                                                        r"formamide, glycerol, hexadecane, water"):
        Surface("p", probe_static_deg={"water": 80, "diiodomethane": 45},
                probe_receding_deg={"water": 60, "diodomethane": 30})
    s = Surface("p", probe_static_deg={"Water": 80, "methylene_iodide": 45, "Glycerin": 70})
    assert list(s.probe_static_deg) == ["Water", "methylene_iodide", "Glycerin"]  # kept as written
    path = tmp_path / "p.csv"
    path.write_text("name,probe_static_deg:water,probe_static_deg:diiodomethane,probe_static_deg:diodomethane\n"
                    "ok,80,45,\nbad,80,,45\n", encoding="utf-8")
    with pytest.raises(SurfaceFileError, match=r"p.csv:3: surface 'bad': probe_static_deg: unknown probe "
                                                       r"liquid 'diodomethane'"):
        load_surfaces(path)
    # a liquid of one's own goes through wetboil.wetting (unchanged): its fitted energy gives the
    # working fluid's angle, which a Surface takes directly (components invented, in N/m)
    energy = wetting.surface_energy([80.0, 45.0], {"own polar": (0.022, 0.050), "own apolar": (0.050, 0.0)})
    theta = float(wetting.predict_angle(energy, *wetting.split_surface_tension(water(p=101325.0).sigma)))
    assert Surface("own liquids (invented)", theta).static_deg == theta


def test_intrinsic_angles_go_through_wenzel():
    s = Surface("t (invented)", 60, 70, 50, angles_are="intrinsic", roughness_ratio=1.5)
    a = s.angles()
    # Wenzel: cos(theta*) = r cos(theta)
    assert np.cos(np.radians(a.static_deg)) == pytest.approx(1.5 * np.cos(np.radians(60)), rel=1e-12)
    assert repr(s).startswith("Surface('t (invented)'")


def test_fused_water_chain_equals_the_separate_functions_bit_for_bit():
    from wetboil.sweep import water_chain

    rng = np.random.default_rng(11)
    n = 50_000
    p = rng.uniform(2e3, 2e7, n)
    th = rng.uniform(1, 90, n)
    rec = th * rng.uniform(0, 1, n)  # receding <= static, as on every surface
    q, phi = rng.uniform(1e4, 1e6, n), rng.uniform(0, 90, n)
    r = water_chain(p, th, rec, q, phi)
    w = water(p=p)
    np.testing.assert_array_equal(r.T_sat, w.T)
    np.testing.assert_array_equal(r.onset_superheat, onset_superheat(q, w, th, method="hsu"))
    np.testing.assert_array_equal(r.departure_diameter, fritz(th, w))
    np.testing.assert_array_equal(r.critical_heat_flux, kandlikar(rec, w, phi))
    assert water_chain(101325.0, 70.0, 40.0, 3e5).T_sat == water(p=101325.0).T


def test_fused_water_chain_has_one_status_per_element():
    """Documented behaviour: an impossible input makes the element's four results NaN, counted
    once. The critical point (22.064 MPa, IAPWS R6-95(2018)) is impossible here as it is for each
    separate model (sigma = 0 there), strict mode included."""
    from wetboil.sweep import water_chain

    with pytest.warns(wetboil.InvalidValueWarning, match="1 of 3"):
        r = water_chain(np.array([1e5, 1e5, 2e5]), 45.0, np.array([40.0, -1.0, 40.0]), 1e5)
    assert np.isnan(r.T_sat[1]) and np.isnan(r.critical_heat_flux[1]) and not np.isnan(r.T_sat[[0, 2]]).any()
    # contact-angle hysteresis: receding <= static <= advancing (a surface whose receding angle
    # exceeds its static one does not exist; common knowledge, no single source)
    with pytest.warns(wetboil.InvalidValueWarning, match="1 of 2"):
        r = water_chain(1e5, 45.0, np.array([60.0, 45.0]), 1e5)
    assert np.isnan(r.critical_heat_flux[0]) and not np.isnan(r.critical_heat_flux[1])
    with wetboil.errstate(invalid="raise"):
        for p_crit in (22.064e6, np.array([1e5, 22.064e6])):
            with pytest.raises(wetboil.InvalidValueError):
                water_chain(p_crit, 45.0, 40.0, 1e5)
        with pytest.warns(wetboil.RangeWarning):
            critical = water(p=22.064e6)  # the state itself, flagged near-critical
        with pytest.raises(wetboil.InvalidValueError):
            kandlikar(40.0, critical)
    with pytest.warns(wetboil.RangeWarning):
        assert not math.isnan(water_chain(22.0e6, 45.0, 40.0, 1e5).T_sat)


# --------------------------------------------------------------------------- impossible operating points


def _bits(ds):
    return ds["invalid_flags"].attrs["bits"].split(",")


def test_impossible_fluid_states_are_flagged_in_sweep_and_screen():
    """Pressures above the critical point (22.064 MPa, IAPWS R6-95(2018)) or
    below the triple point (611.657 Pa, IAPWS R14-08(2011)) have no
    saturated state: NaN, the fluid_state bit and the bit of every NaN
    quantity, one warning per call. Behavioural contract of `sweep`."""
    from wetboil.sweep import STATE_FLAG

    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        ds = wetboil.sweep(SURFACES, "water", p=[1e5, 3e7, 101.3], heat_flux=[3e5, 5e5])
    assert [w.category for w in caught] == [wetboil.InvalidValueWarning], [str(w.message) for w in caught]
    bits = _bits(ds)
    assert bits[-1] == STATE_FLAG == "fluid_state"
    inv = ds["invalid_flags"]
    state = (inv >> bits.index(STATE_FLAG)) & 1
    assert (state.sel(p=1e5) == 0).all() and (state.sel(p=[3e7, 101.3]) == 1).all()
    assert (inv.sel(p=1e5) == 0).all()
    for name in ("onset_superheat", "nucleate_superheat", "departure_diameter", "chf", "chf_margin"):
        assert ds[name].sel(p=[3e7, 101.3]).isnull().all(), name
        assert (((inv.sel(p=[3e7, 101.3]) >> bits.index(name)) & 1) == 1).all(), name
    # measured angles stay what was measured: not NaN, not flagged
    assert (((inv >> bits.index("static_angle")) & 1) == 0).all()

    with wetboil.errstate(invalid="ignore"):
        df = wetboil.screen(SURFACES, "water", heat_flux=3e5, p=[1e5, 3e7])
    bad = df[df["p [Pa]"] == 3e7]
    assert len(bad) == 3 and all("fluid_state" in s and "chf_margin" in s for s in bad["impossible"])
    assert all(s == "" for s in df[df["p [Pa]"] == 1e5]["impossible"])


def test_impossible_temperatures_and_probe_angles_are_flagged_and_chunks_agree():
    """Above the critical temperature (647.096 K, IAPWS R6-95(2018)) there is
    no state; angles predicted from probe liquids need it too. Within 0.997
    T_crit the water state itself is flagged out of range (contract of
    `wetboil.fluids.water`). Behavioural contract: chunked = eager."""
    probe = Surface("probe (invented)", probe_static_deg={"water": 95.0, "diiodomethane": 50.0})
    kw = dict(T=[400.0, 700.0, 646.5], heat_flux=3e5)
    with wetboil.errstate(invalid="ignore", out_of_range="ignore"):
        ds = wetboil.sweep([SURFACES[0], probe], "water", **kw)
        lazy = wetboil.sweep([SURFACES[0], probe], "water", chunks=1, **kw)
    bits = _bits(ds)
    k = bits.index("fluid_state")
    np.testing.assert_array_equal(((ds["invalid_flags"] >> k) & 1).squeeze().values, [[0, 1, 0], [0, 1, 0]])
    np.testing.assert_array_equal(((ds["range_flags"] >> k) & 1).squeeze().values, [[0, 0, 1], [0, 0, 1]])
    angle = ds["static_angle"].sel(surface="probe (invented)", T=700.0)
    assert angle.isnull().all() and (((ds["invalid_flags"].sel(surface="probe (invented)", T=700.0)
                                       >> bits.index("static_angle")) & 1) == 1).all()
    for name in ds.data_vars:
        np.testing.assert_array_equal(ds[name].values, lazy[name].values, err_msg=name)


def test_impossible_fluid_state_raises_in_strict_mode():
    """Behavioural contract: errstate(invalid="raise") turns the NaN into an error."""
    with wetboil.errstate(invalid="raise"), pytest.raises(wetboil.InvalidValueError, match="impossible"):
        wetboil.sweep(SURFACES, "water", p=[1e5, 3e7], heat_flux=3e5)


def test_state_range_message_names_value_range_and_unit_slip():
    """The spec check's verdicts (water: IAPWS R14-08(2011) triple point, 611.657 Pa
    at 273.16 K; critical point 22.064 MPa, 647.096 K, IAPWS R6-95(2018));
    the unit hint is a behavioural contract."""
    from wetboil.sweep import _states_outside_range

    assert _states_outside_range("water", "p", [611.66, 101325.0, 22.064e6]) is None
    msg = _states_outside_range("water", "p", [101.325, 500.0])
    assert "101.325, 500 Pa" in msg and "611.657" in msg and "2.2064e+07 Pa" in msg and "kPa" in msg
    assert "bar" not in msg  # 500 bar is above the critical pressure
    msg = _states_outside_range("water", "p", [1e5, 3e7])
    assert msg.startswith("3e+07 Pa outside") and "look like" not in msg
    msg = _states_outside_range("water", "T", [100.0, 150.0])
    assert "273.16 K" in msg and "647.096 K" in msg and "degC" in msg
    assert _states_outside_range("water", "T", [273.16, 647.0]) is None


# --------------------------------------------------------------------------- methods


SWEEP_MODULE = importlib.import_module("wetboil.sweep")  # `wetboil.sweep` is the function
_EVERY_CHOICE = [(key, choice) for key, choices in SWEEP_MODULE.METHOD_CHOICES.items() for choice in choices]


@pytest.mark.parametrize("key, choice", _EVERY_CHOICE, ids=[f"{k}={c}" for k, c in _EVERY_CHOICE])
def test_every_listed_method_choice_runs(key, choice):
    """Behavioural contract: every method `METHOD_CHOICES` offers runs in a
    sweep, and in-range inputs give finite values except where documented
    (Bergles-Rohsenow's onset has no cavity radius: NaN, not flagged)."""
    with wetboil.errstate(out_of_range="ignore"):
        ds = wetboil.sweep(SURFACES[:2], "water", p=[1e5, 5e5], heat_flux=3e5, methods={key: choice})
    assert (ds["invalid_flags"] == 0).all()
    for name in SWEEP_MODULE.QUANTITIES:
        values = ds[name].values
        if key == "onset" and choice == "bergles_rohsenow" and name == "onset_cavity_radius":
            assert np.isnan(values).all()
        else:
            assert np.isfinite(values).all(), name
    if key == "chf":
        assert f"chf_{choice}" in ds.data_vars


def test_bergles_rohsenow_onset_is_the_public_function():
    """Wiring: the sweep's onset is nucleation.onset_superheat(method="bergles_rohsenow")
    (whose reference values are tested in test_nucleation)."""
    ds = wetboil.sweep(SURFACES[:1], "water", p=[5e5], heat_flux=3e5, methods={"onset": "bergles_rohsenow"})
    assert float(ds["onset_superheat"].squeeze()) == onset_superheat(3e5, water(p=5e5), method="bergles_rohsenow")
    assert "bergles_rohsenow" in ds.attrs["methods"]


def test_bergles_rohsenow_with_another_fluid_is_refused_before_computing():
    """Bergles-Rohsenow is a correlation for water (Bergles and Rohsenow,
    J. Heat Transfer 86 (1964) 365-372): refused up front, lazy or not."""
    other = water(p=1e5).replace(name="R134a")  # every field given: the refusal alone is tested
    for kw in ({}, {"chunks": 1, "compute": False}):
        with pytest.raises(ValueError, match="bergles_rohsenow' is a correlation for water"):
            wetboil.sweep(SURFACES[:1], other, heat_flux=3e5, methods={"onset": "bergles_rohsenow"}, **kw)


def test_a_hand_built_state_without_transport_properties_is_named_once():
    """Consistency with the kernels (each warns for a field never given): the sweep says so once,
    and the quantities that need those fields are NaN while the others are the kernels' values."""
    w = water(p=1e5)
    bare = wetboil.fluids.Saturation(T=w.T, p=w.p, rho_l=w.rho_l, rho_v=w.rho_v, h_lv=w.h_lv, sigma=w.sigma,
                                     molar_mass=w.molar_mass, T_crit=w.T_crit, p_crit=w.p_crit, name="water")
    with pytest.warns(wetboil.WetboilWarning, match="sweep: cp_l, k_l, mu_l, mu_v, cp_v, k_v not given") as rec:
        ds = wetboil.sweep(SURFACES[:1], bare, heat_flux=3e5)
    assert len([r for r in rec if "not given" in str(r.message)]) == 1
    assert np.isnan(ds["onset_superheat"]).all()
    static = SURFACES[0].angles(w)[0]
    assert float(ds["departure_diameter"].squeeze()) == fritz(static, w)


def test_a_perfectly_wetting_surface_is_valid_with_no_departure_frequency():
    """Fritz (1935) gives D = 0 at 0 deg, where f ~ 1/D (Zuber 1963) has no answer. A 0-deg surface is
    measurable (superhydrophilic coatings): NaN frequency flagged out of range, not impossible."""
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        with wetboil.errstate(invalid="raise"):
            ds = wetboil.sweep([Surface("wetting (invented)", 0.0, 0.0, 0.0)], "water", p=1e5, heat_flux=1e5)
    bit = 1 << _bits(ds).index("departure_frequency")
    assert float(ds["departure_diameter"].squeeze()) == 0.0 == fritz(0.0, water(p=1e5))
    assert np.isnan(ds["departure_frequency"]).all()
    assert int(ds["invalid_flags"].squeeze()) == 0 and int(ds["range_flags"].squeeze()) & bit


def test_method_tables_reachable_from_the_sweep_function():
    """Behavioural contract: `wetboil.sweep` (the function) carries the tables its
    docstring names; module imports keep working."""
    module = SWEEP_MODULE
    assert wetboil.sweep.METHOD_CHOICES is module.METHOD_CHOICES
    assert wetboil.sweep.DEFAULT_METHODS is module.DEFAULT_METHODS
    assert wetboil.sweep.QUANTITIES is module.QUANTITIES
    from wetboil.sweep import DEFAULT_METHODS, METHOD_CHOICES, sweep  # noqa: F401

    assert sweep is wetboil.sweep and set(DEFAULT_METHODS) == set(METHOD_CHOICES)


@pytest.mark.parametrize("method", ["zuber", "lienhard_dhir_flat"])
def test_flat_plate_chf_off_horizontal_is_flagged_with_its_facing_up_value(method):
    """Behavioural contract: Zuber's and Lienhard-Dhir's flat-plate CHF are for a large horizontal
    heater facing up (Zuber 1959; Lienhard & Dhir 1973). At any other orientation the sweep keeps
    the facing-up value but flags it, and the margin with it when it is the design method."""
    df = wetboil.screen(SURFACES[:1], "water", heat_flux=3e5, p=101325.0, orientation_deg=[0.0, 90.0, 180.0],
                        methods={"chf": [method, "kandlikar"]})
    flags = dict(zip(df["orientation [deg]"], df["flags"]))
    assert f"chf_{method}" not in flags[0.0] and "chf_margin" not in flags[0.0]
    for phi in (90.0, 180.0):
        assert f"chf_{method}" in flags[phi] and "chf_margin" in flags[phi], (phi, flags[phi])
    assert len(set(df[f"chf_{method} [W/m2]"])) == 1  # the value does not change with orientation


def test_strict_mode_raises_for_flagged_points_instead_of_returning_them():
    """Behavioural contract: errstate(out_of_range="raise") applies to sweeps too."""
    wetboil.sweep(SURFACES[:1], "water", p=101325.0, heat_flux=3e5, orientation_deg=0.0)
    with wetboil.errstate(out_of_range="raise"), pytest.raises(wetboil.OutOfRangeError, match="chf_kandlikar"):
        wetboil.sweep(SURFACES[:1], "water", p=101325.0, heat_flux=3e5, orientation_deg=120.0)
    with wetboil.errstate(out_of_range="raise"):  # nothing flagged: no error
        wetboil.sweep(SURFACES[1:2], "water", p=101325.0, heat_flux=3e5, orientation_deg=0.0)


def test_subcooling_cancels_from_hsu_range_with_the_flux_carrying_layer():
    """Hsu (1962): r_c = delta sin(theta) / (2 (1 + cos theta)) * dTw / (dTw + dTsub)
    * [1 -+ sqrt(1 - 8 (1 + cos theta) sigma T_sat (dTw + dTsub) / (rho_v h_lv delta dTw^2))]
    (the form of the cavity-radius criterion with a contact angle). With delta = k_l (dTw + dTsub)/q
    both delta dTw/(dTw + dTsub) and (dTw + dTsub)/delta lose dTsub: the range depends on dTw and
    q/k_l only, so the sweep's subcooling axis changes no quantity."""
    w = water(p=101325.0)
    q, dtw = 3e5, 12.0
    radii = [hsu_active_radii(dtw, w, 60.0, w.k_l * (dtw + sub) / q, sub) for sub in (0.0, 10.0, 40.0)]
    for r in radii[1:]:
        assert r.r_min == pytest.approx(radii[0].r_min, rel=1e-12)
        assert r.r_max == pytest.approx(radii[0].r_max, rel=1e-12)
    # with a fixed layer thickness, subcooling does narrow the range (the identity above is no accident)
    fixed = [hsu_active_radii(dtw, w, 60.0, 1e-4, sub) for sub in (0.0, 10.0)]
    assert fixed[1].r_max < fixed[0].r_max
    ds = wetboil.sweep(SURFACES, "water", p=101325.0, heat_flux=q, subcooling=[0.0, 10.0, 40.0])
    for name in ("onset_superheat", "nucleate_superheat", "cavity_radius_min", "cavity_radius_max", "chf"):
        v = ds[name].values
        np.testing.assert_allclose(v, np.broadcast_to(v[..., :1], v.shape), rtol=1e-12, err_msg=name)


def test_ranking_puts_a_surface_without_chf_somewhere_after_the_others():
    """Behavioural contract: the lowest margin is over the points with a CHF prediction; a surface
    with points lacking one ranks after every surface predicted everywhere, and says so."""
    from wetboil.report import margin_ranking, margin_text

    summary = pd.DataFrame({
        "surface": ["a", "a", "b", "b", "c", "c"],
        "chf_margin [-]": [4.0, np.nan, 2.0, 3.0, 0.8, 1.5],
        # empty: as screen() gives, NaN: as read_csv
        "flags": [np.nan, "chf_kandlikar, chf, chf_margin", "", np.nan, "", ""],
    })
    r = margin_ranking(summary)
    assert list(r.index) == ["b", "c", "a"]
    assert list(r["no_chf"]) == [0, 0, 1] and list(r["flagged"]) == [0, 0, 1]
    assert margin_text(r.loc["a"]) == "4.00; no CHF prediction at 1 of 2 points"
    assert margin_text(r.loc["c"]).startswith("0.80 (below 1: design flux above the predicted CHF)")


def test_ranking_is_by_lowest_margin_with_flags_breaking_ties_then_names():
    """Behavioural contract (the rule the report states, `RANKING_RULE`): the highest lowest margin
    (CHF / design heat flux: larger is further from burnout) first, whatever else is flagged, so a
    predicted burnout never ranks above a surface with margin; surfaces without a CHF prediction at
    some point after all others; equal margins: fewer flagged rows, then by name. The rule is this
    project's own (no published source)."""
    from wetboil.report import margin_ranking

    summary = pd.DataFrame({
        "surface": ["flagged", "flagged", "q", "q", "p", "p", "tie", "tie", "gap", "gap", "none", "none", "bad", "bad"],
        "chf_margin [-]": [3.0, 4.0, 2.0, 2.5, 2.5, 2.0, 2.0, 2.2, np.nan, 5.0, np.nan, np.nan, 0.5, 0.9],
        "flags": ["departure_frequency", "", "", "", "", "", "chf, chf_margin", "", "chf, chf_margin", "", "", "",
                  "", ""],
    })
    r = margin_ranking(summary)
    assert list(r.index) == ["flagged", "p", "q", "tie", "bad", "gap", "none"]
    assert r.loc["flagged", "lowest_margin"] == 3.0 and r.loc["gap", "lowest_margin"] == 5.0


def test_auto_nucleate_points_carry_the_flags_of_the_method_they_use():
    """Each point of "nucleate": "auto" keeps the validity of the correlation that computed it:
    Cooper's range (p_r >= 0.001, as `cooper_superheat` documents) must not flag a surface that has a
    C_sf and is computed with Rohsenow. Reference: the public functions' own `wetboil.validity`."""
    with_csf = Surface("bare (invented)", 78, 88, 52, C_sf=0.013)
    without = Surface("oxidised (invented)", 24, 33, 11)
    # water at 2 kPa: p_r = 9e-5; 2e4 W/m2 keeps Hsu's onset inside its linearisation bound (0.1 T_sat)
    ds = wetboil.sweep([with_csf, without], "water", p=2e3, heat_flux=2e4)
    bit = ds["range_flags"].attrs["bits"].split(",").index("nucleate_superheat")
    flagged = (ds["range_flags"] >> bit) & 1
    w = water(p=2e3)
    assert int(wetboil.validity(rohsenow_superheat, 2e4, w, 0.013, 1.0)) == 0
    assert int(wetboil.validity(cooper_superheat, 2e4, w, 1e-6)) == 2  # 2: outside its published range
    assert int(flagged.sel(surface="bare (invented)").max()) == 0
    assert int(flagged.sel(surface="oxidised (invented)").min()) == 1
    with wetboil.errstate(out_of_range="raise"):  # the Rohsenow surface alone has nothing to raise for
        wetboil.sweep(with_csf, "water", p=2e3, heat_flux=2e4)


def test_ranking_counts_flags_of_design_quantities_only():
    """A comparison-only CHF method flagged on a row (Zuber's flat-plate form off horizontal) does
    not make the row flagged in the ranking; the design quantities' flags do."""
    from wetboil.report import margin_ranking

    summary = pd.DataFrame({
        "surface": ["a", "a", "b", "b"],
        "chf_margin [-]": [2.0, 3.0, 2.0, 3.0],
        "flags": ["chf_zuber", "", "chf_kandlikar, chf, chf_margin", "departure_diameter, chf_zuber"],
    })
    r = margin_ranking(summary)
    assert r.loc["a", "flagged"] == 0 and r.loc["b", "flagged"] == 2


def test_lazy_sweep_keeps_the_strict_policy_of_the_call_that_built_it():
    """Behavioural contract (README: a lazy result keeps the errstate of the call that built it):
    a sweep built lazily under errstate(out_of_range="raise") raises when computed, wherever it is
    computed; one built under the default policy does not, even if computed under "raise"."""
    with wetboil.errstate(out_of_range="raise"):
        lazy = wetboil.sweep(SURFACES[:1], "water", p=[1e5, 2e5], heat_flux=3e5, orientation_deg=[0.0, 120.0],
                             chunks=1, compute=False)
    with pytest.raises(wetboil.OutOfRangeError, match="chf_kandlikar"):
        lazy.compute()
    lazy = wetboil.sweep(SURFACES[:1], "water", p=[1e5, 2e5], heat_flux=3e5, orientation_deg=[0.0, 120.0],
                         chunks=1, compute=False)
    with wetboil.errstate(out_of_range="raise"):
        assert int(lazy.compute()["range_flags"].max()) > 0


@pytest.mark.parametrize("kw, message", [
    (dict(heat_flux=[1e5, 0.0]), "heat_flux must be positive"),
    (dict(heat_flux=1e5, orientation_deg=[-10.0]), "orientation_deg must lie in 0-180"),
    (dict(heat_flux=1e5, orientation_deg=[0.0, 200.0]), "orientation_deg must lie in 0-180"),
    (dict(heat_flux=1e5, subcooling=[0.0, -5.0]), "subcooling must be zero or positive"),
    # as the study spec's "[study] ... must hold finite numbers": a blank cell read as NaN gave rows of NaN
    # with no flag, and an infinite flux a CHF margin of exactly 0
    (dict(heat_flux=[1e5, np.nan]), r"heat_flux must be positive and finite \[W/m2\], got nan"),
    (dict(heat_flux=[np.inf]), r"heat_flux must be positive and finite \[W/m2\], got inf"),
    (dict(heat_flux=1e5, subcooling=[0.0, np.nan]), "subcooling must be zero or positive and finite"),
])
def test_sweep_refuses_axis_values_the_study_spec_refuses(kw, message):
    """Behavioural contract (no outside value): a mistyped axis raises, as `wetboil run` refuses it in a
    spec, instead of sweeping silently to NaN (an orientation of -10 deg) or to numbers for a
    superheated pool (a negative subcooling)."""
    with pytest.raises(wetboil.WetboilValueError, match=message):
        wetboil.sweep(SURFACES[:1], "water", p=1e5, **kw)


def test_surface_files_refuse_repeated_names_and_other_separators_with_file_and_line(tmp_path):
    """Behavioural contract (no outside value): a repeated name is refused where it is written, not
    later by `sweep`; a semicolon-separated sheet (a spreadsheet's list separator in many locales,
    common practice) gets a hint instead of "unknown column 'name;static_deg'"; a header cell with
    a trailing space is read."""
    csv_path = tmp_path / "s.csv"
    csv_path.write_text("name ,static_deg\nA (invented),30\nB (invented),40\nA (invented),50\n")
    with pytest.raises(SurfaceFileError, match=r"s.csv:4: surface name 'A \(invented\)' already given on line 2"):
        load_surfaces(csv_path)
    csv_path.write_text("name ,static_deg\nA (invented),30\n")
    assert load_surfaces(csv_path)[0].static_deg == 30.0
    csv_path.write_text("name;static_deg\nA (invented);30\n")
    with pytest.raises(SurfaceFileError, match=r"s.csv:1: the values are separated by ';'"):
        load_surfaces(csv_path)
    toml_path = tmp_path / "s.toml"
    toml_path.write_text('[[surface]]\nname = "A (invented)"\nstatic_deg = 30.0\n\n'
                         '[[surface]]\nstatic_deg = 40.0\nname = "A (invented)"\n')
    with pytest.raises(SurfaceFileError, match=r"s.toml:7: surface name 'A \(invented\)' already given on line 2"):
        load_surfaces(toml_path)


def test_sweep_axis_errors_name_the_bad_values_only():
    """Behavioural contract (no outside value): a long axis with one bad value gives a short error
    that names that value, as the duplicate-name error names the duplicates only."""
    with pytest.raises(wetboil.WetboilValueError) as info:
        wetboil.sweep(SURFACES[:1], "water", p=1e5, heat_flux=1e5, orientation_deg=np.append(np.linspace(0, 90, 500), -10.0))
    msg = str(info.value)
    assert msg.endswith("got -10") and len(msg) < 200, msg


def test_fluid_properties_fill_what_coolprop_has_no_model_for(novec649_zuber):
    """CoolProp has no surface tension (nor liquid conductivity or viscosity) for Novec649, a
    dielectric immersion fluid: fluid_properties gives them on the sweep's own axis. The CHF is Zuber's
    (pi/24) worked by hand with CoolProp's saturated densities and latent heat (the reference library)
    and the given surface tension, a placeholder near the maker's published 10.8 mN/m at 25 degC
    (that value from memory; the check is of the plumbing, not of the fluid)."""
    p = [1e5, 2e5]
    sigma = [0.0108, 0.0095]
    surf = [Surface("a (invented)", 60, 70, 40)]
    with pytest.warns(wetboil.WetboilWarning, match=r"CoolProp has no mu_v, k_v for 'Novec649'"):
        ds = wetboil.sweep(surf, "Novec649", p=p, heat_flux=1e5, methods={"chf": "zuber"},
                           fluid_properties={"sigma": sigma, "k_l": 0.059, "mu_l": 6.4e-4})
    for pi, si in zip(p, sigma):
        assert float(ds["chf"].sel(p=pi).squeeze()) == pytest.approx(novec649_zuber(pi, si), rel=1e-9)
    assert np.isfinite(ds["nucleate_superheat"]).all()  # Cooper: no transport property needed
    assert ds.attrs["fluid_fields_missing"] == "mu_v, k_v"
    assert "sigma = [0.0108, 0.0095] N/m" in ds.attrs["fluid_properties_given"]
    # the same states, lazily in chunks, give the same numbers
    lazy = wetboil.sweep(surf, "Novec649", p=p, heat_flux=1e5, methods={"chf": "zuber"}, chunks=1,
                         fluid_properties={"sigma": sigma, "k_l": 0.059, "mu_l": 6.4e-4, "mu_v": 1e-5,
                                           "k_v": 0.012})
    xr.testing.assert_allclose(lazy["chf"], ds["chf"], rtol=1e-15)
    assert "fluid_fields_missing" not in lazy.attrs


@pytest.mark.parametrize("bad, error, message", [
    ({"T": 300.0}, wetboil.WetboilValueError, "fixed field 'T'"),
    ({"sigma": [0.05, 0.05, 0.05]}, wetboil.WetboilValueError, r"one value per state \(2\)"),
    ({"sigma": "0.05"}, wetboil.WetboilTypeError, "number or a sequence"),
    ([("sigma", 0.05)], wetboil.WetboilTypeError, "mapping"),
])
def test_fluid_properties_refuses_what_it_cannot_place(bad, error, message):
    with pytest.raises(error, match=message):
        wetboil.sweep([Surface("a (invented)", 60, 70, 40)], "water", p=[1e5, 2e5], heat_flux=1e5,
                      fluid_properties=bad)
    with pytest.raises(wetboil.WetboilValueError, match=r"\.replace\(\)"):
        wetboil.sweep([Surface("a (invented)", 60, 70, 40)], water(p=1e5), heat_flux=1e5,
                      fluid_properties={"sigma": 0.05})
def test_probe_angles_out_of_order_are_refused(tmp_path):
    # [definition] for each liquid, advancing >= static >= receding (as the working fluid's direct
    # angles are checked); the working fluid's angles are predicted from each probe set, so a
    # disordered pair gave a receding angle above the advancing one to Kandlikar's CHF, unflagged
    # (angles invented)
    static = {"water": 72.0, "diiodomethane": 45.0}
    for kw, message in (
        ({"probe_advancing_deg": {"water": 60.0, "diiodomethane": 50.0}},
         r"water: probe advancing angle 60 deg is below the probe static angle 72 deg"),
        ({"probe_receding_deg": {"Water": 50.0, "methylene iodide": 48.0}},
         r"diiodomethane: probe static angle 45 deg is below the probe receding angle 48 deg"),
        ({"probe_advancing_deg": {"water": 80.0, "diiodomethane": 50.0},
          "probe_receding_deg": {"water": 90.0, "diiodomethane": 40.0}},
         r"water: probe advancing angle 80 deg is below the probe receding angle 90 deg"),
    ):
        with pytest.raises(wetboil.WetboilValueError, match=message):
            Surface("p (invented)", probe_static_deg=static, **kw)
    ordered = Surface("p (invented)", probe_static_deg=static, probe_advancing_deg={"water": 80.0, "diiodomethane": 50.0},
                      probe_receding_deg={"water": 50.0, "diiodomethane": 30.0})
    a = ordered.angles(water(p=101325.0))
    assert a.advancing_deg >= a.static_deg >= a.receding_deg
    path = tmp_path / "p.toml"
    path.write_text('[[surface]]\nname = "a"\nprobe_static_deg = { water = 72.0, diiodomethane = 45.0 }\n\n'
                    '[surface.probe_receding_deg]\nwater = 50.0\n"Methylene iodide" = 48.0\n', encoding="utf-8")
    with pytest.raises(SurfaceFileError, match=r"p.toml:7: surface 'a': diiodomethane: probe static angle 45"):
        load_surfaces(path)


def test_one_probe_liquid_under_two_names_is_refused():
    # "water" and "H2O" are one liquid (wetting.probe_liquid's aliases): given both, the fit used it
    # twice with two angles, silently [review] (angles invented)
    with pytest.raises(wetboil.WetboilValueError, match=r"probe_static_deg: 'water' and 'H2O' name the same"):
        Surface("p (invented)", probe_static_deg={"water": 72.0, "H2O": 60.0, "diiodomethane": 45.0})
    Surface("p (invented)", probe_static_deg={"water": 72.0, "diiodomethane": 45.0})


def test_roughness_with_apparent_angles_is_not_applied_and_says_so():
    # [definition] apparent angles already include the roughness; Wenzel (1936) converts intrinsic
    # ones. A roughness ratio given with apparent angles (the default) was dropped silently
    # (angles invented)
    with pytest.warns(wetboil.WetboilWarning, match=r"roughness_ratio = 1.5 is not applied"):
        s = Surface("r (invented)", 120.0, roughness_ratio=1.5)
    assert s.angles().static_deg == 120.0
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert Surface("r (invented)", 120.0, angles_are="intrinsic", roughness_ratio=1.5).angles().static_deg \
            == pytest.approx(wetting.wenzel(120.0, 1.5))
        Surface("r (invented)", 120.0)



def test_angles_that_look_like_radians_are_questioned():
    # [common practice] 70, 80 and 40 deg typed in radians read 1.22, 1.40 and 0.70 deg, and ran as
    # a superhydrophilic coating without a word (new-user CLI trial; angles invented). Every angle
    # at most pi is questioned, as wetting.surface_energy questions probe angles; one angle above it,
    # or all zero, is not.
    import math

    with pytest.warns(wetboil.WetboilWarning, match=r"'r \(invented\)': every contact angle .*radians"):
        s = Surface("r (invented)", math.radians(70.0), math.radians(80.0), math.radians(40.0))
    assert s.static_deg == pytest.approx(1.2217, abs=1e-4)  # used as given
    with pytest.warns(wetboil.WetboilWarning, match="radians"):
        Surface("p (invented)", probe_static_deg={"water": 1.0, "diiodomethane": 0.7})
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        Surface("a (invented)", 5.0, 8.0, 0.0)
        Surface("b (invented)", 0.0, 0.0, 0.0)
        Surface("p (invented)", probe_static_deg={"water": 3.0, "diiodomethane": 40.0})


def test_roughness_and_cavity_radius_in_micrometres_are_refused():
    # Cooper's Rp of real boiling surfaces is 0.01-20 um and active cavities are microns to tens of
    # microns [common practice, from memory]: 1.5 typed for 1.5 um read as 1.5 m and ran with only
    # Cooper's range flag (new-user CLI trial). Values invented.
    with pytest.raises(wetboil.WetboilValueError, match=r"Rp = 1.5 m is above 1 mm; was it given in micrometres.*1.5e-06 m"):
        Surface("r (invented)", 60.0, Rp=1.5)
    with pytest.raises(wetboil.WetboilValueError, match=r"cavity_radius = 5 m is above 1 mm"):
        Surface("r (invented)", 60.0, cavity_radius=5.0)
    with pytest.raises(wetboil.WetboilValueError, match=r"Rp = 0.0015 m is above 1 mm; .*in metres$"):
        Surface("r (invented)", 60.0, Rp=1.5e-3)  # no micrometre conversion for a value in mm
    s = Surface("r (invented)", 60.0, Rp=1.5e-6, cavity_radius=5e-6)
    assert (s.Rp, s.cavity_radius) == (1.5e-6, 5e-6)

def test_predicted_angles_out_of_order_are_flagged():
    # [definition] advancing >= static >= receding for the working fluid's angles. Each probe set in
    # order (angles invented) does not make the predicted ones so: with water and formamide (van Oss,
    # Chaudhury & Good 1988 components, the default table) and a fully dispersive fluid (n-pentane,
    # tabulated split 1.0), the two-liquid fit weights water negatively, and water's wide hysteresis
    # predicted a receding angle above the advancing one, unflagged, for Kandlikar's CHF [review]; a sweep
    # flags the angles, as it flags a Wenzel or Cassie-Baxter conversion out of range.
    CP = pytest.importorskip("CoolProp.CoolProp")  # noqa: F841  (from_coolprop needs it)
    s = Surface("p (invented)", probe_static_deg={"water": 95.0, "formamide": 82.0},
                probe_advancing_deg={"water": 110.0, "formamide": 85.0},
                probe_receding_deg={"water": 60.0, "formamide": 80.0})
    pentane = wetboil.fluids.from_coolprop("n-Pentane", p=101325.0)
    with pytest.warns(wetboil.RangeWarning, match=r"Surface.angles: surface 'p \(invented\)': 1 of 1"):
        a = s.angles(pentane)
    assert a.receding_deg > a.advancing_deg  # computed all the same
    ds = wetboil.sweep([s], "n-Pentane", p=101325.0, heat_flux=1e4)
    bits = ds["range_flags"].attrs["bits"].split(",")
    flags = int(ds["range_flags"].squeeze())
    assert all(flags & (1 << bits.index(q)) for q in ("static_angle", "advancing_angle", "receding_angle"))
    with pytest.raises(wetboil.OutOfRangeError, match="advancing >= static >= receding"):
        with wetboil.errstate(out_of_range="raise"):
            s.angles(pentane)
    with warnings.catch_warnings():  # in order: silent
        warnings.simplefilter("error")
        Surface("q (invented)", probe_static_deg={"water": 95.0, "formamide": 82.0}).angles(pentane)


def test_fluid_properties_are_checked_and_taken_by_label():
    # As a study file's [fluid_properties] table: a missing (NaN), infinite or non-positive value is
    # refused instead of a silent NaN; a DataArray is placed by its labels, as DataArrays are
    # everywhere else, and one along another dimension is refused. The values are placeholders
    # (water's own surface tension, IAPWS R1-76 via wetboil.fluids.water); the check is of the plumbing.
    surf = [Surface("a (invented)", 60, 70, 40)]
    p = [1e5, 2e5]
    sigma = [float(water(p=v).sigma) for v in p]
    for bad in ([sigma[0], np.nan], np.inf, -0.05, 0.0):
        with pytest.raises(wetboil.WetboilValueError, match="positive and finite"):
            wetboil.sweep(surf, "water", p=p, heat_flux=1e5, fluid_properties={"sigma": bad})
    with pytest.raises(wetboil.WetboilValueError, match="labelled along"):
        wetboil.sweep(surf, "water", p=p, heat_flux=1e5,
                      fluid_properties={"sigma": xr.DataArray(sigma, dims="T")})
    plain = wetboil.sweep(surf, "water", p=p, heat_flux=1e5)
    reversed_labels = xr.DataArray(sigma[::-1], dims="p", coords={"p": p[::-1]})
    ds = wetboil.sweep(surf, "water", p=p, heat_flux=1e5, fluid_properties={"sigma": reversed_labels})
    xr.testing.assert_allclose(ds["chf"], plain["chf"], rtol=1e-12)


def test_screen_takes_fluid_properties_as_sweep_does():
    # screen takes sweep's arguments (its docstring): fluid_properties too, and its table keeps
    # what was given. Water's own surface tension (IAPWS R1-76 via wetboil.fluids.water) given back.
    surf = [Surface("a (invented)", 60, 70, 40)]
    sigma = float(water(p=1e5).sigma)
    df = wetboil.screen(surf, "water", p=1e5, heat_flux=1e5, fluid_properties={"sigma": sigma})
    ref = wetboil.screen(surf, "water", p=1e5, heat_flux=1e5)
    assert df["chf [W/m2]"].tolist() == pytest.approx(ref["chf [W/m2]"].tolist(), rel=1e-12)
    assert df.attrs["fluid_properties_given"] == f"sigma = {sigma!r} N/m"


def test_dataset_metadata_follows_cf_and_survives_netcdf(tmp_path):
    """The Dataset's metadata as the CF conventions (version 1.12) have it,
    kept through a netCDF file: the bit masks carry ``flag_masks`` and
    ``flag_meanings`` (section 3.5, "Flags": bit i of the mask <-> the i-th
    space-separated meaning), the dimensionless CHF margin has units "1"
    (the unit of dimensionless quantities in UDUNITS and in the CF standard
    name table; "-" is no unit UDUNITS parses; from memory), and every
    coordinate has a long_name. The ranked table keeps "[-]" in its labels."""
    ds = wetboil.sweep(SURFACES[:2], "water", p=[1e5, 2.3e7], heat_flux=[3e5, 5e6], orientation_deg=[0.0, 120.0])
    nc = tmp_path / "sweep.nc"
    ds.to_netcdf(nc)
    back = xr.load_dataset(nc)
    assert back["chf_margin"].attrs["units"] == "1"
    for name in ("surface", "p", "heat_flux", "orientation", "subcooling"):
        assert back[name].attrs["long_name"], name
    for flags in ("range_flags", "invalid_flags"):
        attrs = back[flags].attrs
        masks, meanings = np.asarray(attrs["flag_masks"]), attrs["flag_meanings"].split(" ")
        assert meanings == attrs["bits"].split(",") and len(masks) == len(meanings)
        values = back[flags].values.ravel()
        assert values.any()  # above the critical pressure, above CHF, facing down: some of each
        decoded = [{m for mask, m in zip(masks, meanings) if v & mask} for v in values]
        assert decoded == [{m for i, m in enumerate(meanings) if v >> i & 1} for v in values]
    assert "chf_margin [-]" in wetboil.screen(SURFACES[:2], "water", heat_flux=3e5, p=1e5).columns


def test_dataset_carries_the_saturation_temperature_of_each_state(tmp_path):
    """A wall temperature is T_sat + superheat: the Dataset (and the ranked table) carry the other
    saturation variable of each state beside its axis, through a netCDF file. Reference library:
    CoolProp (IAPWS-95 saturation line, Q = 0) at 1 and 10 bar; T_sat of water at 1 atm is
    373.124 K (IAPWS-95)."""
    CP = pytest.importorskip("CoolProp.CoolProp")
    ds = wetboil.sweep(SURFACES[:1], "water", p=[1e5, 1e6], heat_flux=3e5)
    want = [CP.PropsSI("T", "P", p, "Q", 0, "Water") for p in (1e5, 1e6)]
    np.testing.assert_allclose(ds["T_sat"].values, want, rtol=1e-6)
    assert ds["T_sat"].dims == ("p",) and ds["T_sat"].attrs["units"] == "K"
    ds.to_netcdf(tmp_path / "s.nc")
    np.testing.assert_allclose(xr.load_dataset(tmp_path / "s.nc")["T_sat"].values, want, rtol=1e-6)
    by_t = wetboil.sweep(SURFACES[:1], "water", T=[373.124], heat_flux=3e5)
    assert float(by_t["p_sat"][0]) == pytest.approx(101325.0, rel=1e-4)
    df = wetboil.screen(SURFACES[:1], "water", p=[101325.0], heat_flux=3e5)
    assert list(df.columns[1:3]) == ["p [Pa]", "T_sat [K]"] and df["T_sat [K]"][0] == pytest.approx(373.124, abs=1e-3)


def test_wenzel_flags_only_the_angle_it_saturates():
    # Wenzel (1936), cos(theta*) = r cos(theta), evaluated by hand: with r = 1.1 the static 30 deg and
    # advancing 38 deg stay inside |r cos| <= 1 (17.71 and 29.91 deg), the receding 20 deg does not
    # (1.1 cos 20 deg = 1.034 > 1, saturated at 0 and flagged). Only the receding angle carries the flag:
    # the static angle feeds onset and departure, which were marked as extrapolated before.
    s = Surface("laser r=1.1 (invented)", 30.0, 38.0, 20.0, angles_are="intrinsic", roughness_ratio=1.1)
    ds = wetboil.sweep([s], "water", p=101325.0, heat_flux=1e5)
    bits = ds["range_flags"].attrs["bits"].split(",")
    flags = int(ds["range_flags"].values.ravel()[0])
    flagged = {name for i, name in enumerate(bits) if flags & (1 << i)}
    assert float(ds["static_angle"].values.ravel()[0]) == pytest.approx(
        math.degrees(math.acos(1.1 * math.cos(math.radians(30.0)))), abs=1e-9)
    assert float(ds["receding_angle"].values.ravel()[0]) == 0.0
    assert {"static_angle", "advancing_angle", "receding_angle"} & flagged == {"receding_angle"}


def test_quantities_from_a_flagged_angle_carry_its_flag():
    # A hydrophilic texture taken as Cassie-Baxter (air under the drop) is outside that model's range
    # (Cassie & Baxter 1944: cos(theta*) = f cos(theta) + f - 1 with a composite interface, which a
    # wetting liquid does not keep; wetting.cassie_baxter flags it): 8 deg on copper with f = 0.3 gives
    # 113.8 deg by the formula (hand value: acos(0.3 cos 8 deg - 0.7)). Every quantity computed from
    # those angles, Kandlikar's CHF and margin among them, is flagged; Zuber's, which takes no angle,
    # is not (new-user textured-tube trial: the CHF of such a coating was 4.7 times low, unflagged).
    s = Surface("porous CB f=0.3 (invented)", 8.0, 12.0, 3.0, angles_are="intrinsic", solid_fraction=0.3)
    ds = wetboil.sweep([s], "water", p=101325.0, heat_flux=3e5)
    assert float(ds["static_angle"].values.ravel()[0]) == pytest.approx(
        math.degrees(math.acos(0.3 * math.cos(math.radians(8.0)) - 0.7)), abs=1e-9)
    bits = ds["range_flags"].attrs["bits"].split(",")
    flags = int(ds["range_flags"].values.ravel()[0])
    flagged = {name for i, name in enumerate(bits) if flags & (1 << i)}
    assert {"static_angle", "advancing_angle", "receding_angle", "onset_superheat", "onset_cavity_radius",
            "departure_diameter", "departure_frequency", "chf_kandlikar", "chf", "chf_margin"} <= flagged
    assert "chf_zuber" not in flagged and "nucleate_superheat" not in flagged
    # the same angles given as apparent (measured on the coating itself) flag none of it
    plain = Surface("measured (invented)", *(float(ds[k].values.ravel()[0])
                                              for k in ("static_angle", "advancing_angle", "receding_angle")))
    ds2 = wetboil.sweep([plain], "water", p=101325.0, heat_flux=3e5)
    flags2 = int(ds2["range_flags"].values.ravel()[0])
    assert {name for i, name in enumerate(bits) if flags2 & (1 << i)} & {"chf", "onset_superheat"} == set()


def test_design_heat_fluxes_in_w_per_cm2_are_questioned_by_sweep_and_screen():
    """50 typed for 50 W/cm2 (heat-pipe evaporators are specified in W/cm2) on water at 5 kPa ran
    with a CHF margin of about 8000 and no word from sweep or screen (new-user heat-pipe trial; only
    the study runner asked). Zuber's CHF of water at 5 kPa is 0.306 MW/m2 (Zuber 1959, K = pi/24,
    worked by hand with CoolProp's saturated properties at 5 kPa: h_lv 2.423 MJ/kg, rho_v 0.03548,
    rho_l 994.7 kg/m3, sigma 0.0708 N/m), so 50 W/m2 gives margins in the thousands, while the
    intended 5e5 W/m2 is above that CHF (margin below 1). A real design keeps a margin of a few
    [common practice]; the question fires when every margin is above 1000, once per call."""
    surfaces = [wetboil.Surface("sinter (invented)", 35.0, 45.0, 25.0)]
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        ds = wetboil.sweep(surfaces, "water", p=5e3, heat_flux=[50.0])
        df = wetboil.screen(surfaces, "water", heat_flux=50.0, p=5e3)
    asked = [str(w.message) for w in rec if "W/cm2 or kW/m2?" in str(w.message)]
    assert len(asked) == 2, [str(w.message) for w in rec]
    assert asked[0].startswith("sweep: every CHF margin is above 1000") and asked[1].startswith("screen: ")
    assert float(ds["chf_margin"].min()) > 1000.0 and float(df["chf_margin [-]"].min()) > 1000.0
    # Zuber at 5 kPa by hand (CoolProp properties above): pi/24 * h_lv * sqrt(rho_v) * (sigma g drho)**0.25
    zuber_hand = math.pi / 24 * 2.423e6 * math.sqrt(0.03548) * (0.0708 * 9.80665 * (994.7 - 0.03548)) ** 0.25
    assert float(ds["chf_zuber"].squeeze()) == pytest.approx(zuber_hand, rel=2e-3)
    with warnings.catch_warnings(record=True) as rec:
        warnings.simplefilter("always")
        ds = wetboil.sweep(surfaces, "water", p=5e3, heat_flux=[5e4, 5e5])
    assert not [w for w in rec if "W/cm2 or kW/m2?" in str(w.message)], [str(w.message) for w in rec]
    assert float(ds["chf_margin"].sel(heat_flux=5e5).squeeze()) < 1.0   # the intended design is past the CHF


def test_a_nonpositive_coolprop_surface_tension_is_a_missing_value():
    # CoolProp (the reference library) fits methane's surface tension with a correlation that reaches
    # zero just below the critical temperature of its equation of state (negative at 0.9995 T_crit in
    # CoolProp 8). A saturated liquid below T_crit has sigma > 0 (the interface vanishes only at the
    # critical point): the state lacks sigma there, as where CoolProp gives none; its points are
    # flagged fluid_state, not "impossible input" of every kernel.
    CP = pytest.importorskip("CoolProp.CoolProp")
    T_hi = 0.9995 * CP.PropsSI("Tcrit", "Methane")
    if CP.PropsSI("I", "T", T_hi, "Q", 0, "Methane") > 0:
        pytest.skip("this CoolProp gives methane a positive surface tension at 0.9995 T_crit")
    with pytest.warns(wetboil.WetboilWarning, match="CoolProp gave no sigma at 1 of 2 saturated state"):
        s = wetboil.fluids.from_coolprop("Methane", T=[150.0, T_hi])
    assert s.sigma[0] > 0 and math.isnan(s.sigma[1])
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", wetboil.WetboilWarning)
        df = wetboil.screen(SURFACES[:1], "Methane", heat_flux=1e4, T=[150.0, T_hi])
    near = df[df["T [K]"] == T_hi].iloc[0]
    assert math.isnan(near["chf [W/m2]"]) and "fluid_state" in near["flags"]
    assert near["impossible"] == ""  # before: onset, departure and every CHF reported impossible
    assert "fluid_state" not in df[df["T [K]"] == 150.0].iloc[0]["flags"]


@pytest.mark.parametrize("onset, superheat_flagged, radius_flagged", [
    ("hsu", True, True), ("kandlikar", False, True), ("davis_anderson", False, False)])
def test_onset_outputs_carry_only_the_flags_of_the_angle_they_use(onset, superheat_flagged, radius_flagged):
    # Forms as the onset methods write them (wetboil.nucleation.onset_superheat): Hsu's superheat and
    # radius take the static angle; Kandlikar et al. (1997) take the receding angle in the radius only
    # (sin theta_r), the superheat sqrt(8.8 sigma T q/(rho_v h k)) none; Davis & Anderson (1966) none.
    # A Wenzel surface whose angles all saturate at 0 deg (r = 3, angles 20-40 deg: r cos > 1, Wenzel
    # 1936) flags its angles; an onset output carries that flag only if it uses one of them (review).
    s = Surface("laser r=3 (invented)", 30.0, 40.0, 20.0, angles_are="intrinsic", roughness_ratio=3.0)
    ds = wetboil.sweep([s], "water", p=101325.0, heat_flux=1e5, methods={"onset": onset})
    bits = ds["range_flags"].attrs["bits"].split(",")
    flags = int(ds["range_flags"].values.ravel()[0])
    flagged = {name for i, name in enumerate(bits) if flags & (1 << i)}
    assert {"static_angle", "receding_angle"} <= flagged
    assert ("onset_superheat" in flagged) == superheat_flagged
    assert ("onset_cavity_radius" in flagged) == radius_flagged
