//! What is true of every finite crystal, written once against its table: vertices 0..N-1,
//! weights (N x n, vertex-major), and for each i an array f_i (target or -1) with inverse e_i.
//! Models (tableaux now; tensor products, Demazure pieces, pipe dreams, user data later) only
//! produce such a table.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use rayon::prelude::*;
use std::collections::HashMap;

/// Checks that each array of `f` has `count` entries, each -1 or a vertex index.
pub fn check_arrays(f: &[&[i64]], count: usize, name: &str) -> Result<(), Error> {
    let top = i64::try_from(count).map_err(|_| Error::invalid("too many vertices"))?;
    for (k, fi) in f.iter().enumerate() {
        if fi.len() != count {
            return Err(Error::invalid(format!(
                "{name}[{}] must have one entry per vertex ({count}); got {}",
                k + 1,
                fi.len()
            )));
        }
        if let Some((v, &t)) = fi.iter().enumerate().find(|&(_, &t)| t < -1 || t >= top) {
            return Err(Error::invalid(format!(
                "{name}[{}] entries must be -1 or a vertex in 0..{count}; vertex {v} has {t}",
                k + 1
            )));
        }
    }
    Ok(())
}

/// Length of the f-string below each vertex (phi, from `f`) or above it (epsilon, from `e`):
/// `steps[v] = 0` if `next[v] = -1`, else `steps[next[v]] + 1`. O(N); fails on a cycle.
pub fn string_steps(next: &[i64]) -> Result<Vec<i32>, Error> {
    const UNSET: i32 = -1;
    let mut steps = vec![UNSET; next.len()];
    let mut path = Vec::new();
    for start in 0..next.len() {
        let mut v = start;
        while steps[v] == UNSET {
            path.push(v);
            let t = next[v];
            if t < 0 {
                break;
            }
            v = usize::try_from(t).expect("checked non-negative");
            if path.len() > next.len() {
                return Err(Error::invalid(format!(
                    "operator arrays contain a cycle through vertex {start}"
                )));
            }
        }
        let mut s = if next[v] < 0 && steps[v] == UNSET {
            -1
        } else {
            steps[v]
        };
        while let Some(u) = path.pop() {
            s += 1;
            steps[u] = s;
        }
    }
    Ok(steps)
}

/// Vertices that no operator of `ops` acts on (highest weight for e, lowest for f), ascending.
pub fn sources(ops: &[&[i64]], count: usize) -> Vec<i64> {
    (0..count)
        .filter(|&v| ops.iter().all(|o| o[v] < 0))
        .map(|v| i64::try_from(v).expect("vertex counts fit i64"))
        .collect()
}

fn root(parent: &mut [usize], mut v: usize) -> usize {
    while parent[v] != v {
        parent[v] = parent[parent[v]]; // path halving
        v = parent[v];
    }
    v
}

/// Connected components: label per vertex, components numbered by their smallest vertex.
/// `f` must have passed `check_arrays`.
pub fn components(f: &[&[i64]], count: usize) -> Vec<i64> {
    let mut parent: Vec<usize> = (0..count).collect();
    for fi in f {
        for (v, &t) in fi.iter().enumerate() {
            if let Ok(t) = usize::try_from(t) {
                let (a, b) = (root(&mut parent, v), root(&mut parent, t));
                let (lo, hi) = if a < b { (a, b) } else { (b, a) };
                parent[hi] = lo; // the smaller vertex stays root, so roots are component minima
            }
        }
    }
    let mut label = vec![-1i64; count];
    let mut next = 0i64;
    for v in 0..count {
        let r = root(&mut parent, v);
        if label[r] < 0 {
            label[r] = next;
            next += 1;
        }
        label[v] = label[r];
    }
    label
}

/// The character sum over masked vertices of x^wt(v): distinct weights (terms x n, row-major)
/// in decreasing lexicographic order, with their multiplicities. `weights` is vertex-major,
/// `count` x `n` (the count is given because with n = 0 the weights cannot tell it).
pub fn character(
    weights: &[i32],
    n: usize,
    count: usize,
    mask: Option<&[bool]>,
    job: &Job,
) -> Result<(Vec<i32>, Vec<u64>), Error> {
    if weights.len() != count * n {
        return Err(Error::invalid(format!(
            "weights must have {count} x {n} entries; got {}",
            weights.len()
        )));
    }
    if let Some(m) = mask {
        if m.len() != count {
            return Err(Error::invalid(format!(
                "mask must have one entry per vertex ({count}); got {}",
                m.len()
            )));
        }
    }
    let keep = |v: usize| mask.is_none_or(|m| m[v]);
    if n == 0 {
        let total = (0..count).filter(|&v| keep(v)).count() as u64;
        return Ok(if total > 0 {
            (vec![], vec![total])
        } else {
            (vec![], vec![])
        });
    }
    let rows: Vec<&[i32]> = weights.chunks_exact(n).collect();
    let tally = rows
        .par_chunks(1 << 14)
        .enumerate()
        .try_fold(HashMap::<&[i32], u64>::new, |mut acc, (b, chunk)| {
            job.checkpoint(chunk.len() as u64)?;
            for (k, w) in chunk.iter().enumerate() {
                if keep(b * (1 << 14) + k) {
                    *acc.entry(*w).or_insert(0) += 1;
                }
            }
            Ok::<_, Error>(acc)
        })
        .try_reduce(HashMap::new, |mut a, b| {
            for (w, c) in b {
                *a.entry(w).or_insert(0) += c;
            }
            Ok(a)
        })?;
    let mut terms: Vec<(&[i32], u64)> = tally.into_iter().collect();
    terms.sort_unstable_by(|a, b| b.0.cmp(a.0));
    let exps = terms.iter().flat_map(|(w, _)| w.iter().copied()).collect();
    let coeffs = terms.iter().map(|&(_, c)| c).collect();
    Ok((exps, coeffs))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn strings_and_components() {
        // two strings: 0 -> 1 -> 2 and 3 -> 4
        let f: Vec<i64> = vec![1, 2, -1, 4, -1];
        let e: Vec<i64> = vec![-1, 0, 1, -1, 3];
        assert_eq!(string_steps(&f).unwrap(), vec![2, 1, 0, 1, 0]);
        assert_eq!(string_steps(&e).unwrap(), vec![0, 1, 2, 0, 1]);
        assert_eq!(sources(&[&e], 5), vec![0, 3]);
        assert_eq!(components(&[&f], 5), vec![0, 0, 0, 1, 1]);
        assert!(string_steps(&[1, 0]).is_err());
    }

    #[test]
    fn character_counts_weights() {
        let w = vec![1, 0, 0, 1, 1, 0];
        let (exps, coeffs) = character(&w, 2, 3, None, &Job::default()).unwrap();
        assert_eq!(exps, vec![1, 0, 0, 1]);
        assert_eq!(coeffs, vec![2, 1]);
        // n = 0: every kept vertex has the empty weight; the count comes from the caller
        let kept = [true, false, true];
        let (exps, coeffs) = character(&[], 0, 3, Some(&kept), &Job::default()).unwrap();
        assert_eq!((exps, coeffs), (vec![], vec![2]));
        assert!(character(&w, 2, 4, None, &Job::default()).is_err());
    }
}
