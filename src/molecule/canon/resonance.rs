//! Resonant bonds: bonds whose order differs between Kekulé structures of the same molecule.
//!
//! The double bonds of a Kekulé structure form a perfect matching M on the atoms that carry
//! exactly one double bond. Another Kekulé structure differs from M along M-alternating cycles,
//! so a bond changes order between structures exactly when it lies on such a cycle. A single
//! bond u-v lies on one when the matching without u and v can be repaired, i.e. when an
//! augmenting path joins the freed partners of u and v; the path search is Edmonds' blossom
//! method (J. Edmonds, Can. J. Math. 17 (1965) 449), written here from the textbook idea.
//! The result does not depend on which Kekulé structure the input used.

use super::prepare::PreparedBond;
use crate::molecule::element::Element;
use crate::molecule::graph::{Atom, BondOrder};

const NONE: usize = usize::MAX;

/// Lowest valence of `element` with `charge` by the isoelectronic rule, for the elements that
/// may be written in lower case; `None` for the others.
fn lowest_valence(element: Element, charge: i8) -> Option<i16> {
    let c = i16::from(charge);
    match element.atomic_number() {
        5 => Some(3 - c),
        6 => Some(4 - c.abs()),
        7 | 15 | 33 => Some(3 + c),
        8 | 16 | 34 => Some(2 + c),
        _ => None,
    }
}

/// Whether `atom` takes part in pi resonance: exactly one double bond, no triple bond, and
/// its lowest valence asks for exactly that one extra unit (so a lower-case spelling of it
/// reads back with the same hydrogens and charge).
fn pi_atom(atom: &Atom, i: usize, adj: &[Vec<(usize, usize)>], bonds: &[PreparedBond]) -> bool {
    let mut doubles = 0;
    for &(_, e) in &adj[i] {
        match bonds[e].order {
            BondOrder::Single => {}
            BondOrder::Double => doubles += 1,
            _ => return false,
        }
    }
    if doubles != 1 || atom.radical_electrons != 0 {
        return false;
    }
    let sigma = adj[i].len() as i16 + i16::from(atom.hydrogens);
    lowest_valence(atom.element, atom.charge) == Some(sigma + 1)
}

/// Per bond: whether it is resonant.
pub(crate) fn resonant_bonds(
    atoms: &[Atom],
    adj: &[Vec<(usize, usize)>],
    bonds: &[PreparedBond],
) -> Vec<bool> {
    let mut result = vec![false; bonds.len()];
    let mut pi: Vec<bool> = (0..atoms.len())
        .map(|i| pi_atom(&atoms[i], i, adj, bonds))
        .collect();
    // Both ends of a matched bond must be pi atoms.
    for b in bonds {
        if b.order == BondOrder::Double && pi[b.a] != pi[b.b] {
            pi[b.a] = false;
            pi[b.b] = false;
        }
    }
    let local: Vec<usize> = (0..atoms.len()).filter(|&i| pi[i]).collect();
    if local.len() < 4 {
        return result;
    }
    let mut index = vec![NONE; atoms.len()];
    for (k, &i) in local.iter().enumerate() {
        index[i] = k;
    }
    let n = local.len();
    let mut g: Vec<Vec<(usize, usize)>> = vec![Vec::new(); n];
    let mut mate = vec![NONE; n];
    for (e, b) in bonds.iter().enumerate() {
        let (u, v) = (index[b.a], index[b.b]);
        if u == NONE || v == NONE || !b.ring {
            continue;
        }
        g[u].push((v, e));
        g[v].push((u, e));
    }
    for b in bonds {
        if b.order == BondOrder::Double && index[b.a] != NONE {
            mate[index[b.a]] = index[b.b];
            mate[index[b.b]] = index[b.a];
        }
    }
    let mut search = Blossom::new(n);
    for u in 0..n {
        for k in 0..g[u].len() {
            let (v, e) = g[u][k];
            if v < u || mate[u] == v || result[e] {
                continue;
            }
            let (pu, pv) = (mate[u], mate[v]);
            if pu == NONE || pv == NONE {
                continue;
            }
            mate[pu] = NONE;
            mate[pv] = NONE;
            let found = search.augmenting_path(&g, &mate, pu, [u, v]);
            if let Some(end) = found {
                result[e] = true;
                // Walk the path back to the root and mark its unmatched bonds.
                let mut cur = end;
                while cur != NONE {
                    let prev = search.parent[cur];
                    if let Some(&(_, pe)) = g[cur].iter().find(|&&(w, _)| w == prev) {
                        result[pe] = true;
                    }
                    cur = mate[prev];
                }
            }
            mate[pu] = u;
            mate[pv] = v;
        }
    }
    // A double bond is resonant when an unmatched resonant bond touches either end.
    let mut touched = vec![false; atoms.len()];
    for (e, b) in bonds.iter().enumerate() {
        if result[e] && b.order == BondOrder::Single {
            touched[b.a] = true;
            touched[b.b] = true;
        }
    }
    for (e, b) in bonds.iter().enumerate() {
        if b.order == BondOrder::Double && index[b.a] != NONE && (touched[b.a] || touched[b.b]) {
            result[e] = true;
        }
    }
    result
}

