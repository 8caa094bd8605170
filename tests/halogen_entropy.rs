//! Replacing a hydrogen by a halogen never lowers S298 (issue 14): a halogen ligand carries its
//! own entropy (mass, moments of inertia, low bending modes), so every group of the tables that
//! holds a halogen must give more entropy than the same molecule with a hydrogen in its place.
//!
//! Checked on every halogenated species of the reference set (tests/reference/thermo_reference.tsv)
//! and on a hand list covering the halogen groups of each family: each halogen atom in turn is
//! replaced by a hydrogen, and where both molecules get an S298 the halogenated one must be the
//! larger. The entropies compared are intrinsic (S298 + R ln sigma - R ln n, the estimate's own
//! symmetry number and optical isomers taken out): a swap changes the symmetry of either side
//! (CF2=CF2 has sigma 4, CHF=CF2 1), which is not what the groups must get right.

mod common;

use common::Table;
use ringheat::molecule::{parse_smiles, Element, PerceivedMolecule};
use ringheat::thermo::estimate::{EstimateOptions, GroupAdditivity};
use ringheat::units::GAS_CONSTANT_J_PER_MOL_K;

/// Allowed shortfall of the intrinsic entropy (J/(mol K)): rounding of the tabulated values
/// only (our choice), far below any halogen's own entropy (about 20 J/(mol K) for F).
const MARGIN_J: f64 = 0.5;

/// Hand list: one molecule per halogen-group family (alkyl, vinyl, aryl, acyl, benzylic, allylic,
/// geminal and vicinal halides).
const HAND_LIST: &[&str] = &[
    "CC(C)F",
    "CC(C)Cl",
    "CC(C)Br",
    "CC(C)I",
    "CC(C)(C)Cl",
    "CC(C)(C)Br",
    "CC(Cl)(Cl)C",
    "CC(F)Cl",
    "C=CF",
    "C=CCl",
    "C=CBr",
    "C=CI",
    "CC(=C)Cl",
    "Fc1ccccc1",
    "Clc1ccccc1",
    "Brc1ccccc1",
    "Ic1ccccc1",
    "Clc1ccccc1Cl",
    "Fc1ccccc1F",
    "CC(=O)F",
    "CC(=O)Cl",
    "CC(=O)Br",
    "ClCc1ccccc1",
    "C=CCBr",
    "C=CCI",
    "FC(F)(F)C(=O)O",
    "ClCC(=O)O",
    "ClCCCl",
    "CCCCl",
    "FC(F)=C(F)F",
    "ClC(Cl)=C(Cl)Cl",
    "Clc1c(Cl)c(Cl)c(Cl)c(Cl)c1Cl",
];

/// Intrinsic S298 of `smiles` with its halogen atom number `which` (0-based among halogens) replaced by a
/// hydrogen, and of `smiles` itself.
fn pair(engine: &GroupAdditivity, smiles: &str, which: usize) -> Option<(f64, f64)> {
    let mol = parse_smiles(smiles).ok()?;
    let halogens: Vec<_> = mol
        .atoms()
        .filter(|&a| is_halogen(mol.atom(a).element))
        .collect();
    let target = *halogens.get(which)?;
    let mut parent = mol.clone();
    parent.graph[target].element = Element::H;
    let opts = EstimateOptions::default();
    let s = |m: &ringheat::molecule::Molecule| -> Option<f64> {
        let est = engine.estimate(&PerceivedMolecule::new(m), &opts).ok()?;
        let r = GAS_CONSTANT_J_PER_MOL_K;
        est.s298_j.map(|q| {
            q.value + r * (est.symmetry.total as f64).ln()
                - r * (est.symmetry.optical_isomers as f64).ln()
        })
    };
    Some((s(&mol)?, s(&parent)?))
}

fn is_halogen(e: Element) -> bool {
    matches!(e.atomic_number(), 9 | 17 | 35 | 53)
}

fn halogen_count(smiles: &str) -> usize {
    parse_smiles(smiles)
        .map(|m| m.atoms().filter(|&a| is_halogen(m.atom(a).element)).count())
        .unwrap_or(0)
}

#[test]
fn replacing_h_by_a_halogen_never_lowers_s298() {
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    let table = Table::read("thermo_reference.tsv");
    let c_smiles = table.column("smiles");
    let mut molecules: Vec<String> = HAND_LIST.iter().map(|s| s.to_string()).collect();
    molecules.extend(
        table
            .rows
            .iter()
            .map(|r| r.get(c_smiles).to_string())
            .filter(|s| halogen_count(s) > 0),
    );
    let mut checked = 0;
    let mut lower = Vec::new();
    for smiles in &molecules {
        for which in 0..halogen_count(smiles) {
            let Some((with_x, with_h)) = pair(&engine, smiles, which) else {
                continue;
            };
            checked += 1;
            if with_x < with_h - MARGIN_J {
                lower.push(format!(
                    "{smiles} (halogen {}): intrinsic S298 {with_x:.1} against {with_h:.1} J/(mol K) \
                     with H",
                    which + 1
                ));
            }
        }
    }
    assert!(checked > 200, "only {checked} H-to-halogen pairs estimated");
    assert!(
        lower.is_empty(),
        "{} of {checked} halogen swaps lower S298:\n{}",
        lower.len(),
        lower.join("\n")
    );
}
