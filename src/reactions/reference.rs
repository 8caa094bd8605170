//! Reference species: measured gas-phase Hf298 of small molecules, keyed by canonical SMILES.
//!
//! The bundled table is four files of `group-tables/reference/` (a sub-directory, which the
//! group-table loader does not read), embedded at compile time:
//! - `reference-species.toml`: small molecules, Active Thermochemical Tables 1.112 values carried
//!   by the `chemicals` package (written by `tools/make_reference_species.py`);
//! - `ring-species.toml`: ring compounds, ATcT where the package has them, else CRC Handbook
//!   values with an assumed uncertainty (written by `tools/make_measured_species.py`); these give the
//!   measured Hf298 of a strain target;
//! - `acyclic-species.toml`: acyclic compounds from the same source and script, so that the
//!   larger CBH fragments (neopentane, 2-methylbutane, ...) have measured values too;
//! - `ring-species-recalled.toml`: a few strained ring compounds the package lacks (cubane, ...),
//!   typed by hand from published measurements recalled from memory, each saying so.
//!
//! Each entry gives `smiles`, `name`, `hf298_kj`, `unc_kj` and
//! `source` (all required) and optionally `cas` and `note`. Keys are the canonical SMILES of the
//! entry's structure, computed at load, so the file may spell a molecule any way.
//!
//! ```
//! use ringheat::reactions::{ReferenceTable, Species};
//! use ringheat::molecule::parse_smiles;
//! let table = ReferenceTable::bundled().unwrap();
//! let ethane = Species::new(parse_smiles("CC").unwrap());
//! let (hf, _source) = table.lookup(&ethane).unwrap();
//! assert!((hf.value + 83.8).abs() < 0.5);
//! ```

use std::collections::BTreeMap;
use std::path::{Path, PathBuf};

use serde::Deserialize;

use super::error::ReferenceError;
use super::fragment::Species;
use super::heat::SourceTag;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::parse_smiles;
use crate::molecule::PerceivedMolecule;
use crate::thermo::{EstimateOptions, GroupAdditivity, Quantity};

/// The bundled table files: (path relative to the crate root, contents).
pub const BUNDLED_REFERENCE_FILES: [(&str, &str); 4] = [
    (
        "group-tables/reference/reference-species.toml",
        include_str!("../../group-tables/reference/reference-species.toml"),
    ),
    (
        "group-tables/reference/ring-species.toml",
        include_str!("../../group-tables/reference/ring-species.toml"),
    ),
    (
        "group-tables/reference/acyclic-species.toml",
        include_str!("../../group-tables/reference/acyclic-species.toml"),
    ),
    (
        "group-tables/reference/ring-species-recalled.toml",
        include_str!("../../group-tables/reference/ring-species-recalled.toml"),
    ),
];

/// One reference species.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct ReferenceSpecies {
    /// Canonical SMILES (the lookup key).
    pub key: String,
    /// SMILES as written in the file.
    pub smiles: String,
    /// Name as the source gives it.
    pub name: String,
    /// CAS number, if given.
    pub cas: Option<String>,
    /// Gas-phase Hf298, kJ/mol, with the source's uncertainty.
    pub hf298_kj: Quantity,
    /// Where the value comes from.
    pub source: String,
    /// Remark of the file (an assumed uncertainty, a later measurement), if any.
    pub note: Option<String>,
    /// The file the entry was read from.
    pub file: String,
}

/// Reference species by canonical SMILES.
#[derive(Debug, Clone, Default)]
pub struct ReferenceTable {
    entries: BTreeMap<String, ReferenceSpecies>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    /// Free description of the file (title, generator, package versions).
    #[allow(dead_code)]
    meta: Option<toml::Table>,
    #[serde(default)]
    species: Vec<RawSpecies>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawSpecies {
    smiles: Option<String>,
    name: Option<String>,
    cas: Option<String>,
    hf298_kj: Option<f64>,
    unc_kj: Option<f64>,
    source: Option<String>,
    /// Free text for the reader of the file.
    note: Option<String>,
}

impl ReferenceTable {
    /// The table bundled with the library (all of [`BUNDLED_REFERENCE_FILES`]).
    pub fn bundled() -> Result<ReferenceTable, ReferenceError> {
        let mut table = ReferenceTable::default();
        for (path, text) in BUNDLED_REFERENCE_FILES {
            table.extend(ReferenceTable::from_toml(text, Path::new(path))?)?;
        }
        Ok(table)
    }

    /// Adds the entries of `other`; a structure both tables hold is an error naming both entries.
    pub fn extend(&mut self, other: ReferenceTable) -> Result<(), ReferenceError> {
        for (key, entry) in other.entries {
            if let Some(first) = self.entries.get(&key) {
                return Err(ReferenceError::Duplicate {
                    key,
                    first: format!("{} ({}, {})", first.name, first.smiles, first.file),
                    second: format!("{} ({}, {})", entry.name, entry.smiles, entry.file),
                });
            }
            self.entries.insert(key, entry);
        }
        Ok(())
    }

