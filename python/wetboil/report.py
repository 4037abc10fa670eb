"""Study specifications (TOML), their sweep, and the files a study writes:
the Dataset (netCDF), a ranked CSV summary, PNG plots and a Markdown report
with inputs, methods and references, validity flags and the cautions. In the
CSV summary a surface name that starts with ``=``, ``+``, ``-`` or ``@`` gets
a leading apostrophe (``'=...``), so that a spreadsheet shows it as text
instead of running it as a formula; the Dataset keeps the names as given.

Spec format (every key optional unless marked)::

    [study]
    title = "Coating screen for ..."          # shown in the report
    fluid = "water"                           # "water" (built in) or a CoolProp name
    pressures_Pa = [101325.0, 5e5]            # or temperatures_K = [...]   (one of them required)
    heat_fluxes_W_m2 = [3e5, 5e5]             # design heat fluxes (required)
    orientations_deg = [0.0, 90.0]            # default [0.0]
    subcoolings_K = [0.0]                     # default [0.0]
    surfaces_file = "surfaces.toml"           # .toml or .csv, relative to the spec; or [[surface]] tables below
    chunks = 200000                           # optional: run lazily on dask in chunks of this many points
    dispersive_fraction = 0.5                 # optional: dispersive part of the fluid's surface tension (0-1),
                                              # for probe-liquid surfaces in a fluid other than water or a
                                              # saturated hydrocarbon (see wetboil.wetting.dispersive_fraction)

    [fluid_properties]                        # optional: saturated-state fields in SI units (any of
    sigma = 0.0108                            # wetboil.fluids.UNITS but T and p), one number for every
    k_l = [0.059, 0.057]                      # state or one per pressure/temperature; for what CoolProp
                                              # has no model for (e.g. a dielectric fluid's surface
                                              # tension and transport properties) or to override it

    [methods]                                 # optional, see wetboil.sweep.METHOD_CHOICES
    onset = "hsu"
    departure = "fritz"
    frequency = "zuber"
    nucleate = "auto"
    chf = ["kandlikar", "zuber"]

    [[surface]]                               # as in wetboil.load_surfaces
    name = "..."
    static_deg = 70.0
    advancing_deg = 80.0
    receding_deg = 45.0
"""

from __future__ import annotations

import datetime as _dt
import math
import pathlib
import re
import shutil
import tempfile
from typing import Any, Dict, List, Optional, Tuple

import numpy as np

from ._errors import WetboilError, WetboilValueError, WetboilWarning, _warn, dropped_warnings
from .surface import Surface, _check_utf8, _csv_text, _from_toml, _loads_toml, load_surfaces

__all__ = ["SpecError", "Study", "load_spec", "run_study", "CAUTION", "RANKING_RULE"]

CAUTION = (
    "CAUTION: critical heat flux and burnout predictions carry correlation uncertainty of tens of "
    "percent and hold only inside each correlation's published validity range. Apply safety margins "
    "and defer to the codes and licensed engineering practice that govern your application."
)

_STUDY_KEYS: Dict[str, type] = {
    "title": str, "fluid": str, "pressures_Pa": list, "temperatures_K": list, "heat_fluxes_W_m2": list,
    "orientations_deg": list, "subcoolings_K": list, "surfaces_file": str, "chunks": int,
    "lab": str, "product": str, "dispersive_fraction": float,
}
_TOP_KEYS = ("study", "methods", "surface", "fluid_properties")


class SpecError(WetboilValueError):
    """A study specification is wrong; the message names the file, line and key."""


class Study:
    """A parsed, checked study specification."""

    def __init__(self, title: str, fluid: str, axis: str, states: List[float], heat_fluxes: List[float],
                 orientations: List[float], subcoolings: List[float], methods: Dict[str, Any],
                 surfaces: List[Surface], chunks: Optional[int] = None, meta: Optional[Dict[str, str]] = None,
                 dispersive_fraction: Optional[float] = None, fluid_properties: Optional[Dict[str, Any]] = None):
        self.title, self.fluid, self.axis, self.states = title, fluid, axis, states
        self.fluid_properties = fluid_properties or {}
        self.dispersive_fraction = dispersive_fraction
        self.heat_fluxes, self.orientations, self.subcoolings = heat_fluxes, orientations, subcoolings
        self.methods, self.surfaces, self.chunks, self.meta = methods, surfaces, chunks, meta or {}


def _line(text: str, key: str, section: Optional[str] = None) -> int:
    lines = text.splitlines()
    start = 0
    if section is not None:
        for i, line in enumerate(lines):
            if re.match(rf"^\s*\[{re.escape(section)}\]\s*$", line):
                start = i
                break
    pat = re.compile(rf"^\s*\"?{re.escape(key)}\"?\s*=")
    for i in range(start, len(lines)):
        if pat.match(lines[i]):
            return i + 1
    # a table header: [key], [[key]] or, inside a section, [section.key]
    head = re.escape(key) if section is None else rf"(?:{re.escape(section)}\s*\.\s*)?{re.escape(key)}"
    for i, line in enumerate(lines):
        if re.match(rf"^\s*\[+\s*{head}\s*\]+\s*$", line):
            return i + 1
    return 0


