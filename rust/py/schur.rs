//! Bindings for `schur`: Schur polynomial terms and Kostka numbers.
use super::run::run_detached;
use crate::error::Error;
use crate::schur::{self, Coeffs};
use numpy::ndarray::Array2;
use numpy::{IntoPyArray, PyArray2};
use pyo3::prelude::*;

/// `s_shape(x1..xn)`: (exponents (terms, n) int64 in decreasing lexicographic order, coefficients).
#[pyfunction]
fn schur_terms(
    py: Python<'_>,
    shape: Vec<usize>,
    n: usize,
) -> PyResult<(Bound<'_, PyArray2<i64>>, Bound<'_, PyAny>)> {
    let (exps, coeffs) = run_detached(py, |job| {
        let (exps, coeffs) = schur::schur_with::<i64>(&shape, n, job)?;
        let array = Array2::from_shape_vec((coeffs.len(), n), exps)
            .map_err(|_| Error::invalid("schur kernel returned a ragged exponent array"))?;
        Ok((array, coeffs))
    })?;
    let list = match coeffs {
        Coeffs::U64(v) => v.into_pyobject(py)?.into_any(),
        Coeffs::U128(v) => v.into_pyobject(py)?.into_any(),
        Coeffs::Big(v) => v.into_pyobject(py)?.into_any(),
    };
    Ok((exps.into_pyarray(py), list))
}

/// `K_{shape, weight}`: SSYT of shape `shape` and content `weight`, exactly.
#[pyfunction]
fn kostka_number(
    py: Python<'_>,
    shape: Vec<usize>,
    weight: Vec<usize>,
) -> PyResult<num_bigint::BigUint> {
    run_detached(py, |job| schur::kostka(&shape, &weight, job))
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(schur_terms, m)?)?;
    m.add_function(wrap_pyfunction!(kostka_number, m)?)?;
    Ok(())
}
