"""Shared test configuration.

Hypothesis explores new examples on every developer run; under CI (the CI
environment variable set, as `.ci/run` is) it runs a fixed, reproducible set
so that a red build always points at a reproducible failure.
"""

import os

try:
    from hypothesis import settings

    settings.register_profile("ci", derandomize=True, print_blob=True)
    if os.environ.get("CI"):
        settings.load_profile("ci")
except ImportError:  # pragma: no cover
    pass
