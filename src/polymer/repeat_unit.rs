//! The repeat unit of a ring-opening polymer, priced as the middle unit of a long chain.
//!
//! The monomer's graph is cut at the opened bond and `n` copies are joined head to tail (the
//! `b` end of one copy to the `a` end of the next, with the opened bond's order), the two free
//! ends capped by methyl (`=CH2` for a double bond). The unit's group-additivity terms are the
//! terms of the `n`-mer minus those of the `(n-1)`-mer, so the caps and chain ends cancel and no
//! ring term of the opened ring is left (a ring the opening keeps, as in norbornene's
//! cyclopentane, keeps its term). The same difference one chain shorter must agree, else the
//! unit is flagged (an end effect reaching further than a unit). The entropy takes the internal
//! rotor symmetry of the unit (`-R ln` of the ratio of the chains' internal symmetry numbers);
//! the chain's external symmetry and its stereo configurations are not counted (a long
//! stereoregular chain). The vaporisation share of the unit is the same difference of the
//! Chickos contribution counts, without the per-molecule constant.

use std::collections::BTreeMap;

use petgraph::graph::NodeIndex;
use petgraph::visit::EdgeRef;

use super::opening::OpenedBond;
use crate::molecule::canon::canonical_smiles;
use crate::molecule::{Atom, Bond, Element, Molecule, PerceivedMolecule};
use crate::phase::chickos::{count_groups, ChickosCounts};
use crate::phase::PhaseData;
use crate::thermo::estimate::{Term, TermKind};
use crate::thermo::{EstimateOptions, GroupAdditivity, Quantity};
use crate::units::GAS_CONSTANT_J_PER_MOL_K as GAS_CONSTANT;

/// Chain length whose difference to one unit shorter gives the unit.
pub const CHAIN_UNITS: usize = 5;

/// One term of the unit: a group, correction or ring term and its count per unit.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct UnitTerm {
    /// Group, correction or ring.
    pub kind: TermKind,
    /// Its label.
    pub label: String,
    /// Occurrences per unit.
    pub count: i64,
    /// Hf298 per occurrence, kJ/mol, with uncertainty.
    pub hf_kj: Quantity,
    /// Source of the value.
    pub source: String,
}

/// The repeat unit with its gas-phase values.
#[derive(Debug, Clone, serde::Serialize)]
pub struct RepeatUnit {
    /// SMILES of the capped trimer, for the reader's check of the chain built.
    pub trimer_smiles: String,
    /// Hf298 of the unit (gas, middle of a long chain), kJ/mol.
    pub hf298_kj: Quantity,
    /// S298 of the unit, J/(mol K), if every term has an entropy.
    pub s298_j: Option<Quantity>,
    /// The unit's terms.
    pub terms: Vec<UnitTerm>,
    /// `-R ln(internal symmetry ratio)`, J/(mol K), included in `s298_j`.
    pub symmetry_entropy_j: f64,
    /// The unit's vaporisation-enthalpy share (Chickos sum without the constant), kJ/mol.
    pub dhvap_kj: Option<Quantity>,
    /// Why there is no vaporisation share.
    pub dhvap_problem: Option<String>,
    /// Warnings.
    pub flags: Vec<String>,
}

/// Why the unit could not be priced.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum RepeatUnitError {
    /// Group additivity fails on the chain.
    #[error("group additivity fails on the chain: {0}")]
    Estimate(String),
}

/// `n` copies of the monomer joined at the opened bond, ends capped.
pub fn chain(p: &PerceivedMolecule, bond: &OpenedBond, n: usize) -> Molecule {
    let src = &p.mol;
    let mut out = Molecule::new();
    let plain = |a: &Atom| Atom {
        aromatic: false,
        ..a.clone()
    };
    let mut copies: Vec<Vec<NodeIndex>> = Vec::new();
    for _ in 0..n {
        let map: Vec<NodeIndex> = src
            .atoms()
            .map(|i| out.add_atom(plain(src.atom(i))))
            .collect();
        for e in src.graph.edge_references() {
            if e.id() == bond.edge {
                continue;
            }
            out.add_bond(
                map[e.source().index()],
                map[e.target().index()],
                Bond::new(e.weight().order),
            );
        }
        copies.push(map);
    }
    for i in 1..n {
        let (b_prev, a_next) = (copies[i - 1][bond.b.index()], copies[i][bond.a.index()]);
        out.add_bond(b_prev, a_next, Bond::new(bond.order));
    }
    let cap_hydrogens = 4 - bond.order.valence();
    for end in [copies[0][bond.a.index()], copies[n - 1][bond.b.index()]] {
        let mut cap = Atom::new(Element::C);
        cap.hydrogens = cap_hydrogens;
        let c = out.add_atom(cap);
        out.add_bond(end, c, Bond::new(bond.order));
    }
    out
}

type TermKey = (String, String, String);

fn kind_name(k: TermKind) -> String {
    format!("{k:?}")
}

fn term_counts(terms: &[Term]) -> BTreeMap<TermKey, (i64, Term)> {
    let mut out: BTreeMap<TermKey, (i64, Term)> = BTreeMap::new();
    for t in terms {
        let notes: Vec<String> = t.notes.iter().map(|n| n.to_string()).collect();
        let key = (kind_name(t.kind), t.label.clone(), notes.join("; "));
        out.entry(key)
            .and_modify(|e| e.0 += i64::from(t.count))
            .or_insert((i64::from(t.count), t.clone()));
    }
    out
}

