//! Which SIMD clone of a hot loop to run: the one run-time dispatch shared
//! by the binding's block loops and `water::saturation_t`.
//!
//! Clones are compiled with `#[target_feature]` for AVX2/FMA and for AVX-512
//! beside the baseline x86-64 code. Rust never contracts `a*b + c` into a
//! fused multiply-add by itself, and the explicit ones (`mul_add`) are
//! correctly rounded whether they run as one instruction or as the C
//! library's `fma`, so every clone gives the same bits; the tests lower the
//! cap with [`set_cap`] and compare them.

use std::sync::atomic::{AtomicU8, Ordering};

/// Baseline x86-64 (SSE2) or any other architecture.
pub const BASELINE: u8 = 0;
/// AVX2 and FMA.
pub const AVX2: u8 = 1;
/// AVX-512 F, DQ and VL, with AVX2 and FMA.
pub const AVX512: u8 = 2;

static CAP: AtomicU8 = AtomicU8::new(AVX512);

/// [`level`] once detected; [`UNKNOWN`] until then and after [`set_cap`].
static LEVEL: AtomicU8 = AtomicU8::new(UNKNOWN);
const UNKNOWN: u8 = u8::MAX;

/// The widest clone this CPU supports, within the cap: one relaxed load once
/// detected (a scalar call from Python pays it on every call).
#[inline(always)]
pub fn level() -> u8 {
    match LEVEL.load(Ordering::Relaxed) {
        UNKNOWN => detect(),
        level => level,
    }
}

#[cold]
fn detect() -> u8 {
    loop {
        let cap = CAP.load(Ordering::SeqCst);
        let level = detect_within(cap);
        LEVEL.store(level, Ordering::SeqCst);
        // a `set_cap` in between may have been overwritten: detect again
        if CAP.load(Ordering::SeqCst) == cap {
            return level;
        }
    }
}

fn detect_within(cap: u8) -> u8 {
    #[cfg(target_arch = "x86_64")]
    {
        use std::arch::is_x86_feature_detected as has;
        if cap >= AVX2 && has!("avx2") && has!("fma") {
            if cap >= AVX512 && has!("avx512f") && has!("avx512dq") && has!("avx512vl") {
                return AVX512;
            }
            return AVX2;
        }
    }
    let _ = cap;
    BASELINE
}

/// Cap the clones used from now on (for tests) and return the previous cap.
pub fn set_cap(level: u8) -> u8 {
    let previous = CAP.swap(level.min(AVX512), Ordering::SeqCst);
    LEVEL.store(UNKNOWN, Ordering::SeqCst);
    previous
}

/// `$vis fn $name($arg: $t) -> $r` running `$body::<true>` in a clone `$clone` compiled for AVX2 and
/// FMA where [`level`] allows it, else `$body::<false>` (the const parameter tells the body whether it
/// may use `mul_add` as one instruction). Written once for the entry points of `water`.
///
/// A third name (`fn name / avx2_clone / avx512_clone`) adds a clone compiled for AVX-512 as well, for
/// bodies that loop over a block: it runs the same `$body::<true>` with 8 lanes instead of 4, so the
/// two clones give the same bits (the fused multiply-adds are the same operations).
macro_rules! fma_dispatch {
    ($(#[$meta:meta])* $vis:vis fn $name:ident / $clone:ident ($arg:ident: $t:ty) -> $r:ty = $body:ident) => {
        $(#[$meta])*
        $vis fn $name($arg: $t) -> $r {
            #[cfg(target_arch = "x86_64")]
            if $crate::simd::level() >= $crate::simd::AVX2 {
                // SAFETY: the CPU has the features the clone was compiled for.
                return unsafe { $clone($arg) };
            }
            $body::<false>($arg)
        }

        #[cfg(target_arch = "x86_64")]
        #[target_feature(enable = "avx2,fma")]
        unsafe fn $clone($arg: $t) -> $r {
            $body::<true>($arg)
        }
    };
    ($(#[$meta:meta])* $vis:vis fn $name:ident / $clone:ident / $clone512:ident ($arg:ident: $t:ty) -> $r:ty = $body:ident) => {
        $(#[$meta])*
        $vis fn $name($arg: $t) -> $r {
            #[cfg(target_arch = "x86_64")]
            match $crate::simd::level() {
                // SAFETY: the CPU has the features the clone was compiled for.
                $crate::simd::AVX512 => return unsafe { $clone512($arg) },
                $crate::simd::AVX2 => return unsafe { $clone($arg) },
                _ => {}
            }
            $body::<false>($arg)
        }

        #[cfg(target_arch = "x86_64")]
        #[target_feature(enable = "avx2,fma")]
        unsafe fn $clone($arg: $t) -> $r {
            $body::<true>($arg)
        }

        #[cfg(target_arch = "x86_64")]
        #[target_feature(enable = "avx512f,avx512dq,avx512vl,avx2,fma")]
        unsafe fn $clone512($arg: $t) -> $r {
            $body::<true>($arg)
        }
    };
}
pub(crate) use fma_dispatch;