def load_spec(path: Any) -> Study:
    """Read and check a study specification (see the module docstring)."""
    from .sweep import METHOD_CHOICES, _methods

    path = pathlib.Path(path)
    if not path.exists():
        raise SpecError(f"{path}: no such file")
    _check_utf8(path, SpecError)  # TOML is UTF-8, whatever the locale's encoding
    text = path.read_text(encoding="utf-8")
    data = _loads_toml(text, path, SpecError)

    def fail(key: str, msg: str, section: Optional[str] = None) -> SpecError:
        line = _line(text, key, section)
        return SpecError(f"{path}:{line}: {msg}" if line else f"{path}: {msg}")

    for key in data:
        if key not in _TOP_KEYS:
            raise fail(key, f"unknown section or key {key!r}; known: {', '.join(_TOP_KEYS)}")
    study = data.get("study")
    if not isinstance(study, dict):
        raise SpecError(f"{path}: missing [study] section")
    for key, value in study.items():
        if key not in _STUDY_KEYS:
            raise fail(key, f"unknown key {key!r} in [study]; known keys: {', '.join(_STUDY_KEYS)}", "study")
        want = _STUDY_KEYS[key]
        if want is float and isinstance(value, int) and not isinstance(value, bool):
            value = study[key] = float(value)
        if want is list and not isinstance(value, list):
            value = [value]
            study[key] = value
        if not isinstance(value, want) or isinstance(value, bool):
            raise fail(key, f"[study] {key} must be a {want.__name__}", "study")
        if isinstance(value, list):
            if not value:
                raise fail(key, f"[study] {key} is empty: give at least one value", "study")
            if not all(isinstance(v, (int, float)) and not isinstance(v, bool) and math.isfinite(v) for v in value):
                raise fail(key, f"[study] {key} must hold finite numbers", "study")
    fluid = study.get("fluid", "water")
    if ("pressures_Pa" in study) == ("temperatures_K" in study):
        raise fail("study", "[study] needs exactly one of pressures_Pa or temperatures_K")
    axis = "p" if "pressures_Pa" in study else "T"
    states = [float(v) for v in study["pressures_Pa" if axis == "p" else "temperatures_K"]]
    if "heat_fluxes_W_m2" not in study:
        raise fail("study", "[study] needs heat_fluxes_W_m2 (the design heat fluxes)")
    fluxes = [float(v) for v in study["heat_fluxes_W_m2"]]
    if any(q <= 0 for q in fluxes):
        raise fail("heat_fluxes_W_m2", "[study] heat_fluxes_W_m2 must be positive", "study")
    # a heater's orientation is 0 (facing up) to 180 deg (facing down); a negative subcooling is a
    # superheated pool, which no correlation of the chain describes
    orientations = [float(v) for v in study.get("orientations_deg", [0.0])]
    if any(not 0.0 <= v <= 180.0 for v in orientations):
        raise fail("orientations_deg", "[study] orientations_deg must lie in 0-180 (0 facing up, 90 vertical, "
                                       "180 facing down)", "study")
    subcoolings = [float(v) for v in study.get("subcoolings_K", [0.0])]
    if any(v < 0.0 for v in subcoolings):
        raise fail("subcoolings_K", "[study] subcoolings_K must be zero or positive [K]", "study")
    if fluid.lower() != "water":
        try:
            import CoolProp.CoolProp as CP

            CP.PropsSI("Tcrit", fluid)
        except ImportError:
            raise fail("fluid", f"[study] fluid {fluid!r} needs CoolProp (pip install CoolProp); "
                                "'water' is built in", "study") from None
        except ValueError:
            raise fail("fluid", f"[study] unknown fluid {fluid!r} (not 'water' and not a CoolProp name)",
                       "study") from None
    given = data.get("fluid_properties", {})
    if not isinstance(given, dict):
        raise fail("fluid_properties", "[fluid_properties] must be a table")
    from .fluids import FIELDS, UNITS
    from .wetting import _TENSION_MAX

    for key, value in given.items():
        if key not in FIELDS or key in ("T", "p"):
            raise fail(key, f"unknown key {key!r} in [fluid_properties]; known keys (SI units): "
                            f"{', '.join(f'{f} [{UNITS[f]}]' for f in FIELDS if f not in ('T', 'p'))}",
                       "fluid_properties")
        values = value if isinstance(value, list) else [value]
        if not all(isinstance(v, (int, float)) and not isinstance(v, bool) and math.isfinite(v) and v > 0
                   for v in values):
            raise fail(key, f"[fluid_properties] {key} must be a positive number [{UNITS[key]}] or a list of them",
                       "fluid_properties")
        if key == "sigma" and max(values) > _TENSION_MAX:
            raise fail(key, f"[fluid_properties] sigma = {max(values):g} N/m is above {_TENSION_MAX:g} N/m, the bound "
                            "every model flags as a value typed in mN/m: give it in N/m (x 1e-3)",
                       "fluid_properties")
        if isinstance(value, list) and len(value) != len(states):
            raise fail(key, f"[fluid_properties] {key} has {len(value)} values for {len(states)} "
                            f"{'pressures' if axis == 'p' else 'temperatures'}: give one number or one per state",
                       "fluid_properties")
        given[key] = [float(v) for v in value] if isinstance(value, list) else float(value)
    methods = data.get("methods", {})
    if not isinstance(methods, dict):
        raise fail("methods", "[methods] must be a table")
    for key, value in methods.items():
        if key not in METHOD_CHOICES:
            raise fail(key, f"unknown key {key!r} in [methods]; known keys: {', '.join(METHOD_CHOICES)}", "methods")
        values = [value] if isinstance(value, str) else value
        if not isinstance(values, list) or not values:
            raise fail(key, f"[methods] {key} must be a method name or a non-empty list", "methods")
        for v in values:
            if v not in METHOD_CHOICES[key]:
                raise fail(key, f"[methods] {key}: unknown method {v!r}; choices: {', '.join(METHOD_CHOICES[key])}",
                           "methods")
    methods = _methods(methods)
    surfaces: List[Surface] = []
    if "surfaces_file" in study:
        sf = (path.parent / study["surfaces_file"]).resolve()
        try:
            surfaces = load_surfaces(sf)
        except WetboilError as exc:
            raise SpecError(f"{path}:{_line(text, 'surfaces_file', 'study')}: surfaces_file: {exc}") from None
    if "surface" in data:
        surfaces += _from_toml(path)
    if not surfaces:
        raise SpecError(f"{path}: no surfaces: give [study] surfaces_file or [[surface]] tables")
    names = [s.name for s in surfaces]
    dup = sorted({n for n in names if names.count(n) > 1})
    if dup:
        raise SpecError(f"{path}:{_line(text, 'name')}: duplicate surface name(s) {dup}")
    chunks = study.get("chunks")
    if chunks is not None and chunks < 1:
        raise fail("chunks", "[study] chunks must be a positive integer", "study")
    # states without a saturated state (kPa given as Pa, a temperature in deg C...) and methods
    # that do not apply to the fluid: spec errors here, before anything is computed or written
    from .sweep import _method_fluid_problem, _states_outside_range

    problem = _states_outside_range(fluid, axis, states)
    if problem:
        key = "pressures_Pa" if axis == "p" else "temperatures_K"
        raise fail(key, f"[study] {key}: {problem}", "study")
    problem = _method_fluid_problem(methods, fluid)
    if problem:
        raise fail("onset", f"[methods] {problem}", "methods")
    fraction = study.get("dispersive_fraction")
    if fraction is not None and not 0.0 <= fraction <= 1.0:
        raise fail("dispersive_fraction", "[study] dispersive_fraction must lie in 0-1", "study")
    probed = [s.name for s in surfaces if s.probe_static_deg is not None]
    if probed and fraction is None:
        from .wetting import dispersive_fraction

        try:
            dispersive_fraction(fluid)
        except WetboilValueError as exc:
            raise fail("fluid", f"[study] surface(s) {probed} are described by probe-liquid angles, and {exc}; "
                                "set [study] dispersive_fraction", "study") from None
    return Study(
        title=study.get("title", path.stem), fluid=fluid, axis=axis, states=states, heat_fluxes=fluxes,
        orientations=orientations,
        subcoolings=subcoolings,
        methods=methods, surfaces=surfaces, chunks=chunks,
        meta={k: study[k] for k in ("lab", "product") if k in study}, dispersive_fraction=fraction,
        fluid_properties=given,
    )


