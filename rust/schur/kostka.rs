//! Kostka numbers K_{lambda, w}: semistandard tableaux of shape lambda and content w, counted
//! along Gelfand-Tsetlin patterns.
#![deny(unsafe_code)]

use super::width::{Coeff, Halt, Ticker};
use crate::error::Error;
use crate::job::Job;
use num_bigint::BigUint;
use std::collections::HashMap;

/// Memory the partial counts of one level may take.
const BUDGET_BYTES: u128 = 4 << 30;

/// K_{lambda, w} computed in `C`: the partitions mu^(k) = cells holding entries <= k form a chain
/// with `mu^(k)/mu^(k-1)` a horizontal strip of `w_k` cells (Macdonald, Symmetric Functions and Hall
/// Polynomials, 2nd ed., 1995, Ch. I (5.11) and sec. 6), so level by level the count of each
/// mu^(k) is the sum of the counts of the mu^(k-1) it extends. Weights are taken in the order
/// given. `lambda` is a partition without trailing zeros and |w| = |lambda|.
pub(crate) fn count<C: Coeff>(
    lambda: &[usize],
    weight: &[usize],
    job: &Job,
) -> Result<BigUint, Halt> {
    let rows = lambda.len();
    let per_state = (rows as u128) * 8 + 64 + std::mem::size_of::<C>() as u128;
    let max_states = usize::try_from(BUDGET_BYTES / per_state).unwrap_or(usize::MAX);
    let mut letters_left = weight.iter().filter(|&&w| w > 0).count();
    let mut counts: HashMap<Vec<usize>, C> = HashMap::from([(vec![0; rows], C::one())]);
    let mut ticker = Ticker::default();
    for &w in weight.iter().filter(|&&w| w > 0) {
        letters_left -= 1;
        // Columns of lambda/nu must fit the letters still to come: nu_j >= lambda_{j + left}.
        let floor: Vec<usize> = (0..rows)
            .map(|j| lambda.get(j + letters_left).copied().unwrap_or(0))
            .collect();
        let mut next: HashMap<Vec<usize>, C> = HashMap::new();
        for (mu, c) in &counts {
            let mut strip = Strip {
                lambda,
                floor: &floor,
                mu,
                nu: mu.clone(),
                slack: Vec::new(),
            };
            if !strip.prepare() || !(strip.slack[0].0..=strip.slack[0].1).contains(&w) {
                continue;
            }
            let mut failed = None;
            strip.extend(0, w, &mut |nu| {
                let slot = next.entry(nu.to_vec()).or_insert_with(C::zero);
                if slot.add_checked(c) {
                    failed = Some(Halt::Overflow);
                }
            });
            if let Some(halt) = failed {
                return Err(halt);
            }
            if next.len() > max_states {
                return Err(Halt::Fail(too_many_states(next.len())));
            }
            ticker.tick(job, rows.max(1))?;
        }
        counts = next;
    }
    Ok(counts.get(lambda).map_or(BigUint::ZERO, Coeff::to_big))
}

/// The horizontal strips `nu/mu` inside lambda with nu above `floor`: `nu_j` runs over
/// `max(mu_j, floor_j) ..= min(lambda_j, mu_{j-1})`.
struct Strip<'a> {
    lambda: &'a [usize],
    floor: &'a [usize],
    mu: &'a [usize],
    nu: Vec<usize>,
    /// slack[j] = (least, most) cells rows j.. can take together.
    slack: Vec<(usize, usize)>,
}

impl Strip<'_> {
    fn range(&self, j: usize) -> (usize, usize) {
        let top = if j == 0 {
            self.lambda[0]
        } else {
            self.lambda[j].min(self.mu[j - 1])
        };
        (self.mu[j].max(self.floor[j]), top)
    }

    /// Fills `slack`; false if mu has no such strip at all (a row with an empty range).
    fn prepare(&mut self) -> bool {
        let rows = self.mu.len();
        self.slack = vec![(0, 0); rows + 1];
        for j in (0..rows).rev() {
            let (from, to) = self.range(j);
            if from > to {
                return false;
            }
            let (least, most) = self.slack[j + 1];
            self.slack[j] = (least + from - self.mu[j], most + to - self.mu[j]);
        }
        true
    }

    /// Places `cells` more cells in rows j.., never entering a branch that cannot finish.
    fn extend(&mut self, j: usize, cells: usize, emit: &mut impl FnMut(&[usize])) {
        if j == self.mu.len() {
            emit(&self.nu); // cells == 0 here: the slack bounds of the last row were exact
            return;
        }
        let (from, to) = self.range(j);
        let (least_below, most_below) = self.slack[j + 1];
        let lo = from.max(self.mu[j] + cells.saturating_sub(most_below));
        let hi = to.min(self.mu[j] + cells - least_below);
        for a in lo..=hi {
            self.nu[j] = a;
            self.extend(j + 1, cells - (a - self.mu[j]), emit);
        }
        self.nu[j] = self.mu[j];
    }
}

fn too_many_states(states: usize) -> Error {
    Error::TooLarge {
        what: format!("the Kostka number recursion (more than {states} partial shapes)"),
        bytes: BUDGET_BYTES + 1,
        instead: "use a smaller shape".into(),
    }
}
