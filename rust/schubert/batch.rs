//! Every Schubert polynomial of S_n, top down: S_(w0) = x_1^(n-1) ... x_(n-1), then level by
//! level in decreasing length S_w = d_i S_(w s_i) for the first ascent i of w (w(i) < w(i+1),
//! so l(w s_i) = l(w) + 1). This is the definition itself (Lascoux and Schutzenberger,
//! "Polynomes de Schubert", 1982; Macdonald, Notes on Schubert Polynomials, 1991, (4.1)), with
//! one divided difference of `poly` per permutation; each is computed from a parent on the
//! level above, so a level runs in parallel and the result does not depend on the schedule.
#![deny(unsafe_code)]

use super::longest_monomial;
use crate::error::Error;
use crate::job::Job;
use crate::perm;
use crate::poly::{self, CoeffVec, Operator, Terms};
use rayon::prelude::*;

/// Number of terms of all S_w, w in S_n, summed (measured with this module, n = 0..=8; the
/// ratios grow, 14.6, 21.6, 30.5, so extrapolating by the last one underestimates).
const TOTAL_TERMS: [u128; 9] = [1, 1, 2, 7, 41, 388, 5685, 123_013, 3_755_349];

/// Largest n for which the batch is considered at all (S_13 alone has 6.2e9 permutations).
pub const MAX_BATCH_N: usize = 12;

/// Estimated peak bytes for all S_w of S_n: the terms held in Rust (n int64 exponents and an
/// i128 coefficient each), the arrays handed over, and Python's copies. Beyond the table, the
/// last measured growth ratio is applied per step; None past `MAX_BATCH_N`.
pub fn estimated_batch_bytes(n: usize) -> Option<u128> {
    if n > MAX_BATCH_N {
        return None;
    }
    let last = TOTAL_TERMS.len() - 1;
    let mut terms = TOTAL_TERMS[n.min(last)];
    for _ in last..n {
        terms = terms * TOTAL_TERMS[last] / TOTAL_TERMS[last - 1];
    }
    let per_term = 32 * (n as u128) + 64;
    Some(terms * per_term + 256 * perm::factorial(n, usize::MAX).ok()? as u128)
}

/// The state of a batch: every permutation in lexicographic order, the order of computation
/// (levels of decreasing length, lexicographic within a level) and the polynomials so far.
pub struct AllSchuberts {
    n: usize,
    /// Positions (lexicographic ranks) in computation order.
    order: Vec<usize>,
    /// For each permutation, where its level ends in `order`.
    level_end: Vec<usize>,
    /// For each rank: the rank of its parent w s_i and the 0-based letter i (none for w0).
    parent: Vec<Option<(usize, usize)>>,
    polys: Vec<Option<Terms>>,
    done: usize,
}

impl AllSchuberts {
    /// Sets up the batch for S_n, refusing it with `TooLarge` past `budget` bytes (estimated).
    pub fn new(n: usize, budget: u128) -> Result<AllSchuberts, Error> {
        let estimate = estimated_batch_bytes(n);
        if estimate.is_none_or(|bytes| bytes > budget) {
            let bytes = estimate.unwrap_or(u128::MAX);
            return Err(Error::TooLarge {
                what: format!("every Schubert polynomial of S_{n}"),
                bytes,
                instead: "compute single ones with schubert(perm), or take a smaller n".into(),
            });
        }
        let perms = perm::all_perms(n, usize::MAX)?;
        let lengths: Vec<usize> = perms.iter().map(|w| perm::length(w)).collect();
        let top = n * n.saturating_sub(1) / 2;
        let mut order: Vec<usize> = (0..perms.len()).collect();
        // stable: lexicographic within a level
        order.sort_by_key(|&k| top - lengths[k]);
        let mut level_end = vec![0; perms.len()];
        let mut start = 0;
        while start < order.len() {
            let len = lengths[order[start]];
            let end = start + order[start..].partition_point(|&k| lengths[k] == len);
            for &k in &order[start..end] {
                level_end[k] = end;
            }
            start = end;
        }
        let parent = perms
            .iter()
            .map(|w| {
                let i = (0..n.saturating_sub(1)).find(|&i| w[i] < w[i + 1])?;
                let mut up = w.clone();
                up.swap(i, i + 1);
                Some((perm::lex_rank(&up), i))
            })
            .collect();
        Ok(AllSchuberts {
            n,
            order,
            level_end,
            parent,
            polys: vec![None; perms.len()],
            done: 0,
        })
    }

