//! Bindings for `lr`: Littlewood-Richardson multiplicities.
use super::run::run_detached;
use crate::lr;
use pyo3::prelude::*;

/// A list of (lambda, count); counts become Python ints either way, exactly.
impl<'py> IntoPyObject<'py> for lr::Terms {
    type Target = PyAny;
    type Output = Bound<'py, PyAny>;
    type Error = PyErr;

    fn into_pyobject(self, py: Python<'py>) -> Result<Self::Output, Self::Error> {
        Ok(match self {
            lr::Terms::Small(terms) => terms.into_pyobject(py)?.into_any(),
            lr::Terms::Big(terms) => terms.into_pyobject(py)?.into_any(),
        })
    }
}

/// c^lambda_{mu nu} for every lambda: a list of (lambda, count), lambda decreasing.
#[pyfunction]
fn lr_terms(py: Python<'_>, mu: Vec<usize>, nu: Vec<usize>) -> PyResult<lr::Terms> {
    run_detached(py, |job| lr::lr(&mu, &nu, job))
}

/// `lr_terms` for each (mu, nu) of `pairs`, in parallel, in the order given.
#[pyfunction]
fn lr_batch(py: Python<'_>, pairs: Vec<(Vec<usize>, Vec<usize>)>) -> PyResult<Vec<lr::Terms>> {
    run_detached(py, |job| lr::lr_batch(&pairs, job))
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(lr_terms, m)?)?;
    m.add_function(wrap_pyfunction!(lr_batch, m)?)?;
    Ok(())
}
