"""A surface treatment described once: its wettability, roughness and what
else the boiling models need, loaded from and saved to plain TOML or CSV."""

from __future__ import annotations

import csv
import math
import pathlib
import re
from typing import Any, Dict, Iterable, List, Mapping, NamedTuple, Optional, Tuple, Union

import numpy as np

from ._errors import WetboilTypeError, WetboilValueError, WetboilWarning, _warn, one_warning_per_category
from .fluids import Saturation, _is_water

try:  # Python >= 3.11
    import tomllib as _toml
except ModuleNotFoundError:  # pragma: no cover
    import tomli as _toml  # type: ignore[no-redef,import-not-found]

__all__ = ["Surface", "WorkingAngles", "load_surfaces", "save_surfaces", "SurfaceFileError"]

_ANGLE_KEYS = ("static_deg", "advancing_deg", "receding_deg")
_PROBE_KEYS = ("probe_static_deg", "probe_advancing_deg", "probe_receding_deg")
_NUMBER_KEYS = ("roughness_ratio", "solid_fraction", "Rp", "C_sf", "n", "cavity_radius", "cavity_half_angle_deg")
_KEYS = ("name",) + _ANGLE_KEYS + ("angles_are",) + _NUMBER_KEYS + _PROBE_KEYS + ("notes",)


class SurfaceFileError(WetboilValueError):
    """A surface file could not be read: the message names the file, the key
    and the line."""


class WorkingAngles(NamedTuple):
    """Apparent static, advancing and receding angles [deg] of the working
    fluid on a surface (through the liquid)."""

    static_deg: Any
    advancing_deg: Any
    receding_deg: Any


def _error(cls: type, owner: str, message: str, key: str = "name", liquid: Optional[str] = None) -> Exception:
    """A `Surface` error ``surface 'owner': message`` that carries the
    offending `key` (and probe `liquid`), for its line in a surface file."""
    exc = cls(f"surface {owner!r}: {message}")
    exc.key, exc.liquid = key, liquid
    return exc


def _number(owner: str, key: str, value: Any, lo: float = -math.inf, hi: float = math.inf,
            lo_open: bool = False, liquid: Optional[str] = None) -> Optional[float]:
    if value is None:
        return None
    label = key if liquid is None else f"{key}.{liquid}"
    if isinstance(value, bool) or not isinstance(value, (int, float, np.integer, np.floating)):
        raise _error(WetboilTypeError, owner, f"{label} must be a number, got {type(value).__name__}", key, liquid)
    v = float(value)
    bad = not math.isfinite(v) or v > hi or (v <= lo if lo_open else v < lo)
    if bad:
        rng = f"{'(' if lo_open else '['}{lo:g}, {hi:g}]"
        raise _error(WetboilValueError, owner, f"{label} = {v:g} is outside {rng}", key, liquid)
    return v


#: Largest roughness or cavity radius [m] a surface takes: 1 mm. Cooper's Rp of real boiling surfaces
#: is 0.01-20 um and active cavities are microns to tens of microns [common practice]; a value in
#: micrometres typed as metres (1.5 for 1.5 um) reads as metres and would pass every model silently
#: or with a range flag only.
_LENGTH_MAX = 1e-3


def _micrometres(owner: str, key: str, v: Optional[float]) -> Optional[float]:
    if v is not None and v > _LENGTH_MAX:
        # the conversion only where micrometres are the likely slip (1.5 for 1.5 um), not for 1-10 mm
        hint = f" ({v:g} um is {v * 1e-6:g} m)" if v >= 0.01 else ""
        raise _error(WetboilValueError, owner, f"{key} = {v:g} m is above 1 mm; was it given in micrometres or "
                     f"millimetres? It is in metres{hint}", key)
    return v


