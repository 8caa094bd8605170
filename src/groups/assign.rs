//! Group assignment: every heavy atom that is a group centre gets its Benson group key.

use petgraph::graph::NodeIndex;

use super::key::{AtomType, GroupKey};
use super::typing::{type_atoms, AtomRole, AtomTypes, UntypedAtom};
use crate::molecule::{BondOrder, PerceivedMolecule};

/// One group of a molecule: the centre atom and its key.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct AssignedGroup {
    /// The centre atom.
    pub atom: NodeIndex,
    /// The group in Benson's notation.
    pub key: GroupKey,
}

/// The groups of a molecule, one per centre atom, plus the atom typing they came from.
#[derive(Debug, Clone)]
pub struct GroupAssignment {
    /// Groups in atom order.
    pub groups: Vec<AssignedGroup>,
    /// Roles of all atoms.
    pub types: AtomTypes,
}

fn share_aromatic_six_ring(p: &PerceivedMolecule, a: NodeIndex, b: NodeIndex) -> bool {
    p.rings.rings.iter().any(|r| {
        r.atoms.len() == 6
            && r.atoms.contains(&a)
            && r.atoms.contains(&b)
            && r.atoms.iter().all(|x| p.mol.atom(*x).aromatic)
    })
}

/// Assigns Benson groups to a perceived molecule.
pub fn assign_groups(p: &PerceivedMolecule) -> Result<GroupAssignment, UntypedAtom> {
    let types = type_atoms(p)?;
    let mut groups = Vec::new();
    for i in p.mol.atoms() {
        let Some(centre) = types.centre(i) else {
            continue;
        };
        let mut ligands: Vec<AtomType> = Vec::with_capacity(4);
        for (j, bond) in p.mol.neighbours(i) {
            if types.roles[j.index()] == AtomRole::Absorbed(i) {
                continue;
            }
            if centre.implies_partner() && bond.order > BondOrder::Single {
                continue;
            }
            if centre.implies_ring_neighbours() && share_aromatic_six_ring(p, i, j) {
                continue;
            }
            ligands.push(types.ligand_type(j));
        }
        ligands.extend(std::iter::repeat_n(
            AtomType::H,
            p.mol.atom(i).hydrogens as usize,
        ));
        groups.push(AssignedGroup {
            atom: i,
            key: GroupKey::new(centre, &ligands),
        });
    }
    Ok(GroupAssignment { groups, types })
}

/// Stand-ins for a key the tables lack, nearest first: (1) the generic key with every
/// carbon-type ligand taken as `C`, every nitrogen type as `N`, every sulfur type as `S`; (2) the
/// key with every aromatic ring nitrogen ligand (`NA`) taken as a benzene carbon `Cb` (an aza
/// ring atom in place of a CH one; common practice). Keys equal to `key` are left out.
pub fn stand_in_candidates(key: &GroupKey) -> Vec<GroupKey> {
    let aza_as_carbon = |t: AtomType| match t {
        AtomType::NA => AtomType::Cb,
        other => other,
    };
    let mut out: Vec<GroupKey> = Vec::new();
    for map in [
        &AtomType::generic as &dyn Fn(AtomType) -> AtomType,
        &aza_as_carbon,
    ] {
        let ligands: Vec<AtomType> = key
            .ligands
            .iter()
            .flat_map(|(t, n)| std::iter::repeat_n(map(*t), *n as usize))
            .collect();
        let candidate = GroupKey::new(key.centre, &ligands);
        if candidate != *key && !out.contains(&candidate) {
            out.push(candidate);
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    fn keys(smiles: &str) -> Vec<String> {
        let p = PerceivedMolecule::from_smiles(smiles).unwrap();
        let mut k: Vec<String> = assign_groups(&p)
            .unwrap()
            .groups
            .iter()
            .map(|g| g.key.to_string())
            .collect();
        k.sort();
        k
    }

    #[test]
    fn textbook_assignments() {
        assert_eq!(keys("CCC"), ["C-(C)(H)3", "C-(C)(H)3", "C-(C)2(H)2"]);
        assert_eq!(keys("C"), ["C-(H)4"]);
        assert_eq!(
            keys("Cc1ccccc1"),
            [
                "C-(Cb)(H)3",
                "Cb-(C)",
                "Cb-(H)",
                "Cb-(H)",
                "Cb-(H)",
                "Cb-(H)",
                "Cb-(H)"
            ]
        );
        assert_eq!(
            keys("CC(=O)OCC"),
            [
                "C-(C)(H)3",
                "C-(C)(O)(H)2",
                "C-(CO)(H)3",
                "CO-(C)(O)",
                "O-(C)(CO)"
            ]
        );
        assert_eq!(keys("C=C=C"), ["Ca", "Cd-(H)2", "Cd-(H)2"]);
        assert_eq!(keys("CC#N"), ["C-(CN)(H)3", "CN-(C)"]);
        assert_eq!(keys("C[N+](=O)[O-]"), ["C-(NO2)(H)3", "NO2-(C)"]);
        assert_eq!(
            keys("CS(=O)(=O)C"),
            ["C-(SO2)(H)3", "C-(SO2)(H)3", "SO2-(C)2"]
        );
        assert_eq!(keys("ClCCl"), ["C-(Cl)2(H)2"]);
        let naph = keys("c1ccc2ccccc2c1");
        assert_eq!(naph.iter().filter(|k| *k == "Cbf-(Cb)2(Cbf)").count(), 2);
        assert_eq!(naph.iter().filter(|k| *k == "Cb-(H)").count(), 8);
        assert_eq!(keys("C1=CC=CC=C1"), keys("c1ccccc1"));
        assert_eq!(
            keys("C=CC=C"),
            ["Cd-(Cd)(H)", "Cd-(Cd)(H)", "Cd-(H)2", "Cd-(H)2"]
        );
    }

    #[test]
    fn untreatable_atoms_are_named() {
        let p = PerceivedMolecule::from_smiles("C[Si](C)(C)C").unwrap();
        let err = assign_groups(&p).unwrap_err();
        assert!(err.reason.contains("Si"), "{}", err.reason);
        let p = PerceivedMolecule::from_smiles("[CH3]").unwrap();
        assert!(assign_groups(&p).unwrap_err().reason.contains("radical"));
    }

    #[test]
    fn stand_ins_generalise_ligands_then_read_aza_as_carbon() {
        let names = |k: &str| -> Vec<String> {
            stand_in_candidates(&GroupKey::parse(k).unwrap())
                .iter()
                .map(|c| c.to_string())
                .collect()
        };
        assert_eq!(names("C-(Cb)(CO)(H)2"), ["C-(C)2(H)2"]);
        assert_eq!(
            names("Cbf-(Cb)(Cbf)(NA)"),
            ["Cbf-(C)2(N)", "Cbf-(Cb)2(Cbf)"]
        );
        assert!(names("C-(C)(H)3").is_empty());
    }
}
