//! An explicit isomorphism from the component of a highest weight vertex to a model crystal
//! (the tableau crystal B(lambda)), by walking both along f arrows at once.
#![deny(unsafe_code)]

use super::{id, step, Table};
use crate::error::Error;
use crate::job::Job;
use std::collections::VecDeque;

/// Why the walk failed: the vertex of the source crystal, the operator index i (0 when no
/// operator is involved) and what differs.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Mismatch {
    pub vertex: usize,
    pub i: usize,
    pub detail: String,
}

/// The two crystals and their highest weight vertices; `shift` is added to every weight of
/// the model before comparing (the source may be a twist of B(lambda) by a power of det).
pub struct Walk<'s, 'a, 'b> {
    pub source: &'s Table<'a>,
    pub source_top: usize,
    pub model: &'s Table<'b>,
    pub model_top: usize,
    pub shift: i64,
}

/// map[v] = the model vertex of v for every v in the component of `source_top`, -1 elsewhere;
/// or the first place (in breadth-first order from the top) where the crystals differ.
/// Every f_i and e_i arrow and every weight of the component is compared through the map, and
/// the map is injective; since both crystals are connected, it is then an isomorphism.
/// O(size x (n-1)) look-ups. Both tables must have passed `Table::validate` and have weights.
pub fn map_to_model(
    walk: &Walk<'_, '_, '_>,
    job: &Job,
) -> Result<Result<Vec<i64>, Mismatch>, Error> {
    let (src, model) = (walk.source, walk.model);
    if src.n != model.n || src.weights.is_none() || model.weights.is_none() {
        return Err(Error::invalid("both crystals need weights and the same n"));
    }
    let mut map = vec![-1i64; src.count];
    let mut taken = vec![false; model.count];
    let mut queue = VecDeque::from([walk.source_top]);
    map[walk.source_top] = id(walk.model_top);
    taken[walk.model_top] = true;
    let mut seen = 0usize;
    while let Some(v) = queue.pop_front() {
        seen += 1;
        if seen % 4096 == 0 {
            job.checkpoint(4096)?;
        }
        let t = usize::try_from(map[v]).expect("queued vertices are mapped");
        if let Err(m) = compare_weight(walk, v, t) {
            return Ok(Err(m));
        }
        for i in 1..src.n {
            let pairs = [
                (step(src.f[i - 1], v), step(model.f[i - 1], t), 'f'),
                (step(src.e[i - 1], v), step(model.e[i - 1], t), 'e'),
            ];
            for (u, s, op) in pairs {
                let outcome = match (u, s) {
                    (None, None) => Ok(()),
                    (Some(u), Some(s)) => {
                        extend(&mut map, &mut taken, &mut queue, (u, s), (op, i, v))
                    }
                    (Some(u), None) => Err(format!(
                        "{op}_{i}({v}) = {u}, but {op}_{i} is undefined at its image {t}"
                    )),
                    (None, Some(s)) => Err(format!(
                        "{op}_{i}({v}) is undefined, but {op}_{i} of its image {t} is {s}"
                    )),
                };
                if let Err(detail) = outcome {
                    return Ok(Err(Mismatch {
                        vertex: v,
                        i,
                        detail,
                    }));
                }
            }
        }
    }
    if seen != model.count {
        let detail = format!(
            "the component has {seen} vertices, the model {}",
            model.count
        );
        return Ok(Err(Mismatch {
            vertex: walk.source_top,
            i: 0,
            detail,
        }));
    }
    Ok(Ok(map))
}

/// Maps u to s if u is new (s must be free), else checks that u already maps to s.
fn extend(
    map: &mut [i64],
    taken: &mut [bool],
    queue: &mut VecDeque<usize>,
    (u, s): (usize, usize),
    (op, i, v): (char, usize, usize),
) -> Result<(), String> {
    if map[u] == id(s) {
        return Ok(());
    }
    if map[u] >= 0 {
        return Err(format!(
            "{op}_{i}({v}) = {u}, already mapped to {}, but the model's {op}_{i} leads to {s}",
            map[u]
        ));
    }
    if taken[s] {
        return Err(format!(
            "{op}_{i}({v}) = {u} would map to {s}, already the image of another vertex"
        ));
    }
    map[u] = id(s);
    taken[s] = true;
    queue.push_back(u);
    Ok(())
}

fn compare_weight(walk: &Walk<'_, '_, '_>, v: usize, t: usize) -> Result<(), Mismatch> {
    let (wv, wt) = (walk.source.weight(v), walk.model.weight(t));
    if wv
        .iter()
        .zip(wt)
        .all(|(&a, &b)| i64::from(a) == i64::from(b) + walk.shift)
    {
        return Ok(());
    }
    Err(Mismatch {
        vertex: v,
        i: 0,
        detail: format!(
            "vertex {v} has weight {wv:?}; its image {t} has {wt:?}{}",
            if walk.shift == 0 {
                String::new()
            } else {
                format!(" (compared after adding {} to each part)", walk.shift)
            }
        ),
    })
}
