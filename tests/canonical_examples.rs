//! Canonical SMILES: hand-written spellings of the same molecule share one key, different
//! molecules get different keys, and every key reads back to itself.
//!
//! Each group lists one molecule written several ways (atom order, ring digits, branches,
//! Kekulé or lower-case aromatic form, explicit hydrogens). The structures are textbook
//! molecules; the spellings were written by hand for this test (no outside source).

use ringheat::molecule::{canon::canonical_smiles, parse_smiles};

const GROUPS: &[(&str, &[&str])] = &[
    ("methane", &["C", "[CH4]", "[H]C([H])([H])[H]", "[H][CH2][H]"]),
    ("ethane", &["CC", "C-C", "[CH3][CH3]", "[H]C([H])([H])C"]),
    ("propane", &["CCC", "C(C)C", "[CH2](C)C"]),
    ("isobutane", &["CC(C)C", "C(C)(C)C", "C(C(C)C)", "[CH](C)(C)C"]),
    ("neopentane", &["CC(C)(C)C", "C(C)(C)(C)C", "C(C(C)(C)C)"]),
    ("n-hexane", &["CCCCCC", "C(CCCCC)", "C(CC)CCC"]),
    ("cyclopropane", &["C1CC1", "C1C2.C12", "C%10CC%10", "C1CC-1"]),
    ("cyclobutane", &["C1CCC1", "C1C2.C2C1", "C2CCC2"]),
    ("cyclohexane", &["C1CCCCC1", "C1CCC(CC1)", "C(C1)CCCC1", "C%99CCCCC%99"]),
    ("methylcyclopropane", &["CC1CC1", "C1CC1C", "C1C(C)C1"]),
    ("benzene", &["c1ccccc1", "C1=CC=CC=C1", "C=1C=CC=CC=1", "c1ccc2.c2c1"]),
    ("toluene", &["Cc1ccccc1", "c1ccccc1C", "CC1=CC=CC=C1", "CC1C=CC=CC=1", "c1cc(C)ccc1"]),
    ("naphthalene", &["c1ccc2ccccc2c1", "C1=CC=C2C=CC=CC2=C1", "C1=CC2=CC=CC=C2C=C1", "c1cccc2c1cccc2"]),
    ("anthracene", &["c1ccc2cc3ccccc3cc2c1", "C1=CC=C2C=C3C=CC=CC3=CC2=C1", "c1cc2cc3ccccc3cc2cc1"]),
    ("phenanthrene", &["c1ccc2c(c1)ccc1ccccc12", "C1=CC=C2C(=C1)C=CC1=CC=CC=C12", "c1cccc2c1c1ccccc1cc2"]),
    ("pyrene", &["c1cc2ccc3cccc4ccc(c1)c2c34", "c1cc2ccc3cccc4c3c2c(c1)cc4"]),
    ("biphenyl", &["c1ccc(cc1)-c1ccccc1", "c1ccccc1c1ccccc1", "C1=CC=C(C=C1)C1=CC=CC=C1"]),
    ("pyridine", &["c1ccncc1", "n1ccccc1", "C1=CC=NC=C1", "C1=NC=CC=C1"]),
    ("pyrrole", &["c1cc[nH]c1", "[nH]1cccc1", "C1=CNC=C1", "N1C=CC=C1"]),
    ("furan", &["c1ccoc1", "o1cccc1", "C1=COC=C1"]),
    ("thiophene", &["c1ccsc1", "s1cccc1", "C1=CSC=C1"]),
    ("indole", &["c1ccc2[nH]ccc2c1", "C1=CC=C2NC=CC2=C1", "c1cccc2c1cc[nH]2", "N1C=CC2=CC=CC=C12"]),
    ("2-pyridone", &["O=c1cccc[nH]1", "O=C1C=CC=CN1", "N1C(=O)C=CC=C1"]),
    ("p-benzoquinone", &["O=C1C=CC(=O)C=C1", "C1=CC(=O)C=CC1=O", "O=C1C=CC(C=C1)=O"]),
    ("azulene", &["c1ccc2cccc2cc1", "C1=CC=C2C=CC=C2C=C1", "C1=CC2=CC=CC2=CC=C1"]),
    ("cyclooctatetraene", &["C1=CC=CC=CC=C1", "C=1C=CC=CC=CC=1", "c1ccccccc1"]),
    ("norbornane", &["C1CC2CCC1C2", "C1C2CCC1CC2", "C1CC2CC1CC2"]),
    ("norbornene", &["C1CC2CC1C=C2", "C1=CC2CCC1C2", "C2C1CCC2C=C1"]),
    ("spiro[4.5]decane", &["C1CCC2(CC1)CCCC2", "C1CCCC12CCCCC2", "C12(CCCC1)CCCCC2"]),
    ("decalin", &["C1CCC2CCCCC2C1", "C1CC2CCCCC2CC1", "C12CCCCC1CCCC2"]),
    ("cubane", &["C12C3C4C1C5C2C3C45", "C15C2C3C1C4C5C2C34", "C%10%11C%12C%13C%10C%14C%11C%12C%13%14"]),
    ("adamantane", &["C1C2CC3CC1CC(C2)C3", "C1C3CC2CC(CC1C2)C3"]),
    ("dodecahedrane", &[
        "C12C3C4C5C1C1C6C7C2C2C8C3C3C4C4C5C1C1C5C6C6C7C2C2C8C3C4C1C5C62",
        "C87C6C5C4C8C8C3C2C7C7C1C6C6C5C5C4C8C8C4C3C3C2C7C7C1C6C5C8C4C37",
    ]),
    ("oxirane", &["C1CO1", "C1OC1", "O1CC1"]),
    ("1,4-dioxane", &["C1COCCO1", "O1CCOCC1", "C1OCCOC1"]),
    ("acetic acid", &["CC(=O)O", "OC(C)=O", "C(C)(O)=O", "[H]OC(=O)C"]),
    ("acetate", &["CC(=O)[O-]", "[O-]C(C)=O", "C(=O)([O-])C"]),
    ("ammonium", &["[NH4+]", "[H][N+]([H])([H])[H]", "[NH3+][H]"]),
    ("tetramethylammonium", &["C[N+](C)(C)C", "[N+](C)(C)(C)C", "C[N+](C)(C)[CH3]"]),
    ("N-methylpyridinium", &["C[n+]1ccccc1", "c1cc[n+](C)cc1", "C[N+]1=CC=CC=C1", "C1=CC=[N+](C)C=C1"]),
    ("pyridine N-oxide", &["[O-][n+]1ccccc1", "[O-][N+]1=CC=CC=C1", "c1cc[n+]([O-])cc1"]),
    ("nitrobenzene", &["O=[N+]([O-])c1ccccc1", "[O-][N+](=O)C1=CC=CC=C1", "c1ccc(cc1)[N+]([O-])=O"]),
    ("13C-methane", &["[13CH4]", "[H][13C]([H])([H])[H]", "[13CH3][H]"]),
    ("1-13C-ethanol", &["C[13CH2]O", "O[13CH2]C", "[13CH2](O)C", "[H]O[13CH2]C"]),
    ("tetradeuteromethane", &["[2H]C([2H])([2H])[2H]", "C([2H])([2H])([2H])[2H]"]),
    ("hydrogen cyanide", &["C#N", "N#C", "[CH]#N"]),
    ("2-butyne", &["CC#CC", "C(#CC)C", "C(C)#CC"]),
    ("allene", &["C=C=C", "C(=C)=C", "[CH2]=C=[CH2]"]),
    ("carbon dioxide", &["O=C=O", "C(=O)=O", "O=[C]=O"]),
    ("sodium chloride", &["[Na+].[Cl-]", "[Cl-].[Na+]"]),
    ("ethanol + water", &["CCO.O", "O.CCO", "OCC.[OH2]"]),
    ("dimethyl sulfone", &["CS(=O)(=O)C", "O=S(=O)(C)C", "CS(C)(=O)=O"]),
    ("methylphosphonic acid", &["CP(=O)(O)O", "OP(O)(C)=O", "O=P(C)(O)O"]),
    ("methyl radical", &["[CH3]", "[H][CH2]"]),
    ("hydrogen", &["[H][H]", "[H]-[H]"]),
    ("1,3,5-triazine", &["c1ncncn1", "n1cncnc1", "C1=NC=NC=N1"]),
    ("caffeine", &["Cn1cnc2c1c(=O)n(C)c(=O)n2C", "CN1C=NC2=C1C(=O)N(C)C(=O)N2C", "O=C1N(C)C(=O)c2c(ncn2C)N1C"]),
    ("tBu4-methane", &["CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C", "C(C(C)(C)C)(C(C)(C)C)(C(C)(C)C)C(C)(C)C"]),
    ("hexamethylbenzene", &["Cc1c(C)c(C)c(C)c(C)c1C", "CC1=C(C)C(C)=C(C)C(C)=C1C", "C1(C)=C(C)C(C)=C(C)C(C)=C1C"]),
    ("bromochlorofluoromethane (R)", &["F[C@H](Cl)Br", "F[C@]([H])(Cl)Br", "Cl[C@@H](F)Br", "[C@H](F)(Br)Cl", "Br[C@@H](Cl)F"]),
    ("bromochlorofluoromethane (S)", &["F[C@@H](Cl)Br", "Cl[C@H](F)Br", "[C@@H](F)(Br)Cl", "Br[C@H](Cl)F"]),
    ("L-alanine", &["C[C@H](N)C(=O)O", "N[C@@H](C)C(=O)O", "OC(=O)[C@H](C)N", "[C@H](C)(C(=O)O)N"]),
    ("D-alanine", &["C[C@@H](N)C(=O)O", "N[C@H](C)C(=O)O", "OC(=O)[C@@H](C)N"]),
    ("(S,S)-tartaric acid", &["O[C@@H]([C@H](O)C(=O)O)C(=O)O", "OC(=O)[C@@H](O)[C@H](O)C(=O)O", "[C@@H](O)(C(=O)O)[C@H](O)C(=O)O"]),
    ("(R,R)-tartaric acid", &["OC(=O)[C@H](O)[C@@H](O)C(=O)O", "O[C@H]([C@@H](O)C(=O)O)C(=O)O", "[C@H](O)(C(=O)O)[C@@H](O)C(=O)O"]),
    ("meso-tartaric acid", &["O[C@@H]([C@@H](O)C(=O)O)C(=O)O", "OC(=O)[C@@H](O)[C@@H](O)C(=O)O", "O[C@H]([C@H](O)C(=O)O)C(=O)O"]),
    ("cis-1,4-dimethylcyclohexane", &["C[C@H]1CC[C@@H](C)CC1", "C[C@@H]1CC[C@H](C)CC1", "C1C[C@@H](C)CC[C@H]1C"]),
    ("trans-1,4-dimethylcyclohexane", &["C[C@H]1CC[C@H](C)CC1", "C[C@@H]1CC[C@@H](C)CC1", "C1C[C@H](C)CC[C@H]1C"]),
    ("trans-2-butene", &["C/C=C/C", "C\\C=C\\C", "C(\\C)=C/C", "[H]\\C(C)=C/C"]),
    ("cis-2-butene", &["C/C=C\\C", "C\\C=C/C", "C(/C)=C/C"]),
    ("trans-1,2-difluoroethene", &["F/C=C/F", "F\\C=C\\F", "C(\\F)=C/F"]),
    ("cis-1,2-difluoroethene", &["F/C=C\\F", "F\\C=C/F", "C(/F)=C/F"]),
    ("(E,E)-2,4-hexadiene", &["C/C=C/C=C/C", "C\\C=C\\C=C\\C", "C(=C/C)\\C=C\\C"]),
    ("(E,Z)-2,4-hexadiene", &["C/C=C/C=C\\C", "C\\C=C/C=C/C", "C/C=C\\C=C\\C"]),
    ("isopropanol", &["CC(C)O", "C[C@H](C)O", "C[C@@H](C)O", "OC(C)C"]),
    ("2-methyl-2-butene", &["CC=C(C)C", "C/C=C(/C)C", "CC(C)=CC"]),
    ("(R)-2-butanol", &["C[C@@H](O)CC", "CC[C@@H](C)O", "O[C@H](C)CC"]),
    ("(S)-2-butanol", &["C[C@H](O)CC", "CC[C@H](C)O", "O[C@@H](C)CC"]),
    ("methyl ethyl sulfoxide (one enantiomer)", &["C[S@](=O)CC", "CC[S@](C)=O", "O=[S@@](C)CC"]),
    ("methyl ethyl sulfoxide (other enantiomer)", &["C[S@@](=O)CC", "CC[S@@](C)=O", "O=[S@](C)CC"]),
    ("all-cis-1,3,5-trimethylcyclohexane", &["C[C@H]1C[C@@H](C)C[C@@H](C)C1", "C[C@@H]1C[C@H](C)C[C@H](C)C1"]),
    ("cis,trans-1,3,5-trimethylcyclohexane", &["C[C@H]1C[C@@H](C)C[C@H](C)C1", "C[C@H]1C[C@H](C)C[C@@H](C)C1", "C[C@@H]1C[C@@H](C)C[C@H](C)C1"]),
    ("C60", &[
        "c12c3c4c5c1c1c6c7c2c2c8c3c3c9c4c4c%10c5c5c1c1c6c6c%11c7c2c2c7c8c3c3c8c9c4c4c9c%10c5c5c1c1c6c6c%11c2c2c7c3c3c8c4c4c9c5c1c1c6c2c3c41",
        "c98c7c6c5c9c9c4c3c8c8c2c7c7c1c6c6c%90c5c5c9c9c4c4c%99c3c8c8c3c2c7c7c2c1c6c6c1c%90c5c5c9c9c4c4c%99c8c8c3c7c7c2c6c6c1c5c9c9c4c8c7c69",
    ]),
];

