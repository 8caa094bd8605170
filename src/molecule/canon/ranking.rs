//! Canonical atom ranks: atom invariants, iterative refinement by neighbour ranks until stable,
//! stereo configurations folded in as soon as they are defined, and deterministic tie-breaking.
//!
//! A rank is the number of atoms with a strictly smaller class, so tied atoms share a rank.
//! Ties left by refinement are broken one at a time in the lowest tied class. Without stereo
//! any member of that class will do (refinement classes are taken to be symmetry classes).
//! While some stereo element is still undefined, every member is tried and the one whose
//! refined ranks give the smallest list of stereo values wins, so that equivalent inputs pick
//! equivalent atoms.

use super::prepare::Prepared;
use super::stereo::{double_value, tetra_value, ElementId, StereoSet};

/// Invariant class of a bond for refinement: order (5 for resonant) plus 8 when in a ring.
fn bond_class(p: &Prepared, e: usize) -> u8 {
    let b = &p.bonds[e];
    let order = if b.resonant { 5 } else { b.order.valence() };
    order + if b.ring { 8 } else { 0 }
}

/// Ranks from the atoms' own invariants.
fn initial_ranks(p: &Prepared) -> Vec<u32> {
    let keys: Vec<_> = p
        .atoms
        .iter()
        .enumerate()
        .map(|(i, a)| {
            (
                a.element.atomic_number(),
                a.isotope.unwrap_or(0),
                a.charge,
                a.hydrogens,
                p.adj[i].len(),
                a.radical_electrons,
                a.atom_class.map_or(0, |c| u64::from(c) + 1),
                p.ring_atom[i],
                p.resonant_atom[i],
            )
        })
        .collect();
    let mut order: Vec<usize> = (0..keys.len()).collect();
    order.sort_by(|&a, &b| keys[a].cmp(&keys[b]));
    let mut ranks = vec![0u32; keys.len()];
    for k in 1..order.len() {
        ranks[order[k]] = if keys[order[k]] == keys[order[k - 1]] {
            ranks[order[k - 1]]
        } else {
            k as u32
        };
    }
    ranks
}

/// Number of distinct ranks.
fn class_count(ranks: &[u32]) -> usize {
    let mut seen = vec![false; ranks.len()];
    for &r in ranks {
        seen[r as usize] = true;
    }
    seen.iter().filter(|&&s| s).count()
}

/// Refines ranks by (rank, stereo value, sorted neighbour ranks and bond classes) until the
/// number of classes stops growing. Order between atoms already apart is kept.
fn refine(p: &Prepared, classes: &[u8], ranks: &mut [u32], extra: &[u8]) {
    let n = ranks.len();
    let mut count = class_count(ranks);
    let mut order: Vec<usize> = (0..n).collect();
    let mut around: Vec<Vec<(u32, u8)>> = vec![Vec::new(); n];
    let mut next = vec![0u32; n];
    loop {
        for (i, list) in around.iter_mut().enumerate() {
            list.clear();
            list.extend(p.adj[i].iter().map(|&(j, e)| (ranks[j], classes[e])));
            list.sort_unstable();
        }
        let key = |i: usize| (ranks[i], extra[i]);
        order.sort_by(|&a, &b| key(a).cmp(&key(b)).then_with(|| around[a].cmp(&around[b])));
        let mut new_count = 1;
        for k in 0..n {
            let i = order[k];
            next[i] = if k == 0 {
                0
            } else {
                let j = order[k - 1];
                if key(i) == key(j) && around[i] == around[j] {
                    next[j]
                } else {
                    new_count += 1;
                    k as u32
                }
            };
        }
        ranks.copy_from_slice(&next);
        if new_count == count {
            return;
        }
        count = new_count;
    }
}

/// Per-atom stereo values under `ranks` (centre value, plus 4 times a double-bond value on
/// both ends), and the sorted list of defined (rank, value) pairs.
fn stereo_values(p: &Prepared, stereo: &StereoSet, ranks: &[u32]) -> (Vec<u8>, Vec<(u32, u8)>) {
    let mut extra = vec![0u8; ranks.len()];
    let mut defined = Vec::new();
    for t in stereo.tetra.iter().filter(|t| t.active) {
        if let Some(v) = tetra_value(t, ranks) {
            extra[t.centre] |= v;
            defined.push((ranks[t.centre], v));
        }
    }
    for d in stereo.double.iter().filter(|d| d.active) {
        if let Some(v) = double_value(p, d, ranks) {
            extra[d.a] |= v << 2;
            extra[d.b] |= v << 2;
            defined.push((ranks[d.a].min(ranks[d.b]), v + 4));
        }
    }
    defined.sort_unstable();
    (extra, defined)
}

/// Refinement with stereo values, repeated until neither ranks nor values change.
/// Returns the defined stereo list.
fn refine_with_stereo(
    p: &Prepared,
    classes: &[u8],
    stereo: &StereoSet,
    ranks: &mut [u32],
) -> Vec<(u32, u8)> {
    let mut extra = vec![0u8; ranks.len()];
    loop {
        refine(p, classes, ranks, &extra);
        if stereo.is_empty() {
            return Vec::new();
        }
        let (new_extra, defined) = stereo_values(p, stereo, ranks);
        if new_extra == extra {
            return defined;
        }
        extra = new_extra;
    }
}