fn difference(
    long: &BTreeMap<TermKey, (i64, Term)>,
    short: &BTreeMap<TermKey, (i64, Term)>,
) -> BTreeMap<TermKey, (i64, Term)> {
    let mut out = BTreeMap::new();
    for (k, (n, t)) in long {
        let m = short.get(k).map_or(0, |s| s.0);
        if n - m != 0 {
            out.insert(k.clone(), (n - m, t.clone()));
        }
    }
    for (k, (m, t)) in short {
        if !long.contains_key(k) {
            out.insert(k.clone(), (-m, t.clone()));
        }
    }
    out
}

fn counts_difference(long: &ChickosCounts, short: &ChickosCounts) -> Option<ChickosCounts> {
    let sub = |a: u32, b: u32| a.checked_sub(b);
    let mut groups = BTreeMap::new();
    for (k, n) in &long.groups {
        let d = sub(*n, short.groups.get(k).copied().unwrap_or(0))?;
        if d > 0 {
            groups.insert(k.clone(), d);
        }
    }
    if short.groups.keys().any(|k| !long.groups.contains_key(k)) {
        return None;
    }
    Some(ChickosCounts {
        carbons: sub(long.carbons, short.carbons)?,
        quaternary_carbons: sub(long.quaternary_carbons, short.quaternary_carbons)?,
        groups,
    })
}

/// Prices the repeat unit of `p` opened at `bond`.
pub fn repeat_unit(
    p: &PerceivedMolecule,
    bond: &OpenedBond,
    engine: &GroupAdditivity,
    phase: &PhaseData,
) -> Result<RepeatUnit, RepeatUnitError> {
    let options = EstimateOptions::default();
    let chains: Vec<Molecule> = (CHAIN_UNITS - 2..=CHAIN_UNITS)
        .map(|n| chain(p, bond, n))
        .collect();
    let mut estimates = Vec::new();
    for c in &chains {
        let e = engine
            .estimate(&PerceivedMolecule::new(c), &options)
            .map_err(|e| RepeatUnitError::Estimate(e.to_string()))?;
        estimates.push(e);
    }
    let counts: Vec<_> = estimates.iter().map(|e| term_counts(&e.terms)).collect();
    let unit = difference(&counts[2], &counts[1]);
    let check = difference(&counts[1], &counts[0]);
    let mut flags = Vec::new();
    let same = unit.len() == check.len()
        && unit
            .iter()
            .all(|(k, (n, _))| check.get(k).is_some_and(|c| c.0 == *n));
    if !same {
        flags.push(
            "the unit's terms differ between chains of different length (an end effect reaches \
             beyond one unit); the longest chains are used"
                .to_string(),
        );
    }
    let long = &estimates[2];
    flags.extend(
        long.flags
            .iter()
            .filter(|f| {
                matches!(
                    f.category(),
                    crate::thermo::FlagCategory::StandIn | crate::thermo::FlagCategory::NotApplied
                )
            })
            .map(|f| format!("repeat unit: {f}")),
    );
    let (mut hf, mut hf_var, mut s, mut s_var, mut s_known) = (0.0, 0.0, 0.0, 0.0, true);
    let mut terms = Vec::new();
    for (n, t) in unit.values() {
        let v = &t.per_unit;
        let c = *n as f64;
        hf += c * v.hf_kj;
        hf_var += (c * v.unc_hf_kj).powi(2);
        if v.known.s && v.s_j.is_finite() {
            s += c * v.s_j;
            s_var += (c * v.unc_s_j).powi(2);
        } else {
            s_known = false;
        }
        terms.push(UnitTerm {
            kind: t.kind,
            label: t.label.clone(),
            count: *n,
            hf_kj: Quantity::new(v.hf_kj, v.unc_hf_kj),
            source: t.source.clone(),
        });
    }
    if terms.iter().any(|t| t.count < 0) {
        flags.push("a term counts negative per unit (chain end effect)".to_string());
    }
    let ratio = long.symmetry.internal.max(1) as f64 / estimates[1].symmetry.internal.max(1) as f64;
    let symmetry_entropy_j = -GAS_CONSTANT * ratio.ln();
    if !s_known {
        flags.push("a term of the unit has no entropy: S298 of the unit not estimated".to_string());
    }
    let (dhvap_kj, dhvap_problem) = match (count_groups(&chains[2]), count_groups(&chains[1])) {
        (Ok(a), Ok(b)) => match counts_difference(&a, &b).map(|d| phase.method.sum(&d)) {
            Some(Ok(sum)) => {
                let v = sum.without_constant_kj;
                (Some(Quantity::new(v, phase.method.uncertainty_kj(v))), None)
            }
            Some(Err(e)) => (None, Some(e)),
            None => (
                None,
                Some("the chains' group counts do not differ by one unit".to_string()),
            ),
        },
        (Err(e), _) | (_, Err(e)) => (None, Some(e)),
    };
    Ok(RepeatUnit {
        trimer_smiles: canonical_smiles(&chain(p, bond, 3)),
        hf298_kj: Quantity::new(hf, hf_var.sqrt()),
        s298_j: s_known.then(|| Quantity::new(s + symmetry_entropy_j, s_var.sqrt())),
        terms,
        symmetry_entropy_j,
        dhvap_kj,
        dhvap_problem,
        flags,
    })
}
