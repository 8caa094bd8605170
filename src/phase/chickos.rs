//! Vaporisation enthalpy at 298.15 K by the group contributions of Chickos et al. (1988):
//! `dHvap = a (nC - nQ) + q nQ + sum(b) + c`, with the numbers read from
//! `group-tables/phase/vaporisation-groups.toml`.
//!
//! The functional groups are found on the hydrogen-folded graph, each heteroatom counted in one
//! group: carbonyl carbons first (acid, ester, carbonate, amide, aldehyde, ketone), then the
//! remaining oxygens (alcohol, ether), nitrogens (nitrile, nitro, amines, aromatic nitrogen),
//! halogens and sulfur (thiol, sulfide). An atom no group covers (a peroxide oxygen, a sulfone
//! sulfur, phosphorus, ...) leaves the molecule without an estimate.

use std::collections::BTreeMap;

use petgraph::graph::NodeIndex;
use serde::Deserialize;

use crate::molecule::{BondOrder, Element, Molecule};
use crate::thermo::Quantity;

/// The bundled contribution file (path relative to the crate root, contents).
pub const BUNDLED_GROUP_FILE: (&str, &str) = (
    "group-tables/phase/vaporisation-groups.toml",
    include_str!("../../group-tables/phase/vaporisation-groups.toml"),
);

/// The method's constants, functional-group values and the Trouton entropies.
#[derive(Debug, Clone)]
pub struct ChickosMethod {
    /// Name for reports.
    pub name: String,
    /// Citation.
    pub source: String,
    /// kJ/mol per carbon that is not quaternary sp3.
    pub per_carbon_kj: f64,
    /// kJ/mol per quaternary sp3 carbon.
    pub per_quaternary_carbon_kj: f64,
    /// kJ/mol once per molecule.
    pub constant_kj: f64,
    /// Fixed part of the uncertainty, kJ/mol.
    pub unc_kj: f64,
    /// Part of the uncertainty proportional to the estimate.
    pub unc_fraction: f64,
    /// b values by functional-group name, kJ/mol, with an optional note.
    pub groups: BTreeMap<String, (f64, Option<String>)>,
    /// Vaporisation entropy rule.
    pub entropy: TroutonRule,
}

