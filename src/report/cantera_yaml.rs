//! Cantera YAML species entries (NASA7 thermo) for exported species, written as they come;
//! a species that could not be priced becomes a comment line, never a broken entry.
//!
//! The layout follows Cantera's YAML input format for species (`name`, `composition`,
//! `thermo: {model: NASA7, temperature-ranges, data}`, `note`), as documented with Cantera 3
//! (recalled from memory; checked by loading the output with Cantera, tools/cantera_round_trip.sh).

use std::collections::HashSet;
use std::io::{self, Write};

use super::polynomials::ExportedSpecies;
use crate::input::Place;
use crate::thermo::terms::TermKind;

/// Characters kept in a species name; others become `_`. Cantera reads names with these in
/// species lists and reaction equations (checked with Cantera 3.2); white space, `+`, `=`, `<`,
/// `>` and `:` would split or confuse an equation.
fn name_char_ok(c: char) -> bool {
    c.is_ascii_alphanumeric() || "_-(),.*'[]".contains(c)
}

/// Unique, Cantera-safe species names for one output file.
#[derive(Debug, Default)]
pub struct NameBook {
    used: HashSet<String>,
}

impl NameBook {
    /// The name of the next species: the user's (made safe) or the formula, with `-2`, `-3`,
    /// ... for a name already used; and a remark when the name differs from the user's.
    pub fn assign(&mut self, requested: Option<&str>, formula: &str) -> (String, Option<String>) {
        let requested = requested.map(str::trim).filter(|r| !r.is_empty());
        let base_raw = requested.unwrap_or(formula);
        let mut base: String = base_raw
            .chars()
            .map(|c| if name_char_ok(c) { c } else { '_' })
            .collect();
        if !base.starts_with(|c: char| c.is_ascii_alphanumeric()) {
            base.insert(0, 'S');
        }
        let mut name = base.clone();
        let mut k = 1;
        while self.used.contains(&name) {
            k += 1;
            name = format!("{base}-{k}");
        }
        self.used.insert(name.clone());
        let remark = match requested {
            Some(r) if r != name => Some(format!(
                "name `{name}` stands for the given `{r}` (made unique and safe for Cantera)"
            )),
            _ => None,
        };
        (name, remark)
    }
}

/// A float as YAML and Cantera read it back exactly: 17 significant digits, signed exponent.
pub fn yaml_float(v: f64) -> String {
    let s = format!("{v:.16e}");
    match s.split_once('e') {
        Some((mantissa, exp)) => {
            let e: i32 = exp.parse().unwrap_or(0);
            let sign = if e < 0 { '-' } else { '+' };
            format!("{mantissa}e{sign}{:02}", e.abs())
        }
        None => s,
    }
}

/// One line with no control characters (YAML block scalars and comments stay intact).
fn one_line(text: &str) -> String {
    text.chars()
        .map(|c| if c.is_control() { ' ' } else { c })
        .collect::<String>()
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ")
}

