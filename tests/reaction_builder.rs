//! CBH reaction builder: the textbook reactions of small rings, balance and acyclic products on
//! a structure set, no panic on 500 PubChem structures, and strain energies from measured values.

mod common;

use common::{catch, Table};
use ringheat::molecule::canon::canonical_smiles;
use ringheat::molecule::parse_smiles;
use ringheat::reactions::{
    build_hierarchy, build_reaction, strain_from_reaction, Reaction, ReactionError, ReferenceTable,
    Rung, SourceTag, Species,
};
use ringheat::thermo::Quantity;

/// kJ per kcal (thermochemical calorie, exact by definition).
const KJ_PER_KCAL: f64 = 4.184;

fn key(smiles: &str) -> String {
    canonical_smiles(&parse_smiles(smiles).expect("test SMILES parses"))
}

fn reaction(smiles: &str, rung: Rung) -> Reaction {
    let mol = parse_smiles(smiles).expect("test SMILES parses");
    build_reaction(&mol, rung).unwrap_or_else(|e| panic!("{smiles} {rung}: {e}"))
}

/// One side of a reaction as sorted (canonical SMILES, coefficient) pairs.
type Side = Vec<(String, u32)>;

/// The reaction's two sides.
fn sides(r: &Reaction) -> (Side, Side) {
    let list = |terms: &[(Species, u32)]| {
        let mut v: Vec<(String, u32)> = terms.iter().map(|(s, n)| (s.smiles.clone(), *n)).collect();
        v.sort();
        v
    };
    (list(&r.reactants), list(&r.products))
}

fn expect(smiles: &str, rung: Rung, reactants: &[(&str, u32)], products: &[(&str, u32)]) {
    let r = reaction(smiles, rung);
    let want = |terms: &[(&str, u32)]| {
        let mut v: Vec<(String, u32)> = terms.iter().map(|(s, n)| (key(s), *n)).collect();
        v.sort();
        v
    };
    assert_eq!(
        sides(&r),
        (want(reactants), want(products)),
        "{smiles} {rung}: {r}"
    );
    assert_eq!(r.reactants[0].0.smiles, key(smiles), "target first");
    assert_eq!(r.reactants[0].1, 1, "target coefficient 1");
}

#[test]
fn cyclopropane_rungs() {
    // The CBH-2 and CBH-3 reactions are the ones R. O. Ramabhadran and K. Raghavachari, J. Chem.
    // Theory Comput. 7 (2011) 2094 give (recalled from memory); CBH-0 and CBH-1 follow from the definitions.
    expect(
        "C1CC1",
        Rung::Cbh0,
        &[("C1CC1", 1), ("[HH]", 3)],
        &[("C", 3)],
    );
    expect("C1CC1", Rung::Cbh1, &[("C1CC1", 1), ("C", 3)], &[("CC", 3)]);
    expect(
        "C1CC1",
        Rung::Cbh2,
        &[("C1CC1", 1), ("CC", 3)],
        &[("CCC", 3)],
    );
    expect(
        "C1CC1",
        Rung::Cbh3,
        &[("C1CC1", 1), ("CCC", 3)],
        &[("CCCC", 3)],
    );
}

#[test]
fn cyclobutane_and_benzene() {
    expect(
        "C1CCC1",
        Rung::Cbh2,
        &[("C1CCC1", 1), ("CC", 4)],
        &[("CCC", 4)],
    );
    expect(
        "C1CCC1",
        Rung::Cbh3,
        &[("C1CCC1", 1), ("CCC", 4)],
        &[("CCCC", 4)],
    );
    // Benzene CBH-2: the Kekulé bonds give 3 ethylene and 3 ethane on the left, 6 propene.
    expect(
        "c1ccccc1",
        Rung::Cbh2,
        &[("c1ccccc1", 1), ("C=C", 3), ("CC", 3)],
        &[("C=CC", 6)],
    );
    // A heteroatom keeps its bonds: oxirane CBH-2.
    expect(
        "C1CO1",
        Rung::Cbh2,
        &[("C1CO1", 1), ("CC", 1), ("CO", 2)],
        &[("CCO", 2), ("COC", 1)],
    );
}

