//! The SMILES reader: one pass over the bytes that builds atoms, bonds, ring bonds and
//! chirality neighbour lists. Branches use an explicit stack, so nesting depth costs heap,
//! never call stack.

use petgraph::graph::{NodeIndex, UnGraph};

use super::bracket::{char_at, read_bracket};
use super::error::SmilesErrorKind;
use crate::molecule::element::Element;
use crate::molecule::graph::{
    Atom, Bond, BondDirection, BondOrder, ChiralCentre, ChiralTag, Molecule, StereoNeighbour,
};

/// A failure: the kind and the byte column it belongs to.
pub(super) type Failure = (SmilesErrorKind, usize);

/// A bond symbol as written.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum BondSymbol {
    Single,
    Double,
    Triple,
    Quadruple,
    Aromatic,
    Up,
    Down,
}

impl BondSymbol {
    fn from_byte(b: u8) -> Option<BondSymbol> {
        Some(match b {
            b'-' => BondSymbol::Single,
            b'=' => BondSymbol::Double,
            b'#' => BondSymbol::Triple,
            b'$' => BondSymbol::Quadruple,
            b':' => BondSymbol::Aromatic,
            b'/' => BondSymbol::Up,
            b'\\' => BondSymbol::Down,
            _ => return None,
        })
    }
}

/// An open ring bond: the atom it starts at, its bond symbol, where it was written, and the
/// chirality neighbour slot waiting for the partner (centre index, slot index).
#[derive(Debug, Clone, Copy)]
struct RingOpen {
    atom: NodeIndex,
    bond: Option<BondSymbol>,
    column: usize,
    slot: Option<(usize, usize)>,
}

/// An open branch: the atom it hangs from, the column of `(`, the atom count at that point.
struct BranchOpen {
    parent: NodeIndex,
    column: usize,
    atoms_before: usize,
}

/// Placeholder for a ring-closure neighbour not yet seen; always replaced before returning.
const PENDING: StereoNeighbour = StereoNeighbour::ImplicitHydrogen;

/// Reader state for one SMILES.
struct Reader<'a> {
    bytes: &'a [u8],
    mol: Molecule,
    /// Whether each atom was written in brackets.
    bracket: Vec<bool>,
    /// The atom the next atom bonds to.
    prev: Option<NodeIndex>,
    /// A bond symbol waiting for its second atom, with its column.
    pending: Option<(BondSymbol, usize)>,
    branches: Vec<BranchOpen>,
    rings: [Option<RingOpen>; 100],
    /// Column of the latest `.`, for a component left empty.
    last_dot: usize,
}

/// Reads `input` into a molecule (hydrogens of organic-subset atoms not yet assigned, aromatic
/// bonds still single) and the per-atom "written in brackets" flags.
pub(super) fn read(input: &str) -> Result<(Molecule, Vec<bool>), Failure> {
    let bytes = input.as_bytes();
    let mut r = Reader {
        bytes,
        mol: Molecule {
            graph: UnGraph::with_capacity(bytes.len(), bytes.len()),
            chiral_centres: Vec::new(),
        },
        bracket: Vec::with_capacity(bytes.len()),
        prev: None,
        pending: None,
        branches: Vec::new(),
        rings: [None; 100],
        last_dot: 0,
    };
    let mut i = 0;
    while i < bytes.len() {
        i = r.step(i)?;
    }
    r.finish()?;
    Ok((r.mol, r.bracket))
}

