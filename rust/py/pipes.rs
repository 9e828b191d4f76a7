//! Bindings for `schubert::pipes` and `schubert::pipes_read`: reduced pipe dreams as masks.
use super::convert::array2;
use super::run::run_detached;
use crate::error::Error;
use crate::perm;
use crate::schubert::pipes::{mask_words, PipeDreamGraph};
use crate::schubert::pipes_read;
use num_bigint::BigUint;
use numpy::{PyArray2, PyReadonlyArray2, PyUntypedArrayMethods};
use pyo3::prelude::*;

/// The state graph of the pipe dreams of one permutation: count, whole enumeration, ranges.
#[pyclass(module = "druse._core", frozen)]
pub struct PipeDreamModel {
    graph: PipeDreamGraph,
}

#[pymethods]
impl PipeDreamModel {
    #[new]
    fn new(py: Python<'_>, perm: Vec<i64>) -> PyResult<Self> {
        let w = perm::check_perm(&perm, "perm")?;
        let graph = run_detached(py, |job| PipeDreamGraph::new(&w, job))?;
        Ok(PipeDreamModel { graph })
    }

    fn count(&self) -> BigUint {
        self.graph.total_big()
    }

    /// 64-bit words per mask, W = ceil(n(n-1)/2 / 64).
    fn words(&self) -> usize {
        mask_words(self.graph.n())
    }

    /// Every mask in ascending order, a (count, W) uint64 array.
    fn enumerate<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyArray2<u64>>> {
        let g = &self.graph;
        let flat = run_detached(py, |job| pipes_read::enumerate(g, job))?;
        let rows = pipes_read::checked_total(g)?;
        Ok(array2(py, rows, self.words(), flat))
    }

    /// Masks of ranks start .. start + count.
    fn range<'py>(
        &self,
        py: Python<'py>,
        start: u128,
        count: usize,
    ) -> PyResult<Bound<'py, PyArray2<u64>>> {
        let (g, words) = (&self.graph, self.words());
        let flat = run_detached(py, |job| {
            let mut out = vec![0u64; count.checked_mul(words).ok_or(Error::invalid("count"))?];
            g.range_into(start, &mut out, job)?;
            Ok(out)
        })?;
        Ok(array2(py, count, words, flat))
    }
}

type Readings<'py> = (
    Bound<'py, PyArray2<i32>>,
    Bound<'py, PyArray2<u8>>,
    Bound<'py, PyArray2<u8>>,
);

/// Weights (N, n) int32, reduced words (N, length) and rows of the crosses (N, length) uint8.
#[pyfunction]
fn pipe_dream_read<'py>(
    py: Python<'py>,
    masks: PyReadonlyArray2<'py, u64>,
    n: usize,
    length: usize,
) -> PyResult<Readings<'py>> {
    let flat = masks
        .as_slice()
        .map_err(|_| Error::invalid("masks must be C-contiguous"))?;
    let (count, cols) = (masks.shape()[0], masks.shape()[1]);
    let (weights, letters, rows) = run_detached(py, |job| {
        if cols != mask_words(n) {
            return Err(Error::invalid(format!(
                "masks must have {} columns for n = {n}",
                mask_words(n)
            )));
        }
        pipes_read::read(flat, count, n, length, job)
    })?;
    let shaped = |v: Vec<u8>| array2(py, count, length, v);
    Ok((array2(py, count, n, weights), shaped(letters), shaped(rows)))
}

/// S_w(1, ..., 1), the number of reduced pipe dreams of a 1-based permutation.
#[pyfunction]
fn pipe_dream_count(py: Python<'_>, perm: Vec<i64>) -> PyResult<BigUint> {
    let w = perm::check_perm(&perm, "perm")?;
    run_detached(py, |job| pipes_read::count(&w, job))
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_class::<PipeDreamModel>()?;
    m.add_function(wrap_pyfunction!(pipe_dream_read, m)?)?;
    m.add_function(wrap_pyfunction!(pipe_dream_count, m)?)?;
    Ok(())
}
