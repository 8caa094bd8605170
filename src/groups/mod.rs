//! Benson groups: keys, tables loaded from group-tables/, assignment and corrections.

pub mod key;
pub mod table;

pub use key::GroupKey;
