//! `Model`: the completion-count tables of SSYT(shape, n) that rank, unrank and the operators use.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::partition::{normalize, SubShapes};

/// Refuse tables larger than this (they are small for every shape a crystal of this size can hold).
const TABLE_BUDGET_BYTES: u128 = 1 << 30;
const NO_BASE: usize = usize::MAX;
/// Row counts are stored as u16.
pub const MAX_PART: usize = u16::MAX as usize - 1;

/// The shape, n, and for each level k in 1..=n the table `cum[k]`: for each partition nu with at
/// most k rows (located by `base[k][id(nu)]`), the running totals over the partitions mu that nu
/// covers by a horizontal strip (mu_j in nu_{j+1}..=nu_j, fewer than k rows), in decreasing
/// lexicographic order, of the number of SSYT of shape mu with entries <= k-1; the last entry is the count of
/// SSYT of shape nu with entries <= k.
///
/// rank(T) = sum_k cum[k][base[k][id(lambda^(k))] + local(lambda^(k-1) in lambda^(k))]: n look-ups,
/// no hash map. Cost to build: sum over levels of the horizontal-strip pairs inside the shape.
#[derive(Debug, Clone)]
pub struct Model {
    pub shape: Vec<usize>,
    pub n: usize,
    pub rows: usize,
    pub cells: usize,
    pub row_start: Vec<usize>,
    pub sub: SubShapes,
    base: Vec<Vec<usize>>,
    cum: Vec<Vec<u64>>,
    count: u64,
}

impl Model {
    pub fn new(shape: &[usize], n: usize) -> Result<Self, Error> {
        let shape = normalize(shape, "shape")?;
        if n > super::MAX_N {
            return Err(Error::invalid(format!(
                "n must be at most {}; got {n}",
                super::MAX_N
            )));
        }
        if let Some(&big) = shape.first().filter(|&&p| p > MAX_PART) {
            return Err(Error::invalid(format!(
                "shape parts must be at most {MAX_PART}; got {big}"
            )));
        }
        let rows = shape.len();
        let cells = shape.iter().sum();
        let mut row_start = vec![0; rows + 1];
        for r in 0..rows {
            row_start[r + 1] = row_start[r] + shape[r];
        }
        // more rows than letters: no tableau, and no tables to build
        let sub = SubShapes::new(if rows > n { &[] } else { &shape })?;
        let mut model = Model {
            shape,
            n,
            rows,
            cells,
            row_start,
            sub,
            base: vec![Vec::new(); n + 1],
            cum: vec![Vec::new(); n + 1],
            count: 0,
        };
        if rows > n {
            return Ok(model); // no tableau: more rows than letters
        }
        model.check_table_size()?;
        model.build_tables()?;
        let lambda = model.padded(&model.shape);
        model.count = model.total(n, &lambda);
        if model.count > i64::MAX as u64 {
            return Err(Error::TooLarge {
                what: format!(
                    "SSYT({:?}, {n}): {} tableaux, past 2^63",
                    model.shape, model.count
                ),
                bytes: u128::from(model.count),
                instead: "use count_tableaux for the exact number".into(),
            });
        }
        Ok(model)
    }

    /// Number of tableaux.
    pub fn count(&self) -> u64 {
        self.count
    }

    /// A partition as `rows + 1` parts, the last always 0 (so `nu[j + 1]` exists for every row j).
    pub fn padded(&self, parts: &[usize]) -> Vec<u16> {
        let mut out = vec![0u16; self.rows + 1];
        for (o, &p) in out.iter_mut().zip(parts) {
            *o = u16::try_from(p).expect("parts are checked to fit u16 when the model is built");
        }
        out
    }

    /// Rows of the horizontal-strip box below a partition at level k: free parts of mu.
    #[inline]
    pub fn free_rows(&self, k: usize) -> usize {
        (k - 1).min(self.rows)
    }

    /// Position of mu among the partitions that nu covers by a horizontal strip: mixed radix in
    /// the digits nu_j - mu_j, row 1 most significant (so larger mu come first).
    #[inline]
    pub fn local(nu: &[u16], mu: &[u16], free: usize) -> usize {
        let mut x = 0usize;
        for j in 0..free {
            x = x * usize::from(nu[j] - nu[j + 1] + 1) + usize::from(nu[j] - mu[j]);
        }
        x
    }

    #[inline]
    pub fn box_size(nu: &[u16], free: usize) -> usize {
        (0..free)
            .map(|j| usize::from(nu[j] - nu[j + 1] + 1))
            .product()
    }

