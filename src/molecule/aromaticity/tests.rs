//! Tests of aromaticity perception.

use super::*;
use crate::molecule::parse_smiles;

/// Parses, perceives rings and aromaticity, and returns the molecule with its rings.
fn perceived(smiles: &str) -> (Molecule, RingInfo) {
    let mut mol = match parse_smiles(smiles) {
        Ok(mol) => mol,
        Err(e) => panic!("test SMILES {smiles} did not parse: {e}"),
    };
    let rings = RingInfo::perceive(&mol);
    perceive_aromaticity(&mut mol, &rings);
    (mol, rings)
}

fn aromatic_atoms(mol: &Molecule) -> usize {
    mol.atoms().filter(|&a| mol.atom(a).aromatic).count()
}

fn aromatic_bonds(mol: &Molecule) -> usize {
    mol.graph.edge_weights().filter(|b| b.aromatic).count()
}

/// Aromatic by the Hückel rule (textbook examples, common practice): number of aromatic
/// atoms and bonds expected. Written in Kekulé form where possible, so that the flags come
/// from perception and not from lower-case input.
#[test]
fn aromatic_molecules() {
    let cases = [
        ("benzene", "C1=CC=CC=C1", 6, 6),
        ("benzene, aromatic input", "c1ccccc1", 6, 6),
        ("naphthalene", "C1=CC=C2C=CC=CC2=C1", 10, 11),
        ("anthracene", "C1=CC=C2C=C3C=CC=CC3=CC2=C1", 14, 16),
        ("phenanthrene", "C1=CC=C2C(=C1)C=CC1=CC=CC=C12", 14, 16),
        ("pyrene", "c1cc2ccc3cccc4ccc(c1)c2c34", 16, 19),
        ("azulene", "C1=CC2=CC=CC=CC2=C1", 10, 11),
        ("pyridine", "C1=CC=NC=C1", 6, 6),
        ("pyrrole", "C1=CNC=C1", 5, 5),
        ("furan", "C1=COC=C1", 5, 5),
        ("thiophene", "C1=CSC=C1", 5, 5),
        ("indole", "C1=CC=C2C(=C1)C=CN2", 9, 10),
        ("quinoline", "C1=CC=C2C(=C1)C=CC=N2", 10, 11),
        ("cyclopentadienyl anion", "[CH-]1C=CC=C1", 5, 5),
        ("tropylium", "[CH+]1C=CC=CC=C1", 7, 7),
        ("2-pyridone", "O=C1C=CC=CN1", 6, 6),
        ("pyridinium", "C1=CC=[NH+]C=C1", 6, 6),
        ("imidazole", "C1=CN=CN1", 5, 5),
    ];
    for (name, smiles, atoms, bonds) in cases {
        let (mol, _) = perceived(smiles);
        assert_eq!(aromatic_atoms(&mol), atoms, "{name}");
        assert_eq!(aromatic_bonds(&mol), bonds, "{name}");
    }
}

/// Not aromatic (textbook examples, common practice).
#[test]
fn non_aromatic_molecules() {
    for (name, smiles) in [
        ("cyclohexene", "C1=CCCCC1"),
        ("cyclooctatetraene", "C1=CC=CC=CC=C1"),
        ("1,4-cyclohexadiene", "C1=CCC=CC1"),
        ("cyclopentadiene", "C1=CCC=C1"),
        ("p-benzoquinone", "O=C1C=CC(=O)C=C1"),
        ("fulvene", "C=C1C=CC=C1"),
        ("cyclobutadiene", "C1=CC=C1"),
        ("cyclohexane", "C1CCCCC1"),
    ] {
        let (mol, _) = perceived(smiles);
        assert_eq!(aromatic_atoms(&mol), 0, "{name}");
        assert_eq!(aromatic_bonds(&mol), 0, "{name}");
    }
}

