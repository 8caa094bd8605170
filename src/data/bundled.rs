//! Every data file bundled with the library, embedded at build time: (path relative to the
//! crate root, contents). Paths label errors and origins; the program needs no files at run time.

include!(concat!(env!("OUT_DIR"), "/bundled_group_tables.rs"));

/// The group tables (group-tables/*.toml), sorted by file name (listed by build.rs).
pub const GROUP_TABLE_FILES: &[(&str, &str)] = BUNDLED_TABLE_FILES;

/// The reference-species tables (measured Hf298) of group-tables/reference/.
pub const REFERENCE_FILES: [(&str, &str); 4] = [
    (
        "group-tables/reference/reference-species.toml",
        include_str!("../../group-tables/reference/reference-species.toml"),
    ),
    (
        "group-tables/reference/ring-species.toml",
        include_str!("../../group-tables/reference/ring-species.toml"),
    ),
    (
        "group-tables/reference/acyclic-species.toml",
        include_str!("../../group-tables/reference/acyclic-species.toml"),
    ),
    (
        "group-tables/reference/ring-species-recalled.toml",
        include_str!("../../group-tables/reference/ring-species-recalled.toml"),
    ),
];

/// The strain-free increment sets.
pub const INCREMENTS_FILE: (&str, &str) = (
    "group-tables/reference/strain-free-increments.toml",
    include_str!("../../group-tables/reference/strain-free-increments.toml"),
);

/// The list of species whose measured values are judged unreliable.
pub const UNRELIABLE_FILE: (&str, &str) = (
    "group-tables/reference/unreliable-species.toml",
    include_str!("../../group-tables/reference/unreliable-species.toml"),
);
