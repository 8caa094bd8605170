//! The depth-first writer: starts each component at its lowest-ranked atom, visits neighbours
//! in rank order, numbers ring bonds in the order they open (lowest free digit), writes
//! resonant atoms in lower case and re-expresses stereo marks for the written order.

use std::fmt::Write;

use super::prepare::Prepared;
use super::stereo::{neighbour_key, reference_substituent, sort_parity, tetra_value, StereoSet};
use crate::molecule::graph::BondOrder;

const NONE: usize = usize::MAX;

/// The spanning forest of one written order and its ring bonds.
struct Layout {
    /// Position of each atom in writing order.
    pos: Vec<usize>,
    /// Bond to the atom each atom was reached from.
    parent_bond: Vec<usize>,
    parent: Vec<usize>,
    /// Tree children in writing order.
    children: Vec<Vec<usize>>,
    /// Ring bonds opened at the atom, in opening order.
    opens: Vec<Vec<usize>>,
    /// Ring bonds closed at the atom, in closing order.
    closes: Vec<Vec<usize>>,
    /// Roots of the components, in writing order.
    roots: Vec<usize>,
}

/// Builds the depth-first layout, neighbours taken in rank order.
fn layout(p: &Prepared, ranks: &[u32]) -> Layout {
    let n = p.atoms.len();
    let mut sorted: Vec<Vec<(usize, usize)>> = p.adj.clone();
    for list in &mut sorted {
        list.sort_by_key(|&(w, _)| ranks[w]);
    }
    let mut l = Layout {
        pos: vec![NONE; n],
        parent_bond: vec![NONE; n],
        parent: vec![NONE; n],
        children: vec![Vec::new(); n],
        opens: vec![Vec::new(); n],
        closes: vec![Vec::new(); n],
        roots: Vec::new(),
    };
    let mut seen_bond = vec![false; p.bonds.len()];
    let mut by_rank: Vec<usize> = (0..n).collect();
    // Start each component at a least-connected atom (chain ends, not middles), lowest rank first.
    by_rank.sort_by_key(|&i| (p.adj[i].len(), ranks[i]));
    let mut counter = 0;
    for &root in &by_rank {
        if l.pos[root] != NONE {
            continue;
        }
        l.roots.push(root);
        l.pos[root] = counter;
        counter += 1;
        let mut stack = vec![(root, 0usize)];
        while let Some(top) = stack.last_mut() {
            let v = top.0;
            let Some(&(w, e)) = sorted[v].get(top.1) else {
                stack.pop();
                continue;
            };
            top.1 += 1;
            if seen_bond[e] {
                continue;
            }
            seen_bond[e] = true;
            if l.pos[w] == NONE {
                l.pos[w] = counter;
                counter += 1;
                l.parent_bond[w] = e;
                l.parent[w] = v;
                l.children[v].push(w);
                stack.push((w, 0));
            } else {
                l.opens[w].push(e);
                l.closes[v].push(e);
            }
        }
    }
    l
}

