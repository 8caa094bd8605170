//! Checks of computed enthalpies: the round trip with measured heats of formation standing in
//! for computed enthalpies, and the named errors of bad energies files.

use ringheat::computed::{
    check_computed, parse_energies, CheckError, CheckOptions, EnergiesError, InputUnit,
};
use ringheat::molecule::parse_smiles;
use ringheat::reactions::{build_reaction, ReferenceTable, Rung};
use ringheat::thermo::Quantity;

/// kJ/mol per hartree (CODATA 2018, see `ringheat::units`).
use ringheat::units::KJ_PER_HARTREE;

#[test]
fn measured_heats_of_formation_round_trip_through_cbh2() {
    // With each species' measured Hf298 in place of its computed enthalpy, dH(computed) is the
    // measured reaction heat, so the derived Hf298 of the target must be its measured value.
    let table = ReferenceTable::bundled().expect("bundled reference table loads");
    let lookup = |s: &ringheat::reactions::Species| table.lookup(s);
    let mut done = 0;
    let mut worst: f64 = 0.0;
    for entry in table.iter() {
        let Ok(mol) = parse_smiles(&entry.smiles) else {
            continue;
        };
        if mol.cyclomatic_number() == 0 {
            continue;
        }
        let Ok(reaction) = build_reaction(&mol, Rung::Cbh2) else {
            continue;
        };
        // Every co-species measured: no stand-ins in this test.
        let others: Option<Vec<(String, Quantity)>> = reaction
            .signed_terms()
            .filter(|(s, _)| s.smiles != reaction.target.smiles)
            .map(|(s, _)| table.get(&s.smiles).map(|e| (s.smiles.clone(), e.hf298_kj)))
            .collect();
        let Some(others) = others else { continue };
        for unit in [InputUnit::KjPerMol, InputUnit::Hartree] {
            let (scale, decimals) = match unit {
                InputUnit::Hartree => (1.0 / KJ_PER_HARTREE, 10),
                _ => (1.0, 6),
            };
            // The target as the table spells it (not canonical): matching is by structure.
            let mut text = format!(
                "# fake computed enthalpies: measured Hf298 values (round-trip test)\n{} {:.*} {}\n",
                entry.smiles,
                decimals,
                entry.hf298_kj.value * scale,
                unit.word()
            );
            for (smiles, hf) in &others {
                text.push_str(&format!(
                    "{smiles} {:.*} {}\n",
                    decimals,
                    hf.value * scale,
                    unit.word()
                ));
            }
            let energies = parse_energies(&text, "round-trip").expect("file reads");
            let check = check_computed(
                &reaction,
                &energies,
                &lookup,
                None,
                &CheckOptions::default(),
            )
            .unwrap_or_else(|e| panic!("{}: {e}", entry.smiles));
            let diff = (check.hf298_kj.value - entry.hf298_kj.value).abs();
            worst = worst.max(diff);
            // Rounding of the printed values only: 1e-3 kJ/mol is far above it.
            assert!(
                diff < 1e-3,
                "{} ({:?}): off by {diff} kJ/mol",
                entry.smiles,
                unit
            );
        }
        done += 1;
    }
    eprintln!("round trip: {done} ring molecules, largest difference {worst:.2e} kJ/mol");
    assert!(done >= 20, "only {done} ring molecules");
}

fn cyclopropane_check(text: &str) -> Result<f64, CheckError> {
    let table = ReferenceTable::bundled().expect("loads");
    let reaction =
        build_reaction(&parse_smiles("C1CC1").expect("parses"), Rung::Cbh2).expect("builds");
    let energies = parse_energies(text, "bad.txt").map_err(CheckError::Energies)?;
    check_computed(
        &reaction,
        &energies,
        &|s| table.lookup(s),
        Some(Quantity::new(53.6, 2.8)),
        &CheckOptions::default(),
    )
    .map(|c| c.hf298_kj.value)
}

fn errors(text: &str) -> Vec<EnergiesError> {
    match cyclopropane_check(text) {
        Err(CheckError::Energies(e)) => e.0,
        other => panic!("expected energies errors, got {other:?}"),
    }
}

// Invented enthalpies (hartree) for the tests below; they are not results of any calculation.
const GOOD: &str = "C1CC1 -117.845341 hartree\nCC -79.738000 hartree\nCCC -119.034000 hartree\n";

#[test]
fn a_good_file_checks() {
    let hf = cyclopropane_check(GOOD).expect("checks");
    // refs: 3 x (-104.39) - 3 x (-83.78) (ATcT 1.112) minus dH; dH = -0.042659 Eh = -112.0 kJ/mol.
    assert!((hf - 50.17).abs() < 0.1, "{hf}");
}

