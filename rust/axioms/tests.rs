//! Checks on word crystals B(1)^{(x)k} built here by the signature rule, independently of the
//! tableau model, and on deliberately broken copies of them.
use super::iso::{map_to_model, Walk};
use super::*;

/// All words of length k over 1..n (vertex = base-n digits, first letter most significant),
/// f_i and e_i by the signature rule: an i+1 pairs with the nearest unpaired i to its right;
/// f_i turns the rightmost unpaired i into i+1, e_i the leftmost unpaired i+1 into i
/// (Kashiwara-Nakashima 1994, the tensor product rule on words).
struct Words {
    n: usize,
    f: Vec<Vec<i64>>,
    e: Vec<Vec<i64>>,
    w: Vec<i32>,
}

fn unpaired(word: &[usize], i: usize) -> (Vec<usize>, Vec<usize>) {
    let (mut lows, mut highs) = (Vec::new(), Vec::new()); // unpaired i, unpaired i+1
    for (p, &c) in word.iter().enumerate().rev() {
        if c == i {
            lows.push(p);
        } else if c == i + 1 && lows.pop().is_none() {
            highs.push(p);
        }
    }
    lows.reverse(); // ascending positions
    highs.sort_unstable();
    (lows, highs)
}

fn words(n: usize, k: usize) -> Words {
    let count = n.pow(u32::try_from(k).unwrap());
    let decode = |mut v: usize| {
        let mut word = vec![0; k];
        for p in (0..k).rev() {
            word[p] = v % n + 1;
            v /= n;
        }
        word
    };
    let encode = |word: &[usize]| word.iter().fold(0, |acc, &c| acc * n + c - 1);
    let mut out = Words {
        n,
        f: vec![vec![-1; count]; n - 1],
        e: vec![vec![-1; count]; n - 1],
        w: vec![0; count * n],
    };
    for v in 0..count {
        let word = decode(v);
        for &c in &word {
            out.w[v * n + c - 1] += 1;
        }
        for i in 1..n {
            let (lows, highs) = unpaired(&word, i);
            if let Some(&p) = lows.last() {
                let mut t = word.clone();
                t[p] = i + 1;
                out.f[i - 1][v] = i64::try_from(encode(&t)).unwrap();
            }
            if let Some(&p) = highs.first() {
                let mut t = word.clone();
                t[p] = i;
                out.e[i - 1][v] = i64::try_from(encode(&t)).unwrap();
            }
        }
    }
    out
}

impl Words {
    fn table(&self) -> Table<'_> {
        Table {
            n: self.n,
            count: self.w.len() / self.n,
            f: self.f.iter().map(Vec::as_slice).collect(),
            e: self.e.iter().map(Vec::as_slice).collect(),
            weights: Some(&self.w),
            declared: None,
        }
    }
}

fn run(words: &Words) -> Report {
    let opts = Options {
        stembridge: true,
        max_witnesses: 50,
    };
    check(&words.table(), opts, &Job::default()).unwrap()
}

fn total(r: &Report, axiom: Axiom) -> u64 {
    r.counts[axiom as usize]
}

#[test]
fn tensor_powers_satisfy_every_axiom() {
    // Kashiwara 1991: tensor powers of the standard crystal are crystals of representations
    for (n, k) in [(2, 4), (3, 4), (4, 4), (5, 3)] {
        let r = run(&words(n, k));
        assert!(
            r.witnesses.is_empty(),
            "n={n} k={k}: {:?}",
            r.witnesses.first()
        );
    }
}

