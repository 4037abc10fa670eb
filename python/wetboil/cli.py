"""The ``wetboil`` command line.

    wetboil demo [--out DIR]            run the built-in study (invented data) end to end
    wetboil run SPEC.toml --out DIR     run a study described in a TOML file

Every command has ``--help``. The spec format is documented in
`wetboil.report` (``python -c "import wetboil.report; help(wetboil.report)"``).
"""

from __future__ import annotations

import argparse
import datetime as _dt
import pathlib
import sys
from typing import Any, List, Optional

import numpy as np

from ._errors import WetboilError, WetboilValueError

from .report import CAUTION


def _new_out_dir(out: Optional[str], stem: str) -> pathlib.Path:
    if out is None:
        stamp = _dt.datetime.now().strftime("%Y%m%d-%H%M%S")
        path = pathlib.Path(f"{stem}-{stamp}")
        i = 1
        while path.exists():
            i += 1
            path = pathlib.Path(f"{stem}-{stamp}-{i}")
    else:
        path = pathlib.Path(out)
        if path.exists() and not path.is_dir():
            raise WetboilValueError(f"--out {out}: is a file, not a folder")
    try:
        path.mkdir(parents=True, exist_ok=True)
    except OSError as exc:
        raise WetboilValueError(f"--out {path}: cannot create the output folder ({exc.strerror or exc})") from None
    return path


def _cmd_demo(args: argparse.Namespace) -> int:
    from . import demo

    out = _new_out_dir(args.out, "wetboil-demo")
    report = demo.run(out, progress=args.progress)
    print(f"\nDemo outputs written to {out.resolve()}")
    print(f"Report: {report.resolve()}")
    return 0


def impossible_summary(ds: Any) -> List[str]:
    """Lines saying how many operating points of a sweep's Dataset were
    impossible and why (empty when none was): the ranking leaves their NaN
    rows out, so the command line says so."""
    from .sweep import STATE_FLAG

    flags = ds["invalid_flags"]
    bits = flags.attrs["bits"].split(",")
    values = flags.values.astype(np.int64)
    points = [d for d in flags.dims if d != "surface"]
    n_points = int(np.prod([flags.sizes[d] for d in points]))
    lines: List[str] = []
    if STATE_FLAG in bits:
        state = (values >> bits.index(STATE_FLAG)) & 1 != 0
        by_point = state.any(axis=flags.dims.index("surface")) if "surface" in flags.dims else state
        if by_point.any():
            axis = "p" if "p" in flags.dims else ("T" if "T" in flags.dims else None)
            where = ""
            if axis is not None:
                bad = state.any(axis=tuple(i for i, d in enumerate(flags.dims) if d != axis))
                unit = "Pa" if axis == "p" else "K"
                where = f" ({axis} = {', '.join(f'{v:g}' for v in ds[axis].values[bad])} {unit})"
            lines.append(f"Impossible operating points: {int(by_point.sum())} of {n_points}{where} have no saturated "
                         "state of the fluid (outside triple point to critical point); every quantity that needs "
                         "the fluid is NaN there and the ranking above uses the other points only.")
        values = np.where(state, 0, values)  # the rest: other impossible inputs
    others = [name for i, name in enumerate(bits) if name != STATE_FLAG and ((values >> i) & 1).any()]
    if others:
        rows = int((values != 0).sum())
        lines.append(f"Rows with impossible inputs: {rows} of {values.size} have NaN in {', '.join(others)} "
                     "(an input was physically impossible; see the report's validity flags).")
    return lines


def _cmd_run(args: argparse.Namespace) -> int:
    from .demo import print_ranking
    from .report import load_spec, run_study

    # all spec errors are raised before anything is written
    study = load_spec(args.spec)
    existed = args.out is not None and pathlib.Path(args.out).exists()
    out = _new_out_dir(args.out, "wetboil-run")
    try:
        spec_text = pathlib.Path(args.spec).read_text(encoding="utf-8")
        report = run_study(study, out, progress=args.progress, spec_text=spec_text)
    except BaseException:
        if not existed and out.is_dir() and not any(out.iterdir()):
            out.rmdir()  # no empty folder that looks like a run
        raise
    print_ranking(out, study.title)
    import xarray as xr

    with xr.open_dataset(out / "sweep.nc") as ds:
        notes = impossible_summary(ds)
    if notes:
        print()
        for line in notes:
            print(line)
    print(f"\nOutputs written to {out.resolve()}")
    print(f"Report: {report.resolve()}")
    return 0


def build_parser() -> argparse.ArgumentParser:
    ap = argparse.ArgumentParser(
        prog="wetboil",
        description="How a heated surface's wettability changes boiling: onset, bubbles, critical heat flux.",
        epilog=CAUTION,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    from . import __version__

    ap.add_argument("--version", action="version", version=f"wetboil {__version__}")
    sub = ap.add_subparsers(dest="command", metavar="COMMAND")
    demo = sub.add_parser(
        "demo",
        help="run the built-in demo scenario (invented surfaces) and write its table, plot and report",
        description="Run the built-in demo study: invented surface treatments of an invented lab, screened "
        "for onset of boiling, bubble departure, nucleate superheat and critical heat flux margin in saturated "
        "water over pressures, heat fluxes, orientations and subcoolings.",
        epilog=CAUTION,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    demo.add_argument("--out", metavar="DIR", help="output folder (default: a new wetboil-demo-<time> folder)")
    demo.add_argument("--progress", action="store_true", help="show a progress bar for chunked sweeps")
    demo.set_defaults(func=_cmd_demo)
    run = sub.add_parser(
        "run",
        help="run a study described in a TOML file and write its dataset, summary, plots and report",
        description="Run a study described in a TOML specification: fluid, pressures or temperatures, design "
        "heat fluxes, orientations, subcoolings, methods and surfaces (inline [[surface]] tables or a "
        "surfaces_file). Writes sweep.nc, summary.csv, PNG plots and report.md. The format is documented in "
        "the wetboil.report module.",
        epilog=CAUTION,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    run.add_argument("spec", metavar="SPEC.toml", help="study specification")
    run.add_argument("--out", metavar="DIR", help="output folder (default: a new wetboil-run-<time> folder)")
    run.add_argument("--progress", action="store_true", help="show a progress bar for chunked sweeps")
    run.set_defaults(func=_cmd_run)
    return ap


def main(argv: Optional[List[str]] = None) -> int:
    ap = build_parser()
    args = ap.parse_args(argv)
    if not getattr(args, "func", None):
        ap.print_help()
        return 2
    import warnings

    def show(message: Any, category: type, filename: str, lineno: int, file: Any = None, line: Any = None) -> None:
        # one line per warning, as the errors are: the Python source line means nothing to a command's user
        print(f"wetboil: {category.__name__}: {message}", file=sys.stderr if file is None else file)

    try:
        with warnings.catch_warnings():
            warnings.showwarning = show
            return int(args.func(args))
    except WetboilError as exc:
        print(f"wetboil: error: {exc}", file=sys.stderr)
        return 1
    except BrokenPipeError:  # output piped into a command that stopped reading (| head)
        import os

        os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
        return 0
    except OSError as exc:  # a file that cannot be read or written (full disk, permissions, ...)
        print(f"wetboil: error: {exc}", file=sys.stderr)
        return 1


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
