//! Thermochemistry from groups: Hf298, S298, Cp(T), H(T), S(T), G(T) with uncertainties.

pub mod domain;
pub mod estimate;
pub mod flags;
mod linear_solve;
pub mod modes;
pub mod nasa;
pub mod polynomials;
pub mod quantity;
pub mod temperature;
pub mod terms;
pub mod uncertainty;
pub mod wilhoit;

pub use estimate::{EstimateError, EstimateOptions, GroupAdditivity, ThermoEstimate};
pub use flags::{Flag, FlagCategory, Property};
pub use quantity::Quantity;
