//! Walking SSYT(shape, n) in index order: an odometer on the Gelfand-Tsetlin pattern.
#![deny(unsafe_code)]

use super::Model;
use crate::error::Error;
use crate::job::Job;
use rayon::prelude::*;

/// Tableaux per unit of parallel work and per checkpoint.
const BLOCK: usize = 1 << 14;

/// The current pattern and a cursor over the following ones. The digits are the parts of
/// lambda^(n-1), ..., lambda^(1), the last digit changing fastest. Each part of lambda^(k)
/// ranges over lambda^(k+1)_j down to lambda^(k+1)_{j+1}, so every prefix extends (no dead
/// ends) and a step is amortised O(1).
pub struct Walker<'m> {
    model: &'m Model,
    pub gt: Vec<u16>,
}

impl<'m> Walker<'m> {
    pub fn at(model: &'m Model, index: u64) -> Result<Self, Error> {
        let mut gt = vec![0u16; (model.n + 1) * (model.rows + 1)];
        model.unrank_pattern(index, &mut gt)?;
        Ok(Walker { model, gt })
    }

    /// Moves to the next tableau; returns the highest level k whose part changed (levels below k
    /// were reset too), or `None` after the last tableau. Digits go down: a part of lambda^(k)
    /// steps from lambda^(k+1)_j towards lambda^(k+1)_{j+1}, and the parts after it restart at
    /// their largest values.
    #[inline]
    pub fn advance(&mut self) -> Option<usize> {
        let rows = self.model.rows;
        let w = rows + 1;
        let gt = &mut self.gt;
        // Fast path: lambda^(1) is one part, the digit that moves most often.
        if self.model.n >= 2 && rows > 0 && gt[w] > gt[2 * w + 1] {
            gt[w] -= 1;
            return Some(1);
        }
        // Next most often: lambda^(2), at most two parts; lambda^(1) restarts at its top.
        if self.model.n >= 3 {
            for j in (0..2.min(rows)).rev() {
                if gt[2 * w + j] > gt[3 * w + j + 1] {
                    gt[2 * w + j] -= 1;
                    if j == 0 && rows > 1 {
                        gt[2 * w + 1] = gt[3 * w + 1];
                    }
                    gt[w] = gt[2 * w];
                    return Some(2);
                }
            }
        }
        for k in 3..self.model.n {
            let free = k.min(rows);
            for j in (0..free).rev() {
                if gt[k * w + j] > gt[(k + 1) * w + j + 1] {
                    gt[k * w + j] -= 1;
                    // plain loops: these copies are a few elements, shorter than a memmove call
                    for jj in j + 1..free {
                        gt[k * w + jj] = gt[(k + 1) * w + jj];
                    }
                    for kk in (1..k).rev() {
                        for jj in 0..kk.min(rows) {
                            gt[kk * w + jj] = gt[(kk + 1) * w + jj];
                        }
                    }
                    return Some(k);
                }
            }
        }
        None
    }

    /// Rewrites in `t` the cells that may have changed when `advance` returned k: entries <= k + 1
    /// in the rows above row k (lambda^(j) has at most j rows, so lower rows keep their cells).
    #[inline]
    pub fn rewrite(&self, k: usize, t: &mut [u8]) {
        let m = self.model;
        let w = m.rows + 1;
        if k == 1 {
            t[usize::from(self.gt[w])] = 2; // the last 1 of row 1 became a 2
            return;
        }
        for r in 0..k.min(m.rows) {
            let row = &mut t[m.row_start[r]..m.row_start[r + 1]];
            for v in (r + 1)..=(k + 1) {
                let (a, b) = (self.gt[(v - 1) * w + r], self.gt[v * w + r]);
                #[allow(clippy::cast_possible_truncation)]
                row[usize::from(a)..usize::from(b)].fill(v as u8);
            }
        }
    }
}

/// Tableaux of at most this many cells are built in a stack buffer and stored with one
/// fixed-width copy each (the bytes past the tableau land in the next slot, rewritten next).
const NARROW: usize = 32;

