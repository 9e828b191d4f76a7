//! One Schubert polynomial by the transition recursion (Lascoux and Schutzenberger, "Schubert
//! polynomials and the Littlewood-Richardson rule", 1985; Macdonald, Notes on Schubert
//! Polynomials, 1991, (4.16)):
//!
//! for w != id, let r be the last descent of w, s > r the last position with w(s) < w(r), and
//! v = w t_(rs). Then S_w = x_r S_v + sum of S_(v t_(qr)) over the q < r with
//! l(v t_(qr)) = l(w), i.e. v(q) < v(r) and no k in (q, r) with v(q) < v(k) < v(r).
//!
//! Every permutation met is either shorter than w or of the same length and lexicographically
//! larger, so the recursion ends; all of them stay in S_n with last descent at most r.
//! Dominant permutations (weakly decreasing Lehmer code, the 132-avoiding ones) end it at once:
//! S_w = x^code(w) (Macdonald 1991, (4.7)).
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use crate::poly::{CoeffVec, Terms};
use num_bigint::{BigInt, BigUint};
use std::collections::HashMap;

/// Bytes of terms kept in the memo table past which a single S_w is refused.
pub const MAX_MEMO_BYTES: usize = 4 << 30;

/// Non-negative exact coefficients: all the recursion does is add them.
trait Count: Clone + Send {
    fn one() -> Self;
    /// `self += other`; false on overflow (the caller reruns wider).
    fn add_checked(&mut self, other: &Self) -> bool;
}

impl Count for u64 {
    fn one() -> Self {
        1
    }
    fn add_checked(&mut self, other: &Self) -> bool {
        self.checked_add(*other).map(|s| *self = s).is_some()
    }
}

impl Count for BigUint {
    fn one() -> Self {
        BigUint::from(1u8)
    }
    fn add_checked(&mut self, other: &Self) -> bool {
        *self += other;
        true
    }
}

/// Monomials in x_1..x_d as keys whose order is the lexicographic order of exponent rows, so
/// that multiplying by x_r (adding a constant) keeps a sorted list sorted.
trait Monomial: Ord + Clone + Send {
    fn from_row(row: &[usize], layout: &Layout) -> Self;
    fn times_x(&self, r: usize, layout: &Layout) -> Self;
    fn write_row(&self, row: &mut [i64], layout: &Layout);
    /// Bytes a monomial holds outside the term itself.
    fn heap_bytes(layout: &Layout) -> usize;
}

/// `fields` variables (x_1 in the most significant field) of `width` bits each.
struct Layout {
    fields: usize,
    width: u32,
}

impl Layout {
    fn shift(&self, r: usize) -> u32 {
        u32::try_from(self.fields - 1 - r).expect("at most 128 fields") * self.width
    }
}

impl Monomial for u128 {
    fn from_row(row: &[usize], layout: &Layout) -> Self {
        row.iter()
            .enumerate()
            .map(|(r, &e)| (e as u128) << layout.shift(r))
            .sum()
    }
    fn times_x(&self, r: usize, layout: &Layout) -> Self {
        // exponents stay at most l(w) < 2^width, so no field carries into the next
        self + (1u128 << layout.shift(r))
    }
    fn write_row(&self, row: &mut [i64], layout: &Layout) {
        let mask = (1u128 << layout.width) - 1;
        for (r, slot) in row.iter_mut().take(layout.fields).enumerate() {
            *slot = i64::try_from((self >> layout.shift(r)) & mask).expect("a width-bit field");
        }
    }
    fn heap_bytes(_: &Layout) -> usize {
        0
    }
}

/// Plain exponent rows, for permutations whose packed monomials need more than 128 bits.
impl Monomial for Vec<u32> {
    fn from_row(row: &[usize], layout: &Layout) -> Self {
        let mut out = vec![0; layout.fields];
        for (slot, &e) in out.iter_mut().zip(row) {
            *slot = u32::try_from(e).expect("exponents are at most l(w) < 2^32");
        }
        out
    }
    fn times_x(&self, r: usize, _: &Layout) -> Self {
        let mut out = self.clone();
        out[r] += 1;
        out
    }
    fn write_row(&self, row: &mut [i64], _: &Layout) {
        for (slot, &e) in row.iter_mut().zip(self) {
            *slot = i64::from(e);
        }
    }
    fn heap_bytes(layout: &Layout) -> usize {
        4 * layout.fields + 16 // the exponents and the allocator's header
    }
}

