//! The molecular graph: atoms and bonds on a petgraph undirected graph, plus stereo annotations.

use petgraph::graph::{EdgeIndex, NodeIndex, UnGraph};
use petgraph::visit::EdgeRef;

use super::element::Element;

/// Tetrahedral (and other) chirality as written in SMILES, relative to the neighbour order
/// stored in [`ChiralCentre::neighbours`].
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
pub enum ChiralTag {
    /// `@`: neighbours after the first are anticlockwise looking from the first.
    Anticlockwise,
    /// `@@`: clockwise.
    Clockwise,
    /// Another class (`@AL2`, `@SP3`, `@TB10`, `@OH25`, ...): kept, not interpreted. The
    /// parser reads `@TH1` and `@TH2` as `@` and `@@`, which they mean.
    Other { class: [u8; 2], number: u8 },
}

/// One neighbour of a chiral centre in SMILES order.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
pub enum StereoNeighbour {
    /// A neighbouring atom node.
    Atom(NodeIndex),
    /// The hydrogen written inside the centre's bracket (`[C@H]`), which has no node.
    ImplicitHydrogen,
}

/// A chiral centre: the atom, its tag, and its neighbours in the order the tag refers to.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct ChiralCentre {
    pub atom: NodeIndex,
    pub tag: ChiralTag,
    pub neighbours: Vec<StereoNeighbour>,
}

/// Direction of a single bond written with `/` or `\` (for double-bond geometry).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
pub enum BondDirection {
    /// `/` read from `from` towards the other end.
    Up,
    /// `\` read from `from` towards the other end.
    Down,
}

/// An atom of the graph. Hydrogens without a node of their own are counted in `hydrogens`.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Atom {
    pub element: Element,
    /// Mass number from a bracket atom (`[13C]`), if written.
    pub isotope: Option<u16>,
    pub charge: i8,
    /// Hydrogens attached but not present as nodes (implicit, or the bracket `H` count).
    pub hydrogens: u8,
    /// Aromatic as written (lower case) or as perceived; bond orders are always Kekulé.
    pub aromatic: bool,
    /// Atom class (`[CH3:7]`), if written.
    pub atom_class: Option<u32>,
    /// Unpaired electrons implied by a bracket atom below its normal valence (`[CH3]` has 1).
    pub radical_electrons: u8,
    /// Byte column (0-based) of the atom in the SMILES it came from.
    pub column: usize,
}

impl Atom {
    /// A neutral atom of `element` with no hydrogens and no annotations.
    pub fn new(element: Element) -> Atom {
        Atom {
            element,
            isotope: None,
            charge: 0,
            hydrogens: 0,
            aromatic: false,
            atom_class: None,
            radical_electrons: 0,
            column: 0,
        }
    }
}

/// Bond order after kekulization.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, serde::Serialize)]
pub enum BondOrder {
    Single = 1,
    Double = 2,
    Triple = 3,
    Quadruple = 4,
}

impl BondOrder {
    /// Valence units the bond uses on each end.
    pub fn valence(self) -> u8 {
        self as u8
    }

    /// The bond order for 1..=4 valence units.
    pub fn from_valence(units: u8) -> Option<BondOrder> {
        match units {
            1 => Some(BondOrder::Single),
            2 => Some(BondOrder::Double),
            3 => Some(BondOrder::Triple),
            4 => Some(BondOrder::Quadruple),
            _ => None,
        }
    }
}

/// A bond of the graph.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Bond {
    pub order: BondOrder,
    /// Aromatic as written (`:` or between two aromatic atoms) or as perceived.
    pub aromatic: bool,
    /// `/` or `\`, read from the atom `from` (a node index) towards the other end.
    pub direction: Option<(NodeIndex, BondDirection)>,
}

impl Bond {
    /// A plain bond of the given order.
    pub fn new(order: BondOrder) -> Bond {
        Bond {
            order,
            aromatic: false,
            direction: None,
        }
    }
}

/// A molecule (or a set of disconnected components written with `.`).
#[derive(Debug, Clone, Default, serde::Serialize)]
pub struct Molecule {
    #[serde(skip)]
    pub graph: UnGraph<Atom, Bond>,
    /// Chiral centres in the order they were written.
    pub chiral_centres: Vec<ChiralCentre>,
}

impl Molecule {
    /// An empty molecule.
    pub fn new() -> Molecule {
        Molecule::default()
    }

    /// Adds an atom and returns its index.
    pub fn add_atom(&mut self, atom: Atom) -> NodeIndex {
        self.graph.add_node(atom)
    }

    /// Adds a bond between two atoms and returns its index.
    pub fn add_bond(&mut self, a: NodeIndex, b: NodeIndex, bond: Bond) -> EdgeIndex {
        self.graph.add_edge(a, b, bond)
    }

    /// Number of atom nodes (explicit hydrogen nodes included).
    pub fn atom_count(&self) -> usize {
        self.graph.node_count()
    }

