//! Non-ring corrections: counts gauche, 1,5 (syn-pentane), cis and ortho interactions.
//!
//! Counting rules (the table entries of the same names give the value per occurrence):
//! - `gauche`: for every acyclic single bond between two sp3 carbons with n1 and n2 carbon
//!   substituents besides each other, n1*n2 - min(n1, n2) gauche pairs (the fewest a staggered
//!   conformer can have; common practice).
//! - `gauche-(O)`: the same count for every acyclic single bond between an sp3 carbon and an
//!   ether oxygen (bonded to two sp3 carbons), the oxygen's other carbon being its one
//!   substituent: 1 for an isopropyl, 2 for a tert-butyl on the oxygen (counted as Benson counts
//!   alkane gauche pairs, with the oxygen as a chain atom; common practice). Not counted on a
//!   carbon that bears a second oxygen (acetals, ketals): there the anomeric effect favours the
//!   gauche arrangement.
//! - `vicinal-(X)2`: for every acyclic single bond between two sp3 carbons, each pair of like
//!   halogens X, one on each carbon (hexachloroethane: 9 `vicinal-(Cl)2`): halogen
//!   crowding that the one-carbon halogen groups cannot see (our counting rule). Mixed pairs are
//!   not counted: the reference data hold too few compounds to give them values.
//! - `1,5-interaction`: for every pair of sp3 carbons A, B bonded to one sp3 carbon M by acyclic
//!   bonds, with nA, nB >= 2 carbon substituents besides M, (nA-1)(nB-1)-1 interactions. Chosen to
//!   give 0 for 2,4-dimethylpentane, 1 for 2,2,4-trimethylpentane and 3 for
//!   2,2,4,4-tetramethylpentane (counts recalled from memory of Benson's worked examples).
//!   `1,5-interaction-(O)` is the same count with an ether oxygen as M (di-tert-butyl ether: 3).
//! - `cis`: for every acyclic C=C, the pairs of non-hydrogen substituents on the same side: one
//!   for a trisubstituted bond, two for a tetrasubstituted one, and for a 1,2-disubstituted bond
//!   one if written Z, none if written E or unspecified. Where the input gives no geometry and
//!   the arrangements differ, the one with the fewest and mildest cis pairs is taken, and
//!   between equal ones the heavier substituents (by atomic number of the first atom) trans;
//!   a note says which was assumed.
//!   A cis pair with one tert-butyl is `cis-tert-butyl`, with two `cis-di-tert-butyl` (each
//!   falls back to `cis` when the tables lack it). A pair that is not two carbons is
//!   `cis-(X)(Y)` with no stand-in (Benson's `cis` is for alkyl pairs).
//! - `ortho`: for every bond between two `Cb` atoms that both carry a non-hydrogen substituent;
//!   two alkyl carbons give Benson's `ortho`, other pairs `ortho-(X)(Y)` with the substituent
//!   types in the fixed ligand order (e.g. `ortho-(F)2`, `ortho-(C)(Cl)`), falling back to `ortho`.

use petgraph::graph::NodeIndex;

use super::key::{ligand_notation, AtomType};
use super::typing::AtomTypes;
use crate::molecule::{BondDirection, BondOrder, Element, PerceivedMolecule};

/// Counted interactions of one kind.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct InteractionCount {
    /// Correction name as in the tables.
    pub name: String,
    /// Occurrences.
    pub count: u32,
    /// The more general correction that stands in when the tables lack `name`.
    pub fallback: Option<&'static str>,
}

/// An assumption made while counting interactions (shown as a flag of the estimate).
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub enum InteractionNote {
    /// A double bond whose geometry the input does not give, where the arrangements differ:
    /// the one taken by the documented rule (fewest and mildest cis pairs, then the heavier
    /// substituents trans).
    DoubleBondGeometryUnknown {
        /// 1-based input numbers of the two double-bond atoms.
        atoms: [usize; 2],
        /// The cis corrections of the arrangement taken (empty: E, no cis pair).
        cis_pairs: Vec<String>,
    },
    /// A double bond written trans across a ring of nine or more atoms: the ring corrections
    /// are those of the cis ring, so the extra strain of the trans ring is not counted.
    TransRingDoubleBond {
        /// 1-based input numbers of the two double-bond atoms.
        atoms: [usize; 2],
        /// Size of the smallest ring holding the bond.
        ring_size: usize,
    },
}

