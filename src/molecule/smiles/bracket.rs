//! Bracket atoms: `[` isotope? symbol chirality? hydrogens? charge? class? `]`.

use super::error::{BracketProblem, SmilesErrorKind};
use crate::molecule::element::Element;
use crate::molecule::graph::{Atom, ChiralTag};

/// A bracket atom as read: the atom (hydrogens = the written H count) and its chirality tag.
#[derive(Debug, PartialEq)]
pub(super) struct BracketAtom {
    pub atom: Atom,
    pub chirality: Option<ChiralTag>,
}

/// A failure: the kind and the byte column it belongs to.
type Failure = (SmilesErrorKind, usize);

/// Largest charge magnitude the OpenSMILES specification allows.
const MAX_CHARGE: i32 = 15;

/// Lower-case symbols that may be written in brackets as aromatic atoms.
/// Two-letter ones come first so that `se` is not read as `s`.
const AROMATIC_SYMBOLS: [(&str, u8); 9] = [
    ("se", 34),
    ("as", 33),
    ("te", 52),
    ("b", 5),
    ("c", 6),
    ("n", 7),
    ("o", 8),
    ("p", 15),
    ("s", 16),
];

/// A cursor over the bytes of a bracket atom.
struct Cursor<'a> {
    bytes: &'a [u8],
    pos: usize,
}

impl Cursor<'_> {
    fn peek(&self) -> Option<u8> {
        self.bytes.get(self.pos).copied()
    }

    fn peek_at(&self, ahead: usize) -> Option<u8> {
        self.bytes.get(self.pos + ahead).copied()
    }

    fn eat(&mut self, b: u8) -> bool {
        let hit = self.peek() == Some(b);
        self.pos += usize::from(hit);
        hit
    }

    /// Reads a run of at most `max_digits` decimal digits; `None` if there is none.
    fn number(&mut self, max_digits: usize) -> Option<u64> {
        let mut value: u64 = 0;
        let mut n = 0;
        while n < max_digits {
            match self.peek() {
                Some(d @ b'0'..=b'9') => {
                    value = value * 10 + u64::from(d - b'0');
                    self.pos += 1;
                    n += 1;
                }
                _ => break,
            }
        }
        (n > 0).then_some(value)
    }

    /// The problem "unexpected character here", or "unterminated" at the end of input.
    fn unexpected(&self, open: usize) -> Failure {
        match self.peek() {
            None => bad(BracketProblem::Unterminated, open),
            Some(_) => {
                let c = char_at(self.bytes, self.pos);
                bad(BracketProblem::Unexpected(c), self.pos)
            }
        }
    }
}

fn bad(problem: BracketProblem, column: usize) -> Failure {
    (SmilesErrorKind::BadBracketAtom(problem), column)
}

/// The (possibly multi-byte) character starting at `pos`.
pub(super) fn char_at(bytes: &[u8], pos: usize) -> char {
    let end = (pos + 4).min(bytes.len());
    let slice = &bytes[pos.min(end)..end];
    let text = match std::str::from_utf8(slice) {
        Ok(t) => t,
        Err(e) => std::str::from_utf8(&slice[..e.valid_up_to()]).unwrap_or(""),
    };
    text.chars().next().unwrap_or('\u{fffd}')
}

/// Reads the bracket atom whose `[` is at `open`; returns it and the index after its `]`.
pub(super) fn read_bracket(bytes: &[u8], open: usize) -> Result<(BracketAtom, usize), Failure> {
    let mut c = Cursor {
        bytes,
        pos: open + 1,
    };
    let isotope_column = c.pos;
    let isotope = match c.number(6) {
        Some(n) => {
            Some(u16::try_from(n).map_err(|_| bad(BracketProblem::Isotope, isotope_column))?)
        }
        None => None,
    };
    let (element, aromatic) = read_symbol(&mut c, open)?;
    let mut atom = Atom::new(element);
    atom.isotope = isotope;
    atom.aromatic = aromatic;
    atom.column = open;
    let chirality = read_chirality(&mut c)?;
    if c.eat(b'H') {
        atom.hydrogens = c.number(1).map_or(1, |n| n as u8);
    }
    atom.charge = read_charge(&mut c)?;
    if c.eat(b':') {
        let class_column = c.pos;
        let class = c.number(10).ok_or_else(|| match c.peek() {
            None => bad(BracketProblem::Unterminated, open),
            Some(_) => bad(BracketProblem::AtomClass, class_column),
        })?;
        atom.atom_class =
            Some(u32::try_from(class).map_err(|_| bad(BracketProblem::AtomClass, class_column))?);
    }
    if !c.eat(b']') {
        return Err(c.unexpected(open));
    }
    Ok((BracketAtom { atom, chirality }, c.pos))
}

