"""The built-in demo scenario (invented data), run by ``wetboil demo``.

An invented lab screens invented surface treatments of an invented product
for bubble departure size and critical heat flux in saturated water. The
scenario lives in ``data/demo_scenario.toml``; every name and measurement in
it is invented and labelled so.
"""

from __future__ import annotations

import pathlib
import warnings
from importlib import resources
from typing import Any, Dict, List

import numpy as np

from ._errors import RangeWarning
from .chf import kandlikar, zuber
from .departure import fritz
from .fluids import Saturation, water

try:  # Python >= 3.11
    import tomllib as _toml
except ModuleNotFoundError:  # pragma: no cover
    import tomli as _toml  # type: ignore[no-redef,import-not-found]


def load_scenario() -> Dict[str, Any]:
    """The demo scenario as a dict (see data/demo_scenario.toml)."""
    text = resources.files("wetboil").joinpath("data/demo_scenario.toml").read_text()
    return _toml.loads(text)


def run(out: pathlib.Path) -> pathlib.Path:
    """Run the scenario, print its table, write a plot and a short report into
    `out`; return the report's path."""
    sc = load_scenario()
    meta = sc["scenario"]
    fluid = water(p=meta["pressure_Pa"])
    q_design = meta["design_heat_flux_W_m2"]
    orientations = meta["orientations_deg"]
    surfaces: List[Dict[str, Any]] = sc["surface"]

    rows = []
    for s in surfaces:
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            row = {
                "surface": s["name"],
                "static_deg": s["static_deg"],
                "receding_deg": s["receding_deg"],
                "departure_mm": fritz(s["static_deg"], fluid) * 1e3,
            }
            for phi in orientations:
                chf = kandlikar(s["receding_deg"], fluid, phi)
                row[f"chf_{phi:g}deg_MW_m2"] = chf / 1e6
                row[f"margin_{phi:g}deg"] = chf / q_design
        row["flags"] = "; ".join(sorted({str(w.message).split(":")[0] + " outside validity range"
                                         for w in caught if issubclass(w.category, RangeWarning)}))
        rows.append(row)
    rows.sort(key=lambda r: -min(r[f"margin_{phi:g}deg"] for phi in orientations))

    header = f"{'surface (invented)':<40} {'static':>6} {'reced.':>6} {'D_d mm':>7}" + "".join(
        f" {'CHF ' + format(phi, 'g') + 'deg':>10} {'margin':>6}" for phi in orientations
    )
    lines = [header, "-" * len(header)]
    for r in rows:
        line = f"{r['surface']:<40} {r['static_deg']:>6.0f} {r['receding_deg']:>6.0f} {r['departure_mm']:>7.2f}"
        for phi in orientations:
            line += f" {r[f'chf_{phi:g}deg_MW_m2']:>8.2f}MW {r[f'margin_{phi:g}deg']:>6.2f}"
        if r["flags"]:
            line += f"  * {r['flags']}"
        lines.append(line)
    table = "\n".join(lines)
    zuber_ref = zuber(fluid) / 1e6

    print(f"{meta['title']}\n{meta['lab']} -- {meta['product']}")
    print(f"Saturated water at {meta['pressure_Pa'] / 1e5:.3f} bar (T_sat = {fluid.T - 273.15:.2f} C); "
          f"design heat flux {q_design / 1e3:.0f} kW/m2\n")
    print(table)
    print(f"\nReference: Zuber hydrodynamic CHF (K = pi/24) = {zuber_ref:.2f} MW/m2 (no wettability effect)")
    print("Departure diameter: Fritz (1935) with the static angle; CHF: Kandlikar (2001) with the "
          "receding angle; margin = CHF / design heat flux; * = an input left a correlation's validity range.")

    plot = out / "chf_vs_receding_angle.png"
    _plot(plot, fluid, surfaces, orientations, q_design)

    from .cli import CAUTION

    report = out / "report.md"
    report.write_text(
        f"# {meta['title']}\n\n{meta['lab']}, {meta['product']}. All surfaces and measurements are invented.\n\n"
        f"Fluid: saturated water at {meta['pressure_Pa']:.0f} Pa. Design heat flux: {q_design:.0f} W/m2.\n\n"
        f"```\n{table}\n```\n\n"
        "Methods: Fritz (1935) departure diameter, Physik. Z. 36, 379; Kandlikar (2001) CHF, "
        "J. Heat Transfer 123, 1071, doi:10.1115/1.1409265; Zuber (1959) AECU-4439.\n\n"
        f"![CHF against receding angle]({plot.name})\n\n{CAUTION}\n"
    )
    print(f"\n{CAUTION}")
    return report


def _plot(path: pathlib.Path, fluid: Saturation, surfaces, orientations, q_design) -> None:
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    beta = np.linspace(0.0, 120.0, 241)
    fig, ax = plt.subplots(figsize=(7, 4.5))
    for phi in orientations:
        ax.plot(beta, kandlikar(beta, fluid, phi) / 1e6, label=f"Kandlikar (2001), orientation {phi:g} deg")
    for s in surfaces:
        ax.plot(s["receding_deg"], kandlikar(s["receding_deg"], fluid, orientations[0]) / 1e6, "o")
        ax.annotate(s["name"].split()[0], (s["receding_deg"], kandlikar(s["receding_deg"], fluid, orientations[0]) / 1e6),
                    textcoords="offset points", xytext=(5, 5), fontsize=8)
    ax.axhline(q_design / 1e6, color="k", ls="--", lw=1, label="design heat flux")
    ax.set_xlabel("receding contact angle [deg]")
    ax.set_ylabel("critical heat flux [MW/m2]")
    ax.set_title("Invented demo surfaces in saturated water, 1 atm")
    ax.legend(fontsize=8)
    ax.grid(alpha=0.3)
    fig.tight_layout()
    fig.savefig(path, dpi=120)
    plt.close(fig)