impl std::fmt::Display for InteractionNote {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            InteractionNote::DoubleBondGeometryUnknown {
                atoms: [a, b],
                cis_pairs,
            } if cis_pairs.is_empty() => write!(
                f,
                "double bond between atoms {a} and {b} has no geometry in the input: taken \
                 as E (trans), no cis correction"
            ),
            InteractionNote::DoubleBondGeometryUnknown {
                atoms: [a, b],
                cis_pairs,
            } => write!(
                f,
                "double bond between atoms {a} and {b} has no geometry in the input: taken \
                 as the arrangement with cis pair(s) {} (rule: fewest and mildest cis pairs, \
                 then the heavier substituents trans)",
                cis_pairs.join(", ")
            ),
            InteractionNote::TransRingDoubleBond {
                atoms: [a, b],
                ring_size,
            } => write!(
                f,
                "double bond between atoms {a} and {b} is trans in a ring of {ring_size} atoms: \
                 the ring correction is that of the cis ring (the extra strain of the trans ring \
                 is not counted)"
            ),
        }
    }
}

/// All counted interactions and notes about assumptions made.
#[derive(Debug, Clone, Default)]
pub struct Interactions {
    /// Non-zero counts.
    pub counts: Vec<InteractionCount>,
    /// Assumptions (unspecified double-bond geometry, ...).
    pub notes: Vec<InteractionNote>,
}

impl Interactions {
    fn add(&mut self, name: &str, fallback: Option<&'static str>, n: u32) {
        if n == 0 {
            return;
        }
        match self.counts.iter_mut().find(|c| c.name == name) {
            Some(c) => c.count += n,
            None => self.counts.push(InteractionCount {
                name: name.to_string(),
                count: n,
                fallback,
            }),
        }
    }
}

fn is_sp3_carbon(types: &AtomTypes, i: NodeIndex) -> bool {
    types.centre(i) == Some(AtomType::C)
}

fn is_ring_bond(p: &PerceivedMolecule, a: NodeIndex, b: NodeIndex) -> bool {
    p.mol
        .graph
        .find_edge(a, b)
        .is_some_and(|e| p.rings.is_ring_bond(e))
}

/// Whether `o` is an ether oxygen: an O centre bonded to two sp3 carbons by acyclic bonds.
fn is_acyclic_ether_oxygen(p: &PerceivedMolecule, types: &AtomTypes, o: NodeIndex) -> bool {
    types.centre(o) == Some(AtomType::O)
        && p.mol.degree(o) == 2
        && p.mol
            .neighbours(o)
            .all(|(n, _)| is_sp3_carbon(types, n) && !is_ring_bond(p, o, n))
}

fn carbon_substituents_except(p: &PerceivedMolecule, i: NodeIndex, except: NodeIndex) -> usize {
    p.mol
        .neighbours(i)
        .filter(|(n, _)| *n != except && p.mol.atom(*n).element == Element::C)
        .count()
}

/// Whether `x`, bonded to `from`, is a tert-butyl group C(CH3)3.
fn is_tert_butyl(p: &PerceivedMolecule, types: &AtomTypes, x: NodeIndex, from: NodeIndex) -> bool {
    let mol = &p.mol;
    if !is_sp3_carbon(types, x) || mol.atom(x).hydrogens != 0 {
        return false;
    }
    let methyls = mol
        .neighbours(x)
        .filter(|(n, _)| *n != from)
        .filter(|(n, _)| {
            mol.atom(*n).element == Element::C && mol.atom(*n).hydrogens == 3 && mol.degree(*n) == 1
        })
        .count();
    methyls == 3 && mol.degree(x) == 4
}

/// Correction name for one cis pair: by how many of the two are tert-butyl.
fn cis_name(tert_butyls: usize) -> &'static str {
    match tert_butyls {
        0 => "cis",
        1 => "cis-tert-butyl",
        _ => "cis-di-tert-butyl",
    }
}

/// Correction name for an ortho pair of substituent types: Benson's `ortho` for two alkyl
/// carbons, else `ortho-(X)(Y)` in the fixed ligand order.
fn ortho_name(x: AtomType, y: AtomType) -> String {
    if x == AtomType::C && y == AtomType::C {
        return "ortho".to_string();
    }
    format!("ortho-{}", ligand_notation(&[x, y]))
}

