//! Atom typing for Benson groups: which group centre each heavy atom is, and which atoms are
//! absorbed into a neighbour's group (the =O of a carbonyl, the N of a nitrile, ...).

use petgraph::graph::NodeIndex;

use super::key::AtomType;
use crate::molecule::{BondOrder, Element, PerceivedMolecule};

/// The role an atom plays in Benson's scheme.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum AtomRole {
    /// The atom is the centre of a group of this type (`C`, `Cd`, `CO`, `O`, `NO2`, ...).
    Centre(AtomType),
    /// The atom belongs to the group of the atom given (carbonyl O, nitrile N, nitro O, S=O O).
    Absorbed(NodeIndex),
    /// A monovalent ligand with no group of its own (hydrogen node, halogen): typed so.
    Ligand(AtomType),
}

/// Why an atom has no Benson type.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct UntypedAtom {
    /// The atom.
    pub atom: NodeIndex,
    /// What about it the tables cannot treat.
    pub reason: String,
}

/// Roles of all atoms of a molecule, indexed by node index.
#[derive(Debug, Clone)]
pub struct AtomTypes {
    /// One role per atom node.
    pub roles: Vec<AtomRole>,
}

impl AtomTypes {
    /// The group-centre type of `atom`, if it is a centre.
    pub fn centre(&self, atom: NodeIndex) -> Option<AtomType> {
        match self.roles[atom.index()] {
            AtomRole::Centre(t) => Some(t),
            _ => None,
        }
    }

    /// The type `atom` has when it is a ligand of a neighbouring centre: its centre type,
    /// its halogen/hydrogen type, or (for an absorbed atom) the type of its owner.
    pub fn ligand_type(&self, atom: NodeIndex) -> AtomType {
        match &self.roles[atom.index()] {
            AtomRole::Centre(t) | AtomRole::Ligand(t) => *t,
            AtomRole::Absorbed(owner) => self.ligand_type(*owner),
        }
    }
}

fn halogen_type(e: Element) -> Option<AtomType> {
    match e.atomic_number() {
        9 => Some(AtomType::F),
        17 => Some(AtomType::Cl),
        35 => Some(AtomType::Br),
        53 => Some(AtomType::I),
        _ => None,
    }
}

/// Counts of multiple bonds at an atom, split by the partner's element.
struct MultipleBonds {
    double_to_c: Vec<NodeIndex>,
    double_to_o: Vec<NodeIndex>,
    double_to_n: Vec<NodeIndex>,
    double_to_s: Vec<NodeIndex>,
    triple_to_c: usize,
    triple_to_n: Vec<NodeIndex>,
}

fn multiple_bonds(p: &PerceivedMolecule, i: NodeIndex) -> MultipleBonds {
    let mut m = MultipleBonds {
        double_to_c: Vec::new(),
        double_to_o: Vec::new(),
        double_to_n: Vec::new(),
        double_to_s: Vec::new(),
        triple_to_c: 0,
        triple_to_n: Vec::new(),
    };
    for (n, bond) in p.mol.neighbours(i) {
        let e = p.mol.atom(n).element;
        match bond.order {
            BondOrder::Double if e == Element::C => m.double_to_c.push(n),
            BondOrder::Double if e == Element::O => m.double_to_o.push(n),
            BondOrder::Double if e == Element::N => m.double_to_n.push(n),
            BondOrder::Double if e == Element::S => m.double_to_s.push(n),
            BondOrder::Triple if e == Element::C => m.triple_to_c += 1,
            BondOrder::Triple if e == Element::N => m.triple_to_n.push(n),
            _ => {}
        }
    }
    m
}

/// Whether `i` is a carbon of an aromatic six-membered ring (Benson's `Cb` family).
pub fn in_aromatic_six_ring(p: &PerceivedMolecule, i: NodeIndex) -> bool {
    aromatic_six_ring_count(p, i) > 0
}

/// Number of aromatic six-membered rings that hold `i`.
pub fn aromatic_six_ring_count(p: &PerceivedMolecule, i: NodeIndex) -> usize {
    if !p.mol.atom(i).aromatic {
        return 0;
    }
    p.rings
        .rings
        .iter()
        .filter(|r| {
            r.atoms.len() == 6
                && r.atoms.contains(&i)
                && r.atoms.iter().all(|a| p.mol.atom(*a).aromatic)
        })
        .count()
}

/// Whether `i` is an oxygen of a nitro group `[N+](=O)[O-]` or `N(=O)=O` bonded to `n`.
fn is_nitro_nitrogen(p: &PerceivedMolecule, n: NodeIndex) -> bool {
    let a = p.mol.atom(n);
    if a.element != Element::N || a.hydrogens != 0 {
        return false;
    }
    let oxygens: Vec<_> = p
        .mol
        .neighbours(n)
        .filter(|(o, _)| p.mol.atom(*o).element == Element::O && p.mol.degree(*o) == 1)
        .collect();
    if oxygens.len() != 2 || p.mol.degree(n) != 3 {
        return false;
    }
    let charge_sum: i32 = a.charge as i32
        + oxygens
            .iter()
            .map(|(o, _)| p.mol.atom(*o).charge as i32)
            .sum::<i32>();
    let has_double = oxygens.iter().any(|(_, b)| b.order == BondOrder::Double);
    charge_sum == 0 && has_double
}

