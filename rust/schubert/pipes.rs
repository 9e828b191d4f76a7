//! Reduced pipe dreams (RC-graphs) of a permutation: an exact count and the enumeration in
//! ascending bit-mask order, without duplicates and without dead ends.
//!
//! Method: the row-by-row expansion of Fomin-Stanley, "Schubert polynomials and the nilCoxeter
//! algebra", 1994 (Adv. Math. 103): S_w is the coefficient of w in A_1(x_1) ... A_{n-1}(x_{n-1}),
//! A_r(x) = (1 + x u_{n-1})(1 + x u_{n-2}) ... (1 + x u_r) in the nilCoxeter algebra. A term of the
//! product is one choice of crosses per row, read right to left as in Bergeron-Billey, "RC-graphs
//! and Schubert polynomials", 1993; the nilCoxeter relations keep exactly the reduced ones.
//! Row r takes a decreasing word c_r in the letters r..n-1 with w = c_1 ... c_r v, lengths adding,
//! and the rows below can finish v exactly when v lies in the parabolic subgroup on the letters
//! r+1..n-1 (the staircase below row r is that subgroup's full staircase, whose Demazure product
//! is its longest element, and every element is below it in Bruhat order: the subword property,
//! Bjorner-Brenti, "Combinatorics of Coxeter Groups", 2005, Thm. 2.2.2). So the states
//! (row, v) form a graph in which every state reaches the end: counting is a sum over the graph,
//! and enumeration walks it in order with no search that fails.
//!
//! Mask encoding (shared): the L = n(n-1)/2 cells in reading order (rows top to bottom, each right
//! to left) are bits L-1 down to 0, the first cell the most significant. Row r (1-based) is then a
//! contiguous field whose bit c-1 is the cell (r, c), so ascending masks are the lexicographic
//! order of the row fields, row 1 first; the graph's edges are sorted by field for that reason.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use num_bigint::BigUint;
use std::collections::HashMap;

/// Largest n served: a row field must fit a u64 (row 1 has n - 1 cells).
pub const MAX_N: usize = 64;
/// The graph is refused past this many states (each costs about 100 bytes with its key)...
const MAX_STATES: usize = 1 << 22;
/// ... or this many edges (16 bytes each).
const MAX_EDGES: usize = 1 << 26;

/// One row's choice: the crosses of the row as a field (bit c-1 = column c), and the next state.
#[derive(Clone, Copy, Debug)]
pub(super) struct Edge {
    pub(super) field: u64,
    pub(super) child: u32,
}

/// The graph of states (row, v): v^{-1} is stored, since left multiplication by s_a on v is a
/// swap of positions a, a+1 in v^{-1}. Node 0 is w at row 1; the last node is the identity.
#[derive(Debug)]
pub struct PipeDreamGraph {
    pub(super) n: usize,
    /// Level (0-based row) of each node; the end node has level n - 1.
    pub(super) level: Vec<u8>,
    /// Edges of node k are edges[start[k]..start[k + 1]], by ascending field.
    pub(super) start: Vec<usize>,
    pub(super) edges: Vec<Edge>,
    /// Completions of each node, or None past u128.
    pub(super) counts: Vec<Option<u128>>,
    /// Bit offset of row r's field in the mask.
    pub(super) offsets: Vec<u32>,
    /// For a node with one completion, the mask of its rows (W words), else zeros.
    pub(super) tails: Vec<u64>,
}

/// Number of cells L = n(n-1)/2 and 64-bit words W = ceil(L/64) of a mask.
pub fn mask_words(n: usize) -> usize {
    (n * n.saturating_sub(1) / 2).div_ceil(64)
}