/// Counts every interaction named in the module docs.
pub fn count_interactions(p: &PerceivedMolecule, types: &AtomTypes) -> Interactions {
    let mol = &p.mol;
    let mut out = Interactions::default();
    for t in trans_ring_double_bonds(p) {
        match t.ring_size {
            // Smaller rings are refused before counting (see `TransRingBond`).
            7 | 8 => out.add(&trans_ring_correction(t.ring_size), None, 1),
            _ => out.notes.push(InteractionNote::TransRingDoubleBond {
                atoms: t.atoms,
                ring_size: t.ring_size,
            }),
        }
    }
    for e in mol.graph.edge_indices() {
        let Some((a, b)) = mol.graph.edge_endpoints(e) else {
            continue;
        };
        let bond = &mol.graph[e];
        let in_ring = p.rings.is_ring_bond(e);
        if bond.order == BondOrder::Single
            && !in_ring
            && is_sp3_carbon(types, a)
            && is_sp3_carbon(types, b)
        {
            count_vicinal_halogens(p, types, a, b, &mut out);
        }
        match bond.order {
            BondOrder::Single if !in_ring && is_sp3_carbon(types, a) && is_sp3_carbon(types, b) => {
                let n1 = carbon_substituents_except(p, a, b) as u32;
                let n2 = carbon_substituents_except(p, b, a) as u32;
                out.add("gauche", None, n1 * n2 - n1.min(n2));
            }
            BondOrder::Single
                if !in_ring
                    && ((is_sp3_carbon(types, a) && is_acyclic_ether_oxygen(p, types, b))
                        || (is_sp3_carbon(types, b) && is_acyclic_ether_oxygen(p, types, a))) =>
            {
                let (c, o) = if is_sp3_carbon(types, a) {
                    (a, b)
                } else {
                    (b, a)
                };
                let acetal = mol
                    .neighbours(c)
                    .any(|(n, _)| n != o && mol.atom(n).element == Element::O);
                if !acetal {
                    let n = carbon_substituents_except(p, c, o) as u32;
                    out.add("gauche-(O)", None, n.saturating_sub(1));
                }
            }
            _ if types.centre(a) == Some(AtomType::Cb)
                && types.centre(b) == Some(AtomType::Cb)
                && bond.aromatic =>
            {
                let substituent = |x: NodeIndex, other: NodeIndex| {
                    mol.neighbours(x)
                        .find(|(n, nb)| {
                            *n != other && !nb.aromatic && mol.atom(*n).element != Element::H
                        })
                        .map(|(n, _)| n)
                };
                // Substituents tied into one ring with the bond (indane, tetralin) are part of
                // that ring's correction, not an ortho pair.
                let same_ring = |sa: NodeIndex, sb: NodeIndex| {
                    p.rings.rings.iter().any(|r| {
                        r.atoms.contains(&a)
                            && r.atoms.contains(&b)
                            && r.atoms.contains(&sa)
                            && r.atoms.contains(&sb)
                    })
                };
                if let (Some(sa), Some(sb)) = (substituent(a, b), substituent(b, a)) {
                    if same_ring(sa, sb) {
                        continue;
                    }
                    let name = ortho_name(types.ligand_type(sa), types.ligand_type(sb));
                    let fallback = (name != "ortho").then_some("ortho");
                    out.add(&name, fallback, 1);
                }
            }
            BondOrder::Double
                if !in_ring
                    && types.centre(a) == Some(AtomType::Cd)
                    && types.centre(b) == Some(AtomType::Cd) =>
            {
                count_cis(p, types, a, b, &mut out);
            }
            _ => {}
        }
    }
    // 1,5 interactions around every sp3 carbon M, and around every ether oxygen M.
    let mut one_five = 0u32;
    let mut one_five_oxygen = 0u32;
    for m in mol.atoms() {
        let ether = is_acyclic_ether_oxygen(p, types, m);
        if !is_sp3_carbon(types, m) && !ether {
            continue;
        }
        let arms: Vec<NodeIndex> = mol
            .neighbours(m)
            .map(|(n, _)| n)
            .filter(|&n| is_sp3_carbon(types, n) && !is_ring_bond(p, m, n))
            .collect();
        for (i, &x) in arms.iter().enumerate() {
            for &y in &arms[i + 1..] {
                let nx = carbon_substituents_except(p, x, m) as u32;
                let ny = carbon_substituents_except(p, y, m) as u32;
                if nx >= 2 && ny >= 2 {
                    let n = (nx - 1) * (ny - 1) - 1;
                    if ether {
                        one_five_oxygen += n;
                    } else {
                        one_five += n;
                    }
                }
            }
        }
    }
    out.add("1,5-interaction", None, one_five);
    out.add("1,5-interaction-(O)", None, one_five_oxygen);
    out
}

