//! Checks of the peeling kernel. Each value checked against the outside names its source.
use super::*;
use crate::poly::tests::poly;
use crate::poly::{atom, key, product, CoeffVec};

fn scaled(f: &Terms, c: i128) -> Terms {
    product(
        f,
        &poly(f.nvars, &[(&vec![0; f.nvars], c)]),
        &Job::default(),
    )
    .unwrap()
}

fn sum(f: &Terms, g: &Terms) -> Terms {
    // f + g as a non-canonical list: the kernel adds repeated rows itself
    let mut exps = f.exps.clone();
    exps.extend(&g.exps);
    let mut c = f.coeffs.to_big();
    c.extend(g.coeffs.to_big());
    Terms::new(f.nvars, exps, super::super::coefficients(c)).unwrap()
}

fn keyp(alpha: &[i64]) -> Terms {
    key(alpha, &Job::default()).unwrap()
}

#[test]
fn a_sum_of_keys_comes_back() {
    // kappa_(0,2,1) + 3 kappa_(1,0,1): the basis property (Lascoux-Schutzenberger 1990)
    let f = sum(&keyp(&[0, 2, 1]), &scaled(&keyp(&[1, 0, 1]), 3));
    let out = expand(&f, Basis::Key, &Job::default()).unwrap();
    assert_eq!(out, poly(3, &[(&[0, 2, 1], 1), (&[1, 0, 1], 3)]));
}

#[test]
fn a_schur_polynomial_is_one_key() {
    // s_(2,1)(x1, x2, x3), its 8 SSYT written out by hand (from memory), is kappa_(0,1,2)
    // (Reiner-Shimozono 1995: the key of an antidominant composition is a Schur polynomial)
    let s21: &[(&[i64], i128)] = &[
        (&[2, 1, 0], 1),
        (&[2, 0, 1], 1),
        (&[1, 2, 0], 1),
        (&[1, 1, 1], 2),
        (&[1, 0, 2], 1),
        (&[0, 2, 1], 1),
        (&[0, 1, 2], 1),
    ];
    let out = expand(&poly(3, s21), Basis::Key, &Job::default()).unwrap();
    assert_eq!(out, poly(3, &[(&[0, 1, 2], 1)]));
}

#[test]
fn a_key_is_a_sum_of_atoms() {
    // kappa_(0,1) = x1 + x2 = A_(0,1) + A_(1,0), with A_(0,1) = x2 (from memory)
    let out = expand(&keyp(&[0, 1]), Basis::Atom, &Job::default()).unwrap();
    assert_eq!(out, poly(2, &[(&[0, 1], 1), (&[1, 0], 1)]));
}

#[test]
fn coefficients_widen_past_i64_and_i128() {
    let job = Job::default();
    let k = keyp(&[0, 2, 1]); // coefficients 1 and 2: times c the i64 peeling overflows
    for c in [i128::from(i64::MAX) - 3, i128::MAX / 3] {
        let f = sum(&scaled(&k, c), &keyp(&[1, 1, 0]));
        let out = expand(&f, Basis::Key, &job).unwrap();
        assert_eq!(out, poly(3, &[(&[0, 2, 1], c), (&[1, 1, 0], 1)]));
    }
    // 2^100 * (2^40 kappa_(0,2,1)): BigInt input, exact
    let big = BigInt::from(1u8) << 140;
    let f = Terms::new(
        3,
        k.exps.clone(),
        super::super::coefficients(k.coeffs.to_big().iter().map(|c| c * &big).collect()),
    )
    .unwrap();
    let out = expand(&f, Basis::Key, &job).unwrap();
    assert_eq!(out.exps, vec![0, 2, 1]);
    assert_eq!(out.coeffs, CoeffVec::Big(vec![big]));
}

#[test]
fn a_batch_equals_one_by_one_and_reuses_the_cache() {
    let job = Job::default();
    let polys: Vec<Terms> = (0..40)
        .map(|t| {
            let a = [t % 3, (t / 3) % 3, 2 - t % 2, t % 4];
            sum(&scaled(&keyp(&a), i128::from(t) - 20), &keyp(&[1, 0, 2, 1]))
        })
        .collect();
    let cache = ExpansionCache::new(Basis::Key, 4, 5).unwrap();
    let batch = cache.expand_all(&polys, &job).unwrap();
    assert!(!cache.is_empty());
    for (f, out) in polys.iter().zip(&batch) {
        assert_eq!(out, &expand(f, Basis::Key, &job).unwrap());
    }
}

#[test]
fn constants_and_zero() {
    let job = Job::default();
    let seven = poly(0, &[(&[], 7)]);
    assert_eq!(expand(&seven, Basis::Key, &job).unwrap(), seven);
    let zero = poly(2, &[(&[1, 0], 2), (&[1, 0], -2)]);
    assert!(expand(&zero, Basis::Atom, &job).unwrap().is_empty());
}

#[test]
fn bad_input_and_stops_are_errors() {
    let job = Job::default();
    assert!(expand(&poly(2, &[(&[1, -1], 1)]), Basis::Key, &job).is_err());
    let cache = ExpansionCache::new(Basis::Key, 2, 1).unwrap();
    assert!(cache.expand(&poly(2, &[(&[2, 0], 1)]), &job).is_err());
    assert!(cache.expand(&poly(3, &[(&[0, 0, 0], 1)]), &job).is_err());
    assert!(ExpansionCache::new(Basis::Key, 2, -1).is_err());
    assert!(Basis::from_name("schur").is_err());
    // kappa_(0,1,..,6) = s_(6,5,..,1)(x1..x7) has more than 4096 terms: a stop is seen
    let stopped = Job::default();
    stopped.set_stop(true);
    let f = sum(&keyp(&[0, 1, 2, 3, 4, 5, 6]), &keyp(&[6, 0, 0, 0, 0, 0, 0]));
    assert!(keyp(&[0, 1, 2, 3, 4, 5, 6]).len() > 4096);
    assert_eq!(expand(&f, Basis::Key, &stopped), Err(Error::Interrupted));
}

#[test]
fn elements_built_from_cached_neighbours_agree_with_the_operator_route() {
    // one cache for all compositions of length 4 with parts <= 2: elements come from cached
    // neighbours by one operator step; expanding the element of key.rs must give {alpha: 1}
    let job = Job::default();
    for basis in [Basis::Key, Basis::Atom] {
        let cache = ExpansionCache::new(basis, 4, 2).unwrap();
        for code in 0..81i64 {
            let alpha: Vec<i64> = (0..4).map(|k| (code / 3i64.pow(k)) % 3).collect();
            let f = match basis {
                Basis::Key => key(&alpha, &job),
                Basis::Atom => atom(&alpha, &job),
            }
            .unwrap();
            assert_eq!(cache.expand(&f, &job).unwrap(), poly(4, &[(&alpha, 1)]));
        }
        assert_eq!(cache.len(), 81);
    }
}