/// Direction marks to write: per bond, +1 for `/` and -1 for `\` read in writing order.
fn direction_marks(p: &Prepared, stereo: &StereoSet, ranks: &[u32], l: &Layout) -> Vec<i8> {
    let mut marks = vec![0i8; p.bonds.len()];
    let mut doubles: Vec<_> = stereo.double.iter().filter(|d| d.active).collect();
    doubles.sort_by_key(|d| l.pos[d.a].min(l.pos[d.b]));
    for d in doubles {
        let (Some(ra), Some(rb)) = (
            reference_substituent(p, d.a, d.b, ranks),
            reference_substituent(p, d.b, d.a, ranks),
        ) else {
            continue;
        };
        let cis = d.cis ^ (ra != d.x) ^ (rb != d.y);
        // Side of each substituent bond as a multiple of t = side of ra; the mark written on
        // the bond is then sign = -side * f, with f = +1 when the substituent comes first.
        let mut ends: Vec<Vec<(usize, i8, bool)>> = Vec::new();
        for (end, partner, reference, side_ref) in [
            (d.a, d.b, ra, 1i8),
            (d.b, d.a, rb, if cis { 1 } else { -1 }),
        ] {
            let mut list = Vec::new();
            for &(s, e) in &p.adj[end] {
                if s == partner {
                    continue;
                }
                let side = if s == reference { side_ref } else { -side_ref };
                let f: i8 = if l.pos[s] < l.pos[end] { 1 } else { -1 };
                let tree = l.parent_bond[s] == e || l.parent_bond[end] == e;
                list.push((e, -side * f, tree));
            }
            // Candidates in writing order, so the choice below does not follow input order.
            list.sort_by_key(|&(e, _, _)| l.pos[p.bonds[e].a] + l.pos[p.bonds[e].b]);
            ends.push(list);
        }
        let assigned = ends
            .iter()
            .flatten()
            .find(|&&(e, _, _)| marks[e] != 0)
            .map(|&(e, k, _)| marks[e] * k);
        let choices: Vec<Option<(usize, i8)>> = ends
            .iter()
            .map(|list| {
                if list.iter().any(|&(e, _, _)| marks[e] != 0) {
                    return None;
                }
                list.iter()
                    .find(|x| x.2)
                    .or_else(|| list.first())
                    .map(|&(e, k, _)| (e, k))
            })
            .collect();
        // Without earlier marks, the first mark written for this bond is `/`.
        let t = assigned.unwrap_or_else(|| {
            choices
                .iter()
                .flatten()
                .min_by_key(|&&(e, _)| l.pos[p.bonds[e].a].max(l.pos[p.bonds[e].b]))
                .map_or(1, |&(_, k)| k)
        });
        for &(e, k) in choices.iter().flatten() {
            marks[e] = t * k;
        }
    }
    marks
}

/// Lowest valence at or above `used` for an organic-subset element written without brackets.
fn implied_hydrogens(p: &Prepared, atom: usize) -> Option<u32> {
    let used = p.bond_sum(atom);
    let valences = p.atoms[atom].element.default_valences();
    if valences.is_empty() {
        return None;
    }
    Some(
        valences
            .iter()
            .map(|&v| u32::from(v))
            .find(|&v| v >= used)
            .map_or(0, |v| v - used),
    )
}

/// Appends the atom's text; `tag` is `"@"`, `"@@"` or empty.
fn write_atom(out: &mut String, p: &Prepared, atom: usize, tag: &str) {
    let a = &p.atoms[atom];
    let lower = p.resonant_atom[atom];
    let symbol = a.element.symbol();
    let plain = tag.is_empty()
        && a.isotope.is_none()
        && a.charge == 0
        && a.atom_class.is_none()
        && a.radical_electrons == 0
        && (!lower || matches!(symbol, "B" | "C" | "N" | "O" | "P" | "S"))
        && implied_hydrogens(p, atom) == Some(u32::from(a.hydrogens));
    let text = if lower {
        symbol.to_ascii_lowercase()
    } else {
        symbol.to_string()
    };
    if plain {
        out.push_str(&text);
        return;
    }
    out.push('[');
    if let Some(iso) = a.isotope {
        let _ = write!(out, "{iso}");
    }
    out.push_str(&text);
    out.push_str(tag);
    match a.hydrogens {
        0 => {}
        1 => out.push('H'),
        h => {
            let _ = write!(out, "H{h}");
        }
    }
    match a.charge {
        0 => {}
        1 => out.push('+'),
        -1 => out.push('-'),
        c if c > 0 => {
            let _ = write!(out, "+{c}");
        }
        c => {
            let _ = write!(out, "-{}", -c);
        }
    }
    if let Some(class) = a.atom_class {
        let _ = write!(out, ":{class}");
    }
    out.push(']');
}

