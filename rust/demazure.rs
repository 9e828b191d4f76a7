//! Demazure crystals and atoms as vertex subsets of any crystal table, on bitsets (u64 words,
//! bit v of word v / 64 is vertex v).
//!
//! D_i(X) = {f_i^k x : x in X, k >= 0}. For a word (i1, ..., ik) the Demazure crystal is
//! D_{i1}(... D_{ik}(X0) ...), D_{ik} applied first, with X0 = {u_lambda} for B(lambda)
//! (Kashiwara, "The crystal base and Littelmann's refined Demazure character formula", 1993;
//! Littelmann, "Crystal graphs and Young tableaux", 1995). Only the f_i arrays are read.
//! For a reduced word of w the result depends on w only; for any word it is the Demazure
//! crystal of the word's Demazure (0-Hecke) product, because D_i D_i = D_i.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use crate::perm;
use rayon::prelude::*;
use std::sync::atomic::{AtomicU64, Ordering};

/// Masks with at least this many vertices close with several threads.
const PARALLEL_FROM: usize = 1 << 16;
/// Vertices per rayon task in a parallel closure.
const TASK_VERTICES: usize = 1 << 14;
/// Largest symmetric group the batch form accepts (10! = 3628800 masks).
const MAX_GROUP: usize = 3_628_800;

/// Number of u64 words of a mask over `count` vertices.
pub fn words(count: usize) -> usize {
    count.div_ceil(64)
}

/// The bitset of the given vertices (each checked to lie in 0..count).
pub fn mask_of(vertices: &[i64], count: usize) -> Result<Vec<u64>, Error> {
    let mut bits = vec![0u64; words(count)];
    for &v in vertices {
        match usize::try_from(v) {
            Ok(v) if v < count => bits[v / 64] |= 1 << (v % 64),
            _ => {
                return Err(Error::invalid(format!(
                    "start vertices must be in 0..{count}; got {v}"
                )))
            }
        }
    }
    Ok(bits)
}

/// The bitset of a boolean mask.
pub fn pack(mask: &[bool]) -> Vec<u64> {
    let mut bits = vec![0u64; words(mask.len())];
    for (v, _) in mask.iter().enumerate().filter(|&(_, &b)| b) {
        bits[v / 64] |= 1 << (v % 64);
    }
    bits
}

/// A bitset as one bool per vertex.
pub fn unpack(bits: &[u64], count: usize) -> Vec<bool> {
    (0..count)
        .map(|v| bits[v / 64] >> (v % 64) & 1 == 1)
        .collect()
}

/// Set vertices of word `k` of a bitset, ascending.
fn members(word: u64, k: usize) -> impl Iterator<Item = usize> {
    let mut rest = word;
    std::iter::from_fn(move || {
        (rest != 0).then(|| {
            let b = rest.trailing_zeros() as usize;
            rest &= rest - 1;
            k * 64 + b
        })
    })
}

/// D_i(X) for X = `bits`, f_i = `f` (checked by `crystal::check_arrays`).
///
/// Each member walks down its f_i-string and stops at the first vertex already in the result,
/// so every vertex is set once and a walk never repeats another's: O(|D_i(X)| + N/64). The walk
/// also stops on arrays that are not partial bijections or contain cycles, so it always ends.
pub fn close_one(bits: &[u64], f: &[i64]) -> Vec<u64> {
    if f.len() < PARALLEL_FROM {
        let mut out = bits.to_vec();
        for (k, &w) in bits.iter().enumerate() {
            for v in members(w, k) {
                let mut t = f[v];
                while let Ok(u) = usize::try_from(t) {
                    let bit = 1u64 << (u % 64);
                    if out[u / 64] & bit != 0 {
                        break;
                    }
                    out[u / 64] |= bit;
                    t = f[u];
                }
            }
        }
        return out;
    }
    // Several threads set bits with fetch_or; OR commutes, so the result does not depend on
    // the schedule. The thread whose fetch_or set a bit is the one that walks on from it.
    let out: Vec<AtomicU64> = bits.iter().map(|&w| AtomicU64::new(w)).collect();
    bits.par_chunks(TASK_VERTICES / 64)
        .enumerate()
        .for_each(|(c, chunk)| {
            for (j, &w) in chunk.iter().enumerate() {
                for v in members(w, c * (TASK_VERTICES / 64) + j) {
                    let mut t = f[v];
                    while let Ok(u) = usize::try_from(t) {
                        let bit = 1u64 << (u % 64);
                        if out[u / 64].fetch_or(bit, Ordering::Relaxed) & bit != 0 {
                            break;
                        }
                        t = f[u];
                    }
                }
            }
        });
    out.into_iter().map(AtomicU64::into_inner).collect()
}

