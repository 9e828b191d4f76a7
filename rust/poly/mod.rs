//! Exact sparse polynomials under the divided-difference operators, and key polynomials and
//! Demazure atoms by the operator route.
//!
//! A polynomial is `Terms`: `nvars`, exponent rows (row-major, `terms x nvars`, i64) and
//! coefficients. Results are canonical: distinct rows in decreasing lexicographic order,
//! nonzero coefficients. Every operator acts monomial by monomial through its closed form
//! (`operators::image`), never by dividing polynomials. Coefficients are machine integers with
//! checked arithmetic (i64, then i128); on overflow the whole computation reruns in the next
//! width and finally on `BigInt`, so results stay exact. Monomials are packed into one u64 or
//! u128 key when the exponents are non-negative and fit (`codec::Packed`), else kept as rows
//! (`codec::Rows`, Laurent exponents allowed).
#![deny(unsafe_code)]

mod codec;
mod coeff;
mod expand;
mod key;
mod operators;
mod product;
#[cfg(test)]
mod tests;

pub use coeff::CoeffVec;
pub use expand::{expand, Basis, ExpansionCache};
pub use key::{atom, key};
pub use product::product;

use crate::error::Error;
use crate::job::Job;
use codec::{Codec, Packed, Rows};
use coeff::Coeff;
use num_bigint::BigInt;
use operators::TermList;

/// The three operators on x_i, x_{i+1}; s_i swaps the two variables.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Operator {
    /// pi_i f = (x_i f - x_{i+1} s_i f) / (x_i - x_{i+1}), the isobaric divided difference.
    Isobaric,
    /// pi_i - 1, the operator of Demazure atoms (often written pibar_i).
    Atom,
    /// d_i f = (f - s_i f) / (x_i - x_{i+1}), the ordinary divided difference.
    Divided,
}

impl Operator {
    /// "pi", "pibar" or "d".
    pub fn from_name(name: &str) -> Result<Operator, Error> {
        match name {
            "pi" => Ok(Operator::Isobaric),
            "pibar" => Ok(Operator::Atom),
            "d" => Ok(Operator::Divided),
            _ => Err(Error::invalid(format!(
                "kind must be one of 'pi', 'pibar', 'd'; got {name:?}"
            ))),
        }
    }
}

/// An exact sparse polynomial in x_1..x_nvars.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Terms {
    pub nvars: usize,
    /// Row-major exponent rows, `coeffs.len() * nvars` entries.
    pub exps: Vec<i64>,
    pub coeffs: CoeffVec,
}

impl Terms {
    /// Checks that `exps` holds one row of `nvars` per coefficient.
    pub fn new(nvars: usize, exps: Vec<i64>, coeffs: CoeffVec) -> Result<Terms, Error> {
        if Some(exps.len()) != coeffs.len().checked_mul(nvars) {
            return Err(Error::invalid(format!(
                "exps must have one row of nvars={nvars} entries per coefficient; got {} entries \
                 for {} coefficients",
                exps.len(),
                coeffs.len()
            )));
        }
        Ok(Terms {
            nvars,
            exps,
            coeffs,
        })
    }

    /// The monomial x^row with coefficient 1.
    pub fn monomial(row: &[i64]) -> Terms {
        Terms {
            nvars: row.len(),
            exps: row.to_vec(),
            coeffs: CoeffVec::Small(vec![1]),
        }
    }

    pub fn len(&self) -> usize {
        self.coeffs.len()
    }

    pub fn is_empty(&self) -> bool {
        self.coeffs.is_empty()
    }

    fn rows(&self) -> impl Iterator<Item = &[i64]> {
        // nvars = 0 has one empty row per term
        (0..self.len()).map(move |t| &self.exps[t * self.nvars..(t + 1) * self.nvars])
    }

    /// The largest exponent, or None if some exponent is negative (or there are no terms).
    fn max_exponent(&self) -> Option<i64> {
        if self.exps.iter().any(|&e| e < 0) {
            return None;
        }
        Some(self.exps.iter().copied().max().unwrap_or(0))
    }
}

