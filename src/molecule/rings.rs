//! Ring perception: smallest set of smallest rings and ring systems (isolated, fused, bridged, spiro).
//!
//! The rings are a minimum cycle basis of the molecular graph (its number of rings equals the
//! cyclomatic number), found with Vismara's relevant-cycle prototypes and Gaussian elimination
//! over GF(2) (see `basis`). Ring systems group rings that share atoms and carry a kind used by
//! the ring-strain corrections (see `systems` for the classification rules).
//!
//! ```
//! use ringheat::molecule::{parse_smiles, rings::{RingInfo, RingSystemKind}};
//! let mol = parse_smiles("C1CC2CCC1C2").unwrap(); // norbornane
//! let info = RingInfo::perceive(&mol);
//! assert_eq!(info.ring_sizes(), vec![5, 5]);
//! assert_eq!(info.systems[0].kind, RingSystemKind::Bridged);
//! ```

mod basis;
mod systems;
#[cfg(test)]
mod tests;

use petgraph::graph::{EdgeIndex, NodeIndex};

use super::Molecule;

/// One ring of the smallest set of smallest rings.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Ring {
    /// Atoms in cyclic order, starting at the lowest index.
    pub atoms: Vec<NodeIndex>,
    /// Bonds in the same order: `bonds[i]` joins `atoms[i]` and `atoms[i + 1]` (cyclically).
    pub bonds: Vec<EdgeIndex>,
}

impl Ring {
    /// Number of atoms (equal to the number of bonds).
    pub fn size(&self) -> usize {
        self.atoms.len()
    }

    /// Whether the ring contains atom `a`.
    pub fn contains_atom(&self, a: NodeIndex) -> bool {
        self.atoms.contains(&a)
    }

    /// Whether the ring contains bond `b`.
    pub fn contains_bond(&self, b: EdgeIndex) -> bool {
        self.bonds.contains(&b)
    }
}

/// How the rings of a ring system are joined.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
pub enum RingSystemKind {
    /// A single ring.
    Isolated,
    /// Rings sharing single bonds (ortho- and peri-fused), e.g. decalin, naphthalene, indane.
    Fused,
    /// Rings sharing more than one bond, or a closed cage, e.g. norbornane, adamantane, cubane.
    Bridged,
    /// Isolated rings joined only at single atoms, e.g. spiro\[2.2\]pentane.
    Spiro,
}

/// A ring system: rings connected through shared atoms.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct RingSystem {
    /// Indices into [`RingInfo::rings`], ascending.
    pub rings: Vec<usize>,
    /// Atoms of the system, ascending.
    pub atoms: Vec<NodeIndex>,
    /// Bonds of the system, ascending.
    pub bonds: Vec<EdgeIndex>,
    /// The classification (for a system with a spiro junction and fused or bridged parts, the
    /// most complex of those).
    pub kind: RingSystemKind,
    /// Whether two parts of the system meet at a single atom.
    pub has_spiro_junction: bool,
    /// The atoms where parts of the system meet, ascending.
    pub spiro_atoms: Vec<NodeIndex>,
}

/// Rings and ring systems of a molecule.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct RingInfo {
    /// The smallest set of smallest rings, shortest first.
    pub rings: Vec<Ring>,
    /// Ring systems, ordered by their first ring.
    pub systems: Vec<RingSystem>,
    /// Number of relevant cycles (cycles in at least one minimum cycle basis), saturating.
    relevant_cycles: u64,
    /// System index of each atom (by node index).
    atom_system: Vec<Option<usize>>,
    /// Ring membership count of each atom.
    atom_ring_count: Vec<u16>,
    /// Whether each bond (by edge index) lies in a ring.
    ring_bond: Vec<bool>,
}

impl RingInfo {
    /// Finds the rings and ring systems of `mol`. Hydrogen nodes and chains are never in rings;
    /// self-loops and repeated bonds between the same two atoms are ignored.
    pub fn perceive(mol: &Molecule) -> RingInfo {
        let found = basis::minimum_cycle_basis(mol);
        let rings: Vec<Ring> = found
            .cycles
            .into_iter()
            .map(|c| Ring {
                atoms: c.atoms,
                bonds: c.bonds,
            })
            .collect();
        let systems = systems::ring_systems(&rings, mol.atom_count(), mol.bond_count());
        let mut atom_system = vec![None; mol.atom_count()];
        for (i, system) in systems.iter().enumerate() {
            for a in &system.atoms {
                atom_system[a.index()] = Some(i);
            }
        }
        let mut atom_ring_count = vec![0u16; mol.atom_count()];
        let mut ring_bond = vec![false; mol.bond_count()];
        for ring in &rings {
            for a in &ring.atoms {
                atom_ring_count[a.index()] = atom_ring_count[a.index()].saturating_add(1);
            }
            for b in &ring.bonds {
                ring_bond[b.index()] = true;
            }
        }
        RingInfo {
            rings,
            systems,
            relevant_cycles: found.relevant_cycles,
            atom_system,
            atom_ring_count,
            ring_bond,
        }
    }

    /// Ring sizes, ascending.
    pub fn ring_sizes(&self) -> Vec<usize> {
        let mut sizes: Vec<usize> = self.rings.iter().map(Ring::size).collect();
        sizes.sort_unstable();
        sizes
    }

    /// Whether bond `b` lies in a ring (false for an index outside the molecule).
    pub fn is_ring_bond(&self, b: EdgeIndex) -> bool {
        self.ring_bond.get(b.index()).copied().unwrap_or(false)
    }

    /// Whether atom `a` lies in a ring (false for an index outside the molecule).
    pub fn is_ring_atom(&self, a: NodeIndex) -> bool {
        self.ring_count_of_atom(a) > 0
    }

    /// Number of rings of the smallest set that contain atom `a`.
    pub fn ring_count_of_atom(&self, a: NodeIndex) -> usize {
        self.atom_ring_count.get(a.index()).copied().unwrap_or(0) as usize
    }

    /// Indices of the rings that contain atom `a`.
    pub fn rings_with_atom(&self, a: NodeIndex) -> impl Iterator<Item = usize> + '_ {
        self.rings
            .iter()
            .enumerate()
            .filter(move |(_, r)| r.contains_atom(a))
            .map(|(i, _)| i)
    }

    /// Size of the smallest ring containing atom `a`, if any.
    pub fn smallest_ring_of_atom(&self, a: NodeIndex) -> Option<usize> {
        self.rings_with_atom(a).map(|i| self.rings[i].size()).min()
    }

    /// Index into [`RingInfo::systems`] of the ring system holding atom `a`.
    pub fn system_of_atom(&self, a: NodeIndex) -> Option<usize> {
        self.atom_system.get(a.index()).copied().flatten()
    }

    /// Number of relevant cycles: cycles that belong to at least one minimum cycle basis.
    /// Saturates at `u64::MAX`.
    pub fn relevant_cycle_count(&self) -> u64 {
        self.relevant_cycles
    }

    /// Whether the smallest set of smallest rings is the only possible choice, i.e. the relevant
    /// cycles are exactly as many as the rings. The multiset of ring sizes is the same for every
    /// choice; which rings are picked is not (cubane, C60, bicyclo\[2.2.2\]octane).
    pub fn sssr_is_unique(&self) -> bool {
        self.relevant_cycles == self.rings.len() as u64
    }
}
