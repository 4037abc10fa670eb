"""The ``wetboil`` command line.

    wetboil demo [--out DIR]     run the built-in scenario (invented data) end to end

Every command has ``--help``.
"""

from __future__ import annotations

import argparse
import datetime as _dt
import pathlib
import sys
from typing import List, Optional

from ._errors import WetboilError

CAUTION = (
    "CAUTION: critical heat flux and burnout predictions carry correlation uncertainty of tens of\n"
    "percent and hold only inside each correlation's published validity range. Apply safety margins\n"
    "and defer to the codes and licensed engineering practice that govern your application."
)


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
    path.mkdir(parents=True, exist_ok=True)
    return path


def _cmd_demo(args: argparse.Namespace) -> int:
    from . import demo

    out = _new_out_dir(args.out, "wetboil-demo")
    report = demo.run(out)
    print(f"\nDemo outputs written to {out.resolve()}")
    print(f"Report: {report.resolve()}")
    return 0


def build_parser() -> argparse.ArgumentParser:
    ap = argparse.ArgumentParser(
        prog="wetboil",
        description="How a heated surface's wettability changes boiling: onset, bubbles, critical heat flux.",
        epilog=CAUTION,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    sub = ap.add_subparsers(dest="command", metavar="COMMAND")
    demo = sub.add_parser(
        "demo",
        help="run the built-in demo scenario (invented surfaces) and write its table, plot and report",
        description="Run the built-in demo scenario: invented surface treatments of an invented lab, "
        "screened for bubble departure size and critical heat flux in saturated water at 1 atm.",
        epilog=CAUTION,
        formatter_class=argparse.RawDescriptionHelpFormatter,
    )
    demo.add_argument("--out", metavar="DIR", help="output folder (default: a new wetboil-demo-<time> folder)")
    demo.set_defaults(func=_cmd_demo)
    return ap


def main(argv: Optional[List[str]] = None) -> int:
    ap = build_parser()
    args = ap.parse_args(argv)
    if not getattr(args, "func", None):
        ap.print_help()
        return 2
    try:
        return int(args.func(args))
    except WetboilError as exc:
        print(f"wetboil: error: {exc}", file=sys.stderr)
        return 1
    except BrokenPipeError:  # output piped into a command that stopped reading (| head)
        import os

        os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
        return 0


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
