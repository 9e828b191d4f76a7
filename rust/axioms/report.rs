//! Witnesses of violated axioms, and the sink that counts them and keeps the first few.
#![deny(unsafe_code)]

/// The axioms, in the order they are reported at one vertex.
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Axiom {
    Inverse,
    Injective,
    Cycle,
    Weight,
    StringLength,
    Seminormal,
    P3,
    P4,
    P5,
    P6,
    P5Dual,
    P6Dual,
}

impl Axiom {
    pub const ALL: [Axiom; 12] = [
        Axiom::Inverse,
        Axiom::Injective,
        Axiom::Cycle,
        Axiom::Weight,
        Axiom::StringLength,
        Axiom::Seminormal,
        Axiom::P3,
        Axiom::P4,
        Axiom::P5,
        Axiom::P6,
        Axiom::P5Dual,
        Axiom::P6Dual,
    ];

    /// The name users read (the module docs define each).
    pub fn name(self) -> &'static str {
        match self {
            Axiom::Inverse => "inverse",
            Axiom::Injective => "injective",
            Axiom::Cycle => "cycle",
            Axiom::Weight => "weight",
            Axiom::StringLength => "string_length",
            Axiom::Seminormal => "seminormal",
            Axiom::P3 => "P3",
            Axiom::P4 => "P4",
            Axiom::P5 => "P5",
            Axiom::P6 => "P6",
            Axiom::P5Dual => "P5'",
            Axiom::P6Dual => "P6'",
        }
    }

    /// True for Stembridge's local axioms (checked only when asked).
    pub fn is_stembridge(self) -> bool {
        self >= Axiom::P3
    }
}

/// One violation: the axiom, i and j (j = 0 when only one index is involved), the vertices
/// involved (-1 where an operator was undefined) and a short description.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Witness {
    pub axiom: Axiom,
    pub i: usize,
    pub j: usize,
    pub vertices: Vec<i64>,
    pub detail: String,
    /// The vertex the witness is sorted by (the vertex checked, or a cycle's smallest vertex).
    pub at: usize,
}

/// Total violations per axiom (indexed like `Axiom::ALL`) and the first witnesses.
#[derive(Clone, Debug, Default)]
pub struct Report {
    pub counts: Vec<u64>,
    pub witnesses: Vec<Witness>,
}

/// Counts every violation, keeps at most `cap` witnesses.
pub(super) struct Sink {
    cap: usize,
    counts: [u64; 12],
    witnesses: Vec<Witness>,
}

impl Sink {
    pub(super) fn new(cap: usize) -> Self {
        Sink {
            cap,
            counts: [0; 12],
            witnesses: Vec::new(),
        }
    }

    /// Records a violation; the detail is only formatted if the witness is kept.
    pub(super) fn add(
        &mut self,
        axiom: Axiom,
        (i, j): (usize, usize),
        at: usize,
        vertices: &[i64],
        detail: impl FnOnce() -> String,
    ) {
        self.counts[axiom as usize] += 1;
        if self.witnesses.len() < self.cap {
            self.witnesses.push(Witness {
                axiom,
                i,
                j,
                vertices: vertices.to_vec(),
                detail: detail(),
                at,
            });
        }
    }

    /// Adds another sink's counts and witnesses (the caller keeps blocks in vertex order).
    pub(super) fn absorb(&mut self, other: Sink) {
        for (a, b) in self.counts.iter_mut().zip(other.counts) {
            *a += b;
        }
        self.witnesses.extend(other.witnesses);
    }

    /// Sorts the witnesses by vertex (stable: at one vertex, in the order the checks ran) and
    /// keeps the first `cap`. Each part kept its own first `cap` in that order, so the result is
    /// the first `cap` overall.
    pub(super) fn finish(mut self) -> Report {
        self.witnesses.sort_by_key(|w| w.at);
        self.witnesses.truncate(self.cap);
        Report {
            counts: self.counts.to_vec(),
            witnesses: self.witnesses,
        }
    }
}