/// Fused groups: the imide rings of pyromellitic diimide are aromatic only together with the
/// benzene ring (perimeter 10 pi electrons); cycl[3.3.3]azine has a 12-electron perimeter and
/// stays non-aromatic; anthraquinone's middle ring stays non-aromatic. Expected flags agree
/// with RDKit 2026.09.1 (run while writing the test).
#[test]
fn fused_ring_groups() {
    let (mol, _) = perceived("C1=C2C(=CC3=C1C(=O)NC3=O)C(=O)NC2=O");
    assert_eq!(aromatic_atoms(&mol), 12);
    let (mol, _) = perceived("C1=CC2=CC=CC3=CC=CC(=C1)N23");
    assert_eq!(aromatic_atoms(&mol), 0);
    let (mol, _) = perceived("O=C1C2=CC=CC=C2C(=O)C2=CC=CC=C12");
    assert_eq!(aromatic_atoms(&mol), 12);
    assert_eq!(aromatic_bonds(&mol), 12);
}

/// Boron with three single bonds is left out (boroxine, borazine); borabenzene's B=C counts.
#[test]
fn boron_rings() {
    assert_eq!(aromatic_atoms(&perceived("B1OBOBO1").0), 0);
    assert_eq!(aromatic_atoms(&perceived("B1NBNBN1").0), 0);
    assert_eq!(aromatic_atoms(&perceived("C1=CB=CC=C1").0), 6);
}

/// Biphenyl's connecting bond and styrene's vinyl group stay non-aromatic.
#[test]
fn substituents_stay_non_aromatic() {
    let (mol, rings) = perceived("c1ccccc1-c1ccccc1");
    assert_eq!(aromatic_atoms(&mol), 12);
    assert_eq!(aromatic_bonds(&mol), 12);
    for e in mol.graph.edge_indices() {
        assert_eq!(mol.graph[e].aromatic, rings.is_ring_bond(e));
    }
    let (mol, _) = perceived("C=CC1=CC=CC=C1");
    assert_eq!(aromatic_atoms(&mol), 6);
    assert_eq!(aromatic_bonds(&mol), 6);
    assert!(!mol.atom(NodeIndex::new(0)).aromatic);
    assert!(!mol.atom(NodeIndex::new(1)).aromatic);
}

/// Kekulé and aromatic input give the same flags.
#[test]
fn kekule_and_aromatic_input_agree() {
    for (kekule, aromatic) in [
        ("C1=CC=C2C=CC=CC2=C1", "c1ccc2ccccc2c1"),
        ("C1=CNC=C1", "c1cc[nH]c1"),
        ("CC1=CC=CC=C1", "Cc1ccccc1"),
    ] {
        let (a, _) = perceived(kekule);
        let (b, _) = perceived(aromatic);
        let flags = |m: &Molecule| -> Vec<bool> { m.atoms().map(|i| m.atom(i).aromatic).collect() };
        let bond_flags =
            |m: &Molecule| -> Vec<bool> { m.graph.edge_weights().map(|x| x.aromatic).collect() };
        assert_eq!(flags(&a), flags(&b), "{kekule}");
        assert_eq!(bond_flags(&a), bond_flags(&b), "{kekule}");
    }
}

/// Benzenoid rings (for Benson's `Cb` groups): benzene rings of tetralin and naphthalene, not
/// pyridine, not the saturated ring of tetralin.
#[test]
fn benzenoid_rings() {
    let count = |smiles: &str| {
        let (mol, rings) = perceived(smiles);
        rings
            .rings
            .iter()
            .filter(|r| is_benzenoid_ring(&mol, r))
            .count()
    };
    assert_eq!(count("c1ccccc1"), 1);
    assert_eq!(count("c1ccc2ccccc2c1"), 2);
    assert_eq!(count("c1ccc2c(c1)CCCC2"), 1);
    assert_eq!(count("c1ccncc1"), 0);
    assert_eq!(count("C1=CCCCC1"), 0);
}