#[test]
fn acyclic_molecules_reduce_to_nothing_at_high_rungs() {
    for (smiles, rung) in [
        ("C", Rung::Cbh1),
        ("CC", Rung::Cbh1),
        ("CCC", Rung::Cbh2),
        ("CC(C)C", Rung::Cbh2),
        ("CCCC", Rung::Cbh3),
        ("C[C@H](O)CC", Rung::Cbh3),
    ] {
        let r = reaction(smiles, rung);
        assert!(r.target_cancelled(), "{smiles} {rung}: {r}");
        assert!(r.is_empty(), "{smiles} {rung}: {r}");
    }
    // n-hexane CBH-2 is not empty: hexane + 3 ethane -> 4 propane.
    expect(
        "CCCCCC",
        Rung::Cbh2,
        &[("CCCCCC", 1), ("CC", 3)],
        &[("CCC", 4)],
    );
}

/// Structures of every kind the builder must handle.
const SET: &[&str] = &[
    // acyclic
    "CCCC",
    "CC(C)(C)C",
    "C=CC=C",
    "CC#CC",
    "CCO",
    "CC(=O)O",
    "CN(C)C",
    "CCS",
    "ClCCl",
    "FC(F)(F)C",
    "OCCO",
    "C[NH3+]",
    "C[C@H](O)CC",
    "C/C=C/CC",
    "C[N+](=O)[O-]",
    "CN(=O)=O",
    "CS(C)=O",
    "C[N+]#[C-]",
    "[C-]#[O+]",
    // monocyclic
    "C1CC1",
    "C1CCC1",
    "C1CCCC1",
    "C1CCCCC1",
    "C1CCCCCCC1",
    "C1=CC1",
    "C1CC=C1",
    "CC1(C)CC1",
    "O=C1CCC1",
    "C1CN1",
    "C1CS1",
    "C1COC1",
    "O=C1CCO1",
    "ClC1CC1",
    "FC1(F)CC1",
    "N#CC1CC1",
    "OC1CCCCC1",
    "C1CCOC1",
    "C1CCNC1",
    "C1=CCCC1",
    "C1CCC/C=C\\CC1",
    "C1CCS(=O)(=O)C1",
    "O=[N+]([O-])C1CC1",
    // fused, bridged, spiro, cages
    "C1CCC2CCCCC2C1",
    "C1CC2CC2C1",
    "C1CC2CCC1C2",
    "C1C2CC1C2",
    "C1C2CC3CC1CC(C2)C3",
    "C1C23CC12C3",
    "C1CC11CC1",
    "C1CCC2(C1)CCCC2",
    "C12C3C4C1C5C2C3C45",
    // aromatic
    "c1ccccc1",
    "Cc1ccccc1",
    "Oc1ccccc1",
    "c1ccncc1",
    "c1cc[nH]c1",
    "c1ccoc1",
    "c1ccsc1",
    "c1ccc2ccccc2c1",
    "c1ccc2c(c1)CC2",
];

/// Element and charge balance, checked independently of the builder.
fn check_balance(r: &Reaction) -> Result<(), String> {
    common::reaction_imbalance(r).map_or(Ok(()), Err)
}

#[test]
fn every_rung_balances_with_acyclic_fragments() {
    let mut built = 0;
    for smiles in SET {
        let mol = parse_smiles(smiles).expect("test SMILES parses");
        for (rung, result) in Rung::ALL.iter().zip(build_hierarchy(&mol)) {
            let r = result.unwrap_or_else(|e| panic!("{smiles} {rung}: {e}"));
            assert_eq!(r.rung, *rung);
            check_balance(&r).unwrap_or_else(|e| panic!("{smiles} {rung}: {e}: {r}"));
            for (species, n) in r.reactants.iter().chain(&r.products) {
                assert!(*n > 0);
                if species.smiles != r.target.smiles {
                    assert_eq!(
                        species.molecule.cyclomatic_number(),
                        0,
                        "{smiles} {rung}: fragment {} has a ring",
                        species.smiles
                    );
                }
            }
            built += 1;
        }
    }
    assert_eq!(built, 4 * SET.len());
}

