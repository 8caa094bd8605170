//! Group-additivity estimate of one molecule: groups + corrections + ring corrections + symmetry.

use petgraph::graph::NodeIndex;

use super::quantity::{Quantity, GAS_CONSTANT};
use crate::groups::assign::{assign_groups, stand_in_candidates};
use crate::groups::interactions::count_interactions;
use crate::groups::ring_corrections::{RingCorrectionIndex, RingMatch, RingPatternError};
use crate::groups::table::{GroupTables, TableError, ThermoIncrement, CP_TEMPERATURES_K};
use crate::groups::GroupKey;
use crate::molecule::symmetry::symmetry_number;
use crate::molecule::PerceivedMolecule;

/// Extra uncertainty added to a group that stands in for a missing one: our choice, about the
/// spread between neighbouring groups of one family (kJ/mol and J/(mol K)).
const STAND_IN_EXTRA_UNC: (f64, f64, f64) = (4.0, 4.0, 2.0);
/// Extra uncertainty of a ring correction built from stand-ins: our choice (kJ/mol,
/// J/(mol K), J/(mol K)); ring strain does not add up exactly over fused rings.
const RING_FALLBACK_EXTRA_UNC: (f64, f64, f64) = (8.0, 8.0, 4.0);

/// The symmetry used for the entropy term -R ln(sigma) + R ln(n).
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct SymmetryUsed {
    /// Total symmetry number sigma (external x internal).
    pub total: u64,
    /// External (rigid-rotation) part.
    pub external: u64,
    /// Internal-rotor part.
    pub internal: u64,
    /// Number of optical isomers n.
    pub optical_isomers: u8,
    /// Conventions and assumptions.
    pub notes: Vec<String>,
}

fn graph_symmetry(p: &PerceivedMolecule) -> SymmetryUsed {
    let info = symmetry_number(&p.mol);
    SymmetryUsed {
        total: info.total,
        external: info.external,
        internal: info.internal,
        optical_isomers: info.optical_isomers,
        notes: info.notes,
    }
}

/// What a term of the sum is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub enum TermKind {
    /// A Benson group.
    Group,
    /// A non-ring correction (gauche, cis, ...).
    Correction,
    /// A ring correction.
    Ring,
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
    /// Stand-in or other remark, if any.
    pub note: Option<String>,
}

/// Options of an estimate.
#[derive(Debug, Clone, Copy, Default)]
pub struct EstimateOptions {
    /// Symmetry number and optical-isomer count given by the user instead of the graph's.
    pub symmetry_override: Option<(u64, u8)>,
    /// No stand-ins: a missing group or ring system is an error (used to derive table values).
    pub strict: bool,
}

/// Why a molecule could not be estimated.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum EstimateError {
    /// An atom has no Benson type.
    #[error("atom {atom} ({element}, column {}): {reason}", .column + 1)]
    Untyped {
        /// 1-based atom number.
        atom: usize,
        /// Element symbol.
        element: String,
        /// 0-based byte column in the input SMILES (printed 1-based).
        column: usize,
        /// Why.
        reason: String,
    },
    /// Groups missing from the tables, with no stand-in either.
    #[error("groups not in the tables: {}", describe_missing(.0))]
    MissingGroups(Vec<MissingGroup>),
    /// Corrections missing from the tables (strict mode only: otherwise stand-ins apply).
    #[error("corrections not in the tables: {}", .0.iter().map(|(n, c)| format!("{c} x {n}")).collect::<Vec<_>>().join(", "))]
    MissingCorrections(Vec<(String, u32)>),
    /// Ring systems missing from the ring tables (strict mode only: otherwise stand-ins apply).
    #[error("{0} ring system(s) not in the ring tables (strict mode: no stand-ins)")]
    MissingRings(usize),
    /// No atoms, or several disconnected molecules.
    #[error("{0}")]
    NotOneMolecule(String),
}

/// A group the tables lack, how often it occurs, and the first atom that is its centre.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct MissingGroup {
    /// The group.
    pub key: GroupKey,
    /// Occurrences in the molecule.
    pub count: u32,
    /// 1-based number of the first centre atom.
    pub atom: usize,
}

