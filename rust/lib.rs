//! druse's Rust core: kernels for type A crystals. Kernel modules know nothing of Python;
//! the bindings in `py/` convert and call them.

pub mod axioms;
pub mod crystal;
pub mod demazure;
pub mod error;
pub mod job;
pub mod lr;
pub mod memory;
pub mod partition;
pub mod perm;
pub mod poly;
pub mod schubert;
pub mod schur;
pub mod tableau;
pub mod tensor;

#[cfg(feature = "python")]
#[allow(clippy::needless_pass_by_value)] // PyO3 hands extracted arguments over by value
mod py;

#[cfg(feature = "python")]
use pyo3::prelude::*;

#[cfg(feature = "python")]
#[pymodule]
fn _core(m: &Bound<'_, PyModule>) -> PyResult<()> {
    py::register(m)
}