/// Standard vaporisation entropy at 298.15 K by Trouton's rule.
#[derive(Debug, Clone, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct TroutonRule {
    /// Citation.
    pub source: String,
    /// J/(mol K) for liquids without O-H or N-H.
    pub unassociated_j: f64,
    /// J/(mol K) for hydrogen-bond donors.
    pub associated_j: f64,
    /// Uncertainty, J/(mol K).
    pub unc_j: f64,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFile {
    method: RawMethod,
    group: Vec<RawGroup>,
    entropy: TroutonRule,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawMethod {
    name: String,
    source: String,
    per_carbon_kj: f64,
    per_quaternary_carbon_kj: f64,
    constant_kj: f64,
    unc_kj: f64,
    unc_fraction: f64,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawGroup {
    name: String,
    b_kj: f64,
    note: Option<String>,
}

/// A molecule's count of carbons and functional groups for the method.
#[derive(Debug, Clone, Default, PartialEq, serde::Serialize)]
pub struct ChickosCounts {
    /// Carbons that are not quaternary sp3.
    pub carbons: u32,
    /// Quaternary sp3 carbons.
    pub quaternary_carbons: u32,
    /// Functional groups by name with their counts.
    pub groups: BTreeMap<String, u32>,
}

/// The method's sum for some counts, with its terms.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct ChickosSum {
    /// The sum, kJ/mol, without the per-molecule constant.
    pub without_constant_kj: f64,
    /// Notes of the groups used (assumptions).
    pub notes: Vec<String>,
}

impl ChickosMethod {
    /// The bundled contribution file.
    pub fn bundled() -> Result<ChickosMethod, String> {
        ChickosMethod::from_toml(BUNDLED_GROUP_FILE.1)
            .map_err(|e| format!("{}: {e}", BUNDLED_GROUP_FILE.0))
    }

    /// Reads a contribution file.
    pub fn from_toml(text: &str) -> Result<ChickosMethod, String> {
        let raw: RawFile = toml::from_str(text).map_err(|e| e.to_string().trim().to_string())?;
        let mut groups = BTreeMap::new();
        for g in raw.group {
            if groups.insert(g.name.clone(), (g.b_kj, g.note)).is_some() {
                return Err(format!("group `{}` given twice", g.name));
            }
        }
        Ok(ChickosMethod {
            name: raw.method.name,
            source: raw.method.source,
            per_carbon_kj: raw.method.per_carbon_kj,
            per_quaternary_carbon_kj: raw.method.per_quaternary_carbon_kj,
            constant_kj: raw.method.constant_kj,
            unc_kj: raw.method.unc_kj,
            unc_fraction: raw.method.unc_fraction,
            groups,
            entropy: raw.entropy,
        })
    }

    /// The contribution sum of `counts` (no per-molecule constant), or the first group the file
    /// lacks.
    pub fn sum(&self, counts: &ChickosCounts) -> Result<ChickosSum, String> {
        let mut total = self.per_carbon_kj * f64::from(counts.carbons)
            + self.per_quaternary_carbon_kj * f64::from(counts.quaternary_carbons);
        let mut notes = Vec::new();
        for (name, n) in &counts.groups {
            let (b, note) = self
                .groups
                .get(name)
                .ok_or_else(|| format!("no contribution for the group `{name}`"))?;
            total += b * f64::from(*n);
            if let Some(note) = note {
                notes.push(format!("{name}: {note}"));
            }
        }
        Ok(ChickosSum {
            without_constant_kj: total,
            notes,
        })
    }

    /// The vaporisation enthalpy of one molecule, kJ/mol, with the method's uncertainty.
    pub fn estimate(
        &self,
        mol: &Molecule,
    ) -> Result<(Quantity, ChickosCounts, Vec<String>), String> {
        let counts = count_groups(mol)?;
        let sum = self.sum(&counts)?;
        let value = sum.without_constant_kj + self.constant_kj;
        Ok((
            Quantity::new(value, self.uncertainty_kj(value)),
            counts,
            sum.notes,
        ))
    }

    /// The uncertainty of an estimate of `value_kj`.
    pub fn uncertainty_kj(&self, value_kj: f64) -> f64 {
        self.unc_kj + self.unc_fraction * value_kj.abs()
    }

    /// The standard vaporisation entropy of `mol` by Trouton's rule, J/(mol K).
    pub fn vaporisation_entropy_j(&self, mol: &Molecule) -> Quantity {
        let rule = &self.entropy;
        let value = if donates_hydrogen_bonds(mol) {
            rule.associated_j
        } else {
            rule.unassociated_j
        };
        Quantity::new(value, rule.unc_j)
    }
}

/// True when an O or N atom carries a hydrogen.
pub fn donates_hydrogen_bonds(mol: &Molecule) -> bool {
    mol.atoms().any(|a| {
        let e = mol.atom(a).element;
        (e == Element::O || e == Element::N) && mol.total_hydrogens(a) > 0
    })
}

fn heavy_neighbours(mol: &Molecule, a: NodeIndex) -> Vec<(NodeIndex, BondOrder)> {
    mol.neighbours(a)
        .filter(|(n, _)| mol.atom(*n).element != Element::H)
        .map(|(n, b)| (n, b.order))
        .collect()
}

/// Counts carbons and functional groups of `mol` (any hydrogen form); an atom that no group
/// covers is an error naming it.
pub fn count_groups(mol: &Molecule) -> Result<ChickosCounts, String> {
    let mol = mol.with_hydrogens_folded();
    let n = mol.atom_count();
    let mut used = vec![false; n];
    let mut counts = ChickosCounts::default();
    let add = |counts: &mut ChickosCounts, name: &str| {
        *counts.groups.entry(name.to_string()).or_insert(0) += 1;
    };
    let el = |a: NodeIndex| mol.atom(a).element;
    // Carbons and carbonyl groups.
    for a in mol.atoms() {
        if el(a) != Element::C {
            continue;
        }
        let nb = heavy_neighbours(&mol, a);
        let quaternary = nb.len() == 4 && nb.iter().all(|(_, o)| *o == BondOrder::Single);
        if quaternary {
            counts.quaternary_carbons += 1;
        } else {
            counts.carbons += 1;
        }
        let carbonyl_o = nb
            .iter()
            .find(|(x, o)| *o == BondOrder::Double && el(*x) == Element::O && mol.degree(*x) == 1)
            .map(|(x, _)| *x);
        let Some(o_double) = carbonyl_o else { continue };
        if mol.atom(a).aromatic {
            continue;
        }
        let single_o: Vec<NodeIndex> = nb
            .iter()
            .filter(|(x, o)| *o == BondOrder::Single && el(*x) == Element::O && !used[x.index()])
            .map(|(x, _)| *x)
            .collect();
        let amide_n: Vec<NodeIndex> = nb
            .iter()
            .filter(|(x, o)| *o == BondOrder::Single && el(*x) == Element::N && !used[x.index()])
            .map(|(x, _)| *x)
            .collect();
        let taken_o = nb
            .iter()
            .any(|(x, o)| *o == BondOrder::Single && el(*x) == Element::O && used[x.index()]);
        used[o_double.index()] = true;
        let hydroxyl = |x: &NodeIndex| mol.total_hydrogens(*x) > 0;
        if single_o.len() >= 2 {
            if single_o.iter().any(hydroxyl) {
                return Err(format!(
                    "atom {}: carbonic acid half-ester has no contribution",
                    a.index() + 1
                ));
            }
            add(&mut counts, "carbonate");
            for x in &single_o {
                used[x.index()] = true;
            }
        } else if let Some(x) = single_o.first() {
            used[x.index()] = true;
            add(
                &mut counts,
                if hydroxyl(x) {
                    "carboxylic acid"
                } else {
                    "ester"
                },
            );
        } else if taken_o {
            return Err(format!(
                "atom {}: anhydride carbonyl has no contribution",
                a.index() + 1
            ));
        } else if let Some(x) = amide_n.first() {
            used[x.index()] = true;
            let name = match mol.total_hydrogens(*x) {
                0 => "tertiary amide",
                1 => "secondary amide",
                _ => "primary amide",
            };
            add(&mut counts, name);
        } else if mol.total_hydrogens(a) > 0 {
            add(&mut counts, "aldehyde");
        } else {
            add(&mut counts, "ketone");
        }
    }
    // The other heteroatoms.
    for a in mol.atoms() {
        if used[a.index()] {
            continue;
        }
        let e = el(a);
        let nb = heavy_neighbours(&mol, a);
        let h = mol.total_hydrogens(a);
        let place = || format!("atom {} ({e})", a.index() + 1);
        let all_single = nb.iter().all(|(_, o)| *o == BondOrder::Single);
        let name = match e {
            Element::C | Element::H => continue,
            Element::O if nb.iter().any(|(x, _)| el(*x) == Element::O) => {
                return Err(format!("{}: peroxide oxygen has no contribution", place()))
            }
            Element::O if all_single && h == 1 && nb.len() == 1 => "alcohol",
            Element::O if all_single && h == 0 && nb.len() == 2 => "ether",
            Element::O if mol.atom(a).aromatic && nb.len() == 2 => "ether",
            Element::N => match nitrogen_group(&mol, a, &mut used) {
                Some(name) => name,
                None => return Err(format!("{}: this nitrogen has no contribution", place())),
            },
            Element::F => "fluoride",
            Element::CL => "chloride",
            Element::BR => "bromide",
            Element::I => "iodide",
            Element::S if all_single && h == 1 && nb.len() == 1 => "thiol",
            Element::S if (all_single || mol.atom(a).aromatic) && h == 0 && nb.len() == 2 => {
                if nb.iter().any(|(x, _)| el(*x) == Element::S) {
                    return Err(format!("{}: disulfide has no contribution", place()));
                }
                "sulfide"
            }
            _ => return Err(format!("{}: no contribution for this atom", place())),
        };
        used[a.index()] = true;
        add(&mut counts, name);
    }
    Ok(counts)
}

/// The group of an unused nitrogen (marking the nitro oxygens used), or `None`.
fn nitrogen_group(mol: &Molecule, a: NodeIndex, used: &mut [bool]) -> Option<&'static str> {
    let nb = heavy_neighbours(mol, a);
    let oxygens: Vec<NodeIndex> = nb
        .iter()
        .filter(|(x, _)| mol.atom(*x).element == Element::O && mol.degree(*x) == 1)
        .map(|(x, _)| *x)
        .collect();
    if oxygens.len() == 2 && nb.len() == 3 {
        for o in oxygens {
            used[o.index()] = true;
        }
        return Some("nitro");
    }
    if mol.atom(a).charge != 0 {
        return None;
    }
    let h = mol.total_hydrogens(a);
    if nb.len() == 1 && nb[0].1 == BondOrder::Triple {
        return Some("nitrile");
    }
    if mol.atom(a).aromatic {
        return (h == 0 && nb.len() == 2).then_some("aromatic nitrogen");
    }
    if !nb.iter().all(|(_, o)| *o == BondOrder::Single) {
        return None;
    }
    match (nb.len(), h) {
        (1, 2) => Some("primary amine"),
        (2, 1) => Some("secondary amine"),
        (3, 0) => Some("tertiary amine"),
        _ => None,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::parse_smiles;

    fn estimate(smiles: &str) -> f64 {
        let method = ChickosMethod::bundled().expect("bundled file reads");
        let mol = parse_smiles(smiles).expect("test SMILES parses");
        method.estimate(&mol).expect("estimate").0.value
    }

    #[test]
    fn hand_sums_of_the_equation() {
        // 4.69 x 6 + 3.0 = 31.14 for n-hexane (measured 31.6, CRC Handbook; recalled).
        assert!((estimate("CCCCCC") - 31.14).abs() < 1e-9);
        // Neopentane: 4 x 4.69 + 1.3 + 3.0.
        assert!((estimate("CC(C)(C)C") - 23.06).abs() < 1e-9);
        // Ethanol: 2 x 4.69 + 29.4 + 3.0.
        assert!((estimate("CCO") - 41.78).abs() < 1e-9);
        // Methyl acetate: 3 x 4.69 + 10.5 (ester) + 3.0.
        assert!((estimate("CC(=O)OC") - 27.57).abs() < 1e-9);
    }

    #[test]
    fn groups_are_recognised() {
        let names = |s: &str| {
            count_groups(&parse_smiles(s).expect("parses"))
                .expect("covered")
                .groups
                .into_keys()
                .collect::<Vec<_>>()
        };
        assert_eq!(names("O=C1OCCCO1"), vec!["carbonate"]);
        assert_eq!(names("O=C1CCCCCO1"), vec!["ester"]);
        assert_eq!(names("C1CCOC1"), vec!["ether"]);
        assert_eq!(names("CC(=O)O"), vec!["carboxylic acid"]);
        assert_eq!(names("CC(=O)NC"), vec!["secondary amide"]);
        assert_eq!(names("c1ccncc1"), vec!["aromatic nitrogen"]);
        assert_eq!(names("C[N+](=O)[O-]"), vec!["nitro"]);
        assert!(count_groups(&parse_smiles("COOC").expect("parses")).is_err());
        assert!(count_groups(&parse_smiles("CC(=O)OC(C)=O").expect("parses")).is_err());
    }
}
