//! The wetboil thread pool used by large ufunc calls.
//!
//! Its size is `WETBOIL_NUM_THREADS` when set, else the machine's available
//! parallelism, and can be changed at run time with `set_num_threads`. A pool
//! of one thread means no pool: everything runs on the calling thread.
//!
//! Fork safety: a child created by `fork()` inherits the pool's bookkeeping but
//! none of its threads, so using it would hang. `after_fork_child` (registered
//! with `os.register_at_fork` by the Python package) drops the inherited pool
//! without touching its dead threads; the child builds a fresh one on demand.

use std::sync::atomic::{AtomicUsize, Ordering};
use std::sync::{Arc, Mutex};

static POOL: Mutex<Option<Arc<rayon::ThreadPool>>> = Mutex::new(None);
/// Requested size; 0 means "not decided yet".
static REQUESTED: AtomicUsize = AtomicUsize::new(0);

fn default_threads() -> usize {
    std::env::var("WETBOIL_NUM_THREADS")
        .ok()
        .and_then(|s| s.trim().parse::<usize>().ok())
        .filter(|&n| n >= 1)
        .unwrap_or_else(|| std::thread::available_parallelism().map(|n| n.get()).unwrap_or(1))
}

/// The number of threads large calls use.
pub fn num_threads() -> usize {
    match REQUESTED.load(Ordering::Relaxed) {
        0 => {
            let n = default_threads();
            REQUESTED.store(n, Ordering::Relaxed);
            n
        }
        n => n,
    }
}

/// Change the number of threads (at least 1). The new size applies to the next call.
pub fn set_num_threads(n: usize) {
    let n = n.max(1);
    REQUESTED.store(n, Ordering::Relaxed);
    // One thread needs no pool (`pool` returns None), so the pool is kept for
    // a later return to its size: switching 2 -> 1 -> 2 threads costs no
    // thread start-up.
    if n == 1 {
        return;
    }
    if let Ok(mut guard) = POOL.lock() {
        if guard.as_ref().is_some_and(|p| p.current_num_threads() != n) {
            *guard = None; // running calls keep their Arc; the pool ends when they finish
        }
    }
}

/// The pool to run on, or `None` to run on the calling thread.
pub fn pool() -> Option<Arc<rayon::ThreadPool>> {
    let n = num_threads();
    if n <= 1 {
        return None;
    }
    let mut guard = POOL.lock().ok()?;
    if let Some(p) = guard.as_ref() {
        if p.current_num_threads() == n {
            return Some(p.clone());
        }
    }
    let p = Arc::new(
        rayon::ThreadPoolBuilder::new().num_threads(n).thread_name(|i| format!("wetboil-{i}")).build().ok()?,
    );
    *guard = Some(p.clone());
    Some(p)
}

/// Forget the pool inherited through `fork()` (its threads do not exist in the
/// child). If the lock was held at the moment of the fork, the child runs on one
/// thread from then on rather than risk a deadlock.
pub fn after_fork_child() {
    match POOL.try_lock() {
        Ok(mut guard) => {
            if let Some(p) = guard.take() {
                std::mem::forget(p);
            }
        }
        Err(_) => REQUESTED.store(1, Ordering::Relaxed),
    }
}
