//! Crystal operators on tableaux: the signature rule on the row reading word, and targets as
//! indices through Gelfand-Tsetlin rank differences (no search, no hash map).
//!
//! Reading word: rows bottom to top, each left to right. Letters i+1 pair with the nearest
//! unpaired i to their right; f_i turns the rightmost unpaired i into i+1, e_i the leftmost
//! unpaired i+1 into i (Kashiwara-Nakashima 1994; Lascoux-Schutzenberger 1981 for the pairing).
//! In a row all i's precede all (i+1)'s, so the pairing only needs, per row r, the number a_r of
//! i's and b_r of (i+1)'s: a_r = c_i[r] - c_{i-1}[r], b_r = c_{i+1}[r] - c_i[r] where c_k[r]
//! counts the entries <= k of row r.
#![deny(unsafe_code)]

use super::Model;
use crate::error::Error;
use crate::job::Job;
use rayon::prelude::*;

const BLOCK: usize = 1 << 13;

/// phi_i, epsilon_i, and the rows whose cell f_i and e_i change (the last i of row `f_row`
/// becomes i+1; the first i+1 of row `e_row` becomes i).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Signature {
    pub phi: u32,
    pub eps: u32,
    pub f_row: Option<usize>,
    pub e_row: Option<usize>,
}

/// The signature rule from the level counts kappa = c_{i-1}, mu = c_i, nu = c_{i+1}.
#[inline]
pub fn signature(kappa: &[u16], mu: &[u16], nu: &[u16], rows: usize) -> Signature {
    let (mut open, mut phi, mut f_row) = (0u32, 0u32, None);
    for r in (0..rows).rev() {
        let (a, b) = (u32::from(mu[r] - kappa[r]), u32::from(nu[r] - mu[r]));
        let paired = open.min(a);
        if a > paired {
            phi += a - paired;
            f_row = Some(r);
        }
        open = open - paired + b;
    }
    let (mut open_i, mut e_row) = (0u32, None);
    for r in 0..rows {
        let (a, b) = (u32::from(mu[r] - kappa[r]), u32::from(nu[r] - mu[r]));
        let paired = open_i.min(b);
        if b > paired {
            e_row = Some(r);
        }
        open_i = open_i - paired + a;
    }
    Signature { phi, eps: open, f_row, e_row }
}

/// Index of the tableau whose level-i shape is mu with part r moved by `step` (+1 or -1), all
/// other levels unchanged, given the index `v` of the tableau with levels (kappa, mu, nu).
#[inline]
#[allow(clippy::cast_possible_wrap, clippy::cast_sign_loss)]
fn moved(m: &Model, v: u64, i: usize, lv: [&[u16]; 3], r: usize, up: bool, tmp: &mut [u16]) -> i64 {
    let [kappa, mu, nu] = lv;
    tmp.copy_from_slice(mu);
    tmp[r] = if up { mu[r] + 1 } else { mu[r] - 1 };
    let nu_id = m.sub.id(nu);
    let mu_id = m.sub.id(mu);
    let new_id = (mu_id as isize + m.sub.id_delta(r, mu[r], tmp[r])) as usize;
    let before = m.offset(i + 1, nu_id, nu, mu) + m.offset(i, mu_id, mu, kappa);
    let after = m.offset(i + 1, nu_id, nu, tmp) + m.offset(i, new_id, tmp, kappa);
    (v + after - before) as i64
}

/// Counts per row of the entries <= k, for k = i-1, i, i+1 (rows past i hold none).
#[inline]
fn three_levels(m: &Model, t: &[u8], i: usize, out: &mut [u16]) {
    let w = m.rows + 1;
    out.fill(0);
    #[allow(clippy::cast_possible_truncation)]
    let (lo, mid, hi) = ((i - 1) as u8, i as u8, (i + 1) as u8);
    for r in 0..m.rows.min(i + 1) {
        let row = &t[m.row_start[r]..m.row_start[r + 1]];
        let count = |v: u8| row.iter().filter(|&&x| x <= v).count() as u16;
        (out[r], out[w + r], out[2 * w + r]) = (count(lo), count(mid), count(hi));
    }
}

#[inline]
fn narrow(x: u32) -> i32 {
    i32::try_from(x).expect("string lengths are at most the number of cells")
}

fn check_i(m: &Model, i: usize) -> Result<(), Error> {
    if i == 0 || i >= m.n {
        return Err(Error::invalid(format!("i must be in 1..{}; got {i}", m.n.saturating_sub(1))));
    }
    Ok(())
}

fn vertex_count(m: &Model, cells: &[u8]) -> Result<usize, Error> {
    if m.cells == 0 {
        return usize::try_from(m.count()).map_err(|_| Error::invalid("count does not fit"));
    }
    if cells.len() % m.cells != 0 {
        return Err(Error::invalid(format!(
            "tableau array must have {} columns; got {} values",
            m.cells,
            cells.len()
        )));
    }
    Ok(cells.len() / m.cells)
}

