//! Kernel checks that run without Python. Each value checked against the outside names its source.
use super::levels::Level;
use super::width::{with_fallback, Halt, Width};
use super::*;
use std::collections::BTreeMap;

fn job() -> Job {
    Job::default()
}

/// The polynomial as a map from exponent row to coefficient, checking order and nonzero-ness.
fn terms(shape: &[usize], n: usize) -> BTreeMap<Vec<u32>, BigUint> {
    let (exps, coeffs) = schur(shape, n, &job()).unwrap();
    let coeffs = coeffs.to_big();
    assert_eq!(exps.len(), coeffs.len() * n);
    let rows: Vec<&[u32]> = if n == 0 {
        vec![&[]; coeffs.len()]
    } else {
        exps.chunks(n).collect()
    };
    assert!(
        rows.windows(2).all(|w| w[0] > w[1]),
        "decreasing lexicographic order"
    );
    assert!(
        coeffs.iter().all(|c| c.bits() > 0),
        "only nonzero coefficients"
    );
    rows.into_iter().map(<[u32]>::to_vec).zip(coeffs).collect()
}

fn big(v: u64) -> BigUint {
    BigUint::from(v)
}

/// Number of SSYT by the hook-content formula (Stanley, EC2, Cor. 7.21.4).
fn hook_content(shape: &[usize], n: usize) -> BigUint {
    let (mut num, mut den) = (BigUint::from(1u32), BigUint::from(1u32));
    for (r, &len) in shape.iter().enumerate() {
        for c in 0..len {
            let below = shape.iter().skip(r + 1).filter(|&&l| l > c).count();
            num *= BigUint::from(n + c - r);
            den *= BigUint::from(len - c + below);
        }
    }
    num / den
}

/// Number of SYT by the hook length formula (Frame, Robinson and Thrall, 1954).
fn hook_length(shape: &[usize]) -> BigUint {
    let cells: usize = shape.iter().sum();
    let mut num = BigUint::from(1u32);
    for m in 1..=cells {
        num *= BigUint::from(m);
    }
    let mut den = BigUint::from(1u32);
    for (r, &len) in shape.iter().enumerate() {
        for c in 0..len {
            den *= BigUint::from(len - c + shape.iter().skip(r + 1).filter(|&&l| l > c).count());
        }
    }
    num / den
}

const SHAPES: &[&[usize]] = &[
    &[1],
    &[2],
    &[1, 1],
    &[2, 1],
    &[3, 1],
    &[2, 2],
    &[3, 2, 1],
    &[4, 2],
    &[2, 2, 2],
];

#[test]
fn small_polynomials() {
    // s_(2,1)(x1, x2, x3) = sum of x^a over the 8 SSYT: x1^2x2 + ... + 2 x1x2x3 (from memory).
    let s = terms(&[2, 1], 3);
    let want: BTreeMap<Vec<u32>, BigUint> = [
        (vec![2, 1, 0], 1),
        (vec![2, 0, 1], 1),
        (vec![1, 2, 0], 1),
        (vec![1, 1, 1], 2),
        (vec![1, 0, 2], 1),
        (vec![0, 2, 1], 1),
        (vec![0, 1, 2], 1),
    ]
    .into_iter()
    .map(|(a, c)| (a, big(c)))
    .collect();
    assert_eq!(s, want);
    // s_(2)(x1, x2) = x1^2 + x1x2 + x2^2, s_(1,1)(x1, x2) = x1x2 (from memory).
    assert_eq!(terms(&[2], 2).len(), 3);
    assert_eq!(terms(&[1, 1], 2), BTreeMap::from([(vec![1, 1], big(1))]));
}

#[test]
fn conventions() {
    assert!(terms(&[1, 1, 1], 2).is_empty()); // more rows than variables
    assert_eq!(terms(&[], 0), BTreeMap::from([(vec![], big(1))]));
    assert_eq!(terms(&[0, 0], 3), BTreeMap::from([(vec![0, 0, 0], big(1))]));
    assert_eq!(terms(&[4], 1), BTreeMap::from([(vec![4], big(1))]));
    assert!(terms(&[2, 1], 0).is_empty());
    assert!(matches!(
        schur(&[1, 2], 3, &job()),
        Err(Error::InvalidArgument(_))
    ));
}

#[test]
fn coefficients_are_kostka_numbers_and_sum_to_hook_content() {
    for shape in SHAPES {
        for n in 1..=5 {
            let s = terms(shape, n);
            let sum: BigUint = s.values().sum();
            let want = if shape.len() > n {
                BigUint::ZERO
            } else {
                hook_content(shape, n)
            };
            assert_eq!(sum, want, "{shape:?} n={n}");
            for (a, c) in &s {
                let w: Vec<usize> = a.iter().map(|&e| e as usize).collect();
                assert_eq!(&kostka(shape, &w, &job()).unwrap(), c, "{shape:?} {a:?}");
            }
        }
    }
}

#[test]
fn staircase_has_the_published_number_of_terms() {
    // 253692 monomials in s_(5,4,3,2,1)(x1..x9) (the figure given in the project's issue).
    let (_, coeffs) = schur(&[5, 4, 3, 2, 1], 9, &job()).unwrap();
    assert_eq!(coeffs.len(), 253_692);
    let sum: BigUint = coeffs.to_big().iter().sum();
    assert_eq!(sum, hook_content(&[5, 4, 3, 2, 1], 9)); // Stanley, EC2, Cor. 7.21.4
}

