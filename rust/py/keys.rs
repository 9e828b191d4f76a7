//! Bindings for `tableau::keys`: right and left keys of an array of tableaux.
use super::run::run_detached;
use crate::error::Error;
use crate::tableau::{self, KeySide};
use numpy::ndarray::Array2;
use numpy::{IntoPyArray, PyArray2, PyReadonlyArray2, PyUntypedArrayMethods};
use pyo3::prelude::*;

type KeyArrays<'py> = (Bound<'py, PyArray2<u8>>, Bound<'py, PyArray2<i32>>);

fn side(which: &str) -> Result<KeySide, Error> {
    match which {
        "right" => Ok(KeySide::Right),
        "left" => Ok(KeySide::Left),
        other => Err(Error::invalid(format!(
            "which must be 'right' or 'left'; got {other:?}"
        ))),
    }
}

/// Keys of the tableaux `cells` (N, |shape|) of `shape` with entries 1..n: (key cells (N,
/// |shape|) uint8, key contents (N, n) int32). `which` is "right" or "left".
#[pyfunction]
fn tableau_keys<'py>(
    py: Python<'py>,
    shape: Vec<usize>,
    n: usize,
    cells: PyReadonlyArray2<'py, u8>,
    which: &str,
) -> PyResult<KeyArrays<'py>> {
    let key_side = side(which)?;
    let [count, size] = [cells.shape()[0], cells.shape()[1]];
    let flat = cells
        .as_slice()
        .map_err(|_| Error::invalid("cells must be a C-contiguous uint8 array"))?;
    let keys = run_detached(py, |job| {
        let keys = tableau::keys(&shape, n, flat, count, key_side, job)?;
        let ragged = || Error::invalid("key kernel returned a ragged array");
        let cells = Array2::from_shape_vec((count, size), keys.cells).map_err(|_| ragged())?;
        let weights = Array2::from_shape_vec((count, n), keys.weights).map_err(|_| ragged())?;
        Ok((cells, weights))
    })?;
    Ok((keys.0.into_pyarray(py), keys.1.into_pyarray(py)))
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(tableau_keys, m)?)
}