/// Reads the element symbol: two letters where they name an element, else one.
fn read_symbol(c: &mut Cursor<'_>, open: usize) -> Result<(Element, bool), Failure> {
    let start = c.pos;
    match c.peek() {
        Some(b'A'..=b'Z') => {
            if let Some(second @ b'a'..=b'z') = c.peek_at(1) {
                let pair = [c.bytes[start], second];
                let text = std::str::from_utf8(&pair).unwrap_or("");
                if let Some(e) = Element::from_symbol(text) {
                    c.pos += 2;
                    return Ok((e, false));
                }
            }
            let one = [c.bytes[start]];
            let text = std::str::from_utf8(&one).unwrap_or("");
            match Element::from_symbol(text) {
                Some(e) => {
                    c.pos += 1;
                    Ok((e, false))
                }
                None => Err((SmilesErrorKind::UnknownElement(text.to_string()), start)),
            }
        }
        Some(b'a'..=b'z') => {
            for (symbol, z) in AROMATIC_SYMBOLS {
                let element = Element::from_atomic_number(z);
                if let (true, Some(element)) =
                    (c.bytes[start..].starts_with(symbol.as_bytes()), element)
                {
                    c.pos += symbol.len();
                    return Ok((element, true));
                }
            }
            let letters: String = c.bytes[start..]
                .iter()
                .take_while(|b| b.is_ascii_alphabetic())
                .take(2)
                .map(|&b| b as char)
                .collect();
            Err((SmilesErrorKind::UnknownElement(letters), start))
        }
        Some(b'*') => Err((SmilesErrorKind::UnknownElement("*".to_string()), start)),
        Some(_) => Err(bad(BracketProblem::MissingElement, start)),
        None => Err(bad(BracketProblem::Unterminated, open)),
    }
}

/// Reads an optional chirality tag.
fn read_chirality(c: &mut Cursor<'_>) -> Result<Option<ChiralTag>, Failure> {
    let at = c.pos;
    if !c.eat(b'@') {
        return Ok(None);
    }
    if c.eat(b'@') {
        return Ok(Some(ChiralTag::Clockwise));
    }
    // Only an H count may follow a plain '@' in upper case; other capitals start a class.
    let class = match (c.peek(), c.peek_at(1)) {
        (Some(b'H'), _) | (None, _) => return Ok(Some(ChiralTag::Anticlockwise)),
        (Some(a), Some(b)) if a.is_ascii_uppercase() && b.is_ascii_uppercase() => [a, b],
        (Some(a), _) if a.is_ascii_uppercase() => return Err(bad(BracketProblem::Chirality, at)),
        _ => return Ok(Some(ChiralTag::Anticlockwise)),
    };
    let max = match &class {
        b"TH" | b"AL" => 2,
        b"SP" => 3,
        b"TB" => 20,
        b"OH" => 30,
        _ => return Err(bad(BracketProblem::Chirality, at)),
    };
    c.pos += 2;
    let number = c
        .number(2)
        .filter(|n| (1..=max).contains(n))
        .ok_or_else(|| bad(BracketProblem::Chirality, at))?;
    // @TH1 and @TH2 are defined as the same as @ and @@ (OpenSMILES specification).
    Ok(Some(match (&class, number) {
        (b"TH", 1) => ChiralTag::Anticlockwise,
        (b"TH", 2) => ChiralTag::Clockwise,
        _ => ChiralTag::Other {
            class,
            number: number as u8,
        },
    }))
}

