//! Sizes of the branching recursion for `s_lambda(x_1..x_n)`, the choice of the level where its
//! two halves meet, and the memory check made before anything large is allocated.
#![deny(unsafe_code)]

use super::compositions::Compositions;
use super::levels::{strip_pairs, too_many_pairs, too_many_partitions, Level};
use super::width::Width;
use crate::error::Error;
use crate::job::Job;
use num_bigint::BigUint;

/// Memory the Schur kernel may use for its working arrays and its result.
pub(crate) const BUDGET_BYTES: u128 = 4 << 30;
/// Horizontal-strip pairs the recursion may visit. Every pair costs at least one coefficient
/// operation, so past this the work is out of proportion to the memory (long rows, few
/// variables: (3000, 2000) with n = 3 has 2e9 pairs for 6.5e6 terms).
const PAIR_LIMIT: u128 = 1 << 28;

/// Everything the recursion needs before it starts: the composition counts, the levels
/// k = 1..=n with their partitions listed (level n is the shape alone), the meeting level and
/// the coefficient width.
#[derive(Debug)]
pub(crate) struct Plan {
    pub(crate) n: usize,
    pub(crate) total: usize,
    pub(crate) comps: Compositions,
    /// levels[k - 1] for k = 1..=n.
    levels: Vec<Level>,
    pub(crate) sizes: Sizes,
    /// Bottom arrays are built up to this level, top arrays down to it.
    pub(crate) meet: usize,
    pub(crate) width: Width,
}

/// Per level k (index k): coefficients held and additions needed on each side.
#[derive(Debug, Default)]
pub(crate) struct Sizes {
    /// Entries of the arrays of `s_mu(x_1..x_k)`, mu in level k.
    pub(crate) bottom: Vec<u64>,
    /// Entries of the arrays of `s_{lambda/mu}(x_{k+1}..x_n)`, mu in level k.
    pub(crate) top: Vec<u64>,
    /// Additions to build the bottom arrays of level k from those of level k - 1.
    bottom_work: Vec<u64>,
    /// Additions to build the top arrays of level k from those of level k + 1.
    top_work: Vec<u64>,
}

impl Plan {
    /// For a partition `shape` with 1 <= rows <= n and n >= 2, results with `exponent_bytes`
    /// per exponent. Fails with `TooLarge` if no meeting level keeps the estimated peak memory
    /// within the budget.
    pub(crate) fn new(
        shape: &[u32],
        n: usize,
        exponent_bytes: u128,
        job: &Job,
    ) -> Result<Self, Error> {
        let total: usize = shape.iter().map(|&p| p as usize).sum();
        let cap = shape[0] as usize;
        // The count table and the per-row ranking tables come first; bound them before building.
        let table_bytes = 8 * (n as u128 + 1) * (total as u128 + 1) + 16 * (cap as u128 + 1);
        check(table_bytes, shape, n, "tables of composition counts")?;
        let comps = Compositions::new(cap, total, n);
        let terms = u128::from(comps.count(total, n));
        check(
            terms * (n as u128 * exponent_bytes + 4),
            shape,
            n,
            "the result",
        )?;
        let bits = max_coefficient(shape, n, total, job)?.bits();
        let width = Width::for_bits(bits);
        let mut levels = Vec::with_capacity(n);
        for k in 1..=n {
            let (level, count) = Level::plan(shape, n, k);
            if u128::from(count) * (4 * k as u128 + 16) > BUDGET_BYTES {
                return Err(too_many_partitions(count, k));
            }
            levels.push(level);
        }
        let pairs: u128 = levels
            .windows(2)
            .map(|w| u128::from(strip_pairs(&w[1], &w[0])))
            .sum();
        if pairs > PAIR_LIMIT {
            return Err(too_many_pairs(pairs));
        }
        for level in &mut levels {
            level.enumerate();
        }
        let mut plan = Plan {
            n,
            total,
            comps,
            levels,
            sizes: Sizes::default(),
            meet: 1,
            width,
        };
        plan.sizes = plan.measure(job)?;
        let (meet, peak) = plan.choose_meet(width.bytes(bits), exponent_bytes);
        check(peak, shape, n, "the branching recursion")?;
        plan.meet = meet;
        Ok(plan)
    }

    pub(crate) fn level(&self, k: usize) -> &Level {
        &self.levels[k - 1]
    }

    /// Entries and work of every level, from the horizontal-strip pairs between neighbours.
    fn measure(&self, job: &Job) -> Result<Sizes, Error> {
        let (n, d, c) = (self.n, self.total, &self.comps);
        let sum = |k: usize, len: &dyn Fn(usize) -> u64| {
            self.level(k)
                .sizes()
                .iter()
                .fold(0u64, |acc, &s| acc.saturating_add(len(s)))
        };
        let mut sizes = Sizes {
            bottom: (0..=n)
                .map(|k| {
                    if k == 0 {
                        0
                    } else {
                        sum(k, &|s| c.count(s, k))
                    }
                })
                .collect(),
            top: (0..=n)
                .map(|k| {
                    if k == 0 {
                        0
                    } else {
                        sum(k, &|s| c.count(d - s, n - k))
                    }
                })
                .collect(),
            bottom_work: vec![0; n + 1],
            top_work: vec![0; n + 1],
        };
        let mut pairs = Vec::new();
        for k in 2..=n {
            let (upper, lower) = (self.level(k), self.level(k - 1));
            for id in 0..upper.len() {
                pairs.clear();
                lower.strip_sources(upper.partition(id), &mut pairs);
                let above = c.count(d - upper.size(id), n - k);
                for &(_, size) in &pairs {
                    sizes.bottom_work[k] =
                        sizes.bottom_work[k].saturating_add(c.count(size, k - 1));
                    sizes.top_work[k - 1] = sizes.top_work[k - 1].saturating_add(above);
                }
                job.checkpoint(pairs.len() as u64)?;
            }
        }
        Ok(sizes)
    }

