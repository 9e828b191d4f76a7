//! Count types for the Littlewood-Richardson count: a fixed-width integer first, BigUint when
//! that overflows. The count only ever adds non-negative multiplicities.
#![deny(unsafe_code)]

use num_bigint::BigUint;

/// A non-negative exact count that can be added to, with overflow reported.
pub trait Count: Clone {
    fn zero() -> Self;
    fn one() -> Self;
    /// `self += other`; false (and `self` unspecified) on overflow: the caller reruns wider.
    fn add_checked(&mut self, other: &Self) -> bool;
}

macro_rules! fixed_width_count {
    ($($t:ty),*) => {$(
        impl Count for $t {
            fn zero() -> Self {
                0
            }
            fn one() -> Self {
                1
            }
            fn add_checked(&mut self, other: &Self) -> bool {
                self.checked_add(*other).map(|s| *self = s).is_some()
            }
        }
    )*};
}

// u8 lets the tests force the wide rerun on small cases
fixed_width_count!(u8, u64, u128);

impl Count for BigUint {
    fn zero() -> Self {
        BigUint::ZERO
    }
    fn one() -> Self {
        BigUint::from(1u8)
    }
    fn add_checked(&mut self, other: &Self) -> bool {
        *self += other;
        true
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn overflow_is_reported() {
        let mut a = 250u8;
        assert!(a.add_checked(&5) && a == 255);
        assert!(!a.add_checked(&1));
        let mut b = BigUint::from(u128::MAX);
        assert!(b.add_checked(&BigUint::one()));
        assert_eq!(b, BigUint::from(2u8).pow(128)); // 2^128 = (2^128 - 1) + 1
    }
}
