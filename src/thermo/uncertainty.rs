//! Method uncertainty of group additivity: how far a sum of table terms typically misses the
//! measured value, per family of term, added to the tables' own uncertainties.
//!
//! The tables' uncertainties say how well each value is known; they do not say how well a sum of
//! them reproduces a molecule (nearest-neighbour additivity leaves out longer-range effects,
//! stand-ins are approximate, reference data scatter). The reported uncertainty of Hf298 and
//! S298 is therefore
//!
//! `u^2 = u_tables^2 + sum over terms of count x sigma_f^2`,
//!
//! with `sigma_f` the scatter that one occurrence of a term of family `f` adds
//! ([`TermFamily`]). The `sigma_f` of [`METHOD_SIGMA`] were fitted by non-negative least squares
//! to the squared errors of the validation species of tests/thermo_validation.rs (species no
//! table value was derived from; each squared error capped at (24 kJ/mol)^2 or (24 J/(mol K))^2
//! so that a few suspect references do not set the scale) by `tools/calibrate_uncertainty.py`
//! on 2026-12-02. A family whose fitted `sigma_f` is 0 reproduces the measured data within the
//! tables' own uncertainties. Cross-fitted coverage (fitted on one half of the species, counted
//! on the other) is in the README.

use super::terms::{Term, TermKind};
use crate::groups::key::AtomType;
use crate::groups::GroupKey;

/// The families whose terms scatter alike.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum TermFamily {
    /// Groups centred on an sp3 carbon without a halogen ligand.
    Alkyl,
    /// Groups centred on C=C, C#C or allene carbons without a halogen.
    Unsaturated,
    /// Benzene-ring carbons (`Cb`, `Cbf`) without a halogen.
    Aromatic,
    /// Carbonyl and ether/alcohol oxygen groups (`CO`, `O`) without a halogen.
    Oxygen,
    /// Nitrogen-centred and nitrogen-holding centres (`N`, `NA`, `NI`, `CI`, `CN`, `NO2`, `NO`).
    Nitrogen,
    /// Sulfur centres (`S`, `SO`, `SO2`, `CS`).
    Sulfur,
    /// Any group with a halogen ligand.
    Halogen,
    /// Non-ring corrections (gauche, cis, ortho, vicinal, ...).
    Correction,
    /// Ring corrections.
    Ring,
    /// A group, correction or ring entry standing in for one the tables lack (counted on top of
    /// the term's own family).
    StandIn,
}

impl TermFamily {
    /// Name used in the calibration files.
    pub fn label(self) -> &'static str {
        match self {
            TermFamily::Alkyl => "alkyl",
            TermFamily::Unsaturated => "unsaturated",
            TermFamily::Aromatic => "aromatic",
            TermFamily::Oxygen => "oxygen",
            TermFamily::Nitrogen => "nitrogen",
            TermFamily::Sulfur => "sulfur",
            TermFamily::Halogen => "halogen",
            TermFamily::Correction => "correction",
            TermFamily::Ring => "ring",
            TermFamily::StandIn => "stand_in",
        }
    }
}

/// Method scatter per occurrence of a term of each family: (family, Hf298 kJ/mol, S298
/// J/(mol K)). Fitted by tools/calibrate_uncertainty.py on 2026-12-02 (see the module
/// documentation); families not listed add nothing.
pub const METHOD_SIGMA: &[(TermFamily, f64, f64)] = &[
    (TermFamily::Nitrogen, 6.31, 2.59),
    (TermFamily::Oxygen, 5.61, 3.24),
    (TermFamily::Ring, 2.29, 0.0),
    (TermFamily::StandIn, 2.06, 0.0),
];

fn group_family(key: &GroupKey) -> TermFamily {
    let halogen = |t: &AtomType| matches!(t.symbol(), "F" | "Cl" | "Br" | "I");
    if key.ligands.iter().any(|(t, _)| halogen(t)) {
        return TermFamily::Halogen;
    }
    match key.centre.symbol() {
        "C" => TermFamily::Alkyl,
        "Cd" | "Ct" | "Ca" => TermFamily::Unsaturated,
        "Cb" | "Cbf" => TermFamily::Aromatic,
        "CO" | "O" => TermFamily::Oxygen,
        "S" | "SO" | "SO2" | "CS" => TermFamily::Sulfur,
        _ => TermFamily::Nitrogen,
    }
}

/// The families a term counts in: its own, plus [`TermFamily::StandIn`] for a stand-in.
pub fn families(term: &Term) -> Vec<TermFamily> {
    let own = match term.kind {
        TermKind::Correction => TermFamily::Correction,
        TermKind::Ring => TermFamily::Ring,
        TermKind::Group => GroupKey::parse(&term.label)
            .map(|k| group_family(&k))
            .unwrap_or(TermFamily::Alkyl),
    };
    let mut out = vec![own];
    if term.stand_in().is_some() || term.is_ring_stand_in() {
        out.push(TermFamily::StandIn);
    }
    out
}

/// Method variances (Hf298 in (kJ/mol)^2, S298 in (J/(mol K))^2) of a sum of terms.
pub fn method_variance(terms: &[Term]) -> (f64, f64) {
    let mut hf = 0.0;
    let mut s = 0.0;
    for t in terms {
        for f in families(t) {
            if let Some((_, sh, ss)) = METHOD_SIGMA.iter().find(|(g, _, _)| *g == f) {
                hf += f64::from(t.count) * sh * sh;
                s += f64::from(t.count) * ss * ss;
            }
        }
    }
    (hf, s)
}
