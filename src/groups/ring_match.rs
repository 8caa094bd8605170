//! Ring corrections: the skeleton of each ring system, and its match in the ring tables.
//!
//! A skeleton is the ring system's atoms (element), the bonds between them (order, or aromatic),
//! and exocyclic atoms joined to it by a non-aromatic double bond (=O, =CH2, =S, =N). Hydrogens and other
//! substituents do not count. Rings made only of aromatic carbons (benzenoid six-rings) are left
//! out, since Benson's `Cb`/`Cbf` groups already carry them; a ring fused to one keeps the shared
//! aromatic bond, its two ends marked as benzo-fused. Nothing in a skeleton depends on the
//! Kekulé structure: aromatic bonds have one label, and a double bond into an aromatic ring is
//! not an exocyclic atom. Table entries are matched by graph isomorphism of skeletons.

use std::collections::HashMap;

use petgraph::graph::{NodeIndex, UnGraph};

use crate::molecule::aromaticity::is_benzenoid_ring;
use crate::molecule::{BondOrder, Element, PerceivedMolecule};

/// An atom of a ring skeleton.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub struct SkeletonAtom {
    /// Element of the atom.
    pub element: Element,
    /// False for an exocyclic double-bonded atom.
    pub in_ring: bool,
    /// Whether the atom also belongs to a benzenoid ring left out of the skeleton (the ends
    /// of a bond shared with a benzo ring), so that quinoline's pyridine ring is not pyridine.
    pub benzo_fused: bool,
}

/// A bond of a ring skeleton.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum SkeletonBond {
    /// A bond of the given Kekulé order outside any aromatic ring.
    Order(BondOrder),
    /// A bond of a perceived aromatic ring.
    Aromatic,
}

/// Atom count, bond count and sorted atom labels of a skeleton.
pub type SkeletonSignature = (usize, usize, Vec<(u8, bool, bool)>);

/// The skeleton of one ring system of a molecule.
#[derive(Debug, Clone)]
pub struct RingSkeleton {
    /// The skeleton graph.
    pub graph: UnGraph<SkeletonAtom, SkeletonBond>,
    /// Indices (into the molecule's SSSR) of the rings that make it up.
    pub rings: Vec<usize>,
    /// The molecule's atoms in the ring system (ring atoms only).
    pub atoms: Vec<NodeIndex>,
}

impl RingSkeleton {
    /// Number of ring atoms.
    pub fn ring_atom_count(&self) -> usize {
        self.graph.node_weights().filter(|a| a.in_ring).count()
    }

    /// A cheap invariant used to pre-filter candidates before the isomorphism test.
    pub fn signature(&self) -> SkeletonSignature {
        let mut labels: Vec<(u8, bool, bool)> = self
            .graph
            .node_weights()
            .map(|a| (a.element.atomic_number(), a.in_ring, a.benzo_fused))
            .collect();
        labels.sort_unstable();
        (self.graph.node_count(), self.graph.edge_count(), labels)
    }

    /// Whether two skeletons are the same labelled graph.
    pub fn same_as(&self, other: &RingSkeleton) -> bool {
        self.signature() == other.signature() && self.isomorphic_to(other)
    }

    /// Whether two skeletons are the same labelled graph (no pre-filter).
    pub fn isomorphic_to(&self, other: &RingSkeleton) -> bool {
        petgraph::algo::is_isomorphic_matching(
            &self.graph,
            &other.graph,
            |a, b| a == b,
            |a, b| a == b,
        )
    }

    /// The same skeleton with every atom carbon (the first fallback for an unlisted ring).
    pub fn all_carbon(&self) -> RingSkeleton {
        let mut s = self.clone();
        for a in s.graph.node_weights_mut() {
            a.element = Element::C;
        }
        s
    }

    /// Only the ring atoms, all carbon, all bonds single: the cycloalkane of the same shape.
    pub fn saturated_carbon(&self) -> RingSkeleton {
        let mut graph = UnGraph::new_undirected();
        let mut map = HashMap::new();
        for n in self.graph.node_indices() {
            if self.graph[n].in_ring {
                let m = graph.add_node(SkeletonAtom {
                    element: Element::C,
                    in_ring: true,
                    benzo_fused: self.graph[n].benzo_fused,
                });
                map.insert(n, m);
            }
        }
        for e in self.graph.edge_indices() {
            if let Some((a, b)) = self.graph.edge_endpoints(e) {
                if let (Some(x), Some(y)) = (map.get(&a), map.get(&b)) {
                    graph.add_edge(*x, *y, SkeletonBond::Order(BondOrder::Single));
                }
            }
        }
        RingSkeleton {
            graph,
            rings: self.rings.clone(),
            atoms: self.atoms.clone(),
        }
    }
}