    /// n! (the number of polynomials).
    pub fn total(&self) -> usize {
        self.order.len()
    }

    pub fn done(&self) -> usize {
        self.done
    }

    /// Computes `count` more polynomials (at least one, fewer at the end), level by level;
    /// returns how many are done in all.
    pub fn advance(&mut self, count: usize, job: &Job) -> Result<usize, Error> {
        let target = self.done.saturating_add(count.max(1)).min(self.total());
        while self.done < target {
            self.advance_within_level(target - self.done, job)?;
        }
        Ok(self.done)
    }

    /// Up to `count` more polynomials, never past the end of the current level (so every
    /// parent is ready), in parallel when the chunk is wide.
    fn advance_within_level(&mut self, count: usize, job: &Job) -> Result<(), Error> {
        let start = self.done;
        let end = (start + count).min(self.level_end[self.order[start]]);
        let chunk = &self.order[start..end];
        let polys = &self.polys;
        let parent = &self.parent;
        let n = self.n;
        let compute = |&k: &usize| -> Result<Terms, Error> {
            let Some((up, i)) = parent[k] else {
                return Ok(Terms::monomial(&longest_monomial(n)));
            };
            let f = polys[up].as_ref().expect("levels run top down");
            let out = poly::apply_operator(f, Operator::Divided, i + 1, job)?;
            job.checkpoint(1)?;
            Ok(out)
        };
        let results: Vec<Terms> = if chunk.len() >= 64 {
            chunk
                .par_iter()
                .with_min_len(16)
                .map(compute)
                .collect::<Result<_, _>>()?
        } else {
            chunk.iter().map(compute).collect::<Result<_, _>>()?
        };
        for (&k, f) in chunk.iter().zip(results) {
            self.polys[k] = Some(f);
        }
        self.done = end;
        Ok(())
    }

    /// Every polynomial in lexicographic order of the permutations, concatenated: exponent
    /// rows (terms x n), coefficients, and offsets (n! + 1 of them) into both.
    pub fn collect(&self) -> Result<(Vec<i64>, CoeffVec, Vec<i64>), Error> {
        if self.done < self.total() {
            return Err(Error::invalid(format!(
                "the batch is not finished: {} of {} polynomials done",
                self.done,
                self.total()
            )));
        }
        let polys: Vec<&Terms> = self.polys.iter().flatten().collect();
        let terms: usize = polys.iter().map(|f| f.len()).sum();
        let mut exps = Vec::with_capacity(terms * self.n);
        let mut offsets = Vec::with_capacity(polys.len() + 1);
        offsets.push(0i64);
        let big = polys.iter().any(|f| matches!(f.coeffs, CoeffVec::Big(_)));
        let (mut small, mut wide) = (Vec::new(), Vec::new());
        for f in polys {
            exps.extend_from_slice(&f.exps);
            match (&f.coeffs, big) {
                (CoeffVec::Small(c), false) => small.extend_from_slice(c),
                (c, _) => wide.extend(c.to_big()),
            }
            let last = *offsets.last().expect("starts with 0");
            offsets.push(last + i64::try_from(f.len()).expect("fewer than 2^63 terms"));
        }
        let coeffs = if big {
            CoeffVec::Big(wide)
        } else {
            CoeffVec::Small(small)
        };
        Ok((exps, coeffs, offsets))
    }
}
