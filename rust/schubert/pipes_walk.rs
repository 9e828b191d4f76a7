//! Walking the pipe dream graph in ascending mask order from any rank: the streaming and
//! parallel enumeration of rust/schubert/pipes.rs.
//!
//! A path from the root picks one edge (one row's crosses) per level. The walk stops early at a
//! node with a single completion and adds that node's precomputed tail, so the rows near the
//! bottom, where choices run out, cost nothing per pipe dream.
#![deny(unsafe_code)]

use super::pipes::{add_field, mask_words, PipeDreamGraph};
use crate::error::Error;
use crate::job::Job;

impl PipeDreamGraph {
    /// Pipe dreams with ranks start..start + out.len() / W, their masks written to `out`
    /// (W words each, most significant first), in ascending mask order.
    pub fn range_into(&self, start: u128, out: &mut [u64], job: &Job) -> Result<(), Error> {
        let words = mask_words(self.n);
        if words == 0 {
            return Ok(()); // n <= 1: the one, empty pipe dream has an empty mask
        }
        let total = self.total().unwrap_or(u128::MAX);
        let len = out.len() / words;
        if start.checked_add(len as u128).is_none_or(|end| end > total) {
            return Err(Error::invalid(format!(
                "pipe dream range {start}..{start}+{len} is past the count {total}"
            )));
        }
        if len == 0 {
            return Ok(());
        }
        let mut walk = Walk::seek(self, start);
        for (k, slot) in out.chunks_exact_mut(words).enumerate() {
            walk.write(self, slot);
            if k + 1 < len {
                walk.advance(self);
            }
            if k % 65536 == 65535 {
                job.checkpoint(65536)?;
            }
        }
        Ok(())
    }

    fn single(&self, node: usize) -> bool {
        self.counts[node] == Some(1)
    }
}

/// A position in the walk: the edge taken at each of the first `depth` levels, the end of each
/// level's edge range, and the mask of the rows so far (W words per level, level 0 empty).
/// The node reached after `depth` levels has a single completion.
struct Walk {
    edge: Vec<usize>,
    end: Vec<usize>,
    prefix: Vec<u64>,
    words: usize,
    depth: usize,
    bottom: usize,
}

impl Walk {
    /// The path of the pipe dream of rank `skip`, found by subtracting subtree counts.
    fn seek(g: &PipeDreamGraph, mut skip: u128) -> Self {
        let rows = g.n.saturating_sub(1);
        let words = mask_words(g.n);
        let mut walk = Walk {
            edge: vec![0; rows],
            end: vec![0; rows],
            prefix: vec![0; (rows + 1) * words],
            words,
            depth: 0,
            bottom: 0,
        };
        while !g.single(walk.bottom) {
            let (mut e, end) = (g.start[walk.bottom], g.start[walk.bottom + 1]);
            loop {
                let c = g.counts[g.edges[e].child as usize].unwrap_or(u128::MAX);
                if skip < c || e + 1 == end {
                    break;
                }
                skip -= c;
                e += 1;
            }
            walk.push(g, e, end);
        }
        walk
    }

    /// Takes edge e (of a range ending at `end`) at the next level.
    fn push(&mut self, g: &PipeDreamGraph, e: usize, end: usize) {
        let (l, w) = (self.depth, self.words);
        (self.edge[l], self.end[l]) = (e, end);
        let (done, next) = self.prefix.split_at_mut((l + 1) * w);
        let slot = &mut next[..w];
        slot.copy_from_slice(&done[l * w..]);
        add_field(slot, g.edges[e].field, g.offsets[l]);
        self.depth = l + 1;
        self.bottom = g.edges[e].child as usize;
    }

    /// The next path in order: the deepest level with a next sibling moves on, and the walk
    /// goes down the first edges until a single completion.
    fn advance(&mut self, g: &PipeDreamGraph) {
        let Some(level) = (0..self.depth)
            .rev()
            .find(|&l| self.edge[l] + 1 < self.end[l])
        else {
            return;
        };
        let (e, end) = (self.edge[level] + 1, self.end[level]);
        self.depth = level;
        self.push(g, e, end);
        while !g.single(self.bottom) {
            let node = self.bottom;
            self.push(g, g.start[node], g.start[node + 1]);
        }
    }

    fn write(&self, g: &PipeDreamGraph, slot: &mut [u64]) {
        let w = self.words;
        let prefix = &self.prefix[self.depth * w..(self.depth + 1) * w];
        let tail = &g.tails[self.bottom * w..(self.bottom + 1) * w];
        for ((s, p), t) in slot.iter_mut().zip(prefix).zip(tail) {
            *s = p | t;
        }
    }
}
