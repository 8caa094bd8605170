//! Symmetry numbers (external x internal rotation) and optical isomer counts from the graph.
//!
//! The total symmetry number sigma is the order of the group of permutations of the
//! hydrogen-explicit graph that keep every element, bond order (aromatic bonds alike), and
//! the handedness of every stereo unit: tetrahedral centres, pyramidal atoms with their lone
//! pair, cis/trans double bonds and cumulenes, and the cyclic neighbour order of closed
//! three-connected cages such as C60. Those are the proper rotations of the rigid molecule
//! combined with the rotations of its rotors; reflections are left out. The group order comes
//! from individualization-refinement along a stabilizer chain (product of orbit sizes), after
//! interchangeable terminal atoms are folded into their neighbours, so neither C60 nor
//! tetra-tert-butylmethane is ever enumerated.
//!
//! Convention: the graph knows no conformation, so every ring counts as flat (or
//! conformationally averaged): cyclohexane gets 12 (D6h), where the chair is 6 (D3d). Unwritten
//! stereo is filled in with one representative configuration. A user value overrides all of it.
//! The entropy term is `S = ... - R ln(sigma) + R ln(n)` (S. W. Benson, Thermochemical Kinetics,
//! 2nd ed., Wiley 1976).
//!
//! ```
//! use ringheat::molecule::{parse_smiles, symmetry::symmetry_number};
//!
//! let neopentane = parse_smiles("CC(C)(C)C").unwrap();
//! let s = symmetry_number(&neopentane);
//! assert_eq!((s.total, s.external, s.internal), (972, 12, 81));
//! ```

mod build;
mod cage;
mod double_bonds;
mod faces;
mod labelled;
mod partition;
mod reduce;
mod rotors;
mod search;

use crate::molecule::graph::Molecule;
use labelled::{LabelledGraph, UnitKind};
use reduce::fold_terminals;
use search::proper_group_order;

use crate::units::GAS_CONSTANT_J_PER_MOL_K;

/// How the symmetry number was obtained.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub enum SymmetryConvention {
    /// From the graph, every ring taken as flat or conformationally averaged.
    FlatGraph,
    /// Given by the user.
    UserOverride,
}

/// A symmetry number and optical isomer count supplied by the user, checked on construction:
/// sigma and n are at least 1, and the external part (if given) divides sigma. The one type
/// for `--sigma`, the `sigma=` words of an input file and the library.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub struct SymmetryOverride {
    total: u64,
    external: Option<u64>,
    optical_isomers: u8,
}

/// A user symmetry value that cannot be a symmetry number.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum SymmetryOverrideError {
    /// sigma = 0.
    #[error("sigma must be a whole number >= 1")]
    ZeroSigma,
    /// n = 0.
    #[error("the number of optical isomers must be a whole number >= 1")]
    ZeroOpticalIsomers,
    /// The external part does not divide sigma.
    #[error("the external symmetry number {external} does not divide sigma = {total}")]
    ExternalNotADivisor { total: u64, external: u64 },
    /// More symmetry operations than the molecule's like atoms can be permuted in.
    #[error(
        "sigma = {sigma} is larger than the {bound} permutations of the molecule's like atoms \
         (a symmetry operation permutes like atoms, so sigma cannot exceed their count)"
    )]
    TooLarge { sigma: u64, bound: u128 },
}

impl SymmetryOverride {
    /// A user symmetry number `sigma` (external x internal) and optical isomer count `n`.
    pub fn new(sigma: u64, optical_isomers: u8) -> Result<SymmetryOverride, SymmetryOverrideError> {
        if sigma == 0 {
            return Err(SymmetryOverrideError::ZeroSigma);
        }
        if optical_isomers == 0 {
            return Err(SymmetryOverrideError::ZeroOpticalIsomers);
        }
        Ok(SymmetryOverride {
            total: sigma,
            external: None,
            optical_isomers,
        })
    }

    /// The same with the external part given (the internal part is then sigma / external).
    pub fn with_external(self, external: u64) -> Result<SymmetryOverride, SymmetryOverrideError> {
        if external == 0 || !self.total.is_multiple_of(external) {
            return Err(SymmetryOverrideError::ExternalNotADivisor {
                total: self.total,
                external,
            });
        }
        Ok(SymmetryOverride {
            external: Some(external),
            ..self
        })
    }

    /// Total symmetry number sigma.
    pub fn sigma(&self) -> u64 {
        self.total
    }

