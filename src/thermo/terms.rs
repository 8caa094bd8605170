//! The terms of a group-additivity sum: groups, corrections and ring corrections, each with
//! its count, values, source and typed notes, and the sum of a property over them.

use std::fmt;

use super::flags::{Flag, Property};
use super::quantity::Quantity;
use crate::groups::table::ThermoIncrement;
use crate::groups::GroupKey;

/// What a term of the sum is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum TermKind {
    /// A Benson group.
    Group,
    /// A non-ring correction (gauche, cis, ...).
    Correction,
    /// A ring correction.
    Ring,
}

impl fmt::Display for TermKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            TermKind::Group => "group",
            TermKind::Correction => "correction",
            TermKind::Ring => "ring",
        })
    }
}

/// A remark on one term.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum TermNote {
    /// The table takes this group equal to another by convention (`same_as`).
    TakenEqual {
        /// The group whose values it carries.
        group: GroupKey,
    },
    /// The entry is missing; the named one stands in (uncertainty widened).
    StandIn {
        /// The group or correction used in its place.
        entry: String,
    },
    /// A ring correction used as a stand-in for a ring system the tables lack.
    RingStandIn,
    /// The ring entry's entropy moved from its parent's real symmetry number to the
    /// flat-graph convention.
    EntropyShift {
        /// The shift, J/(mol K).
        shift_j: f64,
        /// The parent's symmetry number the entry was given with.
        parent_sigma: u64,
    },
}

impl fmt::Display for TermNote {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            TermNote::TakenEqual { group } => write!(f, "taken equal to {group}"),
            TermNote::StandIn { entry } => write!(f, "stand-in: {entry}"),
            TermNote::RingStandIn => f.write_str("fallback stand-in"),
            TermNote::EntropyShift {
                shift_j,
                parent_sigma,
            } => write!(
                f,
                "entropy moved by {shift_j:+.2} J/(mol K) from the parent's sigma \
                 {parent_sigma} to the flat-graph convention"
            ),
        }
    }
}

/// One line of the explain view: a table entry, how often it counts, and where it comes from.
#[derive(Debug, Clone, serde::Serialize)]
pub struct Term {
    /// Group, correction or ring.
    pub kind: TermKind,
    /// Group key, correction name or ring name.
    pub label: String,
    /// Occurrences.
    pub count: u32,
    /// Values per occurrence (SI).
    pub per_unit: ThermoIncrement,
    /// Source of the values.
    pub source: String,
    /// Stand-in and other remarks, in the order they apply.
    pub notes: Vec<TermNote>,
}

impl Term {
    /// The stand-in note of a group or correction term, if it is a stand-in.
    pub fn stand_in(&self) -> Option<&TermNote> {
        self.notes
            .iter()
            .find(|n| matches!(n, TermNote::StandIn { .. }))
    }

    /// True for a ring correction that stands in for a ring system the tables lack.
    pub fn is_ring_stand_in(&self) -> bool {
        self.kind == TermKind::Ring && self.notes.contains(&TermNote::RingStandIn)
    }

    /// The notes as one text, `"; "` between them (`None` without notes).
    pub fn notes_text(&self) -> Option<String> {
        (!self.notes.is_empty()).then(|| {
            self.notes
                .iter()
                .map(ToString::to_string)
                .collect::<Vec<_>>()
                .join("; ")
        })
    }

    /// Whether the term's table entry gives `property`.
    pub fn gives(&self, property: Property) -> bool {
        let known = &self.per_unit.known;
        match property {
            Property::Hf298 => known.hf,
            Property::S298 => known.s,
            Property::Cp => known.cp,
        }
    }
}

/// The terms one step of an estimate adds, with the flags it raises.
#[derive(Debug, Clone, Default)]
pub struct StepTerms {
    /// The terms.
    pub terms: Vec<Term>,
    /// The flags.
    pub flags: Vec<Flag>,
}

impl StepTerms {
    /// Appends another step's terms and flags.
    pub fn extend(&mut self, other: StepTerms) {
        self.terms.extend(other.terms);
        self.flags.extend(other.flags);
    }
}

/// A property summed over terms, with its uncertainty; `missing` once a term lacks it.
#[derive(Default, Clone, Copy)]
pub(crate) struct Sum {
    value: f64,
    variance: f64,
    missing: bool,
}

impl Sum {
    /// Adds `count` occurrences of a term's `value` with uncertainty `unc`.
    pub fn add(&mut self, value: f64, unc: f64, count: f64, known: bool) {
        if !known || !value.is_finite() {
            self.missing = true;
            return;
        }
        self.value += count * value;
        // Same entry counted n times: errors add linearly within, in quadrature across entries.
        self.variance += (count * unc).powi(2);
    }

    /// The sum, unless a term lacked the property.
    pub fn quantity(&self) -> Option<Quantity> {
        (!self.missing).then(|| Quantity::new(self.value, self.variance.sqrt()))
    }
}

/// Hf298 over `terms`; without the ring terms too (Benson's strain-free sum).
pub(crate) fn hf298_sums(terms: &[Term]) -> (Sum, Sum) {
    let mut hf = Sum::default();
    let mut hf_free = Sum::default();
    for t in terms {
        let v = &t.per_unit;
        let n = f64::from(t.count);
        hf.add(v.hf_kj, v.unc_hf_kj, n, v.known.hf);
        if t.kind != TermKind::Ring {
            hf_free.add(v.hf_kj, v.unc_hf_kj, n, v.known.hf);
        }
    }
    (hf, hf_free)
}

/// S298 (intrinsic, without the symmetry term) and Cp at the table temperatures over `terms`.
pub(crate) fn s298_cp_sums(terms: &[Term]) -> (Sum, [Sum; 7]) {
    let mut s = Sum::default();
    let mut cp = [Sum::default(); 7];
    for t in terms {
        let v = &t.per_unit;
        let n = f64::from(t.count);
        s.add(v.s_j, v.unc_s_j, n, v.known.s);
        for (k, c) in cp.iter_mut().enumerate() {
            c.add(v.cp_j[k], v.unc_cp_j, n, v.known.cp);
        }
    }
    (s, cp)
}
