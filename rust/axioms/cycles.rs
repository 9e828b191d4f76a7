//! Directed cycles through several colours, for crystals given without weights (with weights,
//! every such cycle already breaks `weight`: each f_i lowers sum_k (n - k) wt_k by one).
#![deny(unsafe_code)]

use super::report::{Axiom, Sink};
use super::{id, Table};
use crate::error::Error;
use crate::job::Job;

/// How many vertices of a cycle a witness lists.
const SHOWN: usize = 12;

/// One `cycle` witness per back edge of a depth-first search along all f arrows (vertices in
/// ascending order, colours in order) that closes a cycle using at least two colours; the
/// one-colour cycles are reported from the string lengths. O(N (n-1)), iterative.
pub(super) fn report_mixed_cycles(
    table: &Table<'_>,
    sink: &mut Sink,
    job: &Job,
) -> Result<(), Error> {
    const WHITE: u8 = 0;
    const GREY: u8 = 1;
    const BLACK: u8 = 2;
    let m = table.f.len();
    let mut colour = vec![WHITE; table.count];
    // (vertex, next colour to follow); the colour followed into stack[k + 1] is stack[k].1 - 1
    let mut stack: Vec<(usize, usize)> = Vec::new();
    let mut pushed = 0u64;
    for start in 0..table.count {
        if colour[start] != WHITE {
            continue;
        }
        colour[start] = GREY;
        stack.push((start, 0));
        while let Some(top) = stack.last_mut() {
            let v = top.0;
            if top.1 == m {
                colour[v] = BLACK;
                stack.pop();
                continue;
            }
            top.1 += 1;
            let Ok(t) = usize::try_from(table.f[top.1 - 1][v]) else {
                continue;
            };
            match colour[t] {
                WHITE => {
                    colour[t] = GREY;
                    stack.push((t, 0));
                    pushed += 1;
                    if pushed % 4096 == 0 {
                        job.checkpoint(4096)?;
                    }
                }
                GREY => report(&stack, t, sink),
                _ => {}
            }
        }
    }
    Ok(())
}

/// The cycle closed by the back edge from the top of the stack to t (which is on the stack).
fn report(stack: &[(usize, usize)], t: usize, sink: &mut Sink) {
    let from = stack
        .iter()
        .rposition(|&(v, _)| v == t)
        .expect("a grey vertex is on the stack");
    let cycle = &stack[from..];
    let colours: Vec<usize> = cycle.iter().map(|&(_, k)| k).collect();
    if colours.iter().all(|&c| c == colours[0]) {
        return; // one colour: an infinite string, reported by the string lengths
    }
    let at = cycle
        .iter()
        .map(|&(v, _)| v)
        .min()
        .expect("a cycle has a vertex");
    let shown: Vec<i64> = cycle.iter().take(SHOWN).map(|&(v, _)| id(v)).collect();
    sink.add(
        Axiom::Cycle,
        (colours[colours.len() - 1], 0),
        at,
        &shown,
        || {
            let path: Vec<String> = colours.iter().map(|c| format!("f_{c}")).collect();
            format!(
                "following {} from vertex {t} returns to it (a cycle through several colours)",
                path.join(", ")
            )
        },
    );
}
