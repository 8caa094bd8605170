//! Timing of symmetry numbers for the large symmetric cases (C60, tetra-tert-butylmethane).

use criterion::{criterion_group, criterion_main, Criterion};
use ringheat::molecule::parse_smiles;
use ringheat::molecule::symmetry::symmetry_number;
use std::hint::black_box;

const CASES: &[(&str, &str)] = &[
    ("C60", "c12c3c4c5c1c1c6c7c2c2c8c3c3c9c4c4c%10c5c5c1c1c6c6c%11c7c2c2c7c8c3c3c8c9c4c4c9c%10c5c5c1c1c6c6c%11c2c2c7c3c3c8c4c4c9c5c1c1c6c2c3c41"),
    ("tetra-tert-butylmethane", "CC(C)(C)C(C(C)(C)C)(C(C)(C)C)C(C)(C)C"),
    ("dodecahedrane", "C12C3C4C5C1C6C7C2C8C3C9C4C%10C5C6C%11C7C8C9C%10%11"),
    ("hexamethylbenzene", "Cc1c(C)c(C)c(C)c(C)c1C"),
];

fn symmetry(c: &mut Criterion) {
    for &(name, smiles) in CASES {
        let Ok(mol) = parse_smiles(smiles) else {
            continue;
        };
        c.bench_function(&format!("symmetry_number {name}"), |b| {
            b.iter(|| symmetry_number(black_box(&mol)))
        });
    }
}

criterion_group!(benches, symmetry);
criterion_main!(benches);
