//! A value with its uncertainty, and the unit conversions the reports use.

/// Joules per thermochemical calorie (exact).
pub const JOULES_PER_CALORIE: f64 = 4.184;
/// Gas constant, J/(mol K) (CODATA 2018, exact since the 2019 SI).
pub const GAS_CONSTANT: f64 = 8.314_462_618;
/// Reference temperature, K.
pub const T_REF_K: f64 = 298.15;

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

/// Energy unit for output.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize, Default)]
pub enum EnergyUnit {
    /// kJ/mol and J/(mol K) (the default).
    #[default]
    KiloJoule,
    /// kcal/mol and cal/(mol K).
    KiloCalorie,
}

impl EnergyUnit {
    /// Factor from kJ (or J) to this unit's kcal (or cal).
    pub fn factor(self) -> f64 {
        match self {
            EnergyUnit::KiloJoule => 1.0,
            EnergyUnit::KiloCalorie => 1.0 / JOULES_PER_CALORIE,
        }
    }

    /// Label of the molar energy unit.
    pub fn energy_label(self) -> &'static str {
        match self {
            EnergyUnit::KiloJoule => "kJ/mol",
            EnergyUnit::KiloCalorie => "kcal/mol",
        }
    }

    /// Label of the entropy / heat-capacity unit.
    pub fn entropy_label(self) -> &'static str {
        match self {
            EnergyUnit::KiloJoule => "J/(mol K)",
            EnergyUnit::KiloCalorie => "cal/(mol K)",
        }
    }
}
