//! One species of a reaction: its Hf298, S298 and Cp(T) in the phase asked for, each with its
//! source.
//!
//! Gas Hf298: the user's value, else the measured reference table, else group additivity
//! ([`resolve_target_hf`]). Gas S298 and Cp(T): the small-species table (H2, H2O, ...), else
//! group additivity. Liquid: the user's liquid Hf298 if given, else gas Hf298 minus dHvap
//! ([`PhaseData::vaporisation`]); liquid S298 is the gas value minus the vaporisation entropy.
//! Liquid heat capacities are not estimated, so liquid values exist at 298.15 K only.

use super::small::SmallSpeciesTable;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::formula::Formula;
use crate::molecule::{Molecule, PerceivedMolecule};
use crate::phase::{Phase, PhaseData, Vaporisation};
use crate::strain::{resolve_target_hf, StrainData, TargetHf};
use crate::thermo::temperature::{cp_at, cp_knots, integrate};
use crate::thermo::{EstimateOptions, Quantity};
use crate::units::T_REF_K;

/// Values a user gives for one species (kJ/mol), each replacing what ringheat would use.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct SpeciesValues {
    /// Gas-phase Hf298.
    pub hf298_gas_kj: Option<Quantity>,
    /// Liquid-phase Hf298 (wins over gas Hf298 minus dHvap).
    pub hf298_liquid_kj: Option<Quantity>,
    /// Vaporisation enthalpy at 298.15 K.
    pub dhvap_kj: Option<Quantity>,
}

/// Everything species values are drawn from.
#[derive(Debug, Clone)]
pub struct EnergeticsData {
    /// Group additivity, reference table, strain increment sets.
    pub strain: StrainData,
    /// Vaporisation enthalpies.
    pub phase: PhaseData,
    /// S298 and Cp(T) of small inorganic species.
    pub small: SmallSpeciesTable,
}

impl EnergeticsData {
    /// The bundled data.
    pub fn bundled() -> Result<EnergeticsData, String> {
        Ok(EnergeticsData {
            strain: StrainData::bundled().map_err(|e| e.to_string())?,
            phase: PhaseData::bundled()?,
            small: SmallSpeciesTable::bundled()?,
        })
    }
}

/// A species' values in its phase.
#[derive(Debug, Clone, serde::Serialize)]
pub struct SpeciesThermo {
    /// Canonical SMILES.
    pub key: String,
    /// Hill formula.
    pub formula: String,
    /// Molar mass, g/mol.
    pub molar_mass_g_mol: f64,
    /// The phase the values refer to.
    pub phase: Phase,
    /// Gas-phase Hf298 with its origin.
    pub gas_hf: TargetHf,
    /// Vaporisation terms (liquid species whose liquid Hf298 the user did not give).
    pub vaporisation: Option<Vaporisation>,
    /// True when the liquid Hf298 is the user's own.
    pub liquid_hf_from_user: bool,
    /// Hf298 in the phase, kJ/mol.
    pub hf298_kj: Quantity,
    /// S298 in the phase, J/(mol K), if known.
    pub s298_j: Option<Quantity>,
    /// Where S298 and Cp came from.
    pub s_cp_source: String,
    /// Gas-phase Cp at the table temperatures, if known.
    #[serde(skip)]
    cp_gas_j: Option<[Quantity; 7]>,
    /// Warnings (stand-ins of the estimate, missing properties).
    pub flags: Vec<String>,
}

/// Enthalpy and entropy of a species at one temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpeciesState {
    /// H(T) on the formation scale, kJ/mol.
    pub h_kj: Quantity,
    /// S(T), J/(mol K), if known.
    pub s_j: Option<Quantity>,
}

impl SpeciesThermo {
    /// Resolves the values of `mol` in `phase` with the user's `values`.
    pub fn resolve(
        mol: &Molecule,
        phase: Phase,
        values: &SpeciesValues,
        data: &EnergeticsData,
    ) -> Result<SpeciesThermo, String> {
        SpeciesThermo::resolve_from(mol, phase, values, data, true)
    }

