//! `ringheat polynomials` end to end: YAML entries and error comments, fit-quality views, and
//! refused options.

use std::process::Command;

fn ringheat(args: &[&str]) -> (bool, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_ringheat"))
        .args(args)
        .output()
        .expect("run ringheat");
    (
        out.status.success(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn yaml_has_entries_and_error_comments() {
    let dir = std::env::temp_dir().join(format!("ringheat-poly-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp dir");
    let input = dir.join("species.smi");
    std::fs::write(
        &input,
        "C1CO1 ethylene oxide\nC1COC1 oxetane\nC1CC(\nC1CO1 again\nCCO\n",
    )
    .expect("write input");
    let (ok, yaml, stderr) = ringheat(&[
        "polynomials",
        "--file",
        input.to_str().expect("path"),
        "--phase",
        "gas",
    ]);
    assert!(ok, "{stderr}");
    let names: Vec<&str> = yaml
        .lines()
        .filter_map(|l| l.strip_prefix("- name: "))
        .collect();
    assert_eq!(
        names,
        ["\"ethylene_oxide\"", "\"again\"", "\"C2H6O\"", "\"gas\""]
    );
    let errors: Vec<&str> = yaml
        .lines()
        .filter(|l| l.starts_with("# not exported: "))
        .collect();
    assert_eq!(errors.len(), 2, "{yaml}");
    assert!(errors[0].contains(":2: C1COC1") && errors[0].contains("no heat capacity"));
    assert!(errors[1].contains(":3: C1CC("));
    assert!(
        yaml.contains("model: NASA7")
            && yaml.contains("temperature-ranges: [200.0, 1000.0, 3000.0]")
    );
    assert!(yaml.contains("species: [\"ethylene_oxide\", \"again\", \"C2H6O\"]"));
    assert!(stderr.contains("2 of 5 records"));
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn fit_views_and_ranges() {
    let (ok, csv, _) = ringheat(&["polynomials", "C1CC1", "--format", "csv"]);
    assert!(ok);
    assert!(csv.starts_with("input,formula,atoms,linear,rotors"));
    let (ok, json, _) = ringheat(&[
        "polynomials",
        "CCO",
        "--format",
        "json",
        "--ranges",
        "250,1200,2500",
        "--at",
        "300,2500",
    ]);
    assert!(ok);
    assert!(json.contains("\"t_high_k\": 2500.0") && json.contains("\"nasa_cp_j\""));
    let (ok, _, stderr) = ringheat(&["polynomials", "CCO", "--ranges", "400,1000,3000"]);
    assert!(!ok && stderr.contains("--ranges"), "{stderr}");
    let (ok, _, stderr) = ringheat(&["polynomials", "CCO", "--at", "5000"]);
    assert!(!ok && stderr.contains("--at"), "{stderr}");
}

#[test]
fn poor_fits_are_refused_or_flagged() {
    let (_, yaml, _) = ringheat(&["polynomials", "CC1CO1", "--max-cp-deviation", "0.1"]);
    assert!(yaml.contains("# not exported:") && yaml.contains("NASA-7 fit refused"));
    let (_, yaml, _) = ringheat(&[
        "polynomials",
        "CC1CO1",
        "--max-cp-deviation",
        "0.1",
        "--keep-poor-fits",
    ]);
    assert!(yaml.contains("- name: ") && yaml.contains("poor fit kept on request"));
}