type List<M, C> = Vec<(M, C)>;

/// S_w for w in S_n (0-based one-line notation), canonical `Terms` in n variables.
///
/// Cost: one step per permutation met by the recursion (memoised), each a sort of the terms of
/// its children; coefficients are u64 with checked additions, rerun on BigUint on overflow.
pub fn schubert(w: &[usize], job: &Job) -> Result<Terms, Error> {
    let n = w.len();
    let fields = last_descent(w).map_or(0, |r| r + 1);
    let degree = (0..n)
        .map(|a| (a + 1..n).filter(|&b| w[a] > w[b]).count())
        .sum::<usize>();
    if u32::try_from(degree).is_err() {
        return Err(too_large(n));
    }
    let width = usize::BITS - degree.leading_zeros();
    let layout = Layout {
        fields,
        width: width.max(1),
    };
    if fields * layout.width as usize <= 128 {
        run_widening::<u128>(w, &layout, job)
    } else {
        run_widening::<Vec<u32>>(w, &layout, job)
    }
}

fn run_widening<M: Monomial>(w: &[usize], layout: &Layout, job: &Job) -> Result<Terms, Error> {
    if let Some(list) = recurse::<M, u64>(w, layout, job)? {
        let coeffs = list.iter().map(|(_, c)| i128::from(*c)).collect();
        return Ok(to_terms(&list, CoeffVec::Small(coeffs), w.len(), layout));
    }
    let list = recurse::<M, BigUint>(w, layout, job)?.expect("BigUint additions never overflow");
    let coeffs = list.iter().map(|(_, c)| BigInt::from(c.clone())).collect();
    Ok(to_terms(
        &list,
        CoeffVec::Big(coeffs).narrowed(),
        w.len(),
        layout,
    ))
}

/// Canonical order: decreasing exponent rows, i.e. decreasing keys; `list` is increasing.
fn to_terms<M: Monomial, C>(list: &List<M, C>, coeffs: CoeffVec, n: usize, l: &Layout) -> Terms {
    let mut exps = vec![0i64; list.len() * n];
    if n > 0 {
        for (row, (m, _)) in exps.chunks_exact_mut(n).zip(list.iter().rev()) {
            m.write_row(row, l);
        }
    }
    let coeffs = match coeffs {
        CoeffVec::Small(mut v) => {
            v.reverse();
            CoeffVec::Small(v)
        }
        CoeffVec::Big(mut v) => {
            v.reverse();
            CoeffVec::Big(v)
        }
    };
    Terms {
        nvars: n,
        exps,
        coeffs,
    }
}

/// What S_u is made of: a monomial (dominant u), or x_r S_v plus the S_(v t_(qr)).
enum Step {
    Monomial(Vec<usize>),
    Transition {
        r: usize,
        v: Vec<usize>,
        others: Vec<Vec<usize>>,
    },
}

/// The memoised recursion on an explicit stack (its depth can reach thousands). Ok(None): a
/// coefficient overflowed `C`.
fn recurse<M: Monomial, C: Count>(
    w: &[usize],
    layout: &Layout,
    job: &Job,
) -> Result<Option<List<M, C>>, Error> {
    let mut memo: HashMap<Vec<usize>, List<M, C>> = HashMap::new();
    let mut stored = 0usize;
    let mut stack = vec![w.to_vec()];
    while let Some(u) = stack.last() {
        if memo.contains_key(u) {
            stack.pop();
            continue;
        }
        let step = transition_step(u);
        let missing: Vec<Vec<usize>> = match &step {
            Step::Monomial(_) => Vec::new(),
            Step::Transition { v, others, .. } => std::iter::once(v)
                .chain(others)
                .filter(|p| !memo.contains_key(*p))
                .cloned()
                .collect(),
        };
        if !missing.is_empty() {
            stack.extend(missing);
            continue;
        }
        let Some(list) = combine(&step, &memo, layout) else {
            return Ok(None);
        };
        // the terms, and the permutation keying them with the map's overhead
        stored +=
            list.len() * (std::mem::size_of::<(M, C)>() + M::heap_bytes(layout)) + 8 * w.len() + 64;
        if stored > MAX_MEMO_BYTES {
            return Err(too_large(w.len()));
        }
        job.checkpoint(list.len() as u64 + 1)?;
        let u = stack.pop().expect("the loop saw a top");
        memo.insert(u, list);
    }
    Ok(memo.remove(w))
}

