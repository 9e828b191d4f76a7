//! Semistandard Young tableaux of a fixed shape with entries 1..n: enumeration in one fixed order,
//! ranking and unranking through Gelfand-Tsetlin completion counts, and the crystal operators.
//!
//! A tableau T is stored as its cells in row-major order (row 1 left to right, then row 2, ...),
//! one `u8` per cell. It is also the chain of shapes lambda^(0) = () in lambda^(1) in ... in
//! lambda^(n) = shape, lambda^(k) being the cells holding entries <= k (its Gelfand-Tsetlin
//! pattern); lambda^(k)/lambda^(k-1) is a horizontal strip.
//!
//! **The order.** Tableaux are ordered by (lambda^(n-1), lambda^(n-2), ..., lambda^(1)) in
//! decreasing lexicographic order, each partition compared row 1 first. Index = position; index 0
//! is the highest weight tableau (row r filled with r), the last index the lowest weight one.
#![deny(unsafe_code)]

mod keys;
mod moves;
mod ops;
mod tables;
mod walk;

pub use keys::{keys, KeySide, Keys};
pub use ops::{operator, operator_tables, signature, weights, Operator, Signature};
pub use tables::Model;
pub use walk::{fill, fill_range as walk_range, scan, Walker};

/// Largest n with one-byte entries.
pub const MAX_N: usize = 255;

#[cfg(test)]
#[allow(
    clippy::cast_possible_truncation,
    clippy::cast_sign_loss,
    clippy::cast_possible_wrap
)]
mod tests {
    use super::*;
    use crate::job::Job;

    /// Number of SSYT by the hook-content formula (Stanley, EC2, Cor. 7.21.4), in u128.
    fn hook_content(shape: &[usize], n: usize) -> u128 {
        let (mut num, mut den) = (1u128, 1u128);
        for (r, &len) in shape.iter().enumerate() {
            for c in 0..len {
                let below = shape.iter().skip(r + 1).filter(|&&l| l > c).count();
                num *= (n + c) as u128 - r as u128;
                den *= (len - c + below) as u128;
            }
        }
        num / den
    }

    const SHAPES: &[&[usize]] = &[
        &[],
        &[1],
        &[3],
        &[2, 1],
        &[3, 1, 1],
        &[2, 2, 1],
        &[4, 3, 1],
        &[3, 3, 3],
    ];

    #[test]
    fn counts_match_hook_content() {
        for s in SHAPES {
            for n in 1..=6 {
                let m = Model::new(s, n).unwrap();
                let want = if s.len() > n { 0 } else { hook_content(s, n) };
                assert_eq!(u128::from(m.count()), want, "{s:?} n={n}");
            }
        }
        // Counts past 2^32: (8,8) with n = 15 (PERFORMANCE-NOTES pitfall), checked by hook-content.
        assert_eq!(
            u128::from(Model::new(&[8, 8], 15).unwrap().count()),
            hook_content(&[8, 8], 15)
        );
    }

    #[test]
    fn enumeration_is_ranked_and_semistandard() {
        for s in SHAPES {
            for n in 1..=5 {
                let m = Model::new(s, n).unwrap();
                let all = fill(&m, &Job::default()).unwrap();
                let c = m.cells.max(1);
                if m.cells == 0 {
                    continue;
                }
                for (v, t) in all.chunks(c).enumerate() {
                    m.check_cells(t).unwrap();
                    assert_eq!(m.rank(t).unwrap(), v as u64);
                }
                let mut sorted: Vec<&[u8]> = all.chunks(c).collect();
                sorted.dedup();
                assert_eq!(sorted.len() as u64, m.count());
            }
        }
    }

    #[test]
    fn operators_are_partial_inverses() {
        let m = Model::new(&[3, 2, 1], 4).unwrap();
        let all = fill(&m, &Job::default()).unwrap();
        let tables = operator_tables(&m, &all, false, &Job::default()).unwrap();
        let lowering = operator_tables(&m, &all, true, &Job::default()).unwrap();
        assert!(lowering
            .iter()
            .zip(&tables)
            .all(|(l, t)| l.f == t.f && l.e.is_empty()));
        // 64 = hook-content count of (3,2,1) with n = 4 (Stanley, EC2, Cor. 7.21.4).
        assert_eq!(tables[0].f.len(), 64);
        for (i, op) in tables.iter().enumerate() {
            for (v, &f) in op.f.iter().enumerate() {
                if f >= 0 {
                    assert_eq!(op.e[f as usize], v as i64);
                    assert_eq!(op.phi[f as usize], op.phi[v] - 1);
                }
            }
            let lengths = operator(&m, &all, i + 1, false, &Job::default()).unwrap();
            assert_eq!(
                (lengths.phi.as_slice(), lengths.eps.as_slice()),
                (op.phi.as_slice(), op.eps.as_slice())
            );
            assert!(lengths.f.is_empty());
            let single = operator(&m, &all, i + 1, true, &Job::default()).unwrap();
            assert_eq!((&single.f, &single.e), (&op.f, &op.e));
        }
    }

    #[test]
    fn highest_weight_comes_first() {
        let m = Model::new(&[3, 2], 4).unwrap();
        let all = fill(&m, &Job::default()).unwrap();
        assert_eq!(&all[..5], &[1, 1, 1, 2, 2]);
        // lowest weight: weight lambda reversed, (0, 0, 2, 3)
        assert_eq!(&all[all.len() - 5..], &[3, 3, 4, 4, 4]);
    }

    #[test]
    fn empty_shape_is_one_vertex_with_no_arrows() {
        let m = Model::new(&[], 4).unwrap();
        assert_eq!(m.count(), 1);
        let cells = fill(&m, &Job::default()).unwrap();
        assert!(cells.is_empty());
        let tables = operator_tables(&m, &cells, false, &Job::default()).unwrap();
        assert!(tables
            .iter()
            .all(|op| op.f == [-1] && op.e == [-1] && op.phi == [0]));
        assert_eq!(weights(&m, &cells, &Job::default()).unwrap(), vec![0; 4]);
        // one row longer than any part fits u16: refused, not wrapped
        assert!(Model::new(&[70_000], 2).is_err());
    }

    #[test]
    fn parallel_blocks_join_up() {
        // (4,2,1), n = 8: more than two blocks of the parallel fill
        let m = Model::new(&[4, 2, 1], 8).unwrap();
        let all = fill(&m, &Job::default()).unwrap();
        assert_eq!(all.len() as u64, m.count() * 7);
        for (v, t) in all.chunks(7).enumerate().step_by(101) {
            assert_eq!(m.rank(t).unwrap(), v as u64);
        }
        let mut walker = Walker::at(&m, 0).unwrap();
        let mut steps = 1;
        while walker.advance().is_some() {
            steps += 1;
        }
        assert_eq!(steps, m.count());
    }

    #[test]
    fn scan_counts_everything() {
        let m = Model::new(&[4, 2, 1], 6).unwrap();
        let one = scan(&m, 1, &Job::default()).unwrap();
        let two = scan(&m, 2, &Job::default()).unwrap();
        assert_eq!(one, two);
        assert_eq!(one.0, m.count());
    }
}
