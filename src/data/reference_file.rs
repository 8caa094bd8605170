//! One reference-species file (group-tables/reference/*-species*.toml or a user's): measured
//! gas-phase Hf298 of named compounds, each entry checked and located.

use serde::Deserialize;
use toml::Spanned;

use super::document::Source;
use super::error::{DataError, EntryKind, EntryPlace, Problem};
use super::provenance::Cas;
use crate::thermo::Quantity;

/// One `[[species]]` entry, checked: every field present, the value finite, the uncertainty not
/// negative, the CAS number (if given) well formed.
#[derive(Debug, Clone, PartialEq)]
pub struct SpeciesRecord {
    /// SMILES as written.
    pub smiles: String,
    /// Name as the source gives it.
    pub name: String,
    /// CAS number, if given.
    pub cas: Option<Cas>,
    /// Gas-phase Hf298, kJ/mol, with the source's uncertainty.
    pub hf298_kj: Quantity,
    /// Where the value comes from.
    pub source: String,
    /// Remark (an assumed uncertainty, a later measurement), if any.
    pub note: Option<String>,
    /// The entry's place in its file.
    pub place: EntryPlace,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    /// Free description of the file (title, generator, package versions).
    #[allow(dead_code)]
    meta: Option<toml::Table>,
    #[serde(default)]
    species: Vec<Spanned<RawSpecies>>,
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

/// Reads every `[[species]]` entry of a file, in file order. Every entry needs `smiles`, `name`,
/// `hf298_kj`, `unc_kj` and `source`.
pub fn parse_species_file(source: Source<'_>) -> Result<Vec<SpeciesRecord>, DataError> {
    let raw: RawFile = source.parse()?;
    let mut out = Vec::with_capacity(raw.species.len());
    for (index, spanned) in raw.species.into_iter().enumerate() {
        let line = source.line_of(spanned.span().start);
        let r = spanned.into_inner();
        let label = r
            .smiles
            .clone()
            .unwrap_or_else(|| format!("#{}", index + 1));
        let place = EntryPlace::new(EntryKind::Species, label, Some(line));
        let record =
            check(r, place.clone()).map_err(|p| DataError::at_entry(source.path, &place, p))?;
        out.push(record);
    }
    Ok(out)
}

fn check(r: RawSpecies, place: EntryPlace) -> Result<SpeciesRecord, Problem> {
    let missing = |field: &str| Problem::Entry(format!("no `{field}`"));
    let smiles = r.smiles.ok_or_else(|| missing("smiles"))?;
    let name = r.name.ok_or_else(|| missing("name"))?;
    let source = match r.source {
        Some(s) if !s.trim().is_empty() => s,
        _ => return Err(Problem::NoSource),
    };
    let value = r.hf298_kj.ok_or_else(|| missing("hf298_kj"))?;
    let uncertainty = r.unc_kj.ok_or_else(|| missing("unc_kj"))?;
    if !value.is_finite() || !uncertainty.is_finite() || uncertainty < 0.0 {
        return Err(Problem::Entry(format!(
            "hf298_kj {value} and unc_kj {uncertainty} must be finite, unc_kj not negative"
        )));
    }
    let cas = r
        .cas
        .as_deref()
        .map(Cas::parse)
        .transpose()
        .map_err(Problem::Entry)?;
    Ok(SpeciesRecord {
        smiles,
        name,
        cas,
        hf298_kj: Quantity::new(value, uncertainty),
        source,
        note: r.note,
        place,
    })
}