/// Runs `per_vertex(index, cells, scratch, out)` over all vertices in parallel blocks, writing
/// `width` outputs per vertex into one vector in index order (deterministic).
fn map_vertices<T: Copy + Default + Send>(
    m: &Model,
    cells: &[u8],
    width: usize,
    job: &Job,
    per_vertex: impl Fn(u64, &[u8], &mut [u16], &mut [T]) + Sync,
) -> Result<Vec<T>, Error> {
    let count = vertex_count(m, cells)?;
    let mut out = vec![T::default(); count * width];
    let scratch_len = (m.n + 2) * (m.rows + 1) * 2;
    let c = m.cells.max(1);
    out.par_chunks_mut(BLOCK * width).enumerate().try_for_each(|(b, chunk)| {
        job.checkpoint(BLOCK as u64)?;
        let mut scratch = vec![0u16; scratch_len];
        for (k, slot) in chunk.chunks_mut(width).enumerate() {
            let v = b * BLOCK + k;
            let t = if m.cells == 0 { &[][..] } else { &cells[v * c..(v + 1) * c] };
            per_vertex(v as u64, t, &mut scratch, slot);
        }
        Ok(())
    })?;
    Ok(out)
}

/// phi_i and epsilon_i of every vertex, interleaved as (phi, eps) pairs.
pub fn string_lengths(m: &Model, cells: &[u8], i: usize, job: &Job) -> Result<Vec<i32>, Error> {
    check_i(m, i)?;
    let w = m.rows + 1;
    map_vertices(m, cells, 2, job, |_, t, s, out| {
        three_levels(m, t, i, &mut s[..3 * w]);
        let sig = signature(&s[..w], &s[w..2 * w], &s[2 * w..3 * w], m.rows.min(i + 1));
        (out[0], out[1]) = (narrow(sig.phi), narrow(sig.eps));
    })
}

/// f_i and e_i targets of every vertex (index or -1), interleaved as (f, e) pairs.
pub fn operators(m: &Model, cells: &[u8], i: usize, job: &Job) -> Result<Vec<i64>, Error> {
    check_i(m, i)?;
    let w = m.rows + 1;
    map_vertices(m, cells, 2, job, |v, t, s, out| {
        let (lv, tmp) = s.split_at_mut(3 * w);
        three_levels(m, t, i, lv);
        let levels = [&lv[..w], &lv[w..2 * w], &lv[2 * w..]];
        let sig = signature(levels[0], levels[1], levels[2], m.rows.min(i + 1));
        out[0] = sig.f_row.map_or(-1, |r| moved(m, v, i, levels, r, false, &mut tmp[..w]));
        out[1] = sig.e_row.map_or(-1, |r| moved(m, v, i, levels, r, true, &mut tmp[..w]));
    })
}

/// f_i, e_i, phi_i, epsilon_i for all i in 1..n, each (n-1) x N, row i-1 for operator i.
#[derive(Debug, Default)]
pub struct OperatorTables {
    pub count: usize,
    pub f: Vec<i64>,
    pub e: Vec<i64>,
    pub phi: Vec<i32>,
    pub eps: Vec<i32>,
}

/// All operator tables at once. The Gelfand-Tsetlin pattern is read once per vertex and shared by
/// all i; the vertex-major results are then transposed so that each f_i is contiguous.
#[allow(clippy::cast_possible_truncation)]
pub fn operator_tables(m: &Model, cells: &[u8], job: &Job) -> Result<OperatorTables, Error> {
    let w = m.rows + 1;
    let ops = m.n.saturating_sub(1);
    let raw = map_vertices(m, cells, 4 * ops, job, |v, t, s, out| {
        let (gt, tmp) = s.split_at_mut((m.n + 1) * w);
        m.pattern(t, gt);
        for i in 1..m.n {
            let levels = [&gt[(i - 1) * w..i * w], &gt[i * w..(i + 1) * w], &gt[(i + 1) * w..(i + 2) * w]];
            let sig = signature(levels[0], levels[1], levels[2], m.rows.min(i + 1));
            let o = &mut out[4 * (i - 1)..4 * i];
            o[0] = sig.f_row.map_or(-1, |r| moved(m, v, i, levels, r, false, &mut tmp[..w]));
            o[1] = sig.e_row.map_or(-1, |r| moved(m, v, i, levels, r, true, &mut tmp[..w]));
            (o[2], o[3]) = (i64::from(sig.phi), i64::from(sig.eps));
        }
    })?;
    let count = vertex_count(m, cells)?;
    let mut t = OperatorTables { count, ..Default::default() };
    let column = |k: usize| (0..ops).flat_map(move |i| (0..count).map(move |v| (i, v, k)));
    t.f = column(0).map(|(i, v, k)| raw[v * 4 * ops + 4 * i + k]).collect();
    t.e = column(1).map(|(i, v, k)| raw[v * 4 * ops + 4 * i + k]).collect();
    t.phi = column(2).map(|(i, v, k)| raw[v * 4 * ops + 4 * i + k] as i32).collect();
    t.eps = column(3).map(|(i, v, k)| raw[v * 4 * ops + 4 * i + k] as i32).collect();
    Ok(t)
}

/// Weight of every vertex: the number of entries equal to k, for k = 1..n, vertex-major.
pub fn weights(m: &Model, cells: &[u8], job: &Job) -> Result<Vec<i32>, Error> {
    map_vertices(m, cells, m.n, job, |_, t, _, out| {
        for &x in t {
            out[usize::from(x) - 1] += 1;
        }
    })
}
