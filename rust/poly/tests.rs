//! Kernel checks that run without Python. Each value checked against the outside names its source.
use super::*;
use crate::error::Error;
use crate::job::Job;

/// Terms from (exponents, coefficient) pairs; shared with the expansion kernel's tests.
pub(super) fn poly(nvars: usize, terms: &[(&[i64], i128)]) -> Terms {
    let exps = terms.iter().flat_map(|(r, _)| r.iter().copied()).collect();
    Terms::new(
        nvars,
        exps,
        CoeffVec::Small(terms.iter().map(|t| t.1).collect()),
    )
    .unwrap()
}

fn op(f: &Terms, kind: &str, i: usize) -> Terms {
    apply_operator(f, Operator::from_name(kind).unwrap(), i, &Job::default()).unwrap()
}

#[test]
fn closed_forms_on_small_monomials() {
    // pi_1 x1 = x1 + x2 and d_1 x1^2 = x1 + x2 (Macdonald, Notes on Schubert Polynomials, 1991, (2.2))
    let x1 = poly(2, &[(&[1, 0], 1)]);
    assert_eq!(op(&x1, "pi", 1), poly(2, &[(&[1, 0], 1), (&[0, 1], 1)]));
    assert_eq!(op(&poly(2, &[(&[2, 0], 1)]), "d", 1), op(&x1, "pi", 1));
    // (pi_1 - 1) x1 = x2; d_1 x2 = -1; pi_1 x2 = 0 (the definitions, by hand)
    assert_eq!(op(&x1, "pibar", 1), poly(2, &[(&[0, 1], 1)]));
    assert_eq!(
        op(&poly(2, &[(&[0, 1], 1)]), "d", 1),
        poly(2, &[(&[0, 0], -1)])
    );
    assert!(op(&poly(2, &[(&[0, 1], 1)]), "pi", 1).is_empty());
}

#[test]
fn laurent_rows_agree_with_packed_keys() {
    // x1^3 x2^-1 has no packing: the row path must give x1^3 x2^-1 + x1^2 + x1 x2 + x2^2 + x2^3 x1^-1
    let f = poly(2, &[(&[3, -1], 1)]);
    let expected: &[(&[i64], i128)] = &[
        (&[3, -1], 1),
        (&[2, 0], 1),
        (&[1, 1], 1),
        (&[0, 2], 1),
        (&[-1, 3], 1),
    ];
    assert_eq!(op(&f, "pi", 1), poly(2, expected));
}

#[test]
fn divided_difference_squares_to_zero() {
    // d_i^2 = 0 (Macdonald, Notes on Schubert Polynomials, 1991, (2.3))
    let f = poly(3, &[(&[4, 1, 0], 3), (&[0, 2, 5], -7), (&[1, 1, 1], 2)]);
    assert!(op(&op(&f, "d", 2), "d", 2).is_empty());
}

#[test]
fn keys_and_atoms_of_two_parts() {
    let job = Job::default();
    // kappa_(0,1) = x1 + x2 and the atom of (0,1) is x2 (Lascoux-Schutzenberger 1990, from memory)
    assert_eq!(
        key(&[0, 1], &job).unwrap(),
        poly(2, &[(&[1, 0], 1), (&[0, 1], 1)])
    );
    assert_eq!(atom(&[0, 1], &job).unwrap(), poly(2, &[(&[0, 1], 1)]));
    // kappa of an increasing composition is a Schur polynomial: kappa_(0,1,1) = e_2(x1, x2, x3)
    let e2: &[(&[i64], i128)] = &[(&[1, 1, 0], 1), (&[1, 0, 1], 1), (&[0, 1, 1], 1)];
    assert_eq!(key(&[0, 1, 1], &job).unwrap(), poly(3, e2));
    assert!(key(&[1, -1], &job).is_err());
}

#[test]
fn big_coefficients_stay_exact() {
    let c = i128::MAX - 1;
    let f = poly(2, &[(&[1, 0], c), (&[0, 1], c)]);
    // pi_1 (c x1 + c x2) = 2c x1 + 2c x2 - c (x1 + x2)... by linearity: c pi_1 x1 + c pi_1 x2
    // = c (x1 + x2) + 0, and pi_1 of the doubled polynomial overflows i128 into BigInt
    let doubled = product(&f, &poly(2, &[(&[0, 0], 2)]), &Job::default()).unwrap();
    assert!(matches!(doubled.coeffs, CoeffVec::Big(_)));
    let image = op(&doubled, "pi", 1);
    let two_c = BigInt::from(c) * BigInt::from(2);
    assert_eq!(image.coeffs.to_big(), vec![two_c.clone(), two_c]);
}

#[test]
fn product_matches_by_hand() {
    // (x1 + x2)^2 = x1^2 + 2 x1 x2 + x2^2 (the binomial theorem)
    let s = poly(2, &[(&[1, 0], 1), (&[0, 1], 1)]);
    let square = product(&s, &s, &Job::default()).unwrap();
    assert_eq!(square, poly(2, &[(&[2, 0], 1), (&[1, 1], 2), (&[0, 2], 1)]));
}

#[test]
fn wide_packing_and_rows_agree_with_narrow_packing() {
    // 30 variables with exponents up to 7 need 90 bits: u128 keys; 70 variables need rows
    let job = Job::default();
    for n in [3usize, 30, 70] {
        let mut row = vec![0i64; n];
        (row[0], row[1], row[2]) = (7, 2, 5);
        let f = Terms::monomial(&row);
        let image = apply_operator(&f, Operator::Isobaric, 1, &job).unwrap();
        // pi_1 x1^7 x2^2 = sum of x1^p x2^(9-p), p = 2..7 (the closed form)
        assert_eq!(image.len(), 6);
        assert_eq!(image.exps[..3], [7, 2, 5]);
        assert_eq!(image.exps[n..n + 3], [6, 3, 5]);
    }
}

#[test]
fn huge_images_are_refused() {
    // pi_1 x1^(2^62) x2^(-2^62) would have 2^63 + 1 terms: TooLarge, never an overflow or a hang
    let f = poly(2, &[(&[1 << 62, -(1 << 62)], 1)]);
    let refused = apply_operator(&f, Operator::Isobaric, 1, &Job::default());
    assert!(matches!(refused, Err(Error::TooLarge { .. })));
    let at_limit = poly(2, &[(&[i64::MAX, 1], 1)]);
    assert!(apply_operator(&at_limit, Operator::Divided, 1, &Job::default()).is_err());
}

#[test]
fn bad_arguments_are_errors() {
    let f = poly(2, &[(&[1, 0], 1)]);
    assert!(apply_operator(&f, Operator::Isobaric, 2, &Job::default()).is_err());
    assert!(apply_operator(&f, Operator::Isobaric, 0, &Job::default()).is_err());
    assert!(Operator::from_name("q").is_err());
    assert!(Terms::new(2, vec![1, 2, 3], CoeffVec::Small(vec![1])).is_err());
}
