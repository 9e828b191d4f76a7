//! Weak compositions with a bound on each part, ranked so that the last part is most significant.
//!
//! Compositions `a = (a_1, ..., a_k)` of d with `0 <= a_i <= cap` are ranked in colexicographic order:
//! `rank(a) = sum over e < a_k of count(d - e, k - 1), plus rank(a_1, ..., a_{k-1})`. All compositions
//! with a given last part e therefore form one contiguous block, and inside it they sit in the
//! order of their own rank among compositions of d - e into k - 1 parts. That is what makes
//! `x_k^e * s_mu(x_1..x_{k-1})` a single block addition in the Schur kernel.
#![deny(unsafe_code)]

/// `count(d, k)` for all `k <= max_parts` and `d <= max_sum`, saturating at `u64::MAX`: a
/// saturated count stays saturated along its row and the next, so any array it would size makes
/// the memory estimate refuse the request. `prefix` holds running sums of each row modulo 2^64,
/// whose differences are exact for every range of counts that sizes an accepted array.
#[derive(Debug, Clone)]
pub(crate) struct Compositions {
    cap: usize,
    max_sum: usize,
    table: Vec<u64>,
    prefix: Vec<u64>,
}

impl Compositions {
    /// Cost `O(max_parts * max_sum)` time and 16 bytes per entry; callers bound both first.
    pub(crate) fn new(cap: usize, max_sum: usize, max_parts: usize) -> Self {
        let width = max_sum + 1;
        let mut table = vec![0u64; width * (max_parts + 1)];
        table[0] = 1; // the empty composition of 0
        for k in 1..=max_parts {
            let (before, row) = table.split_at_mut(k * width);
            let prev = &before[(k - 1) * width..];
            // row[d] = prev[d] + prev[d-1] + ... + prev[d-cap]: a sliding window sum.
            let mut window = 0u64;
            for d in 0..width {
                window = window.saturating_add(prev[d]);
                if d > cap {
                    // A saturated window cannot be un-added; it stays saturated, which is safe.
                    if window != u64::MAX {
                        window -= prev[d - cap - 1];
                    }
                }
                row[d] = window;
            }
        }
        let mut prefix = table.clone();
        for row in prefix.chunks_mut(width) {
            for d in 1..row.len() {
                row[d] = row[d].wrapping_add(row[d - 1]);
            }
        }
        Compositions {
            cap,
            max_sum,
            table,
            prefix,
        }
    }

    pub(crate) fn cap(&self) -> usize {
        self.cap
    }

    /// Number of compositions of `d` into `k` parts, each at most `cap` (saturating).
    #[inline]
    pub(crate) fn count(&self, d: usize, k: usize) -> u64 {
        self.table[k * (self.max_sum + 1) + d]
    }

    /// `count` as a length: only called on sizes that passed the memory estimate.
    #[inline]
    pub(crate) fn len(&self, d: usize, k: usize) -> usize {
        usize::try_from(self.count(d, k)).expect("array sizes were checked against the budget")
    }

    /// Where the block of compositions of `d` into `k >= 1` parts with last part `e` starts:
    /// `sum over e' < e of count(d - e', k - 1)`, in O(1). The block has `len(d - e, k - 1)`
    /// entries.
    #[inline]
    pub(crate) fn block_start(&self, d: usize, k: usize, e: usize) -> usize {
        if e == 0 {
            return 0;
        }
        let row = (k - 1) * (self.max_sum + 1);
        let sum = self.prefix[row + d].wrapping_sub(self.prefix[row + d - e]);
        usize::try_from(sum).expect("array sizes were checked against the budget")
    }

    /// Rank of the composition `parts` (of their sum, into `parts.len()` parts of at most cap).
    pub(crate) fn rank(&self, parts: &[u32]) -> usize {
        let mut rest: usize = parts.iter().map(|&p| p as usize).sum();
        let mut rank = 0;
        for k in (1..=parts.len()).rev() {
            let last = parts[k - 1] as usize;
            rank += self.block_start(rest, k, last);
            rest -= last;
        }
        rank
    }

    /// Visits every composition of `d` into `k` parts in decreasing rank order, calling
    /// `visit(rank, parts)` with the parts listed last first: `(a_k, a_{k-1}, ..., a_1)` after the
    /// `prefix` already in `stack`. Cost: O(count(d, k) * k) in the worst case, O(1) amortised
    /// per composition when the blocks are large.
    pub(crate) fn walk_descending(
        &self,
        d: usize,
        k: usize,
        base: usize,
        stack: &mut Vec<u32>,
        visit: &mut impl FnMut(usize, &[u32]),
    ) {
        if k == 0 {
            if d == 0 {
                visit(base, stack);
            }
            return;
        }
        // Last parts from the largest down to the least that leaves the others room.
        let (top, least) = (self.cap.min(d), d.saturating_sub(self.cap * (k - 1)));
        for e in (least..=top).rev() {
            let start = base + self.block_start(d, k, e);
            stack.push(u32::try_from(e).expect("parts are at most cap, which fits u32"));
            self.walk_descending(d - e, k - 1, start, stack, visit);
            stack.pop();
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn counts_and_ranks_agree() {
        let c = Compositions::new(3, 9, 4);
        // compositions of 4 into 3 parts at most 3: C(6, 2) - 3 = 12 (the three with a part 4)
        assert_eq!(c.count(4, 3), 12);
        assert_eq!(c.block_start(4, 3, 3) + c.len(1, 2), 12);
        let mut seen = Vec::new();
        c.walk_descending(4, 3, 0, &mut Vec::new(), &mut |rank, parts| {
            seen.push((rank, parts.to_vec()));
        });
        let ranks: Vec<usize> = seen.iter().map(|s| s.0).collect();
        assert_eq!(ranks, (0..12).rev().collect::<Vec<_>>());
        // Listed last part first, in decreasing lexicographic order of that listing.
        assert_eq!(seen[0].1, vec![3, 1, 0]);
        assert_eq!(seen[11].1, vec![0, 1, 3]);
        assert!(seen.windows(2).all(|w| w[0].1 > w[1].1));
        for (rank, listed) in &seen {
            let parts: Vec<u32> = listed.iter().rev().copied().collect();
            assert_eq!(c.rank(&parts), *rank);
        }
    }
}
