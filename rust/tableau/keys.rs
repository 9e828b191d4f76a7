//! Right and left keys of semistandard tableaux (Lascoux-Schutzenberger), for a whole array of
//! tableaux at once.
//!
//! A key tableau is a semistandard tableau whose columns are nested (each column's set of
//! entries contains the next one's); the key of content alpha has column c = {j : alpha_j >= c}.
//! The right key K_+(T) and the left key K_-(T) are the key tableaux of T's shape found by the
//! jeu de taquin route of Lascoux and Schutzenberger, "Keys and standard bases" (1990), with
//! frank words (see also Reiner and Shimozono, "Key polynomials and a flagged
//! Littlewood-Richardson rule", 1995): column j of K_+(T) is the last column of the
//! anti-rectification of the columns j..m of T, and column j of K_-(T) is the first column of
//! the anti-rectification of the columns 1..j.
//!
//! Anti-rectification is done through the Schutzenberger involution: for a straight tableau S
//! with entries in 1..n, evac(S) = P(w*), the row insertion tableau (Schensted 1961) of w* = the
//! reverse of S's row reading word with every x replaced by n+1-x (Schutzenberger, "Promotion des
//! morphismes d'ensembles ordonnes", 1972; Fulton, "Young Tableaux", 1997, Appendix A). Turning
//! evac(S) by 180 degrees with x -> n+1-x gives an anti-normal tableau whose reading word is
//! Knuth equivalent to S's (w -> w* maps Knuth classes to Knuth classes), so it is antirect(S).
//! Hence column j of K_+(T) is {n+1-x : x in the first column of evac(T_{>=j})} and column j of
//! K_-(T) is {n+1-x : x in the last column of evac(T_{<=j})}; evac keeps the shape, so both have
//! the length of T's column j. Cost: O(|T|) insertions of O(rows * width) per column of T.
//! tests/test_tableau_keys.py checks the result against literal reverse slides and against the
//! Demazure crystal theorem (T in B_w(lambda) iff K_+(T) <= key(w.lambda)).
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;
use crate::memory::filled;
use crate::partition::normalize;
use rayon::prelude::*;

/// Tableaux per parallel block (and per checkpoint).
const BLOCK: usize = 1 << 12;

/// Which key: the right key K_+(T) (entrywise >= T) or the left key K_-(T) (entrywise <= T).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum KeySide {
    Right,
    Left,
}

/// The keys of N tableaux: cells (N x |shape|, row-major like the input) and contents (N x n).
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct Keys {
    pub cells: Vec<u8>,
    pub weights: Vec<i32>,
}

/// The shape's row starts and column lengths, checked once.
struct Frame {
    shape: Vec<usize>,
    row_start: Vec<usize>,
    column_len: Vec<usize>,
    size: usize,
    n: usize,
}

impl Frame {
    fn new(shape: &[usize], n: usize) -> Result<Self, Error> {
        let shape = normalize(shape, "shape")?;
        if n == 0 || n > super::MAX_N {
            return Err(Error::invalid(format!(
                "n must be in 1..{}; got {n}",
                super::MAX_N
            )));
        }
        if shape.len() > n {
            return Err(Error::invalid(format!(
                "shape {shape:?} has more rows than n = {n}: there is no tableau"
            )));
        }
        let mut row_start = vec![0usize; shape.len() + 1];
        for (r, &len) in shape.iter().enumerate() {
            row_start[r + 1] = row_start[r]
                .checked_add(len)
                .ok_or_else(|| Error::invalid("shape has too many cells"))?;
        }
        let width = shape.first().copied().unwrap_or(0);
        let column_len = (0..width)
            .map(|c| shape.iter().filter(|&&l| l > c).count())
            .collect();
        let size = row_start[shape.len()];
        Ok(Frame {
            shape,
            row_start,
            column_len,
            size,
            n,
        })
    }

    /// Entries in 1..n, rows weakly increasing, columns strictly increasing.
    fn check(&self, t: &[u8], v: usize) -> Result<(), Error> {
        for r in 0..self.shape.len() {
            let row = &t[self.row_start[r]..self.row_start[r + 1]];
            for (c, &x) in row.iter().enumerate() {
                let above = (r > 0).then(|| t[self.row_start[r - 1] + c]);
                let rule = if x == 0 || usize::from(x) > self.n {
                    format!("entries must be in 1..{}; got {x}", self.n)
                } else if c > 0 && row[c - 1] > x {
                    format!("rows must weakly increase; {} before {x}", row[c - 1])
                } else if above.is_some_and(|a| a >= x) {
                    format!(
                        "columns must strictly increase; {} above {x}",
                        above.unwrap_or(0)
                    )
                } else {
                    continue;
                };
                return Err(Error::invalid(format!(
                    "cells[{v}] is not a semistandard tableau of shape {:?}: {rule} (row {}, column {})",
                    self.shape,
                    r + 1,
                    c + 1
                )));
            }
        }
        Ok(())
    }
}

