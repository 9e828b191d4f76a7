//! Where the halves meet: `s_lambda(x_1..x_n) = sum over mu of level q of
//! s_{lambda/mu}(x_{q+1}..x_n) * s_mu(x_1..x_q)`, read off in decreasing lexicographic order.
//!
//! A term is the row `(a_n, ..., a_{q+1}, a_q, ..., a_1)` with the coefficient of `x^a`; the
//! coefficient of `x^a` is the number of tableaux of content a, which does not change when a is
//! permuted (`s_lambda` is symmetric: Macdonald, Symmetric Functions and Hall Polynomials, 2nd
//! ed., 1995, Ch. I (3.1)), so these rows with those coefficients are the terms of `s_lambda`.
//! For each top part `r = (a_n, ..., a_{q+1})`, in decreasing lexicographic order, the bottom
//! parts form one array (the sum of `T_mu[r] * B_mu` over mu), listed by decreasing rank.
#![deny(unsafe_code)]

use super::branching::PARALLEL_MIN_WORK;
use super::plan::Plan;
use super::width::{Coeff, Halt, Ticker};
use super::Exponent;
use crate::job::Job;
use rayon::prelude::*;
use std::ops::Range;

/// For each top part r, the (mu, `T_mu[r]`) with a nonzero coefficient, in compressed rows:
/// the pairs of r are `pairs[start[i]..start[i + 1]]`, i = offset of |r| plus the rank of r.
struct Buckets<C> {
    offset: Vec<usize>,
    start: Vec<usize>,
    pairs: Vec<(u32, C)>,
}

const ABSENT: usize = usize::MAX;

fn buckets<C: Coeff>(plan: &Plan, top: &[Vec<C>]) -> Buckets<C> {
    let (level, m, total) = (plan.level(plan.meet), plan.n - plan.meet, plan.total);
    let mut offset = vec![ABSENT; total + 1];
    for &size in level.sizes() {
        offset[total - size] = 0;
    }
    let mut space = 0;
    for (s, o) in offset.iter_mut().enumerate() {
        if *o != ABSENT {
            *o = space;
            space += plan.comps.len(s, m);
        }
    }
    let mut start = vec![0usize; space + 1];
    for (mu, array) in top.iter().enumerate() {
        let base = offset[total - level.size(mu)];
        for (i, c) in array.iter().enumerate() {
            start[base + i + 1] += usize::from(!c.is_zero());
        }
    }
    for i in 0..space {
        start[i + 1] += start[i];
    }
    let mut fill = start.clone();
    let mut pairs = vec![(0u32, C::zero()); start[space]];
    for (mu, array) in top.iter().enumerate() {
        let base = offset[total - level.size(mu)];
        let id = u32::try_from(mu).expect("levels hold fewer than 2^32 partitions");
        for (i, c) in array.iter().enumerate().filter(|(_, c)| !c.is_zero()) {
            pairs[fill[base + i]] = (id, c.clone());
            fill[base + i] += 1;
        }
    }
    Buckets {
        offset,
        start,
        pairs,
    }
}

/// The top parts r with a nonzero bucket, in decreasing lexicographic order: (bucket, |r|),
/// and the parts themselves, m per r.
fn top_parts<C: Coeff>(plan: &Plan, buckets: &Buckets<C>) -> (Vec<(usize, usize)>, Vec<u32>) {
    let cap = plan.comps.cap();
    let (mut found, mut parts) = (Vec::new(), Vec::new());
    let mut visit = |top: &[u32], sum: usize| {
        let base = buckets.offset[sum];
        if base == ABSENT {
            return;
        }
        let at = base + plan.comps.rank(top);
        if buckets.start[at + 1] > buckets.start[at] {
            found.push((at, sum));
            parts.extend_from_slice(top);
        }
    };
    let mut top = vec![0u32; plan.n - plan.meet];
    descend(&mut top, 0, 0, plan.total, cap, plan.meet * cap, &mut visit);
    (found, parts)
}

/// Visits the compositions r (m parts of at most cap, sum at most total, leaving at most
/// `room` for the bottom parts) in decreasing lexicographic order.
fn descend(
    r: &mut [u32],
    i: usize,
    sum: usize,
    total: usize,
    cap: usize,
    room: usize,
    visit: &mut impl FnMut(&[u32], usize),
) {
    if i == r.len() {
        visit(r, sum);
        return;
    }
    let later = cap * (r.len() - i - 1) + room; // what parts after i and the bottom can take
    let hi = cap.min(total - sum);
    let lo = (total - sum).saturating_sub(later);
    for v in (lo..=hi).rev() {
        r[i] = u32::try_from(v).expect("parts are at most lambda_1, a u32");
        descend(r, i + 1, sum + v, total, cap, room, visit);
    }
}