#[test]
fn bad_targets_are_typed_errors() {
    let hydrogen = parse_smiles("[HH]").expect("parses");
    assert_eq!(
        build_reaction(&hydrogen, Rung::Cbh1).err(),
        Some(ReactionError::NoHeavyAtom)
    );
    let salt = parse_smiles("C[NH3+].[Cl-]").expect("parses");
    assert!(matches!(
        build_reaction(&salt, Rung::Cbh2),
        Err(ReactionError::Disconnected { components: 2 })
    ));
    let deuterated = parse_smiles("[2H]C1CC1").expect("parses");
    assert!(matches!(
        build_reaction(&deuterated, Rung::Cbh2),
        Err(ReactionError::LabelledHydrogen { .. })
    ));
}

#[test]
fn pubchem_structures_build_or_fail_cleanly() {
    let table = Table::read("smiles_structures.tsv");
    let col = table.column("smiles");
    let (mut ok, mut refused, mut unparsed) = (0, 0, 0);
    let mut defects = Vec::new();
    let mut refusals = std::collections::BTreeMap::new();
    for row in table.rows.iter().take(500) {
        let smiles = row.get(col);
        let Ok(mol) = parse_smiles(smiles) else {
            unparsed += 1;
            continue;
        };
        let outcome = catch(|| build_hierarchy(&mol));
        let results = match outcome {
            Ok(results) => results,
            Err(panic) => {
                defects.push(format!("line {}: {smiles}: {panic}", row.line));
                continue;
            }
        };
        for result in results {
            match result {
                Ok(r) => match check_balance(&r) {
                    Ok(()) => ok += 1,
                    Err(e) => defects.push(format!("line {}: {smiles}: {e}", row.line)),
                },
                Err(
                    e @ (ReactionError::Unbalanced { .. }
                    | ReactionError::TargetCoefficient { .. }
                    | ReactionError::AbnormalSpecies { .. }),
                ) => {
                    defects.push(format!("line {}: {smiles}: {e}", row.line));
                }
                Err(e) => {
                    refused += 1;
                    let kind = format!("{e:?}");
                    let kind = kind.split([' ', '{']).next().unwrap_or("").to_string();
                    *refusals.entry(kind).or_insert(0) += 1;
                }
            }
        }
    }
    eprintln!(
        "500 rows: {ok} reactions built, {refused} refused {refusals:?}, {unparsed} unparsed"
    );
    assert!(defects.is_empty(), "{}", defects.join("\n"));
    assert!(ok > 1500, "only {ok} reactions built");
}

/// Gas-phase Hf298 (kJ/mol) of a structure from tests/reference/thermo_reference.tsv
/// (ATcT 1.112 or CRC Handbook values via the chemicals package, as the file header says).
fn measured_hf(smiles: &str) -> Quantity {
    let table = Table::read("thermo_reference.tsv");
    let (s, hf, unc) = (
        table.column("smiles"),
        table.column("hf298_kj"),
        table.column("hf298_unc_kj"),
    );
    let wanted = key(smiles);
    let row = table
        .rows
        .iter()
        .find(|r| parse_smiles(r.get(s)).is_ok_and(|m| canonical_smiles(&m) == wanted))
        .unwrap_or_else(|| panic!("{smiles} not in thermo_reference.tsv"));
    let value: f64 = row.get(hf).parse().expect("number");
    // CRC rows carry no uncertainty; 1 kJ/mol stands in (common practice for CRC gas values).
    let uncertainty: f64 = row.get(unc).parse().unwrap_or(1.0);
    Quantity::new(value, uncertainty)
}

