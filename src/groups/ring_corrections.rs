//! Ring-correction lookup: matches each ring system's skeleton against the ring tables, with a
//! flagged fallback (sum of the single rings, then the all-carbon ring of the same shape).

use super::ring_match::{correction_skeletons, skeleton_of_rings, RingSkeleton, SkeletonSignature};
use super::table::{GroupTables, RingEntry};
use crate::molecule::symmetry::symmetry_number;
use crate::molecule::PerceivedMolecule;
use crate::units::GAS_CONSTANT_J_PER_MOL_K;

/// A ring-table entry whose SMILES cannot serve as a ring-correction pattern.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("{file}: ring \"{name}\": {problem}")]
pub struct RingPatternError {
    /// File of the entry.
    pub file: String,
    /// Name of the entry.
    pub name: String,
    /// What is wrong.
    pub problem: String,
}

/// The ring entries with their skeletons, ready for matching.
#[derive(Debug, Clone)]
pub struct RingCorrectionIndex {
    patterns: Vec<(usize, RingSkeleton, SkeletonSignature)>,
    /// Per ring entry: R ln(sigma_flat / sigma_parent), J/(mol K), the shift that puts an
    /// entropy given in the parent's real-symmetry convention onto the flat-graph convention.
    entropy_shift_j: Vec<f64>,
}

/// How one ring system of a molecule got its correction.
#[derive(Debug, Clone, PartialEq)]
pub enum RingMatch {
    /// The whole system is a table entry.
    Exact,
    /// Not in the tables: the parts stood in.
    Fallback(RingStandIn),
}

/// What stood in for a ring system the tables lack.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct RingStandIn {
    /// SSSR ring sizes of the system, ascending.
    pub ring_sizes: Vec<usize>,
    /// The whole system's stand-in (one part), or one part per ring.
    pub parts: Vec<RingStandInPart>,
}

/// One part of a ring stand-in.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub enum RingStandInPart {
    /// A ring entry used for the ring.
    Entry {
        /// Name of the ring entry.
        name: String,
        /// How the ring was matched to it.
        matched: RingPartMatch,
    },
    /// A ring with no entry at all: taken as strain-free.
    NoEntry {
        /// Ring-atom count of the ring.
        ring_atoms: usize,
    },
}

/// How a single ring matched a ring entry.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub enum RingPartMatch {
    /// The ring itself is the entry.
    Itself,
    /// The ring with every atom taken as carbon.
    AllCarbon,
    /// The ring as a saturated carbocycle.
    SaturatedCarbon,
}

impl std::fmt::Display for RingStandInPart {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            RingStandInPart::Entry { name, matched } => match matched {
                RingPartMatch::Itself => write!(f, "{name}"),
                RingPartMatch::AllCarbon => write!(f, "{name} (all-carbon stand-in)"),
                RingPartMatch::SaturatedCarbon => {
                    write!(f, "{name} (saturated carbocycle stand-in)")
                }
            },
            RingStandInPart::NoEntry { ring_atoms } => {
                write!(f, "{ring_atoms}-ring with no entry (taken as strain-free)")
            }
        }
    }
}

impl std::fmt::Display for RingStandIn {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        let parts: Vec<String> = self.parts.iter().map(ToString::to_string).collect();
        write!(
            f,
            "ring system with rings of sizes {:?} is not in the ring tables; stand-in: {}",
            self.ring_sizes,
            parts.join(" + ")
        )
    }
}

/// The correction applied to one ring system.
#[derive(Debug, Clone)]
pub struct AppliedRingCorrection {
    /// Ring-atom count of the system and its SSSR ring sizes, for display.
    pub ring_sizes: Vec<usize>,
    /// Indices into `GroupTables::rings()` of the entries used (one for an exact match).
    pub entries: Vec<usize>,
    /// Exact or fallback.
    pub how: RingMatch,
}

