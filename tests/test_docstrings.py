"""The documented face matches the runtime one: every public model function's
numpydoc ``Parameters`` section names exactly the parameters
``inspect.signature`` reports (a notebook's ``help()`` and ``?`` show both),
it has ``Returns`` and, where it computes a published model, ``References``;
a ``Returns`` that promises a DataArray for labelled input also promises the
Series that pandas input gives (README, "A short tour"). The stubs of the
extension are compared with the runtime by mypy's stubtest in test_stubs.py;
this covers the pure-Python and builtin front doors that stubtest cannot read
docstrings of."""

from __future__ import annotations

import inspect
import re
from typing import Any, List, Tuple

import numpy as np
import pytest

import wetboil
from wetboil import boiling, chf, departure, fluids, nucleation, wetting

MODULES = (wetting, nucleation, departure, chf, boiling)


def _public_functions() -> List[Tuple[str, Any]]:
    out = []
    for mod in MODULES:
        for name in mod.__all__:
            f = getattr(mod, name)
            if callable(f) and not inspect.isclass(f):
                out.append((f"{mod.__name__.rpartition('.')[2]}.{name}", f))
    out += [("water_chain", wetboil.water_chain), ("fluids.water", fluids.water),
            ("fluids.from_coolprop", fluids.from_coolprop)]
    return out


FUNCTIONS = _public_functions()


def _sections(doc: str) -> dict:
    lines = inspect.cleandoc(doc).splitlines()
    out: dict = {}
    current = None
    for i, line in enumerate(lines):
        if i + 1 < len(lines) and line.strip() and re.fullmatch(r"-{3,}", lines[i + 1].strip()) \
                and not line.startswith(" "):
            current = line.strip()
            out[current] = []
            continue
        if re.fullmatch(r"-{3,}", line.strip()):
            continue
        if current is not None:
            out[current].append(line)
    return out


def _documented_parameters(block: List[str]) -> List[str]:
    names = []
    for line in block:
        if line and not line.startswith(" "):  # an entry's head: "a, b : type"
            for n in line.split(" : ")[0].split(","):
                names.append(n.strip().lstrip("*"))
    return names


@pytest.mark.parametrize("name,function", FUNCTIONS, ids=[n for n, _ in FUNCTIONS])
def test_parameters_section_names_the_runtime_signature(name, function):
    params = list(inspect.signature(function).parameters)
    sections = _sections(function.__doc__ or "")
    if not params:
        return
    assert "Parameters" in sections, f"{name}: no Parameters section"
    assert _documented_parameters(sections["Parameters"]) == params, name
    assert "Returns" in sections, f"{name}: no Returns section"


def _is_model(function: Any) -> bool:
    try:
        wetboil.model_of(function)
    except Exception:
        return False
    return True


MODEL_FUNCTIONS = [(n, f) for n, f in FUNCTIONS if _is_model(f)]


@pytest.mark.parametrize("name,function", MODEL_FUNCTIONS, ids=[n for n, _ in MODEL_FUNCTIONS])
def test_model_functions_cite_their_sources(name, function):
    assert "References" in _sections(function.__doc__ or ""), f"{name}: a model with no References section"


@pytest.mark.parametrize("name,function", FUNCTIONS, ids=[n for n, _ in FUNCTIONS])
def test_a_returns_promising_dataarray_also_promises_series(name, function):
    returns = _sections(function.__doc__ or "").get("Returns", [])
    heads = [line for line in returns if line and not line.startswith(" ")]
    for head in heads:
        if "DataArray" in head:
            assert "Series" in head, f"{name}: Returns {head!r} omits the Series a pandas input gives"


def test_dimensionless_size_of_the_documented_parameters():
    # Lienhard & Dhir (1973), L' = L [g (rho_l - rho_v) / sigma]^(1/2): worked by hand.
    w = fluids.Saturation(T=373.15, p=101325.0, rho_l=957.9, rho_v=0.5955, h_lv=2257e3, sigma=58.9e-3)
    assert chf.dimensionless_size(size=0.30, fluid=w, g=9.8) == pytest.approx(
        0.30 * np.sqrt(9.8 * (957.9 - 0.5955) / 58.9e-3), rel=1e-12)


def test_split_surface_tension_labels_each_component():
    # Both halves used to keep the total's label ("sigma"), so xarray.merge of
    # the two failed and a Series of the dispersive part read as the total.
    xr = pytest.importorskip("xarray")
    pd = pytest.importorskip("pandas")
    sigma = fluids.water(T=xr.DataArray([300.0, 400.0], dims="T")).sigma  # named "sigma", units N/m
    d, p = wetting.split_surface_tension(sigma)
    assert (d.name, p.name) == ("sigma_dispersive", "sigma_polar")
    assert d.attrs["units"] == p.attrs["units"] == "N/m"
    merged = xr.merge([d, p])
    # water 21.8 of 72.8 mN/m dispersive (F.M. Fowkes, Ind. Eng. Chem. 56(12) (1964) 40-52)
    np.testing.assert_allclose(merged["sigma_dispersive"] / sigma, 21.8 / 72.8, rtol=1e-12)
    np.testing.assert_allclose(merged["sigma_polar"] / sigma, 51.0 / 72.8, rtol=1e-12)
    s = pd.Series([0.0589, 0.0500], index=["a", "b"], name="sigma")
    d, p = wetting.split_surface_tension(s)
    assert (d.name, p.name, list(d.index)) == ("sigma_dispersive", "sigma_polar", ["a", "b"])
    assert d.attrs["units"] == "N/m"
    assert isinstance(wetting.split_surface_tension(0.0589)[0], float)
