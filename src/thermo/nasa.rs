//! NASA 7-coefficient polynomials over two temperature ranges: evaluation, and a constrained
//! least-squares fit with H and S anchored at 298.15 K and Cp, H, S continuous at the common
//! temperature.
//!
//! Cp/R = a1 + a2 T + a3 T^2 + a4 T^3 + a5 T^4, H/(RT) = a1 + a2 T/2 + a3 T^2/3 + a4 T^3/4 +
//! a5 T^4/5 + a6/T, S/R = a1 ln T + a2 T + a3 T^2/2 + a4 T^3/3 + a5 T^4/4 + a7 (S. Gordon and
//! B. J. McBride, NASA SP-273, 1971; B. J. McBride, S. Gordon and M. A. Reno, NASA TM-4513,
//! 1993; recalled from memory). H is on the formation scale: H(298.15 K) = Hf298. Like the PAC
//! program (B. J. McBride and S. Gordon, NASA RP-1271, 1992, recalled from memory) the fit takes
//! Cp, H and S together, with the anchors and the joins as exact constraints.

use super::linear_solve::{constrained_least_squares, Equation};
use crate::units::{GAS_CONSTANT_J_PER_MOL_K as GAS_CONSTANT, T_REF_K};

/// Scale of the temperature inside the fit (T/1000), which keeps the normal equations well
/// conditioned; the coefficients are converted back to kelvin afterwards.
const T_SCALE_K: f64 = 1000.0;

/// The two temperature ranges: low..mid and mid..high, K.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct NasaRanges {
    /// Lowest temperature, K.
    pub t_low_k: f64,
    /// Common temperature of the two ranges, K.
    pub t_mid_k: f64,
    /// Highest temperature, K.
    pub t_high_k: f64,
}

impl Default for NasaRanges {
    /// 200-1000 K and 1000-3000 K (the ranges of most published NASA-7 sets, common practice).
    fn default() -> NasaRanges {
        NasaRanges {
            t_low_k: 200.0,
            t_mid_k: 1000.0,
            t_high_k: 3000.0,
        }
    }
}

impl NasaRanges {
    /// Checks the order of the temperatures and that 298.15 K, where the fit is anchored, lies
    /// in (or within 2 K below) the low range.
    pub fn check(&self) -> Result<(), NasaError> {
        let NasaRanges {
            t_low_k: lo,
            t_mid_k: mid,
            t_high_k: hi,
        } = *self;
        if !(lo.is_finite() && mid.is_finite() && hi.is_finite() && lo < mid && mid < hi) {
            return Err(NasaError::BadRanges(format!(
                "temperatures {lo}, {mid}, {hi} K must rise strictly"
            )));
        }
        if lo < 50.0 || hi > 6000.0 {
            return Err(NasaError::BadRanges(format!(
                "ranges {lo}-{hi} K: the fits cover 50 to 6000 K"
            )));
        }
        if lo > 300.0 || mid <= T_REF_K + 100.0 {
            return Err(NasaError::BadRanges(format!(
                "low range {lo}-{mid} K: it must start at or below 300 K and end above 398.15 K, \
                 since the fit is anchored at 298.15 K"
            )));
        }
        Ok(())
    }
}

/// A species' NASA-7 polynomials.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct Nasa7 {
    /// The temperature ranges.
    pub ranges: NasaRanges,
    /// a1..a7 of the low range.
    pub low: [f64; 7],
    /// a1..a7 of the high range.
    pub high: [f64; 7],
}

/// Which polynomial of the pair.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Range {
    /// t_low..t_mid.
    Low,
    /// t_mid..t_high.
    High,
}

/// Why a fit failed.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum NasaError {
    /// The ranges are unusable.
    #[error("{0}")]
    BadRanges(String),
    /// Too few samples in a range.
    #[error("too few samples in the {0} range")]
    TooFewSamples(&'static str),
    /// The least-squares system is singular.
    #[error("the NASA-7 least-squares system is singular")]
    Singular,
}