    /// Number of bonds between nodes.
    pub fn bond_count(&self) -> usize {
        self.graph.edge_count()
    }

    /// The atom at `i`.
    pub fn atom(&self, i: NodeIndex) -> &Atom {
        &self.graph[i]
    }

    /// All atom indices.
    pub fn atoms(&self) -> impl Iterator<Item = NodeIndex> + '_ {
        self.graph.node_indices()
    }

    /// Neighbours of `i` with the bond to each.
    pub fn neighbours(&self, i: NodeIndex) -> impl Iterator<Item = (NodeIndex, &Bond)> + '_ {
        self.graph.edges(i).map(move |e| {
            let other = if e.source() == i {
                e.target()
            } else {
                e.source()
            };
            (other, e.weight())
        })
    }

    /// Number of neighbouring nodes of `i`.
    pub fn degree(&self, i: NodeIndex) -> usize {
        self.graph.edges(i).count()
    }

    /// Sum of bond valences at `i` from bonds to nodes (implicit hydrogens excluded).
    pub fn bond_valence(&self, i: NodeIndex) -> u32 {
        self.graph
            .edges(i)
            .map(|e| e.weight().order.valence() as u32)
            .sum()
    }

    /// Total hydrogens on `i`: its `hydrogens` count plus hydrogen nodes bonded to it.
    pub fn total_hydrogens(&self, i: NodeIndex) -> u32 {
        let nodes = self
            .neighbours(i)
            .filter(|(n, _)| self.graph[*n].element == Element::H)
            .count() as u32;
        self.graph[i].hydrogens as u32 + nodes
    }

    /// Number of connected components (0 for an empty molecule).
    pub fn component_count(&self) -> usize {
        petgraph::algo::connected_components(&self.graph)
    }

    /// Cyclomatic number: bonds - atoms + components (the number of independent rings).
    pub fn cyclomatic_number(&self) -> usize {
        self.bond_count() + self.component_count() - self.atom_count()
    }

    /// A copy in which plain hydrogen nodes (neutral, no isotope, no class, one bond to a
    /// non-hydrogen atom, not named by a chiral centre) are folded into their neighbour's
    /// hydrogen count. Group assignment and canonical keys work on this form.
    pub fn with_hydrogens_folded(&self) -> Molecule {
        self.with_hydrogens_folded_map().0
    }

    /// [`Molecule::with_hydrogens_folded`] and, for each atom of `self`, its node in the copy
    /// (`None` for a folded hydrogen).
    pub fn with_hydrogens_folded_map(&self) -> (Molecule, Vec<Option<NodeIndex>>) {
        let foldable = |i: NodeIndex| -> Option<NodeIndex> {
            let a = &self.graph[i];
            if a.element != Element::H
                || a.isotope.is_some()
                || a.charge != 0
                || a.atom_class.is_some()
                || a.radical_electrons != 0
                || self.degree(i) != 1
            {
                return None;
            }
            let (n, bond) = self.neighbours(i).next()?;
            let neighbour_is_h = self.graph[n].element == Element::H;
            let named_in_stereo = self
                .chiral_centres
                .iter()
                .any(|c| c.neighbours.contains(&StereoNeighbour::Atom(i)));
            (bond.order == BondOrder::Single && !neighbour_is_h && !named_in_stereo).then_some(n)
        };
        let mut out = Molecule::new();
        let mut map = vec![None; self.atom_count()];
        let mut extra_h = vec![0u8; self.atom_count()];
        for i in self.atoms() {
            if let Some(n) = foldable(i) {
                extra_h[n.index()] += 1;
            }
        }
        for i in self.atoms() {
            if foldable(i).is_none() {
                let mut atom = self.graph[i].clone();
                atom.hydrogens = atom.hydrogens.saturating_add(extra_h[i.index()]);
                map[i.index()] = Some(out.add_atom(atom));
            }
        }
        for e in self.graph.edge_references() {
            if let (Some(a), Some(b)) = (map[e.source().index()], map[e.target().index()]) {
                let mut bond = e.weight().clone();
                bond.direction = bond
                    .direction
                    .and_then(|(from, d)| map[from.index()].map(|f| (f, d)));
                out.add_bond(a, b, bond);
            }
        }
        out.chiral_centres = self
            .chiral_centres
            .iter()
            .filter_map(|c| {
                Some(ChiralCentre {
                    atom: map[c.atom.index()]?,
                    tag: c.tag,
                    neighbours: c
                        .neighbours
                        .iter()
                        .map(|n| match n {
                            StereoNeighbour::Atom(a) => map[a.index()]
                                .map(StereoNeighbour::Atom)
                                .unwrap_or(StereoNeighbour::ImplicitHydrogen),
                            StereoNeighbour::ImplicitHydrogen => StereoNeighbour::ImplicitHydrogen,
                        })
                        .collect(),
                })
            })
            .collect();
        (out, map)
    }
}
