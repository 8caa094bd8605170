//! Ring entropies: Benson's ring corrections assume the parent's real symmetry number (chair
//! cyclohexane 6) while the tool uses the flat graph's (12); the estimate converts between them,
//! so puckered rings come out right.
//!
//! The measured values are the `s` rows of tests/reference/hand_checks.tsv (with their
//! sources); tests/provenance.rs checks that none of them is a measurement a table entropy was
//! derived from, so this test can fail.

mod common;

use common::Table;
use ringheat::molecule::PerceivedMolecule;
use ringheat::thermo::{EstimateOptions, GroupAdditivity};

/// Tolerance, J/(mol K): about 1 cal/(mol K), the method's usual accuracy for S298 (common
/// practice).
const TOLERANCE_J: f64 = 4.0;

#[test]
fn puckered_ring_entropies_match_measured_values() {
    let engine = GroupAdditivity::bundled().expect("tables");
    let checks = Table::read("hand_checks.tsv");
    let col = |n: &str| checks.column(n);
    let (c_name, c_smiles, c_prop, c_value) =
        (col("name"), col("smiles"), col("property"), col("value"));
    let mut checked = 0;
    for row in checks.rows.iter().filter(|r| r.get(c_prop) == "s") {
        let (name, smiles) = (row.get(c_name), row.get(c_smiles));
        let measured: f64 = row.get(c_value).parse().expect("numeric value");
        let p = PerceivedMolecule::from_smiles(smiles).expect("parses");
        let est = engine
            .estimate(&p, &EstimateOptions::default())
            .expect("estimates");
        let s = est.s298_j.expect("entropy").value;
        assert!(
            (s - measured).abs() < TOLERANCE_J,
            "{name}: estimated {s:.1}, measured {measured} J/(mol K)"
        );
        checked += 1;
    }
    assert!(checked >= 5, "only {checked} ring entropies checked");
}
