//! The partitions a branching recursion for `s_lambda(x_1..x_n)` visits with k variables left.
//!
//! Peeling the letters n, n-1, ..., k+1 off a semistandard tableau of shape lambda leaves a
//! tableau of a shape mu with mu in lambda, at most k rows, and lambda/mu of column height at
//! most n - k; that is, `lambda_{j+n-k} <= mu_j <= lambda_j` for every row j. Every partition in
//! that box occurs, so a level is exactly a box of partitions, numbered here in lexicographic
//! order (row 1 most significant) by an additive rank `id(mu) = sum_j offset_j(mu_j)`.
#![deny(unsafe_code)]

use crate::error::Error;

#[derive(Debug, Clone)]
pub(crate) struct Level {
    rows: usize,
    lo: Vec<u32>,
    hi: Vec<u32>,
    /// `offset[j][a - lo[j]]`: how many partitions of the level precede those with `mu_j = a` among
    /// those agreeing with a given mu on rows before j.
    offset: Vec<Vec<u64>>,
    /// The partitions in id order, `rows` parts each.
    parts: Vec<u32>,
    sizes: Vec<usize>,
}

impl Level {
    /// Number of partitions in level `k` of `shape` with `n` variables (saturating), and the
    /// tables that rank them. Cost `O(rows * lambda_1)`.
    pub(crate) fn plan(shape: &[u32], n: usize, k: usize) -> (Level, u64) {
        let rows = k.min(shape.len());
        let lo: Vec<u32> = (0..rows)
            .map(|j| shape.get(j + n - k).copied().unwrap_or(0))
            .collect();
        let hi: Vec<u32> = shape[..rows].to_vec();
        let cap = shape.first().map_or(0, |&p| p as usize);
        // tails[b]: sequences for rows j.. with mu_j <= b, inside their bounds.
        let mut tails = vec![1u64; cap + 1];
        let mut offset = vec![Vec::new(); rows];
        for j in (0..rows).rev() {
            let (l, h) = (lo[j] as usize, hi[j] as usize);
            let mut row = Vec::with_capacity(h - l + 1);
            let mut acc = 0u64;
            for &t in &tails[l..=h] {
                row.push(acc);
                acc = acc.saturating_add(t);
            }
            // tails for row j: sum of tails[a] over l <= a <= min(b, h), zero below l.
            let mut next = vec![0u64; cap + 1];
            for (b, slot) in next.iter_mut().enumerate().skip(l) {
                *slot = if b < h { row[b - l + 1] } else { acc };
            }
            offset[j] = row;
            tails = next;
        }
        let count = if rows == 0 { 1 } else { tails[hi[0] as usize] };
        let level = Level {
            rows,
            lo,
            hi,
            offset,
            parts: Vec::new(),
            sizes: Vec::new(),
        };
        (level, count)
    }

    /// Lists the partitions (call after `plan`, once the count passed the budget).
    pub(crate) fn enumerate(&mut self) {
        let mut mu = vec![0u32; self.rows];
        let (mut parts, mut sizes) = (Vec::new(), Vec::new());
        self.fill(0, u32::MAX, 0, &mut mu, &mut parts, &mut sizes);
        self.parts = parts;
        self.sizes = sizes;
    }

    fn fill(
        &self,
        j: usize,
        above: u32,
        size: usize,
        mu: &mut [u32],
        parts: &mut Vec<u32>,
        sizes: &mut Vec<usize>,
    ) {
        if j == self.rows {
            parts.extend_from_slice(mu);
            sizes.push(size);
            return;
        }
        for a in self.lo[j]..=self.hi[j].min(above) {
            mu[j] = a;
            self.fill(j + 1, a, size + a as usize, mu, parts, sizes);
        }
    }

    pub(crate) fn len(&self) -> usize {
        self.sizes.len()
    }

    pub(crate) fn size(&self, id: usize) -> usize {
        self.sizes[id]
    }

    pub(crate) fn sizes(&self) -> &[usize] {
        &self.sizes
    }

    pub(crate) fn partition(&self, id: usize) -> &[u32] {
        &self.parts[id * self.rows..(id + 1) * self.rows]
    }

