//! Exact coefficients: `i128` with checked arithmetic first, `BigInt` when a sum overflows.
#![deny(unsafe_code)]

use num_bigint::BigInt;

/// A coefficient ring for the kernels: exact integers of some width.
pub trait Coeff: Clone + Send + Sync {
    fn zero() -> Self;
    fn is_zero(&self) -> bool;
    /// `self += sign * other`; false when the result does not fit (the caller widens).
    fn add_signed(&mut self, other: &Self, negative: bool) -> bool;
    /// `self * other`, or None when it does not fit.
    fn checked_mul(&self, other: &Self) -> Option<Self>;
}

macro_rules! machine_coeff {
    ($t:ty) => {
        impl Coeff for $t {
            fn zero() -> Self {
                0
            }
            fn is_zero(&self) -> bool {
                *self == 0
            }
            #[inline]
            fn add_signed(&mut self, other: &Self, negative: bool) -> bool {
                let sum = if negative {
                    self.checked_sub(*other)
                } else {
                    self.checked_add(*other)
                };
                sum.map(|s| *self = s).is_some()
            }
            fn checked_mul(&self, other: &Self) -> Option<Self> {
                <$t>::checked_mul(*self, *other)
            }
        }
    };
}

// i64 first (half the memory traffic of i128), then i128, then BigInt.
machine_coeff!(i64);
machine_coeff!(i128);

impl Coeff for BigInt {
    fn zero() -> Self {
        BigInt::ZERO
    }
    fn is_zero(&self) -> bool {
        *self == BigInt::ZERO
    }
    fn add_signed(&mut self, other: &Self, negative: bool) -> bool {
        if negative {
            *self -= other;
        } else {
            *self += other;
        }
        true
    }
    fn checked_mul(&self, other: &Self) -> Option<Self> {
        Some(self * other)
    }
}

/// Coefficients of a result, in the narrowest type that held every step exactly.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum CoeffVec {
    Small(Vec<i128>),
    Big(Vec<BigInt>),
}

impl CoeffVec {
    pub fn len(&self) -> usize {
        match self {
            CoeffVec::Small(v) => v.len(),
            CoeffVec::Big(v) => v.len(),
        }
    }

    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// Every coefficient as a big integer (for comparisons and for widening).
    pub fn to_big(&self) -> Vec<BigInt> {
        match self {
            CoeffVec::Small(v) => v.iter().map(|&c| BigInt::from(c)).collect(),
            CoeffVec::Big(v) => v.clone(),
        }
    }

    /// The narrowest form: `Small` when every coefficient fits in an i128.
    #[must_use]
    pub fn narrowed(self) -> CoeffVec {
        match self {
            CoeffVec::Small(v) => CoeffVec::Small(v),
            CoeffVec::Big(v) => match v
                .iter()
                .map(|c| i128::try_from(c).ok())
                .collect::<Option<Vec<_>>>()
            {
                Some(small) => CoeffVec::Small(small),
                None => CoeffVec::Big(v),
            },
        }
    }
}
