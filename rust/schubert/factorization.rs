//! Decreasing factorizations of a permutation and the crystal on them.
//!
//! A decreasing factorization of w in S_n into m factors is a tuple (u^1, ..., u^m) of strictly
//! decreasing words whose concatenation u^1 u^2 ... u^m is a reduced word of w. A strictly
//! decreasing word is determined by its set of letters, so a factor is stored as a `u32` bitset
//! (letter a in 1..n-1 is bit a-1). The crystal is one of GL_m; m = n gives room for every
//! pipe dream and every shape of the Stanley symmetric function, and so does m = n - 1, since
//! a pipe dream has no cross in row n.
//!
//! Weight: wt = (|u^1|, ..., |u^m|), factors counted from the left. The factorization is
//! *bounded* when every letter of u^r is at least r (Assaf-Schilling, "A Demazure crystal
//! construction for Schubert polynomials", 2018); then the cells (r, a - r + 1), a in u^r, are
//! the crosses of a reduced pipe dream of w (row r read right to left is u^r, rows top to bottom
//! give the reduced word), and every reduced pipe dream arises once, with x_r = |u^r|. So the
//! character of the bounded set is sum over pipe dreams of prod x_r^(crosses in row r), the
//! Schubert polynomial S_w (Billey-Jockusch-Stanley, "Some combinatorial properties of Schubert
//! polynomials", 1993; Bergeron-Billey, "RC-graphs and Schubert polynomials", 1993).
//!
//! Crystal (Morse-Schilling, "Crystal approach to affine Schubert calculus", 2016, with the
//! factors indexed from the left: their f_j on v^{j+1} v^j is our e_{m-j}, so that the weight
//! is the row count above). For 1 <= r < m let L = u^r and R = u^{r+1}. Bracketing: take the
//! letters b of L from the largest down, and pair each with the smallest still unpaired a in R
//! with a > b (if any). Then
//! - f_r: if every letter of L is paired, undefined; else take the smallest unpaired b of L,
//!   remove it from L and add b - t to R, t >= 0 least with b - t not in R;
//! - e_r: if every letter of R is paired, undefined; else take the largest unpaired a of R,
//!   remove it from R and add a + s to L, s >= 0 least with a + s not in L.
//!
//! Both keep the product and reducedness, are inverse to each other, and move weight by
//! -alpha_r and +alpha_r; no unpaired letter of R exceeds an unpaired letter of L, so
//! phi_r = #unpaired(L) and epsilon_r = #unpaired(R), as in the signature rule.
//!
//! Vertex order: ascending lexicographic order of (u^1, ..., u^m), each factor compared as its
//! bitset integer (its largest letters most significant). On the bounded vertices this is the
//! ascending order of the pipe-dream bit masks (rows top to bottom, each right to left, first
//! cell most significant), because the bits of letters below r in u^r are zero there.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use rayon::prelude::*;

#[path = "factorization_search.rs"]
mod search;
pub use search::enumerate;
#[path = "factorization_keys.rs"]
mod keys;
pub use keys::{keys_of_ranks, pipe_dream_keys, KeyExpansion, MAX_BATCH_N};

/// Largest n: the letters 1..n-1 of a factor fit a `u32`.
pub const MAX_N: usize = 32;
/// In a truncated table: the operator is defined, but its target is not bounded.
pub const LEAVES: i64 = -2;
/// Vertices at which the operator tables are built with several threads.
const PARALLEL_FROM: usize = 1 << 14;

/// The decreasing factorizations of w into m = n factors, the crystal operators on them, and
/// which ones are bounded.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct FactorizationCrystal {
    /// n, for w in S_n: letters are 1..n-1.
    pub n: usize,
    /// m, the number of factors and of weight coordinates.
    pub m: usize,
    /// Whether only the bounded factorizations were kept (tables then hold `LEAVES`).
    pub bounded_only: bool,
    /// Factor bitsets, row-major (count x m), rows in ascending lexicographic order.
    pub factors: Vec<u32>,
    /// f_r for r = 1..m-1: `lowering[r-1][v]` is the target vertex or -1.
    pub lowering: Vec<Vec<i64>>,
    /// e_r for r = 1..m-1, computed by its own rule (not by inverting f_r).
    pub raising: Vec<Vec<i64>>,
}

impl FactorizationCrystal {
    /// Number of vertices.
    pub fn count(&self) -> usize {
        self.factors.len() / self.m.max(1)
    }

    /// Weights (count x m, row-major): the sizes of the factors.
    pub fn weights(&self) -> Vec<i32> {
        self.factors
            .iter()
            .map(|b| i32::try_from(b.count_ones()).expect("at most 32"))
            .collect()
    }

    /// Whether each vertex is bounded: every letter of u^r is at least r.
    pub fn bounded(&self) -> Vec<bool> {
        self.factors
            .chunks_exact(self.m.max(1))
            .map(|row| {
                row.iter()
                    .enumerate()
                    .all(|(r, &bits)| bits & ((1u32 << r) - 1) == 0)
            })
            .collect()
    }
}

