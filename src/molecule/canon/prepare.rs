//! The graph the canonical writer works on: hydrogens folded, bonds classified, stereo read.

use petgraph::graph::NodeIndex;
use petgraph::visit::EdgeRef;

use super::resonance::resonant_bonds;
use super::stereo::{read_double_bonds, read_tetrahedral, StereoSet};
use crate::molecule::element::Element;
use crate::molecule::graph::{Atom, BondDirection, BondOrder, Molecule, StereoNeighbour};

/// A bond of the prepared graph.
#[derive(Debug, Clone)]
pub(crate) struct PreparedBond {
    pub a: usize,
    pub b: usize,
    pub order: BondOrder,
    /// Single in some Kekulé structure and double in another (lies on an alternating cycle).
    pub resonant: bool,
    /// Part of a ring (not a bridge of the graph).
    pub ring: bool,
    /// Input direction mark: (atom read from, direction).
    pub direction: Option<(usize, BondDirection)>,
}

/// A molecule reduced to plain arrays for ranking and writing.
#[derive(Debug, Clone)]
pub(crate) struct Prepared {
    pub atoms: Vec<Atom>,
    /// Per atom: (neighbour, bond index).
    pub adj: Vec<Vec<(usize, usize)>>,
    pub bonds: Vec<PreparedBond>,
    pub resonant_atom: Vec<bool>,
    pub ring_atom: Vec<bool>,
    /// Stereo elements read from the input, relative to input order.
    pub stereo: StereoSet,
    /// The molecule with every plain hydrogen folded: its node `i` is atom `i` here and its
    /// edge `e` is bond `e` (nitro and halogen oxo groups charge-separated).
    pub folded: Molecule,
    /// For each atom of the input molecule, its atom here (`None` for a folded hydrogen).
    pub from_input: Vec<Option<NodeIndex>>,
}

impl Prepared {
    /// Folds hydrogens (also those named by stereo marks), classifies bonds and reads stereo.
    pub fn new(mol: &Molecule) -> Prepared {
        let (mut folded, from_input) = fold_all_hydrogens(mol);
        separate_charges(&mut folded);
        let atoms: Vec<Atom> = folded.graph.node_weights().cloned().collect();
        let mut adj = vec![Vec::new(); atoms.len()];
        let mut bonds = Vec::with_capacity(folded.bond_count());
        for e in folded.graph.edge_references() {
            let (a, b) = (e.source().index(), e.target().index());
            let idx = bonds.len();
            adj[a].push((b, idx));
            adj[b].push((a, idx));
            bonds.push(PreparedBond {
                a,
                b,
                order: e.weight().order,
                resonant: false,
                ring: false,
                direction: e.weight().direction.map(|(f, d)| (f.index(), d)),
            });
        }
        let ring = ring_bonds(&adj, bonds.len());
        let mut ring_atom = vec![false; atoms.len()];
        for (bond, &r) in bonds.iter_mut().zip(&ring) {
            bond.ring = r;
            if r {
                ring_atom[bond.a] = true;
                ring_atom[bond.b] = true;
            }
        }
        let resonant = resonant_bonds(&atoms, &adj, &bonds);
        let mut resonant_atom = vec![false; atoms.len()];
        for (bond, &r) in bonds.iter_mut().zip(&resonant) {
            bond.resonant = r;
            if r {
                resonant_atom[bond.a] = true;
                resonant_atom[bond.b] = true;
            }
        }
        let mut prepared = Prepared {
            atoms,
            adj,
            bonds,
            resonant_atom,
            ring_atom,
            stereo: StereoSet::default(),
            folded: Molecule::new(),
            from_input,
        };
        prepared.stereo = StereoSet {
            tetra: read_tetrahedral(&folded, &prepared),
            double: read_double_bonds(&prepared),
        };
        prepared.folded = folded;
        prepared
    }

    /// The bond between `a` and `b`, if any.
    pub fn bond_between(&self, a: usize, b: usize) -> Option<usize> {
        self.adj[a].iter().find(|&&(n, _)| n == b).map(|&(_, e)| e)
    }

    /// Sum of Kekulé bond orders at `atom` over bonds to nodes.
    pub fn bond_sum(&self, atom: usize) -> u32 {
        self.adj[atom]
            .iter()
            .map(|&(_, e)| u32::from(self.bonds[e].order.valence()))
            .sum()
    }
}

/// Whether node `i` is a plain hydrogen that can become an implicit hydrogen of its neighbour.
fn plain_hydrogen(mol: &Molecule, i: NodeIndex) -> Option<NodeIndex> {
    let a = mol.atom(i);
    if a.element != Element::H
        || a.isotope.is_some()
        || a.charge != 0
        || a.atom_class.is_some()
        || a.radical_electrons != 0
        || mol.degree(i) != 1
    {
        return None;
    }
    let (n, bond) = mol.neighbours(i).next()?;
    (bond.order == BondOrder::Single && mol.atom(n).element != Element::H).then_some(n)
}

/// Side of substituent `s` relative to double-bond end `e` implied by a direction mark:
/// `/` read from `s` towards `e` puts `s` below (-1), `\` puts it above (+1).
pub(crate) fn side_of(s: usize, direction: (usize, BondDirection)) -> i8 {
    let (from, dir) = direction;
    let up_from_s = (dir == BondDirection::Up) == (from == s);
    if up_from_s {
        -1
    } else {
        1
    }
}

