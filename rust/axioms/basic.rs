//! The basic crystal axioms at one vertex: inverse, weight, string_length, seminormal; and the
//! global injectivity check of each f_i.
#![deny(unsafe_code)]

use super::report::{Axiom, Sink};
use super::strings::Strings;
use super::{id, step, Table};
use rayon::prelude::*;

/// One `injective` witness per vertex that is the f_i target of a second, larger vertex:
/// (i, first preimage, second preimage, target). O(N) per operator, the operators in parallel.
pub(super) fn report_collisions(table: &Table<'_>, sink: &mut Sink) {
    let found: Vec<Vec<(usize, usize, usize)>> = table
        .f
        .par_iter()
        .map(|fi| {
            let mut first = vec![usize::MAX; table.count];
            let mut hits = Vec::new();
            for (v, &t) in fi.iter().enumerate() {
                if let Ok(t) = usize::try_from(t) {
                    if first[t] == usize::MAX {
                        first[t] = v;
                    } else {
                        hits.push((first[t], v, t));
                    }
                }
            }
            hits
        })
        .collect();
    for (k, hits) in found.into_iter().enumerate() {
        let i = k + 1;
        for (u, v, t) in hits {
            sink.add(Axiom::Injective, (i, 0), u, &[id(u), id(v), id(t)], || {
                format!("f_{i}({u}) = f_{i}({v}) = {t}")
            });
        }
    }
}

/// Every basic axiom at vertex x, for each i in turn.
pub(super) fn check_vertex(table: &Table<'_>, strings: &Strings, x: usize, sink: &mut Sink) {
    for i in 1..table.n {
        check_inverse(table, i, x, sink);
        if table.weights.is_some() {
            check_weight(table, i, x, sink);
            check_string_length(table, strings, i, x, sink);
        }
        if table.declared.is_some() {
            check_declared(table, strings, i, x, sink);
        }
    }
}

fn check_inverse(table: &Table<'_>, i: usize, x: usize, sink: &mut Sink) {
    let (f, e) = (table.f[i - 1], table.e[i - 1]);
    if let Some(y) = step(f, x) {
        if e[y] != id(x) {
            sink.add(Axiom::Inverse, (i, 0), x, &[id(x), id(y), e[y]], || {
                format!("f_{i}({x}) = {y} but e_{i}({y}) = {}", e[y])
            });
        }
    }
    if let Some(y) = step(e, x) {
        if f[y] != id(x) {
            sink.add(Axiom::Inverse, (i, 0), x, &[id(x), id(y), f[y]], || {
                format!("e_{i}({x}) = {y} but f_{i}({y}) = {}", f[y])
            });
        }
    }
}

fn show(w: &[i64]) -> String {
    let parts: Vec<String> = w.iter().map(ToString::to_string).collect();
    format!("({})", parts.join(", "))
}

fn check_weight(table: &Table<'_>, i: usize, x: usize, sink: &mut Sink) {
    let Some(y) = step(table.f[i - 1], x) else {
        return;
    };
    let (wx, wy) = (table.weight(x), table.weight(y));
    // wt(x) - alpha_i, in i64 so that -/+ 1 cannot overflow; no allocation on the hot path
    let expected = |k: usize| i64::from(wx[k]) - i64::from(k + 1 == i) + i64::from(k == i);
    if (0..table.n).any(|k| expected(k) != i64::from(wy[k])) {
        sink.add(Axiom::Weight, (i, 0), x, &[id(x), id(y)], || {
            let wanted: Vec<i64> = (0..table.n).map(expected).collect();
            let wx: Vec<i64> = wx.iter().map(|&w| i64::from(w)).collect();
            let wy: Vec<i64> = wy.iter().map(|&w| i64::from(w)).collect();
            format!(
                "wt({x}) = {}, so wt(f_{i}({x})) should be {}; vertex {y} has {}",
                show(&wx),
                show(&wanted),
                show(&wy)
            )
        });
    }
}

fn check_string_length(table: &Table<'_>, strings: &Strings, i: usize, x: usize, sink: &mut Sink) {
    let (Some(phi), Some(eps)) = (strings.phi(i, x), strings.eps(i, x)) else {
        return;
    };
    let w = table.weight(x);
    let pairing = i64::from(w[i - 1]) - i64::from(w[i]);
    if phi - eps != pairing {
        sink.add(Axiom::StringLength, (i, 0), x, &[id(x)], || {
            format!(
                "phi_{i}({x}) - epsilon_{i}({x}) = {phi} - {eps}, but wt_{i} - wt_{} = {pairing}",
                i + 1
            )
        });
    }
}

fn check_declared(table: &Table<'_>, strings: &Strings, i: usize, x: usize, sink: &mut Sink) {
    let (phi, eps) = table.declared.as_ref().expect("checked by the caller");
    let stated = (i64::from(phi[i - 1][x]), i64::from(eps[i - 1][x]));
    let walked = (strings.phi(i, x), strings.eps(i, x));
    if walked != (Some(stated.0), Some(stated.1)) {
        sink.add(Axiom::Seminormal, (i, 0), x, &[id(x)], || {
            let shown = |s: Option<i64>| s.map_or("infinite".to_string(), |s| s.to_string());
            format!(
                "the model states phi_{i}({x}) = {}, epsilon_{i}({x}) = {}; its strings have {} and {}",
                stated.0,
                stated.1,
                shown(walked.0),
                shown(walked.1)
            )
        });
    }
}
