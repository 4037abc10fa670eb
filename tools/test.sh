#!/usr/bin/env bash
# Run every test of the project: the Rust core (cargo test, no Python), then
# pytest (binding contract, references, properties, xarray/dask, command line,
# docstring examples, notebooks). Installs what it needs into .venv first.
set -euo pipefail
cd "$(dirname "$0")/.."
bash tools/setup.sh
echo "== cargo test (pure Rust core)"
cargo test --quiet
echo "== cargo doc (every intra-doc link resolves; units are written \\[K\\])"
RUSTDOCFLAGS="-D warnings" cargo doc --no-deps --quiet
echo "== pytest"
.venv/bin/python -m pytest -p no:cacheprovider
