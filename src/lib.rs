//! # wetboil core
//!
//! Pure-Rust scalar kernels for how a heated surface's wettability changes
//! boiling: one `f64` function per published model, with its equation, units,
//! validity range and original reference in its documentation. Every kernel is
//! pure, allocation-free and returns NaN for physically impossible input.
//!
//! Each model also has a zero-sized type implementing [`model::Kernel`], which
//! carries its facts ([`model::Model`]); with the `python` feature, the
//! `python` module turns every such kernel into a NumPy ufunc through one
//! generic mechanism.

pub mod boiling;
pub mod chain;
pub mod chf;
pub mod departure;
pub mod fastmath;
pub mod model;
pub mod nucleation;
pub mod simd;
pub mod trig;
pub mod water;
pub mod wetting;

#[cfg(test)]
mod fuzz;

#[cfg(feature = "python")]
mod python;
