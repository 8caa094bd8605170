//! Domain of validity of group additivity: structures whose energy the flat, local group and
//! ring terms cannot price (closed or curved conjugated cages, antiaromatic rings), found from
//! the molecular graph before any table is read.
//!
//! Benson's groups and ring corrections are measured on molecules whose pi systems are flat (or
//! freely puckered) and aromatic or merely conjugated. Three kinds of structure fall outside:
//!
//! - closed conjugated cages (fullerenes C60, C70, ...): every atom of the ring system is an sp2
//!   atom with three ring bonds. The pyramidalisation strain of the closed surface (about 8
//!   kcal/mol per carbon in C60, whose measured Hf298 is near 620 kcal/mol against some 200 from
//!   flat aromatic groups; recalled from memory) has no group or ring term;
//! - curved conjugated surfaces (bowls such as corannulene, sumanene; saddles such as
//!   \[7\]circulene): an sp2 atom inside a fused patch with three ring bonds lies flat only when the
//!   interior angles of its three rings, taken as regular polygons, add up to 360 degrees. The
//!   missing (or excess) angle is the angular defect. A ring made only of such fully surrounded
//!   atoms cannot let its defects out at a free edge; when their defects add up to more than
//!   [`CURVATURE_DEFECT_LIMIT_DEG`] the surface curves (corannulene's hub pentagon, five 5-6-6
//!   atoms, 60 degrees, makes a bowl; fluoranthene, acenaphthylene or benzo\[ghi\]fluoranthene,
//!   whose pentagons keep atoms on the edge, stay planar with measured ring corrections);
//! - antiaromatic rings: a ring of at most [`ANTIAROMATIC_MAX_RING`] atoms, or a fully conjugated
//!   fused system of such rings without an aromatic ring (pentalene), whose every atom gives at
//!   least one pi electron and whose pi electrons number 4n (Hueckel's rule; cyclobutadiene,
//!   oxirene, thiirene, 1H-azirine, biphenylene's four-membered ring). Their destabilisation
//!   (tens of kcal/mol in cyclobutadiene) is no ring-strain term of a saturated parent. Rings of
//!   more atoms escape planarity (cyclooctatetraene is a non-aromatic tub with its own measured
//!   ring correction) and are left to the ring tables.
//!
//! The checks are structural only; the estimator refuses such molecules with the reason
//! (`EstimateError::OutOfDomain`) unless asked to estimate them anyway, and then flags them.

use petgraph::graph::NodeIndex;

use crate::molecule::aromaticity::pi_electrons;
use crate::molecule::{Element, PerceivedMolecule};

/// Largest ring (atoms) tested for Hueckel antiaromaticity; larger 4n rings pucker (our choice,
/// from cyclooctatetraene's tub; common practice).
pub const ANTIAROMATIC_MAX_RING: usize = 5;
/// Total angular defect (degrees) of a ring of fully surrounded sp2 atoms above which the
/// surface is curved: our choice, below corannulene's hub (five 5-6-6 atoms, 60 degrees, a bowl)
/// and \[7\]circulene's (seven 7-6-6 atoms, -60 degrees, a saddle); coronene's hub has 0.
pub const CURVATURE_DEFECT_LIMIT_DEG: f64 = 30.0;
/// Largest ring (atoms) taken as a face of a conjugated surface in the curvature test: our
/// choice (larger rings are macrocycles whose shape the ring size does not fix).
pub const FACE_MAX_RING: usize = 8;
/// Fewest atoms of a conjugated ring system counted as a closed cage (the smallest fullerene
/// is C20): our choice.
pub const CAGE_MIN_ATOMS: usize = 20;

/// Why a structure is outside the domain of group additivity.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub enum OutOfDomainKind {
    /// A closed conjugated cage (fullerene-like).
    ClosedConjugatedCage,
    /// A conjugated surface curved into a bowl or a saddle.
    CurvedConjugatedSurface,
    /// A ring or fused ring system with 4n pi electrons.
    AntiaromaticRing,
}

