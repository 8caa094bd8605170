//! From tabulated group values to NASA-7 polynomials: a Wilhoit curve through the tabulated
//! Cp(T) (with the limits from the molecule's modes) is ringheat's heat capacity at every
//! temperature; H and S are its integrals anchored at Hf298 and S298; the NASA-7 pair is fitted
//! to that curve, and its deviation from the tabulated values is measured and judged.

use super::estimate::{ThermoEstimate, CP_TEMPERATURES};
use super::modes::ModeCounts;
use super::nasa::{fit_nasa7, Nasa7, NasaError, NasaRanges, Sample};
use super::wilhoit::{Wilhoit, WilhoitError};
use crate::units::T_REF_K;

/// Samples per range of the NASA fit (our choice: dense enough that the fit sees the curve,
/// not the sample points).
const SAMPLES_PER_RANGE: usize = 80;
/// Weight of each tabulated Cp in the NASA fit, against 1 for each of the Cp, H and S rows of
/// every curve sample. Our choice, from the trade-off measured over the 731 species of
/// tests/reference/thermo_reference.tsv the tables can price (2026-12-02): weight 0 gives a
/// median largest Cp deviation from the group values of 0.18 % (48 species above 0.5 %), 30
/// gives 0.12 % (18 above 0.5 %) with H and S still within 0.2 % and 0.7 % of the curve over
/// 200-3000 K; 100 and more pull H and S at the range ends away from the curve (0.4 %, 5 %).
const TABULATED_CP_WEIGHT: f64 = 30.0;
/// Default largest Cp deviation from the tabulated values a fit may have, percent (our choice:
/// below the usual uncertainty of a group-additivity Cp, 1-2 J/(mol K) per group).
pub const DEFAULT_MAX_CP_DEVIATION_PCT: f64 = 1.0;

/// What the fit starts from: Hf298, S298 and Cp at tabulated temperatures.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct TabulatedThermo {
    /// Hf298, kJ/mol.
    pub hf298_kj: f64,
    /// S298, J/(mol K).
    pub s298_j: f64,
    /// (T K, Cp J/(mol K)), rising in T.
    pub cp_points: Vec<(f64, f64)>,
}

impl TabulatedThermo {
    /// The values of a group-additivity estimate; an error names what the tables lack.
    pub fn from_estimate(estimate: &ThermoEstimate) -> Result<TabulatedThermo, PolynomialError> {
        let cp = estimate.cp_j.ok_or(PolynomialError::NoHeatCapacity)?;
        let s298 = estimate.s298_j.ok_or(PolynomialError::NoEntropy)?;
        let hf298 = estimate
            .hf298_kj
            .filter(|q| q.value.is_finite())
            .ok_or(PolynomialError::NoEnthalpy)?;
        Ok(TabulatedThermo {
            hf298_kj: hf298.value,
            s298_j: s298.value,
            cp_points: CP_TEMPERATURES
                .iter()
                .zip(cp.iter())
                .map(|(&t, q)| (t, q.value))
                .collect(),
        })
    }
}

/// What to do with a fit past the threshold.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize)]
pub enum PoorFit {
    /// Refuse it: the species becomes an error row.
    #[default]
    Refuse,
    /// Keep it, with a flag.
    Flag,
}

/// Options of the polynomial fit.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct PolynomialOptions {
    /// Temperature ranges of the NASA-7 pair.
    pub ranges: NasaRanges,
    /// Largest Cp deviation from the tabulated values, percent.
    pub max_cp_deviation_pct: f64,
    /// Refuse or flag a fit past the threshold.
    pub poor_fit: PoorFit,
}

impl Default for PolynomialOptions {
    fn default() -> PolynomialOptions {
        PolynomialOptions {
            ranges: NasaRanges::default(),
            max_cp_deviation_pct: DEFAULT_MAX_CP_DEVIATION_PCT,
            poor_fit: PoorFit::Refuse,
        }
    }
}

