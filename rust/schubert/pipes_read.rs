//! Pipe dreams in bulk: the whole enumeration on all cores, and what each mask says (weight,
//! reduced word, rows of the crosses), plus the count of a permutation's pipe dreams.
//!
//! A mask's set bits, most significant first, are its crosses in reading order (rows top to
//! bottom, each right to left); cell j of that order is (r, c) with letter r + c - 1.
#![deny(unsafe_code)]

use super::pipes::{mask_words, PipeDreamGraph};
use crate::error::Error;
use crate::job::Job;
use crate::memory;
use num_bigint::BigUint;
use rayon::prelude::*;

/// Materialising more than this many bytes of masks is refused (the Python budget, 8 GiB).
pub const BUDGET_BYTES: u128 = 8 << 30;
/// Pipe dreams per parallel task: big enough to amortise the seek, small enough to balance.
const BLOCK: usize = 1 << 16;

/// S_w(1, ..., 1), the number of reduced pipe dreams of w (0-based), exactly.
pub fn count(w: &[usize], job: &Job) -> Result<BigUint, Error> {
    Ok(PipeDreamGraph::new(w, job)?.total_big())
}

/// The number of pipe dreams as a usize, once their masks are known to fit the budget.
pub fn checked_total(g: &PipeDreamGraph) -> Result<usize, Error> {
    let words = mask_words(g.n()).max(1) as u128;
    let too_large = |bytes: u128| Error::TooLarge {
        what: format!(
            "the masks of the pipe dreams of this permutation of S_{}",
            g.n()
        ),
        bytes,
        instead: "count them with count_pipe_dreams, or stream them in chunks with \
                  iter_pipe_dreams"
            .into(),
    };
    let Some(total) = g.total() else {
        return Err(too_large(u128::MAX));
    };
    let bytes = total.saturating_mul(8 * words);
    if bytes > BUDGET_BYTES {
        return Err(too_large(bytes));
    }
    Ok(usize::try_from(total).expect("within the budget"))
}

/// Every pipe dream's mask, ascending: a flat array of total * W words, W = ceil(L/64).
/// Blocks of BLOCK ranks run in parallel, each seeking its first rank, so the output is the
/// same on any number of threads.
pub fn enumerate(g: &PipeDreamGraph, job: &Job) -> Result<Vec<u64>, Error> {
    let total = checked_total(g)?;
    let words = mask_words(g.n());
    let mut out = memory::filled(total * words, 0u64);
    if words == 0 {
        return Ok(out);
    }
    out.par_chunks_mut(BLOCK * words)
        .enumerate()
        .try_for_each(|(b, chunk)| g.range_into((b * BLOCK) as u128, chunk, job))?;
    Ok(out)
}

/// Cell facts in reading order: (row, letter), both 1-based.
fn cells(n: usize) -> Vec<(u8, u8)> {
    let mut out = Vec::with_capacity(n * n.saturating_sub(1) / 2);
    for r in 1..n {
        for c in (1..=n - r).rev() {
            out.push((
                u8::try_from(r).expect("n <= 64"),
                u8::try_from(r + c - 1).expect("n <= 64"),
            ));
        }
    }
    out
}

/// The reading-order indices j of the set bits of one mask (W words, most significant first).
fn crosses(mask: &[u64], cells: usize, out: &mut Vec<usize>) {
    out.clear();
    let words = mask.len();
    for (k, &word) in mask.iter().enumerate() {
        let mut bits = word;
        while bits != 0 {
            let top = 63 - bits.leading_zeros() as usize;
            bits &= !(1u64 << top);
            let b = (words - 1 - k) * 64 + top; // bit b of the mask is cell L-1-b
            if b < cells {
                out.push(cells - 1 - b);
            }
        }
    }
}

/// Checks a flat mask array of `count` pipe dreams of S_n: W words each, no bit past L,
/// exactly `length` crosses each. Returns W.
fn check_masks(masks: &[u64], count: usize, n: usize, length: usize) -> Result<usize, Error> {
    let words = mask_words(n);
    let cells = n * n.saturating_sub(1) / 2;
    if count.checked_mul(words) != Some(masks.len()) || (words == 0 && length > 0) {
        return Err(Error::invalid(format!(
            "masks must have {words} words per row for n = {n}, and length {length} must fit"
        )));
    }
    if words == 0 {
        return Ok(0);
    }
    for mask in masks.chunks_exact(words) {
        let high = (cells % 64 != 0) && mask[0] >> (cells % 64) != 0;
        let ones: u32 = mask.iter().map(|x| x.count_ones()).sum();
        if high || ones as usize != length {
            return Err(Error::invalid(format!(
                "masks must hold {length} crosses among the {cells} cells of n = {n}"
            )));
        }
    }
    Ok(words)
}

