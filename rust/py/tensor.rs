//! Bindings for `tensor`: the tensor product of two crystal tables.
use super::convert::{array2, slices};
use super::run::run_detached;
use crate::error::Error;
use crate::tensor::{self, Factor};
use numpy::{
    IntoPyArray, PyArray1, PyArray2, PyReadonlyArray1, PyReadonlyArray2, PyUntypedArrayMethods,
};
use pyo3::prelude::*;

/// One factor as Python hands it over: lists of f_i, e_i, phi_i, eps_i arrays, and the weights.
type FactorArgs<'py> = (
    Vec<PyReadonlyArray1<'py, i64>>,
    Vec<PyReadonlyArray1<'py, i64>>,
    Vec<PyReadonlyArray1<'py, i32>>,
    Vec<PyReadonlyArray1<'py, i32>>,
    PyReadonlyArray2<'py, i32>,
);

type Arrays<'py> = (
    Bound<'py, PyArray1<i64>>,
    Bound<'py, PyArray1<i64>>,
    Bound<'py, PyArray1<i32>>,
    Bound<'py, PyArray1<i32>>,
);

fn factor<'a>(args: &'a FactorArgs<'_>) -> PyResult<Factor<'a>> {
    let weights = args
        .4
        .as_slice()
        .map_err(|_| Error::invalid("weights must be C-contiguous"))?;
    Ok(Factor {
        count: args.4.shape()[0],
        f: slices(&args.0, "crystal arrays")?,
        e: slices(&args.1, "crystal arrays")?,
        phi: slices(&args.2, "crystal arrays")?,
        eps: slices(&args.3, "crystal arrays")?,
        weights,
    })
}

/// The table of left (x) right over n letters: per i (f_i, e_i, phi_i, eps_i), and the weights.
#[pyfunction]
fn tensor_tables<'py>(
    py: Python<'py>,
    n: usize,
    left: FactorArgs<'py>,
    right: FactorArgs<'py>,
) -> PyResult<(Vec<Arrays<'py>>, Bound<'py, PyArray2<i32>>)> {
    let (a, b) = (factor(&left)?, factor(&right)?);
    let product = run_detached(py, |job| tensor::tensor(&a, &b, n, job))?;
    let count = a.count * b.count; // the kernel checked that it fits
    let operators = product
        .operators
        .into_iter()
        .map(|(f, e, p, q)| {
            (
                f.into_pyarray(py),
                e.into_pyarray(py),
                p.into_pyarray(py),
                q.into_pyarray(py),
            )
        })
        .collect();
    let weights = array2(py, count, n, product.weights);
    Ok((operators, weights))
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(tensor_tables, m)?)?;
    Ok(())
}