/// Writes tableaux `start .. start + out.len() / cells` (row-major cells, one per row of `out`).
pub fn fill_range(model: &Model, start: u64, out: &mut [u8]) -> Result<(), Error> {
    let c = model.cells;
    if out.is_empty() || c == 0 {
        return Ok(()); // nothing asked, or the empty tableau (no cells)
    }
    let mut walker = Walker::at(model, start)?;
    let count = out.len() / c;
    if c <= NARROW {
        let mut cur = [0u8; NARROW];
        model.cells_of(&walker.gt, &mut cur[..c]);
        for i in 0..count {
            let at = i * c;
            if at + NARROW <= out.len() {
                out[at..at + NARROW].copy_from_slice(&cur);
            } else {
                out[at..at + c].copy_from_slice(&cur[..c]);
            }
            if i + 1 < count {
                let k = walker.advance().expect("the range lies inside 0..count");
                walker.rewrite(k, &mut cur);
            }
        }
        return Ok(());
    }
    model.cells_of(&walker.gt, &mut out[..c]);
    for i in 1..count {
        let (done, rest) = out.split_at_mut(i * c);
        let t = &mut rest[..c];
        t.copy_from_slice(&done[(i - 1) * c..]);
        let k = walker.advance().expect("the range lies inside 0..count");
        walker.rewrite(k, t);
    }
    Ok(())
}

/// All tableaux of the model, row-major, `count * cells` bytes; both cores for large counts.
pub fn fill(model: &Model, job: &Job) -> Result<Vec<u8>, Error> {
    let total = usize::try_from(model.count()).map_err(|_| too_big(model))?;
    let bytes = total
        .checked_mul(model.cells)
        .ok_or_else(|| too_big(model))?;
    let mut out = crate::memory::filled(bytes, 0u8);
    if model.cells == 0 {
        return Ok(out);
    }
    out.par_chunks_mut(BLOCK * model.cells)
        .enumerate()
        .try_for_each(|(b, chunk)| {
            job.checkpoint(BLOCK as u64)?;
            fill_range(model, (b * BLOCK) as u64, chunk)
        })?;
    Ok(out)
}

/// Walks every tableau with a trivial consumer (sums the changed levels), for measuring the
/// enumeration itself; `threads > 1` splits the index range into blocks. Returns (count, checksum).
pub fn scan(model: &Model, threads: usize, job: &Job) -> Result<(u64, u64), Error> {
    let total = model.count();
    if total == 0 {
        return Ok((0, 0));
    }
    let block = (BLOCK as u64) * 64;
    let blocks = total.div_ceil(block);
    let walk_block = |b: u64| -> Result<(u64, u64), Error> {
        let start = b * block;
        let len = block.min(total - start);
        let mut walker = Walker::at(model, start)?;
        let mut sum = 0u64;
        for step in 1..len {
            sum += walker.advance().expect("inside the range") as u64;
            if step % (BLOCK as u64) == 0 {
                job.checkpoint(BLOCK as u64)?;
            }
        }
        Ok((len, sum))
    };
    let add = |a: (u64, u64), b: (u64, u64)| (a.0 + b.0, a.1 + b.1);
    if threads <= 1 {
        (0..blocks).try_fold((0, 0), |acc, b| walk_block(b).map(|r| add(acc, r)))
    } else {
        let pool = rayon::ThreadPoolBuilder::new()
            .num_threads(threads)
            .build()
            .map_err(|e| Error::invalid(format!("threads: could not start a pool ({e})")))?;
        pool.install(|| {
            (0..blocks)
                .into_par_iter()
                .map(walk_block)
                .try_reduce(|| (0, 0), |a, b| Ok(add(a, b)))
        })
    }
}

fn too_big(model: &Model) -> Error {
    Error::TooLarge {
        what: format!(
            "SSYT({:?}, {}) ({} tableaux)",
            model.shape,
            model.n,
            model.count()
        ),
        bytes: u128::from(model.count()) * model.cells as u128,
        instead: "stream it in chunks with iter_tableaux".into(),
    }
}