    /// As [`SpeciesThermo::resolve`]; with `use_measured` false no measured Hf298 or dHvap is
    /// used (user values still are), to compare the estimates with measured values.
    pub fn resolve_from(
        mol: &Molecule,
        phase: Phase,
        values: &SpeciesValues,
        data: &EnergeticsData,
        use_measured: bool,
    ) -> Result<SpeciesThermo, String> {
        let no_table = crate::reactions::ReferenceTable::default();
        let table = if use_measured {
            &data.strain.references
        } else {
            &no_table
        };
        let key = canonical_smiles(mol);
        let formula = Formula::of(mol);
        let estimate = data
            .strain
            .engine
            .estimate(&PerceivedMolecule::new(mol), &EstimateOptions::default());
        let mut flags = Vec::new();
        let gas_hf = resolve_target_hf(&key, values.hf298_gas_kj, table, estimate.as_ref().ok());
        let gas_hf = match (gas_hf, values.hf298_liquid_kj, &estimate) {
            (Some(h), _, _) => h,
            // Only a liquid value is known: the gas value is then never used.
            (None, Some(_), _) if phase == Phase::Liquid => TargetHf {
                hf298_kj: Quantity::new(f64::NAN, f64::NAN),
                origin: crate::strain::TargetHfOrigin::User,
            },
            (None, _, Err(e)) => {
                return Err(format!(
                    "no Hf298: no value given, none measured, and group additivity fails ({e})"
                ))
            }
            (None, _, Ok(_)) => return Err("no finite Hf298 from group additivity".to_string()),
        };
        if let (Ok(e), crate::strain::TargetHfOrigin::GroupAdditivity) = (&estimate, &gas_hf.origin)
        {
            flags.extend(
                e.flags
                    .iter()
                    .filter(|f| {
                        matches!(
                            f.category(),
                            crate::thermo::FlagCategory::StandIn
                                | crate::thermo::FlagCategory::NotApplied
                        )
                    })
                    .map(|f| f.to_string()),
            );
        }
        let (s_gas, cp_gas_j, s_cp_source) = match data.small.get(&key) {
            Some(small) => (
                Some(small.s298_j),
                Some(small.cp_j),
                format!("measured: {}", small.source),
            ),
            None => match &estimate {
                Ok(e) => (e.s298_j, e.cp_j, "Benson group additivity".to_string()),
                Err(_) => (None, None, "none (group additivity fails)".to_string()),
            },
        };
        let mut out = SpeciesThermo {
            key,
            formula: formula.hill(),
            molar_mass_g_mol: formula.molar_mass(),
            phase,
            hf298_kj: gas_hf.hf298_kj,
            gas_hf,
            vaporisation: None,
            liquid_hf_from_user: false,
            s298_j: s_gas,
            s_cp_source,
            cp_gas_j,
            flags,
        };
        if phase == Phase::Liquid {
            let vap = data
                .phase
                .vaporisation_from(mol, values.dhvap_kj, use_measured);
            match (values.hf298_liquid_kj, vap) {
                (Some(h), vap) => {
                    out.hf298_kj = h;
                    out.liquid_hf_from_user = true;
                    out.s298_j = match (&vap, out.s298_j) {
                        (Ok(v), Some(s)) => Some(minus(s, v.dsvap_j)),
                        _ => None,
                    };
                    out.vaporisation = vap.ok();
                }
                (None, Ok(v)) => {
                    out.hf298_kj = minus(out.gas_hf.hf298_kj, v.dhvap_kj);
                    out.s298_j = out.s298_j.map(|s| minus(s, v.dsvap_j));
                    out.vaporisation = Some(v);
                }
                (None, Err(e)) => return Err(e),
            }
        }
        Ok(out)
    }

