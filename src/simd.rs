//! Which SIMD clone of a hot loop to run: the one run-time dispatch shared
//! by the binding's block loops and `water::saturation_t`.
//!
//! Clones are compiled with `#[target_feature]` for AVX2/FMA and for AVX-512
//! beside the baseline x86-64 code. Rust never contracts `a*b + c` into a
//! fused multiply-add by itself, and the explicit ones (`mul_add`) round once
//! whether they run as one instruction or as a call to the linked `fma` (see
//! `fastmath`), so every clone gives the same bits; the tests lower the cap
//! with [`set_cap`] and compare them.

use std::sync::atomic::{AtomicU8, Ordering};

/// Baseline x86-64 (SSE2) or any other architecture.
pub const BASELINE: u8 = 0;
/// AVX2 and FMA.
pub const AVX2: u8 = 1;
/// AVX-512 F, DQ and VL, with AVX2 and FMA.
pub const AVX512: u8 = 2;

static CAP: AtomicU8 = AtomicU8::new(AVX512);

/// The CPU's widest clone once detected ([`UNKNOWN`] before): it never changes,
/// so threads that detect it at the same time store the same value.
static CPU: AtomicU8 = AtomicU8::new(UNKNOWN);
const UNKNOWN: u8 = u8::MAX;

/// The widest clone this CPU supports, within the cap: two relaxed loads once
/// detected (a scalar call from Python pays them on every call).
#[inline(always)]
pub fn level() -> u8 {
    let cpu = match CPU.load(Ordering::Relaxed) {
        UNKNOWN => detect(),
        cpu => cpu,
    };
    cpu.min(CAP.load(Ordering::Relaxed))
}

#[cold]
fn detect() -> u8 {
    #[allow(unused_mut)]
    let mut cpu = BASELINE;
    #[cfg(target_arch = "x86_64")]
    {
        use std::arch::is_x86_feature_detected as has;
        if has!("avx2") && has!("fma") {
            cpu = if has!("avx512f") && has!("avx512dq") && has!("avx512vl") { AVX512 } else { AVX2 };
        }
    }
    CPU.store(cpu, Ordering::Relaxed);
    cpu
}

/// Cap the clones used from now on (for tests) and return the previous cap.
pub fn set_cap(level: u8) -> u8 {
    CAP.swap(level.min(AVX512), Ordering::Relaxed)
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