#[test]
fn missing_species_is_named() {
    let e = errors("C1CC1 -117.845341 hartree\nCC -79.738 hartree\n");
    assert_eq!(e.len(), 1);
    assert!(
        matches!(&e[0], EnergiesError::Missing { key, role, .. } if key == "CCC" && role == "product x 3"),
        "{e:?}"
    );
    assert!(e[0].to_string().contains("bad.txt") && e[0].to_string().contains("CCC"));
}

#[test]
fn species_twice_is_named_with_both_lines() {
    let e = errors(&format!("{GOOD}C(C) -79.7 hartree\n"));
    assert!(
        matches!(&e[0], EnergiesError::Duplicate { line: 4, first_line: 2, smiles, .. } if smiles == "C(C)"),
        "{e:?}"
    );
    assert!(e[0].to_string().starts_with("bad.txt:4: C(C):"));
}

#[test]
fn mixed_units_are_refused() {
    let e = errors("C1CC1 -117.845341 hartree\nCC -209354.1 kJ/mol\nCCC -119.034 hartree\n");
    assert!(
        matches!(&e[0], EnergiesError::MixedUnits { line: 2, first_line: 1, smiles, .. } if smiles == "CC"),
        "{e:?}"
    );
}

#[test]
fn unparsable_smiles_is_named() {
    let e = errors(&format!("{GOOD}C1CC -1.0 hartree\n"));
    assert!(
        matches!(&e[0], EnergiesError::Smiles { line: 4, smiles, .. } if smiles == "C1CC"),
        "{e:?}"
    );
}

#[test]
fn species_not_in_the_reaction_is_named() {
    let e = errors(&format!("{GOOD}CCCC -158.3 hartree\n"));
    assert!(
        matches!(&e[0], EnergiesError::NotInReaction { line: 4, smiles, .. } if smiles == "CCCC"),
        "{e:?}"
    );
}

#[test]
fn unfilled_template_lines_bad_numbers_and_units_are_named() {
    let e = errors(
        "C1CC1 ? hartree # target\nCC -79.7x hartree\nCCC -119.0 joules\nCC(C)C -1.0 hartree extra\n",
    );
    assert_eq!(e.len(), 4, "{e:?}");
    let lines: Vec<String> = e.iter().map(ToString::to_string).collect();
    assert!(lines[0].starts_with("bad.txt:1: C1CC1:"), "{lines:?}");
    assert!(lines[1].starts_with("bad.txt:2: CC:"), "{lines:?}");
    assert!(lines[2].contains("joules"), "{lines:?}");
    assert!(lines[3].contains("must start with #"), "{lines:?}");
    // All problems of a file come together, none dropped.
    let several = errors("C1CC1 -117.8 hartree\nCC -79.7 kJ/mol\nC1CC -1 hartree\n");
    assert_eq!(several.len(), 2, "{several:?}");
}

#[test]
fn the_template_reads_back_once_filled_in() {
    let reaction =
        build_reaction(&parse_smiles("C1CC12CC2").expect("parses"), Rung::Cbh2).expect("builds");
    let text = ringheat::computed::energies::template(&reaction, InputUnit::KjPerMol);
    // Unfilled: one error per species, each naming it.
    let unfilled = parse_energies(&text, "t").expect_err("template has ? values");
    assert_eq!(unfilled.0.len(), reaction.signed_terms().count());
    // Filled with zeros (invented): reads, and every species of the reaction is there.
    let filled = text.replace("  ?  ", "  0.0  ");
    let energies = parse_energies(&filled, "t").expect("filled template reads");
    for (s, _) in reaction.signed_terms() {
        assert!(energies.get(&s.smiles).is_some(), "{}", s.smiles);
    }
}

#[test]
fn tolerance_flag() {
    let table = ReferenceTable::bundled().expect("loads");
    let reaction =
        build_reaction(&parse_smiles("C1CC1").expect("parses"), Rung::Cbh2).expect("builds");
    let energies = parse_energies(GOOD, "good").expect("reads");
    let lookup = |s: &ringheat::reactions::Species| table.lookup(s);
    // A group-additivity value for the comparison (invented for this test).
    let ga = Some(Quantity::new(53.6, 2.8));
    let tight = CheckOptions {
        tolerance_kj: 1.0,
        method_uncertainty_kj: 4.0,
    };
    let c = check_computed(&reaction, &energies, &lookup, ga, &tight).expect("checks");
    assert!(c.flagged && !c.flags.is_empty());
    assert!((c.strain_kj.value - 112.0).abs() < 0.01);
    assert!(c.hf298_kj.uncertainty > 4.0);
    let loose = CheckOptions::default();
    let c = check_computed(&reaction, &energies, &lookup, ga, &loose).expect("checks");
    assert!(!c.flagged);
}