/// Assigns a Benson role to every atom, or says which atom the scheme cannot treat.
pub fn type_atoms(p: &PerceivedMolecule) -> Result<AtomTypes, UntypedAtom> {
    let mol = &p.mol;
    let mut roles: Vec<Option<AtomRole>> = vec![None; mol.atom_count()];
    let untyped = |atom: NodeIndex, reason: &str| UntypedAtom {
        atom,
        reason: reason.to_string(),
    };
    // First pass: centres that absorb neighbours (carbonyl, nitrile, nitro, S=O).
    for i in mol.atoms() {
        let a = mol.atom(i);
        if a.radical_electrons != 0 {
            return Err(untyped(
                i,
                "radical centre: the tables hold closed-shell groups only",
            ));
        }
        let mb = multiple_bonds(p, i);
        match a.element.atomic_number() {
            6 if a.charge == 0 => {
                if let [o] = mb.double_to_o[..] {
                    roles[o.index()] = Some(AtomRole::Absorbed(i));
                    roles[i.index()] = Some(AtomRole::Centre(AtomType::CO));
                } else if let [n] = mb.triple_to_n[..] {
                    roles[n.index()] = Some(AtomRole::Absorbed(i));
                    roles[i.index()] = Some(AtomRole::Centre(AtomType::CN));
                } else if let [s] = mb.double_to_s[..] {
                    roles[s.index()] = Some(AtomRole::Absorbed(i));
                    roles[i.index()] = Some(AtomRole::Centre(AtomType::CS));
                }
            }
            7 if is_nitro_nitrogen(p, i) => {
                for (o, _) in mol.neighbours(i) {
                    if mol.atom(o).element == Element::O && mol.degree(o) == 1 {
                        roles[o.index()] = Some(AtomRole::Absorbed(i));
                    }
                }
                roles[i.index()] = Some(AtomRole::Centre(AtomType::NO2));
            }
            7 if a.charge == 0 && mb.double_to_o.len() == 1 && p.mol.degree(i) == 2 => {
                // Nitroso / nitrite nitrogen: -N=O as one unit.
                roles[mb.double_to_o[0].index()] = Some(AtomRole::Absorbed(i));
                roles[i.index()] = Some(AtomRole::Centre(AtomType::NO));
            }
            16 if a.charge == 0 && !mb.double_to_o.is_empty() => {
                let kind = match mb.double_to_o.len() {
                    1 => AtomType::SO,
                    2 => AtomType::SO2,
                    _ => return Err(untyped(i, "sulfur with three S=O bonds has no group")),
                };
                for o in &mb.double_to_o {
                    roles[o.index()] = Some(AtomRole::Absorbed(i));
                }
                roles[i.index()] = Some(AtomRole::Centre(kind));
            }
            _ => {}
        }
    }
    // Second pass: everything else.
    for i in mol.atoms() {
        if roles[i.index()].is_some() {
            continue;
        }
        let a = mol.atom(i);
        if a.element == Element::H {
            roles[i.index()] = Some(AtomRole::Ligand(AtomType::H));
            continue;
        }
        if let Some(halogen) = halogen_type(a.element) {
            if a.charge != 0 || mol.degree(i) + a.hydrogens as usize != 1 {
                return Err(untyped(
                    i,
                    "halogen that is not a single monovalent substituent",
                ));
            }
            roles[i.index()] = Some(AtomRole::Ligand(halogen));
            continue;
        }
        if a.charge != 0 {
            return Err(untyped(
                i,
                "charged atom: the tables hold neutral groups only",
            ));
        }
        let mb = multiple_bonds(p, i);
        let role = match a.element.atomic_number() {
            6 => {
                let six = aromatic_six_ring_count(p, i);
                if six >= 2 {
                    AtomType::Cbf
                } else if six == 1 {
                    AtomType::Cb
                } else if mb.double_to_c.len() == 2 {
                    AtomType::Ca
                } else if mb.triple_to_c == 1 {
                    AtomType::Ct
                } else if mb.double_to_c.len() == 1 {
                    AtomType::Cd
                } else if mb.double_to_n.len() == 1 {
                    AtomType::CI
                } else if mb.double_to_c.is_empty()
                    && mb.double_to_n.is_empty()
                    && mb.triple_to_c == 0
                    && mb.triple_to_n.is_empty()
                {
                    AtomType::C
                } else {
                    return Err(untyped(i, "carbon with a bonding pattern the tables lack"));
                }
            }
            8 => {
                if mol.bond_valence(i) + a.hydrogens as u32 != 2 || !mb.double_to_c.is_empty() {
                    return Err(untyped(i, "oxygen that is not divalent and singly bonded"));
                }
                AtomType::O
            }
            7 => {
                let valence = mol.bond_valence(i) + a.hydrogens as u32;
                if valence != 3 {
                    return Err(untyped(i, "nitrogen that is not trivalent"));
                }
                if in_aromatic_six_ring(p, i) {
                    AtomType::NA
                } else if mb.double_to_c.len() == 1 {
                    AtomType::NI
                } else if mb.double_to_c.is_empty()
                    && mb.double_to_n.is_empty()
                    && mb.triple_to_c == 0
                {
                    AtomType::N
                } else {
                    return Err(untyped(
                        i,
                        "nitrogen with a bonding pattern the tables lack",
                    ));
                }
            }
            16 => {
                let valence = mol.bond_valence(i) + a.hydrogens as u32;
                if valence != 2 || !mb.double_to_c.is_empty() {
                    return Err(untyped(i, "sulfur that is not a divalent sulfide or thiol"));
                }
                AtomType::S
            }
            _ => {
                return Err(untyped(
                    i,
                    &format!("element {} has no groups in the tables", a.element),
                ))
            }
        };
        roles[i.index()] = Some(AtomRole::Centre(role));
    }
    let roles = roles
        .into_iter()
        .enumerate()
        .map(|(k, r)| r.ok_or_else(|| untyped(NodeIndex::new(k), "atom left without a role")))
        .collect::<Result<Vec<_>, _>>()?;
    Ok(AtomTypes { roles })
}