impl OutOfDomainKind {
    /// Short name used in flags and reports.
    pub fn label(&self) -> &'static str {
        match self {
            OutOfDomainKind::ClosedConjugatedCage => "closed conjugated cage",
            OutOfDomainKind::CurvedConjugatedSurface => "curved conjugated surface",
            OutOfDomainKind::AntiaromaticRing => "antiaromatic ring",
        }
    }
}

/// One finding of the domain check: what, where (1-based atom numbers) and why.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct OutOfDomain {
    /// The kind of structure.
    pub kind: OutOfDomainKind,
    /// 1-based atom numbers of the structure (ring system, cluster or ring).
    pub atoms: Vec<usize>,
    /// Why group additivity cannot price it, in words.
    pub reason: String,
}

impl std::fmt::Display for OutOfDomain {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}: {}", self.kind.label(), self.reason)
    }
}

/// Every out-of-domain structure of the molecule (empty: within the domain as far as the
/// structure shows).
pub fn out_of_domain(p: &PerceivedMolecule) -> Vec<OutOfDomain> {
    let pi: Vec<Option<u32>> = p
        .mol
        .atoms()
        .map(|v| pi_electrons(&p.mol, &p.rings, v))
        .collect();
    let mut found = closed_cages(p, &pi);
    if found.is_empty() {
        found.extend(curved_surfaces(p, &pi));
    }
    found.extend(antiaromatic_rings(p, &pi));
    found
}

fn numbers(atoms: &[NodeIndex]) -> Vec<usize> {
    let mut n: Vec<usize> = atoms.iter().map(|a| a.index() + 1).collect();
    n.sort_unstable();
    n
}

/// Ring bonds of atom `a` (bonds to neighbours in the same ring system).
fn ring_neighbours(p: &PerceivedMolecule, a: NodeIndex) -> Vec<NodeIndex> {
    let sys = p.rings.system_of_atom(a);
    p.mol
        .neighbours(a)
        .map(|(n, _)| n)
        .filter(|n| sys.is_some() && p.rings.system_of_atom(*n) == sys)
        .filter(|n| {
            p.rings
                .rings
                .iter()
                .any(|r| r.contains_atom(a) && r.contains_atom(*n))
        })
        .collect()
}

/// Whether atom `a` is an sp2 atom of a pi surface: aromatic, or giving one pi electron through
/// a double bond (lone-pair donors such as pyrrole N or the P of P4S3 are not surface atoms).
fn conjugated(p: &PerceivedMolecule, pi: &[Option<u32>], a: NodeIndex) -> bool {
    let atom = p.mol.atom(a);
    matches!(atom.element, Element::C | Element::N)
        && (atom.aromatic || pi.get(a.index()).copied().flatten() == Some(1))
}

fn closed_cages(p: &PerceivedMolecule, pi: &[Option<u32>]) -> Vec<OutOfDomain> {
    let mut out = Vec::new();
    for system in &p.rings.systems {
        if system.atoms.len() < CAGE_MIN_ATOMS {
            continue;
        }
        let surrounded = system
            .atoms
            .iter()
            .filter(|&&a| conjugated(p, pi, a) && ring_neighbours(p, a).len() >= 3)
            .count();
        // Fullerene adducts keep most of the cage: nine tenths of the atoms (our choice).
        if surrounded * 10 >= system.atoms.len() * 9 {
            let carbons = system
                .atoms
                .iter()
                .filter(|&&a| p.mol.atom(a).element == Element::C)
                .count();
            out.push(OutOfDomain {
                kind: OutOfDomainKind::ClosedConjugatedCage,
                atoms: numbers(&system.atoms),
                reason: format!(
                    "ring system of {} atoms ({carbons} carbons) in which {surrounded} sp2 atoms \
                     have three ring bonds: a closed pi cage like a fullerene, whose curvature \
                     strain no flat aromatic group or ring correction holds (C60: measured Hf298 \
                     near 620 kcal/mol, flat groups give about 200)",
                    system.atoms.len()
                ),
            });
        }
    }
    out
}