/// The decreasing words of row `r` (0-based letters r..n-2) that are left factors of v, lengths
/// adding, leaving a v' that fixes r: (field, v'^{-1}) pairs, fields ascending.
///
/// With u = v^{-1} and p = v(r) the position of the value r in u (p >= r, since v fixes
/// 0..r-1), only the letter a moves the value at position a + 1 to a, and letters come in
/// decreasing order. So the value r reaches position r exactly when the letters p-1, ..., r
/// are all taken (each a descent, as everything right of the value r is larger) and p is not;
/// the letters above p touch only positions past p and are free, subject to being descents.
/// Every choice found is valid, so the search costs in proportion to what it returns; it stops
/// (None) past `budget` choices, since one state of a large w can have 2^(n-r) of them.
fn row_choices(inv: &[u8], r: usize, budget: usize) -> Option<Vec<(u64, Vec<u8>)>> {
    let n = inv.len();
    let p = inv
        .iter()
        .position(|&x| usize::from(x) == r)
        .expect("a permutation");
    let mut u = inv.to_vec();
    u[r..=p].rotate_right(1); // the letters p-1, ..., r, applied after the free ones
    let forced = (1u64 << (p - r)) - 1;
    let mut out = Vec::new();
    if !free_letters(&mut u, r, p + 1, n - 1, forced, &mut out, budget) {
        return None;
    }
    out.sort_unstable_by_key(|(field, _)| *field);
    Some(out)
}

/// Letters a = top-1 down to lo: take s_a when it is a left descent of v (u[a] > u[a+1]).
/// False once `out` would exceed `budget` entries.
fn free_letters(
    u: &mut Vec<u8>,
    r: usize,
    lo: usize,
    top: usize,
    field: u64,
    out: &mut Vec<(u64, Vec<u8>)>,
    budget: usize,
) -> bool {
    if top <= lo {
        out.push((field, u.clone()));
        return out.len() <= budget;
    }
    let a = top - 1;
    if !free_letters(u, r, lo, a, field, out, budget) {
        return false;
    }
    if u[a] > u[a + 1] {
        u.swap(a, a + 1);
        let fits = free_letters(u, r, lo, a, field | (1 << (a - r)), out, budget);
        u.swap(a, a + 1);
        return fits;
    }
    true
}

/// The refusal once the graph outgrows its caps (sizes as far as they were built: a lower bound).
fn too_large(n: usize, states: usize, edges: usize) -> Error {
    Error::TooLarge {
        what: format!(
            "the pipe dream state graph of this permutation of S_{n} (past its cap of \
             {MAX_STATES} states and {MAX_EDGES} arrows)"
        ),
        bytes: (100 * states + 16 * edges) as u128,
        instead: "no smaller route to this count is offered yet".into(),
    }
}

impl PipeDreamGraph {
    /// Builds the graph of w (0-based one-line notation), row by row, then counts bottom-up.
    pub fn new(w: &[usize], job: &Job) -> Result<Self, Error> {
        let n = w.len();
        if n > MAX_N {
            return Err(Error::invalid(format!(
                "perm must have at most {MAX_N} letters for pipe dreams; got n = {n}"
            )));
        }
        let mut inv = vec![0u8; n];
        for (pos, &x) in w.iter().enumerate() {
            inv[x] = u8::try_from(pos).expect("n <= 64");
        }
        let rows = n.saturating_sub(1);
        let mut g = PipeDreamGraph {
            n,
            level: vec![0],
            start: vec![0],
            edges: Vec::new(),
            counts: Vec::new(),
            offsets: row_offsets(n),
            tails: Vec::new(),
        };
        let mut frontier: Vec<Vec<u8>> = vec![inv];
        for r in 0..rows {
            let first_next = g.level.len();
            let mut next: HashMap<Vec<u8>, u32> = HashMap::new();
            let mut next_list: Vec<Vec<u8>> = Vec::new();
            for u in &frontier {
                // the choices of one state are distinct next states, so both caps bound them
                let states = first_next + next_list.len();
                let budget = MAX_EDGES
                    .saturating_sub(g.edges.len())
                    .min(MAX_STATES.saturating_sub(states));
                let Some(choices) = row_choices(u, r, budget) else {
                    return Err(too_large(n, MAX_STATES, MAX_EDGES));
                };
                for (field, child) in choices {
                    let id = *next.entry(child.clone()).or_insert_with(|| {
                        next_list.push(child);
                        u32::try_from(first_next + next_list.len() - 1).unwrap_or(u32::MAX)
                    });
                    g.edges.push(Edge { field, child: id });
                }
                g.start.push(g.edges.len());
                job.checkpoint(1)?;
                let states = first_next + next_list.len();
                if states > MAX_STATES || g.edges.len() > MAX_EDGES {
                    return Err(too_large(n, states, g.edges.len()));
                }
            }
            g.level.extend(std::iter::repeat_n(
                u8::try_from(r + 1).expect("n <= 64"),
                next_list.len(),
            ));
            frontier = next_list;
        }
        // the last level holds the identity alone, with no edges
        debug_assert_eq!(frontier.len(), 1);
        g.start.push(g.edges.len());
        g.counts = g.count_with(|| Some(1u128), |a, b| a?.checked_add(b?));
        g.tails = g.single_path_tails();
        Ok(g)
    }