class Surface:
    """A named surface treatment.

    Give the working fluid's angles directly (``static_deg``,
    ``advancing_deg``, ``receding_deg``), or probe-liquid angles to derive
    them from (``probe_static_deg={"water": 72, "diiodomethane": 45}`` and,
    for hysteresis, ``probe_advancing_deg`` / ``probe_receding_deg``): the
    solid's surface energy then comes from Owens-Wendt-Rabel-Kaelble and the
    working fluid's angles at its saturation temperature from
    `wetboil.wetting.predict_angle` (see `angles`).

    Parameters
    ----------
    name : str
        Label of the treatment.
    static_deg, advancing_deg, receding_deg : float, optional
        Angles of the working fluid [deg], through the liquid; advancing >=
        static >= receding. A missing advancing or receding angle is taken
        equal to the static one (no hysteresis data; `angles` returns it so).
    angles_are : {"apparent", "intrinsic"}
        "apparent" (default): measured on this surface as it is, roughness
        included. "intrinsic": measured on a smooth coupon of the same
        chemistry; the apparent angles then follow from Wenzel (or
        Cassie-Baxter when `solid_fraction` is given).
    roughness_ratio : float
        Wenzel roughness ratio r >= 1 (true / projected area), applied to
        intrinsic angles only (given with apparent angles, it is not applied
        and a `WetboilWarning` says so). With
        `solid_fraction` it is instead the roughness ratio r_f of the wetted
        texture tops in Cassie-Baxter (1 for flat-topped pillars, the
        default), not the whole texture's Wenzel ratio.
    solid_fraction : float, optional
        Cassie-Baxter wetted solid fraction, 0 < f <= 1 (gas trapped under
        the drop: meant for intrinsic angles above 90 deg; below, see
        `wetboil.wetting.cassie_baxter`, which flags them). For a texture
        that wicks (intrinsic angle below `wetboil.wetting.hemiwicking_angle`),
        compute the angles with `wetboil.wetting.impregnated_angle` and give
        them as apparent angles.
    Rp : float
        Cooper's surface roughness parameter [m] (default 1 um, Cooper's
        value when unknown); above 1 mm it is refused as a value given in
        micrometres.
    C_sf, n : float, optional
        Rohsenow's surface-liquid constant and Prandtl exponent, where known:
        a fitted pair (give the n that C_sf was fitted with). Without n, the
        working fluid's decides (`wetboil.boiling.rohsenow_exponent`: 1.0 for
        water, 1.7 for other liquids). An n without C_sf is not used (a
        `WetboilWarning` says so): files written before n became optional
        carry n = 1.0 for every surface.
    cavity_radius : float, optional
        Typical cavity mouth radius [m], where known; above 1 mm refused, as
        ``Rp``. Recorded with the surface (files, reports); `sweep` and
        `screen` do not use it: give it to
        ``wetboil.boiling.curve(largest_cavity_radius=...)`` or
        `wetboil.nucleation.embryo_superheat` for its onset superheat.
    cavity_half_angle_deg : float, optional
        Typical conical cavity half-angle [deg], where known. Recorded, not
        used by `sweep`: `wetboil.nucleation.traps_vapour` tells whether such
        cavities trap vapour at the advancing angle (Bankoff); highly wetting
        liquids flood most.
    probe_static_deg, probe_advancing_deg, probe_receding_deg : mapping, optional
        Probe-liquid name (see `wetboil.wetting.PROBE_LIQUIDS`) -> angle [deg].
    notes : str
        Free text.

    Examples
    --------
    >>> from wetboil import Surface
    >>> Surface("oxidised copper", static_deg=24, advancing_deg=33, receding_deg=11)
    Surface('oxidised copper', static_deg=24, advancing_deg=33, receding_deg=11)
    """

    def __init__(
        self,
        name: str,
        static_deg: Optional[float] = None,
        advancing_deg: Optional[float] = None,
        receding_deg: Optional[float] = None,
        *,
        angles_are: str = "apparent",
        roughness_ratio: float = 1.0,
        solid_fraction: Optional[float] = None,
        Rp: float = 1e-6,
        C_sf: Optional[float] = None,
        n: Optional[float] = None,
        cavity_radius: Optional[float] = None,
        cavity_half_angle_deg: Optional[float] = None,
        probe_static_deg: Optional[Mapping[str, float]] = None,
        probe_advancing_deg: Optional[Mapping[str, float]] = None,
        probe_receding_deg: Optional[Mapping[str, float]] = None,
        notes: str = "",
    ) -> None:
        if not isinstance(name, str) or not name.strip():
            raise WetboilTypeError(f"Surface: name must be a non-empty string, got {name!r}")
        self.name = name.strip()
        angles = [_number(self.name, k, v, 0.0, 180.0) for k, v in zip(_ANGLE_KEYS, (static_deg, advancing_deg, receding_deg))]
        self.static_deg, self.advancing_deg, self.receding_deg = angles
        if angles_are not in ("apparent", "intrinsic"):
            raise _error(WetboilValueError, self.name, f"angles_are must be 'apparent' or 'intrinsic', got "
                         f"{angles_are!r}", "angles_are")
        self.angles_are = angles_are
        self.roughness_ratio = _number(self.name, "roughness_ratio", roughness_ratio, 1.0)
        self.solid_fraction = _number(self.name, "solid_fraction", solid_fraction, 0.0, 1.0, lo_open=True)
        self.Rp = _micrometres(self.name, "Rp", _number(self.name, "Rp", Rp, 0.0, lo_open=True))
        self.C_sf = _number(self.name, "C_sf", C_sf, 0.0, lo_open=True)
        self.n = _number(self.name, "n", n, 0.0, lo_open=True)
        self.cavity_radius = _micrometres(self.name, "cavity_radius",
                                          _number(self.name, "cavity_radius", cavity_radius, 0.0, lo_open=True))
        self.cavity_half_angle_deg = _number(self.name, "cavity_half_angle_deg", cavity_half_angle_deg, 0.0, 90.0, lo_open=True)
        self.probe_static_deg = self._probe("probe_static_deg", probe_static_deg)
        self.probe_advancing_deg = self._probe("probe_advancing_deg", probe_advancing_deg)
        self.probe_receding_deg = self._probe("probe_receding_deg", probe_receding_deg)
        if not isinstance(notes, str):
            raise _error(WetboilTypeError, self.name, "notes must be a string", "notes")
        self.notes = notes
        self._validate()
        from .wetting import _question_radians

        _question_radians(f"surface {self.name!r}", [v for v in angles if v is not None] + [
            v for probes in (self.probe_static_deg, self.probe_advancing_deg, self.probe_receding_deg)
            for v in (probes or {}).values()], "a superhydrophilic coating can measure this little: then the angles "
            "are used as given")
        if self.angles_are == "apparent" and self.roughness_ratio != 1.0:
            _warn(f"surface {self.name!r}: roughness_ratio = {self.roughness_ratio:g} is not applied: the "
                          "angles are 'apparent' (measured on this surface, roughness included); for angles measured "
                          "on a smooth coupon set angles_are = 'intrinsic' (Wenzel)", WetboilWarning)
        if self.n is not None and self.C_sf is None:
            _warn(f"surface {self.name!r}: n = {self.n:g} is given without C_sf; Rohsenow's constants are a "
                          "fitted pair, so n is used only with the surface's own C_sf (without one, the fluid's "
                          "exponent: 1.0 water, 1.7 other liquids)", WetboilWarning)

    def _probe(self, key: str, value: Optional[Mapping[str, float]]) -> Optional[Dict[str, float]]:
        if value is None:
            return None
        if not isinstance(value, Mapping):
            raise _error(WetboilTypeError, self.name, f"{key} must map probe-liquid names to angles", key)
        from . import wetting

        def known(liquid: str) -> bool:
            # a name some published table knows, read as `wetboil.wetting.probe_liquid` reads it
            # (aliases, case, spacing); `angles` uses the "default" table, which has them all today
            for table in wetting.PROBE_LIQUIDS:
                try:
                    wetting.probe_liquid(liquid, table)
                except WetboilValueError:
                    continue
                return True
            return False

        for liquid in map(str, value):
            if not known(liquid):
                names = sorted({name for rows in wetting.PROBE_LIQUIDS.values() for name in rows})
                raise _error(
                    WetboilValueError, self.name,
                    f"{key}: unknown probe liquid {liquid!r}; known liquids: "
                    f"{', '.join(names)} (case, spaces, hyphens and underscores do not matter; 'methylene iodide' "
                    "and 'glycerin' are understood). For a liquid of your own, fit wetboil.wetting.surface_energy "
                    "with liquids={name: (dispersive, polar)} in N/m and give the working fluid's angles directly "
                    "(static_deg, ...), e.g. from wetboil.wetting.predict_angle", key, liquid
                )
        out = {str(k): _number(self.name, key, v, 0.0, 180.0, liquid=str(k)) for k, v in value.items()}
        if len(out) < 2:
            raise _error(WetboilValueError, self.name, f"{key} needs at least two probe liquids, got {len(out)}", key)
        return out  # type: ignore[return-value]

    def _validate(self) -> None:
        direct = self.static_deg is not None
        probes = self.probe_static_deg is not None
        for kind, given, static in (("", (self.advancing_deg, self.receding_deg), "static_deg"),
                                    ("probe_", (self.probe_advancing_deg, self.probe_receding_deg), "probe_static_deg")):
            if getattr(self, static) is None and any(v is not None for v in given):
                raise _error(WetboilValueError, self.name,
                             f"{kind}advancing_deg / {kind}receding_deg need {static} too (the static angle drives "
                             "the onset and departure models)",
                             f"{kind}advancing_deg" if given[0] is not None else f"{kind}receding_deg")
        if direct == probes:
            raise _error(WetboilValueError, self.name,
                         "give either the working fluid's angles (static_deg, ...) or probe-liquid angles "
                         "(probe_static_deg), not both or neither", "static_deg" if direct else "name")
        a, s, r = self.advancing_deg, self.static_deg, self.receding_deg
        if a is not None and r is not None and a < r:
            raise _error(WetboilValueError, self.name,
                         f"advancing angle {a:g} deg is below the receding angle {r:g} deg", "advancing_deg")
        if s is not None and a is not None and a < s:
            raise _error(WetboilValueError, self.name,
                         f"advancing angle {a:g} deg is below the static angle {s:g} deg", "advancing_deg")
        if s is not None and r is not None and r > s:
            raise _error(WetboilValueError, self.name,
                         f"receding angle {r:g} deg is above the static angle {s:g} deg", "receding_deg")
        # the same order for each probe liquid measured in two sets (names as `wetting.probe_liquid` reads
        # them): the working fluid's angles are predicted from each set, so a disordered pair would give a
        # receding angle above the advancing one for the CHF and onset models
        from .wetting import _normalise

        def by_liquid(probes: Optional[Dict[str, float]], key: str) -> Dict[str, Tuple[str, float]]:
            out: Dict[str, Tuple[str, float]] = {}
            for k, v in (probes or {}).items():
                if _normalise(k) in out:  # one liquid under two names would be fitted twice
                    raise _error(WetboilValueError, self.name, f"{key}: {out[_normalise(k)][0]!r} and {k!r} name the "
                                 "same probe liquid; give it once", key, k)
                out[_normalise(k)] = (k, v)
            return out

        pa, ps, pr = (by_liquid(x, k) for x, k in ((self.probe_advancing_deg, "probe_advancing_deg"),
                                                    (self.probe_static_deg, "probe_static_deg"),
                                                    (self.probe_receding_deg, "probe_receding_deg")))
        for (hi_kind, hi), (lo_kind, lo), key, side in (
            (("advancing", pa), ("receding", pr), "probe_advancing_deg", 0),
            (("advancing", pa), ("static", ps), "probe_advancing_deg", 0),
            (("static", ps), ("receding", pr), "probe_receding_deg", 1),
        ):
            for liquid in hi.keys() & lo.keys():
                (hi_name, hi_v), (lo_name, lo_v) = hi[liquid], lo[liquid]
                if hi_v < lo_v:
                    raise _error(WetboilValueError, self.name,
                                 f"{hi_name}: probe {hi_kind} angle {hi_v:g} deg is below the probe {lo_kind} angle "
                                 f"{lo_v:g} deg", key, (hi_name, lo_name)[side])
        if self.solid_fraction is not None and self.angles_are != "intrinsic":
            raise _error(WetboilValueError, self.name,
                         "solid_fraction converts intrinsic angles; set angles_are = 'intrinsic'", "solid_fraction")

    # -- the working fluid's angles -------------------------------------------------
    @one_warning_per_category("Surface.angles")
    def angles(self, fluid: Optional[Saturation] = None, *, dispersive_fraction: Optional[float] = None) -> WorkingAngles:
        """Apparent static, advancing and receding angles of the working fluid
        [deg].

        Direct angles are returned as given (after Wenzel / Cassie-Baxter when
        they are intrinsic). Probe-liquid angles need `fluid`: the surface
        energy is fitted to each probe set (static, advancing, receding) and
        the working fluid's angle predicted with its surface tension at
        saturation, split into dispersive and polar parts. Missing
        advancing/receding data give the static angle (no hysteresis).

        Parameters
        ----------
        fluid : Saturation, optional
            The working fluid's saturated state(s); needed for probe-liquid
            angles only.
        dispersive_fraction : float, optional
            Dispersive part of the working fluid's surface tension over the
            total, 0-1. By default the fluid's tabulated value
            (`wetboil.wetting.dispersive_fraction`: water and saturated
            hydrocarbons); other fluids raise `WetboilValueError` until it is
            given. Held constant up to saturation (our assumption).
        """
        given = self._given_angles(fluid, dispersive_fraction)
        return WorkingAngles(*(self._apparent(x) for x in given))

    def _given_angles(self, fluid: Optional[Saturation], dispersive_fraction: Optional[float]) -> WorkingAngles:
        """The working fluid's angles as given or predicted from the probe liquids, before Wenzel or
        Cassie-Baxter (see `angles`)."""
        from . import wetting

        if self.static_deg is not None:
            s = self.static_deg
            a = self.advancing_deg if self.advancing_deg is not None else s
            r = self.receding_deg if self.receding_deg is not None else s
        else:
            if not isinstance(fluid, Saturation):
                raise WetboilTypeError(
                    f"surface {self.name!r} is described by probe-liquid angles: angles() needs the working fluid "
                    "(a wetboil.fluids.Saturation)"
                )
            if dispersive_fraction is None:
                fd, fp = _tabulated_split(fluid)
            else:
                fd = float(_number(self.name, "dispersive_fraction", dispersive_fraction, 0.0, 1.0))  # type: ignore[arg-type]
                fp = 1.0 - fd
            d, p = fluid.sigma * fd, fluid.sigma * fp

            def predict(probes: Optional[Dict[str, float]]) -> Any:
                if probes is None:
                    return None
                energy = wetting.surface_energy(list(probes.values()), list(probes.keys()))
                return wetting.predict_angle(energy, d, p)

            s = predict(self.probe_static_deg)
            a = predict(self.probe_advancing_deg)
            r = predict(self.probe_receding_deg)
            a = s if a is None else a
            r = s if r is None else r
            # each probe set in order does not make the predicted angles so: a least-squares or
            # two-liquid fit weights some liquid negatively for many working fluids, so a set's
            # hysteresis can come out reversed (receding above advancing); computed, and flagged
            _flag_disordered(self.name, s, a, r)
        return WorkingAngles(s, a, r)

    def _apparent(self, angle: Any) -> Any:
        """One working-fluid angle as the surface shows it: intrinsic angles through Cassie-Baxter (with
        `solid_fraction`) or Wenzel; apparent angles as they are. Separate from `_given_angles` so that
        `sweep` can flag each of the three angles by its own conversion."""
        from . import wetting

        if self.angles_are != "intrinsic":
            return angle
        if self.solid_fraction is not None:
            return wetting.cassie_baxter(angle, self.solid_fraction, self.roughness_ratio)
        if self.roughness_ratio != 1.0:
            return wetting.wenzel(angle, self.roughness_ratio)
        return angle

    # -- records -------------------------------------------------------------------
    def to_dict(self) -> Dict[str, Any]:
        """The description as a plain dict (None for what is not known)."""
        return {k: getattr(self, k) for k in _KEYS}

    @classmethod
    def from_dict(cls, record: Mapping[str, Any]) -> "Surface":
        """A surface from a dict with the keys of `to_dict` (unknown keys raise)."""
        unknown = set(record) - set(_KEYS)
        if unknown:
            raise WetboilValueError(f"surface {record.get('name', '?')!r}: unknown key(s) {sorted(unknown)}; "
                                    f"known keys are {list(_KEYS)}")
        if "name" not in record:
            raise WetboilValueError("surface record without a name")
        kw = {k: v for k, v in record.items() if v is not None and k != "name"}
        return cls(record["name"], **kw)

    def __eq__(self, other: object) -> bool:
        return isinstance(other, Surface) and self.to_dict() == other.to_dict()

    def __repr__(self) -> str:
        parts = [repr(self.name)]
        defaults = {"angles_are": "apparent", "roughness_ratio": 1.0, "Rp": 1e-6, "notes": ""}
        for k in _KEYS[1:]:
            v = getattr(self, k)
            if v is None or defaults.get(k, object()) == v:
                continue
            parts.append(f"{k}={v:g}" if isinstance(v, float) else f"{k}={v!r}")
        return f"Surface({', '.join(parts)})"


