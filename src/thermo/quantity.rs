//! A value with its uncertainty (constants and unit conversions live in [`crate::units`]).

/// A value with a 1-sigma-like uncertainty, in the unit its name says.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct Quantity {
    /// The value.
    pub value: f64,
    /// Its uncertainty (same unit).
    pub uncertainty: f64,
}

impl Quantity {
    /// A value with an uncertainty.
    pub fn new(value: f64, uncertainty: f64) -> Quantity {
        Quantity { value, uncertainty }
    }

    /// Scales value and uncertainty (unit conversion).
    pub fn scaled(self, factor: f64) -> Quantity {
        Quantity::new(self.value * factor, self.uncertainty * factor.abs())
    }
}
