"""Type stubs of the compiled extension module (Rust, src/python/)."""

from typing import Any, Callable, List, Optional, Sequence, Tuple

import numpy as np
from typing_extensions import final

MAX_INPUTS: int
MAX_OUTPUTS: int
MAX_ARGS: int

@final
class Front:
    """State behind one public builtin function (its ``__self__``)."""

    @property
    def kernels(self) -> List[str]: ...
    @property
    def fallback(self) -> Callable[..., Any]: ...
    def __reduce__(self) -> Tuple[Any, Tuple[str]]: ...

def make_function(
    choices: Sequence[Tuple[Any, str, Sequence[Tuple[int, int]], int, Optional[Callable[..., Any]]]],
    selector: int,
    names: Sequence[str],
    defaults: Sequence[Optional[Any]],
    fallback: Callable[..., Any],
    module: str,
    name: str,
    doc: str,
) -> Callable[..., Any]: ...
def take_counts() -> Tuple[int, int]: ...
def grid_call(kernel: str, inputs: List[np.ndarray], outputs: List[np.ndarray]) -> Tuple[int, int]: ...
def models_json() -> str: ...
def get_num_threads() -> int: ...
def set_num_threads(n: int) -> None: ...
def _after_fork_child() -> None: ...

# One NumPy ufunc per registered kernel, named after the kernel
# (wetboil.models() lists them).
def __getattr__(name: str) -> np.ufunc: ...
