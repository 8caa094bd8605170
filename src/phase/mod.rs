//! Phases: liquid values from gas-phase ones through the vaporisation enthalpy at 298.15 K.
//!
//! `Hf298(liquid) = Hf298(gas) - dHvap`. The vaporisation enthalpy is, in this order, the user's
//! value, a measured value of the CRC Handbook table (`group-tables/phase/vaporisation-crc.toml`),
//! or the group-contribution estimate of Chickos et al. (1988) ([`chickos`]); each says which.
//! The liquid entropy is `S298(gas) - dSvap` with the CRC entropy difference where the table has
//! one, else Trouton's rule. A user's liquid Hf298 replaces the whole chain.
//!
//! ```
//! use ringheat::molecule::parse_smiles;
//! use ringheat::phase::PhaseData;
//! let data = PhaseData::bundled().unwrap();
//! let v = data.vaporisation(&parse_smiles("C1CCOC1").unwrap(), None).unwrap();
//! assert!((v.dhvap_kj.value - 32.0).abs() < 0.1); // CRC Handbook: 31.99 kJ/mol
//! ```

pub mod chickos;
pub mod measured;

use crate::molecule::canon::canonical_smiles;
use crate::molecule::Molecule;
use crate::thermo::Quantity;

pub use chickos::ChickosMethod;
pub use measured::{MeasuredTable, MeasuredVaporisation};

/// The physical state a species' values refer to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Phase {
    /// Ideal gas at 1 bar (group additivity's own state).
    #[default]
    Gas,
    /// Pure liquid at 1 bar.
    Liquid,
}

impl Phase {
    /// `gas` or `liquid`.
    pub fn name(self) -> &'static str {
        match self {
            Phase::Gas => "gas",
            Phase::Liquid => "liquid",
        }
    }

    /// Reads `g`, `gas`, `l`, `liquid`.
    pub fn parse(text: &str) -> Option<Phase> {
        match text.trim().to_ascii_lowercase().as_str() {
            "g" | "gas" => Some(Phase::Gas),
            "l" | "liquid" => Some(Phase::Liquid),
            _ => None,
        }
    }
}

/// Where a vaporisation enthalpy came from.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum VaporisationSource {
    /// Given by the user.
    User,
    /// A measured value.
    Measured {
        /// The entry's name.
        name: String,
        /// The table's source.
        source: String,
    },
    /// The group-contribution estimate.
    Estimated {
        /// The method's name (its citation is [`PhaseData::method_label`]).
        method: String,
        /// Assumptions of the groups used.
        notes: Vec<String>,
    },
}

impl VaporisationSource {
    /// One line for reports.
    pub fn describe(&self) -> String {
        match self {
            VaporisationSource::User => "user value".to_string(),
            VaporisationSource::Measured { name, source } => format!("measured: {source} ({name})"),
            VaporisationSource::Estimated { method, notes } if notes.is_empty() => {
                format!("estimated: {method}")
            }
            VaporisationSource::Estimated { method, notes } => {
                format!("estimated: {method} ({})", notes.join("; "))
            }
        }
    }
}

/// The vaporisation enthalpy and entropy of one species at 298.15 K.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Vaporisation {
    /// dHvap, kJ/mol.
    pub dhvap_kj: Quantity,
    /// Where it came from.
    pub source: VaporisationSource,
    /// Standard vaporisation entropy, J/(mol K).
    pub dsvap_j: Quantity,
    /// Where the entropy came from.
    pub entropy_source: String,
}

/// Everything phase changes need: the measured table and the estimate.
#[derive(Debug, Clone)]
pub struct PhaseData {
    /// The group-contribution method.
    pub method: ChickosMethod,
    /// Measured values.
    pub measured: MeasuredTable,
}

impl PhaseData {
    /// The bundled files.
    pub fn bundled() -> Result<PhaseData, String> {
        Ok(PhaseData {
            method: ChickosMethod::bundled()?,
            measured: MeasuredTable::bundled()?,
        })
    }

    /// The estimate alone (no measured value), for checks and for repeat units.
    pub fn estimate(&self, mol: &Molecule) -> Result<Vaporisation, String> {
        let (q, _, notes) = self.method.estimate(mol)?;
        Ok(Vaporisation {
            dhvap_kj: q,
            source: VaporisationSource::Estimated {
                method: self.method.name.clone(),
                notes,
            },
            dsvap_j: self.method.vaporisation_entropy_j(mol),
            entropy_source: self.method.entropy.source.clone(),
        })
    }

    /// Name and citation of the estimate, for reports.
    pub fn method_label(&self) -> String {
        format!("{}, {}", self.method.name, self.method.source)
    }

    /// dHvap of `mol`: `user` (kJ/mol) first, then the measured table, then the estimate.
    pub fn vaporisation(
        &self,
        mol: &Molecule,
        user: Option<Quantity>,
    ) -> Result<Vaporisation, String> {
        self.vaporisation_from(mol, user, true)
    }

    /// As [`PhaseData::vaporisation`]; with `use_measured` false the measured table is skipped
    /// (to compare the estimate with measured values).
    pub fn vaporisation_from(
        &self,
        mol: &Molecule,
        user: Option<Quantity>,
        use_measured: bool,
    ) -> Result<Vaporisation, String> {
        let key = canonical_smiles(mol);
        let measured = self.measured.usable(&key).filter(|_| use_measured);
        let (dsvap_j, entropy_source) = match measured.and_then(|m| m.svap298_j) {
            Some(s) => (
                Quantity::new(s, 2.0),
                "measured: S(gas) - S(liquid), CRC Handbook via the chemicals package (uncertainty 2 J/(mol K) assumed)".to_string(),
            ),
            None => (
                self.method.vaporisation_entropy_j(mol),
                self.method.entropy.source.clone(),
            ),
        };
        if let Some(q) = user {
            return Ok(Vaporisation {
                dhvap_kj: q,
                source: VaporisationSource::User,
                dsvap_j,
                entropy_source,
            });
        }
        if let Some(m) = measured {
            return Ok(Vaporisation {
                dhvap_kj: m.hvap298_kj,
                source: VaporisationSource::Measured {
                    name: m.name.clone(),
                    source: format!("{}, {}", self.measured.source, m.basis),
                },
                dsvap_j,
                entropy_source,
            });
        }
        let mut v = self.estimate(mol).map_err(|e| {
            format!("no vaporisation enthalpy: not in the measured table, and the estimate fails ({e}); give dHvap")
        })?;
        v.dsvap_j = dsvap_j;
        v.entropy_source = entropy_source;
        Ok(v)
    }
}
