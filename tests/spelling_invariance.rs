//! Same molecule, same numbers: every spelling of a PubChem molecule gets the same Hf298, S298
//! and Cp298 (to the printed precision), the same symmetry number and the same canonical SMILES.
//!
//! `tests/reference/six_spellings.tsv` (made by `tools/make_six_spellings.py` from the PubChem
//! identifier table of the `chemicals` package, spellings written by RDKit) holds each molecule
//! as given, in RDKit's canonical form, and in four random atom orders (two aromatic, two
//! Kekulé). A spelling that fails must fail with every spelling. Set `RINGHEAT_SPELLINGS_REPORT`
//! to a path to get every disagreeing row written there (the larger-run report).

mod common;

use common::Table;
use ringheat::molecule::{canonical_smiles, parse_smiles, PerceivedMolecule};
use ringheat::thermo::{EstimateOptions, GroupAdditivity};

/// What the table prints for one spelling: Hf298, S298, Cp298 at one decimal (kJ/mol,
/// J/(mol K)), sigma and n, or the error text's kind.
fn printed(engine: &GroupAdditivity, smiles: &str) -> (String, String) {
    let mol = match parse_smiles(smiles) {
        Ok(m) => m,
        Err(e) => return (format!("parse error: {e}"), String::new()),
    };
    let canonical = canonical_smiles(&mol);
    let p = PerceivedMolecule::new(&mol);
    let out = match engine.estimate(&p, &EstimateOptions::default()) {
        Ok(e) => {
            let pm = |q: Option<ringheat::thermo::Quantity>| {
                q.map_or("n/a".to_string(), |q| {
                    format!("{:.1} ± {:.1}", q.value, q.uncertainty)
                })
            };
            format!(
                "Hf {} | S {} | Cp {} | sigma {} n {}",
                pm(e.hf298_kj),
                pm(e.s298_j),
                pm(e.cp298_j()),
                e.symmetry.total,
                e.symmetry.optical_isomers
            )
        }
        Err(e) => format!("error: {}", error_kind(&e.to_string())),
    };
    (out, canonical)
}

/// An error message without what follows the input order: atom numbers, columns and the
/// parenthesised atom descriptions.
fn error_kind(message: &str) -> String {
    let mut depth = 0usize;
    let mut text = String::new();
    for c in message.chars() {
        match c {
            '(' => depth += 1,
            ')' => depth = depth.saturating_sub(1),
            _ if depth == 0 => text.push(c),
            _ => {}
        }
    }
    text.split_whitespace()
        .filter(|w| {
            !w.trim_matches(|c: char| !c.is_ascii_alphanumeric())
                .chars()
                .all(|c| c.is_ascii_digit())
        })
        .collect::<Vec<_>>()
        .join(" ")
}

/// A disagreeing row: its CID, and per spelling (SMILES, printed numbers, canonical SMILES).
type Disagreement = (String, Vec<(String, String, String)>);

#[test]
fn six_spellings_give_the_same_numbers() {
    let table = Table::read("six_spellings.tsv");
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    let columns: Vec<usize> = [
        "as_given",
        "rdkit_canonical",
        "random_1",
        "random_2",
        "kekule_1",
        "kekule_2",
    ]
    .iter()
    .map(|c| table.column(c))
    .collect();
    let cid = table.column("pubchem_cid");
    let mut numbers_differ = Vec::new();
    let mut keys_differ = Vec::new();
    for row in &table.rows {
        let results: Vec<(String, String, String)> = columns
            .iter()
            .map(|&c| {
                let s = row.get(c);
                let (out, key) = printed(&engine, s);
                (s.to_string(), out, key)
            })
            .collect();
        if results.iter().any(|r| r.1 != results[0].1) {
            numbers_differ.push((row.get(cid).to_string(), results.clone()));
        }
        if results.iter().any(|r| r.2 != results[0].2) {
            keys_differ.push((row.get(cid).to_string(), results));
        }
    }
    let describe = |list: &[Disagreement], field: usize| {
        list.iter()
            .map(|(cid, results)| {
                let lines: Vec<String> = results
                    .iter()
                    .map(|r| format!("    {}  ->  {}", r.0, if field == 1 { &r.1 } else { &r.2 }))
                    .collect();
                format!("  CID {cid}:\n{}", lines.join("\n"))
            })
            .collect::<Vec<_>>()
            .join("\n")
    };
    if let Ok(path) = std::env::var("RINGHEAT_SPELLINGS_REPORT") {
        let text = format!(
            "numbers differ: {}\n{}\ncanonical SMILES differ: {}\n{}\n",
            numbers_differ.len(),
            describe(&numbers_differ, 1),
            keys_differ.len(),
            describe(&keys_differ, 2)
        );
        std::fs::write(&path, text).expect("report written");
    }
    println!(
        "{} molecules x 6 spellings: numbers differ for {}, canonical SMILES for {}",
        table.rows.len(),
        numbers_differ.len(),
        keys_differ.len()
    );
    let first = |list: &[Disagreement]| list[..list.len().min(10)].to_vec();
    assert!(
        numbers_differ.is_empty(),
        "{} of {} molecules get spelling-dependent numbers; first ones:\n{}",
        numbers_differ.len(),
        table.rows.len(),
        describe(&first(&numbers_differ), 1)
    );
    assert!(
        keys_differ.is_empty(),
        "{} of {} molecules get several canonical SMILES; first ones:\n{}",
        keys_differ.len(),
        table.rows.len(),
        describe(&first(&keys_differ), 2)
    );
}

