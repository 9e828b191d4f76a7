//! Stembridge's local axioms P3-P6, P5', P6' at one vertex (definitions in the module docs of
//! `axioms`; J. R. Stembridge, "A local characterization of simply-laced crystals", 2003).
#![deny(unsafe_code)]

use super::report::{Axiom, Sink};
use super::strings::Strings;
use super::{id, opt_id, step, Table};

/// Cartan matrix entry a_ij of A_{n-1}, i != j.
fn cartan(i: usize, j: usize) -> i64 {
    if i.abs_diff(j) == 1 {
        -1
    } else {
        0
    }
}

/// The table and its string lengths, with the differences the axioms are written in.
struct Local<'t, 'a> {
    table: &'t Table<'a>,
    strings: &'t Strings,
}

impl Local<'_, '_> {
    fn up(&self, i: usize, v: Option<usize>) -> Option<usize> {
        step(self.table.e[i - 1], v?)
    }

    fn down(&self, i: usize, v: Option<usize>) -> Option<usize> {
        step(self.table.f[i - 1], v?)
    }

    /// Delta_i delta(x, j) = epsilon_j(x) - epsilon_j(e_i x), where e_i x = a.
    fn delta_delta(&self, j: usize, x: usize, a: usize) -> Option<i64> {
        Some(self.strings.eps(j, x)? - self.strings.eps(j, a)?)
    }

    /// Nabla_i phi(x, j) = phi_j(x) - phi_j(f_i x), where f_i x = a.
    fn nabla_phi(&self, j: usize, x: usize, a: usize) -> Option<i64> {
        Some(self.strings.phi(j, x)? - self.strings.phi(j, a)?)
    }
}

/// Every local axiom at x: P3 and P4 for each ordered pair (i, j), i != j; then, for each pair
/// i < j, P5 and P6 (and their duals) for both orders, walking each square only once.
pub(super) fn check_vertex(table: &Table<'_>, strings: &Strings, x: usize, sink: &mut Sink) {
    let l = Local { table, strings };
    for i in 1..table.n {
        let Some(a) = step(table.e[i - 1], x) else {
            continue;
        };
        // fast path on the two rows; the reporting path recomputes only where one fails
        let (rx, ra, m) = (strings.row(x), strings.row(a), table.n - 1);
        for j in (1..table.n).filter(|&j| j != i) {
            let (px, pa, ex, ea) = (rx[j - 1], ra[j - 1], rx[m + j - 1], ra[m + j - 1]);
            if px < 0 || pa < 0 || ex < 0 || ea < 0 {
                continue; // an infinite string: skipped, reported as `cycle`
            }
            let (dd, dp) = (i64::from(ex) - i64::from(ea), i64::from(pa) - i64::from(px));
            if dd + dp != cartan(i, j) || dd > 0 || dp > 0 {
                check_p3_p4(&l, (i, j), x, a, sink);
            }
        }
    }
    for i in 1..table.n {
        if let Some(a) = step(table.e[i - 1], x) {
            for j in i + 1..table.n {
                if let Some(b) = step(table.e[j - 1], x) {
                    square_up(&l, (i, j), x, (a, b), sink);
                }
            }
        }
        if let Some(a) = step(table.f[i - 1], x) {
            for j in i + 1..table.n {
                if let Some(b) = step(table.f[j - 1], x) {
                    square_down(&l, (i, j), x, (a, b), sink);
                }
            }
        }
    }
}

/// P3 and P4 at x for the pair (i, j), where a = e_i x.
fn check_p3_p4(l: &Local<'_, '_>, (i, j): (usize, usize), x: usize, a: usize, sink: &mut Sink) {
    let Some(dd) = l.delta_delta(j, x, a) else {
        return;
    };
    let Some(dp) = l
        .strings
        .phi(j, a)
        .zip(l.strings.phi(j, x))
        .map(|(p, q)| p - q)
    else {
        return;
    };
    let vs = [id(x), id(a)];
    if dd + dp != cartan(i, j) {
        sink.add(Axiom::P3, (i, j), x, &vs, || {
            format!(
                "e_{i}({x}) = {a}: Delta delta_{j} + Delta phi_{j} = {dd} + {dp}, not a_{i}{j} = {}",
                cartan(i, j)
            )
        });
    }
    if dd > 0 || dp > 0 {
        sink.add(Axiom::P4, (i, j), x, &vs, || {
            format!(
                "e_{i}({x}) = {a}: Delta delta_{j} = {dd}, Delta phi_{j} = {dp}; both must be <= 0"
            )
        });
    }
}

