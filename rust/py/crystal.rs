//! Bindings for `crystal`: algorithms on any crystal table.
use super::convert::{array2, slices};
use super::run::run_detached;
use crate::crystal;
use crate::error::Error;
use numpy::{
    IntoPyArray, PyArray1, PyArray2, PyReadonlyArray1, PyReadonlyArray2, PyUntypedArrayMethods,
};
use pyo3::prelude::*;

/// Length of the string from each vertex along `next` (f_i gives phi_i, e_i gives epsilon_i).
#[pyfunction]
fn string_steps<'py>(
    py: Python<'py>,
    next: PyReadonlyArray1<'py, i64>,
) -> PyResult<Bound<'py, PyArray1<i32>>> {
    let s = next
        .as_slice()
        .map_err(|_| Error::invalid("operator array must be contiguous"))?;
    crystal::check_arrays(&[s], s.len(), "operator")?;
    Ok(run_detached(py, |_| crystal::string_steps(s))?.into_pyarray(py))
}

/// Vertices on which every operator of `ops` is undefined (-1), ascending.
#[pyfunction]
fn sources<'py>(
    py: Python<'py>,
    ops: Vec<PyReadonlyArray1<'py, i64>>,
    count: usize,
) -> PyResult<Bound<'py, PyArray1<i64>>> {
    per_vertex(py, &ops, count, crystal::sources)
}

/// Component label of each vertex, components numbered by their smallest vertex.
#[pyfunction]
fn components<'py>(
    py: Python<'py>,
    ops: Vec<PyReadonlyArray1<'py, i64>>,
    count: usize,
) -> PyResult<Bound<'py, PyArray1<i64>>> {
    per_vertex(py, &ops, count, crystal::components)
}

/// Checks the operator arrays, then runs a kernel that gives one value per vertex.
fn per_vertex<'py>(
    py: Python<'py>,
    ops: &[PyReadonlyArray1<'py, i64>],
    count: usize,
    kernel: fn(&[&[i64]], usize) -> Vec<i64>,
) -> PyResult<Bound<'py, PyArray1<i64>>> {
    let s = slices(ops, "operator arrays")?;
    crystal::check_arrays(&s, count, "operator")?;
    Ok(run_detached(py, |_| Ok(kernel(&s, count)))?.into_pyarray(py))
}

/// Character of the masked vertices: (exponents (terms, n), coefficients).
#[pyfunction]
#[pyo3(signature = (weights, mask=None))]
fn character<'py>(
    py: Python<'py>,
    weights: PyReadonlyArray2<'py, i32>,
    mask: Option<PyReadonlyArray1<'py, bool>>,
) -> PyResult<(Bound<'py, PyArray2<i64>>, Vec<u64>)> {
    let n = weights.shape()[1];
    let w = weights
        .as_slice()
        .map_err(|_| Error::invalid("weights must be C-contiguous"))?;
    let m = match &mask {
        Some(a) => Some(
            a.as_slice()
                .map_err(|_| Error::invalid("mask must be contiguous"))?,
        ),
        None => None,
    };
    let count = weights.shape()[0];
    let (exps, coeffs) = run_detached(py, |job| crystal::character(w, n, count, m, job))?;
    let terms = coeffs.len();
    let exps: Vec<i64> = exps.into_iter().map(i64::from).collect();
    let arr = array2(py, terms, n, exps);
    Ok((arr, coeffs))
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(string_steps, m)?)?;
    m.add_function(wrap_pyfunction!(sources, m)?)?;
    m.add_function(wrap_pyfunction!(components, m)?)?;
    m.add_function(wrap_pyfunction!(character, m)?)?;
    Ok(())
}