/// Cp/R of coefficients `a` at `t`.
fn cp_over_r(a: &[f64; 7], t: f64) -> f64 {
    a[0] + t * (a[1] + t * (a[2] + t * (a[3] + t * a[4])))
}

/// H/R (K) of coefficients `a` at `t`, without a6.
fn h_over_r_poly(a: &[f64; 7], t: f64) -> f64 {
    t * (a[0] + t * (a[1] / 2.0 + t * (a[2] / 3.0 + t * (a[3] / 4.0 + t * a[4] / 5.0))))
}

/// S/R of coefficients `a` at `t`, without a7.
fn s_over_r_poly(a: &[f64; 7], t: f64) -> f64 {
    a[0] * t.ln() + t * (a[1] + t * (a[2] / 2.0 + t * (a[3] / 3.0 + t * a[4] / 4.0)))
}

impl Nasa7 {
    fn coefficients(&self, range: Range) -> &[f64; 7] {
        match range {
            Range::Low => &self.low,
            Range::High => &self.high,
        }
    }

    /// The range that evaluates `t_k` (the low one up to and including the common temperature,
    /// as Cantera does).
    pub fn range_of(&self, t_k: f64) -> Range {
        if t_k <= self.ranges.t_mid_k {
            Range::Low
        } else {
            Range::High
        }
    }

    /// Cp, J/(mol K), from the polynomial of `range`.
    pub fn cp_j_in(&self, range: Range, t_k: f64) -> f64 {
        GAS_CONSTANT * cp_over_r(self.coefficients(range), t_k)
    }

    /// H on the formation scale, kJ/mol, from the polynomial of `range`.
    pub fn h_kj_in(&self, range: Range, t_k: f64) -> f64 {
        let a = self.coefficients(range);
        GAS_CONSTANT * (h_over_r_poly(a, t_k) + a[5]) / 1000.0
    }

    /// S, J/(mol K), from the polynomial of `range`.
    pub fn s_j_in(&self, range: Range, t_k: f64) -> f64 {
        let a = self.coefficients(range);
        GAS_CONSTANT * (s_over_r_poly(a, t_k) + a[6])
    }

    /// Cp at `t_k`, J/(mol K).
    pub fn cp_j(&self, t_k: f64) -> f64 {
        self.cp_j_in(self.range_of(t_k), t_k)
    }

    /// H at `t_k` on the formation scale, kJ/mol.
    pub fn h_kj(&self, t_k: f64) -> f64 {
        self.h_kj_in(self.range_of(t_k), t_k)
    }

    /// S at `t_k`, J/(mol K).
    pub fn s_j(&self, t_k: f64) -> f64 {
        self.s_j_in(self.range_of(t_k), t_k)
    }

    /// Largest relative difference of Cp, H and S between the two polynomials at the common
    /// temperature (H relative to |H| or Cp*T, whichever is larger).
    pub fn join_mismatch(&self) -> f64 {
        let t = self.ranges.t_mid_k;
        let cp = (self.cp_j_in(Range::Low, t), self.cp_j_in(Range::High, t));
        let h = (self.h_kj_in(Range::Low, t), self.h_kj_in(Range::High, t));
        let s = (self.s_j_in(Range::Low, t), self.s_j_in(Range::High, t));
        let h_scale = h.0.abs().max(cp.0 * t / 1000.0);
        [
            (cp.0 - cp.1).abs() / cp.0.abs(),
            (h.0 - h.1).abs() / h_scale,
            (s.0 - s.1).abs() / s.0.abs(),
        ]
        .into_iter()
        .fold(0.0, f64::max)
    }
}

