//! Permutations of S_n in one-line notation (1-based at the boundary, 0-based inside):
//! validation, length, a canonical reduced word, words to permutations, the Demazure
//! (0-Hecke) product, and Bruhat order.
//!
//! Conventions: a word (i1, ..., ik) with letters in 1..n-1 means w = s_{i1} ... s_{ik}, with
//! permutations composed as functions, (uv)(j) = u(v(j)). So w s_i swaps the entries in
//! positions i, i+1 of the one-line notation of w, and i is a right descent of w
//! (l(w s_i) < l(w)) exactly when w(i) > w(i+1).
#![deny(unsafe_code)]

use crate::error::Error;

/// Checks a permutation given in 1-based one-line notation and returns it 0-based.
/// A 0-based permutation of 0..n-1 is named as such in the error.
pub fn check_perm(p: &[i64], name: &str) -> Result<Vec<usize>, Error> {
    let n = p.len();
    let mut seen = vec![false; n + 1];
    for &x in p {
        if let Some(slot) = usize::try_from(x).ok().and_then(|x| seen.get_mut(x)) {
            *slot = true;
        }
    }
    if seen[1..].iter().all(|&s| s) {
        return Ok(p
            .iter()
            .map(|&x| usize::try_from(x - 1).expect("checked in 1..n"))
            .collect());
    }
    if n > 0 && seen[..n].iter().all(|&s| s) {
        return Err(Error::invalid(format!(
            "{name} must be a permutation of 1..{n} in one-line notation; got {p:?}, which is \
             0-based (a permutation of 0..{}): add 1 to each entry",
            n - 1
        )));
    }
    Err(Error::invalid(format!(
        "{name} must be a permutation of 1..{n} in one-line notation; got {p:?}"
    )))
}

/// Checks a word: each letter in 1..n-1. Returns the letters 0-based (s_i acts on positions i-1, i).
pub fn check_word(word: &[i64], n: usize, name: &str) -> Result<Vec<usize>, Error> {
    word.iter()
        .enumerate()
        .map(|(k, &i)| match usize::try_from(i) {
            Ok(i) if (1..n).contains(&i) => Ok(i - 1),
            _ => Err(Error::invalid(format!(
                "{name}[{k}] must be a letter in 1..{} (n = {n}); got {i}",
                n.saturating_sub(1)
            ))),
        })
        .collect()
}

/// Number of inversions, pairs a < b with w(a) > w(b): the Coxeter length l(w)
/// (Bjorner-Brenti, "Combinatorics of Coxeter Groups", 2005, Prop. 1.5.2). O(n^2).
pub fn length(w: &[usize]) -> usize {
    (0..w.len())
        .map(|a| (a + 1..w.len()).filter(|&b| w[a] > w[b]).count())
        .sum()
}

/// The canonical reduced word of druse (0-based letters): repeatedly remove the smallest right
/// descent, w -> w s_d with d the least position where w(d) > w(d+1), until w = id; the
/// letters removed d1, d2, ..., dk give w = s_dk ... s_d1, so the word is (dk, ..., d1).
/// Each step lowers the length by one, so the word is reduced. O(n^3).
pub fn reduced_word(w: &[usize]) -> Vec<usize> {
    let mut v = w.to_vec();
    let mut removed = Vec::new();
    while let Some(d) = (0..v.len().saturating_sub(1)).find(|&d| v[d] > v[d + 1]) {
        v.swap(d, d + 1);
        removed.push(d);
    }
    removed.reverse();
    removed
}

/// The permutation s_{i1} ... s_{ik} of S_n (0-based letters and values).
pub fn word_to_perm(word: &[usize], n: usize) -> Vec<usize> {
    let mut w: Vec<usize> = (0..n).collect();
    for &i in word {
        w.swap(i, i + 1);
    }
    w
}

