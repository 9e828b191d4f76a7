//! Bindings for `poly`: key polynomials, Demazure atoms and the divided-difference operators.
use super::run::run_detached;
use crate::error::Error;
use crate::poly::{self, CoeffVec, Operator, Terms};
use num_bigint::BigInt;
use numpy::ndarray::Array2;
use numpy::{IntoPyArray, PyArray2, PyReadonlyArray2, PyUntypedArrayMethods};
use pyo3::prelude::*;

type TermsOut<'py> = (Bound<'py, PyArray2<i64>>, Bound<'py, PyAny>);

/// Canonical terms to (exponents (T, nvars) int64, list of Python ints).
fn to_python(py: Python<'_>, terms: Terms) -> PyResult<TermsOut<'_>> {
    let rows = terms.len();
    let array = Array2::from_shape_vec((rows, terms.nvars), terms.exps)
        .map_err(|_| Error::invalid("poly kernel returned a ragged exponent array"))?;
    let list = match terms.coeffs {
        // i64 converts faster than i128, and small values come from Python's cache
        CoeffVec::Small(v) => match v
            .iter()
            .map(|&c| i64::try_from(c))
            .collect::<Result<Vec<_>, _>>()
        {
            Ok(narrow) => narrow.into_pyobject(py)?.into_any(),
            Err(_) => v.into_pyobject(py)?.into_any(),
        },
        CoeffVec::Big(v) => v.into_pyobject(py)?.into_any(),
    };
    Ok((array.into_pyarray(py), list))
}

/// The key polynomial of the weak composition `alpha`, canonical terms.
#[pyfunction]
fn key_terms(py: Python<'_>, alpha: Vec<i64>) -> PyResult<TermsOut<'_>> {
    let terms = run_detached(py, |job| poly::key(&alpha, job))?;
    to_python(py, terms)
}

/// The Demazure atom of the weak composition `alpha`, canonical terms.
#[pyfunction]
fn atom_terms(py: Python<'_>, alpha: Vec<i64>) -> PyResult<TermsOut<'_>> {
    let terms = run_detached(py, |job| poly::atom(&alpha, job))?;
    to_python(py, terms)
}

/// `kind` ("pi", "pibar" or "d") on x_i, x_(i+1) (1-based) applied to the polynomial given by
/// `exps` (T, nvars) and T integer `coeffs`.
#[pyfunction]
fn poly_operator<'py>(
    py: Python<'py>,
    exps: PyReadonlyArray2<'py, i64>,
    coeffs: Vec<BigInt>,
    nvars: usize,
    kind: &str,
    i: usize,
) -> PyResult<TermsOut<'py>> {
    let op = Operator::from_name(kind)?;
    if exps.shape()[1] != nvars {
        return Err(Error::invalid(format!(
            "exps must have nvars={nvars} columns; got {}",
            exps.shape()[1]
        ))
        .into());
    }
    let rows = exps.as_array().iter().copied().collect();
    let f = Terms::new(nvars, rows, poly::coefficients(coeffs))?;
    let terms = run_detached(py, |job| poly::apply_operator(&f, op, i, job))?;
    to_python(py, terms)
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(key_terms, m)?)?;
    m.add_function(wrap_pyfunction!(atom_terms, m)?)?;
    m.add_function(wrap_pyfunction!(poly_operator, m)?)?;
    Ok(())
}
