//! Structures group additivity cannot price are refused with the reason, in the library and in
//! every output format of `ringheat estimate` (table, CSV, JSON); ordinary rings are not.

use std::process::Command;

use ringheat::molecule::PerceivedMolecule;
use ringheat::thermo::domain::OutOfDomainKind;
use ringheat::thermo::estimate::{EstimateError, EstimateOptions, GroupAdditivity};
use ringheat::thermo::Flag;

const C60: &str = "C12=C3C4=C5C6=C1C7=C8C9=C1C%10=C%11C(=C29)C3=C2C3=C4C4=C5C5=C9C6=C7C6=C7C8=C1C1=C8C%10=C%10C%11=C2C2=C3C3=C4C4=C5C5=C%11C%12=C(C6=C95)C7=C1C1=C%12C5=C%11C4=C3C3=C5C(=C81)C%10=C23";
const C70: &str = "C12=C3C4=C5C6=C7C8=C9C%10=C%11C%12=C%13C%10=C%10C8=C5C1=C%10C1=C%13C5=C8C1=C2C1=C3C2=C3C%10=C%13C%14=C3C1=C8C1=C3C5=C%12C5=C8C%11=C%11C9=C7C7=C9C6=C4C2=C2C%10=C4C(=C29)C2=C6C(=C8C8=C9C6=C4C%13=C9C(=C%141)C3=C85)C%11=C27";

/// The test list of structures outside the domain, with the kind each must be refused for.
fn outside() -> Vec<(&'static str, &'static str, OutOfDomainKind)> {
    use OutOfDomainKind::*;
    vec![
        ("C60", C60, ClosedConjugatedCage),
        ("C70", C70, ClosedConjugatedCage),
        (
            "corannulene",
            "c1cc2ccc3ccc4ccc5ccc1c1c2c3c4c51",
            CurvedConjugatedSurface,
        ),
        ("cyclobutadiene", "C1=CC=C1", AntiaromaticRing),
        ("benzocyclobutadiene", "C1=CC=C2C=CC2=C1", AntiaromaticRing),
        ("biphenylene", "c1ccc2c(c1)-c1ccccc1-2", AntiaromaticRing),
        (
            "tetramethylcyclobutadiene",
            "CC1=C(C)C(C)=C1C",
            AntiaromaticRing,
        ),
        ("oxirene", "C1=CO1", AntiaromaticRing),
        ("thiirene", "C1=CS1", AntiaromaticRing),
        ("1H-azirine", "C1=CN1", AntiaromaticRing),
        ("pentalene", "C1=CC2=CC=CC2=C1", AntiaromaticRing),
    ]
}

/// Ordinary ring compounds that must stay inside the domain (planar aromatics with a
/// five-membered ring, puckered 4n rings, cages without a pi surface).
const INSIDE: &[&str] = &[
    "c1ccccc1",
    "c1ccc2cccc2cc1",                     // azulene
    "c1ccc2c(c1)-c1cccc3cccc-2c13",       // fluoranthene
    "C1=Cc2cccc3cccc1c23",                // acenaphthylene
    "c1cc2cccc3c4cccc5cccc(c(c1)c23)c54", // perylene
    "C1=CC=CC=CC=C1",                     // cyclooctatetraene
    "O=C1C=CC(=O)C=C1",                   // p-benzoquinone
    "O=C1C=C1",                           // cyclopropenone
    "C12C3C4C1C5C2C3C45",                 // cubane
    "C1C2CC3CC1CC(C2)C3",                 // adamantane
    "c1ccc2c(c1)ccc1ccccc12",             // phenanthrene
    "c1cc[nH]c1",                         // pyrrole
    "C1CC2=CC=CC=C2C1",                   // indane
];

#[test]
fn the_test_list_is_refused_with_its_reason() {
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    for (name, smiles, kind) in outside() {
        let p = PerceivedMolecule::from_smiles(smiles).expect("parses");
        match engine.estimate(&p, &EstimateOptions::default()) {
            Err(EstimateError::OutOfDomain(found)) => {
                assert!(
                    found.iter().any(|f| f.kind == kind),
                    "{name}: refused for {found:?}, expected {kind:?}"
                );
                assert!(found.iter().all(|f| !f.reason.is_empty()));
            }
            other => panic!("{name}: not refused: {other:?}"),
        }
        // Asked to estimate anyway, the numbers carry the finding as a flag.
        let anyway = EstimateOptions {
            allow_out_of_domain: true,
            ..EstimateOptions::default()
        };
        if let Ok(est) = engine.estimate(&p, &anyway) {
            assert!(
                est.flags
                    .iter()
                    .any(|f| matches!(f, Flag::OutOfDomain(o) if o.kind == kind)),
                "{name}: no out-of-domain flag"
            );
        }
    }
}

#[test]
fn ordinary_rings_are_not_refused() {
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    for smiles in INSIDE {
        let p = PerceivedMolecule::from_smiles(smiles).expect("parses");
        let r = engine.estimate(&p, &EstimateOptions::default());
        assert!(
            !matches!(r, Err(EstimateError::OutOfDomain(_))),
            "{smiles}: refused as out of domain: {r:?}"
        );
    }
}

#[test]
fn every_output_format_names_the_reason() {
    let inputs: Vec<&str> = outside().iter().map(|(_, s, _)| *s).collect();
    for format in ["table", "csv", "json"] {
        let out = Command::new(env!("CARGO_BIN_EXE_ringheat"))
            .args(["estimate", "--format", format])
            .args(&inputs)
            .output()
            .expect("ringheat runs");
        let text = format!(
            "{}{}",
            String::from_utf8_lossy(&out.stdout),
            String::from_utf8_lossy(&out.stderr)
        );
        for (name, _, kind) in outside() {
            assert!(
                text.contains(kind.label()),
                "{format}: {name}: reason `{}` not shown",
                kind.label()
            );
        }
        let refusals = text
            .matches("outside the domain of group additivity")
            .count();
        assert!(
            refusals >= inputs.len(),
            "{format}: {refusals} refusals shown for {} structures",
            inputs.len()
        );
    }
}
