//! Wilhoit's form of Cp(T): a smooth curve through tabulated heat capacities that tends to the
//! exact limits Cp(0) and Cp(infinity), used to extend group values below 300 K and above 1500 K.
//!
//! Cp(T) = Cp0 + (Cpinf - Cp0) y^2 [1 + (y - 1)(a0 + a1 y + a2 y^2 + a3 y^3)], y = T / (T + B).
//!
//! R. C. Wilhoit, "Ideal gas thermodynamic functions", TRC Current Data News 3 (1975) 2-4; used
//! to extrapolate heat capacities by A. Burcat and B. Ruscic, Third Millennium Ideal Gas and
//! Condensed Phase Thermochemical Database for Combustion, Argonne report ANL-05/20 and Technion
//! report TAE 960 (2005). Both recalled from memory; the fitting (a linear least-squares solve
//! for a0..a3 at each B, B found by a one-dimensional search) is common practice.

use super::linear_solve::{constrained_least_squares, Equation};

/// Lowest and highest B tried, K (our choice: with smaller B the free a-terms bent the curve
/// below 300 K, down to negative Cp at 100 K for some group sums of the bundled tables).
const B_SEARCH_K: (f64, f64) = (300.0, 3000.0);
/// Grid points of the coarse search in ln B before the golden-section refinement.
const B_GRID_POINTS: usize = 90;

/// A Wilhoit curve: its limits (J/(mol K)), its scale temperature B (K) and coefficients a0..a3.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct Wilhoit {
    /// Cp at 0 K, J/(mol K).
    pub cp0_j: f64,
    /// Cp at infinite temperature, J/(mol K).
    pub cp_inf_j: f64,
    /// Scale temperature B, K.
    pub b_k: f64,
    /// a0..a3 (dimensionless).
    pub a: [f64; 4],
    /// How many of a0..a3 were fitted (the others are 0).
    pub terms: usize,
}

/// Why a Wilhoit curve could not be fitted.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum WilhoitError {
    /// Fewer than five points for five parameters.
    #[error("{0} heat-capacity points; the Wilhoit fit needs at least 5")]
    TooFewPoints(usize),
    /// A point is not finite or not above 0 K.
    #[error("heat-capacity point ({0} K, {1} J/(mol K)) is not usable")]
    BadPoint(f64, f64),
    /// Cp(infinity) is below Cp(0).
    #[error("Cp(infinity) {0:.2} is below Cp(0) {1:.2} J/(mol K)")]
    BadLimits(f64, f64),
    /// No B gave a solvable system.
    #[error("no scale temperature B gives a solvable Wilhoit fit")]
    Singular,
}

impl Wilhoit {
    fn y(&self, t_k: f64) -> f64 {
        t_k / (t_k + self.b_k)
    }

    /// Cp at `t_k`, J/(mol K).
    pub fn cp_j(&self, t_k: f64) -> f64 {
        let y = self.y(t_k);
        let [a0, a1, a2, a3] = self.a;
        let poly = a0 + y * (a1 + y * (a2 + y * a3));
        self.cp0_j + (self.cp_inf_j - self.cp0_j) * y * y * (1.0 + (y - 1.0) * poly)
    }

    /// Integrals from `t0_k` to `t1_k` of Cp dT (J/mol) and Cp/T dT (J/(mol K)), by composite
    /// six-point Gauss-Legendre quadrature on pieces of at most 50 K (the curve is smooth on
    /// the scale of B, so the error is at rounding level).
    pub fn integrals(&self, t0_k: f64, t1_k: f64) -> (f64, f64) {
        // Nodes and weights on [-1, 1] (Abramowitz & Stegun, Handbook of Mathematical
        // Functions, 1964, Table 25.4).
        const NODES: [f64; 3] = [
            0.238_619_186_083_196_9,
            0.661_209_386_466_264_5,
            0.932_469_514_203_152,
        ];
        const WEIGHTS: [f64; 3] = [
            0.467_913_934_572_691,
            0.360_761_573_048_138_6,
            0.171_324_492_379_170_4,
        ];
        let pieces = ((t1_k - t0_k).abs() / 50.0).ceil().max(1.0) as usize;
        let h = (t1_k - t0_k) / pieces as f64;
        let (mut dh, mut ds) = (0.0, 0.0);
        for p in 0..pieces {
            let mid = t0_k + (p as f64 + 0.5) * h;
            for (x, w) in NODES.iter().zip(WEIGHTS.iter()) {
                for t in [mid - 0.5 * h * x, mid + 0.5 * h * x] {
                    let cp = self.cp_j(t);
                    dh += 0.5 * h * w * cp;
                    ds += 0.5 * h * w * cp / t;
                }
            }
        }
        (dh, ds)
    }

