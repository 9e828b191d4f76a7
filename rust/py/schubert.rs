//! Bindings for `schubert`: one Schubert polynomial (two routes) and the whole-S_n batch.
use super::convert::{terms_out, BlockOut, TermsOut};
use super::run::run_detached;
use crate::error::Error;
use crate::perm;
use crate::poly::Terms;
use crate::schubert::{self, AllSchuberts};
use numpy::ndarray::Array1;
use numpy::IntoPyArray;
use pyo3::prelude::*;
use std::sync::{Mutex, MutexGuard, TryLockError};

/// Canonical terms to (exponents (T, nvars) int64, list of Python ints).
fn to_python(py: Python<'_>, terms: Terms) -> PyResult<TermsOut<'_>> {
    terms_out(py, terms.nvars, terms.exps, terms.coeffs)
}

/// S_w of the 1-based permutation `perm` by the transition recursion, canonical terms.
#[pyfunction]
fn schubert_terms(py: Python<'_>, perm: Vec<i64>) -> PyResult<TermsOut<'_>> {
    let w = perm::check_perm(&perm, "perm")?;
    let terms = run_detached(py, |job| schubert::schubert(&w, job))?;
    to_python(py, terms)
}

/// S_w of the 1-based permutation `perm` by divided differences from S_(w0), canonical terms.
#[pyfunction]
fn schubert_divided_terms(py: Python<'_>, perm: Vec<i64>) -> PyResult<TermsOut<'_>> {
    let w = perm::check_perm(&perm, "perm")?;
    let terms = run_detached(py, |job| schubert::by_divided_differences(&w, job))?;
    to_python(py, terms)
}

/// Estimated peak bytes of the whole-S_n batch, or None past the largest n considered.
#[pyfunction]
fn schubert_batch_bytes(n: usize) -> Option<u128> {
    schubert::estimated_batch_bytes(n)
}

/// Every S_w of S_n, computed in chunks (`advance`) so that the caller can report progress.
#[pyclass(module = "druse._core", frozen)]
pub struct SchubertBatch {
    n: usize,
    state: Mutex<AllSchuberts>,
}

#[pymethods]
impl SchubertBatch {
    #[new]
    fn new(n: usize, budget: u128) -> PyResult<Self> {
        let state = AllSchuberts::new(n, budget)?;
        Ok(SchubertBatch {
            n,
            state: Mutex::new(state),
        })
    }

    /// n!, the number of polynomials.
    fn total(&self) -> PyResult<usize> {
        Ok(self.lock()?.total())
    }

    /// Computes up to `count` more polynomials; returns how many are done in all.
    fn advance(&self, py: Python<'_>, count: usize) -> PyResult<usize> {
        let mut guard = self.lock()?;
        let state: &mut AllSchuberts = &mut guard; // a plain reference crosses threads
        run_detached(py, |job| state.advance(count, job))
    }

    /// (exponents (T, n), coefficients, offsets (n! + 1,)): S_w in lexicographic order of w.
    fn collect<'py>(&self, py: Python<'py>) -> PyResult<BlockOut<'py>> {
        let (exps, coeffs, offsets) = self.lock()?.collect()?;
        let (array, list) = terms_out(py, self.n, exps, coeffs)?;
        Ok((array, list, Array1::from_vec(offsets).into_pyarray(py)))
    }
}

impl SchubertBatch {
    fn lock(&self) -> Result<MutexGuard<'_, AllSchuberts>, Error> {
        // try_lock: blocking here while holding the GIL could deadlock with `advance`
        self.state.try_lock().map_err(|e| match e {
            TryLockError::WouldBlock => {
                Error::invalid("this Schubert batch is busy in another thread")
            }
            TryLockError::Poisoned(_) => {
                Error::invalid("this Schubert batch failed earlier; start a new one")
            }
        })
    }
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(schubert_terms, m)?)?;
    m.add_function(wrap_pyfunction!(schubert_divided_terms, m)?)?;
    m.add_function(wrap_pyfunction!(schubert_batch_bytes, m)?)?;
    m.add_class::<SchubertBatch>()
}
