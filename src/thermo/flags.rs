//! Typed flags of an estimate: each says what was assumed or left out, with the data to show it.
//!
//! A flag is data, not prose: reports print it through [`std::fmt::Display`], code matches on
//! the variant (never on the text). To add a kind of flag, add a variant to [`Flag`] with the
//! data it needs, its text in the `Display` impl and its [`FlagCategory`] in
//! [`Flag::category`]; the compiler then lists every `match` that must learn it.

use std::fmt;

use crate::groups::interactions::InteractionNote;
use crate::groups::ring_corrections::RingStandIn;
use crate::groups::GroupKey;
use crate::thermo::domain::OutOfDomain;

/// A thermochemical property of an estimate.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Property {
    /// Enthalpy of formation at 298.15 K.
    Hf298,
    /// Entropy at 298.15 K.
    S298,
    /// Heat capacity over the table temperatures.
    Cp,
}

impl Property {
    /// What the tables lack for this property, in words (`entropy`, ...).
    pub fn table_word(self) -> &'static str {
        match self {
            Property::Hf298 => "enthalpy of formation",
            Property::S298 => "entropy",
            Property::Cp => "heat capacity",
        }
    }

    /// The property as reports name it (`Hf298`, `S298`, `Cp(T)`).
    pub fn symbol(self) -> &'static str {
        match self {
            Property::Hf298 => "Hf298",
            Property::S298 => "S298",
            Property::Cp => "Cp(T)",
        }
    }
}

/// What kind of warning a flag is, for reports that summarise flags.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum FlagCategory {
    /// A table entry the molecule needs is missing and another one stands in.
    StandIn,
    /// A counted term has no table entry and is left out.
    NotApplied,
    /// An assumption about the structure (geometry, conformation).
    Assumption,
    /// A property could not be estimated.
    PropertyMissing,
    /// The structure lies outside the domain of group additivity.
    OutOfDomain,
}

impl FlagCategory {
    /// Short word for table cells.
    pub fn word(self) -> &'static str {
        match self {
            FlagCategory::StandIn => "stand-in",
            FlagCategory::NotApplied => "not applied",
            FlagCategory::Assumption => "assumption",
            FlagCategory::PropertyMissing => "missing property",
            FlagCategory::OutOfDomain => "out of domain",
        }
    }
}

/// One visible warning of an estimate.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Flag {
    /// A group is not in the tables; a more generic group stands in (uncertainty widened).
    GroupStandIn {
        /// The group the molecule has.
        group: GroupKey,
        /// The group used in its place.
        stand_in: GroupKey,
    },
    /// A correction is not in the tables; a more general one stands in (uncertainty widened).
    CorrectionStandIn {
        /// The correction counted.
        correction: String,
        /// The correction used in its place.
        stand_in: String,
    },
    /// A counted correction has no table entry and no stand-in: left out.
    CorrectionNotApplied {
        /// The correction counted.
        correction: String,
        /// Occurrences.
        count: u32,
    },
    /// A ring system is not in the ring tables; its parts stood in (uncertainty widened).
    RingStandIn(RingStandIn),
    /// An assumption made while counting interactions.
    Interaction(InteractionNote),
    /// A property is not estimated because some terms lack it.
    PropertyNotEstimated {
        /// The property.
        property: Property,
        /// Labels of the terms without a value for it.
        lacking: Vec<String>,
    },
    /// The structure is outside the domain of group additivity, estimated only because the
    /// options asked for it (the numbers miss what the finding names).
    OutOfDomain(OutOfDomain),
}

impl Flag {
    /// The kind of warning.
    pub fn category(&self) -> FlagCategory {
        match self {
            Flag::GroupStandIn { .. } | Flag::CorrectionStandIn { .. } | Flag::RingStandIn(_) => {
                FlagCategory::StandIn
            }
            Flag::CorrectionNotApplied { .. } => FlagCategory::NotApplied,
            Flag::Interaction(_) => FlagCategory::Assumption,
            Flag::PropertyNotEstimated { .. } => FlagCategory::PropertyMissing,
            Flag::OutOfDomain(_) => FlagCategory::OutOfDomain,
        }
    }

    /// The property a [`Flag::PropertyNotEstimated`] is about.
    pub fn missing_property(&self) -> Option<Property> {
        match self {
            Flag::PropertyNotEstimated { property, .. } => Some(*property),
            _ => None,
        }
    }
}

impl fmt::Display for Flag {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Flag::GroupStandIn { group, stand_in } => write!(
                f,
                "group {group} is not in the tables; {stand_in} stands in (uncertainty widened)"
            ),
            Flag::CorrectionStandIn {
                correction,
                stand_in,
            } => write!(
                f,
                "correction {correction} is not in the tables; {stand_in} stands in"
            ),
            Flag::CorrectionNotApplied { correction, count } => write!(
                f,
                "{count} x {correction} counted, but the tables have no `{correction}` \
                 correction: not applied"
            ),
            Flag::RingStandIn(stand_in) => write!(f, "{stand_in}"),
            Flag::Interaction(note) => write!(f, "{note}"),
            Flag::PropertyNotEstimated { property, lacking } => write!(
                f,
                "no {} in the tables for {}: {} not estimated",
                property.table_word(),
                lacking.join(", "),
                property.symbol()
            ),
            Flag::OutOfDomain(found) => write!(
                f,
                "outside the domain of group additivity ({found}); the numbers are not an \
                 estimate of this molecule"
            ),
        }
    }
}

/// Flags as one line, `" | "` between them (CSV cells, test output).
pub fn joined<F: fmt::Display>(flags: &[F]) -> String {
    flags
        .iter()
        .map(ToString::to_string)
        .collect::<Vec<_>>()
        .join(" | ")
}
