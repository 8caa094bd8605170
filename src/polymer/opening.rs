//! Which ring bond a ring-opening polymerisation breaks: the user's, or the usual bond of the
//! ring's functional group.
//!
//! The usual bond, first match wins: the acyl-oxygen bond of a cyclic ester, carbonate or
//! lactide (`C(=O)-O` in the ring); the acyl-nitrogen bond of a lactam; a carbon-oxygen bond of
//! a cyclic ether or acetal; the ring double bond of a cycloalkene (ring-opening metathesis);
//! a carbon-sulfur bond of a cyclic sulfide; a carbon-nitrogen bond of a cyclic amine; a
//! carbon-carbon bond of a cycloalkane. Aromatic bonds and bonds shared by two rings are never
//! opened. Among equal candidates the one with the lowest atom numbers is taken (for a monocyclic
//! monomer every bond of the ring gives the same infinite chain anyway: the chain repeats the
//! ring's atoms in ring order).

use petgraph::graph::{EdgeIndex, NodeIndex};
use petgraph::visit::EdgeRef;

use crate::molecule::{BondOrder, Element, PerceivedMolecule};

/// The kind of bond opened, for reports.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum OpeningKind {
    /// Acyl-oxygen bond of a lactone, cyclic carbonate or lactide.
    AcylOxygen,
    /// Acyl-nitrogen bond of a lactam.
    AcylNitrogen,
    /// Carbon-oxygen bond of a cyclic ether or acetal.
    EtherCarbonOxygen,
    /// Ring double bond (ring-opening metathesis).
    Metathesis,
    /// Carbon-sulfur bond of a cyclic sulfide.
    CarbonSulfur,
    /// Carbon-nitrogen bond of a cyclic amine.
    CarbonNitrogen,
    /// Carbon-carbon single bond of a cycloalkane.
    CarbonCarbon,
    /// The bond the user named.
    UserChosen,
}

impl OpeningKind {
    /// Words for reports.
    pub fn describe(self) -> &'static str {
        match self {
            OpeningKind::AcylOxygen => "acyl-oxygen bond (ester or carbonate)",
            OpeningKind::AcylNitrogen => "acyl-nitrogen bond (lactam)",
            OpeningKind::EtherCarbonOxygen => "carbon-oxygen bond (cyclic ether)",
            OpeningKind::Metathesis => "ring double bond (ring-opening metathesis)",
            OpeningKind::CarbonSulfur => "carbon-sulfur bond (cyclic sulfide)",
            OpeningKind::CarbonNitrogen => "carbon-nitrogen bond (cyclic amine)",
            OpeningKind::CarbonCarbon => "carbon-carbon bond (cycloalkane)",
            OpeningKind::UserChosen => "the bond given",
        }
    }
}

/// The bond a polymerisation opens (atom indices of the hydrogen-folded molecule).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct OpenedBond {
    /// One end: the chain's links run from the `b` of one unit to the `a` of the next.
    pub a: NodeIndex,
    /// The other end.
    pub b: NodeIndex,
    /// The bond.
    pub edge: EdgeIndex,
    /// Its order (kept in the chain's links).
    pub order: BondOrder,
    /// Why this bond.
    pub kind: OpeningKind,
}

impl OpenedBond {
    /// `atoms 2-3 (C-O)` for reports, 1-based.
    pub fn describe(&self, p: &PerceivedMolecule) -> String {
        format!(
            "atoms {}-{} ({}{}{}), {}",
            p.input_atom_number(self.a),
            p.input_atom_number(self.b),
            p.mol.atom(self.a).element,
            if self.order == BondOrder::Double {
                "="
            } else {
                "-"
            },
            p.mol.atom(self.b).element,
            self.kind.describe()
        )
    }
}