#[test]
fn broken_tables_give_witnesses() {
    // a weight off by one at vertex 5
    let mut w = words(3, 3);
    w.w[5 * 3] += 1;
    let r = run(&w);
    assert!(total(&r, Axiom::Weight) > 0 && total(&r, Axiom::StringLength) > 0);
    assert!(r
        .witnesses
        .iter()
        .any(|x| x.axiom == Axiom::StringLength && x.vertices == [5]));
    // e_1 no longer the inverse of f_1 at one vertex
    let mut w = words(3, 3);
    let v = w.f[0].iter().position(|&t| t >= 0).unwrap();
    let t = usize::try_from(w.f[0][v]).unwrap();
    w.e[0][t] = -1;
    let r = run(&w);
    assert_eq!(r.witnesses[0].axiom, Axiom::Inverse);
    assert_eq!(
        r.witnesses[0].vertices[..2],
        [i64::try_from(v).unwrap(), w.f[0][v]]
    );
    // an f_1-string closed into a cycle: 111 -> 211 -> 311? no: words 1,2 for n=2, k=1
    let mut w = words(2, 1);
    w.f[0][1] = 0;
    w.e[0][0] = 1;
    let r = run(&w);
    assert_eq!(total(&r, Axiom::Cycle), 1);
    assert_eq!(r.witnesses[0].vertices, [0, 1]);
}

/// The same crystal with vertex v renamed to perm[v].
fn relabel(w: &Words, perm: &[usize]) -> Words {
    let count = perm.len();
    let mut out = Words {
        n: w.n,
        f: vec![vec![-1; count]; w.n - 1],
        e: vec![vec![-1; count]; w.n - 1],
        w: vec![0; count * w.n],
    };
    let moved = |t: i64| usize::try_from(t).map_or(-1, |t| i64::try_from(perm[t]).unwrap());
    for (v, &p) in perm.iter().enumerate() {
        for k in 0..w.n - 1 {
            out.f[k][p] = moved(w.f[k][v]);
            out.e[k][p] = moved(w.e[k][v]);
        }
        out.w[p * w.n..(p + 1) * w.n].copy_from_slice(&w.w[v * w.n..(v + 1) * w.n]);
    }
    out
}

#[test]
fn isomorphism_of_a_relabelled_crystal() {
    // B(1) of GL_4 (words of length 1), reversed: vertex v becomes 3 - v
    let model = words(4, 1);
    let source = relabel(&model, &[3, 2, 1, 0]);
    let (s, m) = (source.table(), model.table());
    let walk = Walk {
        source: &s,
        source_top: 3,
        model: &m,
        model_top: 0,
        shift: 0,
    };
    let map = map_to_model(&walk, &Job::default()).unwrap().unwrap();
    assert_eq!(map, vec![3, 2, 1, 0]);
    // the component of the word 2 1 (n = 4, vertex 4) is B(1,1), not B(1): a witness at 4
    let two = words(4, 2);
    let t = two.table();
    let walk = Walk {
        source: &t,
        source_top: 4,
        model: &m,
        model_top: 0,
        shift: 0,
    };
    let miss = map_to_model(&walk, &Job::default()).unwrap().unwrap_err();
    assert_eq!((miss.vertex, miss.i), (4, 0));
    assert!(miss.detail.contains("weight"), "{}", miss.detail);
}

#[test]
fn cycles_through_several_colours_without_weights() {
    // f_1(0) = 1, f_2(1) = 0: a cycle through two colours; with weights it breaks `weight`
    let (f1, f2) = (vec![1, -1], vec![-1, 0]);
    let (e1, e2) = (vec![-1, 0], vec![1, -1]);
    let table = Table {
        n: 3,
        count: 2,
        f: vec![&f1, &f2],
        e: vec![&e1, &e2],
        weights: None,
        declared: None,
    };
    let opts = Options {
        stembridge: false,
        max_witnesses: 10,
    };
    let r = check(&table, opts, &Job::default()).unwrap();
    assert_eq!(total(&r, Axiom::Cycle), 1);
    assert_eq!(
        (r.witnesses[0].i, r.witnesses[0].vertices.clone()),
        (2, vec![0, 1])
    );
    // one colour only: reported once, by the string lengths, not again by the search
    let (f1, e1) = (vec![1, 0], vec![1, 0]);
    let none = vec![-1, -1];
    let table = Table {
        f: vec![&f1, &none],
        e: vec![&e1, &none],
        ..table
    };
    let r = check(&table, opts, &Job::default()).unwrap();
    assert_eq!(total(&r, Axiom::Cycle), 1);
}
