//! Rank differences of single moves, tabulated per level: with them an operator's target costs
//! two table look-ups instead of four rank terms.
//!
//! f_i lowers one part of lambda^(i) by one and e_i raises one; only the rank terms of levels i
//! (pair lambda^(i) over lambda^(i-1)) and i+1 (pair lambda^(i+1) over lambda^(i)) change. For
//! every entry (nu, mu) of a level's table and every row r, `inner` holds the change of that
//! level's term when mu_r moves, and `outer` the change when nu_r moves (mu fixed).
#![deny(unsafe_code)]

use super::tables::Level;
use super::Model;

/// The tabulated moves of one level k: index `(entry * rows + r) * 2 + (0 for down, 1 for up)`.
#[derive(Debug, Clone)]
pub struct Moves {
    rows: usize,
    inner: Vec<i64>,
    outer: Vec<i64>,
}

impl Moves {
    /// Tabulates level k (1..=n). Moves that leave the table give 0: the signature rule never asks
    /// for them. Cost: entries x rows x O(rows).
    pub fn new(m: &Model, k: usize) -> Self {
        let (rows, w) = (m.rows, m.rows + 1);
        let level = m.level(k);
        let mut moves = Moves {
            rows,
            inner: vec![0; level.len() * rows * 2],
            outer: vec![0; level.len() * rows * 2],
        };
        let (mut mu, mut shifted_part) = (vec![0u16; w], vec![0u16; w]);
        if m.count() == 0 {
            return moves; // more rows than letters: no tables, no tableau to move
        }
        let free = m.free_rows(k);
        for nu in m.sub.all() {
            let mut nu = nu;
            nu.push(0);
            let nu_id = m.sub.id(&nu);
            if m.rows > k && nu[k] > 0 {
                continue;
            }
            for t in 0..Model::box_size(&nu, free) {
                super::tables::decode(&nu, t, free, &mut mu);
                let entry = level.entry(nu_id, &nu, &mu);
                let here = level.offset(nu_id, &nu, &mu);
                for r in 0..rows {
                    for (dir, up) in [(0, false), (1, true)] {
                        let slot = (entry * rows + r) * 2 + dir;
                        if let Some(x) = shifted(&mu, r, up, &mut shifted_part) {
                            let there = level.try_offset(nu_id, &nu, x);
                            moves.inner[slot] = there.map_or(0, |o| delta(o, here));
                        }
                        if let Some(x) = shifted(&nu, r, up, &mut shifted_part) {
                            moves.outer[slot] = outer_delta(m, &level, x, &mu, here);
                        }
                    }
                }
            }
        }
        moves
    }

    /// Change of the term when part r of mu moves (down or up).
    #[inline]
    pub fn inner(&self, entry: usize, r: usize, up: bool) -> i64 {
        self.inner[(entry * self.rows + r) * 2 + usize::from(up)]
    }

    /// Change of the term when part r of nu moves (down or up), mu fixed.
    #[inline]
    pub fn outer(&self, entry: usize, r: usize, up: bool) -> i64 {
        self.outer[(entry * self.rows + r) * 2 + usize::from(up)]
    }
}

fn shifted<'a>(p: &[u16], r: usize, up: bool, out: &'a mut [u16]) -> Option<&'a [u16]> {
    out.copy_from_slice(p);
    out[r] = if up {
        p[r].checked_add(1)?
    } else {
        p[r].checked_sub(1)?
    };
    Some(out)
}

fn outer_delta(m: &Model, level: &Level<'_>, nu: &[u16], mu: &[u16], here: u64) -> i64 {
    let is_partition = nu.windows(2).all(|w| w[0] >= w[1]);
    let inside = nu.iter().zip(&m.shape).all(|(&a, &b)| usize::from(a) <= b);
    if !is_partition || !inside {
        return 0;
    }
    level
        .try_offset(m.sub.id(nu), nu, mu)
        .map_or(0, |o| delta(o, here))
}

#[allow(clippy::cast_possible_wrap)]
fn delta(to: u64, from: u64) -> i64 {
    // counts are below 2^63 (checked when the model is built), so differences fit i64
    to as i64 - from as i64
}