/// Hf298 (kJ/mol, one decimal) and flags of one spelling.
fn hf_and_flags(engine: &GroupAdditivity, smiles: &str) -> (String, Vec<String>) {
    let p = PerceivedMolecule::from_smiles(smiles).expect("test SMILES parse");
    let e = engine
        .estimate(&p, &EstimateOptions::default())
        .expect("test molecules are estimable");
    let hf = e
        .hf298_kj
        .map_or("n/a".to_string(), |q| format!("{:.1}", q.value));
    (hf, e.flags.iter().map(ToString::to_string).collect())
}

/// The cases of the issue that found the problem: ring corrections that followed the Kekulé
/// form or atom order (phthalazine, tetralin, carbazole) and a trisubstituted double bond whose
/// cis pair followed neighbour order.
#[test]
fn reported_spelling_pairs_agree() {
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    for (a, b) in [
        ("c1ccc2cnncc2c1", "C1=CC2=CN=NC=C2C=C1"),
        ("C1CCC2=C(C1)C=CC=C2", "C1=CC=C2CCCCC2=C1"),
        ("[nH]1c2ccccc2c2ccccc21", "c1c2-c3c(cccc3)Nc2ccc1"),
        ("CC=C(Cl)C", "CC(Cl)=CC"),
        (
            "O=C1NC(=O)c2cc3C(=O)NC(=O)c3cc12",
            "O=C1NC(=O)C2=CC3=C(C=C12)C(=O)NC3=O",
        ),
    ] {
        assert_eq!(
            hf_and_flags(&engine, a).0,
            hf_and_flags(&engine, b).0,
            "{a} and {b}"
        );
    }
    // The geometry left open is said, with the rule used.
    let (_, flags) = hf_and_flags(&engine, "CC=C(Cl)C");
    assert!(
        flags.iter().any(|f| f.contains("no geometry in the input")),
        "{flags:?}"
    );
}

/// A ring whose only match is a skeleton with other heteroatoms or carbonyls is a flagged
/// stand-in, never an exact match (L-lactide, trimethylene carbonate, epsilon-caprolactone
/// priced on cyclohexane, methylenecyclohexane and cycloheptane while the tables lack their
/// rings): an exact match has the entry's skeleton atom for atom.
#[test]
fn skeletons_with_other_atoms_are_flagged_stand_ins() {
    use ringheat::groups::ring_corrections::RingMatch;
    use ringheat::groups::ring_match::correction_skeletons;
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    for smiles in [
        "CC1OC(=O)C(C)OC1=O",
        "O=C1OCCCO1",
        "O=C1CCCCCO1",
        "C1CCOC1",
        "O=C1CCCO1",
    ] {
        let p = PerceivedMolecule::from_smiles(smiles).expect("parses");
        let systems = correction_skeletons(&p);
        let applied = engine.ring_index.apply(&p, &engine.tables);
        let e = engine
            .estimate(&p, &EstimateOptions::default())
            .expect("estimable");
        for (system, a) in systems.iter().zip(&applied) {
            match &a.how {
                RingMatch::Exact => {
                    let entry = &engine.tables.rings()[a.entries[0]];
                    let q = PerceivedMolecule::from_smiles(&entry.smiles).expect("entry parses");
                    let pattern = &correction_skeletons(&q)[0];
                    assert!(
                        pattern.same_as(system),
                        "{smiles}: exact match on {} whose skeleton differs",
                        entry.name
                    );
                }
                RingMatch::Fallback(stand_in) => {
                    let flagged = e.flags.iter().any(
                        |f| matches!(f, ringheat::thermo::Flag::RingStandIn(s) if s == stand_in),
                    );
                    assert!(flagged, "{smiles}: not flagged: {:?}", e.flags);
                }
            }
        }
    }
}
