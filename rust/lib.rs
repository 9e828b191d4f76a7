//! druse's Rust core: kernels for type A crystals. Kernel modules know nothing of Python;
//! the bindings in `py/` convert and call them.

pub mod crystal;
pub mod error;
pub mod job;
pub mod partition;
pub mod schur;
pub mod tableau;

#[cfg(feature = "python")]
mod py;

#[cfg(feature = "python")]
use pyo3::prelude::*;

#[cfg(feature = "python")]
#[pymodule]
fn _core(m: &Bound<'_, PyModule>) -> PyResult<()> {
    py::register(m)
}