/// The note of a species: what it is, what built it, its uncertainty, its fit and its flags.
pub fn note_lines(s: &ExportedSpecies, name_remark: Option<&str>) -> Vec<String> {
    let e = &s.estimate;
    let f = &s.fit;
    let r = &f.nasa.ranges;
    let mut lines = vec![
        format!(
            "Group-additivity estimate by ringheat {} (Benson groups with ring and other \
             corrections). Screening estimate only: not a substitute for calorimetry or a \
             qualified review.",
            env!("CARGO_PKG_VERSION")
        ),
        format!(
            "SMILES {} (canonical {}), {}.",
            s.input, s.canonical_smiles, s.formula
        ),
    ];
    let pm = |q: Option<crate::thermo::Quantity>, unit: &str| match q {
        Some(q) => format!("{:.2} ± {:.2} {unit}", q.value, q.uncertainty),
        None => "n/a".to_string(),
    };
    let cp = match e.cp_j {
        Some(cp) => {
            let lo = cp
                .iter()
                .map(|q| q.uncertainty)
                .fold(f64::INFINITY, f64::min);
            let hi = cp.iter().map(|q| q.uncertainty).fold(0.0, f64::max);
            let unc = if hi - lo < 0.005 {
                format!("± {hi:.2}")
            } else {
                format!("± {lo:.2} to ± {hi:.2}")
            };
            format!(
                "Cp at 300, 400, 500, 600, 800, 1000, 1500 K: {} J/(mol K), {unc}",
                cp.iter()
                    .map(|q| format!("{:.2}", q.value))
                    .collect::<Vec<_>>()
                    .join(", ")
            )
        }
        None => "Cp n/a".to_string(),
    };
    lines.push(format!(
        "Hf298 {}; S298 {}; {cp}.",
        pm(e.hf298_kj, "kJ/mol"),
        pm(e.s298_j, "J/(mol K)")
    ));
    lines.push(format!(
        "Symmetry number {} ({} external x {} internal{}), optical isomers {}.",
        e.symmetry.total,
        e.symmetry.external,
        e.symmetry.internal,
        if e.symmetry_overridden {
            ", given by the user"
        } else {
            ""
        },
        e.symmetry.optical_isomers
    ));
    for kind in [TermKind::Group, TermKind::Correction, TermKind::Ring] {
        let terms: Vec<String> = e
            .terms
            .iter()
            .filter(|t| t.kind == kind)
            .map(|t| {
                let notes: Vec<String> = t.notes.iter().map(|n| n.to_string()).collect();
                if notes.is_empty() {
                    format!("{} x {}", t.label, t.count)
                } else {
                    format!("{} x {} ({})", t.label, t.count, notes.join("; "))
                }
            })
            .collect();
        if !terms.is_empty() {
            let what = match kind {
                TermKind::Group => "Groups",
                TermKind::Correction => "Corrections",
                TermKind::Ring => "Ring corrections",
            };
            lines.push(format!("{what}: {}.", terms.join(", ")));
        }
    }
    lines.push(format!(
        "Cp outside the tabulated 300-1500 K: Wilhoit's form (R. C. Wilhoit 1975), Cp(0) {:.3} \
         and Cp(inf) {:.3} J/(mol K) from {} atoms, {}, {} internal rotors; B {:.1} K, {} of 4 \
         terms.",
        f.wilhoit.cp0_j,
        f.wilhoit.cp_inf_j,
        f.modes.atoms,
        if f.modes.linear {
            "linear"
        } else {
            "non-linear"
        },
        f.modes.rotors,
        f.wilhoit.b_k,
        f.wilhoit.terms
    ));
    lines.push(format!(
        "NASA-7 fit over {}-{} and {}-{} K, H and S anchored to Hf298 and S298 exactly: largest \
         Cp deviation from the tabulated group values {:.3} % at {} K (Wilhoit curve {:.3} %); \
         Cp, H, S within {:.3}, {:.4}, {:.4} % of the Wilhoit curve over 300-1500 K and {:.3}, \
         {:.4}, {:.4} % over the whole range.",
        r.t_low_k,
        r.t_mid_k,
        r.t_mid_k,
        r.t_high_k,
        f.cp_deviation_pct,
        f.cp_deviation_at_k,
        f.wilhoit_cp_deviation_pct,
        f.curve_deviation_tabulated.cp_pct,
        f.curve_deviation_tabulated.h_pct,
        f.curve_deviation_tabulated.s_pct,
        f.curve_deviation.cp_pct,
        f.curve_deviation.h_pct,
        f.curve_deviation.s_pct
    ));
    let flags: Vec<String> = e
        .flags
        .iter()
        .map(|x| x.to_string())
        .chain(f.flags.iter().map(|x| x.to_string()))
        .collect();
    lines.push(if flags.is_empty() {
        "Flags: none.".to_string()
    } else {
        format!("Flags: {}.", flags.join("; "))
    });
    if let Some(remark) = name_remark {
        lines.push(format!("Name: {remark}."));
    }
    lines.into_iter().map(|l| one_line(&l)).collect()
}

/// Writes a Cantera YAML document of species entries, one record at a time.
pub struct CanteraYamlWriter<W: Write> {
    out: W,
    names: NameBook,
    /// An ideal-gas phase of this name listing every species exported, if wanted.
    phase: Option<String>,
    started: bool,
    species_written: Vec<String>,
    elements: Vec<String>,
}

impl<W: Write> CanteraYamlWriter<W> {
    /// A writer to `out`; with `phase`, an ideal-gas phase of that name follows the species.
    pub fn new(out: W, phase: Option<String>) -> Self {
        CanteraYamlWriter {
            out,
            names: NameBook::default(),
            phase,
            started: false,
            species_written: Vec::new(),
            elements: Vec::new(),
        }
    }

    fn start(&mut self) -> io::Result<()> {
        if !self.started {
            self.started = true;
            writeln!(
                self.out,
                "# Cantera species written by ringheat {} (`ringheat polynomials`): NASA-7 fits \
                 of group-additivity estimates.\n# {}\n# Load with Cantera: \
                 ct.Species.list_from_file(\"FILE\"), or in a phase: species: \
                 [{{FILE/species: all}}].",
                env!("CARGO_PKG_VERSION"),
                super::SAFETY_NOTE
            )?;
        }
        Ok(())
    }