/// `op` on x_i, x_{i+1} (i 1-based, 1 <= i < nvars) applied to `f`.
///
/// Cost: one hash-map look-up and two additions per input term, then one step per term of the
/// result (`operators::apply`); with Laurent exponents, one look-up per term of the image.
pub fn apply_operator(f: &Terms, op: Operator, i: usize, job: &Job) -> Result<Terms, Error> {
    if i == 0 || i >= f.nvars {
        return Err(Error::invalid(format!(
            "i must be in 1..{} (the variables x_i, x_(i+1) must exist); got {i}",
            f.nvars.saturating_sub(1)
        )));
    }
    run_chain(f, &[(op, i - 1)], job)
}

/// Applies the steps in order (each an operator and a 0-based variable index) to `f`, with the
/// fastest key representation that holds every exponent; i128 first, BigInt on overflow.
fn run_chain(f: &Terms, steps: &[(Operator, usize)], job: &Job) -> Result<Terms, Error> {
    // Operators never raise the largest exponent (their images lie between a and b), so a
    // packing chosen for the input holds every intermediate.
    let max = f
        .max_exponent()
        .filter(|&m| m <= operators::MAX_LINE_EXPONENT);
    if let Some(packed) = max.and_then(|m| Packed::<u64>::new(f.nvars, m)) {
        return chain_widening(&packed, f, steps, job);
    }
    match max.and_then(|m| Packed::<u128>::new(f.nvars, m)) {
        Some(packed) => chain_widening(&packed, f, steps, job),
        None => chain_widening(&Rows, f, steps, job),
    }
}

fn chain_widening<K: Codec>(
    codec: &K,
    f: &Terms,
    steps: &[(Operator, usize)],
    job: &Job,
) -> Result<Terms, Error> {
    if let CoeffVec::Small(c) = &f.coeffs {
        if let Ok(narrow) = c
            .iter()
            .map(|&x| i64::try_from(x))
            .collect::<Result<Vec<_>, _>>()
        {
            if let Some(list) = chain(codec, encode(codec, f, &narrow), steps, job)? {
                return Ok(decode(codec, list, f.nvars, widen));
            }
        }
        if let Some(list) = chain(codec, encode(codec, f, c), steps, job)? {
            return Ok(decode(codec, list, f.nvars, CoeffVec::Small));
        }
    }
    let big = f.coeffs.to_big();
    let list = chain(codec, encode(codec, f, &big), steps, job)?
        .expect("BigInt arithmetic does not overflow");
    Ok(decode(codec, list, f.nvars, CoeffVec::Big))
}

fn chain<K: Codec, C: Coeff>(
    codec: &K,
    mut list: TermList<K::Key, C>,
    steps: &[(Operator, usize)],
    job: &Job,
) -> Result<Option<TermList<K::Key, C>>, Error> {
    let mut work = operators::Workspace::default();
    let mut next = Vec::new();
    for &step in steps {
        if !operators::apply(codec, &mut work, &list, &mut next, step, job)? {
            return Ok(None);
        }
        std::mem::swap(&mut list, &mut next);
    }
    Ok(Some(list))
}

fn encode<K: Codec, C: Coeff>(codec: &K, f: &Terms, coeffs: &[C]) -> TermList<K::Key, C> {
    f.rows()
        .zip(coeffs)
        .map(|(row, c)| (codec.encode(row), c.clone()))
        .collect()
}

/// Canonical `Terms` from a term list without zeros or repeated keys: decreasing key order.
fn decode<K: Codec, C: Coeff>(
    codec: &K,
    list: TermList<K::Key, C>,
    nvars: usize,
    wrap: fn(Vec<C>) -> CoeffVec,
) -> Terms {
    let (keys, mut coeffs): (Vec<K::Key>, Vec<C>) = list.into_iter().unzip();
    let order = codec.order_descending(&keys);
    let mut exps = vec![0i64; keys.len() * nvars];
    for (row, &k) in exps.chunks_exact_mut(nvars.max(1)).zip(&order) {
        codec.decode(&keys[k], &mut row[..nvars]);
    }
    let sorted = order
        .iter()
        .map(|&k| std::mem::replace(&mut coeffs[k], C::zero()))
        .collect();
    Terms {
        nvars,
        exps,
        coeffs: wrap(sorted).narrowed(),
    }
}

fn widen(coeffs: Vec<i64>) -> CoeffVec {
    CoeffVec::Small(coeffs.into_iter().map(i128::from).collect())
}

/// Widens input coefficients given as big integers to the narrowest form.
pub fn coefficients(values: Vec<BigInt>) -> CoeffVec {
    CoeffVec::Big(values).narrowed()
}