/// Strain (kcal/mol) of `smiles` at `rung`, every other species from the bundled ATcT table.
fn strain_kcal(smiles: &str, rung: Rung, target_hf: Quantity) -> Quantity {
    let table = ReferenceTable::bundled().expect("bundled reference table loads");
    let r = reaction(smiles, rung);
    let se = strain_from_reaction(&r, target_hf, &|s| table.lookup(s))
        .unwrap_or_else(|e| panic!("{smiles} {rung}: {e}"));
    assert!(!se.heat.uses_fallback());
    let kcal = se.strain_kj.scaled(1.0 / KJ_PER_KCAL);
    eprintln!(
        "{smiles} {rung}: {r}; strain {:.2} +- {:.2} kcal/mol",
        kcal.value, kcal.uncertainty
    );
    kcal
}

#[test]
fn strain_energies_from_measured_values() {
    let table = ReferenceTable::bundled().expect("bundled reference table loads");
    let cyclopropane = table
        .get(&key("C1CC1"))
        .expect("ATcT has cyclopropane")
        .hf298_kj;
    // 27.5 kcal/mol: the textbook strain of cyclopropane (common practice), +-1 kcal/mol.
    let se = strain_kcal("C1CC1", Rung::Cbh2, cyclopropane);
    assert!((se.value - 27.5).abs() < 1.0, "cyclopropane CBH-2: {se:?}");
    assert!(se.uncertainty < 0.5, "{se:?}");
    // 26.5 kcal/mol: cyclobutane (common practice textbook value), +-1 kcal/mol.
    let se = strain_kcal("C1CCC1", Rung::Cbh2, measured_hf("C1CCC1"));
    assert!((se.value - 26.5).abs() < 1.0, "cyclobutane CBH-2: {se:?}");
    // Cyclohexane is close to strain-free (common practice: 0 to 1 kcal/mol).
    let se = strain_kcal("C1CCCCC1", Rung::Cbh2, measured_hf("C1CCCCC1"));
    assert!(se.value.abs() < 1.5, "cyclohexane CBH-2: {se:?}");
    // An acyclic molecule: n-hexane CBH-2 heat near zero (Ramabhadran and Raghavachari 2011,
    // recalled from memory), within 1 kcal/mol.
    let se = strain_kcal("CCCCCC", Rung::Cbh2, measured_hf("CCCCCC"));
    assert!(se.value.abs() < 1.0, "n-hexane CBH-2: {se:?}");
}

#[test]
fn missing_species_are_named_and_fallbacks_flagged() {
    let r = reaction("C1CC1", Rung::Cbh3);
    let none = |_: &Species| None;
    let err = strain_from_reaction(&r, Quantity::new(53.6, 0.5), &none).err();
    assert!(
        matches!(err, Some(ReactionError::MissingHeat { .. })),
        "{err:?}"
    );
    // Every species from a stand-in: the heat is flagged and the target's value is the caller's.
    let stand_in = |_: &Species| {
        let tag = SourceTag::Fallback {
            method: "test stand-in".to_string(),
        };
        Some((Quantity::new(0.0, 1.0), tag))
    };
    let se = strain_from_reaction(&r, Quantity::new(10.0, 0.0), &stand_in).expect("prices");
    assert!(se.heat.uses_fallback());
    assert!((se.strain_kj.value - 10.0).abs() < 1e-9);
    // Three butane and three propane at 1 kJ/mol each, in quadrature: sqrt(18).
    assert!((se.strain_kj.uncertainty - 18f64.sqrt()).abs() < 1e-9);
}

#[test]
fn bundled_reference_table_loads() {
    let table = ReferenceTable::bundled().expect("loads");
    assert!(table.len() > 150, "{} entries", table.len());
    for smiles in [
        "C", "CC", "CCC", "CCCC", "C=C", "O", "N", "CO", "C1CC1", "[HH]",
    ] {
        assert!(table.get(&key(smiles)).is_some(), "{smiles} missing");
    }
}

