//! The two halves of the branching recursion for `s_lambda(x_1..x_n)`, on dense arrays.
//!
//! Bottom half: the array of `s_mu(x_1..x_k)` holds the coefficient of `x^a` at `rank(a)` among
//! the compositions of `|mu|` into k parts of at most `lambda_1` (see `compositions`). By the
//! branching rule `s_nu(x_1..x_k) = sum of x_k^{|nu/mu|} s_mu(x_1..x_{k-1})` over `nu/mu` a
//! horizontal strip, the array of nu is, block by block (block e = compositions with
//! `a_k = e`), the sum of the arrays of the mu with `|nu/mu| = e`: additions of contiguous
//! slices.
//!
//! Top half: the same rule read from the other end gives the skew Schur polynomials
//! `s_{lambda/mu}(x_{k+1}..x_n) = sum of x_{k+1}^{|nu/mu|} s_{lambda/nu}(x_{k+2}..x_n)` over
//! `nu/mu` a horizontal strip, nu in level k + 1. Their arrays list the exponents as
//! `(a_n, ..., a_{k+1})`, so that the new variable `x_{k+1}` is again the last, most significant
//! one and each term is again one block.
#![deny(unsafe_code)]

use super::compositions::Compositions;
use super::plan::Plan;
use super::width::{Coeff, Halt, Ticker};
use crate::job::Job;
use rayon::prelude::*;

/// Below this many coefficient operations, threads cost more than they save.
pub(crate) const PARALLEL_MIN_WORK: u64 = 1 << 15;
/// Entries summed per pass over the sources: the destination tile stays in cache meanwhile.
const TILE: usize = 1 << 12;

/// The arrays of `s_mu(x_1..x_q)` for every mu of the meeting level q, in id order.
pub(crate) fn bottom_half<C: Coeff>(plan: &Plan, job: &Job) -> Result<Vec<Vec<C>>, Halt> {
    let mut arrays = vec![vec![C::one()]; plan.level(1).len()]; // s_(m)(x_1) = x_1^m
    let mut sources = Vec::new();
    for k in 2..=plan.meet {
        let (level, below) = (plan.level(k), plan.level(k - 1));
        let one = |id: usize, sources: &mut Vec<(usize, usize)>| {
            sources.clear();
            below.strip_sources(level.partition(id), sources);
            let d = level.size(id);
            for source in sources.iter_mut() {
                source.1 = d - source.1; // (mu, |nu/mu|)
            }
            build_array(&plan.comps, d, k, sources, &arrays, job)
        };
        arrays = each(level.len(), plan.sizes.bottom[k], &mut sources, one)?;
    }
    Ok(arrays)
}

/// The arrays of `s_{lambda/mu}(x_{q+1}..x_n)` for every mu of the meeting level q, in id order.
pub(crate) fn top_half<C: Coeff>(plan: &Plan, job: &Job) -> Result<Vec<Vec<C>>, Halt> {
    let (n, total) = (plan.n, plan.total);
    let mut arrays = vec![vec![C::one()]]; // level n is lambda alone: s_{lambda/lambda} = 1
    let mut sources = Vec::new();
    for k in (plan.meet..n).rev() {
        let (level, above) = (plan.level(k), plan.level(k + 1));
        let one = |id: usize, sources: &mut Vec<(usize, usize)>| {
            sources.clear();
            above.strip_supersets(level.partition(id), sources);
            let size = level.size(id);
            for source in sources.iter_mut() {
                source.1 -= size; // (nu, |nu/mu|)
            }
            build_array(&plan.comps, total - size, n - k, sources, &arrays, job)
        };
        arrays = each(level.len(), plan.sizes.top[k], &mut sources, one)?;
    }
    Ok(arrays)
}

/// `build(id)` for ids 0..count in order, on threads if the level is large.
fn each<C: Coeff>(
    count: usize,
    entries: u64,
    scratch: &mut Vec<(usize, usize)>,
    build: impl Fn(usize, &mut Vec<(usize, usize)>) -> Result<Vec<C>, Halt> + Sync,
) -> Result<Vec<Vec<C>>, Halt> {
    if entries >= PARALLEL_MIN_WORK {
        (0..count)
            .into_par_iter()
            .map_init(Vec::new, |s, id| build(id, s))
            .collect()
    } else {
        (0..count).map(|id| build(id, scratch)).collect()
    }
}

/// The array of degree d in p variables whose block e is the sum of `arrays[id]` over the
/// `(id, e)` in `sources` (each of degree d - e in p - 1 variables).
fn build_array<C: Coeff>(
    comps: &Compositions,
    d: usize,
    p: usize,
    sources: &mut [(usize, usize)],
    arrays: &[Vec<C>],
    job: &Job,
) -> Result<Vec<C>, Halt> {
    sources.sort_unstable_by_key(|&(_, e)| e);
    let mut array = vec![C::zero(); comps.len(d, p)];
    // One (block, its sources) per distinct e, cut from the array in order.
    let mut blocks = Vec::new();
    let (mut rest, mut cut) = (array.as_mut_slice(), 0);
    let mut work = 0u64;
    for group in sources.chunk_by(|a, b| a.1 == b.1) {
        let e = group[0].1;
        let start = comps.block_start(d, p, e);
        let (_, tail) = rest.split_at_mut(start - cut);
        let (block, tail) = tail.split_at_mut(comps.len(d - e, p - 1));
        cut = start + block.len();
        rest = tail;
        let srcs: Vec<&[C]> = group.iter().map(|&(id, _)| arrays[id].as_slice()).collect();
        work += (block.len() * srcs.len()) as u64;
        blocks.push((block, srcs));
    }
    if work >= PARALLEL_MIN_WORK {
        blocks
            .into_par_iter()
            .try_for_each(|(block, srcs)| add_all(block, &srcs, job))?;
    } else {
        blocks
            .into_iter()
            .try_for_each(|(block, srcs)| add_all(block, &srcs, job))?;
    }
    Ok(array)
}

/// block += every source, tile by tile so that the block is read and written once.
fn add_all<C: Coeff>(block: &mut [C], sources: &[&[C]], job: &Job) -> Result<(), Halt> {
    let mut ticker = Ticker::default();
    for start in (0..block.len()).step_by(TILE) {
        let end = (start + TILE).min(block.len());
        let tile = &mut block[start..end];
        let mut over = false;
        for src in sources {
            over |= C::add_slice(tile, &src[start..end]);
        }
        if over {
            return Err(Halt::Overflow);
        }
        ticker.tick(job, (end - start) * sources.len())?;
    }
    Ok(())
}
