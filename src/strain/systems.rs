//! Strain per ring system, from the ring corrections of each system.
//!
//! Choice (documented in the README): a molecule with several separate ring systems gets one
//! strain value per system, the Hf298 ring correction(s) the group tables give that system
//! (Benson's convention: one correction per ring or ring system). The reaction schemes are not
//! split, because a CBH reaction prices the whole molecule at once; when the target's Hf298 is
//! measured, the difference between the molecule's group strain and the sum over its systems
//! (measured minus estimated Hf298) is reported as not assigned to any system.

use crate::groups::ring_corrections::RingMatch;
use crate::groups::ring_match::correction_skeletons;
use crate::molecule::PerceivedMolecule;
use crate::thermo::estimate::TermKind;
use crate::thermo::{GroupAdditivity, Quantity, ThermoEstimate};

/// The strain of one ring system from its ring correction(s).
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct RingSystemStrain {
    /// 1-based number of the system in the molecule.
    pub number: usize,
    /// 1-based atom numbers of the system's ring atoms, ascending.
    pub atoms: Vec<usize>,
    /// SSSR ring sizes, ascending.
    pub ring_sizes: Vec<usize>,
    /// Names of the ring-table entries used.
    pub corrections: Vec<String>,
    /// Sum of their Hf298 corrections, kJ/mol.
    pub strain_kj: Quantity,
    /// Set when the system is not in the ring tables and parts of it stood in.
    pub stand_in: Option<String>,
}

/// The ring systems of `p` that take a ring correction (benzenoid rings take none), each with
/// its share of the group strain. Values (and widened stand-in uncertainties) are those of the
/// `estimate` of the same molecule, so that the systems add up to its ring terms.
pub fn ring_system_strain(
    p: &PerceivedMolecule,
    engine: &GroupAdditivity,
    estimate: &ThermoEstimate,
) -> Vec<RingSystemStrain> {
    let entries = engine.tables.rings();
    let skeletons = correction_skeletons(p);
    let applied = engine.ring_index.apply(p, &engine.tables);
    let mut out = Vec::new();
    for (k, (skeleton, system)) in skeletons.iter().zip(applied).enumerate() {
        let stand_in = match &system.how {
            RingMatch::Exact => None,
            RingMatch::Fallback(what) => Some(what.to_string()),
        };
        let mut value = 0.0;
        let mut variance = 0.0;
        let mut corrections = Vec::new();
        for &i in &system.entries {
            let entry = &entries[i];
            // The estimate's term carries the uncertainty actually used (widened for stand-ins).
            let term = estimate.terms.iter().find(|t| {
                t.kind == TermKind::Ring
                    && t.label == entry.name
                    && t.is_ring_stand_in() == stand_in.is_some()
            });
            let v = term.map_or(entry.values, |t| t.per_unit);
            value += v.hf_kj;
            variance += v.unc_hf_kj.powi(2);
            corrections.push(entry.name.clone());
        }
        let mut atoms: Vec<usize> = skeleton
            .atoms
            .iter()
            .map(|&a| p.input_atom_number(a))
            .collect();
        atoms.sort_unstable();
        out.push(RingSystemStrain {
            number: k + 1,
            atoms,
            ring_sizes: system.ring_sizes,
            corrections,
            strain_kj: Quantity::new(value, variance.sqrt()),
            stand_in,
        });
    }
    out
}

/// Sum of the estimate's ring terms (the Hf298 ring corrections), kJ/mol.
pub fn ring_correction_sum(estimate: &ThermoEstimate) -> Quantity {
    let mut value = 0.0;
    let mut variance = 0.0;
    for t in estimate.terms.iter().filter(|t| t.kind == TermKind::Ring) {
        let n = f64::from(t.count);
        value += n * t.per_unit.hf_kj;
        variance += (n * t.per_unit.unc_hf_kj).powi(2);
    }
    Quantity::new(value, variance.sqrt())
}
