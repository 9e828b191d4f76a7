//! Littlewood-Richardson multiplicities c^lambda_{mu nu}, for all lambda at once.
//!
//! Source: the highest weight vertices of B(mu) (x) B(nu) (Bump-Schilling, "Crystal Bases:
//! Representations and Combinatorics", 2017, the tensor product rule and the
//! Littlewood-Richardson rule derived from it; equivalently Fulton, "Young Tableaux", 1997,
//! ch. 5). With the convention of `tensor.rs`, x (x) y is highest weight iff y is and
//! eps_i(x) <= phi_i(y) for all i; on words this says that the row reading word of T followed by
//! that of u_mu is a reverse lattice word: every suffix has at least as many letters i as i+1.
//! So c^lambda_{nu mu} = c^lambda_{mu nu} counts the SSYT T of shape nu with wt(T) = lambda - mu
//! such that, reading T's rows top to bottom and each right to left (the reverse of the row
//! reading word), every letter j > 1 read keeps mu_{j-1} + #(j-1 read) >= mu_j + #(j read).
//!
//! The count goes row by row: after each row the state is (current lambda, the row just filled,
//! cut to the length of the next row, which is all the next row's column condition sees), and
//! equal states are merged with their multiplicities added, so only the rows are enumerated,
//! never the whole tableaux. Counts are u128, checked.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use crate::partition::normalize;
use rayon::prelude::*;
use std::collections::HashMap;

/// (lambda without trailing zeros, c^lambda_{mu nu}), lambda in decreasing lexicographic order.
pub type Terms = Vec<(Vec<u64>, u128)>;

type States = HashMap<(Vec<u64>, Vec<u8>), u128>;

/// The most memory the row states may take.
const MAX_BYTES: u128 = 4 << 30;

fn overflow() -> Error {
    Error::invalid("a Littlewood-Richardson count exceeds 2^128")
}

/// c^lambda_{mu nu} for every lambda with a nonzero coefficient.
pub fn lr(mu: &[usize], nu: &[usize], job: &Job) -> Result<Terms, Error> {
    let mu = normalize(mu, "mu")?;
    let nu = normalize(nu, "nu")?;
    // fill the partition with fewer cells: fewer rows to enumerate; the count is symmetric
    let (big, small) = if nu.iter().sum::<usize>() <= mu.iter().sum() {
        (mu, nu)
    } else {
        (nu, mu)
    };
    let letters = big.len() + small.len();
    // letters stay below 255 so that "one more than a letter" is still a u8
    let letters_u8 = u8::try_from(letters)
        .ok()
        .filter(|&l| l < u8::MAX)
        .ok_or_else(|| Error::invalid("mu and nu may have at most 254 rows together"))?;
    let mut start = vec![0u64; letters];
    for (slot, &p) in start.iter_mut().zip(&big) {
        *slot = p as u64;
    }
    let mut states = States::new();
    states.insert((start, Vec::new()), 1);
    for (r, &len) in small.iter().enumerate() {
        let keep = small.get(r + 1).copied().unwrap_or(0);
        // a state holds its two vectors (with their headers), the count and the table's slack
        let per_state = (letters * 8 + keep + 48 + 16 + 32) as u128;
        let mut next = States::new();
        for ((mut c, prev), count) in states {
            fill_row(len, &prev, &mut c, letters_u8, job, |c, row| {
                let slot = next.entry((c.to_vec(), row[..keep].to_vec())).or_insert(0);
                *slot = slot.checked_add(count).ok_or_else(overflow)?;
                Ok(())
            })?;
            let bytes = next.len() as u128 * per_state;
            if bytes > MAX_BYTES {
                return Err(Error::TooLarge {
                    what: "the Littlewood-Richardson count (its row states)".into(),
                    bytes,
                    instead: "ask for smaller partitions".into(),
                });
            }
        }
        states = next;
    }
    let mut terms: Terms = states
        .into_iter()
        .map(|((mut c, _), count)| {
            let len = c.iter().rposition(|&p| p > 0).map_or(0, |i| i + 1);
            c.truncate(len);
            (c, count)
        })
        .collect();
    terms.sort_unstable_by(|a, b| b.0.cmp(&a.0));
    Ok(terms)
}