/// The bond symbol for bond `e` written from `from` to `to`.
fn bond_symbol(p: &Prepared, e: usize, marks: &[i8]) -> &'static str {
    let b = &p.bonds[e];
    match marks[e] {
        1 => return "/",
        -1 => return "\\",
        _ => {}
    }
    if b.resonant {
        return "";
    }
    match b.order {
        BondOrder::Single if p.resonant_atom[b.a] && p.resonant_atom[b.b] => "-",
        BondOrder::Single => "",
        BondOrder::Double => "=",
        BondOrder::Triple => "#",
        BondOrder::Quadruple => "$",
    }
}

/// Ring-bond digit text.
fn digit_text(d: usize) -> String {
    match d {
        0..=9 => d.to_string(),
        10..=99 => format!("%{d}"),
        _ => format!("%({d})"),
    }
}

/// Writes the molecule: one string per component, sorted, joined by `.`.
pub(crate) fn write(p: &Prepared, stereo: &StereoSet, ranks: &[u32]) -> String {
    let l = layout(p, ranks);
    let marks = direction_marks(p, stereo, ranks, &l);
    let mut centre_value = vec![0u8; p.atoms.len()];
    for t in stereo.tetra.iter().filter(|t| t.active) {
        if let Some(v) = tetra_value(t, ranks) {
            centre_value[t.centre] = v;
        }
    }
    let mut digit_of = vec![0usize; p.bonds.len()];
    let mut parts: Vec<String> = Vec::with_capacity(l.roots.len());
    enum Step {
        Atom(usize),
        Text(&'static str),
    }
    for &root in &l.roots {
        let mut out = String::new();
        let mut in_use: Vec<bool> = vec![false; 1];
        let mut steps = vec![Step::Atom(root)];
        while let Some(step) = steps.pop() {
            let v = match step {
                Step::Text(t) => {
                    out.push_str(t);
                    continue;
                }
                Step::Atom(v) => v,
            };
            if l.parent_bond[v] != NONE {
                out.push_str(bond_symbol(p, l.parent_bond[v], &marks));
            }
            // Neighbour order the stereo mark refers to.
            let mut order: Vec<Option<usize>> = Vec::with_capacity(4);
            if l.parent[v] != NONE {
                order.push(Some(l.parent[v]));
            }
            let tag = if centre_value[v] != 0 {
                let ring_partners = l.closes[v].iter().chain(&l.opens[v]).map(|&e| {
                    let b = &p.bonds[e];
                    Some(if b.a == v { b.b } else { b.a })
                });
                order.extend(ring_partners);
                order.extend(l.children[v].iter().map(|&c| Some(c)));
                if p.atoms[v].hydrogens > 0 {
                    // A bracket hydrogen follows the atom the centre is reached from.
                    order.insert(usize::from(l.parent[v] != NONE), None);
                } else if order.len() == 3 {
                    // A lone pair takes the second place, as the reading side assumes.
                    order.insert(1, None);
                }
                order.truncate(4);
                let keys: Vec<u32> = order.iter().map(|&n| neighbour_key(n, ranks)).collect();
                let odd = sort_parity(&keys).unwrap_or(false);
                if (centre_value[v] == 2) != odd {
                    "@@"
                } else {
                    "@"
                }
            } else {
                ""
            };
            write_atom(&mut out, p, v, tag);
            for &e in &l.closes[v] {
                out.push_str(&digit_text(digit_of[e]));
            }
            for &e in &l.opens[v] {
                let d = (1..)
                    .find(|&d| in_use.get(d).is_none_or(|u| !u))
                    .unwrap_or(1);
                if in_use.len() <= d {
                    in_use.resize(d + 1, false);
                }
                in_use[d] = true;
                digit_of[e] = d;
                out.push_str(bond_symbol(p, e, &marks));
                out.push_str(&digit_text(d));
            }
            for &e in &l.closes[v] {
                in_use[digit_of[e]] = false;
            }
            let kids = &l.children[v];
            for (k, &c) in kids.iter().enumerate().rev() {
                if k + 1 == kids.len() {
                    steps.push(Step::Atom(c));
                } else {
                    steps.push(Step::Text(")"));
                    steps.push(Step::Atom(c));
                    steps.push(Step::Text("("));
                }
            }
        }
        parts.push(out);
    }
    parts.sort();
    parts.join(".")
}