fn key(smiles: &str) -> String {
    match parse_smiles(smiles) {
        Ok(mol) => canonical_smiles(&mol),
        Err(e) => panic!("{smiles} does not parse: {e}"),
    }
}

#[test]
fn every_spelling_gives_one_key() {
    let mut failures = Vec::new();
    for (name, spellings) in GROUPS {
        let keys: Vec<String> = spellings.iter().map(|s| key(s)).collect();
        if keys.iter().any(|k| *k != keys[0]) {
            failures.push(format!("{name}: {spellings:?} -> {keys:?}"));
        }
    }
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}

#[test]
fn different_molecules_give_different_keys() {
    let mut seen: std::collections::HashMap<String, &str> = std::collections::HashMap::new();
    for (name, spellings) in GROUPS {
        let k = key(spellings[0]);
        if let Some(other) = seen.insert(k.clone(), name) {
            panic!("{name} and {other} share the key {k}");
        }
    }
}

#[test]
fn keys_read_back_to_themselves() {
    for (name, spellings) in GROUPS {
        let k = key(spellings[0]);
        assert_eq!(key(&k), k, "{name}");
    }
}

#[test]
fn key_keeps_atoms_and_bonds() {
    for (name, spellings) in GROUPS {
        let (Ok(a), Ok(b)) = (parse_smiles(spellings[0]), parse_smiles(&key(spellings[0]))) else {
            panic!("{name}");
        };
        let a = a.with_hydrogens_folded();
        let b = b.with_hydrogens_folded();
        assert_eq!(a.atom_count(), b.atom_count(), "{name}");
        assert_eq!(a.bond_count(), b.bond_count(), "{name}");
        let h =
            |m: &ringheat::molecule::Molecule| m.atoms().map(|i| m.total_hydrogens(i)).sum::<u32>();
        assert_eq!(h(&a), h(&b), "{name}");
    }
}