#[test]
fn group_additivity_stands_in_for_missing_references() {
    use ringheat::reactions::{group_additivity_fallback, lookup_with_fallback};
    use ringheat::thermo::GroupAdditivity;
    // Only the ATcT small-molecule file, so that 2-methylbutane is missing from the table.
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("group-tables/reference/reference-species.toml");
    let text = std::fs::read_to_string(&path).expect("ATcT reference file");
    let table = ReferenceTable::from_toml(&text, &path).expect("ATcT reference file loads");
    let estimator = GroupAdditivity::bundled().expect("bundled group tables load");
    let fallback = group_additivity_fallback(&estimator);
    let lookup = lookup_with_fallback(&table, &fallback, "Benson group additivity");
    // Methylcyclopentane CBH-3 needs 2-methylbutane, which the ATcT set lacks.
    let r = reaction("CC1CCCC1", Rung::Cbh3);
    let target = measured_hf("CC1CCCC1");
    let se = strain_from_reaction(&r, target, &lookup).expect("prices with the fallback");
    assert!(se.heat.uses_fallback());
    assert!(se
        .heat
        .fallback_species()
        .contains(&key("CCC(C)C").as_str()));
    let kcal = se.strain_kj.value / KJ_PER_KCAL;
    eprintln!(
        "CC1CCCC1 CBH-3: {r}; strain {kcal:.2} kcal/mol (fallback: {:?})",
        se.heat.fallback_species()
    );
    // Common practice: a cyclopentane ring carries about 6.2 kcal/mol of strain (textbook
    // cyclopentane value); +-3 allows for the methyl group and the group-additivity stand-ins.
    assert!((kcal - 6.2).abs() < 3.0, "{kcal}");
}

#[test]
fn every_fragment_of_the_reference_set_is_a_normal_molecule() {
    use ringheat::reactions::{abnormal_species, molecule_problem};
    // Every structure of tests/reference/thermo_reference.tsv (measured neutral closed-shell
    // molecules, see its header) at every rung: each species must be a neutral molecule whose
    // atoms have normal valences (charge-separated units of charge zero allowed).
    let table = Table::read("thermo_reference.tsv");
    let col = table.column("smiles");
    let (mut built, mut targets, mut skipped) = (0, 0, Vec::new());
    let mut bad = Vec::new();
    for row in &table.rows {
        let smiles = row.get(col);
        let Ok(mol) = parse_smiles(smiles) else {
            continue;
        };
        if let Some(problem) = molecule_problem(&mol) {
            skipped.push(format!("{smiles}: {problem}"));
            continue;
        }
        targets += 1;
        for (rung, result) in Rung::ALL.iter().zip(build_hierarchy(&mol)) {
            let r = match result {
                Ok(r) => r,
                // The builder's own check turns such a reaction into this error.
                Err(e @ ReactionError::AbnormalSpecies { .. }) => {
                    bad.push(format!("line {}: {smiles} {rung}: {e}", row.line));
                    continue;
                }
                Err(e) => panic!("line {}: {smiles} {rung}: {e}", row.line),
            };
            built += 1;
            // Checked here too, independently of the builder's check.
            if let Some((species, problem)) = abnormal_species(&r).first() {
                bad.push(format!(
                    "line {}: {smiles} {rung}: {} ({problem}) in {r}",
                    row.line, species.smiles
                ));
            }
        }
    }
    eprintln!(
        "{targets} targets, {built} reactions built, {} with abnormal species; targets skipped: {skipped:?}",
        bad.len()
    );
    for b in &bad {
        eprintln!("{b}");
    }
    assert!(
        bad.is_empty(),
        "{} reactions with abnormal species",
        bad.len()
    );
}