/// Folds every plain hydrogen node, including those named by chiral centres (they become the
/// centre's implicit hydrogen) and those carrying the only `/` `\` mark at a double-bond end
/// (the mark moves to the other substituent, on the opposite side).
fn fold_all_hydrogens(mol: &Molecule) -> (Molecule, Vec<Option<NodeIndex>>) {
    let mut m = mol.clone();
    let plain: Vec<Option<NodeIndex>> = m.atoms().map(|i| plain_hydrogen(mol, i)).collect();
    for centre in &mut m.chiral_centres {
        for n in &mut centre.neighbours {
            if let StereoNeighbour::Atom(a) = *n {
                if plain[a.index()].is_some() {
                    *n = StereoNeighbour::ImplicitHydrogen;
                }
            }
        }
    }
    let marked: Vec<_> = m
        .graph
        .edge_references()
        .filter_map(|e| {
            let dir = e.weight().direction?;
            let (h, end) = if plain[e.source().index()].is_some() {
                (e.source(), e.target())
            } else if plain[e.target().index()].is_some() {
                (e.target(), e.source())
            } else {
                return None;
            };
            Some((h, end, dir))
        })
        .collect();
    for (h, end, dir) in marked {
        let has_double = m
            .graph
            .edges(end)
            .any(|e| e.weight().order == BondOrder::Double);
        if !has_double {
            continue;
        }
        let side = side_of(h.index(), (dir.0.index(), dir.1));
        let others: Vec<_> = m
            .graph
            .edges(end)
            .filter(|e| {
                let other = if e.source() == end {
                    e.target()
                } else {
                    e.source()
                };
                other != h && e.weight().order == BondOrder::Single
            })
            .map(|e| {
                let other = if e.source() == end {
                    e.target()
                } else {
                    e.source()
                };
                (e.id(), other)
            })
            .collect();
        for (edge, other) in others {
            if m.graph[edge].direction.is_none() {
                let dir = if side > 0 {
                    BondDirection::Up
                } else {
                    BondDirection::Down
                };
                m.graph[edge].direction = Some((other, dir));
            }
        }
    }
    m.with_hydrogens_folded_map()
}

/// Marks bonds that lie on a cycle (the non-bridges), by an iterative low-link search.
fn ring_bonds(adj: &[Vec<(usize, usize)>], bond_count: usize) -> Vec<bool> {
    let n = adj.len();
    let mut disc = vec![usize::MAX; n];
    let mut low = vec![0usize; n];
    let mut ring = vec![true; bond_count];
    let mut time = 0;
    for root in 0..n {
        if disc[root] != usize::MAX {
            continue;
        }
        disc[root] = time;
        low[root] = time;
        time += 1;
        // (atom, bond used to enter it, next neighbour position)
        let mut stack = vec![(root, usize::MAX, 0usize)];
        while let Some(top) = stack.last_mut() {
            let (v, via, pos) = *top;
            if let Some(&(w, e)) = adj[v].get(pos) {
                top.2 += 1;
                if e == via {
                    continue;
                }
                if disc[w] == usize::MAX {
                    disc[w] = time;
                    low[w] = time;
                    time += 1;
                    stack.push((w, e, 0));
                } else {
                    low[v] = low[v].min(disc[w]);
                }
            } else {
                stack.pop();
                if let Some(&(parent, _, _)) = stack.last() {
                    low[parent] = low[parent].min(low[v]);
                    if low[v] > disc[parent] {
                        ring[via] = false;
                    }
                }
            }
        }
    }
    ring
}

/// Writes a pentavalent nitro group `N(=O)=O` in its charge-separated form `[N+](=O)[O-]`, and
/// the oxo bonds of a neutral Cl, Br or I (`OI(=O)=O`) as `[I+2]([O-])[O-]`, so both spellings
/// of one molecule get one key (the forms RDKit and most tables use).
fn separate_charges(mol: &mut Molecule) {
    let atoms: Vec<NodeIndex> = mol.atoms().collect();
    for n in atoms {
        let element = mol.atom(n).element;
        let halogen = matches!(element, Element::CL | Element::BR | Element::I);
        if (element != Element::N && !halogen) || mol.atom(n).charge != 0 {
            continue;
        }
        let terminal_oxo: Vec<(NodeIndex, petgraph::graph::EdgeIndex)> = mol
            .graph
            .edges(n)
            .map(|e| {
                (
                    if e.source() == n {
                        e.target()
                    } else {
                        e.source()
                    },
                    e.id(),
                )
            })
            .filter(|&(o, b)| {
                let a = mol.atom(o);
                a.element == Element::O
                    && a.charge == 0
                    && a.hydrogens == 0
                    && mol.degree(o) == 1
                    && mol.graph[b].order == BondOrder::Double
            })
            .collect();
        let separated: &[(NodeIndex, petgraph::graph::EdgeIndex)] = if halogen {
            &terminal_oxo
        } else if terminal_oxo.len() == 2 {
            &terminal_oxo[1..]
        } else {
            &[]
        };
        for &(o, b) in separated {
            mol.graph[b].order = BondOrder::Single;
            mol.graph[o].charge = -1;
            mol.graph[n].charge += 1;
        }
    }
}