/// Why no bond can be opened.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum OpeningError {
    /// The molecule has no ring.
    #[error("the molecule has no ring to open")]
    NoRing,
    /// The user's atoms are not bonded, or not a ring bond.
    #[error("atoms {0}-{1} are not joined by a ring bond")]
    NotARingBond(usize, usize),
    /// An atom number out of range.
    #[error("atom {0} does not exist (the molecule has {1} atoms without hydrogens)")]
    NoSuchAtom(usize, usize),
    /// Aromatic bond.
    #[error("atoms {0}-{1}: an aromatic bond is not opened by ring-opening polymerisation")]
    Aromatic(usize, usize),
    /// A fusion bond.
    #[error("atoms {0}-{1}: the bond is shared by two rings; opening it leaves a larger ring, not a chain")]
    SharedBond(usize, usize),
    /// No candidate bond.
    #[error("no ring bond of a kind that ring-opening polymerisation opens (only aromatic or shared bonds)")]
    NoCandidate,
}

fn rings_with_bond(p: &PerceivedMolecule, e: EdgeIndex) -> usize {
    p.rings.rings.iter().filter(|r| r.contains_bond(e)).count()
}

/// The kind of a ring bond `x-y`, if polymerisation can open it.
fn classify(
    p: &PerceivedMolecule,
    x: NodeIndex,
    y: NodeIndex,
    order: BondOrder,
) -> Option<(OpeningKind, NodeIndex, NodeIndex)> {
    let mol = &p.mol;
    let el = |a: NodeIndex| mol.atom(a).element;
    let exocyclic_carbonyl = |c: NodeIndex| {
        el(c) == Element::C
            && mol.neighbours(c).any(|(o, b)| {
                el(o) == Element::O && b.order == BondOrder::Double && mol.degree(o) == 1
            })
    };
    // (acyl carbon, heteroatom) in either order.
    let acyl = |het: Element| {
        if exocyclic_carbonyl(x) && el(y) == het {
            Some((x, y))
        } else if exocyclic_carbonyl(y) && el(x) == het {
            Some((y, x))
        } else {
            None
        }
    };
    let pair = |e1: Element, e2: Element| {
        if el(x) == e1 && el(y) == e2 {
            Some((x, y))
        } else if el(y) == e1 && el(x) == e2 {
            Some((y, x))
        } else {
            None
        }
    };
    if order == BondOrder::Single {
        if let Some((c, o)) = acyl(Element::O) {
            return Some((OpeningKind::AcylOxygen, c, o));
        }
        if let Some((c, n)) = acyl(Element::N) {
            return Some((OpeningKind::AcylNitrogen, c, n));
        }
        if let Some((c, o)) = pair(Element::C, Element::O) {
            return Some((OpeningKind::EtherCarbonOxygen, c, o));
        }
    }
    if order == BondOrder::Double && el(x) == Element::C && el(y) == Element::C {
        return Some((OpeningKind::Metathesis, x, y));
    }
    if order == BondOrder::Single {
        if let Some((c, s)) = pair(Element::C, Element::S) {
            return Some((OpeningKind::CarbonSulfur, c, s));
        }
        if let Some((c, n)) = pair(Element::C, Element::N) {
            return Some((OpeningKind::CarbonNitrogen, c, n));
        }
        if el(x) == Element::C && el(y) == Element::C {
            return Some((OpeningKind::CarbonCarbon, x, y));
        }
    }
    None
}

const PRIORITY: [OpeningKind; 7] = [
    OpeningKind::AcylOxygen,
    OpeningKind::AcylNitrogen,
    OpeningKind::EtherCarbonOxygen,
    OpeningKind::Metathesis,
    OpeningKind::CarbonSulfur,
    OpeningKind::CarbonNitrogen,
    OpeningKind::CarbonCarbon,
];

