//! Maintainer tool: derives groups and ring corrections that the published tables lack, each from
//! one measured compound, and writes them to group-tables/groups-derived.toml,
//! group-tables/rings-derived.toml and group-tables/corrections-derived.toml.
//!
//! Rule (fixed in advance, independent of how well anything fits): a compound of
//! tests/reference/thermo_reference.tsv qualifies when, with every other table entry present, it
//! lacks exactly one group, or else exactly one kind of correction (e.g. `ortho-(F)2`), or else
//! exactly one ring system. For each missing entry the compound with the fewest heavy atoms is
//! used (ties: ATcT before CRC, then CAS number). The value is (measured - sum of the other
//! terms) / occurrences. A compound that would also lean on another entry derived in the same
//! round waits for a later round, so that no value absorbs another's effect. Rounds repeat until
//! nothing new can be derived.
//!
//! When no compound qualifies any more, a compound also qualifies for its one missing ring
//! system when every group it lacks sits on an atom of that ring system and no reference
//! compound has that group outside a ring (thiophene: `S-(Cd)2`), and no correction is missing;
//! the ring correction is then derived with the lacking groups' generic stand-ins in place, as
//! the estimator uses them, and says so; those groups are not derived afterwards (the ring value
//! holds their stand-ins).
//!
//! The compounds used are named in `derived_from`, and the validation test leaves them out of
//! its statistics (tests/derived_entries.rs checks that each is reproduced). Entropies come from
//! the CRC S298, else from the TRC correlation; heat capacities only where the compound's
//! ideal-gas Cp(T) is known at every table temperature (tests/reference/trc_heat_capacity.tsv;
//! one measured Cp298 is not a Cp(T)). Conformational corrections (gauche, 1,5, vicinal) take
//! S and Cp 0.
//!
//! Plausibility (bounds fixed in advance, stated in [`Bounds`]): a derived value that lies outside
//! the bounds of its family is rejected, not shipped: that property of the entry is left out
//! (unknown, and estimates that need it say so), and a rejected Hf298 drops the entry. A group
//! that is the whole compound (halomethanes, ketene, ...) is the measurement itself and is not
//! bounded. Rejections are printed.
//!
//! Run: `cargo run --release --example derive_missing_groups`. For cross-validation
//! (tools/cross_validate.py), `RINGHEAT_DERIVE_EXCLUDE=FILE` names CAS numbers (one a line) the
//! derivation may not use and `RINGHEAT_DERIVE_OUT=DIR` writes the derived files there instead. (or all generators in order:
//! `python3 tools/regenerate.py`)

use std::collections::{BTreeMap, HashMap, HashSet};
use std::fmt::Write as _;
use std::path::{Path, PathBuf};

use ringheat::data::{Cas, DerivedFrom, Property, Provenance};
use ringheat::groups::assign::assign_groups;
use ringheat::groups::interactions::count_interactions;
use ringheat::groups::ring_match::correction_skeletons;
use ringheat::groups::table::{GroupTables, CP_TEMPERATURES_K};
use ringheat::molecule::formula::Formula;
use ringheat::molecule::PerceivedMolecule;
use ringheat::thermo::estimate::{EstimateError, EstimateOptions, GroupAdditivity};

/// Assumed uncertainty of a CRC Handbook Hf298 without its own (kJ/mol): our choice.
const CRC_HF_UNC_KJ: f64 = 2.0;
/// Assumed uncertainty of a CRC Handbook (or TRC correlation) S298 (J/(mol K)): our choice.
const CRC_S_UNC_J: f64 = 2.0;
/// Assumed uncertainty of a Cp from a TRC ideal-gas correlation (J/(mol K)): our choice.
const TRC_CP_UNC_J: f64 = 2.0;

/// Ideal-gas S298 and Cp(T) of one compound from the TRC correlation (trc_heat_capacity.tsv).
struct TrcData {
    s298_j: Option<f64>,
    /// Cp at every table temperature, when the correlation covers them all.
    cp_j: Option<[f64; 7]>,
}

/// TRC data by CAS number.
/// A reference TSV file (`#` comment lines, one header row, tab-separated rows): the column
/// index lookup and the data rows. Panics with the path or column name (a maintainer tool
/// reading the repository's own files).
fn read_tsv(path: &Path) -> (impl Fn(&str) -> usize, Vec<Vec<String>>) {
    let text = std::fs::read_to_string(path).unwrap_or_else(|e| panic!("{}: {e}", path.display()));
    let mut lines = text
        .lines()
        .filter(|l| !l.starts_with('#') && !l.trim().is_empty());
    let header: Vec<String> = lines
        .next()
        .map(|h| h.split('\t').map(str::to_string).collect())
        .unwrap_or_default();
    let rows = lines
        .map(|l| l.split('\t').map(str::to_string).collect())
        .collect();
    let col = move |n: &str| {
        header
            .iter()
            .position(|h| h == n)
            .unwrap_or_else(|| panic!("column {n}"))
    };
    (col, rows)
}

