//! Molecules: SMILES parsing, the molecular graph, rings, aromaticity, canonical keys, formulas.

pub mod element;
pub mod graph;

pub use element::Element;
pub use graph::{
    Atom, Bond, BondDirection, BondOrder, ChiralCentre, ChiralTag, Molecule, StereoNeighbour,
};
