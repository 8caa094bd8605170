//! A molecule made ready for thermochemistry: hydrogens folded, rings and aromaticity perceived.

use super::aromaticity::perceive_aromaticity;
use super::graph::Molecule;
use super::rings::RingInfo;
use super::smiles::{parse_smiles, SmilesError};

/// A molecule with its rings and aromaticity perceived, the input of group assignment,
/// symmetry and reaction building. Plain hydrogen nodes are folded into hydrogen counts.
#[derive(Debug, Clone)]
pub struct PerceivedMolecule {
    /// The graph (Kekulé bond orders; `aromatic` flags as perceived).
    pub mol: Molecule,
    /// Smallest set of smallest rings and ring systems.
    pub rings: RingInfo,
}

impl PerceivedMolecule {
    /// Folds hydrogens and perceives rings and aromaticity.
    pub fn new(mol: &Molecule) -> PerceivedMolecule {
        let mut mol = mol.with_hydrogens_folded();
        let rings = RingInfo::perceive(&mol);
        perceive_aromaticity(&mut mol, &rings);
        PerceivedMolecule { mol, rings }
    }

    /// Parses a SMILES and perceives it.
    pub fn from_smiles(smiles: &str) -> Result<PerceivedMolecule, SmilesError> {
        Ok(PerceivedMolecule::new(&parse_smiles(smiles)?))
    }
}