/// Active stereo elements that refinement alone leaves undefined (some of their neighbours
/// are tied): candidates for not being stereogenic at all.
pub(crate) fn undefined_after_refinement(p: &Prepared, stereo: &StereoSet) -> Vec<ElementId> {
    let classes: Vec<u8> = (0..p.bonds.len()).map(|e| bond_class(p, e)).collect();
    let mut ranks = initial_ranks(p);
    refine_with_stereo(p, &classes, stereo, &mut ranks);
    undefined(p, stereo, &ranks)
}

/// Active elements without a value under `ranks`.
fn undefined(p: &Prepared, stereo: &StereoSet, ranks: &[u32]) -> Vec<ElementId> {
    let tetra = stereo
        .tetra
        .iter()
        .enumerate()
        .filter(|(_, t)| t.active && tetra_value(t, ranks).is_none())
        .map(|(i, _)| ElementId::Tetra(i));
    let double = stereo
        .double
        .iter()
        .enumerate()
        .filter(|(_, d)| d.active && double_value(p, d, ranks).is_none())
        .map(|(i, _)| ElementId::Double(i));
    tetra.chain(double).collect()
}

/// Gives `chosen` its class's rank alone; the rest of the class moves one up.
fn single_out(ranks: &mut [u32], chosen: usize) {
    let r = ranks[chosen];
    for (i, x) in ranks.iter_mut().enumerate() {
        if *x == r && i != chosen {
            *x = r + 1;
        }
    }
}

/// How a trial tie-break is judged: the refined partition seen from its cells (size and
/// neighbourhood of each cell in rank order), then the stereo values it defines.
type Signature = (Vec<(u32, Vec<(u32, u8)>)>, Vec<(u32, u8)>);

/// The partition part of a [`Signature`].
fn quotient(p: &Prepared, classes: &[u8], ranks: &[u32]) -> Vec<(u32, Vec<(u32, u8)>)> {
    let n = ranks.len();
    let mut size = vec![0u32; n];
    let mut first = vec![usize::MAX; n];
    for (i, &r) in ranks.iter().enumerate() {
        size[r as usize] += 1;
        if first[r as usize] == usize::MAX {
            first[r as usize] = i;
        }
    }
    (0..n)
        .filter(|&r| size[r] > 0)
        .map(|r| {
            let mut around: Vec<(u32, u8)> = p.adj[first[r]]
                .iter()
                .map(|&(j, e)| (ranks[j], classes[e]))
                .collect();
            around.sort_unstable();
            (size[r], around)
        })
        .collect()
}

/// Candidate classes larger than this are split at their first member without comparing
/// trials, to keep highly symmetric molecules fast.
const TRIAL_LIMIT: usize = 64;

/// Breaks ties until all ranks differ. With `lookahead`, each trial is completed (without
/// lookahead) before it is judged, so stereo choices several ties deep are compared too.
fn complete(
    p: &Prepared,
    classes: &[u8],
    stereo: &StereoSet,
    ranks: &mut Vec<u32>,
    lookahead: bool,
) {
    let n = ranks.len();
    let mut size = vec![0u32; n];
    loop {
        size.fill(0);
        for &r in ranks.iter() {
            size[r as usize] += 1;
        }
        let Some(tied) = (0..n).find(|&r| size[r] > 1) else {
            return;
        };
        let candidates: Vec<usize> = (0..n).filter(|&i| ranks[i] as usize == tied).collect();
        if candidates.len() > TRIAL_LIMIT {
            single_out(ranks, candidates[0]);
            refine_with_stereo(p, classes, stereo, ranks);
            continue;
        }
        let deep = lookahead && !undefined(p, stereo, ranks).is_empty();
        let mut best: Option<(Signature, Vec<u32>)> = None;
        for &c in &candidates {
            let mut trial = ranks.clone();
            single_out(&mut trial, c);
            let defined = refine_with_stereo(p, classes, stereo, &mut trial);
            let signature = if deep {
                // Judge (and keep) the completed ranks: equal signatures then mean equal keys.
                complete(p, classes, stereo, &mut trial, false);
                let (_, defined) = stereo_values(p, stereo, &trial);
                (quotient(p, classes, &trial), defined)
            } else {
                (quotient(p, classes, &trial), defined)
            };
            if best.as_ref().is_none_or(|(s, _)| signature < *s) {
                best = Some((signature, trial));
            }
        }
        if let Some((_, trial)) = best {
            *ranks = trial;
        }
    }
}

/// Canonical ranks: all distinct, 0..n.
pub(crate) fn canonical_ranks(p: &Prepared, stereo: &StereoSet) -> Vec<u32> {
    let classes: Vec<u8> = (0..p.bonds.len()).map(|e| bond_class(p, e)).collect();
    let mut ranks = initial_ranks(p);
    refine_with_stereo(p, &classes, stereo, &mut ranks);
    complete(p, &classes, stereo, &mut ranks, true);
    ranks
}
