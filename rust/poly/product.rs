//! The product of two sparse polynomials, on packed keys when the exponents allow.
#![deny(unsafe_code)]

use super::codec::{Codec, KeyMap, Packed, Rows};
use super::coeff::{Coeff, CoeffVec};
use super::operators::MAX_TERMS;
use super::{decode, encode, Terms};
use crate::error::Error;
use crate::job::Job;

/// f * g, term by term into a hash map (the schoolbook product; Knuth, TAOCP vol. 2, 4.6.1).
/// Cost: len(f) * len(g) map updates.
pub fn product(f: &Terms, g: &Terms, job: &Job) -> Result<Terms, Error> {
    if f.nvars != g.nvars {
        return Err(Error::invalid(format!(
            "the factors must have the same nvars; got {} and {}",
            f.nvars, g.nvars
        )));
    }
    let bound = f.max_exponent().zip(g.max_exponent());
    let max = bound.and_then(|(a, b)| a.checked_add(b));
    if let Some(packed) = max.and_then(|m| Packed::<u64>::new(f.nvars, m)) {
        return product_widening(&packed, f, g, job);
    }
    match max.and_then(|m| Packed::<u128>::new(f.nvars, m)) {
        Some(packed) => product_widening(&packed, f, g, job),
        None => product_widening(&Rows, f, g, job),
    }
}

fn product_widening<K: Codec>(codec: &K, f: &Terms, g: &Terms, job: &Job) -> Result<Terms, Error> {
    if let (CoeffVec::Small(a), CoeffVec::Small(b)) = (&f.coeffs, &g.coeffs) {
        if let Some(list) = multiply(codec, &encode(codec, f, a), &encode(codec, g, b), job)? {
            return Ok(decode(codec, list, f.nvars, CoeffVec::Small));
        }
    }
    let (a, b) = (f.coeffs.to_big(), g.coeffs.to_big());
    let list = multiply(codec, &encode(codec, f, &a), &encode(codec, g, &b), job)?
        .expect("BigInt arithmetic does not overflow");
    Ok(decode(codec, list, f.nvars, CoeffVec::Big))
}

type List<K, C> = Vec<(K, C)>;

fn multiply<K: Codec, C: Coeff>(
    codec: &K,
    f: &[(K::Key, C)],
    g: &[(K::Key, C)],
    job: &Job,
) -> Result<Option<List<K::Key, C>>, Error> {
    let mut out: KeyMap<K::Key, C> = KeyMap::default();
    for (x, c) in f {
        job.checkpoint(g.len() as u64)?;
        if out.len() > MAX_TERMS {
            return Err(Error::TooLarge {
                what: "this product".into(),
                bytes: 40 * MAX_TERMS as u128,
                instead: "multiply smaller pieces".into(),
            });
        }
        for (y, d) in g {
            let key = codec.multiply(x, y).ok_or_else(|| {
                Error::invalid("an exponent of the product leaves the int64 range")
            })?;
            let Some(cd) = c.checked_mul(d) else {
                return Ok(None);
            };
            if !out
                .entry(key)
                .or_insert_with(C::zero)
                .add_signed(&cd, false)
            {
                return Ok(None);
            }
        }
    }
    Ok(Some(
        out.into_iter().filter(|(_, c)| !c.is_zero()).collect(),
    ))
}