/// One point of the curve to fit: Cp, H (formation scale) and S at a temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Sample {
    /// Temperature, K.
    pub t_k: f64,
    /// Cp, J/(mol K).
    pub cp_j: f64,
    /// H, kJ/mol.
    pub h_kj: f64,
    /// S, J/(mol K).
    pub s_j: f64,
    /// Weight of the sample's three rows.
    pub weight: f64,
}

/// Rows of Cp/R, H/(RT) and S/R in the scaled coefficients c (c_k = a_k 1000^(k-1) for k
/// = 1..5, c6 = a6/1000, c7 = a7), placed at `offset` in a row of 14 unknowns.
fn scaled_rows(t_k: f64, offset: usize) -> [Vec<f64>; 3] {
    let x = t_k / T_SCALE_K;
    let mut cp = vec![0.0; 14];
    let mut h = vec![0.0; 14];
    let mut s = vec![0.0; 14];
    let cp_part = [1.0, x, x * x, x.powi(3), x.powi(4), 0.0, 0.0];
    let h_part = [
        1.0,
        x / 2.0,
        x * x / 3.0,
        x.powi(3) / 4.0,
        x.powi(4) / 5.0,
        1.0 / x,
        0.0,
    ];
    let s_part = [
        t_k.ln(),
        x,
        x * x / 2.0,
        x.powi(3) / 3.0,
        x.powi(4) / 4.0,
        0.0,
        1.0,
    ];
    cp[offset..offset + 7].copy_from_slice(&cp_part);
    h[offset..offset + 7].copy_from_slice(&h_part);
    s[offset..offset + 7].copy_from_slice(&s_part);
    [cp, h, s]
}

/// Fits the pair of polynomials to `samples` (Cp, H and S rows in the dimensionless forms
/// Cp/R, H/(RT), S/R, each with its sample's weight) and to `cp_points` (T K, Cp J/(mol K),
/// weight: Cp rows only). H(298.15 K) = `hf298_kj` and S(298.15 K) = `s298_j` hold exactly, as
/// do Cp, H and S at the common temperature (to rounding).
pub fn fit_nasa7(
    samples: &[Sample],
    cp_points: &[(f64, f64, f64)],
    ranges: NasaRanges,
    hf298_kj: f64,
    s298_j: f64,
) -> Result<Nasa7, NasaError> {
    ranges.check()?;
    let mut equations = Vec::new();
    let (mut n_low, mut n_high) = (0, 0);
    for s in samples {
        let targets = [
            s.cp_j / GAS_CONSTANT,
            s.h_kj * 1000.0 / (GAS_CONSTANT * s.t_k),
            s.s_j / GAS_CONSTANT,
        ];
        let mut push = |offset: usize| {
            for (row, target) in scaled_rows(s.t_k, offset).into_iter().zip(targets) {
                equations.push(Equation {
                    row,
                    target,
                    weight: s.weight,
                });
            }
        };
        if s.t_k <= ranges.t_mid_k + 1e-9 && s.t_k >= ranges.t_low_k - 1e-9 {
            push(0);
            n_low += 1;
        }
        if s.t_k >= ranges.t_mid_k - 1e-9 && s.t_k <= ranges.t_high_k + 1e-9 {
            push(7);
            n_high += 1;
        }
    }
    for &(t, cp, weight) in cp_points {
        let in_low = t >= ranges.t_low_k - 1e-9 && t <= ranges.t_mid_k + 1e-9;
        let in_high = t >= ranges.t_mid_k - 1e-9 && t <= ranges.t_high_k + 1e-9;
        for (inside, offset) in [(in_low, 0), (in_high, 7)] {
            if inside {
                let [row, _, _] = scaled_rows(t, offset);
                equations.push(Equation {
                    row,
                    target: cp / GAS_CONSTANT,
                    weight,
                });
            }
        }
    }
    if n_low < 7 {
        return Err(NasaError::TooFewSamples("low"));
    }
    if n_high < 7 {
        return Err(NasaError::TooFewSamples("high"));
    }
    let anchor = scaled_rows(T_REF_K, 0);
    let low = scaled_rows(ranges.t_mid_k, 0);
    let high = scaled_rows(ranges.t_mid_k, 7);
    let difference = |k: usize| -> Vec<f64> {
        low[k]
            .iter()
            .zip(high[k].iter())
            .map(|(l, h)| l - h)
            .collect()
    };
    let constraints = vec![
        (
            anchor[1].clone(),
            hf298_kj * 1000.0 / (GAS_CONSTANT * T_REF_K),
        ),
        (anchor[2].clone(), s298_j / GAS_CONSTANT),
        (difference(0), 0.0),
        (difference(1), 0.0),
        (difference(2), 0.0),
    ];
    let c = constrained_least_squares(14, &equations, &constraints).ok_or(NasaError::Singular)?;
    let unscale = |c: &[f64]| -> [f64; 7] {
        let mut a = [0.0; 7];
        for k in 0..5 {
            a[k] = c[k] / T_SCALE_K.powi(k as i32);
        }
        a[5] = c[5] * T_SCALE_K;
        a[6] = c[6];
        a
    };
    let mut fit = Nasa7 {
        ranges,
        low: unscale(&c[0..7]),
        high: unscale(&c[7..14]),
    };
    impose_exact_constraints(&mut fit, hf298_kj, s298_j);
    if fit
        .low
        .iter()
        .chain(fit.high.iter())
        .any(|v| !v.is_finite())
    {
        return Err(NasaError::Singular);
    }
    Ok(fit)
}

