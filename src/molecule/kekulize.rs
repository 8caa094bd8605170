//! Kekulization: assigns alternating bond orders to aromatic input by a perfect matching.