    /// The partitions mu of this level with `nu/mu` a horizontal strip (`nu_{j+1} <= mu_j <= nu_j`),
    /// where nu is a partition of the next level: pushes (id(mu), |mu|) for each.
    pub(crate) fn strip_sources(&self, nu: &[u32], out: &mut Vec<(usize, usize)>) {
        let bounds = |j: usize| (nu.get(j + 1).copied().unwrap_or(0), nu[j]);
        self.walk(0, &bounds, 0, 0, out);
    }

    /// The partitions mu of this level with `mu/kappa` a horizontal strip
    /// (`kappa_j <= mu_j <= kappa_{j-1}`), where kappa is a partition of the level below:
    /// pushes (id(mu), |mu|).
    pub(crate) fn strip_supersets(&self, kappa: &[u32], out: &mut Vec<(usize, usize)>) {
        let part = |j: usize| kappa.get(j).copied().unwrap_or(0);
        let bounds = |j: usize| (part(j), if j == 0 { self.hi[0] } else { part(j - 1) });
        self.walk(0, &bounds, 0, 0, out);
    }

    /// Every partition of this level whose part j lies in `bounds(j)` (clipped to the level's own
    /// range), from row j on, with the id and size accumulated so far: pushes (id, size).
    fn walk(
        &self,
        j: usize,
        bounds: &dyn Fn(usize) -> (u32, u32),
        id: u64,
        size: usize,
        out: &mut Vec<(usize, usize)>,
    ) {
        if j == self.rows {
            let id = usize::try_from(id).expect("ids are below the level size");
            out.push((id, size));
            return;
        }
        let (low, high) = bounds(j);
        for a in low.max(self.lo[j])..=high.min(self.hi[j]) {
            let step = self.offset[j][(a - self.lo[j]) as usize];
            self.walk(j + 1, bounds, id + step, size + a as usize, out);
        }
    }

    /// Rank of a partition of this level (for tests of the numbering).
    #[cfg(test)]
    pub(crate) fn id(&self, mu: &[u32]) -> usize {
        let id: u64 = (0..self.rows)
            .map(|j| self.offset[j][(mu[j] - self.lo[j]) as usize])
            .sum();
        usize::try_from(id).expect("ids are below the level size")
    }
}

/// Number of pairs (nu in `upper`, mu in `lower`) with `nu/mu` a horizontal strip, where `lower`
/// is the level below `upper`, without listing them: the pairs are the weakly decreasing chains
/// `nu_1 >= mu_1 >= nu_2 >= mu_2 >= ...` inside both boxes, counted position by position in
/// `O(rows * lambda_1)`. Saturates at `u64::MAX`.
pub(crate) fn strip_pairs(upper: &Level, lower: &Level) -> u64 {
    let cap = upper.hi.first().map_or(0, |&h| h as usize);
    // ways[v]: chains so far whose last element is v.
    let mut ways = vec![0u64; cap + 1];
    ways[cap] = 1; // an unbounded start above nu_1
    for j in 0..upper.rows {
        let bounds = [
            (upper.lo[j], upper.hi[j]),
            (
                lower.lo.get(j).copied().unwrap_or(0),
                lower.hi.get(j).copied().unwrap_or(0),
            ),
        ];
        for (lo, hi) in bounds {
            // next[v] = sum of ways[w] over w >= v, for v in lo..=hi.
            let mut next = vec![0u64; cap + 1];
            let mut above = 0u64;
            for v in (0..=cap).rev() {
                above = above.saturating_add(ways[v]);
                if (lo as usize..=hi as usize).contains(&v) {
                    next[v] = above;
                }
            }
            ways = next;
        }
    }
    ways.iter().fold(0u64, |acc, &w| acc.saturating_add(w))
}

/// Refusal for a level with too many partitions to list.
pub(crate) fn too_many_partitions(count: u64, k: usize) -> Error {
    Error::TooLarge {
        what: format!("listing the {count} partitions of the branching level with {k} variables"),
        bytes: u128::from(count) * 16,
        instead: "compute single coefficients with kostka(shape, weight)".into(),
    }
}

/// Refusal for a recursion that would visit too many pairs of partitions.
pub(crate) fn too_many_pairs(pairs: u128) -> Error {
    Error::TooLarge {
        what: format!("the branching recursion, through {pairs} pairs of partitions,"),
        bytes: pairs * 16,
        instead: "compute single coefficients with kostka(shape, weight)".into(),
    }
}
