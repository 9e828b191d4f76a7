//! The fillings of one row of the Littlewood-Richardson count.
#![deny(unsafe_code)]

use crate::error::Error;
use crate::job::Job;

/// Every filling of a row of `len` cells (weakly increasing, each cell above `prev` in its column
/// if `prev` is not empty) whose letters, read right to left, keep `c` a partition as each is
/// added. Calls `emit(c, row)` with `c` updated for each. Iterative, so long rows need no stack.
/// `E` lets `emit` stop the walk with an error of its own (an overflowing count).
pub fn fill_row<E: From<Error>>(
    len: usize,
    prev: &[u8],
    c: &mut [u64],
    letters: u8,
    job: &Job,
    mut emit: impl FnMut(&[u64], &[u8]) -> Result<(), E>,
) -> Result<(), E> {
    if len == 0 {
        return emit(c, &[]);
    }
    let lattice_ok = |c: &[u64], j: u8| j == 1 || c[usize::from(j) - 2] > c[usize::from(j) - 1];
    let mut row = vec![0u8; len];
    let mut next = vec![0u8; len]; // next letter to try at each depth, descending
    let (mut depth, mut emitted) = (0usize, 0u64);
    next[0] = letters;
    loop {
        let pos = len - 1 - depth;
        let lo = prev.get(pos).map_or(1, |&p| p + 1);
        let mut j = next[depth];
        while j >= lo && !lattice_ok(c, j) {
            j -= 1;
        }
        if j < lo {
            if depth == 0 {
                return Ok(());
            }
            depth -= 1;
            let l = row[len - 1 - depth];
            c[usize::from(l) - 1] -= 1;
            next[depth] = l - 1;
            continue;
        }
        row[pos] = j;
        c[usize::from(j) - 1] += 1;
        if depth + 1 == len {
            emit(c, &row)?;
            emitted += 1;
            if emitted % 4096 == 0 {
                job.checkpoint(4096)?;
            }
            c[usize::from(j) - 1] -= 1;
            next[depth] = j - 1;
        } else {
            depth += 1;
            next[depth] = j; // weakly increasing rows: the cell to the left is at most j
        }
    }
}