/// D_{i1}(... D_{ik}(start) ...) for a word of 0-based letters (letter i acts by f[i]).
pub fn closure(f: &[&[i64]], start: &[u64], word: &[usize], job: &Job) -> Result<Vec<u64>, Error> {
    check_letters(word, f.len())?;
    let mut bits = start.to_vec();
    for &i in word.iter().rev() {
        job.checkpoint(f[i].len() as u64)?;
        bits = close_one(&bits, f[i]);
    }
    Ok(bits)
}

fn check_letters(word: &[usize], ops: usize) -> Result<(), Error> {
    match word.iter().find(|&&i| i >= ops) {
        Some(i) => Err(Error::invalid(format!(
            "word letters must be in 1..{ops}; got {}",
            i + 1
        ))),
        None => Ok(()),
    }
}

/// The Demazure crystal of every w in S_n (n = f.len() + 1), in lexicographic order of the
/// one-line notation of w. Masks are built along a tree: for w != id with smallest left
/// descent i (value i+1 left of value i), w = s_i (s_i w) with l(s_i w) = l(w) - 1, so
/// mask(w) = D_i(mask(s_i w)) by one closure step. Lengths are done level by level, each level
/// in parallel, so the output is deterministic. Cost: n! closure steps.
pub fn all_masks(f: &[&[i64]], start: &[u64], job: &Job) -> Result<Vec<Vec<u64>>, Error> {
    let n = f.len() + 1;
    let perms = perm::all_perms(n, MAX_GROUP)?;
    let bytes = (perms.len() as u128) * (start.len() as u128) * 8;
    if bytes > 1 << 33 {
        return Err(Error::TooLarge {
            what: format!("the {} Demazure masks of S_{n}", perms.len()),
            bytes,
            instead: "ask for single masks with demazure_mask_of".into(),
        });
    }
    let mut levels: Vec<Vec<usize>> = Vec::new();
    for (r, w) in perms.iter().enumerate() {
        let l = perm::length(w);
        if levels.len() <= l {
            levels.resize(l + 1, Vec::new());
        }
        levels[l].push(r);
    }
    let mut masks: Vec<Vec<u64>> = vec![Vec::new(); perms.len()];
    masks[0] = start.to_vec();
    for level in levels.iter().skip(1) {
        let made: Vec<(usize, Vec<u64>)> = level
            .par_iter()
            .map(|&r| {
                job.checkpoint(1)?;
                let (i, parent) = left_descent_parent(&perms[r]);
                Ok((r, close_one(&masks[perm::lex_rank(&parent)], f[i])))
            })
            .collect::<Result<_, Error>>()?;
        for (r, m) in made {
            masks[r] = m;
        }
    }
    Ok(masks)
}

/// For w != id: its smallest left descent i (0-based) and s_i w.
fn left_descent_parent(w: &[usize]) -> (usize, Vec<usize>) {
    let mut pos = vec![0; w.len()];
    for (p, &x) in w.iter().enumerate() {
        pos[x] = p;
    }
    let i = (0..w.len() - 1)
        .find(|&i| pos[i] > pos[i + 1])
        .expect("w is not the identity");
    let parent = w
        .iter()
        .map(|&x| match x {
            x if x == i => i + 1,
            x if x == i + 1 => i,
            x => x,
        })
        .collect();
    (i, parent)
}

