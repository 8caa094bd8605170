//! Kekulization: assigns alternating bond orders to aromatic input by a perfect matching.
//!
//! The atoms that need a double bond are the aromatic atoms whose valence leaves exactly one
//! unit free once bonds, hydrogens and radical electrons are counted (c in benzene, n in
//! pyridine, [n+] in pyridinium by the isoelectronic rule; not o, s, [nH] or [cH-]). The
//! candidate double bonds are the aromatic ring bonds between two such atoms; a bond that
//! joins two rings (the middle bond of biphenyl) stays single. A perfect matching over those
//! atoms picks the double bonds; without one the structure has no Kekulé form.
//!
//! ```
//! let benzene = ringheat::molecule::parse_smiles("c1ccccc1").unwrap();
//! let doubles = benzene
//!     .graph
//!     .edge_weights()
//!     .filter(|b| b.order == ringheat::molecule::BondOrder::Double)
//!     .count();
//! assert_eq!(doubles, 3);
//! ```

mod matching;

use petgraph::graph::{EdgeIndex, NodeIndex, UnGraph};
use petgraph::visit::EdgeRef;

use super::graph::{Atom, Bond, BondOrder, Molecule};
use super::smiles::allowed_valences;

/// No aromatic double-bond pattern exists; `atom` belongs to the aromatic system that fails.
#[derive(Debug, Clone, Copy, PartialEq, Eq, thiserror::Error)]
#[error("aromatic atom {} cannot be given a double bond", atom.index())]
pub struct KekulizeError {
    /// An atom left without a double bond.
    pub atom: NodeIndex,
}

/// Turns single aromatic ring bonds into a Kekulé pattern of single and double bonds.
///
/// Aromatic flags on atoms and bonds stay as they are. Bonds that already carry a double
/// order are respected, so a molecule kekulized once is left unchanged by a second call.
pub fn kekulize(mol: &mut Molecule) -> Result<(), KekulizeError> {
    if !mol.graph.node_weights().any(|a| a.aromatic) {
        return Ok(());
    }
    let n = mol.graph.node_count();
    let mut local = vec![usize::MAX; n];
    let mut pi_atoms = Vec::new();
    for node in mol.graph.node_indices() {
        if needs_double_bond(mol, node) {
            local[node.index()] = pi_atoms.len();
            pi_atoms.push(node);
        }
    }
    if pi_atoms.is_empty() {
        return Ok(());
    }
    let in_ring = ring_bonds(&mol.graph);
    let mut edges = Vec::new();
    let mut edge_ids = Vec::new();
    for e in mol.graph.edge_references() {
        let (a, b) = (local[e.source().index()], local[e.target().index()]);
        let bond = e.weight();
        if a != usize::MAX
            && b != usize::MAX
            && bond.aromatic
            && bond.order == BondOrder::Single
            && in_ring[e.id().index()]
        {
            edges.push((a, b));
            edge_ids.push(e.id());
        }
    }
    let adjacency = matching::Adjacency::new(pi_atoms.len(), &edges);
    let mate =
        matching::perfect_matching(&adjacency).map_err(|v| KekulizeError { atom: pi_atoms[v] })?;
    for (&(a, b), &id) in edges.iter().zip(&edge_ids) {
        if mate[a] == b {
            mol.graph[id].order = BondOrder::Double;
        }
    }
    Ok(())
}