/// Whether SSSR ring `r` is a benzenoid ring (six aromatic carbons).
pub fn is_benzenoid(p: &PerceivedMolecule, r: usize) -> bool {
    is_benzenoid_ring(&p.mol, &p.rings.rings[r])
}

/// Builds the skeleton spanned by the given SSSR rings.
pub fn skeleton_of_rings(p: &PerceivedMolecule, rings: &[usize]) -> RingSkeleton {
    let mol = &p.mol;
    let mut benzo = vec![false; mol.atom_count()];
    for r in (0..p.rings.rings.len()).filter(|&r| is_benzenoid(p, r)) {
        for a in &p.rings.rings[r].atoms {
            benzo[a.index()] = true;
        }
    }
    let mut graph = UnGraph::new_undirected();
    let mut map: HashMap<NodeIndex, NodeIndex> = HashMap::new();
    let mut atoms = Vec::new();
    let mut edges = Vec::new();
    for &r in rings {
        let ring = &p.rings.rings[r];
        for &a in &ring.atoms {
            if let std::collections::hash_map::Entry::Vacant(v) = map.entry(a) {
                v.insert(graph.add_node(SkeletonAtom {
                    element: mol.atom(a).element,
                    in_ring: true,
                    benzo_fused: benzo[a.index()],
                }));
                atoms.push(a);
            }
        }
        for &e in &ring.bonds {
            if !edges.contains(&e) {
                edges.push(e);
            }
        }
    }
    let label = |bond: &crate::molecule::Bond| {
        if bond.aromatic {
            SkeletonBond::Aromatic
        } else {
            SkeletonBond::Order(bond.order)
        }
    };
    for e in edges {
        if let Some((a, b)) = mol.graph.edge_endpoints(e) {
            graph.add_edge(map[&a], map[&b], label(&mol.graph[e]));
        }
    }
    for &a in &atoms {
        for (n, bond) in mol.neighbours(a) {
            // A double bond into a neighbouring aromatic ring is a Kekulé choice, not a
            // substituent: it is left out, so the skeleton does not follow the Kekulé form.
            if bond.order == BondOrder::Double && !bond.aromatic && !map.contains_key(&n) {
                let x = graph.add_node(SkeletonAtom {
                    element: mol.atom(n).element,
                    in_ring: false,
                    benzo_fused: false,
                });
                graph.add_edge(map[&a], x, label(bond));
            }
        }
    }
    RingSkeleton {
        graph,
        rings: rings.to_vec(),
        atoms,
    }
}

/// The skeletons of all ring systems that need a ring correction (benzenoid rings left out).
pub fn correction_skeletons(p: &PerceivedMolecule) -> Vec<RingSkeleton> {
    let candidates: Vec<usize> = (0..p.rings.rings.len())
        .filter(|&r| !is_benzenoid(p, r))
        .collect();
    // Union rings that share an atom.
    let mut parent: Vec<usize> = (0..candidates.len()).collect();
    fn find(parent: &mut [usize], x: usize) -> usize {
        let mut r = x;
        while parent[r] != r {
            r = parent[r];
        }
        let mut y = x;
        while parent[y] != r {
            let next = parent[y];
            parent[y] = r;
            y = next;
        }
        r
    }
    for i in 0..candidates.len() {
        for j in (i + 1)..candidates.len() {
            let ri = &p.rings.rings[candidates[i]];
            let rj = &p.rings.rings[candidates[j]];
            if ri.atoms.iter().any(|a| rj.atoms.contains(a)) {
                let (a, b) = (find(&mut parent, i), find(&mut parent, j));
                parent[a] = b;
            }
        }
    }
    let mut systems: Vec<(usize, Vec<usize>)> = Vec::new();
    for (i, &ring) in candidates.iter().enumerate() {
        let root = find(&mut parent, i);
        match systems.iter_mut().find(|(r, _)| *r == root) {
            Some((_, rings)) => rings.push(ring),
            None => systems.push((root, vec![ring])),
        }
    }
    systems
        .into_iter()
        .map(|(_, rings)| skeleton_of_rings(p, &rings))
        .collect()
}