/// `lr` for each pair, in parallel; results in the order of `pairs`.
pub fn lr_batch(pairs: &[(Vec<usize>, Vec<usize>)], job: &Job) -> Result<Vec<Terms>, Error> {
    pairs
        .par_iter()
        .map(|(mu, nu)| {
            job.checkpoint(1)?;
            lr(mu, nu, job)
        })
        .collect()
}

/// Every filling of a row of `len` cells (weakly increasing, each cell above `prev` in its column
/// if `prev` is not empty) whose letters, read right to left, keep `c` a partition as each is
/// added. Calls `emit(c, row)` with `c` updated for each. Iterative, so long rows need no stack.
fn fill_row(
    len: usize,
    prev: &[u8],
    c: &mut [u64],
    letters: u8,
    job: &Job,
    mut emit: impl FnMut(&[u64], &[u8]) -> Result<(), Error>,
) -> Result<(), Error> {
    if len == 0 {
        return emit(c, &[]);
    }
    let lattice_ok = |c: &[u64], j: u8| j == 1 || c[usize::from(j) - 2] > c[usize::from(j) - 1];
    let mut row = vec![0u8; len];
    let mut next = vec![0u8; len]; // next letter to try at each depth, descending
    let (mut depth, mut emitted) = (0usize, 0u64);
    next[0] = letters;
    loop {
        let pos = len - 1 - depth;
        let lo = prev.get(pos).map_or(1, |&p| p + 1);
        let mut j = next[depth];
        while j >= lo && !lattice_ok(c, j) {
            j -= 1;
        }
        if j < lo {
            if depth == 0 {
                return Ok(());
            }
            depth -= 1;
            let l = row[len - 1 - depth];
            c[usize::from(l) - 1] -= 1;
            next[depth] = l - 1;
            continue;
        }
        row[pos] = j;
        c[usize::from(j) - 1] += 1;
        if depth + 1 == len {
            emit(c, &row)?;
            emitted += 1;
            if emitted % 4096 == 0 {
                job.checkpoint(4096)?;
            }
            c[usize::from(j) - 1] -= 1;
            next[depth] = j - 1;
        } else {
            depth += 1;
            next[depth] = j; // weakly increasing rows: the cell to the left is at most j
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn run(mu: &[usize], nu: &[usize]) -> Terms {
        lr(mu, nu, &Job::default()).unwrap()
    }

    #[test]
    fn fulton_example() {
        // c^{(3,2,1)}_{(2,1),(2,1)} = 2 (Fulton, Young Tableaux, 1997, ch. 5)
        let t = run(&[2, 1], &[2, 1]);
        let c = t.iter().find(|(l, _)| l == &[3, 2, 1]).map(|x| x.1);
        assert_eq!(c, Some(2));
        // from memory: s_21^2 = s_42 + s_411 + s_33 + 2 s_321 + s_3111 + s_222 + s_2211
        let total: u128 = t.iter().map(|x| x.1).sum();
        assert_eq!((t.len(), total), (7, 8));
    }

    #[test]
    fn pieri_row() {
        // s_1 * s_1 = s_2 + s_11 (Pieri rule)
        assert_eq!(run(&[1], &[1]), vec![(vec![2], 1), (vec![1, 1], 1)]);
        assert_eq!(run(&[], &[2, 1]), vec![(vec![2, 1], 1)]);
        assert_eq!(run(&[], &[]), vec![(vec![], 1)]);
    }

    #[test]
    fn bad_input_is_refused() {
        assert!(lr(&[1, 2], &[1], &Job::default()).is_err());
        assert!(lr(&[1; 200], &[1; 100], &Job::default()).is_err());
    }
}
