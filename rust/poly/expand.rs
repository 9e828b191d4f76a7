//! Key and atom expansions of exact polynomials by triangular peeling, with one shared cache of
//! basis elements for a whole batch.
//!
//! The key polynomials kappa_alpha (and the Demazure atoms A_alpha), alpha running over the
//! weak compositions of length n, are each a basis of Z[x_1..x_n]; the leading term of each in
//! the reverse lexicographic order (exponents compared from x_n backwards, larger wins) is
//! x^alpha with coefficient 1 (Lascoux and Schutzenberger, "Keys and standard bases", 1990;
//! Reiner and Shimozono, "Key polynomials and a flagged Littlewood-Richardson rule", 1995). So
//! f is peeled exactly: take its leading term c x^beta, subtract c kappa_beta, repeat. Each
//! subtraction only brings terms below beta, so the peeled exponents come out strictly
//! decreasing and the loop ends.
//!
//! Monomials are packed with x_n in the most significant field (the rows are reversed before
//! `Packed` sees them), so that the numeric order of keys is the reverse lexicographic order of
//! the exponents; a max-heap then yields the leading term. Basis elements never hold an
//! exponent above their composition's largest part (their terms are weights of tableaux with
//! that many columns), so one packing chosen for the input holds every intermediate term.
#![deny(unsafe_code)]

mod elements;
mod widths;

use super::codec::{Codec, KeyMap, Packed, Rows};
use super::coeff::Coeff;
use super::{Operator, Terms};
use crate::error::Error;
use crate::job::Job;
use num_bigint::BigInt;
use rayon::prelude::*;
use std::collections::hash_map::Entry;
use std::collections::BinaryHeap;
use std::sync::atomic::AtomicUsize;
use std::sync::{Arc, PoisonError, RwLock};
use widths::{Element, PeelCoeff};

/// Terms kept in a cache at most (about 1 GB at 16 bytes a term); past it, basis elements are
/// computed each time they are needed instead of stored.
const CACHE_TERMS: usize = 1 << 26;

/// Batches with fewer input terms than this run on one thread: rayon would cost more.
const PARALLEL_TERMS: usize = 256;

/// Which basis to expand in.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Basis {
    /// Key polynomials (Demazure characters) kappa_alpha.
    Key,
    /// Demazure atoms A_alpha.
    Atom,
}

impl Basis {
    /// "key" or "atom".
    pub fn from_name(name: &str) -> Result<Basis, Error> {
        match name {
            "key" => Ok(Basis::Key),
            "atom" => Ok(Basis::Atom),
            _ => Err(Error::invalid(format!(
                "basis must be 'key' or 'atom'; got {name:?}"
            ))),
        }
    }

    fn operator(self) -> Operator {
        match self {
            Basis::Key => Operator::Isobaric,
            Basis::Atom => Operator::Atom,
        }
    }
}

/// A bug, not bad input: the kernels' error type has no variant of its own for it yet.
fn internal(msg: &str) -> Error {
    Error::Internal(format!("in the key expansion, {msg}"))
}

/// Basis elements by their leading key.
type ElementMap<Key> = KeyMap<Key, Arc<Element<Key>>>;

/// Basis elements by leading key, for one packing; shared by every thread of a batch.
struct Shelf<K: Codec> {
    codec: K,
    nvars: usize,
    elements: RwLock<ElementMap<K::Key>>,
    stored_terms: AtomicUsize,
}

impl<K: Codec> Shelf<K> {
    fn new(codec: K, nvars: usize) -> Shelf<K> {
        Shelf {
            codec,
            nvars,
            elements: RwLock::new(KeyMap::default()),
            stored_terms: AtomicUsize::new(0),
        }
    }

    /// The revlex key of an exponent row: the row reversed, so x_n is the most significant.
    fn encode(&self, row: &[i64], buf: &mut [i64]) -> K::Key {
        for (slot, &e) in buf.iter_mut().zip(row.iter().rev()) {
            *slot = e;
        }
        self.codec.encode(buf)
    }

    fn decode(&self, key: &K::Key, row: &mut [i64]) {
        self.codec.decode(key, row);
        row.reverse();
    }

