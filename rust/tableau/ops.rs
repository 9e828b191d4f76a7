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

use super::moves::Moves;
use super::tables::Level;
use super::Model;
use crate::error::Error;
use crate::job::Job;
use crate::memory::filled;
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
    Signature {
        phi,
        eps: open,
        f_row,
        e_row,
    }
}

/// Index of f_i(v) (up = false) or e_i(v) (up = true), which move part r of lambda^(i), from
/// where the tableau's level-(i+1) pair (lambda^(i+1) over lambda^(i)) and level-i pair
/// (lambda^(i) over lambda^(i-1)) sit in their tables: rank(v) changes by the two tabulated moves.
#[inline]
#[allow(clippy::cast_possible_wrap)] // indices are below 2^63 (checked when the model is built)
fn target(v: u64, entries: [usize; 2], moves: [&Moves; 2], r: usize, up: bool) -> i64 {
    let ([upper_entry, lower_entry], [upper, lower]) = (entries, moves);
    v as i64 + upper.inner(upper_entry, r, up) + lower.outer(lower_entry, r, up)
}

/// Counts per row of the entries <= k, for k = i-1, i, i+1 (rows past i hold none), in one pass.
#[inline]
fn three_levels(m: &Model, t: &[u8], i: usize, out: &mut [u16]) {
    let w = m.rows + 1;
    #[allow(clippy::cast_possible_truncation)]
    let (lo, mid, hi) = ((i - 1) as u8, i as u8, (i + 1) as u8);
    let used = m.rows.min(i + 1);
    for r in 0..used {
        let (mut a, mut b, mut c) = (0u16, 0u16, 0u16);
        for &x in &t[m.row_start[r]..m.row_start[r + 1]] {
            a += u16::from(x <= lo);
            b += u16::from(x <= mid);
            c += u16::from(x <= hi);
        }
        (out[r], out[w + r], out[2 * w + r]) = (a, b, c);
    }
    for r in used..w {
        (out[r], out[w + r], out[2 * w + r]) = (0, 0, 0);
    }
}

