//! Conversions shared by the bindings: row-major arrays and exact coefficient lists.
use crate::error::Error;
use crate::poly::CoeffVec;
use numpy::ndarray::Array2;
use numpy::{IntoPyArray, PyArray1, PyArray2, PyReadonlyArray1};
use pyo3::prelude::*;

/// A polynomial's terms: exponents (T, nvars) int64 and T Python ints.
pub type TermsOut<'py> = (Bound<'py, PyArray2<i64>>, Bound<'py, PyAny>);
/// Many polynomials' terms one after another, and the N+1 offsets where each starts.
pub type BlockOut<'py> = (
    Bound<'py, PyArray2<i64>>,
    Bound<'py, PyAny>,
    Bound<'py, PyArray1<i64>>,
);

/// Row-major exponents (one row of `nvars` per coefficient) and the coefficients, for Python.
pub fn terms_out(
    py: Python<'_>,
    nvars: usize,
    exps: Vec<i64>,
    coeffs: CoeffVec,
) -> PyResult<TermsOut<'_>> {
    let array = Array2::from_shape_vec((coeffs.len(), nvars), exps)
        .map_err(|_| Error::invalid("a polynomial kernel returned a ragged exponent array"))?;
    Ok((array.into_pyarray(py), coeff_list(py, coeffs)?))
}

/// A (rows, cols) numpy array from a row-major vector the kernel filled.
pub fn array2<T: numpy::Element>(
    py: Python<'_>,
    rows: usize,
    cols: usize,
    v: Vec<T>,
) -> Bound<'_, PyArray2<T>> {
    Array2::from_shape_vec((rows, cols), v)
        .expect("kernels return rows * cols values")
        .into_pyarray(py)
}

/// Exact coefficients as a Python list of ints; i64 converts faster than i128, and small values
/// come from Python's cache.
pub fn coeff_list(py: Python<'_>, coeffs: CoeffVec) -> PyResult<Bound<'_, PyAny>> {
    Ok(match coeffs {
        CoeffVec::Small(v) => match v
            .iter()
            .map(|&c| i64::try_from(c))
            .collect::<Result<Vec<_>, _>>()
        {
            Ok(narrow) => narrow.into_pyobject(py)?.into_any(),
            Err(_) => v.into_pyobject(py)?.into_any(),
        },
        CoeffVec::Big(v) => v.into_pyobject(py)?.into_any(),
    })
}

/// Borrowed slices of 1-d numpy arrays; `what` names them in the error if one is not contiguous.
pub fn slices<'a, T: numpy::Element>(
    arrays: &'a [PyReadonlyArray1<'_, T>],
    what: &str,
) -> PyResult<Vec<&'a [T]>> {
    arrays
        .iter()
        .map(|a| {
            a.as_slice()
                .map_err(|_| Error::invalid(format!("{what} must be contiguous")).into())
        })
        .collect()
}