impl RingCorrectionIndex {
    /// Builds skeletons for every ring entry of the tables.
    pub fn new(tables: &GroupTables) -> Result<RingCorrectionIndex, RingPatternError> {
        let mut patterns = Vec::new();
        let mut entropy_shift_j = vec![0.0; tables.rings().len()];
        for (i, entry) in tables.rings().iter().enumerate() {
            let fail = |problem: String| RingPatternError {
                file: entry.origin.file.display().to_string(),
                name: entry.name.clone(),
                problem,
            };
            let p = PerceivedMolecule::from_smiles(&entry.smiles)
                .map_err(|e| fail(format!("smiles does not parse: {e}")))?;
            let mut skeletons = correction_skeletons(&p);
            if skeletons.len() != 1 {
                return Err(fail(format!(
                    "smiles `{}` must hold exactly one ring system that needs a correction, \
                     found {}",
                    entry.smiles,
                    skeletons.len()
                )));
            }
            if let Some(parent_sigma) = entry.parent_symmetry {
                // Benson's ring entropies assume the parent's real symmetry number; ours
                // subtract R ln(sigma of the flat graph), so the entry moves by the ratio.
                let flat = symmetry_number(&p.mol).total.max(1) as f64;
                entropy_shift_j[i] =
                    GAS_CONSTANT_J_PER_MOL_K * (flat / parent_sigma.max(1) as f64).ln();
            }
            let skeleton = skeletons.remove(0);
            let signature = skeleton.signature();
            patterns.push((i, skeleton, signature));
        }
        Ok(RingCorrectionIndex {
            patterns,
            entropy_shift_j,
        })
    }

    /// The entropy shift (J/(mol K)) that converts ring entry `i` to the flat-graph symmetry
    /// convention; zero for entries already in it.
    pub fn entropy_shift_j(&self, i: usize) -> f64 {
        self.entropy_shift_j.get(i).copied().unwrap_or(0.0)
    }

    /// The table entry whose skeleton is `s`, if any.
    pub fn find(&self, s: &RingSkeleton) -> Option<usize> {
        let signature = s.signature();
        self.patterns
            .iter()
            .find(|(_, pattern, sig)| *sig == signature && pattern.isomorphic_to(s))
            .map(|(i, _, _)| *i)
    }

    /// The entry for one ring, trying the ring itself, then all-carbon, then saturated carbon.
    fn single_ring(
        &self,
        s: &RingSkeleton,
        entries: &[RingEntry],
    ) -> Option<(usize, RingStandInPart)> {
        let part = |i: usize, matched| {
            let name = entries[i].name.clone();
            (i, RingStandInPart::Entry { name, matched })
        };
        if let Some(i) = self.find(s) {
            return Some(part(i, RingPartMatch::Itself));
        }
        if let Some(i) = self.find(&s.all_carbon()) {
            return Some(part(i, RingPartMatch::AllCarbon));
        }
        self.find(&s.saturated_carbon())
            .map(|i| part(i, RingPartMatch::SaturatedCarbon))
    }

    /// Ring corrections for every ring system of `p` that needs one.
    pub fn apply(&self, p: &PerceivedMolecule, tables: &GroupTables) -> Vec<AppliedRingCorrection> {
        let entries = tables.rings();
        let mut out = Vec::new();
        for system in correction_skeletons(p) {
            let mut ring_sizes: Vec<usize> = system
                .rings
                .iter()
                .map(|&r| p.rings.rings[r].atoms.len())
                .collect();
            ring_sizes.sort_unstable();
            if let Some(i) = self.find(&system) {
                out.push(AppliedRingCorrection {
                    ring_sizes,
                    entries: vec![i],
                    how: RingMatch::Exact,
                });
                continue;
            }
            let mut used = Vec::new();
            let mut words = Vec::new();
            let whole = if system.rings.len() == 1 {
                self.single_ring(&system, entries)
            } else {
                None
            };
            if let Some((i, word)) = whole {
                used.push(i);
                words.push(word);
            } else {
                for &r in &system.rings {
                    let single = skeleton_of_rings(p, &[r]);
                    match self.single_ring(&single, entries) {
                        Some((i, word)) => {
                            used.push(i);
                            words.push(word);
                        }
                        None => words.push(RingStandInPart::NoEntry {
                            ring_atoms: single.ring_atom_count(),
                        }),
                    }
                }
            }
            out.push(AppliedRingCorrection {
                ring_sizes: ring_sizes.clone(),
                entries: used,
                how: RingMatch::Fallback(RingStandIn {
                    ring_sizes,
                    parts: words,
                }),
            });
        }
        out
    }
}
