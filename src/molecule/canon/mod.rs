//! Canonical SMILES of our own design: the same molecule always gets the same string.
//!
//! The key is used to merge and look up species (reaction fragments, reference tables, batch
//! deduplication), so it ignores how a molecule was written: atom order, ring digits, branch
//! choices, Kekulé or lower-case aromatic spelling, explicit `[H]` nodes.
//!
//! Steps:
//! 1. Fold plain hydrogen nodes into their neighbours (also those named by stereo marks).
//! 2. Find resonant bonds: bonds that are single in one Kekulé structure and double in
//!    another. They are ranked as one bond class and written in lower case, so the key does
//!    not depend on the Kekulé structure of the input. Rings with a single Kekulé structure
//!    (pyrrole, furan, quinones) are written with their fixed single and double bonds.
//! 3. Rank atoms by their invariants, refine by neighbour ranks until stable, fold in stereo
//!    configurations relative to ranks, and break ties (see `ranking`).
//! 4. Drop stereo marks that do not make a stereoisomer: an element that refinement leaves
//!    undefined is kept only if inverting it changes the key.
//! 5. Write depth-first from the lowest-ranked atom of each component; components sorted.
//!
//! ```
//! use ringheat::molecule::{canon::canonical_smiles, parse_smiles};
//! let a = parse_smiles("C1=CC=CC=C1C").unwrap();
//! let b = parse_smiles("Cc1ccccc1").unwrap();
//! assert_eq!(canonical_smiles(&a), canonical_smiles(&b));
//! ```
//!
//! Known limits: tie-breaking assumes that atoms left tied by refinement are symmetry
//! equivalent, which holds for ordinary molecules and for C60, cubane and dodecahedrane but
//! not for every regular graph; stereo marks other than tetrahedral `@`/`@@` (allene,
//! square-planar, bipyramidal, octahedral classes) are not kept; double-bond geometry in rings
//! of fewer than 8 atoms is not kept; resonance is perceived only over B, C, N, O, P, S, As
//! and Se atoms at their lowest valence (a ring of another element keeps the input's Kekulé
//! form); double bonds that are resonant (in a ring with alternating bonds, as in
//! [16]annulene) lose their geometry; in a conjugated chain whose middle double bond is left
//! unspecified between two specified ones, the written marks can specify the middle one too.
//! Stereo tie-breaking compares candidates with one level of look-ahead, which settles
//! para-type rings (1,4-dimethylcyclohexane, inositols, 1,3,5-trisubstituted cyclohexanes) but
//! is not a proof of canonicity for every stereo graph.

pub(crate) mod prepare;
mod ranking;
pub(crate) mod resonance;
pub(crate) mod stereo;
mod writer;

use crate::molecule::graph::Molecule;
use prepare::Prepared;
use stereo::StereoSet;

/// The canonical SMILES of `mol`: equal for every spelling of the same molecule (including its
/// stereo), different for different molecules, and a valid SMILES of the same graph.
pub fn canonical_smiles(mol: &Molecule) -> String {
    if mol.atom_count() == 0 {
        return String::new();
    }
    let form = CanonicalForm::of(mol);
    writer::write(&form.prepared, &form.stereo, &form.ranks)
}

/// A molecule prepared for its canonical key: hydrogens folded, bonds classified, the stereo
/// elements that make a stereoisomer, and the canonical rank of every atom (all distinct).
#[derive(Debug, Clone)]
pub(crate) struct CanonicalForm {
    pub prepared: Prepared,
    pub stereo: StereoSet,
    /// Canonical rank of each atom of `prepared.folded`, a permutation of `0..n`.
    pub ranks: Vec<u32>,
}

impl CanonicalForm {
    /// The canonical form of `mol` (an empty molecule gives empty lists).
    pub fn of(mol: &Molecule) -> CanonicalForm {
        let prepared = Prepared::new(mol);
        let stereo = stereogenic_elements(&prepared);
        let ranks = ranking::canonical_ranks(&prepared, &stereo);
        CanonicalForm {
            prepared,
            stereo,
            ranks,
        }
    }
}

/// The input's stereo elements less those that describe no stereoisomer of their own.
fn stereogenic_elements(prepared: &Prepared) -> StereoSet {
    let mut stereo = prepared.stereo.clone();
    let suspects = ranking::undefined_after_refinement(prepared, &stereo);
    if suspects.is_empty() {
        return stereo;
    }
    // A mark whose inversion gives the same key describes no stereoisomer of its own. Drop such
    // marks one at a time; when several qualify, drop the one whose removal gives the smallest
    // key, so the choice does not depend on input order (in cis,cis,trans-1,3,5-trimethyl-
    // cyclohexane either twin may go, and the two results differ).
    let mut remaining = suspects;
    loop {
        let kept = key_with(prepared, &stereo);
        let mut best: Option<(String, usize)> = None;
        for (k, &id) in remaining.iter().enumerate() {
            let mut flipped = stereo.clone();
            flipped.flip(id);
            if key_with(prepared, &flipped) != kept {
                continue;
            }
            let mut without = stereo.clone();
            without.drop_element(id);
            let key = key_with(prepared, &without);
            if best.as_ref().is_none_or(|(b, _)| key < *b) {
                best = Some((key, k));
            }
        }
        let Some((_, k)) = best else {
            return stereo;
        };
        stereo.drop_element(remaining.remove(k));
        if remaining.is_empty() {
            return stereo;
        }
    }
}

/// The key for one choice of stereo elements.
fn key_with(prepared: &Prepared, stereo: &StereoSet) -> String {
    let ranks = ranking::canonical_ranks(prepared, stereo);
    writer::write(prepared, stereo, &ranks)
}

#[cfg(test)]
mod tests;
