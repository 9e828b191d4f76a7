//! Tensor products of crystal tables by the tensor-product signature rule.
//!
//! Convention (Bump-Schilling, "Crystal Bases: Representations and Combinatorics", 2017, the
//! tensor product rule of ch. 2), chosen to agree with druse's signature rule on reading words:
//! a word a_1...a_k is the vertex b_{a_1} (x) ... (x) b_{a_k} of the tensor power of the standard
//! crystal. Derivation: in a word an i+1 pairs with the nearest unpaired i to its right, so once
//! pairs are cancelled x reads i^phi(x) (i+1)^eps(x); in x (x) y the middle block
//! (i+1)^eps(x) i^phi(y) cancels min(eps(x), phi(y)) pairs. f_i changes the rightmost unpaired i:
//! it lies in y exactly when phi(y) > eps(x). e_i changes the leftmost unpaired i+1: it lies in x
//! exactly when eps(x) > phi(y). Hence
//!
//!   f_i(x (x) y) = f_i(x) (x) y  if phi_i(y) <= eps_i(x),  else x (x) f_i(y);
//!   e_i(x (x) y) = e_i(x) (x) y  if phi_i(y) <  eps_i(x),  else x (x) e_i(y);
//!   phi_i(x (x) y) = phi_i(x) + max(0, phi_i(y) - eps_i(x)),
//!   eps_i(x (x) y) = eps_i(y) + max(0, eps_i(x) - phi_i(y)),  wt = wt(x) + wt(y).
//!
//! The vertex (x, y) is numbered x * |B2| + y.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use rayon::prelude::*;

/// One factor: for each i (0-based, i < n - 1) its f_i, e_i, phi_i, eps_i, and its weights
/// (`count` x n, vertex-major).
#[derive(Debug, Clone)]
pub struct Factor<'a> {
    pub count: usize,
    pub f: Vec<&'a [i64]>,
    pub e: Vec<&'a [i64]>,
    pub phi: Vec<&'a [i32]>,
    pub eps: Vec<&'a [i32]>,
    pub weights: &'a [i32],
}

/// The arrays of one operator index i: f_i, e_i, phi_i, eps_i.
pub type Arrays = (Vec<i64>, Vec<i64>, Vec<i32>, Vec<i32>);

/// The table of a tensor product: per i the arrays (f_i, e_i, phi_i, eps_i), and the weights.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Product {
    pub operators: Vec<Arrays>,
    pub weights: Vec<i32>,
}

/// Bytes the product table of `a` x `b` vertices over n letters needs: 24 per vertex and operator
/// (f_i and e_i as i64, phi_i and eps_i as i32) and 4 per weight entry. None if it overflows.
pub fn product_bytes(a: usize, b: usize, n: usize) -> Option<u128> {
    let vertices = (a as u128).checked_mul(b as u128)?;
    let per_vertex = 24u128 * (n.saturating_sub(1) as u128) + 4 * n as u128;
    vertices.checked_mul(per_vertex)
}

fn check_factor(t: &Factor<'_>, n: usize, name: &str) -> Result<(), Error> {
    let ops = n.saturating_sub(1);
    if [t.f.len(), t.e.len(), t.phi.len(), t.eps.len()] != [ops; 4] {
        return Err(Error::invalid(format!(
            "{name} must have n - 1 = {ops} arrays of each of f, e, phi, epsilon"
        )));
    }
    if t.weights.len() != t.count * n {
        return Err(Error::invalid(format!(
            "{name} weights must have {} x {n} entries; got {}",
            t.count,
            t.weights.len()
        )));
    }
    crate::crystal::check_arrays(&t.f, t.count, &format!("{name} f"))?;
    crate::crystal::check_arrays(&t.e, t.count, &format!("{name} e"))?;
    for (k, (p, q)) in t.phi.iter().zip(&t.eps).enumerate() {
        if p.len() != t.count || q.len() != t.count {
            return Err(Error::invalid(format!(
                "{name} phi and epsilon [{}] must have one entry per vertex ({})",
                k + 1,
                t.count
            )));
        }
    }
    Ok(())
}

/// The most memory a product table may take (the Python side's budget too).
pub const MAX_BYTES: u128 = 8 << 30;

