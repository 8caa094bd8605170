//! Ring entropies: Benson's ring corrections assume the parent's real symmetry number (chair
//! cyclohexane 6) while the tool uses the flat graph's (12); the estimate converts between them,
//! so puckered rings come out right.

use ringheat::molecule::PerceivedMolecule;
use ringheat::thermo::{EstimateOptions, GroupAdditivity};

#[test]
fn puckered_ring_entropies_match_measured_values() {
    let engine = GroupAdditivity::bundled().expect("tables");
    // Gas-phase S298 in J/(mol K), recalled from memory (NIST Chemistry WebBook / TRC values);
    // tolerance 4 J/(mol K), about 1 cal/(mol K), the method's usual accuracy for S298.
    let cases = [
        ("cyclobutane", "C1CCC1", 265.4),
        ("cyclopentane", "C1CCCC1", 292.9),
        ("cyclohexane", "C1CCCCC1", 298.2),
        ("cycloheptane", "C1CCCCCC1", 342.3),
        ("tetrahydrofuran", "C1CCOC1", 302.4),
    ];
    for (name, smiles, measured) in cases {
        let p = PerceivedMolecule::from_smiles(smiles).expect("parses");
        let est = engine
            .estimate(&p, &EstimateOptions::default())
            .expect("estimates");
        let s = est.s298_j.expect("entropy").value;
        assert!(
            (s - measured).abs() < 4.0,
            "{name}: estimated {s:.1}, measured {measured} J/(mol K)"
        );
    }
}
