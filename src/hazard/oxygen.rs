//! Oxygen balance: the oxygen a compound lacks (negative) or holds beyond (positive) what full
//! combustion to CO2 and H2O needs, in percent of its mass:
//! `OB% = -1600 (2 C + H/2 - O) / M` for a compound with C carbons, H hydrogens and O oxygens
//! and molar mass M in g/mol (nitrogen goes to N2 and takes no oxygen). Definition as in
//! J. Köhler, R. Meyer, A. Homburg, Explosives, 6th ed., Wiley-VCH 2007 (recalled from memory).
//! Halogens are counted as taking the hydrogen they would form HX with (`H - X` in place of H),
//! common practice for CHNO-halogen compounds (recalled from memory); sulfur and other elements
//! are not covered.

use crate::molecule::formula::Formula;
use crate::molecule::Element;

/// Where the definition comes from, for reports.
pub const OXYGEN_BALANCE_SOURCE: &str = "OB% = -1600 (2 C + H/2 - O) / M (J. Köhler, R. Meyer, \
A. Homburg, Explosives, 6th ed., Wiley-VCH 2007; recalled from memory)";

/// The oxygen balance in percent, or why it is not given.
pub fn oxygen_balance_percent(formula: &Formula) -> Result<f64, String> {
    let known = [
        Element::C,
        Element::H,
        Element::N,
        Element::O,
        Element::F,
        Element::CL,
        Element::BR,
        Element::I,
    ];
    let total: u32 = formula.heavy_atoms() + formula.hydrogens();
    let covered: u32 = known.iter().map(|e| formula.count(*e)).sum();
    if covered != total {
        return Err("elements other than C, H, N, O and halogens: not defined here".to_string());
    }
    let c = f64::from(formula.count(Element::C));
    let halogens: u32 = [Element::F, Element::CL, Element::BR, Element::I]
        .iter()
        .map(|e| formula.count(*e))
        .sum();
    let h = f64::from(formula.count(Element::H)) - f64::from(halogens);
    let o = f64::from(formula.count(Element::O));
    Ok(-1600.0 * (2.0 * c + h / 2.0 - o) / formula.molar_mass())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::parse_smiles;

    fn ob(smiles: &str) -> f64 {
        oxygen_balance_percent(&Formula::of(&parse_smiles(smiles).expect("parses")))
            .expect("defined")
    }

    #[test]
    fn published_oxygen_balances() {
        // TNT -74.0 %, nitroglycerine +3.5 % (recalled from memory, common textbook values).
        assert!((ob("Cc1c(cc(cc1[N+](=O)[O-])[N+](=O)[O-])[N+](=O)[O-]") + 74.0).abs() < 0.2);
        assert!((ob("C(C(CO[N+](=O)[O-])O[N+](=O)[O-])O[N+](=O)[O-]") - 3.5).abs() < 0.1);
        // Ethylene oxide: -1600 (4 + 2 - 1) / 44.05 = -181.6 %.
        assert!((ob("C1CO1") + 181.6).abs() < 0.1);
    }
}
