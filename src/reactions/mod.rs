//! Isodesmic reactions for strain energies: the connectivity-based hierarchy CBH-0 to CBH-3,
//! reference species with measured heats of formation, and reaction heats with uncertainties.
//!
//! [`build_reaction`] cuts a molecule into the rung's hydrogen-capped acyclic fragments and
//! returns a balanced [`Reaction`] (checked before it is returned: conservation per rung, and
//! every species an ordinary neutral molecule, [`validity`]); [`strain_from_reaction`]
//! prices it with the target's heat of formation and the [`ReferenceTable`] (or a fallback such
//! as group additivity, flagged per species) and gives the strain energy `SE = -dH`.
//!
//! ```
//! use ringheat::molecule::parse_smiles;
//! use ringheat::reactions::{build_reaction, strain_from_reaction, ReferenceTable, Rung};
//! use ringheat::thermo::Quantity;
//! let table = ReferenceTable::bundled().unwrap();
//! let reaction = build_reaction(&parse_smiles("C1CC1").unwrap(), Rung::Cbh2).unwrap();
//! // Cyclopropane's own Hf298 (ATcT 1.112, about 53.6 kJ/mol) as the caller's value.
//! let se = strain_from_reaction(&reaction, Quantity::new(53.64, 0.52), &|s| table.lookup(s)).unwrap();
//! assert!((se.strain_kj.value / 4.184 - 27.5).abs() < 1.0); // common practice: 27.5 kcal/mol
//! ```

mod balance;
pub mod cbh;
pub mod energetics;
pub mod equation;
pub mod error;
pub mod fragment;
mod geometry;
pub mod heat;
pub mod reaction;
pub mod reference;
mod units;
pub mod validity;

pub use cbh::{build_hierarchy, build_reaction, Rung};
pub use error::ReactionError;
pub use fragment::Species;
pub use heat::{strain_from_reaction, ReactionHeat, SourceTag, SpeciesHeat, StrainEstimate};
pub use reaction::Reaction;
pub use reference::{
    group_additivity_fallback, lookup_with_fallback, ReferenceError, ReferenceSpecies,
    ReferenceTable,
};
pub use validity::{abnormal_species, molecule_problem};