    /// Number of optical isomers n.
    pub fn optical_isomers(&self) -> u8 {
        self.optical_isomers
    }

    /// Checks the value against `mol`: every symmetry operation permutes like atoms (same
    /// element, hydrogens included), so sigma is at most the product of the factorials of the
    /// element counts. Refuses methane with sigma = 2^64 - 1.
    pub fn check_for(&self, mol: &Molecule) -> Result<(), SymmetryOverrideError> {
        let bound = like_atom_permutations(mol);
        if u128::from(self.total) > bound {
            return Err(SymmetryOverrideError::TooLarge {
                sigma: self.total,
                bound,
            });
        }
        Ok(())
    }

    /// The symmetry information this override stands for.
    pub fn info(&self) -> SymmetryInfo {
        from_override(*self)
    }
}

/// Product over elements of (number of atoms of that element)!, hydrogens counted, saturating.
fn like_atom_permutations(mol: &Molecule) -> u128 {
    let mut counts: std::collections::BTreeMap<u8, u64> = std::collections::BTreeMap::new();
    for a in mol.atoms() {
        let atom = mol.atom(a);
        *counts.entry(atom.element.atomic_number()).or_default() += 1;
        *counts.entry(1).or_default() += u64::from(atom.hydrogens);
    }
    counts.values().fold(1u128, |acc, &n| {
        (2..=u128::from(n)).fold(acc, |a, k| a.saturating_mul(k))
    })
}

/// Options for [`symmetry_number_with`].
#[derive(Debug, Clone, Copy, Default, PartialEq, Eq)]
pub struct SymmetryOptions {
    /// A user value that replaces the graph's.
    pub user: Option<SymmetryOverride>,
}

/// Symmetry number and optical isomers of a molecule, with the assumptions made.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct SymmetryInfo {
    /// Rotations of the rigid molecule (sigma external).
    pub external: u64,
    /// Product of the rotor symmetry numbers (sigma internal).
    pub internal: u64,
    /// sigma = external x internal.
    pub total: u64,
    /// Number of optical isomers n for the entropy term `R ln n`.
    pub optical_isomers: u8,
    /// Whether the molecule is chiral (no automorphism is an improper rotation).
    pub chiral: bool,
    /// How the numbers were obtained.
    pub convention: SymmetryConvention,
    /// Assumptions and warnings, in plain words.
    pub notes: Vec<String>,
}

impl SymmetryInfo {
    /// The entropy term `R ln(n) - R ln(sigma)` in J/(mol K).
    pub fn entropy_term_j_per_mol_k(&self) -> f64 {
        GAS_CONSTANT_J_PER_MOL_K
            * ((self.optical_isomers.max(1) as f64).ln() - (self.total.max(1) as f64).ln())
    }
}

/// Symmetry number and optical isomers of `mol` by the flat-graph convention.
pub fn symmetry_number(mol: &Molecule) -> SymmetryInfo {
    symmetry_number_with(mol, &SymmetryOptions::default())
}

/// Symmetry number and optical isomers of `mol`, or the user's values when given.
pub fn symmetry_number_with(mol: &Molecule, options: &SymmetryOptions) -> SymmetryInfo {
    if let Some(user) = options.user {
        return from_override(user);
    }
    let mut notes = Vec::new();
    if mol.atom_count() == 0 {
        notes.push("empty molecule".to_string());
        return plain(1, 1, 1, false, notes);
    }
    let heavy = mol
        .atoms()
        .filter(|&a| mol.atom(a).element.atomic_number() != 1)
        .count();
    if heavy > LARGEST_SEARCHED {
        return large_molecule(mol, heavy, notes);
    }
    let built = build::build(mol);
    notes.extend(built.notes.iter().cloned());
    let g = &built.graph;
    let folded = fold_terminals(g);
    let searched = proper_group_order(&folded.graph);
    let total = match searched {
        Ok(order) => order.saturating_mul(folded.factor),
        Err(_) => {
            notes.push(
                "the symmetry search reached its limit; sigma counts only the folded \
                 terminal atoms and is a lower bound"
                    .to_string(),
            );
            folded.factor
        }
    };
    let chiral = is_chiral(g, &folded.graph, searched.ok());
    let written = g.units.iter().filter(|u| u.specified).count();
    let optical_isomers = if !chiral {
        1
    } else if written > 0 {
        notes.push(format!(
            "chiral; configuration written at {written} stereo element(s): taken as a single \
             enantiomer (n = 1)"
        ));
        1
    } else {
        notes.push("chiral; configuration not written: taken as the racemate (n = 2)".to_string());
        2
    };
    if written == 0 && built.open_stereocentres > 1 {
        notes.push(
            "unwritten stereo: sigma is for one representative stereoisomer (like \
             configurations at equivalent centres)"
                .to_string(),
        );
    }
    if built.puckerable_ring {
        notes.push(
            "flat-graph convention: rings count as flat; a puckered conformer can have a \
             lower sigma (chair cyclohexane 6, not 12); give an override if needed"
                .to_string(),
        );
    }
    if mol.component_count() > 1 {
        notes.push(
            "several components: sigma is for the whole set, swaps of identical components \
             included"
                .to_string(),
        );
    }
    let internal = match rotors::rotors(g) {
        Ok(found) => found
            .iter()
            .fold(1u128, |acc, r| acc.saturating_mul(r.symmetry)),
        Err(_) => 1,
    };
    let (external, internal) = if internal > 0 && total.is_multiple_of(internal) {
        (total / internal, internal)
    } else {
        notes.push(
            "the rotor split does not divide sigma; external reported as the total".to_string(),
        );
        (total, 1)
    };
    if total > u64::MAX as u128 {
        notes.push("sigma exceeds 2^64 and is reported saturated".to_string());
    }
    let mut info = plain(total, external, internal, chiral, notes);
    info.optical_isomers = optical_isomers;
    info
}