/// Re-imposes the anchors and the joins on the final (kelvin) coefficients, so that they hold
/// to rounding in the numbers that are written out, not only in the scaled solve.
fn impose_exact_constraints(fit: &mut Nasa7, hf298_kj: f64, s298_j: f64) {
    let t = T_REF_K;
    fit.low[5] = hf298_kj * 1000.0 / GAS_CONSTANT - h_over_r_poly(&fit.low, t);
    fit.low[6] = s298_j / GAS_CONSTANT - s_over_r_poly(&fit.low, t);
    let mid = fit.ranges.t_mid_k;
    fit.high[0] += cp_over_r(&fit.low, mid) - cp_over_r(&fit.high, mid);
    fit.high[5] = h_over_r_poly(&fit.low, mid) + fit.low[5] - h_over_r_poly(&fit.high, mid);
    fit.high[6] = s_over_r_poly(&fit.low, mid) + fit.low[6] - s_over_r_poly(&fit.high, mid);
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A species with constant Cp is fitted exactly, anchored, and joined.
    #[test]
    fn constant_heat_capacity() {
        let (hf, s298, cp) = (-50.0, 250.0, 40.0);
        let samples: Vec<Sample> = (0..=56)
            .map(|i| {
                let t = 200.0 + 50.0 * i as f64;
                Sample {
                    t_k: t,
                    cp_j: cp,
                    h_kj: hf + cp * (t - T_REF_K) / 1000.0,
                    s_j: s298 + cp * (t / T_REF_K).ln(),
                    weight: 1.0,
                }
            })
            .collect();
        let fit = fit_nasa7(&samples, &[], NasaRanges::default(), hf, s298).unwrap();
        assert!((fit.h_kj(T_REF_K) - hf).abs() < 1e-10);
        assert!((fit.s_j(T_REF_K) - s298).abs() < 1e-10);
        for t in [200.0, 700.0, 1000.0, 2000.0, 3000.0] {
            assert!((fit.cp_j(t) - cp).abs() < 1e-6, "{t}");
        }
        assert!(fit.join_mismatch() < 1e-12);
    }

    #[test]
    fn ranges_are_checked() {
        let bad = NasaRanges {
            t_low_k: 500.0,
            t_mid_k: 1000.0,
            t_high_k: 3000.0,
        };
        assert!(bad.check().is_err());
        assert!(NasaRanges::default().check().is_ok());
    }
}