    /// Whether Cp rises (never falls) from `t0_k` to `t1_k` and stays between the limits,
    /// checked on a log-spaced grid of 400 points.
    pub fn rises_between(&self, t0_k: f64, t1_k: f64) -> bool {
        let n = 400;
        let ratio = (t1_k / t0_k).ln() / (n - 1) as f64;
        let mut previous = f64::NEG_INFINITY;
        let tol = 1e-9 * self.cp_inf_j;
        (0..n).all(|i| {
            let cp = self.cp_j(t0_k * (ratio * i as f64).exp());
            let ok = cp >= previous - tol && cp >= self.cp0_j - tol && cp <= self.cp_inf_j + tol;
            previous = cp;
            ok
        })
    }

    /// Fits B and a0..a3 to `(T K, Cp J/(mol K))` points with the limits held fixed, minimising
    /// the sum of squared relative deviations, among the curves that rise over
    /// `check_range_k`. The four a-terms are tried first; when no B gives a rising curve with
    /// them, the last a-terms are dropped (set to 0) one by one, down to the bare form
    /// Cp0 + (Cpinf - Cp0) y^2, which always rises. Heat capacities of group sums are not
    /// always smooth enough for the full form not to turn over outside the data (our finding
    /// on the bundled tables); the number of terms used is kept in [`Wilhoit::terms`].
    pub fn fit(
        points: &[(f64, f64)],
        cp0_j: f64,
        cp_inf_j: f64,
        check_range_k: (f64, f64),
    ) -> Result<Wilhoit, WilhoitError> {
        if points.len() < 5 {
            return Err(WilhoitError::TooFewPoints(points.len()));
        }
        if let Some(&(t, c)) = points
            .iter()
            .find(|(t, c)| !(t.is_finite() && c.is_finite() && *t > 0.0 && *c > 0.0))
        {
            return Err(WilhoitError::BadPoint(t, c));
        }
        if cp_inf_j.is_nan() || cp0_j.is_nan() || cp_inf_j < cp0_j {
            return Err(WilhoitError::BadLimits(cp_inf_j, cp0_j));
        }
        if cp_inf_j - cp0_j < 1e-9 {
            // An atom: Cp is constant, nothing to fit.
            return Ok(Wilhoit {
                cp0_j,
                cp_inf_j,
                b_k: 1000.0,
                a: [0.0; 4],
                terms: 0,
            });
        }
        let (lo_t, hi_t) = check_range_k;
        for terms in (0..=4).rev() {
            let objective = |ln_b: f64| -> Option<(Wilhoit, f64)> {
                fit_at_b(points, cp0_j, cp_inf_j, ln_b.exp(), terms)
                    .filter(|(w, _)| w.rises_between(lo_t, hi_t))
            };
            if let Some(w) = search_b(&objective) {
                return Ok(w);
            }
        }
        Err(WilhoitError::Singular)
    }
}

