//! The key expansion of S_w from the Demazure pieces of the crystal on pipe dreams.
//!
//! The pipe dreams of w are the bounded decreasing factorizations; inside each component
//! B(lambda) of the crystal on all of them they form a Demazure crystal B_v(lambda)
//! (Assaf-Schilling, "A Demazure crystal construction for Schubert polynomials", 2018), whose
//! character is key(v.lambda). This is checked, not assumed, using only the table truncated to
//! the pipe dreams with `LEAVES` marks (so the much larger whole crystal is never built):
//! 1. strings: no e_i leads out (Demazure crystals are closed under e_i), and no pipe dream
//!    inside an i-string (e_i defined) has an f_i leading out: a Demazure crystal meets each
//!    i-string in nothing, all of it, or its top (Kashiwara 1993, Prop. 3.3.5);
//! 2. each component's extremal weight with the most inversions, alpha, is unique, and the
//!    Demazure closure of the shortest v with v.lambda = alpha, computed from the top one letter
//!    at a time, never follows an f_i out of the pipe dreams and fills the component.
#![deny(unsafe_code)]

use super::{FactorizationCrystal, LEAVES};
use crate::crystal;
use crate::error::Error;
use crate::job::Job;
use crate::perm;
use std::collections::BTreeMap;

/// A key expansion: (composition, multiplicity) pairs, compositions ascending.
pub type KeyExpansion = Vec<(Vec<i32>, u64)>;

fn broken(what: &str) -> Error {
    Error::invalid(format!(
        "the pipe dreams are not a union of Demazure crystals: {what} (a bug in druse; please \
         report it)"
    ))
}

/// Inversions of a composition: pairs j < k with alpha_j < alpha_k.
fn inversions(alpha: &[i32]) -> usize {
    (0..alpha.len())
        .map(|j| {
            (j + 1..alpha.len())
                .filter(|&k| alpha[j] < alpha[k])
                .count()
        })
        .sum()
}

/// The shortest v with v.lambda = alpha, (v.lambda)_{v(j)} = lambda_j, 0-based one-line.
fn shortest_perm(alpha: &[i32]) -> Vec<usize> {
    let mut order: Vec<usize> = (0..alpha.len()).collect();
    order.sort_by_key(|&p| (std::cmp::Reverse(alpha[p]), p));
    order
}

/// Key compositions with their multiplicities, from a table built with `bounded_only`.
/// Cost: O(count * m) for the checks and the components, plus one closure per component,
/// O(component * l(v)).
pub fn pipe_dream_keys(c: &FactorizationCrystal, job: &Job) -> Result<KeyExpansion, Error> {
    if !c.bounded_only {
        return Err(Error::invalid(
            "pipe_dream_keys needs the table truncated to pipe dreams",
        ));
    }
    let (count, m) = (c.count(), c.m);
    for (f, e) in c.lowering.iter().zip(&c.raising) {
        if e.contains(&LEAVES) {
            return Err(broken("an e_i leaves them"));
        }
        if (0..count).any(|v| e[v] >= 0 && f[v] == LEAVES) {
            return Err(broken("an i-string is cut"));
        }
    }
    let weights = c.weights();
    let f: Vec<&[i64]> = c.lowering.iter().map(Vec::as_slice).collect();
    let labels = crystal::components(&f, count);
    let mut sizes: BTreeMap<i64, usize> = BTreeMap::new();
    for &label in &labels {
        *sizes.entry(label).or_default() += 1;
    }
    let mut best: BTreeMap<i64, (usize, usize, bool)> = BTreeMap::new(); // inversions, vertex, tie
    let mut keys: BTreeMap<Vec<i32>, u64> = BTreeMap::new();
    let tops: Vec<usize> = (0..count)
        .filter(|&v| c.raising.iter().all(|e| e[v] == -1))
        .collect();
    let lambda_of: BTreeMap<i64, Vec<i32>> = tops
        .iter()
        .map(|&t| (labels[t], weights[t * m..(t + 1) * m].to_vec()))
        .collect();
    if lambda_of.len() != tops.len() {
        return Err(broken("a component has two highest weight vertices"));
    }
    for v in 0..count {
        let wt = &weights[v * m..(v + 1) * m];
        let lam = &lambda_of[&labels[v]];
        let mut sorted = wt.to_vec();
        sorted.sort_unstable_by(|a, b| b.cmp(a));
        if sorted == *lam {
            let k = inversions(wt);
            let entry = best.entry(labels[v]).or_insert((k, v, false));
            if k > entry.0 {
                *entry = (k, v, false);
            } else if k == entry.0 && v != entry.1 {
                entry.2 = true;
            }
        }
    }
    for &top in &tops {
        job.checkpoint(1)?;
        let (_, extremal, tie) = best[&labels[top]];
        if tie {
            return Err(broken("two longest extremal weights in a component"));
        }
        let alpha = &weights[extremal * m..(extremal + 1) * m];
        let filled = closure_size(c, top, &perm::reduced_word(&shortest_perm(alpha)))?;
        if filled != sizes[&labels[top]] {
            return Err(broken("a Demazure closure does not fill its component"));
        }
        *keys.entry(alpha.to_vec()).or_default() += 1;
    }
    Ok(keys.into_iter().collect())
}

