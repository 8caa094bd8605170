//! Group-additivity estimate of one molecule: groups + corrections + ring corrections + symmetry.
//!
//! [`GroupAdditivity::estimate`] runs the steps in order, each returning its terms and flags
//! ([`StepTerms`]): [`GroupAdditivity::group_terms`], [`GroupAdditivity::correction_terms`],
//! [`GroupAdditivity::ring_terms`]; then the symmetry and the sums. A missing property is
//! `None` with a [`Flag::PropertyNotEstimated`] saying which terms lack it.

use petgraph::graph::NodeIndex;

use super::domain::{out_of_domain, OutOfDomain};
use super::flags::{Flag, Property};
use super::quantity::Quantity;
use super::terms::{hf298_sums, s298_cp_sums};
pub use super::terms::{StepTerms, Term, TermKind, TermNote};
use super::uncertainty::method_variance;
use crate::groups::assign::{assign_groups, stand_in_candidates, GroupAssignment};
use crate::groups::interactions::{
    count_interactions, trans_ring_correction, trans_ring_double_bonds,
};
use crate::groups::ring_corrections::{RingCorrectionIndex, RingMatch, RingPatternError};
use crate::groups::table::{GroupTables, TableError, ThermoIncrement, CP_TEMPERATURES_K};
use crate::groups::GroupKey;
use crate::molecule::symmetry::{symmetry_number, SymmetryOverride, SymmetryOverrideError};
use crate::molecule::PerceivedMolecule;
use crate::units::GAS_CONSTANT_J_PER_MOL_K;

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