/// Why no polynomial was made.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum PolynomialError {
    /// The tables give no Cp(T).
    #[error("no heat capacity estimated (a term lacks Cp): no polynomial")]
    NoHeatCapacity,
    /// The tables give no S298.
    #[error("no entropy estimated (a term lacks S): no polynomial")]
    NoEntropy,
    /// The tables give no Hf298.
    #[error("no heat of formation estimated: no polynomial")]
    NoEnthalpy,
    /// The Wilhoit fit failed.
    #[error("Wilhoit extrapolation: {0}")]
    Wilhoit(#[from] WilhoitError),
    /// The NASA fit failed.
    #[error("NASA-7 fit: {0}")]
    Nasa(#[from] NasaError),
    /// The fit deviates from the tabulated Cp by more than allowed.
    #[error(
        "NASA-7 fit refused: its Cp deviates {deviation_pct:.2} % from the tabulated group value \
         at {at_k} K (limit {limit_pct} %)"
    )]
    PoorFit {
        /// Largest deviation, percent.
        deviation_pct: f64,
        /// Where, K.
        at_k: f64,
        /// The threshold, percent.
        limit_pct: f64,
    },
}

/// Largest relative deviations (percent) of the polynomials from ringheat's curve over the
/// whole fitted range.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct CurveDeviation {
    /// Cp, percent.
    pub cp_pct: f64,
    /// H, percent of |H| or of Cp*T, whichever is larger.
    pub h_pct: f64,
    /// S, percent.
    pub s_pct: f64,
}

/// A warning about the extrapolation or the fit.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum FitFlag {
    /// A tabulated Cp is at or above the high-temperature limit.
    AboveHighLimit {
        /// Temperature, K.
        t_k: f64,
        /// Tabulated Cp, J/(mol K).
        cp_j: f64,
        /// Cp(infinity), J/(mol K).
        limit_j: f64,
        /// Atoms behind the limit.
        atoms: u32,
        /// Rotors behind the limit.
        rotors: u32,
    },
    /// A tabulated Cp is at or below the 0 K limit.
    BelowLowLimit {
        /// Temperature, K.
        t_k: f64,
        /// Tabulated Cp, J/(mol K).
        cp_j: f64,
        /// Cp(0), J/(mol K).
        limit_j: f64,
    },
    /// The Wilhoit curve uses fewer than its four terms, since with all of them it turns down.
    FewerWilhoitTerms {
        /// Terms used.
        terms: usize,
        /// The range checked, K.
        range_k: (f64, f64),
    },
    /// The fit passes the deviation threshold and was kept on request.
    PoorFit {
        /// Largest deviation, percent.
        deviation_pct: f64,
        /// Where, K.
        at_k: f64,
        /// Threshold, percent.
        limit_pct: f64,
    },
}

impl std::fmt::Display for FitFlag {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            FitFlag::AboveHighLimit {
                t_k,
                cp_j,
                limit_j,
                atoms,
                rotors,
            } => write!(
                f,
                "tabulated Cp at {t_k} K ({cp_j:.1} J/(mol K)) is not below the high-temperature \
                 limit {limit_j:.1} J/(mol K) of {atoms} atoms and {rotors} rotors: the group \
                 values or the limit are doubtful, and so is the extrapolation"
            ),
            FitFlag::BelowLowLimit { t_k, cp_j, limit_j } => write!(
                f,
                "tabulated Cp at {t_k} K ({cp_j:.1} J/(mol K)) is not above the 0 K limit \
                 {limit_j:.1} J/(mol K): the extrapolation is doubtful"
            ),
            FitFlag::FewerWilhoitTerms { terms, range_k } => write!(
                f,
                "the Wilhoit curve uses {terms} of its 4 terms: with more it turns down between \
                 {} and {} K",
                range_k.0, range_k.1
            ),
            FitFlag::PoorFit {
                deviation_pct,
                at_k,
                limit_pct,
            } => write!(
                f,
                "poor fit kept on request: the NASA-7 Cp deviates {deviation_pct:.2} % from the \
                 tabulated value at {at_k} K (limit {limit_pct} %)"
            ),
        }
    }
}

/// Ringheat's own Cp, H, S at one temperature (the Wilhoit curve and its integrals).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct CurveState {
    /// Temperature, K.
    pub t_k: f64,
    /// Cp, J/(mol K).
    pub cp_j: f64,
    /// H on the formation scale, kJ/mol.
    pub h_kj: f64,
    /// S, J/(mol K).
    pub s_j: f64,
}

