//! Strain-free increment sets besides Benson's, read from
//! `group-tables/reference/strain-free-increments.toml` (embedded at compile time).
//!
//! A set gives one increment per saturated carbon centre, in Benson's notation (`C-(C)(H)3`,
//! `C-(C)2(H)2`, `C-(C)3(H)`, `C-(C)4`), in kcal/mol as published, and applies to saturated
//! hydrocarbons only: for anything else [`IncrementSet::strain_free_hf`] says why not.
//!
//! ```
//! use ringheat::molecule::parse_smiles;
//! use ringheat::strain::increments::IncrementSet;
//! let sets = IncrementSet::bundled().unwrap();
//! let sum = sets[0].strain_free_hf(&parse_smiles("C1CC1").unwrap()).unwrap();
//! assert!((sum.value / 4.184 + 15.39).abs() < 0.01); // 3 x -5.13 kcal/mol
//! ```

use std::path::Path;

use serde::Deserialize;

use crate::molecule::{BondOrder, Element, Molecule};
use crate::thermo::Quantity;
use crate::units::JOULES_PER_CALORIE;

/// Path label of the bundled file (relative to the crate root).
pub const BUNDLED_INCREMENTS_PATH: &str = "group-tables/reference/strain-free-increments.toml";

const BUNDLED_TEXT: &str = include_str!("../../group-tables/reference/strain-free-increments.toml");

/// The four saturated carbon centres, by number of carbon neighbours (1 to 4).
const CENTRES: [&str; 4] = ["C-(C)(H)3", "C-(C)2(H)2", "C-(C)3(H)", "C-(C)4"];

/// A published set of strain-free increments for saturated hydrocarbons.
#[derive(Debug, Clone, serde::Serialize)]
pub struct IncrementSet {
    /// Short name of the set.
    pub name: String,
    /// Publication (or `recalled from memory`).
    pub source: String,
    /// What the set applies to, as the file says.
    pub applies_to: String,
    /// Remarks of the file.
    pub note: String,
    /// Increments for `C-(C)(H)3`, `C-(C)2(H)2`, `C-(C)3(H)`, `C-(C)4`, kJ/mol.
    pub increments_kj: [Quantity; 4],
}

/// Why the increment file could not be read.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error("{file}: {problem}")]
pub struct IncrementError {
    /// The file.
    pub file: String,
    /// What is wrong (with the set's name when known).
    pub problem: String,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    #[allow(dead_code)]
    meta: Option<toml::Table>,
    #[serde(default)]
    set: Vec<RawSet>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawSet {
    name: String,
    source: String,
    applies_to: String,
    note: String,
    increment: Vec<RawIncrement>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawIncrement {
    group: String,
    hf: f64,
    unc_hf: f64,
}

impl IncrementSet {
    /// The bundled sets.
    pub fn bundled() -> Result<Vec<IncrementSet>, IncrementError> {
        IncrementSet::from_toml(BUNDLED_TEXT, Path::new(BUNDLED_INCREMENTS_PATH))
    }

    /// Parses a file of sets (values in kcal/mol); `path` labels errors. Every set needs all
    /// four centres, each once, with finite values and a non-negative uncertainty.
    pub fn from_toml(text: &str, path: &Path) -> Result<Vec<IncrementSet>, IncrementError> {
        let fail = |problem: String| IncrementError {
            file: path.display().to_string(),
            problem,
        };
        let raw: RawFile = toml::from_str(text).map_err(|e| fail(e.to_string()))?;
        let mut sets = Vec::new();
        for s in raw.set {
            let mut values: [Option<Quantity>; 4] = [None; 4];
            for inc in &s.increment {
                let Some(i) = CENTRES.iter().position(|c| *c == inc.group) else {
                    return Err(fail(format!(
                        "set \"{}\": group {} is not a saturated carbon centre ({})",
                        s.name,
                        inc.group,
                        CENTRES.join(", ")
                    )));
                };
                if !inc.hf.is_finite() || !inc.unc_hf.is_finite() || inc.unc_hf < 0.0 {
                    return Err(fail(format!(
                        "set \"{}\": {}: hf and unc_hf must be finite, unc_hf not negative",
                        s.name, inc.group
                    )));
                }
                if values[i].is_some() {
                    return Err(fail(format!("set \"{}\": {} twice", s.name, inc.group)));
                }
                values[i] = Some(Quantity::new(inc.hf, inc.unc_hf).scaled(JOULES_PER_CALORIE));
            }
            let mut increments_kj = [Quantity::new(0.0, 0.0); 4];
            for (i, v) in values.iter().enumerate() {
                increments_kj[i] = v.ok_or_else(|| {
                    fail(format!(
                        "set \"{}\": no increment for {}",
                        s.name, CENTRES[i]
                    ))
                })?;
            }
            sets.push(IncrementSet {
                name: s.name,
                source: s.source,
                applies_to: s.applies_to,
                note: s.note,
                increments_kj,
            });
        }
        Ok(sets)
    }

    /// The strain-free sum of `mol` in kJ/mol, or why the set does not apply (not a saturated
    /// hydrocarbon, or a carbon without carbon neighbours such as methane).
    pub fn strain_free_hf(&self, mol: &Molecule) -> Result<Quantity, String> {
        let folded = mol.with_hydrogens_folded();
        let mut value = 0.0;
        let mut variance = 0.0;
        let mut counts = [0u32; 4];
        for a in folded.atoms() {
            let atom = folded.atom(a);
            if atom.element != Element::C || atom.charge != 0 || atom.radical_electrons != 0 {
                return Err(format!(
                    "not applicable: {} applies to {} (atom {} is {})",
                    self.name,
                    self.applies_to,
                    a.index() + 1,
                    atom.element
                ));
            }
            let neighbours: Vec<_> = folded.neighbours(a).collect();
            if neighbours.iter().any(|(_, b)| b.order != BondOrder::Single) {
                return Err(format!(
                    "not applicable: {} applies to {} (multiple bond at atom {})",
                    self.name,
                    self.applies_to,
                    a.index() + 1
                ));
            }
            let carbons = neighbours.len();
            if carbons == 0 || carbons > 4 {
                return Err(format!(
                    "not applicable: {} has no increment for a carbon with {carbons} carbon \
                     neighbours",
                    self.name
                ));
            }
            counts[carbons - 1] += 1;
        }
        for (n, inc) in counts.iter().zip(self.increments_kj.iter()) {
            let n = f64::from(*n);
            value += n * inc.value;
            variance += (n * inc.uncertainty).powi(2);
        }
        Ok(Quantity::new(value, variance.sqrt()))
    }
}
