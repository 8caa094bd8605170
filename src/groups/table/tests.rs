//! Tests of the group-table loader: bad files are rejected with file and key named, the bundled
//! tables load, a user directory replaces entries, `same_as` resolves.

use std::path::{Path, PathBuf};
use std::sync::atomic::{AtomicUsize, Ordering};

use super::*;

/// A fresh directory under the system temp dir, removed on drop.
struct TempDir(PathBuf);

impl TempDir {
    fn new() -> TempDir {
        static COUNTER: AtomicUsize = AtomicUsize::new(0);
        let n = COUNTER.fetch_add(1, Ordering::SeqCst);
        let dir =
            std::env::temp_dir().join(format!("ringheat-table-test-{}-{n}", std::process::id()));
        let _ = std::fs::remove_dir_all(&dir);
        std::fs::create_dir_all(&dir).unwrap();
        TempDir(dir)
    }

    fn write(&self, name: &str, text: &str) -> PathBuf {
        let path = self.0.join(name);
        std::fs::write(&path, text).unwrap();
        path
    }

    fn path(&self) -> &Path {
        &self.0
    }
}

impl Drop for TempDir {
    fn drop(&mut self) {
        let _ = std::fs::remove_dir_all(&self.0);
    }
}

const META_KCAL: &str = r#"[meta]
title = "test"
enthalpy_unit = "kcal/mol"
entropy_unit = "cal/(mol K)"
cp_temperatures = [300, 400, 500, 600, 800, 1000, 1500]
"#;

/// Values used only to exercise the loader; they are not thermochemical data.
const METHYL: &str = r#"
[[group]]
key = "C-(C)(H)3"
hf = -10.0
s = 30.0
cp = [6.0, 8.0, 9.0, 10.0, 12.0, 14.0, 17.0]
unc_hf = 0.2
unc_s = 0.3
unc_cp = 0.3
source = "test value"
"#;

fn load_one(text: &str) -> (TempDir, Result<GroupTables, TableError>) {
    let dir = TempDir::new();
    dir.write("t.toml", text);
    let result = GroupTables::load_dir(dir.path());
    (dir, result)
}

fn error_text(text: &str) -> String {
    match load_one(text).1 {
        Ok(_) => panic!("accepted:\n{text}"),
        Err(e) => e.to_string(),
    }
}

#[test]
fn malformed_toml_names_file_and_line() {
    let text = format!("{META_KCAL}\n[[group]]\nkey = \"C-(C)(H)3\"\nhf = -10.0 oops\n");
    let (dir, result) = load_one(&text);
    let err = result.unwrap_err();
    let msg = err.to_string();
    assert!(
        matches!(err.problem, Problem::Syntax(_)) && err.place.line == Some(9),
        "{msg}"
    );
    assert!(
        msg.contains(&dir.path().join("t.toml").display().to_string()),
        "{msg}"
    );
    assert!(msg.contains(":9:"), "{msg}");
}

#[test]
fn entry_without_source_names_file_and_key() {
    let text = format!(
        "{META_KCAL}{}",
        METHYL.replace("source = \"test value\"", "")
    );
    let (dir, result) = load_one(&text);
    let err = result.unwrap_err();
    let msg = err.to_string();
    assert!(matches!(err.problem, Problem::NoSource), "{msg}");
    let expected = format!(
        "{}:7: group \"C-(C)(H)3\": no source",
        dir.path().join("t.toml").display()
    );
    assert_eq!(msg, expected);
}

#[test]
fn value_without_uncertainty_is_rejected() {
    let msg = error_text(&format!("{META_KCAL}{}", METHYL.replace("unc_s = 0.3", "")));
    assert!(msg.contains("`s` is given without `unc_s`"), "{msg}");
    assert!(msg.contains("C-(C)(H)3"), "{msg}");
}

#[test]
fn wrong_cp_length_is_rejected() {
    let msg = error_text(&format!(
        "{META_KCAL}{}",
        METHYL.replace("cp = [6.0, 8.0,", "cp = [8.0,")
    ));
    assert!(
        msg.contains("`cp` has 6 values but cp_temperatures has 7"),
        "{msg}"
    );
}

#[test]
fn missing_meta_and_unknown_unit_are_rejected() {
    let msg = error_text(METHYL);
    assert!(msg.contains("[meta]: missing"), "{msg}");
    let msg = error_text(&format!(
        "{}{METHYL}",
        META_KCAL.replace("kcal/mol", "kcal per mole")
    ));
    assert!(
        msg.contains("unknown enthalpy_unit \"kcal per mole\""),
        "{msg}"
    );
}