/// Interior angle (degrees) of a regular polygon of `n` corners.
fn interior_angle_deg(n: usize) -> f64 {
    180.0 * (n as f64 - 2.0) / n as f64
}

fn curved_surfaces(p: &PerceivedMolecule, pi: &[Option<u32>]) -> Vec<OutOfDomain> {
    // Angular defect of every sp2 atom in three small rings whose ring neighbours are sp2 too.
    let n = p.mol.atom_count();
    let mut surrounded: Vec<Option<f64>> = vec![None; n];
    for a in p.mol.atoms() {
        if !conjugated(p, pi, a) || p.rings.ring_count_of_atom(a) != 3 {
            continue;
        }
        let nb = ring_neighbours(p, a);
        if nb.len() != 3 || !nb.iter().all(|&b| conjugated(p, pi, b)) {
            continue;
        }
        let sizes: Vec<usize> = p
            .rings
            .rings_with_atom(a)
            .map(|r| p.rings.rings[r].size())
            .collect();
        // Only small rings are faces of a surface; a macrocycle (cyclophanes) is not.
        if sizes.iter().any(|&s| s > FACE_MAX_RING) {
            continue;
        }
        let angles: f64 = sizes.iter().map(|&s| interior_angle_deg(s)).sum();
        surrounded[a.index()] = Some(360.0 - angles);
    }
    // A ring whose every atom is such a fully surrounded atom cannot relax its defects into a
    // free edge: the sum over its atoms decides.
    let mut out: Vec<OutOfDomain> = Vec::new();
    for ring in &p.rings.rings {
        let Some(defects) = ring
            .atoms
            .iter()
            .map(|a| surrounded[a.index()])
            .collect::<Option<Vec<f64>>>()
        else {
            continue;
        };
        let total: f64 = defects.iter().sum();
        let shape = if total > 0.0 { "a bowl" } else { "a saddle" };
        if total.abs() > CURVATURE_DEFECT_LIMIT_DEG
            && !out
                .iter()
                .any(|o| numbers(&ring.atoms).iter().all(|a| o.atoms.contains(a)))
        {
            out.push(OutOfDomain {
                kind: OutOfDomainKind::CurvedConjugatedSurface,
                atoms: numbers(&ring.atoms),
                reason: format!(
                    "{}-membered ring of sp2 atoms each fully surrounded by rings, whose angles \
                     leave an angular defect of {:.0} degrees (planar limit \
                     {CURVATURE_DEFECT_LIMIT_DEG:.0}): the pi surface is curved into {shape}, a \
                     strain that no flat aromatic group or ring correction holds",
                    ring.size(),
                    total.abs()
                ),
            });
        }
    }
    out
}