def _flag_disordered(name: str, s: Any, a: Any, r: Any) -> None:
    """Report (out of range) the predicted working-fluid angles not in the order advancing >= static >=
    receding, as every kernel's range is reported (and captured by a sweep for its flags)."""
    from ._api import _CAPTURE
    from ._errors import report

    with np.errstate(invalid="ignore"):
        bad = np.asarray((a < s) | (s < r) | (a < r))
    if not bad.any():
        return
    cap = _CAPTURE.get()
    if cap is not None:
        cap.add(np.where(bad, 2, 0))
    report(f"Surface.angles: surface {name!r}", int(bad.size), 0, int(bad.sum()),
           "the angles predicted from the probe sets in the order advancing >= static >= receding")


def _tabulated_split(fluid: Saturation) -> "tuple[float, float]":
    """Dispersive and polar fractions of a fluid's surface tension from the
    table (water's as the probe table splits it, bit for bit)."""
    from . import wetting

    fd = wetting.dispersive_fraction(fluid)  # raises for a fluid without a tabulated split
    if _is_water(fluid.name):
        return wetting.split_surface_tension(1.0)  # water's proportions: the fractions themselves
    return fd, 1.0 - fd


# ---------------------------------------------------------------------------------
# files

# A TOML key (bare, "basic" or 'literal'), a dotted key path and a table header line.
_TOML_KEY = r"""(?:[A-Za-z0-9_-]+|"(?:[^"\\]|\\.)*"|'[^']*')"""
_TOML_HEADER = re.compile(rf"^\s*(\[\[?)\s*({_TOML_KEY}(?:\s*\.\s*{_TOML_KEY})*)\s*\]\]?\s*(?:#.*)?$")


