//! Conversions shared by the bindings: row-major arrays and exact coefficient lists.
use crate::poly::CoeffVec;
use numpy::ndarray::Array2;
use numpy::{IntoPyArray, PyArray2};
use pyo3::prelude::*;

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
