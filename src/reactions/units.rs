//! Functional units that fragmentation keeps whole: a centre atom with the terminal atoms whose
//! bonds to it cannot be cut into ordinary molecules.
//!
//! A unit is a centre atom `X` and its terminal neighbours `Y` (one heavy neighbour, `X`) of
//! two kinds:
//! - charge-separated: `Y` and `X` both charged, with opposite signs (the `[O-]` of a nitro
//!   group or an amine oxide, the `[C-]` of an isocyanide, the `[N-]` of an azide);
//! - multiply bonded: `Y` is O, S, Se or N with a double or triple bond to `X`, and `X` is a
//!   centre already (it has a charge-separated terminal) or is hypervalent, that is above the
//!   lowest valence [`allowed_valences`] gives for its element and charge (the sulfur of a
//!   sulfoxide or sulfone, the nitrogen of `N(=O)=O`, the phosphorus of `P=O`).
//!
//! So nitro (`[N+](=O)[O-]` or `N(=O)=O`), sulfonyl `S(=O)(=O)`, sulfinyl `S(=O)`, phosphoryl
//! `P(=O)` and isocyanide `[N+]#[C-]` are units. Cutting one apart would leave ions (`[NH4+]`,
//! `[OH-]`) or hypervalent hydrides (`[SH6]`, `O=[SH4]`). Carbonyl (`C=O`) and cyano (`C#N`)
//! groups are not units: their carbon has its lowest valence and no charge, so the cut pieces
//! (`C` and `O`, `C` and `N`) are ordinary molecules, and the CBH rungs keep their usual pieces
//! for them (R. O. Ramabhadran, K. Raghavachari, J. Chem. Theory Comput. 7 (2011) 2094 cut
//! carbonyls this way).
//!
//! Atoms are visited in index order; an atom taken into a unit is never a centre, so units do
//! not overlap (in a two-atom molecule such as `[C-]#[O+]` the first atom is the centre).

use petgraph::graph::NodeIndex;

use crate::molecule::smiles::allowed_valences;
use crate::molecule::{BondOrder, Element, Molecule};

/// The units of a heavy-atom molecule (hydrogens folded into counts).
#[derive(Debug, Clone, Default)]
pub(crate) struct Units {
    /// For every atom: the terminal atoms it holds as a centre, with their bond orders.
    pub members: Vec<Vec<(NodeIndex, BondOrder)>>,
    /// For every atom: true when it is a terminal member of some unit.
    pub absorbed: Vec<bool>,
}

impl Units {
    /// Finds the units of `mol`.
    pub fn find(mol: &Molecule) -> Units {
        let n = mol.atom_count();
        let mut units = Units {
            members: vec![Vec::new(); n],
            absorbed: vec![false; n],
        };
        for x in mol.atoms() {
            if units.absorbed[x.index()] {
                continue;
            }
            let centre = mol.atom(x);
            let free_terminal = |y: NodeIndex| {
                mol.degree(y) == 1
                    && !units.absorbed[y.index()]
                    && units.members[y.index()].is_empty()
            };
            let separated: Vec<(NodeIndex, BondOrder)> = mol
                .neighbours(x)
                .filter(|(y, _)| free_terminal(*y))
                .filter(|(y, _)| {
                    let q = mol.atom(*y).charge;
                    q != 0 && centre.charge != 0 && q.signum() != centre.charge.signum()
                })
                .map(|(y, b)| (y, b.order))
                .collect();
            if separated.is_empty() && !hypervalent(mol, x) {
                continue;
            }
            let multiple: Vec<(NodeIndex, BondOrder)> = mol
                .neighbours(x)
                .filter(|(y, b)| {
                    free_terminal(*y)
                        && b.order != BondOrder::Single
                        && mol.atom(*y).charge == 0
                        && matches!(
                            mol.atom(*y).element,
                            Element::O | Element::S | Element::SE | Element::N
                        )
                })
                .map(|(y, b)| (y, b.order))
                .collect();
            for &(y, _) in separated.iter().chain(&multiple) {
                units.absorbed[y.index()] = true;
            }
            units.members[x.index()] = separated.into_iter().chain(multiple).collect();
        }
        units
    }

    /// True when `a` is a terminal member of a unit (never a fragment centre on its own).
    pub fn is_absorbed(&self, a: NodeIndex) -> bool {
        self.absorbed.get(a.index()).copied().unwrap_or(false)
    }

    /// The terminal members held by centre `a` (empty for a plain atom).
    pub fn members_of(&self, a: NodeIndex) -> &[(NodeIndex, BondOrder)] {
        self.members.get(a.index()).map_or(&[], Vec::as_slice)
    }
}

/// Whether `x` is above the lowest valence its element and charge allow.
fn hypervalent(mol: &Molecule, x: NodeIndex) -> bool {
    let atom = mol.atom(x);
    let Some(lowest) = allowed_valences(atom.element, atom.charge).and_then(|v| v.first()) else {
        return false;
    };
    u32::from(atom.hydrogens) + mol.bond_valence(x) > u32::from(*lowest)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::molecule::parse_smiles;

    /// (centre element, member count) of every unit of `smiles`.
    fn units(smiles: &str) -> Vec<(String, usize)> {
        let mol = parse_smiles(smiles)
            .expect("test SMILES parses")
            .with_hydrogens_folded();
        let u = Units::find(&mol);
        mol.atoms()
            .filter(|&a| !u.members_of(a).is_empty())
            .map(|a| {
                let symbol = mol.atom(a).element.symbol().to_string();
                (symbol, u.members_of(a).len())
            })
            .collect()
    }

    #[test]
    fn units_of_common_groups() {
        let one = |e: &str, k: usize| vec![(e.to_string(), k)];
        assert_eq!(units("C[N+](=O)[O-]"), one("N", 2));
        assert_eq!(units("CN(=O)=O"), one("N", 2));
        assert_eq!(units("C1CCS(=O)(=O)C1"), one("S", 2));
        assert_eq!(units("CS(C)=O"), one("S", 1));
        assert_eq!(units("COP(=O)(OC)OC"), one("P", 1));
        assert_eq!(units("C[N+]#[C-]"), one("N", 1));
        assert_eq!(units("[C-]#[O+]"), one("C", 1));
        // Carbonyl, cyano and plain amines are not units; a nitrate of a sulfate has two.
        for s in ["CC(C)=O", "CC#N", "CN(C)C", "C[NH3+]"] {
            assert_eq!(units(s), Vec::new(), "{s}");
        }
        let mut two = units("OS(=O)(=O)O[N+](=O)[O-]");
        two.sort();
        assert_eq!(two, vec![("N".to_string(), 2), ("S".to_string(), 2)]);
    }
}
