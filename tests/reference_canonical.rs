//! Canonical SMILES against RDKit's random spellings: every row of
//! `tests/reference/canonical_spellings.tsv` (built by `tools/make_reference.py`; see its header)
//! holds one molecule written five ways. All five must parse and give one canonical key, keys of
//! different molecules (different RDKit canonical isomeric SMILES) must differ, and a key read
//! back must give itself.
//! Run with `cargo test --test reference_canonical -- --nocapture` to see the summary.

mod common;

use std::collections::{BTreeMap, BTreeSet, HashMap};

use common::{catch, one_line, Table};
use ringheat::molecule::canon::canonical_smiles;
use ringheat::molecule::parse_smiles;

/// How many rows a failure message lists.
const WORST_LIMIT: usize = 20;

/// The canonical key of one spelling, or why there is none.
fn key_of(smiles: &str) -> Result<String, String> {
    match catch(|| parse_smiles(smiles).map(|m| canonical_smiles(&m))) {
        Ok(Ok(key)) => Ok(key),
        Ok(Err(e)) => Err(format!("parse error: {}", one_line(&e.to_string()))),
        Err(p) => Err(one_line(&p)),
    }
}

/// One molecule's row with the keys of its spellings.
struct Checked {
    id: String,
    category: String,
    rdkit: String,
    spellings: Vec<String>,
    keys: Vec<Result<String, String>>,
}

impl Checked {
    fn distinct_keys(&self) -> BTreeSet<&str> {
        self.keys
            .iter()
            .filter_map(|k| k.as_ref().ok())
            .map(String::as_str)
            .collect()
    }

    fn all_parsed(&self) -> bool {
        self.keys.iter().all(Result::is_ok)
    }

    fn consistent(&self) -> bool {
        self.all_parsed() && self.distinct_keys().len() == 1
    }

    /// Badness for ordering the failure list: failed spellings count double.
    fn badness(&self) -> usize {
        2 * self.keys.iter().filter(|k| k.is_err()).count() + self.distinct_keys().len()
    }

    fn describe(&self) -> String {
        let mut text = format!("  {} [{}] rdkit {}", self.id, self.category, self.rdkit);
        for (s, k) in self.spellings.iter().zip(&self.keys) {
            match k {
                Ok(key) => text.push_str(&format!("\n      {s} -> {key}")),
                Err(e) => text.push_str(&format!("\n      {s} -> {e}")),
            }
        }
        text
    }
}

#[test]
fn spellings_of_one_molecule_share_one_key_and_molecules_differ() {
    let table = Table::read("canonical_spellings.tsv");
    let c_id = table.column("id");
    let c_cat = table.column("category");
    let c_rdkit = table.column("rdkit_canonical");
    let c_spell: Vec<usize> = (1..=5)
        .map(|i| table.column(&format!("spelling_{i}")))
        .collect();

    let checked: Vec<Checked> = table
        .rows
        .iter()
        .map(|row| {
            let spellings: Vec<String> = c_spell.iter().map(|&c| row.get(c).to_string()).collect();
            let keys = spellings.iter().map(|s| key_of(s)).collect();
            Checked {
                id: row.get(c_id).to_string(),
                category: row.get(c_cat).to_string(),
                rdkit: row.get(c_rdkit).to_string(),
                spellings,
                keys,
            }
        })
        .collect();

    // Keys shared by molecules that RDKit tells apart.
    let mut owners: HashMap<&str, BTreeSet<&str>> = HashMap::new();
    for c in &checked {
        for key in c.distinct_keys() {
            owners.entry(key).or_default().insert(c.rdkit.as_str());
        }
    }
    let mut collisions: Vec<(&str, &BTreeSet<&str>)> = owners
        .iter()
        .filter(|(_, o)| o.len() > 1)
        .map(|(k, o)| (*k, o))
        .collect();
    collisions.sort();

    // A key read back must give itself.
    let mut unstable: Vec<(String, String)> = Vec::new();
    for c in checked.iter().filter(|c| c.consistent()) {
        let key = c.distinct_keys().into_iter().next().unwrap_or_default();
        match key_of(key) {
            Ok(again) if again == key => {}
            Ok(again) => unstable.push((c.id.clone(), format!("{key} -> {again}"))),
            Err(e) => unstable.push((c.id.clone(), format!("{key} -> {e}"))),
        }
    }

    let molecules = checked.len();
    let spellings = 5 * molecules;
    let parsed: usize = checked
        .iter()
        .map(|c| c.keys.iter().filter(|k| k.is_ok()).count())
        .sum();
    let consistent = checked.iter().filter(|c| c.consistent()).count();
    let distinct_keys = owners.len();
    println!("reference_canonical: canonical_spellings.tsv");
    println!("  molecules                  {molecules}");
    println!("  spellings parsed           {parsed} of {spellings}");
    println!("  molecules with one key     {consistent} of {molecules}");
    println!("  distinct keys              {distinct_keys}");
    println!("  keys shared by molecules   {}", collisions.len());
    println!("  keys not stable on reread  {}", unstable.len());
    let mut by_category: BTreeMap<&str, (usize, usize)> = BTreeMap::new();
    for c in &checked {
        let e = by_category.entry(c.category.as_str()).or_default();
        e.0 += 1;
        if c.consistent() {
            e.1 += 1;
        }
    }
    for (cat, (n, ok)) in &by_category {
        println!("    {cat:<24} {ok} of {n} with one key");
    }

    let mut failures: Vec<String> = Vec::new();
    let mut bad: Vec<&Checked> = checked.iter().filter(|c| !c.consistent()).collect();
    if !bad.is_empty() {
        bad.sort_by_key(|c| std::cmp::Reverse(c.badness()));
        let list: Vec<String> = bad.iter().take(WORST_LIMIT).map(|c| c.describe()).collect();
        failures.push(format!(
            "{} of {molecules} molecules have a spelling that fails or more than one key; worst:\n{}",
            bad.len(),
            list.join("\n")
        ));
    }
    if !collisions.is_empty() {
        let list: Vec<String> = collisions
            .iter()
            .take(WORST_LIMIT)
            .map(|(k, o)| {
                let names: Vec<&str> = o.iter().copied().collect();
                format!("  {k} <- {}", names.join(" | "))
            })
            .collect();
        failures.push(format!(
            "{} keys are shared by molecules RDKit tells apart:\n{}",
            collisions.len(),
            list.join("\n")
        ));
    }
    if !unstable.is_empty() {
        let list: Vec<String> = unstable
            .iter()
            .take(WORST_LIMIT)
            .map(|(id, t)| format!("  {id}: {t}"))
            .collect();
        failures.push(format!(
            "{} keys do not give themselves when read back:\n{}",
            unstable.len(),
            list.join("\n")
        ));
    }
    assert!(molecules >= 1000, "only {molecules} molecules in the file");
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}
