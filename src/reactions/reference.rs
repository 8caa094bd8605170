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
use std::path::Path;

use super::fragment::Species;
use super::heat::SourceTag;
use crate::data::document::{read_file, Source};
use crate::data::reference_file::{parse_species_file, SpeciesRecord};
use crate::data::{bundled, DataError, Place, Problem, Property, UnreliableList};
use crate::molecule::canon::canonical_smiles;
use crate::molecule::parse_smiles;
use crate::molecule::PerceivedMolecule;
use crate::thermo::{EstimateOptions, GroupAdditivity, Quantity};

/// The bundled table files: (path relative to the crate root, contents).
pub const BUNDLED_REFERENCE_FILES: [(&str, &str); 4] = bundled::REFERENCE_FILES;

/// Errors of the reference table: the data layer's one error type.
pub type ReferenceError = DataError;

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
    /// 1-based line of the entry in that file.
    pub line: Option<usize>,
}

/// Reference species by canonical SMILES.
#[derive(Debug, Clone, Default)]
pub struct ReferenceTable {
    entries: BTreeMap<String, ReferenceSpecies>,
}

impl ReferenceTable {
    /// The table bundled with the library (all of [`BUNDLED_REFERENCE_FILES`]).
    ///
    /// Species whose Hf298 the project's list of unreliable species names
    /// (group-tables/reference/unreliable-species.toml) are left out, so no strain scheme or
    /// reaction uses them; the generators leave them out of the files already.
    pub fn bundled() -> Result<ReferenceTable, ReferenceError> {
        let mut table = ReferenceTable::default();
        for (path, text) in BUNDLED_REFERENCE_FILES {
            table.extend(ReferenceTable::from_toml(text, Path::new(path))?)?;
        }
        Ok(table.without_unreliable(&UnreliableList::bundled()?))
    }

    /// The table without the species whose Hf298 `list` judges unreliable.
    pub fn without_unreliable(mut self, list: &UnreliableList) -> ReferenceTable {
        self.entries.retain(|_, e| {
            !e.cas
                .as_deref()
                .is_some_and(|cas| list.is_unreliable(cas, Property::Hf298))
        });
        self
    }

    /// Adds the entries of `other`; a structure both tables hold is an error at the second
    /// entry that names the first.
    pub fn extend(&mut self, other: ReferenceTable) -> Result<(), ReferenceError> {
        for (key, entry) in other.entries {
            if let Some(first) = self.entries.get(&key) {
                return Err(duplicate(first, &entry));
            }
            self.entries.insert(key, entry);
        }
        Ok(())
    }

    /// Reads a table file.
    pub fn from_path(path: &Path) -> Result<ReferenceTable, ReferenceError> {
        let text = read_file(path)?;
        ReferenceTable::from_toml(&text, path)
    }

    /// Parses table text; `path` only labels errors. Every entry needs `smiles`, `name`,
    /// `hf298_kj`, `unc_kj` (finite, not negative) and `source`, and a SMILES that parses; two
    /// entries with the same canonical SMILES are an error.
    pub fn from_toml(text: &str, path: &Path) -> Result<ReferenceTable, ReferenceError> {
        let mut table = ReferenceTable::default();
        for record in parse_species_file(Source { path, text })? {
            let item = read_entry(record, path)?;
            if let Some(first) = table.entries.get(&item.key) {
                return Err(duplicate(first, &item));
            }
            table.entries.insert(item.key.clone(), item);
        }
        Ok(table)
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

/// The error for a structure held twice: at the second entry, naming the first.
fn duplicate(first: &ReferenceSpecies, second: &ReferenceSpecies) -> DataError {
    let place = Place {
        file: second.file.clone().into(),
        line: second.line,
        column: None,
        entry: Some(crate::data::EntryPlace::new(
            crate::data::EntryKind::Species,
            second.smiles.clone(),
            second.line,
        )),
    };
    let at = first.line.map_or(String::new(), |l| format!(":{l}"));
    DataError::new(
        place,
        Problem::Duplicate {
            first: format!(
                "{}{at}, {} ({}); both are {}",
                first.file, first.name, first.smiles, first.key
            ),
        },
    )
}

/// The table entry of a checked record: its SMILES parsed and canonicalized.
fn read_entry(r: SpeciesRecord, path: &Path) -> Result<ReferenceSpecies, DataError> {
    let mol = parse_smiles(&r.smiles).map_err(|e| {
        DataError::at_entry(
            path,
            &r.place,
            Problem::Entry(format!("SMILES not readable: {e}")),
        )
    })?;
    Ok(ReferenceSpecies {
        key: canonical_smiles(&mol),
        smiles: r.smiles,
        name: r.name,
        cas: r.cas.map(|c| c.as_str().to_string()),
        hf298_kj: r.hf298_kj,
        source: r.source,
        note: r.note,
        file: path.display().to_string(),
        line: r.place.line,
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
