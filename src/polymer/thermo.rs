//! Enthalpy and entropy of ring-opening polymerisation, the Dainton-Ivin ceiling temperature,
//! and whether the polymerisation is favoured.
//!
//! - Gas to gas (`gg`): `dH_p = Hf298(unit) - Hf298(monomer)`, the unit priced by
//!   [`super::repeat_unit`], the monomer's Hf298 from the user, the measured table or group
//!   additivity; `dS_p(1 bar) = S298(unit) - S298(monomer)`.
//! - Liquid monomer to condensed polymer (`lc`): `dH_p(lc) = dH_p(gg) + dHvap(monomer) -
//!   dHvap(unit)`, the monomer's dHvap from the user, the CRC table or the Chickos estimate, the
//!   unit's from the Chickos contributions of one chain unit.
//! - Entropy standard state: monomer at 1 mol/L. `dS_p° = dS_p(gg, 1 bar) + R ln(R T° c°/p°)`
//!   (the ideal-gas change from 1 bar to 1 mol/L, +26.7 J/(mol K) at 298.15 K). For the `lc`
//!   state the solvation entropy of the monomer and the condensation entropy of the repeat unit
//!   are taken to cancel: our assumption, for which the uncertainty is widened by
//!   [`LC_ENTROPY_EXTRA_UNC_J`] (the check against published values is in tests/polymerisation.rs).
//! - Dainton-Ivin (F. S. Dainton, K. J. Ivin, Nature 162 (1948) 705; Q. Rev. Chem. Soc. 12
//!   (1958) 61): at equilibrium `dG_p = dH_p - T (dS_p° + R ln[M]) = 0`, so
//!   `T_c = dH_p / (dS_p° + R ln[M])`, with [M] the monomer concentration in mol/L.

use super::opening::{user_bond, usual_bond, OpenedBond, OpeningError};
use super::repeat_unit::{repeat_unit, RepeatUnit, RepeatUnitError};
use crate::molecule::{Molecule, PerceivedMolecule};
use crate::phase::Phase;
use crate::reactions::energetics::{EnergeticsData, SpeciesThermo, SpeciesValues};
use crate::thermo::Quantity;
use crate::units::{GAS_CONSTANT_J_PER_MOL_K as GAS_CONSTANT, T_REF_K};

/// Standard pressure, Pa (1 bar).
pub const STANDARD_PRESSURE_PA: f64 = 1.0e5;
/// Standard concentration, mol/m^3 (1 mol/L).
pub const STANDARD_CONCENTRATION_MOL_M3: f64 = 1000.0;
/// Monomer concentration used when none is given, mol/L.
pub const DEFAULT_CONCENTRATION_MOL_L: f64 = 1.0;
/// Extra entropy uncertainty of the `lc` state's cancellation assumption, J/(mol K): our
/// choice, about the size of the condensation entropies involved.
pub const LC_ENTROPY_EXTRA_UNC_J: f64 = 15.0;

/// The states the numbers refer to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum PolymerState {
    /// Gaseous monomer to (hypothetical) gaseous polymer, `gg`.
    GasGas,
    /// Liquid monomer to condensed (amorphous) polymer, `lc`.
    #[default]
    LiquidCondensed,
}

impl PolymerState {
    /// Short label and words.
    pub fn describe(self) -> &'static str {
        match self {
            PolymerState::GasGas => "gg: gaseous monomer to gaseous polymer",
            PolymerState::LiquidCondensed => "lc: liquid monomer to condensed polymer",
        }
    }
}

/// What to compute.
#[derive(Debug, Clone, Default)]
pub struct PolymerisationOptions {
    /// The bond to open (1-based atom numbers), else the usual bond.
    pub bond: Option<(usize, usize)>,
    /// Monomer concentration, mol/L (default [`DEFAULT_CONCENTRATION_MOL_L`], said so).
    pub concentration_mol_l: Option<f64>,
    /// Temperature at which favourability is judged, K (default 298.15).
    pub temperature_k: Option<f64>,
    /// The states.
    pub state: PolymerState,
    /// The user's values for the monomer.
    pub monomer_values: SpeciesValues,
    /// The user's vaporisation share of the repeat unit, kJ/mol.
    pub unit_dhvap_kj: Option<Quantity>,
}

