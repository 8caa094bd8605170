//! Severity of a runaway from its adiabatic temperature rise, on published bands, and the
//! 500 J/g screening line.

use crate::thermo::Quantity;

/// The three-level severity bands by adiabatic temperature rise: (name, lower bound K).
/// F. Stoessel, Thermal Safety of Chemical Processes, Wiley-VCH 2008: below 50 K low,
/// 50 to 200 K medium, above 200 K high (recalled from memory).
pub const SEVERITY_BANDS: [(&str, f64); 3] = [("low", 0.0), ("medium", 50.0), ("high", 200.0)];

/// Citation of the bands.
pub const SEVERITY_SOURCE: &str = "adiabatic temperature rise below 50 K low, 50-200 K medium, \
above 200 K high (F. Stoessel, Thermal Safety of Chemical Processes, Wiley-VCH 2008; recalled \
from memory)";

/// The screening line for the specific energy, J/g.
pub const SCREENING_LINE_J_PER_G: f64 = 500.0;

/// Citation of the screening line.
pub const SCREENING_LINE_SOURCE: &str = "500 J/g: below it, an exothermic decomposition energy \
needs no further self-reactivity testing (UN Recommendations on the Transport of Dangerous Goods, \
Manual of Tests and Criteria, Appendix 6, screening procedures; recalled from memory); applied \
here to the heat of the step per gram of reacting mass";

/// A severity judgement with its range over the uncertainty.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Severity {
    /// Class of the central value.
    pub class: &'static str,
    /// Class at the low end of the uncertainty.
    pub class_low: &'static str,
    /// Class at the high end.
    pub class_high: &'static str,
}

impl Severity {
    /// True when the class changes within the uncertainty.
    pub fn changes_within_uncertainty(&self) -> bool {
        self.class_low != self.class_high
    }

    /// `medium` or `medium (low to high within the uncertainty)`.
    pub fn describe(&self) -> String {
        if self.changes_within_uncertainty() {
            format!(
                "{} ({} to {} within the uncertainty)",
                self.class, self.class_low, self.class_high
            )
        } else {
            self.class.to_string()
        }
    }
}

/// The band of a rise, K (a negative rise, an endothermic step, is `low`).
pub fn band(rise_k: f64) -> &'static str {
    SEVERITY_BANDS
        .iter()
        .rev()
        .find(|(_, lower)| rise_k >= *lower)
        .map_or(SEVERITY_BANDS[0].0, |(name, _)| name)
}

/// The class of a rise with its uncertainty.
pub fn severity(rise_k: Quantity) -> Severity {
    Severity {
        class: band(rise_k.value),
        class_low: band(rise_k.value - rise_k.uncertainty),
        class_high: band(rise_k.value + rise_k.uncertainty),
    }
}

/// Where a specific heat stands against the screening line.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "snake_case")]
pub enum ScreeningLine {
    /// Above 500 J/g beyond the uncertainty.
    Above,
    /// Below beyond the uncertainty.
    Below,
    /// The line lies within the uncertainty.
    WithinUncertainty,
}

/// Compares a heat released per gram (J/g, positive for heat given out) with the line.
pub fn screening_line(heat_j_per_g: Quantity) -> ScreeningLine {
    if heat_j_per_g.value - heat_j_per_g.uncertainty > SCREENING_LINE_J_PER_G {
        ScreeningLine::Above
    } else if heat_j_per_g.value + heat_j_per_g.uncertainty < SCREENING_LINE_J_PER_G {
        ScreeningLine::Below
    } else {
        ScreeningLine::WithinUncertainty
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn bands_and_their_edges() {
        assert_eq!(band(10.0), "low");
        assert_eq!(band(50.0), "medium");
        assert_eq!(band(199.9), "medium");
        assert_eq!(band(250.0), "high");
        assert_eq!(band(-30.0), "low");
        let s = severity(Quantity::new(190.0, 20.0));
        assert!(s.changes_within_uncertainty());
        assert_eq!(
            s.describe(),
            "medium (medium to high within the uncertainty)"
        );
        assert_eq!(
            screening_line(Quantity::new(480.0, 30.0)),
            ScreeningLine::WithinUncertainty
        );
        assert_eq!(
            screening_line(Quantity::new(900.0, 30.0)),
            ScreeningLine::Above
        );
    }
}
