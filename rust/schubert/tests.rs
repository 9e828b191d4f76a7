use super::*;
use crate::perm;

fn one_based(terms: &Terms) -> Vec<(Vec<i64>, i128)> {
    let crate::poly::CoeffVec::Small(c) = &terms.coeffs else {
        panic!("small coefficients expected");
    };
    let n = terms.nvars.max(1);
    terms
        .exps
        .chunks(n)
        .zip(c)
        .map(|(row, &c)| (row.to_vec(), c))
        .collect()
}

fn zero_based(w: &[usize]) -> Vec<usize> {
    w.iter().map(|&x| x - 1).collect()
}

#[test]
fn textbook_examples() {
    let job = Job::default();
    // S_132 = x1 + x2 (Macdonald, Notes on Schubert Polynomials, 1991, table of S_3; from memory)
    let s = schubert(&zero_based(&[1, 3, 2]), &job).unwrap();
    assert_eq!(one_based(&s), vec![(vec![1, 0, 0], 1), (vec![0, 1, 0], 1)]);
    // S_2143 = x1^2 + x1 x2 + x1 x3 (Macdonald 1991, table of S_4; from memory)
    let s = schubert(&zero_based(&[2, 1, 4, 3]), &job).unwrap();
    let want = vec![
        (vec![2, 0, 0, 0], 1),
        (vec![1, 1, 0, 0], 1),
        (vec![1, 0, 1, 0], 1),
    ];
    assert_eq!(one_based(&s), want);
    // the identity gives 1; S_0 is 1 in no variables
    assert_eq!(
        one_based(&schubert(&[0, 1, 2], &job).unwrap()),
        vec![(vec![0, 0, 0], 1)]
    );
    assert_eq!(schubert(&[], &job).unwrap().len(), 1);
}

#[test]
fn three_routes_agree_on_s5() {
    // the definition (divided differences from S_w0) against the transition recursion and the batch
    let job = Job::default();
    let mut batch = AllSchuberts::new(5, u128::MAX).unwrap();
    while batch.advance(7, &job).unwrap() < batch.total() {}
    let (exps, coeffs, offsets) = batch.collect().unwrap();
    let crate::poly::CoeffVec::Small(coeffs) = coeffs else {
        panic!("small coefficients expected");
    };
    for (k, w) in perm::all_perms(5, 200).unwrap().iter().enumerate() {
        let by_definition = by_divided_differences(w, &job).unwrap();
        assert_eq!(schubert(w, &job).unwrap(), by_definition, "w = {w:?}");
        let at = |k: usize| usize::try_from(offsets[k]).unwrap();
        let (a, b) = (at(k), at(k + 1));
        assert_eq!(by_definition.exps, exps[a * 5..b * 5], "w = {w:?}");
        assert_eq!(
            crate::poly::CoeffVec::Small(coeffs[a..b].to_vec()),
            by_definition.coeffs
        );
    }
}

#[test]
fn wide_monomials_fall_back_to_rows() {
    // 40 letters and length 77: packed keys would need more than 128 bits; checked against
    // the definition (divided differences from S_w0)
    let job = Job::default();
    let mut w: Vec<usize> = (0..40).collect();
    w.swap(36, 37);
    w.swap(0, 39);
    assert_eq!(
        schubert(&w, &job).unwrap(),
        by_divided_differences(&w, &job).unwrap()
    );
}

#[test]
fn batch_refuses_huge_n() {
    assert!(matches!(
        AllSchuberts::new(11, 8 << 30),
        Err(Error::TooLarge { .. })
    ));
    assert!(AllSchuberts::new(20, u128::MAX).is_err());
}

#[test]
#[ignore = "measures the table TOTAL_TERMS in batch.rs"]
fn measure_total_terms() {
    let job = Job::default();
    for n in 0..=8 {
        let mut batch = AllSchuberts::new(n, u128::MAX).unwrap();
        while batch.advance(1 << 12, &job).unwrap() < batch.total() {}
        let (_, coeffs, _) = batch.collect().unwrap();
        println!("n = {n}: {} terms", coeffs.len());
    }
}