/// Work arrays for one augmenting-path search in a general graph.
struct Blossom {
    parent: Vec<usize>,
    base: Vec<usize>,
    used: Vec<bool>,
    in_blossom: Vec<bool>,
    queue: Vec<usize>,
}

impl Blossom {
    fn new(n: usize) -> Blossom {
        Blossom {
            parent: vec![NONE; n],
            base: (0..n).collect(),
            used: vec![false; n],
            in_blossom: vec![false; n],
            queue: Vec::with_capacity(n),
        }
    }

    /// Searches an augmenting path from the free vertex `root`, never entering `removed`.
    /// Returns the free vertex where it ends; the path follows `parent` and `mate` back.
    fn augmenting_path(
        &mut self,
        g: &[Vec<(usize, usize)>],
        mate: &[usize],
        root: usize,
        removed: [usize; 2],
    ) -> Option<usize> {
        let n = g.len();
        self.parent.fill(NONE);
        self.used.fill(false);
        for (i, b) in self.base.iter_mut().enumerate() {
            *b = i;
        }
        self.queue.clear();
        self.queue.push(root);
        self.used[root] = true;
        let mut head = 0;
        while head < self.queue.len() {
            let v = self.queue[head];
            head += 1;
            for &(to, _) in &g[v] {
                if removed.contains(&to) || self.base[v] == self.base[to] || mate[v] == to {
                    continue;
                }
                if to == root || (mate[to] != NONE && self.parent[mate[to]] != NONE) {
                    let cur = self.common_base(mate, root, v, to);
                    self.in_blossom.fill(false);
                    self.mark_path(mate, v, cur, to);
                    self.mark_path(mate, to, cur, v);
                    for i in 0..n {
                        if self.in_blossom[self.base[i]] {
                            self.base[i] = cur;
                            if !self.used[i] {
                                self.used[i] = true;
                                self.queue.push(i);
                            }
                        }
                    }
                } else if self.parent[to] == NONE {
                    self.parent[to] = v;
                    if mate[to] == NONE {
                        return Some(to);
                    }
                    self.used[mate[to]] = true;
                    self.queue.push(mate[to]);
                }
            }
        }
        None
    }

    /// The base of the blossom closed by the edge a-b.
    fn common_base(&self, mate: &[usize], root: usize, mut a: usize, mut b: usize) -> usize {
        let mut seen = vec![false; mate.len()];
        loop {
            a = self.base[a];
            seen[a] = true;
            if a == root || mate[a] == NONE {
                break;
            }
            a = self.parent[mate[a]];
        }
        loop {
            b = self.base[b];
            if seen[b] {
                return b;
            }
            b = self.parent[mate[b]];
        }
    }

    /// Marks the blossom path from `v` down to base `b`, re-pointing parents through `child`.
    fn mark_path(&mut self, mate: &[usize], mut v: usize, b: usize, mut child: usize) {
        while self.base[v] != b {
            self.in_blossom[self.base[v]] = true;
            self.in_blossom[self.base[mate[v]]] = true;
            self.parent[v] = child;
            child = mate[v];
            v = self.parent[mate[v]];
        }
    }
}

/// Per bond of `mol` (by edge index): whether its order differs between Kekulé structures,
/// by the rule of [`resonant_bonds`], on the molecule as it is (hydrogen nodes kept).
pub(crate) fn resonant_bonds_of(mol: &crate::molecule::Molecule) -> Vec<bool> {
    use petgraph::visit::EdgeRef;
    let atoms: Vec<Atom> = mol.graph.node_weights().cloned().collect();
    let ring = crate::molecule::kekulize::ring_bonds(&mol.graph);
    let mut adj = vec![Vec::new(); atoms.len()];
    let mut bonds = Vec::with_capacity(mol.bond_count());
    for e in mol.graph.edge_references() {
        let (a, b) = (e.source().index(), e.target().index());
        adj[a].push((b, bonds.len()));
        adj[b].push((a, bonds.len()));
        bonds.push(PreparedBond {
            a,
            b,
            order: e.weight().order,
            resonant: false,
            ring: ring[e.id().index()],
            direction: None,
        });
    }
    resonant_bonds(&atoms, &adj, &bonds)
}
