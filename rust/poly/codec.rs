//! Monomial keys: exponent rows packed into one `u128` when they fit, plain rows otherwise.
//!
//! Packing puts x_1 in the most significant field, so that the numeric order of packed keys is
//! the lexicographic order of the exponent rows (all fields are non-negative and equally wide).
#![deny(unsafe_code)]

use std::hash::{BuildHasherDefault, Hash, Hasher};
use std::ops::{BitAnd, BitOr, Not, Shl, Shr};

/// An unsigned machine word that holds packed exponent fields.
pub trait Word:
    Copy
    + Hash
    + Ord
    + Send
    + Sync
    + BitAnd<Output = Self>
    + BitOr<Output = Self>
    + Not<Output = Self>
    + Shl<u32, Output = Self>
    + Shr<u32, Output = Self>
{
    const BITS: u32;
    const ZERO: Self;
    fn from_u64(x: u64) -> Self;
    /// The low 64 bits.
    fn low_u64(self) -> u64;
    /// 2^width - 1, for 1 <= width <= 64.
    fn mask(width: u32) -> Self;
    fn checked_add(self, other: &Self) -> Option<Self>;
}

macro_rules! word {
    ($t:ty) => {
        impl Word for $t {
            const BITS: u32 = <$t>::BITS;
            const ZERO: Self = 0;
            fn from_u64(x: u64) -> Self {
                <$t>::from(x)
            }
            #[allow(clippy::cast_possible_truncation)] // taking the low half on purpose
            fn low_u64(self) -> u64 {
                self as u64
            }
            fn mask(width: u32) -> Self {
                <$t>::MAX >> (<$t>::BITS - width)
            }
            fn checked_add(self, other: &Self) -> Option<Self> {
                <$t>::checked_add(self, *other)
            }
        }
    };
}

word!(u64);
word!(u128);

/// How exponent rows of `n` entries become hashable, ordered keys and back.
pub trait Codec: Sync {
    type Key: Clone + Hash + Eq + Ord + Send + Sync;
    /// Whether every key holds non-negative exponents only.
    const NON_NEGATIVE: bool;
    fn encode(&self, row: &[i64]) -> Self::Key;
    fn decode(&self, key: &Self::Key, row: &mut [i64]);
    /// The exponents of x_j and x_{j+1} (j 0-based).
    fn pair(&self, key: &Self::Key, j: usize) -> (i64, i64);
    /// `key` with the exponents of x_j and x_{j+1} replaced by p and q.
    fn with_pair(&self, key: &Self::Key, j: usize, p: i64, q: i64) -> Self::Key;
    /// The key of the product of two monomials, or None if an exponent leaves its range.
    fn multiply(&self, a: &Self::Key, b: &Self::Key) -> Option<Self::Key>;
    /// A key naming the line of monomials equal to `key` off x_j, x_{j+1} and of degree `total`
    /// in those two; only for codecs with `NON_NEGATIVE`, where 0 <= total <= 2 * max.
    fn line_key(&self, key: &Self::Key, j: usize, total: i64) -> Self::Key {
        self.with_pair(key, j, total, 0)
    }
    /// The positions of `keys` in decreasing key order (the keys are distinct).
    fn order_descending(&self, keys: &[Self::Key]) -> Vec<usize> {
        let mut order: Vec<usize> = (0..keys.len()).collect();
        order.sort_unstable_by(|&x, &y| keys[y].cmp(&keys[x]));
        order
    }
}

/// Rows of non-negative exponents below 2^width packed into a word W (u64 or u128),
/// n * width <= W::BITS.
#[derive(Debug, Clone, Copy)]
pub struct Packed<W> {
    n: usize,
    width: u32,
    field: W,
}

impl<W: Word> Packed<W> {
    /// A packing for rows of `n` exponents in 0..=max, or None if they do not fit in 128 bits.
    pub fn new(n: usize, max: i64) -> Option<Packed<W>> {
        let max = u64::try_from(max).ok()?;
        let width = (u64::BITS - max.leading_zeros()).max(1);
        let bits = u32::try_from(n).ok()?.checked_mul(width)?;
        (bits <= W::BITS && n > 0).then(|| Packed {
            n,
            width,
            field: W::mask(width),
        })
    }

    #[inline]
    fn shift(&self, j: usize) -> u32 {
        // j < n and n * width <= 128, so the product fits in a u32
        u32::try_from(self.n - 1 - j).expect("j < n <= 128") * self.width
    }
}

impl<W: Word> Codec for Packed<W> {
    type Key = W;
    const NON_NEGATIVE: bool = true;

    fn encode(&self, row: &[i64]) -> W {
        row.iter().fold(W::ZERO, |acc, &e| {
            // the caller checked 0 <= e < 2^width
            (acc << self.width) | W::from_u64(e.unsigned_abs())
        })
    }

    fn decode(&self, key: &W, row: &mut [i64]) {
        for (j, slot) in row.iter_mut().enumerate() {
            let field = ((*key >> self.shift(j)) & self.field).low_u64();
            *slot = i64::try_from(field).expect("a field is at most 64 bits wide and below max");
        }
    }

