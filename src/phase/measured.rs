//! Measured vaporisation enthalpies at 298.15 K (CRC Handbook via the `chemicals` package),
//! keyed by canonical SMILES; written by `tools/make_vaporisation_reference.py`. Each entry says
//! its basis: the Hvap298 column, else the handbook's Hf(gas) - Hf(liquid), else its enthalpy
//! at the boiling point moved to 298.15 K by Watson's relation.

use std::collections::BTreeMap;

use serde::Deserialize;

use crate::molecule::canon::canonical_smiles;
use crate::molecule::parse_smiles;
use crate::thermo::Quantity;

/// The bundled file (path relative to the crate root, contents).
pub const BUNDLED_MEASURED_FILE: (&str, &str) = (
    "group-tables/phase/vaporisation-crc.toml",
    include_str!("../../group-tables/phase/vaporisation-crc.toml"),
);

/// One measured species.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct MeasuredVaporisation {
    /// CAS number.
    pub cas: String,
    /// Name as the table gives it.
    pub name: String,
    /// SMILES as written in the file.
    pub smiles: String,
    /// dHvap at 298.15 K, kJ/mol, with the file's (assumed) uncertainty.
    pub hvap298_kj: Quantity,
    /// How the value was obtained: `Hvap298` (the CRC column), `Hf(gas) - Hf(liquid)`, or
    /// `Watson from HvapTb`.
    pub basis: String,
    /// How a moved value was moved, if it was.
    pub note: Option<String>,
    /// Hf(gas) - Hf(liquid) of the CRC standard-state table, kJ/mol, if both are given.
    pub hf_difference_kj: Option<f64>,
    /// S(gas) - S(liquid) of the CRC standard-state table, J/(mol K), if both are given.
    pub svap298_j: Option<f64>,
    /// Why the entry is not used, if it is suspect.
    pub suspect: Option<String>,
}

/// The measured table.
#[derive(Debug, Clone, Default)]
pub struct MeasuredTable {
    /// Source line for reports.
    pub source: String,
    entries: BTreeMap<String, MeasuredVaporisation>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    meta: RawMeta,
    #[serde(default)]
    species: Vec<RawSpecies>,
}

#[derive(Deserialize)]
struct RawMeta {
    source: String,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawSpecies {
    cas: String,
    name: String,
    smiles: String,
    hvap298_kj: f64,
    unc_kj: f64,
    basis: String,
    note: Option<String>,
    hf_difference_kj: Option<f64>,
    svap298_j: Option<f64>,
    suspect: Option<String>,
}

impl MeasuredTable {
    /// The bundled table.
    pub fn bundled() -> Result<MeasuredTable, String> {
        MeasuredTable::from_toml(BUNDLED_MEASURED_FILE.1)
            .map_err(|e| format!("{}: {e}", BUNDLED_MEASURED_FILE.0))
    }

    /// Reads a table; a SMILES that does not parse is an error naming the entry. When two
    /// entries share a structure, the first is kept.
    pub fn from_toml(text: &str) -> Result<MeasuredTable, String> {
        let raw: RawFile = toml::from_str(text).map_err(|e| e.to_string().trim().to_string())?;
        let mut entries = BTreeMap::new();
        for r in raw.species {
            let mol = parse_smiles(&r.smiles)
                .map_err(|e| format!("entry {} ({}): SMILES does not parse: {e}", r.cas, r.name))?;
            entries
                .entry(canonical_smiles(&mol))
                .or_insert(MeasuredVaporisation {
                    cas: r.cas,
                    name: r.name,
                    smiles: r.smiles,
                    hvap298_kj: Quantity::new(r.hvap298_kj, r.unc_kj),
                    basis: r.basis,
                    note: r.note,
                    hf_difference_kj: r.hf_difference_kj,
                    svap298_j: r.svap298_j,
                    suspect: r.suspect,
                });
        }
        Ok(MeasuredTable {
            source: raw.meta.source,
            entries,
        })
    }

    /// The entry for a canonical SMILES, suspect or not.
    pub fn get(&self, key: &str) -> Option<&MeasuredVaporisation> {
        self.entries.get(key)
    }

    /// True for entries of the CRC Hvap298 column itself (the ones estimates are checked with).
    pub fn is_direct(entry: &MeasuredVaporisation) -> bool {
        entry.basis == "Hvap298"
    }

    /// The entry for a canonical SMILES if it is not suspect.
    pub fn usable(&self, key: &str) -> Option<&MeasuredVaporisation> {
        self.get(key).filter(|e| e.suspect.is_none())
    }

    /// Every entry.
    pub fn iter(&self) -> impl Iterator<Item = &MeasuredVaporisation> + '_ {
        self.entries.values()
    }
}
