//! Schubert polynomials S_w of permutations w in S_n (one-line notation, 0-based inside).
//!
//! Definition (Lascoux and Schutzenberger, "Polynomes de Schubert", 1982; Macdonald, Notes on
//! Schubert Polynomials, 1991, (4.1)): S_(w0) = x_1^(n-1) x_2^(n-2) ... x_(n-1) for the longest
//! w0 of S_n, and S_(w s_i) = d_i S_w whenever l(w s_i) < l(w).
//!
//! - `transition`: one S_w by the transition recursion, memoised, exact.
//! - `batch`: every S_w of S_n, top down from S_(w0) by the divided differences of `poly`.
//! - `by_divided_differences`: one S_w straight from the definition, for cross-checks.
#![deny(unsafe_code)]

pub mod batch;
pub mod factorization;
pub mod pipes;
pub mod pipes_read;
pub mod pipes_walk;
pub mod transition;

pub use batch::{estimated_batch_bytes, AllSchuberts};
pub use transition::schubert;

use crate::error::Error;
use crate::job::Job;
use crate::poly::{self, Operator, Terms};

/// The exponents of S_(w0) in S_n: (n-1, n-2, ..., 1, 0).
pub fn longest_monomial(n: usize) -> Vec<i64> {
    (0..n)
        .map(|k| i64::try_from(n - 1 - k).expect("n is far below 2^63"))
        .collect()
}

/// The 0-based letters i such that S_w = d_(i_k) ... d_(i_1) S_(w0), i_1 applied first:
/// walk up from w by ascents (w(i) < w(i+1), then w -> w s_i) until w0, and reverse.
pub fn descent_path_from_longest(w: &[usize]) -> Vec<usize> {
    let mut v = w.to_vec();
    let mut up = Vec::new();
    while let Some(i) = (0..v.len().saturating_sub(1)).find(|&i| v[i] < v[i + 1]) {
        v.swap(i, i + 1);
        up.push(i);
    }
    up.reverse();
    up
}

/// Bytes one step of `by_divided_differences` may produce before it is refused.
pub const MAX_STEP_BYTES: u128 = 2 << 30;

/// S_w from the definition: d_i applied to S_(w0) along a descending path to w, one step of
/// `poly::apply_operator` each. Slow (the intermediate polynomials are large); for checks.
/// Before each step the size of its result is bounded (a monomial with exponents a, b in
/// x_i, x_(i+1) has an image of |a - b| terms) and refused past `MAX_STEP_BYTES`.
pub fn by_divided_differences(w: &[usize], job: &Job) -> Result<Terms, Error> {
    let n = w.len();
    let mut f = Terms::monomial(&longest_monomial(n));
    for i in descent_path_from_longest(w) {
        let bound: u128 = f
            .exps
            .chunks_exact(n)
            .map(|row| u128::from(row[i].abs_diff(row[i + 1])))
            .sum();
        let bytes = bound * (8 * n as u128 + 16);
        if bytes > MAX_STEP_BYTES {
            return Err(Error::TooLarge {
                what: format!("S_w for w in S_{n} by divided differences"),
                bytes,
                instead: "use schubert(perm) (the transition recursion)".into(),
            });
        }
        f = poly::apply_operator(&f, Operator::Divided, i + 1, job)?;
    }
    Ok(f)
}

#[cfg(test)]
mod tests;