    #[inline]
    fn pair(&self, key: &W, j: usize) -> (i64, i64) {
        let get =
            |s: u32| i64::try_from(((*key >> s) & self.field).low_u64()).expect("field below max");
        (get(self.shift(j)), get(self.shift(j + 1)))
    }

    #[inline]
    fn with_pair(&self, key: &W, j: usize, p: i64, q: i64) -> W {
        let (sp, sq) = (self.shift(j), self.shift(j + 1));
        let cleared = *key & !((self.field << sp) | (self.field << sq));
        cleared | (W::from_u64(p.unsigned_abs()) << sp) | (W::from_u64(q.unsigned_abs()) << sq)
    }

    #[inline]
    fn multiply(&self, a: &W, b: &W) -> Option<W> {
        // the caller chose a width that holds every sum of exponents, so fields never carry
        a.checked_add(b)
    }

    /// The two fields of x_j and x_{j+1} are adjacent: together they hold any total < 2^(width+1).
    #[inline]
    fn line_key(&self, key: &W, j: usize, total: i64) -> W {
        let cleared = self.with_pair(key, j, 0, 0);
        cleared | (W::from_u64(total.unsigned_abs()) << self.shift(j + 1))
    }

    /// LSD radix sort on bytes, over the n * width bits in use (Knuth, TAOCP vol. 3, 5.2.5):
    /// a few linear passes instead of a comparison sort's log(terms) ones.
    fn order_descending(&self, keys: &[W]) -> Vec<usize> {
        let bits = u32::try_from(self.n).expect("n <= 128") * self.width;
        let mut order: Vec<usize> = (0..keys.len()).collect();
        let mut spare = vec![0usize; keys.len()];
        for pass in 0..bits.div_ceil(8) {
            let digit = |k: usize| 255 - ((keys[k] >> (8 * pass)).low_u64() & 0xFF) as usize;
            let mut counts = [0usize; 257];
            for &k in &order {
                counts[digit(k) + 1] += 1;
            }
            for d in 0..256 {
                counts[d + 1] += counts[d];
            }
            for &k in &order {
                let d = digit(k);
                spare[counts[d]] = k;
                counts[d] += 1;
            }
            std::mem::swap(&mut order, &mut spare);
        }
        order
    }
}

/// Plain exponent rows (Laurent exponents allowed, any length), for what does not pack.
#[derive(Debug, Clone, Copy)]
pub struct Rows;

impl Codec for Rows {
    type Key = Box<[i64]>;
    const NON_NEGATIVE: bool = false;

    fn encode(&self, row: &[i64]) -> Box<[i64]> {
        row.into()
    }

    fn decode(&self, key: &Box<[i64]>, row: &mut [i64]) {
        row.copy_from_slice(key);
    }

    fn pair(&self, key: &Box<[i64]>, j: usize) -> (i64, i64) {
        (key[j], key[j + 1])
    }

    fn with_pair(&self, key: &Box<[i64]>, j: usize, p: i64, q: i64) -> Box<[i64]> {
        let mut out = key.clone();
        out[j] = p;
        out[j + 1] = q;
        out
    }

    fn multiply(&self, a: &Box<[i64]>, b: &Box<[i64]>) -> Option<Box<[i64]>> {
        a.iter()
            .zip(b.iter())
            .map(|(x, y)| x.checked_add(*y))
            .collect()
    }
}

/// A multiply-rotate hasher for keys that are already well spread integers (the keys above);
/// std's SipHash would cost more than the rest of an operator step.
#[derive(Debug, Default, Clone, Copy)]
pub struct KeyHasher(u64);

const SPREAD: u64 = 0x9E37_79B9_7F4A_7C15; // 2^64 / golden ratio (Knuth, TAOCP vol. 3, 6.4)

impl Hasher for KeyHasher {
    fn finish(&self) -> u64 {
        // the product's high bits mix every input bit; hash tables index by the low ones
        let h = (self.0 ^ (self.0 >> 32)).wrapping_mul(SPREAD);
        h ^ (h >> 29)
    }

    fn write(&mut self, bytes: &[u8]) {
        for &b in bytes {
            self.write_u64(u64::from(b));
        }
    }

    #[inline]
    fn write_u64(&mut self, word: u64) {
        self.0 = (self.0.rotate_left(5) ^ word).wrapping_mul(SPREAD);
    }

    #[inline]
    fn write_i64(&mut self, word: i64) {
        self.write_u64(u64::from_ne_bytes(word.to_ne_bytes()));
    }

    #[inline]
    fn write_u128(&mut self, word: u128) {
        #[allow(clippy::cast_possible_truncation)] // splitting into halves on purpose
        let (lo, hi) = (word as u64, (word >> 64) as u64);
        self.write_u64(lo);
        self.write_u64(hi);
    }

    #[inline]
    fn write_usize(&mut self, word: usize) {
        self.write_u64(word as u64);
    }
}

pub type KeyMap<K, C> = std::collections::HashMap<K, C, BuildHasherDefault<KeyHasher>>;
