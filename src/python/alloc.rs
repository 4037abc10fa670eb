//! A NumPy memory handler (NEP 49) that keeps freed large buffers for reuse:
//! the outputs of wetboil's array calls.
//!
//! Why: a large array's first write costs a page fault per page, in which the
//! kernel finds and zeroes fresh memory. On the 2-core VMs we measure on this
//! costs about 7 ms per 80 MB (10^7 float64), and it does not get faster with
//! more threads (the faults are serialised), so it caps the thread scaling of
//! every memory-bound kernel and makes up a third of a Fritz evaluation. A
//! sweep that calls the same functions over and over on arrays of the same
//! size (chunks of a sweep, Monte-Carlo batches, the iterations of a thermal
//! model) frees and reallocates the same sizes each time; handing a freed
//! buffer back out skips the faults.
//!
//! Scope: the handler is installed (a context variable of NumPy's, so per
//! thread and per async task) only around wetboil's own array evaluations
//! (`wetboil._api.evaluate_arrays`); every other allocation of the process
//! keeps NumPy's default handler. Arrays remember their handler, so buffers
//! allocated here come back here when freed, wherever that happens.
//!
//! Rules:
//! * Every block carries a 64-byte header with its size (NumPy's `size`
//!   argument to `free` is not relied on), and comes from the C library's
//!   `posix_memalign`/`calloc`/`realloc`, so the C library can always take it
//!   back. Blocks from `malloc` requests start on a 64-byte boundary (on
//!   Unix), so their payload does too: the block loops then write large
//!   outputs with full-cache-line non-temporal stores
//!   (`ufunc::stream_block`). Only such blocks are kept for reuse (a block
//!   from `calloc` or `realloc` is only 16-byte aligned and goes back to the
//!   C library), so a reused block is aligned as well.
//! * Only blocks of at least [`MIN_CACHED`] bytes are kept, at most
//!   [`SLOTS`] of them and at most `max_bytes` in all (default: 1/8 of the
//!   physical memory, at most 2 GiB; `WETBOIL_BUFFER_CACHE_MB`, or
//!   `wetboil.set_buffer_cache`; 0 turns it off and frees what is held).
//!   The oldest are returned to the C library first.
//! * A request is served from the cache only by a block of exactly its size.
//! * `calloc` (zeroed memory) never comes from the cache.
//! * The lock is only ever tried: when it is taken by another thread (or was
//!   held at a `fork`), the call bypasses the cache. Nothing here blocks,
//!   allocates from Rust or panics.

use std::ffi::{c_char, c_void};
use std::sync::atomic::{AtomicU64, AtomicUsize, Ordering};
use std::sync::{Mutex, OnceLock};

use pyo3::prelude::*;

/// Smallest block kept for reuse [bytes]: below this, faults are cheap and
/// the C library's own free lists do the job.
pub const MIN_CACHED: usize = 1 << 20;
/// Most blocks kept at once.
pub const SLOTS: usize = 32;
/// Header in front of every block: its size, and room for 64-byte alignment
/// of what follows relative to the block start.
const HEADER: usize = 64;

extern "C" {
    #[cfg(unix)]
    fn posix_memalign(out: *mut *mut c_void, align: usize, size: usize) -> i32;
    #[cfg(not(unix))]
    fn malloc(size: usize) -> *mut c_void;
    fn calloc(n: usize, size: usize) -> *mut c_void;
    fn realloc(p: *mut c_void, size: usize) -> *mut c_void;
    fn free(p: *mut c_void);
}

struct Held {
    /// (block start, payload size), oldest first.
    blocks: [(usize, usize); SLOTS],
    len: usize,
    bytes: usize,
}

impl Held {
    /// Remove block `k` and return it.
    fn take(&mut self, k: usize) -> (usize, usize) {
        let (b, s) = self.blocks[k];
        let len = self.len;
        self.blocks.copy_within(k + 1..len, k);
        self.len -= 1;
        self.bytes -= s;
        (b, s)
    }
}

static HELD: Mutex<Held> = Mutex::new(Held { blocks: [(0, 0); SLOTS], len: 0, bytes: 0 });
/// usize::MAX: not decided yet (read from the environment on first use).
static MAX_BYTES: AtomicUsize = AtomicUsize::new(usize::MAX);
static HITS: AtomicU64 = AtomicU64::new(0);
static MISSES: AtomicU64 = AtomicU64::new(0);

