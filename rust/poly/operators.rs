//! One application of pi_i, pi_i - 1 or d_i, monomial by monomial, by closed forms.
#![deny(unsafe_code)]

use super::codec::{Codec, KeyMap};
use super::coeff::Coeff;
use super::Operator;
use crate::error::Error;
use crate::job::Job;

/// Terms as (key, coefficient) pairs, in no particular order, coefficients nonzero.
pub type TermList<K, C> = Vec<(K, C)>;

/// Results past this many terms are refused: about 10 GB of map at 40 bytes a term.
pub const MAX_TERMS: usize = 1 << 28;

/// Lines (see `Line`) are dense over 0..=total, so they serve exponents up to this bound; larger
/// ones go through the hash map, which costs nothing for the exponents that do not occur.
pub const MAX_LINE_EXPONENT: i64 = 1 << 16;

/// The image of the monomial with x_i^a x_{i+1}^b (other variables untouched): the sum, with
/// sign `negative`, of x_i^p x_{i+1}^(a + b + shift - p) for p in lo..=hi (empty if lo > hi).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Image {
    pub lo: i64,
    pub hi: i64,
    pub shift: i64,
    pub negative: bool,
}

/// The closed forms, from the geometric sum (x^m - y^m)/(x - y) = sum of x^(m-1-k) y^k:
///
/// - pi_i: for a >= b, x_i^a x_{i+1}^b + ... + x_i^b x_{i+1}^a (p in b..=a); for a < b, minus
///   the terms with p in a+1..=b-1 (zero when b = a + 1).
/// - pi_i - 1: p in b..=a-1 for a >= b (zero when a = b); minus p in a..=b-1 for a < b.
/// - d_i (degree one lower): p in b..=a-1 for a > b; zero for a = b; minus p in a..=b-1, with
///   q = a + b - 1 - p, for a < b.
///
/// Sources: Lascoux and Schutzenberger, "Keys and standard bases", 1990 (pi_i and pi_i - 1);
/// Macdonald, Notes on Schubert Polynomials, 1991, (2.2) and (2.4) (d_i, and pi_i = d_i x_i).
/// None when a + b overflows.
pub fn image(op: Operator, a: i64, b: i64) -> Option<Image> {
    let (lo, hi, negative) = match (op, a >= b) {
        (Operator::Isobaric, true) => (b, a, false),
        (Operator::Isobaric, false) => (a.checked_add(1)?, b.checked_sub(1)?, true),
        (Operator::Atom | Operator::Divided, true) => (b, a.checked_sub(1)?, false),
        (Operator::Atom | Operator::Divided, false) => (a, b.checked_sub(1)?, true),
    };
    let shift = if op == Operator::Divided { -1 } else { 0 };
    a.checked_add(b)?.checked_add(shift)?;
    Some(Image {
        lo,
        hi,
        shift,
        negative,
    })
}

fn too_large() -> Error {
    Error::TooLarge {
        what: "this polynomial operator".into(),
        bytes: 40 * MAX_TERMS as u128,
        instead: "apply it to fewer terms, e.g. to each term separately".into(),
    }
}

fn overflow() -> Error {
    Error::invalid("exponents must be far from the int64 limits for this operator")
}

/// `op` on x_j, x_{j+1} by one hash-map update per image term: any exponents (Laurent too).
/// Ok(None) means a coefficient overflowed `C`; zero results are dropped.
pub fn apply_hashed<K: Codec, C: Coeff>(
    codec: &K,
    terms: &[(K::Key, C)],
    op: Operator,
    j: usize,
    job: &Job,
) -> Result<Option<TermList<K::Key, C>>, Error> {
    let mut out: KeyMap<K::Key, C> = KeyMap::default();
    let mut produced: u128 = 0;
    for (t, (key, c)) in terms.iter().enumerate() {
        if t % 4096 == 4095 {
            job.checkpoint(4096)?;
        }
        let (a, b) = codec.pair(key, j);
        let img = image(op, a, b).ok_or_else(overflow)?;
        // one monomial can have a huge image (x_1^(10^12)): refuse before building it
        produced += (i128::from(img.hi) - i128::from(img.lo) + 1)
            .max(0)
            .unsigned_abs();
        if produced > MAX_TERMS as u128 {
            return Err(too_large());
        }
        let total = a + b + img.shift; // checked in `image`
        for p in img.lo..=img.hi {
            let slot = out.entry(codec.with_pair(key, j, p, total - p));
            if !slot.or_insert_with(C::zero).add_signed(c, img.negative) {
                return Ok(None);
            }
        }
    }
    Ok(Some(
        out.into_iter().filter(|(_, c)| !c.is_zero()).collect(),
    ))
}