/// The tensor product `a` (x) `b` over n letters (see the module docs for the rule).
/// Its memory is estimated before anything is allocated.
pub fn tensor(a: &Factor<'_>, b: &Factor<'_>, n: usize, job: &Job) -> Result<Product, Error> {
    check_factor(a, n, "left factor")?;
    check_factor(b, n, "right factor")?;
    let bytes = product_bytes(a.count, b.count, n).unwrap_or(u128::MAX);
    if bytes > MAX_BYTES {
        return Err(Error::TooLarge {
            what: format!("the tensor product of {} and {} vertices", a.count, b.count),
            bytes,
            instead: "decompose the factors first, or use druse.lr for multiplicities".into(),
        });
    }
    let count = a
        .count
        .checked_mul(b.count)
        .filter(|&c| i64::try_from(c).is_ok())
        .ok_or_else(|| Error::invalid("the tensor product has too many vertices to number"))?;
    let mut operators = Vec::with_capacity(n.saturating_sub(1));
    for i in 0..n.saturating_sub(1) {
        operators.push(operator(a, b, i, count, job)?);
    }
    let mut weights = vec![0i32; count * n];
    weights
        .par_chunks_mut((b.count * n).max(1))
        .enumerate()
        .try_for_each(|(x, row)| {
            job.checkpoint(b.count as u64)?;
            let wx = &a.weights[x * n..(x + 1) * n];
            for (y, w) in row.chunks_exact_mut(n).enumerate() {
                let wy = &b.weights[y * n..(y + 1) * n];
                for k in 0..n {
                    w[k] = wx[k]
                        .checked_add(wy[k])
                        .ok_or_else(|| Error::invalid("weights overflow 32-bit integers"))?;
                }
            }
            Ok::<_, Error>(())
        })?;
    Ok(Product { operators, weights })
}

/// f_i, e_i, phi_i, eps_i of the product for one i, one left vertex x per parallel chunk.
fn operator(
    a: &Factor<'_>,
    b: &Factor<'_>,
    i: usize,
    count: usize,
    job: &Job,
) -> Result<Arrays, Error> {
    let index = |v: usize| i64::try_from(v).expect("the product count was checked to fit i64");
    let width = index(b.count);
    let (mut f, mut e) = (vec![-1i64; count], vec![-1i64; count]);
    let (mut phi, mut eps) = (vec![0i32; count], vec![0i32; count]);
    let rows = f
        .par_chunks_mut(b.count.max(1))
        .zip(e.par_chunks_mut(b.count.max(1)))
        .zip(phi.par_chunks_mut(b.count.max(1)))
        .zip(eps.par_chunks_mut(b.count.max(1)));
    rows.enumerate().try_for_each(|(x, (((fr, er), pr), qr))| {
        job.checkpoint(b.count as u64)?;
        let (px, qx) = (a.phi[i][x], a.eps[i][x]);
        let base = index(x) * width;
        let (fx, ex) = (a.f[i][x], a.e[i][x]);
        for y in 0..b.count {
            let (py, qy) = (b.phi[i][y], b.eps[i][y]);
            let yi = index(y);
            fr[y] = if py <= qx {
                if fx < 0 {
                    -1
                } else {
                    fx * width + yi
                }
            } else {
                let t = b.f[i][y];
                if t < 0 {
                    -1
                } else {
                    base + t
                }
            };
            er[y] = if py < qx {
                if ex < 0 {
                    -1
                } else {
                    ex * width + yi
                }
            } else {
                let t = b.e[i][y];
                if t < 0 {
                    -1
                } else {
                    base + t
                }
            };
            pr[y] = px.saturating_add((py - qx).max(0));
            qr[y] = qy.saturating_add((qx - py).max(0));
        }
        Ok::<_, Error>(())
    })?;
    Ok((f, e, phi, eps))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The standard crystal B(1) of GL_2: vertices 1, 2 with f_1(1) = 2.
    fn standard() -> (Arrays, Vec<i32>) {
        (
            (vec![1, -1], vec![-1, 0], vec![1, 0], vec![0, 1]),
            vec![1, 0, 0, 1],
        )
    }

    #[test]
    fn square_of_the_standard_crystal_follows_the_word_rule() {
        let ((f, e, p, q), w) = standard();
        let b = Factor {
            count: 2,
            f: vec![&f],
            e: vec![&e],
            phi: vec![&p],
            eps: vec![&q],
            weights: &w,
        };
        let t = tensor(&b, &b, 2, &Job::default()).unwrap();
        let (tf, te, tp, tq) = &t.operators[0];
        // words 11, 12, 21, 22 are vertices 0..3: f_1(11) = 12 (rightmost unpaired 1),
        // f_1(12) = 22, 21 is isolated (the 2 pairs with the 1 to its right)
        assert_eq!(tf, &vec![1, 3, -1, -1]);
        assert_eq!(te, &vec![-1, 0, -1, 1]);
        assert_eq!(tp, &vec![2, 1, 0, 0]);
        assert_eq!(tq, &vec![0, 1, 0, 2]);
        assert_eq!(t.weights, vec![2, 0, 1, 1, 1, 1, 0, 2]);
    }

    #[test]
    fn bad_tables_are_refused() {
        let ((f, e, p, q), w) = standard();
        let short = [1i64];
        let b = Factor {
            count: 2,
            f: vec![&short],
            e: vec![&e],
            phi: vec![&p],
            eps: vec![&q],
            weights: &w,
        };
        let good = Factor {
            f: vec![&f],
            ..b.clone()
        };
        assert!(tensor(&b, &good, 2, &Job::default()).is_err());
        assert!(tensor(&good, &good, 3, &Job::default()).is_err());
        assert_eq!(product_bytes(2, 3, 2), Some(6 * 32));
    }
}
