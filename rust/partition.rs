//! Partitions: validation, and a dense numbering of the partitions contained in a fixed shape.
#![deny(unsafe_code)]

use crate::error::Error;

/// Checks that `parts` is a partition (weakly decreasing) and drops trailing zeros.
pub fn normalize(parts: &[usize], name: &str) -> Result<Vec<usize>, Error> {
    if let Some(&[a, b]) = parts.windows(2).find(|w| w[0] < w[1]) {
        return Err(Error::invalid(format!(
            "{name} must be weakly decreasing; got {parts:?} ({a} before {b})"
        )));
    }
    let len = parts.iter().rposition(|&p| p > 0).map_or(0, |i| i + 1);
    Ok(parts[..len].to_vec())
}

/// Numbers the partitions mu contained in `shape` (mu_j <= shape_j, as many rows or fewer) by
/// lexicographic order, row 1 most significant. The number is additive over rows:
/// `id(mu) = sum_j offset[j][mu_j]`, so changing one part changes the id by one table difference.
#[derive(Debug, Clone)]
pub struct SubShapes {
    shape: Vec<usize>,
    offset: Vec<u64>, // row j's entries start at start[j]; one flat table keeps look-ups to one load
    start: Vec<usize>,
    count: u64,
}

impl SubShapes {
    pub fn new(shape: &[usize]) -> Result<Self, Error> {
        let rows = shape.len();
        // tails[j][a]: sequences mu_j >= ... >= mu_{rows-1} >= 0 with mu_j <= a and mu_t <= shape_t.
        let mut tails = vec![vec![1u64; shape.first().map_or(1, |&p| p + 1)]; rows + 1];
        for j in (0..rows).rev() {
            let mut acc = 0u64;
            let (this, next) = tails.split_at_mut(j + 1);
            for (a, slot) in this[j].iter_mut().enumerate() {
                if a <= shape[j] {
                    acc = acc.checked_add(next[0][a]).ok_or_else(too_many)?;
                }
                *slot = acc;
            }
        }
        let (mut offset, mut start) = (Vec::new(), Vec::with_capacity(rows));
        for j in 0..rows {
            start.push(offset.len());
            let mut acc = 0u64;
            for &tail in &tails[j + 1][..=shape[j]] {
                offset.push(acc);
                acc += tail;
            }
        }
        let count = tails[0]
            .get(shape.first().copied().unwrap_or(0))
            .copied()
            .unwrap_or(1);
        Ok(SubShapes {
            shape: shape.to_vec(),
            offset,
            start,
            count,
        })
    }

    /// Number of partitions inside the shape, the empty one included.
    pub fn count(&self) -> u64 {
        self.count
    }

    #[inline]
    pub fn id(&self, mu: &[u16]) -> usize {
        let mut id = 0u64;
        for (j, &m) in mu.iter().enumerate().take(self.shape.len()) {
            id += self.offset[self.start[j] + usize::from(m)];
        }
        usize::try_from(id).expect("ids are below count, which fits memory")
    }

    /// Change of `id` when part `j` goes from `from` to `to`.
    #[inline]
    #[allow(clippy::cast_possible_wrap, clippy::cast_possible_truncation)] // ids are below count, which fits memory
    pub fn id_delta(&self, j: usize, from: u16, to: u16) -> isize {
        let row = &self.offset[self.start[j]..];
        row[usize::from(to)] as isize - row[usize::from(from)] as isize
    }

    /// All partitions inside the shape, in id order, each padded with zeros to the shape's length.
    pub fn all(&self) -> Vec<Vec<u16>> {
        let rows = self.shape.len();
        let mut out = Vec::new();
        let mut mu = vec![0u16; rows];
        fill(&self.shape, 0, u16::MAX, &mut mu, &mut out);
        out
    }
}

fn fill(shape: &[usize], j: usize, above: u16, mu: &mut Vec<u16>, out: &mut Vec<Vec<u16>>) {
    if j == shape.len() {
        out.push(mu.clone());
        return;
    }
    let top = u16::try_from(shape[j]).unwrap_or(u16::MAX).min(above);
    for a in 0..=top {
        mu[j] = a;
        fill(shape, j + 1, a, mu, out);
    }
}

fn too_many() -> Error {
    Error::TooLarge {
        what: "numbering the partitions inside this shape".into(),
        bytes: u128::MAX,
        instead: "use a smaller shape".into(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn normalizes() {
        assert_eq!(normalize(&[3, 1, 0, 0], "shape").unwrap(), vec![3, 1]);
        assert!(normalize(&[1, 2], "shape").is_err());
    }

    #[test]
    fn ids_are_a_bijection_in_lex_order() {
        let s = SubShapes::new(&[3, 2, 2]).unwrap();
        let all = s.all();
        assert_eq!(all.len() as u64, s.count());
        for (k, mu) in all.iter().enumerate() {
            assert_eq!(s.id(mu), k);
        }
        // partitions in a 2 x 2 box: C(4, 2) = 6 (from memory: lattice paths in a box)
        assert_eq!(SubShapes::new(&[2, 2]).unwrap().count(), 6);
    }
}
