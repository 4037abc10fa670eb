"""wetboil: how a heated surface's wettability changes boiling.

Vectorised, source-checked kernels from contact angles to critical heat flux,
with a Rust core. Every public function takes SI units (angles in degrees,
contact angles through the liquid), broadcasts like NumPy, keeps xarray labels
and dask laziness, and reports impossible or out-of-range elements by NaN plus
one warning per call (see `errstate`).

.. warning::
   Critical heat flux and burnout predictions carry correlation uncertainty
   of tens of percent and hold only inside their published validity ranges.
   Apply safety margins and defer to local codes and licensed engineering
   practice.
"""

from . import _core
from ._api import (
    VALIDITY_CODES,
    buffer_cache_info,
    get_num_threads,
    model_of,
    models,
    set_buffer_cache,
    set_num_threads,
    ufunc_of,
    validity,
)
from ._errors import (
    InvalidValueError,
    InvalidValueWarning,
    OutOfRangeError,
    RangeWarning,
    WetboilError,
    WetboilTypeError,
    WetboilValueError,
    WetboilWarning,
    errstate,
    geterr,
)
from . import fluids, nucleation, departure, chf, wetting, boiling  # noqa: E402  (topic modules)
from .surface import Surface, load_surfaces, save_surfaces  # noqa: E402
from .sweep import screen, sweep, water_chain  # noqa: E402

__version__ = "0.1.0"

__all__ = [
    "fluids",
    "nucleation",
    "departure",
    "chf",
    "wetting",
    "boiling",
    "Surface",
    "load_surfaces",
    "save_surfaces",
    "screen",
    "sweep",
    "water_chain",
    "errstate",
    "geterr",
    "models",
    "model_of",
    "ufunc_of",
    "validity",
    "VALIDITY_CODES",
    "set_num_threads",
    "get_num_threads",
    "set_buffer_cache",
    "buffer_cache_info",
    "WetboilError",
    "WetboilTypeError",
    "WetboilValueError",
    "InvalidValueError",
    "OutOfRangeError",
    "WetboilWarning",
    "InvalidValueWarning",
    "RangeWarning",
]
