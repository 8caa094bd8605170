//! Temperature dependence from tabulated Cp: Cp(T), H(T)-H298, S(T) and G(T).
//!
//! Cp is taken linear between the table temperatures (and from 300 K back to 298.15 K with the
//! 300-400 K slope), so H and S integrate exactly over each piece. Above the last table
//! temperature nothing is returned: extrapolation is left to the polynomial fit.

use super::estimate::ThermoEstimate;
use super::quantity::Quantity;
use crate::groups::table::CP_TEMPERATURES_K;
use crate::units::T_REF_K;

/// Properties of a species at one temperature (kJ/mol, J/(mol K)).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct StateAt {
    /// Temperature, K.
    pub t_k: f64,
    /// Heat capacity, J/(mol K).
    pub cp_j: f64,
    /// H(T) - H(298.15 K), kJ/mol.
    pub dh_kj: f64,
    /// Enthalpy on the formation scale, Hf298 + [H(T) - H298], kJ/mol.
    pub h_kj: f64,
    /// Entropy S(T), J/(mol K).
    pub s_j: f64,
    /// G(T) = H(T) - T S(T) on the formation-enthalpy scale, kJ/mol.
    pub g_kj: f64,
    /// Uncertainty of `cp_j`, J/(mol K).
    pub cp_unc_j: f64,
    /// Uncertainty of `h_kj` (Hf298 and the Cp integral, taken as fully correlated), kJ/mol.
    pub h_unc_kj: f64,
    /// Uncertainty of `s_j` (S298 and the Cp/T integral, fully correlated), J/(mol K).
    pub s_unc_j: f64,
    /// Uncertainty of `g_kj` (H and T*S combined in quadrature), kJ/mol.
    pub g_unc_kj: f64,
}

/// Knots of the piecewise-linear Cp: (T, Cp) from 298.15 K to the last table temperature.
pub fn cp_knots(cp: &[f64; 7]) -> Vec<(f64, f64)> {
    let t = &CP_TEMPERATURES_K;
    let slope = (cp[1] - cp[0]) / (t[1] - t[0]);
    let mut knots = vec![(T_REF_K, cp[0] - slope * (t[0] - T_REF_K))];
    knots.extend(t.iter().copied().zip(cp.iter().copied()));
    knots
}

/// Cp at `t_k` from the knots, or `None` outside them.
pub fn cp_at(knots: &[(f64, f64)], t_k: f64) -> Option<f64> {
    let first = knots.first()?;
    let last = knots.last()?;
    if !(first.0 - 1e-9..=last.0 + 1e-9).contains(&t_k) {
        return None;
    }
    for w in knots.windows(2) {
        let ((t0, c0), (t1, c1)) = (w[0], w[1]);
        if t_k <= t1 + 1e-9 {
            return Some(c0 + (c1 - c0) * (t_k - t0) / (t1 - t0));
        }
    }
    Some(last.1)
}

/// Integrals from 298.15 K to `t_k` of Cp dT (J/mol) and Cp/T dT (J/(mol K)).
pub fn integrate(knots: &[(f64, f64)], t_k: f64) -> Option<(f64, f64)> {
    cp_at(knots, t_k)?;
    let (mut h, mut s) = (0.0, 0.0);
    for w in knots.windows(2) {
        let ((t0, c0), (t1, c1)) = (w[0], w[1]);
        if t_k <= t0 {
            break;
        }
        let end = t_k.min(t1);
        let b = (c1 - c0) / (t1 - t0);
        let a = c0 - b * t0;
        h += a * (end - t0) + 0.5 * b * (end * end - t0 * t0);
        s += a * (end / t0).ln() + b * (end - t0);
    }
    Some((h, s))
}

impl ThermoEstimate {
    /// Cp, H, S, G at `t_k` (298.15..=1500 K), if Cp and S298 are estimated.
    pub fn state_at(&self, t_k: f64) -> Option<StateAt> {
        let cp_q = self.cp_j?;
        let s298 = self.s298_j?;
        let hf298 = self.hf298_kj?;
        let knots = cp_knots(&cp_q.map(|q| q.value));
        let unc_knots = cp_knots(&cp_q.map(|q| q.uncertainty));
        let cp_t = cp_at(&knots, t_k)?;
        let (dh_j, ds) = integrate(&knots, t_k)?;
        // Cp errors of one table entry move together at all temperatures: integrate them.
        let (dh_unc_j, ds_unc) = integrate(&unc_knots, t_k)?;
        let h_kj = hf298.value + dh_j / 1000.0;
        let s_j = s298.value + ds;
        let h_unc_kj = hf298.uncertainty + dh_unc_j.abs() / 1000.0;
        let s_unc_j = s298.uncertainty + ds_unc.abs();
        Some(StateAt {
            t_k,
            cp_j: cp_t,
            dh_kj: dh_j / 1000.0,
            h_kj,
            s_j,
            g_kj: h_kj - t_k * s_j / 1000.0,
            cp_unc_j: cp_at(&unc_knots, t_k)?.abs(),
            h_unc_kj,
            s_unc_j,
            g_unc_kj: h_unc_kj.hypot(t_k * s_unc_j / 1000.0),
        })
    }

    /// Cp at 298.15 K with its uncertainty, if estimated.
    pub fn cp298_j(&self) -> Option<Quantity> {
        let cp = self.cp_j?;
        let knots = cp_knots(&cp.map(|q| q.value));
        Some(Quantity::new(cp_at(&knots, T_REF_K)?, cp[0].uncertainty))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn constant_cp_integrates_exactly() {
        let knots = cp_knots(&[10.0; 7]);
        let (h, s) = integrate(&knots, 1000.0).unwrap();
        assert!((h - 10.0 * (1000.0 - T_REF_K)).abs() < 1e-9);
        assert!((s - 10.0 * (1000.0f64 / T_REF_K).ln()).abs() < 1e-9);
        assert!(integrate(&knots, 2000.0).is_none());
    }
}