def _toml_lines(text: str) -> List[str]:
    """The lines of a TOML text (split at ``\\n`` as TOML counts them), with
    every line that begins inside a multi-line string blanked, so that a
    string's content is never taken for a key or a table header."""
    out = []
    inside: Optional[str] = None  # '"""' or "'''" while in a multi-line string
    for line in text.split("\n"):
        out.append(line if inside is None else "")
        i, n = 0, len(line)
        while i < n:
            if inside is not None:
                if inside == '"""' and line[i] == "\\":
                    i += 2
                elif line.startswith(inside, i):
                    run = len(line[i:]) - len(line[i:].lstrip(inside[0]))  # up to two more quotes are content
                    inside, i = None, i + run
                else:
                    i += 1
                continue
            c = line[i]
            if c == "#":
                break
            if line.startswith('"""', i) or line.startswith("'''", i):
                inside, i = line[i:i + 3], i + 3
            elif c == '"':
                i += 1
                while i < n and line[i] != '"':
                    i += 2 if line[i] == "\\" else 1
                i += 1
            elif c == "'":
                j = line.find("'", i + 1)
                i = n if j < 0 else j + 1
            else:
                i += 1
    return out


def _toml_header(line: str) -> Optional[Tuple[bool, List[str]]]:
    """``(is_array_of_tables, key parts)`` of a table header line, else None."""
    m = _TOML_HEADER.match(line)
    if m is None:
        return None
    parts = [p[1:-1] if p[0] in "\"'" else p for p in re.findall(_TOML_KEY, m.group(2))]
    return m.group(1) == "[[", parts


