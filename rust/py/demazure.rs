//! Bindings for `demazure` (closures and atoms on a crystal table) and `perm` (permutations).
use super::convert::{array2, slices};
use super::run::{run_detached, run_quick};
use crate::crystal;
use crate::demazure;
use crate::error::Error;
use crate::perm;
use numpy::{IntoPyArray, PyArray1, PyArray2, PyReadonlyArray1};
use pyo3::prelude::*;

/// The checked f_i slices (each `count` long) and the start bitset.
fn table<'a>(
    ops: &'a [PyReadonlyArray1<'_, i64>],
    count: usize,
    start: &[i64],
) -> PyResult<(Vec<&'a [i64]>, Vec<u64>)> {
    let f = slices(ops, "operator arrays")?;
    crystal::check_arrays(&f, count, "lowering")?;
    Ok((f, demazure::mask_of(start, count)?))
}

fn one_based(w: &[usize]) -> Vec<i64> {
    w.iter()
        .map(|&x| i64::try_from(x + 1).expect("small"))
        .collect()
}

/// D_{i1}(... D_{ik}(start)) for the 1-based word, as a bool mask over the vertices.
#[pyfunction]
fn demazure_closure<'py>(
    py: Python<'py>,
    ops: Vec<PyReadonlyArray1<'py, i64>>,
    count: usize,
    start: Vec<i64>,
    word: Vec<i64>,
) -> PyResult<Bound<'py, PyArray1<bool>>> {
    let (f, start) = table(&ops, count, &start)?;
    let word = perm::check_word(&word, f.len() + 1, "word")?;
    let bits = run_detached(py, |job| demazure::closure(&f, &start, &word, job))?;
    Ok(demazure::unpack(&bits, count).into_pyarray(py))
}

/// The Demazure atom of the 1-based permutation, as a bool mask.
#[pyfunction]
fn demazure_atom<'py>(
    py: Python<'py>,
    ops: Vec<PyReadonlyArray1<'py, i64>>,
    count: usize,
    start: Vec<i64>,
    perm: Vec<i64>,
) -> PyResult<Bound<'py, PyArray1<bool>>> {
    let (f, start) = table(&ops, count, &start)?;
    let w = perm::check_perm(&perm, "perm")?;
    let bits = run_detached(py, |job| demazure::atom(&f, &start, &w, job))?;
    Ok(demazure::unpack(&bits, count).into_pyarray(py))
}

/// The masks of every w in S_n, rows in lexicographic order of w: a (n!, count) bool array.
#[pyfunction]
fn demazure_all<'py>(
    py: Python<'py>,
    ops: Vec<PyReadonlyArray1<'py, i64>>,
    count: usize,
    start: Vec<i64>,
) -> PyResult<Bound<'py, PyArray2<bool>>> {
    let (f, start) = table(&ops, count, &start)?;
    let rows = run_detached(py, |job| {
        let masks = demazure::all_masks(&f, &start, job)?;
        let total = masks.len();
        let flat: Vec<bool> = masks
            .iter()
            .flat_map(|m| demazure::unpack(m, count))
            .collect();
        Ok((total, flat))
    })?;
    let (total, flat) = rows;
    Ok(array2(py, total, count, flat))
}

/// Coxeter length (inversions) of a 1-based permutation.
#[pyfunction]
fn perm_length(perm: Vec<i64>) -> PyResult<usize> {
    run_quick(|| Ok(perm::length(&perm::check_perm(&perm, "perm")?)))
}

/// The canonical reduced word (1-based letters) of a 1-based permutation.
#[pyfunction]
fn perm_reduced_word(perm: Vec<i64>) -> PyResult<Vec<i64>> {
    run_quick(|| {
        Ok(one_based(&perm::reduced_word(&perm::check_perm(
            &perm, "perm",
        )?)))
    })
}

/// s_{i1} ... s_{ik} in S_n (1-based), as an ordinary product or as the Demazure product.
#[pyfunction]
fn perm_of_word(word: Vec<i64>, n: usize, demazure: bool) -> PyResult<Vec<i64>> {
    run_quick(|| {
        let word = perm::check_word(&word, n, "word")?;
        Ok(one_based(&if demazure {
            perm::demazure_product(&word, n)
        } else {
            perm::word_to_perm(&word, n)
        }))
    })
}

/// u <= v in Bruhat order (1-based permutations of the same n).
#[pyfunction]
fn perm_bruhat_le(u: Vec<i64>, v: Vec<i64>) -> PyResult<bool> {
    run_quick(|| {
        let (u, v) = (perm::check_perm(&u, "u")?, perm::check_perm(&v, "v")?);
        if u.len() != v.len() {
            return Err(Error::invalid(format!(
                "u and v must lie in the same S_n; got lengths {} and {}",
                u.len(),
                v.len()
            )));
        }
        Ok(perm::bruhat_le(&u, &v))
    })
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(demazure_closure, m)?)?;
    m.add_function(wrap_pyfunction!(demazure_atom, m)?)?;
    m.add_function(wrap_pyfunction!(demazure_all, m)?)?;
    m.add_function(wrap_pyfunction!(perm_length, m)?)?;
    m.add_function(wrap_pyfunction!(perm_reduced_word, m)?)?;
    m.add_function(wrap_pyfunction!(perm_of_word, m)?)?;
    m.add_function(wrap_pyfunction!(perm_bruhat_le, m)?)?;
    Ok(())
}