/// The Demazure product of a word in the 0-Hecke monoid: s_i * s_i = s_i, and
/// w * s_i = w s_i if l(w s_i) > l(w), else w (Norton, "0-Hecke algebras", 1979; Bjorner-Brenti
/// 2005, exercise on the Demazure product). Reading the word left to right: O(k).
pub fn demazure_product(word: &[usize], n: usize) -> Vec<usize> {
    let mut w: Vec<usize> = (0..n).collect();
    for &i in word {
        if w[i] < w[i + 1] {
            w.swap(i, i + 1);
        }
    }
    w
}

/// Bruhat order u <= v by the tableau criterion: for every k, the first k values of u, sorted,
/// are entrywise <= those of v, sorted (Ehresmann 1934; Bjorner-Brenti 2005, Thm. 2.6.3).
/// O(n^2 log n). Both must have the same length.
pub fn bruhat_le(u: &[usize], v: &[usize]) -> bool {
    if u.len() != v.len() {
        return false;
    }
    let (mut a, mut b) = (Vec::with_capacity(u.len()), Vec::with_capacity(v.len()));
    for k in 0..u.len() {
        a.push(u[k]);
        b.push(v[k]);
        a.sort_unstable();
        b.sort_unstable();
        if a.iter().zip(&b).any(|(x, y)| x > y) {
            return false;
        }
    }
    true
}

/// Rank of w in the lexicographic order of S_n (its Lehmer code read in the factorial base).
pub fn lex_rank(w: &[usize]) -> usize {
    let n = w.len();
    let mut rank = 0;
    for a in 0..n {
        let smaller_later = (a + 1..n).filter(|&b| w[b] < w[a]).count();
        rank = rank * (n - a) + smaller_later;
    }
    rank
}

/// n!, or an error past `limit` (so callers never allocate for a huge symmetric group).
pub fn factorial(n: usize, limit: usize) -> Result<usize, Error> {
    (1..=n).try_fold(1usize, |acc, k| {
        acc.checked_mul(k)
            .filter(|&f| f <= limit)
            .ok_or_else(|| Error::invalid(format!("n! for n = {n} is more than {limit}")))
    })
}

/// All permutations of S_n (0-based) in lexicographic order of the one-line notation.
pub fn all_perms(n: usize, limit: usize) -> Result<Vec<Vec<usize>>, Error> {
    let total = factorial(n, limit)?;
    let mut out = Vec::with_capacity(total);
    let mut w: Vec<usize> = (0..n).collect();
    loop {
        out.push(w.clone());
        // next permutation in lexicographic order
        let Some(a) = (0..n.saturating_sub(1)).rev().find(|&a| w[a] < w[a + 1]) else {
            return Ok(out);
        };
        let b = (a + 1..n)
            .rev()
            .find(|&b| w[b] > w[a])
            .expect("w[a+1] > w[a]");
        w.swap(a, b);
        w[a + 1..].reverse();
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn words_and_lengths() {
        let w0 = vec![3, 2, 1, 0];
        assert_eq!(length(&w0), 6); // l(w0) = n(n-1)/2, Bjorner-Brenti Prop. 1.5.2
        let word = reduced_word(&w0);
        assert_eq!(word.len(), 6);
        assert_eq!(word_to_perm(&word, 4), w0);
        assert_eq!(demazure_product(&[0, 0, 1, 0], 3), vec![2, 1, 0]);
        assert!(bruhat_le(&[0, 1, 2], &[2, 1, 0]));
        assert!(!bruhat_le(&[1, 0, 2], &[0, 2, 1]));
    }

    #[test]
    fn perm_checks() {
        assert_eq!(check_perm(&[2, 1, 3], "w").unwrap(), vec![1, 0, 2]);
        let zero = check_perm(&[1, 0, 2], "w").unwrap_err().to_string();
        assert!(zero.contains("0-based"));
        assert!(check_perm(&[1, 1, 3], "w").is_err());
        assert!(check_word(&[1, 3], 3, "word").is_err());
        let perms = all_perms(4, 100).unwrap();
        assert_eq!(perms.len(), 24);
        assert!(perms.iter().enumerate().all(|(k, w)| lex_rank(w) == k));
        assert!(all_perms(30, 1 << 20).is_err());
    }
}
