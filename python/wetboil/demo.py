"""The built-in demo study (invented data), run by ``wetboil demo``.

An invented lab screens invented surface treatments of an invented product:
working-fluid angles (measured, roughened by Wenzel, or predicted from
probe-liquid angles), onset of boiling, active cavities, bubble departure,
nucleate superheat and critical heat flux with its margin, over pressures,
design heat fluxes, orientations and subcoolings. The study lives in
``data/demo_study.toml``; every name and measurement in it is invented and
labelled so.
"""

from __future__ import annotations

import pathlib
from importlib import resources

from .report import CAUTION, load_spec, margin_ranking, margin_text, run_study
from .surface import _csv_untext

__all__ = ["study_path", "run"]


def study_path() -> pathlib.Path:
    """Path of the built-in demo study specification."""
    return pathlib.Path(str(resources.files("wetboil").joinpath("data/demo_study.toml")))


def run(out: pathlib.Path, *, progress: bool = False) -> pathlib.Path:
    """Run the demo study into `out`, print the ranking, return the report path."""
    path = study_path()
    study = load_spec(path)
    report = run_study(study, out, progress=progress, spec_text=path.read_text())
    print_ranking(out, study.title)
    return report


def print_ranking(out: pathlib.Path, title: str) -> None:
    """Print the lowest CHF margin of each surface and the files written."""
    import pandas as pd

    table = pd.read_csv(out / "summary.csv")
    # names as written: pandas would read a surface named "NA" or "null" as missing and drop it
    names = pd.read_csv(out / "summary.csv", usecols=["surface"], dtype=str, keep_default_na=False)["surface"]
    ranking = margin_ranking(table.assign(surface=names.map(_csv_untext)))
    print(title)
    print(f"{'surface':<42} {'rows flagged':>13}  lowest CHF margin")
    for name, r in ranking.iterrows():
        print(f"{name:<42} {int(r['flagged']):>6} / {int(r['points']):<4}  {margin_text(r)}")
    print("\nOrder: highest lowest margin first; surfaces without a CHF prediction at some point last; equal\n"
          "margins by fewer flagged rows (the report states the full rule).")
    print("\nFlagged rows computed a design quantity with a correlation outside its published validity range;\n"
          "the report lists every flag, also those of the CHF methods kept for comparison.")
    print(f"\n{CAUTION}")