    /// The rank contribution of level k: the number of tableaux with the same levels k..n whose
    /// level k-1 comes before mu.
    #[inline]
    pub fn offset(&self, k: usize, nu_id: usize, nu: &[u16], mu: &[u16]) -> u64 {
        self.level(k).offset(nu_id, nu, mu)
    }

    /// The tables of level k, to hoist out of loops over vertices.
    #[inline]
    pub fn level(&self, k: usize) -> Level<'_> {
        Level {
            base: &self.base[k],
            cum: &self.cum[k],
            free: self.free_rows(k),
        }
    }

    /// Number of SSYT of shape nu with entries <= k.
    pub fn total(&self, k: usize, nu: &[u16]) -> u64 {
        let b = self.base[k][self.sub.id(nu)];
        if b == NO_BASE {
            return 0;
        }
        self.cum[k][b + Self::box_size(nu, self.free_rows(k))]
    }

    fn check_table_size(&self) -> Result<(), Error> {
        let subs = u128::from(self.sub.count());
        let bytes = subs * 8 * (self.n as u128 + 1) * 4; // rough: a few entries per partition and level
        if subs > 50_000_000 || bytes > TABLE_BUDGET_BYTES * 8 {
            return Err(Error::TooLarge {
                what: format!(
                    "ranking tables for shape {:?} ({subs} sub-shapes)",
                    self.shape
                ),
                bytes,
                instead: "use count_tableaux for the number of tableaux".into(),
            });
        }
        Ok(())
    }

    fn build_tables(&mut self) -> Result<(), Error> {
        let all: Vec<Vec<u16>> = self
            .sub
            .all()
            .into_iter()
            .map(|mut p| {
                p.push(0);
                p
            })
            .collect();
        let mut bytes: u128 = 0;
        for k in 1..=self.n {
            let free = self.free_rows(k);
            let mut base = vec![NO_BASE; all.len()];
            let mut cum = Vec::new();
            let mut mu = vec![0u16; self.rows + 1];
            for (id, nu) in all.iter().enumerate() {
                if self.rows > k && nu[k] > 0 {
                    continue; // more than k rows: no tableau with entries <= k
                }
                base[id] = cum.len();
                let size = Self::box_size(nu, free);
                let mut acc = 0u64;
                for t in 0..size {
                    cum.push(acc);
                    decode(nu, t, free, &mut mu);
                    let below = if k == 1 { 1 } else { self.total(k - 1, &mu) };
                    acc = acc.checked_add(below).ok_or_else(|| Error::TooLarge {
                        what: format!(
                            "SSYT({:?}, {}): more than 2^64 tableaux",
                            self.shape, self.n
                        ),
                        bytes: u128::MAX,
                        instead: "use count_tableaux for the exact number".into(),
                    })?;
                }
                cum.push(acc);
            }
            bytes += (cum.len() as u128) * 8;
            if bytes > TABLE_BUDGET_BYTES {
                return Err(Error::TooLarge {
                    what: format!("ranking tables for SSYT({:?}, {})", self.shape, self.n),
                    bytes,
                    instead: "use count_tableaux for the number of tableaux".into(),
                });
            }
            self.base[k] = base;
            self.cum[k] = cum;
        }
        Ok(())
    }

    /// Gelfand-Tsetlin pattern of a tableau given by its cells: `gt[k * (rows + 1) + r]` is the
    /// number of entries <= k in row r. Checks nothing: see `check_cells`.
    pub fn pattern(&self, t: &[u8], gt: &mut [u16]) {
        let w = self.rows + 1;
        gt.fill(0);
        for r in 0..self.rows {
            for &x in &t[self.row_start[r]..self.row_start[r + 1]] {
                gt[usize::from(x) * w + r] += 1;
            }
        }
        for k in 1..=self.n {
            for r in 0..w {
                gt[k * w + r] += gt[(k - 1) * w + r];
            }
        }
    }

    /// Index of a tableau (its cells, row-major), after checking that it is one.
    pub fn rank(&self, t: &[u8]) -> Result<u64, Error> {
        self.check_cells(t)?;
        let w = self.rows + 1;
        let mut gt = vec![0u16; (self.n + 1) * w];
        self.pattern(t, &mut gt);
        Ok(self.rank_pattern(&gt))
    }

    pub fn rank_pattern(&self, gt: &[u16]) -> u64 {
        let w = self.rows + 1;
        (1..=self.n)
            .map(|k| {
                let nu = &gt[k * w..(k + 1) * w];
                self.offset(k, self.sub.id(nu), nu, &gt[(k - 1) * w..k * w])
            })
            .sum()
    }

    /// Gelfand-Tsetlin pattern of the tableau with index `index` (binary search at each level).
    pub fn unrank_pattern(&self, mut index: u64, gt: &mut [u16]) -> Result<(), Error> {
        if index >= self.count {
            return Err(Error::invalid(format!(
                "vertex index must be in 0..{}; got {index}",
                self.count
            )));
        }
        let w = self.rows + 1;
        gt.fill(0);
        let top = self.padded(&self.shape);
        gt[self.n * w..].copy_from_slice(&top);
        for k in (1..=self.n).rev() {
            let (lower, upper) = gt.split_at_mut(k * w);
            let nu = &upper[..w];
            let free = self.free_rows(k);
            let b = self.base[k][self.sub.id(nu)];
            let seg = &self.cum[k][b..=b + Self::box_size(nu, free)];
            let t = seg.partition_point(|&v| v <= index) - 1;
            index -= seg[t];
            decode(nu, t, free, &mut lower[(k - 1) * w..]);
        }
        Ok(())
    }

    /// Cells of the tableau whose pattern is `gt`.
    pub fn cells_of(&self, gt: &[u16], t: &mut [u8]) {
        let w = self.rows + 1;
        for r in 0..self.rows {
            let row = &mut t[self.row_start[r]..self.row_start[r + 1]];
            for v in (r + 1)..=self.n {
                let (a, b) = (gt[(v - 1) * w + r], gt[v * w + r]);
                row[usize::from(a)..usize::from(b)].fill(u8::try_from(v).expect("n <= 255"));
            }
        }
    }

    /// Checks that `t` is a semistandard tableau of this shape with entries in 1..=n.
    pub fn check_cells(&self, t: &[u8]) -> Result<(), Error> {
        if t.len() != self.cells {
            return Err(Error::invalid(format!(
                "tableau must have {} cells for shape {:?}; got {}",
                self.cells,
                self.shape,
                t.len()
            )));
        }
        for r in 0..self.rows {
            let row = &t[self.row_start[r]..self.row_start[r + 1]];
            for (c, &x) in row.iter().enumerate() {
                if x == 0 || usize::from(x) > self.n {
                    return Err(Error::invalid(format!(
                        "tableau entries must be in 1..{}; got {x} in row {}",
                        self.n,
                        r + 1
                    )));
                }
                if c > 0 && row[c - 1] > x {
                    return Err(Error::invalid(format!(
                        "tableau rows must weakly increase; row {} has {} before {x}",
                        r + 1,
                        row[c - 1]
                    )));
                }
                if r > 0 && t[self.row_start[r - 1] + c] >= x {
                    return Err(Error::invalid(format!(
                        "tableau columns must strictly increase; column {} has {} above {x}",
                        c + 1,
                        t[self.row_start[r - 1] + c]
                    )));
                }
            }
        }
        Ok(())
    }
}