/// A ring double bond whose input geometry puts the ring's two continuations on opposite
/// sides (trans-cyclooctene `C1CCC/C=C/CC1`). In a ring of fewer than 7 atoms it cannot exist;
/// rings of 7 and 8 atoms take the correction [`trans_ring_correction`] (refused when the tables
/// lack it); larger rings are noted.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct TransRingBond {
    /// 1-based input numbers of the two double-bond atoms.
    pub atoms: [usize; 2],
    /// Size of the smallest ring holding the bond.
    pub ring_size: usize,
}

/// Name of the correction for a trans double bond in a ring of `ring_size` atoms.
pub fn trans_ring_correction(ring_size: usize) -> String {
    format!("trans-ring-({ring_size})")
}

/// The trans ring double bonds of `p` (non-aromatic double bonds in a ring, written trans).
pub fn trans_ring_double_bonds(p: &PerceivedMolecule) -> Vec<TransRingBond> {
    let mol = &p.mol;
    let mut out = Vec::new();
    for e in mol.graph.edge_indices() {
        let bond = &mol.graph[e];
        if bond.order != BondOrder::Double || bond.aromatic || !p.rings.is_ring_bond(e) {
            continue;
        }
        let Some((a, b)) = mol.graph.edge_endpoints(e) else {
            continue;
        };
        let Some(ring) = p
            .rings
            .rings
            .iter()
            .filter(|r| r.contains_bond(e))
            .min_by_key(|r| r.size())
        else {
            continue;
        };
        let along = |x: NodeIndex, other: NodeIndex| {
            mol.neighbours(x)
                .map(|(n, _)| n)
                .find(|&n| n != other && ring.contains_atom(n))
        };
        let (Some(ra), Some(rb)) = (along(a, b), along(b, a)) else {
            continue;
        };
        if double_bond_geometry(p, a, ra, b, rb) == Some(false) {
            out.push(TransRingBond {
                atoms: [p.input_atom_number(a), p.input_atom_number(b)],
                ring_size: ring.size(),
            });
        }
    }
    out
}

/// Like-halogen pairs across the single bond a-b, one halogen on each carbon.
fn count_vicinal_halogens(
    p: &PerceivedMolecule,
    types: &AtomTypes,
    a: NodeIndex,
    b: NodeIndex,
    out: &mut Interactions,
) {
    let halogens = |x: NodeIndex| -> Vec<AtomType> {
        p.mol
            .neighbours(x)
            .filter(|(n, _)| {
                matches!(
                    p.mol.atom(*n).element,
                    Element::F | Element::CL | Element::BR | Element::I
                )
            })
            .map(|(n, _)| types.ligand_type(n))
            .collect()
    };
    let (on_a, on_b) = (halogens(a), halogens(b));
    for x in &on_a {
        for y in on_b.iter().filter(|y| *y == x) {
            let name = format!("vicinal-{}", ligand_notation(&[*x, *y]));
            out.add(&name, None, 1);
        }
    }
}