/// The best curve over B: a grid in ln B, then a golden-section search around the best point.
fn search_b(objective: &dyn Fn(f64) -> Option<(Wilhoit, f64)>) -> Option<Wilhoit> {
    let (lo, hi) = (B_SEARCH_K.0.ln(), B_SEARCH_K.1.ln());
    let step = (hi - lo) / (B_GRID_POINTS - 1) as f64;
    let best = (0..B_GRID_POINTS)
        .filter_map(|i| {
            let ln_b = lo + step * i as f64;
            objective(ln_b).map(|(w, ssr)| (ln_b, w, ssr))
        })
        .min_by(|a, b| a.2.total_cmp(&b.2))?;
    let ssr = |ln_b: f64| objective(ln_b).map_or(f64::INFINITY, |(_, s)| s);
    let (mut a, mut b) = ((best.0 - step).max(lo), (best.0 + step).min(hi));
    let g = 0.5 * (5f64.sqrt() - 1.0);
    let (mut c, mut d) = (b - g * (b - a), a + g * (b - a));
    let (mut fc, mut fd) = (ssr(c), ssr(d));
    for _ in 0..50 {
        if fc < fd {
            b = d;
            d = c;
            fd = fc;
            c = b - g * (b - a);
            fc = ssr(c);
        } else {
            a = c;
            c = d;
            fc = fd;
            d = a + g * (b - a);
            fd = ssr(d);
        }
    }
    match objective(0.5 * (a + b)) {
        Some((w, s)) if s <= best.2 => Some(w),
        _ => Some(best.1),
    }
}

/// The least-squares a-terms (the first `terms` of a0..a3, the rest 0) at a given B, with the
/// sum of squared relative residuals.
fn fit_at_b(
    points: &[(f64, f64)],
    cp0: f64,
    cp_inf: f64,
    b_k: f64,
    terms: usize,
) -> Option<(Wilhoit, f64)> {
    let span = cp_inf - cp0;
    let equations: Vec<Equation> = points
        .iter()
        .map(|&(t, cp)| {
            let y = t / (t + b_k);
            let base = span * y * y * (y - 1.0);
            Equation {
                row: (0..terms).map(|k| base * y.powi(k as i32)).collect(),
                target: cp - cp0 - span * y * y,
                weight: 1.0 / (cp * cp),
            }
        })
        .collect();
    let mut a = [0.0; 4];
    if terms > 0 {
        let solved = constrained_least_squares(terms, &equations, &[])?;
        a[..terms].copy_from_slice(&solved);
    }
    let w = Wilhoit {
        cp0_j: cp0,
        cp_inf_j: cp_inf,
        b_k,
        a,
        terms,
    };
    let ssr = points
        .iter()
        .map(|&(t, cp)| ((w.cp_j(t) - cp) / cp).powi(2))
        .sum();
    Some((w, ssr))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A curve of the Wilhoit form is recovered from seven of its own points.
    #[test]
    fn recovers_its_own_form() {
        let truth = Wilhoit {
            cp0_j: 33.26,
            cp_inf_j: 108.1,
            b_k: 900.0,
            a: [0.3, -1.2, 2.0, -0.8],
            terms: 4,
        };
        let temps = [300.0, 400.0, 500.0, 600.0, 800.0, 1000.0, 1500.0];
        let points: Vec<(f64, f64)> = temps.iter().map(|&t| (t, truth.cp_j(t))).collect();
        let fit = Wilhoit::fit(&points, truth.cp0_j, truth.cp_inf_j, (200.0, 3000.0)).unwrap();
        assert!(truth.rises_between(200.0, 3000.0));
        for t in [200.0, 300.0, 1000.0, 1500.0, 3000.0] {
            let rel = (fit.cp_j(t) - truth.cp_j(t)).abs() / truth.cp_j(t);
            assert!(rel < 1e-3, "{t} K: {rel}");
        }
        assert!((fit.cp_j(1e9) - truth.cp_inf_j).abs() < 1e-3);
        assert!((fit.cp_j(1e-6) - truth.cp0_j).abs() < 1e-6);
    }

    #[test]
    fn integrals_of_a_constant() {
        let w = Wilhoit {
            cp0_j: 20.0,
            cp_inf_j: 20.0,
            b_k: 500.0,
            a: [0.0; 4],
            terms: 0,
        };
        let (h, s) = w.integrals(298.15, 1000.0);
        assert!((h - 20.0 * (1000.0 - 298.15)).abs() < 1e-9);
        assert!((s - 20.0 * (1000.0f64 / 298.15).ln()).abs() < 1e-11);
        let (h_down, _) = w.integrals(298.15, 200.0);
        assert!((h_down + 20.0 * 98.15).abs() < 1e-9);
    }
}