impl Reader<'_> {
    /// Reads the token at `i`; returns the index after it.
    fn step(&mut self, i: usize) -> Result<usize, Failure> {
        let b = self.bytes[i];
        if let Some(symbol) = BondSymbol::from_byte(b) {
            if self.pending.is_some() {
                return Err((SmilesErrorKind::UnexpectedCharacter(b as char), i));
            }
            if self.prev.is_none() {
                return Err((SmilesErrorKind::BondToNothing, i));
            }
            self.pending = Some((symbol, i));
            return Ok(i + 1);
        }
        match b {
            b'(' => self.open_branch(i),
            b')' => self.close_branch(i),
            b'.' => {
                if let Some((_, column)) = self.pending {
                    return Err((SmilesErrorKind::BondToNothing, column));
                }
                if self.prev.is_none() {
                    return Err((SmilesErrorKind::UnexpectedCharacter('.'), i));
                }
                self.prev = None;
                self.last_dot = i;
                Ok(i + 1)
            }
            b'0'..=b'9' => {
                self.ring_bond(b - b'0', i)?;
                Ok(i + 1)
            }
            b'%' => {
                let digits = self.bytes.get(i + 1..i + 3);
                match digits {
                    Some([a @ b'0'..=b'9', c @ b'0'..=b'9']) => {
                        self.ring_bond((a - b'0') * 10 + (c - b'0'), i)?;
                        Ok(i + 3)
                    }
                    _ => Err((SmilesErrorKind::BadRingNumber, i)),
                }
            }
            b'[' => {
                let (bracket, next) = read_bracket(self.bytes, i)?;
                let hydrogens = bracket.atom.hydrogens;
                self.add_atom(bracket.atom, true, bracket.chirality, hydrogens);
                Ok(next)
            }
            _ => self.organic_atom(i),
        }
    }

    /// Reads an organic-subset atom (or reports why the letters at `i` are not one).
    fn organic_atom(&mut self, i: usize) -> Result<usize, Failure> {
        let next = self.bytes.get(i + 1).copied();
        let (element, aromatic, len) = match (self.bytes[i], next) {
            (b'B', Some(b'r')) => (Element::BR, false, 2),
            (b'C', Some(b'l')) => (Element::CL, false, 2),
            (b'B', _) => (Element::B, false, 1),
            (b'C', _) => (Element::C, false, 1),
            (b'N', _) => (Element::N, false, 1),
            (b'O', _) => (Element::O, false, 1),
            (b'P', _) => (Element::P, false, 1),
            (b'S', _) => (Element::S, false, 1),
            (b'F', _) => (Element::F, false, 1),
            (b'I', _) => (Element::I, false, 1),
            (b'b', _) => (Element::B, true, 1),
            (b'c', _) => (Element::C, true, 1),
            (b'n', _) => (Element::N, true, 1),
            (b'o', _) => (Element::O, true, 1),
            (b'p', _) => (Element::P, true, 1),
            (b's', _) => (Element::S, true, 1),
            _ => return Err(self.not_an_atom(i)),
        };
        let mut atom = Atom::new(element);
        atom.aromatic = aromatic;
        atom.column = i;
        self.add_atom(atom, false, None, 0);
        Ok(i + len)
    }

    /// The error for a character at `i` that starts no token.
    fn not_an_atom(&self, i: usize) -> Failure {
        let b = self.bytes[i];
        let text = |s: &[u8]| String::from_utf8_lossy(s).into_owned();
        if b.is_ascii_uppercase() {
            let two = self
                .bytes
                .get(i..i + 2)
                .filter(|p| p[1].is_ascii_lowercase());
            for candidate in [two, Some(&self.bytes[i..=i])].into_iter().flatten() {
                if Element::from_symbol(&text(candidate)).is_some() {
                    return (SmilesErrorKind::NeedsBrackets(text(candidate)), i);
                }
            }
            return (SmilesErrorKind::UnknownElement(text(&[b])), i);
        }
        if b.is_ascii_lowercase() {
            // "Cu" reads as C then 'u': name the element the writer probably meant.
            if let Some(pair) = i.checked_sub(1).and_then(|s| self.bytes.get(s..=i)) {
                if pair[0].is_ascii_uppercase() && Element::from_symbol(&text(pair)).is_some() {
                    return (SmilesErrorKind::NeedsBrackets(text(pair)), i - 1);
                }
            }
            return (SmilesErrorKind::UnknownElement(text(&[b])), i);
        }
        if b == b'*' {
            return (SmilesErrorKind::UnknownElement("*".to_string()), i);
        }
        (
            SmilesErrorKind::UnexpectedCharacter(char_at(self.bytes, i)),
            i,
        )
    }

    /// Adds an atom, bonds it to the previous atom and starts its chirality neighbour list.
    fn add_atom(&mut self, atom: Atom, bracket: bool, chirality: Option<ChiralTag>, hydrogens: u8) {
        let aromatic = atom.aromatic;
        let node = self.mol.add_atom(atom);
        self.bracket.push(bracket);
        if let Some(prev) = self.prev {
            let symbol = self.pending.take().map(|(s, _)| s);
            let both_aromatic = aromatic && self.mol.graph[prev].aromatic;
            let bond = make_bond(symbol, prev, both_aromatic, false);
            self.mol.add_bond(prev, node, bond);
            if let Some(c) = self.centre_of(prev) {
                self.mol.chiral_centres[c]
                    .neighbours
                    .push(StereoNeighbour::Atom(node));
            }
        }
        if let Some(tag) = chirality {
            let mut neighbours = Vec::with_capacity(4);
            neighbours.extend(self.prev.map(StereoNeighbour::Atom));
            for _ in 0..hydrogens {
                neighbours.push(StereoNeighbour::ImplicitHydrogen);
            }
            self.mol.chiral_centres.push(ChiralCentre {
                atom: node,
                tag,
                neighbours,
            });
        }
        self.prev = Some(node);
    }

    /// The index in `chiral_centres` of the centre at `atom`, if it is one. Centres are
    /// pushed in atom order, so the list is sorted by atom.
    fn centre_of(&self, atom: NodeIndex) -> Option<usize> {
        let centres = &self.mol.chiral_centres;
        if centres.last().is_none_or(|c| c.atom < atom) {
            return None;
        }
        centres.binary_search_by_key(&atom, |c| c.atom).ok()
    }

    fn open_branch(&mut self, i: usize) -> Result<usize, Failure> {
        if let Some((_, column)) = self.pending {
            return Err((SmilesErrorKind::BondToNothing, column));
        }
        let parent = self
            .prev
            .ok_or((SmilesErrorKind::UnexpectedCharacter('('), i))?;
        self.branches.push(BranchOpen {
            parent,
            column: i,
            atoms_before: self.mol.atom_count(),
        });
        Ok(i + 1)
    }

    fn close_branch(&mut self, i: usize) -> Result<usize, Failure> {
        if let Some((_, column)) = self.pending {
            return Err((SmilesErrorKind::BondToNothing, column));
        }
        let open = self
            .branches
            .pop()
            .ok_or((SmilesErrorKind::StrayCloseParen, i))?;
        if self.prev.is_none() {
            return Err(self.empty_component());
        }
        if open.atoms_before == self.mol.atom_count() {
            return Err((SmilesErrorKind::EmptyBranch, open.column));
        }
        self.prev = Some(open.parent);
        Ok(i + 1)
    }

    /// Opens or closes ring bond `ring`, written at `column`.
    fn ring_bond(&mut self, ring: u8, column: usize) -> Result<(), Failure> {
        let atom = self.prev.ok_or((
            SmilesErrorKind::UnexpectedCharacter(self.bytes[column] as char),
            column,
        ))?;
        let symbol = self.pending.take().map(|(s, _)| s);
        let Some(open) = self.rings[usize::from(ring)].take() else {
            let slot = self.centre_of(atom).map(|c| {
                let list = &mut self.mol.chiral_centres[c].neighbours;
                list.push(PENDING);
                (c, list.len() - 1)
            });
            self.rings[usize::from(ring)] = Some(RingOpen {
                atom,
                bond: symbol,
                column,
                slot,
            });
            return Ok(());
        };
        if open.atom == atom {
            return Err((SmilesErrorKind::RingBondToSelf { ring }, column));
        }
        let (symbol, closing_side) = match (open.bond, symbol) {
            (Some(a), Some(b)) if a != b => {
                return Err((SmilesErrorKind::RingBondConflict { ring }, column))
            }
            (Some(a), _) => (Some(a), false),
            (None, b) => (b, b.is_some()),
        };
        if self.mol.graph.find_edge(open.atom, atom).is_some() {
            return Err((SmilesErrorKind::DuplicateBond { ring }, column));
        }
        let both_aromatic = self.mol.graph[open.atom].aromatic && self.mol.graph[atom].aromatic;
        let bond = make_bond(symbol, open.atom, both_aromatic, closing_side);
        self.mol.add_bond(open.atom, atom, bond);
        if let Some((c, s)) = open.slot {
            self.mol.chiral_centres[c].neighbours[s] = StereoNeighbour::Atom(atom);
        }
        if let Some(c) = self.centre_of(atom) {
            self.mol.chiral_centres[c]
                .neighbours
                .push(StereoNeighbour::Atom(open.atom));
        }
        Ok(())
    }

    /// The error for a `.` with no atom after it.
    fn empty_component(&self) -> Failure {
        (SmilesErrorKind::UnexpectedCharacter('.'), self.last_dot)
    }

    /// Checks that nothing is left open at the end of the input.
    fn finish(&self) -> Result<(), Failure> {
        if let Some((_, column)) = self.pending {
            return Err((SmilesErrorKind::BondToNothing, column));
        }
        if self.prev.is_none() {
            return Err(self.empty_component());
        }
        if let Some(open) = self.branches.last() {
            return Err((SmilesErrorKind::UnclosedBranch, open.column));
        }
        let first_open = self
            .rings
            .iter()
            .enumerate()
            .filter_map(|(ring, open)| open.map(|o| (o.column, ring)))
            .min();
        if let Some((column, ring)) = first_open {
            let ring = ring as u8;
            return Err((SmilesErrorKind::UnclosedRingBond { ring }, column));
        }
        Ok(())
    }
}

/// The bond for a symbol (or none), with `from` the atom written first. `both_aromatic`
/// makes an unwritten bond aromatic. `flip` reverses a `/` or `\` written at the closing end
/// of a ring bond, which reads from the later atom towards the earlier one.
fn make_bond(symbol: Option<BondSymbol>, from: NodeIndex, both_aromatic: bool, flip: bool) -> Bond {
    let (up, down) = if flip {
        (BondDirection::Down, BondDirection::Up)
    } else {
        (BondDirection::Up, BondDirection::Down)
    };
    let mut bond = Bond::new(BondOrder::Single);
    match symbol {
        None => bond.aromatic = both_aromatic,
        Some(BondSymbol::Single) => {}
        Some(BondSymbol::Double) => bond.order = BondOrder::Double,
        Some(BondSymbol::Triple) => bond.order = BondOrder::Triple,
        Some(BondSymbol::Quadruple) => bond.order = BondOrder::Quadruple,
        Some(BondSymbol::Aromatic) => bond.aromatic = true,
        Some(BondSymbol::Up) => bond.direction = Some((from, up)),
        Some(BondSymbol::Down) => bond.direction = Some((from, down)),
    }
    bond
}
