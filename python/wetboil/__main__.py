"""``python -m wetboil``: the command line (see `wetboil.cli`)."""

import sys

from .cli import main

sys.exit(main())
