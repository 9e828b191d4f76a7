use super::*;
use crate::perm;

fn crystal_of(w1: &[usize]) -> FactorizationCrystal {
    let w: Vec<usize> = w1.iter().map(|&x| x - 1).collect();
    build(&w, (w.len(), false), 1 << 20, &Job::default()).unwrap()
}

/// The letters of a row, factor by factor, each factor decreasing (1-based letters).
fn word(row: &[u32]) -> Vec<usize> {
    row.iter()
        .flat_map(|&bits| (0..32).rev().filter(move |&a| bits & (1 << a) != 0))
        .collect()
}

#[test]
fn counts_match_published_values() {
    // F_{w0} = s_{(2,1)} for S_3, s_{(3,2,1)} for S_4 (Edelman-Greene, "Balanced tableaux",
    // 1987), so there are s_(2,1)(1,1,1) = 8 and s_(3,2,1)(1^4) = 64 (hook-content) of them
    assert_eq!(crystal_of(&[3, 2, 1]).count(), 8);
    assert_eq!(crystal_of(&[4, 3, 2, 1]).count(), 64);
    // one reduced pipe dream for w0; C_3 = 5 for 1 4 3 2 (Woo 2004; OEIS A000108)
    let bounded = |w: &[usize]| crystal_of(w).bounded().iter().filter(|&&b| b).count();
    assert_eq!(bounded(&[4, 3, 2, 1]), 1);
    assert_eq!(bounded(&[1, 4, 3, 2]), 5);
    assert_eq!(bounded(&[1, 5, 4, 3, 2]), 14);
    assert_eq!(crystal_of(&[1]).count(), 1);
}

#[test]
fn every_vertex_is_a_sorted_decreasing_factorization() {
    for w in perm::all_perms(5, 1000).unwrap() {
        let w1: Vec<usize> = w.iter().map(|&x| x + 1).collect();
        let c = crystal_of(&w1);
        let n = c.m;
        for (v, row) in c.factors.chunks_exact(n).enumerate() {
            let letters = word(row);
            assert_eq!(letters.len(), perm::length(&w));
            assert_eq!(perm::word_to_perm(&letters, n), w, "vertex {v} of {w1:?}");
            if v > 0 {
                assert!(c.factors[(v - 1) * n..v * n] < *row);
            }
        }
    }
}

#[test]
fn operators_are_inverse_and_move_weight_by_a_root() {
    for w in perm::all_perms(5, 1000).unwrap() {
        let w1: Vec<usize> = w.iter().map(|&x| x + 1).collect();
        let c = crystal_of(&w1);
        let (n, wt) = (c.m, c.weights());
        for r in 0..n - 1 {
            for v in 0..c.count() {
                let t = c.lowering[r][v];
                if t >= 0 {
                    let t = usize::try_from(t).unwrap();
                    assert_eq!(c.raising[r][t], i64::try_from(v).unwrap());
                    assert_eq!(wt[t * n + r], wt[v * n + r] - 1);
                    assert_eq!(wt[t * n + r + 1], wt[v * n + r + 1] + 1);
                }
                let row = &c.factors[v * n..(v + 1) * n];
                let (free_l, free_r) = unpaired(row[r], row[r + 1]);
                // the string lengths are the unpaired counts, as with the signature rule
                let walk = |table: &Vec<Vec<i64>>| {
                    let (mut steps, mut at) = (0, i64::try_from(v).unwrap());
                    while table[r][usize::try_from(at).unwrap()] >= 0 {
                        at = table[r][usize::try_from(at).unwrap()];
                        steps += 1;
                    }
                    steps
                };
                assert_eq!(walk(&c.lowering), free_l.count_ones());
                assert_eq!(walk(&c.raising), free_r.count_ones());
                // phi - epsilon = <wt, alpha_r^vee>: the string through v has the right length
                assert_eq!(
                    i64::from(free_l.count_ones()) - i64::from(free_r.count_ones()),
                    i64::from(wt[v * n + r] - wt[v * n + r + 1])
                );
            }
        }
    }
}

