//! Ring-opening polymerisation: the repeat unit found from the monomer's graph, dH_p and dS_p in
//! stated states, the Dainton-Ivin ceiling temperature and whether the polymerisation is
//! favoured.
//!
//! ```
//! use ringheat::molecule::parse_smiles;
//! use ringheat::polymer::{polymerisation, PolymerisationOptions, PolymerState};
//! use ringheat::reactions::energetics::EnergeticsData;
//! let data = EnergeticsData::bundled().unwrap();
//! let options = PolymerisationOptions { state: PolymerState::GasGas, ..Default::default() };
//! let p = polymerisation(&parse_smiles("C1CC1").unwrap(), &data, &options).unwrap();
//! // Cyclopropane to polymethylene, gas: about -115 kJ/mol (its strain energy).
//! assert!((p.dh_p_kj.value + 115.0).abs() < 10.0);
//! ```

pub mod opening;
pub mod repeat_unit;
pub mod thermo;

pub use opening::{user_bond, usual_bond, OpenedBond, OpeningError, OpeningKind};
pub use repeat_unit::{repeat_unit, RepeatUnit};
pub use thermo::{
    dainton_ivin, polymerisation, Favourability, LimitKind, PolymerState, Polymerisation,
    PolymerisationError, PolymerisationOptions, DEFAULT_CONCENTRATION_MOL_L,
};