fn antiaromatic_rings(p: &PerceivedMolecule, pi: &[Option<u32>]) -> Vec<OutOfDomain> {
    let electrons = |atoms: &[NodeIndex]| -> Option<u32> {
        atoms
            .iter()
            .map(|a| pi.get(a.index()).copied().flatten().filter(|e| *e >= 1))
            .sum()
    };
    let is_4n = |e: u32| e > 0 && e.is_multiple_of(4);
    let mut out = Vec::new();
    let mut covered: Vec<usize> = Vec::new();
    for (i, ring) in p.rings.rings.iter().enumerate() {
        if ring.size() > ANTIAROMATIC_MAX_RING {
            continue;
        }
        if let Some(e) = electrons(&ring.atoms).filter(|e| is_4n(*e)) {
            covered.push(i);
            out.push(OutOfDomain {
                kind: OutOfDomainKind::AntiaromaticRing,
                atoms: numbers(&ring.atoms),
                reason: format!(
                    "{}-membered ring with {e} pi electrons (4n, Hueckel antiaromatic, as in \
                     cyclobutadiene): its destabilisation is no ring-strain term of a \
                     saturated parent",
                    ring.size()
                ),
            });
        }
    }
    // Fully conjugated fused systems of small rings with a 4n perimeter and no aromatic ring.
    for system in &p.rings.systems {
        if system.rings.len() < 2 || system.rings.iter().any(|r| covered.contains(r)) {
            continue;
        }
        let small = system
            .rings
            .iter()
            .all(|&r| p.rings.rings[r].size() <= ANTIAROMATIC_MAX_RING + 2);
        let aromatic = system.atoms.iter().any(|&a| p.mol.atom(a).aromatic);
        if !small || aromatic {
            continue;
        }
        if let Some(e) = electrons(&system.atoms).filter(|e| is_4n(*e)) {
            out.push(OutOfDomain {
                kind: OutOfDomainKind::AntiaromaticRing,
                atoms: numbers(&system.atoms),
                reason: format!(
                    "fully conjugated fused ring system of {} atoms with {e} pi electrons (4n, \
                     Hueckel antiaromatic, as in pentalene): its destabilisation is no \
                     ring-strain term of a saturated parent",
                    system.atoms.len()
                ),
            });
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    fn kinds(smiles: &str) -> Vec<OutOfDomainKind> {
        let p = PerceivedMolecule::from_smiles(smiles).unwrap();
        out_of_domain(&p).into_iter().map(|o| o.kind).collect()
    }

    #[test]
    fn ordinary_rings_are_in_the_domain() {
        for s in [
            "c1ccccc1",
            "c1ccc2ccccc2c1",
            "c1ccc2cccc2cc1",               // azulene (10 pi)
            "c1ccc2c(c1)-c1cccc3cccc-2c13", // fluoranthene
            "C1=Cc2cccc3cccc1c23",          // acenaphthylene
            "C1=CC=CC=CC=C1",               // cyclooctatetraene (tub)
            "O=C1C=CC(=O)C=C1",             // p-benzoquinone
            "O=C1C=C1",                     // cyclopropenone (2 pi)
            "C12C3C4C1C5C2C3C45",           // cubane
            "C1C2CC3CC1CC(C2)C3",           // adamantane
            "c1ccc2ccccc2c1-c1ccccc1",
            "C1=CCC=C1",
            "c1cc2cccc3c4cccc5cccc(c(c1)c23)c54", // perylene
        ] {
            assert!(kinds(s).is_empty(), "{s}: {:?}", kinds(s));
        }
    }

    #[test]
    fn cages_bowls_and_antiaromatic_rings_are_found() {
        let c60 = "C12=C3C4=C5C6=C1C7=C8C9=C1C%10=C%11C(=C29)C3=C2C3=C4C4=C5C5=C9C6=C7C6=C7C8=C1C1=C8C%10=C%10C%11=C2C2=C3C3=C4C4=C5C5=C%11C%12=C(C6=C95)C7=C1C1=C%12C5=C%11C4=C3C3=C5C(=C81)C%10=C23";
        assert_eq!(kinds(c60), [OutOfDomainKind::ClosedConjugatedCage]);
        assert_eq!(
            kinds("c1cc2ccc3ccc4ccc5ccc1c1c2c3c4c51"), // corannulene
            [OutOfDomainKind::CurvedConjugatedSurface]
        );
        for s in [
            "C1=CC=C1",
            "C1=CO1",
            "C1=CS1",
            "C1=CN1",
            "c1ccc2c(c1)-c1ccccc1-2",
        ] {
            assert_eq!(kinds(s), [OutOfDomainKind::AntiaromaticRing], "{s}");
        }
        assert_eq!(
            kinds("C1=CC2=CC=CC2=C1"),
            [OutOfDomainKind::AntiaromaticRing],
            "pentalene"
        );
    }
}
