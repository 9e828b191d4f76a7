//! Axiom checks on any crystal table of type A_{n-1} (vertices 0..N-1, f_i and e_i index arrays
//! with -1 for "undefined", optional weights N x n), each violation reported with a witness, and
//! the explicit isomorphism of a connected crystal to the tableau crystal B(lambda).
//!
//! The checks, in the order they are reported at a vertex (i, j in 1..n-1, i != j):
//!
//! Basic crystal axioms (Kashiwara, "On crystal bases of the q-analogue of universal enveloping
//! algebras", 1991; Kashiwara-Nakashima 1994 for the tableau model):
//! - `inverse`: f_i x = y if and only if e_i y = x (checked from both sides).
//! - `injective`: f_i is injective where defined (two vertices with the same f_i target).
//! - `cycle`: no f_i-string closes up (every f_i-path is finite). A directed cycle that uses
//!   several colours always breaks `weight`, because each f_i lowers the sum
//!   sum_k (n - k) wt_k by one; so it is reported there, and as `cycle` (one witness per back
//!   edge of a depth-first search) only for a crystal given without weights.
//! - `weight`: wt(f_i x) = wt(x) - alpha_i, alpha_i = e_i - e_{i+1} (needs weights).
//! - `string_length`: phi_i(x) - epsilon_i(x) = wt(x)_i - wt(x)_{i+1}, phi_i and epsilon_i being
//!   the lengths of the i-string below and above x (needs weights).
//! - `seminormal`: a model that states its own phi_i / epsilon_i (as the tableau model does,
//!   by the signature rule) agrees with the string lengths: phi_i(x) = max{k : f_i^k x defined}
//!   and epsilon_i(x) = max{k : e_i^k x defined}. Together with `cycle` and `string_length`
//!   this is Kashiwara's seminormality.
//!
//! Stembridge's local axioms (J. R. Stembridge, "A local characterization of simply-laced
//! crystals", Trans. AMS 355, 2003), for the Cartan matrix of A_{n-1}: a_ii = 2, a_ij = -1 if
//! |i - j| = 1, a_ij = 0 otherwise. With delta(x, j) = -epsilon_j(x), and for an edge
//! e_i x defined, Delta_i delta(x, j) = delta(e_i x, j) - delta(x, j) and
//! Delta_i phi(x, j) = phi(e_i x, j) - phi(x, j); for f_i x defined,
//! Nabla_i delta(x, j) = delta(x, j) - delta(f_i x, j), Nabla_i phi(x, j) = phi(x, j) - phi(f_i x, j):
//! - P1 (every monochromatic path is finite) is `cycle`; P2 (at most one i-edge into and out
//!   of each vertex) is `inverse` and `injective`.
//! - `P3`: e_i x defined: Delta_i delta(x, j) + Delta_i phi(x, j) = a_ij.
//! - `P4`: e_i x defined: Delta_i delta(x, j) <= 0 and Delta_i phi(x, j) <= 0.
//! - `P5`: e_i x, e_j x defined and Delta_i delta(x, j) = 0: then y = e_i e_j x = e_j e_i x
//!   (both defined) and Nabla_j phi(y, i) = 0.
//! - `P6`: e_i x, e_j x defined and Delta_i delta(x, j) = Delta_j delta(x, i) = -1: then
//!   y = e_i e_j e_j e_i x = e_j e_i e_i e_j x (all defined) and
//!   Nabla_i phi(y, j) = Nabla_j phi(y, i) = -1.
//! - `P5'`, `P6'`: the duals, with f for e, Nabla phi for Delta delta and Delta delta for
//!   Nabla phi: f_i x, f_j x defined and Nabla_i phi(x, j) = 0 give y = f_i f_j x = f_j f_i x
//!   with Delta_j delta(y, i) = 0; Nabla_i phi(x, j) = Nabla_j phi(x, i) = -1 give
//!   y = f_i f_j f_j f_i x = f_j f_i f_i f_j x with Delta_i delta(y, j) = Delta_j delta(y, i) = -1.
//!
//! Stembridge's theorem: a connected graph satisfying P1-P6, P5', P6' is the crystal graph of
//! an irreducible highest weight representation. Checks that need a string length skip the
//! vertices whose string is infinite (already reported as `cycle`).
#![deny(unsafe_code)]

mod basic;
mod cycles;
pub mod iso;
mod report;
mod stembridge;
mod strings;

pub use report::{Axiom, Report, Witness};

use crate::crystal::check_arrays;
use crate::error::Error;
use crate::job::Job;
use rayon::prelude::*;
use report::Sink;
use strings::Strings;