/// The Demazure atom of w: mask(w) minus the masks of the w t (t a transposition) with
/// l(w t) = l(w) - 1. Those are the elements w covers in Bruhat order, and every v < w lies
/// below one of them (chain property, Bjorner-Brenti 2005, Thm. 2.2.6), while v <= u gives
/// mask(v) within mask(u) (subword property, Thm. 2.2.2, as D_i is monotone and D_i(X) >= X);
/// so this is mask(w) minus the union over all v < w (Lascoux-Schutzenberger, "Keys and
/// standard bases", 1990; Mason, "An explicit construction of type A Demazure atoms", 2009).
pub fn atom(f: &[&[i64]], start: &[u64], w: &[usize], job: &Job) -> Result<Vec<u64>, Error> {
    if w.len() != f.len() + 1 {
        return Err(Error::invalid(format!(
            "the permutation must have n = {} entries; got {}",
            f.len() + 1,
            w.len()
        )));
    }
    let mut bits = closure(f, start, &perm::reduced_word(w), job)?;
    let l = perm::length(w);
    for a in 0..w.len() {
        for b in a + 1..w.len() {
            let mut v = w.to_vec();
            v.swap(a, b);
            if perm::length(&v) + 1 == l {
                let below = closure(f, start, &perm::reduced_word(&v), job)?;
                bits.iter_mut().zip(&below).for_each(|(x, y)| *x &= !y);
            }
        }
    }
    Ok(bits)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// B(1) of GL_3: 0 -f1-> 1 -f2-> 2 (the standard crystal, Kashiwara-Nakashima 1994).
    fn standard() -> (Vec<i64>, Vec<i64>) {
        (vec![1, -1, -1], vec![-1, 2, -1])
    }

    #[test]
    fn closures_of_the_standard_crystal() {
        let (f1, f2) = standard();
        let f: [&[i64]; 2] = [&f1, &f2];
        let start = mask_of(&[0], 3).unwrap();
        let job = Job::default();
        let m = |word: &[usize]| unpack(&closure(&f, &start, word, &job).unwrap(), 3);
        assert_eq!(m(&[]), vec![true, false, false]);
        assert_eq!(m(&[1]), vec![true, false, false]);
        assert_eq!(m(&[0]), vec![true, true, false]);
        assert_eq!(m(&[1, 0]), vec![true, true, true]);
        assert_eq!(m(&[0, 1]), vec![true, true, false]);
        let all = all_masks(&f, &start, &job).unwrap();
        assert_eq!(all.len(), 6);
        assert_eq!(unpack(&all[5], 3), vec![true; 3]);
        // w = (3,1,2): w.lambda = (0,0,1), whose atom is x3 alone
        let a = atom(&f, &start, &[2, 0, 1], &job).unwrap();
        assert_eq!(unpack(&a, 3), vec![false, false, true]);
        // w = (2,3,1) is not a minimal coset representative of lambda = (1,0,0): empty atom
        let a = atom(&f, &start, &[1, 2, 0], &job).unwrap();
        assert_eq!(unpack(&a, 3), vec![false; 3]);
        assert!(closure(&f, &start, &[2], &job).is_err());
    }

    #[test]
    fn walks_end_on_cycles_and_large_masks() {
        let f = vec![1, 2, 1]; // not injective, with a cycle: the walk must still end
        assert_eq!(
            unpack(&close_one(&pack(&[true, false, false]), &f), 3),
            [true; 3]
        );
        let big = PARALLEL_FROM + 5;
        let top = i64::try_from(big).unwrap();
        let chain: Vec<i64> = (1..=top).map(|t| if t < top { t } else { -1 }).collect();
        let out = close_one(&mask_of(&[0], big).unwrap(), &chain);
        assert!(unpack(&out, big).iter().all(|&b| b));
    }

    /// Strings of lengths 1..=9 whose vertices are scattered by a shuffle, so that walks cross
    /// the parallel tasks; the parallel closure must equal a plain one-vertex-at-a-time closure.
    #[test]
    fn parallel_closure_matches_the_definition() {
        let count = PARALLEL_FROM * 3 + 17;
        let mut seed = 12_345u64;
        let mut next = move || {
            seed = seed.wrapping_mul(6_364_136_223_846_793_005).wrapping_add(1);
            usize::try_from(seed >> 33).unwrap()
        };
        let mut label: Vec<usize> = (0..count).collect();
        for k in (1..count).rev() {
            label.swap(k, next() % (k + 1));
        }
        let mut f = vec![-1i64; count];
        let mut v = 0;
        while v < count {
            let end = (v + 1 + next() % 9).min(count);
            for u in v..end - 1 {
                f[label[u]] = i64::try_from(label[u + 1]).unwrap();
            }
            v = end;
        }
        let start: Vec<bool> = (0..count).map(|_| next() % 50 == 0).collect();
        let mut expected = start.clone();
        for (u, _) in start.iter().enumerate().filter(|&(_, &b)| b) {
            let mut t = f[u];
            while let Ok(x) = usize::try_from(t) {
                expected[x] = true;
                t = f[x];
            }
        }
        assert_eq!(unpack(&close_one(&pack(&start), &f), count), expected);
    }
}
