//! Enumeration of the decreasing factorizations: a depth-first search over left descents.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use crate::schubert::pipes::{mask_words, row_offsets, PipeDreamGraph};
use crate::schubert::pipes_read;
use std::collections::HashMap;

/// Depth-first search state: the inverse of the part of w not yet written, and the factors so far.
struct Search<'a> {
    n: usize,
    m: usize,
    inverse: Vec<usize>,
    row: Vec<u32>,
    out: Vec<u32>,
    limit: usize,
    job: &'a Job,
    finishes: Finishes,
    /// Some(m) when only bounded factorizations are wanted.
    floor: Option<usize>,
}

/// Memo of `can_finish`, keyed by the packed inverse of the rest, the bound and the factors left.
type Finishes = HashMap<([u64; 3], usize, usize), bool>;

/// Entries of the memo (about 60 bytes each with the table's overhead) before the search gives
/// up: past it `can_finish` answers false at once, and `grow` refuses with `TooLarge`.
const MEMO_CAP: usize = 1 << 23;

/// The inverse permutation packed 5 bits an entry (n <= 32).
fn packed(inverse: &[usize]) -> [u64; 3] {
    let mut out = [0u64; 3];
    for (j, &x) in inverse.iter().enumerate() {
        let bit = 5 * j;
        let x = u128::try_from(x).expect("small") << (bit % 64);
        out[bit / 64] |= u64::try_from(x & u128::from(u64::MAX)).expect("masked");
        if bit % 64 > 59 {
            out[bit / 64 + 1] |= u64::try_from(x >> 64).expect("a few bits");
        }
    }
    out
}

/// Whether the rest (given by its inverse, `left` = its length) can be written as the current
/// factor continued with letters below `below` followed by k - 1 more decreasing factors.
/// Memoised, so the enumeration never enters a branch without a leaf.
fn can_finish(
    memo: &mut Finishes,
    inverse: &mut [usize],
    (below, k, floor): (usize, usize, Option<usize>),
    left: usize,
) -> bool {
    let n = inverse.len();
    if left == 0 {
        return true;
    }
    if k == 0 || left > below - 1 + (k - 1) * (n - 1) {
        return false;
    }
    if let Some(m) = floor {
        // bounded: u^j holds at most n - j letters; the search is small, a memo costs more
        let room: usize = (m + 2 - k..=m).map(|j| n.saturating_sub(j)).sum();
        if left > (below - 1).min(n.saturating_sub(m + 1 - k)) + room {
            return false;
        }
        return true;
    }
    let key = (packed(inverse), below, k);
    if let Some(&known) = memo.get(&key) {
        return known;
    }
    if memo.len() >= MEMO_CAP {
        return false; // unwinds the search quickly; the caller sees the full memo and refuses
    }
    let mut ok = k > 1 && can_finish(memo, inverse, (n, k - 1, floor), left);
    // bounded: the factor with k left is u^(m-k+1), whose letters are at least m - k + 1
    let lowest = floor.map_or(1, |m| m + 1 - k);
    for a in lowest..below {
        if ok {
            break;
        }
        if inverse[a - 1] > inverse[a] {
            inverse.swap(a - 1, a);
            ok = can_finish(memo, inverse, (a, k, floor), left - 1);
            inverse.swap(a - 1, a);
        }
    }
    memo.insert(key, ok);
    ok
}

/// All decreasing factorizations of w into m >= 1 factors, sorted (row-major, m bitsets per row).
/// With `bounded_only`, only the bounded ones (letters of u^r at least r): the pipe dreams.
pub fn enumerate(
    w: &[usize],
    (m, bounded_only): (usize, bool),
    limit: usize,
    job: &Job,
) -> Result<Vec<u32>, Error> {
    let n = w.len();
    if n == 0 {
        return Ok(Vec::new());
    }
    if bounded_only && m + 1 >= n {
        return bounded_from_pipe_dreams(w, m, limit, job);
    }
    let mut inverse = vec![0; n];
    for (position, &value) in w.iter().enumerate() {
        inverse[value] = position;
    }
    let length = crate::perm::length(w);
    let mut search = Search {
        n,
        m,
        inverse,
        row: vec![0; m],
        out: Vec::new(),
        limit,
        job,
        finishes: HashMap::new(),
        floor: bounded_only.then_some(m),
    };
    search.grow(0, n, length)?;
    Ok(sorted_rows(&search.out, m))
}