/// Options of an estimate.
#[derive(Debug, Clone, Copy, Default)]
pub struct EstimateOptions {
    /// Symmetry number and optical-isomer count given by the user instead of the graph's.
    pub symmetry_override: Option<SymmetryOverride>,
    /// No stand-ins: a missing group or ring system is an error (used to derive table values).
    pub strict: bool,
    /// Estimate molecules outside the domain of group additivity (fullerenes, antiaromatic
    /// rings; see [`super::domain`]) instead of refusing them; each finding is then a flag.
    pub allow_out_of_domain: bool,
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
    /// A double bond written trans in a ring too small to hold one.
    #[error(
        "trans double bond between atoms {} and {} in a ring of {ring_size} atoms: no such \
         molecule (a ring of fewer than 7 atoms cannot hold a trans double bond)",
        .atoms[0], .atoms[1]
    )]
    ImpossibleTransRing {
        /// 1-based input numbers of the double-bond atoms.
        atoms: [usize; 2],
        /// Size of the smallest ring holding the bond.
        ring_size: usize,
    },
    /// A trans double bond in a 7- or 8-membered ring whose extra strain the tables lack.
    #[error(
        "trans double bond between atoms {} and {} in a ring of {ring_size} atoms: the tables \
         have no `{correction}` correction for its extra strain, so no estimate is given",
        .atoms[0], .atoms[1]
    )]
    TransRingNotCovered {
        /// 1-based input numbers of the double-bond atoms.
        atoms: [usize; 2],
        /// Size of the smallest ring holding the bond.
        ring_size: usize,
        /// The correction that would price it.
        correction: String,
    },
    /// The user's symmetry number cannot be this molecule's.
    #[error("symmetry override: {0}")]
    SymmetryOverride(#[from] SymmetryOverrideError),
    /// The structure is outside the domain of group additivity (see [`super::domain`]).
    #[error("outside the domain of group additivity, not estimated: {}", .0.iter().map(ToString::to_string).collect::<Vec<_>>().join("; "))]
    OutOfDomain(Vec<OutOfDomain>),
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
    pub flags: Vec<Flag>,
    /// Symmetry number and optical isomers used for the entropy.
    pub symmetry: SymmetryUsed,
    /// Whether the symmetry came from the user.
    pub symmetry_overridden: bool,
    /// Hf298, kJ/mol, if every term gives one.
    pub hf298_kj: Option<Quantity>,
    /// Hf298 without ring corrections (Benson's strain-free sum), kJ/mol, if every term gives one.
    pub strain_free_hf298_kj: Option<Quantity>,
    /// S298, J/(mol K), if every term gives an entropy.
    pub s298_j: Option<Quantity>,
    /// Cp at [`CP_TEMPERATURES_K`], J/(mol K), if every term gives one.
    pub cp_j: Option<[Quantity; 7]>,
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

    /// Estimates Hf298, S298 and Cp(T) of one molecule: the steps below in order, then the sums.
    pub fn estimate(
        &self,
        p: &PerceivedMolecule,
        options: &EstimateOptions,
    ) -> Result<ThermoEstimate, EstimateError> {
        check_one_molecule(p)?;
        self.check_trans_rings(p)?;
        let domain = domain_step(p, options)?;
        let assignment = assign(p)?;
        let mut steps = self.group_terms(p, &assignment, options)?;
        steps.extend(self.correction_terms(p, &assignment, options)?);
        steps.extend(self.ring_terms(p, options)?);
        steps.extend(domain);
        let (symmetry, overridden) = symmetry_used(p, options)?;
        Ok(total(steps, symmetry, overridden))
    }

    /// Step 1: one term per distinct Benson group (first-seen order), with stand-ins for
    /// groups the tables lack (unless strict). Groups with neither are an error naming them.
    pub fn group_terms(
        &self,
        p: &PerceivedMolecule,
        assignment: &GroupAssignment,
        options: &EstimateOptions,
    ) -> Result<StepTerms, EstimateError> {
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
        let mut out = StepTerms::default();
        let mut missing: Vec<MissingGroup> = Vec::new();
        for (key, count, atom) in counted {
            let with_hf = |k: &GroupKey| self.tables.group(k).filter(|e| e.values.known.hf);
            if let Some(entry) = with_hf(&key) {
                out.terms.push(Term {
                    kind: TermKind::Group,
                    label: key.to_string(),
                    count,
                    per_unit: entry.values,
                    source: entry.source.clone(),
                    notes: entry
                        .same_as
                        .iter()
                        .map(|g| TermNote::TakenEqual { group: g.clone() })
                        .collect(),
                });
                continue;
            }
            let stand_in = stand_in_candidates(&key)
                .into_iter()
                .filter(|_| !options.strict)
                .find_map(|k| with_hf(&k).map(|e| (k, e)));
            match stand_in {
                Some((k, entry)) => {
                    out.terms.push(Term {
                        kind: TermKind::Group,
                        label: key.to_string(),
                        count,
                        per_unit: inflate(entry.values, STAND_IN_EXTRA_UNC),
                        source: entry.source.clone(),
                        notes: vec![TermNote::StandIn {
                            entry: k.to_string(),
                        }],
                    });
                    out.flags.push(Flag::GroupStandIn {
                        group: key,
                        stand_in: k,
                    });
                }
                None => missing.push(MissingGroup {
                    key,
                    count,
                    atom: p.input_atom_number(atom),
                }),
            }
        }
        if missing.is_empty() {
            Ok(out)
        } else {
            Err(EstimateError::MissingGroups(missing))
        }
    }

    /// Step 2: the non-ring corrections (gauche, cis, ortho, ...) counted on the molecule,
    /// with stand-ins (unless strict) and the assumptions made while counting.
    pub fn correction_terms(
        &self,
        p: &PerceivedMolecule,
        assignment: &GroupAssignment,
        options: &EstimateOptions,
    ) -> Result<StepTerms, EstimateError> {
        let interactions = count_interactions(p, &assignment.types);
        let mut out = StepTerms::default();
        out.flags
            .extend(interactions.notes.into_iter().map(Flag::Interaction));
        let mut missing: Vec<(String, u32)> = Vec::new();
        for c in interactions.counts {
            let exact = self.tables.correction(&c.name);
            let stand_in = c
                .fallback
                .filter(|_| !options.strict)
                .and_then(|f| self.tables.correction(f));
            match (exact, stand_in) {
                (Some(entry), _) => out.terms.push(Term {
                    kind: TermKind::Correction,
                    label: c.name,
                    count: c.count,
                    per_unit: entry.values,
                    source: entry.source.clone(),
                    notes: Vec::new(),
                }),
                (None, Some(entry)) => {
                    out.flags.push(Flag::CorrectionStandIn {
                        correction: c.name.clone(),
                        stand_in: entry.name.clone(),
                    });
                    out.terms.push(Term {
                        kind: TermKind::Correction,
                        label: c.name,
                        count: c.count,
                        per_unit: inflate(entry.values, STAND_IN_EXTRA_UNC),
                        source: entry.source.clone(),
                        notes: vec![TermNote::StandIn {
                            entry: entry.name.clone(),
                        }],
                    });
                }
                (None, None) if options.strict => missing.push((c.name, c.count)),
                (None, None) => out.flags.push(Flag::CorrectionNotApplied {
                    correction: c.name,
                    count: c.count,
                }),
            }
        }
        if missing.is_empty() {
            Ok(out)
        } else {
            Err(EstimateError::MissingCorrections(missing))
        }
    }

    /// Step 3: one ring correction per ring system that needs one (or the stand-ins of its
    /// rings, flagged and widened), entropies moved to the flat-graph symmetry convention.
    pub fn ring_terms(
        &self,
        p: &PerceivedMolecule,
        options: &EstimateOptions,
    ) -> Result<StepTerms, EstimateError> {
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
        let mut out = StepTerms::default();
        for applied in applied_rings {
            let stand_in = match applied.how {
                RingMatch::Exact => false,
                RingMatch::Fallback(what) => {
                    out.flags.push(Flag::RingStandIn(what));
                    true
                }
            };
            for &i in &applied.entries {
                let entry = &entries[i];
                let mut values = if stand_in {
                    inflate(entry.values, RING_FALLBACK_EXTRA_UNC)
                } else {
                    entry.values
                };
                // The shift puts the parent's real-symmetry entropy on the flat-graph
                // convention; a user's sigma is a real symmetry number, so it takes none.
                let shift_j = if options.symmetry_override.is_some() {
                    0.0
                } else {
                    self.ring_index.entropy_shift_j(i)
                };
                values.s_j += shift_j;
                let mut notes = Vec::new();
                if stand_in {
                    notes.push(TermNote::RingStandIn);
                }
                if let (true, Some(parent_sigma)) = (shift_j.abs() > 1e-9, entry.parent_symmetry) {
                    notes.push(TermNote::EntropyShift {
                        shift_j,
                        parent_sigma,
                    });
                }
                let same = |t: &&mut Term| {
                    t.kind == TermKind::Ring && t.label == entry.name && t.notes == notes
                };
                match out.terms.iter_mut().find(same) {
                    Some(t) => t.count += 1,
                    None => out.terms.push(Term {
                        kind: TermKind::Ring,
                        label: entry.name.clone(),
                        count: 1,
                        per_unit: values,
                        source: entry.source.clone(),
                        notes,
                    }),
                }
            }
        }
        Ok(out)
    }
}