def _surface_spans(lines: List[str], count: int) -> List[Tuple[int, int]]:
    """0-based ``(first, end)`` line ranges of the `count` ``[[surface]]``
    tables, sub-tables (``[surface.probe_static_deg]``) included; the whole
    text for each when the headers cannot be matched to the tables (an inline
    array ``surface = [...]``, say)."""
    spans: List[List[int]] = []
    for i, line in enumerate(lines):
        head = _toml_header(line)
        if head is None:
            continue
        is_array, parts = head
        if spans and spans[-1][1] == len(lines) and not (parts[0] == "surface" and len(parts) > 1):
            spans[-1][1] = i  # any other table ends the current one
        if is_array and parts == ["surface"]:
            spans.append([i, len(lines)])
    if len(spans) != count:
        return [(-1, len(lines))] * count
    return [(a, b) for a, b in spans]


def _key_line(lines: List[str], span: Tuple[int, int], key: str, liquid: Optional[str] = None) -> int:
    """1-based line where the ``[[surface]]`` table spanning `span` sets `key`
    (and, for a probe-liquid table, the `liquid` in it): ``key = ...``,
    ``key.sub = ...`` or a ``[surface.key]`` header. Falls back to the
    table's ``[[surface]]`` line (0 when that is unknown)."""

    def quoted(k: str) -> str:
        return rf"""(?:{re.escape(k)}|"{re.escape(k)}"|'{re.escape(k)}')"""

    first, end = span
    heads = {i: h for i in range(first + 1, end) if (h := _toml_header(lines[i])) is not None}
    own_end = min(heads, default=end)  # the table's own keys come before its first sub-table
    assign = re.compile(rf"^\s*{quoted(key)}\s*=")
    dotted = re.compile(rf"^\s*{quoted(key)}\s*\.\s*" + (rf"{quoted(liquid)}\s*=" if liquid is not None else ""))
    for i in range(first + 1, own_end):
        if assign.match(lines[i]) or dotted.match(lines[i]):
            return i + 1
    for i, (_, parts) in heads.items():
        if parts[:2] == ["surface", key]:
            if liquid is not None:
                inner = re.compile(rf"^\s*{quoted(liquid)}\s*=")
                stop = min((j for j in heads if j > i), default=end)
                return next((j + 1 for j in range(i + 1, stop) if inner.match(lines[j])), i + 1)
            return i + 1
    if liquid is not None:
        return _key_line(lines, span, key)
    return first + 1