/// Whether the polymerisation goes at the stated conditions, by the sign of dG_p (or of dH_p
/// when there is no entropy); [`Polymerisation::verdict_within_uncertainty`] says when zero lies
/// within the uncertainty.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Favourability {
    /// dG_p < 0.
    Favoured,
    /// dG_p > 0 (or dH_p > 0 for a small ring without an entropy).
    NotFavoured,
    /// No entropy and dH_p < 0: not judged.
    Unknown,
}

/// The kind of limiting temperature.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum LimitKind {
    /// Favoured below it (dH_p < 0, dS_p + R ln[M] < 0).
    Ceiling,
    /// Favoured above it (dH_p > 0, dS_p + R ln[M] > 0).
    Floor,
    /// Favoured at every temperature (dH_p < 0, dS_p + R ln[M] >= 0).
    None,
    /// Never favoured (dH_p > 0, dS_p + R ln[M] <= 0).
    Never,
}

/// The polymerisation thermodynamics of one monomer.
#[derive(Debug, Clone, serde::Serialize)]
pub struct Polymerisation {
    /// Canonical SMILES of the monomer.
    pub monomer: String,
    /// The bond opened, described.
    pub opened_bond: String,
    /// The repeat unit.
    pub unit: RepeatUnit,
    /// The monomer's gas values and their sources.
    pub monomer_gas: SpeciesThermo,
    /// The monomer's dHvap (lc state), kJ/mol, and its source.
    pub monomer_dhvap: Option<(Quantity, String)>,
    /// The states.
    pub state: PolymerState,
    /// dH_p in the stated states, kJ/mol.
    pub dh_p_kj: Quantity,
    /// dH_p gas to gas, kJ/mol.
    pub dh_p_gg_kj: Quantity,
    /// dS_p° (monomer at 1 mol/L), J/(mol K), if entropies are known.
    pub ds_p_j: Option<Quantity>,
    /// dS_p gas to gas at 1 bar, J/(mol K).
    pub ds_p_gg_1bar_j: Option<Quantity>,
    /// Monomer concentration, mol/L.
    pub concentration_mol_l: f64,
    /// True when the concentration is the default.
    pub concentration_defaulted: bool,
    /// Temperature of the favourability judgement, K.
    pub temperature_k: f64,
    /// dG_p at that temperature and concentration, kJ/mol.
    pub dg_p_kj: Option<Quantity>,
    /// Favoured or not.
    pub favourability: Favourability,
    /// True when dG_p (or dH_p) is zero within its uncertainty, so the verdict could go either way.
    pub verdict_within_uncertainty: bool,
    /// Ceiling (or floor) temperature, K, with uncertainty.
    pub limit_k: Option<Quantity>,
    /// Which limit it is.
    pub limit_kind: Option<LimitKind>,
    /// Warnings and assumptions.
    pub flags: Vec<String>,
}

