//! Group tables: loads group-tables/*.toml (values, uncertainties, sources) and validates them.
