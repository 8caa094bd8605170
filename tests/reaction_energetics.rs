//! Reaction energetics against published reaction heats (tests/reference/
//! reaction_heats_published.toml, each with its source): with the measured reference values
//! within 2 kJ/mol, with every species estimated within the estimate's stated uncertainty.

use std::collections::BTreeMap;

use ringheat::molecule::{canonical_smiles, parse_smiles};
use ringheat::phase::Phase;
use ringheat::reactions::energetics::{
    reaction_energetics, EnergeticsData, EnergeticsOptions, SpeciesValues,
};
use ringheat::reactions::equation::ReactionEquation;
use ringheat::thermo::Quantity;

#[derive(serde::Deserialize)]
struct File {
    reaction: Vec<Check>,
}

#[derive(serde::Deserialize)]
#[allow(dead_code)]
struct Check {
    name: String,
    equation: String,
    phase: String,
    dh_kj: f64,
    source: String,
    note: Option<String>,
}

fn checks() -> Vec<Check> {
    let text = include_str!("reference/reaction_heats_published.toml");
    toml::from_str::<File>(text)
        .expect("check file reads")
        .reaction
}

fn key(smiles: &str) -> String {
    canonical_smiles(&parse_smiles(smiles).expect("parses"))
}

/// H2 and water, which group additivity cannot price, as user values (ATcT 1.112 gas values,
/// CRC liquid water, recalled from memory).
fn small_species() -> BTreeMap<String, SpeciesValues> {
    let mut v = BTreeMap::new();
    v.insert(
        key("[HH]"),
        SpeciesValues {
            hf298_gas_kj: Some(Quantity::new(0.0, 0.0)),
            ..SpeciesValues::default()
        },
    );
    v.insert(
        key("O"),
        SpeciesValues {
            hf298_gas_kj: Some(Quantity::new(-241.82, 0.03)),
            hf298_liquid_kj: Some(Quantity::new(-285.83, 0.04)),
            ..SpeciesValues::default()
        },
    );
    v
}

#[test]
fn measured_values_reproduce_published_heats() {
    let data = EnergeticsData::bundled().expect("bundled data");
    for c in checks() {
        let eq = ReactionEquation::parse(&c.equation).expect("equation parses");
        let options = EnergeticsOptions {
            default_phase: Phase::parse(&c.phase).expect("phase"),
            strain: false,
            ..EnergeticsOptions::default()
        };
        let r = reaction_energetics(&eq, &data, &options).expect("energetics");
        let d = r.dh298_kj.value - c.dh_kj;
        println!(
            "{}: measured {:.2} ± {:.2}, published {:.1} ({}); difference {d:+.2}",
            c.name, r.dh298_kj.value, r.dh298_kj.uncertainty, c.dh_kj, c.source
        );
        assert!(d.abs() <= 2.0, "{}: {d:+.2} kJ/mol", c.name);
    }
}

#[test]
fn estimates_reproduce_published_heats_within_their_uncertainty() {
    let data = EnergeticsData::bundled().expect("bundled data");
    for c in checks() {
        let eq = ReactionEquation::parse(&c.equation).expect("equation parses");
        let options = EnergeticsOptions {
            default_phase: Phase::parse(&c.phase).expect("phase"),
            strain: false,
            use_measured: false,
            user_values: small_species(),
            ..EnergeticsOptions::default()
        };
        let r = reaction_energetics(&eq, &data, &options).expect("energetics");
        let d = r.dh298_kj.value - c.dh_kj;
        println!(
            "{}: estimated {:.2} ± {:.2}, published {:.1}; difference {d:+.2}",
            c.name, r.dh298_kj.value, r.dh298_kj.uncertainty, c.dh_kj
        );
        assert!(
            d.abs() <= r.dh298_kj.uncertainty,
            "{}: {d:+.2} kJ/mol",
            c.name
        );
    }
}

#[test]
fn per_mole_per_gram_and_kirchhoff() {
    let data = EnergeticsData::bundled().expect("bundled data");
    let eq = ReactionEquation::parse("2 C1CC1.2 [H][H]>>2 CCC").expect("parses");
    let options = EnergeticsOptions {
        temperatures_k: vec![500.0],
        per_reactant: Some("C1CC1".to_string()),
        ..EnergeticsOptions::default()
    };
    let r = reaction_energetics(&eq, &data, &options).expect("energetics");
    let (_, nu, per_mol) = r.per_reactant.clone().expect("per reactant");
    assert_eq!(nu, 2.0);
    assert!((per_mol.value * 2.0 - r.dh298_kj.value).abs() < 1e-9);
    // Per gram: dH / (2 x 42.08 + 2 x 2.016) g.
    let mass = 2.0 * 42.081 + 2.0 * 2.016;
    assert!((r.reacting_mass_g - mass).abs() < 0.01);
    assert!((r.dh298_j_per_g.value - r.dh298_kj.value * 1000.0 / r.reacting_mass_g).abs() < 1e-6);
    // Kirchhoff: the 500 K heat differs from the 298 K one by the integral of dCp, a few kJ/mol.
    let hot = r.rows[1].dh_kj.expect("a value at 500 K");
    assert!((hot.value - r.dh298_kj.value).abs() < 15.0);
    assert!((hot.value - r.dh298_kj.value).abs() > 0.1);
    // K follows dG: log10 K = -dG / (R T ln 10).
    let row = &r.rows[0];
    let (dg, logk) = (row.dg_kj.expect("dG"), row.log10_k.expect("K"));
    assert!((logk.value + dg.value * 1000.0 / (8.314462618 * 298.15 * 10f64.ln())).abs() < 1e-9);
    // Strain released: both cyclopropanes' strain, about 2 x 115 kJ/mol by CBH-2.
    let cbh2 = r
        .strain_released
        .iter()
        .find(|s| s.scheme.contains("CBH-2"))
        .and_then(|s| s.released_kj)
        .expect("CBH-2 strain");
    assert!((cbh2.value - 2.0 * 115.0).abs() < 10.0, "{}", cbh2.value);
}

#[test]
fn unbalanced_reactions_show_both_formulas() {
    let data = EnergeticsData::bundled().expect("bundled data");
    let eq = ReactionEquation::parse("C1CO1>>OCCO").expect("parses");
    let e = reaction_energetics(&eq, &data, &EnergeticsOptions::default()).unwrap_err();
    let text = e.to_string();
    assert!(text.contains("reactants C2H4O"), "{text}");
    assert!(text.contains("products C2H6O2"), "{text}");
}
