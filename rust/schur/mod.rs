//! Schur polynomials `s_lambda(x_1..x_n)` and Kostka numbers, exactly, without listing tableaux.
//!
//! Both come from the branching rule (Macdonald, Symmetric Functions and Hall Polynomials, 2nd
//! ed., 1995, Ch. I (5.11)): `s_lambda(x_1..x_k)` = sum over mu with `lambda/mu` a horizontal
//! strip of `x_k^{|lambda/mu|} s_mu(x_1..x_{k-1})`. `schur` runs it from both ends on dense
//! coefficient arrays (see `branching` and `meet`); `kostka` follows one content through it
//! (see `kostka`). Counts are exact: checked sums in the narrowest machine width that a bound
//! on the result allows, widened on overflow up to big integers.
#![deny(unsafe_code)]

mod branching;
mod compositions;
mod kostka;
mod levels;
mod meet;
mod plan;
mod width;

use crate::error::Error;
use crate::job::Job;
use crate::partition::normalize;
use num_bigint::BigUint;
use plan::Plan;
use width::{with_fallback, Width};

/// Exact coefficients in the narrowest type that held them.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Coeffs {
    U64(Vec<u64>),
    U128(Vec<u128>),
    Big(Vec<BigUint>),
}

impl Coeffs {
    pub fn len(&self) -> usize {
        match self {
            Coeffs::U64(v) => v.len(),
            Coeffs::U128(v) => v.len(),
            Coeffs::Big(v) => v.len(),
        }
    }

    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// All coefficients as big integers (for comparisons; costs an allocation each).
    pub fn to_big(&self) -> Vec<BigUint> {
        match self {
            Coeffs::U64(v) => v.iter().map(|&c| BigUint::from(c)).collect(),
            Coeffs::U128(v) => v.iter().map(|&c| BigUint::from(c)).collect(),
            Coeffs::Big(v) => v.clone(),
        }
    }
}

/// An integer type for exponents in results: every part of the shape (a `u32`) fits.
pub trait Exponent: Copy + Default + Send + Sync + From<u32> + 'static {}
impl Exponent for u32 {}
impl Exponent for u64 {}
impl Exponent for i64 {}

/// `s_shape(x_1..x_n)` as (exponents, coefficients): `exponents` holds one row of n entries per
/// term (row-major), rows in decreasing lexicographic order, coefficients all nonzero. The
/// coefficient of `x^a` is the Kostka number `K_{shape, a}`.
///
/// Conventions: trailing zeros of `shape` are ignored; more rows than n gives the zero
/// polynomial (no terms); the empty shape gives the constant 1 (one all-zero row, of length 0
/// when n = 0).
///
/// Method: the branching rule, from both ends. Bottom-up it gives `s_mu(x_1..x_q)` for the
/// partitions mu of a middle level q, top-down the skew polynomials `s_{lambda/mu}(x_{q+1}..x_n)`,
/// and `s_lambda` is the sum of their products (see `branching` and `meet`). The level q is
/// chosen to need the fewest operations within the memory budget.
///
/// Cost: a few operations per entry of the dense result (the compositions of |shape| into n
/// parts of at most `shape_1`), plus writing the terms: about 11 ms for (5,4,3,2,1), n = 9 and
/// 0.4 s for (6,5,4,3,2,1), n = 10 (5.9 million terms) on two cores. Fails with `TooLarge`
/// when the estimated memory, result included, exceeds 4 GiB, or when the recursion would
/// visit more than 2^28 pairs of partitions (long rows and few variables); with `Interrupted`
/// when the job is stopped.
pub fn schur(shape: &[usize], n: usize, job: &Job) -> Result<(Vec<u32>, Coeffs), Error> {
    schur_with::<u32>(shape, n, job)
}