fn read_trc(path: &Path) -> HashMap<String, TrcData> {
    let (col, rows) = read_tsv(path);
    let (c_cas, c_s) = (col("cas"), col("s298_j"));
    let c_cp: Vec<usize> = CP_TEMPERATURES_K
        .iter()
        .map(|t| col(&format!("cp{t}_j")))
        .collect();
    rows.iter()
        .map(|c| {
            let number = |i: usize| c.get(i).and_then(|v| v.parse::<f64>().ok());
            let mut cp = [0.0; 7];
            let mut complete = true;
            for (v, &i) in cp.iter_mut().zip(&c_cp) {
                match number(i) {
                    Some(x) => *v = x,
                    None => complete = false,
                }
            }
            let data = TrcData {
                s298_j: number(c_s),
                cp_j: complete.then_some(cp),
            };
            (c[c_cas].clone(), data)
        })
        .collect()
}

struct Reference {
    cas: String,
    name: String,
    smiles: String,
    hf: f64,
    hf_unc: Option<f64>,
    hf_source: String,
    s: Option<f64>,
    heavy_atoms: u32,
}

fn read_reference(path: &Path) -> Vec<Reference> {
    let (col, rows) = read_tsv(path);
    let (c_cas, c_name, c_smiles, c_hf, c_unc, c_src, c_s) = (
        col("cas"),
        col("name"),
        col("smiles"),
        col("hf298_kj"),
        col("hf298_unc_kj"),
        col("hf_source"),
        col("s298_j"),
    );
    rows.iter()
        .filter_map(|c| {
            let hf = c[c_hf].parse().ok()?;
            let mol = ringheat::molecule::parse_smiles(&c[c_smiles]).ok()?;
            Some(Reference {
                cas: c[c_cas].clone(),
                name: c[c_name].clone(),
                smiles: c[c_smiles].clone(),
                hf,
                hf_unc: c[c_unc].parse().ok(),
                hf_source: c[c_src].clone(),
                s: c[c_s].parse().ok(),
                heavy_atoms: Formula::of(&mol).heavy_atoms(),
            })
        })
        .collect()
}

/// Order of preference among candidate compounds: fewest heavy atoms, ATcT first, CAS number.
type Priority = (u32, bool, String);

fn priority(r: &Reference) -> Priority {
    (
        r.heavy_atoms,
        !r.hf_source.starts_with("ATcT"),
        r.cas.clone(),
    )
}

/// Group keys that some reference compound has on an atom outside every ring: such a group is
/// not a ring's own and must not be absorbed into a ring correction. (Ring-only within the
/// reference set, not by structure: a group absorbed this way, such as `S-(Cb)2`, can occur in
/// chains too; the ring entry's source says which stand-ins it holds, and a table that later
/// gives the group a value makes the regenerated ring entry an ordinary derivation.)
fn groups_outside_rings(refs: &[Reference]) -> HashSet<String> {
    let mut out = HashSet::new();
    for r in refs {
        let Ok(p) = PerceivedMolecule::from_smiles(&r.smiles) else {
            continue;
        };
        let Ok(assignment) = assign_groups(&p) else {
            continue;
        };
        for g in &assignment.groups {
            if !p
                .rings
                .rings
                .iter()
                .any(|ring| ring.atoms.contains(&g.atom))
            {
                out.insert(g.key.to_string());
            }
        }
    }
    out
}

/// Whether the compound lacks exactly one ring system and, besides it, only groups whose atoms
/// all lie in that ring system, that occur nowhere else in the reference set and that have a
/// generic stand-in, with every counted correction in the tables.
fn lacks_only_ring_groups(
    engine: &GroupAdditivity,
    p: &PerceivedMolecule,
    missing: &[ringheat::thermo::estimate::MissingGroup],
    outside_rings: &HashSet<String>,
) -> bool {
    if missing
        .iter()
        .any(|m| outside_rings.contains(&m.key.to_string()))
    {
        return false;
    }
    let skeletons = correction_skeletons(p);
    let [skeleton] = skeletons.as_slice() else {
        return false;
    };
    let Ok(assignment) = assign_groups(p) else {
        return false;
    };
    let on_ring = assignment
        .groups
        .iter()
        .filter(|g| missing.iter().any(|m| m.key == g.key))
        .all(|g| skeleton.atoms.contains(&g.atom));
    // A correction the tables lack (dropped, or taken from its fallback) would be absorbed too.
    let interactions = count_interactions(p, &assignment.types);
    if interactions
        .counts
        .iter()
        .any(|c| engine.tables.correction(&c.name).is_none())
    {
        return false;
    }
    let Ok(est) = engine.estimate(p, &EstimateOptions::default()) else {
        return false;
    };
    let ring_fallback = est.terms.iter().any(|t| t.is_ring_stand_in());
    on_ring && ring_fallback
}

