#!/usr/bin/env bash
# Create (or reuse) the project's virtual environment in .venv, install what
# the package, its tests and its demo need, and build the Rust extension in
# release mode into it. Safe to run again: it only redoes what changed.
set -euo pipefail
cd "$(dirname "$0")/.."

PY=${PYTHON:-python3}
if [ ! -x .venv/bin/python ]; then
    "$PY" -m venv .venv
fi
VPY=.venv/bin/python
stamp=.venv/.wetboil-deps
if [ ! -f "$stamp" ] || [ pyproject.toml -nt "$stamp" ]; then
    "$VPY" -m pip install --quiet --upgrade pip
    # maturin, plus the runtime and test dependencies listed in pyproject.toml
    # (numpy, xarray, dask, distributed, CoolProp, iapws, hypothesis, ...)
    "$VPY" - <<'PYEOF'
import re, subprocess, sys
text = open("pyproject.toml").read()
def block(name):
    m = re.search(rf"^{name}\s*=\s*\[(.*?)\]\s*$", text, re.S | re.M)
    return re.findall(r'"([^"]+)"', m.group(1))
pkgs = ["maturin>=1.5,<2"] + block("dependencies") + block("test")
subprocess.check_call([sys.executable, "-m", "pip", "install", "--quiet", *pkgs])
PYEOF
    touch "$stamp"
fi
VIRTUAL_ENV="$PWD/.venv" .venv/bin/maturin develop --release --quiet
