//! Exact coefficient arithmetic: the integer widths the kernels count in, narrowest first, and the
//! retry at the next width when a checked sum overflows.
#![deny(unsafe_code)]

use crate::error::Error;
use num_bigint::BigUint;

/// The integer type a count is accumulated in.
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord)]
pub(crate) enum Width {
    U32,
    U64,
    U128,
    Big,
}

impl Width {
    /// The narrowest width that holds every number of `bits` bits.
    pub(crate) fn for_bits(bits: u64) -> Width {
        match bits {
            0..=32 => Width::U32,
            33..=64 => Width::U64,
            65..=128 => Width::U128,
            _ => Width::Big,
        }
    }

    pub(crate) fn wider(self) -> Option<Width> {
        match self {
            Width::U32 => Some(Width::U64),
            Width::U64 => Some(Width::U128),
            Width::U128 => Some(Width::Big),
            Width::Big => None,
        }
    }

    /// Bytes per stored value of at most `bits` bits, for memory estimates. A big integer is its
    /// 24-byte header plus its limbs and some allocator overhead.
    pub(crate) fn bytes(self, bits: u64) -> u128 {
        match self {
            Width::U32 => 4,
            Width::U64 => 8,
            Width::U128 => 16,
            Width::Big => 24 + 16 + 8 * u128::from(bits.div_ceil(64)),
        }
    }
}

/// Why an attempt at one width stopped: a sum overflowed (retry wider), or a real error.
#[derive(Debug)]
pub(crate) enum Halt {
    Overflow,
    Fail(Error),
}

impl From<Error> for Halt {
    fn from(e: Error) -> Self {
        Halt::Fail(e)
    }
}

/// A count type with overflow-checked addition.
pub(crate) trait Coeff: Clone + Send + Sync + 'static {
    fn zero() -> Self;
    fn one() -> Self;
    fn is_zero(&self) -> bool;
    fn is_one(&self) -> bool;
    /// `self += other`; true if the sum overflowed (then `self` is meaningless).
    fn add_checked(&mut self, other: &Self) -> bool;
    /// `dst[i] += src[i]` for all i (equal lengths); true if some sum overflowed.
    fn add_slice(dst: &mut [Self], src: &[Self]) -> bool;
    /// `dst[i] += factor * src[i]` for all i (equal lengths); true if something overflowed.
    fn mul_add_slice(dst: &mut [Self], src: &[Self], factor: &Self) -> bool;
    fn to_big(&self) -> BigUint;
}

macro_rules! machine_coeff {
    ($t:ty) => {
        impl Coeff for $t {
            fn zero() -> Self {
                0
            }
            fn one() -> Self {
                1
            }
            fn is_zero(&self) -> bool {
                *self == 0
            }
            fn is_one(&self) -> bool {
                *self == 1
            }
            fn add_checked(&mut self, other: &Self) -> bool {
                let (sum, over) = self.overflowing_add(*other);
                *self = sum;
                over
            }
            #[inline]
            fn add_slice(dst: &mut [Self], src: &[Self]) -> bool {
                // Branch-free so that the loop vectorises; the flag is read once at the end.
                let mut over = false;
                for (d, s) in dst.iter_mut().zip(src) {
                    let (sum, o) = d.overflowing_add(*s);
                    *d = sum;
                    over |= o;
                }
                over
            }
            #[inline]
            fn mul_add_slice(dst: &mut [Self], src: &[Self], factor: &Self) -> bool {
                let mut over = false;
                for (d, s) in dst.iter_mut().zip(src) {
                    let (product, o1) = s.overflowing_mul(*factor);
                    let (sum, o2) = d.overflowing_add(product);
                    *d = sum;
                    over |= o1 | o2;
                }
                over
            }
            fn to_big(&self) -> BigUint {
                BigUint::from(*self)
            }
        }
    };
}

#[cfg(test)]
machine_coeff!(u8);
machine_coeff!(u32);
machine_coeff!(u64);
machine_coeff!(u128);

impl Coeff for BigUint {
    fn zero() -> Self {
        BigUint::ZERO
    }
    fn one() -> Self {
        BigUint::from(1u32)
    }
    fn is_zero(&self) -> bool {
        self.bits() == 0
    }
    fn is_one(&self) -> bool {
        *self == BigUint::from(1u32)
    }
    fn add_checked(&mut self, other: &Self) -> bool {
        *self += other;
        false
    }
    fn add_slice(dst: &mut [Self], src: &[Self]) -> bool {
        for (d, s) in dst.iter_mut().zip(src) {
            *d += s;
        }
        false
    }
    fn mul_add_slice(dst: &mut [Self], src: &[Self], factor: &Self) -> bool {
        for (d, s) in dst.iter_mut().zip(src) {
            if s.bits() > 0 {
                *d += s * factor;
            }
        }
        false
    }
    fn to_big(&self) -> BigUint {
        self.clone()
    }
}

/// Runs `attempt` at width `start` and, each time a checked sum overflows, again one width wider.
/// Big integers never overflow, so this ends.
pub(crate) fn with_fallback<T>(
    start: Width,
    mut attempt: impl FnMut(Width) -> Result<T, Halt>,
) -> Result<T, Error> {
    let mut width = start;
    loop {
        match attempt(width) {
            Ok(value) => return Ok(value),
            Err(Halt::Fail(e)) => return Err(e),
            Err(Halt::Overflow) => {
                width = width.wider().expect("big-integer sums report no overflow");
            }
        }
    }
}

/// Counts work done and calls `job.checkpoint` once per `EVERY` items, so that a kernel polls the
/// stop flag often enough for Ctrl-C without an atomic operation per item.
#[derive(Debug, Default)]
pub(crate) struct Ticker {
    pending: u64,
}

impl Ticker {
    const EVERY: u64 = 4096;

    #[inline]
    pub(crate) fn tick(&mut self, job: &crate::job::Job, items: usize) -> Result<(), Error> {
        self.pending += items as u64;
        if self.pending >= Self::EVERY {
            let done = std::mem::take(&mut self.pending);
            job.checkpoint(done)?;
        }
        Ok(())
    }
}
