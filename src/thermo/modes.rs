//! Degrees of freedom from the molecular graph: atom count, linearity and internal rotors, which
//! fix the low- and high-temperature limits of the ideal-gas heat capacity.
//!
//! The limits follow from the equipartition theorem (textbook statistical mechanics, e.g.
//! D. A. McQuarrie, Statistical Mechanics, Harper & Row 1976, recalled from memory): at 0 K only
//! translation and rotation are excited, Cp(0) = Cv + R = 5/2 R (atom), 7/2 R (linear) or 4 R
//! (non-linear); at very high temperature every vibration adds R, and an internal rotor that
//! turns freely adds R/2 in place of the R of the torsional vibration it replaces (the rotor
//! treatment used with Wilhoit's extrapolation in automatic mechanism generators, common
//! practice).

use petgraph::visit::EdgeRef;

use crate::molecule::{BondOrder, Molecule, PerceivedMolecule};
use crate::units::GAS_CONSTANT_J_PER_MOL_K as GAS_CONSTANT;
use petgraph::graph::NodeIndex;

/// Counts that fix Cp(0) and Cp(infinity).
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
pub struct ModeCounts {
    /// Atoms, hydrogens included.
    pub atoms: u32,
    /// Whether the equilibrium geometry is linear (judged from the graph).
    pub linear: bool,
    /// Internal rotors (torsions about acyclic single bonds between non-terminal atoms).
    pub rotors: u32,
}

impl ModeCounts {
    /// The counts of a perceived molecule.
    pub fn of(p: &PerceivedMolecule) -> ModeCounts {
        let mol = &p.mol;
        let atoms = mol
            .atoms()
            .map(|i| 1 + u32::from(mol.atom(i).hydrogens))
            .sum();
        ModeCounts {
            atoms,
            linear: is_linear(p, atoms),
            rotors: count_rotors(p),
        }
    }

    /// Vibrational modes, 3N - 6 (3N - 5 if linear, 0 for an atom), torsions included.
    pub fn vibrations(&self) -> u32 {
        match (self.atoms, self.linear) {
            (0 | 1, _) => 0,
            (n, true) => 3 * n - 5,
            (n, false) => 3 * n - 6,
        }
    }

    /// Cp at 0 K, J/(mol K): translation and rotation only.
    pub fn cp0_j(&self) -> f64 {
        let over_r = match (self.atoms, self.linear) {
            (0 | 1, _) => 2.5,
            (_, true) => 3.5,
            (_, false) => 4.0,
        };
        over_r * GAS_CONSTANT
    }

    /// Cp at infinite temperature, J/(mol K): Cp(0) plus R per vibration, with R/2 in place of
    /// R for each internal rotor.
    pub fn cp_inf_j(&self) -> f64 {
        let rotors = self.rotors.min(self.vibrations());
        let vibrations = f64::from(self.vibrations() - rotors);
        self.cp0_j() + GAS_CONSTANT * (vibrations + 0.5 * f64::from(rotors))
    }
}

/// Neighbours of `i` including implicit hydrogens.
fn total_degree(mol: &Molecule, i: NodeIndex) -> usize {
    mol.degree(i) + usize::from(mol.atom(i).hydrogens)
}

/// An atom whose two bonds are collinear: two neighbours, and a triple bond or two double bonds.
fn is_sp_linear(mol: &Molecule, i: NodeIndex) -> bool {
    if total_degree(mol, i) != 2 {
        return false;
    }
    let orders: Vec<BondOrder> = mol.neighbours(i).map(|(_, b)| b.order).collect();
    let triples = orders.iter().filter(|o| **o == BondOrder::Triple).count();
    let doubles = orders.iter().filter(|o| **o == BondOrder::Double).count();
    triples >= 1 || doubles == 2
}

/// Linear molecules: two atoms, or an acyclic chain whose every inner atom is sp-linear.
fn is_linear(p: &PerceivedMolecule, atoms: u32) -> bool {
    let mol = &p.mol;
    if atoms <= 2 {
        return atoms == 2;
    }
    if !p.rings.rings.is_empty() {
        return false;
    }
    mol.atoms().all(|i| match total_degree(mol, i) {
        0 | 1 => true,
        2 => is_sp_linear(mol, i),
        _ => false,
    })
}

/// Follows the axis from `from` through `start` across sp-linear atoms; returns the first atom
/// that bends the axis (has neighbours off it), or `None` if the axis ends in a terminal atom.
fn axis_end(mol: &Molecule, from: NodeIndex, start: NodeIndex) -> Option<NodeIndex> {
    let (mut prev, mut here) = (from, start);
    // A chain of sp-linear atoms cannot be longer than the molecule.
    for _ in 0..=mol.atom_count() {
        if total_degree(mol, here) <= 1 {
            return None;
        }
        if !is_sp_linear(mol, here) {
            return Some(here);
        }
        // An sp-linear atom with an implicit hydrogen ends the axis (H-C#C-).
        let next = mol.neighbours(here).map(|(n, _)| n).find(|n| *n != prev);
        match next {
            Some(n) if mol.degree(here) == 2 => {
                prev = here;
                here = n;
            }
            _ => return None,
        }
    }
    None
}

/// Internal rotors: one per torsion axis, an acyclic single bond (or a chain of them through
/// sp-linear atoms) whose two ends both carry atoms off the axis.
fn count_rotors(p: &PerceivedMolecule) -> u32 {
    let mol = &p.mol;
    let mut axes: Vec<(NodeIndex, NodeIndex)> = Vec::new();
    for e in mol.graph.edge_references() {
        if e.weight().order != BondOrder::Single || p.rings.is_ring_bond(e.id()) {
            continue;
        }
        let (a, b) = (e.source(), e.target());
        let ends = (axis_end(mol, b, a), axis_end(mol, a, b));
        if let (Some(x), Some(y)) = ends {
            let axis = (x.min(y), x.max(y));
            if x != y && !axes.contains(&axis) {
                axes.push(axis);
            }
        }
    }
    axes.len() as u32
}

#[cfg(test)]
mod tests {
    use super::*;

    fn counts(smiles: &str) -> ModeCounts {
        match PerceivedMolecule::from_smiles(smiles) {
            Ok(p) => ModeCounts::of(&p),
            Err(e) => panic!("{smiles}: {e}"),
        }
    }

    /// Rotor counts and linearity by hand from the structures (common practice).
    #[test]
    fn counts_of_small_molecules() {
        let cases = [
            ("C", 5, false, 0),
            ("CC", 8, false, 1),
            ("CCC", 11, false, 2),
            ("CO", 6, false, 1),
            ("C#C", 4, true, 0),
            ("C#N", 3, true, 0),
            ("O=C=O", 3, true, 0),
            ("CC#C", 7, false, 0),
            ("CC#CC", 10, false, 1),
            ("C=C=C", 7, false, 0),
            ("C1CC1", 9, false, 0),
            ("c1ccccc1", 12, false, 0),
            ("c1ccccc1-c1ccccc1", 22, false, 1),
            ("CC(C)(C)C", 17, false, 4),
            ("[H][H]", 2, true, 0),
            ("ClCCl", 5, false, 0),
        ];
        for (smiles, atoms, linear, rotors) in cases {
            let c = counts(smiles);
            assert_eq!(
                (c.atoms, c.linear, c.rotors),
                (atoms, linear, rotors),
                "{smiles}"
            );
        }
    }
}