/// Row insertion tableau, rows reused between words so a block allocates once.
#[derive(Default)]
struct Insertion {
    rows: Vec<Vec<u8>>,
    used: usize,
}

impl Insertion {
    fn clear(&mut self) {
        self.used = 0;
    }

    /// Schensted row insertion: x bumps the leftmost entry greater than x, which moves down.
    #[inline]
    fn insert(&mut self, mut x: u8) {
        for row in &mut self.rows[..self.used] {
            if let Some(k) = row.iter().position(|&y| y > x) {
                std::mem::swap(&mut row[k], &mut x);
            } else {
                row.push(x);
                return;
            }
        }
        if self.used == self.rows.len() {
            self.rows.push(Vec::new());
        }
        self.rows[self.used].clear();
        self.rows[self.used].push(x);
        self.used += 1;
    }

    /// Entry (r, c), if the tableau has it.
    fn at(&self, r: usize, c: usize) -> Option<u8> {
        self.rows[..self.used].get(r)?.get(c).copied()
    }
}

/// Writes the key of one tableau `t` into `key` (same layout).
fn key_of(
    f: &Frame,
    t: &[u8],
    side: KeySide,
    p: &mut Insertion,
    key: &mut [u8],
) -> Result<(), Error> {
    #[allow(clippy::cast_possible_truncation)] // n <= 255, so n + 1 - x is in 1..=n
    let flip = |x: u8| (f.n + 1 - usize::from(x)) as u8;
    for (j, &k) in f.column_len.iter().enumerate() {
        p.clear();
        // w*: rows top to bottom, each right to left, over the columns kept, with x -> n+1-x
        for (r, &len) in f.shape.iter().enumerate() {
            let (lo, hi) = match side {
                KeySide::Right => (j, len),
                KeySide::Left => (0, len.min(j + 1)),
            };
            for c in (lo..hi).rev() {
                p.insert(flip(t[f.row_start[r] + c]));
            }
        }
        let column = match side {
            KeySide::Right => 0,
            KeySide::Left => j,
        };
        for r in 0..k {
            // evac's column read bottom up gives the key's column top down, once flipped
            let x = p
                .at(k - 1 - r, column)
                .ok_or_else(|| Error::invalid("key kernel: evacuation lost its shape"))?;
            key[f.row_start[r] + j] = flip(x);
        }
    }
    Ok(())
}

