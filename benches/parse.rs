//! Parser throughput on typical structures (`benches/parse_smiles.txt`: drugs, natural
//! products, heterocycles, ring and cage compounds, small molecules, ions and radicals).
//!
//! Run with `cargo bench --bench parse`. Besides criterion's report it prints a plain
//! molecules-per-second figure from one timed pass over the whole set.

use std::hint::black_box;
use std::time::{Duration, Instant};

use criterion::{criterion_group, criterion_main, Criterion, Throughput};
use ringheat::molecule::parse_smiles;

/// The benchmark structures, one a line; `#` lines are comments.
fn structures() -> Vec<&'static str> {
    include_str!("parse_smiles.txt")
        .lines()
        .map(str::trim)
        .filter(|l| !l.is_empty() && !l.starts_with('#'))
        .collect()
}

/// Parses every structure once; returns how many parsed.
fn parse_all(set: &[&str]) -> usize {
    set.iter()
        .filter(|s| parse_smiles(black_box(s)).is_ok())
        .count()
}

/// Times repeated passes for about `budget` and prints molecules per second.
fn print_rate(set: &[&str], budget: Duration) {
    let start = Instant::now();
    let mut molecules = 0usize;
    while start.elapsed() < budget {
        molecules += parse_all(set);
    }
    let seconds = start.elapsed().as_secs_f64();
    println!(
        "parse: {} structures, {:.0} molecules/second",
        set.len(),
        molecules as f64 / seconds
    );
}

fn bench_parse(c: &mut Criterion) {
    let set = structures();
    let parsed = parse_all(&set);
    assert_eq!(parsed, set.len(), "every benchmark structure must parse");
    print_rate(&set, Duration::from_secs(2));
    let mut group = c.benchmark_group("parse_smiles");
    group.throughput(Throughput::Elements(set.len() as u64));
    group.bench_function("typical_structures", |b| b.iter(|| parse_all(&set)));
    group.finish();
}

criterion_group!(benches, bench_parse);
criterion_main!(benches);
