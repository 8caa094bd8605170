//! Minimum cycle basis and relevant cycles of a molecular graph, after P. Vismara,
//! "Union of all the minimum cycle bases of a graph", Electron. J. Combin. 4 (1997) R9.
//!
//! The graph is first pruned to its 2-core (atoms on no cycle, hydrogens among them, never
//! matter). For every root `r`, a breadth-first search inside the vertices ordered no later than
//! `r` yields candidate cycles ("prototypes"): two shortest paths from `r` of equal length closed
//! by an edge (odd cycles) or by a common neighbour (even cycles). Candidates are taken in order
//! of length and tested by Gaussian elimination over GF(2) edge vectors: a candidate independent
//! of all strictly shorter cycles is relevant, and one independent of all cycles kept so far
//! joins the basis. Each relevant prototype stands for a family of
//! `paths(r, y) * paths(r, z)` relevant cycles (the other shortest-path combinations), which
//! gives the number of relevant cycles without listing them.

use std::collections::VecDeque;

use petgraph::graph::{EdgeIndex, NodeIndex};
use petgraph::visit::EdgeRef;

use crate::molecule::Molecule;

/// A cycle of the basis: atoms in cyclic order and the bonds between consecutive atoms.
pub(super) struct BasisCycle {
    pub atoms: Vec<NodeIndex>,
    pub bonds: Vec<EdgeIndex>,
}

/// The result of the cycle-basis search.
pub(super) struct CycleBasis {
    /// A minimum cycle basis, shortest cycles first.
    pub cycles: Vec<BasisCycle>,
    /// Number of relevant cycles (saturating).
    pub relevant_cycles: u64,
}

/// The 2-core of the molecule, with local indices for atoms and bonds.
struct Core {
    nodes: Vec<NodeIndex>,
    /// For each local atom: (neighbour, local bond index).
    adjacency: Vec<Vec<(usize, usize)>>,
    edges: Vec<EdgeIndex>,
}

impl Core {
    /// Prunes atoms of degree 0 or 1 repeatedly; self-loops and repeated bonds are ignored.
    fn of(mol: &Molecule) -> Core {
        let n = mol.atom_count();
        let mut neighbours: Vec<Vec<(usize, EdgeIndex)>> = vec![Vec::new(); n];
        for e in mol.graph.edge_references() {
            let (a, b) = (e.source().index(), e.target().index());
            if a == b || neighbours[a].iter().any(|&(x, _)| x == b) {
                continue;
            }
            neighbours[a].push((b, e.id()));
            neighbours[b].push((a, e.id()));
        }
        let mut degree: Vec<usize> = neighbours.iter().map(Vec::len).collect();
        let mut removed = vec![false; n];
        let mut queue: Vec<usize> = (0..n).filter(|&v| degree[v] < 2).collect();
        while let Some(v) = queue.pop() {
            if removed[v] {
                continue;
            }
            removed[v] = true;
            for &(u, _) in &neighbours[v] {
                if !removed[u] {
                    degree[u] -= 1;
                    if degree[u] < 2 {
                        queue.push(u);
                    }
                }
            }
        }
        let mut local = vec![usize::MAX; n];
        let mut nodes = Vec::new();
        for v in 0..n {
            if !removed[v] {
                local[v] = nodes.len();
                nodes.push(NodeIndex::new(v));
            }
        }
        let mut adjacency = vec![Vec::new(); nodes.len()];
        let mut edges = Vec::new();
        for (lv, &gv) in nodes.iter().enumerate() {
            for &(u, e) in &neighbours[gv.index()] {
                let lu = local[u];
                if lu != usize::MAX && lv < lu {
                    let id = edges.len();
                    edges.push(e);
                    adjacency[lv].push((lu, id));
                    adjacency[lu].push((lv, id));
                }
            }
        }
        Core {
            nodes,
            adjacency,
            edges,
        }
    }

    fn edge_between(&self, a: usize, b: usize) -> Option<usize> {
        self.adjacency[a]
            .iter()
            .find(|&&(u, _)| u == b)
            .map(|&(_, e)| e)
    }
}

/// Shortest paths from a root inside the vertices `0..=root`.
struct RootedPaths {
    distance: Vec<u32>,
    predecessor: Vec<usize>,
    path_count: Vec<u64>,
}

const UNREACHED: u32 = u32::MAX;

impl RootedPaths {
    fn search(core: &Core, root: usize) -> RootedPaths {
        let n = core.nodes.len();
        let mut distance = vec![UNREACHED; n];
        let mut predecessor = vec![usize::MAX; n];
        let mut path_count = vec![0u64; n];
        distance[root] = 0;
        path_count[root] = 1;
        let mut queue = VecDeque::from([root]);
        while let Some(v) = queue.pop_front() {
            for &(u, _) in &core.adjacency[v] {
                if u > root {
                    continue;
                }
                if distance[u] == UNREACHED {
                    distance[u] = distance[v] + 1;
                    predecessor[u] = v;
                    queue.push_back(u);
                }
                if distance[u] == distance[v] + 1 {
                    path_count[u] = path_count[u].saturating_add(path_count[v]);
                }
            }
        }
        RootedPaths {
            distance,
            predecessor,
            path_count,
        }
    }

    /// Whether the chosen shortest paths from the root to `a` and to `b` (equal lengths) meet
    /// only at the root. Shortest paths that share an atom reach it at the same depth.
    fn disjoint(&self, mut a: usize, mut b: usize, root: usize) -> bool {
        while a != root {
            if a == b {
                return false;
            }
            a = self.predecessor[a];
            b = self.predecessor[b];
        }
        true
    }