fn toml_string(s: &str) -> String {
    format!("\"{}\"", s.replace('\\', "\\\\").replace('"', "\\\""))
}

/// Entropy a halogen ligand adds over a hydrogen on the same centre, cal/(mol K): the means of
/// S. W. Benson's published pairs Cb-(X)/Cb-(H), Cd-(X)(H)/Cd-(H)2 and C-(X)(H)2(C)/C-(H)3(C)
/// (Thermochemical Kinetics, 2nd ed., Wiley 1976, Appendix A; recalled from memory): F 4.9,
/// Cl 7.5, Br 10.4, I 12.6. Used only to put halogen groups on their hydrogen family's scale.
const HALOGEN_ENTROPY_OVER_H_CAL: [(&str, f64); 4] =
    [("F", 4.9), ("Cl", 7.5), ("Br", 10.4), ("I", 12.6)];
/// Heat capacity at 300 K a halogen ligand adds over a hydrogen, cal/(mol K): about 3 (our
/// reading of Benson's pairs: Cb-(F)/Cb-(H) 3.1, C-(Cl)(H)2(C)/C-(H)3(C) 2.7, C-(Cl)3(C)/C-(H)3(C)
/// 3.4 per Cl; recalled from memory). Used only for the Cp bound.
const HALOGEN_CP300_OVER_H_CAL: f64 = 3.0;
const CAL: f64 = 4.184;