    /// Completion counts of every node in any exact arithmetic: leaf value `one`, sum `add`.
    fn count_with<T: Clone>(&self, one: impl Fn() -> T, add: impl Fn(T, T) -> T) -> Vec<T> {
        let nodes = self.level.len();
        let mut counts: Vec<Option<T>> = vec![None; nodes];
        for k in (0..nodes).rev() {
            let (a, b) = (self.start[k], self.start[k + 1]);
            counts[k] = Some(if a == b {
                one()
            } else {
                self.edges[a..b]
                    .iter()
                    .map(|e| {
                        counts[e.child as usize]
                            .clone()
                            .expect("children come later")
                    })
                    .reduce(&add)
                    .expect("a node without edges is the end node")
            });
        }
        counts.into_iter().map(|c| c.expect("filled")).collect()
    }

    /// Bottom-up: a node with one completion has one edge, to a child with one completion, so
    /// its tail is that edge's field added to the child's tail.
    fn single_path_tails(&self) -> Vec<u64> {
        let w = mask_words(self.n);
        let mut tails = vec![0u64; self.level.len() * w];
        for k in (0..self.level.len()).rev() {
            let (a, b) = (self.start[k], self.start[k + 1]);
            if b != a + 1 || self.counts[k] != Some(1) {
                continue;
            }
            let Edge { field, child } = self.edges[a];
            let (head, rest) = tails.split_at_mut(child as usize * w);
            let slot = &mut head[k * w..(k + 1) * w];
            slot.copy_from_slice(&rest[..w]);
            add_field(slot, field, self.offsets[usize::from(self.level[k])]);
        }
        tails
    }

    pub fn n(&self) -> usize {
        self.n
    }

    /// The number of pipe dreams if it fits a u128.
    pub fn total(&self) -> Option<u128> {
        self.counts[0]
    }

    /// The exact number of pipe dreams, S_w(1, ..., 1), in big integers when u128 overflows.
    pub fn total_big(&self) -> BigUint {
        match self.counts[0] {
            Some(c) => BigUint::from(c),
            None => self.count_with(|| BigUint::from(1u8), |a, b| a + b)[0].clone(),
        }
    }
}

/// Bit offset of each row's field: row r (0-based) holds cells L - (n-1) - ... - (n-1-r) upward.
pub(super) fn row_offsets(n: usize) -> Vec<u32> {
    let cells = n * n.saturating_sub(1) / 2;
    let mut used = 0;
    (0..n.saturating_sub(1))
        .map(|r| {
            used += n - 1 - r;
            u32::try_from(cells - used).expect("n <= 64")
        })
        .collect()
}

/// ORs a row field, placed at bit offset `off` of the mask, into W words (most significant first).
pub(super) fn add_field(mask: &mut [u64], field: u64, off: u32) {
    let (words, off) = (mask.len(), off as usize);
    let (word, bit) = (words - 1 - off / 64, off % 64);
    mask[word] |= field << bit;
    if bit > 0 && word > 0 {
        mask[word - 1] |= field >> (64 - bit);
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn big_integer_counts_agree() {
        let job = Job::default();
        let g = PipeDreamGraph::new(&[0, 5, 4, 3, 2, 1], &job).unwrap();
        let big = g.count_with(|| BigUint::from(1u8), |a, b| a + b);
        let small: Vec<BigUint> = g.counts.iter().map(|c| BigUint::from(c.unwrap())).collect();
        assert_eq!(big, small);
        assert_eq!(g.total(), Some(42)); // Catalan C_5 (OEIS A000108)
        let wide: Vec<usize> = (0..65).collect();
        assert!(PipeDreamGraph::new(&wide, &job).is_err()); // past MAX_N
    }
}