/// A finished fit with its quality figures.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct PolynomialFit {
    /// Atom count, linearity and rotors behind the limits.
    pub modes: ModeCounts,
    /// The Wilhoit curve through the tabulated Cp.
    pub wilhoit: Wilhoit,
    /// The NASA-7 pair.
    pub nasa: Nasa7,
    /// The values fitted.
    pub tabulated: TabulatedThermo,
    /// Largest deviation of the Wilhoit curve from the tabulated Cp, percent.
    pub wilhoit_cp_deviation_pct: f64,
    /// Largest deviation of the NASA-7 Cp from the tabulated Cp, percent: the fit quality.
    pub cp_deviation_pct: f64,
    /// Temperature of that largest deviation, K.
    pub cp_deviation_at_k: f64,
    /// Deviations of the NASA-7 pair from the Wilhoit curve over the fitted range.
    pub curve_deviation: CurveDeviation,
    /// The same over the tabulated temperatures' span only (300-1500 K).
    pub curve_deviation_tabulated: CurveDeviation,
    /// Largest relative mismatch of Cp, H, S at the common temperature.
    pub join_mismatch: f64,
    /// Warnings about the extrapolation or the fit.
    pub flags: Vec<FitFlag>,
}

impl PolynomialFit {
    /// Ringheat's Cp, H and S at `t_k`: the Wilhoit curve, integrated from 298.15 K.
    pub fn curve_at(&self, t_k: f64) -> CurveState {
        curve_state(&self.wilhoit, &self.tabulated, t_k)
    }
}

fn curve_state(w: &Wilhoit, tab: &TabulatedThermo, t_k: f64) -> CurveState {
    let (dh, ds) = w.integrals(T_REF_K, t_k);
    CurveState {
        t_k,
        cp_j: w.cp_j(t_k),
        h_kj: tab.hf298_kj + dh / 1000.0,
        s_j: tab.s298_j + ds,
    }
}

/// The sample temperatures: evenly spaced over each range, plus 298.15 K.
fn sample_temperatures(r: &NasaRanges) -> Vec<f64> {
    let mut temps = Vec::with_capacity(2 * SAMPLES_PER_RANGE + 3);
    for (lo, hi) in [(r.t_low_k, r.t_mid_k), (r.t_mid_k, r.t_high_k)] {
        let step = (hi - lo) / SAMPLES_PER_RANGE as f64;
        temps.extend((0..=SAMPLES_PER_RANGE).map(|i| lo + step * i as f64));
    }
    temps.push(T_REF_K);
    temps.sort_by(f64::total_cmp);
    temps.dedup_by(|a, b| (*a - *b).abs() < 1e-9);
    temps
}

/// The curve's states at rising temperatures `temps`, integrating piecewise outwards from
/// 298.15 K (which must be among them).
fn curve_states(w: &Wilhoit, tab: &TabulatedThermo, temps: &[f64]) -> Vec<CurveState> {
    let mut out: Vec<CurveState> = temps
        .iter()
        .map(|&t| CurveState {
            t_k: t,
            cp_j: w.cp_j(t),
            h_kj: tab.hf298_kj,
            s_j: tab.s298_j,
        })
        .collect();
    let Some(anchor) = temps.iter().position(|t| (t - T_REF_K).abs() < 1e-9) else {
        return temps.iter().map(|&t| curve_state(w, tab, t)).collect();
    };
    for i in anchor + 1..out.len() {
        let (dh, ds) = w.integrals(out[i - 1].t_k, out[i].t_k);
        out[i].h_kj = out[i - 1].h_kj + dh / 1000.0;
        out[i].s_j = out[i - 1].s_j + ds;
    }
    for i in (0..anchor).rev() {
        let (dh, ds) = w.integrals(out[i + 1].t_k, out[i].t_k);
        out[i].h_kj = out[i + 1].h_kj + dh / 1000.0;
        out[i].s_j = out[i + 1].s_j + ds;
    }
    out
}