/// The usual bond of the monomer's ring.
pub fn usual_bond(p: &PerceivedMolecule) -> Result<OpenedBond, OpeningError> {
    if p.rings.rings.is_empty() {
        return Err(OpeningError::NoRing);
    }
    let mut candidates = Vec::new();
    for e in p.mol.graph.edge_references() {
        let (x, y, bond) = (e.source(), e.target(), e.weight());
        if bond.aromatic || rings_with_bond(p, e.id()) != 1 {
            continue;
        }
        if let Some((kind, a, b)) = classify(p, x, y, bond.order) {
            candidates.push(OpenedBond {
                a,
                b,
                edge: e.id(),
                order: bond.order,
                kind,
            });
        }
    }
    let rank = |k: OpeningKind| {
        PRIORITY
            .iter()
            .position(|&q| q == k)
            .unwrap_or(PRIORITY.len())
    };
    candidates.sort_by_key(|c| {
        let (i, j) = (p.input_atom_number(c.a), p.input_atom_number(c.b));
        (rank(c.kind), i.min(j), i.max(j))
    });
    candidates
        .into_iter()
        .next()
        .ok_or(OpeningError::NoCandidate)
}

/// The bond between atoms `first` and `second` (1-based, in the order written, hydrogens not
/// counted).
pub fn user_bond(
    p: &PerceivedMolecule,
    first: usize,
    second: usize,
) -> Result<OpenedBond, OpeningError> {
    let n = p.mol.atom_count();
    // Perception renumbers atoms canonically; find the atoms the user numbered.
    let node = |i: usize| {
        p.mol
            .atoms()
            .find(|&a| p.input_atom_number(a) == i)
            .ok_or(OpeningError::NoSuchAtom(i, n))
    };
    let (x, y) = (node(first)?, node(second)?);
    let edge = p
        .mol
        .graph
        .find_edge(x, y)
        .ok_or(OpeningError::NotARingBond(first, second))?;
    let bond = &p.mol.graph[edge];
    match rings_with_bond(p, edge) {
        0 => return Err(OpeningError::NotARingBond(first, second)),
        1 => {}
        _ => return Err(OpeningError::SharedBond(first, second)),
    }
    if bond.aromatic {
        return Err(OpeningError::Aromatic(first, second));
    }
    Ok(OpenedBond {
        a: x,
        b: y,
        edge,
        order: bond.order,
        kind: OpeningKind::UserChosen,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn kind(smiles: &str) -> OpeningKind {
        let p = PerceivedMolecule::from_smiles(smiles).expect("parses");
        usual_bond(&p).expect("a bond").kind
    }

    #[test]
    fn usual_bonds_by_functional_group() {
        assert_eq!(kind("O=C1CCCCCO1"), OpeningKind::AcylOxygen);
        assert_eq!(kind("O=C1OCCCO1"), OpeningKind::AcylOxygen);
        assert_eq!(kind("CC1OC(=O)C(C)OC1=O"), OpeningKind::AcylOxygen);
        assert_eq!(kind("O=C1CCCCCN1"), OpeningKind::AcylNitrogen);
        assert_eq!(kind("C1CCOC1"), OpeningKind::EtherCarbonOxygen);
        assert_eq!(kind("C1=CCCC1"), OpeningKind::Metathesis);
        assert_eq!(kind("C1CCCCC1"), OpeningKind::CarbonCarbon);
        // Norbornene opens at its double bond, not a shared bond.
        assert_eq!(kind("C1CC2CC1C=C2"), OpeningKind::Metathesis);
        let benzene = PerceivedMolecule::from_smiles("c1ccccc1").expect("parses");
        assert_eq!(usual_bond(&benzene).unwrap_err(), OpeningError::NoCandidate);
    }

    #[test]
    fn user_bonds_are_checked() {
        let p = PerceivedMolecule::from_smiles("O=C1CCCCCO1").expect("parses");
        assert!(user_bond(&p, 2, 3).is_ok());
        assert_eq!(
            user_bond(&p, 1, 2).unwrap_err(),
            OpeningError::NotARingBond(1, 2)
        );
        assert_eq!(
            user_bond(&p, 2, 9).unwrap_err(),
            OpeningError::NoSuchAtom(9, 8)
        );
        let decalin = PerceivedMolecule::from_smiles("C1CCC2CCCCC2C1").expect("parses");
        assert_eq!(
            user_bond(&decalin, 4, 9).unwrap_err(),
            OpeningError::SharedBond(4, 9)
        );
    }
}