/// One level's tables, borrowed.
#[derive(Debug, Clone, Copy)]
pub struct Level<'a> {
    base: &'a [usize],
    cum: &'a [u64],
    free: usize,
}

impl Level<'_> {
    #[inline]
    pub fn offset(&self, nu_id: usize, nu: &[u16], mu: &[u16]) -> u64 {
        self.cum[self.entry(nu_id, nu, mu)]
    }

    /// Where the pair (nu, mu) sits in this level's table (nu must be allowed at this level).
    #[inline]
    pub fn entry(&self, nu_id: usize, nu: &[u16], mu: &[u16]) -> usize {
        self.base[nu_id] + Model::local(nu, mu, self.free)
    }

    /// The pair's rank term, if nu is allowed at this level and mu lies in its box.
    pub fn try_offset(&self, nu_id: usize, nu: &[u16], mu: &[u16]) -> Option<u64> {
        let inside = (0..self.free).all(|j| nu[j + 1] <= mu[j] && mu[j] <= nu[j]);
        let tail_zero = mu[self.free..].iter().all(|&x| x == 0);
        (self.base[nu_id] != NO_BASE && inside && tail_zero).then(|| self.offset(nu_id, nu, mu))
    }

    /// Number of entries of this level's table.
    pub fn len(&self) -> usize {
        self.cum.len()
    }
}

/// The `t`-th partition mu covered by nu (the inverse of `Model::local`), into `mu`.
pub(super) fn decode(nu: &[u16], mut t: usize, free: usize, mu: &mut [u16]) {
    mu[..].fill(0);
    for j in (0..free).rev() {
        let d = usize::from(nu[j] - nu[j + 1] + 1);
        mu[j] = nu[j] - u16::try_from(t % d).expect("t % d <= nu_j - nu_{j+1}");
        t /= d;
    }
}
