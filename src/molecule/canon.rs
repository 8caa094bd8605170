//! Canonical SMILES of our own design: the same molecule always gets the same string.
