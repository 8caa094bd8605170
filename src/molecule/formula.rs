//! Molecular formula (Hill order) and molar mass.