    /// The meeting level q in 1..n with the least estimated work among those within the budget
    /// (or the least memory if none is), and its peak memory in bytes.
    fn choose_meet(&self, coeff_bytes: u128, exponent_bytes: u128) -> (usize, u128) {
        let candidates: Vec<(usize, u128, u128)> = (1..self.n)
            .map(|q| {
                (
                    q,
                    self.work(q),
                    self.peak_bytes(q, coeff_bytes, exponent_bytes),
                )
            })
            .collect();
        let fitting = candidates
            .iter()
            .filter(|c| c.2 <= BUDGET_BYTES)
            .min_by_key(|c| c.1);
        let (q, _, peak) = *fitting
            .or_else(|| candidates.iter().min_by_key(|c| c.2))
            .expect("n >= 2 gives at least one meeting level");
        (q, peak)
    }

    /// Estimated cost, in coefficient operations, of meeting at level q: building both halves,
    /// the products at the meeting (a multiply and an add each), and fixed overheads for each
    /// top part visited at the meeting (ranking it, starting a listing there) and for each
    /// product (a short loop over a bottom array). The weights are rough timings.
    fn work(&self, q: usize) -> u128 {
        let (comps, total, n) = (&self.comps, self.total, self.n);
        let count = |size: usize, parts: usize| u128::from(comps.count(size, parts));
        let wide = |v: &[u64]| v.iter().map(|&w| u128::from(w)).sum::<u128>();
        let level = self.level(q).sizes().iter();
        let combine: u128 = level
            .map(|&size| count(total - size, n - q) * count(size, q))
            .sum();
        let cap = comps.cap();
        let visited: u128 = (total.saturating_sub(cap * q)..=total.min(cap * (n - q)))
            .map(|size| count(size, n - q))
            .sum();
        let products = u128::from(self.sizes.top[q]);
        let halves = wide(&self.sizes.bottom_work[2..=q]) + wide(&self.sizes.top_work[q..n]);
        halves + 2 * combine + 40 * visited + 20 * products
    }

    /// The most memory held at once: two neighbouring levels while either half is built (with
    /// the finished bottom half kept while the top one is built); both halves, the top entries
    /// again as (index, coefficient) pairs and the combined result at the meeting; then the
    /// combined result and the listed terms.
    fn peak_bytes(&self, q: usize, coeff_bytes: u128, exponent_bytes: u128) -> u128 {
        let (s, n) = (&self.sizes, self.n);
        let e = |v: &[u64], k: usize| u128::from(v[k]);
        let terms = u128::from(self.comps.count(self.total, n));
        let bottom = (1..=q)
            .map(|k| e(&s.bottom, k - 1) + e(&s.bottom, k))
            .max()
            .unwrap_or(0);
        let top = (q..n)
            .map(|k| e(&s.top, k + 1) + e(&s.top, k))
            .max()
            .unwrap_or(0);
        let meeting = (e(&s.bottom, q) + e(&s.top, q) + terms) * coeff_bytes
            + e(&s.top, q) * (16 + coeff_bytes);
        let listing = terms * coeff_bytes + terms * (n as u128 * exponent_bytes + coeff_bytes);
        (bottom * coeff_bytes)
            .max((e(&s.bottom, q) + top) * coeff_bytes)
            .max(meeting)
            .max(listing)
    }

    /// Moves the meeting level (tests compare every choice).
    #[cfg(test)]
    pub(crate) fn set_meet(&mut self, q: usize) {
        self.meet = q;
    }
}

fn check(bytes: u128, shape: &[u32], n: usize, what: &str) -> Result<(), Error> {
    if bytes <= BUDGET_BYTES {
        return Ok(());
    }
    Err(Error::TooLarge {
        what: format!("{what} for the Schur polynomial of shape {shape:?} in {n} variables"),
        bytes,
        instead: "compute single coefficients with kostka(shape, weight), or use fewer variables"
            .into(),
    })
}

/// The largest coefficient of `s_shape(x_1..x_n)`, used to pick the coefficient width:
/// `K_{shape, beta}` for the most balanced content beta of |shape| into n parts (q + 1 repeated
/// r times, then q, where `|shape| = qn + r`). Weight multiplicities of a `GL_n` module do not
/// decrease when a dominant weight mu moves one box down to `mu - e_i + e_j`, since that weight
/// lies between mu and its mirror image on the `e_i - e_j` string through mu, along which
/// multiplicities are unimodal (the string is a sum of `sl_2` modules with one centre); and
/// beta is below every content in the dominance order.
///
/// It also bounds every partial sum and product of the recursion: each counts tableaux of the
/// whole shape with one fixed content (a tableau of a partition of a level, completed by a
/// fixed filling of the rest with larger letters, stays distinct from the others). Were the
/// bound ever too small, a checked sum would overflow and the next width would be tried.
fn max_coefficient(shape: &[u32], n: usize, total: usize, job: &Job) -> Result<BigUint, Error> {
    let (q, r) = (total / n, total % n);
    let beta: Vec<usize> = (0..n).map(|i| q + usize::from(i < r)).collect();
    let lambda: Vec<usize> = shape.iter().map(|&p| p as usize).collect();
    super::kostka(&lambda, &beta, job)
}
