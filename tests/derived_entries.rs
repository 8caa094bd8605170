//! Every table Hf298 value derived from one measured compound (`derived_from` listing `hf`) must
//! give that
//! compound's measured Hf298 back with the final tables: a derivation that absorbed another
//! term's effect, or a later table change that the derivation did not see, shows up here.

mod common;

use std::collections::HashMap;

use common::Table;
use ringheat::data::Property;
use ringheat::molecule::PerceivedMolecule;
use ringheat::thermo::estimate::{EstimateOptions, GroupAdditivity};

/// Allowed difference (kJ/mol): values are written with two decimals, and a hand-derived entry
/// may have been rounded once more (our choice).
const TOLERANCE_KJ: f64 = 0.15;

#[test]
fn derived_entries_reproduce_their_source_compounds() {
    let engine = GroupAdditivity::bundled().expect("bundled tables load");
    let table = Table::read("thermo_reference.tsv");
    let (c_cas, c_smiles, c_hf) = (
        table.column("cas"),
        table.column("smiles"),
        table.column("hf298_kj"),
    );
    let measured: HashMap<String, (String, f64)> = table
        .rows
        .iter()
        .filter_map(|r| {
            let hf = r.get(c_hf).parse().ok()?;
            Some((r.get(c_cas).to_string(), (r.get(c_smiles).to_string(), hf)))
        })
        .collect();
    let sources = engine.tables.provenances().flat_map(|(entry, p)| {
        p.compounds_for(Property::Hf298)
            .map(|d| {
                (
                    entry.clone(),
                    format!("{} ({})", d.name, d.cas),
                    d.cas.to_string(),
                )
            })
            .collect::<Vec<_>>()
    });
    let mut checked = 0;
    let mut off = Vec::new();
    for (entry, from, cas) in sources {
        // Hand-derived entries may name a compound the reference set does not hold.
        let Some((smiles, hf)) = measured.get(&cas) else {
            continue;
        };
        let p = PerceivedMolecule::from_smiles(smiles).expect("reference SMILES parse");
        match engine.estimate(&p, &EstimateOptions::default()) {
            Ok(est)
                if est
                    .hf298_kj
                    .is_some_and(|q| (q.value - hf).abs() <= TOLERANCE_KJ) => {}
            Ok(est) => off.push(format!(
                "{entry} from {from}: estimate {:?}, measured {hf:.2} kJ/mol",
                est.hf298_kj.map(|q| q.value)
            )),
            Err(e) => off.push(format!("{entry} from {from}: no estimate: {e}")),
        }
        checked += 1;
    }
    assert!(checked > 200, "only {checked} derived entries checked");
    assert!(
        off.is_empty(),
        "{} of {checked} derived entries do not reproduce their compound:\n{}",
        off.len(),
        off.join("\n")
    );
}