#[test]
fn isomers_are_told_apart() {
    let pairs = [
        ("F[C@H](Cl)Br", "F[C@@H](Cl)Br"),
        ("C/C=C/C", "C/C=C\\C"),
        ("C[C@H]1CC[C@@H](C)CC1", "C[C@H]1CC[C@H](C)CC1"),
        (
            "O[C@@H]([C@H](O)C(=O)O)C(=O)O",
            "O[C@@H]([C@@H](O)C(=O)O)C(=O)O",
        ),
        ("CC(C)O", "CCCO"),
        ("c1ccccc1", "C1=CCC=CC1"),
        ("[13CH4]", "C"),
        ("CC(=O)O", "CC(=O)[O-]"),
    ];
    for (a, b) in pairs {
        assert_ne!(key(a), key(b), "{a} vs {b}");
    }
}

/// The pentavalent and the charge-separated spellings of a nitro group are one molecule.
#[test]
fn nitro_spellings_share_a_key() {
    let key = |s: &str| {
        ringheat::molecule::canonical_smiles(&ringheat::molecule::parse_smiles(s).expect("parses"))
    };
    assert_eq!(key("CN(=O)=O"), key("C[N+](=O)[O-]"));
    assert_eq!(key("O=N(=O)c1ccccc1"), key("[O-][N+](=O)c1ccccc1"));
    assert_ne!(key("CN=O"), key("C[N+](=O)[O-]"));
}