#[test]
fn too_many_vertices_is_refused() {
    let err = build(&[3, 2, 1, 0], (4, false), 10, &Job::default()).unwrap_err();
    assert!(matches!(err, Error::TooLarge { .. }));
}

#[test]
fn fewer_factors() {
    let job = Job::default();
    // s_2 s_1 = 3 1 2 has the decreasing word 2 1: one factorization into one factor
    assert_eq!(build(&[2, 0, 1], (1, false), 100, &job).unwrap().count(), 1);
    assert_eq!(build(&[1, 2, 0], (1, false), 100, &job).unwrap().count(), 0); // s_1 s_2 is not
                                                                              // into n - 1 factors: the pipe dreams are the same (no cross in row n), F_w0 = s_(2,1)(1,1)
    let c = build(&[2, 1, 0], (2, false), 100, &job).unwrap();
    assert_eq!(c.count(), 2);
    assert_eq!(c.bounded().iter().filter(|&&b| b).count(), 1);
    assert!(build(&[0, 1], (0, false), 100, &job).is_err());
}

#[test]
fn the_truncation_is_the_bounded_part_of_the_whole() {
    for w in perm::all_perms(5, 1000).unwrap() {
        let job = Job::default();
        let whole = build(&w, (5, false), 1 << 20, &job).unwrap();
        let cut = build(&w, (5, true), 1 << 20, &job).unwrap();
        let keep: Vec<usize> = (0..whole.count()).filter(|&v| whole.bounded()[v]).collect();
        let rows: Vec<&[u32]> = keep
            .iter()
            .map(|&v| &whole.factors[v * 5..v * 5 + 5])
            .collect();
        assert_eq!(rows.concat(), cut.factors);
        for r in 0..4 {
            for (k, &v) in keep.iter().enumerate() {
                for (table, cut_table) in [
                    (&whole.lowering, &cut.lowering),
                    (&whole.raising, &cut.raising),
                ] {
                    let t = table[r][v];
                    let expected = match usize::try_from(t) {
                        Err(_) => -1,
                        Ok(t) => keep
                            .iter()
                            .position(|&u| u == t)
                            .map_or(LEAVES, |p| i64::try_from(p).unwrap()),
                    };
                    assert_eq!(cut_table[r][k], expected);
                }
            }
        }
    }
}

#[test]
fn keys_of_small_schubert_polynomials() {
    let job = Job::default();
    let keys = |w: &[usize]| {
        let c = build(w, (w.len(), true), 1 << 20, &job).unwrap();
        pipe_dream_keys(&c, &job).unwrap()
    };
    // S_1432 = key(0,2,1,0); S_2143 = x1 (x1 + x2 + x3) = key(2,0,0,0) + key(1,0,1,0)
    // (Lascoux-Schutzenberger 1990; from memory)
    assert_eq!(keys(&[0, 3, 2, 1]), vec![(vec![0, 2, 1, 0], 1)]);
    assert_eq!(
        keys(&[1, 0, 3, 2]),
        vec![(vec![1, 0, 1, 0], 1), (vec![2, 0, 0, 0], 1)]
    );
    assert_eq!(keys(&[3, 2, 1, 0]), vec![(vec![3, 2, 1, 0], 1)]); // S_w0 = x^staircase
    let whole = build(&[1, 0, 2], (3, false), 100, &job).unwrap();
    assert!(pipe_dream_keys(&whole, &job).is_err());
}

#[test]
fn batches_follow_the_lexicographic_order() {
    let job = Job::default();
    let all = keys_of_ranks(4, (0, 24), 1 << 20, &job).unwrap();
    for (rank, w) in perm::all_perms(4, 100).unwrap().iter().enumerate() {
        let c = build(w, (4, true), 1 << 20, &job).unwrap();
        assert_eq!(all[rank], pipe_dream_keys(&c, &job).unwrap());
    }
    assert_eq!(
        keys_of_ranks(4, (20, 4), 1 << 20, &job).unwrap(),
        all[20..].to_vec()
    );
    assert!(keys_of_ranks(4, (20, 5), 1 << 20, &job).is_err());
    assert!(keys_of_ranks(13, (0, 1), 1 << 20, &job).is_err());
}
