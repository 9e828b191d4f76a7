//! Bindings for `axioms`: axiom checks with witnesses, and the map to a model crystal.
use super::convert::slices;
use super::run::run_detached;
use crate::axioms::iso::{map_to_model, Walk};
use crate::axioms::{self, Axiom, Options, Table};
use crate::error::Error;
use numpy::{IntoPyArray, PyArray1, PyReadonlyArray1, PyReadonlyArray2, PyUntypedArrayMethods};
use pyo3::prelude::*;

type Arrays<'py, T> = Vec<PyReadonlyArray1<'py, T>>;
/// One witness: axiom name, i, j (0 when none), vertices, detail.
type WitnessRow = (&'static str, usize, usize, Vec<i64>, String);
/// Total violations per axiom, and the first witnesses.
type Checked = (Vec<(&'static str, u64)>, Vec<WitnessRow>);
/// The map (on success) or the mismatch (vertex, i, detail).
type Mapped<'py> = (
    Option<Bound<'py, PyArray1<i64>>>,
    Option<(usize, usize, String)>,
);

/// A validated table over borrowed numpy arrays.
fn table<'a>(
    n: usize,
    count: usize,
    lowering: &'a [PyReadonlyArray1<'_, i64>],
    raising: &'a [PyReadonlyArray1<'_, i64>],
    weights: Option<&'a PyReadonlyArray2<'_, i32>>,
) -> PyResult<Table<'a>> {
    let weights = match weights {
        Some(w) => Some(
            w.as_slice()
                .map_err(|_| Error::invalid("weights must be C-contiguous"))?,
        ),
        None => None,
    };
    let t = Table {
        n,
        count,
        f: slices(lowering, "crystal arrays")?,
        e: slices(raising, "crystal arrays")?,
        weights,
        declared: None,
    };
    t.validate()?;
    Ok(t)
}

/// Every axiom on the table: ([(axiom, total count)], [first witnesses in vertex order]).
#[pyfunction]
#[pyo3(signature = (n, count, lowering, raising, weights, declared, stembridge, max_witnesses))]
#[allow(clippy::too_many_arguments)] // the table's parts, as Python holds them
fn check_axioms<'py>(
    py: Python<'py>,
    n: usize,
    count: usize,
    lowering: Arrays<'py, i64>,
    raising: Arrays<'py, i64>,
    weights: Option<PyReadonlyArray2<'py, i32>>,
    declared: Option<(Arrays<'py, i32>, Arrays<'py, i32>)>,
    stembridge: bool,
    max_witnesses: usize,
) -> PyResult<Checked> {
    let mut t = table(n, count, &lowering, &raising, weights.as_ref())?;
    if let Some((phi, eps)) = &declared {
        t.declared = Some((
            slices(phi, "crystal arrays")?,
            slices(eps, "crystal arrays")?,
        ));
    }
    let options = Options {
        stembridge,
        max_witnesses,
    };
    let report = run_detached(py, |job| axioms::check(&t, options, job))?;
    let counts = Axiom::ALL
        .iter()
        .filter(|a| stembridge || !a.is_stembridge())
        .map(|&a| (a.name(), report.counts[a as usize]))
        .collect();
    let rows = report
        .witnesses
        .into_iter()
        .map(|w| (w.axiom.name(), w.i, w.j, w.vertices, w.detail));
    Ok((counts, rows.collect()))
}

/// The map from the component of `top` to the model (its vertex `model_top`), or the
/// mismatch (vertex, i, detail). Each crystal is (lowering, raising, weights).
#[pyfunction]
fn model_map<'py>(
    py: Python<'py>,
    n: usize,
    source: (
        Arrays<'py, i64>,
        Arrays<'py, i64>,
        PyReadonlyArray2<'py, i32>,
    ),
    top: usize,
    model: (
        Arrays<'py, i64>,
        Arrays<'py, i64>,
        PyReadonlyArray2<'py, i32>,
    ),
    model_top: usize,
    shift: i64,
) -> PyResult<Mapped<'py>> {
    let s = table(
        n,
        source.2.shape()[0],
        &source.0,
        &source.1,
        Some(&source.2),
    )?;
    let m = table(n, model.2.shape()[0], &model.0, &model.1, Some(&model.2))?;
    if top >= s.count || model_top >= m.count {
        return Err(Error::invalid("the highest weight vertices must be vertices").into());
    }
    let walk = Walk {
        source: &s,
        source_top: top,
        model: &m,
        model_top,
        shift,
    };
    match run_detached(py, |job| map_to_model(&walk, job))? {
        Ok(map) => Ok((Some(map.into_pyarray(py)), None)),
        Err(miss) => Ok((None, Some((miss.vertex, miss.i, miss.detail)))),
    }
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(check_axioms, m)?)?;
    m.add_function(wrap_pyfunction!(model_map, m)?)?;
    Ok(())
}
