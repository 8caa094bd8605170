//! Molecules: SMILES parsing, the molecular graph, rings, aromaticity, canonical keys, formulas.

pub mod aromaticity;
pub mod canon;
pub mod element;
pub mod formula;
pub mod graph;
pub mod kekulize;
pub mod perceived;
pub mod rings;
pub mod smiles;
pub mod symmetry;

pub use canon::canonical_smiles;
pub use element::Element;
pub use graph::{
    Atom, Bond, BondDirection, BondOrder, ChiralCentre, ChiralTag, Molecule, StereoNeighbour,
};
pub use perceived::PerceivedMolecule;
#[allow(unused_imports)]
pub use smiles::*;