/// Why the polymerisation could not be computed.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum PolymerisationError {
    /// No bond to open.
    #[error(transparent)]
    Opening(#[from] OpeningError),
    /// The repeat unit could not be priced.
    #[error(transparent)]
    Unit(#[from] RepeatUnitError),
    /// The monomer has no values.
    #[error("monomer: {0}")]
    Monomer(String),
    /// A bad option.
    #[error("{0}")]
    Option(String),
}

/// `R ln(R T c° / p°)`: the entropy change of an ideal gas from 1 bar to 1 mol/L, J/(mol K).
pub fn gas_standard_state_shift_j(t_k: f64) -> f64 {
    GAS_CONSTANT * (GAS_CONSTANT * t_k * STANDARD_CONCENTRATION_MOL_M3 / STANDARD_PRESSURE_PA).ln()
}

/// The Dainton-Ivin limiting temperature `dH_p / (dS_p° + R ln[M])` (kJ/mol, J/(mol K), mol/L)
/// with its kind; the uncertainty treats dH and dS as independent.
pub fn dainton_ivin(
    dh_kj: Quantity,
    ds_j: Quantity,
    concentration_mol_l: f64,
) -> (LimitKind, Option<Quantity>) {
    let s_eff = ds_j.value + GAS_CONSTANT * concentration_mol_l.ln();
    let h = dh_kj.value * 1000.0;
    let kind = match (h < 0.0, s_eff < 0.0) {
        (true, true) => LimitKind::Ceiling,
        (false, false) => LimitKind::Floor,
        (true, false) => LimitKind::None,
        (false, true) => LimitKind::Never,
    };
    let t = match kind {
        LimitKind::Ceiling | LimitKind::Floor if s_eff != 0.0 && h != 0.0 => {
            let t = h / s_eff;
            let rel = (dh_kj.uncertainty * 1000.0 / h).hypot(ds_j.uncertainty / s_eff);
            Some(Quantity::new(t, (t * rel).abs()))
        }
        _ => None,
    };
    (kind, t)
}

fn plus(a: Quantity, b: Quantity) -> Quantity {
    Quantity::new(a.value + b.value, a.uncertainty.hypot(b.uncertainty))
}

/// Polymerisation thermodynamics of the monomer `mol`.
pub fn polymerisation(
    mol: &Molecule,
    data: &EnergeticsData,
    options: &PolymerisationOptions,
) -> Result<Polymerisation, PolymerisationError> {
    let p = PerceivedMolecule::new(mol);
    let bond: OpenedBond = match options.bond {
        Some((x, y)) => user_bond(&p, x, y)?,
        None => usual_bond(&p)?,
    };
    let concentration = options
        .concentration_mol_l
        .unwrap_or(DEFAULT_CONCENTRATION_MOL_L);
    if !(concentration.is_finite() && concentration > 0.0) {
        return Err(PolymerisationError::Option(format!(
            "monomer concentration {concentration} mol/L must be a positive number"
        )));
    }
    let t = options.temperature_k.unwrap_or(T_REF_K);
    if !(t.is_finite() && t > 0.0) {
        return Err(PolymerisationError::Option(format!(
            "temperature {t} K must be positive"
        )));
    }
    let unit = repeat_unit(&p, &bond, &data.strain.engine, &data.phase)?;
    let monomer = SpeciesThermo::resolve(mol, Phase::Gas, &options.monomer_values, data)
        .map_err(PolymerisationError::Monomer)?;
    let mut flags = unit.flags.clone();
    flags.extend(monomer.flags.iter().map(|f| format!("monomer: {f}")));
    let dh_gg = Quantity::new(
        unit.hf298_kj.value - monomer.hf298_kj.value,
        unit.hf298_kj
            .uncertainty
            .hypot(monomer.hf298_kj.uncertainty),
    );
    let ds_gg = match (unit.s298_j, monomer.s298_j) {
        (Some(u), Some(m)) => Some(Quantity::new(
            u.value - m.value,
            u.uncertainty.hypot(m.uncertainty),
        )),
        _ => None,
    };
    let mut monomer_dhvap = None;
    let (dh_p, ds_extra) = match options.state {
        PolymerState::GasGas => (dh_gg, 0.0),
        PolymerState::LiquidCondensed => {
            let liquid = options.monomer_values.hf298_liquid_kj;
            let unit_vap = options.unit_dhvap_kj.or(unit.dhvap_kj).ok_or_else(|| {
                PolymerisationError::Monomer(format!(
                    "no vaporisation share of the repeat unit ({}); give it, or use the gas state",
                    unit.dhvap_problem.clone().unwrap_or_default()
                ))
            })?;
            let dh = match liquid {
                Some(h_l) => {
                    monomer_dhvap = Some((
                        Quantity::new(monomer.hf298_kj.value - h_l.value, h_l.uncertainty),
                        "from the user's liquid Hf298".to_string(),
                    ));
                    // Unit(condensed) - monomer(liquid).
                    Quantity::new(
                        unit.hf298_kj.value - unit_vap.value - h_l.value,
                        unit.hf298_kj
                            .uncertainty
                            .hypot(unit_vap.uncertainty)
                            .hypot(h_l.uncertainty),
                    )
                }
                None => {
                    let vap = data
                        .phase
                        .vaporisation(mol, options.monomer_values.dhvap_kj)
                        .map_err(PolymerisationError::Monomer)?;
                    monomer_dhvap = Some((vap.dhvap_kj, vap.source.describe()));
                    plus(
                        plus(dh_gg, vap.dhvap_kj),
                        Quantity::new(-unit_vap.value, unit_vap.uncertainty),
                    )
                }
            };
            flags.push(format!(
                "condensed polymer: the repeat unit's vaporisation share {:.2} ± {:.2} kJ/mol ({})",
                unit_vap.value,
                unit_vap.uncertainty,
                if options.unit_dhvap_kj.is_some() {
                    "user value".to_string()
                } else {
                    data.phase.method.name.clone()
                }
            ));
            (dh, LC_ENTROPY_EXTRA_UNC_J)
        }
    };
    let shift = gas_standard_state_shift_j(T_REF_K);
    let ds_p = ds_gg.map(|s| Quantity::new(s.value + shift, s.uncertainty.hypot(ds_extra)));
    if options.concentration_mol_l.is_none() {
        flags.push(format!(
            "monomer concentration not given: {DEFAULT_CONCENTRATION_MOL_L} mol/L assumed"
        ));
    }
    let (dg, favourability, within, limit_kind, limit_k) = match ds_p {
        Some(s) => {
            let s_eff = s.value + GAS_CONSTANT * concentration.ln();
            let dg = Quantity::new(
                dh_p.value - t * s_eff / 1000.0,
                dh_p.uncertainty.hypot(t * s.uncertainty / 1000.0),
            );
            let fav = if dg.value < 0.0 {
                Favourability::Favoured
            } else {
                Favourability::NotFavoured
            };
            let (kind, limit) = dainton_ivin(dh_p, s, concentration);
            (
                Some(dg),
                fav,
                dg.value.abs() <= dg.uncertainty,
                Some(kind),
                limit,
            )
        }
        None => {
            flags.push(
                "no entropy of polymerisation: no dG_p and no ceiling temperature".to_string(),
            );
            // Ring-opening polymerisation entropies are negative for rings of up to about eight
            // atoms (Dainton and Ivin 1958, recalled from memory), so dH_p > 0 means not favoured.
            let small_ring = p.rings.rings.iter().all(|r| r.size() <= 8);
            let fav = if dh_p.value > 0.0 && small_ring {
                flags.push(
                    "judged from dH_p > 0 alone (dS_p of rings up to eight atoms is negative)"
                        .to_string(),
                );
                Favourability::NotFavoured
            } else {
                Favourability::Unknown
            };
            (None, fav, dh_p.value.abs() <= dh_p.uncertainty, None, None)
        }
    };
    Ok(Polymerisation {
        monomer: monomer.key.clone(),
        opened_bond: bond.describe(&p),
        unit,
        monomer_gas: monomer,
        monomer_dhvap,
        state: options.state,
        dh_p_kj: dh_p,
        dh_p_gg_kj: dh_gg,
        ds_p_j: ds_p,
        ds_p_gg_1bar_j: ds_gg,
        concentration_mol_l: concentration,
        concentration_defaulted: options.concentration_mol_l.is_none(),
        temperature_k: t,
        dg_p_kj: dg,
        favourability,
        verdict_within_uncertainty: within,
        limit_k,
        limit_kind,
        flags,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn standard_state_shift() {
        // R ln(R T / (p° / c°)) at 298.15 K: ln(24.79) x 8.3145 = 26.7 J/(mol K) (common practice).
        assert!((gas_standard_state_shift_j(T_REF_K) - 26.69).abs() < 0.02);
    }

    #[test]
    fn dainton_ivin_worked_example() {
        // Worked example (our numbers): dH_p = -22.9 kJ/mol, dS_p° = -41.1 J/(mol K) at 1 mol/L
        // (values of the order published for L-lactide, recalled from memory):
        // T_c = -22900 / (-41.1 + 8.314462618 ln 1) = 557.2 K; at 0.1 mol/L the denominator is
        // -41.1 - 19.145 = -60.245, so T_c = 380.1 K.
        let (kind, t) = dainton_ivin(Quantity::new(-22.9, 0.0), Quantity::new(-41.1, 0.0), 1.0);
        assert_eq!(kind, LimitKind::Ceiling);
        assert!((t.expect("a ceiling").value - 557.18).abs() < 0.05);
        let (_, t) = dainton_ivin(Quantity::new(-22.9, 0.0), Quantity::new(-41.1, 0.0), 0.1);
        assert!((t.expect("a ceiling").value - 380.11).abs() < 0.05);
        let (kind, t) = dainton_ivin(Quantity::new(2.9, 0.0), Quantity::new(-10.5, 0.0), 1.0);
        assert_eq!(kind, LimitKind::Never);
        assert!(t.is_none());
    }
}
