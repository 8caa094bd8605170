//! Chemical elements: symbols, standard atomic weights and the default valences SMILES uses.

use std::fmt;

/// A chemical element, stored as its atomic number (1..=118).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, serde::Serialize)]
pub struct Element(u8);

/// Symbol and standard atomic weight (g/mol) for Z = 1..=118.
///
/// Source: IUPAC standard atomic weights (conventional / abridged values), recalled from memory;
/// for elements without a standard weight the mass number of the longest-lived isotope is used
/// (common practice).
const ELEMENTS: [(&str, f64); 118] = [
    ("H", 1.008),
    ("He", 4.002602),
    ("Li", 6.94),
    ("Be", 9.0121831),
    ("B", 10.81),
    ("C", 12.011),
    ("N", 14.007),
    ("O", 15.999),
    ("F", 18.998403163),
    ("Ne", 20.1797),
    ("Na", 22.98976928),
    ("Mg", 24.305),
    ("Al", 26.9815385),
    ("Si", 28.085),
    ("P", 30.973761998),
    ("S", 32.06),
    ("Cl", 35.45),
    ("Ar", 39.948),
    ("K", 39.0983),
    ("Ca", 40.078),
    ("Sc", 44.955908),
    ("Ti", 47.867),
    ("V", 50.9415),
    ("Cr", 51.9961),
    ("Mn", 54.938044),
    ("Fe", 55.845),
    ("Co", 58.933194),
    ("Ni", 58.6934),
    ("Cu", 63.546),
    ("Zn", 65.38),
    ("Ga", 69.723),
    ("Ge", 72.630),
    ("As", 74.921595),
    ("Se", 78.971),
    ("Br", 79.904),
    ("Kr", 83.798),
    ("Rb", 85.4678),
    ("Sr", 87.62),
    ("Y", 88.90584),
    ("Zr", 91.224),
    ("Nb", 92.90637),
    ("Mo", 95.95),
    ("Tc", 98.0),
    ("Ru", 101.07),
    ("Rh", 102.90550),
    ("Pd", 106.42),
    ("Ag", 107.8682),
    ("Cd", 112.414),
    ("In", 114.818),
    ("Sn", 118.710),
    ("Sb", 121.760),
    ("Te", 127.60),
    ("I", 126.90447),
    ("Xe", 131.293),
    ("Cs", 132.90545196),
    ("Ba", 137.327),
    ("La", 138.90547),
    ("Ce", 140.116),
    ("Pr", 140.90766),
    ("Nd", 144.242),
    ("Pm", 145.0),
    ("Sm", 150.36),
    ("Eu", 151.964),
    ("Gd", 157.25),
    ("Tb", 158.92535),
    ("Dy", 162.500),
    ("Ho", 164.93033),
    ("Er", 167.259),
    ("Tm", 168.93422),
    ("Yb", 173.045),
    ("Lu", 174.9668),
    ("Hf", 178.49),
    ("Ta", 180.94788),
    ("W", 183.84),
    ("Re", 186.207),
    ("Os", 190.23),
    ("Ir", 192.217),
    ("Pt", 195.084),
    ("Au", 196.966569),
    ("Hg", 200.592),
    ("Tl", 204.38),
    ("Pb", 207.2),
    ("Bi", 208.98040),
    ("Po", 209.0),
    ("At", 210.0),
    ("Rn", 222.0),
    ("Fr", 223.0),
    ("Ra", 226.0),
    ("Ac", 227.0),
    ("Th", 232.0377),
    ("Pa", 231.03588),
    ("U", 238.02891),
    ("Np", 237.0),
    ("Pu", 244.0),
    ("Am", 243.0),
    ("Cm", 247.0),
    ("Bk", 247.0),
    ("Cf", 251.0),
    ("Es", 252.0),
    ("Fm", 257.0),
    ("Md", 258.0),
    ("No", 259.0),
    ("Lr", 266.0),
    ("Rf", 267.0),
    ("Db", 268.0),
    ("Sg", 269.0),
    ("Bh", 270.0),
    ("Hs", 269.0),
    ("Mt", 278.0),
    ("Ds", 281.0),
    ("Rg", 282.0),
    ("Cn", 285.0),
    ("Nh", 286.0),
    ("Fl", 289.0),
    ("Mc", 290.0),
    ("Lv", 293.0),
    ("Ts", 294.0),
    ("Og", 294.0),
];

impl Element {
    pub const H: Element = Element(1);
    pub const B: Element = Element(5);
    pub const C: Element = Element(6);
    pub const N: Element = Element(7);
    pub const O: Element = Element(8);
    pub const F: Element = Element(9);
    pub const SI: Element = Element(14);
    pub const P: Element = Element(15);
    pub const S: Element = Element(16);
    pub const CL: Element = Element(17);
    pub const SE: Element = Element(34);
    pub const BR: Element = Element(35);
    pub const I: Element = Element(53);

    /// The element with atomic number `z`, if 1..=118.
    pub fn from_atomic_number(z: u8) -> Option<Element> {
        (1..=118).contains(&z).then_some(Element(z))
    }

    /// The element whose symbol is exactly `symbol` (case-sensitive, e.g. "Cl").
    pub fn from_symbol(symbol: &str) -> Option<Element> {
        ELEMENTS
            .iter()
            .position(|(s, _)| *s == symbol)
            .map(|i| Element(i as u8 + 1))
    }

    /// Atomic number.
    pub fn atomic_number(self) -> u8 {
        self.0
    }

    /// Element symbol with its usual capitalisation.
    pub fn symbol(self) -> &'static str {
        ELEMENTS[self.0 as usize - 1].0
    }

    /// Standard atomic weight in g/mol.
    pub fn atomic_weight(self) -> f64 {
        ELEMENTS[self.0 as usize - 1].1
    }

    /// Valences that SMILES assumes for an organic-subset atom written without brackets
    /// (OpenSMILES specification, section on the organic subset); empty for other elements.
    pub fn default_valences(self) -> &'static [u8] {
        match self.0 {
            5 => &[3],
            6 => &[4],
            7 | 15 => &[3, 5],
            8 => &[2],
            16 => &[2, 4, 6],
            9 | 17 | 35 | 53 => &[1],
            _ => &[],
        }
    }

    /// Whether SMILES may write this element without brackets.
    pub fn in_organic_subset(self) -> bool {
        !self.default_valences().is_empty()
    }
}

impl fmt::Display for Element {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.symbol())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn symbols_round_trip() {
        for z in 1..=118u8 {
            let e = Element::from_atomic_number(z).unwrap();
            assert_eq!(Element::from_symbol(e.symbol()), Some(e));
        }
        assert_eq!(Element::from_symbol("Cl"), Some(Element::CL));
        assert_eq!(Element::from_symbol("cl"), None);
    }
}
