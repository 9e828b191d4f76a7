//! Littlewood-Richardson multiplicities c^lambda_{mu nu}, for all lambda at once.
//!
//! Source: the highest weight vertices of B(mu) (x) B(nu) (Bump-Schilling, "Crystal Bases:
//! Representations and Combinatorics", 2017, the tensor product rule and the
//! Littlewood-Richardson rule derived from it; equivalently Fulton, "Young Tableaux", 1997,
//! ch. 5). With the convention of `tensor.rs`, x (x) y is highest weight iff y is and
//! eps_i(x) <= phi_i(y) for all i; on words this says that the row reading word of T followed by
//! that of u_mu is a reverse lattice word: every suffix has at least as many letters i as i+1.
//! So c^lambda_{nu mu} = c^lambda_{mu nu} counts the SSYT T of shape nu with wt(T) = lambda - mu
//! such that, reading T's rows top to bottom and each right to left (the reverse of the row
//! reading word), every letter j > 1 read keeps mu_{j-1} + #(j-1 read) >= mu_j + #(j read).
//!
//! The count goes row by row: after each row the state is (current lambda, the row just filled,
//! cut to the length of the next row, which is all the next row's column condition sees), and
//! equal states are merged with their multiplicities added, so only the rows are enumerated,
//! never the whole tableaux. Counts are u64 with checked additions; if one overflows, the
//! count reruns on BigUint (a second pass is cheaper than carrying big integers every time), and
//! the results come back as u128 when they fit.
#![deny(unsafe_code)]

mod count;
mod fill;

use crate::error::Error;
use crate::job::Job;
use crate::partition::normalize;
use count::Count;
use fill::fill_row;
use num_bigint::BigUint;
use rayon::prelude::*;
use std::collections::HashMap;

/// (lambda without trailing zeros, c^lambda_{mu nu}), lambda in decreasing lexicographic order.
pub type TermList<C> = Vec<(Vec<u64>, C)>;

/// The nonzero c^lambda_{mu nu}: u128 when every one fits, BigUint otherwise.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Terms {
    Small(TermList<u128>),
    Big(TermList<BigUint>),
}

type States<C> = HashMap<(Vec<u64>, Vec<u8>), C>;

/// The most memory the row states may take.
const MAX_BYTES: u128 = 4 << 30;

/// Why a count stopped: a count overflowed its type (rerun wider), or a real error.
enum Halt {
    Overflow,
    Failed(Error),
}

impl From<Error> for Halt {
    fn from(e: Error) -> Self {
        Halt::Failed(e)
    }
}

/// The checked input: `big` is the starting partition, the rows of `small` are filled.
struct Setup {
    big: Vec<usize>,
    small: Vec<usize>,
    letters: u8,
}

impl Setup {
    fn new(mu: &[usize], nu: &[usize]) -> Result<Self, Error> {
        let mu = normalize(mu, "mu")?;
        let nu = normalize(nu, "nu")?;
        // fill the partition with fewer cells: fewer rows to enumerate; the count is symmetric
        let (big, small) = if nu.iter().sum::<usize>() <= mu.iter().sum() {
            (mu, nu)
        } else {
            (nu, mu)
        };
        // letters stay below 255 so that "one more than a letter" is still a u8
        let letters = u8::try_from(big.len() + small.len())
            .ok()
            .filter(|&l| l < u8::MAX)
            .ok_or_else(|| Error::invalid("mu and nu may have at most 254 rows together"))?;
        Ok(Setup {
            big,
            small,
            letters,
        })
    }
}

/// c^lambda_{mu nu} for every lambda with a nonzero coefficient.
pub fn lr(mu: &[usize], nu: &[usize], job: &Job) -> Result<Terms, Error> {
    lr_narrow_first::<u64>(mu, nu, job)
}

