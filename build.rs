//! Build script: embeds the bundled group tables (group-tables/*.toml) into the library.
//!
//! The data stays in the TOML files; this script only lists them, sorted by file name, and writes
//! `$OUT_DIR/bundled_group_tables.rs` with one `include_str!` per file, so the binary carries the
//! tables and works from any directory. Adding a file to group-tables/ reruns the script.

use std::fmt::Write as _;
use std::path::{Path, PathBuf};

fn main() {
    let manifest_dir = std::env::var_os("CARGO_MANIFEST_DIR").map(PathBuf::from);
    let out_dir = std::env::var_os("OUT_DIR").map(PathBuf::from);
    let (Some(manifest_dir), Some(out_dir)) = (manifest_dir, out_dir) else {
        println!("cargo:warning=CARGO_MANIFEST_DIR or OUT_DIR not set; no bundled group tables");
        return;
    };
    let table_dir = manifest_dir.join("group-tables");
    println!("cargo:rerun-if-changed=build.rs");
    // A directory here makes cargo rescan it, so new and removed files are noticed too.
    println!("cargo:rerun-if-changed={}", table_dir.display());

    let files = toml_files(&table_dir);
    let mut code = String::from(
        "/// Bundled group-table files: (path relative to the crate root, file contents), sorted by name.\n\
         pub(crate) const BUNDLED_TABLE_FILES: &[(&str, &str)] = &[\n",
    );
    for path in &files {
        let name = path.file_name().map(|n| n.to_string_lossy().into_owned());
        let Some(name) = name else { continue };
        let label = format!("group-tables/{name}");
        // `{:?}` of a str is a valid Rust string literal with escapes.
        let _ = writeln!(
            code,
            "    ({label:?}, include_str!({:?})),",
            path.display().to_string()
        );
    }
    code.push_str("];\n");
    let target = out_dir.join("bundled_group_tables.rs");
    if let Err(e) = std::fs::write(&target, code) {
        panic!("cannot write {}: {e}", target.display());
    }
}

/// The `*.toml` files directly inside `dir`, sorted by file name; none if the directory is absent.
fn toml_files(dir: &Path) -> Vec<PathBuf> {
    let Ok(entries) = std::fs::read_dir(dir) else {
        return Vec::new();
    };
    let mut files: Vec<PathBuf> = entries
        .filter_map(|e| e.ok().map(|e| e.path()))
        .filter(|p| p.is_file() && p.extension().is_some_and(|x| x == "toml"))
        .collect();
    files.sort_by_key(|p| p.file_name().map(|n| n.to_os_string()));
    files
}
