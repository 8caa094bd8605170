//! Measured gas-phase S298 and Cp(T) of small species that group additivity cannot estimate
//! (H2, H2O, O2, CO2, ...): `group-tables/energetics/small-species.toml`, written by
//! `tools/make_small_species.py` from the `chemicals` package.

use std::collections::BTreeMap;

use serde::Deserialize;

use crate::groups::table::CP_TEMPERATURES_K;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::parse_smiles;
use crate::thermo::Quantity;

/// The bundled file (path relative to the crate root, contents).
pub const BUNDLED_SMALL_SPECIES: (&str, &str) = (
    "group-tables/energetics/small-species.toml",
    include_str!("../../../group-tables/energetics/small-species.toml"),
);

/// Entropy and heat capacity of one species.
#[derive(Debug, Clone, PartialEq)]
pub struct SmallSpecies {
    /// Name.
    pub name: String,
    /// S298, J/(mol K).
    pub s298_j: Quantity,
    /// Cp at the table temperatures, J/(mol K).
    pub cp_j: [Quantity; 7],
    /// Source line.
    pub source: String,
}

/// The table by canonical SMILES.
#[derive(Debug, Clone, Default)]
pub struct SmallSpeciesTable {
    entries: BTreeMap<String, SmallSpecies>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    meta: RawMeta,
    species: Vec<RawSpecies>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawMeta {
    #[allow(dead_code)]
    title: String,
    source: String,
    cp_temperatures_k: Vec<f64>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawSpecies {
    name: String,
    #[allow(dead_code)]
    cas: String,
    smiles: String,
    s298_j: f64,
    cp_j: Vec<f64>,
    unc_j: f64,
}

impl SmallSpeciesTable {
    /// The bundled table.
    pub fn bundled() -> Result<SmallSpeciesTable, String> {
        SmallSpeciesTable::from_toml(BUNDLED_SMALL_SPECIES.1)
            .map_err(|e| format!("{}: {e}", BUNDLED_SMALL_SPECIES.0))
    }

    /// Reads a table; its temperatures must be ringheat's Cp temperatures.
    pub fn from_toml(text: &str) -> Result<SmallSpeciesTable, String> {
        let raw: RawFile = toml::from_str(text).map_err(|e| e.to_string().trim().to_string())?;
        if raw.meta.cp_temperatures_k != CP_TEMPERATURES_K {
            return Err(format!(
                "cp_temperatures_k must be {CP_TEMPERATURES_K:?}, not {:?}",
                raw.meta.cp_temperatures_k
            ));
        }
        let mut entries = BTreeMap::new();
        for r in raw.species {
            let mol = parse_smiles(&r.smiles).map_err(|e| format!("{}: {e}", r.name))?;
            let cp: [f64; 7] = r
                .cp_j
                .try_into()
                .map_err(|_| format!("{}: cp_j needs 7 values", r.name))?;
            entries.insert(
                canonical_smiles(&mol),
                SmallSpecies {
                    name: r.name.clone(),
                    s298_j: Quantity::new(r.s298_j, r.unc_j),
                    cp_j: cp.map(|c| Quantity::new(c, r.unc_j)),
                    source: format!("{} ({})", raw.meta.source, r.name),
                },
            );
        }
        Ok(SmallSpeciesTable { entries })
    }

    /// The entry for a canonical SMILES.
    pub fn get(&self, key: &str) -> Option<&SmallSpecies> {
        self.entries.get(key)
    }
}