impl GroupAdditivity {
    /// Refuses trans double bonds in rings of fewer than 7 atoms (impossible) and in rings of 7
    /// or 8 atoms whose correction the tables lack (the cis ring's correction would understate
    /// the strain by several kcal/mol).
    fn check_trans_rings(&self, p: &PerceivedMolecule) -> Result<(), EstimateError> {
        for t in trans_ring_double_bonds(p) {
            if t.ring_size < 7 {
                return Err(EstimateError::ImpossibleTransRing {
                    atoms: t.atoms,
                    ring_size: t.ring_size,
                });
            }
            let correction = trans_ring_correction(t.ring_size);
            if t.ring_size <= 8 && self.tables.correction(&correction).is_none() {
                return Err(EstimateError::TransRingNotCovered {
                    atoms: t.atoms,
                    ring_size: t.ring_size,
                    correction,
                });
            }
        }
        Ok(())
    }
}

/// Refuses an empty input and several disconnected molecules.
fn check_one_molecule(p: &PerceivedMolecule) -> Result<(), EstimateError> {
    if p.mol.atom_count() == 0 {
        return Err(EstimateError::NotOneMolecule("no atoms".into()));
    }
    if p.mol.component_count() > 1 {
        return Err(EstimateError::NotOneMolecule(
            "several disconnected molecules: estimate each on its own".into(),
        ));
    }
    Ok(())
}