/// `schur` with exponents of type `E` (the Python binding asks for `i64`, saving a copy).
pub fn schur_with<E: Exponent>(
    shape: &[usize],
    n: usize,
    job: &Job,
) -> Result<(Vec<E>, Coeffs), Error> {
    let lambda = normalize(shape, "shape")?;
    let parts: Vec<u32> = lambda
        .iter()
        .map(|&p| u32::try_from(p))
        .collect::<Result<_, _>>()
        .map_err(|_| {
            Error::invalid(format!(
                "shape parts must be at most {}; got {lambda:?}",
                u32::MAX
            ))
        })?;
    if parts.len() > n {
        return Ok((Vec::new(), Coeffs::U64(Vec::new())));
    }
    let exponent_bytes = std::mem::size_of::<E>() as u128;
    if parts.is_empty() || n == 1 {
        if n as u128 * exponent_bytes > plan::BUDGET_BYTES {
            return Err(Error::TooLarge {
                what: format!("one exponent row of {n} variables"),
                bytes: n as u128 * exponent_bytes,
                instead: "use fewer variables".into(),
            });
        }
        let mut row = vec![E::default(); n];
        if let (Some(first), Some(&m)) = (row.first_mut(), parts.first()) {
            *first = E::from(m); // n = 1: s_(m)(x_1) = x_1^m
        }
        return Ok((row, Coeffs::U64(vec![1])));
    }
    let plan = Plan::new(&parts, n, exponent_bytes, job)?;
    with_fallback(plan.width, |w| match w {
        Width::U32 => run::<u32, E>(&plan, job)
            .map(|(e, c)| (e, Coeffs::U64(c.into_iter().map(u64::from).collect()))),
        Width::U64 => run::<u64, E>(&plan, job).map(|(e, c)| (e, Coeffs::U64(c))),
        Width::U128 => run::<u128, E>(&plan, job).map(|(e, c)| (e, Coeffs::U128(c))),
        Width::Big => run::<BigUint, E>(&plan, job).map(|(e, c)| (e, Coeffs::Big(c))),
    })
}

/// The whole recursion at coefficient type `C`.
fn run<C: width::Coeff, E: Exponent>(
    plan: &Plan,
    job: &Job,
) -> Result<(Vec<E>, Vec<C>), width::Halt> {
    let bottom = branching::bottom_half::<C>(plan, job)?;
    let top = branching::top_half::<C>(plan, job)?;
    meet::combine(plan, &bottom, top, job)
}

/// The Kostka number K_{shape, weight}: the number of semistandard tableaux of shape `shape`
/// with `weight[k]` entries equal to k + 1, for a weak composition `weight` taken in the order
/// given. Zero unless |weight| = |shape|. Cost: the horizontal strips between consecutive
/// levels of the partial shapes met, at most the partitions inside `shape` per level. Fails with
/// `TooLarge` past 4 GiB of partial counts.
pub fn kostka(shape: &[usize], weight: &[usize], job: &Job) -> Result<BigUint, Error> {
    let lambda = normalize(shape, "shape")?;
    let cells: u128 = lambda.iter().map(|&p| p as u128).sum();
    let content: u128 = weight.iter().map(|&w| w as u128).sum();
    if cells != content || weight.iter().filter(|&&w| w > 0).count() < lambda.len() {
        return Ok(BigUint::ZERO); // also: more rows than letters, as a column has distinct entries
    }
    kostka_from(&lambda, weight, Width::U64, job)
}

fn kostka_from(
    lambda: &[usize],
    weight: &[usize],
    start: Width,
    job: &Job,
) -> Result<BigUint, Error> {
    with_fallback(start, |w| match w {
        Width::U32 => kostka::count::<u32>(lambda, weight, job),
        Width::U64 => kostka::count::<u64>(lambda, weight, job),
        Width::U128 => kostka::count::<u128>(lambda, weight, job),
        Width::Big => kostka::count::<BigUint>(lambda, weight, job),
    })
}

#[cfg(test)]
mod tests;
