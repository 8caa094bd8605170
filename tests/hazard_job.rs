//! Hazard screening from job files: the demo scenario screens end to end; a job with a missing
//! field, a wrong unit, an unknown compound and an unbalanced step names each by file, line and
//! key while its good step is still reported; the report formats carry the cautions.

use ringheat::hazard::{read_job, screen, CAUTIONS};
use ringheat::reactions::energetics::EnergeticsData;
use ringheat::report::hazard::{render_csv, render_markdown, render_table};
use ringheat::report::html::render_html;

const DEMO: &str = "demo-data/saltmarsh-row-rop-campaign.toml";
const BAD: &str = "demo-data/saltmarsh-row-bad-job.toml";

fn read(path: &str) -> String {
    std::fs::read_to_string(path).expect("demo file reads")
}

#[test]
fn demo_job_screens_every_step() {
    let job = read_job(&read(DEMO), DEMO).expect("TOML");
    assert!(job.problems.is_empty(), "{:?}", job.problems);
    assert!(job.invented);
    let s = screen(&job, &EnergeticsData::bundled().expect("data"));
    assert_eq!(s.failed_steps(), 0, "{:?}", s.steps);
    assert_eq!(s.steps.len(), 6);
    for step in &s.steps {
        let r = step.result.as_ref().expect("screened");
        // dT_ad = Q / (m cp) with Q = -dH n.
        let q_j = -r.dh_kj_per_mol.value * r.reacting_mol.value * 1000.0;
        let text = std::fs::read_to_string(DEMO).expect("reads");
        assert!(text.contains(&r.name));
        assert!((r.heat_kj.value * 1000.0 - q_j).abs() < 1e-6 * q_j.abs().max(1.0));
        assert!((r.max_t_k.value - r.process_t_k.value - r.adiabatic_rise_k.value).abs() < 1e-9);
        assert!(!r.sources.is_empty());
    }
    let eo = s
        .steps
        .iter()
        .find(|s| s.name.contains("ethylene oxide"))
        .expect("EO step");
    let eo = eo.result.as_ref().expect("screened");
    assert_eq!(
        eo.screening_line,
        ringheat::hazard::severity::ScreeningLine::Above
    );
    // Ethylene oxide hydrolysis, liquid: about -97 kJ/mol (tests/reaction_energetics.rs).
    assert!((eo.dh_kj_per_mol.value + 97.0).abs() < 5.0);
    for text in [
        render_table(&s),
        render_markdown(&s),
        render_html(&s),
        render_csv(&s),
    ] {
        for c in CAUTIONS {
            assert!(text.contains(c), "a caution is missing");
        }
        assert!(text.to_lowercase().contains("invented"));
    }
    let html = render_html(&s);
    assert!(html.contains("<svg id=\"ringheat-chart\""));
    assert!(html.contains("class=\"band band-high\""));
    assert_eq!(html.matches("class=\"bar-rise\"").count(), 6);
    assert!(
        !html.contains("http://") || html.matches("http://").count() == 1,
        "only the SVG namespace"
    );
    assert!(!html.contains("<script"));
}

#[test]
fn bad_job_names_file_line_and_key_and_keeps_the_good_step() {
    let text = read(BAD);
    let job = read_job(&text, BAD).expect("TOML");
    let s = screen(&job, &EnergeticsData::bundled().expect("data"));
    assert_eq!(s.steps.len(), 5);
    assert!(s.steps[0].result.is_ok(), "{:?}", s.steps[0].result);
    let line_of = |needle: &str| {
        text.lines()
            .position(|l| l.contains(needle))
            .expect("needle in file")
            + 1
    };
    let expect = [
        (
            2,
            format!(
                "{BAD}:{}: step[3].batch_mass: unit `kJ` is not one of g, kg, t",
                line_of("1250 kJ")
            ),
        ),
        (
            3,
            format!(
                "{BAD}:{}: step[4].monomer: unknown compound `LA`",
                line_of("monomer = \"LA\"")
            ),
        ),
        (
            4,
            format!(
                "{BAD}:{}: step[5].reaction: unbalanced: reactants C2H4O, products C2H6O2",
                line_of("C1CO1>>OCCO")
            ),
        ),
    ];
    for (i, wanted) in &expect {
        let errors = s.steps[*i].result.as_ref().expect_err("a bad step");
        assert!(
            errors.iter().any(|e| e.starts_with(wanted.as_str())),
            "step {i}: {errors:?} lacks {wanted}"
        );
    }
    // The missing field is reported at the line of its step's table.
    let errors = s.steps[1].result.as_ref().expect_err("a bad step");
    let header_line = text
        .lines()
        .enumerate()
        .filter(|(_, l)| l.trim() == "[[step]]")
        .nth(1)
        .map(|(i, _)| i + 1)
        .expect("second step");
    let name_line = header_line + 1;
    assert!(
        errors
            .iter()
            .any(|e| e.contains("step[2].batch_mass: missing")
                && (e.starts_with(&format!("{BAD}:{header_line}:"))
                    || e.starts_with(&format!("{BAD}:{name_line}:")))),
        "{errors:?}"
    );
    let table = render_table(&s);
    assert!(table.contains("good: caprolactone bulk ROP"));
    assert!(table.contains("not screened"));
}

#[test]
fn not_toml_fails_with_its_line() {
    let e = read_job("[job]\ntitle = \"x\"\n[[step]\n", "broken.toml").unwrap_err();
    assert_eq!(e.place.line, 3, "{e}");
}
