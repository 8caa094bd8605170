//! The target's own Hf298 for a strain energy: a user value, else a measured value from the
//! reference table, else the group-additivity estimate (flagged as circular).

use crate::reactions::ReferenceTable;
use crate::thermo::{Quantity, ThermoEstimate};

/// Where the target's Hf298 came from.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum TargetHfOrigin {
    /// Given by the user.
    User,
    /// A measured value of the bundled (or given) reference table.
    Measured {
        /// The entry's name.
        name: String,
        /// The entry's source.
        source: String,
        /// The entry's note (assumed uncertainty and the like), if any.
        note: Option<String>,
    },
    /// The group-additivity estimate itself: group strain is then just the ring corrections.
    GroupAdditivity,
}

/// The target's Hf298 with its origin.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct TargetHf {
    /// Hf298, kJ/mol.
    pub hf298_kj: Quantity,
    /// Where it came from.
    pub origin: TargetHfOrigin,
}

impl TargetHf {
    /// True when the value is the group-additivity estimate, so that strain from it restates
    /// the ring corrections of the tables rather than measuring anything.
    pub fn is_circular(&self) -> bool {
        self.origin == TargetHfOrigin::GroupAdditivity
    }

    /// One line for reports: `user value`, `measured: <source> (<name>)`, ...
    pub fn describe(&self) -> String {
        match &self.origin {
            TargetHfOrigin::User => "user value".to_string(),
            TargetHfOrigin::Measured { name, source, note } => match note {
                Some(n) => format!("measured: {source} ({name}; {n})"),
                None => format!("measured: {source} ({name})"),
            },
            TargetHfOrigin::GroupAdditivity => {
                "group-additivity estimate (circular: no measured value known)".to_string()
            }
        }
    }
}

/// Picks the target's Hf298: `user` first, then the `table` entry for the canonical SMILES
/// `key`, then the estimate's Hf298. `None` when none of the three is available.
pub fn resolve_target_hf(
    key: &str,
    user: Option<Quantity>,
    table: &ReferenceTable,
    estimate: Option<&ThermoEstimate>,
) -> Option<TargetHf> {
    if let Some(q) = user {
        return Some(TargetHf {
            hf298_kj: q,
            origin: TargetHfOrigin::User,
        });
    }
    if let Some(entry) = table.get(key) {
        return Some(TargetHf {
            hf298_kj: entry.hf298_kj,
            origin: TargetHfOrigin::Measured {
                name: entry.name.clone(),
                source: entry.source.clone(),
                note: entry.note.clone(),
            },
        });
    }
    estimate
        .and_then(|e| e.hf298_kj)
        .filter(|hf| hf.value.is_finite())
        .map(|hf298_kj| TargetHf {
            hf298_kj,
            origin: TargetHfOrigin::GroupAdditivity,
        })
}
