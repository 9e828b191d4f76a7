//! The basis elements of a `Shelf`: looked up, built from a cached neighbour by one operator
//! step, checked to lead with x^alpha and coefficient 1, and stored while there is room.
#![deny(unsafe_code)]

use super::widths::{Element, ElementCoeffs};
use super::{internal, Basis, Shelf, CACHE_TERMS};
use crate::error::Error;
use crate::job::Job;
use crate::poly::codec::Codec;
use crate::poly::{apply_operator, CoeffVec, Terms};
use std::sync::atomic::Ordering;
use std::sync::{Arc, PoisonError};

impl<K: Codec> Shelf<K> {
    fn cached(&self, lead: &K::Key) -> Option<Arc<Element<K::Key>>> {
        let elements = self.elements.read().unwrap_or_else(PoisonError::into_inner);
        elements.get(lead).cloned()
    }

    /// Keeps `element` under `lead` if the cache has room; the shared copy either way.
    fn store(&self, lead: &K::Key, element: Element<K::Key>) -> Arc<Element<K::Key>> {
        let element = Arc::new(element);
        let size = element.keys.len();
        if self.stored_terms.fetch_add(size, Ordering::Relaxed) + size <= CACHE_TERMS {
            let mut elements = self
                .elements
                .write()
                .unwrap_or_else(PoisonError::into_inner);
            return Arc::clone(elements.entry(lead.clone()).or_insert(element));
        }
        self.stored_terms.fetch_sub(size, Ordering::Relaxed);
        element
    }

    /// The basis element led by `lead`, from the cache or computed (and stored if there is
    /// room). b_alpha = x^alpha for weakly decreasing alpha, else op_j b_(s_j alpha) with j the
    /// last ascent of alpha and op_j = pi_j (keys) or pi_j - 1 (atoms) (Lascoux and
    /// Schutzenberger, "Keys and standard bases", 1990): one operator step from the element of
    /// s_j alpha, itself cached, instead of one step per inversion of alpha. The chain down to
    /// a cached element is walked in a loop, not by recursion, so its length never matters.
    pub(super) fn element(
        &self,
        basis: Basis,
        lead: &K::Key,
        job: &Job,
    ) -> Result<Arc<Element<K::Key>>, Error> {
        if let Some(element) = self.cached(lead) {
            return Ok(element);
        }
        let mut buf = vec![0i64; self.nvars];
        let mut alpha = vec![0i64; self.nvars];
        self.decode(lead, &mut alpha);
        let mut chain = Vec::new(); // (key, composition, ascent), from alpha down
        let mut key = lead.clone();
        let mut found = None;
        while let Some(j) = (0..self.nvars.saturating_sub(1)).rfind(|&j| alpha[j] < alpha[j + 1]) {
            let below = {
                let mut b = alpha.clone();
                b.swap(j, j + 1);
                b
            };
            chain.push((key, std::mem::replace(&mut alpha, below), j));
            key = self.encode(&alpha, &mut buf);
            found = self.cached(&key);
            if found.is_some() {
                break;
            }
        }
        let mut current = match found {
            Some(element) => element,
            None => self.store(&key, self.build(&Terms::monomial(&alpha), &key, &alpha)?),
        };
        for (key, alpha, j) in chain.into_iter().rev() {
            let image = apply_operator(&self.terms_of(&current), basis.operator(), j + 1, job)?;
            current = self.store(&key, self.build(&image, &key, &alpha)?);
        }
        Ok(current)
    }

    /// A cached element as plain terms (rows in x_1..x_n order).
    fn terms_of(&self, element: &Element<K::Key>) -> Terms {
        let mut exps = vec![0i64; element.keys.len() * self.nvars];
        for (row, key) in exps.chunks_exact_mut(self.nvars.max(1)).zip(&element.keys) {
            self.decode(key, &mut row[..self.nvars]);
        }
        Terms {
            nvars: self.nvars,
            exps,
            coeffs: element.coeffs.to_coeff_vec(),
        }
    }

    /// Sorts a basis element's terms by decreasing revlex key and checks that x^alpha leads
    /// with coefficient 1: the fact the whole peeling rests on.
    fn build(&self, terms: &Terms, lead: &K::Key, alpha: &[i64]) -> Result<Element<K::Key>, Error> {
        let largest = alpha.iter().copied().max().unwrap_or(0);
        if terms.exps.iter().any(|&e| e < 0 || e > largest) {
            // the packing holds exponents up to the input's largest, which bounds alpha's parts
            return Err(internal(&format!(
                "the basis element of {alpha:?} has an exponent outside 0..={largest}"
            )));
        }
        let mut buf = vec![0i64; self.nvars];
        let keys: Vec<K::Key> = terms.rows().map(|row| self.encode(row, &mut buf)).collect();
        let order = self.codec.order_descending(&keys);
        let keys: Vec<K::Key> = order.iter().map(|&t| keys[t].clone()).collect();
        let coeffs = match &terms.coeffs {
            CoeffVec::Small(v) => {
                let wide: Vec<i128> = order.iter().map(|&t| v[t]).collect();
                match wide.iter().map(|&c| i64::try_from(c)).collect() {
                    Ok(narrow) => ElementCoeffs::Narrow(narrow),
                    Err(_) => ElementCoeffs::Wide(wide),
                }
            }
            CoeffVec::Big(v) => ElementCoeffs::Big(order.iter().map(|&t| v[t].clone()).collect()),
        };
        if keys.first() != Some(lead) || !coeffs.leads_with_one() {
            return Err(internal(&format!(
                "the basis element of {alpha:?} does not lead with x^alpha and coefficient 1, so \
                 peeling would not remove the leading term"
            )));
        }
        Ok(Element { keys, coeffs })
    }
}