/// Cis pairs across the acyclic double bond a=b, with tert-butyl pairs named apart. Where the
/// input gives no geometry the most stable arrangement (fewest and mildest cis pairs) is taken.
fn count_cis(
    p: &PerceivedMolecule,
    types: &AtomTypes,
    a: NodeIndex,
    b: NodeIndex,
    out: &mut Interactions,
) {
    let mol = &p.mol;
    let subs = |x: NodeIndex, other: NodeIndex| -> Vec<NodeIndex> {
        mol.neighbours(x)
            .filter(|(n, _)| *n != other && mol.atom(*n).element != Element::H)
            .map(|(n, _)| n)
            .collect()
    };
    let (sa, sb) = (subs(a, b), subs(b, a));
    if sa.is_empty() || sb.is_empty() {
        return;
    }
    let tb = |x: NodeIndex, from: NodeIndex| usize::from(is_tert_butyl(p, types, x, from));
    // Each candidate arrangement: the cis pairs (substituent on a, substituent on b).
    let arrangements: Vec<Vec<(NodeIndex, NodeIndex)>> = match (sa.len(), sb.len()) {
        (1, 1) => vec![vec![(sa[0], sb[0])], vec![]],
        (2, 1) => vec![vec![(sa[0], sb[0])], vec![(sa[1], sb[0])]],
        (1, 2) => vec![vec![(sa[0], sb[0])], vec![(sa[0], sb[1])]],
        (2, 2) => vec![
            vec![(sa[0], sb[0]), (sa[1], sb[1])],
            vec![(sa[0], sb[1]), (sa[1], sb[0])],
        ],
        _ => return,
    };
    let known = arrangements.iter().position(|pairs| match pairs.first() {
        Some(&(x, y)) => double_bond_geometry(p, a, x, b, y) == Some(true),
        None => {
            // The (1,1) trans case: known when the input says trans.
            double_bond_geometry(p, a, sa[0], b, sb[0]) == Some(false)
        }
    });
    // Order-free choice: fewest and mildest cis pairs (a tert-butyl pair costs most); between
    // equal ones, the heavier substituents trans (the smaller sum of atomic numbers in cis
    // pairs, E by the first atoms' priority).
    let cost = |pairs: &Vec<(NodeIndex, NodeIndex)>| -> (usize, u32) {
        let strain = pairs
            .iter()
            .map(|&(x, y)| 1 + 10 * (tb(x, a) + tb(y, b)))
            .sum();
        let weight = pairs
            .iter()
            .map(|&(x, y)| {
                u32::from(mol.atom(x).element.atomic_number())
                    + u32::from(mol.atom(y).element.atomic_number())
            })
            .sum();
        (strain, weight)
    };
    let names = |pairs: &Vec<(NodeIndex, NodeIndex)>| -> Vec<String> {
        let mut n: Vec<String> = pairs
            .iter()
            .map(|&(x, y)| cis_pair_name(p, types, a, b, x, y).0)
            .collect();
        n.sort();
        n
    };
    let chosen = match known {
        Some(i) => i,
        None => {
            let best = (0..arrangements.len())
                .min_by_key(|&i| cost(&arrangements[i]))
                .unwrap_or(0);
            let taken = names(&arrangements[best]);
            if arrangements.iter().any(|other| names(other) != taken) {
                out.notes.push(InteractionNote::DoubleBondGeometryUnknown {
                    atoms: [p.input_atom_number(a), p.input_atom_number(b)],
                    cis_pairs: taken,
                });
            }
            best
        }
    };
    for &(x, y) in &arrangements[chosen] {
        let (name, fallback) = cis_pair_name(p, types, a, b, x, y);
        out.add(&name, fallback, 1);
    }
}

/// The correction for one cis pair `x` (on `a`) and `y` (on `b`), and its stand-in.
fn cis_pair_name(
    p: &PerceivedMolecule,
    types: &AtomTypes,
    a: NodeIndex,
    b: NodeIndex,
    x: NodeIndex,
    y: NodeIndex,
) -> (String, Option<&'static str>) {
    let carbon = |n: NodeIndex| p.mol.atom(n).element == Element::C;
    if carbon(x) && carbon(y) {
        let tb = |s: NodeIndex, from: NodeIndex| usize::from(is_tert_butyl(p, types, s, from));
        let name = cis_name(tb(x, a) + tb(y, b));
        (name.to_string(), (name != "cis").then_some("cis"))
    } else {
        // Benson's cis value is for alkyl pairs; a polar pair (cis-1,2-dichloroethene is
        // the more stable isomer) gets a correction of its own or none.
        let pair = [types.ligand_type(x), types.ligand_type(y)];
        (format!("cis-{}", ligand_notation(&pair)), None)
    }
}

/// Whether substituents `sa` (on `a`) and `sb` (on `b`) are cis across the double bond a=b, from
/// the `/` `\` marks of the input; `None` when the input does not say.
fn double_bond_geometry(
    p: &PerceivedMolecule,
    a: NodeIndex,
    sa: NodeIndex,
    b: NodeIndex,
    sb: NodeIndex,
) -> Option<bool> {
    // Direction of a single bond read from `from` towards `to`.
    let read = |from: NodeIndex, to: NodeIndex| -> Option<BondDirection> {
        let e = p.mol.graph.find_edge(from, to)?;
        let (written_from, d) = p.mol.graph[e].direction?;
        Some(if written_from == from {
            d
        } else {
            match d {
                BondDirection::Up => BondDirection::Down,
                BondDirection::Down => BondDirection::Up,
            }
        })
    };
    let da = read(sa, a).or_else(|| other_substituent_direction(p, a, sa, b))?;
    let db = read(b, sb).or_else(|| {
        other_substituent_direction(p, b, sb, a).map(|d| match d {
            BondDirection::Up => BondDirection::Down,
            BondDirection::Down => BondDirection::Up,
        })
    })?;
    // F/C=C/F: same reading on both sides means trans.
    Some(da != db)
}