/// Domain of validity: a structure group additivity cannot price is refused with the reason,
/// or (when the options allow it) estimated with a flag per finding.
fn domain_step(
    p: &PerceivedMolecule,
    options: &EstimateOptions,
) -> Result<StepTerms, EstimateError> {
    let found = out_of_domain(p);
    if found.is_empty() {
        return Ok(StepTerms::default());
    }
    if !options.allow_out_of_domain {
        return Err(EstimateError::OutOfDomain(found));
    }
    Ok(StepTerms {
        terms: Vec::new(),
        flags: found.into_iter().map(Flag::OutOfDomain).collect(),
    })
}

/// Benson groups of every heavy atom; an atom without a Benson type is an error naming it.
fn assign(p: &PerceivedMolecule) -> Result<GroupAssignment, EstimateError> {
    assign_groups(p).map_err(|u| {
        let atom = p.mol.atom(u.atom);
        EstimateError::Untyped {
            atom: p.input_atom_number(u.atom),
            element: atom.element.to_string(),
            column: atom.column,
            reason: u.reason,
        }
    })
}

/// The symmetry for the entropy: the user's (the graph is then not searched at all) or the
/// graph's; true when it is the user's.
fn symmetry_used(
    p: &PerceivedMolecule,
    options: &EstimateOptions,
) -> Result<(SymmetryUsed, bool), EstimateError> {
    match options.symmetry_override {
        Some(user) => {
            user.check_for(&p.mol)?;
            let info = user.info();
            Ok((
                SymmetryUsed {
                    total: info.total,
                    external: info.external,
                    internal: info.internal,
                    optical_isomers: info.optical_isomers,
                    notes: info.notes,
                },
                true,
            ))
        }
        None => Ok((graph_symmetry(p), false)),
    }
}

/// Last step: sums the terms, adds the symmetry term to S298, and flags every property some
/// term lacks.
fn total(steps: StepTerms, symmetry: SymmetryUsed, overridden: bool) -> ThermoEstimate {
    let StepTerms { terms, mut flags } = steps;
    let (hf, hf_free) = hf298_sums(&terms);
    let (s, cp) = s298_cp_sums(&terms);
    let symmetry_term = -GAS_CONSTANT_J_PER_MOL_K * (symmetry.total.max(1) as f64).ln()
        + GAS_CONSTANT_J_PER_MOL_K * f64::from(symmetry.optical_isomers.max(1)).ln();
    // The method's own scatter per term family (src/thermo/uncertainty.rs) on top of the
    // tables' uncertainties.
    let (method_hf, method_s) = method_variance(&terms);
    let s298_j = s.quantity().map(|q| {
        Quantity::new(
            q.value + symmetry_term,
            q.uncertainty.hypot(method_s.sqrt()),
        )
    });
    let cp_j = cp
        .iter()
        .map(|c| c.quantity())
        .collect::<Option<Vec<Quantity>>>()
        .and_then(|v| <[Quantity; 7]>::try_from(v).ok());
    let hf298_kj = hf
        .quantity()
        .map(|q| Quantity::new(q.value, q.uncertainty.hypot(method_hf.sqrt())));
    for (property, missing) in [
        (Property::Hf298, hf298_kj.is_none()),
        (Property::S298, s298_j.is_none()),
        (Property::Cp, cp_j.is_none()),
    ] {
        if missing {
            flags.push(Flag::PropertyNotEstimated {
                property,
                lacking: terms
                    .iter()
                    .filter(|t| !t.gives(property))
                    .map(|t| t.label.clone())
                    .collect(),
            });
        }
    }
    ThermoEstimate {
        terms,
        flags,
        symmetry,
        symmetry_overridden: overridden,
        hf298_kj,
        strain_free_hf298_kj: hf_free.quantity(),
        s298_j,
        cp_j,
    }
}

/// The heat-capacity temperatures, K (re-exported for reports).
pub const CP_TEMPERATURES: [f64; 7] = CP_TEMPERATURES_K;
