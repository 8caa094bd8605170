//! Quantities of a job file: a number, an optional uncertainty and a unit in one string
//! (`"850 kg"`, `"1.9 ± 0.1 J/(g K)"`, `"130 degC"`), read into one unit per kind.
//!
//! Accepted units: mass `g`, `kg`, `t`; amount `mol`, `kmol`; specific heat capacity
//! `J/(g K)`, `kJ/(kg K)`, `J/(kg K)`; temperature `K`, `degC` (also `°C`, `C`); concentration
//! `mol/L` (also `mol/l`, `M`); molar energy `kJ/mol`, `kcal/mol`. The uncertainty may be written
//! `±` or `+-` between the number and the unit.

use crate::thermo::Quantity;
use crate::units::JOULES_PER_CALORIE;

/// What a quantity measures, with the unit it is read into.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Kind {
    /// Mass, read into g.
    Mass,
    /// Amount of substance or mass, read into mol or g.
    AmountOrMass,
    /// Specific heat capacity, read into J/(g K).
    SpecificHeat,
    /// Temperature, read into K.
    Temperature,
    /// Concentration, read into mol/L.
    Concentration,
    /// Molar energy, read into kJ/mol.
    MolarEnergy,
}

impl Kind {
    /// The units accepted, for error messages.
    pub fn accepted(self) -> &'static str {
        match self {
            Kind::Mass => "g, kg, t",
            Kind::AmountOrMass => "mol, kmol, g, kg, t",
            Kind::SpecificHeat => "J/(g K), kJ/(kg K), J/(kg K)",
            Kind::Temperature => "K, degC",
            Kind::Concentration => "mol/L",
            Kind::MolarEnergy => "kJ/mol, kcal/mol",
        }
    }
}

/// An amount: moles or a mass.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Amount {
    /// mol.
    Moles(Quantity),
    /// g.
    Grams(Quantity),
}

fn unit_factor(kind: Kind, unit: &str) -> Option<(f64, f64, bool)> {
    // (factor, offset, is_mass) : value_in = value * factor + offset.
    let u: String = unit.chars().filter(|c| !c.is_whitespace()).collect();
    let u = u.as_str();
    let mass = |f: f64| Some((f, 0.0, true));
    match kind {
        Kind::Mass | Kind::AmountOrMass => match u {
            "g" => mass(1.0),
            "kg" => mass(1000.0),
            "t" => mass(1.0e6),
            "mol" if kind == Kind::AmountOrMass => Some((1.0, 0.0, false)),
            "kmol" if kind == Kind::AmountOrMass => Some((1000.0, 0.0, false)),
            _ => None,
        },
        Kind::SpecificHeat => match u {
            "J/(gK)" | "J/gK" | "J/(g*K)" | "J/g/K" => Some((1.0, 0.0, false)),
            "kJ/(kgK)" | "kJ/kgK" | "kJ/(kg*K)" | "kJ/kg/K" => Some((1.0, 0.0, false)),
            "J/(kgK)" | "J/kgK" | "J/(kg*K)" | "J/kg/K" => Some((0.001, 0.0, false)),
            _ => None,
        },
        Kind::Temperature => match u {
            "K" => Some((1.0, 0.0, false)),
            "degC" | "°C" | "C" => Some((1.0, 273.15, false)),
            _ => None,
        },
        Kind::Concentration => match u {
            "mol/L" | "mol/l" | "M" | "mol/dm3" => Some((1.0, 0.0, false)),
            _ => None,
        },
        Kind::MolarEnergy => match u {
            "kJ/mol" => Some((1.0, 0.0, false)),
            "kcal/mol" => Some((JOULES_PER_CALORIE, 0.0, false)),
            _ => None,
        },
    }
}

/// Splits `"1.9 ± 0.1 J/(g K)"` into value, uncertainty and unit text.
fn split(text: &str) -> Result<(f64, f64, String), String> {
    let t = text.trim();
    let number_end = |s: &str| {
        s.char_indices()
            .find(|(i, c)| {
                !(c.is_ascii_digit()
                    || *c == '.'
                    || ((*c == '-' || *c == '+') && (*i == 0 || s[..*i].ends_with(['e', 'E'])))
                    || ((*c == 'e' || *c == 'E') && *i > 0))
            })
            .map_or(s.len(), |(i, _)| i)
    };
    let end = number_end(t);
    let value: f64 = t[..end]
        .parse()
        .map_err(|_| format!("`{text}` does not start with a number"))?;
    let mut rest = t[end..].trim_start();
    let mut unc: f64 = 0.0;
    let sep = if rest.starts_with('±') {
        Some('±'.len_utf8())
    } else if rest.starts_with("+-") {
        Some(2)
    } else {
        None
    };
    if let Some(n) = sep {
        rest = rest[n..].trim_start();
        let e = number_end(rest);
        unc = rest[..e]
            .parse()
            .map_err(|_| format!("`{text}`: the uncertainty is not a number"))?;
        rest = rest[e..].trim_start();
    }
    if !value.is_finite() || !unc.is_finite() || unc < 0.0 {
        return Err(format!(
            "`{text}`: value and uncertainty must be finite, the uncertainty not negative"
        ));
    }
    Ok((value, unc, rest.to_string()))
}

/// Reads a quantity of `kind`; the error says which units are accepted.
pub fn parse(text: &str, kind: Kind) -> Result<Quantity, String> {
    match parse_amount_or(text, kind)? {
        Amount::Moles(q) | Amount::Grams(q) => Ok(q),
    }
}

/// Reads an amount (moles or mass).
pub fn parse_amount(text: &str) -> Result<Amount, String> {
    parse_amount_or(text, Kind::AmountOrMass)
}

fn parse_amount_or(text: &str, kind: Kind) -> Result<Amount, String> {
    let (value, unc, unit) = split(text)?;
    if unit.is_empty() {
        return Err(format!(
            "`{text}` has no unit (accepted: {})",
            kind.accepted()
        ));
    }
    let (factor, offset, is_mass) = unit_factor(kind, &unit)
        .ok_or_else(|| format!("unit `{unit}` is not one of {}", kind.accepted()))?;
    let q = Quantity::new(value * factor + offset, unc * factor);
    Ok(if is_mass {
        Amount::Grams(q)
    } else {
        Amount::Moles(q)
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn units_are_read() {
        assert_eq!(parse("850 kg", Kind::Mass).unwrap().value, 850_000.0);
        let cp = parse("1.9 ± 0.1 J/(g K)", Kind::SpecificHeat).unwrap();
        assert_eq!((cp.value, cp.uncertainty), (1.9, 0.1));
        assert_eq!(
            parse("2.1 kJ/(kg K)", Kind::SpecificHeat).unwrap().value,
            2.1
        );
        assert!((parse("130 degC", Kind::Temperature).unwrap().value - 403.15).abs() < 1e-9);
        assert_eq!(parse("-5.4 kJ/mol", Kind::MolarEnergy).unwrap().value, -5.4);
        assert_eq!(
            parse_amount("12 kmol").unwrap(),
            Amount::Moles(Quantity::new(12000.0, 0.0))
        );
    }

    #[test]
    fn wrong_units_are_named() {
        let e = parse("4200 kJ", Kind::Mass).unwrap_err();
        assert!(e.contains("`kJ`") && e.contains("g, kg, t"), "{e}");
        assert!(parse("4200", Kind::Mass).unwrap_err().contains("no unit"));
        assert!(parse("warm", Kind::Temperature).is_err());
    }
}