/// |D_{i1}(... D_{ik}({top}))| for a 0-based word, failing if an f_i it follows leaves.
fn closure_size(c: &FactorizationCrystal, top: usize, word: &[usize]) -> Result<usize, Error> {
    let mut inside = vec![false; c.count()];
    inside[top] = true;
    let mut members = vec![top];
    for &i in word.iter().rev() {
        let f = &c.lowering[i];
        let mut k = 0;
        while k < members.len() {
            let t = f[members[k]];
            if t == LEAVES {
                return Err(broken("a Demazure closure leaves the pipe dreams"));
            }
            if let Ok(t) = usize::try_from(t) {
                if !inside[t] {
                    inside[t] = true;
                    members.push(t);
                }
            }
            k += 1;
        }
    }
    Ok(members.len())
}

/// The permutation of rank `rank` in the lexicographic order of S_n (0-based one-line), read
/// from the factorial-base digits of the rank (the Lehmer code).
fn unrank(n: usize, mut rank: usize) -> Vec<usize> {
    let mut left: Vec<usize> = (0..n).collect();
    let mut radix: usize = (1..n).product();
    let mut out = Vec::with_capacity(n);
    for k in (1..=n).rev() {
        let digit = rank / radix;
        rank %= radix;
        out.push(left.remove(digit));
        if k > 1 {
            radix /= k - 1;
        }
    }
    out
}

/// Largest n for the whole-S_n batch (12! permutations).
pub const MAX_BATCH_N: usize = 12;

/// `pipe_dream_keys` of the permutations of ranks start..start+count in the lexicographic
/// order of S_n, in that order (in parallel; each result is computed independently).
pub fn keys_of_ranks(
    n: usize,
    (start, count): (usize, usize),
    limit: usize,
    job: &Job,
) -> Result<Vec<KeyExpansion>, Error> {
    use rayon::prelude::*;
    if !(1..=MAX_BATCH_N).contains(&n) {
        return Err(Error::invalid(format!(
            "n must be in 1..{MAX_BATCH_N}; got {n}"
        )));
    }
    let total = perm::factorial(n, usize::MAX)?;
    if start.checked_add(count).is_none_or(|end| end > total) {
        return Err(Error::invalid(format!(
            "the ranks {start}..{start}+{count} must lie in 0..{total} (n! for n = {n})"
        )));
    }
    (start..start + count)
        .into_par_iter()
        .map(|rank| {
            let w = unrank(n, rank);
            let c = super::build(&w, (n, true), limit, job)?;
            pipe_dream_keys(&c, job)
        })
        .collect()
}