/// Right or left keys of `count` tableaux of `shape` with entries 1..n, given as `cells`
/// (count x |shape|, each tableau's cells row-major). Returns the keys in the same layout and
/// their contents as weak compositions (count x n). Each tableau is checked to be semistandard.
/// Parallel over blocks of tableaux, each writing its own slices: the result does not depend on
/// the number of threads.
pub fn keys(
    shape: &[usize],
    n: usize,
    cells: &[u8],
    count: usize,
    side: KeySide,
    job: &Job,
) -> Result<Keys, Error> {
    let f = Frame::new(shape, n)?;
    if Some(cells.len()) != count.checked_mul(f.size) {
        return Err(Error::invalid(format!(
            "cells must hold {count} tableaux of {} cells each; got {} values",
            f.size,
            cells.len()
        )));
    }
    let weight_len = count
        .checked_mul(n)
        .ok_or_else(|| Error::invalid("count * n does not fit in memory"))?;
    let mut out = Keys {
        cells: filled(cells.len(), 0u8),
        weights: filled(weight_len, 0i32),
    };
    if f.size == 0 {
        return Ok(out); // the empty tableau is its own key, of content 0
    }
    out.cells
        .par_chunks_mut(BLOCK * f.size)
        .zip(out.weights.par_chunks_mut(BLOCK * n))
        .enumerate()
        .try_for_each(|(b, (key_block, weight_block))| {
            job.checkpoint(BLOCK as u64)?;
            let mut p = Insertion::default();
            let keys = key_block.chunks_mut(f.size);
            for (k, (key, weight)) in keys.zip(weight_block.chunks_mut(n)).enumerate() {
                let v = b * BLOCK + k;
                let t = &cells[v * f.size..(v + 1) * f.size];
                f.check(t, v)?;
                key_of(&f, t, side, &mut p, key)?;
                for &x in key.iter() {
                    weight[usize::from(x) - 1] += 1;
                }
            }
            Ok(())
        })?;
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::tableau::{fill, Model};

    fn run(shape: &[usize], n: usize, t: &[u8], side: KeySide) -> Keys {
        keys(shape, n, t, 1, side, &Job::default()).unwrap()
    }

    #[test]
    fn a_row_keys_to_its_largest_and_smallest_entry() {
        // a one-row key is constant; K_+ >= T and K_- <= T entrywise (Lascoux-Schutzenberger 1990)
        let right = run(&[3], 4, &[1, 2, 4], KeySide::Right);
        assert_eq!(right.cells, [4, 4, 4]);
        assert_eq!(right.weights, [0, 0, 0, 3]);
        assert_eq!(run(&[3], 4, &[1, 2, 4], KeySide::Left).cells, [1, 1, 1]);
    }

    #[test]
    fn worked_example() {
        // T = 1 2 / 3, n = 3, is f_1 f_2 of the highest weight tableau 1 1 / 2, so it lies in the
        // Demazure crystal of w = s1 s2 and not of s1 or s2 (checked by hand on the signature
        // rule); w.(2,1,0) = (0,2,1), whose key is 2 2 / 3 (Lascoux-Schutzenberger 1990: T is in
        // B_w exactly when K_+(T) <= key(w.lambda)).
        let right = run(&[2, 1], 3, &[1, 2, 3], KeySide::Right);
        assert_eq!(right.cells, [2, 2, 3]);
        assert_eq!(right.weights, [0, 2, 1]);
        let left = run(&[2, 1], 3, &[1, 2, 3], KeySide::Left);
        assert_eq!(left.cells, [1, 1, 3]);
        assert_eq!(left.weights, [2, 0, 1]);
    }

    #[test]
    fn keys_are_nested_key_tableaux_bounding_t() {
        let m = Model::new(&[3, 2, 1], 4).unwrap();
        let all = fill(&m, &Job::default()).unwrap();
        let count = all.len() / 6;
        let job = Job::default();
        let right = keys(&[3, 2, 1], 4, &all, count, KeySide::Right, &job).unwrap();
        let left = keys(&[3, 2, 1], 4, &all, count, KeySide::Left, &job).unwrap();
        for v in 0..count {
            let (t, kr, kl) = (
                &all[v * 6..v * 6 + 6],
                &right.cells[v * 6..v * 6 + 6],
                &left.cells[v * 6..v * 6 + 6],
            );
            assert!(t.iter().zip(kr).all(|(a, b)| a <= b));
            assert!(t.iter().zip(kl).all(|(a, b)| a >= b));
            for key in [kr, kl] {
                // columns {k0, k3, k5} contain {k1, k4} contain {k2}
                assert!([key[1], key[4]]
                    .iter()
                    .all(|x| [key[0], key[3], key[5]].contains(x)));
                assert!([key[0], key[3], key[5]].contains(&key[2]));
                assert!([key[1], key[4]].contains(&key[2]));
            }
        }
        // the highest weight tableau is its own right key
        assert_eq!(&right.cells[..6], &all[..6]);
    }

    #[test]
    fn bad_input_is_refused() {
        let job = Job::default();
        let side = KeySide::Right;
        assert!(keys(&[2, 1], 3, &[2, 1, 3], 1, side, &job).is_err()); // row decreases
        assert!(keys(&[2, 1], 3, &[1, 2, 1], 1, side, &job).is_err()); // column not strict
        assert!(keys(&[2, 1], 3, &[1, 2, 4], 1, side, &job).is_err()); // entry > n
        assert!(keys(&[2, 1], 3, &[1, 2], 1, side, &job).is_err()); // wrong length
        assert!(keys(&[1, 2], 3, &[1, 2, 3], 1, side, &job).is_err()); // not a partition
        assert!(keys(&[1, 1], 1, &[1, 1], 1, side, &job).is_err()); // more rows than n
        assert!(keys(&[1], 256, &[1], 1, side, &job).is_err());
        let empty = keys(&[], 2, &[], 3, side, &job).unwrap();
        assert_eq!(empty.weights, [0; 6]);
    }
}