    /// Reads a table file.
    pub fn from_path(path: &Path) -> Result<ReferenceTable, ReferenceError> {
        let text = std::fs::read_to_string(path).map_err(|e| ReferenceError::Io {
            path: path.to_path_buf(),
            message: e.to_string(),
        })?;
        ReferenceTable::from_toml(&text, path)
    }

    /// Parses table text; `path` only labels errors. Every entry needs `smiles`, `name`,
    /// `hf298_kj`, `unc_kj` (finite, not negative) and `source`; two entries with the same
    /// canonical SMILES are an error.
    pub fn from_toml(text: &str, path: &Path) -> Result<ReferenceTable, ReferenceError> {
        let raw: RawFile = toml::from_str(text).map_err(|e| ReferenceError::Syntax {
            path: path.to_path_buf(),
            message: e.to_string().trim().to_string(),
        })?;
        let mut entries = BTreeMap::new();
        for (index, r) in raw.species.into_iter().enumerate() {
            let entry = index + 1;
            let smiles = r.smiles.clone().unwrap_or_default();
            let fail = |problem: String| ReferenceError::Entry {
                path: PathBuf::from(path),
                entry,
                smiles: smiles.clone(),
                problem,
            };
            let item = read_entry(r, path).map_err(&fail)?;
            if let Some(first) = entries.insert(item.key.clone(), item) {
                return Err(fail(format!(
                    "same structure as the entry for {} ({})",
                    first.name, first.smiles
                )));
            }
        }
        Ok(ReferenceTable { entries })
    }

    /// The entry for a canonical SMILES.
    pub fn get(&self, key: &str) -> Option<&ReferenceSpecies> {
        self.entries.get(key)
    }

    /// The value and source of `species`, if the table has it.
    pub fn lookup(&self, species: &Species) -> Option<(Quantity, SourceTag)> {
        self.get(&species.smiles).map(|e| {
            let source = SourceTag::Reference {
                source: format!("{} ({})", e.source, e.name),
            };
            (e.hf298_kj, source)
        })
    }

    /// Number of entries.
    pub fn len(&self) -> usize {
        self.entries.len()
    }

    /// True when the table has no entry.
    pub fn is_empty(&self) -> bool {
        self.entries.is_empty()
    }

    /// All entries by canonical SMILES.
    pub fn iter(&self) -> impl Iterator<Item = &ReferenceSpecies> + '_ {
        self.entries.values()
    }
}

fn read_entry(r: RawSpecies, path: &Path) -> Result<ReferenceSpecies, String> {
    let smiles = r.smiles.ok_or("no smiles")?;
    let name = r.name.ok_or("no name")?;
    let source = r.source.ok_or("no source")?;
    let value = r.hf298_kj.ok_or("no hf298_kj")?;
    let uncertainty = r.unc_kj.ok_or("no unc_kj")?;
    if !value.is_finite() || !uncertainty.is_finite() || uncertainty < 0.0 {
        return Err(format!(
            "hf298_kj {value} and unc_kj {uncertainty} must be finite, unc_kj not negative"
        ));
    }
    let mol = parse_smiles(&smiles).map_err(|e| format!("SMILES not readable: {e}"))?;
    Ok(ReferenceSpecies {
        key: canonical_smiles(&mol),
        smiles,
        name,
        cas: r.cas,
        hf298_kj: Quantity::new(value, uncertainty),
        source,
        note: r.note,
        file: path.display().to_string(),
    })
}

/// A lookup that asks `table` first and `fallback` second; fallback values are tagged
/// [`SourceTag::Fallback`] with `method`, so reports can flag them.
pub fn lookup_with_fallback<'a>(
    table: &'a ReferenceTable,
    fallback: &'a dyn Fn(&Species) -> Option<Quantity>,
    method: &'a str,
) -> impl Fn(&Species) -> Option<(Quantity, SourceTag)> + 'a {
    move |species: &Species| {
        table.lookup(species).or_else(|| {
            fallback(species).map(|hf| {
                let tag = SourceTag::Fallback {
                    method: method.to_string(),
                };
                (hf, tag)
            })
        })
    }
}

/// A fallback that estimates Hf298 by group additivity (`None` when the estimate fails).
pub fn group_additivity_fallback(
    estimator: &GroupAdditivity,
) -> impl Fn(&Species) -> Option<Quantity> + '_ {
    move |species: &Species| {
        let perceived = PerceivedMolecule::new(&species.molecule);
        estimator
            .estimate(&perceived, &EstimateOptions::default())
            .ok()
            .and_then(|e| e.hf298_kj)
    }
}