fn default_max_bytes() -> usize {
    if let Some(mb) = std::env::var("WETBOIL_BUFFER_CACHE_MB").ok().and_then(|s| s.trim().parse::<usize>().ok()) {
        return mb.saturating_mul(1 << 20);
    }
    physical_memory().map(|m| m / 8).unwrap_or(1 << 30).min(2 << 30)
}

#[cfg(target_os = "linux")]
fn physical_memory() -> Option<usize> {
    extern "C" {
        fn sysconf(name: i32) -> i64;
    }
    const SC_PAGESIZE: i32 = 30;
    const SC_PHYS_PAGES: i32 = 85;
    // SAFETY: sysconf has no preconditions.
    let (pages, size) = unsafe { (sysconf(SC_PHYS_PAGES), sysconf(SC_PAGESIZE)) };
    (pages > 0 && size > 0).then(|| (pages as usize).saturating_mul(size as usize))
}

#[cfg(not(target_os = "linux"))]
fn physical_memory() -> Option<usize> {
    None
}

pub fn max_bytes() -> usize {
    match MAX_BYTES.load(Ordering::Relaxed) {
        usize::MAX => {
            let m = default_max_bytes();
            MAX_BYTES.store(m, Ordering::Relaxed);
            m
        }
        m => m,
    }
}

/// Set the most bytes kept (0: none, and free what is held); returns the
/// previous value.
pub fn set_max_bytes(m: usize) -> usize {
    let old = max_bytes();
    MAX_BYTES.store(m.min(usize::MAX - 1), Ordering::Relaxed);
    trim(m);
    old
}

/// Give back the oldest blocks until at most `limit` bytes are held.
fn trim(limit: usize) {
    let mut out = [0usize; SLOTS];
    let mut n = 0;
    if let Ok(mut h) = HELD.try_lock() {
        while h.bytes > limit && h.len > 0 {
            out[n] = h.take(0).0;
            n += 1;
        }
    }
    for &b in &out[..n] {
        // SAFETY: blocks in the cache came from malloc/realloc and are owned by it.
        unsafe { free(b as *mut c_void) };
    }
}

/// `(max_bytes, held_bytes, held_blocks, hits, misses)`.
pub fn info() -> (usize, usize, usize, u64, u64) {
    let (bytes, len) = HELD.try_lock().map(|h| (h.bytes, h.len)).unwrap_or((0, 0));
    (max_bytes(), bytes, len, HITS.load(Ordering::Relaxed), MISSES.load(Ordering::Relaxed))
}

/// Write the header of a block and return its payload.
///
/// # Safety
/// `block` is null or the start of at least `HEADER + size` bytes.
unsafe fn payload(block: *mut c_void, size: usize) -> *mut c_void {
    if block.is_null() {
        return block;
    }
    unsafe {
        (block as *mut usize).write(size);
        (block as *mut u8).add(HEADER) as *mut c_void
    }
}

/// The block start and payload size of a payload.
///
/// # Safety
/// `p` was returned by this handler and not freed.
unsafe fn block_of(p: *mut c_void) -> (*mut c_void, usize) {
    unsafe {
        let block = (p as *mut u8).sub(HEADER) as *mut c_void;
        (block, (block as *const usize).read())
    }
}

/// Ask the kernel for transparent huge pages on a large fresh block, as NumPy's
/// default allocator does (fewer faults and TLB misses where THP is enabled).
#[cfg(target_os = "linux")]
fn advise_huge(block: *mut c_void, len: usize) {
    extern "C" {
        fn madvise(addr: *mut c_void, len: usize, advice: i32) -> i32;
    }
    const MADV_HUGEPAGE: i32 = 14;
    const PAGE: usize = 4096;
    if len < (4 << 20) {
        return;
    }
    let start = (block as usize).div_ceil(PAGE) * PAGE;
    let end = (block as usize + len) / PAGE * PAGE;
    if end > start {
        // SAFETY: the range lies inside a block we own; madvise only advises.
        unsafe { madvise(start as *mut c_void, end - start, MADV_HUGEPAGE) };
    }
}

