//! Bindings for `tableau`: the model of SSYT(shape, n) and its crystal operators.
use super::convert::array2;
use super::run::{run_detached, run_quick};
use crate::error::Error;
use crate::tableau::{self, Model};
use numpy::{IntoPyArray, PyArray1, PyArray2, PyReadonlyArray2};
use pyo3::prelude::*;

/// Tables of SSYT(shape, n); methods take the tableau array that `enumerate` returned.
#[pyclass(module = "druse._core", frozen)]
pub struct TableauModel {
    model: Model,
}

type Lengths<'py> = (Bound<'py, PyArray1<i32>>, Bound<'py, PyArray1<i32>>);

type Arrays4<'py> = (
    Bound<'py, PyArray1<i64>>,
    Bound<'py, PyArray1<i64>>,
    Bound<'py, PyArray1<i32>>,
    Bound<'py, PyArray1<i32>>,
);

fn to_numpy(py: Python<'_>, op: tableau::Operator) -> Arrays4<'_> {
    (
        op.f.into_pyarray(py),
        op.e.into_pyarray(py),
        op.phi.into_pyarray(py),
        op.eps.into_pyarray(py),
    )
}

fn cells<'a>(arr: &'a PyReadonlyArray2<'_, u8>) -> PyResult<&'a [u8]> {
    Ok(arr
        .as_slice()
        .map_err(|_| Error::invalid("tableau array must be C-contiguous"))?)
}

#[pymethods]
impl TableauModel {
    #[new]
    fn new(py: Python<'_>, shape: Vec<usize>, n: usize) -> PyResult<Self> {
        let model = run_detached(py, |_| Model::new(&shape, n))?;
        Ok(TableauModel { model })
    }

    fn count(&self) -> u64 {
        self.model.count()
    }

    fn cells(&self) -> usize {
        self.model.cells
    }

    /// All tableaux, one row of cells each (row-major cells), in index order.
    fn enumerate<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyArray2<u8>>> {
        let m = &self.model;
        let flat = run_detached(py, |job| tableau::fill(m, job))?;
        Ok(array2(
            py,
            usize::try_from(m.count()).unwrap_or(0),
            m.cells,
            flat,
        ))
    }

    /// Tableaux start .. start + count, for streaming.
    fn chunk<'py>(
        &self,
        py: Python<'py>,
        start: u64,
        count: usize,
    ) -> PyResult<Bound<'py, PyArray2<u8>>> {
        let m = &self.model;
        let len = usize::try_from(m.count().saturating_sub(start))
            .unwrap_or(usize::MAX)
            .min(count);
        let flat = run_detached(py, |_| {
            let mut out = vec![0u8; len * m.cells];
            tableau::walk_range(m, start, &mut out)?;
            Ok(out)
        })?;
        Ok(array2(py, len, m.cells, flat))
    }

    /// Walks all tableaux without keeping them; returns (count, checksum).
    fn scan(&self, py: Python<'_>, threads: usize) -> PyResult<(u64, u64)> {
        let m = &self.model;
        run_detached(py, |job| tableau::scan(m, threads, job))
    }

    fn rank(&self, cells: Vec<u8>) -> PyResult<u64> {
        run_quick(|| self.model.rank(&cells))
    }

    fn unrank(&self, index: u64) -> PyResult<Vec<u8>> {
        run_quick(|| {
            let m = &self.model;
            let mut gt = vec![0u16; (m.n + 1) * (m.rows + 1)];
            m.unrank_pattern(index, &mut gt)?;
            let mut t = vec![0u8; m.cells];
            m.cells_of(&gt, &mut t);
            Ok(t)
        })
    }

    /// (phi_i, epsilon_i) of every vertex.
    fn string_lengths<'py>(
        &self,
        py: Python<'py>,
        tableaux: PyReadonlyArray2<'py, u8>,
        i: usize,
    ) -> PyResult<Lengths<'py>> {
        let (m, t) = (&self.model, cells(&tableaux)?);
        let op = run_detached(py, |job| tableau::operator(m, t, i, false, job))?;
        Ok((op.phi.into_pyarray(py), op.eps.into_pyarray(py)))
    }

    /// (f_i, e_i, phi_i, epsilon_i) of every vertex.
    fn operator<'py>(
        &self,
        py: Python<'py>,
        tableaux: PyReadonlyArray2<'py, u8>,
        i: usize,
    ) -> PyResult<Arrays4<'py>> {
        let (m, t) = (&self.model, cells(&tableaux)?);
        let op = run_detached(py, |job| tableau::operator(m, t, i, true, job))?;
        Ok(to_numpy(py, op))
    }

    /// The same for every i = 1..n-1 in one pass; with `lowering_only`, e, phi, epsilon are empty.
    #[pyo3(signature = (tableaux, lowering_only=false))]
    fn operator_tables<'py>(
        &self,
        py: Python<'py>,
        tableaux: PyReadonlyArray2<'py, u8>,
        lowering_only: bool,
    ) -> PyResult<Vec<Arrays4<'py>>> {
        let (m, t) = (&self.model, cells(&tableaux)?);
        let ops = run_detached(py, |job| tableau::operator_tables(m, t, lowering_only, job))?;
        Ok(ops.into_iter().map(|op| to_numpy(py, op)).collect())
    }

    /// Weights (N, n): the number of entries equal to k in each tableau.
    fn weights<'py>(
        &self,
        py: Python<'py>,
        tableaux: PyReadonlyArray2<'py, u8>,
    ) -> PyResult<Bound<'py, PyArray2<i32>>> {
        let (m, t) = (&self.model, cells(&tableaux)?);
        let v = run_detached(py, |job| tableau::weights(m, t, job))?;
        let count = v.len().checked_div(m.n).unwrap_or(0);
        Ok(array2(py, count, m.n, v))
    }
}

pub fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_class::<TableauModel>()
}