/// `lr` counting in `C` first and rerunning on BigUint if a count overflows `C`.
fn lr_narrow_first<C: Count + Into<u128>>(
    mu: &[usize],
    nu: &[usize],
    job: &Job,
) -> Result<Terms, Error> {
    let setup = Setup::new(mu, nu)?;
    match count_rows::<C>(&setup, job) {
        Ok(terms) => Ok(Terms::Small(
            terms.into_iter().map(|(l, c)| (l, c.into())).collect(),
        )),
        Err(Halt::Failed(e)) => Err(e),
        Err(Halt::Overflow) => match count_rows::<BigUint>(&setup, job) {
            Ok(terms) => Ok(narrowed(terms)),
            Err(Halt::Failed(e)) => Err(e),
            Err(Halt::Overflow) => unreachable!("BigUint additions never overflow"),
        },
    }
}

/// `Terms::Small` if every count fits in u128 (an overflow may have been in a row state only).
fn narrowed(terms: TermList<BigUint>) -> Terms {
    if terms.iter().all(|(_, c)| c.bits() <= 128) {
        let small = terms.into_iter().map(|(l, c)| {
            let c = u128::try_from(c).expect("at most 128 bits");
            (l, c)
        });
        Terms::Small(small.collect())
    } else {
        Terms::Big(terms)
    }
}

/// The row-by-row count in `C`; `Halt::Overflow` as soon as an addition overflows.
fn count_rows<C: Count>(setup: &Setup, job: &Job) -> Result<TermList<C>, Halt> {
    let small = &setup.small;
    let letters = usize::from(setup.letters);
    let mut start = vec![0u64; letters];
    for (slot, &p) in start.iter_mut().zip(&setup.big) {
        *slot = p as u64;
    }
    let mut states = States::<C>::new();
    states.insert((start, Vec::new()), C::one());
    for (r, &len) in small.iter().enumerate() {
        let keep = small.get(r + 1).copied().unwrap_or(0);
        // a state holds its two vectors (with their headers), the count and the table's slack
        let per_state = (letters * 8 + keep + 48 + std::mem::size_of::<C>() + 32) as u128;
        let mut next = States::<C>::new();
        for ((mut c, prev), count) in states {
            fill_row(len, &prev, &mut c, setup.letters, job, |c, row| {
                let key = (c.to_vec(), row[..keep].to_vec());
                let slot = next.entry(key).or_insert_with(C::zero);
                if slot.add_checked(&count) {
                    Ok(())
                } else {
                    Err(Halt::Overflow)
                }
            })?;
            let bytes = next.len() as u128 * per_state;
            if bytes > MAX_BYTES {
                return Err(Halt::Failed(Error::TooLarge {
                    what: "the Littlewood-Richardson count (its row states)".into(),
                    bytes,
                    instead: "ask for smaller partitions".into(),
                }));
            }
        }
        states = next;
    }
    let mut terms: TermList<C> = states
        .into_iter()
        .map(|((mut c, _), count)| {
            let len = c.iter().rposition(|&p| p > 0).map_or(0, |i| i + 1);
            c.truncate(len);
            (c, count)
        })
        .collect();
    terms.sort_unstable_by(|a, b| b.0.cmp(&a.0));
    Ok(terms)
}