def _loads_toml(text: str, path: pathlib.Path, error: type) -> Dict[str, Any]:
    """The TOML document `text` of file `path`; `error` naming the file where it is not valid."""
    try:
        return _toml.loads(text)
    except _toml.TOMLDecodeError as exc:
        raise error(f"{path}: not valid TOML: {exc}") from None
    except RecursionError:  # the standard parser recurses once per level of nested arrays or inline tables
        raise error(f"{path}: not valid here: arrays or tables nested too deeply") from None


def _from_toml(path: pathlib.Path) -> List[Surface]:
    text = path.read_text(encoding="utf-8")
    data = _loads_toml(text, path, SurfaceFileError)
    records = data.get("surface")
    if not isinstance(records, list) or not records:
        raise SurfaceFileError(f"{path}: no [[surface]] tables found")
    if not all(isinstance(rec, dict) for rec in records):
        raise SurfaceFileError(f"{path}: 'surface' must be [[surface]] tables")
    lines = _toml_lines(text)
    out = []
    seen: Dict[str, int] = {}
    for rec, span in zip(records, _surface_spans(lines, len(records))):
        for key in rec:
            if key not in _KEYS:
                raise SurfaceFileError(
                    f"{path}:{_key_line(lines, span, key)}: unknown key {key!r} in surface {rec.get('name', '?')!r}; "
                    f"known keys are {', '.join(_KEYS)}"
                )
        try:
            out.append(Surface.from_dict(rec))
        except (WetboilValueError, WetboilTypeError) as exc:
            key = getattr(exc, "key", "name")  # set by the Surface checks (`_error`)
            line = _key_line(lines, span, key if key in rec else "name", getattr(exc, "liquid", None))
            raise SurfaceFileError(f"{path}:{line}: {exc}") from None
        line = _key_line(lines, span, "name")
        if out[-1].name in seen:
            raise SurfaceFileError(f"{path}:{line}: surface name {out[-1].name!r} already given on line "
                                   f"{seen[out[-1].name]}; names must be unique")
        seen[out[-1].name] = line
    return out