/// Fits the Wilhoit curve and the NASA-7 pair, and judges the fit.
pub fn fit_polynomials(
    tab: &TabulatedThermo,
    modes: &ModeCounts,
    options: &PolynomialOptions,
) -> Result<PolynomialFit, PolynomialError> {
    options.ranges.check()?;
    let (cp0, cp_inf) = (modes.cp0_j(), modes.cp_inf_j());
    let mut flags = Vec::new();
    for &(t_k, cp_j) in &tab.cp_points {
        if cp_j >= cp_inf {
            flags.push(FitFlag::AboveHighLimit {
                t_k,
                cp_j,
                limit_j: cp_inf,
                atoms: modes.atoms,
                rotors: modes.rotors,
            });
        } else if cp_j <= cp0 {
            flags.push(FitFlag::BelowLowLimit {
                t_k,
                cp_j,
                limit_j: cp0,
            });
        }
    }
    let r = &options.ranges;
    let wilhoit = Wilhoit::fit(&tab.cp_points, cp0, cp_inf, (r.t_low_k, r.t_high_k))?;
    if wilhoit.terms < 4 {
        flags.push(FitFlag::FewerWilhoitTerms {
            terms: wilhoit.terms,
            range_k: (r.t_low_k, r.t_high_k),
        });
    }
    let temps = sample_temperatures(&options.ranges);
    let states = curve_states(&wilhoit, tab, &temps);
    let samples: Vec<Sample> = states
        .iter()
        .map(|s| Sample {
            t_k: s.t_k,
            cp_j: s.cp_j,
            h_kj: s.h_kj,
            s_j: s.s_j,
            weight: 1.0,
        })
        .collect();
    let points: Vec<(f64, f64, f64)> = tab
        .cp_points
        .iter()
        .map(|&(t, c)| (t, c, TABULATED_CP_WEIGHT))
        .collect();
    let nasa = fit_nasa7(&samples, &points, options.ranges, tab.hf298_kj, tab.s298_j)?;

    let wilhoit_cp_deviation_pct = tab
        .cp_points
        .iter()
        .map(|&(t, cp)| relative_pct(wilhoit.cp_j(t), cp))
        .fold(0.0, f64::max);
    let (cp_deviation_pct, cp_deviation_at_k) = tab
        .cp_points
        .iter()
        .filter(|(t, _)| (options.ranges.t_low_k..=options.ranges.t_high_k).contains(t))
        .map(|&(t, cp)| (relative_pct(nasa.cp_j(t), cp), t))
        .fold((0.0, f64::NAN), |m, d| if d.0 > m.0 { d } else { m });
    let tab_span = (
        tab.cp_points.first().map_or(f64::NAN, |p| p.0),
        tab.cp_points.last().map_or(f64::NAN, |p| p.0),
    );
    let curve_deviation = curve_deviation_of(&nasa, &states, None);
    let curve_deviation_tabulated = curve_deviation_of(&nasa, &states, Some(tab_span));
    if cp_deviation_pct > options.max_cp_deviation_pct {
        match options.poor_fit {
            PoorFit::Refuse => {
                return Err(PolynomialError::PoorFit {
                    deviation_pct: cp_deviation_pct,
                    at_k: cp_deviation_at_k,
                    limit_pct: options.max_cp_deviation_pct,
                })
            }
            PoorFit::Flag => flags.push(FitFlag::PoorFit {
                deviation_pct: cp_deviation_pct,
                at_k: cp_deviation_at_k,
                limit_pct: options.max_cp_deviation_pct,
            }),
        }
    }
    Ok(PolynomialFit {
        modes: *modes,
        wilhoit,
        join_mismatch: nasa.join_mismatch(),
        nasa,
        tabulated: tab.clone(),
        wilhoit_cp_deviation_pct,
        cp_deviation_pct,
        cp_deviation_at_k,
        curve_deviation,
        curve_deviation_tabulated,
        flags,
    })
}

/// |a - b| / |b| in percent.
fn relative_pct(a: f64, b: f64) -> f64 {
    100.0 * (a - b).abs() / b.abs()
}

/// Largest deviations of `nasa` from the curve states (within `span` K, if given).
fn curve_deviation_of(
    nasa: &Nasa7,
    states: &[CurveState],
    span: Option<(f64, f64)>,
) -> CurveDeviation {
    let mut d = CurveDeviation {
        cp_pct: 0.0,
        h_pct: 0.0,
        s_pct: 0.0,
    };
    let inside = |t: f64| span.is_none_or(|(lo, hi)| (lo - 1e-9..=hi + 1e-9).contains(&t));
    for s in states.iter().filter(|s| inside(s.t_k)) {
        let h_scale = s.h_kj.abs().max(s.cp_j * s.t_k / 1000.0);
        d.cp_pct = d.cp_pct.max(relative_pct(nasa.cp_j(s.t_k), s.cp_j));
        d.h_pct = d
            .h_pct
            .max(100.0 * (nasa.h_kj(s.t_k) - s.h_kj).abs() / h_scale);
        d.s_pct = d.s_pct.max(relative_pct(nasa.s_j(s.t_k), s.s_j));
    }
    d
}
