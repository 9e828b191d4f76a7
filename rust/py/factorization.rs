//! Bindings for `schubert::factorization`: the crystal on decreasing factorizations.
use super::convert::array2;
use super::run::run_detached;
use crate::perm;
use crate::schubert::factorization;
use numpy::{IntoPyArray, PyArray1, PyArray2};
use pyo3::prelude::*;

type Table<'py> = (
    Bound<'py, PyArray2<u32>>,
    Vec<Bound<'py, PyArray1<i64>>>,
    Vec<Bound<'py, PyArray1<i64>>>,
    Bound<'py, PyArray2<i32>>,
    Bound<'py, PyArray1<bool>>,
);

/// The decreasing factorizations of a 1-based permutation into m factors: factor bitsets
/// (count, m) uint32, f_r and e_r arrays (r = 1..m-1), weights (count, m) int32, bounded mask.
/// With `bounded_only`, the bounded ones alone, and -2 where an operator leaves them.
#[pyfunction]
fn factorization_crystal(
    py: Python<'_>,
    perm: Vec<i64>,
    factors: usize,
    bounded_only: bool,
    limit: usize,
) -> PyResult<Table<'_>> {
    let w = perm::check_perm(&perm, "perm")?;
    let c = run_detached(py, |job| {
        factorization::build(&w, (factors, bounded_only), limit, job)
    })?;
    let (count, n) = (c.count(), c.m);
    let weights = array2(py, count, n, c.weights());
    let bounded = c.bounded();
    let factors = array2(py, count, n, c.factors);
    let arrays = |v: Vec<Vec<i64>>| v.into_iter().map(|a| a.into_pyarray(py)).collect();
    Ok((
        factors,
        arrays(c.lowering),
        arrays(c.raising),
        weights,
        bounded.into_pyarray(py),
    ))
}

/// The key expansion of S_w (1-based permutation) from the Demazure pieces of its pipe-dream
/// crystal: (key composition, multiplicity) pairs, compositions ascending.
#[pyfunction]
fn pipe_dream_keys(
    py: Python<'_>,
    perm: Vec<i64>,
    limit: usize,
) -> PyResult<factorization::KeyExpansion> {
    let w = perm::check_perm(&perm, "perm")?;
    let n = w.len().max(1);
    run_detached(py, |job| {
        let c = factorization::build(&w, (n, true), limit, job)?;
        factorization::pipe_dream_keys(&c, job)
    })
}

/// `pipe_dream_keys` for the permutations of ranks start..start+count of S_n (lexicographic).
#[pyfunction]
fn pipe_dream_keys_batch(
    py: Python<'_>,
    n: usize,
    start: usize,
    count: usize,
    limit: usize,
) -> PyResult<Vec<factorization::KeyExpansion>> {
    run_detached(py, |job| {
        factorization::keys_of_ranks(n, (start, count), limit, job)
    })
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(factorization_crystal, m)?)?;
    m.add_function(wrap_pyfunction!(pipe_dream_keys, m)?)?;
    m.add_function(wrap_pyfunction!(pipe_dream_keys_batch, m)?)?;
    Ok(())
}