def _from_csv(path: pathlib.Path) -> List[Surface]:
    # utf-8-sig: Excel's "CSV UTF-8" starts with a byte-order mark; newline="": quoted cells keep
    # their line breaks as written (csv's own rule)
    with path.open(encoding="utf-8-sig", newline="") as fh:
        reader = csv.reader(fh)
        columns = next(reader, None)
        if columns is None:
            raise SurfaceFileError(f"{path}: empty CSV file")
        columns = [key.strip() for key in columns]  # "name " as a spreadsheet may write it
        if len(columns) == 1 and (";" in columns[0] or "\t" in columns[0]):
            sep = "';'" if ";" in columns[0] else "tabs"
            raise SurfaceFileError(f"{path}:1: the values are separated by {sep}; wetboil reads comma-separated "
                                   "values with '.' as the decimal mark (in a spreadsheet: save as \"CSV UTF-8\" with "
                                   "comma as the list separator)")
        for key in columns:
            group = key.split(":", 1)[0] if ":" in key else None
            if group is not None and group not in _PROBE_KEYS:
                raise SurfaceFileError(f"{path}:1: unknown column {key!r}")
            if group is None and key not in _KEYS:
                raise SurfaceFileError(f"{path}:1: unknown column {key!r}; known columns are {', '.join(_KEYS)}")
        out = []
        seen: Dict[str, int] = {}
        end = reader.line_num
        for row in reader:
            line_no, end = end + 1, reader.line_num  # a quoted cell may span lines: its row's first line
            if all(not cell.strip() for cell in row):
                continue  # blank lines and the ",,,," rows spreadsheets leave at the end
            if len(row) > len(columns):
                raise SurfaceFileError(f"{path}:{line_no}: more values than column names")
            rec: Dict[str, Any] = {}
            for key, cell in zip(columns, row):
                value = cell if key == "notes" else cell.strip()  # notes are kept as written
                if ":" in key:
                    group, liquid = key.split(":", 1)
                    if value:
                        rec.setdefault(group, {})[liquid] = _csv_number(path, line_no, key, value)
                    continue
                if value == "":
                    continue
                if key in ("name", "notes"):
                    value = _csv_untext(value)  # as save_surfaces escaped it for spreadsheets
                rec[key] = value if key in ("name", "angles_are", "notes") else _csv_number(path, line_no, key, value)
            try:
                out.append(Surface.from_dict(rec))
            except (WetboilValueError, WetboilTypeError) as exc:
                raise SurfaceFileError(f"{path}:{line_no}: {exc}") from None
            if out[-1].name in seen:
                raise SurfaceFileError(f"{path}:{line_no}: surface name {out[-1].name!r} already given on line "
                                       f"{seen[out[-1].name]}; names must be unique")
            seen[out[-1].name] = line_no
    if not out:
        raise SurfaceFileError(f"{path}: no surfaces")
    return out


#: First characters that make a spreadsheet read a CSV cell as a formula (OWASP, "CSV Injection"):
#: a surface named ``=HYPERLINK(...)`` or ``-5 K aged`` would run or break when the file is opened.
_FORMULA_START = ("=", "+", "-", "@", "\t", "\r")


def _csv_text(text: str) -> str:
    """`text` as a CSV cell a spreadsheet shows as text: one that starts with
    ``=``, ``+``, ``-``, ``@``, a tab or a carriage return gets a leading
    apostrophe (``'=SUM(A1)``), so it stays readable and is never run as a
    formula. `load_surfaces` and the command line's ranking read it back
    without the apostrophe. Text that `_csv_untext` would change (an
    apostrophe before such a character or before another apostrophe, as in
    ``'=x``) gets one too, so that every text reads back as written."""
    return "'" + text if text.startswith(_FORMULA_START) or _csv_untext(text) != text else text


def _csv_untext(text: str) -> str:
    """The text `_csv_text` wrote: without the apostrophe it added (one before a formula character
    or before another apostrophe)."""
    return text[1:] if text.startswith("'") and text[1:].startswith(_FORMULA_START + ("'",)) else text


def _csv_number(path: pathlib.Path, line: int, key: str, value: str) -> float:
    try:
        return float(value)
    except ValueError:
        raise SurfaceFileError(f"{path}:{line}: {key} = {value!r} is not a number") from None


#: Largest study or surface file read [bytes] (a real one is a few kB).
_MAX_TEXT_BYTES = 64 << 20


def _check_utf8(path: pathlib.Path, error: type) -> None:
    """Raise `error` naming the file and line when `path` is not UTF-8 text (a
    spreadsheet's plain "CSV" is often Windows-1252, not UTF-8), or holds more
    than `_MAX_TEXT_BYTES` (a device such as /dev/zero would fill the memory)."""
    with path.open("rb") as fh:
        data = fh.read(_MAX_TEXT_BYTES + 1)
    if len(data) > _MAX_TEXT_BYTES:
        raise error(f"{path}: more than {_MAX_TEXT_BYTES >> 20} MiB; not a study or surface file")
    try:
        data.decode("utf-8")
    except UnicodeDecodeError as exc:
        line = data[: exc.start].count(b"\n") + 1
        hint = ' (in a spreadsheet: "CSV UTF-8")' if path.suffix.lower() == ".csv" else ""
        raise error(f"{path}:{line}: not UTF-8 text (byte 0x{data[exc.start]:02x}); "
                    f"save the file as UTF-8{hint}") from None