/// Builds the crystal of the factorizations of w (0-based one-line notation) into m factors,
/// or with `bounded_only` its truncation to the bounded ones (the pipe dreams), where an
/// operator that is defined but leads out of the bounded set is marked `LEAVES` (-2).
/// Fails with `TooLarge` past `limit` vertices (checked during enumeration, before any table
/// is built). Cost: the enumeration is a depth-first search over left descents, memoised so
/// that every branch ends in a vertex, O(count * l(w) * n) plus the memo; the tables are
/// O(count * m * (m + log count)).
pub fn build(
    w: &[usize],
    (m, bounded_only): (usize, bool),
    limit: usize,
    job: &Job,
) -> Result<FactorizationCrystal, Error> {
    let n = w.len();
    if n > MAX_N {
        return Err(Error::invalid(format!(
            "perm must have at most {MAX_N} entries for decreasing factorizations; got {n}"
        )));
    }
    if m == 0 || m > 64 {
        return Err(Error::invalid(format!("factors must be in 1..64; got {m}")));
    }
    let factors = enumerate(w, (m, bounded_only), limit, job)?;
    let mut lowering = Vec::with_capacity(m - 1);
    let mut raising = Vec::with_capacity(m - 1);
    for r in 0..m - 1 {
        lowering.push(operator_table(
            &factors,
            (m, n, bounded_only),
            r,
            true,
            job,
        )?);
        raising.push(operator_table(
            &factors,
            (m, n, bounded_only),
            r,
            false,
            job,
        )?);
    }
    Ok(FactorizationCrystal {
        n,
        m,
        bounded_only,
        factors,
        lowering,
        raising,
    })
}

/// Index of `key` among the sorted rows, if present.
fn find(factors: &[u32], n: usize, key: &[u32]) -> Option<usize> {
    let (mut lo, mut hi) = (0, factors.len() / n);
    while lo < hi {
        let mid = lo + (hi - lo) / 2;
        match factors[mid * n..(mid + 1) * n].cmp(key) {
            std::cmp::Ordering::Less => lo = mid + 1,
            std::cmp::Ordering::Greater => hi = mid,
            std::cmp::Ordering::Equal => return Some(mid),
        }
    }
    None
}

/// The unpaired letters (as bitsets) of L and of R under the bracketing of the module docs.
pub fn unpaired(left: u32, right: u32) -> (u32, u32) {
    let (mut free_left, mut free_right) = (left, right);
    let mut rest = left;
    while rest != 0 {
        let b = rest.ilog2(); // largest remaining letter of L (0-based bit)
        rest &= !(1 << b);
        let above = free_right & !((2u32 << b).wrapping_sub(1)); // bits strictly above b
        if above != 0 {
            free_right &= !(above & above.wrapping_neg()); // the smallest of them
            free_left &= !(1 << b);
        }
    }
    (free_left, free_right)
}

/// f_r (lower) or e_r (raise) on the pair (L, R), or None where undefined. Letters are bits
/// 0..n-2; a moved letter leaving that range means the input was not a reduced factorization.
pub fn move_letter(left: u32, right: u32, lower: bool, n: usize) -> Option<(u32, u32)> {
    let (free_left, free_right) = unpaired(left, right);
    if lower {
        if free_left == 0 {
            return None;
        }
        let b = free_left.trailing_zeros();
        let mut c = b;
        while right & (1 << c) != 0 {
            c = c.checked_sub(1)?;
        }
        Some((left & !(1 << b), right | (1 << c)))
    } else {
        if free_right == 0 {
            return None;
        }
        let a = free_right.ilog2();
        let mut c = a;
        while left & (1 << c) != 0 {
            c += 1;
            if c as usize + 1 >= n {
                return None;
            }
        }
        Some((left | (1 << c), right & !(1 << a)))
    }
}

/// The table of f_{r+1} (lower) or e_{r+1} on every vertex (r 0-based).
fn operator_table(
    factors: &[u32],
    (m, n, bounded_only): (usize, usize, bool),
    r: usize,
    lower: bool,
    job: &Job,
) -> Result<Vec<i64>, Error> {
    let count = factors.len() / m;
    let target = |v: usize| -> Result<i64, Error> {
        let row = &factors[v * m..(v + 1) * m];
        let Some((left, right)) = move_letter(row[r], row[r + 1], lower, n) else {
            return Ok(-1);
        };
        let mut key = row.to_vec();
        key[r] = left;
        key[r + 1] = right;
        // only u^r and u^(r+1) changed; u^(r+1) needs letters >= r + 2 (1-based)
        if bounded_only && (left & ((1 << r) - 1) != 0 || right & ((2 << r) - 1) != 0) {
            return Ok(LEAVES);
        }
        find(factors, m, &key)
            .map(|t| i64::try_from(t).expect("fits"))
            .ok_or_else(|| {
                Error::invalid(
                    "factorization crystal: an operator left the set of factorizations \
                     (a bug in druse; please report it)",
                )
            })
    };
    let chunk = |range: std::ops::Range<usize>| -> Result<Vec<i64>, Error> {
        job.checkpoint(u64::try_from(range.len()).unwrap_or(u64::MAX))?;
        range.map(target).collect()
    };
    let step = 4096;
    let ranges: Vec<_> = (0..count)
        .step_by(step)
        .map(|s| s..(s + step).min(count))
        .collect();
    let parts: Vec<Vec<i64>> = if count >= PARALLEL_FROM {
        ranges
            .into_par_iter()
            .map(chunk)
            .collect::<Result<_, _>>()?
    } else {
        ranges.into_iter().map(chunk).collect::<Result<_, _>>()?
    };
    Ok(parts.concat())
}

#[cfg(test)]
#[path = "factorization_tests.rs"]
mod tests;