/// Reads an optional charge: `+`, `++`, `+2`, `-`, `--`, `-3`, ...
fn read_charge(c: &mut Cursor<'_>) -> Result<i8, Failure> {
    let at = c.pos;
    let sign: i32 = match c.peek() {
        Some(b'+') => 1,
        Some(b'-') => -1,
        _ => return Ok(0),
    };
    let symbol = if sign > 0 { b'+' } else { b'-' };
    c.pos += 1;
    let magnitude = if let Some(n) = c.number(2) {
        i32::try_from(n).unwrap_or(i32::MAX)
    } else {
        let mut n = 1;
        while c.eat(symbol) {
            n += 1;
        }
        n
    };
    if magnitude > MAX_CHARGE || matches!(c.peek(), Some(b'+' | b'-')) {
        return Err(bad(BracketProblem::Charge, at));
    }
    Ok((sign * magnitude) as i8)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn read(s: &str) -> Result<BracketAtom, Failure> {
        read_bracket(s.as_bytes(), 0).map(|(a, end)| {
            assert_eq!(end, s.len());
            a
        })
    }

    #[test]
    fn full_bracket_atom() {
        let a = read("[13CH4:2]").map_err(|e| e.0).unwrap();
        assert_eq!(a.atom.element, Element::C);
        assert_eq!(a.atom.isotope, Some(13));
        assert_eq!(a.atom.hydrogens, 4);
        assert_eq!(a.atom.atom_class, Some(2));
        assert_eq!(a.chirality, None);
    }

    #[test]
    fn charges() {
        let charge = |s: &str| read(s).map(|a| a.atom.charge).map_err(|e| e.0);
        assert_eq!(charge("[Fe++]"), Ok(2));
        assert_eq!(charge("[Fe+3]"), Ok(3));
        assert_eq!(charge("[O-]"), Ok(-1));
        assert_eq!(charge("[O--]"), Ok(-2));
        assert_eq!(charge("[N+]"), Ok(1));
        for bad_charge in ["[C+-]", "[C+16]", "[C-+]", "[C+2+]"] {
            assert_eq!(
                charge(bad_charge),
                Err(SmilesErrorKind::BadBracketAtom(BracketProblem::Charge)),
                "{bad_charge}"
            );
        }
    }

    #[test]
    fn chirality_classes() {
        let tag = |s: &str| read(s).map(|a| a.chirality).map_err(|e| e.0);
        assert_eq!(tag("[C@H]"), Ok(Some(ChiralTag::Anticlockwise)));
        assert_eq!(tag("[C@@H]"), Ok(Some(ChiralTag::Clockwise)));
        assert_eq!(tag("[C@TH2]"), Ok(Some(ChiralTag::Clockwise)));
        assert_eq!(
            tag("[Co@OH25]"),
            Ok(Some(ChiralTag::Other {
                class: *b"OH",
                number: 25
            }))
        );
        assert_eq!(
            tag("[C@AL1]"),
            Ok(Some(ChiralTag::Other {
                class: *b"AL",
                number: 1
            }))
        );
        for bad_tag in [
            "[C@TH3]", "[C@SP4]", "[C@TB21]", "[C@OH31]", "[C@XY1]", "[C@TB]",
        ] {
            assert_eq!(
                tag(bad_tag),
                Err(SmilesErrorKind::BadBracketAtom(BracketProblem::Chirality)),
                "{bad_tag}"
            );
        }
    }

    #[test]
    fn symbols() {
        let el = |s: &str| {
            read(s)
                .map(|a| (a.atom.element, a.atom.aromatic))
                .map_err(|e| e.0)
        };
        assert_eq!(el("[Cl-]"), Ok((Element::CL, false)));
        assert_eq!(el("[se]"), Ok((Element::SE, true)));
        assert_eq!(el("[nH]"), Ok((Element::N, true)));
        assert_eq!(el("[Hg]"), Ok((Element::from_symbol("Hg").unwrap(), false)));
        assert_eq!(el("[H+]"), Ok((Element::H, false)));
        assert_eq!(el("[Xy]"), Err(SmilesErrorKind::UnknownElement("X".into())));
        assert_eq!(
            el("[xe]"),
            Err(SmilesErrorKind::UnknownElement("xe".into()))
        );
    }

    #[test]
    fn unterminated_and_junk() {
        assert_eq!(read("[CH4"), Err(bad(BracketProblem::Unterminated, 0)));
        assert_eq!(read("[C"), Err(bad(BracketProblem::Unterminated, 0)));
        assert_eq!(read("["), Err(bad(BracketProblem::Unterminated, 0)));
        assert_eq!(read("[C:]"), Err(bad(BracketProblem::AtomClass, 3)));
        assert_eq!(read("[CQ]"), Err(bad(BracketProblem::Unexpected('Q'), 2)));
        assert_eq!(read("[]"), Err(bad(BracketProblem::MissingElement, 1)));
        assert_eq!(read("[99999C]"), Err(bad(BracketProblem::Isotope, 1)));
    }
}