/// Chooses the double bonds among `bonds` afresh: every one of them is made single, then a
/// perfect matching of their atoms (taken in node order) picks the doubles. The bonds must be
/// the resonant bonds of a Kekulé structure (every atom of them carries exactly one double bond
/// among them), so a matching exists; if none is found the orders are left as they were. The
/// choice depends only on the graph and its atom order, so a canonically ordered molecule gets
/// a canonical Kekulé structure.
pub(crate) fn rematch_double_bonds(mol: &mut Molecule, bonds: &[EdgeIndex]) {
    let mut local = vec![usize::MAX; mol.atom_count()];
    let mut atoms: Vec<NodeIndex> = bonds
        .iter()
        .filter_map(|&e| mol.graph.edge_endpoints(e))
        .flat_map(|(a, b)| [a, b])
        .collect();
    atoms.sort_unstable();
    atoms.dedup();
    for (k, a) in atoms.iter().enumerate() {
        local[a.index()] = k;
    }
    let mut sorted = bonds.to_vec();
    sorted.sort_unstable();
    let edges: Vec<(usize, usize)> = sorted
        .iter()
        .filter_map(|&e| mol.graph.edge_endpoints(e))
        .map(|(a, b)| (local[a.index()], local[b.index()]))
        .collect();
    let adjacency = matching::Adjacency::new(atoms.len(), &edges);
    let Ok(mate) = matching::perfect_matching(&adjacency) else {
        return;
    };
    for (&(a, b), &e) in edges.iter().zip(&sorted) {
        mol.graph[e].order = if mate[a] == b {
            BondOrder::Double
        } else {
            BondOrder::Single
        };
    }
}

/// Whether the aromatic atom `node` has exactly one valence unit left for a pi double bond.
fn needs_double_bond(mol: &Molecule, node: NodeIndex) -> bool {
    let atom: &Atom = &mol.graph[node];
    if !atom.aromatic {
        return false;
    }
    let Some(valences) = allowed_valences(atom.element, atom.charge) else {
        return false;
    };
    let used =
        mol.bond_valence(node) + u32::from(atom.hydrogens) + u32::from(atom.radical_electrons);
    valences
        .iter()
        .map(|&v| u32::from(v))
        .find(|&v| v >= used)
        .is_some_and(|v| v > used)
}

/// For each edge, whether it lies on a ring (is not a bridge). Iterative lowlink search
/// (R. E. Tarjan, SIAM J. Comput. 1 (1972) 146), so deep chains cost heap, not stack.
pub(crate) fn ring_bonds(graph: &UnGraph<Atom, Bond>) -> Vec<bool> {
    let n = graph.node_count();
    let mut in_ring = vec![true; graph.edge_count()];
    let mut order = vec![0usize; n];
    let mut low = vec![0usize; n];
    let mut clock = 0;
    let mut stack: Vec<(
        NodeIndex,
        Option<EdgeIndex>,
        petgraph::graph::Edges<'_, Bond, _>,
    )> = Vec::new();
    for start in graph.node_indices() {
        if order[start.index()] != 0 {
            continue;
        }
        clock += 1;
        order[start.index()] = clock;
        low[start.index()] = clock;
        stack.push((start, None, graph.edges(start)));
        while let Some(top) = stack.last_mut() {
            let (v, via) = (top.0, top.1);
            match top.2.next() {
                Some(e) => {
                    if Some(e.id()) == via {
                        continue;
                    }
                    let w = if e.source() == v {
                        e.target()
                    } else {
                        e.source()
                    };
                    if order[w.index()] == 0 {
                        clock += 1;
                        order[w.index()] = clock;
                        low[w.index()] = clock;
                        stack.push((w, Some(e.id()), graph.edges(w)));
                    } else {
                        low[v.index()] = low[v.index()].min(order[w.index()]);
                    }
                }
                None => {
                    stack.pop();
                    if let (Some(parent), Some(edge)) = (stack.last(), via) {
                        let p = parent.0.index();
                        low[p] = low[p].min(low[v.index()]);
                        if low[v.index()] > order[p] {
                            in_ring[edge.index()] = false;
                        }
                    }
                }
            }
        }
    }
    in_ring
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::element::Element;

    fn chain_with_ring() -> UnGraph<Atom, Bond> {
        // 0-1-2-0 triangle with a tail 2-3.
        let mut g = UnGraph::new_undirected();
        let n: Vec<_> = (0..4).map(|_| g.add_node(Atom::new(Element::C))).collect();
        for (a, b) in [(0, 1), (1, 2), (2, 0), (2, 3)] {
            g.add_edge(n[a], n[b], Bond::new(BondOrder::Single));
        }
        g
    }

    #[test]
    fn bridges_are_not_ring_bonds() {
        assert_eq!(
            ring_bonds(&chain_with_ring()),
            vec![true, true, true, false]
        );
    }
}
