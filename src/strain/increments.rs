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

use crate::data::document::Source;
use crate::data::increments_file::parse_increments_file;
use crate::data::{bundled, DataError};
use crate::molecule::{BondOrder, Element, Molecule};
use crate::thermo::Quantity;

/// Path label of the bundled file (relative to the crate root).
pub const BUNDLED_INCREMENTS_PATH: &str = bundled::INCREMENTS_FILE.0;

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

/// Errors of the increment file: the data layer's one error type.
pub type IncrementError = DataError;

impl IncrementSet {
    /// The bundled sets.
    pub fn bundled() -> Result<Vec<IncrementSet>, IncrementError> {
        IncrementSet::from_toml(
            bundled::INCREMENTS_FILE.1,
            Path::new(BUNDLED_INCREMENTS_PATH),
        )
    }

    /// Parses a file of sets (`[meta] energy_unit` kcal/mol or kJ/mol); `path` labels errors.
    /// Every set needs all four centres, each once, with finite values and a non-negative
    /// uncertainty.
    pub fn from_toml(text: &str, path: &Path) -> Result<Vec<IncrementSet>, IncrementError> {
        let records = parse_increments_file(Source { path, text })?;
        Ok(records
            .into_iter()
            .map(|r| IncrementSet {
                name: r.name,
                source: r.source,
                applies_to: r.applies_to,
                note: r.note,
                increments_kj: r.increments_kj,
            })
            .collect())
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
