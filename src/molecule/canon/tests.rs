//! Unit tests for the canonical writer's small rules.

use super::stereo::sort_parity;
use super::*;
use crate::molecule::parse_smiles;

fn key(smiles: &str) -> String {
    match parse_smiles(smiles) {
        Ok(m) => canonical_smiles(&m),
        Err(e) => panic!("{smiles}: {e}"),
    }
}

#[test]
fn parity_of_small_permutations() {
    assert_eq!(sort_parity(&[1, 2, 3, 4]), Some(false));
    assert_eq!(sort_parity(&[2, 1, 3, 4]), Some(true));
    assert_eq!(sort_parity(&[4, 3, 2, 1]), Some(false));
    assert_eq!(sort_parity(&[1, 1, 2, 3]), None);
}

#[test]
fn empty_molecule_has_empty_key() {
    assert_eq!(canonical_smiles(&Molecule::new()), "");
}

#[test]
fn kekule_structures_of_benzene_agree() {
    assert_eq!(key("C1=CC=CC=C1"), key("C=1C=CC=CC=1"));
    assert_eq!(key("C1=CC=CC=C1"), key("c1ccccc1"));
    assert_eq!(key("c1ccccc1"), "c1ccccc1");
}

#[test]
fn pyrrole_keeps_its_single_kekule_structure() {
    assert_eq!(key("c1cc[nH]c1"), key("C1=CNC=C1"));
    assert_eq!(key(&key("C1=CNC=C1")), key("C1=CNC=C1"));
    assert!(!key("C1=CNC=C1").contains('c'));
}

#[test]
fn single_bond_between_lower_case_rings_is_written() {
    let k = key("c1ccccc1-c1ccccc1");
    assert!(k.contains('-'), "{k}");
    assert_eq!(key(&k), k);
}

#[test]
fn explicit_hydrogens_fold() {
    assert_eq!(key("[H]C([H])([H])[H]"), "C");
    assert_eq!(key("[CH4]"), "C");
    assert_eq!(key("[H][C@](F)(Cl)Br"), key("F[C@@H](Cl)Br"));
}

#[test]
fn non_stereogenic_centre_loses_its_mark() {
    assert_eq!(key("C[C@H](C)O"), key("CC(C)O"));
    assert_eq!(key("C[C@@H](C)O"), key("CC(C)O"));
}

#[test]
fn double_bond_marks_read_both_ways() {
    assert_eq!(key("F/C=C/F"), key("F\\C=C\\F"));
    assert_ne!(key("F/C=C/F"), key("F/C=C\\F"));
    assert_eq!(key("[H]/C(F)=C/F"), key("F\\C=C/F"));
}

#[test]
fn long_chain_is_written_without_recursion() {
    let chain = "C".repeat(3000);
    assert_eq!(key(&chain), chain);
}