/// (centre, number of H and halogen ligands): a group family.
type Family = (String, u32);
/// (min, max) of S298 on the hydrogen scale and of Cp300, J/(mol K).
type FamilyRange = ((f64, f64), (f64, f64));
/// Why a derived value is implausible: (property, reason) per rejected property.
type Rejections = Vec<(&'static str, String)>;
/// The plausibility test of one derived entry: (whole compound, hf, s, cp) -> rejections.
type BoundTest<'a> = &'a dyn Fn(bool, f64, Option<f64>, Option<&[f64]>) -> Rejections;

/// Plausibility bounds of derived values (fixed in advance; our choice, from the spread of
/// Benson's published values of each family):
/// - non-ring corrections (gauche, 1,5, cis, ortho, vicinal): |Hf298| <= 10 kcal/mol,
///   |S298| <= 3 cal/(mol K), |Cp| <= 3 cal/(mol K) at every temperature (the published alkane,
///   alkene and benzene corrections lie well inside);
/// - ring corrections, per ring of the system: -20 <= Hf298 <= 60 kcal/mol, -10 <= S298 <= 40
///   cal/(mol K), -15 <= Cp300 <= 5 cal/(mol K) (cyclopropane 27.6 kcal/mol and 32.1
///   cal/(mol K), thiophene's resonance about -15 kcal/mol);
/// - groups: S298 on the hydrogen scale (each halogen ligand less its
///   [`HALOGEN_ENTROPY_OVER_H_CAL`]) within 8 cal/(mol K) of the range of the non-derived groups
///   of the same family (centre type and number of H and halogen ligands) in the tables, and
///   Cp300 (each halogen less [`HALOGEN_CP300_OVER_H_CAL`]) within 5 cal/(mol K) of that
///   family's range; a family with no such member is not bounded.
struct Bounds {
    /// (centre, monovalent ligands) -> (min, max) of S298 on the hydrogen scale and of Cp300,
    /// J/(mol K), over the non-derived groups of the tables.
    families: HashMap<Family, FamilyRange>,
}

/// Centre type and number of monovalent (H, halogen) ligands of a group, and its entropy and
/// Cp300 shifts to the hydrogen scale (J/(mol K)).
fn family_of(key: &ringheat::groups::GroupKey) -> ((String, u32), f64, f64) {
    let mut mono = 0;
    let mut shift = 0.0;
    let mut cp_shift = 0.0;
    for (name, n) in &key.ligands {
        if name.symbol() == "H" {
            mono += *n as u32;
        }
        if let Some((_, ds)) = HALOGEN_ENTROPY_OVER_H_CAL
            .iter()
            .find(|(x, _)| *x == name.symbol())
        {
            mono += *n as u32;
            shift += *n as f64 * ds * CAL;
            cp_shift += *n as f64 * HALOGEN_CP300_OVER_H_CAL * CAL;
        }
    }
    ((key.centre.to_string(), mono), shift, cp_shift)
}

impl Bounds {
    fn from_tables(tables: &GroupTables) -> Bounds {
        let mut families: HashMap<Family, FamilyRange> = HashMap::new();
        for g in tables.groups() {
            if !g.provenance.is_empty() || g.same_as.is_some() {
                continue;
            }
            let v = &g.values;
            if !(v.known.s && v.known.cp) {
                continue;
            }
            let (fam, shift, cp_shift) = family_of(&g.key);
            let (s, cp) = (v.s_j - shift, v.cp_j[0] - cp_shift);
            let e = families
                .entry(fam)
                .or_insert(((f64::MAX, f64::MIN), (f64::MAX, f64::MIN)));
            e.0 = (e.0 .0.min(s), e.0 .1.max(s));
            e.1 = (e.1 .0.min(cp), e.1 .1.max(cp));
        }
        Bounds { families }
    }

    /// Why a derived group value is implausible, if it is: (property, reason).
    fn group(&self, key: &str, s: Option<f64>, cp300: Option<f64>) -> Rejections {
        let Ok(k) = ringheat::groups::GroupKey::parse(key) else {
            return Vec::new();
        };
        let (fam, shift, cp_shift) = family_of(&k);
        let Some(((smin, smax), (cmin, cmax))) = self.families.get(&fam) else {
            return Vec::new();
        };
        let mut out = Vec::new();
        if let Some(s) = s {
            let sh = s - shift;
            if sh < smin - 8.0 * CAL || sh > smax + 8.0 * CAL {
                out.push((
                    "s",
                    format!(
                        "S298 {:.1} cal/(mol K) ({:.1} on the hydrogen scale) outside the {} family range {:.1}..{:.1} widened by 8",
                        s / CAL,
                        sh / CAL,
                        fam.0,
                        smin / CAL,
                        smax / CAL
                    ),
                ));
            }
        }
        if let Some(c) = cp300.map(|c| c - cp_shift) {
            if c < cmin - 5.0 * CAL || c > cmax + 5.0 * CAL {
                out.push((
                    "cp",
                    format!(
                        "Cp300 {:.1} cal/(mol K) on the hydrogen scale outside the {} family range \
                         {:.1}..{:.1} widened by 5",
                        c / CAL,
                        fam.0,
                        cmin / CAL,
                        cmax / CAL
                    ),
                ));
            }
        }
        out
    }
}

/// Why a derived correction (rings: `rings` > 0 rings in the system) is implausible.
fn correction_bounds(rings: usize, hf: f64, s: Option<f64>, cp: Option<&[f64]>) -> Rejections {
    let mut out = Vec::new();
    let n = rings as f64;
    let (hf_lo, hf_hi, s_lo, s_hi, cp_lo, cp_hi) = if rings == 0 {
        (-10.0, 10.0, -3.0, 3.0, -3.0, 3.0)
    } else {
        (-20.0 * n, 60.0 * n, -10.0, 40.0 * n, -15.0 * n, 5.0 * n)
    };
    let what = if rings == 0 {
        "non-ring correction"
    } else {
        "ring correction"
    };
    if hf / CAL < hf_lo || hf / CAL > hf_hi {
        out.push((
            "hf",
            format!(
                "Hf298 {:.1} kcal/mol outside {hf_lo}..{hf_hi} for a {what}",
                hf / CAL
            ),
        ));
    }
    if let Some(s) = s {
        if s / CAL < s_lo || s / CAL > s_hi {
            out.push((
                "s",
                format!(
                    "S298 {:.1} cal/(mol K) outside {s_lo}..{s_hi} for a {what}",
                    s / CAL
                ),
            ));
        }
    }
    if let Some(cp) = cp {
        let bad = if rings == 0 {
            cp.iter().any(|c| c / CAL < cp_lo || c / CAL > cp_hi)
        } else {
            cp[0] / CAL < cp_lo || cp[0] / CAL > cp_hi
        };
        if bad {
            out.push((
                "cp",
                format!(
                    "Cp {:.1} cal/(mol K) at 300 K outside {cp_lo}..{cp_hi} for a {what}",
                    cp[0] / CAL
                ),
            ));
        }
    }
    out
}

/// Upper bound on derivation rounds (each round may enable the next).
const ROUNDS: u32 = 16;

const META: &str = "[meta]\nenthalpy_unit = \"kJ/mol\"\nentropy_unit = \"J/(mol K)\"\n\
cp_temperatures = [300, 400, 500, 600, 800, 1000, 1500]\n";

fn main() {
    let root = PathBuf::from(env!("CARGO_MANIFEST_DIR"));
    let tables_dir = root.join("group-tables");
    // Cross-validation (tools/cross_validate.py): compounds to leave out, and where to write.
    let excluded: HashSet<String> = std::env::var("RINGHEAT_DERIVE_EXCLUDE")
        .ok()
        .map(|path| {
            std::fs::read_to_string(&path)
                .unwrap_or_else(|e| panic!("{path}: {e}"))
                .lines()
                .map(|l| l.trim().to_string())
                .filter(|l| !l.is_empty())
                .collect()
        })
        .unwrap_or_default();
    let out_dir = std::env::var("RINGHEAT_DERIVE_OUT")
        .map(PathBuf::from)
        .unwrap_or_else(|_| tables_dir.clone());
    let refs: Vec<Reference> = read_reference(&root.join("tests/reference/thermo_reference.tsv"))
        .into_iter()
        .filter(|r| !excluded.contains(&r.cas))
        .collect();
    let trc = read_trc(&root.join("tests/reference/trc_heat_capacity.tsv"));
    let outside_rings = groups_outside_rings(&refs);
    let work = root.join("target/derive-groups");
    let _ = std::fs::remove_dir_all(&work);
    std::fs::create_dir_all(&work).expect("work dir");
    for entry in std::fs::read_dir(&tables_dir).expect("group-tables") {
        let path = entry.expect("entry").path();
        let name = path.file_name().and_then(|n| n.to_str()).unwrap_or("");
        if name.ends_with(".toml") && !name.ends_with("-derived.toml") {
            std::fs::copy(&path, work.join(name)).expect("copy");
        }
    }
    // Compounds already used by other files' derivations stay unavailable.
    let base = GroupTables::load_dir(&work).expect("tables load");
    let bounds = Bounds::from_tables(&base);
    let mut used: HashSet<String> = HashSet::new();
    used.extend(base.derived_cas(Property::Hf298));
    let mut groups_out = String::new();
    let mut rings_out = String::new();
    let mut corrections_out = String::new();
    let strict = EstimateOptions {
        strict: true,
        ..EstimateOptions::default()
    };
    let lenient = EstimateOptions::default();
    // Groups whose generic stand-ins a joint ring derivation absorbed: never derived afterwards,
    // or the ring value would count them twice.
    let mut absorbed: HashSet<String> = HashSet::new();
    // Candidates of the latest round that could not be derived (reported at the end).
    let mut not_derived: Vec<String> = Vec::new();
    // Set after a round that derived nothing: the next round tries the joint ring derivations.
    let mut stalled = false;
    for round in 1..=ROUNDS {
        let engine = GroupAdditivity::new(GroupTables::load_dir(&work).expect("tables load"))
            .expect("ring patterns");
        // Missing key -> (priority, reference index, occurrences).
        let mut group_candidates: BTreeMap<String, (Priority, usize, u32)> = BTreeMap::new();
        let mut ring_candidates: Vec<(Priority, usize)> = Vec::new();
        // Compounds lacking one ring system and only groups on its atoms (see the doc comment).
        let mut joint_candidates: Vec<(Priority, usize)> = Vec::new();
        let mut correction_candidates: BTreeMap<String, (Priority, usize, u32)> = BTreeMap::new();
        for (i, r) in refs.iter().enumerate() {
            if used.contains(&r.cas) {
                continue;
            }
            let Ok(p) = PerceivedMolecule::from_smiles(&r.smiles) else {
                continue;
            };
            match engine.estimate(&p, &strict) {
                Err(EstimateError::MissingGroups(m))
                    if stalled && lacks_only_ring_groups(&engine, &p, &m, &outside_rings) =>
                {
                    joint_candidates.push((priority(r), i));
                }
                Err(EstimateError::MissingGroups(m))
                    if m.len() == 1 && !absorbed.contains(&m[0].key.to_string()) =>
                {
                    let key = m[0].key.to_string();
                    let cand = (priority(r), i, m[0].count);
                    let better = group_candidates.get(&key).is_none_or(|c| cand.0 < c.0);
                    if better {
                        group_candidates.insert(key, cand);
                    }
                }
                Err(EstimateError::MissingCorrections(m)) if m.len() == 1 => {
                    let cand = (priority(r), i, m[0].1);
                    let better = correction_candidates
                        .get(&m[0].0)
                        .is_none_or(|c| cand.0 < c.0);
                    if better {
                        correction_candidates.insert(m[0].0.clone(), cand);
                    }
                }
                Err(EstimateError::MissingRings(1)) if correction_skeletons(&p).len() == 1 => {
                    ring_candidates.push((priority(r), i));
                }
                _ => {}
            }
        }
        // Joint candidates only once nothing else can be derived, so that the stand-ins they
        // absorb are final; that round derives nothing else.
        let mut joint: HashSet<usize> = HashSet::new();
        if stalled {
            joint = joint_candidates.iter().map(|c| c.1).collect();
            ring_candidates = joint_candidates;
            group_candidates.clear();
            correction_candidates.clear();
        }
        // One ring candidate per distinct skeleton.
        ring_candidates.sort();
        let mut ring_chosen: Vec<usize> = Vec::new();
        for (_, i) in &ring_candidates {
            let p = PerceivedMolecule::from_smiles(&refs[*i].smiles).expect("parsed before");
            let s = correction_skeletons(&p).remove(0);
            let dup = ring_chosen.iter().any(|j| {
                let q = PerceivedMolecule::from_smiles(&refs[*j].smiles).expect("parsed");
                correction_skeletons(&q).remove(0).same_as(&s)
            });
            if !dup {
                ring_chosen.push(*i);
            }
        }
        if group_candidates.is_empty() && ring_chosen.is_empty() && correction_candidates.is_empty()
        {
            if stalled {
                println!("round {round}: nothing more to derive");
                break;
            }
            // Nothing qualifies by the plain rule: try the joint ring derivations next.
            println!("round {round}: nothing by the plain rule");
            stalled = true;
            continue;
        }
        // Zero placeholders, then the estimate of each chosen compound gives the rest.
        let mut placeholder = String::from(META);
        for key in group_candidates.keys() {
            let _ = writeln!(
                placeholder,
                "\n[[group]]\nkey = {}\nhf = 0.0\ns = 0.0\ncp = [0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0]\nunc_hf = 0.0\nunc_s = 0.0\nunc_cp = 0.0\nsource = \"placeholder\"",
                toml_string(key)
            );
        }
        for name in correction_candidates.keys() {
            let _ = writeln!(
                placeholder,
                "\n[[correction]]\nname = {}\nhf = 0.0\ns = 0.0\ncp = [0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0]\nunc_hf = 0.0\nunc_s = 0.0\nunc_cp = 0.0\ncounting = \"placeholder\"\nsource = \"placeholder\"",
                toml_string(name)
            );
        }
        for (n, i) in ring_chosen.iter().enumerate() {
            let _ = writeln!(
                placeholder,
                "\n[[ring]]\nname = \"placeholder {n}\"\nsmiles = {}\nhf = 0.0\ns = 0.0\ncp = [0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0]\nunc_hf = 0.0\nunc_s = 0.0\nunc_cp = 0.0\nsource = \"placeholder\"",
                toml_string(&refs[*i].smiles)
            );
        }
        std::fs::write(work.join("zz-placeholder.toml"), &placeholder).expect("write");
        let probe = GroupAdditivity::new(GroupTables::load_dir(&work).expect("placeholder load"))
            .expect("placeholder rings");
        let mut derived_groups = String::new();
        let mut derived_rings = String::new();
        let mut derived_corrections = String::new();
        let mut count = 0;
        not_derived.clear();
        // `own`: the label of the placeholder term this compound derives; an estimate that also
        // leans on another placeholder (an entry derived in the same round) would absorb that
        // entry's effect as well, so it waits for a later round.
        let emit = |out: &mut String,
                    head: &str,
                    own: &str,
                    r: &Reference,
                    n: u32,
                    stand_ins: bool,
                    conformational: bool,
                    bound: BoundTest|
         -> bool {
            let Ok(p) = PerceivedMolecule::from_smiles(&r.smiles) else {
                return false;
            };
            let options = if stand_ins { &lenient } else { &strict };
            let est = match probe.estimate(&p, options) {
                Ok(est) => est,
                Err(e) => {
                    println!("  {} ({}) not derivable: {e}", r.name, r.cas);
                    return false;
                }
            };
            if let Some(other) = est
                .terms
                .iter()
                .find(|t| t.source == "placeholder" && t.label != own)
            {
                println!(
                    "  {} ({}) waits: it also needs {}, derived in this round",
                    r.name, r.cas, other.label
                );
                return false;
            }
            let with = if stand_ins {
                let names: Vec<String> = est
                    .terms
                    .iter()
                    .filter_map(|t| t.stand_in().map(|n| format!("{} ({n})", t.label)))
                    .collect();
                format!(
                    ", with the generic stand-ins for {} in place (valid with those stand-ins: \
                     if a table gives these groups values, regenerate)",
                    names.join(", ")
                )
            } else {
                String::new()
            };
            let Some(est_hf) = est.hf298_kj else {
                println!("  {} ({}) not derivable: no Hf298 estimate", r.name, r.cas);
                return false;
            };
            let k = n as f64;
            let meas_unc = r.hf_unc.unwrap_or(CRC_HF_UNC_KJ);
            let hf = (r.hf - est_hf.value) / k;
            let unc_hf = meas_unc.hypot(est_hf.uncertainty) / k;
            let mut what = format!(
                "Hf298 {:.2} kJ/mol ({}, thermo_reference.tsv)",
                r.hf, r.hf_source
            );
            // Values first, then the plausibility bounds, then the entry.
            let mut s_value: Option<(f64, f64)> = None;
            let mut cp_value: Option<(Vec<f64>, f64)> = None;
            let mut s_what = String::new();
            let mut cp_what = String::new();
            if conformational {
                s_value = Some((0.0, 0.0));
                cp_value = Some((vec![0.0; 7], 0.0));
                s_what = "; S and Cp taken as 0, as Benson does for the alkane gauche and 1,5 \
                          corrections (our choice for the other conformational corrections)"
                    .to_string();
            } else {
                let trc_of = trc.get(&r.cas);
                let s_measured = match (r.s, trc_of.and_then(|t| t.s298_j)) {
                    (Some(s), _) => Some((s, "CRC, thermo_reference.tsv")),
                    (None, Some(s)) => Some((s, "TRC correlation, trc_heat_capacity.tsv")),
                    (None, None) => None,
                };
                if let (Some((s_meas, s_from)), Some(s_est)) = (s_measured, est.s298_j) {
                    let s = (s_meas - s_est.value) / k;
                    let unc_s = CRC_S_UNC_J.hypot(s_est.uncertainty) / k;
                    s_value = Some((s, unc_s));
                    s_what = format!(" and S298 {s_meas:.2} J/(mol K) ({s_from})");
                }
                if let (Some(cp_meas), Some(cp_est)) = (trc_of.and_then(|t| t.cp_j), est.cp_j) {
                    let cp: Vec<f64> = cp_meas
                        .iter()
                        .zip(&cp_est)
                        .map(|(m, e)| (m - e.value) / k)
                        .collect();
                    let unc_cp = cp_est
                        .iter()
                        .map(|e| TRC_CP_UNC_J.hypot(e.uncertainty) / k)
                        .fold(0.0, f64::max);
                    cp_value = Some((cp, unc_cp));
                    cp_what = " and ideal-gas Cp(T) at 300-1500 K (TRC correlation, \
                               trc_heat_capacity.tsv)"
                        .to_string();
                }
            }
            let whole = est.terms.len() == 1 && n == 1;
            let rejected = bound(
                whole,
                hf,
                s_value.map(|v| v.0),
                cp_value.as_ref().map(|v| v.0.as_slice()),
            );
            for (prop, why) in &rejected {
                println!(
                    "  rejected {prop} of {own} from {} ({}): {why}",
                    r.name, r.cas
                );
            }
            let rejected_prop = |p: &str| rejected.iter().any(|(q, _)| *q == p);
            if rejected_prop("hf") {
                return false;
            }
            let _ = write!(out, "\n{head}\nhf = {hf:.2}\nunc_hf = {unc_hf:.2}\n");
            if let Some((s, unc_s)) = s_value.filter(|_| !rejected_prop("s")) {
                let _ = write!(out, "s = {s:.2}\nunc_s = {unc_s:.2}\n");
                what.push_str(&s_what);
            }
            if let Some((cp, unc_cp)) = cp_value.clone().filter(|_| !rejected_prop("cp")) {
                let cp: Vec<String> = cp.iter().map(|c| format!("{c:.2}")).collect();
                let _ = write!(out, "cp = [{}]\nunc_cp = {unc_cp:.2}\n", cp.join(", "));
                what.push_str(&cp_what);
            }
            let mut derived = vec![Property::Hf298];
            if !conformational {
                if s_value.is_some() && !rejected_prop("s") {
                    derived.push(Property::S298);
                }
                if cp_value.is_some() && !rejected_prop("cp") {
                    derived.push(Property::Cp);
                }
            }
            let provenance = Provenance {
                derived_from: vec![DerivedFrom {
                    cas: Cas::parse(&r.cas).expect("reference CAS numbers are well formed"),
                    name: r.name.clone(),
                    properties: derived,
                }],
            };
            for (prop, why) in &rejected {
                what.push_str(&format!(
                    "; {prop} not shipped: the derived value is implausible ({why}; bounds in \
                     examples/derive_missing_groups.rs)"
                ));
            }
            let _ = write!(
                out,
                "derived_from = {}\nsource = {}\n",
                provenance.to_toml().unwrap_or_default(),
                toml_string(&format!(
                    "Derived from one measured compound: {} (CAS {}): {}, minus the other \
                     terms of ringheat's tables{with}, divided by {} occurrence(s); measured \
                     values as carried by the chemicals 1.5.2 package, files in \
                     tests/reference/ (examples/derive_missing_groups.rs, round {round})",
                    r.name, r.cas, what, n
                ))
            );
            true
        };
        for (key, (_, i, n)) in &group_candidates {
            let r = &refs[*i];
            if emit(
                &mut derived_groups,
                &format!("[[group]]\nkey = {}", toml_string(key)),
                key,
                r,
                *n,
                false,
                false,
                &|whole, _hf, s, cp| {
                    if whole {
                        Vec::new()
                    } else {
                        bounds.group(key, s, cp.map(|c| c[0]))
                    }
                },
            ) {
                used.insert(r.cas.clone());
                count += 1;
            } else {
                not_derived.push(format!("group {key} ({})", r.name));
            }
        }
        for (name, (_, i, n)) in &correction_candidates {
            let r = &refs[*i];
            let head = format!(
                "[[correction]]\nname = {}\ncounting = {}",
                toml_string(name),
                toml_string(
                    "as the code counts it (src/groups/interactions.rs): per occurrence of this \
                     interaction type"
                )
            );
            // Conformational corrections carry no entropy or heat capacity in Benson's scheme;
            // vicinal halogen pairs are treated as gauche-like interactions.
            let conformational = name.starts_with("gauche")
                || name.starts_with("1,5-interaction")
                || name.starts_with("vicinal");
            if emit(
                &mut derived_corrections,
                &head,
                name,
                r,
                *n,
                false,
                conformational,
                &|_, hf, s, cp| correction_bounds(0, hf, s, cp),
            ) {
                used.insert(r.cas.clone());
                count += 1;
            } else {
                not_derived.push(format!("correction {name} ({})", r.name));
            }
        }
        for (n, i) in ring_chosen.iter().enumerate() {
            let r = &refs[*i];
            let head = format!(
                "[[ring]]\nname = {}\nsmiles = {}",
                toml_string(&format!("ring of {}", r.name)),
                toml_string(&r.smiles)
            );
            let own = format!("placeholder {n}");
            let ring_count = PerceivedMolecule::from_smiles(&r.smiles)
                .map(|p| p.rings.rings.len())
                .unwrap_or(1)
                .max(1);
            if emit(
                &mut derived_rings,
                &head,
                &own,
                r,
                1,
                joint.contains(i),
                false,
                &|_, hf, s, cp| correction_bounds(ring_count, hf, s, cp),
            ) {
                if joint.contains(i) {
                    if let Ok(p) = PerceivedMolecule::from_smiles(&r.smiles) {
                        if let Err(EstimateError::MissingGroups(m)) = engine.estimate(&p, &strict) {
                            absorbed.extend(m.iter().map(|g| g.key.to_string()));
                        }
                    }
                }
                used.insert(r.cas.clone());
                count += 1;
            } else {
                not_derived.push(format!("ring system of {}", r.name));
            }
        }
        let _ = std::fs::remove_file(work.join("zz-placeholder.toml"));
        groups_out.push_str(&derived_groups);
        corrections_out.push_str(&derived_corrections);
        std::fs::write(
            work.join("corrections-derived.toml"),
            format!("{META}{corrections_out}"),
        )
        .expect("write");
        rings_out.push_str(&derived_rings);
        std::fs::write(
            work.join("groups-derived.toml"),
            format!("{META}{groups_out}"),
        )
        .expect("write");
        std::fs::write(
            work.join("rings-derived.toml"),
            format!("{META}{rings_out}"),
        )
        .expect("write");
        println!("round {round}: derived {count} entries");
        if round == ROUNDS {
            println!(
                "stopped after {ROUNDS} rounds with entries still being derived: raise ROUNDS"
            );
        }
        if count == 0 && stalled {
            break;
        }
        stalled = count == 0;
    }
    if !not_derived.is_empty() {
        println!(
            "left underived (their best compound needs something no compound supplies): {}",
            not_derived.join("; ")
        );
    }
    let header = |what: &str| {
        format!(
            "# {what} that the published tables lack, each derived from one measured compound.\n\
             # Generated by `cargo run --release --example derive_missing_groups` (run by\n\
             # `python3 tools/regenerate.py`; the rule is in examples/derive_missing_groups.rs);\n\
             # do not edit by hand: fix the published tables or the rule and regenerate.\n\
             # The compounds named in derived_from are left out of the validation statistics.\n"
        )
    };
    std::fs::write(
        out_dir.join("groups-derived.toml"),
        format!("{}{META}{groups_out}", header("Benson groups")),
    )
    .expect("write groups-derived.toml");
    std::fs::write(
        out_dir.join("rings-derived.toml"),
        format!("{}{META}{rings_out}", header("Ring corrections")),
    )
    .expect("write rings-derived.toml");
    std::fs::write(
        out_dir.join("corrections-derived.toml"),
        format!("{}{META}{corrections_out}", header("Non-ring corrections")),
    )
    .expect("write corrections-derived.toml");
    println!("wrote group-tables/{{groups,rings,corrections}}-derived.toml");
}