    /// The expansion of `f` in `basis`: i64 coefficients first, then i128, then BigInt.
    fn expand(&self, basis: Basis, f: &Terms, job: &Job) -> Result<Terms, Error> {
        if let Some(c) = i64::from_input(&f.coeffs) {
            if let Some(out) = self.peel(basis, f, c, job)? {
                return Ok(out);
            }
        }
        if let Some(c) = i128::from_input(&f.coeffs) {
            if let Some(out) = self.peel(basis, f, c, job)? {
                return Ok(out);
            }
        }
        let c = BigInt::from_input(&f.coeffs).expect("every integer is a BigInt");
        Ok(self
            .peel(basis, f, c, job)?
            .expect("BigInt arithmetic does not overflow"))
    }

    /// Triangular peeling in width C; Ok(None) when a coefficient overflows C.
    fn peel<C: PeelCoeff>(
        &self,
        basis: Basis,
        f: &Terms,
        coeffs: Vec<C>,
        job: &Job,
    ) -> Result<Option<Terms>, Error> {
        let mut buf = vec![0i64; self.nvars];
        let mut rest: KeyMap<K::Key, C> = KeyMap::default();
        for (row, c) in f.rows().zip(coeffs) {
            // the input need not be canonical: repeated rows add up
            let slot = rest
                .entry(self.encode(row, &mut buf))
                .or_insert_with(C::zero);
            if !slot.add_signed(&c, false) {
                return Ok(None);
            }
        }
        rest.retain(|_, c| !c.is_zero());
        // A key can sit in the heap more than once (removed at zero, then brought back); the
        // copies that find nothing left in `rest` are skipped.
        let mut heap: BinaryHeap<K::Key> = rest.keys().cloned().collect();
        let mut leads = Vec::new();
        let mut out_coeffs = Vec::new();
        let mut work = 0usize;
        while let Some(lead) = heap.pop() {
            let Some(c) = rest.remove(&lead) else {
                continue;
            };
            let element = self.element(basis, &lead, job)?;
            let Some(values) = C::view(&element) else {
                return Ok(None);
            };
            // the leading term, c * 1 * x^lead, is the one just removed
            if !subtract(&mut rest, &mut heap, &c, &element.keys[1..], &values[1..]) {
                return Ok(None);
            }
            work += element.keys.len();
            if work >= 4096 {
                job.checkpoint(work as u64)?;
                work = 0;
            }
            leads.push(lead);
            out_coeffs.push(c);
        }
        let mut exps = vec![0i64; leads.len() * self.nvars];
        for (row, lead) in exps.chunks_exact_mut(self.nvars.max(1)).zip(&leads) {
            self.decode(lead, &mut row[..self.nvars]);
        }
        Ok(Some(Terms {
            nvars: self.nvars,
            exps,
            coeffs: C::into_coeffs(out_coeffs),
        }))
    }
}

/// rest -= c * (the terms keys, values), pushing keys new to `rest` onto `heap`; false when a
/// coefficient overflows C.
fn subtract<Key: Clone + Ord + std::hash::Hash, C: Coeff>(
    rest: &mut KeyMap<Key, C>,
    heap: &mut BinaryHeap<Key>,
    c: &C,
    keys: &[Key],
    values: &[C],
) -> bool {
    for (k, b) in keys.iter().zip(values) {
        let Some(cb) = c.checked_mul(b) else {
            return false;
        };
        match rest.entry(k.clone()) {
            Entry::Occupied(mut slot) => {
                if !slot.get_mut().add_signed(&cb, true) {
                    return false;
                }
                if slot.get().is_zero() {
                    slot.remove();
                }
            }
            Entry::Vacant(slot) => {
                let mut v = C::zero();
                if !v.add_signed(&cb, true) {
                    return false;
                }
                slot.insert(v);
                heap.push(k.clone());
            }
        }
    }
    true
}

/// The packings, chosen once per cache from the bound on the exponents.
enum Store {
    Narrow(Shelf<Packed<u64>>),
    Wide(Shelf<Packed<u128>>),
    Rows(Shelf<Rows>),
}