/// The terms: exponent rows (n each) and coefficients, in decreasing lexicographic order.
pub(crate) fn combine<C: Coeff, E: Exponent>(
    plan: &Plan,
    bottom: &[Vec<C>],
    top: Vec<Vec<C>>,
    job: &Job,
) -> Result<(Vec<E>, Vec<C>), Halt> {
    let b = buckets(plan, &top);
    drop(top);
    let (found, parts) = top_parts(plan, &b);
    let runs = split_runs(plan, &found);
    let sums = sum_runs(plan, &found, &runs, &b, bottom, job)?;
    drop(b);
    list_rows(plan, &found, &parts, &runs, &sums, job)
}

/// Consecutive top parts in runs of about `PARALLEL_MIN_WORK` coefficients: the units of work
/// for the threads.
fn split_runs(plan: &Plan, found: &[(usize, usize)]) -> Vec<Range<usize>> {
    let (q, total) = (plan.meet, plan.total);
    let mut runs = Vec::new();
    let (mut from, mut size) = (0, 0u64);
    for (t, &(_, sum)) in found.iter().enumerate() {
        size += plan.comps.count(total - sum, q);
        if size >= PARALLEL_MIN_WORK || t + 1 == found.len() {
            runs.push(from..t + 1);
            (from, size) = (t + 1, 0);
        }
    }
    runs
}

/// For each run, the bottom arrays of its top parts (concatenated) and how many are nonzero.
fn sum_runs<C: Coeff>(
    plan: &Plan,
    found: &[(usize, usize)],
    runs: &[Range<usize>],
    b: &Buckets<C>,
    bottom: &[Vec<C>],
    job: &Job,
) -> Result<Vec<(Vec<C>, usize)>, Halt> {
    let (q, total) = (plan.meet, plan.total);
    runs.par_iter()
        .map(|run| {
            let mut ticker = Ticker::default();
            let mut values = Vec::new();
            for &(i, sum) in &found[run.clone()] {
                let at = values.len();
                values.resize(at + plan.comps.len(total - sum, q), C::zero());
                let block = &mut values[at..];
                for (mu, c) in &b.pairs[b.start[i]..b.start[i + 1]] {
                    let src = &bottom[*mu as usize];
                    let over = if c.is_one() {
                        C::add_slice(block, src)
                    } else {
                        C::mul_add_slice(block, src, c)
                    };
                    if over {
                        return Err(Halt::Overflow);
                    }
                    ticker.tick(job, src.len())?;
                }
            }
            let nonzero = values.iter().filter(|c| !c.is_zero()).count();
            Ok((values, nonzero))
        })
        .collect()
}

/// Writes the nonzero coefficients and their exponent rows, each run into its own slice of the
/// output, so that threads never share a vector and the order is fixed.
fn list_rows<C: Coeff, E: Exponent>(
    plan: &Plan,
    found: &[(usize, usize)],
    parts: &[u32],
    runs: &[Range<usize>],
    sums: &[(Vec<C>, usize)],
    job: &Job,
) -> Result<(Vec<E>, Vec<C>), Halt> {
    let (n, q, total) = (plan.n, plan.meet, plan.total);
    let terms: usize = sums.iter().map(|s| s.1).sum();
    let mut exps = vec![E::default(); terms * n];
    let mut coeffs = vec![C::zero(); terms];
    let mut chunks = Vec::with_capacity(runs.len());
    let (mut exp_rest, mut coeff_rest) = (exps.as_mut_slice(), coeffs.as_mut_slice());
    for (run, (values, nonzero)) in runs.iter().zip(sums) {
        let (ex, et) = exp_rest.split_at_mut(nonzero * n);
        let (cx, ct) = coeff_rest.split_at_mut(*nonzero);
        chunks.push((run.clone(), values, ex, cx));
        (exp_rest, coeff_rest) = (et, ct);
    }
    chunks
        .into_par_iter()
        .try_for_each(|(run, values, ex, cx)| {
            let (mut at, mut t) = (0, 0);
            for index in run {
                let sum = found[index].1;
                let mut stack = parts[index * (n - q)..(index + 1) * (n - q)].to_vec();
                let block = &values[at..at + plan.comps.len(total - sum, q)];
                plan.comps
                    .walk_descending(total - sum, q, 0, &mut stack, &mut |rank, row| {
                        if !block[rank].is_zero() {
                            for (slot, &e) in ex[t * n..(t + 1) * n].iter_mut().zip(row) {
                                *slot = E::from(e);
                            }
                            cx[t] = block[rank].clone();
                            t += 1;
                        }
                    });
                at += block.len();
            }
            job.checkpoint(at as u64).map_err(Halt::from)
        })?;
    Ok((exps, coeffs))
}