def _chunk_sizes(study: Study, target: int) -> Dict[str, int]:
    """Chunks of about `target` points: split the surface and state axes."""
    inner = len(study.heat_fluxes) * len(study.orientations) * len(study.subcoolings)
    per_state = max(1, target // max(1, inner * len(study.surfaces)))
    return {"surface": len(study.surfaces), study.axis: min(len(study.states), per_state)}


def _question_heat_fluxes(ds: Any, study: Study, spec_text: str) -> None:
    """One `WetboilWarning` when every predicted CHF margin is above `wetboil.sweep._MARGIN_SLIP`, naming the
    spec line of the heat fluxes (the sweep's own question is silenced for the study)."""
    from .sweep import _margin_slip

    slip = _margin_slip(ds)
    if slip:
        line = _line(spec_text, "heat_fluxes_W_m2", "study") if spec_text else 0
        where = f"line {line}: " if line else ""
        _warn(where + slip, WetboilWarning)


def run_study(study: Study, out: pathlib.Path, *, progress: bool = False, spec_text: str = "") -> pathlib.Path:
    """Sweep the study and write its files into `out`; return the report path.

    Files are written into a scratch folder inside `out` and moved into place
    only when everything succeeded, so a failed run leaves no partial output
    that looks complete.
    """
    from .sweep import _QUIET_SLIP, ranked_table, sweep

    out.mkdir(parents=True, exist_ok=True)
    try:
        scratch = pathlib.Path(tempfile.mkdtemp(prefix=".partial-", dir=out))
    except OSError as exc:  # a read-only folder: say so, not the scratch folder's random name
        raise WetboilValueError(f"{out}: cannot write into the output folder ({exc.strerror or exc})") from None
    try:
        kw: Dict[str, Any] = {"p" if study.axis == "p" else "T": study.states}
        if study.chunks:
            kw["chunks"] = _chunk_sizes(study, study.chunks)
            kw["progress"] = progress
        quiet = _QUIET_SLIP.set(True)  # asked below with the spec line instead
        try:
            ds = sweep(study.surfaces, study.fluid, heat_flux=study.heat_fluxes, orientation_deg=study.orientations,
                       subcooling=study.subcoolings, methods=study.methods,
                       dispersive_fraction=study.dispersive_fraction,
                       fluid_properties=study.fluid_properties or None, **kw)
        finally:
            _QUIET_SLIP.reset(quiet)
        ds.attrs["title"] = study.title
        _question_heat_fluxes(ds, study, spec_text)
        ds.to_netcdf(scratch / "sweep.nc")
        summary = ranked_table(ds)
        # surface names as text a spreadsheet will not run as a formula (demo.print_ranking reads them back)
        summary.assign(surface=summary["surface"].astype(str).map(_csv_text)).to_csv(scratch / "summary.csv",
                                                                                   index=False)
        plots = _plots(ds, study, scratch)
        report = scratch / "report.md"
        report.write_text(_report_text(study, ds, summary, plots, spec_text))
        for f in scratch.iterdir():
            shutil.move(str(f), str(out / f.name))
        return out / "report.md"
    finally:
        shutil.rmtree(scratch, ignore_errors=True)


def _plots(ds: Any, study: Study, folder: pathlib.Path) -> List[Tuple[str, str]]:
    # the sweep already recorded every validity flag; the plots repeat its calls
    with dropped_warnings():  # this thread's only (warnings.catch_warnings is process-wide)
        return _draw(ds, study, folder)


def _draw(ds: Any, study: Study, folder: pathlib.Path) -> List[Tuple[str, str]]:
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    from . import boiling, chf
    from .fluids import from_coolprop, water

    made: List[Tuple[str, str]] = []
    axis = study.axis

    def saturated(v: float) -> Any:
        with dropped_warnings():  # an impossible state is the sweep's to report, not the figures'
            st = (water(p=v) if axis == "p" else water(T=v)) if study.fluid.lower() == "water" else (
                from_coolprop(study.fluid, p=v) if axis == "p" else from_coolprop(study.fluid, T=v))
        i = study.states.index(v)  # the spec's own properties of this state, as the sweep used them
        given = {f: (x[i] if isinstance(x, list) else x) for f, x in study.fluid_properties.items()}
        return st.replace(**given) if given and np.isfinite(st.T) else st

    # the figures use the first state that has a saturated state (a Study built in code may list others)
    first, state = next(((v, st) for v in study.states for st in [saturated(v)] if np.isfinite(st.T)),
                        (study.states[0], saturated(study.states[0])))
    label = f"{first / 1e5:g} bar" if axis == "p" else f"{first:g} K"

    # 1. boiling curves per surface at the first pressure. A surface whose curve has no critical heat
    # flux (e.g. Kandlikar facing down, where the model has no answer) is left out of the plot and the
    # legend, and the caption says why: what would remain is the film branch alone, which does not
    # depend on wettability and hides behind the other surfaces' film branches.
    fig, ax = plt.subplots(figsize=(7.5, 5))
    superheat = np.geomspace(0.5, 1500.0, 400)
    design, phi0 = study.heat_fluxes[0], study.orientations[0]
    missing: List[str] = []
    reasons: List[str] = []
    for s in study.surfaces:
        with dropped_warnings():
            a = s.angles(state, dispersive_fraction=study.dispersive_fraction)
            rec, sta = float(np.asarray(a.receding_deg)), float(np.asarray(a.static_deg))
            try:
                c = boiling.curve(state, superheat, receding_angle_deg=rec, contact_angle_deg=sta,
                                  orientation_deg=phi0, nucleate=_nucleate_method(study, s),
                                  C_sf=s.C_sf, n=s.n if s.C_sf else None, roughness_Rp=s.Rp or 1e-6,
                                  natural_convection_coefficient=1000.0, design_heat_flux=design)
            except WetboilValueError as exc:  # a fluid without some property (CoolProp has no model for it)
                c, why = None, str(exc).replace("boiling.curve: ", "")
        reason = why if c is None else _no_curve_reason(c, rec, phi0)
        if reason:
            missing.append(s.name)
            reasons.append(f"{s.name} ({reason})")
            continue
        ax.plot(superheat, c["heat_flux"].values, label=s.name)
    ax.axhline(design, color="k", ls="--", lw=1, label="design heat flux")
    ax.set_xscale("log")  # set here, also when no surface has a curve to draw
    ax.set_yscale("log")
    ax.set_xlabel("wall superheat [K]")
    ax.set_ylabel("heat flux [W/m2]")
    ax.set_title(f"Pool-boiling curves, {study.fluid} at {label}, orientation {phi0:g} deg")
    ax.set_ylim(1e3, None)
    ax.grid(alpha=0.3, which="both")
    ax.legend(fontsize=7)
    fig.tight_layout()
    if missing:  # a footnote under the axes; the report's caption gives the reasons
        fig.text(0.01, 0.01, "no curve drawn (reason in the report): " + "; ".join(missing), fontsize=7,
                 va="bottom")
        fig.subplots_adjust(bottom=fig.subplotpars.bottom + 0.04)
    fig.savefig(folder / "boiling_curves.png", dpi=110)
    plt.close(fig)
    caption = ("Assembled pool-boiling curves per surface (natural convection h = 1000 W/m2K assumed; transition "
               "branch is a log-log construction).")
    if reasons:
        caption += " No curve: " + "; ".join(reasons) + "."
    made.append(("boiling_curves.png", caption))

    # 2. CHF against receding angle and orientation
    fig, ax = plt.subplots(figsize=(7.5, 5))
    beta = np.linspace(0.0, 150.0, 301)
    for phi in sorted(set(study.orientations) | {0.0, 90.0}):
        with dropped_warnings():  # the sweep has flagged and warned already
            q = chf.kandlikar(beta, state, phi) / 1e6
        # an orientation where the model has no answer at any angle gets no legend entry
        ax.plot(beta, q, label=f"Kandlikar (2001), {phi:g} deg" if np.isfinite(q).any() else "_nolegend_")
    no_point: List[str] = []
    for s in study.surfaces:
        with dropped_warnings():
            r = float(np.asarray(s.angles(state, dispersive_fraction=study.dispersive_fraction).receding_deg))
            q = float(chf.kandlikar(r, state, phi0)) / 1e6 if np.isfinite(r) else math.nan
        if not np.isfinite(q):
            lacks = [f for f in ds.attrs.get("fluid_fields_missing", "").split(", ")
                     if f in ("sigma", "rho_l", "rho_v", "h_lv")]  # what Kandlikar's CHF needs
            why = f"the fluid lacks {', '.join(lacks)}" if lacks else _no_chf_reason(r, phi0)
            no_point.append(f"{s.name} ({why})")
            continue
        ax.plot(r, q, "o", ms=6)
        ax.annotate(s.name, (r, q), fontsize=7, textcoords="offset points", xytext=(4, 4))
    for q in study.heat_fluxes:
        ax.axhline(q / 1e6, color="k", ls=":", lw=0.8)
    ax.set_xlabel("receding contact angle [deg]")
    ax.set_ylabel("critical heat flux [MW/m2]")
    ax.set_title(f"CHF against receding angle and orientation, {study.fluid} at {label}")
    ax.grid(alpha=0.3)
    if ax.get_legend_handles_labels()[0]:
        ax.legend(fontsize=7)
    fig.tight_layout()
    fig.savefig(folder / "chf_receding_orientation.png", dpi=110)
    plt.close(fig)
    caption = (f"Kandlikar CHF against receding angle for each orientation; points: the surfaces at {phi0:g} deg; "
               "dotted lines: design heat fluxes.")
    if no_point:
        caption += " No point: " + "; ".join(no_point) + "."
    made.append(("chf_receding_orientation.png", caption))

    # 3. onset superheat map: surface x pressure (first heat flux, orientation, subcooling)
    onset = ds["onset_superheat"].isel(heat_flux=0, orientation=0, subcooling=0)
    fig, ax = plt.subplots(figsize=(7.5, 0.5 * len(study.surfaces) + 2.5))
    values = np.atleast_2d(onset.values)
    im = ax.imshow(values, aspect="auto", cmap="viridis")
    ax.set_yticks(range(len(study.surfaces)))
    ax.set_yticklabels([s.name for s in study.surfaces], fontsize=7)
    ax.set_xticks(range(len(study.states)))
    ax.set_xticklabels([f"{v / 1e5:g}" if axis == "p" else f"{v:g}" for v in study.states], fontsize=7)
    ax.set_xlabel("pressure [bar]" if axis == "p" else "saturation temperature [K]")
    fig.colorbar(im, ax=ax, label="onset superheat [K]")
    ax.set_title(f"Onset-of-boiling superheat at {study.heat_fluxes[0] / 1e3:g} kW/m2")
    fig.tight_layout()
    fig.savefig(folder / "onset_superheat_map.png", dpi=110)
    plt.close(fig)
    made.append(("onset_superheat_map.png", f"Onset superheat by surface and {'pressure' if axis == 'p' else 'temperature'}"
                 f" ({study.methods['onset']} method)."))
    return made


def _no_chf_reason(receding_deg: float, orientation_deg: float) -> str:
    """Why Kandlikar's CHF has no value for a surface at an orientation."""
    if not np.isfinite(receding_deg):
        return "no working-fluid receding angle"
    if orientation_deg > 90.0:
        return (f"Kandlikar (2001) CHF has no answer at receding angle {receding_deg:.1f} deg facing "
                f"{orientation_deg:g} deg, beyond its published validity (0-90 deg)")
    return "no CHF prediction (see the validity flags)"


def _no_curve_reason(curve: Any, receding_deg: float, orientation_deg: float) -> str:
    """Why a `boiling.curve` is not drawn ("" when it is): it has no value at
    all, or no critical heat flux (then only the film branch, which does not
    depend on wettability, would remain)."""
    if not np.isfinite(curve["heat_flux"].values).any():
        return "no value at any superheat"
    if not np.isfinite(float(curve["critical_heat_flux"])):
        return _no_chf_reason(receding_deg, orientation_deg)
    return ""


_METHOD_KERNELS = {
    ("onset", "hsu"): "hsu_onset", ("onset", "davis_anderson"): "davis_anderson_onset",
    ("onset", "kandlikar"): "kandlikar_onset", ("onset", "bergles_rohsenow"): "bergles_rohsenow_onset",
    ("departure", "fritz"): "fritz_departure", ("departure", "cole_rohsenow"): "cole_rohsenow_departure",
    ("departure", "kocamustafaogullari_ishii"): "kocamustafaogullari_ishii_departure",
    ("chf", "kandlikar"): "kandlikar_chf", ("chf", "zuber"): "zuber_chf", ("chf", "lienhard_dhir_flat"): "zuber_chf",
    ("nucleate", "rohsenow"): "rohsenow_superheat", ("nucleate", "cooper"): "cooper_superheat",
}


def _design_flagged(flags: str) -> bool:
    """Whether a row's ``flags`` text names a design quantity: any but the
    per-method ``chf_<method>`` columns kept for comparison."""
    return any(n and not (n.startswith("chf_") and n != "chf_margin") for n in flags.split(", "))


RANKING_RULE = (
    "Ranking rule: each surface is judged by its lowest CHF margin over all its operating points (the design "
    "method's CHF divided by the design heat flux; higher is better, below 1 the design heat flux is above the "
    "predicted CHF). Highest lowest margin first; surfaces without a CHF prediction at some point come after every "
    "surface predicted everywhere (their worst point is unknown; the margin shown is over the points that have one, "
    "and a surface with none comes at the very end). Equal margins: fewer rows with a design quantity outside its "
    "correlation's published validity range (the flagged column) first, then by name. Read the flagged column with "
    "the margin: a flagged CHF is an extrapolation. A margin is a correlation estimate, not a safety factor: see the "
    "cautions."
)


def margin_ranking(summary: Any) -> Any:
    """Per surface of a `summary.csv` table (as `wetboil.screen` returns it):
    the lowest CHF margin over the operating points that have a CHF
    prediction (``lowest_margin``), the points that have none (``no_chf``:
    NaN, e.g. Kandlikar facing down or an impossible input), the rows where a
    design quantity carries a validity flag (``flagged``: the comparison-only
    ``chf_<method>`` columns do not count; the design method's flag is on
    ``chf``) and the points (``points``). Ranked best first by `RANKING_RULE`:
    the lowest margin, highest first, with surfaces lacking a prediction at
    some point after every surface predicted everywhere (their worst point is
    unknown; NaN last); ties by fewer flagged rows, then name."""
    import pandas as pd

    g = summary.groupby("surface", sort=False)
    table = pd.DataFrame({
        "lowest_margin": g["chf_margin [-]"].min(),
        "no_chf": g["chf_margin [-]"].apply(lambda s: int(s.isna().sum())),
        "flagged": g["flags"].apply(lambda s: int(s.astype(object).fillna("").astype(str).map(_design_flagged).sum())),
        "points": g.size(),
    })
    order = table.assign(gap=table["no_chf"] > 0, name=table.index.astype(str)).sort_values(
        ["gap", "lowest_margin", "flagged", "name"], ascending=[True, False, True, True], na_position="last")
    return table.loc[order.index]


def margin_text(row: Any) -> str:
    """The lowest CHF margin of a `margin_ranking` row in words: the number,
    a note below 1 (the design flux above the predicted CHF) and the points
    without a prediction."""
    m, missing, points = float(row["lowest_margin"]), int(row["no_chf"]), int(row["points"])
    text = "no CHF prediction" if math.isnan(m) else f"{m:.2f}"
    if m < 1.0:
        text += " (below 1: design flux above the predicted CHF)"
    if missing and not math.isnan(m):
        text += f"; no CHF prediction at {missing} of {points} points"
    return text


def _cite(m: Any) -> str:
    """A model's references with its DOI, which belongs to the first paper named that has one: with
    several papers the line says so, so that the DOI is not read as that of the last one named."""
    if not m.doi:
        return str(m.reference)
    return f"{m.reference}; doi:{m.doi}" + (" (of the first of these that has one)" if ";" in m.reference else "")


def _references(study: Study) -> List[str]:
    from . import models

    by_name = {m.name: m for m in models()}
    refs = []
    for key, value in study.methods.items():
        for v in (value if isinstance(value, tuple) else (value,)):
            if v == "auto":  # both, where surfaces use them
                uses = {"cooper" if s.C_sf is None else "rohsenow" for s in study.surfaces}
                for u in sorted(uses):
                    m = by_name[f"{u}_superheat"]
                    refs.append(f"- **{key}: auto ({u})** -- {_cite(m)}")
                continue
            found = by_name.get(_METHOD_KERNELS.get((key, v), ""))
            if found is None:
                found = next((mm for mm in by_name.values() if v.split("_")[0] in mm.name and key[:3] in mm.name),
                             None)
            ref = _cite(found) if found else "see wetboil.models()"
            refs.append(f"- **{key}: {v}** -- {ref}")
    refs.append("- **properties** -- " + (by_name["water_saturation_p"].reference if study.fluid.lower() == "water"
                                          else "CoolProp (Bell et al., Ind. Eng. Chem. Res. 53 (2014) 2498-2508)"))
    return refs


def _nucleate_method(study: Study, s: Surface) -> str:
    """The nucleate correlation the sweep uses for surface `s` (as `wetboil.sweep` decides it)."""
    method = study.methods["nucleate"]
    return method if method != "auto" else ("rohsenow" if s.C_sf is not None else "cooper")


def _cell(text: str) -> str:
    """`text` as one Markdown table cell: line breaks become spaces and pipes are escaped (GitHub
    Flavored Markdown, tables: ``\\|`` is a literal pipe inside a cell)."""
    return " ".join(str(text).split()).replace("|", "\\|")


def _nucleate_cell(study: Study, s: Surface) -> str:
    """Which nucleate-boiling correlation the sweep used for surface `s`, with its constants."""
    from .boiling import ROHSENOW_C_SF_DEFAULT, ROHSENOW_N_OTHER, ROHSENOW_N_WATER
    from .fluids import _is_water

    if _nucleate_method(study, s) == "cooper":
        return f"Cooper, R_p {(s.Rp if s.Rp is not None else 1e-6) * 1e6:g} um"
    c_sf = f"C_sf {s.C_sf:g}" if s.C_sf is not None else f"C_sf {ROHSENOW_C_SF_DEFAULT:g} (water on polished copper)"
    if s.C_sf is not None and s.n is not None:
        return f"Rohsenow, {c_sf}, n {s.n:g}"
    n = ROHSENOW_N_WATER if _is_water(study.fluid) else ROHSENOW_N_OTHER
    return f"Rohsenow, {c_sf}, n {n:g} (the fluid's)"


def _state_label(study: Study, value: float) -> str:
    return f"{value / 1e5:g} bar" if study.axis == "p" else f"{value:g} K"


def _per_state(ds: Any, name: str, surface: str, axis: str) -> List[float]:
    """A per-surface input (the angles) at each state of the study: the
    angles depend on the fluid state only (predicted from probe liquids, or
    roughened with the liquid's properties), not on the heat flux,
    orientation or subcooling."""
    v = ds[name].sel(surface=surface)
    v = v.isel({d: 0 for d in v.dims if d != axis})
    return [float(x) for x in np.atleast_1d(v.values)]


def _angle_cell(ds: Any, name: str, surface: str, axis: str) -> str:
    """One number when the angle is the same at every state, else one per
    state in the study's order, separated by " / "."""
    cells = ["n/a" if not math.isfinite(x) else f"{x:.1f}" for x in _per_state(ds, name, surface, axis)]
    return cells[0] if len(set(cells)) == 1 else " / ".join(cells)


def _angles_caption(study: Study, ds: Any) -> str:
    states = [float(v) for v in np.atleast_1d(ds[study.axis].values)] if study.axis in ds.dims else study.states
    what = "pressure" if study.axis == "p" else "saturation temperature"
    if len(states) == 1:
        return f"Working-fluid contact angles at {_state_label(study, states[0])}."
    return (f"Working-fluid contact angles at each {what}: {' / '.join(_state_label(study, v) for v in states)}. "
            f"One number: the same at every {what}; otherwise one value per {what} in this order.")


def _report_text(study: Study, ds: Any, summary: Any, plots: List[Tuple[str, str]], spec_text: str) -> str:
    from . import __version__
    bits = ds["range_flags"].attrs["bits"].split(",")
    flagged = {name: int(((ds["range_flags"].values >> i) & 1).sum()) for i, name in enumerate(bits)}
    flagged = {k: v for k, v in flagged.items() if v}
    impossible = {name: int(((ds["invalid_flags"].values >> i) & 1).sum()) for i, name in enumerate(bits)}
    impossible = {k: v for k, v in impossible.items() if v}
    n = int(ds["chf"].size)
    axis_name = "pressures [Pa]" if study.axis == "p" else "saturation temperatures [K]"
    lines = [
        f"# {study.title}",
        "",
        f"Generated by wetboil {__version__} on {_dt.datetime.now().strftime('%Y-%m-%d %H:%M')}.",
        "",
        f"> {CAUTION}",
        "",
        "## Inputs",
        "",
    ]
    for k, v in study.meta.items():
        lines.append(f"- {k}: {v}")
    lines += [
        f"- fluid: {study.fluid}",
        *([f"- fluid properties given in the spec (SI; they replace CoolProp's or fill its gaps): "
           f"{ds.attrs['fluid_properties_given']}"] if ds.attrs.get("fluid_properties_given") else []),
        *([f"- fluid properties missing at every state (no model in CoolProp): {ds.attrs['fluid_fields_missing']}; "
           "every quantity that needs one is NaN. Give them in the spec's [fluid_properties] table"] if ds.attrs.get("fluid_fields_missing") else []),
        *([f"- dispersive fraction of its surface tension, for the angles predicted from probe liquids: "
           f"{ds.attrs['dispersive_fraction']:.4g} ({'given in the spec' if study.dispersive_fraction is not None else 'tabulated, wetboil.wetting.DISPERSIVE_FRACTIONS'})"]
          if "dispersive_fraction" in ds.attrs else []),
        f"- {axis_name}: {', '.join(f'{v:g}' for v in study.states)}",
        f"- design heat fluxes [W/m2]: {', '.join(f'{v:g}' for v in study.heat_fluxes)}",
        f"- orientations [deg]: {', '.join(f'{v:g}' for v in study.orientations)}",
        f"- subcoolings [K]: {', '.join(f'{v:g}' for v in study.subcoolings)}"
        + ("" if not any(v > 0 for v in study.subcoolings) else
           " (the onset, nucleate and CHF correlations here are for saturated pool boiling: subcooled rows carry "
           "the saturated values, no subcooling correction; subcooling raises the CHF, so the margins shown are "
           "the saturated, conservative ones)"),
        f"- grid points: {n}",
        "",
        "### Surfaces",
        "",
        _angles_caption(study, ds),
        "",
        "| surface | static [deg] | advancing [deg] | receding [deg] | nucleate boiling | notes |",
        "|---|---|---|---|---|---|",
    ]
    for s in study.surfaces:
        a, b, c = (_angle_cell(ds, name, s.name, study.axis)
                   for name in ("static_angle", "advancing_angle", "receding_angle"))
        intrinsic = s.angles_are == "intrinsic"
        src = "from probe liquids" if s.probe_static_deg else ("measured" if intrinsic else "as measured")
        if intrinsic:  # the conversion Surface.angles applies
            src += (f"; intrinsic, Cassie-Baxter (f = {s.solid_fraction:g}, r = {s.roughness_ratio:g})"
                    if s.solid_fraction is not None else f"; intrinsic, Wenzel (r = {s.roughness_ratio:g})")
        lines.append(f"| {_cell(s.name)} | {a} | {b} | {c} | {_nucleate_cell(study, s)} | "
                     f"{_cell(src + ('; ' + s.notes if s.notes else ''))} |")
    lines += ["", "## Methods and references", ""] + _references(study)
    lines += ["", "## Ranking (best worst-case CHF margin first)", "", RANKING_RULE, ""]
    ranking = margin_ranking(summary)
    lines += ["| surface | lowest CHF margin over the operating points | rows with a design quantity flagged |", "|---|---|---|"]
    lines += [f"| {_cell(name)} | {margin_text(r)} | {int(r['flagged'])} of {int(r['points'])} |"
              for name, r in ranking.iterrows()]
    lines += ["", "Full table: `summary.csv` (one row per surface and operating point); all quantities: `sweep.nc`.",
              "", "## Validity flags", ""]
    if flagged:
        lines.append("Quantities computed outside a correlation's published validity range (extrapolated):")
        lines += [f"- {k}: {v} of {n} points" for k, v in flagged.items()]
    else:
        lines.append("No quantity left its correlation's published validity range.")
    if impossible:
        lines.append("")
        from .sweep import STATE_FLAG

        state_note = " (the fluid has no saturated state there: outside triple point to critical point)"
        lines.append("Quantities without a value because an input was physically impossible:")
        lines += [f"- {k}{state_note if k == STATE_FLAG else ''}: {v} of {n} points" for k, v in impossible.items()]
    over = (ds["onset_superheat"] - ds["nucleate_superheat"]).max(
        [d for d in ds["onset_superheat"].dims if d != "surface"])
    over = {s: float(v) for s, v in zip(over["surface"].values, over.values) if v > 0}
    if over:
        lines += ["", "Incipience overshoot: by these correlations the onset superheat exceeds the nucleate "
                  "superheat at the same design heat flux, so the wall would overshoot to the onset superheat "
                  "before boiling starts and then fall to the nucleate curve (boiling hysteresis); Hsu's active "
                  "cavity range is empty (NaN) at those points. Largest overshoot per surface: "
                  + "; ".join(f"{s} {v:.1f} K" for s, v in over.items()) + "."]
    chf_methods = study.methods["chf"] if isinstance(study.methods["chf"], tuple) else (study.methods["chf"],)
    wetting = {str(k): float(v) for k, v in zip(ds["surface"].values, ds["receding_angle"].min(
        [d for d in ds["receding_angle"].dims if d != "surface"]).values) if v < 20.0}
    if chf_methods[0] == "kandlikar" and wetting:
        # Kandlikar's constant (1 + cos b)/16 [2/pi + (pi/4)(1 + cos b)]^(1/2) facing up: 0.178 at 20 deg,
        # 0.186 at 0, against Zuber's pi/24 = 0.131 (wetboil.chf.kandlikar)
        lines += ["", "Well-wetting surfaces: at receding angles below 20 deg Kandlikar's CHF, the design method "
                  "here, is 1.36 to 1.42 times Zuber's facing up, while plain surfaces in well-wetting liquids "
                  "(refrigerants, dielectric coolants, cryogens) have measured near Zuber's value (from memory). "
                  "Compare the Zuber margin (`chf_zuber` in `sweep.nc`, with \"zuber\" among the CHF methods) before "
                  "relying on these: "
                  + "; ".join(f"{k} {v:.0f} deg" for k, v in wetting.items()) + "."]
    lines += ["", "## Plots", ""]
    for f, caption in plots:
        lines += [f"![{caption}]({f})", "", caption, ""]
    if spec_text:
        lines += ["## Specification", "", "```toml", spec_text.rstrip(), "```", ""]
    lines += ["## Cautions", "", CAUTION, "",
              "Contact angles change with temperature, ageing, oxidation and fouling in service; "
              "re-measure on aged coupons before relying on a wettability-driven margin.", ""]
    return "\n".join(lines)
