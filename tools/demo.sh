#!/usr/bin/env bash
# Run the built-in demo scenario end to end (invented surfaces, built-in
# data) and print where its outputs went. Installs what it needs into .venv.
set -euo pipefail
cd "$(dirname "$0")/.."
bash tools/setup.sh
.venv/bin/python -m wetboil demo "$@"