#[test]
fn every_width_gives_the_same_polynomial() {
    let plan = Plan::new(&[4, 3, 2, 1], 10, 4, &job()).unwrap();
    // The coefficient of x1...x10 is 768 = f^(4,3,2,1) (hook length formula), too big for u8.
    assert!(matches!(run::<u8, u32>(&plan, &job()), Err(Halt::Overflow)));
    let Ok((e64, c64)) = run::<u64, u32>(&plan, &job()) else {
        panic!("u64 suffices")
    };
    let Ok((e128, c128)) = run::<u128, u32>(&plan, &job()) else {
        panic!("u128 suffices")
    };
    let Ok((ebig, cbig)) = run::<BigUint, u32>(&plan, &job()) else {
        panic!("no overflow")
    };
    assert!(e64 == e128 && e64 == ebig);
    assert_eq!(Coeffs::U64(c64).to_big(), cbig);
    assert_eq!(Coeffs::U128(c128).to_big(), cbig);
    assert!(cbig.contains(&hook_length(&[4, 3, 2, 1])));
}

#[test]
fn fallback_widens_until_it_fits() {
    let mut tried = Vec::new();
    let got = with_fallback(Width::U32, |w| {
        tried.push(w);
        if w < Width::U128 {
            Err(Halt::Overflow)
        } else {
            Ok(w)
        }
    });
    assert_eq!(got, Ok(Width::U128));
    assert_eq!(tried, vec![Width::U32, Width::U64, Width::U128]);
    assert_eq!(Width::for_bits(32), Width::U32);
    assert_eq!(Width::for_bits(33), Width::U64);
    assert_eq!(Width::for_bits(129), Width::Big);
}

#[test]
fn kostka_small_values() {
    // Macdonald, Symmetric Functions and Hall Polynomials, Ch. I sec. 6, n = 3 and 4 (from memory).
    assert_eq!(kostka(&[2, 1], &[1, 1, 1], &job()).unwrap(), big(2));
    assert_eq!(kostka(&[3, 1], &[2, 1, 1], &job()).unwrap(), big(2));
    assert_eq!(kostka(&[2, 2], &[2, 1, 1], &job()).unwrap(), big(1));
    assert_eq!(kostka(&[2, 2], &[3, 1], &job()).unwrap(), BigUint::ZERO);
    assert_eq!(kostka(&[2, 1], &[1, 1], &job()).unwrap(), BigUint::ZERO); // |weight| != |shape|
    assert_eq!(kostka(&[], &[0, 0], &job()).unwrap(), big(1));
    // Zeros and order in the weight do not matter (Bender and Knuth, 1972).
    assert_eq!(kostka(&[3, 1], &[0, 1, 2, 0, 1], &job()).unwrap(), big(2));
}

#[test]
fn kostka_widens_past_u64_and_u128() {
    let ones = |m| vec![1usize; m];
    // K_{lambda,(1^m)} = f^lambda (hook length formula, Frame-Robinson-Thrall 1954).
    assert!(matches!(
        kostka::count::<u8>(&[4, 3, 2, 1], &ones(10), &job()),
        Err(Halt::Overflow)
    ));
    assert_eq!(
        kostka_from(&[4, 3, 2, 1], &ones(10), Width::U32, &job()).unwrap(),
        big(768)
    );
    let five = [10; 5]; // f is about 2.3e23, past u64
    assert_eq!(
        kostka(&five, &ones(50), &job()).unwrap(),
        hook_length(&five)
    );
    let nine = [9; 9]; // f is about 2.2e47, past u128
    assert_eq!(
        kostka(&nine, &ones(81), &job()).unwrap(),
        hook_length(&nine)
    );
}

#[test]
fn levels_are_numbered_in_listing_order_and_pairs_counted() {
    let shape = [4u32, 3, 3, 1];
    let mut below: Option<Level> = None;
    for k in 1..=6 {
        let (mut level, count) = Level::plan(&shape, 6, k);
        level.enumerate();
        assert_eq!(level.len() as u64, count);
        for id in 0..level.len() {
            assert_eq!(level.id(level.partition(id)), id);
        }
        if let Some(lower) = &below {
            let mut listed = 0;
            let mut up = 0;
            for id in 0..level.len() {
                let mut out = Vec::new();
                lower.strip_sources(level.partition(id), &mut out);
                listed += out.len();
            }
            for id in 0..lower.len() {
                let mut out = Vec::new();
                level.strip_supersets(lower.partition(id), &mut out);
                up += out.len();
            }
            assert_eq!(listed, up, "k={k}");
            assert_eq!(
                super::levels::strip_pairs(&level, lower),
                listed as u64,
                "k={k}"
            );
        }
        below = Some(level);
    }
}

#[test]
fn every_meeting_level_gives_the_same_polynomial() {
    for (shape, n) in [
        (&[3usize, 2, 1][..], 5),
        (&[4, 2, 2, 1], 6),
        (&[2, 2], 4),
        (&[5], 3),
    ] {
        let parts: Vec<u32> = shape.iter().map(|&p| u32::try_from(p).unwrap()).collect();
        let mut plan = Plan::new(&parts, n, 4, &job()).unwrap();
        let want = run::<u64, u32>(&plan, &job()).unwrap();
        for q in 1..n {
            plan.set_meet(q);
            let got = run::<u64, u32>(&plan, &job()).unwrap();
            assert!(got == want, "{shape:?} n={n} q={q}");
        }
    }
}

#[test]
fn stops_when_asked() {
    let stopped = Job::default();
    stopped.set_stop(true);
    assert_eq!(
        schur(&[5, 4, 3, 2, 1], 9, &stopped),
        Err(Error::Interrupted)
    );
}
