//! The coefficient widths of the peeling (i64, then i128, then BigInt) and the cached basis
//! elements' coefficients in each.
#![deny(unsafe_code)]

use super::super::coeff::{Coeff, CoeffVec};
use num_bigint::BigInt;
use std::borrow::Cow;

/// Coefficients of a cached basis element, in the narrowest width that holds them.
pub(super) enum ElementCoeffs {
    Narrow(Vec<i64>),
    Wide(Vec<i128>),
    Big(Vec<BigInt>),
}

impl ElementCoeffs {
    pub fn to_coeff_vec(&self) -> CoeffVec {
        match self {
            ElementCoeffs::Narrow(v) => CoeffVec::Small(v.iter().map(|&c| i128::from(c)).collect()),
            ElementCoeffs::Wide(v) => CoeffVec::Small(v.clone()),
            ElementCoeffs::Big(v) => CoeffVec::Big(v.clone()),
        }
    }

    /// Whether the first coefficient is 1.
    pub fn leads_with_one(&self) -> bool {
        match self {
            ElementCoeffs::Narrow(v) => v.first() == Some(&1),
            ElementCoeffs::Wide(v) => v.first() == Some(&1),
            ElementCoeffs::Big(v) => v.first() == Some(&BigInt::from(1)),
        }
    }
}

/// A basis element: revlex keys in decreasing order (its leading term first) and coefficients.
pub(super) struct Element<Key> {
    pub keys: Vec<Key>,
    pub coeffs: ElementCoeffs,
}

/// Coefficient widths the peeling runs in: i64, then i128, then BigInt.
pub(super) trait PeelCoeff: Coeff {
    /// The input's coefficients, or None if one does not fit.
    fn from_input(coeffs: &CoeffVec) -> Option<Vec<Self>>;
    /// An element's coefficients, or None if one does not fit.
    fn view<K>(element: &Element<K>) -> Option<Cow<'_, [Self]>>;
    fn into_coeffs(values: Vec<Self>) -> CoeffVec;
}

impl PeelCoeff for i64 {
    fn from_input(coeffs: &CoeffVec) -> Option<Vec<i64>> {
        match coeffs {
            CoeffVec::Small(v) => v.iter().map(|&c| i64::try_from(c).ok()).collect(),
            CoeffVec::Big(_) => None,
        }
    }
    fn view<K>(element: &Element<K>) -> Option<Cow<'_, [i64]>> {
        match &element.coeffs {
            ElementCoeffs::Narrow(v) => Some(Cow::Borrowed(v)),
            _ => None,
        }
    }
    fn into_coeffs(values: Vec<i64>) -> CoeffVec {
        CoeffVec::Small(values.into_iter().map(i128::from).collect())
    }
}

impl PeelCoeff for i128 {
    fn from_input(coeffs: &CoeffVec) -> Option<Vec<i128>> {
        match coeffs {
            CoeffVec::Small(v) => Some(v.clone()),
            CoeffVec::Big(_) => None,
        }
    }
    fn view<K>(element: &Element<K>) -> Option<Cow<'_, [i128]>> {
        match &element.coeffs {
            ElementCoeffs::Narrow(v) => {
                Some(Cow::Owned(v.iter().map(|&c| i128::from(c)).collect()))
            }
            ElementCoeffs::Wide(v) => Some(Cow::Borrowed(v)),
            ElementCoeffs::Big(_) => None,
        }
    }
    fn into_coeffs(values: Vec<i128>) -> CoeffVec {
        CoeffVec::Small(values)
    }
}

impl PeelCoeff for BigInt {
    fn from_input(coeffs: &CoeffVec) -> Option<Vec<BigInt>> {
        Some(coeffs.to_big())
    }
    fn view<K>(element: &Element<K>) -> Option<Cow<'_, [BigInt]>> {
        Some(match &element.coeffs {
            ElementCoeffs::Narrow(v) => Cow::Owned(v.iter().map(|&c| BigInt::from(c)).collect()),
            ElementCoeffs::Wide(v) => Cow::Owned(v.iter().map(|&c| BigInt::from(c)).collect()),
            ElementCoeffs::Big(v) => Cow::Borrowed(v),
        })
    }
    fn into_coeffs(values: Vec<BigInt>) -> CoeffVec {
        CoeffVec::Big(values).narrowed()
    }
}
