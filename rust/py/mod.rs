//! PyO3 bindings: conversions only, one file per kernel module.
mod axioms;
mod convert;
mod crystal;
mod demazure;
mod errors;
mod factorization;
mod keys;
mod lr;
mod pipes;
mod poly;
mod run;
mod schubert;
mod schur;
mod tableau;
mod tensor;

use pyo3::prelude::*;

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    tableau::register(m)?;
    crystal::register(m)?;
    schur::register(m)?;
    poly::register(m)?;
    demazure::register(m)?;
    keys::register(m)?;
    tensor::register(m)?;
    lr::register(m)?;
    schubert::register(m)?;
    pipes::register(m)?;
    axioms::register(m)?;
    factorization::register(m)?;
    Ok(())
}