/// `lr` for each pair, in parallel; results in the order of `pairs`.
pub fn lr_batch(pairs: &[(Vec<usize>, Vec<usize>)], job: &Job) -> Result<Vec<Terms>, Error> {
    pairs
        .par_iter()
        .map(|(mu, nu)| {
            job.checkpoint(1)?;
            lr(mu, nu, job)
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn run(mu: &[usize], nu: &[usize]) -> TermList<u128> {
        match lr(mu, nu, &Job::default()).unwrap() {
            Terms::Small(t) => t,
            Terms::Big(_) => panic!("these counts fit in u128"),
        }
    }

    #[test]
    fn fulton_example() {
        // c^{(3,2,1)}_{(2,1),(2,1)} = 2 (Fulton, Young Tableaux, 1997, ch. 5)
        let t = run(&[2, 1], &[2, 1]);
        let c = t.iter().find(|(l, _)| l == &[3, 2, 1]).map(|x| x.1);
        assert_eq!(c, Some(2));
        // from memory: s_21^2 = s_42 + s_411 + s_33 + 2 s_321 + s_3111 + s_222 + s_2211
        let total: u128 = t.iter().map(|x| x.1).sum();
        assert_eq!((t.len(), total), (7, 8));
    }

    #[test]
    fn pieri_row() {
        // s_1 * s_1 = s_2 + s_11 (Pieri rule)
        assert_eq!(run(&[1], &[1]), vec![(vec![2], 1), (vec![1, 1], 1)]);
        assert_eq!(run(&[], &[2, 1]), vec![(vec![2, 1], 1)]);
        assert_eq!(run(&[], &[]), vec![(vec![], 1)]);
    }

    #[test]
    fn bad_input_is_refused() {
        assert!(lr(&[1, 2], &[1], &Job::default()).is_err());
        assert!(lr(&[1; 200], &[1; 100], &Job::default()).is_err());
    }

    /// f^lambda, the number of standard tableaux, by the hook length formula
    /// (Frame-Robinson-Thrall, "The hook graphs of the symmetric group", 1954).
    fn standard_count(shape: &[u64]) -> BigUint {
        let n: u64 = shape.iter().sum();
        let mut hooks = BigUint::from(1u8);
        for (r, &len) in shape.iter().enumerate() {
            for c in 0..len {
                let below = shape[r + 1..].iter().filter(|&&l| l > c).count() as u64;
                hooks *= len - c + below;
            }
        }
        (1..=n).map(BigUint::from).product::<BigUint>() / hooks
    }

    fn binomial(n: u64, k: u64) -> BigUint {
        (0..k).fold(BigUint::from(1u8), |b, i| b * (n - i) / (i + 1))
    }

    #[test]
    fn narrow_count_reruns_wide() {
        let (mu, nu) = ([6, 5, 4, 3, 2, 1], [5, 4, 3, 2, 1]);
        let setup = Setup::new(&mu, &nu).unwrap();
        let job = Job::default();
        assert!(matches!(
            count_rows::<u8>(&setup, &job),
            Err(Halt::Overflow)
        ));
        let fixed = run(&mu, &nu);
        assert!(
            fixed.iter().any(|(_, c)| *c > 255),
            "the case must overflow u8"
        );
        let wide = count_rows::<BigUint>(&setup, &job).ok().unwrap();
        let wide_as_u128: TermList<u128> = wide
            .iter()
            .map(|(l, c)| (l.clone(), u128::try_from(c).unwrap()))
            .collect();
        assert_eq!(wide_as_u128, fixed);
        // through the public route: u8 first, BigUint rerun, narrowed back
        assert_eq!(
            lr_narrow_first::<u8>(&mu, &nu, &job).unwrap(),
            Terms::Small(fixed)
        );
        // sum_lambda c^lambda f^lambda = binom(|mu|+|nu|, |mu|) f^mu f^nu (Ind_{S_21 x S_15})
        let total: BigUint = wide.iter().map(|(l, c)| c * standard_count(l)).sum();
        assert_eq!(
            total,
            binomial(36, 21)
                * standard_count(&[6, 5, 4, 3, 2, 1])
                * standard_count(&[5, 4, 3, 2, 1])
        );
    }

    #[test]
    fn counts_past_u128_stay_big() {
        let two_128 = BigUint::from(u128::MAX) + 1u8;
        let big = narrowed(vec![
            (vec![2], two_128.clone()),
            (vec![1, 1], BigUint::from(3u8)),
        ]);
        assert_eq!(
            big,
            Terms::Big(vec![(vec![2], two_128), (vec![1, 1], BigUint::from(3u8))])
        );
        let small = narrowed(vec![(vec![2], BigUint::from(u128::MAX))]);
        assert_eq!(small, Terms::Small(vec![(vec![2], u128::MAX)]));
    }
}