#[test]
fn bad_key_duplicate_and_unknown_field_are_rejected() {
    let msg = error_text(&format!(
        "{META_KCAL}{}",
        METHYL.replace("C-(C)(H)3", "C-(C")
    ));
    assert!(msg.contains("group \"C-(C\""), "{msg}");
    // Ligand order is free, so these two keys are the same group.
    let twice = format!(
        "{META_KCAL}{METHYL}{}",
        METHYL.replace("C-(C)(H)3", "C-(H)3(C)")
    );
    let msg = error_text(&twice);
    assert!(msg.contains("defined twice (first at line 7)"), "{msg}");
    let msg = error_text(&format!(
        "{META_KCAL}{}",
        METHYL.replace("C-(C)(H)3", "C-(Si)(H)3")
    ));
    assert!(
        msg.contains(":7: group \"C-(Si)(H)3\": group key `C-(Si)(H)3`: unknown ligand type `Si`"),
        "{msg}"
    );
    let msg = error_text(&format!("{META_KCAL}{}", METHYL.replace("unc_s", "unc_S")));
    assert!(msg.contains("unc_S"), "{msg}");
}

#[test]
fn same_as_resolves_through_a_chain_and_rejects_cycles_and_gaps() {
    let chain = format!(
        "{META_KCAL}{METHYL}
[[group]]
key = \"C-(Cd)(H)3\"
same_as = \"C-(Ct)(H)3\"
source = \"test convention\"

[[group]]
key = \"C-(Ct)(H)3\"
same_as = \"C-(C)(H)3\"
source = \"test convention\"
"
    );
    let (_dir, result) = load_one(&chain);
    let tables = result.unwrap();
    let key = GroupKey::parse("C-(Cd)(H)3").unwrap();
    let entry = tables.group(&key).unwrap();
    assert_eq!(entry.same_as, Some(GroupKey::parse("C-(Ct)(H)3").unwrap()));
    assert!((entry.values.hf_kj - (-41.84)).abs() < 1e-9);
    assert!(entry.values.known.cp);

    let cycle = chain.replace("same_as = \"C-(C)(H)3\"", "same_as = \"C-(Cd)(H)3\"");
    let msg = error_text(&cycle);
    assert!(msg.contains("same_as forms a cycle"), "{msg}");
    let gap = chain.replace("same_as = \"C-(C)(H)3\"", "same_as = \"C-(O)(H)3\"");
    let msg = error_text(&gap);
    assert!(
        msg.contains("same_as \"C-(O)(H)3\" is not in the tables"),
        "{msg}"
    );
}

#[test]
fn user_directory_replaces_an_entry_and_same_as_follows() {
    let base = TempDir::new();
    base.write(
        "a.toml",
        &format!(
            "{META_KCAL}{METHYL}
[[group]]
key = \"C-(Cb)(H)3\"
same_as = \"C-(C)(H)3\"
source = \"test convention\"
"
        ),
    );
    let user = TempDir::new();
    let user_file = user.write(
        "mine.toml",
        r#"[meta]
enthalpy_unit = "kJ/mol"
entropy_unit = "J/(mol K)"

[[group]]
key = "C-(H)3(C)"
hf = -42.5
unc_hf = 0.5
source = "user's own value"
"#,
    );
    let tables = GroupTables::load_dir(base.path())
        .unwrap()
        .with_extra_dir(user.path())
        .unwrap();
    let methyl = tables
        .group(&GroupKey::parse("C-(C)(H)3").unwrap())
        .unwrap();
    assert_eq!(methyl.values.hf_kj, -42.5);
    assert!(!methyl.values.known.cp && methyl.values.cp_at(300.0).is_none());
    assert_eq!(methyl.origin.file, user_file);
    assert_eq!(methyl.origin.replaced, Some(base.path().join("a.toml")));
    let on_benzene = tables
        .group(&GroupKey::parse("C-(Cb)(H)3").unwrap())
        .unwrap();
    assert_eq!(on_benzene.values.hf_kj, -42.5);
    assert_eq!(tables.files().len(), 2);
}

#[test]
fn cp_interpolates_and_extrapolates_to_298() {
    let (_dir, result) = load_one(&format!("{META_KCAL}{METHYL}"));
    let tables = result.unwrap();
    let v = tables
        .group(&GroupKey::parse("C-(C)(H)3").unwrap())
        .unwrap()
        .values;
    let cal = JOULES_PER_CALORIE;
    assert!((v.cp_at(300.0).unwrap() - 6.0 * cal).abs() < 1e-12);
    assert!((v.cp_at(450.0).unwrap() - 8.5 * cal).abs() < 1e-12);
    assert!((v.cp_at(1500.0).unwrap() - 17.0 * cal).abs() < 1e-12);
    // 300-400 K slope is 2 cal/(mol K) per 100 K.
    let expected_298 = (6.0 - 2.0 * 1.85 / 100.0) * cal;
    assert!((v.cp_298().unwrap() - expected_298).abs() < 1e-12);
    assert!(v.cp_at(250.0).is_none() && v.cp_at(1600.0).is_none());
}

