//! Bindings for `poly`: key polynomials, Demazure atoms, the divided-difference operators, and
//! key and atom expansions (one polynomial, or batches sharing an `ExpansionCache`).
use super::convert::{terms_out, BlockOut, TermsOut};
use super::run::run_detached;
use crate::error::Error;
use crate::poly::{self, Basis, CoeffVec, ExpansionCache, Operator, Terms};
use num_bigint::BigInt;
use numpy::{IntoPyArray, PyReadonlyArray2, PyUntypedArrayMethods};
use pyo3::prelude::*;

/// Canonical terms to (exponents (T, nvars) int64, list of Python ints).
fn to_python(py: Python<'_>, terms: Terms) -> PyResult<TermsOut<'_>> {
    terms_out(py, terms.nvars, terms.exps, terms.coeffs)
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

/// Exponent rows `exps` (T, nvars) and T integer `coeffs` (a sequence of Python ints) as
/// `Terms`; i64 coefficients convert fastest, larger ones go through BigInt.
fn to_terms(
    exps: &PyReadonlyArray2<'_, i64>,
    coeffs: &Bound<'_, PyAny>,
    nvars: usize,
) -> PyResult<Terms> {
    if exps.shape()[1] != nvars {
        return Err(Error::invalid(format!(
            "exps must have nvars={nvars} columns; got {}",
            exps.shape()[1]
        ))
        .into());
    }
    let values = match coeffs.extract::<Vec<i64>>() {
        Ok(small) => CoeffVec::Small(small.into_iter().map(i128::from).collect()),
        Err(_) => poly::coefficients(coeffs.extract::<Vec<BigInt>>()?),
    };
    let rows = exps.as_array().iter().copied().collect();
    Ok(Terms::new(nvars, rows, values)?)
}

/// The coefficients of the polynomial (`exps`, `coeffs`) in the basis `kind` ("key" or
/// "atom"): compositions (K, nvars) in decreasing reverse lexicographic order, K ints.
#[pyfunction]
fn key_expansion_terms<'py>(
    py: Python<'py>,
    exps: PyReadonlyArray2<'py, i64>,
    coeffs: Bound<'py, PyAny>,
    nvars: usize,
    kind: &str,
) -> PyResult<TermsOut<'py>> {
    let basis = Basis::from_name(kind)?;
    let f = to_terms(&exps, &coeffs, nvars)?;
    let terms = run_detached(py, |job| poly::expand(&f, basis, job))?;
    to_python(py, terms)
}

/// Basis elements (key polynomials or atoms) kept across calls of `key_expansion_batch`.
#[pyclass(module = "druse._core", frozen, name = "ExpansionCache")]
struct PyExpansionCache {
    inner: ExpansionCache,
}

#[pymethods]
impl PyExpansionCache {
    /// A cache for basis `kind` in `nvars` variables, exponents at most `max_exponent`.
    #[new]
    fn new(kind: &str, nvars: usize, max_exponent: i64) -> PyResult<Self> {
        let basis = Basis::from_name(kind)?;
        Ok(PyExpansionCache {
            inner: ExpansionCache::new(basis, nvars, max_exponent)?,
        })
    }

    /// The number of basis elements held.
    fn __len__(&self) -> usize {
        self.inner.len()
    }
}

/// The expansions of many polynomials (each an (exps, coeffs) pair) with one cache, in order,
/// as one block: all compositions (K, nvars), all K coefficients, and N+1 offsets (the rows of
/// polynomial k are offsets[k]..offsets[k+1]); one block converts much faster than N pairs.
#[pyfunction]
fn key_expansion_batch<'py>(
    py: Python<'py>,
    cache: &PyExpansionCache,
    polys: Vec<(PyReadonlyArray2<'py, i64>, Bound<'py, PyAny>)>,
) -> PyResult<BlockOut<'py>> {
    let nvars = cache.inner.nvars();
    let inputs = polys
        .iter()
        .map(|(exps, coeffs)| to_terms(exps, coeffs, nvars))
        .collect::<PyResult<Vec<_>>>()?;
    let inner = &cache.inner;
    let outputs = run_detached(py, |job| inner.expand_all(&inputs, job))?;
    let (block, offsets) = concatenate(nvars, &outputs)?;
    let (array, list) = to_python(py, block)?;
    Ok((array, list, offsets.into_pyarray(py)))
}

/// The terms one after another, and where each starts (N+1 offsets).
fn concatenate(nvars: usize, parts: &[Terms]) -> Result<(Terms, Vec<i64>), Error> {
    let mut offsets = Vec::with_capacity(parts.len() + 1);
    offsets.push(0i64);
    let mut exps = Vec::new();
    let mut small = Vec::new();
    let mut all_small = true;
    for t in parts {
        exps.extend_from_slice(&t.exps);
        let end = offsets[offsets.len() - 1] + i64::try_from(t.len()).unwrap_or(i64::MAX);
        offsets.push(end);
        match &t.coeffs {
            CoeffVec::Small(v) => small.extend_from_slice(v),
            CoeffVec::Big(_) => all_small = false,
        }
    }
    let coeffs = if all_small {
        CoeffVec::Small(small)
    } else {
        CoeffVec::Big(parts.iter().flat_map(|t| t.coeffs.to_big()).collect())
    };
    Ok((Terms::new(nvars, exps, coeffs)?, offsets))
}

/// (index of the first array holding a negative entry, or -1; the largest entry, or 0) over
/// exponent arrays, so that a batch is checked without one numpy call per polynomial.
#[pyfunction]
fn exponent_bounds(arrays: Vec<PyReadonlyArray2<'_, i64>>) -> (i64, i64) {
    let mut first_negative = -1;
    let mut top = 0;
    for (k, a) in arrays.iter().enumerate() {
        for &e in a.as_array() {
            if e < 0 && first_negative < 0 {
                first_negative = i64::try_from(k).unwrap_or(i64::MAX);
            }
            top = top.max(e);
        }
    }
    (first_negative, top)
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(key_expansion_terms, m)?)?;
    m.add_function(wrap_pyfunction!(key_expansion_batch, m)?)?;
    m.add_function(wrap_pyfunction!(exponent_bounds, m)?)?;
    m.add_class::<PyExpansionCache>()?;
    m.add_function(wrap_pyfunction!(key_terms, m)?)?;
    m.add_function(wrap_pyfunction!(atom_terms, m)?)?;
    m.add_function(wrap_pyfunction!(poly_operator, m)?)?;
    Ok(())
}