fn describe_missing(missing: &[MissingGroup]) -> String {
    missing
        .iter()
        .map(|m| format!("{} (atom {})", m.key, m.atom))
        .collect::<Vec<_>>()
        .join(", ")
}

/// Problems setting up the estimator from tables.
#[derive(Debug, thiserror::Error)]
pub enum SetupError {
    /// A table could not be loaded.
    #[error(transparent)]
    Table(#[from] TableError),
    /// A ring entry's SMILES is not a usable pattern.
    #[error(transparent)]
    RingPattern(#[from] RingPatternError),
}

/// The group-additivity estimate of one molecule.
#[derive(Debug, Clone, serde::Serialize)]
pub struct ThermoEstimate {
    /// Every group, correction and ring term with its count.
    pub terms: Vec<Term>,
    /// Visible warnings: stand-ins, assumptions, missing properties.
    pub flags: Vec<String>,
    /// Symmetry number and optical isomers used for the entropy.
    pub symmetry: SymmetryUsed,
    /// Whether the symmetry came from the user.
    pub symmetry_overridden: bool,
    /// Hf298, kJ/mol.
    pub hf298_kj: Quantity,
    /// Hf298 without ring corrections (Benson's strain-free sum), kJ/mol.
    pub strain_free_hf298_kj: Quantity,
    /// S298, J/(mol K), if every term gives an entropy.
    pub s298_j: Option<Quantity>,
    /// Cp at [`CP_TEMPERATURES_K`], J/(mol K), if every term gives one.
    pub cp_j: Option<[Quantity; 7]>,
}

/// A summed property with its uncertainty.
#[derive(Default, Clone, Copy)]
struct Sum {
    value: f64,
    variance: f64,
    missing: bool,
}

impl Sum {
    fn add(&mut self, value: f64, unc: f64, count: f64, known: bool) {
        if !known || !value.is_finite() {
            self.missing = true;
            return;
        }
        self.value += count * value;
        // Same entry counted n times: errors add linearly within, in quadrature across entries.
        self.variance += (count * unc).powi(2);
    }
    fn quantity(&self) -> Option<Quantity> {
        (!self.missing).then(|| Quantity::new(self.value, self.variance.sqrt()))
    }
}

/// Tables plus the ring-correction index: everything needed to estimate molecules.
#[derive(Debug, Clone)]
pub struct GroupAdditivity {
    /// The group, correction and ring tables.
    pub tables: GroupTables,
    /// Ring entries prepared for matching.
    pub ring_index: RingCorrectionIndex,
}

fn inflate(mut v: ThermoIncrement, extra: (f64, f64, f64)) -> ThermoIncrement {
    v.unc_hf_kj = v.unc_hf_kj.hypot(extra.0);
    v.unc_s_j = v.unc_s_j.hypot(extra.1);
    v.unc_cp_j = v.unc_cp_j.hypot(extra.2);
    v
}

impl GroupAdditivity {
    /// Uses the given tables.
    pub fn new(tables: GroupTables) -> Result<GroupAdditivity, SetupError> {
        let ring_index = RingCorrectionIndex::new(&tables)?;
        Ok(GroupAdditivity { tables, ring_index })
    }

    /// The bundled tables of the repository's group-tables/ directory.
    pub fn bundled() -> Result<GroupAdditivity, SetupError> {
        GroupAdditivity::new(GroupTables::bundled()?)
    }

    /// Estimates Hf298, S298 and Cp(T) of one molecule.
    pub fn estimate(
        &self,
        p: &PerceivedMolecule,
        options: &EstimateOptions,
    ) -> Result<ThermoEstimate, EstimateError> {
        if p.mol.atom_count() == 0 {
            return Err(EstimateError::NotOneMolecule("no atoms".into()));
        }
        if p.mol.component_count() > 1 {
            return Err(EstimateError::NotOneMolecule(
                "several disconnected molecules: estimate each on its own".into(),
            ));
        }
        let assignment = assign_groups(p).map_err(|u| {
            let atom = p.mol.atom(u.atom);
            EstimateError::Untyped {
                atom: u.atom.index() + 1,
                element: atom.element.to_string(),
                column: atom.column,
                reason: u.reason,
            }
        })?;
        let mut terms: Vec<Term> = Vec::new();
        let mut flags: Vec<String> = Vec::new();
        let mut missing: Vec<MissingGroup> = Vec::new();

        // Groups, counted by key in first-seen order.
        let mut counted: Vec<(GroupKey, u32, NodeIndex)> = Vec::new();
        for g in &assignment.groups {
            match counted.iter_mut().find(|(k, _, _)| *k == g.key) {
                Some((_, n, _)) => *n += 1,
                None => counted.push((g.key.clone(), 1, g.atom)),
            }
        }
        if counted.is_empty() {
            return Err(EstimateError::NotOneMolecule(
                "no group centre (only hydrogens and halogens)".into(),
            ));
        }
        for (key, count, atom) in counted {
            let found = self.tables.group(&key).filter(|e| e.values.known.hf);
            if let Some(entry) = found {
                terms.push(Term {
                    kind: TermKind::Group,
                    label: key.to_string(),
                    count,
                    per_unit: entry.values,
                    source: entry.source.clone(),
                    note: entry
                        .same_as
                        .as_ref()
                        .map(|s| format!("taken equal to {s}")),
                });
                continue;
            }
            let stand_in = stand_in_candidates(&key)
                .into_iter()
                .filter(|_| !options.strict)
                .find_map(|k| {
                    self.tables
                        .group(&k)
                        .filter(|e| e.values.known.hf)
                        .map(|e| (k, e))
                });
            match stand_in {
                Some((k, entry)) => {
                    flags.push(format!(
                        "group {key} is not in the tables; {k} stands in (uncertainty widened)"
                    ));
                    terms.push(Term {
                        kind: TermKind::Group,
                        label: key.to_string(),
                        count,
                        per_unit: inflate(entry.values, STAND_IN_EXTRA_UNC),
                        source: entry.source.clone(),
                        note: Some(format!("stand-in: {k}")),
                    });
                }
                None => missing.push(MissingGroup {
                    key,
                    count,
                    atom: atom.index() + 1,
                }),
            }
        }
        if !missing.is_empty() {
            return Err(EstimateError::MissingGroups(missing));
        }

        // Non-ring corrections.
        let interactions = count_interactions(p, &assignment.types);
        flags.extend(interactions.notes);
        let mut missing_corrections: Vec<(String, u32)> = Vec::new();
        for c in interactions.counts {
            let exact = self.tables.correction(&c.name);
            let stand_in = c
                .fallback
                .filter(|_| !options.strict)
                .and_then(|f| self.tables.correction(f));
            match (exact, stand_in) {
                (Some(entry), _) => terms.push(Term {
                    kind: TermKind::Correction,
                    label: c.name.clone(),
                    count: c.count,
                    per_unit: entry.values,
                    source: entry.source.clone(),
                    note: None,
                }),
                (None, Some(entry)) => {
                    flags.push(format!(
                        "correction {} is not in the tables; {} stands in",
                        c.name, entry.name
                    ));
                    terms.push(Term {
                        kind: TermKind::Correction,
                        label: c.name.clone(),
                        count: c.count,
                        per_unit: inflate(entry.values, STAND_IN_EXTRA_UNC),
                        source: entry.source.clone(),
                        note: Some(format!("stand-in: {}", entry.name)),
                    });
                }
                (None, None) if options.strict => missing_corrections.push((c.name, c.count)),
                (None, None) => flags.push(format!(
                    "{} x {} counted, but the tables have no `{}` correction: not applied",
                    c.count, c.name, c.name
                )),
            }
        }
        if !missing_corrections.is_empty() {
            return Err(EstimateError::MissingCorrections(missing_corrections));
        }

        // Ring corrections.
        let entries = self.tables.rings();
        let applied_rings = self.ring_index.apply(p, &self.tables);
        if options.strict {
            let unmatched = applied_rings
                .iter()
                .filter(|a| a.how != RingMatch::Exact)
                .count();
            if unmatched > 0 {
                return Err(EstimateError::MissingRings(unmatched));
            }
        }
        for applied in applied_rings {
            let (note, extra) = match &applied.how {
                RingMatch::Exact => (None, None),
                RingMatch::Fallback(text) => {
                    flags.push(text.clone());
                    (
                        Some("fallback stand-in".to_string()),
                        Some(RING_FALLBACK_EXTRA_UNC),
                    )
                }
            };
            if applied.entries.is_empty() {
                continue;
            }
            for &i in &applied.entries {
                let entry = &entries[i];
                let mut values = match extra {
                    Some(x) => inflate(entry.values, x),
                    None => entry.values,
                };
                let shift = self.ring_index.entropy_shift_j(i);
                values.s_j += shift;
                let note = match (&note, shift.abs() > 1e-9, entry.parent_symmetry) {
                    (n, true, Some(sigma)) => Some(
                        n.iter()
                            .cloned()
                            .chain(std::iter::once(format!(
                                "entropy moved by {shift:+.2} J/(mol K) from the parent's \
                                 sigma {sigma} to the flat-graph convention"
                            )))
                            .collect::<Vec<_>>()
                            .join("; "),
                    ),
                    (n, _, _) => n.clone(),
                };
                match terms
                    .iter_mut()
                    .find(|t| t.kind == TermKind::Ring && t.label == entry.name && t.note == note)
                {
                    Some(t) => t.count += 1,
                    None => terms.push(Term {
                        kind: TermKind::Ring,
                        label: entry.name.clone(),
                        count: 1,
                        per_unit: values,
                        source: entry.source.clone(),
                        note: note.clone(),
                    }),
                }
            }
        }

        // Sums.
        let mut hf = Sum::default();
        let mut hf_free = Sum::default();
        let mut s = Sum::default();
        let mut cp = [Sum::default(); 7];
        for t in &terms {
            let v = &t.per_unit;
            let n = t.count as f64;
            hf.add(v.hf_kj, v.unc_hf_kj, n, v.known.hf);
            if t.kind != TermKind::Ring {
                hf_free.add(v.hf_kj, v.unc_hf_kj, n, v.known.hf);
            }
            s.add(v.s_j, v.unc_s_j, n, v.known.s);
            for (k, c) in cp.iter_mut().enumerate() {
                c.add(v.cp_j[k], v.unc_cp_j, n, v.known.cp);
            }
        }
        let (symmetry, overridden) = match options.symmetry_override {
            // The user's value replaces the graph's; the graph is not searched at all.
            Some((sigma, n)) => (
                SymmetryUsed {
                    total: sigma.max(1),
                    external: sigma.max(1),
                    internal: 1,
                    optical_isomers: n.max(1),
                    notes: vec!["symmetry number and optical isomers given by the user".into()],
                },
                true,
            ),
            None => (graph_symmetry(p), false),
        };
        let s298 = s.quantity().map(|q| {
            let sym = -GAS_CONSTANT * (symmetry.total.max(1) as f64).ln()
                + GAS_CONSTANT * (symmetry.optical_isomers.max(1) as f64).ln();
            Quantity::new(q.value + sym, q.uncertainty)
        });
        let lacking = |has: fn(&ThermoIncrement) -> bool| -> String {
            terms
                .iter()
                .filter(|t| !has(&t.per_unit))
                .map(|t| t.label.clone())
                .collect::<Vec<_>>()
                .join(", ")
        };
        if s298.is_none() {
            flags.push(format!(
                "no entropy in the tables for {}: S298 not estimated",
                lacking(|v| v.known.s)
            ));
        }
        let cp_j = if cp.iter().any(|c| c.missing) {
            flags.push(format!(
                "no heat capacity in the tables for {}: Cp(T) not estimated",
                lacking(|v| v.known.cp)
            ));
            None
        } else {
            let mut out = [Quantity::new(0.0, 0.0); 7];
            for (o, c) in out.iter_mut().zip(cp.iter()) {
                *o = Quantity::new(c.value, c.variance.sqrt());
            }
            Some(out)
        };
        let hf298 = hf.quantity().unwrap_or(Quantity::new(f64::NAN, f64::NAN));
        let strain_free = hf_free
            .quantity()
            .unwrap_or(Quantity::new(f64::NAN, f64::NAN));
        Ok(ThermoEstimate {
            terms,
            flags,
            symmetry,
            symmetry_overridden: overridden,
            hf298_kj: hf298,
            strain_free_hf298_kj: strain_free,
            s298_j: s298,
            cp_j,
        })
    }
}

/// The heat-capacity temperatures, K (re-exported for reports).
pub const CP_TEMPERATURES: [f64; 7] = CP_TEMPERATURES_K;