#[test]
fn functional_units_stay_whole() {
    // Nitromethane: the nitro group is one super-atom, so the only CBH bond is C-N and the
    // CBH-0 pieces are methane and the unit capped once (H-NO2), not [NH4+] and [OH-].
    expect(
        "C[N+](=O)[O-]",
        Rung::Cbh0,
        &[("C[N+](=O)[O-]", 1), ("[HH]", 1)],
        &[("C", 1), ("O=[NH+][O-]", 1)],
    );
    assert!(reaction("C[N+](=O)[O-]", Rung::Cbh1).is_empty());
    // Sulfolane: the sulfonyl group stays whole at every rung.
    expect(
        "C1CCS(=O)(=O)C1",
        Rung::Cbh0,
        &[("C1CCS(=O)(=O)C1", 1), ("[HH]", 5)],
        &[("C", 4), ("O=[SH2]=O", 1)],
    );
    expect(
        "C1CCS(=O)(=O)C1",
        Rung::Cbh2,
        &[("C1CCS(=O)(=O)C1", 1), ("CC", 3), ("C[SH](=O)=O", 2)],
        &[("CCC", 2), ("CC[SH](=O)=O", 2), ("CS(C)(=O)=O", 1)],
    );
    // Carbonyl and cyano groups are cut as in the CBH papers: water and ammonia at CBH-0.
    expect(
        "CC(C)=O",
        Rung::Cbh0,
        &[("CC(C)=O", 1), ("[HH]", 4)],
        &[("C", 3), ("O", 1)],
    );
    expect(
        "CC#N",
        Rung::Cbh0,
        &[("CC#N", 1), ("[HH]", 4)],
        &[("C", 2), ("N", 1)],
    );
    // Nitrocyclopropane CBH-2: the nitro group rides on its carbon (2-nitropropane); as a
    // terminal super-atom its own piece equals its bond piece and drops out.
    expect(
        "O=[N+]([O-])C1CC1",
        Rung::Cbh2,
        &[("O=[N+]([O-])C1CC1", 1), ("CC", 3)],
        &[("CCC", 2), ("CC(C)[N+](=O)[O-]", 1)],
    );
}

#[test]
fn ring_double_bonds_are_cis_in_fragments() {
    // Cyclopentene CBH-3: the piece around the ring C=C is cis-2-butene.
    expect(
        "C1=CCCC1",
        Rung::Cbh3,
        &[("C1=CCCC1", 1), ("C=CC", 2), ("CCC", 3)],
        &[("C/C=C\\C", 1), ("C=CCC", 2), ("CCCC", 2)],
    );
    // It is priced with the measured cis-2-butene entry (ATcT 1.112), not a stereo-free key.
    let table = ReferenceTable::bundled().expect("bundled reference table loads");
    let cis = table
        .get(&key("C/C=C\\C"))
        .expect("cis-2-butene in the table");
    assert_eq!(cis.name, "cis-2-Butene");
    assert!(table.get(&key("CC=CC")).is_none());
    let r = reaction("C1=CCCC1", Rung::Cbh3);
    let se = strain_from_reaction(&r, measured_hf("C1=CCCC1"), &|s| table.lookup(s))
        .unwrap_or_else(|e| panic!("cyclopentene CBH-3: {e}"));
    assert!(!se.heat.uses_fallback());
    let kcal = se.strain_kj.value / KJ_PER_KCAL;
    eprintln!("C1=CCCC1 CBH-3: {r}; strain {kcal:.2} kcal/mol");
    // Recalled from memory: cyclopentene's ring strain is quoted at about 5 to 7 kcal/mol
    // (Benson's ring correction 5.9 kcal/mol); +-2 kcal/mol around 6.
    assert!((kcal - 6.0).abs() < 2.0, "{kcal}");
    // Cyclopropene and a Kekule benzene bond give the cis piece too.
    let has = |smiles: &str, rung: Rung, piece: &str| {
        let r = reaction(smiles, rung);
        r.products.iter().any(|(s, _)| s.smiles == key(piece))
    };
    assert!(has("C1=CC1", Rung::Cbh3, "C/C=C\\C"));
    assert!(has("c1ccccc1", Rung::Cbh3, "C/C=C\\C"));
    // An eight-membered ring keeps the written geometry, else none; acyclic bonds keep theirs.
    assert!(has("C1CCC/C=C\\CC1", Rung::Cbh3, "C/C=C\\C"));
    assert!(has("C1=CCCCCCC1", Rung::Cbh3, "CC=CC"));
    assert!(has("C/C=C/CC", Rung::Cbh3, "C/C=C/C"));
    assert!(has("CC=CCC", Rung::Cbh3, "CC=CC"));
    // A written acyclic target still cancels against its own fragments.
    assert!(reaction("C/C=C\\C", Rung::Cbh3).is_empty());
}