/// When only the other substituent of `x` carries a mark: its direction read towards `x`,
/// flipped (the two substituents of one end point opposite ways).
fn other_substituent_direction(
    p: &PerceivedMolecule,
    x: NodeIndex,
    s: NodeIndex,
    partner: NodeIndex,
) -> Option<BondDirection> {
    let other = p
        .mol
        .neighbours(x)
        .map(|(n, _)| n)
        .find(|&n| n != s && n != partner)?;
    let e = p.mol.graph.find_edge(other, x)?;
    let (written_from, d) = p.mol.graph[e].direction?;
    let towards_x = if written_from == other {
        d
    } else {
        match d {
            BondDirection::Up => BondDirection::Down,
            BondDirection::Down => BondDirection::Up,
        }
    };
    Some(match towards_x {
        BondDirection::Up => BondDirection::Down,
        BondDirection::Down => BondDirection::Up,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::groups::assign::assign_groups;

    fn count(smiles: &str, name: &str) -> u32 {
        let p = PerceivedMolecule::from_smiles(smiles).unwrap();
        let types = assign_groups(&p).unwrap().types;
        count_interactions(&p, &types)
            .counts
            .iter()
            .find(|c| c.name == name)
            .map_or(0, |c| c.count)
    }

    #[test]
    fn alkane_counts_follow_the_documented_rules() {
        assert_eq!(count("CC(C)(C)CC(C)(C)C", "1,5-interaction"), 3);
        assert_eq!(count("CC(C)(C)CC(C)C", "1,5-interaction"), 1);
        assert_eq!(count("CC(C)CC(C)C", "1,5-interaction"), 0);
        assert_eq!(count("CCCC", "gauche"), 0);
        assert_eq!(count("CC(C)C(C)C", "gauche"), 2);
    }

    #[test]
    fn ether_oxygen_counts_as_a_chain_atom() {
        assert_eq!(count("COC(C)(C)C", "gauche-(O)"), 2);
        assert_eq!(count("CC(C)OC(C)C", "gauche-(O)"), 2);
        assert_eq!(count("CCOCC", "gauche-(O)"), 0);
        assert_eq!(count("CC(C)(C)OC(C)(C)C", "gauche-(O)"), 4);
        assert_eq!(count("CC(C)(C)OC(C)(C)C", "1,5-interaction-(O)"), 3);
        // Alcohols, esters and ring oxygens are not ether chain atoms here.
        assert_eq!(count("CC(C)(C)O", "gauche-(O)"), 0);
        assert_eq!(count("CC(=O)OC(C)(C)C", "gauche-(O)"), 0);
        assert_eq!(count("CC1(C)CCCO1", "gauche-(O)"), 0);
        assert_eq!(count("CCOC(C)(C)OCC", "gauche-(O)"), 0);
    }

    #[test]
    fn vicinal_halogen_pairs() {
        assert_eq!(count("ClC(Cl)(Cl)C(Cl)(Cl)Cl", "vicinal-(Cl)2"), 9);
        assert_eq!(count("FC(F)(F)C(F)(F)Cl", "vicinal-(F)2"), 6);
        assert_eq!(count("FC(F)(F)C(F)(F)Cl", "vicinal-(F)(Cl)"), 0);
        assert_eq!(count("ClCCCl", "vicinal-(Cl)2"), 1);
        assert_eq!(count("ClCC(C)Cl", "vicinal-(Cl)2"), 1);
        assert_eq!(count("ClC(Cl)C", "vicinal-(Cl)2"), 0);
        assert_eq!(count("FC1CCCCC1F", "vicinal-(F)2"), 0);
    }

    #[test]
    fn cis_and_ortho_pairs() {
        assert_eq!(count("C/C=C\\C", "cis"), 1);
        assert_eq!(count("C/C=C/C", "cis"), 0);
        assert_eq!(count("Cc1ccccc1C", "ortho"), 1);
        assert_eq!(count("Cc1ccccc1F", "ortho-(C)(F)"), 1);
    }
}
