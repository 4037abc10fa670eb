"""The buffer cache: wetboil's large results are allocated through a NumPy
memory handler (NEP 49) that keeps freed buffers for the next result of the
same size (src/python/alloc.rs). These tests check that it is used only where
it should be, that reused buffers never leak old values into new results, that
its limits hold, and that every allocation path of the handler (malloc,
calloc, realloc, free) gives NumPy working memory. The expected values are
wetboil's own results with the cache off: this is a check of the mechanism,
not of the physics."""

import sys
import threading

import numpy as np
import pytest

import wetboil
from wetboil import departure, _core
from wetboil.fluids import water

handler_name = np._core.multiarray.get_handler_name

W = water(p=101325.0)
N = 300_000  # 2.4 MB per float64 array: above the 1 MiB the cache keeps


@pytest.fixture
def cache():
    """A fresh cache of 256 MiB for the test; the previous limit afterwards."""
    old = wetboil.set_buffer_cache(0)  # frees whatever earlier tests left
    wetboil.set_buffer_cache(256 << 20)
    yield
    wetboil.set_buffer_cache(old)


def test_results_use_the_handler_and_the_default_is_restored(cache):
    d = departure.fritz(np.linspace(1.0, 90.0, N), W)
    assert handler_name(d) == "wetboil_buffer_cache"
    if sys.platform != "win32":  # posix_memalign: a cache line's alignment, for full-line non-temporal stores
        assert d.ctypes.data % 64 == 0
    assert handler_name() == "default_allocator"  # the context is restored after the call
    assert handler_name(np.empty(N)) == "default_allocator"  # other allocations are untouched


def test_handler_restored_when_the_call_raises(cache):
    angles = np.full(N, 45.0)
    angles[7] = 200.0  # impossible: raised from inside the evaluation, after the outputs exist
    with wetboil.errstate(invalid="raise"), pytest.raises(wetboil.WetboilError):
        departure.fritz(angles, W)
    assert handler_name() == "default_allocator"


def test_freed_result_is_reused_without_stale_values(cache):
    a = np.linspace(1.0, 90.0, N)
    b = a[::-1].copy()
    first = departure.fritz(a, W)
    address = first.__array_interface__["data"][0]
    del first
    info = wetboil.buffer_cache_info()
    assert info["held_blocks"] == 1 and info["held_bytes"] == 8 * N
    hits = info["hits"]
    second = departure.fritz(b, W)
    assert wetboil.buffer_cache_info()["hits"] == hits + 1
    assert second.__array_interface__["data"][0] == address  # the same memory, handed out again
    wetboil.set_buffer_cache(0)
    expect = departure.fritz(b, W)  # cache off: fresh memory
    assert handler_name(expect) == "default_allocator"
    np.testing.assert_array_equal(second, expect)


def test_limits_hold(cache):
    wetboil.set_buffer_cache(3 * 8 * N)  # room for three results
    keep = [departure.fritz(np.full(N, 10.0 + i), W) for i in range(6)]
    del keep
    info = wetboil.buffer_cache_info()
    assert info["held_bytes"] <= 3 * 8 * N and info["held_blocks"] == 3
    # small results are never kept
    before = wetboil.buffer_cache_info()["held_blocks"]
    small = departure.fritz(np.full(1000, 10.0), W)
    del small
    assert wetboil.buffer_cache_info()["held_blocks"] == before
    assert wetboil.set_buffer_cache(0) == 3 * 8 * N
    assert wetboil.buffer_cache_info()["held_bytes"] == 0


def test_every_allocation_path_gives_working_memory(cache):
    token = _core._cache_enter()
    try:
        z = np.zeros(N)  # calloc: zeroed, never from the cache
        e = np.empty(N)  # malloc
        e[:] = 7.0
        e.resize(3 * N, refcheck=False)  # realloc, growing
        e[N:] = 1.0
        s = np.empty(N)
        s.resize(10, refcheck=False)  # realloc, shrinking below the cached size
    finally:
        _core._cache_exit(token)
    assert handler_name(z) == handler_name(e) == "wetboil_buffer_cache"
    assert not z.any()
    assert (e[:N] == 7.0).all() and (e[N:] == 1.0).all()
    del z, e, s  # free through the handler, whichever path allocated
    z2 = np.zeros(N)
    assert not z2.any()


def test_reused_blocks_stay_cache_line_aligned(cache):
    # calloc and realloc blocks are only 16-byte aligned: freed, they must not be handed out again for
    # a malloc of their size (which promises 64 bytes, for full-line non-temporal stores)
    token = _core._cache_enter()
    try:
        for _ in range(3):
            z = np.zeros(N)  # calloc
            r = np.empty(N // 2)
            r.resize(N, refcheck=False)  # realloc to N elements
            del r
            del z  # the newest freed block: the first one a malloc of its size would get
            e1, e2 = np.empty(N), np.empty(N)  # mallocs of the same size
            if sys.platform != "win32":
                assert e1.ctypes.data % 64 == 0 and e2.ctypes.data % 64 == 0
            del e1, e2
    finally:
        _core._cache_exit(token)


def test_bad_limits_raise():
    for bad in (-1, 1.5, "1", True):
        with pytest.raises(wetboil.WetboilValueError):
            wetboil.set_buffer_cache(bad)


def test_threads_share_the_cache_safely(cache):
    a = np.linspace(1.0, 90.0, N)
    expect = departure.fritz(a, W)
    errors = []

    def work(k):
        try:
            for _ in range(20):
                got = departure.fritz(a * (1.0 + 0.0 * k), W)
                if not np.array_equal(got, expect):
                    errors.append(k)
                del got
        except Exception as exc:  # pragma: no cover - reported below
            errors.append(repr(exc))

    threads = [threading.Thread(target=work, args=(k,)) for k in range(4)]
    for t in threads:
        t.start()
    for t in threads:
        t.join()
    assert not errors
    assert wetboil.buffer_cache_info()["hits"] > 0