    /// One line naming where Hf298 came from.
    pub fn hf_source(&self) -> String {
        if self.liquid_hf_from_user {
            return "liquid Hf298: user value".to_string();
        }
        match &self.vaporisation {
            Some(v) if self.phase == Phase::Liquid => format!(
                "gas Hf298: {}; dHvap {:.2} ± {:.2} kJ/mol: {}",
                self.gas_hf.describe(),
                v.dhvap_kj.value,
                v.dhvap_kj.uncertainty,
                v.source.describe()
            ),
            _ => self.gas_hf.describe(),
        }
    }

    /// H and S at `t_k`: Kirchhoff integration of the gas Cp; liquid values at 298.15 K only.
    pub fn state_at(&self, t_k: f64) -> Result<SpeciesState, String> {
        if (t_k - T_REF_K).abs() < 1e-6 {
            return Ok(SpeciesState {
                h_kj: self.hf298_kj,
                s_j: self.s298_j,
            });
        }
        if self.phase == Phase::Liquid {
            return Err(format!(
                "{} (liquid): no liquid heat capacity, so liquid values are given at 298.15 K only",
                self.key
            ));
        }
        let cp = self
            .cp_gas_j
            .ok_or_else(|| format!("{}: no heat capacity, so no value at {t_k} K", self.key))?;
        let knots = cp_knots(&cp.map(|q| q.value));
        let unc_knots = cp_knots(&cp.map(|q| q.uncertainty));
        cp_at(&knots, t_k).ok_or_else(|| {
            format!("{t_k} K is outside 298.15-1500 K, the range of the heat capacities")
        })?;
        let (dh_j, ds_j) = integrate(&knots, t_k).unwrap_or((f64::NAN, f64::NAN));
        let (dh_unc_j, ds_unc_j) = integrate(&unc_knots, t_k).unwrap_or((0.0, 0.0));
        // A table entry's Cp errors move together at all temperatures: add them linearly.
        Ok(SpeciesState {
            h_kj: Quantity::new(
                self.hf298_kj.value + dh_j / 1000.0,
                self.hf298_kj.uncertainty + dh_unc_j.abs() / 1000.0,
            ),
            s_j: self
                .s298_j
                .map(|s| Quantity::new(s.value + ds_j, s.uncertainty + ds_unc_j.abs())),
        })
    }
}

/// `a - b` with independent uncertainties.
fn minus(a: Quantity, b: Quantity) -> Quantity {
    Quantity::new(a.value - b.value, a.uncertainty.hypot(b.uncertainty))
}

/// Reads `VALUE`, `VALUE±UNC` or `VALUE+-UNC` (one unit, given by the caller).
pub fn parse_value_with_uncertainty(text: &str) -> Result<Quantity, String> {
    let t = text.trim();
    let (v, u) = match t.split_once('±').or_else(|| t.split_once("+-")) {
        Some((v, u)) => (v.trim(), Some(u.trim())),
        None => (t, None),
    };
    let value: f64 = v
        .parse()
        .map_err(|_| format!("`{text}` is not a number (write VALUE or VALUE±UNC)"))?;
    let unc: f64 = match u {
        Some(u) => u
            .parse()
            .map_err(|_| format!("`{text}`: the uncertainty `{u}` is not a number"))?,
        None => 0.0,
    };
    if !value.is_finite() || !unc.is_finite() || unc < 0.0 {
        return Err(format!(
            "`{text}`: value and uncertainty must be finite, the uncertainty not negative"
        ));
    }
    Ok(Quantity::new(value, unc))
}

/// Reads `SMILES=VALUE[±UNC]` into the canonical SMILES and the value (the last `=` separates,
/// since SMILES double bonds use `=` too).
pub fn parse_species_value(text: &str) -> Result<(String, Quantity), String> {
    let (smiles, value) = text
        .rsplit_once('=')
        .ok_or_else(|| format!("`{text}`: write SMILES=VALUE"))?;
    let mol = crate::molecule::parse_smiles(smiles.trim())
        .map_err(|e| format!("`{text}`: the SMILES does not parse: {}", e.kind))?;
    Ok((canonical_smiles(&mol), parse_value_with_uncertainty(value)?))
}