fn check_i(m: &Model, i: usize) -> Result<(), Error> {
    if i == 0 || i >= m.n {
        return Err(Error::invalid(format!(
            "i must be in 1..{}; got {i}",
            m.n.saturating_sub(1)
        )));
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

/// f_i, e_i (targets or -1) and phi_i, epsilon_i of every vertex for one i.
#[derive(Debug, Default, Clone)]
pub struct Operator {
    pub f: Vec<i64>,
    pub e: Vec<i64>,
    pub phi: Vec<i32>,
    pub eps: Vec<i32>,
}

/// One operator for all vertices; with `targets = false` only phi and epsilon are filled (f and
/// e stay empty). Parallel over blocks of vertices, each block writing its own slices.
pub fn operator(
    m: &Model,
    cells: &[u8],
    i: usize,
    targets: bool,
    job: &Job,
) -> Result<Operator, Error> {
    check_i(m, i)?;
    let count = vertex_count(m, cells)?;
    let mut op = Operator {
        phi: filled(count, 0),
        eps: filled(count, 0),
        ..Operator::default()
    };
    let lengths = op
        .phi
        .par_chunks_mut(BLOCK)
        .zip(op.eps.par_chunks_mut(BLOCK));
    if targets {
        let moves = [Moves::new(m, i + 1), Moves::new(m, i)];
        (op.f, op.e) = (filled(count, -1), filled(count, -1));
        let ends = op.f.par_chunks_mut(BLOCK).zip(op.e.par_chunks_mut(BLOCK));
        lengths
            .zip(ends)
            .enumerate()
            .try_for_each(|(b, ((phi, eps), (f, e)))| {
                job.checkpoint(BLOCK as u64)?;
                operator_block(m, cells, i, b * BLOCK, phi, eps, Some((f, e, &moves)));
                Ok(())
            })?;
    } else {
        lengths.enumerate().try_for_each(|(b, (phi, eps))| {
            job.checkpoint(BLOCK as u64)?;
            operator_block(m, cells, i, b * BLOCK, phi, eps, None);
            Ok::<_, Error>(())
        })?;
    }
    Ok(op)
}

/// The vertices `first ..` of one block: phi, epsilon, and the targets when asked for.
fn operator_block(
    m: &Model,
    cells: &[u8],
    i: usize,
    first: usize,
    phi: &mut [i32],
    eps: &mut [i32],
    mut targets: Option<(&mut [i64], &mut [i64], &[Moves; 2])>,
) {
    let w = m.rows + 1;
    let c = m.cells.max(1);
    let used = m.rows.min(i + 1);
    let (upper, lower) = (m.level(i + 1), m.level(i));
    let mut lv = vec![0u16; 3 * w];
    for k in 0..phi.len() {
        let v = first + k;
        let t = if m.cells == 0 {
            &[][..]
        } else {
            &cells[v * c..(v + 1) * c]
        };
        three_levels(m, t, i, &mut lv);
        let (kappa, rest) = lv.split_at(w);
        let (mu, nu) = rest.split_at(w);
        let sig = signature(kappa, mu, nu, used);
        (phi[k], eps[k]) = (narrow(sig.phi), narrow(sig.eps));
        if let Some((f, e, [up_moves, low_moves])) =
            targets.as_mut().map(|(f, e, mv)| (f, e, mv.each_ref()))
        {
            if sig.f_row.is_some() || sig.e_row.is_some() {
                let (mu_id, nu_id) = (m.sub.id(mu), m.sub.id(nu));
                let entries = [upper.entry(nu_id, nu, mu), lower.entry(mu_id, mu, kappa)];
                let moves = [up_moves, low_moves];
                if let Some(r) = sig.f_row {
                    f[k] = target(v as u64, entries, moves, r, false);
                }
                if let Some(r) = sig.e_row {
                    e[k] = target(v as u64, entries, moves, r, true);
                }
            }
        }
    }
}

/// One block's share of one operator's four output arrays.
struct Slices<'a> {
    f: &'a mut [i64],
    e: &'a mut [i64],
    phi: &'a mut [i32],
    eps: &'a mut [i32],
}

/// Every operator i = 1..n-1 at once. Each vertex's pattern, level ids and rank terms are read
/// once and shared by all i; blocks of vertices run in parallel, each writing its own slices of
/// the (n-1) x 4 output arrays, so every output stays contiguous per i without a transpose.
/// With `lowering_only`, only the f_i are filled (e, phi and epsilon stay empty): what a
/// Demazure closure needs, at about half the cost.
pub fn operator_tables(
    m: &Model,
    cells: &[u8],
    lowering_only: bool,
    job: &Job,
) -> Result<Vec<Operator>, Error> {
    let count = vertex_count(m, cells)?;
    let rest = if lowering_only { 0 } else { count };
    let blank = || Operator {
        f: filled(count, -1),
        e: filled(rest, -1),
        phi: filled(rest, 0),
        eps: filled(rest, 0),
    };
    let mut out: Vec<Operator> = (1..m.n).map(|_| blank()).collect();
    let moves: Vec<Moves> = (1..=m.n)
        .into_par_iter()
        .map(|k| Moves::new(m, k))
        .collect();
    let mut per_block: Vec<Vec<Slices>> = (0..count.div_ceil(BLOCK)).map(|_| Vec::new()).collect();
    for op in &mut out {
        let (mut e, mut phi) = (op.e.chunks_mut(BLOCK), op.phi.chunks_mut(BLOCK));
        let mut eps = op.eps.chunks_mut(BLOCK);
        for (b, f) in op.f.chunks_mut(BLOCK).enumerate() {
            let (e, phi, eps) = (e.next(), phi.next(), eps.next()); // None when lowering only
            let (e, phi, eps) = (
                e.unwrap_or_default(),
                phi.unwrap_or_default(),
                eps.unwrap_or_default(),
            );
            per_block[b].push(Slices { f, e, phi, eps });
        }
    }
    per_block
        .into_par_iter()
        .enumerate()
        .try_for_each(|(b, mut slices)| {
            job.checkpoint(BLOCK as u64)?;
            tables_block(m, cells, b * BLOCK, &moves, &mut slices);
            Ok::<_, Error>(())
        })?;
    Ok(out)
}

/// `moves[k - 1]` and `levels[k - 1]` belong to level k.
fn tables_block(m: &Model, cells: &[u8], first: usize, moves: &[Moves], out: &mut [Slices]) {
    let (n, w, c) = (m.n, m.rows + 1, m.cells.max(1));
    let levels: Vec<Level> = (1..=n).map(|k| m.level(k)).collect();
    let mut gt = vec![0u16; (n + 1) * w];
    let (mut ids, mut entries) = (vec![0usize; n + 1], vec![0usize; n + 1]);
    let len = out.first().map_or(0, |s| s.f.len());
    for k in 0..len {
        let v = first + k;
        m.pattern(
            if m.cells == 0 {
                &[]
            } else {
                &cells[v * c..(v + 1) * c]
            },
            &mut gt,
        );
        let level = |l: usize| &gt[l * w..(l + 1) * w];
        for (l, id) in ids.iter_mut().enumerate() {
            *id = m.sub.id(level(l));
        }
        for l in 1..=n {
            entries[l] = levels[l - 1].entry(ids[l], level(l), level(l - 1));
        }
        for i in 1..n {
            let (kappa, mu, nu) = (level(i - 1), level(i), level(i + 1));
            let sig = signature(kappa, mu, nu, m.rows.min(i + 1));
            let s = &mut out[i - 1];
            let full = !s.phi.is_empty();
            if full {
                (s.phi[k], s.eps[k]) = (narrow(sig.phi), narrow(sig.eps));
            }
            if sig.f_row.is_none() && sig.e_row.is_none() {
                continue;
            }
            let pair = [entries[i + 1], entries[i]];
            let tables = [&moves[i], &moves[i - 1]];
            if let Some(r) = sig.f_row {
                s.f[k] = target(v as u64, pair, tables, r, false);
            }
            if let Some(r) = sig.e_row.filter(|_| full) {
                s.e[k] = target(v as u64, pair, tables, r, true);
            }
        }
    }
}

#[inline]
fn narrow(x: u32) -> i32 {
    i32::try_from(x).expect("string lengths are at most the number of cells")
}

/// Weight of every vertex: the number of entries equal to k, for k = 1..n, vertex-major.
pub fn weights(m: &Model, cells: &[u8], job: &Job) -> Result<Vec<i32>, Error> {
    let count = vertex_count(m, cells)?;
    let mut out = filled(count * m.n, 0i32);
    if m.cells == 0 || m.n == 0 {
        return Ok(out);
    }
    out.par_chunks_mut(BLOCK * m.n)
        .enumerate()
        .try_for_each(|(b, chunk)| {
            job.checkpoint(BLOCK as u64)?;
            for (k, row) in chunk.chunks_mut(m.n).enumerate() {
                let v = b * BLOCK + k;
                for &x in &cells[v * m.cells..(v + 1) * m.cells] {
                    row[usize::from(x) - 1] += 1;
                }
            }
            Ok(())
        })?;
    Ok(out)
}