/// Whether no improper automorphism exists. Pyramidal nitrogen and oxonium centres whose
/// configuration is not written are ignored here: they invert quickly (common practice).
fn is_chiral(g: &LabelledGraph, folded: &LabelledGraph, order: Option<u128>) -> bool {
    let inverting = |k: UnitKind, specified: bool| k == UnitKind::InvertingPyramid && !specified;
    let (m, order) = if g.units.iter().any(|u| inverting(u.kind, u.specified)) {
        let mut h = g.clone();
        h.units.retain(|u| !inverting(u.kind, u.specified));
        h.finish();
        let m = fold_terminals(&h).graph;
        let order = proper_group_order(&m).ok();
        (m, order)
    } else {
        (folded.clone(), order)
    };
    if m.units.is_empty() {
        return false;
    }
    let Some(order) = order else {
        return false;
    };
    match proper_group_order(&m.disjoint_union(&m.mirrored())) {
        Ok(both) => both < order.saturating_mul(order).saturating_mul(2),
        Err(_) => false,
    }
}

/// Heavy atoms above which the exact search is skipped: batch work must not stall on a
/// polymer-sized input (our choice; a 500-carbon n-alkane or cycloalkane takes about 60 ms).
pub const LARGEST_SEARCHED: usize = 500;

/// Symmetry of a molecule too large for the search: external 1, one rotor factor of 3 per
/// methyl group (a lower bound on sigma), not chiral; the notes say so.
fn large_molecule(mol: &Molecule, heavy: usize, mut notes: Vec<String>) -> SymmetryInfo {
    let methyls = mol
        .atoms()
        .filter(|&a| {
            let atom = mol.atom(a);
            atom.element.atomic_number() == 6 && mol.total_hydrogens(a) == 3 && mol.degree(a) == 1
        })
        .count() as u32;
    let internal = 3u128.saturating_pow(methyls);
    notes.push(format!(
        "{heavy} heavy atoms: more than {LARGEST_SEARCHED}, so the symmetry search was skipped; \
         sigma counts only the {methyls} methyl rotors (external symmetry taken as 1), a lower \
         bound; give the value yourself to override"
    ));
    plain(internal, 1, internal, false, notes)
}

fn plain(
    total: u128,
    external: u128,
    internal: u128,
    chiral: bool,
    notes: Vec<String>,
) -> SymmetryInfo {
    let clip = |x: u128| u64::try_from(x).unwrap_or(u64::MAX);
    SymmetryInfo {
        external: clip(external),
        internal: clip(internal),
        total: clip(total),
        optical_isomers: 1,
        chiral,
        convention: SymmetryConvention::FlatGraph,
        notes,
    }
}

fn from_override(user: SymmetryOverride) -> SymmetryInfo {
    let total = user.total.max(1);
    let external = user.external.unwrap_or(total);
    SymmetryInfo {
        external,
        internal: total / external,
        total,
        optical_isomers: user.optical_isomers.max(1),
        chiral: user.optical_isomers > 1,
        convention: SymmetryConvention::UserOverride,
        notes: vec!["symmetry number and optical isomers given by the user".to_string()],
    }
}