/// P5 for (i, j) and (j, i), and P6, at x, where a = e_i x, b = e_j x, i < j.
fn square_up(
    l: &Local<'_, '_>,
    (i, j): (usize, usize),
    x: usize,
    (a, b): (usize, usize),
    sink: &mut Sink,
) {
    let (dij, dji) = (l.delta_delta(j, x, a), l.delta_delta(i, x, b));
    if dij == Some(0) || dji == Some(0) {
        // e_j e_i x and e_i e_j x: the same square for both orders
        let (p, q) = (l.up(j, Some(a)), l.up(i, Some(b)));
        for (s, t, paths) in [(i, j, [p, q]), (j, i, [q, p])] {
            if (if s == i { dij } else { dji }) != Some(0) {
                continue;
            }
            let y = meet(sink, Axiom::P5, (s, t), x, paths, || {
                format!("e_{t} e_{s} ({x}) and e_{s} e_{t} ({x})")
            });
            // Nabla_t phi(y, s) = phi_s(y) - phi_s(f_t y)
            if let Some(nabla) = y.and_then(|y| l.nabla_phi(s, y, l.down(t, Some(y))?)) {
                if nabla != 0 {
                    sink.add(Axiom::P5, (s, t), x, &[id(x), opt_id(y)], || {
                        format!("y = e_{s} e_{t} ({x}): Nabla_{t} phi_{s}(y) = {nabla}, not 0")
                    });
                }
            }
        }
    }
    if dij == Some(-1) && dji == Some(-1) {
        let left = l.up(i, l.up(j, l.up(j, Some(a))));
        let right = l.up(j, l.up(i, l.up(i, Some(b))));
        let y = meet(sink, Axiom::P6, (i, j), x, [left, right], || {
            format!("e_{i} e_{j} e_{j} e_{i} ({x}) and e_{j} e_{i} e_{i} e_{j} ({x})")
        });
        if let Some(y) = y {
            let nij = l.down(i, Some(y)).and_then(|z| l.nabla_phi(j, y, z));
            let nji = l.down(j, Some(y)).and_then(|z| l.nabla_phi(i, y, z));
            if nij != Some(-1) || nji != Some(-1) {
                sink.add(Axiom::P6, (i, j), x, &[id(x), id(y)], || {
                    format!("y = e_{i} e_{j} e_{j} e_{i} ({x}): Nabla_{i} phi_{j}(y) = {}, Nabla_{j} phi_{i}(y) = {}; both must be -1", shown(nij), shown(nji))
                });
            }
        }
    }
}

/// P5' for (i, j) and (j, i), and P6', at x, where a = f_i x, b = f_j x, i < j.
fn square_down(
    l: &Local<'_, '_>,
    (i, j): (usize, usize),
    x: usize,
    (a, b): (usize, usize),
    sink: &mut Sink,
) {
    let (nij, nji) = (l.nabla_phi(j, x, a), l.nabla_phi(i, x, b));
    if nij == Some(0) || nji == Some(0) {
        // f_j f_i x and f_i f_j x: the same square for both orders
        let (p, q) = (l.down(j, Some(a)), l.down(i, Some(b)));
        for (s, t, paths) in [(i, j, [p, q]), (j, i, [q, p])] {
            if (if s == i { nij } else { nji }) != Some(0) {
                continue;
            }
            let y = meet(sink, Axiom::P5Dual, (s, t), x, paths, || {
                format!("f_{t} f_{s} ({x}) and f_{s} f_{t} ({x})")
            });
            // Delta_t delta(y, s) = epsilon_s(y) - epsilon_s(e_t y)
            if let Some(delta) = y.and_then(|y| l.delta_delta(s, y, l.up(t, Some(y))?)) {
                if delta != 0 {
                    sink.add(Axiom::P5Dual, (s, t), x, &[id(x), opt_id(y)], || {
                        format!("y = f_{s} f_{t} ({x}): Delta_{t} delta_{s}(y) = {delta}, not 0")
                    });
                }
            }
        }
    }
    if nij == Some(-1) && nji == Some(-1) {
        let left = l.down(i, l.down(j, l.down(j, Some(a))));
        let right = l.down(j, l.down(i, l.down(i, Some(b))));
        let y = meet(sink, Axiom::P6Dual, (i, j), x, [left, right], || {
            format!("f_{i} f_{j} f_{j} f_{i} ({x}) and f_{j} f_{i} f_{i} f_{j} ({x})")
        });
        if let Some(y) = y {
            let dij = l.up(i, Some(y)).and_then(|z| l.delta_delta(j, y, z));
            let dji = l.up(j, Some(y)).and_then(|z| l.delta_delta(i, y, z));
            if dij != Some(-1) || dji != Some(-1) {
                sink.add(Axiom::P6Dual, (i, j), x, &[id(x), id(y)], || {
                    format!("y = f_{i} f_{j} f_{j} f_{i} ({x}): Delta_{i} delta_{j}(y) = {}, Delta_{j} delta_{i}(y) = {}; both must be -1", shown(dij), shown(dji))
                });
            }
        }
    }
}
/// The common end y of two paths from x, or a witness that they do not meet (an end undefined,
/// or two different ends). `what` names the two paths.
fn meet(
    sink: &mut Sink,
    axiom: Axiom,
    pair: (usize, usize),
    x: usize,
    [p, q]: [Option<usize>; 2],
    what: impl FnOnce() -> String,
) -> Option<usize> {
    if p.is_some() && p == q {
        return p;
    }
    sink.add(axiom, pair, x, &[id(x), opt_id(p), opt_id(q)], || {
        let shown = |v: Option<usize>| v.map_or("undefined".to_string(), |v| v.to_string());
        format!(
            "{} must be one vertex; they are {} and {}",
            what(),
            shown(p),
            shown(q)
        )
    });
    None
}

/// A difference of string lengths, or why there is none.
fn shown(d: Option<i64>) -> String {
    d.map_or("undefined".to_string(), |d| d.to_string())
}
