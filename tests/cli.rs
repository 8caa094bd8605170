//! The command line as a user runs it: every input line gives one row, bad lines give located
//! errors, and the output formats parse.

use std::io::Write;
use std::process::{Command, Stdio};

fn ringheat(args: &[&str], stdin: &str) -> (String, String, bool) {
    let mut child = Command::new(env!("CARGO_BIN_EXE_ringheat"))
        .args(args)
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .expect("the binary starts");
    child
        .stdin
        .take()
        .expect("stdin")
        .write_all(stdin.as_bytes())
        .expect("write stdin");
    let out = child.wait_with_output().expect("the binary ends");
    (
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
        out.status.success(),
    )
}

const BATCH: &str = "# a comment\nC1CC1 cyclopropane\n\nC1CC(=O cut short\nc1ccccc1\nC[Xx]\n";

#[test]
fn every_record_gives_one_csv_row_and_errors_name_their_line() {
    let (out, err, ok) = ringheat(&["structure", "--format", "csv"], BATCH);
    assert!(ok, "{err}");
    let mut reader = csv::Reader::from_reader(out.as_bytes());
    let rows: Vec<csv::StringRecord> = reader.records().map(|r| r.expect("csv row")).collect();
    assert_eq!(rows.len(), 4, "{out}");
    let errors: Vec<&str> = rows
        .iter()
        .map(|r| r.get(r.len() - 1).unwrap_or(""))
        .collect();
    assert!(errors[0].is_empty() && errors[2].is_empty());
    assert!(errors[1].starts_with("<stdin>:4:"), "{}", errors[1]);
    assert!(errors[3].starts_with("<stdin>:6:"), "{}", errors[3]);
    assert!(err.contains("2 of 4 records"), "{err}");
}

#[test]
fn table_output_shows_the_caret_under_the_problem() {
    let (out, _, _) = ringheat(&["structure", "C1CC(=O"], "");
    let lines: Vec<&str> = out.lines().collect();
    let at = lines
        .iter()
        .position(|l| l.contains("C1CC(=O") && !l.contains("error"))
        .expect("the input is echoed");
    let caret = lines.get(at + 1).expect("a caret line");
    let column = caret.find('^').expect("a caret") - lines[at].find('C').expect("input");
    assert_eq!(column, 4, "caret under the unclosed branch:\n{out}");
}

#[test]
fn estimate_json_holds_values_and_sources() {
    let (out, err, ok) = ringheat(&["estimate", "--format", "json", "C1CC1", "CC"], "");
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("json");
    let rows = v.as_array().expect("array");
    assert_eq!(rows.len(), 2);
    let hf = rows[0]["estimate"]["hf298_kj"]["value"]
        .as_f64()
        .expect("Hf");
    // Cyclopropane, measured 53.3 kJ/mol (CRC Handbook via the chemicals package).
    assert!((hf - 53.3).abs() < 8.0, "{hf}");
    let terms = rows[0]["estimate"]["terms"].as_array().expect("terms");
    assert!(terms
        .iter()
        .all(|t| !t["source"].as_str().unwrap_or("").is_empty()));
    // Ethane's symmetry number is 18 (recalled from memory; Benson 1976).
    assert_eq!(rows[1]["estimate"]["symmetry"]["total"].as_u64(), Some(18));
}

#[test]
fn explain_lists_terms_symmetry_and_kcal() {
    let (out, err, ok) = ringheat(&["estimate", "--explain", "--kcal", "CC1CO1"], "");
    assert!(ok, "{err}");
    for needle in [
        "C-(C)(H)3",
        "ring",
        "symmetry number",
        "kcal/mol",
        "optical isomers 2",
    ] {
        assert!(out.contains(needle), "missing {needle:?} in\n{out}");
    }
}

#[test]
fn an_element_without_groups_is_an_error_row_not_a_zero() {
    let (out, _, ok) = ringheat(&["estimate", "--format", "csv", "C[Si](C)(C)C"], "");
    assert!(ok);
    assert!(out.contains("element Si has no groups"), "{out}");
}
