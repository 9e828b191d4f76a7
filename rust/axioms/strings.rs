//! String lengths phi_i, epsilon_i of every vertex, tolerant of broken tables: a vertex whose
//! string never ends (it runs into a cycle) gets UNKNOWN, and the f_i cycles are kept as witnesses.
#![deny(unsafe_code)]

use super::report::{Axiom, Sink};
use super::{id, Table};
use crate::error::Error;
use crate::job::Job;
use rayon::prelude::*;

/// String length of a vertex whose string is infinite.
pub(super) const UNKNOWN: i32 = -1;
/// Marks a vertex on the path being walked.
const ON_PATH: i32 = -2;
/// Marks a vertex not reached yet.
const UNSET: i32 = -3;
/// How many vertices of a cycle a witness lists.
const CYCLE_SHOWN: usize = 12;

/// The string lengths, vertex-major so that one vertex's phi_1.., epsilon_1.. share a cache
/// line: `rows[v * 2m + k]` is phi_{k+1}(v), `rows[v * 2m + m + k]` is epsilon_{k+1}(v), m = n - 1.
/// cycles: (i, vertices of one f_i cycle).
pub(super) struct Strings {
    m: usize,
    rows: Vec<i32>,
    cycles: Vec<(usize, Vec<usize>)>,
}

impl Strings {
    /// O(N) per operator, the operators in parallel, then one transposition.
    pub(super) fn new(table: &Table<'_>, job: &Job) -> Result<Self, Error> {
        let m = table.f.len();
        let walked = (0..2 * m)
            .into_par_iter()
            .map(|k| {
                job.checkpoint(table.count as u64)?;
                let op = if k < m { table.f[k] } else { table.e[k - m] };
                Ok(lengths(op))
            })
            .collect::<Result<Vec<_>, Error>>()?;
        let mut rows = vec![UNKNOWN; table.count * 2 * m];
        if m > 0 {
            rows.par_chunks_mut(2 * m).enumerate().for_each(|(v, row)| {
                for (k, (steps, _)) in walked.iter().enumerate() {
                    row[k] = steps[v];
                }
            });
        }
        let cycles = walked
            .into_iter()
            .take(m)
            .enumerate()
            .flat_map(|(k, (_, cycles))| cycles.into_iter().map(move |c| (k + 1, c)))
            .collect();
        Ok(Strings { m, rows, cycles })
    }

    /// The row of v: phi_1..phi_m, then epsilon_1..epsilon_m (UNKNOWN where infinite).
    #[inline]
    pub(super) fn row(&self, v: usize) -> &[i32] {
        &self.rows[v * 2 * self.m..(v + 1) * 2 * self.m]
    }

    /// phi_i(v), or None where the string is infinite.
    #[inline]
    pub(super) fn phi(&self, i: usize, v: usize) -> Option<i64> {
        known(self.rows[v * 2 * self.m + i - 1])
    }

    /// epsilon_i(v), or None where the string is infinite.
    #[inline]
    pub(super) fn eps(&self, i: usize, v: usize) -> Option<i64> {
        known(self.rows[v * 2 * self.m + self.m + i - 1])
    }

    /// One `cycle` witness per f_i cycle, at its smallest vertex.
    pub(super) fn report_cycles(&self, sink: &mut Sink) {
        for (i, cycle) in &self.cycles {
            let at = *cycle.iter().min().expect("a cycle has a vertex");
            let shown: Vec<i64> = cycle.iter().take(CYCLE_SHOWN).map(|&v| id(v)).collect();
            sink.add(Axiom::Cycle, (*i, 0), at, &shown, || {
                let more = if cycle.len() > CYCLE_SHOWN {
                    ", ..."
                } else {
                    ""
                };
                format!(
                    "f_{i} returns to vertex {at} after {} steps (an infinite {i}-string{more})",
                    cycle.len()
                )
            });
        }
    }
}

fn known(s: i32) -> Option<i64> {
    (s >= 0).then_some(i64::from(s))
}

/// steps[v] = number of times `op` applies from v (UNKNOWN on and before a cycle), and the
/// cycles found, each listed from the vertex where the walk met it. Each vertex is walked once.
fn lengths(op: &[i64]) -> (Vec<i32>, Vec<Vec<usize>>) {
    let mut steps = vec![UNSET; op.len()];
    let mut path: Vec<usize> = Vec::new();
    let mut cycles = Vec::new();
    for start in 0..op.len() {
        let mut v = start;
        // walk until the string ends, meets a known vertex, or meets the path itself
        let end = loop {
            if steps[v] != UNSET {
                break steps[v];
            }
            steps[v] = ON_PATH;
            path.push(v);
            match usize::try_from(op[v]) {
                Ok(t) => v = t,
                Err(_) => break UNSET, // the string ends at v
            }
        };
        // the length below the last vertex of the path, or None on a cycle
        let below = match end {
            ON_PATH => {
                let from = path.iter().position(|&u| u == v).expect("v is on the path");
                cycles.push(path[from..].to_vec());
                None
            }
            UNSET => Some(-1), // the path's last vertex ends the string
            UNKNOWN => None,
            known => Some(known),
        };
        let mut s = below;
        while let Some(u) = path.pop() {
            s = s.map(|s| s.saturating_add(1));
            steps[u] = s.unwrap_or(UNKNOWN);
        }
    }
    (steps, cycles)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn lengths_of_strings_and_cycles() {
        // 0 -> 1 -> 2 | 3 -> 4 -> 3 (cycle) | 5 -> 3 (into the cycle)
        let op = [1, 2, -1, 4, 3, 3];
        let (steps, cycles) = lengths(&op);
        assert_eq!(steps, vec![2, 1, 0, UNKNOWN, UNKNOWN, UNKNOWN]);
        assert_eq!(cycles, vec![vec![3, 4]]);
    }
}