/// One line of monomials x_i^p x_{i+1}^(total - p) with all other exponents fixed: the images
/// of a monomial under every operator lie on one line, so each line keeps a difference array
/// over p and an input term costs one map look-up and two additions.
struct Line<Key> {
    base: Key,
    total: i64,
    start: usize,
    lo: i64,
    hi: i64,
}

/// Buffers kept from one operator step to the next: fresh pages cost more than the work.
pub struct Workspace<Key, C> {
    index: KeyMap<Key, usize>,
    lines: Vec<Line<Key>>,
    diffs: Vec<C>,
}

impl<Key, C> Default for Workspace<Key, C> {
    fn default() -> Self {
        Workspace {
            index: KeyMap::default(),
            lines: Vec::new(),
            diffs: Vec::new(),
        }
    }
}

/// `op` on variables x_j, x_{j+1} (j 0-based) applied to `terms`, written to `out`. Ok(false)
/// means a coefficient overflowed `C` (the caller retries wider); zero results are dropped.
pub fn apply<K: Codec, C: Coeff>(
    codec: &K,
    work: &mut Workspace<K::Key, C>,
    terms: &[(K::Key, C)],
    out: &mut TermList<K::Key, C>,
    (op, j): (Operator, usize),
    job: &Job,
) -> Result<bool, Error> {
    out.clear();
    if !K::NON_NEGATIVE {
        return Ok(match apply_hashed(codec, terms, op, j, job)? {
            Some(list) => {
                *out = list;
                true
            }
            None => false,
        });
    }
    work.index.clear();
    work.lines.clear();
    work.diffs.clear();
    // at most one line per term, usually a few terms per line: no rehash, few regrowths
    work.index.reserve(terms.len());
    work.lines.reserve(terms.len());
    work.diffs.reserve(terms.len() * 4);
    for (t, (key, c)) in terms.iter().enumerate() {
        if t % 4096 == 4095 {
            job.checkpoint(4096)?;
        }
        if !add_images(codec, work, key, c, op, j)? {
            return Ok(false);
        }
    }
    Ok(sum_lines(codec, work, j, out))
}

/// Adds the image of one term to its line (every exponent non-negative, so 0 <= p <= total).
#[inline]
fn add_images<K: Codec, C: Coeff>(
    codec: &K,
    work: &mut Workspace<K::Key, C>,
    key: &K::Key,
    c: &C,
    op: Operator,
    j: usize,
) -> Result<bool, Error> {
    let (a, b) = codec.pair(key, j);
    let img = image(op, a, b).ok_or_else(overflow)?;
    if img.lo > img.hi {
        return Ok(true);
    }
    let total = a + b + img.shift; // checked in `image`
    let Workspace {
        index,
        lines,
        diffs,
    } = work;
    let slot = *index
        .entry(codec.line_key(key, j, total))
        .or_insert_with(|| {
            let span = usize::try_from(total).map_or(0, |t| t + 2);
            lines.push(Line {
                base: codec.with_pair(key, j, 0, 0),
                total,
                start: diffs.len(),
                lo: img.lo,
                hi: img.hi,
            });
            diffs.resize(diffs.len() + span, C::zero());
            lines.len() - 1
        });
    if diffs.len() > MAX_TERMS {
        return Err(too_large());
    }
    let line = &mut lines[slot];
    (line.lo, line.hi) = (line.lo.min(img.lo), line.hi.max(img.hi));
    let at = |p: i64| line.start + usize::try_from(p).unwrap_or(0);
    let (first, past) = (at(img.lo), at(img.hi + 1));
    Ok(diffs[first].add_signed(c, img.negative) && diffs[past].add_signed(c, !img.negative))
}

/// The terms of every line: prefix sums of its difference array, nonzero ones kept.
fn sum_lines<K: Codec, C: Coeff>(
    codec: &K,
    work: &Workspace<K::Key, C>,
    j: usize,
    out: &mut TermList<K::Key, C>,
) -> bool {
    out.reserve(work.diffs.len());
    for line in &work.lines {
        let mut running = C::zero();
        for p in line.lo..=line.hi {
            let d = &work.diffs[line.start + usize::try_from(p).unwrap_or(0)];
            if !running.add_signed(d, false) {
                return false;
            }
            if !running.is_zero() {
                out.push((
                    codec.with_pair(&line.base, j, p, line.total - p),
                    running.clone(),
                ));
            }
        }
    }
    true
}