def load_surfaces(path: Union[str, pathlib.Path]) -> List[Surface]:
    """Read surfaces from a TOML file (``[[surface]]`` tables with the keys of
    `Surface`) or a CSV file (one row per surface; probe angles as columns
    ``probe_static_deg:water`` ...). Errors name the file, line and key.

    Both are read as UTF-8; a CSV file may start with a byte-order mark (as
    spreadsheets write "CSV UTF-8"), and rows whose every cell is empty are
    skipped. In a CSV file, a name or note written as ``'`` followed by
    ``=``, ``+``, ``-`` or ``@`` is read without the apostrophe: `save_surfaces`
    adds it so that a spreadsheet shows such a cell as text, not a formula.
    """
    path = pathlib.Path(path)
    if not path.exists():
        raise SurfaceFileError(f"{path}: no such file")
    _check_utf8(path, SurfaceFileError)
    if path.suffix.lower() == ".toml":
        return _from_toml(path)
    if path.suffix.lower() == ".csv":
        return _from_csv(path)
    raise SurfaceFileError(f"{path}: unknown format (use .toml or .csv)")


# TOML 1.0 basic strings: the quote, the backslash and the control characters U+0000-U+001F and U+007F
# must be escaped (tab may stand as is; it is escaped too); the short escapes where TOML has them.
_TOML_ESCAPES = {'"': '\\"', "\\": "\\\\", "\b": "\\b", "\t": "\\t", "\n": "\\n", "\f": "\\f", "\r": "\\r"}


def _toml_value(v: Any) -> str:
    """`v` as a TOML value: a basic string (escaped as TOML 1.0 requires) or a float."""
    if isinstance(v, str):
        return '"' + re.sub(r'["\\\x00-\x1f\x7f]',
                            lambda m: _TOML_ESCAPES.get(m.group(), f"\\u{ord(m.group()):04X}"), v) + '"'
    return repr(float(v))


def save_surfaces(surfaces: Iterable[Surface], path: Union[str, pathlib.Path]) -> pathlib.Path:
    """Write surfaces to a TOML or CSV file (by the extension), in UTF-8, that
    `load_surfaces` reads back unchanged. In a CSV file a name or note that
    starts with ``=``, ``+``, ``-`` or ``@`` is written with a leading
    apostrophe, so that a spreadsheet shows it as text (OWASP, "CSV
    Injection")."""
    path = pathlib.Path(path)
    surfaces = list(surfaces)
    if not all(isinstance(s, Surface) for s in surfaces):
        raise WetboilTypeError("save_surfaces: expected Surface objects")
    for s in surfaces:
        texts = [("name", s.name), ("notes", s.notes)]
        texts += [(k, liq) for k in _PROBE_KEYS for liq in (getattr(s, k) or {})]
        for key, text in texts:
            try:
                text.encode("utf-8")
            except UnicodeEncodeError:
                raise WetboilValueError(
                    f"save_surfaces: surface {s.name!r}: {key} holds {text!r}, which has a character UTF-8 cannot "
                    "store (a lone surrogate)"
                ) from None
    if path.suffix.lower() == ".toml":
        lines = ["# wetboil surface descriptions", ""]
        for s in surfaces:
            lines.append("[[surface]]")
            probes = []
            for k, v in s.to_dict().items():
                if v is None:
                    continue
                if isinstance(v, dict):
                    probes.append((k, v))
                    continue
                lines.append(f"{k} = {_toml_value(v)}")
            for k, v in probes:
                lines.append(f"[surface.{k}]")
                lines.extend(f"{_toml_value(liq)} = {_toml_value(a)}" for liq, a in v.items())
            lines.append("")
        path.write_text("\n".join(lines), encoding="utf-8")
    elif path.suffix.lower() == ".csv":
        probe_cols = sorted({f"{k}:{liq}" for s in surfaces for k in _PROBE_KEYS for liq in (getattr(s, k) or {})})
        cols = [k for k in _KEYS if k not in _PROBE_KEYS] + probe_cols
        with path.open("w", newline="", encoding="utf-8") as fh:
            w = csv.DictWriter(fh, fieldnames=cols)
            w.writeheader()
            for s in surfaces:
                d = s.to_dict()
                row = {k: ("" if d[k] is None else d[k]) for k in cols if ":" not in k}
                row["name"], row["notes"] = _csv_text(row["name"]), _csv_text(row["notes"])  # no formulas
                for col in probe_cols:
                    group, liq = col.split(":", 1)
                    row[col] = (d[group] or {}).get(liq, "")
                w.writerow(row)
    else:
        raise WetboilValueError(f"save_surfaces: unknown format {path.suffix!r} (use .toml or .csv)")
    return path
