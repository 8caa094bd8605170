//! Physical constants and unit conversions, defined once for the whole crate.
//!
//! Everything inside the library is SI-molar: kJ/mol for energies and enthalpies, J/(mol K)
//! for entropies and heat capacities, K for temperatures. Conversions to other units happen
//! at the edges (reading a table or an energies file, writing a report), through the
//! constants and [`EnergyUnit`] of this module.

/// Joules per thermochemical calorie (exact by definition).
pub const JOULES_PER_CALORIE: f64 = 4.184;

/// Molar gas constant, J/(mol K) (CODATA 2018; exact since the 2019 SI redefinition).
pub const GAS_CONSTANT_J_PER_MOL_K: f64 = 8.314_462_618;

/// kJ/mol per hartree: the Hartree energy 4.359 744 722 2071e-18 J (CODATA 2018) times the
/// Avogadro constant 6.022 140 76e23 /mol (exact), rounded to the digits used here.
pub const KJ_PER_HARTREE: f64 = 2625.4996;

/// Reference temperature of the tabulated properties, K.
pub const T_REF_K: f64 = 298.15;

/// kcal (or cal) to kJ (or J).
pub fn kcal_to_kj(kcal: f64) -> f64 {
    kcal * JOULES_PER_CALORIE
}

/// kJ (or J) to kcal (or cal).
pub fn kj_to_kcal(kj: f64) -> f64 {
    kj / JOULES_PER_CALORIE
}

/// The unit family a user reads and writes: kJ/mol with J/(mol K), or kcal/mol with
/// cal/(mol K).
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize, Default)]
pub enum EnergyUnit {
    /// kJ/mol and J/(mol K) (the default).
    #[default]
    KiloJoule,
    /// kcal/mol and cal/(mol K).
    KiloCalorie,
}

impl EnergyUnit {
    /// kcal/mol with `kcal`, else kJ/mol (the `--kcal` switch of the commands).
    pub fn from_kcal_switch(kcal: bool) -> EnergyUnit {
        if kcal {
            EnergyUnit::KiloCalorie
        } else {
            EnergyUnit::KiloJoule
        }
    }

    /// Factor from kJ (or J) to this unit's kJ or kcal (or J or cal).
    pub fn factor(self) -> f64 {
        match self {
            EnergyUnit::KiloJoule => 1.0,
            EnergyUnit::KiloCalorie => 1.0 / JOULES_PER_CALORIE,
        }
    }

    /// Factor from this unit's kJ or kcal to kJ (reading a user value given in this unit).
    pub fn to_kj(self) -> f64 {
        match self {
            EnergyUnit::KiloJoule => 1.0,
            EnergyUnit::KiloCalorie => JOULES_PER_CALORIE,
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

    /// The energy unit as it appears in column and field names: `kj_per_mol` or `kcal_per_mol`.
    pub fn energy_slug(self) -> &'static str {
        match self {
            EnergyUnit::KiloJoule => "kj_per_mol",
            EnergyUnit::KiloCalorie => "kcal_per_mol",
        }
    }

    /// The entropy unit as it appears in column and field names: `j_per_mol_k` or
    /// `cal_per_mol_k`.
    pub fn entropy_slug(self) -> &'static str {
        match self {
            EnergyUnit::KiloJoule => "j_per_mol_k",
            EnergyUnit::KiloCalorie => "cal_per_mol_k",
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn conversions_invert() {
        assert!((kj_to_kcal(kcal_to_kj(12.5)) - 12.5).abs() < 1e-12);
        let kcal = EnergyUnit::from_kcal_switch(true);
        assert!((kcal.factor() * kcal.to_kj() - 1.0).abs() < 1e-15);
        // Hartree energy times Avogadro, CODATA 2018: 2625.499 639... kJ/mol.
        assert!((KJ_PER_HARTREE - 4.359_744_722_207_1e-21 * 6.022_140_76e23).abs() < 1e-3);
    }
}