    /// Writes one record: a species entry, or a comment line giving its error.
    pub fn write_record(
        &mut self,
        place: &Place,
        input: &str,
        outcome: Result<&ExportedSpecies, &str>,
    ) -> io::Result<()> {
        self.start()?;
        let s = match outcome {
            Ok(s) => s,
            Err(message) => {
                return writeln!(
                    self.out,
                    "# not exported: {place}: {}: {}",
                    one_line(input),
                    one_line(message)
                );
            }
        };
        if self.species_written.is_empty() {
            writeln!(self.out, "species:")?;
        }
        let (name, remark) = self.names.assign(s.requested_name.as_deref(), &s.formula);
        let composition = s
            .composition
            .iter()
            .map(|(e, n)| format!("{e}: {n}"))
            .collect::<Vec<_>>()
            .join(", ");
        for (e, _) in &s.composition {
            if !self.elements.contains(e) {
                self.elements.push(e.clone());
            }
        }
        let nasa = &s.fit.nasa;
        let r = &nasa.ranges;
        let row = |a: &[f64; 7]| {
            a.iter()
                .map(|v| yaml_float(*v))
                .collect::<Vec<_>>()
                .join(", ")
        };
        writeln!(self.out, "- name: \"{name}\"")?;
        writeln!(self.out, "  composition: {{{composition}}}")?;
        writeln!(self.out, "  thermo:")?;
        writeln!(self.out, "    model: NASA7")?;
        writeln!(
            self.out,
            "    temperature-ranges: [{:?}, {:?}, {:?}]",
            r.t_low_k, r.t_mid_k, r.t_high_k
        )?;
        writeln!(self.out, "    data:")?;
        writeln!(self.out, "    - [{}]", row(&nasa.low))?;
        writeln!(self.out, "    - [{}]", row(&nasa.high))?;
        writeln!(self.out, "  note: |-")?;
        for line in note_lines(s, remark.as_deref()) {
            writeln!(self.out, "    {line}")?;
        }
        self.species_written.push(name);
        Ok(())
    }

    /// Ends the document: an empty species list if nothing was exported, and the phase.
    pub fn finish(&mut self) -> io::Result<()> {
        self.start()?;
        if self.species_written.is_empty() {
            writeln!(self.out, "species: []")?;
        }
        if let Some(phase) = &self.phase {
            if !self.species_written.is_empty() {
                let quoted = |v: &[String]| {
                    v.iter()
                        .map(|s| format!("\"{s}\""))
                        .collect::<Vec<_>>()
                        .join(", ")
                };
                writeln!(self.out, "phases:")?;
                writeln!(
                    self.out,
                    "- name: \"{}\"",
                    one_line(phase).replace('"', "'")
                )?;
                writeln!(self.out, "  thermo: ideal-gas")?;
                writeln!(self.out, "  elements: [{}]", quoted(&self.elements))?;
                writeln!(self.out, "  species: [{}]", quoted(&self.species_written))?;
                writeln!(self.out, "  state: {{T: 300.0, P: 1 atm}}")?;
            }
        }
        self.out.flush()
    }

    /// The output, once finished.
    pub fn into_inner(self) -> W {
        self.out
    }

    /// Names written so far, in order.
    pub fn names(&self) -> &[String] {
        &self.species_written
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn floats_round_trip() {
        for v in [
            1.0,
            -1.234_567_890_123_456_7e-13,
            6.02e23,
            0.0,
            -9_468.344_59,
        ] {
            let s = yaml_float(v);
            assert_eq!(s.parse::<f64>().unwrap(), v, "{s}");
            assert!(s.contains("e+") || s.contains("e-"), "{s}");
        }
    }

    #[test]
    fn names_are_unique_and_safe() {
        let mut book = NameBook::default();
        assert_eq!(book.assign(None, "C3H6").0, "C3H6");
        assert_eq!(book.assign(None, "C3H6").0, "C3H6-2");
        let (n, remark) = book.assign(Some("ethylene oxide"), "C2H4O");
        assert_eq!(n, "ethylene_oxide");
        assert!(remark.is_some());
        assert_eq!(
            book.assign(Some("1,3-dioxolane"), "C3H6O2").0,
            "1,3-dioxolane"
        );
        assert_eq!(book.assign(Some("+x"), "C").0, "S_x");
    }
}