fn too_large(n: usize) -> Error {
    Error::TooLarge {
        what: format!("this Schubert polynomial of S_{n} (the transition recursion's table)"),
        bytes: MAX_MEMO_BYTES as u128,
        instead: "use a permutation of smaller length or fewer letters".into(),
    }
}

/// x_r S_v + sum of the others, from the memo table; None on coefficient overflow.
fn combine<M: Monomial, C: Count>(
    step: &Step,
    memo: &HashMap<Vec<usize>, List<M, C>>,
    layout: &Layout,
) -> Option<List<M, C>> {
    let (r, v, others) = match step {
        Step::Monomial(code) => return Some(vec![(M::from_row(code, layout), C::one())]),
        Step::Transition { r, v, others } => (*r, v, others),
    };
    let mut all: List<M, C> = memo[v]
        .iter()
        .map(|(m, c)| (m.times_x(r, layout), c.clone()))
        .collect();
    if others.is_empty() {
        return Some(all); // x_r times a sorted list is sorted
    }
    for p in others {
        all.extend(memo[p].iter().cloned());
    }
    all.sort_unstable_by(|a, b| a.0.cmp(&b.0));
    let mut out: List<M, C> = Vec::with_capacity(all.len());
    for (m, c) in all {
        match out.last_mut() {
            Some(last) if last.0 == m => {
                if !last.1.add_checked(&c) {
                    return None;
                }
            }
            _ => out.push((m, c)),
        }
    }
    Some(out)
}

/// The largest r with w(r) > w(r+1), or None for the identity.
fn last_descent(w: &[usize]) -> Option<usize> {
    (0..w.len().saturating_sub(1)).rfind(|&r| w[r] > w[r + 1])
}

/// The Lehmer code of w, restricted to the first `fields` positions, if it is weakly
/// decreasing (w dominant), else None.
fn dominant_code(w: &[usize], fields: usize) -> Option<Vec<usize>> {
    let code: Vec<usize> = (0..fields)
        .map(|a| (a + 1..w.len()).filter(|&b| w[b] < w[a]).count())
        .collect();
    code.windows(2).all(|p| p[0] >= p[1]).then_some(code)
}

fn transition_step(u: &[usize]) -> Step {
    let Some(r) = last_descent(u) else {
        return Step::Monomial(Vec::new());
    };
    // the code vanishes past the last descent (the tail is increasing); the layout's fields
    // cover it, since the last descents met never pass w's
    if let Some(code) = dominant_code(u, r + 1) {
        return Step::Monomial(code);
    }
    let s = (r + 1..u.len())
        .rfind(|&s| u[s] < u[r])
        .expect("r is a descent, so u(r+1) < u(r)");
    let mut v = u.to_vec();
    v.swap(r, s);
    let mut others = Vec::new();
    // scanning q downwards from r - 1, v(q) qualifies when it lies above every earlier
    // candidate value below v(r): then no k in (q, r) has v(q) < v(k) < v(r)
    let mut floor: Option<usize> = None;
    for q in (0..r).rev() {
        if v[q] < v[r] && floor.is_none_or(|f| v[q] > f) {
            floor = Some(v[q]);
            let mut t = v.clone();
            t.swap(q, r);
            others.push(t);
        }
    }
    Step::Transition { r, v, others }
}