#[cfg(not(target_os = "linux"))]
fn advise_huge(_block: *mut c_void, _len: usize) {}

/// `size` bytes from the C library starting on a cache line (64 bytes) where the platform has
/// `posix_memalign`, else from `malloc`; null on failure. `free` and `realloc` take either.
///
/// # Safety
/// Plain C allocation; the caller owns the block.
#[cfg(unix)]
unsafe fn aligned_block(size: usize) -> *mut c_void {
    let mut block = std::ptr::null_mut();
    // SAFETY: writes a pointer into a local; on failure it is not set.
    if unsafe { posix_memalign(&mut block, 64, size) } != 0 {
        return std::ptr::null_mut();
    }
    block
}

#[cfg(not(unix))]
unsafe fn aligned_block(size: usize) -> *mut c_void {
    unsafe { malloc(size) }
}

unsafe extern "C" fn h_malloc(_ctx: *mut c_void, size: usize) -> *mut c_void {
    let Some(total) = size.checked_add(HEADER) else {
        return std::ptr::null_mut();
    };
    if size >= MIN_CACHED {
        if let Ok(mut h) = HELD.try_lock() {
            // newest first: the most recently freed block is the likeliest to be cached and mapped
            if let Some(k) = (0..h.len).rev().find(|&k| h.blocks[k].1 == size) {
                let (b, _) = h.take(k);
                drop(h);
                HITS.fetch_add(1, Ordering::Relaxed);
                // SAFETY: the block holds HEADER + size bytes (its header says so).
                return unsafe { payload(b as *mut c_void, size) };
            }
        }
        MISSES.fetch_add(1, Ordering::Relaxed);
    }
    // SAFETY: plain C allocation.
    let block = unsafe { aligned_block(total) };
    if !block.is_null() {
        advise_huge(block, total);
    }
    unsafe { payload(block, size) }
}

unsafe extern "C" fn h_calloc(_ctx: *mut c_void, n: usize, elsize: usize) -> *mut c_void {
    let Some(size) = n.checked_mul(elsize) else {
        return std::ptr::null_mut();
    };
    let Some(total) = size.checked_add(HEADER) else {
        return std::ptr::null_mut();
    };
    // SAFETY: plain C allocation; the payload is zeroed by calloc.
    unsafe { payload(calloc(1, total), size) }
}

unsafe extern "C" fn h_realloc(ctx: *mut c_void, p: *mut c_void, size: usize) -> *mut c_void {
    if p.is_null() {
        return unsafe { h_malloc(ctx, size) };
    }
    let Some(total) = size.checked_add(HEADER) else {
        return std::ptr::null_mut();
    };
    // SAFETY: `p` came from this handler; its block from the C library.
    unsafe {
        let (block, _) = block_of(p);
        payload(realloc(block, total), size)
    }
}

unsafe extern "C" fn h_free(_ctx: *mut c_void, p: *mut c_void, _size: usize) {
    if p.is_null() {
        return;
    }
    // SAFETY: `p` came from this handler.
    let (block, size) = unsafe { block_of(p) };
    let limit = max_bytes();
    // kept only when aligned as `h_malloc`'s own blocks are, so that every reused block is
    if size >= MIN_CACHED && size <= limit && block as usize % 64 == 0 {
        if let Ok(mut h) = HELD.try_lock() {
            let mut out = [0usize; SLOTS];
            let mut n = 0;
            while h.len > 0 && (h.len == SLOTS || h.bytes + size > limit) {
                out[n] = h.take(0).0;
                n += 1;
            }
            let len = h.len;
            h.blocks[len] = (block as usize, size);
            h.len += 1;
            h.bytes += size;
            drop(h);
            for &b in &out[..n] {
                // SAFETY: evicted blocks came from the C library and are no longer held.
                unsafe { free(b as *mut c_void) };
            }
            return;
        }
    }
    // SAFETY: the block came from the C library.
    unsafe { free(block) };
}

#[repr(C)]
struct Allocator {
    ctx: *mut c_void,
    malloc: unsafe extern "C" fn(*mut c_void, usize) -> *mut c_void,
    calloc: unsafe extern "C" fn(*mut c_void, usize, usize) -> *mut c_void,
    realloc: unsafe extern "C" fn(*mut c_void, *mut c_void, usize) -> *mut c_void,
    free: unsafe extern "C" fn(*mut c_void, *mut c_void, usize),
}