impl Search<'_> {
    /// Extends factor r (0-based) with letters below `below`, `left` letters still to write.
    fn grow(&mut self, r: usize, below: usize, left: usize) -> Result<(), Error> {
        let finishes = can_finish(
            &mut self.finishes,
            &mut self.inverse,
            (below, self.m - r, self.floor),
            left,
        );
        if self.finishes.len() >= MEMO_CAP {
            return Err(Error::TooLarge {
                what: "the search for the decreasing factorizations of this permutation".into(),
                bytes: u128::try_from(MEMO_CAP * 60).unwrap_or(u128::MAX),
                instead: "use druse.pipe_dreams, or druse.schubert_key_expansion with \
                          method=\"polynomial\" (a smaller permutation for the Stanley \
                          symmetric function)"
                    .to_string(),
            });
        }
        if !finishes {
            return Ok(());
        }
        if r + 1 == self.m {
            if left == 0 {
                self.emit()?;
            }
        } else {
            self.grow(r + 1, self.n, left)?;
        }
        for a in self.floor.map_or(1, |_| r + 1)..below {
            // letter a is a left descent of the rest iff value a+1 stands left of value a
            // (1-based values; `inverse` is 0-based): l(s_a rest) < l(rest)
            if left > 0 && self.inverse[a - 1] > self.inverse[a] {
                self.inverse.swap(a - 1, a);
                self.row[r] |= 1 << (a - 1);
                let result = self.grow(r, a, left - 1);
                self.row[r] &= !(1 << (a - 1));
                self.inverse.swap(a - 1, a);
                result?;
            }
        }
        Ok(())
    }

    fn emit(&mut self) -> Result<(), Error> {
        let count = self.out.len() / self.m;
        if count >= self.limit {
            return Err(too_many(self.limit, count, self.m));
        }
        if count % 4096 == 0 {
            self.job.checkpoint(4096)?;
        }
        self.out.extend_from_slice(&self.row);
        Ok(())
    }
}

fn sorted_rows(flat: &[u32], n: usize) -> Vec<u32> {
    let mut rows: Vec<&[u32]> = flat.chunks_exact(n).collect();
    rows.sort_unstable();
    rows.concat()
}

fn too_many(limit: usize, count: usize, m: usize) -> Error {
    Error::TooLarge {
        what: format!("more than {limit} decreasing factorizations"),
        bytes: u128::try_from(count.saturating_mul(m * 40)).unwrap_or(u128::MAX),
        instead: "use druse.pipe_dreams, or druse.schubert_key_expansion with \
                  method=\"polynomial\""
            .to_string(),
    }
}

/// The bounded factorizations into m >= n - 1 factors, straight from the pipe-dream enumeration
/// (which has no dead ends, unlike a search with the bounded length test): row r of a pipe dream
/// is the factor u^(r+1), its field bit c standing for the 0-based letter r + c. Ascending masks
/// compare row 1 first, so the rows come out sorted as `sorted_rows` would sort them.
fn bounded_from_pipe_dreams(
    w: &[usize],
    m: usize,
    limit: usize,
    job: &Job,
) -> Result<Vec<u32>, Error> {
    let n = w.len();
    let graph = PipeDreamGraph::new(w, job)?;
    let total = pipes_read::checked_total(&graph)?;
    if total > limit {
        return Err(too_many(limit, total, m));
    }
    let masks = pipes_read::enumerate(&graph, job)?;
    let words = mask_words(n);
    let offsets = row_offsets(n);
    let mut out = vec![0u32; total * m];
    if words == 0 {
        return Ok(out);
    }
    for (mask, rows) in masks.chunks_exact(words).zip(out.chunks_exact_mut(m)) {
        for (r, &off) in offsets.iter().enumerate() {
            for c in 0..n - 1 - r {
                let bit = off as usize + c;
                if mask[words - 1 - bit / 64] >> (bit % 64) & 1 == 1 {
                    rows[r] |= 1 << (r + c);
                }
            }
        }
    }
    job.checkpoint(total as u64)?;
    Ok(out)
}