    /// Atoms from `v` back towards the root, `v` first, the root left out.
    fn path_below_root(&self, mut v: usize, root: usize) -> Vec<usize> {
        let mut out = Vec::new();
        while v != root {
            out.push(v);
            v = self.predecessor[v];
        }
        out
    }

    /// Atoms from the root to `v`, both included.
    fn path_from_root(&self, v: usize, root: usize) -> Vec<usize> {
        let mut out = self.path_below_root(v, root);
        out.push(root);
        out.reverse();
        out
    }
}

/// A candidate cycle with its GF(2) bond vector and its family size.
struct Candidate {
    atoms: Vec<usize>,
    bits: Vec<u64>,
    family: u64,
}

fn candidates(core: &Core) -> Vec<Candidate> {
    let words = core.edges.len().div_ceil(64);
    let mut out = Vec::new();
    let mut make = |atoms: Vec<usize>, family: u64| {
        let mut bits = vec![0u64; words];
        for i in 0..atoms.len() {
            let (a, b) = (atoms[i], atoms[(i + 1) % atoms.len()]);
            if let Some(e) = core.edge_between(a, b) {
                bits[e / 64] |= 1 << (e % 64);
            }
        }
        out.push(Candidate {
            atoms,
            bits,
            family,
        });
    };
    for root in 0..core.nodes.len() {
        let paths = RootedPaths::search(core, root);
        for y in 0..=root {
            let dy = paths.distance[y];
            if dy == UNREACHED || dy == 0 {
                continue;
            }
            // Odd cycles: an edge y-z between two atoms at the same depth.
            for &(z, _) in &core.adjacency[y] {
                if z < y && paths.distance[z] == dy && paths.disjoint(y, z, root) {
                    let mut atoms = paths.path_from_root(y, root);
                    atoms.extend(paths.path_below_root(z, root));
                    make(
                        atoms,
                        paths.path_count[y].saturating_mul(paths.path_count[z]),
                    );
                }
            }
            // Even cycles: y is the far atom p, closed through two of its neighbours one step
            // nearer the root.
            let nearer: Vec<usize> = core.adjacency[y]
                .iter()
                .map(|&(u, _)| u)
                .filter(|&u| u <= root && paths.distance[u] == dy - 1)
                .collect();
            for (i, &a) in nearer.iter().enumerate() {
                for &b in &nearer[i + 1..] {
                    if paths.disjoint(a, b, root) {
                        let mut atoms = paths.path_from_root(a, root);
                        atoms.push(y);
                        atoms.extend(paths.path_below_root(b, root));
                        make(
                            atoms,
                            paths.path_count[a].saturating_mul(paths.path_count[b]),
                        );
                    }
                }
            }
        }
    }
    out.sort_by_key(|c| c.atoms.len());
    out
}

/// Row-echelon basis over GF(2); each row is reduced by all earlier rows.
struct EchelonBasis {
    rows: Vec<(usize, Vec<u64>)>,
}

impl EchelonBasis {
    /// Reduces `v` by the first `upto` rows.
    fn reduce(&self, v: &mut [u64], from: usize, upto: usize) {
        for (pivot, row) in &self.rows[from..upto] {
            if v[pivot / 64] >> (pivot % 64) & 1 == 1 {
                for (x, r) in v.iter_mut().zip(row) {
                    *x ^= r;
                }
            }
        }
    }

    fn push(&mut self, v: Vec<u64>) {
        if let Some(pivot) = lowest_bit(&v) {
            self.rows.push((pivot, v));
        }
    }
}

fn lowest_bit(v: &[u64]) -> Option<usize> {
    v.iter()
        .enumerate()
        .find(|(_, w)| **w != 0)
        .map(|(i, w)| i * 64 + w.trailing_zeros() as usize)
}

/// Rotates a cycle so that its smallest atom comes first and its second atom is the smaller
/// of that atom's two cycle neighbours, so that output does not depend on search order.
fn normalise(atoms: &mut [NodeIndex]) {
    let Some(start) = (0..atoms.len()).min_by_key(|&i| atoms[i]) else {
        return;
    };
    atoms.rotate_left(start);
    if atoms.len() > 2 && atoms[atoms.len() - 1] < atoms[1] {
        atoms[1..].reverse();
    }
}

/// Computes a minimum cycle basis and the number of relevant cycles.
pub(super) fn minimum_cycle_basis(mol: &Molecule) -> CycleBasis {
    let core = Core::of(mol);
    let mut basis = EchelonBasis { rows: Vec::new() };
    let mut cycles = Vec::new();
    let mut relevant_cycles = 0u64;
    let candidates = candidates(&core);
    let mut shorter = 0;
    let mut current_length = 0;
    for c in candidates {
        if c.atoms.len() != current_length {
            current_length = c.atoms.len();
            shorter = basis.rows.len();
        }
        let mut v = c.bits.clone();
        basis.reduce(&mut v, 0, shorter);
        if v.iter().all(|&w| w == 0) {
            continue;
        }
        relevant_cycles = relevant_cycles.saturating_add(c.family);
        basis.reduce(&mut v, shorter, basis.rows.len());
        if v.iter().any(|&w| w != 0) {
            basis.push(v);
            let mut atoms: Vec<NodeIndex> = c.atoms.iter().map(|&a| core.nodes[a]).collect();
            normalise(&mut atoms);
            let bonds = (0..atoms.len())
                .filter_map(|i| mol.graph.find_edge(atoms[i], atoms[(i + 1) % atoms.len()]))
                .collect();
            cycles.push(BasisCycle { atoms, bonds });
        }
    }
    CycleBasis {
        cycles,
        relevant_cycles,
    }
}