/// `PyDataMem_Handler` of NumPy's `ndarraytypes.h` (version 1).
#[repr(C)]
struct Handler {
    name: [c_char; 127],
    version: u8,
    allocator: Allocator,
}

// SAFETY: immutable after construction; the context pointer is unused (null).
unsafe impl Sync for Handler {}

const fn handler_name() -> [c_char; 127] {
    let s = b"wetboil_buffer_cache";
    let mut n = [0 as c_char; 127];
    let mut i = 0;
    while i < s.len() {
        n[i] = s[i] as c_char;
        i += 1;
    }
    n
}

static HANDLER: Handler = Handler {
    name: handler_name(),
    version: 1,
    allocator: Allocator { ctx: std::ptr::null_mut(), malloc: h_malloc, calloc: h_calloc, realloc: h_realloc, free: h_free },
};

/// NumPy's `PyDataMem_SetHandler` and our handler's capsule, or None when the
/// running NumPy predates NEP 49 (1.22).
struct Api {
    set_handler: unsafe extern "C" fn(*mut pyo3::ffi::PyObject) -> *mut pyo3::ffi::PyObject,
    capsule: Py<PyAny>,
}

fn api(py: Python<'_>) -> Option<&'static Api> {
    static API: OnceLock<Option<Api>> = OnceLock::new();
    API.get_or_init(|| load_api(py).ok().flatten()).as_ref()
}

fn load_api(py: Python<'_>) -> PyResult<Option<Api>> {
    let module = py.import("numpy._core._multiarray_umath").or_else(|_| py.import("numpy.core._multiarray_umath"))?;
    let table = module.getattr("_ARRAY_API")?;
    // SAFETY: `_ARRAY_API` is NumPy's C-API capsule (unnamed), a table of
    // function pointers that lives as long as NumPy is loaded (the process).
    unsafe {
        let t = pyo3::ffi::PyCapsule_GetPointer(table.as_ptr(), std::ptr::null()) as *const *const c_void;
        if t.is_null() {
            pyo3::ffi::PyErr_Clear();
            return Ok(None);
        }
        // slot 211: PyArray_GetNDArrayCFeatureVersion; NEP 49 needs 0x0f (NumPy 1.22)
        let feature = std::mem::transmute::<*const c_void, extern "C" fn() -> u32>(*t.add(211));
        if feature() < 0x0f {
            return Ok(None);
        }
        type SetHandler = unsafe extern "C" fn(*mut pyo3::ffi::PyObject) -> *mut pyo3::ffi::PyObject;
        let set_handler = std::mem::transmute::<*const c_void, SetHandler>(*t.add(304));
        let capsule = pyo3::ffi::PyCapsule_New(&HANDLER as *const Handler as *mut c_void, c"mem_handler".as_ptr(), None);
        let capsule = Bound::from_owned_ptr_or_err(py, capsule)?.unbind();
        Ok(Some(Api { set_handler, capsule }))
    }
}

/// Make this handler NumPy's current one (in this thread's context) and
/// return the previous one, or None (nothing changed: the cache is off, or
/// NumPy lacks NEP 49).
pub fn enter(py: Python<'_>) -> PyResult<Option<Py<PyAny>>> {
    if max_bytes() == 0 {
        return Ok(None);
    }
    let Some(api) = api(py) else { return Ok(None) };
    // SAFETY: NumPy's API function with a valid "mem_handler" capsule; it
    // returns a new reference to the previous handler, or NULL with an error.
    let old = unsafe { (api.set_handler)(api.capsule.as_ptr()) };
    Ok(Some(unsafe { Bound::from_owned_ptr_or_err(py, old)? }.unbind()))
}

/// Restore the handler `enter` returned.
pub fn exit(py: Python<'_>, old: Option<Py<PyAny>>) -> PyResult<()> {
    let (Some(old), Some(api)) = (old, api(py)) else { return Ok(()) };
    // SAFETY: as in `enter`; `old` is a handler capsule NumPy gave us.
    let prev = unsafe { (api.set_handler)(old.as_ptr()) };
    unsafe { Bound::from_owned_ptr_or_err(py, prev) }.map(drop)
}