/// Vertices per parallel block: large enough to amortise the checkpoint, small enough to balance.
const BLOCK: usize = 1 << 14;

/// A model's own string lengths: (phi[k], epsilon[k]) for i = k + 1.
pub type Declared<'a> = (Vec<&'a [i32]>, Vec<&'a [i32]>);

/// A crystal table as the checks read it. `f[k]`, `e[k]` are the operators of i = k + 1;
/// `weights` is vertex-major (`count` x `n`); `declared` holds a model's own (phi_i, epsilon_i).
pub struct Table<'a> {
    pub n: usize,
    pub count: usize,
    pub f: Vec<&'a [i64]>,
    pub e: Vec<&'a [i64]>,
    pub weights: Option<&'a [i32]>,
    pub declared: Option<Declared<'a>>,
}

impl Table<'_> {
    /// Validates lengths and index ranges, so that every later look-up is in bounds.
    pub fn validate(&self) -> Result<(), Error> {
        if self.n == 0 {
            return Err(Error::invalid("n must be a positive integer; got 0"));
        }
        if self.f.len() != self.n - 1 || self.e.len() != self.n - 1 {
            return Err(Error::invalid(format!(
                "a crystal of GL_{} needs {} lowering and raising arrays; got {} and {}",
                self.n,
                self.n - 1,
                self.f.len(),
                self.e.len()
            )));
        }
        check_arrays(&self.f, self.count, "lowering")?;
        check_arrays(&self.e, self.count, "raising")?;
        if let Some(w) = self.weights {
            if Some(w.len()) != self.count.checked_mul(self.n) {
                return Err(Error::invalid(format!(
                    "weights must have {} x {} entries; got {}",
                    self.count,
                    self.n,
                    w.len()
                )));
            }
        }
        if let Some((phi, eps)) = &self.declared {
            let bad =
                |a: &[&[i32]]| a.len() != self.n - 1 || a.iter().any(|s| s.len() != self.count);
            if bad(phi) || bad(eps) {
                return Err(Error::invalid(
                    "declared phi and epsilon must hold n - 1 arrays of one entry per vertex",
                ));
            }
        }
        Ok(())
    }

    /// The weight of vertex v (the table must have weights).
    fn weight(&self, v: usize) -> &[i32] {
        let w = self.weights.expect("only called when weights are present");
        &w[v * self.n..(v + 1) * self.n]
    }
}

/// What to check and how many witnesses to keep.
#[derive(Clone, Copy, Debug)]
pub struct Options {
    pub stembridge: bool,
    pub max_witnesses: usize,
}

/// Checks every axiom listed in the module docs on `table`; returns the total count per axiom
/// and the first `max_witnesses` witnesses in vertex order (ties by axiom, then i, then j).
/// Cost O(N (n-1)) for the basic axioms and O(N (n-1)^2) for Stembridge's, in parallel blocks
/// of vertices; the output does not depend on the number of threads.
pub fn check(table: &Table<'_>, options: Options, job: &Job) -> Result<Report, Error> {
    table.validate()?;
    let strings = Strings::new(table, job)?;
    let cap = options.max_witnesses;
    let mut sink = Sink::new(cap);
    strings.report_cycles(&mut sink);
    basic::report_collisions(table, &mut sink);
    if table.weights.is_none() {
        cycles::report_mixed_cycles(table, &mut sink, job)?;
    }
    let starts: Vec<usize> = (0..table.count).step_by(BLOCK).collect();
    let blocks = starts
        .par_iter()
        .map(|&start| {
            let end = (start + BLOCK).min(table.count);
            job.checkpoint((end - start) as u64)?;
            let mut local = Sink::new(cap);
            for x in start..end {
                basic::check_vertex(table, &strings, x, &mut local);
                if options.stembridge {
                    stembridge::check_vertex(table, &strings, x, &mut local);
                }
            }
            Ok(local)
        })
        .collect::<Result<Vec<Sink>, Error>>()?;
    for block in blocks {
        sink.absorb(block);
    }
    Ok(sink.finish())
}

/// Vertex index as i64 for witnesses (vertex counts fit i64: `check_arrays` ensured it).
fn id(v: usize) -> i64 {
    i64::try_from(v).expect("vertex counts fit i64")
}

/// Optional vertex as i64 (-1 for none) for witnesses.
fn opt_id(v: Option<usize>) -> i64 {
    v.map_or(-1, id)
}

/// Follows an operator array: the target of v, or None.
#[inline]
fn step(op: &[i64], v: usize) -> Option<usize> {
    usize::try_from(op[v]).ok()
}

#[cfg(test)]
mod tests;