/// Weights, letters and rows of a batch of masks, flat.
pub type Readings = (Vec<i32>, Vec<u8>, Vec<u8>);

/// Per pipe dream: the weight (crosses per row, n entries), and in reading order the letters
/// (the reduced word) and the rows of the crosses (the compatible sequence's second half).
/// Flat arrays (count x n) int32, (count x length) u8, (count x length) u8.
pub fn read(
    masks: &[u64],
    count: usize,
    n: usize,
    length: usize,
    job: &Job,
) -> Result<Readings, Error> {
    let words = check_masks(masks, count, n, length)?;
    let table = cells(n);
    let cells_total = table.len();
    let mut weights = vec![0i32; count * n];
    let (mut letters, mut rows) = (vec![0u8; count * length], vec![0u8; count * length]);
    if count == 0 || length == 0 {
        return Ok((weights, letters, rows));
    }
    weights
        .par_chunks_mut(BLOCK * n)
        .zip(letters.par_chunks_mut(BLOCK * length))
        .zip(rows.par_chunks_mut(BLOCK * length))
        .zip(masks.par_chunks(BLOCK * words))
        .try_for_each(|(((wt, le), ro), ms)| {
            let mut js = Vec::with_capacity(length);
            for (k, mask) in ms.chunks_exact(words).enumerate() {
                crosses(mask, cells_total, &mut js);
                for (t, &j) in js.iter().enumerate() {
                    let (r, a) = table[j];
                    wt[k * n + usize::from(r) - 1] += 1;
                    le[k * length + t] = a;
                    ro[k * length + t] = r;
                }
            }
            job.checkpoint(ms.len() as u64)
        })?;
    Ok((weights, letters, rows))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::perm;

    fn all_masks(w: &[usize]) -> Vec<u64> {
        let job = Job::default();
        enumerate(&PipeDreamGraph::new(w, &job).unwrap(), &job).unwrap()
    }

    #[test]
    fn small_counts() {
        let job = Job::default();
        // S_{1432} = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3: 5 terms (from memory);
        // 1 n n-1 ... 2 has Catalan(n-1) pipe dreams (Woo 2004; OEIS A000108: 2, 5, 14, 42, 132)
        let cat: Vec<u32> = (3..=7)
            .map(|n| {
                let mut w: Vec<usize> = vec![0];
                w.extend((1..n).rev());
                u32::try_from(count(&w, &job).unwrap()).unwrap()
            })
            .collect();
        assert_eq!(cat, vec![2, 5, 14, 42, 132]);
        let w0: Vec<usize> = (0..6).rev().collect();
        assert_eq!(all_masks(&w0), vec![(1u64 << 15) - 1]); // w0: the full staircase alone
        assert_eq!(all_masks(&[0, 1, 2]), vec![0]);
        assert_eq!(count(&[0], &job).unwrap(), BigUint::from(1u8));
        let w0: Vec<usize> = (0..64).rev().collect(); // S_{w0} is one monomial
        assert_eq!(count(&w0, &job).unwrap(), BigUint::from(1u8));
        let (weights, _, _) = read(&[], 1, 1, 0, &job).unwrap(); // n = 1: one empty pipe dream
        assert_eq!(weights, vec![0]);
    }

    #[test]
    fn masks_ascend_and_read_back_to_w() {
        let job = Job::default();
        for w in perm::all_perms(5, 1000).unwrap() {
            let masks = all_masks(&w);
            assert!(masks.windows(2).all(|p| p[0] < p[1]));
            let l = perm::length(&w);
            let (weights, letters, _rows) = read(&masks, masks.len(), 5, l, &job).unwrap();
            assert_eq!(weights.len(), masks.len() * 5);
            for word in letters.chunks_exact(l.max(1)).take(masks.len()) {
                let word: Vec<usize> = word.iter().map(|&a| usize::from(a) - 1).collect();
                assert_eq!(perm::word_to_perm(&word, 5), w);
            }
        }
    }

    #[test]
    fn ranges_agree_with_the_whole() {
        let job = Job::default();
        let w = vec![0, 5, 4, 3, 2, 1];
        let g = PipeDreamGraph::new(&w, &job).unwrap();
        let all = enumerate(&g, &job).unwrap();
        let mut part = vec![0u64; 5];
        g.range_into(3, &mut part, &job).unwrap();
        assert_eq!(part, all[3..8]);
        assert_eq!(all.len(), 42); // Catalan(5), OEIS A000108
        assert!(g.range_into(38, &mut part, &job).is_err());
        let wide: Vec<usize> = (0..13).rev().collect(); // L = 78 > 64: two words
        let g = PipeDreamGraph::new(&wide, &job).unwrap();
        assert_eq!(enumerate(&g, &job).unwrap(), vec![(1 << 14) - 1, u64::MAX]);
    }
}