/// Basis elements shared across many expansions in one basis, number of variables and bound
/// on the exponents. Thread-safe: a batch expands its polynomials on rayon threads, all
/// reading and filling one cache; results do not depend on what the cache held before.
pub struct ExpansionCache {
    basis: Basis,
    nvars: usize,
    max_exponent: i64,
    store: Store,
}

impl ExpansionCache {
    /// A cache for polynomials in `nvars` variables with exponents in 0..=max_exponent.
    pub fn new(basis: Basis, nvars: usize, max_exponent: i64) -> Result<ExpansionCache, Error> {
        if max_exponent < 0 {
            return Err(Error::invalid(format!(
                "max_exponent must be non-negative; got {max_exponent}"
            )));
        }
        let store = if let Some(p) = Packed::<u64>::new(nvars, max_exponent) {
            Store::Narrow(Shelf::new(p, nvars))
        } else if let Some(p) = Packed::<u128>::new(nvars, max_exponent) {
            Store::Wide(Shelf::new(p, nvars))
        } else {
            Store::Rows(Shelf::new(Rows, nvars))
        };
        Ok(ExpansionCache {
            basis,
            nvars,
            max_exponent,
            store,
        })
    }

    pub fn basis(&self) -> Basis {
        self.basis
    }

    pub fn nvars(&self) -> usize {
        self.nvars
    }

    pub fn max_exponent(&self) -> i64 {
        self.max_exponent
    }

    /// The number of basis elements held.
    pub fn len(&self) -> usize {
        fn count<K: Codec>(s: &Shelf<K>) -> usize {
            s.elements
                .read()
                .unwrap_or_else(PoisonError::into_inner)
                .len()
        }
        match &self.store {
            Store::Narrow(s) => count(s),
            Store::Wide(s) => count(s),
            Store::Rows(s) => count(s),
        }
    }

    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// The coefficients c_alpha of f = sum c_alpha b_alpha (b the basis) as `Terms`: one row
    /// alpha per nonzero coefficient, in decreasing reverse lexicographic order.
    ///
    /// Cost: one hash-map update per term of each basis element subtracted, plus computing
    /// each element not yet cached (`key`, `atom`).
    pub fn expand(&self, f: &Terms, job: &Job) -> Result<Terms, Error> {
        self.check(f)?;
        match &self.store {
            Store::Narrow(s) => s.expand(self.basis, f, job),
            Store::Wide(s) => s.expand(self.basis, f, job),
            Store::Rows(s) => s.expand(self.basis, f, job),
        }
    }

    /// `expand` of each polynomial, in input order, on rayon threads when the batch is large
    /// enough to pay for them.
    pub fn expand_all(&self, polys: &[Terms], job: &Job) -> Result<Vec<Terms>, Error> {
        let terms: usize = polys.iter().map(Terms::len).sum();
        if polys.len() > 1 && terms >= PARALLEL_TERMS {
            polys.par_iter().map(|f| self.expand(f, job)).collect()
        } else {
            polys.iter().map(|f| self.expand(f, job)).collect()
        }
    }

    fn check(&self, f: &Terms) -> Result<(), Error> {
        if f.nvars != self.nvars {
            return Err(Error::invalid(format!(
                "the polynomial must have nvars={} like the cache; got {}",
                self.nvars, f.nvars
            )));
        }
        if let Some(&e) = f.exps.iter().find(|&&e| e < 0 || e > self.max_exponent) {
            return Err(Error::invalid(if e < 0 {
                format!("the polynomial must have non-negative exponents; got {e}")
            } else {
                format!(
                    "the polynomial's exponents must be at most the cache's max_exponent={}; got {e}",
                    self.max_exponent
                )
            }));
        }
        Ok(())
    }
}

/// The expansion of one polynomial in `basis` (see `ExpansionCache::expand`).
pub fn expand(f: &Terms, basis: Basis, job: &Job) -> Result<Terms, Error> {
    let max = f.exps.iter().copied().max().unwrap_or(0).max(0);
    ExpansionCache::new(basis, f.nvars, max)?.expand(f, job)
}

#[cfg(test)]
mod tests;