#[test]
fn other_cp_grids_are_interpolated_onto_the_standard_one() {
    let text = r#"[meta]
enthalpy_unit = "kJ/mol"
entropy_unit = "J/(mol K)"
cp_temperatures = [298.15, 500, 1000, 1500]

[[correction]]
name = "test"
counting = "never"
hf = 1.0
s = 0.0
cp = [10.0, 20.0, 30.0, 40.0]
unc_hf = 0.1
unc_s = 0.1
unc_cp = 0.1
source = "test value"
"#;
    let (_dir, result) = load_one(text);
    let tables = result.unwrap();
    let c = tables.correction("test").unwrap();
    assert_eq!(c.values.cp_j[2], 20.0);
    assert!((c.values.cp_j[4] - 26.0).abs() < 1e-12);
}

#[test]
fn bundled_tables_load() {
    let tables = match GroupTables::bundled() {
        Ok(t) => t,
        Err(e) => panic!("bundled tables: {e}"),
    };
    // The bundled files are written by different people: no entry may silently override another.
    for entry in tables.groups() {
        assert!(!entry.source.is_empty(), "{}", entry.key);
        assert!(entry.origin.file.starts_with("group-tables"));
        assert_eq!(entry.origin.replaced, None, "group {}", entry.key);
    }
    for entry in tables.corrections() {
        assert_eq!(entry.origin.replaced, None, "correction {}", entry.name);
    }
    for entry in tables.rings() {
        assert_eq!(entry.origin.replaced, None, "ring {}", entry.name);
    }
    if tables
        .files()
        .iter()
        .any(|f| f.ends_with("groups-hydrocarbons.toml"))
    {
        let methyl = GroupKey::parse("C-(C)(H)3").unwrap();
        assert!(tables.group(&methyl).is_some());
        let on_alkene = tables
            .group(&GroupKey::parse("C-(Cd)(H)3").unwrap())
            .unwrap();
        assert_eq!(on_alkene.values, tables.group(&methyl).unwrap().values);
    }
}

#[test]
fn typed_provenance_is_read_per_property() {
    let text = format!(
        "{META_KCAL}{}derived_from = [{{ cas = \"71-43-2\", name = \"benzene\", properties = [\"hf\"] }}, {{ cas = \"7732-18-5\", name = \"water\", properties = [\"s\", \"cp\"] }}]\n",
        METHYL
    );
    let (_dir, result) = load_one(&text);
    let tables = result.expect("loads");
    let entry = tables
        .group(&GroupKey::parse("C-(C)(H)3").unwrap())
        .unwrap();
    let p = &entry.provenance;
    assert_eq!(p.cas_for(Property::Hf298).collect::<Vec<_>>(), ["71-43-2"]);
    assert_eq!(p.cas_for(Property::Cp).collect::<Vec<_>>(), ["7732-18-5"]);
    assert!(tables.derived_cas(Property::S298).contains("7732-18-5"));
    assert_eq!(tables.provenances().count(), 1);
}

#[test]
fn bad_provenance_is_refused_at_its_entry() {
    let cases = [
        ("derived_from = \"benzene, 71-43-2\"\n", "old prose form"),
        (
            "s_derived_from = \"benzene, 71-43-2\"\n",
            "`s_derived_from` is replaced by derived_from",
        ),
        (
            "derived_from = { cas = \"71-43-3\", name = \"benzene\", properties = [\"hf\"] }\n",
            "check digit",
        ),
    ];
    for (line, expected) in cases {
        let msg = error_text(&format!("{META_KCAL}{METHYL}{line}"));
        assert!(msg.contains(expected), "{msg}");
        assert!(
            msg.contains(":7: group \"C-(C)(H)3\": derived_from"),
            "{msg}"
        );
    }
    // A property the entry does not give cannot have been derived.
    let no_cp = METHYL
        .replace("cp = [6.0, 8.0, 9.0, 10.0, 12.0, 14.0, 17.0]\n", "")
        .replace("unc_cp = 0.3\n", "");
    let msg = error_text(&format!(
        "{META_KCAL}{no_cp}derived_from = {{ cas = \"71-43-2\", name = \"benzene\", properties = [\"cp\"] }}\n"
    ));
    assert!(
        msg.contains("lists `cp`, which this entry does not give"),
        "{msg}"
    );
}
